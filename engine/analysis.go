package engine

import (
	"errors"
	"math"
	"strconv"
	"strings"

	"gibbsheet/engine/internal/say"
	"gibbsheet/engine/mdf"
)

// MDF is the max-min driving force of the pathway (Noor et al., PLoS Comput Biol 10:e1003483, 2014): the
// largest value that the smallest driving force −ΔrG' of the rows can take for concentrations within the
// bounds, with the concentrations that reach it.
type MDF struct {
	DrivingForce   float64           `json:"drivingForce"` // kJ/mol; negative: no concentrations drive every row
	Bottlenecks    []string          `json:"bottlenecks"`  // ids of the rows whose constraint binds
	Concentrations []OptimalConc     `json:"concentrations"`
	Rows           []MDFRow          `json:"rows"`
	Binding        []BindingBound    `json:"binding"` // the bounds that limit the MDF
	LeftOut        []string          `json:"leftOut"` // rows without ΔrG'°, not in the analysis
	Message        string            `json:"message"`
	Solver         map[string]string `json:"-"`

	json []byte // for an MDF a Session keeps (see mdfMemo): the MDF as appendJSON writes it
}

// OptimalConc is one compound's concentration at the MDF optimum (mol/L), beside its bounds and the
// concentration in use in the rows.
type OptimalConc struct {
	Compound      string  `json:"compound"`
	Concentration float64 `json:"concentration"`
	Entered       float64 `json:"entered"`
	Low           float64 `json:"low"`
	High          float64 `json:"high"`
}

// MDFRow is a row's driving force at the optimum; Shadow is how much the MDF falls per kJ/mol added to the
// row's ΔrG'° (the dual value; the shadows sum to 1).
type MDFRow struct {
	ID           string  `json:"id"`
	DrivingForce float64 `json:"drivingForce"`
	Shadow       float64 `json:"shadow"`
	Bottleneck   bool    `json:"bottleneck"`
}

// BindingBound is a concentration bound that holds the MDF down: relaxing it would raise the MDF.
type BindingBound struct {
	Compound string  `json:"compound"`
	Side     string  `json:"side"` // "low", "high", or "fixed" for a compound held at one concentration
	Bound    float64 `json:"bound"`
}

// FluxForce relates a row's ΔrG' to its one-way fluxes (Beard and Qian, PLoS ONE 2:e144, 2007):
// J+/J− = exp(−ΔrG'/RT). ReverseShare = J−/J+ (at most 1) is the share of the forward flux that the reverse
// flux cancels.
type FluxForce struct {
	Ratio        *float64 `json:"ratio"` // nil where it overflows; Log10Ratio still carries it
	Log10Ratio   float64  `json:"log10Ratio"`
	ReverseShare float64  `json:"reverseShare"`
}

// Remedy is the smallest change of one concentration, within its bounds, that brings an uphill row to
// ΔrG' = 0; any further change makes it downhill.
type Remedy struct {
	Compound string  `json:"compound"`
	From     float64 `json:"from"`   // mol/L, in use now
	To       float64 `json:"to"`     // mol/L
	Factor   float64 `json:"factor"` // To / From
}

// computedRow is a row that entered the totals, with its stoichiometry.
type computedRow struct {
	index int
	nu    []stoich
}

// analyse adds the max-min driving force of the rows that entered the totals to the result (the rows'
// flux-force relation and remedies come with the rows, see flux). An evaluation of a Session takes what it
// can from the Session's latest analysis, and the MDF it keeps is encoded once (see mdfMemo).
func (ev *evaluation) analyse() {
	memo := ev.analysis
	if memo == nil {
		memo = new(mdfMemo)
	}
	m := ev.maxMinDrivingForce(ev.computed, memo)
	if ev.analysis != nil && m != nil && m.json == nil {
		ev.analysis.encode(m)
	}
	ev.res.MDF = m
}

// mdfSizeGuess is a little more than the bytes of m encoded, with names and ids of a usual length.
func mdfSizeGuess(m *MDF) int {
	return 512 + len(m.Message) + 96*len(m.Rows) + 160*len(m.Concentrations) + 96*len(m.Binding) + 16*len(m.LeftOut)
}

// flux sets the row's flux-force ratio and, for an uphill step, the smallest single change of concentration
// that would make it run forward.
func (ev *evaluation) flux(out *RowResult, nu []stoich) {
	if out.DG == nil {
		return
	}
	dg := *out.DG
	logRatio := -dg / (ev.rt * math.Ln10)
	out.FluxForce = &FluxForce{Ratio: positiveOrNil(math.Pow(10, logRatio)), Log10Ratio: logRatio,
		ReverseShare: math.Min(1, math.Exp(dg/ev.rt))}
	if out.Status == StatusUphill {
		out.Remedy = ev.remedy(dg, nu)
	}
}

// remedy finds the compound whose concentration, changed by the smallest factor within its bounds, brings
// ΔrG' to zero: ΔrG' + RT ν_i Δln c_i = 0, so Δln c_i = −ΔrG'/(RT ν_i).
func (ev *evaluation) remedy(dg float64, nu []stoich) *Remedy {
	var best *Remedy
	bestStep := math.Inf(1)
	for _, s := range nu {
		if s.coef == 0 || s.r.isWater() || s.r.isProton() {
			continue
		}
		c, _ := ev.concentrationOf(s.r)
		step := -dg / (ev.rt * s.coef)
		to := c.molar * math.Exp(step)
		b := ev.boundOf(s.r)
		if to < b.low*(1-1e-12) || to > b.high*(1+1e-12) || math.Abs(step) >= bestStep {
			continue
		}
		bestStep = math.Abs(step)
		best = &Remedy{Compound: s.term.Name + tagOf(s.term.Compartment), From: c.molar, To: to, Factor: to / c.molar}
	}
	return best
}

// maxMinDrivingForce builds the MDF linear program over the computed rows and solves it, or takes its
// solution, or the whole MDF, from memo, which then holds this analysis.
func (ev *evaluation) maxMinDrivingForce(rows []computedRow, memo *mdfMemo) *MDF {
	in := &memo.next
	in.reset()
	for i, m := range ev.done {
		if m.result.DG0 == nil {
			in.leftOut = append(in.leftOut, ev.ws.Rows[i].ID)
		}
	}
	if len(in.leftOut) > 0 {
		ev.warn(Warning{Code: "mdf-left-out", Path: "rows", Message: say.Sprintf(
			"the max-min driving force leaves out the row(s) without ΔrG'°: %s", strings.Join(in.leftOut, ", "))})
	}
	if len(rows) == 0 {
		return nil
	}
	var prev *mdfInputs
	if memo.valid {
		prev = &memo.last
	}
	in.build(ev, rows, prev)
	sol, err, same := memo.solve(ev, rows)
	if err != nil {
		memo.keep(nil, err, nil)
		msg := "the max-min driving force could not be computed: " + err.Error()
		if errors.Is(err, mdf.ErrNumerical) {
			msg += " (please report the worksheet)"
		}
		ev.warn(Warning{Code: "mdf-failed", Message: msg})
		return nil
	}
	if same {
		memo.keep(sol, nil, memo.out)
		return memo.out
	}
	out := &MDF{DrivingForce: sol.MDF, Bottlenecks: []string{}, Concentrations: make([]OptimalConc, 0, len(in.compounds)),
		Rows: make([]MDFRow, 0, len(rows)), Binding: []BindingBound{}, LeftOut: append([]string{}, in.leftOut...)}
	for j, cr := range rows {
		id := ev.done[cr.index].result.ID
		out.Rows = append(out.Rows, MDFRow{ID: id, DrivingForce: sol.DrivingForce[j], Shadow: sol.Shadow[j],
			Bottleneck: sol.Bottleneck[j]})
		if sol.Bottleneck[j] {
			out.Bottlenecks = append(out.Bottlenecks, id)
		}
	}
	for i, c := range in.compounds {
		name, b := c.name+tagOf(c.compartment), c.bound
		out.Concentrations = append(out.Concentrations, OptimalConc{Compound: name, Concentration: math.Exp(sol.LnConc[i]),
			Entered: c.entered, Low: b.low, High: b.high})
		switch {
		case (sol.LowerBinding[i] || sol.UpperBinding[i]) && b.low == b.high:
			out.Binding = append(out.Binding, BindingBound{Compound: name, Side: "fixed", Bound: b.low})
		case sol.LowerBinding[i]:
			out.Binding = append(out.Binding, BindingBound{Compound: name, Side: "low", Bound: b.low})
		case sol.UpperBinding[i]:
			out.Binding = append(out.Binding, BindingBound{Compound: name, Side: "high", Bound: b.high})
		}
	}
	out.Message = mdfMessage(out)
	memo.keep(sol, nil, out)
	return out
}

func mdfMessage(m *MDF) string {
	var b strings.Builder
	steps := strings.Join(m.Bottlenecks, ", ")
	if m.DrivingForce < 0 {
		b.WriteString("no concentrations within the bounds let every step run forward: at best the bottleneck step(s) ")
		b.WriteString(steps)
		b.WriteString(" stay uphill by ")
		b.WriteString(strconv.FormatFloat(-m.DrivingForce, 'f', 1, 64))
		b.WriteString(" kJ/mol")
	} else {
		b.WriteString("every step can run forward within the bounds, with at least ")
		b.WriteString(strconv.FormatFloat(m.DrivingForce, 'f', 1, 64))
		b.WriteString(" kJ/mol of driving force; the bottleneck step(s): ")
		b.WriteString(steps)
	}
	for i, bb := range m.Binding {
		if i == 0 {
			b.WriteString("; the bounds that limit it: ")
		} else {
			b.WriteString(", ")
		}
		b.WriteString(bb.Compound)
		if bb.Side == "fixed" {
			b.WriteString(" fixed at ")
		} else {
			b.WriteString(" at its ")
			b.WriteString(bb.Side)
			b.WriteString(" bound ")
		}
		b.WriteString(formatMolar(bb.Bound))
	}
	return b.String()
}

// formatMolar writes a concentration with the unit that keeps the number between 1 and 1000.
func formatMolar(c float64) string {
	for _, u := range []struct {
		name   string
		factor float64
	}{{"M", 1}, {"mM", 1e-3}, {"µM", 1e-6}, {"nM", 1e-9}} {
		if c >= u.factor {
			return strconv.FormatFloat(c/u.factor, 'g', 3, 64) + " " + u.name
		}
	}
	return strconv.FormatFloat(c/1e-12, 'g', 3, 64) + " pM"
}
