package ifcgen

import (
	"bytes"
	"math"
	"testing"

	"swaygate/ifcstep"
)

// attribute counts of IFC4 entities (ifc-facts §2 and §3, flattened from the
// buildingSMART EXPRESS schema IFC4_ADD2_TC1).
var ifc4Arity = map[string]int{
	"IFCCOLUMN": 9, "IFCSTRUCTURALCURVEMEMBER": 9, "IFCSTRUCTURALCURVEREACTION": 10,
	"IFCSTRUCTURALLOADGROUP": 10, "IFCSTRUCTURALRESULTGROUP": 8, "IFCSTRUCTURALANALYSISMODEL": 10,
	"IFCBUILDINGSTOREY": 10, "IFCPROJECT": 9, "IFCISHAPEPROFILEDEF": 10, "IFCRECTANGLEHOLLOWPROFILEDEF": 8,
	"IFCMATERIALPROFILE": 6, "IFCMATERIALPROFILESET": 4, "IFCMATERIALPROFILESETUSAGE": 3, "IFCMATERIAL": 3,
	"IFCRELASSIGNSTOPRODUCT": 7, "IFCRELASSIGNSTOGROUP": 7, "IFCRELCONNECTSSTRUCTURALACTIVITY": 6,
	"IFCRELCONNECTSSTRUCTURALMEMBER": 10, "IFCSTRUCTURALPOINTCONNECTION": 9, "IFCSTRUCTURALLOADCONFIGURATION": 3,
	"IFCSTRUCTURALLOADSINGLEFORCE": 7, "IFCBOUNDARYNODECONDITION": 7, "IFCPROPERTYSINGLEVALUE": 4,
	"IFCPROPERTYSET": 5, "IFCRELDEFINESBYPROPERTIES": 6, "IFCRELCONTAINEDINSPATIALSTRUCTURE": 6,
	"IFCRELASSOCIATESMATERIAL": 6, "IFCEXTRUDEDAREASOLID": 4, "IFCLOCALPLACEMENT": 2, "IFCAXIS2PLACEMENT3D": 3,
	"IFCGEOMETRICREPRESENTATIONCONTEXT": 6, "IFCGEOMETRICREPRESENTATIONSUBCONTEXT": 10, "IFCSHAPEREPRESENTATION": 4,
	"IFCTOPOLOGYREPRESENTATION": 4, "IFCPRODUCTDEFINITIONSHAPE": 3, "IFCMATERIALPROPERTIES": 4,
	"IFCRELAGGREGATES": 6, "IFCCARTESIANPOINT": 1, "IFCDIRECTION": 1, "IFCPOLYLINE": 1, "IFCEDGE": 2,
	"IFCVERTEXPOINT": 1, "IFCUNITASSIGNMENT": 1, "IFCSIUNIT": 4, "IFCDERIVEDUNIT": 3, "IFCDERIVEDUNITELEMENT": 2,
	"IFCSITE": 14, "IFCBUILDING": 12, "IFCBUILDINGELEMENTPROXY": 9, "IFCPOLYLOOP": 1, "IFCFACEOUTERBOUND": 2,
	"IFCFACE": 1, "IFCCLOSEDSHELL": 1, "IFCFACETEDBREP": 1, "IFCTRIANGULATEDFACESET": 5, "IFCCARTESIANPOINTLIST3D": 1,
}

func generate(t *testing.T, opt Options) (*ifcstep.File, Stats, []byte) {
	t.Helper()
	var b bytes.Buffer
	st, err := Write(&b, opt)
	if err != nil {
		t.Fatal(err)
	}
	if int64(b.Len()) != st.Bytes {
		t.Errorf("Stats.Bytes = %d, wrote %d", st.Bytes, b.Len())
	}
	f, err := ifcstep.Parse(b.Bytes(), "gen.ifc", ifcstep.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return f, st, b.Bytes()
}

func TestModelIsValid(t *testing.T) {
	f, st, _ := generate(t, Options{Columns: 70, Storeys: 4, TargetBytes: 1 << 20, Seed: 7})
	if f.Family != ifcstep.IFC4 || f.Len() != st.Instances {
		t.Fatalf("family %v, %d instances (stats %d)", f.Family, f.Len(), st.Instances)
	}
	counts := f.TypeCounts()
	if counts["IFCCOLUMN"] != 70 || counts["IFCBUILDINGSTOREY"] != 4 || counts["IFCSTRUCTURALCURVEMEMBER"] != 70 ||
		counts["IFCSTRUCTURALCURVEREACTION"] != 140 || counts["IFCBUILDINGELEMENTPROXY"] != st.Proxies || st.Proxies == 0 {
		t.Errorf("counts: %v", counts)
	}
	if st.Bytes < 1<<20*95/100 || st.Bytes > 1<<20*110/100 {
		t.Errorf("size %d, want about 1 MiB", st.Bytes)
	}
	for _, typ := range f.Types() {
		want, known := ifc4Arity[typ]
		if !known {
			t.Errorf("type %s has no expected arity", typ)
		}
		for _, in := range f.ByType(typ) {
			vs, err := in.Attrs()
			if err != nil {
				t.Fatal(err)
			}
			if len(vs) != want {
				t.Fatalf("%v has %d attributes, want %d", in, len(vs), want)
			}
			for _, v := range vs {
				walk(t, f, in, v)
			}
		}
	}
	if ws := f.Warnings(); len(ws) != 0 {
		t.Errorf("warnings: %v", ws)
	}
}

// walk checks that every reference resolves and every string decodes.
func walk(t *testing.T, f *ifcstep.File, from ifcstep.Instance, v ifcstep.Value) {
	switch v.Kind() {
	case ifcstep.KindRef:
		if _, ok := f.Deref(from, v); !ok {
			t.Fatalf("%v: dangling %s", from, v.Raw())
		}
	case ifcstep.KindString:
		if _, err := v.Text(); err != nil {
			t.Fatal(err)
		}
	case ifcstep.KindList:
		l, err := v.List()
		if err != nil {
			t.Fatal(err)
		}
		for _, e := range l {
			walk(t, f, from, e)
		}
	case ifcstep.KindTyped:
		_, in, ok := v.Typed()
		if !ok {
			t.Fatalf("%v: bad typed value %s", from, v.Raw())
		}
		walk(t, f, from, in)
	}
}

// The end forces are in equilibrium (no load between the ends) and follow
// the end-force convention of design §4.2: in compression ForceX is positive
// at the start and negative at the end.
func TestEndForces(t *testing.T) {
	f, _, _ := generate(t, Options{Columns: 40, Storeys: 4, Seed: 3})
	for _, cfg := range f.ByType("IFCSTRUCTURALLOADCONFIGURATION") {
		forces, _ := cfg.Attr(1).List()
		locs, _ := cfg.Attr(2).List()
		last, _ := locs[1].List()
		L, _ := last[0].Real()
		var fv [2][7]float64
		for k := range forces {
			in, _ := f.Deref(cfg, forces[k])
			for j := 1; j < 7; j++ {
				fv[k][j], _ = in.Attr(j).Real()
			}
		}
		head, tail := fv[0], fv[1]
		if head[1] <= 0 || tail[1] >= 0 || head[1] != -tail[1] {
			t.Errorf("%v: ForceX %g, %g", cfg, head[1], tail[1])
		}
		// ΣFz = 0, ΣMy about the start = My0 + My1 - L·Fz1 = 0, ΣMz = Mz0 + Mz1 + L·Fy1 = 0
		tol := 1e-6 * (math.Abs(head[5]) + math.Abs(tail[5]) + math.Abs(head[6]) + math.Abs(tail[6]) + 1e3)
		if math.Abs(head[3]+tail[3]) > 1e-3 || math.Abs(head[5]+tail[5]-L*tail[3]) > tol || math.Abs(head[6]+tail[6]+L*tail[2]) > tol {
			t.Errorf("%v: not in equilibrium: head %v tail %v L %g", cfg, head, tail, L)
		}
	}
}

func TestDeterministic(t *testing.T) {
	_, _, a := generate(t, Options{Columns: 30, Storeys: 3, TargetBytes: 200 << 10, Seed: 5})
	_, _, b := generate(t, Options{Columns: 30, Storeys: 3, TargetBytes: 200 << 10, Seed: 5})
	_, _, c := generate(t, Options{Columns: 30, Storeys: 3, TargetBytes: 200 << 10, Seed: 6})
	if !bytes.Equal(a, b) {
		t.Error("same seed, different output")
	}
	if bytes.Equal(a, c) {
		t.Error("different seeds, same output")
	}
}

func TestSizing(t *testing.T) {
	if n := ColumnsForSize(32 << 20); n != 2000 {
		t.Errorf("ColumnsForSize(32 MiB) = %d", n)
	}
	if n := ColumnsForSize(300 << 20); n != 13500 {
		t.Errorf("ColumnsForSize(300 MiB) = %d", n)
	}
	if b := SizeForColumns(2000); b != 32<<20 {
		t.Errorf("SizeForColumns(2000) = %d", b)
	}
}

func TestEncode(t *testing.T) {
	tests := map[string]string{
		"plain":     "plain",
		"Client's":  "Client''s",
		`a\b`:       `a\\b`,
		"Büro":      `B\X2\00FC\X0\ro`,
		"Gießen 2×": `Gie\X2\00DF\X0\en 2\X2\00D7\X0\`,
		"😀":         `\X2\D83DDE00\X0\`,
	}
	for in, want := range tests {
		if got := encode(in, false); got != want {
			t.Errorf("encode(%q) = %q, want %q", in, got, want)
		}
	}
	if got := encode("N° 12 §", true); got != `N\S\0 12 \S\''` {
		t.Errorf("latin1: %q", got)
	}
}

// Every fit-out text decodes back to itself through ifcstep.
func TestEncodeRoundTrip(t *testing.T) {
	for _, it := range fitOut {
		for _, text := range []string{it.name, it.note} {
			src := "ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION((''),'2;1');\nFILE_NAME('','',(''),(''),'','','');\n" +
				"FILE_SCHEMA(('IFC4'));\nENDSEC;\nDATA;\n#1=IFCLABEL('" + encode(text, it.latin1) + "');\nENDSEC;\nEND-ISO-10303-21;\n"
			f, err := ifcstep.Parse([]byte(src), "rt.ifc", ifcstep.Options{})
			if err != nil {
				t.Fatal(err)
			}
			in, _ := f.Get(1)
			if got, err := in.Attr(0).Text(); err != nil || got != text {
				t.Errorf("%q -> %q -> %q, %v", text, encode(text, it.latin1), got, err)
			}
		}
	}
}
