package compounds

import (
	"encoding/json"
	"os"
	"testing"

	"github.com/google/go-cmp/cmp"
)

// TestBuiltinValid checks that the compiled-in library is what NewLibrary builds from the compiled-in
// compounds, so that the data pass NewLibrary's validation and the name list and index are right.
func TestBuiltinValid(t *testing.T) {
	want, err := NewLibrary(builtinCompounds[:])
	if err != nil {
		t.Fatalf("the built-in data are invalid:\n%v", err)
	}
	if diff := cmp.Diff(want, Builtin(), cmp.AllowUnexported(Library{}, nameEntry{})); diff != "" {
		t.Errorf("Builtin() differs from NewLibrary(builtinCompounds) (-want +got):\n%s", diff)
	}
}

// BenchmarkBuiltin measures the first Builtin() call, now a pointer to compiled-in data; its first
// Lookup is what the first worksheet evaluation pays for the library.
func BenchmarkBuiltin(b *testing.B) {
	for b.Loop() {
		if Builtin().Lookup("ATP") == nil {
			b.Fatal("no ATP")
		}
	}
}

// BenchmarkNewLibrary measures building and validating the library from the compiled-in compounds at
// run time, the alternative to compiling the name index in.
func BenchmarkNewLibrary(b *testing.B) {
	for b.Loop() {
		if _, err := NewLibrary(builtinCompounds[:]); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkBuiltinFromJSON measures the former first Builtin() call, decoding data/compounds.json with
// encoding/json before building the library, for comparison.
func BenchmarkBuiltinFromJSON(b *testing.B) {
	data, err := os.ReadFile("data/compounds.json")
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		var cs []Compound
		if err := json.Unmarshal(data, &cs); err != nil {
			b.Fatal(err)
		}
		if _, err := NewLibrary(cs); err != nil {
			b.Fatal(err)
		}
	}
}
