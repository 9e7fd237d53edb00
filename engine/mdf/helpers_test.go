package mdf

import (
	"fmt"
	"math"
	"math/rand/v2"
)

// rt298 is RT at 298.15 K in kJ/mol: R = 8.314462618e-3 kJ/(mol·K) (CODATA
// 2018 exact value) times 298.15 K.
const rt298 = 8.314462618e-3 * 298.15

// checkTol is the tolerance of the property checks, in kJ/mol or ln units.
const checkTol = 1e-6

// randomNetwork returns a seeded random problem with m reactions in the
// spirit of a pathway (invented data): about m+1 compounds, each reaction
// with 2–4 compounds drawn near its position in the chain, coefficients in
// {±1, ±2}, ΔrG'° uniform in ±40 kJ/mol, bounds within 1 µM–10 mM, and about
// one compound in eight fixed.
func randomNetwork(seed uint64, m int) *Problem {
	rng := rand.New(rand.NewPCG(seed, 0x6d6466))
	n := m + 1
	p := &Problem{RT: rt298, Lower: make([]float64, n), Upper: make([]float64, n)}
	lo, up := math.Log(1e-6), math.Log(1e-2)
	for i := range n {
		a := lo + (up-lo)*rng.Float64()
		b := lo + (up-lo)*rng.Float64()
		if rng.IntN(8) == 0 {
			b = a
		}
		p.Lower[i], p.Upper[i] = min(a, b), max(a, b)
	}
	for j := range m {
		k := 2 + rng.IntN(3)
		r := Reaction{DG0: -40 + 80*rng.Float64()}
		seen := map[int]bool{}
		for len(r.Compound) < k {
			c := j + rng.IntN(5) - 2
			if rng.IntN(4) == 0 {
				c = rng.IntN(n)
			}
			if c < 0 || c >= n || seen[c] {
				continue
			}
			seen[c] = true
			v := float64(1 + rng.IntN(2))
			if len(r.Compound)%2 == 0 {
				v = -v
			}
			r.Compound = append(r.Compound, c)
			r.Coef = append(r.Coef, v)
		}
		p.Reactions = append(p.Reactions, r)
	}
	return p
}

// dualObjective returns the Lagrangian dual of the MDF LP at reaction duals
// λ (λ ≥ 0, Σλ = 1):
//
//	D(λ) = Σ_j λ_j (−ΔrG'°_j) + Σ_i max(−a_i L_i, −a_i U_i),  a_i = RT Σ_j λ_j S_ij,
//
// which bounds the MDF from above and equals it at the dual optimum (LP
// duality; derivation: maximise B + Σ_j λ_j(b_j − Σ_i A_ji x_i − B) over B
// free and x in the box).
func dualObjective(p *Problem, lambda []float64) float64 {
	a := make([]float64, len(p.Lower))
	d := 0.0
	for j, r := range p.Reactions {
		d -= lambda[j] * r.DG0
		for k, c := range r.Compound {
			a[c] += p.RT * r.Coef[k] * lambda[j]
		}
	}
	for i, ai := range a {
		d += max(-ai*p.Lower[i], -ai*p.Upper[i])
	}
	return d
}

// checkSolution verifies the optimality certificate of sol: concentrations
// within bounds, every driving force ≥ MDF and one equal to it, duals
// nonnegative summing to 1, complementary slackness, and dual objective
// equal to the MDF. It returns a description of the first violation.
func checkSolution(p *Problem, sol *Solution) error {
	for i, x := range sol.LnConc {
		if x < p.Lower[i]-checkTol || x > p.Upper[i]+checkTol {
			return fmt.Errorf("compound %d: ln c = %g outside [%g, %g]", i, x, p.Lower[i], p.Upper[i])
		}
	}
	df := DrivingForces(p, sol.LnConc)
	least := math.Inf(1)
	for j, f := range df {
		if f < sol.MDF-checkTol {
			return fmt.Errorf("reaction %d: driving force %g below MDF %g", j, f, sol.MDF)
		}
		if math.Abs(f-sol.DrivingForce[j]) > checkTol {
			return fmt.Errorf("reaction %d: reported driving force %g, recomputed %g", j, sol.DrivingForce[j], f)
		}
		least = min(least, f)
	}
	if math.Abs(least-sol.MDF) > checkTol {
		return fmt.Errorf("MDF %g but least driving force %g", sol.MDF, least)
	}
	sum := 0.0
	for j, l := range sol.Shadow {
		if l < -checkTol {
			return fmt.Errorf("reaction %d: negative dual %g", j, l)
		}
		if l > checkTol && df[j]-sol.MDF > checkTol {
			return fmt.Errorf("reaction %d: dual %g but slack %g", j, l, df[j]-sol.MDF)
		}
		if sol.Bottleneck[j] != (l > dualTol) {
			return fmt.Errorf("reaction %d: Bottleneck %v with dual %g", j, sol.Bottleneck[j], l)
		}
		sum += l
	}
	if math.Abs(sum-1) > checkTol {
		return fmt.Errorf("duals sum to %g, want 1", sum)
	}
	if d := dualObjective(p, sol.Shadow); math.Abs(d-sol.MDF) > checkTol {
		return fmt.Errorf("dual objective %g ≠ MDF %g", d, sol.MDF)
	}
	for i := range sol.LnConc {
		if sol.LowerBinding[i] && sol.LnConc[i] != p.Lower[i] || sol.UpperBinding[i] && sol.LnConc[i] != p.Upper[i] {
			return fmt.Errorf("compound %d: marked binding but not at that bound", i)
		}
	}
	return nil
}

// chainNetwork returns a seeded linear pathway X0 → X1 → … → Xm with
// cofactor pairs (invented data): ends fixed at 1 mM and 1 µM, intermediates
// in 1 µM–10 mM, every third reaction coupled to ATP → ADP (both bounded) and
// ΔrG'° uniform in [−15, 10] kJ/mol, so many reactions share the MDF and the
// basis kernel grows large, the hard case for the solver.
func chainNetwork(seed uint64, m int) *Problem {
	rng := rand.New(rand.NewPCG(seed, 0x636861))
	n := m + 3 // X0..Xm, ATP, ADP
	atp, adp := m+1, m+2
	p := &Problem{RT: rt298, Lower: make([]float64, n), Upper: make([]float64, n)}
	for i := range n {
		p.Lower[i], p.Upper[i] = math.Log(1e-6), math.Log(1e-2)
	}
	p.Lower[0], p.Upper[0] = math.Log(1e-3), math.Log(1e-3)
	p.Lower[m], p.Upper[m] = math.Log(1e-6), math.Log(1e-6)
	p.Lower[atp], p.Upper[atp] = math.Log(1e-3), math.Log(5e-3)
	p.Lower[adp], p.Upper[adp] = math.Log(1e-4), math.Log(1e-3)
	for j := range m {
		r := rxn(-15+25*rng.Float64(), float64(j), -1, float64(j+1), 1)
		if j%3 == 2 {
			r.Compound = append(r.Compound, atp, adp)
			r.Coef = append(r.Coef, -1, 1)
		}
		p.Reactions = append(p.Reactions, r)
	}
	return p
}
