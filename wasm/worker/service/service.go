// Package service is Gibbsheet's HTTP service: it serves the single-file page, evaluates worksheet
// documents with the engine, and publishes worksheets under ids derived from their content. It is plain
// net/http and knows nothing of the runtime it is served by; storage comes in as a Store.
package service

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"net/http"
	"strings"
	"unicode/utf8"

	"gibbsheet/engine"
	"gibbsheet/web/inject"
)

// MaxBody is the largest request body accepted, in bytes (1 MiB); a larger one is answered with 413.
const MaxBody = 1 << 20

// Paths of the service's endpoints. A worksheet's id follows WorksheetsPath+"/" or PagePath.
const (
	EvaluatePath   = "/v1/evaluate"
	WorksheetsPath = "/v1/worksheets"
	PagePath       = "/w/"
)

// Store keeps published worksheet documents. Any error other than ErrNotFound means the storage failed;
// the service answers it with 503 and keeps evaluating.
type Store interface {
	// Get returns the document stored under id, or ErrNotFound.
	Get(id string) ([]byte, error)
	// Put stores doc under id.
	Put(id string, doc []byte) error
}

// ErrNotFound is returned by a Store's Get when nothing is stored under the id.
var ErrNotFound = errors.New("no worksheet is stored under this id")

// Published is the answer to a POST of a worksheet.
type Published struct {
	ID  string `json:"id"`  // see ID
	URL string `json:"url"` // absolute address of the page with the worksheet loaded
}

// Error is the body of every error answer.
type Error struct {
	Message string `json:"error"`
}

type handler struct {
	page  []byte // the page as built, without the marker
	store Store
}

// New returns the service's handler. page is the single-file page (dist/gibbsheet.html); it must have a
// <head> element and the worksheet element of package inject, otherwise New returns an error.
func New(page []byte, store Store) (http.Handler, error) {
	if _, err := inject.Extract(page); err != nil {
		return nil, fmt.Errorf("service: %w", err)
	}
	if headEnd(page) < 0 {
		return nil, ErrNoHead
	}
	// The marker goes in as the page is sent: every request starts a new instance of the worker, and most
	// of them never send the page.
	return &handler{page: page, store: store}, nil
}

func (h *handler) ServeHTTP(w http.ResponseWriter, r *http.Request) {
	w.Header().Set("X-Content-Type-Options", "nosniff")
	p := r.URL.Path
	switch {
	case p == "/":
		if allow(w, r, http.MethodGet) {
			sendPage(w, r, h.page, "no-cache")
		}
	case p == EvaluatePath:
		if allow(w, r, http.MethodPost) {
			h.evaluate(w, r)
		}
	case p == WorksheetsPath:
		if allow(w, r, http.MethodPost) {
			h.publish(w, r)
		}
	case strings.HasPrefix(p, WorksheetsPath+"/"):
		if allow(w, r, http.MethodGet) {
			h.document(w, r, strings.TrimPrefix(p, WorksheetsPath+"/"))
		}
	case strings.HasPrefix(p, PagePath):
		if allow(w, r, http.MethodGet) {
			h.worksheetPage(w, r, strings.TrimPrefix(p, PagePath))
		}
	default:
		sendError(w, http.StatusNotFound, fmt.Sprintf("there is nothing at %s", p))
	}
}

// allow reports whether r's method is method (HEAD counts as GET); otherwise it answers 405.
func allow(w http.ResponseWriter, r *http.Request, method string) bool {
	if r.Method == method || (method == http.MethodGet && r.Method == http.MethodHead) {
		return true
	}
	allowed := method
	if method == http.MethodGet {
		allowed = "GET, HEAD"
	}
	w.Header().Set("Allow", allowed)
	sendError(w, http.StatusMethodNotAllowed,
		fmt.Sprintf("%s does not accept %s; use %s", r.URL.Path, r.Method, allowed))
	return false
}

func (h *handler) evaluate(w http.ResponseWriter, r *http.Request) {
	body, ok := readBody(w, r)
	if !ok {
		return
	}
	out, err := engine.EvaluateJSON(body)
	if err != nil {
		sendError(w, http.StatusBadRequest, err.Error())
		return
	}
	w.Header().Set("Cache-Control", "no-store")
	send(w, r, http.StatusOK, "application/json", out)
}

func (h *handler) publish(w http.ResponseWriter, r *http.Request) {
	doc, ok := readBody(w, r)
	if !ok {
		return
	}
	if !utf8.Valid(doc) {
		sendError(w, http.StatusBadRequest, "the worksheet is not valid UTF-8 text")
		return
	}
	if _, _, err := engine.Decode(doc); err != nil {
		sendError(w, http.StatusBadRequest, err.Error())
		return
	}
	id := ID(doc)
	status := http.StatusCreated
	switch old, err := h.store.Get(id); {
	case err == nil:
		if !bytes.Equal(old, doc) {
			// Two documents with one id: never overwrite; a 128-bit digest makes this all but impossible.
			sendError(w, http.StatusConflict, "a different worksheet is already stored under id "+id)
			return
		}
		status = http.StatusOK
	case errors.Is(err, ErrNotFound):
		if err := h.store.Put(id, doc); err != nil {
			storageError(w, err)
			return
		}
	default:
		storageError(w, err)
		return
	}
	link := origin(r) + PagePath + id
	w.Header().Set("Location", link)
	out, _ := json.Marshal(Published{ID: id, URL: link})
	send(w, r, status, "application/json", out)
}

func (h *handler) document(w http.ResponseWriter, r *http.Request, id string) {
	if doc, ok := h.load(w, id); ok {
		w.Header().Set("Cache-Control", "public, max-age=31536000, immutable")
		send(w, r, http.StatusOK, "application/json", doc)
	}
}

func (h *handler) worksheetPage(w http.ResponseWriter, r *http.Request, id string) {
	doc, ok := h.load(w, id)
	if !ok {
		return
	}
	// The page shows the saved result while its engine starts: a stored document is read by the engine,
	// which passed it before storing it, so an error here leaves the page to compute it alone.
	result, err := engine.EvaluateJSON(doc)
	if err != nil {
		result = nil
	}
	page, err := inject.Worksheet(h.page, doc, result)
	if err != nil { // stored documents passed engine.Decode, so they are JSON
		sendError(w, http.StatusInternalServerError, "cannot put the stored worksheet into the page: "+err.Error())
		return
	}
	sendPage(w, r, page, "public, max-age=31536000, immutable")
}

// load fetches the stored document of id, answering 404 or 503 itself when it cannot.
func (h *handler) load(w http.ResponseWriter, id string) ([]byte, bool) {
	if !ValidID(id) {
		sendError(w, http.StatusNotFound, fmt.Sprintf("%q is not a worksheet id", id))
		return nil, false
	}
	doc, err := h.store.Get(id)
	switch {
	case errors.Is(err, ErrNotFound):
		sendError(w, http.StatusNotFound, "no worksheet is stored under id "+id)
		return nil, false
	case err != nil:
		storageError(w, err)
		return nil, false
	}
	return doc, true
}

// readBody reads the whole request body, answering 413 when it is over MaxBody and 400 when it is empty.
func readBody(w http.ResponseWriter, r *http.Request) ([]byte, bool) {
	if r.ContentLength > MaxBody {
		sendError(w, http.StatusRequestEntityTooLarge, tooLarge(r.ContentLength))
		return nil, false
	}
	var body []byte
	if r.Body != nil {
		var err error
		body, err = io.ReadAll(io.LimitReader(r.Body, MaxBody+1))
		if err != nil {
			sendError(w, http.StatusBadRequest, "cannot read the request body: "+err.Error())
			return nil, false
		}
	}
	if len(body) > MaxBody {
		sendError(w, http.StatusRequestEntityTooLarge, tooLarge(-1))
		return nil, false
	}
	if len(bytes.TrimSpace(body)) == 0 {
		sendError(w, http.StatusBadRequest, "the request body is empty; send a worksheet document (JSON)")
		return nil, false
	}
	return body, true
}

func tooLarge(n int64) string {
	size := "over 1 MiB"
	if n > 0 {
		size = fmt.Sprintf("%d bytes", n)
	}
	return fmt.Sprintf("the request body is %s; the limit is %d bytes (1 MiB)", size, MaxBody)
}

func storageError(w http.ResponseWriter, err error) {
	w.Header().Set("Retry-After", "60")
	sendError(w, http.StatusServiceUnavailable,
		"worksheet storage is unavailable (evaluation still works): "+err.Error())
}

// origin is the scheme and host the request was addressed to, e.g. "https://example.org".
func origin(r *http.Request) string {
	if r.URL.IsAbs() {
		return r.URL.Scheme + "://" + r.URL.Host
	}
	scheme := "http"
	if r.TLS != nil {
		scheme = "https"
	}
	return scheme + "://" + r.Host
}

// sendPage sends page as MarkPage marks it (New has checked that it has a <head>).
func sendPage(w http.ResponseWriter, r *http.Request, page []byte, cache string) {
	marked, err := MarkPage(page)
	if err != nil {
		sendError(w, http.StatusInternalServerError, err.Error())
		return
	}
	w.Header().Set("Cache-Control", cache)
	send(w, r, http.StatusOK, "text/html; charset=utf-8", marked)
}

func sendError(w http.ResponseWriter, status int, msg string) {
	out, _ := json.Marshal(Error{Message: msg})
	w.Header().Set("Cache-Control", "no-store")
	w.Header().Set("Content-Type", "application/json")
	w.Header().Set("Content-Length", fmt.Sprint(len(out)))
	w.WriteHeader(status)
	w.Write(out)
}

// send answers with the body made of parts, or for a HEAD request with the headers alone (no
// Content-Length either: the Workers runtime holds a response with a Content-Length to that many bytes).
func send(w http.ResponseWriter, r *http.Request, status int, contentType string, parts ...[]byte) {
	w.Header().Set("Content-Type", contentType)
	if r.Method == http.MethodHead {
		w.WriteHeader(status)
		return
	}
	n := 0
	for _, p := range parts {
		n += len(p)
	}
	w.Header().Set("Content-Length", fmt.Sprint(n))
	w.WriteHeader(status)
	for _, p := range parts {
		w.Write(p)
	}
}
