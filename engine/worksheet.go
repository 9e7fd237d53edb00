package engine

import (
	"bytes"
	"errors"
	"math"
	"strconv"
	"strings"

	"gibbsheet/engine/internal/say"
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
//
// The reading is encoding/json's (see decode.go), and so is what is reported first: an error in the JSON
// syntax, then a wrong or missing format, then a field of the wrong type.
func Decode(data []byte) (*Worksheet, []string, error) {
	return decodeWith(&decoder{data: data})
}

// decodeSeen is Decode taking the rows whose text is unchanged from seen, the rows of the document read
// before (nil for none); it returns what to pass for the next document, which keeps data: the caller must
// not change it afterwards.
func decodeSeen(data []byte, seen *rowsSeen) (*Worksheet, []string, *rowsSeen, error) {
	d := &decoder{data: data, seen: seen}
	ws, unknown, err := decodeWith(d)
	if err != nil {
		return nil, nil, seen, err
	}
	d.next.text, d.next.rows = data, ws.Rows
	if d.rowLists > 1 {
		d.next.spans = nil // the later list changed rows the spans were read for
	}
	// A copy, not &d.next: that would keep the decoder, and through its seen every earlier reading,
	// alive as long as the session keeps this one (TestSessionKeepsOnlyTheLatestDocument).
	next := new(rowsSeen)
	*next = d.next
	return ws, unknown, next, nil
}

func decodeWith(d *decoder) (*Worksheet, []string, error) {
	data := d.data
	ws, err := d.document()
	if err != nil {
		return nil, nil, err
	}
	if d.typeErr == nil && !d.unknown {
		if err := checkFormat(&ws.Format, data); err != nil {
			return nil, nil, err
		}
		if d.trailing >= 0 {
			return nil, nil, d.trailingError()
		}
		return ws, nil, nil
	}
	// As the encoding/json reader had it: with an unknown member or a wrong value somewhere, the format is
	// that of the last "format" member, a null clearing it (without, a null is ignored as for any text).
	if d.trailing >= 0 {
		return nil, nil, d.trailingError()
	}
	if d.formatErr != nil {
		return nil, nil, d.formatErr
	}
	if err := checkFormat(d.probe, data); err != nil {
		return nil, nil, err
	}
	if d.typeErr != nil {
		return nil, nil, d.typeErr
	}
	return ws, d.unknownList(), nil
}

func (d *decoder) trailingError() error {
	line, col := lineColumn(d.data, d.trailing)
	return say.Errorf("not valid JSON at line %d, column %d: there is more text after the worksheet", line, col)
}

// checkFormat checks the "format" field; data tells a missing field from an empty one.
func checkFormat(f *string, data []byte) error {
	if f != nil && *f == "" && !bytes.Contains(data, []byte(`"format"`)) {
		f = nil
	}
	switch {
	case f == nil:
		return say.Errorf("%w: the \"format\" field is missing (expected %q)", ErrFormat, Format)
	case *f == Format:
		return nil
	case strings.HasPrefix(*f, formatPrefix):
		return say.Errorf("%w: format %q is not readable by this version, which reads %q; "+
			"open it with a newer Gibbsheet", ErrFormat, *f, Format)
	default:
		return say.Errorf("%w: format %q found, expected %q", ErrFormat, *f, Format)
	}
}

// lineColumn turns a byte offset into a 1-based line and a 1-based column counted in bytes.
func lineColumn(data []byte, offset int) (line, col int) {
	if offset > len(data) {
		offset = len(data)
	}
	before := data[:offset]
	line = bytes.Count(before, []byte("\n")) + 1
	col = offset - bytes.LastIndexByte(before, '\n')
	return line, col
}

// Encode writes the worksheet document, indented for people who read or diff it: the bytes of
// json.MarshalIndent(ws, "", "  "). It fails if a number is NaN or infinite, which JSON cannot write.
func (ws *Worksheet) Encode() ([]byte, error) {
	if path := ws.nonFinite(); path != "" {
		return nil, say.Errorf("cannot write the worksheet: field %q is not a finite number", path)
	}
	return appendIndented(nil, ws.AppendJSON(nil)), nil
}

// AppendJSON appends the worksheet document, compact, to dst and returns the extended buffer: the bytes of
// json.Marshal(ws), fields in declaration order with the omitempty rules of the tags, map keys sorted,
// numbers and strings as encoding/json writes them. Like Result.AppendJSON it panics if a number is NaN or
// infinite (Encode reports that as an error instead).
func (ws *Worksheet) AppendJSON(dst []byte) []byte {
	if ws == nil {
		return append(dst, "null"...)
	}
	dst = append(dst, `{"format":`...)
	dst = appendJSONString(dst, ws.Format)
	dst = appendOptString(dst, `,"title":`, ws.Title)
	dst = appendOptString(dst, `,"notes":`, ws.Notes)
	if c := ws.Conditions; c != nil {
		dst = append(dst, `,"conditions":`...)
		start := len(dst)
		dst = appendOptFloat(dst, `,"pH":`, c.PH)
		dst = appendOptFloat(dst, `,"ionicStrength":`, c.IonicStrength)
		dst = appendOptFloat(dst, `,"pMg":`, c.PMg)
		dst = appendOptFloat(dst, `,"temperature":`, c.Temperature)
		dst = closeObject(dst, start)
	}
	dst = appendOptString(dst, `,"defaultConcentration":`, ws.DefaultConcentration)
	if len(ws.Concentrations) > 0 {
		dst = append(dst, `,"concentrations":`...)
		dst = appendSortedMap(dst, ws.Concentrations, appendJSONString)
	}
	if len(ws.Compounds) > 0 {
		dst = append(dst, `,"compounds":`...)
		dst = appendJSONSlice(dst, ws.Compounds, (*Compound).appendJSON)
	}
	if len(ws.Values) > 0 {
		dst = append(dst, `,"values":`...)
		dst = appendSortedMap(dst, ws.Values, appendValue)
	}
	dst = appendOptFloat(dst, `,"nearEquilibrium":`, ws.NearEquilibrium)
	if len(ws.Compartments) > 0 {
		dst = append(dst, `,"compartments":`...)
		dst = appendJSONSlice(dst, ws.Compartments, (*Compartment).appendJSON)
	}
	dst = appendOptString(dst, `,"defaultCompartment":`, ws.DefaultCompartment)
	if b := ws.Bounds; b != nil {
		dst = append(dst, `,"bounds":`...)
		start := len(dst)
		if len(b.Default) > 0 {
			dst = append(dst, `,"default":`...)
			dst = appendJSONSlice(dst, b.Default, appendJSONStringAt)
		}
		if len(b.Compounds) > 0 {
			dst = append(dst, `,"compounds":`...)
			dst = appendSortedMap(dst, b.Compounds, func(dst []byte, pair []string) []byte {
				return appendJSONSlice(dst, pair, appendJSONStringAt)
			})
		}
		dst = closeObject(dst, start)
	}
	dst = append(dst, `,"rows":`...)
	dst = appendJSONSlice(dst, ws.Rows, (*Row).appendJSON)
	return append(dst, '}')
}

func (c *Compound) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"id":`...)
	dst = appendJSONString(dst, c.ID)
	dst = appendOptString(dst, `,"name":`, c.Name)
	dst = appendOptString(dst, `,"formula":`, c.Formula)
	if c.Charge != nil {
		dst = append(dst, `,"charge":`...)
		dst = strconv.AppendInt(dst, int64(*c.Charge), 10)
	}
	if len(c.Species) > 0 {
		dst = append(dst, `,"species":`...)
		dst = appendJSONSlice(dst, c.Species, appendSpecies)
	}
	dst = appendOptFloat(dst, `,"dfG0prime":`, c.DfG0Prime)
	return append(dst, '}')
}

func appendSpecies(s *thermo.Species, dst []byte) []byte {
	dst = append(dst, `{"dfG0":`...)
	dst = appendJSONFloat(dst, s.DfG0)
	dst = appendOptFloat(dst, `,"dfH0":`, s.DfH0)
	dst = append(dst, `,"charge":`...)
	dst = strconv.AppendInt(dst, int64(s.Charge), 10)
	dst = append(dst, `,"nH":`...)
	dst = strconv.AppendInt(dst, int64(s.NH), 10)
	if s.NMg != 0 {
		dst = append(dst, `,"nMg":`...)
		dst = strconv.AppendInt(dst, int64(s.NMg), 10)
	}
	return append(dst, '}')
}

func appendValue(dst []byte, v Value) []byte {
	start := len(dst)
	dst = appendOptFloat(dst, `,"phosphate":`, v.Phosphate)
	dst = appendOptFloat(dst, `,"reducing":`, v.Reducing)
	dst = appendOptFloat(dst, `,"po":`, v.PO)
	dst = appendOptFloat(dst, `,"protonsPerATP":`, v.ProtonsPerATP)
	return closeObject(dst, start)
}

func (r *Row) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"id":`...)
	dst = appendJSONString(dst, r.ID)
	dst = append(dst, `,"equation":`...)
	dst = appendJSONString(dst, r.Equation)
	dst = appendOptFloat(dst, `,"times":`, r.Times)
	dst = appendOptFloat(dst, `,"dG0":`, r.DG0)
	dst = appendOptString(dst, `,"note":`, r.Note)
	return append(dst, '}')
}

func (c *Compartment) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"id":`...)
	dst = appendJSONString(dst, c.ID)
	dst = appendOptString(dst, `,"name":`, c.Name)
	dst = appendOptFloat(dst, `,"pH":`, c.PH)
	dst = appendOptFloat(dst, `,"ionicStrength":`, c.IonicStrength)
	dst = appendOptFloat(dst, `,"pMg":`, c.PMg)
	dst = appendOptFloat(dst, `,"potential":`, c.Potential)
	return append(dst, '}')
}

// appendOptString writes the member name (with its leading comma) and s, unless s is empty (omitempty).
func appendOptString(dst []byte, name, s string) []byte {
	if s == "" {
		return dst
	}
	return appendJSONString(append(dst, name...), s)
}

// appendOptFloat writes the member name (with its leading comma) and *f, unless f is nil (omitempty).
func appendOptFloat(dst []byte, name string, f *float64) []byte {
	if f == nil {
		return dst
	}
	return appendJSONFloat(append(dst, name...), *f)
}

// closeObject ends an object whose members, each written with a leading comma, start at dst[start]: the
// first comma becomes the "{".
func closeObject(dst []byte, start int) []byte {
	if len(dst) == start {
		return append(dst, '{', '}')
	}
	dst[start] = '{'
	return append(dst, '}')
}

// appendSortedMap writes a map as an object, names sorted as encoding/json sorts them (bytewise).
func appendSortedMap[V any](dst []byte, m map[string]V, appendValue func([]byte, V) []byte) []byte {
	for i, k := range sortedKeys(m) {
		dst = append(dst, ',')
		if i == 0 {
			dst[len(dst)-1] = '{'
		}
		dst = appendJSONString(dst, k)
		dst = append(dst, ':')
		dst = appendValue(dst, m[k])
	}
	return append(dst, '}')
}

// appendIndented appends the compact JSON src indented as json.Indent(dst, src, "", "  ") indents it: a
// member or element per line, two spaces a level, a space after ":", and {} and [] left empty on their line.
func appendIndented(dst, src []byte) []byte {
	depth := 0
	opened := false // the last byte opened an object or list
	inString, escaped := false, false
	for _, c := range src {
		if inString {
			dst = append(dst, c)
			switch {
			case escaped:
				escaped = false
			case c == '\\':
				escaped = true
			case c == '"':
				inString = false
			}
			continue
		}
		if opened && c != '}' && c != ']' {
			opened = false
			depth++
			dst = appendNewline(dst, depth)
		}
		switch c {
		case '"':
			inString = true
			dst = append(dst, c)
		case '{', '[':
			opened = true
			dst = append(dst, c)
		case ',':
			dst = appendNewline(append(dst, c), depth)
		case ':':
			dst = append(dst, ':', ' ')
		case '}', ']':
			if opened {
				opened = false
			} else {
				depth--
				dst = appendNewline(dst, depth)
			}
			dst = append(dst, c)
		default:
			dst = append(dst, c)
		}
	}
	return dst
}

func appendNewline(dst []byte, depth int) []byte {
	dst = append(dst, '\n')
	for range depth {
		dst = append(dst, ' ', ' ')
	}
	return dst
}

// nonFinite returns the path of the first number of the worksheet, in document order, that is NaN or
// infinite; "" if none.
func (ws *Worksheet) nonFinite() string {
	bad := ""
	check := func(f *float64, format string, args ...any) {
		if bad == "" && f != nil && (math.IsNaN(*f) || math.IsInf(*f, 0)) {
			bad = say.Sprintf(format, args...)
		}
	}
	if c := ws.Conditions; c != nil {
		check(c.PH, "conditions.pH")
		check(c.IonicStrength, "conditions.ionicStrength")
		check(c.PMg, "conditions.pMg")
		check(c.Temperature, "conditions.temperature")
	}
	for i, c := range ws.Compounds {
		for j := range c.Species {
			check(&c.Species[j].DfG0, "compounds[%d].species[%d].dfG0", i, j)
			check(c.Species[j].DfH0, "compounds[%d].species[%d].dfH0", i, j)
		}
		check(c.DfG0Prime, "compounds[%d].dfG0prime", i)
	}
	for _, k := range sortedKeys(ws.Values) {
		v := ws.Values[k]
		check(v.Phosphate, "values.%s.phosphate", k)
		check(v.Reducing, "values.%s.reducing", k)
		check(v.PO, "values.%s.po", k)
		check(v.ProtonsPerATP, "values.%s.protonsPerATP", k)
	}
	check(ws.NearEquilibrium, "nearEquilibrium")
	for i, c := range ws.Compartments {
		check(c.PH, "compartments[%d].pH", i)
		check(c.IonicStrength, "compartments[%d].ionicStrength", i)
		check(c.PMg, "compartments[%d].pMg", i)
		check(c.Potential, "compartments[%d].potential", i)
	}
	for i, r := range ws.Rows {
		check(r.Times, "rows[%d].times", i)
		check(r.DG0, "rows[%d].dG0", i)
	}
	return bad
}
