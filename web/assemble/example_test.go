package assemble_test

import (
	"fmt"

	"gibbsheet/web/assemble"
)

// Text7 writes 7 bits per character. Here the two bytes give the values 60, 60 and 0 (padding); 60 is "<"
// and 0 is NUL, which may not stand raw in a script element, so they become U+00FC and U+00C0.
func ExampleText7() {
	s := assemble.Text7([]byte{0x78, 0xf0})
	fmt.Printf("%q %v\n", s, assemble.FromText7(s, 2))
	// Output: "üüÀ" [120 240]
}
