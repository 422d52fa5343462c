package ifcstep

import (
	"bytes"
	"strconv"
)

func countByte(b []byte, c byte) int     { return bytes.Count(b, []byte{c}) }
func lastIndexByte(b []byte, c byte) int { return bytes.LastIndexByte(b, c) }
func itoa(n int) string                  { return strconv.Itoa(n) }
func utoa(n uint32) string               { return strconv.FormatUint(uint64(n), 10) }

// upper returns s in ASCII upper case, without allocating when it already is.
func upper(s string) string {
	for i := 0; i < len(s); i++ {
		if c := s[i]; 'a' <= c && c <= 'z' {
			b := []byte(s)
			for j := i; j < len(b); j++ {
				if c := b[j]; 'a' <= c && c <= 'z' {
					b[j] = c - 'a' + 'A'
				}
			}
			return string(b)
		}
	}
	return s
}

func isSpace(c byte) bool { return c == ' ' || c == '\n' || c == '\r' || c == '\t' }
func isDigit(c byte) bool { return '0' <= c && c <= '9' }

// digits returns the number of decimal digits of n.
func digits(n uint32) int {
	d := 1
	for n >= 10 {
		n /= 10
		d++
	}
	return d
}
func isAlpha(c byte) bool { return 'A' <= c && c <= 'Z' || 'a' <= c && c <= 'z' }

// isKeyChar reports whether c may continue a keyword.
func isKeyChar(c byte) bool { return isAlpha(c) || isDigit(c) || c == '_' }

// quote renders b for a message: at most 32 bytes, printable ASCII only.
func quote(b []byte) string {
	const max = 32
	out := make([]byte, 0, max+8)
	out = append(out, '"')
	for i, c := range b {
		if i == max {
			out = append(out, "..."...)
			break
		}
		if c < 0x20 || c >= 0x7f || c == '"' {
			out = append(out, '?')
			continue
		}
		out = append(out, c)
	}
	return string(append(out, '"'))
}

// describe names the byte at p for a message.
func describe(data []byte, p int) string {
	if p >= len(data) {
		return "end of file"
	}
	c := data[p]
	switch {
	case c == '\'':
		return "a string"
	case c == '\n' || c == '\r':
		return "end of line"
	case c >= 0x21 && c < 0x7f:
		return "'" + string(c) + "'"
	}
	return "byte 0x" + strconv.FormatUint(uint64(c), 16)
}

func boolInt(b bool) int {
	if b {
		return 1
	}
	return 0
}
