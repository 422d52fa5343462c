package frame

import (
	"math"
	"math/rand/v2"
	"sort"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/gonum/mat"
)

// The buckling problem K·φ = λ·G·φ (K positive definite, G indefinite) is
// solved through the symmetric operator C = L⁻¹·G·L⁻ᵀ with K = L·Lᵀ: its
// eigenvalues are θ = 1/λ and its eigenvectors x give φ = L⁻ᵀ·x. The lowest
// positive λ are the largest positive θ, at the top of C's spectrum, where
// Lanczos iteration converges first (the shift-invert form of the problem).

const debugLanczos = false

// operator applies C = L⁻¹·G·L⁻ᵀ.
type operator struct {
	sys *system
	f   *factor
	y   []float64
	tmp []float64
	neg bool // apply −C
}

func newOperator(sys *system, f *factor) *operator {
	return &operator{sys: sys, f: f, y: make([]float64, sys.n), tmp: make([]float64, f.sy.maxFront)}
}

func (op *operator) apply(dst, x []float64) {
	copy(op.y, x)
	op.f.solveLT(op.y, op.tmp)
	op.sys.gMulVec(dst, op.y)
	op.f.solveL(dst, op.tmp)
	if op.neg {
		for i := range dst {
			dst[i] = -dst[i]
		}
	}
}

// eigenpairs are eigenvalues (descending) with their vectors.
type eigenpairs struct {
	theta []float64
	x     [][]float64
	steps int
	scale float64 // largest |θ| seen: the operator's norm, or a lower bound
}

// denseTop computes all eigenpairs of C densely and returns the nev
// largest.
func denseTop(op *operator, n, nev int) (eigenpairs, error) {
	c := mat.NewSymDense(n, nil)
	col := make([]float64, n)
	e := make([]float64, n)
	for j := 0; j < n; j++ {
		e[j] = 1
		op.apply(col, e)
		e[j] = 0
		for i := 0; i <= j; i++ {
			// C is symmetric; average the two computed halves.
			if i == j {
				c.SetSym(i, j, col[i])
			} else {
				c.SetSym(i, j, (c.At(i, j)+col[i])/2)
			}
		}
		for i := j + 1; i < n; i++ {
			c.SetSym(i, j, col[i]) // provisional, averaged when column i comes
		}
	}
	var es mat.EigenSym
	if !es.Factorize(c, true) {
		return eigenpairs{}, ErrNoConvergence
	}
	vals := es.Values(nil)
	var vecs mat.Dense
	es.VectorsTo(&vecs)
	var ep eigenpairs
	ep.steps = n
	for _, v := range vals {
		ep.scale = math.Max(ep.scale, math.Abs(v))
	}
	for k := n - 1; k >= 0 && len(ep.theta) < nev; k-- {
		ep.theta = append(ep.theta, vals[k])
		ep.x = append(ep.x, mat.Col(nil, k, &vecs))
	}
	return ep, nil
}

// lanczos returns the nev largest eigenpairs of the symmetric operator op
// of order n by Lanczos iteration with full reorthogonalisation and thick
// restarts (the symmetric case of Stewart's Krylov–Schur method; Wu &
// Simon 2000). A Ritz pair (θ, x) is accepted when its residual
// ‖C·x − θ·x‖ is below tol·|θ_max|.
func lanczos(op *operator, n, nev int, tol float64) (eigenpairs, error) {
	if nev > n {
		nev = n
	}
	mMax := max(2*nev+20, 40)
	mMax = min(mMax, n)
	keep := min(nev+6, mMax/2)
	// The basis is one block, row i the vector v[i], so that
	// orthogonalisation is two matrix–vector products. v[mMax] is the
	// residual direction.
	block := make([]float64, (mMax+1)*n)
	v := make([][]float64, mMax+1)
	for i := range v {
		v[i] = block[i*n : (i+1)*n : (i+1)*n]
	}
	coef := make([]float64, mMax)
	h := make([]float64, mMax*mMax)
	w := make([]float64, n)
	rnd := rand.New(rand.NewPCG(1, 2))
	for i := range v[0] {
		v[0][i] = rnd.Float64() - 0.5
	}
	floats.Scale(1/floats.Norm(v[0], 2), v[0])

	var ep eigenpairs
	k := 0 // Ritz vectors kept from the last cycle
	scratch := make([][]float64, keep)
	for i := range scratch {
		scratch[i] = make([]float64, n)
	}

	// ritz computes the Ritz pairs of the m×m projected matrix, sorted by
	// decreasing value, and whether the wanted ones have converged given
	// the norm beta of the residual direction.
	ritz := func(m int, beta float64) (vals []float64, y *mat.Dense, idx []int, done bool, err error) {
		hm := mat.NewSymDense(m, nil)
		for i := 0; i < m; i++ {
			for j := i; j < m; j++ {
				hm.SetSym(i, j, h[i*mMax+j])
			}
		}
		var es mat.EigenSym
		if !es.Factorize(hm, true) {
			return nil, nil, nil, false, ErrNoConvergence
		}
		vals = es.Values(nil)
		y = new(mat.Dense)
		es.VectorsTo(y)
		idx = make([]int, m)
		for i := range idx {
			idx[i] = i
		}
		sort.Slice(idx, func(a, b int) bool { return vals[idx[a]] > vals[idx[b]] })
		top := 0.0
		for _, v := range vals {
			top = math.Max(top, math.Abs(v))
		}
		done = true
		for _, i := range idx[:min(nev, m)] {
			if math.Abs(beta*y.At(m-1, i)) > tol*top {
				done = false
			}
		}
		if debugLanczos {
			i := idx[0]
			println("m", m, "theta", vals[i], "res", math.Abs(beta*y.At(m-1, i))/top)
		}
		return vals, y, idx, done || m == n, nil
	}

	const maxCycles = 200
	for cycle := 0; cycle < maxCycles; cycle++ {
		m := mMax
		var beta float64
		scale := 0.0
		for j := k; j < mMax; j++ {
			op.apply(w, v[j])
			ep.steps++
			// Classical Gram–Schmidt against the whole basis, repeated
			// once when the first pass cancels much of w ("twice is
			// enough", Parlett).
			basis := blas64.General{Rows: j + 1, Cols: n, Stride: n, Data: block}
			wv := blas64.Vector{N: n, Inc: 1, Data: w}
			cv := blas64.Vector{N: j + 1, Inc: 1, Data: coef[:j+1]}
			before := floats.Norm(w, 2)
			for pass := 0; pass < 2; pass++ {
				blas64.Gemv(blas.NoTrans, 1, basis, wv, 0, cv)
				blas64.Gemv(blas.Trans, -1, basis, cv, 1, wv)
				for i := 0; i <= j; i++ {
					h[i*mMax+j] += coef[i]
				}
				after := floats.Norm(w, 2)
				if after > 0.7*before {
					break
				}
				before = after
			}
			for i := 0; i < j; i++ {
				h[j*mMax+i] = h[i*mMax+j]
			}
			for i := 0; i <= j; i++ {
				scale = math.Max(scale, math.Abs(h[i*mMax+j]))
			}
			beta = floats.Norm(w, 2)
			if beta <= 1e-12*scale || beta == 0 {
				// Invariant subspace: the Ritz values are exact.
				m = j + 1
				beta = 0
				break
			}
			floats.ScaleTo(v[j+1], 1/beta, w)
			// Test convergence every few steps: the projected problem is
			// tiny next to one application of the operator.
			if j+1 < mMax && j+1-k >= 6 && (j+1)%3 == 0 {
				_, _, _, done, err := ritz(j+1, beta)
				if err != nil {
					return ep, err
				}
				if done {
					m = j + 1
					break
				}
			}
		}
		vals, y, idx, done, err := ritz(m, beta)
		if err != nil {
			return ep, err
		}
		for _, v := range vals {
			ep.scale = math.Max(ep.scale, math.Abs(v))
		}
		if done {
			want := min(nev, m)
			ep.theta = ep.theta[:0]
			ep.x = ep.x[:0]
			for _, i := range idx[:want] {
				x := make([]float64, n)
				for j := 0; j < m; j++ {
					floats.AddScaled(x, y.At(j, i), v[j])
				}
				ep.theta = append(ep.theta, vals[i])
				ep.x = append(ep.x, x)
			}
			return ep, nil
		}

		// Thick restart: keep the best Ritz vectors, continue from the
		// residual direction.
		k = min(keep, m-1)
		for r := 0; r < k; r++ {
			x := scratch[r]
			for t := range x {
				x[t] = 0
			}
			for j := 0; j < m; j++ {
				floats.AddScaled(x, y.At(j, idx[r]), v[j])
			}
		}
		for r := 0; r < k; r++ {
			copy(v[r], scratch[r])
		}
		copy(v[k], v[m]) // m == mMax here: v[mMax] holds w/β
		for i := range h {
			h[i] = 0
		}
		for r := 0; r < k; r++ {
			h[r*mMax+r] = vals[idx[r]]
		}
	}
	return ep, ErrNoConvergence
}
