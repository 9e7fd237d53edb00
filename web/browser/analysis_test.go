package browser

import (
	"context"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"
)

// chainSheet is the hand-derived chain of engine/analysis_test.go: A fixed at 5 mM and D at 0.1 mM,
// B and C free within 1 µM–10 mM, rows A = B (−10 kJ/mol), B = C (+5), C = D (−2), entered ΔrG'°.
const chainSheet = `{"format":"gibbsheet-worksheet/1","title":"chain","compounds":[{"id":"A"},{"id":"B"},{"id":"C"},{"id":"D"}],
 "bounds":{"default":["1 uM","10 mM"],"compounds":{"A":["5 mM","5 mM"],"D":["0.1 mM","0.1 mM"]}},
 "rows":[{"id":"1","equation":"A = B","dG0":-10},{"id":"2","equation":"B = C","dG0":5},{"id":"3","equation":"C = D","dG0":-2}]}`

// rtRef is RT at 298.15 K in kJ/mol.
var rtRef = R * 298.15

func (p *page) load(doc string) {
	p.t.Helper()
	eval[bool](p, fmt.Sprintf(`(() => { gibbsheetPage.loadDocument(JSON.parse(%s), "test"); return true; })()`, jsString(doc)))
}

// mdfShown reads the MDF figure of the analysis panel.
func (p *page) mdfShown() float64 {
	p.t.Helper()
	return shownNumber(p.t.(*testing.T), p.text("#mdf-value"))
}

// TestMDFPanel checks the MDF figure, the marked bottlenecks, the flux-force columns and the remedy on
// the hand-derived chain, then edits a bound and the unit.
func TestMDFPanel(t *testing.T) {
	p := openPage(t, 1400, 1000)
	p.load(chainSheet)
	p.waitFor(`gibbsheetPage.store.doc.title === "chain"`)
	// Derived by hand in engine/analysis_test.go: B sits at its 10 mM bound and rows 2 and 3 share
	// −3 − RT ln(D/B) = −3 + RT ln 100 equally, so MDF = (−3 + RT ln 100)/2 = 4.208 kJ/mol.
	want := (-3 + rtRef*math.Log(100)) / 2
	if got := p.mdfShown(); math.Abs(got-want) > 0.005+1e-9 {
		t.Errorf("MDF shown %v kJ/mol, want %.4f", got, want)
	}
	if got := p.text("#mdf-value"); !strings.Contains(got, "kJ/mol") {
		t.Errorf("MDF figure %q has no unit", got)
	}
	if got := p.text("#mdf-message"); !strings.Contains(got, "bottleneck") {
		t.Errorf("engine's message not shown: %q", got)
	}
	marked := eval[[]string](p, `[...document.querySelectorAll("#mdf-rows tr")].filter(tr => tr.textContent.includes("◆ bottleneck")).map(tr => tr.dataset.id)`)
	if fmt.Sprint(marked) != "[2 3]" {
		t.Errorf("rows marked as bottleneck in the table: %v, want [2 3]", marked)
	}
	if n := eval[int](p, `document.querySelectorAll("#chart-mdf rect.bottleneck").length`); n != 2 {
		t.Errorf("%d bottleneck bars in the chart, want 2", n)
	}
	if n := eval[int](p, `[...document.querySelectorAll("#chart-mdf text.mark.bn")].filter(e => e.textContent === "◆").length`); n != 2 {
		t.Errorf("%d ◆ symbols in the chart, want 2 (the bottlenecks are marked by symbol, not colour alone)", n)
	}
	if got := p.text("#chart-mdf svg"); !strings.Contains(got, "kJ/mol") {
		t.Errorf("chart axis lacks the unit: %q", got)
	}
	// Row 1 at the optimum keeps 10 − RT ln 2 = 8.282 kJ/mol (B at 10 mM, A at 5 mM; by hand).
	df1 := shownNumber(t, p.text(`#mdf-rows tr[data-id="1"] td.num`))
	if w := 10 - rtRef*math.Log(2); math.Abs(df1-w) > 0.005+1e-9 {
		t.Errorf("row 1 driving force at the optimum %v, want %.3f", df1, w)
	}
	// At the entered concentrations (every one at the 1 mM default) Q = 1, so ΔrG' = ΔrG'°: row 1 has
	// J+/J− = exp(10/RT) = 56.5 (flux-force relation, Beard and Qian, PLoS ONE 2:e144, 2007); row 2 is
	// uphill by 5 kJ/mol, its reverse flux matches the forward one (share 100 %), and raising B by
	// exp(5/RT) = 7.52 (to 7.52 mM, inside the 10 mM bound) brings it to ΔrG' = 0 (by hand).
	cells := eval[[]string](p, `[...document.querySelectorAll('#mdf-rows tr[data-id="1"] td')].map(td => td.textContent)`)
	if w := math.Exp(10 / rtRef); !strings.Contains(strings.Join(cells, "|"), fmt.Sprintf("%.1f", w)) {
		t.Errorf("row 1 cells %q lack J+/J− = %.1f", cells, w)
	}
	cells = eval[[]string](p, `[...document.querySelectorAll('#mdf-rows tr[data-id="2"] td')].map(td => td.textContent)`)
	row2 := strings.Join(cells, "|")
	if !strings.Contains(row2, "100 %") {
		t.Errorf("row 2 reverse share missing: %q", row2)
	}
	if w := math.Exp(5 / rtRef); !strings.Contains(row2, fmt.Sprintf("raise B from 1 mM to %.2f mM (×%.2f)", w, w)) {
		t.Errorf("row 2 remedy: %q, want raise B to %.2f mM", row2, w)
	}
	p.shotOf("#mdf", "mdf-chain")

	// Letting D go down to 0.01 mM: rows 2 and 3 then share −3 + RT ln 1000, MDF = (−3 + RT ln 1000)/2 =
	// 7.062 kJ/mol (row 1 keeps 8.282, more; by hand as above).
	p.replaceText(`#mdf-conc tr[data-compound="D"] input.bound`, "0.01 mM")
	p.waitFor(`JSON.stringify(gibbsheetPage.store.doc.bounds.compounds.D) === '["0.01 mM","0.1 mM"]'`)
	want2 := (-3 + rtRef*math.Log(1000)) / 2
	p.waitFor(fmt.Sprintf(`Math.abs(gibbsheetPage.store.result.mdf.drivingForce - %v) < 1e-6`, want2))
	if got := p.mdfShown(); math.Abs(got-want2) > 0.005+1e-9 {
		t.Errorf("after the bound edit the MDF shows %v, want %.4f", got, want2)
	}
	if got := p.text(`#mdf-conc tr[data-compound="D"] td.limit`); !strings.Contains(got, "low bound") {
		t.Errorf("D should now limit the MDF at its low bound: %q", got)
	}

	// A wrong bound stays as typed, is marked, and carries the engine's message.
	p.replaceText(`#mdf-body .bounds-default input.bound`, "5 mg")
	p.waitFor(`gibbsheetPage.store.result.errors?.some(e => e.path === "bounds.default[0]")`)
	if got := eval[string](p, `gibbsheetPage.store.doc.bounds.default[0]`); got != "5 mg" {
		t.Errorf("document holds %q for the wrong bound", got)
	}
	if !p.invalid(`#mdf-body .bounds-default input.bound`) {
		t.Error("the wrong bound is not marked")
	}
	engineMsg := eval[string](p, `gibbsheetPage.store.result.errors.find(e => e.path === "bounds.default[0]").message`)
	if got := eval[string](p, `document.querySelector("#mdf-body .bounds-default input.bound").title`); got != engineMsg {
		t.Errorf("field message %q, engine said %q", got, engineMsg)
	}

	// The kcal/mol toggle converts the figure and the axis (1 kcal = 4.184 kJ, by definition).
	p.replaceText(`#mdf-body .bounds-default input.bound`, "1 uM")
	p.do(chromedp.Click(chromedp.CSS(`[data-unit="kcal"]`)))
	p.waitFor(`document.getElementById("mdf-value").textContent.includes("kcal/mol")`)
	if got := p.mdfShown(); math.Abs(got-want2/4.184) > 0.005+1e-9 {
		t.Errorf("MDF in kcal/mol %v, want %.4f", got, want2/4.184)
	}
	if got := p.text("#chart-mdf svg"); !strings.Contains(got, "kcal/mol") {
		t.Errorf("chart axis not in kcal/mol: %q", got)
	}
	p.shotOf("#mdf", "mdf-kcal")
	p.noErrors()
}

// TestCompareTemplates puts two templates beside the open worksheet: the table shows each budget and
// MDF, and the chart has one line per worksheet, told apart by dash pattern and letter.
func TestCompareTemplates(t *testing.T) {
	p := openPage(t, 1400, 1000)
	add := func(file string) {
		eval[bool](p, fmt.Sprintf(`(() => { const s = document.getElementById("cmp-template"); s.value = %q; return s.value === %q; })()`, file, file))
		p.do(chromedp.Click(chromedp.CSS("#cmp-add-template")))
	}
	add("glycolysis.json")
	add("lactate-fermentation.json")
	p.waitFor(`document.querySelectorAll("#cmp-table thead th.ws").length === 3`)
	heads := eval[[]string](p, `[...document.querySelectorAll("#cmp-table thead th.ws")].map(th => th.textContent)`)
	if !strings.Contains(heads[1], "Glycolysis") || !strings.Contains(heads[2], "Lactate fermentation") {
		t.Errorf("columns %q", heads)
	}
	row := func(label string) []string {
		return eval[[]string](p, fmt.Sprintf(`[...document.querySelectorAll("#cmp-table tbody tr")].find(tr => tr.cells[0].textContent.startsWith(%q))?.querySelectorAll("td") ? [...[...document.querySelectorAll("#cmp-table tbody tr")].find(tr => tr.cells[0].textContent.startsWith(%q)).querySelectorAll("td")].map(td => td.textContent) : []`, label, label))
	}
	// Per glucose, glycolysis yields 2 ATP and 2 NADH and lactate fermentation 2 ATP with the NADH
	// spent again on pyruvate (Berg, Tymoczko and Stryer, Biochemistry; from memory). With NADH worth
	// 2.5 ATP (P/O 2.5, common practice) the totals are −7 and −2 ATP equivalents.
	checks := []struct {
		label string
		want  [2]float64
	}{{"Phosphate", [2]float64{-2, -2}}, {"Reducing", [2]float64{-2, 0}}, {"Total cost", [2]float64{-7, -2}}}
	for _, c := range checks {
		got := row(c.label)
		if len(got) != 3 {
			t.Fatalf("row %s: %q", c.label, got)
		}
		for i, w := range c.want {
			if v := shownNumber(t, got[i+1]); math.Abs(v-w) > 0.005 {
				t.Errorf("%s of worksheet %d shows %v, want %v", c.label, i+2, v, w)
			}
		}
	}
	for i, m := range row("MDF")[1:] {
		if shownNumber(t, m) <= 0 {
			t.Errorf("MDF of template %d = %s, want a positive MDF (both pathways run)", i+1, m)
		}
	}
	if n := eval[int](p, `document.querySelectorAll("#chart-compare polyline.line").length`); n != 3 {
		t.Errorf("%d lines in the comparison chart, want 3", n)
	}
	dashes := eval[[]string](p, `[...document.querySelectorAll("#chart-compare polyline.line")].map(l => l.getAttribute("stroke-dasharray") || "solid")`)
	if dashes[0] == dashes[1] || dashes[1] == dashes[2] || dashes[0] == dashes[2] {
		t.Errorf("lines share a dash pattern: %q", dashes)
	}
	if got := eval[[]string](p, `[...document.querySelectorAll("#chart-compare text.end-label")].map(e => e.textContent).sort()`); fmt.Sprint(got) != "[A B C]" {
		t.Errorf("line labels %q, want A B C", got)
	}
	p.shotOf("#compare", "compare")

	// A file that is not a worksheet gets a message naming it; the comparison is unchanged.
	bad := t.TempDir() + "/notes.json"
	writeFile(t, bad, "these are my notes, not JSON")
	p.do(chromedp.SetUploadFiles("#cmp-file", []string{bad}))
	p.waitFor(`document.querySelector("#cmp-body .cmp-msgs")?.textContent.includes("notes.json")`)
	if got := p.text("#cmp-body .cmp-msgs"); !strings.Contains(got, "not valid JSON") {
		t.Errorf("message for a bad file: %q", got)
	}
	if n := eval[int](p, `document.querySelectorAll("#cmp-table thead th.ws").length`); n != 3 {
		t.Errorf("after a bad file the comparison has %d worksheets, want 3", n)
	}
	p.noErrors()
}

func writeFile(t *testing.T, path, text string) {
	t.Helper()
	if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
}

// shotOf saves a screenshot of the element matching the CSS selector as name.png in the test's
// artifact folder.
func (p *page) shotOf(sel, name string) {
	p.t.Helper()
	ctx, cancel := context.WithTimeout(p.ctx, 60*time.Second)
	defer cancel()
	buf, err := chromedp.Run(ctx, chromedp.Screenshot(chromedp.CSS(sel)))
	if err != nil {
		p.t.Fatalf("screenshot of %s: %v", sel, err)
	}
	path := filepath.Join(p.t.ArtifactDir(), name+".png")
	if err := os.WriteFile(path, buf, 0o644); err != nil {
		p.t.Fatal(err)
	}
	p.t.Logf("screenshot: %s", path)
}

// TestAnalysisFollowsEdit: the max-min driving force comes after the rows, in a task of its own; after an
// edit that leaves a row out of it and one that brings the row back, the panel and the page's messages
// show the analysis of the worksheet as it now is, not of an earlier one.
func TestAnalysisFollowsEdit(t *testing.T) {
	p := openPage(t, 1400, 900)
	eq := `#grid-body tr[data-id="r4"] input.eq-input`
	p.replaceText(eq, "FBP = DHAP + glyceraldehyd")
	p.waitFor(`document.getElementById("doc-messages").textContent.includes("leaves out the row(s) without ΔrG'°: r4")`)
	if got := p.text(`#mdf-rows tr[data-id="r4"]`); !strings.Contains(got, "not in the analysis") {
		t.Errorf("the step left out of the analysis reads %q", got)
	}
	p.shot("analysis-row-left-out")
	p.replaceText(eq, "FBP = DHAP + GAP")
	p.waitFor(`!document.getElementById("doc-messages").textContent.includes("leaves out") &&
		gibbsheetPage.store.result.mdf.rows.some(r => r.id === "r4")`)
	if got := p.text(`#mdf-rows tr[data-id="r4"]`); strings.Contains(got, "not in the analysis") {
		t.Errorf("the step brought back still reads %q", got)
	}
	p.noErrors()
}
