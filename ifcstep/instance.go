package ifcstep

import "sort"

// Instance is one data instance of a File: a small value type (file pointer
// and index). The zero Instance is not valid: its accessors return zero
// values.
type Instance struct {
	f *File
	s uint32 // slot: position in file order
}

// File returns the file that holds the instance.
func (in Instance) File() *File { return in.f }

// ID returns the instance id N of #N.
func (in Instance) ID() uint32 {
	if in.f == nil {
		return 0
	}
	return in.f.ids[in.s]
}

// Type returns the upper-case entity type, e.g. "IFCCOLUMN" (interned: no
// allocation). For a complex instance it is the first record's type.
func (in Instance) Type() string {
	if in.f == nil {
		return ""
	}
	return in.f.types[in.f.typ[in.s]]
}

// Offset returns the byte offset of the '#' that starts the instance.
func (in Instance) Offset() int {
	if in.f == nil {
		return 0
	}
	return in.f.offset(in.s)
}

// Complex reports whether the instance is a complex instance #N=(A()B()).
func (in Instance) Complex() bool {
	if in.f == nil || len(in.f.cplx) == 0 {
		return false
	}
	c := in.f.cplx
	k := sort.Search(len(c), func(k int) bool { return c[k] >= in.s })
	return k < len(c) && c[k] == in.s
}

// String renders the instance as "#12=IFCCOLUMN" for messages.
func (in Instance) String() string {
	return "#" + utoa(in.ID()) + "=" + in.Type()
}

// open returns the offset of the '(' that opens the attribute list (or, for
// a complex instance, the record list).
//
// Nearly every exporter writes "#N=TYPE(" without white space: then the
// '(' is at a known distance from the '#' (the id's digits and the interned
// type name's length) and is found without a scan.
func (in Instance) open() int {
	f := in.f
	data := f.data
	off := f.offset(in.s)
	if q := off + 1 + digits(f.ids[in.s]); q+1 < len(data) && data[q] == '=' && isAlpha(data[q+1]) {
		if r := q + 1 + len(f.types[f.typ[in.s]]); r < len(data) && data[r] == '(' {
			return r
		}
	}
	p := off + 1
	for p < len(data) && isDigit(data[p]) {
		p++
	}
	p, _ = skipSpace(data, p)
	p, _ = skipSpace(data, p+1) // '='
	for p < len(data) && (isKeyChar(data[p]) || data[p] == '!') {
		p++
	}
	p, _ = skipSpace(data, p)
	return p
}

// Attrs decodes the top-level attribute list. Each call decodes anew and
// allocates one slice. A syntax error inside the instance is returned as a
// positioned *Error.
//
// For a complex instance, Attrs returns one KindTyped value per record:
// Typed gives the record's type name and its parameter list (a KindList).
func (in Instance) Attrs() ([]Value, error) {
	if in.f == nil {
		return nil, nil
	}
	var buf [16]Value
	out, err := in.AppendAttrs(buf[:0])
	if err != nil {
		return nil, err
	}
	res := make([]Value, len(out))
	copy(res, out)
	return res, nil
}

// AppendAttrs appends the top-level attributes to dst and returns the
// extended slice, as Attrs does; with a reused dst it does not allocate.
func (in Instance) AppendAttrs(dst []Value) ([]Value, error) {
	if in.f == nil {
		return dst, nil
	}
	if in.Complex() {
		return in.records(dst)
	}
	it := in.f.elems(in.open(), len(in.f.data))
	for {
		v, ok, err := it.next()
		if err != nil {
			return dst, err
		}
		if !ok {
			return dst, nil
		}
		dst = append(dst, v)
	}
}

// records returns the records of a complex instance as typed values.
func (in Instance) records(out []Value) ([]Value, error) {
	f := in.f
	data := f.data
	p := in.open() + 1
	for {
		var e *perr
		if p, e = skipSpace(data, p); e != nil {
			return nil, f.fail(e)
		}
		if p >= len(data) || data[p] == ')' {
			return out, nil
		}
		k := p
		for p < len(data) && (isKeyChar(data[p]) || data[p] == '!') {
			p++
		}
		q, e := skipSpace(data, p)
		if e != nil {
			return nil, f.fail(e)
		}
		if p == k || q >= len(data) || data[q] != '(' {
			return nil, f.syntaxAt(q, "malformed record of a complex instance")
		}
		if p, e = skipList(data, q, 0, 0, &f.lim); e != nil {
			return nil, f.fail(e)
		}
		out = append(out, Value{f: f, off: k, n: p - k, kind: KindTyped, flags: flagRecord})
	}
}

// Attr returns attribute i (0-based), or an unset Value when i is out of
// range or the instance cannot be decoded. It does not allocate.
func (in Instance) Attr(i int) Value {
	if in.f == nil || i < 0 {
		return Value{}
	}
	if in.Complex() {
		vs, err := in.Attrs()
		if err != nil || i >= len(vs) {
			return Value{}
		}
		return vs[i]
	}
	it := in.f.elems(in.open(), len(in.f.data))
	for k := 0; ; k++ {
		v, ok, err := it.next()
		if err != nil || !ok {
			return Value{}
		}
		if k == i {
			return v
		}
	}
}

// NumAttrs returns the number of top-level attributes (records, for a
// complex instance), or 0 when the instance cannot be decoded.
func (in Instance) NumAttrs() int {
	if in.f == nil {
		return 0
	}
	if in.Complex() {
		vs, _ := in.Attrs()
		return len(vs)
	}
	it := in.f.elems(in.open(), len(in.f.data))
	for k := 0; ; k++ {
		_, ok, err := it.next()
		if err != nil {
			return 0
		}
		if !ok {
			return k
		}
	}
}
