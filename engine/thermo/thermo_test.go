package thermo

import (
	"errors"
	"math"
	"testing"
)

func ptr(x float64) *float64 { return &x }

// Species data from Alberty 2003 / BasicBiochemData3 (from memory), used here only to check the
// transforms; the library's data live in package compounds.
var (
	water = []Species{{DfG0: -237.19, DfH0: ptr(-285.83), Charge: 0, NH: 2}}
	atp   = []Species{
		{DfG0: -2768.1, DfH0: ptr(-3619.21), Charge: -4, NH: 12},
		{DfG0: -2811.48, DfH0: ptr(-3612.91), Charge: -3, NH: 13},
		{DfG0: -2838.18, DfH0: ptr(-3627.91), Charge: -2, NH: 14},
		{DfG0: -3258.68, Charge: -2, NH: 12, NMg: 1},
	}
)

// tabulatedTol is the tolerance, kJ/mol, for transformed values that Alberty tabulates to 0.01 kJ/mol:
// his values were computed with the same equations, so only rounding of the inputs remains.
const tabulatedTol = 0.02

// rtAlphaTol is the tolerance, kJ/mol, for the RTα polynomial against Alberty's value at 298.15 K. The
// polynomial is a fit over 0–40 °C; evaluated it gives 2.91489, 7e-5 kJ/mol (0.002 %) above the value
// Alberty uses in his tables, which moves a ΔfG'° by at most 3e-4 kJ/mol (z = −4, I = 0.25 M).
const rtAlphaTol = 1e-4

func TestRTAlpha(t *testing.T) {
	// Alberty 2003, §3.7 (from memory): RTα = 2.91482 kJ/mol at 298.15 K.
	if got := RTAlpha(298.15); math.Abs(got-2.91482) > rtAlphaTol {
		t.Errorf("RTAlpha(298.15) = %.6f, want 2.91482", got)
	}
}

func TestReactantAlberty(t *testing.T) {
	// Alberty 2003, table of ΔfG'° at 298.15 K, pH 7, I = 0.25 M (from memory).
	c := Conditions{PH: 7, IonicStrength: 0.25, PMg: math.Inf(1), Temperature: 298.15}
	for _, tc := range []struct {
		name string
		sp   []Species
		want float64
	}{
		{"H2O", water, -155.66},
		{"ATP", atp, -2292.50},
	} {
		got, err := ReactantDfG0Prime(tc.sp, c)
		if err != nil || math.Abs(got-tc.want) > tabulatedTol {
			t.Errorf("%s: ΔfG'° = %.3f, %v; want %.2f", tc.name, got, err, tc.want)
		}
	}
}

func TestCheck(t *testing.T) {
	ok := Conditions{PH: 7, IonicStrength: 0.25, PMg: 3, Temperature: 298.15}
	if err := ok.Check(); err != nil {
		t.Fatalf("Check(%+v) = %v", ok, err)
	}
	noMg := ok
	noMg.PMg = math.Inf(1)
	if err := noMg.Check(); err != nil {
		t.Fatalf("pMg = +Inf: %v", err)
	}
	nan := math.NaN()
	for _, tc := range []struct {
		field string
		mod   func(*Conditions)
	}{
		{"temperature", func(c *Conditions) { c.Temperature = 0 }},
		{"temperature", func(c *Conditions) { c.Temperature = -5 }},
		{"temperature", func(c *Conditions) { c.Temperature = nan }},
		{"temperature", func(c *Conditions) { c.Temperature = math.Inf(1) }},
		{"ionicStrength", func(c *Conditions) { c.IonicStrength = -0.1 }},
		{"ionicStrength", func(c *Conditions) { c.IonicStrength = nan }},
		{"pH", func(c *Conditions) { c.PH = 14.5 }},
		{"pH", func(c *Conditions) { c.PH = -1 }},
		{"pH", func(c *Conditions) { c.PH = nan }},
		{"pMg", func(c *Conditions) { c.PMg = -1 }},
		{"pMg", func(c *Conditions) { c.PMg = nan }},
		{"pMg", func(c *Conditions) { c.PMg = math.Inf(-1) }},
	} {
		c := ok
		tc.mod(&c)
		var ce *ConditionError
		if err := c.Check(); !errors.As(err, &ce) || ce.Field != tc.field || ce.Msg == "" {
			t.Errorf("Check(%+v) = %v, want a ConditionError for %s", c, err, tc.field)
		}
	}
}

func TestNoSpecies(t *testing.T) {
	c := Conditions{PH: 7, IonicStrength: 0, PMg: math.Inf(1), Temperature: 298.15}
	if _, err := ReactantDfG0Prime(nil, c); !errors.Is(err, ErrNoSpecies) {
		t.Errorf("no species: err = %v, want ErrNoSpecies", err)
	}
	onlyMg := []Species{{DfG0: -10, NMg: 1}}
	if _, err := ReactantDfG0Prime(onlyMg, c); !errors.Is(err, ErrNoSpecies) {
		t.Errorf("only Mg species with pMg = +Inf: err = %v, want ErrNoSpecies", err)
	}
	if m := MeanBoundH(nil, c); !math.IsNaN(m) {
		t.Errorf("MeanBoundH(nil) = %v, want NaN", m)
	}
}

// TestMgIgnored: with pMg = +Inf the Mg species contribute nothing, so ATP with and without its Mg
// species agree; at pMg 3 the Mg species lower ΔfG'° (binding is favourable).
func TestMgIgnored(t *testing.T) {
	c := Conditions{PH: 7, IonicStrength: 0.25, PMg: math.Inf(1), Temperature: 298.15}
	with, _ := ReactantDfG0Prime(atp, c)
	without, _ := ReactantDfG0Prime(atp[:3], c)
	if with != without {
		t.Errorf("pMg=+Inf: with Mg species %v, without %v", with, without)
	}
	if m := MeanBoundMg(atp, c); m != 0 {
		t.Errorf("MeanBoundMg at pMg=+Inf = %v", m)
	}
	c.PMg = 3
	mg, _ := ReactantDfG0Prime(atp, c)
	if !(mg < without) {
		t.Errorf("pMg 3: %v not below %v", mg, without)
	}
	if m := MeanBoundMg(atp, c); !(m > 0.5 && m < 1) {
		t.Errorf("MeanBoundMg at pMg 3 = %v, want most ATP bound to Mg (Alberty 2003, Ch. 8)", m)
	}
}
