package equation

import (
	"sort"
	"strings"
	"unicode/utf8"

	"gibbsheet/engine/internal/say"
)

// Pos is a byte offset into the equation text. Offsets are turned into
// columns with Column only when an error is reported.
type Pos int

// Column returns the 1-based column of p in src, counted in Unicode
// characters (runes), so that "ΔG" takes two columns. An invalid UTF-8 byte
// counts as one character. Offsets outside src are clamped to 0..len(src);
// the column of len(src) is one past the last character.
func Column(src string, p Pos) int {
	n := int(p)
	if n < 0 {
		n = 0
	}
	if n > len(src) {
		n = len(src)
	}
	return utf8.RuneCountInString(src[:n]) + 1
}

// An Error is one problem in an equation text. The offending text is
// src[Pos:End]; End equals Pos when the problem is something missing.
type Error struct {
	Pos     Pos
	End     Pos
	Msg     string
	Suggest []string // possible replacements, if any
}

// Error returns the message prefixed with the byte offset, as in
// "offset 4: empty term between "+" signs". Callers that know the source text
// use Column to print a column instead.
func (e *Error) Error() string {
	return say.Sprintf("offset %d: %s", int(e.Pos), e.Msg)
}

// ErrorList is a list of *Errors, the error type returned by Parse.
type ErrorList []*Error

// add appends an error for the span [pos, end).
func (l *ErrorList) add(pos, end Pos, format string, args ...any) {
	*l = append(*l, &Error{Pos: pos, End: end, Msg: say.Sprintf(format, args...)})
}

// Len, Less and Swap implement sort.Interface: by Pos, then End, then Msg.
func (l ErrorList) Len() int      { return len(l) }
func (l ErrorList) Swap(i, j int) { l[i], l[j] = l[j], l[i] }
func (l ErrorList) Less(i, j int) bool {
	a, b := l[i], l[j]
	if a.Pos != b.Pos {
		return a.Pos < b.Pos
	}
	if a.End != b.End {
		return a.End < b.End
	}
	return a.Msg < b.Msg
}

// Sort sorts the list by position.
func (l ErrorList) Sort() { sort.Stable(l) }

// Error joins the messages of all errors with "; ".
func (l ErrorList) Error() string {
	switch len(l) {
	case 0:
		return "no errors"
	case 1:
		return l[0].Error()
	}
	msgs := make([]string, len(l))
	for i, e := range l {
		msgs[i] = e.Error()
	}
	return strings.Join(msgs, "; ")
}

// Err returns nil if the list is empty and the list itself otherwise.
func (l ErrorList) Err() error {
	if len(l) == 0 {
		return nil
	}
	return l
}
