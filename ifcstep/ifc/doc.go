// Package ifc turns a parsed IFC model (an ifcstep.File) into the members
// the checks need (a checks.Model): every steel column with its section,
// length, material, restraint per axis and design actions per load
// combination, and every gap reported rather than guessed (design §4).
//
//	f, err := ifcstep.ReadFile("model.ifc", ifcstep.Options{})
//	...
//	m, err := ifc.Extract(f, ifc.Options{})
//
// # Schemas
//
// Attribute values are positional and the positions differ between IFC2X3,
// IFC4 and IFC4X3 (IfcColumn has 8 or 9 attributes, IfcIShapeProfileDef 8 or
// 10, IfcAsymmetricIShapeProfileDef was restructured, the T, L, U and C
// profiles lost their centre of gravity). Every entity read has its
// attribute list per family in schema.go, as ifc-facts.md §2–3 gives them;
// positions that move are resolved from those lists per family, and the
// positions that do not move are named constants checked against the lists
// by a test.
//
// # Units
//
// The project's IfcUnitAssignment: IfcSIUnit with its prefix (a prefix of
// SQUARE_METRE or CUBIC_METRE is squared or cubed: MILLI SQUARE_METRE is a
// square millimetre), IfcConversionBasedUnit (inch, foot, pound-force, kip,
// psi, degree... by their conversion factor) and IfcDerivedUnit (torque,
// modulus, second moment...), checked by their dimensions. Everything is
// converted to N, mm, MPa, N·mm and radians. A unit type the assignment does
// not give is the SI unit, recorded as an assumption when a value of that
// type is read (and warned about when the units it derives from are not SI).
// An IfcPropertySingleValue's own Unit wins over the project's.
//
// # Members
//
// IfcColumn and IfcColumnStandardCase; IfcMember of the predefined types of
// Options.MemberTypes (the type object's PredefinedType wins over the
// occurrence's). A model without any IfcColumn (an analysis model) has its
// vertical IfcStructuralCurveMembers (within 10° of vertical) taken as the
// members, recorded as an assumption.
//
// For each member, in order of precedence:
//
//   - storey: IfcRelContainedInSpatialStructure of the element or of the
//     assembly it is part of (IfcRelAggregates), up to an IfcBuildingStorey
//     (through a space); StoreyKey is the storey's "#id".
//   - material: IfcRelAssociatesMaterial of the occurrence, else of its type
//     (IfcRelDefinesByType). A material whose name or category says
//     concrete, timber, masonry or aluminium, or whose properties say concrete
//     (a compressive strength) or whose modulus is below 100 000 MPa, is not
//     steel: the element is listed in Model.Skipped with reason not-steel. A
//     material that says neither steel nor anything else is kept as steel,
//     with the problem material-unknown.
//   - E, fy, fu: IFC4 IfcMaterialProperties (Pset_MaterialMechanical
//     YoungModulus, Pset_MaterialSteel YieldStress, UltimateStress,
//     StructuralGrade), IFC2X3 IfcMechanicalSteelMaterialProperties; values
//     not plausible for steel are ignored with a note; none given leaves 0 for
//     the rule set's recorded default.
//   - profile: the material profile set (IfcMaterialProfileSetUsage, the set
//     or an IfcMaterialProfile) of the occurrence, else of the type, else the
//     body's IfcExtrudedAreaSolid.SweptArea, also through IfcMappedItem and
//     the first operand of IfcBooleanClippingResult/IfcBooleanResult. A
//     tessellated or Brep body gives missing-section.
//   - section properties: computed from the profile's dimensions
//     (checks/section shapes: every parametric profile of design §5.1,
//     IfcDerivedProfileDef and IfcMirroredProfileDef as a Transformed shape,
//     arbitrary closed profiles with voids from IfcPolyline,
//     IfcIndexedPolyCurve and IfcCompositeCurve of lines and circular or
//     elliptic arcs, as chords of at most 2°). The properties are about the
//     principal axes. The computed values win; the model's profile properties
//     (IFC4 Pset_ProfileMechanical in IfcProfileProperties, IFC2X3
//     IfcStructuralProfileProperties) fill only what the dimensions cannot
//     give (a profile that cannot be mapped, J and Iw of an outline), which
//     is recorded, and differences over 2 % are reported.
//   - sway directions: the major principal axis in world coordinates, from
//     the placement chain (IfcLocalPlacement, cycles guarded), the profile's
//     plane (the element's xy plane for a material profile set, else the
//     extrusion's Position), the profile's Position and the section's
//     principal angle. Bending about an axis sways the column perpendicular
//     to it: a major axis along X sways in Y. Axes more than 10° from X and Y
//     are given the nearer direction with skewed-column.
//   - length: the linked analytical member's edge, else the extrusion's
//     Depth × |ExtrudedDirection · member axis| (the 'Axis' polyline, else
//     the extrusion direction), else Qto_ColumnBaseQuantities (IFC2X3
//     BaseQuantities) Length; BaseZ/TopZ from the same sources.
//   - restraint: our property set Swaygate_ColumnDesign on the occurrence,
//     property by property over the one on its type (design §4.1); end
//     conditions give ke by checks/effective's idealised table of
//     Options.KeFamily when no factor is given. No set leaves the axes unknown
//     for the engine to report missing-restraint (or to fill from the user's
//     defaults).
//
// # Actions
//
// In precedence:
//
//  1. A side-car (Options.Actions, package ifcstep/sidecar): then the only
//     source; its combinations are the model's; a GlobalId the model does
//     not have is a warning unknown-global-id.
//  2. The analysis results of the linked IfcStructuralCurveMember
//     (IfcRelAssignsToProduct in either direction, IFC2X3
//     IfcRelConnectsStructuralElement): IfcStructuralCurveReaction of an
//     IfcStructuralResultGroup whose ResultForLoadGroup is a load combination
//     (LOAD_COMBINATION, IFC2X3 LOAD_COMBINATION_GROUP, or a group built by
//     IfcRelAssignsToGroupByFactor). Results of bare load cases are skipped
//     with a warning unless Options.LoadCases. The combination is named by
//     its load group; TheoryType gives the theory. When the model has results,
//     its combinations are those with results (the others are listed in a
//     warning); when it has none, every declared combination is listed.
//  3. Swaygate_DesignActions of the occurrence (one combination, named by the
//     set's Description or "design").
//
// Results are an IfcStructuralLoadConfiguration of
// IfcStructuralLoadSingleForce at Locations along the member. GLOBAL_COORDS
// are resolved onto the member's local axes (x along the edge, z from Axis,
// y = z × x) — except that end forces declared global which balance only
// when read in the local axes are read as local (global-coords-suspect), as
// the buildingSMART structural sample writes them. The sign convention
// (section forces, or end forces) is detected per member and combination
// from the axial forces at the two ends (opposite signs: end forces; the
// same: section forces; within 10 % of the larger: no sign) unless declared
// (Options.Convention); an undecided pattern reads both ways, takes the
// larger compression and peaks, and marks the curvature unknown
// (CurvatureUnknown, sign-convention-ambiguous: beta_m = -1). MomentY is
// major-axis bending and MomentZ minor, resolved onto the section's principal
// axes (and onto the physical profile's when the analytical local y is more
// than 10° from it: axes-mismatch). N* is the largest compression along the
// member; M*m the largest |M| along it, between stations from the cubic
// Hermite interpolant with the shears as slopes (exact for a uniform load);
// shears that differ mark a load between the ends. Where most members of a
// combination come out in tension, those in tension get axial-sign-suspect.
// End moments alone (side-car, property set) with a transverse load flagged
// (TransverseLoadMajor/Minor) give interior-moment-unknown unless the
// side-car gives the peak.
//
// # Speed
//
// The reader keeps no inverse references: the relationships are scanned once
// (the long lists on every core) into maps keyed by the candidates, and the
// members are then extracted on every core, each worker with its own caches
// (placements, directions, profiles, materials, storeys), and merged in
// candidate order, so that the model does not depend on the number of
// workers. Attributes are decoded once per instance into stack buffers.
package ifc
