package browser

import (
	"bytes"
	"context"
	"encoding/json"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/browser"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/cdproto/network"
	cdppage "github.com/chromedp/cdproto/page"
	"github.com/chromedp/chromedp"
	"github.com/chromedp/chromedp/kb"
	"github.com/google/go-cmp/cmp"

	"gibbsheet/web/inject"
)

// filePage is a browser with a Gibbsheet file open, logging every network request, download and
// dialog, and every Content-Security-Policy violation.
type filePage struct {
	*page
	dir string // downloads land here, named by their GUID

	rec       sync.Mutex
	requests  []request         // every request the page started, in order
	names     map[string]string // download GUID -> suggested file name
	done      map[string]bool   // download GUID -> completed
	dialogs   []string          // messages of the dialogs shown (all accepted)
	rejectDlg bool              // dismiss dialogs instead of accepting them
}

// watch is injected before the page's own scripts: it notes what the page's policy blocks.
const watch = `window.__csp = []; document.addEventListener("securitypolicyviolation",
	(e) => window.__csp.push(e.violatedDirective + " " + e.blockedURI));`

// openFile starts a fresh Chromium with its own profile (profile "" makes a new one), opens path from
// file:// and waits for the first result. offline cuts the browser off the network first.
func openFile(t *testing.T, path, profile string, offline bool) *filePage {
	t.Helper()
	if profile == "" {
		profile = t.TempDir()
	}
	// Anything that tried to leave the machine would go to a closed local port.
	alloc, cancelAlloc := chromedp.NewExecAllocator(context.Background(),
		browserOptions(profile, 1400, 1000, chromedp.Flag("proxy-server", "127.0.0.1:9"))...)
	ctx, cancel := chromedp.NewContext(alloc)
	t.Cleanup(func() {
		cancel()
		cancelAlloc()
	})
	fp := &filePage{page: &page{t: t, ctx: ctx}, dir: t.TempDir(), names: map[string]string{}, done: map[string]bool{}}
	if err := chromedp.Listen(ctx, fp.listenMore); err != nil {
		t.Fatalf("starting Chromium: %v", err)
	}
	if err := chromedp.ListenBrowser(ctx, fp.listenBrowser); err != nil {
		t.Fatal(err)
	}
	fp.call(func(ctx context.Context) error {
		if _, err := chromedp.CallBrowser(ctx, browser.SetDownloadBehavior, browser.SetDownloadBehaviorParams{
			Behavior: browser.SetDownloadBehaviorBehaviorAllowAndName, DownloadPath: fp.dir, EventsEnabled: ptr(true)}); err != nil {
			return err
		}
		if _, err := chromedp.Call(ctx, network.Enable, network.EnableParams{}); err != nil {
			return err
		}
		if offline {
			if _, err := chromedp.Call(ctx, network.OverrideNetworkState, network.OverrideNetworkStateParams{
				Offline: true, DownloadThroughput: -1, UploadThroughput: -1}); err != nil {
				return err
			}
		}
		_, err := chromedp.Call(ctx, cdppage.AddScriptToEvaluateOnNewDocument, cdppage.AddScriptToEvaluateOnNewDocumentParams{Source: watch})
		return err
	})
	fp.do(chromedp.EmulateViewport(1400, 1000), chromedp.Navigate("file://"+path))
	fp.waitFor(`document.body.dataset.ready === "true"`)
	fp.clean()
	return fp
}

func ptr[T any](v T) *T { return &v }

// request is one request the page started; blocked is the browser's reason for stopping it before it
// went anywhere ("csp" when the page's policy refused it).
type request struct {
	id      network.RequestID
	url     string
	blocked string
}

func (p *filePage) listenMore(ev any) {
	p.listen(ev)
	switch ev := ev.(type) {
	case *network.EventRequestWillBeSent:
		p.rec.Lock()
		p.requests = append(p.requests, request{id: ev.RequestID, url: ev.Request.URL})
		p.rec.Unlock()
	case *network.EventLoadingFailed:
		p.rec.Lock()
		for i := range p.requests {
			if p.requests[i].id == ev.RequestID {
				p.requests[i].blocked = string(ev.BlockedReason)
			}
		}
		p.rec.Unlock()
	case *cdppage.EventJavascriptDialogOpening:
		p.rec.Lock()
		p.dialogs = append(p.dialogs, ev.Message)
		accept := !p.rejectDlg
		p.rec.Unlock()
		go chromedp.Call(p.ctx, cdppage.HandleJavaScriptDialog, cdppage.HandleJavaScriptDialogParams{Accept: accept})
	}
}

func (p *filePage) listenBrowser(ev any) {
	p.rec.Lock()
	defer p.rec.Unlock()
	switch ev := ev.(type) {
	case *browser.EventDownloadWillBegin:
		p.names[ev.GUID] = ev.SuggestedFilename
	case *browser.EventDownloadProgress:
		if ev.State == browser.DownloadProgressStateCompleted {
			p.done[ev.GUID] = true
		}
	}
}

// clean fails the test if the page threw, logged an error or broke its own policy so far.
func (p *filePage) clean() {
	p.t.Helper()
	p.noErrors()
	if v := eval[[]string](p.page, `window.__csp`); len(v) > 0 {
		p.t.Fatalf("the page broke its Content-Security-Policy: %v", v)
	}
}

// download clicks the button and returns the name and content of the file it downloads.
func (p *filePage) download(button string) (string, []byte) {
	p.t.Helper()
	p.rec.Lock()
	before := len(p.done)
	p.rec.Unlock()
	p.do(chromedp.Click(chromedp.CSS(button)))
	deadline := time.Now().Add(30 * time.Second)
	for time.Now().Before(deadline) {
		p.rec.Lock()
		for guid := range p.done {
			if len(p.done) > before && !p.seen(guid) {
				name := p.names[guid]
				p.rec.Unlock()
				data, err := os.ReadFile(filepath.Join(p.dir, guid))
				if err != nil {
					p.t.Fatal(err)
				}
				p.markSeen(guid)
				return name, data
			}
		}
		p.rec.Unlock()
		time.Sleep(50 * time.Millisecond)
	}
	p.t.Fatalf("clicking %s downloaded nothing", button)
	return "", nil
}

var seenDownloads sync.Map

func (p *filePage) seen(guid string) bool { _, ok := seenDownloads.Load(guid); return ok }
func (p *filePage) markSeen(guid string)  { seenDownloads.Store(guid, true) }

// doc is the open worksheet document as the page holds it.
func (p *filePage) doc() map[string]any {
	p.t.Helper()
	var v map[string]any
	if err := json.Unmarshal([]byte(eval[string](p.page, `JSON.stringify(gibbsheetPage.store.doc)`)), &v); err != nil {
		p.t.Fatal(err)
	}
	return v
}

// embedded reads the worksheet document out of a saved file with package inject.
func embedded(t *testing.T, html []byte) map[string]any {
	t.Helper()
	raw, err := inject.Extract(html)
	if err != nil {
		t.Fatal(err)
	}
	var v map[string]any
	if err := json.Unmarshal(raw, &v); err != nil {
		t.Fatalf("the saved worksheet is not JSON: %v", err)
	}
	return v
}

// outside lists the recorded requests that did not stay inside the file itself: every one but the file,
// the downloads it made (blob:), inline data (data:, which the browser's own error pages use) and those the
// policy stopped before they left (blocked "csp"). A request stopped by the policy is listed apart.
func (p *filePage) outside(self string) (out, stopped []string) {
	p.rec.Lock()
	defer p.rec.Unlock()
	for _, r := range p.requests {
		switch {
		case r.url == "file://"+self, strings.HasPrefix(r.url, "blob:"), strings.HasPrefix(r.url, "data:"):
		case r.blocked == string(network.BlockedReasonCsp):
			stopped = append(stopped, r.url)
		default:
			out = append(out, r.url+" (blocked: "+r.blocked+")")
		}
	}
	return out, stopped
}

// TestSaveAndReopen edits the demo, saves the page as a file, opens the saved file in a new profile
// with the network off, compares the worksheet, edits and saves it again; a file opened and saved
// without edits comes back byte for byte. No request leaves the file at any point.
func TestSaveAndReopen(t *testing.T) {
	p := openFile(t, pagePath, "", false)
	title := `Glycolysis try 2 </script><img src=x onerror="window.__pwned=1"> & ‘quotes’`
	p.typeInto("#ws-title", title)
	eq := `#grid-body tr.row[data-id="` + eval[string](p.page, `gibbsheetPage.store.doc.rows[0].id`) + `"] input.eq-input`
	p.typeInto(eq, "ATP + H2O = ADP + Pi")
	// Line and paragraph separators (legal in JSON, not in a script before ES2019) in the notes, set
	// through the page's store: a text field does not take them from key events.
	eval[bool](p.page, `(() => { gibbsheetPage.store.doc.notes = "a\u2028b\u2029c"; gibbsheetPage.recompute(); return true; })()`)
	want := p.doc()
	if want["title"] != title {
		t.Fatalf("title in the document = %q", want["title"])
	}
	t0 := time.Now()
	name, saved := p.download("#save-file")
	t.Logf("saved %d bytes in %v (click to completed download)", len(saved), time.Since(t0).Round(time.Millisecond))
	p.shot("saved-message")
	if !strings.HasSuffix(name, ".html") || !strings.HasPrefix(name, "Glycolysis try 2") || strings.ContainsAny(name, `/<>"`) {
		t.Errorf("suggested file name %q", name)
	}
	if diff := cmp.Diff(want, embedded(t, saved)); diff != "" {
		t.Errorf("worksheet in the saved file (-page +file):\n%s", diff)
	}
	// The page escapes exactly as package inject does.
	raw, _ := inject.Extract(saved)
	esc, err := inject.Escape([]byte(eval[string](p.page, `JSON.stringify(gibbsheetPage.store.doc)`)))
	if err != nil || !bytes.Equal(raw, esc) {
		t.Errorf("the page's escaping differs from inject.Escape:\npage   %s\ninject %s", raw, esc)
	}
	if bytes.Count(bytes.ToLower(saved), []byte("</script")) != bytes.Count(bytes.ToLower(saved), []byte("<script")) {
		t.Error("the saved file has unbalanced script elements")
	}
	p.clean()
	if out, stopped := p.outside(pagePath); len(out)+len(stopped) > 0 {
		t.Errorf("the page made requests outside itself: %v %v", out, stopped)
	}

	// A colleague opens the file on a machine with no network.
	savedPath := filepath.Join(t.TempDir(), "shared.html")
	if err := os.WriteFile(savedPath, saved, 0o644); err != nil {
		t.Fatal(err)
	}
	q := openFile(t, savedPath, "", true)
	q.shot("reopened-offline")
	if diff := cmp.Diff(want, q.doc()); diff != "" {
		t.Errorf("worksheet after reopening (-saved +reopened):\n%s", diff)
	}
	if got := eval[string](q.page, `document.getElementById("ws-title").value`); got != title {
		t.Errorf("title field shows %q, want %q", got, title)
	}
	if !eval[bool](q.page, `document.getElementById("demo-flag").hidden`) {
		t.Error("a saved worksheet is labelled as the invented demo")
	}
	if eval[bool](q.page, `window.__pwned !== undefined`) {
		t.Fatal("text of the worksheet ran as script")
	}
	// Saved again without an edit: the same file, byte for byte.
	_, again := q.download("#save-file")
	if !bytes.Equal(again, saved) {
		t.Errorf("open-then-save changed the file (%d bytes, was %d)", len(again), len(saved))
	}
	// The colleague edits and sends it back.
	q.do(chromedp.Click(chromedp.CSS("#add-row")))
	q.do(chromedp.KeyEvent("glucose + ATP = glucose 6-phosphate + ADP"))
	back := q.doc()
	_, returned := q.download("#save-file")
	if diff := cmp.Diff(back, embedded(t, returned)); diff != "" {
		t.Errorf("worksheet sent back (-page +file):\n%s", diff)
	}
	if rows := back["rows"].([]any); len(rows) != len(want["rows"].([]any))+1 {
		t.Errorf("%d rows after adding one to %d", len(rows), len(want["rows"].([]any)))
	}
	// Back home, the file sent back opens in the page through "Open a file…".
	backPath := filepath.Join(t.TempDir(), "returned.html")
	if err := os.WriteFile(backPath, returned, 0o644); err != nil {
		t.Fatal(err)
	}
	p.do(chromedp.SetUploadFiles(chromedp.CSS("#import-input"), []string{backPath}))
	p.waitFor(`document.getElementById("share-msg").textContent.includes("Opened")`)
	if diff := cmp.Diff(back, p.doc()); diff != "" {
		t.Errorf("the returned file opened in the page (-sent +opened):\n%s", diff)
	}
	q.clean()
	if out, stopped := q.outside(savedPath); len(out)+len(stopped) > 0 {
		t.Errorf("the saved file made requests outside itself: %v %v", out, stopped)
	}
}

// TestAutosave edits, reloads and finds the edits; the Worksheets list keeps them, and renames,
// duplicates, opens and deletes worksheets.
func TestAutosave(t *testing.T) {
	p := openFile(t, pagePath, "", false)
	p.typeInto("#ws-title", "kept across reloads")
	p.do(chromedp.Click(chromedp.CSS("#add-row")))
	p.do(chromedp.KeyEvent("ATP + H2O = ADP + Pi"))
	want := p.doc()
	p.do(chromedp.Reload())
	p.waitFor(`document.body.dataset.ready === "true"`)
	if diff := cmp.Diff(want, p.doc()); diff != "" {
		t.Errorf("worksheet after reloading (-before +after):\n%s", diff)
	}
	if msg := p.text("#share-msg"); !strings.Contains(msg, "kept in this browser") {
		t.Errorf("no word about the kept edits: %q", msg)
	}
	// The file's own version is one click away, and the kept one stays in the list.
	p.do(chromedp.Click(chromedp.CSS("#open-file-version")))
	if got := p.doc()["title"]; got == "kept across reloads" {
		t.Error("the file's version did not open")
	}
	p.do(chromedp.Click(chromedp.CSS("#show-sheets")))
	p.waitFor(`document.querySelectorAll("#sheets-list li").length === 1`)
	p.shot("worksheets-list")
	item := `#sheets-list li`
	if got := p.text(item + " .sheet-name"); got != "kept across reloads" {
		t.Errorf("list shows %q", got)
	}
	p.do(chromedp.Click(chromedp.CSS(item + ` button[data-act="Duplicate"]`)))
	p.waitFor(`document.querySelectorAll("#sheets-list li").length === 2`)
	// Rename the copy, then open it.
	idx := eval[int](p.page, `[...document.querySelectorAll("#sheets-list .sheet-name")].findIndex(e => e.textContent.endsWith("(copy)"))`)
	if idx < 0 {
		t.Fatal("no copy in the list")
	}
	nth := func(i int) string { return `#sheets-list li:nth-child(` + strconv.Itoa(i+1) + `)` }
	p.do(chromedp.Click(chromedp.CSS(nth(idx) + ` button[data-act="Rename"]`)))
	p.do(chromedp.KeyEvent("second design"), chromedp.KeyEvent(kb.Enter))
	p.waitFor(`[...document.querySelectorAll("#sheets-list .sheet-name")].some(e => e.textContent === "second design")`)
	idx = eval[int](p.page, `[...document.querySelectorAll("#sheets-list .sheet-name")].findIndex(e => e.textContent === "second design")`)
	p.do(chromedp.Click(chromedp.CSS(nth(idx) + ` button[data-act="Open"]`)))
	if got := p.doc()["title"]; got != "second design" {
		t.Errorf("opened %q, want the renamed copy", got)
	}
	if diff := cmp.Diff(want["rows"], p.doc()["rows"]); diff != "" {
		t.Errorf("the copy's rows (-original +copy):\n%s", diff)
	}
	// Delete the first one (asks; the test accepts).
	idx = eval[int](p.page, `[...document.querySelectorAll("#sheets-list .sheet-name")].findIndex(e => e.textContent === "kept across reloads")`)
	p.do(chromedp.Click(chromedp.CSS(nth(idx) + ` button[data-act="Delete"]`)))
	p.waitFor(`![...document.querySelectorAll("#sheets-list .sheet-name")].some(e => e.textContent === "kept across reloads")`)
	p.rec.Lock()
	asked := len(p.dialogs) == 1 && strings.Contains(p.dialogs[0], "Delete")
	p.rec.Unlock()
	if !asked {
		t.Errorf("deleting did not ask first: dialogs %q", p.dialogs)
	}
	p.clean()
}

// TestUndoRedo takes back and replays typing, a new row and a title with the usual keys and buttons.
func TestUndoRedo(t *testing.T) {
	p := openFile(t, pagePath, "", false)
	start := p.doc()
	p.do(chromedp.Click(chromedp.CSS("#add-row")))
	p.do(chromedp.KeyEvent("ATP + H2O = ADP + Pi"))
	typed := p.doc()
	p.typeInto("#ws-title", "renamed")
	renamed := p.doc()

	p.do(chromedp.KeyEvent("z", chromedp.KeyModifiers(chromedp.ModifierCtrl)))
	if diff := cmp.Diff(typed, p.doc()); diff != "" {
		t.Errorf("after one undo (-want +got):\n%s", diff)
	}
	if got := eval[string](p.page, `document.getElementById("ws-title").value`); got != typed["title"] {
		t.Errorf("title field shows %q after undo", got)
	}
	p.do(chromedp.KeyEvent("z", chromedp.KeyModifiers(chromedp.ModifierCtrl)))
	// Typing the equation is one step, adding the row another.
	if rows := p.doc()["rows"].([]any); rows[len(rows)-1].(map[string]any)["equation"] != "" {
		t.Errorf("after two undos the new row holds %v, want it empty", rows[len(rows)-1])
	}
	p.do(chromedp.Click(chromedp.CSS("#undo")))
	if diff := cmp.Diff(start, p.doc()); diff != "" {
		t.Errorf("after three undos (-start +got):\n%s", diff)
	}
	p.do(chromedp.KeyEvent("z", chromedp.KeyModifiers(chromedp.ModifierCtrl, chromedp.ModifierShift)))
	p.do(chromedp.KeyEvent("y", chromedp.KeyModifiers(chromedp.ModifierCtrl)))
	p.do(chromedp.Click(chromedp.CSS("#redo")))
	if diff := cmp.Diff(renamed, p.doc()); diff != "" {
		t.Errorf("after three redos (-want +got):\n%s", diff)
	}
	if !eval[bool](p.page, `document.getElementById("redo").disabled`) {
		t.Error("redo is still offered at the newest state")
	}
	p.clean()
}

// TestBadFiles opens each kind of bad file: every one gets a clear message, and the open worksheet is
// untouched.
func TestBadFiles(t *testing.T) {
	p := openFile(t, pagePath, "", false)
	dir := t.TempDir()
	big := append([]byte(`{"format":"gibbsheet-worksheet/1","notes":"`), bytes.Repeat([]byte("x"), 5*1024*1024)...)
	big = append(big, `"}`...)
	cases := []struct {
		name, content, want string
	}{
		{"numbers.json", `{"a": 1, "b": [2, 3]}`, "not a Gibbsheet worksheet"},
		{"list.json", `[1, 2, 3]`, "not a worksheet"},
		{"future.json", `{"format":"gibbsheet-worksheet/2","rows":[]}`, "newer Gibbsheet (format version 2)"},
		{"big.json", string(big), "up to 5 MB"},
		{"broken.json", `{"format":"gibbsheet-worksheet/1", "rows": [`, "not valid JSON"},
		{"wrongtype.json", `{"format":"gibbsheet-worksheet/1","rows":"none"}`, "cannot be read as a worksheet"},
		{"page.html", `<!doctype html><title>x</title><p>hello`, "not a saved Gibbsheet worksheet"},
		{`<img src=x onerror=window.__pwned=1>.json`, `{"format":"gibbsheet-worksheet/1",`, "not valid JSON"},
	}
	before := p.doc()
	for _, c := range cases {
		path := filepath.Join(dir, c.name)
		if err := os.WriteFile(path, []byte(c.content), 0o644); err != nil {
			t.Fatal(err)
		}
		p.do(chromedp.SetUploadFiles(chromedp.CSS("#import-input"), []string{path}))
		p.waitFor(`document.getElementById("share-msg").textContent.includes(` + jsString(c.name) + `)`)
		msg := p.text("#share-msg")
		if !strings.Contains(msg, c.want) || !strings.Contains(msg, "unchanged") && !strings.Contains(msg, "Nothing was changed") {
			t.Errorf("%s: message %q, want one saying %q and that nothing changed", c.name, msg, c.want)
		}
		if diff := cmp.Diff(before, p.doc()); diff != "" {
			t.Errorf("%s changed the open worksheet (-before +after):\n%s", c.name, diff)
		}
		if c.name[0] == '<' {
			p.shot("bad-file-hostile-name")
		}
	}
	if eval[bool](p.page, `window.__pwned !== undefined || document.querySelector("#share-msg img") !== null`) {
		t.Fatal("a file name was read as markup")
	}
	p.clean()
}

// hostile is text that would run script if it were ever inserted as markup or ended its element.
const hostile = `</script><img src=x onerror="window.__pwned=1"><script>window.__pwned=2</script><!--`

// TestHostileWorksheet opens a worksheet whose every name is hostile, from a file and as the page's own
// worksheet: everything shows literally and no script runs.
func TestHostileWorksheet(t *testing.T) {
	doc := map[string]any{
		"format": "gibbsheet-worksheet/1", "title": hostile, "notes": hostile,
		"defaultConcentration": "1 mM", "conditions": map[string]any{},
		"concentrations": map[string]any{hostile: "1 mM"},
		"compounds":      []any{map[string]any{"id": hostile, "name": hostile, "dfG0prime": -10}},
		"values":         map[string]any{},
		"rows": []any{
			map[string]any{"id": "r1", "equation": "ATP + H2O = ADP + " + hostile, "times": 1, "dG0": nil, "note": hostile},
			map[string]any{"id": "r2", "equation": hostile + " = ATP", "times": 1, "dG0": nil, "note": ""},
		},
	}
	raw, _ := json.Marshal(doc)
	var want map[string]any
	json.Unmarshal(raw, &want)
	dir := t.TempDir()
	wsPath := filepath.Join(dir, hostile[2:8]+".json")
	if err := os.WriteFile(wsPath, raw, 0o644); err != nil {
		t.Fatal(err)
	}
	p := openFile(t, pagePath, "", false)
	p.do(chromedp.SetUploadFiles(chromedp.CSS("#import-input"), []string{wsPath}))
	p.waitFor(`gibbsheetPage.store.doc.title === ` + jsString(hostile))
	p.shot("hostile-worksheet")
	check := func(p *filePage) {
		t.Helper()
		if eval[bool](p.page, `window.__pwned !== undefined`) {
			t.Fatal("a name in the worksheet ran as script")
		}
		if n := eval[int](p.page, `document.querySelectorAll("img, body script:not([type]), iframe, object").length`); n != 2 {
			t.Errorf("%d img/script/iframe/object elements, want only the page's own two scripts (the page's, wasm_exec's)", n)
		}
		if got := eval[string](p.page, `document.getElementById("ws-title").value`); got != hostile {
			t.Errorf("title shows %q", got)
		}
		// The row's note is shown in its field, as text.
		if got := eval[string](p.page, `document.querySelector("#grid-body .note-input")?.value ?? ""`); got != hostile {
			t.Errorf("the row note shows %q, want it literally", got)
		}
	}
	check(p)
	// Saved and reopened, the same holds.
	_, saved := p.download("#save-file")
	if diff := cmp.Diff(want, embedded(t, saved)); diff != "" {
		t.Errorf("hostile worksheet in the saved file (-want +got):\n%s", diff)
	}
	path := filepath.Join(dir, "hostile.html")
	os.WriteFile(path, saved, 0o644)
	q := openFile(t, path, "", true)
	check(q)
	p.clean()
	q.clean()
}

// TestExports writes the worksheet (JSON), the results (CSV) and copies the table; the JSON opens again
// unchanged, and the CSV and the copied text are the engine's table.
func TestExports(t *testing.T) {
	p := openFile(t, pagePath, "", false)
	want := p.doc()
	name, data := p.download("#export-json")
	if !strings.HasSuffix(name, ".json") {
		t.Errorf("JSON file named %q", name)
	}
	var got map[string]any
	if err := json.Unmarshal(data, &got); err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff(want, got); diff != "" {
		t.Errorf("exported worksheet (-page +file):\n%s", diff)
	}
	name, csvData := p.download("#export-csv")
	if !strings.HasSuffix(name, ".csv") || !bytes.HasPrefix(csvData, []byte("\ufeffrow,equation,")) {
		t.Errorf("CSV %q starts %q", name, csvData[:min(40, len(csvData))])
	}
	lines := strings.Count(string(csvData), "\r\n")
	if rows := len(want["rows"].([]any)); lines != rows+2 {
		t.Errorf("CSV has %d lines for %d rows, want header, rows and total", lines, rows)
	}
	// The copied text: the clipboard call is recorded by the page itself.
	eval[bool](p.page, `(() => { window.__copied = null; navigator.clipboard.writeText = async (t) => { window.__copied = t; }; return true; })()`)
	p.do(chromedp.Click(chromedp.CSS("#copy-table")))
	p.waitFor(`window.__copied !== null`)
	tsv := eval[string](p.page, `window.__copied`)
	if !strings.HasPrefix(tsv, "row\tequation\ttimes\t") || strings.Count(tsv, "\n") != lines {
		t.Errorf("copied table starts %q with %d lines", tsv[:min(60, len(tsv))], strings.Count(tsv, "\n"))
	}
	if !strings.Contains(p.text("#share-msg"), "copied") {
		t.Errorf("no word that the table was copied: %q", p.text("#share-msg"))
	}
	// Re-import the exported JSON: the worksheet is the same.
	path := filepath.Join(t.TempDir(), "again.json")
	os.WriteFile(path, data, 0o644)
	p.do(chromedp.SetUploadFiles(chromedp.CSS("#import-input"), []string{path}))
	p.waitFor(`document.getElementById("share-msg").textContent.includes("Opened")`)
	if diff := cmp.Diff(want, p.doc()); diff != "" {
		t.Errorf("re-imported worksheet (-exported +imported):\n%s", diff)
	}
	p.clean()
}

// TestPrintView shows the page as printed: no buttons, the grid within the page width, the charts kept.
func TestPrintView(t *testing.T) {
	p := openFile(t, pagePath, "", false)
	p.call(func(ctx context.Context) error {
		_, err := chromedp.Call(ctx, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: "print"})
		return err
	})
	p.do(chromedp.EmulateViewport(794, 1123)) // A4 at 96 dpi
	p.shot("print-view")
	if eval[bool](p.page, `getComputedStyle(document.querySelector(".file-bar")).display !== "none"`) {
		t.Error("the file buttons are printed")
	}
	if w := eval[float64](p.page, `document.getElementById("grid").getBoundingClientRect().right`); w > 794 {
		t.Errorf("the grid runs to x = %v, past the paper (794 px)", w)
	}
	if n := eval[int](p.page, `document.querySelectorAll(".chart svg").length`); n < 2 {
		t.Errorf("%d charts in the print view", n)
	}
	p.clean()
}

// TestStorageRefused makes the browser refuse local storage: the page says so, and asks before a new
// worksheet replaces edits that are kept nowhere; saying no keeps them.
func TestStorageRefused(t *testing.T) {
	p := openFile(t, pagePath, "", false)
	eval[bool](p.page, `(() => { Storage.prototype.setItem = function () { throw new DOMException("the quota is full", "QuotaExceededError"); }; return true; })()`)
	p.typeInto("#ws-title", "kept nowhere")
	p.waitFor(`document.getElementById("share-msg").textContent.includes("refused to keep")`)
	p.rec.Lock()
	p.rejectDlg = true
	p.rec.Unlock()
	p.do(chromedp.Click(chromedp.CSS("#new-sheet")))
	p.waitFor(`true`)
	time.Sleep(300 * time.Millisecond)
	p.rec.Lock()
	dialogs := append([]string(nil), p.dialogs...)
	p.rec.Unlock()
	if len(dialogs) != 1 || !strings.Contains(dialogs[0], "Discard") {
		t.Errorf("dialogs %q, want one question before discarding", dialogs)
	}
	if got := p.doc()["title"]; got != "kept nowhere" {
		t.Errorf("after saying no, the open worksheet is %q", got)
	}
	p.noErrors()
}

// TestPolicyBlocks has the page try to reach out — a connection, an image, a frame — and checks that
// its own policy stops each one before any request is made. 192.0.2.1 is a documentation address
// (RFC 5737) that nothing answers.
func TestPolicyBlocks(t *testing.T) {
	p := openFile(t, pagePath, "", false)
	got := eval[string](p.page, `fetch("http://192.0.2.1/x").then(() => "fetched", (e) => "refused")`)
	if got != "refused" {
		t.Errorf("fetch: %s", got)
	}
	eval[bool](p.page, `(() => { const i = new Image(); i.src = "http://192.0.2.1/i.png"; document.body.append(i);
		const f = document.createElement("iframe"); f.src = "http://192.0.2.1/"; document.body.append(f); return true; })()`)
	p.waitFor(`window.__csp.length >= 3`)
	v := strings.Join(eval[[]string](p.page, `window.__csp`), "\n")
	for _, d := range []string{"connect-src", "img-src", "frame-src"} {
		if !strings.Contains(v, d) {
			t.Errorf("no %s violation in:\n%s", d, v)
		}
	}
	out, stopped := p.outside(pagePath)
	if len(out) > 0 {
		t.Errorf("requests left the file: %v", out)
	}
	if !slices.Contains(stopped, "http://192.0.2.1/i.png") {
		t.Errorf("the image request was not stopped by the policy: stopped %v", stopped)
	}
}
