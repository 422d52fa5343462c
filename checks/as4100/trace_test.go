package as4100_test

import (
	"fmt"
	"math"
	"math/rand/v2"
	"reflect"
	"testing"

	"swaygate/checks"
)

// traceModel: a storey of two sway columns and a leaning one, three
// combinations.
func traceModel() *checks.Model {
	m := storeyModel(400, 600)
	lean := column("LEAN", iFor(3000e3, 4000), iFor(3000e3, 4000))
	lean.StoreyKey = "#10"
	m.Members = append(m.Members, lean)
	for k := range m.Members {
		mem := &m.Members[k]
		mem.Actions = []checks.Actions{
			act("C1", 300+100*float64(k), 20, -10),
			act("C2", 500+100*float64(k), 30, 15),
			act("C3", 200, 10, 10),
		}
		mem.Actions[1].Moments[1] = checks.AxisMoments{Start: 4e6, End: 4e6}
	}
	m.Combinations = []string{"C1", "C2", "C3"}
	return m
}

// TestTraceLevels: full holds every combination, summary the governing one,
// none nothing; on demand rebuilds the same steps.
// source: design §5.5 (trace levels)
func TestTraceLevels(t *testing.T) {
	full := runAS(t, traceModel(), stabilityOptions())
	el := &full.Elements[1]
	combs := map[string]bool{}
	for _, s := range el.Trace {
		combs[s.Combination] = true
		if math.IsNaN(s.Value) || math.IsInf(s.Value, 0) {
			t.Errorf("step %s has value %v", s.Quantity, s.Value)
		}
		for _, in := range s.In() {
			if math.IsNaN(in.Value) || math.IsInf(in.Value, 0) {
				t.Errorf("step %s input %s = %v", s.Quantity, in.Name, in.Value)
			}
		}
	}
	for _, c := range []string{"", "C1", "C2", "C3"} {
		if !combs[c] {
			t.Errorf("full trace has no step of combination %q", c)
		}
	}
	// A step as design §5.5 describes it.
	var found bool
	for _, s := range el.Trace {
		if s.Quantity == "delta_b,major" && s.Combination == "C2" {
			found = true
			if s.Clause != "AS 4100 4.4.2.2" || s.Formula == "" || s.NInputs < 3 || s.Unit != "" {
				t.Errorf("delta_b step %+v", s)
			}
			nomb := el.Combinations[1].Axes[0].Nomb.F()
			// source: AS 4100 4.4.2.2: beta_m = -0.5 (30, 15 single curvature), cm = 0.8
			want := math.Max(1, 0.8/(1-600e3/nomb))
			if math.Abs(s.Value-want) > 1e-12 {
				t.Errorf("delta_b step value %v, want %v", s.Value, want)
			}
		}
		if s.Quantity == "N_om,major" && (s.Unit != "kN" || s.Clause != "AS 4100 4.6.2") {
			t.Errorf("Nom step %+v", s)
		}
	}
	if !found {
		t.Error("no delta_b,major step for C2")
	}

	opt := stabilityOptions()
	opt.Trace = "summary"
	sum := runAS(t, traceModel(), opt)
	sel := &sum.Elements[1]
	gov := sel.GoverningCombination
	for _, s := range sel.Trace {
		if s.Combination != "" && s.Combination != gov {
			t.Errorf("summary trace has combination %q, governing %q", s.Combination, gov)
		}
	}
	if len(sel.Trace) == 0 || len(sel.Trace) >= len(el.Trace) {
		t.Errorf("summary trace %d steps, full %d", len(sel.Trace), len(el.Trace))
	}
	if !same(sel.Combinations, el.Combinations) || !same(sel.Reasons, el.Reasons) {
		t.Error("the trace level changed the results")
	}

	opt.Trace = "none"
	none := runAS(t, traceModel(), opt)
	if none.Elements[1].Trace != nil || len(none.AppendTrace(nil, 1)) != 0 {
		t.Error("trace none recorded steps")
	}

	for _, level := range []string{"full", "summary"} {
		opt.Trace = level
		opt.TraceOnDemand = false
		eager := runAS(t, traceModel(), opt)
		opt.TraceOnDemand = true
		lazy := runAS(t, traceModel(), opt)
		var buf []checks.Step
		for i := range eager.Elements {
			if lazy.Elements[i].Trace != nil {
				t.Errorf("%s: on-demand run stored a trace", level)
			}
			buf = lazy.AppendTrace(buf[:0], i)
			if !reflect.DeepEqual(buf, eager.Elements[i].Trace) {
				t.Errorf("%s: element %d: on-demand trace differs from the stored one", level, i)
			}
			if !same(lazy.Elements[i].Combinations, eager.Elements[i].Combinations) {
				t.Errorf("%s: results differ", level)
			}
		}
		// AppendTrace appends.
		two := lazy.AppendTrace(lazy.AppendTrace(nil, 0), 1)
		if len(two) != len(eager.Elements[0].Trace)+len(eager.Elements[1].Trace) {
			t.Errorf("%s: AppendTrace does not append", level)
		}
	}
}

// same compares results printed with %v, where NaN equals NaN.
func same(a, b any) bool { return fmt.Sprintf("%v", a) == fmt.Sprintf("%v", b) }

// TestPropertyDeltaAtLeastOne: delta_b, delta_s and delta_m are never below
// 1 when known, over random members, roles, storeys and actions.
// source: AS 4100 4.4.2.2 (delta_b ≥ 1), 4.4.2.3 (delta_s = 1/(1-1/lambda) ≥ 1 for lambda > 1)
func TestPropertyDeltaAtLeastOne(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	for trial := range 50 {
		m := randomModel(rng, 30, 4)
		rep := runAS(t, m, noTrace())
		for i := range rep.Elements {
			for _, c := range rep.Elements[i].Combinations {
				for a, ax := range c.Axes {
					for _, d := range []checks.Num{ax.DeltaB, ax.DeltaS, ax.DeltaM} {
						if d.Known() && d.F() < 1 {
							t.Fatalf("trial %d member %d %s axis %d: delta %v < 1 (%+v)", trial, i, c.Name, a, d.F(), ax)
						}
					}
					if ax.DeltaM.Known() && ax.MAmp.Known() && ax.MAmp.F() < ax.MStar.F()*(1-1e-12) {
						t.Fatalf("amplified moment below M*m: %+v", ax)
					}
				}
			}
		}
	}
}

// randomModel builds n random columns in a few storeys (invented test data).
func randomModel(rng *rand.Rand, n, nc int) *checks.Model {
	m := &checks.Model{}
	for c := range nc {
		m.Combinations = append(m.Combinations, "C"+string(rune('0'+c)))
	}
	for i := range n {
		mem := column("R"+string(rune('A'+i%26))+string(rune('a'+i/26)), 10e6+rng.Float64()*300e6, 5e6+rng.Float64()*100e6)
		mem.Length = 2500 + rng.Float64()*4000
		mem.StoreyKey = "#" + string(rune('1'+rng.IntN(3)))
		for a := range mem.Axes {
			ax := &mem.Axes[a]
			if rng.IntN(3) == 0 {
				ax.Restraint, ax.Ke = checks.Sway, 1+rng.Float64()*1.5
				ax.BracedKe = 0.7 + rng.Float64()*0.3
			} else {
				ax.Ke = 0.6 + rng.Float64()*0.4
			}
		}
		for c := range nc {
			a := checks.Actions{Combination: m.Combinations[c], NStar: (rng.Float64()*1.2 - 0.1) * 3000e3}
			for ax := range a.Moments {
				a.Moments[ax] = checks.AxisMoments{Start: (rng.Float64() - 0.5) * 200e6, End: (rng.Float64() - 0.5) * 200e6}
				if rng.IntN(5) == 0 {
					a.Moments[ax] = checks.AxisMoments{}
				}
			}
			if rng.IntN(8) == 0 {
				a.Theory = checks.SecondOrder
			}
			mem.Actions = append(mem.Actions, a)
		}
		m.Members = append(m.Members, mem)
	}
	return m
}

// TestPropertyMonotoneInNStar: the deltas grow with N*, and the verdict
// never improves as N* grows (pass < needs-analysis < fail).
// source: AS 4100 4.4.2.2 and 4.4.2.3 (each factor increases with N*), design §5.4 (verdict order)
func TestPropertyMonotoneInNStar(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	for trial := range 200 {
		base := column("P", 20e6+rng.Float64()*200e6, 10e6+rng.Float64()*80e6)
		base.Length = 3000 + rng.Float64()*3000
		sway := rng.IntN(2) == 0
		if sway {
			base.Axes[0] = checks.AxisInput{Restraint: checks.Sway, Ke: 1 + rng.Float64(), BracedKe: 0.7 + 0.3*rng.Float64(), Direction: checks.DirY}
		} else {
			base.Axes[0].Ke = 0.7 + 0.3*rng.Float64()
		}
		mo := checks.AxisMoments{Start: (rng.Float64() - 0.5) * 200e6, End: (rng.Float64() - 0.5) * 200e6}
		if rng.IntN(4) == 0 {
			mo = checks.AxisMoments{}
		}
		prev := checks.AxisResult{DeltaB: 1, DeltaS: 1, DeltaM: 1}
		prevV := checks.Pass
		for step := range 60 {
			n := -500e3 + float64(step)*150e3
			m := base
			m.Actions = []checks.Actions{{Combination: "ULS", NStar: n, Moments: [2]checks.AxisMoments{mo, {}}}}
			rep := runAS(t, model(m), noTrace())
			el := &rep.Elements[0]
			ax := el.Combinations[0].Axes[0]
			if el.Verdict < prevV {
				t.Fatalf("trial %d: verdict improved from %v to %v at N* = %v", trial, prevV, el.Verdict, n)
			}
			prevV = el.Verdict
			for k, pair := range [][2]checks.Num{{prev.DeltaB, ax.DeltaB}, {prev.DeltaS, ax.DeltaS}, {prev.DeltaM, ax.DeltaM}} {
				if pair[0].Known() && pair[1].Known() && pair[1].F() < pair[0].F()-1e-12 {
					t.Fatalf("trial %d: delta %d fell from %v to %v at N* = %v", trial, k, pair[0].F(), pair[1].F(), n)
				}
			}
			prev = ax
		}
	}
}

func noTrace() checks.Options {
	o := stabilityOptions()
	o.Trace = "none"
	return o
}
