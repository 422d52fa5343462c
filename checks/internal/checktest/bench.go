package checktest

import (
	"math/rand/v2"
	"strconv"
	"testing"

	"swaygate/checks"
	"swaygate/checks/section"
)

// BenchModel is an invented building of n columns (storeys of 1000), half
// of them sway columns about the major axis, every minor axis braced, nc
// combinations of first-order actions with moments about both axes; the
// columns are 310UC96.8 (dimensions from sections.md) with fy = 300 MPa
// given in the model, so the capacity checks run in full. Seeded: the same
// model every run. (Invented benchmark data, not check values.)
func BenchModel(n, nc int) *checks.Model {
	rng := rand.New(rand.NewPCG(1, 1))
	p, err := section.ISection{Name: "310UC96.8", B: 305, D: 308, Tw: 9.9, Tf: 15.4, R: 16.5}.Properties()
	if err != nil {
		panic(err)
	}
	m := &checks.Model{Members: make([]checks.Member, n)}
	for c := range nc {
		m.Combinations = append(m.Combinations, "ULS-"+strconv.Itoa(c+1))
	}
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
			Section:         &p,
			Material:        checks.Material{E: 200_000, Fy: 300, Source: "model"},
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

// BenchRunFull runs the 100,000-member × 10-combination BenchModel with rs
// under scope stability and scope full, without a trace and with the
// summary trace streamed on demand.
func BenchRunFull(b *testing.B, rs checks.RuleSet) {
	m := BenchModel(100_000, 10)
	for _, scope := range []string{"stability", "full"} {
		for _, trace := range []string{"none", "summary"} {
			b.Run("scope="+scope+"/trace="+trace, func(b *testing.B) {
				opt := checks.DefaultOptions()
				opt.Scope = scope
				opt.Trace = trace
				opt.TraceOnDemand = true
				b.ReportAllocs()
				var buf []checks.Step
				for b.Loop() {
					rep, err := checks.Run(m, rs, opt)
					if err != nil {
						b.Fatal(err)
					}
					if trace != "none" {
						for i := range rep.Elements {
							buf = rep.AppendTrace(buf[:0], i)
						}
					}
				}
			})
		}
	}
}

// CheckBenchModel keeps a benchmark honest: with rs and scope full, at
// least minPass of BenchModel's columns pass, so the pass path is what is
// measured, and every member gets capacity checks.
func CheckBenchModel(t *testing.T, rs checks.RuleSet, minPass float64) {
	t.Helper()
	opt := checks.DefaultOptions()
	opt.Scope = "full"
	opt.Trace = "none"
	rep := Run(t, BenchModel(2000, 10), rs, opt)
	if s := rep.Summary; float64(s.Pass) < minPass*float64(s.Members) {
		t.Errorf("summary %+v: the benchmark model should mostly pass", s)
	}
	for i := range rep.Elements {
		if len(rep.Elements[i].Combinations[0].Capacity) == 0 {
			t.Fatalf("element %d: no capacity checks", i)
		}
	}
}
