package compounds_test

import (
	"math"
	"testing"

	"gibbsheet/engine/compounds"
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
		// E°'(gluconate/glucose) = −0.44 V (Thauer, Jungermann and Decker 1977, from memory), taken for the
		// 6-phosphates: 6PG + 2 e⁻ = G6P + H2O has ΔrG'° = −2F·E°'.
		{"6-phosphogluconate reduction", []term{{"6PG", -1}, {"G6P", 1}, {"H2O", 1}}, -2 * thermo.Faraday * -0.44},
		// δ-lactone : gluconic acid ≈ 1 : 3 at equilibrium and pK 3.86 of gluconic acid (from memory).
		{"lactone hydrolysis", []term{{"6PGL", -1}, {"H2O", -1}, {"6PG", 1}, {"H+", 1}},
			-albertyMg.RT() * (math.Log(3) + math.Log(1+math.Pow(10, 7-3.86)))},
		// 6-phosphogluconate dehydrogenase, K = 0.172 M with dissolved CO2 (Villet and Dalziel 1969, from
		// memory), times total/dissolved CO2 at these conditions.
		{"6-phosphogluconate dehydrogenase", []term{{"6PG", -1}, {"NADP+", -1}, {"Ru5P", 1}, {"CO2", 1}, {"NADPH", 1}},
			-albertyMg.RT() * math.Log(0.172*totalOverDissolvedCO2(t))},
		// Hydrolysis of carbamoyl phosphate, −51.5 kJ/mol (Garrett and Grisham, from memory).
		{"carbamoyl phosphate hydrolysis", hydrolysis("carbamoyl phosphate", "NH3", "CO2", "Pi"), -51.5},
		// Group additivity (common practice, no source): carbamoylating ornithine's δ-amino group is worth what
		// carbamoylating ammonia to urea is.
		{"citrulline − ornithine = urea − NH3", []term{{"citrulline", 1}, {"ornithine", -1}, {"urea", -1}, {"NH3", 1}}, 0},
		// Argininosuccinate synthetase K' = 8.9 (Ratner and co-workers, from memory).
		{"argininosuccinate synthetase", []term{{"citrulline", -1}, {"aspartate", -1}, {"ATP", -1}, {"argininosuccinate", 1}, {"AMP", 1}, {"PPi", 1}},
			-albertyMg.RT() * math.Log(8.9)},
		// Argininosuccinate lyase K' = 11.4 mM (Ratner, Anslow and Petrack 1953, from memory).
		{"argininosuccinate lyase", []term{{"argininosuccinate", -1}, {"arginine", 1}, {"fumarate", 1}}, -albertyMg.RT() * math.Log(0.0114)},
	} {
		if got := drG(t, albertyMg, tc.ts...); math.Abs(got-tc.want) > derivedTol {
			t.Errorf("%s: ΔrG'° = %.3f kJ/mol, derived from %.3f", tc.name, got, tc.want)
		}
	}
}

// totalOverDissolvedCO2 is [total CO2]/[CO2(aq)] at the derivation conditions, from the library's CO2
// species: exp((ΔfG°(CO2(aq)) − ΔfG'°(CO2 total))/RT), CO2(aq) being the species with no charge.
func totalOverDissolvedCO2(t *testing.T) float64 {
	t.Helper()
	for _, s := range compounds.Builtin().Lookup("CO2").Species {
		if s.Charge == 0 {
			return math.Exp((thermo.SpeciesDfG0Prime(s, albertyMg) - dfG(t, "CO2", albertyMg)) / albertyMg.RT())
		}
	}
	t.Fatal("no CO2(aq) species")
	return 0
}
