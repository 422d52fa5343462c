package section

import "math"

// def is what a shape hands to the common solver: its exact outline and the
// constants that come from shape formulas rather than from the outline.
type def struct {
	shape string  // Properties.Shape
	name  string  // Properties.Profile
	reg   region  // material outline
	j, iw float64 // torsion and warping constants (NaN: no formula)
}

// builder is implemented by every shape of this package: it validates the
// dimensions and returns the exact outline.
type builder interface {
	build() (def, error)
}

// properties computes the Properties of a shape from its definition.
func properties(s builder, geometry Shape) (Properties, error) {
	d, err := s.build()
	if err != nil {
		return Properties{}, err
	}
	p, err := solve(d.reg)
	if err != nil {
		var ck checker
		ck.shape, ck.name = typeName(geometry), d.name
		ck.failf("", 0, "%v", err)
		return Properties{}, ck.err
	}
	p.Profile, p.Shape = d.name, d.shape
	p.J, p.Iw = d.j, d.iw
	p.Source = "computed"
	p.Geometry = geometry
	return p, nil
}

type solveError string

func (e solveError) Error() string { return string(e) }

// isotropic is the relative difference below which the two principal second
// moments count as equal: every axis is then principal and Angle is 0.
const isotropic = 1e-9

// solve computes area, centroid, principal second moments and axes, elastic
// and plastic moduli of a region. J and Iw are left NaN.
func solve(g region) (Properties, error) {
	nan := math.NaN()
	p := Properties{J: nan, Iw: nan}
	if len(g.loops) == 0 {
		return p, solveError("the outline is empty")
	}
	// Integrate about the centre of the bounding box: moments about a far
	// origin would lose digits in the parallel-axis shift. (The shapes of
	// this package are centred already: no copy then.)
	xmin, xmax, ymin, ymax := g.bounds()
	ox, oy := (xmin+xmax)/2, (ymin+ymax)/2
	if math.Abs(ox)+math.Abs(oy) > 1e-9*(xmax-xmin+ymax-ymin) {
		g = g.transform(similarity{scale: 1, tx: -ox, ty: -oy})
	} else {
		ox, oy = 0, 0
	}
	m, bad := g.orient()
	if bad >= 0 {
		if g.loops[bad].hole {
			return p, solveError("a hole has zero area")
		}
		return p, solveError("the outline has zero area")
	}
	if !(m.a > 0) || math.IsInf(m.a, 0) {
		return p, solveError("the holes leave no material (net area not positive)")
	}
	xc, yc := m.sy/m.a, m.sx/m.a
	ix := m.ixx - m.a*yc*yc
	iy := m.iyy - m.a*xc*xc
	ixy := m.ixy - m.a*xc*yc
	if ix <= 0 || iy <= 0 {
		return p, solveError("the outline is degenerate (non-positive second moment)")
	}
	mean, half := (ix+iy)/2, (ix-iy)/2
	if math.Abs(ixy) <= 1e-12*mean {
		ixy = 0 // symmetric about an axis parallel to x or y
	}
	rr := math.Hypot(half, ixy)
	theta := 0.0
	if rr > isotropic*mean {
		theta = 0.5 * math.Atan2(-2*ixy, ix-iy) // in (−π/2, π/2]
	} else {
		rr = 0
	}
	if theta <= -math.Pi/2 {
		theta += math.Pi
	}
	if theta == 0 {
		theta = 0 // not −0
	}
	// Snap a centroid that is zero up to rounding (symmetric shapes).
	size := xmax - xmin + ymax - ymin
	if math.Abs(xc+ox) <= 1e-12*size {
		xc = -ox
	}
	if math.Abs(yc+oy) <= 1e-12*size {
		yc = -oy
	}

	p.A = m.a
	p.Cx, p.Cy = xc+ox, yc+oy
	p.IMajor, p.IMinor = mean+rr, mean-rr
	p.RMajor, p.RMinor = math.Sqrt(p.IMajor/p.A), math.Sqrt(p.IMinor/p.A)
	p.Angle = theta

	// Principal frame: centroid at the origin, major axis along x, that is
	// p' = R(−θ)·(p − c). The minor-axis plastic modulus works on it turned
	// a further −π/2, so that its y is minus the principal x.
	pr := g
	if theta != 0 || xc != 0 || yc != 0 {
		pr = g.transform(toFrame(-theta, xc, yc))
	}
	bx0, bx1, by0, by1 := pr.bounds()
	p.ZMajor = p.IMajor / math.Max(-by0, by1)
	p.ZMinor = p.IMinor / math.Max(-bx0, bx1)
	p.SMajor = plastic(pr, false, p.A, by0, by1)
	p.SMinor = plastic(pr, true, p.A, -bx1, -bx0)
	return p, nil
}

// toFrame is the similarity p' = R(rot)·(p − (xc, yc)).
func toFrame(rot, xc, yc float64) similarity {
	s, c := math.Sincos(rot)
	return similarity{rot: rot, scale: 1, tx: -(c*xc - s*yc), ty: -(s*xc + c*yc)}
}

// plastic returns the plastic modulus of a region whose centroid is at the
// origin for bending about a horizontal axis: ∫|y − c| dA with c the
// equal-area line, found by the Illinois (modified regula falsi) method on
// the area above c. ymin and ymax bound the region. With turn the region is
// taken turned by −π/2 (see region.above), for the other principal axis.
func plastic(g region, turn bool, a, ymin, ymax float64) float64 {
	half := a / 2
	f := func(c float64) (float64, float64) {
		ar, q := g.above(c, turn)
		return ar - half, q
	}
	tolA := 1e-13 * a
	tolY := 1e-13 * (ymax - ymin)
	c := 0.0
	fc, q := f(c)
	if math.Abs(fc) > tolA {
		lo, hi := ymin, ymax
		flo, fhi := half, -half
		side := 0
		for i := 0; i < 200; i++ {
			c = (lo*fhi - hi*flo) / (fhi - flo)
			if !(c > lo && c < hi) {
				c = (lo + hi) / 2
			}
			fc, q = f(c)
			if math.Abs(fc) <= tolA || hi-lo <= tolY {
				break
			}
			if fc > 0 {
				lo, flo = c, fc
				if side == 1 {
					fhi /= 2
				}
				side = 1
			} else {
				hi, fhi = c, fc
				if side == -1 {
					flo /= 2
				}
				side = -1
			}
		}
	}
	// ∫|y−c| = Q_above − Q_below, and Q_above + Q_below = ∫(y−c) = −cA.
	return 2*q + c*a
}

// typeName is the Go type name of a shape of this package, for messages.
func typeName(s Shape) string {
	switch s.(type) {
	case ISection, *ISection:
		return "ISection"
	case AsymmetricI, *AsymmetricI:
		return "AsymmetricI"
	case RHS, *RHS:
		return "RHS"
	case CHS, *CHS:
		return "CHS"
	case Rect, *Rect:
		return "Rect"
	case Circle, *Circle:
		return "Circle"
	case Tee, *Tee:
		return "Tee"
	case Angle, *Angle:
		return "Angle"
	case Channel, *Channel:
		return "Channel"
	case LippedChannel, *LippedChannel:
		return "LippedChannel"
	case Zed, *Zed:
		return "Zed"
	case Polygon, *Polygon:
		return "Polygon"
	case Transformed, *Transformed:
		return "Transformed"
	}
	return "Shape"
}
