package say

import (
	"unicode/utf8"
	"unsafe"
)

// Stringer is the interface of values that print themselves, fmt.Stringer's method set.
type Stringer interface {
	String() string
}

// printArg prints one argument for verb, as fmt's printArg does for the supported types.
func (p *printer) printArg(arg any, verb rune) {
	p.arg = arg
	switch verb {
	case 'v', 'd', 's', 'q', 'x', 'X', 'g', 'G', 'e', 'E', 'f', 'F', 'U', 't', 'w':
	default:
		p.unsupported(verb)
		return
	}
	if arg == nil {
		if verb == 'v' {
			p.padString(nilAngle)
		} else {
			p.badVerb(verb)
		}
		return
	}
	if p.sharp {
		p.unsupported(verb)
		return
	}
	switch f := arg.(type) {
	case bool:
		p.printBool(f, verb)
	case float32:
		p.printFloat(float64(f), 32, verb)
	case float64:
		p.printFloat(f, 64, verb)
	case int:
		p.printInteger(uint64(f), true, verb)
	case int8:
		p.printInteger(uint64(f), true, verb)
	case int16:
		p.printInteger(uint64(f), true, verb)
	case int32:
		p.printInteger(uint64(f), true, verb)
	case int64:
		p.printInteger(uint64(f), true, verb)
	case uint:
		p.printInteger(uint64(f), false, verb)
	case uint8:
		p.printInteger(uint64(f), false, verb)
	case uint16:
		p.printInteger(uint64(f), false, verb)
	case uint32:
		p.printInteger(uint64(f), false, verb)
	case uint64:
		p.printInteger(f, false, verb)
	case uintptr:
		p.printInteger(uint64(f), false, verb)
	case string:
		p.printString(f, verb)
	case []byte:
		if verb == 's' || verb == 'q' {
			p.printString(string(f), verb)
		} else {
			p.unsupported(verb) // fmt prints a list of numbers
		}
	default:
		p.printMethods(verb)
	}
}

// typeName returns the name fmt prints for the type of a supported basic argument, or "".
func typeName(arg any) string {
	switch arg.(type) {
	case bool:
		return "bool"
	case float32:
		return "float32"
	case float64:
		return "float64"
	case int:
		return "int"
	case int8:
		return "int8"
	case int16:
		return "int16"
	case int32:
		return "int32"
	case int64:
		return "int64"
	case uint:
		return "uint"
	case uint8:
		return "uint8"
	case uint16:
		return "uint16"
	case uint32:
		return "uint32"
	case uint64:
		return "uint64"
	case uintptr:
		return "uintptr"
	case string:
		return "string"
	}
	return ""
}

// printMethods prints an error or a Stringer through its method, as fmt's handleMethods does; any
// other type is unsupported.
func (p *printer) printMethods(verb rune) {
	if p.erroring {
		p.unsupported(verb)
		return
	}
	if verb == 'w' {
		if _, ok := p.arg.(error); !ok || !p.wrapErrs {
			p.unsupported(verb) // fmt's report names the dynamic type, which needs reflection
			return
		}
		verb = 'v'
	}
	switch verb {
	case 'v', 's', 'q':
	default:
		p.unsupported(verb)
		return
	}
	switch v := p.arg.(type) {
	case error:
		defer p.catchPanic(p.arg, verb, "Error")
		p.printString(v.Error(), verb)
	case Stringer:
		defer p.catchPanic(p.arg, verb, "String")
		p.printString(v.String(), verb)
	default:
		p.unsupported(verb)
	}
}

// catchPanic reports a panic of an Error or String method as fmt does: "<nil>" for a nil pointer
// receiver, else "%!v(PANIC=String method: ...)".
func (p *printer) catchPanic(arg any, verb rune, method string) {
	err := recover()
	if err == nil {
		return
	}
	if isNilPointer(arg) {
		p.buf = append(p.buf, nilAngle...)
		return
	}
	if p.panicking {
		panic(err)
	}
	old, oldWid, oldPrec := p.flags, p.wid, p.prec
	p.clearflags()
	p.buf = append(p.buf, percentBang...)
	p.buf = utf8.AppendRune(p.buf, verb)
	p.buf = append(p.buf, "(PANIC="...)
	p.buf = append(p.buf, method...)
	p.buf = append(p.buf, " method: "...)
	p.panicking = true
	p.printArg(err, 'v')
	p.panicking = false
	p.buf = append(p.buf, ')')
	p.flags, p.wid, p.prec = old, oldWid, oldPrec
}

// isNilPointer reports whether arg holds a nil pointer. An interface stores a pointer in its data word,
// and every non-pointer value behind a non-nil data word, so a nil data word is a nil pointer (or a nil
// map, channel or function, which fmt would report as a panic instead). This replaces fmt's
// reflect.ValueOf(arg).IsNil().
func isNilPointer(arg any) bool {
	return (*[2]unsafe.Pointer)(unsafe.Pointer(&arg))[1] == nil
}

// badVerb writes fmt's report of a verb that does not suit a basic argument, e.g. "%!d(string=hi)".
func (p *printer) badVerb(verb rune) {
	p.erroring = true
	p.buf = append(p.buf, percentBang...)
	p.buf = utf8.AppendRune(p.buf, verb)
	p.buf = append(p.buf, '(')
	if p.arg == nil {
		p.buf = append(p.buf, nilAngle...)
	} else {
		p.buf = append(p.buf, typeName(p.arg)...)
		p.buf = append(p.buf, '=')
		p.printArg(p.arg, 'v')
	}
	p.buf = append(p.buf, ')')
	p.erroring = false
}

// unsupported writes "%!verb(unsupported)" for what this package does not format.
func (p *printer) unsupported(verb rune) {
	p.buf = append(p.buf, percentBang...)
	p.buf = utf8.AppendRune(p.buf, verb)
	p.buf = append(p.buf, unsupported...)
}
