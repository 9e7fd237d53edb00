package engine

import (
	"errors"
	"math"

	"gibbsheet/engine/internal/say"
	"gibbsheet/engine/thermo"
)

// Defaults of the worksheet's conditions (common practice for transformed thermodynamic tables: Alberty
// 2003 tabulates at pH 7, I = 0.25 M, 298.15 K).
const (
	DefaultPH            = 7.0
	DefaultIonicStrength = 0.25 // mol/L
	DefaultTemperature   = thermo.TRef
	DefaultConcentration = "1 mM"
)

// readConditions fills defaults, reports impossible values as field errors (ok false) and values outside the
// model's range as warnings.
func readConditions(in *Conditions) (c thermo.Conditions, warnings []Warning, errs []FieldError) {
	c = thermo.Conditions{PH: DefaultPH, IonicStrength: DefaultIonicStrength, PMg: math.Inf(1),
		Temperature: DefaultTemperature}
	if in != nil {
		set := func(dst *float64, src *float64) {
			if src != nil {
				*dst = *src
			}
		}
		set(&c.PH, in.PH)
		set(&c.IonicStrength, in.IonicStrength)
		set(&c.PMg, in.PMg)
		set(&c.Temperature, in.Temperature)
	}
	if err := c.Check(); err != nil {
		return c, nil, []FieldError{{Path: "conditions." + conditionField(err), Message: err.Error()}}
	}
	if c.IonicStrength > thermo.MaxIonicStrength {
		warnings = append(warnings, Warning{Code: "ionic-strength", Path: "conditions.ionicStrength",
			Message: say.Sprintf("ionic strength %g M is above %g M, where the extended Debye–Hückel "+
				"equation stops being reliable", c.IonicStrength, thermo.MaxIonicStrength)})
	}
	if c.PH < thermo.MinReliablePH || c.PH > thermo.MaxReliablePH {
		warnings = append(warnings, Warning{Code: "pH", Path: "conditions.pH",
			Message: say.Sprintf("pH %g is outside %g–%g, where the tabulated species and pKs are "+
				"reliable; forms that matter there may be missing", c.PH, thermo.MinReliablePH, thermo.MaxReliablePH)})
	}
	if c.Temperature < thermo.MinReliableTemperature || c.Temperature > thermo.MaxReliableTemperature {
		warnings = append(warnings, Warning{Code: "temperature", Path: "conditions.temperature",
			Message: say.Sprintf("temperature %.2f K is outside %.2f–%.2f K: ΔfH° is taken as constant and "+
				"heat capacities are ignored, so results are rougher", c.Temperature,
				thermo.MinReliableTemperature, thermo.MaxReliableTemperature)})
	}
	return c, warnings, nil
}

func conditionsUsed(c thermo.Conditions, band float64) ConditionsUsed {
	used := ConditionsUsed{PH: c.PH, IonicStrength: c.IonicStrength, Temperature: c.Temperature,
		RT: c.RT(), NearEquilibrium: band}
	if !math.IsInf(c.PMg, 1) {
		pMg := c.PMg
		used.PMg = &pMg
	}
	return used
}

// conditionField is the document field of a thermo.ConditionError ("pH", "ionicStrength", ...).
func conditionField(err error) string {
	var ce *thermo.ConditionError
	if errors.As(err, &ce) {
		return ce.Field
	}
	return "conditions"
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }
