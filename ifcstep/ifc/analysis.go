package ifc

import (
	"math"
	"strings"

	"swaygate/checks"
	"swaygate/ifcstep"
)

// analyticalMember is an IfcStructuralCurveMember's geometry.
type analyticalMember struct {
	inst ifcstep.Instance
	ok   bool   // the edge was read
	why  string // why not

	// In the analysis model's coordinates (its shared placement), which are
	// those of GLOBAL_COORDS results and of the Axis attribute, mm.
	start, end vec
	x, y, z    vec // local axes; y, z zero when Axis is not usable
	hasAxes    bool
	length     float64

	// In world coordinates.
	wStart, wEnd vec
	wx, wy, wz   vec
}

// analyticalMember reads (and caches) the geometry of a curve member.
func (x *extractor) analyticalMember(id uint32) *analyticalMember {
	if am, ok := x.analytical[id]; ok {
		return am
	}
	am := &analyticalMember{}
	x.analytical[id] = am
	in, ok := x.f.Get(id)
	if !ok {
		am.why = "analytical member " + refID(id) + " is missing"
		return am
	}
	am.inst = in
	var ab [10]ifcstep.Value
	vs := attrsOf(in, ab[:])
	world := identity
	if pl, ok := x.deref(in, at(vs, pPlacement)); ok {
		f, ok := x.placement(pl)
		if !ok {
			am.why = "the placement of analytical member " + ref(in) + " cannot be read"
			return am
		}
		world = f
	}
	s, e, ok := x.memberEdge(in, at(vs, pRepresentation))
	if !ok {
		am.why = "analytical member " + ref(in) + " has no readable edge (IfcTopologyRepresentation with an IfcEdge)"
		return am
	}
	am.start, am.end = s, e
	d := e.sub(s)
	am.length = d.norm()
	xa, ok := d.unit()
	if !ok {
		am.why = "analytical member " + ref(in) + " has a zero-length edge"
		return am
	}
	am.ok = true
	am.x = xa
	if x.s.memberAxis >= 0 {
		if ai, ok := x.deref(in, at(vs, x.s.memberAxis)); ok {
			if a, ok := x.readDir(ai); ok {
				if z, ok := a.sub(xa.scale(a.dot(xa))).unit(); ok {
					am.z, am.y, am.hasAxes = z, z.cross(xa), true
				}
			}
		}
	}
	am.wStart, am.wEnd = world.point(am.start), world.point(am.end)
	am.wx = world.dir(am.x)
	if am.hasAxes {
		am.wy, am.wz = world.dir(am.y), world.dir(am.z)
	}
	return am
}

// memberEdge reads the start and end vertices of a curve member's edge.
func (x *extractor) memberEdge(in ifcstep.Instance, rep ifcstep.Value) (vec, vec, bool) {
	pds, ok := x.deref(in, rep)
	if !ok {
		return vec{}, vec{}, false
	}
	var rb [4]ifcstep.Value
	for _, rv := range listOf(pds.Attr(pReps), rb[:]) {
		rep, ok := x.deref(pds, rv)
		if !ok {
			continue
		}
		if s, e, ok := x.repEdge(rep, identity, 0); ok {
			return s, e, true
		}
	}
	return vec{}, vec{}, false
}

// repEdge finds the first edge among a representation's items, also through
// mapped items (whose transformation it applies).
func (x *extractor) repEdge(rep ifcstep.Instance, tr frame, depth int) (vec, vec, bool) {
	if depth > 4 {
		return vec{}, vec{}, false
	}
	switch rep.Type() {
	case "IFCTOPOLOGYREPRESENTATION", "IFCSHAPEREPRESENTATION":
	default:
		return vec{}, vec{}, false
	}
	var ib [2]ifcstep.Value
	for _, iv := range listOf(rep.Attr(pRepItems), ib[:]) {
		it, ok := x.deref(rep, iv)
		if !ok {
			continue
		}
		if it.Type() == "IFCMAPPEDITEM" {
			src, ok := x.deref(it, it.Attr(pMapSource))
			if !ok {
				continue
			}
			origin, target := identity, identity
			if oi, ok := x.deref(src, src.Attr(pMapOrigin)); ok {
				if origin, ok = x.readAxis2Placement(oi); !ok {
					continue
				}
			}
			if ti, ok := x.deref(it, it.Attr(pMapTarget)); ok {
				if target, _, ok = x.transform3D(ti); !ok {
					continue
				}
			}
			mr, ok := x.deref(src, src.Attr(pMapRep))
			if !ok {
				continue
			}
			if s, e, ok := x.repEdge(mr, tr.then(target).then(origin.inverse()), depth+1); ok {
				return s, e, true
			}
			continue
		}
		if s, e, ok := x.edgePoints(it, 0); ok {
			return tr.point(s), tr.point(e), true
		}
	}
	return vec{}, vec{}, false
}

func (x *extractor) edgePoints(it ifcstep.Instance, depth int) (vec, vec, bool) {
	if depth > 4 {
		return vec{}, vec{}, false
	}
	vertex := func(v ifcstep.Value) (vec, bool) {
		vp, ok := x.deref(it, v)
		if !ok || vp.Type() != "IFCVERTEXPOINT" {
			return vec{}, false
		}
		pt, ok := x.deref(vp, vp.Attr(pVertexPoint))
		if !ok {
			return vec{}, false
		}
		return x.readPoint(pt)
	}
	switch it.Type() {
	case "IFCEDGE", "IFCEDGECURVE", "IFCSUBEDGE":
		var ab [4]ifcstep.Value
		vs := attrsOf(it, ab[:])
		s, ok1 := vertex(at(vs, pEdgeStart))
		e, ok2 := vertex(at(vs, pEdgeEnd))
		return s, e, ok1 && ok2
	case "IFCORIENTEDEDGE":
		el, ok := x.deref(it, it.Attr(pOrientedEdge))
		if !ok {
			return vec{}, vec{}, false
		}
		s, e, ok := x.edgePoints(el, depth+1)
		if o, known := it.Attr(pOrientedSense).Bool(); known && !o {
			s, e = e, s
		}
		return s, e, ok
	}
	return vec{}, vec{}, false
}

// analysisCandidates takes the vertical IfcStructuralCurveMembers as the
// members of an analysis-only model (one without IfcColumn).
func (x *extractor) analysisCandidates() []candidate {
	var out []candidate
	total := 0
	for _, t := range [...]string{"IFCSTRUCTURALCURVEMEMBER", "IFCSTRUCTURALCURVEMEMBERVARYING"} {
		for _, in := range x.f.ByType(t) {
			total++
			am := x.analyticalMember(in.ID())
			if !am.ok {
				x.warn("analytical-member-unreadable", am.why, ref(in))
				continue
			}
			if math.Abs(am.wx[2]) < math.Cos(maxSkew) {
				continue // not vertical
			}
			out = append(out, candidate{inst: in, entity: t, analysisOnly: true})
		}
	}
	if total > 0 {
		x.assume("the model has no IfcColumn: its " + itoa(len(out)) + " vertical analytical members (IfcStructuralCurveMember within " +
			ftoa(maxSkew*180/math.Pi) + "° of vertical, of " + itoa(total) + ") are taken as the members")
	}
	return out
}

// loadGroup is an IfcStructuralLoadGroup (or IfcStructuralLoadCase).
type loadGroup struct {
	id          uint32
	name        string
	predefined  string
	combination bool // a design combination (LOAD_COMBINATION, or built by factors)
	kind        string
}

// resultSet is one result group's reading.
type resultSet struct {
	id     uint32
	theory checks.Theory
	group  *loadGroup
	use    bool   // its results are checked
	name   string // the combination name
}

// readAnalysis classifies the load groups and result groups of the model.
func (x *extractor) readAnalysis() {
	x.groups = map[uint32]*loadGroup{}
	x.results = map[uint32]*resultSet{}
	for _, t := range [...]string{"IFCSTRUCTURALLOADGROUP", "IFCSTRUCTURALLOADCASE"} {
		for _, in := range x.f.ByType(t) {
			g := &loadGroup{id: in.ID(), name: text(in.Attr(pName))}
			g.predefined, _ = in.Attr(pGroupPredef).Enum()
			switch {
			case g.predefined == "LOAD_COMBINATION" || g.predefined == "LOAD_COMBINATION_GROUP":
				g.combination, g.kind = true, "load combination"
			case x.idx.byFactor[in.ID()] && g.predefined != "LOAD_CASE":
				g.combination, g.kind = true, "load combination (by factors)"
			case g.predefined == "LOAD_CASE":
				g.kind = "load case"
			default:
				g.kind = "load group (" + strings.ToLower(g.predefined) + ")"
			}
			if strings.TrimSpace(g.name) == "" {
				g.name = refID(g.id)
			}
			x.groups[g.id] = g
		}
	}
	used := map[string]uint32{}
	for _, in := range x.f.ByType("IFCSTRUCTURALRESULTGROUP") {
		rs := &resultSet{id: in.ID()}
		x.results[rs.id] = rs
		th, _ := in.Attr(pResTheory).Enum()
		switch th {
		case "SECOND_ORDER_THEORY", "THIRD_ORDER_THEORY", "FULL_NONLINEAR_THEORY":
			rs.theory = checks.SecondOrder
		case "FIRST_ORDER_THEORY":
		default:
			x.warn("theory-unknown", "result group "+ref(in)+" gives the analysis theory as "+strings.ToLower(th)+
				": taken as first order (its moments are amplified)", ref(in))
		}
		gid, ok := in.Attr(pResFor).Ref()
		g := x.groups[gid]
		if !ok || g == nil {
			x.warn("results-without-load-group", "result group "+ref(in)+" names no load group: its results are not used", ref(in))
			continue
		}
		rs.group = g
		rs.name = g.name
		switch {
		case g.combination:
			rs.use = true
		case g.predefined == "LOAD_CASE" && x.opt.LoadCases:
			rs.use = true
			x.warn("load-case-checked", "results of load case "+quote(g.name)+" ("+refID(g.id)+") are unfactored; checked as requested", refID(g.id))
		case g.predefined == "LOAD_CASE":
			x.warn("load-case-skipped", "results of load case "+quote(g.name)+" ("+refID(g.id)+") are unfactored: not checked (only load combinations are; opt in to check load cases)", ref(in))
		default:
			x.warn("load-group-skipped", "results of "+g.kind+" "+quote(g.name)+" ("+refID(g.id)+") are not of a load combination: not checked", ref(in))
		}
		if rs.use {
			if prev, dup := used[rs.name]; dup {
				x.warn("duplicate-combination", "result groups "+refID(prev)+" and "+ref(in)+" are both for "+quote(rs.name)+": only the first is used", ref(in))
				rs.use = false
			} else {
				used[rs.name] = rs.id
			}
		}
	}
}

// station is one location of a member result, in internal units, with the
// forces as written (in the result's coordinate system).
type station struct {
	x    float64 // mm along the member
	f, m vec     // N, N·mm
}

// memberResult is the result of one analytical member for one result set.
type memberResult struct {
	set      *resultSet
	stations []station
	global   bool // GLOBAL_COORDS
	ref      string
}

// memberResults reads the curve reactions of an analytical member that
// belong to result sets that are checked.
func (x *extractor) memberResults(am *analyticalMember) []memberResult {
	rids := x.idx.reactions[am.inst.ID()]
	if len(rids) == 0 {
		return nil
	}
	out := make([]memberResult, 0, len(rids))
	for _, rid := range rids {
		rs := x.results[x.idx.resultGroup[rid]]
		if rs == nil || !rs.use {
			continue
		}
		r, ok := x.f.Get(rid)
		if !ok {
			continue
		}
		mr, why := x.readReaction(r, am)
		if why != "" {
			x.warn("results-unreadable", why, ref(r))
			continue
		}
		mr.set = rs
		out = append(out, mr)
	}
	return out
}

// readReaction reads an IfcStructuralCurveReaction's load configuration.
func (x *extractor) readReaction(r ifcstep.Instance, am *analyticalMember) (memberResult, string) {
	mr := memberResult{ref: ref(r)}
	var rb [10]ifcstep.Value
	rvs := attrsOf(r, rb[:])
	g, _ := at(rvs, pReactGlobal).Enum()
	mr.global = g == "GLOBAL_COORDS"
	load, ok := x.deref(r, at(rvs, pReactLoad))
	if !ok {
		return mr, "curve reaction " + ref(r) + " has no applied load"
	}
	if load.Type() != "IFCSTRUCTURALLOADCONFIGURATION" {
		return mr, "curve reaction " + ref(r) + " gives " + entityName(load.Type()) + ", not an IfcStructuralLoadConfiguration of forces at locations: not used"
	}
	fq, mq := x.factor(qForce), x.factor(qTorque)
	var cb [3]ifcstep.Value
	cvs := attrsOf(load, cb[:])
	var lb [8]float64
	locs := lb[:0]
	if lv := at(cvs, pConfigLocs); !lv.IsUnset() {
		var eb [8]ifcstep.Value
		list := listOf(lv, eb[:])
		if list == nil {
			return mr, "unreadable locations in " + ref(load)
		}
		for _, l := range list {
			var p [2]float64
			n, ok := readReals(l, p[:])
			if !ok || n < 1 {
				return mr, "unreadable locations in " + ref(load)
			}
			locs = append(locs, p[0]*x.lengthFactor)
		}
	}
	var vb [8]ifcstep.Value
	vals := listOf(at(cvs, pConfigValues), vb[:])
	if len(vals) == 0 {
		return mr, "no values in " + ref(load)
	}
	if len(locs) == 0 {
		// EQUIDISTANT: the values are spread evenly from start to end.
		if len(vals) < 2 || am.length == 0 {
			return mr, "values without locations in " + ref(load)
		}
		for i := range vals {
			locs = append(locs, am.length*float64(i)/float64(len(vals)-1))
		}
	}
	if len(locs) != len(vals) {
		return mr, ref(load) + " has " + itoa(len(vals)) + " values at " + itoa(len(locs)) + " locations"
	}
	mr.stations = make([]station, 0, len(vals))
	for i, v := range vals {
		sf, ok := x.deref(load, v)
		if !ok || sf.Type() != "IFCSTRUCTURALLOADSINGLEFORCE" {
			return mr, ref(load) + " holds a value that is not an IfcStructuralLoadSingleForce"
		}
		var fb [7]ifcstep.Value
		vs := attrsOf(sf, fb[:])
		if len(vs) < 7 {
			return mr, "unreadable force " + ref(sf)
		}
		var st station
		st.x = locs[i]
		for k := 0; k < 3; k++ {
			if f, ok := realOf(vs[pForceX+k]); ok {
				st.f[k] = f * fq
			}
			if m, ok := realOf(vs[pForceX+3+k]); ok {
				st.m[k] = m * mq
			}
		}
		mr.stations = append(mr.stations, st)
	}
	// In order along the member (stable insertion sort: few stations).
	st := mr.stations
	for i := 1; i < len(st); i++ {
		for j := i; j > 0 && st[j].x < st[j-1].x; j-- {
			st[j], st[j-1] = st[j-1], st[j]
		}
	}
	return mr, ""
}
