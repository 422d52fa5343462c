package api

import (
	"bytes"
	"io"
	"net/http"
	"os"
	"slices"
	"strconv"
	"sync"
	"sync/atomic"
	"testing"
	"time"
)

// BenchmarkServeDemo measures requests per second and the p50 and p99
// latency of POST /v1/checks with the demo model over loopback, with 1, 4
// and 16 concurrent clients (real pipeline, SQLite store, default slots:
// GOMAXPROCS, waiting when busy).
//
//	go test ./api -run '^$' -bench ServeDemo -benchtime 200x
func BenchmarkServeDemo(b *testing.B) {
	model, err := os.ReadFile(demoModel)
	if err != nil {
		b.Fatal(err)
	}
	for _, clients := range []int{1, 4, 16} {
		b.Run("clients="+strconv.Itoa(clients), func(b *testing.B) {
			ls := startLive(b, b.TempDir(), nil)
			ls.waitReady(b)
			client := &http.Client{Transport: &http.Transport{MaxIdleConnsPerHost: clients}}
			post := func() (time.Duration, error) {
				start := time.Now()
				resp, err := client.Post(ls.url+"/v1/checks?project=bench&trace=full", "application/x-step", bytes.NewReader(model))
				if err != nil {
					return 0, err
				}
				io.Copy(io.Discard, resp.Body)
				resp.Body.Close()
				if resp.StatusCode != http.StatusCreated {
					return 0, &statusError{resp.StatusCode}
				}
				return time.Since(start), nil
			}
			if _, err := post(); err != nil { // warm up
				b.Fatal(err)
			}
			lat := make([]time.Duration, b.N)
			var next atomic.Int64
			var wg sync.WaitGroup
			b.ResetTimer()
			start := time.Now()
			for c := 0; c < clients; c++ {
				wg.Add(1)
				go func() {
					defer wg.Done()
					for {
						i := next.Add(1) - 1
						if i >= int64(b.N) {
							return
						}
						d, err := post()
						if err != nil {
							b.Error(err)
							return
						}
						lat[i] = d
					}
				}()
			}
			wg.Wait()
			elapsed := time.Since(start)
			b.StopTimer()
			slices.Sort(lat)
			b.ReportMetric(float64(b.N)/elapsed.Seconds(), "req/s")
			b.ReportMetric(float64(lat[len(lat)/2].Microseconds())/1000, "p50-ms")
			b.ReportMetric(float64(lat[min(len(lat)-1, len(lat)*99/100)].Microseconds())/1000, "p99-ms")
			ls.stop()
		})
	}
}

type statusError struct{ code int }

func (e *statusError) Error() string { return "status " + strconv.Itoa(e.code) }
