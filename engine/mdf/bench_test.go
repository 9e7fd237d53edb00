package mdf

import (
	"fmt"
	"testing"
)

// BenchmarkSolve compares Solve with gonum's dense lp.Simplex on the same
// seeded random networks (randomNetwork). gonum is skipped at n=500, where
// one solve takes far longer than the benchmark budget.
func BenchmarkSolve(b *testing.B) { benchSolvers(b, randomNetwork) }

// BenchmarkSolveChain is the hard case: a linear pathway where many
// reactions share the MDF, so the basis kernel grows to tens or hundreds
// of rows (chainNetwork). gonum is skipped at n=500.
func BenchmarkSolveChain(b *testing.B) { benchSolvers(b, chainNetwork) }

func benchSolvers(b *testing.B, network func(seed uint64, m int) *Problem) {
	solvers := []struct {
		name  string
		solve func(*Problem) (*Solution, error)
		max   int
	}{
		{"gonum", SolveGonum, 100},
		{"own", Solve, 500},
	}
	for _, s := range solvers {
		for _, m := range []int{20, 100, 500} {
			if m > s.max {
				continue
			}
			p := network(uint64(m), m)
			b.Run(fmt.Sprintf("%s/n=%d", s.name, m), func(b *testing.B) {
				for b.Loop() {
					if _, err := s.solve(p); err != nil {
						b.Fatal(err)
					}
				}
			})
		}
	}
}
