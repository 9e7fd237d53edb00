package engine

import (
	"slices"
	"strings"

	"gibbsheet/engine/internal/say"
	"gibbsheet/engine/thermo"
)

// Compartment of the worksheet: its own pH, ionic strength and pMg (absent: the worksheet's conditions) and
// its electric potential in mV relative to a common reference (absent: 0).
type Compartment struct {
	ID            string   `json:"id"`
	Name          string   `json:"name,omitempty"`
	PH            *float64 `json:"pH,omitempty"`
	IonicStrength *float64 `json:"ionicStrength,omitempty"`
	PMg           *float64 `json:"pMg,omitempty"`
	Potential     *float64 `json:"potential,omitempty"` // mV
}

// compartment is a compartment as the evaluation uses it.
type compartment struct {
	id   string
	name string
	cond thermo.Conditions
	psi  float64 // V
	ok   bool    // its conditions are usable
}

// readCompartments builds the compartments: the listed ones, and the default compartment with the
// worksheet's conditions when the list does not define it. Wrong values are field errors.
func (ev *evaluation) readCompartments() {
	ws := ev.ws
	ev.defaultComp = strings.TrimSpace(ws.DefaultCompartment)
	if ev.defaultComp == "" {
		ev.defaultComp = DefaultCompartment
	}
	ev.comps = map[string]*compartment{}
	for i, in := range ws.Compartments {
		path := say.Sprintf("compartments[%d]", i)
		id := strings.TrimSpace(in.ID)
		switch {
		case id == "" || strings.ContainsAny(id, "[] +"):
			ev.fieldError(path+".id", say.Sprintf("compartment id %q must be a short name without spaces or brackets, e.g. \"m\"", in.ID))
			continue
		case ev.comps[id] != nil:
			ev.fieldError(path+".id", say.Sprintf("compartment %q is defined twice", id))
			continue
		}
		c := &compartment{id: id, name: in.Name, cond: ev.cond, ok: ev.condOK}
		for _, f := range []struct {
			src *float64
			dst *float64
		}{{in.PH, &c.cond.PH}, {in.IonicStrength, &c.cond.IonicStrength}, {in.PMg, &c.cond.PMg}} {
			if f.src != nil {
				*f.dst = *f.src
			}
		}
		if err := c.cond.Check(); err != nil {
			ev.fieldError(path+"."+conditionField(err), err.Error())
			c.ok = false
		}
		if in.Potential != nil {
			if !finite(*in.Potential) {
				ev.fieldError(path+".potential", "the potential must be a finite number of mV")
				c.ok = false
			}
			c.psi = *in.Potential / 1000
		}
		ev.comps[id] = c
	}
	if ev.comps[ev.defaultComp] == nil {
		ev.comps[ev.defaultComp] = &compartment{id: ev.defaultComp, cond: ev.cond, ok: ev.condOK}
	}
}

// compartmentOf returns the compartment a tag names ("" is the default one), nil when there is none.
func (ev *evaluation) compartmentOf(tag string) *compartment {
	if tag == "" {
		tag = ev.defaultComp
	}
	return ev.comps[tag]
}

func (ev *evaluation) compartmentIDs() string {
	ids := make([]string, 0, len(ev.comps))
	for id := range ev.comps {
		ids = append(ids, id)
	}
	slices.Sort(ids)
	return quoteList(ids)
}

// splitTag splits "malate[m]" into "malate" and "m"; a name without a trailing tag has tag "".
func splitTag(s string) (name, tag string) {
	s = strings.TrimSpace(s)
	if strings.HasSuffix(s, "]") {
		if i := strings.LastIndexByte(s, '['); i > 0 {
			return strings.TrimSpace(s[:i]), strings.TrimSpace(s[i+1 : len(s)-1])
		}
	}
	return s, ""
}
