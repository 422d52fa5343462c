package framebuckling

import (
	"math"
	"testing"

	"swaygate/checks"
	"swaygate/checks/as4100"
	"swaygate/checks/frame"
	"swaygate/checks/section"
)

// portal builds a plane portal in the X–Z plane: fixed bases, h = b =
// 3000 mm, columns and beam a 100 x 200 rectangle bending about its major
// axis in the plane (R = 1), and the checks model of its two columns plus a
// third column that is not in the frame.
func portal(t *testing.T, p float64) (*checks.Model, *Input) {
	t.Helper()
	props, err := section.Rect{Name: "R100x200", B: 100, D: 200}.Properties()
	if err != nil {
		t.Fatal(err)
	}
	fixed := &frame.Support{Fixed: [6]bool{true, true, true, true, true, true}}
	mk := func(id string, a, b int, axis frame.Vec3) frame.Member {
		return frame.Member{ID: id, Nodes: [2]int{a, b}, E: 200e3, G: 80e3, A: props.A, Iy: props.IMajor, Iz: props.IMinor, J: props.J, Axis: axis}
	}
	fm := &frame.Model{
		Plane: &frame.Axes{Z: frame.Vec3{0, -1, 0}, X: frame.Vec3{1, 0, 0}},
		Nodes: []frame.Node{
			{ID: "N1", Pos: frame.Vec3{0, 0, 0}, Support: fixed},
			{ID: "N2", Pos: frame.Vec3{0, 0, 3000}},
			{ID: "N3", Pos: frame.Vec3{3000, 0, 3000}},
			{ID: "N4", Pos: frame.Vec3{3000, 0, 0}, Support: fixed},
		},
		// Local y along global Y: bending in the plane is about the major axis.
		Members: []frame.Member{mk("left", 0, 1, frame.Vec3{-1, 0, 0}), mk("right", 3, 2, frame.Vec3{-1, 0, 0}), mk("beam", 1, 2, frame.Vec3{0, 0, 1})},
	}
	column := func(id string) checks.Member {
		return checks.Member{GlobalID: id, Entity: "IfcColumn", Length: 3000, Section: &props,
			StoreyKey: "#1", Storey: "Level 1", StoreyElevation: 0, BaseZ: 0, TopZ: 3000,
			Material: checks.Material{E: 200e3, Source: "model"},
			Axes: [2]checks.AxisInput{
				{Restraint: checks.Sway, Ke: 1.2, Direction: checks.DirX},
				{Restraint: checks.Braced, Ke: 1, Direction: checks.DirY},
			},
			Actions: []checks.Actions{{Combination: "ULS", NStar: p, Source: "side-car"}},
		}
	}
	m := &checks.Model{Combinations: []string{"ULS"},
		Members: []checks.Member{column("left"), column("right"), column("outside")}}
	in := &Input{Name: "portal", Model: fm, Columns: [][]int{{0}, {1}, nil}}
	return m, in
}

// TestProviderPortal: lambda_c of the sway axes of the frame's columns is
// the frame's sway buckling load factor, Pcr/P with Pcr = 7.3792 EI/h²
// (R = 1, fixed bases), the column outside the frame falls back to the
// storey method with frame-fallback, and the report carries the frame.
// source: standards-notes §5 [D], Timoshenko & Gere §2.8, (kh)·cot(kh) = −6R, kh = 2.71646
func TestProviderPortal(t *testing.T) {
	const p = 1000e3
	m, in := portal(t, p)
	an := Analyze(m, in, Options{Frame: frame.Options{Elements: 8}, Diaphragms: true})
	if an.Err != nil {
		t.Fatal(an.Err)
	}
	want := 7.3792 * 200e3 * in.Model.Members[0].Iy / (3000 * 3000) / p // source: standards-notes §5 [D]
	opt := stabilityOptions()
	opt.SwayMethod = "frame"
	rep, err := checks.RunWith(m, as4100.New(), an.Provider(), opt)
	if err != nil {
		t.Fatal(err)
	}
	for i := 0; i < 2; i++ {
		ar := rep.Elements[i].Combinations[0].Axes[checks.Major]
		if got := ar.LambdaC.F(); math.Abs(got-want) > 0.01*want {
			t.Errorf("column %d: lambda_c %.4f, want %.4f within 1 %%", i, got, want)
		}
		for _, r := range rep.Elements[i].Reasons {
			if r.Code == checks.CodeFrameFallback {
				t.Errorf("column %d is in the frame but fell back: %s", i, r.Message)
			}
		}
	}
	fell := false
	for _, r := range rep.Elements[2].Reasons {
		fell = fell || r.Code == checks.CodeFrameFallback
	}
	if !fell {
		t.Errorf("the column outside the frame has no frame-fallback reason: %+v", rep.Elements[2].Reasons)
	}
	if got := rep.Elements[2].Combinations[0].Axes[checks.Major].LambdaC.F(); !(got > 0) || math.Abs(got-want) < 0.05*want {
		t.Errorf("the column outside the frame took lambda_c %.4f: want the storey method's value", got)
	}
	f := rep.Frame
	if f == nil || !f.Plane || f.Covered != 2 || f.FellBack != 1 || len(f.Members) != 3 || len(f.Combinations) != 1 {
		t.Fatalf("frame report %+v", f)
	}
	c := f.Combinations[0]
	if math.Abs(c.LambdaC.F()-want) > 0.01*want || math.Abs(c.LambdaX.F()-want) > 0.01*want || len(c.Mode) != 4 {
		t.Errorf("frame combination: lambda_c %.4f, x %.4f, %d mode nodes", c.LambdaC.F(), c.LambdaX.F(), len(c.Mode))
	}
	// The sway mode: both column tops translate equally in X, the bases not.
	if math.Abs(math.Abs(c.Mode[1].UX)-1) > 1e-3 || math.Abs(c.Mode[1].UX-c.Mode[2].UX) > 1e-3 || c.Mode[0].UX != 0 {
		t.Errorf("mode %+v: want a sway of the top", c.Mode)
	}
}

// TestProviderNoFrame: without an analysable frame every sway axis takes
// the storey method (frame-fallback) and the run goes on.
func TestProviderNoFrame(t *testing.T) {
	m, _ := portal(t, 1000e3)
	an := Unavailable(m, "the model has no analytical frame")
	opt := stabilityOptions()
	opt.SwayMethod = "frame"
	rep, err := checks.RunWith(m, as4100.New(), an.Provider(), opt)
	if err != nil {
		t.Fatal(err)
	}
	for i := range rep.Elements {
		fell := false
		for _, r := range rep.Elements[i].Reasons {
			fell = fell || r.Code == checks.CodeFrameFallback
		}
		if !fell {
			t.Errorf("member %d: no frame-fallback", i)
		}
		// source: common practice — the fallback is the storey method's own lambda_c, form A = form B for equal columns.
		if l := rep.Elements[i].Combinations[0].Axes[checks.Major].LambdaC.F(); !(l > 0) {
			t.Errorf("member %d: storey lambda_c %g", i, l)
		}
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
