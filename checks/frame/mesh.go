package frame

import (
	"math"
	"strconv"
	"strings"
)

// slot states.
const (
	slotFree     uint8 = iota // an unknown of the system
	slotFixed                 // rigidly supported, or restrained for lack of stiffness
	slotInactive              // out of the plane of a plane model
)

// mesh is the discretised model: points (model nodes first, then the
// interior points of subdivided members) with their degree-of-freedom axes,
// elements with the maps from their points' slots to their 12 local degrees
// of freedom, and springs. A slot is one degree of freedom of a point (6 per
// point, slot = 6·point + dof) or a pseudo degree of freedom created by a
// member-end release (slots from 6·len(points) on).
type mesh struct {
	plane    bool
	planeRot rot

	points   []point
	interior [][]int32 // per member: its interior points in order (nil for one element)

	elems []element
	slots []int32   // element slot lists (arena)
	coef  []float64 // element maps (arena): 12 coefficients per slot, one column of C

	springs     []spring
	springSlots []int32
	springCoef  []float64

	state     []uint8 // per slot
	group     []int32 // per slot: the point, or len(points) + pseudo group
	pseudo    []pseudoSlot
	nGroups   int
	restraint []string // points with slots restrained for lack of stiffness, for the notes
	moreAuto  bool     // more such points than listed
	nAuto     int
}

type point struct {
	frame  rot
	axes   string // name of the frame for messages: "global", "support", "plane"
	node   int32  // model node, or -1 for an interior point
	member int32  // interior point: its member
	k      int32  // interior point: its position 1..n-1 along the member
}

// element is one beam-column element. Its map C (12 × m) takes the values
// of its m slots to its local degrees of freedom: column j is
// coef[12·(off+j) : 12·(off+j+1)].
type element struct {
	member int32
	length float64
	frame  rot
	off, m int32
}

// spring adds ½·k·(cᵀu)² over its slots.
type spring struct {
	k      float64
	off, m int32
}

type pseudoSlot struct {
	member int32
	end    int8 // 0 start, 1 end
	dof    int8 // local degree of freedom released
}

// column is one column of an element map under construction.
type column struct {
	slot int32
	c    [12]float64
}

const inPlaneTol = 1e-6

// buildMesh validates m, subdivides its members and builds the element maps.
func buildMesh(m *Model, o Options) (*mesh, error) {
	ms := &mesh{}
	if err := validate(m, ms); err != nil {
		return nil, err
	}

	// Points: model nodes, with their degree-of-freedom axes.
	ms.points = make([]point, len(m.Nodes))
	for i := range m.Nodes {
		p := point{frame: rot{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}, axes: "global", node: int32(i), member: -1}
		if ms.plane {
			p.frame, p.axes = ms.planeRot, "plane"
		}
		if s := m.Nodes[i].Support; s != nil && s.Axes != nil {
			p.frame, _ = s.Axes.frame() // validated
			p.axes = "support"
		}
		ms.points[i] = p
	}

	// Subdivision: interior points along each member.
	loaded := make([]bool, len(m.Members))
	for _, c := range m.Combinations {
		for i, n := range c.Compression {
			if n != 0 {
				loaded[i] = true
			}
		}
	}
	nElem := make([]int, len(m.Members))
	ms.interior = make([][]int32, len(m.Members))
	interiorFrame, interiorAxes := rot{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}, "global"
	if ms.plane {
		interiorFrame, interiorAxes = ms.planeRot, "plane"
	}
	for i := range m.Members {
		mb := &m.Members[i]
		n := 1
		switch {
		case mb.Elements > 0:
			n = mb.Elements
		case loaded[i]:
			n = o.Elements
		}
		nElem[i] = n
		if n == 1 {
			continue
		}
		ip := make([]int32, n-1)
		for k := 1; k < n; k++ {
			ip[k-1] = int32(len(ms.points))
			ms.points = append(ms.points, point{frame: interiorFrame, axes: interiorAxes, node: -1, member: int32(i), k: int32(k)})
		}
		ms.interior[i] = ip
	}

	// Slot states of the points.
	np := len(ms.points)
	ms.state = make([]uint8, 6*np, 6*np+16)
	ms.group = make([]int32, 6*np, 6*np+16)
	for p := range ms.points {
		for d := 0; d < 6; d++ {
			ms.group[6*p+d] = int32(p)
		}
		if ms.plane {
			in := ms.inPlaneSlots(&ms.points[p].frame)
			for d := 0; d < 6; d++ {
				if !in[d] {
					ms.state[6*p+d] = slotInactive
				}
			}
		}
	}
	ms.nGroups = np
	for i := range m.Nodes {
		s := m.Nodes[i].Support
		if s == nil {
			continue
		}
		for d := 0; d < 6; d++ {
			sl := 6*i + d
			if ms.state[sl] == slotInactive {
				continue
			}
			switch {
			case s.Fixed[d] || math.IsInf(s.Stiffness[d], 1):
				ms.state[sl] = slotFixed
			case s.Stiffness[d] > 0:
				ms.addSpring(s.Stiffness[d], []int32{int32(sl)}, []float64{1})
			}
		}
	}

	// Elements. Arenas sized for 12 map columns per element, the common
	// case (fewer at supports, more at releases).
	total := 0
	for _, n := range nElem {
		total += n
	}
	ms.elems = make([]element, 0, total)
	ms.slots = make([]int32, 0, 12*total)
	ms.coef = make([]float64, 0, 144*total)
	var cols [24]column
	for i := range m.Members {
		mb := &m.Members[i]
		na, nb := mb.Nodes[0], mb.Nodes[1]
		pa := m.Nodes[na].Pos.add(mb.Ends[0].Offset)
		pb := m.Nodes[nb].Pos.add(mb.Ends[1].Offset)
		fr, length, _ := memberFrame(pa, pb, ms.memberAxis(mb, pa, pb)) // validated
		n := nElem[i]
		chain := make([]int32, 0, n+1)
		chain = append(chain, int32(na))
		chain = append(chain, ms.interior[i]...)
		chain = append(chain, int32(nb))
		for e := 0; e < n; e++ {
			nc := 0
			for end := 0; end < 2; end++ {
				p := chain[e+end]
				var ec *EndCondition
				if (end == 0 && e == 0) || (end == 1 && e == n-1) {
					ec = &mb.Ends[end]
				}
				nc = ms.endColumns(cols[:], nc, p, end, &fr, ec, int32(i))
			}
			ms.addElement(int32(i), length/float64(n), fr, cols[:nc])
		}
	}

	ms.restrainUnstiffened(m)
	return ms, nil
}

// inPlaneSlots reports which slots of a point with frame f are solved in a
// plane model: the translations along the two in-plane axes of f and the
// rotation about its normal axis (validated to exist).
func (ms *mesh) inPlaneSlots(f *rot) [6]bool {
	var in [6]bool
	n := ms.planeRot[2]
	for k := 0; k < 3; k++ {
		if math.Abs(f[k].dot(n)) > 0.5 {
			in[3+k] = true
		} else {
			in[k] = true
		}
	}
	return in
}

// memberAxis returns the Axis of mb or its default.
func (ms *mesh) memberAxis(mb *Member, pa, pb Vec3) Vec3 {
	if !mb.Axis.isZero() {
		return mb.Axis
	}
	var pr *rot
	if ms.plane {
		pr = &ms.planeRot
	}
	return defaultAxis(pb.sub(pa).unit(), pr)
}

// endColumns appends to cols (from index nc) the columns that map the slots
// of point p to the local degrees of freedom of one end of an element (end
// 0 or 1) with local axes fr. ec is the member's end condition when the
// element end is a member end, nil at an interior point.
func (ms *mesh) endColumns(cols []column, nc int, p int32, end int, fr *rot, ec *EndCondition, member int32) int {
	pt := &ms.points[p]
	var offset Vec3
	if ec != nil {
		offset = ec.Offset
	}
	first := nc
	r0 := 6 * end
	for d := 0; d < 6; d++ {
		sl := 6*int(p) + d
		if ms.state[sl] != slotFree {
			continue
		}
		c := &cols[nc]
		*c = column{slot: int32(sl)}
		if d < 3 {
			t := fr.apply(pt.frame[d])
			c.c[r0], c.c[r0+1], c.c[r0+2] = t[0], t[1], t[2]
		} else {
			ax := pt.frame[d-3]
			t := fr.apply(ax)
			c.c[r0+3], c.c[r0+4], c.c[r0+5] = t[0], t[1], t[2]
			if !offset.isZero() {
				u := fr.apply(ax.cross(offset))
				c.c[r0], c.c[r0+1], c.c[r0+2] = u[0], u[1], u[2]
			}
		}
		nc++
	}
	if ec == nil {
		return nc
	}
	var inPlane [6]bool
	if ms.plane {
		inPlane = ms.localInPlane(fr)
	}
	group := int32(-1)
	for r := 0; r < 6; r++ {
		if !ec.Released[r] || math.IsInf(ec.Stiffness[r], 1) || (ms.plane && !inPlane[r]) {
			continue
		}
		// The local degree of freedom r becomes its own unknown q; the node
		// keeps only the spring across the release, ½k(q − c_r·u)².
		if group < 0 {
			group = int32(ms.nGroups)
			ms.nGroups++
		}
		q := int32(len(ms.state))
		ms.state = append(ms.state, slotFree)
		ms.group = append(ms.group, group)
		ms.pseudo = append(ms.pseudo, pseudoSlot{member: member, end: int8(end), dof: int8(r)})
		var ss []int32
		var sc []float64
		k := ec.Stiffness[r]
		if k > 0 {
			ss = append(ss, q)
			sc = append(sc, 1)
		}
		for j := first; j < nc; j++ {
			v := cols[j].c[r0+r]
			cols[j].c[r0+r] = 0
			if k > 0 && v != 0 {
				ss = append(ss, cols[j].slot)
				sc = append(sc, -v)
			}
		}
		if k > 0 {
			ms.addSpring(k, ss, sc)
		}
		cols[nc] = column{slot: q}
		cols[nc].c[r0+r] = 1
		nc++
	}
	return nc
}

// localInPlane reports which local degrees of freedom of a member with
// frame fr act in the plane of a plane model (validated: local y or z is
// normal to the plane).
func (ms *mesh) localInPlane(fr *rot) [6]bool {
	n := ms.planeRot[2]
	if math.Abs(fr[1].dot(n)) > 0.5 { // y normal: w and ry act in the plane
		return [6]bool{true, false, true, false, true, false}
	}
	return [6]bool{true, true, false, false, false, true}
}

func (ms *mesh) addElement(member int32, length float64, fr rot, cols []column) {
	off := int32(len(ms.slots))
	for i := range cols {
		ms.slots = append(ms.slots, cols[i].slot)
		ms.coef = append(ms.coef, cols[i].c[:]...)
	}
	ms.elems = append(ms.elems, element{member: member, length: length, frame: fr, off: off, m: int32(len(cols))})
}

func (ms *mesh) addSpring(k float64, slots []int32, c []float64) {
	off := int32(len(ms.springSlots))
	ms.springSlots = append(ms.springSlots, slots...)
	ms.springCoef = append(ms.springCoef, c...)
	ms.springs = append(ms.springs, spring{k: k, off: off, m: int32(len(slots))})
}

// restrainUnstiffened restrains free slots that no element or spring
// reaches (for example the rotations of a node where every member is
// pinned): they are uncoupled zero rows, and restraining them changes
// nothing but the solvability.
func (ms *mesh) restrainUnstiffened(m *Model) {
	touched := make([]bool, len(ms.state))
	for _, e := range ms.elems {
		for j := int32(0); j < e.m; j++ {
			col := ms.coef[12*(e.off+j) : 12*(e.off+j+1)]
			for _, v := range col {
				if math.Abs(v) > 1e-12 {
					touched[ms.slots[e.off+j]] = true
					break
				}
			}
		}
	}
	for _, s := range ms.springs {
		for j := int32(0); j < s.m; j++ {
			touched[ms.springSlots[s.off+j]] = true
		}
	}
	const maxListed = 12
	for p := range ms.points {
		var names []string
		for d := 0; d < 6; d++ {
			sl := 6*p + d
			if ms.state[sl] == slotFree && !touched[sl] {
				ms.state[sl] = slotFixed
				ms.nAuto++
				names = append(names, dofName(d))
			}
		}
		if names == nil {
			continue
		}
		if len(ms.restraint) >= maxListed {
			ms.moreAuto = true
			continue
		}
		pt := &ms.points[p]
		var s string
		if pt.node >= 0 {
			s = where("node", int(pt.node), m.Nodes[pt.node].ID)
		} else {
			s = where("member", int(pt.member), m.Members[pt.member].ID) + " interior point " + strconv.Itoa(int(pt.k))
		}
		ms.restraint = append(ms.restraint, s+" "+strings.Join(names, " ")+" ("+pt.axes+" axes)")
	}
}

// validate checks m and sets up the plane of a plane model.
func validate(m *Model, ms *mesh) error {
	if len(m.Nodes) == 0 {
		return &InputError{Item: "model", Index: -1, Msg: "no nodes"}
	}
	if m.Plane != nil {
		f, ok := m.Plane.frame()
		if !ok {
			return &InputError{Item: "model", Index: -1, Msg: "plane axes are degenerate (X parallel to Z, zero or not finite)"}
		}
		ms.plane, ms.planeRot = true, f
	}
	var lo, hi Vec3
	for i := range m.Nodes {
		nd := &m.Nodes[i]
		if !nd.Pos.finite() {
			return &InputError{Item: "node", Index: i, ID: nd.ID, Msg: "position is not finite"}
		}
		for k := 0; k < 3; k++ {
			if i == 0 || nd.Pos[k] < lo[k] {
				lo[k] = nd.Pos[k]
			}
			if i == 0 || nd.Pos[k] > hi[k] {
				hi[k] = nd.Pos[k]
			}
		}
		if s := nd.Support; s != nil {
			for d := 0; d < 6; d++ {
				if k := s.Stiffness[d]; math.IsNaN(k) || k < 0 {
					return &InputError{Item: "node", Index: i, ID: nd.ID, Msg: "support stiffness " + dofName(d) + " = " + ftoa(k) + ": want ≥ 0"}
				}
			}
			if s.Axes != nil {
				f, ok := s.Axes.frame()
				if !ok {
					return &InputError{Item: "node", Index: i, ID: nd.ID, Msg: "support axes are degenerate"}
				}
				if ms.plane && !hasNormalAxis(&f, ms.planeRot[2]) {
					return &InputError{Item: "node", Index: i, ID: nd.ID, Msg: "support axes have no axis normal to the plane of the model"}
				}
			}
		}
	}
	size := hi.sub(lo).norm()
	tol := inPlaneTol * math.Max(size, 1)
	if ms.plane {
		n := ms.planeRot[2]
		for i := range m.Nodes {
			if d := m.Nodes[i].Pos.sub(m.Nodes[0].Pos).dot(n); math.Abs(d) > tol {
				return &InputError{Item: "node", Index: i, ID: m.Nodes[i].ID, Msg: "lies " + ftoa(d) + " mm out of the plane of the model"}
			}
		}
	}
	for i := range m.Members {
		if err := validateMember(m, ms, i, tol); err != nil {
			return err
		}
	}
	for i := range m.Combinations {
		c := &m.Combinations[i]
		if len(c.Compression) != len(m.Members) {
			return &InputError{Item: "combination", Index: i, ID: c.Name, Msg: "has " + strconv.Itoa(len(c.Compression)) + " axial forces for " + strconv.Itoa(len(m.Members)) + " members"}
		}
		for j, n := range c.Compression {
			if math.IsNaN(n) || math.IsInf(n, 0) {
				return &InputError{Item: "combination", Index: i, ID: c.Name, Msg: "axial force of " + where("member", j, m.Members[j].ID) + " is not finite"}
			}
		}
	}
	return nil
}

func validateMember(m *Model, ms *mesh, i int, tol float64) error {
	mb := &m.Members[i]
	bad := func(msg string) error { return &InputError{Item: "member", Index: i, ID: mb.ID, Msg: msg} }
	for _, n := range mb.Nodes {
		if n < 0 || n >= len(m.Nodes) {
			return bad("node index " + strconv.Itoa(n) + " out of range")
		}
	}
	if mb.Nodes[0] == mb.Nodes[1] {
		return bad("starts and ends at the same node")
	}
	if mb.Elements < 0 {
		return bad("negative number of elements")
	}
	props := []struct {
		name string
		v    float64
		need bool
	}{
		{"E", mb.E, true}, {"A", mb.A, true},
		{"Iy", mb.Iy, !ms.plane}, {"Iz", mb.Iz, !ms.plane},
		{"G", mb.G, !ms.plane}, {"J", mb.J, !ms.plane},
	}
	for _, p := range props {
		if math.IsNaN(p.v) || math.IsInf(p.v, 0) || p.v < 0 || (p.need && p.v == 0) {
			return bad(p.name + " = " + ftoa(p.v) + ": want a positive finite value")
		}
	}
	for e := 0; e < 2; e++ {
		ec := &mb.Ends[e]
		if !ec.Offset.finite() {
			return bad("end offset is not finite")
		}
		for d := 0; d < 6; d++ {
			if k := ec.Stiffness[d]; math.IsNaN(k) || k < 0 {
				return bad("release stiffness " + dofName(d) + " = " + ftoa(k) + ": want ≥ 0")
			}
		}
	}
	if !mb.Axis.finite() {
		return bad("axis is not finite")
	}
	pa := m.Nodes[mb.Nodes[0]].Pos.add(mb.Ends[0].Offset)
	pb := m.Nodes[mb.Nodes[1]].Pos.add(mb.Ends[1].Offset)
	if pb.sub(pa).norm() <= tol {
		return bad("has zero length")
	}
	fr, _, ok := memberFrame(pa, pb, ms.memberAxis(mb, pa, pb))
	if !ok {
		return bad("axis is parallel to the member")
	}
	if ms.plane {
		n := ms.planeRot[2]
		for e := 0; e < 2; e++ {
			if math.Abs(mb.Ends[e].Offset.dot(n)) > tol {
				return bad("end offset leaves the plane of the model")
			}
		}
		if !hasNormalAxis(&fr, n) || math.Abs(fr[0].dot(n)) > 1e-6 {
			return bad("local y or z must be normal to the plane of the model")
		}
		in := ms.localInPlane(&fr)
		var ip float64
		if in[4] {
			ip = mb.Iy
		} else {
			ip = mb.Iz
		}
		if !(ip > 0) {
			return bad("in-plane second moment of area is zero")
		}
	}
	return nil
}

// hasNormalAxis reports whether one axis of f is parallel to n.
func hasNormalAxis(f *rot, n Vec3) bool {
	for k := 0; k < 3; k++ {
		if math.Abs(math.Abs(f[k].dot(n))-1) < 1e-6 {
			return true
		}
	}
	return false
}

func ftoa(v float64) string { return strconv.FormatFloat(v, 'g', 6, 64) }
