// Package compounds is Gibbsheet's built-in library of biochemical reactants: species data in
// Alberty's form (ΔfG°, ΔfH°, charge, N_H, N_Mg at 298.15 K and I = 0) with their sources, molecular
// formulas, and lookup of the names biochemists type. The data are compiled in, generated from
// data/compounds.json by go generate.
//
// Conventions, as in Alberty's tables: ΔfG° = ΔfH° = 0 for H+, for oxidized NAD and FAD and for CoA,
// whose moiety also carries no charge, so only reactions that conserve these groups are meaningful.
// CO2 is total CO2 written on the CO2 basis (the HCO3- and CO3 2- species minus one H2O), so reactions
// are written with CO2 as in textbooks. Nucleotides without published species data use the adenine
// nucleotides' data (see each compound's Approximation). Entries derived from a published ΔrG'°, E°' or
// equilibrium ratio name it in Source.
package compounds
