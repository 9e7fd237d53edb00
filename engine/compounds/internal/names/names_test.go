package names

import (
	"testing"

	"github.com/google/go-cmp/cmp"
)

// The expected values follow the normalization rules stated in Normalize's doc comment (common practice
// for name lookup, no source).
func TestNormalize(t *testing.T) {
	for _, tt := range []struct{ in, want string }{
		{"ATP", "atp"},
		{"  Adenosine   5′-Triphosphate ", "adenosine 5'-triphosphate"},
		{"5’-AMP", "5'-amp"},
		{"‘quoted’", "'quoted'"},
		{"H₂O", "h₂o"},
		{"\t\n", ""},
	} {
		if got := Normalize(tt.in); got != tt.want {
			t.Errorf("Normalize(%q) = %q, want %q", tt.in, got, tt.want)
		}
	}
}

func TestCollectAndIndex(t *testing.T) {
	entries, clashes := Collect([][]string{{"B", "beta", "BETA", ""}, {"A", "alpha", "Beta"}})
	wantEntries := []Entry{{"B", "b", true, 0}, {"beta", "beta", false, 0}, {"A", "a", true, 1}, {"alpha", "alpha", false, 1}}
	if diff := cmp.Diff(wantEntries, entries); diff != "" {
		t.Errorf("entries (-want +got):\n%s", diff)
	}
	if diff := cmp.Diff([]Clash{{"Beta", 1, 0}}, clashes); diff != "" {
		t.Errorf("clashes (-want +got):\n%s", diff)
	}
	if diff := cmp.Diff([]int{2, 3, 0, 1}, Index(entries)); diff != "" {
		t.Errorf("index (-want +got):\n%s", diff)
	}
}
