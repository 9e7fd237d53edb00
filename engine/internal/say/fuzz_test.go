package say

import (
	"errors"
	"testing"
)

// FuzzSprintf compares Sprintf and Errorf with fmt on arbitrary formats; sel chooses the kinds of the
// arguments in turn from the fuzzed values. Seeds are in testdata/fuzz/FuzzSprintf.
func FuzzSprintf(f *testing.F) {
	f.Add("%+.1f kJ/mol", "ATP", int64(-3), 2.5, "f")
	f.Add("compound %d %q: name %q already used by compound %d %q", "ΔG\xff", int64(7), 0.0, "isiis")
	f.Add("invalid UTF-8 byte 0x%02x, control character %U", "", int64(0x1f), 1e300, "bi")
	f.Add("%v K is not a temperature; %w", "x", int64(0), -0.0, "fe")
	f.Add("%5.2s|%-4d|%04d|% g|%10.3e|%%|%", "日本", int64(-42), -1e-9, "sssf")
	f.Fuzz(func(t *testing.T, format, s string, i int64, x float64, sel string) {
		if len(format) > 200 || len(sel) > 16 {
			return
		}
		for _, d := range parseDirectives(format) {
			if d.weird {
				return // fmt's own extensions ('*', '[n]') or huge widths: not compared
			}
		}
		var args []any
		for _, c := range []byte(sel) {
			switch c % 10 {
			case 0:
				args = append(args, s)
			case 1:
				args = append(args, int(i))
			case 2:
				args = append(args, x)
			case 3:
				args = append(args, errors.New(s))
			case 4:
				args = append(args, valStringer{s})
			case 5:
				args = append(args, byte(i))
			case 6:
				args = append(args, rune(i))
			case 7:
				args = append(args, nil, []byte(s))
			case 8:
				args = append(args, float32(x))
			default:
				args = append(args, uint64(i))
			}
		}
		compare(t, format, args...)
	})
}
