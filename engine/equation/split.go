package equation

import (
	"strings"
	"unicode"
	"unicode/utf8"
)

// This file holds the splitting stage: it checks the characters of the text,
// finds the arrows that split an equation into sides, and the "+" signs that
// split a side into terms. All results are byte offsets into the text.

// knownArrows lists the arrows an equation may use, in the order of error messages.
var knownArrows = []string{"=", "<=>", "⇌", "->", "→"}

// arrow is a run of arrow characters, known or not.
type arrow struct {
	pos, end Pos
	text     string
	known    bool
}

// isSpace reports whether c separates words. All Unicode white space counts;
// normal forms write it as one ASCII space.
func isSpace(c rune) bool { return unicode.IsSpace(c) }

// isArrowRune reports whether c can be part of an arrow: the ASCII arrow
// characters and the Unicode arrow blocks.
func isArrowRune(c rune) bool {
	switch {
	case c == '<', c == '>', c == '=', c == '-':
		return true
	case 0x2190 <= c && c <= 0x21FF, 0x27F0 <= c && c <= 0x27FF, 0x2900 <= c && c <= 0x297F:
		return true
	}
	return false
}

// scan checks every character of the text, reporting invalid UTF-8 and
// control characters, and returns the arrows. An arrow is a maximal run of
// arrow characters that is not made of hyphens only (hyphens belong to
// names such as "D-glucose"); runs that are not one of knownArrows are returned
// as unknown arrows, so that "A => B" gets one clear error.
func (p *parser) scan() []arrow {
	var arrows []arrow
	src := p.src
	for i := 0; i < len(src); {
		c, size := utf8.DecodeRuneInString(src[i:])
		switch {
		case c == utf8.RuneError && size == 1:
			j := i + 1
			for j < len(src) {
				if c, size := utf8.DecodeRuneInString(src[j:]); c != utf8.RuneError || size != 1 {
					break
				}
				j++
			}
			p.errs.add(Pos(i), Pos(j), "invalid UTF-8 byte 0x%02x: the text must be UTF-8 encoded", src[i])
			i = j
			continue
		case unicode.IsControl(c) && !isSpace(c):
			p.errs.add(Pos(i), Pos(i+size), "control character %U is not allowed", c)
		case isArrowRune(c):
			j := i + size
			for j < len(src) {
				c, size := utf8.DecodeRuneInString(src[j:])
				if !isArrowRune(c) {
					break
				}
				j += size
			}
			if text := src[i:j]; strings.Trim(text, "-") != "" {
				arrows = append(arrows, arrow{Pos(i), Pos(j), text, isKnownArrow(text)})
			}
			i = j
			continue
		}
		i += size
	}
	return arrows
}

func isKnownArrow(s string) bool {
	for _, a := range knownArrows {
		if s == a {
			return true
		}
	}
	return false
}

// separators returns the offsets of the "+" signs in [pos, end) that
// separate terms: a "+" with white space or the edge of the side on both
// sides. A "+" glued to a word, as in "NAD+", belongs to the name.
func (p *parser) separators(pos, end Pos) []Pos {
	var seps []Pos
	for i := pos; i < end; i++ {
		if p.src[i] != '+' {
			continue
		}
		before := i == pos
		if !before {
			c, _ := utf8.DecodeLastRuneInString(p.src[pos:i])
			before = isSpace(c)
		}
		after := i+1 == end
		if !after {
			c, _ := utf8.DecodeRuneInString(p.src[i+1 : end])
			after = isSpace(c)
		}
		if before && after {
			seps = append(seps, i)
		}
	}
	return seps
}

// trim returns [pos, end) without leading and trailing white space.
func (p *parser) trim(pos, end Pos) (Pos, Pos) {
	s := p.src[pos:end]
	t := strings.TrimLeftFunc(s, isSpace)
	pos += Pos(len(s) - len(t))
	t = strings.TrimRightFunc(t, isSpace)
	return pos, pos + Pos(len(t))
}

// wordEnd returns the end of the word starting at pos, at most end.
func (p *parser) wordEnd(pos, end Pos) Pos {
	i := strings.IndexFunc(p.src[pos:end], isSpace)
	if i < 0 {
		return end
	}
	return pos + Pos(i)
}

// collapse trims s and writes each inner run of white space as one space.
func collapse(s string) string { return strings.Join(strings.Fields(s), " ") }
