package engine

import (
	"math/big"
	"strconv"

	"gibbsheet/engine/equation"
)

// netReaction sums the rows' stoichiometries, each times its multiplier, in exact rational arithmetic so
// that intermediates cancel exactly. Coefficients stay in int64 (equation.Rat) while they fit and move to
// math/big when they do not. Compounds keep the order in which they first appear.
type netReaction struct {
	order []string
	coef  map[string]*netCoef
}

type netCoef struct {
	small equation.Rat
	big   *big.Rat // non-nil once the sum no longer fits in small
	term  equation.Term
}

func (n *netReaction) add(nu []stoich, times float64) {
	if n.coef == nil {
		n.coef = map[string]*netCoef{}
	}
	t, tOK := equation.RatFromFloat(times)
	for _, s := range nu {
		c, ok := n.coef[s.key]
		if !ok {
			c = &netCoef{term: s.term}
			n.coef[s.key] = c
			n.order = append(n.order, s.key)
		}
		if c.big == nil && tOK {
			if p, ok := s.rat.Mul(t); ok {
				if sum, ok := c.small.Add(p); ok {
					c.small = sum
					continue
				}
			}
		}
		if c.big == nil {
			c.big = ratBig(c.small)
		}
		p := new(big.Rat).Mul(ratBig(s.rat), bigOf(times))
		c.big.Add(c.big, p)
	}
}

// String prints the net reaction in the equation normal form; "" when nothing is left.
func (n *netReaction) String() string {
	var eq equation.Equation
	for _, key := range n.order {
		c := n.coef[key]
		r := c.small
		if c.big != nil {
			r = ratTerm(c.big)
		}
		if r.IsZero() {
			continue
		}
		t := c.term
		if r.Sign() < 0 {
			t.Coef = r.Neg()
			eq.Left = append(eq.Left, t)
		} else {
			t.Coef = r
			eq.Right = append(eq.Right, t)
		}
	}
	if len(eq.Left) == 0 && len(eq.Right) == 0 {
		return ""
	}
	return eq.String()
}

func ratBig(r equation.Rat) *big.Rat {
	den := r.Den
	if den == 0 {
		den = 1
	}
	return new(big.Rat).SetFrac64(r.Num, den)
}

// bigOf converts a multiplier to the rational its shortest decimal text denotes (2.5 → 5/2, 0.1 → 1/10).
func bigOf(x float64) *big.Rat {
	r, ok := new(big.Rat).SetString(strconv.FormatFloat(x, 'g', -1, 64))
	if !ok {
		r = new(big.Rat).SetFloat64(x)
	}
	return r
}

// ratTerm converts to the parser's coefficient type; a value too large for it is rounded to a decimal.
func ratTerm(r *big.Rat) equation.Rat {
	if r.Num().IsInt64() && r.Denom().IsInt64() {
		if q, ok := equation.NewRat(r.Num().Int64(), r.Denom().Int64()); ok {
			return q
		}
	}
	f, _ := r.Float64()
	q, _ := equation.RatFromFloat(f)
	return q
}
