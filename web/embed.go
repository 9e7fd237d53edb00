// Package web holds the sources of the worksheet page: one HTML skeleton, one style sheet and the
// JavaScript modules under src/. Package web/assemble turns them, the WebAssembly engine and the initial
// worksheet into the single self-contained file that users open.
package web

import "embed"

// Sources is the src/ folder: index.html, style.css and js/*.js.
//
//go:embed src
var Sources embed.FS
