#!/bin/sh
# Builds the worker the way github.com/syumai/workers builds for Workers: its assets generator writes the
# JavaScript glue (worker.mjs, runtime.mjs, wasm_exec.js) into OUT, then the Go program is compiled with
# GOOS=js GOARCH=wasm to OUT/app.wasm, embedding the page PAGE.
#
#   build.sh PAGE [OUT]     PAGE: the single-file page (dist/gibbsheet.html); OUT: default build/ beside this script
#
# The go command is $GO when set.
set -eu
if [ $# -lt 1 ] || [ $# -gt 2 ]; then
  echo "usage: build.sh PAGE [OUT]" >&2
  exit 2
fi
page=$1
here=$(cd "$(dirname "$0")" && pwd)
out=${2:-$here/build}
if [ ! -f "$page" ]; then
  echo "build.sh: the page $page does not exist; build it first (go run ./web/cmd/gibbsheet-html -o dist/gibbsheet.html)" >&2
  exit 1
fi
case $out in /*) ;; *) out=$(pwd)/$out ;; esac
cp "$page" "$here/page/gibbsheet.html"
cd "$here"
go=${GO:-go}
"$go" run github.com/syumai/workers/cmd/workers-assets-gen -mode=go -o "$out"
GOOS=js GOARCH=wasm "$go" build -trimpath -o "$out/app.wasm" .
