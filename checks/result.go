package checks

// Options choose how a run is checked. The zero value is not valid: use
// DefaultOptions and change what the user asked for.
type Options struct {
	Standard   string // "as4100" (default), "nzs3404", "en1993", "aisc360"
	SwayMethod string // "storey" (default), "member", "frame"
	Scope      string // "stability" or "full"
	Trace      string // "full" (default), "summary", "none"

	// NZSProvisions: "default" or "quoted" (NZS 3404 only).
	NZSProvisions string
	// AISCMethod: "lrfd" (default) or "asd" (AISC 360 only).
	AISCMethod string
	// MemberPDeltaModelled: the user declares that second-order results also
	// include member (P-delta) effects, so delta_b = 1 for them.
	MemberPDeltaModelled bool

	// Defaults applied where a member has no restraint data for an axis; each
	// use is recorded in the report's assumptions and as assumed-restraint on
	// the member.
	Defaults [2]RestraintDefault
	// Modulus overrides the standard's default E where the model gives none
	// (MPa; 0 = the standard's default).
	Modulus float64
	// Yield is fy where the model gives none (MPa; 0 = none).
	Yield float64

	// KeFrom says where the effective length factors come from (the
	// pipeline fills the members' AxisInput.Ke before the run; the engine
	// itself does not read it): "" or "auto" (the property set where it
	// gives ke, else the end-restraint ratios of the analytical frame),
	// "property-set", "restraint-ratios" or "buckling".
	KeFrom string

	// TraceOnDemand: Run leaves Element.Trace nil and a writer gets each
	// element's steps from Report.AppendTrace, one element at a time. Use it
	// for large models: a full trace holds about 170 steps of some 450 bytes
	// per member with 10 combinations.
	TraceOnDemand bool
}

// RestraintDefault is a user-chosen default for one axis.
type RestraintDefault struct {
	Restraint Restraint // RestraintUnknown = no default
	Ke        float64   // 0 = 1.0
	BracedKe  float64   // 0 = 1.0
}

// DefaultOptions returns the options a run uses unless told otherwise.
func DefaultOptions() Options {
	return Options{
		Standard:      "as4100",
		SwayMethod:    "storey",
		Scope:         "full",
		Trace:         "full",
		NZSProvisions: "default",
		AISCMethod:    "lrfd",
	}
}

// Report is the outcome of a run, before a writer renders it.
type Report struct {
	Standard   string
	SwayMethod string
	Scope      string

	Summary     Summary
	Assumptions []string
	Warnings    []Reason
	Skipped     []Skipped
	Storeys     []StoreyResult
	// Elements in the order of the model's members.
	Elements []Element
	// Frame holds the elastic buckling analysis of the analytical frame when
	// the frame method ran; nil otherwise.
	Frame *FrameResult

	run *run // the run's state, for AppendTrace
}

// Summary counts members by verdict.
type Summary struct {
	Members, Pass, Fail, NeedsAnalysis int
}

// StoreyResult is the storey buckling load factor of one storey, direction and
// combination.
type StoreyResult struct {
	StoreyKey      string
	Name           string
	Elevation      Num // mm
	Direction      Direction
	Combination    string
	LambdaC        Num // the value used
	FormA          Num // Σ(Noms/L) / Σ(N*/L)
	FormB          Num // Σ(Noms·N*/L) / Σ(N*²/L)
	FormDrift      Num // from storey shear and drift, when given
	Form           string
	SwayMembers    int
	LeaningMembers int
	SumNStar       Num // N, all columns
	// SumNStarSway is Σ N* over the storey's sway columns (N, tension counts
	// 0): the load on the lateral system (AISC's P_mf, A-8-8).
	SumNStarSway Num
	// The drift inputs used when the storey's shear and drift are given
	// (Model.StoreyData), NaN otherwise: storey shear (N), first-order
	// inter-storey drift (mm), storey height (mm) and vertical load (N; the
	// given one, else SumNStar). A rule set traces its drift form from them.
	Shear, Drift, Height, Vertical Num
	Complete                       bool
	Reasons                        []Reason
}

// Element is one member's result.
type Element struct {
	Member               *Member
	Verdict              Verdict
	Reasons              []Reason
	GoverningCombination string
	// GoverningUtilisation is the largest capacity utilisation over all
	// combinations and checks (scope full); NaN when not computed.
	GoverningUtilisation Num
	// E used (MPa) and where it came from.
	E            float64
	ESource      string
	Combinations []CombinationResult
	Trace        []Step
}

// CombinationResult is one member under one combination.
type CombinationResult struct {
	Name    string
	Theory  Theory
	Verdict Verdict
	NStar   Num // N, compression positive; NaN = missing actions
	Axes    [2]AxisResult
	// Capacity checks (scope full), each with its utilisation.
	Capacity []CapacityCheck
}

// AxisResult holds the numbers of one axis under one combination. Values that
// could not be computed are NaN; every value that could be is given.
type AxisResult struct {
	Restraint Restraint
	Leaning   bool
	Direction Direction
	Ke        Num
	Length    Num // buckling length used, mm
	Nom       Num // N: Nom with the axis's ke (Noms on a sway axis)
	Nomb      Num // N: with the braced ke
	LambdaC   Num
	BetaM     Num
	Cm        Num
	DeltaB    Num
	DeltaS    Num
	DeltaM    Num
	MStar     Num // N·mm, M*m
	MAmp      Num // N·mm, amplified design moment
	Verdict   Verdict
}

// CapacityCheck is one member strength check under one combination.
type CapacityCheck struct {
	Name        string // e.g. "section-major", "in-plane-major", "out-of-plane", "biaxial"
	Clause      string
	Demand      Num
	Capacity    Num
	Unit        string
	Utilisation Num
}

// FrameResult is the elastic buckling analysis of the analytical frame.
type FrameResult struct {
	Nodes        int
	Elements     int
	DOF          int
	Combinations []FrameCombination
	Notes        []string

	// Name is the analysis model's name (or reference); Plane is true for a
	// plane (IN_PLANE_LOADING_2D) model, whose plane has the normal
	// PlaneNormal.
	Name        string
	Plane       bool
	PlaneNormal [3]float64
	// Members are the analytical members, their ends indexing the nodes
	// of each combination's Mode (every Mode lists the nodes in the same
	// order).
	Members []FrameMember
	// Governing is the combination with the lowest lambda_c ("" when none
	// buckles).
	Governing string
	// Limitations lists the buckling modes the analysis cannot represent.
	Limitations []string
	// Covered counts the checked members (columns) idealised in the frame;
	// FellBack the sway or leaning axes that took the storey method instead
	// (frame-fallback).
	Covered, FellBack int
}

// FrameMember is one analytical member of the frame.
type FrameMember struct {
	ID         string
	Start, End int // indices into FrameCombination.Mode
}

// FrameCombination is the lowest buckling load factor of one combination.
type FrameCombination struct {
	Name    string
	LambdaC Num
	// Mode is the normalised buckled shape: per node, its id and translations.
	Mode []ModeNode
	// LambdaX and LambdaY are the load factors of the lowest modes that sway
	// in global X and Y: the lambda_c of the axes swaying that way.
	LambdaX, LambdaY Num
	// Status: "buckles", "no-compression" (lambda_c infinite) or
	// "no-positive-buckling" (only reversed loads would buckle the frame).
	Status string
	// Drivers are the members with the largest shares of the mode's
	// second-order work, largest first: they drive the mode.
	Drivers []ModeShare
	// Storeys split the mode by level, bottom first (rising members only).
	Storeys []ModeStorey
	// Interior holds per member (FrameResult.Members) the normalised
	// translations of its interior points from start to end, equally
	// spaced (nil for a member of one element), for drawing the mode. It is
	// not written to the JSON report.
	Interior [][][3]float64
}

// ModeShare is one member's share of a mode.
type ModeShare struct {
	Member string
	Share  float64
}

// ModeStorey is the part of a mode between two levels.
type ModeStorey struct {
	BottomZ, TopZ float64 // mm
	Share         float64 // part of the mode's second-order work
	Drift         float64 // largest inter-storey drift of the mode (per mm of height)
}

// ModeNode is one node of a buckled mode shape.
type ModeNode struct {
	Node       string
	X, Y, Z    float64 // node position, mm
	UX, UY, UZ float64 // normalised translations (largest = 1)
}
