package mdf

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"
)

// TestBlandOnly runs the solver in Bland mode from the first pivot, the
// anti-cycling fallback, and checks it reaches the same optimum.
func TestBlandOnly(t *testing.T) {
	for seed := range uint64(60) {
		p := randomNetwork(seed+5e5, 5+int(seed%60))
		compareStart(t, p, nil, true, fmt.Sprintf("seed %d bland", seed))
	}
}

// compareStart solves p from the default start, or from a random vertex if
// rng is not nil, optionally in Bland mode throughout, and checks the
// certificate and that the MDF matches Solve.
func compareStart(t *testing.T, p *Problem, rng *rand.Rand, bland bool, what string) {
	t.Helper()
	want, err := Solve(p)
	if err != nil {
		t.Fatalf("%s: %v", what, err)
	}
	sx := newSimplex(newSparseLP(p))
	if rng != nil {
		randomStart(sx, rng)
	}
	sx.bland = bland
	if err := sx.run(); err != nil {
		t.Fatalf("%s: %v", what, err)
	}
	got := sx.solution(p)
	if err := checkSolution(p, got); err != nil {
		t.Errorf("%s: %v", what, err)
	}
	if math.Abs(got.MDF-want.MDF) > checkTol {
		t.Errorf("%s: MDF %g, Solve %g", what, got.MDF, want.MDF)
	}
}

// randomStart puts every compound at a random bound and rebuilds the
// initial basis.
func randomStart(sx *simplex, rng *rand.Rand) {
	for i := range sx.x {
		if rng.IntN(2) == 0 {
			sx.x[i], sx.st[i] = sx.lp.lo[i], atLower
		} else {
			sx.x[i], sx.st[i] = sx.lp.up[i], atUpper
		}
	}
	sx.startBasis()
}

// TestMonotone checks properties that follow from the LP (common practice,
// no source): widening any bound never lowers the MDF; lowering ΔrG'°_j by
// δ raises the MDF by at most δ; permuting reactions changes nothing.
func TestMonotone(t *testing.T) {
	rng := rand.New(rand.NewPCG(42, 1))
	for seed := range uint64(80) {
		p := randomNetwork(seed+9e5, 5+int(seed%30))
		base, err := Solve(p)
		if err != nil {
			t.Fatal(err)
		}
		q := *p
		q.Lower = append([]float64(nil), p.Lower...)
		q.Upper = append([]float64(nil), p.Upper...)
		i := rng.IntN(len(q.Lower))
		q.Lower[i] -= rng.Float64()
		q.Upper[i] += rng.Float64()
		wider, err := Solve(&q)
		if err != nil {
			t.Fatal(err)
		}
		if wider.MDF < base.MDF-checkTol {
			t.Errorf("seed %d: widening compound %d lowered MDF %g → %g", seed, i, base.MDF, wider.MDF)
		}

		q = *p
		q.Reactions = append([]Reaction(nil), p.Reactions...)
		j, delta := rng.IntN(len(q.Reactions)), 5*rng.Float64()
		q.Reactions[j].DG0 -= delta
		easier, err := Solve(&q)
		if err != nil {
			t.Fatal(err)
		}
		if d := easier.MDF - base.MDF; d < -checkTol || d > delta+checkTol {
			t.Errorf("seed %d: ΔrG'°_%d − %g moved MDF by %g", seed, j, delta, d)
		}

		q = *p
		q.Reactions = append([]Reaction(nil), p.Reactions...)
		rng.Shuffle(len(q.Reactions), func(a, b int) { q.Reactions[a], q.Reactions[b] = q.Reactions[b], q.Reactions[a] })
		perm, err := Solve(&q)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(perm.MDF-base.MDF) > checkTol {
			t.Errorf("seed %d: permuting reactions moved MDF %g → %g", seed, base.MDF, perm.MDF)
		}
	}
}

// TestRandomStart runs the simplex method from random vertices (every
// compound at a random bound) instead of the default start, which drives
// it through pivots the default start rarely needs, such as a tight
// reaction leaving the kernel together with a basic compound; the optimum
// must not depend on the start.
func TestRandomStart(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 7))
	for seed := range uint64(200) {
		p := randomNetwork(seed+3e6, 3+int(seed%50))
		for _, bland := range []bool{false, true} {
			compareStart(t, p, rng, bland, fmt.Sprintf("seed %d bland=%v", seed, bland))
		}
	}
}
