package ifcgen

import (
	"bufio"
	"io"
	"math"
	"strconv"
)

// stepWriter writes ISO 10303-21 instances with increasing ids, building each
// statement in a reused buffer (no fmt, no per-value allocation).
type stepWriter struct {
	w     *bufio.Writer
	buf   []byte
	next  int   // next instance id
	n     int64 // bytes written
	comma bool  // a value was written at this list level
	err   error
}

func newStepWriter(w io.Writer) *stepWriter {
	return &stepWriter{w: bufio.NewWriterSize(w, 1<<20), next: 1, buf: make([]byte, 0, 4096)}
}

// begin starts "#N=TYPE(" and returns N.
func (s *stepWriter) begin(typ string) int {
	id := s.next
	s.next++
	s.buf = append(s.buf[:0], '#')
	s.buf = strconv.AppendInt(s.buf, int64(id), 10)
	s.buf = append(s.buf, '=')
	s.buf = append(s.buf, typ...)
	s.buf = append(s.buf, '(')
	s.comma = false
	return id
}

// end finishes the statement with ");\n" and writes it.
func (s *stepWriter) end() {
	s.buf = append(s.buf, ");\n"...)
	s.raw(s.buf)
}

func (s *stepWriter) raw(b []byte) {
	if s.err != nil {
		return
	}
	n, err := s.w.Write(b)
	s.n += int64(n)
	s.err = err
}

func (s *stepWriter) rawString(t string) {
	if s.err != nil {
		return
	}
	n, err := s.w.WriteString(t)
	s.n += int64(n)
	s.err = err
}

func (s *stepWriter) flush() error {
	if s.err != nil {
		return s.err
	}
	return s.w.Flush()
}

func (s *stepWriter) sep() {
	if s.comma {
		s.buf = append(s.buf, ',')
	}
	s.comma = true
}

// open starts a list; close ends it.
func (s *stepWriter) open() *stepWriter {
	s.sep()
	s.buf = append(s.buf, '(')
	s.comma = false
	return s
}

func (s *stepWriter) close() *stepWriter {
	s.buf = append(s.buf, ')')
	s.comma = true
	return s
}

func (s *stepWriter) unset() *stepWriter   { s.sep(); s.buf = append(s.buf, '$'); return s }
func (s *stepWriter) derived() *stepWriter { s.sep(); s.buf = append(s.buf, '*'); return s }

func (s *stepWriter) ref(id int) *stepWriter {
	s.sep()
	s.buf = append(s.buf, '#')
	s.buf = strconv.AppendInt(s.buf, int64(id), 10)
	return s
}

func (s *stepWriter) refs(ids ...int) *stepWriter {
	s.open()
	for _, id := range ids {
		s.ref(id)
	}
	return s.close()
}

func (s *stepWriter) integer(v int) *stepWriter {
	s.sep()
	s.buf = strconv.AppendInt(s.buf, int64(v), 10)
	return s
}

// real writes a STEP real, always with a decimal point: 4500., 1.5E-05.
func (s *stepWriter) real(v float64) *stepWriter {
	s.sep()
	s.buf = appendReal(s.buf, v)
	return s
}

func appendReal(b []byte, v float64) []byte {
	if v == 0 && !math.Signbit(v) {
		return append(b, "0."...)
	}
	start := len(b)
	b = strconv.AppendFloat(b, v, 'G', 12, 64)
	dot, exp := -1, -1
	for i := start; i < len(b); i++ {
		switch b[i] {
		case '.':
			dot = i
		case 'E':
			exp = i
		}
	}
	switch {
	case dot >= 0:
	case exp >= 0:
		b = append(b, 0)
		copy(b[exp+1:], b[exp:])
		b[exp] = '.'
	default:
		b = append(b, '.')
	}
	return b
}

func (s *stepWriter) reals(vs ...float64) *stepWriter {
	s.open()
	for _, v := range vs {
		s.real(v)
	}
	return s.close()
}

// str writes a string literal already encoded for STEP (apostrophes
// doubled, directives in place); see encode.
func (s *stepWriter) str(encoded string) *stepWriter {
	s.sep()
	s.buf = append(s.buf, '\'')
	s.buf = append(s.buf, encoded...)
	s.buf = append(s.buf, '\'')
	return s
}

func (s *stepWriter) enum(e string) *stepWriter {
	s.sep()
	s.buf = append(s.buf, '.')
	s.buf = append(s.buf, e...)
	s.buf = append(s.buf, '.')
	return s
}

func (s *stepWriter) boolean(b bool) *stepWriter {
	if b {
		return s.enum("T")
	}
	return s.enum("F")
}

// typed writes TYPE(value) where value is written by fn.
func (s *stepWriter) typedReal(typ string, v float64) *stepWriter {
	s.sep()
	s.buf = append(s.buf, typ...)
	s.buf = append(s.buf, '(')
	s.buf = appendReal(s.buf, v)
	s.buf = append(s.buf, ')')
	return s
}

func (s *stepWriter) typedBool(typ string, b bool) *stepWriter {
	s.sep()
	s.buf = append(s.buf, typ...)
	if b {
		s.buf = append(s.buf, "(.T.)"...)
	} else {
		s.buf = append(s.buf, "(.F.)"...)
	}
	return s
}

func (s *stepWriter) typedStr(typ, encoded string) *stepWriter {
	s.sep()
	s.buf = append(s.buf, typ...)
	s.buf = append(s.buf, "('"...)
	s.buf = append(s.buf, encoded...)
	s.buf = append(s.buf, "')"...)
	return s
}

// encode encodes text for a STEP string literal: apostrophes doubled,
// backslashes doubled, characters outside printable ASCII as \X2\hhhh\X0\
// (or, when latin1 is set, characters U+00A0..U+00FE as \S\c).
func encode(text string, latin1 bool) string {
	const hexDigits = "0123456789ABCDEF"
	var b []byte
	inX2 := false
	for _, r := range text {
		if r >= 0x20 && r < 0x7F || latin1 && r >= 0xA0 && r <= 0xFE {
			if inX2 {
				b = append(b, `\X0\`...)
				inX2 = false
			}
			switch {
			case r == '\'':
				b = append(b, "''"...)
			case r == '\\':
				b = append(b, `\\`...)
			case r >= 0xA0:
				b = append(b, `\S\`...)
				b = append(b, byte(r-0x80))
				if r == 0xA7 { // \S\ followed by an apostrophe, which is doubled
					b = append(b, '\'')
				}
			default:
				b = append(b, byte(r))
			}
			continue
		}
		if !inX2 {
			b = append(b, `\X2\`...)
			inX2 = true
		}
		var units []uint16
		if r > 0xFFFF {
			r -= 0x10000
			units = []uint16{uint16(0xD800 + r>>10), uint16(0xDC00 + r&0x3FF)}
		} else {
			units = []uint16{uint16(r)}
		}
		for _, u := range units {
			b = append(b, hexDigits[u>>12], hexDigits[u>>8&15], hexDigits[u>>4&15], hexDigits[u&15])
		}
	}
	if inX2 {
		b = append(b, `\X0\`...)
	}
	return string(b)
}

// globalID encodes a 128-bit number as an IFC GlobalId (22 characters of the
// IFC base-64 alphabet, the first carrying 2 bits).
func globalID(hi, lo uint64) string {
	const alphabet = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz_$"
	var out [22]byte
	for i := 21; i >= 0; i-- {
		out[i] = alphabet[lo&63]
		lo = lo>>6 | (hi&63)<<58
		hi >>= 6
	}
	return string(out[:])
}
