// Command gibbsheet-html writes the worksheet page as one self-contained HTML file and, with -serve,
// serves it on a local address as well (the file also works opened directly from disk).
//
//	gibbsheet-html -o dist/gibbsheet.html
//	gibbsheet-html -o dist/gibbsheet.html -serve 127.0.0.1:8080
package main

import (
	"flag"
	"fmt"
	"log"
	"net/http"
	"os"
	"path/filepath"

	"gibbsheet/web/assemble"
)

func main() {
	out := flag.String("o", "dist/gibbsheet.html", "file to write")
	serve := flag.String("serve", "", "after writing, serve the page on this address (e.g. 127.0.0.1:8080)")
	demo := flag.String("worksheet", "", "initial worksheet (default: pathways/demo.json of the module)")
	version := flag.String("version", "", "version text shown in the page (default \"dev\")")
	zopfli := flag.Bool("zopfli", false, "compress the engine with the zopfli program (about 4% smaller file, slower build)")
	from := flag.String("from", "", "put -worksheet into this already built page instead of building one (fast, for one file per design)")
	flag.Parse()
	log.SetFlags(0)
	log.SetPrefix("gibbsheet-html: ")
	if *from != "" {
		if err := fromPage(*from, *demo, *out); err != nil {
			log.Fatal(err)
		}
		return
	}

	p, err := assemble.WriteFile(*out, assemble.Options{Demo: *demo, Version: *version, Zopfli: *zopfli})
	if err != nil {
		log.Fatal(err)
	}
	abs, err := filepath.Abs(*out)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("wrote %s (%d bytes; engine %d bytes, %d gzipped)\n", abs, len(p.HTML), p.WasmSize, p.GzipSize)
	if *serve == "" {
		return
	}
	http.HandleFunc("/", func(w http.ResponseWriter, r *http.Request) {
		if r.URL.Path != "/" && r.URL.Path != "/gibbsheet.html" {
			http.NotFound(w, r)
			return
		}
		w.Header().Set("Content-Type", "text/html; charset=utf-8")
		w.Header().Set("Cache-Control", "no-store")
		http.ServeFile(w, r, abs)
	})
	fmt.Printf("serving the page on http://%s/ (file: %s); stop with Ctrl+C\n", *serve, abs)
	if err := http.ListenAndServe(*serve, nil); err != nil {
		fmt.Fprintln(os.Stderr, "gibbsheet-html:", err)
		os.Exit(1)
	}
}

// fromPage writes out: the page built earlier (from) holding the worksheet file ws.
func fromPage(from, ws, out string) error {
	if ws == "" {
		return fmt.Errorf("-from needs -worksheet, the worksheet to put in the page")
	}
	page, err := os.ReadFile(from)
	if err != nil {
		return err
	}
	doc, err := os.ReadFile(ws)
	if err != nil {
		return err
	}
	html, err := assemble.WithWorksheet(page, doc)
	if err != nil {
		return fmt.Errorf("%s: %w", ws, err)
	}
	if err := os.MkdirAll(filepath.Dir(out), 0o755); err != nil {
		return err
	}
	if err := os.WriteFile(out, html, 0o644); err != nil {
		return err
	}
	fmt.Printf("wrote %s (%d bytes) from %s\n", out, len(html), from)
	return nil
}
