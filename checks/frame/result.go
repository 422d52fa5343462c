package frame

// Status says what the eigenvalue analysis of a combination found.
type Status uint8

const (
	// Buckles: a positive buckling load factor was found.
	Buckles Status = iota
	// NoCompression: no member is in compression; there is no buckling
	// (Lambda is +Inf).
	NoCompression
	// NoPositive: members are in compression but no positive load factor
	// exists (the compression is held by restrained or tension-stiffened
	// parts); Lambda is +Inf and NegativeLambda tells whether the
	// reversed loads would buckle the frame.
	NoPositive
)

func (s Status) String() string {
	switch s {
	case NoCompression:
		return "no-compression"
	case NoPositive:
		return "no-positive-buckling"
	}
	return "buckles"
}

// Result is the elastic buckling analysis of a model.
type Result struct {
	// Combinations holds one entry per Model.Combinations, in order.
	Combinations []Buckling
	// Lambda is the lowest buckling load factor over the combinations
	// (+Inf if none buckles), Governing its combination's index (-1 if
	// none).
	Lambda    float64
	Governing int
	// Limitations lists the buckling modes this analysis cannot represent.
	Limitations []string
	// Notes records what the analysis assumed about the model, such as
	// degrees of freedom restrained for lack of any stiffness.
	Notes []string
	Stats Stats
}

// Stats describe the size and cost of the analysis.
type Stats struct {
	Points   int     // model nodes and interior points
	Elements int     // beam-column elements after subdivision
	DOF      int     // equations solved
	Ordering string  // ordering used for the factorisation
	FactorNZ int     // entries stored in the Cholesky factor
	Flops    float64 // multiply–adds of the factorisation
	Eigen    string  // "dense" or "lanczos"
}

// Buckling is the result of one combination.
type Buckling struct {
	Combination string
	Status      Status
	// Lambda is the lowest positive buckling load factor: the axial forces
	// times Lambda buckle the frame. +Inf when it does not buckle.
	Lambda float64
	// NegativeLambda, for Status NoPositive, is the negative load factor of
	// least magnitude (the reversed forces times |NegativeLambda| buckle
	// the frame), or -Inf if there is none. 0 otherwise.
	NegativeLambda float64
	// Modes are the lowest positive modes, Lambda first.
	Modes []Mode
	// Ke holds per member the effective length factors derived from Lambda:
	// ke = π·sqrt(E·I/(λ·N*))/L, with L the node-to-node length and N* the
	// member's compression; [0] about local y (Iy), [1] about local z (Iz).
	// NaN where N* ≤ 0, where the frame does not buckle, and for the
	// out-of-plane axis of a plane model.
	Ke [][2]float64
	// Applications of the eigenvalue operator (each one forward and one
	// backward substitution).
	Steps int
}

// Mode is one buckling mode.
type Mode struct {
	Lambda float64
	// Nodes are the translations of the model nodes in global axes,
	// scaled so that the largest translation of any point (model node or
	// interior point) is 1, its largest component positive.
	Nodes []Vec3
	// Interior holds per member the translations of its interior points,
	// from start to end (nil for a member of one element), on the same
	// scale.
	Interior [][]Vec3
	// Share is each member's part of the mode's second-order work,
	// φᵀ·(N*·G0)·φ over its elements divided by the total: the members
	// with the largest shares drive the mode. Tension members have
	// negative shares; the shares sum to 1.
	Share []float64
}
