package browser

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
	"github.com/chromedp/chromedp/kb"
)

// openTemplateList clicks the header button and waits for the search field.
func (p *page) openTemplateList() {
	p.t.Helper()
	p.do(chromedp.Click(chromedp.CSS("#from-template")))
	p.waitFor(`!document.getElementById("tpl-picker").hidden && document.activeElement.id === "tpl-search"`)
}

func (p *page) templateTitles() []string {
	p.t.Helper()
	return eval[[]string](p, `[...document.querySelectorAll("#tpl-list li .tpl-title")].map(e => e.textContent)`)
}

// TestTemplatePicker types into the template list to narrow it, opens the first match with Enter and
// checks that its steps and totals are on screen.
func TestTemplatePicker(t *testing.T) {
	p := openPage(t, 1400, 1000)
	p.openTemplateList()
	all := p.templateTitles()
	if len(all) < 10 {
		t.Fatalf("the list shows %d templates, want every pathway template (at least 10): %q", len(all), all)
	}
	if n := eval[int](p, `[...document.querySelectorAll("#tpl-list li .tpl-summary")].filter(e => e.textContent.trim()).length`); n != len(all) {
		t.Errorf("%d of %d templates have their one-line summary", n, len(all))
	}
	// A compound name that is in no title finds the pathway that uses it: acetaldehyde is an
	// intermediate of ethanol fermentation only (pyruvate decarboxylase, alcohol dehydrogenase; common
	// practice, no source).
	p.do(chromedp.KeyEvent("acetaldehyde"))
	p.waitFor(fmt.Sprintf(`document.querySelectorAll("#tpl-list li").length < %d`, len(all)))
	if got := p.templateTitles(); len(got) != 1 || !strings.HasPrefix(got[0], "Ethanol fermentation") {
		t.Errorf("search for a compound lists %q, want only ethanol fermentation", got)
	}
	// Typing a title word replaces the search; Enter opens the highlighted template.
	eval[bool](p, `(() => { const e = document.getElementById("tpl-search"); e.select(); return true; })()`)
	p.do(chromedp.KeyEvent("glycolysis"))
	p.waitFor(`document.querySelector("#tpl-list li.on .tpl-title")?.textContent.startsWith("Glycolysis")`)
	p.shot("template-picker")
	rows := eval[int](p, `globalThis.gibbsheetPage.templates().find(t => t.file === "glycolysis.json").doc.rows.length`)
	p.key(kb.Enter)
	p.waitFor(`document.getElementById("tpl-picker").hidden && gibbsheetPage.store.doc.title.startsWith("Glycolysis")`)
	if got := eval[int](p, `document.querySelectorAll("#grid-body tr.row").length`); got != rows {
		t.Errorf("grid shows %d steps, the template has %d", got, rows)
	}
	if got := eval[int](p, `document.querySelectorAll("#grid-body tr.row.st-uphill, #grid-body tr.row.st-near, #grid-body tr.row.st-down").length`); got != rows {
		t.Errorf("%d of %d steps have a status", got, rows)
	}
	if !eval[bool](p, `document.getElementById("demo-flag").hidden`) {
		t.Error("a template is still labelled as the invented demo")
	}
	// Glycolysis yields 2 ATP and 2 NADH per glucose (Berg, Tymoczko and Stryer, Biochemistry; from
	// memory): the balance shows a phosphate cost of −2 and a reducing cost of −2.
	for sel, want := range map[string]float64{"#tot-p": -2, "#tot-r": -2} {
		if got := shownNumber(t, p.text(sel)); math.Abs(got-want) > 0.005 {
			t.Errorf("%s shows %v, want %v", sel, got, want)
		}
	}
	if got := p.text("#net-eq"); !strings.Contains(got, "2 pyruvate") || !strings.Contains(got, "glucose") {
		t.Errorf("net reaction %q", got)
	}
	p.shot("template-open")
	p.noErrors()
}

// TestTemplateNoMatch: a search that matches nothing says so, and Escape closes the list without
// touching the worksheet.
func TestTemplateNoMatch(t *testing.T) {
	p := openPage(t, 1400, 900)
	before := eval[string](p, `JSON.stringify(gibbsheetPage.store.doc)`)
	p.openTemplateList()
	p.do(chromedp.KeyEvent("zzqx"))
	p.waitFor(`document.querySelectorAll("#tpl-list li").length === 0`)
	if got := p.text("#tpl-count"); !strings.Contains(got, "No template matches") {
		t.Errorf("count line %q", got)
	}
	p.key(kb.Enter)
	p.key(kb.Escape)
	p.waitFor(`document.getElementById("tpl-picker").hidden`)
	if after := eval[string](p, `JSON.stringify(gibbsheetPage.store.doc)`); after != before {
		t.Error("the worksheet changed without a template being chosen")
	}
	p.noErrors()
}
