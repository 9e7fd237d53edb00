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
	lnc := math.Log
	p := &mdf.Problem{
		RT:    8.314462618e-3 * 298.15,
		Lower: []float64{lnc(1e-3), lnc(1e-6), lnc(1e-4)},
		Upper: []float64{lnc(1e-3), lnc(1e-2), lnc(1e-4)},
		Reactions: []mdf.Reaction{
			{DG0: -10, Compound: []int{0, 1}, Coef: []float64{-1, 1}},
			{DG0: 5, Compound: []int{1, 2}, Coef: []float64{-1, 1}},
		},
	}
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
