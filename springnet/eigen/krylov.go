package eigen

import (
	"math"
	"math/rand/v2"
	"sort"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/gonum/mat"
)

// operator is a linear operator OP that is self-adjoint in the B-inner
// product ⟨x, y⟩ = xᵀ·B·y, B symmetric positive semidefinite.
type operator interface {
	// apply sets dst = OP·x, given bx = B·x. It must not change x or bx.
	apply(dst, x, bx []float64) error
	// applyMany sets dst[i] = OP·x[i], given bx[i] = B·x[i], for a block
	// (one pass over the factor for all of them).
	applyMany(dst, x, bx [][]float64) error
	// bmul sets dst = B·x.
	bmul(dst, x []float64)
}

// krylov is a block Lanczos process with full reorthogonalisation and thick
// restarts, written as a symmetric block Krylov–Schur iteration: the basis
// Q (B-orthonormal rows) and the projected matrix H = Qᵀ·B·OP·Q are kept
// explicitly, every new vector is orthogonalised against the whole basis
// (classical Gram–Schmidt, twice), and a restart keeps the wanted Ritz
// vectors and the residual block.
//
// Invariant between expansions: rows 0..k−p−1 are expanded (their OP
// images are in span(Q) plus the last block), rows k−p..k−1 are the
// residual block, not yet expanded.
type krylov struct {
	op   operator
	n    int       // vector length
	p    int       // block size
	mmax int       // basis size at which to restart (multiple of p)
	ld   int       // mmax + p: capacity in rows, and leading dimension of h
	q    []float64 // ld rows of length n
	bq   []float64 // B·q, row by row
	h    []float64 // ld × ld, row-major
	k    int       // rows in use
	tmp  []float64 // mmax × n, restart workspace
	x    []float64 // scratch vectors
	bx   []float64
	coef []float64
	rng  *rand.Rand

	solves    int
	restarts  int
	exhausted bool // the basis spans an invariant subspace: Ritz pairs are exact
}

func newKrylov(op operator, n, p, mmax int) *krylov {
	ld := mmax + p
	return &krylov{
		op: op, n: n, p: p, mmax: mmax, ld: ld,
		q:    make([]float64, ld*n),
		bq:   make([]float64, ld*n),
		h:    make([]float64, ld*ld),
		tmp:  make([]float64, mmax*n),
		x:    make([]float64, n),
		bx:   make([]float64, n),
		coef: make([]float64, ld),
		rng:  rand.New(rand.NewPCG(1, 1)),
	}
}

func (kr *krylov) row(i int) []float64  { return kr.q[i*kr.n : (i+1)*kr.n] }
func (kr *krylov) brow(i int) []float64 { return kr.bq[i*kr.n : (i+1)*kr.n] }

// rows returns rows [0, k) of the row-major matrix data as a blas64.General.
func rows(data []float64, k, n int) blas64.General {
	return blas64.General{Rows: k, Cols: n, Stride: n, Data: data[:k*n]}
}

// orth makes w B-orthogonal to rows [0, k) by classical Gram–Schmidt
// applied twice, adding the coefficients to c[0:k]. bw is workspace.
func (kr *krylov) orth(w []float64, k int, c []float64) {
	if k == 0 {
		return
	}
	n := kr.n
	d := kr.coef[:k]
	for pass := 0; pass < 2; pass++ {
		// d = (B·Q)·w, w −= Qᵀ·d
		blas64.Gemv(blas.NoTrans, 1, rows(kr.bq, k, n), blas64.Vector{N: n, Inc: 1, Data: w}, 0, blas64.Vector{N: k, Inc: 1, Data: d})
		blas64.Gemv(blas.Trans, -1, rows(kr.q, k, n), blas64.Vector{N: k, Inc: 1, Data: d}, 1, blas64.Vector{N: n, Inc: 1, Data: w})
		floats.Add(c[:k], d)
	}
}

// normalize B-normalises row i (setting brow(i) = B·row(i)) and returns
// its B-norm before scaling.
func (kr *krylov) normalize(i int) float64 {
	w, bw := kr.row(i), kr.brow(i)
	kr.op.bmul(bw, w)
	nrm := floats.Dot(w, bw)
	if !(nrm > 0) || math.IsInf(nrm, 0) {
		return 0
	}
	nrm = math.Sqrt(nrm)
	floats.Scale(1/nrm, w)
	floats.Scale(1/nrm, bw)
	return nrm
}

// fresh fills row i with a random vector in the range of OP, B-orthonormal
// to rows [0, i). It returns false if no such vector could be found (the
// basis spans the whole range of OP).
func (kr *krylov) fresh(i int) (bool, error) {
	w := kr.row(i)
	for try := 0; try < 3; try++ {
		for j := range kr.x {
			kr.x[j] = kr.rng.Float64() - 0.5
		}
		kr.op.bmul(kr.bx, kr.x)
		if err := kr.op.apply(w, kr.x, kr.bx); err != nil {
			return false, err
		}
		kr.solves++
		kr.op.bmul(kr.bx, w)
		before := math.Sqrt(math.Abs(floats.Dot(w, kr.bx)))
		c := make([]float64, i)
		kr.orth(w, i, c)
		if nrm := kr.normalize(i); nrm > 1e-8*before && before > 0 {
			return true, nil
		}
	}
	for j := range w {
		w[j] = 0
	}
	for j := range kr.brow(i) {
		kr.brow(i)[j] = 0
	}
	return false, nil
}

// start fills the first block with random vectors in the range of OP.
func (kr *krylov) start() error {
	for j := range kr.h {
		kr.h[j] = 0
	}
	kr.k = 0
	return kr.freshBlock()
}

// freshBlock appends a block of p fresh rows (see fresh) at row k, and
// marks the basis exhausted if one of them cannot be found.
func (kr *krylov) freshBlock() error {
	kr.exhausted = false
	for r := 0; r < kr.p; r++ {
		ok, err := kr.fresh(kr.k)
		if err != nil {
			return err
		}
		if !ok {
			kr.exhausted = true
		}
		kr.k++
	}
	return nil
}

// appendImage takes row k (the current size), which holds OP·q_c,
// B-orthogonalises it against rows [0, k), stores the coefficients in
// column c of h, and keeps the normalised remainder as row k. On a
// breakdown the row gets a replacement vector or, if none exists, zeros.
func (kr *krylov) appendImage(c int) error {
	k, ld := kr.k, kr.ld
	w := kr.row(k)
	if floats.Norm(kr.row(c), math.Inf(1)) == 0 {
		for j := range w {
			w[j] = 0
		}
		for j := range kr.brow(k) {
			kr.brow(k)[j] = 0
		}
		kr.k++
		return nil
	}
	col := make([]float64, k)
	kr.orth(w, k, col)
	scale := floats.Norm(col, 2)
	for r := 0; r < k; r++ {
		kr.h[r*ld+c] = col[r]
	}
	nrm := kr.normalize(k)
	if nrm <= 1e-10*scale || nrm == 0 {
		// Breakdown: the basis contains an invariant subspace. Continue
		// with a new random direction (coupling zero), if one exists.
		ok, err := kr.fresh(k)
		if err != nil {
			return err
		}
		if !ok {
			kr.exhausted = true
		}
		nrm = 0
	}
	kr.h[k*ld+c] = nrm
	kr.h[c*ld+k] = nrm
	kr.k++
	return nil
}

// expand expands the residual block, appending a new one. The OP images
// of the whole block are computed together, in one pass over the factor.
func (kr *krylov) expand() error {
	c0, k := kr.k-kr.p, kr.k
	var dst, xs, bxs [][]float64
	for i := 0; i < kr.p; i++ {
		w := kr.row(k + i)
		if floats.Norm(kr.row(c0+i), math.Inf(1)) == 0 {
			for j := range w {
				w[j] = 0
			}
			continue
		}
		dst = append(dst, w)
		xs = append(xs, kr.row(c0+i))
		bxs = append(bxs, kr.brow(c0+i))
	}
	if len(dst) > 0 {
		if err := kr.op.applyMany(dst, xs, bxs); err != nil {
			return err
		}
		kr.solves += len(dst)
	}
	for i := 0; i < kr.p; i++ {
		if err := kr.appendImage(c0 + i); err != nil {
			return err
		}
	}
	return nil
}

// finishExhausted completes column c of H for every row c ≥ first once the
// basis spans an invariant subspace: OP·q_c is then in span(Q), so its
// coefficients are the whole projection and the remainder is dropped.
func (kr *krylov) finishExhausted(first int) error {
	ld := kr.ld
	for c := first; c < kr.k; c++ {
		qc := kr.row(c)
		if floats.Norm(qc, math.Inf(1)) == 0 {
			continue
		}
		if err := kr.op.apply(kr.x, qc, kr.brow(c)); err != nil {
			return err
		}
		kr.solves++
		col := make([]float64, kr.k)
		kr.orth(kr.x, kr.k, col)
		for r := 0; r < kr.k; r++ {
			kr.h[r*ld+c] = col[r]
		}
	}
	return nil
}

// ritz is a Rayleigh–Ritz solution on the current basis.
type ritz struct {
	m     int         // number of basis rows used
	idx   []int       // basis rows used (nonzero rows)
	theta []float64   // Ritz values, ascending
	s     *mat.Dense  // Ritz vectors in the basis, column j for theta[j]
	resid []float64   // ‖OP·y − θ·y‖_B
	e     [][]float64 // coupling of the residual block: e[r] row of length len(idx)
	order []int       // Ritz indices, most wanted first
	conv  []bool      // per Ritz index
	tail  int         // first row of the residual block
	exact bool        // residuals are exactly zero (exhausted basis)
}

// rayleighRitz solves the projected eigenproblem on rows [0, m), with the
// residual block rows [m, m+p) (or none when exhausted).
func (kr *krylov) rayleighRitz(m int, exact bool, prio func(float64) float64, tol float64) (*ritz, error) {
	ld := kr.ld
	var idx []int
	for r := 0; r < m; r++ {
		if floats.Norm(kr.row(r), math.Inf(1)) > 0 {
			idx = append(idx, r)
		}
	}
	mm := len(idx)
	hs := mat.NewSymDense(mm, nil)
	for a, i := range idx {
		for b := a; b < mm; b++ {
			j := idx[b]
			hs.SetSym(a, b, 0.5*(kr.h[i*ld+j]+kr.h[j*ld+i]))
		}
	}
	var es mat.EigenSym
	if !es.Factorize(hs, true) {
		return nil, &ConvergenceError{Restarts: kr.restarts}
	}
	rz := &ritz{m: m, idx: idx, theta: es.Values(nil), s: &mat.Dense{}, tail: m, exact: exact}
	es.VectorsTo(rz.s)
	rz.resid = make([]float64, mm)
	if !exact {
		rz.e = make([][]float64, kr.p)
		for r := 0; r < kr.p; r++ {
			rz.e[r] = make([]float64, mm)
			for a, i := range idx {
				rz.e[r][a] = kr.h[(m+r)*ld+i]
			}
		}
		for j := 0; j < mm; j++ {
			var ss float64
			for r := 0; r < kr.p; r++ {
				var d float64
				for a := range idx {
					d += rz.e[r][a] * rz.s.At(a, j)
				}
				ss += d * d
			}
			rz.resid[j] = math.Sqrt(ss)
		}
	}
	rz.order = make([]int, mm)
	for j := range rz.order {
		rz.order[j] = j
	}
	sort.SliceStable(rz.order, func(a, b int) bool {
		return prio(rz.theta[rz.order[a]]) > prio(rz.theta[rz.order[b]])
	})
	var tmax float64
	for _, t := range rz.theta {
		tmax = max(tmax, math.Abs(t))
	}
	rz.conv = make([]bool, mm)
	for j, t := range rz.theta {
		rz.conv[j] = rz.resid[j] <= tol*math.Abs(t) || (exact && math.Abs(t) > 0)
		if math.Abs(t) <= 1e-12*tmax {
			rz.conv[j] = false // an infinite eigenvalue of the pencil: never wanted
		}
	}
	return rz, nil
}

// iterate runs restart cycles until the want most wanted Ritz pairs are
// converged (or the basis is exhausted). It returns the last Rayleigh–Ritz
// solution.
func (kr *krylov) iterate(want, maxRestarts int, tol float64, prio func(float64) float64) (*ritz, error) {
	for {
		for !kr.exhausted && kr.k+kr.p <= kr.ld {
			if err := kr.expand(); err != nil {
				return nil, err
			}
		}
		var rz *ritz
		var err error
		if kr.exhausted {
			if err := kr.finishExhausted(kr.k - kr.p); err != nil {
				return nil, err
			}
			rz, err = kr.rayleighRitz(kr.k, true, prio, tol)
		} else {
			rz, err = kr.rayleighRitz(kr.k-kr.p, false, prio, tol)
		}
		if err != nil {
			return nil, err
		}
		nconv := 0
		for _, j := range rz.order[:min(want, len(rz.order))] {
			if rz.conv[j] {
				nconv++
			}
		}
		if nconv >= want || kr.exhausted {
			return rz, nil
		}
		if kr.restarts >= maxRestarts {
			return rz, &ConvergenceError{Want: want, Converged: nconv, Restarts: kr.restarts}
		}
		// Thick restart: keep the most wanted Ritz vectors, about half way
		// between want and the basis size, at least one block fewer than
		// the basis.
		mm := len(rz.idx)
		keep := min(max(want+(mm-want)/2, want+kr.p), kr.mmax-kr.p, mm)
		kr.restart(rz, rz.order[:keep], false)
		kr.restarts++
	}
}

// combine sets the first len(cols) rows of dst to the Ritz combinations
// Σ_a s[a, col]·src[idx[a]].
func (kr *krylov) combine(dst, src []float64, rz *ritz, cols []int) {
	n := kr.n
	mm := len(rz.idx)
	st := blas64.General{Rows: len(cols), Cols: mm, Stride: mm, Data: make([]float64, len(cols)*mm)}
	for i, c := range cols {
		for a := 0; a < mm; a++ {
			st.Data[i*mm+a] = rz.s.At(a, c)
		}
	}
	// Gather the used rows (contiguous in the common case).
	srcRows := blas64.General{Rows: mm, Cols: n, Stride: n}
	contiguous := true
	for a, i := range rz.idx {
		if i != a {
			contiguous = false
			break
		}
	}
	if contiguous {
		srcRows.Data = src[:mm*n]
	} else {
		srcRows.Data = make([]float64, mm*n)
		for a, i := range rz.idx {
			copy(srcRows.Data[a*n:(a+1)*n], src[i*n:(i+1)*n])
		}
	}
	out := blas64.General{Rows: len(cols), Cols: n, Stride: n, Data: dst[:len(cols)*n]}
	blas64.Gemm(blas.NoTrans, blas.NoTrans, 1, st, srcRows, 0, out)
}

// restart replaces the basis by the Ritz vectors keep (in that order)
// followed by the residual block. With lock, the couplings of the kept
// vectors to the residual block are dropped (they are converged) and the
// residual block is replaced by fresh random vectors: the process then
// searches the B-orthogonal complement of the kept vectors.
func (kr *krylov) restart(rz *ritz, keep []int, lock bool) error {
	n, p, ld := kr.n, kr.p, kr.ld
	kk := len(keep)
	kr.combine(kr.tmp, kr.q, rz, keep)
	copy(kr.q[:kk*n], kr.tmp[:kk*n])
	kr.combine(kr.tmp, kr.bq, rz, keep)
	copy(kr.bq[:kk*n], kr.tmp[:kk*n])
	// coupling c[r][i] = e_r · s_keep[i]
	c := make([][]float64, p)
	if rz.e != nil && !lock {
		for r := 0; r < p; r++ {
			c[r] = make([]float64, kk)
			for i, j := range keep {
				var d float64
				for a := range rz.idx {
					d += rz.e[r][a] * rz.s.At(a, j)
				}
				c[r][i] = d
			}
		}
	}
	for r := 0; r < p && !lock && !rz.exact; r++ {
		copy(kr.row(kk+r), kr.row(rz.tail+r))
		copy(kr.brow(kk+r), kr.brow(rz.tail+r))
	}
	for j := range kr.h {
		kr.h[j] = 0
	}
	for i, j := range keep {
		kr.h[i*ld+i] = rz.theta[j]
	}
	kr.k = kk
	if lock || rz.exact {
		return kr.freshBlock()
	}
	for r := 0; r < p; r++ {
		for i := 0; i < kk; i++ {
			kr.h[(kk+r)*ld+i] = c[r][i]
			kr.h[i*ld+kk+r] = c[r][i]
		}
	}
	kr.k = kk + p
	return nil
}

// vector writes the Ritz vector of Ritz index j into dst. With purify, it
// adds the correction (1/θ)·Q_res·(E·s) that makes it OP·y/θ, which removes
// components along the null space of B (Nour-Omid et al. 1987).
func (kr *krylov) vector(dst []float64, rz *ritz, j int, purify bool) {
	n := kr.n
	for i := range dst {
		dst[i] = 0
	}
	for a, i := range rz.idx {
		floats.AddScaled(dst, rz.s.At(a, j), kr.q[i*n:(i+1)*n])
	}
	if !purify || rz.e == nil || rz.theta[j] == 0 {
		return
	}
	for r := 0; r < kr.p; r++ {
		var d float64
		for a := range rz.idx {
			d += rz.e[r][a] * rz.s.At(a, j)
		}
		floats.AddScaled(dst, d/rz.theta[j], kr.row(rz.tail+r))
	}
}
