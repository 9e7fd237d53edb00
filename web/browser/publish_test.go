package browser

import (
	"encoding/json"
	"errors"
	"io"
	"net/http"
	"net/http/httptest"
	"os"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
	"github.com/google/go-cmp/cmp"

	"gibbsheet/wasm/worker/service"
)

// TestPublishFromServedPage: served by the service's handler (the same one the Workers build runs), the
// page offers to publish; the link it shows returns exactly the open worksheet, and opening the link shows
// that worksheet. Opened as a file, the page offers nothing (TestNoPublishFromFile).
func TestPublishFromServedPage(t *testing.T) {
	html, err := os.ReadFile(pagePath)
	if err != nil {
		t.Fatal(err)
	}
	handler, err := service.New(html, &service.MemoryStore{})
	if err != nil {
		t.Fatal(err)
	}
	srv := httptest.NewServer(handler)
	defer srv.Close()

	p := openURL(t, srv.URL+"/", 1300, 900)
	if !eval[bool](p, `!!document.getElementById("publish")`) {
		t.Fatal("the served page offers no publish button")
	}
	p.do(chromedp.Click(chromedp.CSS("#publish")))
	p.waitFor(`!document.getElementById("publish").disabled && document.getElementById("publish-msg").className !== "publish-msg busy"`)
	if msg := p.text("#publish-msg"); !eval[bool](p, `!!document.getElementById("publish-link")`) {
		t.Fatalf("no link after publishing; the page says %q; policy %s; errors %v", msg,
			eval[string](p, `document.querySelector('meta[http-equiv="Content-Security-Policy"]').content`), p.errs)
	}
	link := eval[string](p, `document.getElementById("publish-link").value`)
	if !strings.Contains(link, "/w/") {
		t.Fatalf("link %q is not a worksheet link", link)
	}
	shown := eval[string](p, `JSON.stringify(globalThis.gibbsheetPage.store.doc)`)

	id := link[strings.LastIndex(link, "/")+1:]
	resp, err := http.Get(srv.URL + "/v1/worksheets/" + id)
	if err != nil {
		t.Fatal(err)
	}
	stored, _ := io.ReadAll(resp.Body)
	resp.Body.Close()
	var want, got any
	if err := errors.Join(json.Unmarshal([]byte(shown), &want), json.Unmarshal(stored, &got)); err != nil {
		t.Fatal(err)
	}
	if diff := cmp.Diff(want, got); diff != "" {
		t.Errorf("stored worksheet differs from the open one (-open +stored):\n%s", diff)
	}

	q := openURL(t, link, 1300, 900)
	opened := eval[string](q, `JSON.stringify(globalThis.gibbsheetPage.store.doc)`)
	var again any
	json.Unmarshal([]byte(opened), &again)
	if diff := cmp.Diff(want, again); diff != "" {
		t.Errorf("the link opens another worksheet (-published +opened):\n%s", diff)
	}
	p.shot("published-link")
	p.noErrors()
}

func TestNoPublishFromFile(t *testing.T) {
	p := openPage(t, 1300, 900)
	if eval[bool](p, `!!document.getElementById("publish")`) {
		t.Error("a page opened as a file offers to publish")
	}
}
