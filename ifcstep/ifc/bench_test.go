package ifc

import (
	"os"
	"path/filepath"
	"testing"
	"time"

	"swaygate/ifcstep"
)

// The generated models (git-ignored) come from
//
//	go run ./cmd/swaygate generate --columns 2000 --target-mb 32 --out testdata/gen/model-32mb.ifc
//	go run ./cmd/swaygate generate --columns 13500 --target-mb 300 --out testdata/gen/big.ifc
//
// BenchmarkExtract times the STEP index (Parse, recording the references of
// RefTypes as the pipeline does) and the extraction of every member on top
// of a fresh index (Extract, including the reader's lazy by-type table), and
// reports the extraction time as a share of the indexing time
// ("extract/index"; the target is ≤ 0.25).
func BenchmarkExtract(b *testing.B) {
	for _, tc := range []struct{ name, file string }{
		{"32MB", "model-32mb.ifc"},
		{"300MB", "big.ifc"},
	} {
		path := filepath.Join("..", "..", "testdata", "gen", tc.file)
		data, err := os.ReadFile(path)
		if err != nil {
			b.Logf("skip %s: %v", tc.name, err)
			continue
		}
		var index, extract time.Duration
		b.Run(tc.name+"/index", func(b *testing.B) {
			b.SetBytes(int64(len(data)))
			b.ReportAllocs()
			start := time.Now()
			for b.Loop() {
				if _, err := ifcstep.Parse(data, tc.file, ifcstep.Options{RefTypes: RefTypes()}); err != nil {
					b.Fatal(err)
				}
			}
			index = time.Since(start) / time.Duration(b.N)
		})
		b.Run(tc.name+"/extract", func(b *testing.B) {
			b.ReportAllocs()
			var members int
			for i := 0; i < b.N; i++ {
				b.StopTimer()
				f, err := ifcstep.Parse(data, tc.file, ifcstep.Options{RefTypes: RefTypes()})
				if err != nil {
					b.Fatal(err)
				}
				b.StartTimer()
				t0 := time.Now()
				m, err := Extract(f, Options{})
				extract += time.Since(t0)
				if err != nil {
					b.Fatal(err)
				}
				members = len(m.Members)
			}
			extract /= time.Duration(b.N)
			b.ReportMetric(float64(members), "members")
			if index > 0 {
				b.ReportMetric(float64(extract)/float64(index), "extract/index")
			}
			extract = 0
		})
	}
}
