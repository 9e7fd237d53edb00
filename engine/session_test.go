package engine

import (
	"bytes"
	"encoding/json"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"gibbsheet/engine/compounds"
)

// sessionEdits are the edits a user makes in the page, applied in turn to a worksheet; each is followed by
// a ChangesJSON call on the session.
var sessionEdits = []struct {
	name   string
	change func(ws *Worksheet)
}{
	{"unchanged", func(ws *Worksheet) {}},
	{"typing in the last row", func(ws *Worksheet) { ws.Rows[len(ws.Rows)-1].Equation += " + H2O" }},
	{"half-typed equation", func(ws *Worksheet) { ws.Rows[0].Equation += " + " }},
	{"a concentration", func(ws *Worksheet) {
		ws.Concentrations = cloneMap(ws.Concentrations)
		ws.Concentrations["ADP"] = "0.7 mM"
	}},
	{"a row inserted first", func(ws *Worksheet) {
		ws.Rows = append([]Row{{ID: "new", Equation: "ATP + H2O = ADP + Pi"}}, ws.Rows...)
	}},
	{"the rows reversed", func(ws *Worksheet) {
		for i, j := 0, len(ws.Rows)-1; i < j; i, j = i+1, j-1 {
			ws.Rows[i], ws.Rows[j] = ws.Rows[j], ws.Rows[i]
		}
	}},
	{"a row deleted", func(ws *Worksheet) { ws.Rows = ws.Rows[1:] }},
	{"the title", func(ws *Worksheet) { ws.Title += " (copy)" }},
	{"an id used twice", func(ws *Worksheet) { ws.Rows[1].ID = ws.Rows[0].ID }},
	{"the title again", func(ws *Worksheet) { ws.Title += " (2)" }},
	{"an empty id", func(ws *Worksheet) { ws.Rows[1].ID = "" }},
}

func cloneMap(m map[string]string) map[string]string {
	out := map[string]string{}
	for k, v := range m {
		out[k] = v
	}
	return out
}

// mergeChanges applies a changes document and an analysis document to the previous merged result, as the
// page does, and returns the merged result.
func mergeChanges(t *testing.T, prev map[string]any, changes, analysis []byte) map[string]any {
	t.Helper()
	var doc, an map[string]any
	if err := json.Unmarshal(changes, &doc); err != nil {
		t.Fatalf("changes document: %v\n%s", err, changes)
	}
	if err := json.Unmarshal(analysis, &an); err != nil {
		t.Fatalf("analysis document: %v\n%s", err, analysis)
	}
	if doc["seq"] != an["seq"] {
		t.Fatalf("analysis of answer %v, changes are answer %v", an["seq"], doc["seq"])
	}
	rows := doc["rows"].([]any)
	for i, r := range rows {
		if j, ok := r.(float64); ok {
			if doc["base"].(float64) == 0 {
				t.Fatalf("row %d given by number %v with no base", i, j)
			}
			rows[i] = prev["rows"].([]any)[int(j)]
		}
	}
	delete(doc, "seq")
	delete(doc, "base")
	doc["mdf"] = an["mdf"]
	doc["warnings"] = append(doc["warnings"].([]any), an["warnings"].([]any)...)
	return doc
}

// TestSessionMatchesEvaluate: merging a session's changes and analysis into the previous answer gives the
// document a fresh evaluation gives, and so does EvaluateJSON (which keeps the worksheet it read last), byte
// for byte, after every edit of every worksheet; rows that did not change come back as
// numbers; a failed call leaves the session where it was, and a base that is not the latest answer gets
// every row written out.
func TestSessionMatchesEvaluate(t *testing.T) {
	eachWorksheet(t, []string{"../testdata/worksheets/*.json", "../pathways/*.json"}, func(t *testing.T, name string, doc []byte) {
		ws, _, err := Decode(doc)
		if err != nil {
			t.Fatal(err)
		}
		if len(ws.Rows) < 3 {
			t.Skip("fewer than three rows") // every edit needs rows to change and rows to keep
		}
		s := new(Session)
		var merged map[string]any
		seq := 0
		for _, e := range sessionEdits {
			rowsBefore := len(ws.Rows)
			ws.Rows = append([]Row(nil), ws.Rows...)
			e.change(ws)
			text, err := json.Marshal(ws)
			if err != nil {
				t.Fatal(err)
			}
			changes, err := s.ChangesJSON(text, seq)
			if err != nil {
				t.Fatalf("%s: %v", e.name, err)
			}
			analysis, err := s.AnalysisJSON()
			if err != nil {
				t.Fatalf("%s: %v", e.name, err)
			}
			merged = mergeChanges(t, merged, changes, analysis)
			full, _ := evaluateFresh(text)
			var want map[string]any
			json.Unmarshal(full, &want)
			if kept, _ := EvaluateJSON(text); !bytes.Equal(kept, full) {
				t.Fatalf("%s: EvaluateJSON with the worksheet kept from the last call differs from a fresh evaluation", e.name)
			}
			if diff := cmp.Diff(want, merged); diff != "" {
				t.Fatalf("%s: merged changes differ from EvaluateJSON (-want +got):\n%s", e.name, diff)
			}
			var c struct {
				Seq  int               `json:"seq"`
				Rows []json.RawMessage `json:"rows"`
			}
			json.Unmarshal(changes, &c)
			written := 0
			for _, r := range c.Rows {
				if strings.HasPrefix(string(r), "{") {
					written++
				}
			}
			switch e.name {
			case "unchanged", "the rows reversed", "a row deleted", "the title":
				if seq > 0 && written != 0 {
					t.Errorf("%s: %d rows written out, want all given by number", e.name, written)
				}
			case "typing in the last row", "half-typed equation", "a row inserted first":
				if written != 1 {
					t.Errorf("%s: %d rows written out of %d, want 1", e.name, written, rowsBefore)
				}
			}
			seq = c.Seq
		}

		// An unreadable document changes nothing; a stale base gets every row.
		if _, err := s.ChangesJSON([]byte(`{"format":"gibbsheet-worksheet/1","rows":7}`), seq); err == nil {
			t.Fatal("a document with rows 7 was read")
		}
		text, _ := json.Marshal(ws)
		changes, err := s.ChangesJSON(text, seq)
		if err != nil {
			t.Fatal(err)
		}
		if !strings.Contains(string(changes), `"base":`+itoa(seq)+`,`) {
			t.Errorf("after a failed call the base %d is not the latest answer: %.60s", seq, changes)
		}
		changes, _ = s.ChangesJSON(text, seq) // seq is now the one before the latest
		if !strings.Contains(string(changes), `"base":0,`) || !strings.Contains(string(changes), `"rows":[{`) {
			t.Errorf("a stale base was used: %.60s", changes)
		}
	})
}

func itoa(n int) string { b, _ := json.Marshal(n); return string(b) }

func TestSessionAnalysisFirst(t *testing.T) {
	if _, err := new(Session).AnalysisJSON(); err == nil {
		t.Error("an empty session gave an analysis")
	}
}

// TestCompoundsJSON: the library list the page receives, written when the library is generated, is the
// library's compounds as LibraryEntry values, in library order, as json.Marshal writes them.
func TestCompoundsJSON(t *testing.T) {
	var want []LibraryEntry
	for _, c := range compounds.Builtin().All() {
		want = append(want, LibraryEntry{ID: c.ID, Name: c.Name, Synonyms: c.Synonyms, Formula: c.Formula,
			Approximate: c.Approximation != "", Source: c.Source})
	}
	var got []LibraryEntry
	if err := json.Unmarshal([]byte(CompoundsJSON()), &got); err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff(want, got); diff != "" {
		t.Errorf("CompoundsJSON (-library +written):\n%s", diff)
	}
}
