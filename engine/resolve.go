package engine

import (
	"math"
	"slices"
	"strings"
	"sync"

	"gibbsheet/engine/compounds"
	"gibbsheet/engine/internal/say"
	"gibbsheet/engine/thermo"
)

// DefaultCompartment is the compartment of every untagged name unless the worksheet sets another.
const DefaultCompartment = "c"

// Library ids the evaluation treats specially.
const (
	waterID  = "H2O" // activity 1 in dilute aqueous solution
	protonID = "H+"  // fixed by pH; left out of the transformed equation
)

// compound is a compound of the worksheet as the evaluation knows it, independent of compartment.
type compound struct {
	key     string // identity: library id or "own:" + own id
	name    string // full name
	lib     *compounds.Compound
	own     *Compound
	formula []elementCount // elements other than H, sorted; nil when the formula is unknown
	species []thermo.Species
	noData  string // why there are no data, when the compound has neither species nor an entered ΔfG'°
	approx  string // non-empty: the data are approximate, and how

}

func (c *compound) isWater() bool  { return c.lib != nil && c.lib.ID == waterID }
func (c *compound) isProton() bool { return c.lib != nil && c.lib.ID == protonID }

// reactant is a compound in one compartment, with its data transformed at that compartment's conditions.
type reactant struct {
	*compound
	comp      *compartment
	key       string  // compound key + "[" + compartment + "]"
	dfG0prime float64 // kJ/mol; valid when hasData
	hasData   bool
	noData    string
	meanH     float64 // N̄H at the compartment's conditions
	meanZ     float64 // z̄ at the compartment's conditions

	noEnthalpy bool // a species that counts here has no ΔfH°, so Gibbs–Helmholtz cannot move it

	ref *reactant // the same at 298.15 K, made by atReference when first needed
}

// reactantID identifies a reactant within one evaluation without building its key.
type reactantID struct {
	c    *compound
	comp *compartment
}

// normalName folds a name for case-insensitive matching of the worksheet's own compounds.
func normalName(s string) string { return strings.ToLower(strings.Join(strings.Fields(s), " ")) }

// catalog resolves the names written in a worksheet: its own compounds first, then the library.
type catalog struct {
	lib       *compounds.Library
	own       map[string]*Compound // by normalName of id and name
	names     map[string]*compound // by name as written; nil entries remember unknown names
	compounds map[string]*compound // by identity
	reactants map[reactantID]*reactant
}

func newCatalog(lib *compounds.Library, ws *Worksheet, ev *evaluation) *catalog {
	cat := &catalog{lib: lib, own: map[string]*Compound{}, names: map[string]*compound{},
		compounds: map[string]*compound{}, reactants: map[reactantID]*reactant{}}
	for i := range ws.Compounds {
		c := &ws.Compounds[i]
		path := say.Sprintf("compounds[%d]", i)
		if strings.TrimSpace(c.ID) == "" {
			ev.fieldError(path+".id", "a compound needs an id: the name used in equations")
			continue
		}
		if prev, dup := cat.own[normalName(c.ID)]; dup {
			ev.fieldError(path+".id", say.Sprintf("compound id %q is defined twice (also as %q)", c.ID, prev.ID))
			continue
		}
		if msg := checkOwnCompound(c); msg != "" {
			ev.fieldError(path, msg)
		}
		if libc := lib.Lookup(c.ID); libc != nil {
			ev.warn(Warning{Code: "own-shadows-library", Path: path + ".id",
				Message: say.Sprintf("the worksheet's own compound %q is used in place of the library's %s", c.ID, libc.Name)})
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
		return say.Sprintf("compound %q has both species data and a ΔfG'°: keep one", c.ID)
	}
	if c.DfG0Prime != nil && !finite(*c.DfG0Prime) {
		return say.Sprintf("compound %q: ΔfG'° must be a finite number", c.ID)
	}
	for j, s := range c.Species {
		if s.NH < 0 || s.NMg < 0 || !finite(s.DfG0) || s.DfH0 != nil && !finite(*s.DfH0) {
			return say.Sprintf("compound %q, species %d: ΔfG° must be finite and nH, nMg not negative", c.ID, j+1)
		}
	}
	if c.Formula != "" {
		if _, err := compounds.ParseFormula(c.Formula); err != nil {
			return say.Sprintf("compound %q: formula %q: %v", c.ID, c.Formula, err)
		}
	}
	return ""
}

// resolve finds the compound a name refers to; nil when there is none.
func (cat *catalog) resolve(name string) *compound {
	if c, seen := cat.names[name]; seen {
		return c
	}
	var c *compound
	if own, ok := cat.own[normalName(name)]; ok {
		c = cat.compound("own:"+own.ID, func() *compound { return ownCompound(own) })
	} else if libc := lookupLibrary(cat.lib, name); libc != nil {
		c = cat.compound(libc.ID, func() *compound { return libCompound(libc) })
	}
	cat.names[name] = c
	return c
}

// key resolves a name to its identity, for keys of values.
func (cat *catalog) key(name string) (string, bool) {
	if c := cat.resolve(name); c != nil {
		return c.key, true
	}
	return "", false
}

func (cat *catalog) compound(key string, build func() *compound) *compound {
	if c, ok := cat.compounds[key]; ok {
		return c
	}
	c := build()
	cat.compounds[key] = c
	return c
}

// libCompounds keeps the evaluation's view of each library compound: it depends on the compound alone, and
// library compounds never change, so every evaluation shares it.
var libCompounds sync.Map // *compounds.Compound → *compound

func libCompound(c *compounds.Compound) *compound {
	if v, ok := libCompounds.Load(c); ok {
		return v.(*compound)
	}
	v, _ := libCompounds.LoadOrStore(c, newLibCompound(c))
	return v.(*compound)
}

// libraryNames remembers name lookups in the built-in library across evaluations (names are normalised
// on each lookup, which shows in profiles of the page's recompute on every keystroke).
var libraryNames = newMemo[*compounds.Compound](4096)

func lookupLibrary(lib *compounds.Library, name string) *compounds.Compound {
	if lib != compounds.Builtin() {
		return lib.Lookup(name)
	}
	return libraryNames.get(name, lib.Lookup)
}

func newLibCompound(c *compounds.Compound) *compound {
	out := &compound{key: c.ID, name: c.Name, lib: c, approx: c.Approximation, species: c.Species}
	if f, err := compounds.ParseFormula(c.Formula); err == nil {
		out.formula = heavyElements(f)
	}
	if len(c.Species) == 0 && c.ID != protonID {
		out.noData = say.Sprintf("no species data for %s", c.Name)
	}
	return out
}

func ownCompound(c *Compound) *compound {
	out := &compound{key: "own:" + c.ID, name: c.Name, own: c, species: c.Species}
	if out.name == "" {
		out.name = c.ID
	}
	if f, err := compounds.ParseFormula(c.Formula); c.Formula != "" && err == nil {
		out.formula = heavyElements(f)
	}
	switch {
	case checkOwnCompound(c) != "":
		out.noData = say.Sprintf("the data of compound %q are not usable (see the compound)", c.ID)
		out.species = nil
	case c.DfG0Prime == nil && len(c.Species) == 0:
		out.noData = say.Sprintf("%q has no thermodynamic data: enter the row's ΔrG'°, or give the compound species data or a ΔfG'°", c.ID)
	}
	return out
}

// missingEnthalpy reports whether a species that counts at c has no ΔfH° (magnesium species do not count
// when magnesium is ignored).
func missingEnthalpy(sp []thermo.Species, c thermo.Conditions) bool {
	return slices.ContainsFunc(sp, func(s thermo.Species) bool {
		return s.DfH0 == nil && (s.NMg == 0 || !math.IsInf(c.PMg, 1))
	})
}

// reactant returns the compound in a compartment, transformed at its conditions (Alberty's transform, see
// thermo) once per evaluation.
func (cat *catalog) reactant(c *compound, comp *compartment) *reactant {
	id := reactantID{c, comp}
	if r, ok := cat.reactants[id]; ok {
		return r
	}
	key := c.key + "[" + comp.id + "]"
	r := &reactant{compound: c, comp: comp, key: key, noData: c.noData}
	switch {
	case c.isProton():
		r.hasData, r.meanH, r.meanZ = true, 1, 1 // ΔfG'°(H+) = 0: the pH fixes it
	case c.noData != "":
	case c.own != nil && c.own.DfG0Prime != nil:
		r.dfG0prime, r.hasData = *c.own.DfG0Prime, true
		if c.own.Charge != nil {
			r.meanZ = float64(*c.own.Charge)
		}
	case !comp.ok:
		r.noData = say.Sprintf("the conditions of compartment %q are not usable", comp.id)
	default:
		g, err := thermo.ReactantDfG0Prime(c.species, comp.cond)
		if err != nil || math.IsNaN(g) {
			r.noData = say.Sprintf("cannot transform %s: %v", c.name, err)
			break
		}
		r.dfG0prime, r.hasData = g, true
		r.meanH = thermo.MeanBoundH(c.species, comp.cond)
		r.meanZ = thermo.MeanCharge(c.species, comp.cond)
		r.noEnthalpy = missingEnthalpy(c.species, comp.cond)
	}
	cat.reactants[id] = r
	return r
}

// atReference returns the reactant's data at 298.15 K and its compartment's pH, I and pMg (see
// heatUnknown): ΔfG'°, N̄H and z̄. Reactants whose data do not come from species (H+, an entered ΔfG'°) keep
// their values.
func (cat *catalog) atReference(r *reactant) *reactant {
	if r.ref != nil {
		return r.ref
	}
	comp := *r.comp
	comp.cond.Temperature = thermo.TRef
	ref := *r
	ref.comp = &comp
	ref.ref = &ref
	r.ref = &ref
	if len(r.species) > 0 && !r.isProton() && !(r.own != nil && r.own.DfG0Prime != nil) && r.hasData {
		if g, err := thermo.ReactantDfG0Prime(r.species, comp.cond); err == nil {
			ref.dfG0prime = g
			ref.meanH = thermo.MeanBoundH(r.species, comp.cond)
			ref.meanZ = thermo.MeanCharge(r.species, comp.cond)
		}
	}
	return r.ref
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
