package mdf

import (
	"fmt"
	"math"
	"runtime"
	"testing"
)

// TestOracleRandom compares Solve with gonum's lp.Simplex (reference
// library) on seeded random networks of 5 to 200 reactions and checks the
// optimality certificate (dual objective = MDF, LP duality) of every
// solution.
func TestOracleRandom(t *testing.T) {
	sizes := []int{5, 6, 8, 10, 13, 17, 20, 25, 30, 40, 50, 60, 80, 100, 150, 200}
	for _, m := range sizes {
		reps := 6
		if m > 50 {
			reps = 1
		}
		for s := range reps {
			seed := uint64(1000*m + s)
			compareGonum(t, randomNetwork(seed, m), m <= gonumMax(), fmt.Sprintf("m=%d seed=%d", m, seed))
		}
	}
}

// gonumMax is the largest network compared with gonum: its dense simplex
// needs seconds beyond that, and several times longer under WebAssembly or
// with -short.
func gonumMax() int {
	if testing.Short() || runtime.GOARCH == "wasm" {
		return 40
	}
	return 100
}

// TestOracleChain compares Solve with gonum's lp.Simplex (reference
// library) on seeded linear pathways where many reactions share the MDF
// (chainNetwork), and checks the certificate up to 200 reactions.
func TestOracleChain(t *testing.T) {
	for _, m := range []int{3, 5, 8, 12, 20, 30, 45, 60, 200} {
		for s := range 2 {
			seed := uint64(77*m + s)
			compareGonum(t, chainNetwork(seed, m), m <= min(60, gonumMax()), fmt.Sprintf("m=%d seed=%d", m, seed))
		}
	}
}

// compareGonum solves p, checks the optimality certificate and, if
// withGonum, that the MDF agrees with gonum's lp.Simplex within checkTol.
func compareGonum(t *testing.T, p *Problem, withGonum bool, what string) {
	t.Helper()
	got, err := Solve(p)
	if err != nil {
		t.Fatalf("%s: Solve: %v", what, err)
	}
	if err := checkSolution(p, got); err != nil {
		t.Errorf("%s: %v", what, err)
	}
	if !withGonum {
		return // gonum's dense simplex takes seconds here; the certificate still holds
	}
	want, err := SolveGonum(p)
	if err != nil {
		t.Fatalf("%s: SolveGonum: %v", what, err)
	}
	if math.Abs(got.MDF-want.MDF) > checkTol {
		t.Errorf("%s: MDF = %.9g, gonum %.9g", what, got.MDF, want.MDF)
	}
}
