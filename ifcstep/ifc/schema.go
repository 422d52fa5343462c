package ifc

import (
	"strings"

	"swaygate/ifcstep"
)

// Attribute lists of every entity the extraction reads, per schema family:
// the explicit attributes flattened root first, as ifc-facts.md §2–3 lists
// them from the buildingSMART EXPRESS schemas (IFC2X3_TC1, IFC4_ADD2_TC1,
// IFC4x3 with the ADD2 corrections). "=" means "as the previous family";
// "" means the entity is not in that schema. The positions the code uses are
// resolved from these lists once per family (see schema), so a position is
// never written as a bare number in the readers.
const (
	aRoot      = "GlobalId OwnerHistory Name Description"
	aObject    = aRoot + " ObjectType"
	aProduct   = aObject + " ObjectPlacement Representation"
	aElement   = aProduct + " Tag"
	aType      = aRoot + " ApplicableOccurrence HasPropertySets"
	aTypeProd  = aType + " RepresentationMaps Tag"
	aElemType  = aTypeProd + " ElementType PredefinedType"
	aRel       = aRoot + " RelatedObjects"
	aAssigns   = aRel + " RelatedObjectsType"
	aProfile   = "ProfileType ProfileName"
	aParam     = aProfile + " Position"
	aStructAct = aProduct + " AppliedLoad GlobalOrLocal"
)

var entitySpecs = []struct {
	name         string
	x3, x4, x4x3 string
}{
	// Kernel, elements and types (§2.1).
	{"IFCCOLUMN", aElement, aElement + " PredefinedType", "="},
	{"IFCCOLUMNSTANDARDCASE", "", aElement + " PredefinedType", ""},
	{"IFCMEMBER", aElement, aElement + " PredefinedType", "="},
	{"IFCMEMBERSTANDARDCASE", "", aElement + " PredefinedType", ""},
	{"IFCCOLUMNTYPE", aElemType, "=", "="},
	{"IFCMEMBERTYPE", aElemType, "=", "="},
	{"IFCELEMENTASSEMBLY", aElement + " AssemblyPlace PredefinedType", "=", "="},
	// Placement and shape (§2.2).
	{"IFCLOCALPLACEMENT", "PlacementRelTo RelativePlacement", "=", "="},
	{"IFCGRIDPLACEMENT", "PlacementLocation PlacementRefDirection", "=", "PlacementRelTo PlacementLocation PlacementRefDirection"},
	{"IFCAXIS2PLACEMENT3D", "Location Axis RefDirection", "=", "="},
	{"IFCAXIS2PLACEMENT2D", "Location RefDirection", "=", "="},
	{"IFCCARTESIANPOINT", "Coordinates", "=", "="},
	{"IFCDIRECTION", "DirectionRatios", "=", "="},
	{"IFCPRODUCTDEFINITIONSHAPE", "Name Description Representations", "=", "="},
	{"IFCSHAPEREPRESENTATION", "ContextOfItems RepresentationIdentifier RepresentationType Items", "=", "="},
	{"IFCTOPOLOGYREPRESENTATION", "ContextOfItems RepresentationIdentifier RepresentationType Items", "=", "="},
	{"IFCEXTRUDEDAREASOLID", "SweptArea Position ExtrudedDirection Depth", "=", "="},
	{"IFCEXTRUDEDAREASOLIDTAPERED", "", "SweptArea Position ExtrudedDirection Depth EndSweptArea", "="},
	{"IFCMAPPEDITEM", "MappingSource MappingTarget", "=", "="},
	{"IFCREPRESENTATIONMAP", "MappingOrigin MappedRepresentation", "=", "="},
	{"IFCCARTESIANTRANSFORMATIONOPERATOR2D", "Axis1 Axis2 LocalOrigin Scale", "=", "="},
	{"IFCCARTESIANTRANSFORMATIONOPERATOR3D", "Axis1 Axis2 LocalOrigin Scale Axis3", "=", "="},
	{"IFCCARTESIANTRANSFORMATIONOPERATOR3DNONUNIFORM", "Axis1 Axis2 LocalOrigin Scale Axis3 Scale2 Scale3", "=", "="},
	{"IFCBOOLEANCLIPPINGRESULT", "Operator FirstOperand SecondOperand", "=", "="},
	{"IFCBOOLEANRESULT", "Operator FirstOperand SecondOperand", "=", "="},
	{"IFCPOLYLINE", "Points", "=", "="},
	{"IFCINDEXEDPOLYCURVE", "", "Points Segments SelfIntersect", "="},
	{"IFCCARTESIANPOINTLIST2D", "", "CoordList", "CoordList TagList"},
	{"IFCCOMPOSITECURVE", "Segments SelfIntersect", "=", "="},
	{"IFCCOMPOSITECURVESEGMENT", "Transition SameSense ParentCurve", "=", "="},
	{"IFCTRIMMEDCURVE", "BasisCurve Trim1 Trim2 SenseAgreement MasterRepresentation", "=", "="},
	{"IFCCIRCLE", "Position Radius", "=", "="},
	{"IFCELLIPSE", "Position SemiAxis1 SemiAxis2", "=", "="},
	{"IFCLINE", "Pnt Dir", "=", "="},
	{"IFCVECTOR", "Orientation Magnitude", "=", "="},
	// Profiles (§2.3).
	{"IFCISHAPEPROFILEDEF", aParam + " OverallWidth OverallDepth WebThickness FlangeThickness FilletRadius",
		aParam + " OverallWidth OverallDepth WebThickness FlangeThickness FilletRadius FlangeEdgeRadius FlangeSlope", "="},
	{"IFCASYMMETRICISHAPEPROFILEDEF",
		aParam + " OverallWidth OverallDepth WebThickness FlangeThickness FilletRadius TopFlangeWidth TopFlangeThickness TopFlangeFilletRadius CentreOfGravityInY",
		aParam + " BottomFlangeWidth OverallDepth WebThickness BottomFlangeThickness BottomFlangeFilletRadius TopFlangeWidth TopFlangeThickness TopFlangeFilletRadius BottomFlangeEdgeRadius BottomFlangeSlope TopFlangeEdgeRadius TopFlangeSlope", "="},
	{"IFCRECTANGLEHOLLOWPROFILEDEF", aParam + " XDim YDim WallThickness InnerFilletRadius OuterFilletRadius", "=", "="},
	{"IFCRECTANGLEPROFILEDEF", aParam + " XDim YDim", "=", "="},
	{"IFCROUNDEDRECTANGLEPROFILEDEF", aParam + " XDim YDim RoundingRadius", "=", "="},
	{"IFCCIRCLEHOLLOWPROFILEDEF", aParam + " Radius WallThickness", "=", "="},
	{"IFCCIRCLEPROFILEDEF", aParam + " Radius", "=", "="},
	{"IFCTSHAPEPROFILEDEF", aParam + " Depth FlangeWidth WebThickness FlangeThickness FilletRadius FlangeEdgeRadius WebEdgeRadius WebSlope FlangeSlope CentreOfGravityInY",
		aParam + " Depth FlangeWidth WebThickness FlangeThickness FilletRadius FlangeEdgeRadius WebEdgeRadius WebSlope FlangeSlope", "="},
	{"IFCLSHAPEPROFILEDEF", aParam + " Depth Width Thickness FilletRadius EdgeRadius LegSlope CentreOfGravityInX CentreOfGravityInY",
		aParam + " Depth Width Thickness FilletRadius EdgeRadius LegSlope", "="},
	{"IFCUSHAPEPROFILEDEF", aParam + " Depth FlangeWidth WebThickness FlangeThickness FilletRadius EdgeRadius FlangeSlope CentreOfGravityInX",
		aParam + " Depth FlangeWidth WebThickness FlangeThickness FilletRadius EdgeRadius FlangeSlope", "="},
	{"IFCCSHAPEPROFILEDEF", aParam + " Depth Width WallThickness Girth InternalFilletRadius CentreOfGravityInX",
		aParam + " Depth Width WallThickness Girth InternalFilletRadius", "="},
	{"IFCZSHAPEPROFILEDEF", aParam + " Depth FlangeWidth WebThickness FlangeThickness FilletRadius EdgeRadius", "=", "="},
	{"IFCARBITRARYCLOSEDPROFILEDEF", aProfile + " OuterCurve", "=", "="},
	{"IFCARBITRARYPROFILEDEFWITHVOIDS", aProfile + " OuterCurve InnerCurves", "=", "="},
	{"IFCDERIVEDPROFILEDEF", aProfile + " ParentProfile Operator Label", "=", "="},
	{"IFCMIRROREDPROFILEDEF", "", aProfile + " ParentProfile Operator Label", "="},
	{"IFCCOMPOSITEPROFILEDEF", aProfile + " Profiles Label", "=", "="},
	// Materials and properties (§2.4).
	{"IFCMATERIAL", "Name", "Name Description Category", "="},
	{"IFCMATERIALLIST", "Materials", "=", "="},
	{"IFCMATERIALLAYERSETUSAGE", "ForLayerSet LayerSetDirection DirectionSense OffsetFromReferenceLine", "ForLayerSet LayerSetDirection DirectionSense OffsetFromReferenceLine ReferenceExtent", "="},
	{"IFCMATERIALLAYERSET", "MaterialLayers LayerSetName", "MaterialLayers LayerSetName Description", "="},
	{"IFCMATERIALLAYER", "Material LayerThickness IsVentilated", "Material LayerThickness IsVentilated Name Description Category Priority", "="},
	{"IFCMATERIALPROFILESET", "", "Name Description MaterialProfiles CompositeProfile", "="},
	{"IFCMATERIALPROFILE", "", "Name Description Material Profile Priority Category", "="},
	{"IFCMATERIALPROFILESETUSAGE", "", "ForProfileSet CardinalPoint ReferenceExtent", "="},
	{"IFCMATERIALPROFILESETUSAGETAPERING", "", "ForProfileSet CardinalPoint ReferenceExtent ForProfileEndSet CardinalEndPoint", "="},
	{"IFCMATERIALCONSTITUENTSET", "", "Name Description MaterialConstituents", "="},
	{"IFCMATERIALCONSTITUENT", "", "Name Description Material Fraction Category", "="},
	{"IFCRELASSOCIATESMATERIAL", aRel + " RelatingMaterial", "=", "="},
	{"IFCMATERIALPROPERTIES", "", "Name Description Properties Material", "="},
	{"IFCEXTENDEDMATERIALPROPERTIES", "Material ExtendedProperties Description Name", "", ""},
	{"IFCMECHANICALMATERIALPROPERTIES", "Material DynamicViscosity YoungModulus ShearModulus PoissonRatio ThermalExpansionCoefficient", "", ""},
	{"IFCMECHANICALSTEELMATERIALPROPERTIES", "Material DynamicViscosity YoungModulus ShearModulus PoissonRatio ThermalExpansionCoefficient YieldStress UltimateStress UltimateStrain HardeningModule ProportionalStress PlasticStrain Relaxations", "", ""},
	{"IFCMECHANICALCONCRETEMATERIALPROPERTIES", "Material DynamicViscosity YoungModulus ShearModulus PoissonRatio ThermalExpansionCoefficient CompressiveStrength MaxAggregateSize AdmixturesDescription Workability ProtectivePoreRatio WaterImpermeability", "", ""},
	{"IFCPROFILEPROPERTIES", "", "Name Description Properties ProfileDefinition", "="},
	{"IFCSTRUCTURALPROFILEPROPERTIES", "ProfileName ProfileDefinition PhysicalWeight Perimeter MinimumPlateThickness MaximumPlateThickness CrossSectionArea TorsionalConstantX MomentOfInertiaYZ MomentOfInertiaY MomentOfInertiaZ WarpingConstant ShearCentreZ ShearCentreY ShearDeformationAreaZ ShearDeformationAreaY MaximumSectionModulusY MinimumSectionModulusY MaximumSectionModulusZ MinimumSectionModulusZ TorsionalSectionModulus CentreOfGravityInX CentreOfGravityInY", "", ""},
	{"IFCSTRUCTURALSTEELPROFILEPROPERTIES", "ProfileName ProfileDefinition PhysicalWeight Perimeter MinimumPlateThickness MaximumPlateThickness CrossSectionArea TorsionalConstantX MomentOfInertiaYZ MomentOfInertiaY MomentOfInertiaZ WarpingConstant ShearCentreZ ShearCentreY ShearDeformationAreaZ ShearDeformationAreaY MaximumSectionModulusY MinimumSectionModulusY MaximumSectionModulusZ MinimumSectionModulusZ TorsionalSectionModulus CentreOfGravityInX CentreOfGravityInY ShearAreaZ ShearAreaY PlasticShapeFactorY PlasticShapeFactorZ", "", ""},
	{"IFCGENERALPROFILEPROPERTIES", "ProfileName ProfileDefinition PhysicalWeight Perimeter MinimumPlateThickness MaximumPlateThickness CrossSectionArea", "", ""},
	{"IFCRELASSOCIATESPROFILEPROPERTIES", aRel + " RelatingProfileProperties ProfileSectionLocation ProfileOrientation", "", ""},
	// Properties, quantities, spatial structure, units (§2.6).
	{"IFCRELDEFINESBYPROPERTIES", aRel + " RelatingPropertyDefinition", "=", "="},
	{"IFCRELDEFINESBYTYPE", aRel + " RelatingType", "=", "="},
	{"IFCPROPERTYSET", aRoot + " HasProperties", "=", "="},
	{"IFCPROPERTYSINGLEVALUE", "Name Description NominalValue Unit", "=", "="},
	{"IFCELEMENTQUANTITY", aRoot + " MethodOfMeasurement Quantities", "=", "="},
	{"IFCQUANTITYLENGTH", "Name Description Unit LengthValue", "Name Description Unit LengthValue Formula", "="},
	{"IFCRELCONTAINEDINSPATIALSTRUCTURE", aRoot + " RelatedElements RelatingStructure", "=", "="},
	{"IFCRELAGGREGATES", aRoot + " RelatingObject RelatedObjects", "=", "="},
	{"IFCBUILDINGSTOREY", aProduct + " LongName CompositionType Elevation", "=", "="},
	{"IFCPROJECT", aObject + " LongName Phase RepresentationContexts UnitsInContext", "=", "="},
	{"IFCUNITASSIGNMENT", "Units", "=", "="},
	{"IFCSIUNIT", "Dimensions UnitType Prefix Name", "=", "="},
	{"IFCCONVERSIONBASEDUNIT", "Dimensions UnitType Name ConversionFactor", "=", "="},
	{"IFCCONVERSIONBASEDUNITWITHOFFSET", "", "Dimensions UnitType Name ConversionFactor ConversionOffset", "="},
	{"IFCMEASUREWITHUNIT", "ValueComponent UnitComponent", "=", "="},
	{"IFCDERIVEDUNIT", "Elements UnitType UserDefinedType", "=", "Elements UnitType UserDefinedType Name"},
	{"IFCDERIVEDUNITELEMENT", "Unit Exponent", "=", "="},
	// Structural analysis domain (§3).
	{"IFCSTRUCTURALANALYSISMODEL", aObject + " PredefinedType OrientationOf2DPlane LoadedBy HasResults",
		aObject + " PredefinedType OrientationOf2DPlane LoadedBy HasResults SharedPlacement", "="},
	{"IFCSTRUCTURALCURVEMEMBER", aProduct + " PredefinedType", aProduct + " PredefinedType Axis", "="},
	{"IFCSTRUCTURALCURVEMEMBERVARYING", aProduct + " PredefinedType", aProduct + " PredefinedType Axis", "="},
	{"IFCEDGE", "EdgeStart EdgeEnd", "=", "="},
	{"IFCORIENTEDEDGE", "EdgeStart EdgeEnd EdgeElement Orientation", "=", "="},
	{"IFCEDGECURVE", "EdgeStart EdgeEnd EdgeGeometry SameSense", "=", "="},
	{"IFCVERTEXPOINT", "VertexGeometry", "=", "="},
	{"IFCSTRUCTURALLOADGROUP", aObject + " PredefinedType ActionType ActionSource Coefficient Purpose", "=", "="},
	{"IFCSTRUCTURALLOADCASE", "", aObject + " PredefinedType ActionType ActionSource Coefficient Purpose SelfWeightCoefficients", "="},
	{"IFCSTRUCTURALRESULTGROUP", aObject + " TheoryType ResultForLoadGroup IsLinear", "=", "="},
	{"IFCSTRUCTURALCURVEREACTION", "", aStructAct + " PredefinedType", "="},
	{"IFCSTRUCTURALLOADCONFIGURATION", "", "Name Values Locations", "="},
	{"IFCSTRUCTURALLOADSINGLEFORCE", "Name ForceX ForceY ForceZ MomentX MomentY MomentZ", "=", "="},
	{"IFCRELASSIGNSTOPRODUCT", aAssigns + " RelatingProduct", "=", "="},
	{"IFCRELASSIGNSTOGROUP", aAssigns + " RelatingGroup", "=", "="},
	{"IFCRELASSIGNSTOGROUPBYFACTOR", "", aAssigns + " RelatingGroup Factor", "="},
	{"IFCRELCONNECTSSTRUCTURALACTIVITY", aRoot + " RelatingElement RelatedStructuralActivity", "=", "="},
	{"IFCRELCONNECTSSTRUCTURALELEMENT", aRoot + " RelatingElement RelatedStructuralMember", "", ""},
}

// famIndex maps a family to its column in entitySpecs.
func famIndex(f ifcstep.Family) int {
	switch f {
	case ifcstep.IFC2X3:
		return 0
	case ifcstep.IFC4X3:
		return 2
	}
	return 1
}

// attrLists returns the attribute names of every entity in family f.
func attrLists(f ifcstep.Family) map[string][]string {
	fi := famIndex(f)
	out := make(map[string][]string, len(entitySpecs))
	for _, e := range entitySpecs {
		cols := [3]string{e.x3, e.x4, e.x4x3}
		for i := 1; i < 3; i++ {
			if cols[i] == "=" {
				cols[i] = cols[i-1]
			}
		}
		if cols[fi] != "" {
			out[e.name] = strings.Fields(cols[fi])
		}
	}
	return out
}

// schema holds the attribute positions (0-based) the readers use for one
// family; -1 marks an attribute the family does not have.
type schema struct {
	family ifcstep.Family
	lists  map[string][]string // attribute names of each entity read

	// IfcRoot and IfcProduct (the same in every family).
	globalID, name, description, placement, representation, tag int
	elemPredef                                                  int // IfcColumn/IfcMember.PredefinedType
	typePsets, typeMaps, typePredef, typeElementType            int // IfcColumnType...
	gridRelTo, gridLoc, gridRef                                 int // IfcGridPlacement
	cpl2DCoords                                                 int // IfcCartesianPointList2D.CoordList

	// Profiles.
	iW, iD, iTw, iTf, iR, iEdge, iSlope int // IfcIShapeProfileDef
	// IfcAsymmetricIShapeProfileDef: bottom and top flanges.
	aiBW, aiD, aiTw, aiBT, aiBR, aiTW, aiTT, aiTR, aiBE, aiBS, aiTE, aiTS int

	// Materials.
	matName, matCategory int

	// Structural.
	memberAxis      int // IfcStructuralCurveMember.Axis
	derivedUnitType int
}

// schemas holds the resolved tables, built once (read-only afterwards).
var schemas = [3]*schema{buildSchema(ifcstep.IFC2X3), buildSchema(ifcstep.IFC4), buildSchema(ifcstep.IFC4X3)}

func schemaFor(f ifcstep.Family) *schema { return schemas[famIndex(f)] }

func buildSchema(f ifcstep.Family) *schema {
	lists := attrLists(f)
	pos := func(entity, attr string) int {
		for i, a := range lists[entity] {
			if a == attr {
				return i
			}
		}
		return -1
	}
	s := &schema{family: f, lists: lists}
	s.globalID = pos("IFCCOLUMN", "GlobalId")
	s.name = pos("IFCCOLUMN", "Name")
	s.description = pos("IFCCOLUMN", "Description")
	s.placement = pos("IFCCOLUMN", "ObjectPlacement")
	s.representation = pos("IFCCOLUMN", "Representation")
	s.tag = pos("IFCCOLUMN", "Tag")
	s.elemPredef = pos("IFCCOLUMN", "PredefinedType")
	s.typePsets = pos("IFCCOLUMNTYPE", "HasPropertySets")
	s.typeMaps = pos("IFCCOLUMNTYPE", "RepresentationMaps")
	s.typePredef = pos("IFCCOLUMNTYPE", "PredefinedType")
	s.typeElementType = pos("IFCCOLUMNTYPE", "ElementType")
	s.gridRelTo = pos("IFCGRIDPLACEMENT", "PlacementRelTo")
	s.gridLoc = pos("IFCGRIDPLACEMENT", "PlacementLocation")
	s.gridRef = pos("IFCGRIDPLACEMENT", "PlacementRefDirection")
	s.cpl2DCoords = pos("IFCCARTESIANPOINTLIST2D", "CoordList")

	s.iW = pos("IFCISHAPEPROFILEDEF", "OverallWidth")
	s.iD = pos("IFCISHAPEPROFILEDEF", "OverallDepth")
	s.iTw = pos("IFCISHAPEPROFILEDEF", "WebThickness")
	s.iTf = pos("IFCISHAPEPROFILEDEF", "FlangeThickness")
	s.iR = pos("IFCISHAPEPROFILEDEF", "FilletRadius")
	s.iEdge = pos("IFCISHAPEPROFILEDEF", "FlangeEdgeRadius")
	s.iSlope = pos("IFCISHAPEPROFILEDEF", "FlangeSlope")

	const ai = "IFCASYMMETRICISHAPEPROFILEDEF"
	if f == ifcstep.IFC2X3 {
		s.aiBW, s.aiBT, s.aiBR = pos(ai, "OverallWidth"), pos(ai, "FlangeThickness"), pos(ai, "FilletRadius")
	} else {
		s.aiBW, s.aiBT, s.aiBR = pos(ai, "BottomFlangeWidth"), pos(ai, "BottomFlangeThickness"), pos(ai, "BottomFlangeFilletRadius")
	}
	s.aiD, s.aiTw = pos(ai, "OverallDepth"), pos(ai, "WebThickness")
	s.aiTW, s.aiTT, s.aiTR = pos(ai, "TopFlangeWidth"), pos(ai, "TopFlangeThickness"), pos(ai, "TopFlangeFilletRadius")
	s.aiBE, s.aiBS = pos(ai, "BottomFlangeEdgeRadius"), pos(ai, "BottomFlangeSlope")
	s.aiTE, s.aiTS = pos(ai, "TopFlangeEdgeRadius"), pos(ai, "TopFlangeSlope")

	s.matName = pos("IFCMATERIAL", "Name")
	s.matCategory = pos("IFCMATERIAL", "Category")
	s.memberAxis = pos("IFCSTRUCTURALCURVEMEMBER", "Axis")
	s.derivedUnitType = pos("IFCDERIVEDUNIT", "UnitType")
	return s
}

// pos returns the position of attr in entity for the family, or -1.
func (s *schema) pos(entity, attr string) int {
	for i, a := range s.lists[entity] {
		if a == attr {
			return i
		}
	}
	return -1
}

// has reports whether the family has the entity (of those read).
func (s *schema) has(entity string) bool { _, ok := s.lists[entity]; return ok }
