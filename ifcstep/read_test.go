package ifcstep

import (
	"archive/zip"
	"bytes"
	"compress/gzip"
	"errors"
	"os"
	"path/filepath"
	"runtime"
	"testing"

	"swaygate/internal/ifcgen"
)

func TestReadFormats(t *testing.T) {
	src := []byte(doc("#1=IFCX('a');\n#2=IFCY(#1);\n"))
	var gz bytes.Buffer
	zw := gzip.NewWriter(&gz)
	zw.Write(src)
	zw.Close()
	zipped := func(names ...string) []byte {
		var b bytes.Buffer
		w := zip.NewWriter(&b)
		for _, n := range names {
			fw, _ := w.Create(n)
			fw.Write(src)
		}
		w.Close()
		return b.Bytes()
	}
	dir := t.TempDir()
	tests := []struct {
		name string
		data []byte
		err  string
	}{
		{"plain.ifc", src, ""},
		{"model.ifc.gz", gz.Bytes(), ""},
		{"model.ifczip", zipped("readme.txt", "dir/Model.IFC"), ""},
		{"two.ifczip", zipped("a.ifc", "b.ifc"), "two.ifczip: line 1, column 1 (byte 0): zip archive holds 2 .ifc entries, expected one"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			path := filepath.Join(dir, tt.name)
			if err := os.WriteFile(path, tt.data, 0o644); err != nil {
				t.Fatal(err)
			}
			check := func(f *File, err error, name string) {
				t.Helper()
				if tt.err != "" {
					if err == nil || err.Error() != name+tt.err[len(tt.name):] {
						t.Errorf("err = %v, want %s", err, tt.err)
					}
					return
				}
				if err != nil {
					t.Fatal(err)
				}
				if f.Len() != 2 || f.Family != IFC4 {
					t.Errorf("Len %d Family %v", f.Len(), f.Family)
				}
			}
			f, err := ReadFile(path, Options{})
			check(f, err, path)
			f, err = Read(bytes.NewReader(tt.data), tt.name, Options{})
			check(f, err, tt.name)
		})
	}
	// the size limit applies to the decompressed text
	_, err := Read(bytes.NewReader(gz.Bytes()), "big.gz", Options{Limits: Limits{MaxFileSize: 50}})
	var e *Error
	if !errors.As(err, &e) || e.Kind != ErrLimit {
		t.Errorf("err = %v, want a limit error", err)
	}
	if _, err := ReadFile(filepath.Join(dir, "missing.ifc"), Options{}); err == nil {
		t.Error("missing file: want error")
	}
}

// A plain file above mmapMin is mapped; the result equals a parse of the
// bytes read, and the mapping is released after the File is dropped.
func TestReadFileMapped(t *testing.T) {
	path := filepath.Join(t.TempDir(), "big.ifc")
	fh, err := os.Create(path)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := ifcgen.Write(fh, ifcgen.Options{Columns: 60, Storeys: 3, TargetBytes: 5 << 20}); err != nil {
		t.Fatal(err)
	}
	fh.Close()
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	want, err := Parse(data, path, Options{})
	if err != nil {
		t.Fatal(err)
	}
	for range 3 {
		got, err := ReadFile(path, Options{})
		if err != nil {
			t.Fatal(err)
		}
		if d := sameIndex(want, got); d != "" {
			t.Fatal(d)
		}
		in := got.ByType("IFCBUILDINGELEMENTPROXY")[0]
		name, err := in.Attr(2).Text()
		if err != nil || name == "" {
			t.Fatalf("Text = %q, %v", name, err)
		}
		got = nil
		runtime.GC()
		if s, _ := in.Attr(2).Text(); s != name { // in keeps the File, and so the mapping, alive
			t.Fatalf("after GC: %q", s)
		}
	}
	runtime.GC()
	runtime.GC()
}
