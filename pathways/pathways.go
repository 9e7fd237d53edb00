// Package pathways holds the ready worksheets users start from: glycolysis, gluconeogenesis, the citric
// acid cycle and other textbook pathways, each a worksheet document (format gibbsheet-worksheet/1) embedded
// from this directory. Every template's net reaction, energy budget and far-from-equilibrium steps are
// checked against textbooks in the package's tests.
//
// A template's one-line description for the picker (its Summary) is the first line of the worksheet's
// "notes": notes begin with that line, a newline, then the rest (per what the worksheet is written, its
// sources, what comes out uphill and why). A worksheet without notes is summarised by its title.
package pathways

import (
	"embed"
	"errors"
	"fmt"
	"io/fs"
	"slices"
	"strings"

	"gibbsheet/engine"
)

//go:embed *.json
var files embed.FS

// demoFile is the invented demonstration worksheet, kept in this directory but not a template.
const demoFile = "demo.json"

// Template is one ready worksheet.
type Template struct {
	File    string // file name, e.g. "glycolysis.json"
	Title   string // the worksheet's title
	Summary string // one line for a searchable picker: the first line of the notes
	Doc     []byte // the worksheet document as stored
}

// ErrNotFound is returned by Get for a file name that is not a template.
var ErrNotFound = errors.New("no such pathway template")

// All returns every template sorted by file name, without the demo worksheet. The error reports embedded
// documents that are not readable worksheets, lack a title, or contain fields the format does not define;
// the package's tests keep it nil.
func All() ([]Template, error) {
	names, err := fs.Glob(files, "*.json")
	if err != nil {
		return nil, err
	}
	slices.Sort(names)
	var out []Template
	var errs []error
	for _, name := range names {
		if name == demoFile {
			continue
		}
		t, err := read(name)
		if err != nil {
			errs = append(errs, err)
			continue
		}
		out = append(out, t)
	}
	return out, errors.Join(errs...)
}

// Get returns the template stored under a file name ("glycolysis.json"); ErrNotFound when there is none.
func Get(file string) (Template, error) {
	if file == demoFile || !strings.HasSuffix(file, ".json") || strings.Contains(file, "/") {
		return Template{}, fmt.Errorf("%w: %q", ErrNotFound, file)
	}
	if _, err := fs.Stat(files, file); err != nil {
		return Template{}, fmt.Errorf("%w: %q", ErrNotFound, file)
	}
	return read(file)
}

// read loads and checks one embedded worksheet.
func read(name string) (Template, error) {
	doc, err := files.ReadFile(name)
	if err != nil {
		return Template{}, err
	}
	ws, unknown, err := engine.Decode(doc)
	if err != nil {
		return Template{}, fmt.Errorf("pathway %s: %w", name, err)
	}
	if len(unknown) > 0 {
		return Template{}, fmt.Errorf("pathway %s: fields not in the worksheet format: %s", name, strings.Join(unknown, ", "))
	}
	title := strings.TrimSpace(ws.Title)
	if title == "" {
		return Template{}, fmt.Errorf("pathway %s: the worksheet has no title", name)
	}
	return Template{File: name, Title: title, Summary: Summary(ws.Notes, title), Doc: doc}, nil
}

// Summary returns the one-line description of a worksheet: the first non-empty line of its notes, or its
// title when the notes are empty.
func Summary(notes, title string) string {
	for line := range strings.SplitSeq(notes, "\n") {
		if s := strings.TrimSpace(line); s != "" {
			return s
		}
	}
	return strings.TrimSpace(title)
}
