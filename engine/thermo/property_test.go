package thermo

import (
	"math"
	"math/rand/v2"
	"testing"
)

// randomSpecies returns a reactant of 1 to 4 species with ΔfG° in a biochemical range.
func randomSpecies(r *rand.Rand) []Species {
	n := 1 + r.IntN(4)
	sp := make([]Species, n)
	base := -3000 + 3000*r.Float64()
	for i := range sp {
		sp[i] = Species{
			DfG0:   base - 40*float64(i)*r.Float64(),
			DfH0:   ptr(base * (1 + 0.3*r.Float64())),
			Charge: -4 + i + r.IntN(2),
			NH:     10 + i,
			NMg:    r.IntN(2) * r.IntN(2),
		}
	}
	return sp
}

func randomConditions(r *rand.Rand) Conditions {
	return Conditions{PH: 5 + 4*r.Float64(), IonicStrength: 0.35 * r.Float64(), PMg: 2 + 4*r.Float64(),
		Temperature: 273.15 + 50*r.Float64()}
}

// TestPHSlope: ∂ΔfG'°/∂pH = RT ln 10 · N̄H (Alberty 2003, §4.4, from memory).
func TestPHSlope(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	const h = 1e-4
	for range 200 {
		sp, c := randomSpecies(r), randomConditions(r)
		up, lo := c, c
		up.PH += h
		lo.PH -= h
		gu, _ := ReactantDfG0Prime(sp, up)
		gl, _ := ReactantDfG0Prime(sp, lo)
		slope := (gu - gl) / (2 * h)
		want := c.RT() * math.Ln10 * MeanBoundH(sp, c)
		if math.Abs(slope-want) > 1e-4*math.Max(1, math.Abs(want)) {
			t.Fatalf("%+v at %+v: slope %.6f, RT ln10 N̄H %.6f", sp, c, slope, want)
		}
	}
}

// TestGibbsHelmholtz: with ΔfH° constant, ΔfG°(T)/T is linear in 1/T with slope ΔfH°
// (Gibbs–Helmholtz equation, Alberty 2003, Ch. 4).
func TestGibbsHelmholtz(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	for range 100 {
		s := Species{DfG0: -2000 * r.Float64(), DfH0: ptr(-2000 * r.Float64())}
		g := func(T float64) float64 {
			return SpeciesDfG0Prime(s, Conditions{PH: 7, Temperature: T, PMg: math.Inf(1)})
		}
		T1, T2 := 275+20*r.Float64(), 300+20*r.Float64()
		slope := (g(T2)/T2 - g(T1)/T1) / (1/T2 - 1/T1)
		if math.Abs(slope-*s.DfH0) > 1e-6*math.Abs(*s.DfH0)+1e-6 {
			t.Fatalf("slope of ΔfG°/T vs 1/T = %v, want ΔfH° = %v", slope, *s.DfH0)
		}
		if got := g(TRef); math.Abs(got-s.DfG0) > 1e-9 {
			t.Fatalf("ΔfG°(298.15) = %v, want %v", got, s.DfG0)
		}
	}
	// Without ΔfH° the 298.15 K value is kept.
	s := Species{DfG0: -100}
	if got := SpeciesDfG0Prime(s, Conditions{PH: 7, Temperature: 310, PMg: math.Inf(1)}); got != -100 {
		t.Errorf("no ΔfH°: ΔfG°(310 K) = %v, want -100", got)
	}
}

// TestZeroIonicStrength: the Debye–Hückel term vanishes at I = 0 (Alberty 2003, §3.7).
func TestZeroIonicStrength(t *testing.T) {
	r := rand.New(rand.NewPCG(5, 6))
	for range 50 {
		T := 273.15 + 50*r.Float64()
		if d := DebyeHuckel(T, 0); d != 0 {
			t.Fatalf("DebyeHuckel(%v, 0) = %v", T, d)
		}
		s := Species{DfG0: -1000 * r.Float64(), Charge: -3}
		if got := SpeciesDfG0Prime(s, Conditions{PH: 0, Temperature: TRef, PMg: math.Inf(1)}); got != s.DfG0 {
			t.Fatalf("pH 0, I 0, 298.15 K: ΔfG'° = %v, want ΔfG° = %v", got, s.DfG0)
		}
	}
}

// TestLogSumExp: the stable sum equals −RT ln Σ exp(−ΔfG'_j°/RT) computed naively where that does not
// overflow, and stays finite where it would.
func TestLogSumExp(t *testing.T) {
	r := rand.New(rand.NewPCG(7, 8))
	for range 200 {
		c := randomConditions(r)
		sp := make([]Species, 1+r.IntN(4))
		for i := range sp {
			sp[i] = Species{DfG0: -30*r.Float64() - 40*float64(sp[i].NH), Charge: -r.IntN(4)}
		}
		naive := 0.0
		for _, s := range sp {
			naive += math.Exp(-SpeciesDfG0Prime(s, c) / c.RT())
		}
		want := -c.RT() * math.Log(naive)
		got, _ := ReactantDfG0Prime(sp, c)
		if math.Abs(got-want) > 1e-9*math.Max(1, math.Abs(want)) {
			t.Fatalf("stable %v, naive %v", got, want)
		}
	}
	c := Conditions{PH: 7, Temperature: TRef, PMg: math.Inf(1)}
	big := []Species{{DfG0: -5000}, {DfG0: -5000}}
	got, err := ReactantDfG0Prime(big, c)
	want := -5000 - c.RT()*math.Ln2
	if err != nil || math.Abs(got-want) > 1e-9 {
		t.Errorf("overflowing sum: %v, %v; want %v", got, err, want)
	}
}
