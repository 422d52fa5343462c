package standards_test

import (
	"testing"

	"swaygate/checks/standards"
)

// TestLookup: every listed name resolves to its rule set, its default
// modulus is the standard's. source: standards-notes §1.0 (AS 4100 2.2.4: E = 200 000 MPa), §2 (NZS 3404 follows AS 4100)
func TestLookup(t *testing.T) {
	for _, name := range standards.Names() {
		rs, err := standards.Lookup(name)
		if err != nil || rs.Name() != name {
			t.Fatalf("Lookup(%q) = %v, %v", name, rs, err)
		}
		// source: standards-notes §1.0 (AS 4100 2.2.4: E = 200 000 MPa; NZS 3404 follows AS 4100, §2)
		if e, clause := rs.Modulus(); e != 200_000 || clause == "" {
			t.Errorf("%s: E = %v (%q)", name, e, clause)
		}
	}
	if rs, err := standards.Lookup(""); err != nil || rs.Name() != standards.Default {
		t.Errorf("default: %v %v", rs, err)
	}
	if rs, err := standards.Lookup(" NZS3404 "); err != nil || rs.Name() != "nzs3404" {
		t.Errorf("case: %v %v", rs, err)
	}
	if _, err := standards.Lookup("bs5950"); err == nil {
		t.Error("unknown standard accepted")
	}
}
