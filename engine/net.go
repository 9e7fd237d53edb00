package engine

import (
	"math"
	"strconv"
	"strings"

	"gibbsheet/engine/equation"
)

// netReaction sums the rows' stoichiometries, each times its multiplier, in exact rational arithmetic
// (equation.Rat) so that intermediates cancel exactly. A sum that no longer fits in int64 (coefficients and
// multipliers far beyond any real pathway) carries on in float64 and is printed rounded. Compounds keep the
// order in which they first appear.
type netReaction struct {
	coefs []netCoef      // in order of first appearance
	index map[string]int // into coefs, by reactant key
}

type netCoef struct {
	exact   equation.Rat
	inexact bool    // the exact sum overflowed; approx holds it
	approx  float64 // the sum in float64, kept alongside
	term    equation.Term
}

func (n *netReaction) add(nu []stoich, times float64) {
	if n.index == nil {
		n.index = make(map[string]int, 32)
		n.coefs = make([]netCoef, 0, 32)
	}
	t, tOK := equation.Rat{Num: int64(times), Den: 1}, true
	if times != math.Trunc(times) || math.Abs(times) > 1<<53 {
		t, tOK = equation.RatFromFloat(times)
	}
	for _, s := range nu {
		i, ok := n.index[s.key]
		if !ok {
			i = len(n.coefs)
			n.index[s.key] = i
			n.coefs = append(n.coefs, netCoef{term: s.term})
		}
		c := &n.coefs[i]
		c.approx += s.coef * times
		if c.inexact || !tOK {
			c.inexact = true
			continue
		}
		p, ok := s.rat, true
		if t != (equation.Rat{Num: 1, Den: 1}) {
			p, ok = s.rat.Mul(t)
		}
		if ok {
			p, ok = c.exact.Add(p)
		}
		c.exact, c.inexact = p, !ok
	}
}

// String prints the net reaction in the equation normal form; "" when nothing is left. A coefficient too
// large for the normal form is written out in full digits (the text then no longer parses as an equation).
func (n *netReaction) String() string {
	var eq equation.Equation
	huge := false
	for i := range n.coefs {
		c := &n.coefs[i]
		r := c.exact
		if c.inexact {
			var ok bool
			if r, ok = equation.RatFromFloat(c.approx); !ok && c.approx != 0 {
				huge = true
			}
		}
		if r.IsZero() && !huge {
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
	if huge {
		return n.plainString()
	}
	if len(eq.Left) == 0 && len(eq.Right) == 0 {
		return ""
	}
	return eq.String()
}

// plainString prints the net reaction from the float sums, for coefficients beyond the normal form.
func (n *netReaction) plainString() string {
	var left, right []string
	for i := range n.coefs {
		c := &n.coefs[i]
		x := c.exact.Float()
		if c.inexact {
			x = c.approx
		}
		if x == 0 {
			continue
		}
		t := c.term
		t.Coef = equation.Rat{Num: 1, Den: 1}
		text := strconv.FormatFloat(math.Abs(x), 'f', -1, 64) + " " + t.String()
		if x < 0 {
			left = append(left, text)
		} else {
			right = append(right, text)
		}
	}
	return strings.Join(left, " + ") + " = " + strings.Join(right, " + ")
}
