package service_test

import (
	"encoding/json"
	"net/http"
	"testing"
)

// FuzzServe posts arbitrary bodies to the two POST endpoints: whatever the body, the answer is never a 5xx,
// and an error answer is {"error": message}. Seeds are under testdata/fuzz/FuzzServe.
func FuzzServe(f *testing.F) {
	f.Add(false, []byte(worksheet))
	f.Add(true, []byte(worksheet))
	f.Add(true, []byte(`{"format": "gibbsheet-worksheet/1", "rows": [{"equation": "= ="}]}`))
	h := newHandler(f, &memStore{})
	f.Fuzz(func(t *testing.T, publish bool, body []byte) {
		path := "/v1/evaluate"
		if publish {
			path = "/v1/worksheets"
		}
		w := do(h, "POST", path, body)
		switch w.Code {
		case http.StatusOK, http.StatusCreated:
			if !json.Valid(w.Body.Bytes()) {
				t.Fatalf("%s answered %d with a body that is not JSON: %q", path, w.Code, w.Body)
			}
		case http.StatusBadRequest, http.StatusRequestEntityTooLarge:
			checkError(t, w, w.Code)
		default:
			t.Fatalf("%s answered %d for body %q: %s", path, w.Code, body, w.Body)
		}
	})
}
