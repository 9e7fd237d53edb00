package mdf

// Solution is the optimum of a Problem.
type Solution struct {
	// MDF is the max-min driving force B* in kJ/mol: the smallest
	// DrivingForce at the optimum (negative when no concentrations within
	// the bounds make every reaction downhill).
	MDF float64
	// LnConc holds the optimal ln(c_i / 1 M), within the bounds.
	LnConc []float64
	// DrivingForce holds −ΔrG'_j = −(ΔrG'°_j + RT Σ_i S_ij x_i) in kJ/mol.
	DrivingForce []float64
	// Shadow holds the reaction duals λ_j ≥ 0, which sum to 1: the rate at
	// which the MDF falls per kJ/mol added to ΔrG'°_j.
	Shadow []float64
	// Bottleneck marks the reactions with Shadow > dualTol.
	Bottleneck []bool
	// BoundShadow holds ∂MDF/∂x_i at the active bound of each compound in
	// kJ/mol per unit ln concentration: −RT Σ_j λ_j S_ij. It is negative
	// where raising the lower bound would lower the MDF and positive where
	// raising the upper bound would raise it; zero for compounds strictly
	// between their bounds.
	BoundShadow []float64
	// LowerBinding and UpperBinding mark compounds at that bound whose
	// BoundShadow is nonzero (beyond dualTol), so relaxing the bound would
	// raise the MDF. A fixed compound binds on the side its sign selects.
	LowerBinding, UpperBinding []bool
	// Pivots is the number of simplex pivots used.
	Pivots int
}

// Solve computes the max-min driving force of p with a bounded-variable
// revised simplex method (see simplex). Data errors are returned joined:
// a *BoundsError (ErrBadBounds) per compound with NaN, infinite or crossed
// bounds, a *ReactionError (ErrBadReaction) per non-finite ΔrG'° or
// coefficient, ErrBadRT and ErrNoReactions. ErrNumerical is returned only if
// the simplex method breaks down. Solve panics if len(p.Lower) !=
// len(p.Upper), a reaction has len(Compound) != len(Coef), or a compound
// index is out of range, all programmer mistakes.
//
// For degenerate problems the duals, and so Bottleneck and the binding
// bounds, are one optimal choice among several; MDF and the constraint
// values are unique up to rounding.
func Solve(p *Problem) (*Solution, error) { return new(Solver).Solve(p) }

// Solver solves one problem after another in the same working memory,
// which saves most of the allocations of Solve when the problems are of a
// like size. Its results are those of Solve, whatever it solved before
// (TestSolverReuse). The zero value is ready to use; a Solver is not safe for
// concurrent use.
type Solver struct {
	lp  sparseLP
	sx  simplex
	pos []int
}

// Solve is Solve(p), in s's working memory; the Solution shares no memory with s.
func (s *Solver) Solve(p *Problem) (*Solution, error) {
	if err := p.validate(); err != nil {
		return nil, err
	}
	s.pos = s.lp.build(p, s.pos)
	s.sx.init(&s.lp)
	if err := s.sx.run(); err != nil {
		return nil, err
	}
	return s.sx.solution(p), nil
}

// solution reads the optimal basis into a Solution, recomputing the driving
// forces from the original reactions.
func (sx *simplex) solution(p *Problem) *Solution {
	lp, n, m := sx.lp, sx.lp.n, sx.lp.m
	sol := &Solution{
		LnConc:       make([]float64, n),
		DrivingForce: make([]float64, m),
		Shadow:       make([]float64, m),
		Bottleneck:   make([]bool, m),
		BoundShadow:  make([]float64, n),
		LowerBinding: make([]bool, n),
		UpperBinding: make([]bool, n),
		Pivots:       sx.iters,
	}
	for i, v := range sx.x {
		sol.LnConc[i] = min(max(v, lp.lo[i]), lp.up[i])
		if sx.st[i] == basic {
			continue
		}
		d := sx.d[i]
		sol.BoundShadow[i] = d
		sol.LowerBinding[i] = sol.LnConc[i] == lp.lo[i] && d < -dualTol
		sol.UpperBinding[i] = sol.LnConc[i] == lp.up[i] && d > dualTol
	}
	for r, j := range sx.T {
		sol.Shadow[j] = sx.y[r]
		sol.Bottleneck[j] = sx.y[r] > dualTol
	}
	sol.DrivingForce = DrivingForces(p, sol.LnConc)
	sol.MDF = sol.DrivingForce[0]
	for _, f := range sol.DrivingForce {
		sol.MDF = min(sol.MDF, f)
	}
	return sol
}

// DrivingForces returns −ΔrG'_j = −(ΔrG'°_j + RT Σ_i S_ij x_i) in kJ/mol
// for every reaction of p at ln concentrations x. It panics if a compound
// index is out of range of x.
func DrivingForces(p *Problem, x []float64) []float64 {
	f := make([]float64, len(p.Reactions))
	for j := range p.Reactions {
		r := &p.Reactions[j]
		v := r.DG0
		for k, c := range r.Compound {
			v += p.RT * r.Coef[k] * x[c]
		}
		f[j] = -v
	}
	return f
}
