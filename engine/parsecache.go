package engine

import (
	"sync"

	"gibbsheet/engine/equation"
)

// The page evaluates the whole worksheet on every keystroke, so nearly every equation it parses it parsed
// the time before. parsed keeps the outcome of recent parses, keyed by the equation text. Parsed equations
// are never modified after parsing, so entries are shared between evaluations.
var parsed = struct {
	sync.Mutex
	m map[string]parseOutcome
}{m: map[string]parseOutcome{}}

// parseCacheSize bounds the number of remembered equations (a few hundred bytes each); when it is reached
// the cache starts afresh, which costs one full parse of the worksheet.
const parseCacheSize = 4096

type parseOutcome struct {
	eq     *equation.Equation
	normal string
	err    error
}

// parseEquation is equation.Parse with the normal form, remembered across evaluations.
func parseEquation(src string) parseOutcome {
	parsed.Lock()
	out, ok := parsed.m[src]
	parsed.Unlock()
	if ok {
		return out
	}
	eq, err := equation.Parse(src)
	out = parseOutcome{eq: eq, err: err}
	if err == nil {
		out.normal = eq.String()
	}
	parsed.Lock()
	if len(parsed.m) >= parseCacheSize {
		clear(parsed.m)
	}
	parsed.m[src] = out
	parsed.Unlock()
	return out
}
