package browser

import (
	"fmt"
	"testing"
)

// BenchmarkMDF measures the max-min driving force in the page: gibbsheet.evaluate (bridge and JSON
// included) on a worksheet of n rows forming a linear chain X0 → X1 → … → Xn of the worksheet's own
// compounds with entered ΔrG'°, so every evaluation solves an MDF problem of n reactions and n + 1
// concentrations. Target: median under 20 ms for 100 reactions. Read the ms/evaluate metric; ns/op
// counts a whole batch with its browser round trip.
func BenchmarkMDF(b *testing.B) {
	for _, n := range []int{20, 100, 500} {
		b.Run(fmt.Sprintf("reactions=%d", n), func(b *testing.B) { benchMDF(b, n) })
	}
}

func benchMDF(b *testing.B, n int) {
	p := openPage(b, 1400, 900)
	// ΔrG'° cycles through −6, +2, −3, −1 kJ/mol (invented, for timing only); X0 and Xn are held at
	// 5 mM and 0.1 mM so the optimum is not at a corner of the default bounds.
	ok := eval[bool](p, fmt.Sprintf(`(() => {
		const n = %d, dg = [-6, 2, -3, -1];
		const doc = { format: "gibbsheet-worksheet/1", title: "chain", compounds: [], rows: [],
			bounds: { compounds: { X0: ["5 mM", "5 mM"] } } };
		doc.bounds.compounds["X" + n] = ["0.1 mM", "0.1 mM"];
		for (let i = 0; i <= n; i++) doc.compounds.push({ id: "X" + i });
		for (let i = 0; i < n; i++) doc.rows.push({ id: "r" + i, equation: "X" + i + " = X" + (i + 1), dG0: dg[i %% 4] });
		globalThis.__mdfDoc = JSON.stringify(doc);
		const res = JSON.parse(gibbsheet.evaluate(globalThis.__mdfDoc));
		return res.mdf !== null && res.mdf.rows.length === n && res.mdf.concentrations.length === n + 1;
	})()`, n))
	if !ok {
		b.Fatalf("the %d-row chain has no MDF of %d rows", n, n)
	}
	const samples = 10
	batch := 5
	if n >= 500 {
		batch = 2
	}
	js := fmt.Sprintf(`(() => {
		const out = [], text = globalThis.__mdfDoc;
		for (let s = 0; s < %d; s++) {
			const t0 = performance.now();
			for (let i = 0; i < %d; i++) JSON.parse(gibbsheet.evaluate(text));
			out.push((performance.now() - t0) / %d);
		}
		return out; })()`, samples, batch, batch)
	var ms []float64
	for b.Loop() {
		ms = append(ms, eval[[]float64](p, js)...)
	}
	b.ReportMetric(median(ms), "ms/evaluate")
	p.noErrors()
}
