package ifc

// Attribute positions (0-based) that are the same in every schema family,
// named for the readers. TestStablePositions checks each against the
// per-family lists of schema.go; positions that differ between families are
// fields of schema.
const (
	// IfcRoot, IfcProduct, IfcElement (every family).
	pGlobalID       = 0
	pName           = 2
	pDescription    = 3
	pObjectType     = 4
	pPlacement      = 5
	pRepresentation = 6
	pTag            = 7

	// Relationships.
	pRelatedObjects  = 4 // IfcRelDefinesBy*, IfcRelAssociates*, IfcRelAssigns*
	pRelatingDef     = 5 // IfcRelDefinesByProperties.RelatingPropertyDefinition, ...ByType.RelatingType, IfcRelAssociatesMaterial.RelatingMaterial
	pAssignsTarget   = 6 // IfcRelAssignsToProduct.RelatingProduct, IfcRelAssignsToGroup.RelatingGroup
	pFactor          = 7 // IfcRelAssignsToGroupByFactor.Factor
	pContainedElems  = 4 // IfcRelContainedInSpatialStructure.RelatedElements
	pContainedIn     = 5 // .RelatingStructure
	pAggWhole        = 4 // IfcRelAggregates.RelatingObject
	pAggParts        = 5 // .RelatedObjects
	pRelating        = 4 // IfcRelConnectsStructuralActivity/Element.RelatingElement
	pRelated         = 5 // .RelatedStructuralActivity / .RelatedStructuralMember
	pProfilePropsFor = 5 // IfcRelAssociatesProfileProperties.RelatingProfileProperties

	// Spatial structure and project.
	pStoreyLongName  = 7 // IfcBuildingStorey.LongName
	pStoreyElevation = 9 // IfcBuildingStorey.Elevation
	pProjectUnits    = 8 // IfcProject.UnitsInContext

	// Placement and geometry.
	pRelTo        = 0 // IfcLocalPlacement.PlacementRelTo
	pRelPlacement = 1 // IfcLocalPlacement.RelativePlacement
	pLocation     = 0 // IfcAxis2Placement2D/3D.Location
	pAxis         = 1 // IfcAxis2Placement3D.Axis
	pRefDir3D     = 2 // IfcAxis2Placement3D.RefDirection
	pRefDir2D     = 1 // IfcAxis2Placement2D.RefDirection
	pCoordinates  = 0 // IfcCartesianPoint.Coordinates, IfcDirection.DirectionRatios
	pReps         = 2 // IfcProductDefinitionShape.Representations
	pRepID        = 1 // IfcShapeRepresentation.RepresentationIdentifier
	pRepType      = 2 // .RepresentationType
	pRepItems     = 3 // .Items
	pSwept        = 0 // IfcExtrudedAreaSolid.SweptArea
	pSolidPos     = 1 // .Position
	pExtrudedDir  = 2 // .ExtrudedDirection
	pDepth        = 3 // .Depth
	pMapSource    = 0 // IfcMappedItem.MappingSource
	pMapTarget    = 1 // IfcMappedItem.MappingTarget
	pMapOrigin    = 0 // IfcRepresentationMap.MappingOrigin
	pMapRep       = 1 // IfcRepresentationMap.MappedRepresentation
	pOpAxis1      = 0 // IfcCartesianTransformationOperator.Axis1
	pOpAxis2      = 1 // .Axis2
	pOpOrigin     = 2 // .LocalOrigin
	pOpScale      = 3 // .Scale
	pOpAxis3      = 4 // IfcCartesianTransformationOperator3D.Axis3
	pFirstOperand = 1 // IfcBooleanResult.FirstOperand

	// Curves.
	pPolyPoints    = 0 // IfcPolyline.Points, IfcIndexedPolyCurve.Points
	pIndexedSegs   = 1 // IfcIndexedPolyCurve.Segments
	pCompSegments  = 0 // IfcCompositeCurve.Segments
	pSegSameSense  = 1 // IfcCompositeCurveSegment.SameSense
	pSegParent     = 2 // IfcCompositeCurveSegment.ParentCurve
	pTrimBasis     = 0 // IfcTrimmedCurve.BasisCurve
	pTrim1         = 1 // .Trim1
	pTrim2         = 2 // .Trim2
	pTrimSense     = 3 // .SenseAgreement
	pCirclePos     = 0 // IfcCircle.Position
	pCircleRadius  = 1 // IfcCircle.Radius
	pLinePnt       = 0 // IfcLine.Pnt
	pLineDir       = 1 // IfcLine.Dir
	pVectorOrient  = 0 // IfcVector.Orientation
	pVectorMag     = 1 // IfcVector.Magnitude
	pProfileName   = 1 // IfcProfileDef.ProfileName
	pProfilePos    = 2 // IfcParameterizedProfileDef.Position
	pOuterCurve    = 2 // IfcArbitraryClosedProfileDef.OuterCurve
	pInnerCurves   = 3 // IfcArbitraryProfileDefWithVoids.InnerCurves
	pParentProfile = 2 // IfcDerivedProfileDef.ParentProfile
	pDerivedOp     = 3 // IfcDerivedProfileDef.Operator

	// Parametric profiles whose positions agree in every family (the first
	// parameters of T, L, U, C shapes; the IFC2X3 extras come last).
	pDim1 = 3 // first dimension: XDim, Radius, Depth
	pDim2 = 4
	pDim3 = 5
	pDim4 = 6
	pDim5 = 7
	pDim6 = 8
	pDim7 = 9
	pDim8 = 10
	pDim9 = 11

	// Materials (IFC4 and later; IFC2X3 material positions are in schema).
	pMatProfileSet   = 0 // IfcMaterialProfileSetUsage.ForProfileSet
	pMatProfiles     = 2 // IfcMaterialProfileSet.MaterialProfiles
	pMatProfMaterial = 2 // IfcMaterialProfile.Material
	pMatProfProfile  = 3 // IfcMaterialProfile.Profile
	pMatListMats     = 0 // IfcMaterialList.Materials
	pLayerSetUsage   = 0 // IfcMaterialLayerSetUsage.ForLayerSet
	pLayerSetLayers  = 0 // IfcMaterialLayerSet.MaterialLayers
	pLayerMaterial   = 0 // IfcMaterialLayer.Material
	pConstituents    = 2 // IfcMaterialConstituentSet.MaterialConstituents
	pConstMaterial   = 2 // IfcMaterialConstituent.Material
	pMatPropsName    = 0 // IfcMaterialProperties.Name (IFC4), IfcProfileProperties.Name
	pMatPropsProps   = 2 // IfcMaterialProperties.Properties
	pMatPropsOf      = 3 // IfcMaterialProperties.Material, IfcProfileProperties.ProfileDefinition
	pMechMaterial    = 0 // IfcMechanical*MaterialProperties.Material (IFC2X3)
	pMechE           = 2 // .YoungModulus
	pMechFy          = 6 // IfcMechanicalSteelMaterialProperties.YieldStress
	pMechFu          = 7 // .UltimateStress
	pExtMatMaterial  = 0 // IfcExtendedMaterialProperties.Material (IFC2X3)
	pExtMatProps     = 1 // .ExtendedProperties
	pExtMatName      = 3 // .Name

	// Properties and quantities.
	pPsetProps   = 4 // IfcPropertySet.HasProperties
	pPropName    = 0 // IfcPropertySingleValue.Name, IfcQuantityLength.Name
	pPropValue   = 2 // IfcPropertySingleValue.NominalValue
	pPropUnit    = 3 // IfcPropertySingleValue.Unit
	pQtoItems    = 5 // IfcElementQuantity.Quantities
	pQtyLenUnit  = 2 // IfcQuantityLength.Unit
	pQtyLenValue = 3 // IfcQuantityLength.LengthValue

	// Structural analysis.
	pSAMLoadedBy   = 7 // IfcStructuralAnalysisModel.LoadedBy
	pSAMResults    = 8 // IfcStructuralAnalysisModel.HasResults
	pMemberPredef  = 7 // IfcStructuralCurveMember.PredefinedType
	pEdgeStart     = 0 // IfcEdge.EdgeStart
	pEdgeEnd       = 1 // IfcEdge.EdgeEnd
	pOrientedEdge  = 2 // IfcOrientedEdge.EdgeElement
	pOrientedSense = 3 // IfcOrientedEdge.Orientation
	pVertexPoint   = 0 // IfcVertexPoint.VertexGeometry
	pGroupPredef   = 5 // IfcStructuralLoadGroup.PredefinedType
	pGroupCoeff    = 8 // IfcStructuralLoadGroup.Coefficient
	pGroupPurpose  = 9 // IfcStructuralLoadGroup.Purpose
	pResTheory     = 5 // IfcStructuralResultGroup.TheoryType
	pResFor        = 6 // IfcStructuralResultGroup.ResultForLoadGroup
	pReactLoad     = 7 // IfcStructuralCurveReaction.AppliedLoad
	pReactGlobal   = 8 // IfcStructuralCurveReaction.GlobalOrLocal
	pConfigValues  = 1 // IfcStructuralLoadConfiguration.Values
	pConfigLocs    = 2 // IfcStructuralLoadConfiguration.Locations
	pForceX        = 1 // IfcStructuralLoadSingleForce.ForceX (then Y, Z, MomentX, Y, Z)
)
