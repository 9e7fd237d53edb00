package engine

import (
	"encoding/json"
	"errors"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
)

func TestDecodeFormat(t *testing.T) {
	for _, tc := range []struct{ in, msg string }{
		{`{"rows":[]}`, `"format" field is missing`},
		{`{"format":"gibbsheet-worksheet/2","rows":[]}`, `"gibbsheet-worksheet/2" is not readable`},
		{`{"format":"spreadsheet","rows":[]}`, `format "spreadsheet" found`},
		{`{"format":7}`, `field "format" must be text`},
		{`[1,2]`, `must be a JSON object`},
		{`{"format":"gibbsheet-worksheet/1","rows":[{"id":"a","times":"two"}]}`, `field "rows[0].times" must be a number, found text`},
		{`{"format":"gibbsheet-worksheet/1",`, `ends before the document is complete`},
		{"{\n\"format\": x}", `line 2, column 11`},
		{``, `ends before`},
	} {
		_, _, err := Decode([]byte(tc.in))
		if err == nil || !strings.Contains(err.Error(), tc.msg) {
			t.Errorf("Decode(%s): error %v; want one containing %q", tc.in, err, tc.msg)
		}
	}
	_, _, err := Decode([]byte(`{"format":"gibbsheet-worksheet/9"}`))
	if !errors.Is(err, ErrFormat) {
		t.Errorf("newer format: error %v is not ErrFormat", err)
	}
}

func TestDecodeUnknownFields(t *testing.T) {
	_, unknown, err := Decode([]byte(`{"format":"gibbsheet-worksheet/1","colour":"red",` +
		`"conditions":{"ph":7},"rows":[{"id":"a","equation":"A = B","comment":"x"}]}`))
	if err != nil {
		t.Fatal(err)
	}
	want := []string{"colour", "conditions.ph", "rows[0].comment"}
	if diff := cmp.Diff(want, unknown); diff != "" {
		t.Errorf("unknown fields (-want +got):\n%s", diff)
	}
}

// TestRoundTrip: reading then writing a document gives the same document (compared as JSON values).
func TestRoundTrip(t *testing.T) {
	docs := []string{
		`{"format":"gibbsheet-worksheet/1","rows":[]}`,
		`{"format":"gibbsheet-worksheet/1","title":"t","notes":"n\u003cb\u003e","conditions":{"pH":7.4,` +
			`"ionicStrength":0.15,"pMg":3,"temperature":310.15},"defaultConcentration":"0.1 mM",` +
			`"concentrations":{"ATP":"3 mM","x y":"bad"},"compounds":[{"id":"X","name":"ex","formula":"C3H4O3",` +
			`"charge":-1,"species":[{"dfG0":-350.1,"dfH0":-400,"charge":-1,"nH":3}]},{"id":"Y","dfG0prime":-12.5}],` +
			`"values":{"ATP":{"phosphate":2},"NADH":{"reducing":1,"po":2.5}},"nearEquilibrium":3,` +
			`"rows":[{"id":"r1","equation":"A = B","times":2,"dG0":-3.5,"note":"a note"},{"id":"r2","equation":""}]}`,
	}
	for _, doc := range docs {
		ws, _, err := Decode([]byte(doc))
		if err != nil {
			t.Fatal(err)
		}
		out, err := ws.Encode()
		if err != nil {
			t.Fatal(err)
		}
		var want, got any
		json.Unmarshal([]byte(doc), &want)
		json.Unmarshal(out, &got)
		if diff := cmp.Diff(want, got); diff != "" {
			t.Errorf("round trip changed the document (-want +got):\n%s", diff)
		}
	}
}
