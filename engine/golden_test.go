package engine

import (
	"encoding/json"
	"flag"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
)

var update = flag.Bool("update", false, "rewrite the golden result documents in testdata/results")

// goldenTolerance is the relative difference allowed between a computed number and its golden value: the
// goldens guard the shape and content of the result document, not the last bits of the arithmetic, which
// differ between native code and WebAssembly (fused multiply-add).
const goldenTolerance = 1e-9

// TestGolden evaluates every worksheet in testdata/worksheets and compares the result document with the
// golden one in testdata/results. Run `go test ./engine -run Golden -update` to accept a change.
func TestGolden(t *testing.T) {
	inputs, err := filepath.Glob("../testdata/worksheets/*.json")
	if err != nil || len(inputs) == 0 {
		t.Fatalf("no golden worksheets found: %v", err)
	}
	for _, in := range inputs {
		name := strings.TrimSuffix(filepath.Base(in), ".json")
		t.Run(name, func(t *testing.T) {
			doc, err := os.ReadFile(in)
			if err != nil {
				t.Fatal(err)
			}
			out, err := EvaluateJSON(doc)
			if err != nil {
				t.Fatal(err)
			}
			goldenPath := filepath.Join("../testdata/results", name+".json")
			if *update {
				var v any
				json.Unmarshal(out, &v)
				pretty, _ := json.MarshalIndent(v, "", "  ")
				if err := os.WriteFile(goldenPath, append(pretty, '\n'), 0o644); err != nil {
					t.Fatal(err)
				}
				return
			}
			wantBytes, err := os.ReadFile(goldenPath)
			if err != nil {
				t.Fatalf("%v (run with -update to create it)", err)
			}
			var want, got any
			if err := json.Unmarshal(wantBytes, &want); err != nil {
				t.Fatal(err)
			}
			json.Unmarshal(out, &got)
			if diff := cmp.Diff(want, got, cmpopts.EquateApprox(goldenTolerance, 1e-12)); diff != "" {
				t.Errorf("result of %s differs from its golden file (-want +got):\n%s", in, diff)
			}
		})
	}
}
