package engine

import (
	"fmt"
	"maps"
	"slices"
	"strings"
)

// balanceTolerance is the largest element imbalance treated as zero; fractional coefficients (1/2 O2) sum
// exactly in binary only up to rounding.
const balanceTolerance = 1e-9

// balance checks a row's element balance. A biochemical equation at fixed pH (and pMg) conserves every
// element except hydrogen (Alberty 2003, §4.1), so H is not counted; every other element in the formulas is.
func (ev *evaluation) balance(nu []stoich, out *RowResult) {
	diff := map[string]float64{}
	var unknown []string
	for _, s := range nu {
		if s.r.formula == nil {
			unknown = append(unknown, s.r.name)
			continue
		}
		for el, n := range s.r.formula {
			if el != "H" {
				diff[el] += s.coef * float64(n)
			}
		}
	}
	if len(unknown) > 0 {
		out.Warnings = append(out.Warnings, Warning{Code: "balance-unchecked", Message: fmt.Sprintf(
			"element balance not checked: no formula for %s", strings.Join(unknown, ", "))})
		return
	}
	var parts []string
	for _, el := range slices.Sorted(maps.Keys(diff)) {
		d := diff[el]
		switch {
		case d > balanceTolerance:
			parts = append(parts, fmt.Sprintf("%s: %s more on the right", el, formatCount(d)))
		case d < -balanceTolerance:
			parts = append(parts, fmt.Sprintf("%s: %s more on the left", el, formatCount(-d)))
		}
	}
	if len(parts) > 0 {
		out.Warnings = append(out.Warnings, Warning{Code: "unbalanced",
			Message: "elements do not balance (" + strings.Join(parts, "; ") + ")"})
	}
}

func formatCount(x float64) string { return strings.TrimSuffix(fmt.Sprintf("%.4g", x), ".0") }
