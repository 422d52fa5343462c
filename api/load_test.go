package api

import (
	"context"
	"io"
	"net/http"
	"net/http/httptest"
	"runtime"
	"strings"
	"sync"
	"sync/atomic"
	"testing"
	"time"

	"swaygate/api/store"
)

// TestLoad: 8 clients upload 50 models each over loopback to a server with
// two check slots (wait mode). Every upload is stored, and the heap stays
// bounded while 100 MB pass through.
func TestLoad(t *testing.T) {
	clients, each := 8, 50
	if testing.Short() {
		each = 10
	}
	env := newTestEnv(t, func(o *Options) { o.MaxChecks = 2; o.QueueTimeout = time.Minute })
	ts := httptest.NewServer(env.h)
	defer ts.Close()
	// A small model padded to 256 KiB with a STEP comment.
	model := fakeModel + "/*" + strings.Repeat("padding ", 256<<10/8) + "*/\n"

	runtime.GC()
	var base runtime.MemStats
	runtime.ReadMemStats(&base)
	var peak atomic.Uint64
	stop := make(chan struct{})
	sampled := make(chan struct{})
	go func() {
		defer close(sampled)
		var ms runtime.MemStats
		for {
			select {
			case <-stop:
				return
			case <-time.After(20 * time.Millisecond):
			}
			runtime.ReadMemStats(&ms)
			if ms.HeapInuse > peak.Load() {
				peak.Store(ms.HeapInuse)
			}
		}
	}()

	client := &http.Client{Transport: &http.Transport{MaxIdleConnsPerHost: clients}, Timeout: 2 * time.Minute}
	var wg sync.WaitGroup
	var failed atomic.Int64
	for c := 0; c < clients; c++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := 0; i < each; i++ {
				resp, err := client.Post(ts.URL+"/v1/checks?project=load", "application/x-step", strings.NewReader(model))
				if err != nil {
					t.Error(err)
					failed.Add(1)
					continue
				}
				b, _ := io.ReadAll(resp.Body)
				resp.Body.Close()
				if resp.StatusCode != http.StatusCreated {
					t.Errorf("upload: %d %s", resp.StatusCode, b)
					failed.Add(1)
				}
			}
		}()
	}
	wg.Wait()
	close(stop)
	<-sampled
	if failed.Load() > 0 {
		t.Fatalf("%d of %d uploads failed", failed.Load(), clients*each)
	}
	runs, _, err := env.st.ListRuns(context.Background(), "load", store.Page{Limit: 1000})
	if err != nil || len(runs) != clients*each {
		t.Errorf("%d runs stored, want %d (%v)", len(runs), clients*each, err)
	}
	growth := int64(peak.Load()) - int64(base.HeapInuse)
	t.Logf("%d uploads of %d KiB; heap in use %d MiB at start, peak %d MiB", clients*each, len(model)>>10,
		base.HeapInuse>>20, peak.Load()>>20)
	// Two checks at a time of a 256 KiB model, their reports, and the
	// store's compression buffers: far below 64 MiB. Unbounded buffering of
	// 8 concurrent uploads would not be.
	if growth > 64<<20 {
		t.Errorf("heap grew by %d MiB under load", growth>>20)
	}
	if got := metricValue(t, env.reg, "swaygate_checks_in_flight"); got != 0 {
		t.Errorf("in flight after the load: %v", got)
	}
}
