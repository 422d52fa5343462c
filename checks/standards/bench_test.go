package standards_test

import (
	"math/rand/v2"
	"strconv"
	"testing"

	"swaygate/checks"
	"swaygate/checks/section"
	"swaygate/checks/standards"
)

// benchModel is an invented building of n columns in storeys of 1000, half
// sway columns about the major axis (global Y), half leaning; minor axes
// braced; nc combinations of first-order actions. Seeded. (The same shape
// as the checks package's benchmark model; invented data, no check values.)
func benchModel(n, nc int) *checks.Model {
	rng := rand.New(rand.NewPCG(1, 1))
	m := &checks.Model{Members: make([]checks.Member, n)}
	for c := range nc {
		m.Combinations = append(m.Combinations, "ULS-"+strconv.Itoa(c+1))
	}
	sec := &section.Properties{Profile: "310UC96.8", Shape: "I", A: 12_400, IMajor: 223e6, IMinor: 72.9e6}
	for i := range m.Members {
		mem := &m.Members[i]
		storey := i / 1000
		*mem = checks.Member{
			GlobalID:  "G" + strconv.Itoa(i),
			Entity:    "IfcColumn",
			StoreyKey: "#" + strconv.Itoa(storey),
			Storey:    "Level " + strconv.Itoa(storey),
			Length:    4000,
			Section:   sec,
			Material:  checks.Material{E: 200_000, Source: "model"},
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
			a := checks.Actions{Combination: m.Combinations[c], NStar: 300e3 + rng.Float64()*900e3}
			a.Moments[0] = checks.AxisMoments{Start: (rng.Float64() - 0.5) * 160e6, End: (rng.Float64() - 0.5) * 160e6}
			a.Moments[1] = checks.AxisMoments{Start: (rng.Float64() - 0.5) * 20e6, End: (rng.Float64() - 0.5) * 20e6}
			if i%2 == 1 {
				a.Moments[0] = checks.AxisMoments{}
			}
			mem.Actions[c] = a
		}
	}
	return m
}

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
