package ifcstep

import (
	"os"
	"path/filepath"
	"testing"
)

// samplesDir holds the public sample models (see its README.md).
const samplesDir = "../../shared/samples"

func sample(t testing.TB, rel string) string {
	t.Helper()
	p := filepath.Join(samplesDir, rel)
	if _, err := os.Stat(p); err != nil {
		t.Skipf("sample %s not available: %v", rel, err)
	}
	return p
}

// TestSampleCounts parses every sample and compares the instance count with
// the reference parser where the samples' README gives one.
func TestSampleCounts(t *testing.T) {
	// source: shared/samples/README.md, instance counts of web-ifc 0.0.78
	want := map[string]int{
		"ifc2x3/steel-mini-project.ifc":    49044,
		"ifc2x3/duplex.ifc":                38898,
		"ifc4/fzk-haus.ifc":                44249,
		"ifc4/building_02.ifc":             31851,
		"ifc2x3/example.ifc":               6490,
		"ifc4x3/grid-placement.ifc":        525,
		"ifc4x3/column-extruded-solid.ifc": 43,
	}
	files, _ := filepath.Glob(filepath.Join(samplesDir, "*", "*.ifc"))
	if len(files) == 0 {
		t.Skip("no samples")
	}
	for _, path := range files {
		rel, _ := filepath.Rel(samplesDir, path)
		rel = filepath.ToSlash(rel)
		t.Run(rel, func(t *testing.T) {
			for _, workers := range []int{1, 2, 4} {
				f, err := ReadFile(path, Options{Workers: workers})
				if err != nil {
					t.Fatalf("workers %d: %v", workers, err)
				}
				if n, ok := want[rel]; ok && f.Len() != n {
					t.Errorf("workers %d: Len = %d, want %d", workers, f.Len(), n)
				}
				if f.Family == FamilyUnknown {
					t.Errorf("no family")
				}
				// every instance decodes
				for _, typ := range f.Types() {
					for _, in := range f.ByType(typ) {
						if _, err := in.Attrs(); err != nil {
							t.Fatalf("%v: %v", in, err)
						}
					}
				}
			}
		})
	}
}
