package say_test

import (
	"errors"
	"fmt"

	"gibbsheet/engine/internal/say"
)

func ExampleSprintf() {
	fmt.Println(say.Sprintf("uphill: ΔrG' = %+.1f kJ/mol for %q", 12.34, "hexokinase"))
	fmt.Println(say.Sprintf("byte 0x%02x, %U, %d%%", byte(7), '\x1b', 50))
	fmt.Println(say.Sprintf("%v %x", 1.5, "unsupported for strings"))
	// Output:
	// uphill: ΔrG' = +12.3 kJ/mol for "hexokinase"
	// byte 0x07, U+001B, 50%
	// 1.5 %!x(unsupported)
}

func ExampleErrorf() {
	errBad := errors.New("bad conditions")
	err := say.Errorf("%w (got %g)", errBad, -1.0)
	fmt.Println(err, errors.Is(err, errBad))
	// Output:
	// bad conditions (got -1) true
}
