package browser

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
)

// R is the molar gas constant in kJ mol⁻¹ K⁻¹ (CODATA 2018: 8.314462618 J mol⁻¹ K⁻¹).
const R = 8.314462618e-3

// shownRounding is how far a value the grid shows (one decimal) may be from the exact one.
const shownRounding = 0.05 + 1e-9

// newSheet clicks "New empty worksheet" and waits for the empty row.
func (p *page) newSheet() {
	p.t.Helper()
	p.do(chromedp.Click(chromedp.CSS("#new-sheet")))
	p.waitFor(`gibbsheetPage.store.doc.rows.length === 1 && gibbsheetPage.store.doc.rows[0].equation === ""`)
}

// cell is the selector of an element of the grid row with the given id.
func cell(id, sel string) string {
	return fmt.Sprintf(`#grid-body tr.row[data-id=%q] %s`, id, sel)
}

// outCell returns the text of the n-th computed cell (0 ΔrG'°, 1 ΔrG', 2 K', 3 status, 4 cost).
func (p *page) outCell(id string, n int) string {
	p.t.Helper()
	return eval[string](p, fmt.Sprintf(`document.querySelectorAll(%s)[%d].textContent`, jsString(cell(id, "td.out")), n))
}

// shownNumber reads a number the grid shows ("−31.5", "22.8 entered").
func shownNumber(t *testing.T, s string) float64 {
	t.Helper()
	f := strings.Fields(strings.ReplaceAll(s, "−", "-"))
	if len(f) == 0 {
		t.Fatalf("no number in %q", s)
	}
	v, err := strconv.ParseFloat(f[0], 64)
	if err != nil {
		t.Fatalf("shown value %q: %v", s, err)
	}
	return v
}

// resultRow reads a field of a row of the engine's last result in the page.
func resultRow[T any](p *page, id, field string) T {
	return eval[T](p, fmt.Sprintf(`gibbsheetPage.store.result.rows.find(r => r.id === %q).%s`, id, field))
}

// replaceText selects the field's text and types over it, with real key events.
func (p *page) replaceText(sel, text string) {
	p.t.Helper()
	eval[bool](p, fmt.Sprintf(`(() => { const e = document.querySelector(%s); e.focus(); e.select(); return true; })()`, jsString(sel)))
	p.do(chromedp.KeyEvent(text))
}

// TestTypeEquation types an equation into an empty worksheet and waits for its ΔrG'° to appear.
func TestTypeEquation(t *testing.T) {
	p := openPage(t, 1400, 900)
	p.newSheet()
	p.do(chromedp.SendKeys(chromedp.CSS(cell("r1", "input.eq-input")), "ATP + H2O = ADP + Pi"))
	p.waitFor(fmt.Sprintf(`document.querySelector(%s).textContent !== "—"`, jsString(cell("r1", "td.out"))))
	shown := shownNumber(t, p.outCell("r1", 0))
	exact := resultRow[float64](p, "r1", "dG0")
	if math.Abs(shown-exact) > shownRounding {
		t.Errorf("grid shows ΔrG'° %v, engine computed %v", shown, exact)
	}
	// ATP + H2O = ADP + Pi at pH 7, I = 0.25 M, no Mg²⁺ binding, 298.15 K: ΔrG'° = −36.03 kJ/mol
	// (Alberty, Thermodynamics of Biochemical Reactions, 2003; from memory). The library's adenine
	// nucleotide data are marked approximate, hence the wide tolerance.
	const alberty, tol = -36.03, 1.5
	if math.Abs(exact-alberty) > tol {
		t.Errorf("ΔrG'° of ATP hydrolysis = %.2f kJ/mol, published %.2f ± %.1f", exact, alberty, tol)
	}
	if st := p.outCell("r1", 3); !strings.Contains(st, "downhill") {
		t.Errorf("status %q, want downhill at 1 mM each", st)
	}
	p.shot("typed-equation")
	p.noErrors()
}

// TestConcentrationMovesDG changes a concentration and checks that ΔrG' moves by RT ln of the ratio.
func TestConcentrationMovesDG(t *testing.T) {
	p := openPage(t, 1400, 900)
	// Demo row r1 is glucose + ATP = G6P + ADP with glucose at 5 mM, at 30 °C.
	before := resultRow[float64](p, "r1", "dG")
	shownBefore := shownNumber(t, p.outCell("r1", 1))
	T := eval[float64](p, `gibbsheetPage.store.result.conditions.temperature`)
	if T != 303.15 {
		t.Fatalf("demo temperature %v K, the test expects 303.15 K", T)
	}
	p.replaceText(`input[data-path="concentrations.glucose"]`, "50 mM")
	p.waitFor(`gibbsheetPage.store.doc.concentrations.glucose === "50 mM"`)
	after := resultRow[float64](p, "r1", "dG")
	// glucose is a substrate: Q falls tenfold, so ΔrG' changes by RT ln(1/10), RT = R·T (CODATA 2018 R).
	want := R * T * math.Log(5.0/50.0)
	if d := after - before; math.Abs(d-want) > 1e-6 {
		t.Errorf("ΔrG' moved by %.6f kJ/mol, want RT ln(5/50) = %.6f", d, want)
	}
	shownAfter := shownNumber(t, p.outCell("r1", 1))
	if d := shownAfter - shownBefore; math.Abs(d-want) > 2*shownRounding {
		t.Errorf("grid's ΔrG' moved by %.2f, want %.2f", d, want)
	}
	if rt := p.text("#c-rt"); !strings.Contains(rt, strconv.FormatFloat(R*T, 'f', 4, 64)) {
		t.Errorf("RT shown as %q, want %.4f kJ/mol", rt, R*T)
	}
	if got := eval[string](p, `[...document.querySelectorAll("#levels-body tr")].find(tr => tr.textContent.includes("D-glucose")).querySelector("td.use").textContent`); got != "50 mM" {
		t.Errorf("glucose in use shown as %q, want 50 mM", got)
	}
	p.shot("concentration-changed")
	p.noErrors()
}

// TestUphillWarning raises a product's concentration until its step runs uphill.
func TestUphillWarning(t *testing.T) {
	p := openPage(t, 1400, 900)
	if st := resultRow[string](p, "r2", "status"); st == "uphill" {
		t.Fatalf("demo row r2 is uphill before the change")
	}
	p.replaceText(`input[data-path="concentrations.F6P"]`, "100 mM")
	p.waitFor(`gibbsheetPage.store.result.rows[1].status === "uphill"`)
	if got := p.outCell("r2", 3); !strings.Contains(got, "▲") || !strings.Contains(got, "uphill") {
		t.Errorf("status cell %q, want symbol and word", got)
	}
	if !eval[bool](p, `document.querySelector('#grid-body tr.row[data-id="r2"]').classList.contains("st-uphill")`) {
		t.Error("the row is not marked uphill")
	}
	msgs := p.text(`#grid-body tr.sub[data-for="r2"]`)
	if !strings.Contains(msgs, "uphill") || !strings.Contains(msgs, "cannot run forward") {
		t.Errorf("row r2's messages %q lack the uphill warning", msgs)
	}
	if dg := resultRow[float64](p, "r2", "dG"); dg <= 0 {
		t.Errorf("ΔrG' = %v, want > 0", dg)
	}
	p.shot("uphill")
	p.noErrors()
}

// TestPasteRows pastes two tab-separated rows copied from a spreadsheet into the first cell.
func TestPasteRows(t *testing.T) {
	p := openPage(t, 1400, 900)
	p.newSheet()
	text := "ATP + H2O = ADP + Pi\t1\t\nglucose + ATP = G6P + ADP\t2\t-20\n"
	// A synthetic paste event: headless Chromium has no clipboard to copy from, so the test hands the
	// text to the page as the clipboard would.
	eval[bool](p, fmt.Sprintf(`(() => {
		const e = document.querySelector(%s); e.focus();
		const dt = new DataTransfer(); dt.setData("text/plain", %s);
		e.dispatchEvent(new ClipboardEvent("paste", { clipboardData: dt, bubbles: true, cancelable: true }));
		return true; })()`, jsString(cell("r1", "input.eq-input")), jsString(text)))
	p.waitFor(`gibbsheetPage.store.doc.rows.length === 2`)
	type row struct {
		Equation string   `json:"equation"`
		Times    float64  `json:"times"`
		DG0      *float64 `json:"dG0"`
	}
	rows := eval[[]row](p, `gibbsheetPage.store.doc.rows`)
	if rows[0].Equation != "ATP + H2O = ADP + Pi" || rows[0].Times != 1 || rows[0].DG0 != nil {
		t.Errorf("first pasted row = %+v", rows[0])
	}
	if rows[1].Equation != "glucose + ATP = G6P + ADP" || rows[1].Times != 2 || rows[1].DG0 == nil || *rows[1].DG0 != -20 {
		t.Errorf("second pasted row = %+v", rows[1])
	}
	id := eval[string](p, `gibbsheetPage.store.doc.rows[1].id`)
	if got := p.outCell(id, 0); !strings.Contains(got, "−20.0") || !strings.Contains(got, "entered") {
		t.Errorf("second row's ΔrG'° cell %q, want the entered −20.0", got)
	}
	if got := eval[string](p, `document.querySelector(`+jsString(cell(id, `input[data-col="times"]`))+`).value`); got != "2" {
		t.Errorf("multiplier field shows %q", got)
	}
	p.shot("pasted")
	p.noErrors()
}
