// Package assemble builds the worksheet page as one self-contained HTML file: the style sheet, the
// page's markup, the initial worksheet and the engine's result for it as inert JSON, the page's
// JavaScript modules joined into one script, which shows that worksheet and result as soon as it is read,
// and after it the engine compiled to WebAssembly (gzip -9, written as text 7 bits to a character by
// Text7, inflated in the page with DecompressionStream), Go's wasm_exec.js from the same toolchain and the
// script that starts the engine. The file needs no server and no network.
package assemble

import (
	"bytes"
	"compress/gzip"
	_ "embed"
	"fmt"
	"io/fs"
	"os"
	"os/exec"
	"path/filepath"
	"strings"

	"gibbsheet/web"
	"gibbsheet/web/inject"
)

// Options say where the parts of the page come from. The zero value builds from the module that holds
// the working directory, with the demo worksheet.
type Options struct {
	Root    string // module root (the folder of go.mod); "" finds it with `go env GOMOD`
	Demo    string // initial worksheet file; "" means Root/pathways/demo.json
	Go      string // go command; "" means "go" on PATH
	Version string // shown in the page and returned by gibbsheet.version; "" means "dev"
	// Zopfli compresses the module with the zopfli program (Debian package zopfli) instead of Go's
	// gzip -9: the same gzip format, about 4 % smaller, some 20 s slower. Build fails if it is missing.
	Zopfli bool
}

// Page is an assembled page.
type Page struct {
	HTML     []byte
	WasmSize int // bytes of the WebAssembly module
	GzipSize int // bytes of the module after gzip -9
}

// startScript starts the engine; it follows wasm_exec.js in the classic script after the engine's
// element at the end of the body (js/engine.js waits for it).
//
//go:embed start.js
var startScript string

// Markers in src/index.html, each replaced by one part of the page; each must occur exactly once.
const (
	markStyle     = "<!-- gibbsheet:style -->"
	markWorksheet = "<!-- gibbsheet:worksheet -->"
	markResult    = "<!-- gibbsheet:result -->"
	markWasm      = "<!-- gibbsheet:wasm -->"
	markWasmExec  = "<!-- gibbsheet:wasm_exec -->"
	markScript    = "<!-- gibbsheet:script -->"
)

// Build compiles the bridge (package gibbsheet/wasm/page) for GOOS=js GOARCH=wasm with
// -trimpath -ldflags="-s -w" and assembles the page.
func Build(opts Options) (*Page, error) {
	if opts.Go == "" {
		opts.Go = "go"
	}
	if opts.Version == "" {
		opts.Version = "dev"
	}
	if opts.Root == "" {
		gomod, err := goEnv(opts.Go, "", "GOMOD")
		if err != nil {
			return nil, err
		}
		if gomod == "" || gomod == os.DevNull {
			return nil, fmt.Errorf("assemble: the working directory is not inside the gibbsheet module; set Options.Root")
		}
		opts.Root = filepath.Dir(gomod)
	}
	builtInDemo := opts.Demo == "" // the page labels this worksheet as the invented demo
	if opts.Demo == "" {
		opts.Demo = filepath.Join(opts.Root, "pathways", "demo.json")
	}

	wasm, err := buildWasm(opts)
	if err != nil {
		return nil, err
	}
	gz, err := compress(wasm, opts.Zopfli)
	if err != nil {
		return nil, err
	}

	goroot, err := goEnv(opts.Go, opts.Root, "GOROOT")
	if err != nil {
		return nil, err
	}
	wasmExec, err := os.ReadFile(filepath.Join(goroot, "lib", "wasm", "wasm_exec.js"))
	if err != nil {
		return nil, fmt.Errorf("assemble: reading Go's wasm_exec.js: %w", err)
	}
	demo, err := os.ReadFile(opts.Demo)
	if err != nil {
		return nil, fmt.Errorf("assemble: reading the initial worksheet: %w", err)
	}
	if err := checkWorksheet(demo); err != nil {
		return nil, fmt.Errorf("assemble: %s: %w", opts.Demo, err)
	}
	worksheet, err := inject.Escape(demo)
	if err != nil {
		return nil, fmt.Errorf("assemble: %s: %w", opts.Demo, err)
	}
	saved, err := savedResult(worksheet)
	if err != nil {
		return nil, fmt.Errorf("assemble: %s: %w", opts.Demo, err)
	}

	templates, err := templatesElement()
	if err != nil {
		return nil, err
	}

	skeleton, err := fs.ReadFile(web.Sources, "src/index.html")
	if err != nil {
		return nil, err
	}
	style, err := fs.ReadFile(web.Sources, "src/style.css")
	if err != nil {
		return nil, err
	}
	script, err := bundle(web.Sources, "src/js", "main.js")
	if err != nil {
		return nil, fmt.Errorf("assemble: %w", err)
	}
	startLines := strings.Split(startScript, "\n")
	if err := checkLiterals("start.js", startLines); err != nil {
		return nil, fmt.Errorf("assemble: %w", err)
	}
	start := compact(startLines) + "\n"
	for name, text := range map[string]string{"wasm_exec.js": string(wasmExec), "start.js": start, "page script": script} {
		if strings.Contains(strings.ToLower(text), "</script") {
			return nil, fmt.Errorf("assemble: %s contains </script, which would end its element early", name)
		}
	}
	if strings.Contains(strings.ToLower(string(style)), "</style") {
		return nil, fmt.Errorf("assemble: style.css contains </style")
	}

	// The parts in the order they come in the page.
	parts := []struct{ mark, text string }{
		{markStyle, "<style>\n" + string(style) + "</style>"},
		{markWorksheet, `<script type="application/json" id="` + inject.ElementID + `">` + string(worksheet) + `</script>`},
		{markResult, `<script type="application/json" id="` + inject.ResultID + `">` + string(saved) + `</script>`},
		// A classic script, run as soon as the browser has read it, before the engine's text that follows
		// it: it shows the worksheet with its saved result while the engine starts (js/main.js).
		{markScript, `<script data-version="` + htmlAttr(opts.Version) + "\">\n" + script + "</script>"},
		{markTemplates, templates},
		{markWasm, `<script type="application/octet-stream" id="gs-engine" data-encoding="gzip+text7" data-length="` +
			fmt.Sprint(gz.Len()) + `">` + Text7(gz.Bytes()) + `</script>`},
		// wasm_exec.js and, after it, the script that starts the engine with it.
		{markWasmExec, "<script>\n" + string(wasmExec) + "\n" + start + "</script>"},
	}
	// fillPage (share.go) adds the Content-Security-Policy with the hashes of these scripts and the shell
	// from which the page saves itself, and puts each part in place of its marker.
	demoText := ""
	if builtInDemo {
		demoText = string(worksheet)
	}
	html, err := fillPage(string(skeleton), parts, demoText)
	if err != nil {
		return nil, err
	}
	return &Page{HTML: []byte(html), WasmSize: len(wasm), GzipSize: gz.Len()}, nil
}

// WriteFile builds the page and writes it to path, creating its folder.
func WriteFile(path string, opts Options) (*Page, error) {
	p, err := Build(opts)
	if err != nil {
		return nil, err
	}
	if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
		return nil, err
	}
	return p, os.WriteFile(path, p.HTML, 0o644)
}

func buildWasm(opts Options) ([]byte, error) {
	dir, err := os.MkdirTemp("", "gibbsheet-wasm-")
	if err != nil {
		return nil, err
	}
	defer os.RemoveAll(dir)
	out := filepath.Join(dir, "page.wasm")
	cmd := exec.Command(opts.Go, "build", "-trimpath",
		"-ldflags=-s -w -X main.version="+opts.Version, "-o", out, "./wasm/page")
	cmd.Dir = opts.Root
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm", "CGO_ENABLED=0")
	if msg, err := cmd.CombinedOutput(); err != nil {
		return nil, fmt.Errorf("assemble: building the WebAssembly module: %v\n%s", err, msg)
	}
	return os.ReadFile(out)
}

// compress returns data in gzip format: Go's compress/gzip at level 9, or the zopfli program's output.
func compress(data []byte, zopfli bool) (*bytes.Buffer, error) {
	var gz bytes.Buffer
	if zopfli {
		f, err := os.CreateTemp("", "gibbsheet-*.wasm")
		if err != nil {
			return nil, err
		}
		defer os.Remove(f.Name())
		_, err = f.Write(data)
		if cerr := f.Close(); err == nil {
			err = cerr
		}
		if err != nil {
			return nil, err
		}
		cmd := exec.Command("zopfli", "--i5", "-c", f.Name())
		cmd.Stdout = &gz
		var stderr bytes.Buffer
		cmd.Stderr = &stderr
		if err := cmd.Run(); err != nil {
			return nil, fmt.Errorf("assemble: zopfli: %v %s", err, stderr.String())
		}
		return &gz, nil
	}
	zw, _ := gzip.NewWriterLevel(&gz, gzip.BestCompression) // the level is valid, so no error
	zw.Write(data)
	if err := zw.Close(); err != nil {
		return nil, err
	}
	return &gz, nil
}

func goEnv(goCmd, dir, name string) (string, error) {
	cmd := exec.Command(goCmd, "env", name)
	cmd.Dir = dir
	out, err := cmd.Output()
	if err != nil {
		return "", fmt.Errorf("assemble: go env %s: %v", name, err)
	}
	return strings.TrimSpace(string(out)), nil
}

func htmlAttr(s string) string {
	return strings.NewReplacer("&", "&amp;", `"`, "&quot;", "<", "&lt;", ">", "&gt;").Replace(s)
}
