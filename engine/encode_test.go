package engine

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"reflect"
	"strconv"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
)

// The reference for every test in this file is encoding/json: AppendJSON must write exactly the bytes
// json.Marshal writes for the same value.

// appender is a document type with a hand-written encoder (Result, Worksheet).
type appender interface{ AppendJSON(dst []byte) []byte }

// checkSameAsMarshal fails unless r.AppendJSON writes what json.Marshal writes for r, byte for byte, after
// the bytes already in dst.
func checkSameAsMarshal(t *testing.T, name string, r appender) {
	t.Helper()
	want, err := json.Marshal(r)
	if err != nil {
		t.Fatalf("%s: json.Marshal: %v", name, err)
	}
	prefix := []byte("prefix")
	got := r.AppendJSON(prefix[:len(prefix):len(prefix)])
	if !bytes.HasPrefix(got, prefix) {
		t.Fatalf("%s: AppendJSON lost the bytes already in dst: %.20q", name, got)
	}
	if got = got[len(prefix):]; !bytes.Equal(want, got) {
		i := 0
		for i < len(want) && i < len(got) && want[i] == got[i] {
			i++
		}
		lo := max(0, i-60)
		t.Errorf("%s: AppendJSON differs from json.Marshal at byte %d:\njson.Marshal: …%s\nAppendJSON:   …%s",
			name, i, want[lo:min(len(want), i+60)], got[lo:min(len(got), i+60)])
	}
}

// TestAppendJSONWorksheets compares the encoders on the results of the golden worksheets, the seeds of
// FuzzEvaluateJSON (odd and broken inputs) and the benchmark worksheets.
func TestAppendJSONWorksheets(t *testing.T) {
	docs := map[string][]byte{"bench-10": benchSheet(10), "bench-100": benchSheet(100)}
	golden, _ := filepath.Glob("../testdata/worksheets/*.json")
	seeds, _ := filepath.Glob("testdata/fuzz/FuzzEvaluateJSON/*")
	if len(golden) == 0 || len(seeds) == 0 {
		t.Fatalf("found %d golden worksheets and %d fuzz seeds; want some of each", len(golden), len(seeds))
	}
	for _, path := range golden {
		b, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		docs[path] = b
	}
	for _, path := range seeds {
		b, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		// A seed file is the header line and one []byte("…") line.
		lines := strings.Split(strings.TrimSpace(string(b)), "\n")
		quoted, ok := strings.CutPrefix(lines[len(lines)-1], "[]byte(")
		doc, err := strconv.Unquote(strings.TrimSuffix(quoted, ")"))
		if !ok || err != nil {
			t.Fatalf("%s: not a []byte seed: %v", path, err)
		}
		docs[path] = []byte(doc)
	}
	for name, doc := range docs {
		ws, unknown, err := Decode(doc)
		if err != nil {
			continue // an unreadable worksheet has no result document
		}
		checkSameAsMarshal(t, name, Evaluate(ws, unknown))
	}
}

// awkwardFloats are numbers at the edges of encoding/json's formatting: the switches to exponent form at
// 1e-6 and 1e21, the cleaned-up exponent "e-7", negative zero, the smallest subnormal and the largest float.
var awkwardFloats = []float64{0, math.Copysign(0, -1), 1, -1, 0.1, 1.0 / 3, -2.5, 298.15, 1e-7, -1e-7, 1e-6,
	9.999999999999999e-7, 1e-5, 1.5e-10, 1e-100, 1e20, 1e21, -1e21, 9.999999999999998e20, 123456789012345680000,
	1e100, 5e-324, -5e-324, 2.2250738585072014e-308, 1.7976931348623157e308, -1.7976931348623157e308, 12345.678}

// awkwardStrings need escaping: HTML characters, quotes and backslashes, control characters, U+2028 and
// U+2029, invalid and truncated UTF-8, and ordinary non-ASCII text that must pass unchanged.
var awkwardStrings = func() []string {
	all := make([]byte, 256)
	for i := range all {
		all[i] = byte(i)
	}
	return []string{"", "ATP", "<b>&amp;</b> -> x", `"quoted" \back\slash/`, "\x00\x01\x1f\x7f", "\b\f\n\r\t",
		"line\u2028para\u2029end", "\u2027\u202a", "\xff\xfe invalid", "cut \xe2\x82", "\xed\xa0\x80 surrogate",
		"ΔrG'° µM", "emoji 🧪 é", string(all[:128]), string(all)}
}()

// handMadeResults exercise every field: nil and non-nil pointers, nil and empty slices and maps, fields
// left out by omitempty and written, awkward numbers and strings.
func handMadeResults() map[string]*Result {
	negZero := math.Copysign(0, -1)
	out := map[string]*Result{
		"nil":  nil,
		"zero": {},
		"empty": {Rows: []RowResult{}, Compounds: []CompoundUse{}, Values: map[string]ValueUsed{},
			Warnings: []Warning{}, Errors: []FieldError{}, MDF: &MDF{Bottlenecks: []string{},
				Concentrations: []OptimalConc{}, Rows: []MDFRow{}, Binding: []BindingBound{}, LeftOut: []string{}}},
		"empty-row": {Rows: []RowResult{{Warnings: []Warning{}, Errors: []RowError{}, Cost: &Cost{},
			Transport: &Transport{}, FluxForce: &FluxForce{}, Remedy: &Remedy{}, Error: &RowError{Suggestions: []string{}}}},
			Compounds: []CompoundUse{{Rows: []string{}}}, Values: map[string]ValueUsed{"": {ProtonsPerATP: negZero}},
			MDF: &MDF{Solver: map[string]string{"x": "y"}}},
	}
	for i, f := range awkwardFloats {
		p := &awkwardFloats[i]
		out[fmt.Sprintf("float %v", f)] = &Result{
			Rows: []RowResult{{Times: f, DG0: p, DG: p, K: p, Q: p, Log10K: p, Log10Q: p,
				Cost: &Cost{Phosphate: f, Reducing: f, Protons: f, ProtonATP: f, Total: f}, Transport: &Transport{Moves: []Move{{Amount: f, Work: f}}, Work: f},
				FluxForce: &FluxForce{Ratio: p, Log10Ratio: f, ReverseShare: f}, Remedy: &Remedy{From: f, To: f, Factor: f},
				Error: &RowError{Column: i, Length: -i}}},
			Total:      Total{DG0: p, DG: p, Cost: Cost{Phosphate: f, Reducing: f, Protons: f, ProtonATP: f, Total: f}},
			Compounds:  []CompoundUse{{Concentration: p, DfG0Prime: p}},
			Values:     map[string]ValueUsed{"v": {Phosphate: f, Reducing: f, PO: f, ProtonsPerATP: f}},
			Conditions: ConditionsUsed{PH: f, IonicStrength: f, PMg: p, Temperature: f, RT: f, NearEquilibrium: f},
			MDF: &MDF{DrivingForce: f, Concentrations: []OptimalConc{{Compound: "c", Concentration: f, Entered: f, Low: f, High: f}},
				Rows:    []MDFRow{{ID: "r", DrivingForce: f, Shadow: f, Bottleneck: true}},
				Binding: []BindingBound{{Compound: "c", Side: "low", Bound: f}}},
		}
	}
	for _, s := range awkwardStrings {
		ss := []string{s, s}
		out[fmt.Sprintf("string %q", s)] = &Result{
			Rows: []RowResult{{ID: s, Equation: s, Status: s, Warnings: []Warning{{Code: s, Message: s, Path: s}},
				Transport: &Transport{Moves: []Move{{Compound: s, From: s, To: s}}}, Remedy: &Remedy{Compound: s},
				Error: &RowError{Message: s, Suggestions: ss}, Errors: []RowError{{Message: s, Suggestions: ss}}}},
			Total: Total{Equation: s},
			Compounds: []CompoundUse{{ID: s, Compartment: s, Name: s, Library: s, Own: true, Text: s, AtDefault: true,
				Fixed: s, Rows: ss}},
			Values:   map[string]ValueUsed{s: {}, s + "b": {}, "b" + s: {}, "\u00e9": {}, "Z": {}, "a": {}},
			Warnings: []Warning{{Code: s, Message: s, Path: s}},
			Errors:   []FieldError{{Path: s, Message: s}},
			MDF: &MDF{Bottlenecks: ss, Concentrations: []OptimalConc{{Compound: s}}, Rows: []MDFRow{{ID: s}},
				Binding: []BindingBound{{Compound: s, Side: s}}, LeftOut: ss, Message: s, Solver: map[string]string{s: s}},
		}
	}
	return out
}

func TestAppendJSONHandMade(t *testing.T) {
	for name, r := range handMadeResults() {
		checkSameAsMarshal(t, name, r)
	}
}

// TestAppendJSONStringRandom compares the string escaping with json.Marshal's on seeded random strings
// built from characters that are copied, escaped or start UTF-8 sequences, at every offset of the 8-byte
// words that appendJSONString tests at once.
func TestAppendJSONStringRandom(t *testing.T) {
	pieces := []string{"a", "Z", " ", "~", "\x7f", `"`, "\\", "<", ">", "&", "=", "?", "\x00", "\n", "\x1f", "é", "−",
		"\u2028", "\u2029", "\xe2\x80", "\xff", "🧪", "\xf0\x9f"}
	rnd := rand.New(rand.NewPCG(20261201, 2))
	for range 20000 {
		var b strings.Builder
		for range rnd.IntN(40) {
			b.WriteString(pieces[rnd.IntN(len(pieces))])
		}
		s := b.String()
		want, _ := json.Marshal(s)
		if got := appendJSONString(nil, s); !bytes.Equal(want, got) {
			t.Fatalf("%q: appendJSONString writes %s, json.Marshal %s", s, got, want)
		}
	}
}

// filler sets every exported field of a value, walking the types with reflect, so that a field the encoder
// does not know changes json.Marshal's output and not AppendJSON's.
type filler struct {
	rnd *rand.Rand
	// mode "full": no nil pointer, slice or map, no zero leaf (every field is written, omitempty or not);
	// "minimal": containers of one element with zero leaves (omitempty fields are left out);
	// "random": anything, nil and zero included.
	mode string
}

func (f *filler) fill(v reflect.Value) {
	r, full := f.rnd, f.mode == "full"
	zero := f.mode == "minimal" || f.mode == "random" && r.IntN(3) == 0
	switch v.Kind() {
	case reflect.String:
		if !zero {
			v.SetString(awkwardStrings[1+r.IntN(len(awkwardStrings)-1)])
		}
	case reflect.Float64:
		if !zero {
			v.SetFloat(awkwardFloats[2+r.IntN(len(awkwardFloats)-2)]) // no zeros: zero is the other case
		}
	case reflect.Int:
		if !zero {
			v.SetInt(1 + r.Int64N(1<<31))
		}
	case reflect.Bool:
		v.SetBool(!zero)
	case reflect.Pointer:
		if full || f.mode == "minimal" || r.IntN(3) > 0 {
			v.Set(reflect.New(v.Type().Elem()))
			f.fill(v.Elem())
		}
	case reflect.Slice:
		n := 1
		if f.mode == "full" {
			n = 1 + r.IntN(3)
		} else if f.mode == "random" {
			n = r.IntN(4) - 1 // -1: nil
		}
		if n >= 0 {
			v.Set(reflect.MakeSlice(v.Type(), n, n))
			for i := range n {
				f.fill(v.Index(i))
			}
		}
	case reflect.Map:
		if !full && f.mode != "minimal" && r.IntN(4) == 0 {
			return
		}
		v.Set(reflect.MakeMap(v.Type()))
		for range 1 + r.IntN(5) {
			k, e := reflect.New(v.Type().Key()).Elem(), reflect.New(v.Type().Elem()).Elem()
			f.fill(k)
			f.fill(e)
			v.SetMapIndex(k, e)
		}
	case reflect.Struct:
		for i := range v.NumField() {
			if v.Type().Field(i).IsExported() {
				f.fill(v.Field(i))
			}
		}
	default:
		panic(fmt.Sprintf("filler: a field of kind %s; teach the filler and the encoder", v.Kind()))
	}
}

// TestAppendJSONFilled fills the Result types by reflection, so that it covers a field added to them
// whether or not the encoder was taught it: in "full" mode every field is written by json.Marshal, in
// "minimal" mode the omitempty fields are left out. Random fills (seeded) mix nil, empty and set values.
func TestAppendJSONFilled(t *testing.T) {
	rnd := rand.New(rand.NewPCG(20261201, 1))
	for _, mode := range []string{"full", "minimal", "random"} {
		for i := range 100 {
			var r Result
			(&filler{rnd, mode}).fill(reflect.ValueOf(&r).Elem())
			if checkSameAsMarshal(t, fmt.Sprintf("%s fill %d", mode, i), &r); t.Failed() {
				return // the first few differences tell enough
			}
		}
	}
}

// encodedFields lists, per type, the fields appendJSON writes: name, Go type and json tag. Change it only
// together with encode.go.
var encodedFields = map[string][]string{
	"Result": {"Rows []engine.RowResult rows", "Total engine.Total total", "Compounds []engine.CompoundUse compounds",
		"Values map[string]engine.ValueUsed values", "Conditions engine.ConditionsUsed conditions",
		"Warnings []engine.Warning warnings", "Errors []engine.FieldError errors,omitempty", "MDF *engine.MDF mdf"},
	"RowResult": {"ID string id", "Equation string equation", "Times float64 times", "DG0 *float64 dG0",
		"DG *float64 dG", "K *float64 K", "Q *float64 Q", "Log10K *float64 log10K", "Log10Q *float64 log10Q",
		"Status string status", "Cost *engine.Cost cost", "Warnings []engine.Warning warnings",
		"Transport *engine.Transport transport,omitempty", "FluxForce *engine.FluxForce fluxForce,omitempty",
		"Remedy *engine.Remedy toDownhill,omitempty", "Error *engine.RowError error,omitempty",
		"Errors []engine.RowError errors,omitempty"},
	"Transport": {"Moves []engine.Move moves", "Work float64 work"},
	"Move": {"Compound string compound", "From string from", "To string to", "Amount float64 amount",
		"Work float64 work"},
	"Cost": {"Phosphate float64 phosphate", "Reducing float64 reducing", "Protons float64 protons",
		"ProtonATP float64 protonATP", "Total float64 total"},
	"RowError": {"Message string message", "Column int column", "Length int length",
		"Suggestions []string suggestions,omitempty"},
	"Warning":    {"Code string code", "Message string message", "Path string path,omitempty"},
	"FieldError": {"Path string path", "Message string message"},
	"Total":      {"Equation string equation", "DG0 *float64 dG0", "DG *float64 dG", "Cost engine.Cost cost"},
	"CompoundUse": {"ID string id", "Compartment string compartment", "Name string name", "Library string library",
		"Own bool own", "Concentration *float64 concentration", "Text string text", "AtDefault bool atDefault",
		"Fixed string fixed,omitempty", "DfG0Prime *float64 dfG0prime", "Approximation string approximation,omitempty",
		"Rows []string rows"},
	"ValueUsed": {"Phosphate float64 phosphate", "Reducing float64 reducing", "PO float64 po",
		"ProtonsPerATP float64 protonsPerATP,omitempty"},
	"ConditionsUsed": {"PH float64 pH", "IonicStrength float64 ionicStrength", "PMg *float64 pMg",
		"Temperature float64 temperature", "RT float64 RT", "NearEquilibrium float64 nearEquilibrium"},
	"MDF": {"DrivingForce float64 drivingForce", "Bottlenecks []string bottlenecks",
		"Concentrations []engine.OptimalConc concentrations", "Rows []engine.MDFRow rows",
		"Binding []engine.BindingBound binding", "LeftOut []string leftOut", "Message string message",
		"Solver map[string]string -"},
	"OptimalConc": {"Compound string compound", "Concentration float64 concentration", "Entered float64 entered",
		"Low float64 low", "High float64 high"},
	"MDFRow": {"ID string id", "DrivingForce float64 drivingForce", "Shadow float64 shadow",
		"Bottleneck bool bottleneck"},
	"BindingBound": {"Compound string compound", "Side string side", "Bound float64 bound"},
	"FluxForce":    {"Ratio *float64 ratio", "Log10Ratio float64 log10Ratio", "ReverseShare float64 reverseShare"},
	"Remedy":       {"Compound string compound", "From float64 from", "To float64 to", "Factor float64 factor"},
}

// TestEncoderKnowsEveryField walks the Result type tree and fails if a struct in it has a field, a type or a
// json tag that encodedFields (and so encode.go) does not have, or if a type was added or dropped.
func TestEncoderKnowsEveryField(t *testing.T) {
	got := map[string][]string{}
	var walk func(reflect.Type)
	walk = func(typ reflect.Type) {
		for typ.Kind() == reflect.Pointer || typ.Kind() == reflect.Slice || typ.Kind() == reflect.Map {
			typ = typ.Elem()
		}
		if _, seen := got[typ.Name()]; typ.Kind() != reflect.Struct || seen {
			return
		}
		got[typ.Name()] = []string{}
		for i := range typ.NumField() {
			f := typ.Field(i)
			if !f.IsExported() {
				continue // not part of the document (Result.rowJSON: the rows' encodings, checked by the tests above)
			}
			got[typ.Name()] = append(got[typ.Name()], fmt.Sprintf("%s %s %s", f.Name, f.Type, f.Tag.Get("json")))
			walk(f.Type)
		}
	}
	walk(reflect.TypeFor[Result]())
	if diff := cmp.Diff(encodedFields, got); diff != "" {
		t.Errorf("the Result types changed; update encode.go, then encodedFields (-encoder knows +types have):\n%s", diff)
	}
}

// TestAppendJSONUnsupported: where json.Marshal fails on NaN or an infinity, AppendJSON panics with the
// same error.
func TestAppendJSONUnsupported(t *testing.T) {
	for _, f := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		r := &Result{Rows: []RowResult{{DG0: &f}}}
		_, want := json.Marshal(r)
		if got := appendJSONError(r); want == nil || got == nil || got.Error() != want.Error() {
			t.Errorf("%v: AppendJSON error %v, json.Marshal error %v", f, got, want)
		}
	}
}

// appendJSONError runs r.AppendJSON and returns the error it panics with, or nil.
func appendJSONError(r *Result) (err error) {
	defer func() {
		if p := recover(); p != nil {
			err, _ = p.(error)
			if err == nil {
				err = fmt.Errorf("panic with a non-error: %v", p)
			}
		}
	}()
	r.AppendJSON(nil)
	return nil
}

// FuzzAppendJSON builds a Result from fuzzed strings and numbers and compares AppendJSON with json.Marshal.
func FuzzAppendJSON(f *testing.F) {
	f.Fuzz(func(t *testing.T, a, b string, x, y float64) {
		ab := []string{a, b}
		r := &Result{
			Rows: []RowResult{{ID: a, Equation: b, Times: x, DG0: &y, Status: a, Cost: &Cost{Phosphate: x, Total: y},
				Warnings: []Warning{{Code: a, Message: b, Path: a}}, FluxForce: &FluxForce{Log10Ratio: x, ReverseShare: y},
				Remedy: &Remedy{Compound: b, From: x, To: y, Factor: x}, Error: &RowError{Message: a, Suggestions: ab}}},
			Total:      Total{Equation: b, DG: &x, Cost: Cost{Protons: y, ProtonATP: x}},
			Compounds:  []CompoundUse{{ID: a, Name: b, Fixed: a, Concentration: &x, Rows: ab}},
			Values:     map[string]ValueUsed{a: {PO: x, ProtonsPerATP: y}, b: {Phosphate: y, ProtonsPerATP: x}},
			Conditions: ConditionsUsed{PH: x, PMg: &y},
			Warnings:   []Warning{{Code: b, Message: a}},
			Errors:     []FieldError{{Path: a, Message: b}},
			MDF: &MDF{DrivingForce: x, Bottlenecks: ab, Binding: []BindingBound{{Compound: a, Side: b, Bound: y}},
				Message: b, Solver: map[string]string{a: b}},
		}
		want, err := json.Marshal(r)
		if err != nil {
			if got := appendJSONError(r); got == nil || got.Error() != err.Error() {
				t.Fatalf("json.Marshal fails with %v, AppendJSON with %v", err, got)
			}
			return
		}
		if got := r.AppendJSON(nil); !bytes.Equal(want, got) {
			t.Fatalf("AppendJSON differs from json.Marshal:\njson.Marshal: %s\nAppendJSON:   %s", want, got)
		}
	})
}

// BenchmarkEncode compares json.Marshal with AppendJSON, into a new buffer (as EvaluateJSON does) and into
// a reused one, on the result of a 100-row worksheet.
func BenchmarkEncode(b *testing.B) {
	ws, unknown, err := Decode(benchSheet(100))
	if err != nil {
		b.Fatal(err)
	}
	r := Evaluate(ws, unknown)
	size := int64(len(r.AppendJSON(nil)))
	b.Run("json.Marshal", func(b *testing.B) {
		b.SetBytes(size)
		for b.Loop() {
			if _, err := json.Marshal(r); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("AppendJSON", func(b *testing.B) {
		b.SetBytes(size)
		for b.Loop() {
			r.AppendJSON(nil)
		}
	})
	b.Run("AppendJSON-reuse", func(b *testing.B) {
		b.SetBytes(size)
		var buf []byte
		for b.Loop() {
			buf = r.AppendJSON(buf[:0])
		}
	})
}
