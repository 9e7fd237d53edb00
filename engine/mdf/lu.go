package mdf

import "math"

// singularTol is the smallest pivot, relative to the largest entry of the
// matrix, that the dense LU factorisation of the basis kernel accepts. The
// kernel entries are RT·S_ij and 1, so a pivot below it means the ratio test
// let a dependent column into the basis.
const singularTol = 1e-11

// denseLU is an LU factorisation with partial pivoting, P·K = L·U, of the
// k×k basis kernel K stored row-major. The buffers are reused between
// pivots.
type denseLU struct {
	k    int
	a    []float64 // L below the diagonal (unit diagonal implied), U on and above
	perm []int     // row perm[r] of K is row r of P·K
}

// factor factorises the k×k row-major matrix a in place and reports whether
// it is numerically nonsingular.
func (f *denseLU) factor(a []float64, k int) bool {
	f.k, f.a = k, a
	f.perm = f.perm[:0]
	for r := range k {
		f.perm = append(f.perm, r)
	}
	scale := 0.0
	for _, v := range a {
		scale = math.Max(scale, math.Abs(v))
	}
	for c := range k {
		p, best := c, math.Abs(a[c*k+c])
		for r := c + 1; r < k; r++ {
			if v := math.Abs(a[r*k+c]); v > best {
				p, best = r, v
			}
		}
		if best <= singularTol*scale {
			return false
		}
		if p != c {
			rc, rp := a[c*k:c*k+k], a[p*k:p*k+k]
			for i := range rc {
				rc[i], rp[i] = rp[i], rc[i]
			}
			f.perm[c], f.perm[p] = f.perm[p], f.perm[c]
		}
		piv := a[c*k+c]
		for r := c + 1; r < k; r++ {
			l := a[r*k+c] / piv
			if l == 0 {
				continue
			}
			a[r*k+c] = l
			row, top := a[r*k+c+1:r*k+k], a[c*k+c+1:c*k+k]
			for i, v := range top {
				row[i] -= l * v
			}
		}
	}
	return true
}

// solve overwrites x (length k, right-hand side on entry) with K⁻¹x, using
// tmp (length k) as scratch.
func (f *denseLU) solve(x, tmp []float64) {
	k, a := f.k, f.a
	for r := range k {
		tmp[r] = x[f.perm[r]]
	}
	for r := range k { // L y = P x
		s := tmp[r]
		for c, v := range a[r*k : r*k+r] {
			s -= v * tmp[c]
		}
		tmp[r] = s
	}
	for r := k - 1; r >= 0; r-- { // U x = y
		s := tmp[r]
		for c := r + 1; c < k; c++ {
			s -= a[r*k+c] * tmp[c]
		}
		tmp[r] = s / a[r*k+r]
	}
	copy(x, tmp[:k])
}

// solveT overwrites x (length k, right-hand side on entry) with K⁻ᵀx, using
// tmp (length k) as scratch. Kᵀ = Uᵀ Lᵀ P, so solve Uᵀz = x, Lᵀw = z, x = Pᵀw.
func (f *denseLU) solveT(x, tmp []float64) {
	k, a := f.k, f.a
	copy(tmp, x[:k])
	for c := range k { // Uᵀ z = x: column c of U is row c of Uᵀ
		s := tmp[c]
		for r := range c {
			s -= a[r*k+c] * tmp[r]
		}
		tmp[c] = s / a[c*k+c]
	}
	for c := k - 1; c >= 0; c-- { // Lᵀ w = z
		s := tmp[c]
		for r := c + 1; r < k; r++ {
			s -= a[r*k+c] * tmp[r]
		}
		tmp[c] = s
	}
	for r := range k {
		x[f.perm[r]] = tmp[r]
	}
}
