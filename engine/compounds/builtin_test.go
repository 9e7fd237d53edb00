package compounds

import "testing"

// TestBuiltinValid checks that the embedded library parses and passes NewLibrary's validation.
func TestBuiltinValid(t *testing.T) {
	l := Builtin()
	if len(l.All()) == 0 {
		t.Fatal("empty built-in library")
	}
}
