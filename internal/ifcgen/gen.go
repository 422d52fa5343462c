// Package ifcgen writes large synthetic IFC4 models of an invented building,
// for benchmarks of reading, extraction and checking. Output is deterministic
// for given Options (the random choices come from a seeded generator).
//
// # The scenario: Harbour Quay Offices
//
// An invented office block of S storeys (default 10) on a square grid of
// 6.0 m bays. The ground storey is 4.5 m high, every upper storey 3.6 m; each
// IfcBuildingStorey carries its Elevation. Every storey has the same number
// of steel columns (the total spread as evenly as the count allows), placed
// row by row on an nx × ny grid: grid lines A, B, ... along X and 1, 2, ...
// along Y.
//
// Lateral load is resisted by moment frames on every grid line: the frame
// columns are rotated 90° (RefDirection along global Y) so that major-axis
// bending sways them in X and minor-axis bending in Y, and they are sway
// members about both axes (SwayMajor = SwayMinor = true). Every third
// interior column (grid positions 1, 4, 7, ... in both directions) is a
// gravity column braced in both directions (ke = 1.0) that leans on the
// frames.
//
// Sway ke is 1.2 to 1.5 (chosen per column and axis); frame columns have fixed bases,
// interior ones pinned. Sections are picked by the gravity load: universal
// columns and HE sizes (HE-400-B, 310UC137, HE-300-B, 250UC89.5, HE-260-A, HE-200-B,
// HE-200-A) as IfcIShapeProfileDef, and some light interior columns as a
// 200x200x9.0 SHS (IfcRectangleHollowProfileDef); steel grades S355 and
// S355J2H (IfcMaterial Category 'Steel'), each column associated through
// IfcMaterialProfileSetUsage -> IfcMaterialProfileSet -> IfcMaterialProfile.
// Bodies are IfcExtrudedAreaSolid with Depth = storey height; each column
// has an 'Axis' polyline, is contained in its storey
// (IfcRelContainedInSpatialStructure) and carries the property set
// Swaygate_ColumnDesign (design §4.1) through IfcRelDefinesByProperties.
//
// Units: mm, N, N·mm (torque), MPa (pressure and modulus), radian.
//
// The structural analysis model (IfcStructuralAnalysisModel, LOADING_3D) has
// one IfcStructuralCurveMember per column: an IfcTopologyRepresentation edge
// between two IfcVertexPoint nodes (IfcStructuralPointConnection, shared by
// the columns above and below a floor), Axis = the profile's y direction,
// linked to its column by IfcRelAssignsToProduct (RelatedObjects = the
// member, RelatingProduct = the column). Two design combinations,
// IfcStructuralLoadGroup .LOAD_COMBINATION.:
//   - "ULS-gravity" (1.2G + 1.5Q): 9 kPa on 36 m² per bay, so the axial load
//     grows downwards with the number of floors above; small end moments from
//     beam eccentricity (reverse curvature about the major axis);
//   - "ULS-wind-X" (1.2G + 0.4Q + Wu in X): 80 % of the gravity load, plus
//     the storey shear in X (2.5 % of the storey's gravity load) shared by the
//     X-frame columns as double-curvature major-axis moments, and overturning
//     axial load varying across the frame.
//
// Each combination has an IfcStructuralResultGroup (FIRST_ORDER_THEORY,
// ResultForLoadGroup), and per member an IfcStructuralCurveReaction
// (LOCAL_COORDS, DISCRETE) whose AppliedLoad is an
// IfcStructuralLoadConfiguration of two IfcStructuralLoadSingleForce at
// Locations ((0.),(L)), written as end forces (design §4.2: the actions on
// the member at its ends; in compression ForceX is positive at the start and
// negative at the end; MomentY major, MomentZ minor). Reactions are connected
// to their member by IfcRelConnectsStructuralActivity and grouped into the
// result group by IfcRelAssignsToGroup.
//
// Filler makes up the requested file size: fit-out items of each storey
// (desks and cabinets as IfcFacetedBrep boxes, chairs and plants as
// IfcTriangulatedFaceSet) as IfcBuildingElementProxy, each with a small
// property set whose texts use the string escapes \X2\, \S\ and doubled
// apostrophes.
//
// Every number here is invented.
package ifcgen

import (
	"io"
	"math"
	"math/rand/v2"
	"strconv"
)

// Options choose the size of the model.
type Options struct {
	Columns     int    // steel columns in total; 0 = ColumnsForSize(TargetBytes)
	Storeys     int    // storeys; 0 = 10 (never more than Columns)
	TargetBytes int64  // approximate file size, reached with filler; 0 = no filler
	Seed        uint64 // random seed; 0 = 1
}

// Stats describe a written model.
type Stats struct {
	Columns, Storeys, Proxies, Instances int
	Bytes                                int64
}

// ColumnsForSize returns the default number of columns for a file of about
// the given size: 2,000 for 32 MB, 13,500 for 300 MB, interpolated linearly.
func ColumnsForSize(bytes int64) int {
	mb := float64(bytes) / (1 << 20)
	return max(1, int(math.Round(2000+(13500-2000)*(mb-32)/(300-32))))
}

// SizeForColumns is the inverse of ColumnsForSize.
func SizeForColumns(columns int) int64 {
	mb := 32 + (float64(columns)-2000)*(300-32)/(13500-2000)
	return int64(math.Max(mb, 0) * (1 << 20))
}

const (
	bay          = 6000.0 // mm
	groundHeight = 4500.0 // mm
	upperHeight  = 3600.0 // mm
	floorLoadULS = 0.009  // N/mm² (9 kPa), 1.2G + 1.5Q
	// structBytesPerColumn estimates the bytes per column written after the
	// storeys (analytical member, nodes, two reactions), used to share the
	// filler among the storeys.
	structBytesPerColumn = 1850
)

// profile is a section of the scenario (dimensions in mm).
type profile struct {
	name            string
	hollow          bool
	b, d, tw, tf, r float64 // I: width, depth, web, flange, root radius; SHS: b, d, wall in tw, inner r, outer in tf
	grade           string
	id, set, usage  int // instance ids once written
	columns         []int
}

// Sections: universal columns from shared/sections.md (AS handbook), HE
// sizes from the same page (EU tables), and the SHS of the demo model.
func sections() []*profile {
	return []*profile{
		{name: "HE400B", b: 300, d: 400, tw: 13.5, tf: 24, r: 27, grade: "S355"},
		{name: "310UC137", b: 309, d: 321, tw: 13.8, tf: 21.7, r: 16.5, grade: "S355"},
		{name: "HE300B", b: 300, d: 300, tw: 11, tf: 19, r: 27, grade: "S355"},
		{name: "250UC89.5", b: 256, d: 260, tw: 10.5, tf: 17.3, r: 14, grade: "S355"},
		{name: "HE260A", b: 260, d: 250, tw: 7.5, tf: 12.5, r: 24, grade: "S355"},
		{name: "HE200B", b: 200, d: 200, tw: 9, tf: 15, r: 18, grade: "S355"},
		{name: "HE200A", b: 200, d: 190, tw: 6.5, tf: 10, r: 18, grade: "S355"},
		{name: "200x200x9.0SHS", hollow: true, b: 200, d: 200, tw: 9, r: 13.5, tf: 22.5, grade: "S355J2H"},
	}
}

// pickSection chooses by the gravity axial load (N).
func pickSection(ps []*profile, n float64, interior bool, rng *rand.Rand) *profile {
	kn := n / 1000
	switch {
	case kn > 2600:
		return ps[0]
	case kn > 1900:
		return ps[1]
	case kn > 1300:
		return ps[2]
	case kn > 800:
		return ps[3]
	case interior && rng.IntN(4) == 0:
		return ps[7]
	case kn > 450:
		return ps[4]
	case kn > 250:
		return ps[5]
	}
	return ps[6]
}

type gen struct {
	s   *stepWriter
	rng *rand.Rand
	opt Options
	gid uint64 // GlobalId counter

	nx, ny   int
	perStory []int
	elev     []float64
	height   []float64

	ctx, body, axisCtx     int
	zDir, xDir, yDir, negX int
	origin, world          int
	storeyIDs, storeyPl    []int
	profiles               []*profile
	materials              map[string]int
	proxies                int

	cols  []colRec
	nodes []map[int]int // per level: grid position -> point connection
}

// colRec is what the structural model needs of a written column.
type colRec struct {
	id, storey, pos int
	x, y, h         float64
	rotated         bool
	frameX, frameY  bool
	nGrav           float64 // N, compression
	m0              float64 // N·mm, gravity end moment scale
	vary            [4]float64
}

// Write writes the model to w.
func Write(w io.Writer, opt Options) (Stats, error) {
	if opt.Seed == 0 {
		opt.Seed = 1
	}
	if opt.Columns <= 0 {
		opt.Columns = ColumnsForSize(opt.TargetBytes)
	}
	if opt.Storeys <= 0 {
		opt.Storeys = 10
	}
	opt.Storeys = min(opt.Storeys, opt.Columns)
	g := &gen{
		s:         newStepWriter(w),
		rng:       rand.New(rand.NewPCG(opt.Seed, 0x5eed1f3c)),
		opt:       opt,
		materials: map[string]int{},
	}
	g.layout()
	g.header()
	g.context()
	g.sectionsAndMaterials()
	for st := 0; st < opt.Storeys; st++ {
		g.storeyColumns(st)
		g.filler(st)
	}
	g.associateMaterials()
	g.structural()
	g.s.rawString("ENDSEC;\nEND-ISO-10303-21;\n")
	err := g.s.flush()
	return Stats{Columns: opt.Columns, Storeys: opt.Storeys, Proxies: g.proxies, Instances: g.s.next - 1, Bytes: g.s.n}, err
}

func (g *gen) newGID() string {
	g.gid++
	return globalID(mix(g.opt.Seed^g.gid*0x9E3779B97F4A7C15), mix(g.gid+0x632BE59BD9B4E019))
}

// mix is splitmix64's finaliser.
func mix(z uint64) uint64 {
	z += 0x9E3779B97F4A7C15
	z = (z ^ z>>30) * 0xBF58476D1CE4E5B9
	z = (z ^ z>>27) * 0x94D049BB133111EB
	return z ^ z>>31
}

func (g *gen) layout() {
	S := g.opt.Storeys
	g.perStory = make([]int, S)
	maxPer := 0
	for st := range g.perStory {
		g.perStory[st] = g.opt.Columns / S
		if st < g.opt.Columns%S {
			g.perStory[st]++
		}
		maxPer = max(maxPer, g.perStory[st])
	}
	g.nx = int(math.Ceil(math.Sqrt(float64(maxPer))))
	g.ny = (maxPer + g.nx - 1) / g.nx
	g.elev = make([]float64, S+1)
	g.height = make([]float64, S)
	for st := 0; st < S; st++ {
		h := upperHeight
		if st == 0 {
			h = groundHeight
		}
		g.height[st] = h
		g.elev[st+1] = g.elev[st] + h
	}
}

func (g *gen) header() {
	g.s.rawString("ISO-10303-21;\nHEADER;\n" +
		"FILE_DESCRIPTION(('ViewDefinition [DesignTransferView]','Synthetic model of swaygate: invented data'),'2;1');\n" +
		"FILE_NAME('harbour-quay-offices.ifc','2026-12-01T09:00:00',('swaygate generator'),('swaygate'),'swaygate ifcgen','swaygate','');\n" +
		"FILE_SCHEMA(('IFC4'));\nENDSEC;\nDATA;\n")
}

func (g *gen) context() {
	s := g.s
	mm := s.begin("IFCSIUNIT")
	s.derived().enum("LENGTHUNIT").enum("MILLI").enum("METRE").end()
	newton := s.begin("IFCSIUNIT")
	s.derived().enum("FORCEUNIT").unset().enum("NEWTON").end()
	e1 := s.begin("IFCDERIVEDUNITELEMENT")
	s.ref(newton).integer(1).end()
	e2 := s.begin("IFCDERIVEDUNITELEMENT")
	s.ref(mm).integer(1).end()
	torque := s.begin("IFCDERIVEDUNIT")
	s.refs(e1, e2).enum("TORQUEUNIT").unset().end()
	mpa := s.begin("IFCSIUNIT")
	s.derived().enum("PRESSUREUNIT").enum("MEGA").enum("PASCAL").end()
	e3 := s.begin("IFCDERIVEDUNITELEMENT")
	s.ref(mpa).integer(1).end()
	modulus := s.begin("IFCDERIVEDUNIT")
	s.refs(e3).enum("MODULUSOFELASTICITYUNIT").unset().end()
	rad := s.begin("IFCSIUNIT")
	s.derived().enum("PLANEANGLEUNIT").unset().enum("RADIAN").end()
	units := s.begin("IFCUNITASSIGNMENT")
	s.refs(mm, newton, torque, mpa, modulus, rad).end()

	g.origin = s.begin("IFCCARTESIANPOINT")
	s.reals(0, 0, 0).end()
	g.world = s.begin("IFCAXIS2PLACEMENT3D")
	s.ref(g.origin).unset().unset().end()
	g.ctx = s.begin("IFCGEOMETRICREPRESENTATIONCONTEXT")
	s.unset().str("Model").integer(3).real(1e-5).ref(g.world).unset().end()
	g.body = s.begin("IFCGEOMETRICREPRESENTATIONSUBCONTEXT")
	s.str("Body").str("Model").derived().derived().derived().derived().ref(g.ctx).unset().enum("MODEL_VIEW").unset().end()
	g.axisCtx = s.begin("IFCGEOMETRICREPRESENTATIONSUBCONTEXT")
	s.str("Axis").str("Model").derived().derived().derived().derived().ref(g.ctx).unset().enum("MODEL_VIEW").unset().end()
	project := s.begin("IFCPROJECT")
	s.str(g.newGID()).unset().str("Harbour Quay Offices").str("Invented office block (synthetic benchmark model)").unset().unset().unset().refs(g.ctx).ref(units).end()

	sitePl := s.begin("IFCLOCALPLACEMENT")
	s.unset().ref(g.world).end()
	site := s.begin("IFCSITE")
	s.str(g.newGID()).unset().str("Harbour Quay").unset().unset().ref(sitePl).unset().unset().enum("ELEMENT").unset().unset().unset().unset().unset().end()
	bldPl := s.begin("IFCLOCALPLACEMENT")
	s.ref(sitePl).ref(g.world).end()
	bld := s.begin("IFCBUILDING")
	s.str(g.newGID()).unset().str("Office block").unset().unset().ref(bldPl).unset().unset().enum("ELEMENT").unset().unset().unset().end()
	s.begin("IFCRELAGGREGATES")
	s.str(g.newGID()).unset().unset().unset().ref(project).refs(site).end()
	s.begin("IFCRELAGGREGATES")
	s.str(g.newGID()).unset().unset().unset().ref(site).refs(bld).end()

	S := g.opt.Storeys
	g.storeyIDs = make([]int, S)
	g.storeyPl = make([]int, S)
	for st := 0; st < S; st++ {
		p := s.begin("IFCCARTESIANPOINT")
		s.reals(0, 0, g.elev[st]).end()
		a := s.begin("IFCAXIS2PLACEMENT3D")
		s.ref(p).unset().unset().end()
		g.storeyPl[st] = s.begin("IFCLOCALPLACEMENT")
		s.ref(bldPl).ref(a).end()
		g.storeyIDs[st] = s.begin("IFCBUILDINGSTOREY")
		s.str(g.newGID()).unset().str(storeyName(st)).unset().unset().ref(g.storeyPl[st]).unset().unset().enum("ELEMENT").real(g.elev[st]).end()
	}
	s.begin("IFCRELAGGREGATES")
	s.str(g.newGID()).unset().unset().unset().ref(bld).refs(g.storeyIDs...).end()

	g.zDir = s.begin("IFCDIRECTION")
	s.reals(0, 0, 1).end()
	g.xDir = s.begin("IFCDIRECTION")
	s.reals(1, 0, 0).end()
	g.yDir = s.begin("IFCDIRECTION")
	s.reals(0, 1, 0).end()
	g.negX = s.begin("IFCDIRECTION")
	s.reals(-1, 0, 0).end()
}

func storeyName(st int) string {
	if st == 0 {
		return "Ground Floor"
	}
	return "Level " + strconv.Itoa(st)
}

func (g *gen) material(grade string) int {
	if id, ok := g.materials[grade]; ok {
		return id
	}
	s := g.s
	m := s.begin("IFCMATERIAL")
	s.str(grade).unset().str("Steel").end()
	e := s.begin("IFCPROPERTYSINGLEVALUE")
	s.str("YoungModulus").unset().typedReal("IFCMODULUSOFELASTICITYMEASURE", 210000).unset().end()
	s.begin("IFCMATERIALPROPERTIES")
	s.str("Pset_MaterialMechanical").unset().refs(e).ref(m).end()
	fy := s.begin("IFCPROPERTYSINGLEVALUE")
	s.str("YieldStress").unset().typedReal("IFCPRESSUREMEASURE", 355).unset().end()
	s.begin("IFCMATERIALPROPERTIES")
	s.str("Pset_MaterialSteel").unset().refs(fy).ref(m).end()
	g.materials[grade] = m
	return m
}

func (g *gen) sectionsAndMaterials() {
	s := g.s
	g.profiles = sections()
	for _, p := range g.profiles {
		mat := g.material(p.grade)
		if p.hollow {
			p.id = s.begin("IFCRECTANGLEHOLLOWPROFILEDEF")
			s.enum("AREA").str(p.name).unset().real(p.b).real(p.d).real(p.tw).real(p.r).real(p.tf).end()
		} else {
			p.id = s.begin("IFCISHAPEPROFILEDEF")
			s.enum("AREA").str(p.name).unset().real(p.b).real(p.d).real(p.tw).real(p.tf).real(p.r).unset().unset().end()
		}
		mp := s.begin("IFCMATERIALPROFILE")
		s.str(p.name).unset().ref(mat).ref(p.id).unset().unset().end()
		p.set = s.begin("IFCMATERIALPROFILESET")
		s.str(p.name).unset().refs(mp).unset().end()
		p.usage = s.begin("IFCMATERIALPROFILESETUSAGE")
		s.ref(p.set).integer(5).unset().end()
	}
}

func gridName(gx, gy int) string {
	var letters []byte
	for n := gx; ; n = n/26 - 1 {
		letters = append([]byte{byte('A' + n%26)}, letters...)
		if n < 26 {
			break
		}
	}
	return string(letters) + strconv.Itoa(gy+1)
}

func (g *gen) storeyColumns(st int) {
	s := g.s
	S := g.opt.Storeys
	h := g.height[st]
	var ids []int
	for pos := 0; pos < g.perStory[st]; pos++ {
		gx, gy := pos%g.nx, pos/g.nx
		// Moment frames on every grid line: columns are rotated so that
		// their strong axis resists sway in X and their weak axis sways in
		// Y; every third interior column is a gravity column that leans on
		// the frames.
		interior := gx%3 == 1 && gy%3 == 1 && gx != g.nx-1 && gy != g.ny-1
		frameX := !interior
		frameY := false
		fx, fy := 1.0, 1.0
		if gx == 0 || gx == g.nx-1 {
			fx = 0.5
		}
		if gy == 0 || gy == g.ny-1 {
			fy = 0.5
		}
		pFloor := floorLoadULS * bay * bay * fx * fy
		nGrav := pFloor * float64(S-st) * (0.95 + 0.1*g.rng.Float64())
		prof := pickSection(g.profiles, nGrav, interior, g.rng)
		x, y := float64(gx)*bay, float64(gy)*bay
		// Alternate the orientation so that each direction has strong and
		// weak axes in its frames.
		rotated := frameX && (gx+gy)%2 == 0

		pt := s.begin("IFCCARTESIANPOINT")
		s.reals(x, y, 0).end()
		ax := s.begin("IFCAXIS2PLACEMENT3D")
		ref := g.xDir
		if rotated {
			ref = g.yDir
		}
		s.ref(pt).ref(g.zDir).ref(ref).end()
		pl := s.begin("IFCLOCALPLACEMENT")
		s.ref(g.storeyPl[st]).ref(ax).end()
		a0 := s.begin("IFCCARTESIANPOINT")
		s.reals(0, 0, 0).end()
		a1 := s.begin("IFCCARTESIANPOINT")
		s.reals(0, 0, h).end()
		poly := s.begin("IFCPOLYLINE")
		s.refs(a0, a1).end()
		axisRep := s.begin("IFCSHAPEREPRESENTATION")
		s.ref(g.axisCtx).str("Axis").str("Curve3D").refs(poly).end()
		solid := s.begin("IFCEXTRUDEDAREASOLID")
		s.ref(prof.id).unset().ref(g.zDir).real(h).end()
		bodyRep := s.begin("IFCSHAPEREPRESENTATION")
		s.ref(g.body).str("Body").str("SweptSolid").refs(solid).end()
		pds := s.begin("IFCPRODUCTDEFINITIONSHAPE")
		s.unset().unset().refs(axisRep, bodyRep).end()
		name := gridName(gx, gy)
		col := s.begin("IFCCOLUMN")
		s.str(g.newGID()).unset().str("Column " + name + " " + storeyName(st)).unset().unset().ref(pl).ref(pds).str(name + "/" + strconv.Itoa(st)).enum("COLUMN").end()

		keMaj, keMin := 1.0, 1.0
		if !interior {
			keMaj = []float64{1.2, 1.3, 1.4, 1.5}[g.rng.IntN(4)]
			keMin = []float64{1.2, 1.3, 1.4, 1.5}[g.rng.IntN(4)]
		}
		p1 := s.begin("IFCPROPERTYSINGLEVALUE")
		s.str("EffectiveLengthFactorMajor").unset().typedReal("IFCPOSITIVERATIOMEASURE", keMaj).unset().end()
		p2 := s.begin("IFCPROPERTYSINGLEVALUE")
		s.str("EffectiveLengthFactorMinor").unset().typedReal("IFCPOSITIVERATIOMEASURE", keMin).unset().end()
		p3 := s.begin("IFCPROPERTYSINGLEVALUE")
		s.str("SwayMajor").unset().typedBool("IFCBOOLEAN", !interior).unset().end()
		p4 := s.begin("IFCPROPERTYSINGLEVALUE")
		s.str("SwayMinor").unset().typedBool("IFCBOOLEAN", !interior).unset().end()
		ps := s.begin("IFCPROPERTYSET")
		s.str(g.newGID()).unset().str("Swaygate_ColumnDesign").unset().refs(p1, p2, p3, p4).end()
		s.begin("IFCRELDEFINESBYPROPERTIES")
		s.str(g.newGID()).unset().unset().unset().refs(col).ref(ps).end()

		ids = append(ids, col)
		prof.columns = append(prof.columns, col)
		var vary [4]float64
		for k := range vary {
			vary[k] = 0.9 + 0.2*g.rng.Float64()
		}
		g.cols = append(g.cols, colRec{
			id: col, storey: st, pos: pos, x: x, y: y, h: h, rotated: rotated,
			frameX: frameX, frameY: frameY, nGrav: nGrav, m0: pFloor * 100 * 0.3, vary: vary,
		})
	}
	s.begin("IFCRELCONTAINEDINSPATIALSTRUCTURE")
	s.str(g.newGID()).unset().str("Columns of " + storeyName(st)).unset().refs(ids...).ref(g.storeyIDs[st]).end()
}

func (g *gen) associateMaterials() {
	s := g.s
	for _, p := range g.profiles {
		if len(p.columns) == 0 {
			continue
		}
		s.begin("IFCRELASSOCIATESMATERIAL")
		s.str(g.newGID()).unset().unset().unset().refs(p.columns...).ref(p.usage).end()
	}
}
