package pipeline

import (
	"context"
	"io"
	"os"
	"path/filepath"
	"testing"

	"swaygate/checks"
	"swaygate/checks/standards"
	"swaygate/reports"
)

// BenchmarkPhases times the phases of `swaygate check --format json --trace
// summary` on the generated 32 MB model (git-ignored; bench/compare.sh
// writes it): Load (index, extraction, hash), Run (the checks) and the JSON
// report written to io.Discard, each on its own.
//
//	go test ./internal/pipeline -run '^$' -bench Phases -count 6
func BenchmarkPhases(b *testing.B) {
	path := filepath.Join("..", "..", "testdata", "gen", "bench-32mb.ifc")
	if _, err := os.Stat(path); err != nil {
		b.Skipf("%v (generate it with bench/compare.sh)", err)
	}
	opt := checks.DefaultOptions()
	opt.Trace = "summary"
	opt.TraceOnDemand = true
	req := Request{ModelPath: path, Options: opt}
	ld, err := Load(context.Background(), req)
	if err != nil {
		b.Fatal(err)
	}
	rs, err := standards.Lookup(opt.Standard)
	if err != nil {
		b.Fatal(err)
	}
	rep, err := checks.Run(ld.Model, rs, opt)
	if err != nil {
		b.Fatal(err)
	}
	b.Run("load", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := Load(context.Background(), req); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("checks", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := checks.Run(ld.Model, rs, opt); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("json", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if err := reports.WriteJSON(io.Discard, rep, reports.Run{Model: ld.Info}); err != nil {
				b.Fatal(err)
			}
		}
	})
}
