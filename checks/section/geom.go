package section

import "math"

// Point is a point of a cross-section outline, mm.
type Point struct{ X, Y float64 }

// seg is one piece of a closed boundary: a straight line or a circular arc
// from (x0, y0) to (x1, y1). Arcs are kept exact (centre, radius and angles)
// so that root fillets and rounded corners integrate without discretisation.
type seg struct {
	x0, y0, x1, y1 float64
	arc            bool
	cx, cy, r      float64 // arc centre and radius
	a0, a1         float64 // arc start and end angle, radians; a1-a0 is the signed sweep
}

// loop is a closed boundary. f is +1 or -1: the factor that turns the loop's
// signed integrals into a material (+) or void (-) contribution whatever the
// loop's orientation; it is set by region.orient.
type loop struct {
	segs []seg
	hole bool
	f    float64
}

// region is material bounded by outer loops minus holes.
type region struct{ loops []loop }

// corner is a vertex of a polygon whose corner may be rounded with radius r,
// tangent to both adjacent edges. field names the dimension that asked for the
// radius, for error messages.
type corner struct {
	x, y  float64
	r     float64
	field string
}

// roundedLoop builds a closed loop from polygon vertices, replacing each
// corner with r > 0 by a circular arc tangent to both edges (a convex corner
// becomes a rounded edge, a re-entrant corner a root fillet). The arc turns
// the way the boundary turns, so the loop keeps its orientation.
func roundedLoop(cs []corner, hole bool, ck *checker) loop {
	n := len(cs)
	type tangent struct {
		ax, ay, bx, by float64 // tangent points on the incoming and outgoing edge
		td             float64 // tangent distance from the vertex
		s              seg     // the arc, when rounded
		round          bool
	}
	ts := make([]tangent, n)
	for i := range cs {
		v := cs[i]
		ts[i] = tangent{ax: v.x, ay: v.y, bx: v.x, by: v.y}
		if v.r <= 0 {
			continue
		}
		p := cs[(i+n-1)%n]
		q := cs[(i+1)%n]
		u1x, u1y := unit(p.x-v.x, p.y-v.y)
		u2x, u2y := unit(q.x-v.x, q.y-v.y)
		cosPhi := u1x*u2x + u1y*u2y
		if cosPhi < -1+1e-12 { // straight through: nothing to round
			continue
		}
		phi := math.Acos(math.Max(-1, math.Min(1, cosPhi)))
		half := phi / 2
		td := v.r / math.Tan(half)
		bx, by := unit(u1x+u2x, u1y+u2y)
		dc := v.r / math.Sin(half)
		cx, cy := v.x+bx*dc, v.y+by*dc
		t := &ts[i]
		t.td = td
		t.ax, t.ay = v.x+u1x*td, v.y+u1y*td
		t.bx, t.by = v.x+u2x*td, v.y+u2y*td
		sweep := math.Pi - phi
		// (v - p) x (q - v): positive when the boundary turns left.
		if (v.x-p.x)*(q.y-v.y)-(v.y-p.y)*(q.x-v.x) < 0 {
			sweep = -sweep
		}
		a0 := math.Atan2(t.ay-cy, t.ax-cx)
		t.s = seg{x0: t.ax, y0: t.ay, x1: t.bx, y1: t.by, arc: true, cx: cx, cy: cy, r: v.r, a0: a0, a1: a0 + sweep}
		t.round = true
	}
	// Every edge must hold the tangent lengths of both its end corners.
	for i := range cs {
		j := (i + 1) % n
		l := math.Hypot(cs[j].x-cs[i].x, cs[j].y-cs[i].y)
		need := ts[i].td + ts[j].td
		if need > l*(1+1e-9)+1e-12 {
			f, r := cs[i].field, cs[i].r
			if ts[j].td > ts[i].td {
				f, r = cs[j].field, cs[j].r
			}
			ck.failf(f, r, "the rounded corner does not fit: it needs %.4g mm along an edge %.4g mm long", need, l)
			return loop{}
		}
	}
	segs := make([]seg, 0, 2*n)
	for i := range cs {
		t := ts[i]
		if t.round {
			segs = append(segs, t.s)
		}
		nx := ts[(i+1)%n]
		if t.bx != nx.ax || t.by != nx.ay {
			segs = append(segs, seg{x0: t.bx, y0: t.by, x1: nx.ax, y1: nx.ay})
		}
	}
	return loop{segs: segs, hole: hole}
}

// circleLoop is a full circle as one arc.
func circleLoop(cx, cy, r float64, hole bool) loop {
	return loop{segs: []seg{{x0: cx + r, y0: cy, x1: cx + r, y1: cy, arc: true, cx: cx, cy: cy, r: r, a0: 0, a1: 2 * math.Pi}}, hole: hole}
}

// polyLoop is a closed polyline. A closing point equal to the first is
// dropped.
func polyLoop(pts []Point, hole bool) loop {
	n := len(pts)
	if n > 1 && pts[0] == pts[n-1] {
		n--
	}
	segs := make([]seg, 0, n)
	for i := 0; i < n; i++ {
		a, b := pts[i], pts[(i+1)%n]
		segs = append(segs, seg{x0: a.X, y0: a.Y, x1: b.X, y1: b.Y})
	}
	return loop{segs: segs, hole: hole}
}

func unit(x, y float64) (float64, float64) {
	l := math.Hypot(x, y)
	if l == 0 {
		return 0, 0
	}
	return x / l, y / l
}

// similarity is p' = s·R(rot)·M·p + (tx, ty), M = diag(1, -1) when mirror.
type similarity struct {
	rot    float64
	mirror bool
	scale  float64
	tx, ty float64
}

func (t similarity) apply(x, y float64) (float64, float64) {
	if t.mirror {
		y = -y
	}
	s, c := math.Sincos(t.rot)
	return t.scale*(c*x-s*y) + t.tx, t.scale*(s*x+c*y) + t.ty
}

// angle maps a direction angle through the linear part of t.
func (t similarity) angle(a float64) float64 {
	if t.mirror {
		a = -a
	}
	return a + t.rot
}

// transform returns a copy of g mapped by t. Arcs stay exact: a similarity
// maps circles to circles.
func (g region) transform(t similarity) region {
	out := region{loops: make([]loop, len(g.loops))}
	for i, l := range g.loops {
		segs := make([]seg, len(l.segs))
		for k, s := range l.segs {
			n := s
			n.x0, n.y0 = t.apply(s.x0, s.y0)
			n.x1, n.y1 = t.apply(s.x1, s.y1)
			if s.arc {
				n.cx, n.cy = t.apply(s.cx, s.cy)
				n.r = s.r * math.Abs(t.scale)
				n.a0, n.a1 = t.angle(s.a0), t.angle(s.a1)
			}
			segs[k] = n
		}
		out.loops[i] = loop{segs: segs, hole: l.hole, f: l.f}
	}
	return out
}

// bounds returns the bounding box of the region's boundary.
func (g region) bounds() (xmin, xmax, ymin, ymax float64) {
	xmin, ymin = math.Inf(1), math.Inf(1)
	xmax, ymax = math.Inf(-1), math.Inf(-1)
	add := func(x, y float64) { // coordinates are finite: no NaN care needed
		if x < xmin {
			xmin = x
		}
		if x > xmax {
			xmax = x
		}
		if y < ymin {
			ymin = y
		}
		if y > ymax {
			ymax = y
		}
	}
	for _, l := range g.loops {
		for _, s := range l.segs {
			add(s.x0, s.y0) // a loop is closed: each end point starts the next piece
			if !s.arc {
				continue
			}
			lo, hi := math.Min(s.a0, s.a1), math.Max(s.a0, s.a1)
			// Extremes of the circle at multiples of pi/2 inside the arc.
			for k := math.Ceil(lo / (math.Pi / 2)); k*math.Pi/2 <= hi; k++ {
				switch int(math.Mod(math.Mod(k, 4)+4, 4)) {
				case 0:
					add(s.cx+s.r, s.cy)
				case 1:
					add(s.cx, s.cy+s.r)
				case 2:
					add(s.cx-s.r, s.cy)
				case 3:
					add(s.cx, s.cy-s.r)
				}
			}
		}
	}
	return
}

// polygon returns the region's loops as polylines, each arc replaced by
// chords of at most maxStep radians.
func (g region) polygon(maxStep float64) (outer []Point, holes [][]Point) {
	for _, l := range g.loops {
		var pts []Point
		for _, s := range l.segs {
			if !s.arc {
				pts = append(pts, Point{s.x0, s.y0})
				continue
			}
			n := int(math.Ceil(math.Abs(s.a1-s.a0) / maxStep))
			if n < 1 {
				n = 1
			}
			arc := ArcPoints(s.cx, s.cy, s.r, s.a0, s.a1, n)
			arc[0] = Point{s.x0, s.y0} // keep the exact tangent points
			pts = append(pts, arc[:n]...)
		}
		if l.hole {
			holes = append(holes, pts)
		} else if outer == nil {
			outer = pts
		} else {
			// A second outer loop cannot be expressed as one Polygon; the
			// shapes of this package have one.
			outer = append(outer, pts...)
		}
	}
	return outer, holes
}

// ArcPoints returns n+1 points on the circle of centre (cx, cy) and radius r
// from angle a0 to angle a1 (radians, counter-clockwise from +x; a1 < a0 runs
// clockwise), both ends included: the polyline of n chords that approximates
// the arc, for building a Polygon from an outline with arcs. n < 1 is taken
// as 1. The area between an arc of sweep θ and its n chords is r²θ³/(12n²) to
// leading order: for a root fillet of 90° and n = 16 that is 0.6 % of the
// fillet's own area (1 − π/4)r².
func ArcPoints(cx, cy, r, a0, a1 float64, n int) []Point {
	if n < 1 {
		n = 1
	}
	pts := make([]Point, n+1)
	for i := 0; i <= n; i++ {
		a := a0 + (a1-a0)*float64(i)/float64(n)
		s, c := math.Sincos(a)
		pts[i] = Point{cx + r*c, cy + r*s}
	}
	return pts
}
