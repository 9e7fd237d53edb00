package compounds

//go:generate go run ./internal/gencompounds

// Builtin returns the built-in library. It is compiled in (builtin_data.go, generated from
// data/compounds.json by go generate), so the first call costs nothing; the package's tests check that
// it is what NewLibrary builds from the data, which validates them.
func Builtin() *Library { return &builtinLibrary }
