package checks

import "swaygate/checks/section"

// Axis names a principal bending axis of a member. Major is bending about the
// profile's x-axis for I, channel and rectangular shapes (depth along profile
// y); in the structural analysis domain that is MomentY.
type Axis uint8

const (
	Major Axis = iota
	Minor
)

// Axes lists both axes in report order.
var Axes = [2]Axis{Major, Minor}

func (a Axis) String() string {
	if a == Minor {
		return "minor"
	}
	return "major"
}

// Direction is the global plan direction in which bending about an axis makes
// a column sway. Bending about an axis deflects the member perpendicular to it:
// an unrotated column's major axis lies along global X, so major-axis bending
// sways it in Y.
type Direction uint8

const (
	DirUnknown Direction = iota
	DirX
	DirY
)

func (d Direction) String() string {
	switch d {
	case DirX:
		return "X"
	case DirY:
		return "Y"
	}
	return ""
}

// Restraint says whether an axis belongs to the lateral (sway) system.
type Restraint uint8

const (
	RestraintUnknown Restraint = iota // no data: missing-restraint unless a default applies
	Sway                              // part of the moment frame that resists sway in this plane
	Braced                            // braced member, or a gravity (leaning) column of a sway storey
)

func (r Restraint) String() string {
	switch r {
	case Sway:
		return "sway"
	case Braced:
		return "braced"
	}
	return "unknown"
}

// Theory is the analysis theory that produced a combination's actions.
type Theory uint8

const (
	FirstOrder Theory = iota
	SecondOrder
)

func (t Theory) String() string {
	if t == SecondOrder {
		return "second-order"
	}
	return "first-order"
}

// Model is everything the engine checks in one run.
type Model struct {
	Members []Member
	// Combinations in report order (the union of the members' combination names,
	// in the order the source gave them).
	Combinations []string
	// Skipped elements that are not checked (for example not-steel columns).
	Skipped []Skipped
	// StoreyData are optional per-storey rows (storey shear and drift) that some
	// standards' storey forms use (EN 1993 5.2.1(4)B, AISC A-8-7).
	StoreyData []StoreyData
	// Warnings found while building the model (unknown GlobalIds in a side-car,
	// load cases skipped, dangling references reached...).
	Warnings []Reason
	// Assumptions made while building the model (defaults applied, conventions).
	Assumptions []string
}

// Skipped is an element found in the model but not checked.
type Skipped struct {
	GlobalID string
	Name     string
	Entity   string
	Reason   string // e.g. "not-steel"
	Message  string
}

// Member is one column (or a member of a chosen type) with everything the
// checks need. Zero values mean "not known"; the engine turns gaps into
// needs-analysis reasons, never into guesses.
type Member struct {
	// Identity.
	GlobalID string
	Entity   string // e.g. "IfcColumn"
	Name     string
	Tag      string
	Ref      string // where it came from, e.g. "#210" (for messages)

	// Storey: StoreyKey groups members into one storey instance (opaque, e.g.
	// "#38"); Storey is its display name. Empty key: no storey.
	StoreyKey       string
	Storey          string
	StoreyElevation Num // mm
	// BaseZ and TopZ are the global elevations of the member's ends (mm), used to
	// test whether it spans its storey.
	BaseZ, TopZ Num

	// Geometry and section.
	Length  float64             // mm, system length; 0 = unknown (missing-length)
	Section *section.Properties // nil = unknown (missing-section)

	Material Material

	// Per axis: restraint, effective length, direction of sway.
	Axes [2]AxisInput

	// Actions per combination. A member with no entry for a combination of the
	// Model is missing-actions for it.
	Actions []Actions

	// Problems found while extracting this member (missing-section,
	// unsupported-profile, sign-convention-ambiguous...). Blocking codes make
	// the member needs-analysis; informational ones are carried to the report.
	Problems []Reason
}

// Material holds the steel properties in MPa.
type Material struct {
	E      float64 // 0 = not given; the rule set's default is used and recorded
	Fy     float64 // 0 = not given
	Fu     float64 // 0 = not given
	Grade  string  // e.g. "S355JR", "300PLUS"
	Name   string  // material name as found
	Source string  // "model", "request", "default"
}

// AxisInput describes one principal axis of a member.
type AxisInput struct {
	Restraint Restraint
	// Ke is the effective length factor for this axis (the sway ke on a sway
	// axis); 0 = unknown.
	Ke float64
	// BracedKe is the ke used for delta_b (Nomb) of a sway axis; 0 = default 1.0.
	BracedKe float64
	// BucklingLength overrides Length for this axis (mm); 0 = Length.
	BucklingLength float64
	// Direction is the global storey direction this axis sways in.
	Direction Direction
	// TransverseLoad: a load acts between the ends (beta_m = -1).
	TransverseLoad bool
	// Source of the restraint data: "property-set", "end-conditions",
	// "request-default", "frame"...
	Source string
}

// Actions are the design actions of one combination. Forces in N (compression
// positive), moments in N·mm as internal bending moments at the member's start
// (bottom) and end (top): the same sign at both ends is single curvature.
type Actions struct {
	Combination string
	Theory      Theory
	// NStar is the largest axial compression along the member (N); negative is
	// tension.
	NStar   float64
	Moments [2]AxisMoments
	// Source: "side-car", "ifc-results", "property-set".
	Source string
	Ref    string // e.g. "#2773" or "actions.csv:12"
}

// AxisMoments are the first-order moments about one axis.
type AxisMoments struct {
	Start, End float64 // internal end moments, N·mm
	// Peak is M*m, the largest |M| anywhere along the member (N·mm). Zero with
	// non-zero end moments means "the larger end moment".
	Peak float64
	// Transverse: the shears show a load between the ends.
	Transverse bool
	// InteriorUnknown: a transverse load acts but only end moments are known,
	// so the peak cannot be known (interior-moment-unknown).
	InteriorUnknown bool
	// CurvatureUnknown: the relative sign of the end moments is unknown (the
	// sign convention of the analysis results could not be told from them,
	// sign-convention-ambiguous), so single or double curvature cannot be
	// told: beta_m = -1 (conservative). Start and End are then as written.
	CurvatureUnknown bool
	// Split holds separate no-translation and lateral-translation moments when
	// the source gives them (AISC B1·Mnt + B2·Mlt); nil otherwise.
	Split *SplitMoments
}

// SplitMoments separate the no-sway (nt) and sway (lt) parts of the moments.
type SplitMoments struct {
	NtStart, NtEnd, NtPeak float64
	LtStart, LtEnd, LtPeak float64
}

// StoreyData is one optional storey row for the drift forms of the storey
// buckling load factor.
type StoreyData struct {
	StoreyKey   string // matches Member.StoreyKey, or empty to match by name
	Storey      string
	Direction   Direction
	Combination string
	ShearN      float64 // total design horizontal storey shear H (N)
	DriftMM     float64 // first-order inter-storey drift under that shear (mm)
	HeightMM    float64 // storey height (mm)
	VerticalN   float64 // total design vertical load on the storey (N); 0 = sum of the members' N*
	Ref         string
}
