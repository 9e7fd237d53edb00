package say

import (
	"strings"
	"unicode/utf8"
)

// This file states which directives and argument kinds this package formats exactly as fmt does. The
// differential tests check it against fmt; the call-site test checks every format in the engine against it.

// kind classifies an argument as this package does.
type kind int

const (
	kNil      kind = iota // untyped nil
	kBool                 // bool
	kInt                  // int, int8, int16, int32 (rune), int64
	kUint                 // uint, uint8 (byte), uint16, uint32, uint64, uintptr
	kFloat                // float32, float64
	kString               // string
	kBytes                // []byte
	kError                // implements error
	kStringer             // implements String() string and not error
	kAny                  // a static type any: only the call-site test uses it, for %v
	kOther                // anything else: unsupported
)

// sayVerbs are the verbs the package implements; any other verb is unsupported.
const sayVerbs = "vdsqxXgGeEfFUtw"

// directive is one parsed %-directive of a format.
type directive struct {
	text  string // as written, e.g. "%+.1f"
	flags string // the flag characters as written
	verb  rune
	weird bool // '*', '[', a verb '.' or a number above 10⁶: fmt's extensions the package does not parse
}

// exact reports whether the package prints verb with the given flags for an argument of kind k exactly
// as fmt does; inErrorf is true for Errorf, where %w wraps an error.
func exact(d directive, k kind, inErrorf bool) bool {
	if d.weird || !strings.ContainsRune(sayVerbs, d.verb) {
		return false
	}
	if k == kNil {
		return true
	}
	if strings.Contains(d.flags, "#") {
		return false
	}
	switch k {
	case kBool, kInt, kUint:
		return true
	case kFloat, kString:
		return d.verb != 'x' && d.verb != 'X'
	case kError:
		return strings.ContainsRune("vsq", d.verb) || d.verb == 'w' && inErrorf
	case kStringer:
		return strings.ContainsRune("vsq", d.verb)
	case kBytes:
		return d.verb == 's' || d.verb == 'q'
	case kAny:
		return d.verb == 'v' && d.flags == ""
	}
	return false
}

// parseDirectives returns the directives of format that take an argument, in order (%% is left out).
func parseDirectives(format string) []directive {
	var out []directive
	for i := 0; i < len(format); {
		if format[i] != '%' {
			i++
			continue
		}
		start := i
		i++
		for i < len(format) && strings.IndexByte("#0+- ", format[i]) >= 0 {
			i++
		}
		d := directive{flags: format[start+1 : i]}
		digits := func() {
			n := 0
			for i < len(format) && '0' <= format[i] && format[i] <= '9' {
				n++
				i++
			}
			if n > 6 {
				d.weird = true
			}
		}
		digits()
		if i+1 < len(format) && format[i] == '.' {
			i++
			digits()
		}
		if i >= len(format) {
			break // %!(NOVERB)
		}
		r, size := utf8.DecodeRuneInString(format[i:])
		i += size
		if r == '%' {
			continue
		}
		d.verb, d.text = r, format[start:i]
		d.weird = d.weird || r == '*' || r == '[' || r == '.'
		out = append(out, d)
	}
	return out
}

// kindOf returns the kind of a run-time argument.
func kindOf(a any) kind {
	switch a.(type) {
	case nil:
		return kNil
	case bool:
		return kBool
	case int, int8, int16, int32, int64:
		return kInt
	case uint, uint8, uint16, uint32, uint64, uintptr:
		return kUint
	case float32, float64:
		return kFloat
	case string:
		return kString
	case []byte:
		return kBytes
	case error:
		return kError
	case Stringer:
		return kStringer
	}
	return kOther
}
