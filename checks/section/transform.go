package section

import (
	"errors"
	"math"
)

// Transformed is a Parent shape moved by a similarity transform (IFC
// DerivedProfile, or a profile placed with a Position):
//
//	p' = Scale · Rot(Rotation) · Mirror · p + (X, Y)
//
// where Mirror, when set, reflects y → −y before the rotation (an IFC
// operator whose second axis is clockwise from its first). Non-uniform
// scaling is not supported.
//
// The properties are those of the moved outline about its own principal
// axes: for a parent of this package, or any parent that implements
// Outliner, the outline is transformed exactly and everything recomputed;
// J and Iw scale as Scale⁴ and Scale⁶. A parent that gives neither has its
// Properties mapped instead: the principal values are invariant under
// rotation, mirroring and translation, so A, I, r, Z, S, J, Iw scale as
// Scale², ⁴, ¹, ³, ³, ⁴, ⁶, Angle and the centroid move with the transform.
// The only difference between the two routes is for sections whose two
// principal second moments are equal (a square tube, say): every axis is
// then principal, the recomputed route reports the moduli about the new x
// and y axes (Angle 0), the mapped route about the parent's rotated axes.
type Transformed struct {
	Name   string // designation; empty: the parent's
	Parent Shape

	Rotation float64 // radians, counter-clockwise
	Mirror   bool    // reflect y → −y before rotating
	Scale    float64 // uniform scale factor; 0 means 1
	X, Y     float64 // translation, mm
}

// errNoOutline means the parent can give neither a region nor an outline.
var errNoOutline = errors.New("section: parent has no outline")

func (s Transformed) sim() (similarity, error) {
	ck := checker{shape: "Transformed", name: s.Name}
	k := s.Scale
	if k == 0 {
		k = 1
	}
	ck.positive("Scale", k)
	for _, f := range []struct {
		n string
		v float64
	}{{"Rotation", s.Rotation}, {"X", s.X}, {"Y", s.Y}} {
		if math.IsNaN(f.v) || math.IsInf(f.v, 0) {
			ck.failf(f.n, f.v, "must be a finite number")
		}
	}
	if s.Parent == nil && ck.err == nil {
		ck.failf("Parent", 0, "is missing")
	}
	return similarity{rot: s.Rotation, mirror: s.Mirror, scale: k, tx: s.X, ty: s.Y}, ck.err
}

func (s Transformed) build() (def, error) {
	t, err := s.sim()
	if err != nil {
		return def{}, err
	}
	var d def
	switch p := s.Parent.(type) {
	case builder:
		if d, err = p.build(); err != nil {
			return def{}, err
		}
	case Outliner:
		poly, err := p.Outline()
		if err != nil {
			return def{}, err
		}
		if d, err = poly.build(); err != nil {
			return def{}, err
		}
		pp, err := p.Properties()
		if err != nil {
			return def{}, err
		}
		d.shape, d.name, d.j, d.iw = pp.Shape, pp.Profile, pp.J, pp.Iw
	default:
		return def{}, errNoOutline
	}
	k := t.scale
	d.reg = d.reg.transform(t)
	d.j *= k * k * k * k
	d.iw *= k * k * k * k * k * k
	if s.Name != "" {
		d.name = s.Name
	}
	return d, nil
}

// Properties computes the properties of the transformed parent.
func (s Transformed) Properties() (Properties, error) {
	p, err := properties(s, s)
	if !errors.Is(err, errNoOutline) {
		return p, err
	}
	t, _ := s.sim()
	if p, err = s.Parent.Properties(); err != nil {
		return Properties{}, err
	}
	k := t.scale
	k2 := k * k
	p.A *= k2
	p.IMajor *= k2 * k2
	p.IMinor *= k2 * k2
	p.RMajor *= k
	p.RMinor *= k
	p.ZMajor *= k2 * k
	p.ZMinor *= k2 * k
	p.SMajor *= k2 * k
	p.SMinor *= k2 * k
	p.J *= k2 * k2
	p.Iw *= k2 * k2 * k2
	p.Angle = principalAngle(t.angle(p.Angle))
	p.Cx, p.Cy = t.apply(p.Cx, p.Cy)
	if s.Name != "" {
		p.Profile = s.Name
	}
	p.Geometry = s
	return p, nil
}

// principalAngle reduces an axis direction to (−π/2, π/2].
func principalAngle(a float64) float64 {
	a = math.Remainder(a, math.Pi)
	if a <= -math.Pi/2 {
		a += math.Pi
	}
	return a
}

// Outline returns the transformed outline. It fails when the parent has no
// outline.
func (s Transformed) Outline() (Polygon, error) {
	d, err := s.build()
	if err != nil {
		return Polygon{}, err
	}
	outer, holes := d.reg.polygon(arcStep)
	return Polygon{Name: d.name, Outer: outer, Holes: holes}, nil
}

// Plates returns the parent's plates scaled by Scale. It fails when the
// parent has no plates.
func (s Transformed) Plates() ([]Plate, error) {
	t, err := s.sim()
	if err != nil {
		return nil, err
	}
	p, ok := s.Parent.(Plated)
	if !ok {
		return nil, &DimensionError{Shape: "Transformed", Name: s.Name, Field: "Parent", Reason: "has no plate elements"}
	}
	ps, err := p.Plates()
	if err != nil {
		return nil, err
	}
	out := make([]Plate, len(ps))
	for i, q := range ps {
		q.Width *= t.scale
		q.Thickness *= t.scale
		q.Fillet *= t.scale
		out[i] = q
	}
	return out, nil
}
