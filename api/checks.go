package api

import (
	"bufio"
	"context"
	"errors"
	"fmt"
	"io"
	"math"
	"net/http"
	"net/url"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"time"

	"github.com/gin-gonic/gin"
	"go.uber.org/zap"

	"swaygate/api/store"
	"swaygate/checks"
	"swaygate/checks/standards"
	"swaygate/ifcstep"
	"swaygate/internal/pipeline"
	"swaygate/reports"
)

// DefaultProject is the project of a run posted without one.
const DefaultProject = "default"

// checkParams are the query parameters of POST /v1/checks.
type checkParams struct {
	standard   string
	swayMethod string
	scope      string
	trace      string
	gate       string
	project    string
	units      string
	name       string

	nzsProvisions string
	aiscMethod    string
	include       []string
	loadCases     bool
	convention    string
	keFrom        string
}

// checkParamNames are the accepted query parameters; any other is a 400, so
// that a misspelt option is not silently ignored.
var checkParamNames = []string{"standard", "sway_method", "scope", "trace", "gate", "project", "units", "name",
	"nzs_provisions", "aisc_method", "include", "load_cases", "sign_convention", "ke_from"}

// parseCheckParams reads and checks the query before any upload is read.
// The engine checks the options again (checks.ErrOption).
func parseCheckParams(q url.Values) (checkParams, error) {
	for k, vs := range q {
		if !slices.Contains(checkParamNames, k) {
			return checkParams{}, newError(http.StatusBadRequest, codeUnknownParameter,
				"unknown query parameter "+strconv.Quote(k)+" (known: "+strings.Join(checkParamNames, ", ")+")")
		}
		if len(vs) > 1 {
			return checkParams{}, newError(http.StatusBadRequest, codeInvalidParameter, "query parameter "+k+" given more than once")
		}
	}
	p := checkParams{
		standard:   q.Get("standard"),
		swayMethod: q.Get("sway_method"),
		scope:      q.Get("scope"),
		trace:      q.Get("trace"),
		gate:       q.Get("gate"),
		project:    q.Get("project"),
		units:      q.Get("units"),
		name:       q.Get("name"),

		nzsProvisions: q.Get("nzs_provisions"),
		aiscMethod:    q.Get("aisc_method"),
		convention:    q.Get("sign_convention"),
		keFrom:        q.Get("ke_from"),
	}
	for _, t := range strings.Split(q.Get("include"), ",") {
		if t = strings.ToUpper(strings.TrimSpace(t)); t != "" {
			p.include = append(p.include, t)
		}
	}
	switch lc := q.Get("load_cases"); lc {
	case "", "false":
	case "true":
		p.loadCases = true
	default:
		return p, invalidParam("load_cases", lc, []string{"true", "false"})
	}
	if err := oneOf("nzs_provisions", p.nzsProvisions, "default", "quoted"); err != nil {
		return p, err
	}
	if err := oneOf("aisc_method", p.aiscMethod, "lrfd", "asd"); err != nil {
		return p, err
	}
	if err := oneOf("sign_convention", p.convention, "auto", "section-forces", "end-forces"); err != nil {
		return p, err
	}
	if err := oneOf("ke_from", p.keFrom, "auto", "property-set", "restraint-ratios", "buckling"); err != nil {
		return p, err
	}
	if p.standard != "" {
		if _, err := standards.Lookup(p.standard); err != nil {
			return p, invalidParam("standard", p.standard, standards.Names())
		}
	}
	if err := oneOf("sway_method", p.swayMethod, "storey", "member", "frame"); err != nil {
		return p, err
	}
	if err := oneOf("scope", p.scope, "stability", "full"); err != nil {
		return p, err
	}
	if err := oneOf("trace", p.trace, "full", "summary", "none"); err != nil {
		return p, err
	}
	if err := oneOf("gate", p.gate, reports.GateFail, reports.GateNeedsAnalysis, reports.GateNone); err != nil {
		return p, err
	}
	if err := oneOf("units", p.units, reports.UnitsSI, reports.UnitsUS); err != nil {
		return p, err
	}
	if p.project == "" {
		p.project = DefaultProject
	} else if !validProject(p.project) {
		return p, newError(http.StatusBadRequest, codeInvalidParameter,
			"project "+strconv.Quote(p.project)+": use 1 to 128 letters, digits, '.', '_' or '-', starting with a letter or digit")
	}
	if p.name != "" {
		p.name = sanitizeName(p.name)
	}
	return p, nil
}

func oneOf(key, v string, allowed ...string) error {
	if v == "" || slices.Contains(allowed, v) {
		return nil
	}
	return invalidParam(key, v, allowed)
}

func invalidParam(key, v string, allowed []string) error {
	return newError(http.StatusBadRequest, codeInvalidParameter,
		key+" "+strconv.Quote(v)+" is not one of "+strings.Join(allowed, ", "))
}

// validProject reports whether p is a project name: 1 to 128 ASCII letters,
// digits, '.', '_' or '-', starting with a letter or digit.
func validProject(p string) bool {
	if len(p) == 0 || len(p) > 128 {
		return false
	}
	for i := 0; i < len(p); i++ {
		b := p[i]
		switch {
		case b >= 'a' && b <= 'z', b >= 'A' && b <= 'Z', b >= '0' && b <= '9':
		case i > 0 && (b == '.' || b == '_' || b == '-'):
		default:
			return false
		}
	}
	return true
}

// createCheck is POST /v1/checks: receive the model, check it, store the run
// and answer 201 with the report.
func (s *Server) createCheck(c *gin.Context) (reply, error) {
	p, err := parseCheckParams(c.Request.URL.Query())
	if err != nil {
		return reply{}, err
	}
	if s.shutting.Load() {
		return reply{}, &apiError{status: http.StatusServiceUnavailable, code: codeShuttingDown,
			msg: "the server is shutting down", retryAfter: "30"}
	}
	s.active.Add(1)
	defer s.active.Done()
	release, err := s.limiter.acquire(c.Request.Context())
	if err != nil {
		if errors.Is(err, errBusy) {
			return reply{}, &apiError{status: http.StatusTooManyRequests, code: codeBusy,
				msg: "all " + strconv.Itoa(s.opt.MaxChecks) + " check slots are busy; try again later", retryAfter: "5"}
		}
		return reply{}, &apiError{status: http.StatusServiceUnavailable, code: codeCanceled, msg: "the request was cancelled", cause: err}
	}
	defer release()
	s.metrics.inFlight.Inc()
	defer s.metrics.inFlight.Dec()

	up, err := s.receive(c, p.name)
	if err != nil {
		s.refused(c, err, 0, 0)
		return reply{}, err
	}
	kept := false
	defer func() {
		if !kept {
			up.remove()
		}
	}()
	s.metrics.modelBytes.Observe(float64(up.modelSize))

	start := time.Now()
	opts := checks.DefaultOptions()
	if p.standard != "" {
		opts.Standard = p.standard
	}
	if p.swayMethod != "" {
		opts.SwayMethod = p.swayMethod
	}
	if p.scope != "" {
		opts.Scope = p.scope
	}
	if p.trace != "" {
		opts.Trace = p.trace
	}
	if p.nzsProvisions != "" {
		opts.NZSProvisions = p.nzsProvisions
	}
	if p.aiscMethod != "" {
		opts.AISCMethod = p.aiscMethod
	}
	if p.keFrom != "" {
		opts.KeFrom = p.keFrom
	}
	req := pipeline.Request{
		ModelPath:   up.modelPath,
		Name:        up.modelName,
		ActionsPath: up.actionsPath,
		ActionsName: up.actionsName,
		StoreysPath: up.storeysPath,
		StoreysName: up.storeysName,
		Options:     opts,
		Include:     p.include,
		LoadCases:   p.loadCases,
		Convention:  p.convention,
		Gate:        p.gate,
		Project:     p.project,
		Units:       p.units,
		RunID:       s.opt.NewRunID(),
		Now:         s.opt.Now,
		ToolVersion: s.opt.ToolVersion,
		// A gzip or zip model is bounded by the upload limit once expanded,
		// as a gzip Content-Encoding is.
		Limits: ifcstep.Limits{MaxFileSize: s.opt.MaxUploadBytes},
	}
	createdAt := s.opt.Now()
	ctx, cancel := context.WithTimeout(c.Request.Context(), s.opt.CheckTimeout)
	defer cancel()
	res, err := s.runChecker(ctx, req)
	if err != nil {
		ae := checkError(err, &req)
		s.refused(c, ae, up.modelSize, time.Since(start))
		return reply{}, ae
	}
	if res == nil || res.Report == nil {
		err := &apiError{status: http.StatusInternalServerError, code: codeInternal, msg: "internal error",
			cause: errors.New("api: the checker returned no report")}
		s.refused(c, err, up.modelSize, time.Since(start))
		return reply{}, err
	}

	rep := res.Report
	run := res.Run
	run.RunID = req.RunID
	if run.CreatedAt.IsZero() {
		run.CreatedAt = createdAt
	}
	run.ToolVersion = s.opt.ToolVersion
	run.Project = p.project
	run.Units = p.units
	if run.Model.File == "" {
		run.Model.File = up.modelName
	}
	if run.Gate, err = reports.NewGate(p.gate, rep.Summary); err != nil {
		return reply{}, checkError(err, &req) // parseCheckParams checked the policy
	}

	docs, err := s.render(rep, run)
	if err != nil {
		docs.remove()
		s.refused(c, err, up.modelSize, time.Since(start))
		return reply{}, err
	}
	sr := storeRun(rep, run, up.modelSize, time.Since(start))
	if err := s.save(c.Request.Context(), sr, elementRows(rep), docs); err != nil {
		docs.remove()
		ae := &apiError{status: http.StatusServiceUnavailable, code: codeUnavailable,
			msg: "the run could not be stored", retryAfter: "30", cause: err}
		s.refused(c, ae, up.modelSize, time.Since(start))
		return reply{}, ae
	}
	if s.opt.KeepModels {
		kept = s.keep(run.RunID, up)
	}
	d := time.Since(start)
	s.checked(c, sr, d)
	s.prune(c.Request.Context())

	body, size, err := docs.open(store.DocJSON)
	if err != nil {
		docs.remove()
		return reply{}, err
	}
	return reply{
		status:      http.StatusCreated,
		body:        body,
		size:        size,
		contentType: "application/json",
		location:    "/v1/checks/" + url.PathEscape(run.RunID),
		cleanup:     docs.remove,
	}, nil
}

// runChecker calls the checker, turning a panic into an error so that one bad
// model cannot take the service down.
func (s *Server) runChecker(ctx context.Context, req pipeline.Request) (res *pipeline.Result, err error) {
	defer func() {
		if v := recover(); v != nil {
			s.log.Error("checker panic", zap.String("run_id", req.RunID), zap.Any("panic", v), zap.Stack("stack"))
			res, err = nil, fmt.Errorf("api: checker panic: %v", v)
		}
	}()
	return s.checker.Check(ctx, req)
}

// save stores the run with its elements and documents.
func (s *Server) save(ctx context.Context, r *store.Run, els []store.Element, docs *rendered) error {
	var sds []store.Document
	for _, d := range docs.files {
		f, err := os.Open(d.path)
		if err != nil {
			return err
		}
		defer f.Close()
		sds = append(sds, store.Document{Kind: d.kind, Body: bufio.NewReaderSize(f, 64<<10)})
	}
	// A check that finished is stored even if the client went away meanwhile.
	return s.store.CreateRun(context.WithoutCancel(ctx), r, els, sds)
}

// refused logs and counts a check that did not produce a run.
func (s *Server) refused(c *gin.Context, err error, size int64, d time.Duration) {
	ae := asAPIError(err)
	outcome := outcomeInvalid
	switch {
	case ae.code == codeTimeout:
		outcome = outcomeTimeout
	case ae.code == codeCanceled:
		outcome = outcomeCanceled
	case ae.status >= 500:
		outcome = outcomeError
	}
	s.metrics.runs.WithLabelValues(outcome).Inc()
	s.log.Info("check refused",
		zap.String("request_id", requestIDOf(c)),
		zap.String("outcome", outcome),
		zap.Int("status", ae.status),
		zap.String("code", ae.code),
		zap.String("message", ae.msg),
		zap.Int64("model_bytes", size),
		zap.Duration("duration", d),
	)
}

// checked logs and counts a stored run.
func (s *Server) checked(c *gin.Context, r *store.Run, d time.Duration) {
	outcome := outcomeGateFailed
	if r.GatePassed {
		outcome = outcomeGatePassed
	}
	s.metrics.runs.WithLabelValues(outcome).Inc()
	s.metrics.checkDuration.Observe(d.Seconds())
	s.metrics.members.WithLabelValues("pass").Add(float64(r.Summary.Pass))
	s.metrics.members.WithLabelValues("fail").Add(float64(r.Summary.Fail))
	s.metrics.members.WithLabelValues("needs-analysis").Add(float64(r.Summary.NeedsAnalysis))
	s.log.Info("check",
		zap.String("request_id", requestIDOf(c)),
		zap.String("run_id", r.ID),
		zap.String("project", r.Project),
		zap.String("model", r.ModelName),
		zap.String("model_sha256", r.ModelSHA256),
		zap.Int64("model_bytes", r.ModelSize),
		zap.String("standard", r.Standard),
		zap.Int("members", r.Summary.Members),
		zap.Int("pass", r.Summary.Pass),
		zap.Int("fail", r.Summary.Fail),
		zap.Int("needs_analysis", r.Summary.NeedsAnalysis),
		zap.Int("warnings", r.Warnings),
		zap.String("gate", r.GatePolicy),
		zap.Bool("gate_passed", r.GatePassed),
		zap.Duration("duration", d),
	)
}

// storeRun is the run row of a finished check.
func storeRun(rep *checks.Report, run reports.Run, size int64, d time.Duration) *store.Run {
	return &store.Run{
		ID:          run.RunID,
		Project:     run.Project,
		Status:      store.StatusComplete,
		CreatedAt:   run.CreatedAt,
		ToolVersion: run.ToolVersion,
		Standard:    rep.Standard,
		SwayMethod:  rep.SwayMethod,
		Scope:       rep.Scope,
		ModelName:   run.Model.File,
		ModelSHA256: run.Model.SHA256,
		ModelSchema: run.Model.Schema,
		ModelSize:   size,
		Summary:     rep.Summary,
		Warnings:    len(rep.Warnings),
		GatePolicy:  run.Gate.Policy,
		GatePassed:  run.Gate.Passed,
		Duration:    d,
	}
}

// elementRows are the element rows of a report: what member history is
// built on.
func elementRows(rep *checks.Report) []store.Element {
	out := make([]store.Element, 0, len(rep.Elements))
	for i := range rep.Elements {
		e := &rep.Elements[i]
		m := e.Member
		if m == nil {
			continue
		}
		var codes []string
		for _, r := range e.Reasons {
			if !slices.Contains(codes, r.Code) {
				codes = append(codes, r.Code)
			}
		}
		out = append(out, store.Element{
			GlobalID:             m.GlobalID,
			Name:                 m.Name,
			Storey:               m.Storey,
			Entity:               m.Entity,
			Verdict:              e.Verdict.String(),
			GoverningCombination: e.GoverningCombination,
			GoverningDeltaM:      governingDeltaM(e),
			Reasons:              codes,
		})
	}
	return out
}

// governingDeltaM is the larger known delta_m of the two axes under the
// governing combination (the figure the text report shows), NaN when
// unknown.
func governingDeltaM(e *checks.Element) checks.Num {
	best := math.NaN()
	for i := range e.Combinations {
		cr := &e.Combinations[i]
		if cr.Name != e.GoverningCombination {
			continue
		}
		for a := range cr.Axes {
			v := cr.Axes[a].DeltaM.F()
			if math.IsNaN(v) || math.IsInf(v, 0) {
				continue
			}
			if math.IsNaN(best) || math.Abs(v) > math.Abs(best) {
				best = v
			}
		}
		break
	}
	return checks.Num(best)
}

// rendered are a run's documents in temporary files.
type rendered struct {
	files []renderedFile
}

type renderedFile struct {
	kind string
	path string
}

func (r *rendered) remove() {
	if r == nil {
		return
	}
	for _, f := range r.files {
		os.Remove(f.path)
	}
}

// open opens one document for the response; closing it removes nothing (the
// handler's cleanup does).
func (r *rendered) open(kind string) (io.ReadCloser, int64, error) {
	for _, f := range r.files {
		if f.kind != kind {
			continue
		}
		fh, err := os.Open(f.path)
		if err != nil {
			return nil, 0, storageError(err)
		}
		st, err := fh.Stat()
		if err != nil {
			fh.Close()
			return nil, 0, storageError(err)
		}
		return fh, st.Size(), nil
	}
	return nil, 0, store.ErrNotFound
}

// render writes the report in every stored format. A writer's refusal of
// the content (such as a GlobalId used twice) is the model's fault (422);
// a failure to write the file is the server's.
func (s *Server) render(rep *checks.Report, run reports.Run) (*rendered, error) {
	out := &rendered{}
	writers := []struct {
		kind  string
		write func(io.Writer, *checks.Report, reports.Run) error
	}{
		{store.DocJSON, reports.WriteJSON},
		{store.DocHTML, reports.WriteHTML},
		{store.DocJUnit, reports.WriteJUnit},
		{store.DocCSV, reports.WriteCSV},
	}
	for _, w := range writers {
		f, err := os.CreateTemp(s.tmpDir, tmpPrefix+"report-*."+w.kind)
		if err != nil {
			return out, storageError(err)
		}
		out.files = append(out.files, renderedFile{kind: w.kind, path: f.Name()})
		bw := bufio.NewWriterSize(writeTagger{f}, 64<<10)
		err = w.write(bw, rep, run)
		if err == nil {
			err = bw.Flush()
		}
		if cerr := f.Close(); err == nil && cerr != nil {
			err = writeErr{cerr}
		}
		if err != nil {
			var we writeErr
			if errors.As(err, &we) {
				return out, storageError(we.error)
			}
			return out, &apiError{status: http.StatusUnprocessableEntity, code: codeInvalidModel,
				msg: "the report cannot be written: " + err.Error(), cause: err}
		}
	}
	return out, nil
}

// writeTagger marks errors of the underlying file as writeErr.
type writeTagger struct{ w io.Writer }

func (t writeTagger) Write(p []byte) (int, error) {
	n, err := t.w.Write(p)
	if err != nil {
		err = writeErr{err}
	}
	return n, err
}

// keep moves a checked model (and side-car) to DataDir/models/RUN_ID/ and
// reports whether it did.
func (s *Server) keep(runID string, up *upload) bool {
	dir, ok := s.keptDir(runID)
	if !ok {
		return false
	}
	if err := os.Rename(up.dir, dir); err != nil {
		s.log.Error("keep model", zap.String("run_id", runID), zap.Error(err))
		return false
	}
	return true
}

// keptDir is the folder of a run's kept model; ok is false for an id that
// cannot be a folder name.
func (s *Server) keptDir(runID string) (string, bool) {
	if runID == "" || runID == "." || runID == ".." || strings.ContainsAny(runID, `/\`) {
		return "", false
	}
	return filepath.Join(s.modelDir, runID), true
}

// removeKept deletes a run's kept model, if any.
func (s *Server) removeKept(runID string) {
	if dir, ok := s.keptDir(runID); ok {
		os.RemoveAll(dir)
	}
}
