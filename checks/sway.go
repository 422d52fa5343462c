package checks

import (
	"math"
	"strconv"
)

// A SwayProvider gives every axis of the model its role (sway, leaning,
// braced) and, for sway and leaning axes, the elastic buckling load factor
// lambda_c per combination. It is model-wide: the storey method sums over
// the columns of a storey, a frame buckling analysis (a later provider) over
// the whole analytical frame. Rule sets never see which provider ran beyond
// SwayValue.Method and .Form, so a new provider changes no rule set.
//
// A provider value serves one run: Prepare is called once, after every
// member's buckling loads are known and before any member is amplified; Sway
// and MemberNotes are then called for each member, possibly again when a
// trace is rebuilt, and must return the same answers.
type SwayProvider interface {
	// Method names the method in the report: "storey", "member", "frame".
	Method() string
	// Prepare computes the model-wide values. It may append to the report's
	// Storeys, Assumptions and Warnings (sc.Report). An error is a usage
	// error; data problems become reasons.
	Prepare(sc *SwayContext) error
	// Sway returns the role and lambda_c of member i's axis a under
	// combination c.
	Sway(i int, a Axis, c int) SwayValue
	// MemberNotes appends the provider's member-level reasons for member i
	// (for example storey-geometry) to dst.
	MemberNotes(i int, dst []Reason) []Reason
}

// SwayValue is what a SwayProvider says about one axis under one
// combination.
type SwayValue struct {
	Role Role
	// Lambda is the elastic buckling load factor of a sway or leaning axis:
	// NaN when unknown (Code then says why, when the cause is not the
	// member's own missing data), +Inf when there is no compression.
	Lambda float64
	Method string // "storey", "member", "frame"
	Form   string // the form used: "A", "B", "drift", "member"...
	// Storey is the storey row behind Lambda (storey method); nil otherwise.
	Storey *StoreyResult
	// Code and Message: a blocking reason for this axis when Lambda is
	// unknown (storey-incomplete), empty otherwise.
	Code, Message string
}

// StoreySums are the sums over the columns of one storey, direction and
// combination that a rule set's StoreyLambda chooses from. Lengths in mm,
// forces in N.
type StoreySums struct {
	Storey *StoreyResult // key, name, direction, combination

	SumNomsOverL  float64 // Σ Noms/L over the sway columns that give stiffness
	SumNomsNOverL float64 // Σ Noms·N*/L over the same
	SumNOverL     float64 // Σ N*/L over all columns (tension counts 0)
	SumN2OverL    float64 // Σ N*²/L over all columns
	SumN          float64 // Σ N* over all columns (tension counts 0)
	SumNSway      float64 // Σ N* over the sway columns (moment-frame load)

	// FormA = SumNomsOverL/SumNOverL, FormB = SumNomsNOverL/SumN2OverL;
	// +Inf when the storey has no compression.
	FormA, FormB float64

	// Drift data from Model.StoreyData, when HasDrift: the design storey
	// shear (N), the first-order inter-storey drift under it (mm), the storey
	// height (mm) and the vertical load (N; the given VerticalN, else SumN).
	HasDrift                       bool
	Shear, Drift, Height, Vertical float64
}

// SwayContext is what the engine gives a SwayProvider in Prepare.
type SwayContext struct {
	Model        *Model
	Rules        RuleSet
	Options      *Options
	Combinations []string
	Report       *Report

	r *run
}

// Members returns the number of members.
func (sc *SwayContext) Members() int { return len(sc.r.setups) }

// Axis returns the resolved setup of member i's axis a, with its buckling
// loads.
func (sc *SwayContext) Axis(i int, a Axis) *AxisSetup { return &sc.r.setups[i].Axes[a] }

// NStar returns member i's design axial compression under combination c (N),
// NaN when the member has no actions for it.
func (sc *SwayContext) NStar(i, c int) float64 { return sc.r.nstar[i*sc.r.nc+c] }

// Theory returns the analysis theory of member i's actions under combination
// c (FirstOrder when it has none).
func (sc *SwayContext) Theory(i, c int) Theory {
	if k := sc.r.actIdx[i*sc.r.nc+c]; k >= 0 {
		return sc.Model.Members[i].Actions[k].Theory
	}
	return FirstOrder
}

// MemberProvider is the member method (--sway-method member): lambda_c of a
// sway axis is its own Noms/N*, and braced-flagged axes are braced (leaning
// columns are not found). It is not a method of the standards for sway frames
// and is recorded as an assumption.
type MemberProvider struct {
	sc *SwayContext
}

// NewMemberProvider returns a provider for one run.
func NewMemberProvider() *MemberProvider { return &MemberProvider{} }

// Method implements SwayProvider.
func (p *MemberProvider) Method() string { return "member" }

// Prepare implements SwayProvider.
func (p *MemberProvider) Prepare(sc *SwayContext) error {
	p.sc = sc
	sc.Report.Assumptions = append(sc.Report.Assumptions,
		"sway method member (user choice): lambda_c of each sway axis is the member's own Noms/N*; "+
			"leaning (gravity) columns are not found and braced-flagged axes are taken as braced. "+
			"This is not a method of the standards for sway frames: it ignores the load of leaning columns.")
	return nil
}

// Sway implements SwayProvider.
func (p *MemberProvider) Sway(i int, a Axis, c int) SwayValue {
	s := p.sc.Axis(i, a)
	switch s.Restraint {
	case Sway:
		return SwayValue{Role: RoleSway, Lambda: ownLambda(s.Nom, p.sc.NStar(i, c)), Method: "member", Form: "member"}
	case Braced:
		return SwayValue{Role: RoleBraced, Lambda: math.NaN()}
	}
	return SwayValue{Role: RoleUnknown, Lambda: math.NaN()}
}

// MemberNotes implements SwayProvider.
func (p *MemberProvider) MemberNotes(i int, dst []Reason) []Reason { return dst }

// ownLambda is a member's own Noms/N*: +Inf without compression.
func ownLambda(noms, nstar float64) float64 {
	switch {
	case math.IsNaN(nstar) || math.IsNaN(noms):
		return math.NaN()
	case nstar <= 0:
		return math.Inf(1)
	}
	return noms / nstar
}

// itoa formats an integer for messages built once per run.
func itoa(n int) string { return strconv.Itoa(n) }

// ftoa formats a number for messages built once per run.
func ftoa(x float64) string { return strconv.FormatFloat(x, 'g', 6, 64) }
