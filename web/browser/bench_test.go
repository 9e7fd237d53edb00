package browser

import (
	"fmt"
	"os"
	"slices"
	"testing"
)

// BenchmarkPage measures the page in Chromium: the recompute latency for 100 and 1,000 rows timed in
// the page with performance.now (bridge included: JSON.stringify, the engine call, JSON.parse; and the
// same plus drawing every panel), the time from opening the file to the first drawn result, and the
// size of the file. Targets: 100 rows < 1 ms, 1,000 rows < 10 ms (median per recompute), first result
// < 300 ms, file < 1.5 MB. The ns/op column counts the browser round trip of a whole batch and is not
// one of these figures; read the reported metrics.
func BenchmarkPage(b *testing.B) {
	for _, n := range []int{100, 1000} {
		b.Run(fmt.Sprintf("recompute/rows=%d", n), func(b *testing.B) { benchRecompute(b, n) })
	}
	b.Run("first-result", benchFirstResult)
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
	batch := 5
	const samples = 20
	// One sample is the mean of batch calls, since performance.now is coarsened to 0.1 ms.
	evalJS := fmt.Sprintf(`(() => {
		const doc = gibbsheetPage.store.doc, engine = gibbsheetPage.store.engine, out = [];
		for (let s = 0; s < %d; s++) {
			const t0 = performance.now();
			for (let i = 0; i < %d; i++) JSON.parse(engine.evaluate(JSON.stringify(doc)));
			out.push((performance.now() - t0) / %d);
		}
		return out; })()`, samples, batch, batch)
	drawJS := fmt.Sprintf(`(() => {
		const out = [];
		for (let s = 0; s < %d; s++) {
			const t0 = performance.now();
			for (let i = 0; i < %d; i++) gibbsheetPage.recompute();
			out.push((performance.now() - t0) / %d);
		}
		return out; })()`, samples, batch, batch)
	var evals, draws []float64
	for b.Loop() {
		evals = append(evals, eval[[]float64](p, evalJS)...)
		draws = append(draws, eval[[]float64](p, drawJS)...)
	}
	b.ReportMetric(median(evals), "ms/recompute")
	b.ReportMetric(median(draws), "ms/recompute+draw")
	p.noErrors()
}

func benchFirstResult(b *testing.B) {
	var firsts []float64
	for b.Loop() {
		p := openPage(b, 1400, 900)
		// Milliseconds from the start of the navigation to the first result drawn in the page.
		firsts = append(firsts, eval[float64](p, `performance.getEntriesByName("gibbsheet:first-result")[0].startTime`))
	}
	b.ReportMetric(median(firsts), "ms/first-result")
}
