// Package frame computes the elastic buckling load factors of a frame (AS
// 4100 4.7.2 rational buckling analysis, EN 1993-1-1 5.2.1 α_cr, AISC 360
// Appendix 7 sidesway buckling analysis) from its analytical model: nodes,
// supports, prismatic members, and the axial forces of each load
// combination. It is pure numerics: no IFC, no I/O.
//
// # Model
//
// A Model mirrors an IFC structural analysis model: Nodes
// (IfcStructuralPointConnection) with optional Supports
// (IfcBoundaryNodeCondition: six fixities or stiffnesses, in an optional
// rotated condition coordinate system), Members (IfcStructuralCurveMember)
// between two nodes with E, G, A, Iy, Iz, J and the local z direction Axis,
// EndConditions per member end (releases with optional springs, and rigid
// eccentricities), and Combinations with the axial force of every member,
// compression positive. Model.Plane declares an IN_PLANE_LOADING_2D model,
// solved with three degrees of freedom per node.
//
// Units: N, mm, MPa, N·mm; springs in N/mm and N·mm/rad.
//
// Local member axes follow IFC: x from the start node to the end node, z
// along Axis (made perpendicular to x), y = z × x; Iy is the second moment
// about y.
//
// # Filling a Model from IFC
//
// The types follow the structural analysis domain so that a reader can
// fill them directly:
//
//   - IfcStructuralPointConnection → Node: Pos from its vertex;
//     AppliedCondition → Support; ConditionCoordinateSystem → Support.Axes.
//   - IfcBoundaryNodeCondition → Support: a stiffness component that is
//     TRUE is Fixed, FALSE or absent is free, a stiffness measure goes to
//     Stiffness (converted to N/mm or N·mm/rad).
//   - IfcStructuralCurveMember → Member: its Axis attribute → Axis; the
//     profile's area, MomentOfInertiaY/Z and TorsionalConstantX → A, Iy,
//     Iz, J; the material's moduli → E, G.
//   - IfcRelConnectsStructuralMember → EndCondition of the member end at
//     that connection: a component of its AppliedCondition that is FALSE
//     is Released, one with a stiffness value is Released with that
//     Stiffness. Releases are in the member's local axes; a
//     ConditionCoordinateSystem that differs from them must be resolved by
//     the reader. IfcRelConnectsWithEccentricity's
//     IfcConnectionPointEccentricity → Offset, as a global vector.
//   - IfcStructuralAnalysisModel with PredefinedType IN_PLANE_LOADING_2D →
//     Plane = OrientationOf2DPlane (its X–Y plane is the plane of analysis).
//   - Member axial forces of a combination's results → Combination, with
//     the sign turned to compression positive.
//
// # Method
//
// Each member carrying axial force in any combination is divided into
// Options.Elements (default 4) 12-degree-of-freedom Euler–Bernoulli
// beam-column elements, so that buckling of a member between its nodes
// (the P-δ effect) is captured as well as sway of the frame (P-Δ); the
// error of a pin-ended strut is +21.6 % with one element, +0.75 % with two,
// +0.05 % with four and +0.003 % with eight. The elastic stiffness K and,
// per combination, the geometric stiffness G = Σ N*·G0 (the consistent
// geometric matrix per unit compression) are assembled into a sparse
// matrix; releases become extra unknowns, so that hinges are exact rather
// than condensed.
//
// K is ordered (minimum degree or reverse Cuthill–McKee, whichever
// predicts less work) and factored once, K = L·Lᵀ, by a supernodal
// multifrontal Cholesky factorisation; a singular K is reported as a
// *MechanismError naming the node and degree of freedom. The buckling
// problem K·φ = λ·G·φ becomes the symmetric eigenproblem of
// C = L⁻¹·G·L⁻ᵀ, whose largest positive eigenvalues θ = 1/λ give the
// lowest positive load factors; they are found by Lanczos iteration with
// thick restarts (or densely, for up to DenseLimit unknowns).
//
// # Results
//
// Per combination: λ (Buckling.Lambda; +Inf when nothing is in
// compression, and NegativeLambda when only reversed loads would buckle
// the frame), a few modes with their node translations normalised to a
// largest value of 1 and each member's share of the mode's second-order
// work (Mode.Share, Mode.TopMembers, Storeys), and each member's effective
// length factor implied by λ (EffectiveLengthFactor): ke = π·sqrt(E·I/(λ·N*))/L.
//
// # Not represented
//
// Result.Limitations lists the modes that a 12-degree-of-freedom element
// with axial-force geometric stiffness cannot find: above all warping
// torsion of open sections (torsional and flexural–torsional buckling) and
// lateral–torsional buckling.
package frame
