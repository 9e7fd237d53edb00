package say

import (
	"strconv"
	"unicode/utf8"
)

// The formatting below follows package fmt's (print.go and format.go of Go's standard library, BSD
// licence) for the supported verbs and flags, so that the output is the same byte for byte.

const (
	ldigits = "0123456789abcdefx"
	udigits = "0123456789ABCDEFX"
)

func (p *printer) printBool(v bool, verb rune) {
	switch verb {
	case 't', 'v':
		p.padString(strconv.FormatBool(v))
	default:
		p.badVerb(verb)
	}
}

func (p *printer) printInteger(v uint64, signed bool, verb rune) {
	switch verb {
	case 'v', 'd':
		p.fmtInteger(v, 10, signed, ldigits)
	case 'x':
		p.fmtInteger(v, 16, signed, ldigits)
	case 'X':
		p.fmtInteger(v, 16, signed, udigits)
	case 'q':
		p.fmtQc(v)
	case 'U':
		p.fmtUnicode(v)
	default:
		p.badVerb(verb)
	}
}

func (p *printer) printFloat(v float64, size int, verb rune) {
	switch verb {
	case 'v':
		p.fmtFloat(v, size, 'g', -1)
	case 'g', 'G':
		p.fmtFloat(v, size, verb, -1)
	case 'f', 'e', 'E':
		p.fmtFloat(v, size, verb, 6)
	case 'F':
		p.fmtFloat(v, size, 'f', 6)
	case 'x', 'X':
		p.unsupported(verb)
	default:
		p.badVerb(verb)
	}
}

func (p *printer) printString(v string, verb rune) {
	switch verb {
	case 'v', 's':
		p.padString(p.truncate(v))
	case 'q':
		s := p.truncate(v)
		if p.plus {
			p.pad(strconv.AppendQuoteToASCII(nil, s))
		} else {
			p.pad(strconv.AppendQuote(nil, s))
		}
	case 'x', 'X':
		p.unsupported(verb)
	default:
		p.badVerb(verb)
	}
}

// writePadding appends n bytes of padding: zeros when the 0 flag applies, else spaces.
func (p *printer) writePadding(n int) {
	c := byte(' ')
	if p.zero && !p.minus {
		c = '0'
	}
	for ; n > 0; n-- {
		p.buf = append(p.buf, c)
	}
}

// pad appends b padded to the width, counted in runes, on the left or with the - flag on the right.
func (p *printer) pad(b []byte) { p.padString(string(b)) }

func (p *printer) padString(s string) {
	if !p.widPresent || p.wid == 0 {
		p.buf = append(p.buf, s...)
		return
	}
	width := p.wid - utf8.RuneCountInString(s)
	if !p.minus {
		p.writePadding(width)
		p.buf = append(p.buf, s...)
	} else {
		p.buf = append(p.buf, s...)
		p.writePadding(width)
	}
}

// truncate cuts s to the precision, counted in runes.
func (p *printer) truncate(s string) string {
	if p.precPresent {
		n := p.prec
		for i := range s {
			n--
			if n < 0 {
				return s[:i]
			}
		}
	}
	return s
}

// fmtInteger formats u (a two's-complement int64 when signed) in base 10 or 16.
func (p *printer) fmtInteger(u uint64, base uint64, signed bool, digits string) {
	negative := signed && int64(u) < 0
	if negative {
		u = -u
	}
	prec := 0
	if p.precPresent {
		prec = p.prec
		if prec == 0 && u == 0 {
			oldZero := p.zero
			p.zero = false
			p.writePadding(p.wid)
			p.zero = oldZero
			return
		}
	} else if p.zero && !p.minus && p.widPresent { // zero padding only on the left
		prec = p.wid
		if negative || p.plus || p.space {
			prec-- // room for the sign
		}
	}
	buf := make([]byte, 68+p.wid+p.prec)
	i := len(buf)
	for u >= base {
		i--
		buf[i] = digits[u%base]
		u /= base
	}
	i--
	buf[i] = digits[u]
	for i > 0 && prec > len(buf)-i {
		i--
		buf[i] = '0'
	}
	if negative {
		i--
		buf[i] = '-'
	} else if p.plus {
		i--
		buf[i] = '+'
	} else if p.space {
		i--
		buf[i] = ' '
	}
	oldZero := p.zero
	p.zero = false
	p.pad(buf[i:])
	p.zero = oldZero
}

// fmtUnicode formats u as "U+0078", with at least the precision (default 4) hex digits.
func (p *printer) fmtUnicode(u uint64) {
	prec := 4
	if p.precPresent && p.prec > 4 {
		prec = p.prec
	}
	buf := make([]byte, 2+max(prec, 16))
	i := len(buf)
	for u >= 16 {
		i--
		buf[i] = udigits[u&0xF]
		prec--
		u >>= 4
	}
	i--
	buf[i] = udigits[u]
	prec--
	for ; prec > 0; prec-- {
		i--
		buf[i] = '0'
	}
	i -= 2
	buf[i], buf[i+1] = 'U', '+'
	oldZero := p.zero
	p.zero = false
	p.pad(buf[i:])
	p.zero = oldZero
}

// fmtQc formats c as a quoted character literal, RuneError when out of range.
func (p *printer) fmtQc(c uint64) {
	r := rune(c)
	if c > utf8.MaxRune {
		r = utf8.RuneError
	}
	if p.plus {
		p.pad(strconv.AppendQuoteRuneToASCII(nil, r))
	} else {
		p.pad(strconv.AppendQuoteRune(nil, r))
	}
}

// fmtFloat formats v with strconv's verb and precision (the directive's precision if given); the sign,
// the space and 0 flags and the padding of Inf and NaN are fmt's.
func (p *printer) fmtFloat(v float64, size int, verb rune, prec int) {
	if p.precPresent {
		prec = p.prec
	}
	num := strconv.AppendFloat([]byte{0}, v, byte(verb), prec, size)
	if num[1] == '-' || num[1] == '+' {
		num = num[1:]
	} else {
		num[0] = '+'
	}
	if p.space && num[0] == '+' && !p.plus {
		num[0] = ' '
	}
	if num[1] == 'I' || num[1] == 'N' {
		oldZero := p.zero
		p.zero = false
		if num[1] == 'N' && !p.space && !p.plus {
			num = num[1:]
		}
		p.pad(num)
		p.zero = oldZero
		return
	}
	if p.plus || num[0] != '+' {
		if p.zero && !p.minus && p.widPresent && p.wid > len(num) {
			p.buf = append(p.buf, num[0])
			p.writePadding(p.wid - len(num))
			p.buf = append(p.buf, num[1:]...)
			return
		}
		p.pad(num)
		return
	}
	p.pad(num[1:])
}
