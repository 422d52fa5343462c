package ifc

import (
	"math"
	"path/filepath"
	"strings"
	"testing"

	"swaygate/checks"
	"swaygate/checks/section"
	"swaygate/reports"
)

func fixture(name string) string { return filepath.Join(fixturesDir, name) }

// TestResultConventions: one load, written as section forces (C1), end
// forces in global coordinates (C2, a rotated column), section forces at
// five stations (C3), gives the same actions; C4's end forces are labelled
// GLOBAL_COORDS but balance only in the member's axes.
func TestResultConventions(t *testing.T) {
	m := extract(t, fixture("results-conventions.ifc"), Options{})
	const l, w, m0 = 3600.0, 10.0, -5e6 // mm, N/mm, N·mm
	v0 := (5e6-m0)/l + w*l/2
	// source: textbook closed form, the largest moment under a uniform load
	// where the shear vanishes: M0 + V0²/(2w)
	peak := m0 + v0*v0/(2*w)
	for _, name := range []string{"C1", "C2", "C3"} {
		c := byName(t, m, name)
		if len(c.Problems) != 0 {
			t.Errorf("%s: %s", name, codes(c))
		}
		a := actionsOf(t, c, "ULS-A")
		closeTo(t, name+" N*", a.NStar, 800e3, 1e-9)
		mj, mn := a.Moments[checks.Major], a.Moments[checks.Minor]
		closeTo(t, name+" major start", mj.Start, -5e6, 1e-9)
		closeTo(t, name+" major end", mj.End, 5e6, 1e-9)
		closeTo(t, name+" major peak", mj.Peak, peak, 1e-9)
		if !mj.Transverse || mj.InteriorUnknown {
			t.Errorf("%s major: %+v, want a load between the ends with a known peak", name, mj)
		}
		closeTo(t, name+" minor start", mn.Start, 2e6, 1e-9)
		closeTo(t, name+" minor end", mn.End, -3e6, 1e-9)
		if mn.Transverse || mn.Peak != 0 {
			t.Errorf("%s minor: %+v", name, mn)
		}
	}
	if d := byName(t, m, "C2").Axes[checks.Major].Direction; d != checks.DirX {
		t.Errorf("C2 (rotated) major direction %v, want X", d)
	}
	c4 := byName(t, m, "C4")
	if codes(c4) != "global-coords-suspect@ULS-A" {
		t.Errorf("C4: %s", codes(c4))
	}
	a := actionsOf(t, c4, "ULS-A")
	if a.NStar != 800e3 || a.Moments[0].Start != -5e6 || a.Moments[0].End != 5e6 || a.Moments[0].Transverse {
		t.Errorf("C4: %+v", a)
	}
}

func TestResultSigns(t *testing.T) {
	m := extract(t, fixture("results-signs.ifc"), Options{})
	c1 := byName(t, m, "C1")
	if codes(c1) != "sign-convention-ambiguous@ULS-A axial-sign-suspect@ULS-T" {
		t.Errorf("C1: %s", codes(c1))
	}
	a := actionsOf(t, c1, "ULS-A")
	mj := a.Moments[checks.Major]
	if !mj.CurvatureUnknown || a.NStar != 0 || checks.MaxMoment(&mj) != 20e6 {
		t.Errorf("C1 ULS-A: %+v", a)
	}
	if got := codes(byName(t, m, "C2")); got != "axial-sign-suspect@ULS-T" {
		t.Errorf("C2: %s", got)
	}
	if got := codes(byName(t, m, "C3")); got != "" {
		t.Errorf("C3 is in compression in ULS-T: %s", got)
	}
	closeTo(t, "C2 ULS-T N*", actionsOf(t, byName(t, m, "C2"), "ULS-T").NStar, -120e3, 1e-12)

	// Declaring the convention removes the ambiguity.
	m = extract(t, fixture("results-signs.ifc"), Options{Convention: ConventionEndForces})
	c1 = byName(t, m, "C1")
	a = actionsOf(t, c1, "ULS-A")
	if hasCode(c1, checks.CodeSignConventionAmbiguous) || a.Moments[0].CurvatureUnknown || a.Moments[0].Start != -10e6 || a.Moments[0].End != 20e6 {
		t.Errorf("declared end forces: %s %+v", codes(c1), a)
	}
	// Declaring the other convention: the axial pattern disagrees, noted.
	m = extract(t, fixture("results-signs.ifc"), Options{Convention: ConventionSectionForces})
	if !hasCode(byName(t, m, "C2"), "sign-convention-declared") {
		t.Errorf("C2: %s", codes(byName(t, m, "C2")))
	}
}

func TestResultsByFactor(t *testing.T) {
	m := extract(t, fixture("results-by-factor.ifc"), Options{})
	if strings.Join(m.Combinations, "|") != "1.2G+1.5Q" {
		t.Errorf("combinations %q", m.Combinations)
	}
	if w := warningCodes(m); w != "load-case-skipped combinations-without-results" {
		t.Errorf("warnings %s", w)
	}
	c := byName(t, m, "C1")
	a := actionsOf(t, c, "1.2G+1.5Q")
	if a.Theory != checks.SecondOrder || a.NStar != 700e3 || a.Moments[0].Start != 3e6 || a.Moments[0].End != 6e6 {
		t.Errorf("actions %+v", a)
	}
	// Opting in: the load case is checked too.
	m = extract(t, fixture("results-by-factor.ifc"), Options{LoadCases: true})
	if strings.Join(m.Combinations, "|") != "G|1.2G+1.5Q" || !strings.Contains(warningCodes(m), "load-case-checked") {
		t.Errorf("combinations %q, warnings %s", m.Combinations, warningCodes(m))
	}
}

func TestPsetActions(t *testing.T) {
	m := extract(t, fixture("pset-actions.ifc"), Options{})
	if strings.Join(m.Combinations, "|") != "ULS-P|design" {
		t.Errorf("combinations %q", m.Combinations)
	}
	p1, p2, p3 := byName(t, m, "P1"), byName(t, m, "P2"), byName(t, m, "P3")
	a := actionsOf(t, p1, "ULS-P")
	if a.Source != "property-set" || a.NStar != 450e3 || a.Moments[0].Start != 12e6 || a.Moments[0].End != -8e6 || a.Moments[1].End != 2.5e6 {
		t.Errorf("P1 actions %+v", a)
	}
	// A transverse load flagged with only end moments known.
	if !a.Moments[0].InteriorUnknown || !a.Moments[0].Transverse || a.Moments[1].InteriorUnknown {
		t.Errorf("P1 moments %+v", a.Moments)
	}
	if a := actionsOf(t, p2, "design"); a.NStar != 300e3 || a.Moments[0].Start != 6e6 {
		t.Errorf("P2 actions %+v", a)
	}
	if len(p3.Actions) != 0 {
		t.Errorf("P3 actions %+v", p3.Actions)
	}
	// Restraint on the type, end conditions fixed-pinned.
	// source: standards-notes §1.2 / AS 4100 Figure 4.6.3.2: braced fixed–pinned 0.85, sway fixed–pinned 2.2
	for _, p := range []*checks.Member{p1, p3} {
		if p.Axes[0].Ke != 0.85 || p.Axes[0].Restraint != checks.Braced || p.Axes[1].Ke != 2.2 || p.Axes[1].Restraint != checks.Sway ||
			p.Axes[0].Source != "end-conditions" {
			t.Errorf("%s axes %+v", p.Name, p.Axes)
		}
	}
	// The occurrence's factor overrides the type's end conditions.
	if p2.Axes[0].Ke != 0.9 || p2.Axes[0].Source != "property-set" || p2.Axes[1].BucklingLength != 2500 {
		t.Errorf("P2 axes %+v", p2.Axes)
	}
	for _, p := range []*checks.Member{p1, p2, p3} {
		// Section from the type's material profile set, length from Qto_ColumnBaseQuantities.
		if p.Section == nil || p.Section.Profile != "200UC46.2" || p.Length != 3300 {
			t.Errorf("%s: section %v length %g", p.Name, p.Section, p.Length)
		}
		if p.Material.E != 200000 || p.Material.Fy != 300 || p.Material.Fu != 440 || p.Material.Grade != "300PLUS" {
			t.Errorf("%s: material %+v", p.Name, p.Material)
		}
	}
	// source: shared/sections.md, 200UC46.2: A = 5900 mm², Ix = 4.59e7, Iy = 1.53e7 mm⁴
	closeTo(t, "200UC46.2 A", p1.Section.A, 5900, 0.01)
	closeTo(t, "200UC46.2 Ix", p1.Section.IMajor, 4.59e7, 0.01)
	closeTo(t, "200UC46.2 Iy", p1.Section.IMinor, 1.53e7, 0.01)
}

// TestImperialUnits: inch, kip, kip-foot and ksi, with a profile turned by
// its Position.
func TestImperialUnits(t *testing.T) {
	m := extract(t, fixture("imperial.ifc"), Options{})
	c := byName(t, m, "W1")
	const kip = 4448.2216152605 // N
	closeTo(t, "length", c.Length, 144*inch, 1e-12)
	closeTo(t, "buckling length", c.Axes[0].BucklingLength, 120*inch, 1e-12)
	closeTo(t, "E", c.Material.E, 29000*6.8947572932, 1e-12)
	closeTo(t, "fy", c.Material.Fy, 50*6.8947572932, 1e-12)
	a := actionsOf(t, c, "LRFD-1")
	closeTo(t, "N*", a.NStar, 500*kip, 1e-12)
	closeTo(t, "M start", a.Moments[0].Start, 40*kip*304.8, 1e-12)
	closeTo(t, "M end", a.Moments[0].End, -20*kip*304.8, 1e-12)
	// source: shared/sections.md, W14X90: A = 26.5 in², Ix = 999 in⁴, Iy = 362 in⁴
	closeTo(t, "A", c.Section.A, 26.5*in2, 0.01)
	closeTo(t, "Ix", c.Section.IMajor, 999*in4, 0.01)
	closeTo(t, "Iy", c.Section.IMinor, 362*in4, 0.01)
	// The profile's Position turns it by 90°: major-axis bending sways in X.
	if c.Axes[checks.Major].Direction != checks.DirX {
		t.Errorf("major direction %v", c.Axes[checks.Major].Direction)
	}
}

func TestProblemFixture(t *testing.T) {
	m := extract(t, fixture("problems.ifc"), Options{MemberTypes: []string{"POST"}})
	want := map[string]string{
		"UNSUPPORTED": checks.CodeUnsupportedProfile,
		"NOGEOMETRY":  checks.CodeMissingSection + " " + checks.CodeMissingLength,
		"SKEWED":      checks.CodeSkewedColumn,
		"MISMATCH":    checks.CodeAxesMismatch,
		"SWAYKE":      "",
		"ENDS":        checks.CodeInvalidRestraint + "/major",
		"MAPPED":      "",
		"TESSELLATED": checks.CodeMissingSection + " " + checks.CodeMissingLength,
		"NOMATERIAL":  "material-unknown",
		"TYPEPROFILE": "",
		"INASSEMBLY":  "",
		"POST1":       "",
	}
	if len(m.Members) != len(want) {
		t.Errorf("%d members, want %d", len(m.Members), len(want))
	}
	for name, w := range want {
		c := byName(t, m, name)
		var got []string
		for _, p := range c.Problems {
			if p.Code != checks.CodeMissingActions {
				s := p.Code
				if p.Axis != "" {
					s += "/" + p.Axis
				}
				got = append(got, s)
			}
		}
		if strings.Join(got, " ") != w {
			t.Errorf("%s: problems %q, want %q", name, strings.Join(got, " "), w)
		}
	}
	skipped := map[string]string{}
	for _, s := range m.Skipped {
		skipped[s.Name] = s.Reason
	}
	if skipped["CONCRETE"] != checks.CodeNotSteel || skipped["DUPLICATE"] != "duplicate-global-id" || len(skipped) != 2 {
		t.Errorf("skipped %v", skipped)
	}
	if c := byName(t, m, "SWAYKE"); c.Axes[0].Ke != 0.8 || c.Axes[0].Restraint != checks.Sway {
		t.Errorf("SWAYKE: %+v (the engine reports the sway ke below 1)", c.Axes[0])
	}
	if c := byName(t, m, "MAPPED"); c.Section == nil || c.Section.Profile != "HE200A" || c.Length != 3000 || c.Axes[0].Direction != checks.DirX {
		t.Errorf("MAPPED: section %v length %g direction %v (a mapped, end-cut extrusion turned 90°)", c.Section, c.Length, c.Axes[0].Direction)
	}
	if c := byName(t, m, "TYPEPROFILE"); c.Section == nil || c.Section.Profile != "HE200A" || c.Length != 2800 {
		t.Errorf("TYPEPROFILE: section %v length %g", c.Section, c.Length)
	}
	if c := byName(t, m, "INASSEMBLY"); c.Storey != "Level 2" || float64(c.StoreyElevation) != 4000 {
		t.Errorf("INASSEMBLY: storey %q at %g (through its assembly)", c.Storey, c.StoreyElevation)
	}
	if c := byName(t, m, "POST1"); c.Entity != "IfcMember" {
		t.Errorf("POST1 entity %q", c.Entity)
	}
	if !strings.Contains(warningCodes(m), "duplicate-global-id") {
		t.Errorf("warnings %s", warningCodes(m))
	}

	// Every IfcMember.
	all := extract(t, fixture("problems.ifc"), Options{MemberTypes: []string{"*"}})
	if len(all.Members) != len(want)+1 {
		t.Errorf("with every IfcMember: %d members", len(all.Members))
	}
	none := extract(t, fixture("problems.ifc"), Options{})
	if len(none.Members) != len(want)-1 {
		t.Errorf("without IfcMember: %d members", len(none.Members))
	}
}

// TestProfiles maps every parametric profile and compares with handbook
// values where the handbook has the section, and with the section package's
// own shapes built from the same dimensions (which checks the attribute
// positions of the mapping).
func TestProfiles(t *testing.T) {
	m := extract(t, fixture("profiles.ifc"), Options{})
	get := func(name string) *section.Properties {
		t.Helper()
		c := byName(t, m, name)
		if c.Section == nil {
			t.Fatalf("%s: no section: %s", name, codes(c))
		}
		return c.Section
	}
	handbook := []struct {
		member, profile string
		a, ix, iy       float64
	}{
		// source: shared/sections.md, IPE-400: A = 84.5 cm², Iy = 23100 cm⁴, Iz = 1320 cm⁴
		{"P00", "IPE400", 84.5 * cm2, 23100 * cm4, 1320 * cm4},
		// source: shared/sections.md, HE-300-B: A = 149 cm², Iy = 25200 cm⁴, Iz = 8560 cm⁴
		{"P01", "HE300B", 149 * cm2, 25200 * cm4, 8560 * cm4},
		// source: shared/sections.md, 360UB50.7: A = 6470 mm², Ix = 1.42e8, Iy = 9.6e6 mm⁴
		{"P02", "360UB50.7", 6470, 1.42e8, 9.6e6},
		// source: shared/sections.md, W14X48: A = 14.1 in², Ix = 484 in⁴, Iy = 51.4 in⁴ (dimensions in mm, fillet kdes − tf)
		{"P03", "W14X48", 14.1 * in2, 484 * in4, 51.4 * in4},
	}
	for _, h := range handbook {
		s := get(h.member)
		if s.Profile != h.profile {
			t.Errorf("%s: profile %q", h.member, s.Profile)
		}
		closeTo(t, h.profile+" A", s.A, h.a, 0.01)
		closeTo(t, h.profile+" I major", s.IMajor, h.ix, 0.01)
		closeTo(t, h.profile+" I minor", s.IMinor, h.iy, 0.01)
	}
	shapes := []struct {
		member string
		shape  section.Shape
	}{
		{"P04", section.AsymmetricI{D: 500, Tw: 10, BottomWidth: 300, BottomThickness: 20, BottomFillet: 12, TopWidth: 200, TopThickness: 15, TopFillet: 10}},
		{"P05", section.RHS{B: 100, D: 150, T: 6, Ri: 6, Ro: 12}},
		{"P06", section.CHS{D: 168.3, T: 6.4}},
		{"P07", section.Rect{B: 300, D: 100}},
		{"P08", section.Circle{D: 100}},
		{"P09", section.Tee{D: 200, B: 150, Tw: 10, Tf: 15, R: 8}},
		{"P10", section.Angle{D: 150, B: 90, T: 10, R: 12, EdgeRadius: 5}},
		{"P11", section.Channel{D: 300, B: 90, Tw: 8, Tf: 16, R: 15}},
		{"P12", section.LippedChannel{D: 203, B: 76, T: 1.5, Lip: 19, Ri: 3}},
		{"P13", section.Zed{D: 203, B: 79, Tw: 1.5, Tf: 1.5, R: 3}},
		{"P16", section.Transformed{Parent: section.ISection{B: 180, D: 400, Tw: 8.6, Tf: 13.5, R: 21}, Rotation: math.Pi / 2}},
		{"P17", section.Channel{D: 300, B: 90, Tw: 8, Tf: 16, R: 15}},
	}
	for _, sc := range shapes {
		want, err := sc.shape.Properties()
		if err != nil {
			t.Fatal(err)
		}
		got := get(sc.member)
		closeTo(t, sc.member+" A", got.A, want.A, 1e-9)
		closeTo(t, sc.member+" I major", got.IMajor, want.IMajor, 1e-9)
		closeTo(t, sc.member+" I minor", got.IMinor, want.IMinor, 1e-9)
		if math.Abs(math.Remainder(got.Angle-want.Angle, math.Pi)) > 1e-9 {
			t.Errorf("%s: angle %g, want %g", sc.member, got.Angle, want.Angle)
		}
	}
	// source: closed forms: rectangle 300 × 100: Iy = 100·300³/12 about the long side's axis; hollow box
	// 200 × 300 × 10: (200·300³ − 180·280³)/12; circle of radius 100 (as arcs): πr⁴/4
	closeTo(t, "FL300x100 I major", get("P07").IMajor, 100*300*300*300/12.0, 1e-12)
	closeTo(t, "box I major", get("P14").IMajor, (200*300*300*300-180*280*280*280)/12.0, 1e-12)
	closeTo(t, "box A", get("P14").A, 200*300-180*280, 1e-12)
	closeTo(t, "round I", get("P15").IMajor, math.Pi*1e8/4, 0.001) // chords of 2°
	closeTo(t, "rounded rectangle A", get("P18").A, 200*100-(4-math.Pi)*400, 0.001)
	// The rectangle is wider than deep: its major axis is the profile's y,
	// along global Y: it sways in X.
	if c := byName(t, m, "P07"); c.Axes[checks.Major].Direction != checks.DirX {
		t.Errorf("P07 major direction %v", c.Axes[checks.Major].Direction)
	}
}

// TestIFC2X3Fixture: the IFC2X3 layouts of the asymmetric I, T, L, U and C
// profiles, IfcMechanicalSteelMaterialProperties, structural profile
// properties and IfcRelConnectsStructuralElement.
func TestIFC2X3Fixture(t *testing.T) {
	m := extract(t, fixture("ifc2x3-steel.ifc"), Options{})
	x4 := extract(t, fixture("profiles.ifc"), Options{})
	pairs := [][2]string{{"K1", "P04"}, {"K2", "P09"}, {"K3", "P10"}, {"K4", "P11"}, {"K5", "P12"}, {"K0", "P14"}}
	for _, p := range pairs {
		a, b := byName(t, m, p[0]), byName(t, x4, p[1])
		if a.Section == nil || b.Section == nil {
			t.Fatalf("%s/%s: no section", p[0], p[1])
		}
		closeTo(t, p[0]+" A", a.Section.A, b.Section.A, 1e-12)
		closeTo(t, p[0]+" I major", a.Section.IMajor, b.Section.IMajor, 1e-12)
		if a.Material.E != 205000 || a.Material.Fy != 275 || a.Material.Fu != 430 || a.Material.Grade != "S275" {
			t.Errorf("%s material %+v", p[0], a.Material)
		}
		if a.Axes[0].Ke != 1 || a.Axes[0].Restraint != checks.Braced {
			t.Errorf("%s restraint from the type's HasPropertySets: %+v", p[0], a.Axes[0])
		}
		if a.Length != 3500 {
			t.Errorf("%s length %g", p[0], a.Length)
		}
	}
	// The box outline has no torsion constant: the model's value fills it,
	// and its second moments, which differ, are noted.
	k0 := byName(t, m, "K0")
	if k0.Section.J != 1.2e8 || !hasCode(k0, "section-properties-differ") {
		t.Errorf("K0: J %g, problems %s", k0.Section.J, codes(k0))
	}
	// K6 is linked to an analytical member: its length (3600) wins over the body's (3500).
	if k6 := byName(t, m, "K6"); k6.Length != 3600 {
		t.Errorf("K6 length %g", k6.Length)
	}
	// K7 has no geometry: its own IfcStructuralProfileProperties give the section.
	if k7 := byName(t, m, "K7"); k7.Section == nil || k7.Section.Source != "model" || k7.Section.A != 5873 ||
		k7.Section.IMajor != 4.568e7 || k7.Section.J != 2.22e5 || k7.Length != 3500 || hasCode(k7, checks.CodeMissingSection) {
		t.Errorf("K7: section %+v length %g problems %s", k7.Section, k7.Length, codes(k7))
	}
	if strings.Join(m.Combinations, "|") != "ULS 1" || !strings.Contains(warningCodes(m), "combinations-without-results") {
		t.Errorf("combinations %q warnings %s", m.Combinations, warningCodes(m))
	}
}

func TestOptionsErrors(t *testing.T) {
	f := readModel(t, fixture("results-signs.ifc"))
	if _, err := Extract(f, Options{Convention: 9}); err == nil {
		t.Error("invalid convention accepted")
	}
	if _, err := Extract(f, Options{MemberTypes: []string{""}}); err == nil {
		t.Error("empty member type accepted")
	}
	if _, err := Extract(nil, Options{}); err == nil {
		t.Error("nil file accepted")
	}
	for _, s := range []string{"", "auto", "section-forces", "end-forces"} {
		if _, err := ParseSignConvention(s); err != nil {
			t.Errorf("%q: %v", s, err)
		}
	}
	if _, err := ParseSignConvention("both"); err == nil {
		t.Error("unknown convention accepted")
	}
}

// TestWorkersDeterministic: the model does not depend on the number of
// goroutines (compared through the member listing, which writes every
// extracted value).
func TestWorkersDeterministic(t *testing.T) {
	listing := func(m *checks.Model) string {
		var b strings.Builder
		if err := reports.WriteMembersJSON(&b, m, reports.Run{}); err != nil {
			t.Fatal(err)
		}
		return b.String()
	}
	for _, path := range []string{filepath.Join(demoDir, "tern-street-depot.ifc"), fixture("problems.ifc"), fixture("results-signs.ifc"), fixture("profiles.ifc")} {
		f := readModel(t, path)
		one, err := Extract(f, Options{Workers: 1, MemberTypes: []string{"*"}})
		if err != nil {
			t.Fatal(err)
		}
		want := listing(one)
		for _, w := range []int{2, 3, 7} {
			m, err := Extract(f, Options{Workers: w, MemberTypes: []string{"*"}})
			if err != nil {
				t.Fatal(err)
			}
			if got := listing(m); got != want {
				t.Errorf("%s: %d workers give another model than one", path, w)
			}
		}
	}
}
