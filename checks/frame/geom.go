package frame

import "math"

func (a Vec3) add(b Vec3) Vec3      { return Vec3{a[0] + b[0], a[1] + b[1], a[2] + b[2]} }
func (a Vec3) sub(b Vec3) Vec3      { return Vec3{a[0] - b[0], a[1] - b[1], a[2] - b[2]} }
func (a Vec3) scale(s float64) Vec3 { return Vec3{s * a[0], s * a[1], s * a[2]} }
func (a Vec3) dot(b Vec3) float64   { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func (a Vec3) norm() float64        { return math.Sqrt(a.dot(a)) }
func (a Vec3) isZero() bool         { return a[0] == 0 && a[1] == 0 && a[2] == 0 }
func (a Vec3) cross(b Vec3) Vec3 {
	return Vec3{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}

func (a Vec3) unit() Vec3 {
	n := a.norm()
	if n == 0 {
		return a
	}
	return a.scale(1 / n)
}

func (a Vec3) finite() bool {
	for _, v := range a {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

// rot is an orthonormal frame: its rows are the unit x, y and z axes in
// global coordinates. It maps global components to frame components
// (v_frame = rot·v_global).
type rot [3]Vec3

// apply returns r·v (global → frame components).
func (r *rot) apply(v Vec3) Vec3 { return Vec3{r[0].dot(v), r[1].dot(v), r[2].dot(v)} }

// frame builds the rotation of a, reporting false when its directions are
// degenerate (zero-length Z given as non-zero components that are not
// finite, or X parallel to Z).
func (a Axes) frame() (rot, bool) {
	if !a.Z.finite() || !a.X.finite() {
		return rot{}, false
	}
	z := a.Z
	if z.isZero() {
		z = Vec3{0, 0, 1}
	}
	z = z.unit()
	x := a.X
	if x.isZero() {
		x = Vec3{1, 0, 0}
		if math.Abs(z[0]) > 1-1e-12 {
			x = Vec3{0, 1, 0}
		}
	}
	x = x.sub(z.scale(x.dot(z)))
	if x.norm() < 1e-9*a.X.norm() || x.norm() == 0 {
		return rot{}, false
	}
	x = x.unit()
	return rot{x, z.cross(x), z}, true
}

// memberFrame returns the local axes of a member from its start point to its
// end point with local z along axis (made perpendicular to x). It reports
// false when the member has zero length or axis is parallel to it.
func memberFrame(pa, pb, axis Vec3) (r rot, length float64, ok bool) {
	d := pb.sub(pa)
	length = d.norm()
	if !(length > 0) || math.IsInf(length, 0) {
		return rot{}, 0, false
	}
	x := d.scale(1 / length)
	z := axis.sub(x.scale(axis.dot(x)))
	if z.norm() <= 1e-6*axis.norm() || z.norm() == 0 {
		return rot{}, length, false
	}
	z = z.unit()
	return rot{x, z.cross(x), z}, length, true
}

// defaultAxis is the local z direction of a member with no Axis given: in a
// plane model with normal n, the in-plane direction n × x; in 3D global Z,
// or global X for members within about 8° of vertical (|x·Z| > 0.99).
func defaultAxis(x Vec3, plane *rot) Vec3 {
	if plane != nil {
		return plane[2].cross(x)
	}
	if math.Abs(x[2]) > 0.99 {
		return Vec3{1, 0, 0}
	}
	return Vec3{0, 0, 1}
}
