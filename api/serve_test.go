package api

import (
	"context"
	"io"
	"net"
	"net/http"
	"strings"
	"testing"
	"time"

	"go.uber.org/zap"

	"swaygate/api/store"
)

// serveFake runs the server with the fake checker on a loopback port until
// the returned stop is called; stop returns Serve's error.
func serveFake(t *testing.T, dir string, fake *fakeChecker, mutate func(*Options)) (string, func() error) {
	t.Helper()
	st, err := store.OpenSQLite(context.Background(), dir)
	if err != nil {
		t.Fatal(err)
	}
	opt := Options{Store: st, DataDir: dir, Checker: fake, Logger: zap.NewNop()}
	if mutate != nil {
		mutate(&opt)
	}
	srv, err := New(opt)
	if err != nil {
		t.Fatal(err)
	}
	ln, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		t.Fatal(err)
	}
	ctx, cancel := context.WithCancel(context.Background())
	done := make(chan error, 1)
	go func() { done <- srv.Serve(ctx, ln) }()
	return "http://" + ln.Addr().String(), func() error {
		cancel()
		err := <-done
		st.Close()
		return err
	}
}

type result struct {
	code int
	body string
	err  error
}

func postAsync(url, model string) chan result {
	ch := make(chan result, 1)
	go func() {
		resp, err := http.Post(url+"/v1/checks?project=s", "application/x-step", strings.NewReader(model))
		if err != nil {
			ch <- result{err: err}
			return
		}
		b, _ := io.ReadAll(resp.Body)
		resp.Body.Close()
		ch <- result{code: resp.StatusCode, body: string(b)}
	}()
	return ch
}

// TestGracefulShutdown: on shutdown an in-flight check finishes and is
// stored; the server then stops, and a restart on the same data directory
// finds the run.
func TestGracefulShutdown(t *testing.T) {
	dir := t.TempDir()
	fake := &fakeChecker{started: make(chan string, 1)}
	url, stop := serveFake(t, dir, fake, func(o *Options) { o.ShutdownTimeout = 10 * time.Second })
	ch := postAsync(url, fakeModel+"FAKE-SLEEP")
	<-fake.started
	start := time.Now()
	if err := stop(); err != nil {
		t.Fatalf("Serve: %v", err)
	}
	r := <-ch
	if r.err != nil || r.code != 201 {
		t.Fatalf("in-flight check: %d %v %s", r.code, r.err, r.body)
	}
	if d := time.Since(start); d > 5*time.Second {
		t.Errorf("shutdown took %v", d)
	}

	url, stop = serveFake(t, dir, &fakeChecker{}, nil)
	defer stop()
	resp, err := http.Get(url + "/v1/projects/s/runs")
	if err != nil {
		t.Fatal(err)
	}
	b, _ := io.ReadAll(resp.Body)
	resp.Body.Close()
	if !strings.Contains(string(b), `"status":"complete"`) {
		t.Errorf("runs after restart: %s", b)
	}
}

// TestShutdownTimeout: a check still running when the shutdown timeout
// ends is cancelled, and Serve returns.
func TestShutdownTimeout(t *testing.T) {
	dir := t.TempDir()
	fake := &fakeChecker{started: make(chan string, 1)}
	url, stop := serveFake(t, dir, fake, func(o *Options) { o.ShutdownTimeout = 100 * time.Millisecond })
	ch := postAsync(url, fakeModel+"FAKE-WAIT")
	<-fake.started
	start := time.Now()
	if err := stop(); err != nil {
		t.Fatalf("Serve: %v", err)
	}
	if d := time.Since(start); d > 5*time.Second {
		t.Errorf("shutdown took %v", d)
	}
	if r := <-ch; r.err == nil && r.code == 201 {
		t.Errorf("a cancelled check was stored: %d", r.code)
	}
}
