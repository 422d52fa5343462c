package section

import (
	"math"
	"testing"
)

var ipe200 = ISection{Name: "IPE200", B: 100, D: 200, Tw: 5.6, Tf: 8.5, R: 12}

func TestTransformedRotatedI(t *testing.T) {
	// source: textbook: principal second moments and moduli are invariant
	// under rotation; turning an I by 90° makes its major axis the y-axis
	// (Angle π/2) and swaps the second moments about x and y.
	base := mustProps(t, ipe200)
	p := mustProps(t, Transformed{Parent: ipe200, Rotation: math.Pi / 2})
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"A", p.A, base.A}, {"IMajor", p.IMajor, base.IMajor}, {"IMinor", p.IMinor, base.IMinor},
		{"ZMajor", p.ZMajor, base.ZMajor}, {"ZMinor", p.ZMinor, base.ZMinor},
		{"SMajor", p.SMajor, base.SMajor}, {"SMinor", p.SMinor, base.SMinor},
		{"J", p.J, base.J}, {"Iw", p.Iw, base.Iw},
	} {
		within(t, c.what, c.got, c.want, exact)
	}
	if math.Abs(p.Angle-math.Pi/2) > 1e-12 {
		t.Errorf("Angle = %v, want π/2", p.Angle)
	}
	ix, iy, ixy := p.AxisI()
	within(t, "Ix (rotated)", ix, base.IMinor, exact)
	within(t, "Iy (rotated)", iy, base.IMajor, exact)
	if math.Abs(ixy) > 1e-9*base.IMajor {
		t.Errorf("Ixy = %v, want 0", ixy)
	}
	if p.Profile != "IPE200" || p.Shape != "I" {
		t.Errorf("Profile %q Shape %q", p.Profile, p.Shape)
	}
}

func TestTransformedMoveScaleMirror(t *testing.T) {
	// source: textbook: under p' = k·R·M·p + d, areas scale by k², second
	// moments by k⁴, moduli by k³; the centroid moves with the points.
	ang := Angle{D: 150, B: 90, T: 12, R: 11, EdgeRadius: 4.8}
	base := mustProps(t, ang)
	k, rot := 2.0, 0.3
	tr := Transformed{Name: "L150x90x12 derived", Parent: ang, Rotation: rot, Mirror: true, Scale: k, X: 1000, Y: -500}
	p := mustProps(t, tr)
	within(t, "A", p.A, k*k*base.A, exact)
	within(t, "IMajor", p.IMajor, math.Pow(k, 4)*base.IMajor, exact)
	within(t, "IMinor", p.IMinor, math.Pow(k, 4)*base.IMinor, exact)
	within(t, "ZMajor", p.ZMajor, k*k*k*base.ZMajor, exact)
	within(t, "ZMinor", p.ZMinor, k*k*k*base.ZMinor, exact)
	within(t, "SMajor", p.SMajor, k*k*k*base.SMajor, 1e-8)
	within(t, "SMinor", p.SMinor, k*k*k*base.SMinor, 1e-8)
	within(t, "J", p.J, math.Pow(k, 4)*base.J, exact)
	within(t, "Iw", p.Iw, math.Pow(k, 6)*base.Iw, exact)
	s, c := math.Sincos(rot)
	cx, cy := base.Cx, -base.Cy // mirror y → −y first
	within(t, "Cx", p.Cx, k*(c*cx-s*cy)+1000, exact)
	within(t, "Cy", p.Cy, k*(s*cx+c*cy)-500, exact)
	if want := principalAngle(-base.Angle + rot); math.Abs(p.Angle-want) > 1e-9 {
		t.Errorf("Angle = %v, want %v", p.Angle, want)
	}
	if p.Profile != "L150x90x12 derived" || p.Geometry != Shape(tr) {
		t.Errorf("Profile %q Geometry %T", p.Profile, p.Geometry)
	}
}

// opaque is a Shape with properties but no outline.
type opaque struct{ p Properties }

func (o opaque) Properties() (Properties, error) { return o.p, nil }

// outlined is a Shape that can give its outline.
type outlined struct{ poly Polygon }

func (o outlined) Outline() (Polygon, error) { return o.poly, nil }

func (o outlined) Properties() (Properties, error) {
	p, err := o.poly.Properties()
	p.J, p.Iw = 123, 456
	return p, err
}

func TestTransformedForeignParents(t *testing.T) {
	// source: as TestTransformedMoveScaleMirror (invariance of principal
	// values under similarity transforms)
	ang := Angle{D: 100, B: 60, T: 8}
	base := mustProps(t, ang)
	rot, k := 0.7, 1.5

	p := mustProps(t, Transformed{Parent: opaque{base}, Rotation: rot, Scale: k, X: 5})
	within(t, "mapped IMajor", p.IMajor, math.Pow(k, 4)*base.IMajor, exact)
	within(t, "mapped SMinor", p.SMinor, k*k*k*base.SMinor, exact)
	within(t, "mapped Iw", p.Iw, math.Pow(k, 6)*base.Iw, exact)
	if want := principalAngle(base.Angle + rot); math.Abs(p.Angle-want) > 1e-12 {
		t.Errorf("mapped Angle = %v, want %v", p.Angle, want)
	}

	poly, err := ang.Outline()
	if err != nil {
		t.Fatal(err)
	}
	q := mustProps(t, Transformed{Parent: outlined{poly}, Rotation: rot, Scale: k})
	within(t, "outline IMajor", q.IMajor, math.Pow(k, 4)*base.IMajor, exact)
	within(t, "outline SMajor", q.SMajor, k*k*k*base.SMajor, 1e-8)
	within(t, "outline J", q.J, 123*math.Pow(k, 4), exact)
	if math.Abs(q.Angle-p.Angle) > 1e-9 {
		t.Errorf("outline Angle = %v, mapped %v", q.Angle, p.Angle)
	}
}

func TestTransformedPlates(t *testing.T) {
	ps, err := Transformed{Parent: ipe200, Scale: 2}.Plates()
	if err != nil {
		t.Fatal(err)
	}
	// source: ISection.Plates doc: outstand (B − Tw)/2, web D − 2Tf, here ×2
	if ps[0].Width != 2*(100-5.6)/2 || ps[1].Width != 2*(200-17) || ps[0].Thickness != 17 {
		t.Errorf("plates %+v", ps)
	}
	if _, err := (Transformed{Parent: Rect{B: 10, D: 20}}).Plates(); err == nil {
		t.Error("a rectangle has no plates")
	}
}
