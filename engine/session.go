package engine

import (
	"bytes"
	"strconv"
	"sync"

	"gibbsheet/engine/compounds"
)

// Session evaluates the successive versions of one worksheet as someone edits it, the way the page does on
// every keystroke, and answers with what changed since its previous answer, which the caller keeps.
//
// ChangesJSON is EvaluateJSON without the max-min driving force, and with every row whose result is, byte
// for byte, a row of the previous answer written as that row's index in it: typing in one row of a
// hundred sends one row back. AnalysisJSON then gives the max-min driving force of the latest answer, so
// a caller can show the rows at once and the analysis, which weighs the whole pathway, a moment later.
// Merging the two gives exactly EvaluateJSON's document (TestSessionMatchesEvaluate).
//
// A Session is safe for concurrent use, though its answers only make sense to a caller that sees them
// in order.
type Session struct {
	mu    sync.Mutex
	seq   int         // number of the latest answer; 0 before the first
	ev    *evaluation // the latest answer's
	setup *setup      // the latest context's, read once for the answers that share it
	seen  *rowsSeen   // the latest worksheet's rows as read, to read the next one faster

	analysis mdfMemo // the latest analysis, which the next one takes what it can from
}

// ChangesJSON reads a worksheet document and returns the changes document:
//
//	{"seq": n, "base": b, "rows": [...], "total": ..., "compounds": ..., "values": ..., "conditions": ...,
//	 "warnings": [...], "errors": [...]}
//
// with the fields of the result document, less "mdf". A row given as a number i is row i of the answer
// numbered b, which is base when base is the session's latest answer and 0 (no row given by number)
// otherwise. Errors are EvaluateJSON's; after one the session's latest answer stays what it was. The
// session keeps worksheet to read the next version faster: the caller must not change it afterwards.
func (s *Session) ChangesJSON(worksheet []byte, base int) (out []byte, err error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	defer recoverEngine(&out, &err, s.reset)
	var prevRows [][]byte // the rows of the answer numbered s.seq, encoded
	if s.ev != nil {
		prevRows = s.ev.res.rowJSON
	}
	ev, err := s.evaluate(worksheet)
	if err != nil {
		return nil, err
	}
	res := ev.res
	if base != s.seq || base == 0 {
		base = 0
	}
	// Each row is either the index of the same row in the previous answer or, -1, written out.
	refs := make([]int, len(res.rowJSON))
	size := sizeGuessBase + sizeGuessCompound*len(res.Compounds)
	var prev map[*byte]int // the previous rows by where their encoding lies, made when first needed
	for i, enc := range res.rowJSON {
		refs[i] = -1
		switch {
		case base == 0:
		case i < len(prevRows) && bytes.Equal(prevRows[i], enc):
			refs[i] = i
		case ev.done[i].made == ev.serial:
			// computed just now; the address map below finds only remembered rows
		default:
			// A row moved elsewhere is the same remembered row, so its encoding lies at the same address.
			if prev == nil {
				prev = make(map[*byte]int, len(prevRows))
				for j := len(prevRows) - 1; j >= 0; j-- {
					prev[&prevRows[j][0]] = j
				}
			}
			if j, ok := prev[&enc[0]]; ok {
				refs[i] = j
			}
		}
		if refs[i] < 0 {
			size += len(enc) + 1
		} else {
			size += 8
		}
	}
	for i := range res.Compounds {
		size += 8 * len(res.Compounds[i].Rows)
	}
	dst := make([]byte, 0, size)
	dst = append(dst, `{"seq":`...)
	dst = strconv.AppendInt(dst, int64(s.seq+1), 10)
	dst = append(dst, `,"base":`...)
	dst = strconv.AppendInt(dst, int64(base), 10)
	dst = append(dst, `,"rows":[`...)
	for i, enc := range res.rowJSON {
		if i > 0 {
			dst = append(dst, ',')
		}
		if refs[i] >= 0 {
			dst = strconv.AppendInt(dst, int64(refs[i]), 10)
		} else {
			dst = append(dst, enc...)
		}
	}
	dst = append(dst, ']')
	dst = res.appendAfterRows(dst, false)

	s.seq++
	return dst, nil
}

// evaluate reads the worksheet and computes its rows and totals, using what the session kept of the
// worksheet before: its context, if unchanged, the rows at the same place, and the text of its rows. The
// new evaluation becomes the session's latest; after an error the session is as it was.
func (s *Session) evaluate(worksheet []byte) (*evaluation, error) {
	ws, unknown, seen, err := decodeSeen(worksheet, s.seen)
	if err != nil {
		return nil, err
	}
	var ev *evaluation
	if context := contextKey(ws); s.setup != nil && s.setup.ev.context == context {
		ev = s.setup.evaluation(ws, unknown)
		ev.prior, ev.priorEv = s.ev.done, s.ev
	} else {
		ev = newEvaluation(compounds.Builtin(), ws, unknown)
		s.setup = ev.setup(len(unknown))
	}
	ev.live, ev.analysis = true, &s.analysis
	ev.evaluateRows()
	ev.prior, ev.priorEv = nil, nil
	s.ev, s.seen = ev, seen
	return ev, nil
}

// AnalysisJSON returns the max-min driving force of the latest answer and the warnings that come with it:
// {"seq": n, "mdf": ..., "warnings": [...]}, n being the number of that answer. It fails before the first
// answer.
func (s *Session) AnalysisJSON() (out []byte, err error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	defer recoverEngine(&out, &err, s.reset)
	if s.ev == nil {
		return nil, errNoAnswer
	}
	ev := s.ev
	n := len(ev.res.Warnings)
	ev.analyse()
	size := 256
	if ev.res.MDF != nil {
		size += len(ev.res.MDF.json)
	}
	dst := append(make([]byte, 0, size), `{"seq":`...)
	dst = strconv.AppendInt(dst, int64(s.seq), 10)
	dst = append(dst, `,"mdf":`...)
	if ev.res.MDF == nil {
		dst = append(dst, "null"...)
	} else {
		dst = ev.res.MDF.appendJSON(dst)
	}
	dst = append(dst, `,"warnings":`...)
	dst = appendJSONSlice(dst, ev.res.Warnings[n:], (*Warning).appendJSON)
	ev.res.Warnings, ev.res.MDF = ev.res.Warnings[:n], nil
	return append(dst, '}'), nil
}

// reset forgets the latest answer, after a failure of the engine left it in doubt.
func (s *Session) reset() {
	s.seq++
	s.ev, s.setup, s.seen = nil, nil, nil
	s.analysis = mdfMemo{}
}
