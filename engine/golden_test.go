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
	eachWorksheet(t, []string{"../testdata/worksheets/*.json"}, func(t *testing.T, name string, doc []byte) {
		out, err := EvaluateJSON(doc)
		if err != nil {
			t.Fatal(err)
		}
		var v any
		json.Unmarshal(out, &v)
		pretty, _ := json.MarshalIndent(v, "", "  ")
		checkGolden(t, filepath.Join("../testdata/results", name+".json"), append(pretty, '\n'),
			func(t *testing.T, b []byte) any {
				var v any
				if err := json.Unmarshal(b, &v); err != nil {
					t.Fatal(err)
				}
				return v
			})
	})
}

// eachWorksheet runs fn as a subtest on every worksheet file the patterns match, named by its base name;
// it fails when they match fewer than two files, so a moved folder cannot pass unnoticed.
func eachWorksheet(t *testing.T, patterns []string, fn func(t *testing.T, name string, doc []byte)) {
	t.Helper()
	var inputs []string
	for _, pat := range patterns {
		m, err := filepath.Glob(pat)
		if err != nil {
			t.Fatal(err)
		}
		inputs = append(inputs, m...)
	}
	if len(inputs) < 2 {
		t.Fatalf("found only %d worksheets for %v", len(inputs), patterns)
	}
	for _, in := range inputs {
		t.Run(strings.TrimSuffix(filepath.Base(in), ".json"), func(t *testing.T) {
			doc, err := os.ReadFile(in)
			if err != nil {
				t.Fatal(err)
			}
			fn(t, strings.TrimSuffix(filepath.Base(in), ".json"), doc)
		})
	}
}

// checkGolden compares got with the golden file at path, both turned into comparable values by decode, with
// numbers within goldenTolerance; with -update it writes got there instead.
func checkGolden[T any](t *testing.T, path string, got []byte, decode func(*testing.T, []byte) T) {
	t.Helper()
	if *update {
		if err := os.WriteFile(path, got, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run with -update to create it)", err)
	}
	if diff := cmp.Diff(decode(t, want), decode(t, got), cmpopts.EquateApprox(goldenTolerance, 1e-12)); diff != "" {
		t.Errorf("%s differs (-want +got):\n%s", path, diff)
	}
}
