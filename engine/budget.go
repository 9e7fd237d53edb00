package engine

import (
	"fmt"
	"maps"
	"slices"
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
}

// pyrophosphateNote is attached to every row that makes or uses PPi at the default value.
const pyrophosphateNote = "PPi is counted at phosphate value 0: it is assumed hydrolysed by pyrophosphatase " +
	"(set a value for PPi to count it otherwise)"

// valueTable holds the values in use: the defaults with the worksheet's overrides applied, keyed by the
// compound's identity (library id or own-compound id).
type valueTable struct {
	used       map[string]ValueUsed
	overridden map[string]bool // keys the worksheet sets a value for
}

// buildValues applies the worksheet's overrides. Keys of ws.Values are compound names as the user writes
// them; resolve maps them to compound identities. Bad keys and values become field errors.
func buildValues(ws *Worksheet, resolve func(string) (string, bool), errs *[]FieldError) valueTable {
	table := valueTable{used: maps.Clone(defaultValues), overridden: map[string]bool{}}
	for _, name := range slices.Sorted(maps.Keys(ws.Values)) {
		path := "values." + name
		key, ok := resolve(name)
		if !ok {
			*errs = append(*errs, FieldError{Path: path, Message: fmt.Sprintf("no compound %q for this value", name)})
			continue
		}
		v := ws.Values[name]
		used := table.used[key]
		table.overridden[key] = true
		for _, f := range []struct {
			field string
			in    *float64
			out   *float64
		}{{"phosphate", v.Phosphate, &used.Phosphate}, {"reducing", v.Reducing, &used.Reducing}, {"po", v.PO, &used.PO}} {
			if f.in == nil {
				continue
			}
			if !finite(*f.in) || *f.in < 0 && f.field == "po" {
				*errs = append(*errs, FieldError{Path: path + "." + f.field,
					Message: fmt.Sprintf("%s value %v is not usable: enter a finite number (P/O not negative)", f.field, *f.in)})
				continue
			}
			*f.out = *f.in
		}
		table.used[key] = used
	}
	return table
}

// cost of a reaction with stoichiometry nu (compound identity → signed coefficient, products positive):
//
//	phosphate = −Σ ν_i·P_i,  reducing = −Σ ν_i·R_i,  total = −Σ ν_i·(P_i + R_i·PO_i)
//
// times the multiplier, so a cost is positive and a yield negative (ATP + glucose = ADP + G6P costs 1).
func (t valueTable) cost(nu []stoich, times float64) Cost {
	var c Cost
	for _, s := range nu {
		v := t.used[s.key]
		c.Phosphate -= s.coef * v.Phosphate
		c.Reducing -= s.coef * v.Reducing
		c.Total -= s.coef * (v.Phosphate + v.Reducing*v.PO)
	}
	c.Phosphate *= times
	c.Reducing *= times
	c.Total *= times
	return Cost{Phosphate: clean(c.Phosphate), Reducing: clean(c.Reducing), Total: clean(c.Total)}
}

// clean removes the −0 and rounding dust (below 1e-12) that sums of exact small values leave.
func clean(x float64) float64 {
	if x > -1e-12 && x < 1e-12 {
		return 0
	}
	return x
}
