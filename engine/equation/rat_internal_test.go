package equation

import (
	"math/big"
	"math/rand/v2"
	"testing"
)

// TestRatFastPathMatchesBig: the int64 fast path of Add and Mul gives what math/big gives, on seeded random
// values on both sides of its limit.
func TestRatFastPathMatchesBig(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for range 20000 {
		lim := int64(1) << (5 + rng.IntN(30))
		r, _ := NewRat(rng.Int64N(2*lim)-lim, 1+rng.Int64N(lim))
		s, _ := NewRat(rng.Int64N(2*lim)-lim, 1+rng.Int64N(lim))
		for _, op := range []struct {
			name string
			fast func(Rat) (Rat, bool)
			slow *big.Rat
		}{
			{"+", r.Add, new(big.Rat).Add(r.big(), s.big())},
			{"×", r.Mul, new(big.Rat).Mul(r.big(), s.big())},
		} {
			got, ok := op.fast(s)
			want, wantOK := fromBig(op.slow)
			if ok != wantOK || ok && got != want {
				t.Fatalf("%v %s %v = %v (%v), want %v (%v)", r, op.name, s, got, ok, want, wantOK)
			}
		}
	}
}
