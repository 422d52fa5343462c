package ifc

import (
	"math"

	"swaygate/ifcstep"
)

// vec is a 3-D vector (mm for points).
type vec [3]float64

func (a vec) add(b vec) vec       { return vec{a[0] + b[0], a[1] + b[1], a[2] + b[2]} }
func (a vec) sub(b vec) vec       { return vec{a[0] - b[0], a[1] - b[1], a[2] - b[2]} }
func (a vec) scale(k float64) vec { return vec{a[0] * k, a[1] * k, a[2] * k} }
func (a vec) dot(b vec) float64   { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func (a vec) norm() float64       { return math.Sqrt(a.dot(a)) }
func (a vec) cross(b vec) vec {
	return vec{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}
func (a vec) unit() (vec, bool)              { n := a.norm(); return a.scale(1 / n), n > 1e-12 && !math.IsInf(n, 0) }
func (a vec) isFinite() bool                 { return !math.IsNaN(a.dot(a)) && !math.IsInf(a.dot(a), 0) }
func (a vec) approx(b vec, tol float64) bool { return a.sub(b).norm() <= tol }

// frame is a rigid placement: origin and orthonormal axes, all expressed in
// the parent system. A point p of the frame is o + x·p0 + y·p1 + z·p2.
type frame struct {
	o, x, y, z vec
}

var identity = frame{x: vec{1, 0, 0}, y: vec{0, 1, 0}, z: vec{0, 0, 1}}

// point maps a point of the frame to the parent system.
func (f frame) point(p vec) vec {
	return f.o.add(f.x.scale(p[0])).add(f.y.scale(p[1])).add(f.z.scale(p[2]))
}

// dir maps a direction of the frame to the parent system.
func (f frame) dir(d vec) vec {
	return f.x.scale(d[0]).add(f.y.scale(d[1])).add(f.z.scale(d[2]))
}

// then returns the frame g placed in f (f∘g): a point of g mapped by g, then
// by f.
func (f frame) then(g frame) frame {
	return frame{o: f.point(g.o), x: f.dir(g.x), y: f.dir(g.y), z: f.dir(g.z)}
}

// buildAxes returns orthonormal x, y, z from an axis z and a reference
// direction for x (IfcBuildAxes / IfcFirstProjAxis of the IFC schemas): x is
// ref projected on the plane normal to z; with no usable ref, (1,0,0), or
// (0,1,0) when z is along x. ok is false for a zero axis.
func buildAxes(z, ref vec, hasRef bool) (vec, vec, vec, bool) {
	z, ok := z.unit()
	if !ok {
		return vec{}, vec{}, vec{}, false
	}
	if !hasRef || ref.cross(z).norm() < 1e-9*ref.norm() {
		ref = vec{1, 0, 0}
		if math.Abs(z[0]) > 1-1e-12 {
			ref = vec{0, 1, 0}
		}
	}
	x, ok := ref.sub(z.scale(ref.dot(z))).unit()
	if !ok {
		return vec{}, vec{}, vec{}, false
	}
	return x, z.cross(x), z, true
}

// readPoint reads an IfcCartesianPoint (2 or 3 coordinates), scaled to mm.
func (x *extractor) readPoint(in ifcstep.Instance) (vec, bool) {
	if in.Type() != "IFCCARTESIANPOINT" {
		return vec{}, false
	}
	var p vec
	n, ok := readReals(in.Attr(pCoordinates), p[:])
	if !ok || n < 2 {
		return vec{}, false
	}
	k := x.lengthFactor
	return vec{p[0] * k, p[1] * k, p[2] * k}, true
}

// readDir reads an IfcDirection (2 or 3 ratios), not normalised.
func (x *extractor) readDir(in ifcstep.Instance) (vec, bool) {
	if in.Type() != "IFCDIRECTION" {
		return vec{}, false
	}
	// Directions are shared by many placements: cached.
	if d, ok := x.dirs[in.ID()]; ok {
		return d.d, d.ok
	}
	var d vec
	n, ok := readReals(in.Attr(pCoordinates), d[:])
	if !ok || n < 2 || !d.isFinite() {
		d, ok = vec{}, false
	}
	if x.dirs != nil {
		x.dirs[in.ID()] = cachedDir{d, ok}
	}
	return d, ok
}

type cachedDir struct {
	d  vec
	ok bool
}

// readReals reads a list of numbers into dst, returning how many there were.
// It decodes the list without allocating.
func readReals(v ifcstep.Value, dst []float64) (int, bool) {
	raw := v.Raw()
	if v.Kind() != ifcstep.KindList || len(raw) < 2 {
		return 0, false
	}
	n := 0
	p := 1
	for p < len(raw) {
		for p < len(raw) && (raw[p] == ' ' || raw[p] == ',' || raw[p] == '\t' || raw[p] == '\r' || raw[p] == '\n') {
			p++
		}
		if p >= len(raw) || raw[p] == ')' {
			break
		}
		q := p
		for q < len(raw) && raw[q] != ',' && raw[q] != ')' && raw[q] != ' ' {
			q++
		}
		f, ok := parseReal(raw[p:q])
		if !ok {
			// Not a plain number (a typed value, a comment): the slow path.
			return readRealsSlow(v, dst)
		}
		if n < len(dst) {
			dst[n] = f
		}
		n++
		p = q
	}
	return n, n > 0
}

func readRealsSlow(v ifcstep.Value, dst []float64) (int, bool) {
	list, err := v.List()
	if err != nil {
		return 0, false
	}
	for i, e := range list {
		f, ok := e.Real()
		if !ok {
			return 0, false
		}
		if i < len(dst) {
			dst[i] = f
		}
	}
	return len(list), len(list) > 0
}

// parseReal parses a STEP real or integer ("12.", "-1.5E-3", "42") without
// allocating; ok is false for anything else.
func parseReal(b []byte) (float64, bool) {
	if len(b) == 0 {
		return 0, false
	}
	i := 0
	neg := false
	if b[0] == '+' || b[0] == '-' {
		neg = b[0] == '-'
		i++
	}
	var mant uint64
	digits, exp := 0, 0
	start := i
	for i < len(b) && b[i] >= '0' && b[i] <= '9' {
		if digits < 18 {
			mant = mant*10 + uint64(b[i]-'0')
			if mant != 0 {
				digits++
			}
		} else {
			exp++
		}
		i++
	}
	if i == start {
		return 0, false
	}
	if i < len(b) && b[i] == '.' {
		i++
		for i < len(b) && b[i] >= '0' && b[i] <= '9' {
			if digits < 18 {
				mant = mant*10 + uint64(b[i]-'0')
				if mant != 0 {
					digits++
				}
				exp--
			}
			i++
		}
	}
	if i < len(b) && (b[i] == 'E' || b[i] == 'e') {
		i++
		eneg := false
		if i < len(b) && (b[i] == '+' || b[i] == '-') {
			eneg = b[i] == '-'
			i++
		}
		es := i
		e := 0
		for i < len(b) && b[i] >= '0' && b[i] <= '9' {
			if e < 10000 {
				e = e*10 + int(b[i]-'0')
			}
			i++
		}
		if i == es {
			return 0, false
		}
		if eneg {
			e = -e
		}
		exp += e
	}
	if i != len(b) {
		return 0, false
	}
	f := float64(mant)
	switch {
	case mant == 0:
	case exp > 0 && exp <= 22:
		f *= pow10[exp]
	case exp < 0 && exp >= -22:
		f /= pow10[-exp]
	case exp != 0:
		f *= math.Pow(10, float64(exp))
	}
	if neg {
		f = -f
	}
	return f, true
}

var pow10 = [...]float64{1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22}

// readAxis2Placement3D reads an IfcAxis2Placement3D (or a 2-D placement,
// taken in the xy plane) as a frame in mm.
func (x *extractor) readAxis2Placement(in ifcstep.Instance) (frame, bool) {
	switch in.Type() {
	case "IFCAXIS2PLACEMENT3D":
		var buf [3]ifcstep.Value
		vs := attrsOf(in, buf[:])
		if len(vs) < 3 {
			return frame{}, false
		}
		var f frame
		loc, ok := x.deref(in, vs[pLocation])
		if !ok {
			return frame{}, false
		}
		if f.o, ok = x.readPoint(loc); !ok {
			return frame{}, false
		}
		z := vec{0, 0, 1}
		if d, ok := x.deref(in, vs[pAxis]); ok {
			if z, ok = x.readDir(d); !ok {
				return frame{}, false
			}
		}
		var ref vec
		hasRef := false
		if d, ok := x.deref(in, vs[pRefDir3D]); ok {
			if ref, hasRef = x.readDir(d); !hasRef {
				return frame{}, false
			}
		}
		if f.x, f.y, f.z, ok = buildAxes(z, ref, hasRef); !ok {
			return frame{}, false
		}
		return f, true
	case "IFCAXIS2PLACEMENT2D":
		o, xa, ok := x.readPlacement2D(in)
		if !ok {
			return frame{}, false
		}
		return frame{o: vec{o[0], o[1], 0}, x: vec{xa[0], xa[1], 0}, y: vec{-xa[1], xa[0], 0}, z: vec{0, 0, 1}}, true
	}
	return frame{}, false
}

// readPlacement2D reads an IfcAxis2Placement2D: origin (mm) and unit x axis.
func (x *extractor) readPlacement2D(in ifcstep.Instance) (o [2]float64, xa [2]float64, ok bool) {
	if in.Type() != "IFCAXIS2PLACEMENT2D" {
		return o, xa, false
	}
	var buf [2]ifcstep.Value
	vs := attrsOf(in, buf[:])
	loc, ok := x.deref(in, at(vs, pLocation))
	if !ok {
		return o, xa, false
	}
	p, ok := x.readPoint(loc)
	if !ok {
		return o, xa, false
	}
	xa = [2]float64{1, 0}
	if d, ok := x.deref(in, at(vs, pRefDir2D)); ok {
		v, ok := x.readDir(d)
		if !ok {
			return o, xa, false
		}
		n := math.Hypot(v[0], v[1])
		if !(n > 1e-12) {
			return o, xa, false
		}
		xa = [2]float64{v[0] / n, v[1] / n}
	}
	return [2]float64{p[0], p[1]}, xa, true
}

// placement returns the world frame of an IfcObjectPlacement, following the
// IfcLocalPlacement chain (cached; cycles and unreadable links are reported
// and give ok false).
func (x *extractor) placement(in ifcstep.Instance) (frame, bool) {
	if f, ok := x.placements[in.ID()]; ok {
		return f.f, f.ok
	}
	var chain [64]ifcstep.Instance
	var rels [64]ifcstep.Value // RelativePlacement of each link
	var buf [2]ifcstep.Value
	n := 0
	cur := in
	var base frame = identity
	baseOK := true
	for {
		if c, ok := x.placements[cur.ID()]; ok {
			base, baseOK = c.f, c.ok
			break
		}
		if n == len(chain) {
			x.warn("placement-cycle", "the placement chain of "+ref(in)+" is longer than 64 links or cyclic: placement unknown", ref(in))
			baseOK = false
			break
		}
		for k := 0; k < n; k++ {
			if chain[k].ID() == cur.ID() {
				x.warn("placement-cycle", "the placement chain of "+ref(in)+" is cyclic (at "+ref(cur)+"): placement unknown", ref(cur))
				baseOK = false
				break
			}
		}
		if !baseOK {
			break
		}
		chain[n] = cur
		n++
		if cur.Type() != "IFCLOCALPLACEMENT" {
			if cur.Type() == "IFCGRIDPLACEMENT" {
				x.warnOnce("grid-placement", "grid placements (IfcGridPlacement) are not evaluated: the placement of elements placed on a grid is unknown", ref(cur))
			}
			baseOK = false
			break
		}
		vs := attrsOf(cur, buf[:])
		rels[n-1] = at(vs, pRelPlacement)
		parent, ok := x.deref(cur, at(vs, pRelTo))
		if !ok {
			break // relative to the world
		}
		cur = parent
	}
	// Resolve from the outermost link inwards.
	f, ok := base, baseOK
	for k := n - 1; k >= 0; k-- {
		c := chain[k]
		if ok && c.Type() == "IFCLOCALPLACEMENT" {
			rel, rok := x.deref(c, rels[k])
			var g frame
			if rok {
				g, rok = x.readAxis2Placement(rel)
			}
			if !rok {
				ok = false
			} else {
				f = f.then(g)
			}
		} else {
			ok = false
		}
		x.placements[c.ID()] = cachedFrame{f, ok}
	}
	return f, ok
}

type cachedFrame struct {
	f  frame
	ok bool
}

// transform3D reads an IfcCartesianTransformationOperator3D as a frame and
// a uniform scale (IfcBaseAxis semantics: missing axes are completed). A
// non-uniform operator gives ok false.
func (x *extractor) transform3D(in ifcstep.Instance) (frame, float64, bool) {
	switch in.Type() {
	case "IFCCARTESIANTRANSFORMATIONOPERATOR3D":
	case "IFCCARTESIANTRANSFORMATIONOPERATOR3DNONUNIFORM":
		s1, _ := in.Attr(pOpScale).Real()
		s2, ok2 := in.Attr(5).Real()
		s3, ok3 := in.Attr(6).Real()
		if s1 == 0 {
			s1 = 1
		}
		if (ok2 && s2 != s1) || (ok3 && s3 != s1) {
			return frame{}, 0, false
		}
	default:
		return frame{}, 0, false
	}
	var f frame
	org, ok := x.deref(in, in.Attr(pOpOrigin))
	if !ok {
		return frame{}, 0, false
	}
	if f.o, ok = x.readPoint(org); !ok {
		return frame{}, 0, false
	}
	scale := 1.0
	if s, ok := in.Attr(pOpScale).Real(); ok && s > 0 {
		scale = s
	}
	var a1, a3 vec
	has1, has3 := false, false
	if d, ok := x.deref(in, in.Attr(pOpAxis1)); ok {
		a1, has1 = x.readDir(d)
	}
	if d, ok := x.deref(in, in.Attr(pOpAxis3)); ok {
		a3, has3 = x.readDir(d)
	}
	if !has3 {
		a3 = vec{0, 0, 1}
	}
	if f.x, f.y, f.z, ok = buildAxes(a3, a1, has1); !ok {
		return frame{}, 0, false
	}
	return f, scale, true
}
