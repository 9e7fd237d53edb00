package equation_test

import (
	"testing"
	"unicode/utf8"

	"gibbsheet/engine/equation"
)

// FuzzParse checks that Parse never panics, that every error lies within the
// text and that the normal form of a parsed equation parses to itself.
func FuzzParse(f *testing.F) {
	for _, s := range []string{"NAD+ + H2O = NADH + H+", "2 pyruvate[m] + 1/2 O2 → x", "A +  + B = C"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, src string) {
		e, err := equation.Parse(src)
		if err != nil {
			list, ok := err.(equation.ErrorList)
			if !ok || len(list) == 0 || e != nil {
				t.Fatalf("Parse(%q) = %v, %T %v", src, e, err, err)
			}
			last := utf8.RuneCountInString(src) + 1
			for i, x := range list {
				if x.Pos < 0 || x.End < x.Pos || int(x.End) > len(src) {
					t.Fatalf("Parse(%q): error %q has span %d-%d", src, x.Msg, x.Pos, x.End)
				}
				if c := equation.Column(src, x.End); c > last {
					t.Fatalf("Parse(%q): error %q ends at column %d > %d", src, x.Msg, c, last)
				}
				if i > 0 && list[i-1].Pos > x.Pos {
					t.Fatalf("Parse(%q): errors not sorted", src)
				}
			}
			return
		}
		reparse(t, src, e)
	})
}
