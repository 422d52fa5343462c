package frame

import (
	"math"
	"testing"
)

const (
	// source: standards-notes §1.0 [L], AS 4100 2.2.4: E = 200 000 MPa; G = 80 000 MPa [M].
	testE = 200000.0
	testG = 80000.0
)

// Supports used by the tests (global axes).
var (
	allFixed = [6]bool{true, true, true, true, true, true}
	// A pin that also stops twist about the vertical member axis.
	pinNoTwist = [6]bool{true, true, true, false, false, true}
	// A pin free to slide vertically (top of a strut), no twist.
	rollerZ = [6]bool{true, true, false, false, false, true}
	// Fixed but free to slide vertically.
	slideZ = [6]bool{true, true, false, true, true, true}
)

// strut is a vertical member of length l along global Z from a base node
// to a top node, with the given supports, carrying compression p. Its
// weak axis is local y (Iy = i, Iz = 3i), which bends towards global X.
func strut(l, i, p float64, base, top [6]bool, elements int) *Model {
	return &Model{
		Nodes: []Node{
			{ID: "base", Pos: Vec3{0, 0, 0}, Support: &Support{Fixed: base}},
			{ID: "top", Pos: Vec3{0, 0, l}, Support: &Support{Fixed: top}},
		},
		Members: []Member{{ID: "strut", Nodes: [2]int{0, 1}, E: testE, G: testG, A: 5000, Iy: i, Iz: 3 * i, J: 2e5, Elements: elements}},
		Combinations: []Combination{
			{Name: "C1", Compression: []float64{p}},
		},
	}
}

// xz is the vertical X–Z plane of the plane models: plane X = global X,
// plane Y = global Z, normal −Y.
var xz = Axes{Z: Vec3{0, -1, 0}, X: Vec3{1, 0, 0}}

// portal is a plane portal frame in the X–Z plane: columns of height h and
// second moment ic, a beam of span b and second moment ib, each column
// carrying compression p (the beam none). Bases are fixed or pinned; braced
// adds a horizontal support at the top of the left column. The members are
// nearly inextensible (A = 10⁷ mm²), as the closed forms assume: with real
// areas the columns' shortening lets a stiff beam rock and the frame
// buckles a little earlier (0.25 % with A = 10⁴ mm² here).
func portal(h, b, ic, ib, p float64, fixedBase, braced bool, elements int) *Model {
	base := [6]bool{true, true, true, false, false, false}
	if fixedBase {
		base = allFixed
	}
	var brace *Support
	if braced {
		brace = &Support{Fixed: [6]bool{true, false, false, false, false, false}}
	}
	col := Member{E: testE, A: 1e7, Iy: ic, Elements: elements}
	beam := Member{E: testE, A: 1e7, Iy: ib, Elements: elements}
	m := &Model{
		Plane: &xz,
		Nodes: []Node{
			{ID: "A", Pos: Vec3{0, 0, 0}, Support: &Support{Fixed: base}},
			{ID: "B", Pos: Vec3{0, 0, h}, Support: brace},
			{ID: "C", Pos: Vec3{b, 0, h}},
			{ID: "D", Pos: Vec3{b, 0, 0}, Support: &Support{Fixed: base}},
		},
	}
	c1, bm, c2 := col, beam, col
	c1.ID, c1.Nodes = "left", [2]int{0, 1}
	bm.ID, bm.Nodes = "beam", [2]int{1, 2}
	c2.ID, c2.Nodes = "right", [2]int{3, 2}
	m.Members = []Member{c1, bm, c2}
	m.Combinations = []Combination{{Name: "gravity", Compression: []float64{p, 0, p}}}
	return m
}

// analyze runs Analyze and fails the test on error.
func analyze(t *testing.T, m *Model, o Options) *Result {
	t.Helper()
	r, err := Analyze(m, o)
	if err != nil {
		t.Fatalf("Analyze: %v", err)
	}
	return r
}

// relErr is |got − want| / |want|.
func relErr(got, want float64) float64 { return math.Abs(got-want) / math.Abs(want) }

// bisect returns the root of f in [lo, hi] by bisection (f(lo), f(hi)
// of opposite signs), for closed-form buckling equations.
func bisect(f func(float64) float64, lo, hi float64) float64 {
	flo := f(lo)
	for i := 0; i < 200; i++ {
		mid := (lo + hi) / 2
		fm := f(mid)
		if (fm < 0) == (flo < 0) {
			lo, flo = mid, fm
		} else {
			hi = mid
		}
	}
	return (lo + hi) / 2
}

func isMechanism(err error) bool {
	_, ok := err.(*MechanismError)
	return ok
}
