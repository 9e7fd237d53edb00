package thermo

import "math"

// MeanCharge returns the average charge z̄ = Σ_j p_j z_j of a reactant at c, with p_j the equilibrium mole
// fractions (Alberty 2003, Ch. 4). It is NaN when no species remains.
func MeanCharge(sp []Species, c Conditions) float64 {
	return mean(sp, c, func(s Species) int { return s.Charge })
}

// ProtonPotential returns the chemical potential of the hydrogen ion in a compartment at c, in kJ/mol,
// on the scale that the Legendre transform of SpeciesDfG0Prime uses:
//
//	μ(H+) = ΔfG°(H+, T, I) + RT ln 10^−pH = −RTα z²√I/(1+B√I) − RT ln 10 · pH   (z = 1)
func ProtonPotential(c Conditions) float64 {
	return -DebyeHuckel(c.Temperature, c.IonicStrength) - c.RT()*math.Ln10*c.PH
}

// TransportWork returns, in kJ/mol, what moving one mole of a reactant from compartment a to compartment b
// adds to ΔfG'°(b) − ΔfG'°(a). The reactant crosses as the species mixture of the compartment it leaves,
// carrying N̄H(a) hydrogen atoms and the charge z̄(a), and re-equilibrates with b's buffer on arrival:
//
//	W = N̄H(a)·[μ(H+, b) − μ(H+, a)] + F·z̄(a)·(ψb − ψa)
//
// with ψ in volts and F in kJ mol⁻¹ V⁻¹. This is the treatment of transport in transformed thermodynamics
// by Jol, Kümmel, Hoppe and Heinemann (Biophys J 99, 3139–3144, 2010; from memory), with the convention
// stated above for which species crosses. For H+ itself (N̄H = 1, z = 1, ΔfG'° = 0) it gives the
// proton-motive work RT ln 10 (pHa − pHb) + F(ψb − ψa) per proton when both sides have the same ionic
// strength.
func TransportWork(meanH, meanCharge float64, a, b Conditions, psiA, psiB float64) float64 {
	return meanH*(ProtonPotential(b)-ProtonPotential(a)) + Faraday*meanCharge*(psiB-psiA)
}
