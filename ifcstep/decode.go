package ifcstep

import "sort"

// scanValue scans one value at p (white space already skipped), not beyond
// end. It returns the value and the offset after it.
func (f *File) scanValue(p, end int) (Value, int, error) {
	data := f.data[:end]
	if p >= end {
		return Value{}, p, f.syntaxAt(p, "expected a value, found "+describe(data, p))
	}
	val := func(q int, k Kind) (Value, int, error) { return Value{f: f, off: p, n: q - p, kind: k}, q, nil }
	switch c := data[p]; {
	case c == '$':
		return val(p+1, KindUnset)
	case c == '*':
		return val(p+1, KindDerived)
	case c == '#':
		q := p + 1
		for q < end && isDigit(data[q]) {
			q++
		}
		if q == p+1 || q-p > 11 {
			return Value{}, p, f.syntaxAt(p, "malformed reference")
		}
		return val(q, KindRef)
	case c == '\'':
		q, e := skipString(data, p, 0, f.lim.MaxStringLen)
		if e != nil {
			return Value{}, p, f.fail(e)
		}
		return val(q, KindString)
	case c == '.':
		q := p + 1
		for q < end && isKeyChar(data[q]) {
			q++
		}
		if q == p+1 || q >= end || data[q] != '.' {
			return Value{}, p, f.syntaxAt(p, "malformed enumeration value")
		}
		return val(q+1, KindEnum)
	case c == '"':
		q := p + 1
		for q < end && isHex(data[q]) {
			q++
		}
		if q == p+1 || q >= end || data[q] != '"' || data[p+1] > '3' {
			return Value{}, p, f.syntaxAt(p, "malformed binary value")
		}
		return val(q+1, KindBinary)
	case c == '(':
		q, e := skipList(data, p, 0, 0, &f.lim)
		if e != nil {
			return Value{}, p, f.fail(e)
		}
		return val(q, KindList)
	case c == '+' || c == '-' || isDigit(c):
		q := p
		if c == '+' || c == '-' {
			q++
		}
		d := q
		for q < end && isDigit(data[q]) {
			q++
		}
		if q == d {
			return Value{}, p, f.syntaxAt(p, "malformed number")
		}
		k := KindInt
		if q < end && data[q] == '.' {
			k = KindReal
			q++
			for q < end && isDigit(data[q]) {
				q++
			}
		}
		if q < end && (data[q] == 'E' || data[q] == 'e') {
			k = KindReal
			q++
			if q < end && (data[q] == '+' || data[q] == '-') {
				q++
			}
			e := q
			for q < end && isDigit(data[q]) {
				q++
			}
			if q == e {
				return Value{}, p, f.syntaxAt(p, "malformed exponent")
			}
		}
		return val(q, k)
	case isAlpha(c) || c == '!':
		q := p + 1
		for q < end && isKeyChar(data[q]) {
			q++
		}
		r, e := skipSpace(data, q)
		if e != nil {
			return Value{}, p, f.fail(e)
		}
		if r >= end || data[r] != '(' {
			return Value{}, p, f.syntaxAt(r, "expected '(' after the type name "+quote(data[p:q]))
		}
		r, e = skipList(data, r, 0, 0, &f.lim)
		if e != nil {
			return Value{}, p, f.fail(e)
		}
		return val(r, KindTyped)
	}
	return Value{}, p, f.syntaxAt(p, "expected a value, found "+describe(data, p))
}

func (f *File) syntaxAt(off int, msg string) error {
	return f.errAt(off, f.idAt(off), ErrSyntax, msg)
}

// idAt returns the id of the instance that contains offset off, or 0.
func (f *File) idAt(off int) uint32 {
	n := len(f.ids)
	if n == 0 || off < f.offset(0) {
		return 0
	}
	s := sort.Search(n, func(s int) bool { return f.offset(uint32(s)) > off }) - 1
	return f.ids[s]
}

// plain marks the bytes that cannot start white space or a comment.
var plain = func() (t [256]bool) {
	for c := range t {
		t[c] = c != ' ' && c != '\n' && c != '\r' && c != '\t' && c != '/'
	}
	return t
}()

// elemIter iterates over the elements of a list whose '(' is at off.
type elemIter struct {
	f       *File
	p, end  int
	started bool
	done    bool
}

func (f *File) elems(off, end int) elemIter {
	return elemIter{f: f, p: off + 1, end: end}
}

// next returns the next element; ok is false after the last one.
func (it *elemIter) next() (v Value, ok bool, err error) {
	if it.done {
		return Value{}, false, nil
	}
	f := it.f
	data := f.data[:it.end]
	// White space and comments are rare between values: the calls to
	// skipSpace are made only when one may start here.
	p := it.p
	var e *perr
	if p >= len(data) || !plain[data[p]] {
		if p, e = skipSpace(data, p); e != nil {
			it.done = true
			return Value{}, false, f.fail(e)
		}
	}
	if p < it.end && data[p] == ')' {
		it.done = true
		return Value{}, false, nil
	}
	if it.started {
		if p >= it.end || data[p] != ',' {
			it.done = true
			return Value{}, false, f.syntaxAt(p, "expected ',' or ')', found "+describe(data, p))
		}
		p++
		if p >= len(data) || !plain[data[p]] {
			if p, e = skipSpace(data, p); e != nil {
				it.done = true
				return Value{}, false, f.fail(e)
			}
		}
	}
	it.started = true
	v, q, err := f.scanValue(p, it.end)
	if err != nil {
		it.done = true
		return Value{}, false, err
	}
	it.p = q
	return v, true, nil
}
