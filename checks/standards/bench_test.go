package standards_test

import (
	"swaygate/checks/internal/checktest"
	"testing"

	"swaygate/checks"
	"swaygate/checks/standards"
)

// benchModel is the shared invented benchmark building
// (checks/internal/checktest.BenchModel): 310UC96.8 columns in storeys of
// 1000, half sway about the major axis, seeded actions.
var benchModel = checktest.BenchModel

// BenchmarkStandards: 100,000 members × 10 combinations under each
// standard, storey method, no trace. Target (design §8): < 1 s per op on
// one core (go test -run - -bench Standards -benchtime 3x -cpu 1
// ./checks/standards/).
func BenchmarkStandards(b *testing.B) {
	m := benchModel(100_000, 10)
	for _, name := range standards.Names() {
		b.Run(name, func(b *testing.B) {
			rs, err := standards.Lookup(name)
			if err != nil {
				b.Fatal(err)
			}
			opt := stabilityOptions()
			opt.Trace = "none"
			b.ReportAllocs()
			for b.Loop() {
				if _, err := checks.Run(m, rs, opt); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// TestBenchModelPasses keeps the benchmark honest: the model mostly passes
// under every standard, so the pass path is what is measured.
// // common practice: benchmark inputs are realistic
func TestBenchModelPasses(t *testing.T) {
	m := benchModel(2000, 10)
	for _, name := range standards.Names() {
		rs, _ := standards.Lookup(name)
		opt := stabilityOptions()
		opt.Trace = "none"
		rep, err := checks.Run(m, rs, opt)
		if err != nil {
			t.Fatal(err)
		}
		if s := rep.Summary; s.Pass < s.Members*8/10 {
			t.Errorf("%s: summary %+v: the benchmark model should mostly pass", name, s)
		}
	}
}

// stabilityOptions are the default options with scope stability: the tests of
// the amplification provisions alone. (The product default is scope full,
// which adds the member capacity checks; their tests set it explicitly.)
func stabilityOptions() checks.Options {
	opt := checks.DefaultOptions()
	opt.Scope = "stability"
	return opt
}
