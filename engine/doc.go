// Package engine evaluates a Gibbsheet worksheet: reaction rows plus conditions and concentrations in,
// each row's transformed Gibbs energies, mass-action ratio, status and energy cost out, with the pathway's
// net reaction and budget. It is pure Go and the single entry point that the page and the edge service call
// (EvaluateJSON); the parsing, the compound data and the physical chemistry live in its sub-packages.
package engine
