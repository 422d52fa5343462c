package store

import (
	"context"
	"errors"
	"io"
	"time"

	"swaygate/checks"
)

// Errors returned by every Store.
var (
	// ErrNotFound: no run (or element, or document) with that id.
	ErrNotFound = errors.New("store: not found")
	// ErrExists: a run with that id is already stored.
	ErrExists = errors.New("store: run already exists")
	// ErrCursor: a page cursor that this store did not hand out.
	ErrCursor = errors.New("store: invalid cursor")
)

// Run statuses.
const (
	// StatusComplete: the check finished and its report is stored. Only
	// complete runs are stored today; queued and running states come with
	// asynchronous checks.
	StatusComplete = "complete"
)

// Document kinds.
const (
	DocJSON  = "json"  // the canonical report, as the POST answered
	DocHTML  = "html"  // reports.WriteHTML
	DocJUnit = "junit" // reports.WriteJUnit
	DocCSV   = "csv"   // reports.WriteCSV
)

// Run is one stored check.
type Run struct {
	ID          string
	Project     string
	Status      string
	CreatedAt   time.Time // stored to the nanosecond, read back in UTC
	ToolVersion string

	Standard   string
	SwayMethod string
	Scope      string

	ModelName   string
	ModelSHA256 string
	ModelSchema string
	ModelSize   int64 // bytes as uploaded (after any Content-Encoding)

	Summary  checks.Summary
	Warnings int // number of run warnings in the report

	GatePolicy string
	GatePassed bool

	Duration time.Duration // of the check, stored in milliseconds
}

// Element is one checked member of a run.
type Element struct {
	GlobalID             string
	Name                 string
	Storey               string
	Entity               string
	Verdict              string // "pass", "fail", "needs-analysis"
	GoverningCombination string
	// GoverningDeltaM is the larger known delta_m of the two axes under the
	// governing combination; NaN (null) when unknown.
	GoverningDeltaM checks.Num
	// Reasons are the codes of the member's reasons, in report order,
	// without repeats.
	Reasons []string
}

// Document is one rendering of a run's report given to CreateRun.
type Document struct {
	Kind string    // DocJSON, DocHTML, DocJUnit or DocCSV
	Body io.Reader // read to the end once
}

// HistoryEntry is one member in one run.
type HistoryEntry struct {
	Run     Run
	Element Element
}

// Page selects one page of a listing.
type Page struct {
	Limit  int    // at most this many rows; <= 0 means 50
	Cursor string // "" for the first page; else a cursor returned before
}

// DefaultLimit is the page size when Page.Limit is not positive.
const DefaultLimit = 50

// Retention says which runs Prune deletes. Zero fields keep everything.
type Retention struct {
	MaxAge  time.Duration // runs created longer ago than this
	MaxRuns int           // beyond this many runs of one project (the oldest go)
}

// Store keeps runs. Implementations are safe for concurrent use.
type Store interface {
	// CreateRun stores a complete run with its elements and documents in one
	// transaction. ErrExists if the id is taken.
	CreateRun(ctx context.Context, r *Run, elements []Element, docs []Document) error
	// Run returns one run; ErrNotFound if there is none.
	Run(ctx context.Context, id string) (*Run, error)
	// Document returns a run's document and its size in bytes; the caller
	// closes it. ErrNotFound if the run or that kind is missing.
	Document(ctx context.Context, runID, kind string) (io.ReadCloser, int64, error)
	// Element returns one element of a run; ErrNotFound if the run or the
	// element is missing.
	Element(ctx context.Context, runID, globalID string) (*Element, error)
	// DeleteRun deletes a run with its elements and documents; ErrNotFound if
	// there is none.
	DeleteRun(ctx context.Context, id string) error
	// ListRuns lists a project's runs newest first and returns the next
	// page's cursor ("" on the last page).
	ListRuns(ctx context.Context, project string, p Page) ([]Run, string, error)
	// MemberHistory lists one member (by GlobalId) across a project's runs,
	// newest first, with the next page's cursor.
	MemberHistory(ctx context.Context, project, globalID string, p Page) ([]HistoryEntry, string, error)
	// Prune deletes the runs that ret does not keep, as of now, and returns
	// their ids.
	Prune(ctx context.Context, now time.Time, ret Retention) ([]string, error)
	// Ping reports whether the store can be reached.
	Ping(ctx context.Context) error
	// Close releases the store.
	Close() error
}
