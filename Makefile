# Gibbsheet build and test targets. `make test` is what CI runs; `make run` is what a newcomer runs.
GO       ?= go
WASMEXEC := $(shell $(GO) env GOROOT)/lib/wasm
FUZZTIME ?= 4s
WASMENV  := PATH="$(WASMEXEC):$$PATH" GOOS=js GOARCH=wasm

.PHONY: test vet fmt unit wasm-test fuzz bench html run

test: vet fmt unit wasm-test fuzz

vet:
	$(GO) vet ./...
	GOOS=js GOARCH=wasm $(GO) vet ./wasm/... ./engine/...

fmt:
	@out=$$(gofmt -l $$(git ls-files -co --exclude-standard '*.go')); \
	if [ -n "$$out" ]; then echo "not gofmt-formatted:"; echo "$$out"; exit 1; fi

unit:
	$(GO) test -count=1 ./...

# The engine's tests again, compiled to WebAssembly and run under Node.
wasm-test:
	$(WASMENV) $(GO) test -count=1 ./engine/...

# Every fuzz target for $(FUZZTIME); a fuzz target is any `func FuzzX(f *testing.F)` in a _test.go file.
fuzz:
	@set -e; for f in $$(grep -rl --include='*_test.go' '^func Fuzz' engine web wasm 2>/dev/null); do \
	  dir=./$$(dirname $$f); \
	  for name in $$(grep -o '^func Fuzz[A-Za-z0-9_]*' $$f | cut -d' ' -f2); do \
	    echo "fuzz $$dir $$name"; \
	    $(GO) test -run='^$$' -fuzz="^$$name\$$" -fuzztime=$(FUZZTIME) $$dir; \
	  done; \
	done

bench:
	$(GO) test -run='^$$' -bench=. -benchmem ./engine/...
