package reports

import (
	"encoding/json"
	"strings"
	"testing"

	"swaygate/reports/schema"
)

// TestSchemaRejects changes one field of a valid report at a time and expects
// the schema to reject each change.
func TestSchemaRejects(t *testing.T) {
	valid := writeJSON(t, fxReport(true), fxRun)
	if err := schema.ValidateReport(valid); err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		name string
		edit func(doc map[string]any)
	}{
		{"unknown top-level field", func(d map[string]any) { d["extra"] = 1 }},
		{"report version", func(d map[string]any) { d["report_version"] = "2" }},
		{"created_at not RFC 3339", func(d map[string]any) { d["created_at"] = "15/01/2025" }},
		{"missing caution", func(d map[string]any) { delete(d, "caution") }},
		{"unknown standard", func(d map[string]any) { d["standard"] = "bs5950" }},
		{"gate policy", func(d map[string]any) { d["gate"].(map[string]any)["policy"] = "warn" }},
		{"verdict", func(d map[string]any) { el(d, "1hL2Wb0aL9$Qm8sZkT4p01")["verdict"] = "ok" }},
		{"reason code", func(d map[string]any) {
			el(d, "1hL2Wb0aL9$Qm8sZkT4p05")["reasons"].([]any)[0].(map[string]any)["code"] = "Unstable!"
		}},
		{"delta below 1", func(d map[string]any) { axis(d, "major")["delta_m"] = 0.9 }},
		{"NaN as string", func(d map[string]any) { axis(d, "major")["lambda_c"] = "NaN" }},
		{"zero stiffness", func(d map[string]any) { axis(d, "major")["n_om_kn"] = 0 }},
		{"direction", func(d map[string]any) { axis(d, "major")["direction"] = "Z" }},
		{"unit suffix renamed", func(d map[string]any) {
			a := axis(d, "minor")
			a["n_om"] = a["n_om_kn"]
			delete(a, "n_om_kn")
		}},
		{"sha256", func(d map[string]any) { d["model"].(map[string]any)["sha256"] = "xyz" }},
		{"empty GlobalId key", func(d map[string]any) {
			els := d["elements"].(map[string]any)
			els[""] = els["1hL2Wb0aL9$Qm8sZkT4p01"]
		}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			var doc map[string]any
			if err := json.Unmarshal(valid, &doc); err != nil {
				t.Fatal(err)
			}
			tc.edit(doc)
			b, err := json.Marshal(doc)
			if err != nil {
				t.Fatal(err)
			}
			if err := schema.ValidateReport(b); err == nil {
				t.Error("schema accepted the change")
			} else if !strings.HasPrefix(err.Error(), "schema: report does not match its schema") {
				t.Errorf("error %q", err)
			}
		})
	}
	if err := schema.ValidateReport([]byte(`{"report_version":`)); err == nil || !strings.Contains(err.Error(), "not JSON") {
		t.Errorf("truncated input: %v", err)
	}
}

func el(d map[string]any, gid string) map[string]any {
	return d["elements"].(map[string]any)[gid].(map[string]any)
}

func axis(d map[string]any, ax string) map[string]any {
	return el(d, "1hL2Wb0aL9$Qm8sZkT4p01")["combinations"].([]any)[0].(map[string]any)[ax].(map[string]any)
}
