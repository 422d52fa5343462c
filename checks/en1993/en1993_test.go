package en1993_test

import (
	"math"
	"testing"

	"swaygate/checks"
	"swaygate/checks/en1993"
)

// TestFunctions checks the formulas on their own.
func TestFunctions(t *testing.T) {
	cases := []struct {
		name        string
		drift       float64 // mm
		alpha       float64
		factor      float64 // 1/(1 − 1/alpha_cr)
		first, need bool
	}{
		// source: standards-notes §6.4 [D] (H_Ed = 50 kN, V_Ed = 2000 kN, h = 4000 mm), EN 1993-1-1 5.2.1(4)B, 5.2.1(3)
		{"delta 8", 8, 12.5, 1.0869565, true, false},
		// source: standards-notes §6.4 [D], EN 1993-1-1 5.2.2(5)B
		{"delta 15", 15, 6.6667, 1.1765, false, false},
		// source: standards-notes §6.4 [D], EN 1993-1-1 5.2.2(5)B (still ≥ 3)
		{"delta 30", 30, 3.3333, 1.4286, false, false},
		// source: EN 1993-1-1 5.2.2(5)B via standards-notes §3 [M]: below 3 a second-order analysis is required
		{"delta 40", 40, 2.5, 1.6667, false, true},
	}
	for _, tc := range cases {
		a := en1993.DriftAlpha(50e3, 2000e3, 4000, tc.drift)
		if math.Abs(a-tc.alpha) > 1e-4 {
			t.Errorf("%s: alpha_cr = %v, want %v", tc.name, a, tc.alpha)
		}
		if f := en1993.SwayFactor(a); math.Abs(f-tc.factor) > 1e-4 {
			t.Errorf("%s: 1/(1 - 1/alpha_cr) = %v, want %v", tc.name, f, tc.factor)
		}
		if en1993.FirstOrder(a) != tc.first || en1993.SecondOrderRequired(a) != tc.need {
			t.Errorf("%s: first-order %v, second-order required %v", tc.name, en1993.FirstOrder(a), en1993.SecondOrderRequired(a))
		}
	}
	// source: EN 1993-1-1 5.2.1(3), 5.2.2(5)B (standards-notes §3): the thresholds themselves are on the permitted side
	if !en1993.FirstOrder(10) || en1993.FirstOrder(9.999) || en1993.SecondOrderRequired(3) || !en1993.SecondOrderRequired(2.999) {
		t.Error("thresholds 3 and 10 misplaced")
	}
	if !math.IsInf(en1993.DriftAlpha(50e3, 2000e3, 4000, 0), 1) {
		t.Error("no drift: alpha_cr should be +Inf")
	}
}

// TestStoreyDriftTable runs the alpha_cr table of standards-notes §6.4
// through the engine: a storey of two sway columns carrying V_Ed = 2000 kN,
// with storey rows H_Ed = 50 kN, h = 4000 mm and δ_H,Ed = 8, 15, 30 mm.
func TestStoreyDriftTable(t *testing.T) {
	cases := []struct {
		drift, alpha, deltaS float64
	}{
		{8, 12.5, 1},           // source: standards-notes §6.4 [D]: first-order allowed (EN 1993-1-1 5.2.1(3))
		{15, 6.6667, 1.1765},   // source: standards-notes §6.4 [D]: amplify (5.2.2(5)B)
		{30, 3.3333, 1.428571}, // source: standards-notes §6.4 [D]: amplify, still ≥ 3
	}
	for _, tc := range cases {
		a := swayColumn("A", "L1", 10_000e3)
		b := swayColumn("B", "L1", 10_000e3)
		a.Actions = []checks.Actions{act("ULS", 1000, -50, 100)}
		b.Actions = []checks.Actions{act("ULS", 1000, -50, 100)}
		m := model(a, b)
		m.StoreyData = []checks.StoreyData{{StoreyKey: "L1", Direction: checks.DirY, Combination: "ULS",
			ShearN: 50e3, DriftMM: tc.drift, HeightMM: 4000}}
		rep := run(t, m, stabilityOptions())
		for i := range rep.Elements {
			el := &rep.Elements[i]
			ax := &el.Combinations[0].Axes[checks.Major]
			near(t, "alpha_cr", ax.LambdaC, tc.alpha, 1e-4)
			near(t, "delta_s", ax.DeltaS, tc.deltaS, 1e-4)
			near(t, "delta_m", ax.DeltaM, tc.deltaS, 1e-4)
			near(t, "M_Ed,amp", ax.MAmp, tc.deltaS*100e6, 1e-4*100e6)
			null(t, "delta_b", ax.DeltaB)
			wantVerdict(t, el, checks.Pass)
		}
		st := &rep.Storeys[0]
		if st.Form != "drift" {
			t.Errorf("storey form %q, want drift", st.Form)
		}
		near(t, "storey drift form", st.FormDrift, tc.alpha, 1e-4)
		near(t, "storey form A (reported, not used)", st.FormA, 10, 1e-9)
		s := step(&rep.Elements[0], "alpha_cr,major")
		if s == nil || s.Clause != "EN 1993-1-1 5.2.1(4)B" || s.NInputs != 4 || math.Abs(s.Inputs[0].Value-50) > 1e-9 ||
			math.Abs(s.Inputs[1].Value-2000) > 1e-9 {
			t.Errorf("alpha_cr step %+v", s)
		}
		if tc.deltaS > 1 {
			wantReason(t, &rep.Elements[0], checks.CodeTotalMomentAmplified, "major")
		} else {
			noReason(t, &rep.Elements[0], checks.CodeTotalMomentAmplified)
		}
	}
}

// swayAlone is a sway column without a storey: alpha_cr is its own
// N_cr/N_Ed, so N_Ed sets alpha_cr exactly.
func swayAlone(alpha float64) checks.Member {
	const ncr = 3000e3
	m := swayColumn("S", "", ncr)
	m.Actions = []checks.Actions{act("ULS", ncr/alpha/1e3, 30, 60)}
	return m
}

// TestAlphaBoundaries: the thresholds 10, 3 and 1 (5.2.1(3), 5.2.2(5)B).
func TestAlphaBoundaries(t *testing.T) {
	cases := []struct {
		alpha   float64
		deltaS  float64 // NaN = null
		verdict checks.Verdict
		code    string
	}{
		{10, 1, checks.Pass, ""},                  // source: EN 1993-1-1 5.2.1(3) (standards-notes §3 [L]): alpha_cr ≥ 10, first order
		{9.99, 1 / (1 - 1/9.99), checks.Pass, ""}, // source: EN 1993-1-1 5.2.2(5)B (standards-notes §3 [M])
		{3, 1.5, checks.Pass, ""},                 // source: EN 1993-1-1 5.2.2(5)B: amplification provided alpha_cr ≥ 3.0
		{2.99, 1 / (1 - 1/2.99), checks.NeedsAnalysis, checks.CodeSecondOrderRequired}, // source: EN 1993-1-1 5.2.2(5)B: below 3 a more accurate analysis
		{1, math.NaN(), checks.Fail, checks.CodeUnstable},                              // source: EN 1993-1-1 5.2.1(3): F_Ed reaches F_cr
		{0.8, math.NaN(), checks.Fail, checks.CodeUnstable},                            // source: EN 1993-1-1 5.2.1(3)
	}
	for _, tc := range cases {
		rep := run(t, model(swayAlone(tc.alpha)), stabilityOptions())
		el := &rep.Elements[0]
		ax := &el.Combinations[0].Axes[checks.Major]
		near(t, "alpha_cr", ax.LambdaC, tc.alpha, 1e-9*tc.alpha)
		if math.IsNaN(tc.deltaS) {
			null(t, "delta_s", ax.DeltaS)
		} else {
			near(t, "delta_s", ax.DeltaS, tc.deltaS, 1e-9)
			near(t, "M_Ed,amp", ax.MAmp, tc.deltaS*60e6, 1e-3)
		}
		wantVerdict(t, el, tc.verdict)
		if tc.code != "" {
			wantReason(t, el, tc.code, "major")
		} else {
			noReason(t, el, checks.CodeSecondOrderRequired)
		}
	}
}

// TestBracedAxis: on a braced axis lambda_c = N_cr/N_Ed, delta_s and
// delta_b are null, delta_m = 1 and the trace refers the member
// imperfections to 6.3 (design §6 field table).
func TestBracedAxis(t *testing.T) {
	m := column("B", iFor(4000e3, 4000), iFor(6000e3, 4000))
	m.Actions = []checks.Actions{act("ULS", 1000, 80, 80)}
	rep := run(t, model(m), stabilityOptions())
	el := &rep.Elements[0]
	ax := &el.Combinations[0].Axes[checks.Major]
	near(t, "lambda_c = N_cr/N_Ed", ax.LambdaC, 4, 1e-9) // source: design §6 table (EN 1993 braced: N_cr/N_Ed), 4000/1000
	null(t, "delta_s", ax.DeltaS)
	null(t, "delta_b", ax.DeltaB)
	null(t, "beta_m", ax.BetaM)
	null(t, "c_m", ax.Cm)
	near(t, "delta_m", ax.DeltaM, 1, 0)
	near(t, "M_Ed,amp", ax.MAmp, 80e6, 1e-6)
	wantVerdict(t, el, checks.Pass)
	s := step(el, "delta_m,major")
	if s == nil || s.Clause != "EN 1993-1-1 6.3" || s.Note == "" {
		t.Errorf("braced delta_m step %+v", s)
	}
	if !contains(rep.Assumptions, "member buckling check of EN 1993-1-1 6.3") {
		t.Errorf("assumptions %q", rep.Assumptions)
	}

	// Tension: no lambda_c, delta_m = 1.
	m.Actions = []checks.Actions{act("ULS", -200, 80, 80)}
	rep = run(t, model(m), stabilityOptions())
	ax = &rep.Elements[0].Combinations[0].Axes[checks.Major]
	null(t, "lambda_c (tension)", ax.LambdaC)
	near(t, "delta_m (tension)", ax.DeltaM, 1, 0)
	wantReason(t, &rep.Elements[0], checks.CodeNotInCompression, "major")
	wantVerdict(t, &rep.Elements[0], checks.Pass)

	// N_Ed ≥ N_cr: the member buckles.
	m.Actions = []checks.Actions{act("ULS", 4000, 80, 80)}
	rep = run(t, model(m), stabilityOptions())
	ax = &rep.Elements[0].Combinations[0].Axes[checks.Major]
	null(t, "delta_m (unstable)", ax.DeltaM)
	wantReason(t, &rep.Elements[0], checks.CodeUnstable, "major")
	wantVerdict(t, &rep.Elements[0], checks.Fail)
}

// TestBracedModeOfSwayColumn: a sway column whose N_Ed reaches N_cr of its
// braced mode fails although the storey's alpha_cr is above 1; the storey
// takes its load but not its stiffness.
func TestBracedModeOfSwayColumn(t *testing.T) {
	a := swayColumn("A", "L1", 10_000e3)
	b := swayColumn("B", "L1", 500e3) // braced mode 2000 kN
	a.Actions = []checks.Actions{act("ULS", 500, 20, 40)}
	b.Actions = []checks.Actions{act("ULS", 2500, 20, 40)}
	rep := run(t, model(a, b), stabilityOptions())
	// source: design §5.3 (a column unstable itself adds load, no stiffness): alpha_cr = 10 000/(500 + 2500) [D]
	near(t, "alpha_cr", rep.Elements[0].Combinations[0].Axes[0].LambdaC, 10.0/3, 1e-9)
	near(t, "delta_s", rep.Elements[0].Combinations[0].Axes[0].DeltaS, 1/(1-0.3), 1e-9)
	wantVerdict(t, &rep.Elements[0], checks.Pass)
	wantReason(t, &rep.Elements[1], checks.CodeUnstable, "major")
	wantVerdict(t, &rep.Elements[1], checks.Fail)
}

// TestLeaningFormA: EN 1993 takes form A of the storey sums, with the
// leaning column's load; AS 4100 would take the lower form B here.
func TestLeaningFormA(t *testing.T) {
	c1 := swayColumn("C1", "L1", 5000e3)
	c2 := swayColumn("C2", "L1", 5000e3)
	g := column("G", iFor(6000e3, 4000), iFor(6000e3, 4000))
	g.StoreyKey, g.Storey = "L1", "L1"
	c1.Actions = []checks.Actions{act("ULS", 800, -40, 60)}
	c2.Actions = []checks.Actions{act("ULS", 800, -40, 60)}
	g.Actions = []checks.Actions{act("ULS", 1200, 0, 0)}
	rep := run(t, model(c1, c2, g), stabilityOptions())
	st := &rep.Storeys[0]
	// source: standards-notes §1.3 [D]: form A = 3.571, form B = 2.941 for N_oms 5000/5000/0 and N* 800/800/1200
	near(t, "storey alpha_cr", st.LambdaC, 3.5714, 1e-4)
	near(t, "form B (reported)", st.FormB, 2.9412, 1e-4)
	if st.Form != "A" {
		t.Errorf("form %q, want A", st.Form)
	}
	gx := &rep.Elements[2].Combinations[0].Axes[checks.Major]
	if !gx.Leaning {
		t.Error("G's major axis should be leaning")
	}
	near(t, "leaning alpha_cr", gx.LambdaC, 3.5714, 1e-4)
	near(t, "leaning delta_s", gx.DeltaS, 1/(1-1/3.5714286), 1e-6)
	for i := range rep.Elements {
		wantVerdict(t, &rep.Elements[i], checks.Pass)
	}
	wantReason(t, &rep.Elements[2], checks.CodeNoMoment, "major")
}

// TestSplitMoments: with separate no-sway and sway moments only the sway
// part is amplified (5.2.2(5)B); without them the total is, with the
// informational total-moment-amplified.
func TestSplitMoments(t *testing.T) {
	m := swayAlone(5) // delta_s = 1.25
	m.Actions[0].Moments[0] = checks.AxisMoments{Start: -20e6, End: 40e6,
		Split: &checks.SplitMoments{NtStart: 40e6, NtEnd: -20e6, LtStart: -60e6, LtEnd: 60e6}}
	rep := run(t, model(m), stabilityOptions())
	ax := &rep.Elements[0].Combinations[0].Axes[checks.Major]
	// source: EN 1993-1-1 5.2.2(5)B (sway effects amplified): max(|40 - 1.25·60|, |-20 + 1.25·60|) = 55 kNm [D]
	near(t, "M_Ed,amp (split)", ax.MAmp, 55e6, 1e-3)
	near(t, "delta_m", ax.DeltaM, 1.25, 1e-9)
	noReason(t, &rep.Elements[0], checks.CodeTotalMomentAmplified)

	m.Actions[0].Moments[0].Split = nil
	rep = run(t, model(m), stabilityOptions())
	ax = &rep.Elements[0].Combinations[0].Axes[checks.Major]
	// source: design §5.3 (total moment amplified without a split): 1.25 · 40 = 50 kNm [D], below the split 55
	near(t, "M_Ed,amp (total)", ax.MAmp, 50e6, 1e-3)
	wantReason(t, &rep.Elements[0], checks.CodeTotalMomentAmplified, "major")
	wantVerdict(t, &rep.Elements[0], checks.Pass)
}

// TestSecondOrderActions: with actions from a second-order analysis the
// sway effects are included (delta_s = 1) and alpha_cr < 3 needs nothing
// more; alpha_cr ≤ 1 still fails.
func TestSecondOrderActions(t *testing.T) {
	m := swayAlone(2)
	m.Actions[0].Theory = checks.SecondOrder
	rep := run(t, model(m), stabilityOptions())
	el := &rep.Elements[0]
	// source: EN 1993-1-1 5.2.2 (second-order analysis includes the sway effects), design §5.3
	near(t, "delta_s", el.Combinations[0].Axes[0].DeltaS, 1, 0)
	noReason(t, el, checks.CodeSecondOrderRequired)
	wantReason(t, el, checks.CodeSecondOrderResults, "")
	wantVerdict(t, el, checks.Pass)

	m = swayAlone(0.9)
	m.Actions[0].Theory = checks.SecondOrder
	rep = run(t, model(m), stabilityOptions())
	wantVerdict(t, &rep.Elements[0], checks.Fail) // source: EN 1993-1-1 5.2.1(3): alpha_cr < 1, F_Ed above F_cr
}

// TestOptions: assumptions, scope full, the member method and the default
// modulus.
func TestOptions(t *testing.T) {
	opt := stabilityOptions()
	rep := run(t, model(swayAlone(5)), opt)
	for _, want := range []string{"EN 1993-1-1 5.3.2", "form A", "EN 1993-1-1 5.2.1(4)B", "5.2.2(6)B"} {
		if !contains(rep.Assumptions, want) {
			t.Errorf("no assumption mentions %q: %q", want, rep.Assumptions)
		}
	}

	// Scope full is accepted; a section without a plate model cannot be
	// classified (EN 1993-1-1 Table 5.2), so the member needs analysis.
	opt.Scope = "full"
	rep = run(t, model(swayAlone(5)), opt)
	wantReason(t, &rep.Elements[0], checks.CodeUnsupportedProfile, "")
	wantVerdict(t, &rep.Elements[0], checks.NeedsAnalysis)
	if !contains(rep.Assumptions, "gamma_M0 = gamma_M1 = 1.0") {
		t.Errorf("no capacity assumption: %q", rep.Assumptions)
	}

	// Member method: alpha_cr of a storey column is its own N_cr/N_Ed.
	a := swayColumn("A", "L1", 6000e3)
	b := swayColumn("B", "L1", 2000e3)
	a.Actions = []checks.Actions{act("ULS", 1000, 10, 20)}
	b.Actions = []checks.Actions{act("ULS", 1000, 10, 20)}
	opt = stabilityOptions()
	opt.SwayMethod = "member"
	rep = run(t, model(a, b), opt)
	// source: design §5.3 (member method: the member's own N_cr/N_Ed), 6000/1000 and 2000/1000 [D]
	near(t, "A alpha_cr", rep.Elements[0].Combinations[0].Axes[0].LambdaC, 6, 1e-9)
	near(t, "B alpha_cr", rep.Elements[1].Combinations[0].Axes[0].LambdaC, 2, 1e-9)
	wantVerdict(t, &rep.Elements[1], checks.NeedsAnalysis)
	if !contains(rep.Assumptions, "member's own N_cr/N_Ed") {
		t.Errorf("member method assumption missing: %q", rep.Assumptions)
	}

	// No modulus in the model: 210 000 MPa (3.2.6), recorded.
	m := column("E", iFor(4000e3, 4000), iFor(4000e3, 4000))
	m.Material = checks.Material{}
	m.Actions = []checks.Actions{act("ULS", 1000, 10, 10)}
	rep = run(t, model(m), stabilityOptions())
	el := &rep.Elements[0]
	if el.E != 210_000 || el.ESource != "default" { // source: standards-notes §3, EN 1993-1-1 3.2.6
		t.Errorf("E = %v (%s)", el.E, el.ESource)
	}
	wantReason(t, el, checks.CodeAssumedModulus, "")
	near(t, "N_cr with the default E", el.Combinations[0].Axes[0].Nom, 4000e3, 1e-3)
}

// TestStoreyNoCompression: a storey in tension has alpha_cr = +Inf
// (reported null) and delta_s = 1.
func TestStoreyNoCompression(t *testing.T) {
	a := swayColumn("A", "L1", 5000e3)
	b := swayColumn("B", "L1", 5000e3)
	a.Actions = []checks.Actions{act("ULS", -100, 10, 20)}
	b.Actions = []checks.Actions{act("ULS", -100, 10, 20)}
	rep := run(t, model(a, b), stabilityOptions())
	ax := &rep.Elements[0].Combinations[0].Axes[0]
	if !math.IsInf(ax.LambdaC.F(), 1) {
		t.Errorf("alpha_cr = %v, want +Inf", ax.LambdaC.F())
	}
	near(t, "delta_s", ax.DeltaS, 1, 0) // source: design §5.3 (no compression in the storey: delta_s = 1)
	wantVerdict(t, &rep.Elements[0], checks.Pass)
}

// TestTrace: every amplification step cites an EN 1993-1-1 clause, and the
// summary trace is the full trace's governing part.
func TestTrace(t *testing.T) {
	m := swayAlone(5)
	rep := run(t, model(m), stabilityOptions())
	el := &rep.Elements[0]
	want := map[string]string{
		"N_cr,major":     "EN 1993-1-1 6.3.1.2",
		"N_cr,b,major":   "EN 1993-1-1 6.3.1.2",
		"M_Ed,major":     "EN 1993-1-1 5.2.2",
		"alpha_cr,major": "EN 1993-1-1 5.2.1(3)",
		"delta_s,major":  "EN 1993-1-1 5.2.2(5)B, (6)B",
		"delta_m,major":  "EN 1993-1-1 5.2.2(5)B, (6)B",
		"M_Ed,amp,major": "EN 1993-1-1 5.2.2(5)B, (6)B",
		"delta_m,minor":  "EN 1993-1-1 6.3",
	}
	for q, clause := range want {
		s := step(el, q)
		if s == nil || s.Clause != clause {
			t.Errorf("step %s: %+v, want clause %q", q, s, clause)
		}
	}
	// source: EN 1993-1-1 5.2.2(5)B: 1/(1 - 1/5) = 1.25 [D]
	if s := step(el, "delta_s,major"); s == nil || math.Abs(s.Value-1.25) > 1e-9 {
		t.Errorf("delta_s step %+v", s)
	}
	opt := stabilityOptions()
	opt.TraceOnDemand = true
	rep2 := run(t, model(m), opt)
	got := rep2.AppendTrace(nil, 0)
	if len(got) != len(el.Trace) {
		t.Errorf("trace on demand: %d steps, inline %d", len(got), len(el.Trace))
	}
}
