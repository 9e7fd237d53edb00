package compounds_test

import (
	"encoding/json"
	"os"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"gibbsheet/engine/compounds"
	"gibbsheet/engine/compounds/internal/gen"
)

// TestBuiltinDataUpToDate regenerates builtin_data.go from data/compounds.json in memory and fails when
// the committed file differs: run go generate ./engine/compounds after editing the data.
func TestBuiltinDataUpToDate(t *testing.T) {
	data, err := os.ReadFile("data/compounds.json")
	if err != nil {
		t.Fatal(err)
	}
	want, err := gen.Generate(data)
	if err != nil {
		t.Fatal(err)
	}
	got, err := os.ReadFile("builtin_data.go")
	if err != nil {
		t.Fatal(err)
	}
	if string(got) != string(want) {
		w, g := strings.Split(string(want), "\n"), strings.Split(string(got), "\n")
		i := 0
		for i < min(len(w), len(g)) && w[i] == g[i] {
			i++
		}
		w, g = append(w, ""), append(g, "") // a line to show at the end of the shorter one
		t.Errorf("builtin_data.go is stale: run go generate ./engine/compounds; first difference at line %d:\nwant %s\ngot  %s",
			i+1, w[i], g[i])
	}
}

// TestBuiltinEqualsJSON checks that the compiled-in library holds exactly what encoding/json decodes
// from data/compounds.json into []Compound, as the package did before the data were generated.
func TestBuiltinEqualsJSON(t *testing.T) {
	data, err := os.ReadFile("data/compounds.json")
	if err != nil {
		t.Fatal(err)
	}
	var want []compounds.Compound
	if err := json.Unmarshal(data, &want); err != nil {
		t.Fatal(err)
	}
	var got []compounds.Compound
	for _, c := range compounds.Builtin().All() {
		got = append(got, *c)
	}
	if diff := cmp.Diff(want, got); diff != "" {
		t.Errorf("Builtin() differs from data/compounds.json (-want +got):\n%s", diff)
	}
}

// TestLibraryJSON checks LibraryJSON against json.Marshal of the library's entries.
func TestLibraryJSON(t *testing.T) {
	var list []compounds.LibraryEntry
	for _, c := range compounds.Builtin().All() {
		list = append(list, compounds.LibraryEntry{ID: c.ID, Name: c.Name, Synonyms: c.Synonyms, Formula: c.Formula,
			Approximate: c.Approximation != "", Source: c.Source})
	}
	want, err := json.Marshal(list)
	if err != nil {
		t.Fatal(err)
	}
	if compounds.LibraryJSON != string(want) {
		t.Errorf("LibraryJSON differs from json.Marshal of the entries (-want +got):\n%s",
			cmp.Diff(string(want), compounds.LibraryJSON))
	}
}

// TestGenerateRejects checks that the generator reports malformed data instead of writing code.
func TestGenerateRejects(t *testing.T) {
	for _, data := range []string{
		`[{"id": "X", "nmae": "typo"}]`,
		`[{"id": "X"}] [`,
		`{"id": "X"}`,
		`[{"id": "X", "species": [{"dfG0": "1"}]}]`,
	} {
		if _, err := gen.Generate([]byte(data)); err == nil {
			t.Errorf("Generate(%s) succeeded, want an error", data)
		}
	}
}
