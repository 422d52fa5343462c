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

	steps []stepText   // text of the trace steps, by position (writeTrace)
	nums  *numberCache // text of recent numbers; nil until the first
}

// numberCache remembers the text of recently written numbers, by their
// bits: members that share a profile, a length or a material repeat most
// of their section, buckling and capacity values, and copying a text is
// several times cheaper than formatting the number again (the shortest
// round-trip form costs some 60 ns). Direct-mapped; a slot holds the text of
// one value written as an element field (shortest) or as a trace number
// (six digits).
type numberCache struct {
	key  [numberSlots]uint64 // the value's bits
	six  [numberSlots]bool   // the text is the trace format's
	n    [numberSlots]uint8  // text length, 0 = empty
	text [numberSlots][numberText]byte
}

const (
	numberBits  = 10
	numberSlots = 1 << numberBits
	numberText  = 24
)

// cachedNumber appends the text of v made by format (fmt6 selects the
// trace format), from the cache when it holds it.
func (j *jsonWriter) cachedNumber(b []byte, v float64, fmt6 bool) []byte {
	if j.nums == nil {
		j.nums = new(numberCache)
	}
	c := j.nums
	k := math.Float64bits(v)
	h := (k * 0x9E3779B97F4A7C15) >> (64 - numberBits)
	if fmt6 {
		h ^= 1 // the two formats of one value in neighbouring slots
	}
	if n := c.n[h]; n != 0 && c.key[h] == k && c.six[h] == fmt6 {
		return append(b, c.text[h][:n]...)
	}
	start := len(b)
	if fmt6 {
		b = appendJSONFloat6(b, v)
	} else {
		b = appendJSONFloat(b, v)
	}
	if n := len(b) - start; n <= numberText {
		c.key[h], c.six[h], c.n[h] = k, fmt6, uint8(n)
		copy(c.text[h][:], b[start:])
	}
	return b
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
	if f == math.Trunc(f) && math.Abs(f) < 1e15 || math.IsNaN(f) {
		j.buf = appendJSONFloat(j.buf, f) // integers and null: cheap already
		return
	}
	j.buf = j.cachedNumber(j.buf, f, false)
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

// traceDigits is the number of significant digits of the numbers of a
// trace (step values and inputs): a hand calculation never needs more, and
// they are most of the numbers of a traced report. Element and combination
// fields keep the shortest round-trip form of appendJSONFloat.
const traceDigits = 6

// pow10 holds the powers of ten that are exact in float64.
var pow10 = [...]float64{1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10,
	1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22}

// appendJSONFloat6 formats f rounded to 6 significant digits (traceDigits),
// without trailing zeros, in the layout of appendJSONFloat: plain decimals
// for magnitudes from 1e-6 to below 1e21, exponent form outside, and null
// for NaN and ±Inf. 1234.5678 → 1234.57, 104549554.33 → 104550000,
// 0.000123456789 → 0.000123457.
//
// The digits are those of strconv's correctly rounded 'e' format. Most
// values take a fast path instead, about 2× faster than that format and 3×
// faster than the shortest round-trip form: the value is scaled by
// an exact power of ten to a number m in [1e5, 1e6) with a single rounding
// (error below 2e-10), and m rounded to an integer gives the six digits;
// values whose m lies within 1e-6 of a rounding boundary take strconv's
// path, so that the digits are always the correctly rounded ones.
func appendJSONFloat6(b []byte, f float64) []byte {
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return append(b, "null"...)
	}
	if f == 0 {
		return append(b, '0') // also for -0
	}
	abs := math.Abs(f)
	if abs < 1e6 && f == math.Trunc(f) {
		return strconv.AppendInt(b, int64(f), 10) // at most 6 digits: exact
	}
	if abs < 1e-6 || abs >= 1e21 {
		return appendExp6(b, f)
	}
	digits, exp, ok := sixDigits(abs)
	if !ok {
		digits, exp = sixDigitsExact(abs)
	}
	if f < 0 {
		b = append(b, '-')
	}
	return appendDecimal(b, digits, exp)
}

// sixDigits returns the value rounded to 6 significant digits as an integer
// in [1e5, 1e6) and the decimal exponent of its first digit, for 1e-6 <= v <
// 1e21; ok is false when the rounding cannot be decided in float64.
func sixDigits(v float64) (digits uint64, exp int, ok bool) {
	// The decimal exponent: 10^exp <= v < 10^(exp+1), from the binary
	// exponent (log10(2) ≈ 78913/2^18), corrected by one comparison.
	e2 := int(math.Float64bits(v)>>52&0x7FF) - 1023 // v = 1.f·2^e2 (v is normal)
	exp = (e2 * 78913) >> 18
	if exp+1 >= 0 && exp+1 < len(pow10) && v >= pow10[exp+1] {
		exp++
	} else if exp < 0 && -exp-1 < len(pow10) && v >= 1/pow10[-exp-1] {
		exp++
	}
	var m float64
	switch k := 5 - exp; {
	case k >= 0 && k < len(pow10):
		m = v * pow10[k]
	case k < 0 && -k < len(pow10):
		m = v / pow10[-k]
	default:
		return 0, 0, false
	}
	if m < 99999.5 || m >= 999999.5 {
		return 0, 0, false // exponent guess off, or rounds up to a new digit
	}
	fl := uint64(m) // m > 0: truncation is the floor
	d := m - float64(fl) - 0.5
	if d > -1e-6 && d < 1e-6 {
		return 0, 0, false // too close to half way to decide here
	}
	if d > 0 {
		fl++
	}
	return fl, exp, true
}

// sixDigitsExact is sixDigits by strconv's correctly rounded formatting.
func sixDigitsExact(v float64) (digits uint64, exp int) {
	var tmp [32]byte
	s := strconv.AppendFloat(tmp[:0], v, 'e', traceDigits-1, 64) // d.ddddde±dd
	for _, c := range s {
		if c == 'e' {
			break
		}
		if c != '.' {
			digits = digits*10 + uint64(c-'0')
		}
	}
	k := len(s) - 1
	for s[k-1] != 'e' && s[k-1] != '+' && s[k-1] != '-' {
		k--
	}
	for _, c := range s[k:] {
		exp = exp*10 + int(c-'0')
	}
	if s[k-1] == '-' {
		exp = -exp
	}
	return digits, exp
}

// appendDecimal writes the 6-digit integer digits (first digit at decimal
// exponent exp, -6 <= exp <= 20) as a plain decimal without trailing zeros.
// The text is laid out in a small array and appended once.
func appendDecimal(b []byte, digits uint64, exp int) []byte {
	var d [traceDigits]byte
	for i := traceDigits - 2; i >= 0; i -= 2 {
		r := digits % 100
		digits /= 100
		d[i], d[i+1] = digitPairs[2*r], digitPairs[2*r+1]
	}
	n := traceDigits
	for n > 1 && d[n-1] == '0' {
		n--
	}
	var t [32]byte
	k := 0
	switch {
	case exp < 0:
		t[0], t[1] = '0', '.'
		k = 2
		for i := -1; i > exp; i-- {
			t[k] = '0'
			k++
		}
		k += copy(t[k:], d[:n])
	case n <= exp+1:
		k = copy(t[:], d[:n])
		for i := n; i <= exp; i++ {
			t[k] = '0'
			k++
		}
	default:
		k = copy(t[:], d[:exp+1])
		t[k] = '.'
		k++
		k += copy(t[k:], d[exp+1:n])
	}
	return append(b, t[:k]...)
}

// digitPairs holds "00" to "99".
const digitPairs = "00010203040506070809101112131415161718192021222324252627282930313233343536373839" +
	"40414243444546474849505152535455565758596061626364656667686970717273747576777879" +
	"8081828384858687888990919293949596979899"

// appendExp6 writes f with 6 significant digits in exponent form, as
// encoding/json writes exponents (1.5e-7, 2e+21).
func appendExp6(b []byte, f float64) []byte {
	var tmp [32]byte
	s := strconv.AppendFloat(tmp[:0], f, 'e', traceDigits-1, 64)
	k := 0
	for s[k] != 'e' {
		k++
	}
	m := k
	for s[m-1] == '0' {
		m--
	}
	if s[m-1] == '.' {
		m--
	}
	b = append(b, s[:m]...)
	b = append(b, 'e', s[k+1])
	e := s[k+2:]
	if len(e) > 1 && e[0] == '0' {
		e = e[1:]
	}
	return append(b, e...)
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
