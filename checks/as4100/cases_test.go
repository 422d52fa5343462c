package as4100_test

import (
	"math"
	"testing"

	"swaygate/checks"
)

// TestMissingData: every gap is needs-analysis with its code, never a pass,
// and every value that can be computed is still given.
// source: design §5.4 (verdicts and reasons), §5.3 (missing data)
func TestMissingData(t *testing.T) {
	base := func() checks.Member {
		m := column("M", iFor(8000e3, 4000), iFor(4000e3, 4000))
		m.Actions = []checks.Actions{act("ULS", 500, 40, -20)}
		return m
	}
	cases := []struct {
		name   string
		edit   func(*checks.Member)
		code   string
		axis   string
		verify func(t *testing.T, c *checks.CombinationResult)
	}{
		{"missing-section", func(m *checks.Member) { m.Section = nil }, checks.CodeMissingSection, "",
			func(t *testing.T, c *checks.CombinationResult) {
				null(t, "Nom", c.Axes[0].Nom)
				null(t, "delta_b", c.Axes[0].DeltaB)
				near(t, "beta_m", c.Axes[0].BetaM, 0.5, 1e-12) // source: AS 4100 4.4.2.2, 20/40 reverse curvature
				near(t, "M*m", c.Axes[0].MStar, 40e6, 1e-6)
			}},
		{"missing-section (one axis)", func(m *checks.Member) { m.Section.IMinor = math.NaN() }, checks.CodeMissingSection, "minor",
			func(t *testing.T, c *checks.CombinationResult) {
				null(t, "Nom minor", c.Axes[1].Nom)
				near(t, "Nom major", c.Axes[0].Nom, 8000e3, 1e-3)
				if c.Axes[0].Verdict != checks.Pass || c.Axes[1].Verdict != checks.NeedsAnalysis {
					t.Errorf("axis verdicts %v %v", c.Axes[0].Verdict, c.Axes[1].Verdict)
				}
			}},
		{"missing-length", func(m *checks.Member) { m.Length = 0 }, checks.CodeMissingLength, "",
			func(t *testing.T, c *checks.CombinationResult) { null(t, "Nom", c.Axes[0].Nom) }},
		{"missing-restraint", func(m *checks.Member) { m.Axes[1] = checks.AxisInput{Direction: checks.DirX} }, checks.CodeMissingRestraint, "minor",
			func(t *testing.T, c *checks.CombinationResult) {
				null(t, "delta_m minor", c.Axes[1].DeltaM)
				near(t, "c_m minor", c.Axes[1].Cm, 1, 1e-12)
				near(t, "delta_m major", c.Axes[0].DeltaM, 1, 1e-12)
			}},
		{"missing-restraint (ke only)", func(m *checks.Member) { m.Axes[0].Ke = 0 }, checks.CodeMissingRestraint, "major", nil},
		{"invalid-restraint (sway ke < 1)", func(m *checks.Member) { m.Axes[0].Restraint, m.Axes[0].Ke = checks.Sway, 0.8 }, checks.CodeInvalidRestraint, "major", nil},
		{"invalid-restraint (negative ke)", func(m *checks.Member) { m.Axes[0].Ke = -1 }, checks.CodeInvalidRestraint, "major", nil},
		{"missing-actions", func(m *checks.Member) { m.Actions[0].Combination = "other" }, checks.CodeMissingActions, "",
			func(t *testing.T, c *checks.CombinationResult) {
				null(t, "N*", c.NStar)
				near(t, "Nom still given", c.Axes[0].Nom, 8000e3, 1e-3)
			}},
		{"interior-moment-unknown", func(m *checks.Member) { m.Actions[0].Moments[0].InteriorUnknown = true }, checks.CodeInteriorMomentUnknown, "major",
			func(t *testing.T, c *checks.CombinationResult) {
				null(t, "M*m", c.Axes[0].MStar)
				null(t, "M*", c.Axes[0].MAmp)
				near(t, "beta_m", c.Axes[0].BetaM, -1, 0) // source: design §5.3: transverse load gives beta_m = -1
				if !c.Axes[0].DeltaB.Known() {
					t.Error("delta_b should still be given")
				}
			}},
		{"blocking problem", func(m *checks.Member) {
			m.Problems = []checks.Reason{{Code: checks.CodeAxialSignSuspect, Message: "most columns in tension"}}
		}, checks.CodeAxialSignSuspect, "", nil},
		{"unsupported-profile", func(m *checks.Member) {
			m.Section = nil
			m.Problems = []checks.Reason{{Code: checks.CodeUnsupportedProfile, Message: "IfcCraneRailAShapeProfileDef"}}
		}, checks.CodeUnsupportedProfile, "", nil},
	}
	// A model whose only combination "ULS" exists (the missing-actions case
	// renames the member's row).
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			m := base()
			tc.edit(&m)
			md := model(m)
			md.Combinations = []string{"ULS"}
			rep := runAS(t, md, stabilityOptions())
			el := &rep.Elements[0]
			wantVerdict(t, el, checks.NeedsAnalysis)
			wantReason(t, el, tc.code, tc.axis)
			if el.Combinations[0].Verdict != checks.NeedsAnalysis {
				t.Errorf("combination verdict %v", el.Combinations[0].Verdict)
			}
			if tc.verify != nil {
				tc.verify(t, &el.Combinations[0])
			}
			if rep.Summary.NeedsAnalysis != 1 || rep.Summary.Members != 1 {
				t.Errorf("summary %+v", rep.Summary)
			}
		})
	}
}

// TestMissingActionsNamesCombination: missing-actions names the combination
// when only some are missing, and is kept once when all are.
// source: design §5.4 (missing-actions naming the combination)
func TestMissingActionsNamesCombination(t *testing.T) {
	a := column("A", iFor(8000e3, 4000), iFor(4000e3, 4000))
	a.Actions = []checks.Actions{act("ULS1", 100, 10, 10)}
	b := column("B", iFor(8000e3, 4000), iFor(4000e3, 4000))
	md := model(a, b)
	md.Combinations = []string{"ULS1", "ULS2"}
	rep := runAS(t, md, stabilityOptions())
	r := wantReason(t, &rep.Elements[0], checks.CodeMissingActions, "")
	if r != nil && r.Combination != "ULS2" {
		t.Errorf("missing-actions of A names %q, want ULS2", r.Combination)
	}
	if rep.Elements[0].GoverningCombination != "ULS2" {
		t.Errorf("governing %q, want ULS2", rep.Elements[0].GoverningCombination)
	}
	r = wantReason(t, &rep.Elements[1], checks.CodeMissingActions, "")
	if r != nil && r.Combination != "" {
		t.Errorf("missing-actions of B (all combinations) names %q, want none", r.Combination)
	}
	if n := len(rep.Elements[1].Reasons); n != 1 {
		t.Errorf("B has %d reasons, want 1: %v", n, rep.Elements[1].Reasons)
	}
}

// TestNoDesignCombinations: a model with no combination is needs-analysis.
// source: design §4.2, §5.4 (no-design-combinations)
func TestNoDesignCombinations(t *testing.T) {
	rep := runAS(t, model(column("A", 1e8, 1e8)), stabilityOptions())
	wantVerdict(t, &rep.Elements[0], checks.NeedsAnalysis)
	wantReason(t, &rep.Elements[0], checks.CodeNoDesignCombinations, "")
	if len(rep.Warnings) == 0 || rep.Warnings[0].Code != checks.CodeNoDesignCombinations {
		t.Errorf("warnings %v", rep.Warnings)
	}
}

// TestSecondOrderResults: delta_s = 1 with second-order results, delta_b
// still applies unless member P-delta was modelled.
// source: design §4.2 (TheoryType), AS 4100 4.4.2.2
func TestSecondOrderResults(t *testing.T) {
	build := func() *checks.Model {
		m := storeyModel(1500, 1500) // lambda = 5000/1500 = 3.33: delta_s = 1.43 in a first-order analysis
		for k := range m.Members {
			m.Members[k].Actions[0].Theory = checks.SecondOrder
			m.Members[k].Actions[0].Moments[0] = checks.AxisMoments{Start: 50e6, End: 25e6} // single curvature: cm = 0.8
		}
		return m
	}
	rep := runAS(t, build(), stabilityOptions())
	el := &rep.Elements[0]
	ax := &el.Combinations[0].Axes[checks.Major]
	near(t, "delta_s", ax.DeltaS, 1, 0)
	near(t, "lambda_c", ax.LambdaC, 5000.0/1500, 1e-9) // source: standards-notes §1.3, both forms equal
	wantDB := 0.8 / (1 - 1500.0/5000)                  // source: AS 4100 4.4.2.2, cm = 0.8: 1.143
	near(t, "delta_b", ax.DeltaB, wantDB, 1e-9)
	near(t, "delta_m", ax.DeltaM, wantDB, 1e-9)
	wantReason(t, el, checks.CodeSecondOrderResults, "")
	if el.Combinations[0].Theory != checks.SecondOrder {
		t.Error("theory not reported")
	}
	wantVerdict(t, el, checks.Pass)

	// The same actions from a first-order analysis: delta_s = 1.43 > 1.4.
	fo := build()
	for k := range fo.Members {
		fo.Members[k].Actions[0].Theory = checks.FirstOrder
	}
	rep = runAS(t, fo, stabilityOptions())
	near(t, "first-order delta_s", rep.Elements[0].Combinations[0].Axes[0].DeltaS, 1/(1-1500.0/5000), 1e-12) // source: AS 4100 4.4.2.3
	wantVerdict(t, &rep.Elements[0], checks.NeedsAnalysis)

	opt := stabilityOptions()
	opt.MemberPDeltaModelled = true
	rep = runAS(t, build(), opt)
	ax = &rep.Elements[0].Combinations[0].Axes[checks.Major]
	near(t, "delta_b (member P-delta modelled)", ax.DeltaB, 1, 0)
	near(t, "delta_m", ax.DeltaM, 1, 0)
	if !hasAssumption(rep, "member (P-delta)") {
		t.Errorf("no P-delta assumption: %q", rep.Assumptions)
	}
}

// TestTensionMember: no member buckling check, delta_b = 1; on a braced axis
// lambda_c is null and delta_m = 1; on a sway axis delta_s still applies.
// source: design §5.3 (N* ≤ 0)
func TestTensionMember(t *testing.T) {
	m := storeyModel(1000, -200)
	m.Members[1].Actions[0].Moments[1] = checks.AxisMoments{Start: 5e6, End: 5e6}
	rep := runAS(t, m, stabilityOptions())
	el := &rep.Elements[1]
	wantReason(t, el, checks.CodeNotInCompression, "")
	maj, min := &el.Combinations[0].Axes[checks.Major], &el.Combinations[0].Axes[checks.Minor]
	near(t, "delta_b major", maj.DeltaB, 1, 0)
	// source: standards-notes §1.3 [D]: form A = 10000/1000 = 10, form B =
	// 5000·1000/1000² = 5 (the tension column adds no N*-weighted stiffness);
	// design §5.3: the lower is used.
	lambda := 5.0
	near(t, "storey lambda", maj.LambdaC, lambda, 1e-9)
	near(t, "delta_s", maj.DeltaS, 1/(1-1/lambda), 1e-12) // source: AS 4100 4.4.2.3
	near(t, "delta_m major", maj.DeltaM, 1/(1-1/lambda), 1e-12)
	null(t, "lambda_c minor", min.LambdaC)
	near(t, "delta_b minor", min.DeltaB, 1, 0)
	near(t, "delta_m minor", min.DeltaM, 1, 0)
	near(t, "M* minor", min.MAmp, 5e6, 1e-9)
	wantVerdict(t, el, checks.Pass)
}

// TestRestraintDefaults: user defaults fill missing restraint, recorded as
// assumptions and on each member.
// source: design §4 (restraint table: request-level defaults recorded)
func TestRestraintDefaults(t *testing.T) {
	m := column("D", iFor(6000e3, 4000*1.2), iFor(3000e3, 4000))
	m.Axes[checks.Major] = checks.AxisInput{Direction: checks.DirY}
	m.Actions = []checks.Actions{act("ULS", 300, 30, -30)}
	opt := stabilityOptions()
	opt.Defaults[checks.Major] = checks.RestraintDefault{Restraint: checks.Sway, Ke: 1.2}
	rep := runAS(t, model(m), opt)
	el := &rep.Elements[0]
	r := wantReason(t, el, checks.CodeAssumedRestraint, "major")
	if r != nil && !contains(r.Message, "sway, ke = 1.2, braced ke = 1") {
		t.Errorf("message %q", r.Message)
	}
	noReason(t, el, checks.CodeMissingRestraint)
	if !hasAssumption(rep, "user's default for the major axis: sway, ke = 1.2") {
		t.Errorf("assumptions %q", rep.Assumptions)
	}
	ax := &el.Combinations[0].Axes[checks.Major]
	near(t, "Noms with ke 1.2", ax.Nom, 6000e3, 1e-3)
	near(t, "Nomb with braced ke 1.0", ax.Nomb, 6000e3*1.44, 1e-3)
	near(t, "ke", ax.Ke, 1.2, 0)
	wantVerdict(t, el, checks.Pass)

	// No default: missing-restraint.
	rep = runAS(t, model(m), stabilityOptions())
	wantReason(t, &rep.Elements[0], checks.CodeMissingRestraint, "major")
	wantVerdict(t, &rep.Elements[0], checks.NeedsAnalysis)
}

// TestStoreyIncomplete: a storey column without actions makes the storey's
// sway and leaning axes needs-analysis.
// source: design §5.3 (storey-incomplete)
func TestStoreyIncomplete(t *testing.T) {
	m := storeyModel(500, 500, 500)
	lean := column("LEAN", 1e8, 1e8)
	lean.StoreyKey = "#10"
	lean.Actions = []checks.Actions{act("ULS", 400, 0, 0)}
	m.Members = append(m.Members, lean)
	m.Members[2].Actions = nil
	rep := runAS(t, m, stabilityOptions())
	st := storeyRow(t, rep, checks.DirY)
	if st.Complete || st.LambdaC.Known() || len(st.Reasons) == 0 || st.Reasons[0].Code != checks.CodeStoreyIncomplete {
		t.Errorf("storey row %+v", *st)
	}
	for _, k := range []int{0, 1, 3} {
		el := &rep.Elements[k]
		wantVerdict(t, el, checks.NeedsAnalysis)
		r := wantReason(t, el, checks.CodeStoreyIncomplete, "major")
		if r != nil && !contains(r.Message, "SC") {
			t.Errorf("message %q should name the column", r.Message)
		}
		ax := &el.Combinations[0].Axes[checks.Major]
		null(t, "delta_s", ax.DeltaS)
		if !ax.DeltaB.Known() || !ax.BetaM.Known() {
			t.Errorf("computable values missing: %+v", ax)
		}
	}
	wantReason(t, &rep.Elements[2], checks.CodeMissingActions, "")
	noReason(t, &rep.Elements[2], checks.CodeStoreyIncomplete)

	// A sway column whose stiffness is unknown (no section) also leaves the
	// sums unknown.
	m = storeyModel(500, 500)
	m.Members[1].Section = nil
	rep = runAS(t, m, stabilityOptions())
	wantReason(t, &rep.Elements[0], checks.CodeStoreyIncomplete, "major")
	// A column without restraint data gives load, no stiffness.
	m = storeyModel(500, 500)
	nr := column("NR", 1e8, 1e8)
	nr.StoreyKey = "#10"
	nr.Axes[checks.Major] = checks.AxisInput{Direction: checks.DirY}
	nr.Actions = []checks.Actions{act("ULS", 1000, 0, 0)}
	m.Members = append(m.Members, nr)
	rep = runAS(t, m, stabilityOptions())
	st = storeyRow(t, rep, checks.DirY)
	// source: standards-notes §1.3 [D]: form A = 10000/2000 = 5, form B =
	// 5000·500·2/(500²·2 + 1000²) = 3.333; the lower is used (design §5.3).
	near(t, "lambda with load only from NR", st.LambdaC, 10.0/3, 1e-9)
	wantReason(t, &rep.Elements[2], checks.CodeMissingRestraint, "major")
}

// TestMixedSwayFlags: a leaning column with end moments gets a warning and
// delta_s.
// source: design §5.3 (leaning axes, mixed-sway-flags)
func TestMixedSwayFlags(t *testing.T) {
	m := storeyModel(500, 500)
	lean := column("LEAN", iFor(4000e3, 4000), 1e8)
	lean.StoreyKey = "#10"
	lean.Actions = []checks.Actions{act("ULS", 500, 30, 15)}
	m.Members = append(m.Members, lean)
	rep := runAS(t, m, stabilityOptions())
	el := &rep.Elements[2]
	wantReason(t, el, checks.CodeMixedSwayFlags, "major")
	ax := &el.Combinations[0].Axes[checks.Major]
	if !ax.Leaning {
		t.Error("not leaning")
	}
	// source: standards-notes §1.3 [D]: form A = 10000/1500 = form B = 6.667
	// (equal N*), AS 4100 4.4.2.3: delta_s = 1/(1 - 0.15) = 1.1765.
	near(t, "lambda_c", ax.LambdaC, 10000.0/1500, 1e-9)
	near(t, "delta_s", ax.DeltaS, 1/(1-0.15), 1e-12)
	// source: AS 4100 4.4.2.2: beta_m = -0.5, cm = 0.8, 0.8/(1 - 500/4000) = 0.914, floored to 1.
	near(t, "delta_b", ax.DeltaB, 1, 0)
	near(t, "delta_m", ax.DeltaM, 1/(1-0.15), 1e-12)
	near(t, "M*", ax.MAmp, 30e6/(1-0.15), 1e-6)
	wantVerdict(t, el, checks.Pass)
}

// TestKeWarnings: a braced ke above 1 is allowed with unusual-ke.
// source: design §4.1 (unusual-ke)
func TestKeWarnings(t *testing.T) {
	m := column("K", iFor(8000e3, 4000), iFor(8000e3, 4000))
	m.Axes[checks.Minor].Ke = 1.2
	m.Actions = []checks.Actions{act("ULS", 100, 10, 10)}
	rep := runAS(t, model(m), stabilityOptions())
	wantReason(t, &rep.Elements[0], checks.CodeUnusualKe, "minor")
	wantVerdict(t, &rep.Elements[0], checks.Pass)
}

// TestAssumedModulus: E from the options, else the standard's default, each
// recorded.
// source: design §4 (E: request default, then 200 000 MPa for AS 4100), AS 4100 2.2.4
func TestAssumedModulus(t *testing.T) {
	m := column("E", 1e8, 5e7)
	m.Material = checks.Material{}
	m.Actions = []checks.Actions{act("ULS", 100, 10, 10)}
	rep := runAS(t, model(m), stabilityOptions())
	el := &rep.Elements[0]
	if el.E != 200_000 || el.ESource != "default" {
		t.Errorf("E %v from %q", el.E, el.ESource)
	}
	wantReason(t, el, checks.CodeAssumedModulus, "")
	if !hasAssumption(rep, "E = 200000 MPa") {
		t.Errorf("assumptions %q", rep.Assumptions)
	}
	opt := stabilityOptions()
	opt.Modulus = 205_000
	rep = runAS(t, model(m), opt)
	if el := &rep.Elements[0]; el.E != 205_000 || el.ESource != "request" {
		t.Errorf("E %v from %q", el.E, el.ESource)
	}
	near(t, "Nom with E 205000", rep.Elements[0].Combinations[0].Axes[0].Nom, checks.Euler(205_000, 1e8, 4000), 1e-6)
}

// TestStoreyGeometry: a column whose top is off the storey's by > 10 % of
// the storey height gets storey-geometry.
// source: design §5.3 (storey-geometry)
func TestStoreyGeometry(t *testing.T) {
	m := storeyModel(500, 500, 500, 500, 500)
	for k := range m.Members {
		m.Members[k].BaseZ, m.Members[k].TopZ = 0, 4000
	}
	m.Members[3].TopZ = 4300 // 7.5 % of the storey height 4000
	m.Members[4].TopZ = 4500 // 12.5 %
	m.Members[4].BaseZ = 500 // its own length still 4000
	rep := runAS(t, m, stabilityOptions())
	wantReason(t, &rep.Elements[4], checks.CodeStoreyGeometry, "")
	noReason(t, &rep.Elements[3], checks.CodeStoreyGeometry)
	wantVerdict(t, &rep.Elements[4], checks.Pass)
}

// TestUnstable: N* ≥ Nomb, and a storey with lambda_c ≤ 1, fail.
// source: design §5.3 (fail unstable), AS 4100 4.4.2.2, 4.7.2.2
func TestUnstable(t *testing.T) {
	m := column("U", iFor(1000e3, 4000), iFor(5000e3, 4000))
	m.Actions = []checks.Actions{act("ULS", 1000, 10, 10)}
	rep := runAS(t, model(m), stabilityOptions())
	el := &rep.Elements[0]
	wantVerdict(t, el, checks.Fail)
	wantReason(t, el, checks.CodeUnstable, "major")
	null(t, "delta_b", el.Combinations[0].Axes[0].DeltaB)
	near(t, "lambda_c", el.Combinations[0].Axes[0].LambdaC, 1, 1e-12)

	st := storeyModel(4000, 4000, 4000)     // Nomb = 5000 > N*, lambda = 1.25
	st.Members[0].Actions[0].NStar = 5200e3 // unstable itself: no stiffness
	rep = runAS(t, st, stabilityOptions())
	row := storeyRow(t, rep, checks.DirY)
	lambda := 10000.0 / 13200 // source: standards-notes §1.3 form A without the unstable column's stiffness
	if row.LambdaC.F() > lambda+1e-9 {
		t.Errorf("storey lambda %v, want ≤ %v", row.LambdaC, lambda)
	}
	for k := range st.Members {
		wantVerdict(t, &rep.Elements[k], checks.Fail)
	}
	wantReason(t, &rep.Elements[1], checks.CodeUnstable, "major")
}

// TestStoreyNoCompression: no compression in the storey gives delta_s = 1.
// source: design §5.3
func TestStoreyNoCompression(t *testing.T) {
	rep := runAS(t, storeyModel(-100, 0), stabilityOptions())
	row := storeyRow(t, rep, checks.DirY)
	if !math.IsInf(row.LambdaC.F(), 1) || len(row.Reasons) != 1 || row.Reasons[0].Code != checks.CodeNotInCompression {
		t.Errorf("row %+v", *row)
	}
	for k := range rep.Elements {
		near(t, "delta_s", rep.Elements[k].Combinations[0].Axes[0].DeltaS, 1, 0)
		wantVerdict(t, &rep.Elements[k], checks.Pass)
	}
}

// TestMemberMethod: lambda_c = Noms/N*, leaning axes braced, recorded.
// source: design §5.3 (--sway-method member)
func TestMemberMethod(t *testing.T) {
	m := storeyModel(800, 800)
	lean := column("LEAN", iFor(3000e3, 4000), 1e8)
	lean.StoreyKey = "#10"
	lean.Actions = []checks.Actions{act("ULS", 1200, 0, 0)}
	m.Members = append(m.Members, lean)
	opt := stabilityOptions()
	opt.SwayMethod = "member"
	rep := runAS(t, m, opt)
	if rep.SwayMethod != "member" || len(rep.Storeys) != 0 {
		t.Errorf("method %q storeys %d", rep.SwayMethod, len(rep.Storeys))
	}
	near(t, "lambda_c", rep.Elements[0].Combinations[0].Axes[0].LambdaC, 5000.0/800, 1e-9) // source: design §5.3, Noms/N*
	lax := &rep.Elements[2].Combinations[0].Axes[0]
	if lax.Leaning || lax.DeltaS.Known() {
		t.Errorf("leaning column should be braced under the member method: %+v", lax)
	}
	if !hasAssumption(rep, "sway method member") {
		t.Errorf("assumptions %q", rep.Assumptions)
	}
}

// TestGoverningCombination: the worst verdict governs; ties go to the
// largest delta_m; the summary counts members.
// source: design §5.4
func TestGoverningCombination(t *testing.T) {
	a := column("A", iFor(2000e3, 4000), iFor(8000e3, 4000))
	a.Actions = []checks.Actions{act("C1", 200, 10, 10), act("C2", 500, 10, 10), act("C3", 400, 10, 10)}
	b := column("B", iFor(2000e3, 4000), iFor(8000e3, 4000))
	b.Actions = []checks.Actions{act("C1", 200, 10, 10), act("C2", 1000, 10, 10), act("C3", 2500, 10, 10)}
	rep := runAS(t, model(a, b), stabilityOptions())
	if g := rep.Elements[0].GoverningCombination; g != "C2" {
		t.Errorf("A governing %q, want C2 (largest delta_m)", g)
	}
	wantVerdict(t, &rep.Elements[0], checks.Pass)
	if g := rep.Elements[1].GoverningCombination; g != "C3" {
		t.Errorf("B governing %q, want C3 (unstable)", g)
	}
	wantVerdict(t, &rep.Elements[1], checks.Fail)
	// C2 of B: delta_b = 1/(1 - 0.5) = 2 > 1.4. source: AS 4100 4.4.1.2
	if v := rep.Elements[1].Combinations[1].Verdict; v != checks.NeedsAnalysis {
		t.Errorf("B C2 verdict %v", v)
	}
	if s := rep.Summary; s.Members != 2 || s.Pass != 1 || s.Fail != 1 || s.NeedsAnalysis != 0 {
		t.Errorf("summary %+v", s)
	}
}

// TestCombinationProblems: a reader's problem that names a combination
// applies to it alone; sign-convention-ambiguous gives beta_m = -1 there.
// source: design §4.2 (sign conventions: beta_m = -1, conservative; axial-sign-suspect per combination)
func TestCombinationProblems(t *testing.T) {
	m := column("P", iFor(8000e3, 4000), iFor(4000e3, 4000))
	m.Actions = []checks.Actions{act("C1", 500, 40, -20), act("C2", 500, 40, -20), act("C3", 500, 40, -20)}
	m.Problems = []checks.Reason{
		{Code: checks.CodeSignConventionAmbiguous, Message: "axial force too small to decide", Combination: "C2"},
		{Code: checks.CodeAxialSignSuspect, Message: "most columns in tension", Combination: "C3"},
	}
	rep := runAS(t, model(m), stabilityOptions())
	el := &rep.Elements[0]
	c := el.Combinations
	near(t, "beta_m C1", c[0].Axes[0].BetaM, 0.5, 0) // source: AS 4100 4.4.2.2, 20/40 reverse curvature
	near(t, "beta_m C2", c[1].Axes[0].BetaM, -1, 0)  // source: design §4.2, conservative
	if c[0].Verdict != checks.Pass || c[1].Verdict != checks.Pass || c[2].Verdict != checks.NeedsAnalysis {
		t.Errorf("verdicts %v %v %v", c[0].Verdict, c[1].Verdict, c[2].Verdict)
	}
	wantVerdict(t, el, checks.NeedsAnalysis)
	if el.GoverningCombination != "C3" {
		t.Errorf("governing %q", el.GoverningCombination)
	}
}

// TestNonFiniteActions: a row with NaN is missing, never a pass.
// source: design §5.4 (missing data is needs-analysis)
func TestNonFiniteActions(t *testing.T) {
	m := column("N", iFor(8000e3, 4000), iFor(4000e3, 4000))
	m.Actions = []checks.Actions{act("ULS", math.NaN(), 40, -20)}
	rep := runAS(t, model(m), stabilityOptions())
	wantVerdict(t, &rep.Elements[0], checks.NeedsAnalysis)
	wantReason(t, &rep.Elements[0], checks.CodeMissingActions, "")
}
