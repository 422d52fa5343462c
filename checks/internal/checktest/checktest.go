// Package checktest holds the helpers that the rule sets' tests share: small
// invented members and models, and assertions on a report's elements.
package checktest

import (
	"math"
	"strings"
	"testing"

	"swaygate/checks"
	"swaygate/checks/section"
)

// IFor is the second moment (mm⁴) that gives an elastic buckling load ncr
// (N) over an effective length le (mm) with modulus e (MPa).
func IFor(ncr, le, e float64) float64 { return ncr * le * le / (math.Pi * math.Pi * e) }

// Column is a 4 m column braced about both axes with ke = 1, modulus e
// (invented test data); tests change what they need.
func Column(id string, imaj, imin, e float64) checks.Member {
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

// Act is one combination's actions: N* in kN, major end moments in kNm.
func Act(comb string, nKN, startKNm, endKNm float64) checks.Actions {
	return checks.Actions{
		Combination: comb,
		NStar:       nKN * 1e3,
		Moments:     [2]checks.AxisMoments{{Start: startKNm * 1e6, End: endKNm * 1e6}},
	}
}

// Model collects members into a model whose combinations are the members'
// combination names in order of first appearance.
func Model(ms ...checks.Member) *checks.Model {
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

// Run runs m with rs and fails the test on an option error.
func Run(t *testing.T, m *checks.Model, rs checks.RuleSet, opt checks.Options) *checks.Report {
	t.Helper()
	rep, err := checks.Run(m, rs, opt)
	if err != nil {
		t.Fatal(err)
	}
	return rep
}

// Near checks that got is known and within tol of want.
func Near(t *testing.T, what string, got checks.Num, want, tol float64) {
	t.Helper()
	if !got.Known() || math.Abs(got.F()-want) > tol {
		t.Errorf("%s = %v, want %v ± %v", what, got.F(), want, tol)
	}
}

// Null checks that got is unknown.
func Null(t *testing.T, what string, got checks.Num) {
	t.Helper()
	if got.Known() {
		t.Errorf("%s = %v, want null", what, got.F())
	}
}

// Reason returns el's first reason with code (and axis, when not empty).
func Reason(el *checks.Element, code, axis string) *checks.Reason {
	for k := range el.Reasons {
		r := &el.Reasons[k]
		if r.Code == code && (axis == "" || r.Axis == axis) {
			return r
		}
	}
	return nil
}

// WantReason checks that el has a reason with code (and axis).
func WantReason(t *testing.T, el *checks.Element, code, axis string) *checks.Reason {
	t.Helper()
	r := Reason(el, code, axis)
	if r == nil {
		t.Errorf("%s: no reason %s (axis %q); reasons: %v", el.Member.GlobalID, code, axis, el.Reasons)
	}
	return r
}

// NoReason checks that el has no reason with code.
func NoReason(t *testing.T, el *checks.Element, code string) {
	t.Helper()
	if r := Reason(el, code, ""); r != nil {
		t.Errorf("%s: unexpected reason %v", el.Member.GlobalID, *r)
	}
}

// WantVerdict checks el's verdict.
func WantVerdict(t *testing.T, el *checks.Element, v checks.Verdict) {
	t.Helper()
	if el.Verdict != v {
		t.Errorf("%s: verdict %v, want %v; reasons: %v", el.Member.GlobalID, el.Verdict, v, el.Reasons)
	}
}

// Step returns the first trace step whose quantity starts with prefix.
func Step(el *checks.Element, prefix string) *checks.Step {
	for k := range el.Trace {
		if strings.HasPrefix(el.Trace[k].Quantity, prefix) {
			return &el.Trace[k]
		}
	}
	return nil
}

// Contains reports whether some string of list contains part.
func Contains(list []string, part string) bool {
	for _, s := range list {
		if strings.Contains(s, part) {
			return true
		}
	}
	return false
}
