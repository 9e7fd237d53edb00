package engine

import (
	"slices"
	"strings"

	"gibbsheet/engine/internal/say"
	"gibbsheet/engine/thermo"
)

// transport finds what a row carries between compartments and the work of carrying it. A compound that
// the row consumes in one compartment and produces in another is moved, in the amount both sides share;
// each mole moved adds thermo.TransportWork (the pH term of the hydrogen atoms it carries and the electrical
// work of its charge, Jol et al. 2010) to ΔrG'°. H+ written in two compartments is moved the same way. A row
// whose compounds sit in several compartments without such pairs gets a warning, since where its unpaired
// compounds cross is not written.
//
// When atReference is set (see heatUnknown) the work is that at 298.15 K, like the row's formation energies.
func (ev *evaluation) transport(nu []stoich, atReference bool, out *RowResult) []Move {
	if !slices.ContainsFunc(nu, func(s stoich) bool { return s.r.comp != nu[0].r.comp }) {
		return nil // one compartment: nothing crosses
	}
	// Group the reactants of each compound, in order of appearance.
	var order []string
	groups := map[string][]int{}
	for i, s := range nu {
		k := s.r.compound.key
		if _, ok := groups[k]; !ok {
			order = append(order, k)
		}
		groups[k] = append(groups[k], i)
	}
	var moves []Move
	var work float64
	var unpaired []string
	unpairedIn := map[string]bool{}
	for _, k := range order {
		idx := groups[k]
		left := make([]float64, len(idx)) // amount still to pair: consumed (−) or produced (+)
		for j, i := range idx {
			left[j] = nu[i].coef
		}
		for a := range idx {
			for b := range idx {
				from, to := nu[idx[a]].r, nu[idx[b]].r
				if left[a] >= 0 || left[b] <= 0 || from.comp == to.comp {
					continue
				}
				if atReference {
					from, to = ev.cat.atReference(from), ev.cat.atReference(to)
				}
				amount := min(-left[a], left[b])
				left[a] += amount
				left[b] -= amount
				w := thermo.TransportWork(from.meanH, from.meanZ, from.comp.cond, to.comp.cond, from.comp.psi, to.comp.psi)
				moves = append(moves, Move{Compound: from.compound.displayName(), From: from.comp.id, To: to.comp.id,
					Amount: amount, Work: w})
				work += amount * w
			}
		}
		for j, i := range idx {
			if left[j] != 0 && !nu[i].r.isWater() && !nu[i].r.isProton() {
				unpaired = append(unpaired, nu[i].term.String())
				unpairedIn[nu[i].r.comp.id] = true
			}
		}
	}
	if len(moves) > 0 {
		out.Transport = &Transport{Moves: moves, Work: work}
	}
	// Chemistry in one compartment with things carried across is fine; unpaired compounds in two or more
	// compartments mean something crosses that the row does not say.
	if len(unpairedIn) > 1 {
		out.Warnings = append(out.Warnings, Warning{Code: "compartments-unpaired", Message: say.Sprintf(
			"this row spans compartments, but %s do(es) not cross with a partner on the other side: their "+
				"electrical and pH work is not counted; write the transport as its own row", strings.Join(unpaired, ", "))})
	}
	return moves
}

// displayName is how a compound is named in messages and moves: its library id or own id.
func (c *compound) displayName() string {
	if c.lib != nil {
		return c.lib.ID
	}
	return c.own.ID
}

// protonsDown counts the protons moved down their electrochemical gradient (work < 0) less those pumped up.
func protonsDown(moves []Move) float64 {
	var n float64
	for _, m := range moves {
		if m.Compound != protonID {
			continue
		}
		switch {
		case m.Work < 0:
			n += m.Amount
		case m.Work > 0:
			n -= m.Amount
		}
	}
	return n
}
