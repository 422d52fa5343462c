package ifcstep

import (
	"os"
	"path/filepath"
	"runtime"
	"strconv"
	"testing"

	"swaygate/internal/ifcgen"
)

// Benchmarks run on generated models (internal/ifcgen), written into
// testdata/gen/ (git-ignored) on first use: about 32 MiB always, about
// 300 MiB when SWAYGATE_BENCH_LARGE=1.

func benchModels(b *testing.B) []string {
	sizes := []int{32}
	if os.Getenv("SWAYGATE_BENCH_LARGE") == "1" {
		sizes = append(sizes, 300)
	}
	var paths []string
	for _, mb := range sizes {
		paths = append(paths, benchModel(b, mb))
	}
	return paths
}

func benchModel(b *testing.B, mb int) string {
	b.Helper()
	dir := filepath.Join("..", "testdata", "gen")
	path := filepath.Join(dir, "bench-"+strconv.Itoa(mb)+"mb.ifc")
	if _, err := os.Stat(path); err == nil {
		return path
	}
	if err := os.MkdirAll(dir, 0o755); err != nil {
		b.Fatal(err)
	}
	tmp := path + ".tmp"
	fh, err := os.Create(tmp)
	if err != nil {
		b.Fatal(err)
	}
	if _, err := ifcgen.Write(fh, ifcgen.Options{TargetBytes: int64(mb) << 20}); err != nil {
		b.Fatal(err)
	}
	if err := fh.Close(); err != nil {
		b.Fatal(err)
	}
	if err := os.Rename(tmp, path); err != nil {
		b.Fatal(err)
	}
	return path
}

func readModel(b *testing.B, path string) []byte {
	data, err := os.ReadFile(path)
	if err != nil {
		b.Fatal(err)
	}
	return data
}

// BenchmarkIndex measures Parse (header, syntax check and index) on one
// worker and on all.
func BenchmarkIndex(b *testing.B) {
	for _, path := range benchModels(b) {
		data := readModel(b, path)
		for _, workers := range []int{1, runtime.GOMAXPROCS(0)} {
			b.Run(filepath.Base(path)+"/workers="+strconv.Itoa(workers), func(b *testing.B) {
				b.SetBytes(int64(len(data)))
				b.ReportAllocs()
				for b.Loop() {
					if _, err := Parse(data, path, Options{Workers: workers}); err != nil {
						b.Fatal(err)
					}
				}
			})
		}
	}
}

// BenchmarkDecodeAll decodes every attribute of every instance of an indexed
// file (lists recursively, typed values unwrapped, scalars converted).
func BenchmarkDecodeAll(b *testing.B) {
	for _, path := range benchModels(b) {
		data := readModel(b, path)
		f, err := Parse(data, path, Options{})
		if err != nil {
			b.Fatal(err)
		}
		b.Run(filepath.Base(path), func(b *testing.B) {
			b.SetBytes(int64(len(data)))
			b.ReportAllocs()
			for b.Loop() {
				for s := 0; s < f.Len(); s++ {
					if err := decodeInstance(Instance{f: f, s: uint32(s)}); err != nil {
						b.Fatal(err)
					}
				}
			}
		})
		// the same with AppendAttrs and AppendList into reused buffers
		b.Run(filepath.Base(path)+"/append", func(b *testing.B) {
			b.SetBytes(int64(len(data)))
			b.ReportAllocs()
			var d decoder
			for b.Loop() {
				for s := 0; s < f.Len(); s++ {
					if err := d.instance(Instance{f: f, s: uint32(s)}); err != nil {
						b.Fatal(err)
					}
				}
			}
		})
	}
}

// decodeInstance decodes every attribute of in.
func decodeInstance(in Instance) error {
	vs, err := in.Attrs()
	if err != nil {
		return err
	}
	for _, v := range vs {
		if err := decodeValue(v, 0); err != nil {
			return err
		}
	}
	return nil
}

func decodeValue(v Value, depth int) error {
	if depth > 100 {
		return nil
	}
	switch v.Kind() {
	case KindInt:
		v.Int()
	case KindReal:
		v.Real()
	case KindString:
		v.Text() // a malformed string is a warning, not a failure
	case KindEnum:
		v.Enum()
		v.Bool()
	case KindRef:
		v.Ref()
	case KindBinary:
		if _, err := v.Binary(); err != nil {
			return err
		}
	case KindTyped:
		if _, in, ok := v.Typed(); ok {
			return decodeValue(in, depth+1)
		}
	case KindList:
		l, err := v.List()
		if err != nil {
			return err
		}
		for _, e := range l {
			if err := decodeValue(e, depth+1); err != nil {
				return err
			}
		}
	}
	return nil
}

// decoder decodes like decodeInstance with one reused buffer per depth.
type decoder struct{ bufs [][]Value }

func (d *decoder) buf(depth int) []Value {
	for len(d.bufs) <= depth {
		d.bufs = append(d.bufs, make([]Value, 0, 64))
	}
	return d.bufs[depth][:0]
}

func (d *decoder) instance(in Instance) error {
	vs, err := in.AppendAttrs(d.buf(0))
	if err != nil {
		return err
	}
	d.bufs[0] = vs
	for _, v := range vs {
		if err := d.value(v, 1); err != nil {
			return err
		}
	}
	return nil
}

func (d *decoder) value(v Value, depth int) error {
	if depth > 100 {
		return nil
	}
	switch v.Kind() {
	case KindTyped:
		if _, in, ok := v.Typed(); ok {
			return d.value(in, depth+1)
		}
	case KindList:
		l, err := v.AppendList(d.buf(depth))
		if err != nil {
			return err
		}
		d.bufs[depth] = l
		for _, e := range l {
			if err := d.value(e, depth+1); err != nil {
				return err
			}
		}
	default:
		return decodeValue(v, depth)
	}
	return nil
}
