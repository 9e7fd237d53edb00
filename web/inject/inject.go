// Package inject places a worksheet document inside the single-file page and takes it out again. The
// document travels as inert data: a <script type="application/json"> element that the page reads with
// JSON.parse, escaped so that no text in the worksheet can end the element or be read as markup.
package inject

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
)

// ElementID is the id of the script element that holds the worksheet in the page.
const ElementID = "gibbsheet-worksheet"

var (
	openTag  = []byte(`<script type="application/json" id="` + ElementID + `">`)
	closeTag = []byte(`</script>`)
)

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

// Worksheet returns a copy of page with the worksheet element's content replaced by the escaped doc.
func Worksheet(page, doc []byte) ([]byte, error) {
	start, end, err := span(page)
	if err != nil {
		return nil, err
	}
	esc, err := Escape(doc)
	if err != nil {
		return nil, err
	}
	out := make([]byte, 0, len(page)-(end-start)+len(esc))
	out = append(out, page[:start]...)
	out = append(out, esc...)
	return append(out, page[end:]...), nil
}

// Extract returns the worksheet element's content: the document as embedded (escaped JSON, which decodes to
// the document that was put in). It is empty when the page carries no worksheet.
func Extract(page []byte) ([]byte, error) {
	start, end, err := span(page)
	if err != nil {
		return nil, err
	}
	return bytes.TrimSpace(page[start:end]), nil
}

func span(page []byte) (start, end int, err error) {
	i := bytes.Index(page, openTag)
	if i < 0 {
		return 0, 0, ErrNoElement
	}
	start = i + len(openTag)
	j := bytes.Index(page[start:], closeTag)
	if j < 0 {
		return 0, 0, fmt.Errorf("%w: the element is not closed", ErrNoElement)
	}
	return start, start + j, nil
}
