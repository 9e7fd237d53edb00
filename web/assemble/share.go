package assemble

import (
	"crypto/sha256"
	"encoding/base64"
	"encoding/json"
	"fmt"
	"regexp"
	"strings"
	"unicode/utf8"

	"gibbsheet/engine"
	"gibbsheet/web/inject"
)

// How the page saves itself. A page that has run cannot be serialized back to its file (the DOM holds
// what it drew), so the file carries the recipe of itself: the shell element (ShellID, inert JSON) holds
// the skeleton — index.html with the Content-Security-Policy filled in and every other marker left in
// place — and, for each marker, the opening and closing tag of the element that replaces it and that
// element's id. The elements' contents are raw text that the page never changes (script and style
// elements; the HTML parser keeps their text byte for byte, since Build refuses CR, NUL and invalid
// UTF-8 in them), so the page rebuilds its own file as
//
//	skeleton with each marker replaced by open + textContent of the element with that id + close
//
// except for the worksheet element, whose content is the current document escaped as inject.Escape does,
// and the result element, whose content is the result for it as inject.Result writes it (js/share.js).
// The scripts come back byte for byte, so the hashes in the policy stay valid.

// ShellID is the id of the element that holds the page's recipe of itself.
const ShellID = "gibbsheet-shell"

// Markers of the policy and of the shell in src/index.html.
const (
	markCSP   = "<!-- gibbsheet:csp -->"
	markShell = "<!-- gibbsheet:shell -->"
)

// shellPart is one element of the page as the shell describes it.
type shellPart struct {
	Mark  string `json:"mark"`
	Open  string `json:"open"`
	Close string `json:"close"`
	ID    string `json:"id"`
	body  string
}

// shell is the content of the shell element.
type shell struct {
	Skeleton  string      `json:"skeleton"`
	Worksheet string      `json:"worksheet"` // id of the worksheet element
	Result    string      `json:"result"`    // id of the element of the result saved with it
	Demo      string      `json:"demo"`      // the built-in demo's element text ("" when built with another)
	Parts     []shellPart `json:"parts"`
}

var (
	openTag = regexp.MustCompile(`^<(script|style)\b[^>]*>`)
	idAttr  = regexp.MustCompile(`\sid="([^"]*)"`)
	typeAtt = regexp.MustCompile(`\stype="([^"]*)"`)
)

// splitPart takes apart an element written as <script ...>text</script> or <style ...>text</style>,
// giving it an id derived from the marker when it has none.
func splitPart(mark, text string) (shellPart, error) {
	m := openTag.FindStringSubmatch(text)
	if m == nil || !strings.HasSuffix(text, "</"+m[1]+">") {
		return shellPart{}, fmt.Errorf("assemble: the part for %s is not one script or style element", mark)
	}
	closing := "</" + m[1] + ">"
	p := shellPart{Mark: mark, Open: m[0], Close: closing, body: text[len(m[0]) : len(text)-len(closing)]}
	if g := idAttr.FindStringSubmatch(p.Open); g != nil {
		p.ID = g[1]
	} else {
		name := strings.TrimSuffix(strings.TrimPrefix(mark, "<!-- gibbsheet:"), " -->")
		p.ID = "gibbsheet-part-" + strings.ReplaceAll(name, "_", "-")
		p.Open = p.Open[:len(p.Open)-1] + ` id="` + p.ID + `">`
	}
	if strings.ContainsAny(p.body, "\r\x00") || !utf8.ValidString(p.body) {
		return shellPart{}, fmt.Errorf("assemble: the part for %s holds CR, NUL or invalid UTF-8, which the browser would not keep as written", mark)
	}
	if strings.Contains(strings.ToLower(p.body), closing) {
		return shellPart{}, fmt.Errorf("assemble: the part for %s contains %s, which would end its element early", mark, closing)
	}
	return p, nil
}

// executes reports whether the browser runs the script element (classic or module), as opposed to a
// data block such as type="application/json".
func executes(open string) bool {
	if !strings.HasPrefix(open, "<script") {
		return false
	}
	g := typeAtt.FindStringSubmatch(open)
	if g == nil {
		return true
	}
	switch strings.ToLower(g[1]) {
	case "", "module", "text/javascript", "application/javascript":
		return true
	}
	return false
}

// cspHash is the policy's source expression for an inline element's text.
func cspHash(text string) string {
	sum := sha256.Sum256([]byte(text))
	return "'sha256-" + base64.StdEncoding.EncodeToString(sum[:]) + "'"
}

// Policy returns the Content-Security-Policy of a page whose inline scripts and style elements have the
// given texts: nothing from anywhere (default-src 'none', no connections, no forms, no base URL), only
// the listed inline scripts and styles, and the compilation of WebAssembly.
func Policy(scripts, styles []string) string {
	src := func(texts []string, extra ...string) string {
		var b strings.Builder
		for _, t := range texts {
			b.WriteString(" " + cspHash(t))
		}
		for _, e := range extra {
			b.WriteString(" " + e)
		}
		if b.Len() == 0 {
			return " 'none'"
		}
		return b.String()
	}
	return "default-src 'none'; script-src" + src(scripts, "'wasm-unsafe-eval'") + "; style-src" + src(styles) +
		"; connect-src 'none'; img-src 'none'; form-action 'none'; base-uri 'none'"
}

// fillPage puts the parts into the skeleton: the policy with the hashes of the parts' scripts and styles,
// the shell, and each part at its marker. Every marker must occur exactly once in the skeleton. demo is
// the worksheet element's text when it is the built-in demo, so that the page can label it as invented
// data as long as it is unchanged (a saved worksheet is not the demo).
func fillPage(skeleton string, parts []struct{ mark, text string }, demo string) (string, error) {
	sh := shell{Worksheet: inject.ElementID, Result: inject.ResultID, Demo: demo}
	var scripts, styles []string
	for _, p := range parts {
		sp, err := splitPart(p.mark, p.text)
		if err != nil {
			return "", err
		}
		if executes(sp.Open) {
			scripts = append(scripts, sp.body)
		} else if strings.HasPrefix(sp.Open, "<style") {
			styles = append(styles, sp.body)
		}
		sh.Parts = append(sh.Parts, sp)
	}
	meta := `<meta http-equiv="Content-Security-Policy" content="` + htmlAttr(Policy(scripts, styles)) + `">`
	skeleton, err := replaceMarks(skeleton, []shellPart{{Mark: markCSP, body: meta}})
	if err != nil {
		return "", err
	}
	sh.Skeleton = skeleton
	self := shellPart{Mark: markShell, Open: `<script type="application/json" id="` + ShellID + `">`, Close: "</script>", ID: ShellID}
	sh.Parts = append(sh.Parts, self)
	raw, err := json.Marshal(sh)
	if err != nil {
		return "", err
	}
	esc, err := inject.Escape(raw)
	if err != nil {
		return "", err
	}
	sh.Parts[len(sh.Parts)-1].body = string(esc)
	for i := range sh.Parts {
		p := &sh.Parts[i]
		if p.Mark != markCSP {
			p.body = p.Open + p.body + p.Close
		}
	}
	return replaceMarks(skeleton, sh.Parts)
}

// replaceMarks replaces each part's marker in text by the part's body. The markers are found in text
// before anything is inserted, so inserted text never counts as a marker.
func replaceMarks(text string, parts []shellPart) (string, error) {
	type at struct {
		i int
		p *shellPart
	}
	var spots []at
	for i := range parts {
		p := &parts[i]
		if n := strings.Count(text, p.Mark); n != 1 {
			return "", fmt.Errorf("assemble: index.html must contain %s exactly once, found %d", p.Mark, n)
		}
		spots = append(spots, at{strings.Index(text, p.Mark), p})
	}
	for i := 1; i < len(spots); i++ { // insertion sort by position; there are a handful
		for j := i; j > 0 && spots[j].i < spots[j-1].i; j-- {
			spots[j], spots[j-1] = spots[j-1], spots[j]
		}
	}
	var b strings.Builder
	last := 0
	for _, s := range spots {
		b.WriteString(text[last:s.i])
		b.WriteString(s.p.body)
		last = s.i + len(s.p.Mark)
	}
	b.WriteString(text[last:])
	return b.String(), nil
}

// checkWorksheet refuses a file that is not a worksheet document this version reads, with the engine's
// message (not JSON, not a worksheet, a newer format), so that a pipeline never writes a page that opens
// on an error.
func checkWorksheet(doc []byte) error {
	if _, _, err := engine.Decode(doc); err != nil {
		return fmt.Errorf("not a worksheet this page can open: %w", err)
	}
	return nil
}

// WithWorksheet returns a copy of a built page holding doc as its worksheet, without building anything:
// the fast way for a pipeline to write one file per design. The engine, the scripts and the policy stay
// as they are; doc must be a worksheet document this version reads.
func WithWorksheet(page, doc []byte) ([]byte, error) {
	if err := checkWorksheet(doc); err != nil {
		return nil, err
	}
	if !strings.Contains(string(page), `id="`+ShellID+`"`) {
		return nil, fmt.Errorf("assemble: the page was not built by this version (it has no %s element)", ShellID)
	}
	result, err := engine.EvaluateJSON(doc)
	if err != nil { // checkWorksheet read it, so the engine reads it too
		return nil, err
	}
	return inject.Worksheet(page, doc, result)
}

// savedResult returns the content of the result element for the worksheet element text worksheet: the
// engine's result for it, which the page shows until its own engine has computed one.
func savedResult(worksheet []byte) ([]byte, error) {
	result, err := engine.EvaluateJSON(worksheet)
	if err != nil {
		return nil, err
	}
	return inject.Result(worksheet, result)
}
