package as4100

import (
	"math"

	"swaygate/checks"
)

// quantities are the trace labels of one axis, built once per rule set so
// that no step concatenates strings.
type quantities struct {
	nom, nomb, mStar, betaM, cm, deltaB, nRatio, lambda, deltaS, deltaM, mAmp string
}

func newQuantities(axis string) quantities {
	return quantities{
		nom:    "N_om," + axis,
		nomb:   "N_omb," + axis,
		mStar:  "M*_m," + axis,
		betaM:  "beta_m," + axis,
		cm:     "c_m," + axis,
		deltaB: "delta_b," + axis,
		nRatio: "N*/N_omb," + axis,
		lambda: "lambda_c," + axis,
		deltaS: "delta_s," + axis,
		deltaM: "delta_m," + axis,
		mAmp:   "M*," + axis,
	}
}

// Step notes; a variant's note is appended to each once, in NewVariant.
const (
	noteNone = iota
	noteAssumedE
	noteSwayKe
	noteBracedOwnKe
	noteBracedKe
	noteEndMoments
	noteTransverse
	noteNoEndMoments
	noteShortLength
	noteFloored
	noteNotInCompression
	noteMemberPDelta
	noteUnstableMember
	noteBracedLambda
	noteFormA
	noteFormB
	noteDrift
	noteOwnNoStorey
	noteMemberMethod
	noteFrame
	noteSecondOrder
	noteNoStoreyCompression
	noteBraced
	noteSwayMax
	noteNoMoment
	noteInteriorPeak
	noteSignAmbiguous
	nNotes
)

func noteText() [nNotes]string {
	return [nNotes]string{
		noteAssumedE:            "the model gives no modulus",
		noteSwayKe:              "sway axis: N_oms with the sway k_e",
		noteBracedOwnKe:         "braced axis: the axis's own k_e, so N_omb = N_om",
		noteBracedKe:            "sway axis: N_omb with the braced k_e (default 1.0)",
		noteEndMoments:          "M_2 the larger end moment; positive in reverse curvature",
		noteTransverse:          "transverse load between the ends: beta_m = -1",
		noteNoEndMoments:        "no end moments: beta_m = -1",
		noteShortLength:         "buckling length shorter than the member and no moments inside given: beta_m = -1",
		noteFloored:             "below 1: floored to 1.0",
		noteNotInCompression:    "N* ≤ 0: no member buckling check, delta_b = 1",
		noteMemberPDelta:        "second-order analysis declared to include member P-delta: delta_b = 1",
		noteUnstableMember:      "≥ 1: the member buckles between its ends, no amplification",
		noteBracedLambda:        "braced axis",
		noteFormA:               "storey form A, the lower of forms A and B",
		noteFormB:               "storey form B, the lower of forms A and B",
		noteDrift:               "storey-drift form from the given storey shear and drift",
		noteOwnNoStorey:         "column without a storey: its own N_oms/N*",
		noteMemberMethod:        "member method (user choice): not a method of the standard for sway frames",
		noteFrame:               "elastic buckling analysis of the frame",
		noteSecondOrder:         "actions from a second-order analysis: delta_s = 1",
		noteNoStoreyCompression: "no compression in the storey: delta_s = 1",
		noteBraced:              "braced axis: delta_m = delta_b",
		noteSwayMax:             "sway or leaning axis: delta_m = max(delta_b, delta_s)",
		noteNoMoment:            "no moment about this axis: nothing to amplify",
		noteInteriorPeak:        "M*_m is the largest moment along the member (analysis stations)",
		noteSignAmbiguous:       "sign convention of the moments ambiguous: beta_m = -1 (conservative)",
	}
}

// Reason messages.
const (
	msgNotInCompression = "N* ≤ 0: no member buckling check, delta_b = 1"
	msgNoMomentBraced   = "no moment about this axis: nothing to amplify (member compression capacity is not part of the stability scope)"
	msgNoMomentFull     = "no moment about this axis: nothing to amplify (the member's compression capacity is among the capacity checks)"
	msgNoMomentSway     = "no moment about this axis: the 1.4 limit applies to the storey's delta_s only"
	msgInteriorUnknown  = "a transverse load acts between the ends but only end moments are known: M*_m cannot be found"
)

// betaM returns beta_m and the note that explains it (4.4.2.2).
func betaM(s *checks.AxisSetup, mo *checks.AxisMoments, ambiguous bool) (float64, int) {
	switch {
	case ambiguous:
		return -1, noteSignAmbiguous
	case s.Transverse || mo.Transverse || mo.InteriorUnknown:
		return -1, noteTransverse
	case s.Length < s.MemberLength*(1-1e-9):
		return -1, noteShortLength
	}
	b, ok := checks.EndMomentRatio(mo.Start, mo.End)
	if !ok {
		return -1, noteNoEndMoments
	}
	return b, noteEndMoments
}

// Amplify implements checks.RuleSet (4.4.2.2, 4.4.2.3, 4.4.1.2).
func (r *Rules) Amplify(cx *checks.AxisContext, out *checks.AxisResult, tr *checks.Tracer) {
	s, mo := cx.Setup, cx.Moments
	q := &r.q[cx.Axis]
	c := &r.v.Clauses
	opt := cx.Options()
	nstar := cx.NStar
	secondOrder := cx.Actions.Theory == checks.SecondOrder
	role := cx.Sway.Role
	on := tr.On()

	// M*m.
	mm, hasMoment := checks.FirstOrderMoment(cx, out, tr, q.mStar, c.MStar, r.notes[noteInteriorPeak], r.notes[noteNone], msgInteriorUnknown)

	// beta_m and c_m.
	beta, why := betaM(s, mo, cx.SignAmbiguous)
	cm := Cm(beta)
	out.BetaM, out.Cm = checks.Num(beta), checks.Num(cm)
	if on {
		st := tr.Step(q.betaM, c.BetaM, "M_1 / M_2", beta, "")
		if why == noteEndMoments {
			st.Add("M_start", checks.KNm(mo.Start), "kNm").Add("M_end", checks.KNm(mo.End), "kNm")
		}
		st.Noted(r.notes[why])
		tr.Step(q.cm, c.BetaM, "min(1, 0.6 - 0.4 beta_m)", cm, "").Add("beta_m", beta, "").Noted(r.notes[noteNone])
	}

	// delta_b.
	deltaB := math.NaN()
	switch {
	case !(nstar > 0):
		deltaB = 1
		cx.Reason(checks.CodeNotInCompression, msgNotInCompression)
		if on {
			tr.Step(q.deltaB, c.BetaM, "1", 1, "").Add("N*", checks.KN(nstar), "kN").Noted(r.notes[noteNotInCompression])
		}
	case math.IsNaN(s.Nomb):
		// Unknown: the missing input has its own reason.
	case nstar >= s.Nomb:
		cx.Reason(checks.CodeUnstable, r.msgUnstableMember)
		if on {
			tr.Step(q.nRatio, c.Nom, "N* / N_omb", nstar/s.Nomb, "").
				Add("N*", checks.KN(nstar), "kN").Add("N_omb", checks.KN(s.Nomb), "kN").Noted(r.notes[noteUnstableMember])
		}
	case secondOrder && opt.MemberPDeltaModelled:
		deltaB = 1
		if on {
			tr.Step(q.deltaB, c.BetaM, "1", 1, "").Noted(r.notes[noteMemberPDelta])
		}
	default:
		raw := BracedFactor(cm, nstar, s.Nomb)
		deltaB = math.Max(1, raw)
		if on {
			note := noteNone
			if raw < 1 {
				note = noteFloored
			}
			tr.Step(q.deltaB, c.BetaM, "max(1, c_m / (1 - N*/N_omb))", deltaB, "").
				Add("c_m", cm, "").Add("N*", checks.KN(nstar), "kN").Add("N_omb", checks.KN(s.Nomb), "kN").
				Add("c_m/(1 - N*/N_omb)", raw, "").Noted(r.notes[note])
		}
	}
	out.DeltaB = checks.Num(deltaB)

	// lambda_c, delta_s, delta_m.
	deltaS, deltaM := math.NaN(), math.NaN()
	switch {
	case role == checks.RoleBraced:
		if nstar > 0 && !math.IsNaN(s.Nomb) {
			l := s.Nomb / nstar
			out.LambdaC = checks.Num(l)
			if on {
				tr.Step(q.lambda, c.BracedLambda, "N_omb / N*", l, "").
					Add("N_omb", checks.KN(s.Nomb), "kN").Add("N*", checks.KN(nstar), "kN").Noted(r.notes[noteBracedLambda])
			}
		}
		deltaM = deltaB
		if on && !math.IsNaN(deltaM) {
			tr.Step(q.deltaM, c.BetaM, "delta_b", deltaM, "").Noted(r.notes[noteBraced])
		}
	case role.Swaying():
		l := cx.Sway.Lambda
		out.LambdaC = checks.Num(l)
		if on && !math.IsNaN(l) && !math.IsInf(l, 0) {
			r.traceLambda(cx, l, tr)
		}
		switch {
		case l <= 1:
			cx.Reason(checks.CodeUnstable, numMsg("lambda_c = ", l, r.unstableSuffix(cx)))
		case secondOrder:
			deltaS = 1
			if on {
				tr.Step(q.deltaS, c.DeltaS, "1", 1, "").Noted(r.notes[noteSecondOrder])
			}
		case math.IsNaN(l):
			// Unknown: the provider's reason says why.
		case r.v.Sway != nil:
			deltaS = r.v.Sway(cx, l, tr)
		default:
			deltaS = SwayFactor(l)
			if on {
				if math.IsInf(l, 1) {
					tr.Step(q.deltaS, c.DeltaS, "1", 1, "").Noted(r.notes[noteNoStoreyCompression])
				} else {
					tr.Step(q.deltaS, c.DeltaS, "1 / (1 - 1/lambda_c)", deltaS, "").Add("lambda_c", l, "").Noted(r.notes[noteNone])
				}
			}
		}
		if !math.IsNaN(deltaB) && !math.IsNaN(deltaS) {
			deltaM = math.Max(deltaB, deltaS)
			if on {
				tr.Step(q.deltaM, c.DeltaS, "max(delta_b, delta_s)", deltaM, "").
					Add("delta_b", deltaB, "").Add("delta_s", deltaS, "").Noted(r.notes[noteSwayMax])
			}
		}
	}
	out.DeltaS, out.DeltaM = checks.Num(deltaS), checks.Num(deltaM)

	// The limit of 4.4.1.2.
	switch {
	case hasMoment:
		if Exceeds(deltaM) {
			cx.Reason(checks.CodeSecondOrderRequired, numMsg("delta_m = ", deltaM, r.msgLimitSuffix))
		}
	case role.Swaying():
		cx.Reason(checks.CodeNoMoment, msgNoMomentSway)
		if Exceeds(deltaS) {
			cx.Reason(checks.CodeSecondOrderRequired, numMsg("delta_s = ", deltaS, r.msgSwayLimit))
		}
	case opt.Scope == "full":
		cx.Reason(checks.CodeNoMoment, msgNoMomentFull)
	default:
		cx.Reason(checks.CodeNoMoment, msgNoMomentBraced)
	}

	// The design moment.
	if !mo.InteriorUnknown && !math.IsNaN(deltaM) {
		out.MAmp = checks.Num(deltaM * mm)
		if on {
			st := tr.Step(q.mAmp, c.BetaM, "delta_m M*_m", checks.KNm(deltaM*mm), "kNm").
				Add("delta_m", deltaM, "").Add("M*_m", checks.KNm(mm), "kNm")
			if role.Swaying() {
				st.Clause = c.DeltaS
			}
			if !hasMoment {
				st.Noted(r.notes[noteNoMoment])
			} else {
				st.Noted(r.notes[noteNone])
			}
		}
	}
}

// traceLambda records lambda_c of a sway or leaning axis with its source.
func (r *Rules) traceLambda(cx *checks.AxisContext, l float64, tr *checks.Tracer) {
	q := &r.q[cx.Axis]
	c := &r.v.Clauses
	sv := &cx.Sway
	switch {
	case sv.Method == "frame":
		tr.Step(q.lambda, c.FrameLambda, "elastic buckling load factor of the frame", l, "").Noted(r.notes[noteFrame])
	case sv.Form == "member":
		note := noteOwnNoStorey
		clause := c.StoreyLambda
		if sv.Method == "member" {
			note, clause = noteMemberMethod, ""
		}
		tr.Step(q.lambda, clause, "N_oms / N*", l, "").
			Add("N_oms", checks.KN(cx.Setup.Nom), "kN").Add("N*", checks.KN(cx.NStar), "kN").Noted(r.notes[note])
	case sv.Form == "drift":
		tr.Step(q.lambda, c.DriftLambda, "h_s sum(V*) / (Delta_s sum(N*))", l, "").Noted(r.notes[noteDrift])
	case sv.Storey != nil:
		note := noteFormA
		if sv.Form == "B" {
			note = noteFormB
		}
		tr.Step(q.lambda, c.StoreyLambda, "min(sum(N_oms/L) / sum(N*/L), sum(N_oms N*/L) / sum(N*^2/L))", l, "").
			Add("form A", sv.Storey.FormA.F(), "").Add("form B", sv.Storey.FormB.F(), "").
			Add("sum(N*)", checks.KN(sv.Storey.SumNStar.F()), "kN").Noted(r.notes[note])
	default:
		tr.Step(q.lambda, "", "elastic buckling load factor ("+sv.Method+")", l, "").Noted(r.notes[noteNone])
	}
}

func (r *Rules) unstableSuffix(cx *checks.AxisContext) string {
	c := &r.v.Clauses
	switch {
	case cx.Sway.Method == "frame":
		return " ≤ 1: the frame buckles under the design load (" + c.FrameLambda + ")"
	case cx.Sway.Form == "member":
		return " ≤ 1: the member buckles in sway under the design load (N_oms/N*)"
	}
	return " ≤ 1: the storey buckles in sway under the design load (" + c.StoreyLambda + ")"
}
