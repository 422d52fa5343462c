package ifcstep

import (
	"math"
	"reflect"
	"testing"
)

// Token forms from ifc-facts §1.3 (ISO 10303-21 WSN), many as they occur in
// the public samples.
func TestValueKinds(t *testing.T) {
	tests := []struct {
		in   string
		kind Kind
		raw  string
	}{
		{"$", KindUnset, "$"},
		{"*", KindDerived, "*"},
		{"42", KindInt, "42"},
		{"-7", KindInt, "-7"},
		{"+3", KindInt, "+3"},
		{"0.", KindReal, "0."},
		{"-0.", KindReal, "-0."},
		{"1.E-05", KindReal, "1.E-05"},
		{"4.5000000E+002", KindReal, "4.5000000E+002"},
		{"3.63797880709171E-12", KindReal, "3.63797880709171E-12"},
		{"1.5e3", KindReal, "1.5e3"},
		{"'abc'", KindString, "'abc'"},
		{"''", KindString, "''"},
		{"'it''s'", KindString, "'it''s'"},
		{".MILLI.", KindEnum, ".MILLI."},
		{".LOAD_CASE.", KindEnum, ".LOAD_CASE."},
		{"#12", KindRef, "#12"},
		{"(1,2)", KindList, "(1,2)"},
		{"()", KindList, "()"},
		{"((96.),(192.))", KindList, "((96.),(192.))"},
		{"IFCLENGTHMEASURE(2.5)", KindTyped, "IFCLENGTHMEASURE(2.5)"},
		{"IFCLABEL ( 'x' )", KindTyped, "IFCLABEL ( 'x' )"},
		{`"0FF"`, KindBinary, `"0FF"`},
		{" /* c */ 5 /* d */", KindInt, "5"},
	}
	for _, tt := range tests {
		t.Run(tt.in, func(t *testing.T) {
			v := attr0(t, tt.in)
			if v.Kind() != tt.kind || string(v.Raw()) != tt.raw {
				t.Errorf("got %v %q, want %v %q", v.Kind(), v.Raw(), tt.kind, tt.raw)
			}
		})
	}
}

func TestValueAccessors(t *testing.T) {
	t.Run("int", func(t *testing.T) {
		for in, want := range map[string]int64{"42": 42, "-7": -7, "+3": 3, "IFCINTEGER(12)": 12, "9223372036854775807": math.MaxInt64, "-9223372036854775808": math.MinInt64} {
			if got, ok := attr0(t, in).Int(); !ok || got != want {
				t.Errorf("%s: Int = %d, %v; want %d", in, got, ok, want)
			}
		}
		for _, in := range []string{"9223372036854775808", "1.", "'1'", "$"} {
			if got, ok := attr0(t, in).Int(); ok {
				t.Errorf("%s: Int = %d, want !ok", in, got)
			}
		}
	})
	t.Run("real", func(t *testing.T) {
		tests := map[string]float64{
			"0.": 0, "1.E-05": 1e-05, "4.5000000E+002": 450, "3.63797880709171E-12": 3.63797880709171e-12,
			"1.5e3": 1500, "7": 7, "IFCLENGTHMEASURE(2.5)": 2.5, "IFCPOSITIVERATIOMEASURE(0.85)": 0.85,
			"-2.": -2,
		}
		for in, want := range tests {
			if got, ok := attr0(t, in).Real(); !ok || got != want {
				t.Errorf("%s: Real = %g, %v; want %g", in, got, ok, want)
			}
		}
		if got, ok := attr0(t, "-0.").Real(); !ok || got != 0 || !math.Signbit(got) {
			t.Errorf("-0.: Real = %g, %v; want -0", got, ok)
		}
		if _, ok := attr0(t, "1.E999").Real(); ok {
			t.Error("1.E999: want !ok")
		}
	})
	t.Run("bool", func(t *testing.T) {
		tests := []struct {
			in    string
			b, ok bool
		}{{".T.", true, true}, {".F.", false, true}, {".U.", false, false}, {"IFCBOOLEAN(.T.)", true, true}, {"IFCLOGICAL(.F.)", false, true}, {"1", false, false}}
		for _, tt := range tests {
			if b, ok := attr0(t, tt.in).Bool(); b != tt.b || ok != tt.ok {
				t.Errorf("%s: Bool = %v, %v; want %v, %v", tt.in, b, ok, tt.b, tt.ok)
			}
		}
	})
	t.Run("enum", func(t *testing.T) {
		if s, ok := attr0(t, ".MILLI.").Enum(); !ok || s != "MILLI" {
			t.Errorf("Enum = %q, %v", s, ok)
		}
		if s, ok := attr0(t, "IFCCOLUMNTYPEENUM(.COLUMN.)").Enum(); !ok || s != "COLUMN" {
			t.Errorf("typed Enum = %q, %v", s, ok)
		}
	})
	t.Run("ref", func(t *testing.T) {
		if id, ok := attr0(t, "#4294967295").Ref(); !ok || id != 4294967295 {
			t.Errorf("Ref = %d, %v", id, ok)
		}
		if _, ok := attr0(t, "#4294967296").Ref(); ok {
			t.Error("#4294967296: want !ok")
		}
	})
	t.Run("typed", func(t *testing.T) {
		name, in, ok := attr0(t, "ifcLengthMeasure( 2.5 )").Typed()
		if !ok || name != "IFCLENGTHMEASURE" || in.Kind() != KindReal || string(in.Raw()) != "2.5" {
			t.Errorf("Typed = %q, %v %q, %v", name, in.Kind(), in.Raw(), ok)
		}
		if _, _, ok := attr0(t, "IFCX(1,2)").Typed(); ok {
			t.Error("IFCX(1,2): a typed value has one parameter")
		}
	})
	t.Run("list", func(t *testing.T) {
		v := attr0(t, "( #1 , 'a''b', (1.,2.) ,$, IFCREAL(1.) )")
		l, err := v.List()
		if err != nil {
			t.Fatal(err)
		}
		var kinds []Kind
		for _, e := range l {
			kinds = append(kinds, e.Kind())
		}
		want := []Kind{KindRef, KindString, KindList, KindUnset, KindTyped}
		if !reflect.DeepEqual(kinds, want) {
			t.Errorf("kinds = %v, want %v", kinds, want)
		}
		if s, _ := l[1].Text(); s != "a'b" {
			t.Errorf("Text = %q", s)
		}
		if l, err := attr0(t, "()").List(); err != nil || len(l) != 0 {
			t.Errorf("() = %v, %v", l, err)
		}
		if _, err := attr0(t, "5").List(); err == nil {
			t.Error("List of an integer: want error")
		}
	})
	t.Run("binary", func(t *testing.T) {
		tests := map[string][]byte{`"0FF"`: {0xFF}, `"1FF"`: {0x7F}, `"3F"`: {0x01}, `"0"`: {}, `"00123"`: {0x01, 0x23}, `"2abc"`: {0x02, 0xBC}, `"30F"`: {0x0F}}
		for in, want := range tests {
			if got, err := attr0(t, in).Binary(); err != nil || !reflect.DeepEqual(got, want) {
				t.Errorf("%s: Binary = %x, %v; want %x", in, got, err, want)
			}
		}
	})
}

func TestWrongKindError(t *testing.T) {
	f := mustParse(t, doc("#7=X(.A.);\n"))
	in, _ := f.Get(7)
	_, err := in.Attr(0).Text()
	want := "t.ifc: line 8, column 6 (byte 193, #7): expected a string, found an enumeration"
	if err == nil || err.Error() != want {
		t.Errorf("err = %v\nwant  %s", err, want)
	}
	if e, ok := err.(*Error); !ok || e.Kind != ErrWrongKind {
		t.Errorf("err = %#v, want *Error of kind ErrWrongKind", err)
	}
}

func TestAttrs(t *testing.T) {
	f := mustParse(t, doc("#1 = IFCCARTESIANPOINT ( ( 0. , -1.5 , 2.E+3 ) ) ;\r\n#2=IFCX();\n#3=IFCY($,*,#1);\n"))
	in, _ := f.Get(1)
	if in.Type() != "IFCCARTESIANPOINT" || in.NumAttrs() != 1 {
		t.Fatalf("%v: %d attributes", in, in.NumAttrs())
	}
	l, err := in.Attr(0).List()
	if err != nil {
		t.Fatal(err)
	}
	var got []float64
	for _, v := range l {
		x, _ := v.Real()
		got = append(got, x)
	}
	if !reflect.DeepEqual(got, []float64{0, -1.5, 2000}) {
		t.Errorf("coordinates = %v", got)
	}
	in2, _ := f.Get(2)
	if vs, err := in2.Attrs(); err != nil || len(vs) != 0 || in2.NumAttrs() != 0 {
		t.Errorf("#2: %v, %v", vs, err)
	}
	if f.At(0).ID() != 1 || f.At(2).ID() != 3 || f.At(3).ID() != 0 || f.At(-1).Type() != "" {
		t.Errorf("At: %v %v %v", f.At(0), f.At(2), f.At(3))
	}
	in3, _ := f.Get(3)
	if in3.NumAttrs() != 3 || !in3.Attr(0).IsUnset() || !in3.Attr(1).IsDerived() || !in3.Attr(5).IsUnset() {
		t.Errorf("#3 attributes wrong")
	}
	if tgt, ok := f.Deref(in3, in3.Attr(2)); !ok || tgt.ID() != 1 {
		t.Errorf("Deref = %v, %v", tgt, ok)
	}
}

func TestAppendNoAlloc(t *testing.T) {
	f := mustParse(t, doc("#1=IFCX((1.,2.,3.),#2,'a',IFCLABEL('b'),.T.);\n#2=IFCY();\n"))
	in, _ := f.Get(1)
	buf := make([]Value, 0, 8)
	lbuf := make([]Value, 0, 8)
	allocs := testing.AllocsPerRun(100, func() {
		vs, err := in.AppendAttrs(buf[:0])
		if err != nil || len(vs) != 5 {
			t.Fatalf("AppendAttrs = %v, %v", vs, err)
		}
		l, err := vs[0].AppendList(lbuf[:0])
		if err != nil || len(l) != 3 {
			t.Fatalf("AppendList = %v, %v", l, err)
		}
		if x, ok := l[2].Real(); !ok || x != 3 {
			t.Fatalf("Real = %v", x)
		}
		if id, ok := vs[1].Ref(); !ok || id != 2 {
			t.Fatalf("Ref = %v", id)
		}
		if b, ok := vs[4].Bool(); !ok || !b {
			t.Fatal("Bool")
		}
		if in.Type() != "IFCX" || in.NumAttrs() != 5 || in.Attr(3).Kind() != KindTyped {
			t.Fatal("Type/NumAttrs/Attr")
		}
	})
	if allocs != 0 {
		t.Errorf("%v allocations per run, want 0", allocs)
	}
}

// TestAttrsLayouts decodes the same instance written in every layout the
// syntax allows around its id, '=' and type name: the attribute list is
// found by the fast path for "#N=TYPE(" and by the scan otherwise.
func TestAttrsLayouts(t *testing.T) {
	for _, stmt := range []string{
		"#7=IFCX(1,'a',#2);",
		"#7 = IFCX (1,'a',#2);",
		"#7=IFCX\n(1,'a',#2);",
		"#7=/* c */IFCX(1,'a',#2);",
		"#007=IFCX(1,'a',#2);",
		"#7=ifcx(1,'a',#2);",
		"#7=IFCX( 1 , 'a' ,#2 );",
	} {
		f := mustParse(t, doc("#2=IFCY();\n"+stmt+"\n"))
		in, ok := f.Get(7)
		if !ok {
			t.Fatalf("%s: no #7", stmt)
		}
		vs, err := in.Attrs()
		if err != nil || len(vs) != 3 {
			t.Fatalf("%s: Attrs = %v, %v", stmt, vs, err)
		}
		if n, _ := vs[0].Int(); n != 1 {
			t.Errorf("%s: attribute 0 = %d", stmt, n)
		}
		if s, _ := in.Attr(1).Text(); s != "a" {
			t.Errorf("%s: attribute 1 = %q", stmt, s)
		}
		if r, _ := in.Attr(2).Ref(); r != 2 || in.NumAttrs() != 3 {
			t.Errorf("%s: attribute 2 = #%d, %d attributes", stmt, r, in.NumAttrs())
		}
	}
}
