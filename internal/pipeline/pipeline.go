// Package pipeline runs one check from a model file to a report: read and
// index the STEP file, extract the members (with optional side-car actions),
// run the chosen rule set, and evaluate the gate. The CLI and the HTTP
// service both call Check, so that they give the same results.
package pipeline

import (
	"context"
	"errors"
	"time"

	"swaygate/checks"
	"swaygate/reports"
)

// Request is one check to run.
type Request struct {
	// ModelPath is the model on disk: plain STEP, gzip or .ifczip.
	ModelPath string
	// Name is the model's display name in reports (default: the base name of
	// ModelPath).
	Name string
	// ActionsPath is an optional side-car actions file (CSV or JSON).
	ActionsPath string
	// ActionsName is the side-car's display name in messages.
	ActionsName string

	Options checks.Options
	// Include lists IfcMember predefined types to check as well as columns,
	// e.g. ["POST", "STRUT"].
	Include []string
	// LoadCases: also check results of unfactored load cases.
	LoadCases bool

	Gate    string // "fail" (default) or "needs-analysis"
	Project string
	Units   string // "si" (default) or "us": display units of text and HTML

	RunID       string
	Now         func() time.Time // default time.Now
	ToolVersion string
}

// Result is a finished check.
type Result struct {
	Report *checks.Report
	Run    reports.Run
}

// ErrNotImplemented is returned until the extraction is wired in.
var ErrNotImplemented = errors.New("pipeline: not implemented yet")

// Check runs req. Errors the user caused (a file that is not STEP, a bad
// side-car, invalid options) are returned as positioned errors of the
// packages that found them (*ifcstep.Error, *sidecar.Error) or wrap
// checks.ErrOption; ctx cancels a long run.
func Check(ctx context.Context, req Request) (*Result, error) {
	return nil, ErrNotImplemented
}
