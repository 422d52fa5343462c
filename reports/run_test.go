package reports

import (
	"io"
	"strings"
	"testing"

	"swaygate/checks"
)

func TestNewGate(t *testing.T) {
	for _, tc := range []struct {
		policy  string
		s       checks.Summary
		want    Gate
		wantErr string
	}{
		{"", checks.Summary{Members: 3, Pass: 3}, Gate{GateFail, true}, ""},
		{"fail", checks.Summary{Members: 3, Pass: 2, NeedsAnalysis: 1}, Gate{GateFail, true}, ""},
		{"fail", checks.Summary{Members: 3, Pass: 2, Fail: 1}, Gate{GateFail, false}, ""},
		{"needs-analysis", checks.Summary{Members: 3, Pass: 2, NeedsAnalysis: 1}, Gate{GateNeedsAnalysis, false}, ""},
		{"needs-analysis", checks.Summary{Members: 3, Pass: 2, Fail: 1}, Gate{GateNeedsAnalysis, false}, ""},
		{"needs-analysis", checks.Summary{Members: 3, Pass: 3}, Gate{GateNeedsAnalysis, true}, ""},
		{"needs-analysis", checks.Summary{}, Gate{GateNeedsAnalysis, true}, ""},
		{"none", checks.Summary{Members: 3, Pass: 1, Fail: 2}, Gate{GateNone, true}, ""},
		{"warn", checks.Summary{}, Gate{}, `reports: unknown gate policy "warn" (want "fail", "needs-analysis" or "none")`},
	} {
		got, err := NewGate(tc.policy, tc.s)
		if tc.wantErr != "" {
			if err == nil || err.Error() != tc.wantErr {
				t.Errorf("NewGate(%q) err = %v, want %s", tc.policy, err, tc.wantErr)
			}
			continue
		}
		if err != nil || got != tc.want {
			t.Errorf("NewGate(%q, %+v) = %+v, %v; want %+v", tc.policy, tc.s, got, err, tc.want)
		}
	}
}

func TestCaution(t *testing.T) {
	for _, tc := range []struct {
		standard, scope string
		want, notWant   []string
	}{
		{"as4100", "stability",
			[]string{"AS 4100", "licensed structural engineer", "local building code", "With scope stability",
				"does not mean that the column has enough strength", "Seismic P-delta", "NZS 1170.5", "advanced", "assumption"},
			[]string{"total-moment-amplified", "member capacity,"}},
		{"nzs3404", "full", []string{"NZS 3404", "and of member capacity", "With scope full"}, []string{"total-moment-amplified"}},
		{"aisc360", "stability", []string{"AISC 360", "total-moment-amplified", "opposite signs", "unconservative"}, nil},
		{"en1993", "full", []string{"EN 1993-1-1", "total-moment-amplified"}, nil},
	} {
		c := Caution(tc.standard, tc.scope)
		for _, s := range tc.want {
			if !strings.Contains(c, s) {
				t.Errorf("Caution(%s, %s) lacks %q", tc.standard, tc.scope, s)
			}
		}
		for _, s := range tc.notWant {
			if strings.Contains(c, s) {
				t.Errorf("Caution(%s, %s) has %q", tc.standard, tc.scope, s)
			}
		}
		if strings.ContainsAny(c, "\n\r\"'<>&") {
			t.Errorf("Caution(%s, %s) spans lines or needs escaping", tc.standard, tc.scope)
		}
	}
}

// TestCautionEveryFormat checks that each format carries the caution.
func TestCautionEveryFormat(t *testing.T) {
	r := fxReport(true)
	c := Caution(r.Standard, r.Scope)
	for name, write := range writers {
		var b strings.Builder
		if err := write(&b, r, fxRun); err != nil {
			t.Fatal(err)
		}
		if !strings.Contains(b.String(), c) {
			t.Errorf("%s output lacks the caution", name)
		}
	}
}

var writers = map[string]func(io.Writer, *checks.Report, Run) error{
	"json": WriteJSON, "junit": WriteJUnit, "csv": WriteCSV, "html": WriteHTML, "text": WriteText,
}

func TestUnknownUnits(t *testing.T) {
	run := fxRun
	run.Units = "imperial"
	var b strings.Builder
	for _, err := range []error{WriteText(&b, fxReport(false), run), WriteHTML(&b, fxReport(false), run),
		WriteMembersText(&b, fxModel(), run)} {
		if err == nil || err.Error() != `reports: unknown units "imperial" (want "si" or "us")` {
			t.Errorf("err = %v", err)
		}
	}
}

func TestFmtSig(t *testing.T) {
	for _, tc := range []struct {
		v    float64
		want string
	}{
		{0, "0"}, {708.2, "708.2"}, {708.21, "708.2"}, {200000, "200000"}, {4200, "4200"}, {1.2, "1.2"},
		{0.30967741935483867, "0.3097"}, {-0.75, "-0.75"}, {2.23e8, "2.23e8"}, {1.56e12, "1.56e12"},
		{0.00012, "1.2e-4"}, {1, "1"}, {-0.00001, "-1e-5"}, {999999, "999999"},
	} {
		if got := fmtSig(tc.v, 4); got != tc.want {
			t.Errorf("fmtSig(%v) = %q, want %q", tc.v, got, tc.want)
		}
	}
}
