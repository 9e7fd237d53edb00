package engine

import (
	"math"
	"strings"
	"testing"
)

func TestParseConcentration(t *testing.T) {
	for _, tc := range []struct {
		in   string
		want float64 // mol/L
	}{
		{"3 mM", 3e-3}, {"50 uM", 50e-6}, {"50 µM", 50e-6}, {"50 μM", 50e-6}, {"2 nM", 2e-9},
		{"0.1 M", 0.1}, {"2.5e-3 M", 2.5e-3}, {"1mM", 1e-3}, {" 7 pM ", 7e-12}, {"4 mmol/L", 4e-3},
	} {
		got, err := ParseConcentration(tc.in)
		if err != nil || math.Abs(got-tc.want) > 1e-12*tc.want {
			t.Errorf("ParseConcentration(%q) = %g, %v; want %g", tc.in, got, err, tc.want)
		}
	}
	for _, tc := range []struct{ in, msg string }{
		{"", "empty"}, {"3", "no unit"}, {"3 mg", "unknown unit"}, {"0 mM", "greater than zero"},
		{"-1 mM", "greater than zero"}, {"mM", "does not start with a number"}, {"1e400 M", "not a number"},
		{"30 M", "above"}, {"1..2 mM", "not a number"},
	} {
		_, err := ParseConcentration(tc.in)
		if err == nil || !strings.Contains(err.Error(), tc.msg) {
			t.Errorf("ParseConcentration(%q) error = %v; want one containing %q", tc.in, err, tc.msg)
		}
	}
}
