package assemble_test

import (
	"crypto/sha256"
	"encoding/base64"
	"encoding/json"
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"strings"
	"sync"
	"testing"

	"github.com/google/go-cmp/cmp"

	"gibbsheet/engine"
	"gibbsheet/web/assemble"
	"gibbsheet/web/inject"
)

var builtPage = sync.OnceValues(func() (*assemble.Page, error) {
	return assemble.Build(assemble.Options{Version: "test"})
})

func page(t *testing.T) string {
	t.Helper()
	p, err := builtPage()
	if err != nil {
		t.Fatal(err)
	}
	return string(p.HTML)
}

var (
	elementRE = regexp.MustCompile(`(?s)<(script|style)\b([^>]*)>(.*?)</(?:script|style)>`)
	cspRE     = regexp.MustCompile(`<meta http-equiv="Content-Security-Policy" content="([^"]*)">`)
	hashRE    = regexp.MustCompile(`'sha256-[A-Za-z0-9+/=]+'`)
)

// TestPolicyHashes checks that the built page's policy allows exactly the inline scripts the browser
// runs (the classic scripts, not the JSON and engine data blocks) and the style element, by their SHA-256
// (the CSP Level 3 hash source), and blocks every connection and every resource from elsewhere.
func TestPolicyHashes(t *testing.T) {
	html := page(t)
	metas := cspRE.FindAllStringSubmatch(html, -1)
	if len(metas) != 1 {
		t.Fatalf("%d policy elements, want 1", len(metas))
	}
	policy := strings.ReplaceAll(metas[0][1], "&#39;", "'")
	if i, j := strings.Index(html, metas[0][0]), strings.Index(html, "<script"); i > j || i > strings.Index(html, "<style") {
		t.Error("the policy must come before every script and style element")
	}
	directives := map[string][]string{}
	for d := range strings.SplitSeq(policy, ";") {
		f := strings.Fields(d)
		if len(f) > 0 {
			directives[f[0]] = f[1:]
		}
	}
	for _, d := range []string{"default-src", "connect-src", "form-action", "base-uri", "img-src"} {
		if diff := cmp.Diff([]string{"'none'"}, directives[d]); diff != "" {
			t.Errorf("%s (-want +got):\n%s", d, diff)
		}
	}
	var wantScripts, wantStyles []string
	for _, m := range elementRE.FindAllStringSubmatch(html, -1) {
		typ := regexp.MustCompile(`type="([^"]*)"`).FindStringSubmatch(m[2])
		sum := sha256.Sum256([]byte(m[3]))
		h := "'sha256-" + base64.StdEncoding.EncodeToString(sum[:]) + "'"
		switch {
		case m[1] == "style":
			wantStyles = append(wantStyles, h)
		case typ == nil || typ[1] == "module":
			wantScripts = append(wantScripts, h)
		}
	}
	if len(wantScripts) != 2 || len(wantStyles) != 1 {
		t.Fatalf("found %d running scripts and %d styles, want 2 (wasm_exec.js with start.js, the page) and 1", len(wantScripts), len(wantStyles))
	}
	got := func(d string) []string {
		var hs []string
		for _, s := range directives[d] {
			if hashRE.MatchString(s) {
				hs = append(hs, s)
			}
		}
		return hs
	}
	if diff := cmp.Diff(wantScripts, got("script-src")); diff != "" {
		t.Errorf("script-src hashes (-want +got):\n%s", diff)
	}
	if !slices.Contains(directives["script-src"], "'wasm-unsafe-eval'") || slices.Contains(directives["script-src"], "'unsafe-inline'") ||
		slices.Contains(directives["script-src"], "'unsafe-eval'") {
		t.Errorf("script-src = %v: want the hashes and 'wasm-unsafe-eval' only", directives["script-src"])
	}
	if diff := cmp.Diff(wantStyles, directives["style-src"]); diff != "" {
		t.Errorf("style-src (-want +got):\n%s", diff)
	}
}

// rebuild does in Go what js/share.js does in the page: the skeleton of the shell with each marker
// replaced by its element, the element's text taken from the page (by id), the worksheet's from doc
// escaped by inject.Escape and the result's written by inject.Result from it and result (doc nil: both as
// in the page).
func rebuild(t *testing.T, html string, doc, result []byte) string {
	t.Helper()
	var sh struct {
		Skeleton  string
		Worksheet string
		Result    string
		Parts     []struct{ Mark, Open, Close, ID string }
	}
	m := regexp.MustCompile(`<script type="application/json" id="` + assemble.ShellID + `">([^<]*)</script>`).FindStringSubmatch(html)
	if m == nil {
		t.Fatal("the page has no shell")
	}
	if err := json.Unmarshal([]byte(m[1]), &sh); err != nil {
		t.Fatal(err)
	}
	byID := map[string]string{}
	for _, e := range elementRE.FindAllStringSubmatch(html, -1) {
		if id := regexp.MustCompile(`\sid="([^"]*)"`).FindStringSubmatch(e[2]); id != nil {
			byID[id[1]] = e[3]
		}
	}
	out := sh.Skeleton
	for _, p := range sh.Parts {
		body, ok := byID[p.ID]
		if !ok {
			t.Fatalf("no element with id %q in the page", p.ID)
		}
		if p.ID == sh.Worksheet && doc != nil {
			esc, err := inject.Escape(doc)
			if err != nil {
				t.Fatal(err)
			}
			body = string(esc)
		}
		if p.ID == sh.Result && doc != nil {
			esc, _ := inject.Escape(doc)
			saved, err := inject.Result(esc, result)
			if err != nil {
				t.Fatal(err)
			}
			body = string(saved)
		}
		if strings.Count(out, p.Mark) != 1 {
			t.Fatalf("marker %s not once in the skeleton", p.Mark)
		}
		out = strings.Replace(out, p.Mark, p.Open+body+p.Close, 1)
	}
	return out
}

// TestShellRebuildsPage checks that the recipe in the shell is complete: following it with the page's
// own elements gives the page back byte for byte, and with another worksheet gives what package inject
// makes of the page, which inject.Extract reads back.
func TestShellRebuildsPage(t *testing.T) {
	html := page(t)
	if got := rebuild(t, html, nil, nil); got != html {
		i := 0
		for i < len(got) && i < len(html) && got[i] == html[i] {
			i++
		}
		t.Fatalf("the rebuilt page differs from the built one at byte %d: %.80q vs %.80q", i, got[i:], html[i:])
	}
	doc := []byte(`{"format":"gibbsheet-worksheet/1","title":"</script><img src=x onerror=alert(1)>","rows":[]}`)
	result, err := engine.EvaluateJSON(doc)
	if err != nil {
		t.Fatal(err)
	}
	want, err := inject.Worksheet([]byte(html), doc, result)
	if err != nil {
		t.Fatal(err)
	}
	if got := rebuild(t, html, doc, result); got != string(want) {
		t.Error("rebuilding with a new worksheet differs from inject.Worksheet")
	}
}

// TestWorksheetFromCommandLine writes a page for a given worksheet as a pipeline would, and reads the
// worksheet back from the file.
func TestWorksheetFromCommandLine(t *testing.T) {
	dir := t.TempDir()
	ws := filepath.Join(dir, "design.json")
	doc := `{"format":"gibbsheet-worksheet/1","title":"design 7","rows":[{"id":"r1","equation":"ATP + H2O = ADP + Pi"}]}`
	if err := os.WriteFile(ws, []byte(doc), 0o644); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(dir, "out", "design.html")
	if _, err := assemble.WriteFile(out, assemble.Options{Demo: ws}); err != nil {
		t.Fatal(err)
	}
	html, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	got, err := inject.Extract(html)
	if err != nil {
		t.Fatal(err)
	}
	want, _ := inject.Escape([]byte(doc))
	if string(got) != string(want) {
		t.Errorf("embedded worksheet %s, want %s", got, want)
	}
	checkSavedResult(t, html)
}

// TestSavedResult checks the result the built page carries for its worksheet: the engine's result for
// the worksheet element's text, under that text's fingerprint.
func TestSavedResult(t *testing.T) {
	checkSavedResult(t, []byte(page(t)))
}

// checkSavedResult checks that the page's result element holds {"for": fingerprint of the worksheet
// element's text, "result": the engine's result for it}.
func checkSavedResult(t *testing.T, html []byte) {
	t.Helper()
	ws, err := inject.Extract(html)
	if err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile(`<script type="application/json" id="` + inject.ResultID + `">([^<]*)</script>`).FindSubmatch(html)
	if m == nil {
		t.Fatal("the page has no result element")
	}
	var saved struct {
		For    string
		Result json.RawMessage
	}
	if err := json.Unmarshal(m[1], &saved); err != nil {
		t.Fatalf("the result element does not hold JSON: %v", err)
	}
	if want := inject.Fingerprint(ws); saved.For != want {
		t.Errorf("the saved result is for %q, the worksheet's fingerprint is %q", saved.For, want)
	}
	want, err := engine.EvaluateJSON(ws)
	if err != nil {
		t.Fatal(err)
	}
	var a, b any
	json.Unmarshal(want, &a)
	json.Unmarshal(saved.Result, &b)
	if diff := cmp.Diff(a, b); diff != "" {
		t.Errorf("the saved result is not the engine's for the worksheet (-want +got):\n%s", diff)
	}
}

// TestWithWorksheet puts a worksheet into a built page without building: the worksheet is read back,
// the page can still rebuild itself, and bad documents or pages are refused with a message.
func TestWithWorksheet(t *testing.T) {
	html := page(t)
	doc := []byte(`{"format":"gibbsheet-worksheet/1","title":"design 8 <b>","rows":[]}`)
	out, err := assemble.WithWorksheet([]byte(html), doc)
	if err != nil {
		t.Fatal(err)
	}
	got, _ := inject.Extract(out)
	want, _ := inject.Escape(doc)
	if string(got) != string(want) {
		t.Errorf("embedded %s, want %s", got, want)
	}
	checkSavedResult(t, out)
	if rebuilt := rebuild(t, string(out), nil, nil); rebuilt != string(out) {
		t.Error("a page made by WithWorksheet cannot rebuild itself")
	}
	for _, c := range []struct {
		page, doc, want string
	}{
		{html, `{"format":"gibbsheet-worksheet/2"}`, "newer"},
		{html, `{"title":"x"}`, "format"},
		{html, `{"format":`, "JSON"},
		{"<html></html>", string(doc), "no " + assemble.ShellID},
	} {
		if _, err := assemble.WithWorksheet([]byte(c.page), []byte(c.doc)); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("WithWorksheet(%.20q, %s): error %v, want one containing %q", c.page, c.doc, err, c.want)
		}
	}
}
