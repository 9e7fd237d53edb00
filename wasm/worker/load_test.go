//go:build !js

package main_test

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"slices"
	"strings"
	"sync"
	"testing"
	"time"

	"gibbsheet/wasm/worker/service"
)

// The load: loadRequests requests from loadWorkers clients at once against the local service with KV,
// in the mix below; every answer is checked and any 5xx fails the run.
const (
	loadRequests = 2000
	loadWorkers  = 8
)

// loadCase is one kind of request of the mix and the exact answer it must get.
type loadCase struct {
	method, path string
	body         []byte
	status       int
	want         []byte
}

// BenchmarkLoad reports the latency percentiles of the mix: of every 10 requests, 7 evaluate the
// worksheet, 2 fetch it, 1 publishes it again. Run it with -benchtime=1x for one round of loadRequests.
func BenchmarkLoad(b *testing.B) {
	doc := readWorksheet(b)
	id := service.ID(doc)
	pub, _ := json.Marshal(service.Published{ID: id, URL: withKV.base + "/w/" + id})
	resp, got, err := call("POST", withKV.base+"/v1/worksheets", bytesBody(doc))
	if err != nil {
		b.Fatal(err)
	}
	if (resp.StatusCode != 200 && resp.StatusCode != 201) || !bytes.Equal(got, pub) {
		b.Fatalf("publish: status %d, body %s; want 200 or 201 and %s", resp.StatusCode, got, pub)
	}
	resp, result, err := call("POST", withKV.base+"/v1/evaluate", bytesBody(doc))
	if err != nil || resp.StatusCode != 200 {
		b.Fatalf("evaluate: %v %v %.300s", err, resp.Status, result)
	}
	checkAgainstEngine(b, doc, result)
	evaluate := loadCase{"POST", "/v1/evaluate", doc, 200, result}
	fetch := loadCase{"GET", "/v1/worksheets/" + id, nil, 200, doc}
	publish := loadCase{"POST", "/v1/worksheets", doc, 200, pub}
	mix := []loadCase{evaluate, evaluate, fetch, evaluate, evaluate, publish, evaluate, fetch, evaluate, evaluate}

	var latencies []time.Duration
	b.ResetTimer()
	for range b.N {
		lat, err := load(mix)
		if err != nil {
			b.Fatalf("%v\nthe service's log ends:\n%s", err, tail(withKV.output(), 40))
		}
		latencies = append(latencies, lat...)
	}
	b.StopTimer()
	slices.Sort(latencies)
	b.ReportMetric(ms(percentile(latencies, 50)), "p50-ms")
	b.ReportMetric(ms(percentile(latencies, 99)), "p99-ms")
	b.ReportMetric(float64(len(latencies))/b.Elapsed().Seconds(), "req/s")
}

// load sends loadRequests requests of mix from loadWorkers goroutines and returns each one's latency.
func load(mix []loadCase) ([]time.Duration, error) {
	jobs := make(chan int)
	lat := make([]time.Duration, loadRequests)
	errs := make(chan error, loadWorkers)
	var wg sync.WaitGroup
	for range loadWorkers {
		wg.Go(func() {
			for i := range jobs {
				start := time.Now()
				err := check(mix[i%len(mix)])
				lat[i] = time.Since(start)
				if err != nil {
					errs <- fmt.Errorf("request %d: %w", i, err)
					return
				}
			}
		})
	}
	go func() {
		defer close(jobs)
		for i := range loadRequests {
			select {
			case jobs <- i:
			case err := <-errs:
				errs <- err
				return
			}
		}
	}()
	wg.Wait()
	close(errs)
	return lat, <-errs
}

// check sends c's request and compares the answer with c's.
func check(c loadCase) error {
	var body io.Reader
	if c.body != nil {
		body = bytes.NewReader(c.body)
	}
	resp, got, err := call(c.method, withKV.base+c.path, body)
	if err != nil {
		return err
	}
	if resp.StatusCode != c.status || !bytes.Equal(got, c.want) {
		return fmt.Errorf("%s %s: status %d, body %.300s; want %d, %.300s", c.method, c.path, resp.StatusCode, got, c.status, c.want)
	}
	return nil
}

// percentile is the p-th percentile of sorted by the nearest-rank method.
func percentile(sorted []time.Duration, p int) time.Duration {
	if len(sorted) == 0 {
		return 0
	}
	rank := (p*len(sorted) + 99) / 100 // ⌈p/100 · n⌉
	return sorted[max(rank, 1)-1]
}

// tail is the last n lines of text.
func tail(text string, n int) string {
	lines := strings.Split(strings.TrimRight(text, "\n"), "\n")
	return strings.Join(lines[max(len(lines)-n, 0):], "\n")
}

func ms(d time.Duration) float64 { return float64(d) / float64(time.Millisecond) }
