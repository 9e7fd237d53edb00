package engine

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"testing"
)

// FuzzEvaluateJSON: whatever the input, EvaluateJSON returns a valid result document or a clean error, and
// every row of the input has its row in the result.
func FuzzEvaluateJSON(f *testing.F) {
	seeds, _ := filepath.Glob("../testdata/worksheets/*.json")
	for _, s := range seeds {
		if b, err := os.ReadFile(s); err == nil {
			f.Add(b)
		}
	}
	f.Add([]byte(sheet(`"concentrations":{"ATP":"1e-30 M"}`, "ATP + H2O = ADP + Pi")))
	f.Fuzz(func(t *testing.T, data []byte) {
		out, err := EvaluateJSON(data)
		if err != nil {
			if out != nil {
				t.Fatal("error with output")
			}
			if _, _, derr := Decode(data); derr == nil {
				t.Fatalf("a readable worksheet failed to evaluate: %v", err)
			}
			return
		}
		// Rows remembered from an evaluation, and the worksheet kept from the last one, give the same bytes
		// as rows computed afresh.
		again, _ := EvaluateJSON(data)
		rows = &rowMemo{}
		fresh, _ := evaluateFresh(data)
		if !bytes.Equal(out, again) || !bytes.Equal(out, fresh) {
			t.Fatalf("evaluations of the same worksheet differ:\n%s\n%s\n%s", out, again, fresh)
		}
		var res Result
		if err := json.Unmarshal(out, &res); err != nil {
			t.Fatalf("result is not valid JSON: %v\n%s", err, out)
		}
		ws, _, err := Decode(data)
		if err != nil {
			t.Fatalf("EvaluateJSON accepted what Decode rejects: %v", err)
		}
		if len(res.Rows) != len(ws.Rows) {
			t.Fatalf("%d rows in, %d out", len(ws.Rows), len(res.Rows))
		}
	})
}
