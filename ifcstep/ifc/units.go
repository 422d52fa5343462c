package ifc

import (
	"math"
	"strings"

	"swaygate/ifcstep"
)

// quantity is a kind of value the extraction converts, with its internal
// unit (N, mm, MPa, N·mm, rad).
type quantity uint8

const (
	qNone quantity = iota // dimensionless: ratios, counts
	qLength
	qArea
	qForce
	qTorque
	qPressure // stress and modulus
	qModulus
	qInertia // second moment of area
	qSecMod  // section modulus
	qWarping // warping constant
	qAngle   // plane angle
	nQuantities
)

// quantityInfo gives, per quantity, the IFC unit type that fixes its unit,
// the factor from the SI unit to the internal one, the dimensions (length,
// mass, time exponents) of the SI unit and a name for messages.
var quantityInfo = [nQuantities]struct {
	unitType string
	toInt    float64
	dims     dims
	si       string
}{
	qNone:     {"", 1, dims{}, ""},
	qLength:   {"LENGTHUNIT", 1e3, dims{1, 0, 0}, "m"},
	qArea:     {"AREAUNIT", 1e6, dims{2, 0, 0}, "m²"},
	qForce:    {"FORCEUNIT", 1, dims{1, 1, -2}, "N"},
	qTorque:   {"TORQUEUNIT", 1e3, dims{2, 1, -2}, "N·m"},
	qPressure: {"PRESSUREUNIT", 1e-6, dims{-1, 1, -2}, "Pa"},
	qModulus:  {"MODULUSOFELASTICITYUNIT", 1e-6, dims{-1, 1, -2}, "Pa"},
	qInertia:  {"MOMENTOFINERTIAUNIT", 1e12, dims{4, 0, 0}, "m⁴"},
	qSecMod:   {"SECTIONMODULUSUNIT", 1e9, dims{3, 0, 0}, "m³"},
	qWarping:  {"WARPINGCONSTANTUNIT", 1e18, dims{6, 0, 0}, "m⁶"},
	qAngle:    {"PLANEANGLEUNIT", 1, dims{}, "rad"},
}

// measureQuantity maps the typed-value names of IfcMeasureValue to the
// quantity they carry.
var measureQuantity = map[string]quantity{
	"IFCLENGTHMEASURE":               qLength,
	"IFCPOSITIVELENGTHMEASURE":       qLength,
	"IFCNONNEGATIVELENGTHMEASURE":    qLength,
	"IFCAREAMEASURE":                 qArea,
	"IFCFORCEMEASURE":                qForce,
	"IFCTORQUEMEASURE":               qTorque,
	"IFCPRESSUREMEASURE":             qPressure,
	"IFCMODULUSOFELASTICITYMEASURE":  qModulus,
	"IFCMOMENTOFINERTIAMEASURE":      qInertia,
	"IFCSECTIONMODULUSMEASURE":       qSecMod,
	"IFCWARPINGCONSTANTMEASURE":      qWarping,
	"IFCPLANEANGLEMEASURE":           qAngle,
	"IFCPOSITIVEPLANEANGLEMEASURE":   qAngle,
	"IFCPOSITIVERATIOMEASURE":        qNone,
	"IFCRATIOMEASURE":                qNone,
	"IFCNORMALISEDRATIOMEASURE":      qNone,
	"IFCREAL":                        qNone,
	"IFCINTEGER":                     qNone,
	"IFCCOUNTMEASURE":                qNone,
	"IFCSHEARMODULUSMEASURE":         qModulus,
	"IFCLINEARFORCEMEASURE":          qNone, // not converted (not used)
	"IFCMASSPERLENGTHMEASURE":        qNone,
	"IFCTHERMALEXPANSIONCOEFFICIENT": qNone,
}

// dims are the exponents of length, mass and time.
type dims [3]int

func (d dims) add(e dims, n int) dims { return dims{d[0] + n*e[0], d[1] + n*e[1], d[2] + n*e[2]} }

// siPrefix is the factor of an IfcSIPrefix.
var siPrefix = map[string]float64{
	"EXA": 1e18, "PETA": 1e15, "TERA": 1e12, "GIGA": 1e9, "MEGA": 1e6, "KILO": 1e3, "HECTO": 1e2, "DECA": 1e1,
	"DECI": 1e-1, "CENTI": 1e-2, "MILLI": 1e-3, "MICRO": 1e-6, "NANO": 1e-9, "PICO": 1e-12, "FEMTO": 1e-15, "ATTO": 1e-18,
}

// siName gives the SI factor (to the coherent SI unit: kg for mass) and the
// dimensions of an IfcSIUnitName. The exponent says how the prefix applies:
// MILLI SQUARE_METRE is a square millimetre, (1e-3)².
var siName = map[string]struct {
	factor float64
	dims   dims
	exp    int
}{
	"METRE":        {1, dims{1, 0, 0}, 1},
	"SQUARE_METRE": {1, dims{2, 0, 0}, 2},
	"CUBIC_METRE":  {1, dims{3, 0, 0}, 3},
	"GRAM":         {1e-3, dims{0, 1, 0}, 1},
	"SECOND":       {1, dims{0, 0, 1}, 1},
	"NEWTON":       {1, dims{1, 1, -2}, 1},
	"PASCAL":       {1, dims{-1, 1, -2}, 1},
	"JOULE":        {1, dims{2, 1, -2}, 1},
	"RADIAN":       {1, dims{}, 1},
	"STERADIAN":    {1, dims{}, 1},
	"HERTZ":        {1, dims{0, 0, -1}, 1},
}

// unit is a resolved unit: the factor from it to the SI unit of its
// dimensions.
type unit struct {
	factor float64
	dims   dims
	name   string
	ok     bool
}

// units is the project's unit assignment.
type units struct {
	assigned [nQuantities]unit // from IfcUnitAssignment; ok false when absent
	toInt    [nQuantities]float64
	notes    []string // assumptions about the units, in order found
	noted    [nQuantities]bool
}

// readUnits reads the unit assignment of the (first) IfcProject.
func (x *extractor) readUnits() {
	u := &x.units
	var assign ifcstep.Instance
	projects := x.f.ByType("IFCPROJECT")
	if len(projects) > 1 {
		x.warn("multiple-projects", "the model has "+itoa(len(projects))+" IfcProject instances: the units of the first ("+ref(projects[0])+") are used", ref(projects[0]))
	}
	if len(projects) > 0 {
		if in, ok := x.deref(projects[0], projects[0].Attr(pProjectUnits)); ok {
			assign = in
		}
	}
	if assign.ID() == 0 {
		x.assume("the model has no unit assignment (IfcProject.UnitsInContext): SI units assumed (m, N, Pa)")
	}
	seen := map[quantity]bool{}
	if assign.ID() != 0 {
		list, _ := assign.Attr(0).List()
		for _, v := range list {
			in, ok := x.deref(assign, v)
			if !ok {
				continue
			}
			var ut string
			switch in.Type() {
			case "IFCSIUNIT", "IFCCONVERSIONBASEDUNIT", "IFCCONVERSIONBASEDUNITWITHOFFSET", "IFCCONTEXTDEPENDENTUNIT":
				ut, _ = in.Attr(1).Enum()
			case "IFCDERIVEDUNIT":
				ut, _ = in.Attr(x.s.derivedUnitType).Enum()
			default:
				continue
			}
			for q := qLength; q < nQuantities; q++ {
				if quantityInfo[q].unitType != ut {
					continue
				}
				un := x.resolveUnit(in, 0)
				if !un.ok {
					x.warn("unit-unreadable", "the "+strings.ToLower(ut)+" "+ref(in)+" cannot be read: SI ("+quantityInfo[q].si+") assumed", ref(in))
					continue
				}
				if un.dims != quantityInfo[q].dims {
					x.warn("unit-dimensions", "the "+strings.ToLower(ut)+" "+ref(in)+" ("+un.name+") does not have the dimensions of "+
						quantityInfo[q].si+": ignored, SI assumed", ref(in))
					continue
				}
				if seen[q] {
					continue
				}
				seen[q] = true
				u.assigned[q] = un
			}
		}
	}
	for q := qNone; q < nQuantities; q++ {
		f := 1.0
		if u.assigned[q].ok {
			f = u.assigned[q].factor
		}
		u.toInt[q] = f * quantityInfo[q].toInt
	}
}

// factor returns the factor that converts a value of quantity q in the
// project's units to the internal unit, and records the SI assumption the
// first time an unassigned unit type is used.
func (x *extractor) factor(q quantity) float64 {
	u := &x.units
	if q != qNone && !u.assigned[q].ok && !u.noted[q] {
		u.noted[q] = true
		x.assume("no " + quantityInfo[q].unitType + " in the model's unit assignment: values of that type read in " + quantityInfo[q].si + " (SI)")
		// A derived quantity without a unit while the units it derives from
		// are not SI is suspect: the exporter may have meant the coherent
		// unit of its own (pound-force inch, say).
		if base := derivedFrom[q]; base != nil {
			var odd []string
			for _, b := range base {
				if a := u.assigned[b]; a.ok && a.factor != 1 {
					odd = append(odd, strings.ToLower(quantityInfo[b].unitType)+" "+a.name)
				}
			}
			if len(odd) > 0 {
				x.warn("unit-missing", "no "+quantityInfo[q].unitType+" is assigned while the model's "+strings.Join(odd, " and ")+
					" are not SI: values of that type are read in "+quantityInfo[q].si+" (SI), which may not be what the exporter meant", "")
			}
		}
	}
	return u.toInt[q]
}

// derivedFrom names the quantities whose units a derived quantity's unit is
// usually built from.
var derivedFrom = map[quantity][]quantity{
	qTorque:  {qForce, qLength},
	qModulus: {qPressure},
	qInertia: {qLength},
	qSecMod:  {qLength},
	qWarping: {qLength},
	qArea:    {qLength},
}

// resolveUnit resolves an IfcNamedUnit or IfcDerivedUnit to its SI factor
// and dimensions.
func (x *extractor) resolveUnit(in ifcstep.Instance, depth int) unit {
	if depth > 8 {
		return unit{}
	}
	switch in.Type() {
	case "IFCSIUNIT":
		name, _ := in.Attr(3).Enum()
		sn, ok := siName[name]
		if !ok {
			return unit{}
		}
		f := sn.factor
		label := strings.ToLower(name)
		if p, ok := in.Attr(2).Enum(); ok {
			pf, ok := siPrefix[p]
			if !ok {
				return unit{}
			}
			f *= math.Pow(pf, float64(sn.exp))
			label = strings.ToLower(p) + " " + label
		}
		return unit{factor: f, dims: sn.dims, name: label, ok: true}
	case "IFCCONVERSIONBASEDUNIT", "IFCCONVERSIONBASEDUNITWITHOFFSET":
		name, _ := in.Attr(2).Text()
		mwu, ok := x.deref(in, in.Attr(3))
		if !ok {
			return unit{}
		}
		val, ok := mwu.Attr(0).Real()
		if !ok || !(val > 0) {
			return unit{}
		}
		base, ok := x.deref(mwu, mwu.Attr(1))
		if !ok {
			return unit{}
		}
		bu := x.resolveUnit(base, depth+1)
		if !bu.ok {
			return unit{}
		}
		return unit{factor: val * bu.factor, dims: bu.dims, name: name, ok: true}
	case "IFCDERIVEDUNIT":
		elems, err := in.Attr(0).List()
		if err != nil || len(elems) == 0 {
			return unit{}
		}
		out := unit{factor: 1, ok: true}
		var names []string
		for _, ev := range elems {
			el, ok := x.deref(in, ev)
			if !ok {
				return unit{}
			}
			e, ok := el.Attr(1).Int()
			if !ok {
				return unit{}
			}
			nu, ok := x.deref(el, el.Attr(0))
			if !ok {
				return unit{}
			}
			bu := x.resolveUnit(nu, depth+1)
			if !bu.ok {
				return unit{}
			}
			out.factor *= math.Pow(bu.factor, float64(e))
			out.dims = out.dims.add(bu.dims, int(e))
			n := bu.name
			if e != 1 {
				n += "^" + itoa(int(e))
			}
			names = append(names, n)
		}
		out.name = strings.Join(names, "·")
		return out
	}
	return unit{}
}

// measure converts a value written as a typed measure (IFCFORCEMEASURE(2.5))
// or a bare number of quantity q to internal units. An explicit unit (the
// Unit of an IfcPropertySingleValue, unitRef) overrides the project's.
func (x *extractor) measure(v ifcstep.Value, q quantity, owner ifcstep.Instance, unitRef ifcstep.Value) (float64, bool) {
	r, ok := v.Real()
	if !ok || math.IsNaN(r) || math.IsInf(r, 0) {
		return 0, false
	}
	if name, _, typed := v.Typed(); typed {
		if mq, known := measureQuantity[name]; known {
			q = mq
		}
	}
	if q == qNone {
		return r, true
	}
	if un, ok := x.deref(owner, unitRef); ok {
		if ru := x.resolveUnit(un, 0); ru.ok && ru.dims == quantityInfo[q].dims {
			return r * ru.factor * quantityInfo[q].toInt, true
		}
		x.warn("unit-unreadable", "the unit "+ref(un)+" of "+ref(owner)+" cannot be used for "+quantityInfo[q].si+": the project unit is used", ref(owner))
	}
	return r * x.factor(q), true
}
