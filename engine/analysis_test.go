package engine

import (
	"math"
	"testing"

	"gibbsheet/engine/thermo"
)

// chainSheet is a linear chain A → B → C → D of the worksheet's own compounds with entered ΔrG'°.
const chainSheet = `{"format":"gibbsheet-worksheet/1","compounds":[{"id":"A"},{"id":"B"},{"id":"C"},{"id":"D"}],
 "bounds":{` + chainBounds + `},"rows":[` + chainRows + `]}`

const (
	chainBounds = `"default":["1 uM","10 mM"],"compounds":{"A":["5 mM","5 mM"],"D":["0.1 mM","0.1 mM"]}`
	chainRows   = `{"id":"1","equation":"A = B","dG0":-10},{"id":"2","equation":"B = C","dG0":5},{"id":"3","equation":"C = D","dG0":-2}`
)

// TestMDFLinearChain, derived by hand (RT = 2.47896 kJ/mol at 298.15 K): A is fixed at 5 mM and D at
// 0.1 mM; B and C are free within 1 µM–10 mM. The driving forces are
//
//	df1 = 10 − RT ln(B/A),  df2 = −5 − RT ln(C/B),  df3 = 2 − RT ln(D/C).
//
// Sharing all of df1 + df2 + df3 = 7 − RT ln(D/A) = 16.698 equally would need ln(B/A) = (10 − 5.566)/RT,
// B = 30 mM, above the bound; so B sits at 10 mM, df1 = 10 − RT ln 2 = 8.282, and rows 2 and 3 share
// df2 + df3 = −3 − RT ln(D/B) = −3 + RT ln 100 = 8.416 equally: MDF = 4.208 kJ/mol, bottlenecks 2 and 3
// (C = D·exp((MDF − 2)/RT) = 0.244 mM lies within its bounds).
func TestMDFLinearChain(t *testing.T) {
	res := evaluate(t, chainSheet)
	m := res.MDF
	if m == nil {
		t.Fatalf("no MDF; warnings %+v", res.Warnings)
	}
	rt := thermo.R * 298.15
	want := (-3 + rt*math.Log(100)) / 2
	if !near(m.DrivingForce, want, 1e-6) {
		t.Errorf("MDF %.6f, want %.6f", m.DrivingForce, want)
	}
	if len(m.Bottlenecks) != 2 || m.Bottlenecks[0] != "2" || m.Bottlenecks[1] != "3" {
		t.Errorf("bottlenecks %v, want [2 3]", m.Bottlenecks)
	}
	if len(m.Binding) != 2 || m.Binding[0] != (BindingBound{"B", "high", 0.01}) || m.Binding[1] != (BindingBound{"D", "fixed", 1e-4}) {
		t.Errorf("binding bounds %+v, want B at its high bound and D fixed", m.Binding)
	}
	var shadows float64
	for i, r := range m.Rows {
		shadows += r.Shadow
		wantDF := want
		if i == 0 {
			wantDF = 10 - rt*math.Log(2)
		}
		if !near(r.DrivingForce, wantDF, 1e-6) {
			t.Errorf("row %s driving force %.6f, want %.6f", r.ID, r.DrivingForce, wantDF)
		}
	}
	if !near(shadows, 1, 1e-9) {
		t.Errorf("shadow prices sum to %v, want 1 (LP duality)", shadows)
	}
}

// TestMDFInfeasible: the same chain with ΔrG'° of the middle step at +45 kJ/mol cannot run. The middle step
// alone is best off with B at 10 mM and C at 1 µM: df2 = −45 − RT ln(1e-6/1e-2) = −45 + RT ln 1e4 =
// −22.168 kJ/mol, and rows 1 and 3 keep more than that, so the MDF is −22.168 with row 2 the bottleneck.
func TestMDFInfeasible(t *testing.T) {
	doc := `{"format":"gibbsheet-worksheet/1","compounds":[{"id":"A"},{"id":"B"},{"id":"C"},{"id":"D"}],
 "bounds":{"compounds":{"A":["5 mM","5 mM"],"D":["0.1 mM","0.1 mM"]}},
 "rows":[{"id":"1","equation":"A = B","dG0":-10},{"id":"2","equation":"B = C","dG0":45},{"id":"3","equation":"C = D","dG0":-2},
 {"id":"4","equation":"X = Y"}]}`
	res := evaluate(t, doc)
	m := res.MDF
	rt := thermo.R * 298.15
	want := -45 + rt*math.Log(1e4)
	if m == nil || !near(m.DrivingForce, want, 1e-6) {
		t.Fatalf("MDF %+v, want %.6f", m, want)
	}
	if len(m.Bottlenecks) != 1 || m.Bottlenecks[0] != "2" {
		t.Errorf("bottlenecks %v, want [2]", m.Bottlenecks)
	}
	if len(m.LeftOut) != 1 || m.LeftOut[0] != "4" {
		t.Errorf("left out %v, want [4]", m.LeftOut)
	}
	if m.Message == "" || m.Message[:2] != "no" {
		t.Errorf("message %q should say no concentrations drive the pathway", m.Message)
	}
}

// TestFluxForceAndRemedy: J+/J− = exp(−ΔrG'/RT) (Beard and Qian 2007), and the remedy for an uphill row
// brings ΔrG' to zero by changing the one concentration that needs the smallest factor.
func TestFluxForceAndRemedy(t *testing.T) {
	doc := `{"format":"gibbsheet-worksheet/1","compounds":[{"id":"X"},{"id":"Y"}],
 "concentrations":{"X":"1 mM","Y":"1 mM"},
 "rows":[{"id":"down","equation":"X = Y","dG0":-5},{"id":"up","equation":"X = 2 Y","dG0":3}]}`
	res := evaluate(t, doc)
	rt := thermo.R * 298.15
	down := res.Rows[0]
	if down.FluxForce == nil || !near(*down.FluxForce.Ratio, math.Exp(5/rt), 1e-9) ||
		!near(down.FluxForce.ReverseShare, math.Exp(-5/rt), 1e-12) {
		t.Errorf("flux-force of a −5 kJ/mol step: %+v", down.FluxForce)
	}
	up := res.Rows[1]
	dg := 3 + rt*math.Log(1e-3) // X = 2 Y at 1 mM each: Q = 1e-3
	if up.Status != StatusDownhill && dg > 0 {
		t.Fatalf("expected uphill, dG %v", dg)
	}
	if up.Status == StatusUphill {
		r := up.Remedy
		if r == nil {
			t.Fatal("uphill row without remedy")
		}
		// Y has coefficient 2, so lowering Y needs only half the log change that raising X needs.
		if r.Compound != "Y" || !near(math.Log(r.Factor), -dg/(2*rt), 1e-9) {
			t.Errorf("remedy %+v, want Y by factor %g", r, math.Exp(-dg/(2*rt)))
		}
	}
}
