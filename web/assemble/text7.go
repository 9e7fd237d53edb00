package assemble

import "strings"

// text7Escape is added to a 7-bit value that may not stand raw in the page: the escaped characters
// (U+00C0, U+00CD, U+00FC) stay within Latin-1, so the browser keeps the whole text in one byte a
// character (a text with any character from U+0100 on is held in two, and the page's parse of it took
// a fifth longer; see web/browser/bench_start_test.go).
const text7Escape = 0xC0

// Text7 writes binary data as text for a script element, 7 bits to a character (most significant bit
// first, the last character padded with zero bits). A 7-bit value that may not stand raw in an HTML
// script element — NUL (the parser replaces it), CR (the parser turns it into LF) and "<" (it could
// start "</script") — is written as the character U+00C0 + value, two bytes in UTF-8. The text is about
// 8/7 of the data's size where base64 would be 4/3. The page's decoder (js/engine.js) needs the data's
// length in bytes to drop the padding.
func Text7(data []byte) string {
	var b strings.Builder
	b.Grow(len(data)*8/7 + len(data)/40 + 2)
	var acc uint32
	var n uint
	emit := func(v uint32) {
		switch v {
		case 0, '\r', '<':
			b.WriteRune(rune(text7Escape + v))
		default:
			b.WriteByte(byte(v))
		}
	}
	for _, x := range data {
		acc = acc<<8 | uint32(x)
		n += 8
		for n >= 7 {
			n -= 7
			emit(acc >> n & 0x7f)
		}
		acc &= 1<<n - 1
	}
	if n > 0 {
		emit(acc << (7 - n) & 0x7f)
	}
	return b.String()
}

// FromText7 reverses Text7; n is the length of the data in bytes. It is the reference for the page's
// decoder and is used by the tests.
func FromText7(s string, n int) []byte {
	out := make([]byte, 0, n)
	var acc uint32
	var bits uint
	for _, r := range s {
		v := uint32(r)
		if v >= 0x80 {
			v -= text7Escape
		}
		acc = acc<<7 | v&0x7f
		bits += 7
		if bits >= 8 {
			bits -= 8
			if len(out) < n {
				out = append(out, byte(acc>>bits))
			}
			acc &= 1<<bits - 1
		}
	}
	return out
}
