package api

import (
	"context"
	"errors"
	"fmt"
	"net"
	"net/http"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"sync"
	"sync/atomic"
	"time"

	"github.com/gin-gonic/gin"
	"github.com/google/uuid"
	"github.com/prometheus/client_golang/prometheus"
	"go.uber.org/zap"

	"swaygate/api/store"
)

// Defaults of Options.
const (
	DefaultMaxUploadBytes    = 2 << 30 // 2 GiB
	DefaultQueueTimeout      = time.Minute
	DefaultCheckTimeout      = 10 * time.Minute
	DefaultShutdownTimeout   = 30 * time.Second
	DefaultRetentionInterval = 10 * time.Minute
)

// What a POST does when every check slot is taken.
const (
	BusyWait   = "wait"   // wait up to QueueTimeout for a slot, then 429
	BusyReject = "reject" // answer 429 at once
)

// Options configure a Server. Store and DataDir are required; New fills the
// other zero values with the defaults documented on each field.
type Options struct {
	// Store keeps the runs. The caller opens and closes it.
	Store store.Store
	// DataDir holds the temporary uploads (DataDir/tmp, emptied at start) and
	// kept models (DataDir/models/RUN_ID/).
	DataDir string
	// Checker runs the checks; nil means PipelineChecker().
	Checker Checker
	// Logger receives the structured logs; nil means none.
	Logger *zap.Logger
	// Registry receives the metrics and is served at /metrics; nil means a
	// new registry with the Go and process collectors.
	Registry *prometheus.Registry

	// MaxUploadBytes bounds an upload, on the wire and after decoding a
	// Content-Encoding (default 2 GiB).
	MaxUploadBytes int64
	// MaxChecks bounds the checks that run at once (default GOMAXPROCS).
	// Uploads count from their first byte, so the bound also caps the disk
	// and memory taken by uploads.
	MaxChecks int
	// WhenBusy is BusyWait (default) or BusyReject.
	WhenBusy string
	// QueueTimeout bounds the wait for a slot in BusyWait mode (default 1 min).
	QueueTimeout time.Duration
	// CheckTimeout bounds one check, from the end of the upload (default 10 min).
	CheckTimeout time.Duration
	// ShutdownTimeout bounds the wait for in-flight requests on shutdown
	// (default 30 s); checks still running then are cancelled.
	ShutdownTimeout time.Duration
	// KeepModels keeps each checked model (and side-car) under DataDir/models.
	KeepModels bool
	// Retention deletes old runs: after each stored run and every
	// RetentionInterval (default 10 min). Zero keeps everything.
	Retention         store.Retention
	RetentionInterval time.Duration

	// ToolVersion is written into reports.
	ToolVersion string
	// Now is the clock (default time.Now); NewRunID the run id source
	// (default a random UUID). Tests fix both for stable output.
	Now      func() time.Time
	NewRunID func() string
}

// Server is the HTTP service. Create it with New, serve it with Serve (or
// mount Handler in a server of your own).
type Server struct {
	opt      Options
	log      *zap.Logger
	store    store.Store
	checker  Checker
	metrics  *metrics
	registry *prometheus.Registry
	limiter  *limiter
	router   *gin.Engine
	tmpDir   string
	modelDir string

	shutting atomic.Bool
	active   sync.WaitGroup // POSTs in progress
}

// New checks opt, applies its defaults, prepares the data directory and
// builds the router.
func New(opt Options) (*Server, error) {
	if opt.Store == nil {
		return nil, errors.New("api: no store")
	}
	if opt.DataDir == "" {
		return nil, errors.New("api: no data directory")
	}
	if opt.Checker == nil {
		opt.Checker = PipelineChecker()
	}
	if opt.Logger == nil {
		opt.Logger = zap.NewNop()
	}
	if opt.MaxUploadBytes <= 0 {
		opt.MaxUploadBytes = DefaultMaxUploadBytes
	}
	if opt.MaxChecks <= 0 {
		opt.MaxChecks = runtime.GOMAXPROCS(0)
	}
	switch opt.WhenBusy {
	case "":
		opt.WhenBusy = BusyWait
	case BusyWait, BusyReject:
	default:
		return nil, fmt.Errorf("api: when busy: %q is neither %q nor %q", opt.WhenBusy, BusyWait, BusyReject)
	}
	if opt.QueueTimeout <= 0 {
		opt.QueueTimeout = DefaultQueueTimeout
	}
	if opt.CheckTimeout <= 0 {
		opt.CheckTimeout = DefaultCheckTimeout
	}
	if opt.ShutdownTimeout <= 0 {
		opt.ShutdownTimeout = DefaultShutdownTimeout
	}
	if opt.RetentionInterval <= 0 {
		opt.RetentionInterval = DefaultRetentionInterval
	}
	if opt.Retention.MaxAge < 0 || opt.Retention.MaxRuns < 0 {
		return nil, errors.New("api: retention must not be negative")
	}
	if opt.Now == nil {
		opt.Now = time.Now
	}
	if opt.NewRunID == nil {
		opt.NewRunID = uuid.NewString
	}

	s := &Server{
		opt:      opt,
		log:      opt.Logger,
		store:    opt.Store,
		checker:  opt.Checker,
		tmpDir:   filepath.Join(opt.DataDir, "tmp"),
		modelDir: filepath.Join(opt.DataDir, "models"),
	}
	if err := s.prepareDirs(); err != nil {
		return nil, err
	}
	reg := opt.Registry
	if reg == nil {
		reg = newRegistry()
	}
	m, err := newMetrics(reg)
	if err != nil {
		return nil, err
	}
	s.registry, s.metrics = reg, m
	s.limiter = newLimiter(opt.MaxChecks, opt.WhenBusy == BusyWait, opt.QueueTimeout, m.waiting)
	s.router = s.routes()
	return s, nil
}

// prepareDirs creates the data directory's folders and empties the
// temporary one (uploads left by a crash).
func (s *Server) prepareDirs() error {
	for _, d := range []string{s.tmpDir, s.modelDir} {
		if err := os.MkdirAll(d, 0o750); err != nil {
			return fmt.Errorf("api: %w", err)
		}
	}
	ents, err := os.ReadDir(s.tmpDir)
	if err != nil {
		return fmt.Errorf("api: %w", err)
	}
	for _, e := range ents {
		if strings.HasPrefix(e.Name(), tmpPrefix) {
			os.RemoveAll(filepath.Join(s.tmpDir, e.Name()))
		}
	}
	return nil
}

// Handler returns the router.
func (s *Server) Handler() http.Handler { return s.router }

// Serve answers requests on ln until ctx is done, then shuts down: /readyz
// turns 503, new checks are refused, and in-flight requests get
// Options.ShutdownTimeout to finish before their checks are cancelled. It
// also prunes runs by Options.Retention. Serve returns nil after a clean
// shutdown.
func (s *Server) Serve(ctx context.Context, ln net.Listener) error {
	base, cancelBase := context.WithCancel(context.Background())
	defer cancelBase()
	hs := &http.Server{
		Handler:           s.router,
		ReadHeaderTimeout: 30 * time.Second,
		IdleTimeout:       2 * time.Minute,
		BaseContext:       func(net.Listener) context.Context { return base },
		ErrorLog:          zap.NewStdLog(s.log.With(zap.String("component", "http"))),
	}
	errc := make(chan error, 1)
	go func() { errc <- hs.Serve(ln) }()

	pruneDone := make(chan struct{})
	go func() {
		defer close(pruneDone)
		s.pruneLoop(base)
	}()

	var serveErr error
	select {
	case serveErr = <-errc:
		cancelBase()
		<-pruneDone
		return serveErr
	case <-ctx.Done():
	}

	s.shutting.Store(true)
	s.log.Info("shutting down", zap.Duration("timeout", s.opt.ShutdownTimeout),
		zap.Int("checks_in_flight", s.limiter.inUse()))
	sctx, cancel := context.WithTimeout(context.Background(), s.opt.ShutdownTimeout)
	defer cancel()
	err := hs.Shutdown(sctx)
	if err != nil {
		s.log.Warn("shutdown timeout: cancelling the checks still running", zap.Error(err))
	}
	cancelBase()
	if err != nil {
		hs.Close()
	}
	// Wait for the handlers of cancelled checks to finish with the store.
	done := make(chan struct{})
	go func() { s.active.Wait(); close(done) }()
	select {
	case <-done:
	case <-time.After(10 * time.Second):
		s.log.Error("checks did not stop after cancellation")
	}
	<-pruneDone
	if e := <-errc; e != nil && !errors.Is(e, http.ErrServerClosed) {
		return e
	}
	s.log.Info("stopped")
	return nil
}

// pruneLoop applies the retention at start and every RetentionInterval
// until ctx is done.
func (s *Server) pruneLoop(ctx context.Context) {
	if s.opt.Retention == (store.Retention{}) {
		return
	}
	t := time.NewTicker(s.opt.RetentionInterval)
	defer t.Stop()
	for {
		s.prune(ctx)
		select {
		case <-ctx.Done():
			return
		case <-t.C:
		}
	}
}

// prune deletes the runs the retention does not keep, with their kept models.
func (s *Server) prune(ctx context.Context) {
	if s.opt.Retention == (store.Retention{}) {
		return
	}
	ids, err := s.store.Prune(ctx, s.opt.Now(), s.opt.Retention)
	if err != nil {
		s.log.Error("retention", zap.Error(err))
		return
	}
	for _, id := range ids {
		s.removeKept(id)
	}
	if len(ids) > 0 {
		s.metrics.pruned.Add(float64(len(ids)))
		s.log.Info("retention deleted runs", zap.Int("runs", len(ids)))
	}
}
