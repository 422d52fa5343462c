package ifc

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strconv"
	"testing"

	"swaygate/ifcstep"
	"swaygate/internal/ifcgen"
)

// TestRecordedRefs extracts every sample, fixture, the demo and a generated
// model twice, from a File that recorded the references of RefTypes while
// indexing and from one that did not, and expects the same model.
func TestRecordedRefs(t *testing.T) {
	var paths []string
	for _, pat := range []string{filepath.Join(samplesDir, "*", "*.ifc"), filepath.Join(fixturesDir, "*.ifc"), filepath.Join(demoDir, "*.ifc")} {
		m, _ := filepath.Glob(pat)
		paths = append(paths, m...)
	}
	var gen bytes.Buffer
	if _, err := ifcgen.Write(&gen, ifcgen.Options{Columns: 300, Storeys: 3}); err != nil {
		t.Fatal(err)
	}
	type model struct {
		name string
		data []byte
	}
	models := []model{{"generated", gen.Bytes()}}
	for _, p := range paths {
		data, err := os.ReadFile(p)
		if err != nil {
			t.Fatal(err)
		}
		models = append(models, model{p, data})
	}
	recorded := 0
	for _, md := range models {
		plain, err := ifcstep.Parse(md.data, md.name, ifcstep.Options{})
		if err != nil || plain.Family == ifcstep.FamilyUnknown {
			continue // files that are not meant to be read
		}
		rec, err := ifcstep.Parse(md.data, md.name, ifcstep.Options{RefTypes: RefTypes()})
		if err != nil {
			t.Fatal(err)
		}
		for _, opt := range []Options{{}, {MemberTypes: []string{"*"}}, {LoadCases: true}} {
			want, err := Extract(plain, opt)
			if err != nil {
				t.Fatal(err)
			}
			got, err := Extract(rec, opt)
			if err != nil {
				t.Fatal(err)
			}
			if path := differ(reflect.ValueOf(got), reflect.ValueOf(want), "model"); path != "" {
				t.Fatalf("%s %+v: extraction from recorded references differs at %s", md.name, opt, path)
			}
		}
		for _, typ := range RefTypes() {
			rec.RefsOf(typ, func(ifcstep.Instance, []ifcstep.Ref) { recorded++ })
		}
	}
	if recorded < 1000 {
		t.Errorf("only %d recorded relationships: the test does not exercise the recorded path", recorded)
	}
}

// differ returns the path of the first difference between a and b, "" when
// they are equal; NaN equals NaN, and pointers are compared by what they
// point to.
func differ(a, b reflect.Value, path string) string {
	if a.Kind() != b.Kind() {
		return path + " (kind)"
	}
	switch a.Kind() {
	case reflect.Float32, reflect.Float64:
		x, y := a.Float(), b.Float()
		if x != y && !(math.IsNaN(x) && math.IsNaN(y)) {
			return path
		}
	case reflect.Pointer, reflect.Interface:
		if a.IsNil() || b.IsNil() {
			if a.IsNil() != b.IsNil() {
				return path + " (nil)"
			}
			return ""
		}
		return differ(a.Elem(), b.Elem(), path)
	case reflect.Struct:
		for i := range a.NumField() {
			if p := differ(a.Field(i), b.Field(i), path+"."+a.Type().Field(i).Name); p != "" {
				return p
			}
		}
	case reflect.Slice, reflect.Array:
		if a.Len() != b.Len() {
			return path + " (length " + strconv.Itoa(a.Len()) + " vs " + strconv.Itoa(b.Len()) + ")"
		}
		for i := range a.Len() {
			if p := differ(a.Index(i), b.Index(i), path+"["+strconv.Itoa(i)+"]"); p != "" {
				return p
			}
		}
	case reflect.Map:
		if a.Len() != b.Len() {
			return path + " (map size)"
		}
		for _, k := range a.MapKeys() {
			if p := differ(a.MapIndex(k), b.MapIndex(k), path+"[key]"); p != "" {
				return p
			}
		}
	case reflect.String:
		if a.String() != b.String() {
			return path
		}
	case reflect.Bool:
		if a.Bool() != b.Bool() {
			return path
		}
	case reflect.Int, reflect.Int8, reflect.Int16, reflect.Int32, reflect.Int64:
		if a.Int() != b.Int() {
			return path
		}
	case reflect.Uint, reflect.Uint8, reflect.Uint16, reflect.Uint32, reflect.Uint64, reflect.Uintptr:
		if a.Uint() != b.Uint() {
			return path
		}
	}
	return ""
}
