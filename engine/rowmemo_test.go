package engine

import (
	"bytes"
	"encoding/json"
	"testing"
)

// TestRowMemo: after one row of a worksheet changes, evaluating it (the other rows come from memory) gives
// the same bytes as evaluating it with nothing remembered; so does a change of the context (a concentration),
// which must not reuse any row.
func TestRowMemo(t *testing.T) {
	eachWorksheet(t, []string{"../testdata/worksheets/*.json", "../pathways/*.json"}, func(t *testing.T, name string, doc []byte) {
		ws, _, err := Decode(doc)
		if err != nil {
			t.Fatal(err)
		}
		if _, err := EvaluateJSON(doc); err != nil { // fills the memory
			t.Fatal(err)
		}
		edits := map[string]func(*Worksheet){
			"row": func(ws *Worksheet) { ws.Rows[len(ws.Rows)-1].Equation += " + H2O" },
			"context": func(ws *Worksheet) {
				if ws.Concentrations == nil {
					ws.Concentrations = map[string]string{}
				}
				ws.Concentrations["ATP"] = "7 mM"
			},
		}
		for edit, change := range edits {
			changed := *ws
			changed.Rows = append([]Row(nil), ws.Rows...)
			changed.Concentrations = map[string]string{}
			for k, v := range ws.Concentrations {
				changed.Concentrations[k] = v
			}
			change(&changed)
			b, _ := json.Marshal(&changed)
			remembered, err := EvaluateJSON(b)
			if err != nil {
				t.Fatal(err)
			}
			rows = &rowMemo{}
			fresh, _ := evaluateFresh(b)
			if !bytes.Equal(remembered, fresh) {
				t.Errorf("%s edit: result with remembered rows differs from a fresh evaluation", edit)
			}
			EvaluateJSON(doc) // back to the original in memory
		}
	})
}

// TestRowEncodings: the result document writes each row from the encoding made when the row was computed;
// it must equal what json.Marshal writes for the row as it stands in the Result, for every worksheet,
// remembered or not.
func TestRowEncodings(t *testing.T) {
	eachWorksheet(t, []string{"../testdata/worksheets/*.json", "../pathways/*.json"}, func(t *testing.T, name string, doc []byte) {
		ws, unknown, err := Decode(doc)
		if err != nil {
			t.Fatal(err)
		}
		for _, pass := range []string{"computed", "remembered"} {
			res := Evaluate(ws, unknown)
			if len(res.rowJSON) != len(res.Rows) {
				t.Fatalf("%s: %d encodings for %d rows", pass, len(res.rowJSON), len(res.Rows))
			}
			for i := range res.Rows {
				want, err := json.Marshal(&res.Rows[i])
				if err != nil {
					t.Fatal(err)
				}
				if !bytes.Equal(res.rowJSON[i], want) {
					t.Errorf("%s: row %d: encoding\n%s\nwant\n%s", pass, i, res.rowJSON[i], want)
				}
			}
		}
	})
}
