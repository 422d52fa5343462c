package checks

// A RuleSet is one design standard's stability and amplification procedure.
// Each standard is its own package (checks/as4100, checks/nzs3404, ...): its
// constants, thresholds, formulas and clause labels live there and nowhere
// else. The engine (Run) does the standard-independent work: it resolves the
// inputs (modulus, restraint defaults, buckling lengths), finds missing data,
// gives each axis its role and sway buckling load factor through a
// SwayProvider, aggregates verdicts and reasons, and keeps the trace.
//
// A RuleSet holds no per-run state: the same value may serve concurrent runs.
// Every method but Begin is on the hot path and should not allocate on a
// member that passes.
type RuleSet interface {
	// Name is the identifier used in options and reports, e.g. "as4100".
	Name() string
	// Title is the display name, e.g. "AS 4100".
	Title() string

	// Begin is called once per run before any member. It checks the options
	// that concern this standard (an error is a usage error, for example an
	// unknown provisions value or a scope the standard does not implement)
	// and returns the standard's assumptions for the whole run.
	Begin(opt *Options) (assumptions []string, err error)

	// Modulus is the default elastic modulus (MPa) when neither the model nor
	// the options give one, and the clause that sets it.
	Modulus() (e float64, clause string)

	// Member computes the combination-independent values of one member: for
	// each axis whose inputs are known, the elastic buckling loads Nom and
	// Nomb (mc.Axes[a].Nom, .Nomb, in N; leave NaN when they cannot be
	// computed). It may keep further member values in mc.Scratch. It is called
	// before the sway provider runs (with tr off) and again when a trace is
	// built.
	Member(mc *MemberContext, tr *Tracer)

	// StoreyLambda chooses the storey elastic buckling load factor from the
	// sums of one storey, direction and combination (forms A and B are
	// filled in; the drift data when given). It returns the value used, the
	// name of the form, and the drift form's value (NaN when not given or not
	// used by the standard).
	StoreyLambda(s *StoreySums) (lambda float64, form string, drift float64)

	// Amplify computes one axis under one combination: lambda_c (braced
	// axes), beta_m, cm, delta_b, delta_s, delta_m, M*m and the amplified
	// moment, written to out (Nom, Nomb, identity fields are set by the
	// engine). Reasons go through cx.Reason; the engine derives the verdict
	// from them. cx.Actions is never nil.
	Amplify(cx *AxisContext, out *AxisResult, tr *Tracer)

	// Capacity adds the member capacity checks of one combination (scope
	// full) to out.Capacity, with reasons through cx.Reason. It is called
	// after both axes are amplified, only when Options.Scope is "full".
	Capacity(cx *CombinationContext, out *CombinationResult, tr *Tracer)
}

// Role is what an axis does in its storey under the sway method.
type Role uint8

const (
	RoleUnknown Role = iota // no restraint data: gives load, no stiffness
	RoleBraced              // braced: no column of its storey sways that way
	RoleSway                // part of the lateral system
	RoleLeaning             // braced-flagged column of a swaying storey
)

func (r Role) String() string {
	switch r {
	case RoleBraced:
		return "braced"
	case RoleSway:
		return "sway"
	case RoleLeaning:
		return "leaning"
	}
	return "unknown"
}

// Swaying reports whether the axis takes the sway amplification (sway or
// leaning).
func (r Role) Swaying() bool { return r == RoleSway || r == RoleLeaning }

// MemberContext is what a rule set sees of one member. The engine reuses one
// value across members: a rule set must not keep pointers into it.
type MemberContext struct {
	Index   int // index in Model.Members
	Member  *Member
	Options *Options

	// E is the elastic modulus used (MPa) and ESource where it came from:
	// "model", "request" or "default".
	E       float64
	ESource string

	Axes [2]AxisSetup

	// Scratch belongs to the rule set: it may hold a pointer to its own
	// per-member values (reset them in Member). The engine keeps it across
	// members of a run and never reads it.
	Scratch any
}

// AxisSetup is one axis of a member after defaults are applied. Unknown
// values are NaN.
type AxisSetup struct {
	Axis      Axis
	Restraint Restraint // after defaults; RestraintUnknown = missing-restraint
	Direction Direction // global direction it sways in (never DirUnknown)
	// Ke is the axis's effective length factor (the sway ke on a sway axis);
	// BracedKe the ke for Nomb: the axis's own on a braced axis, the braced
	// factor (default 1.0) on a sway axis.
	Ke, BracedKe float64
	// Length is the buckling length for this axis (mm); MemberLength the
	// member's system length (mm).
	Length, MemberLength float64
	// I is the second moment of area about this axis (mm⁴).
	I float64
	// Transverse: a load acts between the ends (beta_m = -1).
	Transverse bool
	// Assumed: the restraint came from the user's defaults.
	Assumed bool
	// Invalid: the restraint data cannot be used (a sway ke below 1, a
	// negative ke): invalid-restraint, and no storey stiffness.
	Invalid bool

	// Nom and Nomb are set by RuleSet.Member (N). Nom is the elastic buckling
	// load with Ke (Noms on a sway axis), Nomb with BracedKe.
	Nom, Nomb float64
}

// AxisContext is one axis of one member under one combination.
type AxisContext struct {
	Member      *MemberContext
	Setup       *AxisSetup
	Axis        Axis
	Combination int    // index in Model.Combinations
	Name        string // combination name
	Actions     *Actions
	Moments     *AxisMoments
	// NStar is the design axial compression (N); negative is tension.
	NStar float64
	// Sway is the role of the axis and, for sway and leaning axes, its
	// elastic buckling load factor from the run's SwayProvider.
	Sway SwayValue
	// SignAmbiguous: the reader could not tell the moments' sign convention
	// for this combination (sign-convention-ambiguous): the curvature is
	// unknown, so beta_m must be taken as -1.
	SignAmbiguous bool

	sink *reasonSink
}

// Reason records a reason for this axis and combination. Message should be a
// constant or built without fmt on the pass path.
func (cx *AxisContext) Reason(code, message string) {
	cx.sink.add(Reason{Code: code, Message: message, Combination: cx.Name, Axis: cx.Axis.String()})
}

// Options returns the run's options.
func (cx *AxisContext) Options() *Options { return cx.Member.Options }

// CombinationContext is one member under one combination, after both axes
// are amplified (for the capacity checks).
type CombinationContext struct {
	Member      *MemberContext
	Combination int
	Name        string
	Actions     *Actions
	Axes        [2]*AxisContext

	sink *reasonSink
}

// Reason records a reason for this combination (axis "" or "major"/"minor").
func (cx *CombinationContext) Reason(code, message, axis string) {
	cx.sink.add(Reason{Code: code, Message: message, Combination: cx.Name, Axis: axis})
}
