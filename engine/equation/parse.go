package equation

import (
	"strings"
	"unicode"
	"unicode/utf8"

	"gibbsheet/engine/internal/say"
)

// parser holds the text and the errors found so far.
type parser struct {
	src  string
	errs ErrorList
}

// Parse parses a reaction equation such as "ATP + H2O = ADP + Pi".
// It never panics. When the text has errors it returns a nil equation and an
// ErrorList, sorted by position, with every error of the text.
func Parse(src string) (*Equation, error) {
	p := &parser{src: src}
	e := p.parseEquation()
	if len(p.errs) > 0 {
		p.errs.Sort()
		return nil, p.errs
	}
	return e, nil
}

// parseEquation parses
//
//	equation: side arrow side
//	arrow:    "=" | "<=>" | "⇌" | "->" | "→"
func (p *parser) parseEquation() *Equation {
	arrows := p.scan()
	start, end := p.trim(0, Pos(len(p.src)))
	if start == end {
		p.errs.add(0, Pos(len(p.src)), `empty equation: write a reaction such as "A + B = C"`)
		return nil
	}
	for _, a := range arrows {
		if !a.known {
			p.errs = append(p.errs, &Error{Pos: a.pos, End: a.end,
				Msg:     say.Sprintf(`%q is not an arrow: write one of "=", "<=>", "⇌", "->" or "→"`, a.text),
				Suggest: append([]string(nil), knownArrows...)})
		}
	}
	if len(arrows) == 0 {
		p.errs.add(start, end, `missing arrow: write "=" between the two sides`)
		p.parseSide(0, Pos(len(p.src)), "in the equation")
		return nil
	}
	for i, a := range arrows[1:] {
		p.errs.add(a.pos, a.end, "%s arrow %q: an equation has one arrow", ordinal(i+2), a.text)
	}
	a := arrows[0]
	e := &Equation{Arrow: a.text, ArrowPos: a.pos}
	// Sides are the texts between arrows; text beyond a second arrow is
	// checked too, so that all its errors are reported at once.
	rightEnd := Pos(len(p.src))
	if len(arrows) > 1 {
		rightEnd = arrows[1].pos
	}
	if s, t := p.trim(0, a.pos); s == t && len(arrows) == 1 {
		p.errs.add(a.pos, a.end, "empty left side: write the substrates before %q", a.text)
	}
	if s, t := p.trim(a.end, rightEnd); s == t && len(arrows) == 1 {
		p.errs.add(a.pos, a.end, "empty right side: write the products after %q", a.text)
	}
	e.Left = p.parseSide(0, a.pos, "on the left side")
	e.Right = p.parseSide(a.end, rightEnd, "on the right side")
	for i, b := range arrows[1:] {
		end := Pos(len(p.src))
		if i+2 < len(arrows) {
			end = arrows[i+2].pos
		}
		p.parseSide(b.end, end, "")
	}
	return e
}

func ordinal(n int) string {
	if words := []string{"", "", "second", "third", "fourth", "fifth"}; n < len(words) {
		return words[n]
	}
	return "another"
}

// parseSide parses the side in [pos, end) and checks that no compound
// appears twice on it; label places the side in messages, as in "on the
// left side" ("" skips the check).
//
//	side: term (" + " term)*
func (p *parser) parseSide(pos, end Pos, label string) []Term {
	if s, t := p.trim(pos, end); s == t {
		return nil // reported by the caller, who knows which side it is
	}
	var terms []Term
	var ends []Pos
	seps := p.separators(pos, end)
	for i := 0; i <= len(seps); i++ {
		from, to := pos, end
		if i > 0 {
			from = seps[i-1] + 1
		}
		if i < len(seps) {
			to = seps[i]
		}
		from, to = p.trim(from, to)
		if from == to {
			switch {
			case i == 0:
				p.errs.add(seps[0], seps[0]+1, `empty term before "+": remove the "+" or write a compound before it`)
			case i == len(seps):
				p.errs.add(seps[i-1], seps[i-1]+1, `empty term after "+": remove the "+" or write a compound after it`)
			default:
				p.errs.add(seps[i-1], seps[i]+1, `empty term between "+" signs: remove one "+" or write a compound between them`)
			}
			continue
		}
		// Terms with a bad coefficient still count for the repeat check.
		if t, ok := p.parseTerm(from, to); ok {
			terms = append(terms, t)
			ends = append(ends, to)
		}
	}
	if label != "" {
		p.checkRepeats(terms, ends, label)
	}
	return terms
}

// checkRepeats reports every term whose compound (name compared without
// regard to case and white space, and tag) appeared earlier on the side.
func (p *parser) checkRepeats(terms []Term, ends []Pos, label string) {
	type seen struct {
		first int // index of the first term with this compound
		count int
		sum   Rat
	}
	compounds := make(map[string]*seen)
	var repeats []int
	for i, t := range terms {
		key := foldCase(collapse(t.Name)) + "\x00" + collapse(t.Compartment)
		s := compounds[key]
		if s == nil {
			compounds[key] = &seen{first: i, count: 1, sum: t.Coef}
			continue
		}
		s.count++
		s.sum, _ = s.sum.Add(t.Coef) // a sum that overflows only spoils the suggestion
		repeats = append(repeats, i)
	}
	counts := make(map[int]int) // occurrences of each first term so far
	for _, i := range repeats {
		t := terms[i]
		s := compounds[foldCase(collapse(t.Name))+"\x00"+collapse(t.Compartment)]
		counts[s.first]++
		times := "twice"
		if n := counts[s.first] + 1; n > 2 {
			times = say.Sprintf("%d times", n)
		}
		first := terms[s.first]
		combined := Term{Coef: s.sum, Name: first.Name, Compartment: first.Compartment}.String()
		p.errs = append(p.errs, &Error{Pos: t.Pos, End: ends[i],
			Msg: say.Sprintf("%q appears %s %s: write it once as %q",
				first.compound(), times, label, combined),
			Suggest: []string{combined}})
	}
}

// foldCase maps every character of s to the smallest character it equals
// under simple Unicode case folding, so that two strings have the same
// foldCase exactly when strings.EqualFold reports them equal.
func foldCase(s string) string {
	return strings.Map(func(c rune) rune {
		m := c
		for f := unicode.SimpleFold(c); f != c; f = unicode.SimpleFold(f) {
			m = min(m, f)
		}
		return m
	}, s)
}

// parseTerm parses the trimmed, non-empty term in [pos, end).
//
//	term: [coefficient " "] name ["[" tag "]"]
//
// It reports false if the term has no usable name or tag.
func (p *parser) parseTerm(pos, end Pos) (Term, bool) {
	t := Term{Coef: Rat{1, 1}, Pos: pos, NamePos: pos}
	if w := p.wordEnd(pos, end); isCoefficient(p.src[pos:w]) {
		if w == end {
			p.errs.add(pos, end, "missing name after coefficient %q", p.src[pos:w])
			return t, false
		}
		t.Coef = p.parseCoefficient(pos, w)
		t.NamePos, _ = p.trim(w, end)
		if w2 := p.wordEnd(t.NamePos, end); isCoefficient(p.src[t.NamePos:w2]) {
			p.errs.add(t.NamePos, w2, "second number %q after coefficient %q: write one coefficient before the name",
				p.src[t.NamePos:w2], p.src[pos:w])
		}
	}
	t.NameEnd = end
	tagOK := true
	if open := strings.IndexAny(p.src[t.NamePos:end], "[]"); open >= 0 {
		t.NameEnd = t.NamePos + Pos(open)
		n := len(p.errs)
		t.Compartment = p.parseTag(t.NameEnd, end)
		tagOK = len(p.errs) == n
		_, t.NameEnd = p.trim(t.NamePos, t.NameEnd)
	}
	t.Name = p.parseName(t.NamePos, t.NameEnd, end)
	return t, tagOK && t.Name != ""
}

// isCoefficient reports whether the word w is meant as a coefficient: an
// optional sign, then digits, "." and "/" only, with at least one digit.
// Words such as "2-phospho-D-glycerate" or "1,3-bisphosphoglycerate" are names.
func isCoefficient(w string) bool {
	if w != "" && (w[0] == '-' || w[0] == '+') {
		w = w[1:]
	}
	digit := false
	for i := 0; i < len(w); i++ {
		switch c := w[i]; {
		case '0' <= c && c <= '9':
			digit = true
		case c != '.' && c != '/':
			return false
		}
	}
	return digit
}

// parseCoefficient parses the coefficient in [pos, end).
//
//	coefficient: rat  (see ParseRat), positive
func (p *parser) parseCoefficient(pos, end Pos) Rat {
	text := p.src[pos:end]
	r, why := parseRat(text)
	if why == "" && r.Sign() <= 0 {
		why = "coefficients must be positive"
	}
	if why != "" {
		p.errs.add(pos, end, "%q is not a valid coefficient: %s", text, why)
		return Rat{1, 1}
	}
	return r
}

// parseName checks the name in [pos, end); termEnd is the end of its term.
//
//	name: word (" " word)*   where a "+" may only end a word, as in "NAD+"
func (p *parser) parseName(pos, end, termEnd Pos) string {
	name := p.src[pos:end]
	if name == "" {
		p.errs.add(pos, termEnd, `missing compound name before the compartment tag`)
		return ""
	}
	for i := 0; i < len(name); i++ {
		if name[i] != '+' {
			continue
		}
		startsWord := i == 0
		if !startsWord {
			c, _ := utf8.DecodeLastRuneInString(name[:i])
			startsWord = isSpace(c)
		}
		endsWord := i+1 == len(name) || strings.ContainsRune(")+", rune(name[i+1]))
		if !endsWord {
			c, _ := utf8.DecodeRuneInString(name[i+1:])
			endsWord = isSpace(c)
		}
		if startsWord || !endsWord {
			q := pos + Pos(i)
			p.errs.add(q, q+1, `"+" inside a name: write a space on both sides of "+" to separate terms, as in "A + B"`)
		}
	}
	return name
}

// parseTag parses the compartment tag that starts with the bracket at pos
// and runs to the end of the term, returning the trimmed tag.
//
//	tag: "[" text "]"   at the end of the term
func (p *parser) parseTag(pos, end Pos) string {
	if p.src[pos] == ']' {
		p.errs.add(pos, pos+1, `unmatched "]": a compartment tag is written as in "pyruvate[m]"`)
		return ""
	}
	rest := p.src[pos+1 : end]
	i := strings.IndexAny(rest, "[]")
	if i < 0 {
		p.errs.add(pos, end, `unclosed compartment tag: add "]" at the end, as in "pyruvate[m]"`)
		return ""
	}
	if rest[i] == '[' {
		q := pos + 1 + Pos(i)
		p.errs.add(q, q+1, `"[" inside a compartment tag: write one tag, as in "pyruvate[m]"`)
		return ""
	}
	closeAt := pos + 1 + Pos(i)
	tagStart, tagEnd := p.trim(pos+1, closeAt)
	if tagStart == tagEnd {
		p.errs.add(pos, closeAt+1, `empty compartment tag: write a compartment such as "[c]" or remove the brackets`)
	}
	if s, t := p.trim(closeAt+1, end); s < t {
		p.errs.add(s, t, "unexpected %q after the compartment tag: the tag goes at the end of the term", p.src[s:t])
	}
	return p.src[tagStart:tagEnd]
}
