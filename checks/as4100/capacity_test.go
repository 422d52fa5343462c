package as4100_test

import (
	"math"
	"math/rand/v2"
	"reflect"
	"strconv"
	"strings"
	"testing"

	"swaygate/checks"
	"swaygate/checks/as4100"
	"swaygate/checks/section"
)

// fullOpt are the default options with the capacity checks.
func fullOpt() checks.Options {
	o := stabilityOptions()
	o.Scope = "full"
	return o
}

// capMember is a braced column (ke = 1 both axes) of the given shape and
// length with one combination; grade and fy as given (fy 0 = not given).
func capMember(t *testing.T, id string, shape section.Shape, grade string, fy, length float64, a checks.Actions) checks.Member {
	t.Helper()
	p, err := shape.Properties()
	if err != nil {
		t.Fatal(err)
	}
	return checks.Member{
		GlobalID: id,
		Entity:   "IfcColumn",
		Length:   length,
		Section:  &p,
		Material: checks.Material{E: e, Fy: fy, Grade: grade, Source: "model"},
		Axes: [2]checks.AxisInput{
			{Restraint: checks.Braced, Ke: 1, Direction: checks.DirY},
			{Restraint: checks.Braced, Ke: 1, Direction: checks.DirX},
		},
		Actions: []checks.Actions{a},
	}
}

// axial is a combination with N* (kN) and moments (kNm) about both axes.
func axial(nKN, mxStart, mxEnd, myStart, myEnd float64) checks.Actions {
	return checks.Actions{Combination: "ULS", NStar: nKN * 1e3, Moments: [2]checks.AxisMoments{
		{Start: mxStart * 1e6, End: mxEnd * 1e6}, {Start: myStart * 1e6, End: myEnd * 1e6}}}
}

func runFull(t *testing.T, rs checks.RuleSet, ms ...checks.Member) *checks.Report {
	t.Helper()
	rep, err := checks.Run(model(ms...), rs, fullOpt())
	if err != nil {
		t.Fatal(err)
	}
	return rep
}

// stepValue returns the value of the element's first step with the quantity.
func stepValue(t *testing.T, el *checks.Element, quantity string) float64 {
	t.Helper()
	for _, s := range el.Trace {
		if s.Quantity == quantity {
			return s.Value
		}
	}
	t.Fatalf("%s: no step %q", el.Member.GlobalID, quantity)
	return math.NaN()
}

// stepInput returns the named input of the element's first step with the
// quantity.
func stepInput(t *testing.T, el *checks.Element, quantity, input string) float64 {
	t.Helper()
	for k := range el.Trace {
		if el.Trace[k].Quantity != quantity {
			continue
		}
		for _, in := range el.Trace[k].In() {
			if in.Name == input {
				return in.Value
			}
		}
	}
	t.Fatalf("%s: no input %q of step %q", el.Member.GlobalID, input, quantity)
	return math.NaN()
}

// check returns the named capacity check of combination c.
func check(t *testing.T, el *checks.Element, c int, name string) *checks.CapacityCheck {
	t.Helper()
	cs := el.Combinations[c].Capacity
	for k := range cs {
		if cs[k].Name == name {
			return &cs[k]
		}
	}
	t.Fatalf("%s: no capacity check %q in %+v", el.Member.GlobalID, name, cs)
	return nil
}

func relNear(t *testing.T, what string, got, want, rel float64) {
	t.Helper()
	if !(math.Abs(got-want) <= rel*math.Abs(want)) {
		t.Errorf("%s = %.6g, want %.6g ± %.2g %% (off by %+.2f %%)", what, got, want, rel*100, 100*(got/want-1))
	}
}

// shs200x5 is the 200×200×5.0 SHS of SDH Example 6.2: cold-formed corners
// ro = 2.5t, ri = 1.5t give Ag = 3814 mm².
// source: standards-notes §6.3 [D] (Ag = 3814 mm²); corner radii from memory (AS/NZS 1163 tubes, ro = 2.5t)
var shs200x5 = section.RHS{Name: "200x200x5.0SHS", B: 200, D: 200, T: 5, Ro: 12.5, Ri: 7.5}

// TestSDHExample62 reproduces Steel Designers' Handbook Example 6.2:
// 200×200×5.0 SHS C450L0, le = 3.8 m about both axes.
func TestSDHExample62(t *testing.T) {
	m := capMember(t, "SHS", shs200x5, "C450L0", 0, 3800, axial(500, 0, 0, 0, 0))
	rep := runFull(t, as4100.New(), m)
	el := &rep.Elements[0]
	// source: standards-notes §6.3 [D]: Ag = 3814 mm²
	relNear(t, "A_g", m.Section.A, 3814, 0.001)
	// source: standards-notes §6.3 [D]: λe = 50.98 > 40, kf = 0.785
	relNear(t, "lambda_e", stepValue(t, el, "lambda_e,flange"), 50.98, 0.001)
	relNear(t, "k_f", stepValue(t, el, "k_f"), 0.785, 0.002)
	// source: standards-notes §6.3 [L]: SDH Example 6.2, Ns = 1340 kN published ([D] 1348 kN unrounded)
	relNear(t, "N_s", stepValue(t, el, "N_s"), 1340, 0.01)
	// source: standards-notes §6.3 [L]: SDH Example 6.2, αb = -0.5, αc = 0.876
	relNear(t, "alpha_b", stepValue(t, el, "alpha_b"), -0.5, 0)
	if got := stepValue(t, el, "alpha_c,major"); math.Abs(got-0.876) > 0.0006 {
		t.Errorf("alpha_c = %.4f, want 0.876", got)
	}
	// source: standards-notes §6.3 [L]: SDH Example 6.2, φNc = 1050 kN. The
	// handbook rounds: 0.9 × 0.876 × 1340 = 1056 kN, printed 1050; the
	// unrounded chain here gives 1062 kN (+1.2 % on the printed value, +0.6 %
	// on 1056), so the printed value is checked within 1.2 % and the
	// handbook's own product of its rounded factors within 1 %.
	phiNc := check(t, el, 0, as4100.CheckCompressionMaj).Capacity.F() / 1e3
	relNear(t, "phi N_c (printed 1050)", phiNc, 1050, 0.012)
	relNear(t, "phi N_c (0.9 × 0.876 × 1340)", phiNc, 0.9*0.876*1340, 0.01)
	wantVerdict(t, el, checks.Pass)
}

// TestHollowSectionTables reproduces rows of the hollow-section design
// capacity tables: φNs and φNc against the effective length.
func TestHollowSectionTables(t *testing.T) {
	cases := []struct {
		name  string
		shape section.Shape
		grade string
		phiNs float64   // kN
		le    []float64 // mm
		phiNc []float64 // kN, buckling about x
	}{
		// source: OneSteel DuraGal design capacity tables DCTDHS/06 (March 2002), Table D3.1-3
		// (φNs) and Table D5.2-2(A) (buckling about x), 125×75×2.8 RHS C450L0 (αb = -0.5,
		// slender web, kf < 1); corner radii ro = 2t, ri = t give its 8.39 kg/m [D]
		{"125x75x2.8RHS C450L0", section.RHS{B: 75, D: 125, T: 2.8, Ro: 5.6, Ri: 2.8}, "C450L0", 351,
			[]float64{2000, 3000, 4000, 5000}, []float64{315, 266, 199, 141}},
		// source: Australian Tube Mills, Design Capacity Tables for Structural Steel Hollow
		// Sections (2013), design member capacities in axial compression, 165.1×5.4 CHS
		// (φNs = 610 kN is 0.9·A·250: grade C250L0, kf = 1, αb = -0.5)
		{"165.1x5.4CHS C250L0", section.CHS{D: 165.1, T: 5.4}, "C250L0", 610,
			[]float64{2000, 3000, 4000, 5000}, []float64{581, 544, 490, 418}},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			for k, le := range tc.le {
				m := capMember(t, "T", tc.shape, tc.grade, 0, le, axial(10, 0, 0, 0, 0))
				el := &runFull(t, as4100.New(), m).Elements[0]
				// The tables print three significant figures.
				if got := check(t, el, 0, as4100.CheckSection).Capacity.F() / 1e3; math.Abs(got-tc.phiNs) > 0.5 {
					t.Errorf("phi N_s = %.1f, want %v", got, tc.phiNs)
				}
				if got := check(t, el, 0, as4100.CheckCompressionMaj).Capacity.F() / 1e3; math.Abs(got-tc.phiNc[k]) > 0.5 {
					t.Errorf("le %v: phi N_cx = %.1f, want %v", le, got, tc.phiNc[k])
				}
			}
		})
	}
}

// TestDuraGalSectionCapacities reproduces Table D3.1-3 of the OneSteel
// DuraGal design capacity tables (DCTDHS/06, March 2002): design section
// capacities of C450L0 RHS, φNt (fracture governs, 0.85·An·fu with An =
// Ag), φNs (kf from effective widths), φMsx and φMsy (compact,
// non-compact and slender walls; slender by the effective section).
// Corner radii ro = 2t, ri = t reproduce the tabulated masses within 0.2 %.
func TestDuraGalSectionCapacities(t *testing.T) {
	// source: OneSteel DuraGal DCTDHS/06 Table D3.1-3 (d b t; φNt φNs φMsx φMsy in kN, kNm)
	rows := []struct{ d, b, t, nt, ns, mx, my float64 }{
		{125, 75, 2.8, 409, 351, 16.9, 8.80},
		{125, 75, 2.3, 339, 259, 12.3, 6.50},
		{100, 50, 2.8, 302, 295, 10.2, 5.05},
		{100, 50, 2.3, 251, 215, 8.52, 3.70},
		{75, 50, 2.8, 248, 263, 6.52, 4.71},
		{75, 50, 2.3, 207, 215, 5.49, 3.56},
		{65, 35, 2.8, 194, 206, 4.21, 2.72},
		{65, 35, 2.3, 163, 172, 3.57, 2.16},
		{50, 25, 2.8, 141, 149, 2.26, 1.37},
		{50, 25, 2.3, 119, 126, 1.94, 1.18},
		{50, 20, 2.8, 130, 138, 1.99, 1.02},
		{50, 20, 2.3, 110, 116, 1.71, 0.882},
	}
	for _, r := range rows {
		sh := section.RHS{B: r.b, D: r.d, T: r.t, Ro: 2 * r.t, Ri: r.t}
		m := capMember(t, "RHS", sh, "C450L0", 0, 1000, axial(-1, 0, 0, 0, 0))
		el := &runFull(t, as4100.New(), m).Elements[0]
		name := func(q string) string {
			return q + " of " + strconv.FormatFloat(r.d, 'g', -1, 64) + "x" + strconv.FormatFloat(r.b, 'g', -1, 64) +
				"x" + strconv.FormatFloat(r.t, 'g', -1, 64)
		}
		// Three significant figures in the table: within 0.6 %.
		relNear(t, name("phi N_t"), check(t, el, 0, as4100.CheckSection).Capacity.F()/1e3, r.nt, 0.006)
		relNear(t, name("phi N_s"), as4100.Phi*stepValue(t, el, "N_s"), r.ns, 0.006)
		relNear(t, name("phi M_sx"), as4100.Phi*stepValue(t, el, "M_sx"), r.mx, 0.006)
		relNear(t, name("phi M_sy"), as4100.Phi*stepValue(t, el, "M_sy"), r.my, 0.006)
	}
}

// TestFormFactor460UB checks kf = 0.948 of 460UB74.6 grade 300.
func TestFormFactor460UB(t *testing.T) {
	// from memory: 460UB74.6 d = 457, bf = 190, tf = 14.5, tw = 9.1, r1 = 11.4 mm (Hot Rolled and Structural Steel Products)
	ub := section.ISection{Name: "460UB74.6", B: 190, D: 457, Tw: 9.1, Tf: 14.5, R: 11.4}
	m := capMember(t, "UB", ub, "300PLUS", 0, 4000, axial(100, 0, 0, 0, 0))
	rep := runFull(t, as4100.New(), m)
	el := &rep.Elements[0]
	// source: standards-notes §6.3: kf = 0.948 (Hot Rolled and Structural Steel Products, 7th ed.)
	relNear(t, "k_f", stepValue(t, el, "k_f"), 0.948, 0.001)
	// fy 300 by the 14.5 mm flange. // source: AS 4100 Table 2.1, AS/NZS 3679.1 grade 300 [L]
	relNear(t, "f_y", stepValue(t, el, "f_y"), 300, 0)
}

// TestTensionExample71 checks φNt = 2870 kN of SDH Example 7.1 (part 4):
// 250UC89.5 grade 300, fy = 280 MPa by its 17.3 mm flange.
func TestTensionExample71(t *testing.T) {
	// source: sections.md 250UC89.5 dimensions
	uc := section.ISection{Name: "250UC89.5", B: 256, D: 260, Tw: 10.5, Tf: 17.3, R: 14.0}
	m := capMember(t, "UC", uc, "300", 0, 4000, axial(-2000, 0, 0, 0, 0))
	rep := runFull(t, as4100.New(), m)
	el := &rep.Elements[0]
	// source: standards-notes §6.3 [L]: SDH Example 7.1, φNt = 2870 kN
	relNear(t, "phi N_t", check(t, el, 0, as4100.CheckSection).Capacity.F()/1e3, 2870, 0.002)
	relNear(t, "u", check(t, el, 0, as4100.CheckSection).Utilisation.F(), 2000/2870.0, 0.002) // source: as above
	for _, c := range el.Combinations[0].Capacity {
		if strings.HasPrefix(c.Name, "compression") || strings.HasPrefix(c.Name, "in-plane") {
			t.Errorf("tension member has check %s", c.Name)
		}
	}
	wantVerdict(t, el, checks.Pass)
}

// TestHandbookSectionModulus checks Z, S and the effective modulus Ze of
// the UB and UC sections of sections.md: compactness from the plate
// slenderness (5.2.2) with fy by the flange band of AS/NZS 3679.1 grade 300,
// Ze from the handbook Z and S by 5.2.3 (compact) or 5.2.4 (non-compact).
func TestHandbookSectionModulus(t *testing.T) {
	cases := []struct {
		shape      section.ISection
		zx, sx     float64 // handbook, mm³
		zy, sy     float64
		fy         float64 // by the flange thickness
		compactX   bool
		zex, zey   float64 // [D] from the handbook Z, S
		zeyUnknown bool
	}{
		// source: sections.md (skane88/utilityscripts steel_data.xlsx) for dimensions, Z and S;
		// Ze [D] by AS 4100 5.2.3/5.2.4 from them; compact about x: min(S, 1.5Z) = S
		{section.ISection{Name: "250UB37.3", B: 146, D: 256, Tw: 6.4, Tf: 10.9, R: 8.9}, 4.35e5, 4.86e5, 7.75e4, 1.19e5, 320, true, 4.86e5, 1.1625e5, false},
		{section.ISection{Name: "310UB40.4", B: 165, D: 304, Tw: 6.1, Tf: 10.2, R: 11.4}, 5.69e5, 6.33e5, 9.27e4, 1.42e5, 320, true, 6.33e5, 1.3905e5, false},
		{section.ISection{Name: "360UB50.7", B: 171, D: 356, Tw: 7.3, Tf: 11.5, R: 11.4}, 7.98e5, 8.97e5, 1.12e5, 1.73e5, 300, true, 8.97e5, 1.68e5, false},
		{section.ISection{Name: "460UB82.1", B: 191, D: 460, Tw: 9.9, Tf: 16.0, R: 11.4}, 1.61e6, 1.84e6, 1.95e5, 3.03e5, 300, true, 1.84e6, 2.925e5, false},
		{section.ISection{Name: "150UC30.0", B: 153, D: 158, Tw: 6.6, Tf: 9.4, R: 8.9}, 2.23e5, 2.5e5, 7.34e4, 1.12e5, 320, true, 2.5e5, 1.101e5, false},
		// [D] flange λe = ((203 − 7.3)/2/11)·√(300/250) = 9.74 > 9: non-compact;
		// Ze = 451 + (16 − 9.74)/(16 − 9)·(500 − 451) = 494.8e3; about y 151 + (25 − 9.74)/16·(226.5 − 151) = 223.0e3
		// from memory: the ASI design capacity tables mark 200UC46.2 non-compact about x
		{section.ISection{Name: "200UC46.2", B: 203, D: 203, Tw: 7.3, Tf: 11.0, R: 11.4}, 4.51e5, 5e5, 1.51e5, 2.3e5, 300, false, 4.948e5, 2.230e5, false},
		{section.ISection{Name: "250UC89.5", B: 256, D: 260, Tw: 10.5, Tf: 17.3, R: 14.0}, 1.1e6, 1.23e6, 3.78e5, 5.75e5, 280, true, 1.23e6, 5.67e5, false},
		// [D] flange λe = 10.50: non-compact; Ze = 1450 + (16 − 10.50)/7·150 = 1567.9e3
		// from memory: the ASI design capacity tables give Zex ≈ 1560e3 (non-compact) for 310UC96.8 grade 300
		{section.ISection{Name: "310UC96.8", B: 305, D: 308, Tw: 9.9, Tf: 15.4, R: 16.5}, 1.45e6, 1.6e6, 4.78e5, 7.25e5, 300, false, 1.5679e6, 6.946e5, false},
		{section.ISection{Name: "310UC137", B: 309, D: 321, Tw: 13.8, Tf: 21.7, R: 16.5}, 2.05e6, 2.3e6, 6.91e5, 1.05e6, 280, true, 2.3e6, 1.036e6, false},
	}
	for _, tc := range cases {
		t.Run(tc.shape.Name, func(t *testing.T) {
			m := capMember(t, tc.shape.Name, tc.shape, "300", 0, 4000, axial(100, 10, 10, 1, 1))
			p := m.Section
			relNear(t, "Zx", p.ZMajor, tc.zx, 0.01) // source: sections.md
			relNear(t, "Sx", p.SMajor, tc.sx, 0.01) // source: sections.md
			relNear(t, "Zy", p.ZMinor, tc.zy, 0.01) // source: sections.md
			relNear(t, "Sy", p.SMinor, tc.sy, 0.01) // source: sections.md
			rep := runFull(t, as4100.New(), m)
			el := &rep.Elements[0]
			relNear(t, "f_y", stepValue(t, el, "f_y"), tc.fy, 0) // source: AS 4100 Table 2.1 [L]
			relNear(t, "Zex", stepValue(t, el, "Z_ex"), tc.zex, 0.012)
			relNear(t, "Zey", stepValue(t, el, "Z_ey"), tc.zey, 0.012)
			ls := stepValue(t, el, "lambda_s,major")
			lsp := stepInput(t, el, "lambda_s,major", "lambda_sp")
			// source: AS 4100 5.2.2, Table 5.2 (λep = 9 for a hot-rolled outstand, 82 for a web in bending) [L]
			if got := ls <= lsp; got != tc.compactX {
				t.Errorf("compact about x: %v (lambda_s %.2f, lambda_sp %.0f)", got, ls, lsp)
			}
			relNear(t, "M_sx", stepValue(t, el, "M_sx"), tc.fy*tc.zex/1e6, 0.012) // source: AS 4100 5.2.1, Ms = fy Ze
		})
	}
}

// TestCapacityVerdicts: a utilisation above 1 fails with capacity-exceeded
// naming the check; checks that cannot be made are needs-analysis.
func TestCapacityVerdicts(t *testing.T) {
	uc := section.ISection{Name: "310UC96.8", B: 305, D: 308, Tw: 9.9, Tf: 15.4, R: 16.5} // source: sections.md
	cases := []struct {
		name    string
		member  func(t *testing.T) checks.Member
		opt     func(*checks.Options)
		verdict checks.Verdict
		code    string
		text    string // in the reason's message
	}{
		{"light load passes", func(t *testing.T) checks.Member {
			return capMember(t, "A", uc, "", 300, 4000, axial(800, 50, -20, 5, 5))
		}, nil, checks.Pass, "", ""},
		// Braced, N* = 95 % of Nomb about the minor axis: stable (no
		// amplification problem) but well above φNcy: it must fail.
		// source: design §5.4 and issue 7 (a braced column at 95 % of its buckling load must fail)
		{"95 % of the buckling load", func(t *testing.T) checks.Member {
			m := capMember(t, "B", uc, "", 300, 8000, axial(0, 0, 0, 0, 0))
			m.Actions[0].NStar = 0.95 * checks.Euler(e, m.Section.IMinor, 8000)
			return m
		}, nil, checks.Fail, checks.CodeCapacityExceeded, "compression-minor"},
		{"bending", func(t *testing.T) checks.Member {
			return capMember(t, "C", uc, "", 300, 4000, axial(200, 420, 420, 0, 0))
		}, nil, checks.Fail, checks.CodeCapacityExceeded, "section-major"},
		{"no fy", func(t *testing.T) checks.Member {
			return capMember(t, "D", uc, "S355JR", 0, 4000, axial(200, 0, 0, 0, 0))
		}, nil, checks.NeedsAnalysis, checks.CodeMissingMaterial, "yield"},
		{"fy from the request", func(t *testing.T) checks.Member {
			return capMember(t, "E", uc, "", 0, 4000, axial(200, 0, 0, 0, 0))
		}, func(o *checks.Options) { o.Yield = 300 }, checks.Pass, "", ""},
		{"polygon", func(t *testing.T) checks.Member {
			sq := section.Polygon{Name: "plate", Outer: []section.Point{{X: -100, Y: -100}, {X: 100, Y: -100}, {X: 100, Y: 100}, {X: -100, Y: 100}}}
			return capMember(t, "F", sq, "", 300, 4000, axial(200, 0, 0, 0, 0))
		}, nil, checks.NeedsAnalysis, checks.CodeUnsupportedProfile, "plate"},
		{"angle, axial only", func(t *testing.T) checks.Member {
			return capMember(t, "G", section.Angle{B: 100, D: 100, T: 8, R: 8}, "", 300, 2000, axial(50, 0, 0, 0, 0))
		}, nil, checks.Pass, "", ""},
		{"angle with a major moment", func(t *testing.T) checks.Member {
			return capMember(t, "H", section.Angle{B: 100, D: 100, T: 8, R: 8}, "", 300, 2000, axial(50, 1, 1, 0, 0))
		}, nil, checks.NeedsAnalysis, checks.CodeUnsupportedProfile, "lateral-torsional"},
		{"no plastic modulus, with a moment", func(t *testing.T) checks.Member {
			m := capMember(t, "J", uc, "", 300, 4000, axial(200, 50, 50, 0, 0))
			m.Section.SMajor = math.NaN()
			return m
		}, nil, checks.NeedsAnalysis, checks.CodeMissingSection, "section modulus"},
		{"no area", func(t *testing.T) checks.Member {
			m := capMember(t, "K", uc, "", 300, 4000, axial(200, 0, 0, 0, 0))
			m.Section.A = math.NaN()
			return m
		}, nil, checks.NeedsAnalysis, checks.CodeMissingSection, "area"},
		{"tension with moment", func(t *testing.T) checks.Member {
			return capMember(t, "I", uc, "", 300, 4000, axial(-1000, 500, 500, 0, 0))
		}, nil, checks.Fail, checks.CodeCapacityExceeded, "section-major"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			opt := fullOpt()
			if tc.opt != nil {
				tc.opt(&opt)
			}
			rep, err := checks.Run(model(tc.member(t)), as4100.New(), opt)
			if err != nil {
				t.Fatal(err)
			}
			el := &rep.Elements[0]
			wantVerdict(t, el, tc.verdict)
			if tc.code == "" {
				if !el.GoverningUtilisation.Known() || el.GoverningUtilisation.F() > 1 {
					t.Errorf("governing utilisation %v", el.GoverningUtilisation)
				}
				return
			}
			var found bool
			for _, r := range el.Reasons {
				found = found || (r.Code == tc.code && strings.Contains(r.Message, tc.text))
			}
			if !found {
				t.Errorf("no reason %s naming %q; reasons: %v", tc.code, tc.text, el.Reasons)
			}
			if tc.code == checks.CodeCapacityExceeded && !(el.GoverningUtilisation.F() > 1) {
				t.Errorf("governing utilisation %v, want > 1", el.GoverningUtilisation)
			}
		})
	}
}

// TestStabilityScopeUnchanged: scope stability adds no capacity checks, no
// utilisation, no capacity steps and no capacity reasons; its verdicts do
// not depend on the material.
func TestStabilityScopeUnchanged(t *testing.T) {
	uc := section.ISection{Name: "310UC96.8", B: 305, D: 308, Tw: 9.9, Tf: 15.4, R: 16.5} // source: sections.md
	heavy := capMember(t, "H", uc, "", 300, 4000, axial(200, 420, 420, 0, 0))             // fails capacity in scope full
	noFy := capMember(t, "N", uc, "", 0, 4000, axial(200, 0, 0, 0, 0))                    // missing-material in scope full
	near95 := capMember(t, "B", uc, "", 300, 8000, axial(0, 0, 0, 0, 0))                  // 95 % of Nomb: fails in scope full
	near95.Actions[0].NStar = 0.95 * checks.Euler(e, near95.Section.IMinor, 8000)
	rep, err := checks.Run(model(heavy, noFy, near95), as4100.New(), stabilityOptions())
	if err != nil {
		t.Fatal(err)
	}
	if rep.Scope != "stability" {
		t.Fatalf("default scope %q", rep.Scope) // source: design §5.4 (the default stays stability until every standard has capacity)
	}
	for i := range rep.Elements {
		el := &rep.Elements[i]
		wantVerdict(t, el, checks.Pass) // source: design §5.4, stability scope: pass means amplification permitted
		if el.GoverningUtilisation.Known() {
			t.Errorf("%s: utilisation %v in scope stability", el.Member.GlobalID, el.GoverningUtilisation)
		}
		for _, c := range el.Combinations {
			if len(c.Capacity) != 0 {
				t.Errorf("%s: capacity checks in scope stability", el.Member.GlobalID)
			}
		}
		for _, s := range el.Trace {
			if s.Quantity == "k_f" || strings.HasPrefix(s.Quantity, "u,") {
				t.Errorf("%s: capacity step %q in scope stability", el.Member.GlobalID, s.Quantity)
			}
		}
		noReason(t, el, checks.CodeCapacityExceeded)
		noReason(t, el, checks.CodeMissingMaterial)
	}
	for _, a := range rep.Assumptions {
		if strings.Contains(a, "member capacity") {
			t.Errorf("capacity assumption in scope stability: %q", a)
		}
	}
}

// TestUtilisationGrowsWithLoad: the governing utilisation and every
// check's utilisation never fall as N* or M* grow. (Property test on
// invented members.) // source: AS 4100 Section 8 (capacities fall and amplified moments rise with N*)
func TestUtilisationGrowsWithLoad(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 7))
	shapes := []section.Shape{
		section.ISection{Name: "310UC96.8", B: 305, D: 308, Tw: 9.9, Tf: 15.4, R: 16.5}, // source: sections.md
		section.ISection{Name: "460UB82.1", B: 191, D: 460, Tw: 9.9, Tf: 16.0, R: 11.4}, // source: sections.md
		shs200x5,
		section.CHS{Name: "323.9x6.4CHS", D: 323.9, T: 6.4},
	}
	for _, sh := range shapes {
		for trial := range 5 {
			mx1, mx2 := (rng.Float64()-0.3)*100, (rng.Float64()-0.5)*100
			my1, my2 := (rng.Float64()-0.5)*10, (rng.Float64()-0.5)*10
			var prev []checks.CapacityCheck
			prevGov := math.Inf(-1)
			for step := range 25 {
				n := float64(step) * 60 // kN
				m := capMember(t, "P", sh, "", 350, 4500, axial(n, mx1, mx2, my1, my2))
				el := &runFull(t, as4100.New(), m).Elements[0]
				monotone(t, trial, "N*", n, prev, el.Combinations[0].Capacity, &prevGov, el.GoverningUtilisation.F())
				prev = el.Combinations[0].Capacity
			}
			prev, prevGov = nil, math.Inf(-1)
			for step := range 25 {
				s := 1 + float64(step)*0.25
				m := capMember(t, "Q", sh, "", 350, 4500, axial(300, s*mx1, s*mx2, s*my1, s*my2))
				el := &runFull(t, as4100.New(), m).Elements[0]
				monotone(t, trial, "M* scale", s, prev, el.Combinations[0].Capacity, &prevGov, el.GoverningUtilisation.F())
				prev = el.Combinations[0].Capacity
			}
		}
	}
}

func monotone(t *testing.T, trial int, what string, x float64, prev, cur []checks.CapacityCheck, prevGov *float64, gov float64) {
	t.Helper()
	if math.IsNaN(gov) {
		return // a check could not be made (an unstable member)
	}
	if gov < *prevGov*(1-1e-12) {
		t.Errorf("trial %d, %s = %v: governing utilisation fell from %v to %v", trial, what, x, *prevGov, gov)
	}
	*prevGov = gov
	for _, p := range prev {
		for _, c := range cur {
			if c.Name == p.Name && c.Utilisation.F() < p.Utilisation.F()*(1-1e-12) {
				t.Errorf("trial %d, %s = %v: %s utilisation fell from %v to %v", trial, what, x, c.Name, p.Utilisation.F(), c.Utilisation.F())
			}
		}
	}
}

// TestStockierNeverWeaker: with the same fy, thicker plates never give a
// lower capacity, nor a higher utilisation under the same actions.
// (Property test; fy fixed in the model: a grade's thickness bands can
// lower fy for thicker plates, which is the standard's own effect.)
// source: AS 4100 6.2, 5.2, 6.3.3 (capacities grow with plate thickness at fixed fy)
func TestStockierNeverWeaker(t *testing.T) {
	families := map[string]func(k float64) section.Shape{
		"SHS": func(k float64) section.Shape { return section.RHS{B: 200, D: 200, T: 3 + k, Ro: 0, Ri: 0} },
		"RHS": func(k float64) section.Shape {
			return section.RHS{B: 150, D: 300, T: 3 + k, Ro: 2 * (3 + k), Ri: 3 + k}
		},
		"CHS": func(k float64) section.Shape { return section.CHS{D: 323.9, T: 3 + k} },
		"UC": func(k float64) section.Shape {
			return section.ISection{B: 305, D: 308, Tw: 5 + k, Tf: 7 + k, R: 16.5}
		},
	}
	for name, mk := range families {
		var prev []checks.CapacityCheck
		for k := 0.0; k <= 9; k += 0.5 {
			m := capMember(t, name, mk(k), "", 350, 5000, axial(400, 30, -10, 3, 3))
			el := &runFull(t, as4100.New(), m).Elements[0]
			cur := el.Combinations[0].Capacity
			for _, p := range prev {
				for _, c := range cur {
					if c.Name != p.Name {
						continue
					}
					if c.Unit != "" && c.Capacity.F() < p.Capacity.F()*(1-1e-9) {
						t.Errorf("%s t+%v: %s capacity fell from %v to %v", name, k, c.Name, p.Capacity.F(), c.Capacity.F())
					}
					if c.Utilisation.F() > p.Utilisation.F()*(1+1e-9) {
						t.Errorf("%s t+%v: %s utilisation rose from %v to %v", name, k, c.Name, p.Utilisation.F(), c.Utilisation.F())
					}
				}
			}
			prev = cur
		}
	}
}

// TestCapacityTrace: every capacity step names its clause, the trace built
// on demand equals the stored one, and a rotated section gives the same
// checks as the plain one.
func TestCapacityTrace(t *testing.T) {
	uc := section.ISection{Name: "310UC96.8", B: 305, D: 308, Tw: 9.9, Tf: 15.4, R: 16.5} // source: sections.md
	a := capMember(t, "A", uc, "300", 0, 4000, axial(900, 120, -60, 10, 10))
	b := capMember(t, "B", shs200x5, "C450L0", 0, 3800, axial(400, 20, 20, 5, -5))
	a.Actions = append(a.Actions, axial(500, 60, 60, 0, 0))
	a.Actions[1].Combination = "ULS-2"
	b.Actions = append(b.Actions, axial(-100, 20, 20, 0, 0))
	b.Actions[1].Combination = "ULS-2"
	rep := runFull(t, as4100.New(), a, b)
	capQuantities := map[string]bool{"f_y": true, "k_f": true, "N_s": true, "alpha_b": true, "N_t": true,
		"M_o": true, "alpha_s": true, "alpha_m": true, "M_bx": true, "M_rx": true, "M_ry": true, "M_ix": true,
		"M_iy": true, "M_ox": true, "section interaction": true, "member interaction": true}
	for i := range rep.Elements {
		el := &rep.Elements[i]
		var n int
		for _, s := range el.Trace {
			if capQuantities[s.Quantity] || strings.HasPrefix(s.Quantity, "u,") || strings.HasPrefix(s.Quantity, "lambda_") ||
				strings.HasPrefix(s.Quantity, "Z_e") || strings.HasPrefix(s.Quantity, "M_s") || strings.HasPrefix(s.Quantity, "N_c") {
				n++
				if !strings.HasPrefix(s.Clause, "AS 4100 ") { // source: design §5.5 (every step with its clause)
					t.Errorf("%s: step %q without an AS 4100 clause (%q)", el.Member.GlobalID, s.Quantity, s.Clause)
				}
			}
		}
		if n < 20 {
			t.Errorf("%s: only %d capacity steps", el.Member.GlobalID, n)
		}
	}
	// The trace rebuilt on demand equals the stored one (member values are
	// cached per member, so the order of members must not matter).
	opt := fullOpt()
	opt.TraceOnDemand = true
	lazy, err := checks.Run(model(a, b), as4100.New(), opt)
	if err != nil {
		t.Fatal(err)
	}
	for _, i := range []int{1, 0, 1} {
		got := lazy.AppendTrace(nil, i)
		if !reflect.DeepEqual(got, rep.Elements[i].Trace) {
			t.Errorf("element %d: trace on demand differs (%d vs %d steps)", i, len(got), len(rep.Elements[i].Trace))
		}
		for c := range rep.Elements[i].Combinations {
			if !sameChecks(lazy.Elements[i].Combinations[c].Capacity, rep.Elements[i].Combinations[c].Capacity) {
				t.Errorf("element %d: capacity checks differ with trace on demand", i)
			}
		}
	}
	// A section placed with a rotation and a mirror is the same section.
	rot := capMember(t, "R", section.Transformed{Parent: uc, Rotation: 0.3, Mirror: true, X: 50}, "300", 0, 4000, axial(900, 120, -60, 10, 10))
	rr := runFull(t, as4100.New(), rot)
	for k, c := range rr.Elements[0].Combinations[0].Capacity {
		want := rep.Elements[0].Combinations[0].Capacity[k]
		if c.Name != want.Name || math.Abs(c.Utilisation.F()-want.Utilisation.F()) > 1e-6*math.Abs(want.Utilisation.F()) {
			t.Errorf("rotated: %+v, want %+v", c, want)
		}
	}
}

// sameChecks compares two lists of checks (NaN equal to NaN).
func sameChecks(a, b []checks.CapacityCheck) bool {
	if len(a) != len(b) {
		return false
	}
	eq := func(x, y checks.Num) bool { return x == y || (!x.Known() && !y.Known()) }
	for k := range a {
		x, y := a[k], b[k]
		if x.Name != y.Name || x.Clause != y.Clause || x.Unit != y.Unit ||
			!eq(x.Demand, y.Demand) || !eq(x.Capacity, y.Capacity) || !eq(x.Utilisation, y.Utilisation) {
			return false
		}
	}
	return true
}
