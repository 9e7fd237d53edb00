package compounds

import (
	"errors"
	"fmt"
	"strings"

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
	index map[string]*Compound // normalized ID, name or synonym → compound
	names []nameEntry          // every name for Suggest, IDs first
}

type nameEntry struct {
	text, norm string
	isID       bool
}

// NewLibrary validates cs and builds a library of copies of them, in the given order. Every compound
// needs an ID, a name, a formula that parses, at least one species and a source; the formula must
// describe one of its Mg-free species (same N_H); IDs, names and synonyms must be unique across the
// library after normalization (see Lookup). All problems are reported together.
func NewLibrary(cs []Compound) (*Library, error) {
	l := &Library{index: map[string]*Compound{}}
	var errs []error
	owner := map[string]int{} // normalized name → index of the compound that has it
	for i := range cs {
		c := cs[i]
		c.Synonyms = append([]string(nil), c.Synonyms...)
		c.Species = append([]thermo.Species(nil), c.Species...)
		for _, msg := range check(&c) {
			errs = append(errs, fmt.Errorf("compound %d %q: %s", i+1, c.ID, msg))
		}
		l.all = append(l.all, &c)
		for k, n := range append([]string{c.ID, c.Name}, c.Synonyms...) {
			key := normalize(n)
			if key == "" {
				continue
			}
			if o, dup := owner[key]; dup {
				if o != i {
					errs = append(errs, fmt.Errorf("compound %d %q: name %q already used by compound %d %q", i+1, c.ID, n, o+1, cs[o].ID))
				}
				continue
			}
			owner[key] = i
			l.index[key] = &c
			l.names = append(l.names, nameEntry{n, key, k == 0})
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
		msgs = append(msgs, fmt.Sprintf("formula %s has %d H but no Mg-free species has nH = %d", c.Formula, f["H"], f["H"]))
	}
	return msgs
}

// All returns the compounds in library order.
func (l *Library) All() []*Compound { return append([]*Compound(nil), l.all...) }

// Lookup returns the compound with the given ID, name or synonym, or nil. Matching ignores case,
// leading and trailing space, and runs of inner space, and treats the primes ' ′ ’ alike.
func (l *Library) Lookup(name string) *Compound { return l.index[normalize(name)] }

// primes maps the prime variants people type to '.
var primes = strings.NewReplacer("′", "'", "’", "'", "‘", "'")

// normalize folds case, trims and collapses spaces, and maps the prime variants to '.
func normalize(s string) string {
	s = strings.Join(strings.Fields(s), " ")
	return strings.ToLower(primes.Replace(s))
}
