package mdf

import (
	"math"
	"testing"
)

// TestOracleRandom compares Solve with gonum's lp.Simplex (reference
// library) on seeded random networks of 5 to 200 reactions and checks the
// optimality certificate (dual objective = MDF, LP duality) of every
// solution.
func TestOracleRandom(t *testing.T) {
	sizes := []int{5, 6, 8, 10, 13, 17, 20, 25, 30, 40, 50, 60, 80, 100, 150, 200}
	perSize := 6
	if testing.Short() {
		perSize = 2
	}
	for _, m := range sizes {
		reps := perSize
		if m >= 100 {
			reps = 1
		}
		for s := range reps {
			seed := uint64(1000*m + s)
			p := randomNetwork(seed, m)
			got, err := Solve(p)
			if err != nil {
				t.Fatalf("m=%d seed=%d: Solve: %v", m, seed, err)
			}
			if err := checkSolution(p, got); err != nil {
				t.Errorf("m=%d seed=%d: %v", m, seed, err)
			}
			if m > 100 || m == 100 && testing.Short() {
				continue // gonum's dense simplex takes seconds here; the certificate still holds
			}
			want, err := SolveGonum(p)
			if err != nil {
				t.Fatalf("m=%d seed=%d: SolveGonum: %v", m, seed, err)
			}
			if math.Abs(got.MDF-want.MDF) > checkTol {
				t.Errorf("m=%d seed=%d: MDF = %.9g, gonum %.9g", m, seed, got.MDF, want.MDF)
			}
		}
	}
}

// TestOracleChain compares Solve with gonum's lp.Simplex (reference
// library) on seeded linear pathways where many reactions share the MDF
// (chainNetwork), and checks the certificate up to 200 reactions.
func TestOracleChain(t *testing.T) {
	for _, m := range []int{3, 5, 8, 12, 20, 30, 45, 60, 200} {
		for s := range 2 {
			seed := uint64(77*m + s)
			p := chainNetwork(seed, m)
			got, err := Solve(p)
			if err != nil {
				t.Fatalf("m=%d seed=%d: Solve: %v", m, seed, err)
			}
			if err := checkSolution(p, got); err != nil {
				t.Errorf("m=%d seed=%d: %v", m, seed, err)
			}
			if m > 60 {
				continue
			}
			want, err := SolveGonum(p)
			if err != nil {
				t.Fatalf("m=%d seed=%d: SolveGonum: %v", m, seed, err)
			}
			if math.Abs(got.MDF-want.MDF) > checkTol {
				t.Errorf("m=%d seed=%d: MDF = %.9g, gonum %.9g", m, seed, got.MDF, want.MDF)
			}
		}
	}
}
