package ifc

import (
	"path/filepath"
	"testing"

	"swaygate/ifcstep"
)

// TestAttributeCounts checks the per-schema attribute lists against the
// counts of ifc-facts.md §2–3 (flattened from the buildingSMART EXPRESS
// schemas and cross-checked on 316,852 sample instances there).
func TestAttributeCounts(t *testing.T) {
	// source: shared/ifc-facts.md §2.1–§3.1, the [n] of each entity per family (0: not in the schema)
	counts := map[string][3]int{
		"IFCCOLUMN":                            {8, 9, 9},
		"IFCCOLUMNSTANDARDCASE":                {0, 9, 0},
		"IFCMEMBER":                            {8, 9, 9},
		"IFCCOLUMNTYPE":                        {10, 10, 10},
		"IFCLOCALPLACEMENT":                    {2, 2, 2},
		"IFCAXIS2PLACEMENT3D":                  {3, 3, 3},
		"IFCAXIS2PLACEMENT2D":                  {2, 2, 2},
		"IFCEXTRUDEDAREASOLID":                 {4, 4, 4},
		"IFCMAPPEDITEM":                        {2, 2, 2},
		"IFCCARTESIANTRANSFORMATIONOPERATOR3D": {5, 5, 5},
		"IFCISHAPEPROFILEDEF":                  {8, 10, 10},
		"IFCASYMMETRICISHAPEPROFILEDEF":        {12, 15, 15},
		"IFCRECTANGLEHOLLOWPROFILEDEF":         {8, 8, 8},
		"IFCCIRCLEHOLLOWPROFILEDEF":            {5, 5, 5},
		"IFCRECTANGLEPROFILEDEF":               {5, 5, 5},
		"IFCCIRCLEPROFILEDEF":                  {4, 4, 4},
		"IFCTSHAPEPROFILEDEF":                  {13, 12, 12},
		"IFCLSHAPEPROFILEDEF":                  {11, 9, 9},
		"IFCUSHAPEPROFILEDEF":                  {11, 10, 10},
		"IFCCSHAPEPROFILEDEF":                  {9, 8, 8},
		"IFCZSHAPEPROFILEDEF":                  {9, 9, 9},
		"IFCARBITRARYCLOSEDPROFILEDEF":         {3, 3, 3},
		"IFCARBITRARYPROFILEDEFWITHVOIDS":      {4, 4, 4},
		"IFCDERIVEDPROFILEDEF":                 {5, 5, 5},
		"IFCMATERIAL":                          {1, 3, 3},
		"IFCRELASSOCIATESMATERIAL":             {6, 6, 6},
		"IFCMATERIALPROFILESET":                {0, 4, 4},
		"IFCMATERIALPROFILE":                   {0, 6, 6},
		"IFCMATERIALPROFILESETUSAGE":           {0, 3, 3},
		"IFCMATERIALPROPERTIES":                {0, 4, 4},
		"IFCMECHANICALSTEELMATERIALPROPERTIES": {13, 0, 0},
		"IFCPROFILEPROPERTIES":                 {0, 4, 4},
		"IFCSTRUCTURALPROFILEPROPERTIES":       {23, 0, 0},
		"IFCSTRUCTURALSTEELPROFILEPROPERTIES":  {27, 0, 0},
		"IFCRELASSOCIATESPROFILEPROPERTIES":    {8, 0, 0},
		"IFCRELDEFINESBYPROPERTIES":            {6, 6, 6},
		"IFCRELDEFINESBYTYPE":                  {6, 6, 6},
		"IFCPROPERTYSET":                       {5, 5, 5},
		"IFCPROPERTYSINGLEVALUE":               {4, 4, 4},
		"IFCELEMENTQUANTITY":                   {6, 6, 6},
		"IFCQUANTITYLENGTH":                    {4, 5, 5},
		"IFCRELCONTAINEDINSPATIALSTRUCTURE":    {6, 6, 6},
		"IFCRELAGGREGATES":                     {6, 6, 6},
		"IFCBUILDINGSTOREY":                    {10, 10, 10},
		"IFCPROJECT":                           {9, 9, 9},
		"IFCSIUNIT":                            {4, 4, 4},
		"IFCCONVERSIONBASEDUNIT":               {4, 4, 4},
		"IFCDERIVEDUNIT":                       {3, 3, 4},
		"IFCSTRUCTURALANALYSISMODEL":           {9, 10, 10},
		"IFCSTRUCTURALCURVEMEMBER":             {8, 9, 9},
		"IFCSTRUCTURALLOADGROUP":               {10, 10, 10},
		"IFCSTRUCTURALLOADCASE":                {0, 11, 11},
		"IFCSTRUCTURALRESULTGROUP":             {8, 8, 8},
		"IFCSTRUCTURALCURVEREACTION":           {0, 10, 10},
		"IFCSTRUCTURALLOADSINGLEFORCE":         {7, 7, 7},
		"IFCSTRUCTURALLOADCONFIGURATION":       {0, 3, 3},
		"IFCRELASSIGNSTOPRODUCT":               {7, 7, 7},
		"IFCRELASSIGNSTOGROUP":                 {7, 7, 7},
		"IFCRELASSIGNSTOGROUPBYFACTOR":         {0, 8, 8},
		"IFCRELCONNECTSSTRUCTURALACTIVITY":     {6, 6, 6},
		"IFCRELCONNECTSSTRUCTURALELEMENT":      {6, 0, 0},
		"IFCEDGE":                              {2, 2, 2},
		"IFCVERTEXPOINT":                       {1, 1, 1},
	}
	fams := [3]ifcstep.Family{ifcstep.IFC2X3, ifcstep.IFC4, ifcstep.IFC4X3}
	for i, fam := range fams {
		lists := attrLists(fam)
		for e, want := range counts {
			if got := len(lists[e]); got != want[i] {
				t.Errorf("%s %s: %d attributes, want %d", fam, e, got, want[i])
			}
		}
	}
}

// TestStablePositions checks the position constants against the lists of
// every family that has the entity.
func TestStablePositions(t *testing.T) {
	tests := []struct {
		pos          int
		entity, attr string
	}{
		{pGlobalID, "IFCCOLUMN", "GlobalId"}, {pName, "IFCCOLUMN", "Name"}, {pDescription, "IFCPROPERTYSET", "Description"},
		{pObjectType, "IFCMEMBER", "ObjectType"}, {pPlacement, "IFCCOLUMN", "ObjectPlacement"},
		{pRepresentation, "IFCSTRUCTURALCURVEMEMBER", "Representation"}, {pTag, "IFCMEMBER", "Tag"},
		{pRelatedObjects, "IFCRELDEFINESBYPROPERTIES", "RelatedObjects"}, {pRelatedObjects, "IFCRELASSOCIATESMATERIAL", "RelatedObjects"},
		{pRelatedObjects, "IFCRELDEFINESBYTYPE", "RelatedObjects"}, {pRelatedObjects, "IFCRELASSIGNSTOPRODUCT", "RelatedObjects"},
		{pRelatedObjects, "IFCRELASSIGNSTOGROUP", "RelatedObjects"}, {pRelatingDef, "IFCRELDEFINESBYPROPERTIES", "RelatingPropertyDefinition"},
		{pRelatingDef, "IFCRELDEFINESBYTYPE", "RelatingType"}, {pRelatingDef, "IFCRELASSOCIATESMATERIAL", "RelatingMaterial"},
		{pAssignsTarget, "IFCRELASSIGNSTOPRODUCT", "RelatingProduct"}, {pAssignsTarget, "IFCRELASSIGNSTOGROUP", "RelatingGroup"},
		{pAssignsTarget, "IFCRELASSIGNSTOGROUPBYFACTOR", "RelatingGroup"}, {pFactor, "IFCRELASSIGNSTOGROUPBYFACTOR", "Factor"},
		{pContainedElems, "IFCRELCONTAINEDINSPATIALSTRUCTURE", "RelatedElements"}, {pContainedIn, "IFCRELCONTAINEDINSPATIALSTRUCTURE", "RelatingStructure"},
		{pAggWhole, "IFCRELAGGREGATES", "RelatingObject"}, {pAggParts, "IFCRELAGGREGATES", "RelatedObjects"},
		{pRelating, "IFCRELCONNECTSSTRUCTURALACTIVITY", "RelatingElement"}, {pRelated, "IFCRELCONNECTSSTRUCTURALACTIVITY", "RelatedStructuralActivity"},
		{pRelating, "IFCRELCONNECTSSTRUCTURALELEMENT", "RelatingElement"}, {pRelated, "IFCRELCONNECTSSTRUCTURALELEMENT", "RelatedStructuralMember"},
		{pProfilePropsFor, "IFCRELASSOCIATESPROFILEPROPERTIES", "RelatingProfileProperties"},
		{pStoreyLongName, "IFCBUILDINGSTOREY", "LongName"}, {pStoreyElevation, "IFCBUILDINGSTOREY", "Elevation"}, {pProjectUnits, "IFCPROJECT", "UnitsInContext"},
		{pRelTo, "IFCLOCALPLACEMENT", "PlacementRelTo"}, {pRelPlacement, "IFCLOCALPLACEMENT", "RelativePlacement"},
		{pLocation, "IFCAXIS2PLACEMENT3D", "Location"}, {pLocation, "IFCAXIS2PLACEMENT2D", "Location"}, {pAxis, "IFCAXIS2PLACEMENT3D", "Axis"},
		{pRefDir3D, "IFCAXIS2PLACEMENT3D", "RefDirection"}, {pRefDir2D, "IFCAXIS2PLACEMENT2D", "RefDirection"},
		{pCoordinates, "IFCCARTESIANPOINT", "Coordinates"}, {pCoordinates, "IFCDIRECTION", "DirectionRatios"},
		{pReps, "IFCPRODUCTDEFINITIONSHAPE", "Representations"}, {pRepID, "IFCSHAPEREPRESENTATION", "RepresentationIdentifier"},
		{pRepType, "IFCSHAPEREPRESENTATION", "RepresentationType"}, {pRepItems, "IFCSHAPEREPRESENTATION", "Items"},
		{pRepItems, "IFCTOPOLOGYREPRESENTATION", "Items"},
		{pSwept, "IFCEXTRUDEDAREASOLID", "SweptArea"}, {pSolidPos, "IFCEXTRUDEDAREASOLID", "Position"},
		{pExtrudedDir, "IFCEXTRUDEDAREASOLID", "ExtrudedDirection"}, {pDepth, "IFCEXTRUDEDAREASOLID", "Depth"},
		{pDepth, "IFCEXTRUDEDAREASOLIDTAPERED", "Depth"},
		{pMapSource, "IFCMAPPEDITEM", "MappingSource"}, {pMapTarget, "IFCMAPPEDITEM", "MappingTarget"},
		{pMapOrigin, "IFCREPRESENTATIONMAP", "MappingOrigin"}, {pMapRep, "IFCREPRESENTATIONMAP", "MappedRepresentation"},
		{pOpAxis1, "IFCCARTESIANTRANSFORMATIONOPERATOR3D", "Axis1"}, {pOpAxis2, "IFCCARTESIANTRANSFORMATIONOPERATOR2D", "Axis2"},
		{pOpOrigin, "IFCCARTESIANTRANSFORMATIONOPERATOR3D", "LocalOrigin"}, {pOpScale, "IFCCARTESIANTRANSFORMATIONOPERATOR3D", "Scale"},
		{pOpAxis3, "IFCCARTESIANTRANSFORMATIONOPERATOR3D", "Axis3"},
		{pFirstOperand, "IFCBOOLEANCLIPPINGRESULT", "FirstOperand"}, {pFirstOperand, "IFCBOOLEANRESULT", "FirstOperand"},
		{pPolyPoints, "IFCPOLYLINE", "Points"}, {pPolyPoints, "IFCINDEXEDPOLYCURVE", "Points"}, {pIndexedSegs, "IFCINDEXEDPOLYCURVE", "Segments"},
		{pCompSegments, "IFCCOMPOSITECURVE", "Segments"}, {pSegSameSense, "IFCCOMPOSITECURVESEGMENT", "SameSense"},
		{pSegParent, "IFCCOMPOSITECURVESEGMENT", "ParentCurve"}, {pTrimBasis, "IFCTRIMMEDCURVE", "BasisCurve"},
		{pTrim1, "IFCTRIMMEDCURVE", "Trim1"}, {pTrim2, "IFCTRIMMEDCURVE", "Trim2"}, {pTrimSense, "IFCTRIMMEDCURVE", "SenseAgreement"},
		{pCirclePos, "IFCCIRCLE", "Position"}, {pCircleRadius, "IFCCIRCLE", "Radius"}, {pCirclePos, "IFCELLIPSE", "Position"},
		{pCircleRadius, "IFCELLIPSE", "SemiAxis1"}, {pCircleRadius + 1, "IFCELLIPSE", "SemiAxis2"},
		{pLinePnt, "IFCLINE", "Pnt"}, {pLineDir, "IFCLINE", "Dir"}, {pVectorOrient, "IFCVECTOR", "Orientation"}, {pVectorMag, "IFCVECTOR", "Magnitude"},
		{pProfileName, "IFCISHAPEPROFILEDEF", "ProfileName"}, {pProfilePos, "IFCISHAPEPROFILEDEF", "Position"},
		{pOuterCurve, "IFCARBITRARYCLOSEDPROFILEDEF", "OuterCurve"}, {pInnerCurves, "IFCARBITRARYPROFILEDEFWITHVOIDS", "InnerCurves"},
		{pParentProfile, "IFCDERIVEDPROFILEDEF", "ParentProfile"}, {pDerivedOp, "IFCDERIVEDPROFILEDEF", "Operator"},
		{pDim1, "IFCRECTANGLEHOLLOWPROFILEDEF", "XDim"}, {pDim2, "IFCRECTANGLEHOLLOWPROFILEDEF", "YDim"},
		{pDim3, "IFCRECTANGLEHOLLOWPROFILEDEF", "WallThickness"}, {pDim4, "IFCRECTANGLEHOLLOWPROFILEDEF", "InnerFilletRadius"},
		{pDim5, "IFCRECTANGLEHOLLOWPROFILEDEF", "OuterFilletRadius"}, {pDim1, "IFCCIRCLEHOLLOWPROFILEDEF", "Radius"},
		{pDim2, "IFCCIRCLEHOLLOWPROFILEDEF", "WallThickness"}, {pDim3, "IFCROUNDEDRECTANGLEPROFILEDEF", "RoundingRadius"},
		{pDim1, "IFCTSHAPEPROFILEDEF", "Depth"}, {pDim2, "IFCTSHAPEPROFILEDEF", "FlangeWidth"}, {pDim3, "IFCTSHAPEPROFILEDEF", "WebThickness"},
		{pDim4, "IFCTSHAPEPROFILEDEF", "FlangeThickness"}, {pDim5, "IFCTSHAPEPROFILEDEF", "FilletRadius"}, {pDim6, "IFCTSHAPEPROFILEDEF", "FlangeEdgeRadius"},
		{pDim7, "IFCTSHAPEPROFILEDEF", "WebEdgeRadius"}, {pDim8, "IFCTSHAPEPROFILEDEF", "WebSlope"}, {pDim9, "IFCTSHAPEPROFILEDEF", "FlangeSlope"},
		{pDim1, "IFCLSHAPEPROFILEDEF", "Depth"}, {pDim2, "IFCLSHAPEPROFILEDEF", "Width"}, {pDim3, "IFCLSHAPEPROFILEDEF", "Thickness"},
		{pDim4, "IFCLSHAPEPROFILEDEF", "FilletRadius"}, {pDim5, "IFCLSHAPEPROFILEDEF", "EdgeRadius"}, {pDim6, "IFCLSHAPEPROFILEDEF", "LegSlope"},
		{pDim1, "IFCUSHAPEPROFILEDEF", "Depth"}, {pDim2, "IFCUSHAPEPROFILEDEF", "FlangeWidth"}, {pDim3, "IFCUSHAPEPROFILEDEF", "WebThickness"},
		{pDim4, "IFCUSHAPEPROFILEDEF", "FlangeThickness"}, {pDim5, "IFCUSHAPEPROFILEDEF", "FilletRadius"}, {pDim6, "IFCUSHAPEPROFILEDEF", "EdgeRadius"},
		{pDim7, "IFCUSHAPEPROFILEDEF", "FlangeSlope"},
		{pDim1, "IFCCSHAPEPROFILEDEF", "Depth"}, {pDim2, "IFCCSHAPEPROFILEDEF", "Width"}, {pDim3, "IFCCSHAPEPROFILEDEF", "WallThickness"},
		{pDim4, "IFCCSHAPEPROFILEDEF", "Girth"}, {pDim5, "IFCCSHAPEPROFILEDEF", "InternalFilletRadius"},
		{pDim1, "IFCZSHAPEPROFILEDEF", "Depth"}, {pDim2, "IFCZSHAPEPROFILEDEF", "FlangeWidth"}, {pDim3, "IFCZSHAPEPROFILEDEF", "WebThickness"},
		{pDim4, "IFCZSHAPEPROFILEDEF", "FlangeThickness"}, {pDim5, "IFCZSHAPEPROFILEDEF", "FilletRadius"}, {pDim6, "IFCZSHAPEPROFILEDEF", "EdgeRadius"},
		{pMatProfileSet, "IFCMATERIALPROFILESETUSAGE", "ForProfileSet"}, {pMatProfileSet, "IFCMATERIALPROFILESETUSAGETAPERING", "ForProfileSet"},
		{pMatProfiles, "IFCMATERIALPROFILESET", "MaterialProfiles"}, {pMatProfMaterial, "IFCMATERIALPROFILE", "Material"},
		{pMatProfProfile, "IFCMATERIALPROFILE", "Profile"}, {pMatListMats, "IFCMATERIALLIST", "Materials"},
		{pLayerSetUsage, "IFCMATERIALLAYERSETUSAGE", "ForLayerSet"}, {pLayerSetLayers, "IFCMATERIALLAYERSET", "MaterialLayers"},
		{pLayerMaterial, "IFCMATERIALLAYER", "Material"}, {pConstituents, "IFCMATERIALCONSTITUENTSET", "MaterialConstituents"},
		{pConstMaterial, "IFCMATERIALCONSTITUENT", "Material"}, {pMatPropsName, "IFCMATERIALPROPERTIES", "Name"},
		{pMatPropsProps, "IFCMATERIALPROPERTIES", "Properties"}, {pMatPropsOf, "IFCMATERIALPROPERTIES", "Material"},
		{pMatPropsName, "IFCPROFILEPROPERTIES", "Name"}, {pMatPropsProps, "IFCPROFILEPROPERTIES", "Properties"},
		{pMatPropsOf, "IFCPROFILEPROPERTIES", "ProfileDefinition"},
		{pMechMaterial, "IFCMECHANICALSTEELMATERIALPROPERTIES", "Material"}, {pMechE, "IFCMECHANICALSTEELMATERIALPROPERTIES", "YoungModulus"},
		{pMechFy, "IFCMECHANICALSTEELMATERIALPROPERTIES", "YieldStress"}, {pMechFu, "IFCMECHANICALSTEELMATERIALPROPERTIES", "UltimateStress"},
		{pMechE, "IFCMECHANICALMATERIALPROPERTIES", "YoungModulus"}, {pMechE, "IFCMECHANICALCONCRETEMATERIALPROPERTIES", "YoungModulus"},
		{pExtMatMaterial, "IFCEXTENDEDMATERIALPROPERTIES", "Material"}, {pExtMatProps, "IFCEXTENDEDMATERIALPROPERTIES", "ExtendedProperties"},
		{pExtMatName, "IFCEXTENDEDMATERIALPROPERTIES", "Name"},
		{pPsetProps, "IFCPROPERTYSET", "HasProperties"}, {pPropName, "IFCPROPERTYSINGLEVALUE", "Name"}, {pPropValue, "IFCPROPERTYSINGLEVALUE", "NominalValue"},
		{pPropUnit, "IFCPROPERTYSINGLEVALUE", "Unit"}, {pQtoItems, "IFCELEMENTQUANTITY", "Quantities"}, {pPropName, "IFCQUANTITYLENGTH", "Name"},
		{pQtyLenUnit, "IFCQUANTITYLENGTH", "Unit"}, {pQtyLenValue, "IFCQUANTITYLENGTH", "LengthValue"},
		{pSAMLoadedBy, "IFCSTRUCTURALANALYSISMODEL", "LoadedBy"}, {pSAMResults, "IFCSTRUCTURALANALYSISMODEL", "HasResults"},
		{pMemberPredef, "IFCSTRUCTURALCURVEMEMBER", "PredefinedType"}, {pEdgeStart, "IFCEDGE", "EdgeStart"}, {pEdgeEnd, "IFCEDGE", "EdgeEnd"},
		{pEdgeStart, "IFCEDGECURVE", "EdgeStart"}, {pOrientedEdge, "IFCORIENTEDEDGE", "EdgeElement"}, {pOrientedSense, "IFCORIENTEDEDGE", "Orientation"},
		{pVertexPoint, "IFCVERTEXPOINT", "VertexGeometry"}, {pGroupPredef, "IFCSTRUCTURALLOADGROUP", "PredefinedType"},
		{pGroupPredef, "IFCSTRUCTURALLOADCASE", "PredefinedType"}, {pGroupCoeff, "IFCSTRUCTURALLOADGROUP", "Coefficient"},
		{pGroupPurpose, "IFCSTRUCTURALLOADGROUP", "Purpose"}, {pResTheory, "IFCSTRUCTURALRESULTGROUP", "TheoryType"},
		{pResFor, "IFCSTRUCTURALRESULTGROUP", "ResultForLoadGroup"}, {pReactLoad, "IFCSTRUCTURALCURVEREACTION", "AppliedLoad"},
		{pReactGlobal, "IFCSTRUCTURALCURVEREACTION", "GlobalOrLocal"}, {pConfigValues, "IFCSTRUCTURALLOADCONFIGURATION", "Values"},
		{pConfigLocs, "IFCSTRUCTURALLOADCONFIGURATION", "Locations"}, {pForceX, "IFCSTRUCTURALLOADSINGLEFORCE", "ForceX"},
		{pForceX + 3, "IFCSTRUCTURALLOADSINGLEFORCE", "MomentX"},
	}
	for _, fam := range [3]ifcstep.Family{ifcstep.IFC2X3, ifcstep.IFC4, ifcstep.IFC4X3} {
		s := schemaFor(fam)
		for _, tc := range tests {
			if !s.has(tc.entity) {
				continue
			}
			if got := s.pos(tc.entity, tc.attr); got != tc.pos {
				t.Errorf("%s %s.%s at %d, the constant says %d", fam, tc.entity, tc.attr, got, tc.pos)
			}
		}
	}
	// Positions that move between families.
	if s := schemaFor(ifcstep.IFC2X3); s.elemPredef != -1 || s.iSlope != -1 || s.memberAxis != -1 || s.matCategory != -1 || s.aiBW != 3 {
		t.Errorf("IFC2X3 table: %+v", s)
	}
	if s := schemaFor(ifcstep.IFC4); s.elemPredef != 8 || s.iSlope != 9 || s.memberAxis != 8 || s.matCategory != 2 || s.aiBW != 3 || s.aiBS != 12 {
		t.Errorf("IFC4 table: %+v", s)
	}
}

// TestSampleArities checks the lists on real files: every instance of an
// entity in the tables has the table's number of attributes (the malformed
// IfcSpace of example.ifc is not one of ours).
func TestSampleArities(t *testing.T) {
	files := []string{"ifc2x3/steel-mini-project.ifc", "ifc2x3/example.ifc", "ifc4/building_02.ifc",
		"ifc4x3/structural-curve-member.ifc", "ifc4x3/beam-parametric-cross-section.ifc", "ifc4x3/curve-parameters-in-degrees.ifc"}
	for _, rel := range files {
		path := filepath.Join(samplesDir, rel)
		f, err := ifcstep.ReadFile(path, ifcstep.Options{})
		if err != nil {
			t.Skipf("%s: %v", rel, err)
		}
		lists := attrLists(f.Family)
		for e, attrs := range lists {
			for _, in := range f.ByType(e) {
				if n := in.NumAttrs(); n != len(attrs) {
					t.Errorf("%s %s: %d attributes, the table has %d", rel, in, n, len(attrs))
					break
				}
			}
		}
	}
}
