package checks_test

import (
	"math"
	"sync"
	"testing"

	"swaygate/checks"
	"swaygate/checks/internal/checktest"
	"swaygate/checks/standards"
)

// TestTraceReplayer checks that replayers rebuild exactly the traces of
// Report.AppendTrace, on several goroutines at once, for every standard,
// scope and trace level. (Invented benchmark data; no check values.)
// common practice: a concurrent writer must not change the report
func TestTraceReplayer(t *testing.T) {
	m := checktest.BenchModel(240, 3)
	for _, name := range standards.Names() {
		rs, err := standards.Lookup(name)
		if err != nil {
			t.Fatal(err)
		}
		for _, c := range []struct{ scope, level, sway string }{
			{"stability", "full", "storey"}, {"stability", "summary", "member"},
			{"full", "full", "member"}, {"full", "summary", "storey"},
		} {
			t.Run(name+"/"+c.scope+"/"+c.level+"/"+c.sway, func(t *testing.T) {
				opt := checks.DefaultOptions()
				opt.Standard, opt.Scope, opt.Trace, opt.TraceOnDemand = name, c.scope, c.level, true
				opt.SwayMethod = c.sway
				rep, err := checks.Run(m, rs, opt)
				if err != nil {
					t.Fatal(err)
				}
				want := make([][]checks.Step, len(rep.Elements))
				for i := range want {
					want[i] = rep.AppendTrace(nil, i)
				}
				const workers = 4
				got := make([][]checks.Step, len(rep.Elements))
				var wg sync.WaitGroup
				for w := range workers {
					rp := rep.NewTraceReplayer()
					wg.Add(1)
					go func() {
						defer wg.Done()
						var buf []checks.Step
						for i := w; i < len(got); i += workers {
							buf = rp.AppendTrace(buf[:0], i)
							got[i] = append([]checks.Step(nil), buf...)
						}
					}()
				}
				wg.Wait()
				for i := range want {
					if len(want[i]) == 0 || !sameSteps(got[i], want[i]) {
						t.Fatalf("element %d: replayed %d steps, AppendTrace %d, or they differ", i, len(got[i]), len(want[i]))
					}
				}
			})
		}
	}
	opt := stabilityOptions()
	opt.Trace = "none"
	rep, err := checks.Run(m, standardsAS4100(t), opt)
	if err != nil {
		t.Fatal(err)
	}
	if rep.NewTraceReplayer() != nil {
		t.Error("trace none: want no replayer")
	}
	if (&checks.Report{}).NewTraceReplayer() != nil {
		t.Error("a report not made by Run: want no replayer")
	}
}

func standardsAS4100(t *testing.T) checks.RuleSet {
	rs, err := standards.Lookup("as4100")
	if err != nil {
		t.Fatal(err)
	}
	return rs
}

// sameSteps compares steps field by field, NaN equal to NaN.
func sameSteps(a, b []checks.Step) bool {
	if len(a) != len(b) {
		return false
	}
	same := func(x, y float64) bool { return math.Float64bits(x) == math.Float64bits(y) }
	for k := range a {
		x, y := &a[k], &b[k]
		if x.Quantity != y.Quantity || x.Clause != y.Clause || x.Formula != y.Formula || x.Unit != y.Unit ||
			x.Combination != y.Combination || x.Axis != y.Axis || x.Note != y.Note || x.NInputs != y.NInputs || !same(x.Value, y.Value) {
			return false
		}
		for n := range x.In() {
			if x.Inputs[n].Name != y.Inputs[n].Name || x.Inputs[n].Unit != y.Inputs[n].Unit || !same(x.Inputs[n].Value, y.Inputs[n].Value) {
				return false
			}
		}
	}
	return true
}
