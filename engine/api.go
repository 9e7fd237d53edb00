package engine

import (
	"errors"
	"slices"

	"gibbsheet/engine/compounds"
	"gibbsheet/engine/internal/say"
)

// EvaluateJSON reads a worksheet document and returns its result document. It returns an error only when
// the input cannot be read as a worksheet at all (not JSON, a field of the wrong type, a missing or
// unsupported format); everything wrong inside a row is reported in that row, and wrong field values in the
// result's errors. It does not panic: a failure of the engine itself comes back as an error too.
func EvaluateJSON(worksheet []byte) (out []byte, err error) {
	if !shared.mu.TryLock() {
		return evaluateFresh(worksheet) // another goroutine holds the worksheet kept
	}
	defer shared.mu.Unlock()
	defer recoverEngine(&out, &err, shared.reset)
	ev, err := shared.evaluate(slices.Clone(worksheet))
	if err != nil {
		return nil, err
	}
	ev.analyse()
	return ev.res.AppendJSON(nil), nil
}

// shared keeps the last worksheet EvaluateJSON read, so that reading the next version of it, as when
// someone edits it, reuses its context and its unchanged rows (see Session).
var shared Session

// evaluateFresh is EvaluateJSON with nothing kept from earlier worksheets but the remembered rows.
func evaluateFresh(worksheet []byte) (out []byte, err error) {
	defer recoverEngine(&out, &err, nil)
	ws, unknown, err := Decode(worksheet)
	if err != nil {
		return nil, err
	}
	return Evaluate(ws, unknown).AppendJSON(nil), nil
}

// recoverEngine, deferred, turns a panic of the engine into the error its caller returns, after calling
// cleanup if there is one.
func recoverEngine(out *[]byte, err *error, cleanup func()) {
	p := recover()
	if p == nil {
		return
	}
	if cleanup != nil {
		cleanup()
	}
	*out, *err = nil, say.Errorf("internal error in the engine (please report it with the worksheet): %v", p)
}

var errNoAnswer = errors.New("there is no worksheet to analyse yet: evaluate one first")

// LibraryEntry is what the page needs of a library compound for completion and display; CompoundsJSON is
// the library as a list of these.
type LibraryEntry = compounds.LibraryEntry

// CompoundsJSON returns the built-in library as a JSON array of LibraryEntry, for completion in the page.
// The text is written when the library is generated (compounds.LibraryJSON), so that the page gets it with
// no work; TestCompoundsJSON checks it against the library.
func CompoundsJSON() string { return compounds.LibraryJSON }
