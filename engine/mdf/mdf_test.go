package mdf

import (
	"math"
	"testing"
)

// ln returns the natural logarithm of a molar concentration.
func ln(c float64) float64 { return math.Log(c) }

// rxn builds a reaction from (compound, coefficient) pairs.
func rxn(dg0 float64, pairs ...float64) Reaction {
	r := Reaction{DG0: dg0}
	for k := 0; k < len(pairs); k += 2 {
		r.Compound = append(r.Compound, int(pairs[k]))
		r.Coef = append(r.Coef, pairs[k+1])
	}
	return r
}

// bounds returns ln bounds for molar concentration intervals given as
// (lower, upper) pairs.
func bounds(pairs ...float64) (lo, up []float64) {
	for k := 0; k < len(pairs); k += 2 {
		lo = append(lo, ln(pairs[k]))
		up = append(up, ln(pairs[k+1]))
	}
	return lo, up
}

// handCase is a problem whose optimum is derived analytically in its
// comment. want* fields that are nil are not checked.
type handCase struct {
	name       string
	p          *Problem
	mdf        float64
	shadow     []float64 // nil: not unique
	lowerBind  []int
	upperBind  []int
	conc       map[int]float64 // ln concentrations that are unique at the optimum
	bottleneck []int
}

// Units: ΔrG'° in kJ/mol, concentrations in M, RT = rt298 kJ/mol.
// All MDF values below are derived by hand from the definition
// MDF = max_x min_j −(ΔrG'°_j + RT Σ_i S_ij ln c_i) (Noor et al., PLoS
// Comput Biol 2014, eq. 7); the derivations are in the comments.
func handCases() []handCase {
	const g1, g2 = -10.0, 5.0
	var cases []handCase

	// Single reaction A → B, A ∈ [1 µM, 10 mM], B ∈ [1 µM, 10 mM], ΔrG'° = 5.
	// −ΔrG' = −(g + RT(ln B − ln A)) is largest at B = Bmin, A = Amax:
	// MDF = −(g + RT(ln Bmin − ln Amax)) = −5 + RT ln 1e4 ≈ 17.832.
	// λ = 1; raising Amax or lowering Bmin helps, so A's upper and B's
	// lower bound bind.
	lo, up := bounds(1e-6, 1e-2, 1e-6, 1e-2)
	cases = append(cases, handCase{
		name: "single A→B",
		p:    &Problem{RT: rt298, Lower: lo, Upper: up, Reactions: []Reaction{rxn(5, 0, -1, 1, 1)}},
		mdf:  -(5 + rt298*(ln(1e-6)-ln(1e-2))), shadow: []float64{1},
		upperBind: []int{0}, lowerBind: []int{1}, bottleneck: []int{0},
		conc: map[int]float64{0: ln(1e-2), 1: ln(1e-6)},
	})

	// Chain A → B → C, A fixed at a = ln 1 mM, C fixed at c = ln 0.1 mM,
	// B ∈ [1 µM, 10 mM], ΔrG'° g1 = −10, g2 = 5. The driving forces
	// F1 = −(g1 + RT(x_B − a)) and F2 = −(g2 + RT(c − x_B)) sum to
	// −(g1 + g2 + RT(c − a)) whatever x_B is, so min(F1, F2) is largest when
	// F1 = F2: MDF = −(g1 + g2 + RT ln(C/A))/2 ≈ 5.354, at
	// x_B = (g2 − g1 + RT(a + c))/(2RT) ≈ ln 6.5 mM, inside B's bounds.
	// Both reactions bind, λ = (1/2, 1/2); more A or less C would help, so
	// fixed A binds on its upper side and fixed C on its lower side.
	lo, up = bounds(1e-3, 1e-3, 1e-6, 1e-2, 1e-4, 1e-4)
	chain := []Reaction{rxn(g1, 0, -1, 1, 1), rxn(g2, 1, -1, 2, 1)}
	cases = append(cases, handCase{
		name: "chain A→B→C, B free",
		p:    &Problem{RT: rt298, Lower: lo, Upper: up, Reactions: chain},
		mdf:  -(g1 + g2 + rt298*ln(1e-4/1e-3)) / 2, shadow: []float64{0.5, 0.5},
		bottleneck: []int{0, 1}, upperBind: []int{0}, lowerBind: []int{2},
		conc: map[int]float64{1: (g2 - g1 + rt298*(ln(1e-3)+ln(1e-4))) / (2 * rt298)},
	})

	// Same chain with B ≤ 1 mM, below the balancing ≈ 6.5 mM. F2 rises with
	// x_B, so x_B = ln 1 mM and MDF = F2 = −(g2 + RT(ln 0.1 mM − ln 1 mM))
	// = −5 + RT ln 10 ≈ 0.708 (F1 ≈ 10 is larger). Only reaction 2 binds,
	// λ = (0, 1), and so do B's upper bound and fixed C's lower side; A only
	// enters the slack reaction 1, so it does not bind.
	lo, up = bounds(1e-3, 1e-3, 1e-6, 1e-3, 1e-4, 1e-4)
	cases = append(cases, handCase{
		name: "chain A→B→C, B upper binds",
		p:    &Problem{RT: rt298, Lower: lo, Upper: up, Reactions: chain},
		mdf:  -(g2 + rt298*ln(1e-4/1e-3)), shadow: []float64{0, 1},
		upperBind: []int{1}, lowerBind: []int{2}, bottleneck: []int{1},
		conc: map[int]float64{1: ln(1e-3)},
	})

	// Same chain with B ≥ 8 mM, above the balancing point: x_B = ln 8 mM and
	// MDF = F1 = −(g1 + RT(ln 8 mM − ln 1 mM)) = 10 − RT ln 8 ≈ 4.845;
	// λ = (1, 0), B's lower bound and fixed A's upper side bind.
	lo, up = bounds(1e-3, 1e-3, 8e-3, 1e-2, 1e-4, 1e-4)
	cases = append(cases, handCase{
		name: "chain A→B→C, B lower binds",
		p:    &Problem{RT: rt298, Lower: lo, Upper: up, Reactions: chain},
		mdf:  -(g1 + rt298*ln(8e-3/1e-3)), shadow: []float64{1, 0},
		lowerBind: []int{1}, upperBind: []int{0}, bottleneck: []int{0},
		conc: map[int]float64{1: ln(8e-3)},
	})

	// Chain of m = 4 steps X0 → X1 → X2 → X3 → X4, X0 fixed 10 mM, X4
	// fixed 1 µM, intermediates in [1 nM, 1 M] (wide enough), ΔrG'° = 3, −8,
	// 6, 1. As for two steps the forces sum to −(Σg + RT ln(X4/X0)), so
	// MDF = −(Σg + RT ln(X4/X0))/m = (−2 + RT ln 1e4)/4 ≈ 5.208 with
	// λ_j = 1/m; fixed X0 binds on its upper side, fixed X4 on its lower.
	lo, up = bounds(1e-2, 1e-2, 1e-9, 1, 1e-9, 1, 1e-9, 1, 1e-6, 1e-6)
	gs := []float64{3, -8, 6, 1}
	var long []Reaction
	for j, g := range gs {
		long = append(long, rxn(g, float64(j), -1, float64(j+1), 1))
	}
	cases = append(cases, handCase{
		name: "chain of 4, intermediates free",
		p:    &Problem{RT: rt298, Lower: lo, Upper: up, Reactions: long},
		mdf:  -(3 - 8 + 6 + 1 + rt298*ln(1e-6/1e-2)) / 4, shadow: []float64{0.25, 0.25, 0.25, 0.25},
		bottleneck: []int{0, 1, 2, 3}, upperBind: []int{0}, lowerBind: []int{4},
	})

	// Stoichiometry 2: 2A → B, ΔrG'° = 0, A ∈ [1 µM, 1 mM], B ∈ [1 µM, 1 mM].
	// F = −RT(ln B − 2 ln A), largest at B = 1 µM, A = 1 mM:
	// MDF = −RT(ln 1e-6 − 2 ln 1e-3) = 0 exactly.
	lo, up = bounds(1e-6, 1e-3, 1e-6, 1e-3)
	cases = append(cases, handCase{
		name: "2A→B",
		p:    &Problem{RT: rt298, Lower: lo, Upper: up, Reactions: []Reaction{rxn(0, 0, -2, 1, 1)}},
		mdf:  0, shadow: []float64{1}, upperBind: []int{0}, lowerBind: []int{1}, bottleneck: []int{0},
	})
	return cases
}

func TestHandDerived(t *testing.T) {
	for _, tc := range handCases() {
		t.Run(tc.name, func(t *testing.T) {
			sol := solveWant(t, tc.p, tc.mdf)
			for j, want := range tc.shadow {
				if math.Abs(sol.Shadow[j]-want) > checkTol {
					t.Errorf("Shadow[%d] = %g, want %g", j, sol.Shadow[j], want)
				}
			}
			if tc.shadow != nil {
				checkMarks(t, "Bottleneck", sol.Bottleneck, tc.bottleneck)
				checkMarks(t, "LowerBinding", sol.LowerBinding, tc.lowerBind)
				checkMarks(t, "UpperBinding", sol.UpperBinding, tc.upperBind)
			}
			for i, want := range tc.conc {
				if math.Abs(sol.LnConc[i]-want) > checkTol {
					t.Errorf("LnConc[%d] = %g, want %g", i, sol.LnConc[i], want)
				}
			}
		})
	}
}

// checkMarks reports whether exactly the indices in want are marked.
func checkMarks(t *testing.T, what string, got []bool, want []int) {
	t.Helper()
	w := make([]bool, len(got))
	for _, i := range want {
		w[i] = true
	}
	for i := range got {
		if got[i] != w[i] {
			t.Errorf("%s[%d] = %v, want %v", what, i, got[i], w[i])
		}
	}
}

// solveWant solves p, checks the optimality certificate and that the MDF
// equals want within checkTol, and returns the solution.
func solveWant(t *testing.T, p *Problem, want float64) *Solution {
	t.Helper()
	sol, err := Solve(p)
	if err != nil {
		t.Fatal(err)
	}
	if err := checkSolution(p, sol); err != nil {
		t.Fatal(err)
	}
	if math.Abs(sol.MDF-want) > checkTol {
		t.Errorf("MDF = %.9g, want %.9g", sol.MDF, want)
	}
	return sol
}
