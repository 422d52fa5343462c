// Package en1993 is the EN 1993-1-1 (Eurocode 3, Part 1-1:2005) rule set:
// the elastic critical buckling load factor alpha_cr of each storey (5.2.1),
// when second-order effects may be neglected (alpha_cr ≥ 10, 5.2.1(3)), the
// amplification of the sway moments by 1/(1 − 1/alpha_cr) of a first-order
// elastic analysis (5.2.2(5)B and (6)B, for alpha_cr ≥ 3) and the limit
// below which a second-order analysis is required (alpha_cr < 3).
//
// Field meanings (design §6): lambda_c is alpha_cr on sway and leaning axes
// (the storey-stiffness form A of the storey sums by default; the storey
// drift form (H_Ed/V_Ed)(h/δ_H,Ed) of 5.2.1(4)B where storey shear and drift
// are given; the member's own N_cr/N_Ed with the member method) and
// N_cr/N_Ed on braced axes; delta_s is 1 for alpha_cr ≥ 10, else
// 1/(1 − 1/alpha_cr), null on braced axes; delta_b, beta_m and c_m are not
// used (null); delta_m is delta_s on sway and leaning axes and 1 on braced
// axes, whose member imperfections and second-order effects within the
// member are covered by the member buckling check of 6.3 (scope full,
// below).
//
// A member fails (unstable) when alpha_cr ≤ 1 or when N_Ed reaches N_cr of
// its braced (non-sway) buckling mode.
//
// With scope full (Capacity) a member must also be strong enough: its
// section class (5.5.2, Table 5.2; Class 4 in compression with the
// effective area of EN 1993-1-5 4.4, Class 4 in bending needs-analysis),
// the flexural buckling resistance N_b,Rd per axis (6.3.1, curves of Table
// 6.2), lateral-torsional buckling of I sections (6.3.2.2), the
// cross-section by the linear sum of 6.2.1(7), and the member interaction
// of 6.3.3 (6.61, 6.62) with the factors of Annex B and the amplified
// moments. f_y comes from the model, the request, or a grade table
// (material.go); each utilisation above 1 fails the member
// (capacity-exceeded), a check that cannot be made needs analysis. The
// checks are EN 1993-1-1 clauses [L] where standards-notes confirms them
// and from memory [M] elsewhere (Annex B, C1, EN 1993-1-5 rho), as the
// comments beside each formula say.
//
// The thresholds are the standard's recommended values; a National Annex
// may change the plastic-analysis limit (15), which swaygate does not use.
// Clause numbers are those of EN 1993-1-1:2005 (standards-notes §3; 5.2.1
// [L], 5.2.2 and 5.3.2 [M]).
package en1993

import (
	"math"
	"strconv"

	"swaygate/checks"
)

// Constants of EN 1993-1-1.
const (
	// Modulus is the elastic modulus of steel (MPa), 3.2.6(1).
	Modulus = 210_000.0
	// FirstOrderFrom: from this alpha_cr, second-order effects may be
	// neglected in an elastic analysis (5.2.1(3), formula (5.1)).
	FirstOrderFrom = 10.0
	// AmplifyFrom: from this alpha_cr up to FirstOrderFrom, the sway effects
	// may be amplified by 1/(1 − 1/alpha_cr); below it a second-order
	// analysis is required (5.2.2(5)B, (6)B).
	AmplifyFrom = 3.0
)

// Clause labels.
const (
	clauseModulus    = "EN 1993-1-1 3.2.6"
	clauseNcr        = "EN 1993-1-1 6.3.1.2"
	clauseAlpha      = "EN 1993-1-1 5.2.1(3)"
	clauseDrift      = "EN 1993-1-1 5.2.1(4)B"
	clauseAmplify    = "EN 1993-1-1 5.2.2(5)B, (6)B"
	clauseFirstOrder = "EN 1993-1-1 5.2.1(3)"
	clauseMoment     = "EN 1993-1-1 5.2.2"
	clauseMember     = "EN 1993-1-1 6.3"
	clauseImperf     = "EN 1993-1-1 5.3.2"
)

// thresholdTolerance keeps an alpha_cr that equals a threshold in exact
// arithmetic (3 or 10) on the permitted side despite rounding.
const thresholdTolerance = 1e-12

// Rules is the EN 1993-1-1 rule set. It holds no per-run state.
type Rules struct {
	q [2]quantities
}

// New returns the EN 1993-1-1 rule set.
func New() *Rules {
	r := &Rules{}
	for a := range checks.Axes {
		r.q[a] = newQuantities(checks.Axis(a).String())
	}
	return r
}

// Name implements checks.RuleSet.
func (r *Rules) Name() string { return "en1993" }

// Title implements checks.RuleSet.
func (r *Rules) Title() string { return "EN 1993-1-1" }

// Modulus implements checks.RuleSet: E = 210 000 MPa (3.2.6).
func (r *Rules) Modulus() (float64, string) { return Modulus, clauseModulus }

// Begin implements checks.RuleSet.
func (r *Rules) Begin(opt *checks.Options) ([]string, error) {
	as := []string{
		"EN 1993-1-1 elastic global analysis: second-order effects are neglected where alpha_cr ≥ 10 (" + clauseFirstOrder +
			"), the sway moments are amplified by 1/(1 − 1/alpha_cr) where 3 ≤ alpha_cr < 10 (" + clauseAmplify +
			") and a second-order analysis is required below 3; recommended values, no National Annex applied",
		"EN 1993-1-1: the amplification 1/(1 − 1/alpha_cr) presumes that the first-order analysis included the global sway " +
			"imperfections of " + clauseImperf + " (equivalent horizontal forces phi·N_Ed); the actions cannot show this: check it",
		"EN 1993-1-1: in multi-storey frames (5.2.2(6)B) the amplification presumes that all storeys have a similar distribution " +
			"of vertical load, horizontal load and frame stiffness relative to the storey shear",
		"EN 1993-1-1: braced axes take no global amplification (delta_m = 1); member imperfections and second-order effects " +
			"within the member are covered by the member buckling check of " + clauseMember + ", which is outside the stability scope",
	}
	if opt.Scope == "full" {
		as = append(as, capacityAssumptions()...)
	}
	switch opt.SwayMethod {
	case "", "storey":
		as = append(as,
			"EN 1993-1-1: alpha_cr = F_cr/F_Ed ("+clauseAlpha+") of a storey is the storey-stiffness form A, "+
				"Σ(N_cr,sway/L)/Σ(N_Ed/L), with N_cr,sway of the sway columns and N_Ed of all columns",
			"EN 1993-1-1: where storey shear and drift are given for a storey, direction and combination, alpha_cr = "+
				"(H_Ed/V_Ed)(h/δ_H,Ed) ("+clauseDrift+"); it presumes that H_Ed includes the imperfection forces and that "+
				"the axial compression of the beams is not significant")
	case "member":
		as = append(as,
			"EN 1993-1-1: alpha_cr of each sway axis is the member's own N_cr/N_Ed (user choice); "+clauseAlpha+
				" defines alpha_cr for the whole structure, so this ignores the load of leaning columns")
	case "frame":
		as = append(as,
			"EN 1993-1-1: alpha_cr = F_cr/F_Ed ("+clauseAlpha+") from the elastic buckling analysis of the frame, "+
				"based on the initial elastic stiffnesses")
	}
	return as, nil
}

// Member implements checks.RuleSet: N_cr of both axes with the axis's
// buckling length (Nom) and with its braced buckling length (Nomb).
func (r *Rules) Member(mc *checks.MemberContext, tr *checks.Tracer) {
	if tr.On() {
		switch mc.ESource {
		case "model":
			tr.Step("E", "", "elastic modulus (from the model)", mc.E, "MPa")
		case "request":
			tr.Step("E", "", "elastic modulus (the request's default)", mc.E, "MPa").Noted(noteAssumedE)
		default:
			tr.Step("E", clauseModulus, "elastic modulus of steel", mc.E, "MPa").Noted(noteAssumedE)
		}
	}
	for a := range mc.Axes {
		s := &mc.Axes[a]
		s.Nom = checks.Euler(mc.E, s.I, s.Ke*s.Length)
		s.Nomb = checks.Euler(mc.E, s.I, s.BracedKe*s.Length)
		if !tr.On() {
			continue
		}
		q := &r.q[a]
		if !math.IsNaN(s.Nom) {
			note := ""
			switch s.Restraint {
			case checks.Sway:
				note = noteSwayNcr
			case checks.Braced:
				note = noteBracedNcr
			}
			tr.Step(q.ncr, clauseNcr, "pi^2 E I / (k L)^2", checks.KN(s.Nom), "kN").
				Add("E", mc.E, "MPa").Add("I", s.I, "mm⁴").Add("k", s.Ke, "").Add("L", s.Length, "mm").Noted(note)
		}
		if s.Restraint == checks.Sway && !math.IsNaN(s.Nomb) {
			tr.Step(q.ncrb, clauseNcr, "pi^2 E I / (k_b L)^2", checks.KN(s.Nomb), "kN").
				Add("E", mc.E, "MPa").Add("I", s.I, "mm⁴").Add("k_b", s.BracedKe, "").Add("L", s.Length, "mm").
				Noted(noteBracedMode)
		}
	}
	if tr.On() && mc.Options.Scope == "full" {
		r.memberCapacity(mc, scratchOf(mc), tr)
	}
}

// StoreyLambda implements checks.RuleSet: the drift form (5.2.1(4)B) when
// the storey's shear and drift are given, else form A, the storey-stiffness
// form of F_cr/F_Ed (5.2.1(3)).
func (r *Rules) StoreyLambda(s *checks.StoreySums) (float64, string, float64) {
	if s.HasDrift {
		d := DriftAlpha(s.Shear, s.Vertical, s.Height, s.Drift)
		return d, "drift", d
	}
	return s.FormA, "A", math.NaN()
}

// DriftAlpha is alpha_cr = (H_Ed/V_Ed)(h/δ_H,Ed) of 5.2.1(4)B, formula
// (5.2): +Inf with no drift or no vertical load.
func DriftAlpha(shear, vertical, height, drift float64) float64 {
	if !(drift > 0) || !(vertical > 0) {
		return math.Inf(1)
	}
	return shear / vertical * (height / drift)
}

// SwayFactor is 1/(1 − 1/alpha_cr) of 5.2.2(5)B for alpha_cr > 1 (1 for
// alpha_cr = +Inf).
func SwayFactor(alpha float64) float64 { return 1 / (1 - 1/alpha) }

// FirstOrder reports whether second-order effects may be neglected
// (alpha_cr ≥ 10, 5.2.1(3)).
func FirstOrder(alpha float64) bool { return alpha >= FirstOrderFrom*(1-thresholdTolerance) }

// SecondOrderRequired reports whether alpha_cr is below the amplification
// range (alpha_cr < 3, 5.2.2(5)B).
func SecondOrderRequired(alpha float64) bool { return alpha < AmplifyFrom*(1-thresholdTolerance) }

// numMsg builds prefix + x (3 decimals) + suffix with one allocation.
func numMsg(prefix string, x float64, suffix string) string {
	var buf [224]byte
	b := append(buf[:0], prefix...)
	b = strconv.AppendFloat(b, x, 'f', 3, 64)
	b = append(b, suffix...)
	return string(b)
}
