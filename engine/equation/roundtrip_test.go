package equation_test

import (
	"math/rand/v2"
	"strings"
	"testing"

	"gibbsheet/engine/equation"
)

// Pieces for random equations: names with the characters names may hold.
var (
	namePieces = []string{"ATP", "NAD+", "H+", "D-glucose", "6-phosphate", "α-D", "β-alanine", "ΔX",
		"5'-AMP", "3′,5′-cyclic", "(S)-malate", "1,3-bisphospho", "CoA", "Fe2+", "HCO3-", "acetyl-CoA",
		"O2", "e-", "glyceraldehyde", "ﬁsh", "İstanbul", "ǅ", "x"}
	spaces = []string{" ", " ", " ", "  ", "\t", "\u00a0", " \u2003 "}
	coefs  = []string{"", "", "1 ", "2 ", "0.5 ", "1/2 ", "3/4 ", "2.50 ", "007 ", "1/3 ", "0.125 "}
	tags   = []string{"", "", "[c]", "[m]", "[ e ]", " [mito]", "[extra  cell]"}
	arrows = []string{"=", "<=>", "⇌", "->", "→", " = "}
)

func pick(rng *rand.Rand, s []string) string { return s[rng.IntN(len(s))] }

// randomEquation writes a random equation text; its sides may repeat a
// compound, which Parse rejects, so callers count successes.
func randomEquation(rng *rand.Rand) string {
	var b strings.Builder
	side := func() {
		for i, n := 0, 1+rng.IntN(4); i < n; i++ {
			if i > 0 {
				b.WriteString(pick(rng, spaces) + "+" + pick(rng, spaces))
			}
			b.WriteString(pick(rng, coefs))
			for j, m := 0, 1+rng.IntN(3); j < m; j++ {
				if j > 0 {
					b.WriteString(pick(rng, spaces))
				}
				b.WriteString(pick(rng, namePieces))
			}
			b.WriteString(pick(rng, tags))
		}
	}
	b.WriteString(pick(rng, spaces))
	side()
	b.WriteString(pick(rng, spaces) + pick(rng, arrows) + pick(rng, spaces))
	side()
	return b.String()
}

// TestRoundTrip checks that the normal form of every parsed equation parses
// to the same normal form and the same terms.
func TestRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	const n = 5000
	parsed := 0
	for range n {
		src := randomEquation(rng)
		e, err := equation.Parse(src)
		if err != nil {
			if !strings.Contains(err.Error(), "appears") {
				t.Fatalf("Parse(%q): %v", src, err)
			}
			continue
		}
		parsed++
		e2 := reparse(t, src, e)
		for i, side := range [][2][]equation.Term{{e.Left, e2.Left}, {e.Right, e2.Right}} {
			if len(side[0]) != len(side[1]) {
				t.Fatalf("side %d of %q: %d terms, re-parsed %d", i, src, len(side[0]), len(side[1]))
			}
			for j, a := range side[0] {
				b := side[1][j]
				if a.Coef != b.Coef || strings.Join(strings.Fields(a.Name), " ") != b.Name ||
					strings.Join(strings.Fields(a.Compartment), " ") != b.Compartment {
					t.Fatalf("term %d of %q: %+v, re-parsed %+v", j, src, a, b)
				}
			}
		}
	}
	if parsed < n/2 {
		t.Fatalf("only %d of %d random equations parsed", parsed, n)
	}
}

// reparse parses the normal form of e, parsed from src, and checks that it
// prints as itself.
func reparse(t *testing.T, src string, e *equation.Equation) *equation.Equation {
	t.Helper()
	norm := e.String()
	e2, err := equation.Parse(norm)
	if err != nil {
		t.Fatalf("normal form %q of %q does not parse: %v", norm, src, err)
	}
	if got := e2.String(); got != norm {
		t.Fatalf("normal form %q of %q prints as %q", norm, src, got)
	}
	return e2
}
