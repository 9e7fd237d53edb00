package equation

import (
	"errors"
	"math"
	"math/bits"
	"strconv"
	"strings"
	"unicode/utf8"

	"gibbsheet/engine/internal/say"
)

// MaxDigits is the largest number of significant digits ParseRat accepts in
// an integer, in each part of a fraction, or in a decimal (integer digits
// without leading zeros plus all digits after the point). Eighteen digits keep
// every accepted value exact in int64 (10¹⁸ < 2⁶³).
const MaxDigits = 18

// A Rat is an exact rational number Num/Den. Values made by this package are
// reduced, have Den > 0, and never have Num == math.MinInt64. Methods read a
// zero Den as 1, so Rat{} is 0 and Rat{Num: 2} is 2, and they reduce
// unreduced values first. A Rat whose reduced form cannot be represented
// (such as math.MinInt64/-1) is a programmer mistake; methods panic on it.
//
// The parser produces positive coefficients only; arithmetic allows any sign.
type Rat struct{ Num, Den int64 }

// NewRat returns num/den reduced. It reports false if den is zero or the
// value cannot be represented.
func NewRat(num, den int64) (Rat, bool) {
	if den == 0 {
		return Rat{}, false
	}
	n, d := abs(num), abs(den)
	g := gcd(n, d)
	return fromParts((num < 0) != (den < 0), 0, n/g, d/g)
}

// fromParts makes a Rat of sign neg and magnitude (nHi·2⁶⁴ + n)/d, already
// reduced, reporting false if it does not fit in int64.
func fromParts(neg bool, nHi, n, d uint64) (Rat, bool) {
	if nHi != 0 || n > math.MaxInt64 || d > math.MaxInt64 || d == 0 {
		return Rat{}, false
	}
	if neg {
		return Rat{-int64(n), int64(d)}, true
	}
	return Rat{int64(n), int64(d)}, true
}

// norm returns r reduced with Den > 0; see the Rat doc for the zero Den.
func (r Rat) norm() Rat {
	if r.Den == 0 {
		r.Den = 1
	}
	if r.Den > 0 && r.Num != math.MinInt64 {
		g := int64(gcd(abs(r.Num), uint64(r.Den)))
		if g == 1 {
			return r
		}
		return Rat{r.Num / g, r.Den / g}
	}
	n, ok := NewRat(r.Num, r.Den)
	if !ok {
		panic(say.Sprintf("equation: Rat %d/%d cannot be represented", r.Num, r.Den))
	}
	return n
}

// Add returns r+s exactly, reporting false if the result does not fit in
// int64. It follows Knuth (TAOCP vol. 2, §4.5.1): with d1 = gcd(b, d),
// t = a·(d/d1) + c·(b/d1) and d2 = gcd(t, d1), the sum is (t/d2) / ((b/d1)·(d/d2)),
// reduced; t is held in 128 bits (math/bits), so nothing overflows on the way.
func (r Rat) Add(s Rat) (Rat, bool) {
	// Whole numbers (most coefficients) add directly unless the sum overflows.
	if (r.Den == 1 || r.Den == 0) && (s.Den == 1 || s.Den == 0) {
		if sum := r.Num + s.Num; (r.Num^sum)&(s.Num^sum) >= 0 && sum != math.MinInt64 {
			return Rat{sum, 1}, true
		}
	}
	r, s = r.norm(), s.norm()
	d1 := gcd(uint64(r.Den), uint64(s.Den))
	b1, d1s := uint64(r.Den)/d1, uint64(s.Den)/d1
	hi1, lo1 := bits.Mul64(abs(r.Num), d1s)
	hi2, lo2 := bits.Mul64(abs(s.Num), b1)
	neg1, neg2 := r.Num < 0, s.Num < 0
	var hi, lo uint64
	var neg bool
	switch {
	case neg1 == neg2:
		var carry uint64
		lo, carry = bits.Add64(lo1, lo2, 0)
		hi, _ = bits.Add64(hi1, hi2, carry) // each product is below 2¹²⁷
		neg = neg1
	case hi1 > hi2 || hi1 == hi2 && lo1 >= lo2:
		var borrow uint64
		lo, borrow = bits.Sub64(lo1, lo2, 0)
		hi, _ = bits.Sub64(hi1, hi2, borrow)
		neg = neg1
	default:
		var borrow uint64
		lo, borrow = bits.Sub64(lo2, lo1, 0)
		hi, _ = bits.Sub64(hi2, hi1, borrow)
		neg = neg2
	}
	if hi == 0 && lo == 0 {
		return Rat{0, 1}, true
	}
	d2 := gcd(bits.Rem64(hi, lo, d1), d1)
	if hi >= d2 {
		return Rat{}, false // the quotient needs more than 64 bits
	}
	q, _ := bits.Div64(hi, lo, d2)
	dh, dl := bits.Mul64(b1, uint64(s.Den)/d2)
	if dh != 0 {
		return Rat{}, false
	}
	return fromParts(neg, 0, q, dl)
}

// Mul returns r·s exactly, reporting false if the result does not fit in
// int64. Cross-cancelling first (gcd of each numerator with the other
// denominator) leaves a reduced product, computed in 128 bits.
func (r Rat) Mul(s Rat) (Rat, bool) {
	r, s = r.norm(), s.norm()
	if r.Num == 0 || s.Num == 0 {
		return Rat{0, 1}, true
	}
	g1 := gcd(abs(r.Num), uint64(s.Den))
	g2 := gcd(abs(s.Num), uint64(r.Den))
	nh, nl := bits.Mul64(abs(r.Num)/g1, abs(s.Num)/g2)
	dh, dl := bits.Mul64(uint64(r.Den)/g2, uint64(s.Den)/g1)
	if dh != 0 {
		return Rat{}, false
	}
	return fromParts((r.Num < 0) != (s.Num < 0), nh, nl, dl)
}

// Neg returns −r. It never overflows for values made by this package.
func (r Rat) Neg() Rat {
	r = r.norm()
	return Rat{-r.Num, r.Den}
}

// Sign returns -1, 0 or +1 for r < 0, r == 0 and r > 0.
func (r Rat) Sign() int {
	r = r.norm()
	switch {
	case r.Num < 0:
		return -1
	case r.Num > 0:
		return 1
	}
	return 0
}

// IsZero reports whether r is 0.
func (r Rat) IsZero() bool { return r.Num == 0 }

// Float returns r as a float64: the nearest one when Num and Den are at most
// 2⁵³ (one correctly rounded division), else within a few units in the last
// place (the parts are rounded first).
func (r Rat) Float() float64 {
	r = r.norm()
	return float64(r.Num) / float64(r.Den)
}

// String returns r as an integer ("2"), as a decimal when the decimal
// terminates within MaxDigits digits ("0.5", "0.25"), or else as a fraction
// ("1/3"). ParseRat(r.String()) returns r whenever Num and Den have at most
// MaxDigits digits.
func (r Rat) String() string {
	r = r.norm()
	if r.Den == 1 {
		return strconv.FormatInt(r.Num, 10)
	}
	if s, ok := r.decimal(); ok {
		return s
	}
	return strconv.FormatInt(r.Num, 10) + "/" + strconv.FormatInt(r.Den, 10)
}

// decimal returns the terminating decimal form of the reduced r, if it has
// k ≤ MaxDigits places and its digits form a number below 10^MaxDigits.
func (r Rat) decimal() (string, bool) {
	d, twos, fives := uint64(r.Den), 0, 0
	for ; d%2 == 0; d /= 2 {
		twos++
	}
	for ; d%5 == 0; d /= 5 {
		fives++
	}
	k := max(twos, fives)
	if d != 1 || k > MaxDigits {
		return "", false
	}
	mult := pow(2, k-twos) * pow(5, k-fives) // 10^k / Den
	hi, digits := bits.Mul64(abs(r.Num), mult)
	if hi != 0 || digits >= pow(10, MaxDigits) {
		return "", false
	}
	s := strconv.FormatUint(digits, 10)
	if len(s) <= k {
		s = strings.Repeat("0", k+1-len(s)) + s
	}
	s = s[:len(s)-k] + "." + s[len(s)-k:]
	if r.Num < 0 {
		s = "-" + s
	}
	return s, true
}

// ParseRat parses an exact number: an integer ("2", "-3"), a decimal
// ("0.5", exactly 1/2) or a fraction of integers ("1/2"), with an optional
// leading "+" or "-". It rejects more than MaxDigits digits, a zero
// denominator and malformed text with an error that says why.
func ParseRat(s string) (Rat, error) {
	r, why := parseRat(s)
	if why != "" {
		return Rat{}, errors.New(strconv.Quote(s) + " is not a number: " + why)
	}
	return r, nil
}

// parseRat is ParseRat with the reason for a failure returned as text.
//
//	rat: ["+" | "-"] ( digits ["." digits] | digits "/" digits )
func parseRat(s string) (Rat, string) {
	t, neg := s, false
	if t != "" && (t[0] == '-' || t[0] == '+') {
		t, neg = t[1:], t[0] == '-'
	}
	if t == "" {
		return Rat{}, "no digits"
	}
	for i := 0; i < len(t); {
		c, size := utf8.DecodeRuneInString(t[i:])
		if !isDigit(c) && c != '.' && c != '/' {
			return Rat{}, say.Sprintf("unexpected character %q", c)
		}
		i += size
	}
	dots, slashes := strings.Count(t, "."), strings.Count(t, "/")
	var num, den int64
	var ok bool
	switch {
	case slashes > 1:
		return Rat{}, `more than one "/"`
	case slashes == 1 && dots > 0:
		return Rat{}, `a fraction is written with whole numbers, as in "1/2"`
	case slashes == 1:
		a, b, _ := strings.Cut(t, "/")
		if a == "" || b == "" {
			return Rat{}, `write digits on both sides of "/", as in "1/2"`
		}
		num, ok = parseDigits(a)
		if ok {
			den, ok = parseDigits(b)
		}
		if !ok {
			return Rat{}, say.Sprintf("too many digits (at most %d)", MaxDigits)
		}
		if den == 0 {
			return Rat{}, "the denominator is zero"
		}
	case dots > 1:
		return Rat{}, "more than one decimal point"
	case dots == 1:
		a, b, _ := strings.Cut(t, ".")
		if a == "" || b == "" {
			return Rat{}, `write digits on both sides of the decimal point, as in "0.5"`
		}
		if len(strings.TrimLeft(a, "0"))+len(b) > MaxDigits {
			return Rat{}, say.Sprintf("too many digits (at most %d)", MaxDigits)
		}
		whole, _ := parseDigits(a)
		frac, _ := parseDigits(b)
		den = int64(pow(10, len(b)))
		num = whole*den + frac
	default:
		if num, ok = parseDigits(t); !ok {
			return Rat{}, say.Sprintf("too many digits (at most %d)", MaxDigits)
		}
		den = 1
	}
	if neg {
		num = -num
	}
	return Rat{num, den}.norm(), ""
}

// parseDigits parses a string of ASCII digits with at most MaxDigits
// significant digits.
func parseDigits(s string) (int64, bool) {
	s = strings.TrimLeft(s, "0")
	if len(s) > MaxDigits {
		return 0, false
	}
	var n int64
	for i := 0; i < len(s); i++ {
		n = n*10 + int64(s[i]-'0')
	}
	return n, true
}

// RatFromFloat returns the Rat written by the shortest decimal text of f
// (0.1 gives 1/10, not the binary value of 0.1). It reports false for NaN,
// infinities and values that need more than MaxDigits digits.
func RatFromFloat(f float64) (Rat, bool) {
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return Rat{}, false
	}
	r, why := parseRat(strconv.FormatFloat(f, 'f', -1, 64))
	return r, why == ""
}

func isDigit(c rune) bool { return '0' <= c && c <= '9' }

func abs(n int64) uint64 {
	if n < 0 {
		return uint64(-n)
	}
	return uint64(n)
}

func gcd(a, b uint64) uint64 {
	for b != 0 {
		a, b = b, a%b
	}
	if a == 0 {
		return 1
	}
	return a
}

// pow returns b^k for small results that fit in uint64.
func pow(b uint64, k int) uint64 {
	p := uint64(1)
	for ; k > 0; k-- {
		p *= b
	}
	return p
}
