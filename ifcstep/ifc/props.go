package ifc

import (
	"strings"

	"swaygate/ifcstep"
)

// prop is one IfcPropertySingleValue (or a quantity) of a set.
type prop struct {
	name  string
	val   ifcstep.Value
	unit  ifcstep.Value
	owner ifcstep.Instance
}

// propList is the single values of a property set, in order.
type propList []prop

// properties reads the IfcPropertySingleValue entries listed in attribute at
// of set (IfcPropertySet.HasProperties, IfcMaterialProperties.Properties...).
func (x *extractor) properties(set ifcstep.Instance, at int) propList {
	var out propList
	forRefs(set.Attr(at), func(id uint32) {
		in, ok := x.getRef(set, set.Attr(at), id)
		if !ok {
			return
		}
		switch in.Type() {
		case "IFCPROPERTYSINGLEVALUE":
			out = append(out, prop{name: text(in.Attr(pPropName)), val: in.Attr(pPropValue), unit: in.Attr(pPropUnit), owner: in})
		case "IFCQUANTITYLENGTH":
			out = append(out, prop{name: text(in.Attr(pPropName)), val: in.Attr(pQtyLenValue), unit: in.Attr(pQtyLenUnit), owner: in})
		}
	})
	return out
}

// find returns the property of that name (case-insensitive).
func (p propList) find(name string) (prop, bool) {
	for _, q := range p {
		if strings.EqualFold(q.name, name) {
			return q, true
		}
	}
	return prop{}, false
}

// number returns a numeric property converted to internal units (quantity q
// unless the value's measure type says otherwise).
func (p propList) number(x *extractor, name string, q quantity) (float64, bool) {
	pr, ok := p.find(name)
	if !ok || pr.val.IsUnset() {
		return 0, false
	}
	return x.measure(pr.val, q, pr.owner, pr.unit)
}

// boolean returns a boolean property (IFCBOOLEAN(.T.), .T., IFCLOGICAL).
func (p propList) boolean(name string) (value, present, ok bool) {
	pr, found := p.find(name)
	if !found || pr.val.IsUnset() {
		return false, found, false
	}
	b, ok := pr.val.Bool()
	return b, true, ok
}

// label returns a text property.
func (p propList) label(name string) (string, bool) {
	pr, ok := p.find(name)
	if !ok || pr.val.IsUnset() {
		return "", false
	}
	s, err := pr.val.Text()
	if err != nil && s == "" {
		return "", false
	}
	return s, true
}

// psetName returns the Name of a property set or element quantity.
func psetName(in ifcstep.Instance) string { return text(in.Attr(pName)) }
