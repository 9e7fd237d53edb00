package mdf

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"
)

// TestRegression holds one row per defect found while writing the solver;
// each is checked against gonum's lp.Simplex (reference library) and the
// optimality certificate.
func TestRegression(t *testing.T) {
	lo, up := bounds(1e-6, 1e-2, 1e-6, 1e-2, 1e-6, 1e-2)
	tests := []struct {
		name string
		p    *Problem
	}{{
		// newSparseLP once kept the duplicate-detection mark of an entry
		// dropped as zero, so compound 1 in reaction 1 was taken for a
		// repeat of reaction 0's entry and summed into the wrong slot.
		name: "zero entry before a compound reused in the next reaction",
		p: &Problem{RT: rt298, Lower: lo, Upper: up,
			Reactions: []Reaction{rxn(-3, 0, 0, 1, 1), rxn(4, 1, -1, 2, 1)}},
	}}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, err := Solve(tc.p)
			if err != nil {
				t.Fatal(err)
			}
			if err := checkSolution(tc.p, got); err != nil {
				t.Fatal(err)
			}
			want, err := SolveGonum(tc.p)
			if err != nil {
				t.Fatal(err)
			}
			if math.Abs(got.MDF-want.MDF) > checkTol {
				t.Errorf("MDF = %.9g, gonum %.9g", got.MDF, want.MDF)
			}
		})
	}
}

// TestBasisBookkeeping pivots step by step from random vertices and checks
// after every pivot that P, T and their position maps agree. removeP and
// removeT once restored the position of the entry they removed when it was
// the last one, leaving a loose reaction marked tight.
func TestBasisBookkeeping(t *testing.T) {
	rng := rand.New(rand.NewPCG(11, 3))
	for seed := range uint64(150) {
		p := randomNetwork(seed+4e6, 3+int(seed%40))
		sx := newSimplex(newSparseLP(p))
		for i := range sx.x {
			if rng.IntN(2) == 0 {
				sx.x[i], sx.st[i] = p.Lower[i], atLower
			} else {
				sx.x[i], sx.st[i] = p.Upper[i], atUpper
			}
		}
		sx.startBasis()
		for it := 0; ; it++ {
			done, err := sx.step()
			if err != nil {
				t.Fatalf("seed %d: %v", seed, err)
			}
			if msg := basisError(sx); msg != "" {
				t.Fatalf("seed %d pivot %d: %s", seed, it, msg)
			}
			if done {
				break
			}
		}
	}
	// Removing the last and a middle entry directly.
	sx := newSimplex(newSparseLP(randomNetwork(1, 6)))
	sx.T, sx.P = sx.T[:0], sx.P[:0]
	for j := range sx.tPos {
		sx.tPos[j] = -1
	}
	for v := range sx.pPos {
		sx.pPos[v] = -1
	}
	for j := range 4 {
		sx.tPos[j], sx.T = len(sx.T), append(sx.T, j)
	}
	for _, c := range []int{sx.lp.n, 0, 1, 2} {
		sx.pPos[c], sx.P = len(sx.P), append(sx.P, c)
		if c < sx.lp.n {
			sx.st[c] = basic
		}
	}
	sx.removeT(3)
	sx.removeT(0)
	sx.st[2], sx.st[0] = atLower, atLower
	sx.removeP(3)
	sx.removeP(1)
	if msg := basisError(sx); msg != "" {
		t.Error(msg)
	}
}

// basisError describes the first inconsistency of the basis bookkeeping.
func basisError(sx *simplex) string {
	if len(sx.P) != len(sx.T) {
		return fmt.Sprintf("|P| = %d, |T| = %d", len(sx.P), len(sx.T))
	}
	for v, c := range sx.pPos {
		if (c >= 0) != (c >= 0 && c < len(sx.P) && sx.P[c] == v) {
			return fmt.Sprintf("pPos[%d] = %d, P = %v", v, c, sx.P)
		}
		if v < sx.lp.n && (c >= 0) != (sx.st[v] == basic) {
			return fmt.Sprintf("compound %d: pPos %d, status %d", v, c, sx.st[v])
		}
	}
	for j, r := range sx.tPos {
		if (r >= 0) != (r >= 0 && r < len(sx.T) && sx.T[r] == j) {
			return fmt.Sprintf("tPos[%d] = %d, T = %v", j, r, sx.T)
		}
	}
	for c, v := range sx.P {
		if sx.pPos[v] != c {
			return fmt.Sprintf("P[%d] = %d but pPos = %d", c, v, sx.pPos[v])
		}
	}
	for r, j := range sx.T {
		if sx.tPos[j] != r {
			return fmt.Sprintf("T[%d] = %d but tPos = %d", r, j, sx.tPos[j])
		}
	}
	return ""
}
