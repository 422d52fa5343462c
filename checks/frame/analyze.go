package frame

import (
	"math"
	"strconv"
)

// Analyze computes the elastic buckling load factors of every combination
// of m: it subdivides the members, assembles and factors the elastic
// stiffness once, and for each combination solves K·φ = λ·G·φ, where G is
// the geometric stiffness of the combination's axial forces, for the lowest
// positive λ and a few more modes.
//
// Errors: *InputError for an invalid model, *MechanismError when the
// elastic stiffness is singular, ErrNoConvergence (wrapped with the
// combination) if the iteration fails. A combination without compression is
// not an error: its Status is NoCompression.
//
// m is read, not kept or modified.
func Analyze(m *Model, opt Options) (*Result, error) {
	o := opt.withDefaults()
	ms, err := buildMesh(m, o)
	if err != nil {
		return nil, err
	}
	res := &Result{Governing: -1, Lambda: math.Inf(1), Limitations: limitations(ms.plane, o.Torsion)}
	if ms.nAuto > 0 {
		note := strconv.Itoa(ms.nAuto) + " degrees of freedom without any stiffness were restrained: "
		for i, s := range ms.restraint {
			if i > 0 {
				note += "; "
			}
			note += s
		}
		if ms.moreAuto {
			note += "; …"
		}
		res.Notes = append(res.Notes, note)
	}
	sys := newSystem(ms, o)
	res.Stats = Stats{
		Points:   len(ms.points),
		Elements: len(ms.elems),
		DOF:      sys.n,
		Ordering: sys.ordering.String(),
		FactorNZ: sys.sy.nnz,
		Flops:    sys.sy.flops,
	}
	method := o.Eigen
	if method == EigenAuto {
		method = EigenLanczos
		if sys.n <= DenseLimit {
			method = EigenDense
		}
	}
	res.Stats.Eigen = method.String()

	var f *factor
	if sys.n > 0 {
		sys.assembleK(m)
		var perr *pivotError
		f, perr = sys.sy.factorize(&sys.pattern)
		if perr != nil {
			return nil, sys.mechanism(m, perr)
		}
	}

	res.Combinations = make([]Buckling, len(m.Combinations))
	for ci := range m.Combinations {
		b, err := sys.buckle(m, ci, f, method, o)
		if err != nil {
			return nil, err
		}
		res.Combinations[ci] = b
		if b.Lambda < res.Lambda {
			res.Lambda, res.Governing = b.Lambda, ci
		}
	}
	return res, nil
}

// limitations lists what a 12-degree-of-freedom beam-column model with
// axial-force geometric stiffness cannot find.
func limitations(plane, torsion bool) []string {
	l := []string{
		"warping torsion of open sections: no warping degree of freedom, so torsional and flexural-torsional buckling of open sections are not represented",
		"lateral-torsional buckling: bending moments do not enter the geometric stiffness (axial forces only)",
		"flexural-torsional coupling of monosymmetric and asymmetric sections: the shear centre is taken at the centroid",
		"shear deformation (Euler-Bernoulli elements)",
		"local and distortional buckling of the section's plates",
		"axial force varying along a member: one force per member",
		"rigid end offsets carry no geometric stiffness",
	}
	if !torsion {
		l = append(l, "pure torsional buckling: the Wagner term of the geometric stiffness is off (Options.Torsion)")
	}
	if plane {
		l = append(l, "out-of-plane buckling: plane model")
	}
	return l
}

// buckle solves combination ci.
func (sys *system) buckle(m *Model, ci int, f *factor, method Eigen, o Options) (Buckling, error) {
	c := &m.Combinations[ci]
	b := Buckling{Combination: c.Name, Lambda: math.Inf(1)}
	compressed := false
	for _, p := range c.Compression {
		if p > 0 {
			compressed = true
		}
	}
	if !compressed {
		b.Status = NoCompression
		b.Ke = memberKe(m, c.Compression, b.Lambda, sys.ms)
		return b, nil
	}
	b.Status = NoPositive
	b.NegativeLambda = math.Inf(-1)
	if sys.n == 0 {
		b.Ke = memberKe(m, c.Compression, b.Lambda, sys.ms)
		return b, nil
	}
	sys.assembleG(m, c.Compression, o.Torsion)
	op := newOperator(sys, f)
	solve := func(nev int) (eigenpairs, error) {
		if method == EigenDense {
			return denseTop(op, sys.n, nev)
		}
		return lanczos(op, sys.n, nev, o.Tol)
	}
	ep, err := solve(o.Modes)
	b.Steps += ep.steps
	if err != nil {
		return b, wrapCombination(ci, c.Name, err)
	}
	thr := 1e-12 * ep.scale
	for i, th := range ep.theta {
		if !(th > thr) {
			break
		}
		phi := ep.x[i]
		f.solveLT(phi, op.tmp)
		b.Modes = append(b.Modes, sys.mode(m, c.Compression, 1/th, phi, o.Torsion))
	}
	if len(b.Modes) > 0 {
		b.Status = Buckles
		b.Lambda = b.Modes[0].Lambda
		b.NegativeLambda = 0
	} else {
		// No positive load factor: look at the other end of the spectrum.
		op.neg = true
		ep, err := solve(1)
		b.Steps += ep.steps
		if err != nil {
			return b, wrapCombination(ci, c.Name, err)
		}
		if len(ep.theta) > 0 && ep.theta[0] > thr {
			b.NegativeLambda = -1 / ep.theta[0]
		}
	}
	b.Ke = memberKe(m, c.Compression, b.Lambda, sys.ms)
	return b, nil
}

type combinationError struct {
	index int
	name  string
	err   error
}

func (e *combinationError) Error() string {
	return "frame: " + where("combination", e.index, e.name) + ": " + e.err.Error()
}

func (e *combinationError) Unwrap() error { return e.err }

func wrapCombination(i int, name string, err error) error {
	return &combinationError{index: i, name: name, err: err}
}

// mode builds a Mode from φ (in equations).
func (sys *system) mode(m *Model, p []float64, lambda float64, phi []float64, torsion bool) Mode {
	ms := sys.ms
	md := Mode{Lambda: lambda, Nodes: make([]Vec3, len(m.Nodes)), Interior: make([][]Vec3, len(m.Members))}
	trans := func(pt int) Vec3 {
		var u Vec3
		fr := &ms.points[pt].frame
		for d := 0; d < 3; d++ {
			if eq := sys.slotEq[6*pt+d]; eq >= 0 {
				u = u.add(fr[d].scale(phi[eq]))
			}
		}
		return u
	}
	var big Vec3
	bigN := -1.0
	consider := func(u Vec3) {
		if n := u.norm(); n > bigN {
			big, bigN = u, n
		}
	}
	for i := range m.Nodes {
		md.Nodes[i] = trans(i)
		consider(md.Nodes[i])
	}
	for i, ip := range ms.interior {
		if ip == nil {
			continue
		}
		md.Interior[i] = make([]Vec3, len(ip))
		for k, pt := range ip {
			md.Interior[i][k] = trans(int(pt))
			consider(md.Interior[i][k])
		}
	}
	// Scale: largest translation 1, its largest component positive.
	s := 1.0
	if bigN > 0 {
		s = 1 / bigN
		lc := 0
		for k := 1; k < 3; k++ {
			if math.Abs(big[k]) > math.Abs(big[lc]) {
				lc = k
			}
		}
		if big[lc] < 0 {
			s = -s
		}
	}
	for i := range md.Nodes {
		md.Nodes[i] = md.Nodes[i].scale(s)
	}
	for _, in := range md.Interior {
		for k := range in {
			in[k] = in[k].scale(s)
		}
	}

	// Shares of the second-order work.
	md.Share = make([]float64, len(m.Members))
	var total float64
	var loc [12]float64
	for _, e := range ms.elems {
		n := p[e.member]
		if n == 0 {
			continue
		}
		for i := range loc {
			loc[i] = 0
		}
		for j := int32(0); j < e.m; j++ {
			eq := sys.slotEq[ms.slots[e.off+j]]
			if eq < 0 {
				continue
			}
			col := ms.coef[12*(e.off+j) : 12*(e.off+j+1)]
			for i, c := range col {
				loc[i] += c * phi[eq]
			}
		}
		g := geometricLocal(&m.Members[e.member], e.length, torsion)
		var q float64
		for i := 0; i < 12; i++ {
			var r float64
			for k := 0; k < 12; k++ {
				r += g[12*i+k] * loc[k]
			}
			q += loc[i] * r
		}
		md.Share[e.member] += n * q
		total += n * q
	}
	if total != 0 {
		for i := range md.Share {
			md.Share[i] /= total
		}
	}
	return md
}

// memberKe returns the effective length factors implied by λ for every
// member.
func memberKe(m *Model, p []float64, lambda float64, ms *mesh) [][2]float64 {
	ke := make([][2]float64, len(m.Members))
	for i := range m.Members {
		mb := &m.Members[i]
		l := m.Nodes[mb.Nodes[1]].Pos.sub(m.Nodes[mb.Nodes[0]].Pos).norm()
		ke[i] = [2]float64{
			EffectiveLengthFactor(mb.E, mb.Iy, l, p[i], lambda),
			EffectiveLengthFactor(mb.E, mb.Iz, l, p[i], lambda),
		}
		if ms.plane {
			pa := m.Nodes[mb.Nodes[0]].Pos.add(mb.Ends[0].Offset)
			pb := m.Nodes[mb.Nodes[1]].Pos.add(mb.Ends[1].Offset)
			fr, _, _ := memberFrame(pa, pb, ms.memberAxis(mb, pa, pb))
			if ms.localInPlane(&fr)[4] {
				ke[i][1] = math.NaN()
			} else {
				ke[i][0] = math.NaN()
			}
		}
	}
	return ke
}

// EffectiveLengthFactor returns the effective length factor of a member of
// modulus e (MPa), second moment i (mm⁴) and length l (mm) that buckles
// with the frame at load factor lambda under compression nStar (N):
//
//	ke = π·sqrt(E·I/(λ·N*))/L
//
// so that π²EI/(ke·L)² = λ·N*. It is NaN when nStar ≤ 0 or lambda is not
// positive and finite. For members far from critical the value is large
// and means only that the member is not what buckles.
func EffectiveLengthFactor(e, i, l, nStar, lambda float64) float64 {
	if !(nStar > 0) || !(lambda > 0) || math.IsInf(lambda, 1) || !(l > 0) {
		return math.NaN()
	}
	return math.Pi * math.Sqrt(e*i/(lambda*nStar)) / l
}

// mechanism maps a failed pivot to a MechanismError.
func (sys *system) mechanism(m *Model, pe *pivotError) error {
	ms := sys.ms
	sl := int(sys.eqSlot[pe.dof])
	np := len(ms.points)
	me := &MechanismError{Ratio: pe.ratio}
	if sl >= 6*np {
		ps := ms.pseudo[sl-6*np]
		me.Item, me.Index, me.ID = "member", int(ps.member), m.Members[ps.member].ID
		me.Release = "start"
		if ps.end == 1 {
			me.Release = "end"
		}
		me.DOF, me.Axes = int(ps.dof), "member"
		return me
	}
	pt := &ms.points[sl/6]
	me.DOF, me.Axes = sl%6, pt.axes
	if pt.node >= 0 {
		me.Item, me.Index, me.ID = "node", int(pt.node), m.Nodes[pt.node].ID
	} else {
		me.Item, me.Index, me.ID, me.Point = "member", int(pt.member), m.Members[pt.member].ID, int(pt.k)
	}
	return me
}
