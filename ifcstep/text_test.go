package ifcstep

import (
	"errors"
	"testing"
)

// String decoding. Vectors from ifc-facts §1.4 (ISO 10303-21 control
// directives) and the public samples named there.
func TestText(t *testing.T) {
	tests := []struct {
		lit, want string
	}{
		{`'plain'`, "plain"},
		{`''`, ""},
		{`'it''s'`, "it's"},
		{`''''`, "'"},
		{`'DOMAIN\\user'`, `DOMAIN\user`},          // source: ifc-facts §1.3, a sample header
		{`'N\S\0 250'`, "N° 250"},                  // source: ifc-facts §1.4, real sample
		{`'Wohn\X\FCberbauung'`, "Wohnüberbauung"}, // source: ifc-facts §1.4
		{`'Grundst\X2\00FC\X0\ck'`, "Grundstück"},  // source: ifc-facts §1.4
		{`'Grundst\X2\00fc\X0\ck'`, "Grundstück"},  // lower-case hex: web-ifc#949
		{`'\X2\3010\X0\S\X2\3011\X0\'`, "【S】"},     // BIMserver#407: literal S after \X0\
		{`'\X2\D83DDE00\X0\'`, "😀"},                // surrogate pair
		{`'\X4\0001F600\X0\'`, "😀"},                // extended4
		{`'\X2\00C400D6\X0\x'`, "ÄÖx"},             // several code units
		{`'C\X\8E'`, "C\u008e"},                    // C1 control code, ifc-facts §1.4
		{`'\PB\\S\9'`, "š"},                        // ISO 8859-2: 0x39+0x80 = 0xB9 = U+0161
		{`'\S\D'`, "Ä"},                            // 0x44+0x80 = 0xC4
		{`'\PE\\S\P'`, "а"},                        // ISO 8859-5 0xD0 = U+0430 (Cyrillic a)
		{"'line\r\nbreak'", "linebreak"},           // print control directives are dropped
		{"'caf\xc3\xa9'", "café"},                  // raw UTF-8 (edition 3)
		{"'caf\xe9'", "café"},                      // raw Latin-1 fallback
		{`'a\X2\00E9\X0\b\X\E9c'`, "aébéc"},
	}
	for _, tt := range tests {
		t.Run(tt.lit, func(t *testing.T) {
			got, err := attr0(t, tt.lit).Text()
			if err != nil || got != tt.want {
				t.Errorf("Text = %q, %v; want %q", got, err, tt.want)
			}
		})
	}
}

func TestTextMalformed(t *testing.T) {
	tests := []struct {
		lit string
		col int // column of the bad directive on line 8 ("#1=X(" is 5 bytes)
		msg string
	}{
		{`'a\X2\00F\X0\b'`, 8, "malformed string: \\X2\\ needs groups of 4 hex digits"},
		{`'a\X2\00FC'`, 8, "malformed string: \\X2\\ not closed by \\X0\\"},
		{`'\X4\0011FFFF\X0\'`, 7, "malformed string: invalid code point in \\X4\\"},
		{`'\X2\D83D\X0\'`, 7, "malformed string: unpaired surrogate in \\X2\\"},
		{`'\X\G1'`, 7, "malformed string: malformed \\X\\ directive (expected two hex digits)"},
		{`'\PZ\'`, 7, "malformed string: malformed \\P directive (expected \\PA\\ to \\PI\\)"},
		{`'ab\Q'`, 9, "malformed string: unknown directive \\Q"},
		{`'ab\'`, 9, "malformed string: lone '\\' at the end of the string"},
		{`'\X0\'`, 7, "malformed string: unknown directive \\X0"},
	}
	for _, tt := range tests {
		t.Run(tt.lit, func(t *testing.T) {
			v := attr0(t, tt.lit)
			got, err := v.Text()
			raw := string(v.Raw())
			if got != raw[1:len(raw)-1] {
				t.Errorf("Text = %q, want the raw text %q", got, raw[1:len(raw)-1])
			}
			var se *StringError
			if !errors.As(err, &se) {
				t.Fatalf("err = %v, want *StringError", err)
			}
			if se.Pos.Line != headerLines+1 || se.Pos.Column != tt.col || se.ID != 1 || se.Msg != tt.msg {
				t.Errorf("err = %v, want line %d column %d: %s", err, headerLines+1, tt.col, tt.msg)
			}
			ws := v.f.Warnings()
			if len(ws) != 1 || ws[0].Code != "malformed-string" || ws[0].Pos != se.Pos {
				t.Errorf("warnings = %v", ws)
			}
		})
	}
}

// A malformed string spoils only itself: the next string decodes.
func TestTextMalformedIsolated(t *testing.T) {
	f := mustParse(t, doc(`#1=X('\X\C3\X\96\X2\00','Grundst\X2\00FC\X0\ck');`+"\n"))
	in, _ := f.Get(1)
	if _, err := in.Attr(0).Text(); err == nil {
		t.Error("want error for the first string")
	}
	if s, err := in.Attr(1).Text(); err != nil || s != "Grundstück" {
		t.Errorf("second = %q, %v", s, err)
	}
}
