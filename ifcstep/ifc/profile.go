package ifc

import (
	"errors"
	"math"
	"strings"

	"swaygate/checks"
	"swaygate/checks/section"
	"swaygate/ifcstep"
)

// profileInfo is a profile definition mapped to a section shape, with its
// properties.
type profileInfo struct {
	id    uint32
	name  string // ProfileName
	shape section.Shape
	props *section.Properties // nil when unknown
	// rot is the rotation (rad) of the shape's x axis in the profile's
	// coordinate system (the parameterized profile's Position).
	rot float64
	// problem, when not empty, says why there are no properties
	// (CodeUnsupportedProfile or CodeMissingSection).
	code, msg string
	// fromModel: the properties (or some of them) came from the model's
	// profile properties.
	fromModel bool
	// differs lists model-given values that differ from the computed ones.
	differs string
}

// profile maps a profile definition to its shape and properties (cached).
func (x *extractor) profile(in ifcstep.Instance) *profileInfo {
	if p, ok := x.profiles[in.ID()]; ok {
		return p
	}
	p := &profileInfo{id: in.ID(), name: text(in.Attr(pProfileName))}
	x.profiles[in.ID()] = p
	shape, rot, err := x.shapeOf(in, 0)
	switch {
	case err != nil:
		var ue unsupportedError
		if errors.As(err, &ue) {
			p.code = checks.CodeUnsupportedProfile
		} else {
			p.code = checks.CodeMissingSection
		}
		p.msg = "profile " + ref(in) + describeProfile(p.name) + ": " + err.Error()
	default:
		p.shape, p.rot = shape, rot
		props, err := shape.Properties()
		if err != nil {
			p.code = checks.CodeMissingSection
			p.msg = "profile " + ref(in) + describeProfile(p.name) + ": " + err.Error()
			p.shape = nil
		} else {
			if props.Profile == "" {
				props.Profile = p.name
			}
			props.Source = "computed"
			p.props = &props
		}
	}
	x.applyProfileProperties(in, p)
	return p
}

func describeProfile(name string) string {
	if name == "" {
		return ""
	}
	return " (" + name + ")"
}

// unsupportedError marks a profile the extraction cannot map.
type unsupportedError string

func (e unsupportedError) Error() string { return string(e) }

// shapeOf maps a profile definition to a shape of checks/section. rot is the
// rotation of the shape's x axis given by the profile's Position.
func (x *extractor) shapeOf(in ifcstep.Instance, depth int) (section.Shape, float64, error) {
	if depth > 8 {
		return nil, 0, errors.New("derived profiles nested too deep")
	}
	L := func(i int) float64 {
		v, ok := in.Attr(i).Real()
		if !ok {
			return 0
		}
		return v * x.lengthFactor
	}
	A := func(i int) float64 {
		v, ok := in.Attr(i).Real()
		if !ok {
			return 0
		}
		return v * x.angleFactor
	}
	has := func(i int) bool { return i >= 0 && !in.Attr(i).IsUnset() }
	name := text(in.Attr(pProfileName))
	t := in.Type()
	if pt, ok := in.Attr(0).Enum(); ok && pt == "CURVE" {
		return nil, 0, unsupportedError("a CURVE profile (open, no area)")
	}
	var rot float64
	if strings.HasSuffix(t, "PROFILEDEF") && t != "IFCARBITRARYCLOSEDPROFILEDEF" && t != "IFCARBITRARYPROFILEDEFWITHVOIDS" &&
		t != "IFCDERIVEDPROFILEDEF" && t != "IFCMIRROREDPROFILEDEF" && t != "IFCCOMPOSITEPROFILEDEF" {
		if pos, ok := x.deref(in, in.Attr(pProfilePos)); ok {
			_, xa, ok := x.readPlacement2D(pos)
			if !ok {
				return nil, 0, errors.New("unreadable Position " + ref(pos))
			}
			rot = math.Atan2(xa[1], xa[0])
		}
	}
	s := x.s
	switch t {
	case "IFCISHAPEPROFILEDEF":
		sh := section.ISection{Name: name, B: L(s.iW), D: L(s.iD), Tw: L(s.iTw), Tf: L(s.iTf), R: L(s.iR)}
		if s.iEdge >= 0 {
			sh.FlangeEdgeRadius = L(s.iEdge)
		}
		if s.iSlope >= 0 {
			sh.FlangeSlope = A(s.iSlope)
		}
		return sh, rot, nil
	case "IFCASYMMETRICISHAPEPROFILEDEF":
		sh := section.AsymmetricI{Name: name, D: L(s.aiD), Tw: L(s.aiTw),
			BottomWidth: L(s.aiBW), BottomThickness: L(s.aiBT), BottomFillet: L(s.aiBR),
			TopWidth: L(s.aiTW), TopThickness: L(s.aiTT), TopFillet: L(s.aiTR)}
		// IFC: a missing top flange thickness or fillet equals the bottom one.
		if !has(s.aiTT) {
			sh.TopThickness = sh.BottomThickness
		}
		if !has(s.aiTR) {
			sh.TopFillet = sh.BottomFillet
		}
		if s.aiBE >= 0 {
			sh.BottomEdgeRadius, sh.BottomSlope = L(s.aiBE), A(s.aiBS)
			sh.TopEdgeRadius, sh.TopSlope = L(s.aiTE), A(s.aiTS)
		}
		return sh, rot, nil
	case "IFCRECTANGLEHOLLOWPROFILEDEF":
		return section.RHS{Name: name, B: L(pDim1), D: L(pDim2), T: L(pDim3), Ri: L(pDim4), Ro: L(pDim5)}, rot, nil
	case "IFCRECTANGLEPROFILEDEF":
		return section.Rect{Name: name, B: L(pDim1), D: L(pDim2)}, rot, nil
	case "IFCROUNDEDRECTANGLEPROFILEDEF":
		b, d, r := L(pDim1), L(pDim2), L(pDim3)
		if !(b > 0 && d > 0) || r < 0 || 2*r > math.Min(b, d) {
			return nil, 0, errors.New("invalid rounded rectangle dimensions")
		}
		return section.Polygon{Name: name, Outer: roundedRect(b, d, r)}, rot, nil
	case "IFCCIRCLEHOLLOWPROFILEDEF":
		return section.CHS{Name: name, D: 2 * L(pDim1), T: L(pDim2)}, rot, nil
	case "IFCCIRCLEPROFILEDEF":
		return section.Circle{Name: name, D: 2 * L(pDim1)}, rot, nil
	case "IFCTSHAPEPROFILEDEF":
		return section.Tee{Name: name, D: L(pDim1), B: L(pDim2), Tw: L(pDim3), Tf: L(pDim4), R: L(pDim5),
			FlangeEdgeRadius: L(pDim6), WebEdgeRadius: L(pDim7), WebSlope: A(pDim8), FlangeSlope: A(pDim9)}, rot, nil
	case "IFCLSHAPEPROFILEDEF":
		d := L(pDim1)
		b := d
		if has(pDim2) {
			b = L(pDim2)
		}
		if sl := A(pDim6); sl != 0 {
			return nil, 0, unsupportedError("angle with sloped legs (LegSlope " + ftoa(sl*180/math.Pi) + "°)")
		}
		return section.Angle{Name: name, D: d, B: b, T: L(pDim3), R: L(pDim4), EdgeRadius: L(pDim5)}, rot, nil
	case "IFCUSHAPEPROFILEDEF":
		return section.Channel{Name: name, D: L(pDim1), B: L(pDim2), Tw: L(pDim3), Tf: L(pDim4), R: L(pDim5),
			EdgeRadius: L(pDim6), FlangeSlope: A(pDim7)}, rot, nil
	case "IFCCSHAPEPROFILEDEF":
		return section.LippedChannel{Name: name, D: L(pDim1), B: L(pDim2), T: L(pDim3), Lip: L(pDim4), Ri: L(pDim5)}, rot, nil
	case "IFCZSHAPEPROFILEDEF":
		return section.Zed{Name: name, D: L(pDim1), B: L(pDim2), Tw: L(pDim3), Tf: L(pDim4), R: L(pDim5), EdgeRadius: L(pDim6)}, rot, nil
	case "IFCARBITRARYCLOSEDPROFILEDEF", "IFCARBITRARYPROFILEDEFWITHVOIDS":
		oc, ok := x.deref(in, in.Attr(pOuterCurve))
		if !ok {
			return nil, 0, errors.New("no outer curve")
		}
		outer, err := x.curvePoints(oc, 0)
		if err != nil {
			return nil, 0, err
		}
		poly := section.Polygon{Name: name, Outer: outer}
		if t == "IFCARBITRARYPROFILEDEFWITHVOIDS" {
			var cerr error
			list, _ := in.Attr(pInnerCurves).List()
			for _, v := range list {
				ic, ok := x.deref(in, v)
				if !ok {
					cerr = errors.New("unreadable inner curve")
					break
				}
				hole, err := x.curvePoints(ic, 0)
				if err != nil {
					cerr = err
					break
				}
				poly.Holes = append(poly.Holes, hole)
			}
			if cerr != nil {
				return nil, 0, cerr
			}
		}
		return poly, 0, nil
	case "IFCDERIVEDPROFILEDEF", "IFCMIRROREDPROFILEDEF":
		pp, ok := x.deref(in, in.Attr(pParentProfile))
		if !ok {
			return nil, 0, errors.New("no parent profile")
		}
		parent, prot, err := x.shapeOf(pp, depth+1)
		if err != nil {
			return nil, 0, err
		}
		if prot != 0 {
			parent = section.Transformed{Parent: parent, Rotation: prot}
		}
		tr := section.Transformed{Name: name, Parent: parent}
		if t == "IFCMIRROREDPROFILEDEF" {
			// Mirrored about the profile's y axis: x -> -x, which is the
			// reflection y -> -y followed by a half turn.
			tr.Mirror, tr.Rotation = true, math.Pi
			return tr, 0, nil
		}
		op, ok := x.deref(in, in.Attr(pDerivedOp))
		if !ok {
			return nil, 0, errors.New("no transformation operator")
		}
		if err := x.operator2D(op, &tr); err != nil {
			return nil, 0, err
		}
		return tr, 0, nil
	case "IFCCOMPOSITEPROFILEDEF":
		return nil, 0, unsupportedError("composite profile (IfcCompositeProfileDef) of several parts")
	}
	return nil, 0, unsupportedError("profile type " + entityName(t) + " is not supported")
}

// operator2D reads an IfcCartesianTransformationOperator2D into tr.
func (x *extractor) operator2D(op ifcstep.Instance, tr *section.Transformed) error {
	if op.Type() != "IFCCARTESIANTRANSFORMATIONOPERATOR2D" {
		return unsupportedError("transformation " + entityName(op.Type()) + " (non-uniform scaling) is not supported")
	}
	org, ok := x.deref(op, op.Attr(pOpOrigin))
	if !ok {
		return errors.New("operator without LocalOrigin")
	}
	o, ok := x.readPoint(org)
	if !ok {
		return errors.New("unreadable LocalOrigin")
	}
	tr.X, tr.Y = o[0], o[1]
	if s, ok := op.Attr(pOpScale).Real(); ok && s > 0 {
		tr.Scale = s
	}
	a1 := vec{1, 0, 0}
	if d, ok := x.deref(op, op.Attr(pOpAxis1)); ok {
		if a1, ok = x.readDir(d); !ok {
			return errors.New("unreadable Axis1")
		}
	}
	n := math.Hypot(a1[0], a1[1])
	if !(n > 0) {
		return errors.New("zero Axis1")
	}
	ax, ay := a1[0]/n, a1[1]/n
	tr.Rotation = math.Atan2(ay, ax)
	if d, ok := x.deref(op, op.Attr(pOpAxis2)); ok {
		a2, ok := x.readDir(d)
		if !ok {
			return errors.New("unreadable Axis2")
		}
		// Axis2 clockwise from Axis1: a mirrored system.
		if ax*a2[1]-ay*a2[0] < 0 {
			tr.Mirror = true
		}
	}
	return nil
}

// roundedRect is the outline of a rectangle b × d with corner radius r.
func roundedRect(b, d, r float64) []section.Point {
	if r <= 0 {
		return []section.Point{{X: -b / 2, Y: -d / 2}, {X: b / 2, Y: -d / 2}, {X: b / 2, Y: d / 2}, {X: -b / 2, Y: d / 2}}
	}
	var pts []section.Point
	cx, cy := b/2-r, d/2-r
	corners := [4][3]float64{{cx, -cy, -math.Pi / 2}, {cx, cy, 0}, {-cx, cy, math.Pi / 2}, {-cx, -cy, math.Pi}}
	for _, c := range corners {
		pts = append(pts, section.ArcPoints(c[0], c[1], r, c[2], c[2]+math.Pi/2, 18)...)
	}
	return pts
}

// applyProfileProperties uses the model's profile properties
// (Pset_ProfileMechanical in IFC4, IfcStructuralProfileProperties in IFC2X3):
// the properties computed from the dimensions win; the model's values fill
// what the dimensions cannot give (a profile that cannot be mapped, the
// torsion and warping constants of a polygon), and differences over 2 % are
// noted.
func (x *extractor) applyProfileProperties(in ifcstep.Instance, p *profileInfo) {
	pid, ok := x.idx.profileProps[in.ID()]
	if !ok {
		return
	}
	pp, ok := x.f.Get(pid)
	if !ok {
		return
	}
	x.mergeProfileProps(p, x.readProfileProps(pp))
}

// elementProfileProps applies IFC2X3 profile properties associated with the
// element itself (IfcRelAssociatesProfileProperties) to a copy of p (p may
// be nil: no profile at all).
func (x *extractor) elementProfileProps(p *profileInfo, id uint32) *profileInfo {
	pp, ok := x.f.Get(id)
	if !ok {
		return p
	}
	var cp profileInfo
	if p != nil {
		cp = *p
		if p.props != nil {
			pc := *p.props
			cp.props = &pc
		}
	} else {
		cp.id = id
		cp.name = text(pp.Attr(0)) // ProfileName
	}
	x.mergeProfileProps(&cp, x.readProfileProps(pp))
	return &cp
}

// mergeProfileProps applies model-given section values to p: the whole
// section when the dimensions give none, else the missing J and Iw, noting
// differences over 2 %.
func (x *extractor) mergeProfileProps(p *profileInfo, mv modelSection) {
	if !(mv.a > 0) && !(mv.iy > 0) {
		return
	}
	if p.props == nil {
		if !(mv.a > 0 && mv.iy > 0 && mv.iz > 0) {
			return
		}
		props := mv.properties(p.name)
		p.props = &props
		p.fromModel = true
		p.code, p.msg = "", ""
		return
	}
	pr := p.props
	var diffs []string
	cmp := func(label string, model, computed float64) {
		if model > 0 && computed > 0 && math.Abs(model-computed) > 0.02*computed {
			diffs = append(diffs, label+" "+ftoa(model)+" given, "+ftoa(computed)+" computed")
		}
	}
	ix, iy, _ := pr.AxisI()
	cmp("A (mm²)", mv.a, pr.A)
	cmp("I about the profile's x (mm⁴)", mv.iy, ix)
	cmp("I about the profile's y (mm⁴)", mv.iz, iy)
	if len(diffs) > 0 {
		p.differs = strings.Join(diffs, "; ")
	}
	if math.IsNaN(pr.J) && mv.j > 0 {
		pr.J = mv.j
		p.fromModel = true
	}
	if math.IsNaN(pr.Iw) && mv.iw > 0 {
		pr.Iw = mv.iw
		p.fromModel = true
	}
}

// modelSection holds section values given by the model (mm units).
type modelSection struct {
	a, iy, iz, iyz, j, iw float64
	zy, zz                float64 // minimum elastic moduli about profile x and y
}

// properties builds principal properties from model values; Y and Z of the
// property set are the profile's x and y (member local y and z).
func (m modelSection) properties(name string) section.Properties {
	nan := math.NaN()
	c, d := (m.iy+m.iz)/2, (m.iy-m.iz)/2
	r := math.Hypot(d, m.iyz)
	imaj, imin := c+r, c-r
	angle := 0.0
	if r > 0 {
		angle = 0.5 * math.Atan2(-2*m.iyz, m.iy-m.iz)
	}
	p := section.Properties{Profile: name, Shape: "MODEL", A: m.a, IMajor: imaj, IMinor: imin,
		RMajor: math.Sqrt(imaj / m.a), RMinor: math.Sqrt(imin / m.a), ZMajor: nan, ZMinor: nan, SMajor: nan, SMinor: nan,
		J: nan, Iw: nan, Angle: angle, Source: "model"}
	if m.iyz == 0 {
		if m.zy > 0 {
			p.ZMajor = m.zy
		}
		if m.zz > 0 {
			p.ZMinor = m.zz
		}
		if m.iz > m.iy {
			p.ZMajor, p.ZMinor = p.ZMinor, p.ZMajor
		}
	}
	if m.j > 0 {
		p.J = m.j
	}
	if m.iw > 0 {
		p.Iw = m.iw
	}
	return p
}

// readProfileProps reads the section values of an IfcProfileProperties
// (IFC4 property list) or an IFC2X3 IfcStructuralProfileProperties.
func (x *extractor) readProfileProps(pp ifcstep.Instance) modelSection {
	var m modelSection
	switch pp.Type() {
	case "IFCPROFILEPROPERTIES":
		props := x.properties(pp, pMatPropsProps)
		get := func(name string, q quantity) float64 {
			v, ok := props.number(x, name, q)
			if !ok {
				return 0
			}
			return v
		}
		m.a = get("CrossSectionArea", qArea)
		m.iy = get("MomentOfInertiaY", qInertia)
		m.iz = get("MomentOfInertiaZ", qInertia)
		m.iyz = get("MomentOfInertiaYZ", qInertia)
		m.j = get("TorsionalConstantX", qInertia)
		m.iw = get("WarpingConstant", qWarping)
		m.zy = get("MinimumSectionModulusY", qSecMod)
		m.zz = get("MinimumSectionModulusZ", qSecMod)
	case "IFCSTRUCTURALPROFILEPROPERTIES", "IFCSTRUCTURALSTEELPROFILEPROPERTIES", "IFCGENERALPROFILEPROPERTIES":
		t := pp.Type()
		get := func(attr string, q quantity) float64 {
			v, ok := x.measure(pp.Attr(x.s.pos(t, attr)), q, pp, ifcstep.Value{})
			if !ok {
				return 0
			}
			return v
		}
		m.a = get("CrossSectionArea", qArea)
		m.j = get("TorsionalConstantX", qInertia)
		m.iyz = get("MomentOfInertiaYZ", qInertia)
		m.iy = get("MomentOfInertiaY", qInertia)
		m.iz = get("MomentOfInertiaZ", qInertia)
		m.iw = get("WarpingConstant", qWarping)
		m.zy = get("MinimumSectionModulusY", qSecMod)
		m.zz = get("MinimumSectionModulusZ", qSecMod)
	}
	return m
}
