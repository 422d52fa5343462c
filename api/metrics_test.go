package api

import (
	"strings"
	"testing"

	"github.com/prometheus/client_golang/prometheus"
	"github.com/prometheus/client_golang/prometheus/testutil"
	"github.com/prometheus/client_golang/prometheus/testutil/promlint"
)

// testutilValue returns the value of a counter or gauge with one label pair
// (none when label is ""), 0 when absent.
func testutilValue(t *testing.T, reg *prometheus.Registry, name, label, value string) float64 {
	t.Helper()
	if label == "" {
		return metricValue(t, reg, name)
	}
	return metricValue(t, reg, name, label, value)
}

// metricValue returns the value of the counter or gauge name whose labels
// include the given name/value pairs (a histogram gives its sample count),
// 0 when there is none.
func metricValue(t *testing.T, reg *prometheus.Registry, name string, labels ...string) float64 {
	t.Helper()
	mfs, err := reg.Gather()
	if err != nil {
		t.Fatal(err)
	}
	for _, mf := range mfs {
		if mf.GetName() != name {
			continue
		}
	metrics:
		for _, m := range mf.GetMetric() {
			for i := 0; i+1 < len(labels); i += 2 {
				found := false
				for _, lp := range m.GetLabel() {
					if lp.GetName() == labels[i] && lp.GetValue() == labels[i+1] {
						found = true
					}
				}
				if !found {
					continue metrics
				}
			}
			switch {
			case m.Counter != nil:
				return m.Counter.GetValue()
			case m.Gauge != nil:
				return m.Gauge.GetValue()
			case m.Histogram != nil:
				return float64(m.Histogram.GetSampleCount())
			}
		}
	}
	return 0
}

// TestMetrics: /metrics serves the service's registry; the metrics pass
// promlint; checks are counted by outcome and verdict; no label carries a
// GlobalId, a project name, a run id or a raw path.
func TestMetrics(t *testing.T) {
	env := newTestEnv(t, nil)
	env.mustPost("project=secret-project-name", fakeModel)
	env.mustPost("project=secret-project-name", fakeModel+"FAKE-SET:"+gidC2+"=pass;")
	env.post("", "not a model")
	env.do("GET", "/v1/checks/"+testRunID(1)+"/elements/"+gidC1, nil)
	env.do("GET", "/v1/projects/secret-project-name/members/"+gidC2+"/history", nil)
	env.do("GET", "/v1/no/such/path/"+gidC3, nil)
	env.do("BREW", "/v1/checks", nil)

	rec := env.do("GET", "/metrics", nil)
	if rec.Code != 200 {
		t.Fatalf("/metrics: %d", rec.Code)
	}
	text := rec.Body.String()
	for _, name := range []string{"swaygate_check_duration_seconds", "swaygate_model_size_bytes", "swaygate_members_checked_total",
		"swaygate_runs_total", "swaygate_checks_in_flight", "swaygate_http_requests_total", "swaygate_http_request_duration_seconds"} {
		if !strings.Contains(text, "# TYPE "+name+" ") {
			t.Errorf("/metrics has no %s", name)
		}
	}
	for _, leak := range []string{gidC1, gidC2, gidC3, "secret-project-name", testRunID(1), "/v1/no/such", "BREW"} {
		if strings.Contains(text, leak) {
			t.Errorf("/metrics carries %q", leak)
		}
	}

	// The scraped text passes the linter.
	problems, err := promlint.New(strings.NewReader(text)).Lint()
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range problems {
		t.Errorf("promlint: %s: %s", p.Metric, p.Text)
	}
	// And the registry itself, through client_golang's test utilities.
	regProblems, err := testutil.GatherAndLint(env.reg)
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range regProblems {
		t.Errorf("testutil lint: %s: %s", p.Metric, p.Text)
	}

	want := map[[2]string]float64{
		{"swaygate_runs_total", outcomeGateFailed}:           1,
		{"swaygate_runs_total", outcomeGatePassed}:           1,
		{"swaygate_runs_total", outcomeInvalid}:              1,
		{"swaygate_members_checked_total", "pass"}:           3, // source: the fake's verdicts, C2 passing in the second run
		{"swaygate_members_checked_total", "fail"}:           1,
		{"swaygate_members_checked_total", "needs-analysis"}: 2,
	}
	for k, v := range want {
		label := "outcome"
		if strings.HasPrefix(k[0], "swaygate_members") {
			label = "verdict"
		}
		if got := testutilValue(t, env.reg, k[0], label, k[1]); got != v {
			t.Errorf("%s{%s=%q} = %v, want %v", k[0], label, k[1], got, v)
		}
	}
	if got := testutilValue(t, env.reg, "swaygate_checks_in_flight", "", ""); got != 0 {
		t.Errorf("in flight after the checks: %v", got)
	}
	http := func(method, route, code string) float64 {
		return metricValue(t, env.reg, "swaygate_http_requests_total", "method", method, "route", route, "code", code)
	}
	if got := http("POST", "/v1/checks", "201"); got != 2 {
		t.Errorf("POST 201 count %v", got)
	}
	if got := http("GET", "unmatched", "404"); got != 1 {
		t.Errorf("unmatched 404 count %v", got)
	}
	if got := http("other", "unmatched", "405"); got != 1 {
		t.Errorf("unknown method count %v", got)
	}
	if got := metricValue(t, env.reg, "swaygate_check_duration_seconds"); got != 2 {
		t.Errorf("check duration samples %v", got)
	}
	if got := metricValue(t, env.reg, "swaygate_model_size_bytes"); got != 3 {
		t.Errorf("model size samples %v", got)
	}
}

// TestMetricsDefaultRegistry: without a registry the server makes its own,
// with the Go and process collectors, and never touches the global one.
func TestMetricsDefaultRegistry(t *testing.T) {
	env := newTestEnv(t, func(o *Options) { o.Registry = nil })
	text := env.do("GET", "/metrics", nil).Body.String()
	if !strings.Contains(text, "go_goroutines") || !strings.Contains(text, "swaygate_runs_total") {
		t.Errorf("default registry:\n%.400s", text)
	}
	mfs, _ := prometheus.DefaultGatherer.Gather()
	for _, mf := range mfs {
		if strings.HasPrefix(mf.GetName(), "swaygate_") {
			t.Errorf("%s on the global registry", mf.GetName())
		}
	}
}
