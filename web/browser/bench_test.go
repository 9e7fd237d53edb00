package browser

import (
	"fmt"
	"os"
	"slices"
	"testing"
)

// BenchmarkPage measures the page in Chromium: the recompute latency for 100 and 1,000 rows after a
// keystroke that changes one row, timed in the page with performance.now (bridge included:
// JSON.stringify, the engine call, JSON.parse and merging; the same plus drawing every panel; and the
// analysis that follows in its own task), the time from opening the file to the first drawn result, and the
// size of the file. Targets: 100 rows < 1 ms, 1,000 rows < 10 ms (median per recompute), first result
// < 300 ms, file < 1.5 MB; and, for scale, the time Chromium takes to run the script of a nearly empty
// file. The ns/op column counts the browser round trip of a whole batch and is not
// one of these figures; read the reported metrics.
func BenchmarkPage(b *testing.B) {
	for _, n := range []int{100, 1000} {
		b.Run(fmt.Sprintf("recompute/rows=%d", n), func(b *testing.B) { benchRecompute(b, n) })
	}
	b.Run("first-result", benchFirstResult)
	b.Run("blank-file", benchBlankFile)
	b.Run("file", func(b *testing.B) {
		st, err := os.Stat(pagePath)
		if err != nil {
			b.Fatal(err)
		}
		for b.Loop() {
		}
		b.ReportMetric(float64(st.Size()), "bytes")
		b.ReportMetric(float64(st.Size())/1e6, "MB")
	})
}

func median(xs []float64) float64 {
	s := slices.Clone(xs)
	slices.Sort(s)
	if len(s) == 0 {
		return 0
	}
	if len(s)%2 == 1 {
		return s[len(s)/2]
	}
	return (s[len(s)/2-1] + s[len(s)/2]) / 2
}

func benchRecompute(b *testing.B, n int) {
	p := openPage(b, 1400, 900)
	// n rows made by repeating the demo's rows, with the demo's concentrations and conditions.
	eval[bool](p, fmt.Sprintf(`(() => {
		const demo = JSON.parse(document.getElementById("gibbsheet-worksheet").textContent);
		const doc = JSON.parse(JSON.stringify(demo));
		doc.rows = [];
		for (let i = 0; i < %d; i++) doc.rows.push({ ...demo.rows[i %% demo.rows.length], id: "b" + i });
		gibbsheetPage.loadDocument(doc, "bench");
		return gibbsheetPage.store.result.rows.length === %d && gibbsheetPage.store.result.rows.every(r => r.dG !== null);
	})()`, n, n))
	// A keystroke changes one row: the multiplier of the middle row goes 1, 2, 1, ... One sample is the mean
	// of batch keystrokes, since performance.now is coarsened to 0.1 ms.
	const batch, samples = 5, 20
	keystroke := fmt.Sprintf(`const row = gibbsheetPage.store.doc.rows[%d];
		const key = () => { row.times = row.times === 2 ? 1 : 2; };`, n/2)
	timed := func(body string) string {
		return fmt.Sprintf(`(() => { %s
			const engine = gibbsheetPage.store.engine, out = [];
			for (let s = 0; s < %d; s++) {
				let t = 0;
				for (let i = 0; i < %d; i++) { %s }
				out.push(t / %d);
			}
			return out; })()`, keystroke, samples, batch, body, batch)
	}
	// The page's engine call (JSON.stringify, gibbsheet.changes, JSON.parse, merging the unchanged rows);
	// the same and every panel drawn; the analysis that follows (gibbsheet.analysis, JSON.parse).
	evalJS := timed(`key(); const t0 = performance.now(); gibbsheetPage.evaluateDocument(); t += performance.now() - t0;`)
	drawJS := timed(`key(); const t0 = performance.now(); gibbsheetPage.recompute(); t += performance.now() - t0;`)
	analysisJS := timed(`key(); gibbsheetPage.evaluateDocument(); const t0 = performance.now(); JSON.parse(engine.analysis()); t += performance.now() - t0;`)
	var evals, draws, analyses []float64
	for b.Loop() {
		evals = append(evals, eval[[]float64](p, evalJS)...)
		draws = append(draws, eval[[]float64](p, drawJS)...)
		analyses = append(analyses, eval[[]float64](p, analysisJS)...)
	}
	eval[bool](p, `gibbsheetPage.settled().then(() => true)`)
	if !eval[bool](p, fmt.Sprintf(`gibbsheetPage.store.result.rows.length === %d && gibbsheetPage.store.result.mdf !== null`, n)) {
		b.Fatal("after the keystrokes the page does not hold every row and the analysis")
	}
	b.ReportMetric(median(evals), "ms/recompute")
	b.ReportMetric(median(draws), "ms/recompute+draw")
	b.ReportMetric(median(analyses), "ms/analysis")
	p.noErrors()
}
