package engine

import (
	"bytes"
	"encoding/json"
	"math/rand/v2"
	"runtime"
	"slices"
	"strings"
	"testing"
	"weak"

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

// mdfEdits are edits of chainSheet (analysis_test.go) that the max-min driving force either shows
// (changed) or not, and that change its linear program (solved) or not; TestMDFMemoMatchesFresh evaluates
// chainSheet and each edit in turn. Empty rows and bounds stand for chainRows and chainBounds.
var mdfEdits = []struct {
	name                string
	changed, solved     bool
	rows, bounds, extra string
}{
	{"only a multiplier", false, false, strings.Replace(chainRows, `"id":"2",`, `"id":"2","times":2,`, 1), "", ""},
	{"only a note", false, false, strings.Replace(chainRows, `"id":"1",`, `"id":"1","note":"first step",`, 1), "", ""},
	{"only the title", false, false, "", "", `"title":"a chain",`},
	{"only a bound", true, true, "", strings.Replace(chainBounds, `"D"`, `"B":["1 uM","20 mM"],"D"`, 1), ""},
	{"only a ΔrG'°", true, true, strings.Replace(chainRows, `"dG0":5`, `"dG0":6`, 1), "", ""},
	{"only one coefficient", true, true, strings.Replace(chainRows, `"C = D"`, `"C = 2 D"`, 1), "", ""},
	{"only a compound", true, true, strings.Replace(chainRows, `"C = D"`, `"B = D"`, 1), "", ""},
	{"a compound with other bounds", true, true, strings.Replace(chainRows, `"C = D"`, `"C = E"`, 1), "",
		`"compounds":[{"id":"A"},{"id":"B"},{"id":"C"},{"id":"D"},{"id":"E"}],`},
	{"only a compound's name as written", true, false, strings.Replace(chainRows, `"A = B"`, `"a = B"`, 1), "", ""},
	{"only an entered concentration", true, false, "", "", `"concentrations":{"C":"0.2 mM"},`},
	{"only a row id", true, false, strings.Replace(chainRows, `"id":"3"`, `"id":"third"`, 1), "", ""},
	{"only the temperature", true, true, "", "", `"conditions":{"temperature":310.15},`},
	{"only the default bounds", true, true, "", strings.Replace(chainBounds, `"1 uM"`, `"10 uM"`, 1), ""},
	{"only a row left out", true, false, chainRows + `,{"id":"4","equation":"X = Y"}`, "", ""},
	{"a row without ΔrG'°", true, true, strings.Replace(chainRows, `"dG0":-10`, `"times":1`, 1), "", ""},
	{"the rows in another order", true, true, `{"id":"3","equation":"C = D","dG0":-2},` +
		`{"id":"1","equation":"A = B","dG0":-10},{"id":"2","equation":"B = C","dG0":5}`, "", ""},
}

// TestMDFMemoMatchesFresh: a Session, and EvaluateJSON, which take the max-min driving force from their
// latest analysis when its problem is unchanged, give the MDF of a fresh evaluation, byte for byte, after
// each edit of mdfEdits and after going back from it to chainSheet; the fresh MDF does change with each
// edit marked changed, so that an MDF kept too long would show, and the session solves again, and makes the
// MDF again, exactly after the edits that change the problem, or the MDF, and after going back from them.
func TestMDFMemoMatchesFresh(t *testing.T) {
	s := new(Session)
	var merged map[string]any
	var before []byte // the fresh MDF of the version before
	seq := 0
	evaluate := func(name string, changed, solved bool, rows, bounds, extra string) {
		t.Helper()
		if rows == "" {
			rows = chainRows
		}
		if bounds == "" {
			bounds = chainBounds
		}
		if !strings.Contains(extra, `"compounds"`) {
			extra += `"compounds":[{"id":"A"},{"id":"B"},{"id":"C"},{"id":"D"}],`
		}
		doc := []byte(`{"format":"gibbsheet-worksheet/1",` + extra + `"bounds":{` + bounds + `},"rows":[` + rows + `]}`)
		fresh, err := evaluateFresh(doc)
		if err != nil {
			t.Fatalf("%s: %v\n%s", name, err, doc)
		}
		var want struct {
			MDF    json.RawMessage `json:"mdf"`
			Errors []FieldError    `json:"errors"`
		}
		if err := json.Unmarshal(fresh, &want); err != nil || len(want.Errors) > 0 || string(want.MDF) == "null" {
			t.Fatalf("%s: not a clean worksheet with an MDF (%v): %s", name, err, fresh)
		}
		if got := !bytes.Equal(want.MDF, before); got != changed {
			t.Errorf("%s: the fresh MDF changed: %v, want %v", name, got, changed)
		}
		before = want.MDF
		if kept, _ := EvaluateJSON(doc); !bytes.Equal(kept, fresh) {
			t.Errorf("%s: EvaluateJSON differs from a fresh evaluation:\n%s\n%s", name, kept, fresh)
		}
		sol, out := s.analysis.sol, s.analysis.out
		changes, err := s.ChangesJSON(doc, seq)
		if err != nil {
			t.Fatal(err)
		}
		seq++
		analysis, err := s.AnalysisJSON()
		if err != nil {
			t.Fatal(err)
		}
		if got := s.analysis.sol != sol; got != solved {
			t.Errorf("%s: solved again: %v, want %v", name, got, solved)
		}
		if got := s.analysis.out != out; got != changed {
			t.Errorf("%s: the MDF made again: %v, want %v", name, got, changed)
		}
		merged = mergeChanges(t, merged, changes, analysis)
		var wantDoc map[string]any
		json.Unmarshal(fresh, &wantDoc)
		if diff := cmp.Diff(wantDoc, merged); diff != "" {
			t.Errorf("%s: the session's answer differs from a fresh evaluation (-want +got):\n%s", name, diff)
		}
	}
	evaluate("chainSheet", true, true, "", "", "")
	for _, e := range mdfEdits {
		evaluate(e.name, e.changed, e.solved, e.rows, e.bounds, e.extra)
		evaluate(e.name+", undone", e.changed, e.solved, "", "", "")
	}
}

// TestMDFMemoRandomEdits: a seeded random series of edits of a 30-row glycolysis worksheet (multipliers,
// coefficients, rows swapped, removed and put back, bounds and concentrations) evaluated by EvaluateJSON,
// which keeps its latest analysis, gives after every edit the bytes of a fresh evaluation.
func TestMDFMemoRandomEdits(t *testing.T) {
	rng := rand.New(rand.NewPCG(20261202, 2))
	ws, _, err := Decode(benchSheet(30))
	if err != nil {
		t.Fatal(err)
	}
	all := slices.Clone(ws.Rows)
	for step := range 200 {
		ws.Rows = slices.Clone(ws.Rows)
		i := rng.IntN(len(ws.Rows))
		switch rng.IntN(6) {
		case 0:
			times := float64(1 + rng.IntN(3))
			ws.Rows[i].Times = &times
		case 1:
			ws.Rows[i].Equation = "2 " + strings.ReplaceAll(strings.ReplaceAll(all[i%len(all)].Equation,
				" + ", " + 2 "), " = ", " = 2 ")
		case 2:
			j := rng.IntN(len(ws.Rows))
			ws.Rows[i], ws.Rows[j] = ws.Rows[j], ws.Rows[i]
		case 3:
			if len(ws.Rows) > 2 {
				ws.Rows = slices.Delete(ws.Rows, i, i+1)
			} else {
				ws.Rows = slices.Clone(all)
			}
		case 4:
			ws.Bounds = &Bounds{Compounds: map[string][]string{"ADP": {"1 uM", []string{"1 mM", "10 mM"}[rng.IntN(2)]}}}
		case 5:
			ws.Concentrations = cloneMap(ws.Concentrations)
			ws.Concentrations["Pi"] = []string{"3 mM", "5 mM"}[rng.IntN(2)]
		}
		doc, err := json.Marshal(ws)
		if err != nil {
			t.Fatal(err)
		}
		got, err := EvaluateJSON(doc)
		if err != nil {
			t.Fatal(err)
		}
		if want, _ := evaluateFresh(doc); !bytes.Equal(got, want) {
			t.Fatalf("step %d: EvaluateJSON differs from a fresh evaluation:\n%s\n%s", step, got, want)
		}
	}
}

// TestSessionKeepsOnlyTheLatestDocument edits a worksheet many times in one session and checks that the
// documents it read before the latest are let go: a session that kept every version (as one did, through
// the reading it keeps for the next) grows without end while someone types, until the page slows to a
// crawl. It is a memory test and needs no source.
func TestSessionKeepsOnlyTheLatestDocument(t *testing.T) {
	doc := benchSheet(50)
	edited := bytes.Replace(doc, []byte(`"id":"r25",`), []byte(`"id":"r25","times":2,`), 1)
	s := new(Session)
	first := bytes.Clone(doc)
	gone := weak.Make(&first[0])
	if _, err := s.ChangesJSON(first, 0); err != nil {
		t.Fatal(err)
	}
	first = nil
	for i := 1; i <= 6; i++ {
		next := bytes.Clone([2][]byte{doc, edited}[i%2])
		if _, err := s.ChangesJSON(next, i); err != nil {
			t.Fatal(err)
		}
		if _, err := s.AnalysisJSON(); err != nil {
			t.Fatal(err)
		}
	}
	runtime.GC()
	runtime.GC()
	if gone.Value() != nil {
		t.Error("after six more versions, the session still holds the first document it read")
	}
	runtime.KeepAlive(s)
}
