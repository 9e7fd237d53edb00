package mdf

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/optimize/convex/lp"
)

// gonumTol is the reduced-cost tolerance handed to lp.Simplex.
const gonumTol = 1e-10

// SolveGonum solves the same LP as Solve with gonum's dense lp.Simplex,
// the test oracle. Variables v = (x_0..x_{n-1}, B); the general form
//
//	minimise −B  s.t.  [RT·Sᵀ 1] v ≤ −ΔrG'°,  x_i ≤ U_i,  −x_i ≤ −L_i,
//	                   x_i = L_i for fixed compounds,
//
// is turned into standard form by lp.Convert. Only MDF, LnConc and
// DrivingForce are filled in: lp.Simplex returns no duals.
func SolveGonum(p *Problem) (*Solution, error) {
	if err := p.validate(); err != nil {
		return nil, err
	}
	n := len(p.Lower)
	nv := n + 1
	c := make([]float64, nv)
	c[n] = -1
	var gRows [][]float64
	var h []float64
	for _, r := range p.Reactions {
		row := make([]float64, nv)
		for k, ci := range r.Compound {
			row[ci] += p.RT * r.Coef[k]
		}
		row[n] = 1
		gRows = append(gRows, row)
		h = append(h, -r.DG0)
	}
	var aRows [][]float64
	var b []float64
	for i := range n {
		row := make([]float64, nv)
		row[i] = 1
		if p.Lower[i] == p.Upper[i] {
			aRows = append(aRows, row)
			b = append(b, p.Lower[i])
			continue
		}
		neg := make([]float64, nv)
		neg[i] = -1
		gRows = append(gRows, row, neg)
		h = append(h, p.Upper[i], -p.Lower[i])
	}
	var aMat mat.Matrix
	if len(aRows) > 0 {
		aMat = dense(aRows, nv)
	}
	cNew, aNew, bNew := lp.Convert(c, dense(gRows, nv), h, aMat, b)
	_, xs, err := lp.Simplex(cNew, aNew, bNew, gonumTol, nil)
	if err != nil {
		return nil, fmt.Errorf("gonum lp.Simplex: %w", err)
	}
	// Convert splits each free variable v into v⁺ − v⁻, columns k and nv+k.
	x := make([]float64, n)
	for i := range x {
		x[i] = xs[i] - xs[nv+i]
	}
	sol := &Solution{LnConc: x, DrivingForce: DrivingForces(p, x)}
	sol.MDF = math.Inf(1)
	for _, f := range sol.DrivingForce {
		sol.MDF = min(sol.MDF, f)
	}
	return sol, nil
}

func dense(rows [][]float64, nc int) *mat.Dense {
	d := mat.NewDense(len(rows), nc, nil)
	for r, row := range rows {
		d.SetRow(r, row)
	}
	return d
}
