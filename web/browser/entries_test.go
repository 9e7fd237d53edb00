package browser

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
)

func (p *page) value(sel string) string {
	p.t.Helper()
	return eval[string](p, fmt.Sprintf(`document.querySelector(%s).value`, jsString(sel)))
}

func (p *page) invalid(sel string) bool {
	p.t.Helper()
	return eval[bool](p, fmt.Sprintf(`document.querySelector(%s).getAttribute("aria-invalid") === "true"`, jsString(sel)))
}

// TestInvalidEntriesKept types wrong entries: each stays in its field as typed, is marked, and the
// message says what is wrong; the rest of the sheet keeps computing.
func TestInvalidEntriesKept(t *testing.T) {
	p := openPage(t, 1400, 900)
	const conc = `input[data-path="concentrations.ATP"]`
	p.replaceText(conc, "3 mg")
	p.waitFor(`gibbsheetPage.store.result.errors?.some(e => e.path === "concentrations.ATP")`)
	if got := p.value(conc); got != "3 mg" {
		t.Errorf("concentration field shows %q, want the text as typed", got)
	}
	if got := eval[string](p, `gibbsheetPage.store.doc.concentrations.ATP`); got != "3 mg" {
		t.Errorf("document holds %q", got)
	}
	if !p.invalid(conc) {
		t.Error("the concentration field is not marked")
	}
	msg := eval[string](p, `document.querySelector('input[data-path="concentrations.ATP"]').parentElement.querySelector(".field-msg").textContent`)
	if msg == "" {
		t.Error("no message beside the wrong concentration")
	}

	p.replaceText("#c-ph", "7..2")
	p.waitFor(`gibbsheetPage.store.drafts.has("conditions.pH")`)
	if got := p.value("#c-ph"); got != "7..2" {
		t.Errorf("pH field shows %q", got)
	}
	if !p.invalid("#c-ph") {
		t.Error("the pH field is not marked")
	}
	if got := p.text("#doc-messages"); !strings.Contains(got, "pH") || !strings.Contains(got, "not a number") {
		t.Errorf("messages %q do not explain the pH entry", got)
	}
	// Leaving the field keeps the text too.
	p.do(chromedp.Focus(chromedp.CSS("#c-ionic")))
	if got := p.value("#c-ph"); got != "7..2" {
		t.Errorf("after leaving, pH field shows %q", got)
	}
	if got := eval[float64](p, `gibbsheetPage.store.result.conditions.pH`); got != 7 {
		t.Errorf("results use pH %v, want the last valid 7", got)
	}

	p.replaceText(cell("r3", `input[data-col="times"]`), "two")
	p.waitFor(`gibbsheetPage.store.drafts.has("row:r3:times")`)
	if got := p.value(cell("r3", `input[data-col="times"]`)); got != "two" {
		t.Errorf("multiplier field shows %q", got)
	}
	if got := p.text(`#grid-body tr.sub[data-for="r3"]`); !strings.Contains(got, "multiplier") {
		t.Errorf("row r3 messages %q do not mention the multiplier", got)
	}
	p.shot("invalid-entries")
	p.noErrors()
}

// TestUnitsAndTemperature switches to kcal/mol and enters the temperature in kelvin.
func TestUnitsAndTemperature(t *testing.T) {
	p := openPage(t, 1400, 900)
	kj := shownNumber(t, p.outCell("r4", 0))
	p.do(chromedp.Click(chromedp.CSS(`button[data-unit="kcal"]`)))
	p.waitFor(`gibbsheetPage.store.ui.unit === "kcal"`)
	kcal := shownNumber(t, p.outCell("r4", 0))
	// 1 kcal = 4.184 kJ (thermochemical calorie, by definition).
	if math.Abs(kcal-kj/4.184) > 0.051+0.05/4.184 {
		t.Errorf("ΔrG'° %v kJ/mol shown as %v kcal/mol, want %v", kj, kcal, kj/4.184)
	}
	if got := p.text("#grid thead"); !strings.Contains(got, "kcal/mol") {
		t.Errorf("headers %q do not say kcal/mol", got)
	}
	p.do(chromedp.SetValue(chromedp.CSS("#c-temp-unit"), "K"))
	eval[bool](p, `document.getElementById("c-temp-unit").dispatchEvent(new Event("change")) || true`)
	if got := p.value("#c-temp"); got != "303.15" {
		t.Errorf("temperature in K shows %q, want 303.15", got)
	}
	p.replaceText("#c-temp", "310.15")
	p.waitFor(`gibbsheetPage.store.result.conditions.temperature === 310.15`)
	if got := p.text("#c-temp-both"); !strings.Contains(got, "37.00 °C") || !strings.Contains(got, "310.15 K") {
		t.Errorf("temperature shown as %q, want both 37.00 °C and 310.15 K", got)
	}
	p.shot("kcal-kelvin")
	p.noErrors()
}

// addOwnCompound adds the first worksheet compound of an empty sheet and names it.
func (p *page) addOwnCompound(name string) {
	p.t.Helper()
	p.do(chromedp.Click(chromedp.CSS("#own-add")))
	p.waitFor(`gibbsheetPage.store.doc.compounds.length === 1`)
	p.replaceText("#own-list .own-id", name)
}

// usedInOneStep checks that the compound card reports its use in the sheet's one step.
func (p *page) usedInOneStep() {
	p.t.Helper()
	if info := p.text("#own-list .own-use"); !strings.Contains(info, "used in 1 step") {
		p.t.Errorf("compound card says %q", info)
	}
}

// TestOwnCompound adds a compound the library lacks, with a ΔfG'° at the conditions, and uses it.
func TestOwnCompound(t *testing.T) {
	p := openPage(t, 1400, 900)
	p.newSheet()
	p.addOwnCompound("product X")
	p.replaceText(`input[data-path="compounds[0].dfG0prime"]`, "-500")
	p.waitFor(`gibbsheetPage.store.doc.compounds[0].dfG0prime === -500`)
	p.do(chromedp.SendKeys(chromedp.CSS(cell("r1", "input.eq-input")), "pyruvate = product X"))
	p.waitFor(`gibbsheetPage.store.result.rows[0].dG0 !== null`)
	// ΔrG'° = ΔfG'°(X) − ΔfG'°(pyruvate), both at the worksheet's conditions (definition of a reaction
	// Gibbs energy from formation energies; common practice, no source).
	pyr := eval[float64](p, `gibbsheetPage.store.result.compounds.find(c => c.library === "pyruvate").dfG0prime`)
	got := resultRow[float64](p, "r1", "dG0")
	if math.Abs(got-(-500-pyr)) > 1e-9 {
		t.Errorf("ΔrG'° = %v, want −500 − (%v)", got, pyr)
	}
	p.usedInOneStep()
	p.shot("own-compound")
	p.noErrors()
}

// TestSpeciesCompound defines a compound by one species through the page's species form and checks
// its transformed ΔfG'° against Alberty's equation at pH 7, I = 0.25 M, 298.15 K.
func TestSpeciesCompound(t *testing.T) {
	p := openPage(t, 1400, 900)
	p.newSheet()
	p.addOwnCompound("my acid")
	for label, v := range map[string]string{"ΔfG° of a new species": "-300", "charge of a new species": "-1", "H atoms of a new species": "3"} {
		p.replaceText(fmt.Sprintf(`#own-list input[aria-label=%q]`, label), v)
	}
	p.do(chromedp.Click(chromedp.CSS("#own-list tr.adder button")))
	p.waitFor(`gibbsheetPage.store.doc.compounds[0].species?.length === 1`)
	p.do(chromedp.SendKeys(chromedp.CSS(cell("r1", "input.eq-input")), "my acid = pyruvate"))
	p.waitFor(`gibbsheetPage.store.result.rows[0].dG0 !== null`)
	got := eval[float64](p, `gibbsheetPage.store.result.compounds.find(c => c.own).dfG0prime`)
	// Alberty (Thermodynamics of Biochemical Reactions, 2003, eq. 3.6-3; RTα = 2.91482 kJ kg^½ mol^-3/2
	// at 298.15 K, from memory): ΔfG'° = ΔfG° + N_H·RT ln10·pH − RTα (z² − N_H) √I / (1 + 1.6 √I).
	rt := R * 298.15
	sqrtI := math.Sqrt(0.25)
	want := -300 + 3*rt*math.Ln10*7 - 2.91482*(1-3)*sqrtI/(1+1.6*sqrtI)
	if math.Abs(got-want) > 0.01 {
		t.Errorf("ΔfG'° of the one-species compound = %.3f kJ/mol, Alberty's equation gives %.3f", got, want)
	}
	p.usedInOneStep()
	p.shot("species-compound")
	p.noErrors()
}

// TestEditValues changes the P/O ratio of NADH in the balance panel and sees the total cost follow.
func TestEditValues(t *testing.T) {
	p := openPage(t, 1400, 900)
	before := eval[float64](p, `gibbsheetPage.store.result.total.cost.total`)
	reducing := eval[float64](p, `gibbsheetPage.store.result.total.cost.reducing`)
	po := eval[float64](p, `gibbsheetPage.store.result.values.NADH.po`)
	p.replaceText(`#values-body input[aria-label="P/O value of NADH"]`, "3")
	p.waitFor(`gibbsheetPage.store.result.values.NADH.po === 3`)
	after := eval[float64](p, `gibbsheetPage.store.result.total.cost.total`)
	// The total counts each reduced carrier at its P/O ratio (the engine's documented cost convention).
	if want := before + reducing*(3-po); math.Abs(after-want) > 1e-9 {
		t.Errorf("total cost %v after P/O %v → 3, want %v", after, po, want)
	}
	if got := p.text("#tot-c"); !strings.Contains(got, fmt.Sprintf("%.2f", after)) {
		t.Errorf("total cost shown as %q, want %.2f", got, after)
	}
	p.noErrors()
}

// TestRowNote: a note is written on a step from its ✎ button, kept in the document when the field is left,
// and edited in place afterwards; the note's text is shown as text.
func TestRowNote(t *testing.T) {
	p := openPage(t, 1400, 900)
	id := eval[string](p, `globalThis.gibbsheetPage.store.doc.rows[0].id`)
	p.do(chromedp.Click(chromedp.CSS(`tr.row[data-id="` + id + `"] button[title="Write a note on this step"]`)))
	p.waitFor(`document.activeElement && document.activeElement.classList.contains("note-input")`)
	// The demo's first step already has a note: the field shows it, and typed text replaces the selection.
	if got := eval[string](p, `document.activeElement.value`); got != "hexokinase" {
		t.Errorf("note field shows %q, want the step's note %q", got, "hexokinase")
	}
	eval[bool](p, `(document.activeElement.select(), true)`)
	p.do(chromedp.SendKeys(chromedp.CSS(`tr.sub[data-for="`+id+`"] .note-input`), "<b>measured</b> in lysate\r"))
	p.waitFor(`globalThis.gibbsheetPage.store.doc.rows[0].note === "<b>measured</b> in lysate"`)
	if n := eval[int](p, `document.querySelectorAll('tr.sub b').length`); n != 0 {
		t.Errorf("the note was inserted as markup (%d <b> elements)", n)
	}
	p.noErrors()
}
