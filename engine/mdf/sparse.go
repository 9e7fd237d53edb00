package mdf

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
	m, n := len(p.Reactions), len(p.Lower)
	s := &sparseLP{m: m, n: n, b: make([]float64, m), lo: p.Lower, up: p.Upper}
	s.rowStart = make([]int, m+1)
	terms := 0
	for j := range p.Reactions {
		terms += len(p.Reactions[j].Compound)
	}
	s.rowCmp, s.rowVal = make([]int, 0, terms), make([]float64, 0, terms)
	pos := make([]int, n) // position of compound i in the current row, plus 1
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
	// Transpose into columns.
	s.colStart = make([]int, n+1)
	for _, c := range s.rowCmp {
		s.colStart[c+1]++
	}
	for i := range n {
		s.colStart[i+1] += s.colStart[i]
	}
	nnz := len(s.rowCmp)
	s.colRow = make([]int, nnz)
	s.colVal = make([]float64, nnz)
	next := append([]int(nil), s.colStart[:n]...)
	for j := range m {
		for k := s.rowStart[j]; k < s.rowStart[j+1]; k++ {
			c := s.rowCmp[k]
			s.colRow[next[c]] = j
			s.colVal[next[c]] = s.rowVal[k]
			next[c]++
		}
	}
	return s
}
