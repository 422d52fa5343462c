package ifcstep

import (
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"syscall"
	"testing"

	"swaygate/internal/ifcgen"
)

// A named pipe is read as a stream.
func TestReadFilePipe(t *testing.T) {
	path := filepath.Join(t.TempDir(), "pipe.ifc")
	if err := syscall.Mkfifo(path, 0o600); err != nil {
		t.Skipf("no fifo: %v", err)
	}
	go func() {
		w, err := os.OpenFile(path, os.O_WRONLY, 0)
		if err != nil {
			return
		}
		w.Write([]byte(doc("#1=IFCX(1);\n")))
		w.Close()
	}()
	f, err := ReadFile(path, Options{})
	if err != nil || f.Len() != 1 {
		t.Fatalf("ReadFile = %v, %v", f, err)
	}
}

// DropPages takes a mapped file's pages out of the resident memory, and the
// File reads the same afterwards.
func TestDropPages(t *testing.T) {
	path := filepath.Join(t.TempDir(), "big.ifc")
	fh, err := os.Create(path)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := ifcgen.Write(fh, ifcgen.Options{Columns: 60, Storeys: 3, TargetBytes: 8 << 20}); err != nil {
		t.Fatal(err)
	}
	fh.Close()
	f, err := ReadFile(path, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if !f.mapped {
		t.Fatal("a plain file of 8 MiB is not mapped")
	}
	before := make([]string, 0, 64)
	for _, in := range f.ByType("IFCBUILDINGELEMENTPROXY")[:64] {
		s, _ := in.Attr(2).Text()
		before = append(before, s)
	}
	r0 := rssFileKB(t)
	f.DropPages()
	if r1 := rssFileKB(t); r0-r1 < 6<<10 {
		t.Errorf("RssFile %d kB before DropPages, %d kB after: want at least 6 MiB less", r0, r1)
	}
	for k, in := range f.ByType("IFCBUILDINGELEMENTPROXY")[:64] {
		if s, err := in.Attr(2).Text(); err != nil || s != before[k] {
			t.Fatalf("after DropPages: %q, %v; want %q", s, err, before[k])
		}
	}
	mustParse(t, doc("#1=IFCX(1);\n")).DropPages() // data in memory: nothing to do
}

// A mapped file from dropMin up is not kept resident by the index: its pages
// are dropped chunk by chunk once skimmed, and the File reads the same as a
// parse of the bytes in memory.
func TestReadFileDropsWhileIndexing(t *testing.T) {
	if testing.Short() {
		t.Skip("writes a 70 MiB model")
	}
	path := filepath.Join(t.TempDir(), "large.ifc")
	fh, err := os.Create(path)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := ifcgen.Write(fh, ifcgen.Options{Columns: 200, Storeys: 4, TargetBytes: 70 << 20}); err != nil {
		t.Fatal(err)
	}
	fh.Close()
	before := rssFileKB(t)
	f, err := ReadFile(path, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if grew := rssFileKB(t) - before; grew > 35<<10 {
		t.Errorf("RssFile grew by %d kB while indexing a %d kB file: want less than half of it", grew, f.Size()>>10)
	}
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	want, err := Parse(data, path, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if d := sameIndex(want, f); d != "" {
		t.Fatal(d)
	}
	for k, in := range f.ByType("IFCCOLUMN") {
		w := want.ByType("IFCCOLUMN")[k]
		a, _ := in.Attr(0).Text()
		b, _ := w.Attr(0).Text()
		if a != b || a == "" {
			t.Fatalf("%s: GlobalId %q, in memory %q", in, a, b)
		}
	}
}

// rssFileKB is the process's resident file-backed memory, in kB.
func rssFileKB(t *testing.T) int {
	b, err := os.ReadFile("/proc/self/status")
	if err != nil {
		t.Skip(err)
	}
	for _, line := range strings.Split(string(b), "\n") {
		if v, ok := strings.CutPrefix(line, "RssFile:"); ok {
			n, _ := strconv.Atoi(strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(v), "kB")))
			return n
		}
	}
	t.Skip("no RssFile")
	return 0
}
