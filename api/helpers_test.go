package api

import (
	"bytes"
	"compress/gzip"
	"context"
	"crypto/sha256"
	"encoding/hex"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"mime/multipart"
	"net/http"
	"net/http/httptest"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"sync/atomic"
	"testing"
	"time"

	"github.com/prometheus/client_golang/prometheus"
	"go.uber.org/zap"
	"go.uber.org/zap/zapcore"
	"go.uber.org/zap/zaptest/observer"

	"swaygate/api/store"
	"swaygate/checks"
	"swaygate/ifcstep"
	"swaygate/ifcstep/sidecar"
	"swaygate/internal/pipeline"
	"swaygate/reports"
)

// The fake checker reads directives from the model's bytes instead of IFC.
// Its reports are built by hand: an invented three-column frame (data for
// tests only).
const (
	gidC1 = "2O2Fr$t4X7Zf8NOew3FLOH" // pass
	gidC2 = "1hqIFTRjfV6AWq_bMtnZwI" // fail (unstable)
	gidC3 = "0u4wgLe6n0ABVaiXyikbkA" // needs-analysis (missing-section)

	fakeModel = "ISO-10303-21;\nHEADER;\nFILE_SCHEMA(('IFC4'));\nENDSEC;\nDATA;\n#1=IFCCOLUMN('2O2Fr$t4X7Zf8NOew3FLOH',$,'C1',$,$,$,$,$,$);\nENDSEC;\nEND-ISO-10303-21;\n"
)

// fakeChecker answers by the directives found in the model:
//
//	not starting with ISO-10303-21;  an *ifcstep.Error of kind not-step
//	FAKE-TRUNCATED   an *ifcstep.Error of kind truncated at line 3, column 7, byte 40, #12
//	FAKE-PATHERR     an *ifcstep.Error naming the model by its path on disk
//	FAKE-OPTION      an error wrapping checks.ErrOption
//	FAKE-INTERNAL    a plain error
//	FAKE-PANIC       a panic
//	FAKE-WAIT        blocks until the context is done
//	FAKE-SLEEP       takes 300 ms (or until the context is done), then answers
//	FAKE-EMPTY       a report without elements and with a warning
//	FAKE-SET:GID=V;  member GID gets verdict V (pass, fail, needs-analysis)
//	FAKE-DUP         two elements with the same GlobalId
//
// A side-car containing "BAD" is a positioned side-car error; one naming
// UNKNOWNGID gives an unknown-global-id warning. Gzip models are
// decompressed first, as the reader does.
type fakeChecker struct {
	calls   atomic.Int64
	started chan string // receives the run id of each FAKE-WAIT check, if not nil

	mu   sync.Mutex
	last pipeline.Request
}

func (f *fakeChecker) lastRequest() pipeline.Request {
	f.mu.Lock()
	defer f.mu.Unlock()
	return f.last
}

func (f *fakeChecker) Check(ctx context.Context, req pipeline.Request) (*pipeline.Result, error) {
	f.calls.Add(1)
	f.mu.Lock()
	f.last = req
	f.mu.Unlock()
	raw, err := os.ReadFile(req.ModelPath)
	if err != nil {
		return nil, err
	}
	data := raw
	if len(data) > 2 && data[0] == 0x1f && data[1] == 0x8b {
		zr, err := gzip.NewReader(bytes.NewReader(data))
		if err != nil {
			return nil, err
		}
		if data, err = io.ReadAll(zr); err != nil {
			return nil, err
		}
	}
	s := string(data)
	switch {
	case !strings.HasPrefix(s, "ISO-10303-21;"):
		return nil, &ifcstep.Error{File: req.Name, Pos: ifcstep.Position{Line: 1, Column: 1}, Kind: ifcstep.ErrNotStep,
			Msg: "not a STEP file: it does not start with ISO-10303-21;"}
	case strings.Contains(s, "FAKE-TRUNCATED"):
		return nil, &ifcstep.Error{File: req.Name, Pos: ifcstep.Position{Line: 3, Column: 7, Offset: 40}, ID: 12,
			Kind: ifcstep.ErrTruncated, Msg: "the file ends inside an instance"}
	case strings.Contains(s, "FAKE-PATHERR"):
		return nil, &ifcstep.Error{File: req.ModelPath, Pos: ifcstep.Position{Line: 2, Column: 1, Offset: 14}, Kind: ifcstep.ErrSyntax,
			Msg: "see " + req.ModelPath}
	case strings.Contains(s, "FAKE-OPTION"):
		return nil, fmt.Errorf("checks: unknown trace level %q: %w", "x", checks.ErrOption)
	case strings.Contains(s, "FAKE-INTERNAL"):
		return nil, errors.New("secret internal detail /srv/data/x")
	case strings.Contains(s, "FAKE-PANIC"):
		panic("fake checker panic with secret detail")
	case strings.Contains(s, "FAKE-WAIT"):
		if f.started != nil {
			f.started <- req.RunID
		}
		<-ctx.Done()
		return nil, ctx.Err()
	case strings.Contains(s, "FAKE-SLEEP"):
		if f.started != nil {
			f.started <- req.RunID
		}
		select {
		case <-time.After(300 * time.Millisecond):
		case <-ctx.Done():
			return nil, ctx.Err()
		}
	}

	rep := fakeReport(s)
	if req.ActionsPath != "" {
		a, err := os.ReadFile(req.ActionsPath)
		if err != nil {
			return nil, err
		}
		if bytes.Contains(a, []byte("BAD")) {
			return nil, fmt.Errorf("sidecar: %w", &sidecar.Error{File: req.ActionsName, Line: 2, Column: 5, Msg: "axial_compression_kN is not a number"})
		}
		if bytes.Contains(a, []byte("UNKNOWNGID")) {
			rep.Warnings = append(rep.Warnings, checks.Reason{Code: checks.CodeUnknownGlobalID,
				Message: "the side-car names GlobalId UNKNOWNGID, which is not in the model", Ref: req.ActionsName + ":2"})
		}
	}
	sum := sha256.Sum256(raw)
	gate, err := reports.NewGate(req.Gate, rep.Summary)
	if err != nil {
		return nil, err
	}
	now := time.Now
	if req.Now != nil {
		now = req.Now
	}
	return &pipeline.Result{Report: rep, Run: reports.Run{
		RunID:       req.RunID,
		CreatedAt:   now(),
		ToolVersion: req.ToolVersion,
		Project:     req.Project,
		Model:       reports.ModelInfo{File: req.Name, SHA256: hex.EncodeToString(sum[:]), Schema: "IFC4", Instances: strings.Count(s, "\n#")},
		Gate:        gate,
		Units:       req.Units,
	}}, nil
}

// axis returns an axis result with every unknown value null.
func axis(r checks.Restraint, ke, deltaM float64, v checks.Verdict) checks.AxisResult {
	n := checks.Null
	a := checks.AxisResult{Restraint: r, Direction: checks.DirY, Ke: checks.Num(ke), Length: n, Nom: n, Nomb: n,
		LambdaC: n, BetaM: n, Cm: n, DeltaB: n, DeltaS: n, DeltaM: n, MStar: n, MAmp: n, Verdict: v}
	if !math.IsNaN(deltaM) {
		a.DeltaM = checks.Num(deltaM)
	}
	return a
}

// fakeReport is the invented three-column report, with the verdicts set by
// FAKE-SET directives.
func fakeReport(s string) *checks.Report {
	rep := &checks.Report{Standard: "as4100", SwayMethod: "storey", Scope: "stability",
		Assumptions: []string{"invented test data"}}
	if strings.Contains(s, "FAKE-EMPTY") {
		rep.Warnings = []checks.Reason{{Code: "no-columns", Message: "the model has no steel columns"}}
		return rep
	}
	type col struct {
		gid, name, storey string
		v                 checks.Verdict
		reason            checks.Reason
		dm                [2]float64
	}
	cols := []col{
		{gidC1, "C1", "Level 1", checks.Pass, checks.Reason{Code: checks.CodeAssumedModulus, Message: "E = 200000 MPa assumed"}, [2]float64{1.05, 1.12}},
		{gidC2, "C2", "Level 1", checks.Fail, checks.Reason{Code: checks.CodeUnstable, Message: "N* exceeds the elastic buckling load", Combination: "ULS-2", Axis: "minor"}, [2]float64{1.2, math.NaN()}},
		{gidC3, "C3", "Level 2", checks.NeedsAnalysis, checks.Reason{Code: checks.CodeMissingSection, Message: "no profile found"}, [2]float64{math.NaN(), math.NaN()}},
	}
	if strings.Contains(s, "FAKE-DUP") {
		cols[2].gid = gidC1
	}
	for _, c := range cols {
		key := "FAKE-SET:" + c.gid + "="
		if i := strings.Index(s, key); i >= 0 {
			v := s[i+len(key):]
			v = v[:strings.IndexByte(v, ';')]
			switch v {
			case "pass":
				c.v = checks.Pass
			case "fail":
				c.v = checks.Fail
			default:
				c.v = checks.NeedsAnalysis
			}
		}
		m := &checks.Member{GlobalID: c.gid, Entity: "IfcColumn", Name: c.name, Storey: c.storey, StoreyKey: c.storey,
			StoreyElevation: 0, Length: 4200, Ref: "#1"}
		gov := "ULS-1"
		if c.v == checks.Fail {
			gov = "ULS-2"
		}
		e := checks.Element{Member: m, Verdict: c.v, Reasons: []checks.Reason{c.reason}, GoverningCombination: gov,
			GoverningUtilisation: checks.Null, E: 200000, ESource: "default"}
		for _, name := range []string{"ULS-1", "ULS-2"} {
			e.Combinations = append(e.Combinations, checks.CombinationResult{Name: name, Verdict: c.v, NStar: 850e3,
				Axes: [2]checks.AxisResult{axis(checks.Sway, 1.2, c.dm[0], c.v), axis(checks.Braced, 1, c.dm[1], c.v)}})
		}
		rep.Elements = append(rep.Elements, e)
		rep.Summary.Members++
		switch c.v {
		case checks.Pass:
			rep.Summary.Pass++
		case checks.Fail:
			rep.Summary.Fail++
		default:
			rep.Summary.NeedsAnalysis++
		}
	}
	return rep
}

// testEnv is a server on a fresh data directory with the fake checker, a
// fixed clock and sequential run ids.
type testEnv struct {
	t    *testing.T
	srv  *Server
	h    http.Handler
	st   *store.SQLite
	fake *fakeChecker
	logs *observer.ObservedLogs
	reg  *prometheus.Registry
	dir  string
}

var testT0 = time.Date(2025, 6, 1, 8, 0, 0, 0, time.UTC)

// testRunID is the n-th (1-based) run id the test server hands out.
func testRunID(n int64) string { return fmt.Sprintf("00000000-0000-4000-8000-%012d", n) }

func newTestEnv(t *testing.T, mutate func(*Options)) *testEnv {
	t.Helper()
	dir := t.TempDir()
	st, err := store.OpenSQLite(context.Background(), dir)
	if err != nil {
		t.Fatal(err)
	}
	core, logs := observer.New(zapcore.DebugLevel)
	var ids, ticks atomic.Int64
	env := &testEnv{t: t, st: st, fake: &fakeChecker{}, logs: logs, reg: prometheus.NewRegistry(), dir: dir}
	opt := Options{
		Store:       st,
		DataDir:     dir,
		Checker:     env.fake,
		Logger:      zap.New(core),
		Registry:    env.reg,
		ToolVersion: "0.1.0-test",
		Now:         func() time.Time { return testT0.Add(time.Duration(ticks.Add(1)-1) * time.Second) },
		NewRunID:    func() string { return testRunID(ids.Add(1)) },
	}
	if mutate != nil {
		mutate(&opt)
	}
	srv, err := New(opt)
	if err != nil {
		t.Fatal(err)
	}
	env.srv, env.h = srv, srv.Handler()
	t.Cleanup(func() {
		st.Close()
		// No upload or rendering is left behind.
		ents, _ := os.ReadDir(filepath.Join(dir, "tmp"))
		for _, e := range ents {
			t.Errorf("left in the temporary folder: %s", e.Name())
		}
	})
	return env
}

// do serves one request and returns the recorded response.
func (e *testEnv) do(method, target string, body io.Reader, header ...string) *httptest.ResponseRecorder {
	e.t.Helper()
	req := httptest.NewRequest(method, target, body)
	for i := 0; i+1 < len(header); i += 2 {
		req.Header.Set(header[i], header[i+1])
	}
	rec := httptest.NewRecorder()
	e.h.ServeHTTP(rec, req)
	return rec
}

// serve serves a prepared request.
func (e *testEnv) serve(req *http.Request) *httptest.ResponseRecorder {
	rec := httptest.NewRecorder()
	e.h.ServeHTTP(rec, req)
	return rec
}

// post uploads a model as the raw body.
func (e *testEnv) post(query, model string) *httptest.ResponseRecorder {
	e.t.Helper()
	target := "/v1/checks"
	if query != "" {
		target += "?" + query
	}
	return e.do("POST", target, strings.NewReader(model), "Content-Type", "application/x-step")
}

// mustPost uploads a model and fails the test unless it is stored (201).
func (e *testEnv) mustPost(query, model string) map[string]any {
	e.t.Helper()
	rec := e.post(query, model)
	if rec.Code != http.StatusCreated {
		e.t.Fatalf("POST: %d %s", rec.Code, rec.Body)
	}
	return decode(e.t, rec.Body.Bytes())
}

// multipartBody builds a multipart body of the given parts (field, file
// name, content).
func multipartBody(t *testing.T, parts ...[3]string) (*bytes.Buffer, string) {
	t.Helper()
	var buf bytes.Buffer
	mw := multipart.NewWriter(&buf)
	for _, p := range parts {
		var w io.Writer
		var err error
		if p[1] == "" {
			w, err = mw.CreateFormField(p[0])
		} else {
			w, err = mw.CreateFormFile(p[0], p[1])
		}
		if err != nil {
			t.Fatal(err)
		}
		io.WriteString(w, p[2])
	}
	mw.Close()
	return &buf, mw.FormDataContentType()
}

func decode(t *testing.T, b []byte) map[string]any {
	t.Helper()
	var m map[string]any
	if err := json.Unmarshal(b, &m); err != nil {
		t.Fatalf("not JSON: %v\n%s", err, b)
	}
	return m
}

// errorOf returns the code of a JSON error response, failing on another shape.
func errorOf(t *testing.T, rec *httptest.ResponseRecorder) (code, msg string, pos map[string]any) {
	t.Helper()
	if ct := rec.Header().Get("Content-Type"); ct != "application/json" {
		t.Errorf("error Content-Type %q", ct)
	}
	var b struct {
		Error struct {
			Code     string         `json:"code"`
			Message  string         `json:"message"`
			Position map[string]any `json:"position"`
		} `json:"error"`
	}
	if err := json.Unmarshal(rec.Body.Bytes(), &b); err != nil || b.Error.Code == "" {
		t.Fatalf("not a JSON error (%v): %s", err, rec.Body)
	}
	return b.Error.Code, b.Error.Message, b.Error.Position
}

func gzipBytes(t *testing.T, s string) []byte {
	t.Helper()
	var buf bytes.Buffer
	zw := gzip.NewWriter(&buf)
	io.WriteString(zw, s)
	zw.Close()
	return buf.Bytes()
}
