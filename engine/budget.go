package engine

import (
	"maps"
	"strings"

	"gibbsheet/engine/internal/say"
)

// defaultValues are the energy values of the currency compounds, keyed by library id. They are common
// practice with no single source: a nucleoside triphosphate holds two phosphoanhydride bonds (2 ATP
// equivalents), a diphosphate one, a monophosphate none; PPi is taken as 0 because cells hydrolyse it with
// pyrophosphatase; NAD(P)H, FADH2 and ubiquinol carry one pair of electrons each, worth 2.5 ATP (NADH,
// NADPH) and 1.5 ATP (FADH2, ubiquinol) through oxidative phosphorylation (the P/O ratios now usual in
// textbooks, e.g. Berg, Tymoczko & Stryer, Biochemistry; from memory).
var defaultValues = map[string]ValueUsed{
	"ATP": {Phosphate: 2}, "ADP": {Phosphate: 1}, "AMP": {Phosphate: 0},
	"GTP": {Phosphate: 2}, "GDP": {Phosphate: 1}, "GMP": {Phosphate: 0},
	"UTP": {Phosphate: 2}, "UDP": {Phosphate: 1}, "UMP": {Phosphate: 0},
	"CTP": {Phosphate: 2}, "CDP": {Phosphate: 1}, "CMP": {Phosphate: 0},
	"ITP": {Phosphate: 2}, "IDP": {Phosphate: 1}, "IMP": {Phosphate: 0},
	"PPi":  {Phosphate: 0},
	"NADH": {Reducing: 1, PO: 2.5}, "NADPH": {Reducing: 1, PO: 2.5},
	"FADH2": {Reducing: 1, PO: 1.5}, "ubiquinol": {Reducing: 1, PO: 1.5},
	"NAD+": {PO: 2.5}, "NADP+": {PO: 2.5}, "FAD": {PO: 1.5}, "ubiquinone": {PO: 1.5},
	protonID: {ProtonsPerATP: DefaultProtonsPerATP},
}

// DefaultProtonsPerATP is how many protons crossing the inner mitochondrial membrane count as one ATP: about
// 2.7 through the synthase (8 c-subunits per 3 ATP in animals) and 1 for the phosphate carrier and the
// ATP/ADP translocase, rounded to 4 as textbooks do (Berg, Tymoczko & Stryer, Biochemistry; from memory).
// It matches the P/O ratio of 2.5 for NADH (10 protons pumped).
const DefaultProtonsPerATP = 4.0

// pyrophosphateNote is attached to every row that makes or uses PPi at the default value.
const pyrophosphateNote = "PPi is counted at phosphate value 0: it is assumed hydrolysed by pyrophosphatase " +
	"(set a value for PPi to count it otherwise)"

// valueTable holds the values in use: the defaults with the worksheet's overrides applied, keyed by the
// compound's identity (library id or "own:" + own id).
type valueTable struct {
	byKey      map[string]ValueUsed
	overridden map[string]bool // keys the worksheet sets a value for
}

// buildValues applies the worksheet's overrides. Keys of ws.Values are compound names as the user writes
// them; resolve maps them to compound identities. Bad keys and values become field errors.
func buildValues(ws *Worksheet, resolve func(string) (string, bool), errs *[]FieldError) valueTable {
	table := valueTable{byKey: maps.Clone(defaultValues), overridden: map[string]bool{}}
	for _, name := range sortedKeys(ws.Values) {
		path := "values." + name
		key, ok := resolve(name)
		if !ok {
			*errs = append(*errs, FieldError{Path: path, Message: say.Sprintf("no compound %q for this value", name)})
			continue
		}
		v := ws.Values[name]
		used := table.byKey[key]
		table.overridden[key] = true
		for _, f := range []struct {
			field    string
			in, out  *float64
			positive bool
		}{
			{"phosphate", v.Phosphate, &used.Phosphate, false},
			{"reducing", v.Reducing, &used.Reducing, false},
			{"po", v.PO, &used.PO, false},
			{"protonsPerATP", v.ProtonsPerATP, &used.ProtonsPerATP, true},
		} {
			if f.in == nil {
				continue
			}
			switch {
			case f.field == "protonsPerATP" && key != protonID:
				*errs = append(*errs, FieldError{Path: path + "." + f.field, Message: "protonsPerATP is set on H+ only"})
			case !finite(*f.in) || f.field == "po" && *f.in < 0 || f.positive && *f.in <= 0:
				*errs = append(*errs, FieldError{Path: path + "." + f.field,
					Message: say.Sprintf("%s value %v is not usable: enter a finite number%s", f.field, *f.in,
						map[bool]string{true: " greater than zero", false: ""}[f.positive || f.field == "po"])})
			default:
				*f.out = *f.in
			}
		}
		table.byKey[key] = used
	}
	return table
}

// cost of a reaction with stoichiometry nu (signed coefficients, products positive):
//
//	phosphate = −Σ ν_i·P_i,  reducing = −Σ ν_i·R_i,  total = −Σ ν_i·(P_i + R_i·PO_i) + protons/(H+ per ATP)
//
// times the multiplier, so a cost is positive and a yield negative (ATP + glucose = ADP + G6P costs 1).
// protons counts the protons the row lets back across a membrane down their gradient (negative: pumped).
func (t valueTable) cost(nu []stoich, protons, times float64) Cost {
	var c Cost
	for _, s := range nu {
		v := t.byKey[s.r.compound.key]
		c.Phosphate -= s.coef * v.Phosphate
		c.Reducing -= s.coef * v.Reducing
		c.Total -= s.coef * (v.Phosphate + v.Reducing*v.PO)
	}
	c.Protons = protons
	c.ProtonATP = protons / t.byKey[protonID].ProtonsPerATP
	c.Total += c.ProtonATP
	c.scale(times)
	c.clean()
	return c
}

// used lists the values in use for the compounds the worksheet names (in rows, concentrations or values)
// that have a value, by the names a user knows them by (library id or own id); named holds the keys of
// the compounds named that have one.
func (t valueTable) used(named map[string]bool) map[string]ValueUsed {
	out := map[string]ValueUsed{}
	for k, v := range t.byKey {
		if named[k] || t.overridden[k] {
			out[strings.TrimPrefix(k, "own:")] = v
		}
	}
	return out
}

func (c *Cost) scale(f float64) {
	c.Phosphate *= f
	c.Reducing *= f
	c.Protons *= f
	c.ProtonATP *= f
	c.Total *= f
}

func (c *Cost) finite() bool {
	return finite(c.Phosphate) && finite(c.Reducing) && finite(c.Protons) && finite(c.ProtonATP) && finite(c.Total)
}

// clean removes the −0 and rounding dust (below 1e-12) that sums of exact small values leave.
func (c *Cost) clean() {
	for _, x := range []*float64{&c.Phosphate, &c.Reducing, &c.Protons, &c.ProtonATP, &c.Total} {
		if *x > -1e-12 && *x < 1e-12 {
			*x = 0
		}
	}
}
