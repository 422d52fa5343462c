package checks_test

import (
	"swaygate/checks/internal/checktest"
	"testing"

	"swaygate/checks"
	"swaygate/checks/as4100"
)

// benchModel is the shared invented benchmark building
// (checks/internal/checktest.BenchModel): 310UC96.8 columns in storeys of
// 1000, half sway about the major axis, seeded actions.
var benchModel = checktest.BenchModel

// BenchmarkRun: 100,000 members × 10 combinations, both axes, storey
// method. Target (design §8): < 1 s per op on one core
// (go test -run - -bench Run -benchtime 3x -cpu 1 ./checks/).
//
//   - trace=none: the check alone.
//   - trace=full, trace=summary: the check, then every element's trace
//     rebuilt into one reused buffer (TraceOnDemand), as a streaming writer
//     does.
//   - trace=summary/stored: the summary kept in Element.Trace (some 22 steps
//     of about 450 bytes per member).
func BenchmarkRun(b *testing.B) {
	m := benchModel(100_000, 10)
	rs := as4100.New()
	run := func(b *testing.B, opt checks.Options, stream bool) {
		b.ReportAllocs()
		var buf []checks.Step
		var steps int
		for b.Loop() {
			rep, err := checks.Run(m, rs, opt)
			if err != nil {
				b.Fatal(err)
			}
			if stream {
				steps = 0
				for i := range rep.Elements {
					buf = rep.AppendTrace(buf[:0], i)
					steps += len(buf)
				}
			}
		}
		if stream {
			b.ReportMetric(float64(steps), "steps/op")
		}
	}
	b.Run("trace=none", func(b *testing.B) {
		opt := stabilityOptions()
		opt.Trace = "none"
		run(b, opt, false)
	})
	b.Run("trace=full", func(b *testing.B) {
		opt := stabilityOptions()
		opt.TraceOnDemand = true
		run(b, opt, true)
	})
	b.Run("trace=summary", func(b *testing.B) {
		opt := stabilityOptions()
		opt.Trace = "summary"
		opt.TraceOnDemand = true
		run(b, opt, true)
	})
	b.Run("trace=summary/stored", func(b *testing.B) {
		opt := stabilityOptions()
		opt.Trace = "summary"
		run(b, opt, false)
	})
}

// TestBenchModelVerdicts keeps the benchmark honest: its model is mostly
// passing columns, so the pass path is what is measured. (Invented demo
// data; no check values.) // common practice: benchmark inputs are realistic
func TestBenchModelVerdicts(t *testing.T) {
	opt := stabilityOptions()
	opt.Trace = "none"
	rep, err := checks.Run(benchModel(2000, 10), as4100.New(), opt)
	if err != nil {
		t.Fatal(err)
	}
	if s := rep.Summary; s.Pass < s.Members*8/10 {
		t.Errorf("summary %+v: the benchmark model should mostly pass", s)
	}
}
