package engine

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"gibbsheet/engine/compounds"
	"gibbsheet/engine/thermo"
)

// DefaultCompartment is the compartment of every untagged name.
const DefaultCompartment = "c"

// Library ids the evaluation treats specially.
const (
	waterID  = "H2O" // activity 1 in dilute aqueous solution
	protonID = "H+"  // fixed by pH; left out of the transformed equation
)

// reactant is one compound of the worksheet as the evaluation knows it: where its data come from and the
// values derived from them, computed once per evaluation.
type reactant struct {
	key     string // identity: library id or "own:" + own id
	name    string // full name
	lib     *compounds.Compound
	own     *Compound
	formula compounds.Formula // nil when unknown

	dfG0prime  float64 // kJ/mol at the worksheet's conditions; valid when hasData
	hasData    bool
	noData     string // why there are no data, when !hasData
	approx     string // non-empty: the data are approximate, and how
	noEnthalpy bool   // some species lacks ΔfH°, so the temperature is not followed
}

func (r *reactant) isWater() bool  { return r.lib != nil && r.lib.ID == waterID }
func (r *reactant) isProton() bool { return r.lib != nil && r.lib.ID == protonID }

// normalName folds a name for case-insensitive matching of the worksheet's own compounds.
func normalName(s string) string { return strings.ToLower(strings.Join(strings.Fields(s), " ")) }

// catalog resolves the names written in a worksheet: its own compounds first, then the library.
type catalog struct {
	lib   *compounds.Library
	own   map[string]*Compound // by normalName of id and name
	cond  thermo.Conditions
	cache map[string]*reactant
}

func newCatalog(lib *compounds.Library, ws *Worksheet, cond thermo.Conditions, errs *[]FieldError, warns *[]Warning) *catalog {
	cat := &catalog{lib: lib, own: map[string]*Compound{}, cond: cond, cache: map[string]*reactant{}}
	for i := range ws.Compounds {
		c := &ws.Compounds[i]
		path := fmt.Sprintf("compounds[%d]", i)
		if strings.TrimSpace(c.ID) == "" {
			*errs = append(*errs, FieldError{Path: path + ".id", Message: "a compound needs an id: the name used in equations"})
			continue
		}
		if prev, dup := cat.own[normalName(c.ID)]; dup {
			*errs = append(*errs, FieldError{Path: path + ".id", Message: fmt.Sprintf("compound id %q is defined twice (also as %q)", c.ID, prev.ID)})
			continue
		}
		if msg := checkOwnCompound(c); msg != "" {
			*errs = append(*errs, FieldError{Path: path, Message: msg})
		}
		if libc := lib.Lookup(c.ID); libc != nil {
			*warns = append(*warns, Warning{Code: "own-shadows-library", Path: path + ".id",
				Message: fmt.Sprintf("the worksheet's own compound %q is used in place of the library's %s", c.ID, libc.Name)})
		}
		cat.own[normalName(c.ID)] = c
		if c.Name != "" {
			if _, taken := cat.own[normalName(c.Name)]; !taken {
				cat.own[normalName(c.Name)] = c
			}
		}
	}
	return cat
}

// checkOwnCompound returns what is wrong with a worksheet compound's data, or "".
func checkOwnCompound(c *Compound) string {
	if len(c.Species) > 0 && c.DfG0Prime != nil {
		return fmt.Sprintf("compound %q has both species data and a ΔfG'°: keep one", c.ID)
	}
	if c.DfG0Prime != nil && !finite(*c.DfG0Prime) {
		return fmt.Sprintf("compound %q: ΔfG'° must be a finite number", c.ID)
	}
	for j, s := range c.Species {
		if s.NH < 0 || s.NMg < 0 || !finite(s.DfG0) || s.DfH0 != nil && !finite(*s.DfH0) {
			return fmt.Sprintf("compound %q, species %d: ΔfG° must be finite and nH, nMg not negative", c.ID, j+1)
		}
	}
	if c.Formula != "" {
		if _, err := compounds.ParseFormula(c.Formula); err != nil {
			return fmt.Sprintf("compound %q: formula %q: %v", c.ID, c.Formula, err)
		}
	}
	return ""
}

// resolve finds the compound a name refers to; nil when there is none.
func (cat *catalog) resolve(name string) *reactant {
	if own, ok := cat.own[normalName(name)]; ok {
		return cat.reactant("own:"+own.ID, func() *reactant { return cat.ownReactant(own) })
	}
	if libc := cat.lib.Lookup(name); libc != nil {
		return cat.reactant(libc.ID, func() *reactant { return cat.libReactant(libc) })
	}
	return nil
}

// key resolves a name to its identity, for keys of concentrations and values.
func (cat *catalog) key(name string) (string, bool) {
	r := cat.resolve(name)
	if r == nil {
		return "", false
	}
	return r.key, true
}

func (cat *catalog) reactant(key string, build func() *reactant) *reactant {
	if r, ok := cat.cache[key]; ok {
		return r
	}
	r := build()
	cat.cache[key] = r
	return r
}

func (cat *catalog) libReactant(c *compounds.Compound) *reactant {
	r := &reactant{key: c.ID, name: c.Name, lib: c, approx: c.Approximation}
	if f, err := compounds.ParseFormula(c.Formula); err == nil {
		r.formula = f
	}
	cat.transform(r, c.Species)
	return r
}

func (cat *catalog) ownReactant(c *Compound) *reactant {
	r := &reactant{key: "own:" + c.ID, name: c.Name, own: c}
	if r.name == "" {
		r.name = c.ID
	}
	if f, err := compounds.ParseFormula(c.Formula); c.Formula != "" && err == nil {
		r.formula = f
	}
	switch {
	case checkOwnCompound(c) != "":
		r.noData = fmt.Sprintf("the data of compound %q are not usable (see the compound)", c.ID)
	case c.DfG0Prime != nil:
		r.dfG0prime, r.hasData = *c.DfG0Prime, true
	case len(c.Species) > 0:
		cat.transform(r, c.Species)
	default:
		r.noData = fmt.Sprintf("%q has no thermodynamic data: enter the row's ΔrG'°, or give the compound species data or a ΔfG'°", c.ID)
	}
	return r
}

// transform computes the reactant's ΔfG'° at the worksheet's conditions (Alberty's transform, see thermo).
func (cat *catalog) transform(r *reactant, sp []thermo.Species) {
	if len(sp) == 0 {
		if r.lib != nil && r.lib.ID == protonID {
			return // H+ carries no transformed energy: pH fixes it
		}
		r.noData = fmt.Sprintf("no species data for %s", r.name)
		return
	}
	g, err := thermo.ReactantDfG0Prime(sp, cat.cond)
	if err != nil || math.IsNaN(g) {
		r.noData = fmt.Sprintf("cannot transform %s: %v", r.name, err)
		return
	}
	r.dfG0prime, r.hasData = g, true
	for _, s := range sp {
		if s.DfH0 == nil {
			r.noEnthalpy = true
		}
	}
}

// suggestions lists the names nearest to an unknown one: the worksheet's own compounds that share its start,
// then the library's nearest.
func (cat *catalog) suggestions(name string) []string {
	var out []string
	n := normalName(name)
	for k, c := range cat.own {
		if k == normalName(c.ID) && (strings.HasPrefix(k, n) || strings.HasPrefix(n, k)) {
			out = append(out, c.ID)
		}
	}
	slices.Sort(out)
	if len(out) > maxSuggestions {
		out = out[:maxSuggestions]
	}
	return append(out, cat.lib.Suggest(name, maxSuggestions-len(out))...)
}

// maxSuggestions is how many names an unknown-compound error offers.
const maxSuggestions = 3
