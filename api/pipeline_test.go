package api

import (
	"bytes"
	"context"
	"encoding/json"
	"io"
	"mime/multipart"
	"net"
	"net/http"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"go.uber.org/zap"

	"swaygate/api/store"
	"swaygate/internal/pipeline"
	"swaygate/reports"
)

// Files of the tests that run the real pipeline.
var (
	demoModel   = filepath.Join("..", "testdata", "demo", "tern-street-depot.ifc")
	demoActions = filepath.Join("..", "testdata", "demo", "tern-street-depot-actions.csv")
	samplesDir  = filepath.Join("..", "..", "shared", "samples")
)

// liveServer is the real server on a loopback port with the real pipeline.
type liveServer struct {
	url  string
	dir  string // data directory
	st   *store.SQLite
	srv  *Server
	stop func()
}

// startLive starts a server on dir (a data directory, reused across
// restarts).
func startLive(tb testing.TB, dir string, mutate func(*Options)) *liveServer {
	tb.Helper()
	st, err := store.OpenSQLite(context.Background(), dir)
	if err != nil {
		tb.Fatal(err)
	}
	opt := Options{Store: st, DataDir: dir, Logger: zap.NewNop(), ToolVersion: "0.1.0-test"}
	if mutate != nil {
		mutate(&opt)
	}
	srv, err := New(opt)
	if err != nil {
		tb.Fatal(err)
	}
	ln, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		tb.Fatal(err)
	}
	ctx, cancel := context.WithCancel(context.Background())
	done := make(chan error, 1)
	go func() { done <- srv.Serve(ctx, ln) }()
	ls := &liveServer{url: "http://" + ln.Addr().String(), dir: dir, st: st, srv: srv}
	stopped := false
	ls.stop = func() {
		if stopped {
			return
		}
		stopped = true
		cancel()
		if err := <-done; err != nil {
			tb.Errorf("Serve: %v", err)
		}
		st.Close()
	}
	tb.Cleanup(ls.stop)
	return ls
}

// uploadFile posts a model file (and an optional side-car) and returns the
// status and body.
func (ls *liveServer) uploadFile(tb testing.TB, query, model, actions string) (int, []byte) {
	tb.Helper()
	f, err := os.Open(model)
	if err != nil {
		tb.Fatal(err)
	}
	defer f.Close()
	var body io.Reader = f
	ct := "application/x-step"
	if actions != "" {
		var buf bytes.Buffer
		mw := multipart.NewWriter(&buf)
		w, _ := mw.CreateFormFile("model", filepath.Base(model))
		io.Copy(w, f)
		a, err := os.ReadFile(actions)
		if err != nil {
			tb.Fatal(err)
		}
		w, _ = mw.CreateFormFile("actions", filepath.Base(actions))
		w.Write(a)
		mw.Close()
		body, ct = &buf, mw.FormDataContentType()
	} else {
		query += "&name=" + filepath.Base(model)
	}
	return ls.post(tb, query, ct, body)
}

func (ls *liveServer) post(tb testing.TB, query, ct string, body io.Reader) (int, []byte) {
	tb.Helper()
	resp, err := http.Post(ls.url+"/v1/checks?"+strings.TrimPrefix(query, "&"), ct, body)
	if err != nil {
		tb.Fatal(err)
	}
	defer resp.Body.Close()
	b, _ := io.ReadAll(resp.Body)
	return resp.StatusCode, b
}

func (ls *liveServer) get(tb testing.TB, path string) (int, []byte) {
	tb.Helper()
	resp, err := http.Get(ls.url + path)
	if err != nil {
		tb.Fatal(err)
	}
	defer resp.Body.Close()
	b, _ := io.ReadAll(resp.Body)
	return resp.StatusCode, b
}

// reportVerdicts reads the per-GlobalId verdicts and the summary of a JSON
// report.
func reportVerdicts(tb testing.TB, b []byte) (map[string]string, map[string]int) {
	tb.Helper()
	var r struct {
		Summary  map[string]int `json:"summary"`
		Elements map[string]struct {
			Verdict string `json:"verdict"`
		} `json:"elements"`
	}
	if err := json.Unmarshal(b, &r); err != nil {
		tb.Fatalf("report: %v", err)
	}
	v := make(map[string]string, len(r.Elements))
	for gid, e := range r.Elements {
		v[gid] = e.Verdict
	}
	return v, r.Summary
}

// cliVerdicts runs the check as the command line does (pipeline.Check and
// reports.WriteJSON) and returns its verdicts and summary.
func cliVerdicts(tb testing.TB, model, actions string) (map[string]string, map[string]int) {
	tb.Helper()
	req := pipeline.Request{ModelPath: model, ActionsPath: actions}
	if actions != "" {
		req.ActionsName = filepath.Base(actions)
	}
	res, err := pipeline.Check(context.Background(), req)
	if err != nil {
		tb.Fatalf("pipeline.Check(%s): %v", model, err)
	}
	var buf bytes.Buffer
	if err := reports.WriteJSON(&buf, res.Report, res.Run); err != nil {
		tb.Fatal(err)
	}
	return reportVerdicts(tb, buf.Bytes())
}

// waitReady polls /readyz.
func (ls *liveServer) waitReady(tb testing.TB) {
	tb.Helper()
	for i := 0; i < 100; i++ {
		if code, _ := ls.get(tb, "/readyz"); code == 200 {
			return
		}
		time.Sleep(20 * time.Millisecond)
	}
	tb.Fatal("the server is not ready")
}
