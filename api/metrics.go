package api

import (
	"github.com/prometheus/client_golang/prometheus"
	"github.com/prometheus/client_golang/prometheus/collectors"
)

// metrics are the service's Prometheus metrics (design §7). Labels take
// bounded values only: verdicts, outcomes, methods, route templates and
// status codes; never a GlobalId, a path or a project name.
type metrics struct {
	checkDuration prometheus.Histogram
	modelBytes    prometheus.Histogram
	members       *prometheus.CounterVec // by verdict
	runs          *prometheus.CounterVec // by outcome
	inFlight      prometheus.Gauge
	waiting       prometheus.Gauge
	pruned        prometheus.Counter

	httpRequests *prometheus.CounterVec   // by method, route, code
	httpDuration *prometheus.HistogramVec // by method, route
}

// Outcomes of a check (label values of swaygate_runs_total).
const (
	outcomeGatePassed = "gate_passed"   // stored; the gate held
	outcomeGateFailed = "gate_failed"   // stored; the gate did not hold
	outcomeInvalid    = "invalid_input" // the model, side-car or options were refused (4xx)
	outcomeTimeout    = "timeout"
	outcomeCanceled   = "canceled" // the client went away or the server stopped
	outcomeError      = "error"    // an internal error or an unavailable dependency
)

var (
	outcomes = []string{outcomeGatePassed, outcomeGateFailed, outcomeInvalid, outcomeTimeout, outcomeCanceled, outcomeError}
	verdicts = []string{"pass", "fail", "needs-analysis"}
)

func newRegistry() *prometheus.Registry {
	reg := prometheus.NewRegistry()
	reg.MustRegister(
		collectors.NewGoCollector(),
		collectors.NewProcessCollector(collectors.ProcessCollectorOpts{}),
	)
	return reg
}

func newMetrics(reg prometheus.Registerer) (*metrics, error) {
	m := &metrics{
		checkDuration: prometheus.NewHistogram(prometheus.HistogramOpts{
			Name:    "swaygate_check_duration_seconds",
			Help:    "Time to check one model, from the end of the upload to the stored run.",
			Buckets: prometheus.ExponentialBuckets(0.01, 2.5, 12), // 10 ms .. about 10 min
		}),
		modelBytes: prometheus.NewHistogram(prometheus.HistogramOpts{
			Name:    "swaygate_model_size_bytes",
			Help:    "Size of uploaded models (after any Content-Encoding is decoded).",
			Buckets: prometheus.ExponentialBuckets(1024, 4, 12), // 1 KiB .. 4 GiB
		}),
		members: prometheus.NewCounterVec(prometheus.CounterOpts{
			Name: "swaygate_members_checked_total",
			Help: "Members checked, by verdict.",
		}, []string{"verdict"}),
		runs: prometheus.NewCounterVec(prometheus.CounterOpts{
			Name: "swaygate_runs_total",
			Help: "Checks by outcome: gate_passed, gate_failed, invalid_input, timeout, canceled, error.",
		}, []string{"outcome"}),
		inFlight: prometheus.NewGauge(prometheus.GaugeOpts{
			Name: "swaygate_checks_in_flight",
			Help: "Checks running now (upload, check and store).",
		}),
		waiting: prometheus.NewGauge(prometheus.GaugeOpts{
			Name: "swaygate_checks_waiting",
			Help: "Check requests waiting for a free slot.",
		}),
		pruned: prometheus.NewCounter(prometheus.CounterOpts{
			Name: "swaygate_runs_pruned_total",
			Help: "Runs deleted by the retention setting.",
		}),
		httpRequests: prometheus.NewCounterVec(prometheus.CounterOpts{
			Name: "swaygate_http_requests_total",
			Help: "HTTP requests by method, route template and status code.",
		}, []string{"method", "route", "code"}),
		httpDuration: prometheus.NewHistogramVec(prometheus.HistogramOpts{
			Name:    "swaygate_http_request_duration_seconds",
			Help:    "HTTP request latency by method and route template.",
			Buckets: []float64{0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10, 30, 60, 300},
		}, []string{"method", "route"}),
	}
	for _, c := range []prometheus.Collector{m.checkDuration, m.modelBytes, m.members, m.runs,
		m.inFlight, m.waiting, m.pruned, m.httpRequests, m.httpDuration} {
		if err := reg.Register(c); err != nil {
			return nil, err
		}
	}
	for _, v := range verdicts {
		m.members.WithLabelValues(v)
	}
	for _, o := range outcomes {
		m.runs.WithLabelValues(o)
	}
	return m, nil
}

// methodLabel bounds the method label to the standard methods.
func methodLabel(m string) string {
	switch m {
	case "GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS", "CONNECT", "TRACE":
		return m
	}
	return "other"
}

// routeLabel is the route template, or "unmatched" for a path no route
// serves (never the raw path).
func routeLabel(fullPath string) string {
	if fullPath == "" {
		return "unmatched"
	}
	return fullPath
}
