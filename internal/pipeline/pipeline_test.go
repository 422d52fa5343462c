package pipeline

import (
	"context"
	"errors"
	"testing"

	"swaygate/checks"
	"swaygate/ifcstep"
)

// TestDemoCheck runs the demo model through the whole pipeline. The demo's
// data are invented; the verdicts follow from the AS 4100 provisions checked
// elsewhere against published values, so this pins the wiring, not the
// engineering.
func TestDemoCheck(t *testing.T) {
	res, err := Check(context.Background(), Request{ModelPath: "../../testdata/demo/tern-street-depot.ifc"})
	if err != nil {
		t.Fatal(err)
	}
	s := res.Report.Summary
	t.Logf("summary %+v skipped %d", s, len(res.Report.Skipped))
	for _, e := range res.Report.Elements {
		t.Logf("%-28s %-14s %v %v", e.Member.Name, e.Verdict, e.GoverningCombination, e.Reasons)
	}
	if s.Members != 16 || len(res.Report.Skipped) != 1 {
		t.Errorf("members %d skipped %d, want 16 and 1", s.Members, len(res.Report.Skipped))
	}
	if res.Run.Model.SHA256 == "" || res.Run.Model.Schema != "IFC4" {
		t.Errorf("model info %+v", res.Run.Model)
	}
}

func TestBadInputs(t *testing.T) {
	_, err := Check(context.Background(), Request{ModelPath: "pipeline.go"})
	var pe *ifcstep.Error
	if !errors.As(err, &pe) {
		t.Errorf("not STEP: got %v, want *ifcstep.Error", err)
	}
	opt := checks.DefaultOptions()
	opt.Standard = "bs5950"
	_, err = Check(context.Background(), Request{ModelPath: "../../testdata/demo/tern-street-depot.ifc", Options: opt})
	if !errors.Is(err, checks.ErrOption) {
		t.Errorf("unknown standard: got %v, want ErrOption", err)
	}
}
