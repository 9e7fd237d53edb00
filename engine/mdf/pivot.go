package mdf

import (
	"math"

	"gibbsheet/engine/internal/say"
)

// pivot moves entering variable q in direction dir (+1 or −1) until a basic
// variable reaches a bound or q reaches its other bound (ratio test), and
// updates the basis.
func (sx *simplex) pivot(q, dir int) error {
	lp, n := sx.lp, sx.lp.n
	slackRow := -1 // row whose slack enters, if q is a slack
	if q > n {
		slackRow = q - n - 1
	}
	// alpha = K⁻¹ a_q[T] = Σ_r E[:, r] a_q[T_r] over the few nonzeros of
	// a_q; w = a_q − A[:, P] alpha on rows outside T.
	k, ks := len(sx.P), sx.ks
	alpha := sx.alpha[:k]
	clear(alpha)
	clear(sx.w)
	addCol := func(r int, v float64) {
		for c := range alpha {
			alpha[c] += sx.kinv[c*ks+r] * v
		}
	}
	if slackRow >= 0 {
		addCol(sx.tPos[slackRow], 1)
	} else {
		for e := lp.colStart[q]; e < lp.colStart[q+1]; e++ {
			j := lp.colRow[e]
			if r := sx.tPos[j]; r >= 0 {
				addCol(r, lp.colVal[e])
			} else {
				sx.w[j] = lp.colVal[e]
			}
		}
	}
	for c, p := range sx.P {
		a := alpha[c]
		if a == 0 {
			continue
		}
		if p == n {
			for j := range sx.w {
				sx.w[j] -= a
			}
			continue
		}
		for e := lp.colStart[p]; e < lp.colStart[p+1]; e++ {
			sx.w[lp.colRow[e]] -= lp.colVal[e] * a
		}
	}

	// Ratio test. A basic variable changes by δ·t when q moves by dir·t,
	// with δ = −dir·alpha (structural) or −dir·w (slack).
	const flip = -1
	tBest, leave, leaveIdx, leavePiv := math.Inf(1), -2, 0, 0.0
	if slackRow < 0 {
		tBest, leave, leavePiv = lp.up[q]-lp.lo[q], flip, math.Inf(1)
	}
	consider := func(t float64, idx int, piv float64) {
		switch {
		case t < tBest-ratioTieTol:
		case t > tBest+ratioTieTol:
			return
		case sx.bland:
			if leave != flip && idx < leaveIdx {
				break
			}
			return
		default:
			if piv > leavePiv {
				break
			}
			return
		}
		tBest, leave, leaveIdx, leavePiv = math.Max(t, 0), idx, idx, piv
	}
	for c, p := range sx.P {
		if p == n {
			continue
		}
		switch delta := -float64(dir) * alpha[c]; {
		case delta < -pivTol:
			consider((sx.x[p]-lp.lo[p])/-delta, p, -delta)
		case delta > pivTol:
			consider((lp.up[p]-sx.x[p])/delta, p, delta)
		}
	}
	for j, wj := range sx.w {
		if sx.tPos[j] >= 0 {
			continue
		}
		// The slack is computed where the ratio test needs it (see primal),
		// and a step longer than the best so far is passed over before
		// consider, which would pass it over too.
		if delta := -float64(dir) * wj; delta < -pivTol {
			if t := math.Max(lp.b[j]-sx.rowDot(j)-sx.bval, 0) / -delta; t <= tBest+ratioTieTol {
				consider(t, n+1+j, -delta)
			}
		}
	}
	if leave == -2 {
		return say.Errorf("%w: unbounded direction at pivot %d", ErrNumerical, sx.iters)
	}
	if tBest <= degenerateTol {
		if sx.degen++; sx.degen >= blandAfter {
			sx.bland = true
		}
	} else {
		sx.degen = 0
	}

	switch {
	case leave == flip:
		if dir > 0 {
			sx.x[q], sx.st[q] = lp.up[q], atUpper
		} else {
			sx.x[q], sx.st[q] = lp.lo[q], atLower
		}
	case leave < n: // a basic compound reaches a bound
		c := sx.pPos[leave]
		if -float64(dir)*alpha[c] < 0 {
			sx.x[leave], sx.st[leave] = lp.lo[leave], atLower
		} else {
			sx.x[leave], sx.st[leave] = lp.up[leave], atUpper
		}
		sx.pPos[leave] = -1
		if slackRow < 0 {
			sx.replaceCol(c, alpha)
			sx.P[c], sx.pPos[q], sx.st[q] = q, c, basic
		} else {
			r := sx.tPos[slackRow]
			sx.shrink(c, r)
			sx.removeP(c)
			sx.removeT(r)
		}
	default: // the slack of a loose row reaches zero: the row becomes tight
		j := leave - n - 1
		if slackRow < 0 {
			sx.grow(j, alpha, sx.w[j])
			sx.pPos[q], sx.st[q] = len(sx.P), basic
			sx.P = append(sx.P, q)
			sx.tPos[j] = len(sx.T)
			sx.T = append(sx.T, j)
		} else {
			r := sx.tPos[slackRow]
			sx.replaceRow(r, j)
			sx.tPos[slackRow], sx.tPos[j], sx.T[r] = -1, r, j
		}
	}
	return nil
}

// removeP deletes position c of P by moving the last entry into it.
func (sx *simplex) removeP(c int) { removeAt(&sx.P, sx.pPos, c) }

// removeT deletes position r of T by moving the last entry into it.
func (sx *simplex) removeT(r int) { removeAt(&sx.T, sx.tPos, r) }

// removeAt deletes position i of list by moving the last entry into it, keeping pos (the position of each
// entry in list, −1 when absent) in step.
func removeAt(list *[]int, pos []int, i int) {
	l := *list
	last, v := len(l)-1, l[i]
	l[i] = l[last]
	pos[l[i]] = i
	pos[v] = -1
	*list = l[:last]
}
