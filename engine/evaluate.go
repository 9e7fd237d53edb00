package engine

import (
	"math"
	"slices"
	"strings"
	"unicode/utf8"

	"gibbsheet/engine/compounds"
	"gibbsheet/engine/equation"
	"gibbsheet/engine/internal/say"
	"gibbsheet/engine/thermo"
)

// stoich is one reactant of a reaction with its signed coefficient (products positive).
type stoich struct {
	key  string // reactant key: compound and compartment
	coef float64
	rat  equation.Rat // exact coefficient; coef is its value
	r    *reactant
	term equation.Term // the term as written (the last one, where a reactant stands on both sides)
}

// evaluation holds what one Evaluate call shares between rows.
type evaluation struct {
	ws          *Worksheet
	cat         *catalog
	cond        thermo.Conditions
	condOK      bool
	rt          float64
	band        float64
	comps       map[string]*compartment
	defaultComp string
	values      valueTable
	bounds      boundTable
	conc        map[string]concentration // by reactant key
	defc        concentration
	res         *Result
	uses        map[string]int       // index into res.Compounds by reactant key
	lastUse     []int32              // by index into res.Compounds: 1 + the index of the last row that used it
	useRows     []useRef             // every row's uses of compounds, in order
	context     string               // everything in the worksheet that a row's result depends on, but the rows
	used        []stoich             // the reactants the row being computed names
	named       []*compound          // the compounds the row being computed names, H+ included
	valued      map[string]bool      // the compounds named that have an energy value (see valueTable.used)
	prior       []*memoRow           // the rows of a Session's previous evaluation, under the same context
	priorEv     *evaluation          // that evaluation
	idErrors    []FieldError         // the errors about the rows' ids
	serial      uint64               // this evaluation's number, from 1 (see memoRow.made)
	live        bool                 // for a Session: the result's Rows stay empty (the encodings and done hold them)
	heads       map[headKey]*useHead // for a Session: the compounds' entries under this context
	done        []*memoRow           // the rows computed or remembered, in order
	computed    []computedRow        // those of them that entered the totals, for the analysis
	analysis    *mdfMemo             // for a Session: its latest analysis, which analyse takes from and sets
}

type concentration struct {
	molar float64
	text  string
	err   string
}

// Evaluate computes the result document of a decoded worksheet with the built-in compound library.
// unknown lists document fields that Decode did not recognise; they become warnings.
func Evaluate(ws *Worksheet, unknown []string) *Result {
	return evaluateWith(compounds.Builtin(), ws, unknown)
}

func evaluateWith(lib *compounds.Library, ws *Worksheet, unknown []string) *Result {
	ev := newEvaluation(lib, ws, unknown)
	ev.evaluateRows()
	ev.analyse()
	return ev.res
}

// newEvaluation reads everything in the worksheet but its rows: conditions, compartments, compounds,
// values, concentrations and bounds.
func newEvaluation(lib *compounds.Library, ws *Worksheet, unknown []string) *evaluation {
	res := &Result{Rows: make([]RowResult, 0, len(ws.Rows)), rowJSON: make([][]byte, 0, len(ws.Rows)),
		Compounds: []CompoundUse{}, Warnings: []Warning{}}
	ev := &evaluation{ws: ws, res: res, uses: make(map[string]int, 32)}
	ev.warnUnknown(unknown)
	cond, warns, errs := readConditions(ws.Conditions)
	ev.cond, ev.condOK = cond, errs == nil
	res.Warnings = append(res.Warnings, warns...)
	res.Errors = append(res.Errors, errs...)
	ev.rt = cond.RT()
	if !ev.condOK {
		ev.rt = thermo.R * DefaultTemperature
	}
	ev.readCompartments()
	ev.cat = newCatalog(lib, ws, ev)
	ev.band = ev.readBand()
	ev.values = buildValues(ws, ev.cat.key, &res.Errors)
	ev.readConcentrations()
	ev.readBounds()
	ev.context = contextKey(ws)
	res.Conditions = conditionsUsed(cond, ev.band)
	return ev
}

func (ev *evaluation) warnUnknown(fields []string) {
	for _, f := range fields {
		ev.warn(Warning{Code: "unknown-field", Path: f,
			Message: say.Sprintf("field %q is not part of the worksheet format and is ignored", f)})
	}
}

// valuedInContext lists the compounds the catalog holds before any row is read (those the concentrations,
// values and bounds name) that have an energy value.
func (ev *evaluation) valuedInContext() []string {
	var out []string
	for k := range ev.cat.compounds {
		if _, ok := ev.values.byKey[k]; ok {
			out = append(out, k)
		}
	}
	return out
}

// setup is an evaluation as newEvaluation leaves it, kept by a Session to evaluate the next version of the
// worksheet without reading its context again while the context stays the same.
type setup struct {
	ev       evaluation
	warnings []Warning    // the context's warnings, without those about unknown fields
	errors   []FieldError // the context's errors
	valued   []string     // the compounds the context names that have an energy value
}

func (ev *evaluation) setup(unknown int) *setup {
	ev.heads = map[headKey]*useHead{}
	return &setup{ev: *ev, warnings: slices.Clone(ev.res.Warnings[unknown:]), errors: slices.Clone(ev.res.Errors),
		valued: ev.valuedInContext()}
}

// evaluation starts the evaluation of ws, whose context must be the setup's, as newEvaluation would.
func (s *setup) evaluation(ws *Worksheet, unknown []string) *evaluation {
	ev := new(evaluation)
	*ev = s.ev
	ev.ws = ws
	ev.res = &Result{rowJSON: make([][]byte, 0, len(ws.Rows)),
		Compounds: []CompoundUse{}, Warnings: []Warning{}, Conditions: s.ev.res.Conditions}
	ev.uses = make(map[string]int, 32)
	ev.warnUnknown(unknown)
	ev.res.Warnings = append(ev.res.Warnings, s.warnings...)
	ev.res.Errors = slices.Clone(s.errors)
	ev.valued = make(map[string]bool, len(s.valued)+8)
	for _, k := range s.valued {
		ev.valued[k] = true
	}
	return ev
}

// evaluateRows computes every row and the totals: everything of the result but the max-min driving
// force. It notes in computed the rows that can enter the analysis.
func (ev *evaluation) evaluateRows() {
	ws, res := ev.ws, ev.res
	ev.serial = serials.Add(1)
	ev.checkRowIDs(ev.priorEv)
	ev.useRows = make([]useRef, 0, 4*len(ws.Rows))
	if ev.valued == nil {
		ev.valued = make(map[string]bool, 16)
		for _, k := range ev.valuedInContext() {
			ev.valued[k] = true
		}
	}
	var net netReaction
	total := Total{DG0: new(float64), DG: new(float64)}
	var incomplete []string
	computed := make([]computedRow, 0, len(ws.Rows))
	ev.done = make([]*memoRow, 0, len(ws.Rows))
	for i := range ws.Rows {
		m := ev.row(i, &ws.Rows[i])
		ev.done = append(ev.done, m)
		row, nu := m.result, m.nu
		if !ev.live {
			res.Rows = append(res.Rows, row)
		}
		res.rowJSON = append(res.rowJSON, m.json)
		if nu == nil {
			incomplete = append(incomplete, row.ID)
			total.DG0, total.DG = nil, nil
			continue
		}
		computed = append(computed, computedRow{index: i, nu: nu})
		net.add(nu, row.Times)
		total.Cost.add(*row.Cost)
		if total.DG0 != nil {
			*total.DG0 += row.Times * *row.DG0
		}
		if total.DG != nil && row.DG != nil {
			*total.DG += row.Times * *row.DG
		} else {
			total.DG = nil
		}
	}
	if len(incomplete) > 0 {
		ev.warn(Warning{Code: "total-incomplete", Path: "rows",
			Message: say.Sprintf("the totals leave out %d row(s) that could not be computed: %s",
				len(incomplete), strings.Join(incomplete, ", "))})
	}
	total.Equation = net.String()
	total.Cost.clean()
	total.DG0, total.DG = finiteOrNil(deref(total.DG0)), finiteOrNil(deref(total.DG))
	if !total.Cost.finite() {
		total.Cost = Cost{}
		ev.warn(Warning{Code: "total-out-of-range", Path: "rows", Message: "the total cost is out of range and is not shown"})
	}
	res.Total = total
	ev.finishUses()
	res.Values = ev.values.used(ev.valued)
	if len(res.Errors) == 0 {
		res.Errors = nil
	}
	ev.computed = computed
}

func deref(p *float64) float64 {
	if p == nil {
		return math.NaN()
	}
	return *p
}

func (ev *evaluation) fieldError(path, msg string) {
	ev.res.Errors = append(ev.res.Errors, FieldError{Path: path, Message: msg})
}

func (ev *evaluation) warn(w Warning) { ev.res.Warnings = append(ev.res.Warnings, w) }

func (ev *evaluation) readBand() float64 {
	band := ev.rt * math.Ln10 // Q within tenfold of K'
	if b := ev.ws.NearEquilibrium; b != nil {
		if !finite(*b) || *b < 0 {
			ev.fieldError("nearEquilibrium", say.Sprintf("near-equilibrium band %v kJ/mol must be a finite number ≥ 0", *b))
		} else {
			band = *b
		}
	}
	return band
}

// resolveName maps a name as written in a document key ("ATP", "malate[m]") to a reactant; the message
// says why when there is none.
func (ev *evaluation) resolveName(written string) (*reactant, string) {
	name, tag := splitTag(written)
	c := ev.cat.resolve(name)
	if c == nil {
		return nil, say.Sprintf("no compound %q: check the name used in the equations", name)
	}
	comp := ev.compartmentOf(tag)
	if comp == nil {
		return nil, say.Sprintf("no compartment %q: the worksheet has %s", tag, ev.compartmentIDs())
	}
	return ev.cat.reactant(c, comp), ""
}

func (ev *evaluation) readConcentrations() {
	ev.conc = map[string]concentration{}
	text := ev.ws.DefaultConcentration
	if strings.TrimSpace(text) == "" {
		text = DefaultConcentration
	}
	ev.defc = concentration{text: text}
	if c, err := ParseConcentration(text); err != nil {
		ev.defc.err = err.Error()
		ev.fieldError("defaultConcentration", err.Error())
	} else {
		ev.defc.molar = c
	}
	given := map[string]string{}
	for _, name := range sortedKeys(ev.ws.Concentrations) {
		path := "concentrations." + name
		r, why := ev.resolveName(name)
		switch {
		case r == nil:
			ev.fieldError(path, why)
			continue
		case r.isWater():
			ev.warn(Warning{Code: "fixed-concentration", Path: path,
				Message: "water is taken at activity 1 in dilute solution; its concentration is ignored"})
			continue
		case r.isProton():
			ev.warn(Warning{Code: "fixed-concentration", Path: path,
				Message: "H+ is set by the pH; its concentration is ignored"})
			continue
		}
		if prev, dup := given[r.key]; dup {
			ev.fieldError(path, say.Sprintf("%q and %q name the same compound: keep one concentration", prev, name))
			continue
		}
		given[r.key] = name
		c := concentration{text: ev.ws.Concentrations[name]}
		if v, err := ParseConcentration(c.text); err != nil {
			c.err = err.Error()
			ev.fieldError(path, err.Error())
		} else {
			c.molar = v
		}
		ev.conc[r.key] = c
	}
}

// concentrationOf returns the concentration in use for a reactant and whether it was entered.
func (ev *evaluation) concentrationOf(r *reactant) (concentration, bool) {
	if c, ok := ev.conc[r.key]; ok {
		return c, true
	}
	return ev.defc, false
}

// checkRowIDs reports rows without an id or with one used before. When the rows' ids are those of the
// previous evaluation of a Session, its findings are taken again.
func (ev *evaluation) checkRowIDs(prior *evaluation) {
	if prior != nil && len(prior.done) == len(ev.ws.Rows) {
		same := true
		for i := range ev.ws.Rows {
			if prior.done[i].key.id != ev.ws.Rows[i].ID {
				same = false
				break
			}
		}
		if same {
			ev.idErrors = prior.idErrors
			ev.res.Errors = append(ev.res.Errors, ev.idErrors...)
			return
		}
	}
	n := len(ev.res.Errors)
	seen := make(map[string]bool, len(ev.ws.Rows))
	for i, row := range ev.ws.Rows {
		switch {
		case row.ID == "":
			ev.fieldError(say.Sprintf("rows[%d].id", i), "a row needs an id")
		case seen[row.ID]:
			ev.fieldError(say.Sprintf("rows[%d].id", i), say.Sprintf("row id %q is used twice", row.ID))
		}
		seen[row.ID] = true
	}
	ev.idErrors = slices.Clip(ev.res.Errors[n:])
}

// rowErrors converts the parser's errors to row errors with character columns.
func rowErrors(src string, err error) []RowError {
	list, ok := err.(equation.ErrorList)
	if !ok {
		return []RowError{{Message: err.Error()}}
	}
	out := make([]RowError, 0, len(list))
	for _, e := range list {
		out = append(out, spanError(src, e.Pos, e.End, e.Msg, e.Suggest))
	}
	return out
}

func spanError(src string, pos, end equation.Pos, msg string, suggest []string) RowError {
	length := 1
	if int(end) > int(pos) && int(end) <= len(src) {
		length = max(1, utf8.RuneCountInString(src[pos:end]))
	}
	return RowError{Message: msg, Column: equation.Column(src, pos), Length: length, Suggestions: suggest}
}

func sortedKeys[V any](m map[string]V) []string {
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	return keys
}
