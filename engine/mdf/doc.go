// Package mdf computes the max-min driving force (MDF) of a pathway: the
// largest B such that every reaction has driving force −ΔrG' ≥ B for some
// concentrations within the given bounds (Noor et al., PLoS Comput Biol 2014).
// It solves that linear program with a bounded-variable revised simplex
// method whose basis kernel holds only the binding reactions.
package mdf
