package engine

import (
	"slices"
	"strings"

	"gibbsheet/engine/compounds"
	"gibbsheet/engine/internal/say"
)

// balanceTolerance is the largest element imbalance treated as zero; fractional coefficients (1/2 O2) sum
// exactly in binary only up to rounding.
const balanceTolerance = 1e-9

// elementCount is one element of a formula with its count.
type elementCount struct {
	element string
	n       float64
}

// heavyElements lists a formula's elements other than hydrogen, sorted: a biochemical equation at fixed pH
// (and pMg) conserves every element except hydrogen (Alberty 2003, §4.1), so H is never counted.
func heavyElements(f compounds.Formula) []elementCount {
	out := make([]elementCount, 0, len(f))
	for el, n := range f {
		if el != "H" {
			out = append(out, elementCount{el, float64(n)})
		}
	}
	slices.SortFunc(out, func(a, b elementCount) int { return strings.Compare(a.element, b.element) })
	return out
}

// balance checks a row's element balance and warns, naming each element and the side that has more.
func (ev *evaluation) balance(nu []stoich, out *RowResult) {
	var diff []elementCount // sorted by element
	var unknown []string
	for _, s := range nu {
		if s.r.formula == nil {
			if !s.r.isProton() {
				unknown = append(unknown, s.r.name)
			}
			continue
		}
		for _, e := range s.r.formula {
			i, found := slices.BinarySearchFunc(diff, e.element, func(a elementCount, el string) int {
				return strings.Compare(a.element, el)
			})
			if !found {
				diff = slices.Insert(diff, i, elementCount{element: e.element})
			}
			diff[i].n += s.coef * e.n
		}
	}
	if len(unknown) > 0 {
		out.Warnings = append(out.Warnings, Warning{Code: "balance-unchecked", Message: say.Sprintf(
			"element balance not checked: no formula for %s", strings.Join(unknown, ", "))})
		return
	}
	var parts []string
	for _, d := range diff {
		switch {
		case d.n > balanceTolerance:
			parts = append(parts, say.Sprintf("%s: %s more on the right", d.element, formatCount(d.n)))
		case d.n < -balanceTolerance:
			parts = append(parts, say.Sprintf("%s: %s more on the left", d.element, formatCount(-d.n)))
		}
	}
	if len(parts) > 0 {
		out.Warnings = append(out.Warnings, Warning{Code: "unbalanced",
			Message: "elements do not balance (" + strings.Join(parts, "; ") + ")"})
	}
}

func formatCount(x float64) string { return strings.TrimSuffix(say.Sprintf("%.4g", x), ".0") }
