package reports

import (
	"bytes"
	"encoding/json"
	"testing"

	"swaygate/reports/schema"
)

func TestWriteMembersJSON(t *testing.T) {
	var buf bytes.Buffer
	if err := WriteMembersJSON(&buf, fxModel(), fxRun); err != nil {
		t.Fatal(err)
	}
	got := buf.Bytes()
	if err := schema.ValidateMembers(got); err != nil {
		t.Fatal(err)
	}
	if err := schema.ValidateReport(got); err == nil {
		t.Error("a member listing passed the report schema")
	}
	var doc struct {
		Summary  map[string]int `json:"summary"`
		Elements map[string]struct {
			Reasons      []map[string]string `json:"reasons"`
			Combinations []map[string]any    `json:"combinations"`
			Restraint    map[string]map[string]any
			Verdict      *string `json:"verdict"`
			Trace        []any   `json:"trace"`
		} `json:"elements"`
	}
	if err := json.Unmarshal(got, &doc); err != nil {
		t.Fatal(err)
	}
	if doc.Summary["members"] != 5 || doc.Summary["with_problems"] != 1 {
		t.Errorf("summary %v", doc.Summary)
	}
	c1 := doc.Elements["1hL2Wb0aL9$Qm8sZkT4p01"]
	if c1.Verdict != nil || c1.Trace != nil {
		t.Error("member listing carries a verdict or a trace")
	}
	a := c1.Combinations[0]
	for k, want := range map[string]float64{"n_star_kn": 1450, "m_major_start_knm": 45, "m_major_end_knm": -62,
		"m_major_peak_knm": 62, "m_minor_peak_knm": 5} {
		if a[k] != want {
			t.Errorf("C1 %s = %v, want %v", k, a[k], want)
		}
	}
	if r := c1.Restraint["major"]; r["sway"] != true || r["ke"] != 1.2 || r["braced_ke"] != 1.0 || r["buckling_length_mm"] != 4200.0 {
		t.Errorf("C1 major restraint %v", r)
	}
	c4 := doc.Elements["1hL2Wb0aL9$Qm8sZkT4p04"]
	if len(c4.Reasons) != 2 || c4.Reasons[0]["code"] != "missing-section" || c4.Reasons[1]["axis"] != "minor" {
		t.Errorf("C4 reasons %v", c4.Reasons)
	}
	if r := c4.Restraint["minor"]; r["sway"] != nil || r["ke"] != nil {
		t.Errorf("C4 minor restraint %v, want sway and ke null", r)
	}
	if c5 := doc.Elements["1hL2Wb0aL9$Qm8sZkT4p05"]; c5.Restraint["minor"]["buckling_length_mm"] != 7200.0 {
		t.Errorf("C5 minor buckling length %v", c5.Restraint["minor"]["buckling_length_mm"])
	}

	var ind bytes.Buffer
	if err := json.Indent(&ind, got, "", "  "); err != nil {
		t.Fatal(err)
	}
	ind.WriteByte('\n')
	golden(t, "members.golden.json", ind.Bytes())
}

func TestWriteMembersText(t *testing.T) {
	for _, units := range []string{UnitsSI, UnitsUS} {
		t.Run(units, func(t *testing.T) {
			run := fxRun
			run.Units = units
			var buf bytes.Buffer
			if err := WriteMembersText(&buf, fxModel(), run); err != nil {
				t.Fatal(err)
			}
			golden(t, "members-"+units+".golden.txt", buf.Bytes())
		})
	}
}
