package ifcstep

import (
	"os"
	"path/filepath"
	"syscall"
	"testing"
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
