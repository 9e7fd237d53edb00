//go:build js && wasm

// Command page is the bridge between the worksheet page and the engine: it registers the engine's entry
// points on globalThis.gibbsheet, passes JSON text both ways and turns any failure, a panic included, into
// a JavaScript Error. It holds no science; everything it answers comes from package engine.
package main

import (
	"errors"
	"strings"
	"syscall/js"

	"gibbsheet/engine"
)

// version is set at link time by the page assembler (-X main.version=...).
var version = "dev"

// session holds the page's own worksheet as it is edited live: changes(worksheet, base) and analysis().
var session engine.Session

func main() {
	js.Global().Set("gibbsheet", api())
	select {} // keep the functions alive for the life of the page
}

// api builds the object {evaluate, changes, analysis, compounds, csv, version} that the page calls.
func api() js.Value {
	evaluate := guard(func(args []js.Value) (any, error) {
		if len(args) != 1 || args[0].Type() != js.TypeString {
			return nil, errors.New("gibbsheet.evaluate needs one argument: the worksheet document as JSON text")
		}
		out, err := engine.EvaluateJSON([]byte(args[0].String()))
		if err != nil {
			return nil, err
		}
		return string(out), nil
	})
	changes := guard(func(args []js.Value) (any, error) {
		if len(args) != 2 || args[0].Type() != js.TypeString || args[1].Type() != js.TypeNumber {
			return nil, errors.New("gibbsheet.changes needs the worksheet document as JSON text and the number of the answer the page holds (0 for none)")
		}
		out, err := session.ChangesJSON([]byte(args[0].String()), args[1].Int())
		if err != nil {
			return nil, err
		}
		return string(out), nil
	})
	analysis := guard(func(args []js.Value) (any, error) {
		if len(args) != 0 {
			return nil, errors.New("gibbsheet.analysis takes no argument: it analyses the worksheet of the latest changes")
		}
		out, err := session.AnalysisJSON()
		if err != nil {
			return nil, err
		}
		return string(out), nil
	})
	compounds := guard(func([]js.Value) (any, error) {
		return engine.CompoundsJSON(), nil
	})
	obj := js.Global().Get("Object").New()
	obj.Set("evaluate", throwing(evaluate))
	obj.Set("changes", throwing(changes))
	obj.Set("analysis", throwing(analysis))
	obj.Set("compounds", throwing(compounds))
	obj.Set("csv", throwing(guard(table)))
	obj.Set("version", version)
	return obj
}

// guard wraps fn so that a returned error or a panic comes back as a JavaScript Error value (a Go
// callback cannot throw by itself; throwing makes the wrapper throw it).
func guard(fn func(args []js.Value) (any, error)) js.Func {
	errorCtor := js.Global().Get("Error")
	return js.FuncOf(func(_ js.Value, args []js.Value) (ret any) {
		defer func() {
			if p := recover(); p != nil {
				ret = errorCtor.New("internal error in the engine: " + panicText(p))
			}
		}()
		v, err := fn(args)
		if err != nil {
			return errorCtor.New(err.Error())
		}
		return v
	})
}

// table is gibbsheet.csv(worksheet[, separator]): the results table of engine.ResultsTable, comma-separated
// (CSV) unless the separator is given ("\t" for the clipboard).
func table(args []js.Value) (any, error) {
	if len(args) < 1 || len(args) > 2 || args[0].Type() != js.TypeString {
		return nil, errors.New("gibbsheet.csv needs the worksheet document as JSON text and, optionally, a separator")
	}
	sep := ','
	if len(args) == 2 {
		s := []rune(args[1].String())
		if args[1].Type() != js.TypeString || len(s) != 1 || !strings.ContainsRune(",;\t", s[0]) {
			return nil, errors.New(`gibbsheet.csv: the separator must be ",", ";" or a tab`)
		}
		sep = s[0]
	}
	out, err := engine.ResultsTable([]byte(args[0].String()), sep)
	if err != nil {
		return nil, err
	}
	return string(out), nil
}

// throwing returns a JavaScript function that calls f and throws the Error values f returns. In the page
// the wrapper comes from globalThis.gibbsheetThrowing, which js/engine.js defines before starting the
// engine: the page's Content-Security-Policy forbids making functions from text. Elsewhere (Node, the
// tests) it is made with the Function constructor.
func throwing(f js.Func) js.Value {
	if w := js.Global().Get("gibbsheetThrowing"); w.Type() == js.TypeFunction {
		return w.Invoke(f)
	}
	wrap := js.Global().Get("Function").New("f",
		`return function (...args) { const r = f(...args); if (r instanceof Error) throw r; return r; };`)
	return wrap.Invoke(f)
}

// panicText describes a recovered panic value without package fmt, which the engine leaves out of the
// WebAssembly module to keep it small.
func panicText(p any) string {
	switch v := p.(type) {
	case error:
		return v.Error()
	case string:
		return v
	case interface{ String() string }:
		return v.String()
	}
	return "an unexpected failure"
}
