package engine

import (
	"strconv"
	"strings"
	"unicode/utf16"
	"unicode/utf8"

	"gibbsheet/engine/internal/say"
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
