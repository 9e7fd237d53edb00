//go:build js && wasm

package main

import (
	"encoding/json"
	"strings"
	"syscall/js"
	"testing"
)

// call invokes a function of the api object and reports its value or the message it threw.
func call(t *testing.T, name string, args ...any) (string, string) {
	t.Helper()
	catcher := js.Global().Get("Function").New("o", "name", "args",
		`try { return { value: o[name](...args) }; } catch (e) { return { error: e instanceof Error ? e.message : "not an Error: " + e }; }`)
	r := catcher.Invoke(api(), name, js.ValueOf(args))
	if e := r.Get("error"); !e.IsUndefined() {
		return "", e.String()
	}
	return r.Get("value").String(), ""
}

func TestEvaluate(t *testing.T) {
	out, msg := call(t, "evaluate", `{"format":"gibbsheet-worksheet/1","rows":[{"id":"r1","equation":"ATP + H2O = ADP + Pi"}]}`)
	if msg != "" {
		t.Fatalf("evaluate threw %q", msg)
	}
	var res struct {
		Rows []struct {
			ID  string   `json:"id"`
			DG0 *float64 `json:"dG0"`
		} `json:"rows"`
	}
	if err := json.Unmarshal([]byte(out), &res); err != nil {
		t.Fatalf("result is not JSON: %v", err)
	}
	if len(res.Rows) != 1 || res.Rows[0].ID != "r1" || res.Rows[0].DG0 == nil {
		t.Errorf("result rows %+v", res.Rows)
	}
}

func TestEvaluateThrows(t *testing.T) {
	for _, c := range []struct {
		args []any
		want string
	}{
		{nil, "needs one argument"},
		{[]any{42}, "needs one argument"},
		{[]any{"{not json"}, "JSON"},
		{[]any{`{"format":"something else/1"}`}, "format"},
	} {
		if _, msg := call(t, "evaluate", c.args...); !strings.Contains(msg, c.want) {
			t.Errorf("evaluate(%v) threw %q, want a message containing %q", c.args, msg, c.want)
		}
	}
}

// TestChanges: the page's live calls. A second call with the first answer's number gives the unchanged
// row by number; analysis gives the MDF of the latest answer; wrong arguments throw.
func TestChanges(t *testing.T) {
	doc := `{"format":"gibbsheet-worksheet/1","rows":[{"id":"r1","equation":"ATP + H2O = ADP + Pi"},{"id":"r2","equation":"glucose + ATP = glucose 6-phosphate + ADP"}]}`
	if _, msg := call(t, "analysis"); !strings.Contains(msg, "evaluate one first") {
		t.Errorf("analysis before any changes threw %q", msg)
	}
	first, msg := call(t, "changes", doc, 0)
	if msg != "" {
		t.Fatalf("changes threw %q", msg)
	}
	var c struct {
		Seq  int               `json:"seq"`
		Base int               `json:"base"`
		Rows []json.RawMessage `json:"rows"`
	}
	if err := json.Unmarshal([]byte(first), &c); err != nil || c.Seq == 0 || c.Base != 0 || len(c.Rows) != 2 {
		t.Fatalf("first changes %.80s (%v)", first, err)
	}
	edited := strings.Replace(doc, `"equation":"ATP + H2O = ADP + Pi"`, `"equation":"ATP + H2O = AMP + PPi"`, 1)
	second, _ := call(t, "changes", edited, c.Seq)
	json.Unmarshal([]byte(second), &c)
	if len(c.Rows) != 2 || string(c.Rows[1]) != "1" || c.Rows[0][0] != '{' {
		t.Errorf("second changes %.120s: want row 0 written out and row 1 given as 1", second)
	}
	a, msg := call(t, "analysis")
	var an struct {
		Seq int `json:"seq"`
		MDF *struct {
			DrivingForce float64 `json:"drivingForce"`
		} `json:"mdf"`
	}
	if err := json.Unmarshal([]byte(a), &an); err != nil || msg != "" || an.Seq != c.Seq || an.MDF == nil {
		t.Errorf("analysis %q threw %q (%v)", a, msg, err)
	}
	for _, args := range [][]any{{doc}, {doc, "1"}, {42, 0}} {
		if _, msg := call(t, "changes", args...); !strings.Contains(msg, "needs the worksheet") {
			t.Errorf("changes(%v) threw %q", args, msg)
		}
	}
}

func TestCompounds(t *testing.T) {
	out, msg := call(t, "compounds")
	if msg != "" {
		t.Fatal(msg)
	}
	var list []struct {
		ID   string `json:"id"`
		Name string `json:"name"`
	}
	if err := json.Unmarshal([]byte(out), &list); err != nil || len(list) == 0 {
		t.Fatalf("compounds gave %d entries, err %v", len(list), err)
	}
	for _, c := range list {
		if c.ID == "ATP" {
			return
		}
	}
	t.Error("the library has no ATP")
}

// TestPanicBecomesError checks that a panic inside a bridged function reaches JavaScript as an Error.
func TestPanicBecomesError(t *testing.T) {
	f := throwing(guard(func([]js.Value) (any, error) { panic("boom") }))
	catcher := js.Global().Get("Function").New("f",
		`try { f(); return "no throw"; } catch (e) { return e instanceof Error ? e.message : "not an Error"; }`)
	if got := catcher.Invoke(f).String(); !strings.Contains(got, "internal error in the engine: boom") {
		t.Errorf("panic surfaced as %q", got)
	}
}
