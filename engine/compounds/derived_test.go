package compounds_test

import (
	"math"
	"testing"

	"gibbsheet/engine/thermo"
)

// derivedTol is the tolerance, kJ/mol, for re-deriving a compound's data from the published value it
// was derived from: the JSON stores ΔfG° rounded to 0.01 kJ/mol.
const derivedTol = 0.02

// TestDerivedEntries recomputes the published ΔrG'° (or E°', or equilibrium ratio) from which each
// derived compound was set, at the derivation conditions (pH 7, I = 0.25 M, pMg 3, 298.15 K), so that
// a typo or a change of the data it depends on is caught.
func TestDerivedEntries(t *testing.T) {
	for _, tc := range []struct {
		name string
		ts   []term
		want float64 // kJ/mol
	}{
		// Lehninger Principles of Biochemistry, table of ΔG'° of glycolysis/TCA/glycogen steps (from memory).
		{"citrate synthase", []term{{"acetyl-CoA", -1}, {"oxaloacetate", -1}, {"H2O", -1}, {"citrate", 1}, {"CoA", 1}}, -32.2},
		{"succinyl-CoA synthetase", []term{{"succinyl-CoA", -1}, {"GDP", -1}, {"Pi", -1}, {"succinate", 1}, {"GTP", 1}, {"CoA", 1}}, -2.9},
		{"glycogen phosphorylase", []term{{"glycogen", -1}, {"Pi", -1}, {"G1P", 1}}, 3.1},
		{"glycogen synthase", []term{{"UDP-glucose", -1}, {"UDP", 1}, {"glycogen", 1}}, -13.4},
		{"glycerol 3-phosphate hydrolysis", hydrolysis("glycerol 3-phosphate", "glycerol", "Pi"), -9.2},
		// E°'(ubiquinone/ubiquinol) = +0.045 V, Lehninger table of standard reduction potentials (from memory).
		{"ubiquinone reduction", []term{{"ubiquinone", -1}, {"ubiquinol", 1}}, -2 * thermo.Faraday * 0.045},
		// citrate : cis-aconitate ≈ 91 : 3 at equilibrium (Krebs 1953, from memory).
		{"citrate dehydration", []term{{"citrate", -1}, {"cis-aconitate", 1}, {"H2O", 1}}, -albertyMg.RT() * math.Log(3.0/91)},
	} {
		if got := drG(t, albertyMg, tc.ts...); math.Abs(got-tc.want) > derivedTol {
			t.Errorf("%s: ΔrG'° = %.3f kJ/mol, derived from %.3f", tc.name, got, tc.want)
		}
	}
}
