package ifc

import (
	"math"
	"testing"
)

func within(got, want, rel float64) bool {
	return math.Abs(got-want) <= rel*math.Max(1, math.Abs(want))
}

func TestDetectConvention(t *testing.T) {
	// source: design.md §4.2 — end forces have ForceX of opposite sign at the
	// two ends (compression: positive at the start), section forces the same
	// sign; a tolerance of 10 % of the larger value.
	tests := []struct {
		name   string
		n0, n1 float64 // N
		want   SignConvention
		ok     bool
	}{
		{"end forces in compression", 620e3, -620e3, ConventionEndForces, true},
		{"end forces in tension", -120e3, 120e3, ConventionEndForces, true},
		{"end forces with self-weight", 620e3, -600e3, ConventionEndForces, true},
		{"section forces in compression", -620e3, -600e3, ConventionSectionForces, true},
		{"section forces in tension", 50e3, 55e3, ConventionSectionForces, true},
		{"no axial force", 0, 0, ConventionAuto, false},
		{"below the floor", 3, -3, ConventionAuto, false},
		{"one end without a sign", 100e3, 5e3, ConventionAuto, false},
		{"one end zero", 0, -80e3, ConventionAuto, false},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, ok := detectConvention(tc.n0, tc.n1)
			if ok != tc.ok || (ok && got != tc.want) {
				t.Errorf("detectConvention(%g, %g) = %v, %v; want %v, %v", tc.n0, tc.n1, got, ok, tc.want, tc.ok)
			}
		})
	}
}

// TestHermitePeakUniformLoad checks the interpolated peak against the closed
// forms of a beam under a uniformly distributed load w over span L.
func TestHermitePeakUniformLoad(t *testing.T) {
	const w, l = 10.0, 3600.0 // N/mm, mm
	tests := []struct {
		name   string
		m0, m1 float64 // end moments, N·mm (sagging positive)
		want   float64
	}{
		// source: textbook closed form, simply supported beam: M_max = wL²/8 at midspan
		{"simply supported", 0, 0, w * l * l / 8},
		// source: textbook closed form, fixed-ended beam: ends −wL²/12, midspan +wL²/24; max |M| = wL²/12 at the ends
		{"fixed ends", -w * l * l / 12, -w * l * l / 12, w * l * l / 12},
		// source: textbook closed form, propped cantilever: fixed end −wL²/8, max sagging 9wL²/128 at 5L/8 from the fixed end
		{"propped cantilever sagging", -w * l * l / 8, 0, w * l * l / 8},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			// Shear from statics: V0 = (M1 − M0)/L + wL/2, V1 = V0 − wL;
			// dM/dx = V (section forces).
			v0 := (tc.m1-tc.m0)/l + w*l/2
			v1 := v0 - w*l
			got := hermitePeak([]float64{0, l}, []float64{tc.m0, tc.m1}, []float64{v0, v1})
			if !within(got, tc.want, 1e-12) {
				t.Errorf("peak = %g, want %g", got, tc.want)
			}
		})
	}
	// The sagging peak of the propped cantilever, 9wL²/128, is an interior
	// extremum: check it with the hogging end moment removed from the search.
	m0 := -w * l * l / 8
	v0 := (0-m0)/l + w*l/2
	xs := []float64{0.25 * l, l}
	ms := []float64{m0 + v0*xs[0] - w*xs[0]*xs[0]/2, 0}
	ss := []float64{v0 - w*xs[0], v0 - w*l}
	// source: textbook closed form, propped cantilever under UDL: +9wL²/128
	if got, want := hermitePeak(xs, ms, ss), 9*w*l*l/128; !within(got, want, 1e-12) {
		t.Errorf("propped cantilever sagging peak = %g, want %g", got, want)
	}
}

func TestHermitePeakLinear(t *testing.T) {
	// A linear diagram (no load between the ends) peaks at an end.
	got := hermitePeak([]float64{0, 4000}, []float64{-12e6, 25e6}, []float64{37e6 / 4000, 37e6 / 4000})
	if !within(got, 25e6, 1e-12) {
		t.Errorf("peak = %g, want 25e6", got)
	}
}

// TestConventionsAgree writes one member's internal forces as section forces
// and as end forces and checks that both readings give the same actions.
func TestConventionsAgree(t *testing.T) {
	const l = 3600.0
	// A column in 800 kN compression with a uniform transverse load of
	// 10 N/mm about its major axis and a linear minor-axis moment.
	const w, m0, m1 = 10.0, -5e6, 5e6
	v0 := (m1-m0)/l + w*l/2
	sec := func(x float64) station {
		my := m0 + v0*x - w*x*x/2
		vz := v0 - w*x
		mz := 2e6 - 5e6*x/l
		vy := 5e6 / l // dMz/dx = −Vy
		return station{x: x, f: vec{-800e3, vy, vz}, m: vec{0, my, mz}}
	}
	s0, s1 := sec(0), sec(l)
	asSection := []station{s0, s1}
	asEnd := []station{{x: 0, f: s0.f.scale(-1), m: s0.m.scale(-1)}, s1}

	c1, ok1 := detectConvention(asSection[0].f[0], asSection[1].f[0])
	c2, ok2 := detectConvention(asEnd[0].f[0], asEnd[1].f[0])
	if !ok1 || !ok2 || c1 != ConventionSectionForces || c2 != ConventionEndForces {
		t.Fatalf("detected %v,%v and %v,%v", c1, ok1, c2, ok2)
	}
	n1, a1 := diagram(toSectionForces(asSection, c1), 0, l)
	n2, a2 := diagram(toSectionForces(asEnd, c2), 0, l)
	if n1 != 800e3 || n2 != 800e3 {
		t.Errorf("N* = %g, %g; want 800e3", n1, n2)
	}
	for a := range a1 {
		if a1[a] != a2[a] {
			t.Errorf("axis %d: section forces give %+v, end forces %+v", a, a1[a], a2[a])
		}
	}
	// source: textbook closed form, M_max = M0 + V0²/(2w) where the shear is zero
	if want := m0 + v0*v0/(2*w); !within(a1[0].Peak, want, 1e-12) || !a1[0].Transverse {
		t.Errorf("major peak %g (transverse %v), want %g (transverse)", a1[0].Peak, a1[0].Transverse, want)
	}
	if a1[1].Transverse || a1[1].Peak != 0 || a1[1].Start != 2e6 || a1[1].End != -3e6 {
		t.Errorf("minor axis %+v, want end moments 2e6, -3e6 and no load between the ends", a1[1])
	}
	// Resolving onto principal axes turned by 90° swaps the axes.
	_, rot := diagram(toSectionForces(asSection, c1), math.Pi/2, l)
	if !within(rot[1].Start, -a1[0].Start, 1e-12) || !within(rot[0].Start, a1[1].Start, 1e-12) {
		t.Errorf("turned by 90°: %+v", rot)
	}
}

func TestEquilibrium(t *testing.T) {
	// End forces of a member with no load between the ends balance:
	// F0 + F1 = 0 and M0 + M1 + (L x) × F1 = 0.
	const l = 3000.0
	x := vec{0, 0, 1}
	vz := 3000.0 // N
	f0, f1 := vec{-vz, 0, 500e3}, vec{vz, 0, -500e3}
	// (L z) × F1 = (0, L·vz, 0): the end moments balance that couple.
	m0, m1 := vec{0, 2e6, 0}, vec{0, -l*vz - 2e6, 0}
	if r := equilibriumResidual(f0, m0, f1, m1, x, l); r > 1e-12 {
		t.Errorf("balanced end forces: residual %g", r)
	}
	if r := equilibriumResidual(f0, m0, f1, m1.scale(-1), x, l); r < 0.1 {
		t.Errorf("unbalanced end forces: residual %g", r)
	}
}

func TestQuadRoots(t *testing.T) {
	tests := []struct {
		a, b, c float64
		want    []float64
	}{
		{1, -3, 2, []float64{1, 2}},
		{0, 2, -1, []float64{0.5}},
		{1, 0, 1, nil},
		{0, 0, 1, nil},
	}
	for _, tc := range tests {
		got := quadRoots(tc.a, tc.b, tc.c)
		if len(got) != len(tc.want) {
			t.Errorf("quadRoots(%g,%g,%g) = %v, want %v", tc.a, tc.b, tc.c, got, tc.want)
			continue
		}
		for _, w := range tc.want {
			found := false
			for _, g := range got {
				found = found || within(g, w, 1e-12)
			}
			if !found {
				t.Errorf("quadRoots(%g,%g,%g) = %v, want %v", tc.a, tc.b, tc.c, got, tc.want)
			}
		}
	}
}

func TestParseReal(t *testing.T) {
	tests := []struct {
		in   string
		want float64
		ok   bool
	}{
		{"12.", 12, true}, {"-0.", 0, true}, {"1.E-05", 1e-5, true}, {"4.5000000E+002", 450, true},
		{"3.63797880709171E-12", 3.63797880709171e-12, true}, {"42", 42, true}, {"-1.5e3", -1500, true},
		{"0.0174532925199433", 0.0174532925199433, true}, {"", 0, false}, {"$", 0, false}, {"1.2.3", 0, false}, {"E5", 0, false},
	}
	for _, tc := range tests {
		got, ok := parseReal([]byte(tc.in))
		if ok != tc.ok || (ok && !within(got, tc.want, 1e-15)) {
			t.Errorf("parseReal(%q) = %g, %v; want %g, %v", tc.in, got, ok, tc.want, tc.ok)
		}
	}
}
