package main

import (
	"bytes"
	"errors"
	"flag"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// The -update flag rewrites golden files. It is registered in init only if no
// other test file of the package has registered it.
func init() {
	if flag.Lookup("update") == nil {
		flag.Bool("update", false, "rewrite the golden files")
	}
}

func updateGolden() bool {
	f := flag.Lookup("update")
	return f != nil && f.Value.String() == "true"
}

const samplesDir = "../../../shared/samples"

func runCmd(t *testing.T, args ...string) (stdout, stderr string, err error) {
	t.Helper()
	var out, errb bytes.Buffer
	root := newRootCmd(&out, &errb)
	root.SetArgs(args)
	err = root.Execute()
	return out.String(), errb.String(), err
}

// Golden scan outputs of public samples (shared/samples/README.md).
func TestScanGolden(t *testing.T) {
	for _, rel := range []string{
		"ifc4x3/column-extruded-solid.ifc",
		"ifc4x3/structural-curve-member.ifc",
		"ifc2x3/example.ifc",
		"ifc4/building_02.ifc",
	} {
		t.Run(rel, func(t *testing.T) {
			path := filepath.Join(samplesDir, rel)
			if _, err := os.Stat(path); err != nil {
				t.Skipf("sample not available: %v", err)
			}
			out, _, err := runCmd(t, "scan", path)
			if err != nil {
				t.Fatal(err)
			}
			golden := filepath.Join("..", "..", "testdata", "golden", "scan", strings.TrimSuffix(filepath.Base(rel), ".ifc")+".json")
			if updateGolden() {
				if err := os.MkdirAll(filepath.Dir(golden), 0o755); err != nil {
					t.Fatal(err)
				}
				if err := os.WriteFile(golden, []byte(out), 0o644); err != nil {
					t.Fatal(err)
				}
			}
			want, err := os.ReadFile(golden)
			if err != nil {
				t.Fatalf("%v (run with -update to create it)", err)
			}
			if out != string(want) {
				t.Errorf("scan %s differs from %s:\n%s", rel, golden, out)
			}
		})
	}
}

func TestScanBadFile(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "bad.ifc")
	src := "ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION((''),'2;1');\nFILE_NAME('','',(''),(''),'','','');\n" +
		"FILE_SCHEMA(('IFC4'));\nENDSEC;\nDATA;\n#1=IFCX('open);\n"
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	out, _, err := runCmd(t, "scan", path)
	var ee *exitError
	if !errors.As(err, &ee) || ee.code != exitUsage {
		t.Fatalf("err = %v, want exit status %d", err, exitUsage)
	}
	want := path + ": line 8, column 9 (byte 134, #1): unterminated string: no closing apostrophe before the end of the file"
	if ee.msg != want {
		t.Errorf("message = %q\nwant      %q", ee.msg, want)
	}
	if out != "" {
		t.Errorf("stdout = %q, want nothing", out)
	}
}
