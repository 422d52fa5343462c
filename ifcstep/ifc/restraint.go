package ifc

import (
	"strings"

	"swaygate/checks"
	"swaygate/checks/effective"
	"swaygate/ifcstep"
)

// Our property sets (design §4.1).
const (
	psetColumnDesign  = "Swaygate_ColumnDesign"
	psetDesignActions = "Swaygate_DesignActions"
)

// psets gathers the property sets and quantity sets of a member: those of
// the occurrence first, then those of its type (relationships and the
// type's HasPropertySets).
type psets struct {
	occ, typ []ifcstep.Instance
}

func (x *extractor) memberPsets(c *candidate) psets {
	var p psets
	p.occ = make([]ifcstep.Instance, 0, len(c.psets))
	for _, id := range c.psets {
		if in, ok := x.f.Get(id); ok {
			p.occ = append(p.occ, in)
		}
	}
	if t := c.typeObj; t.ID() != 0 {
		for _, id := range x.idx.typePsets[t.ID()] {
			if in, ok := x.f.Get(id); ok {
				p.typ = append(p.typ, in)
			}
		}
		if x.s.typePsets >= 0 {
			forRefs(t.Attr(x.s.typePsets), func(id uint32) {
				if in, ok := x.getRef(t, t.Attr(x.s.typePsets), id); ok {
					p.typ = append(p.typ, in)
				}
			})
		}
	}
	return p
}

// named returns the properties of the sets called name, occurrence first
// (each property name taken from the first set that has it), and the first
// such set (zero when there is none).
func (x *extractor) named(sets []ifcstep.Instance, name string) (propList, ifcstep.Instance) {
	var out propList
	var at0 ifcstep.Instance
	n := 0
	for _, s := range sets {
		if s.Type() != "IFCPROPERTYSET" {
			continue
		}
		var ab [5]ifcstep.Value
		vs := attrsOf(s, ab[:])
		if !textIs(at(vs, pName), name) {
			continue
		}
		props := x.propertiesOf(s, at(vs, pPsetProps))
		n++
		if n == 1 {
			out, at0 = props, s
			continue
		}
		for _, p := range props {
			if _, dup := out.findValue(p.name); !dup {
				out = append(out, p)
			}
		}
	}
	return out, at0
}

// designNames are the per-axis properties of Swaygate_ColumnDesign.
var designNames = [2]struct{ sway, ke, braced, length, transverse string }{
	{"SwayMajor", "EffectiveLengthFactorMajor", "BracedEffectiveLengthFactorMajor", "BucklingLengthMajor", "TransverseLoadMajor"},
	{"SwayMinor", "EffectiveLengthFactorMinor", "BracedEffectiveLengthFactorMinor", "BucklingLengthMinor", "TransverseLoadMinor"},
}

// restraint reads Swaygate_ColumnDesign (occurrence, then type) into the
// member's axes. Problems found are added to m.Problems.
func (x *extractor) restraint(m *checks.Member, ps psets) {
	sets := ps.occ
	if len(ps.typ) > 0 {
		sets = append(append([]ifcstep.Instance{}, ps.occ...), ps.typ...)
	}
	props, set := x.named(sets, psetColumnDesign)
	if set.ID() == 0 {
		return // the engine reports missing-restraint per axis
	}
	problem := func(code, msg, axis string) {
		m.Problems = append(m.Problems, checks.Reason{Code: code, Message: msg, Axis: axis, Ref: ref(set)})
	}
	var ends [2]effective.End
	var endGiven [2]bool
	for k, name := range [2]string{"EndConditionBottom", "EndConditionTop"} {
		s, ok := props.label(name)
		if !ok {
			continue
		}
		endGiven[k] = true
		e, ok := effective.ParseEnd(strings.ToLower(strings.TrimSpace(s)))
		if !ok {
			problem(checks.CodeInvalidRestraint, psetColumnDesign+"."+name+" is "+quote(s)+": want fixed, pinned or free", "")
			endGiven[k] = false
			continue
		}
		ends[k] = e
	}
	for _, a := range checks.Axes {
		ax := &m.Axes[a]
		n := &designNames[a]
		axis := a.String()
		ax.Source = "property-set"
		sway, present, ok := props.boolean(n.sway)
		switch {
		case ok && sway:
			ax.Restraint = checks.Sway
		case ok:
			ax.Restraint = checks.Braced
		case present:
			problem(checks.CodeInvalidRestraint, psetColumnDesign+"."+n.sway+" is not a boolean", axis)
		}
		if ke, ok := props.number(x, n.ke, qNone); ok {
			if ke > 0 {
				ax.Ke = ke
			} else {
				ax.Ke = -1 // the engine reports invalid-restraint
				if ke == 0 {
					problem(checks.CodeInvalidRestraint, psetColumnDesign+"."+n.ke+" is 0", axis)
				}
			}
		} else if endGiven[0] || endGiven[1] {
			x.keFromEnds(ax, ends, endGiven, axis, problem)
		}
		if bke, ok := props.number(x, n.braced, qNone); ok {
			if bke > 0 {
				ax.BracedKe = bke
			} else {
				problem(checks.CodeInvalidRestraint, psetColumnDesign+"."+n.braced+" must be positive", axis)
			}
		}
		if bl, ok := props.number(x, n.length, qLength); ok {
			if bl > 0 {
				ax.BucklingLength = bl
			} else {
				problem(checks.CodeInvalidRestraint, psetColumnDesign+"."+n.length+" must be positive", axis)
			}
		}
		if t, _, ok := props.boolean(n.transverse); ok {
			ax.TransverseLoad = t
		}
	}
}

// keFromEnds sets ke from the idealised end conditions (standards-notes
// §1.2 via checks/effective) when no factor is given.
func (x *extractor) keFromEnds(ax *checks.AxisInput, ends [2]effective.End, given [2]bool, axis string, problem func(code, msg, axis string)) {
	if !given[0] || !given[1] {
		problem(checks.CodeInvalidRestraint, "only one end condition ("+psetColumnDesign+".EndConditionBottom/Top) is given: ke cannot be found", axis)
		return
	}
	if ax.Restraint == checks.RestraintUnknown {
		problem(checks.CodeInvalidRestraint, "end conditions are given but not whether the axis sways ("+psetColumnDesign+".Sway"+upperFirst(axis)+"): ke cannot be found", axis)
		return
	}
	ke, ok := effective.Idealised(x.opt.KeFamily, ends[0], ends[1], ax.Restraint == checks.Sway)
	if !ok {
		kind := "braced"
		if ax.Restraint == checks.Sway {
			kind = "sway"
		}
		problem(checks.CodeInvalidRestraint, "end conditions "+endName(ends[0])+"–"+endName(ends[1])+" of a "+kind+" axis have no finite ke (a mechanism, or a free end that cannot be braced)", axis)
		return
	}
	ax.Ke = ke
	ax.Source = "end-conditions"
	x.assume("ke from the end conditions of " + psetColumnDesign + " by the idealised table (" + familyName(x.opt.KeFamily) + ")")
}

func endName(e effective.End) string {
	switch e {
	case effective.Fixed:
		return "fixed"
	case effective.Pinned:
		return "pinned"
	case effective.Free:
		return "free"
	}
	return "unknown"
}

func familyName(f effective.Family) string {
	switch f {
	case effective.AISC:
		return "AISC 360 Table C-A-7.1 design values"
	case effective.Theoretical:
		return "theoretical values"
	}
	return "AS 4100 Figure 4.6.3.2 design values"
}

func upperFirst(s string) string {
	if s == "" {
		return s
	}
	return strings.ToUpper(s[:1]) + s[1:]
}
