package as4100_test

import (
	"math"
	"testing"

	"swaygate/checks"
	"swaygate/checks/as4100"
	"swaygate/checks/section"
)

// e is the modulus of the test members (MPa). // source: standards-notes §1.0, AS 4100 2.2.4
const e = 200_000.0

// iFor is the second moment (mm⁴) that gives an elastic buckling load nom
// (N) over an effective length le (mm) with E = e.
func iFor(nom, le float64) float64 { return nom * le * le / (math.Pi * math.Pi * e) }

// column is a 4 m column braced about both axes with ke = 1 (invented test
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

// act is one combination's actions: N* in kN, major end moments in kNm.
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

func runAS(t *testing.T, m *checks.Model, opt checks.Options) *checks.Report {
	t.Helper()
	rep, err := checks.Run(m, as4100.New(), opt)
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

// reason returns the element's first reason with code (and, when given,
// axis), or nil.
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
