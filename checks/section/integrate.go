package section

import "math"

// Integrals over a region by Green's theorem, written as boundary integrals
// ∮ f dy with ∂f/∂x the integrand:
//
//	∫∫ 1 dA  = ∮ x dy        ∫∫ x dA  = ∮ x²/2 dy     ∫∫ y dA = ∮ xy dy
//	∫∫ x² dA = ∮ x³/3 dy     ∫∫ y² dA = ∮ xy² dy      ∫∫ xy dA = ∮ x²y/2 dy
//
// A straight edge is integrated exactly by two-point Gauss–Legendre (the
// integrands are cubic along it). An arc is its chord plus the circular
// segment between chord and arc, whose moments have closed forms. The ∮ f dy
// form also makes clipping easy: the part of a region above a line y = c is
// bounded by the clipped boundary and pieces of that line, and dy = 0 along
// the line, so clipping each edge is all the clipping there is.

// moments holds the area integrals of a region about the origin.
type moments struct {
	a   float64 // ∫ dA
	sx  float64 // ∫ y dA (first moment about the x-axis)
	sy  float64 // ∫ x dA
	ixx float64 // ∫ y² dA
	iyy float64 // ∫ x² dA
	ixy float64 // ∫ xy dA
}

func (m *moments) add(o moments, f float64) {
	m.a += f * o.a
	m.sx += f * o.sx
	m.sy += f * o.sy
	m.ixx += f * o.ixx
	m.iyy += f * o.iyy
	m.ixy += f * o.ixy
}

// Two-point Gauss–Legendre nodes on [0, 1] (weights 1/2 each).
const (
	glLo = 0.5 - 0.28867513459481287 // 1/2 − 1/(2√3)
	glHi = 0.5 + 0.28867513459481287
)

// lineMoments integrates the six integrands along a straight edge.
func lineMoments(x0, y0, x1, y1 float64) moments {
	dx, dy := x1-x0, y1-y0
	if dy == 0 {
		return moments{}
	}
	var m moments
	for _, t := range [2]float64{glLo, glHi} {
		x, y := x0+t*dx, y0+t*dy
		m.a += x
		m.sy += x * x / 2
		m.sx += x * y
		m.iyy += x * x * x / 3
		m.ixx += x * y * y
		m.ixy += x * x * y / 2
	}
	h := dy / 2
	m.a *= h
	m.sx *= h
	m.sy *= h
	m.ixx *= h
	m.iyy *= h
	m.ixy *= h
	return m
}

// segmentMoments returns the area integrals of the circular segment between
// the arc of centre (cx, cy), radius r, from angle a0 to a1 (|a1−a0| ≤ 2π)
// and its chord. In local axes u along the bisector and v across it, with
// half-angle α: A = r²(α − sinα cosα), ∫u = ⅔r³sin³α,
// ∫u² = r⁴/4 (α + sinα cosα) − r⁴ sinα cos³α / 2,
// ∫v² = r⁴/4 (α − sinα cosα) − r⁴ sin³α cosα / 6 (sector minus triangle).
func segmentMoments(cx, cy, r, a0, a1 float64) moments {
	al := math.Abs(a1-a0) / 2
	sa, ca := math.Sincos(al)
	r2 := r * r
	r4 := r2 * r2
	a := r2 * (al - sa*ca)
	qu := 2.0 / 3.0 * r * r2 * sa * sa * sa
	iuu := r4/4*(al+sa*ca) - r4*sa*ca*ca*ca/2
	ivv := r4/4*(al-sa*ca) - r4*sa*sa*sa*ca/6
	s, c := math.Sincos((a0 + a1) / 2)
	return moments{
		a:   a,
		sy:  cx*a + c*qu,
		sx:  cy*a + s*qu,
		iyy: cx*cx*a + 2*cx*c*qu + c*c*iuu + s*s*ivv,
		ixx: cy*cy*a + 2*cy*s*qu + s*s*iuu + c*c*ivv,
		ixy: cx*cy*a + (cx*s+cy*c)*qu + c*s*(iuu-ivv),
	}
}

// segMoments returns ∮ over one boundary piece.
func segMoments(s seg) moments {
	m := lineMoments(s.x0, s.y0, s.x1, s.y1)
	if s.arc {
		m.add(segmentMoments(s.cx, s.cy, s.r, s.a0, s.a1), sign(s.a1-s.a0))
	}
	return m
}

func sign(v float64) float64 {
	if v < 0 {
		return -1
	}
	return 1
}

// loopMoments returns the signed integrals of one loop (positive when it runs
// counter-clockwise).
func loopMoments(l loop) moments {
	var m moments
	for _, s := range l.segs {
		m.add(segMoments(s), 1)
	}
	return m
}

// orient sets each loop's factor from the sign of its area, so that outer
// loops add and holes subtract whichever way they run, and returns the
// region's moments. A loop of zero area is reported by index.
func (g *region) orient() (moments, int) {
	var tot moments
	for i := range g.loops {
		l := &g.loops[i]
		m := loopMoments(*l)
		if m.a == 0 || math.IsNaN(m.a) {
			return tot, i
		}
		l.f = sign(m.a)
		if l.hole {
			l.f = -l.f
		}
		tot.add(m, l.f)
	}
	return tot, -1
}

// above returns the area of the region above the line y = c and its first
// moment about that line, ∫(y − c) dA over that part. orient must have run.
// With turn set it works on the region turned by −π/2, (x, y) → (y, −x),
// without copying it: "above" is then x ≤ −c.
func (g region) above(c float64, turn bool) (area, q float64) {
	for _, l := range g.loops {
		var a, m float64
		for _, s := range l.segs {
			if turn {
				s.x0, s.y0, s.x1, s.y1 = s.y0, -s.x0, s.y1, -s.x1
				s.cx, s.cy = s.cy, -s.cx
				s.a0 -= math.Pi / 2
				s.a1 -= math.Pi / 2
			}
			if s.arc {
				da, dm := arcAbove(s, c)
				a += da
				m += dm
			} else {
				da, dm := lineAbove(s.x0, s.y0, s.x1, s.y1, c)
				a += da
				m += dm
			}
		}
		area += l.f * a
		q += l.f * m
	}
	return area, q
}

// lineAbove integrates f = x and f = x(y−c) dy along the part of an edge at
// or above y = c.
func lineAbove(x0, y0, x1, y1, c float64) (float64, float64) {
	if y0 == y1 {
		return 0, 0
	}
	in0, in1 := y0 >= c, y1 >= c
	switch {
	case !in0 && !in1:
		return 0, 0
	case in0 != in1:
		t := (c - y0) / (y1 - y0)
		xc := x0 + t*(x1-x0)
		if in0 {
			x1, y1 = xc, c
		} else {
			x0, y0 = xc, c
		}
	}
	return chord(x0, y0, x1, y1, c)
}

// arcAbove is lineAbove for an arc: the sub-arcs at or above y = c, each as
// its chord plus its circular segment.
func arcAbove(s seg, c float64) (float64, float64) {
	lo, hi := s.a0, s.a1
	dir := 1.0
	if hi < lo {
		lo, hi, dir = hi, lo, -1
	}
	k := (c - s.cy) / s.r
	if k >= 1 {
		return 0, 0
	}
	var a, m float64
	piece := func(t0, t1 float64) {
		if t1 <= t0 {
			return
		}
		var x0, y0, x1, y1 float64
		if t0 == lo && t1 == hi { // the whole arc: its end points are known
			x0, y0, x1, y1 = s.x0, s.y0, s.x1, s.y1
			if dir < 0 {
				x0, y0, x1, y1 = x1, y1, x0, y0
			}
		} else {
			s0, c0 := math.Sincos(t0)
			s1, c1 := math.Sincos(t1)
			x0, y0 = s.cx+s.r*c0, s.cy+s.r*s0
			x1, y1 = s.cx+s.r*c1, s.cy+s.r*s1
		}
		da, dm := chord(x0, y0, x1, y1, c)
		sm := segmentMoments(s.cx, s.cy, s.r, t0, t1)
		a += da + sm.a
		m += dm + sm.sx - c*sm.a
	}
	if k <= -1 {
		piece(lo, hi)
		return dir * a, dir * m
	}
	b := math.Asin(k)
	// Above the line for θ in [b + 2πn, π − b + 2πn].
	n0 := math.Floor((lo - (math.Pi - b)) / (2 * math.Pi))
	for n := n0; b+2*math.Pi*n < hi; n++ {
		piece(math.Max(lo, b+2*math.Pi*n), math.Min(hi, math.Pi-b+2*math.Pi*n))
	}
	return dir * a, dir * m
}

// chord integrates f = x and f = x(y−c) dy along a whole straight edge.
func chord(x0, y0, x1, y1, c float64) (float64, float64) {
	dx, dy := x1-x0, y1-y0
	var a, m float64
	for _, t := range [2]float64{glLo, glHi} {
		x, y := x0+t*dx, y0+t*dy
		a += x
		m += x * (y - c)
	}
	return a * dy / 2, m * dy / 2
}
