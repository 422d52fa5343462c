package section

import "math"

// Rect is a solid rectangle (IFC Rectangle), centred on the origin, B along
// x and D along y. When B > D the larger principal second moment is about y
// and Angle is π/2.
//
// J is Saint-Venant's series for a rectangle of long side b and short side
// t: J = (b·t³/3)·[1 − (192/π⁵)·(t/b)·Σ_{n odd} tanh(nπb/2t)/n⁵]. Iw is
// the thin-plate value b³·t³/144 (exact only as t/b → 0; small for any
// rectangle).
type Rect struct {
	Name string  // designation, copied to Properties.Profile
	B    float64 // width along x, mm
	D    float64 // depth along y, mm
}

// Properties computes the section properties of the rectangle.
func (s Rect) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the rectangle.
func (s Rect) Outline() (Polygon, error) { return outline(s) }

func (s Rect) build() (def, error) {
	ck := checker{shape: "Rect", name: s.Name}
	ck.positive("B", s.B)
	ck.positive("D", s.D)
	if ck.err != nil {
		return def{}, ck.err
	}
	bx, by := s.B/2, s.D/2
	l := roundedLoop([]corner{{x: -bx, y: -by}, {x: bx, y: -by}, {x: bx, y: by}, {x: -bx, y: by}}, false, &ck)
	b, t := math.Max(s.B, s.D), math.Min(s.B, s.D)
	return def{
		shape: "RECT", name: s.Name,
		reg: region{loops: []loop{l}},
		j:   jRect(b, t),
		iw:  b * b * b * t * t * t / 144,
	}, nil
}

// jRect is Saint-Venant's torsion constant of a b × t rectangle, b ≥ t.
func jRect(b, t float64) float64 {
	var sum float64
	for n := 1.0; n < 200; n += 2 {
		term := math.Tanh(n*math.Pi*b/(2*t)) / (n * n * n * n * n)
		sum += term
		if term < 1e-17*sum {
			break
		}
	}
	return b * t * t * t / 3 * (1 - 192/math.Pow(math.Pi, 5)*(t/b)*sum)
}

// Circle is a solid circle (IFC Circle; its Radius is D/2) centred on the
// origin. J = π·D⁴/32 and Iw = 0 exactly.
type Circle struct {
	Name string  // designation, copied to Properties.Profile
	D    float64 // diameter, mm
}

// Properties computes the section properties of the circle.
func (s Circle) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the circle as a 72-sided polygon.
func (s Circle) Outline() (Polygon, error) { return outline(s) }

func (s Circle) build() (def, error) {
	ck := checker{shape: "Circle", name: s.Name}
	ck.positive("D", s.D)
	if ck.err != nil {
		return def{}, ck.err
	}
	r := s.D / 2
	return def{
		shape: "CIRC", name: s.Name,
		reg: region{loops: []loop{circleLoop(0, 0, r, false)}},
		j:   math.Pi / 2 * r * r * r * r,
		iw:  0,
	}, nil
}
