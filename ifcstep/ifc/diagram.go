package ifc

import (
	"math"

	"swaygate/checks"
)

// The mechanics of member results (design §4.2): reading the written forces
// in one of the two sign conventions, and the moment diagram between the
// stations. Pure functions on plain values.

// sectionForce is the internal force at a station in the member's local
// axes, in the section-force convention: on the cut face whose outward
// normal is +x, N tension positive, dMy/dx = Vz, dMz/dx = −Vy. N, N·mm, mm.
type sectionForce struct {
	x          float64
	n, vy, vz  float64
	my, mz     float64
	ty         float64 // torsion (not used by the checks)
	haveShears bool
}

// conventionTolerance is the share of the larger end axial force within
// which a force counts as having no sign when the convention is detected.
const conventionTolerance = 0.10

// axialFloor is the axial force (N) below which the convention cannot be
// told from the axial pattern at all (10 N = 0.01 kN).
const axialFloor = 10.0

// detectConvention tells the sign convention from the axial forces written
// at the start and the end of a member: end forces have opposite signs
// (compression: positive at the start, negative at the end), section forces
// the same sign. A force within 10 % of the larger of the two has no sign;
// ok is false when the pattern does not decide (both tiny, or one without a
// sign).
func detectConvention(n0, n1 float64) (SignConvention, bool) {
	m := math.Max(math.Abs(n0), math.Abs(n1))
	if !(m > axialFloor) {
		return ConventionAuto, false
	}
	t := conventionTolerance * m
	sign := func(v float64) int {
		switch {
		case v > t:
			return 1
		case v < -t:
			return -1
		}
		return 0
	}
	s := sign(n0) * sign(n1)
	switch {
	case s < 0:
		return ConventionEndForces, true
	case s > 0:
		return ConventionSectionForces, true
	}
	return ConventionAuto, false
}

// toSectionForces reads stations (already in local axes) in convention c.
// In the end-force convention the first and last stations are the member's
// ends: the section force is minus the written force at the start and the
// written force at the end; stations in between can only be section forces
// and are read as such.
func toSectionForces(st []station, c SignConvention) []sectionForce {
	return appendSectionForces(make([]sectionForce, 0, len(st)), st, c)
}

// appendSectionForces is toSectionForces into dst's storage.
func appendSectionForces(dst []sectionForce, st []station, c SignConvention) []sectionForce {
	dst = dst[:0]
	for i, s := range st {
		k := 1.0
		if c == ConventionEndForces && i == 0 && len(st) > 1 {
			k = -1
		}
		dst = append(dst, sectionForce{x: s.x, n: k * s.f[0], vy: k * s.f[1], vz: k * s.f[2], ty: k * s.m[0], my: k * s.m[1], mz: k * s.m[2], haveShears: true})
	}
	return dst
}

// equilibriumResidual returns how far the forces written at the two ends of
// a member of length L along unit axis ax are from equilibrium as end forces
// (the actions on the member at its ends), relative to their size: 0 is
// exact. The moments are taken about the start: M0 + M1 + (L·ax) × F1.
func equilibriumResidual(f0, m0, f1, m1 vec, ax vec, l float64) float64 {
	r := ax.scale(l)
	couple := r.cross(f1)
	dm := m0.add(m1).add(couple)
	df := f0.add(f1)
	scaleM := math.Max(math.Max(m0.norm(), m1.norm()), couple.norm())
	scaleF := math.Max(f0.norm(), f1.norm())
	res := 0.0
	if scaleM > 0 {
		res = dm.norm() / scaleM
	}
	if scaleF > 0 {
		res = math.Max(res, df.norm()/scaleF)
	}
	return res
}

// balanced reports whether two end stations balance as end forces (or, with
// the start negated, as section forces) along axis ax: 1 % tolerance.
func balanced(s0, s1 station, ax vec, l float64) bool {
	if equilibriumResidual(s0.f, s0.m, s1.f, s1.m, ax, l) < 0.01 {
		return true
	}
	return equilibriumResidual(s0.f.scale(-1), s0.m.scale(-1), s1.f, s1.m, ax, l) < 0.01
}

// hermitePeak returns the largest |M| of the moment diagram through the
// stations xs with moments ms and slopes (dM/dx) ss: at the stations and at
// the extrema of the cubic Hermite interpolant between them, which is exact
// when the moment is a polynomial of degree three or less between stations
// (a uniformly distributed load makes it a parabola).
func hermitePeak(xs, ms, ss []float64) float64 {
	peak := 0.0
	for _, m := range ms {
		peak = math.Max(peak, math.Abs(m))
	}
	for i := 0; i+1 < len(xs); i++ {
		h := xs[i+1] - xs[i]
		if !(h > 0) {
			continue
		}
		m0, m1 := ms[i], ms[i+1]
		d0, d1 := h*ss[i], h*ss[i+1]
		// dH/dt = a t² + b t + c on t in (0, 1).
		a := 6*m0 + 3*d0 - 6*m1 + 3*d1
		b := -6*m0 - 4*d0 + 6*m1 - 2*d1
		c := d0
		roots, nr := roots2(a, b, c)
		for _, t := range roots[:nr] {
			if t > 0 && t < 1 {
				t2, t3 := t*t, t*t*t
				v := (2*t3-3*t2+1)*m0 + (t3-2*t2+t)*d0 + (-2*t3+3*t2)*m1 + (t3-t2)*d1
				peak = math.Max(peak, math.Abs(v))
			}
		}
	}
	return peak
}

// quadRoots returns the real roots of a t² + b t + c = 0 (one root when
// linear, none when constant).
func quadRoots(a, b, c float64) []float64 {
	r, n := roots2(a, b, c)
	return append([]float64(nil), r[:n]...)
}

// roots2 is quadRoots without allocating: the roots and their number.
func roots2(a, b, c float64) ([2]float64, int) {
	var r [2]float64
	scale := math.Max(math.Abs(a), math.Max(math.Abs(b), math.Abs(c)))
	if scale == 0 {
		return r, 0
	}
	if math.Abs(a) < 1e-12*scale {
		if math.Abs(b) < 1e-12*scale {
			return r, 0
		}
		r[0] = -c / b
		return r, 1
	}
	disc := b*b - 4*a*c
	if disc < 0 {
		return r, 0
	}
	sq := math.Sqrt(disc)
	// Numerically stable form.
	q := -0.5 * (b + math.Copysign(sq, b))
	if q != 0 {
		r[0], r[1] = q/a, c/q
		return r, 2
	}
	r[0] = -b / (2 * a)
	return r, 1
}

// shearTolerance: end shears that differ by more than 1 % of the larger
// shear (or of the mean gradient max|M|/L) and by more than 1 N mean a load
// between the ends.
const shearTolerance = 0.01

// diagram turns section forces into one combination's actions: N* the
// largest compression, and per axis the end moments, the peak of the moment
// diagram and whether a load acts between the ends. phi is the angle from
// the member's local y to its major principal axis, in the local y-z plane.
func diagram(sf []sectionForce, phi, length float64) (nstar float64, ax [2]checks.AxisMoments) {
	nstar = math.Inf(-1)
	for _, s := range sf {
		nstar = math.Max(nstar, -s.n)
	}
	if len(sf) == 0 {
		return 0, ax
	}
	c, s := math.Cos(phi), math.Sin(phi)
	// Stack storage for the usual few stations.
	var xsA [8]float64
	var msA, ssA [2][8]float64
	xs := xsA[:0]
	var ms, ss [2][]float64
	if len(sf) <= len(xsA) {
		xs = xsA[:len(sf)]
		for a := range ms {
			ms[a], ss[a] = msA[a][:len(sf)], ssA[a][:len(sf)]
		}
	} else {
		xs = make([]float64, len(sf))
		for a := range ms {
			ms[a] = make([]float64, len(sf))
			ss[a] = make([]float64, len(sf))
		}
	}
	for i, f := range sf {
		xs[i] = f.x
		ms[0][i] = f.my*c + f.mz*s
		ms[1][i] = -f.my*s + f.mz*c
		// dMy/dx = Vz, dMz/dx = −Vy.
		ss[0][i] = f.vz*c - f.vy*s
		ss[1][i] = -f.vz*s - f.vy*c
	}
	for a := range ax {
		m := &ax[a]
		m.Start, m.End = ms[a][0], ms[a][len(sf)-1]
		m.Peak = hermitePeak(xs, ms[a], ss[a])
		lo, hi, mmax := math.Inf(1), math.Inf(-1), 0.0
		for i := range sf {
			lo, hi = math.Min(lo, ss[a][i]), math.Max(hi, ss[a][i])
			mmax = math.Max(mmax, math.Abs(ms[a][i]))
		}
		scale := math.Max(math.Max(math.Abs(lo), math.Abs(hi)), mmax/math.Max(length, 1))
		if spread := hi - lo; spread > shearTolerance*scale && spread > 1 {
			m.Transverse = true
		}
		if m.Peak <= math.Max(math.Abs(m.Start), math.Abs(m.End))*(1+1e-12) {
			m.Peak = 0 // the larger end moment (the input type's convention)
		}
	}
	return nstar, ax
}
