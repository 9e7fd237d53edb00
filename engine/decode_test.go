package engine

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"maps"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"testing"
	"unsafe"

	"github.com/google/go-cmp/cmp"

	"gibbsheet/engine/thermo"
)

// The reference for every test in this file is encoding/json: decodeReference is the document reader as it
// was before decode.go, built on encoding/json, and Decode must read every document as it does. The
// encoders are compared with json.Marshal and json.MarshalIndent.

// decodeReference is the former Decode, kept unchanged as the reference.
func decodeReference(data []byte) (*Worksheet, []string, error) {
	ws := new(Worksheet)
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.DisallowUnknownFields()
	err := dec.Decode(ws)
	if err == nil {
		if err := checkFormat(&ws.Format, data); err != nil {
			return nil, nil, err
		}
		if dec.More() {
			return nil, nil, fmt.Errorf("not valid JSON: there is more text after the worksheet")
		}
		return ws, nil, nil
	}
	// A wrong or missing format explains the other errors best, so it is reported first.
	var probe struct {
		Format *string `json:"format"`
	}
	if perr := json.Unmarshal(data, &probe); perr != nil {
		return nil, nil, describeJSONError(data, perr)
	}
	if probe.Format == nil {
		return nil, nil, checkFormat(nil, data)
	}
	if ferr := checkFormat(probe.Format, data); ferr != nil {
		return nil, nil, ferr
	}
	if !strings.HasPrefix(err.Error(), "json: unknown field ") {
		return nil, nil, describeJSONError(data, err)
	}
	ws = new(Worksheet)
	if err := json.Unmarshal(data, ws); err != nil {
		return nil, nil, describeJSONError(data, err)
	}
	return ws, unknownFields(data), nil
}

// describeJSONError turns encoding/json's errors into a message that names the field or the line.
func describeJSONError(data []byte, err error) error {
	var syntax *json.SyntaxError
	var typ *json.UnmarshalTypeError
	switch {
	case strings.Contains(err.Error(), "unexpected end of JSON input"):
		return fmt.Errorf("not valid JSON: the text ends before the document is complete")
	case errors.As(err, &syntax):
		// Offset counts the bytes read, the offending one included.
		line, col := lineColumn(data, max(0, int(syntax.Offset)-1))
		return fmt.Errorf("not valid JSON at line %d, column %d: %s", line, col, syntax.Error())
	case errors.As(err, &typ):
		field := typ.Field
		if field == "" {
			return fmt.Errorf("a worksheet must be a JSON object, found %s", typ.Value)
		}
		return fmt.Errorf("field %q must be %s, found %s", field, jsonKind(typ.Type.Kind().String()), typ.Value)
	}
	return fmt.Errorf("cannot read the worksheet: %v", err)
}

func jsonKind(goKind string) string {
	switch goKind {
	case "string":
		return "text"
	case "float64", "int":
		return "a number"
	case "slice":
		return "a list"
	case "map", "struct", "ptr":
		return "an object"
	}
	return goKind
}

// unknownFields lists the JSON paths of object members the document format does not define.
func unknownFields(data []byte) []string {
	var doc map[string]json.RawMessage
	if json.Unmarshal(data, &doc) != nil {
		return nil
	}
	var out []string
	known := fieldSet(Worksheet{})
	for k, v := range doc {
		if !known[k] {
			out = append(out, k)
			continue
		}
		switch k {
		case "conditions":
			out = append(out, unknownIn(v, "conditions", fieldSet(Conditions{}))...)
		case "rows":
			out = append(out, unknownInList(v, "rows", fieldSet(Row{}))...)
		case "compounds":
			out = append(out, unknownInList(v, "compounds", fieldSet(Compound{}))...)
		case "compartments":
			out = append(out, unknownInList(v, "compartments", fieldSet(Compartment{}))...)
		case "bounds":
			out = append(out, unknownIn(v, "bounds", fieldSet(Bounds{}))...)
		}
	}
	slices.Sort(out)
	return out
}

func unknownInList(data json.RawMessage, path string, known map[string]bool) []string {
	var list []json.RawMessage
	if json.Unmarshal(data, &list) != nil {
		return nil
	}
	var out []string
	for i, item := range list {
		out = append(out, unknownIn(item, fmt.Sprintf("%s[%d]", path, i), known)...)
	}
	return out
}

func unknownIn(data json.RawMessage, path string, known map[string]bool) []string {
	var obj map[string]json.RawMessage
	if json.Unmarshal(data, &obj) != nil {
		return nil
	}
	var out []string
	for k := range obj {
		if !known[k] {
			out = append(out, path+"."+k)
		}
	}
	return out
}

// fieldSet lists the JSON member names of a document struct, read from its tags.
func fieldSet(v any) map[string]bool {
	t := reflect.TypeOf(v)
	set := make(map[string]bool, t.NumField())
	for i := range t.NumField() {
		name, _, _ := strings.Cut(t.Field(i).Tag.Get("json"), ",")
		set[name] = true
	}
	return set
}

// checkLikeReference fails unless Decode reads data as decodeReference does: the same worksheet (deeply
// equal, nil and empty lists told apart) and unknown list when the reference reads it; an error when the
// reference fails, the same one when it is about the format. The one intended difference: text after the
// document that starts with "}" or "]", which the reference let through, is an error.
func checkLikeReference(t *testing.T, data []byte) (*Worksheet, bool) {
	t.Helper()
	ws, unknown, err := Decode(data)
	rws, runknown, rerr := decodeReference(data)
	switch {
	case rerr != nil && err == nil:
		t.Fatalf("Decode(%.200q) succeeded; the reference fails: %v", data, rerr)
	case rerr != nil:
		if ws != nil || unknown != nil {
			t.Fatalf("Decode(%.200q) failed (%v) but returned a worksheet or unknown fields", data, err)
		}
		if errors.Is(rerr, ErrFormat) || errors.Is(err, ErrFormat) {
			if err.Error() != rerr.Error() || !errors.Is(err, ErrFormat) {
				t.Fatalf("Decode(%.200q): error %q; the reference: %q", data, err, rerr)
			}
		}
		return nil, false
	case err != nil:
		if !json.Valid(data) && strings.Contains(err.Error(), "more text after the worksheet") {
			return nil, false
		}
		t.Fatalf("Decode(%.200q) failed: %v; the reference reads it", data, err)
	}
	if !reflect.DeepEqual(rws, ws) {
		t.Fatalf("Decode(%.200q) differs from the reference (-reference +Decode):\n%s", data, cmp.Diff(rws, ws))
	}
	if !reflect.DeepEqual(runknown, unknown) {
		t.Fatalf("Decode(%.200q): unknown fields %#v; the reference: %#v", data, unknown, runknown)
	}
	return ws, true
}

// checkEncoders fails unless AppendJSON and Encode write what json.Marshal and json.MarshalIndent write.
func checkEncoders(t *testing.T, name string, ws *Worksheet) {
	t.Helper()
	checkSameAsMarshal(t, name, ws)
	if t.Failed() {
		t.FailNow()
	}
	want, _ := json.MarshalIndent(ws, "", "  ")
	got, err := ws.Encode()
	if err != nil || !bytes.Equal(want, got) {
		t.Fatalf("%s: Encode differs from json.MarshalIndent (error %v):\n%s\n%s", name, err, want, got)
	}
}

// FuzzDecode compares Decode with the reference reader on any input, and the encoders with encoding/json on
// every worksheet read. Seeds: the golden worksheets, the pathway templates, the seeds of FuzzEvaluateJSON
// and the hand-made ones in testdata/fuzz/FuzzDecode.
func FuzzDecode(f *testing.F) {
	for _, pattern := range []string{"../testdata/worksheets/*.json", "../pathways/*.json"} {
		paths, _ := filepath.Glob(pattern)
		if len(paths) == 0 {
			f.Fatalf("no seeds match %s", pattern)
		}
		for _, path := range paths {
			b, err := os.ReadFile(path)
			if err != nil {
				f.Fatal(err)
			}
			f.Add(b)
		}
	}
	seeds, _ := filepath.Glob("testdata/fuzz/FuzzEvaluateJSON/*")
	if len(seeds) == 0 {
		f.Fatal("no seeds of FuzzEvaluateJSON")
	}
	for _, path := range seeds {
		doc, err := readFuzzSeed(path)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(doc)
	}
	f.Add(benchSheet(3))
	f.Fuzz(func(t *testing.T, data []byte) {
		if ws, ok := checkLikeReference(t, data); ok {
			checkEncoders(t, "fuzzed", ws)
		}
	})
}

// readFuzzSeed reads a corpus file of a fuzz target with one []byte argument.
func readFuzzSeed(path string) ([]byte, error) {
	b, err := os.ReadFile(path)
	if err != nil {
		return nil, err
	}
	header, arg, _ := strings.Cut(strings.TrimSpace(string(b)), "\n")
	quoted, ok := strings.CutPrefix(arg, "[]byte(")
	quoted, ok2 := strings.CutSuffix(quoted, ")")
	doc, err := strconv.Unquote(quoted)
	if header != "go test fuzz v1" || !ok || !ok2 || err != nil {
		return nil, fmt.Errorf("%s: not a corpus file with one []byte: %v", path, err)
	}
	return []byte(doc), nil
}

// TestDecodeFilled fills the worksheet types by reflection (see filler) so that a field added to them is
// covered whether or not decode.go and the encoders were taught it: the filled worksheet, written by
// json.Marshal, must read as the reference reads it, with no unknown field, and be written back as
// encoding/json writes it.
func TestDecodeFilled(t *testing.T) {
	rnd := rand.New(rand.NewPCG(20261202, 2))
	for _, mode := range []string{"full", "minimal", "random"} {
		for i := range 100 {
			var ws Worksheet
			(&filler{rnd, mode}).fill(reflect.ValueOf(&ws).Elem())
			ws.Format = Format
			name := fmt.Sprintf("%s fill %d", mode, i)
			checkEncoders(t, name, &ws)
			doc, err := json.Marshal(&ws)
			if err != nil {
				t.Fatal(err)
			}
			got, ok := checkLikeReference(t, doc)
			if !ok {
				t.Fatalf("%s: not read: %s", name, doc)
			}
			if _, unknown, _ := Decode(doc); unknown != nil {
				t.Fatalf("%s: unknown fields %q in what json.Marshal wrote", name, unknown)
			}
			checkEncoders(t, name+" read back", got)
		}
	}
}

// TestDecoderKnowsEveryField fails if the member names of a worksheet type differ from the table decode.go
// reads it with, or if a field's type is a struct that has no table (a type added to the format).
func TestDecoderKnowsEveryField(t *testing.T) {
	tables := map[reflect.Type][]string{reflect.TypeFor[Worksheet](): worksheetFields,
		reflect.TypeFor[Conditions](): conditionsFields, reflect.TypeFor[Compound](): compoundFields,
		reflect.TypeFor[thermo.Species](): speciesFields, reflect.TypeFor[Value](): valueFields,
		reflect.TypeFor[Row](): rowFields, reflect.TypeFor[Compartment](): compartmentFields,
		reflect.TypeFor[Bounds](): boundsFields}
	for typ, table := range tables {
		var names []string
		for f := range typ.Fields() {
			name, _, _ := strings.Cut(f.Tag.Get("json"), ",")
			names = append(names, name)
			elem := f.Type
			for elem.Kind() == reflect.Pointer || elem.Kind() == reflect.Slice || elem.Kind() == reflect.Map {
				elem = elem.Elem()
			}
			if _, known := tables[elem]; elem.Kind() == reflect.Struct && !known {
				t.Errorf("%s.%s is a %s, a type decode.go does not read", typ.Name(), f.Name, elem)
			}
		}
		if diff := cmp.Diff(table, names); diff != "" {
			t.Errorf("the members of %s changed; teach decode.go and the encoders, then the table (-decode.go +type):\n%s", typ.Name(), diff)
		}
	}
}

// TestDecodeErrors: the messages name the field path, or the line and column, of the fault.
func TestDecodeErrors(t *testing.T) {
	const head = `{"format":"gibbsheet-worksheet/1",`
	for _, tc := range []struct{ in, msg string }{
		{head + `"rows":[{"id":"a"},{"id":"b","times":"2"}]}`, `field "rows[1].times" must be a number, found text`},
		{head + `"compounds":[{"id":"X","charge":1.5}],"rows":[]}`, `field "compounds[0].charge" must be a whole number (no fraction or exponent), found 1.5`},
		{head + `"compounds":[{"id":"X","species":[{"nH":"x"}]}],"rows":[]}`, `field "compounds[0].species[0].nH" must be a whole number, found text`},
		{head + `"values":{"ATP":{"phosphate":[]}},"rows":[]}`, `field "values.ATP.phosphate" must be a number, found a list`},
		{head + `"bounds":{"compounds":{"A":["1 mM",2]}},"rows":[]}`, `field "bounds.compounds.A[1]" must be text, found a number`},
		{head + `"conditions":{"pH":1e999},"rows":[]}`, `field "conditions.pH" must be a number between -1.8e308 and 1.8e308, found 1e999`},
		{head + `"rows":{}}`, `field "rows" must be a list, found an object`},
		{head + `"conditions":true,"rows":[]}`, `field "conditions" must be an object, found true`},
		{`"text"`, `a worksheet must be a JSON object, found text`},
		{head + "\n\"rows\":[]} x", `line 2, column 12: there is more text after the worksheet`},
		{head + "\n\"rows\":[]}}", `line 2, column 11: there is more text after the worksheet`},
		{"\xef\xbb\xbf{}", `line 1, column 1: found a byte order mark (U+FEFF) where a value should begin`},
		{head + `"rows":[1,]}`, `line 1, column 45: found ']' where a value should begin`},
		{head + `"rows":[],}`, `line 1, column 45: found '}' where the name of a member, in double quotes, should be`},
		{head + `"rows" []}`, `line 1, column 42: found '[' after the name "rows"; expected ':'`},
		{head + `"title":"a` + "\t" + `b","rows":[]}`, `line 1, column 45: control character U+0009 in text`},
		{head + `"title":"a\x","rows":[]}`, `line 1, column 45: invalid escape "\\x" in text`},
		{head + `"title":"\u12G4","rows":[]}`, `line 1, column 48: found 'G' in a \u escape`},
		{head + `"nearEquilibrium":01,"rows":[]}`, `line 1, column 54: found '1' after a member of an object`},
		{head + `"nearEquilibrium":1.,"rows":[]}`, `line 1, column 55: found ',' in a number where a digit should be`},
		{head + `"rows":[tru]}`, `line 1, column 46: found ']' in the middle of "true"`},
		{head + `"x":` + strings.Repeat("[", maxDepth) + strings.Repeat("]", maxDepth) + `}`, `nested more than 10000 deep`},
		{head + `"title":"\ud800`, `ends before the document is complete`},
		{" \n ", `ends before the document is complete`},
	} {
		_, _, err := Decode([]byte(tc.in))
		if err == nil || !strings.Contains(err.Error(), tc.msg) {
			t.Errorf("Decode(%.80q): error %v; want one containing %q", tc.in, err, tc.msg)
		}
	}
}

// BenchmarkDecode compares Decode with the encoding/json reader it replaces on the benchmark worksheets.
func BenchmarkDecode(b *testing.B) {
	for _, n := range []int{100, 1000} {
		doc := benchSheet(n)
		for _, impl := range []struct {
			name   string
			decode func([]byte) (*Worksheet, []string, error)
		}{{"Decode", Decode}, {"encoding-json", decodeReference}} {
			b.Run(fmt.Sprintf("%s/rows=%d", impl.name, n), func(b *testing.B) {
				b.SetBytes(int64(len(doc)))
				b.ReportAllocs()
				for b.Loop() {
					if _, _, err := impl.decode(doc); err != nil {
						b.Fatal(err)
					}
				}
			})
		}
	}
}

// TestEncodeNonFinite: where json.MarshalIndent fails on NaN or an infinity, Encode fails, naming the field,
// and AppendJSON panics as Result.AppendJSON does.
func TestEncodeNonFinite(t *testing.T) {
	for _, f := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		ws := &Worksheet{Format: Format, Rows: []Row{{ID: "a"}, {ID: "b", DG0: &f}}}
		if _, err := json.MarshalIndent(ws, "", "  "); err == nil {
			t.Fatalf("json.MarshalIndent accepted %v; the reference changed", f)
		}
		if _, err := ws.Encode(); err == nil || !strings.Contains(err.Error(), `field "rows[1].dG0" is not a finite number`) {
			t.Errorf("Encode with dG0 %v: error %v; want one naming rows[1].dG0", f, err)
		}
		func() {
			defer func() {
				if recover() == nil {
					t.Errorf("AppendJSON with dG0 %v did not panic", f)
				}
			}()
			ws.AppendJSON(nil)
		}()
	}
}

// BenchmarkWorksheetAppendJSON compares AppendJSON with json.Marshal on the 100-row benchmark worksheet.
func BenchmarkWorksheetAppendJSON(b *testing.B) {
	ws, _, err := Decode(benchSheet(100))
	if err != nil {
		b.Fatal(err)
	}
	b.Run("AppendJSON", func(b *testing.B) {
		var buf []byte
		for b.Loop() {
			buf = ws.AppendJSON(buf[:0])
		}
	})
	b.Run("json.Marshal", func(b *testing.B) {
		for b.Loop() {
			if _, err := json.Marshal(ws); err != nil {
				b.Fatal(err)
			}
		}
	})
}

// docSchema gives, for each worksheet type, its members' kinds, for genDoc.
var docSchema = map[string]map[string]string{
	"Worksheet": {"format": "text", "title": "text", "notes": "text", "conditions": "struct:Conditions",
		"defaultConcentration": "text", "concentrations": "map:text", "compounds": "list:struct:Compound",
		"values": "map:struct:Value", "nearEquilibrium": "float", "compartments": "list:struct:Compartment",
		"defaultCompartment": "text", "bounds": "struct:Bounds", "rows": "list:struct:Row"},
	"Conditions":  {"pH": "float", "ionicStrength": "float", "pMg": "float", "temperature": "float"},
	"Compound":    {"id": "text", "name": "text", "formula": "text", "charge": "int", "species": "list:struct:Species", "dfG0prime": "float"},
	"Species":     {"dfG0": "float", "dfH0": "float", "charge": "int", "nH": "int", "nMg": "int"},
	"Value":       {"phosphate": "float", "reducing": "float", "po": "float", "protonsPerATP": "float"},
	"Row":         {"id": "text", "equation": "text", "times": "float", "dG0": "float", "note": "text"},
	"Compartment": {"id": "text", "name": "text", "pH": "float", "ionicStrength": "float", "pMg": "float", "potential": "float"},
	"Bounds":      {"default": "list:text", "compounds": "map:list:text"},
}

// Literals genDoc draws from: ordinary values and awkward ones (escapes, lone surrogates, invalid UTF-8,
// numbers at the edges), and rarely numbers that do not fit (out of range, not whole) and other kinds.
var (
	genTexts     = []string{`""`, `"a"`, `"gibbsheet-worksheet/1"`, `"A = B"`, `"\u00e9\ud83e\uddea"`, `"\ud800"`, `"\udc00\ud800x"`, "\"\xff\xfe\"", `"<&>\u2028"`, `"\"format\""`}
	genFloats    = []string{`0`, `-0`, `7`, `2.5`, `-1e-7`, `1e21`, `1e-400`, `123456789012345678901234567890`}
	genInts      = []string{`0`, `-0`, `1`, `-3`, `9223372036854775807`, `-9223372036854775808`}
	genUnfitting = []string{`1e999`, `-1e400`, `1.0`, `1e2`, `9223372036854775808`}
	genOdd       = []string{`true`, `false`, `[]`, `{}`, `[1,{"a":null}]`, `{"x":[true]}`, `"text"`, `12`}
)

// genDoc writes a random document of the kind given (see docSchema): members named exactly, in other
// cases, with U+017F for s, or unknown; repeated members; nulls; now and then a value of a wrong kind.
func genDoc(r *rand.Rand, dst []byte, kind string, depth int) []byte {
	pick := func(list []string) string { return list[r.IntN(len(list))] }
	switch n := r.IntN(400); {
	case n < 10 || depth > 4:
		return append(dst, "null"...)
	case n == 10:
		return append(dst, pick(genOdd)...)
	case n == 11 && (kind == "float" || kind == "int"):
		return append(dst, pick(genUnfitting)...)
	}
	switch {
	case kind == "text":
		return append(dst, pick(genTexts)...)
	case kind == "float":
		return append(dst, pick(genFloats)...)
	case kind == "int":
		return append(dst, pick(genInts)...)
	case strings.HasPrefix(kind, "list:"):
		dst = append(dst, '[')
		for i := range r.IntN(5) {
			if i > 0 {
				dst = append(dst, ',')
			}
			dst = genDoc(r, dst, kind[len("list:"):], depth+1)
		}
		return append(dst, ']')
	}
	dst = append(dst, '{')
	if depth == 0 && r.IntN(10) > 0 {
		dst = append(dst, `"format":"gibbsheet-worksheet/1",`...)
	}
	schema := docSchema[strings.TrimPrefix(kind, "struct:")]
	names := slices.Sorted(maps.Keys(schema))
	for i := range r.IntN(8) + 1 {
		if i > 0 {
			dst = append(dst, ',')
		}
		name, elem := "", strings.TrimPrefix(kind, "map:")
		if schema != nil {
			name = names[r.IntN(len(names))]
			elem = schema[name]
			switch r.IntN(16) {
			case 0:
				name = strings.ToUpper(name)
			case 1:
				name = strings.ReplaceAll(name, "s", "\u017f")
			case 2:
				name, elem = pick([]string{"x", "colour", "ph", "conditions.x"}), "text"
			}
		} else {
			name = pick([]string{"A", "B", "a", ""})
		}
		dst = strconv.AppendQuote(dst, name)
		dst = append(dst, ':')
		dst = genDoc(r, dst, elem, depth+1)
	}
	return append(dst, '}')
}

// TestDecodeGenerated compares Decode with the reference on seeded random documents built from the format's
// grammar (genDoc), where mutation fuzzing rarely goes: repeated and case-folded members, nulls, wrong kinds.
func TestDecodeGenerated(t *testing.T) {
	r := rand.New(rand.NewPCG(20261202, 3))
	read := 0
	for range 5000 {
		doc := genDoc(r, nil, "struct:Worksheet", 0)
		if ws, ok := checkLikeReference(t, doc); ok {
			read++
			checkEncoders(t, string(doc), ws)
		}
	}
	t.Logf("%d of 5000 read", read)
	if read < 500 {
		t.Errorf("only %d of 5000 generated documents were readable; the generator lost its way", read)
	}
}

// TestDecodeSeen: reading a document with the rows kept from the one read before gives what Decode gives,
// whatever changed between the two, including rows with unknown or misspelled members, which are never
// taken from before, a second "rows" member, and rows moved or re-spaced.
func TestDecodeSeen(t *testing.T) {
	const head = `{"format":"gibbsheet-worksheet/1",`
	docs := []string{
		head + `"rows":[{"id":"a","equation":"ATP + H2O = ADP + Pi"},{"id":"b","equation":"G6P = F6P","times":2}]}`,
		head + `"rows":[{"id":"a","equation":"ATP + H2O = ADP + Pi"},{"id":"b","equation":"G6P = F6P","times":3}]}`,
		head + `"rows":[{"id":"b","equation":"G6P = F6P","times":3},{"id":"a","equation":"ATP + H2O = ADP + Pi"}]}`,
		head + `"rows":[ {"id":"b","equation":"G6P = F6P","times":3} ,{"id":"a","equation":"ATP + H2O = ADP + Pi","colour":"red"}]}`,
		head + `"rows":[{"id":"b","equation":"G6P = F6P","times":3},{"id":"a","equation":"ATP + H2O = ADP + Pi","colour":"red"}]}`,
		head + `"rows":[{"id":"b","equation":"G6P = F6P","times":3},{"id":"a","Equation":"ATP + H2O = ADP + Pi"}]}`,
		head + `"rows":[{"id":"b","equation":"G6P = F6P","times":3},{"id":"a","Equation":"ATP + H2O = ADP + Pi"}]}`,
		head + `"rows":[{"id":"b","equation":"G6P = F6P","times":3}],"rows":[{"note":"x"},{"id":"c","equation":"G6P = F6P","times":3}]}`,
		head + `"Rows":[{"id":"b","equation":"G6P = F6P","times":3}]}`,
		head + `"rows":[{"id":"b","equation":"G6P = F6P","times":"3"}]}`,
		head + `"rows":[{"id":"b","equation":"G6P = F6P","times":3}]}`,
		head + `"rows":[{"id":"b","equation":"G6P = F6P","times":3},{"id":"b","equation":"G6P = F6P","times":3}]}`,
		head + `"rows":[]}`,
		head + `"rows":[{"id":"b","equation":"G6P = F6P","times":3}]}`,
	}
	var seen *rowsSeen
	var prev *Worksheet
	for i, doc := range docs {
		want, wantUnknown, wantErr := Decode([]byte(doc))
		got, gotUnknown, next, gotErr := decodeSeen([]byte(doc), seen)
		if i == 1 && unsafe.StringData(got.Rows[0].Equation) != unsafe.StringData(prev.Rows[0].Equation) {
			t.Error("document 1: the unchanged first row was decoded again, not taken from the one before")
		}
		if i == 6 && unsafe.StringData(got.Rows[1].Equation) == unsafe.StringData(prev.Rows[1].Equation) {
			t.Error("document 6: a row with a misspelled member was taken from the one before")
		}
		prev = got
		if (wantErr == nil) != (gotErr == nil) || wantErr != nil && wantErr.Error() != gotErr.Error() {
			t.Fatalf("document %d: error %v, want %v", i, gotErr, wantErr)
		}
		if diff := cmp.Diff(want, got); diff != "" {
			t.Errorf("document %d: (-Decode +with the rows seen before):\n%s", i, diff)
		}
		if diff := cmp.Diff(wantUnknown, gotUnknown); diff != "" {
			t.Errorf("document %d: unknown fields (-Decode +with the rows seen before):\n%s", i, diff)
		}
		seen = next
	}
}
