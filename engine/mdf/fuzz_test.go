package mdf

import (
	"errors"
	"testing"
)

// decodeProblem turns fuzz bytes into a small problem:
//
//	byte 0: n = b mod 5 compounds; byte 1: m = 1 + b mod 5 reactions;
//	per compound 2 bytes: lower = −14 + 10·b/255, upper = lower + 10·b/255,
//	    with b = 0 fixing the compound and b = 255 crossing the bounds;
//	per reaction: ΔrG'° = int8(b)/2, k = b mod 5 entries of
//	    (compound b mod n, coefficient int8(b)/32).
//
// Missing bytes read as zero.
func decodeProblem(data []byte) *Problem {
	next := func() byte {
		if len(data) == 0 {
			return 0
		}
		b := data[0]
		data = data[1:]
		return b
	}
	n, m := int(next()%5), 1+int(next()%5)
	p := &Problem{RT: rt298, Lower: make([]float64, n), Upper: make([]float64, n)}
	for i := range n {
		p.Lower[i] = -14 + 10*float64(next())/255
		switch w := next(); w {
		case 255:
			p.Upper[i] = p.Lower[i] - 1
		default:
			p.Upper[i] = p.Lower[i] + 10*float64(w)/255
		}
	}
	for range m {
		r := Reaction{DG0: float64(int8(next())) / 2}
		k := int(next() % 5)
		for range k {
			c, v := next(), next()
			if n == 0 {
				continue
			}
			r.Compound = append(r.Compound, int(c)%n)
			r.Coef = append(r.Coef, float64(int8(v))/32)
		}
		p.Reactions = append(p.Reactions, r)
	}
	return p
}

// FuzzSolve checks that Solve never panics on decoded problems and returns
// either ErrBadBounds or a solution with a valid optimality certificate.
func FuzzSolve(f *testing.F) {
	f.Add([]byte{2, 0, 100, 200, 100, 200, 10, 2, 0, 224, 1, 32})
	f.Fuzz(func(t *testing.T, data []byte) {
		p := decodeProblem(data)
		sol, err := Solve(p)
		if err != nil {
			if !errors.Is(err, ErrBadBounds) {
				t.Fatalf("Solve(%+v): unexpected error %v", p, err)
			}
			return
		}
		if err := checkSolution(p, sol); err != nil {
			t.Fatalf("Solve(%+v): %v", p, err)
		}
	})
}
