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
	rss := func() int {
		b, err := os.ReadFile("/proc/self/status")
		if err != nil {
			return -1
		}
		for _, line := range strings.Split(string(b), "\n") {
			if v, ok := strings.CutPrefix(line, "RssFile:"); ok {
				n, _ := strconv.Atoi(strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(v), "kB")))
				return n
			}
		}
		return -1
	}
	r0 := rss()
	f.DropPages()
	if r1 := rss(); r0 > 0 && r0-r1 < 6<<10 {
		t.Errorf("RssFile %d kB before DropPages, %d kB after: want at least 6 MiB less", r0, r1)
	}
	for k, in := range f.ByType("IFCBUILDINGELEMENTPROXY")[:64] {
		if s, err := in.Attr(2).Text(); err != nil || s != before[k] {
			t.Fatalf("after DropPages: %q, %v; want %q", s, err, before[k])
		}
	}
	mustParse(t, doc("#1=IFCX(1);\n")).DropPages() // data in memory: nothing to do
}
