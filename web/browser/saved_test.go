package browser

import (
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"gibbsheet/web/assemble"
)

// gridResults is the text of every row's computed cells (ΔrG'°, ΔrG', K', status, cost), row by row.
const gridResults = `JSON.stringify([...document.querySelectorAll("#grid-body tr")].filter((tr) => tr.querySelector("td.out"))
	.map((tr) => [...tr.querySelectorAll("td.out")].map((td) => td.textContent)))`

// withoutEngine writes a copy of the page file whose engine cannot start (its stated length is wrong, so
// the start script refuses it), after change, and returns its path. The policy's hashes stay valid: the
// engine's element is a data block.
func withoutEngine(t *testing.T, html []byte, change func(string) string) string {
	t.Helper()
	s := regexp.MustCompile(`(id="gs-engine" data-encoding="gzip\+text7" data-length=")(\d+)"`).ReplaceAllString(string(html), `${1}1$2"`)
	if s == string(html) {
		t.Fatal("the page has no engine element to break")
	}
	path := filepath.Join(t.TempDir(), "no-engine.html")
	if err := os.WriteFile(path, []byte(change(s)), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// openWithoutEngine opens such a file and waits for the page to say that its engine could not start.
func openWithoutEngine(t *testing.T, path, shot string) *page {
	t.Helper()
	p := openUntil(t, "file://"+path, 1400, 900, `document.getElementById("engine-state").textContent.includes("could not start")`)
	p.shot(shot)
	return p
}

func readPage(t *testing.T) []byte {
	t.Helper()
	html, err := os.ReadFile(pagePath)
	if err != nil {
		t.Fatal(err)
	}
	return html
}

// TestSavedResultShown checks that the page shows the result saved with its worksheet before its engine
// has started, that this is what the engine then computes (the grid reads the same), and that a saved
// result is not shown for a worksheet it was not computed for.
func TestSavedResultShown(t *testing.T) {
	p := openPage(t, 1400, 900)
	computed := eval[string](p, gridResults)
	if !regexp.MustCompile(`\d`).MatchString(computed) {
		t.Fatalf("the grid shows no results: %s", computed)
	}
	shown, ready := eval[float64](p, `performance.getEntriesByName("gibbsheet:first-result")[0].startTime`),
		eval[float64](p, `performance.getEntriesByName("gibbsheet:engine-ready")[0].startTime`)
	if shown >= ready {
		t.Errorf("the first result was drawn at %.0f ms, not before the engine was ready (%.0f ms)", shown, ready)
	}
	// The first frame waits for it (the page's render-blocking link), so no frame shows the grid empty.
	p.waitFor(`performance.getEntriesByName("first-contentful-paint").length > 0`)
	if painted := eval[float64](p, `performance.getEntriesByName("first-contentful-paint")[0].startTime`); painted < shown {
		t.Errorf("the page was first painted at %.0f ms, before the first result was drawn (%.0f ms)", painted, shown)
	}

	q := openWithoutEngine(t, withoutEngine(t, readPage(t), func(s string) string { return s }), "saved-result")
	if got := eval[string](q, gridResults); got != computed {
		t.Errorf("the saved result drawn without the engine differs from the engine's:\n%s", cmp.Diff(computed, got))
	}
	q.noErrors()

	// The worksheet element changed by hand (a step's multiplier): its saved result is another
	// worksheet's, so none is shown, and the rows are.
	r := openWithoutEngine(t, withoutEngine(t, readPage(t), func(s string) string {
		out := strings.Replace(s, `"times":2`, `"times":3`, 1)
		if out == s {
			t.Fatal(`the demo has no "times":2 to change`)
		}
		return out
	}), "not-its-result")
	if got := eval[string](r, gridResults); regexp.MustCompile(`\d`).MatchString(got) {
		t.Errorf("a result is shown for a worksheet it was not saved with: %s", got)
	}
	if n := eval[int](r, `document.querySelectorAll("#grid-body textarea, #grid-body input").length`); n == 0 {
		t.Error("the rows of the changed worksheet are not shown")
	}

	// With its engine, the changed worksheet is computed, and the footer says the engine is ready.
	changed := filepath.Join(t.TempDir(), "changed.html")
	if err := os.WriteFile(changed, []byte(strings.Replace(string(readPage(t)), `"times":2`, `"times":3`, 1)), 0o644); err != nil {
		t.Fatal(err)
	}
	e := openURL(t, "file://"+changed, 1400, 900)
	if got := eval[string](e, gridResults); !regexp.MustCompile(`\d`).MatchString(got) {
		t.Errorf("the changed worksheet is not computed: %s", got)
	}
	if got := e.text("#engine-state"); !strings.HasPrefix(got, "Engine ready") {
		t.Errorf("the footer says %q once the engine has computed a worksheet without a saved result, want Engine ready …", got)
	}
}

// TestSavedResultSaved edits the worksheet, saves the page as a file and opens that file without its
// engine: it shows the result of the edited worksheet, as the engine had computed it.
func TestSavedResultSaved(t *testing.T) {
	p := openFile(t, pagePath, "", false)
	eval[bool](p.page, `(async () => { const s = gibbsheetPage.store; s.doc.rows[0].times = 3;
		s.doc.concentrations["ATP"] = "4 mM"; gibbsheetPage.recompute(); await gibbsheetPage.settled(); return true; })()`)
	computed := eval[string](p.page, gridResults)
	_, saved := p.download("#save-file")
	q := openWithoutEngine(t, withoutEngine(t, saved, func(s string) string { return s }), "saved-file")
	if got := eval[string](q, gridResults); got != computed {
		t.Errorf("the saved file shows another result than the page it was saved from:\n%s", cmp.Diff(computed, got))
	}
	if got := eval[float64](q, `gibbsheetPage.store.doc.rows[0].times`); got != 3 {
		t.Errorf("the saved worksheet's first multiplier is %v, want 3", got)
	}
}

// slowEngine holds the engine's compilation back by two seconds, as a slow machine would.
const slowEngine = `(() => { const f = WebAssembly.instantiateStreaming;
	WebAssembly.instantiateStreaming = async (...a) => { await new Promise((r) => setTimeout(r, 2000)); return f(...a); }; })()`

// TestEditBeforeEngine types in the grid while the page shows the saved result and its engine is still
// starting: the saved result, no longer the worksheet's, is taken off the edited step at once, the edit is
// kept, and the engine, once started, computes the edited worksheet.
func TestEditBeforeEngine(t *testing.T) {
	p := openUntil(t, "file://"+pagePath, 1400, 900, `document.querySelector("#grid-body tr.row td.out")?.textContent.match(/\d/)`, slowEngine)
	if eval[bool](p, `!!gibbsheetPage.store.engine`) {
		t.Fatal("the engine started within the two seconds it was held back")
	}
	p.typeInto(`#grid-body tr.row input[data-col="times"]`, "3")
	if got := eval[string](p, `document.querySelector("#grid-body tr.row").querySelectorAll("td.out")[4].textContent`); got != "—" {
		t.Errorf("before the engine, the edited step's cost shows %q, want — (the saved result is another worksheet's)", got)
	}
	p.waitFor(`document.body.dataset.ready === "true"`)
	if got := eval[float64](p, `gibbsheetPage.store.doc.rows[0].times`); got != 3 {
		t.Errorf("the multiplier typed before the engine started is %v in the worksheet, want 3", got)
	}
	// Hexokinase spends one ATP per pass (common practice, no source): three passes cost 3.0.
	if got := eval[string](p, `document.querySelector("#grid-body tr.row").querySelectorAll("td.out")[4].textContent`); got != "3.0" {
		t.Errorf("after the engine started, the edited step's cost shows %q, want 3.0", got)
	}
	p.noErrors()
}

// TestSavedResultFromGo puts a worksheet whose text is beyond ASCII (µ, Δ, a character outside the Basic
// Multilingual Plane) into the built page with assemble.WithWorksheet, as the command line and the edge
// service do, and opens it without its engine: the page takes the result Go saved, so the page's
// fingerprint of the text (in UTF-16 code units) agrees with inject.Fingerprint.
func TestSavedResultFromGo(t *testing.T) {
	doc := []byte(`{"format":"gibbsheet-worksheet/1","title":"µM and ΔrG'° 🧪","rows":[` +
		`{"id":"r1","equation":"ATP + H2O = ADP + Pi","note":"hydrolysis 🧪"}]}`)
	html, err := assemble.WithWorksheet(readPage(t), doc)
	if err != nil {
		t.Fatal(err)
	}
	p := openWithoutEngine(t, withoutEngine(t, html, func(s string) string { return s }), "saved-by-go")
	if got := eval[string](p, gridResults); !regexp.MustCompile(`\d`).MatchString(got) {
		t.Errorf("the page shows no result for the worksheet Go put in with its result: %s", got)
	}
	if got := eval[string](p, `gibbsheetPage.store.doc.title`); got != "µM and ΔrG'° 🧪" {
		t.Errorf("title %q", got)
	}
}
