package api

import (
	"context"
	"encoding/json"
	"errors"
	"io"
	"net/http"
	"net/url"
	"strconv"
	"strings"
	"time"

	"github.com/gin-gonic/gin"

	"swaygate/api/store"
	"swaygate/checks"
)

// docKind is a stored rendering of a report.
type docKind struct {
	kind        string // store.Doc*
	contentType string
	ext         string // of the download's file name
	attachment  bool
}

var (
	docHTML  = docKind{store.DocHTML, "text/html; charset=utf-8", "html", false}
	docJUnit = docKind{store.DocJUnit, "application/xml; charset=utf-8", "junit.xml", true}
	docCSV   = docKind{store.DocCSV, "text/csv; charset=utf-8", "csv", true}
)

// htmlCSP lets the self-contained HTML report use its inline styles and
// nothing else.
const htmlCSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'"

// runParam returns the run id of the path; an id no run can have is a 404.
func runParam(c *gin.Context) (string, error) {
	id := c.Param("run_id")
	if id == "" || len(id) > 128 {
		return "", runNotFound(id)
	}
	return id, nil
}

func runNotFound(id string) *apiError {
	return newError(http.StatusNotFound, codeNotFound, "no run "+strconv.Quote(id))
}

// getReport is GET /v1/checks/{run_id}: the stored JSON report, the same
// bytes as the POST answered.
func (s *Server) getReport(c *gin.Context) (reply, error) {
	id, err := runParam(c)
	if err != nil {
		return reply{}, err
	}
	body, size, err := s.store.Document(c.Request.Context(), id, store.DocJSON)
	if errors.Is(err, store.ErrNotFound) {
		return reply{}, runNotFound(id)
	}
	if err != nil {
		return reply{}, err
	}
	return reply{body: body, size: size, contentType: "application/json"}, nil
}

// getDocument serves one stored rendering: GET /v1/checks/{run_id}/report.{html,junit,csv}.
func (s *Server) getDocument(d docKind) handlerFunc {
	return func(c *gin.Context) (reply, error) {
		id, err := runParam(c)
		if err != nil {
			return reply{}, err
		}
		body, size, err := s.store.Document(c.Request.Context(), id, d.kind)
		if errors.Is(err, store.ErrNotFound) {
			return reply{}, runNotFound(id)
		}
		if err != nil {
			return reply{}, err
		}
		h := map[string]string{}
		if d.attachment {
			h["Content-Disposition"] = `attachment; filename="swaygate-` + safeFileName(id) + "." + d.ext + `"`
		}
		if d.kind == store.DocHTML {
			h["Content-Security-Policy"] = htmlCSP
		}
		return reply{body: body, size: size, contentType: d.contentType, headers: h}, nil
	}
}

// safeFileName keeps the characters of id that need no quoting in a header.
func safeFileName(id string) string {
	return strings.Map(func(r rune) rune {
		if r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9' || r == '-' || r == '_' || r == '.' {
			return r
		}
		return '_'
	}, id)
}

// deleteRun is DELETE /v1/checks/{run_id}: 204, or 404.
func (s *Server) deleteRun(c *gin.Context) (reply, error) {
	id, err := runParam(c)
	if err != nil {
		return reply{}, err
	}
	err = s.store.DeleteRun(c.Request.Context(), id)
	if errors.Is(err, store.ErrNotFound) {
		return reply{}, runNotFound(id)
	}
	if err != nil {
		return reply{}, err
	}
	s.removeKept(id)
	return reply{status: http.StatusNoContent}, nil
}

// elementView is the answer of GET /v1/checks/{run_id}/elements/{global_id}.
type elementView struct {
	RunID    string          `json:"run_id"`
	GlobalID string          `json:"global_id"`
	Element  json.RawMessage `json:"element"` // as in the report's "elements"
}

// getElement answers one element of a stored report, as the report has it.
func (s *Server) getElement(c *gin.Context) (reply, error) {
	id, err := runParam(c)
	if err != nil {
		return reply{}, err
	}
	gid := c.Param("global_id")
	ctx := c.Request.Context()
	if _, err := s.store.Element(ctx, id, gid); errors.Is(err, store.ErrNotFound) {
		if _, rerr := s.store.Run(ctx, id); errors.Is(rerr, store.ErrNotFound) {
			return reply{}, runNotFound(id)
		}
		return reply{}, newError(http.StatusNotFound, codeNotFound, "run "+id+" has no element "+strconv.Quote(gid))
	} else if err != nil {
		return reply{}, err
	}
	body, _, err := s.store.Document(ctx, id, store.DocJSON)
	if err != nil {
		return reply{}, err
	}
	defer body.Close()
	raw, err := findElement(body, gid)
	if err != nil {
		return reply{}, err
	}
	return reply{data: elementView{RunID: id, GlobalID: gid, Element: raw}}, nil
}

// findElement reads a JSON report as a stream and returns the raw object of
// elements[gid], holding one element at a time.
func findElement(r io.Reader, gid string) (json.RawMessage, error) {
	dec := json.NewDecoder(r)
	if err := expectDelim(dec, '{'); err != nil {
		return nil, err
	}
	for dec.More() {
		key, err := dec.Token()
		if err != nil {
			return nil, err
		}
		if key != "elements" {
			if err := skipValue(dec); err != nil {
				return nil, err
			}
			continue
		}
		if err := expectDelim(dec, '{'); err != nil {
			return nil, err
		}
		for dec.More() {
			k, err := dec.Token()
			if err != nil {
				return nil, err
			}
			if k == gid {
				var raw json.RawMessage
				err := dec.Decode(&raw)
				return raw, err
			}
			if err := skipValue(dec); err != nil {
				return nil, err
			}
		}
		break
	}
	return nil, store.ErrNotFound
}

func expectDelim(dec *json.Decoder, d json.Delim) error {
	t, err := dec.Token()
	if err != nil {
		return err
	}
	if t != d {
		return errors.New("api: stored report: expected " + d.String())
	}
	return nil
}

// skipValue skips the next value without keeping it.
func skipValue(dec *json.Decoder) error {
	depth := 0
	for {
		t, err := dec.Token()
		if err != nil {
			return err
		}
		switch t {
		case json.Delim('{'), json.Delim('['):
			depth++
		case json.Delim('}'), json.Delim(']'):
			depth--
		}
		if depth == 0 {
			return nil
		}
	}
}

// runView is a run in a listing.
type runView struct {
	RunID           string      `json:"run_id"`
	Project         string      `json:"project"`
	Status          string      `json:"status"`
	CreatedAt       string      `json:"created_at"`
	ToolVersion     string      `json:"tool_version"`
	Standard        string      `json:"standard"`
	SwayMethod      string      `json:"sway_method"`
	Scope           string      `json:"scope"`
	Model           modelView   `json:"model"`
	Summary         summaryView `json:"summary"`
	Gate            gateView    `json:"gate"`
	Warnings        int         `json:"warnings"`
	DurationSeconds float64     `json:"duration_seconds"`
	Links           linksView   `json:"links"`
}

type modelView struct {
	File      string `json:"file"`
	SHA256    string `json:"sha256"`
	Schema    string `json:"schema"`
	SizeBytes int64  `json:"size_bytes"`
}

type summaryView struct {
	Members       int `json:"members"`
	Pass          int `json:"pass"`
	Fail          int `json:"fail"`
	NeedsAnalysis int `json:"needs_analysis"`
}

type gateView struct {
	Policy string `json:"policy"`
	Passed bool   `json:"passed"`
}

type linksView struct {
	Report string `json:"report"`
	HTML   string `json:"html"`
	JUnit  string `json:"junit"`
	CSV    string `json:"csv"`
}

func newRunView(r *store.Run) runView {
	base := "/v1/checks/" + url.PathEscape(r.ID)
	return runView{
		RunID:           r.ID,
		Project:         r.Project,
		Status:          r.Status,
		CreatedAt:       r.CreatedAt.UTC().Format(time.RFC3339Nano),
		ToolVersion:     r.ToolVersion,
		Standard:        r.Standard,
		SwayMethod:      r.SwayMethod,
		Scope:           r.Scope,
		Model:           modelView{File: r.ModelName, SHA256: r.ModelSHA256, Schema: r.ModelSchema, SizeBytes: r.ModelSize},
		Summary:         summaryView{r.Summary.Members, r.Summary.Pass, r.Summary.Fail, r.Summary.NeedsAnalysis},
		Gate:            gateView{Policy: r.GatePolicy, Passed: r.GatePassed},
		Warnings:        r.Warnings,
		DurationSeconds: r.Duration.Seconds(),
		Links: linksView{Report: base, HTML: base + "/report.html", JUnit: base + "/report.junit",
			CSV: base + "/report.csv"},
	}
}

// runList is the answer of GET /v1/projects/{project}/runs.
type runList struct {
	Project    string    `json:"project"`
	Runs       []runView `json:"runs"`
	NextCursor *string   `json:"next_cursor"` // null on the last page
}

// Page sizes of the listings.
const (
	defaultPageLimit = 50
	maxPageLimit     = 500
)

// pageParams reads limit and cursor; any other query parameter is a 400.
func pageParams(q url.Values) (store.Page, error) {
	for k, vs := range q {
		if k != "limit" && k != "cursor" {
			return store.Page{}, newError(http.StatusBadRequest, codeUnknownParameter,
				"unknown query parameter "+strconv.Quote(k)+" (known: limit, cursor)")
		}
		if len(vs) > 1 {
			return store.Page{}, newError(http.StatusBadRequest, codeInvalidParameter, "query parameter "+k+" given more than once")
		}
	}
	p := store.Page{Limit: defaultPageLimit, Cursor: q.Get("cursor")}
	if v := q.Get("limit"); v != "" {
		n, err := strconv.Atoi(v)
		if err != nil || n < 1 || n > maxPageLimit {
			return p, newError(http.StatusBadRequest, codeInvalidParameter,
				"limit "+strconv.Quote(v)+" is not a whole number from 1 to "+strconv.Itoa(maxPageLimit))
		}
		p.Limit = n
	}
	return p, nil
}

func projectParam(c *gin.Context) (string, error) {
	p := c.Param("project")
	if !validProject(p) {
		return "", newError(http.StatusBadRequest, codeInvalidParameter,
			"project "+strconv.Quote(p)+": use 1 to 128 letters, digits, '.', '_' or '-', starting with a letter or digit")
	}
	return p, nil
}

// listRuns is GET /v1/projects/{project}/runs: newest first, paginated. A
// project without runs has an empty list.
func (s *Server) listRuns(c *gin.Context) (reply, error) {
	project, err := projectParam(c)
	if err != nil {
		return reply{}, err
	}
	page, err := pageParams(c.Request.URL.Query())
	if err != nil {
		return reply{}, err
	}
	runs, next, err := s.store.ListRuns(c.Request.Context(), project, page)
	if err != nil {
		return reply{}, err
	}
	out := runList{Project: project, Runs: make([]runView, 0, len(runs)), NextCursor: optString(next)}
	for i := range runs {
		out.Runs = append(out.Runs, newRunView(&runs[i]))
	}
	return reply{data: out}, nil
}

// historyEntry is one member in one run.
type historyEntry struct {
	RunID                string     `json:"run_id"`
	CreatedAt            string     `json:"created_at"`
	Standard             string     `json:"standard"`
	Model                modelRef   `json:"model"`
	Name                 string     `json:"name"`
	Storey               *string    `json:"storey"`
	Verdict              string     `json:"verdict"`
	GoverningCombination *string    `json:"governing_combination"`
	GoverningDeltaM      checks.Num `json:"governing_delta_m"` // null when unknown
	Reasons              []string   `json:"reasons"`
	Report               string     `json:"report"` // the element's URL
}

type modelRef struct {
	File   string `json:"file"`
	SHA256 string `json:"sha256"`
}

// historyList is the answer of GET /v1/projects/{project}/members/{global_id}/history.
type historyList struct {
	Project    string         `json:"project"`
	GlobalID   string         `json:"global_id"`
	History    []historyEntry `json:"history"`
	NextCursor *string        `json:"next_cursor"`
}

// optString is s, or nil (JSON null) when empty.
func optString(s string) *string {
	if s == "" {
		return nil
	}
	return &s
}

// memberHistory is the verdict and governing delta_m of one member across a
// project's runs, newest first: what a dashboard of failing members plots.
func (s *Server) memberHistory(c *gin.Context) (reply, error) {
	project, err := projectParam(c)
	if err != nil {
		return reply{}, err
	}
	page, err := pageParams(c.Request.URL.Query())
	if err != nil {
		return reply{}, err
	}
	gid := c.Param("global_id")
	hs, next, err := s.store.MemberHistory(c.Request.Context(), project, gid, page)
	if err != nil {
		return reply{}, err
	}
	out := historyList{Project: project, GlobalID: gid, History: make([]historyEntry, 0, len(hs)), NextCursor: optString(next)}
	for i := range hs {
		r, e := &hs[i].Run, &hs[i].Element
		reasons := e.Reasons
		if reasons == nil {
			reasons = []string{}
		}
		out.History = append(out.History, historyEntry{
			RunID:                r.ID,
			CreatedAt:            r.CreatedAt.UTC().Format(time.RFC3339Nano),
			Standard:             r.Standard,
			Model:                modelRef{File: r.ModelName, SHA256: r.ModelSHA256},
			Name:                 e.Name,
			Storey:               optString(e.Storey),
			Verdict:              e.Verdict,
			GoverningCombination: optString(e.GoverningCombination),
			GoverningDeltaM:      e.GoverningDeltaM,
			Reasons:              reasons,
			Report:               "/v1/checks/" + url.PathEscape(r.ID) + "/elements/" + url.PathEscape(gid),
		})
	}
	return reply{data: out}, nil
}

// healthz: the process answers.
func (s *Server) healthz(*gin.Context) (reply, error) {
	return reply{data: map[string]string{"status": "ok"}}, nil
}

// readyz: the store answers and the server is not shutting down.
func (s *Server) readyz(c *gin.Context) (reply, error) {
	if s.shutting.Load() {
		return reply{}, newError(http.StatusServiceUnavailable, codeNotReady, "shutting down")
	}
	ctx, cancel := context.WithTimeout(c.Request.Context(), 2*time.Second)
	defer cancel()
	if err := s.store.Ping(ctx); err != nil {
		return reply{}, &apiError{status: http.StatusServiceUnavailable, code: codeNotReady, msg: "the run store does not answer", cause: err}
	}
	return reply{data: map[string]string{"status": "ready"}}, nil
}
