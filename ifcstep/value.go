package ifcstep

import (
	"math"
	"strconv"
)

// Kind is the kind of an attribute value.
type Kind uint8

// Kinds of values.
const (
	KindUnset   Kind = iota // $
	KindDerived             // *
	KindInt                 // 42, -7
	KindReal                // 0., -1.5E-3
	KindString              // 'text'
	KindEnum                // .MILLI.
	KindRef                 // #12
	KindList                // (a, b, ...)
	KindTyped               // IFCLENGTHMEASURE(2.5)
	KindBinary              // "0FF"
)

var kindNames = [...]string{"unset", "derived", "integer", "real", "string", "enumeration", "reference", "list", "typed value", "binary"}

// String names the kind, e.g. "enumeration".
func (k Kind) String() string {
	if int(k) < len(kindNames) {
		return kindNames[k]
	}
	return "kind(" + itoa(int(k)) + ")"
}

// Value is one attribute value: its kind and where it is written in the file.
// It is a small value type that refers into the file's data; decoding happens
// in the accessors. The zero Value is unset.
type Value struct {
	f     *File
	off   int // offset of the first byte
	n     int // length in bytes
	kind  Kind
	flags uint8
}

// flagRecord marks a typed value that is a record of a complex instance.
const flagRecord = 1

// Kind returns the kind of the value.
func (v Value) Kind() Kind { return v.kind }

// Raw returns the value's bytes as written: a slice of the file's data, not
// to be modified, and valid while the File (or an Instance or Value of it)
// is reachable, since a memory-mapped file is unmapped after that.
func (v Value) Raw() []byte {
	if v.f == nil {
		return nil
	}
	return v.f.data[v.off : v.off+v.n : v.off+v.n]
}

// Offset returns the value's byte offset in the file.
func (v Value) Offset() int { return v.off }

// IsUnset reports whether the value is $.
func (v Value) IsUnset() bool { return v.kind == KindUnset }

// IsDerived reports whether the value is *.
func (v Value) IsDerived() bool { return v.kind == KindDerived }

// unwrap returns the innermost value of a typed value (IFCLABEL('x') -> 'x').
func (v Value) unwrap() Value {
	for range 64 {
		if v.kind != KindTyped {
			return v
		}
		_, in, ok := v.Typed()
		if !ok {
			return v
		}
		v = in
	}
	return v
}

// Ref returns the id of a reference #N.
func (v Value) Ref() (uint32, bool) {
	if v.kind != KindRef {
		return 0, false
	}
	raw := v.Raw()
	var id uint64
	for _, c := range raw[1:] {
		id = id*10 + uint64(c-'0')
		if id > math.MaxUint32 {
			return 0, false
		}
	}
	return uint32(id), true
}

// Int returns an integer; typed values are unwrapped (IFCINTEGER(3) -> 3).
// ok is false for other kinds and on overflow.
func (v Value) Int() (int64, bool) {
	v = v.unwrap()
	if v.kind != KindInt {
		return 0, false
	}
	return parseInt(v.Raw())
}

func parseInt(raw []byte) (int64, bool) {
	neg := false
	if len(raw) > 0 && (raw[0] == '+' || raw[0] == '-') {
		neg = raw[0] == '-'
		raw = raw[1:]
	}
	if len(raw) == 0 {
		return 0, false
	}
	var u uint64
	for _, c := range raw {
		if c < '0' || c > '9' {
			return 0, false
		}
		if u > (math.MaxUint64-9)/10 {
			return 0, false
		}
		u = u*10 + uint64(c-'0')
	}
	if neg {
		if u > 1<<63 {
			return 0, false
		}
		return -int64(u), true
	}
	if u > math.MaxInt64 {
		return 0, false
	}
	return int64(u), true
}

// Real returns a real or an integer as float64; typed values are unwrapped
// (IFCLENGTHMEASURE(2.5) -> 2.5). ok is false for other kinds and for
// values out of the float64 range.
func (v Value) Real() (float64, bool) {
	v = v.unwrap()
	switch v.kind {
	case KindInt:
		if i, ok := parseInt(v.Raw()); ok && i > -1<<53 && i < 1<<53 {
			return float64(i), true
		}
		fallthrough
	case KindReal:
		x, err := strconv.ParseFloat(string(v.Raw()), 64)
		if err != nil {
			return 0, false
		}
		return x, true
	}
	return 0, false
}

// Bool returns the value of .T. or .F. (also IFCBOOLEAN(.T.)); .U. and
// other values give ok = false.
func (v Value) Bool() (b, ok bool) {
	v = v.unwrap()
	if v.kind != KindEnum || v.n != 3 {
		return false, false
	}
	switch v.f.data[v.off+1] {
	case 'T', 't':
		return true, true
	case 'F', 'f':
		return false, true
	}
	return false, false
}

// Enum returns an enumeration value without the dots, e.g. "MILLI"; typed
// values are unwrapped.
func (v Value) Enum() (string, bool) {
	v = v.unwrap()
	if v.kind != KindEnum {
		return "", false
	}
	return v.f.internName(v.f.data[v.off+1 : v.off+v.n-1]), true
}

// Typed returns the (upper-case) type name and the inner value of a typed
// value such as IFCLENGTHMEASURE(2.5).
func (v Value) Typed() (name string, inner Value, ok bool) {
	if v.kind != KindTyped {
		return "", Value{}, false
	}
	data := v.f.data
	end := v.off + v.n
	p := v.off
	for p < end && (isKeyChar(data[p]) || data[p] == '!') {
		p++
	}
	name = v.f.internName(data[v.off:p])
	p, _ = skipSpace(data[:end], p)
	if p >= end || data[p] != '(' {
		return name, Value{}, false
	}
	if v.flags&flagRecord != 0 { // a record of a complex instance: the inner value is its parameter list
		return name, Value{f: v.f, off: p, n: end - p, kind: KindList}, true
	}
	q, _ := skipSpace(data[:end-1], p+1)
	in, r, err := v.f.scanValue(q, end-1)
	if err != nil {
		return name, Value{}, false
	}
	if r, _ = skipSpace(data[:end-1], r); r != end-1 {
		return name, Value{}, false // more than one parameter
	}
	return name, in, true
}

// List returns the elements of a list (typed values are unwrapped). A
// syntax error inside the list is returned as an *Error.
func (v Value) List() ([]Value, error) {
	var buf [16]Value
	out, err := v.AppendList(buf[:0])
	if err != nil {
		return nil, err
	}
	res := make([]Value, len(out))
	copy(res, out)
	return res, nil
}

// AppendList appends the elements of a list to dst and returns the extended
// slice, as List does; with a reused dst it does not allocate.
func (v Value) AppendList(dst []Value) ([]Value, error) {
	v = v.unwrap()
	if v.kind != KindList {
		return dst, v.wrongKind("a list")
	}
	it := v.f.elems(v.off, v.off+v.n)
	for {
		e, ok, err := it.next()
		if err != nil {
			return dst, err
		}
		if !ok {
			return dst, nil
		}
		dst = append(dst, e)
	}
}

// Binary returns the bits of a binary literal "..." as bytes, right-aligned
// (big-endian; the unused high-order bits named by the literal's first digit
// are zero).
func (v Value) Binary() ([]byte, error) {
	v = v.unwrap()
	if v.kind != KindBinary {
		return nil, v.wrongKind("a binary")
	}
	raw := v.Raw()
	unused := raw[1] - '0'
	hex := raw[2 : len(raw)-1] // after the quote and the unused-bits digit
	out := make([]byte, (len(hex)+1)/2)
	j := len(out) - 1
	for i := len(hex) - 1; i >= 0; i -= 2 {
		lo := unhex(hex[i])
		if i == 0 {
			lo &= 0xF >> unused
		}
		b := lo
		if i > 0 {
			hi := unhex(hex[i-1])
			if i-1 == 0 {
				hi &= 0xF >> unused
			}
			b |= hi << 4
		}
		out[j] = b
		j--
	}
	return out, nil
}

func unhex(c byte) byte {
	switch {
	case '0' <= c && c <= '9':
		return c - '0'
	case 'A' <= c && c <= 'F':
		return c - 'A' + 10
	case 'a' <= c && c <= 'f':
		return c - 'a' + 10
	}
	return 0
}

func isHex(c byte) bool {
	return '0' <= c && c <= '9' || 'A' <= c && c <= 'F' || 'a' <= c && c <= 'f'
}

func (v Value) wrongKind(want string) error {
	if v.f == nil {
		return &Error{Kind: ErrWrongKind, Msg: "expected " + want + ", found an unset value"}
	}
	return v.f.errAt(v.off, v.f.idAt(v.off), ErrWrongKind, "expected "+want+", found "+article(v.kind))
}

func article(k Kind) string {
	switch k {
	case KindUnset:
		return "$ (unset)"
	case KindDerived:
		return "* (derived)"
	case KindInt, KindEnum:
		return "an " + k.String()
	}
	return "a " + k.String()
}
