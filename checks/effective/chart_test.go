package effective

import (
	"errors"
	"math"
	"testing"
)

var inf = math.Inf(1)

// within reports whether got is within rel (relative) of want.
func within(got, want, rel float64) bool {
	return math.Abs(got-want) <= rel*math.Abs(want)
}

func TestChartSolvedValues(t *testing.T) {
	// source: standards-notes §5 [D], alignment-chart solved values (the
	// equations of AISC 360-22 Commentary Appendix 7, Kavanagh 1962).
	tests := []struct {
		gA, gB       float64
		braced, sway float64
	}{
		{0, 0, 0.5000, 1.0000},
		{0, inf, 0.6992, 2.0000},
		{0.5, 0.5, 0.6863, 1.1639},
		{1, 1, 0.7743, 1.3173},
		{2, 2, 0.8553, 1.5895},
		{3, 3, 0.8934, 1.8258},
		{1, 10, 0.8599, 1.9030},
		{0.6, 10, 0.8209, 1.8132},
		{10, 10, 0.9625, 3.0104},
		{1, 0, 0.6261, 1.1565},
	}
	for _, tt := range tests {
		for _, swap := range []bool{false, true} {
			gA, gB := tt.gA, tt.gB
			if swap {
				gA, gB = gB, gA
			}
			kb, err := Braced(gA, gB)
			if err != nil || !within(kb, tt.braced, 0.002) {
				t.Errorf("Braced(%g, %g) = %.5f, %v; want %.4f ± 0.2 %%", gA, gB, kb, err, tt.braced)
			}
			ks, err := Sway(gA, gB)
			if err != nil || !within(ks, tt.sway, 0.002) {
				t.Errorf("Sway(%g, %g) = %.5f, %v; want %.4f ± 0.2 %%", gA, gB, ks, err, tt.sway)
			}
		}
	}
}

func TestChartClosedForms(t *testing.T) {
	tests := []struct {
		name   string
		sway   bool
		gA, gB float64
		want   float64
		rel    float64
	}{
		// source: Timoshenko & Gere, Theory of Elastic Stability §2.1 (from memory for the section number): fixed–fixed K = 0.5.
		{"braced fixed-fixed", false, 0, 0, 0.5, 1e-12},
		// source: Timoshenko & Gere §2.1: pin-ended strut, K = 1.
		{"braced pinned-pinned", false, inf, inf, 1, 1e-12},
		// source: standards-notes §5, fixed–pinned tan(kL) = kL, kL = 4.4934, K = π/4.4934 = 0.6992.
		{"braced fixed-pinned", false, 0, inf, math.Pi / 4.493409457909064, 1e-9},
		// source: standards-notes §5, rigid-beam portal sway with fixed bases, K = 1.
		{"sway fixed-fixed", true, 0, 0, 1, 1e-12},
		// source: Timoshenko & Gere: cantilever (fixed base, free top) K = 2; the sway chart with G_A = 0, G_B = +Inf.
		{"sway fixed-pinned", true, 0, inf, 2, 1e-9},
		// source: standards-notes §5 [D] (Timoshenko & Gere §2.8 frames): portal with R = 1, pinned bases,
		// (kh)tan(kh) = 6R, K = 2.328; equals the sway chart with G = 1/R and G = +Inf.
		{"portal R=1 pinned bases", true, 1, inf, 2.328, 0.001},
		// source: standards-notes §5 [D]: portal with R = 1, fixed bases, (kh)cot(kh) = −6R, K = 1.1565.
		{"portal R=1 fixed bases", true, 1, 0, 1.1565, 0.001},
		// source: standards-notes §5 [D]: symmetric (braced) portal mode, R = 1: pinned bases 0.8749, fixed 0.6260.
		{"braced portal R=1 pinned bases", false, 1, inf, 0.8749, 0.001},
		{"braced portal R=1 fixed bases", false, 1, 0, 0.6260, 0.001},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			f := Braced
			if tt.sway {
				f = Sway
			}
			got, err := f(tt.gA, tt.gB)
			if err != nil || !within(got, tt.want, tt.rel) {
				t.Errorf("got %.6f, %v; want %.6f (rel %g)", got, err, tt.want, tt.rel)
			}
		})
	}
}

// TestChartResidual checks the returned K against the original (unscaled)
// chart equations. source: standards-notes §5 [C], AISC 360-22 Commentary
// Appendix 7 equations.
func TestChartResidual(t *testing.T) {
	braced := func(ga, gb, k float64) float64 {
		x := math.Pi / k
		return ga*gb/4*x*x + (ga+gb)/2*(1-x/math.Tan(x)) + 2*math.Tan(x/2)/x - 1
	}
	sway := func(ga, gb, k float64) float64 {
		x := math.Pi / k
		return (ga*gb*x*x-36)/(6*(ga+gb)) - x/math.Tan(x)
	}
	for _, ga := range []float64{0.1, 0.3, 0.8, 1.5, 4, 20, 100} {
		for _, gb := range []float64{0.2, 1, 2.5, 9, 50} {
			kb, err := Braced(ga, gb)
			if err != nil || math.Abs(braced(ga, gb, kb)) > 1e-9 {
				t.Errorf("Braced(%g, %g) = %g: residual %g, %v", ga, gb, kb, braced(ga, gb, kb), err)
			}
			ks, err := Sway(ga, gb)
			if err != nil || math.Abs(sway(ga, gb, ks)) > 1e-9 {
				t.Errorf("Sway(%g, %g) = %g: residual %g, %v", ga, gb, ks, sway(ga, gb, ks), err)
			}
		}
	}
}

func TestChartMonotone(t *testing.T) {
	// More flexible restraint never shortens the effective length.
	// source: standards-notes §5 [C]: K braced → 1.0 and K sway → ∞ as G_A, G_B → ∞.
	prevB, prevS := 0.0, 0.0
	for _, g := range []float64{0, 1e-6, 0.01, 0.1, 0.5, 1, 2, 5, 10, 100, 1e4, 1e8} {
		kb, err := Braced(g, g)
		if err != nil || kb < prevB || kb > 1 {
			t.Errorf("Braced(%g, %g) = %g, %v: want non-decreasing, ≤ 1", g, g, kb, err)
		}
		ks, err := Sway(g, g)
		if err != nil || ks < prevS || ks < 1 {
			t.Errorf("Sway(%g, %g) = %g, %v: want non-decreasing, ≥ 1", g, g, ks, err)
		}
		prevB, prevS = kb, ks
	}
	if prevS < 1000 {
		t.Errorf("Sway(1e8, 1e8) = %g: want a very long effective length", prevS)
	}
}

func TestChartErrors(t *testing.T) {
	// source: standards-notes §5: the pinned–pinned sway case is a mechanism.
	if k, err := Sway(inf, inf); !errors.Is(err, ErrMechanism) || !math.IsInf(k, 1) {
		t.Errorf("Sway(+Inf, +Inf) = %g, %v; want +Inf, ErrMechanism", k, err)
	}
	var re *RatioError
	if _, err := Braced(-1, 1); !errors.As(err, &re) || re.End != "A" {
		t.Errorf("Braced(-1, 1) error = %v; want RatioError on end A", err)
	}
	if _, err := Sway(1, math.NaN()); !errors.As(err, &re) || re.End != "B" {
		t.Errorf("Sway(1, NaN) error = %v; want RatioError on end B", err)
	}
}
