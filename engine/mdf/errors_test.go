package mdf

import (
	"errors"
	"math"
	"strings"
	"testing"
)

func TestErrors(t *testing.T) {
	good := func() *Problem {
		lo, up := bounds(1e-6, 1e-2, 1e-6, 1e-2)
		return &Problem{RT: rt298, Lower: lo, Upper: up, Reactions: []Reaction{rxn(5, 0, -1, 1, 1)}}
	}
	tests := []struct {
		name     string
		edit     func(*Problem)
		is       error
		compound int // for ErrBadBounds: the compound named, else -1
		msg      string
	}{
		{"lower above upper", func(p *Problem) { p.Lower[1], p.Upper[1] = -3, -4 }, ErrBadBounds, 1, "compound 1"},
		{"NaN bound", func(p *Problem) { p.Lower[0] = math.NaN() }, ErrBadBounds, 0, "compound 0"},
		{"infinite bound", func(p *Problem) { p.Upper[1] = math.Inf(1) }, ErrBadBounds, 1, "compound 1"},
		{"minus infinite bound", func(p *Problem) { p.Lower[0] = math.Inf(-1) }, ErrBadBounds, 0, "compound 0"},
		{"NaN ΔrG'°", func(p *Problem) { p.Reactions[0].DG0 = math.NaN() }, ErrBadReaction, -1, "reaction 0"},
		{"infinite coefficient", func(p *Problem) { p.Reactions[0].Coef[1] = math.Inf(-1) }, ErrBadReaction, -1, "coefficient of compound 1"},
		{"zero RT", func(p *Problem) { p.RT = 0 }, ErrBadRT, -1, "RT"},
		{"NaN RT", func(p *Problem) { p.RT = math.NaN() }, ErrBadRT, -1, "RT"},
		{"no reactions", func(p *Problem) { p.Reactions = nil }, ErrNoReactions, -1, "no reactions"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			p := good()
			tc.edit(p)
			sol, err := Solve(p)
			if !errors.Is(err, tc.is) || sol != nil {
				t.Fatalf("Solve = %v, %v; want error %v", sol, err, tc.is)
			}
			if !strings.Contains(err.Error(), tc.msg) {
				t.Errorf("error %q does not mention %q", err, tc.msg)
			}
			var be *BoundsError
			if tc.compound >= 0 && (!errors.As(err, &be) || be.Compound != tc.compound) {
				t.Errorf("error %v does not name compound %d", err, tc.compound)
			}
		})
	}
}

// TestErrorsJoined checks that every bad compound is reported, not only the
// first.
func TestErrorsJoined(t *testing.T) {
	p := &Problem{RT: rt298, Lower: []float64{0, 1, -1, 2}, Upper: []float64{0, 0, 0, 1},
		Reactions: []Reaction{rxn(0, 0, -1, 3, 1)}}
	_, err := Solve(p)
	for _, want := range []string{"compound 1", "compound 3"} {
		if err == nil || !strings.Contains(err.Error(), want) {
			t.Errorf("error %v does not mention %s", err, want)
		}
	}
	if err != nil && strings.Contains(err.Error(), "compound 2") {
		t.Errorf("error %v mentions the valid compound 2", err)
	}
}

func TestPanics(t *testing.T) {
	tests := []struct {
		name string
		p    *Problem
	}{
		{"bounds lengths differ", &Problem{RT: 1, Lower: []float64{0}, Upper: nil, Reactions: []Reaction{{}}}},
		{"coefficients length", &Problem{RT: 1, Lower: []float64{0}, Upper: []float64{0},
			Reactions: []Reaction{{Compound: []int{0}}}}},
		{"index out of range", &Problem{RT: 1, Lower: []float64{0}, Upper: []float64{0},
			Reactions: []Reaction{rxn(0, 1, 1)}}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			defer func() {
				if recover() == nil {
					t.Error("no panic")
				}
			}()
			Solve(tc.p)
		})
	}
}
