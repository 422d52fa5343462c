package ifcstep

import (
	"os"
	"path/filepath"
	"slices"
	"testing"
)

// decodedRefs is what RefsOf should give for in, found by decoding its
// attributes.
func decodedRefs(t testing.TB, in Instance) []Ref {
	t.Helper()
	vs, err := in.Attrs()
	if err != nil {
		t.Fatalf("%s: %v", in, err)
	}
	var out []Ref
	var walk func(v Value, attr, depth int, typed bool)
	walk = func(v Value, attr, depth int, typed bool) {
		switch v.Kind() {
		case KindRef:
			id, _ := v.Ref()
			out = append(out, Ref{ID: id, Attr: uint16(attr), Depth: uint8(depth), Typed: typed})
		case KindList:
			es, err := v.List()
			if err != nil {
				t.Fatalf("%s: %v", in, err)
			}
			for _, e := range es {
				walk(e, attr, depth+1, typed)
			}
		case KindTyped:
			if _, inner, ok := v.Typed(); ok {
				walk(inner, attr, depth+1, true)
			}
		}
	}
	for a, v := range vs {
		walk(v, a, 1, false)
	}
	return out
}

// checkRefs compares RefsOf with the decoded references for every type of f
// (all of them recorded) and returns the number of instances seen.
func checkRefs(t testing.TB, f *File) int {
	t.Helper()
	n := 0
	for _, typ := range f.Types() {
		ok := f.RefsOf(typ, func(in Instance, refs []Ref) {
			n++
			if in.Type() != typ {
				t.Fatalf("RefsOf(%s) gave %s", typ, in)
			}
			if want := decodedRefs(t, in); !slices.Equal(refs, want) {
				t.Fatalf("%s: RefsOf %v, decoded %v", in, refs, want)
			}
		})
		if !ok {
			t.Fatalf("RefsOf(%s): not recorded", typ)
		}
	}
	return n
}

// TestRefsOf records the references of every type while indexing and checks
// them against the decoded attributes, serially and in small chunks, on
// hand-made layouts and on the public samples.
func TestRefsOf(t *testing.T) {
	src := doc("#1=IFCX('#9 is not a ref',$,#2,(#3,#4),IFCY(#5),(IFCY(#6)),((#7)),*);\n" +
		"#2 = IFCX ( /* #8 */ 'it''s #9' , #3 , ( #1 , #2 ) , IFCY ( ( #4 ) ) ) ;\n" +
		"#3=IFCZ(.T.,\"0FF\",1.5E-3,#4294967295);\n#4=IFCZ();\n#5=(IFCA(#1)IFCB(#2));\n")
	all := []string{"IFCX", "ifcz", "IFCA", "IFCB"}
	for _, opt := range []Options{{Workers: 1, RefTypes: all}, {Workers: 3, RefTypes: all, chunkSize: 40}} {
		f, err := Parse([]byte(src), "t.ifc", opt)
		if err != nil {
			t.Fatal(err)
		}
		var x1 []Ref
		if !f.RefsOf("ifcx", func(in Instance, refs []Ref) {
			if in.ID() == 1 {
				x1 = slices.Clone(refs)
			}
		}) {
			t.Fatal("IFCX not recorded")
		}
		want := []Ref{{2, 2, 1, false}, {3, 3, 2, false}, {4, 3, 2, false}, {5, 4, 2, true}, {6, 5, 3, true}, {7, 6, 3, false}}
		if !slices.Equal(x1, want) {
			t.Errorf("#1: %v, want %v", x1, want)
		}
		if n := checkRefs(t, f); n != 4 {
			t.Errorf("%d recorded instances, want 4 (the complex #5 is not recorded)", n)
		}
		if f.RefsOf("IFCY", func(Instance, []Ref) {}) {
			t.Error("IFCY was not asked for, but RefsOf says it was recorded")
		}
	}
	if (&File{}).RefsOf("IFCX", func(Instance, []Ref) {}) {
		t.Error("a File without recorded types says IFCX was recorded")
	}

	files, _ := filepath.Glob(filepath.Join(samplesDir, "*", "*.ifc"))
	for _, path := range files {
		data, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		plain, err := Parse(data, path, Options{Workers: 1})
		if err != nil {
			continue // the samples that are not meant to parse
		}
		for _, opt := range []Options{{Workers: 1}, {Workers: 3, chunkSize: 1 << 16}} {
			opt.RefTypes = plain.Types()
			f, err := Parse(data, path, opt)
			if err != nil {
				t.Fatal(err)
			}
			if d := sameIndex(plain, f); d != "" {
				t.Fatalf("%s: recording changes the index: %s", path, d)
			}
			if n := checkRefs(t, f); n != f.Len()-len(f.cplx) {
				t.Errorf("%s: %d instances recorded of %d", path, n, f.Len()-len(f.cplx))
			}
		}
	}
}
