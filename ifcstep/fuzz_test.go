package ifcstep

import (
	"os"
	"path/filepath"
	"testing"
)

// FuzzParse parses arbitrary bytes serially and in parallel chunks, with and
// without recording references (all must agree), and decodes every
// attribute of every instance. Run it with
//
//	go test ./ifcstep -run '^$' -fuzz FuzzParse -fuzztime 60s
func FuzzParse(f *testing.F) {
	// seeds: the small public samples
	for _, rel := range []string{
		"ifc4/beam_01.ifc", "ifc4/cantilever_01.ifc", "ifc4/portal_01.ifc", "ifc4/grid_of_beams.ifc",
		"ifc4x3/column-extruded-solid.ifc", "ifc4x3/beam-extruded-solid.ifc", "ifc4x3/beam-varying-profiles.ifc",
		"ifc4x3/column-straight-rectangle-tessellation.ifc", "ifc4x3/structural-curve-member.ifc",
		"ifc4x3/mapped-shape-with-transformation.ifc", "ifc4x3/curve-parameters-in-degrees.ifc",
	} {
		if data, err := os.ReadFile(filepath.Join(samplesDir, rel)); err == nil {
			f.Add(data)
		}
	}
	// hand cases
	for _, s := range []string{
		trickyDocN(8),
		doc(`#1=X('N\S\0 250','Grundst\X2\00FC\X0\ck','\X4\0001F600\X0\','\PE\\S\P','a''b','\\');` + "\n"),
		doc(`#1=X('\X2\00F\X0\','\X\G','\Q','\');` + "\n"),
		doc("#1=(A(1)B((2,3),'x')C());\n#2=X(#1,#3);\n"),
		doc(`#1=X(IFCLENGTHMEASURE(2.5),(IFCREAL(1.),IFCREAL(2.)),"0FF",.T.,$,*,-0.,1.E-05,4.5000000E+002);` + "\n"),
		doc("#1 = X ( /* c */ 1 , ( ( 2 ) ) ) ;\r\n#4294967295=Y();\n"),
		doc("#1=X((((((((((1))))))))));\n"),
		docSchema("IFC4X1", "#1=X(1);\n"),
		"ISO-10303-21;\nHEADER;\nENDSEC;\nDATA;\nENDSEC;\nEND-ISO-10303-21;\n",
		"",
	} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		lim := Limits{MaxDepth: 16, MaxStringLen: 4096, MaxInstances: 100000, MaxWarnings: 100}
		refTypes := []string{"X", "Y", "IFCX", "IFCY", "IFCLABEL", "IFCRELDEFINESBYPROPERTIES", "IFCRELAGGREGATES",
			"IFCPROPERTYSET", "IFCCOLUMN", "IFCSHAPEREPRESENTATION"}
		f1, err1 := Parse(data, "fuzz.ifc", Options{Workers: 1, Limits: lim, RefTypes: refTypes})
		f2, err2 := Parse(data, "fuzz.ifc", Options{Workers: 3, Limits: lim, chunkSize: 5 + len(data)%97, RefTypes: refTypes})
		if (err1 == nil) != (err2 == nil) || err1 != nil && err1.Error() != err2.Error() {
			t.Fatalf("serial: %v\nchunked: %v", err1, err2)
		}
		// Recording references (skipListRefs) checks exactly what skipList does.
		f0, err0 := Parse(data, "fuzz.ifc", Options{Workers: 1, Limits: lim})
		if (err0 == nil) != (err1 == nil) || err0 != nil && err0.Error() != err1.Error() {
			t.Fatalf("without RefTypes: %v\nwith: %v", err0, err1)
		}
		if err0 == nil {
			if d := sameIndex(f0, f1); d != "" {
				t.Fatalf("without and with RefTypes differ: %s", d)
			}
		}
		if err1 != nil {
			if _, ok := err1.(*Error); !ok {
				t.Fatalf("error of type %T", err1)
			}
			return
		}
		if d := sameIndex(f1, f2); d != "" {
			t.Fatalf("serial and chunked differ: %s", d)
		}
		for s := 0; s < f1.Len(); s++ {
			in := Instance{f: f1, s: uint32(s)}
			if got, ok := f1.Get(in.ID()); !ok || got.ID() != in.ID() {
				t.Fatalf("Get(%d) failed", in.ID())
			}
			_ = decodeInstance(in)
			_ = in.NumAttrs()
			for _, v := range func() []Value { vs, _ := in.Attrs(); return vs }() {
				f1.Deref(in, v)
			}
		}
		for _, typ := range f1.Types() {
			_ = f1.ByType(typ)
			var r1, r2 []Ref
			f1.RefsOf(typ, func(in Instance, refs []Ref) { r1 = append(r1, refs...) })
			f2.RefsOf(typ, func(in Instance, refs []Ref) { r2 = append(r2, refs...) })
			if len(r1) != len(r2) {
				t.Fatalf("RefsOf(%s): serial %d references, chunked %d", typ, len(r1), len(r2))
			}
			for k := range r1 {
				if r1[k] != r2[k] {
					t.Fatalf("RefsOf(%s): serial %v, chunked %v", typ, r1[k], r2[k])
				}
			}
		}
		_ = f1.TypeCounts()
		_ = f1.Warnings()
		_ = f1.Position(len(data) / 2)
	})
}
