package frame

import (
	"math"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
	"gonum.org/v1/gonum/floats"
)

// Sparse Cholesky factorisation K = L·Lᵀ by the multifrontal method
// (Duff & Reid 1983; Liu, "The multifrontal method for sparse matrix
// solution", SIAM Review 1992). The symbolic phase works on the graph of
// points (vertices of several degrees of freedom each), so every vertex
// is a dense block and fundamental supernodes are runs of vertices. Each
// supernode's frontal matrix is dense and is factored with LAPACK/BLAS
// kernels (potrf, trsm, syrk), which carry nearly all the work.

// csr is a symmetric matrix stored in full (both triangles) compressed
// rows, columns sorted within each row.
type csr struct {
	n      int
	rowPtr []int
	col    []int32
	val    []float64
}

// mulVec sets y = A·x.
func (a *csr) mulVec(y, x []float64) {
	for i := 0; i < a.n; i++ {
		var s float64
		cols := a.col[a.rowPtr[i]:a.rowPtr[i+1]]
		vals := a.val[a.rowPtr[i]:a.rowPtr[i+1]]
		for k, j := range cols {
			s += vals[k] * x[j]
		}
		y[i] = s
	}
}

// symbolic is the structure of the factor.
type symbolic struct {
	perm  []int32 // perm[i]: the input graph's vertex eliminated i-th
	first []int32 // first degree of freedom of each vertex in elimination order; len nv+1

	snStart  []int32 // supernode s holds vertices snStart[s] .. snStart[s+1]-1
	rowsOff  []int   // rows[rowsOff[s]:rowsOff[s+1]]: degrees of freedom below supernode s's columns
	rows     []int32
	snParent []int32 // -1 at a root
	nChild   []int32
	lOff     []int // L block of s: l[lOff[s]:lOff[s+1]], (k+r)×k row-major

	g        *graph    // the graph in elimination order
	snK, snR []int32   // columns and rows below them, per supernode
	snRowsV  [][]int32 // vertices below each supernode, until layout
	stackMax int       // largest total size of pending update matrices

	nnz      int     // stored entries of L (including the upper parts of diagonal blocks)
	flops    float64 // multiply–adds of the factorisation (estimate)
	maxFront int
}

// analyse computes the symbolic factorisation of a graph in the elimination
// order perm: elimination tree (Liu's algorithm), its postorder (same fill),
// the row structures, and fundamental supernodes.
func analyse(g0 *graph, perm0 []int32) *symbolic {
	n := g0.n()
	g := g0.permute(perm0)

	// Elimination tree with path compression.
	parent := make([]int32, n)
	anc := make([]int32, n)
	for j := int32(0); j < int32(n); j++ {
		parent[j], anc[j] = -1, -1
		for _, i := range g.neighbours(j) {
			if i >= j {
				continue
			}
			r := i
			for anc[r] != -1 && anc[r] != j {
				t := anc[r]
				anc[r] = j
				r = t
			}
			if anc[r] == -1 {
				anc[r] = j
				parent[r] = j
			}
		}
	}

	// Postorder, children in increasing order.
	head := make([]int32, n)
	next := make([]int32, n)
	for i := range head {
		head[i] = -1
	}
	for v := int32(n) - 1; v >= 0; v-- {
		if p := parent[v]; p >= 0 {
			next[v] = head[p]
			head[p] = v
		}
	}
	post := make([]int32, 0, n)
	stack := make([]int32, 0, 64)
	for root := int32(0); root < int32(n); root++ {
		if parent[root] != -1 {
			continue
		}
		stack = append(stack[:0], root)
		for len(stack) > 0 {
			v := stack[len(stack)-1]
			if c := head[v]; c != -1 {
				head[v] = next[c] // visit child c next time
				stack = append(stack, c)
				continue
			}
			stack = stack[:len(stack)-1]
			post = append(post, v)
		}
	}
	perm := make([]int32, n)
	for i, v := range post {
		perm[i] = perm0[v]
	}
	g = g0.permute(perm)

	// Row structures: struct(j) = adj⁺(j) ∪ ⋃ struct(children) \ {j}.
	structs := make([][]int32, n)
	children := make([][]int32, n)
	mark := make([]int32, n)
	for i := range mark {
		mark[i] = -1
	}
	nChildV := make([]int32, n)
	for j := int32(0); j < int32(n); j++ {
		var s []int32
		mark[j] = j
		for _, i := range g.neighbours(j) {
			if i > j && mark[i] != j {
				mark[i] = j
				s = append(s, i)
			}
		}
		for _, c := range children[j] {
			for _, i := range structs[c] {
				if mark[i] != j {
					mark[i] = j
					s = append(s, i)
				}
			}
		}
		children[j] = nil
		sortInt32(s)
		structs[j] = s
		parent[j] = -1
		if len(s) > 0 {
			parent[j] = s[0]
			children[s[0]] = append(children[s[0]], j)
			nChildV[s[0]]++
		}
	}

	sy := &symbolic{perm: perm, first: make([]int32, n+1), g: g}
	for v := 0; v < n; v++ {
		sy.first[v+1] = sy.first[v] + g.w[v]
	}

	// Fundamental supernodes: runs of vertices where each is the only child
	// of the next and their structures nest.
	var fStart []int32
	for j := 0; j < n; j++ {
		if j > 0 && parent[j-1] == int32(j) && nChildV[j] == 1 && len(structs[j-1]) == len(structs[j])+1 {
			continue
		}
		fStart = append(fStart, int32(j))
	}
	nf := len(fStart)
	fStart = append(fStart, int32(n))
	fOf := make([]int32, n) // vertex → fundamental supernode
	for f := 0; f < nf; f++ {
		for v := fStart[f]; v < fStart[f+1]; v++ {
			fOf[v] = int32(f)
		}
	}
	fk := make([]int, nf)
	fr := make([]int, nf)
	for f := 0; f < nf; f++ {
		last := fStart[f+1] - 1
		fk[f] = int(sy.first[last+1] - sy.first[fStart[f]])
		for _, v := range structs[last] {
			fr[f] += int(g.w[v])
		}
	}
	fParent := func(f int) int {
		if p := parent[fStart[f+1]-1]; p >= 0 {
			return int(fOf[p])
		}
		return -1
	}

	// Relaxed amalgamation: a supernode joins its parent when the parent
	// follows it directly (it is the parent's last child, so the columns
	// stay contiguous) and the merge stores few explicit zeros. Fewer,
	// wider supernodes make the dense kernels efficient; the many tiny
	// fronts of subdivided members would otherwise cost more in call
	// overhead than in arithmetic.
	const (
		relaxCols  = 24   // always merge up to this many columns,
		relaxMid   = 96   // up to this many
		relaxZeroM = 0.15 // while zeros stay below this fraction,
		relaxZeroL = 0.02 // and above it below this one
	)
	groupOf := make([]int32, nf)
	var gFirst []int32 // first fundamental supernode of each group
	for f := 0; f < nf; {
		gFirst = append(gFirst, int32(f))
		k := fk[f]
		entries := (fk[f] + fr[f]) * fk[f]
		groupOf[f] = int32(len(gFirst) - 1)
		for f+1 < nf && fParent(f) == f+1 {
			km := k + fk[f+1]
			merged := (km + fr[f+1]) * km
			true_ := entries + (fk[f+1]+fr[f+1])*fk[f+1]
			zeros := float64(merged-true_) / float64(merged)
			if km > relaxCols && (km > relaxMid || zeros > relaxZeroM) && zeros > relaxZeroL {
				break
			}
			f++
			k, entries = km, true_
			groupOf[f] = int32(len(gFirst) - 1)
		}
		f++
	}
	ns := len(gFirst)
	gFirst = append(gFirst, int32(nf))
	sy.snStart = make([]int32, ns+1)
	sy.snParent = make([]int32, ns)
	sy.nChild = make([]int32, ns)
	sy.snRowsV = make([][]int32, ns)
	sy.snK = make([]int32, ns)
	sy.snR = make([]int32, ns)
	sy.snStart[ns] = int32(n)
	for s := 0; s < ns; s++ {
		fl := int(gFirst[s+1]) - 1 // last fundamental supernode of the group
		sy.snStart[s] = fStart[gFirst[s]]
		last := fStart[fl+1] - 1
		k := int(sy.first[last+1] - sy.first[sy.snStart[s]])
		r := fr[fl]
		sy.snRowsV[s] = structs[last]
		sy.snK[s], sy.snR[s] = int32(k), int32(r)
		sy.snParent[s] = -1
		if p := fParent(fl); p >= 0 {
			sy.snParent[s] = groupOf[p]
			sy.nChild[groupOf[p]]++
		}
		fk, fr := float64(k), float64(r)
		sy.flops += fk*fk*fk/3 + fk*fk*fr + fk*fr*fr/2
		sy.nnz += (k + r) * k
		if k+r > sy.maxFront {
			sy.maxFront = k + r
		}
	}
	return sy
}

// layout lays out the factor of the analysed structure: the row lists of
// the supernodes, the offsets of their blocks of L, and the size of the
// update-matrix stack of the factorisation.
func (sy *symbolic) layout() {
	ns := len(sy.snK)
	sy.rowsOff = make([]int, ns+1)
	sy.lOff = make([]int, ns+1)
	total := 0
	for s := 0; s < ns; s++ {
		total += int(sy.snR[s])
	}
	sy.rows = make([]int32, 0, total)
	var sizes []int // the stack of update-matrix sizes
	depth := 0
	for s := 0; s < ns; s++ {
		for _, v := range sy.snRowsV[s] {
			for d := sy.first[v]; d < sy.first[v+1]; d++ {
				sy.rows = append(sy.rows, d)
			}
		}
		sy.rowsOff[s+1] = len(sy.rows)
		k, r := int(sy.snK[s]), int(sy.snR[s])
		sy.lOff[s+1] = sy.lOff[s] + (k+r)*k
		for q := int32(0); q < sy.nChild[s]; q++ {
			depth -= sizes[len(sizes)-1]
			sizes = sizes[:len(sizes)-1]
		}
		if r > 0 && sy.snParent[s] >= 0 {
			sizes = append(sizes, r*(r+1)/2) // packed lower triangle
			depth += r * (r + 1) / 2
			sy.stackMax = max(sy.stackMax, depth)
		}
	}
	sy.snRowsV = nil
}

// factor is a numeric Cholesky factor.
type factor struct {
	sy *symbolic
	l  []float64
}

// pivotError reports the first degree of freedom (in elimination order)
// whose pivot is not positive enough.
type pivotError struct {
	dof   int
	ratio float64
}

// pivotTol is the smallest accepted ratio of a pivot to the degree of
// freedom's own stiffness. A mechanism leaves a pivot of rounding size
// (about 1e-16 relative); genuine flexible structures stay many orders of
// magnitude above 1e-10.
const pivotTol = 1e-10

// factorize computes the numeric factor of a (in elimination order).
func (sy *symbolic) factorize(a *csr) (*factor, *pivotError) {
	ns := len(sy.snStart) - 1
	f := &factor{sy: sy, l: make([]float64, sy.nnz)}
	rel := make([]int32, a.n)
	work := make([]float64, sy.maxFront*sy.maxFront)
	stack := make([]float64, 0, sy.stackMax) // update matrices of processed supernodes
	var stackS []int32                       // their supernodes
	var stackOff []int                       // and offsets in stack
	for s := 0; s < ns; s++ {
		c0 := int(sy.first[sy.snStart[s]])
		c1 := int(sy.first[sy.snStart[s+1]])
		k := c1 - c0
		rows := sy.rows[sy.rowsOff[s]:sy.rowsOff[s+1]]
		r := len(rows)
		fs := k + r
		F := work[:fs*fs]
		for i := range F {
			F[i] = 0
		}
		for i := 0; i < k; i++ {
			rel[c0+i] = int32(i)
		}
		for i, d := range rows {
			rel[d] = int32(k + i)
		}

		// Original entries of the supernode's columns (lower part).
		for c := c0; c < c1; c++ {
			cc := c - c0
			cols := a.col[a.rowPtr[c]:a.rowPtr[c+1]]
			vals := a.val[a.rowPtr[c]:a.rowPtr[c+1]]
			for t, j := range cols {
				if int(j) >= c {
					F[int(rel[j])*fs+cc] += vals[t]
				}
			}
		}

		// Extend-add the children's update matrices (on top of the stack).
		for q := int32(0); q < sy.nChild[s]; q++ {
			top := len(stackS) - 1
			ch := stackS[top]
			off := stackOff[top]
			crow := sy.rows[sy.rowsOff[ch]:sy.rowsOff[ch+1]]
			rc := len(crow)
			u := stack[off : off+rc*(rc+1)/2]
			for x := 0; x < rc; x++ {
				fx := int(rel[crow[x]]) * fs
				ux := u[x*(x+1)/2 : x*(x+1)/2+x+1]
				for y, v := range ux {
					F[fx+int(rel[crow[y]])] += v
				}
			}
			stack = stack[:off]
			stackS = stackS[:top]
			stackOff = stackOff[:top]
		}

		// Dense partial factorisation of the front.
		if i, ratio := cholLower(F, fs, k, a, c0); i >= 0 {
			return nil, &pivotError{dof: c0 + i, ratio: ratio}
		}
		if r > 0 {
			l11 := blas64.Triangular{Uplo: blas.Lower, Diag: blas.NonUnit, N: k, Stride: fs, Data: F}
			f21 := blas64.General{Rows: r, Cols: k, Stride: fs, Data: F[k*fs:]}
			blas64.Trsm(blas.Right, blas.Trans, 1, l11, f21)
			syrkLower(f21, F[k*fs+k:], fs)
		}
		// Keep L's columns; push the update matrix.
		ls := f.l[sy.lOff[s]:sy.lOff[s+1]]
		for i := 0; i < fs; i++ {
			copy(ls[i*k:(i+1)*k], F[i*fs:i*fs+k])
		}
		if r > 0 && sy.snParent[s] >= 0 {
			off := len(stack)
			stack = stack[:off+r*(r+1)/2] // within stackMax
			u := stack[off:]
			for i := 0; i < r; i++ {
				copy(u[i*(i+1)/2:i*(i+1)/2+i+1], F[(k+i)*fs+k:(k+i)*fs+k+i+1])
			}
			stackS = append(stackS, int32(s))
			stackOff = append(stackOff, off)
		}
	}
	return f, nil
}

// syrkLower sets the lower triangle of C (a.Rows square, row-major with
// stride ldc) to C − A·Aᵀ. It works in column panels so that nearly all
// the work is a matrix product: gonum's Dgemm is blocked and parallel,
// its Dsyrk is neither, and was four times slower here.
func syrkLower(a blas64.General, c []float64, ldc int) {
	const nb = 96
	r := a.Rows
	for j := 0; j < r; j += nb {
		w := min(nb, r-j)
		// C[j:r, j:j+w] −= A[j:r, :]·A[j:j+w, :]ᵀ (the strictly upper part of
		// the diagonal panel is written too, and never read).
		aj := blas64.General{Rows: r - j, Cols: a.Cols, Stride: a.Stride, Data: a.Data[j*a.Stride:]}
		bj := blas64.General{Rows: w, Cols: a.Cols, Stride: a.Stride, Data: a.Data[j*a.Stride:]}
		cj := blas64.General{Rows: r - j, Cols: w, Stride: ldc, Data: c[j*ldc+j:]}
		blas64.Gemm(blas.NoTrans, blas.Trans, -1, aj, bj, 1, cj)
	}
}

// diagOf returns a[i][i].
func diagOf(a *csr, i int) float64 {
	cols := a.col[a.rowPtr[i]:a.rowPtr[i+1]]
	lo, hi := 0, len(cols)
	for lo < hi {
		m := (lo + hi) / 2
		if int(cols[m]) < i {
			lo = m + 1
		} else {
			hi = m
		}
	}
	if lo < len(cols) && int(cols[lo]) == i {
		return a.val[a.rowPtr[i]+lo]
	}
	return 0
}

// cholLower factors the leading k×k block of F (row-major, stride ld) in
// place into its lower Cholesky factor, in column panels: an unblocked
// factorisation of each diagonal block, then a triangular solve and a
// matrix-product update of the block below it. It checks every pivot
// against the degree of freedom's own stiffness a[c0+i][c0+i] and returns
// the first failing column and its pivot ratio, or -1. (LAPACK's potrf
// does the same work but reports only failure, not where.)
func cholLower(F []float64, ld, k int, a *csr, c0 int) (int, float64) {
	const nb = 64
	for j := 0; j < k; j += nb {
		w := min(nb, k-j)
		for c := j; c < j+w; c++ {
			rc := F[c*ld+j : c*ld+c]
			d := F[c*ld+c] - floats.Dot(rc, rc)
			orig := diagOf(a, c0+c)
			if !(orig > 0) || !(d >= pivotTol*orig) {
				ratio := 0.0
				if orig > 0 {
					ratio = d / orig
				}
				return c, ratio
			}
			p := math.Sqrt(d)
			F[c*ld+c] = p
			for i := c + 1; i < j+w; i++ {
				F[i*ld+c] = (F[i*ld+c] - floats.Dot(F[i*ld+j:i*ld+c], rc)) / p
			}
		}
		if j+w == k {
			break
		}
		// Panel below the diagonal block, then the trailing block.
		l := blas64.Triangular{Uplo: blas.Lower, Diag: blas.NonUnit, N: w, Stride: ld, Data: F[j*ld+j:]}
		below := blas64.General{Rows: k - j - w, Cols: w, Stride: ld, Data: F[(j+w)*ld+j:]}
		blas64.Trsm(blas.Right, blas.Trans, 1, l, below)
		syrkLower(below, F[(j+w)*ld+j+w:], ld)
	}
	return -1, 0
}

// solveL overwrites x with L⁻¹·x; tmp must hold maxFront values.
func (f *factor) solveL(x, tmp []float64) {
	sy := f.sy
	ns := len(sy.snStart) - 1
	for s := 0; s < ns; s++ {
		c0 := int(sy.first[sy.snStart[s]])
		k := int(sy.first[sy.snStart[s+1]]) - c0
		rows := sy.rows[sy.rowsOff[s]:sy.rowsOff[s+1]]
		r := len(rows)
		ls := f.l[sy.lOff[s]:sy.lOff[s+1]]
		xs := blas64.Vector{N: k, Inc: 1, Data: x[c0 : c0+k]}
		forward(ls, k, xs.Data)
		if r == 0 {
			continue
		}
		t := blas64.Vector{N: r, Inc: 1, Data: tmp[:r]}
		blas64.Gemv(blas.NoTrans, 1, blas64.General{Rows: r, Cols: k, Stride: k, Data: ls[k*k:]}, xs, 0, t)
		for i, d := range rows {
			x[d] -= tmp[i]
		}
	}
}

// solveLT overwrites x with L⁻ᵀ·x; tmp must hold maxFront values.
func (f *factor) solveLT(x, tmp []float64) {
	sy := f.sy
	for s := len(sy.snStart) - 2; s >= 0; s-- {
		c0 := int(sy.first[sy.snStart[s]])
		k := int(sy.first[sy.snStart[s+1]]) - c0
		rows := sy.rows[sy.rowsOff[s]:sy.rowsOff[s+1]]
		r := len(rows)
		ls := f.l[sy.lOff[s]:sy.lOff[s+1]]
		xs := blas64.Vector{N: k, Inc: 1, Data: x[c0 : c0+k]}
		if r > 0 {
			for i, d := range rows {
				tmp[i] = x[d]
			}
			t := blas64.Vector{N: r, Inc: 1, Data: tmp[:r]}
			blas64.Gemv(blas.Trans, -1, blas64.General{Rows: r, Cols: k, Stride: k, Data: ls[k*k:]}, t, 1, xs)
		}
		backward(ls, k, xs.Data)
	}
}

// forward overwrites x with L⁻¹·x for the k×k lower triangle L (row-major,
// stride k): each unknown is a dot product with its row. (gonum's Dtrsv
// runs a scalar loop here and took a fifth of the whole analysis.)
func forward(l []float64, k int, x []float64) {
	for i := 0; i < k; i++ {
		row := l[i*k : i*k+i]
		x[i] = (x[i] - floats.Dot(row, x[:i])) / l[i*k+i]
	}
}

// backward overwrites x with L⁻ᵀ·x: each unknown, once known, is taken out
// of the ones before it along its row.
func backward(l []float64, k int, x []float64) {
	for i := k - 1; i >= 0; i-- {
		x[i] /= l[i*k+i]
		if i > 0 {
			floats.AddScaled(x[:i], -x[i], l[i*k:i*k+i])
		}
	}
}
