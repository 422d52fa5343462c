// Package section computes the geometric properties of steel cross-sections
// from plain shape structs (no IFC names): area, second moments about the
// principal axes, radii of gyration, elastic and plastic section moduli, and
// the torsion and warping constants where the shape has a formula.
//
// Lengths are in mm and the results in mm², mm⁴, mm³ and mm⁶.
//
// Axis convention: for I, channel, tee and rectangular shapes, major is
// bending about the shape's x-axis (flanges parallel to x, depth along y).
//
// # Shapes
//
// Each shape is a plain struct of dimensions in mm, usable as a literal
// (no constructor); Properties validates the dimensions and returns a
// *DimensionError naming the field at fault. The parametric shapes put
// their origin at the centre of the bounding box, as IFC does: ISection,
// AsymmetricI, RHS, CHS, Rect, Circle, Tee, Angle, Channel, LippedChannel
// and Zed. Polygon is an arbitrary outline with holes; Transformed moves,
// turns, mirrors or scales another shape.
//
// # Method
//
// Area, centroid and second moments are integrated exactly over the
// outline by Green's theorem, with root fillets and rounded corners kept as
// true circular arcs. The principal axes follow from the second moments;
// Angle is the major axis's inclination (0 when it is x, π/2 when it is y).
// Z is I over the farthest fibre from the principal axis. S is ∫|v − c| dA
// about the equal-area axis parallel to the principal axis, exact for every
// shape including fillets (the axis is found to rounding by iteration when
// the section is not symmetric about it). J and Iw come from shape
// formulas, documented on each shape; they are NaN for a Polygon.
package section

// Properties are the section properties a check needs. Unknown values are
// NaN.
type Properties struct {
	Profile string // designation as given, e.g. "IPE200", "310UC96.8"
	Shape   string // "I", "RHS", "CHS", "RECT", "CIRC", "T", "L", "U", "C", "Z", "ARB"

	A      float64 // area, mm²
	IMajor float64 // second moment about the major principal axis, mm⁴
	IMinor float64 // about the minor principal axis, mm⁴
	RMajor float64 // radius of gyration, mm
	RMinor float64
	ZMajor float64 // elastic section modulus (smaller of the two extreme fibres), mm³
	ZMinor float64
	SMajor float64 // plastic section modulus, mm³
	SMinor float64
	J      float64 // torsion constant, mm⁴
	Iw     float64 // warping constant, mm⁶

	// Angle is the rotation (radians, counter-clockwise) of the major principal
	// axis from the shape's x-axis; 0 for doubly symmetric shapes.
	Angle float64

	// Cx, Cy locate the centroid in the shape's own coordinates, mm (the
	// parametric shapes of this package put their origin at the centre of the
	// bounding box, as IFC does).
	Cx, Cy float64

	// Source: "computed" from dimensions, or "model" (properties given in the
	// model, e.g. Pset_ProfileMechanical).
	Source string

	// Geometry is the shape the properties were computed from (nil when they
	// came from the model); the capacity checks read plate dimensions from it.
	Geometry Shape
}

// Shape is a cross-section that can compute its own properties.
type Shape interface {
	// Properties computes the section properties. An error means the
	// dimensions are not a valid section (for example a wall thicker than
	// half the width).
	Properties() (Properties, error)
}
