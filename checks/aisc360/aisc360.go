// Package aisc360 is the AISC 360 (ANSI/AISC 360-22; 360-16 is the same in
// substance) rule set: the approximate second-order analysis of Appendix 8,
// with the P-δ multiplier B1 (A-8-3, with C_m of A-8-4 and P_e1 of A-8-5)
// and the P-Δ multiplier B2 (A-8-6) of the storey, and the limit of the
// effective length and first-order analysis methods on the ratio of second-
// to first-order drift, for which B2 may be used (B2 ≤ 1.5, App. 7.2.1(b)
// and 7.3.1(c)).
//
// P_e,story (A-8-7) is, by default, the storey's sidesway buckling strength
// ΣP_e2 of its sway columns (the storey-stiffness form A of the storey sums,
// Σ(P_e2/L)/Σ(P_r/L), which is ΣP_e2/ΣP_r for columns of one height),
// without R_M; where storey shear and drift are given, it is R_M·H·L/Δ_H
// with R_M = 1 − 0.15 P_mf/P_story (A-8-8), P_mf being the load on the
// storey's sway (moment-frame) columns. The member method (the member's own
// P_e2) is available on request and recorded as not a method of the current
// specification.
//
// alpha is 1.0 (LRFD) or 1.6 (ASD), chosen by Options.AISCMethod.
//
// Field meanings (design §6): n_om_kn is P_e2 on a sway axis and P_e1 on a
// braced axis; n_omb_kn is P_e1 (K1 = the braced ke: the axis's own on a
// braced axis, 1.0 by default on a sway axis); lambda_c is P_e,story/P_story
// on sway and leaning axes and P_e1/P_r on braced axes; beta_m is M1/M2 and
// c_m is C_m; delta_b is B1; delta_s is B2 (null on braced axes); delta_m is
// max(B1, B2), or, where the actions give M_nt and M_lt separately, the
// effective factor (B1 M_nt + B2 M_lt)/M_r1 of A-8-1, M_r1 being the first-
// order moment.
//
// A member fails (unstable) when alpha P_r ≥ P_e1 or alpha P_story ≥
// P_e,story (the multipliers are not defined there).
//
// With scope full (Capacity) a member must also be strong enough: local
// buckling classification (B4.1), P_n by E3 with E7 effective areas for
// slender elements, M_n by F2/F3 (I major axis, lateral-torsional buckling
// over the member length with C_b from the end moments), F6 (I minor
// axis), F7 (rectangular HSS) and F8 (round HSS), P_c and M_c with φ or Ω
// of Options.AISCMethod, and the interaction of H1.1 (H1-1a/b) with the
// amplified M_r. F_y comes from the model, the request, or a table of
// ASTM grades (material.go). A utilisation above 1 fails the member
// (capacity-exceeded); a check that cannot be made (F4/F5 webs, slender
// HSS walls in flexure, no F_y, no plate model) needs analysis. Table
// B4.1, E7, F2, F6, F7 and F8 are [L] (a public implementation citing the
// clauses), E3 and H1 [C] (standards-notes §4); the φ and Ω values and the
// C_b formula are from memory [M].
//
// Numbers inside are SI (N, mm, MPa); models in US customary units are
// converted by the extraction.
package aisc360

import (
	"errors"
	"math"
	"strconv"

	"swaygate/checks"
)

// Constants of AISC 360.
const (
	// Modulus is the elastic modulus of steel, 29 000 ksi = 200 000 MPa
	// (the value the Specification states in SI).
	Modulus = 200_000.0
	// AlphaLRFD and AlphaASD are alpha of A-8-3 and A-8-6.
	AlphaLRFD = 1.0
	AlphaASD  = 1.6
	// B2Limit is the largest ratio of second- to first-order drift (taken
	// as B2) for the effective length method (App. 7.2.1(b)) and the
	// first-order analysis method (App. 7.3.1(c)).
	B2Limit = 1.5
	// RMFactor is the 0.15 of R_M = 1 − 0.15 P_mf/P_story (A-8-8).
	RMFactor = 0.15
)

// Clause labels.
const (
	clauseModulus = "AISC 360 E3"
	clauseAlpha   = "AISC 360 App. 8 (A-8-3)"
	clauseMr      = "AISC 360 App. 8 (A-8-1)"
	clauseB1      = "AISC 360 App. 8 (A-8-3)"
	clauseCm      = "AISC 360 App. 8 (A-8-4)"
	clausePe1     = "AISC 360 App. 8 (A-8-5)"
	clauseB2      = "AISC 360 App. 8 (A-8-6)"
	clausePeStory = "AISC 360 App. 8 (A-8-7)"
	clauseRM      = "AISC 360 App. 8 (A-8-8)"
	clauseLimit   = "AISC 360 App. 7.2.1(b), 7.3.1(c)"
)

// limitTolerance keeps a B2 that equals B2Limit in exact arithmetic from
// tripping the limit by rounding.
const limitTolerance = 1e-12

// Errors of Begin.
var (
	// ErrMethod: Options.AISCMethod is neither lrfd nor asd.
	ErrMethod = errors.New("aisc360: unknown AISC method (want lrfd or asd)")
)

// Rules is the AISC 360 rule set. It holds no per-run state.
type Rules struct {
	q [2]quantities
}

// New returns the AISC 360 rule set.
func New() *Rules {
	r := &Rules{}
	for a := range checks.Axes {
		r.q[a] = newQuantities(checks.Axis(a).String())
	}
	return r
}

// Name implements checks.RuleSet.
func (r *Rules) Name() string { return "aisc360" }

// Title implements checks.RuleSet.
func (r *Rules) Title() string { return "AISC 360" }

// Modulus implements checks.RuleSet: E = 29 000 ksi (200 000 MPa).
func (r *Rules) Modulus() (float64, string) { return Modulus, clauseModulus + " (E = 29 000 ksi)" }

// Alpha returns alpha of A-8-3 and A-8-6 for an AISC method ("lrfd", the
// default when empty, or "asd") and whether the method is known.
func Alpha(method string) (float64, bool) {
	switch method {
	case "", "lrfd":
		return AlphaLRFD, true
	case "asd":
		return AlphaASD, true
	}
	return math.NaN(), false
}

// Begin implements checks.RuleSet.
func (r *Rules) Begin(opt *checks.Options) ([]string, error) {
	alpha, ok := Alpha(opt.AISCMethod)
	if !ok {
		return nil, errors.Join(ErrMethod, errors.New("aisc360: got "+strconv.Quote(opt.AISCMethod)))
	}
	method := "LRFD"
	if alpha == AlphaASD {
		method = "ASD"
	}
	as := []string{
		"AISC 360 Appendix 8 approximate second-order analysis, " + method + ": alpha = " + ftoa(alpha) +
			" in B1 (A-8-3) and B2 (A-8-6); the design actions are taken as " + method + " load combinations",
		"AISC 360: P_e1 and P_e2 with the elastic EI (the effective length method of App. 7.2 and the first-order method of " +
			"App. 7.3); the direct analysis method would use EI* = 0.8 tau_b EI (A-8-5) and a drift from the reduced stiffness",
		"AISC 360: P_r in B1 is the first-order estimate P_nt + P_lt (permitted by A-8-3); the amplified axial force " +
			"P_nt + B2 P_lt (A-8-2) belongs to the member strength checks",
		"AISC 360: B2 > " + ftoa(B2Limit) + " (the ratio of second- to first-order drift limited by App. 7.2.1(b) and 7.3.1(c)) " +
			"requires a second-order analysis; B1 has no such limit",
	}
	if opt.Scope == "full" {
		as = append(as, capacityAssumptions(opt.AISCMethod)...)
	}
	switch opt.SwayMethod {
	case "", "storey":
		as = append(as,
			"AISC 360: P_e,story of a storey (A-8-7) is its sidesway buckling strength ΣP_e2 of the sway columns (form A, "+
				"Σ(P_e2/L)/Σ(P_r/L) times P_story), without R_M; P_story is the vertical load of all its columns, leaning columns included",
			"AISC 360: where storey shear and drift are given for a storey, direction and combination, P_e,story = R_M H L/Delta_H "+
				"(A-8-7) with R_M = 1 - 0.15 P_mf/P_story (A-8-8), P_mf being the load on the storey's sway (moment-frame) columns")
	case "member":
		as = append(as,
			"AISC 360: B2 of each sway axis from the member's own P_e2 (member method, user choice): this is not a method of "+
				"the current specification, which takes B2 per storey (A-8-6, A-8-7), and it ignores the load of leaning columns")
	case "frame":
		as = append(as,
			"AISC 360: P_e,story/P_story from the elastic buckling analysis of the frame (the sidesway buckling analysis "+
				"that A-8-7 permits), without R_M")
	}
	return as, nil
}

// Member implements checks.RuleSet: P_e2 (the sway axis's ke) and P_e1
// (K1, the braced ke) of both axes (A-8-5), and alpha.
func (r *Rules) Member(mc *checks.MemberContext, tr *checks.Tracer) {
	if tr.On() {
		switch mc.ESource {
		case "model":
			tr.Step("E", "", "elastic modulus (from the model)", mc.E, "MPa")
		case "request":
			tr.Step("E", "", "elastic modulus (the request's default)", mc.E, "MPa").Noted(noteAssumedE)
		default:
			tr.Step("E", clauseModulus, "elastic modulus of steel, 29 000 ksi", mc.E, "MPa").Noted(noteAssumedE)
		}
		alpha, _ := Alpha(mc.Options.AISCMethod)
		note := noteLRFD
		if alpha == AlphaASD {
			note = noteASD
		}
		tr.Step("alpha", clauseAlpha, "1.0 (LRFD) or 1.6 (ASD)", alpha, "").Noted(note)
	}
	for a := range mc.Axes {
		s := &mc.Axes[a]
		s.Nom = checks.Euler(mc.E, s.I, s.Ke*s.Length)
		s.Nomb = checks.Euler(mc.E, s.I, s.BracedKe*s.Length)
		if !tr.On() {
			continue
		}
		q := &r.q[a]
		if s.Restraint == checks.Sway {
			if !math.IsNaN(s.Nom) {
				tr.Step(q.pe2, clausePeStory, "pi^2 E I / (K2 L)^2", checks.KN(s.Nom), "kN").
					Add("E", mc.E, "MPa").Add("I", s.I, "mm⁴").Add("K2", s.Ke, "").Add("L", s.Length, "mm").Noted(notePe2)
			}
			if !math.IsNaN(s.Nomb) {
				tr.Step(q.pe1, clausePe1, "pi^2 E I / (K1 L)^2", checks.KN(s.Nomb), "kN").
					Add("E", mc.E, "MPa").Add("I", s.I, "mm⁴").Add("K1", s.BracedKe, "").Add("L", s.Length, "mm").Noted(notePe1Sway)
			}
			continue
		}
		if !math.IsNaN(s.Nomb) {
			tr.Step(q.pe1, clausePe1, "pi^2 E I / (K1 L)^2", checks.KN(s.Nomb), "kN").
				Add("E", mc.E, "MPa").Add("I", s.I, "mm⁴").Add("K1", s.BracedKe, "").Add("L", s.Length, "mm").Noted(notePe1Braced)
		}
	}
	if tr.On() && mc.Options.Scope == "full" {
		r.memberCapacity(mc, scratchOf(mc), tr)
	}
}

// StoreyLambda implements checks.RuleSet: P_e,story/P_story, with
// P_e,story = R_M H L/Δ_H (A-8-7, A-8-8) when the storey's shear and drift
// are given, else the sidesway buckling form A, ΣP_e2/ΣP_r.
func (r *Rules) StoreyLambda(s *checks.StoreySums) (float64, string, float64) {
	if s.HasDrift {
		pe := PeStory(RM(s.SumNSway, s.Vertical), s.Shear, s.Height, s.Drift)
		l := math.Inf(1)
		if s.Vertical > 0 {
			l = pe / s.Vertical
		}
		return l, "drift", l
	}
	return s.FormA, "A", math.NaN()
}

// RM is R_M = 1 − 0.15 P_mf/P_story of A-8-8, with the ratio kept within
// [0, 1]; 1 when the storey carries no load.
func RM(pmf, pstory float64) float64 {
	if !(pstory > 0) {
		return 1
	}
	return 1 - RMFactor*math.Min(1, math.Max(0, pmf/pstory))
}

// PeStory is P_e,story = R_M H L/Δ_H of A-8-7 (N): +Inf with no drift.
func PeStory(rm, shear, height, drift float64) float64 {
	if !(drift > 0) {
		return math.Inf(1)
	}
	return rm * shear * height / drift
}

// Cm is C_m = 0.6 − 0.4 M1/M2 of A-8-4 (M1/M2 positive in reverse
// curvature).
func Cm(ratio float64) float64 { return 0.6 - 0.4*ratio }

// B1 is C_m/(1 − alpha P_r/P_e1) of A-8-3 before the floor of 1.
func B1(cm, alpha, pr, pe1 float64) float64 { return cm / (1 - alpha*pr/pe1) }

// B2 is 1/(1 − alpha P_story/P_e,story) of A-8-6 with lambda =
// P_e,story/P_story > alpha (1 for lambda = +Inf).
func B2(alpha, lambda float64) float64 { return 1 / (1 - alpha/lambda) }

// ExceedsLimit reports whether B2 is above B2Limit.
func ExceedsLimit(b2 float64) bool { return b2 > B2Limit*(1+limitTolerance) }

func ftoa(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// numMsg builds prefix + x (3 decimals) + suffix with one allocation.
func numMsg(prefix string, x float64, suffix string) string {
	var buf [256]byte
	b := append(buf[:0], prefix...)
	b = strconv.AppendFloat(b, x, 'f', 3, 64)
	b = append(b, suffix...)
	return string(b)
}
