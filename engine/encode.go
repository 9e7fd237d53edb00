package engine

import (
	"math"
	"slices"
	"strconv"
	"unicode/utf8"
)

// This file writes the result document without reflection. Every appendJSON method writes its type's
// fields in declaration order, with the names and omitempty rules of the struct tags, so that the output
// is byte for byte what json.Marshal writes; encode_test.go compares the two and checks that no field of
// the Result types is left out.

// AppendJSON appends the result document, encoded as JSON, to dst and returns the extended buffer. The bytes
// are exactly those of json.Marshal(r): fields in declaration order, nil pointers, slices and maps as null,
// map keys sorted, numbers as encoding/json formats them and strings escaped as it escapes them (including
// <, >, &, U+2028 and U+2029, and invalid UTF-8 as U+FFFD).
//
// AppendJSON panics with an error that reads as json.Marshal's, where json.Marshal would fail, if a number is NaN or
// infinite: the engine never puts one in a result, so one there is a programming error.
func (r *Result) AppendJSON(dst []byte) []byte {
	if r == nil {
		return append(dst, "null"...)
	}
	size := sizeGuessBase + sizeGuessRow*len(r.Rows) + sizeGuessCompound*len(r.Compounds)
	if r.rowJSON != nil {
		// The rows' encodings, and the MDF's where a Session kept it, are there to measure.
		size = sizeGuessBase + sizeGuessMDFRow*len(r.rowJSON) + sizeGuessCompound*len(r.Compounds)
		if r.MDF != nil && r.MDF.json != nil {
			size += len(r.MDF.json) - sizeGuessMDFRow*len(r.rowJSON)
		}
		for _, enc := range r.rowJSON {
			size += len(enc) + 1
		}
		for i := range r.Compounds {
			size += 8 * len(r.Compounds[i].Rows)
		}
	}
	dst = slices.Grow(dst, size)
	dst = append(dst, `{"rows":`...)
	dst = r.appendRows(dst)
	return r.appendAfterRows(dst, true)
}

// appendAfterRows writes the members that follow "rows" and closes the document; withMDF includes "mdf".
func (r *Result) appendAfterRows(dst []byte, withMDF bool) []byte {
	dst = append(dst, `,"total":`...)
	dst = r.Total.appendJSON(dst)
	dst = append(dst, `,"compounds":`...)
	if r.useHeads != nil && len(r.useHeads) == len(r.Compounds) {
		dst = append(dst, '[')
		for i := range r.Compounds {
			if i > 0 {
				dst = append(dst, ',')
			}
			dst = r.Compounds[i].appendJSONRows(append(dst, r.useHeads[i]...))
		}
		dst = append(dst, ']')
	} else {
		dst = appendJSONSlice(dst, r.Compounds, (*CompoundUse).appendJSON)
	}
	dst = append(dst, `,"values":`...)
	dst = appendJSONValues(dst, r.Values)
	dst = append(dst, `,"conditions":`...)
	dst = r.Conditions.appendJSON(dst)
	dst = append(dst, `,"warnings":`...)
	dst = appendJSONSlice(dst, r.Warnings, (*Warning).appendJSON)
	if len(r.Errors) > 0 {
		dst = append(dst, `,"errors":`...)
		dst = appendJSONSlice(dst, r.Errors, (*FieldError).appendJSON)
	}
	if withMDF {
		dst = append(dst, `,"mdf":`...)
		if r.MDF == nil {
			dst = append(dst, "null"...)
		} else {
			dst = r.MDF.appendJSON(dst)
		}
	}
	return append(dst, '}')
}

// appendRows writes the rows, from the encodings made during evaluation where there are any (a Session's
// results hold only those).
func (r *Result) appendRows(dst []byte) []byte {
	if r.rowJSON == nil || len(r.Rows) != 0 && len(r.rowJSON) != len(r.Rows) {
		return appendJSONSlice(dst, r.Rows, (*RowResult).appendJSON)
	}
	dst = append(dst, '[')
	for i, enc := range r.rowJSON {
		if i > 0 {
			dst = append(dst, ',')
		}
		dst = append(dst, enc...)
	}
	return append(dst, ']')
}

// The room AppendJSON makes beforehand, in bytes: a little more than the golden and benchmark worksheets
// take (a computed row about 1 KB with its MDF entries, a compound about 250 bytes), so that one
// allocation usually holds the whole document.
const (
	sizeGuessBase     = 2048
	sizeGuessRow      = 1152
	sizeGuessCompound = 256
	sizeGuessMDFRow   = 128 // a row's entry in the MDF
)

func (r *RowResult) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"id":`...)
	dst = appendJSONString(dst, r.ID)
	dst = append(dst, `,"equation":`...)
	dst = appendJSONString(dst, r.Equation)
	dst = append(dst, `,"times":`...)
	dst = appendJSONFloat(dst, r.Times)
	dst = append(dst, `,"dG0":`...)
	dst = appendJSONFloatPtr(dst, r.DG0)
	dst = append(dst, `,"dG":`...)
	dst = appendJSONFloatPtr(dst, r.DG)
	dst = append(dst, `,"K":`...)
	dst = appendJSONFloatPtr(dst, r.K)
	dst = append(dst, `,"Q":`...)
	dst = appendJSONFloatPtr(dst, r.Q)
	dst = append(dst, `,"log10K":`...)
	dst = appendJSONFloatPtr(dst, r.Log10K)
	dst = append(dst, `,"log10Q":`...)
	dst = appendJSONFloatPtr(dst, r.Log10Q)
	dst = append(dst, `,"status":`...)
	dst = appendJSONString(dst, r.Status)
	dst = append(dst, `,"cost":`...)
	if r.Cost == nil {
		dst = append(dst, "null"...)
	} else {
		dst = r.Cost.appendJSON(dst)
	}
	dst = append(dst, `,"warnings":`...)
	dst = appendJSONSlice(dst, r.Warnings, (*Warning).appendJSON)
	if r.Transport != nil {
		dst = append(dst, `,"transport":{"moves":`...)
		dst = appendJSONSlice(dst, r.Transport.Moves, (*Move).appendJSON)
		dst = append(dst, `,"work":`...)
		dst = appendJSONFloat(dst, r.Transport.Work)
		dst = append(dst, '}')
	}
	if f := r.FluxForce; f != nil {
		dst = append(dst, `,"fluxForce":{"ratio":`...)
		dst = appendJSONFloatPtr(dst, f.Ratio)
		dst = append(dst, `,"log10Ratio":`...)
		dst = appendJSONFloat(dst, f.Log10Ratio)
		dst = append(dst, `,"reverseShare":`...)
		dst = appendJSONFloat(dst, f.ReverseShare)
		dst = append(dst, '}')
	}
	if m := r.Remedy; m != nil {
		dst = append(dst, `,"toDownhill":{"compound":`...)
		dst = appendJSONString(dst, m.Compound)
		dst = append(dst, `,"from":`...)
		dst = appendJSONFloat(dst, m.From)
		dst = append(dst, `,"to":`...)
		dst = appendJSONFloat(dst, m.To)
		dst = append(dst, `,"factor":`...)
		dst = appendJSONFloat(dst, m.Factor)
		dst = append(dst, '}')
	}
	if r.Error != nil {
		dst = append(dst, `,"error":`...)
		dst = r.Error.appendJSON(dst)
	}
	if len(r.Errors) > 0 {
		dst = append(dst, `,"errors":`...)
		dst = appendJSONSlice(dst, r.Errors, (*RowError).appendJSON)
	}
	return append(dst, '}')
}

func (m *Move) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"compound":`...)
	dst = appendJSONString(dst, m.Compound)
	dst = append(dst, `,"from":`...)
	dst = appendJSONString(dst, m.From)
	dst = append(dst, `,"to":`...)
	dst = appendJSONString(dst, m.To)
	dst = append(dst, `,"amount":`...)
	dst = appendJSONFloat(dst, m.Amount)
	dst = append(dst, `,"work":`...)
	dst = appendJSONFloat(dst, m.Work)
	return append(dst, '}')
}

func (c *Cost) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"phosphate":`...)
	dst = appendJSONFloat(dst, c.Phosphate)
	dst = append(dst, `,"reducing":`...)
	dst = appendJSONFloat(dst, c.Reducing)
	dst = append(dst, `,"protons":`...)
	dst = appendJSONFloat(dst, c.Protons)
	dst = append(dst, `,"protonATP":`...)
	dst = appendJSONFloat(dst, c.ProtonATP)
	dst = append(dst, `,"total":`...)
	dst = appendJSONFloat(dst, c.Total)
	return append(dst, '}')
}

func (e *RowError) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"message":`...)
	dst = appendJSONString(dst, e.Message)
	dst = append(dst, `,"column":`...)
	dst = strconv.AppendInt(dst, int64(e.Column), 10)
	dst = append(dst, `,"length":`...)
	dst = strconv.AppendInt(dst, int64(e.Length), 10)
	if len(e.Suggestions) > 0 {
		dst = append(dst, `,"suggestions":`...)
		dst = appendJSONSlice(dst, e.Suggestions, appendJSONStringAt)
	}
	return append(dst, '}')
}

func (w *Warning) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"code":`...)
	dst = appendJSONString(dst, w.Code)
	dst = append(dst, `,"message":`...)
	dst = appendJSONString(dst, w.Message)
	if w.Path != "" {
		dst = append(dst, `,"path":`...)
		dst = appendJSONString(dst, w.Path)
	}
	return append(dst, '}')
}

func (e *FieldError) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"path":`...)
	dst = appendJSONString(dst, e.Path)
	dst = append(dst, `,"message":`...)
	dst = appendJSONString(dst, e.Message)
	return append(dst, '}')
}

func (t *Total) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"equation":`...)
	dst = appendJSONString(dst, t.Equation)
	dst = append(dst, `,"dG0":`...)
	dst = appendJSONFloatPtr(dst, t.DG0)
	dst = append(dst, `,"dG":`...)
	dst = appendJSONFloatPtr(dst, t.DG)
	dst = append(dst, `,"cost":`...)
	dst = t.Cost.appendJSON(dst)
	return append(dst, '}')
}

func (c *CompoundUse) appendJSON(dst []byte) []byte {
	return c.appendJSONRows(c.appendJSONHead(dst))
}

// appendJSONHead writes the compound's object up to its "rows" member, which ends it (appendJSONRows);
// a Session keeps the head of each compound of its worksheet's context.
func (c *CompoundUse) appendJSONHead(dst []byte) []byte {
	dst = append(dst, `{"id":`...)
	dst = appendJSONString(dst, c.ID)
	dst = append(dst, `,"compartment":`...)
	dst = appendJSONString(dst, c.Compartment)
	dst = append(dst, `,"name":`...)
	dst = appendJSONString(dst, c.Name)
	dst = append(dst, `,"library":`...)
	dst = appendJSONString(dst, c.Library)
	dst = append(dst, `,"own":`...)
	dst = strconv.AppendBool(dst, c.Own)
	dst = append(dst, `,"concentration":`...)
	dst = appendJSONFloatPtr(dst, c.Concentration)
	dst = append(dst, `,"text":`...)
	dst = appendJSONString(dst, c.Text)
	dst = append(dst, `,"atDefault":`...)
	dst = strconv.AppendBool(dst, c.AtDefault)
	if c.Fixed != "" {
		dst = append(dst, `,"fixed":`...)
		dst = appendJSONString(dst, c.Fixed)
	}
	dst = append(dst, `,"dfG0prime":`...)
	dst = appendJSONFloatPtr(dst, c.DfG0Prime)
	if c.Approximation != "" {
		dst = append(dst, `,"approximation":`...)
		dst = appendJSONString(dst, c.Approximation)
	}
	return append(dst, `,"rows":`...)
}

func (c *CompoundUse) appendJSONRows(dst []byte) []byte {
	dst = appendJSONSlice(dst, c.Rows, appendJSONStringAt)
	return append(dst, '}')
}

// appendJSONValues writes the map with its keys in the order encoding/json sorts them (by bytes).
func appendJSONValues(dst []byte, m map[string]ValueUsed) []byte {
	if m == nil {
		return append(dst, "null"...)
	}
	var room [32]string
	keys := room[:0]
	for k := range m {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	dst = append(dst, '{')
	for i, k := range keys {
		if i > 0 {
			dst = append(dst, ',')
		}
		dst = appendJSONString(dst, k)
		dst = append(dst, ':')
		v := m[k]
		dst = v.appendJSON(dst)
	}
	return append(dst, '}')
}

func (v *ValueUsed) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"phosphate":`...)
	dst = appendJSONFloat(dst, v.Phosphate)
	dst = append(dst, `,"reducing":`...)
	dst = appendJSONFloat(dst, v.Reducing)
	dst = append(dst, `,"po":`...)
	dst = appendJSONFloat(dst, v.PO)
	if v.ProtonsPerATP != 0 {
		dst = append(dst, `,"protonsPerATP":`...)
		dst = appendJSONFloat(dst, v.ProtonsPerATP)
	}
	return append(dst, '}')
}

func (c *ConditionsUsed) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"pH":`...)
	dst = appendJSONFloat(dst, c.PH)
	dst = append(dst, `,"ionicStrength":`...)
	dst = appendJSONFloat(dst, c.IonicStrength)
	dst = append(dst, `,"pMg":`...)
	dst = appendJSONFloatPtr(dst, c.PMg)
	dst = append(dst, `,"temperature":`...)
	dst = appendJSONFloat(dst, c.Temperature)
	dst = append(dst, `,"RT":`...)
	dst = appendJSONFloat(dst, c.RT)
	dst = append(dst, `,"nearEquilibrium":`...)
	dst = appendJSONFloat(dst, c.NearEquilibrium)
	return append(dst, '}')
}

// appendJSON writes the MDF without Solver, which stays out of the document (json:"-"), or copies its
// encoding where a Session kept one.
func (m *MDF) appendJSON(dst []byte) []byte {
	if m.json != nil {
		return append(dst, m.json...)
	}
	return m.appendJSONRows(dst, (*MDFRow).appendJSON)
}

// appendJSONRows is appendJSON with the rows written by appendRow, in order.
func (m *MDF) appendJSONRows(dst []byte, appendRow func(*MDFRow, []byte) []byte) []byte {
	dst = append(dst, `{"drivingForce":`...)
	dst = appendJSONFloat(dst, m.DrivingForce)
	dst = append(dst, `,"bottlenecks":`...)
	dst = appendJSONSlice(dst, m.Bottlenecks, appendJSONStringAt)
	dst = append(dst, `,"concentrations":`...)
	dst = appendJSONSlice(dst, m.Concentrations, (*OptimalConc).appendJSON)
	dst = append(dst, `,"rows":`...)
	dst = appendJSONSlice(dst, m.Rows, appendRow)
	dst = append(dst, `,"binding":`...)
	dst = appendJSONSlice(dst, m.Binding, (*BindingBound).appendJSON)
	dst = append(dst, `,"leftOut":`...)
	dst = appendJSONSlice(dst, m.LeftOut, appendJSONStringAt)
	dst = append(dst, `,"message":`...)
	dst = appendJSONString(dst, m.Message)
	return append(dst, '}')
}

func (c *OptimalConc) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"compound":`...)
	dst = appendJSONString(dst, c.Compound)
	dst = append(dst, `,"concentration":`...)
	dst = appendJSONFloat(dst, c.Concentration)
	dst = append(dst, `,"entered":`...)
	dst = appendJSONFloat(dst, c.Entered)
	dst = append(dst, `,"low":`...)
	dst = appendJSONFloat(dst, c.Low)
	dst = append(dst, `,"high":`...)
	dst = appendJSONFloat(dst, c.High)
	return append(dst, '}')
}

func (r *MDFRow) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"id":`...)
	dst = appendJSONString(dst, r.ID)
	dst = append(dst, `,"drivingForce":`...)
	dst = appendJSONFloat(dst, r.DrivingForce)
	dst = append(dst, `,"shadow":`...)
	dst = appendJSONFloat(dst, r.Shadow)
	dst = append(dst, `,"bottleneck":`...)
	dst = strconv.AppendBool(dst, r.Bottleneck)
	return append(dst, '}')
}

func (b *BindingBound) appendJSON(dst []byte) []byte {
	dst = append(dst, `{"compound":`...)
	dst = appendJSONString(dst, b.Compound)
	dst = append(dst, `,"side":`...)
	dst = appendJSONString(dst, b.Side)
	dst = append(dst, `,"bound":`...)
	dst = appendJSONFloat(dst, b.Bound)
	return append(dst, '}')
}

// appendJSONSlice writes s as an array of its elements written by appendElem, or null if s is nil.
func appendJSONSlice[T any](dst []byte, s []T, appendElem func(*T, []byte) []byte) []byte {
	if s == nil {
		return append(dst, "null"...)
	}
	dst = append(dst, '[')
	for i := range s {
		if i > 0 {
			dst = append(dst, ',')
		}
		dst = appendElem(&s[i], dst)
	}
	return append(dst, ']')
}

func appendJSONFloatPtr(dst []byte, f *float64) []byte {
	if f == nil {
		return append(dst, "null"...)
	}
	return appendJSONFloat(dst, *f)
}

// unsupportedValue is the error AppendJSON panics with on a number JSON cannot hold; its text is
// json.Marshal's for the same value.
type unsupportedValue string

func (v unsupportedValue) Error() string { return "json: unsupported value: " + string(v) }

// appendJSONFloat writes f as encoding/json does, the shortest decimal that reads back as f, like
// JavaScript's Number.prototype.toString: exponent form below 1e-6 and from 1e21 on in magnitude, with
// the exponent not padded ("1e-7", "1e+21"). It panics on NaN and infinities (see Result.AppendJSON).
func appendJSONFloat(dst []byte, f float64) []byte {
	if math.IsInf(f, 0) || math.IsNaN(f) {
		panic(unsupportedValue(strconv.FormatFloat(f, 'g', -1, 64)))
	}
	if i := int64(f); float64(i) == f && i > -exactIntegers && i < exactIntegers && (i != 0 || !math.Signbit(f)) {
		return strconv.AppendInt(dst, i, 10) // the same digits, faster
	}
	format := byte('f')
	if abs := math.Abs(f); abs != 0 && (abs < 1e-6 || abs >= 1e21) {
		format = 'e'
	}
	dst = strconv.AppendFloat(dst, f, format, -1, 64)
	if n := len(dst); format == 'e' && dst[n-4] == 'e' && dst[n-3] == '-' && dst[n-2] == '0' {
		dst[n-2] = dst[n-1] // e-07 to e-7
		dst = dst[:n-1]
	}
	return dst
}

// exactIntegers bounds the whole numbers that appendJSONFloat writes as integers: below 2⁵³ every whole
// number is a float64 and its shortest decimal form is its digits, as strconv.AppendFloat writes them.
const exactIntegers = 1e15

func appendJSONStringAt(s *string, dst []byte) []byte { return appendJSONString(dst, *s) }

// appendJSONString writes s as a JSON string escaped as encoding/json escapes it by default: quote,
// backslash and the control characters, also <, > and & (HTML-safe), U+2028 and U+2029, and each byte of
// invalid UTF-8 as \ufffd.
func appendJSONString(dst []byte, s string) []byte {
	const hex = "0123456789abcdef"
	dst = append(dst, '"')
	start := 0
	for i := plainRun(s, 0); i < len(s); {
		b := s[i]
		if b < utf8.RuneSelf {
			if jsonSafe[b] {
				if i++; i&7 == 0 { // back to whole words
					i = plainRun(s, i)
				}
				continue
			}
			dst = append(dst, s[start:i]...)
			switch b {
			case '\\', '"':
				dst = append(dst, '\\', b)
			case '\b':
				dst = append(dst, '\\', 'b')
			case '\f':
				dst = append(dst, '\\', 'f')
			case '\n':
				dst = append(dst, '\\', 'n')
			case '\r':
				dst = append(dst, '\\', 'r')
			case '\t':
				dst = append(dst, '\\', 't')
			default:
				dst = append(dst, '\\', 'u', '0', '0', hex[b>>4], hex[b&0xF])
			}
			i++
			start = i
			continue
		}
		c, size := utf8.DecodeRuneInString(s[i:])
		switch {
		case c == utf8.RuneError && size == 1:
			dst = append(dst, s[start:i]...)
			dst = append(dst, `\ufffd`...)
		case c == '\u2028' || c == '\u2029':
			dst = append(dst, s[start:i]...)
			dst = append(dst, '\\', 'u', '2', '0', '2', hex[c&0xF])
		default:
			i = plainRun(s, i+size)
			continue
		}
		i += size
		start = i
	}
	dst = append(dst, s[start:]...)
	return append(dst, '"')
}

// jsonSafe marks the ASCII bytes that appendJSONString copies as they are.
var jsonSafe = func() (safe [utf8.RuneSelf]bool) {
	for b := range safe {
		safe[b] = b >= ' ' && b != '"' && b != '\\' && b != '<' && b != '>' && b != '&'
	}
	return safe
}()

// plainRun returns the index of the first 8-byte word of s, from i on, that is not all ASCII copied as
// it is: with none of its bytes below 0x20, at or above 0x80, or one of " & < > \\. It tests 8 bytes at
// once as one uint64; the tests for a zero or a small byte are exact as "any byte" tests, and setting one
// bit makes one test cover two characters: 0x22 " and 0x26 & with 0x04, 0x3c < and 0x3e > with 0x02.
func plainRun(s string, i int) int {
	const ones, highs = 0x0101010101010101, 0x8080808080808080
	for ; i+8 <= len(s); i += 8 {
		w := s[i : i+8]
		x := uint64(w[0]) | uint64(w[1])<<8 | uint64(w[2])<<16 | uint64(w[3])<<24 |
			uint64(w[4])<<32 | uint64(w[5])<<40 | uint64(w[6])<<48 | uint64(w[7])<<56
		quoteAmp := x | 0x04*ones ^ '&'*ones
		angle := x | 0x02*ones ^ '>'*ones
		backslash := x ^ '\\'*ones
		bad := x | (x-' '*ones)&^x // a byte at or above 0x80 or below 0x20
		bad |= (quoteAmp-ones)&^quoteAmp | (angle-ones)&^angle | (backslash-ones)&^backslash
		if bad&highs != 0 {
			break
		}
	}
	return i
}
