package compounds

import (
	"errors"
	"sort"
	"strings"

	"gibbsheet/engine/compounds/internal/names"
	"gibbsheet/engine/internal/say"
	"gibbsheet/engine/thermo"
)

// Compound is a reactant: one or more species in equilibrium with one another.
type Compound struct {
	ID            string           `json:"id"`                      // canonical short id: "ATP", "NAD+", "H2O", "Pi", "glucose"
	Name          string           `json:"name"`                    // full name
	Synonyms      []string         `json:"synonyms,omitempty"`      // other names a biochemist types
	Formula       string           `json:"formula"`                 // of one species without Mg; other elements than H are the same in all
	Species       []thermo.Species `json:"species"`                 // Alberty's species data
	Source        string           `json:"source"`                  // citation of the data, "(from memory)" where so
	Approximation string           `json:"approximation,omitempty"` // non-empty: the data are approximate, says how
}

// Library is a validated set of compounds with a name index.
type Library struct {
	all   []*Compound
	names []nameEntry // every name, by compound in library order, each compound's ID first (for Suggest)
	index []int       // positions in names sorted by normalized name (for Lookup)
}

// nameEntry is one name of a compound.
type nameEntry struct {
	text, norm string // as written and normalized (see Lookup)
	isID       bool
	c          *Compound
}

// NewLibrary validates cs and builds a library of copies of them, in the given order. Every compound
// needs an ID, a name, a formula that parses, at least one species and a source; the formula must
// describe one of its Mg-free species (same N_H); IDs, names and synonyms must be unique across the
// library after normalization (see Lookup). All problems are reported together.
func NewLibrary(cs []Compound) (*Library, error) {
	l := &Library{}
	all := make([]Compound, len(cs))
	lists := make([][]string, len(cs))
	for i, c := range cs {
		c.Synonyms = append([]string(nil), c.Synonyms...)
		c.Species = append([]thermo.Species(nil), c.Species...)
		all[i] = c
		l.all = append(l.all, &all[i])
		lists[i] = append([]string{c.ID, c.Name}, c.Synonyms...)
	}
	entries, clashes := names.Collect(lists)
	for _, e := range entries {
		l.names = append(l.names, nameEntry{e.Text, e.Norm, e.IsID, l.all[e.Owner]})
	}
	l.index = names.Index(entries)
	var errs []error
	for i, c := range l.all {
		for _, msg := range check(c) {
			errs = append(errs, say.Errorf("compound %d %q: %s", i+1, c.ID, msg))
		}
		for _, d := range clashes {
			if d.Owner == i {
				errs = append(errs, say.Errorf("compound %d %q: name %q already used by compound %d %q",
					i+1, c.ID, d.Text, d.Other+1, cs[d.Other].ID))
			}
		}
	}
	if len(errs) > 0 {
		return nil, errors.Join(errs...)
	}
	return l, nil
}

// check returns the problems of one compound.
func check(c *Compound) []string {
	var msgs []string
	if strings.TrimSpace(c.ID) == "" {
		msgs = append(msgs, "missing id")
	}
	if strings.TrimSpace(c.Name) == "" {
		msgs = append(msgs, "missing name")
	}
	if strings.TrimSpace(c.Source) == "" {
		msgs = append(msgs, "missing source")
	}
	if len(c.Species) == 0 {
		msgs = append(msgs, "no species")
	}
	f, err := ParseFormula(c.Formula)
	if err != nil {
		return append(msgs, err.Error())
	}
	if f["Mg"] != 0 {
		msgs = append(msgs, "formula must be that of a species without magnesium")
	}
	found := false
	for _, s := range c.Species {
		if s.NMg < 0 {
			msgs = append(msgs, "negative nMg")
		}
		found = found || (s.NMg == 0 && s.NH == f["H"])
	}
	if !found && len(c.Species) > 0 {
		msgs = append(msgs, say.Sprintf("formula %s has %d H but no Mg-free species has nH = %d", c.Formula, f["H"], f["H"]))
	}
	return msgs
}

// All returns the compounds in library order.
func (l *Library) All() []*Compound { return append([]*Compound(nil), l.all...) }

// Lookup returns the compound with the given ID, name or synonym, or nil. Matching ignores case,
// leading and trailing space, and runs of inner space, and treats the primes ' ′ ’ ‘ alike.
func (l *Library) Lookup(name string) *Compound {
	key := names.Normalize(name)
	i := sort.Search(len(l.index), func(i int) bool { return l.names[l.index[i]].norm >= key })
	if i < len(l.index) && l.names[l.index[i]].norm == key {
		return l.names[l.index[i]].c
	}
	return nil
}
