package frame

import (
	"math"
	"testing"
)

// TestStrutClosedForms checks single members against the classical
// buckling loads, refined to 8 elements.
func TestStrutClosedForms(t *testing.T) {
	const l, i, p = 5000.0, 1e7, 100e3
	euler := math.Pi * math.Pi * testE * i / (l * l)
	tests := []struct {
		name      string
		base, top [6]bool
		k         float64 // effective length factor
	}{
		// source: Timoshenko & Gere, Theory of Elastic Stability §2.1 (section from memory); standards-notes §5: Pcr = π²EI/L².
		{"pinned-pinned", pinNoTwist, rollerZ, 1},
		// source: standards-notes §5: cantilever Pcr = π²EI/(4L²), K = 2.
		{"cantilever", allFixed, [6]bool{false, false, false, false, false, false}, 2},
		// source: standards-notes §5: fixed–fixed 4π²EI/L², K = 0.5.
		{"fixed-fixed", allFixed, slideZ, 0.5},
		// source: standards-notes §5: fixed–pinned tan(kL) = kL, kL = 4.4934, Pcr = 20.19·EI/L².
		{"fixed-pinned", allFixed, rollerZ, math.Pi / 4.493409457909064},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			m := strut(l, i, p, tt.base, tt.top, 8)
			r := analyze(t, m, Options{})
			b := r.Combinations[0]
			want := euler / (tt.k * tt.k) / p
			if b.Status != Buckles || relErr(b.Lambda, want) > 1e-3 {
				t.Errorf("λ = %.6g (%v); want %.6g ± 0.1 %%", b.Lambda, b.Status, want)
			}
			if got := b.Ke[0][0]; relErr(got, tt.k) > 1e-3 {
				t.Errorf("ke (y) = %.5f; want %.5f", got, tt.k)
			}
		})
	}
}

// TestMeshConvergence divides a pin-ended strut into 1, 2, 4 and 8
// elements: the error against π²EI/L² must fall each time.
func TestMeshConvergence(t *testing.T) {
	const l, i, p = 6000.0, 2e7, 1e5
	// source: standards-notes §5, Euler load π²EI/L².
	euler := math.Pi * math.Pi * testE * i / (l * l)
	prev := math.Inf(1)
	for _, n := range []int{1, 2, 4, 8} {
		r := analyze(t, strut(l, i, p, pinNoTwist, rollerZ, n), Options{})
		e := r.Combinations[0].Lambda*p/euler - 1
		if !(e > 0) || e >= prev {
			t.Errorf("%d elements: error %.3g; want positive and below %.3g", n, e, prev)
		}
		prev = e
		if n == 1 {
			// A single cubic element gives 12EI/L². source: derived here [D]
			// (Rayleigh quotient of the cubic shape function).
			if want := 12/(math.Pi*math.Pi) - 1; math.Abs(e-want) > 1e-9 {
				t.Errorf("1 element: error %.9f; want 12/π² − 1 = %.9f", e, want)
			}
		}
	}
	if prev > 1e-4 {
		t.Errorf("8 elements: error %.3g; want < 1e-4", prev)
	}
}

// TestPortals solves portal frames as plane models and compares the
// columns' K derived from λ with the closed forms.
func TestPortals(t *testing.T) {
	const h, ic, p = 4000.0, 1e8, 1e5
	tests := []struct {
		name          string
		ib            float64
		fixed, braced bool
		k             float64
		tol           float64
	}{
		// Rigid beam (Ib = 10⁴ Ic). source: standards-notes §5 (Timoshenko & Gere §2.8, frames).
		{"rigid beam, sway, fixed bases", 1e4 * ic, true, false, 1, 1e-3},
		{"rigid beam, sway, pinned bases", 1e4 * ic, false, false, 2, 1e-3},
		{"rigid beam, braced, fixed bases", 1e4 * ic, true, true, 0.5, 1e-3},
		{"rigid beam, braced, pinned bases", 1e4 * ic, false, true, 0.6992, 1e-3},
		// Flexible beam Ib = Ic, b = h (R = 1). source: standards-notes §5 [D], Timoshenko & Gere:
		// (kh)tan(kh) = 6R → K = 2.328 pinned; (kh)cot(kh) = −6R → K = 1.1565 fixed.
		{"R=1, sway, pinned bases", ic, false, false, 2.328, 2e-3},
		{"R=1, sway, fixed bases", ic, true, false, 1.1565, 2e-3},
		// source: standards-notes §5 [D]: symmetric (braced) mode, R = 1: pinned 0.8749, fixed 0.6260.
		{"R=1, braced, pinned bases", ic, false, true, 0.8749, 2e-3},
		{"R=1, braced, fixed bases", ic, true, true, 0.6260, 2e-3},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			m := portal(h, h, ic, tt.ib, p, tt.fixed, tt.braced, 8)
			r := analyze(t, m, Options{})
			b := r.Combinations[0]
			if b.Status != Buckles {
				t.Fatalf("status %v", b.Status)
			}
			// K from λ: π²EI/(K h)² = λ P.
			k := math.Pi * math.Sqrt(testE*ic/(b.Lambda*p)) / h
			if relErr(k, tt.k) > tt.tol {
				t.Errorf("K = %.5f (λ = %.5g); want %.4f", k, b.Lambda, tt.k)
			}
			for _, c := range []int{0, 2} {
				if relErr(b.Ke[c][0], k) > 1e-12 || !math.IsNaN(b.Ke[c][1]) {
					t.Errorf("member %d: Ke = %v; want [%.5f NaN] (plane model: in-plane axis only)", c, b.Ke[c], k)
				}
			}
			if !math.IsNaN(b.Ke[1][0]) {
				t.Errorf("beam Ke = %v; want NaN (no compression)", b.Ke[1])
			}
			// The columns do all the work, equal shares unless the two
			// braced columns under a rigid beam buckle independently
			// (a double eigenvalue: any mix of the two is a mode).
			md := b.Modes[0]
			if math.Abs(md.Share[0]+md.Share[2]-1) > 1e-9 || md.Share[1] != 0 {
				t.Errorf("shares %v; want the columns' to sum to 1", md.Share)
			}
			if (!tt.braced || tt.ib == ic) && (math.Abs(md.Share[0]-0.5) > 1e-6 || math.Abs(md.Share[2]-0.5) > 1e-6) {
				t.Errorf("shares %v; want [0.5 0 0.5]", md.Share)
			}
		})
	}
}

// TestPlaneEqualsSpace solves the R = 1 portals as plane models and as 3D
// models whose out-of-plane stiffness is much larger: the lowest load
// factors must agree.
func TestPlaneEqualsSpace(t *testing.T) {
	const h, ic, p = 4000.0, 1e8, 1e5
	for _, fixed := range []bool{true, false} {
		plane := portal(h, h, ic, ic, p, fixed, false, 4)
		space := portal(h, h, ic, ic, p, fixed, false, 4)
		space.Plane = nil
		for i := range space.Members {
			mb := &space.Members[i]
			mb.Iz, mb.G, mb.J = 1e3*ic, testG, 1e3*ic
			mb.Axis = Vec3{0, -1, 0} // local z normal to the frame: in-plane bending about local z
			mb.Iy, mb.Iz = 1e3*ic, ic
		}
		for _, nd := range []int{0, 3} {
			space.Nodes[nd].Support.Fixed = [6]bool{true, true, true, true, true, true}
			if !fixed {
				space.Nodes[nd].Support.Fixed = [6]bool{true, true, true, true, false, true} // free to rotate about Y only
			}
		}
		rp := analyze(t, plane, Options{})
		rs := analyze(t, space, Options{})
		// source: derived here [D]: a plane frame's in-plane modes are modes of the 3D model.
		if relErr(rs.Lambda, rp.Lambda) > 1e-7 {
			t.Errorf("fixed=%v: 3D λ = %.10g, plane λ = %.10g", fixed, rs.Lambda, rp.Lambda)
		}
		if rp.Stats.DOF >= rs.Stats.DOF {
			t.Errorf("plane model has %d unknowns, 3D %d: want fewer", rp.Stats.DOF, rs.Stats.DOF)
		}
		// The 3D mode sways in X like the plane one, with no out-of-plane part.
		for i, u := range rs.Combinations[0].Modes[0].Nodes {
			up := rp.Combinations[0].Modes[0].Nodes[i]
			if math.Abs(u[1]) > 1e-9 || u.sub(up).norm() > 1e-5 {
				t.Errorf("node %d: 3D mode %v, plane mode %v", i, u, up)
			}
		}
	}
}

// TestRotationalSprings checks supports and member-end springs against
// closed forms.
func TestRotationalSprings(t *testing.T) {
	const l, i, p = 5000.0, 1e7, 1e5
	ei := testE * i
	t.Run("cantilever on a rotational spring", func(t *testing.T) {
		// μL·tan(μL) = C·L/EI, μ² = P/EI. source: derived here [D] (equilibrium of the
		// deflected cantilever; the form is in Timoshenko & Gere Ch. 2, from memory).
		c := ei / l // C·L/EI = 1
		m := strut(l, i, p, [6]bool{true, true, true, true, false, true}, [6]bool{}, 8)
		m.Nodes[0].Support.Stiffness[4] = c // rotation about global Y: bending towards X
		m.Members[0].Iz = 1e3 * i           // keep the other plane out of the way
		mu := bisect(func(x float64) float64 { return x*math.Tan(x) - c*l/ei }, 1e-6, math.Pi/2-1e-9)
		want := mu * mu * ei / (l * l) / p
		r := analyze(t, m, Options{})
		if got := r.Lambda; relErr(got, want) > 1e-3 {
			t.Errorf("λ = %.6g; want %.6g", got, want)
		}
	})
	t.Run("braced strut with end springs", func(t *testing.T) {
		// Member-end rotational springs C = 2EI/L at both ends are a braced
		// column with G = (EI/L)/(C/2) = 1 at each end: K = 0.7743.
		// source: standards-notes §5 [D] alignment-chart solved values (G 1, 1 → 0.7743).
		m := strut(l, i, p, allFixed, slideZ, 8)
		m.Plane = &xz
		for e := 0; e < 2; e++ {
			m.Members[0].Ends[e].Released[4] = true
			m.Members[0].Ends[e].Stiffness[4] = 2 * ei / l
		}
		r := analyze(t, m, Options{})
		if k := r.Combinations[0].Ke[0][0]; relErr(k, 0.7743) > 1e-3 {
			t.Errorf("K = %.5f; want 0.7743", k)
		}
	})
	t.Run("hinged ends", func(t *testing.T) {
		// Free hinges at both ends of a strut between fixed nodes: pinned–pinned, K = 1.
		// source: standards-notes §5, Euler strut.
		m := strut(l, i, p, allFixed, slideZ, 8)
		for e := 0; e < 2; e++ {
			m.Members[0].Ends[e].Released[4] = true
			m.Members[0].Ends[e].Released[5] = true
		}
		r := analyze(t, m, Options{})
		if k := r.Combinations[0].Ke[0][0]; relErr(k, 1) > 1e-3 {
			t.Errorf("K = %.5f; want 1", k)
		}
	})
}

// TestEndOffset models a cantilever whose member starts at a rigid stub
// above its fixed node: the flexible length is what buckles.
func TestEndOffset(t *testing.T) {
	const l, stub, i, p = 4000.0, 600.0, 1e7, 1e5
	m := strut(l+stub, i, p, allFixed, [6]bool{}, 8)
	m.Members[0].Ends[0].Offset = Vec3{0, 0, stub}
	r := analyze(t, m, Options{})
	// source: standards-notes §5: cantilever π²EI/(4L²) over the flexible length L.
	want := math.Pi * math.Pi * testE * i / (4 * l * l) / p
	if relErr(r.Lambda, want) > 1e-3 {
		t.Errorf("λ = %.6g; want %.6g", r.Lambda, want)
	}
}

// TestRotatedSupport gives the top of a pin-ended strut its support in
// condition axes rotated 30° about Z: restraining x′ and y′ is the same as
// restraining X and Y.
func TestRotatedSupport(t *testing.T) {
	const l, i, p = 5000.0, 1e7, 1e5
	ref := analyze(t, strut(l, i, p, pinNoTwist, rollerZ, 4), Options{})
	m := strut(l, i, p, pinNoTwist, rollerZ, 4)
	s, c := math.Sincos(math.Pi / 6)
	m.Nodes[1].Support.Axes = &Axes{Z: Vec3{0, 0, 1}, X: Vec3{c, s, 0}}
	r := analyze(t, m, Options{})
	// source: derived here [D]: the same physical restraint.
	if relErr(r.Lambda, ref.Lambda) > 1e-9 {
		t.Errorf("rotated axes λ = %.10g; global axes %.10g", r.Lambda, ref.Lambda)
	}
	// A support restraining only x′ leaves the strut free to sway along
	// y′: a mechanism.
	m.Nodes[1].Support.Fixed = [6]bool{true, false, false, false, false, true}
	if _, err := Analyze(m, Options{}); !isMechanism(err) {
		t.Errorf("roller in x′ only: err = %v; want a mechanism", err)
	}
}
