package section

import "math"

// RHS is a rectangular or square hollow section (IFC RectangleHollow),
// centred on the origin, B along x and D along y.
//
// Corner radii are optional: a zero Ro or Ri means a sharp corner. They are
// never defaulted here, because the right values depend on how the tube was
// made (hot-finished tubes have small radii, cold-formed ones ro ≈ 2t to 3t);
// a caller that knows the product standard sets them.
//
// J is the Bredt–Batho closed-section formula with the rounded-corner
// correction of the hollow-section product standards (EN 10219-2, EN
// 10210-2): J = T³·h/3 + 2·K·Ah, with the mean corner radius
// Rc = (Ro + Ri)/2, the mid-wall perimeter h = 2·[(B − T) + (D − T)] −
// 2·Rc·(4 − π), the enclosed area Ah = (B − T)·(D − T) − Rc²·(4 − π) and
// K = 2·Ah·T/h. Iw is the thin-walled closed-section value of a uniform
// rectangular tube on its centre line b = B − T, d = D − T (corners sharp):
// Iw = T·b²·d²·(b − d)²/(24·(b + d)), zero for a square tube.
type RHS struct {
	Name string // designation, copied to Properties.Profile

	B  float64 // outside width along x (IFC XDim), mm
	D  float64 // outside depth along y (IFC YDim), mm
	T  float64 // wall thickness, mm
	Ri float64 // inner corner radius, mm (0: sharp)
	Ro float64 // outer corner radius, mm (0: sharp)
}

// Properties computes the section properties of the hollow section.
func (s RHS) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the outer boundary and the hole, corners as chords of at
// most 5°.
func (s RHS) Outline() (Polygon, error) { return outline(s) }

// Plates returns the two walls parallel to x ("flange", clear width B − 2T)
// and the two parallel to y ("web", clear width D − 2T), all supported along
// both edges, with Fillet the inner corner radius.
func (s RHS) Plates() ([]Plate, error) {
	if _, err := s.build(); err != nil {
		return nil, err
	}
	return []Plate{
		{Part: "flange", Width: s.B - 2*s.T, Thickness: s.T, Fillet: s.Ri, Support: BothEdges, Count: 2},
		{Part: "web", Width: s.D - 2*s.T, Thickness: s.T, Fillet: s.Ri, Support: BothEdges, Count: 2},
	}, nil
}

func (s RHS) build() (def, error) {
	ck := checker{shape: "RHS", name: s.Name}
	ck.positive("B", s.B)
	ck.positive("D", s.D)
	ck.positive("T", s.T)
	ck.nonNegative("Ri", s.Ri)
	ck.nonNegative("Ro", s.Ro)
	if ck.err != nil {
		return def{}, ck.err
	}
	m := math.Min(s.B, s.D)
	ck.less("T", s.T, m/2, "half the smaller outside dimension")
	if ck.err == nil && s.Ro > m/2 {
		ck.failf("Ro", s.Ro, "must not exceed half the smaller outside dimension (%.4g mm)", m/2)
	}
	if ck.err == nil && s.Ri > m/2-s.T {
		ck.failf("Ri", s.Ri, "must not exceed half the smaller inside dimension (%.4g mm)", m/2-s.T)
	}
	// Wall left across a corner, along its diagonal.
	if wall := math.Sqrt2*s.T + (s.Ri-s.Ro)*(math.Sqrt2-1); ck.err == nil && wall <= 0 {
		ck.failf("Ro", s.Ro, "is too large for the inner radius Ri = %.4g mm: the corner has no wall", s.Ri)
	}
	if ck.err != nil {
		return def{}, ck.err
	}
	bx, by := s.B/2, s.D/2
	ix, iy := bx-s.T, by-s.T
	outer := roundedLoop([]corner{
		{x: -bx, y: -by, r: s.Ro, field: "Ro"}, {x: bx, y: -by, r: s.Ro, field: "Ro"},
		{x: bx, y: by, r: s.Ro, field: "Ro"}, {x: -bx, y: by, r: s.Ro, field: "Ro"},
	}, false, &ck)
	inner := roundedLoop([]corner{
		{x: -ix, y: -iy, r: s.Ri, field: "Ri"}, {x: ix, y: -iy, r: s.Ri, field: "Ri"},
		{x: ix, y: iy, r: s.Ri, field: "Ri"}, {x: -ix, y: iy, r: s.Ri, field: "Ri"},
	}, true, &ck)
	if ck.err != nil {
		return def{}, ck.err
	}
	t := s.T
	rc := (s.Ro + s.Ri) / 2
	h := 2*((s.B-t)+(s.D-t)) - 2*rc*(4-math.Pi)
	ah := (s.B-t)*(s.D-t) - rc*rc*(4-math.Pi)
	k := 2 * ah * t / h
	b, d := s.B-t, s.D-t
	return def{
		shape: "RHS", name: s.Name,
		reg: region{loops: []loop{outer, inner}},
		j:   t*t*t*h/3 + 2*k*ah,
		iw:  t * b * b * d * d * (b - d) * (b - d) / (24 * (b + d)),
	}, nil
}

// CHS is a circular hollow section (IFC CircleHollow; its Radius is D/2),
// centred on the origin. J = π·(D⁴ − d⁴)/32 and Iw = 0 exactly.
type CHS struct {
	Name string  // designation, copied to Properties.Profile
	D    float64 // outside diameter, mm
	T    float64 // wall thickness, mm
}

// Properties computes the section properties of the tube.
func (s CHS) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the two circles as 72-sided polygons.
func (s CHS) Outline() (Polygon, error) { return outline(s) }

// Plates returns the wall: Width is the outside diameter, Support is Ring.
func (s CHS) Plates() ([]Plate, error) {
	if _, err := s.build(); err != nil {
		return nil, err
	}
	return []Plate{{Part: "wall", Width: s.D, Thickness: s.T, Support: Ring, Count: 1}}, nil
}

func (s CHS) build() (def, error) {
	ck := checker{shape: "CHS", name: s.Name}
	ck.positive("D", s.D)
	ck.positive("T", s.T)
	if ck.err == nil {
		ck.less("T", s.T, s.D/2, "half the outside diameter")
	}
	if ck.err != nil {
		return def{}, ck.err
	}
	ro, ri := s.D/2, s.D/2-s.T
	return def{
		shape: "CHS", name: s.Name,
		reg: region{loops: []loop{circleLoop(0, 0, ro, false), circleLoop(0, 0, ri, true)}},
		j:   math.Pi / 2 * (ro*ro*ro*ro - ri*ri*ri*ri),
		iw:  0,
	}, nil
}
