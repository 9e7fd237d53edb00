//go:build js && wasm

// Command worker is Gibbsheet's edge service for the Workers runtime: package service served with
// github.com/syumai/workers, worksheets kept in the KV namespace bound as WORKSHEETS. Build it with
// build.sh, which embeds the single-file page and writes the runtime's glue next to app.wasm.
package main

import (
	"embed"

	"github.com/syumai/workers"

	"gibbsheet/wasm/worker/service"
)

// pageFile is the single-file page that build.sh copies here from dist/ before compiling.
const pageFile = "page/gibbsheet.html"

//go:embed page
var pageFS embed.FS

// main panics when the worker was built without a usable page, a fault of the build that build.sh prevents.
func main() {
	page, err := pageFS.ReadFile(pageFile)
	if err != nil {
		panic("worker built without the page; build it with build.sh: " + err.Error())
	}
	h, err := service.New(page, kvStore{binding: binding})
	if err != nil {
		panic(err)
	}
	workers.Serve(h)
}
