package frame

// Vec3 is a vector in global model coordinates (positions and offsets in mm).
type Vec3 [3]float64

// Axes is a right-handed coordinate system given as in an IfcAxis2Placement3D:
// Z is the third axis (IFC Axis) and X the reference direction (IFC
// RefDirection), made perpendicular to Z; Y = Z × X. A zero Z means global
// Z. A zero X means global X, or global Y when Z is parallel to global X.
type Axes struct {
	Z, X Vec3
}

// Node is a point of the analytical model (an IfcStructuralPointConnection).
type Node struct {
	ID      string // caller's identifier, used in messages (e.g. "#118" or a GlobalId)
	Pos     Vec3   // mm, global coordinates; global Z is up (Storeys uses it)
	Support *Support
}

// Support restrains the degrees of freedom of a node (an
// IfcBoundaryNodeCondition), in the order ux, uy, uz, rx, ry, rz of Axes.
// The zero value restrains nothing.
type Support struct {
	// Fixed marks rigidly restrained degrees of freedom (IFC: TRUE).
	Fixed [6]bool
	// Stiffness is the elastic restraint of a degree of freedom that is not
	// Fixed: N/mm for translations, N·mm/rad for rotations (IFC: a
	// stiffness value; FALSE or absent: 0, free).
	Stiffness [6]float64
	// Axes is the condition coordinate system the six components refer to;
	// nil means global axes.
	Axes *Axes
}

// EndCondition connects one end of a member to its node. The zero value is
// a rigid connection at the node.
type EndCondition struct {
	// Released marks local degrees of freedom (ux, uy, uz, rx, ry, rz in
	// the member's local axes) that are not connected to the node: a hinge
	// for rotations, a slot for translations.
	Released [6]bool
	// Stiffness is an optional spring across a released degree of freedom
	// (semi-rigid connection): N/mm or N·mm/rad; 0 is a free release.
	Stiffness [6]float64
	// Offset is a rigid eccentricity: the global vector (mm) from the node
	// to the member's end. The rigid link carries no geometric stiffness.
	Offset Vec3
}

// Member is a prismatic member between two nodes (an
// IfcStructuralCurveMember). Local axes follow IFC: x from the start node to
// the end node, z along Axis made perpendicular to x, y = z × x. Iy is the
// second moment about local y (bending that deflects along z), Iz about
// local z.
type Member struct {
	ID    string
	Nodes [2]int          // start and end, indices into Model.Nodes
	Ends  [2]EndCondition // at the start and end node

	E  float64 // Young's modulus, MPa
	G  float64 // shear modulus, MPa (3D models)
	A  float64 // area, mm²
	Iy float64 // mm⁴
	Iz float64 // mm⁴
	J  float64 // St Venant torsion constant, mm⁴ (3D models)

	// Axis is the local z direction (IFC Axis). Zero selects a default:
	// in 3D, global Z made perpendicular to x, or global X for a vertical
	// member; in a plane model, the in-plane direction n × x, so that
	// in-plane bending is about local y and uses Iy.
	Axis Vec3

	// Elements overrides Options.Elements for this member (0: default).
	Elements int
}

// Combination is one load combination: the axial force of every member.
type Combination struct {
	Name string
	// Compression holds one axial force per member, indexed like
	// Model.Members, in N: compression positive, tension negative. The
	// force is taken as constant along the member.
	Compression []float64
}

// Model is an analytical frame with its load combinations.
type Model struct {
	Nodes        []Node
	Members      []Member
	Combinations []Combination
	// Plane, when not nil, declares a plane model (IFC IN_PLANE_LOADING_2D
	// with OrientationOf2DPlane): the model lies in a plane parallel to the
	// X–Y plane of Plane, and only the in-plane translations and the
	// rotation about Plane's Z are solved (3 degrees of freedom per node).
	// Every node must lie in the plane through the first node (within
	// 1e-6 of the model size), every member's local y or z must be normal
	// to it, and a support's Axes must have one axis normal to it.
	// Releases of out-of-plane degrees of freedom are ignored.
	Plane *Axes
}

// Ordering selects the fill-reducing ordering of the sparse factorisation.
type Ordering uint8

const (
	// OrderAuto computes both orderings and keeps the one with the smaller
	// predicted factorisation cost.
	OrderAuto Ordering = iota
	// OrderMinDegree is a minimum degree ordering of the node graph.
	OrderMinDegree
	// OrderRCM is the reverse Cuthill–McKee (profile) ordering.
	OrderRCM
)

func (o Ordering) String() string {
	switch o {
	case OrderMinDegree:
		return "minimum-degree"
	case OrderRCM:
		return "reverse-cuthill-mckee"
	}
	return "auto"
}

// Eigen selects the eigenvalue method.
type Eigen uint8

const (
	// EigenAuto uses EigenDense up to DenseLimit degrees of freedom and
	// EigenLanczos above.
	EigenAuto Eigen = iota
	// EigenDense forms L⁻¹·Kg·L⁻ᵀ densely and calls a symmetric eigensolver.
	EigenDense
	// EigenLanczos runs restarted Lanczos iteration on L⁻¹·Kg·L⁻ᵀ.
	EigenLanczos
)

func (e Eigen) String() string {
	switch e {
	case EigenDense:
		return "dense"
	case EigenLanczos:
		return "lanczos"
	}
	return "auto"
}

// DenseLimit is the largest number of degrees of freedom EigenAuto solves
// densely.
const DenseLimit = 600

// Options control the analysis. The zero value is the default.
type Options struct {
	// Elements is the number of elements each member carrying axial force
	// in any combination is divided into, so that buckling between nodes
	// is captured (0: 4). Members without axial force in every combination
	// stay one element: with no geometric stiffness their cubic element is
	// exact.
	Elements int
	// Modes is the number of buckling modes wanted per combination (0: 3).
	Modes int
	// Torsion adds the Wagner term P·(Iy+Iz)/A to the geometric stiffness
	// of twist. Without warping stiffness it finds pure torsional buckling
	// of open sections far too low, so it is off by default.
	Torsion bool
	// Ordering of the sparse factorisation (default OrderAuto).
	Ordering Ordering
	// Eigen is the eigenvalue method (default EigenAuto).
	Eigen Eigen
	// Tol is the convergence tolerance of the Lanczos iteration (0: 1e-7):
	// a mode is accepted when its residual ‖C·x − θ·x‖ is below Tol·|θ|,
	// θ = 1/λ. The relative error of λ is then below Tol, and usually
	// near Tol² divided by the relative gap to the next mode.
	Tol float64
}

func (o Options) withDefaults() Options {
	if o.Elements <= 0 {
		o.Elements = 4
	}
	if o.Modes <= 0 {
		o.Modes = 3
	}
	if !(o.Tol > 0) {
		o.Tol = 1e-7
	}
	return o
}
