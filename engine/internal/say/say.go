package say

import (
	"errors"
	"unicode/utf8"
)

// Sprintf formats args according to format as fmt.Sprintf does, within the subset described in the
// package documentation.
func Sprintf(format string, args ...any) string {
	var p printer
	p.doPrintf(format, args)
	return string(p.buf)
}

// Errorf formats like Sprintf and returns the text as an error, as fmt.Errorf does: with one %w
// directive the error's Unwrap() error returns that argument; with several, Unwrap() []error returns
// those that are errors, in order. Without %w it is errors.New of the text.
func Errorf(format string, args ...any) error {
	p := printer{wrapErrs: true}
	p.doPrintf(format, args)
	s := string(p.buf)
	switch len(p.wrapped) {
	case 0:
		return errors.New(s)
	case 1:
		err, _ := args[p.wrapped[0]].(error)
		return &wrapError{s, err}
	}
	var errs []error
	for _, i := range p.wrapped {
		if e, ok := args[i].(error); ok {
			errs = append(errs, e)
		}
	}
	return &wrapErrors{s, errs}
}

type wrapError struct {
	msg string
	err error
}

func (e *wrapError) Error() string { return e.msg }
func (e *wrapError) Unwrap() error { return e.err }

type wrapErrors struct {
	msg  string
	errs []error
}

func (e *wrapErrors) Error() string   { return e.msg }
func (e *wrapErrors) Unwrap() []error { return e.errs }

// flags are the settings of one directive.
type flags struct {
	widPresent, precPresent  bool
	minus, plus, space, zero bool
	sharp                    bool // unsupported; kept to refuse the directive
	plusV                    bool // %+v: plus moved aside, as fmt does
}

// printer holds the output and the state of the directive being formatted.
type printer struct {
	buf []byte
	flags
	wid, prec           int
	arg                 any   // the argument being printed
	erroring, panicking bool  // inside a bad-verb or a panic report
	wrapErrs            bool  // Errorf: %w allowed
	wrapped             []int // argument indices of the %w directives
}

// Texts of fmt's error forms.
const (
	percentBang = "%!"
	missing     = "(MISSING)"
	noVerb      = "%!(NOVERB)"
	extra       = "%!(EXTRA "
	nilAngle    = "<nil>"
	unsupported = "(unsupported)"
)

// doPrintf is fmt's directive loop without argument indices and * widths:
//
//	directive = "%" { "#" | "0" | "+" | "-" | " " } [ width ] [ "." [ precision ] ] verb
func (p *printer) doPrintf(format string, a []any) {
	end := len(format)
	argNum := 0
	for i := 0; i < end; {
		lasti := i
		for i < end && format[i] != '%' {
			i++
		}
		p.buf = append(p.buf, format[lasti:i]...)
		if i >= end {
			break
		}
		i++ // the %
		p.clearflags()
	flagLoop:
		for ; i < end; i++ {
			switch format[i] {
			case '#':
				p.sharp = true
			case '0':
				p.zero = true
			case '+':
				p.plus = true
			case '-':
				p.minus = true
			case ' ':
				p.space = true
			default:
				break flagLoop
			}
		}
		p.wid, p.widPresent, i = parsenum(format, i, end)
		if i+1 < end && format[i] == '.' {
			i++
			p.prec, p.precPresent, i = parsenum(format, i, end)
			if !p.precPresent {
				p.prec, p.precPresent = 0, true
			}
		}
		if i >= end {
			p.buf = append(p.buf, noVerb...)
			break
		}
		verb, size := utf8.DecodeRuneInString(format[i:])
		i += size
		switch {
		case verb == '%':
			p.buf = append(p.buf, '%')
		case argNum >= len(a):
			p.buf = append(p.buf, percentBang...)
			p.buf = utf8.AppendRune(p.buf, verb)
			p.buf = append(p.buf, missing...)
		default:
			if verb == 'w' {
				p.wrapped = append(p.wrapped, argNum)
			}
			if verb == 'v' || verb == 'w' {
				p.plusV, p.plus = p.plus, false
			}
			p.printArg(a[argNum], verb)
			argNum++
		}
	}
	if argNum < len(a) {
		p.clearflags()
		p.buf = append(p.buf, extra...)
		for i, arg := range a[argNum:] {
			if i > 0 {
				p.buf = append(p.buf, ", "...)
			}
			if arg == nil {
				p.buf = append(p.buf, nilAngle...)
			} else if name := typeName(arg); name == "" {
				p.buf = append(p.buf, unsupported...)
			} else {
				p.buf = append(p.buf, name...)
				p.buf = append(p.buf, '=')
				p.printArg(arg, 'v')
			}
		}
		p.buf = append(p.buf, ')')
	}
}

// clearflags resets the directive's settings, keeping the printer's modes.
func (p *printer) clearflags() {
	p.flags = flags{}
	p.wid, p.prec = 0, 0
}

// parsenum reads a decimal number at s[start:end]; like fmt it gives up on numbers above 10⁶.
func parsenum(s string, start, end int) (num int, isnum bool, newi int) {
	if start >= end {
		return 0, false, end
	}
	for newi = start; newi < end && '0' <= s[newi] && s[newi] <= '9'; newi++ {
		if num > 1e6 {
			return 0, false, end
		}
		num = num*10 + int(s[newi]-'0')
		isnum = true
	}
	return
}
