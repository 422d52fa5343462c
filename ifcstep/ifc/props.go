package ifc

import (
	"bytes"
	"strings"

	"swaygate/ifcstep"
)

// prop is one IfcPropertySingleValue (or a quantity) of a set.
type prop struct {
	name  ifcstep.Value // the Name attribute, compared without decoding when plain
	val   ifcstep.Value
	unit  ifcstep.Value
	owner ifcstep.Instance
}

// propList is the single values of a property set, in order.
type propList []prop

// properties reads the IfcPropertySingleValue entries listed in attribute at
// of set (IfcPropertySet.HasProperties, IfcMaterialProperties.Properties...).
func (x *extractor) properties(set ifcstep.Instance, pos int) propList {
	return x.propertiesOf(set, set.Attr(pos))
}

// propertiesOf reads the property entries of list, an attribute of set.
func (x *extractor) propertiesOf(set ifcstep.Instance, list ifcstep.Value) propList {
	n := 0
	forRefs(list, func(uint32) { n++ })
	out := make(propList, 0, n)
	forRefs(list, func(id uint32) {
		in, ok := x.getRef(set, list, id)
		if !ok {
			return
		}
		var ab [5]ifcstep.Value
		switch in.Type() {
		case "IFCPROPERTYSINGLEVALUE":
			vs := attrsOf(in, ab[:])
			out = append(out, prop{name: at(vs, pPropName), val: at(vs, pPropValue), unit: at(vs, pPropUnit), owner: in})
		case "IFCQUANTITYLENGTH":
			vs := attrsOf(in, ab[:])
			out = append(out, prop{name: at(vs, pPropName), val: at(vs, pQtyLenValue), unit: at(vs, pQtyLenUnit), owner: in})
		}
	})
	return out
}

// find returns the property of that name (case-insensitive).
func (p propList) find(name string) (prop, bool) {
	for _, q := range p {
		if textIs(q.name, name) {
			return q, true
		}
	}
	return prop{}, false
}

// findValue returns the property whose name equals the string value name.
func (p propList) findValue(name ifcstep.Value) (prop, bool) {
	return p.find(text(name))
}

// textIs reports whether a string value equals name, ignoring ASCII case.
// A literal is compared in place, without decoding: escapes only make the
// written form longer than the text, so a literal of the name's length is
// compared byte by byte and only a longer one with escapes is decoded.
func textIs(v ifcstep.Value, name string) bool {
	raw := v.Raw()
	if v.Kind() != ifcstep.KindString || len(raw) < 2 {
		return v.Kind() == ifcstep.KindTyped && strings.EqualFold(text(v), name)
	}
	in := raw[1 : len(raw)-1]
	switch {
	case len(in) < len(name):
		return false
	case len(in) > len(name):
		if bytes.IndexByte(in, '\\') < 0 && bytes.IndexByte(in, '\'') < 0 && !hasHighByte(in) {
			return false
		}
		return strings.EqualFold(text(v), name)
	}
	for i := range in {
		a, b := in[i], name[i]
		if 'A' <= a && a <= 'Z' {
			a += 'a' - 'A'
		}
		if 'A' <= b && b <= 'Z' {
			b += 'a' - 'A'
		}
		if a != b {
			return false
		}
	}
	return true
}

func hasHighByte(b []byte) bool {
	for _, c := range b {
		if c >= 0x80 {
			return true
		}
	}
	return false
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

// psetIs reports whether a property set or element quantity is called name
// (ignoring case).
func psetIs(in ifcstep.Instance, name string) bool { return textIs(in.Attr(pName), name) }
