package inject

import (
	"bytes"
	"encoding/json"
	"testing"

	"github.com/google/go-cmp/cmp"
)

const page = `<html><head><script type="application/json" id="gibbsheet-worksheet">{}</script></head></html>`

func TestRoundTripHostileText(t *testing.T) {
	doc := []byte(`{"format":"gibbsheet-worksheet/1","title":"</script><img src=x onerror=alert(1)> <!-- & \u2028",` +
		`"rows":[{"id":"r1","equation":"A = B","note":"</SCRIPT>"}]}`)
	out, err := Worksheet([]byte(page), doc)
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
	again, err := Worksheet(out, inner)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(again, out) {
		t.Errorf("second embedding changed the page")
	}
}

func TestErrors(t *testing.T) {
	if _, err := Worksheet([]byte("<html></html>"), []byte("{}")); err == nil {
		t.Error("page without element: want error")
	}
	if _, err := Worksheet([]byte(page), []byte("{")); err == nil {
		t.Error("broken JSON: want error")
	}
}
