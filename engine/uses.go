package engine

import (
	"slices"

	"gibbsheet/engine/equation"
)

// use records that a row uses a compound, for the result's list of compounds and their concentrations.
// The compound's list of rows is filled by finishUses.
func (ev *evaluation) use(r *reactant, t equation.Term, row int) {
	i, ok := ev.uses[r.key]
	if !ok {
		i = ev.newUse(r, t)
	}
	// A row is listed once per compound, as are consecutive rows with the same id.
	if last := ev.lastUse[i] - 1; last < 0 || ev.ws.Rows[last].ID != ev.ws.Rows[row].ID {
		ev.lastUse[i] = int32(row) + 1
		ev.useRows = append(ev.useRows, useRef{compound: int32(i), row: int32(row)})
	}
}

// useRef is the use by the row at index row of the worksheet of the compound at index compound of the
// result's list (numbers, not names, so that the garbage collector has nothing to look at).
type useRef struct{ compound, row int32 }

// finishUses gives every compound of the result its list of rows, all in one backing array: appending
// to a list per compound is much of an evaluation's time in WebAssembly.
func (ev *evaluation) finishUses() {
	list := ev.res.Compounds
	counts := make([]int, len(list))
	for _, u := range ev.useRows {
		counts[u.compound]++
	}
	backing := make([]string, len(ev.useRows))
	off := 0
	for i := range list {
		list[i].Rows = backing[off : off : off+counts[i]]
		off += counts[i]
	}
	for _, u := range ev.useRows {
		c := &list[u.compound]
		c.Rows = append(c.Rows, ev.ws.Rows[u.row].ID)
	}
}

func (ev *evaluation) newUse(r *reactant, t equation.Term) int {
	if ev.res.Compounds == nil || len(ev.res.Compounds) == cap(ev.res.Compounds) {
		// Room for a pathway's compounds at once: growing a slice of these structs is dear in WebAssembly.
		ev.res.Compounds = slices.Grow(ev.res.Compounds, 32+len(ev.res.Compounds))
	}
	ev.lastUse = append(ev.lastUse, 0)
	i := len(ev.res.Compounds)
	ev.uses[r.key] = i
	if ev.heads == nil {
		ev.res.Compounds = append(ev.res.Compounds, ev.compoundUse(r, t))
		return i
	}
	// In a Session, a compound's entry but for its rows is made once for the context.
	k := headKey{r.key, t.Name, t.Compartment}
	h, ok := ev.heads[k]
	if !ok {
		h = &useHead{use: ev.compoundUse(r, t)}
		h.json = h.use.appendJSONHead(nil)
		ev.heads[k] = h
	}
	ev.res.Compounds = append(ev.res.Compounds, h.use)
	ev.res.useHeads = append(ev.res.useHeads, h.json)
	return i
}

// headKey names a compound's entry in the result: the reactant, and its name as first written.
type headKey struct{ reactant, name, compartment string }

// useHead is a compound's entry, without its rows, and its encoding up to them.
type useHead struct {
	use  CompoundUse
	json []byte
}

// compoundUse is the compound's entry in the result's list, without its rows.
func (ev *evaluation) compoundUse(r *reactant, t equation.Term) CompoundUse {
	use := CompoundUse{ID: t.Name + tagOf(t.Compartment), Name: r.name, Compartment: r.comp.id,
		Approximation: r.approx}
	u := &use
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
	return use
}

func tagOf(compartment string) string {
	if compartment == "" {
		return ""
	}
	return "[" + compartment + "]"
}
