package effective

import (
	"math"
	"testing"
)

func TestIdealised(t *testing.T) {
	tests := []struct {
		f    Family
		a, b End
		sway bool
		want float64
		ok   bool
	}{
		// source: standards-notes §1.2 [M], AS 4100 Figure 4.6.3.2 (from memory: design values).
		{AS4100, Fixed, Fixed, false, 0.7, true},
		{AS4100, Fixed, Pinned, false, 0.85, true},
		{AS4100, Pinned, Fixed, false, 0.85, true},
		{AS4100, Pinned, Pinned, false, 1.0, true},
		{AS4100, Fixed, Fixed, true, 1.2, true},
		{AS4100, Fixed, Free, true, 2.2, true},
		{AS4100, Free, Fixed, true, 2.2, true},
		{AS4100, Fixed, Pinned, true, 2.2, true},
		// source: standards-notes §1.2 [C], AISC Table C-A-7.1 recommended values.
		{AISC, Fixed, Fixed, false, 0.65, true},
		{AISC, Fixed, Pinned, false, 0.8, true},
		{AISC, Pinned, Pinned, false, 1.0, true},
		{AISC, Fixed, Fixed, true, 1.2, true},
		{AISC, Fixed, Free, true, 2.1, true},
		{AISC, Pinned, Fixed, true, 2.0, true},
		// source: standards-notes §1.2: theoretical 0.5 / 0.7 / 1.0 / 1.0 / 2.0 / 2.0.
		{Theoretical, Fixed, Fixed, false, 0.5, true},
		{Theoretical, Fixed, Pinned, false, 0.7, true},
		{Theoretical, Fixed, Free, true, 2.0, true},
		// Mechanisms and contradictions. source: standards-notes §5: pinned–pinned sway is a mechanism.
		{AS4100, Pinned, Pinned, true, 0, false},
		{AS4100, Pinned, Free, true, 0, false},
		{AS4100, Free, Free, true, 0, false},
		{AS4100, Fixed, Free, false, 0, false},
		{AS4100, Free, Free, false, 0, false},
		{AS4100, EndUnknown, Fixed, false, 0, false},
		{Family(9), Fixed, Fixed, false, 0, false},
	}
	for _, tt := range tests {
		got, ok := Idealised(tt.f, tt.a, tt.b, tt.sway)
		if ok != tt.ok || (ok && math.Abs(got-tt.want) > 1e-12) {
			t.Errorf("Idealised(%v, %v, %v, sway=%v) = %g, %v; want %g, %v", tt.f, tt.a, tt.b, tt.sway, got, ok, tt.want, tt.ok)
		}
	}
}

func TestParseEnd(t *testing.T) {
	// source: design.md §4 property set values fixed / pinned / free (common practice labels).
	for in, want := range map[string]End{"fixed": Fixed, "Pinned": Pinned, "FREE": Free} {
		if got, ok := ParseEnd(in); !ok || got != want {
			t.Errorf("ParseEnd(%q) = %v, %v; want %v", in, got, ok, want)
		}
	}
	if _, ok := ParseEnd("hinged"); ok {
		t.Error(`ParseEnd("hinged") ok; want false`)
	}
}

func TestBetaE(t *testing.T) {
	tests := []struct {
		f    Family
		far  FarEnd
		sway bool
		want float64
	}{
		// source: standards-notes §1.2 [M], AS 4100 Table 4.6.3.4 (from memory).
		{AS4100, FarPinned, false, 1.5},
		{AS4100, FarColumn, false, 1.0},
		{AS4100, FarFixed, false, 2.0},
		{AS4100, FarPinned, true, 0.5},
		{AS4100, FarColumn, true, 1.0},
		{AS4100, FarFixed, true, 0.67},
		// source: standards-notes §5 [C], AISC Commentary Appendix 7 girder adjustments ×1.5, ×2; ×1/2, ×2/3.
		{AISC, FarPinned, false, 1.5},
		{AISC, FarFixed, false, 2.0},
		{AISC, FarPinned, true, 0.5},
		{AISC, FarFixed, true, 2.0 / 3},
	}
	for _, tt := range tests {
		if got := BetaE(tt.f, tt.far, tt.sway); math.Abs(got-tt.want) > 1e-12 {
			t.Errorf("BetaE(%v, %v, sway=%v) = %g; want %g", tt.f, tt.far, tt.sway, got, tt.want)
		}
	}
}

func TestRatio(t *testing.T) {
	const e = 200000 // MPa. source: standards-notes §1.0 [L], AS 4100 2.2.4.
	col := Column{E: e, I: 100e6, L: 4000}
	beam := Beam{E: e, I: 200e6, L: 8000}
	tests := []struct {
		name    string
		columns []Column
		beams   []Beam
		sway    bool
		want    float64
	}{
		// G = Σ(I/l)c / Σ(βe I/l)b. source: standards-notes §1.2 [M], AS 4100 4.6.3.3.
		{"one column two beams", []Column{col}, []Beam{beam, beam}, true, 0.5},
		{"two columns one beam", []Column{col, col}, []Beam{beam}, false, 2},
		// βe = 0.5 for a pinned far end in a sway frame. source: standards-notes §1.2 Table 4.6.3.4 [M].
		{"sway far end pinned", []Column{col}, []Beam{{E: e, I: 200e6, L: 8000, Far: FarPinned}}, true, 2},
		// βe = 2.0 for a fixed far end in a braced frame.
		{"braced far end fixed", []Column{col}, []Beam{{E: e, I: 200e6, L: 8000, Far: FarFixed}}, false, 0.5},
		{"no beam", []Column{col}, nil, true, math.Inf(1)},
	}
	for _, tt := range tests {
		got, err := Ratio(AS4100, tt.columns, tt.beams, tt.sway)
		if err != nil || !(got == tt.want || math.Abs(got-tt.want) <= 1e-12*tt.want) {
			t.Errorf("%s: Ratio = %g, %v; want %g", tt.name, got, err, tt.want)
		}
	}
	if _, err := Ratio(AS4100, nil, []Beam{beam}, true); err == nil {
		t.Error("Ratio without a column: want an error")
	}
	if _, err := Ratio(AS4100, []Column{col}, []Beam{{E: e, I: 0, L: 8000}}, true); err == nil {
		t.Error("Ratio with I = 0: want an error")
	}
}

// TestPortalFromRatio runs the chain Ratio → Sway for the portal of
// standards-notes §5 with R = 1: each column top meets one beam (far end
// rigid to the other column), G_top = (Ic/h)/(Ib/b) = 1, and the theoretical
// footing gives G = +Inf (pinned) or 0 (fixed).
func TestPortalFromRatio(t *testing.T) {
	const e = 200000
	gTop, err := Ratio(Theoretical, []Column{{E: e, I: 50e6, L: 5000}}, []Beam{{E: e, I: 50e6, L: 5000}}, true)
	if err != nil {
		t.Fatal(err)
	}
	for _, tt := range []struct {
		base End
		want float64
	}{
		// source: standards-notes §5 [D], Timoshenko & Gere portal, R = 1: pinned bases K = 2.328, fixed 1.1565.
		{Pinned, 2.328},
		{Fixed, 1.1565},
	} {
		gBase, ok := Footing(Theoretical, tt.base)
		if !ok {
			t.Fatalf("Footing(%v) not ok", tt.base)
		}
		k, err := Sway(gTop, gBase)
		if err != nil || !within(k, tt.want, 0.001) {
			t.Errorf("%v bases: K = %g, %v; want %g", tt.base, k, err, tt.want)
		}
	}
}

func TestFooting(t *testing.T) {
	tests := []struct {
		f    Family
		base End
		want float64
		ok   bool
	}{
		// source: standards-notes §1.2 [L], Steel Designers' Handbook p.53 on AS 4100: γ ≥ 10 pinned, 0.6 rigid footing.
		{AS4100, Pinned, 10, true},
		{AS4100, Fixed, 0.6, true},
		// source: standards-notes §5 [C], AISC Commentary Appendix 7: G = 10 not rigidly fixed, 1.0 rigidly fixed.
		{AISC, Pinned, 10, true},
		{AISC, Fixed, 1.0, true},
		{Theoretical, Fixed, 0, true},
		{Theoretical, Pinned, math.Inf(1), true},
		{AS4100, Free, 0, false},
	}
	for _, tt := range tests {
		got, ok := Footing(tt.f, tt.base)
		if ok != tt.ok || got != tt.want {
			t.Errorf("Footing(%v, %v) = %g, %v; want %g, %v", tt.f, tt.base, got, ok, tt.want, tt.ok)
		}
	}
}
