package inject

import (
	"bytes"
	"encoding/json"
	"fmt"
	"hash/fnv"
	"testing"

	"github.com/google/go-cmp/cmp"
)

const page = `<html><head><script type="application/json" id="gibbsheet-worksheet">{}</script></head></html>`

func TestRoundTripHostileText(t *testing.T) {
	doc := []byte(`{"format":"gibbsheet-worksheet/1","title":"</script><img src=x onerror=alert(1)> <!-- & \u2028",` +
		`"rows":[{"id":"r1","equation":"A = B","note":"</SCRIPT>"}]}`)
	out, err := Worksheet([]byte(page), doc, nil)
	if err != nil {
		t.Fatal(err)
	}
	inner, err := Extract(out)
	if err != nil {
		t.Fatal(err)
	}
	for _, bad := range []string{"</script", "</SCRIPT", "<!--", "<img"} {
		if bytes.Contains(bytes.ToLower(inner), bytes.ToLower([]byte(bad))) {
			t.Errorf("embedded data contains %q: %s", bad, inner)
		}
	}
	var want, got any
	if err := json.Unmarshal(doc, &want); err != nil {
		t.Fatal(err)
	}
	if err := json.Unmarshal(inner, &got); err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff(want, got); diff != "" {
		t.Errorf("document changed by embedding (-want +got):\n%s", diff)
	}
	// Embedding the extracted text again gives the same page: a round trip is lossless.
	again, err := Worksheet(out, inner, nil)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(again, out) {
		t.Errorf("second embedding changed the page")
	}
}

func TestErrors(t *testing.T) {
	if _, err := Worksheet([]byte("<html></html>"), []byte("{}"), nil); err == nil {
		t.Error("page without element: want error")
	}
	if _, err := Worksheet([]byte(page), []byte("{"), nil); err == nil {
		t.Error("broken JSON: want error")
	}
	if _, err := Worksheet([]byte(withResult), []byte("{}"), []byte("{")); err == nil {
		t.Error("broken result JSON: want error")
	}
	if _, err := Worksheet([]byte(page+`<script type="application/json" id="gibbsheet-result">`), []byte("{}"), nil); err == nil {
		t.Error("result element not closed: want error")
	}
}

const withResult = `<html><head><script type="application/json" id="gibbsheet-worksheet">{}</script>` +
	`<script type="application/json" id="gibbsheet-result">null</script></head></html>`

// TestSavedResult puts a worksheet and its result into a page: the result element holds the result
// under the fingerprint of the worksheet element's text, escaped like the worksheet; no result gives null.
func TestSavedResult(t *testing.T) {
	doc := []byte(`{"format":"gibbsheet-worksheet/1","title":"µM </script>"}`)
	result := []byte(`{"rows": [], "warnings": [{"message": "</script><!--"}]}`)
	out, err := Worksheet([]byte(withResult), doc, result)
	if err != nil {
		t.Fatal(err)
	}
	esc, _ := Escape(doc)
	want := `<script type="application/json" id="gibbsheet-result">{"for":"` + Fingerprint(esc) +
		`","result":{"rows":[],"warnings":[{"message":"\u003c/script\u003e\u003c!--"}]}}</script>`
	if !bytes.Contains(out, []byte(want)) {
		t.Errorf("page %s\nlacks %s", out, want)
	}
	out, err = Worksheet(out, doc, nil)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Contains(out, []byte(`id="gibbsheet-result">null</script>`)) {
		t.Errorf("no result: want null in %s", out)
	}
}

// TestFingerprint checks FNV-1a over UTF-16 code units. For ASCII text the code units are the bytes, so
// the value is the standard 32-bit FNV-1a, checked against Go's hash/fnv and against the published test
// vectors of the FNV reference ("" 811c9dc5, "a" e40c292c, "foobar" bf9cf968; from memory). Beyond
// ASCII, each code unit is one step: "µ" is the one unit 0x00b5, "😀" the two units d83d de00.
func TestFingerprint(t *testing.T) {
	for _, c := range []struct{ text, want string }{
		{"", "811c9dc5"}, {"a", "e40c292c"}, {"foobar", "bf9cf968"},
	} {
		if got := Fingerprint([]byte(c.text)); got != c.want {
			t.Errorf("Fingerprint(%q) = %s, want %s", c.text, got, c.want)
		}
	}
	for _, text := range []string{"gibbsheet", `{"format":"gibbsheet-worksheet/1"}`, "x"} {
		h := fnv.New32a()
		h.Write([]byte(text))
		if got, want := Fingerprint([]byte(text)), fmt.Sprintf("%08x", h.Sum32()); got != want {
			t.Errorf("Fingerprint(%q) = %s, hash/fnv gives %s", text, got, want)
		}
	}
	step := func(h uint32, unit uint32) uint32 { return (h ^ unit) * 0x01000193 }
	for _, c := range []struct {
		text  string
		units []uint32
	}{{"µ", []uint32{0xb5}}, {"😀", []uint32{0xd83d, 0xde00}}, {"aΔ😀", []uint32{'a', 0x394, 0xd83d, 0xde00}}} {
		h := uint32(0x811c9dc5)
		for _, u := range c.units {
			h = step(h, u)
		}
		if got, want := Fingerprint([]byte(c.text)), fmt.Sprintf("%08x", h); got != want {
			t.Errorf("Fingerprint(%q) = %s, want %s", c.text, got, want)
		}
	}
}
