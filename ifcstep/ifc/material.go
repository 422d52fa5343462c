package ifc

import (
	"strings"
	"unicode"

	"swaygate/ifcstep"
)

// matClass says whether a material is steel.
type matClass uint8

const (
	matUnknown matClass = iota // no material, or nothing recognisable
	matSteel
	matNotSteel
)

// Plausible ranges of steel properties (MPa). A value outside is ignored
// with a note: the structural sample of buildingSMART, for one, declares
// psi and writes E = 29 (meaning 29·10⁶ psi).
const (
	steelEMin, steelEMax   = 150e3, 250e3
	steelFyMin, steelFyMax = 150, 1000
	notSteelEMax           = 100e3 // a modulus below this is not steel (concrete, timber, aluminium)
)

// materialInfo is what a material association gives.
type materialInfo struct {
	names    []string
	class    matClass
	why      string // why not steel, or what is unknown
	e, fy    float64
	fu       float64
	grade    string
	fromProp bool // a value came from the model's material properties
	notes    []string

	// Profiles of an IfcMaterialProfileSet(Usage) or IfcMaterialProfile, in
	// order.
	profiles []uint32
	set      uint32 // the profile set, when there is one
	tapered  bool   // an IfcMaterialProfileSetUsageTapering
}

// material resolves an IfcRelAssociatesMaterial.RelatingMaterial (cached).
func (x *extractor) material(id uint32) *materialInfo {
	if m, ok := x.materials[id]; ok {
		return m
	}
	mi := &materialInfo{}
	x.materials[id] = mi
	in, ok := x.f.Get(id)
	if !ok {
		mi.why = "the material association points to a missing instance " + refID(id)
		return mi
	}
	var mats []ifcstep.Instance
	addMat := func(from ifcstep.Instance, v ifcstep.Value) {
		if m, ok := x.deref(from, v); ok && m.Type() == "IFCMATERIAL" {
			mats = append(mats, m)
		}
	}
	addProfile := func(mp ifcstep.Instance) {
		addMat(mp, mp.Attr(pMatProfMaterial))
		if p, ok := mp.Attr(pMatProfProfile).Ref(); ok {
			mi.profiles = append(mi.profiles, p)
		}
	}
	addSet := func(set ifcstep.Instance) {
		mi.set = set.ID()
		forRefs(set.Attr(pMatProfiles), func(pid uint32) {
			if mp, ok := x.getRef(set, set.Attr(pMatProfiles), pid); ok && mp.Type() == "IFCMATERIALPROFILE" {
				addProfile(mp)
			}
		})
	}
	switch in.Type() {
	case "IFCMATERIAL":
		mats = append(mats, in)
	case "IFCMATERIALLIST":
		list, _ := in.Attr(pMatListMats).List()
		for _, v := range list {
			addMat(in, v)
		}
	case "IFCMATERIALPROFILESETUSAGE", "IFCMATERIALPROFILESETUSAGETAPERING":
		if set, ok := x.deref(in, in.Attr(pMatProfileSet)); ok {
			addSet(set)
		}
		mi.tapered = in.Type() == "IFCMATERIALPROFILESETUSAGETAPERING"
	case "IFCMATERIALPROFILESET":
		addSet(in)
	case "IFCMATERIALPROFILE":
		addProfile(in)
	case "IFCMATERIALLAYERSETUSAGE", "IFCMATERIALLAYERSET", "IFCMATERIALLAYER":
		set := in
		if in.Type() == "IFCMATERIALLAYERSETUSAGE" {
			set, ok = x.deref(in, in.Attr(pLayerSetUsage))
		}
		if ok {
			if set.Type() == "IFCMATERIALLAYER" {
				addMat(set, set.Attr(pLayerMaterial))
			} else {
				list, _ := set.Attr(pLayerSetLayers).List()
				for _, v := range list {
					if l, ok := x.deref(set, v); ok {
						addMat(l, l.Attr(pLayerMaterial))
					}
				}
			}
		}
	case "IFCMATERIALCONSTITUENTSET":
		list, _ := in.Attr(pConstituents).List()
		for _, v := range list {
			if c, ok := x.deref(in, v); ok {
				addMat(c, c.Attr(pConstMaterial))
			}
		}
	case "IFCMATERIALCONSTITUENT":
		addMat(in, in.Attr(pConstMaterial))
	}
	x.classify(mi, mats)
	return mi
}

// classify decides whether the materials are steel and reads E and fy.
func (x *extractor) classify(mi *materialInfo, mats []ifcstep.Instance) {
	if len(mats) == 0 {
		mi.why = "no material is associated"
		return
	}
	var steel, other []string
	var steelMat ifcstep.Instance
	for _, m := range mats {
		name := text(m.Attr(x.s.matName))
		mi.names = append(mi.names, name)
		cat := ""
		if x.s.matCategory >= 0 {
			cat = text(m.Attr(x.s.matCategory))
		}
		props := x.materialProps(m)
		c, why := classifyMaterial(name, cat, props)
		switch c {
		case matSteel:
			steel = append(steel, name)
			if steelMat.ID() == 0 {
				steelMat = m
			}
		case matNotSteel:
			other = append(other, why)
		}
		if c != matNotSteel && props.e > 0 && props.e < notSteelEMax && c != matSteel {
			other = append(other, "material "+quote(name)+" has a modulus of "+ftoa(props.e)+" MPa")
		}
	}
	switch {
	case len(other) > 0 && len(steel) > 0:
		mi.class = matNotSteel
		mi.why = "composite of steel and other materials (" + strings.Join(other, "; ") + ")"
		return
	case len(other) > 0:
		mi.class = matNotSteel
		mi.why = strings.Join(other, "; ")
		return
	case len(steel) > 0:
		mi.class = matSteel
	default:
		mi.class = matUnknown
		mi.why = "material " + quote(strings.Join(mi.names, ", ")) + " is not recognisable as steel"
		steelMat = mats[0]
	}
	props := x.materialProps(steelMat)
	name := text(steelMat.Attr(x.s.matName))
	mi.grade = name
	if props.grade != "" {
		mi.grade = props.grade
	}
	if props.e > 0 {
		if props.e >= steelEMin && props.e <= steelEMax {
			mi.e, mi.fromProp = props.e, true
		} else {
			mi.notes = append(mi.notes, "the model's modulus of "+quote(name)+", "+ftoa(props.e)+" MPa, is not plausible for steel: ignored")
		}
	}
	if props.fy > 0 {
		if props.fy >= steelFyMin && props.fy <= steelFyMax {
			mi.fy, mi.fromProp = props.fy, true
		} else {
			mi.notes = append(mi.notes, "the model's yield stress of "+quote(name)+", "+ftoa(props.fy)+" MPa, is not plausible for steel: ignored")
		}
	}
	if props.fu > 0 && props.fu >= mi.fy && props.fu <= 2*steelFyMax {
		mi.fu = props.fu
	}
}

func quote(s string) string { return "'" + s + "'" }

// matProps are the values a material's properties give (MPa).
type matProps struct {
	e, fy, fu float64
	grade     string
	concrete  bool // compressive strength or a concrete property set
	wood      bool
}

// materialProps reads the properties of one IfcMaterial: IFC4
// IfcMaterialProperties (Pset_MaterialMechanical YoungModulus,
// Pset_MaterialSteel YieldStress, UltimateStress, StructuralGrade), IFC2X3
// IfcMechanicalSteelMaterialProperties and IfcExtendedMaterialProperties.
func (x *extractor) materialProps(m ifcstep.Instance) matProps {
	var mp matProps
	for _, pid := range x.idx.matProps[m.ID()] {
		in, ok := x.f.Get(pid)
		if !ok {
			continue
		}
		switch in.Type() {
		case "IFCMATERIALPROPERTIES", "IFCEXTENDEDMATERIALPROPERTIES":
			name, at := text(in.Attr(pMatPropsName)), pMatPropsProps
			if in.Type() == "IFCEXTENDEDMATERIALPROPERTIES" {
				name, at = text(in.Attr(pExtMatName)), pExtMatProps
			}
			ln := strings.ToLower(name)
			if strings.Contains(ln, "concrete") {
				mp.concrete = true
			}
			if strings.Contains(ln, "wood") || strings.Contains(ln, "timber") {
				mp.wood = true
			}
			props := x.properties(in, at)
			if _, ok := props.find("CompressiveStrength"); ok {
				mp.concrete = true
			}
			if v, ok := props.number(x, "YoungModulus", qModulus); ok && (mp.e == 0 || strings.EqualFold(name, "Pset_MaterialMechanical")) {
				mp.e = v
			}
			if v, ok := props.number(x, "YieldStress", qPressure); ok && (mp.fy == 0 || strings.EqualFold(name, "Pset_MaterialSteel")) {
				mp.fy = v
			}
			if v, ok := props.number(x, "UltimateStress", qPressure); ok && mp.fu == 0 {
				mp.fu = v
			}
			if g, ok := props.label("StructuralGrade"); ok && g != "" {
				mp.grade = g
			}
		case "IFCMECHANICALSTEELMATERIALPROPERTIES", "IFCMECHANICALMATERIALPROPERTIES", "IFCMECHANICALCONCRETEMATERIALPROPERTIES":
			if v, ok := x.measure(in.Attr(pMechE), qModulus, in, ifcstep.Value{}); ok && mp.e == 0 {
				mp.e = v
			}
			if in.Type() == "IFCMECHANICALSTEELMATERIALPROPERTIES" {
				if v, ok := x.measure(in.Attr(pMechFy), qPressure, in, ifcstep.Value{}); ok && mp.fy == 0 {
					mp.fy = v
				}
				if v, ok := x.measure(in.Attr(pMechFu), qPressure, in, ifcstep.Value{}); ok && mp.fu == 0 {
					mp.fu = v
				}
			}
			if in.Type() == "IFCMECHANICALCONCRETEMATERIALPROPERTIES" {
				mp.concrete = true
			}
		}
	}
	return mp
}

// Words that mark a material as not steel, and as steel (compared with the
// words of the material's name and category, lower case).
var (
	notSteelWords = map[string]string{
		"concrete": "concrete", "beton": "concrete", "béton": "concrete", "hormigon": "concrete", "hormigón": "concrete",
		"calcestruzzo": "concrete", "cement": "concrete", "precast": "concrete", "grout": "concrete",
		"timber": "timber", "wood": "timber", "holz": "timber", "hout": "timber", "bois": "timber", "glulam": "timber",
		"lumber": "timber", "plywood": "timber", "softwood": "timber", "hardwood": "timber", "clt": "timber", "lvl": "timber",
		"masonry": "masonry", "brick": "masonry", "blockwork": "masonry", "stone": "masonry", "mauerwerk": "masonry",
		"aluminium": "aluminium", "aluminum": "aluminium",
	}
	steelWords = map[string]bool{"steel": true, "stahl": true, "staal": true, "acier": true, "acero": true, "acciaio": true, "stål": true}
)

// classifyMaterial classifies one material by its name and category words,
// then by its properties. why explains a not-steel result.
func classifyMaterial(name, category string, p matProps) (matClass, string) {
	words := materialWords(name + " " + category)
	var kinds []string
	isSteel := false
	for _, w := range words {
		if k, ok := notSteelWords[w]; ok {
			kinds = appendUniq(kinds, k)
		}
		if steelWords[w] || isSteelGrade(w) {
			isSteel = true
		}
	}
	if len(kinds) > 0 {
		return matNotSteel, "material " + quote(name) + " is " + strings.Join(kinds, " and ")
	}
	if isSteel {
		return matSteel, ""
	}
	switch {
	case p.concrete:
		return matNotSteel, "material " + quote(name) + " has concrete properties (compressive strength)"
	case p.wood:
		return matNotSteel, "material " + quote(name) + " has timber properties"
	}
	return matUnknown, ""
}

func appendUniq(ss []string, s string) []string {
	for _, x := range ss {
		if x == s {
			return ss
		}
	}
	return append(ss, s)
}

// materialWords splits a name into lower-case words of letters and digits.
func materialWords(s string) []string {
	return strings.FieldsFunc(strings.ToLower(s), func(r rune) bool { return !unicode.IsLetter(r) && !unicode.IsDigit(r) })
}

// isSteelGrade recognises common structural steel grade designations:
// EN 10025 / 10210 / 10219 (S235, S355JR, S355J2H...), AS/NZS (300PLUS,
// 350L0, C350L0, C450L0, grade 250/300/350 with PLUS), ASTM (A36, A572,
// A992, A500, A1085), JIS (SS400, SM490), GB (Q235, Q345, Q355).
func isSteelGrade(w string) bool {
	digitsFrom := func(s string, i int) int {
		n := 0
		for i+n < len(s) && s[i+n] >= '0' && s[i+n] <= '9' {
			n++
		}
		return n
	}
	switch {
	case len(w) >= 4 && w[0] == 's' && digitsFrom(w, 1) == 3:
		return true // S235, S355JR, S460M
	case len(w) >= 4 && (w[0] == 'q') && digitsFrom(w, 1) == 3:
		return true
	case strings.HasPrefix(w, "ss") || strings.HasPrefix(w, "sm"):
		return len(w) >= 5 && digitsFrom(w, 2) == 3
	case w[0] == 'a' && digitsFrom(w, 1) >= 2:
		switch w[1:] {
		case "36", "572", "992", "500", "1085", "53", "913", "588", "529":
			return true
		}
	case w[0] == 'c' && digitsFrom(w, 1) == 3 && strings.HasSuffix(w, "l0"):
		return true // C350L0, C450L0
	case strings.HasSuffix(w, "plus") && digitsFrom(w, 0) == 3:
		return true // 300PLUS
	case strings.HasSuffix(w, "l0") && digitsFrom(w, 0) == 3:
		return true // 350L0
	}
	return false
}
