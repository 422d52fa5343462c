package section

import (
	"math"
	"testing"
)

// exact is the tolerance for results that must equal a closed form up to
// rounding.
const exact = 1e-9

func mustProps(t *testing.T, s Shape) Properties {
	t.Helper()
	p, err := s.Properties()
	if err != nil {
		t.Fatalf("%T: %v", s, err)
	}
	return p
}

func TestRectangle(t *testing.T) {
	// source: textbook closed forms A = bd, I = bd³/12, Z = bd²/6, S = bd²/4
	for _, c := range []struct {
		b, d  float64
		angle float64
	}{
		{50, 100, 0},           // deeper than wide: major about x
		{100, 50, math.Pi / 2}, // wider than deep: major about y
	} {
		p := mustProps(t, Rect{B: c.b, D: c.d})
		big, small := math.Max(c.b, c.d), math.Min(c.b, c.d)
		within(t, "A", p.A, c.b*c.d, exact)
		within(t, "IMajor", p.IMajor, small*big*big*big/12, exact)
		within(t, "IMinor", p.IMinor, big*small*small*small/12, exact)
		within(t, "ZMajor", p.ZMajor, small*big*big/6, exact)
		within(t, "ZMinor", p.ZMinor, big*small*small/6, exact)
		within(t, "SMajor", p.SMajor, small*big*big/4, exact)
		within(t, "SMinor", p.SMinor, big*small*small/4, exact)
		within(t, "RMajor", p.RMajor, big/math.Sqrt(12), exact)
		if math.Abs(p.Angle-c.angle) > 1e-12 {
			t.Errorf("%v×%v: Angle = %v, want %v", c.b, c.d, p.Angle, c.angle)
		}
	}
}

func TestRectangleTorsion(t *testing.T) {
	// source: from memory: Saint-Venant coefficients β in J = β·b·t³ for a
	// rectangle b × t (Timoshenko & Goodier, Theory of Elasticity, torsion of
	// rectangular bars): 0.141 (b/t = 1), 0.229 (2), 0.263 (3), 0.281 (4),
	// 0.312 (10), 1/3 (∞); tabulated to three figures.
	for _, c := range []struct{ ratio, beta float64 }{
		{1, 0.141}, {2, 0.229}, {3, 0.263}, {4, 0.281}, {10, 0.312}, {1000, 1.0 / 3},
	} {
		tt := 10.0
		b := c.ratio * tt
		p := mustProps(t, Rect{B: b, D: tt})
		within(t, "J", p.J, c.beta*b*tt*tt*tt, 0.003)
	}
}

func TestCircle(t *testing.T) {
	// source: textbook closed forms for a solid circle: A = πD²/4,
	// I = πD⁴/64, Z = πD³/32, S = D³/6, J = πD⁴/32
	d := 80.0
	p := mustProps(t, Circle{D: d})
	within(t, "A", p.A, math.Pi*d*d/4, exact)
	within(t, "I", p.IMajor, math.Pi*math.Pow(d, 4)/64, exact)
	within(t, "IMinor", p.IMinor, math.Pi*math.Pow(d, 4)/64, exact)
	within(t, "Z", p.ZMajor, math.Pi*d*d*d/32, exact)
	within(t, "S", p.SMajor, d*d*d/6, exact)
	within(t, "SMinor", p.SMinor, d*d*d/6, exact)
	within(t, "J", p.J, math.Pi*math.Pow(d, 4)/32, exact)
	if p.Angle != 0 || p.Iw != 0 {
		t.Errorf("Angle %v Iw %v, want 0, 0", p.Angle, p.Iw)
	}
}

func TestCHS(t *testing.T) {
	// source: textbook closed forms for a tube: A = π(D² − d²)/4,
	// I = π(D⁴ − d⁴)/64, Z = 2I/D, S = (D³ − d³)/6, J = 2I
	for _, c := range []struct{ d, t float64 }{{168.3, 7.1}, {48.3, 3.2}, {610, 12.5}} {
		p := mustProps(t, CHS{D: c.d, T: c.t})
		di := c.d - 2*c.t
		i := math.Pi * (math.Pow(c.d, 4) - math.Pow(di, 4)) / 64
		within(t, "A", p.A, math.Pi*(c.d*c.d-di*di)/4, exact)
		within(t, "IMajor", p.IMajor, i, exact)
		within(t, "IMinor", p.IMinor, i, exact)
		within(t, "Z", p.ZMajor, 2*i/c.d, exact)
		within(t, "S", p.SMajor, (c.d*c.d*c.d-di*di*di)/6, exact)
		within(t, "J", p.J, 2*i, exact)
		if p.Shape != "CHS" || p.Angle != 0 {
			t.Errorf("Shape %q Angle %v", p.Shape, p.Angle)
		}
	}
}

func TestSHSExample62(t *testing.T) {
	// source: standards-notes §6.3 [D] (Steel Designers' Handbook Example
	// 6.2): 200×200×5.0 SHS, Ag = 3814 mm², r ≈ 79.3 mm. Corner radii by
	// the cold-formed convention ro = 2.5t, ri = 1.5t (common practice).
	p := mustProps(t, RHS{Name: "200x200x5.0SHS", B: 200, D: 200, T: 5, Ro: 12.5, Ri: 7.5})
	within(t, "Ag", p.A, 3814, 0.001)
	within(t, "rx", p.RMajor, 79.3, 0.01)
	within(t, "ry", p.RMinor, 79.3, 0.01)
	// Exact corner geometry: each corner removes (1 − π/4)(ro² − ri²).
	// source: textbook (area of a square minus a quarter circle)
	within(t, "A exact", p.A, 200*200-190*190-(4-math.Pi)*(12.5*12.5-7.5*7.5), exact)
	if p.Iw != 0 || p.Angle != 0 {
		t.Errorf("square tube: Iw = %v, Angle = %v, want 0, 0", p.Iw, p.Angle)
	}
	// J by the Bredt formula 4·Ah²·t/p with the mid-wall line, which the
	// corner-corrected product-standard formula exceeds by the small t³p/3.
	// source: textbook (Bredt–Batho thin-walled closed section)
	rc := 10.0
	ah := 195*195 - rc*rc*(4-math.Pi)
	per := 4*195 - 2*rc*(4-math.Pi)
	within(t, "J", p.J, 4*ah*ah*5/per+5*5*5*per/3, exact)
}

func TestRHSSharpEqualsPolygon(t *testing.T) {
	// source: textbook closed forms for a sharp-cornered box:
	// A = BD − bd, I = (BD³ − bd³)/12, S = (BD² − bd²)/4
	b, d, tt := 150.0, 250.0, 8.0
	bi, di := b-2*tt, d-2*tt
	rhs := mustProps(t, RHS{B: b, D: d, T: tt})
	within(t, "A", rhs.A, b*d-bi*di, exact)
	within(t, "Ix", rhs.IMajor, (b*d*d*d-bi*di*di*di)/12, exact)
	within(t, "Iy", rhs.IMinor, (d*b*b*b-di*bi*bi*bi)/12, exact)
	within(t, "Sx", rhs.SMajor, (b*d*d-bi*di*di)/4, exact)
	within(t, "Sy", rhs.SMinor, (d*b*b-di*bi*bi)/4, exact)
	within(t, "Zx", rhs.ZMajor, (b*d*d*d-bi*di*di*di)/(6*d), exact)

	rect := func(w, h float64, cw bool) []Point {
		p := []Point{{-w / 2, -h / 2}, {w / 2, -h / 2}, {w / 2, h / 2}, {-w / 2, h / 2}}
		if cw {
			p[1], p[3] = p[3], p[1]
		}
		return p
	}
	for _, cw := range []bool{false, true} {
		poly := mustProps(t, Polygon{Outer: rect(b, d, !cw), Holes: [][]Point{rect(bi, di, cw)}})
		for _, c := range []struct {
			what      string
			got, want float64
		}{
			{"A", poly.A, rhs.A}, {"IMajor", poly.IMajor, rhs.IMajor}, {"IMinor", poly.IMinor, rhs.IMinor},
			{"ZMajor", poly.ZMajor, rhs.ZMajor}, {"ZMinor", poly.ZMinor, rhs.ZMinor},
			{"SMajor", poly.SMajor, rhs.SMajor}, {"SMinor", poly.SMinor, rhs.SMinor},
		} {
			within(t, c.what, c.got, c.want, exact)
		}
		if poly.Angle != 0 || poly.Shape != "ARB" || !math.IsNaN(poly.J) || !math.IsNaN(poly.Iw) {
			t.Errorf("polygon: Angle %v Shape %q J %v Iw %v", poly.Angle, poly.Shape, poly.J, poly.Iw)
		}
	}
}

func TestIFilletsExact(t *testing.T) {
	// source: standards-notes §6.6 [D]: fillet area (1 − π/4)r², centroid
	// 0.2234r from the web–flange corner (exactly r(10 − 3π)/(12 − 3π)),
	// second moment r⁴(1/3 − π/16) about an axis through the other corner of
	// the r × r square that holds the fillet (the arc's centre, r − e from
	// the centroid); parallel-axis theorem.
	s := ISection{B: 100, D: 200, Tw: 5.6, Tf: 8.5, R: 12}
	p := mustProps(t, s)
	r := s.R
	af := (1 - math.Pi/4) * r * r
	e := r * (10 - 3*math.Pi) / (12 - 3*math.Pi)
	hw := s.D - 2*s.Tf
	a := 2*s.B*s.Tf + hw*s.Tw + 4*af
	within(t, "A", p.A, a, exact)
	ownF := r*r*r*r*(1.0/3-math.Pi/16) - af*(r-e)*(r-e)
	yF := s.D/2 - s.Tf - e // fillet centroid from the x-axis
	ix := 2*(s.B*s.Tf*s.Tf*s.Tf/12+s.B*s.Tf*math.Pow(s.D/2-s.Tf/2, 2)) + s.Tw*hw*hw*hw/12 +
		4*(ownF+af*yF*yF)
	within(t, "Ix", p.IMajor, ix, exact)
	xF := s.Tw/2 + e
	iy := 2*s.Tf*s.B*s.B*s.B/12 + hw*s.Tw*s.Tw*s.Tw/12 + 4*(ownF+af*xF*xF)
	within(t, "Iy", p.IMinor, iy, exact)
	// Plastic modulus about x: flanges, web and fillets, each first moment
	// about the centroid (symmetric: the equal-area axis is the x-axis).
	sx := 2*s.B*s.Tf*(s.D/2-s.Tf/2) + 2*(s.Tw*hw/2)*(hw/4) + 4*af*yF
	within(t, "Sx", p.SMajor, sx, exact)
	sy := 2*(s.Tf*s.B/2)*(s.B/4)*2 + 2*(hw*s.Tw/2)*(s.Tw/4) + 4*af*xF
	within(t, "Sy", p.SMinor, sy, exact)
}

// composite is a textbook sum of rectangles (x0, y0, x1, y1), for checking
// the outline integration independently.
type composite [][4]float64

func (c composite) props() (a, xc, yc, ix, iy, ixy float64) {
	var sx, sy float64
	for _, r := range c {
		ar := (r[2] - r[0]) * (r[3] - r[1])
		a += ar
		sy += ar * (r[0] + r[2]) / 2
		sx += ar * (r[1] + r[3]) / 2
	}
	xc, yc = sy/a, sx/a
	for _, r := range c {
		w, h := r[2]-r[0], r[3]-r[1]
		dx, dy := (r[0]+r[2])/2-xc, (r[1]+r[3])/2-yc
		ix += w*h*h*h/12 + w*h*dy*dy
		iy += h*w*w*w/12 + w*h*dx*dx
		ixy += w * h * dx * dy
	}
	return
}

func TestAnglePrincipalAxes(t *testing.T) {
	// source: textbook composite areas and Mohr's circle:
	// I1,2 = (Ix + Iy)/2 ± √(((Ix − Iy)/2)² + Ixy²), tan 2θ = −2Ixy/(Ix − Iy);
	// an equal angle's principal axes are at 45°.
	for _, c := range []struct{ d, b, t float64 }{{100, 100, 10}, {150, 90, 12}, {75, 125, 8}} {
		s := Angle{D: c.d, B: c.b, T: c.t}
		p := mustProps(t, s)
		x0, y0 := -c.b/2, -c.d/2
		rects := composite{
			{x0, y0, x0 + c.b, y0 + c.t},
			{x0, y0 + c.t, x0 + c.t, y0 + c.d},
		}
		a, xc, yc, ix, iy, ixy := rects.props()
		mean, rr := (ix+iy)/2, math.Hypot((ix-iy)/2, ixy)
		within(t, "A", p.A, a, exact)
		within(t, "Cx", p.Cx, xc, exact)
		within(t, "Cy", p.Cy, yc, exact)
		within(t, "IMajor", p.IMajor, mean+rr, exact)
		within(t, "IMinor", p.IMinor, mean-rr, exact)
		theta := 0.5 * math.Atan2(-2*ixy, ix-iy)
		if math.Abs(p.Angle-theta) > 1e-9 {
			t.Errorf("%v×%v×%v: Angle = %v, want %v", c.d, c.b, c.t, p.Angle, theta)
		}
		if c.d == c.b && math.Abs(p.Angle-math.Pi/4) > 1e-12 {
			t.Errorf("equal angle: Angle = %v, want π/4", p.Angle)
		}
		gx, gy, gxy := p.AxisI()
		within(t, "AxisI x", gx, ix, exact)
		within(t, "AxisI y", gy, iy, exact)
		within(t, "AxisI xy", gxy, ixy, exact)
		// J and Iw thin-walled, on the leg centre lines.
		// source: from memory: AISC Design Guide 9 angle formulas
		// J = Σ b't³/3, Cw = t³(b1'³ + b2'³)/36, b' = leg − t/2
		b1, b2 := c.b-c.t/2, c.d-c.t/2
		within(t, "J", p.J, (b1+b2)*c.t*c.t*c.t/3, exact)
		within(t, "Iw", p.Iw, c.t*c.t*c.t*(b1*b1*b1+b2*b2*b2)/36, exact)
	}
}

func TestTeeSharp(t *testing.T) {
	// source: textbook composite areas; plastic neutral axis at half the
	// area (inside the flange here, 9.5 mm below the top)
	p := mustProps(t, Tee{D: 100, B: 100, Tw: 10, Tf: 10})
	rects := composite{{-50, 40, 50, 50}, {-5, -50, 5, 40}}
	a, _, yc, ix, iy, _ := rects.props()
	within(t, "A", p.A, a, exact)
	within(t, "Cy", p.Cy, yc, exact)
	within(t, "IMajor", p.IMajor, ix, exact)
	within(t, "IMinor", p.IMinor, iy, exact)
	within(t, "ZMajor", p.ZMajor, ix/(yc+50), exact) // the stem tip is the far fibre
	// flange above the axis, flange below it, stem (centroid 45.5 below)
	sx := 100*9.5*(9.5/2) + 100*0.5*(0.5/2) + 900*(0.5+45)
	within(t, "SMajor", p.SMajor, sx, exact)
	within(t, "SMinor", p.SMinor, 10*100*100/4+90*10*10/4, exact)
}

func TestTrianglePlastic(t *testing.T) {
	// source: textbook: a triangle of base b and height h has its centroid
	// h/3 above the base, I = bh³/36, Z = bh²/24 (apex fibre) and its plastic
	// neutral axis h/√2 below the apex; S = ∫|y − c| dA about that axis, and
	// the shape factor S/Z is the classic 2.34 (from memory).
	b, h := 90.0, 120.0 // tall enough that bending about x is major
	p := mustProps(t, Polygon{Outer: []Point{{0, 0}, {b, 0}, {b / 2, h}}})
	a := h / math.Sqrt2
	qAbove := b * a * a * a / (6 * h)
	qBelow := b / h * ((h*h*h-a*a*a)/3 - a*(h*h-a*a)/2)
	within(t, "A", p.A, b*h/2, exact)
	within(t, "Cy", p.Cy, h/3, exact)
	within(t, "Ix", p.IMajor, b*h*h*h/36, exact)
	within(t, "Iy", p.IMinor, h*b*b*b/48, exact)
	within(t, "Zx", p.ZMajor, b*h*h/24, exact)
	within(t, "Sx", p.SMajor, qAbove+qBelow, 1e-9)
	within(t, "Sy", p.SMinor, 2*(h*b/4)*(b/6), 1e-9) // two right triangles, centroids b/6 out
	within(t, "shape factor", p.SMajor/p.ZMajor, 2.343, 0.001)
	if p.Angle != 0 {
		t.Errorf("Angle = %v, want 0", p.Angle)
	}
}

func TestChannelWarping(t *testing.T) {
	// source: from memory: thin-walled channel, b and h on the centre lines,
	// Iw = tf·b³·h²/12 · (3·b·tf + 2·h·tw)/(6·b·tf + h·tw) (Galambos;
	// AISC Design Guide 9)
	s := Channel{D: 300, B: 100, Tw: 10, Tf: 16}
	p := mustProps(t, s)
	b, h := s.B-s.Tw/2, s.D-s.Tf
	iw := s.Tf * b * b * b * h * h / 12 * (3*b*s.Tf + 2*h*s.Tw) / (6*b*s.Tf + h*s.Tw)
	within(t, "Iw", p.Iw, iw, 1e-9)
	within(t, "J", p.J, (2*b*math.Pow(s.Tf, 3)+h*math.Pow(s.Tw, 3))/3, exact)
	// Sharp channel: composite areas.
	// source: textbook composite areas
	a, xc, _, ix, iy, _ := composite{{-50, -150, 50, -134}, {-50, -134, -40, 134}, {-50, 134, 50, 150}}.props()
	within(t, "A", p.A, a, exact)
	within(t, "Cx", p.Cx, xc, exact)
	within(t, "Ix", p.IMajor, ix, exact)
	within(t, "Iy", p.IMinor, iy, exact)
	within(t, "ZMinor", p.ZMinor, iy/(50-xc), exact)
}

func TestZedWarping(t *testing.T) {
	// source: thin-walled zed with equal plates t, flange b and web h on the
	// centre lines: Iw = t·b³·h²·(b + 2h)/(12·(2b + h)) (derived here: the
	// sectorial coordinate about the centroid is 0 on the web and rises to
	// hb/2 at both tips) [D]
	s := Zed{D: 200, B: 80, Tw: 4, Tf: 4}
	p := mustProps(t, s)
	b, h, tt := s.B-s.Tw/2, s.D-s.Tf, 4.0
	within(t, "Iw", p.Iw, tt*b*b*b*h*h*(b+2*h)/(12*(2*b+h)), 1e-9)
	// Principal axes inclined; composite check.
	// source: textbook composite areas and Mohr's circle
	w := s.Tw / 2
	_, _, _, ix, iy, ixy := composite{{-w, -100, -w + 80, -96}, {-w, -96, w, 96}, {w - 80, 96, w, 100}}.props()
	mean, rr := (ix+iy)/2, math.Hypot((ix-iy)/2, ixy)
	within(t, "IMajor", p.IMajor, mean+rr, exact)
	within(t, "IMinor", p.IMinor, mean-rr, exact)
	if th := 0.5 * math.Atan2(-2*ixy, ix-iy); math.Abs(p.Angle-th) > 1e-9 || !(p.Angle > 0) {
		t.Errorf("Angle = %v, want %v (> 0: top flange to −x)", p.Angle, th)
	}
	if math.Abs(p.Cx) > 1e-9 || math.Abs(p.Cy) > 1e-9 {
		t.Errorf("centroid (%v, %v), want the origin", p.Cx, p.Cy)
	}
}

func TestThinWalledI(t *testing.T) {
	// source: thin-walled I with flanges I1, I2 (own minor-axis second
	// moments) h apart: Iw = h²·I1·I2/(I1 + I2); doubly symmetric
	// tf·b³·h²/24 (textbook)
	for _, c := range []struct{ b1, t1, b2, t2, h, tw float64 }{
		{200, 15, 200, 15, 285, 9},
		{300, 20, 150, 10, 500, 10},
	} {
		_, iw := thinWalled(
			[]Point{{-c.b1 / 2, 0}, {0, 0}, {c.b1 / 2, 0}, {0, c.h}, {-c.b2 / 2, c.h}, {c.b2 / 2, c.h}},
			[]twPlate{{0, 1, c.t1}, {1, 2, c.t1}, {1, 3, c.tw}, {3, 4, c.t2}, {3, 5, c.t2}})
		i1, i2 := c.t1*c.b1*c.b1*c.b1/12, c.t2*c.b2*c.b2*c.b2/12
		want := c.h * c.h * i1 * i2 / (i1 + i2)
		within(t, "Iw", iw, want, 1e-9)
		got := iwI(flange{width: c.b1, thick: c.t1}, flange{width: c.b2, thick: c.t2}, c.h+c.t1/2+c.t2/2)
		within(t, "iwI", got, want, 1e-12)
	}
}
