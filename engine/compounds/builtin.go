package compounds

import (
	_ "embed"
	"encoding/json"
	"fmt"
	"sync"
)

//go:embed data/compounds.json
var builtinJSON []byte

// Builtin returns the built-in library, parsed and validated once from the embedded data
// (data/compounds.json). It panics if the embedded data are invalid, a programmer mistake that the
// package's tests catch.
func Builtin() *Library { return builtin() }

var builtin = sync.OnceValue(func() *Library {
	var cs []Compound
	if err := json.Unmarshal(builtinJSON, &cs); err != nil {
		panic(fmt.Sprintf("compounds: embedded data: %v", err))
	}
	l, err := NewLibrary(cs)
	if err != nil {
		panic(fmt.Sprintf("compounds: embedded data: %v", err))
	}
	return l
})
