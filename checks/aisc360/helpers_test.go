package aisc360_test

import (
	"math"
	"strings"
	"testing"

	"swaygate/checks"
	"swaygate/checks/aisc360"
	"swaygate/checks/section"
)

// e is the modulus of the test members (MPa). // source: standards-notes §4, AISC 360 E3 (29 000 ksi = 200 000 MPa)
const e = 200_000.0

// iFor is the second moment (mm⁴) that gives an elastic buckling load ncr
// (N) over an effective length le (mm) with E = e.
func iFor(ncr, le float64) float64 { return ncr * le * le / (math.Pi * math.Pi * e) }

// column is a 4 m column braced about both axes with k = 1 (invented test
// data); tests change what they need.
func column(id string, imaj, imin float64) checks.Member {
	return checks.Member{
		GlobalID: id,
		Entity:   "IfcColumn",
		Length:   4000,
		Section:  &section.Properties{Profile: "test", Shape: "I", A: 10_000, IMajor: imaj, IMinor: imin},
		Material: checks.Material{E: e, Source: "model"},
		Axes: [2]checks.AxisInput{
			{Restraint: checks.Braced, Ke: 1, Direction: checks.DirY},
			{Restraint: checks.Braced, Ke: 1, Direction: checks.DirX},
		},
	}
}

// swayColumn is a column of storey key with a sway major axis (k = 2) whose
// P_e2 is ncr (N); its P_e1 (K1 = 1) is 4 ncr.
func swayColumn(id, key string, ncr float64) checks.Member {
	m := column(id, iFor(ncr, 8000), iFor(50_000e3, 4000))
	m.StoreyKey, m.Storey = key, key
	m.Axes[checks.Major] = checks.AxisInput{Restraint: checks.Sway, Ke: 2, Direction: checks.DirY}
	return m
}

// act is one combination's actions: N in kN, major end moments in kNm.
func act(comb string, nKN, startKNm, endKNm float64) checks.Actions {
	return checks.Actions{
		Combination: comb,
		NStar:       nKN * 1e3,
		Moments:     [2]checks.AxisMoments{{Start: startKNm * 1e6, End: endKNm * 1e6}},
	}
}

func model(ms ...checks.Member) *checks.Model {
	m := &checks.Model{Members: ms}
	seen := map[string]bool{}
	for _, mem := range ms {
		for _, a := range mem.Actions {
			if !seen[a.Combination] {
				seen[a.Combination] = true
				m.Combinations = append(m.Combinations, a.Combination)
			}
		}
	}
	return m
}

func run(t *testing.T, m *checks.Model, opt checks.Options) *checks.Report {
	t.Helper()
	rep, err := checks.Run(m, aisc360.New(), opt)
	if err != nil {
		t.Fatal(err)
	}
	return rep
}

func near(t *testing.T, what string, got checks.Num, want, tol float64) {
	t.Helper()
	if !got.Known() || math.Abs(got.F()-want) > tol {
		t.Errorf("%s = %v, want %v ± %v", what, got.F(), want, tol)
	}
}

func null(t *testing.T, what string, got checks.Num) {
	t.Helper()
	if got.Known() {
		t.Errorf("%s = %v, want null", what, got.F())
	}
}

func reason(el *checks.Element, code, axis string) *checks.Reason {
	for k := range el.Reasons {
		r := &el.Reasons[k]
		if r.Code == code && (axis == "" || r.Axis == axis) {
			return r
		}
	}
	return nil
}

func wantReason(t *testing.T, el *checks.Element, code, axis string) *checks.Reason {
	t.Helper()
	r := reason(el, code, axis)
	if r == nil {
		t.Errorf("%s: no reason %s (axis %q); reasons: %v", el.Member.GlobalID, code, axis, el.Reasons)
	}
	return r
}

func noReason(t *testing.T, el *checks.Element, code string) {
	t.Helper()
	if r := reason(el, code, ""); r != nil {
		t.Errorf("%s: unexpected reason %v", el.Member.GlobalID, *r)
	}
}

func wantVerdict(t *testing.T, el *checks.Element, v checks.Verdict) {
	t.Helper()
	if el.Verdict != v {
		t.Errorf("%s: verdict %v, want %v; reasons: %v", el.Member.GlobalID, el.Verdict, v, el.Reasons)
	}
}

// step returns the first trace step whose quantity starts with prefix.
func step(el *checks.Element, prefix string) *checks.Step {
	for k := range el.Trace {
		if strings.HasPrefix(el.Trace[k].Quantity, prefix) {
			return &el.Trace[k]
		}
	}
	return nil
}

func contains(list []string, part string) bool {
	for _, s := range list {
		if strings.Contains(s, part) {
			return true
		}
	}
	return false
}
