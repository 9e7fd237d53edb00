package mdf

import (
	"math"
	"testing"
)

// TestDegenerate covers degenerate programs (ties, fixed compounds, shared
// compounds, empty and duplicated reactions). Expected MDFs are derived in
// the comments from the definition (Noor et al., PLoS Comput Biol 2014,
// eq. 7); where the dual is not unique only the certificate is checked.
func TestDegenerate(t *testing.T) {
	wide := func(n int) (lo, up []float64) {
		for range n {
			lo, up = append(lo, ln(1e-6)), append(up, ln(1e-2))
		}
		return lo, up
	}
	lo2, up2 := wide(2)
	lo3, up3 := wide(3)
	fixLo, fixUp := bounds(1e-3, 1e-3, 1e-5, 1e-5)
	u := ln(1e-2) - ln(1e-6) // largest ln(A/B) within the wide bounds
	tests := []struct {
		name string
		p    *Problem
		mdf  float64
	}{{
		// A reaction without compounds has F = −ΔrG'° = 1 whatever x is; the
		// A → B reaction alone reaches −5 + RT u ≈ 17.8 > 1, so MDF = 1.
		name: "reaction without compounds",
		p: &Problem{RT: rt298, Lower: lo2, Upper: up2,
			Reactions: []Reaction{rxn(5, 0, -1, 1, 1), {DG0: -1}}},
		mdf: 1,
	}, {
		// Only reactions without compounds: MDF = min_j −ΔrG'°_j = −3.
		name: "no compounds at all",
		p:    &Problem{RT: rt298, Reactions: []Reaction{{DG0: 3}, {DG0: -2}}},
		mdf:  -3,
	}, {
		// The same reaction three times: MDF as for one, −5 + RT u.
		name: "duplicated reactions",
		p: &Problem{RT: rt298, Lower: lo2, Upper: up2,
			Reactions: []Reaction{rxn(5, 0, -1, 1, 1), rxn(5, 0, -1, 1, 1), rxn(5, 0, -1, 1, 1)}},
		mdf: -5 + rt298*u,
	}, {
		// A → B and 2A → 2B share all compounds; with v = ln A − ln B both
		// forces −g1 + RT v and −g2 + 2RT v grow with v, so v = u and
		// MDF = min(−20 + RT u, 10 + 2RT u) = −20 + RT u ≈ 2.832.
		name: "reactions sharing all compounds",
		p: &Problem{RT: rt298, Lower: lo2, Upper: up2,
			Reactions: []Reaction{rxn(20, 0, -1, 1, 1), rxn(-10, 0, -2, 1, 2)}},
		mdf: math.Min(-20+rt298*u, 10+2*rt298*u),
	}, {
		// A → B and B → A with ΔrG'° = 4 and −4: the forces sum to zero, so
		// MDF ≤ 0, reached at v = ln A − ln B = 4/RT (within ±u): MDF = 0.
		name: "futile pair",
		p: &Problem{RT: rt298, Lower: lo2, Upper: up2,
			Reactions: []Reaction{rxn(4, 0, -1, 1, 1), rxn(-4, 1, -1, 0, 1)}},
		mdf: 0,
	}, {
		// Cycle A → B → C → A with ΔrG'° −10 each: forces sum to 30, and
		// equal forces 10 are reached at ln A − ln B = ln B − ln C = 0: MDF = 10.
		name: "cycle",
		p: &Problem{RT: rt298, Lower: lo3, Upper: up3,
			Reactions: []Reaction{rxn(-10, 0, -1, 1, 1), rxn(-10, 1, -1, 2, 1), rxn(-10, 2, -1, 0, 1)}},
		mdf: 10,
	}, {
		// All compounds fixed (A = 1 mM, B = 10 µM): forces are numbers,
		// F1 = −(2 + RT ln(1e-5/1e-3)) ≈ 9.416, F2 = −(−3 + RT ln(1e-3/1e-5))
		// ≈ −8.416, so MDF = F2.
		name: "all fixed",
		p: &Problem{RT: rt298, Lower: fixLo, Upper: fixUp,
			Reactions: []Reaction{rxn(2, 0, -1, 1, 1), rxn(-3, 1, -1, 0, 1)}},
		mdf: 3 - rt298*ln(1e-3/1e-5),
	}, {
		// Compound listed twice (−1 and −1 sum to −2) and a zero entry:
		// the same as 2A → B with ΔrG'° = 0, MDF = −RT(ln 1e-6 − 2 ln 1e-2).
		name: "repeated and zero coefficients",
		p: &Problem{RT: rt298, Lower: lo3, Upper: up3,
			Reactions: []Reaction{rxn(0, 0, -1, 1, 1, 0, -1, 2, 0)}},
		mdf: -rt298 * (ln(1e-6) - 2*ln(1e-2)),
	}, {
		// Many ties: four A → B reactions with equal ΔrG'°, two of them
		// with a cofactor C fixed at 1 M (ln c = 0, so it adds nothing):
		// every force is −1 + RT u.
		name: "ties",
		p: &Problem{RT: rt298, Lower: append(lo2, 0), Upper: append(up2, 0),
			Reactions: []Reaction{rxn(1, 0, -1, 1, 1), rxn(1, 1, 1, 0, -1), rxn(1, 0, -1, 1, 1, 2, 1),
				rxn(1, 0, -1, 1, 1, 2, -1)}},
		mdf: -1 + rt298*u,
	}}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			solveWant(t, tc.p, tc.mdf)
		})
	}
}

// TestRandomDegenerate checks the optimality certificate on seeded random
// networks made degenerate on purpose: integer ΔrG'°, shared bounds, many
// fixed compounds and duplicated reactions (invented data).
func TestRandomDegenerate(t *testing.T) {
	for seed := range uint64(300) {
		m := 5 + int(seed%40)
		p := randomNetwork(seed+7e6, m)
		for i := range p.Lower {
			switch i % 3 {
			case 0:
				p.Lower[i], p.Upper[i] = ln(1e-6), ln(1e-2)
			case 1:
				p.Lower[i] = p.Upper[i]
			}
		}
		for j := range p.Reactions {
			p.Reactions[j].DG0 = math.Round(p.Reactions[j].DG0 / 10)
		}
		p.Reactions = append(p.Reactions, p.Reactions[:m/3]...)
		sol, err := Solve(p)
		if err != nil {
			t.Fatalf("seed %d: %v", seed, err)
		}
		if err := checkSolution(p, sol); err != nil {
			t.Errorf("seed %d: %v", seed, err)
		}
	}
}
