package browser

import (
	"strings"
	"testing"
)

// TestDemoOnOpen opens the file as a user would and checks that the demo worksheet, its "invented data"
// label and the caution line are there, with an uphill, a near-equilibrium and a costly step.
func TestDemoOnOpen(t *testing.T) {
	p := openPage(t, 1400, 1000)
	p.shot("demo-open")
	if got := p.text("#caution"); !strings.Contains(got, "not for clinical decisions") {
		t.Errorf("caution line = %q", got)
	}
	if eval[bool](p, `document.getElementById("demo-flag").hidden`) {
		t.Error("the demo is not labelled as invented data")
	}
	if title := eval[string](p, `document.getElementById("ws-title").value`); !strings.Contains(strings.ToLower(title), "invented") {
		t.Errorf("demo title %q does not say the data are invented", title)
	}
	for _, sel := range []string{"tr.row.st-uphill", "tr.row.st-near"} {
		if n := eval[int](p, `document.querySelectorAll("`+sel+`").length`); n == 0 {
			t.Errorf("no %s row in the demo", sel)
		}
	}
	if got := p.text("tr.row.st-uphill td.status"); !strings.Contains(got, "▲ uphill") {
		t.Errorf("uphill status text = %q, want symbol and word", got)
	}
	maxCost := eval[float64](p, `Math.max(...gibbsheetPage.store.result.rows.map(r => r.cost ? r.cost.total : 0))`)
	if maxCost < 2 {
		t.Errorf("costliest demo step costs %v ATP equivalents, want a costly step (≥ 2)", maxCost)
	}
	p.noErrors()
}

// TestNarrowWindow opens the page in a small window: the panels stack and the grid scrolls sideways
// instead of squeezing the equations.
func TestNarrowWindow(t *testing.T) {
	p := openPage(t, 900, 800)
	p.shot("narrow")
	if w := eval[float64](p, `document.querySelector(".col-side").getBoundingClientRect().left`); w > 100 {
		t.Errorf("side panels start at x = %v in a 900 px window, want them stacked below", w)
	}
	if eval[float64](p, `document.querySelector(".eq-box").getBoundingClientRect().width`) < 250 {
		t.Error("the equation cell is squeezed below 250 px")
	}
	p.noErrors()
}
