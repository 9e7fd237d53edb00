package thermo

import (
	"math"

	"gibbsheet/engine/internal/say"
)

// Physical constants (CODATA 2018) and Alberty's reference values.
const (
	// R is the molar gas constant in kJ mol⁻¹ K⁻¹ (CODATA 2018: 8.314462618 J mol⁻¹ K⁻¹).
	R = 8.314462618e-3
	// Faraday is the Faraday constant in kJ mol⁻¹ V⁻¹ (CODATA 2018: 96485.33212 C/mol).
	Faraday = 96.48533212
	// TRef is the reference temperature of the species data, in K.
	TRef = 298.15
	// B is the constant of the extended Debye–Hückel equation as Alberty uses it, in kg^½ mol^-½
	// (Alberty 2003, §3.7).
	B = 1.6
)

// Limits of the model. Conditions outside them are possible but the data or the activity model
// are no longer trustworthy there; the engine warns, thermo does not.
const (
	// MaxIonicStrength is the largest ionic strength, in mol/L, for which the extended Debye–Hückel
	// equation with B = 1.6 kg^½ mol^-½ is used (Alberty 2003, §3.7, from memory).
	MaxIonicStrength = 0.35
	// MinReliablePH and MaxReliablePH bound the pH range for which the tabulated species, and so their
	// pKs, describe a reactant (Alberty 2003, from memory: the tables are meant for pH 5 to 9); outside
	// it species that are not tabulated become important.
	MinReliablePH = 5.0
	MaxReliablePH = 9.0
	// MinReliableTemperature and MaxReliableTemperature (K) bound the band, 0 to 50 °C, in which the
	// Gibbs–Helmholtz extrapolation with constant ΔfH° (ΔCp° = 0) from 298.15 K and the RTα polynomial
	// are trusted (a band chosen here for aqueous biochemistry, common practice, no source).
	MinReliableTemperature = 273.15
	MaxReliableTemperature = 323.15
)

// Conditions are the intensive variables held fixed in a biochemical reaction system.
type Conditions struct {
	PH            float64 // −log10 a(H+), 0..14
	IonicStrength float64 // I in mol/L (taken equal to molality), ≥ 0
	PMg           float64 // −log10 [Mg2+]; math.Inf(1) means magnesium binding is ignored
	Temperature   float64 // K, > 0
}

// RT returns R·T in kJ/mol.
func (c Conditions) RT() float64 { return R * c.Temperature }

// A ConditionError reports a physically impossible condition; Field names it
// ("pH", "ionicStrength", "pMg", "temperature").
type ConditionError struct {
	Field string
	Msg   string
}

func (e *ConditionError) Error() string { return e.Field + ": " + e.Msg }

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// Check returns a *ConditionError for the first impossible condition: temperature not finite or
// ≤ 0 K, ionic strength not finite or negative, pH not in [0, 14], pMg NaN, −Inf or negative.
// It does not judge whether the model is valid there (see MaxIonicStrength and the other limits).
func (c Conditions) Check() error {
	switch {
	case !finite(c.Temperature) || c.Temperature <= 0:
		return &ConditionError{"temperature", say.Sprintf("%v K is not a temperature above absolute zero", c.Temperature)}
	case !finite(c.IonicStrength) || c.IonicStrength < 0:
		return &ConditionError{"ionicStrength", say.Sprintf("%v M: ionic strength must be a finite number ≥ 0", c.IonicStrength)}
	case !finite(c.PH) || c.PH < 0 || c.PH > 14:
		return &ConditionError{"pH", say.Sprintf("%v is outside 0 to 14", c.PH)}
	case math.IsNaN(c.PMg) || c.PMg < 0:
		return &ConditionError{"pMg", say.Sprintf("%v: pMg must be ≥ 0 (or infinite to ignore magnesium)", c.PMg)}
	}
	return nil
}
