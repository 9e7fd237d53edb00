// Package browser holds the page's browser tests and benchmarks: they build the single-file page, open
// it from file:// in headless Chromium (/usr/bin/chromium) through chromedp, and type, click and paste
// as a user would. The package has no code of its own besides the tests.
package browser
