//go:build linux

package ifcstep

import (
	"os"
	"runtime"
	"syscall"
)

// mmapMin is the size from which ReadFile maps a plain file instead of
// reading it: mapping avoids copying the file (about 13 ms for 32 MiB, a
// third of a scan) and its pages stay shared with the page cache.
const mmapMin = 4 << 20

// mapFile maps fh read-only. ok is false when the file cannot be mapped; the
// caller then reads it. A file below dropMin is populated at once (faster
// than faulting it in); a larger one is not: the index faults its pages in
// chunk by chunk and drops them again (dropSkimmed), so that the whole file
// is never resident at once.
func mapFile(fh *os.File, size int64) (data []byte, ok bool) {
	if size < mmapMin || int64(int(size)) != size {
		return nil, false
	}
	flags := syscall.MAP_SHARED
	if size < dropMin {
		flags |= syscall.MAP_POPULATE
	}
	data, err := syscall.Mmap(int(fh.Fd()), 0, int(size), syscall.PROT_READ, flags)
	if err != nil {
		return nil, false
	}
	return data, true
}

// unmapWhenUnreachable releases the mapping of f's data once f can no longer
// be reached. Instances and Values hold f, so the data outlives them.
func unmapWhenUnreachable(f *File, data []byte) {
	runtime.AddCleanup(f, func(b []byte) { _ = syscall.Munmap(b) }, data)
}

func unmap(data []byte) { _ = syscall.Munmap(data) }

// dropPages drops the resident pages of a mapping from the process: they
// stay in the page cache, and the next access maps them again.
func dropPages(data []byte) { _ = syscall.Madvise(data, syscall.MADV_DONTNEED) }
