package engine

import (
	"math"
	"slices"
	"strings"

	"gibbsheet/engine/internal/say"
	"gibbsheet/engine/thermo"

	"gibbsheet/engine/equation"
)

// row evaluates one reaction row:
//
//	ΔrG'° = Σ ν_i ΔfG'°_i + W      (Alberty 2003, eq. 4.4-2, each reactant at its compartment's
//	                                 conditions; W the transport work, see transport; or the entered dG0)
//	Q     = Π c_i^ν_i              (c in mol/L over 1 M; water at activity 1, H+ left out)
//	ΔrG'  = ΔrG'° + RT ln Q,   K' = exp(−ΔrG'°/RT)
//
// It returns the row's result and its stoichiometry; the stoichiometry is nil when the row cannot enter
// the totals, and the row's result encoded as in the result document. Rows evaluated before under the same
// worksheet context are taken from the previous evaluation of a Session when they stand at the same
// place, and otherwise from rowMemo.
func (ev *evaluation) row(i int, in *Row) *memoRow {
	key := rowKeyOf(in)
	var m *memoRow
	if i < len(ev.prior) && ev.prior[i].key == key {
		m = ev.prior[i]
	} else if m = rows.get(ev.context, key); m == nil {
		ev.used, ev.named = nil, nil
		m = &memoRow{key: key, made: ev.serial}
		m.result, m.nu = ev.computeRow(in)
		if m.nu != nil {
			ev.flux(&m.result, m.nu)
		}
		m.json = m.result.appendJSON(make([]byte, 0, sizeGuessRow))
		m.used = ev.used
		for _, c := range ev.named {
			if _, ok := ev.values.byKey[c.key]; ok && !slices.Contains(m.valued, c.key) {
				m.valued = append(m.valued, c.key)
			}
		}
		rows.put(ev.context, key, m)
	}
	for _, k := range m.valued {
		ev.valued[k] = true
	}
	for _, s := range m.used {
		if s.coef != 0 && !s.r.isProton() {
			ev.use(s.r, s.term, i)
		}
	}
	return m
}

func (ev *evaluation) computeRow(in *Row) (RowResult, []stoich) {
	out := RowResult{ID: in.ID, Equation: in.Equation, Times: 1, Warnings: []Warning{}}
	var errs []RowError
	if in.Times != nil {
		out.Times = *in.Times
		if !finite(*in.Times) || *in.Times <= 0 {
			errs = append(errs, RowError{Message: say.Sprintf("multiplier %v must be a number greater than zero "+
				"(to run a step backwards, swap the sides of its equation)", *in.Times)})
		}
	}
	if in.DG0 != nil && !finite(*in.DG0) {
		errs = append(errs, RowError{Message: "the entered ΔrG'° must be a finite number"})
	}
	if !ev.condOK {
		errs = append(errs, RowError{Message: "the conditions are not usable: correct them first"})
	}
	parse := parseEquation(in.Equation)
	if parse.err != nil {
		return finishRow(out, append(errs, rowErrors(in.Equation, parse.err)...)), nil
	}
	eq := parse.eq
	out.Equation = parse.normal
	nu, termErrs := ev.resolveTerms(in, eq, &out)
	if errs = append(errs, termErrs...); len(errs) > 0 {
		return finishRow(out, errs), nil
	}
	atReference := ev.heatUnknown(in, nu, &out)
	moves := ev.transport(nu, atReference, &out)

	dg0, dataErrs := ev.standardEnergy(in, nu, atReference, &out)
	lnQ, concErrs := ev.lnQ(in.Equation, nu)
	out.Cost = new(Cost)
	*out.Cost = ev.values.cost(nu, protonsDown(moves), out.Times)
	ev.costNotes(nu, &out)
	ev.balance(nu, &out)
	if dg0 != nil {
		out.DG0 = dg0
		logK := -*dg0 / (ev.rt * math.Ln10)
		out.Log10K = &logK
		out.K = positiveOrNil(math.Pow(10, logK))
	}
	if len(concErrs) == 0 {
		logQ := lnQ / math.Ln10
		out.Log10Q = &logQ
		out.Q = positiveOrNil(math.Exp(lnQ))
		if dg0 != nil {
			dg := *dg0 + ev.rt*lnQ
			out.DG = &dg
			out.Status = ev.status(dg)
			if out.Status == StatusUphill {
				out.Warnings = append(out.Warnings, Warning{Code: "uphill", Message: say.Sprintf(
					"uphill: ΔrG' = %+.1f kJ/mol, so this step cannot run forward at these concentrations", dg)})
			}
		}
	}
	if errs = append(dataErrs, concErrs...); len(errs) > 0 {
		return finishRow(out, errs), nil
	}
	if !out.finite() {
		return finishRow(RowResult{ID: out.ID, Equation: out.Equation, Times: out.Times, Warnings: out.Warnings},
			[]RowError{{Message: "the numbers of this row are out of range: check the coefficients, the " +
				"multiplier and the data of its compounds"}}), nil
	}
	return out, nu
}

// finite reports whether every number of the row can be written in JSON (no overflow to ±Inf or NaN).
func (r *RowResult) finite() bool {
	for _, x := range [...]*float64{r.DG0, r.DG, r.K, r.Q, r.Log10K, r.Log10Q} {
		if x != nil && !finite(*x) {
			return false
		}
	}
	if r.Cost != nil && !r.Cost.finite() {
		return false
	}
	if t := r.Transport; t != nil {
		if !finite(t.Work) {
			return false
		}
		for _, m := range t.Moves {
			if !finite(m.Amount) || !finite(m.Work) {
				return false
			}
		}
	}
	return finite(r.Times)
}

func finishRow(out RowResult, errs []RowError) RowResult {
	if len(errs) > 0 {
		out.Error = &errs[0]
		out.Errors = errs
		out.Status = ""
	}
	return out
}

// positiveOrNil is for K' and Q, which are positive: nil where they overflow or underflow float64 (log10K
// and log10Q still carry them).
func positiveOrNil(x float64) *float64 {
	if !finite(x) || x <= 0 {
		return nil
	}
	return &x
}

// finiteOrNil is nil for a number that JSON cannot carry.
func finiteOrNil(x float64) *float64 {
	if !finite(x) {
		return nil
	}
	return &x
}

func (ev *evaluation) status(dg float64) string {
	switch {
	case dg > 0:
		return StatusUphill
	case dg >= -ev.band:
		return StatusNearEquilibrium
	}
	return StatusDownhill
}

// resolveTerms maps every term to its reactant (compound and compartment) and adds up the signed
// coefficients; a reactant on both sides keeps its net coefficient. Unknown names and compartments are
// errors at their columns. H+ stays only where it crosses a membrane (it appears in two compartments);
// elsewhere the pH fixes it and it is dropped with a note.
func (ev *evaluation) resolveTerms(in *Row, eq *equation.Equation, out *RowResult) ([]stoich, []RowError) {
	nu := make([]stoich, 0, len(eq.Left)+len(eq.Right))
	var errs []RowError
	var protonComp *compartment // the compartment of the H+ terms so far
	protonComps := 0            // how many compartments H+ is written in
	add := func(t equation.Term, sign int64) {
		comp := ev.compartmentOf(t.Compartment)
		if comp == nil {
			errs = append(errs, spanError(in.Equation, t.NameEnd, t.NameEnd+equation.Pos(len(t.Compartment)+2),
				say.Sprintf("unknown compartment %q: the worksheet has %s", t.Compartment, ev.compartmentIDs()), nil))
			return
		}
		c := ev.cat.resolve(t.Name)
		if c == nil {
			sugg := ev.cat.suggestions(t.Name)
			msg := say.Sprintf("unknown compound %q", t.Name)
			if len(sugg) > 0 {
				msg += "; did you mean " + quoteList(sugg) + "?"
			}
			errs = append(errs, spanError(in.Equation, t.NamePos, t.NameEnd, msg, sugg))
			return
		}
		ev.named = append(ev.named, c)
		r := ev.cat.reactant(c, comp)
		if c.isProton() && comp != protonComp {
			protonComp = comp
			protonComps++
		}
		coef := t.Coef
		if sign < 0 {
			coef = coef.Neg()
		}
		if i := slices.IndexFunc(nu, func(s stoich) bool { return s.r == r }); i >= 0 {
			sum, ok := nu[i].rat.Add(coef)
			if !ok {
				errs = append(errs, spanError(in.Equation, t.Pos, t.NameEnd, "the coefficients of this compound are too large to add", nil))
				return
			}
			nu[i].rat, nu[i].coef = sum, sum.Float()
			return
		}
		nu = append(nu, stoich{key: r.key, coef: coef.Float(), rat: coef, r: r, term: t})
	}
	for _, t := range eq.Left {
		add(t, -1)
	}
	for _, t := range eq.Right {
		add(t, 1)
	}
	if protonComps == 1 {
		kept := nu[:0]
		for _, s := range nu {
			if !s.r.isProton() {
				kept = append(kept, s)
			}
		}
		nu = kept
		out.Warnings = append(out.Warnings, Warning{Code: "proton", Message: "H+ is left out of the " +
			"transformed equation: the pH fixes its concentration, so it carries no term"})
	}
	ev.used = nu // the compounds the row names, for the result's list (see row)
	return nu, errs
}

// standardEnergy is ΔrG'° of the row: entered, or Σ ν ΔfG'° over reactants with data plus the transport
// work already put in out.Transport. A reactant without data is an error unless a ΔrG'° was entered.
//
// When atReference is set (see heatUnknown) the formation energies are those at 298.15 K.
func (ev *evaluation) standardEnergy(in *Row, nu []stoich, atReference bool, out *RowResult) (*float64, []RowError) {
	var errs []RowError
	var sum float64
	if out.Transport != nil {
		sum = out.Transport.Work
	}
	for k, s := range nu {
		r := s.r
		// A compound written in two compartments gets each note once.
		seen := slices.ContainsFunc(nu[:k], func(p stoich) bool { return p.r.compound == r.compound })
		once := func(code, msg string) {
			if !seen {
				out.Warnings = append(out.Warnings, Warning{Code: code, Message: msg})
			}
		}
		if r.approx != "" {
			once("approximate-data", "the data for "+r.name+" are approximate (the compound list says how)")
		}
		if r.own != nil && r.own.DfG0Prime != nil && in.DG0 == nil {
			once("entered-formation-energy", say.Sprintf("ΔfG'° of %s is used as entered and does not follow "+
				"changes of pH, I, pMg or temperature", r.name))
		}
		if !r.hasData {
			if in.DG0 == nil {
				errs = append(errs, spanError(in.Equation, s.term.NamePos, s.term.NameEnd, r.noData, nil))
			}
			continue
		}
		g := r.dfG0prime
		if atReference {
			g = ev.cat.atReference(r).dfG0prime
		}
		sum += s.coef * g
	}
	if in.DG0 != nil {
		v := *in.DG0
		msg := say.Sprintf("the entered ΔrG'° (%.2f kJ/mol) is used", v)
		if len(errs) == 0 {
			msg += say.Sprintf(" in place of the computed %.2f kJ/mol", sum)
		}
		out.Warnings = append(out.Warnings, Warning{Code: "entered-dG0", Message: msg})
		return &v, nil
	}
	if len(errs) > 0 {
		return nil, errs
	}
	return &sum, nil
}

// heatUnknown reports whether the row's ΔrG'° must be taken at 298.15 K: the temperature differs from it and
// some compound of the row has a species without ΔfH°, so Gibbs–Helmholtz cannot move the row as a whole.
// Moving only the compounds with ΔfH° would shift ΔrG'° by tens of kJ/mol for no physical reason (it would
// amount to assuming ΔfH° = ΔfG° for the others); holding ΔrG'° at its 298.15 K value (at the worksheet's
// pH, I and pMg) is the usual approximation when ΔrH'° is unknown (common practice, no source). The row
// says so in a warning.
func (ev *evaluation) heatUnknown(in *Row, nu []stoich, out *RowResult) bool {
	if in.DG0 != nil || math.Abs(ev.cond.Temperature-thermo.TRef) < temperatureTolerance {
		return false
	}
	var missing []string
	for _, s := range nu {
		if s.r.noEnthalpy && s.r.hasData && len(s.r.species) > 0 && !slices.Contains(missing, s.r.name) {
			missing = append(missing, s.r.name)
		}
	}
	if len(missing) == 0 {
		return false
	}
	out.Warnings = append(out.Warnings, Warning{Code: "no-enthalpy", Message: say.Sprintf(
		"no ΔfH° is known for %s, so ΔrG'° is taken at 298.15 K (at this pH, I and pMg), as if it did not "+
			"change with temperature; ΔrG' uses the worksheet's temperature", strings.Join(missing, ", "))})
	return true
}

// temperatureTolerance (K) is how close to 298.15 K a temperature counts as the reference temperature.
const temperatureTolerance = 1e-6

// lnQ is ln of the mass-action ratio with concentrations in mol/L; water counts at activity 1 and H+ is
// fixed by each compartment's pH, so neither enters.
func (ev *evaluation) lnQ(src string, nu []stoich) (float64, []RowError) {
	var lnQ float64
	var errs []RowError
	for _, s := range nu {
		if s.r.isWater() || s.r.isProton() || s.coef == 0 {
			continue
		}
		c, _ := ev.concentrationOf(s.r)
		if c.err != "" {
			errs = append(errs, spanError(src, s.term.NamePos, s.term.NameEnd,
				say.Sprintf("the concentration of %s (%q) is not usable: %s", s.r.name, c.text, c.err), nil))
			continue
		}
		lnQ += s.coef * math.Log(c.molar)
	}
	return lnQ, errs
}

// costNotes explains cost values that rest on an assumption.
func (ev *evaluation) costNotes(nu []stoich, out *RowResult) {
	for _, s := range nu {
		if s.r.compound.key == "PPi" && s.coef != 0 && !ev.values.overridden["PPi"] {
			out.Warnings = append(out.Warnings, Warning{Code: "pyrophosphate", Message: pyrophosphateNote})
			return
		}
	}
}

func quoteList(names []string) string {
	s := ""
	for i, n := range names {
		if i > 0 {
			s += ", "
		}
		s += say.Sprintf("%q", n)
	}
	return s
}
