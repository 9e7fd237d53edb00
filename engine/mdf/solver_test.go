package mdf

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"reflect"
	"testing"
)

// TestSolverReuse: one Solver, given seeded random problems of every size in a shuffled order (random and
// chain networks, degenerate ones with shared bounds and duplicated reactions, invented data) with invalid
// problems among them, gives each the solution Solve gives it afresh, bit for bit, or the same error: what
// it solved before does not show in its results.
func TestSolverReuse(t *testing.T) {
	rng := rand.New(rand.NewPCG(20261202, 1))
	var problems []*Problem
	for seed := range uint64(40) {
		m := 5 + rng.IntN(120) // randomNetwork needs 4 compounds or more
		problems = append(problems, randomNetwork(seed+9e6, m), chainNetwork(seed+9e6, 2+rng.IntN(60)))
		p := randomNetwork(seed+8e6, m)
		for i := range p.Lower {
			if i%3 == 1 {
				p.Lower[i] = p.Upper[i]
			}
		}
		for j := range p.Reactions {
			p.Reactions[j].DG0 = math.Round(p.Reactions[j].DG0 / 10)
		}
		p.Reactions = append(p.Reactions, p.Reactions[:m/3]...)
		problems = append(problems, p)
		if seed%10 == 0 {
			bad := randomNetwork(seed, 5)
			bad.Lower[2] = math.NaN()
			problems = append(problems, bad)
		}
	}
	rng.Shuffle(len(problems), func(i, j int) { problems[i], problems[j] = problems[j], problems[i] })
	var s Solver
	for round := range 2 {
		for i, p := range problems {
			what := fmt.Sprintf("round %d, problem %d (%d reactions)", round, i, len(p.Reactions))
			want, wantErr := Solve(p)
			got, err := s.Solve(p)
			switch {
			case (err == nil) != (wantErr == nil):
				t.Fatalf("%s: error %v, Solve's %v", what, err, wantErr)
			case err != nil:
				if !errors.Is(err, ErrBadBounds) || err.Error() != wantErr.Error() {
					t.Errorf("%s: error %v, Solve's %v", what, err, wantErr)
				}
			case !reflect.DeepEqual(got, want):
				t.Errorf("%s: the reused Solver's solution differs from Solve's:\n%+v\n%+v", what, got, want)
			}
		}
	}
}
