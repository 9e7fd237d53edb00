package pathways_test

import (
	"errors"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"gibbsheet/pathways"
)

// TestAll checks the list of templates: the files issues 5 and 7 ask for and the two NADH shuttles, sorted by
// name, without the demo, each with a title and a one-line summary.
func TestAll(t *testing.T) {
	all, err := pathways.All()
	if err != nil {
		t.Fatal(err)
	}
	var files []string
	for _, tpl := range all {
		files = append(files, tpl.File)
		if tpl.Title == "" || tpl.Summary == "" || strings.Contains(tpl.Summary, "\n") {
			t.Errorf("%s: title %q, summary %q: want both, the summary on one line", tpl.File, tpl.Title, tpl.Summary)
		}
		if len(tpl.Doc) == 0 {
			t.Errorf("%s: empty document", tpl.File)
		}
	}
	want := []string{
		"beta-oxidation-round.json",
		"ethanol-fermentation.json",
		"gluconeogenesis-mitochondrial-pepck.json",
		"gluconeogenesis.json",
		"glycerol-phosphate-shuttle.json",
		"glycogen-synthesis.json",
		"glycolysis.json",
		"glyoxylate-shunt.json",
		"lactate-fermentation.json",
		"malate-aspartate-shuttle.json",
		"pentose-phosphate-oxidative.json",
		"tca-cycle.json",
		"urea-cycle.json",
	}
	if diff := cmp.Diff(want, files); diff != "" {
		t.Errorf("templates (-want +got):\n%s", diff)
	}
}

func TestGet(t *testing.T) {
	tpl, err := pathways.Get("glycolysis.json")
	if err != nil {
		t.Fatal(err)
	}
	if !strings.HasPrefix(tpl.Summary, "Glycolysis:") {
		t.Errorf("summary %q", tpl.Summary)
	}
	for _, bad := range []string{"demo.json", "nothing.json", "glycolysis", "../go.mod", ""} {
		if _, err := pathways.Get(bad); !errors.Is(err, pathways.ErrNotFound) {
			t.Errorf("Get(%q): error %v, want ErrNotFound", bad, err)
		}
	}
}

func TestSummary(t *testing.T) {
	for _, tc := range []struct{ notes, title, want string }{
		{"First line.\nSecond line.", "Title", "First line."},
		{"\n  Indented first line.  \nrest", "Title", "Indented first line."},
		{"", " Title ", "Title"},
		{"\n\n", "Title", "Title"},
	} {
		if got := pathways.Summary(tc.notes, tc.title); got != tc.want {
			t.Errorf("Summary(%q, %q) = %q, want %q", tc.notes, tc.title, got, tc.want)
		}
	}
}
