package engine

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"gibbsheet/engine/thermo"
)

// twoCompartments is a worksheet with a cytosol-like compartment c and a matrix-like compartment m.
func twoCompartments(cPH, mPH, mPotential float64, extra string, equations ...string) string {
	comps := `"compartments":[{"id":"c","pH":` + ftoa(cPH) + `},{"id":"m","pH":` + ftoa(mPH) +
		`,"potential":` + ftoa(mPotential) + `}]`
	if extra != "" {
		comps += "," + extra
	}
	return sheet(`"conditions":{"ionicStrength":0.15},`+comps, equations...)
}

func ftoa(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// TestProtonMotiveWork: moving one proton out of the matrix against ΔpH = 0.75 and Δψ = 150 mV (matrix
// negative) costs RT ln 10·ΔpH + F·Δψ. Worked by hand, as in the textbook treatment of the proton-motive
// force (Lehninger, Principles of Biochemistry, ch. 19: "Δψ 0.15 to 0.2 V, ΔpH about 0.75", from memory):
//
//	RT ln 10 = 8.314462618e-3 × 298.15 × 2.302585 = 5.70803 kJ/mol;  × 0.75 = 4.28102 kJ/mol
//	F Δψ     = 96.48533212 kJ/(mol V) × 0.150 V = 14.47280 kJ/mol
//	sum      = 18.75382 kJ/mol per proton pumped out (about 20 kJ/mol, as the textbook says)
func TestProtonMotiveWork(t *testing.T) {
	res := evaluate(t, twoCompartments(7.0, 7.75, -150, "", "H+[m] = H+[c]", "H+[c] = H+[m]"))
	const want = 18.75382
	out, in := res.Rows[0], res.Rows[1]
	if out.Error != nil || in.Error != nil {
		t.Fatalf("errors: %v %v", out.Error, in.Error)
	}
	if !near(*out.DG0, want, 1e-4) || !near(*in.DG0, -want, 1e-4) {
		t.Errorf("ΔrG'° per proton out %.5f, in %.5f; want ±%.5f", *out.DG0, *in.DG0, want)
	}
	// Pumping out builds the gradient (a yield of 1/4 ATP at 4 H+/ATP); letting one in spends it.
	if out.Cost.Protons != -1 || in.Cost.Protons != 1 || !near(in.Cost.Total, 1/DefaultProtonsPerATP, 1e-12) {
		t.Errorf("proton costs: out %+v, in %+v", *out.Cost, *in.Cost)
	}
	if out.Transport == nil || len(out.Transport.Moves) != 1 || out.Transport.Moves[0].From != "m" {
		t.Errorf("transport of the pumped proton: %+v", out.Transport)
	}
}

// TestUnchargedTransport: an uncharged compound moved between compartments of equal pH and ionic strength
// carries no pH or electrical work, so ΔrG' = RT ln(c_to/c_from) whatever the potential (the definition of
// the chemical potential; common practice, no source).
func TestUnchargedTransport(t *testing.T) {
	res := evaluate(t, twoCompartments(7.2, 7.2, -170, `"concentrations":{"glycerol":"2 mM","glycerol[m]":"0.1 mM"}`,
		"glycerol = glycerol[m]"))
	r := res.Rows[0]
	if r.Error != nil {
		t.Fatal(r.Error.Message)
	}
	want := thermo.R * 298.15 * math.Log(0.1/2)
	if !near(*r.DG, want, 1e-9) || !near(*r.DG0, 0, 1e-9) {
		t.Errorf("glycerol c→m: ΔrG'° %g (want 0), ΔrG' %g (want %g)", *r.DG0, *r.DG, want)
	}
}

// TestMalateAspartateShuttle: the shuttle's six steps carry NADH from the cytosol into the matrix; the
// aspartate–glutamate carrier imports one H+ with glutamate (electrogenic exchange; Berg, Tymoczko & Stryer,
// Biochemistry, ch. 18, from memory). Net: NADH[c] + NAD+[m] + H+[c] = NAD+[c] + NADH[m] + H+[m], with no
// reducing equivalents made or spent and one proton let into the matrix.
func TestMalateAspartateShuttle(t *testing.T) {
	res := evaluate(t, twoCompartments(7.2, 7.8, -160, "",
		"oxaloacetate + NADH = malate + NAD+",
		"malate + 2-oxoglutarate[m] = malate[m] + 2-oxoglutarate",
		"malate[m] + NAD+[m] = oxaloacetate[m] + NADH[m]",
		"oxaloacetate[m] + glutamate[m] = aspartate[m] + 2-oxoglutarate[m]",
		"aspartate[m] + glutamate + H+ = aspartate + glutamate[m] + H+[m]",
		"aspartate + 2-oxoglutarate = oxaloacetate + glutamate",
	))
	for _, r := range res.Rows {
		if r.Error != nil {
			t.Fatalf("row %s: %s", r.ID, r.Error.Message)
		}
		if hasWarning(r, "unbalanced") || hasWarning(r, "compartments-unpaired") {
			t.Errorf("row %s: %+v", r.ID, r.Warnings)
		}
	}
	if got, want := res.Total.Equation, "NADH + NAD+[m] + H+ = NAD+ + NADH[m] + H+[m]"; got != want {
		t.Errorf("net reaction %q, want %q", got, want)
	}
	if c := res.Total.Cost; c.Reducing != 0 || c.Protons != 1 || c.Phosphate != 0 {
		t.Errorf("shuttle budget %+v; want reducing 0, protons 1, phosphate 0", c)
	}
}

func TestCompartmentErrors(t *testing.T) {
	res := evaluate(t, sheet(`"compartments":[{"id":"m","pH":15},{"id":"m"},{"id":"a b"}],"concentrations":{"ATP[x]":"1 mM"}`,
		"ATP[q] + H2O = ADP + Pi"))
	paths := map[string]bool{}
	for _, e := range res.Errors {
		paths[e.Path] = true
	}
	for _, p := range []string{"compartments[0].pH", "compartments[1].id", "compartments[2].id", "concentrations.ATP[x]"} {
		if !paths[p] {
			t.Errorf("no error at %s: %+v", p, res.Errors)
		}
	}
	r := res.Rows[0]
	if r.Error == nil || r.Error.Column != 4 || !strings.Contains(r.Error.Message, `unknown compartment "q"`) {
		t.Errorf("unknown tag: %+v", r.Error)
	}
}
