package section

// Support says how a plate element is held along its two longitudinal edges,
// which decides its local buckling limits.
type Support uint8

const (
	// OneEdge is an outstand: supported along one edge, free along the other
	// (a flange outstand of an I, a leg of an angle, the stem of a tee).
	OneEdge Support = iota + 1
	// BothEdges is an internal element: supported along both edges (the web
	// of an I or channel, a wall of a rectangular hollow section).
	BothEdges
	// Ring is the wall of a circular hollow section; its slenderness is
	// taken on the outside diameter.
	Ring
)

func (s Support) String() string {
	switch s {
	case OneEdge:
		return "one edge"
	case BothEdges:
		return "both edges"
	case Ring:
		return "ring"
	}
	return "unknown"
}

// Plate is one plate element of a section for the local buckling checks.
//
// Width is the clear width: for an outstand, from the face of the supporting
// plate to the free edge; for an internal element, between the faces of the
// two supporting plates (root fillets and corner radii not deducted); for a
// circular hollow section, the outside diameter. Standards that measure the
// flat width instead (EN 1993-1-1 Table 5.2 deducts the root radius at each
// supported edge of a rolled section) deduct Fillet themselves.
type Plate struct {
	Part      string  // "flange", "web", "wall", "leg" or "lip"
	Width     float64 // clear width, mm (see above)
	Thickness float64 // mm; the nominal thickness for tapered plates
	Fillet    float64 // root fillet or inner corner radius at each supported edge, mm (0: none)
	Support   Support
	Count     int // number of such plates in the section
}

// Plated is implemented by shapes made of plates: ISection, AsymmetricI,
// RHS, CHS, Channel, Tee, Angle, LippedChannel and Zed (and a Transformed of
// one of them). Solid shapes and polygons have no plate elements.
type Plated interface {
	Shape
	// Plates lists the plate elements; an error means invalid dimensions.
	Plates() ([]Plate, error)
}

// Outliner is implemented by shapes that can give their outline as polygons:
// every shape of this package. Arcs come back as chords of at most 5°.
type Outliner interface {
	Shape
	Outline() (Polygon, error)
}

// arcStep is the largest angle a chord of an Outline spans.
const arcStep = 5 * 3.141592653589793 / 180

// outline turns a builder's exact region into a Polygon.
func outline(b builder) (Polygon, error) {
	d, err := b.build()
	if err != nil {
		return Polygon{}, err
	}
	outer, holes := d.reg.polygon(arcStep)
	return Polygon{Name: d.name, Outer: outer, Holes: holes}, nil
}
