package engine

import (
	"bytes"
	"encoding/csv"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
)

// TestResultsCSVGolden writes the results table of every golden worksheet (testdata/worksheets) and of
// the table's own cases (testdata/csv/*.json) and compares it with testdata/csv/NAME.csv, numbers within
// goldenTolerance. Run `go test ./engine -run ResultsCSVGolden -update` to accept a change.
func TestResultsCSVGolden(t *testing.T) {
	eachWorksheet(t, []string{"../testdata/worksheets/*.json", "../testdata/csv/*.json"},
		func(t *testing.T, name string, doc []byte) {
			got, err := ResultsCSV(doc)
			if err != nil {
				t.Fatal(err)
			}
			checkGolden(t, filepath.Join("../testdata/csv", name+".csv"), got,
				func(t *testing.T, b []byte) [][]any { return readTable(t, b, ',') })
		})
}

// readTable parses a table and turns each field that is a number into a float64, so that goldens compare
// numbers with a tolerance and text exactly.
func readTable(t *testing.T, data []byte, sep rune) [][]any {
	t.Helper()
	r := csv.NewReader(bytes.NewReader(data))
	r.Comma = sep
	recs, err := r.ReadAll()
	if err != nil {
		t.Fatalf("table does not parse: %v\n%s", err, data)
	}
	out := make([][]any, len(recs))
	for i, rec := range recs {
		for _, f := range rec {
			if v, err := strconv.ParseFloat(f, 64); err == nil {
				out[i] = append(out[i], v)
			} else {
				out[i] = append(out[i], f)
			}
		}
	}
	return out
}

// TestResultsTableShape checks what a spreadsheet relies on: the header, one line per row plus the total,
// the same number of fields on every line, CRLF for CSV and LF for tabs, and the same content whatever the
// separator.
func TestResultsTableShape(t *testing.T) {
	doc, err := os.ReadFile("../testdata/csv/quoting.json")
	if err != nil {
		t.Fatal(err)
	}
	c, err := ResultsCSV(doc)
	if err != nil {
		t.Fatal(err)
	}
	tab, err := ResultsTable(doc, '\t')
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasSuffix(c, []byte("\r\n")) || bytes.Contains(tab, []byte("\r\n")) {
		t.Error("want CRLF line ends in CSV and LF in the tab-separated text")
	}
	rc, rt := readTable(t, c, ','), readTable(t, tab, '\t')
	if diff := cmp.Diff(rc, rt); diff != "" {
		t.Errorf("CSV and tab-separated tables differ (-csv +tab):\n%s", diff)
	}
	if len(rc) != 1+4+1 {
		t.Fatalf("%d lines, want header + 4 rows + total", len(rc))
	}
	for i, line := range rc {
		if len(line) != len(TableHeader) {
			t.Errorf("line %d has %d fields, want %d", i+1, len(line), len(TableHeader))
		}
	}
	if rc[len(rc)-1][0] != "total" {
		t.Errorf("last line starts with %v, want total", rc[len(rc)-1][0])
	}
	// Text that a spreadsheet would take for a formula is guarded; negative numbers are not.
	for _, c := range []struct {
		line, field int
		want        any
	}{
		{1, 0, "'=1+1"},
		{2, 0, `a,"b"`},
		{4, 0, "'-x"},
		{4, 2, 2.0},
		{4, 3, -30.5}, // the entered ΔrG'° is the row's ΔrG'°
	} {
		if got := rc[c.line][c.field]; got != c.want {
			t.Errorf("line %d field %d = %#v, want %#v", c.line, c.field+1, got, c.want)
		}
	}
	for _, line := range rc {
		for _, f := range line {
			if s, ok := f.(string); ok && s != "" && strings.ContainsRune("=+-@", rune(s[0])) {
				t.Errorf("unguarded formula-like text %q", s)
			}
		}
	}
}

// TestResultsTableNumbers checks the number formats: empty for nothing, no "-0", and powers of ten beyond
// the range of doubles written from the logarithm.
func TestResultsTableNumbers(t *testing.T) {
	neg0, big, one := -0.0, 400.25, 1.0
	inf := math.Inf(1)
	for _, c := range []struct {
		got, want string
	}{
		{tableNumber(nil), ""},
		{tableNumber(&neg0), "0"},
		{tableNumber(&one), "1"},
		{tablePower(&inf, &big), "1.77827941e+400"},
		{tablePower(nil, nil), ""},
	} {
		if c.got != c.want {
			t.Errorf("got %q, want %q", c.got, c.want)
		}
	}
}

func TestResultsCSVBadDocument(t *testing.T) {
	for _, doc := range []string{`{`, `{"format":"gibbsheet-worksheet/2"}`, `[]`} {
		if _, err := ResultsCSV([]byte(doc)); err == nil {
			t.Errorf("ResultsCSV(%s): want an error", doc)
		}
	}
}

// TestCSVLineMatchesEncodingCSV: the engine's own CSV writer writes what encoding/csv's Writer writes
// (the reference library), for seeded random fields full of separators, quotes, line ends and spaces.
func TestCSVLineMatchesEncodingCSV(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	pieces := []string{"a", "ΔrG'°", ",", ";", "\t", `"`, "\r", "\n", "\r\n", " ", "\u00a0", `\.`, "=1", ""}
	for _, sep := range []rune{',', ';', '\t'} {
		for _, crlf := range []bool{false, true} {
			for range 2000 {
				fields := make([]string, 1+rng.IntN(4))
				for i := range fields {
					for range rng.IntN(4) {
						fields[i] += pieces[rng.IntN(len(pieces))]
					}
				}
				var buf bytes.Buffer
				w := csv.NewWriter(&buf)
				w.Comma, w.UseCRLF = sep, crlf
				w.Write(fields)
				w.Flush()
				if got := string(appendCSVLine(nil, fields, sep, crlf)); got != buf.String() {
					t.Fatalf("sep %q crlf %v fields %q:\n got %q\nwant %q", sep, crlf, fields, got, buf.String())
				}
			}
		}
	}
}
