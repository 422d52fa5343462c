package checks

import "math"

// The helpers below are mechanics shared by every standard, not the rules of
// one: a rule set names the clause that uses them in its own trace.

// MomentTolerance is the magnitude (N·mm) below which a moment counts as zero:
// 1 N·mm is 1e-6 kNm, well below the precision of any analysis output.
const MomentTolerance = 1.0

// Euler returns the elastic critical load pi² E I / le² (N) of a pin-ended
// strut of effective length le (mm), with E in MPa and I in mm⁴ (Timoshenko &
// Gere, Theory of Elastic Stability, §2.1). It is NaN when an input is unknown
// or not positive.
func Euler(e, i, le float64) float64 {
	if !(e > 0) || !(i > 0) || !(le > 0) || math.IsInf(e+i+le, 0) {
		return math.NaN()
	}
	return math.Pi * math.Pi * e * i / (le * le)
}

// EndMomentRatio returns M1/M2 of the internal end moments start and end:
// M2 is the larger magnitude and M1 the smaller; the ratio is positive when
// the two have opposite signs (reverse curvature) and negative when they have
// the same sign (single curvature). ok is false when both are zero (below
// MomentTolerance).
func EndMomentRatio(start, end float64) (ratio float64, ok bool) {
	as, ae := math.Abs(start), math.Abs(end)
	m2, m1 := as, ae
	if ae > as {
		m2, m1 = ae, as
	}
	if !(m2 > MomentTolerance) {
		return math.NaN(), false
	}
	if m1 <= MomentTolerance {
		return 0, true
	}
	r := m1 / m2
	if (start < 0) == (end < 0) {
		return -r, true // same sign: single curvature
	}
	return r, true
}

// MaxMoment returns M*m of one axis: Peak when given, else the larger end
// moment magnitude (N·mm).
func MaxMoment(m *AxisMoments) float64 {
	if p := math.Abs(m.Peak); p > 0 {
		return p
	}
	return math.Max(math.Abs(m.Start), math.Abs(m.End))
}

// HasEndMoments reports whether either end moment is above MomentTolerance.
func HasEndMoments(m *AxisMoments) bool {
	return math.Abs(m.Start) > MomentTolerance || math.Abs(m.End) > MomentTolerance
}

// KN converts N to kN, the report unit of forces.
func KN(n float64) float64 { return n / 1e3 }

// KNm converts N·mm to kNm, the report unit of moments.
func KNm(nmm float64) float64 { return nmm / 1e6 }

func known(x float64) bool { return !math.IsNaN(x) }

func finitePos(x float64) bool { return x > 0 && !math.IsInf(x, 1) }

// SplitMoment returns the design moment (N·mm) of separate no-translation
// (nt) and lateral-translation (lt) moments amplified by fnt and flt, as
// fnt·Mnt + flt·Mlt taken at each place both are known: each end, and, when
// the source gives a peak of either part, the peak of that part together
// with the largest magnitude of the other along the member (a safe bound,
// since the two peaks need not be at the same place). The caller names the
// clause (AISC 360 A-8-1; EN 1993-1-1 5.2.2(5)B amplifies the sway part
// only, fnt = 1).
func SplitMoment(sp *SplitMoments, fnt, flt float64) float64 {
	m := math.Max(math.Abs(fnt*sp.NtStart+flt*sp.LtStart), math.Abs(fnt*sp.NtEnd+flt*sp.LtEnd))
	if sp.NtPeak != 0 || sp.LtPeak != 0 {
		nt := math.Max(math.Abs(sp.NtPeak), math.Max(math.Abs(sp.NtStart), math.Abs(sp.NtEnd)))
		lt := math.Max(math.Abs(sp.LtPeak), math.Max(math.Abs(sp.LtStart), math.Abs(sp.LtEnd)))
		m = math.Max(m, math.Abs(fnt)*nt+math.Abs(flt)*lt)
	}
	return m
}

// FirstOrderMoment finds M*m of one axis under one combination, the moment
// a rule set amplifies: MaxMoment, or, when only split moments are given, the
// sum of their peaks (SplitMoment). A transverse load with only end moments
// known records interior-moment-unknown (message msgUnknown) and leaves
// out.MStar unknown; otherwise out.MStar is set and the step traced as
// quantity under clause, with notePeak when the peak along the member was
// given and noteEnds otherwise. hasMoment reports whether there is a moment
// to amplify (an unknown interior moment counts).
func FirstOrderMoment(cx *AxisContext, out *AxisResult, tr *Tracer, quantity, clause, notePeak, noteEnds, msgUnknown string) (mm float64, hasMoment bool) {
	mo := cx.Moments
	mm = MaxMoment(mo)
	if mm <= MomentTolerance && mo.Split != nil {
		mm = SplitMoment(mo.Split, 1, 1)
	}
	hasMoment = mm > MomentTolerance || mo.InteriorUnknown
	if mo.InteriorUnknown {
		cx.Reason(CodeInteriorMomentUnknown, msgUnknown)
		return mm, hasMoment
	}
	out.MStar = Num(mm)
	if tr.On() {
		formula, note := "max(|M_start|, |M_end|)", noteEnds
		if mo.Peak != 0 {
			formula, note = "max |M| along the member", notePeak
		}
		tr.Step(quantity, clause, formula, KNm(mm), "kNm").
			Add("M_start", KNm(mo.Start), "kNm").Add("M_end", KNm(mo.End), "kNm").Noted(note)
	}
	return mm, hasMoment
}
