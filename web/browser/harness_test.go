package browser

import (
	"context"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"testing"
	"time"

	cdppage "github.com/chromedp/cdproto/page"
	"github.com/chromedp/cdproto/runtime"
	"github.com/chromedp/chromedp"

	"gibbsheet/web/assemble"
)

// chromium is Debian's browser; a missing browser fails the tests, it never skips them.
const chromium = "/usr/bin/chromium"

// pagePath is the page built once for all tests by TestMain.
var pagePath string

func TestMain(m *testing.M) {
	dir, err := os.MkdirTemp("", "gibbsheet-page-")
	if err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(1)
	}
	pagePath = filepath.Join(dir, "gibbsheet.html")
	if _, err := assemble.WriteFile(pagePath, assemble.Options{}); err != nil {
		fmt.Fprintln(os.Stderr, "building the page:", err)
		os.Exit(1)
	}
	code := m.Run()
	os.RemoveAll(dir)
	os.Exit(code)
}

// page is one browser with the page open in it.
type page struct {
	t   testing.TB
	ctx context.Context

	mu   sync.Mutex
	errs []string // uncaught exceptions and console errors

	close func() // ends the browser before the test's end, as benchmarks do after each opening
}

// openPage starts a fresh Chromium (its own profile folder) at the given window size, opens the built
// file from file:// and waits until the first result is drawn.
func openPage(t testing.TB, width, height int) *page {
	t.Helper()
	return openURL(t, "file://"+pagePath, width, height)
}

// openURL is openPage for any address, such as the page served by the edge service's handler.
func openURL(t testing.TB, url string, width, height int) *page {
	t.Helper()
	return openUntil(t, url, width, height, `document.body.dataset.ready === "true"`)
}

// openUntil is openURL waiting for the expression until instead of the page's readiness. Each prelude
// script runs in the page before the page's own.
func openUntil(t testing.TB, url string, width, height int, until string, prelude ...string) *page {
	t.Helper()
	if _, err := os.Stat(chromium); err != nil {
		t.Fatalf("the browser tests need Chromium at %s: %v", chromium, err)
	}
	alloc, cancelAlloc := chromedp.NewExecAllocator(context.Background(), browserOptions(t.TempDir(), width, height)...)
	ctx, cancel := chromedp.NewContext(alloc)
	stop := func() {
		cancel()
		cancelAlloc()
	}
	t.Cleanup(stop)
	p := &page{t: t, ctx: ctx, close: stop}
	if err := chromedp.Listen(ctx, p.listen); err != nil {
		t.Fatalf("starting Chromium: %v", err)
	}
	for _, src := range prelude {
		p.call(func(ctx context.Context) error {
			_, err := chromedp.Call(ctx, cdppage.AddScriptToEvaluateOnNewDocument, cdppage.AddScriptToEvaluateOnNewDocumentParams{Source: src})
			return err
		})
	}
	p.do(chromedp.EmulateViewport(int64(width), int64(height)), chromedp.Navigate(url))
	p.waitFor(until)
	p.noErrors()
	return p
}

// browserOptions starts Debian's Chromium headless with the flags this machine needs (no sandbox as root,
// no background connections, which the closed network refuses), a profile folder and a window size.
func browserOptions(profile string, width, height int, extra ...chromedp.ExecAllocatorOption) []chromedp.ExecAllocatorOption {
	return append([]chromedp.ExecAllocatorOption{
		chromedp.ExecPath(chromium),
		chromedp.Headless,
		chromedp.NoSandbox,
		chromedp.DisableGPU,
		chromedp.NoFirstRun,
		chromedp.Flag("disable-quic", true),
		chromedp.Flag("disable-background-networking", true),
		chromedp.Flag("disable-component-update", true),
		chromedp.Flag("disable-sync", true),
		chromedp.Flag("disable-dev-shm-usage", true),
		chromedp.UserDataDir(profile),
		chromedp.WindowSize(width, height),
	}, extra...)
}

func (p *page) listen(ev any) {
	p.mu.Lock()
	defer p.mu.Unlock()
	switch ev := ev.(type) {
	case *runtime.EventExceptionThrown:
		msg := ev.ExceptionDetails.Text
		if ev.ExceptionDetails.Exception != nil {
			msg += " " + ev.ExceptionDetails.Exception.Description
		}
		p.errs = append(p.errs, "exception: "+msg)
	case *runtime.EventConsoleAPICalled:
		if ev.Type == runtime.ConsoleAPICalledTypeError {
			var parts []string
			for _, a := range ev.Args {
				parts = append(parts, string(a.Value)+a.Description)
			}
			p.errs = append(p.errs, "console.error: "+strings.Join(parts, " "))
		}
	}
}

// noErrors fails the test if the page threw or logged an error so far.
func (p *page) noErrors() {
	p.t.Helper()
	p.mu.Lock()
	defer p.mu.Unlock()
	if len(p.errs) > 0 {
		p.t.Fatalf("the page reported errors:\n%s", strings.Join(p.errs, "\n"))
	}
}

// call runs f with the page's context and a time limit.
func (p *page) call(f func(ctx context.Context) error) {
	p.t.Helper()
	ctx, cancel := context.WithTimeout(p.ctx, 60*time.Second)
	defer cancel()
	if err := chromedp.Do(ctx, chromedp.Func(func(ctx context.Context, _ *chromedp.Target) error { return f(ctx) })); err != nil {
		p.t.Fatalf("browser: %v", err)
	}
}

// typeInto focuses the field, selects what it holds and types text over it with key events.
func (p *page) typeInto(sel, text string) {
	p.t.Helper()
	eval[bool](p, `(() => { const e = document.querySelector(`+jsString(sel)+`); e.focus(); e.select(); return true; })()`)
	p.do(chromedp.KeyEvent(text))
}

// do runs actions with a time limit.
func (p *page) do(actions ...chromedp.Action[chromedp.Void]) {
	p.t.Helper()
	ctx, cancel := context.WithTimeout(p.ctx, 60*time.Second)
	defer cancel()
	if err := chromedp.Do(ctx, actions...); err != nil {
		p.t.Fatalf("browser: %v", err)
	}
}

// eval evaluates a JavaScript expression in the page and decodes its value.
func eval[T any](p *page, expr string) T {
	p.t.Helper()
	ctx, cancel := context.WithTimeout(p.ctx, 120*time.Second)
	defer cancel()
	v, err := chromedp.Run(ctx, chromedp.Evaluate[T](expr, chromedp.EvalAwaitPromise))
	if err != nil {
		p.t.Fatalf("evaluating %s: %v", expr, err)
	}
	return v
}

// waitLimit bounds every wait; it is generous because the machines that run the tests are shared and
// at times heavily loaded. Speed is measured by BenchmarkPage, not here.
const waitLimit = 60 * time.Second

// waitFor polls until the expression is true (waitLimit at most).
func (p *page) waitFor(expr string) {
	p.t.Helper()
	deadline := time.Now().Add(waitLimit)
	for {
		if eval[bool](p, "!!("+expr+")") {
			return
		}
		if time.Now().After(deadline) {
			p.mu.Lock()
			errs := strings.Join(p.errs, "\n")
			p.mu.Unlock()
			p.t.Fatalf("timed out waiting for %s\npage errors: %s", expr, errs)
		}
		time.Sleep(20 * time.Millisecond)
	}
}

// shot saves a screenshot of the whole page as name.png in the test's artifact folder.
func (p *page) shot(name string) string {
	p.t.Helper()
	ctx, cancel := context.WithTimeout(p.ctx, 60*time.Second)
	defer cancel()
	buf, err := chromedp.Run(ctx, chromedp.FullScreenshot(100))
	if err != nil {
		p.t.Fatalf("screenshot: %v", err)
	}
	path := filepath.Join(p.t.ArtifactDir(), name+".png")
	if err := os.WriteFile(path, buf, 0o644); err != nil {
		p.t.Fatal(err)
	}
	p.t.Logf("screenshot: %s", path)
	return path
}

// text is the text of the first element matching the CSS selector ("" if none).
func (p *page) text(sel string) string {
	p.t.Helper()
	return eval[string](p, fmt.Sprintf(`(document.querySelector(%q)?.textContent ?? "")`, sel))
}

// jsString quotes s for JavaScript.
func jsString(s string) string {
	return fmt.Sprintf("%q", s)
}
