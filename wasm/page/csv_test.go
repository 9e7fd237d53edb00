//go:build js && wasm

package main

import (
	"strings"
	"testing"
)

// TestCSV checks gibbsheet.csv: CSV by default, tab-separated on request, refused separators and
// documents thrown as Errors.
func TestCSV(t *testing.T) {
	doc := `{"format":"gibbsheet-worksheet/1","rows":[{"id":"r1","equation":"ATP + H2O = ADP + Pi"}]}`
	out, msg := call(t, "csv", doc)
	if msg != "" || !strings.HasPrefix(out, "row,equation,times,") || !strings.Contains(out, "\r\nr1,ATP + H2O = ADP + Pi,1,") {
		t.Errorf("csv(doc) = %.80q, threw %q", out, msg)
	}
	out, msg = call(t, "csv", doc, "\t")
	if msg != "" || !strings.HasPrefix(out, "row\tequation\ttimes\t") {
		t.Errorf("csv(doc, tab) = %.80q, threw %q", out, msg)
	}
	for _, c := range []struct {
		args []any
		want string
	}{
		{[]any{doc, "|"}, "separator"},
		{[]any{doc, 9}, "separator"},
		{nil, "needs the worksheet"},
		{[]any{`{"format":"gibbsheet-worksheet/9"}`}, "format"},
	} {
		if _, msg := call(t, "csv", c.args...); !strings.Contains(msg, c.want) {
			t.Errorf("csv(%v) threw %q, want %q", c.args, msg, c.want)
		}
	}
}
