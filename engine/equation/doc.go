// Package equation parses reaction equations such as
// "ATP + D-glucose = ADP + D-glucose 6-phosphate" into terms with exact
// rational coefficients and optional compartment tags. Parse reports every
// error of the text at once, each with the exact byte span to underline, and
// every parsed value prints its normal form with String.
package equation
