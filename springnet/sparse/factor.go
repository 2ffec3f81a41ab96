package sparse

import (
	"fmt"
	"math"
	"slices"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
)

// Ordering selects the fill-reducing ordering used by Factor.Analyze.
type Ordering int

// Orderings. The zero Ordering is Auto.
const (
	Auto             Ordering = iota // the package's choice for the matrix
	Natural                          // no reordering
	MinDegree                        // approximate minimum degree
	NestedDissection                 // nested dissection (geometric when Coords are given)
)

// Mode selects the factorisation.
type Mode int

// Modes. The zero Mode is Cholesky.
const (
	// Cholesky expects a symmetric positive definite matrix; a pivot that
	// is not positive (relative to its column's diagonal) is an error.
	Cholesky Mode = iota
	// LDLT factorises a symmetric, possibly indefinite matrix without
	// pivoting (A = L·D·Lᵀ), and counts the signs of the pivots (Inertia).
	LDLT
)

// Options controls Analyze and Factorize. A nil *Options means defaults;
// zero fields mean defaults.
type Options struct {
	Ordering Ordering
	Mode     Mode
	// Coords, if not nil, gives a point in space for each row (len N); a
	// geometric nested dissection may use it.
	Coords [][3]float64
	// PivotTol is the relative pivot tolerance: a pivot d_k with
	// |d_k| <= PivotTol·|a_kk| marks column k as singular (where a_kk is
	// zero, the largest |entry| of column k replaces it). Default 1e-11.
	PivotTol float64
}

// DefaultPivotTol is the relative pivot tolerance used when Options.PivotTol is zero.
const DefaultPivotTol = 1e-11

// PivotError reports a zero, tiny or (in Cholesky mode) negative pivot.
// Col is the row/column of the original (unpermuted) matrix.
type PivotError struct {
	Col      int     // original index of the failing column
	Pivot    float64 // the pivot found
	Diagonal float64 // the original diagonal entry of that column
	Negative bool    // the pivot is clearly negative (matrix indefinite) rather than near zero
}

// Error implements the error interface.
func (e *PivotError) Error() string {
	what := "near-zero"
	if e.Negative {
		what = "negative"
	}
	return fmt.Sprintf("sparse: %s pivot %.3g at column %d (diagonal %.3g): matrix is singular or not positive definite", what, e.Pivot, e.Col, e.Diagonal)
}

// Factor is a sparse L·D·Lᵀ factorisation of a symmetric matrix, P·A·Pᵀ =
// L·D·Lᵀ. The zero Factor is ready for Analyze. A Factor keeps its ordering
// and symbolic analysis, so Factorize may be called again with a matrix of
// the same pattern and new values without a new Analyze; it then reuses
// all its storage (the first Factorize after an Analyze allocates it).
//
// The numeric factorisation is multifrontal over relaxed supernodes, with
// dense blocked kernels (see doc.go). A Factor is not safe for concurrent
// use: Solve uses internal workspace.
type Factor struct {
	n       int
	opt     Options
	perm    []int // perm[k] = original index of pivot k
	inv     []int // inv[i] = pivot position of original index i
	aColPtr []int // pattern of the analysed matrix, to check reuse
	aRowIdx []int

	// Lower triangle of C = P·A·Pᵀ: values in column order, the map from
	// A's entries, and the front offset of each entry.
	cp    []int
	cmap  []int
	cdiag []int // position in cx of each column's diagonal, or -1
	cx    []float64
	ci    []int     // row indices of C's lower triangle
	scale []float64 // largest |entry| of each column of C
	fo    []int     // offset of C's entry in its supernode's front

	nnzl  int     // entries of L including the diagonal (exact, no padding)
	flops float64 // Σ colcount²

	// Supernodes, in postorder: columns sfirst[s]..sfirst[s+1]-1; row
	// structure srow[sptr[s]:sptr[s+1]] (its own columns first); L block
	// lx[lptr[s]:lptr[s+1]] row-major, rows × columns.
	ns      int
	sfirst  []int
	sptr    []int
	srow    []int
	lptr    []int
	lx      []float64
	d       []float64
	cptr    []int // children of s: child[cptr[s]:cptr[s+1]], increasing
	child   []int
	relptr  []int // rel[relptr[s]:relptr[s+1]]: positions in the parent's front
	rel     []int // of s's update rows
	snodeOf []int // supernode of each column
	// Parallel plan: taskOf[s] is the worker factorising s, or -1 for
	// the top part (main); fdesc[s] is the first supernode of s's subtree;
	// rootOff[r] is where worker subtree root r left its update matrix.
	taskOf      []int
	fdesc       []int
	rootOff     []int
	workers     []*fworker
	main        *fworker
	minParallel float64 // work threshold for going parallel (0: default)
	gw          gemmPool
	y           []float64
	xblk        []float64   // SolveMany workspace: the right-hand sides, N each
	xcols       [][]float64 // SolveMany workspace: views of xblk
	tbuf        []float64   // Solve workspace: a supernode's off-diagonal rows
	ok          bool
	neg         int
	pos         int
}

// Analyze computes the ordering and the symbolic factorisation of A:
// elimination tree, column counts, supernodes and the storage of L.
func (f *Factor) Analyze(a *Matrix, opt *Options) error {
	if opt != nil {
		f.opt = *opt
	} else {
		f.opt = Options{}
	}
	if f.opt.PivotTol == 0 {
		f.opt.PivotTol = DefaultPivotTol
	}
	if f.opt.Coords != nil && len(f.opt.Coords) != a.n {
		return fmt.Errorf("sparse: Options.Coords has %d points for a matrix of order %d", len(f.opt.Coords), a.n)
	}
	n := a.n
	f.n = n
	f.ok = false
	perm0 := order(a, &f.opt)
	return f.analyzePerm(a, perm0)
}

// analyzePerm runs the symbolic analysis of a for the ordering perm0,
// which it refines by a postorder of the elimination tree.
func (f *Factor) analyzePerm(a *Matrix, perm0 []int) error {
	n := a.n
	inv := make([]int, n)
	for k, i := range perm0 {
		inv[i] = k
	}
	pat := permuteLower(a, inv)
	parent := etree(n, pat.cp, pat.ci)
	post := postorder(parent)
	f.perm = make([]int, n)
	for k, j := range post {
		f.perm[k] = perm0[j]
	}
	f.inv = inv
	for k, i := range f.perm {
		f.inv[i] = k
	}
	pat = permuteLower(a, f.inv)
	parent = etree(n, pat.cp, pat.ci)
	cc := colCounts(n, pat.cp, pat.ci, parent)
	f.nnzl, f.flops = 0, 0
	for _, c := range cc {
		f.nnzl += c
		f.flops += float64(c) * float64(c)
	}
	f.aColPtr = append(f.aColPtr[:0], a.colPtr...)
	f.aRowIdx = append(f.aRowIdx[:0], a.rowIdx...)
	f.cp, f.ci, f.cmap = pat.cp, pat.ci, pat.cmap
	f.scale = make([]float64, n)
	f.cx = make([]float64, len(pat.ci))
	f.cdiag = make([]int, n)
	for j := 0; j < n; j++ {
		f.cdiag[j] = -1
		if p := pat.cp[j]; p < pat.cp[j+1] && pat.ci[p] == j {
			f.cdiag[j] = p
		}
	}

	// Supernodes and their tree.
	f.sfirst = supernodes(n, parent, cc)
	ns := len(f.sfirst) - 1
	f.ns = ns
	snodeOf := make([]int, n)
	for s := 0; s < ns; s++ {
		for j := f.sfirst[s]; j < f.sfirst[s+1]; j++ {
			snodeOf[j] = s
		}
	}
	sparent := make([]int, ns)
	for s := 0; s < ns; s++ {
		sparent[s] = -1
		if p := parent[f.sfirst[s+1]-1]; p != -1 {
			sparent[s] = snodeOf[p]
		}
	}
	f.cptr = make([]int, ns+1)
	for s := 0; s < ns; s++ {
		if p := sparent[s]; p != -1 {
			f.cptr[p+1]++
		}
	}
	for s := 0; s < ns; s++ {
		f.cptr[s+1] += f.cptr[s]
	}
	f.child = make([]int, f.cptr[ns])
	next := make([]int, ns)
	copy(next, f.cptr[:ns])
	for s := 0; s < ns; s++ {
		if p := sparent[s]; p != -1 {
			f.child[next[p]] = s
			next[p]++
		}
	}

	// Row structures: own columns, then the union of A's rows and the
	// children's update rows beyond the last column, sorted.
	mark := make([]int, n)
	for i := range mark {
		mark[i] = -1
	}
	f.sptr = make([]int, ns+1)
	f.srow = f.srow[:0]
	for s := 0; s < ns; s++ {
		c0, c1 := f.sfirst[s], f.sfirst[s+1]
		for j := c0; j < c1; j++ {
			f.srow = append(f.srow, j)
			mark[j] = s
		}
		tail := len(f.srow)
		for j := c0; j < c1; j++ {
			for p := pat.cp[j]; p < pat.cp[j+1]; p++ {
				if i := pat.ci[p]; mark[i] != s {
					mark[i] = s
					f.srow = append(f.srow, i)
				}
			}
		}
		for _, c := range f.child[f.cptr[s]:f.cptr[s+1]] {
			cf := f.sfirst[c+1] - f.sfirst[c]
			for _, i := range f.srow[f.sptr[c]+cf : f.sptr[c+1]] {
				if mark[i] != s {
					mark[i] = s
					f.srow = append(f.srow, i)
				}
			}
		}
		sortInts(f.srow[tail:])
		f.sptr[s+1] = len(f.srow)
	}

	// Storage of L, relative indices, front offsets.
	f.lptr = make([]int, ns+1)
	f.relptr = make([]int, ns+1)
	f.fo = make([]int, len(pat.ci))
	pos := make([]int, n)
	for s := 0; s < ns; s++ {
		k := f.sfirst[s+1] - f.sfirst[s]
		rows := f.srow[f.sptr[s]:f.sptr[s+1]]
		m := len(rows)
		f.lptr[s+1] = f.lptr[s] + m*k
		for t, i := range rows {
			pos[i] = t
		}
		for j := f.sfirst[s]; j < f.sfirst[s+1]; j++ {
			for p := pat.cp[j]; p < pat.cp[j+1]; p++ {
				f.fo[p] = pos[pat.ci[p]]*k + pos[j]
			}
		}
	}
	// Relative indices of each supernode's update rows in its parent.
	for s := 0; s < ns; s++ {
		k := f.sfirst[s+1] - f.sfirst[s]
		f.relptr[s+1] = f.relptr[s] + (f.sptr[s+1] - f.sptr[s] - k)
	}
	f.rel = make([]int, f.relptr[ns])
	for s := 0; s < ns; s++ {
		rows := f.srow[f.sptr[s]:f.sptr[s+1]]
		for t, i := range rows {
			pos[i] = t
		}
		for _, c := range f.child[f.cptr[s]:f.cptr[s+1]] {
			cf := f.sfirst[c+1] - f.sfirst[c]
			for t, i := range f.srow[f.sptr[c]+cf : f.sptr[c+1]] {
				f.rel[f.relptr[c]+t] = pos[i]
			}
		}
	}
	// The numeric storage is allocated by the first Factorize.
	f.lx = nil
	f.snodeOf = snodeOf
	f.planTasks()
	f.d = make([]float64, n)
	f.y = make([]float64, n)
	maxU := 0
	for s := 0; s < ns; s++ {
		maxU = max(maxU, f.sptr[s+1]-f.sptr[s]-(f.sfirst[s+1]-f.sfirst[s]))
	}
	f.tbuf = make([]float64, maxU)
	return nil
}

// allocNumeric allocates the numeric storage sized by the analysis,
// unless the previous factorisation left it in place.
func (f *Factor) allocNumeric() {
	if f.lx != nil {
		return
	}
	f.lx = make([]float64, f.lptr[f.ns])
	if len(f.gw) < max(1, len(f.workers)) {
		f.gw = newGemmPool()
		for len(f.gw) < len(f.workers) {
			f.gw = append(f.gw, newGemmWork())
		}
	}
	// Every multiply of a front of m rows and k pivots is at most m×m×k:
	// size the panels for the largest once, rather than growing them.
	maxM, maxK := 0, 0
	for s := 0; s < f.ns; s++ {
		maxM = max(maxM, f.sptr[s+1]-f.sptr[s])
		maxK = max(maxK, f.sfirst[s+1]-f.sfirst[s])
	}
	for _, w := range f.gw {
		w.reserve(maxM, maxM, maxK)
	}
	f.main.alloc(f.gw)
	for t, w := range f.workers {
		w.alloc(f.gw[t : t+1])
	}
}

// NNZL returns the number of entries in L including its unit diagonal
// (the exact count for the ordering, without supernodal padding).
func (f *Factor) NNZL() int { return f.nnzl }

// Perm returns the ordering: Perm()[k] is the original index of pivot k.
func (f *Factor) Perm() []int { return f.perm }

func (f *Factor) samePattern(a *Matrix) bool {
	return a.n == f.n && slices.Equal(a.colPtr, f.aColPtr) && slices.Equal(a.rowIdx, f.aRowIdx)
}

// Factorize computes the numeric factorisation of A. If A's pattern differs
// from the analysed one (or Analyze was not called), it analyses A first
// with the options of the last Analyze (defaults if none). It returns a
// *PivotError naming the original column whose pivot failed.
func (f *Factor) Factorize(a *Matrix) error {
	if f.perm == nil || !f.samePattern(a) {
		opt := f.opt
		if opt.Coords != nil && len(opt.Coords) != a.n {
			opt.Coords = nil
		}
		if err := f.Analyze(a, &opt); err != nil {
			return err
		}
	}
	f.ok = false
	f.allocNumeric()
	for p, q := range f.cmap {
		f.cx[q] = a.val[p]
	}
	// Column scales: the pivot test of a column with a zero diagonal is
	// relative to the column's largest entry instead.
	clear(f.scale)
	for j := 0; j < f.n; j++ {
		for q := f.cp[j]; q < f.cp[j+1]; q++ {
			v := math.Abs(f.cx[q])
			i := f.ci[q]
			f.scale[i] = max(f.scale[i], v)
			f.scale[j] = max(f.scale[j], v)
		}
	}
	if err := f.factorNumeric(); err != nil {
		return err
	}
	f.ok = true
	return nil
}

// checkPivot applies the pivot test to pivot dj of column col (pivot
// order) and counts its sign.
func (f *Factor) checkPivot(col int, dj float64, w *fworker) error {
	diag := 0.0
	if q := f.cdiag[col]; q >= 0 {
		diag = f.cx[q]
	}
	ref := math.Abs(diag)
	if diag == 0 {
		ref = f.scale[col]
	}
	switch {
	case math.IsNaN(dj) || math.Abs(dj) <= f.opt.PivotTol*ref || ref == 0:
		return &PivotError{Col: f.perm[col], Pivot: dj, Diagonal: diag}
	case dj < 0 && f.opt.Mode == Cholesky:
		return &PivotError{Col: f.perm[col], Pivot: dj, Diagonal: diag, Negative: true}
	case dj < 0:
		w.neg++
	default:
		w.pos++
	}
	return nil
}

// Inertia returns the number of negative and positive pivots of the last
// successful factorisation. By Sylvester's law of inertia these are the
// numbers of negative and positive eigenvalues of A.
func (f *Factor) Inertia() (neg, pos int) { return f.neg, f.pos }

// Solve sets dst to the solution x of A·x = b. dst and b must have length
// N; they may be the same slice. It panics if there is no successful
// factorisation (a programming error).
func (f *Factor) Solve(dst, b []float64) {
	if !f.ok {
		panic("sparse: Solve without a successful Factorize")
	}
	x := f.y[:f.n]
	for k, i := range f.perm {
		x[k] = b[i]
	}
	f.solvePermuted(x)
	for k, i := range f.perm {
		dst[i] = x[k]
	}
}

// solveBLAS is the supernode width from which solvePermuted uses the
// (vectorised) gonum BLAS matrix-vector kernels rather than plain loops.
const solveBLAS = 8

// solvePermuted overwrites x with (L·D·Lᵀ)⁻¹·x, in pivot order.
func (f *Factor) solvePermuted(x []float64) {
	t := f.tbuf
	// Forward: L·y = b.
	for s := 0; s < f.ns; s++ {
		c0, c1 := f.sfirst[s], f.sfirst[s+1]
		k := c1 - c0
		rows := f.srow[f.sptr[s]:f.sptr[s+1]]
		u := len(rows) - k
		lx := f.lx[f.lptr[s]:f.lptr[s+1]]
		xs := x[c0:c1]
		if k >= solveBLAS {
			blas64.Trsv(blas.NoTrans, blas64.Triangular{Uplo: blas.Lower, Diag: blas.Unit, N: k, Stride: k, Data: lx[:k*k]}, blas64.Vector{N: k, Inc: 1, Data: xs})
			if u > 0 {
				ts := t[:u]
				blas64.Gemv(blas.NoTrans, 1, blas64.General{Rows: u, Cols: k, Stride: k, Data: lx[k*k:]}, blas64.Vector{N: k, Inc: 1, Data: xs}, 0, blas64.Vector{N: u, Inc: 1, Data: ts})
				for i, r := range rows[k:] {
					x[r] -= ts[i]
				}
			}
			continue
		}
		for j := 1; j < k; j++ {
			lj := lx[j*k : j*k+j]
			v := xs[j]
			for c, l := range lj {
				v -= l * xs[c]
			}
			xs[j] = v
		}
		for i := k; i < len(rows); i++ {
			li := lx[i*k : (i+1)*k]
			v := 0.0
			for c, l := range li {
				v += l * xs[c]
			}
			x[rows[i]] -= v
		}
	}
	for j, dj := range f.d {
		x[j] /= dj
	}
	// Backward: Lᵀ·x = y.
	for s := f.ns - 1; s >= 0; s-- {
		c0, c1 := f.sfirst[s], f.sfirst[s+1]
		k := c1 - c0
		rows := f.srow[f.sptr[s]:f.sptr[s+1]]
		u := len(rows) - k
		lx := f.lx[f.lptr[s]:f.lptr[s+1]]
		xs := x[c0:c1]
		if k >= solveBLAS {
			if u > 0 {
				ts := t[:u]
				for i, r := range rows[k:] {
					ts[i] = x[r]
				}
				blas64.Gemv(blas.Trans, -1, blas64.General{Rows: u, Cols: k, Stride: k, Data: lx[k*k:]}, blas64.Vector{N: u, Inc: 1, Data: ts}, 1, blas64.Vector{N: k, Inc: 1, Data: xs})
			}
			blas64.Trsv(blas.Trans, blas64.Triangular{Uplo: blas.Lower, Diag: blas.Unit, N: k, Stride: k, Data: lx[:k*k]}, blas64.Vector{N: k, Inc: 1, Data: xs})
			continue
		}
		for i := k; i < len(rows); i++ {
			li := lx[i*k : (i+1)*k]
			xi := x[rows[i]]
			if xi == 0 {
				continue
			}
			for c, l := range li {
				xs[c] -= l * xi
			}
		}
		for i := k - 1; i > 0; i-- {
			li := lx[i*k : i*k+i]
			xi := xs[i]
			for c, l := range li {
				xs[c] -= l * xi
			}
		}
	}
}

// Residual returns the relative residual ‖A·x − b‖₂ / ‖b‖₂ (or ‖A·x‖₂ when
// b is zero).
func Residual(a *Matrix, x, b []float64) float64 {
	r := make([]float64, a.n)
	a.MulVec(r, x)
	var rn, bn float64
	for i := range r {
		d := r[i] - b[i]
		rn += d * d
		bn += b[i] * b[i]
	}
	if bn == 0 {
		return math.Sqrt(rn)
	}
	return math.Sqrt(rn / bn)
}
