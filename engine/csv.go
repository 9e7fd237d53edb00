package engine

import (
	"math"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"gibbsheet/engine/internal/say"
)

// TableHeader is the first line of the results table written by ResultsTable: one column per value of a
// row, energies in kJ/mol, costs in ATP equivalents (multiplier included).
var TableHeader = []string{
	"row", "equation", "times", "ΔrG'° (kJ/mol)", "ΔrG' (kJ/mol)", "K'", "Q", "status",
	"phosphate (ATP eq.)", "reducing (carriers)", "total cost (ATP eq.)", "warnings", "error",
}

// tableDigits is the number of significant digits of the numbers in the table: more than any input or
// published value carries, fewer than the last bits of floating-point arithmetic, so that the table is
// the same on every platform.
const tableDigits = 10

// ResultsCSV evaluates a worksheet document and returns its results as CSV (RFC 4180: comma-separated,
// fields quoted where needed, lines ended by CRLF): TableHeader, one line per row of the worksheet, then
// a "total" line with the net reaction, its energies and the pathway's cost, and the document's own
// warnings and errors. It fails only when EvaluateJSON would.
func ResultsCSV(worksheet []byte) ([]byte, error) {
	return ResultsTable(worksheet, ',')
}

// ResultsTable is ResultsCSV with another field separator: '\t' gives the tab-separated text that
// spreadsheets take from the clipboard (lines then end with LF alone). Numbers that cannot be computed
// are empty fields. Text that a spreadsheet would read as a formula (starting with =, +, -, @, tab or CR)
// is written with a leading apostrophe, so that opening the table never runs anything. sep must be a
// valid separator for encoding/csv (not a quote, CR, LF or the replacement character); others panic.
func ResultsTable(worksheet []byte, sep rune) ([]byte, error) {
	ws, unknown, err := Decode(worksheet)
	if err != nil {
		return nil, err
	}
	res := Evaluate(ws, unknown)
	lines := [][]string{TableHeader}
	for _, r := range res.Rows {
		line := []string{
			tableText(r.ID), tableText(r.Equation), tableNumber(&r.Times), tableNumber(r.DG0), tableNumber(r.DG),
			tablePower(r.K, r.Log10K), tablePower(r.Q, r.Log10Q), tableText(r.Status), "", "", "",
			tableText(joinWarnings(r.Warnings)), tableText(joinRowErrors(r)),
		}
		if r.Cost != nil {
			line[8], line[9], line[10] = tableNumber(&r.Cost.Phosphate), tableNumber(&r.Cost.Reducing), tableNumber(&r.Cost.Total)
		}
		lines = append(lines, line)
	}
	t := res.Total
	var docErrs []string
	for _, e := range res.Errors {
		docErrs = append(docErrs, e.Path+": "+e.Message)
	}
	lines = append(lines, []string{
		"total", tableText(t.Equation), "", tableNumber(t.DG0), tableNumber(t.DG), "", "", "",
		tableNumber(&t.Cost.Phosphate), tableNumber(&t.Cost.Reducing), tableNumber(&t.Cost.Total),
		tableText(joinWarnings(res.Warnings)), tableText(strings.Join(docErrs, "; ")),
	})
	var out []byte
	for _, line := range lines {
		out = appendCSVLine(out, line, sep, sep == ',')
	}
	return out, nil
}

// appendCSVLine writes one line of fields as encoding/csv's Writer does with Comma sep and UseCRLF crlf:
// a field is quoted when it holds the separator, a quote, CR or LF, starts with a space, or is `\.`;
// quotes are doubled. The engine writes its own so that the WebAssembly module need not carry
// encoding/csv and package fmt behind it. sep must be ASCII and not a quote, CR or LF (a caller's
// mistake: it panics).
func appendCSVLine(dst []byte, fields []string, sep rune, crlf bool) []byte {
	if sep <= 0 || sep >= utf8.RuneSelf || sep == '"' || sep == '\r' || sep == '\n' {
		panic(say.Sprintf("engine: ResultsTable with separator %q: not a separator a table can use", sep))
	}
	for n, field := range fields {
		if n > 0 {
			dst = append(dst, byte(sep))
		}
		if !csvNeedsQuotes(field, byte(sep)) {
			dst = append(dst, field...)
			continue
		}
		dst = append(dst, '"')
		for len(field) > 0 {
			i := strings.IndexAny(field, "\"\r\n")
			if i < 0 {
				i = len(field)
			}
			dst, field = append(dst, field[:i]...), field[i:]
			if len(field) == 0 {
				break
			}
			switch field[0] {
			case '"':
				dst = append(dst, `""`...)
			case '\r':
				if !crlf {
					dst = append(dst, '\r')
				}
			case '\n':
				if crlf {
					dst = append(dst, '\r')
				}
				dst = append(dst, '\n')
			}
			field = field[1:]
		}
		dst = append(dst, '"')
	}
	if crlf {
		dst = append(dst, '\r')
	}
	return append(dst, '\n')
}

func csvNeedsQuotes(field string, sep byte) bool {
	if field == "" {
		return false
	}
	if field == `\.` || strings.ContainsAny(field, "\"\r\n") || strings.IndexByte(field, sep) >= 0 {
		return true
	}
	r, _ := utf8.DecodeRuneInString(field)
	return unicode.IsSpace(r)
}

// tableNumber writes a value with tableDigits significant digits and no trailing zeros; nil is "".
func tableNumber(x *float64) string {
	if x == nil || math.IsNaN(*x) || math.IsInf(*x, 0) {
		return ""
	}
	v := *x
	if v == 0 {
		v = 0 // no "-0"
	}
	return strconv.FormatFloat(v, 'g', tableDigits, 64)
}

// tablePower writes K' or Q: the value itself, or 10 to the given power when the value is beyond the range of
// doubles but its logarithm is known ("1.234e+400").
func tablePower(x, log10 *float64) string {
	if x != nil && *x != 0 && !math.IsInf(*x, 0) {
		return tableNumber(x)
	}
	if log10 == nil || math.IsNaN(*log10) || math.IsInf(*log10, 0) {
		return tableNumber(x)
	}
	e := math.Floor(*log10)
	m := math.Pow(10, *log10-e)
	if m >= 10 { // rounding of the mantissa
		m /= 10
		e++
	}
	return strconv.FormatFloat(m, 'g', tableDigits, 64) + say.Sprintf("e%+d", int(e))
}

// tableText guards a text field against being read as a formula by a spreadsheet.
func tableText(s string) string {
	if s != "" && strings.ContainsRune("=+-@\t\r", rune(s[0])) {
		return "'" + s
	}
	return s
}

func joinWarnings(ws []Warning) string {
	msgs := make([]string, len(ws))
	for i, w := range ws {
		msgs[i] = w.Message
	}
	return strings.Join(msgs, "; ")
}

// joinRowErrors writes every error of a row, each with the column it starts at when it has one.
func joinRowErrors(r RowResult) string {
	errs := r.Errors
	if len(errs) == 0 && r.Error != nil {
		errs = []RowError{*r.Error}
	}
	msgs := make([]string, len(errs))
	for i, e := range errs {
		msgs[i] = e.Message
		if e.Column > 0 {
			msgs[i] = say.Sprintf("column %d: %s", e.Column, e.Message)
		}
	}
	return strings.Join(msgs, "; ")
}
