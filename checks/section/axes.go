package section

import "math"

// AxisI returns the second moments about centroidal axes parallel to the
// shape's own x and y axes, and the product of inertia ∫xy dA, mm⁴, from the
// principal values and Angle. For a shape whose principal axes are x and y
// (Angle 0) ix = IMajor and iy = IMinor; for Angle π/2 they swap.
func (p Properties) AxisI() (ix, iy, ixy float64) {
	s, c := math.Sincos(p.Angle)
	ix = p.IMajor*c*c + p.IMinor*s*s
	iy = p.IMajor*s*s + p.IMinor*c*c
	ixy = (p.IMinor - p.IMajor) * s * c
	return ix, iy, ixy
}
