package api

import (
	"bytes"
	"context"
	"encoding/json"
	"flag"
	"net/http"
	"net/http/httptest"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/gin-gonic/gin"

	"swaygate/api/store"
	"swaygate/reports/schema"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata")

// TestCreateCheckGolden: with a fixed clock and run ids, the POST answers
// exactly the golden report, which the report schema accepts, and GET
// answers the same bytes.
func TestCreateCheckGolden(t *testing.T) {
	env := newTestEnv(t, nil)
	rec := env.post("project=tern-street&name=depot.ifc", fakeModel)
	if rec.Code != http.StatusCreated {
		t.Fatalf("POST: %d %s", rec.Code, rec.Body)
	}
	id := testRunID(1)
	if got := rec.Header().Get("Location"); got != "/v1/checks/"+id {
		t.Errorf("Location %q", got)
	}
	if ct := rec.Header().Get("Content-Type"); ct != "application/json" {
		t.Errorf("Content-Type %q", ct)
	}
	body := rec.Body.Bytes()
	if err := schema.ValidateReport(body); err != nil {
		t.Errorf("the report does not match its schema: %v", err)
	}
	golden := filepath.Join("testdata", "post-report.golden.json")
	if *update {
		os.MkdirAll("testdata", 0o755)
		os.WriteFile(golden, body, 0o644)
	}
	want, err := os.ReadFile(golden)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(body, want) {
		t.Errorf("POST report differs from %s (run with -update to rewrite):\n%s", golden, body)
	}

	get := env.do("GET", "/v1/checks/"+id, nil)
	if get.Code != http.StatusOK || !bytes.Equal(get.Body.Bytes(), body) {
		t.Errorf("GET: %d, same bytes as the POST: %v", get.Code, bytes.Equal(get.Body.Bytes(), body))
	}
	if cl := get.Header().Get("Content-Length"); cl != strconv.Itoa(len(body)) {
		t.Errorf("GET Content-Length %s, want %d", cl, len(body))
	}
}

// TestCreateCheckReport: the report's run facts and gate come from the
// request; the HTTP status does not depend on the gate.
func TestCreateCheckReport(t *testing.T) {
	env := newTestEnv(t, nil)
	tests := []struct {
		query      string
		model      string
		gatePolicy string
		gatePassed bool
	}{
		{"", fakeModel, "fail", false},
		{"gate=needs-analysis", fakeModel + "FAKE-SET:" + gidC2 + "=pass;", "needs-analysis", false},
		{"gate=fail", fakeModel + "FAKE-SET:" + gidC2 + "=pass;", "fail", true},
	}
	for _, tt := range tests {
		r := env.mustPost(tt.query, tt.model)
		g := r["gate"].(map[string]any)
		if g["policy"] != tt.gatePolicy || g["passed"] != tt.gatePassed {
			t.Errorf("%q: gate %v, want %s %v", tt.query, g, tt.gatePolicy, tt.gatePassed)
		}
		if r["project"] != DefaultProject {
			t.Errorf("project %v, want %s", r["project"], DefaultProject)
		}
	}
	req := env.fake.lastRequest()
	if req.Options.Standard != "as4100" || req.Gate != "fail" || req.Name != "model.ifc" || req.RunID != testRunID(3) {
		t.Errorf("pipeline request %+v", req)
	}
}

// TestCreateCheckOptions: query parameters reach the pipeline request.
func TestCreateCheckOptions(t *testing.T) {
	env := newTestEnv(t, nil)
	env.mustPost("standard=nzs3404&sway_method=member&scope=full&trace=summary&gate=needs-analysis&project=p-1&units=us&name=a%2Fb%2Fdepot.ifc", fakeModel)
	req := env.fake.lastRequest()
	o := req.Options
	if o.Standard != "nzs3404" || o.SwayMethod != "member" || o.Scope != "full" || o.Trace != "summary" ||
		req.Gate != "needs-analysis" || req.Project != "p-1" || req.Units != "us" || req.Name != "depot.ifc" {
		t.Errorf("pipeline request %+v", req)
	}
	if !strings.HasSuffix(req.ModelPath, ".ifc") {
		t.Errorf("the temporary model %s does not keep the extension", req.ModelPath)
	}
}

// TestCreateCheckMultipart: the model and side-car parts reach the pipeline;
// the side-car keeps (or gets) an extension that names its format.
func TestCreateCheckMultipart(t *testing.T) {
	env := newTestEnv(t, nil)
	tests := []struct {
		actionsName, actions, wantExt, wantName string
	}{
		{"loads.csv", "global_id,combination\n", ".csv", "loads.csv"},
		{"loads.txt", "  [ {\"global_id\": \"x\"} ]", ".json", "loads.txt"},
		{"", "global_id,combination\n", ".csv", "actions.csv"},
	}
	for _, tt := range tests {
		body, ct := multipartBody(t, [3]string{"model", "C:\\models\\depot.ifc", fakeModel}, [3]string{"actions", tt.actionsName, tt.actions})
		if tt.actionsName == "" {
			body, ct = multipartBody(t, [3]string{"model", "depot.ifc", fakeModel}, [3]string{"actions", "", tt.actions})
		}
		rec := env.do("POST", "/v1/checks?project=mp", body, "Content-Type", ct)
		if rec.Code != http.StatusCreated {
			t.Fatalf("%s: %d %s", tt.actionsName, rec.Code, rec.Body)
		}
		req := env.fake.lastRequest()
		if req.Name != "depot.ifc" || req.ActionsName != tt.wantName || filepath.Ext(req.ActionsPath) != tt.wantExt {
			t.Errorf("%s: name %q, actions %q at %s", tt.actionsName, req.Name, req.ActionsName, req.ActionsPath)
		}
	}
}

// TestCreateCheckGzip: a gzip Content-Encoding is decoded on the way; a gzip
// file sent as is goes to the reader unchanged.
func TestCreateCheckGzip(t *testing.T) {
	env := newTestEnv(t, nil)
	gz := gzipBytes(t, fakeModel)

	rec := env.do("POST", "/v1/checks", bytes.NewReader(gz), "Content-Type", "application/octet-stream", "Content-Encoding", "gzip")
	if rec.Code != http.StatusCreated {
		t.Fatalf("Content-Encoding gzip: %d %s", rec.Code, rec.Body)
	}
	r, _ := env.st.Run(context.Background(), testRunID(1))
	if r.ModelSize != int64(len(fakeModel)) {
		t.Errorf("decoded upload: size %d, want %d", r.ModelSize, len(fakeModel))
	}

	rec = env.do("POST", "/v1/checks?name=depot.ifc.gz", bytes.NewReader(gz), "Content-Type", "application/gzip")
	if rec.Code != http.StatusCreated {
		t.Fatalf("gzip file: %d %s", rec.Code, rec.Body)
	}
	r, _ = env.st.Run(context.Background(), testRunID(2))
	if r.ModelSize != int64(len(gz)) {
		t.Errorf("gzip file: size %d, want %d (kept as sent)", r.ModelSize, len(gz))
	}
	if p := env.fake.lastRequest().ModelPath; !strings.HasSuffix(p, ".gz") {
		t.Errorf("gzip file stored as %s", p)
	}
}

// TestCreateCheckErrors: every refusal is a JSON error with its status and
// code, and the position where the checker gave one.
func TestCreateCheckErrors(t *testing.T) {
	big := strings.Repeat("x", 3000)
	tests := []struct {
		name    string
		query   string
		body    []byte
		header  []string
		status  int
		code    string
		pos     map[string]any
		noCheck bool // the checker must not be called
	}{
		{name: "empty body", body: nil, status: 400, code: codeEmptyBody, noCheck: true},
		{name: "unknown parameter", query: "standrad=as4100", body: []byte(fakeModel), status: 400, code: codeUnknownParameter, noCheck: true},
		{name: "repeated parameter", query: "gate=fail&gate=fail", body: []byte(fakeModel), status: 400, code: codeInvalidParameter, noCheck: true},
		{name: "unknown standard", query: "standard=bs5950", body: []byte(fakeModel), status: 400, code: codeInvalidParameter, noCheck: true},
		{name: "bad sway method", query: "sway_method=guess", body: []byte(fakeModel), status: 400, code: codeInvalidParameter, noCheck: true},
		{name: "bad scope", query: "scope=most", body: []byte(fakeModel), status: 400, code: codeInvalidParameter, noCheck: true},
		{name: "bad trace", query: "trace=some", body: []byte(fakeModel), status: 400, code: codeInvalidParameter, noCheck: true},
		{name: "bad gate", query: "gate=never", body: []byte(fakeModel), status: 400, code: codeInvalidParameter, noCheck: true},
		{name: "bad units", query: "units=imperial", body: []byte(fakeModel), status: 400, code: codeInvalidParameter, noCheck: true},
		{name: "bad project", query: "project=../etc", body: []byte(fakeModel), status: 400, code: codeInvalidParameter, noCheck: true},
		{name: "JSON content type", body: []byte(fakeModel), header: []string{"Content-Type", "application/json"}, status: 415, code: codeUnsupportedType, noCheck: true},
		{name: "form content type", body: []byte(fakeModel), header: []string{"Content-Type", "application/x-www-form-urlencoded"}, status: 415, code: codeUnsupportedType, noCheck: true},
		{name: "malformed content type", body: []byte(fakeModel), header: []string{"Content-Type", "application/"}, status: 415, code: codeUnsupportedType, noCheck: true},
		{name: "brotli encoding", body: []byte(fakeModel), header: []string{"Content-Encoding", "br"}, status: 415, code: codeUnsupportedType, noCheck: true},
		{name: "not gzip", body: []byte(fakeModel), header: []string{"Content-Encoding", "gzip"}, status: 400, code: codeInvalidEncoding, noCheck: true},
		{name: "empty gzip", body: nil, header: []string{"Content-Encoding", "gzip"}, status: 400, code: codeEmptyBody, noCheck: true},
		{name: "too large", body: []byte(big), status: 413, code: codeTooLarge, noCheck: true},
		{name: "gzip expands beyond the limit", body: gzipBytes(t, big), header: []string{"Content-Encoding", "gzip"}, status: 413, code: codeTooLarge, noCheck: true},
		{name: "not STEP", body: []byte("hello, world\n"), status: 422, code: "model-not-step",
			pos: map[string]any{"file": "model.ifc", "line": 1.0, "column": 1.0, "byte": 0.0}},
		{name: "truncated", query: "name=t.ifc", body: []byte(fakeModel + "FAKE-TRUNCATED"), status: 422, code: "model-truncated",
			pos: map[string]any{"file": "t.ifc", "line": 3.0, "column": 7.0, "byte": 40.0, "instance": 12.0}},
		{name: "error naming the server's path", query: "name=p.ifc", body: []byte(fakeModel + "FAKE-PATHERR"), status: 422, code: "model-syntax",
			pos: map[string]any{"file": "p.ifc", "line": 2.0, "column": 1.0, "byte": 14.0}},
		{name: "option refused by the engine", body: []byte(fakeModel + "FAKE-OPTION"), status: 400, code: codeInvalidOption},
		{name: "internal error", body: []byte(fakeModel + "FAKE-INTERNAL"), status: 500, code: codeInternal},
		{name: "checker panic", body: []byte(fakeModel + "FAKE-PANIC"), status: 500, code: codeInternal},
		{name: "duplicate GlobalId", body: []byte(fakeModel + "FAKE-DUP"), status: 422, code: codeInvalidModel},
	}
	env := newTestEnv(t, func(o *Options) { o.MaxUploadBytes = 2048 })
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			env.t = t
			before := env.fake.calls.Load()
			target := "/v1/checks"
			if tt.query != "" {
				target += "?" + tt.query
			}
			hdr := tt.header
			if len(hdr) == 0 || hdr[0] != "Content-Type" {
				hdr = append([]string{"Content-Type", "application/octet-stream"}, hdr...)
			}
			rec := env.do("POST", target, bytes.NewReader(tt.body), hdr...)
			if rec.Code != tt.status {
				t.Fatalf("status %d, want %d: %s", rec.Code, tt.status, rec.Body)
			}
			code, msg, pos := errorOf(t, rec)
			if code != tt.code {
				t.Errorf("code %q, want %q (%s)", code, tt.code, msg)
			}
			if tt.pos != nil && !equalJSON(pos, tt.pos) {
				t.Errorf("position %v, want %v", pos, tt.pos)
			}
			if tt.pos == nil && pos != nil {
				t.Errorf("unexpected position %v", pos)
			}
			for _, leak := range []string{"goroutine", "secret", ".go:", "/srv/", env.dir, tmpPrefix} {
				if strings.Contains(rec.Body.String(), leak) {
					t.Errorf("the response leaks %q: %s", leak, rec.Body)
				}
			}
			if called := env.fake.calls.Load() != before; called == tt.noCheck {
				t.Errorf("checker called: %v", called)
			}
		})
	}
	env.t = t
	// The service still answers, and nothing was stored.
	if rec := env.do("GET", "/healthz", nil); rec.Code != 200 {
		t.Errorf("healthz after the errors: %d", rec.Code)
	}
	if runs, _, _ := env.st.ListRuns(context.Background(), DefaultProject, store.Page{}); len(runs) != 0 {
		t.Errorf("%d runs stored by refused checks", len(runs))
	}
	env.mustPost("", fakeModel)
}

func equalJSON(a, b any) bool {
	x, _ := json.Marshal(a)
	y, _ := json.Marshal(b)
	return bytes.Equal(x, y)
}

// TestCreateCheckSideCar: side-car errors are 422 with their position; a
// side-car naming unknown GlobalIds gives a stored run with a warning.
func TestCreateCheckSideCar(t *testing.T) {
	env := newTestEnv(t, nil)
	body, ct := multipartBody(t, [3]string{"model", "depot.ifc", fakeModel}, [3]string{"actions", "loads.csv", "global_id\nBAD"})
	rec := env.do("POST", "/v1/checks", body, "Content-Type", ct)
	if rec.Code != 422 {
		t.Fatalf("bad side-car: %d %s", rec.Code, rec.Body)
	}
	code, _, pos := errorOf(t, rec)
	if want := map[string]any{"file": "loads.csv", "line": 2.0, "column": 5.0, "byte": 0.0}; code != codeInvalidActions || !equalJSON(pos, want) {
		t.Errorf("bad side-car: %s at %v", code, pos)
	}

	body, ct = multipartBody(t, [3]string{"model", "depot.ifc", fakeModel}, [3]string{"actions", "loads.csv", "global_id\nUNKNOWNGID"})
	rec = env.do("POST", "/v1/checks", body, "Content-Type", ct)
	if rec.Code != 201 {
		t.Fatalf("unknown GlobalId: %d %s", rec.Code, rec.Body)
	}
	var r struct {
		Warnings []struct{ Code string } `json:"warnings"`
	}
	json.Unmarshal(rec.Body.Bytes(), &r)
	if len(r.Warnings) != 1 || r.Warnings[0].Code != "unknown-global-id" {
		t.Errorf("warnings %+v", r.Warnings)
	}
}

// TestCreateCheckMultipartErrors: malformed multipart bodies are 400.
func TestCreateCheckMultipartErrors(t *testing.T) {
	env := newTestEnv(t, nil)
	noModel, ct1 := multipartBody(t, [3]string{"actions", "a.csv", "x"})
	unknown, ct2 := multipartBody(t, [3]string{"model", "m.ifc", fakeModel}, [3]string{"standard", "", "as4100"})
	twice, ct3 := multipartBody(t, [3]string{"model", "m.ifc", fakeModel}, [3]string{"model", "n.ifc", fakeModel})
	emptyModel, ct4 := multipartBody(t, [3]string{"model", "m.ifc", ""})
	tests := []struct {
		name string
		body *bytes.Reader
		ct   string
		code string
	}{
		{"no model part", toReader(noModel), ct1, codeEmptyBody},
		{"unknown part", toReader(unknown), ct2, codeInvalidMultipart},
		{"two models", toReader(twice), ct3, codeInvalidMultipart},
		{"empty model", toReader(emptyModel), ct4, codeEmptyBody},
		{"no boundary", bytes.NewReader([]byte("x")), "multipart/form-data", codeInvalidMultipart},
		{"broken body", bytes.NewReader([]byte("--zz\r\nContent-Disposition: form-data; name=\"model\"\r\n\r\nISO")), "multipart/form-data; boundary=zz", codeInvalidMultipart},
	}
	for _, tt := range tests {
		rec := env.do("POST", "/v1/checks", tt.body, "Content-Type", tt.ct)
		if rec.Code != 400 {
			t.Errorf("%s: %d %s", tt.name, rec.Code, rec.Body)
			continue
		}
		if code, msg, _ := errorOf(t, rec); code != tt.code {
			t.Errorf("%s: %s (%s), want %s", tt.name, code, msg, tt.code)
		}
	}
	if n := env.fake.calls.Load(); n != 0 {
		t.Errorf("checker called %d times", n)
	}
}

func toReader(r interface{ Bytes() []byte }) *bytes.Reader { return bytes.NewReader(r.Bytes()) }

// TestCreateCheckEmptyModel: a model without columns is a valid run with an
// empty report and a warning.
func TestCreateCheckEmptyModel(t *testing.T) {
	env := newTestEnv(t, nil)
	r := env.mustPost("", fakeModel+"FAKE-EMPTY")
	if s := r["summary"].(map[string]any); s["members"] != 0.0 {
		t.Errorf("summary %v", s)
	}
	if len(r["elements"].(map[string]any)) != 0 || len(r["warnings"].([]any)) != 1 {
		t.Errorf("elements %v, warnings %v", r["elements"], r["warnings"])
	}
	if g := r["gate"].(map[string]any); g["passed"] != true {
		t.Errorf("gate %v", g)
	}
}

// TestBusyReject: with one slot in reject mode, a second check while the
// first runs is 429 with Retry-After.
func TestBusyReject(t *testing.T) {
	env := newTestEnv(t, func(o *Options) { o.MaxChecks = 1; o.WhenBusy = BusyReject })
	env.fake.started = make(chan string, 1)
	ctx, cancel := context.WithCancel(context.Background())
	done := make(chan *httptest.ResponseRecorder)
	go func() {
		req := httptest.NewRequest("POST", "/v1/checks", strings.NewReader(fakeModel+"FAKE-WAIT")).WithContext(ctx)
		rec := httptest.NewRecorder()
		env.h.ServeHTTP(rec, req)
		done <- rec
	}()
	<-env.fake.started
	rec := env.post("", fakeModel)
	if rec.Code != 429 || rec.Header().Get("Retry-After") == "" {
		t.Errorf("second check: %d, Retry-After %q", rec.Code, rec.Header().Get("Retry-After"))
	}
	if code, _, _ := errorOf(t, rec); code != codeBusy {
		t.Errorf("code %s", code)
	}
	// The client of the first check goes away: the check is cancelled.
	cancel()
	first := <-done
	if first.Code != 503 {
		t.Errorf("cancelled check: %d %s", first.Code, first.Body)
	}
	if got := testutilValue(t, env.reg, "swaygate_runs_total", "outcome", outcomeCanceled); got != 1 {
		t.Errorf("canceled runs %v", got)
	}
	env.mustPost("", fakeModel)
}

// TestBusyWait: in wait mode a check waits for a slot, and gets 429 after
// the queue timeout.
func TestBusyWait(t *testing.T) {
	env := newTestEnv(t, func(o *Options) { o.MaxChecks = 1; o.QueueTimeout = 50 * time.Millisecond })
	env.fake.started = make(chan string, 1)
	ctx, cancel := context.WithCancel(context.Background())
	done := make(chan struct{})
	go func() {
		defer close(done)
		req := httptest.NewRequest("POST", "/v1/checks", strings.NewReader(fakeModel+"FAKE-WAIT")).WithContext(ctx)
		env.h.ServeHTTP(httptest.NewRecorder(), req)
	}()
	<-env.fake.started
	start := time.Now()
	rec := env.post("", fakeModel)
	if rec.Code != 429 || time.Since(start) < 50*time.Millisecond {
		t.Errorf("waiting check: %d after %v", rec.Code, time.Since(start))
	}
	// A check that waits while the slot frees gets it.
	go func() { time.Sleep(20 * time.Millisecond); cancel() }()
	env.srv.limiter.timeout = 5 * time.Second
	if rec := env.post("", fakeModel); rec.Code != 201 {
		t.Errorf("check after the slot freed: %d %s", rec.Code, rec.Body)
	}
	<-done
}

// TestCheckTimeout: a check that runs out of time is 503 timeout.
func TestCheckTimeout(t *testing.T) {
	env := newTestEnv(t, func(o *Options) { o.CheckTimeout = 30 * time.Millisecond })
	rec := env.post("", fakeModel+"FAKE-WAIT")
	if code, _, _ := errorOf(t, rec); rec.Code != 503 || code != codeTimeout {
		t.Errorf("%d %s", rec.Code, rec.Body)
	}
	if got := testutilValue(t, env.reg, "swaygate_runs_total", "outcome", outcomeTimeout); got != 1 {
		t.Errorf("timeout runs %v", got)
	}
}

// TestShuttingDown: during shutdown new checks are 503 and /readyz is 503.
func TestShuttingDown(t *testing.T) {
	env := newTestEnv(t, nil)
	env.srv.shutting.Store(true)
	if rec := env.post("", fakeModel); rec.Code != 503 {
		t.Errorf("check: %d", rec.Code)
	}
	if rec := env.do("GET", "/readyz", nil); rec.Code != 503 {
		t.Errorf("readyz: %d", rec.Code)
	}
	if rec := env.do("GET", "/healthz", nil); rec.Code != 200 {
		t.Errorf("healthz: %d", rec.Code)
	}
}

func TestHealthReady(t *testing.T) {
	env := newTestEnv(t, nil)
	for _, p := range []string{"/healthz", "/readyz"} {
		rec := env.do("GET", p, nil)
		if rec.Code != 200 || !strings.Contains(rec.Body.String(), `"status"`) {
			t.Errorf("%s: %d %s", p, rec.Code, rec.Body)
		}
	}
	env.st.Close() // the store goes away
	rec := env.do("GET", "/readyz", nil)
	if code, _, _ := errorOf(t, rec); rec.Code != 503 || code != codeNotReady {
		t.Errorf("readyz without a store: %d %s", rec.Code, rec.Body)
	}
}

// TestRunEndpoints: report, element, documents and delete of a stored run.
func TestRunEndpoints(t *testing.T) {
	env := newTestEnv(t, nil)
	post := env.post("project=docs", fakeModel)
	id := testRunID(1)
	var report struct {
		Elements map[string]json.RawMessage `json:"elements"`
	}
	json.Unmarshal(post.Body.Bytes(), &report)

	rec := env.do("GET", "/v1/checks/"+id+"/elements/"+gidC2, nil)
	if rec.Code != 200 {
		t.Fatalf("element: %d %s", rec.Code, rec.Body)
	}
	var el elementView
	json.Unmarshal(rec.Body.Bytes(), &el)
	if el.RunID != id || el.GlobalID != gidC2 || !bytes.Equal(el.Element, report.Elements[gidC2]) {
		t.Errorf("element %s %s:\n%s\nwant\n%s", el.RunID, el.GlobalID, el.Element, report.Elements[gidC2])
	}

	docs := []struct {
		path, ct, prefix, disposition string
	}{
		{"report.html", "text/html; charset=utf-8", "<!DOCTYPE html>", ""},
		{"report.junit", "application/xml; charset=utf-8", "<?xml", `attachment; filename="swaygate-` + id + `.junit.xml"`},
		{"report.csv", "text/csv; charset=utf-8", "global_id", `attachment; filename="swaygate-` + id + `.csv"`},
	}
	for _, d := range docs {
		rec := env.do("GET", "/v1/checks/"+id+"/"+d.path, nil)
		if rec.Code != 200 || rec.Header().Get("Content-Type") != d.ct {
			t.Errorf("%s: %d %s", d.path, rec.Code, rec.Header().Get("Content-Type"))
			continue
		}
		if !strings.HasPrefix(strings.TrimSpace(rec.Body.String()), d.prefix) {
			t.Errorf("%s starts %.40q", d.path, rec.Body.String())
		}
		if got := rec.Header().Get("Content-Disposition"); got != d.disposition {
			t.Errorf("%s: Content-Disposition %q", d.path, got)
		}
		if !strings.Contains(rec.Body.String(), gidC2) {
			t.Errorf("%s does not name %s", d.path, gidC2)
		}
	}
	if csp := env.do("GET", "/v1/checks/"+id+"/report.html", nil).Header().Get("Content-Security-Policy"); !strings.Contains(csp, "default-src 'none'") {
		t.Errorf("HTML report CSP %q", csp)
	}

	notFound := []string{
		"/v1/checks/nope",
		"/v1/checks/nope/report.html",
		"/v1/checks/nope/elements/" + gidC1,
		"/v1/checks/" + id + "/elements/nope",
		"/v1/checks/" + strings.Repeat("x", 200),
		"/v1/nothing",
	}
	for _, p := range notFound {
		rec := env.do("GET", p, nil)
		if code, _, _ := errorOf(t, rec); rec.Code != 404 || code != codeNotFound {
			t.Errorf("GET %s: %d %s", p, rec.Code, rec.Body)
		}
	}
	if rec := env.do("PUT", "/v1/checks", nil); rec.Code != 405 {
		t.Errorf("PUT /v1/checks: %d", rec.Code)
	} else if code, _, _ := errorOf(t, rec); code != codeMethodNotAllowed {
		t.Errorf("PUT /v1/checks: %s", code)
	}

	if rec := env.do("DELETE", "/v1/checks/"+id, nil); rec.Code != 204 || rec.Body.Len() != 0 {
		t.Errorf("DELETE: %d %q", rec.Code, rec.Body)
	}
	for _, p := range []string{"/v1/checks/" + id, "/v1/checks/" + id + "/report.csv", "/v1/checks/" + id + "/elements/" + gidC1} {
		if rec := env.do("GET", p, nil); rec.Code != 404 {
			t.Errorf("GET %s after delete: %d", p, rec.Code)
		}
	}
	if rec := env.do("DELETE", "/v1/checks/"+id, nil); rec.Code != 404 {
		t.Errorf("second DELETE: %d", rec.Code)
	}
}

// TestListRuns: newest first, summary counts, pages by cursor.
func TestListRuns(t *testing.T) {
	env := newTestEnv(t, nil)
	for i := 0; i < 5; i++ {
		env.mustPost("project=p1", fakeModel)
	}
	env.mustPost("project=p2", fakeModel)

	var ids []string
	next := ""
	for page := 0; ; page++ {
		target := "/v1/projects/p1/runs?limit=2"
		if next != "" {
			target += "&cursor=" + next
		}
		rec := env.do("GET", target, nil)
		if rec.Code != 200 {
			t.Fatalf("page %d: %d %s", page, rec.Code, rec.Body)
		}
		var l runList
		json.Unmarshal(rec.Body.Bytes(), &l)
		if l.Project != "p1" || len(l.Runs) != []int{2, 2, 1}[page] {
			t.Fatalf("page %d: %+v", page, l)
		}
		for _, r := range l.Runs {
			ids = append(ids, r.RunID)
			if r.Summary != (summaryView{3, 1, 1, 1}) || r.Gate != (gateView{"fail", false}) || r.Status != "complete" ||
				r.Model.File != "model.ifc" || r.Model.SizeBytes != int64(len(fakeModel)) || len(r.Model.SHA256) != 64 ||
				r.Links.HTML != "/v1/checks/"+r.RunID+"/report.html" {
				t.Errorf("run %+v", r)
			}
		}
		if l.NextCursor == nil {
			break
		}
		next = *l.NextCursor
	}
	want := []string{testRunID(5), testRunID(4), testRunID(3), testRunID(2), testRunID(1)}
	if strings.Join(ids, ",") != strings.Join(want, ",") {
		t.Errorf("runs %v, want %v", ids, want)
	}
	if rec := env.do("GET", "/v1/projects/none/runs", nil); rec.Code != 200 || !strings.Contains(rec.Body.String(), `"runs":[]`) {
		t.Errorf("project without runs: %d %s", rec.Code, rec.Body)
	}
	bad := []string{"?limit=0", "?limit=501", "?limit=x", "?cursor=zzz", "?page=2", "?limit=1&limit=2"}
	for _, q := range bad {
		rec := env.do("GET", "/v1/projects/p1/runs"+q, nil)
		if rec.Code != 400 {
			t.Errorf("%s: %d", q, rec.Code)
		}
		errorOf(t, rec)
	}
	if rec := env.do("GET", "/v1/projects/-bad/runs", nil); rec.Code != 400 {
		t.Errorf("bad project name: %d", rec.Code)
	}
}

// TestMemberHistory: one member's verdict and governing delta_m across runs.
func TestMemberHistory(t *testing.T) {
	env := newTestEnv(t, nil)
	verdicts := []string{"fail", "needs-analysis", "pass"}
	for _, v := range verdicts {
		env.mustPost("project=hist", fakeModel+"FAKE-SET:"+gidC2+"="+v+";")
	}
	env.mustPost("project=other", fakeModel)

	rec := env.do("GET", "/v1/projects/hist/members/"+gidC2+"/history", nil)
	if rec.Code != 200 {
		t.Fatalf("%d %s", rec.Code, rec.Body)
	}
	var h historyList
	json.Unmarshal(rec.Body.Bytes(), &h)
	if h.GlobalID != gidC2 || len(h.History) != 3 || h.NextCursor != nil {
		t.Fatalf("%+v", h)
	}
	for i, e := range h.History {
		want := verdicts[2-i]
		if e.Verdict != want || e.RunID != testRunID(int64(3-i)) || e.Name != "C2" || *e.Storey != "Level 1" {
			t.Errorf("entry %d: %+v, want verdict %s", i, e, want)
		}
		// source: the fake's C2 has delta_m 1.2 major and unknown minor
		if e.GoverningDeltaM.F() != 1.2 {
			t.Errorf("entry %d: delta_m %v", i, e.GoverningDeltaM)
		}
	}
	if h.History[2].GoverningCombination == nil || *h.History[2].GoverningCombination != "ULS-2" || h.History[2].Reasons[0] != "unstable" {
		t.Errorf("failing entry %+v", h.History[2])
	}
	// An unknown delta_m is null.
	rec = env.do("GET", "/v1/projects/hist/members/"+gidC3+"/history?limit=1", nil)
	if !strings.Contains(rec.Body.String(), `"governing_delta_m":null`) || !strings.Contains(rec.Body.String(), `"next_cursor":"`) {
		t.Errorf("C3: %s", rec.Body)
	}
	rec = env.do("GET", "/v1/projects/hist/members/nobody/history", nil)
	if rec.Code != 200 || !strings.Contains(rec.Body.String(), `"history":[]`) {
		t.Errorf("unknown member: %d %s", rec.Code, rec.Body)
	}
}

// TestRequestID: a sane X-Request-ID is echoed, another is replaced.
func TestRequestID(t *testing.T) {
	env := newTestEnv(t, nil)
	if got := env.do("GET", "/healthz", nil, "X-Request-ID", "abc-123").Header().Get("X-Request-ID"); got != "abc-123" {
		t.Errorf("echoed %q", got)
	}
	for _, in := range []string{"", "has space", strings.Repeat("x", 129), "ctl\x01"} {
		got := env.do("GET", "/healthz", nil, "X-Request-ID", in).Header().Get("X-Request-ID")
		if got == in || len(got) != 36 {
			t.Errorf("%q: got %q", in, got)
		}
	}
}

// TestLogs: one line per request with its route template, one per check
// with run id, model hash, member counts and duration; panics are logged
// with their stack (and only logged).
func TestLogs(t *testing.T) {
	env := newTestEnv(t, nil)
	env.do("POST", "/v1/checks?project=logs", strings.NewReader(fakeModel), "Content-Type", "application/x-step", "X-Request-ID", "req-1")
	env.do("GET", "/v1/checks/"+testRunID(1)+"/elements/"+gidC1, nil)
	env.post("", fakeModel+"FAKE-PANIC")

	checks := env.logs.FilterMessage("check").All()
	if len(checks) != 1 {
		t.Fatalf("%d check lines", len(checks))
	}
	f := checks[0].ContextMap()
	for _, k := range []string{"run_id", "model_sha256", "members", "pass", "fail", "needs_analysis", "duration", "request_id", "project"} {
		if _, ok := f[k]; !ok {
			t.Errorf("check line without %s: %v", k, f)
		}
	}
	if f["run_id"] != testRunID(1) || f["request_id"] != "req-1" || f["members"] != int64(3) || len(f["model_sha256"].(string)) != 64 {
		t.Errorf("check line %v", f)
	}
	reqs := env.logs.FilterMessage("request").All()
	if len(reqs) != 3 {
		t.Fatalf("%d request lines", len(reqs))
	}
	if r := reqs[1].ContextMap(); r["route"] != "/v1/checks/:run_id/elements/:global_id" || r["status"] != int64(200) {
		t.Errorf("request line %v", r)
	}
	if n := env.logs.FilterMessage("checker panic").Len(); n != 1 {
		t.Errorf("%d panic lines", n)
	}
}

// TestRecoveryMiddleware: a panic outside the checker is a 500 without a
// stack trace, and the server keeps answering.
func TestRecoveryMiddleware(t *testing.T) {
	env := newTestEnv(t, nil)
	env.srv.router.GET("/panic", func(c *gin.Context) { panic("boom at secret.go:12") })
	rec := env.do("GET", "/panic", nil)
	if code, msg, _ := errorOf(t, rec); rec.Code != 500 || code != codeInternal || strings.Contains(msg, "secret") {
		t.Errorf("%d %s", rec.Code, rec.Body)
	}
	if env.logs.FilterMessage("panic").Len() != 1 {
		t.Error("panic not logged")
	}
	if rec := env.do("GET", "/healthz", nil); rec.Code != 200 {
		t.Errorf("after a panic: %d", rec.Code)
	}
}

// TestKeepModels: with KeepModels the model and side-car stay under
// models/RUN_ID until the run is deleted; without, nothing stays.
func TestKeepModels(t *testing.T) {
	env := newTestEnv(t, func(o *Options) { o.KeepModels = true })
	body, ct := multipartBody(t, [3]string{"model", "depot.ifc", fakeModel}, [3]string{"actions", "loads.csv", "global_id\n"})
	if rec := env.do("POST", "/v1/checks", body, "Content-Type", ct); rec.Code != 201 {
		t.Fatalf("%d %s", rec.Code, rec.Body)
	}
	dir := filepath.Join(env.dir, "models", testRunID(1))
	for _, f := range []string{"depot.ifc", "loads.csv"} {
		if b, err := os.ReadFile(filepath.Join(dir, f)); err != nil || len(b) == 0 {
			t.Errorf("kept %s: %v", f, err)
		}
	}
	env.do("DELETE", "/v1/checks/"+testRunID(1), nil)
	if _, err := os.Stat(dir); !os.IsNotExist(err) {
		t.Errorf("kept model after delete: %v", err)
	}

	env2 := newTestEnv(t, nil)
	env2.mustPost("", fakeModel)
	if ents, _ := os.ReadDir(filepath.Join(env2.dir, "models")); len(ents) != 0 {
		t.Errorf("models kept without KeepModels: %v", ents)
	}
}

// TestRetention: runs beyond the per-project limit are deleted after each
// stored run.
func TestRetention(t *testing.T) {
	env := newTestEnv(t, func(o *Options) { o.Retention = store.Retention{MaxRuns: 2} })
	for i := 0; i < 4; i++ {
		env.mustPost("project=r", fakeModel)
	}
	var l runList
	json.Unmarshal(env.do("GET", "/v1/projects/r/runs", nil).Body.Bytes(), &l)
	if len(l.Runs) != 2 || l.Runs[1].RunID != testRunID(3) {
		t.Errorf("%+v", l.Runs)
	}
	if got := testutilValue(t, env.reg, "swaygate_runs_pruned_total", "", ""); got != 2 {
		t.Errorf("pruned %v", got)
	}
}

func TestNewOptions(t *testing.T) {
	st, err := store.OpenSQLite(context.Background(), t.TempDir())
	if err != nil {
		t.Fatal(err)
	}
	defer st.Close()
	bad := []Options{
		{DataDir: t.TempDir()},
		{Store: st},
		{Store: st, DataDir: t.TempDir(), WhenBusy: "queue"},
		{Store: st, DataDir: t.TempDir(), Retention: store.Retention{MaxRuns: -1}},
	}
	for i, o := range bad {
		if _, err := New(o); err == nil {
			t.Errorf("options %d accepted", i)
		}
	}
	// New clears uploads a crash left behind, and nothing else.
	dir := t.TempDir()
	os.MkdirAll(filepath.Join(dir, "tmp"), 0o755)
	os.WriteFile(filepath.Join(dir, "tmp", tmpPrefix+"upload-1.ifc"), []byte("x"), 0o644)
	os.WriteFile(filepath.Join(dir, "tmp", "other"), []byte("x"), 0o644)
	if _, err := New(Options{Store: st, DataDir: dir}); err != nil {
		t.Fatal(err)
	}
	ents, _ := os.ReadDir(filepath.Join(dir, "tmp"))
	if len(ents) != 1 || ents[0].Name() != "other" {
		t.Errorf("tmp after New: %v", ents)
	}
}

// TestPostOptionsReachThePipeline: the extraction and standard options of
// POST /v1/checks are passed to the check; bad values are 400.
func TestPostOptionsReachThePipeline(t *testing.T) {
	env := newTestEnv(t, nil)
	rec := env.post("standard=aisc360&aisc_method=asd&nzs_provisions=quoted&include=post,Strut&load_cases=true&sign_convention=end-forces&ke_from=buckling", fakeModel)
	if rec.Code != 201 {
		t.Fatalf("status %d: %s", rec.Code, rec.Body.String())
	}
	req := env.fake.lastRequest()
	if req.Options.AISCMethod != "asd" || req.Options.NZSProvisions != "quoted" || !req.LoadCases ||
		req.Convention != "end-forces" || req.Options.KeFrom != "buckling" || strings.Join(req.Include, ",") != "POST,STRUT" {
		t.Errorf("request %+v", req)
	}
	for _, q := range []string{"load_cases=yes", "aisc_method=lsd", "sign_convention=both", "nzs_provisions=new", "ke_from=guess"} {
		if rec := env.post(q, fakeModel); rec.Code != 400 {
			t.Errorf("%s: status %d, want 400", q, rec.Code)
		}
	}
}
