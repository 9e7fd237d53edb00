package engine

import (
	"sync"
	"sync/atomic"
)

// The page evaluates the whole worksheet on every keystroke, and a keystroke changes one row or one
// setting. rows remembers the rows of the last worksheet context evaluated: a row's result depends only on
// the row and on the context (conditions, concentrations, compounds, values, compartments, bounds, band),
// so an unchanged row under an unchanged context is not computed again. A result taken from memory is
// shared and never modified; evaluateWith copies it into the result document.
var rows = &rowMemo{}

// rowMemoSize bounds the remembered rows; when reached the memory starts afresh.
const rowMemoSize = 8192

type rowMemo struct {
	mu      sync.Mutex
	context string
	m       map[rowKey]*memoRow
}

// rowKey is what a row's result depends on besides the context (its note does not enter the result).
type rowKey struct {
	id, equation     string
	times, dG0       float64
	hasTimes, hasDG0 bool
}

// serials numbers evaluations, for memoRow.made.
var serials atomic.Uint64

func rowKeyOf(r *Row) rowKey {
	k := rowKey{id: r.ID, equation: r.Equation}
	if r.Times != nil {
		k.times, k.hasTimes = *r.Times, true
	}
	if r.DG0 != nil {
		k.dG0, k.hasDG0 = *r.DG0, true
	}
	return k
}

type memoRow struct {
	key    rowKey
	made   uint64 // the serial of the evaluation that computed it: a row made there is in no earlier result
	result RowResult
	json   []byte   // result as AppendJSON writes it; never changed once made
	nu     []stoich // nil when the row cannot enter the totals
	used   []stoich // the reactants the row names, replayed into the result's list of compounds
	valued []string // the compounds it names, H+ included, that have an energy value: those are listed
}

func (c *rowMemo) get(context string, k rowKey) *memoRow {
	c.mu.Lock()
	defer c.mu.Unlock()
	if c.context != context {
		return nil
	}
	return c.m[k]
}

func (c *rowMemo) put(context string, k rowKey, m *memoRow) {
	c.mu.Lock()
	defer c.mu.Unlock()
	if c.context != context || len(c.m) >= rowMemoSize {
		c.context, c.m = context, map[rowKey]*memoRow{}
	}
	c.m[k] = m
}

// contextKey is the worksheet without its rows, title and notes, as JSON: two worksheets with the same key
// give every row the same result.
func contextKey(ws *Worksheet) string {
	ctx := *ws
	ctx.Rows, ctx.Title, ctx.Notes = nil, "", ""
	return string(ctx.AppendJSON(nil))
}
