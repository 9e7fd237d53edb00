package equation

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"math/bits"
	"strconv"
	"strings"
	"unicode/utf8"
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
	return fromBig(new(big.Rat).SetFrac(big.NewInt(num), big.NewInt(den)))
}

// fromBig converts x to a Rat, reporting false if it does not fit.
func fromBig(x *big.Rat) (Rat, bool) {
	n, d := x.Num(), x.Denom()
	if !n.IsInt64() || !d.IsInt64() || n.Int64() == math.MinInt64 {
		return Rat{}, false
	}
	return Rat{n.Int64(), d.Int64()}, true
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
		panic(fmt.Sprintf("equation: Rat %d/%d cannot be represented", r.Num, r.Den))
	}
	return n
}

func (r Rat) big() *big.Rat {
	r = r.norm()
	return new(big.Rat).SetFrac(big.NewInt(r.Num), big.NewInt(r.Den))
}

// smallLimit bounds the numerators and denominators for which Add and Mul compute in int64 directly: the
// cross products of two such values stay below 2^63.
const smallLimit = 1 << 30

func (r Rat) small() bool {
	return r.Num > -smallLimit && r.Num < smallLimit && r.Den > 0 && r.Den < smallLimit
}

// Add returns r+s exactly, reporting false if the result does not fit in int64. Small values (the usual
// coefficients and multipliers) are added in int64; others with math/big.
func (r Rat) Add(s Rat) (Rat, bool) {
	if r.Den == 0 {
		r.Den = 1
	}
	if s.Den == 0 {
		s.Den = 1
	}
	if r.small() && s.small() {
		return Rat{r.Num*s.Den + s.Num*r.Den, r.Den * s.Den}.norm(), true
	}
	return fromBig(new(big.Rat).Add(r.big(), s.big()))
}

// Mul returns r·s exactly, reporting false if the result does not fit in int64; like Add it stays in int64
// for small values.
func (r Rat) Mul(s Rat) (Rat, bool) {
	if r.Den == 0 {
		r.Den = 1
	}
	if s.Den == 0 {
		s.Den = 1
	}
	if r.small() && s.small() {
		return Rat{r.Num * s.Num, r.Den * s.Den}.norm(), true
	}
	return fromBig(new(big.Rat).Mul(r.big(), s.big()))
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

// Float returns the float64 nearest to r.
func (r Rat) Float() float64 {
	r = r.norm()
	if abs(r.Num) <= 1<<53 && r.Den <= 1<<53 {
		return float64(r.Num) / float64(r.Den) // both exact: one correctly rounded division
	}
	f, _ := r.big().Float64()
	return f
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
			return Rat{}, fmt.Sprintf("unexpected character %q", c)
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
			return Rat{}, fmt.Sprintf("too many digits (at most %d)", MaxDigits)
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
			return Rat{}, fmt.Sprintf("too many digits (at most %d)", MaxDigits)
		}
		whole, _ := parseDigits(a)
		frac, _ := parseDigits(b)
		den = int64(pow(10, len(b)))
		num = whole*den + frac
	default:
		if num, ok = parseDigits(t); !ok {
			return Rat{}, fmt.Sprintf("too many digits (at most %d)", MaxDigits)
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
