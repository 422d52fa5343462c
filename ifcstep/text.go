package ifcstep

import (
	"unicode/utf16"
	"unicode/utf8"
)

// Text returns the decoded string of a string literal; typed values are
// unwrapped (IFCLABEL('x') -> "x"). Decoding turns a doubled apostrophe into one, \\ into \,
// and applies the control directives \S\c (with the ISO 8859 part selected
// by \PA\ .. \PI\, default part 1), \X\hh, \X2\hhhh..\X0\ (UTF-16) and
// \X4\hhhhhhhh..\X0\ (code points); line breaks inside the literal are
// dropped. Raw bytes above 0x7F are read as UTF-8 when the literal is valid
// UTF-8, else as ISO 8859-1.
//
// A malformed directive spoils only this string: Text returns the literal
// as written (without the enclosing apostrophes) and a *StringError, and
// records a "malformed-string" warning in the file.
func (v Value) Text() (string, error) {
	v = v.unwrap()
	if v.kind != KindString {
		return "", v.wrongKind("a string")
	}
	raw := v.f.data[v.off+1 : v.off+v.n-1]
	s, bad, msg := decodeText(raw)
	if bad < 0 {
		return s, nil
	}
	f := v.f
	off := v.off + 1 + bad
	id := f.idAt(off)
	e := &StringError{File: f.Name, Pos: f.Position(off), ID: id, Msg: "malformed string: " + msg}
	f.Warn(Warning{File: e.File, Pos: e.Pos, ID: id, Code: "malformed-string", Msg: e.Msg})
	return s, e
}

// decodeText decodes the content of a string literal (between the
// apostrophes). On a malformed directive it returns the content as written,
// the offset of the directive in raw and a message; else bad is -1.
func decodeText(raw []byte) (s string, bad int, msg string) {
	plain, high := true, false
	for _, c := range raw {
		switch {
		case c >= 0x80:
			high = true
			plain = false
		case c == '\\' || c == '\'' || c == '\n' || c == '\r':
			plain = false
		}
	}
	if plain {
		return string(raw), -1, ""
	}
	utf8ok := high && utf8.Valid(raw)
	out := make([]byte, 0, len(raw))
	page := 0 // 0 = ISO 8859-1, k = ISO 8859-(k+1)
	for i := 0; i < len(raw); {
		c := raw[i]
		switch {
		case c == '\'':
			out = append(out, '\'')
			i++
			if i < len(raw) && raw[i] == '\'' {
				i++
			}
		case c == '\n' || c == '\r':
			i++
		case c >= 0x80:
			if utf8ok {
				_, size := utf8.DecodeRune(raw[i:])
				out = append(out, raw[i:i+size]...)
				i += size
			} else {
				out = utf8.AppendRune(out, rune(c))
				i++
			}
		case c != '\\':
			out = append(out, c)
			i++
		default:
			n, m := directive(raw[i:], &page, &out)
			if m != "" {
				return string(raw), i, m
			}
			i += n
		}
	}
	return string(out), -1, ""
}

// directive decodes the control directive at the start of d (d[0] == '\\'),
// appending the text to *out. It returns the bytes consumed, or a message.
func directive(d []byte, page *int, out *[]byte) (int, string) {
	if len(d) < 2 {
		return 0, "lone '\\' at the end of the string"
	}
	switch d[1] {
	case '\\':
		*out = append(*out, '\\')
		return 2, ""
	case 'S':
		if len(d) < 4 || d[2] != '\\' {
			return 0, "malformed \\S\\ directive"
		}
		c := d[3]
		n := 4
		if c == '\'' {
			if len(d) < 5 || d[4] != '\'' {
				return 0, "malformed \\S\\ directive"
			}
			n = 5
		}
		if c < 0x20 || c > 0x7E {
			return 0, "\\S\\ followed by a character outside the basic alphabet"
		}
		r := rune(c) + 0x80
		if *page > 0 {
			r = iso8859High[*page-1][r-0xA0]
		}
		*out = utf8.AppendRune(*out, r)
		return n, ""
	case 'P':
		if len(d) < 4 || d[3] != '\\' || d[2] < 'A' || d[2] > 'I' {
			return 0, "malformed \\P directive (expected \\PA\\ to \\PI\\)"
		}
		*page = int(d[2] - 'A')
		return 4, ""
	case 'X':
		if len(d) < 3 {
			return 0, "malformed \\X directive"
		}
		switch d[2] {
		case '\\':
			if len(d) < 5 || !isHex(d[3]) || !isHex(d[4]) {
				return 0, "malformed \\X\\ directive (expected two hex digits)"
			}
			*out = utf8.AppendRune(*out, rune(unhex(d[3])<<4|unhex(d[4])))
			return 5, ""
		case '2', '4':
			if len(d) < 4 || d[3] != '\\' {
				return 0, "malformed \\X" + string(d[2]) + "\\ directive"
			}
			width := 4
			if d[2] == '4' {
				width = 8
			}
			j := 4
			for j < len(d) && isHex(d[j]) {
				j++
			}
			hex := d[4:j]
			if len(d)-j < 4 || string(d[j:j+4]) != `\X0\` {
				return 0, "\\X" + string(d[2]) + "\\ not closed by \\X0\\"
			}
			if len(hex) == 0 || len(hex)%width != 0 {
				return 0, "\\X" + string(d[2]) + "\\ needs groups of " + itoa(width) + " hex digits"
			}
			if width == 4 {
				var units [64]uint16
				u := units[:0]
				for k := 0; k < len(hex); k += 4 {
					u = append(u, uint16(hexVal(hex[k:k+4])))
				}
				for k := 0; k < len(u); k++ {
					r := rune(u[k])
					if utf16.IsSurrogate(r) {
						if k+1 >= len(u) {
							return 0, "unpaired surrogate in \\X2\\"
						}
						r = utf16.DecodeRune(r, rune(u[k+1]))
						if r == utf8.RuneError {
							return 0, "unpaired surrogate in \\X2\\"
						}
						k++
					}
					*out = utf8.AppendRune(*out, r)
				}
			} else {
				for k := 0; k < len(hex); k += 8 {
					r := rune(hexVal(hex[k : k+8]))
					if r > utf8.MaxRune || r < 0 || utf16.IsSurrogate(r) {
						return 0, "invalid code point in \\X4\\"
					}
					*out = utf8.AppendRune(*out, r)
				}
			}
			return j + 4, ""
		}
		return 0, "unknown directive \\X" + string(printable(d[2]))
	}
	return 0, "unknown directive \\" + string(printable(d[1]))
}

func printable(c byte) byte {
	if c < 0x20 || c >= 0x7F {
		return '?'
	}
	return c
}

func hexVal(h []byte) uint32 {
	var v uint32
	for _, c := range h {
		v = v<<4 | uint32(unhex(c))
	}
	return v
}
