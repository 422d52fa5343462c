package ifc

import (
	"strings"
	"sync"

	"swaygate/ifcstep"
)

// candidate is an element that may become a member.
type candidate struct {
	inst         ifcstep.Instance
	entity       string // upper-case type
	analysisOnly bool   // an IfcStructuralCurveMember taken as the member

	typeObj   ifcstep.Instance // IfcRelDefinesByType.RelatingType, zero if none
	psets     []uint32         // property definitions of the occurrence
	material  uint32           // IfcRelAssociatesMaterial.RelatingMaterial of the occurrence
	structure uint32           // spatial container (of the element or its assembly)
	links     []uint32         // linked analytical members
	profProps uint32           // IFC2X3 IfcRelAssociatesProfileProperties of the occurrence
}

// relIndex holds the relationships the extraction follows, inverted from
// the relationship instances (the reader keeps no inverse attributes).
type relIndex struct {
	typePsets     map[uint32][]uint32 // type object -> property definitions (via relationships)
	typeMaterial  map[uint32]uint32   // type object -> RelatingMaterial
	parent        map[uint32]uint32   // IfcRelAggregates: part -> whole
	contained     map[uint32]uint32   // element -> spatial structure (only for elements of interest)
	reactions     map[uint32][]uint32 // analytical member -> curve reactions
	resultGroup   map[uint32]uint32   // reaction -> IfcStructuralResultGroup
	byFactor      map[uint32]bool     // load groups that IfcRelAssignsToGroupByFactor targets
	matProps      map[uint32][]uint32 // material -> IfcMaterialProperties (IFC4) or IFC2X3 property entities
	profileProps  map[uint32]uint32   // profile -> IfcProfileProperties / IfcStructuralProfileProperties
	elemProfProps map[uint32]uint32   // element -> IfcStructuralProfileProperties (IFC2X3)
}

// idSet is a set of instance ids as a bitmap: one bit per id up to the
// largest added (instance ids are dense in IFC files).
type idSet []uint64

func (s *idSet) add(id uint32) {
	w := int(id >> 6)
	if w >= len(*s) {
		n := make(idSet, max(w+1, 2*len(*s)))
		copy(n, *s)
		*s = n
	}
	(*s)[w] |= 1 << (id & 63)
}

func (s idSet) has(id uint32) bool {
	w := int(id >> 6)
	return w < len(s) && s[w]&(1<<(id&63)) != 0
}

// forRefs calls fn for every reference in a list value (or for a single
// reference). It reads the list's bytes directly, without allocating, and
// falls back to the reader's List for anything but plain "#N" items.
func forRefs(v ifcstep.Value, fn func(id uint32)) {
	switch v.Kind() {
	case ifcstep.KindRef:
		if id, ok := v.Ref(); ok {
			fn(id)
		}
		return
	case ifcstep.KindList:
	default:
		return
	}
	raw := v.Raw()
	p := 1
	for p < len(raw) {
		c := raw[p]
		switch {
		case c == ' ' || c == ',' || c == '\t' || c == '\r' || c == '\n':
			p++
		case c == ')':
			return
		case c == '#':
			p++
			var id uint64
			start := p
			for p < len(raw) && raw[p] >= '0' && raw[p] <= '9' {
				id = id*10 + uint64(raw[p]-'0')
				if id > 1<<32-1 {
					id = 0
					break
				}
				p++
			}
			if p == start || id == 0 {
				forRefsSlow(v, fn)
				return
			}
			fn(uint32(id))
		default:
			forRefsSlow(v, fn)
			return
		}
	}
}

// scan calls fn on every instance of ins, on x.workers goroutines for a
// long list (contiguous shares), and returns the hits fn appends, in the
// order of ins. fn may only read shared state.
func scan[T any](x *extractor, ins []ifcstep.Instance, fn func(in ifcstep.Instance, hits []T) []T) []T {
	n := min(x.workers, len(ins)/2048)
	if n <= 1 {
		var hits []T
		for _, in := range ins {
			hits = fn(in, hits)
		}
		return hits
	}
	parts := make([][]T, n)
	var wg sync.WaitGroup
	for k := range parts {
		lo, hi := k*len(ins)/n, (k+1)*len(ins)/n
		wg.Add(1)
		go func() {
			defer wg.Done()
			var hits []T
			for _, in := range ins[lo:hi] {
				hits = fn(in, hits)
			}
			parts[k] = hits
		}()
	}
	wg.Wait()
	var out []T
	for _, p := range parts {
		out = append(out, p...)
	}
	return out
}

// RefTypes returns the relationship types whose references Extract reads
// as the reader recorded them while indexing (ifcstep.Options.RefTypes),
// when it did, instead of decoding the relationships: the most numerous
// ones in a large model, each read once by a scan over all of its kind.
func RefTypes() []string {
	return []string{"IFCRELDEFINESBYPROPERTIES", "IFCRELCONNECTSSTRUCTURALACTIVITY", "IFCRELASSIGNSTOPRODUCT"}
}

// relation is a relationship instance as a scan reads it: its references
// as recorded while indexing (recorded), or decoded.
type relation struct {
	in       ifcstep.Instance
	refs     []ifcstep.Ref
	recorded bool
}

// ref returns attribute attr when it is a reference.
func (r relation) ref(attr int) (uint32, bool) {
	if !r.recorded {
		return r.in.Attr(attr).Ref()
	}
	for _, x := range r.refs {
		if int(x.Attr) == attr && x.Depth == 1 {
			return x.ID, true
		}
	}
	return 0, false
}

// each calls fn for attribute attr when it is a reference, or for each
// reference in its list, as forRefs does.
func (r relation) each(attr int, fn func(id uint32)) {
	if !r.recorded {
		forRefs(r.in.Attr(attr), fn)
		return
	}
	for _, x := range r.refs {
		if int(x.Attr) == attr && x.Depth <= 2 && !x.Typed {
			fn(x.ID)
		}
	}
}

// relsOf calls fn on every relationship of type typ and returns the hits it
// appends, in file order: from the references the reader recorded when it
// did (one cheap pass), else decoded on every worker (scan). fn may only
// read shared state.
func relsOf[T any](x *extractor, typ string, fn func(rel relation, hits []T) []T) []T {
	var hits []T
	if x.f.RefsOf(typ, func(in ifcstep.Instance, refs []ifcstep.Ref) {
		hits = fn(relation{in: in, refs: refs, recorded: true}, hits)
	}) {
		return hits
	}
	return scan(x, x.f.ByType(typ), func(in ifcstep.Instance, hits []T) []T {
		return fn(relation{in: in}, hits)
	})
}

func forRefsSlow(v ifcstep.Value, fn func(id uint32)) {
	list, err := v.List()
	if err != nil {
		return
	}
	for _, e := range list {
		if id, ok := e.Ref(); ok {
			fn(id)
		}
	}
}

// attrsOf decodes an instance's attributes into buf's storage (no
// allocation when they fit); nil on a syntax error. Decoding the attributes
// once costs one pass over the instance, where each Instance.Attr call
// passes over it again.
func attrsOf(in ifcstep.Instance, buf []ifcstep.Value) []ifcstep.Value {
	vs, err := in.AppendAttrs(buf[:0])
	if err != nil {
		return nil
	}
	return vs
}

// listOf decodes a list value into buf's storage; nil when v is not a list.
func listOf(v ifcstep.Value, buf []ifcstep.Value) []ifcstep.Value {
	if k := v.Kind(); k != ifcstep.KindList && k != ifcstep.KindTyped {
		return nil
	}
	vs, err := v.AppendList(buf[:0])
	if err != nil {
		return nil
	}
	return vs
}

// realOf returns a number value as float64: plain reals and integers are
// parsed in place (faster than the reader's general accessor), anything
// else (typed values) through Value.Real.
func realOf(v ifcstep.Value) (float64, bool) {
	if k := v.Kind(); k == ifcstep.KindReal || k == ifcstep.KindInt {
		if f, ok := parseReal(v.Raw()); ok {
			return f, true
		}
	}
	return v.Real()
}

// at returns vs[i], or an unset value when i is out of range.
func at(vs []ifcstep.Value, i int) ifcstep.Value {
	if i < 0 || i >= len(vs) {
		return ifcstep.Value{}
	}
	return vs[i]
}

// typeOf returns the upper-case type of instance id ("" when absent).
func (x *extractor) typeOf(id uint32) string {
	in, ok := x.f.Get(id)
	if !ok {
		return ""
	}
	return in.Type()
}

// candidates collects the elements to extract: IfcColumn and
// IfcColumnStandardCase, IfcMember of the chosen predefined types, or, in a
// model without physical columns, the vertical IfcStructuralCurveMembers.
func (x *extractor) candidates() []candidate {
	var out []candidate
	for _, t := range [...]string{"IFCCOLUMN", "IFCCOLUMNSTANDARDCASE"} {
		for _, in := range x.f.ByType(t) {
			out = append(out, candidate{inst: in, entity: t})
		}
	}
	nColumns := len(out)
	if len(x.opt.MemberTypes) > 0 {
		var members []candidate
		for _, t := range [...]string{"IFCMEMBER", "IFCMEMBERSTANDARDCASE"} {
			for _, in := range x.f.ByType(t) {
				members = append(members, candidate{inst: in, entity: t})
			}
		}
		x.indexTypes(members)
		all := false
		want := map[string]bool{}
		for _, t := range x.opt.MemberTypes {
			t = strings.ToUpper(strings.TrimSpace(t))
			if t == "*" {
				all = true
			}
			want[t] = true
		}
		for _, c := range members {
			pt := x.predefinedType(&c)
			if all || want[pt] {
				out = append(out, c)
			}
		}
		x.assume("IfcMember elements of predefined type " + strings.Join(x.opt.MemberTypes, ", ") + " are included as members")
	}
	if nColumns == 0 && len(out) == 0 {
		out = x.analysisCandidates()
	}
	return out
}

// predefinedType returns the element's predefined type: the type object's
// when it has one other than NOTDEFINED, else the occurrence's (IFC2X3
// occurrences have none); USERDEFINED gives the ObjectType text.
func (x *extractor) predefinedType(c *candidate) string {
	if c.typeObj.ID() != 0 && x.s.typePredef >= 0 {
		if e, ok := c.typeObj.Attr(x.s.typePredef).Enum(); ok && e != "NOTDEFINED" {
			if e == "USERDEFINED" {
				if t := strings.ToUpper(text(c.typeObj.Attr(x.s.typeElementType))); t != "" {
					return t
				}
			}
			return e
		}
	}
	if x.s.elemPredef >= 0 {
		if e, ok := c.inst.Attr(x.s.elemPredef).Enum(); ok {
			if e == "USERDEFINED" {
				if t := strings.ToUpper(text(c.inst.Attr(pObjectType))); t != "" {
					return t
				}
			}
			return e
		}
	}
	return "NOTDEFINED"
}

// indexTypes fills typeObj of the candidates from IfcRelDefinesByType.
func (x *extractor) indexTypes(cs []candidate) {
	if len(cs) == 0 {
		return
	}
	pos := make(map[uint32]int, len(cs))
	for i := range cs {
		pos[cs[i].inst.ID()] = i
	}
	for _, rel := range x.f.ByType("IFCRELDEFINESBYTYPE") {
		var hits []int
		forRefs(rel.Attr(pRelatedObjects), func(id uint32) {
			if i, ok := pos[id]; ok {
				hits = append(hits, i)
			}
		})
		if len(hits) == 0 {
			continue
		}
		t, ok := x.deref(rel, rel.Attr(pRelatingDef))
		if !ok {
			continue
		}
		for _, i := range hits {
			if cs[i].typeObj.ID() == 0 {
				cs[i].typeObj = t
			}
		}
	}
}

// buildIndex inverts the relationships that concern the candidates.
func (x *extractor) buildIndex(cs []candidate) {
	ix := &x.idx
	ix.typePsets = map[uint32][]uint32{}
	ix.typeMaterial = map[uint32]uint32{}
	ix.parent = map[uint32]uint32{}
	ix.contained = map[uint32]uint32{}
	ix.reactions = map[uint32][]uint32{}
	ix.resultGroup = map[uint32]uint32{}
	ix.byFactor = map[uint32]bool{}
	ix.matProps = map[uint32][]uint32{}
	ix.profileProps = map[uint32]uint32{}
	ix.elemProfProps = map[uint32]uint32{}

	pos := make(map[uint32]int, len(cs))
	for i := range cs {
		pos[cs[i].inst.ID()] = i
	}
	// The types of the candidates not typed yet (IfcMember candidates were
	// typed to read their predefined type).
	var untyped []candidate
	var back []int
	for i := range cs {
		if cs[i].typeObj.ID() == 0 && !cs[i].analysisOnly {
			untyped = append(untyped, cs[i])
			back = append(back, i)
		}
	}
	x.indexTypes(untyped)
	for k, i := range back {
		cs[i].typeObj = untyped[k].typeObj
	}
	types := map[uint32]bool{}
	var related idSet // candidates and their types
	for i := range cs {
		related.add(cs[i].inst.ID())
		if id := cs[i].typeObj.ID(); id != 0 {
			types[id] = true
			related.add(id)
		}
	}

	// Property sets and quantities (in a large model most relationships are
	// of other elements: the scan runs on every worker).
	type objSet struct{ obj, set uint32 }
	for _, h := range relsOf(x, "IFCRELDEFINESBYPROPERTIES", func(rel relation, hits []objSet) []objSet {
		var pset uint32
		rel.each(pRelatedObjects, func(id uint32) {
			if !related.has(id) {
				return
			}
			if pset == 0 {
				if p, ok := rel.ref(pRelatingDef); ok {
					pset = p
				}
			}
			if pset != 0 {
				hits = append(hits, objSet{id, pset})
			}
		})
		return hits
	}) {
		if i, isCand := pos[h.obj]; isCand {
			cs[i].psets = append(cs[i].psets, h.set)
		} else {
			ix.typePsets[h.obj] = append(ix.typePsets[h.obj], h.set)
		}
	}

	// Materials.
	for _, rel := range x.f.ByType("IFCRELASSOCIATESMATERIAL") {
		var mat uint32
		forRefs(rel.Attr(pRelatedObjects), func(id uint32) {
			i, isCand := pos[id]
			if !isCand && !types[id] {
				return
			}
			if mat == 0 {
				if m, ok := rel.Attr(pRelatingDef).Ref(); ok {
					mat = m
				}
			}
			if mat == 0 {
				return
			}
			switch {
			case isCand && cs[i].material == 0:
				cs[i].material = mat
			case !isCand && ix.typeMaterial[id] == 0:
				ix.typeMaterial[id] = mat
			}
		})
	}

	// Assemblies, then the spatial containment of candidates and wholes.
	for _, rel := range x.f.ByType("IFCRELAGGREGATES") {
		whole, ok := rel.Attr(pAggWhole).Ref()
		if !ok {
			continue
		}
		forRefs(rel.Attr(pAggParts), func(id uint32) {
			if _, dup := ix.parent[id]; !dup {
				ix.parent[id] = whole
			}
		})
	}
	interest := make(map[uint32]bool, len(cs)*2)
	for i := range cs {
		id := cs[i].inst.ID()
		for depth := 0; id != 0 && depth < 16; depth++ {
			interest[id] = true
			id = ix.parent[id]
		}
	}
	for _, h := range scan(x, x.f.ByType("IFCRELCONTAINEDINSPATIALSTRUCTURE"), func(rel ifcstep.Instance, hits []objSet) []objSet {
		var st uint32
		forRefs(rel.Attr(pContainedElems), func(id uint32) {
			if !interest[id] {
				return
			}
			if st == 0 {
				st, _ = rel.Attr(pContainedIn).Ref()
			}
			if st != 0 {
				hits = append(hits, objSet{id, st})
			}
		})
		return hits
	}) {
		if _, dup := ix.contained[h.obj]; !dup {
			ix.contained[h.obj] = h.set
		}
	}
	for i := range cs {
		id := cs[i].inst.ID()
		for depth := 0; id != 0 && depth < 16; depth++ {
			if st, ok := ix.contained[id]; ok {
				cs[i].structure = st
				break
			}
			id = ix.parent[id]
		}
	}

	// Physical-analytical links: IfcRelAssignsToProduct in either direction
	// (IFC4 and later), IfcRelConnectsStructuralElement (IFC2X3).
	isMember := func(id uint32) bool {
		t := x.typeOf(id)
		return t == "IFCSTRUCTURALCURVEMEMBER" || t == "IFCSTRUCTURALCURVEMEMBERVARYING"
	}
	link := func(i int, m uint32) {
		for _, l := range cs[i].links {
			if l == m {
				return
			}
		}
		cs[i].links = append(cs[i].links, m)
	}
	type candLink struct {
		cand int
		m    uint32
	}
	for _, l := range relsOf(x, "IFCRELASSIGNSTOPRODUCT", func(rel relation, links []candLink) []candLink {
		target, ok := rel.ref(pAssignsTarget)
		if !ok {
			return links
		}
		if i, isCand := pos[target]; isCand {
			rel.each(pRelatedObjects, func(id uint32) {
				if isMember(id) {
					links = append(links, candLink{i, id})
				}
			})
			return links
		}
		n := len(links)
		rel.each(pRelatedObjects, func(id uint32) {
			if i, ok := pos[id]; ok {
				links = append(links, candLink{i, target})
			}
		})
		if len(links) > n && !isMember(target) {
			links = links[:n]
		}
		return links
	}) {
		link(l.cand, l.m)
	}
	for _, rel := range x.f.ByType("IFCRELCONNECTSSTRUCTURALELEMENT") {
		el, ok1 := rel.Attr(pRelating).Ref()
		m, ok2 := rel.Attr(pRelated).Ref()
		if i, isCand := pos[el]; ok1 && ok2 && isCand && isMember(m) {
			link(i, m)
		}
	}

	// Results of the analytical members of interest.
	members := map[uint32]bool{}
	for i := range cs {
		if cs[i].analysisOnly {
			members[cs[i].inst.ID()] = true
		}
		for _, m := range cs[i].links {
			members[m] = true
		}
	}
	reactions := map[uint32]bool{}
	if len(members) > 0 {
		for _, h := range relsOf(x, "IFCRELCONNECTSSTRUCTURALACTIVITY", func(rel relation, hits []objSet) []objSet {
			m, ok := rel.ref(pRelating)
			if !ok || !members[m] {
				return hits
			}
			r, ok := rel.ref(pRelated)
			if !ok || x.typeOf(r) != "IFCSTRUCTURALCURVEREACTION" {
				return hits
			}
			return append(hits, objSet{m, r})
		}) {
			ix.reactions[h.obj] = append(ix.reactions[h.obj], h.set)
			reactions[h.set] = true
		}
	}
	if len(reactions) > 0 {
		for _, rel := range x.f.ByType("IFCRELASSIGNSTOGROUP") {
			g, ok := rel.Attr(pAssignsTarget).Ref()
			if !ok || x.typeOf(g) != "IFCSTRUCTURALRESULTGROUP" {
				continue
			}
			forRefs(rel.Attr(pRelatedObjects), func(id uint32) {
				if reactions[id] {
					if _, dup := ix.resultGroup[id]; !dup {
						ix.resultGroup[id] = g
					}
				}
			})
		}
	}
	for _, rel := range x.f.ByType("IFCRELASSIGNSTOGROUPBYFACTOR") {
		if g, ok := rel.Attr(pAssignsTarget).Ref(); ok {
			ix.byFactor[g] = true
		}
	}

	// Material and profile properties (small sets).
	for _, t := range [...]string{"IFCMATERIALPROPERTIES", "IFCMECHANICALSTEELMATERIALPROPERTIES", "IFCMECHANICALMATERIALPROPERTIES",
		"IFCMECHANICALCONCRETEMATERIALPROPERTIES", "IFCEXTENDEDMATERIALPROPERTIES"} {
		at := pMechMaterial
		if t == "IFCMATERIALPROPERTIES" {
			at = pMatPropsOf
		}
		for _, in := range x.f.ByType(t) {
			if m, ok := in.Attr(at).Ref(); ok {
				ix.matProps[m] = append(ix.matProps[m], in.ID())
			}
		}
	}
	for _, in := range x.f.ByType("IFCPROFILEPROPERTIES") {
		if p, ok := in.Attr(pMatPropsOf).Ref(); ok {
			if _, dup := ix.profileProps[p]; !dup || isProfileMechanical(in) {
				ix.profileProps[p] = in.ID()
			}
		}
	}
	for _, t := range [...]string{"IFCSTRUCTURALSTEELPROFILEPROPERTIES", "IFCSTRUCTURALPROFILEPROPERTIES", "IFCGENERALPROFILEPROPERTIES"} {
		for _, in := range x.f.ByType(t) {
			if p, ok := in.Attr(1).Ref(); ok {
				if _, dup := ix.profileProps[p]; !dup {
					ix.profileProps[p] = in.ID()
				}
			}
		}
	}
	for _, rel := range x.f.ByType("IFCRELASSOCIATESPROFILEPROPERTIES") {
		p, ok := rel.Attr(pProfilePropsFor).Ref()
		if !ok {
			continue
		}
		forRefs(rel.Attr(pRelatedObjects), func(id uint32) {
			if i, ok := pos[id]; ok && cs[i].profProps == 0 {
				cs[i].profProps = p
			}
		})
	}
}

func isProfileMechanical(in ifcstep.Instance) bool {
	return strings.EqualFold(text(in.Attr(pMatPropsName)), "Pset_ProfileMechanical")
}

// getRef returns instance id, referenced from inside value v of instance
// from; a dangling reference is recorded as a warning by the reader.
func (x *extractor) getRef(from ifcstep.Instance, v ifcstep.Value, id uint32) (ifcstep.Instance, bool) {
	if in, ok := x.f.Get(id); ok {
		return in, true
	}
	// Let the reader record the dangling reference with its position.
	if v.Kind() == ifcstep.KindRef {
		return x.f.Deref(from, v)
	}
	if list, err := v.List(); err == nil {
		for _, e := range list {
			if r, ok := e.Ref(); ok && r == id {
				return x.f.Deref(from, e)
			}
		}
	}
	return ifcstep.Instance{}, false
}
