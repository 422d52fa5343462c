package pipeline

import (
	"bufio"
	"context"
	"os"
	"path/filepath"
	"testing"

	"swaygate/checks"
	"swaygate/internal/ifcgen"
)

// BenchmarkCheckFrame runs the whole pipeline with the frame sway method on
// a generated model (2,000 columns in 20 storeys, about 2,100 nodes and
// 48,000 degrees of freedom with the floor diaphragm links): read, extract,
// frame extraction and buckling analysis, checks. The generated analytical
// model has columns only, so its lambda_c is tiny (stacked cantilevers):
// this measures cost, not engineering.
// source: common practice — invented benchmark data (internal/ifcgen).
func BenchmarkCheckFrame(b *testing.B) {
	path := filepath.Join(b.TempDir(), "gen.ifc")
	fh, err := os.Create(path)
	if err != nil {
		b.Fatal(err)
	}
	w := bufio.NewWriter(fh)
	if _, err := ifcgen.Write(w, ifcgen.Options{Columns: 2000, Storeys: 20}); err != nil {
		b.Fatal(err)
	}
	if err := w.Flush(); err != nil {
		b.Fatal(err)
	}
	fh.Close()
	for _, method := range []string{"storey", "frame"} {
		b.Run(method, func(b *testing.B) {
			opt := checks.DefaultOptions()
			opt.SwayMethod = method
			opt.Trace = "summary"
			opt.TraceOnDemand = true
			b.ReportAllocs()
			for b.Loop() {
				if _, err := Check(context.Background(), Request{ModelPath: path, Options: opt}); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
