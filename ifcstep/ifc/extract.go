package ifc

import (
	"errors"
	"math"
	"strconv"
	"strings"

	"swaygate/checks"
	"swaygate/checks/effective"
	"swaygate/ifcstep"
	"swaygate/ifcstep/sidecar"
)

// SignConvention is the convention of the member results in the model's
// structural analysis results (design §4.2).
type SignConvention uint8

const (
	// ConventionAuto detects the convention per member and combination from
	// the axial pattern (the default).
	ConventionAuto SignConvention = iota
	// ConventionSectionForces: the forces on the cut face whose outward
	// normal is +x (N tension positive, dMy/dx = Vz, dMz/dx = −Vy).
	ConventionSectionForces
	// ConventionEndForces: the actions applied to the member at its two ends
	// (at the start minus the section force, at the end the section force).
	ConventionEndForces
)

// ParseSignConvention reads "auto", "section-forces" or "end-forces".
func ParseSignConvention(s string) (SignConvention, error) {
	switch s {
	case "", "auto":
		return ConventionAuto, nil
	case "section-forces":
		return ConventionSectionForces, nil
	case "end-forces":
		return ConventionEndForces, nil
	}
	return 0, errors.New("ifc: unknown sign convention " + strconv.Quote(s) + " (want auto, section-forces or end-forces)")
}

func (c SignConvention) String() string {
	switch c {
	case ConventionSectionForces:
		return "section-forces"
	case ConventionEndForces:
		return "end-forces"
	}
	return "auto"
}

// Options configure Extract. The zero value extracts IfcColumn and
// IfcColumnStandardCase only, reads actions from the model, skips the
// results of bare load cases and detects the result sign convention.
type Options struct {
	// MemberTypes are the predefined types of IfcMember (and
	// IfcMemberStandardCase) to include as members, upper case, e.g. POST,
	// STRUT; "*" includes every IfcMember. The type object's PredefinedType
	// wins over the occurrence's when both are given (IFC 4.3 doc of
	// IfcColumn.PredefinedType).
	MemberTypes []string

	// Actions, when not nil, are side-car actions (design §4.3). They are
	// then the only source of actions: the combinations are the side-car's
	// and the model's own results and Swaygate_DesignActions are not read.
	Actions *sidecar.File

	// LoadCases opts in to checking the results of bare load cases
	// (LOAD_CASE), which are unfactored; by default they are skipped with a
	// warning.
	LoadCases bool

	// Convention declares the sign convention of the model's member results;
	// ConventionAuto (the default) detects it.
	Convention SignConvention

	// KeFamily chooses the idealised ke table used for
	// Swaygate_ColumnDesign end conditions (EndConditionBottom/Top): the
	// design values of AS 4100 (the default), AISC, or the theoretical ones.
	KeFamily effective.Family
}

// Extract turns a parsed model into the members the checks need (design §4).
// Gaps are reported, never guessed: a member without a section, length,
// restraint or actions carries the reason in Member.Problems (and the engine
// makes it needs-analysis); columns that are recognisably not steel are in
// Model.Skipped; findings about the model as a whole are Model.Warnings and
// Model.Assumptions.
//
// The error is for invalid options only; problems of the model's data never
// stop the extraction.
func Extract(f *ifcstep.File, opt Options) (*checks.Model, error) {
	if f == nil {
		return nil, errors.New("ifc: no file")
	}
	if f.Family == ifcstep.FamilyUnknown {
		return nil, errors.New("ifc: unknown schema family " + strconv.Quote(f.SchemaID))
	}
	switch opt.Convention {
	case ConventionAuto, ConventionSectionForces, ConventionEndForces:
	default:
		return nil, errors.New("ifc: invalid sign convention")
	}
	for _, t := range opt.MemberTypes {
		if t == "" {
			return nil, errors.New("ifc: empty IfcMember predefined type")
		}
	}
	x := newExtractor(f, opt)
	x.run()
	return x.model, nil
}

// extractor is the state of one extraction.
type extractor struct {
	f     *ifcstep.File
	s     *schema
	opt   Options
	model *checks.Model

	units        units
	lengthFactor float64 // model length unit -> mm
	angleFactor  float64 // model plane angle unit -> rad

	warned  map[string]bool // warning keys already given
	assumed map[string]bool

	// Caches keyed by instance id.
	placements map[uint32]cachedFrame
	profiles   map[uint32]*profileInfo
	materials  map[uint32]*materialInfo
	storeys    map[uint32]storeyInfo
	analytical map[uint32]*analyticalMember

	idx     relIndex
	groups  map[uint32]*loadGroup
	results map[uint32]*resultSet
	aux     []memberAux // parallel to model.Members
}

func newExtractor(f *ifcstep.File, opt Options) *extractor {
	return &extractor{
		f:          f,
		s:          schemaFor(f.Family),
		opt:        opt,
		model:      &checks.Model{},
		warned:     map[string]bool{},
		assumed:    map[string]bool{},
		placements: map[uint32]cachedFrame{},
		profiles:   map[uint32]*profileInfo{},
		materials:  map[uint32]*materialInfo{},
		storeys:    map[uint32]storeyInfo{},
		analytical: map[uint32]*analyticalMember{},
	}
}

// run performs the extraction.
func (x *extractor) run() {
	x.readUnits()
	x.lengthFactor = x.factor(qLength)
	x.angleFactor = x.units.toInt[qAngle]

	cands := x.candidates()
	x.buildIndex(cands)
	x.readAnalysis()

	members := make([]checks.Member, 0, len(cands))
	x.aux = make([]memberAux, 0, len(cands))
	seen := make(map[string]uint32, len(cands))
	for i := range cands {
		m, aux, skip := x.member(&cands[i], seen)
		if skip != nil {
			x.model.Skipped = append(x.model.Skipped, *skip)
			continue
		}
		members = append(members, m)
		x.aux = append(x.aux, aux)
	}
	x.model.Members = members
	x.assignActions()
}

// warn records a model-wide warning once per (code, message).
func (x *extractor) warn(code, msg, at string) {
	k := code + "\x00" + msg
	if x.warned[k] {
		return
	}
	x.warned[k] = true
	x.model.Warnings = append(x.model.Warnings, checks.Reason{Code: code, Message: msg, Ref: at})
}

// warnOnce records a warning once per code.
func (x *extractor) warnOnce(code, msg, at string) {
	k := code + "\x00"
	if x.warned[k] {
		return
	}
	x.warned[k] = true
	x.model.Warnings = append(x.model.Warnings, checks.Reason{Code: code, Message: msg, Ref: at})
}

// assume records an assumption once.
func (x *extractor) assume(msg string) {
	if x.assumed[msg] {
		return
	}
	x.assumed[msg] = true
	x.model.Assumptions = append(x.model.Assumptions, msg)
}

// deref follows a reference value of instance from (a dangling reference is
// recorded by the reader as a warning); an unset or non-reference value gives
// ok false.
func (x *extractor) deref(from ifcstep.Instance, v ifcstep.Value) (ifcstep.Instance, bool) {
	if v.Kind() != ifcstep.KindRef {
		return ifcstep.Instance{}, false
	}
	return x.f.Deref(from, v)
}

// ref renders an instance reference "#12".
func ref(in ifcstep.Instance) string { return "#" + strconv.FormatUint(uint64(in.ID()), 10) }

func refID(id uint32) string { return "#" + strconv.FormatUint(uint64(id), 10) }

func itoa(n int) string { return strconv.Itoa(n) }

// ftoa renders a number for messages, with up to 4 significant digits.
func ftoa(v float64) string {
	if math.IsNaN(v) {
		return "?"
	}
	return strconv.FormatFloat(v, 'g', 4, 64)
}

// text returns a string attribute ("" when unset or not a string).
func text(v ifcstep.Value) string {
	if v.Kind() != ifcstep.KindString && v.Kind() != ifcstep.KindTyped {
		return ""
	}
	s, _ := v.Text()
	return s
}

// entityName renders an upper-case entity type in IFC spelling for reports
// (IFCCOLUMN -> IfcColumn).
func entityName(t string) string {
	if n, ok := entityNames[t]; ok {
		return n
	}
	if strings.HasPrefix(t, "IFC") && len(t) > 3 {
		return "Ifc" + t[3:4] + strings.ToLower(t[4:])
	}
	return t
}

var entityNames = map[string]string{
	"IFCCOLUMN":                                      "IfcColumn",
	"IFCCOLUMNSTANDARDCASE":                          "IfcColumnStandardCase",
	"IFCMEMBER":                                      "IfcMember",
	"IFCMEMBERSTANDARDCASE":                          "IfcMemberStandardCase",
	"IFCSTRUCTURALCURVEMEMBER":                       "IfcStructuralCurveMember",
	"IFCSTRUCTURALCURVEMEMBERVARYING":                "IfcStructuralCurveMemberVarying",
	"IFCTRIANGULATEDFACESET":                         "IfcTriangulatedFaceSet",
	"IFCPOLYGONALFACESET":                            "IfcPolygonalFaceSet",
	"IFCFACETEDBREP":                                 "IfcFacetedBrep",
	"IFCFACETEDBREPWITHVOIDS":                        "IfcFacetedBrepWithVoids",
	"IFCADVANCEDBREP":                                "IfcAdvancedBrep",
	"IFCEXTRUDEDAREASOLID":                           "IfcExtrudedAreaSolid",
	"IFCEXTRUDEDAREASOLIDTAPERED":                    "IfcExtrudedAreaSolidTapered",
	"IFCREVOLVEDAREASOLID":                           "IfcRevolvedAreaSolid",
	"IFCSWEPTDISKSOLID":                              "IfcSweptDiskSolid",
	"IFCSURFACECURVESWEPTAREASOLID":                  "IfcSurfaceCurveSweptAreaSolid",
	"IFCFIXEDREFERENCESWEPTAREASOLID":                "IfcFixedReferenceSweptAreaSolid",
	"IFCSHELLBASEDSURFACEMODEL":                      "IfcShellBasedSurfaceModel",
	"IFCFACEBASEDSURFACEMODEL":                       "IfcFaceBasedSurfaceModel",
	"IFCBOUNDINGBOX":                                 "IfcBoundingBox",
	"IFCCSGSOLID":                                    "IfcCsgSolid",
	"IFCCOMPOSITEPROFILEDEF":                         "IfcCompositeProfileDef",
	"IFCCENTERLINEPROFILEDEF":                        "IfcCenterLineProfileDef",
	"IFCELLIPSEPROFILEDEF":                           "IfcEllipseProfileDef",
	"IFCTRAPEZIUMPROFILEDEF":                         "IfcTrapeziumProfileDef",
	"IFCARBITRARYOPENPROFILEDEF":                     "IfcArbitraryOpenProfileDef",
	"IFCSTRUCTURALLOADLINEARFORCE":                   "IfcStructuralLoadLinearForce",
	"IFCSTRUCTURALLOADSINGLEFORCE":                   "IfcStructuralLoadSingleForce",
	"IFCBSPLINECURVEWITHKNOTS":                       "IfcBSplineCurveWithKnots",
	"IFCELLIPSE":                                     "IfcEllipse",
	"IFCCARTESIANTRANSFORMATIONOPERATOR2DNONUNIFORM": "IfcCartesianTransformationOperator2DnonUniform",
}
