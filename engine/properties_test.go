package engine

import (
	"fmt"
	"math"
	"testing"

	"gibbsheet/engine/compounds"
	"gibbsheet/engine/thermo"
)

// dG0At evaluates one equation at the given conditions and returns its ΔrG'°.
func dG0At(t *testing.T, eq string, pH, I, T float64) float64 {
	t.Helper()
	res := evaluate(t, sheet(fmt.Sprintf(`"conditions":{"pH":%g,"ionicStrength":%g,"temperature":%g}`, pH, I, T), eq))
	r := res.Rows[0]
	if r.Error != nil {
		t.Fatalf("%s: %s", eq, r.Error.Message)
	}
	return *r.DG0
}

// TestPHSlope: ∂ΔrG'°/∂pH = RT ln 10 · Σ ν_i N̄H,i, the change in bound hydrogen ions of the reaction
// (Alberty 2003, eq. 4.5-7, from memory). Checked by central differences against the mean bound H of the
// library's species at each pH.
func TestPHSlope(t *testing.T) {
	lib := compounds.Builtin()
	for _, tc := range []struct {
		eq string
		nu map[string]float64
	}{
		{"ATP + H2O = ADP + Pi", map[string]float64{"ATP": -1, "H2O": -1, "ADP": 1, "Pi": 1}},
		{"glucose 6-phosphate + H2O = glucose + Pi", map[string]float64{"G6P": -1, "H2O": -1, "glucose": 1, "Pi": 1}},
		{"pyruvate + NADH = lactate + NAD+", map[string]float64{"pyruvate": -1, "NADH": -1, "lactate": 1, "NAD+": 1}},
	} {
		for _, pH := range []float64{6, 6.5, 7, 7.5, 8} {
			const h = 1e-4
			slope := (dG0At(t, tc.eq, pH+h, 0.1, 298.15) - dG0At(t, tc.eq, pH-h, 0.1, 298.15)) / (2 * h)
			c := thermo.Conditions{PH: pH, IonicStrength: 0.1, PMg: math.Inf(1), Temperature: 298.15}
			var dNH float64
			for id, n := range tc.nu {
				dNH += n * thermo.MeanBoundH(lib.Lookup(id).Species, c)
			}
			want := c.RT() * math.Ln10 * dNH
			if !near(slope, want, 1e-5) {
				t.Errorf("%s at pH %g: slope %.6f kJ/mol per pH, want RT ln10 ΔN̄H = %.6f", tc.eq, pH, slope, want)
			}
		}
	}
}

// TestGibbsHelmholtzReaction: at I = 0, for a reaction whose reactants are single species with known ΔfH°,
// ΔrG'°(T)/T is linear in 1/T with slope ΔrH° = Σ ν ΔfH° (the Gibbs–Helmholtz equation with ΔrH° constant,
// Alberty 2003 §4.6; the H+ term of the transform adds a constant to ΔrG'°/T, since ΔfH°(H+) = 0).
func TestGibbsHelmholtzReaction(t *testing.T) {
	lib := compounds.Builtin()
	const eq = "ethanol + NAD+ = acetaldehyde + NADH"
	nu := map[string]float64{"ethanol": -1, "NAD+": -1, "acetaldehyde": 1, "NADH": 1}
	var dH float64
	for id, n := range nu {
		sp := lib.Lookup(id).Species
		if len(sp) != 1 || sp[0].DfH0 == nil {
			t.Fatalf("%s: the test needs one species with ΔfH°", id)
		}
		dH += n * *sp[0].DfH0
	}
	g := func(T float64) float64 { return dG0At(t, eq, 7, 0, T) / T }
	for _, T := range []float64{283.15, 310.15, 323.15} {
		slope := (g(T) - g(298.15)) / (1/T - 1/298.15)
		if !near(slope, dH, 1e-6) {
			t.Errorf("slope of ΔrG'°/T against 1/T between 298.15 and %g K is %.6f, want ΔrH° = %.6f", T, slope, dH)
		}
	}
}

// TestTemperatureWithoutEnthalpy: where a compound of the row has no ΔfH°, ΔrG'° is held at its 298.15 K
// value at the worksheet's pH and ionic strength (common practice when ΔrH'° is unknown), and the row says
// so; ΔrG' still uses RT at the worksheet's temperature.
func TestTemperatureWithoutEnthalpy(t *testing.T) {
	const eq = "glucose 6-phosphate = fructose 6-phosphate" // no ΔfH° for fructose 6-phosphate in the library
	at298, at310 := dG0At(t, eq, 7.2, 0.18, 298.15), dG0At(t, eq, 7.2, 0.18, 310.15)
	if at298 != at310 {
		t.Errorf("ΔrG'° at 310.15 K is %v, want the 298.15 K value %v", at310, at298)
	}
	res := evaluate(t, sheet(`"conditions":{"temperature":310.15}`, eq))
	if !hasWarning(res.Rows[0], "no-enthalpy") {
		t.Errorf("no warning that the temperature is not applied: %+v", res.Rows[0].Warnings)
	}
}

// TestHeldRowsAreContinuous: a row held at its 298.15 K ΔrG'° keeps exactly that value at other
// temperatures, transport work included (regressions: H+ moved across a membrane was counted with its
// species energy, and the transport work followed the temperature while the formation energies did not).
func TestHeldRowsAreContinuous(t *testing.T) {
	for _, eq := range []string{"phosphoenolpyruvate[m] + H+[m] = phosphoenolpyruvate + H+", "Pi = Pi[m]"} {
		var at []float64
		for _, T := range []float64{298.15, 298.16, 310.15} {
			doc := sheet(fmt.Sprintf(`"conditions":{"temperature":%g,"pMg":3},"compartments":[{"id":"c","pH":7.2},`+
				`{"id":"m","pH":7.95,"potential":-160}]`, T), eq)
			r := evaluate(t, doc).Rows[0]
			if r.Error != nil {
				t.Fatalf("%s: %s", eq, r.Error.Message)
			}
			at = append(at, *r.DG0)
			if T != 298.15 && !hasWarning(r, "no-enthalpy") {
				t.Errorf("%s at %g K: no no-enthalpy warning", eq, T)
			}
		}
		if !near(at[1], at[0], 1e-9) || !near(at[2], at[0], 1e-9) {
			t.Errorf("%s: ΔrG'° at 298.15, 298.16, 310.15 K = %v, want all equal", eq, at)
		}
	}
}
