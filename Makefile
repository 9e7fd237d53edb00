# Gibbsheet build and test targets. `make test` is what CI runs; `make run` is what a newcomer runs.
GO       ?= go
WASMEXEC := $(shell $(GO) env GOROOT)/lib/wasm
FUZZTIME ?= 5000x
WASMENV  := PATH="$(WASMEXEC):$$PATH" GOOS=js GOARCH=wasm

WRANGLER_ENV := WRANGLER_SEND_METRICS=false WRANGLER_HIDE_BANNER=true CLOUDFLARE_CF_FETCH_ENABLED=false

.PHONY: test vet fmt unit wasm-test fuzz bench html run designs worker-build worker-dev worker-bench

test: vet fmt unit wasm-test fuzz

vet:
	$(GO) vet ./...
	GOOS=js GOARCH=wasm $(GO) vet ./wasm/... ./engine/...

fmt:
	@out=$$(gofmt -l $$(git ls-files -co --exclude-standard '*.go')); \
	if [ -n "$$out" ]; then echo "not gofmt-formatted:"; echo "$$out"; exit 1; fi

unit:
	$(GO) test -count=1 ./...

# The engine's tests again, compiled to WebAssembly and run under Node, and the page's bridge.
wasm-test:
	$(WASMENV) $(GO) test -count=1 ./engine/... ./wasm/page

# Every fuzz target for $(FUZZTIME) (5,000 inputs: 1-5 s each here); a fuzz target is any
# `func FuzzX(f *testing.F)` in a _test.go file. A count rather than a duration: with a duration Go's
# fuzzing can end a clean run with "context deadline exceeded" when time runs out mid-input.
fuzz:
	@set -e; for f in $$(grep -rl --include='*_test.go' '^func Fuzz' engine web wasm 2>/dev/null); do \
	  dir=./$$(dirname $$f); \
	  for name in $$(grep -o '^func Fuzz[A-Za-z0-9_]*' $$f | cut -d' ' -f2); do \
	    echo "fuzz $$dir $$name"; \
	    $(GO) test -run='^$$' -fuzz="^$$name\$$" -fuzztime=$(FUZZTIME) $$dir; \
	  done; \
	done

# Benchmarks: the engine and the MDF solver natively, the page in headless Chromium, the edge service under
# load (2,000 requests at concurrency 8 against wrangler dev on 127.0.0.1).
bench: worker-bench
	$(GO) test -run='^$$' -bench=. -benchmem ./engine/...
	$(GO) test -run='^$$' -bench=. -benchtime=1x ./web/browser/

# The single-file page: the engine compiled to WebAssembly, gzipped and inlined with the page's sources.
# With Debian's zopfli installed the engine is compressed by it (about 6 % smaller, some 20 s slower).
ZOPFLI := $(if $(shell command -v zopfli),-zopfli,)

html:
	$(GO) run ./web/cmd/gibbsheet-html $(ZOPFLI) -o dist/gibbsheet.html

# Builds the page and serves it on http://127.0.0.1:8080 (the file also works opened from disk).
run:
	$(GO) run ./web/cmd/gibbsheet-html $(ZOPFLI) -o dist/gibbsheet.html -serve 127.0.0.1:8080

# One shareable file per pathway template, for pipelines that produce a file per design.
designs: html
	@mkdir -p dist/designs; for f in pathways/*.json; do \
	  $(GO) run ./web/cmd/gibbsheet-html -from dist/gibbsheet.html -worksheet $$f -o dist/designs/$$(basename $$f .json).html; \
	done

# The edge service (wasm/worker/README.md): built the way github.com/syumai/workers builds for Workers.
worker-build: html
	GO=$(GO) sh wasm/worker/build.sh dist/gibbsheet.html

# Runs the service locally on 127.0.0.1:8787, offline, with a local KV store.
worker-dev: worker-build
	@test -x wasm/worker/node_modules/.bin/wrangler || { echo "wrangler is not installed: run (cd wasm/worker && npm ci)"; exit 1; }
	cd wasm/worker && $(WRANGLER_ENV) node_modules/.bin/wrangler dev --local --ip 127.0.0.1 --port 8787

worker-bench:
	$(GO) test -count=1 -run='^$$' -bench=Load -benchtime=1x ./wasm/worker/
