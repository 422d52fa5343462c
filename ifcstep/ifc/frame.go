package ifc

import (
	"errors"
	"math"
	"sort"
	"strconv"
	"strings"

	"swaygate/checks"
	fa "swaygate/checks/frame"
	"swaygate/ifcstep"
)

// Attribute positions (0-based) of the structural analysis entities the
// frame reader uses. They are the same in IFC2X3, IFC4 and IFC4X3
// (ifc-facts §3.1), except the IFC4 additions marked, which IFC2X3 lacks.
const (
	pSAMPredef      = 5 // IfcStructuralAnalysisModel.PredefinedType
	pSAMPlane       = 6 // .OrientationOf2DPlane
	pSAMShared      = 9 // .SharedPlacement (IFC4 and later)
	pConnCondition  = 7 // IfcStructuralPointConnection.AppliedCondition
	pConnCondSystem = 8 // .ConditionCoordinateSystem (IFC4 and later)
	pRelMember      = 4 // IfcRelConnectsStructuralMember.RelatingStructuralMember
	pRelConnection  = 5 // .RelatedStructuralConnection
	pRelCondition   = 6 // .AppliedCondition
	pRelCondSystem  = 9 // .ConditionCoordinateSystem
	pRelConstraint  = 10
	pEccX           = 2 // IfcConnectionPointEccentricity.EccentricityInX (then Y, Z)
	pNodeCondFirst  = 1 // IfcBoundaryNodeCondition: TranslationalStiffnessX (then Y, Z, RotationalStiffnessX, Y, Z)
	pMechShear      = 3 // IFC2X3 IfcMechanicalMaterialProperties.ShearModulus
	pMechPoisson    = 4 // .PoissonRatio
)

// Frame is the analytical frame of a model (its IfcStructuralAnalysisModel)
// in the terms of checks/frame, with the links back to the model: which
// analytical members idealise each checked member, and the axial forces of
// every analytical member under each combination with results.
type Frame struct {
	// Model holds the nodes and members in world coordinates (mm, N, MPa);
	// its Combinations are left empty: Axial gives the forces.
	Model *fa.Model
	// Name names the analysis model ("Name (#id)").
	Name string
	// Members describe each member of Model.
	Members []FrameMember
	// Columns maps each member of the checks.Model given to ExtractFrame
	// (by index) to the indices of the frame members that idealise it,
	// bottom (start) first; nil where the member is not in the frame.
	Columns [][]int
	// Combinations are the names of the result sets read (design
	// combinations, and load cases when Options.LoadCases), in model order.
	Combinations []string
	// Axial holds per combination name the axial compression of each frame
	// member from the model's results (N, compression positive, the largest
	// along the member); NaN where the member has no result for it.
	Axial map[string][]float64
	// Planes are groups of nodes that a surface member (a wall, a slab) ties
	// together: rigid in the surface's plane, free out of it.
	Planes [][]int
	// Notes record what the reader assumed; Problems what it could not use.
	Notes    []string
	Problems []checks.Reason
}

// FrameMember is the source of one frame member.
type FrameMember struct {
	Ref       string // the IfcStructuralCurveMember, e.g. "#228"
	GlobalID  string
	Name      string
	PinJoined bool   // PIN_JOINED_MEMBER
	Profile   string // profile name
	// Part and Parts: a curve member split at connections along it becomes
	// Parts frame members (1 when not split).
	Part, Parts int
}

// Label names the member in messages: its name and reference.
func (fm *FrameMember) Label() string {
	if fm.Name == "" {
		return fm.Ref
	}
	return fm.Name + " (" + fm.Ref + ")"
}

// ErrNoFrame is returned by ExtractFrame when the file has no analytical
// curve members.
var ErrNoFrame = errors.New("ifc: the model has no structural analysis model with curve members")

// ExtractFrame reads the analytical frame of f: the nodes
// (IfcStructuralPointConnection) with their supports, the curve members with
// their sections, moduli, end releases and eccentricities, the axial forces
// of every member from the analysis results (the result sets opt selects:
// design combinations, and load cases with opt.LoadCases), and the links
// from the members of m (as Extract returned them for f) to their analytical
// members. It never fails on the model's data: what cannot be used is
// reported in Problems; the error is ErrNoFrame, or for invalid arguments.
func ExtractFrame(f *ifcstep.File, m *checks.Model, opt Options) (*Frame, error) {
	if f == nil || m == nil {
		return nil, errors.New("ifc: no file or no model")
	}
	if f.Family == ifcstep.FamilyUnknown {
		return nil, errors.New("ifc: unknown schema family " + strconv.Quote(f.SchemaID))
	}
	x := newExtractor(f, opt)
	x.readUnits()
	x.lengthFactor = x.factor(qLength)
	x.angleFactor = x.units.toInt[qAngle]
	x.buildIndex(nil)
	x.readAnalysis()
	r := &frameReader{x: x, fr: &Frame{Model: &fa.Model{}, Axial: map[string][]float64{}}}
	if !r.selectModel() {
		return nil, ErrNoFrame
	}
	r.readNodes()
	r.readMembers()
	if len(r.fr.Model.Members) == 0 {
		return nil, ErrNoFrame
	}
	r.surfaces()
	r.prune()
	if len(r.fr.Model.Members) == 0 {
		return nil, ErrNoFrame
	}
	r.supportTorsion()
	r.readResults()
	r.mapColumns(m)
	return r.fr, nil
}

// frameReader is the state of one frame extraction.
type frameReader struct {
	x  *extractor
	fr *Frame

	model   ifcstep.Instance // the analysis model (zero when none)
	world   frame            // its shared placement
	members []ifcstep.Instance
	conns   []ifcstep.Instance
	inModel map[uint32]bool

	nodeOf   map[uint32]int     // point connection -> node index
	vertexOf map[uint32]int     // vertex point of a connection -> node index
	byPos    map[[3]int64][]int // rounded position -> nodes
	pieces   map[uint32][]int   // curve member -> frame members, start first
	amOf     map[uint32]*analyticalMember
	tol      float64 // mm: positions closer than this coincide
	nConns   int     // nodes read from point connections (the first ones)
	noteSeen map[string]bool
}

func (r *frameReader) note(msg string) {
	if r.noteSeen == nil {
		r.noteSeen = map[string]bool{}
	}
	if !r.noteSeen[msg] {
		r.noteSeen[msg] = true
		r.fr.Notes = append(r.fr.Notes, msg)
	}
}

func (r *frameReader) problem(code, msg, at string) {
	r.fr.Problems = append(r.fr.Problems, checks.Reason{Code: code, Message: msg, Ref: at})
}

// selectModel picks the analysis model (the one grouping the most curve
// members) and its members and connections; with no model, every curve
// member and point connection of the file.
func (r *frameReader) selectModel() bool {
	x := r.x
	f := x.f
	isMember := func(t string) bool { return t == "IFCSTRUCTURALCURVEMEMBER" || t == "IFCSTRUCTURALCURVEMEMBERVARYING" }
	models := f.ByType("IFCSTRUCTURALANALYSISMODEL")
	groups := map[uint32][]uint32{}
	if len(models) > 0 {
		isModel := map[uint32]bool{}
		for _, in := range models {
			isModel[in.ID()] = true
		}
		for _, rel := range f.ByType("IFCRELASSIGNSTOGROUP") {
			g, ok := rel.Attr(pAssignsTarget).Ref()
			if !ok || !isModel[g] {
				continue
			}
			forRefs(rel.Attr(pRelatedObjects), func(id uint32) { groups[g] = append(groups[g], id) })
		}
	}
	best, bestN := -1, -1
	for k, in := range models {
		n := 0
		for _, id := range groups[in.ID()] {
			if isMember(x.typeOf(id)) {
				n++
			}
		}
		if n > bestN {
			best, bestN = k, n
		}
	}
	r.inModel = map[uint32]bool{}
	r.world = identity
	if best >= 0 && bestN > 0 {
		r.model = models[best]
		for _, id := range groups[r.model.ID()] {
			r.inModel[id] = true
		}
		if len(models) > 1 {
			r.note("the file has " + itoa(len(models)) + " structural analysis models: " + r.modelName() + ", which groups the most curve members, is used")
		}
		if x.s.family != ifcstep.IFC2X3 {
			if pl, ok := x.deref(r.model, r.model.Attr(pSAMShared)); ok {
				if w, ok := x.placement(pl); ok {
					r.world = w
				}
			}
		}
	} else if len(models) > 0 {
		r.model = models[0]
	}
	all := len(r.inModel) == 0
	for _, t := range [...]string{"IFCSTRUCTURALCURVEMEMBER", "IFCSTRUCTURALCURVEMEMBERVARYING"} {
		for _, in := range f.ByType(t) {
			if all || r.inModel[in.ID()] {
				r.members = append(r.members, in)
			}
		}
	}
	for _, in := range f.ByType("IFCSTRUCTURALPOINTCONNECTION") {
		if all || r.inModel[in.ID()] {
			r.conns = append(r.conns, in)
		}
	}
	if all && len(r.members) > 0 {
		r.note("no structural analysis model groups the curve members: all " + itoa(len(r.members)) + " curve members of the file form the frame")
	}
	r.fr.Name = r.modelName()
	if r.model.ID() != 0 {
		if pt, ok := r.model.Attr(pSAMPredef).Enum(); ok {
			switch pt {
			case "IN_PLANE_LOADING_2D":
				r.readPlane()
			case "OUT_PLANE_LOADING_2D":
				r.note("the analysis model is a plane model loaded out of its plane (a grillage): it is analysed in 3D")
			}
		}
	}
	return len(r.members) > 0
}

func (r *frameReader) modelName() string {
	if r.model.ID() == 0 {
		return "analytical members"
	}
	name := strings.TrimSpace(text(r.model.Attr(pName)))
	if name == "" {
		return ref(r.model)
	}
	return name + " (" + ref(r.model) + ")"
}

// readPlane sets the plane of an IN_PLANE_LOADING_2D model.
func (r *frameReader) readPlane() {
	x := r.x
	in, ok := x.deref(r.model, r.model.Attr(pSAMPlane))
	if !ok {
		r.note("the analysis model is IN_PLANE_LOADING_2D but gives no OrientationOf2DPlane: it is analysed in 3D")
		return
	}
	pl, ok := x.readAxis2Placement(in)
	if !ok {
		r.problem("frame-plane-unreadable", "the OrientationOf2DPlane "+ref(in)+" of the analysis model cannot be read: analysed in 3D", ref(in))
		return
	}
	z, xd := r.world.dir(pl.z), r.world.dir(pl.x)
	r.fr.Model.Plane = &fa.Axes{Z: fa.Vec3(z), X: fa.Vec3(xd)}
	r.note("the analysis model is a plane frame (IN_PLANE_LOADING_2D): it is analysed in the X–Y plane of its OrientationOf2DPlane, 3 degrees of freedom per node")
}

// vertexOfConnection reads a point connection's vertex: its IfcVertexPoint
// id and position in the connection's placement.
func (r *frameReader) vertexOfConnection(in ifcstep.Instance) (uint32, vec, bool) {
	x := r.x
	pds, ok := x.deref(in, in.Attr(pRepresentation))
	if !ok {
		return 0, vec{}, false
	}
	reps, _ := pds.Attr(pReps).List()
	for _, rv := range reps {
		rep, ok := x.deref(pds, rv)
		if !ok {
			continue
		}
		items, _ := rep.Attr(pRepItems).List()
		for _, iv := range items {
			it, ok := x.deref(rep, iv)
			if !ok {
				continue
			}
			switch it.Type() {
			case "IFCVERTEXPOINT":
				pt, ok := x.deref(it, it.Attr(pVertexPoint))
				if !ok {
					continue
				}
				if p, ok := x.readPoint(pt); ok {
					return it.ID(), p, true
				}
			case "IFCCARTESIANPOINT":
				if p, ok := x.readPoint(it); ok {
					return 0, p, true
				}
			}
		}
	}
	return 0, vec{}, false
}

// placementOf returns the world frame of an item of the model: its
// ObjectPlacement, else the model's shared placement.
func (r *frameReader) placementOf(in ifcstep.Instance) (frame, bool) {
	if pl, ok := r.x.deref(in, in.Attr(pPlacement)); ok {
		return r.x.placement(pl)
	}
	return r.world, true
}

func posKey(p vec, tol float64) [3]int64 {
	return [3]int64{int64(math.Round(p[0] / tol)), int64(math.Round(p[1] / tol)), int64(math.Round(p[2] / tol))}
}

// findNode returns a node within r.tol of p.
func (r *frameReader) findNode(p vec) (int, bool) {
	k := posKey(p, r.tol)
	for dx := int64(-1); dx <= 1; dx++ {
		for dy := int64(-1); dy <= 1; dy++ {
			for dz := int64(-1); dz <= 1; dz++ {
				for _, n := range r.byPos[[3]int64{k[0] + dx, k[1] + dy, k[2] + dz}] {
					if vec(r.fr.Model.Nodes[n].Pos).approx(p, r.tol) {
						return n, true
					}
				}
			}
		}
	}
	return 0, false
}

func (r *frameReader) addNode(id string, p vec, s *fa.Support) int {
	n := len(r.fr.Model.Nodes)
	r.fr.Model.Nodes = append(r.fr.Model.Nodes, fa.Node{ID: id, Pos: fa.Vec3(p), Support: s})
	k := posKey(p, r.tol)
	r.byPos[k] = append(r.byPos[k], n)
	return n
}

// readNodes reads the point connections: positions and supports.
func (r *frameReader) readNodes() {
	x := r.x
	r.nodeOf = map[uint32]int{}
	r.vertexOf = map[uint32]int{}
	r.byPos = map[[3]int64][]int{}
	type raw struct {
		in     ifcstep.Instance
		vertex uint32
		p      vec
	}
	var nodes []raw
	lo, hi := vec{math.Inf(1), math.Inf(1), math.Inf(1)}, vec{math.Inf(-1), math.Inf(-1), math.Inf(-1)}
	grow := func(p vec) {
		for k := 0; k < 3; k++ {
			lo[k], hi[k] = math.Min(lo[k], p[k]), math.Max(hi[k], p[k])
		}
	}
	for _, in := range r.conns {
		v, p, ok := r.vertexOfConnection(in)
		if !ok {
			r.problem("frame-node-unreadable", "point connection "+ref(in)+" has no readable vertex: not used", ref(in))
			continue
		}
		w, ok := r.placementOf(in)
		if !ok {
			r.problem("frame-node-unreadable", "the placement of point connection "+ref(in)+" cannot be read: not used", ref(in))
			continue
		}
		p = w.point(p)
		grow(p)
		nodes = append(nodes, raw{in, v, p})
	}
	r.amOf = map[uint32]*analyticalMember{}
	for _, in := range r.members {
		am := x.analyticalMember(in.ID())
		r.amOf[in.ID()] = am
		if am.ok {
			grow(am.wStart)
			grow(am.wEnd)
		}
	}
	size := hi.sub(lo).norm()
	if math.IsInf(size, 0) || math.IsNaN(size) {
		size = 0
	}
	r.tol = math.Max(1, 1e-6*size)
	defer func() { r.nConns = len(r.fr.Model.Nodes) }()
	for _, nd := range nodes {
		if n, dup := r.findNode(nd.p); dup {
			r.nodeOf[nd.in.ID()] = n
			if nd.vertex != 0 {
				r.vertexOf[nd.vertex] = n
			}
			r.note("point connections at the same position are one node")
			if s := r.support(nd.in); s != nil && r.fr.Model.Nodes[n].Support == nil {
				r.fr.Model.Nodes[n].Support = s
			}
			continue
		}
		n := r.addNode(ref(nd.in), nd.p, r.support(nd.in))
		r.nodeOf[nd.in.ID()] = n
		if nd.vertex != 0 {
			r.vertexOf[nd.vertex] = n
		}
	}
}

// support reads a point connection's AppliedCondition as a support (nil:
// none).
func (r *frameReader) support(in ifcstep.Instance) *fa.Support {
	x := r.x
	cond, ok := x.deref(in, in.Attr(pConnCondition))
	if !ok {
		return nil
	}
	if !strings.HasPrefix(cond.Type(), "IFCBOUNDARYNODECONDITION") {
		r.problem("frame-support-ignored", "the applied condition "+ref(cond)+" of point connection "+ref(in)+" is "+
			entityName(cond.Type())+", not a boundary node condition: no support", ref(cond))
		return nil
	}
	fixed, stiff, any := r.nodeCondition(cond)
	if !any {
		return nil
	}
	s := &fa.Support{Fixed: fixed, Stiffness: stiff}
	if x.s.family != ifcstep.IFC2X3 {
		if cs, ok := x.deref(in, in.Attr(pConnCondSystem)); ok {
			if f, ok := x.readAxis2Placement(cs); ok {
				w, _ := r.placementOf(in)
				s.Axes = &fa.Axes{Z: fa.Vec3(w.dir(f.z)), X: fa.Vec3(w.dir(f.x))}
			} else {
				r.problem("frame-support-axes", "the condition coordinate system "+ref(cs)+" of "+ref(in)+" cannot be read: global axes used", ref(cs))
			}
		}
	}
	return s
}

// nodeCondition reads the six components of an IfcBoundaryNodeCondition:
// IFC4 IfcBoolean TRUE (rigid), FALSE (free) or a stiffness measure; IFC2X3
// numbers, where -1 means rigid and 0 free. Stiffnesses are converted to
// N/mm and N·mm/rad from the project's force, length, torque and angle
// units. any is false when every component is free.
func (r *frameReader) nodeCondition(cond ifcstep.Instance) (fixed [6]bool, stiff [6]float64, any bool) {
	x := r.x
	linear := x.factor(qForce) / x.lengthFactor
	rotational := x.factor(qTorque) / x.angleFactor
	for d := 0; d < 6; d++ {
		v := cond.Attr(pNodeCondFirst + d)
		if v.IsUnset() {
			continue
		}
		if b, ok := v.Bool(); ok {
			fixed[d] = b
			any = any || b
			continue
		}
		k, ok := v.Real()
		if !ok || math.IsNaN(k) {
			continue
		}
		switch {
		case k < 0 && math.Abs(k+1) < 1e-9:
			fixed[d] = true // IFC2X3: -1 is infinitely stiff
			any = true
		case k > 0 && !math.IsInf(k, 0):
			if d < 3 {
				stiff[d] = k * linear
			} else {
				stiff[d] = k * rotational
			}
			any = true
		case math.IsInf(k, 1):
			fixed[d] = true
			any = true
		}
	}
	return fixed, stiff, any
}

// memberConn is one connection of a curve member to a node.
type memberConn struct {
	rel    ifcstep.Instance
	node   int
	t      float64 // position along the member from its start, mm
	end    int     // 0 start, 1 end, -1 interior
	offset vec     // node to member end (rigid eccentricity), world mm
}

// readMembers reads the curve members, their connections and sections.
func (r *frameReader) readMembers() {
	x := r.x
	f := x.f
	conns := map[uint32][]ifcstep.Instance{}
	inSet := make(map[uint32]bool, len(r.members))
	for _, in := range r.members {
		inSet[in.ID()] = true
	}
	for _, t := range [...]string{"IFCRELCONNECTSSTRUCTURALMEMBER", "IFCRELCONNECTSWITHECCENTRICITY"} {
		for _, rel := range f.ByType(t) {
			m, ok := rel.Attr(pRelMember).Ref()
			if !ok || !inSet[m] {
				continue
			}
			conns[m] = append(conns[m], rel)
		}
	}
	// The physical elements linked to the curve members: a member without a
	// section of its own takes its element's.
	element := map[uint32]uint32{}
	link := func(mem, el uint32) {
		if inSet[mem] && !inSet[el] {
			if _, dup := element[mem]; !dup {
				element[mem] = el
			}
		}
	}
	for _, rel := range f.ByType("IFCRELASSIGNSTOPRODUCT") {
		target, ok := rel.Attr(pAssignsTarget).Ref()
		if !ok {
			continue
		}
		forRefs(rel.Attr(pRelatedObjects), func(id uint32) {
			link(id, target)
			link(target, id)
		})
	}
	for _, rel := range f.ByType("IFCRELCONNECTSSTRUCTURALELEMENT") {
		el, ok1 := rel.Attr(pRelating).Ref()
		mem, ok2 := rel.Attr(pRelated).Ref()
		if ok1 && ok2 {
			link(mem, el)
		}
	}
	linked := make(map[uint32]bool, len(element))
	for _, el := range element {
		linked[el] = true
	}
	material := map[uint32]uint32{}
	for _, rel := range f.ByType("IFCRELASSOCIATESMATERIAL") {
		mat, ok := rel.Attr(pRelatingDef).Ref()
		if !ok {
			continue
		}
		forRefs(rel.Attr(pRelatedObjects), func(id uint32) {
			if inSet[id] || linked[id] {
				if _, dup := material[id]; !dup {
					material[id] = mat
				}
			}
		})
	}
	fromElement := 0
	r.pieces = map[uint32][]int{}
	var noJ, noAxis, defaultE int
	for _, in := range r.members {
		am := r.amOf[in.ID()]
		if !am.ok {
			r.problem("frame-member-unreadable", am.why+": left out of the frame", ref(in))
			continue
		}
		mem, why := r.section(in, material[in.ID()])
		if el, ok := element[in.ID()]; ok && why != "" && material[el] != 0 {
			if m2, why2 := r.section(in, material[el]); why2 == "" {
				mem, why = m2, ""
				fromElement++
			}
		}
		if why != "" {
			r.problem("frame-member-section", "analytical member "+ref(in)+": "+why+": left out of the frame", ref(in))
			continue
		}
		if mem.noJ {
			noJ++
		}
		if mem.defaultE {
			defaultE++
		}
		// Local axes: x along the member, y' along the major principal axis.
		var axis vec
		if am.hasAxes {
			major := am.wy.scale(math.Cos(mem.angle)).add(am.wz.scale(math.Sin(mem.angle)))
			axis = am.wx.cross(major)
		} else {
			noAxis++
		}
		cs := r.connections(in, am, conns[in.ID()])
		cs = r.nodesOnMember(am, cs)
		pin := false
		if pt, ok := in.Attr(pMemberPredef).Enum(); ok && pt == "PIN_JOINED_MEMBER" {
			pin = true
		}
		fm := FrameMember{Ref: ref(in), GlobalID: strings.TrimSpace(text(in.Attr(pGlobalID))), Name: text(in.Attr(pName)),
			PinJoined: pin, Profile: mem.profile}
		// Split at interior connections.
		var inner []memberConn
		var ends [2]*memberConn
		for k := range cs {
			switch cs[k].end {
			case -1:
				inner = append(inner, cs[k])
			default:
				if ends[cs[k].end] == nil {
					ends[cs[k].end] = &cs[k]
				}
			}
		}
		for e := 0; e < 2; e++ {
			if ends[e] != nil {
				continue
			}
			p := am.wStart
			if e == 1 {
				p = am.wEnd
			}
			n, ok := r.findNode(p)
			if !ok {
				n = r.addNode(ref(in)+"/"+[]string{"start", "end"}[e], p, nil)
			}
			ends[e] = &memberConn{node: n, end: e, t: am.length * float64(e)}
		}
		sort.Slice(inner, func(i, j int) bool { return inner[i].t < inner[j].t })
		stops := make([]*memberConn, 0, len(inner)+2)
		stops = append(stops, ends[0])
		for k := range inner {
			if inner[k].node != stops[len(stops)-1].node && inner[k].node != ends[1].node {
				stops = append(stops, &inner[k])
			}
		}
		stops = append(stops, ends[1])
		fm.Parts = len(stops) - 1
		if fm.Parts > 1 {
			r.note("curve members connected to nodes along their length are split there")
		}
		for k := 0; k+1 < len(stops); k++ {
			a, b := stops[k], stops[k+1]
			fmk := fm
			fmk.Part = k + 1
			mb := fa.Member{
				ID:    fm.Ref,
				Nodes: [2]int{a.node, b.node},
				E:     mem.e, G: mem.g, A: mem.a, Iy: mem.iy, Iz: mem.iz, J: mem.j,
				Axis: fa.Vec3(axis),
			}
			if fm.Name != "" {
				mb.ID = fm.Name + " (" + fm.Ref + ")"
			}
			if fm.Parts > 1 {
				mb.ID += " part " + itoa(k+1)
			}
			if k == 0 {
				mb.Ends[0] = r.endCondition(a, am, axis, in)
			}
			if k+1 == len(stops)-1 {
				mb.Ends[1] = r.endCondition(b, am, axis, in)
			}
			if pin {
				mb.Ends[0].Released[4], mb.Ends[0].Released[5] = true, true
				mb.Ends[1].Released[4], mb.Ends[1].Released[5] = true, true
				mb.Ends[0].Stiffness[4], mb.Ends[0].Stiffness[5] = 0, 0
				mb.Ends[1].Stiffness[4], mb.Ends[1].Stiffness[5] = 0, 0
			}
			r.pieces[in.ID()] = append(r.pieces[in.ID()], len(r.fr.Model.Members))
			r.fr.Model.Members = append(r.fr.Model.Members, mb)
			r.fr.Members = append(r.fr.Members, fmk)
		}
	}
	if fromElement > 0 {
		r.note(itoa(fromElement) + " analytical member(s) without a section of their own take the section and material of the physical element linked to them")
	}
	if noJ > 0 {
		r.note(itoa(noJ) + " member(s) have no torsion constant J (an outline profile): J is taken as 1 % of Iy + Iz, which only keeps their twist stable")
	}
	if noAxis > 0 {
		r.note(itoa(noAxis) + " member(s) have no usable Axis: their major axis is taken about the default local y (global Z made normal to the member, global X for a vertical one)")
	}
	if defaultE > 0 {
		r.note(itoa(defaultE) + " member(s) have no elastic modulus in the model: E = 200 000 MPa and G = 80 000 MPa (steel) are assumed")
	}
}

// Plausible elastic moduli of structural materials (MPa): timber, masonry
// and concrete from about 5 000, steel 200 000.
const plausibleEMin, plausibleEMax = 1e3, 1e6

// memberSection is the stiffness data of a member.
type memberSection struct {
	e, g, a, iy, iz, j float64
	angle              float64 // member local y to the major principal axis, rad
	profile            string
	noJ, defaultE      bool
}

// section reads a member's section (material profile set, or the profile's
// Pset_ProfileMechanical) and moduli.
func (r *frameReader) section(in ifcstep.Instance, matID uint32) (memberSection, string) {
	x := r.x
	var ms memberSection
	if matID == 0 {
		return ms, "no material association (no section)"
	}
	mi := x.material(matID)
	switch {
	case len(mi.profiles) == 0:
		return ms, "no material profile set (no section)"
	case len(mi.profiles) > 1:
		return ms, "a material profile set of " + itoa(len(mi.profiles)) + " profiles (a composite section)"
	}
	p, ok := x.f.Get(mi.profiles[0])
	if !ok {
		return ms, "missing profile " + refID(mi.profiles[0])
	}
	pi := x.profile(p)
	if pi.props == nil {
		return ms, pi.msg
	}
	pr := pi.props
	ms.a, ms.iy, ms.iz, ms.j = pr.A, pr.IMajor, pr.IMinor, pr.J
	ms.angle = pi.rot + pr.Angle
	ms.profile = pi.name
	if !(ms.j > 0) {
		ms.j = 0.01 * (ms.iy + ms.iz)
		ms.noJ = true
	}
	ms.e, ms.g = r.moduli(matID)
	if ms.e > 0 && (ms.e < plausibleEMin || ms.e > plausibleEMax) {
		r.note("elastic moduli outside " + ftoa(plausibleEMin) + " to " + ftoa(plausibleEMax) + " MPa are not plausible for a structural material (a unit slip): ignored")
		ms.e = 0
	}
	if !(ms.g > 0 && ms.g < ms.e) {
		ms.g = ms.e / 2.6
	}
	if !(ms.e > 0) {
		ms.e, ms.g, ms.defaultE = 200e3, 80e3, true
	}
	if !(ms.a > 0 && ms.iy > 0 && ms.iz > 0) {
		return ms, "incomplete section properties of profile " + ref(p)
	}
	return ms, ""
}

// moduli reads E and G of the first material of an association (any
// material: the frame includes concrete and timber members too). G comes
// from ShearModulus, else E/(2(1 + PoissonRatio)), else E/2.6.
func (r *frameReader) moduli(matID uint32) (e, g float64) {
	x := r.x
	mat := r.firstMaterial(matID, 0)
	if mat.ID() == 0 {
		return 0, 0
	}
	e = x.materialProps(mat).e
	nu := math.NaN()
	for _, pid := range x.idx.matProps[mat.ID()] {
		in, ok := x.f.Get(pid)
		if !ok {
			continue
		}
		switch in.Type() {
		case "IFCMATERIALPROPERTIES", "IFCEXTENDEDMATERIALPROPERTIES":
			at := pMatPropsProps
			if in.Type() == "IFCEXTENDEDMATERIALPROPERTIES" {
				at = pExtMatProps
			}
			props := x.properties(in, at)
			if v, ok := props.number(x, "ShearModulus", qModulus); ok && v > 0 && g == 0 {
				g = v
			}
			if v, ok := props.number(x, "PoissonRatio", qNone); ok && v >= 0 && v < 0.5 {
				nu = v
			}
		case "IFCMECHANICALSTEELMATERIALPROPERTIES", "IFCMECHANICALMATERIALPROPERTIES", "IFCMECHANICALCONCRETEMATERIALPROPERTIES":
			if v, ok := x.measure(in.Attr(pMechShear), qModulus, in, ifcstep.Value{}); ok && v > 0 && g == 0 {
				g = v
			}
			if v, ok := in.Attr(pMechPoisson).Real(); ok && v >= 0 && v < 0.5 {
				nu = v
			}
		}
	}
	if g == 0 && e > 0 {
		if math.IsNaN(nu) {
			nu = 0.3
		}
		g = e / (2 * (1 + nu))
	}
	return e, g
}

// firstMaterial follows a material association to its first IfcMaterial.
func (r *frameReader) firstMaterial(id uint32, depth int) ifcstep.Instance {
	x := r.x
	in, ok := x.f.Get(id)
	if !ok || depth > 4 {
		return ifcstep.Instance{}
	}
	next := func(v ifcstep.Value) ifcstep.Instance {
		if d, ok := v.Ref(); ok {
			return r.firstMaterial(d, depth+1)
		}
		if list, err := v.List(); err == nil {
			for _, e := range list {
				if d, ok := e.Ref(); ok {
					if m := r.firstMaterial(d, depth+1); m.ID() != 0 {
						return m
					}
				}
			}
		}
		return ifcstep.Instance{}
	}
	switch in.Type() {
	case "IFCMATERIAL":
		return in
	case "IFCMATERIALPROFILESETUSAGE", "IFCMATERIALPROFILESETUSAGETAPERING":
		return next(in.Attr(pMatProfileSet))
	case "IFCMATERIALPROFILESET":
		return next(in.Attr(pMatProfiles))
	case "IFCMATERIALPROFILE":
		return next(in.Attr(pMatProfMaterial))
	case "IFCMATERIALLIST":
		return next(in.Attr(pMatListMats))
	}
	return ifcstep.Instance{}
}

// connections reads a member's connections to nodes: which end, or where
// along it, and the rigid eccentricity.
func (r *frameReader) connections(in ifcstep.Instance, am *analyticalMember, rels []ifcstep.Instance) []memberConn {
	x := r.x
	var out []memberConn
	for _, rel := range rels {
		cid, ok := rel.Attr(pRelConnection).Ref()
		if !ok {
			continue
		}
		n, ok := r.nodeOf[cid]
		if !ok {
			if t := x.typeOf(cid); t != "" && t != "IFCSTRUCTURALPOINTCONNECTION" {
				r.note("connections other than point connections (" + entityName(t) + ") are not part of the frame")
			}
			continue
		}
		p := vec(r.fr.Model.Nodes[n].Pos)
		c := memberConn{rel: rel, node: n}
		d0, d1 := p.sub(am.wStart).norm(), p.sub(am.wEnd).norm()
		c.t = p.sub(am.wStart).dot(am.wx)
		perp := p.sub(am.wStart.add(am.wx.scale(c.t))).norm()
		switch {
		case d0 <= r.tol:
			c.end, c.t = 0, 0
			c.offset = r.eccentricity(rel, am)
		case d1 <= r.tol:
			c.end, c.t = 1, am.length
			c.offset = r.eccentricity(rel, am)
		case perp <= r.tol && c.t > r.tol && c.t < am.length-r.tol && rel.Type() != "IFCRELCONNECTSWITHECCENTRICITY":
			c.end = -1
		default:
			// An eccentric connection: the nearer end, offset from the node.
			c.end = 0
			end := am.wStart
			if d1 < d0 {
				c.end, c.t, end = 1, am.length, am.wEnd
			}
			c.offset = end.sub(p)
			r.note("members whose ends lie off their nodes (IfcRelConnectsWithEccentricity, or vertices apart) are joined to the node by a rigid link from the node to the member end")
		}
		out = append(out, c)
	}
	return out
}

// nodesOnMember adds the point connections that lie on a member between its
// ends without being connected to it (a secondary beam framing into a
// girder that is not split there): the member is split at them.
func (r *frameReader) nodesOnMember(am *analyticalMember, cs []memberConn) []memberConn {
	nodes := r.fr.Model.Nodes
	lo, hi := am.wStart, am.wStart
	for k := 0; k < 3; k++ {
		lo[k], hi[k] = math.Min(am.wStart[k], am.wEnd[k])-r.tol, math.Max(am.wStart[k], am.wEnd[k])+r.tol
	}
	added := false
	for n := 0; n < r.nConns; n++ {
		p := vec(nodes[n].Pos)
		if p[0] < lo[0] || p[0] > hi[0] || p[1] < lo[1] || p[1] > hi[1] || p[2] < lo[2] || p[2] > hi[2] {
			continue
		}
		t := p.sub(am.wStart).dot(am.wx)
		if t <= r.tol || t >= am.length-r.tol || p.sub(am.wStart.add(am.wx.scale(t))).norm() > r.tol {
			continue
		}
		known := false
		for k := range cs {
			if cs[k].node == n {
				known = true
				break
			}
		}
		if !known {
			cs = append(cs, memberConn{node: n, t: t, end: -1})
			added = true
		}
	}
	if added {
		r.note("members are split at point connections that lie on them without a connection relationship (the member is taken as connected there)")
	}
	return cs
}

// eccentricity returns the rigid offset from the node to the member end
// that an IfcConnectionPointEccentricity gives where the member's vertex
// lies on the node: its EccentricityInX/Y/Z, in the member's local axes,
// run from the member end to the connection, so the offset is minus them.
func (r *frameReader) eccentricity(rel ifcstep.Instance, am *analyticalMember) vec {
	x := r.x
	if rel.Type() != "IFCRELCONNECTSWITHECCENTRICITY" || !am.hasAxes {
		return vec{}
	}
	cp, ok := x.deref(rel, rel.Attr(pRelConstraint))
	if !ok || cp.Type() != "IFCCONNECTIONPOINTECCENTRICITY" {
		return vec{}
	}
	var e vec
	for k := 0; k < 3; k++ {
		if v, ok := cp.Attr(pEccX + k).Real(); ok {
			e[k] = v * x.lengthFactor
		}
	}
	if e.norm() <= r.tol {
		return vec{}
	}
	r.note("eccentricities given where a member's vertex lies on its node (EccentricityInX/Y/Z, member local axes, from the member end to the node) become rigid links")
	return am.wx.scale(-e[0]).add(am.wy.scale(-e[1])).add(am.wz.scale(-e[2]))
}

// endCondition reads the release of a member end from its connection's
// AppliedCondition (in the member's local axes, or in the relation's
// ConditionCoordinateSystem), mapped onto the frame member's local axes
// (x along the member, z along axis; zero axis: checks/frame's default).
func (r *frameReader) endCondition(c *memberConn, am *analyticalMember, axis vec, member ifcstep.Instance) fa.EndCondition {
	x := r.x
	ec := fa.EndCondition{Offset: fa.Vec3(c.offset)}
	if c.rel.ID() == 0 {
		return ec
	}
	cond, ok := x.deref(c.rel, c.rel.Attr(pRelCondition))
	if !ok {
		return ec
	}
	if !strings.HasPrefix(cond.Type(), "IFCBOUNDARYNODECONDITION") {
		r.problem("frame-release-ignored", "the applied condition "+ref(cond)+" of "+ref(c.rel)+" is "+entityName(cond.Type())+
			", not a boundary node condition: the member end is taken as rigidly connected", ref(cond))
		return ec
	}
	fixed, stiff, _ := r.nodeCondition(cond)
	// The axes the components refer to.
	src := [3]vec{am.wx, am.wy, am.wz}
	if !am.hasAxes {
		_, y, z, _ := frameAxes(am.wx, vec{})
		src = [3]vec{am.wx, y, z}
	}
	if cs, ok := x.deref(c.rel, c.rel.Attr(pRelCondSystem)); ok {
		if f, ok := x.readAxis2Placement(cs); ok {
			w, _ := r.placementOf(member)
			src = [3]vec{w.dir(f.x), w.dir(f.y), w.dir(f.z)}
		}
	}
	_, ly, lz, _ := frameAxes(am.wx, axis)
	dst := [3]vec{am.wx, ly, lz}
	for d := 0; d < 6; d++ {
		if fixed[d] {
			continue
		}
		// A component that is not rigid is released (with its spring).
		k := d % 3
		best, bd := 0, -1.0
		for j := 0; j < 3; j++ {
			if v := math.Abs(src[k].dot(dst[j])); v > bd {
				best, bd = j, v
			}
		}
		if bd < 0.99 {
			r.note("releases given in axes that are not the member's principal axes are applied to the nearest principal axis")
		}
		t := best + 3*(d/3)
		if t == 3 {
			// Torsion stays connected: a twist release leaves members free to
			// spin wherever nothing else holds the twist, and does not change
			// flexural buckling.
			r.note("torsion releases of member ends are not applied (the twist stays connected): they do not change flexural buckling and would leave members free to spin")
			continue
		}
		ec.Released[t] = true
		ec.Stiffness[t] = stiff[d]
	}
	return ec
}

// frameAxes returns checks/frame's local axes for a member along ex with
// local z along axis (zero axis: the package default).
func frameAxes(ex, axis vec) (vec, vec, vec, bool) {
	z := axis
	if z.norm() < 1e-12 {
		z = vec{0, 0, 1}
		if math.Abs(ex[2]) > 1-1e-6 {
			z = vec{1, 0, 0}
		}
	}
	z, ok := z.sub(ex.scale(z.dot(ex))).unit()
	if !ok {
		return vec{}, vec{}, vec{}, false
	}
	return ex, z.cross(ex), z, true
}

// readResults reads the axial force of every frame member from the result
// sets that are used.
func (r *frameReader) readResults() {
	x := r.x
	inSet := make(map[uint32]bool, len(r.pieces))
	for id := range r.pieces {
		inSet[id] = true
	}
	x.idx.reactions = map[uint32][]uint32{}
	x.idx.resultGroup = map[uint32]uint32{}
	reactions := map[uint32]bool{}
	for _, rel := range x.f.ByType("IFCRELCONNECTSSTRUCTURALACTIVITY") {
		m, ok := rel.Attr(pRelating).Ref()
		if !ok || !inSet[m] {
			continue
		}
		rid, ok := rel.Attr(pRelated).Ref()
		if !ok || x.typeOf(rid) != "IFCSTRUCTURALCURVEREACTION" {
			continue
		}
		x.idx.reactions[m] = append(x.idx.reactions[m], rid)
		reactions[rid] = true
	}
	if len(reactions) > 0 {
		for _, rel := range x.f.ByType("IFCRELASSIGNSTOGROUP") {
			g, ok := rel.Attr(pAssignsTarget).Ref()
			if !ok || x.typeOf(g) != "IFCSTRUCTURALRESULTGROUP" {
				continue
			}
			forRefs(rel.Attr(pRelatedObjects), func(id uint32) {
				if reactions[id] {
					if _, dup := x.idx.resultGroup[id]; !dup {
						x.idx.resultGroup[id] = g
					}
				}
			})
		}
	}
	var sets []*resultSet
	for _, rs := range x.results {
		if rs.use {
			sets = append(sets, rs)
		}
	}
	sort.Slice(sets, func(i, j int) bool { return sets[i].group.id < sets[j].group.id })
	nm := len(r.fr.Model.Members)
	for _, rs := range sets {
		r.fr.Combinations = append(r.fr.Combinations, rs.name)
		ax := make([]float64, nm)
		for i := range ax {
			ax[i] = math.NaN()
		}
		r.fr.Axial[rs.name] = ax
	}
	if len(sets) == 0 {
		return
	}
	var ambiguous int
	for _, in := range r.members {
		ps := r.pieces[in.ID()]
		if len(ps) == 0 {
			continue
		}
		am := r.amOf[in.ID()]
		for _, mr := range x.memberResults(am) {
			n, amb, ok := axialForce(mr, am, x.opt.Convention)
			if !ok {
				continue
			}
			if amb {
				ambiguous++
			}
			ax := r.fr.Axial[mr.set.name]
			for _, j := range ps {
				ax[j] = n
			}
		}
	}
	if ambiguous > 0 {
		r.note(itoa(ambiguous) + " member result(s) do not tell section forces from end forces: the larger compression of the two readings is used")
	}
}

// axialForce returns the largest compression along a member (N) from one
// result: stations in global coordinates are resolved onto the member (or
// read as local when only that balances, as the member extraction does),
// and the sign convention is detected from the axial pattern unless
// declared.
func axialForce(mr memberResult, am *analyticalMember, conv SignConvention) (n float64, ambiguous, ok bool) {
	st := mr.stations
	if len(st) == 0 {
		return 0, false, false
	}
	if mr.global {
		local := len(st) == 2 && am.hasAxes &&
			!balanced(st[0], st[1], am.x, am.length) && balanced(st[0], st[1], vec{1, 0, 0}, am.length)
		if !local {
			if !am.hasAxes && math.Abs(am.x[0]) < 1-1e-9 {
				// Only the axial component is needed: project on the axis.
				out := make([]station, len(st))
				for i, s := range st {
					out[i] = station{x: s.x, f: vec{s.f.dot(am.x), 0, 0}}
				}
				st = out
			} else {
				st = toLocal(st, am)
			}
		}
	}
	if conv == ConventionAuto {
		switch {
		case len(st) > 2:
			conv = ConventionSectionForces
		case len(st) == 2:
			if c, decided := detectConvention(st[0].f[0], st[1].f[0]); decided {
				conv = c
			}
		}
	}
	largest := func(c SignConvention) float64 {
		v := math.Inf(-1)
		for _, s := range toSectionForces(st, c) {
			v = math.Max(v, -s.n)
		}
		return v
	}
	if conv == ConventionAuto {
		return math.Max(largest(ConventionSectionForces), largest(ConventionEndForces)), true, true
	}
	return largest(conv), false, true
}

// mapColumns links each checked member to its frame members: an analytical
// member taken as the member itself, else the curve members linked to the
// physical element (IfcRelAssignsToProduct in either direction, IFC2X3
// IfcRelConnectsStructuralElement).
func (r *frameReader) mapColumns(m *checks.Model) {
	x := r.x
	links := map[uint32][]uint32{}
	add := func(el, mem uint32) {
		if len(r.pieces[mem]) == 0 {
			return
		}
		for _, l := range links[el] {
			if l == mem {
				return
			}
		}
		links[el] = append(links[el], mem)
	}
	for _, rel := range x.f.ByType("IFCRELASSIGNSTOPRODUCT") {
		target, ok := rel.Attr(pAssignsTarget).Ref()
		if !ok {
			continue
		}
		_, targetIsMember := r.pieces[target]
		forRefs(rel.Attr(pRelatedObjects), func(id uint32) {
			if _, ok := r.pieces[id]; ok {
				add(target, id)
			} else if targetIsMember {
				add(id, target)
			}
		})
	}
	for _, rel := range x.f.ByType("IFCRELCONNECTSSTRUCTURALELEMENT") {
		el, ok1 := rel.Attr(pRelating).Ref()
		mem, ok2 := rel.Attr(pRelated).Ref()
		if ok1 && ok2 {
			add(el, mem)
		}
	}
	r.fr.Columns = make([][]int, len(m.Members))
	for i := range m.Members {
		id, ok := parseRef(m.Members[i].Ref)
		if !ok {
			continue
		}
		var list []int
		if ps, own := r.pieces[id]; own {
			list = append(list, ps...)
		} else {
			for _, mem := range links[id] {
				list = append(list, r.pieces[mem]...)
			}
		}
		if len(list) == 0 {
			continue
		}
		// Bottom first: by the elevation of each piece's lower end.
		nodes := r.fr.Model.Nodes
		low := func(j int) float64 {
			mb := &r.fr.Model.Members[j]
			return math.Min(nodes[mb.Nodes[0]].Pos[2], nodes[mb.Nodes[1]].Pos[2])
		}
		sort.SliceStable(list, func(a, b int) bool { return low(list[a]) < low(list[b]) })
		r.fr.Columns[i] = list
	}
}

// parseRef reads "#123".
func parseRef(s string) (uint32, bool) {
	if len(s) < 2 || s[0] != '#' {
		return 0, false
	}
	v, err := strconv.ParseUint(s[1:], 10, 32)
	return uint32(v), err == nil && v > 0
}

// surfaces records the nodes of each surface member (walls, slabs:
// IfcStructuralSurfaceMember), which the frame does not model as such: a
// surface is taken as rigid in its plane (a diaphragm or a shear wall) and
// flexible out of it (Frame.Planes).
func (r *frameReader) surfaces() {
	x := r.x
	nodesOf := map[uint32][]int{}
	for _, t := range [...]string{"IFCRELCONNECTSSTRUCTURALMEMBER", "IFCRELCONNECTSWITHECCENTRICITY"} {
		for _, rel := range x.f.ByType(t) {
			sid, ok := rel.Attr(pRelMember).Ref()
			if !ok || !strings.HasPrefix(x.typeOf(sid), "IFCSTRUCTURALSURFACEMEMBER") {
				continue
			}
			if len(r.inModel) > 0 && !r.inModel[sid] {
				continue
			}
			cid, ok := rel.Attr(pRelConnection).Ref()
			if !ok {
				continue
			}
			if n, ok := r.nodeOf[cid]; ok {
				nodesOf[sid] = append(nodesOf[sid], n)
			}
		}
	}
	if len(nodesOf) == 0 {
		return
	}
	ids := make([]uint32, 0, len(nodesOf))
	for id := range nodesOf {
		ids = append(ids, id)
	}
	sort.Slice(ids, func(i, j int) bool { return ids[i] < ids[j] })
	skipped := 0
	for _, id := range ids {
		ns := nodesOf[id]
		if _, ok := planeNormal(r.fr.Model.Nodes, ns, r.tol); !ok {
			skipped++
			continue
		}
		r.fr.Planes = append(r.fr.Planes, ns)
	}
	r.note("surface members (walls, slabs) are not part of the frame: each of the " + itoa(len(r.fr.Planes)) +
		" is taken as rigid in its plane and flexible out of it (its nodes are tied in the plane)")
	if skipped > 0 {
		r.note(itoa(skipped) + " surface member(s) connect to fewer than three nodes not in line: they tie nothing")
	}
}

// planeNormal returns the unit normal of the plane through the nodes ns.
func planeNormal(nodes []fa.Node, ns []int, tol float64) (vec, bool) {
	if len(ns) < 3 {
		return vec{}, false
	}
	p0 := vec(nodes[ns[0]].Pos)
	far, fd := -1, 0.0
	for _, k := range ns[1:] {
		if d := vec(nodes[k].Pos).sub(p0).norm(); d > fd {
			far, fd = k, d
		}
	}
	if far < 0 || fd <= tol {
		return vec{}, false
	}
	u := vec(nodes[far].Pos).sub(p0)
	best, bn := vec{}, 0.0
	for _, k := range ns[1:] {
		c := u.cross(vec(nodes[k].Pos).sub(p0))
		if c.norm() > bn {
			best, bn = c, c.norm()
		}
	}
	if bn <= tol*fd {
		return vec{}, false
	}
	return best.unit()
}

// supportTorsion restrains, at supports, the rotation about a global axis
// that only twists the members connected there (every member end that
// rotation reaches runs along the axis, like a column on a pinned base):
// a member free to twist at both ends would be a mechanism, and the
// restraint changes no flexural mode.
func (r *frameReader) supportTorsion() {
	m := r.fr.Model
	type end struct{ member, e int }
	at := make([][]end, len(m.Nodes))
	for i := range m.Members {
		for e := 0; e < 2; e++ {
			n := m.Members[i].Nodes[e]
			at[n] = append(at[n], end{i, e})
		}
	}
	fixed := 0
	for n := range m.Nodes {
		s := m.Nodes[n].Support
		if s == nil || s.Axes != nil || len(at[n]) == 0 {
			continue
		}
		for d := 3; d < 6; d++ {
			if s.Fixed[d] || s.Stiffness[d] > 0 {
				continue
			}
			axis := vec{}
			axis[d-3] = 1
			torsionOnly, reached := true, false
			for _, me := range at[n] {
				mb := &m.Members[me.member]
				a := vec(m.Nodes[mb.Nodes[0]].Pos).add(vec(mb.Ends[0].Offset))
				b := vec(m.Nodes[mb.Nodes[1]].Pos).add(vec(mb.Ends[1].Offset))
				ex, ok := b.sub(a).unit()
				if !ok {
					continue
				}
				lx, ly, lz, ok := frameAxes(ex, vec(mb.Axis))
				if !ok {
					continue
				}
				ec := &mb.Ends[me.e]
				for k, v := range [3]vec{lx, ly, lz} {
					if math.Abs(v.dot(axis)) < 1e-3 || (ec.Released[3+k] && ec.Stiffness[3+k] == 0) {
						continue
					}
					reached = true
					if k != 0 {
						torsionOnly = false
					}
				}
			}
			if reached && torsionOnly {
				s.Fixed[d] = true
				fixed++
			}
		}
	}
	if fixed > 0 {
		r.note("supports free to rotate about the axis of the member they carry are taken as restrained in that rotation (" + itoa(fixed) +
			"): a member free to twist would be a mechanism, and the restraint changes no flexural buckling mode")
	}
}

// prune leaves out the members that hang from a hinge: one end at a node
// that nothing else holds (no other member, no support, no surface) and the
// other end released in bending, so the member can swing freely (a
// connection lost in the export). Repeated until none is left.
func (r *frameReader) prune() {
	m := r.fr.Model
	held := make([]bool, len(m.Nodes))
	for _, g := range r.fr.Planes {
		for _, n := range g {
			held[n] = true
		}
	}
	keep := make([]bool, len(m.Members))
	for j := range keep {
		keep[j] = true
	}
	var dropped []string
	for {
		ends := make([]int, len(m.Nodes))
		for j := range m.Members {
			if keep[j] {
				ends[m.Members[j].Nodes[0]]++
				ends[m.Members[j].Nodes[1]]++
			}
		}
		free := func(n int) bool { return ends[n] == 1 && m.Nodes[n].Support == nil && !held[n] }
		changed := false
		for j := range m.Members {
			if !keep[j] {
				continue
			}
			mb := &m.Members[j]
			for e := 0; e < 2; e++ {
				if !free(mb.Nodes[e]) {
					continue
				}
				o := &mb.Ends[1-e]
				hinged := (o.Released[4] && o.Stiffness[4] == 0) || (o.Released[5] && o.Stiffness[5] == 0)
				if hinged || free(mb.Nodes[1-e]) {
					keep[j] = false
					changed = true
					dropped = append(dropped, mb.ID)
					break
				}
			}
		}
		if !changed {
			break
		}
	}
	if len(dropped) == 0 {
		return
	}
	idx := make([]int, len(m.Members))
	k := 0
	for j := range m.Members {
		idx[j] = -1
		if keep[j] {
			idx[j] = k
			m.Members[k] = m.Members[j]
			r.fr.Members[k] = r.fr.Members[j]
			k++
		}
	}
	m.Members = m.Members[:k]
	r.fr.Members = r.fr.Members[:k]
	for id, ps := range r.pieces {
		out := ps[:0]
		for _, j := range ps {
			if idx[j] >= 0 {
				out = append(out, idx[j])
			}
		}
		if len(out) == 0 {
			delete(r.pieces, id)
		} else {
			r.pieces[id] = out
		}
	}
	msg := itoa(len(dropped)) + " member(s) hang from a hinge with their other end free (a lost connection?) and would swing freely: left out of the frame"
	if len(dropped) <= 5 {
		msg += " (" + strings.Join(dropped, ", ") + ")"
	}
	r.note(msg)
	r.problem("frame-member-free", msg, "")
}
