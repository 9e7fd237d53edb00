package mdf

import (
	"math"

	"gibbsheet/engine/internal/say"
)

// Tolerances of the bounded-variable simplex method. Lengths are in units
// of ln concentration, reduced costs in kJ/mol per unit ln concentration
// (compounds) or dimensionless (reaction duals).
const (
	// dualTol is the reduced cost a nonbasic variable must exceed to enter
	// the basis; it is also the dual value above which a reaction counts as
	// a bottleneck and a compound bound as binding.
	dualTol = 1e-9
	// pivTol is the smallest |entry| of the entering column that the ratio
	// test accepts as a pivot, keeping the basis kernel well conditioned.
	pivTol = 1e-9
	// ratioTieTol is the difference below which two step lengths in the
	// ratio test are treated as tied; ties go to the larger pivot, or in
	// Bland mode to the smaller variable index.
	ratioTieTol = 1e-12
	// degenerateTol is the step length at or below which a pivot counts as
	// degenerate (the objective does not move).
	degenerateTol = 1e-12
	// blandAfter is the number of consecutive degenerate pivots after which
	// the solver switches from largest-reduced-cost pricing to Bland's rule
	// (smallest eligible index enters, smallest tied index leaves), which
	// cannot cycle (Bland, Math. Oper. Res. 2:103, 1977).
	blandAfter = 50
	// iterFactor bounds the number of pivots by iterFactor·(m+n+1)+100.
	iterFactor = 50
)

type varStatus int8

const (
	atLower varStatus = iota
	atUpper
	basic
)

// simplex is the state of the bounded-variable revised simplex method on
//
//	maximise B  s.t.  A x + B·1 + s = b,  s ≥ 0,  lo ≤ x ≤ up,  B free.
//
// Variables are numbered: compounds 0..n-1, B is n, the slack of row j is
// n+1+j. A basis consists of the basic slacks of the rows not in T plus the
// structural basic variables P (always including B, which is free and so
// never leaves). With rows permuted, the basis matrix is [K 0; A_NP I], with
// the kernel K = A[T, P] square, so only the |T|×|T| kernel is inverted
// (inverse.go); |T| is the number of tight reactions, a handful in typical
// pathways and up to about m/2 in long chains sharing one MDF. A pivot
// costs O(|T|² + nonzeros + m + n).
type simplex struct {
	lp   *sparseLP
	x    []float64 // compound values (nonbasic: exactly at a bound)
	bval float64   // value of B
	st   []varStatus
	P, T []int // structural basics (n = B) and tight rows, paired by position
	pPos []int // position of structural variable in P, or -1 (length n+1)
	tPos []int // position of row in T, or -1
	lu   denseLU
	kbuf []float64
	kinv []float64 // E = K⁻¹, row-major with stride ks (see inverse.go)
	ks   int
	// inverted reports that kinv holds the inverse of the current kernel,
	// up to the updates since.
	inverted bool
	// updates counts inverse updates since the last refactorisation.
	updates int
	// fresh makes primal and dual use the LU factors instead of kinv.
	fresh bool
	y     []float64 // reaction duals by position in T
	d     []float64 // reduced costs of compounds
	alpha []float64 // K⁻¹ times the entering column, by position in P
	w     []float64 // change of basic slacks per unit step, by row
	tmp   []float64
	net   []float64 // scratch for init
	bland bool
	degen int
	iters int
}

func newSimplex(lp *sparseLP) *simplex {
	sx := new(simplex)
	sx.init(lp)
	return sx
}

// init sets sx up for lp as newSimplex does, in the buffers sx holds: every
// value the method reads is set again, so what sx solved before does not
// matter.
func (sx *simplex) init(lp *sparseLP) {
	n := lp.n
	sx.lp = lp
	sx.x, sx.st = resize(sx.x, n), resize(sx.st, n)
	sx.pPos, sx.tPos = resize(sx.pPos, n+1), resize(sx.tPos, lp.m)
	sx.d, sx.w = resize(sx.d, n), resize(sx.w, lp.m)
	sx.bval, sx.inverted, sx.updates, sx.fresh = 0, false, 0, false
	sx.bland, sx.degen, sx.iters = false, 0, 0
	// Start with every compound at the bound that favours its net use:
	// net substrates high, products low (any vertex would do).
	net := resize(sx.net, n)
	clear(net)
	for k, c := range lp.rowCmp {
		net[c] += lp.rowVal[k]
	}
	for i := range n {
		if net[i] < 0 {
			sx.x[i], sx.st[i] = lp.up[i], atUpper
		} else {
			sx.x[i], sx.st[i] = lp.lo[i], atLower
		}
	}
	sx.net = net
	sx.startBasis()
}

// startBasis sets up the initial basis for compounds all nonbasic at the
// bounds in x: B = min_j (b_j − a_j x) makes every slack nonnegative, and
// the row attaining it is tight and pairs with B.
func (sx *simplex) startBasis() {
	lp := sx.lp
	best, bestRow := math.Inf(1), 0
	for j := range lp.m {
		sx.tPos[j] = -1
		if v := lp.b[j] - sx.rowDot(j); v < best {
			best, bestRow = v, j
		}
	}
	for i := range sx.pPos {
		sx.pPos[i] = -1
	}
	sx.P = append(sx.P[:0], lp.n)
	sx.pPos[lp.n] = 0
	sx.T = append(sx.T[:0], bestRow)
	sx.tPos[bestRow] = 0
}

// rowDot returns Σ_i A_ji x_i.
func (sx *simplex) rowDot(j int) float64 {
	lp, v := sx.lp, 0.0
	for k := lp.rowStart[j]; k < lp.rowStart[j+1]; k++ {
		v += lp.rowVal[k] * sx.x[lp.rowCmp[k]]
	}
	return v
}

// run pivots until no nonbasic variable has a favourable reduced cost.
func (sx *simplex) run() error {
	limit := iterFactor*(sx.lp.m+sx.lp.n+1) + 100
	for sx.iters = 0; sx.iters < limit; sx.iters++ {
		if done, err := sx.step(); done || err != nil {
			return err
		}
	}
	return say.Errorf("%w: no optimum after %d pivots", ErrNumerical, limit)
}

// step refactors the kernel, recomputes primal and dual values, and makes
// one pivot; it reports done at optimality.
func (sx *simplex) step() (done bool, err error) {
	if sx.stale() && !sx.refactor() {
		return false, say.Errorf("%w: singular basis kernel at pivot %d", ErrNumerical, sx.iters)
	}
	sx.primal()
	sx.dual()
	q, dir := sx.price()
	if q < 0 && sx.updates > 0 {
		// Accept optimality only on a fresh LU factorisation of the kernel.
		if !sx.factor() {
			return false, say.Errorf("%w: singular basis kernel at pivot %d", ErrNumerical, sx.iters)
		}
		sx.fresh = true
		sx.primal()
		sx.dual()
		sx.fresh = false
		if q, dir = sx.price(); q >= 0 {
			sx.updates = refactorMin + 2*len(sx.P) // the updated inverse drifted
		}
	}
	if q < 0 {
		return true, nil
	}
	return false, sx.pivot(q, dir)
}

// factor builds the kernel K = A[T, P] and factorises it.
func (sx *simplex) factor() bool {
	lp, k := sx.lp, len(sx.P)
	if cap(sx.kbuf) < k*k {
		sx.kbuf = make([]float64, k*k, 2*k*k)
	}
	kb := sx.kbuf[:k*k]
	clear(kb)
	for c, p := range sx.P {
		if p == lp.n {
			for r := range k {
				kb[r*k+c] = 1
			}
			continue
		}
		for e := lp.colStart[p]; e < lp.colStart[p+1]; e++ {
			if r := sx.tPos[lp.colRow[e]]; r >= 0 {
				kb[r*k+c] = lp.colVal[e]
			}
		}
	}
	return sx.lu.factor(kb, k)
}

// primal recomputes the basic values from the nonbasic ones, so rounding
// errors do not accumulate over pivots: K x_P = b_T − A[T, nonbasic] x_N.
// The slacks s = b − A x − B of the rows outside T follow from them; the
// ratio test computes those it needs (pivot).
func (sx *simplex) primal() {
	lp, rhs := sx.lp, sx.alpha[:len(sx.T)]
	for r, j := range sx.T {
		v := lp.b[j]
		for e := lp.rowStart[j]; e < lp.rowStart[j+1]; e++ {
			if c := lp.rowCmp[e]; sx.st[c] != basic {
				v -= lp.rowVal[e] * sx.x[c]
			}
		}
		rhs[r] = v
	}
	if sx.fresh {
		sx.lu.solve(rhs, sx.tmp)
	} else {
		sx.applyInv(rhs)
	}
	for c, p := range sx.P {
		if p == lp.n {
			sx.bval = rhs[c]
		} else {
			sx.x[p] = rhs[c]
		}
	}
}

// dual solves Kᵀ y = c_P (1 for B, 0 for compounds) and sets the compound
// reduced costs d_i = −Σ_{r} y_r A[T_r, i]; the slack of row T_r has
// reduced cost −y_r.
func (sx *simplex) dual() {
	lp := sx.lp
	k, b := len(sx.P), sx.pPos[lp.n]
	sx.y = sx.y[:k]
	if sx.fresh {
		clear(sx.y)
		sx.y[b] = 1
		sx.lu.solveT(sx.y, sx.tmp)
	} else {
		copy(sx.y, sx.kinv[b*sx.ks:b*sx.ks+k]) // y = Eᵀ e_B
	}
	clear(sx.d)
	for r, j := range sx.T {
		yr := sx.y[r]
		for e := lp.rowStart[j]; e < lp.rowStart[j+1]; e++ {
			sx.d[lp.rowCmp[e]] -= yr * lp.rowVal[e]
		}
	}
}

// price picks the entering variable and its direction (+1 up, −1 down), or
// returns q < 0 at optimality. Fixed compounds never enter.
func (sx *simplex) price() (q, dir int) {
	lp := sx.lp
	q, best := -1, 0.0
	take := func(v, sign int, gain float64) {
		if sx.bland {
			if q < 0 || v < q {
				q, dir = v, sign
			}
		} else if gain > best {
			q, dir, best = v, sign, gain
		}
	}
	for i := range lp.n {
		switch {
		case sx.st[i] == basic || lp.lo[i] == lp.up[i]:
		case sx.st[i] == atLower && sx.d[i] > dualTol:
			take(i, 1, sx.d[i])
		case sx.st[i] == atUpper && sx.d[i] < -dualTol:
			take(i, -1, -sx.d[i])
		}
	}
	for r, j := range sx.T {
		if sx.y[r] < -dualTol {
			take(lp.n+1+j, 1, -sx.y[r])
		}
	}
	return q, dir
}
