package checks

// Verdict is a member's or a combination's outcome. The order is the severity
// order: the worst over combinations is the member's verdict.
type Verdict uint8

const (
	Pass Verdict = iota
	NeedsAnalysis
	Fail
)

func (v Verdict) String() string {
	switch v {
	case NeedsAnalysis:
		return "needs-analysis"
	case Fail:
		return "fail"
	}
	return "pass"
}

// Worse returns the more severe of v and w.
func (v Verdict) Worse(w Verdict) Verdict {
	if w > v {
		return w
	}
	return v
}

// Reason codes are stable identifiers, part of the public report contract.
const (
	// Verdict-setting.
	CodeUnstable              = "unstable"
	CodeSecondOrderRequired   = "second-order-required"
	CodeStoreyIncomplete      = "storey-incomplete"
	CodeMissingActions        = "missing-actions"
	CodeMissingRestraint      = "missing-restraint"
	CodeInvalidRestraint      = "invalid-restraint"
	CodeMissingSection        = "missing-section"
	CodeMissingLength         = "missing-length"
	CodeUnsupportedProfile    = "unsupported-profile"
	CodeInteriorMomentUnknown = "interior-moment-unknown"
	CodeAxialSignSuspect      = "axial-sign-suspect"
	CodeNoDesignCombinations  = "no-design-combinations"
	CodeCapacityExceeded      = "capacity-exceeded"
	CodeMissingMaterial       = "missing-material"

	// Informational.
	CodeNotInCompression        = "not-in-compression"
	CodeNoMoment                = "no-moment"
	CodeSecondOrderResults      = "second-order-results"
	CodeAssumedModulus          = "assumed-modulus"
	CodeAssumedRestraint        = "assumed-restraint"
	CodeUnusualKe               = "unusual-ke"
	CodeMixedSwayFlags          = "mixed-sway-flags"
	CodeSignConventionAmbiguous = "sign-convention-ambiguous"
	CodeStoreyGeometry          = "storey-geometry"
	CodeSkewedColumn            = "skewed-column"
	CodeAxesMismatch            = "axes-mismatch"
	CodeTotalMomentAmplified    = "total-moment-amplified"
	CodeUnknownGlobalID         = "unknown-global-id"
	CodeNotSteel                = "not-steel"
	// CodeStoreyDataIgnored: a storey shear/drift row could not be used
	// (run warning).
	CodeStoreyDataIgnored = "storey-data-ignored"
	// CodeFrameFallback: the sway method is frame but this member's axis is
	// not covered by the analytical frame (not linked to it, out of the
	// plane of a plane model, or the analysis failed): its lambda_c comes
	// from the storey method instead.
	CodeFrameFallback = "frame-fallback"
	// CodeKeFromFrame: an axis's ke comes from the analytical frame (the
	// end-restraint ratios or the buckling load factor); the message gives
	// the values behind it.
	CodeKeFromFrame = "ke-from-frame"
)

// codeVerdict maps each verdict-setting code to the verdict it sets. Codes not
// listed are informational.
var codeVerdict = map[string]Verdict{
	CodeUnstable:              Fail,
	CodeCapacityExceeded:      Fail,
	CodeSecondOrderRequired:   NeedsAnalysis,
	CodeStoreyIncomplete:      NeedsAnalysis,
	CodeMissingActions:        NeedsAnalysis,
	CodeMissingRestraint:      NeedsAnalysis,
	CodeInvalidRestraint:      NeedsAnalysis,
	CodeMissingSection:        NeedsAnalysis,
	CodeMissingLength:         NeedsAnalysis,
	CodeUnsupportedProfile:    NeedsAnalysis,
	CodeInteriorMomentUnknown: NeedsAnalysis,
	CodeAxialSignSuspect:      NeedsAnalysis,
	CodeNoDesignCombinations:  NeedsAnalysis,
	CodeMissingMaterial:       NeedsAnalysis,
}

// CodeVerdict returns the verdict a reason code sets (Pass for informational
// codes).
func CodeVerdict(code string) Verdict { return codeVerdict[code] }

// Reason explains a verdict or records a fact. Combination and Axis are empty
// when the reason concerns the whole member.
type Reason struct {
	Code        string
	Message     string
	Combination string
	Axis        string // "major", "minor" or ""
	Ref         string // source location, e.g. "#210" or "actions.csv:4"
}

// Verdict returns the verdict this reason sets.
func (r Reason) Verdict() Verdict { return codeVerdict[r.Code] }
