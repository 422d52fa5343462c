package ifc

import (
	"strings"

	"swaygate/ifcstep"
)

// extrusion is an IfcExtrudedAreaSolid found in a body representation,
// expressed in the element's object coordinates.
type extrusion struct {
	solid   ifcstep.Instance
	profile ifcstep.Instance
	plane   frame   // the profile's xy plane (the solid's Position, through mapped items)
	dir     vec     // unit extrusion direction
	depth   float64 // mm
	tapered bool
}

// bodyInfo is what the element's representations give.
type bodyInfo struct {
	extrusions []extrusion
	others     []string // kinds of other body items (Brep, Tessellation...)

	// The 'Axis' representation, read on demand by axisLine.
	axisRep   ifcstep.Instance
	axisItems ifcstep.Value
	axis      []vec // its polyline points, object coordinates (mm), once read
	axisRead  bool
}

// axisLine returns the points of the 'Axis' polyline (object coordinates),
// reading them the first time.
func (x *extractor) axisLine(b *bodyInfo) []vec {
	if !b.axisRead {
		b.axisRead = true
		if b.axisRep.ID() != 0 {
			b.axis = x.axisPoints(b.axisRep, b.axisItems)
		}
	}
	return b.axis
}

// body reads the element's body and axis representations from its
// Representation attribute (rep).
func (x *extractor) body(el ifcstep.Instance, rep ifcstep.Value) bodyInfo {
	var b bodyInfo
	pds, ok := x.deref(el, rep)
	if !ok {
		return b
	}
	var rb [4]ifcstep.Value
	reps := listOf(pds.Attr(pReps), rb[:])
	for _, rv := range reps {
		r, ok := x.deref(pds, rv)
		if !ok || r.Type() != "IFCSHAPEREPRESENTATION" {
			continue
		}
		var ab [4]ifcstep.Value
		vs := attrsOf(r, ab[:])
		id := text(at(vs, pRepID))
		switch {
		case strings.EqualFold(id, "axis"):
			if b.axisRep.ID() == 0 {
				b.axisRep, b.axisItems = r, at(vs, pRepItems)
			}
		case strings.EqualFold(id, "body"):
			x.walkItems(r, at(vs, pRepItems), identity, 1, 0, &b)
		case id == "":
			switch strings.ToLower(text(at(vs, pRepType))) {
			case "sweptsolid", "clipping", "csg", "mappedrepresentation", "advancedsweptsolid", "brep", "tessellation", "advancedbrep":
				x.walkItems(r, at(vs, pRepItems), identity, 1, 0, &b)
			}
		}
	}
	return b
}

// walkItems collects the extrusions among a representation's items, through
// mapped items (transformed) and boolean results (their first operand).
func (x *extractor) walkItems(rep ifcstep.Instance, items ifcstep.Value, tr frame, scale float64, depth int, b *bodyInfo) {
	if depth > 8 {
		return
	}
	var ib [4]ifcstep.Value
	for _, iv := range listOf(items, ib[:]) {
		it, ok := x.deref(rep, iv)
		if !ok {
			continue
		}
		x.walkItem(it, tr, scale, depth, b)
	}
}

func (x *extractor) walkItem(it ifcstep.Instance, tr frame, scale float64, depth int, b *bodyInfo) {
	if depth > 8 {
		return
	}
	switch t := it.Type(); t {
	case "IFCEXTRUDEDAREASOLID", "IFCEXTRUDEDAREASOLIDTAPERED":
		e := extrusion{solid: it, tapered: t == "IFCEXTRUDEDAREASOLIDTAPERED"}
		var ab [5]ifcstep.Value
		vs := attrsOf(it, ab[:])
		if len(vs) < 4 {
			b.others = append(b.others, "unreadable "+entityName(t))
			return
		}
		var ok bool
		if e.profile, ok = x.deref(it, vs[pSwept]); !ok {
			b.others = append(b.others, entityName(t)+" without a profile")
			return
		}
		pos := identity
		if pi, ok := x.deref(it, vs[pSolidPos]); ok {
			if pos, ok = x.readAxis2Placement(pi); !ok {
				b.others = append(b.others, entityName(t)+" with an unreadable Position")
				return
			}
		}
		di, ok := x.deref(it, vs[pExtrudedDir])
		var d vec
		if ok {
			d, ok = x.readDir(di)
		}
		if ok {
			d, ok = d.unit()
		}
		depthV, dok := realOf(vs[pDepth])
		if !ok || !dok || !(depthV > 0) {
			b.others = append(b.others, entityName(t)+" with an unreadable direction or depth")
			return
		}
		e.plane = tr.then(pos)
		e.dir = tr.dir(pos.dir(d))
		e.depth = depthV * x.lengthFactor * scale
		b.extrusions = append(b.extrusions, e)
	case "IFCMAPPEDITEM":
		var ab [2]ifcstep.Value
		vs := attrsOf(it, ab[:])
		src, ok := x.deref(it, at(vs, pMapSource))
		if !ok {
			return
		}
		var sb [2]ifcstep.Value
		svs := attrsOf(src, sb[:])
		origin := identity
		if oi, ok := x.deref(src, at(svs, pMapOrigin)); ok {
			if origin, ok = x.readAxis2Placement(oi); !ok {
				return
			}
		}
		target, s := identity, 1.0
		if ti, ok := x.deref(it, at(vs, pMapTarget)); ok {
			if target, s, ok = x.transform3D(ti); !ok {
				b.others = append(b.others, "a mapped item with a non-uniform or unreadable transformation")
				return
			}
		}
		rep, ok := x.deref(src, at(svs, pMapRep))
		if !ok {
			return
		}
		// The mapped items are placed by origin⁻¹ then the target operator
		// (ifc-facts §2.2); the scale applies to lengths.
		x.walkItems(rep, rep.Attr(pRepItems), tr.then(target).then(origin.inverse()), scale*s, depth+1, b)
	case "IFCBOOLEANCLIPPINGRESULT", "IFCBOOLEANRESULT":
		// End cuts: the section is that of the first operand.
		if first, ok := x.deref(it, it.Attr(pFirstOperand)); ok {
			x.walkItem(first, tr, scale, depth+1, b)
		}
	default:
		b.others = append(b.others, entityName(t))
	}
}

// inverse returns the inverse of a rigid frame.
func (f frame) inverse() frame {
	// Rows of the rotation are the columns of the inverse.
	g := frame{
		x: vec{f.x[0], f.y[0], f.z[0]},
		y: vec{f.x[1], f.y[1], f.z[1]},
		z: vec{f.x[2], f.y[2], f.z[2]},
	}
	g.o = g.dir(f.o).scale(-1)
	return g
}

// axisPoints reads the first polyline among an 'Axis' representation's
// items.
func (x *extractor) axisPoints(rep ifcstep.Instance, items ifcstep.Value) []vec {
	var ib [2]ifcstep.Value
	for _, iv := range listOf(items, ib[:]) {
		it, ok := x.deref(rep, iv)
		if !ok || it.Type() != "IFCPOLYLINE" {
			continue
		}
		var pb [4]ifcstep.Value
		list := listOf(it.Attr(pPolyPoints), pb[:])
		if len(list) < 2 {
			continue
		}
		pts := make([]vec, 0, len(list))
		for _, pv := range list {
			pi, ok := x.deref(it, pv)
			if !ok {
				return nil
			}
			p, ok := x.readPoint(pi)
			if !ok {
				return nil
			}
			pts = append(pts, p)
		}
		return pts
	}
	return nil
}
