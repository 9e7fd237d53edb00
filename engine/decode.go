package engine

import (
	"math"
	"slices"
	"strconv"
	"strings"
	"unicode/utf16"
	"unicode/utf8"

	"gibbsheet/engine/internal/say"
	"gibbsheet/engine/thermo"
)

// This file reads the worksheet document without reflection: a byte scanner with one function per kind of
// value, positions kept as byte offsets and turned into a line and column only for an error. It decodes as
// encoding/json decoded into the Worksheet types, quirks included, so that a document means what it meant:
// member names match the fields case-insensitively (Unicode simple folding), the last of duplicate members
// wins and decodes into what the earlier ones left (objects merge, lists reuse their elements), null leaves
// a text, number or struct as it is and clears a pointer, list or map, numbers must fit their field, and
// text with invalid UTF-8 or a lone surrogate escape reads as U+FFFD. One difference is intended: any text
// after the document is an error, where the former reader let text starting with "}" or "]" through.

// maxDepth is the deepest nesting of lists and objects a document may have (encoding/json's limit).
const maxDepth = 10000

// A decoder reads one document. Syntax errors end the reading (panic with *syntaxError, recovered by
// document); the first value of a wrong type is remembered and the reading goes on, so that a syntax error
// later in the text is still the one reported.
type decoder struct {
	data  []byte
	off   int // offset of the next byte to read
	depth int
	path  []pathElem // where the value being read sits, for messages
	buf   []byte     // text of the last string that needed unescaping

	typeErr   *typeError // first value of a wrong type
	formatErr *typeError // first top-level "format" value that is not text (or a document that is no object)
	unknown   bool       // a member name no field matches, even case-insensitively
	probe     *string    // the format as a lone *string field reads it: null clears it
	trailing  int        // offset of text after the document, -1 if none

	// Unknown member names compared exactly (see unknownList): by top-level name, the names it contributes.
	unknowns map[string][]string
	nested   []string // names collected in the member being read

	seen     *rowsSeen // the rows of the document read before, if the caller kept them
	rowLists int       // how many "rows" members the document has (after a second, no span holds)
	next     rowsSeen  // this document's rows that read cleanly, for the next reading
}

// rowsSeen is what a Session keeps of the rows of the document it read last, so that reading the next
// version takes a row whose text is unchanged from there instead of decoding it again: while someone
// types, all rows but one are.
type rowsSeen struct {
	text  []byte    // the document read
	rows  []Row     // its rows as read
	spans []rowSpan // by index in rows: where a row that read cleanly stands in text
}

// rowSpan is where a row was decoded from, text[start:end], if it was an object with no member of an
// unknown or misspelled name and no value of a wrong type, decoded into an empty row; an empty span for
// others. Identical text decodes to the same row.
type rowSpan struct{ start, end int32 }

// rowOrSeen reads one row of the list, from the row seen at the same place when its text is the same.
func (d *decoder) rowOrSeen(r *Row, collect bool) {
	i := d.path[len(d.path)-1].index
	fresh := *r == Row{}
	d.peek()
	start := d.off
	if fresh && d.seen != nil && i < len(d.seen.spans) {
		p := d.seen.spans[i]
		if text := d.seen.text[p.start:p.end]; len(text) > 0 && len(d.data)-d.off >= len(text) &&
			string(d.data[d.off:d.off+len(text)]) == string(text) {
			*r = d.seen.rows[i]
			d.off += len(text)
			d.keepRow(i, start)
			return
		}
	}
	typeErr, unknown, nested := d.typeErr, d.unknown, len(d.nested)
	d.row(r, collect)
	if fresh && d.typeErr == typeErr && typeErr == nil && !unknown && !d.unknown && len(d.nested) == nested {
		d.keepRow(i, start)
	}
}

func (d *decoder) keepRow(i, start int) {
	if d.next.spans == nil && d.seen != nil {
		d.next.spans = make([]rowSpan, 0, len(d.seen.spans)+8)
	}
	for len(d.next.spans) < i {
		d.next.spans = append(d.next.spans, rowSpan{}) // an empty span matches no row
	}
	if len(d.next.spans) == i && start <= math.MaxInt32 && d.off <= math.MaxInt32 {
		d.next.spans = append(d.next.spans, rowSpan{start: int32(start), end: int32(d.off)})
	}
}

// pathElem is one step of a path: a member name, or a list index when index >= 0. For a struct object,
// nestedStart is where its collected names begin in decoder.nested.
type pathElem struct {
	name        string
	index       int
	nestedStart int
}

// syntaxError is text that is not JSON, at byte offset off (len(data) with eof: the text ended early).
type syntaxError struct {
	off int
	eof bool
	msg string
}

// typeError is a value of the wrong kind for its field.
type typeError struct {
	path, want, found string
}

func (e *typeError) Error() string {
	if e.path == "" {
		return say.Sprintf("a worksheet must be %s, found %s", e.want, e.found)
	}
	return say.Sprintf("field %q must be %s, found %s", e.path, e.want, e.found)
}

// describe turns a syntax error into the message Decode returns.
func (e *syntaxError) describe(data []byte) error {
	if e.eof {
		return say.Errorf("not valid JSON: the text ends before the document is complete")
	}
	line, col := lineColumn(data, e.off)
	return say.Errorf("not valid JSON at line %d, column %d: %s", line, col, e.msg)
}

func (d *decoder) fail(off int, format string, args ...any) {
	panic(&syntaxError{off: off, msg: say.Sprintf(format, args...)})
}

func (d *decoder) failEOF() { panic(&syntaxError{off: len(d.data), eof: true}) }

// char describes the byte at off for a message: the character it starts, or the byte when it starts none.
func (d *decoder) char(off int) string {
	r, size := utf8.DecodeRune(d.data[off:])
	switch {
	case r == utf8.RuneError && size == 1:
		return say.Sprintf("byte 0x%02x", d.data[off])
	case r == '\uFEFF':
		return "a byte order mark (U+FEFF)"
	}
	return say.Sprintf("%q", r)
}

// document = ws value ws, the value an object (or null); it returns the worksheet and any syntax error.
func (d *decoder) document() (ws *Worksheet, err error) {
	defer func() {
		if r := recover(); r != nil {
			se, ok := r.(*syntaxError)
			if !ok {
				panic(r)
			}
			ws, err = nil, se.describe(d.data)
		}
	}()
	ws = new(Worksheet)
	d.trailing = -1
	switch d.peek() {
	case '{':
		d.worksheet(ws)
	case 'n':
		d.literal("null")
	default:
		d.wrong("a JSON object")
		d.formatErr = d.typeErr
	}
	d.skipSpace()
	if d.off < len(d.data) {
		d.trailing = d.off
	}
	return ws, nil
}

func (d *decoder) skipSpace() {
	for d.off < len(d.data) {
		switch d.data[d.off] {
		case ' ', '\t', '\n', '\r':
			d.off++
		default:
			return
		}
	}
}

// peek skips white space and returns the next byte; the text must not end there.
func (d *decoder) peek() byte {
	d.skipSpace()
	if d.off >= len(d.data) {
		d.failEOF()
	}
	return d.data[d.off]
}

// isNull reads a null if one comes next.
func (d *decoder) isNull() bool {
	if d.peek() != 'n' {
		return false
	}
	d.literal("null")
	return true
}

// literal reads the word true, false or null.
func (d *decoder) literal(word string) {
	for i := range len(word) {
		switch {
		case d.off+i >= len(d.data):
			d.failEOF()
		case d.data[d.off+i] != word[i]:
			d.fail(d.off+i, "found %s in the middle of %q", d.char(d.off+i), word)
		}
	}
	d.off += len(word)
}

// open consumes the "{" or "[" at d.off and enters it.
func (d *decoder) open() {
	if d.depth++; d.depth > maxDepth {
		d.fail(d.off, "lists and objects are nested more than %d deep", maxDepth)
	}
	d.off++
	d.path = append(d.path, pathElem{index: -1, nestedStart: len(d.nested)})
}

// more reports whether another member or element follows in the object or list that close ends, reading the
// separating "," (first: none is due) or the closing byte; after a "," a member's name must follow.
func (d *decoder) more(close byte, first bool) bool {
	c := d.peek()
	if c == close {
		d.off++
		d.depth--
		d.path = d.path[:len(d.path)-1]
		return false
	}
	if !first {
		if c != ',' {
			if close == '}' {
				d.fail(d.off, "found %s after a member of an object; expected ',' or '}'", d.char(d.off))
			}
			d.fail(d.off, "found %s after an element of a list; expected ',' or ']'", d.char(d.off))
		}
		d.off++
		c = d.peek()
	}
	if close == '}' && c != '"' {
		d.fail(d.off, "found %s where the name of a member, in double quotes, should be", d.char(d.off))
	}
	return true
}

// key reads a member's name and the ":" after it.
func (d *decoder) key() []byte {
	k := d.str()
	if d.peek() != ':' {
		d.fail(d.off, "found %s after the name %q; expected ':'", d.char(d.off), k)
	}
	d.off++
	return k
}

// skipValue reads a value of any kind and drops it.
//
//	value = object | list | string | number | "true" | "false" | "null"
func (d *decoder) skipValue() {
	switch c := d.peek(); {
	case c == '{':
		d.open()
		for first := true; d.more('}', first); first = false {
			d.key()
			d.skipValue()
		}
	case c == '[':
		d.open()
		for first := true; d.more(']', first); first = false {
			d.skipValue()
		}
	case c == '"':
		d.str()
	case c == '-' || '0' <= c && c <= '9':
		d.number()
	case c == 't':
		d.literal("true")
	case c == 'f':
		d.literal("false")
	case c == 'n':
		d.literal("null")
	default:
		d.fail(d.off, "found %s where a value should begin", d.char(d.off))
	}
}

// wrong records that the next value is not of the kind want names, and skips it.
func (d *decoder) wrong(want string) {
	if d.typeErr == nil {
		d.typeErr = &typeError{path: d.pathString(), want: want, found: d.found()}
	}
	d.skipValue()
}

// found names the kind of the next value.
func (d *decoder) found() string {
	switch d.peek() {
	case '"':
		return "text"
	case '{':
		return "an object"
	case '[':
		return "a list"
	case 't':
		return "true"
	case 'f':
		return "false"
	case 'n':
		return "null"
	}
	return "a number"
}

// wrongNumber records that the number lit does not fit its field.
func (d *decoder) wrongNumber(want string, lit []byte) {
	if d.typeErr == nil {
		d.typeErr = &typeError{path: d.pathString(), want: want, found: string(lit)}
	}
}

func (d *decoder) pathString() string {
	var b strings.Builder
	for i, e := range d.path {
		switch {
		case e.index >= 0:
			b.WriteByte('[')
			b.WriteString(strconv.Itoa(e.index))
			b.WriteByte(']')
		case e.name == "":
			// an object entered whose member is not read yet
		default:
			if i > 0 {
				b.WriteByte('.')
			}
			b.WriteString(e.name)
		}
	}
	return b.String()
}

// number reads a number and returns its text.
//
//	number = [ "-" ] ( "0" | digit1-9 { digit } ) [ "." digit { digit } ] [ ( "e" | "E" ) [ "+" | "-" ] digit { digit } ]
func (d *decoder) number() []byte {
	start := d.off
	i := d.off
	if d.data[i] == '-' {
		i++
	}
	digits := func(first bool) {
		if i >= len(d.data) {
			d.failEOF()
		}
		if c := d.data[i]; c < '0' || c > '9' {
			d.fail(i, "found %s in a number where a digit should be", d.char(i))
		}
		if first && d.data[i] == '0' {
			i++
			return
		}
		for i < len(d.data) && '0' <= d.data[i] && d.data[i] <= '9' {
			i++
		}
	}
	digits(true)
	if i < len(d.data) && d.data[i] == '.' {
		i++
		digits(false)
	}
	if i < len(d.data) && (d.data[i] == 'e' || d.data[i] == 'E') {
		i++
		if i < len(d.data) && (d.data[i] == '+' || d.data[i] == '-') {
			i++
		}
		digits(false)
	}
	d.off = i
	return d.data[start:i]
}

// str reads a string and returns its text: escapes decoded, and each byte of invalid UTF-8 and each lone
// surrogate escape as U+FFFD. The result is valid until the next string is read.
//
//	string = '"' { any character but '"', '\' and U+0000 to U+001F | escape } '"'
//	escape = '\' ( '"' | '\' | "/" | "b" | "f" | "n" | "r" | "t" | "u" hex hex hex hex )
func (d *decoder) str() []byte {
	start := d.off + 1
	for i := start; i < len(d.data); {
		c := d.data[i]
		switch {
		case c == '"':
			d.off = i + 1
			return d.data[start:i]
		case c == '\\' || c < ' ':
			return d.strEscaped(start, i)
		case c < utf8.RuneSelf:
			i++
		default:
			r, size := utf8.DecodeRune(d.data[i:])
			if r == utf8.RuneError && size == 1 {
				return d.strEscaped(start, i)
			}
			i += size
		}
	}
	d.failEOF()
	return nil
}

// strEscaped finishes a string whose text from start to i needed nothing done to it.
func (d *decoder) strEscaped(start, i int) []byte {
	b := append(d.buf[:0], d.data[start:i]...)
	for {
		if i >= len(d.data) {
			d.failEOF()
		}
		switch c := d.data[i]; {
		case c == '"':
			d.off = i + 1
			d.buf = b
			return b
		case c < ' ':
			d.fail(i, "control character %U in text; write it as an escape such as \\n or \\u%04x", c, c)
		case c == '\\':
			b, i = d.escape(b, i)
		case c < utf8.RuneSelf:
			b = append(b, c)
			i++
		default:
			r, size := utf8.DecodeRune(d.data[i:])
			b = utf8.AppendRune(b, r) // U+FFFD for a byte of invalid UTF-8
			i += size
		}
	}
}

// escape decodes the escape at i, appending it to b; it returns b and the offset after the escape.
func (d *decoder) escape(b []byte, i int) ([]byte, int) {
	if i+1 >= len(d.data) {
		d.failEOF()
	}
	switch e := d.data[i+1]; e {
	case '"', '\\', '/':
		return append(b, e), i + 2
	case 'b':
		return append(b, '\b'), i + 2
	case 'f':
		return append(b, '\f'), i + 2
	case 'n':
		return append(b, '\n'), i + 2
	case 'r':
		return append(b, '\r'), i + 2
	case 't':
		return append(b, '\t'), i + 2
	case 'u':
		r := d.hex4(i + 2)
		i += 6
		if utf16.IsSurrogate(r) {
			// A high surrogate and a low one make a pair; anything else is U+FFFD, and what follows is
			// read on its own.
			if r2, ok := d.peekHex4(i); ok {
				if pair := utf16.DecodeRune(r, r2); pair != utf8.RuneError {
					return utf8.AppendRune(b, pair), i + 6
				}
			}
			r = utf8.RuneError
		}
		return utf8.AppendRune(b, r), i
	}
	d.fail(i, "invalid escape %q in text; the escapes are \\\" \\\\ \\/ \\b \\f \\n \\r \\t and \\u followed by 4 hex digits",
		d.data[i:i+2])
	return nil, 0
}

// hex4 reads the 4 hex digits of a \u escape at i.
func (d *decoder) hex4(i int) rune {
	var r rune
	for j := i; j < i+4; j++ {
		if j >= len(d.data) {
			d.failEOF()
		}
		v, ok := hexValue(d.data[j])
		if !ok {
			d.fail(j, "found %s in a \\u escape where a hex digit should be", d.char(j))
		}
		r = r<<4 | v
	}
	return r
}

// peekHex4 decodes the \u escape at i, if there is one.
func (d *decoder) peekHex4(i int) (rune, bool) {
	if i+6 > len(d.data) || d.data[i] != '\\' || d.data[i+1] != 'u' {
		return 0, false
	}
	var r rune
	for _, c := range d.data[i+2 : i+6] {
		v, ok := hexValue(c)
		if !ok {
			return 0, false
		}
		r = r<<4 | v
	}
	return r, true
}

func hexValue(c byte) (rune, bool) {
	switch {
	case '0' <= c && c <= '9':
		return rune(c - '0'), true
	case 'a' <= c && c <= 'f':
		return rune(c - 'a' + 10), true
	case 'A' <= c && c <= 'F':
		return rune(c - 'A' + 10), true
	}
	return 0, false
}

// The document's grammar: one function per type of the format, each reading an object member by member.

// Member names of the document types, as their json tags give them.
var (
	worksheetFields   = []string{"format", "title", "notes", "conditions", "defaultConcentration", "concentrations", "compounds", "values", "nearEquilibrium", "compartments", "defaultCompartment", "bounds", "rows"}
	conditionsFields  = []string{"pH", "ionicStrength", "pMg", "temperature"}
	compoundFields    = []string{"id", "name", "formula", "charge", "species", "dfG0prime"}
	speciesFields     = []string{"dfG0", "dfH0", "charge", "nH", "nMg"}
	valueFields       = []string{"phosphate", "reducing", "po", "protonsPerATP"}
	rowFields         = []string{"id", "equation", "times", "dG0", "note"}
	compartmentFields = []string{"id", "name", "pH", "ionicStrength", "pMg", "potential"}
	boundsFields      = []string{"default", "compounds"}
)

// field returns the field of fields that the member name k names, the exact name first, then one equal
// under Unicode case folding; "" if none. exact reports an exact match.
func field(k []byte, fields []string) (name string, exact bool) {
	for _, f := range fields {
		if string(k) == f {
			return f, true
		}
	}
	for _, f := range fields {
		if strings.EqualFold(string(k), f) {
			return f, false
		}
	}
	return "", false
}

// worksheet reads the document's object into ws. Besides decoding, it notes what unknownList needs: the
// member names that are not exactly a field's name, at the top and in the objects of conditions, bounds,
// rows, compounds and compartments; for a name given twice only the last member counts.
//
//	worksheet = "{" [ member { "," member } ] "}"   with the members of Worksheet
func (d *decoder) worksheet(ws *Worksheet) {
	d.open()
	for first := true; d.more('}', first); first = false {
		k := d.key()
		name, exact := field(k, worksheetFields)
		if !exact {
			key := string(k)
			d.contribute(key, []string{key})
			d.unknown = d.unknown || name == ""
		}
		d.path[0].name = name
		d.nested = d.nested[:0]
		collect := exact
		switch name {
		case "format":
			switch d.peek() {
			case '"':
				ws.Format = string(d.str())
				f := ws.Format
				d.probe = &f
			case 'n':
				d.literal("null")
				d.probe = nil
			default:
				if d.formatErr == nil {
					d.formatErr = &typeError{path: "format", want: "text", found: d.found()}
				}
				d.wrong("text")
			}
		case "title":
			d.text(&ws.Title)
		case "notes":
			d.text(&ws.Notes)
		case "conditions":
			if d.isNull() {
				ws.Conditions = nil
				break
			}
			if ws.Conditions == nil {
				ws.Conditions = new(Conditions)
			}
			d.conditions(ws.Conditions, collect)
		case "defaultConcentration":
			d.text(&ws.DefaultConcentration)
		case "concentrations":
			decodeMap(d, &ws.Concentrations, (*decoder).text)
		case "compounds":
			decodeList(d, &ws.Compounds, func(d *decoder, c *Compound) { d.compound(c, collect) })
		case "values":
			decodeMap(d, &ws.Values, (*decoder).value)
		case "nearEquilibrium":
			d.floatPtr(&ws.NearEquilibrium)
		case "compartments":
			decodeList(d, &ws.Compartments, func(d *decoder, c *Compartment) { d.compartment(c, collect) })
		case "defaultCompartment":
			d.text(&ws.DefaultCompartment)
		case "bounds":
			if d.isNull() {
				ws.Bounds = nil
				break
			}
			if ws.Bounds == nil {
				ws.Bounds = new(Bounds)
			}
			d.bounds(ws.Bounds, collect)
		case "rows":
			d.rowLists++
			if ws.Rows == nil && d.seen != nil {
				ws.Rows = make([]Row, 0, len(d.seen.rows)+8) // the room the list will likely take
			}
			decodeList(d, &ws.Rows, func(d *decoder, r *Row) { d.rowOrSeen(r, collect) })
		default:
			d.skipValue()
		}
		if exact {
			d.contribute(name, d.nested)
		}
	}
}

// contribute sets the unknown names the top-level member key contributes (see unknownList).
func (d *decoder) contribute(key string, names []string) {
	if len(names) == 0 {
		if d.unknowns != nil {
			delete(d.unknowns, key)
		}
		return
	}
	if d.unknowns == nil {
		d.unknowns = make(map[string][]string)
	}
	d.unknowns[key] = append([]string(nil), names...)
}

// unknownList lists, sorted, the paths of the member names that are not exactly a field's name, as the
// document reader has always listed them: at the top, and in the objects of "conditions", "bounds" and the
// lists "rows", "compounds" and "compartments" written with those exact names. Members matched
// case-insensitively ("PH") are read and also listed.
func (d *decoder) unknownList() []string {
	var out []string
	for _, names := range d.unknowns {
		out = append(out, names...)
	}
	slices.Sort(out)
	return out
}

// begin reads the "{" of a struct's object; false when there is none (null, or a value of another kind,
// recorded as wrong).
func (d *decoder) begin() bool {
	switch d.peek() {
	case '{':
		d.open()
		return true
	case 'n':
		d.literal("null")
	default:
		d.wrong("an object")
	}
	return false
}

// object reads a struct's object, calling set for each member with the field among fields it names, ""
// for none (set must then skip the value); see member for collect.
func (d *decoder) object(fields []string, collect bool, set func(name string)) {
	if !d.begin() {
		return
	}
	for first := true; d.more('}', first); first = false {
		set(d.member(fields, collect))
	}
}

// member reads the name of an object's member and the ":" and returns the field it names among fields, ""
// for none; with collect, a name that is not exactly a field's is collected for unknownList.
func (d *decoder) member(fields []string, collect bool) string {
	k := d.key()
	name, exact := field(k, fields)
	d.unknown = d.unknown || name == ""
	top := &d.path[len(d.path)-1]
	if collect && !exact {
		top.name = ""
		path := d.pathString() + "." + string(k)
		if !slices.Contains(d.nested[top.nestedStart:], path) {
			d.nested = append(d.nested, path)
		}
	}
	top.name = name
	return name
}

// conditions = "{" [ member { "," member } ] "}"   with the members of Conditions
func (d *decoder) conditions(c *Conditions, collect bool) {
	d.object(conditionsFields, collect, func(name string) {
		switch name {
		case "pH":
			d.floatPtr(&c.PH)
		case "ionicStrength":
			d.floatPtr(&c.IonicStrength)
		case "pMg":
			d.floatPtr(&c.PMg)
		case "temperature":
			d.floatPtr(&c.Temperature)
		default:
			d.skipValue()
		}
	})
}

// compound = "{" [ member { "," member } ] "}"   with the members of Compound
func (d *decoder) compound(c *Compound, collect bool) {
	d.object(compoundFields, collect, func(name string) {
		switch name {
		case "id":
			d.text(&c.ID)
		case "name":
			d.text(&c.Name)
		case "formula":
			d.text(&c.Formula)
		case "charge":
			d.intPtr(&c.Charge)
		case "species":
			decodeList(d, &c.Species, (*decoder).species)
		case "dfG0prime":
			d.floatPtr(&c.DfG0Prime)
		default:
			d.skipValue()
		}
	})
}

// species = "{" [ member { "," member } ] "}"   with the members of thermo.Species
func (d *decoder) species(s *thermo.Species) {
	d.object(speciesFields, false, func(name string) {
		switch name {
		case "dfG0":
			d.float(&s.DfG0)
		case "dfH0":
			d.floatPtr(&s.DfH0)
		case "charge":
			d.int(&s.Charge)
		case "nH":
			d.int(&s.NH)
		case "nMg":
			d.int(&s.NMg)
		default:
			d.skipValue()
		}
	})
}

// value = "{" [ member { "," member } ] "}"   with the members of Value
func (d *decoder) value(v *Value) {
	d.object(valueFields, false, func(name string) {
		switch name {
		case "phosphate":
			d.floatPtr(&v.Phosphate)
		case "reducing":
			d.floatPtr(&v.Reducing)
		case "po":
			d.floatPtr(&v.PO)
		case "protonsPerATP":
			d.floatPtr(&v.ProtonsPerATP)
		default:
			d.skipValue()
		}
	})
}

// row = "{" [ member { "," member } ] "}"   with the members of Row
func (d *decoder) row(r *Row, collect bool) {
	d.object(rowFields, collect, func(name string) {
		switch name {
		case "id":
			d.text(&r.ID)
		case "equation":
			d.text(&r.Equation)
		case "times":
			d.floatPtr(&r.Times)
		case "dG0":
			d.floatPtr(&r.DG0)
		case "note":
			d.text(&r.Note)
		default:
			d.skipValue()
		}
	})
}

// compartment = "{" [ member { "," member } ] "}"   with the members of Compartment
func (d *decoder) compartment(c *Compartment, collect bool) {
	d.object(compartmentFields, collect, func(name string) {
		switch name {
		case "id":
			d.text(&c.ID)
		case "name":
			d.text(&c.Name)
		case "pH":
			d.floatPtr(&c.PH)
		case "ionicStrength":
			d.floatPtr(&c.IonicStrength)
		case "pMg":
			d.floatPtr(&c.PMg)
		case "potential":
			d.floatPtr(&c.Potential)
		default:
			d.skipValue()
		}
	})
}

// bounds = "{" [ member { "," member } ] "}"   with the members of Bounds
func (d *decoder) bounds(b *Bounds, collect bool) {
	d.object(boundsFields, collect, func(name string) {
		switch name {
		case "default":
			decodeList(d, &b.Default, (*decoder).text)
		case "compounds":
			decodeMap(d, &b.Compounds, func(d *decoder, pair *[]string) { decodeList(d, pair, (*decoder).text) })
		default:
			d.skipValue()
		}
	})
}

// decodeList reads a list into *dst as encoding/json does: the elements already in the slice, and those
// between its length and capacity, are decoded into rather than replaced (a repeated member merges into
// what the earlier one left), the slice grows as append grows it, and [] makes an empty, non-nil slice.
//
//	list = "[" [ value { "," value } ] "]"
func decodeList[T any](d *decoder, dst *[]T, elem func(*decoder, *T)) {
	switch d.peek() {
	case '[':
	case 'n':
		d.literal("null")
		*dst = nil
		return
	default:
		d.wrong("a list")
		return
	}
	d.open()
	s := *dst
	i := 0
	for first := true; d.more(']', first); first = false {
		switch {
		case i >= cap(s):
			var zero T
			s = append(s, zero)
		case i >= len(s):
			s = s[:i+1]
		}
		d.path[len(d.path)-1].index = i
		elem(d, &s[i])
		i++
	}
	switch {
	case i == 0:
		s = make([]T, 0)
	case i < len(s):
		s = s[:i]
	}
	*dst = s
}

// decodeMap reads an object with names of the caller's choosing into the map *dst, adding to the map
// already there; each entry's value is decoded from its zero value.
func decodeMap[V any](d *decoder, dst *map[string]V, elem func(*decoder, *V)) {
	switch d.peek() {
	case '{':
	case 'n':
		d.literal("null")
		*dst = nil
		return
	default:
		d.wrong("an object")
		return
	}
	d.open()
	if *dst == nil {
		*dst = make(map[string]V)
	}
	for first := true; d.more('}', first); first = false {
		k := string(d.key())
		d.path[len(d.path)-1].name = k
		var v V
		elem(d, &v)
		(*dst)[k] = v
	}
}

// text = string | "null"   (null leaves the text as it is)
func (d *decoder) text(dst *string) {
	switch d.peek() {
	case '"':
		*dst = string(d.str())
	case 'n':
		d.literal("null")
	default:
		d.wrong("text")
	}
}

func isNumberStart(c byte) bool { return c == '-' || '0' <= c && c <= '9' }

// float = number | "null"   (null leaves the number as it is); the number must be within float64's range.
func (d *decoder) float(dst *float64) {
	switch c := d.peek(); {
	case isNumberStart(c):
		lit := d.number()
		f, err := strconv.ParseFloat(string(lit), 64)
		if err != nil {
			d.wrongNumber("a number between -1.8e308 and 1.8e308", lit)
			return
		}
		*dst = f
	case c == 'n':
		d.literal("null")
	default:
		d.wrong("a number")
	}
}

// floatPtr = number | "null"   (null clears the pointer)
func (d *decoder) floatPtr(dst **float64) {
	if d.isNull() {
		*dst = nil
		return
	}
	if *dst == nil {
		*dst = new(float64)
	}
	d.float(*dst)
}

// int = number | "null"   (null leaves the number as it is); the number must be a whole one written without
// fraction or exponent, within int's range.
func (d *decoder) int(dst *int) {
	switch c := d.peek(); {
	case isNumberStart(c):
		lit := d.number()
		n, err := strconv.ParseInt(string(lit), 10, 64)
		if err != nil || int64(int(n)) != n {
			d.wrongNumber("a whole number (no fraction or exponent)", lit)
			return
		}
		*dst = int(n)
	case c == 'n':
		d.literal("null")
	default:
		d.wrong("a whole number")
	}
}

// intPtr = number | "null"   (null clears the pointer)
func (d *decoder) intPtr(dst **int) {
	if d.isNull() {
		*dst = nil
		return
	}
	if *dst == nil {
		*dst = new(int)
	}
	d.int(*dst)
}
