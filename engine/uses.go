package engine

import (
	"gibbsheet/engine/equation"
	"slices"
)

// use records that a row uses a compound, for the result's list of compounds and their concentrations.
func (ev *evaluation) use(r *reactant, t equation.Term, rowID string) {
	if i, ok := ev.uses[r.key]; ok {
		u := &ev.res.Compounds[i]
		if n := len(u.Rows); n == 0 || u.Rows[n-1] != rowID {
			u.Rows = append(u.Rows, rowID)
		}
		return
	}
	if ev.res.Compounds == nil || len(ev.res.Compounds) == cap(ev.res.Compounds) {
		// Room for a pathway's compounds at once: growing a slice of these structs is dear in WebAssembly.
		ev.res.Compounds = slices.Grow(ev.res.Compounds, 32+len(ev.res.Compounds))
	}
	rows := make([]string, 1, 8)
	rows[0] = rowID
	ev.res.Compounds = append(ev.res.Compounds, CompoundUse{ID: t.Name + tagOf(t.Compartment), Name: r.name,
		Compartment: r.comp.id, Approximation: r.approx, Rows: rows})
	u := &ev.res.Compounds[len(ev.res.Compounds)-1]
	if r.lib != nil {
		u.Library = r.lib.ID
	} else {
		u.Own = true
	}
	if r.hasData {
		u.DfG0Prime = finiteOrNil(r.dfG0prime)
	}
	switch {
	case r.isWater():
		u.Fixed = "activity 1"
	default:
		c, given := ev.concentrationOf(r)
		u.Text, u.AtDefault = c.text, !given
		if c.err == "" {
			m := c.molar
			u.Concentration = &m
		}
	}
	ev.uses[r.key] = len(ev.res.Compounds) - 1
}

func tagOf(compartment string) string {
	if compartment == "" {
		return ""
	}
	return "[" + compartment + "]"
}
