package en1993

import (
	"math"

	"swaygate/checks"
)

// quantities are the trace labels of one axis, built once per rule set so
// that no step concatenates strings.
type quantities struct {
	ncr, ncrb, ratio, mEd, lambda, alpha, deltaS, deltaM, mAmp string
}

func newQuantities(axis string) quantities {
	return quantities{
		ncr:    "N_cr," + axis,
		ncrb:   "N_cr,b," + axis,
		ratio:  "N_Ed/N_cr,b," + axis,
		mEd:    "M_Ed," + axis,
		lambda: "N_cr/N_Ed," + axis,
		alpha:  "alpha_cr," + axis,
		deltaS: "delta_s," + axis,
		deltaM: "delta_m," + axis,
		mAmp:   "M_Ed,amp," + axis,
	}
}

// Step notes.
const (
	noteAssumedE       = "the model gives no modulus"
	noteSwayNcr        = "sway axis: N_cr of the sway mode, with the sway buckling length"
	noteBracedNcr      = "braced axis: N_cr with the axis's own buckling length"
	noteBracedMode     = "sway axis: N_cr of the braced (non-sway) mode, with the braced buckling length (default k_b = 1.0)"
	notePeak           = "the largest moment along the member (analysis stations)"
	noteUnstableMember = "≥ 1: the member buckles between its ends"
	noteBracedLambda   = "braced axis"
	noteBracedMember   = "braced axis: no global amplification; member imperfections and second-order effects within the member " +
		"are covered by the member buckling check of " + clauseMember + " (outside the stability scope)"
	noteFormA          = "storey-stiffness form A: N_cr of the storey's sway columns, N_Ed of all its columns"
	noteFormALeaning   = "storey-stiffness form A; leaning axis: it takes its storey's alpha_cr"
	noteDrift          = "storey drift form from the given storey shear and drift"
	noteOwnNoStorey    = "column without a storey: its own N_cr/N_Ed"
	noteMemberMethod   = "member method (user choice): " + clauseAlpha + " defines alpha_cr for the whole structure"
	noteFrame          = "elastic buckling analysis of the frame"
	noteSecondOrder    = "actions from a second-order analysis: the sway effects are included, delta_s = 1"
	noteNoCompression  = "no compression in the storey: delta_s = 1"
	noteFirstOrder     = "alpha_cr ≥ 10: second-order effects may be neglected"
	noteAmplify        = "3 ≤ alpha_cr < 10: the sway effects are amplified"
	noteSecondRequired = "alpha_cr < 3: a second-order analysis is required; the factor is given for information"
	noteSwayM          = "sway or leaning axis: delta_m = delta_s"
	noteSplit          = "M_Ed = M_nt + delta_s M_lt from the separate no-sway and sway moments"
	noteTotal          = "no separate sway moments: the total moment is amplified"
	noteNoMoment       = "no moment about this axis: nothing to amplify"
)

// Reason messages.
const (
	msgNotInCompression = "N_Ed ≤ 0: no member buckling"
	msgUnstableMember   = "N_Ed ≥ N_cr of the braced (non-sway) buckling mode: the member buckles between its ends (" + clauseNcr + ")"
	msgNoMomentBraced   = "no moment about this axis: nothing to amplify (the member buckling resistance of " + clauseMember +
		" is not part of the stability scope)"
	msgNoMomentSway = "no moment about this axis: nothing to amplify; the storey's alpha_cr limits still apply"
	msgInteriorUnk  = "a transverse load acts between the ends but only end moments are known: M_Ed cannot be found"
	msgTotalMoment  = "no separate no-sway and sway moments: the total moment is amplified by 1/(1 − 1/alpha_cr), where " +
		clauseAmplify + " amplifies the sway effects only; this can be unconservative where the two parts have opposite signs"
	suffixSecondOrder = " < 3: amplification of the sway moments is not permitted; a second-order analysis is required (" +
		clauseAmplify + ")"
	suffixUnstableStorey = " ≤ 1: the storey buckles in sway under the design load (" + clauseAlpha + ")"
	suffixUnstableOwn    = " ≤ 1: the member buckles in sway under the design load (N_cr/N_Ed)"
	suffixUnstableFrame  = " ≤ 1: the frame buckles under the design load (" + clauseAlpha + ")"
)

// Amplify implements checks.RuleSet (5.2.1, 5.2.2).
func (r *Rules) Amplify(cx *checks.AxisContext, out *checks.AxisResult, tr *checks.Tracer) {
	s, mo := cx.Setup, cx.Moments
	q := &r.q[cx.Axis]
	nEd := cx.NStar
	secondOrder := cx.Actions.Theory == checks.SecondOrder
	role := cx.Sway.Role
	on := tr.On()

	// M_Ed, the largest first-order moment.
	mm, hasMoment := checks.FirstOrderMoment(cx, out, tr, q.mEd, clauseMoment, notePeak, "", msgInteriorUnk)

	// The braced (non-sway) buckling mode of the member.
	memberOK := true
	switch {
	case !(nEd > 0):
		cx.Reason(checks.CodeNotInCompression, msgNotInCompression)
	case math.IsNaN(s.Nomb):
		// Unknown: the missing input has its own reason.
	case nEd >= s.Nomb:
		memberOK = false
		cx.Reason(checks.CodeUnstable, msgUnstableMember)
		if on {
			tr.Step(q.ratio, clauseNcr, "N_Ed / N_cr,b", nEd/s.Nomb, "").
				Add("N_Ed", checks.KN(nEd), "kN").Add("N_cr,b", checks.KN(s.Nomb), "kN").Noted(noteUnstableMember)
		}
	}

	deltaS, deltaM := math.NaN(), math.NaN()
	switch {
	case role == checks.RoleBraced:
		if nEd > 0 && !math.IsNaN(s.Nomb) {
			l := s.Nomb / nEd
			out.LambdaC = checks.Num(l)
			if on {
				tr.Step(q.lambda, clauseNcr, "N_cr / N_Ed", l, "").
					Add("N_cr", checks.KN(s.Nomb), "kN").Add("N_Ed", checks.KN(nEd), "kN").Noted(noteBracedLambda)
			}
		}
		if memberOK {
			deltaM = 1
			if on {
				tr.Step(q.deltaM, clauseMember, "1", 1, "").Noted(noteBracedMember)
			}
		}
	case role.Swaying():
		a := cx.Sway.Lambda
		out.LambdaC = checks.Num(a)
		if on && !math.IsNaN(a) && !math.IsInf(a, 0) {
			r.traceAlpha(cx, a, tr)
		}
		switch {
		case a <= 1:
			cx.Reason(checks.CodeUnstable, numMsg("alpha_cr = ", a, unstableSuffix(&cx.Sway)))
		case secondOrder:
			deltaS = 1
			if on {
				tr.Step(q.deltaS, clauseAmplify, "1", 1, "").Noted(noteSecondOrder)
			}
		case math.IsNaN(a):
			// Unknown: the provider's reason says why.
		case math.IsInf(a, 1):
			deltaS = 1
			if on {
				tr.Step(q.deltaS, clauseFirstOrder, "1", 1, "").Noted(noteNoCompression)
			}
		case FirstOrder(a):
			deltaS = 1
			if on {
				tr.Step(q.deltaS, clauseFirstOrder, "1 (alpha_cr ≥ 10)", 1, "").Add("alpha_cr", a, "").Noted(noteFirstOrder)
			}
		default:
			deltaS = SwayFactor(a)
			note := noteAmplify
			if SecondOrderRequired(a) {
				note = noteSecondRequired
				cx.Reason(checks.CodeSecondOrderRequired, numMsg("alpha_cr = ", a, suffixSecondOrder))
			}
			if on {
				tr.Step(q.deltaS, clauseAmplify, "1 / (1 - 1/alpha_cr)", deltaS, "").Add("alpha_cr", a, "").Noted(note)
			}
		}
		deltaM = deltaS
		if on && !math.IsNaN(deltaM) {
			tr.Step(q.deltaM, clauseAmplify, "delta_s", deltaM, "").Noted(noteSwayM)
		}
	}
	out.DeltaS, out.DeltaM = checks.Num(deltaS), checks.Num(deltaM)

	if !hasMoment {
		if role.Swaying() {
			cx.Reason(checks.CodeNoMoment, msgNoMomentSway)
		} else {
			cx.Reason(checks.CodeNoMoment, msgNoMomentBraced)
		}
	}

	// The design moment: the sway part amplified (5.2.2(5)B).
	if mo.InteriorUnknown || math.IsNaN(deltaM) {
		return
	}
	amp, note := deltaM*mm, ""
	switch {
	case !hasMoment:
		note = noteNoMoment
	case role.Swaying() && mo.Split != nil:
		amp, note = checks.SplitMoment(mo.Split, 1, deltaS), noteSplit
	case role.Swaying() && deltaS > 1:
		note = noteTotal
		cx.Reason(checks.CodeTotalMomentAmplified, msgTotalMoment)
	}
	out.MAmp = checks.Num(amp)
	if on {
		if note == noteSplit {
			sp := mo.Split
			tr.Step(q.mAmp, clauseAmplify, "max |M_nt + delta_s M_lt|", checks.KNm(amp), "kNm").
				Add("delta_s", deltaS, "").
				Add("M_nt,start", checks.KNm(sp.NtStart), "kNm").Add("M_nt,end", checks.KNm(sp.NtEnd), "kNm").
				Add("M_lt,start", checks.KNm(sp.LtStart), "kNm").Add("M_lt,end", checks.KNm(sp.LtEnd), "kNm").
				Add("M_nt,peak", checks.KNm(sp.NtPeak), "kNm").Add("M_lt,peak", checks.KNm(sp.LtPeak), "kNm").
				Noted(note)
		} else {
			clause := clauseAmplify
			if role == checks.RoleBraced {
				clause = clauseMember
			}
			tr.Step(q.mAmp, clause, "delta_m M_Ed", checks.KNm(amp), "kNm").
				Add("delta_m", deltaM, "").Add("M_Ed", checks.KNm(mm), "kNm").Noted(note)
		}
	}
}

// traceAlpha records alpha_cr of a sway or leaning axis with its source.
func (r *Rules) traceAlpha(cx *checks.AxisContext, a float64, tr *checks.Tracer) {
	q := &r.q[cx.Axis]
	sv := &cx.Sway
	switch {
	case sv.Method == "frame":
		tr.Step(q.alpha, clauseAlpha, "F_cr / F_Ed (elastic buckling analysis of the frame)", a, "").Noted(noteFrame)
	case sv.Form == "member":
		note, clause := noteOwnNoStorey, clauseAlpha
		if sv.Method == "member" {
			note, clause = noteMemberMethod, ""
		}
		tr.Step(q.alpha, clause, "N_cr / N_Ed", a, "").
			Add("N_cr", checks.KN(cx.Setup.Nom), "kN").Add("N_Ed", checks.KN(cx.NStar), "kN").Noted(note)
	case sv.Form == "drift" && sv.Storey != nil:
		st := sv.Storey
		tr.Step(q.alpha, clauseDrift, "(H_Ed / V_Ed) (h / delta_H,Ed)", a, "").
			Add("H_Ed", checks.KN(st.Shear.F()), "kN").Add("V_Ed", checks.KN(st.Vertical.F()), "kN").
			Add("h", st.Height.F(), "mm").Add("delta_H,Ed", st.Drift.F(), "mm").Noted(noteDrift)
	case sv.Storey != nil:
		note := noteFormA
		if sv.Role == checks.RoleLeaning {
			note = noteFormALeaning
		}
		tr.Step(q.alpha, clauseAlpha, "sum(N_cr/L) / sum(N_Ed/L)", a, "").
			Add("form A", sv.Storey.FormA.F(), "").Add("form B (not used)", sv.Storey.FormB.F(), "").
			Add("sum(N_Ed)", checks.KN(sv.Storey.SumNStar.F()), "kN").Noted(note)
	default:
		tr.Step(q.alpha, clauseAlpha, "elastic critical buckling load factor ("+sv.Method+")", a, "")
	}
}

func unstableSuffix(sv *checks.SwayValue) string {
	switch {
	case sv.Method == "frame":
		return suffixUnstableFrame
	case sv.Form == "member":
		return suffixUnstableOwn
	}
	return suffixUnstableStorey
}
