// Package say formats messages like package fmt's Sprintf and Errorf without reflection, so that the
// engine compiled to WebAssembly does not carry fmt, reflect and their tables, which keeps the page small.
// It supports the verbs %v %d %s %q %x %X %g %G %e %E %f %F %U %t %w and %%, with the flags + - 0 and
// space, width and precision, for arguments of the predeclared boolean, integer, floating-point and
// string types, []byte (%s and %q), error, Stringer (String() string) and nil; for those its output is byte for byte fmt's.
// Anything else (the # flag, * and [n] in a directive, other verbs, other argument types such as named
// integers or structs) prints as "%!verb(unsupported)" instead of panicking.
package say
