package compounds

import (
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
)

func TestParseFormula(t *testing.T) {
	for _, tc := range []struct {
		in   string
		want Formula
		str  string
	}{
		{"C6H12O6", Formula{"C": 6, "H": 12, "O": 6}, "C6H12O6"},
		{"C10H12N5O13P3", Formula{"C": 10, "H": 12, "N": 5, "O": 13, "P": 3}, "C10H12N5O13P3"},
		{"H2O", Formula{"H": 2, "O": 1}, "H2O"},
		{"CH3COOH", Formula{"C": 2, "H": 4, "O": 2}, "C2H4O2"},
		{"O4PH", Formula{"H": 1, "O": 4, "P": 1}, "HO4P"}, // Hill order without carbon: alphabetical
		{"NaCl", Formula{"Na": 1, "Cl": 1}, "ClNa"},
		{"SC21H36N7O16P3", Formula{"C": 21, "H": 36, "N": 7, "O": 16, "P": 3, "S": 1}, "C21H36N7O16P3S"},
		{"Og", Formula{"Og": 1}, "Og"},
	} {
		got, err := ParseFormula(tc.in)
		if err != nil {
			t.Errorf("ParseFormula(%q): %v", tc.in, err)
			continue
		}
		if d := cmp.Diff(tc.want, got); d != "" {
			t.Errorf("ParseFormula(%q) (-want +got):\n%s", tc.in, d)
		}
		if s := got.String(); s != tc.str {
			t.Errorf("ParseFormula(%q).String() = %q, want %q", tc.in, s, tc.str)
		}
	}
}

func TestParseFormulaErrors(t *testing.T) {
	for _, tc := range []struct{ in, msg string }{
		{"", "empty formula"},
		{"  ", "empty formula"},
		{"C6H12Xx6", `column 6: unknown element symbol "Xx"`},
		{"c6", `column 1: expected an element symbol`},
		{"C6 H12", `column 3: expected an element symbol`},
		{"C06", "column 2: count must be a positive integer"},
		{"C0", "column 2: count must be a positive integer"},
		{"C99999999999999999999", "column 2: count too large"},
		{"Ca2+", "column 4: expected an element symbol"},
		{"Hé", `column 2: expected an element symbol (capital letter), found 'é'`},
		{"J", `unknown element symbol "J"`},
	} {
		_, err := ParseFormula(tc.in)
		if err == nil || !strings.Contains(err.Error(), tc.msg) {
			t.Errorf("ParseFormula(%q) = %v, want error containing %q", tc.in, err, tc.msg)
		}
	}
}

// FuzzParseFormula: the parser never panics, and a parsed formula's normal form parses to itself.
func FuzzParseFormula(f *testing.F) {
	for _, s := range []string{"C6H12O6", "C10H12N5O13P3", "H2O", "NaCl", "C0", "Xx", "CH3COOH"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		got, err := ParseFormula(s)
		if err != nil {
			if err.Error() == "" {
				t.Fatal("empty error message")
			}
			return
		}
		again, err := ParseFormula(got.String())
		if err != nil {
			t.Fatalf("String() %q of %q does not parse: %v", got.String(), s, err)
		}
		if d := cmp.Diff(got, again); d != "" {
			t.Fatalf("round trip of %q (-first +second):\n%s", s, d)
		}
	})
}
