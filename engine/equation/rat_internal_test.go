package equation

import (
	"math"
	"math/big"
	"math/rand/v2"
	"testing"
)

// TestRatArithmeticMatchesBig: Add and Mul give what math/big gives, overflow included, on seeded random
// values of every size up to the int64 limit.
func TestRatArithmeticMatchesBig(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for range 20000 {
		lim := int64(1) << (5 + rng.IntN(57))
		r, _ := NewRat(rng.Int64N(2*lim)-lim, 1+rng.Int64N(lim))
		s, _ := NewRat(rng.Int64N(2*lim)-lim, 1+rng.Int64N(lim))
		for _, op := range []struct {
			name string
			fast func(Rat) (Rat, bool)
			slow *big.Rat
		}{
			{"+", r.Add, new(big.Rat).Add(toBig(r), toBig(s))},
			{"×", r.Mul, new(big.Rat).Mul(toBig(r), toBig(s))},
		} {
			got, ok := op.fast(s)
			want, wantOK := fromBig(op.slow)
			if ok != wantOK || ok && got != want {
				t.Fatalf("%v %s %v = %v (%v), want %v (%v)", r, op.name, s, got, ok, want, wantOK)
			}
		}
	}
}

// TestRatWholeNumbersMatchBig checks Add's shortcut for whole numbers against math/big (the reference
// library), near the ends of int64 too, where a sum overflows or reaches math.MinInt64, which a Rat cannot
// hold.
func TestRatWholeNumbersMatchBig(t *testing.T) {
	edges := []int64{0, 1, -1, 2, -2, math.MaxInt64, -math.MaxInt64, math.MaxInt64 - 1, -math.MaxInt64 + 1,
		1 << 62, -(1 << 62), 1<<62 + 1}
	rng := rand.New(rand.NewPCG(3, 5))
	for range 2000 {
		edges = append(edges, rng.Int64()>>rng.IntN(63)*(1-2*rng.Int64N(2)))
	}
	for _, a := range edges {
		for _, b := range edges[:40] {
			r, s := Rat{a, 1}, Rat{b, 1}
			if a == math.MinInt64 || b == math.MinInt64 {
				continue
			}
			got, ok := r.Add(s)
			want, wantOK := fromBig(new(big.Rat).Add(toBig(r), toBig(s)))
			if ok != wantOK || ok && got != want {
				t.Fatalf("%d + %d = %v (%v), want %v (%v)", a, b, got, ok, want, wantOK)
			}
		}
	}
}

func toBig(r Rat) *big.Rat { return new(big.Rat).SetFrac64(r.Num, r.Den) }

func fromBig(x *big.Rat) (Rat, bool) {
	n, d := x.Num(), x.Denom()
	if !n.IsInt64() || !d.IsInt64() || n.Int64() == math.MinInt64 {
		return Rat{}, false
	}
	return Rat{n.Int64(), d.Int64()}, true
}
