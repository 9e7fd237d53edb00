package mdf

// The simplex method keeps the explicit inverse E = K⁻¹ of the basis kernel
// K = A[T, P] (rows of E follow P, columns follow T) and updates it in
// O(k²) per pivot with rank-one formulas (product-form updates, e.g.
// Chvátal, Linear Programming, 1983, ch. 7, from memory; the bordered and
// shrunk forms follow from the block inverse). E is recomputed from a fresh
// LU factorisation every max(refactorMin, 2k) updates, and optimality is
// only accepted after primal and dual values recomputed from a fresh LU
// factorisation confirm it, so rounding errors of the updates cannot decide
// the result.

// refactorMin is the least number of inverse updates between
// refactorisations.
const refactorMin = 32

// stale reports whether the inverse is due for recomputation.
func (sx *simplex) stale() bool {
	return !sx.inverted || sx.updates >= max(refactorMin, 2*len(sx.P))
}

// reserve makes the stride of the inverse at least k, keeping its entries.
func (sx *simplex) reserve(k int) {
	if k <= sx.ks {
		return
	}
	ks := max(2*k, 8)
	e := make([]float64, ks*ks)
	for i := range min(len(sx.P), sx.ks) {
		copy(e[i*ks:i*ks+len(sx.T)], sx.kinv[i*sx.ks:i*sx.ks+len(sx.T)])
	}
	sx.kinv, sx.ks = e, ks
	sx.tmp = make([]float64, ks)
	sx.y = make([]float64, ks)
	sx.alpha = make([]float64, ks)
}

// refactor recomputes E = K⁻¹ column by column from an LU factorisation of
// K and reports whether K is numerically nonsingular.
func (sx *simplex) refactor() bool {
	k := len(sx.P)
	sx.reserve(k)
	if !sx.factor() {
		return false
	}
	col := sx.alpha[:k]
	for r := range k {
		clear(col)
		col[r] = 1
		sx.lu.solve(col, sx.tmp[:k])
		for c, v := range col {
			sx.kinv[c*sx.ks+r] = v
		}
	}
	sx.updates, sx.inverted = 0, true
	return true
}

// applyInv overwrites x[:k] (indexed by T position) with E x (indexed by P
// position).
func (sx *simplex) applyInv(x []float64) {
	k, ks, t := len(sx.P), sx.ks, sx.tmp[:len(sx.P)]
	for c := range k {
		row, s := sx.kinv[c*ks:c*ks+k], 0.0
		for r, v := range row {
			s += v * x[r]
		}
		t[c] = s
	}
	copy(x[:k], t)
}

// rowTimesInv sets sx.tmp[:k] to ρ = uᵀE, where u = A[j, P] is row j of
// the constraint matrix restricted to the basic structural variables.
func (sx *simplex) rowTimesInv(j int) []float64 {
	lp, k, ks := sx.lp, len(sx.P), sx.ks
	rho := sx.tmp[:k]
	copy(rho, sx.kinv[sx.pPos[lp.n]*ks:sx.pPos[lp.n]*ks+k]) // B's entry is 1
	for e := lp.rowStart[j]; e < lp.rowStart[j+1]; e++ {
		if c := sx.pPos[lp.rowCmp[e]]; c >= 0 {
			u, row := lp.rowVal[e], sx.kinv[c*ks:c*ks+k]
			for r, v := range row {
				rho[r] += u * v
			}
		}
	}
	return rho
}

// replaceCol updates E when the variable at P position c is replaced by a
// column a with α = E a: row c becomes row_c/α_c, row i becomes
// row_i − α_i row_c/α_c.
func (sx *simplex) replaceCol(c int, alpha []float64) {
	k, ks := len(sx.P), sx.ks
	rc := sx.kinv[c*ks : c*ks+k]
	inv := 1 / alpha[c]
	for r := range rc {
		rc[r] *= inv
	}
	for i := range k {
		if a := alpha[i]; i != c && a != 0 {
			ri := sx.kinv[i*ks : i*ks+k]
			for r, v := range rc {
				ri[r] -= a * v
			}
		}
	}
	sx.updates++
}

// replaceRow updates E when the row at T position r is replaced by row j
// of the constraint matrix, with ρ = A[j, P]ᵀE: column r becomes
// col_r/ρ_r, column s becomes col_s − ρ_s col_r/ρ_r.
func (sx *simplex) replaceRow(r, j int) {
	k, ks := len(sx.P), sx.ks
	rho := sx.rowTimesInv(j)
	inv := 1 / rho[r]
	for i := range k {
		row := sx.kinv[i*ks : i*ks+k]
		row[r] *= inv
		if f := row[r]; f != 0 {
			for s, p := range rho {
				if s != r {
					row[s] -= p * f
				}
			}
		}
	}
	sx.updates++
}

// grow borders E with row j (new last T position) and a column whose
// E-image is α (new last P position). With ρ = A[j, P]ᵀE and the Schur
// complement s = A[j, q] − A[j, P]·α (the pivot w_j):
//
//	E' = [E + α ρᵀ/s  −α/s; −ρᵀ/s  1/s].
func (sx *simplex) grow(j int, alpha []float64, s float64) {
	k := len(sx.P)
	sx.reserve(k + 1)
	ks := sx.ks
	rho := sx.rowTimesInv(j)
	inv := 1 / s
	for i := range k {
		row, a := sx.kinv[i*ks:i*ks+k+1], alpha[i]*inv
		for r, p := range rho {
			row[r] += a * p
		}
		row[k] = -a
	}
	last := sx.kinv[k*ks : k*ks+k+1]
	for r, p := range rho {
		last[r] = -p * inv
	}
	last[k] = inv
	sx.updates++
}

// shrink removes P position c and T position r from E (the basis loses a
// structural variable and a tight row):
//
//	E' = E[−c, −r] − E[−c, r] E[c, −r] / E[c, r],
//
// then moves the last row into row c and the last column into column r, as
// removeP and removeT do with P and T.
func (sx *simplex) shrink(c, r int) {
	k, ks := len(sx.P), sx.ks
	rc := sx.kinv[c*ks : c*ks+k]
	inv := 1 / rc[r]
	for i := range k {
		if i == c {
			continue
		}
		row := sx.kinv[i*ks : i*ks+k]
		if f := row[r] * inv; f != 0 {
			for s, v := range rc {
				row[s] -= f * v
			}
		}
	}
	last := k - 1
	if c != last {
		copy(sx.kinv[c*ks:c*ks+k], sx.kinv[last*ks:last*ks+k])
	}
	if r != last {
		for i := range last {
			sx.kinv[i*ks+r] = sx.kinv[i*ks+last]
		}
	}
	sx.updates++
}
