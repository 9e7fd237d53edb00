package engine

import (
	"math"

	"gibbsheet/engine/internal/say"
)

// Default concentration bounds of the max-min driving force, mol/L: 1 µM to 10 mM, the physiological range
// usual in pathway analysis (common practice; the range Noor et al. 2014 use).
const (
	DefaultLowerBound = "1 uM"
	DefaultUpperBound = "10 mM"
)

// bound is a concentration range in mol/L.
type bound struct{ low, high float64 }

// readBounds parses the worksheet's bounds into ranges by reactant key; wrong entries are field errors and
// fall back to the default range.
func (ev *evaluation) readBounds() {
	ev.bounds = boundTable{def: bound{1e-6, 1e-2}, byKey: map[string]bound{}}
	b := ev.ws.Bounds
	if b == nil {
		return
	}
	if b.Default != nil {
		if r, ok := ev.parseBound("bounds.default", b.Default); ok {
			ev.bounds.def = r
		}
	}
	for _, name := range sortedKeys(b.Compounds) {
		path := "bounds.compounds." + name
		r, why := ev.resolveName(name)
		if r == nil {
			ev.fieldError(path, why)
			continue
		}
		if r.isWater() || r.isProton() {
			ev.warn(Warning{Code: "fixed-concentration", Path: path,
				Message: "water and H+ are fixed (activity 1, and the pH); their bounds are ignored"})
			continue
		}
		if rng, ok := ev.parseBound(path, b.Compounds[name]); ok {
			ev.bounds.byKey[r.key] = rng
		}
	}
}

// boundTable holds the worksheet's bounds: a default range and ranges by reactant key.
type boundTable struct {
	def   bound
	byKey map[string]bound
}

// boundOf is the range the max-min driving force may choose the reactant's concentration from.
func (ev *evaluation) boundOf(r *reactant) bound {
	if b, ok := ev.bounds.byKey[r.key]; ok {
		return b
	}
	return ev.bounds.def
}

func (ev *evaluation) parseBound(path string, pair []string) (bound, bool) {
	if len(pair) != 2 {
		ev.fieldError(path, say.Sprintf(`a bound is a pair ["low", "high"], e.g. ["1 uM", "10 mM"]; found %d value(s)`, len(pair)))
		return bound{}, false
	}
	var r bound
	for i, dst := range []*float64{&r.low, &r.high} {
		v, err := ParseConcentration(pair[i])
		if err != nil {
			ev.fieldError(say.Sprintf("%s[%d]", path, i), err.Error())
			return bound{}, false
		}
		*dst = v
	}
	if r.low > r.high {
		ev.fieldError(path, say.Sprintf("the low bound %s is above the high bound %s", pair[0], pair[1]))
		return bound{}, false
	}
	return r, true
}

func (b bound) ln() (float64, float64) { return math.Log(b.low), math.Log(b.high) }
