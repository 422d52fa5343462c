package frame

import "sort"

// system numbers the free slots of a mesh into equations in a
// fill-reducing order and assembles the sparse elastic and geometric
// stiffness matrices.
type system struct {
	ms     *mesh
	sy     *symbolic
	n      int     // equations
	slotEq []int32 // slot → equation, -1 if not free
	eqSlot []int32 // equation → slot

	pattern  csr       // shared structure; values of K
	gval     []float64 // values of the geometric matrix, same structure
	elemPos  []int32   // per element: m×m positions in the values (-1: not free)
	posOff   []int     // element e: elemPos[posOff[e]:posOff[e+1]]
	ordering Ordering
}

// newSystem builds the vertex graph of the mesh's free slots, orders it,
// and lays out the matrices.
func newSystem(ms *mesh, o Options) *system {
	// Vertices: groups with at least one free slot.
	vOfGroup := make([]int32, ms.nGroups)
	for i := range vOfGroup {
		vOfGroup[i] = -1
	}
	var w []int32
	for sl, st := range ms.state {
		if st != slotFree {
			continue
		}
		gr := ms.group[sl]
		if vOfGroup[gr] < 0 {
			vOfGroup[gr] = int32(len(w))
			w = append(w, 0)
		}
		w[vOfGroup[gr]]++
	}
	nv := len(w)

	// Adjacency from the elements and springs.
	lists := make([][]int32, nv)
	var vs []int32
	link := func(slots []int32) {
		vs = vs[:0]
		for _, sl := range slots {
			if ms.state[sl] != slotFree {
				continue
			}
			v := vOfGroup[ms.group[sl]]
			dup := false
			for _, u := range vs {
				if u == v {
					dup = true
					break
				}
			}
			if !dup {
				vs = append(vs, v)
			}
		}
		for _, a := range vs {
			for _, b := range vs {
				if a != b {
					lists[a] = append(lists[a], b)
				}
			}
		}
	}
	for _, e := range ms.elems {
		link(ms.slots[e.off : e.off+e.m])
	}
	for _, s := range ms.springs {
		link(ms.springSlots[s.off : s.off+s.m])
	}
	g := &graph{xadj: make([]int32, nv+1), w: w}
	for v := range lists {
		l := lists[v]
		sortInt32(l)
		k := 0
		for i, u := range l {
			if i == 0 || u != l[k-1] {
				l[k] = u
				k++
			}
		}
		g.adj = append(g.adj, l[:k]...)
		g.xadj[v+1] = int32(len(g.adj))
		lists[v] = nil
	}

	// Ordering.
	sys := &system{ms: ms}
	switch o.Ordering {
	case OrderRCM:
		sys.sy, sys.ordering = analyse(g, rcm(g)), OrderRCM
	case OrderMinDegree:
		sys.sy, sys.ordering = analyse(g, minDegree(g)), OrderMinDegree
	default:
		a := analyse(g, minDegree(g))
		sys.sy, sys.ordering = a, OrderMinDegree
		// A profile ordering fills most of its envelope, so the envelope
		// estimates its cost cheaply (within a factor of about two on
		// frames) and spares the full analysis when it cannot win.
		p := rcm(g)
		if envelopeFlops(g, p) < 2*a.flops {
			if b := analyse(g, p); b.flops < a.flops {
				sys.sy, sys.ordering = b, OrderRCM
			}
		}
	}
	sy := sys.sy
	sy.layout()

	// Equations: vertices in elimination order, slots in order within.
	pos := make([]int32, nv) // vertex → position in elimination order
	for i, v := range sy.perm {
		pos[v] = int32(i)
	}
	sys.n = int(sy.first[nv])
	sys.slotEq = make([]int32, len(ms.state))
	sys.eqSlot = make([]int32, sys.n)
	next := make([]int32, nv)
	copy(next, sy.first[:nv])
	for sl, st := range ms.state {
		sys.slotEq[sl] = -1
		if st != slotFree {
			continue
		}
		p := pos[vOfGroup[ms.group[sl]]]
		sys.slotEq[sl] = next[p]
		sys.eqSlot[next[p]] = int32(sl)
		next[p]++
	}

	// Matrix structure: row i holds the equations of its vertex and of the
	// vertex's neighbours, in order.
	pg := sy.g
	a := &sys.pattern
	a.n = sys.n
	a.rowPtr = make([]int, sys.n+1)
	for v := 0; v < nv; v++ {
		width := int(pg.w[v])
		for _, u := range pg.neighbours(int32(v)) {
			width += int(pg.w[u])
		}
		for e := sy.first[v]; e < sy.first[v+1]; e++ {
			a.rowPtr[e+1] = a.rowPtr[e] + width
		}
	}
	a.col = make([]int32, a.rowPtr[sys.n])
	for v := 0; v < nv; v++ {
		row := a.col[a.rowPtr[sy.first[v]]:a.rowPtr[sy.first[v]+1]]
		k := 0
		nb := pg.neighbours(int32(v))
		self := false
		emit := func(u int32) {
			for e := sy.first[u]; e < sy.first[u+1]; e++ {
				row[k] = e
				k++
			}
		}
		for _, u := range nb {
			if !self && u > int32(v) {
				emit(int32(v))
				self = true
			}
			emit(u)
		}
		if !self {
			emit(int32(v))
		}
		for e := sy.first[v] + 1; e < sy.first[v+1]; e++ {
			copy(a.col[a.rowPtr[e]:a.rowPtr[e+1]], row)
		}
	}
	a.val = make([]float64, len(a.col))
	sys.gval = make([]float64, len(a.col))

	// Positions of every element's entries.
	sys.posOff = make([]int, len(ms.elems)+1)
	for i, e := range ms.elems {
		sys.posOff[i+1] = sys.posOff[i] + int(e.m*e.m)
	}
	sys.elemPos = make([]int32, sys.posOff[len(ms.elems)])
	for i, e := range ms.elems {
		sys.positions(ms.slots[e.off:e.off+e.m], sys.elemPos[sys.posOff[i]:sys.posOff[i+1]])
	}
	return sys
}

// envelopeFlops estimates the multiply–adds of factoring g in the order
// perm if the envelope fills: for each vertex, its degrees of freedom
// times half the square of the degrees of freedom from its first
// neighbour in the order up to it.
func envelopeFlops(g *graph, perm []int32) float64 {
	n := g.n()
	pos := make([]int32, n)
	for i, v := range perm {
		pos[v] = int32(i)
	}
	first := make([]int64, n+1) // degrees of freedom before each position
	for i, v := range perm {
		first[i+1] = first[i] + int64(g.w[v])
	}
	var fl float64
	for i, v := range perm {
		lo := int32(i)
		for _, u := range g.neighbours(v) {
			lo = min(lo, pos[u])
		}
		w := float64(first[i] - first[lo])
		fl += float64(g.w[v]) * w * w / 2
	}
	return fl
}

// positions fills pos (m×m) with the value index of each pair of slots,
// -1 where either is not free.
func (sys *system) positions(slots []int32, pos []int32) {
	m := len(slots)
	a := &sys.pattern
	for i, si := range slots {
		ei := sys.slotEq[si]
		for j, sj := range slots {
			ej := sys.slotEq[sj]
			if ei < 0 || ej < 0 {
				pos[i*m+j] = -1
				continue
			}
			cols := a.col[a.rowPtr[ei]:a.rowPtr[ei+1]]
			k := sort.Search(len(cols), func(t int) bool { return cols[t] >= ej })
			pos[i*m+j] = int32(a.rowPtr[ei] + k)
		}
	}
}

// congruent returns Cᵀ·M·C for an element map C of m columns (column j is
// c[12j:12j+12]) into out (m×m); t is scratch of 12·m.
func congruent(mat *mat12, c []float64, m int, out, t []float64) {
	// t = M·C, column-major like C.
	for j := 0; j < m; j++ {
		cj := c[12*j : 12*j+12]
		tj := t[12*j : 12*j+12]
		for i := 0; i < 12; i++ {
			row := mat[12*i : 12*i+12]
			var s float64
			for k, v := range cj {
				if v != 0 {
					s += row[k] * v
				}
			}
			tj[i] = s
		}
	}
	for a := 0; a < m; a++ {
		ca := c[12*a : 12*a+12]
		for b := a; b < m; b++ {
			tb := t[12*b : 12*b+12]
			var s float64
			for i, v := range ca {
				if v != 0 {
					s += v * tb[i]
				}
			}
			out[a*m+b] = s
			out[b*m+a] = s
		}
	}
}

// assembleK assembles the elastic stiffness of every element and spring.
func (sys *system) assembleK(m *Model) {
	ms := sys.ms
	val := sys.pattern.val
	for i := range val {
		val[i] = 0
	}
	var out, t [24 * 24]float64
	for i, e := range ms.elems {
		mb := &m.Members[e.member]
		k := elasticLocal(mb, e.length)
		mm := int(e.m)
		congruent(&k, ms.coef[12*e.off:12*(e.off+e.m)], mm, out[:mm*mm], t[:12*mm])
		for q, p := range sys.elemPos[sys.posOff[i]:sys.posOff[i+1]] {
			if p >= 0 {
				val[p] += out[q]
			}
		}
	}
	var pos [64]int32
	for _, s := range ms.springs {
		slots := ms.springSlots[s.off : s.off+s.m]
		c := ms.springCoef[s.off : s.off+s.m]
		mm := len(slots)
		sys.positions(slots, pos[:mm*mm])
		for a := 0; a < mm; a++ {
			for b := 0; b < mm; b++ {
				if p := pos[a*mm+b]; p >= 0 {
					val[p] += s.k * c[a] * c[b]
				}
			}
		}
	}
}

// assembleG assembles the geometric matrix Σ P·G0 for the member axial
// forces p (compression positive) and reports whether any element is in
// compression.
func (sys *system) assembleG(m *Model, p []float64, torsion bool) bool {
	ms := sys.ms
	val := sys.gval
	for i := range val {
		val[i] = 0
	}
	var out, t [24 * 24]float64
	compressed := false
	for i, e := range ms.elems {
		n := p[e.member]
		if n == 0 {
			continue
		}
		if n > 0 {
			compressed = true
		}
		g := geometricLocal(&m.Members[e.member], e.length, torsion)
		mm := int(e.m)
		congruent(&g, ms.coef[12*e.off:12*(e.off+e.m)], mm, out[:mm*mm], t[:12*mm])
		for q, ps := range sys.elemPos[sys.posOff[i]:sys.posOff[i+1]] {
			if ps >= 0 {
				val[ps] += n * out[q]
			}
		}
	}
	return compressed
}

// gMulVec sets y = G·x.
func (sys *system) gMulVec(y, x []float64) {
	g := csr{n: sys.n, rowPtr: sys.pattern.rowPtr, col: sys.pattern.col, val: sys.gval}
	g.mulVec(y, x)
}
