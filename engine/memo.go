package engine

import (
	"sync"

	"gibbsheet/engine/equation"
)

// memo remembers values computed from a key across evaluations, up to a number of entries; when full it
// starts afresh, which costs one round of recomputation. It is safe for concurrent use.
type memo[V any] struct {
	mu   sync.Mutex
	m    map[string]V
	size int
}

func newMemo[V any](size int) *memo[V] { return &memo[V]{m: map[string]V{}, size: size} }

// get returns the value for key, computing and remembering it the first time.
func (c *memo[V]) get(key string, compute func(string) V) V {
	c.mu.Lock()
	v, ok := c.m[key]
	c.mu.Unlock()
	if ok {
		return v
	}
	v = compute(key)
	c.mu.Lock()
	if len(c.m) >= c.size {
		clear(c.m)
	}
	c.m[key] = v
	c.mu.Unlock()
	return v
}

// The page evaluates the whole worksheet on every keystroke, so nearly every equation it parses it parsed
// the time before. parsed keeps the outcome of recent parses, keyed by the equation text (a few hundred
// bytes each). Parsed equations are never modified after parsing, so entries are shared between
// evaluations.
var parsed = newMemo[parseOutcome](4096)

type parseOutcome struct {
	eq     *equation.Equation
	normal string
	err    error
}

// parseEquation is equation.Parse with the normal form, remembered across evaluations.
func parseEquation(src string) parseOutcome {
	return parsed.get(src, func(src string) parseOutcome {
		eq, err := equation.Parse(src)
		out := parseOutcome{eq: eq, err: err}
		if err == nil {
			out.normal = eq.String()
		}
		return out
	})
}
