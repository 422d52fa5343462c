package schema

import (
	"bytes"
	"encoding/json"
	"testing"
)

// TestSchemaEmbedded checks that the embedded schema is the file in the
// repository and declares draft 2020-12.
func TestSchemaEmbedded(t *testing.T) {
	s := Report()
	var doc map[string]any
	if err := json.Unmarshal(s, &doc); err != nil {
		t.Fatal(err)
	}
	if doc["$schema"] != "https://json-schema.org/draft/2020-12/schema" || doc["$id"] != ReportID {
		t.Errorf("$schema %v $id %v", doc["$schema"], doc["$id"])
	}
	if !bytes.Contains(s, []byte(`"m_amplified_knm"`)) {
		t.Error("schema lacks m_amplified_knm")
	}
}

// TestValidateMembers: an empty listing is not a listing.
func TestValidateMembers(t *testing.T) {
	if err := ValidateMembers([]byte(`{}`)); err == nil {
		t.Error("an empty object validates as a member listing")
	}
	if err := ValidateReport([]byte(`[`)); err == nil {
		t.Error("truncated JSON validates")
	}
}
