//go:build !linux

package ifcstep

import "os"

func mapFile(fh *os.File, size int64) ([]byte, bool) { return nil, false }
func unmapWhenUnreachable(f *File, data []byte)      {}
func unmap(data []byte)                              {}
func dropPages(data []byte)                          {}
