// Package inject places a worksheet document inside the single-file page and takes it out again, with
// the result saved beside it. Both travel as inert data: <script type="application/json"> elements that
// the page reads with JSON.parse, escaped so that no text in them can end the element or be read as
// markup.
package inject

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"strconv"
	"unicode/utf16"
)

// ElementID is the id of the script element that holds the worksheet in the page.
const ElementID = "gibbsheet-worksheet"

// ResultID is the id of the script element that holds the result saved with the worksheet: the engine's
// result document for it, which the page shows while its own engine starts (see Result).
const ResultID = "gibbsheet-result"

var (
	openTag       = []byte(`<script type="application/json" id="` + ElementID + `">`)
	openResultTag = []byte(`<script type="application/json" id="` + ResultID + `">`)
	closeTag      = []byte(`</script>`)
)

// Fingerprint is FNV-1a (32 bits) over the UTF-16 code units of text, as 8 lowercase hex digits: the
// page's hash of a text (js/share.js, fingerprint), which ties a saved result to the worksheet element
// text it was computed for.
func Fingerprint(text []byte) string {
	h := uint32(0x811c9dc5)
	mix := func(unit rune) { h = (h ^ uint32(unit)) * 0x01000193 }
	for _, r := range string(text) {
		if r >= 0x10000 { // a pair of surrogates in UTF-16
			r1, r2 := utf16.EncodeRune(r)
			mix(r1)
			mix(r2)
		} else {
			mix(r)
		}
	}
	s := strconv.FormatUint(uint64(h), 16)
	for len(s) < 8 {
		s = "0" + s
	}
	return s
}

// Result returns the content of the result element for a worksheet element whose text is worksheet (as
// Escape writes it) and the engine's result document for that worksheet:
//
//	{"for":"<Fingerprint(worksheet)>","result":<result>}
//
// escaped like Escape. The page shows the saved result only while the worksheet element's text has that
// fingerprint, so a worksheet changed by other means never shows a result that is not its own. A nil
// result gives null: no result saved.
func Result(worksheet, result []byte) ([]byte, error) {
	if result == nil {
		return []byte("null"), nil
	}
	var b bytes.Buffer
	b.WriteString(`{"for":"` + Fingerprint(worksheet) + `","result":`)
	if err := json.Compact(&b, result); err != nil {
		return nil, fmt.Errorf("the result is not valid JSON: %w", err)
	}
	b.WriteByte('}')
	var out bytes.Buffer
	json.HTMLEscape(&out, b.Bytes())
	return out.Bytes(), nil
}

// ErrNoElement means the page has no worksheet element to fill or read.
var ErrNoElement = errors.New("the page has no worksheet element")

// Escape returns doc as compact JSON with <, >, & and U+2028/U+2029 written as \u escapes. The result
// decodes to the same value and cannot contain "</script" or "<!--", so it is safe inside a script element.
func Escape(doc []byte) ([]byte, error) {
	var compact bytes.Buffer
	if err := json.Compact(&compact, doc); err != nil {
		return nil, fmt.Errorf("the worksheet is not valid JSON: %w", err)
	}
	var out bytes.Buffer
	json.HTMLEscape(&out, compact.Bytes())
	return out.Bytes(), nil
}

// Worksheet returns a copy of page with the worksheet element's content replaced by the escaped doc and,
// when the page has a result element, that element's content by Result of it and result, the engine's
// result document for doc (nil: none saved).
func Worksheet(page, doc, result []byte) ([]byte, error) {
	start, end, err := span(page, openTag)
	if err != nil {
		return nil, err
	}
	esc, err := Escape(doc)
	if err != nil {
		return nil, err
	}
	out := make([]byte, 0, len(page)-(end-start)+len(esc)+len(result))
	out = append(out, page[:start]...)
	out = append(out, esc...)
	out = append(out, page[end:]...)
	rs, re, err := span(out, openResultTag)
	if errors.Is(err, ErrNoElement) && !bytes.Contains(out, openResultTag) {
		return out, nil // a page built before results were saved with the worksheet
	} else if err != nil {
		return nil, err
	}
	saved, err := Result(esc, result)
	if err != nil {
		return nil, err
	}
	return append(out[:rs:rs], append(saved, out[re:]...)...), nil
}

// Extract returns the worksheet element's content: the document as embedded (escaped JSON, which decodes to
// the document that was put in). It is empty when the page carries no worksheet.
func Extract(page []byte) ([]byte, error) {
	start, end, err := span(page, openTag)
	if err != nil {
		return nil, err
	}
	return bytes.TrimSpace(page[start:end]), nil
}

// span returns where the content of the element opened by open starts and ends in page.
func span(page, open []byte) (start, end int, err error) {
	i := bytes.Index(page, open)
	if i < 0 {
		return 0, 0, ErrNoElement
	}
	start = i + len(open)
	j := bytes.Index(page[start:], closeTag)
	if j < 0 {
		return 0, 0, fmt.Errorf("%w: the element is not closed", ErrNoElement)
	}
	return start, start + j, nil
}
