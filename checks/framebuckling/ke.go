package framebuckling

import (
	"errors"
	"math"
	"sort"
	"strconv"

	"swaygate/checks"
	"swaygate/checks/effective"
	"swaygate/checks/frame"
)

// Sources of ke (KeOptions.From and checks.AxisInput.Source).
const (
	KeAuto            = "auto"
	KePropertySet     = "property-set"
	KeRestraintRatios = "restraint-ratios"
	KeBuckling        = "buckling"
)

// KeOptions choose how ApplyKe sets the members' effective length factors.
type KeOptions struct {
	// From: "" or KeAuto (the property set's ke where given, else the
	// restraint ratios), KePropertySet (nothing changes),
	// KeRestraintRatios (the restraint ratios wherever the frame gives
	// them), KeBuckling (sway axes: K from the buckling load factor).
	From string
	// Family chooses the βe factors and footing values (AS 4100 for AS 4100
	// and NZS 3404, AISC for AISC 360).
	Family effective.Family
	// Defaults are the user's restraint defaults: an axis without restraint
	// data takes its role (sway or braced) from them.
	Defaults [2]checks.RestraintDefault
	// Modulus is E where a member gives none (the rule set's default, MPa).
	Modulus float64
}

// ErrKeFrom is returned for an unknown KeOptions.From.
var ErrKeFrom = errors.New("framebuckling: unknown ke source (want auto, property-set, restraint-ratios or buckling)")

// Angles of the restraint-ratio method: a member within 20° of the column's
// axis is a column at the joint; a beam restrains the column in the plane of
// buckling when it lies within 20° of that plane.
var (
	cosColumn    = math.Cos(20 * math.Pi / 180)
	sinPlane     = math.Sin(20 * math.Pi / 180)
	axisParallel = math.Cos(45 * math.Pi / 180)
)

// ApplyKe sets AxisInput.Ke (and Source) of the members of m from the
// analytical frame as o.From asks, and returns the assumptions to record.
// An axis whose ke comes from the frame also gets the informational reason
// ke-from-frame with the values behind it.
func (a *Analysis) ApplyKe(m *checks.Model, o KeOptions) ([]string, error) {
	switch o.From {
	case "", KeAuto:
		o.From = KeAuto
	case KePropertySet:
		return nil, nil
	case KeRestraintRatios, KeBuckling:
	default:
		return nil, ErrKeFrom
	}
	at := a.adjacency()
	var set, kept, none, assumedRole int
	for i := range m.Members {
		mem := &m.Members[i]
		for _, ax := range checks.Axes {
			in := &mem.Axes[ax]
			role, assumed := in.Restraint, false
			if role == checks.RestraintUnknown && o.Defaults[ax].Restraint != checks.RestraintUnknown {
				role, assumed = o.Defaults[ax].Restraint, true
			}
			if role == checks.RestraintUnknown {
				continue
			}
			if o.From == KeAuto && in.Ke > 0 {
				continue
			}
			if o.From == KeBuckling && role != checks.Sway {
				continue
			}
			var ke float64
			var msg string
			var ok bool
			if o.From == KeBuckling {
				ke, msg, ok = a.bucklingKe(m, i, ax, o.Modulus)
			} else {
				ke, msg, ok = a.ratioKe(i, ax, role == checks.Sway, o.Family, at)
			}
			if !ok {
				if in.Ke > 0 {
					kept++
				} else {
					none++
				}
				continue
			}
			in.Ke, in.Source = ke, o.From
			if o.From == KeAuto {
				in.Source = KeRestraintRatios
			}
			if assumed {
				in.Restraint = role
				assumedRole++
				mem.Problems = append(mem.Problems, checks.Reason{Code: checks.CodeAssumedRestraint, Axis: ax.String(),
					Message: "no restraint data for this axis: " + role.String() + " from the user's default, ke from the analytical frame"})
			}
			mem.Problems = append(mem.Problems, checks.Reason{Code: checks.CodeKeFromFrame, Axis: ax.String(), Message: msg})
			set++
		}
	}
	var as []string
	switch o.From {
	case KeAuto:
		if set > 0 {
			as = append(as, "ke from the property set where it is given, else from the end-restraint ratios of the analytical frame ("+
				itoa(set)+" axes; "+familyText(o.Family)+")")
		}
	case KeRestraintRatios:
		as = append(as, "ke from the end-restraint ratios of the analytical frame (user choice, "+itoa(set)+" axes; "+familyText(o.Family)+")")
	case KeBuckling:
		as = append(as, "ke of sway axes from the frame's elastic buckling load factor, K = π·sqrt(E·I/(λ·N*))/L with the lowest λ "+
			"of the combinations in which the member is in compression (user choice, "+itoa(set)+" axes); braced axes keep their ke, "+
			"because the frame's lowest mode is not their own buckling")
	}
	if set > 0 || o.From != KeAuto {
		as = append(as, "restraint-ratio method: γ = Σ(EI/L) of the columns / Σ(βe·EI/L) of the beams rigidly connected at each column end in "+
			"the plane of buckling (members within 20° of the column's axis are columns, of the plane beams); a beam whose far end is "+
			"free is left out; the alignment-chart equations are solved for ke, sway or braced by the axis's flag")
	}
	if kept > 0 {
		as = append(as, itoa(kept)+" axes keep the property set's ke: the analytical frame gives no "+o.From+" value for them")
	}
	if none > 0 && o.From != KeAuto {
		as = append(as, itoa(none)+" axes have no ke: neither the property set nor the analytical frame gives one")
	}
	if assumedRole > 0 {
		as = append(as, itoa(assumedRole)+" axes without restraint data take sway or braced from the user's default and ke from the frame")
	}
	return as, nil
}

func familyText(f effective.Family) string {
	switch f {
	case effective.AISC:
		return "AISC Commentary App. 7 girder factors, footings G = 10 pinned, 1.0 fixed"
	case effective.Theoretical:
		return "theoretical beam factors, footings G = ∞ pinned, 0 fixed"
	}
	return "AS 4100 Table 4.6.3.4 βe, footings γ = 10 pinned, 0.6 fixed"
}

// memberEnd is one end of a frame member at a node.
type memberEnd struct{ member, end int }

// adjacency lists the member ends at each node (tie links excluded).
func (a *Analysis) adjacency() [][]memberEnd {
	m := a.In.Model
	at := make([][]memberEnd, len(m.Nodes))
	for j := 0; j < a.members; j++ {
		for e := 0; e < 2; e++ {
			n := m.Members[j].Nodes[e]
			at[n] = append(at[n], memberEnd{j, e})
		}
	}
	return at
}

// axes returns a frame member's local axes and length (checks/frame's
// conventions: x start to end, z along Axis made normal to x, default
// global Z, or global X for a vertical member).
func (a *Analysis) axes(j int) (x, y, z vec, l float64, ok bool) {
	m := a.In.Model
	mb := &m.Members[j]
	p0 := vec(m.Nodes[mb.Nodes[0]].Pos).add(vec(mb.Ends[0].Offset))
	p1 := vec(m.Nodes[mb.Nodes[1]].Pos).add(vec(mb.Ends[1].Offset))
	d := p1.sub(p0)
	l = d.norm()
	x, ok = d.unit()
	if !ok {
		return
	}
	zz := vec(mb.Axis)
	if zz.norm() < 1e-12 {
		zz = vec{0, 0, 1}
		if math.Abs(x[2]) > 1-1e-6 {
			zz = vec{1, 0, 0}
		}
	}
	z, ok = zz.sub(x.scale(zz.dot(x))).unit()
	if !ok {
		return
	}
	y = z.cross(x)
	return x, y, z, l, true
}

// iAbout returns member j's second moment about the unit axis b.
func (a *Analysis) iAbout(j int, y, z, b vec) float64 {
	mb := &a.In.Model.Members[j]
	cy, cz := y.dot(b), z.dot(b)
	return mb.Iy*cy*cy + mb.Iz*cz*cz
}

// releasedAbout reports whether end e of member j is hinged about b.
func (a *Analysis) releasedAbout(j, e int, x, y, z, b vec) bool {
	ec := &a.In.Model.Members[j].Ends[e]
	for r, v := range [3]vec{x, y, z} {
		if ec.Released[3+r] && ec.Stiffness[3+r] == 0 && math.Abs(v.dot(b)) > axisParallel {
			return true
		}
	}
	return false
}

// supportAbout returns whether node n's support fixes rotation about b, and
// its rotational spring about b (N·mm/rad).
func (a *Analysis) supportAbout(n int, b vec) (present, fixed bool, spring float64) {
	s := a.In.Model.Nodes[n].Support
	if s == nil {
		return false, false, 0
	}
	ax := [3]vec{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}
	if s.Axes != nil {
		zz, xx := vec(s.Axes.Z), vec(s.Axes.X)
		if u, ok := zz.unit(); ok {
			zz = u
		} else {
			zz = vec{0, 0, 1}
		}
		if xx.norm() < 1e-12 {
			xx = vec{1, 0, 0}
			if math.Abs(zz[0]) > 1-1e-6 {
				xx = vec{0, 1, 0}
			}
		}
		if u, ok := xx.sub(zz.scale(xx.dot(zz))).unit(); ok {
			ax = [3]vec{u, zz.cross(u), zz}
		}
	}
	for k, v := range ax {
		if math.Abs(v.dot(b)) > axisParallel {
			if s.Fixed[3+k] {
				return true, true, 0
			}
			spring = s.Stiffness[3+k]
		}
	}
	return true, false, spring
}

// ratioKe computes ke of checked member i's axis from the end-restraint
// ratios at its two ends.
func (a *Analysis) ratioKe(i int, ax checks.Axis, sway bool, fam effective.Family, at [][]memberEnd) (float64, string, bool) {
	if i >= len(a.In.Columns) || len(a.In.Columns[i]) == 0 {
		return 0, "", false
	}
	m := a.In.Model
	pieces := a.In.Columns[i]
	first, last := pieces[0], pieces[len(pieces)-1]
	x0, y0, z0, _, ok := a.axes(first)
	if !ok {
		return 0, "", false
	}
	b := y0 // bending about the major axis (local y, aligned by the reader)
	if ax == checks.Minor {
		b = z0
	}
	if pl := m.Plane; pl != nil && math.Abs(b.dot(vec(planeNormal(pl)))) < axisParallel {
		return 0, "", false // out of the plane of a plane frame
	}
	// The lower end of the first piece and the upper end of the last.
	eb := 0
	if x0[2] < 0 {
		eb = 1
	}
	xl, _, _, _, ok := a.axes(last)
	if !ok {
		return 0, "", false
	}
	et := 1
	if xl[2] < 0 {
		et = 0
	}
	nb, nt := m.Members[first].Nodes[eb], m.Members[last].Nodes[et]
	xcol, ok := vec(m.Nodes[nt].Pos).sub(vec(m.Nodes[nb].Pos)).unit()
	if !ok {
		return 0, "", false
	}
	gb, db, okb := a.endRatio(nb, first, eb, b, xcol, sway, fam, at)
	gt, dt, okt := a.endRatio(nt, last, et, b, xcol, sway, fam, at)
	if !okb || !okt {
		return 0, "", false
	}
	var ke float64
	var err error
	chart := "braced"
	if sway {
		chart = "sway"
		ke, err = effective.Sway(gb, gt)
	} else {
		ke, err = effective.Braced(gb, gt)
	}
	if err != nil || !(ke > 0) || math.IsInf(ke, 0) {
		return 0, "", false
	}
	msg := "ke = " + ftoa(ke, 4) + " from the " + chart + " alignment-chart equation with γ bottom = " + gtext(gb) + " (" + db +
		") and γ top = " + gtext(gt) + " (" + dt + ")"
	if len(pieces) > 1 {
		msg += "; the column spans " + itoa(len(pieces)) + " analytical members: joints between them are not counted"
	}
	return ke, msg, true
}

func gtext(g float64) string {
	if math.IsInf(g, 1) {
		return "∞"
	}
	return ftoa(g, 3)
}

// endRatio computes the end-restraint ratio at node n of a column whose
// frame member col meets n at end e, for bending about b.
func (a *Analysis) endRatio(n, col, e int, b, xcol vec, sway bool, fam effective.Family, at [][]memberEnd) (float64, string, bool) {
	m := a.In.Model
	cx, cy, cz, _, _ := a.axes(col)
	if a.releasedAbout(col, e, cx, cy, cz, b) {
		return math.Inf(1), "the column is hinged there", true
	}
	var cols []effective.Column
	var beams []effective.Beam
	for _, me := range at[n] {
		x, y, z, l, ok := a.axes(me.member)
		if !ok || a.releasedAbout(me.member, me.end, x, y, z, b) {
			continue
		}
		d := x
		if me.end == 1 {
			d = x.scale(-1)
		}
		mb := &m.Members[me.member]
		ib := a.iAbout(me.member, y, z, b)
		if !(ib > 0) {
			continue
		}
		if math.Abs(d.dot(xcol)) > cosColumn {
			cols = append(cols, effective.Column{E: mb.E, I: ib, L: l})
			continue
		}
		if math.Abs(d.dot(b)) > sinPlane {
			continue // not in the plane of buckling
		}
		far, ok := a.farEnd(me, b, at)
		if !ok {
			continue
		}
		beams = append(beams, effective.Beam{E: mb.E, I: ib, L: l, Far: far})
	}
	if len(cols) == 0 {
		return 0, "", false
	}
	present, fixed, spring := a.supportAbout(n, b)
	switch {
	case fixed:
		g, _ := effective.Footing(fam, effective.Fixed)
		return g, "fixed support: rigid footing", true
	case present && len(beams) == 0 && spring > 0:
		sum := 0.0
		for _, c := range cols {
			sum += c.E * c.I / c.L
		}
		k := spring / 2
		if sway {
			k = spring / 6
		}
		return sum / k, "rotational spring of the support", true
	case present && len(beams) == 0:
		g, _ := effective.Footing(fam, effective.Pinned)
		return g, "pinned support: pinned footing", true
	case len(beams) == 0:
		return math.Inf(1), "no beam rigidly connected in the plane of buckling", true
	}
	g, err := effective.Ratio(fam, cols, beams, sway)
	if err != nil {
		return 0, "", false
	}
	return g, itoa(len(cols)) + " column(s), " + itoa(len(beams)) + " beam(s)", true
}

// farEnd classifies the far end of beam me.member: pinned (released there,
// or only a support free to rotate), fixed (a support fixed in rotation), or
// rigidly connected to other members; ok false when it is free.
func (a *Analysis) farEnd(me memberEnd, b vec, at [][]memberEnd) (effective.FarEnd, bool) {
	m := a.In.Model
	fe := 1 - me.end
	f := m.Members[me.member].Nodes[fe]
	x, y, z, _, _ := a.axes(me.member)
	if a.releasedAbout(me.member, fe, x, y, z, b) {
		return effective.FarPinned, true
	}
	present, fixed, _ := a.supportAbout(f, b)
	if fixed {
		return effective.FarFixed, true
	}
	for _, o := range at[f] {
		if o.member == me.member {
			continue
		}
		ox, oy, oz, _, ok := a.axes(o.member)
		if ok && !a.releasedAbout(o.member, o.end, ox, oy, oz, b) {
			return effective.FarColumn, true
		}
	}
	if present {
		return effective.FarPinned, true
	}
	return 0, false
}

// bucklingKe returns the ke of checked member i's axis implied by the
// frame's buckling load factor: K = π·sqrt(E·I/(λ·N*))/L with the lowest λ
// of the combinations in which the member is in compression. A value below
// 1 on a sway axis is raised to 1, the least a sway member can have.
func (a *Analysis) bucklingKe(m *checks.Model, i int, ax checks.Axis, eDefault float64) (float64, string, bool) {
	if !a.Covered(i) {
		return 0, "", false
	}
	mem := &m.Members[i]
	if mem.Section == nil {
		return 0, "", false
	}
	if pl := a.Model.Plane; pl != nil && outOfPlane(mem.Axes[ax].Direction, vec(planeNormal(pl))) {
		return 0, "", false
	}
	e := mem.Material.E
	if !(e > 0) {
		e = eDefault
	}
	in := mem.Axes[ax]
	l := mem.Length
	if in.BucklingLength > 0 {
		l = in.BucklingLength
	}
	ii := mem.Section.IMajor
	if ax == checks.Minor {
		ii = mem.Section.IMinor
	}
	order := make([]int, len(a.Combinations))
	for c := range order {
		order[c] = c
	}
	sort.SliceStable(order, func(p, q int) bool { return a.lambda(order[p]) < a.lambda(order[q]) })
	for _, c := range order {
		lam := a.lambda(c)
		act := actionsFor(mem, a.Combinations[c])
		if act == nil || !(act.NStar > 0) || !(lam > 0) || math.IsInf(lam, 0) {
			continue
		}
		k := frame.EffectiveLengthFactor(e, ii, l, act.NStar, lam)
		if math.IsNaN(k) {
			continue
		}
		msg := "ke = π·sqrt(E·I/(λ·N*))/L = " + ftoa(k, 4) + " with λ = " + ftoa(lam, 4) + " (" + strconv.Quote(a.Combinations[c]) +
			"), N* = " + ftoa(act.NStar/1e3, 4) + " kN, E = " + ftoa(e, 6) + " MPa, I = " + ftoa(ii, 4) + " mm⁴, L = " + ftoa(l, 5) + " mm"
		if k < 1 {
			msg += "; raised to 1.0, the least for a sway member"
			k = 1
		}
		return k, msg, true
	}
	return 0, "", false
}
