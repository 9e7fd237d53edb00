package engine

import (
	"fmt"
	"testing"
)

// benchRows cycles through the steps of glycolysis so that the benchmark parses, resolves and transforms
// real equations; the concentrations make every compound's lookup go through the map.
var benchRows = []string{
	"glucose + ATP = glucose 6-phosphate + ADP",
	"glucose 6-phosphate = fructose 6-phosphate",
	"fructose 6-phosphate + ATP = fructose 1,6-bisphosphate + ADP",
	"fructose 1,6-bisphosphate = dihydroxyacetone phosphate + glyceraldehyde 3-phosphate",
	"dihydroxyacetone phosphate = glyceraldehyde 3-phosphate",
	"glyceraldehyde 3-phosphate + NAD+ + Pi = 1,3-bisphosphoglycerate + NADH",
	"1,3-bisphosphoglycerate + ADP = 3-phosphoglycerate + ATP",
	"3-phosphoglycerate = 2-phosphoglycerate",
	"2-phosphoglycerate = phosphoenolpyruvate + H2O",
	"phosphoenolpyruvate + ADP = pyruvate + ATP",
}

func benchSheet(n int) []byte {
	eqs := make([]string, n)
	for i := range eqs {
		eqs[i] = benchRows[i%len(benchRows)]
	}
	return []byte(sheet(`"concentrations":{"ATP":"5 mM","ADP":"0.5 mM","Pi":"3 mM","NAD+":"1 mM","NADH":"0.05 mM"}`, eqs...))
}

func BenchmarkEvaluateJSON(b *testing.B) {
	for _, n := range []int{10, 100, 1000} {
		doc := benchSheet(n)
		b.Run(fmt.Sprintf("rows=%d", n), func(b *testing.B) {
			b.SetBytes(int64(len(doc)))
			for b.Loop() {
				if _, err := EvaluateJSON(doc); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
