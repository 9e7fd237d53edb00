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
		t.Run(tc.name, func(t *testing.T) { compareGonum(t, tc.p, true, tc.name) })
	}
}

// TestBasisBookkeeping pivots step by step from random vertices and checks
// after every pivot that P, T and their position maps agree and that the
// updated inverse E satisfies E·K = I. removeP and
// removeT once restored the position of the entry they removed when it was
// the last one, leaving a loose reaction marked tight.
func TestBasisBookkeeping(t *testing.T) {
	rng := rand.New(rand.NewPCG(11, 3))
	for seed := range uint64(150) {
		p := randomNetwork(seed+4e6, 3+int(seed%40))
		if seed%2 == 1 {
			p = chainNetwork(seed, 3+int(seed%50))
		}
		sx := newSimplex(newSparseLP(p))
		randomStart(sx, rng)
		for it := 0; ; it++ {
			done, err := sx.step()
			if err != nil {
				t.Fatalf("seed %d: %v", seed, err)
			}
			if msg := basisError(sx); msg != "" {
				t.Fatalf("seed %d pivot %d: %s", seed, it, msg)
			}
			if msg := inverseError(sx); msg != "" {
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

// inverseError checks E·K = I for the kernel K = A[T, P] within 1e-8.
func inverseError(sx *simplex) string {
	k, lp := len(sx.P), sx.lp
	kern := make([]float64, k*k) // row r = T[r], column c = P[c]
	for c, p := range sx.P {
		for r, j := range sx.T {
			if p == lp.n {
				kern[r*k+c] = 1
				continue
			}
			for e := lp.rowStart[j]; e < lp.rowStart[j+1]; e++ {
				if lp.rowCmp[e] == p {
					kern[r*k+c] = lp.rowVal[e]
				}
			}
		}
	}
	for i := range k {
		for c := range k {
			s := 0.0
			for r := range k {
				s += sx.kinv[i*sx.ks+r] * kern[r*k+c]
			}
			want := 0.0
			if i == c {
				want = 1
			}
			if math.Abs(s-want) > 1e-8 {
				return fmt.Sprintf("(E·K)[%d][%d] = %g after %d updates", i, c, s, sx.updates)
			}
		}
	}
	return ""
}

// TestInverseUpdates applies the rarely pivoted inverse updates (row
// replacement and shrinking) directly to optimal bases of chain networks
// and checks E·K = I afterwards.
func TestInverseUpdates(t *testing.T) {
	rows, shrinks := 0, 0
	for seed := range uint64(20) {
		p := chainNetwork(seed, 10+int(seed))
		sx := newSimplex(newSparseLP(p))
		if err := sx.run(); err != nil {
			t.Fatal(err)
		}
		// Replace a tight row by a loose one where the pivot ρ_r is safe.
		for j := range sx.lp.m {
			if sx.tPos[j] >= 0 {
				continue
			}
			rho := sx.rowTimesInv(j)
			r := -1
			for i, v := range rho {
				if math.Abs(v) > 1e-3 {
					r = i
				}
			}
			if r < 0 {
				continue
			}
			old := sx.T[r]
			sx.replaceRow(r, j)
			sx.tPos[old], sx.tPos[j], sx.T[r] = -1, r, j
			if msg := inverseError(sx); msg != "" {
				t.Fatalf("seed %d: replaceRow: %s", seed, msg)
			}
			rows++
			break
		}
		// Drop compound/row pairs until only B is left.
		for len(sx.P) > 1 {
			c, r := -1, -1
			for i, v := range sx.P {
				if v == sx.lp.n {
					continue
				}
				for s := range sx.T {
					if math.Abs(sx.kinv[i*sx.ks+s]) > 1e-3 {
						c, r = i, s
					}
				}
			}
			if c < 0 {
				break
			}
			sx.shrink(c, r)
			sx.st[sx.P[c]] = atLower
			sx.removeP(c)
			sx.removeT(r)
			if msg := inverseError(sx); msg != "" {
				t.Fatalf("seed %d: shrink to %d: %s", seed, len(sx.P), msg)
			}
			shrinks++
		}
	}
	if rows < 10 || shrinks < 50 {
		t.Errorf("only %d row replacements and %d shrinks exercised", rows, shrinks)
	}
	t.Logf("%d row replacements, %d shrinks", rows, shrinks)
}
