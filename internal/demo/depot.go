// Package demo writes swaygate's demo model: the Tern Street Depot, an
// invented two-storey steel-framed workshop with a mezzanine.
//
// # The scenario
//
// Grid lines A–D run along X at 6 m spacing, lines 1–2 along Y at 8 m. The
// ground storey is 4.5 m high, the mezzanine 3.6 m. Lateral load in X is
// resisted by moment frames through the universal columns on lines A and D
// (rotated so that their major axis bends in X); lateral load in Y by
// cross-bracing on lines A and D, so every column is braced in Y. The columns
// on lines B and C carry gravity only: braced about both axes and leaning in X.
// A concrete column stands by the stair (SC1) and is not checked. On the
// mezzanine, column B1 was issued without its design data (missing
// restraint), B2 carries a plant skid with a uniform moment, and C2 was left
// at its original size after a plant platform was added above it.
//
// Two load combinations carry first-order results written as member end
// forces in an IFC4 structural analysis model linked to the physical columns:
// ULS-1 (1.2G + 1.5Q) and ULS-2 (1.2G + 0.4Q + Wu in X). The same actions can
// also be written as a side-car CSV.
//
// Every number here is invented for the demonstration.
package demo

import (
	"crypto/sha1"
	"fmt"
	"io"
	"math"
)

// Units choose the unit assignment the model is written in, so that tests can
// check that the same building in other units gives the same members.
type Units struct {
	Metres    bool // length in m instead of mm
	Newtons   bool // force in N instead of kN (torque follows: N·m or kN·m)
	WithSteel bool // unused; reserved
}

// column is one physical column of the depot.
type column struct {
	name      string
	gx, gy    int // grid indices
	storey    int // 0 ground, 1 mezzanine
	profile   string
	rotated   bool // major axis bends in X
	sway      bool // part of the X moment frames (major axis)
	keMajor   float64
	keMinor   float64
	design    bool // carries Swaygate_ColumnDesign
	concrete  bool
	fixedBase bool
	// actions per combination: N* (kN, compression +), major Ma, Mb, minor Ma, Mb (kNm, internal)
	act [2][5]float64
}

var (
	gridX   = [4]float64{0, 6000, 12000, 18000}
	gridY   = [2]float64{0, 8000}
	levels  = [3]float64{0, 4500, 8100}
	storeys = [2]string{"Ground Floor", "Mezzanine"}
	combos  = [2]string{"ULS-1 1.2G+1.5Q", "ULS-2 1.2G+0.4Q+Wu(X)"}
	letters = "ABCD"
)

// profiles are handbook sizes (dimensions in mm).
type profileDef struct {
	kind                 string // "I", "SHS", "RECT", "CHS"
	b, d, tw, tf, r, ro  float64
	material, grade, cat string
}

var profiles = map[string]profileDef{
	"310UC96.8":        {kind: "I", b: 305, d: 308, tw: 9.9, tf: 15.4, r: 16.5, grade: "300PLUS", cat: "Steel"},
	"250UC89.5":        {kind: "I", b: 256, d: 260, tw: 10.5, tf: 17.3, r: 14, grade: "300PLUS", cat: "Steel"},
	"150UC30.0":        {kind: "I", b: 153, d: 158, tw: 6.6, tf: 9.4, r: 8.9, grade: "300PLUS", cat: "Steel"},
	"460UB82.1":        {kind: "I", b: 191, d: 460, tw: 9.9, tf: 16, r: 11.4, grade: "300PLUS", cat: "Steel"},
	"360UB50.7":        {kind: "I", b: 171, d: 356, tw: 7.3, tf: 11.5, r: 11.4, grade: "300PLUS", cat: "Steel"},
	"200x200x9.0SHS":   {kind: "SHS", b: 200, d: 200, tw: 9, r: 13.5, ro: 22.5, grade: "C450L0", cat: "Steel"},
	"88.9x5.0CHS":      {kind: "CHS", d: 88.9, tw: 5, grade: "C350L0", cat: "Steel"},
	"400x400 concrete": {kind: "RECT", b: 400, d: 400, grade: "Concrete 40 MPa", cat: "Concrete"},
}

func depotColumns() []column {
	var cs []column
	for s := 0; s < 2; s++ {
		for gy := 0; gy < 2; gy++ {
			for gx := 0; gx < 4; gx++ {
				c := column{
					name: fmt.Sprintf("%c%d", letters[gx], gy+1),
					gx:   gx, gy: gy, storey: s,
					design: true, keMinor: 1.0,
				}
				edge := gx == 0 || gx == 3
				switch {
				case edge && s == 0:
					c.profile, c.rotated, c.sway, c.keMajor, c.fixedBase = "310UC96.8", true, true, 1.3, true
				case edge:
					c.profile, c.rotated, c.sway, c.keMajor = "250UC89.5", true, true, 1.3
				case s == 0:
					c.profile, c.keMajor = "200x200x9.0SHS", 1.0
				default:
					c.profile, c.keMajor = "150UC30.0", 1.0
				}
				c.act = depotActions(c)
				cs = append(cs, c)
			}
		}
	}
	// The mezzanine cases of the story.
	for i := range cs {
		c := &cs[i]
		if c.storey != 1 {
			continue
		}
		switch c.name {
		case "B1":
			c.design = false
		case "B2":
			c.act[0] = [5]float64{520, 0, 0, 10, 10}
			c.act[1] = [5]float64{380, 0, 0, 7, 7}
		case "C2":
			c.act[0] = [5]float64{900, 0, 6, 0, 0}
			c.act[1] = [5]float64{640, 0, 4, 0, 0}
		}
	}
	cs = append(cs, column{name: "SC1", gx: 1, gy: 0, storey: 0, profile: "400x400 concrete", concrete: true})
	return cs
}

// depotActions returns invented first-order actions for a column:
// N* (kN), major Ma, Mb, minor Ma, Mb (kNm).
func depotActions(c column) [2][5]float64 {
	windward := c.gx == 0
	switch {
	case c.sway && c.storey == 0:
		n2 := 600.0
		if windward {
			n2 = 440
		}
		return [2][5]float64{
			{620, -12, 25, 3, 6},
			{n2, 95, -70, 2, 4},
		}
	case c.sway:
		n2 := 250.0
		if windward {
			n2 = 210
		}
		return [2][5]float64{
			{280, -10, 22, 2, 5},
			{n2, 55, -48, 2, 3},
		}
	case c.storey == 0:
		// Gravity columns: the pinned Y beams bear on their flanges, so
		// the eccentric reactions bend them about the braced (major) axis.
		return [2][5]float64{
			{1150, 0, 8, 0, 0},
			{800, 0, 6, 0, 0},
		}
	default:
		return [2][5]float64{
			{420, 0, 5, 0, 0},
			{300, 0, 4, 0, 0},
		}
	}
}

// globalID makes a stable IFC GlobalId from a name.
func globalID(name string) string {
	const alphabet = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz_$"
	h := sha1.Sum([]byte("tern-street-depot/" + name))
	// 128 bits from the hash; 22 characters of 6 bits, the first carrying 2.
	var out [22]byte
	var hi, lo uint64
	for i := 0; i < 8; i++ {
		hi = hi<<8 | uint64(h[i])
		lo = lo<<8 | uint64(h[8+i])
	}
	for i := 21; i >= 0; i-- {
		out[i] = alphabet[lo&63]
		lo = lo>>6 | (hi&63)<<58
		hi >>= 6
	}
	return string(out[:])
}

// Write writes the depot model as IFC4 in the given units.
func Write(w io.Writer, u Units) error {
	lenScale := 1.0 // mm -> model length unit
	if u.Metres {
		lenScale = 0.001
	}
	forceScale := 1.0 // kN -> model force unit
	if u.Newtons {
		forceScale = 1000
	}
	// torque: kN·m or N·m, or with metres... torque unit is force × length(m) here.
	torqueScale := forceScale // kNm -> (force unit)·m
	L := func(mm float64) string { return realv(round(mm*lenScale, 9)) }

	s := newStepWriter(w)
	s.raw("ISO-10303-21;\nHEADER;\n")
	s.raw("FILE_DESCRIPTION(('ViewDefinition [DesignTransferView]','Demo model of swaygate: invented data'),'2;1');\n")
	s.raw("FILE_NAME('tern-street-depot.ifc','2026-11-30T09:00:00',('swaygate demo'),('swaygate'),'swaygate demo writer','swaygate','');\n")
	s.raw("FILE_SCHEMA(('IFC4'));\nENDSEC;\nDATA;\n")

	// Units.
	var lengthUnit int
	if u.Metres {
		lengthUnit = s.add("IFCSIUNIT", "*", ".LENGTHUNIT.", unset, ".METRE.")
	} else {
		lengthUnit = s.add("IFCSIUNIT", "*", ".LENGTHUNIT.", ".MILLI.", ".METRE.")
	}
	var forceUnit int
	if u.Newtons {
		forceUnit = s.add("IFCSIUNIT", "*", ".FORCEUNIT.", unset, ".NEWTON.")
	} else {
		forceUnit = s.add("IFCSIUNIT", "*", ".FORCEUNIT.", ".KILO.", ".NEWTON.")
	}
	metre := s.add("IFCSIUNIT", "*", ".LENGTHUNIT.", unset, ".METRE.")
	tf := s.add("IFCDERIVEDUNITELEMENT", ref(forceUnit), "1")
	tl := s.add("IFCDERIVEDUNITELEMENT", ref(metre), "1")
	torqueUnit := s.add("IFCDERIVEDUNIT", refs(tf, tl), ".TORQUEUNIT.", unset)
	pressure := s.add("IFCSIUNIT", "*", ".PRESSUREUNIT.", ".MEGA.", ".PASCAL.")
	mpa := s.add("IFCDERIVEDUNITELEMENT", ref(pressure), "1")
	modulus := s.add("IFCDERIVEDUNIT", refs(mpa), ".MODULUSOFELASTICITYUNIT.", unset)
	angle := s.add("IFCSIUNIT", "*", ".PLANEANGLEUNIT.", unset, ".RADIAN.")
	unitsID := s.add("IFCUNITASSIGNMENT", refs(lengthUnit, forceUnit, torqueUnit, pressure, modulus, angle))

	origin := s.add("IFCCARTESIANPOINT", reals(0, 0, 0))
	world := s.add("IFCAXIS2PLACEMENT3D", ref(origin), unset, unset)
	ctx := s.add("IFCGEOMETRICREPRESENTATIONCONTEXT", unset, str("Model"), "3", "1.E-05", ref(world), unset)
	body := s.add("IFCGEOMETRICREPRESENTATIONSUBCONTEXT", str("Body"), str("Model"), "*", "*", "*", "*", ref(ctx), unset, ".MODEL_VIEW.", unset)
	axisCtx := s.add("IFCGEOMETRICREPRESENTATIONSUBCONTEXT", str("Axis"), str("Model"), "*", "*", "*", "*", ref(ctx), unset, ".MODEL_VIEW.", unset)
	project := s.add("IFCPROJECT", str(globalID("project")), unset, str("Tern Street Depot"), str("Invented demo building"), unset, unset, unset, refs(ctx), ref(unitsID))

	sitePl := s.add("IFCLOCALPLACEMENT", unset, ref(world))
	site := s.add("IFCSITE", str(globalID("site")), unset, str("Depot site"), unset, unset, ref(sitePl), unset, unset, ".ELEMENT.", unset, unset, unset, unset, unset)
	bldPl := s.add("IFCLOCALPLACEMENT", ref(sitePl), ref(world))
	bld := s.add("IFCBUILDING", str(globalID("building")), unset, str("Workshop"), unset, unset, ref(bldPl), unset, unset, ".ELEMENT.", unset, unset, unset)
	s.add("IFCRELAGGREGATES", str(globalID("agg-project")), unset, unset, unset, ref(project), refs(site))
	s.add("IFCRELAGGREGATES", str(globalID("agg-site")), unset, unset, unset, ref(site), refs(bld))

	var storeyIDs [2]int
	var storeyPl [2]int
	for i, name := range storeys {
		p := s.add("IFCCARTESIANPOINT", reals(0, 0, round(levels[i]*lenScale, 9)))
		a := s.add("IFCAXIS2PLACEMENT3D", ref(p), unset, unset)
		storeyPl[i] = s.add("IFCLOCALPLACEMENT", ref(bldPl), ref(a))
		storeyIDs[i] = s.add("IFCBUILDINGSTOREY", str(globalID("storey/"+name)), unset, str(name), unset, unset, ref(storeyPl[i]), unset, unset, ".ELEMENT.", L(levels[i]))
	}
	s.add("IFCRELAGGREGATES", str(globalID("agg-building")), unset, unset, unset, ref(bld), refs(storeyIDs[0], storeyIDs[1]))

	// Materials and profiles.
	zDir := s.add("IFCDIRECTION", reals(0, 0, 1))
	xDir := s.add("IFCDIRECTION", reals(1, 0, 0))
	yDir := s.add("IFCDIRECTION", reals(0, 1, 0))
	negX := s.add("IFCDIRECTION", reals(-1, 0, 0))
	materials := map[string]int{}
	profileIDs := map[string]int{}
	setIDs := map[string]int{}
	for _, name := range sortedKeys(profiles) {
		p := profiles[name]
		m, ok := materials[p.grade]
		if !ok {
			m = s.add("IFCMATERIAL", str(p.grade), unset, str(p.cat))
			materials[p.grade] = m
			if p.cat == "Steel" {
				fy := map[string]float64{"300PLUS": 300, "C450L0": 450, "C350L0": 350}[p.grade]
				e := s.add("IFCPROPERTYSINGLEVALUE", str("YoungModulus"), unset, "IFCMODULUSOFELASTICITYMEASURE("+realv(200000)+")", unset)
				s.add("IFCMATERIALPROPERTIES", str("Pset_MaterialMechanical"), unset, refs(e), ref(m))
				y := s.add("IFCPROPERTYSINGLEVALUE", str("YieldStress"), unset, "IFCPRESSUREMEASURE("+realv(fy)+")", unset)
				s.add("IFCMATERIALPROPERTIES", str("Pset_MaterialSteel"), unset, refs(y), ref(m))
			}
		}
		var prof int
		switch p.kind {
		case "I":
			prof = s.add("IFCISHAPEPROFILEDEF", ".AREA.", str(name), unset, L(p.b), L(p.d), L(p.tw), L(p.tf), L(p.r), unset, unset)
		case "SHS":
			prof = s.add("IFCRECTANGLEHOLLOWPROFILEDEF", ".AREA.", str(name), unset, L(p.b), L(p.d), L(p.tw), L(p.r), L(p.ro))
		case "CHS":
			prof = s.add("IFCCIRCLEHOLLOWPROFILEDEF", ".AREA.", str(name), unset, L(p.d/2), L(p.tw))
		case "RECT":
			prof = s.add("IFCRECTANGLEPROFILEDEF", ".AREA.", str(name), unset, L(p.b), L(p.d))
		}
		profileIDs[name] = prof
		mp := s.add("IFCMATERIALPROFILE", str(name), unset, ref(m), ref(prof), unset, unset)
		setIDs[name] = s.add("IFCMATERIALPROFILESET", str(name), unset, refs(mp), unset)
	}

	// Physical columns.
	cols := depotColumns()
	colIDs := make([]int, len(cols))
	var inStorey [2][]int
	usage := map[string][]int{}
	for i, c := range cols {
		x, y := gridX[c.gx], gridY[c.gy]
		if c.concrete {
			x, y = 7500, 2500
		}
		h := levels[c.storey+1] - levels[c.storey]
		p := s.add("IFCCARTESIANPOINT", reals(round(x*lenScale, 9), round(y*lenScale, 9), 0))
		ref2 := xDir
		if c.rotated {
			ref2 = yDir
		}
		a := s.add("IFCAXIS2PLACEMENT3D", ref(p), ref(zDir), ref(ref2))
		pl := s.add("IFCLOCALPLACEMENT", ref(storeyPl[c.storey]), ref(a))
		p0 := s.add("IFCCARTESIANPOINT", reals(0, 0, 0))
		p1 := s.add("IFCCARTESIANPOINT", reals(0, 0, round(h*lenScale, 9)))
		line := s.add("IFCPOLYLINE", refs(p0, p1))
		axisRep := s.add("IFCSHAPEREPRESENTATION", ref(axisCtx), str("Axis"), str("Curve3D"), refs(line))
		solid := s.add("IFCEXTRUDEDAREASOLID", ref(profileIDs[c.profile]), unset, ref(zDir), L(h))
		bodyRep := s.add("IFCSHAPEREPRESENTATION", ref(body), str("Body"), str("SweptSolid"), refs(solid))
		shape := s.add("IFCPRODUCTDEFINITIONSHAPE", unset, unset, refs(axisRep, bodyRep))
		tag := fmt.Sprintf("%s/%s", c.name, []string{"G", "M"}[c.storey])
		colIDs[i] = s.add("IFCCOLUMN", str(globalID("column/"+tag)), unset, str("Column "+c.name+" "+storeys[c.storey]), unset, unset, ref(pl), ref(shape), str(tag), ".COLUMN.")
		inStorey[c.storey] = append(inStorey[c.storey], colIDs[i])
		usage[c.profile] = append(usage[c.profile], colIDs[i])
		if c.design {
			props := []int{
				s.add("IFCPROPERTYSINGLEVALUE", str("EffectiveLengthFactorMajor"), unset, "IFCPOSITIVERATIOMEASURE("+realv(c.keMajor)+")", unset),
				s.add("IFCPROPERTYSINGLEVALUE", str("EffectiveLengthFactorMinor"), unset, "IFCPOSITIVERATIOMEASURE("+realv(c.keMinor)+")", unset),
				s.add("IFCPROPERTYSINGLEVALUE", str("SwayMajor"), unset, "IFCBOOLEAN("+boolean(c.sway)+")", unset),
				s.add("IFCPROPERTYSINGLEVALUE", str("SwayMinor"), unset, "IFCBOOLEAN(.F.)", unset),
			}
			if c.fixedBase {
				props = append(props,
					s.add("IFCPROPERTYSINGLEVALUE", str("EndConditionBottom"), unset, "IFCLABEL('fixed')", unset))
			}
			pset := s.add("IFCPROPERTYSET", str(globalID("pset/"+tag)), unset, str("Swaygate_ColumnDesign"), unset, refsSlice(props))
			s.add("IFCRELDEFINESBYPROPERTIES", str(globalID("defines/"+tag)), unset, unset, unset, refs(colIDs[i]), ref(pset))
		}
	}
	for st := 0; st < 2; st++ {
		s.add("IFCRELCONTAINEDINSPATIALSTRUCTURE", str(globalID(fmt.Sprintf("contained/%d", st))), unset, unset, unset, refsSlice(inStorey[st]), ref(storeyIDs[st]))
	}
	for _, name := range sortedKeys(usage) {
		u := s.add("IFCMATERIALPROFILESETUSAGE", ref(setIDs[name]), "5", unset)
		s.add("IFCRELASSOCIATESMATERIAL", str(globalID("material/"+name)), unset, unset, unset, refsSlice(usage[name]), ref(u))
	}

	// Structural analysis model.
	shared := s.add("IFCLOCALPLACEMENT", unset, ref(world))
	type nodeKey struct{ gx, gy, lv int }
	nodes := map[nodeKey]int{}
	vertices := map[nodeKey]int{}
	fixed := s.add("IFCBOUNDARYNODECONDITION", str("Fixed base"), "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.T.)")
	pinned := s.add("IFCBOUNDARYNODECONDITION", str("Pinned base"), "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.F.)", "IFCBOOLEAN(.F.)", "IFCBOOLEAN(.F.)")
	hinge := s.add("IFCBOUNDARYNODECONDITION", str("Hinge"), "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.T.)", "IFCBOOLEAN(.F.)", "IFCBOOLEAN(.F.)")
	var groupItems []int
	for lv := 0; lv < 3; lv++ {
		for gy := 0; gy < 2; gy++ {
			for gx := 0; gx < 4; gx++ {
				k := nodeKey{gx, gy, lv}
				p := s.add("IFCCARTESIANPOINT", reals(round(gridX[gx]*lenScale, 9), round(gridY[gy]*lenScale, 9), round(levels[lv]*lenScale, 9)))
				v := s.add("IFCVERTEXPOINT", ref(p))
				rep := s.add("IFCTOPOLOGYREPRESENTATION", ref(ctx), str("Reference"), str("Vertex"), refs(v))
				shape := s.add("IFCPRODUCTDEFINITIONSHAPE", unset, unset, refs(rep))
				cond := unset
				if lv == 0 {
					cond = ref(pinned)
					if gx == 0 || gx == 3 {
						cond = ref(fixed)
					}
				}
				nodes[k] = s.add("IFCSTRUCTURALPOINTCONNECTION", str(globalID(fmt.Sprintf("node/%c%d/%d", letters[gx], gy+1, lv))), unset, str(fmt.Sprintf("N%c%d-%d", letters[gx], gy+1, lv)), unset, unset, ref(shared), ref(shape), cond, unset)
				vertices[k] = v
				groupItems = append(groupItems, nodes[k])
			}
		}
	}

	type analytical struct {
		id      int
		length  float64 // mm
		col     int     // index into cols, -1 for beams and braces
		axialKN [2]float64
	}
	var members []analytical
	memberSets := map[string][]int{}
	addMember := func(name, profile string, a, b nodeKey, axis int, pinA, pinB bool, kind string, col int) {
		e := s.add("IFCEDGE", ref(vertices[a]), ref(vertices[b]))
		rep := s.add("IFCTOPOLOGYREPRESENTATION", ref(ctx), str("Reference"), str("Edge"), refs(e))
		shape := s.add("IFCPRODUCTDEFINITIONSHAPE", unset, unset, refs(rep))
		id := s.add("IFCSTRUCTURALCURVEMEMBER", str(globalID("member/"+name)), unset, str(name), unset, unset, ref(shared), ref(shape), kind, ref(axis))
		condA, condB := unset, unset
		if pinA {
			condA = ref(hinge)
		}
		if pinB {
			condB = ref(hinge)
		}
		s.add("IFCRELCONNECTSSTRUCTURALMEMBER", str(globalID("conn-a/"+name)), unset, unset, unset, ref(id), ref(nodes[a]), condA, unset, unset, unset)
		s.add("IFCRELCONNECTSSTRUCTURALMEMBER", str(globalID("conn-b/"+name)), unset, unset, unset, ref(id), ref(nodes[b]), condB, unset, unset, unset)
		pa := [3]float64{gridX[a.gx], gridY[a.gy], levels[a.lv]}
		pb := [3]float64{gridX[b.gx], gridY[b.gy], levels[b.lv]}
		length := math.Sqrt(sq(pa[0]-pb[0]) + sq(pa[1]-pb[1]) + sq(pa[2]-pb[2]))
		members = append(members, analytical{id: id, length: length, col: col})
		memberSets[profile] = append(memberSets[profile], id)
		groupItems = append(groupItems, id)
	}
	for i, c := range cols {
		if c.concrete {
			continue
		}
		a := nodeKey{c.gx, c.gy, c.storey}
		b := nodeKey{c.gx, c.gy, c.storey + 1}
		// local z = the profile's depth direction in global axes.
		axis := yDir
		if c.rotated {
			axis = negX
		}
		pinBottom := c.storey == 0 && !c.fixedBase
		addMember("C-"+c.name+[]string{"G", "M"}[c.storey], c.profile, a, b, axis, pinBottom, false, ".RIGID_JOINED_MEMBER.", i)
		s.add("IFCRELASSIGNSTOPRODUCT", str(globalID("assign/"+c.name+[]string{"G", "M"}[c.storey])), unset, str("Context"), unset, refs(members[len(members)-1].id), unset, ref(colIDs[i]))
	}
	for lv := 1; lv < 3; lv++ {
		for gy := 0; gy < 2; gy++ {
			for gx := 0; gx < 3; gx++ {
				// X beams: moment connected to the frame columns on A and D.
				pinA := gx != 0
				pinB := gx+1 != 3
				addMember(fmt.Sprintf("B-X%c%c%d-%d", letters[gx], letters[gx+1], gy+1, lv), "460UB82.1",
					nodeKey{gx, gy, lv}, nodeKey{gx + 1, gy, lv}, zDir, pinA, pinB, ".RIGID_JOINED_MEMBER.", -1)
			}
		}
		for gx := 0; gx < 4; gx++ {
			addMember(fmt.Sprintf("B-Y%c-%d", letters[gx], lv), "360UB50.7",
				nodeKey{gx, 0, lv}, nodeKey{gx, 1, lv}, zDir, true, true, ".PIN_JOINED_MEMBER.", -1)
		}
	}
	for _, gx := range []int{0, 3} {
		for lv := 0; lv < 2; lv++ {
			addMember(fmt.Sprintf("BR-%c-%da", letters[gx], lv), "88.9x5.0CHS",
				nodeKey{gx, 0, lv}, nodeKey{gx, 1, lv + 1}, xDir, true, true, ".PIN_JOINED_MEMBER.", -1)
			addMember(fmt.Sprintf("BR-%c-%db", letters[gx], lv), "88.9x5.0CHS",
				nodeKey{gx, 1, lv}, nodeKey{gx, 0, lv + 1}, xDir, true, true, ".PIN_JOINED_MEMBER.", -1)
		}
	}
	for _, name := range sortedKeys(memberSets) {
		u := s.add("IFCMATERIALPROFILESETUSAGE", ref(setIDs[name]), "10", unset)
		s.add("IFCRELASSOCIATESMATERIAL", str(globalID("analytical-material/"+name)), unset, unset, unset, refsSlice(memberSets[name]), ref(u))
	}

	// Load cases, combinations and results.
	caseNames := []string{"G", "Q", "Wu(X)"}
	var cases []int
	for _, n := range caseNames {
		cases = append(cases, s.add("IFCSTRUCTURALLOADCASE", str(globalID("case/"+n)), unset, str(n), unset, unset, ".LOAD_CASE.", ".NOTDEFINED.", ".NOTDEFINED.", realv(1), unset, unset))
	}
	factors := [2][3]float64{{1.2, 1.5, 0}, {1.2, 0.4, 1}}
	var combIDs [2]int
	var resultIDs [2]int
	for k, name := range combos {
		combIDs[k] = s.add("IFCSTRUCTURALLOADGROUP", str(globalID("combination/"+name)), unset, str(name), unset, unset, ".LOAD_COMBINATION.", ".NOTDEFINED.", ".NOTDEFINED.", realv(1), str("ULS"))
		for ci, f := range factors[k] {
			if f != 0 {
				s.add("IFCRELASSIGNSTOGROUPBYFACTOR", str(globalID(fmt.Sprintf("factor/%d/%d", k, ci))), unset, unset, unset, refs(cases[ci]), unset, ref(combIDs[k]), realv(f))
			}
		}
		resultIDs[k] = s.add("IFCSTRUCTURALRESULTGROUP", str(globalID("results/"+name)), unset, str("Results "+name), unset, unset, ".FIRST_ORDER_THEORY.", ref(combIDs[k]), ".T.")
	}
	model := s.add("IFCSTRUCTURALANALYSISMODEL", str(globalID("analysis-model")), unset, str("Depot frame"), unset, unset, ".LOADING_3D.", unset,
		refs(combIDs[0], combIDs[1]), refs(resultIDs[0], resultIDs[1]), ref(shared))
	s.add("IFCRELASSIGNSTOGROUP", str(globalID("model-items")), unset, unset, unset, refsSlice(groupItems), unset, ref(model))
	s.add("IFCRELDECLARES", str(globalID("declares")), unset, unset, unset, ref(project), refs(model))

	for k := range combos {
		var reactions []int
		for mi, m := range members {
			var n, maj0, maj1, min0, min1 float64
			if m.col >= 0 {
				act := cols[m.col].act[k]
				n, maj0, maj1, min0, min1 = act[0], act[1], act[2], act[3], act[4]
			}
			reactions = append(reactions, s.endForces(fmt.Sprintf("%d/%d", k, mi), m.id, m.length, n, maj0, maj1, min0, min1, forceScale, torqueScale, lenScale))
		}
		s.add("IFCRELASSIGNSTOGROUP", str(globalID(fmt.Sprintf("result-items/%d", k))), unset, unset, unset, refsSlice(reactions), unset, ref(resultIDs[k]))
	}

	s.raw("ENDSEC;\nEND-ISO-10303-21;\n")
	return s.flush()
}

// endForces writes one member's end forces for one combination and returns
// the reaction's id. n is the axial compression (kN), the moments are internal
// end moments (kNm) at the start (bottom) and end (top). End forces are the
// actions on the member at its ends: at the start minus the section force, at
// the end the section force (section forces: tension positive,
// dMy/dx = Vz, dMz/dx = -Vy).
func (s *stepWriter) endForces(key string, member int, lengthMM, n, maj0, maj1, min0, min1, fScale, tScale, lScale float64) int {
	lm := lengthMM / 1000
	vz := (maj1 - maj0) / lm  // kN
	vy := -(min1 - min0) / lm // kN
	N := -n                   // section force, tension positive
	f := func(v float64) string { return realv(round(v*fScale, 9)) }
	t := func(v float64) string { return realv(round(v*tScale, 9)) }
	head := s.add("IFCSTRUCTURALLOADSINGLEFORCE", str("Head"), f(-N), f(-vy), f(-vz), realv(0), t(-maj0), t(-min0))
	tail := s.add("IFCSTRUCTURALLOADSINGLEFORCE", str("Tail"), f(N), f(vy), f(vz), realv(0), t(maj1), t(min1))
	cfg := s.add("IFCSTRUCTURALLOADCONFIGURATION", str("Member end forces"), refs(head, tail),
		"(("+realv(0)+"),("+realv(round(lengthMM*lScale, 9))+"))")
	r := s.add("IFCSTRUCTURALCURVEREACTION", str(globalID("reaction/"+key)), unset, unset, unset, unset, unset, unset, ref(cfg), ".LOCAL_COORDS.", ".DISCRETE.")
	s.add("IFCRELCONNECTSSTRUCTURALACTIVITY", str(globalID("activity/"+key)), unset, unset, unset, ref(member), ref(r))
	return r
}

// WriteActionsCSV writes the same actions as a side-car CSV (design §4.3).
func WriteActionsCSV(w io.Writer) error {
	if _, err := io.WriteString(w, "global_id,combination,axial_compression_kN,m_major_start_kNm,m_major_end_kNm,m_minor_start_kNm,m_minor_end_kNm\n"); err != nil {
		return err
	}
	for _, c := range depotColumns() {
		if c.concrete {
			continue
		}
		tag := fmt.Sprintf("%s/%s", c.name, []string{"G", "M"}[c.storey])
		for k, name := range combos {
			a := c.act[k]
			if _, err := fmt.Fprintf(w, "%s,%s,%g,%g,%g,%g,%g\n", globalID("column/"+tag), name, a[0], a[1], a[2], a[3], a[4]); err != nil {
				return err
			}
		}
	}
	return nil
}

func boolean(b bool) string {
	if b {
		return ".T."
	}
	return ".F."
}

func refsSlice(ids []int) string { return refs(ids...) }

func sq(x float64) float64 { return x * x }

func round(x float64, digits int) float64 {
	p := math.Pow(10, float64(digits))
	return math.Round(x*p) / p
}

// WriteStoreysCSV writes the storey shear and drift of the wind combination
// in X (invented first-order analysis output) as a storey file, for the
// drift forms of the storey buckling load factor.
func WriteStoreysCSV(w io.Writer) error {
	_, err := io.WriteString(w, "storey,direction,combination,storey_shear_kN,storey_drift_mm,storey_height_mm\n"+
		storeys[0]+",X,"+combos[1]+",120,9,4500\n"+
		storeys[1]+",X,"+combos[1]+",60,6.5,3600\n")
	return err
}
