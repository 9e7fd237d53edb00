package service

import (
	"bytes"
	"errors"
)

// Marker is the element the service puts into the page's <head> so that the page knows it was served by
// the service and may offer to publish: the page looks for meta[name="gibbsheet-service"] and POSTs the
// worksheet to the path in its content. A page opened as a file has no marker and offers nothing.
const Marker = `<meta name="gibbsheet-service" content="` + WorksheetsPath + `">`

// ErrNoHead means the page has no <head> element to put the marker in.
var ErrNoHead = errors.New("service: the page has no <head> element")

// MarkPage returns a copy of page with Marker right after the opening <head> tag. The page's
// Content-Security-Policy forbids every connection (connect-src 'none'), which is right for a file; a page
// served by the service must reach the service to publish, so its policy allows its own origin instead
// (connect-src 'self') and nothing else.
func MarkPage(page []byte) ([]byte, error) {
	at := headEnd(page)
	if at < 0 {
		return nil, ErrNoHead
	}
	out := make([]byte, 0, len(page)+len(Marker))
	out = append(out, page[:at]...)
	out = append(out, Marker...)
	rest := page[at:]
	if i := bytes.Index(rest[:min(len(rest), headSearch)], noConnect); i >= 0 {
		out = append(out, rest[:i]...)
		out = append(out, selfConnect...)
		rest = rest[i+len(noConnect):]
	}
	return append(out, rest...), nil
}

var (
	noConnect   = []byte("connect-src 'none'")
	selfConnect = []byte("connect-src 'self'")
)

// headSearch is how far into the page the opening <head> tag is looked for.
const headSearch = 64 << 10

// headEnd is the offset just past the first opening <head> tag (any letter case, attributes allowed) in the
// first headSearch bytes, or -1.
func headEnd(page []byte) int {
	lower := bytes.ToLower(page[:min(len(page), headSearch)])
	for from := 0; ; {
		i := bytes.Index(lower[from:], []byte("<head"))
		if i < 0 {
			return -1
		}
		i += from + len("<head")
		if i < len(lower) && (lower[i] == '>' || lower[i] == ' ' || lower[i] == '\t' || lower[i] == '\n' || lower[i] == '\r') {
			if j := bytes.IndexByte(lower[i:], '>'); j >= 0 {
				return i + j + 1
			}
			return -1
		}
		from = i // "<header" and the like
	}
}
