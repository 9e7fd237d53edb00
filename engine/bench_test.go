package engine

import (
	"bytes"
	"encoding/json"
	"fmt"
	"strconv"
	"strings"
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

// BenchmarkEvaluateJSON: "cold" forgets remembered rows and equations, and the worksheet kept from the last
// call, before every evaluation; "keystroke" changes one row's multiplier between evaluations, as typing in
// the page does, so the other rows come from memory (see rowMemo) and the max-min driving force's problem
// stays the same (see mdfMemo); "keystroke-equation" changes the equation of a row in the middle between
// two forms with different coefficients, so that the max-min driving force is solved again every time.
func BenchmarkEvaluateJSON(b *testing.B) {
	for _, n := range []int{10, 100, 1000} {
		doc := benchSheet(n)
		b.Run(fmt.Sprintf("cold/rows=%d", n), func(b *testing.B) {
			b.SetBytes(int64(len(doc)))
			for b.Loop() {
				rows = &rowMemo{}
				parsed = newMemo[parseOutcome](4096)
				shared = Session{}
				if _, err := EvaluateJSON(doc); err != nil {
					b.Fatal(err)
				}
			}
		})
		b.Run(fmt.Sprintf("keystroke/rows=%d", n), func(b *testing.B) {
			alternate(b, [2][]byte{doc, bytes.Replace(doc, []byte(`"id":"r1",`), []byte(`"id":"r1","times":2,`), 1)})
		})
		b.Run(fmt.Sprintf("keystroke-equation/rows=%d", n), func(b *testing.B) { alternate(b, equationEdit(doc, n)) })
	}
}

// alternate evaluates the two documents in turn with EvaluateJSON.
func alternate(b *testing.B, docs [2][]byte) {
	b.SetBytes(int64(len(docs[0])))
	i := 0
	for b.Loop() {
		i++
		if _, err := EvaluateJSON(docs[i%2]); err != nil {
			b.Fatal(err)
		}
	}
}

// equationEdit returns the benchmark worksheet of n rows and the same with the equation of its middle row
// written with every coefficient doubled, which changes the row's ΔrG'° and coefficients in the max-min
// driving force's problem.
func equationEdit(doc []byte, n int) [2][]byte {
	i := n/2 - 1
	eq, _ := json.Marshal(benchRows[i%len(benchRows)])
	doubled, _ := json.Marshal("2 " + strings.ReplaceAll(strings.ReplaceAll(benchRows[i%len(benchRows)],
		" + ", " + 2 "), " = ", " = 2 "))
	row := fmt.Sprintf(`{"id":"r%d","equation":`, i+1)
	edited := bytes.Replace(doc, []byte(row+string(eq)), []byte(row+string(doubled)), 1)
	if bytes.Equal(edited, doc) {
		panic("equationEdit: row r" + strconv.Itoa(i+1) + " not found")
	}
	return [2][]byte{doc, edited}
}

// BenchmarkSession is the page's live path: each iteration changes one row's multiplier and asks the
// session for the changes since its previous answer (ChangesJSON), without the analysis, which "analysis"
// times after the same keystroke; "analysis-equation" times it after the edit of keystroke-equation
// (BenchmarkEvaluateJSON), which changes the max-min driving force's problem.
func BenchmarkSession(b *testing.B) {
	for _, n := range []int{10, 100, 1000} {
		doc := benchSheet(n)
		docs := [2][]byte{doc, bytes.Replace(doc, []byte(fmt.Sprintf(`"id":"r%d",`, n/2)),
			[]byte(fmt.Sprintf(`"id":"r%d","times":2,`, n/2)), 1)}
		b.Run(fmt.Sprintf("changes/rows=%d", n), func(b *testing.B) {
			s := new(Session)
			seq := 0
			b.SetBytes(int64(len(doc)))
			for b.Loop() {
				seq++
				if _, err := s.ChangesJSON(docs[seq%2], seq-1); err != nil {
					b.Fatal(err)
				}
			}
		})
		b.Run(fmt.Sprintf("analysis/rows=%d", n), func(b *testing.B) { analyseAfter(b, docs) })
		b.Run(fmt.Sprintf("analysis-equation/rows=%d", n), func(b *testing.B) { analyseAfter(b, equationEdit(doc, n)) })
	}
}

// analyseAfter times AnalysisJSON after ChangesJSON of each of the two documents in turn.
func analyseAfter(b *testing.B, docs [2][]byte) {
	s := new(Session)
	seq := 0
	for b.Loop() {
		b.StopTimer()
		seq++
		if _, err := s.ChangesJSON(docs[seq%2], seq-1); err != nil {
			b.Fatal(err)
		}
		b.StartTimer()
		if _, err := s.AnalysisJSON(); err != nil {
			b.Fatal(err)
		}
	}
}
