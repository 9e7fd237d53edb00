//go:build !js

package main_test

import (
	"bytes"
	"encoding/json"
	"net/http"
	"os"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"

	"gibbsheet/engine"
	"gibbsheet/wasm/worker/service"
	"gibbsheet/web/inject"
)

// sameEngine is how far the worker's numbers may be from the engine's run natively: the same Go code, but
// the math package's assembly on the host and pure Go in WebAssembly may differ in the last bits.
const sameEngine = 1e-12

func readWorksheet(t testing.TB) []byte {
	t.Helper()
	doc, err := os.ReadFile("testdata/hexokinase.json")
	if err != nil {
		t.Fatal(err)
	}
	return doc
}

// checkJSONError checks status and that the body is {"error": message}.
func checkJSONError(t *testing.T, resp *http.Response, body []byte, status int) {
	t.Helper()
	if resp.StatusCode != status {
		t.Fatalf("status %d, want %d; body %s", resp.StatusCode, status, body)
	}
	var e service.Error
	if err := json.Unmarshal(body, &e); err != nil || e.Message == "" {
		t.Errorf("body %q is not {\"error\": message} (%v)", body, err)
	}
	if ct := resp.Header.Get("Content-Type"); ct != "application/json" {
		t.Errorf("Content-Type %q, want application/json", ct)
	}
}

func TestPage(t *testing.T) {
	resp, body, err := call("GET", withKV.base+"/", nil)
	if err != nil {
		t.Fatal(err)
	}
	if resp.StatusCode != 200 || resp.Header.Get("Content-Type") != "text/html; charset=utf-8" {
		t.Fatalf("status %d, Content-Type %q", resp.StatusCode, resp.Header.Get("Content-Type"))
	}
	if !bytes.Contains(body, []byte(service.Marker)) {
		t.Error("the page has no service marker")
	}
	if _, err := inject.Extract(body); err != nil {
		t.Error(err)
	}
	resp, body, err = call("HEAD", withKV.base+"/", nil)
	if err != nil || resp.StatusCode != 200 || len(body) != 0 {
		t.Errorf("HEAD /: %v, %v, %d body bytes; want 200 and none", resp.Status, err, len(body))
	}
}

func TestEvaluate(t *testing.T) {
	doc := readWorksheet(t)
	resp, body, err := call("POST", withKV.base+"/v1/evaluate", bytesBody(doc))
	if err != nil {
		t.Fatal(err)
	}
	if resp.StatusCode != 200 {
		t.Fatalf("status %d: %s", resp.StatusCode, body)
	}
	checkAgainstEngine(t, doc, body)
}

// checkAgainstEngine checks the worker's result for doc against the engine's run natively.
func checkAgainstEngine(tb testing.TB, doc, result []byte) {
	tb.Helper()
	native, err := engine.EvaluateJSON(doc)
	if err != nil {
		tb.Fatal(err)
	}
	var want, got any
	if err := json.Unmarshal(native, &want); err != nil {
		tb.Fatal(err)
	}
	if err := json.Unmarshal(result, &got); err != nil {
		tb.Fatalf("the worker's result is not JSON: %v", err)
	}
	if diff := cmp.Diff(want, got, cmpopts.EquateApprox(sameEngine, 0)); diff != "" {
		tb.Errorf("the worker's result differs from the engine's (-want +got):\n%s", diff)
	}
}

func TestPublish(t *testing.T) {
	doc := readWorksheet(t)
	id := service.ID(doc)
	link := withKV.base + "/w/" + id
	for i, status := range []int{http.StatusCreated, http.StatusOK} { // stored, then already there
		resp, body, err := call("POST", withKV.base+"/v1/worksheets", bytesBody(doc))
		if err != nil {
			t.Fatal(err)
		}
		var pub service.Published
		if resp.StatusCode != status || json.Unmarshal(body, &pub) != nil || pub != (service.Published{ID: id, URL: link}) {
			t.Errorf("publish %d: status %d body %s; want %d and id %s, url %s", i+1, resp.StatusCode, body, status, id, link)
		}
	}

	resp, body, err := call("GET", withKV.base+"/v1/worksheets/"+id, nil)
	if err != nil {
		t.Fatal(err)
	}
	if resp.StatusCode != 200 || !bytes.Equal(body, doc) {
		t.Errorf("GET the document: status %d, body %q; want the document exactly as sent", resp.StatusCode, body)
	}

	resp, body, err = call("GET", link, nil)
	if err != nil {
		t.Fatal(err)
	}
	if resp.StatusCode != 200 || !strings.HasPrefix(resp.Header.Get("Content-Type"), "text/html") {
		t.Fatalf("GET %s: status %d, Content-Type %q", link, resp.StatusCode, resp.Header.Get("Content-Type"))
	}
	embedded, err := inject.Extract(body)
	if err != nil {
		t.Fatal(err)
	}
	if want, _ := inject.Escape(doc); !bytes.Equal(embedded, want) {
		t.Errorf("the page carries %s, want %s", embedded, want)
	}
	if !bytes.Contains(body, []byte(service.Marker)) {
		t.Error("the worksheet's page has no service marker")
	}
}

// TestPublishLarge stores a document just under the body limit and gets it back unchanged.
func TestPublishLarge(t *testing.T) {
	doc := readWorksheet(t)
	filler := strings.Repeat("Δ", (service.MaxBody-len(doc)-16)/len("Δ"))
	doc = bytes.Replace(doc, []byte(`"notes": "`), []byte(`"notes": "`+filler), 1)
	resp, body, err := call("POST", withKV.base+"/v1/worksheets", bytesBody(doc))
	if err != nil {
		t.Fatal(err)
	}
	if resp.StatusCode != http.StatusCreated {
		t.Fatalf("publish %d bytes: status %d: %s", len(doc), resp.StatusCode, body)
	}
	resp, body, err = call("GET", withKV.base+"/v1/worksheets/"+service.ID(doc), nil)
	if err != nil {
		t.Fatal(err)
	}
	if resp.StatusCode != 200 || !bytes.Equal(body, doc) {
		t.Errorf("GET: status %d, %d bytes; want the %d bytes sent", resp.StatusCode, len(body), len(doc))
	}
}

func TestErrors(t *testing.T) {
	big := bytes.Repeat([]byte(" "), service.MaxBody+1)
	unknown := service.ID([]byte("never stored"))
	doc := readWorksheet(t)
	tests := []struct {
		name, method, path string
		body               func() []byte
		chunked            bool
		status             int
	}{
		{"evaluate not JSON", "POST", "/v1/evaluate", func() []byte { return []byte("ATP = ADP") }, false, 400},
		{"evaluate no format", "POST", "/v1/evaluate", func() []byte { return []byte(`{"rows": []}`) }, false, 400},
		{"evaluate empty", "POST", "/v1/evaluate", func() []byte { return nil }, false, 400},
		{"publish not a worksheet", "POST", "/v1/worksheets", func() []byte { return []byte(`[1, 2]`) }, false, 400},
		{"publish not UTF-8", "POST", "/v1/worksheets",
			func() []byte { return bytes.Replace(doc, []byte("Δ"), []byte{0xff}, 1) }, false, 400},
		{"unknown id", "GET", "/v1/worksheets/" + unknown, nil, false, 404},
		{"malformed id", "GET", "/v1/worksheets/not-an-id", nil, false, 404},
		{"unknown page id", "GET", "/w/" + unknown, nil, false, 404},
		{"unknown path", "GET", "/v1/nothing", nil, false, 404},
		{"GET evaluate", "GET", "/v1/evaluate", nil, false, 405},
		{"GET worksheets", "GET", "/v1/worksheets", nil, false, 405},
		{"PUT worksheet", "PUT", "/v1/worksheets/" + unknown, func() []byte { return doc }, false, 405},
		{"POST page", "POST", "/", func() []byte { return doc }, false, 405},
		{"DELETE worksheet page", "DELETE", "/w/" + unknown, nil, false, 405},
		{"evaluate too large", "POST", "/v1/evaluate", func() []byte { return big }, false, 413},
		{"evaluate too large, chunked", "POST", "/v1/evaluate", func() []byte { return big }, true, 413},
		{"publish too large", "POST", "/v1/worksheets", func() []byte { return big }, false, 413},
		{"publish too large, chunked", "POST", "/v1/worksheets", func() []byte { return big }, true, 413},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			var body []byte
			if tt.body != nil {
				body = tt.body()
			}
			r := bytesBody(body)
			if tt.chunked {
				r = stream{r}
			}
			resp, got, err := call(tt.method, withKV.base+tt.path, r)
			if err != nil {
				t.Fatal(err)
			}
			checkJSONError(t, resp, got, tt.status)
			if tt.status == 405 && resp.Header.Get("Allow") == "" {
				t.Error("405 without an Allow header")
			}
		})
	}
}

// TestStorageUnavailable runs against the instance whose KV binding is absent: storing and fetching fail
// with 503, the page and evaluation go on working.
func TestStorageUnavailable(t *testing.T) {
	doc := readWorksheet(t)
	id := service.ID(doc)
	for _, r := range []struct{ method, path string }{
		{"POST", "/v1/worksheets"}, {"GET", "/v1/worksheets/" + id}, {"GET", "/w/" + id},
	} {
		resp, body, err := call(r.method, withoutKV.base+r.path, requestBody(r.method, doc))
		if err != nil {
			t.Fatal(err)
		}
		checkJSONError(t, resp, body, http.StatusServiceUnavailable)
		if !bytes.Contains(body, []byte("WORKSHEETS")) {
			t.Errorf("%s %s: %s does not name the missing binding", r.method, r.path, body)
		}
	}
	for _, r := range []struct{ method, path string }{{"POST", "/v1/evaluate"}, {"GET", "/"}} {
		resp, body, err := call(r.method, withoutKV.base+r.path, requestBody(r.method, doc))
		if err != nil {
			t.Fatal(err)
		}
		if resp.StatusCode != 200 {
			t.Errorf("%s %s without storage: status %d, want 200: %.200s", r.method, r.path, resp.StatusCode, body)
		}
	}
}
