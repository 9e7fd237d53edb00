package mdf_test

import (
	"fmt"
	"math"

	"gibbsheet/engine/mdf"
)

// A two-step chain A → B → C with A fixed at 1 mM and C at 0.1 mM
// (invented example data): the MDF is −(ΔrG'°₁ + ΔrG'°₂ + RT ln(C/A))/2,
// shared by both reactions.
func ExampleSolve() {
	p := twoStepChain()
	sol, err := mdf.Solve(p)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("MDF %.3f kJ/mol, [B] = %.2f mM\n", sol.MDF, 1e3*math.Exp(sol.LnConc[1]))
	for j, f := range sol.DrivingForce {
		fmt.Printf("reaction %d: −ΔrG' = %.3f kJ/mol, shadow %.2f, bottleneck %v\n",
			j, f, sol.Shadow[j], sol.Bottleneck[j])
	}
	// Output:
	// MDF 5.354 kJ/mol, [B] = 6.52 mM
	// reaction 0: −ΔrG' = 5.354 kJ/mol, shadow 0.50, bottleneck true
	// reaction 1: −ΔrG' = 5.354 kJ/mol, shadow 0.50, bottleneck true
}

// twoStepChain is the problem of ExampleSolve: compounds A, B, C, with ln bounds of 1 mM (fixed), 1 µM–10 mM
// and 0.1 mM (fixed), and the reactions A → B (ΔrG'° = −10 kJ/mol) and B → C (5 kJ/mol), at 298.15 K.
func twoStepChain() *mdf.Problem {
	lnc := math.Log
	return &mdf.Problem{
		RT:    8.314462618e-3 * 298.15,
		Lower: []float64{lnc(1e-3), lnc(1e-6), lnc(1e-4)},
		Upper: []float64{lnc(1e-3), lnc(1e-2), lnc(1e-4)},
		Reactions: []mdf.Reaction{
			{DG0: -10, Compound: []int{0, 1}, Coef: []float64{-1, 1}},
			{DG0: 5, Compound: []int{1, 2}, Coef: []float64{-1, 1}},
		},
	}
}

// Bad bounds are reported with the compound index.
func ExampleSolve_badBounds() {
	p := &mdf.Problem{
		RT:        2.479,
		Lower:     []float64{-5, -4},
		Upper:     []float64{-4, -5},
		Reactions: []mdf.Reaction{{DG0: 1, Compound: []int{0, 1}, Coef: []float64{-1, 1}}},
	}
	_, err := mdf.Solve(p)
	fmt.Println(err)
	// Output:
	// mdf: compound 1: bad ln bounds [-4, -5]: need finite lower ≤ upper
}

// A Solver solves the chain of ExampleSolve, then again in the same memory with ΔrG'°₂ raised to 8 kJ/mol
// (invented example data). Sharing the driving force evenly would then need [B] = 11.9 mM, above its
// bound; so [B] stays at 10 mM and the second reaction alone is the bottleneck, with −ΔrG'₂ = −8 + RT ln(10 mM /
// 0.1 mM) = 3.416 kJ/mol (derived by hand).
func ExampleSolver() {
	p := twoStepChain()
	var s mdf.Solver
	for _, dg0 := range []float64{5, 8} {
		p.Reactions[1].DG0 = dg0
		sol, err := s.Solve(p)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("ΔrG'°₂ = %g kJ/mol: MDF %.3f kJ/mol, [B] = %.2f mM, bottlenecks %v\n",
			dg0, sol.MDF, 1e3*math.Exp(sol.LnConc[1]), sol.Bottleneck)
	}
	// Output:
	// ΔrG'°₂ = 5 kJ/mol: MDF 5.354 kJ/mol, [B] = 6.52 mM, bottlenecks [true true]
	// ΔrG'°₂ = 8 kJ/mol: MDF 3.416 kJ/mol, [B] = 10.00 mM, bottlenecks [false true]
}
