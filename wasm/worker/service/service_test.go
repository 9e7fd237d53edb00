package service_test

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"net/http"
	"net/http/httptest"
	"strings"
	"testing"

	"gibbsheet/engine"
	"gibbsheet/wasm/worker/service"
	"gibbsheet/web/inject"
)

// testPage is the smallest page the service accepts, a head and the worksheet element, with the element
// of the result saved with the worksheet.
const testPage = `<!doctype html><html><head><title>t</title></head><body>` +
	`<script type="application/json" id="` + inject.ElementID + `">{}</script>` +
	`<script type="application/json" id="` + inject.ResultID + `">null</script></body></html>`

// worksheet is a small valid worksheet document (its chemistry is not under test here).
const worksheet = `{"format": "gibbsheet-worksheet/1", "title": "hexokinase",
 "conditions": {"pH": 7, "ionicStrength": 0.25, "pMg": null, "temperature": 298.15},
 "rows": [{"id": "r1", "equation": "ATP + glucose = ADP + glucose 6-phosphate"}]}`

// memStore is a MemoryStore that counts its writes; fail, when set, is returned by every call instead.
type memStore struct {
	service.MemoryStore
	puts int
	fail error
}

func (s *memStore) Get(id string) ([]byte, error) {
	if s.fail != nil {
		return nil, s.fail
	}
	return s.MemoryStore.Get(id)
}

func (s *memStore) Put(id string, doc []byte) error {
	if s.fail != nil {
		return s.fail
	}
	s.puts++
	return s.MemoryStore.Put(id, doc)
}

func newHandler(t testing.TB, st service.Store) http.Handler {
	t.Helper()
	h, err := service.New([]byte(testPage), st)
	if err != nil {
		t.Fatal(err)
	}
	return h
}

func do(h http.Handler, method, path string, body []byte) *httptest.ResponseRecorder {
	var r *http.Request
	if body == nil {
		r = httptest.NewRequest(method, path, nil)
	} else {
		r = httptest.NewRequest(method, path, bytes.NewReader(body))
	}
	w := httptest.NewRecorder()
	h.ServeHTTP(w, r)
	return w
}

// checkError checks that an error answer has the status and a JSON body {"error": message}.
func checkError(t *testing.T, w *httptest.ResponseRecorder, status int) {
	t.Helper()
	if w.Code != status {
		t.Fatalf("status %d, want %d; body %s", w.Code, status, w.Body)
	}
	if ct := w.Header().Get("Content-Type"); ct != "application/json" {
		t.Errorf("Content-Type %q, want application/json", ct)
	}
	var e service.Error
	if err := json.Unmarshal(w.Body.Bytes(), &e); err != nil || e.Message == "" {
		t.Errorf("body %q is not {\"error\": message} (%v)", w.Body, err)
	}
}

func TestErrors(t *testing.T) {
	big := bytes.Repeat([]byte(" "), service.MaxBody+1)
	unknown := service.ID([]byte("not stored"))
	tests := []struct {
		name, method, path string
		body               []byte
		status             int
		allow              string
	}{
		{"evaluate not JSON", "POST", "/v1/evaluate", []byte("ATP = ADP"), 400, ""},
		{"evaluate no format", "POST", "/v1/evaluate", []byte(`{"rows": []}`), 400, ""},
		{"evaluate empty", "POST", "/v1/evaluate", []byte(""), 400, ""},
		{"evaluate no body", "POST", "/v1/evaluate", nil, 400, ""},
		{"evaluate too large", "POST", "/v1/evaluate", big, 413, ""},
		{"publish too large", "POST", "/v1/worksheets", big, 413, ""},
		{"publish not JSON", "POST", "/v1/worksheets", []byte("{"), 400, ""},
		{"publish wrong format", "POST", "/v1/worksheets", []byte(`{"format": "other/9"}`), 400, ""},
		{"publish not UTF-8", "POST", "/v1/worksheets",
			[]byte("{\"format\": \"gibbsheet-worksheet/1\", \"title\": \"\xff\"}"), 400, ""},
		{"unknown id", "GET", "/v1/worksheets/" + unknown, nil, 404, ""},
		{"malformed id", "GET", "/v1/worksheets/..%2fx", nil, 404, ""},
		{"empty id", "GET", "/v1/worksheets/", nil, 404, ""},
		{"unknown page id", "GET", "/w/" + unknown, nil, 404, ""},
		{"unknown path", "GET", "/v2/evaluate", nil, 404, ""},
		{"GET evaluate", "GET", "/v1/evaluate", nil, 405, "POST"},
		{"PUT worksheets", "PUT", "/v1/worksheets", []byte(worksheet), 405, "POST"},
		{"POST page", "POST", "/", []byte(worksheet), 405, "GET, HEAD"},
		{"DELETE worksheet", "DELETE", "/v1/worksheets/" + unknown, nil, 405, "GET, HEAD"},
		{"POST worksheet page", "POST", "/w/" + unknown, nil, 405, "GET, HEAD"},
	}
	h := newHandler(t, &memStore{})
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			w := do(h, tt.method, tt.path, tt.body)
			checkError(t, w, tt.status)
			if got := w.Header().Get("Allow"); got != tt.allow {
				t.Errorf("Allow %q, want %q", got, tt.allow)
			}
		})
	}
}

func TestEvaluate(t *testing.T) {
	w := do(newHandler(t, &memStore{}), "POST", "/v1/evaluate", []byte(worksheet))
	if w.Code != 200 {
		t.Fatalf("status %d: %s", w.Code, w.Body)
	}
	var res struct {
		Rows []struct{ ID string } `json:"rows"`
	}
	if err := json.Unmarshal(w.Body.Bytes(), &res); err != nil {
		t.Fatal(err)
	}
	if len(res.Rows) != 1 || res.Rows[0].ID != "r1" {
		t.Errorf("rows %+v, want the one row r1", res.Rows)
	}
}

func TestPublish(t *testing.T) {
	st := &memStore{}
	h := newHandler(t, st)
	doc := []byte(worksheet)
	first := do(h, "POST", "http://example.org/v1/worksheets", doc)
	if first.Code != http.StatusCreated {
		t.Fatalf("first publish: status %d: %s", first.Code, first.Body)
	}
	var pub service.Published
	if err := json.Unmarshal(first.Body.Bytes(), &pub); err != nil {
		t.Fatal(err)
	}
	id := service.ID(doc)
	if pub.ID != id || pub.URL != "http://example.org/w/"+id {
		t.Errorf("published %+v, want id %s at http://example.org/w/%[2]s", pub, id)
	}
	again := do(h, "POST", "http://example.org/v1/worksheets", doc)
	if again.Code != http.StatusOK || again.Body.String() != first.Body.String() {
		t.Errorf("second publish: status %d body %s, want 200 and %s", again.Code, again.Body, first.Body)
	}
	if st.puts != 1 {
		t.Errorf("%d puts, want 1: the same document is stored once", st.puts)
	}

	got := do(h, "GET", "/v1/worksheets/"+id, nil)
	if got.Code != 200 || !bytes.Equal(got.Body.Bytes(), doc) {
		t.Errorf("GET: status %d body %q, want the document exactly as sent", got.Code, got.Body)
	}
	head := do(h, "HEAD", "/v1/worksheets/"+id, nil)
	if head.Code != 200 || head.Body.Len() != 0 {
		t.Errorf("HEAD: status %d with %d body bytes, want 200 and none", head.Code, head.Body.Len())
	}

	page := do(h, "GET", "/w/"+id, nil)
	if page.Code != 200 || !strings.HasPrefix(page.Header().Get("Content-Type"), "text/html") {
		t.Fatalf("page: status %d, Content-Type %q", page.Code, page.Header().Get("Content-Type"))
	}
	embedded, err := inject.Extract(page.Body.Bytes())
	if err != nil {
		t.Fatal(err)
	}
	if want, _ := inject.Escape(doc); !bytes.Equal(embedded, want) {
		t.Errorf("page carries %s, want %s", embedded, want)
	}
	// The page carries the engine's result for the worksheet, which it shows while its engine starts.
	result, err := engine.EvaluateJSON(doc)
	if err != nil {
		t.Fatal(err)
	}
	if want, _ := inject.Result(embedded, result); !bytes.Contains(page.Body.Bytes(), want) {
		t.Errorf("the page does not carry the worksheet's result %.200s…", want)
	}
	if !strings.Contains(page.Body.String(), service.Marker) {
		t.Error("the worksheet page has no service marker")
	}

	spaced := append([]byte(worksheet), '\n')
	other := do(h, "POST", "/v1/worksheets", spaced)
	if other.Code != http.StatusCreated || strings.Contains(other.Body.String(), id) {
		t.Errorf("a document differing in white space: status %d body %s, want 201 and a new id", other.Code, other.Body)
	}
}

func TestNeverOverwrites(t *testing.T) {
	doc := []byte(worksheet)
	st := &memStore{}
	st.MemoryStore.Put(service.ID(doc), []byte(`{"format":"gibbsheet-worksheet/1"}`))
	checkError(t, do(newHandler(t, st), "POST", "/v1/worksheets", doc), http.StatusConflict)
	if st.puts != 0 {
		t.Errorf("%d puts, want none", st.puts)
	}
}

func TestStorageDown(t *testing.T) {
	h := newHandler(t, &memStore{fail: errors.New("namespace not bound")})
	id := service.ID([]byte(worksheet))
	for _, r := range []struct{ method, path string }{
		{"POST", "/v1/worksheets"}, {"GET", "/v1/worksheets/" + id}, {"GET", "/w/" + id},
	} {
		w := do(h, r.method, r.path, []byte(worksheet))
		checkError(t, w, http.StatusServiceUnavailable)
		if !strings.Contains(w.Body.String(), "namespace not bound") {
			t.Errorf("%s %s: %s does not say why", r.method, r.path, w.Body)
		}
	}
	if w := do(h, "POST", "/v1/evaluate", []byte(worksheet)); w.Code != 200 {
		t.Errorf("evaluate while storage is down: status %d, want 200", w.Code)
	}
	if w := do(h, "GET", "/", nil); w.Code != 200 {
		t.Errorf("page while storage is down: status %d, want 200", w.Code)
	}
}

func TestPage(t *testing.T) {
	h := newHandler(t, &memStore{})
	w := do(h, "GET", "/", nil)
	want, _ := service.MarkPage([]byte(testPage))
	if w.Code != 200 || !bytes.Equal(w.Body.Bytes(), want) {
		t.Errorf("GET /: status %d body %s, want 200 and %s", w.Code, w.Body, want)
	}
	if n := w.Header().Get("Content-Length"); n != fmt.Sprint(len(want)) {
		t.Errorf("Content-Length %s, want %d", n, len(want))
	}
	if w := do(h, "HEAD", "/", nil); w.Code != 200 || w.Body.Len() != 0 {
		t.Errorf("HEAD /: status %d with %d body bytes, want 200 and none", w.Code, w.Body.Len())
	}
}

func TestNewRejectsPages(t *testing.T) {
	for _, page := range []string{
		`<html><head></head><body>no worksheet element</body></html>`,
		`<html><body><script type="application/json" id="` + inject.ElementID + `">{}</script></body></html>`,
	} {
		if _, err := service.New([]byte(page), &memStore{}); err == nil {
			t.Errorf("New accepted %s", page)
		}
	}
}

func TestMarkPage(t *testing.T) {
	m := service.Marker
	tests := []struct{ in, want string }{
		{"<head><title>x</title></head>", "<head>" + m + "<title>x</title></head>"},
		{"<!doctype html><HEAD lang=en>\n<meta>", "<!doctype html><HEAD lang=en>" + m + "\n<meta>"},
		{"<header></header><head>", "<header></header><head>" + m},
		{"<head\n>", "<head\n>" + m},
		// A served page may reach its own origin to publish; every other source stays closed.
		{`<head><meta http-equiv="Content-Security-Policy" content="default-src 'none'; connect-src 'none'">`,
			`<head>` + m + `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; connect-src 'self'">`},
	}
	for _, tt := range tests {
		got, err := service.MarkPage([]byte(tt.in))
		if err != nil || string(got) != tt.want {
			t.Errorf("MarkPage(%q) = %q, %v; want %q", tt.in, got, err, tt.want)
		}
	}
	for _, in := range []string{"", "<body></body>", "<header>", "<head"} {
		if _, err := service.MarkPage([]byte(in)); !errors.Is(err, service.ErrNoHead) {
			t.Errorf("MarkPage(%q): error %v, want ErrNoHead", in, err)
		}
	}
}

func TestID(t *testing.T) {
	// SHA-256("abc") = ba7816bf 8f01cfea 414140de 5dae2223 b00361a3 96177a9c b410ff61 f20015ad
	// (FIPS 180-2, appendix B.1); its first 16 bytes in unpadded base64url (RFC 4648 §5):
	const want = "ungWv48Bz-pBQUDeXa4iIw"
	if got := service.ID([]byte("abc")); got != want {
		t.Errorf("ID(abc) = %s, want %s", got, want)
	}
	if !service.ValidID(want) {
		t.Errorf("ValidID(%s) = false", want)
	}
	for _, s := range []string{"", want[:21], want + "A", "ungWv48Bz+pBQUDeXa4iIw", "ungWv48Bz-pBQUDeXa4iIx", "../../../../etc/passwd"} {
		if service.ValidID(s) {
			t.Errorf("ValidID(%q) = true", s)
		}
	}
}
