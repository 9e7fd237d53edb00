package mdf

import (
	"errors"
	"math"

	"gibbsheet/engine/internal/say"
)

// Reaction is one row of the MDF linear program.
//
// The stoichiometry is held as parallel slices rather than a map: the solver
// walks every reaction's compounds many times per pivot, and a slice walk is
// several times faster than map iteration and has a fixed order, so results
// are reproducible bit for bit. Coefficients are negative for substrates and
// positive for products. A compound listed twice has its coefficients
// summed; zero coefficients are ignored.
type Reaction struct {
	// DG0 is the standard transformed Gibbs energy ΔrG'° in kJ/mol.
	DG0 float64
	// Compound holds compound indices into Problem.Lower and Problem.Upper.
	Compound []int
	// Coef holds the stoichiometric coefficient of Compound[k] at Coef[k].
	Coef []float64
}

// Problem is the MDF linear program
//
//	maximise B  subject to  ΔrG'°_j + RT Σ_i S_ij x_i ≤ −B  for every reaction j,
//	                        Lower_i ≤ x_i ≤ Upper_i        for every compound i,
//
// where x_i = ln(c_i / 1 M) (Noor et al., PLoS Comput Biol 2014, eq. 7).
type Problem struct {
	Reactions []Reaction
	// Lower and Upper are the natural-log concentration bounds ln(c/1 M) of
	// each compound; Lower[i] == Upper[i] fixes compound i.
	Lower, Upper []float64
	// RT is the gas constant times temperature in kJ/mol
	// (8.314462618e-3 kJ/(mol·K) × 298.15 K ≈ 2.4790 kJ/mol).
	RT float64
}

var (
	// ErrBadBounds reports a compound whose bounds are NaN, infinite or
	// have Lower > Upper. It is wrapped in a *BoundsError.
	ErrBadBounds = errors.New("mdf: bad concentration bounds")
	// ErrBadReaction reports a reaction whose ΔrG'° or a coefficient is NaN
	// or infinite. It is wrapped in a *ReactionError.
	ErrBadReaction = errors.New("mdf: bad reaction")
	// ErrBadRT reports an RT that is not a finite positive number.
	ErrBadRT = errors.New("mdf: RT must be finite and positive")
	// ErrNoReactions reports a problem without reactions, whose MDF is
	// unbounded.
	ErrNoReactions = errors.New("mdf: no reactions")
	// ErrNumerical reports a breakdown of the simplex method (a singular
	// basis or no progress within the iteration limit). It is not expected
	// for valid input; the message says which.
	ErrNumerical = errors.New("mdf: numerical failure")
)

// BoundsError names the compound with invalid bounds.
type BoundsError struct {
	Compound     int
	Lower, Upper float64
}

func (e *BoundsError) Error() string {
	return say.Sprintf("mdf: compound %d: bad ln bounds [%g, %g]: need finite lower ≤ upper",
		e.Compound, e.Lower, e.Upper)
}

// Unwrap returns ErrBadBounds.
func (e *BoundsError) Unwrap() error { return ErrBadBounds }

// ReactionError names the reaction with a non-finite value.
type ReactionError struct {
	Reaction int
	What     string
}

func (e *ReactionError) Error() string {
	return say.Sprintf("mdf: reaction %d: %s", e.Reaction, e.What)
}

// Unwrap returns ErrBadReaction.
func (e *ReactionError) Unwrap() error { return ErrBadReaction }

// validate checks the data conditions of p and returns all violations
// joined. It panics on programmer mistakes: len(Lower) != len(Upper),
// len(Compound) != len(Coef), or a compound index out of range.
func (p *Problem) validate() error {
	n := len(p.Lower)
	if len(p.Upper) != n {
		panic(say.Sprintf("mdf: len(Lower) = %d, len(Upper) = %d", n, len(p.Upper)))
	}
	var errs []error
	if !(p.RT > 0) || math.IsInf(p.RT, 1) {
		errs = append(errs, say.Errorf("%w (got %g)", ErrBadRT, p.RT))
	}
	if len(p.Reactions) == 0 {
		errs = append(errs, ErrNoReactions)
	}
	for i := range n {
		lo, up := p.Lower[i], p.Upper[i]
		if !finite(lo) || !finite(up) || lo > up {
			errs = append(errs, &BoundsError{Compound: i, Lower: lo, Upper: up})
		}
	}
	for j := range p.Reactions {
		r := &p.Reactions[j]
		if len(r.Compound) != len(r.Coef) {
			panic(say.Sprintf("mdf: reaction %d: len(Compound) = %d, len(Coef) = %d",
				j, len(r.Compound), len(r.Coef)))
		}
		if !finite(r.DG0) {
			errs = append(errs, &ReactionError{Reaction: j, What: say.Sprintf("ΔrG'° is %g", r.DG0)})
		}
		for k, c := range r.Compound {
			if c < 0 || c >= n {
				panic(say.Sprintf("mdf: reaction %d: compound index %d out of range [0, %d)", j, c, n))
			}
			if !finite(r.Coef[k]) {
				errs = append(errs, &ReactionError{Reaction: j,
					What: say.Sprintf("coefficient of compound %d is %g", c, r.Coef[k])})
			}
		}
	}
	return errors.Join(errs...)
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
