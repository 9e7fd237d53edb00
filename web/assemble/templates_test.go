package assemble_test

import (
	"bytes"
	"compress/gzip"
	"encoding/json"
	"io"
	"regexp"
	"strconv"
	"testing"

	"gibbsheet/pathways"
	"gibbsheet/web/assemble"
)

// TestTemplatesEmbedded builds the page and reads the templates element back: one entry per pathway
// template with its file, title, summary and the stored document, and nothing in it that could end
// the script element early.
func TestTemplatesEmbedded(t *testing.T) {
	p, err := assemble.Build(assemble.Options{Version: "test"})
	if err != nil {
		t.Fatal(err)
	}
	re := regexp.MustCompile(`<script type="application/octet-stream" id="` + assemble.TemplatesID +
		`" data-encoding="gzip\+text7" data-length="(\d+)">([^<]*)</script>`)
	m := re.FindAllSubmatch(p.HTML, -1)
	if len(m) != 1 {
		t.Fatalf("found %d templates elements whose text has no '<', want exactly 1", len(m))
	}
	n, _ := strconv.Atoi(string(m[0][1]))
	zr, err := gzip.NewReader(bytes.NewReader(assemble.FromText7(string(m[0][2]), n)))
	if err != nil {
		t.Fatal(err)
	}
	raw, err := io.ReadAll(zr)
	if err != nil {
		t.Fatal(err)
	}
	var got []struct {
		File, Title, Summary string
		Doc                  json.RawMessage
	}
	if err := json.Unmarshal(raw, &got); err != nil {
		t.Fatalf("templates element is not JSON: %v", err)
	}
	want, err := pathways.All()
	if err != nil {
		t.Fatal(err)
	}
	if len(got) != len(want) {
		t.Fatalf("%d templates embedded, pathways has %d", len(got), len(want))
	}
	for i, w := range want {
		g := got[i]
		if g.File != w.File || g.Title != w.Title || g.Summary != w.Summary {
			t.Errorf("template %d = %q %q %q, want %q %q %q", i, g.File, g.Title, g.Summary, w.File, w.Title, w.Summary)
		}
		var gd, wd any
		if err := json.Unmarshal(g.Doc, &gd); err != nil {
			t.Fatalf("%s: embedded document: %v", w.File, err)
		}
		json.Unmarshal(w.Doc, &wd)
		gj, _ := json.Marshal(gd)
		wj, _ := json.Marshal(wd)
		if string(gj) != string(wj) {
			t.Errorf("%s: embedded document differs from the stored one", w.File)
		}
	}
}
