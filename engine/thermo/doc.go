// Package thermo holds physical constants and Alberty's transformed Gibbs energies of formation:
// species data at 298.15 K and zero ionic strength are carried to a temperature, ionic strength, pH
// and pMg, and the species of a reactant are combined into one reactant at those conditions.
// Source throughout: R. A. Alberty, Thermodynamics of Biochemical Reactions (Wiley, 2003).
package thermo
