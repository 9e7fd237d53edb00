package engine

import (
	"strconv"
	"strings"

	"gibbsheet/engine/internal/say"
)

// concentrationUnits maps the units a user may type to their factor to mol/L. The micro prefix is accepted
// as "u", as the micro sign U+00B5 and as the Greek letter mu U+03BC, since keyboards produce all three.
var concentrationUnits = map[string]float64{
	"M": 1, "mol/L": 1, "mol/l": 1,
	"mM": 1e-3, "mmol/L": 1e-3, "mmol/l": 1e-3,
	"uM": 1e-6, "µM": 1e-6, "μM": 1e-6, "umol/L": 1e-6, "µmol/L": 1e-6, "μmol/L": 1e-6,
	"nM": 1e-9, "nmol/L": 1e-9,
	"pM": 1e-12, "pmol/L": 1e-12,
}

// maxConcentration is the largest concentration accepted, in mol/L. Nothing dissolved in a cell comes near
// it (water itself is 55 M and takes no concentration); larger values are typing mistakes.
const maxConcentration = 20.0

// ParseConcentration reads a concentration such as "3 mM", "50 uM", "50 µM", "2 nM", "0.1 M" or "2.5e-3 M"
// and returns it in mol/L. A unit is required: a bare number is ambiguous between M and mM.
func ParseConcentration(s string) (float64, error) {
	text := strings.TrimSpace(s)
	if text == "" {
		return 0, say.Errorf(`empty concentration: write a number and a unit, e.g. "2 mM"`)
	}
	split := strings.IndexFunc(text, func(r rune) bool {
		return !(r >= '0' && r <= '9' || r == '.' || r == 'e' || r == 'E' || r == '+' || r == '-')
	})
	// An exponent marker directly followed by a unit letter ("2e" + "M") is not an exponent.
	for split > 0 && (text[split-1] == 'e' || text[split-1] == 'E') {
		split--
	}
	if split < 0 {
		return 0, say.Errorf("%q has no unit: write it with one, e.g. %q or %q", text, text+" mM", text+" µM")
	}
	number, unit := strings.TrimSpace(text[:split]), strings.TrimSpace(text[split:])
	if number == "" {
		return 0, say.Errorf("%q does not start with a number: write e.g. \"2 mM\"", text)
	}
	v, err := strconv.ParseFloat(number, 64)
	if err != nil {
		return 0, say.Errorf("%q is not a number", number)
	}
	factor, ok := concentrationUnits[unit]
	if !ok {
		return 0, say.Errorf("unknown unit %q: use M, mM, µM (or uM), nM or pM", unit)
	}
	c := v * factor
	switch {
	case !(c > 0):
		return 0, say.Errorf("concentration %q must be greater than zero", text)
	case c > maxConcentration:
		return 0, say.Errorf("concentration %q is above %g M, which no solute reaches", text, maxConcentration)
	}
	return c, nil
}
