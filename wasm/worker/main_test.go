//go:build !js

package main_test

// This file starts the worker under the local Workers runtime (wrangler dev --local) once per test
// binary: one instance with the KV namespace bound, one with its binding left out to see storage fail.

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"net"
	"net/http"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"
)

// pageEnv names a page file to build the worker with instead of one made by web/cmd/gibbsheet-html.
const pageEnv = "GIBBSHEET_PAGE"

const (
	readyTimeout = 3 * time.Minute // wrangler's start and the first instance of the worker
	stopTimeout  = 10 * time.Second
)

// instance is a running wrangler dev.
type instance struct {
	name string
	base string // e.g. "http://127.0.0.1:8787"
	cmd  *exec.Cmd
	log  string // file with wrangler's output
}

var (
	withKV    *instance // KV namespace bound
	withoutKV *instance // binding absent, so every storage call fails
	client    = &http.Client{Timeout: time.Minute}
)

func TestMain(m *testing.M) {
	os.Exit(run(m))
}

func run(m *testing.M) int {
	tmp, err := os.MkdirTemp("", "gibbsheet-worker-")
	if err != nil {
		fmt.Fprintln(os.Stderr, err)
		return 1
	}
	defer os.RemoveAll(tmp)
	if err := start(tmp); err != nil {
		fmt.Fprintln(os.Stderr, "wasm/worker:", err)
		stop()
		return 1
	}
	code := m.Run()
	stop()
	return code
}

// start builds the worker into dir and starts both services, in parallel.
func start(dir string) error {
	wrangler, err := filepath.Abs(filepath.Join("node_modules", ".bin", "wrangler"))
	if err != nil {
		return err
	}
	if _, err := os.Stat(wrangler); err != nil {
		return fmt.Errorf("wrangler is not installed (%v); run `npm ci` in wasm/worker first", err)
	}
	page := os.Getenv(pageEnv)
	if page == "" {
		page = filepath.Join(dir, "gibbsheet.html")
		if err := command("go", "run", "gibbsheet/web/cmd/gibbsheet-html", "-o", page); err != nil {
			return fmt.Errorf("building the page: %w", err)
		}
	}
	build := filepath.Join(dir, "build")
	if err := command("sh", "build.sh", page, build); err != nil {
		return fmt.Errorf("building the worker: %w", err)
	}
	conf, err := os.ReadFile("wrangler.toml")
	if err != nil {
		return err
	}
	bare, _, found := strings.Cut(string(conf), "[[kv_namespaces]]")
	if !found {
		return errors.New("wrangler.toml has no [[kv_namespaces]] section")
	}
	bareConf := filepath.Join(dir, "without-kv.toml")
	if err := os.WriteFile(bareConf, []byte(bare), 0o644); err != nil {
		return err
	}
	script := filepath.Join(build, "worker.mjs")
	withKV, err = launch(dir, wrangler, "with-kv", "wrangler.toml", script)
	if err != nil {
		return err
	}
	withoutKV, err = launch(dir, wrangler, "without-kv", bareConf, script)
	if err != nil {
		return err
	}
	errs := make(chan error, 2)
	for _, s := range []*instance{withKV, withoutKV} {
		go func() { errs <- s.waitReady() }()
	}
	return errors.Join(<-errs, <-errs)
}

// command runs name in the package directory, its output going to the test's output.
func command(name string, args ...string) error {
	cmd := exec.Command(name, args...)
	cmd.Stdout, cmd.Stderr = os.Stderr, os.Stderr
	return cmd.Run()
}

// launch starts wrangler dev with config and script on free loopback ports, in its own process group.
func launch(dir, wrangler, name, config, script string) (*instance, error) {
	port, err := freePort()
	if err != nil {
		return nil, err
	}
	inspector, err := freePort()
	if err != nil {
		return nil, err
	}
	s := &instance{name: name, base: fmt.Sprintf("http://127.0.0.1:%d", port), log: filepath.Join(dir, name+".log")}
	out, err := os.Create(s.log)
	if err != nil {
		return nil, err
	}
	defer out.Close()
	s.cmd = exec.Command(wrangler, "dev", script, "--config", config, "--local",
		"--ip", "127.0.0.1", "--port", fmt.Sprint(port), "--inspector-port", fmt.Sprint(inspector),
		"--persist-to", filepath.Join(dir, name+"-state"), "--show-interactive-dev-session=false")
	s.cmd.Env = append(os.Environ(), "WRANGLER_SEND_METRICS=false", "WRANGLER_HIDE_BANNER=true",
		"CLOUDFLARE_CF_FETCH_ENABLED=false", "XDG_CONFIG_HOME="+filepath.Join(dir, "config"))
	s.cmd.Stdout, s.cmd.Stderr = out, out
	s.cmd.SysProcAttr = &syscall.SysProcAttr{Setpgid: true}
	if err := s.cmd.Start(); err != nil {
		return nil, fmt.Errorf("starting wrangler dev (%s): %w", name, err)
	}
	return s, nil
}

func freePort() (int, error) {
	l, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		return 0, err
	}
	defer l.Close()
	return l.Addr().(*net.TCPAddr).Port, nil
}

// waitReady waits until the worker itself answers the page.
func (s *instance) waitReady() error {
	deadline := time.Now().Add(readyTimeout)
	for time.Now().Before(deadline) {
		resp, err := client.Get(s.base + "/")
		if err == nil {
			io.Copy(io.Discard, resp.Body)
			resp.Body.Close()
			if resp.StatusCode == http.StatusOK {
				return nil
			}
			time.Sleep(time.Second) // let the runtime write out why
			return fmt.Errorf("%s: GET / answered %s\n%s", s.name, resp.Status, s.output())
		}
		time.Sleep(250 * time.Millisecond)
	}
	return fmt.Errorf("%s: not ready after %v\n%s", s.name, readyTimeout, s.output())
}

func (s *instance) output() string {
	b, _ := os.ReadFile(s.log)
	return string(b)
}

// stop ends both services: SIGTERM to each process group, SIGKILL to what is left after stopTimeout.
func stop() {
	for _, s := range []*instance{withKV, withoutKV} {
		if s == nil || s.cmd.Process == nil {
			continue
		}
		pgid := s.cmd.Process.Pid
		syscall.Kill(-pgid, syscall.SIGTERM)
		done := make(chan struct{})
		go func() { s.cmd.Wait(); close(done) }()
		select {
		case <-done:
		case <-time.After(stopTimeout):
		}
		syscall.Kill(-pgid, syscall.SIGKILL)
	}
}

// call sends one request and returns the status and the whole body.
func call(method, url string, body io.Reader) (*http.Response, []byte, error) {
	req, err := http.NewRequest(method, url, body)
	if err != nil {
		return nil, nil, err
	}
	resp, err := client.Do(req)
	if err != nil {
		return nil, nil, err
	}
	defer resp.Body.Close()
	b, err := io.ReadAll(resp.Body)
	return resp, b, err
}

// stream hides a reader's length so that the client sends it chunked, without a Content-Length.
type stream struct{ io.Reader }

func bytesBody(b []byte) io.Reader { return bytes.NewReader(b) }

// requestBody is doc for a POST and nothing for other methods.
func requestBody(method string, doc []byte) io.Reader {
	if method == http.MethodPost {
		return bytesBody(doc)
	}
	return nil
}
