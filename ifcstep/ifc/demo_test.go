package ifc

import (
	"math"
	"path/filepath"
	"strings"
	"testing"

	"swaygate/checks"
)

// The demo model (invented data: internal/demo) in mm/kN and m/N.
func TestDemoModel(t *testing.T) {
	m := extract(t, filepath.Join(demoDir, "tern-street-depot.ifc"), Options{})
	if len(m.Members) != 16 {
		t.Fatalf("%d members, want 16", len(m.Members))
	}
	if len(m.Skipped) != 1 || m.Skipped[0].Reason != checks.CodeNotSteel || !strings.Contains(m.Skipped[0].Name, "SC1") {
		t.Errorf("skipped = %+v, want SC1 not-steel", m.Skipped)
	}
	if want := []string{"ULS-1 1.2G+1.5Q", "ULS-2 1.2G+0.4Q+Wu(X)"}; strings.Join(m.Combinations, "|") != strings.Join(want, "|") {
		t.Errorf("combinations = %q, want %q", m.Combinations, want)
	}
	if len(m.Warnings) != 0 {
		t.Errorf("warnings: %+v", m.Warnings)
	}
	for i := range m.Members {
		mb := &m.Members[i]
		grid := strings.Fields(mb.Name)[1] // "Column A1 Ground Floor"
		edge := grid[0] == 'A' || grid[0] == 'D'
		ground := strings.HasSuffix(mb.Name, "Ground Floor")
		// Frame columns on A and D are rotated: major-axis bending sways in X.
		wantMajor, wantMinor := checks.DirY, checks.DirX
		if edge {
			wantMajor, wantMinor = checks.DirX, checks.DirY
		}
		if mb.Axes[checks.Major].Direction != wantMajor || mb.Axes[checks.Minor].Direction != wantMinor {
			t.Errorf("%s: directions %v/%v, want %v/%v", mb.Name, mb.Axes[0].Direction, mb.Axes[1].Direction, wantMajor, wantMinor)
		}
		wantL, wantStorey, wantElev := 3600.0, "Mezzanine", 4500.0
		if ground {
			wantL, wantStorey, wantElev = 4500, "Ground Floor", 0
		}
		if mb.Length != wantL || mb.Storey != wantStorey || float64(mb.StoreyElevation) != wantElev {
			t.Errorf("%s: length %g storey %q at %g; want %g %q at %g", mb.Name, mb.Length, mb.Storey, mb.StoreyElevation, wantL, wantStorey, wantElev)
		}
		if float64(mb.BaseZ) != wantElev || float64(mb.TopZ) != wantElev+wantL {
			t.Errorf("%s: ends at %g..%g", mb.Name, mb.BaseZ, mb.TopZ)
		}
		if mb.Section == nil || mb.Material.E != 200000 || mb.Material.Source != "model" {
			t.Errorf("%s: section %v, material %+v", mb.Name, mb.Section, mb.Material)
		}
		if grid == "B1" && !ground {
			// Issued without its design data.
			for _, a := range checks.Axes {
				if mb.Axes[a].Restraint != checks.RestraintUnknown || mb.Axes[a].Ke != 0 {
					t.Errorf("B1 mezzanine %v axis: %+v, want no restraint data", a, mb.Axes[a])
				}
			}
			continue
		}
		if len(mb.Problems) != 0 {
			t.Errorf("%s: problems %s", mb.Name, codes(mb))
		}
		if edge && (mb.Axes[checks.Major].Restraint != checks.Sway || mb.Axes[checks.Major].Ke != 1.3) {
			t.Errorf("%s: major axis %+v, want sway ke 1.3", mb.Name, mb.Axes[checks.Major])
		}
		if !edge && (mb.Axes[checks.Major].Restraint != checks.Braced || mb.Axes[checks.Major].Ke != 1) {
			t.Errorf("%s: major axis %+v, want braced ke 1", mb.Name, mb.Axes[checks.Major])
		}
	}
}

// TestDemoActionsMatchSidecar: the end forces written in the demo's analysis
// model give exactly the actions of its side-car CSV (the same invented
// numbers).
func TestDemoActionsMatchSidecar(t *testing.T) {
	m := extract(t, filepath.Join(demoDir, "tern-street-depot.ifc"), Options{})
	sc := readSidecar(t, filepath.Join(demoDir, "tern-street-depot-actions.csv"))
	byID := map[string]*checks.Member{}
	for i := range m.Members {
		byID[m.Members[i].GlobalID] = &m.Members[i]
	}
	for _, r := range sc.Rows {
		mb := byID[r.GlobalID]
		if mb == nil {
			t.Errorf("%s: side-car member not extracted", r.GlobalID)
			continue
		}
		a := actionsOf(t, mb, r.Combination)
		if a.Source != "ifc-results" || a.Theory != checks.FirstOrder {
			t.Errorf("%s %s: source %q theory %v", mb.Name, r.Combination, a.Source, a.Theory)
		}
		closeTo(t, mb.Name+" N*", a.NStar, r.NStar, 1e-9)
		closeTo(t, mb.Name+" major start", a.Moments[0].Start, r.MajorStart, 1e-9)
		closeTo(t, mb.Name+" major end", a.Moments[0].End, r.MajorEnd, 1e-9)
		closeTo(t, mb.Name+" minor start", a.Moments[1].Start, r.MinorStart, 1e-9)
		closeTo(t, mb.Name+" minor end", a.Moments[1].End, r.MinorEnd, 1e-9)
		for ax := range a.Moments {
			if a.Moments[ax].Transverse || a.Moments[ax].InteriorUnknown || a.Moments[ax].CurvatureUnknown {
				t.Errorf("%s %s axis %d: %+v", mb.Name, r.Combination, ax, a.Moments[ax])
			}
		}
	}
}

// TestUnitsRoundTrip: the demo written in mm and kN and in m and N gives the
// same members.
func TestUnitsRoundTrip(t *testing.T) {
	a := extract(t, filepath.Join(demoDir, "tern-street-depot.ifc"), Options{})
	b := extract(t, filepath.Join(demoDir, "tern-street-depot-m-n.ifc"), Options{})
	if len(a.Members) != len(b.Members) || len(a.Skipped) != len(b.Skipped) {
		t.Fatalf("%d/%d members, %d/%d skipped", len(a.Members), len(b.Members), len(a.Skipped), len(b.Skipped))
	}
	const tol = 1e-9
	eq := func(what string, x, y float64) {
		t.Helper()
		if math.IsNaN(x) && math.IsNaN(y) {
			return
		}
		if math.Abs(x-y) > tol*math.Max(math.Abs(x), math.Abs(y)) {
			t.Errorf("%s: %.12g (mm, kN) vs %.12g (m, N)", what, x, y)
		}
	}
	for i := range a.Members {
		p, q := &a.Members[i], &b.Members[i]
		if p.GlobalID != q.GlobalID {
			t.Fatalf("member %d: %s vs %s", i, p.GlobalID, q.GlobalID)
		}
		n := p.Name
		eq(n+" length", p.Length, q.Length)
		eq(n+" elevation", float64(p.StoreyElevation), float64(q.StoreyElevation))
		eq(n+" base", float64(p.BaseZ), float64(q.BaseZ))
		eq(n+" top", float64(p.TopZ), float64(q.TopZ))
		eq(n+" A", p.Section.A, q.Section.A)
		eq(n+" I major", p.Section.IMajor, q.Section.IMajor)
		eq(n+" I minor", p.Section.IMinor, q.Section.IMinor)
		eq(n+" J", p.Section.J, q.Section.J)
		eq(n+" E", p.Material.E, q.Material.E)
		eq(n+" fy", p.Material.Fy, q.Material.Fy)
		for ax := range p.Axes {
			if p.Axes[ax] != q.Axes[ax] {
				t.Errorf("%s axis %d: %+v vs %+v", n, ax, p.Axes[ax], q.Axes[ax])
			}
		}
		if len(p.Actions) != len(q.Actions) {
			t.Fatalf("%s: %d vs %d actions", n, len(p.Actions), len(q.Actions))
		}
		for k := range p.Actions {
			x, y := &p.Actions[k], &q.Actions[k]
			eq(n+" N*", x.NStar, y.NStar)
			for ax := range x.Moments {
				eq(n+" start", x.Moments[ax].Start, y.Moments[ax].Start)
				eq(n+" end", x.Moments[ax].End, y.Moments[ax].End)
				eq(n+" peak", x.Moments[ax].Peak, y.Moments[ax].Peak)
			}
		}
	}
}

// TestDemoHandbookSections: the demo's universal columns against the
// handbook table (shared/sections.md, AS handbook UC values), within 1 %.
func TestDemoHandbookSections(t *testing.T) {
	m := extract(t, filepath.Join(demoDir, "tern-street-depot.ifc"), Options{})
	tests := []struct {
		member       string
		a, ix, iy, j float64
	}{
		// source: shared/sections.md, 310UC96.8: A=12400 mm², Ix=2.23e8, Iy=7.29e7 mm⁴, J=9.28e5 mm⁴
		{"Column A1 Ground Floor", 12400, 2.23e8, 7.29e7, 9.28e5},
		// source: shared/sections.md, 250UC89.5: A=11400, Ix=1.43e8, Iy=4.84e7, J=1.04e6
		{"Column A1 Mezzanine", 11400, 1.43e8, 4.84e7, 1.04e6},
		// source: shared/sections.md, 150UC30.0: A=3860, Ix=1.76e7, Iy=5.62e6, J=1.09e5
		{"Column B1 Mezzanine", 3860, 1.76e7, 5.62e6, 1.09e5},
	}
	for _, tc := range tests {
		s := byName(t, m, tc.member).Section
		closeTo(t, tc.member+" A", s.A, tc.a, 0.01)
		closeTo(t, tc.member+" I major", s.IMajor, tc.ix, 0.01)
		closeTo(t, tc.member+" I minor", s.IMinor, tc.iy, 0.01)
		closeTo(t, tc.member+" J", s.J, tc.j, 0.025) // J formulas differ a little from the tabulated
	}
}

func TestDemoSidecarRoutes(t *testing.T) {
	model := filepath.Join(demoDir, "tern-street-depot.ifc")
	ifcActs := extract(t, model, Options{})
	for _, file := range []string{filepath.Join(demoDir, "tern-street-depot-actions.csv"), filepath.Join(fixturesDir, "depot-actions.json")} {
		m := extract(t, model, Options{Actions: readSidecar(t, file)})
		if strings.Join(m.Combinations, "|") != strings.Join(ifcActs.Combinations, "|") {
			t.Errorf("%s: combinations %q", file, m.Combinations)
		}
		if len(m.Assumptions) == 0 || !strings.Contains(strings.Join(m.Assumptions, "\n"), "side-car") {
			t.Errorf("%s: assumptions %q", file, m.Assumptions)
		}
		for i := range m.Members {
			p, q := &m.Members[i], &ifcActs.Members[i]
			if len(p.Actions) != 2 {
				t.Fatalf("%s: %s has %d actions", file, p.Name, len(p.Actions))
			}
			for k := range p.Actions {
				x, y := p.Actions[k], q.Actions[k]
				if x.Source != "side-car" || !strings.Contains(x.Ref, ":") {
					t.Errorf("%s: source %q ref %q", p.Name, x.Source, x.Ref)
				}
				closeTo(t, p.Name+" N*", x.NStar, y.NStar, 1e-9)
				for ax := range x.Moments {
					closeTo(t, p.Name+" start", x.Moments[ax].Start, y.Moments[ax].Start, 1e-9)
					closeTo(t, p.Name+" end", x.Moments[ax].End, y.Moments[ax].End, 1e-9)
				}
			}
		}
	}

	// A side-car with gaps.
	m := extract(t, model, Options{Actions: readSidecar(t, filepath.Join(fixturesDir, "depot-actions-partial.csv"))})
	if strings.Join(m.Combinations, "|") != "ULS-1|ULS-2" {
		t.Errorf("combinations %q", m.Combinations)
	}
	if warningCodes(m) != checks.CodeUnknownGlobalID || !strings.HasSuffix(m.Warnings[0].Ref, "depot-actions-partial.csv:9") {
		t.Errorf("warnings %+v", m.Warnings)
	}
	b2 := byName(t, m, "Column B2 Mezzanine")
	if len(b2.Actions) != 1 || b2.Actions[0].Combination != "ULS-1" {
		t.Errorf("B2: %+v", b2.Actions)
	}
	c2 := byName(t, m, "Column C2 Mezzanine")
	if a := actionsOf(t, c2, "ULS-1"); a.Theory != checks.SecondOrder || a.Moments[0].Peak != 2.5e6 || a.NStar != 900e3 {
		t.Errorf("C2 ULS-1: %+v", a)
	}
	if n := len(byName(t, m, "Column A2 Mezzanine").Actions); n != 0 {
		t.Errorf("A2 mezzanine has %d side-car actions, want none (the model's own results are not used)", n)
	}
}
