package engine

import (
	"math"
	"slices"
	"strconv"
	"strings"

	"gibbsheet/engine/thermo"
)

// This file reads the worksheet's own values with the scanner of decode.go: one function per document
// type, each with its grammar rule, and the rows a Session saw before.

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
