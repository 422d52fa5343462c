package section

import (
	"math"
	"strconv"
)

// Polygon is an arbitrary section (IFC ArbitraryClosed, ArbitraryWithVoids):
// an outer boundary and optional holes, each a closed polyline in mm (the
// closing point may be repeated or left out). Orientation does not matter:
// the outer boundary adds material and every hole removes it, whichever way
// either runs. Arcs must be given as polylines (ArcPoints).
//
// Area and second moments are exact for the polygon (Green's theorem); the
// plastic moduli are found numerically at the equal-area axis parallel to
// each principal axis. J and Iw are NaN: there is no general formula.
//
// The outline is not checked for self-intersection or for holes that
// overlap each other or cross the outer boundary; such input gives
// meaningless properties.
type Polygon struct {
	Name  string    // designation, copied to Properties.Profile
	Outer []Point   // outer boundary
	Holes [][]Point // voids
}

// Properties computes the section properties of the polygon.
func (s Polygon) Properties() (Properties, error) { return properties(s, s) }

// Outline returns a copy of the polygon.
func (s Polygon) Outline() (Polygon, error) {
	if _, err := s.build(); err != nil {
		return Polygon{}, err
	}
	out := Polygon{Name: s.Name, Outer: append([]Point(nil), s.Outer...)}
	for _, h := range s.Holes {
		out.Holes = append(out.Holes, append([]Point(nil), h...))
	}
	return out, nil
}

func (s Polygon) build() (def, error) {
	ck := checker{shape: "Polygon", name: s.Name}
	checkRing(&ck, "Outer", s.Outer)
	for i, h := range s.Holes {
		checkRing(&ck, "Holes["+strconv.Itoa(i)+"]", h)
	}
	if ck.err != nil {
		return def{}, ck.err
	}
	reg := region{loops: make([]loop, 0, 1+len(s.Holes))}
	reg.loops = append(reg.loops, polyLoop(s.Outer, false))
	ob := region{loops: reg.loops[:1]}
	x0, x1, y0, y1 := ob.bounds()
	for i, h := range s.Holes {
		l := polyLoop(h, true)
		hx0, hx1, hy0, hy1 := region{loops: []loop{l}}.bounds()
		if hx0 < x0 || hx1 > x1 || hy0 < y0 || hy1 > y1 {
			ck.failf("Holes["+strconv.Itoa(i)+"]", 0, "reaches outside the outer boundary")
			return def{}, ck.err
		}
		reg.loops = append(reg.loops, l)
	}
	return def{shape: "ARB", name: s.Name, reg: reg, j: math.NaN(), iw: math.NaN()}, nil
}

// checkRing requires at least three points, all finite.
func checkRing(ck *checker, field string, pts []Point) {
	n := len(pts)
	if n > 1 && pts[0] == pts[n-1] {
		n--
	}
	if n < 3 {
		ck.failf(field, float64(n), "needs at least 3 distinct points")
		return
	}
	for i, p := range pts {
		if math.IsNaN(p.X) || math.IsInf(p.X, 0) || math.IsNaN(p.Y) || math.IsInf(p.Y, 0) {
			ck.failf(field+"["+strconv.Itoa(i)+"]", math.NaN(), "coordinates must be finite numbers")
			return
		}
	}
}
