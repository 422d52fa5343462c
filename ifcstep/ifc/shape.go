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
	axis       []vec    // 'Axis' polyline points, object coordinates (mm)
}

// body reads the element's body and axis representations.
func (x *extractor) body(el ifcstep.Instance) bodyInfo {
	var b bodyInfo
	pds, ok := x.deref(el, el.Attr(pRepresentation))
	if !ok {
		return b
	}
	reps, _ := pds.Attr(pReps).List()
	var bodies []ifcstep.Instance
	for _, rv := range reps {
		rep, ok := x.deref(pds, rv)
		if !ok || rep.Type() != "IFCSHAPEREPRESENTATION" {
			continue
		}
		id := strings.ToLower(text(rep.Attr(pRepID)))
		switch id {
		case "axis":
			if b.axis == nil {
				b.axis = x.axisPoints(rep)
			}
		case "body":
			bodies = append(bodies, rep)
		case "":
			switch strings.ToLower(text(rep.Attr(pRepType))) {
			case "sweptsolid", "clipping", "csg", "mappedrepresentation", "advancedsweptsolid", "brep", "tessellation", "advancedbrep":
				bodies = append(bodies, rep)
			}
		}
	}
	for _, rep := range bodies {
		x.walkItems(rep, identity, 1, 0, &b)
	}
	return b
}

// walkItems collects the extrusions of a representation's items, through
// mapped items (transformed) and boolean results (their first operand).
func (x *extractor) walkItems(rep ifcstep.Instance, tr frame, scale float64, depth int, b *bodyInfo) {
	if depth > 8 {
		return
	}
	items, _ := rep.Attr(pRepItems).List()
	for _, iv := range items {
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
		vs, err := it.Attrs()
		if err != nil || len(vs) < 4 {
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
		depthV, dok := vs[pDepth].Real()
		if !ok || !dok || !(depthV > 0) {
			b.others = append(b.others, entityName(t)+" with an unreadable direction or depth")
			return
		}
		e.plane = tr.then(pos)
		e.dir = tr.dir(pos.dir(d))
		e.depth = depthV * x.lengthFactor * scale
		b.extrusions = append(b.extrusions, e)
	case "IFCMAPPEDITEM":
		src, ok := x.deref(it, it.Attr(pMapSource))
		if !ok {
			return
		}
		origin := identity
		if oi, ok := x.deref(src, src.Attr(pMapOrigin)); ok {
			if origin, ok = x.readAxis2Placement(oi); !ok {
				return
			}
		}
		target, s := identity, 1.0
		if ti, ok := x.deref(it, it.Attr(pMapTarget)); ok {
			if target, s, ok = x.transform3D(ti); !ok {
				b.others = append(b.others, "a mapped item with a non-uniform or unreadable transformation")
				return
			}
		}
		rep, ok := x.deref(src, src.Attr(pMapRep))
		if !ok {
			return
		}
		// The mapped items are placed by origin⁻¹ then the target operator
		// (ifc-facts §2.2); the scale applies to lengths.
		x.walkItems(rep, tr.then(target).then(origin.inverse()), scale*s, depth+1, b)
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

// axisPoints reads the first polyline of an 'Axis' representation.
func (x *extractor) axisPoints(rep ifcstep.Instance) []vec {
	items, _ := rep.Attr(pRepItems).List()
	for _, iv := range items {
		it, ok := x.deref(rep, iv)
		if !ok || it.Type() != "IFCPOLYLINE" {
			continue
		}
		list, _ := it.Attr(pPolyPoints).List()
		var pts []vec
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
		if len(pts) >= 2 {
			return pts
		}
	}
	return nil
}
