package thermo

import (
	"errors"
	"math"
)

// Species holds the standard thermodynamic properties of one species at 298.15 K and I = 0.
type Species struct {
	DfG0   float64  `json:"dfG0"`           // ΔfG°, kJ/mol, 298.15 K, I = 0
	DfH0   *float64 `json:"dfH0,omitempty"` // ΔfH°, kJ/mol, 298.15 K, I = 0; nil when unknown
	Charge int      `json:"charge"`         // z
	NH     int      `json:"nH"`             // number of hydrogen atoms N_H (negative only for a species written on another basis, e.g. HCO3- − H2O)
	NMg    int      `json:"nMg,omitempty"`  // number of magnesium atoms N_Mg
}

// ErrNoSpecies is returned for a reactant without species.
var ErrNoSpecies = errors.New("thermo: reactant has no species")

// Reference data of the ions fixed by the conditions (Alberty 2003 / BasicBiochemData3,
// from memory). ΔfG°(H+) = ΔfH°(H+) = 0 at every temperature by convention.
const (
	MgDfG0   = -455.3 // ΔfG°(Mg2+), kJ/mol, 298.15 K, I = 0
	MgDfH0   = -467.0 // ΔfH°(Mg2+), kJ/mol, 298.15 K, I = 0
	MgCharge = 2
)

// RTAlpha returns RTα(T) in kJ/mol, the Debye–Hückel coefficient times RT:
//
//	RTα = 9.20483e-3 T − 1.28467e-5 T² + 4.95199e-8 T³   (T in K)
//
// Alberty 2003, §3.7 (from memory); 2.91482 kJ/mol at 298.15 K.
func RTAlpha(T float64) float64 {
	return 9.20483e-3*T - 1.28467e-5*T*T + 4.95199e-8*T*T*T
}

// DebyeHuckel returns the extended Debye–Hückel term in kJ/mol for unit charge,
//
//	RTα(T) √I / (1 + B √I),   I in mol/L, B = 1.6 kg^½ mol^-½
//
// (Alberty 2003, §3.7). A species of charge z has ΔfG°(I) = ΔfG°(0) − z²·DebyeHuckel(T, I).
func DebyeHuckel(T, I float64) float64 {
	s := math.Sqrt(I)
	return RTAlpha(T) * s / (1 + B*s)
}

// gibbsHelmholtz returns ΔfG°(T) in kJ/mol from 298.15 K data with ΔfH° constant (ΔCp° = 0):
//
//	ΔfG°(T) = (T/298.15) ΔfG°(298.15) + (1 − T/298.15) ΔfH°(298.15)
//
// (Alberty 2003, Ch. 4; integrated Gibbs–Helmholtz equation). Without ΔfH° the 298.15 K value
// is returned unchanged.
func gibbsHelmholtz(dfG0 float64, dfH0 *float64, T float64) float64 {
	if dfH0 == nil {
		return dfG0
	}
	r := T / TRef
	return r*dfG0 + (1-r)**dfH0
}

// SpeciesDfG0Prime returns the standard transformed Gibbs energy of formation ΔfG'°_j of a species in
// kJ/mol at c (Alberty 2003, Chs. 3 and 4):
//
//	ΔfG_j°(T,I) = ΔfG_j°(T) − RTα z_j² √I/(1+B√I)
//	ΔfG'_j°     = ΔfG_j°(T,I) − N_H(j)[ΔfG°(H+,T,I) + RT ln 10^−pH]
//	                          − N_Mg(j)[ΔfG°(Mg2+,T,I) + RT ln 10^−pMg]
//
// with ΔfG°(H+, T, 0) = 0 and ΔfG°(Mg2+) from MgDfG0, MgDfH0. ΔfG_j°(T) is the Gibbs–Helmholtz
// value (ΔfH° constant); a species without DfH0 keeps its 298.15 K ΔfG°. When c.PMg is +Inf, a species
// with magnesium is excluded from its reactant and SpeciesDfG0Prime returns +Inf for it.
func SpeciesDfG0Prime(s Species, c Conditions) float64 {
	T := c.Temperature
	rt := R * T
	dh := DebyeHuckel(T, c.IonicStrength)
	g := gibbsHelmholtz(s.DfG0, s.DfH0, T) - float64(s.Charge*s.Charge)*dh
	if s.NH != 0 {
		muH := -dh - rt*math.Ln10*c.PH // ΔfG°(H+,T,I) + RT ln 10^−pH
		g -= float64(s.NH) * muH
	}
	if s.NMg != 0 {
		if math.IsInf(c.PMg, 1) {
			return math.Inf(1)
		}
		h := MgDfH0
		muMg := gibbsHelmholtz(MgDfG0, &h, T) - MgCharge*MgCharge*dh - rt*math.Ln10*c.PMg
		g -= float64(s.NMg) * muMg
	}
	return g
}

// speciesTerms returns ΔfG'_j° of every species and the smallest finite one.
func speciesTerms(sp []Species, c Conditions) ([]float64, float64) {
	g := make([]float64, len(sp))
	min := math.Inf(1)
	for i, s := range sp {
		g[i] = SpeciesDfG0Prime(s, c)
		min = math.Min(min, g[i])
	}
	return g, min
}

// ReactantDfG0Prime returns the standard transformed Gibbs energy of formation of a reactant (a sum of
// species in equilibrium at c) in kJ/mol (Alberty 2003, Ch. 4):
//
//	ΔfG'° = −RT ln Σ_j exp(−ΔfG'_j°/RT)
//
// evaluated as log-sum-exp about the smallest ΔfG'_j° so that no term overflows. Species with
// magnesium are left out when c.PMg is +Inf. The error is ErrNoSpecies when sp is empty or no species
// remains. Conditions are not checked (see Conditions.Check).
func ReactantDfG0Prime(sp []Species, c Conditions) (float64, error) {
	g, min := speciesTerms(sp, c)
	if math.IsInf(min, 1) {
		return math.NaN(), ErrNoSpecies
	}
	rt := c.RT()
	sum := 0.0
	for _, x := range g {
		sum += math.Exp(-(x - min) / rt)
	}
	return min - rt*math.Log(sum), nil
}

// fractions returns the equilibrium mole fractions p_j = exp(−(ΔfG'_j° − ΔfG'°)/RT) of the species
// (Alberty 2003, Ch. 4), nil when no species remains.
func fractions(sp []Species, c Conditions) []float64 {
	g, min := speciesTerms(sp, c)
	if math.IsInf(min, 1) {
		return nil
	}
	rt := c.RT()
	sum := 0.0
	for i, x := range g {
		g[i] = math.Exp(-(x - min) / rt)
		sum += g[i]
	}
	for i := range g {
		g[i] /= sum
	}
	return g
}

// MeanBoundH returns the average number of hydrogen atoms N̄H = Σ_j p_j N_H(j) of a reactant at c,
// with p_j the equilibrium mole fractions; ∂ΔfG'°/∂pH = RT ln 10 · N̄H (Alberty 2003, Ch. 4).
// It is NaN when no species remains.
func MeanBoundH(sp []Species, c Conditions) float64 {
	return mean(sp, c, func(s Species) int { return s.NH })
}

// MeanBoundMg returns the average number of magnesium ions N̄Mg = Σ_j p_j N_Mg(j) of a reactant at c;
// 0 when c.PMg is +Inf, NaN when no species remains.
func MeanBoundMg(sp []Species, c Conditions) float64 {
	return mean(sp, c, func(s Species) int { return s.NMg })
}

func mean(sp []Species, c Conditions, n func(Species) int) float64 {
	p := fractions(sp, c)
	if p == nil {
		return math.NaN()
	}
	m := 0.0
	for i, s := range sp {
		m += p[i] * float64(n(s))
	}
	return m
}
