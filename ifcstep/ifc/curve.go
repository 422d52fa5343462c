package ifc

import (
	"errors"
	"math"

	"swaygate/checks/section"
	"swaygate/ifcstep"
)

// arcChordDeg is the largest angle (degrees) of one chord of an arc turned
// into a polyline. The area lost between an arc and its chords is about
// θ²/12 of the sector's (θ in radians): 0.03 % at 2°.
const arcChordDeg = 2

// curvePoints turns a closed 2-D profile curve into a polyline in mm:
// IfcPolyline, IfcIndexedPolyCurve (lines and arcs), IfcCompositeCurve of
// polylines and trimmed lines and circles, or a whole IfcCircle. Arcs become
// chords of at most 5°.
func (x *extractor) curvePoints(in ifcstep.Instance, depth int) ([]section.Point, error) {
	if depth > 8 {
		return nil, errors.New("curves nested too deep")
	}
	switch in.Type() {
	case "IFCPOLYLINE":
		list, err := in.Attr(pPolyPoints).List()
		if err != nil || len(list) < 2 {
			return nil, errors.New("polyline " + ref(in) + " without points")
		}
		pts := make([]section.Point, 0, len(list))
		for _, v := range list {
			pi, ok := x.deref(in, v)
			if !ok {
				return nil, errors.New("unreadable point in " + ref(in))
			}
			p, ok := x.readPoint(pi)
			if !ok {
				return nil, errors.New("unreadable point " + ref(pi))
			}
			pts = append(pts, section.Point{X: p[0], Y: p[1]})
		}
		return pts, nil
	case "IFCINDEXEDPOLYCURVE":
		return x.indexedPolyCurve(in)
	case "IFCCOMPOSITECURVE":
		list, err := in.Attr(pCompSegments).List()
		if err != nil || len(list) == 0 {
			return nil, errors.New("composite curve " + ref(in) + " without segments")
		}
		var pts []section.Point
		for _, v := range list {
			seg, ok := x.deref(in, v)
			if !ok {
				return nil, errors.New("unreadable segment in " + ref(in))
			}
			pc, ok := x.deref(seg, seg.Attr(pSegParent))
			if !ok {
				return nil, errors.New("segment " + ref(seg) + " without parent curve")
			}
			sp, err := x.curvePoints(pc, depth+1)
			if err != nil {
				return nil, err
			}
			if same, ok := seg.Attr(pSegSameSense).Bool(); ok && !same {
				reversePoints(sp)
			}
			if len(pts) > 0 && len(sp) > 0 && near(pts[len(pts)-1], sp[0]) {
				sp = sp[1:]
			}
			pts = append(pts, sp...)
		}
		return pts, nil
	case "IFCTRIMMEDCURVE":
		return x.trimmedCurve(in)
	case "IFCCIRCLE":
		c, r, ok := x.circle(in)
		if !ok {
			return nil, errors.New("unreadable circle " + ref(in))
		}
		return section.ArcPoints(c.o[0], c.o[1], r, 0, 2*math.Pi, 72)[:72], nil
	}
	return nil, unsupportedError("profile curve " + entityName(in.Type()) + " is not supported")
}

func near(a, b section.Point) bool { return math.Abs(a.X-b.X) < 1e-6 && math.Abs(a.Y-b.Y) < 1e-6 }

func reversePoints(p []section.Point) {
	for i, j := 0, len(p)-1; i < j; i, j = i+1, j-1 {
		p[i], p[j] = p[j], p[i]
	}
}

// circle reads an IfcCircle: its placement frame (mm) and radius (mm).
func (x *extractor) circle(in ifcstep.Instance) (frame, float64, bool) {
	pos, ok := x.deref(in, in.Attr(pCirclePos))
	if !ok {
		return frame{}, 0, false
	}
	f, ok := x.readAxis2Placement(pos)
	if !ok {
		return frame{}, 0, false
	}
	r, ok := in.Attr(pCircleRadius).Real()
	if !ok || !(r > 0) {
		return frame{}, 0, false
	}
	return f, r * x.lengthFactor, true
}

// trimmedCurve turns an IfcTrimmedCurve of a circle or a line into points.
func (x *extractor) trimmedCurve(in ifcstep.Instance) ([]section.Point, error) {
	basis, ok := x.deref(in, in.Attr(pTrimBasis))
	if !ok {
		return nil, errors.New("trimmed curve " + ref(in) + " without basis curve")
	}
	sense := true
	if b, ok := in.Attr(pTrimSense).Bool(); ok {
		sense = b
	}
	switch basis.Type() {
	case "IFCCIRCLE":
		c, r, ok := x.circle(basis)
		if !ok {
			return nil, errors.New("unreadable circle " + ref(basis))
		}
		a0, ok0 := x.trimAngle(in, in.Attr(pTrim1), c, r)
		a1, ok1 := x.trimAngle(in, in.Attr(pTrim2), c, r)
		if !ok0 || !ok1 {
			return nil, errors.New("unreadable trims of " + ref(in))
		}
		// Angles in the circle's own frame, counter-clockwise when the sense
		// agrees.
		if sense {
			for a1 <= a0 {
				a1 += 2 * math.Pi
			}
		} else {
			for a1 >= a0 {
				a1 -= 2 * math.Pi
			}
		}
		n := int(math.Ceil(math.Abs(a1-a0) / (arcChordDeg * math.Pi / 180)))
		local := section.ArcPoints(0, 0, r, a0, a1, max(n, 1))
		out := make([]section.Point, len(local))
		for i, p := range local {
			w := c.point(vec{p.X, p.Y, 0})
			out[i] = section.Point{X: w[0], Y: w[1]}
		}
		return out, nil
	case "IFCELLIPSE":
		c, a, b, ok := x.ellipse(basis)
		if !ok {
			return nil, errors.New("unreadable ellipse " + ref(basis))
		}
		t0, ok0 := x.trimParam(in.Attr(pTrim1))
		t1, ok1 := x.trimParam(in.Attr(pTrim2))
		if !ok0 || !ok1 {
			return nil, unsupportedError("trims of the ellipse " + ref(in) + " by point are not supported")
		}
		if sense {
			for t1 <= t0 {
				t1 += 2 * math.Pi
			}
		} else {
			for t1 >= t0 {
				t1 -= 2 * math.Pi
			}
		}
		n := max(int(math.Ceil(math.Abs(t1-t0)/(arcChordDeg*math.Pi/180))), 1)
		out := make([]section.Point, n+1)
		for i := 0; i <= n; i++ {
			t := t0 + (t1-t0)*float64(i)/float64(n)
			w := c.point(vec{a * math.Cos(t), b * math.Sin(t), 0})
			out[i] = section.Point{X: w[0], Y: w[1]}
		}
		return out, nil
	case "IFCLINE", "IFCPOLYLINE":
		p0, ok0 := x.trimPoint(in, in.Attr(pTrim1), basis)
		p1, ok1 := x.trimPoint(in, in.Attr(pTrim2), basis)
		if !ok0 || !ok1 {
			return nil, errors.New("unreadable trims of " + ref(in))
		}
		if !sense {
			p0, p1 = p1, p0
		}
		return []section.Point{{X: p0[0], Y: p0[1]}, {X: p1[0], Y: p1[1]}}, nil
	}
	return nil, unsupportedError("trimmed " + entityName(basis.Type()) + " is not supported")
}

// ellipse reads an IfcEllipse: its placement frame and semi-axes (mm).
func (x *extractor) ellipse(in ifcstep.Instance) (frame, float64, float64, bool) {
	pos, ok := x.deref(in, in.Attr(pCirclePos))
	if !ok {
		return frame{}, 0, 0, false
	}
	f, ok := x.readAxis2Placement(pos)
	if !ok {
		return frame{}, 0, 0, false
	}
	a, ok1 := in.Attr(pCircleRadius).Real()
	b, ok2 := in.Attr(pCircleRadius + 1).Real()
	if !ok1 || !ok2 || !(a > 0) || !(b > 0) {
		return frame{}, 0, 0, false
	}
	return f, a * x.lengthFactor, b * x.lengthFactor, true
}

// trimParam reads a trim given as a parameter value (an angle in the
// model's plane angle unit).
func (x *extractor) trimParam(v ifcstep.Value) (float64, bool) {
	list, err := v.List()
	if err != nil {
		return 0, false
	}
	for _, e := range list {
		if name, inner, ok := e.Typed(); ok && name == "IFCPARAMETERVALUE" {
			if p, ok := inner.Real(); ok {
				return p * x.angleFactor, true
			}
		}
	}
	return 0, false
}

// trimAngle reads one trim of a circle: a parameter value (an angle in the
// model's plane angle unit) or a point, as an angle in the circle's frame.
func (x *extractor) trimAngle(owner ifcstep.Instance, v ifcstep.Value, c frame, r float64) (float64, bool) {
	var pointAngle, param float64
	hasPoint, hasParam := false, false
	list, err := v.List()
	if err != nil {
		return 0, false
	}
	for _, e := range list {
		if name, inner, ok := e.Typed(); ok && name == "IFCPARAMETERVALUE" {
			if p, ok := inner.Real(); ok {
				param, hasParam = p*x.angleFactor, true
			}
			continue
		}
		if pi, ok := x.deref(owner, e); ok {
			if p, ok := x.readPoint(pi); ok {
				d := p.sub(c.o)
				pointAngle, hasPoint = math.Atan2(d.dot(c.y), d.dot(c.x)), true
			}
		}
	}
	switch {
	case hasParam:
		return param, true
	case hasPoint:
		return pointAngle, true
	}
	return 0, false
}

// trimPoint reads one trim of a line (a point, or a parameter along the
// line's direction vector).
func (x *extractor) trimPoint(owner ifcstep.Instance, v ifcstep.Value, basis ifcstep.Instance) (vec, bool) {
	list, err := v.List()
	if err != nil {
		return vec{}, false
	}
	var param float64
	hasParam := false
	for _, e := range list {
		if name, inner, ok := e.Typed(); ok && name == "IFCPARAMETERVALUE" {
			param, hasParam = inner.Real()
			continue
		}
		if pi, ok := x.deref(owner, e); ok {
			if p, ok := x.readPoint(pi); ok {
				return p, true
			}
		}
	}
	if !hasParam || basis.Type() != "IFCLINE" {
		return vec{}, false
	}
	pi, ok := x.deref(basis, basis.Attr(pLinePnt))
	if !ok {
		return vec{}, false
	}
	p, ok := x.readPoint(pi)
	if !ok {
		return vec{}, false
	}
	vi, ok := x.deref(basis, basis.Attr(pLineDir))
	if !ok {
		return vec{}, false
	}
	di, ok := x.deref(vi, vi.Attr(pVectorOrient))
	if !ok {
		return vec{}, false
	}
	d, ok := x.readDir(di)
	if !ok {
		return vec{}, false
	}
	d, ok = d.unit()
	mag, _ := vi.Attr(pVectorMag).Real()
	if !ok {
		return vec{}, false
	}
	return p.add(d.scale(param * mag * x.lengthFactor)), true
}

// indexedPolyCurve reads an IfcIndexedPolyCurve over an
// IfcCartesianPointList2D, with IfcLineIndex and IfcArcIndex segments (or
// all points in order when no segments are given).
func (x *extractor) indexedPolyCurve(in ifcstep.Instance) ([]section.Point, error) {
	pl, ok := x.deref(in, in.Attr(pPolyPoints))
	if !ok || pl.Type() != "IFCCARTESIANPOINTLIST2D" {
		return nil, unsupportedError("indexed poly curve " + ref(in) + " without a 2-D point list")
	}
	rows, err := pl.Attr(x.s.cpl2DCoords).List()
	if err != nil || len(rows) < 2 {
		return nil, errors.New("empty point list " + ref(pl))
	}
	coords := make([]section.Point, len(rows))
	for i, r := range rows {
		var c [2]float64
		if n, ok := readReals(r, c[:]); !ok || n < 2 {
			return nil, errors.New("unreadable point list " + ref(pl))
		}
		coords[i] = section.Point{X: c[0] * x.lengthFactor, Y: c[1] * x.lengthFactor}
	}
	segs := in.Attr(pIndexedSegs)
	if segs.IsUnset() {
		return coords, nil
	}
	list, err := segs.List()
	if err != nil {
		return nil, errors.New("unreadable segments of " + ref(in))
	}
	at := func(i int64) (section.Point, bool) {
		if i < 1 || i > int64(len(coords)) {
			return section.Point{}, false
		}
		return coords[i-1], true
	}
	var pts []section.Point
	for _, s := range list {
		name, inner, ok := s.Typed()
		if !ok {
			return nil, errors.New("unreadable segment of " + ref(in))
		}
		idx, err := inner.List()
		if err != nil {
			return nil, errors.New("unreadable segment of " + ref(in))
		}
		var seg []section.Point
		for _, iv := range idx {
			i, ok := iv.Int()
			if !ok {
				return nil, errors.New("unreadable index in " + ref(in))
			}
			p, ok := at(i)
			if !ok {
				return nil, errors.New("index out of range in " + ref(in))
			}
			seg = append(seg, p)
		}
		switch name {
		case "IFCLINEINDEX":
		case "IFCARCINDEX":
			if len(seg) != 3 {
				return nil, errors.New("arc segment without three points in " + ref(in))
			}
			arc, ok := arcThrough(seg[0], seg[1], seg[2])
			if !ok {
				return nil, errors.New("degenerate arc in " + ref(in))
			}
			seg = arc
		default:
			return nil, unsupportedError("segment " + name + " is not supported")
		}
		if len(pts) > 0 && len(seg) > 0 && near(pts[len(pts)-1], seg[0]) {
			seg = seg[1:]
		}
		pts = append(pts, seg...)
	}
	return pts, nil
}

// arcThrough returns chords of the circular arc from a through b to c.
func arcThrough(a, b, c section.Point) ([]section.Point, bool) {
	d := 2 * (a.X*(b.Y-c.Y) + b.X*(c.Y-a.Y) + c.X*(a.Y-b.Y))
	if math.Abs(d) < 1e-12 {
		return nil, false
	}
	a2, b2, c2 := a.X*a.X+a.Y*a.Y, b.X*b.X+b.Y*b.Y, c.X*c.X+c.Y*c.Y
	ux := (a2*(b.Y-c.Y) + b2*(c.Y-a.Y) + c2*(a.Y-b.Y)) / d
	uy := (a2*(c.X-b.X) + b2*(a.X-c.X) + c2*(b.X-a.X)) / d
	r := math.Hypot(a.X-ux, a.Y-uy)
	t0 := math.Atan2(a.Y-uy, a.X-ux)
	t2 := math.Atan2(c.Y-uy, c.X-ux)
	// Counter-clockwise when b lies on the ccw sweep from a to c.
	ccw := d > 0
	sweep := func(from, to float64) float64 {
		s := to - from
		if ccw {
			for s < 0 {
				s += 2 * math.Pi
			}
		} else {
			for s > 0 {
				s -= 2 * math.Pi
			}
		}
		return s
	}
	s := sweep(t0, t2)
	n := int(math.Ceil(math.Abs(s) / (arcChordDeg * math.Pi / 180)))
	pts := section.ArcPoints(ux, uy, r, t0, t0+s, max(n, 1))
	pts[0], pts[len(pts)-1] = a, c
	return pts, true
}
