package standards_test

import (
	"testing"

	"swaygate/checks/standards"
)

// TestLookup: every listed name resolves to its rule set, its default
// modulus is the standard's.
func TestLookup(t *testing.T) {
	modulus := map[string]float64{
		"as4100":  200_000, // source: standards-notes §1.0 (AS 4100 2.2.4)
		"nzs3404": 200_000, // source: standards-notes §2 (NZS 3404 follows AS 4100)
		"en1993":  210_000, // source: standards-notes §3 (EN 1993-1-1 3.2.6, 6.3.1: E = 210 000 MPa)
		"aisc360": 200_000, // source: standards-notes §4 (AISC 360 E3: E = 29 000 ksi = 200 000 MPa)
	}
	if len(standards.Names()) != len(modulus) {
		t.Errorf("Names() = %v", standards.Names())
	}
	for _, name := range standards.Names() {
		rs, err := standards.Lookup(name)
		if err != nil || rs.Name() != name {
			t.Fatalf("Lookup(%q) = %v, %v", name, rs, err)
		}
		if e, clause := rs.Modulus(); e != modulus[name] || clause == "" {
			t.Errorf("%s: E = %v (%q), want %v", name, e, clause, modulus[name])
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
