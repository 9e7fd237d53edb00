package engine

import (
	"math"
	"slices"

	"gibbsheet/engine/mdf"
)

// A keystroke in a row's multiplier or note, in the title or in an entered concentration leaves the max-min
// driving force's linear program as it was. A Session keeps its latest analysis in an mdfMemo: when
// the next one builds the same problem (every number equal bit for bit, the same compound indices) it takes
// the solution instead of solving again, and when the rest of what the MDF shows (row ids, compound names,
// entered concentrations, bounds, rows left out) is equal too it takes the MDF and its encoding. The simplex
// method always starts afresh, from no earlier basis: mdf.Solve is a function of its problem alone, so a
// solution taken from the memo is the one a fresh evaluation computes (TestMDFMemoMatchesFresh).

// mdfMemo holds a Session's latest analysis and the buffers the next one builds its problem in. Its zero
// value holds none.
type mdfMemo struct {
	next, last mdfInputs // last: those of the analysis below, when valid
	valid      bool
	sol        *mdf.Solution // nil after an error
	err        error
	out        *MDF       // shared by the results that take it, so never changed but for its encoding
	solver     mdf.Solver // the working memory of the simplex method, which starts afresh on every problem

	encoded      *MDF    // the MDF encoded last (see encode)
	spans, spare []int32 // where each of its rows lies in its encoding, start and end; the next one's buffer
}

// mdfInputs is everything the MDF of a worksheet depends on but the ids of its rows, which the MDF kept
// holds. Building it stores no pointers but for the compounds, so that it does not slow down with the
// garbage collector's write barriers.
type mdfInputs struct {
	problem   mdf.Problem   // without Reactions until it is solved (see reactions)
	compounds []mdfCompound // by compound index in the problem
	leftOut   []string      // the ids of the rows without ΔrG'°

	index         map[string]int // compound index by reactant key, while building
	compound, end []int          // all reactions' compound indices; where each reaction's end
	coef, dg0     []float64      // all reactions' coefficients; each one's ΔrG'°
}

// mdfCompound is a compound of the problem as the MDF shows it.
type mdfCompound struct {
	key               string // the reactant's
	name, compartment string // as first written in the rows
	entered           float64
	bound             bound
}

// reset empties in, keeping its buffers.
func (in *mdfInputs) reset() {
	if in.index == nil {
		in.index = make(map[string]int, 32)
	}
	clear(in.index)
	in.problem.Reactions, in.problem.Lower, in.problem.Upper = in.problem.Reactions[:0], in.problem.Lower[:0], in.problem.Upper[:0]
	in.compounds, in.leftOut = in.compounds[:0], in.leftOut[:0]
	in.compound, in.end, in.coef, in.dg0 = in.compound[:0], in.end[:0], in.coef[:0], in.dg0[:0]
}

// build sets up the MDF linear program over the computed rows; water and H+ are fixed and stay out of it.
// prev, if not nil, is the latest analysis's: while the compounds of the terms are those of prev, in the
// same order, so are their indices, which saves looking them up. (If they are so far, a term whose compound
// is prev's for the same term has prev's index: it is either one of the compounds so far, the same in both,
// or, in both, the first one after them.)
func (in *mdfInputs) build(ev *evaluation, rows []computedRow, prev *mdfInputs) {
	p := &in.problem
	p.RT = ev.rt
	follow := prev != nil
	for _, cr := range rows {
		for k := range cr.nu {
			s := &cr.nu[k]
			if s.r.isWater() || s.r.isProton() || s.coef == 0 {
				continue
			}
			t, i := len(in.compound), 0
			if follow && t < len(prev.compound) && prev.compound[t] <= len(in.compounds) &&
				prev.compounds[prev.compound[t]].key == s.key {
				i = prev.compound[t]
			} else {
				if follow {
					follow = false
					for j := range in.compounds {
						in.index[in.compounds[j].key] = j
					}
				}
				var ok bool
				if i, ok = in.index[s.key]; !ok {
					i = len(in.compounds)
					in.index[s.key] = i
				}
			}
			if i == len(in.compounds) {
				c, _ := ev.concentrationOf(s.r)
				b := ev.boundOf(s.r)
				in.compounds = append(in.compounds, mdfCompound{key: s.key, name: s.term.Name,
					compartment: s.term.Compartment, entered: c.molar, bound: b})
				lo, hi := b.ln()
				p.Lower, p.Upper = append(p.Lower, lo), append(p.Upper, hi)
			}
			in.compound, in.coef = append(in.compound, i), append(in.coef, s.coef)
		}
		in.end = append(in.end, len(in.compound))
		in.dg0 = append(in.dg0, *ev.done[cr.index].result.DG0)
	}
}

// reactions gives the problem its reactions, which share one backing array each for compounds and
// coefficients: a pathway's worth of small slices is most of the set-up's time otherwise.
func (in *mdfInputs) reactions() *mdf.Problem {
	p := &in.problem
	p.Reactions = p.Reactions[:0]
	start := 0
	for j, end := range in.end {
		p.Reactions = append(p.Reactions, mdf.Reaction{DG0: in.dg0[j], Compound: in.compound[start:end:end],
			Coef: in.coef[start:end:end]})
		start = end
	}
	return p
}

// sameProblem reports whether in and o hold the same linear program, every number equal bit for bit.
func (in *mdfInputs) sameProblem(o *mdfInputs) bool {
	return math.Float64bits(in.problem.RT) == math.Float64bits(o.problem.RT) &&
		sameBits(in.problem.Lower, o.problem.Lower) && sameBits(in.problem.Upper, o.problem.Upper) &&
		slices.Equal(in.end, o.end) && slices.Equal(in.compound, o.compound) &&
		sameBits(in.coef, o.coef) && sameBits(in.dg0, o.dg0)
}

// sameShown reports whether in, built from the rows of ev, gives out, the MDF of o, which holds the same
// problem.
func (in *mdfInputs) sameShown(ev *evaluation, rows []computedRow, o *mdfInputs, out *MDF) bool {
	if len(out.Rows) != len(rows) || !slices.Equal(in.leftOut, o.leftOut) ||
		!slices.EqualFunc(in.compounds, o.compounds, func(a, b mdfCompound) bool {
			return a.name == b.name && a.compartment == b.compartment &&
				math.Float64bits(a.entered) == math.Float64bits(b.entered) &&
				math.Float64bits(a.bound.low) == math.Float64bits(b.bound.low) &&
				math.Float64bits(a.bound.high) == math.Float64bits(b.bound.high)
		}) {
		return false
	}
	for j, cr := range rows {
		if ev.done[cr.index].result.ID != out.Rows[j].ID {
			return false
		}
	}
	return true
}

func sameBits(a, b []float64) bool {
	return slices.EqualFunc(a, b, func(x, y float64) bool { return math.Float64bits(x) == math.Float64bits(y) })
}

// solve returns the solution of the problem in m.next, built from the rows of ev, taken from the latest
// analysis if it had the same problem, and whether the latest analysis's MDF holds as it is.
func (m *mdfMemo) solve(ev *evaluation, rows []computedRow) (sol *mdf.Solution, err error, same bool) {
	if m.valid && m.next.sameProblem(&m.last) {
		return m.sol, m.err, m.out != nil && m.next.sameShown(ev, rows, &m.last, m.out)
	}
	sol, err = m.solver.Solve(m.next.reactions())
	return sol, err, false
}

// keep makes m.next, with its solution and MDF, the latest analysis; the buffers of the one before are
// the next one's.
func (m *mdfMemo) keep(sol *mdf.Solution, err error, out *MDF) {
	m.next, m.last = m.last, m.next
	m.valid, m.sol, m.err, m.out = true, sol, err, out
}

// encode sets out.json, copying the encoding of each row of out that is, bit for bit, the row at the same
// place in the MDF encoded last from that one's encoding: an edit leaves the driving force of many rows as
// it was.
func (m *mdfMemo) encode(out *MDF) {
	prev, spans, next := m.encoded, m.spans, m.spare[:0]
	j := 0
	out.json = out.appendJSONRows(make([]byte, 0, mdfSizeGuess(out)), func(r *MDFRow, dst []byte) []byte {
		start := len(dst)
		if p := 2 * j; prev != nil && j < len(prev.Rows) && sameMDFRow(&prev.Rows[j], r) {
			dst = append(dst, prev.json[spans[p]:spans[p+1]]...)
		} else {
			dst = r.appendJSON(dst)
		}
		next = append(next, int32(start), int32(len(dst)))
		j++
		return dst
	})
	m.encoded, m.spans, m.spare = out, next, spans
}

func sameMDFRow(a, b *MDFRow) bool {
	return a.ID == b.ID && a.Bottleneck == b.Bottleneck && math.Float64bits(a.DrivingForce) == math.Float64bits(b.DrivingForce) &&
		math.Float64bits(a.Shadow) == math.Float64bits(b.Shadow)
}
