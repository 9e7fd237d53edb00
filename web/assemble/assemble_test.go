package assemble_test

import (
	"bytes"
	"encoding/json"
	"math/rand/v2"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"gibbsheet/web"
	"gibbsheet/web/assemble"
	"gibbsheet/web/inject"
)

// TestText7RoundTrip checks the page encoding on edge lengths and on seeded random data.
func TestText7RoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	cases := [][]byte{nil, {0}, {0xff}, {'<', '\r', 0}, bytes.Repeat([]byte{0}, 15)}
	for n := range 40 {
		b := make([]byte, n*37)
		for i := range b {
			b[i] = byte(rng.UintN(256))
		}
		cases = append(cases, b)
	}
	for _, data := range cases {
		s := assemble.Text7(data)
		if got := assemble.FromText7(s, len(data)); !bytes.Equal(got, data) {
			t.Fatalf("round trip of %d bytes failed", len(data))
		}
		checkText7Safe(t, s)
		// 7 bits a character, and no more than 2 bytes for any character.
		if max := (len(data)*8 + 6) / 7 * 2; len(s) > max {
			t.Errorf("%d bytes encoded in %d bytes, more than %d", len(data), len(s), max)
		}
	}
}

func checkText7Safe(t *testing.T, s string) {
	t.Helper()
	if strings.ContainsAny(s, "\x00\r<") {
		t.Fatalf("encoded text holds NUL, CR or <")
	}
	// Latin-1 only, so that the browser holds the text one byte a character.
	if i := strings.IndexFunc(s, func(r rune) bool { return r > 0xff }); i >= 0 {
		t.Fatalf("encoded text holds %U at byte %d, beyond Latin-1", []rune(s[i:])[0], i)
	}
}

func FuzzText7(f *testing.F) {
	f.Add([]byte("\x00\r<script>"))
	f.Add([]byte{})
	f.Fuzz(func(t *testing.T, data []byte) {
		s := assemble.Text7(data)
		checkText7Safe(t, s)
		if got := assemble.FromText7(s, len(data)); !bytes.Equal(got, data) {
			t.Fatalf("round trip failed for %q", data)
		}
	})
}

// TestBundleSources bundles the page's real modules and checks the script is valid JavaScript (node
// --check) and exports what main.js imports.
func TestBundleSources(t *testing.T) {
	script, err := assemble.Bundle(web.Sources, "src/js", "main.js")
	if err != nil {
		t.Fatal(err)
	}
	if strings.Contains(script, "\nimport ") || strings.Contains(script, "\nexport ") {
		t.Error("import or export left in the bundle")
	}
	node, err := exec.LookPath("node")
	if err != nil {
		t.Fatalf("node is needed to check the bundle's syntax: %v", err)
	}
	path := filepath.Join(t.TempDir(), "bundle.js")
	if err := os.WriteFile(path, []byte(script), 0o644); err != nil {
		t.Fatal(err)
	}
	if out, err := exec.Command(node, "--check", path).CombinedOutput(); err != nil {
		t.Fatalf("bundle is not valid JavaScript: %v\n%s", err, out)
	}
}

// TestBundleRejects checks the bundler's messages for the forms it does not handle.
func TestBundleRejects(t *testing.T) {
	cases := []struct {
		name  string
		files map[string]string
		want  string
	}{
		{"renamed import", map[string]string{"main.js": `import { a as b } from "./x.js";`, "x.js": "export const a = 1;"}, "renaming"},
		{"default export", map[string]string{"main.js": "export default 1;"}, "only `export"},
		{"missing module", map[string]string{"main.js": `import { a } from "./x.js";`}, "not in"},
		{"missing name", map[string]string{"main.js": `import { b } from "./x.js";`, "x.js": "export const a = 1;"}, "does not export"},
		{"cycle", map[string]string{"main.js": `import { a } from "./x.js";`, "x.js": "import { m } from \"./main.js\";\nexport const a = 1;"}, "cycle"},
		{"literal over lines", map[string]string{"main.js": "export const t = `a\n  b`;"}, "spans lines"},
		{"indented export", map[string]string{"main.js": "  export const t = 1;"}, "first column"},
	}
	for _, c := range cases {
		fsys := memFS(t, c.files)
		_, err := assemble.Bundle(fsys, "js", "main.js")
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want one containing %q", c.name, err, c.want)
		}
	}
}

// TestBuildPage builds the whole page and checks its parts: one inert worksheet that no text can close,
// the engine, Go's wasm_exec.js and no reference to anything outside the file.
func TestBuildPage(t *testing.T) {
	demo := filepath.Join(t.TempDir(), "ws.json")
	// A title that would end the script element if it were not escaped.
	ws := `{"format":"gibbsheet-worksheet/1","title":"</script><b>x</b> & \u2028","rows":[]}`
	if err := os.WriteFile(demo, []byte(ws), 0o644); err != nil {
		t.Fatal(err)
	}
	p, err := assemble.Build(assemble.Options{Demo: demo, Version: "test"})
	if err != nil {
		t.Fatal(err)
	}
	html := string(p.HTML)
	if n := strings.Count(strings.ToLower(html), "</script"); n != strings.Count(strings.ToLower(html), "<script") {
		t.Errorf("%d script ends for %d script starts", n, strings.Count(html, "<script"))
	}
	// The page must be readable by package inject, which saving a worksheet into the page will use.
	body, err := inject.Extract(p.HTML)
	if err != nil {
		t.Fatal(err)
	}
	var got, want map[string]any
	if err := json.Unmarshal(body, &got); err != nil {
		t.Fatalf("embedded worksheet is not JSON: %v", err)
	}
	json.Unmarshal([]byte(ws), &want)
	if got["title"] != want["title"] {
		t.Errorf("title came back as %q", got["title"])
	}
	for _, part := range []string{`id="gs-engine"`, "globalThis.Go = class", `data-version="test"`, "gibbsheetPage"} {
		if !strings.Contains(html, part) {
			t.Errorf("page lacks %s", part)
		}
	}
	for _, outside := range []string{`src="http`, `href="http`, "import("} {
		if strings.Contains(html, outside) {
			t.Errorf("page refers outside itself: %s", outside)
		}
	}
	// The one link is the render-blocking one to an element of the page itself.
	if links := regexp.MustCompile(`<link\b[^>]*>`).FindAllString(html, -1); len(links) != 1 ||
		links[0] != `<link rel="expect" href="#gibbsheet-drawn" blocking="render">` || !strings.Contains(html, `id="gibbsheet-drawn"`) {
		t.Errorf("the page's links are %q, want only the render-blocking link to #gibbsheet-drawn, which it holds", links)
	}
	if p.GzipSize >= p.WasmSize {
		t.Errorf("gzip did not shrink the module: %d >= %d", p.GzipSize, p.WasmSize)
	}
}

// moduleKeyword matches a line that starts an import or export declaration: the keyword followed by white
// space, a brace, a star, a quote or the end (not an identifier such as "import0", nor "import!").
var moduleKeyword = regexp.MustCompile(`^(import|export)([\s{*"']|$)`)

// FuzzParseModule feeds arbitrary sources to the bundler: it must answer with a bundle or an error,
// never panic, and a bundle never keeps an import or export line.
func FuzzParseModule(f *testing.F) {
	f.Add("import { a, b } from \"./x.js\";\nexport function f() {}\n")
	f.Add("export const x = 1;\nexport class Y {}\n")
	f.Add("import {} from \"./main.js\";")
	f.Fuzz(func(t *testing.T, src string) {
		fsys := memFS(t, map[string]string{"main.js": src, "x.js": "export const a = 1, b = 2;\n"})
		script, err := assemble.Bundle(fsys, "js", "main.js")
		if err != nil {
			return
		}
		for _, line := range strings.Split(script, "\n") {
			if moduleKeyword.MatchString(line) {
				t.Fatalf("bundle keeps %q", line)
			}
		}
	})
}
