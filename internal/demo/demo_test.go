package demo

import (
	"bytes"
	"flag"
	"os"
	"path/filepath"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the demo files in testdata/demo")

// TestDemoFilesUpToDate keeps the committed demo model and side-car in step
// with this writer. Run with -update after changing the scenario.
func TestDemoFilesUpToDate(t *testing.T) {
	cases := []struct {
		file  string
		write func(*bytes.Buffer) error
	}{
		{"tern-street-depot.ifc", func(b *bytes.Buffer) error { return Write(b, Units{}) }},
		{"tern-street-depot-m-n.ifc", func(b *bytes.Buffer) error { return Write(b, Units{Metres: true, Newtons: true}) }},
		{"tern-street-depot-actions.csv", func(b *bytes.Buffer) error { return WriteActionsCSV(b) }},
		{"tern-street-depot-storeys.csv", func(b *bytes.Buffer) error { return WriteStoreysCSV(b) }},
	}
	for _, c := range cases {
		var b bytes.Buffer
		if err := c.write(&b); err != nil {
			t.Fatal(err)
		}
		path := filepath.Join("..", "..", "testdata", "demo", c.file)
		if *update {
			if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
				t.Fatal(err)
			}
			if err := os.WriteFile(path, b.Bytes(), 0o644); err != nil {
				t.Fatal(err)
			}
			continue
		}
		got, err := os.ReadFile(path)
		if err != nil {
			t.Fatalf("%v (run go test ./internal/demo -update)", err)
		}
		if !bytes.Equal(got, b.Bytes()) {
			t.Errorf("%s is out of date: run go test ./internal/demo -update", c.file)
		}
	}
}

func TestGlobalIDsAreValidAndUnique(t *testing.T) {
	seen := map[string]string{}
	for _, name := range []string{"a", "b", "column/A1/G", "column/A1/M"} {
		g := globalID(name)
		if len(g) != 22 || g[0] > '3' {
			t.Errorf("globalID(%q) = %q: not a valid IFC GlobalId", name, g)
		}
		if prev, ok := seen[g]; ok {
			t.Errorf("globalID collision %q and %q", prev, name)
		}
		seen[g] = name
	}
}
