package say

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
)

// The reference for every output below is package fmt of the Go standard library: the package's
// promise is fmt's output byte for byte within its subset.

// valStringer is a Stringer with a value receiver: a nil *valStringer panics in String, which fmt
// prints as "<nil>".
type valStringer struct{ s string }

func (v valStringer) String() string { return v.s }

// ptrStringer handles a nil receiver itself.
type ptrStringer struct{ s string }

func (p *ptrStringer) String() string {
	if p == nil {
		return "nil ptrStringer"
	}
	return p.s
}

// panicStringer panics with its text (a non-nil receiver), which fmt reports as a PANIC.
type panicStringer struct{ s string }

func (p panicStringer) String() string { panic(p.s) }

// panicError's Error method panics with an error.
type panicError struct{}

func (panicError) Error() string { panic(errors.New("broken Error")) }

// strs are strings with quotes, escapes, unicode, wide characters and invalid UTF-8.
var strs = []string{"", "a", "ATP", `say "hi"`, "back\\slash", "tab\there\n", "ΔrG'°", "µM", "→ ⇌",
	"日本語", "\x00\x7f", "\xff", "a\xc3", "\xed\xa0\x80", "\U0001F600 emoji", "\u200b zero width", "'", "`"}

// randString returns a random string of bytes or runes, often invalid UTF-8.
func randString(r *rand.Rand) string {
	var b strings.Builder
	for n := r.IntN(12); n > 0; n-- {
		switch r.IntN(4) {
		case 0:
			b.WriteByte(byte(r.IntN(256)))
		case 1:
			b.WriteByte(byte(' ' + r.IntN(95)))
		case 2:
			b.WriteRune(rune(r.IntN(0x110000)))
		default:
			b.WriteString(strs[r.IntN(len(strs))])
		}
	}
	return b.String()
}

// specialFloats are the floats where formatting goes wrong most easily.
var specialFloats = []float64{0, math.Copysign(0, -1), 1, -1, 0.5, 0.05, 0.15, 2.5, 1e-7, 1e21, 1e20, 123456789,
	math.NaN(), math.Inf(1), math.Inf(-1), math.MaxFloat64, -math.MaxFloat64, math.SmallestNonzeroFloat64,
	2.2250738585072014e-308, 9.999999e-5, 99.95, 0.99995, -2.5e-12, 1.0 / 3, 298.15, -237.19}

// randFloat returns a float of random magnitude and digits.
func randFloat(r *rand.Rand) float64 {
	switch r.IntN(4) {
	case 0:
		return specialFloats[r.IntN(len(specialFloats))]
	case 1:
		return math.Float64frombits(r.Uint64())
	case 2:
		return float64(r.IntN(2000001)-1000000) / 100 // two decimals, as data are written
	}
	return (r.Float64()*2 - 1) * math.Pow(10, float64(r.IntN(40)-20))
}

// randArg returns a random argument of a random supported type.
func randArg(r *rand.Rand) any {
	i := r.Int64() >> r.IntN(64)
	if r.IntN(2) == 0 {
		i = -i
	}
	edge := []int64{0, 1, -1, math.MaxInt64, math.MinInt64, math.MaxInt32, math.MinInt32, 255, 0x10ffff, 0x110000}
	if r.IntN(5) == 0 {
		i = edge[r.IntN(len(edge))]
	}
	s := randString(r)
	switch r.IntN(20) {
	case 0:
		return nil
	case 1:
		return r.IntN(2) == 0
	case 2:
		return int(i)
	case 3:
		return int8(i)
	case 4:
		return int16(i)
	case 5:
		return rune(i)
	case 6:
		return i
	case 7:
		return uint(i)
	case 8:
		return byte(i)
	case 9:
		return uint16(i)
	case 10:
		return uint32(i)
	case 11:
		return uint64(i)
	case 12:
		return float32(randFloat(r))
	case 13, 14:
		return randFloat(r)
	case 15:
		if r.IntN(4) == 0 {
			return []byte(s)
		}
		return s
	case 16:
		return errors.New(s)
	case 17:
		return valStringer{s}
	case 18:
		return []any{(*valStringer)(nil), (*ptrStringer)(nil), &ptrStringer{s}, panicStringer{s}, panicError{}}[r.IntN(5)]
	}
	return uintptr(i)
}

// randDirective returns a random directive over the package's verbs and flags plus a few others.
func randDirective(r *rand.Rand) string {
	var b strings.Builder
	b.WriteByte('%')
	for _, f := range "+- 0#" {
		if r.IntN(5) == 0 {
			b.WriteRune(f)
		}
	}
	if r.IntN(2) == 0 {
		fmt.Fprint(&b, r.IntN(25))
	}
	if r.IntN(2) == 0 {
		b.WriteByte('.')
		if r.IntN(5) > 0 {
			fmt.Fprint(&b, r.IntN(20))
		}
	}
	verbs := sayVerbs + "cboT%"
	b.WriteByte(verbs[r.IntN(len(verbs))])
	return b.String()
}

// compare checks Sprintf (and Errorf) against fmt for one format and its arguments: equal when every
// directive is exact for its argument, else no panic.
func compare(t *testing.T, format string, args ...any) {
	t.Helper()
	ds := parseDirectives(format)
	exactAll, exactErrorf := true, true
	for i, d := range ds {
		k := kNil
		if i < len(args) {
			k = kindOf(args[i])
		}
		exactAll = exactAll && exact(d, k, false)
		exactErrorf = exactErrorf && exact(d, k, true)
	}
	for _, a := range args[min(len(ds), len(args)):] { // EXTRA arguments print their type names
		exactAll = exactAll && kindOf(a) <= kString
	}
	exactErrorf = exactErrorf && exactAll
	got := Sprintf(format, args...)
	if want := fmt.Sprintf(format, args...); exactAll && got != want {
		t.Errorf("Sprintf(%q, %#v) = %q, fmt gives %q", format, args, got, want)
	} else if !exactAll && got != want && !strings.Contains(got, unsupported) {
		t.Errorf("Sprintf(%q, %#v) = %q, neither fmt's %q nor marked unsupported", format, args, got, want)
	}
	gotErr := Errorf(format, args...).Error()
	if want := fmt.Errorf(format, args...).Error(); exactErrorf && gotErr != want {
		t.Errorf("Errorf(%q, %#v) = %q, fmt gives %q", format, args, gotErr, want)
	}
}

// TestTable checks hand-picked cases, including every format the engine used when the package was written.
func TestTable(t *testing.T) {
	var nilVal *valStringer
	tests := []struct {
		format string
		args   []any
		want   string // fmt's output
	}{
		{"%+.1f kJ/mol", []any{-3.04}, "-3.0 kJ/mol"},
		{"%+.1f", []any{3.05}, "+3.0"},
		{"%.2f", []any{math.Inf(-1)}, "-Inf"},
		{"%.3g pM", []any{1.23456e-3}, "0.00123 pM"},
		{"%.4g", []any{2.0}, "2"},
		{"e%+d", []any{-5}, "e-5"},
		{"0x%02x", []any{byte(7)}, "0x07"},
		{"%U", []any{rune(0x1b)}, "U+001B"},
		{"%q", []any{'→'}, "'→'"},
		{"%q", []any{"a\"b\xff"}, `"a\"b\xff"`},
		{"%v K", []any{-1.5}, "-1.5 K"},
		{"%v", []any{nil}, "<nil>"},
		{"%v", []any{error(nil)}, "<nil>"},
		{"%s", []any{nilVal}, "<nil>"},
		{"%s", []any{(*ptrStringer)(nil)}, "nil ptrStringer"},
		{"%v", []any{panicStringer{"boom"}}, "%!v(PANIC=String method: boom)"},
		{"%s", []any{panicError{}}, "%!s(PANIC=Error method: broken Error)"},
		{"%d", []any{"x"}, "%!d(string=x)"},
		{"%d", []any{}, "%!d(MISSING)"},
		{"%", []any{}, "%!(NOVERB)"},
		{"100%%", []any{}, "100%"},
		{"%d", []any{1, "a", 2.5, nil}, "1%!(EXTRA string=a, float64=2.5, <nil>)"},
		{"%5.2s|%-4d|%04d", []any{"ΔrG", -3, -3}, "   Δr|-3  |-003"},
		{"%x", []any{"hex"}, "%!x(unsupported)"},
		{"%#v", []any{1}, "%!v(unsupported)"},
		{"%c", []any{'x'}, "%!c(unsupported)"},
		{"%v", []any{struct{}{}}, "%!v(unsupported)"},
		{"%w", []any{errors.New("e")}, "%!w(unsupported)"}, // Sprintf: fmt names the error's type
	}
	for _, tt := range tests {
		got := Sprintf(tt.format, tt.args...)
		if got != tt.want {
			t.Errorf("Sprintf(%q, %v) = %q, want %q", tt.format, tt.args, got, tt.want)
		}
		if !strings.Contains(tt.want, unsupported) {
			if f := fmt.Sprintf(tt.format, tt.args...); f != tt.want {
				t.Errorf("fmt.Sprintf(%q) = %q: the table's want %q is wrong", tt.format, f, tt.want)
			}
		}
	}
}

// TestExhaustiveVerbsFlags tries every verb with every combination of flags, a few widths and
// precisions, on a fixed argument of every kind.
func TestExhaustiveVerbsFlags(t *testing.T) {
	args := []any{nil, true, 42, -7, int8(-128), rune('é'), int64(math.MinInt64), uint(3), byte(0xfe),
		uint64(math.MaxUint64), uintptr(9), float32(0.1), 2.5, -0.0, math.NaN(), math.Inf(1), 1e-9, 6.02214076e23,
		"ΔG", "quote\"d", "\xff", []byte("b\"\xfe"), []byte(nil), errors.New("bad"), valStringer{"rat 1/2"}, (*valStringer)(nil)}
	flagSets := []string{""}
	for _, f := range "+- 0#" {
		for _, s := range flagSets {
			flagSets = append(flagSets, s+string(f))
		}
	}
	for _, verb := range sayVerbs + "cT" {
		for _, fl := range flagSets {
			for _, wp := range []string{"", "1", "8", ".0", ".", ".3", "12.5"} {
				for _, a := range args {
					compare(t, "%"+fl+wp+string(verb), a)
				}
			}
		}
	}
}

// TestRandom compares random formats and arguments with fmt (seeded).
func TestRandom(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	n := 40000
	if testing.Short() {
		n = 4000
	}
	for range n {
		var b strings.Builder
		var args []any
		for k := r.IntN(4); k >= 0; k-- {
			b.WriteString([]string{"", "·", "x = ", "%%"}[r.IntN(4)])
			b.WriteString(randDirective(r))
			args = append(args, randArg(r))
		}
		args = args[:r.IntN(len(args)+2)%(len(args)+1)] // sometimes missing arguments
		compare(t, b.String(), args...)
	}
}

// TestErrorf checks that %w wraps like fmt.Errorf: errors.Is, errors.As and Unwrap.
func TestErrorf(t *testing.T) {
	errA, errB := errors.New("a"), errors.New("b")
	e := Errorf("x: %w (got %g)", errA, 1.5)
	if e.Error() != "x: a (got 1.5)" || !errors.Is(e, errA) || errors.Unwrap(e) != errA {
		t.Errorf("one %%w: %q, Is = %v, Unwrap = %v", e, errors.Is(e, errA), errors.Unwrap(e))
	}
	var pe panicError
	if e := Errorf("%w", &wrapError{"w", errB}); !errors.Is(e, errB) || errors.As(e, &pe) {
		t.Errorf("nested %%w: Is = %v", errors.Is(e, errB))
	}
	two := Errorf("%w and %w", errA, errB)
	if !errors.Is(two, errA) || !errors.Is(two, errB) || two.Error() != fmt.Errorf("%w and %w", errA, errB).Error() {
		t.Errorf("two %%w: %q", two)
	}
	if u, ok := two.(interface{ Unwrap() []error }); !ok || len(u.Unwrap()) != 2 {
		t.Errorf("two %%w: Unwrap() []error missing or wrong")
	}
	if e := Errorf("%w", nil); e.Error() != "%!w(<nil>)" || errors.Unwrap(e) != nil {
		t.Errorf("%%w of nil: %q, Unwrap = %v", e, errors.Unwrap(e))
	}
	if e := Errorf("plain %d", 3); errors.Unwrap(e) != nil || e.Error() != "plain 3" {
		t.Errorf("no %%w: %q wraps %v", e, errors.Unwrap(e))
	}
	wf := "%w" // not a constant, so that vet lets the wrong argument through
	if e := Errorf(wf, 3); e.Error() != fmt.Errorf(wf, 3).Error() || errors.Unwrap(e) != nil {
		t.Errorf("%%w of an int: %q, fmt gives %q", e, fmt.Errorf(wf, 3))
	}
}
