package ifcstep

import (
	"archive/zip"
	"bufio"
	"bytes"
	"compress/gzip"
	"errors"
	"fmt"
	"io"
	"os"
	"path"
	"strings"
)

// ReadFile reads a model from disk, plain STEP, gzip (detected by its magic
// bytes) or a zip archive (.ifczip) holding one .ifc entry, and parses it,
// bounded by Limits.MaxFileSize (of the plain text). Errors are *Error for
// the content and wrapped os errors for I/O.
//
// A large plain file is memory-mapped (on Linux) rather than read: it must
// not be truncated or rewritten while the File is in use, and the mapping is
// released once the File, its Instances and Values are no longer reachable.
// Slices returned by Value.Raw are valid only while one of those is. The
// pages of a mapped file of 64 MiB or more do not stay resident: the index
// drops them chunk by chunk once skimmed, and later reads map what they
// touch again.
func ReadFile(path string, opt Options) (*File, error) {
	lim := opt.Limits.withDefaults()
	name := path
	if opt.Name != "" {
		name = opt.Name
	}
	fh, err := os.Open(path)
	if err != nil {
		return nil, fmt.Errorf("ifcstep: %s: %w", name, pathless(err))
	}
	defer fh.Close()
	st, err := fh.Stat()
	if err != nil {
		return nil, fmt.Errorf("ifcstep: %s: %w", name, pathless(err))
	}
	if !st.Mode().IsRegular() { // a pipe or a device: read as a stream
		return readStream(fh, name, opt, lim)
	}
	var magic [4]byte
	n, _ := io.ReadFull(fh, magic[:])
	if _, err := fh.Seek(0, io.SeekStart); err != nil {
		return nil, fmt.Errorf("ifcstep: %s: %w", name, pathless(err))
	}
	switch {
	case isZip(magic[:n]):
		zr, err := zip.NewReader(fh, st.Size())
		if err != nil {
			return nil, fmt.Errorf("ifcstep: %s: %w", name, err)
		}
		return readZip(zr, name, opt, lim)
	case isGzip(magic[:n]):
		return readStream(fh, name, opt, lim)
	}
	if st.Size() > lim.MaxFileSize {
		return nil, limitErr(name, lim.MaxFileSize)
	}
	if data, ok := mapFile(fh, st.Size()); ok {
		f, err := parse(data, name, opt, true)
		if err != nil {
			unmap(data)
			return nil, err
		}
		unmapWhenUnreachable(f, data)
		return f, nil
	}
	data := make([]byte, st.Size())
	if _, err := io.ReadFull(fh, data); err != nil {
		return nil, fmt.Errorf("ifcstep: %s: %w", name, err)
	}
	return Parse(data, name, opt)
}

// Read reads a model from a stream (plain, gzip or zip as for ReadFile),
// bounded by Limits.MaxFileSize, and parses it.
func Read(r io.Reader, name string, opt Options) (*File, error) {
	return readStream(r, name, opt, opt.Limits.withDefaults())
}

func readStream(r io.Reader, name string, opt Options, lim Limits) (*File, error) {
	br := bufio.NewReader(r)
	magic, _ := br.Peek(4)
	switch {
	case isGzip(magic):
		zr, err := gzip.NewReader(br)
		if err != nil {
			return nil, fmt.Errorf("ifcstep: %s: %w", name, err)
		}
		data, err := readAll(zr, lim.MaxFileSize, name)
		if err != nil {
			return nil, err
		}
		return Parse(data, name, opt)
	case isZip(magic):
		// zip needs random access: hold the archive, bounded like the model
		buf, err := readAll(br, lim.MaxFileSize, name)
		if err != nil {
			return nil, err
		}
		zr, err := zip.NewReader(bytes.NewReader(buf), int64(len(buf)))
		if err != nil {
			return nil, fmt.Errorf("ifcstep: %s: %w", name, err)
		}
		return readZip(zr, name, opt, lim)
	}
	data, err := readAll(br, lim.MaxFileSize, name)
	if err != nil {
		return nil, err
	}
	return Parse(data, name, opt)
}

func readZip(zr *zip.Reader, name string, opt Options, lim Limits) (*File, error) {
	var entry *zip.File
	count := 0
	for _, zf := range zr.File {
		if strings.EqualFold(path.Ext(zf.Name), ".ifc") && !zf.FileInfo().IsDir() {
			if entry == nil {
				entry = zf
			}
			count++
		}
	}
	if count != 1 {
		return nil, &Error{File: name, Pos: Position{Line: 1, Column: 1}, Kind: ErrNotStep,
			Msg: "zip archive holds " + itoa(count) + " .ifc entries, expected one"}
	}
	rc, err := entry.Open()
	if err != nil {
		return nil, fmt.Errorf("ifcstep: %s: %w", name, err)
	}
	defer rc.Close()
	data, err := readAll(rc, lim.MaxFileSize, name)
	if err != nil {
		return nil, err
	}
	return Parse(data, name+"!"+entry.Name, opt)
}

// readAll reads r whole, failing with ErrLimit beyond max bytes.
func readAll(r io.Reader, max int64, name string) ([]byte, error) {
	var buf bytes.Buffer
	n, err := buf.ReadFrom(io.LimitReader(r, max+1))
	if err != nil && !errors.Is(err, io.EOF) {
		return nil, fmt.Errorf("ifcstep: %s: %w", name, err)
	}
	if n > max {
		return nil, limitErr(name, max)
	}
	return buf.Bytes(), nil
}

func limitErr(name string, max int64) *Error {
	return &Error{File: name, Pos: Position{Line: 1, Column: 1}, Kind: ErrLimit,
		Msg: "file larger than the limit of " + itoa(int(max)) + " bytes"}
}

func isGzip(m []byte) bool { return len(m) >= 2 && m[0] == 0x1f && m[1] == 0x8b }
func isZip(m []byte) bool  { return len(m) >= 4 && string(m[:4]) == "PK\x03\x04" }

// pathless drops the path from an *os.PathError, so that a display name can
// stand in for it.
func pathless(err error) error {
	var pe *os.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	return err
}
