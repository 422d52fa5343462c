package ifc

import (
	"errors"
	"math"
	"runtime"
	"strconv"
	"strings"
	"sync"

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

	// Workers is the number of goroutines that extract members and scan the
	// relationships; 0 means runtime.GOMAXPROCS(0). The result does not
	// depend on it.
	Workers int

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
	dirs       map[uint32]cachedDir
	profiles   map[uint32]*profileInfo
	materials  map[uint32]*materialInfo
	storeys    map[uint32]storeyInfo
	analytical map[uint32]*analyticalMember

	idx     relIndex
	groups  map[uint32]*loadGroup
	results map[uint32]*resultSet
	aux     []memberAux // parallel to model.Members

	workers int
	// sink, when set (a worker's copy), collects warnings and assumptions
	// for the main extractor to merge in candidate order.
	sink *[]note
}

// note is a warning or an assumption found by a worker.
type note struct {
	kind           uint8 // noteWarn, noteWarnOnce, noteAssume
	code, msg, ref string
}

const (
	noteWarn uint8 = iota
	noteWarnOnce
	noteAssume
)

// fork returns a copy of x for one worker: the shared, read-only state
// (file, schema, options, units, indexes, load and result groups) and its
// own caches. Its warnings and assumptions go to its sink.
func (x *extractor) fork() *extractor {
	w := *x
	w.placements = map[uint32]cachedFrame{}
	w.dirs = map[uint32]cachedDir{}
	w.profiles = map[uint32]*profileInfo{}
	w.materials = map[uint32]*materialInfo{}
	w.storeys = map[uint32]storeyInfo{}
	w.analytical = map[uint32]*analyticalMember{}
	w.warned, w.assumed = nil, nil
	w.aux = nil
	w.sink = nil
	return &w
}

// merge replays a worker's notes on x.
func (x *extractor) merge(notes []note) {
	for _, n := range notes {
		switch n.kind {
		case noteWarn:
			x.warn(n.code, n.msg, n.ref)
		case noteWarnOnce:
			x.warnOnce(n.code, n.msg, n.ref)
		default:
			x.assume(n.msg)
		}
	}
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
		dirs:       map[uint32]cachedDir{},
		profiles:   map[uint32]*profileInfo{},
		materials:  map[uint32]*materialInfo{},
		storeys:    map[uint32]storeyInfo{},
		analytical: map[uint32]*analyticalMember{},
	}
}

// run performs the extraction.
func (x *extractor) run() {
	x.workers = x.opt.Workers
	if x.workers <= 0 {
		x.workers = runtime.GOMAXPROCS(0)
	}
	x.readUnits()
	x.lengthFactor = x.factor(qLength)
	x.angleFactor = x.units.toInt[qAngle]

	cands := x.candidates()
	x.buildIndex(cands)
	x.readAnalysis()
	x.readMembers(cands)
	x.assignActions()
}

// memberResult is what a worker makes of one candidate.
type candResult struct {
	m     checks.Member
	aux   memberAux
	skip  *checks.Skipped
	notes []note
}

// readMembers extracts the candidates on x.workers goroutines, each on a
// contiguous share, and merges the results in candidate order, so that the
// model does not depend on the number of workers.
func (x *extractor) readMembers(cands []candidate) {
	res := make([]candResult, len(cands))
	// Written before the workers read it (the write barrier of a struct
	// copy reads the old contents): a fresh page read first maps the zero
	// page, and the write after it costs a page copy and a TLB flush on
	// every core.
	clear(res)
	work := func(w *extractor, lo, hi int) {
		for i := lo; i < hi; i++ {
			r := &res[i]
			w.sink = &r.notes
			r.m, r.aux, r.skip = w.member(&cands[i])
			if r.skip == nil && x.opt.Actions == nil {
				w.memberActions(&r.m, &r.aux)
			}
		}
		w.sink = nil
	}
	n := min(x.workers, len(cands))
	if x.opt.Workers <= 0 {
		n = min(n, len(cands)/64+1) // not worth a goroutine for a few members
	}
	if n <= 1 {
		work(x.fork(), 0, len(cands))
	} else {
		var wg sync.WaitGroup
		for k := 0; k < n; k++ {
			lo, hi := k*len(cands)/n, (k+1)*len(cands)/n
			w := x.fork()
			wg.Add(1)
			go func() {
				defer wg.Done()
				work(w, lo, hi)
			}()
		}
		wg.Wait()
	}

	members := make([]checks.Member, 0, len(cands))
	x.aux = make([]memberAux, 0, len(cands))
	seen := make(map[string]uint32, len(cands))
	for i := range res {
		r := &res[i]
		x.merge(r.notes)
		if r.skip == nil {
			in := cands[i].inst
			if prev, dup := seen[r.m.GlobalID]; dup {
				x.warn("duplicate-global-id", r.m.Entity+" "+ref(in)+" repeats the GlobalId "+r.m.GlobalID+" of "+refID(prev)+": not checked", ref(in))
				r.skip = &checks.Skipped{GlobalID: r.m.GlobalID, Name: r.m.Name, Entity: r.m.Entity, Reason: "duplicate-global-id",
					Message: ref(in) + " repeats the GlobalId of " + refID(prev)}
			} else {
				seen[r.m.GlobalID] = in.ID()
			}
		}
		if r.skip != nil {
			x.model.Skipped = append(x.model.Skipped, *r.skip)
			continue
		}
		members = append(members, r.m)
		x.aux = append(x.aux, r.aux)
	}
	x.model.Members = members
}

// warn records a model-wide warning once per (code, message).
func (x *extractor) warn(code, msg, at string) {
	if x.sink != nil {
		*x.sink = append(*x.sink, note{kind: noteWarn, code: code, msg: msg, ref: at})
		return
	}
	k := code + "\x00" + msg
	if x.warned[k] {
		return
	}
	x.warned[k] = true
	x.model.Warnings = append(x.model.Warnings, checks.Reason{Code: code, Message: msg, Ref: at})
}

// warnOnce records a warning once per code.
func (x *extractor) warnOnce(code, msg, at string) {
	if x.sink != nil {
		*x.sink = append(*x.sink, note{kind: noteWarnOnce, code: code, msg: msg, ref: at})
		return
	}
	k := code + "\x00"
	if x.warned[k] {
		return
	}
	x.warned[k] = true
	x.model.Warnings = append(x.model.Warnings, checks.Reason{Code: code, Message: msg, Ref: at})
}

// assume records an assumption once.
func (x *extractor) assume(msg string) {
	if x.sink != nil {
		*x.sink = append(*x.sink, note{kind: noteAssume, msg: msg})
		return
	}
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
func ref(in ifcstep.Instance) string { return refID(in.ID()) }

func refID(id uint32) string {
	var b [12]byte
	b[0] = '#'
	return string(strconv.AppendUint(b[:1], uint64(id), 10))
}

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
