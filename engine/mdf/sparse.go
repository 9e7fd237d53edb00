package mdf

import "slices"

// sparseLP is the constraint matrix of a Problem in the form
//
//	A x + B·1 + s = b,   s ≥ 0,   lo ≤ x ≤ up,   B free,
//
// with A_ji = RT·S_ij (kJ/mol per unit ln concentration) and b_j = −ΔrG'°_j,
// stored both by reaction (rows) and by compound (columns).
type sparseLP struct {
	m, n int
	b    []float64

	rowStart []int // entries of row j are rowStart[j] ≤ k < rowStart[j+1]
	rowCmp   []int
	rowVal   []float64

	colStart []int // entries of column i are colStart[i] ≤ k < colStart[i+1]
	colRow   []int
	colVal   []float64

	lo, up []float64
}

// newSparseLP builds the matrix of a validated problem, summing repeated
// compounds within a reaction and dropping zero coefficients.
func newSparseLP(p *Problem) *sparseLP {
	s := new(sparseLP)
	s.build(p, nil)
	return s
}

// build makes s the matrix of a validated problem as newSparseLP does, in
// the buffers s holds, and returns pos, a scratch buffer to keep for the next
// build.
func (s *sparseLP) build(p *Problem, pos []int) []int {
	m, n := len(p.Reactions), len(p.Lower)
	s.m, s.n, s.lo, s.up = m, n, p.Lower, p.Upper
	s.b = resize(s.b, m)
	s.rowStart = resize(s.rowStart, m+1)
	s.rowStart[0] = 0
	terms := 0
	for j := range p.Reactions {
		terms += len(p.Reactions[j].Compound)
	}
	s.rowCmp, s.rowVal = slices.Grow(s.rowCmp[:0], terms), slices.Grow(s.rowVal[:0], terms)
	pos = resize(pos, n) // position of compound i in the current row, plus 1
	clear(pos)
	for j := range p.Reactions {
		r := &p.Reactions[j]
		s.b[j] = -r.DG0
		start := len(s.rowCmp)
		for k, c := range r.Compound {
			if at := pos[c]; at > start {
				s.rowVal[at-1] += p.RT * r.Coef[k]
				continue
			}
			s.rowCmp = append(s.rowCmp, c)
			s.rowVal = append(s.rowVal, p.RT*r.Coef[k])
			pos[c] = len(s.rowCmp)
		}
		// Forget this row's positions, then drop entries that are or
		// summed to zero.
		w := start
		for k := start; k < len(s.rowCmp); k++ {
			pos[s.rowCmp[k]] = 0
		}
		for k := start; k < len(s.rowCmp); k++ {
			if s.rowVal[k] != 0 {
				s.rowCmp[w], s.rowVal[w] = s.rowCmp[k], s.rowVal[k]
				w++
			}
		}
		s.rowCmp, s.rowVal = s.rowCmp[:w], s.rowVal[:w]
		s.rowStart[j+1] = w
	}
	// Transpose into columns; pos is the next free entry of each column.
	s.colStart = resize(s.colStart, n+1)
	clear(s.colStart)
	for _, c := range s.rowCmp {
		s.colStart[c+1]++
	}
	for i := range n {
		s.colStart[i+1] += s.colStart[i]
	}
	nnz := len(s.rowCmp)
	s.colRow, s.colVal = resize(s.colRow, nnz), resize(s.colVal, nnz)
	next := append(pos[:0], s.colStart[:n]...)
	for j := range m {
		for k := s.rowStart[j]; k < s.rowStart[j+1]; k++ {
			c := s.rowCmp[k]
			s.colRow[next[c]] = j
			s.colVal[next[c]] = s.rowVal[k]
			next[c]++
		}
	}
	return next
}

// resize returns b with length n, reallocated if its capacity is short; the
// entries are left as they were.
func resize[T any](b []T, n int) []T {
	if cap(b) < n {
		return make([]T, n)
	}
	return b[:n]
}
