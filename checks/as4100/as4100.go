// Package as4100 is the AS 4100 rule set: member elastic buckling loads
// (4.6.2), the moment amplification of a first-order elastic analysis for
// braced members (delta_b, 4.4.2.2) and sway members (delta_s, delta_m,
// 4.4.2.3), the storey buckling load factor (4.7.2.2) and the limit beyond
// which a second-order analysis is required (delta_m > 1.4, 4.4.1.2 in the
// 2020 text).
//
// With scope full it adds the member capacity checks (see Capacity): the
// form factor and compression capacity (Section 6), the tension capacity
// (7.2), the section moment capacity (5.2), lateral-torsional buckling
// (5.6.1) and the combined-action checks of Section 8 with the amplified
// moments, each with its utilisation.
//
// Clause numbers follow AS 4100:2020 where the two editions differ; the
// storey formula of 4.7.2.2 is not confirmed against the text, so the lower
// (safe) of the two candidate forms is used. A standard that follows AS 4100
// (NZS 3404) reuses the procedure through NewVariant with its own clause
// labels and sway provisions.
package as4100

import (
	"math"
	"strconv"

	"swaygate/checks"
)

// Constants of AS 4100.
const (
	// Modulus is the elastic modulus of steel (MPa), clause 2.2.4.
	Modulus = 200_000.0
	// DeltaLimit is the largest moment amplification factor for which
	// amplified first-order moments may be used (4.4.1.2, 2020 text).
	DeltaLimit = 1.4
	// BracedLambdaNote: on a braced axis lambda_c is Nomb/N* (4.7.2.1).
)

// limitTolerance keeps a factor that equals DeltaLimit in exact arithmetic
// (lambda_c = 3.5 gives delta_s = 1.4) from tripping the limit by rounding.
const limitTolerance = 1e-12

// Clauses are the clause labels a rule set of the AS 4100 family cites in
// its trace and messages.
type Clauses struct {
	Standard     string // e.g. "AS 4100"
	Modulus      string // E
	Nom          string // member elastic buckling load Nom, Nomb
	MStar        string // M*m, the largest first-order moment
	BetaM        string // beta_m, c_m, delta_b (braced member)
	BracedLambda string // lambda_c of a braced member
	StoreyLambda string // storey buckling load factor lambda_ms
	DriftLambda  string // the storey-drift form of delta_s
	FrameLambda  string // rational elastic buckling analysis
	DeltaS       string // delta_s, delta_m (sway member)
	Limit        string // the 1.4 limit
}

// ASClauses returns the AS 4100 labels.
func ASClauses() Clauses {
	return Clauses{
		Standard:     "AS 4100",
		Modulus:      "AS 4100 2.2.4",
		Nom:          "AS 4100 4.6.2",
		MStar:        "AS 4100 4.4.2.2",
		BetaM:        "AS 4100 4.4.2.2",
		BracedLambda: "AS 4100 4.7.2.1",
		StoreyLambda: "AS 4100 4.7.2.2",
		DriftLambda:  "AS 4100 4.4.2.3(a)(i)",
		FrameLambda:  "AS 4100 4.7.2",
		DeltaS:       "AS 4100 4.4.2.3",
		Limit:        "AS 4100 4.4.1.2",
	}
}

// Variant describes a standard that follows the AS 4100 procedure.
type Variant struct {
	Name, Title string
	Clauses     Clauses
	// Note is added to every step of the trace, for example to say that
	// clause numbers follow AS 4100 where they are not confirmed.
	Note string
	// Begin checks the variant's own options and returns its assumptions;
	// nil for none.
	Begin func(opt *checks.Options) ([]string, error)
	// Sway, when set, gives delta_s of a sway or leaning axis in a
	// first-order analysis with lambda_c > 1 (lambda may be +Inf when the
	// storey has no compression) in place of SwayFactor. It may add reasons
	// through cx and must trace its delta_s step.
	Sway func(cx *checks.AxisContext, lambda float64, tr *checks.Tracer) float64
}

// Rules is the AS 4100 rule set, or a variant of it. It holds no per-run
// state.
type Rules struct {
	v     Variant
	q     [2]quantities
	notes [nNotes]string

	// Capacity labels and notes (scope full).
	cc      capClauses
	cq      [2]capQuantities
	cnotes  [nCapNotes]string
	abNotes [nAlphaB]string
	gNotes  []string
	pNotes  [5]string

	msgUnstableMember string
	msgLimitSuffix    string
	msgSwayLimit      string
}

// New returns the AS 4100 rule set.
func New() *Rules {
	return NewVariant(Variant{Name: "as4100", Title: "AS 4100", Clauses: ASClauses()})
}

// NewVariant returns the AS 4100 procedure with a variant's labels and sway
// provisions.
func NewVariant(v Variant) *Rules {
	r := &Rules{v: v}
	for a := range checks.Axes {
		r.q[a] = newQuantities(checks.Axis(a).String())
	}
	for k, n := range noteText() {
		switch {
		case n == "":
			r.notes[k] = v.Note
		case v.Note == "":
			r.notes[k] = n
		default:
			r.notes[k] = n + "; " + v.Note
		}
	}
	c := &r.v.Clauses
	r.msgUnstableMember = "N* ≥ N_omb: the member buckles between its ends (" + c.Nom + ")"
	r.msgLimitSuffix = " > 1.4: amplification of first-order moments is not permitted; a second-order analysis is required (" + c.Limit + ")"
	r.msgSwayLimit = " > 1.4 with no moment about this axis: the storey is too sway-sensitive for amplification; a second-order analysis is required (" + c.Limit + ")"
	r.initCapacity()
	return r
}

// Name implements checks.RuleSet.
func (r *Rules) Name() string { return r.v.Name }

// Title implements checks.RuleSet.
func (r *Rules) Title() string { return r.v.Title }

// Clauses returns the rule set's clause labels.
func (r *Rules) Clauses() Clauses { return r.v.Clauses }

// Begin implements checks.RuleSet. With scope full it adds the
// assumptions of the member capacity checks.
func (r *Rules) Begin(opt *checks.Options) ([]string, error) {
	c := &r.v.Clauses
	var as []string
	if opt.SwayMethod == "" || opt.SwayMethod == "storey" {
		as = append(as,
			r.v.Title+": lambda_c of a storey ("+c.StoreyLambda+") is the lower of form A Σ(Noms/L)/Σ(N*/L) and "+
				"form B Σ(Noms·N*/L)/Σ(N*²/L): the clause's own formula is not confirmed, and the lower is the safe choice",
			r.v.Title+": where storey shear and drift are given for a storey, direction and combination, lambda_c is the "+
				"storey-drift form of "+c.DriftLambda+", h_s·ΣV*/(Δ_s·ΣN*), which the clause permits in place of "+c.StoreyLambda)
	}
	if r.v.Begin != nil {
		more, err := r.v.Begin(opt)
		if err != nil {
			return nil, err
		}
		as = append(as, more...)
	}
	if opt.Scope == "full" {
		as = append(as, r.capacityAssumptions()...)
	}
	return as, nil
}

// Modulus implements checks.RuleSet.
func (r *Rules) Modulus() (float64, string) { return Modulus, r.v.Clauses.Modulus }

// Member implements checks.RuleSet: Nom and Nomb of both axes (4.6.2).
func (r *Rules) Member(mc *checks.MemberContext, tr *checks.Tracer) {
	c := &r.v.Clauses
	if tr.On() {
		switch mc.ESource {
		case "model":
			tr.Step("E", "", "elastic modulus (from the model)", mc.E, "MPa").Noted(r.notes[noteNone])
		case "request":
			tr.Step("E", "", "elastic modulus (the request's default)", mc.E, "MPa").Noted(r.notes[noteAssumedE])
		default:
			tr.Step("E", c.Modulus, "elastic modulus of steel", mc.E, "MPa").Noted(r.notes[noteAssumedE])
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
			tr.Step(q.nom, c.Nom, "pi^2 E I / (k_e L)^2", checks.KN(s.Nom), "kN").
				Add("E", mc.E, "MPa").Add("I", s.I, "mm⁴").Add("k_e", s.Ke, "").Add("L", s.Length, "mm").
				Noted(r.notes[roleNote(s.Restraint)])
		}
		if s.Restraint == checks.Sway && !math.IsNaN(s.Nomb) {
			tr.Step(q.nomb, c.Nom, "pi^2 E I / (k_eb L)^2", checks.KN(s.Nomb), "kN").
				Add("E", mc.E, "MPa").Add("I", s.I, "mm⁴").Add("k_eb", s.BracedKe, "").Add("L", s.Length, "mm").
				Noted(r.notes[noteBracedKe])
		}
	}
	if tr.On() && mc.Options.Scope == "full" {
		sc := scratchOf(mc)
		r.memberCapacity(mc, &sc.cap, sc, tr)
	}
}

func roleNote(rs checks.Restraint) int {
	switch rs {
	case checks.Sway:
		return noteSwayKe
	case checks.Braced:
		return noteBracedOwnKe
	}
	return noteNone
}

// StoreyLambda implements checks.RuleSet: the storey-drift form of
// 4.4.2.3(a)(i) when the storey's shear and drift are given, else the lower
// of forms A and B (4.7.2.2).
func (r *Rules) StoreyLambda(s *checks.StoreySums) (float64, string, float64) {
	if s.HasDrift {
		// delta_s = 1/(1 − Δs·ΣN*/(hs·ΣV*)) is 1/(1 − 1/lambda) with
		// lambda = hs·ΣV*/(Δs·ΣN*).
		d := math.Inf(1)
		if s.Drift > 0 && s.Vertical > 0 {
			d = s.Height * s.Shear / (s.Drift * s.Vertical)
		}
		return d, "drift", d
	}
	if s.FormB < s.FormA {
		return s.FormB, "B", math.NaN()
	}
	return s.FormA, "A", math.NaN()
}

// SwayFactor is delta_s = 1/(1 − 1/lambda_c) of 4.4.2.3 for lambda_c > 1
// (1 for lambda_c = +Inf).
func SwayFactor(lambda float64) float64 { return 1 / (1 - 1/lambda) }

// BracedFactor is delta_b = cm/(1 − N*/Nomb) of 4.4.2.2 before the floor of
// 1 is applied.
func BracedFactor(cm, nstar, nomb float64) float64 { return cm / (1 - nstar/nomb) }

// Cm is c_m = 0.6 − 0.4·beta_m ≤ 1 (4.4.2.2).
func Cm(betaM float64) float64 { return math.Min(1, 0.6-0.4*betaM) }

// Exceeds reports whether an amplification factor is above DeltaLimit.
func Exceeds(delta float64) bool { return delta > DeltaLimit*(1+limitTolerance) }

// numMsg builds prefix + x (3 decimals) + suffix with one allocation.
func numMsg(prefix string, x float64, suffix string) string {
	var buf [192]byte
	b := append(buf[:0], prefix...)
	b = strconv.AppendFloat(b, x, 'f', 3, 64)
	b = append(b, suffix...)
	return string(b)
}
