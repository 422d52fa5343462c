package section

import "math"

// Thin-walled open sections (Vlasov): the section is modelled by the centre
// lines of its plates, each of constant thickness, meeting at nodes and
// forming a tree (no closed cells). Fillets and corner radii are ignored.

// twPlate is a straight centre-line plate from node i to node j.
type twPlate struct {
	i, j int
	t    float64
}

// thinWalled returns the torsion constant J = Σ b t³/3 and the warping
// constant Iw about the shear centre of a thin-walled open section.
func thinWalled(nodes []Point, plates []twPlate) (j, iw float64) {
	// lin integrates the product of two functions linear along a plate.
	lin := func(l, f0, f1, g0, g1 float64) float64 {
		return l * ((f0*g0+f1*g1)/3 + (f0*g1+f1*g0)/6)
	}
	length := make([]float64, len(plates))
	var a, sx, sy float64
	for k, p := range plates {
		n0, n1 := nodes[p.i], nodes[p.j]
		l := math.Hypot(n1.X-n0.X, n1.Y-n0.Y)
		length[k] = l
		a += l * p.t
		sx += l * p.t * (n0.Y + n1.Y) / 2
		sy += l * p.t * (n0.X + n1.X) / 2
		j += l * p.t * p.t * p.t / 3
	}
	xc, yc := sy/a, sx/a
	x := make([]float64, len(nodes))
	y := make([]float64, len(nodes))
	for i, n := range nodes {
		x[i], y[i] = n.X-xc, n.Y-yc
	}
	// Sectorial coordinate about the centroid, by walking the tree from
	// node 0: dω = x dy − y dx.
	adj := make([][]int, len(nodes))
	for k, p := range plates {
		adj[p.i] = append(adj[p.i], k)
		adj[p.j] = append(adj[p.j], k)
	}
	w := make([]float64, len(nodes))
	seen := make([]bool, len(nodes))
	seen[0] = true
	stack := []int{0}
	for len(stack) > 0 {
		i := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		for _, k := range adj[i] {
			o := plates[k].i
			if o == i {
				o = plates[k].j
			}
			if seen[o] {
				continue
			}
			seen[o] = true
			w[o] = w[i] + x[i]*y[o] - x[o]*y[i]
			stack = append(stack, o)
		}
	}
	var ixx, iyy, ixy, iwx, iwy float64
	for k, p := range plates {
		l, t := length[k], p.t
		ixx += t * lin(l, y[p.i], y[p.j], y[p.i], y[p.j])
		iyy += t * lin(l, x[p.i], x[p.j], x[p.i], x[p.j])
		ixy += t * lin(l, x[p.i], x[p.j], y[p.i], y[p.j])
		iwx += t * lin(l, w[p.i], w[p.j], x[p.i], x[p.j])
		iwy += t * lin(l, w[p.i], w[p.j], y[p.i], y[p.j])
	}
	// Shear centre (xs, ys) from ∫ω_s x dA = ∫ω_s y dA = 0 with
	// ω_s = ω − xs·y + ys·x.
	det := ixx*iyy - ixy*ixy
	xs := (iwy*iyy - iwx*ixy) / det
	ys := (iwy*ixy - iwx*ixx) / det
	var mean float64
	for k, p := range plates {
		w0 := w[p.i] - xs*y[p.i] + ys*x[p.i]
		w1 := w[p.j] - xs*y[p.j] + ys*x[p.j]
		mean += p.t * length[k] * (w0 + w1) / 2
	}
	mean /= a
	for k, p := range plates {
		w0 := w[p.i] - xs*y[p.i] + ys*x[p.i] - mean
		w1 := w[p.j] - xs*y[p.j] + ys*x[p.j] - mean
		iw += p.t * lin(length[k], w0, w1, w0, w1)
	}
	return j, iw
}
