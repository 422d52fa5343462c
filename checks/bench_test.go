package checks_test

import (
	"math/rand/v2"
	"strconv"
	"testing"

	"swaygate/checks"
	"swaygate/checks/as4100"
	"swaygate/checks/section"
)

// benchModel is an invented building of n columns in storeys of 1000, half
// of them sway columns about the major axis (global Y), the rest leaning;
// every minor axis braced; nc combinations of first-order actions with
// moments about both axes. Seeded: the same model every run.
func benchModel(n, nc int) *checks.Model {
	rng := rand.New(rand.NewPCG(1, 1))
	m := &checks.Model{Members: make([]checks.Member, n)}
	for c := range nc {
		m.Combinations = append(m.Combinations, "ULS-"+strconv.Itoa(c+1))
	}
	// A 310UC96.8-like section (invented demo data, not a check value).
	sec := &section.Properties{Profile: "310UC96.8", Shape: "I", A: 12_400, IMajor: 223e6, IMinor: 72.9e6}
	for i := range m.Members {
		mem := &m.Members[i]
		storey := i / 1000
		*mem = checks.Member{
			GlobalID:        "G" + strconv.Itoa(i),
			Entity:          "IfcColumn",
			StoreyKey:       "#" + strconv.Itoa(storey),
			Storey:          "Level " + strconv.Itoa(storey),
			StoreyElevation: checks.Num(4000 * storey),
			Length:          4000,
			Section:         sec,
			Material:        checks.Material{E: 200_000, Source: "model"},
			Axes: [2]checks.AxisInput{
				{Restraint: checks.Braced, Ke: 1, Direction: checks.DirY},
				{Restraint: checks.Braced, Ke: 0.85, Direction: checks.DirX},
			},
			Actions: make([]checks.Actions, nc),
		}
		if i%2 == 0 {
			mem.Axes[0] = checks.AxisInput{Restraint: checks.Sway, Ke: 1.3, Direction: checks.DirY}
		}
		for c := range nc {
			n := 300e3 + rng.Float64()*900e3
			a := checks.Actions{Combination: m.Combinations[c], NStar: n}
			a.Moments[0] = checks.AxisMoments{Start: (rng.Float64() - 0.5) * 160e6, End: (rng.Float64() - 0.5) * 160e6}
			a.Moments[1] = checks.AxisMoments{Start: (rng.Float64() - 0.5) * 20e6, End: (rng.Float64() - 0.5) * 20e6}
			if i%2 == 1 {
				a.Moments[0] = checks.AxisMoments{} // leaning: no major-axis moment
			}
			mem.Actions[c] = a
		}
	}
	return m
}

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
