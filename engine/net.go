package engine

import (
	"math/big"
	"strconv"

	"gibbsheet/engine/equation"
)

// netReaction sums the rows' stoichiometries, each times its multiplier, in exact rational arithmetic so
// that intermediates cancel exactly. Compounds keep the order in which they first appear.
type netReaction struct {
	order []string
	coef  map[string]*big.Rat
	term  map[string]equation.Term
}

func (n *netReaction) add(nu []stoich, times float64) {
	if n.coef == nil {
		n.coef, n.term = map[string]*big.Rat{}, map[string]equation.Term{}
	}
	t := ratOf(times)
	for _, s := range nu {
		c, ok := n.coef[s.key]
		if !ok {
			c = new(big.Rat)
			n.coef[s.key] = c
			n.order = append(n.order, s.key)
			n.term[s.key] = s.term
		}
		c.Add(c, new(big.Rat).Mul(s.rat, t))
	}
}

// String prints the net reaction in the equation normal form; "" when nothing is left.
func (n *netReaction) String() string {
	var eq equation.Equation
	for _, key := range n.order {
		c := n.coef[key]
		if c.Sign() == 0 {
			continue
		}
		t := n.term[key]
		abs := new(big.Rat).Abs(c)
		t.Coef = ratTerm(abs)
		if c.Sign() < 0 {
			eq.Left = append(eq.Left, t)
		} else {
			eq.Right = append(eq.Right, t)
		}
	}
	if len(eq.Left) == 0 && len(eq.Right) == 0 {
		return ""
	}
	return eq.String()
}

// ratOf converts a multiplier to the rational its shortest decimal text denotes (2.5 → 5/2, 0.1 → 1/10).
func ratOf(x float64) *big.Rat {
	r, ok := new(big.Rat).SetString(strconv.FormatFloat(x, 'g', -1, 64))
	if !ok {
		r = new(big.Rat).SetFloat64(x)
	}
	return r
}

// ratTerm converts to the parser's coefficient type; a value too large for it is rounded to a decimal.
func ratTerm(r *big.Rat) equation.Rat {
	if r.Num().IsInt64() && r.Denom().IsInt64() {
		return equation.Rat{Num: r.Num().Int64(), Den: r.Denom().Int64()}
	}
	f, _ := r.Float64()
	q, _ := equation.RatFromFloat(f)
	return q
}
