package aisc360

import (
	"math"

	"swaygate/checks"
)

// quantities are the trace labels of one axis, built once per rule set so
// that no step concatenates strings.
type quantities struct {
	pe1, pe2, mr1, ratio, cm, b1, prRatio, lambda, rm, peStory, b2, deltaM, mr string
}

func newQuantities(axis string) quantities {
	return quantities{
		pe1:     "P_e1," + axis,
		pe2:     "P_e2," + axis,
		mr1:     "M_r1," + axis,
		ratio:   "M1/M2," + axis,
		cm:      "C_m," + axis,
		b1:      "B1," + axis,
		prRatio: "alpha P_r/P_e1," + axis,
		lambda:  "lambda_c," + axis,
		rm:      "R_M," + axis,
		peStory: "P_e,story," + axis,
		b2:      "B2," + axis,
		deltaM:  "delta_m," + axis,
		mr:      "M_r," + axis,
	}
}

// Step notes.
const (
	noteAssumedE      = "the model gives no modulus"
	noteLRFD          = "LRFD"
	noteASD           = "ASD"
	notePe2           = "sway axis: P_e2 of the sidesway mode, K2 = the sway ke"
	notePe1Sway       = "sway axis: P_e1 with K1 = the braced ke (default 1.0)"
	notePe1Braced     = "braced axis: K1 = the axis's own ke"
	notePeak          = "the largest first-order moment along the member (analysis stations)"
	noteEndMoments    = "M2 the larger end moment; positive in reverse curvature"
	noteNtEndMoments  = "from the no-translation (nt) end moments; positive in reverse curvature"
	noteTransverse    = "transverse load between the supports: C_m = 1.0 (conservative)"
	noteNoEndMoments  = "no end moments: C_m = 1.0"
	noteShortLength   = "unbraced length shorter than the member and no moments inside given: C_m = 1.0"
	noteSignAmbiguous = "sign convention of the moments ambiguous: C_m = 1.0 (conservative)"
	noteFloored       = "below 1: B1 = 1"
	noteNotInComp     = "not in compression: B1 = 1"
	noteMemberPDelta  = "second-order analysis declared to include member P-delta: B1 = 1"
	noteUnstable      = "≥ 1: the member buckles between its ends, B1 not defined"
	noteBracedLambda  = "braced axis: P_e1 / P_r"
	noteFormA         = "storey sidesway buckling, form A: P_e2 of the storey's sway columns, P_r of all its columns; no R_M"
	noteFormALeaning  = "storey sidesway buckling, form A; leaning axis: it takes its storey's B2"
	notePeStoryA      = "sidesway buckling: sum(P_e2) = lambda_c sum(P_r) (equal for columns of one height)"
	noteRM            = "P_mf: load on the storey's sway (moment-frame) columns"
	noteDrift         = "from the given storey shear and first-order drift"
	noteOwnNoStorey   = "column without a storey: its own P_e2 / P_r"
	noteMemberMethod  = "member method (user choice): not a method of the current specification"
	noteFrame         = "elastic buckling analysis of the frame"
	noteSecondOrder   = "actions from a second-order analysis: the P-Delta effect is included, B2 = 1"
	noteNoCompression = "no compression in the storey: B2 = 1"
	noteB2Limit       = "above 1.5: a second-order analysis is required (" + clauseLimit + "); B2 given for information"
	noteBraced        = "braced axis: delta_m = B1"
	noteSwayMax       = "sway or leaning axis: delta_m = max(B1, B2)"
	noteSplit         = "B1 M_nt + B2 M_lt from the separate no-translation and lateral-translation moments"
	noteTotal         = "no separate M_nt and M_lt: the total moment is amplified by max(B1, B2)"
	noteNoMoment      = "no moment about this axis: nothing to amplify"
)

// Reason messages.
const (
	msgNotInCompression = "P_r ≤ 0: B1 = 1, the member is not in compression (" + clauseB1 + ")"
	msgUnstableMember   = "alpha P_r ≥ P_e1: the member buckles between its ends; B1 is not defined (" + clauseB1 + ")"
	msgNoMomentBraced   = "no moment about this axis: nothing to amplify (member strength is not part of the stability scope)"
	msgNoMomentSway     = "no moment about this axis: nothing to amplify; the storey's B2 limit still applies"
	msgInteriorUnk      = "a transverse load acts between the supports but only end moments are known: M_r cannot be found"
	msgTotalMoment      = "no separate no-translation and lateral-translation moments: the total moment is amplified by " +
		"max(B1, B2) in place of B1 M_nt + B2 M_lt (" + clauseMr + "); this can be unconservative where the two parts have opposite signs"
	suffixB2Limit = " > 1.5: the ratio of second- to first-order drift exceeds the limit of the effective length and " +
		"first-order analysis methods (" + clauseLimit + "); a second-order analysis is required"
	suffixUnstableStorey = " ≥ 1: the storey buckles in sway under the design load; B2 is not defined (" + clauseB2 + ")"
	suffixUnstableOwn    = " ≥ 1: the member buckles in sway under the design load (alpha P_r ≥ P_e2)"
	suffixUnstableFrame  = " ≥ 1: the frame buckles under the design load"
)

// endRatio returns M1/M2 for C_m and the note that explains it (A-8-4).
func endRatio(s *checks.AxisSetup, mo *checks.AxisMoments, ambiguous bool) (float64, string) {
	switch {
	case ambiguous || mo.CurvatureUnknown:
		return -1, noteSignAmbiguous
	case s.Transverse || mo.Transverse || mo.InteriorUnknown:
		return -1, noteTransverse
	case s.Length < s.MemberLength*(1-1e-9):
		return -1, noteShortLength
	}
	a, b, note := mo.Start, mo.End, noteEndMoments
	if sp := mo.Split; sp != nil {
		a, b, note = sp.NtStart, sp.NtEnd, noteNtEndMoments
	}
	ratio, ok := checks.EndMomentRatio(a, b)
	if !ok {
		return -1, noteNoEndMoments
	}
	return ratio, note
}

// Amplify implements checks.RuleSet (App. 8, A-8-1 to A-8-8).
func (r *Rules) Amplify(cx *checks.AxisContext, out *checks.AxisResult, tr *checks.Tracer) {
	s, mo := cx.Setup, cx.Moments
	q := &r.q[cx.Axis]
	opt := cx.Options()
	alpha, _ := Alpha(opt.AISCMethod)
	pr := cx.NStar
	secondOrder := cx.Actions.Theory == checks.SecondOrder
	role := cx.Sway.Role
	on := tr.On()

	// M_r1, the largest first-order moment.
	mm, hasMoment := checks.FirstOrderMoment(cx, out, tr, q.mr1, clauseMr, notePeak, "", msgInteriorUnk)

	// M1/M2 and C_m.
	ratio, why := endRatio(s, mo, cx.SignAmbiguous)
	cm := Cm(ratio)
	out.BetaM, out.Cm = checks.Num(ratio), checks.Num(cm)
	if on {
		st := tr.Step(q.ratio, clauseCm, "M1 / M2", ratio, "")
		switch why {
		case noteEndMoments:
			st.Add("M_start", checks.KNm(mo.Start), "kNm").Add("M_end", checks.KNm(mo.End), "kNm")
		case noteNtEndMoments:
			st.Add("M_nt,start", checks.KNm(mo.Split.NtStart), "kNm").Add("M_nt,end", checks.KNm(mo.Split.NtEnd), "kNm")
		}
		st.Noted(why)
		tr.Step(q.cm, clauseCm, "0.6 - 0.4 M1/M2", cm, "").Add("M1/M2", ratio, "")
	}

	// B1 (P-δ).
	b1 := math.NaN()
	switch {
	case !(pr > 0):
		b1 = 1
		cx.Reason(checks.CodeNotInCompression, msgNotInCompression)
		if on {
			tr.Step(q.b1, clauseB1, "1", 1, "").Add("P_r", checks.KN(pr), "kN").Noted(noteNotInComp)
		}
	case math.IsNaN(s.Nomb):
		// Unknown: the missing input has its own reason.
	case alpha*pr >= s.Nomb:
		cx.Reason(checks.CodeUnstable, msgUnstableMember)
		if on {
			tr.Step(q.prRatio, clauseB1, "alpha P_r / P_e1", alpha*pr/s.Nomb, "").
				Add("alpha", alpha, "").Add("P_r", checks.KN(pr), "kN").Add("P_e1", checks.KN(s.Nomb), "kN").Noted(noteUnstable)
		}
	case secondOrder && opt.MemberPDeltaModelled:
		b1 = 1
		if on {
			tr.Step(q.b1, clauseB1, "1", 1, "").Noted(noteMemberPDelta)
		}
	default:
		raw := B1(cm, alpha, pr, s.Nomb)
		b1 = math.Max(1, raw)
		if on {
			note := ""
			if raw < 1 {
				note = noteFloored
			}
			tr.Step(q.b1, clauseB1, "max(1, C_m / (1 - alpha P_r/P_e1))", b1, "").
				Add("C_m", cm, "").Add("alpha", alpha, "").Add("P_r", checks.KN(pr), "kN").
				Add("P_e1", checks.KN(s.Nomb), "kN").Add("C_m/(1 - alpha P_r/P_e1)", raw, "").Noted(note)
		}
	}
	out.DeltaB = checks.Num(b1)

	// lambda_c, B2 (P-Δ), delta_m.
	b2, deltaM := math.NaN(), math.NaN()
	switch {
	case role == checks.RoleBraced:
		if pr > 0 && !math.IsNaN(s.Nomb) {
			l := s.Nomb / pr
			out.LambdaC = checks.Num(l)
			if on {
				tr.Step(q.lambda, clausePe1, "P_e1 / P_r", l, "").
					Add("P_e1", checks.KN(s.Nomb), "kN").Add("P_r", checks.KN(pr), "kN").Noted(noteBracedLambda)
			}
		}
		deltaM = b1
		if on && !math.IsNaN(deltaM) {
			tr.Step(q.deltaM, clauseMr, "B1", deltaM, "").Noted(noteBraced)
		}
	case role.Swaying():
		l := cx.Sway.Lambda
		out.LambdaC = checks.Num(l)
		var pStory, peStory float64
		if on && !math.IsNaN(l) && !math.IsInf(l, 0) {
			pStory, peStory = r.traceStorey(cx, l, tr)
		}
		switch {
		case l <= alpha:
			cx.Reason(checks.CodeUnstable, numMsg("alpha P_story / P_e,story = ", alpha/l, unstableSuffix(&cx.Sway)))
		case secondOrder:
			b2 = 1
			if on {
				tr.Step(q.b2, clauseB2, "1", 1, "").Noted(noteSecondOrder)
			}
		case math.IsNaN(l):
			// Unknown: the provider's reason says why.
		case math.IsInf(l, 1):
			b2 = 1
			if on {
				tr.Step(q.b2, clauseB2, "1", 1, "").Noted(noteNoCompression)
			}
		default:
			b2 = B2(alpha, l)
			note := ""
			if ExceedsLimit(b2) {
				note = noteB2Limit
				cx.Reason(checks.CodeSecondOrderRequired, numMsg("B2 = ", b2, suffixB2Limit))
			}
			if on {
				st := tr.Step(q.b2, clauseB2, "1 / (1 - alpha P_story / P_e,story)", b2, "").Add("alpha", alpha, "")
				if peStory > 0 {
					st.Add("P_story", checks.KN(pStory), "kN").Add("P_e,story", checks.KN(peStory), "kN")
				} else {
					st.Add("P_e,story/P_story", l, "")
				}
				st.Noted(note)
			}
		}
		if !math.IsNaN(b1) && !math.IsNaN(b2) {
			deltaM = math.Max(b1, b2)
		}
	}
	out.DeltaS = checks.Num(b2)

	if !hasMoment {
		if role.Swaying() {
			cx.Reason(checks.CodeNoMoment, msgNoMomentSway)
		} else {
			cx.Reason(checks.CodeNoMoment, msgNoMomentBraced)
		}
	}

	// M_r (A-8-1).
	if mo.InteriorUnknown || math.IsNaN(deltaM) {
		out.DeltaM = checks.Num(deltaM)
		return
	}
	amp, note := deltaM*mm, ""
	switch {
	case !hasMoment:
		note = noteNoMoment
	case role.Swaying() && mo.Split != nil:
		amp, note = checks.SplitMoment(mo.Split, b1, b2), noteSplit
		deltaM = amp / mm
	case role.Swaying():
		note = noteSwayMax
		if deltaM > 1 {
			note = noteTotal
			cx.Reason(checks.CodeTotalMomentAmplified, msgTotalMoment)
		}
	}
	out.DeltaM, out.MAmp = checks.Num(deltaM), checks.Num(amp)
	if !on {
		return
	}
	if note == noteSplit {
		sp := mo.Split
		tr.Step(q.mr, clauseMr, "max |B1 M_nt + B2 M_lt|", checks.KNm(amp), "kNm").
			Add("B1", b1, "").Add("B2", b2, "").
			Add("M_nt,start", checks.KNm(sp.NtStart), "kNm").Add("M_nt,end", checks.KNm(sp.NtEnd), "kNm").
			Add("M_lt,start", checks.KNm(sp.LtStart), "kNm").Add("M_lt,end", checks.KNm(sp.LtEnd), "kNm").
			Add("M_nt,peak", checks.KNm(sp.NtPeak), "kNm").Add("M_lt,peak", checks.KNm(sp.LtPeak), "kNm").Noted(note)
		tr.Step(q.deltaM, clauseMr, "M_r / M_r1", deltaM, "").
			Add("M_r", checks.KNm(amp), "kNm").Add("M_r1", checks.KNm(mm), "kNm").Noted("effective amplification")
		return
	}
	if role.Swaying() {
		tr.Step(q.deltaM, clauseMr, "max(B1, B2)", deltaM, "").Add("B1", b1, "").Add("B2", b2, "").Noted(noteSwayMax)
	}
	tr.Step(q.mr, clauseMr, "delta_m M_r1", checks.KNm(amp), "kNm").
		Add("delta_m", deltaM, "").Add("M_r1", checks.KNm(mm), "kNm").Noted(note)
}

// traceStorey records lambda_c of a sway or leaning axis with the storey
// quantities behind it, and returns P_story and P_e,story (N) when known
// (zero otherwise).
func (r *Rules) traceStorey(cx *checks.AxisContext, l float64, tr *checks.Tracer) (pStory, peStory float64) {
	q := &r.q[cx.Axis]
	sv := &cx.Sway
	switch {
	case sv.Method == "frame":
		tr.Step(q.lambda, clausePeStory, "P_e,story / P_story (elastic buckling analysis of the frame)", l, "").Noted(noteFrame)
		return 0, 0
	case sv.Form == "member":
		note, clause := noteOwnNoStorey, clausePeStory
		if sv.Method == "member" {
			note, clause = noteMemberMethod, ""
		}
		tr.Step(q.lambda, clause, "P_e2 / P_r", l, "").
			Add("P_e2", checks.KN(cx.Setup.Nom), "kN").Add("P_r", checks.KN(cx.NStar), "kN").Noted(note)
		return cx.NStar, cx.Setup.Nom
	case sv.Form == "drift" && sv.Storey != nil:
		st := sv.Storey
		pStory = st.Vertical.F()
		pmf := st.SumNStarSway.F()
		rm := RM(pmf, pStory)
		tr.Step(q.rm, clauseRM, "1 - 0.15 P_mf / P_story", rm, "").
			Add("P_mf", checks.KN(pmf), "kN").Add("P_story", checks.KN(pStory), "kN").Noted(noteRM)
		peStory = PeStory(rm, st.Shear.F(), st.Height.F(), st.Drift.F())
		tr.Step(q.peStory, clausePeStory, "R_M H L / Delta_H", checks.KN(peStory), "kN").
			Add("R_M", rm, "").Add("H", checks.KN(st.Shear.F()), "kN").Add("L", st.Height.F(), "mm").
			Add("Delta_H", st.Drift.F(), "mm").Noted(noteDrift)
		tr.Step(q.lambda, clausePeStory, "P_e,story / P_story", l, "").
			Add("P_e,story", checks.KN(peStory), "kN").Add("P_story", checks.KN(pStory), "kN")
		return pStory, peStory
	case sv.Storey != nil:
		st := sv.Storey
		note := noteFormA
		if sv.Role == checks.RoleLeaning {
			note = noteFormALeaning
		}
		pStory = st.SumNStar.F()
		tr.Step(q.lambda, clausePeStory, "sum(P_e2/L) / sum(P_r/L)", l, "").
			Add("form A", st.FormA.F(), "").Add("form B (not used)", st.FormB.F(), "").
			Add("P_story", checks.KN(pStory), "kN").Noted(note)
		peStory = l * pStory
		tr.Step(q.peStory, clausePeStory, "lambda_c P_story", checks.KN(peStory), "kN").
			Add("lambda_c", l, "").Add("P_story", checks.KN(pStory), "kN").Noted(notePeStoryA)
		return pStory, peStory
	}
	tr.Step(q.lambda, clausePeStory, "P_e,story / P_story ("+sv.Method+")", l, "")
	return 0, 0
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
