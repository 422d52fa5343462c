package ifcstep

import (
	"errors"
	"strings"
	"testing"
)

func TestParseErrors(t *testing.T) {
	tests := []struct {
		name string
		src  string
		kind ErrorKind
		want string // the rendered message
	}{
		{"empty", "", ErrNotStep,
			"t.ifc: line 1, column 1 (byte 0): not a STEP file: expected ISO-10303-21; at the start"},
		{"not step", "PK\x03\x04....", ErrNotStep,
			"t.ifc: line 1, column 1 (byte 0): not a STEP file: expected ISO-10303-21; at the start"},
		{"truncated at a statement boundary", strings.TrimSuffix(doc("#1=X(1);\n"), "ENDSEC;\nEND-ISO-10303-21;\n"), ErrTruncated,
			"t.ifc: line 9, column 1 (byte 197): file ends inside the DATA section (no ENDSEC)"},
		{"truncated inside an instance", strings.TrimSuffix(doc("#1=X(1,(2"), "ENDSEC;\nEND-ISO-10303-21;\n"), ErrTruncated,
			"t.ifc: line 8, column 10 (byte 197, #1): file ends inside an instance (unclosed list)"},
		{"truncated after ENDSEC", strings.TrimSuffix(doc("#1=X(1);\n"), "END-ISO-10303-21;\n"), ErrTruncated,
			"t.ifc: line 10, column 1 (byte 205): file ends before END-ISO-10303-21;"},
		{"unterminated string", doc("#1=X(1);\n#2=X('abc);\n#3=X(2);\n"), ErrUnterminatedString,
			"t.ifc: line 9, column 6 (byte 202, #2): unterminated string: no closing apostrophe before the end of the file"},
		{"unterminated list", doc("#1=X(1);\n#22=X((1,2);\n#3=X(2);\n"), ErrUnterminatedList,
			"t.ifc: line 9, column 12 (byte 208, #22): unterminated list: ';' before the closing ')'"},
		{"unterminated comment", doc("#1=X(1);\n/* open\n#2=X(2);\n"), ErrUnterminatedComment,
			"t.ifc: line 9, column 1 (byte 197): unterminated comment: no */ before the end of the file"},
		{"unterminated comment in instance", doc("#1=X(1 /* open);\n"), ErrUnterminatedComment,
			"t.ifc: line 8, column 8 (byte 195, #1): unterminated comment: no */ before the end of the file"},
		{"duplicate id", doc("#1=X(1);\n#2=X(2);\n#1=Y(3);\n"), ErrDuplicateID,
			"t.ifc: line 10, column 1 (byte 206, #1): duplicate instance #1 (first defined at line 8)"},
		{"duplicate id sparse", doc("#1=X(1);\n#200000=X(2);\n#1=Y(3);\n"), ErrDuplicateID,
			"t.ifc: line 10, column 1 (byte 211, #1): duplicate instance #1 (first defined at line 8)"},
		{"unknown schema", docSchema("IFC2X_FINAL", "#1=X(1);\n"), ErrUnknownSchema,
			`t.ifc: line 5, column 1 (byte 151): unknown schema "IFC2X_FINAL": supported are IFC2X3, IFC4 (also IFC4X1, IFC4X2) and IFC4X3`},
		{"IFC5", docSchema("IFC5", "#1=X(1);\n"), ErrUnknownSchema,
			`t.ifc: line 5, column 1 (byte 151): unknown schema "IFC5": supported are IFC2X3, IFC4 (also IFC4X1, IFC4X2) and IFC4X3`},
		{"empty schema", docSchema("", "#1=X(1);\n"), ErrUnknownSchema,
			`t.ifc: line 5, column 1 (byte 151): unknown schema "": supported are IFC2X3, IFC4 (also IFC4X1, IFC4X2) and IFC4X3`},
		{"missing =", doc("#1 X(1);\n"), ErrSyntax,
			"t.ifc: line 8, column 4 (byte 191, #1): expected '=' after #1, found 'X'"},
		{"missing type", doc("#1=5;\n"), ErrSyntax,
			"t.ifc: line 8, column 4 (byte 191, #1): expected an entity type name, found '5'"},
		{"missing semicolon", doc("#1=X(1)\n#2=X(2);\n"), ErrSyntax,
			"t.ifc: line 9, column 1 (byte 196, #1): expected ';' after the instance, found '#'"},
		{"extra close", doc("#1=X(1));\n"), ErrSyntax,
			"t.ifc: line 8, column 8 (byte 195, #1): expected ';' after the instance, found ')'"},
		{"garbage between", doc("#1=X(1);\nfoo\n"), ErrSyntax,
			"t.ifc: line 9, column 1 (byte 197): expected an instance (#N=...) or ENDSEC, found 'f'"},
		{"id too large", doc("#4294967296=X(1);\n"), ErrLimit,
			"t.ifc: line 8, column 1 (byte 188): instance id larger than 4294967295"},
		{"second DATA", doc("#1=X(1);\n") + "", ErrSyntax, ""},
	}
	tests[len(tests)-1].src = strings.Replace(doc("#1=X(1);\n"), "END-ISO-10303-21;", "DATA;\nENDSEC;\nEND-ISO-10303-21;", 1)
	tests[len(tests)-1].want = "t.ifc: line 10, column 1 (byte 205): a second DATA section is not supported"
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			for _, workers := range []int{1, 3} {
				_, err := Parse([]byte(tt.src), "t.ifc", Options{Workers: workers})
				var e *Error
				if !errors.As(err, &e) {
					t.Fatalf("err = %v, want *Error", err)
				}
				if e.Kind != tt.kind || err.Error() != tt.want {
					t.Errorf("got  %v: %s\nwant %v: %s", e.Kind, err, tt.kind, tt.want)
				}
			}
		})
	}
}

func TestLimits(t *testing.T) {
	tests := []struct {
		name string
		src  string
		lim  Limits
		want string
	}{
		{"file size", doc("#1=X(1);\n"), Limits{MaxFileSize: 100},
			"t.ifc: line 1, column 1 (byte 0): file of 223 bytes is larger than the limit of 100 bytes"},
		{"depth", doc("#1=X((((1))));\n"), Limits{MaxDepth: 3},
			"t.ifc: line 8, column 8 (byte 195, #1): lists nested deeper than the limit of 3"},
		{"string", doc("#1=X('" + strings.Repeat("x", 41) + "');\n"), Limits{MaxStringLen: 40},
			"t.ifc: line 8, column 6 (byte 193, #1): string longer than the limit of 40 bytes"},
		{"instances", doc("#1=X(1);\n#2=X(1);\n#3=X(1);\n"), Limits{MaxInstances: 2},
			"t.ifc: line 10, column 1 (byte 206, #3): more instances than the limit of 2"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := Parse([]byte(tt.src), "t.ifc", Options{Limits: tt.lim})
			var e *Error
			if !errors.As(err, &e) || e.Kind != ErrLimit || err.Error() != tt.want {
				t.Errorf("got  %v\nwant %s", err, tt.want)
			}
		})
	}
	// within the limits
	if _, err := Parse([]byte(doc("#1=X((((1))));\n")), "t.ifc", Options{Limits: Limits{MaxDepth: 4}}); err != nil {
		t.Errorf("depth 4: %v", err)
	}
}

func TestSchemaFamily(t *testing.T) {
	tests := []struct {
		id   string
		fam  Family
		warn bool
	}{
		{"IFC2X3", IFC2X3, false},
		{"ifc2x3", IFC2X3, false},
		{"IFC2X3_TC1", IFC2X3, false},
		{"IFC4", IFC4, false},
		{"IFC4_ADD2_TC1", IFC4, false},
		{"IFC4X1", IFC4, true},
		{"IFC4X2", IFC4, true},
		{"IFC4X3", IFC4X3, false},
		{"IFC4X3_ADD2", IFC4X3, false},
		{"IFC4X3_DEV_7e95fe8", IFC4X3, false},
	}
	for _, tt := range tests {
		f := mustParse(t, docSchema(tt.id, "#1=X(1);\n"))
		if f.Family != tt.fam || f.SchemaID != strings.ToUpper(tt.id) {
			t.Errorf("%s: %v %q", tt.id, f.Family, f.SchemaID)
		}
		ws := f.Warnings()
		if got := len(ws) == 1 && ws[0].Code == "schema-family"; got != tt.warn {
			t.Errorf("%s: warnings %v", tt.id, ws)
		}
	}
}

// The sample ifc2x3/example.ifc has four references to missing instances,
// all in #14315 (an IfcWindowStyle): walking every reference of the file
// with Deref finds exactly those.
func TestDanglingReferences(t *testing.T) {
	f, err := ReadFile(sample(t, "ifc2x3/example.ifc"), Options{})
	if err != nil {
		t.Fatal(err)
	}
	var walk func(from Instance, v Value)
	refs, found := 0, 0
	walk = func(from Instance, v Value) {
		switch v.Kind() {
		case KindRef:
			refs++
			if _, ok := f.Deref(from, v); ok {
				found++
			}
		case KindList:
			l, err := v.List()
			if err != nil {
				t.Fatal(err)
			}
			for _, e := range l {
				walk(from, e)
			}
		case KindTyped:
			_, in, _ := v.Typed()
			walk(from, in)
		}
	}
	for _, typ := range f.Types() {
		for _, in := range f.ByType(typ) {
			vs, err := in.Attrs()
			if err != nil {
				t.Fatal(err)
			}
			for _, v := range vs {
				walk(in, v)
			}
		}
	}
	if refs-found != 4 {
		t.Errorf("%d of %d references dangle, want 4", refs-found, refs)
	}
	var got []string
	for _, w := range f.Warnings() {
		if w.Code == "dangling-reference" {
			got = append(got, w.Msg)
			if w.ID != 14315 || w.Pos.Line != 6517 {
				t.Errorf("warning at %v, #%d", w.Pos, w.ID)
			}
		}
	}
	want := []string{
		"#14315 refers to #14688, which does not exist",
		"#14315 refers to #14744, which does not exist",
		"#14315 refers to #14747, which does not exist",
		"#14315 refers to #14687, which does not exist",
	}
	if strings.Join(got, "\n") != strings.Join(want, "\n") {
		t.Errorf("warnings:\n%s\nwant:\n%s", strings.Join(got, "\n"), strings.Join(want, "\n"))
	}
	// once per pair
	in, _ := f.Get(14315)
	f.Deref(in, in.Attr(5))
	l, _ := in.Attr(5).List()
	f.Deref(in, l[0])
	if n := len(f.Warnings()); n != 4 {
		t.Errorf("%d warnings after repeating, want 4", n)
	}
}

func TestComplexInstance(t *testing.T) {
	f := mustParse(t, doc("#1=(A(1,2)B('x')C());\n#2=X(#1);\n"))
	in, _ := f.Get(1)
	if !in.Complex() || in.Type() != "A" {
		t.Fatalf("Complex %v Type %q", in.Complex(), in.Type())
	}
	if in2, _ := f.Get(2); in2.Complex() {
		t.Error("#2 is not complex")
	}
	vs, err := in.Attrs()
	if err != nil || len(vs) != 3 {
		t.Fatalf("Attrs = %v, %v", vs, err)
	}
	name, params, ok := vs[1].Typed()
	l, _ := params.List()
	if s, _ := l[0].Text(); !ok || name != "B" || s != "x" {
		t.Errorf("record 1 = %q %v", name, l)
	}
	ws := f.Warnings()
	if len(ws) != 1 || ws[0].Code != "complex-instance" || ws[0].ID != 1 {
		t.Errorf("warnings = %v", ws)
	}
	counts := f.TypeCounts()
	if counts["A"] != 1 || counts["X"] != 1 || len(counts) != 2 {
		t.Errorf("TypeCounts = %v", counts)
	}
}

// Beyond Limits.MaxWarnings warnings are counted, not kept.
func TestWarningsCapped(t *testing.T) {
	var b strings.Builder
	for i := 1; i <= 50; i++ {
		b.WriteString("#" + itoa(i) + "=(A(#" + itoa(1000+i) + ")B());\n")
	}
	f, err := Parse([]byte(doc(b.String())), "t.ifc", Options{Limits: Limits{MaxWarnings: 10}})
	if err != nil {
		t.Fatal(err)
	}
	for i := uint32(1); i <= 50; i++ {
		in, _ := f.Get(i)
		_, params, _ := in.Attr(0).Typed()
		l, _ := params.List()
		f.Deref(in, l[0])
	}
	ws := f.Warnings()
	if len(ws) != 11 || ws[10].Code != "warnings-truncated" || ws[10].Msg != "90 more warnings not kept (limit 10)" {
		t.Errorf("got %d warnings, last %v", len(ws), ws[len(ws)-1])
	}
}
