package browser

import (
	"fmt"
	"math"
	"os"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
	"github.com/chromedp/chromedp/kb"
)

// Faraday is the Faraday constant in kJ mol⁻¹ V⁻¹ (CODATA 2018: 96 485.332 12 C/mol).
const Faraday = 96.48533212

func (p *page) loadFile(path string) {
	p.t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		p.t.Fatal(err)
	}
	p.load(string(b))
}

// TestCompartments opens the mitochondrion golden worksheet (cytosol c and matrix m at −160 mV): the
// transport rows are marked, editing the matrix potential changes the ATP synthase row's ΔrG'° by the
// electrical work of the protons it lets in, and wrong entries stay and are marked.
func TestCompartments(t *testing.T) {
	p := openPage(t, 1400, 1000)
	p.loadFile("../../testdata/worksheets/mitochondrion.json")
	p.waitFor(`document.querySelectorAll("#comp-rows tr").length === 2`)
	marks := eval[[]string](p, `[...document.querySelectorAll("#grid-body tr.row.transport td.status .xport")].map(e => e.textContent)`)
	if len(marks) != 3 {
		t.Fatalf("transport marks %q, want one on each of the 3 rows", marks)
	}
	if got := p.text(cell("mpc", "td.status")); !strings.Contains(got, "⇄ transport c→m") {
		t.Errorf("pyruvate carrier row status %q, want ⇄ transport c→m", got)
	}
	if got := p.text(`#grid-body tr.sub[data-for="mpc"]`); !strings.Contains(got, "work of moving") || !strings.Contains(got, "pyruvate c→m") {
		t.Errorf("row detail %q does not describe the moves and their work", got)
	}
	if got := p.text("#comp-protons"); !strings.Contains(got, "3 transport steps") {
		t.Errorf("proton summary %q", got)
	}
	p.shotOf("#compartments", "compartments")
	p.shot("compartments-page")

	// The ATP synthase row lets 4 H+ from c (0 mV) into m. Moving charge z from ψ1 to ψ2 takes
	// zF(ψ2 − ψ1) (Nicholls and Ferguson, Bioenergetics; from memory), so raising ψm from −160 to −100 mV
	// raises the row's ΔrG'° by 4 F × 0.060 V = 23.156 kJ/mol; nothing else in the row changes.
	before := resultRow[float64](p, "atp", "dG0")
	pot := `#comp-rows tr[data-index="1"] input[data-field="potential"]`
	p.replaceText(pot, "-100")
	p.waitFor(`gibbsheetPage.store.doc.compartments[1].potential === -100`)
	after := resultRow[float64](p, "atp", "dG0")
	if want := 4 * Faraday * 0.060; math.Abs(after-before-want) > 1e-6 {
		t.Errorf("ΔrG'° of the ATP synthase row moved by %.6f kJ/mol, want %.6f", after-before, want)
	}
	if shown := shownNumber(t, p.outCell("atp", 0)); math.Abs(shown-after) > shownRounding {
		t.Errorf("grid shows ΔrG'° %v, engine computed %v", shown, after)
	}

	// A pH the engine refuses stays as typed, is marked and explained.
	ph := `#comp-rows tr[data-index="1"] input[data-field="pH"]`
	p.replaceText(ph, "15")
	p.waitFor(`gibbsheetPage.store.result.errors?.some(e => e.path === "compartments[1].pH")`)
	if got := p.value(ph); got != "15" {
		t.Errorf("pH field shows %q", got)
	}
	if !p.invalid(ph) {
		t.Error("the refused pH is not marked")
	}
	if got := p.text("#comp-body .comp-msgs"); !strings.Contains(got, `compartment "m" pH`) {
		t.Errorf("messages %q do not name the compartment and field", got)
	}

	// Adding a compartment and removing it again.
	p.do(chromedp.Click(chromedp.CSS("#comp-add")))
	p.waitFor(`gibbsheetPage.store.doc.compartments.length === 3`)
	if got := eval[string](p, `gibbsheetPage.store.doc.compartments[2].id`); got == "c" || got == "m" || got == "" {
		t.Errorf("new compartment id %q is not a fresh one", got)
	}
	p.do(chromedp.Click(chromedp.CSS(`#comp-rows tr[data-index="2"] button.act`)))
	p.waitFor(`gibbsheetPage.store.doc.compartments.length === 2 && document.querySelectorAll("#comp-rows tr").length === 2`)
	p.noErrors()
}

// TestTagCompletion: after a compound name, "[" offers the worksheet's compartment tags.
func TestTagCompletion(t *testing.T) {
	p := openPage(t, 1400, 900)
	p.loadFile("../../testdata/worksheets/mitochondrion.json")
	p.waitFor(`gibbsheetPage.store.doc.compartments.length === 2`)
	p.do(chromedp.Click(chromedp.CSS("#add-row")))
	p.waitFor(`gibbsheetPage.store.doc.rows.length === 4 && document.activeElement.classList.contains("eq-input")`)
	id := eval[string](p, `gibbsheetPage.store.doc.rows[3].id`)
	p.do(chromedp.KeyEvent("pyruvate["))
	p.waitFor(`!document.getElementById("complete").hidden`)
	opts := eval[[]string](p, `[...document.querySelectorAll("#complete .opt")].map(o => o.textContent)`)
	if len(opts) != 2 || !strings.HasPrefix(opts[0], "[c]") || !strings.HasPrefix(opts[1], "[m]") || !strings.Contains(opts[1], "mitochondrial matrix") {
		t.Fatalf("completion offers %q, want [c] and [m] with their names", opts)
	}
	p.shot("tag-completion")
	p.key(kb.ArrowDown)
	p.key(kb.Enter)
	p.waitFor(fmt.Sprintf(`gibbsheetPage.store.doc.rows[3].equation === "pyruvate[m]"`))
	if got := p.value(cell(id, "input.eq-input")); got != "pyruvate[m]" {
		t.Errorf("equation %q after taking the tag", got)
	}
	// The tags narrow as the id is typed, and a closed tag offers nothing more.
	p.do(chromedp.KeyEvent(" = pyruvate[c"))
	p.waitFor(`[...document.querySelectorAll("#complete .opt")].map(o => o.textContent.slice(0, 3)).join() === "[c]"`)
	p.key(kb.Escape)
	p.noErrors()
}
