package compounds

import "gibbsheet/engine/compounds/internal/names"

//go:generate go run ./internal/gencompounds

// Builtin returns the built-in library. It is compiled in (builtin_data.go, generated from
// data/compounds.json by go generate), so the first call costs nothing; the package's tests check that
// it is what NewLibrary builds from the data, which validates them.
func Builtin() *Library { return &builtinLibrary }

// LibraryEntry is what the page receives of a library compound for completion and display; LibraryJSON,
// generated with the library, is the library as a list of these.
type LibraryEntry = names.Listed
