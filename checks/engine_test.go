package checks_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"swaygate/checks"
	"swaygate/checks/as4100"
	"swaygate/checks/section"
)

// TestEuler checks the classical strut loads. source: Timoshenko & Gere,
// Theory of Elastic Stability §2.1: pin-ended pi^2 EI/L^2, cantilever
// pi^2 EI/(4L^2), fixed-fixed 4 pi^2 EI/L^2.
func TestEuler(t *testing.T) {
	const e, i, l = 200_000.0, 8e6, 4000.0
	pin := math.Pi * math.Pi * e * i / (l * l)
	cases := []struct {
		ke, want float64
	}{
		{1, pin},
		{2, pin / 4},
		{0.5, 4 * pin},
	}
	for _, tc := range cases {
		if got := checks.Euler(e, i, tc.ke*l); math.Abs(got-tc.want) > 1e-9*tc.want {
			t.Errorf("ke %v: %v, want %v", tc.ke, got, tc.want)
		}
	}
	// source: standards-notes §6.5 [L] (OpenCalcs): 100 pi^2 kN
	if got := checks.Euler(e, i, l) / 1e3; math.Abs(got-100*math.Pi*math.Pi) > 1e-9 {
		t.Errorf("%v kN", got)
	}
	for _, bad := range [][3]float64{{0, i, l}, {e, math.NaN(), l}, {e, i, 0}, {e, i, math.Inf(1)}} {
		if !math.IsNaN(checks.Euler(bad[0], bad[1], bad[2])) {
			t.Errorf("Euler%v should be NaN", bad)
		}
	}
}

// TestEndMomentRatio: M1/M2, positive in reverse curvature. source:
// standards-notes §1.1 [C]/[L] (Steel Designers' Handbook p.53; AISC A-8-4
// uses the same sign).
func TestEndMomentRatio(t *testing.T) {
	cases := []struct {
		a, b, want float64
		ok         bool
	}{
		{100, 50, -0.5, true},
		{-100, -50, -0.5, true},
		{100, -50, 0.5, true},
		{-50, 100, 0.5, true},
		{100, 100, -1, true},
		{100, -100, 1, true},
		{100, 0, 0, true},
		{0, 0, 0, false},
	}
	for _, tc := range cases {
		got, ok := checks.EndMomentRatio(tc.a, tc.b)
		if ok != tc.ok || (ok && got != tc.want) {
			t.Errorf("EndMomentRatio(%v, %v) = %v %v, want %v %v", tc.a, tc.b, got, ok, tc.want, tc.ok)
		}
	}
}

func testModel() *checks.Model {
	mk := func(id string, r checks.Restraint, n float64) checks.Member {
		return checks.Member{
			GlobalID: id, StoreyKey: "#1", Storey: "L1", Length: 4000,
			Section:  &section.Properties{IMajor: 100e6, IMinor: 30e6},
			Material: checks.Material{E: 200_000, Source: "model"},
			Axes: [2]checks.AxisInput{
				{Restraint: r, Ke: 1.2, Direction: checks.DirY},
				{Restraint: checks.Braced, Ke: 1, Direction: checks.DirX},
			},
			Actions: []checks.Actions{{Combination: "ULS", NStar: n,
				Moments: [2]checks.AxisMoments{{Start: 30e6, End: -10e6}, {Start: 2e6, End: 2e6}}}},
		}
	}
	return &checks.Model{
		Members:      []checks.Member{mk("A", checks.Sway, 500e3), mk("B", checks.Braced, 900e3)},
		Combinations: []string{"ULS"},
	}
}

// TestOptionErrors: invalid options are errors wrapping ErrOption, before
// any work. (No check values.) // common practice: usage errors exit 2
func TestOptionErrors(t *testing.T) {
	for _, edit := range []func(*checks.Options){
		func(o *checks.Options) { o.SwayMethod = "guess" },
		func(o *checks.Options) { o.SwayMethod = "frame" },
		func(o *checks.Options) { o.Trace = "verbose" },
		func(o *checks.Options) { o.Scope = "everything" },
		func(o *checks.Options) { o.Modulus = -1 },
		func(o *checks.Options) { o.Defaults[0] = checks.RestraintDefault{Restraint: checks.Sway, Ke: 0.7} },
	} {
		opt := stabilityOptions()
		edit(&opt)
		if _, err := checks.Run(testModel(), as4100.New(), opt); !errors.Is(err, checks.ErrOption) {
			t.Errorf("%+v: err %v", opt, err)
		}
	}
}

// capacityRules is AS 4100 with a stand-in capacity check, to show that a
// rule set adds capacity checks through the hook without engine changes.
type capacityRules struct{ *as4100.Rules }

func (capacityRules) Begin(*checks.Options) ([]string, error) { return nil, nil }

func (capacityRules) Capacity(cx *checks.CombinationContext, out *checks.CombinationResult, tr *checks.Tracer) {
	// A stand-in "capacity" of 800 kN (invented) so both outcomes occur.
	u := cx.Actions.NStar / 800e3
	out.Capacity = append(out.Capacity, checks.CapacityCheck{Name: "stand-in", Demand: checks.Num(cx.Actions.NStar),
		Capacity: 800e3, Unit: "N", Utilisation: checks.Num(u)})
	if u > 1 {
		cx.Reason(checks.CodeCapacityExceeded, "stand-in capacity exceeded", "")
	}
	if tr.On() {
		tr.Step("u", "", "N*/800 kN", u, "")
	}
}

func TestCapacityHook(t *testing.T) {
	opt := stabilityOptions()
	opt.Scope = "full"
	rep, err := checks.Run(testModel(), capacityRules{as4100.New()}, opt)
	if err != nil {
		t.Fatal(err)
	}
	if rep.Scope != "full" {
		t.Errorf("scope %q", rep.Scope)
	}
	a, b := &rep.Elements[0], &rep.Elements[1]
	if len(a.Combinations[0].Capacity) != 1 || a.Verdict != checks.Pass {
		t.Errorf("A: %+v %v %v", a.Combinations[0].Capacity, a.Verdict, a.Reasons)
	}
	if b.Verdict != checks.Fail || b.Combinations[0].Verdict != checks.Fail {
		t.Errorf("B verdict %v; %v", b.Verdict, b.Reasons)
	}
	var step bool
	for _, s := range b.Trace {
		step = step || s.Quantity == "u"
	}
	if !step {
		t.Error("capacity step not traced")
	}
	// AS 4100 has its own capacity checks: scope full is accepted.
	if _, err := checks.Run(testModel(), as4100.New(), opt); err != nil {
		t.Errorf("err %v", err)
	}
}

// constProvider stands in for a frame buckling analysis: one lambda_c per
// combination for every sway axis.
type constProvider struct {
	sc     *checks.SwayContext
	lambda float64
}

func (p *constProvider) Method() string { return "frame" }
func (p *constProvider) Prepare(sc *checks.SwayContext) error {
	p.sc = sc
	sc.Report.Frame = &checks.FrameResult{Combinations: []checks.FrameCombination{{Name: "ULS", LambdaC: checks.Num(p.lambda)}}}
	return nil
}
func (p *constProvider) Sway(i int, a checks.Axis, c int) checks.SwayValue {
	if p.sc.Axis(i, a).Restraint == checks.Sway {
		return checks.SwayValue{Role: checks.RoleSway, Lambda: p.lambda, Method: "frame", Form: "frame"}
	}
	return checks.SwayValue{Role: checks.RoleBraced, Lambda: math.NaN()}
}
func (p *constProvider) MemberNotes(int, []checks.Reason) []checks.Reason { return nil }

// TestRunWithProvider: a model-wide provider plugs in without rule-set
// changes; the trace names the frame clause.
func TestRunWithProvider(t *testing.T) {
	rep, err := checks.RunWith(testModel(), as4100.New(), &constProvider{lambda: 8}, stabilityOptions())
	if err != nil {
		t.Fatal(err)
	}
	if rep.SwayMethod != "frame" || rep.Frame == nil {
		t.Errorf("method %q frame %v", rep.SwayMethod, rep.Frame)
	}
	ax := rep.Elements[0].Combinations[0].Axes[0]
	if want := 1 / (1 - 1.0/8); math.Abs(ax.DeltaS.F()-want) > 1e-12 { // source: AS 4100 4.4.2.3
		t.Errorf("delta_s %v, want %v", ax.DeltaS.F(), want)
	}
	var cites bool
	for _, s := range rep.Elements[0].Trace {
		cites = cites || (strings.HasPrefix(s.Quantity, "lambda_c") && s.Clause == "AS 4100 4.7.2")
	}
	if !cites {
		t.Error("trace does not cite the frame buckling clause")
	}
}

// TestModelPassThrough: the model's warnings, assumptions and skipped
// elements reach the report; combinations default to the union of actions.
func TestModelPassThrough(t *testing.T) {
	m := testModel()
	m.Combinations = nil
	m.Warnings = []checks.Reason{{Code: checks.CodeUnknownGlobalID, Message: "x"}}
	m.Assumptions = []string{"reader assumption"}
	m.Skipped = []checks.Skipped{{GlobalID: "C", Reason: checks.CodeNotSteel}}
	rep, err := checks.Run(m, as4100.New(), stabilityOptions())
	if err != nil {
		t.Fatal(err)
	}
	if len(rep.Elements[0].Combinations) != 1 || rep.Elements[0].Combinations[0].Name != "ULS" {
		t.Errorf("combinations %+v", rep.Elements[0].Combinations)
	}
	if rep.Warnings[0].Code != checks.CodeUnknownGlobalID || rep.Assumptions[0] != "reader assumption" || len(rep.Skipped) != 1 {
		t.Errorf("report %+v", rep)
	}
	if rep.Standard != "as4100" || rep.SwayMethod != "storey" || rep.Scope != "stability" {
		t.Errorf("header %q %q %q", rep.Standard, rep.SwayMethod, rep.Scope)
	}
}

// stabilityOptions are the default options with scope stability: the tests of
// the amplification provisions alone. (The product default is scope full,
// which adds the member capacity checks; their tests set it explicitly.)
func stabilityOptions() checks.Options {
	opt := checks.DefaultOptions()
	opt.Scope = "stability"
	return opt
}
