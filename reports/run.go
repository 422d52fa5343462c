package reports

import (
	"fmt"
	"time"

	"swaygate/checks"
)

// ReportVersion is the version of the JSON contract ("report_version").
const ReportVersion = "1"

// Gate policies.
const (
	GateFail          = "fail"           // the gate holds when no member fails
	GateNeedsAnalysis = "needs-analysis" // ... when no member fails or needs analysis
	GateNone          = "none"           // always holds: report only (exploring a model)
)

// Units for the text and HTML reports.
const (
	UnitsSI = "si" // kN, kNm, mm (the default)
	UnitsUS = "us" // kip, kip-ft, ft and in
)

// Run holds the facts of one check run that are not part of the engine's
// result: identity, provenance and the gate.
type Run struct {
	RunID       string
	CreatedAt   time.Time // written in UTC, RFC 3339
	ToolVersion string
	Project     string // written as "project" when not empty
	Model       ModelInfo
	Gate        Gate // from NewGate; an empty policy is written as "fail"
	// Units chooses the display units of the text and HTML reports: "si"
	// (default when empty) or "us". JSON and CSV are always SI.
	Units string
}

// ModelInfo describes the checked model file.
type ModelInfo struct {
	File      string
	SHA256    string
	Schema    string // e.g. "IFC4"
	Instances int
}

// Gate is a gate policy and whether the run met it.
type Gate struct {
	Policy string // GateFail, GateNeedsAnalysis or GateNone
	Passed bool
}

// NewGate evaluates policy against a run's verdict counts. An empty policy is
// GateFail; any other unknown policy is an error.
func NewGate(policy string, s checks.Summary) (Gate, error) {
	switch policy {
	case "", GateFail:
		return Gate{Policy: GateFail, Passed: s.Fail == 0}, nil
	case GateNeedsAnalysis:
		return Gate{Policy: GateNeedsAnalysis, Passed: s.Fail == 0 && s.NeedsAnalysis == 0}, nil
	case GateNone:
		return Gate{Policy: GateNone, Passed: true}, nil
	}
	return Gate{}, fmt.Errorf("reports: unknown gate policy %q (want %q, %q or %q)", policy, GateFail, GateNeedsAnalysis, GateNone)
}

// policy returns the gate policy, GateFail when unset.
func (g Gate) policy() string {
	if g.Policy == "" {
		return GateFail
	}
	return g.Policy
}

// unitSystem returns the display unit system of run, or an error for an
// unknown name.
func (r *Run) unitSystem() (*unitSystem, error) {
	switch r.Units {
	case "", UnitsSI:
		return &siUnits, nil
	case UnitsUS:
		return &usUnits, nil
	}
	return nil, fmt.Errorf("reports: unknown units %q (want %q or %q)", r.Units, UnitsSI, UnitsUS)
}
