package engine

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"reflect"
	"slices"
	"strings"

	"gibbsheet/engine/thermo"
)

// Format is the value of the "format" field of every worksheet document this version reads and writes.
const Format = "gibbsheet-worksheet/1"

const formatPrefix = "gibbsheet-worksheet/"

// Worksheet is the document users keep and share (JSON, version 1). The field names are the file format;
// DEVELOPERS.md describes every field. Optional fields are pointers or omitempty so that reading and then
// writing a document gives back the same document.
type Worksheet struct {
	Format               string            `json:"format"`
	Title                string            `json:"title,omitempty"`
	Notes                string            `json:"notes,omitempty"`
	Conditions           *Conditions       `json:"conditions,omitempty"`
	DefaultConcentration string            `json:"defaultConcentration,omitempty"`
	Concentrations       map[string]string `json:"concentrations,omitempty"`
	Compounds            []Compound        `json:"compounds,omitempty"`
	Values               map[string]Value  `json:"values,omitempty"`
	NearEquilibrium      *float64          `json:"nearEquilibrium,omitempty"`
	Compartments         []Compartment     `json:"compartments,omitempty"`
	DefaultCompartment   string            `json:"defaultCompartment,omitempty"`
	Bounds               *Bounds           `json:"bounds,omitempty"`
	Rows                 []Row             `json:"rows"`
}

// Bounds limit the concentrations the max-min driving force may choose: Default as [low, high] with units
// (absent: 1 µM to 10 mM, common practice) and per-compound entries; low = high holds a compound fixed.
type Bounds struct {
	Default   []string            `json:"default,omitempty"`
	Compounds map[string][]string `json:"compounds,omitempty"`
}

// Conditions of the worksheet. Absent fields take their defaults (pH 7, 0.25 M, magnesium ignored,
// 298.15 K); PMg absent or null means magnesium binding is ignored.
type Conditions struct {
	PH            *float64 `json:"pH,omitempty"`
	IonicStrength *float64 `json:"ionicStrength,omitempty"` // mol/L
	PMg           *float64 `json:"pMg,omitempty"`
	Temperature   *float64 `json:"temperature,omitempty"` // K
}

// Compound is one of the worksheet's own compounds. It carries either species data (transformed like the
// library's), a ΔfG'° already at the worksheet's conditions, or neither, in which case only rows with an
// entered dG0 can use it.
type Compound struct {
	ID        string           `json:"id"`
	Name      string           `json:"name,omitempty"`
	Formula   string           `json:"formula,omitempty"`
	Charge    *int             `json:"charge,omitempty"`
	Species   []thermo.Species `json:"species,omitempty"`
	DfG0Prime *float64         `json:"dfG0prime,omitempty"` // kJ/mol at the worksheet's conditions
}

// Value overrides the energy values of one compound: Phosphate in ATP equivalents per mole (ATP 2, ADP 1),
// Reducing in reduced carriers per mole (NADH 1), PO in ATP per reduced carrier (the P/O ratio, NADH 2.5).
// ProtonsPerATP, set on "H+", is how many protons moved across a membrane are worth one ATP.
type Value struct {
	Phosphate     *float64 `json:"phosphate,omitempty"`
	Reducing      *float64 `json:"reducing,omitempty"`
	PO            *float64 `json:"po,omitempty"`
	ProtonsPerATP *float64 `json:"protonsPerATP,omitempty"`
}

// Row is one reaction of the worksheet. Times multiplies it in the pathway (2 per glucose for the lower half
// of glycolysis); DG0, when entered, replaces the computed ΔrG'° (kJ/mol, at the worksheet's conditions).
type Row struct {
	ID       string   `json:"id"`
	Equation string   `json:"equation"`
	Times    *float64 `json:"times,omitempty"`
	DG0      *float64 `json:"dG0,omitempty"`
	Note     string   `json:"note,omitempty"`
}

// ErrFormat is wrapped by every error about the document's "format" field.
var ErrFormat = errors.New("not a Gibbsheet worksheet")

// Decode reads a worksheet document. It fails only when the bytes cannot be read as a worksheet at all: not
// JSON, a field of the wrong type, or a missing or unsupported format. Unknown fields are ignored and listed
// in the returned slice (as JSON paths) so the caller can warn about them.
func Decode(data []byte) (*Worksheet, []string, error) {
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

// Encode writes the worksheet document, indented for people who read or diff it.
func (ws *Worksheet) Encode() ([]byte, error) {
	return json.MarshalIndent(ws, "", "  ")
}

// checkFormat checks the "format" field; data tells a missing field from an empty one.
func checkFormat(f *string, data []byte) error {
	if f != nil && *f == "" && !bytes.Contains(data, []byte(`"format"`)) {
		f = nil
	}
	switch {
	case f == nil:
		return fmt.Errorf("%w: the \"format\" field is missing (expected %q)", ErrFormat, Format)
	case *f == Format:
		return nil
	case strings.HasPrefix(*f, formatPrefix):
		return fmt.Errorf("%w: format %q is not readable by this version, which reads %q; "+
			"open it with a newer Gibbsheet", ErrFormat, *f, Format)
	default:
		return fmt.Errorf("%w: format %q found, expected %q", ErrFormat, *f, Format)
	}
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

func lineColumn(data []byte, offset int) (line, col int) {
	if offset > len(data) {
		offset = len(data)
	}
	before := data[:offset]
	line = bytes.Count(before, []byte("\n")) + 1
	col = offset - bytes.LastIndexByte(before, '\n')
	return line, col
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
