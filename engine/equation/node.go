package equation

import "strings"

// A Term is one compound of a side with its coefficient, as in
// "2 pyruvate[m]".
type Term struct {
	Coef        Rat    // positive for parsed terms
	Name        string // without the tag, trimmed, inner white space as written
	Compartment string // "m" for "pyruvate[m]"; "" when untagged
	Pos         Pos    // start of the term (its coefficient, if any)
	NamePos     Pos    // start of the name
	NameEnd     Pos    // end of the name, before any white space or tag
}

// String returns the normal form of t: the coefficient unless it is 1, the
// name with white space collapsed to single spaces, and the tag, as in
// "2 pyruvate[m]".
func (t Term) String() string {
	var b strings.Builder
	t.write(&b)
	return b.String()
}

func (t Term) write(b *strings.Builder) {
	if c := t.Coef.norm(); c.Num != 1 || c.Den != 1 {
		b.WriteString(c.String())
		b.WriteByte(' ')
	}
	b.WriteString(t.compound())
}

// compound returns the normal form of the name and tag, without coefficient.
func (t Term) compound() string {
	name := collapse(t.Name)
	if t.Compartment == "" {
		return name
	}
	return name + "[" + collapse(t.Compartment) + "]"
}

// An Equation is a parsed reaction equation.
type Equation struct {
	Left, Right []Term
	Arrow       string // the arrow as written: "=", "<=>", "⇌", "->" or "→"
	ArrowPos    Pos
}

// String returns the normal form of e: terms joined by " + " and the sides
// by " = " whatever arrow was written, as in "A + 2 B = C + D". Parsing the
// normal form gives an equation with the same normal form.
func (e *Equation) String() string {
	var b strings.Builder
	writeSide(&b, e.Left)
	b.WriteString(" = ")
	writeSide(&b, e.Right)
	return b.String()
}

func writeSide(b *strings.Builder, terms []Term) {
	for i, t := range terms {
		if i > 0 {
			b.WriteString(" + ")
		}
		t.write(b)
	}
}
