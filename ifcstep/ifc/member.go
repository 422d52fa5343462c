package ifc

import (
	"math"
	"strings"

	"swaygate/checks"
	"swaygate/ifcstep"
)

// maxSkew is the largest angle (10°) between a member's principal axis and
// the global X or Y direction, or between the analytical and physical axes,
// that is taken as aligned.
const maxSkew = 10 * math.Pi / 180

// memberAux is what the actions need of a member beyond checks.Member.
type memberAux struct {
	am       *analyticalMember // the linked (or own) analytical member; nil when none
	phi      float64           // analytical local y to the major principal axis (rad)
	phiOK    bool
	mismatch bool // axes-mismatch: phi resolves the results onto the physical axes
	psets    psets
}

// storeyInfo is an IfcBuildingStorey's name and elevation.
type storeyInfo struct {
	key, name string
	elev      checks.Num
	ok        bool
}

// member builds one member from a candidate, or says why it is skipped.
func (x *extractor) member(c *candidate) (checks.Member, memberAux, *checks.Skipped) {
	in := c.inst
	m := checks.Member{Entity: entityName(c.entity), Ref: ref(in), StoreyElevation: checks.Null, BaseZ: checks.Null, TopZ: checks.Null}
	var aux memberAux
	var ab [10]ifcstep.Value
	vs := attrsOf(in, ab[:])
	m.GlobalID = strings.TrimSpace(text(at(vs, pGlobalID)))
	m.Name = text(at(vs, pName))
	if !c.analysisOnly {
		m.Tag = text(at(vs, pTag))
	}
	skip := func(reason, msg string) *checks.Skipped {
		return &checks.Skipped{GlobalID: m.GlobalID, Name: m.Name, Entity: m.Entity, Reason: reason, Message: msg}
	}
	if m.GlobalID == "" {
		x.warn("missing-global-id", m.Entity+" "+ref(in)+" has no GlobalId: not checked", ref(in))
		return m, aux, skip("missing-global-id", ref(in)+" has no GlobalId")
	}

	// Material: the occurrence's association, else the type's.
	var mi, typeMI *materialInfo
	if c.material != 0 {
		mi = x.material(c.material)
	}
	if t := c.typeObj.ID(); t != 0 {
		if tm := x.idx.typeMaterial[t]; tm != 0 {
			typeMI = x.material(tm)
			if mi == nil || (len(mi.names) == 0 && mi.class == matUnknown) {
				mi = typeMI
			}
		}
	}
	if mi != nil && mi.class == matNotSteel {
		return m, aux, skip(checks.CodeNotSteel, mi.why)
	}
	x.setMaterial(&m, mi)

	// Storey.
	if st := x.storey(c.structure); st.ok {
		m.StoreyKey, m.Storey, m.StoreyElevation = st.key, st.name, st.elev
	}

	aux.psets = x.memberPsets(c)
	if c.analysisOnly {
		aux.am = x.analyticalMember(in.ID())
		x.analysisGeometry(&m, &aux, mi, typeMI)
	} else {
		if len(c.links) > 0 {
			aux.am = x.analyticalMember(c.links[0])
			if len(c.links) > 1 {
				m.Problems = append(m.Problems, checks.Reason{Code: "multiple-analytical-members",
					Message: "linked to " + itoa(len(c.links)) + " analytical members: the first (" + refID(c.links[0]) + ") is used", Ref: refID(c.links[0])})
			}
			if !aux.am.ok {
				m.Problems = append(m.Problems, checks.Reason{Code: "analytical-member-unreadable", Message: aux.am.why, Ref: refID(c.links[0])})
				aux.am = nil
			}
		}
		x.physicalGeometry(c, &m, &aux, mi, typeMI, at(vs, pPlacement), at(vs, pRepresentation))
	}
	x.restraint(&m, aux.psets)
	return m, aux, nil
}

// setMaterial copies the material's values to the member.
func (x *extractor) setMaterial(m *checks.Member, mi *materialInfo) {
	if mi == nil {
		m.Problems = append(m.Problems, checks.Reason{Code: "material-unknown",
			Message: "no material is associated: steel assumed" + nameHint(m.Name)})
		return
	}
	m.Material = checks.Material{E: mi.e, Fy: mi.fy, Fu: mi.fu, Grade: mi.grade, Name: strings.Join(mi.names, ", ")}
	if mi.fromProp {
		m.Material.Source = "model"
	}
	if mi.class == matUnknown {
		m.Problems = append(m.Problems, checks.Reason{Code: "material-unknown", Message: mi.why + ": steel assumed" + nameHint(m.Name)})
	}
	for _, n := range mi.notes {
		m.Problems = append(m.Problems, checks.Reason{Code: "material-value-ignored", Message: n})
	}
}

// nameHint notes when an element's own name suggests it is not steel.
func nameHint(name string) string {
	for _, w := range materialWords(name) {
		if k, ok := notSteelWords[w]; ok {
			return " (its name suggests " + k + ")"
		}
	}
	return ""
}

// storey resolves the spatial container to its building storey: directly,
// or through the aggregation of a space (or zone) into a storey.
func (x *extractor) storey(id uint32) storeyInfo {
	if id == 0 {
		return storeyInfo{}
	}
	if s, ok := x.storeys[id]; ok {
		return s
	}
	var out storeyInfo
	cur := id
	for depth := 0; cur != 0 && depth < 8; depth++ {
		in, ok := x.f.Get(cur)
		if !ok {
			break
		}
		if in.Type() == "IFCBUILDINGSTOREY" {
			out = storeyInfo{key: ref(in), name: text(in.Attr(pName)), elev: checks.Null, ok: true}
			if out.name == "" {
				out.name = text(in.Attr(pStoreyLongName))
			}
			if out.name == "" {
				out.name = ref(in)
			}
			if e, ok := in.Attr(pStoreyElevation).Real(); ok {
				out.elev = checks.Num(e * x.lengthFactor)
			}
			break
		}
		switch in.Type() {
		case "IFCBUILDING", "IFCSITE", "IFCPROJECT", "IFCFACILITY", "IFCBRIDGE", "IFCROAD", "IFCRAILWAY":
			cur = 0
		default:
			cur = x.idx.parent[cur]
		}
	}
	x.storeys[id] = out
	return out
}

// physicalGeometry finds the section, orientation, length and elevations of
// a physical element.
func (x *extractor) physicalGeometry(c *candidate, m *checks.Member, aux *memberAux, mi, typeMI *materialInfo, plV, repV ifcstep.Value) {
	in := c.inst
	world, worldOK := identity, false
	if pl, ok := x.deref(in, plV); ok {
		world, worldOK = x.placement(pl)
	}
	// The profile: the material profile set (occurrence, else type), else
	// the body extrusion.
	var profiles []uint32
	profRef := ""
	tapered := false
	for _, src := range []*materialInfo{mi, typeMI} {
		if src != nil && len(src.profiles) > 0 {
			profiles, tapered = src.profiles, src.tapered
			profRef = refID(src.set)
			break
		}
	}
	// The body is read when it gives the profile, or the length and the
	// elevations that no analytical member gives. A profile of a material
	// profile set lies in the element's xy plane (the set usage's
	// convention), whatever the body's extrusion says.
	var b bodyInfo
	if len(profiles) != 1 || aux.am == nil {
		b = x.body(in, repV)
	}
	var prof ifcstep.Instance
	var ext *extrusion
	switch {
	case len(profiles) > 1:
		m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeUnsupportedProfile,
			Message: "the material profile set " + profRef + " has " + itoa(len(profiles)) + " profiles (a composite section)", Ref: profRef})
	case len(profiles) == 1:
		p, ok := x.f.Get(profiles[0])
		if !ok {
			m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeMissingSection, Message: "the material profile points to a missing profile " + refID(profiles[0]), Ref: profRef})
			break
		}
		prof = p
		for i := range b.extrusions {
			if b.extrusions[i].profile.ID() == p.ID() {
				ext = &b.extrusions[i]
				break
			}
		}
	default:
		switch {
		case len(b.extrusions) == 0:
			msg := "no profile: no material profile set and no extruded body"
			if len(b.others) > 0 {
				msg += " (the body is " + strings.Join(uniqStrings(b.others), ", ") + ")"
			}
			m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeMissingSection, Message: msg, Ref: ref(in)})
		case sameProfile(b.extrusions):
			ext = &b.extrusions[0]
			prof = ext.profile
		default:
			m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeMissingSection,
				Message: "the body has " + itoa(len(b.extrusions)) + " extrusions of different profiles: the section is not known", Ref: ref(in)})
		}
	}
	if ext == nil && len(b.extrusions) > 0 && sameProfile(b.extrusions) {
		// The body's solid gives the length and elevations even when the
		// section comes from the material profile set.
		ext = &b.extrusions[0]
	}
	switch {
	case ext != nil && ext.tapered:
		m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeUnsupportedProfile,
			Message: "tapered extrusion " + ref(ext.solid) + ": the section varies along the member", Ref: ref(ext.solid)})
		prof = ifcstep.Instance{}
	case tapered && prof.ID() != 0:
		m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeUnsupportedProfile,
			Message: "tapered material profile set usage " + profRef + ": the section varies along the member", Ref: profRef})
		prof = ifcstep.Instance{}
	}

	// Axis of the member, object coordinates: the 'Axis' polyline when it
	// matters (no analytical member gives the length), else the extrusion.
	axisDir := vec{0, 0, 1}
	var axis []vec
	if aux.am == nil || ext == nil {
		axis = x.axisLine(&b)
	}
	switch {
	case len(axis) >= 2:
		if d, ok := axis[len(axis)-1].sub(axis[0]).unit(); ok {
			axisDir = d
		}
	case ext != nil:
		axisDir = ext.dir
	}
	plane := identity
	if len(profiles) == 0 && ext != nil && ext.profile.ID() == prof.ID() {
		plane = ext.plane
	}

	var pi *profileInfo
	if prof.ID() != 0 {
		pi = x.profile(prof)
		if c.profProps != 0 && x.idx.profileProps[prof.ID()] == 0 {
			pi = x.elementProfileProps(pi, c.profProps)
		}
		x.setSection(m, pi)
	} else if c.profProps != 0 {
		// No usable profile, but the element's own profile properties.
		if p := x.elementProfileProps(nil, c.profProps); p.props != nil {
			kept := m.Problems[:0]
			for _, r := range m.Problems {
				if r.Code != checks.CodeMissingSection {
					kept = append(kept, r)
				}
			}
			m.Problems = kept
			pi = p
			x.setSection(m, pi)
		}
	}

	// Orientation of the principal axes.
	if pi != nil && pi.props != nil {
		if !worldOK {
			m.Problems = append(m.Problems, checks.Reason{Code: "placement-unknown",
				Message: "the placement cannot be read: the global sway directions are not known", Ref: ref(in)})
		} else {
			ang := pi.rot + pi.props.Angle
			major := world.dir(plane.dir(vec{math.Cos(ang), math.Sin(ang), 0}))
			profX := world.dir(plane.dir(vec{math.Cos(pi.rot), math.Sin(pi.rot), 0}))
			x.setDirections(m, major, world.dir(axisDir))
			if aux.am != nil && aux.am.hasAxes {
				x.resolveAxes(m, aux, major, profX, pi)
			}
		}
	}

	// Length: analytical member, then extrusion depth along the member
	// axis, then the base quantities.
	switch {
	case aux.am != nil:
		m.Length = aux.am.length
	case ext != nil:
		m.Length = ext.depth * math.Abs(ext.dir.dot(axisDir))
	default:
		if l, ok := x.quantityLength(aux.psets); ok {
			m.Length = l
		} else {
			m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeMissingLength,
				Message: "no length: no analytical member, no extruded body and no base quantity Length", Ref: ref(in)})
		}
	}

	// Elevations of the ends.
	if worldOK {
		switch {
		case ext != nil:
			p0 := world.point(ext.plane.o)
			p1 := world.point(ext.plane.o.add(ext.dir.scale(ext.depth)))
			m.BaseZ, m.TopZ = checks.Num(math.Min(p0[2], p1[2])), checks.Num(math.Max(p0[2], p1[2]))
		case len(axis) >= 2:
			p0, p1 := world.point(axis[0]), world.point(axis[len(axis)-1])
			m.BaseZ, m.TopZ = checks.Num(math.Min(p0[2], p1[2])), checks.Num(math.Max(p0[2], p1[2]))
		}
	}
	if math.IsNaN(float64(m.BaseZ)) && aux.am != nil {
		m.BaseZ = checks.Num(math.Min(aux.am.wStart[2], aux.am.wEnd[2]))
		m.TopZ = checks.Num(math.Max(aux.am.wStart[2], aux.am.wEnd[2]))
	}
}

func sameProfile(es []extrusion) bool {
	if len(es) == 0 {
		return false
	}
	for _, e := range es[1:] {
		if e.profile.ID() != es[0].profile.ID() {
			return false
		}
	}
	return true
}

func uniqStrings(ss []string) []string {
	var out []string
	for _, s := range ss {
		out = appendUniq(out, s)
	}
	return out
}

// setSection copies a profile's properties to the member.
func (x *extractor) setSection(m *checks.Member, pi *profileInfo) {
	if pi.code != "" {
		m.Problems = append(m.Problems, checks.Reason{Code: pi.code, Message: pi.msg, Ref: refID(pi.id)})
	}
	if pi.props != nil {
		m.Section = pi.props
	}
	if pi.differs != "" {
		m.Problems = append(m.Problems, checks.Reason{Code: "section-properties-differ",
			Message: "the model's profile properties differ from those computed from the dimensions (the computed ones are used): " + pi.differs, Ref: refID(pi.id)})
	}
	if pi.fromModel {
		x.assume("section properties are computed from the profile dimensions; values the model gives (Pset_ProfileMechanical, IfcStructuralProfileProperties) are used only where the dimensions give none")
	}
}

// setDirections assigns each axis the global direction it sways in: bending
// about an axis deflects the member perpendicular to it, so a major axis
// along X sways in Y. major is the major principal axis and along the member
// axis, in world coordinates.
func (x *extractor) setDirections(m *checks.Member, major, along vec) {
	// The principal axis in plan.
	h := math.Hypot(major[0], major[1])
	if h < 0.2 || math.Abs(along[2]) < math.Cos(maxSkew*3) {
		m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeSkewedColumn,
			Message: "the member is not vertical enough to assign its axes to the global X and Y directions"})
		return
	}
	alpha := math.Atan2(major[1], major[0]) // from global X
	// Distance to the nearest multiple of 90°.
	q := math.Round(alpha / (math.Pi / 2))
	dev := math.Abs(alpha - q*math.Pi/2)
	alongX := int(math.Abs(q))%2 == 0 // the major axis lies along X
	if alongX {
		m.Axes[checks.Major].Direction, m.Axes[checks.Minor].Direction = checks.DirY, checks.DirX
	} else {
		m.Axes[checks.Major].Direction, m.Axes[checks.Minor].Direction = checks.DirX, checks.DirY
	}
	if dev > maxSkew {
		m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeSkewedColumn,
			Message: "the principal axes are " + ftoa(dev*180/math.Pi) + "° from global X and Y: major-axis bending is taken to sway in " +
				m.Axes[checks.Major].Direction.String() + ", the nearer direction"})
	}
}

// resolveAxes compares the analytical member's local y with the physical
// profile's x and sets the angle that resolves the analysis moments onto the
// physical principal axes.
func (x *extractor) resolveAxes(m *checks.Member, aux *memberAux, major, profX vec, pi *profileInfo) {
	am := aux.am
	psi := math.Atan2(profX.dot(am.wz), profX.dot(am.wy))
	// Axes, not vectors: compare modulo 180°.
	d := math.Abs(math.Remainder(psi, math.Pi))
	if d > maxSkew {
		aux.mismatch = true
		aux.phi = math.Atan2(major.dot(am.wz), major.dot(am.wy))
		m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeAxesMismatch,
			Message: "the analytical member's local y is " + ftoa(d*180/math.Pi) + "° from the physical profile's x: the physical element wins, the analysis moments are resolved onto its principal axes",
			Ref:     ref(am.inst)})
	} else {
		aux.phi = pi.rot + pi.props.Angle
	}
	aux.phiOK = true
}

// analysisGeometry is physicalGeometry for an analytical member taken as the
// member: its edge gives the length and elevations, its material profile set
// the section, and the profile's x lies along its local y.
func (x *extractor) analysisGeometry(m *checks.Member, aux *memberAux, mi, typeMI *materialInfo) {
	am := aux.am
	m.Length = am.length
	m.BaseZ = checks.Num(math.Min(am.wStart[2], am.wEnd[2]))
	m.TopZ = checks.Num(math.Max(am.wStart[2], am.wEnd[2]))
	var profiles []uint32
	for _, src := range []*materialInfo{mi, typeMI} {
		if src != nil && len(src.profiles) > 0 {
			profiles = src.profiles
			break
		}
	}
	switch {
	case len(profiles) == 0:
		m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeMissingSection, Message: "no material profile set: the section is not known", Ref: m.Ref})
		return
	case len(profiles) > 1:
		m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeUnsupportedProfile, Message: "the material profile set has " + itoa(len(profiles)) + " profiles (a composite section)", Ref: m.Ref})
		return
	}
	p, ok := x.f.Get(profiles[0])
	if !ok {
		m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeMissingSection, Message: "missing profile " + refID(profiles[0]), Ref: m.Ref})
		return
	}
	pi := x.profile(p)
	x.setSection(m, pi)
	if pi.props == nil {
		return
	}
	if !am.hasAxes {
		m.Problems = append(m.Problems, checks.Reason{Code: "placement-unknown", Message: "the analytical member has no usable Axis: its principal axes are not known", Ref: m.Ref})
		return
	}
	ang := pi.rot + pi.props.Angle
	major := am.wy.scale(math.Cos(ang)).add(am.wz.scale(math.Sin(ang)))
	x.setDirections(m, major, am.wx)
	aux.phi, aux.phiOK = ang, true
}

// quantityLength reads Length from the base quantities (IFC4
// Qto_ColumnBaseQuantities or Qto_MemberBaseQuantities, IFC2X3
// BaseQuantities), occurrence first.
func (x *extractor) quantityLength(ps psets) (float64, bool) {
	for _, sets := range [2][]ifcstep.Instance{ps.occ, ps.typ} {
		for _, s := range sets {
			if s.Type() != "IFCELEMENTQUANTITY" {
				continue
			}
			switch strings.ToLower(psetName(s)) {
			case "qto_columnbasequantities", "qto_memberbasequantities", "basequantities":
			default:
				continue
			}
			props := x.properties(s, pQtoItems)
			if l, ok := props.number(x, "Length", qLength); ok && l > 0 {
				return l, true
			}
		}
	}
	return 0, false
}
