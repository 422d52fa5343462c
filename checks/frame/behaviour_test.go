package frame

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
)

func TestMechanism(t *testing.T) {
	const h, ic, p = 4000.0, 1e8, 1e5
	t.Run("pinned portal with a hinged beam", func(t *testing.T) {
		// Pinned bases and a beam hinged at both ends cannot resist sway.
		// source: standards-notes §5: the pinned–pinned sway case is a mechanism.
		m := portal(h, h, ic, ic, p, false, false, 4)
		m.Members[1].Ends[0].Released[4] = true
		m.Members[1].Ends[1].Released[4] = true
		_, err := Analyze(m, Options{})
		var me *MechanismError
		if !errors.As(err, &me) {
			t.Fatalf("err = %v; want *MechanismError", err)
		}
		if !strings.Contains(err.Error(), "mechanism at") || !strings.Contains(err.Error(), "has no stiffness") {
			t.Errorf("message %q", err)
		}
	})
	t.Run("strut free to twist", func(t *testing.T) {
		// Nothing restrains rotation about the strut's own axis (global Z).
		// source: common practice (a rigid-body twist is a mechanism).
		free := pinNoTwist
		free[5] = false
		roller := rollerZ
		roller[5] = false
		_, err := Analyze(strut(5000, 1e7, p, free, roller, 4), Options{})
		var me *MechanismError
		if !errors.As(err, &me) {
			t.Fatalf("err = %v; want *MechanismError", err)
		}
		if me.DOF != 5 || me.Axes != "global" {
			t.Errorf("mechanism at %s %d point %d DOF %s (%s axes); want rz in global axes", me.Item, me.Index, me.Point, dofName(me.DOF), me.Axes)
		}
	})
	t.Run("all-pinned node rotation is restrained, not a mechanism", func(t *testing.T) {
		// A strut hinged at both ends to nodes that only it reaches: the node
		// rotations have no stiffness at all and are restrained with a note.
		m := strut(5000, 1e7, p, pinNoTwist, rollerZ, 4)
		for e := 0; e < 2; e++ {
			m.Members[0].Ends[e].Released[4] = true
			m.Members[0].Ends[e].Released[5] = true
		}
		r := analyze(t, m, Options{})
		if len(r.Notes) != 1 || !strings.Contains(r.Notes[0], `node 0 ("base") rx ry`) {
			t.Errorf("notes %q", r.Notes)
		}
		// source: standards-notes §5, Euler strut K = 1.
		if k := r.Combinations[0].Ke[0][0]; relErr(k, 1) > 1e-3 {
			t.Errorf("K = %.5f; want 1", k)
		}
	})
}

func TestNoBuckling(t *testing.T) {
	const l, i = 5000.0, 1e7
	t.Run("tension only", func(t *testing.T) {
		m := strut(l, i, -1e5, pinNoTwist, rollerZ, 4)
		m.Combinations = append(m.Combinations, Combination{Name: "none", Compression: []float64{0}})
		r := analyze(t, m, Options{})
		for _, b := range r.Combinations {
			if b.Status != NoCompression || !math.IsInf(b.Lambda, 1) || len(b.Modes) != 0 {
				t.Errorf("%s: status %v λ %g modes %d; want no-compression, +Inf, none", b.Combination, b.Status, b.Lambda, len(b.Modes))
			}
			if len(b.Ke) != 1 || !math.IsNaN(b.Ke[0][0]) || !math.IsNaN(b.Ke[0][1]) {
				t.Errorf("%s: Ke %v; want NaN for the one member", b.Combination, b.Ke)
			}
		}
		if r.Governing != -1 || !math.IsInf(r.Lambda, 1) {
			t.Errorf("governing %d λ %g; want -1, +Inf", r.Governing, r.Lambda)
		}
	})
	t.Run("everything restrained", func(t *testing.T) {
		r := analyze(t, strut(l, i, 1e5, allFixed, allFixed, 1), Options{})
		b := r.Combinations[0]
		if r.Stats.DOF != 0 || b.Status != NoPositive || !math.IsInf(b.Lambda, 1) || len(b.Ke) != 1 {
			t.Errorf("DOF %d status %v λ %g Ke %v; want 0 unknowns, no-positive-buckling, +Inf", r.Stats.DOF, b.Status, b.Lambda, b.Ke)
		}
	})
	t.Run("compression held by supports, tension cantilever", func(t *testing.T) {
		// A strut in compression whose both nodes are fully fixed (one element,
		// no free unknowns) and a cantilever in tension T: only the reversed
		// loads buckle the frame, at the cantilever's load π²EI/(4L²)/T.
		// source: standards-notes §5, cantilever K = 2.
		const tension = 2e5
		m := &Model{
			Nodes: []Node{
				{ID: "a", Pos: Vec3{0, 0, 0}, Support: &Support{Fixed: allFixed}},
				{ID: "b", Pos: Vec3{0, 0, l}, Support: &Support{Fixed: allFixed}},
				{ID: "tip", Pos: Vec3{0, 0, 2 * l}},
			},
			Members: []Member{
				{ID: "held", Nodes: [2]int{0, 1}, E: testE, G: testG, A: 5000, Iy: i, Iz: i, J: 1e5, Elements: 1},
				{ID: "tie", Nodes: [2]int{1, 2}, E: testE, G: testG, A: 5000, Iy: i, Iz: 3 * i, J: 1e5, Elements: 8},
			},
			Combinations: []Combination{{Name: "C", Compression: []float64{1e6, -tension}}},
		}
		for _, eig := range []Eigen{EigenDense, EigenLanczos} {
			r := analyze(t, m, Options{Eigen: eig})
			b := r.Combinations[0]
			want := -math.Pi * math.Pi * testE * i / (4 * l * l) / tension
			if b.Status != NoPositive || !math.IsInf(b.Lambda, 1) || relErr(b.NegativeLambda, want) > 1e-3 {
				t.Errorf("%v: status %v λ %g negative λ %.6g; want no-positive-buckling, +Inf, %.6g", eig, b.Status, b.Lambda, b.NegativeLambda, want)
			}
		}
	})
}

// TestLoadScaling: λ scales as the inverse of a load factor applied to all
// axial forces. source: derived here [D] (K·φ = λ·(s·G)·φ has λ/s).
func TestLoadScaling(t *testing.T) {
	rnd := rand.New(rand.NewPCG(7, 11))
	m := building(2, 1)
	base := m.Combinations[0].Compression
	var combos []Combination
	for trial := 0; trial < 3; trial++ {
		p := make([]float64, len(base))
		for i, v := range base {
			p[i] = v * (0.5 + rnd.Float64())
			if v == 0 {
				p[i] = 2e4 * (rnd.Float64() - 0.5) // small beam forces of either sign
			}
		}
		for _, s := range []float64{1, 2, 0.37} {
			q := make([]float64, len(p))
			for i, v := range p {
				q[i] = s * v
			}
			combos = append(combos, Combination{Name: "t", Compression: q})
		}
	}
	m.Combinations = combos
	for _, eig := range []Eigen{EigenDense, EigenLanczos} {
		r := analyze(t, m, Options{Eigen: eig})
		for trial := 0; trial < 3; trial++ {
			l1 := r.Combinations[3*trial].Lambda
			for k, s := range []float64{1, 2, 0.37} {
				got := r.Combinations[3*trial+k].Lambda
				if relErr(got, l1/s) > 1e-7 {
					t.Errorf("%v trial %d: λ(%g·N) = %.10g; want λ(N)/%g = %.10g", eig, trial, s, got, s, l1/s)
				}
			}
		}
	}
}

// TestSolversAgree compares the dense and Lanczos eigensolvers and the two
// orderings on a small building: the three lowest load factors must agree.
func TestSolversAgree(t *testing.T) {
	m := building(3, 2)
	ref := analyze(t, m, Options{Eigen: EigenDense, Ordering: OrderMinDegree})
	if ref.Stats.DOF > DenseLimit*2 {
		t.Fatalf("test model has %d unknowns", ref.Stats.DOF)
	}
	for _, o := range []Options{
		{Eigen: EigenLanczos, Ordering: OrderMinDegree},
		{Eigen: EigenLanczos, Ordering: OrderRCM},
		{Eigen: EigenDense, Ordering: OrderRCM},
		{Eigen: EigenLanczos, Modes: 6, Tol: 1e-10},
	} {
		r := analyze(t, m, o)
		a, b := ref.Combinations[0].Modes, r.Combinations[0].Modes
		if len(b) < 3 {
			t.Fatalf("%+v: %d modes", o, len(b))
		}
		for k := 0; k < 3; k++ {
			// source: derived here [D]: the same eigenproblem.
			if relErr(b[k].Lambda, a[k].Lambda) > 1e-6 {
				t.Errorf("%+v: mode %d λ = %.10g; dense %.10g", o, k, b[k].Lambda, a[k].Lambda)
			}
		}
		if relErr(r.Lambda, ref.Lambda) > 1e-9 {
			t.Errorf("%+v: λ = %.12g; dense %.12g", o, r.Lambda, ref.Lambda)
		}
	}
}

func TestModeShape(t *testing.T) {
	const h, ic, p = 4000.0, 1e8, 1e5
	r := analyze(t, portal(h, h, ic, ic, p, true, false, 4), Options{})
	md := r.Combinations[0].Modes[0]
	big := 0.0
	for _, u := range md.Nodes {
		big = math.Max(big, u.norm())
	}
	for _, in := range md.Interior {
		for _, u := range in {
			big = math.Max(big, u.norm())
		}
	}
	if math.Abs(big-1) > 1e-12 {
		t.Errorf("largest translation %g; want 1", big)
	}
	// Sway: both column tops move the same way along X, bases not at all.
	// source: standards-notes §5: the sway mode of a symmetric portal.
	if md.Nodes[1][0] < 0.98 || md.Nodes[2][0] < 0.98 || md.Nodes[0].norm() != 0 || md.Nodes[3].norm() != 0 {
		t.Errorf("mode %v", md.Nodes)
	}
	if len(md.Interior[0]) != 3 || md.Interior[1] == nil && r.Combinations[0].Modes == nil {
		t.Errorf("interior points %v", md.Interior)
	}
	top := md.TopMembers(2)
	if len(top) != 2 || top[0] == 1 || top[1] == 1 {
		t.Errorf("top members %v; want the columns", top)
	}
	st := Storeys(&Model{Nodes: portal(h, h, ic, ic, p, true, false, 4).Nodes, Members: portal(h, h, ic, ic, p, true, false, 4).Members}, &md, 1)
	if len(st) != 1 || math.Abs(st[0].Share-1) > 1e-9 || st[0].Bottom != 0 || st[0].Top != h || len(st[0].Members) != 2 {
		t.Fatalf("storeys %+v", st)
	}
	if want := math.Hypot(md.Nodes[1][0], md.Nodes[1][1]) / h; relErr(st[0].Drift, want) > 1e-12 {
		t.Errorf("drift %g; want %g (the tops' sway over the height)", st[0].Drift, want)
	}
}

func TestStoreysOfBuilding(t *testing.T) {
	// A 3-storey frame with the bottom storey's columns much weaker: the
	// bottom storey governs.
	m := building(3, 1)
	for i := range m.Members {
		mb := &m.Members[i]
		if m.Nodes[mb.Nodes[1]].Pos[2] == 3600 && m.Nodes[mb.Nodes[0]].Pos[2] == 0 {
			mb.Iy, mb.Iz = mb.Iy/8, mb.Iz/8
		}
	}
	r := analyze(t, m, Options{})
	st := Storeys(m, &r.Combinations[0].Modes[0], 1)
	if len(st) != 3 {
		t.Fatalf("%d storeys", len(st))
	}
	// source: common practice (the soft storey governs the sway mode).
	if !(st[0].Share > st[1].Share && st[0].Share > st[2].Share && st[0].Drift > st[1].Drift) {
		t.Errorf("storeys %+v: want the first to govern", st)
	}
	sum := st[0].Share + st[1].Share + st[2].Share
	if math.Abs(sum-1) > 1e-9 {
		t.Errorf("shares sum to %g", sum)
	}
}

func TestInputErrors(t *testing.T) {
	good := func() *Model { return strut(5000, 1e7, 1e5, pinNoTwist, rollerZ, 4) }
	tests := []struct {
		name   string
		change func(m *Model)
		item   string
		index  int
	}{
		{"node index", func(m *Model) { m.Members[0].Nodes[1] = 7 }, "member", 0},
		{"same node", func(m *Model) { m.Members[0].Nodes[1] = 0 }, "member", 0},
		{"zero E", func(m *Model) { m.Members[0].E = 0 }, "member", 0},
		{"zero J in 3D", func(m *Model) { m.Members[0].J = 0 }, "member", 0},
		{"axis along member", func(m *Model) { m.Members[0].Axis = Vec3{0, 0, 2} }, "member", 0},
		{"forces count", func(m *Model) { m.Combinations[0].Compression = nil }, "combination", 0},
		{"force NaN", func(m *Model) { m.Combinations[0].Compression[0] = math.NaN() }, "combination", 0},
		{"negative spring", func(m *Model) { m.Nodes[1].Support.Stiffness[0] = -1 }, "node", 1},
		{"position", func(m *Model) { m.Nodes[1].Pos[0] = math.Inf(1) }, "node", 1},
		{"out of plane", func(m *Model) { m.Plane = &xz; m.Nodes[1].Pos[1] = 10 }, "node", 1},
		{"member axes skew to the plane", func(m *Model) { m.Plane = &xz; m.Members[0].Axis = Vec3{1, 1, 0} }, "member", 0},
		{"no nodes", func(m *Model) { m.Nodes = nil }, "model", -1},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			m := good()
			tt.change(m)
			_, err := Analyze(m, Options{})
			var ie *InputError
			if !errors.As(err, &ie) || ie.Item != tt.item || ie.Index != tt.index {
				t.Fatalf("err = %v; want *InputError on %s %d", err, tt.item, tt.index)
			}
			if !strings.HasPrefix(err.Error(), "frame: ") {
				t.Errorf("message %q", err)
			}
		})
	}
}

func TestLimitations(t *testing.T) {
	r := analyze(t, strut(5000, 1e7, 1e5, pinNoTwist, rollerZ, 4), Options{})
	joined := strings.Join(r.Limitations, "\n")
	// source: design issue 8: say which modes a 12-DOF element cannot represent (warping torsion of open sections).
	for _, want := range []string{"warping torsion", "lateral-torsional", "Wagner"} {
		if !strings.Contains(joined, want) {
			t.Errorf("limitations lack %q:\n%s", want, joined)
		}
	}
	r = analyze(t, strut(5000, 1e7, 1e5, pinNoTwist, rollerZ, 4), Options{Torsion: true})
	if strings.Contains(strings.Join(r.Limitations, "\n"), "Wagner") {
		t.Error("with Options.Torsion the Wagner limitation should go")
	}
}

// TestTorsion: with the Wagner term a short cruciform-like section (tiny J)
// buckles in twist at P = G·J·A/Ip. source: Timoshenko & Gere Ch. 5
// (from memory): pure torsional buckling without warping, P = G·J/r0², r0² = Ip/A.
func TestTorsion(t *testing.T) {
	const l, i, a, j = 3000.0, 1e7, 5000.0, 1e3
	m := strut(l, i, 1e5, pinNoTwist, rollerZ, 8)
	m.Members[0].A, m.Members[0].J = a, j
	r := analyze(t, m, Options{Torsion: true})
	want := testG * j * a / (i + 3*i) / 1e5
	if relErr(r.Lambda, want) > 1e-6 {
		t.Errorf("λ = %.8g; want %.8g", r.Lambda, want)
	}
	// Without it, flexure governs. source: standards-notes §5, Euler strut.
	r = analyze(t, m, Options{})
	if want := math.Pi * math.Pi * testE * i / (l * l) / 1e5; relErr(r.Lambda, want) > 1e-3 {
		t.Errorf("λ = %.6g; want %.6g", r.Lambda, want)
	}
}

func TestEffectiveLengthFactor(t *testing.T) {
	const e, i, l = testE, 1e8, 4000.0
	// π²EI/(ke·L)² = λ·N*. source: standards-notes §1.2 [C], AS 4100 4.6.2 Nom = π²EI/(ke·l)².
	for _, tt := range []struct{ n, lambda float64 }{{1e5, 12.3}, {2.5e6, 1.7}} {
		ke := EffectiveLengthFactor(e, i, l, tt.n, tt.lambda)
		nom := math.Pi * math.Pi * e * i / (ke * l * ke * l)
		if relErr(nom, tt.lambda*tt.n) > 1e-12 {
			t.Errorf("N* %g λ %g: ke %g gives Nom %g; want %g", tt.n, tt.lambda, ke, nom, tt.lambda*tt.n)
		}
	}
	for _, tt := range []struct{ n, lambda float64 }{{0, 2}, {-1e5, 2}, {1e5, math.Inf(1)}, {1e5, -3}, {1e5, math.NaN()}} {
		if ke := EffectiveLengthFactor(e, i, l, tt.n, tt.lambda); !math.IsNaN(ke) {
			t.Errorf("N* %g λ %g: ke %g; want NaN", tt.n, tt.lambda, ke)
		}
	}
}
