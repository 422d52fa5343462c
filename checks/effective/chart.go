package effective

import (
	"errors"
	"fmt"
	"math"
)

// ErrMechanism is returned by Sway when both ends are pinned (G_A = G_B =
// +Inf): a sway member without rotational restraint has no buckling load.
var ErrMechanism = errors.New("effective: sway member pinned at both ends is a mechanism")

// RatioError reports an end-restraint ratio that is negative or NaN.
type RatioError struct {
	End   string // "A" or "B"
	Value float64
}

func (e *RatioError) Error() string {
	return fmt.Sprintf("effective: end-restraint ratio G_%s = %g: want 0 ≤ G ≤ +Inf", e.End, e.Value)
}

// Braced returns the effective length factor K of a braced (sidesway
// inhibited) column from the end-restraint ratios gA and gB (AS 4100 γ1,
// γ2), solving the alignment-chart equation
//
//	(G_A·G_B/4)(π/K)² + ((G_A+G_B)/2)(1 − (π/K)/tan(π/K)) + 2 tan(π/(2K))/(π/K) − 1 = 0
//
// for the lowest buckling load, 0.5 ≤ K ≤ 1. G = 0 is a fixed end and
// G = +Inf a pinned end (K = 1 when both are pinned).
func Braced(gA, gB float64) (float64, error) {
	a, b, err := normalise(gA, gB)
	if err != nil {
		return 0, err
	}
	switch {
	case a == 0 && b == 0:
		return 0.5, nil // both fixed; the end points are exact roots, spared the rounding of sin(2π)
	case a == 1 && b == 1:
		return 1, nil // both pinned
	}
	// With x = π/K in [π, 2π], multiply the equation by x·sin x and divide
	// it by (1+G_A)(1+G_B): the result is free of poles and finite for G =
	// +Inf. With a = G_A/(1+G_A), b = G_B/(1+G_B):
	//   F(x) = ab·x³ sin x/4 + (a(1−b)+b(1−a))·(x sin x − x² cos x)/2
	//          + (1−a)(1−b)·(2(1 − cos x) − x sin x).
	// F(π) ≥ 0 (zero only for a = b = 1, K = 1) and F(2π) ≤ 0 (zero only for
	// a = b = 0, K = 0.5); the lowest load is the first sign change from π.
	f := func(x float64) float64 {
		s, c := math.Sincos(x)
		return a*b*x*x*x*s/4 + (a*(1-b)+b*(1-a))*(x*s-x*x*c)/2 + (1-a)*(1-b)*(2*(1-c)-x*s)
	}
	x, ok := firstRoot(f, math.Pi, 2*math.Pi)
	if !ok {
		// Unreachable for 0 ≤ G ≤ +Inf: F changes sign on [π, 2π].
		return 0, fmt.Errorf("effective: braced chart equation has no root for G_A = %g, G_B = %g", gA, gB)
	}
	return math.Pi / x, nil
}

// Sway returns the effective length factor K of a sway (sidesway
// uninhibited) column from the end-restraint ratios gA and gB, solving the
// alignment-chart equation
//
//	[G_A·G_B(π/K)² − 36] / [6(G_A+G_B)] − (π/K)/tan(π/K) = 0
//
// for the lowest buckling load, K ≥ 1. G = 0 is a fixed end (K = 1 for both
// fixed) and G = +Inf a pinned end; both pinned is ErrMechanism.
func Sway(gA, gB float64) (float64, error) {
	a, b, err := normalise(gA, gB)
	if err != nil {
		return 0, err
	}
	if a == 1 && b == 1 {
		return math.Inf(1), ErrMechanism
	}
	if a == 0 && b == 0 {
		return 1, nil // both fixed, S(π) = 0 exactly
	}
	// With x = π/K in (0, π], multiply by 6(G_A+G_B)·sin x, divide by
	// x(1+G_A)(1+G_B) to remove the trivial root x = 0:
	//   S(x) = ab·x sin x − 36(1−a)(1−b)·sin x/x − 6(a+b−2ab)·cos x.
	// S(0) = −36(1−a)(1−b) − 6(a+b−2ab) < 0 unless a = b = 1 (mechanism),
	// S(π) = 6(a+b−2ab) ≥ 0 (zero only for a = b = 0, K = 1).
	f := func(x float64) float64 {
		s, c := math.Sincos(x)
		sinc := 1.0
		if x != 0 {
			sinc = s / x
		}
		return a*b*x*s - 36*(1-a)*(1-b)*sinc - 6*(a+b-2*a*b)*c
	}
	x, ok := firstRoot(f, 0, math.Pi)
	if !ok || x == 0 {
		return 0, fmt.Errorf("effective: sway chart equation has no root for G_A = %g, G_B = %g", gA, gB)
	}
	return math.Pi / x, nil
}

// normalise maps the ratios to a = G/(1+G) in [0, 1] (1 for G = +Inf).
func normalise(gA, gB float64) (a, b float64, err error) {
	for i, g := range [2]float64{gA, gB} {
		if math.IsNaN(g) || g < 0 {
			end := "A"
			if i == 1 {
				end = "B"
			}
			return 0, 0, &RatioError{End: end, Value: g}
		}
	}
	return unit(gA), unit(gB), nil
}

func unit(g float64) float64 {
	if math.IsInf(g, 1) {
		return 1
	}
	return g / (1 + g)
}

// firstRoot finds the root of f in [lo, hi] nearest lo: it scans the
// interval for the first sign change and refines it with Brent's method.
// f(lo) must be non-zero unless lo itself is the root.
func firstRoot(f func(float64) float64, lo, hi float64) (float64, bool) {
	const n = 128
	x0, f0 := lo, f(lo)
	if f0 == 0 {
		return lo, true
	}
	for i := 1; i <= n; i++ {
		x1 := lo + (hi-lo)*float64(i)/n
		if i == n {
			x1 = hi
		}
		f1 := f(x1)
		if f1 == 0 {
			return x1, true
		}
		if (f0 < 0) != (f1 < 0) {
			return brent(f, x0, x1, f0, f1), true
		}
		x0, f0 = x1, f1
	}
	return 0, false
}

// brent returns a root of f in [a, b] where f(a) = fa and f(b) = fb have
// opposite signs (Brent 1973, "zeroin"), to about machine precision.
func brent(f func(float64) float64, a, b, fa, fb float64) float64 {
	c, fc := a, fa
	d := b - a
	e := d
	for iter := 0; iter < 200; iter++ {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol := 2*0x1p-52*math.Abs(b) + 1e-300
		m := (c - b) / 2
		if math.Abs(m) <= tol || fb == 0 {
			return b
		}
		if math.Abs(e) >= tol && math.Abs(fa) > math.Abs(fb) {
			// Interpolate: secant (a == c) or inverse quadratic.
			var p, q float64
			s := fb / fa
			if a == c {
				p = 2 * m * s
				q = 1 - s
			} else {
				qq := fa / fc
				r := fb / fc
				p = s * (2*m*qq*(qq-r) - (b-a)*(r-1))
				q = (qq - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			} else {
				p = -p
			}
			if 2*p < math.Min(3*m*q-math.Abs(tol*q), math.Abs(e*q)) {
				e = d
				d = p / q
			} else {
				d = m
				e = m
			}
		} else {
			d = m
			e = m
		}
		a, fa = b, fb
		if math.Abs(d) > tol {
			b += d
		} else if m > 0 {
			b += tol
		} else {
			b -= tol
		}
		fb = f(b)
	}
	return b
}
