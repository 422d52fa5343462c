package aisc360_test

import (
	"math"
	"strings"
	"testing"

	"swaygate/checks"
	"swaygate/checks/aisc360"
	"swaygate/checks/section"
)

// More US customary units (kip, ksi and inch: aisc360_test.go).
const (
	in    = inch
	ft    = 12 * inch
	kipFt = kip * ft
	eUS   = 29000 * ksi // E = 29 000 ksi. source: AISC 360 E3 via standards-notes §4 [C]
)

// wShape is a W shape from its tabulated d, bf, tw, tf and k_des (in), the
// root radius taken as k_des − t_f (standards-notes §6.6).
func wShape(name string, d, bf, tw, tf, kdes float64) section.ISection {
	return section.ISection{Name: name, D: d * in, B: bf * in, Tw: tw * in, Tf: tf * in, R: (kdes - tf) * in}
}

// Tabulated dimensions (in).
var (
	// source: AISC shapes database via a public section table (W14x132: A 38.8, d 14.66, bf 14.73, tf 1.030,
	// tw 0.645, kdes 1.63, Ix 1530, Iy 548, ry 3.76) [L]
	w14x132 = wShape("W14X132", 14.66, 14.725, 0.645, 1.03, 1.63)
	// source: sections.md (steelsnakes US/W.json)
	w14x90 = wShape("W14X90", 14.0, 14.5, 0.44, 0.71, 1.31)
	// source: sections.md (steelsnakes US/W.json)
	w14x99 = wShape("W14X99", 14.2, 14.6, 0.485, 0.78, 1.38)
	// source: public section table (W16x31: A 9.13, d 15.9, bf 5.53, tw 0.275, tf 0.440) [L]; k_des 0.842 from memory
	// (it reproduces the tabulated h/tw = 51.6)
	w16x31 = wShape("W16X31", 15.88, 5.525, 0.275, 0.44, 0.842)
	// HSS12×10×3/8: design wall 0.93 × 0.375 = 0.349 in (AISC 360 B4.2), outside corner radius 2t and
	// inside t (the AISC Manual's convention for computing HSS properties), from memory [M]
	hss12x10 = section.RHS{Name: "HSS12X10X3/8", D: 12 * in, B: 10 * in, T: 0.349 * in, Ro: 0.698 * in, Ri: 0.349 * in}
)

func shapeProps(t *testing.T, s section.Shape) *section.Properties {
	t.Helper()
	p, err := s.Properties()
	if err != nil {
		t.Fatal(err)
	}
	return &p
}

// usColumn is a braced column (K = 1) of length l (mm), Fy in MPa.
func usColumn(p *section.Properties, fy, l float64) checks.Member {
	return checks.Member{
		GlobalID: "C",
		Entity:   "IfcColumn",
		Length:   l,
		Section:  p,
		Material: checks.Material{E: eUS, Fy: fy, Source: "model"},
		Axes: [2]checks.AxisInput{
			{Restraint: checks.Braced, Ke: 1, Direction: checks.DirY},
			{Restraint: checks.Braced, Ke: 1, Direction: checks.DirX},
		},
	}
}

func fullOptions() checks.Options {
	opt := stabilityOptions()
	opt.Scope = "full"
	return opt
}

func capCheck(t *testing.T, el *checks.Element, name string) *checks.CapacityCheck {
	t.Helper()
	cs := el.Combinations[0].Capacity
	for k := range cs {
		if cs[k].Name == name {
			return &cs[k]
		}
	}
	t.Fatalf("no check %s in %v; reasons %v", name, cs, el.Reasons)
	return nil
}

// TestPublishedCompression reproduces the compression examples of the
// AISC Design Examples (standards-notes §6.2).
func TestPublishedCompression(t *testing.T) {
	cases := []struct {
		name   string
		shape  section.Shape
		fy     float64 // ksi
		lx, ly float64 // ft
		phiPn  float64 // kips
		tol    float64 // relative
	}{
		// source: AISC Design Examples E.1A (standards-notes §6.2 [L]): W14×132, Lc = 30 ft, φPn = 893 kips
		{"E.1A W14x132", w14x132, 50, 30, 30, 893, 0.005},
		// source: AISC Design Examples E.1D (standards-notes §6.2 [L]): W14×90, Lcx = 30 ft, Lcy = 15 ft, φPn = 927 kips
		{"E.1D W14x90", w14x90, 50, 30, 15, 927, 0.005},
		// source: AISC Design Examples E.9 (standards-notes §6.2 [L]): HSS12×10×3/8, Lc = 16 ft: 518 kips (Fy = 46),
		// 556 kips (Fy = 50); properties computed from the design wall thickness (tolerance 1 %)
		{"E.9 HSS Fy 46", hss12x10, 46, 16, 16, 518, 0.01},
		{"E.9 HSS Fy 50", hss12x10, 50, 16, 16, 556, 0.01},
		// source: AISC Design Examples E.1E (standards-notes §6.2 [L]): W16×31 with a slender web (E7), Lc = 5, 10,
		// 15 ft: φPn = 313, 190, 87.1 kips
		{"E.1E W16x31 5 ft", w16x31, 50, 5, 5, 313, 0.01},
		{"E.1E W16x31 10 ft", w16x31, 50, 10, 10, 190, 0.01},
		{"E.1E W16x31 15 ft", w16x31, 50, 15, 15, 87.1, 0.01},
		// source: AISC Design Examples H.1B (standards-notes §6.2 [L]): W14×99, Lc = 14 ft, φPn = 1130 kips
		{"H.1B W14x99", w14x99, 50, 14, 14, 1130, 0.005},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			m := usColumn(shapeProps(t, tc.shape), tc.fy*ksi, tc.lx*ft)
			m.Axes[checks.Minor].BucklingLength = tc.ly * ft
			m.Actions = []checks.Actions{{Combination: "ULS", NStar: 50 * kip}}
			rep := run(t, model(m), fullOptions())
			el := &rep.Elements[0]
			c := capCheck(t, el, aisc360.CheckCompression)
			if got := c.Capacity.F() / kip; math.Abs(got-tc.phiPn) > tc.tol*tc.phiPn {
				t.Errorf("φPn = %.1f kips, want %v ± %v %%", got, tc.phiPn, 100*tc.tol)
			}
			wantVerdict(t, el, checks.Pass)
		})
	}
}

// TestH1B reproduces Design Example H.1B: W14×99, Lc = Lb = 14 ft, Cb = 1,
// Pu = 400 kips, Mux = 250 kip-ft, Muy = 80 kip-ft: interaction 0.929.
func TestH1B(t *testing.T) {
	// source: AISC Design Examples H.1B (standards-notes §6.2 [L]): with the published φPn = 1130 kips,
	// φMnx = 642 kip-ft, φMny = 311 kip-ft, 400/1130 + (8/9)(250/642 + 80/311) = 0.929 (H1-1a)
	v, clause := aisc360.Interaction(400, 1130, 250, 642, 80, 311)
	if math.Abs(v-0.929) > 0.0005 || !strings.Contains(clause, "H1-1a") {
		t.Errorf("H1.1 = %.4f (%s), want 0.929 (H1-1a)", v, clause)
	}
	// source: AISC 360 H1.1 (standards-notes §4 [C]): below P_r/P_c = 0.2 the H1-1b form
	if v, clause := aisc360.Interaction(100, 1130, 250, 642, 80, 311); !strings.Contains(clause, "H1-1b") ||
		math.Abs(v-(100/2260.0+250/642.0+80/311.0)) > 1e-12 {
		t.Errorf("H1-1b = %v (%s)", v, clause)
	}

	// The same member through the engine: the design moments are second-order results that include member
	// P-delta (B1 = 1), uniform about each axis (C_b = 1).
	m := usColumn(shapeProps(t, w14x99), 50*ksi, 14*ft)
	m.Actions = []checks.Actions{{Combination: "ULS", Theory: checks.SecondOrder, NStar: 400 * kip,
		Moments: [2]checks.AxisMoments{{Start: 250 * kipFt, End: 250 * kipFt}, {Start: 80 * kipFt, End: 80 * kipFt}}}}
	opt := fullOptions()
	opt.MemberPDeltaModelled = true
	rep := run(t, model(m), opt)
	el := &rep.Elements[0]
	// source: H.1B published φMnx = 642 and φMny = 311 kip-ft; computed from our section properties within 1 %
	// (Zx from the dimensions with fillets r = k_des − t_f is 174.1 in³ against the tabulated 173, Zy 84.0
	// against 83.6; J and Cw from the shape formulas): we get 646.6 and 312.6
	if got := capCheck(t, el, aisc360.CheckFlexureMajor).Capacity.F() / kipFt; math.Abs(got-642) > 0.01*642 {
		t.Errorf("φMnx = %.1f kip-ft, want 642", got)
	}
	if got := capCheck(t, el, aisc360.CheckFlexureMinor).Capacity.F() / kipFt; math.Abs(got-311) > 0.01*311 {
		t.Errorf("φMny = %.1f kip-ft, want 311", got)
	}
	// source: H.1B 0.929 with the published strengths (standards-notes §6.2: the xc test computes 0.924 with
	// φPn = 1137.5); ours 0.924 with our own strengths, within 0.006
	c := capCheck(t, el, aisc360.CheckInteraction)
	near(t, "H1-1a", c.Utilisation, 0.929, 0.006)
	if !strings.Contains(c.Clause, "H1-1a") {
		t.Errorf("clause %q", c.Clause)
	}
	wantVerdict(t, el, checks.Pass)
	near(t, "governing utilisation", el.GoverningUtilisation, c.Utilisation.F(), 1e-12)

	// ASD: Pc = Pn/1.67, Mc = Mn/1.67. source: AISC 360 E1, F1 (Ωc = Ωb = 1.67, standards-notes §4 [M])
	opt.AISCMethod = "asd"
	m.Actions[0].NStar, m.Actions[0].Moments[0].Start, m.Actions[0].Moments[0].End = 250*kip, 150*kipFt, 150*kipFt
	rep = run(t, model(m), opt)
	lrfd := capCheck(t, el, aisc360.CheckCompression).Capacity.F()
	asd := capCheck(t, &rep.Elements[0], aisc360.CheckCompression).Capacity.F()
	if math.Abs(asd*1.67*0.9-lrfd) > 1e-6*lrfd {
		t.Errorf("ASD P_c = %v, LRFD %v", asd, lrfd)
	}
}

// TestCb: F1-1 for linear moment diagrams.
func TestCb(t *testing.T) {
	cases := []struct{ start, end, cb float64 }{
		// source: AISC 360 F1-1 [M] (uniform moment: 1.0; one end zero: 12.5/(2.5 + 2.25 + 2 + 0.75) = 1.667;
		// equal end moments in reverse curvature: 12.5/(2.5 + 1.5 + 0 + 1.5) = 2.273)
		{100, 100, 1.0},
		{100, 0, 1.6667},
		{100, -100, 2.2727},
		{0, 0, 1.0},
	}
	for _, tc := range cases {
		if got := aisc360.Cb(tc.start*1e6, tc.end*1e6); math.Abs(got-tc.cb) > 1e-4 {
			t.Errorf("Cb(%v, %v) = %v, want %v", tc.start, tc.end, got, tc.cb)
		}
	}
}

// TestHandbookModuli: Z and S of the W shapes of sections.md computed from
// their dimensions.
func TestHandbookModuli(t *testing.T) {
	cases := []struct {
		s              section.ISection
		zx, sx, zy, sy float64 // in³
	}{
		// source: sections.md (steelsnakes US/W.json: Zx, Sx, Zy, Sy)
		{w14x90, 157, 143, 75.6, 49.9},
		{wShape("W14X48", 13.8, 8.03, 0.34, 0.595, 1.19), 78.4, 70.2, 19.6, 12.8},
		{wShape("W14X68", 14.0, 10.0, 0.415, 0.72, 1.31), 115, 103, 36.9, 24.2},
		{wShape("W12X65", 12.1, 12.0, 0.39, 0.605, 1.2), 96.8, 87.9, 44.1, 29.1},
		{wShape("W10X33", 9.73, 7.96, 0.29, 0.435, 0.935), 38.8, 35.0, 14.0, 9.2},
		{wShape("W8X31", 8.0, 8.0, 0.285, 0.435, 0.829), 30.4, 27.5, 14.1, 9.27},
		{wShape("W18X50", 18.0, 7.5, 0.355, 0.57, 0.972), 101, 88.9, 16.6, 10.7},
		{w14x99, 173, 157, 83.6, 55.2},
		{wShape("W12X58", 12.2, 10.0, 0.36, 0.64, 1.24), 86.4, 78.0, 32.5, 21.4},
	}
	in3 := in * in * in
	for _, tc := range cases {
		p := shapeProps(t, tc.s)
		for _, v := range []struct {
			what      string
			got, want float64
		}{{"Zx", p.SMajor / in3, tc.zx}, {"Sx", p.ZMajor / in3, tc.sx}, {"Zy", p.SMinor / in3, tc.zy}, {"Sy", p.ZMinor / in3, tc.sy}} {
			// Tabulated values are rounded to 3 figures and the root radius is approximate: 1.5 %.
			if math.Abs(v.got-v.want) > 0.015*v.want {
				t.Errorf("%s: %s = %.2f in³, want %v", tc.s.Name, v.what, v.got, v.want)
			}
		}
	}
}

// TestClassification: Table B4.1 for known shapes, and the verdicts of
// checks that cannot be made.
func TestClassification(t *testing.T) {
	// source: [D] W14×90, Fy = 50 ksi: bf/2tf = 10.2 > 0.38 sqrt(E/Fy) = 9.15 (noncompact flange in flexure,
	// the known W14×90 case), ≤ 0.56 sqrt(E/Fy) = 13.5 (nonslender in compression); AISC 360 Table B4.1 [L]
	m := usColumn(shapeProps(t, w14x90), 50*ksi, 15*ft)
	m.Actions = []checks.Actions{{Combination: "ULS", NStar: 300 * kip, Moments: [2]checks.AxisMoments{{Start: 100 * kipFt, End: 100 * kipFt}}}}
	rep := run(t, model(m), fullOptions())
	el := &rep.Elements[0]
	st := step(el, "lambda,flange")
	if st == nil || !strings.Contains(st.Note, "x: noncompact") || !strings.Contains(st.Note, "nonslender") {
		t.Errorf("flange classification step %+v", st)
	}
	if c := capCheck(t, el, aisc360.CheckFlexureMajor); !strings.Contains(c.Clause, "F3") {
		t.Errorf("clause %q, want F3", c.Clause)
	}

	// No Fy: missing-material; with a grade name: A992 gives 50 ksi.
	m = usColumn(shapeProps(t, w14x90), 0, 15*ft)
	m.Actions = []checks.Actions{{Combination: "ULS", NStar: 300 * kip}}
	rep = run(t, model(m), fullOptions())
	wantReason(t, &rep.Elements[0], checks.CodeMissingMaterial, "")
	wantVerdict(t, &rep.Elements[0], checks.NeedsAnalysis)
	for _, g := range []struct {
		name string
		fy   float64
		s    section.Shape
	}{
		{"ASTM A992", 50, w14x90},     // source: standards-notes §6.2 (E.1: Fy = 50 ksi, A992) [L]
		{"A500 Gr. B", 46, hss12x10},  // source: standards-notes §6.2 (E.9: Fy = 46 ksi, A500 Gr B) [L]
		{"A500-C", 50, hss12x10},      // source: standards-notes §6.2 (E.9: Fy = 50 ksi, A500 Gr C) [L]
		{"A36", 36, w14x90},           // from memory: AISC Manual Table 2-4, A36 Fy = 36 ksi [M]
		{"A572 Grade 50", 50, w14x90}, // from memory: AISC Manual Table 2-4 [M]
	} {
		m = usColumn(shapeProps(t, g.s), 0, 15*ft)
		m.Material.Grade = g.name
		m.Actions = []checks.Actions{{Combination: "ULS", NStar: 100 * kip}}
		rep = run(t, model(m), fullOptions())
		st := step(&rep.Elements[0], "F_y")
		if st == nil || math.Abs(st.Value-g.fy*ksi) > 1e-9*st.Value {
			t.Errorf("%s: F_y step %+v, want %v ksi", g.name, st, g.fy)
		}
	}

	// A built-up I with a slender web in flexure: F4/F5 not implemented.
	m = usColumn(shapeProps(t, section.ISection{Name: "welded plate girder", B: 300, D: 1200, Tw: 8, Tf: 20}), 345, 4000)
	m.Actions = []checks.Actions{{Combination: "ULS", NStar: 100e3, Moments: [2]checks.AxisMoments{{Start: 100e6, End: 100e6}}}}
	rep = run(t, model(m), fullOptions())
	if r := wantReason(t, &rep.Elements[0], checks.CodeUnsupportedProfile, "major"); r != nil && !strings.Contains(r.Message, "F4") {
		t.Errorf("message %q", r.Message)
	}
	wantVerdict(t, &rep.Elements[0], checks.NeedsAnalysis)
}

// TestVerdicts: capacity-exceeded names the check; scope stability is
// unchanged.
func TestVerdicts(t *testing.T) {
	// source: AISC Design Examples E.1A (standards-notes §6.2): φPn = 893 kips; 900 kips exceeds it
	m := usColumn(shapeProps(t, w14x132), 50*ksi, 30*ft)
	m.Actions = []checks.Actions{{Combination: "ULS", NStar: 900 * kip}}
	rep := run(t, model(m), fullOptions())
	el := &rep.Elements[0]
	wantVerdict(t, el, checks.Fail)
	if r := wantReason(t, el, checks.CodeCapacityExceeded, ""); r != nil && !strings.Contains(r.Message, aisc360.CheckCompression) {
		t.Errorf("message %q", r.Message)
	}
	rep = run(t, model(m), stabilityOptions())
	wantVerdict(t, &rep.Elements[0], checks.Pass)
	null(t, "governing utilisation", rep.Elements[0].GoverningUtilisation)
	if len(rep.Elements[0].Combinations[0].Capacity) != 0 || step(&rep.Elements[0], "F_y") != nil {
		t.Error("scope stability ran capacity checks")
	}
}

// TestMonotonic: utilisation grows with P_r and M_r; a stockier section
// never has a lower capacity (property tests on invented members).
func TestMonotonic(t *testing.T) {
	util := func(p *section.Properties, pr, mx, my float64) float64 {
		m := usColumn(p, 345, 4500)
		m.Actions = []checks.Actions{{Combination: "ULS", NStar: pr, Moments: [2]checks.AxisMoments{
			{Start: mx, End: -0.4 * mx}, {Start: my, End: my}}}}
		rep := run(t, model(m), fullOptions())
		return rep.Elements[0].GoverningUtilisation.F()
	}
	for _, s := range []section.Shape{w14x90, w16x31, hss12x10, section.CHS{Name: "HSS", D: 273, T: 9}} {
		p := shapeProps(t, s)
		prev := 0.0
		for pr := 0.0; pr <= 3000e3 && prev <= 1; pr += 150e3 {
			u := util(p, pr, 50e6, 10e6)
			if u < prev-1e-12 {
				t.Errorf("%s: utilisation falls from %v to %v as P_r grows to %v", p.Profile, prev, u, pr)
			}
			prev = u
		}
		prev = 0
		for mx := 0.0; mx <= 800e6 && prev <= 1; mx += 40e6 {
			u := util(p, 500e3, mx, 10e6)
			if u < prev-1e-12 {
				t.Errorf("%s: utilisation falls from %v to %v as M_rx grows to %v", p.Profile, prev, u, mx)
			}
			prev = u
		}
	}
	for _, f := range []float64{0.8, 1.0, 1.3} {
		thin := section.ISection{Name: "W", B: 250, D: 350, Tw: 7 * f, Tf: 11 * f, R: 12}
		thick := section.ISection{Name: "W", B: 250, D: 350, Tw: 7 * f * 1.1, Tf: 11 * f * 1.1, R: 12}
		a, b := util(shapeProps(t, thin), 800e3, 120e6, 10e6), util(shapeProps(t, thick), 800e3, 120e6, 10e6)
		if b > a+1e-12 {
			t.Errorf("f = %v: stockier section utilisation %v above %v", f, b, a)
		}
	}
}

func TestTraceOnDemand(t *testing.T) {
	m := usColumn(shapeProps(t, w14x90), 345, 4000)
	m.Actions = []checks.Actions{
		{Combination: "ULS-1", NStar: 800e3, Moments: [2]checks.AxisMoments{{Start: 40e6, End: -20e6}}},
		{Combination: "ULS-2", NStar: 500e3, Moments: [2]checks.AxisMoments{{Start: 60e6, End: 60e6}, {Start: 5e6, End: 5e6}}},
	}
	inline := run(t, model(m), fullOptions())
	opt := fullOptions()
	opt.TraceOnDemand = true
	rep := run(t, model(m), opt)
	got := rep.AppendTrace(nil, 0)
	want := inline.Elements[0].Trace
	if len(got) != len(want) {
		t.Fatalf("%d steps on demand, %d inline", len(got), len(want))
	}
	for k := range want {
		if got[k].Quantity != want[k].Quantity || got[k].Value != want[k].Value && !(math.IsNaN(got[k].Value) && math.IsNaN(want[k].Value)) {
			t.Fatalf("step %d: %s %v, want %s %v", k, got[k].Quantity, got[k].Value, want[k].Quantity, want[k].Value)
		}
	}
	if step(&inline.Elements[0], "u,interaction") == nil {
		t.Error("no capacity step in the trace")
	}
}
