package ifcstep

import "bytes"

// Ref is a reference #ID written in an instance of one of Options.RefTypes,
// recorded while the file was indexed.
type Ref struct {
	ID   uint32 // the instance referred to
	Attr uint16 // the top-level attribute it is written in, 0-based
	// Depth is 1 when the attribute is the reference itself, 2 for an
	// element of the attribute's list, more for deeper lists.
	Depth uint8
	// Typed: the reference sits inside a typed value, e.g. IFCX(#5) or
	// (IFCX(#5)), rather than in plain lists.
	Typed bool
}

// RefsOf calls fn for every instance of typ, in file order, with the
// references written in it, as recorded while the file was indexed
// (Options.RefTypes): no attribute is decoded and the instances' bytes are
// not read again. refs is shared: fn must not modify or keep it. RefsOf
// returns false, without calling fn, when typ was not recorded. Complex
// instances are never recorded.
func (f *File) RefsOf(typ string, fn func(in Instance, refs []Ref)) bool {
	t, ok := f.typeIdx[typ]
	if !ok {
		t, ok = f.typeIdx[upper(typ)]
	}
	if !f.refNames[upper(typ)] {
		return false
	}
	if !ok {
		return true // recorded, but no instance has the type
	}
	for k, s := range f.refSlots {
		if f.typ[s] == t {
			fn(Instance{f: f, s: s}, f.refs[f.refStart[k]:f.refStart[k+1]:f.refStart[k+1]])
		}
	}
	return true
}

// refSpecial marks the bytes skipListRefs must look at: those of skipList
// (special) and the reference and separator bytes.
var refSpecial = [256]bool{'\'': true, '(': true, ')': true, ';': true, '/': true, '#': true, ',': true}

// skipListRefs is skipList for the attribute list at p of an instance whose
// references are recorded (Options.RefTypes), as instance k of chunk c: the
// same pass over the bytes, with the same checks and errors, also records
// each reference with its attribute, depth and whether it sits in a typed
// value.
func skipListRefs(data []byte, p int, id uint32, lim *Limits, c *chunk, k int) (int, *perr) {
	c.refInst = append(c.refInst, uint32(k))
	c.refStart = append(c.refStart, uint32(len(c.refs)))
	n := len(data)
	depth, attr := 1, 0
	if depth > lim.MaxDepth {
		return p, &perr{off: p, id: id, kind: ErrLimit, msg: "lists nested deeper than the limit of " + itoa(lim.MaxDepth)}
	}
	// typedAt is the depth from which the lists belong to a typed value
	// (0: none): a '(' after a keyword opens a typed value.
	typedAt := 0
	i := p + 1
	for {
		for i < n && !refSpecial[data[i]] {
			i++
		}
		if i >= n {
			return i, &perr{off: n, id: id, kind: ErrTruncated, msg: "file ends inside an instance (unclosed list)"}
		}
		switch data[i] {
		case '\'':
			j, e := skipString(data, i, id, lim.MaxStringLen)
			if e != nil {
				return i, e
			}
			i = j
		case '(':
			depth++
			if depth > lim.MaxDepth {
				return i, &perr{off: i, id: id, kind: ErrLimit, msg: "lists nested deeper than the limit of " + itoa(lim.MaxDepth)}
			}
			if typedAt == 0 {
				b := i - 1
				for b > p && isSpace(data[b]) {
					b--
				}
				if isKeyChar(data[b]) {
					typedAt = depth
				}
			}
			i++
		case ')':
			if depth == typedAt {
				typedAt = 0
			}
			depth--
			i++
			if depth == 0 {
				return i, nil
			}
		case ';':
			return i, &perr{off: i, id: id, kind: ErrUnterminatedList, msg: "unterminated list: ';' before the closing ')'"}
		case '/':
			if i+1 < n && data[i+1] == '*' {
				q := bytes.Index(data[i+2:], starSlash)
				if q < 0 {
					return i, &perr{off: i, id: id, kind: ErrUnterminatedComment, msg: "unterminated comment: no */ before the end of the file"}
				}
				i += 2 + q + 2
			} else {
				i++
			}
		case ',':
			if depth == 1 && attr < 1<<16-1 {
				attr++
			}
			i++
		case '#':
			j := i + 1
			var ref uint64
			for j < n && isDigit(data[j]) && ref <= 1<<32-1 {
				ref = ref*10 + uint64(data[j]-'0')
				j++
			}
			if j > i+1 && ref <= 1<<32-1 {
				c.refs = append(c.refs, Ref{ID: uint32(ref), Attr: uint16(attr), Depth: uint8(min(depth, 255)), Typed: typedAt != 0})
			}
			i = j
		}
	}
}

// wantsRefs reports whether instances of chunk-local type t are recorded.
func (c *chunk) wantsRefs(t uint16) bool {
	for len(c.want) <= int(t) {
		c.want = append(c.want, c.refNames[upper(string(c.tt.names[len(c.want)]))])
	}
	return c.want[t]
}
