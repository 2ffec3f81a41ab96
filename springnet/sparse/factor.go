package sparse

import (
	"fmt"
	"math"
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
	// |d_k| <= PivotTol·|a_kk| marks column k as singular. Default 1e-11.
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
// the same pattern and new values without a new Analyze.
type Factor struct {
	n        int
	opt      Options
	perm     []int // perm[k] = original index of pivot k
	inv      []int // inv[i] = pivot position of original index i
	aColPtr  []int // pattern of the analysed matrix, to check reuse
	aRowIdx  []int
	cp, ci   []int // upper triangle of P·A·Pᵀ, CSC
	cmap     []int // position in c of each stored entry of A
	cx       []float64
	parent   []int
	lp       []int
	li       []int
	lx       []float64
	d        []float64
	lnz      []int
	flag     []int
	pattern  []int
	y        []float64
	ok       bool
	neg, pos int
}

// Analyze computes the ordering and the symbolic factorisation of A.
func (f *Factor) Analyze(a *Matrix, opt *Options) error {
	if opt != nil {
		f.opt = *opt
	} else {
		f.opt = Options{}
	}
	if f.opt.PivotTol == 0 {
		f.opt.PivotTol = DefaultPivotTol
	}
	n := a.n
	f.n = n
	f.ok = false
	f.perm = order(a, &f.opt)
	f.inv = make([]int, n)
	for k, i := range f.perm {
		f.inv[i] = k
	}
	f.aColPtr = append(f.aColPtr[:0], a.colPtr...)
	f.aRowIdx = append(f.aRowIdx[:0], a.rowIdx...)

	// Upper triangle of C = P·A·Pᵀ in CSC, with a map from A's entries.
	f.cp = make([]int, n+1)
	for j := 0; j < n; j++ {
		for p := a.colPtr[j]; p < a.colPtr[j+1]; p++ {
			pi, pj := f.inv[a.rowIdx[p]], f.inv[j]
			f.cp[max(pi, pj)+1]++
		}
	}
	for k := 0; k < n; k++ {
		f.cp[k+1] += f.cp[k]
	}
	next := append([]int(nil), f.cp[:n]...)
	f.ci = make([]int, a.NNZ())
	f.cx = make([]float64, a.NNZ())
	f.cmap = make([]int, a.NNZ())
	for j := 0; j < n; j++ {
		for p := a.colPtr[j]; p < a.colPtr[j+1]; p++ {
			pi, pj := f.inv[a.rowIdx[p]], f.inv[j]
			col, row := max(pi, pj), min(pi, pj)
			q := next[col]
			next[col]++
			f.ci[q] = row
			f.cmap[p] = q
		}
	}

	// Elimination tree and column counts (Davis, LDL, ACM TOMS 2005).
	f.parent = make([]int, n)
	f.lnz = make([]int, n)
	f.flag = make([]int, n)
	for k := 0; k < n; k++ {
		f.parent[k] = -1
		f.flag[k] = k
		for p := f.cp[k]; p < f.cp[k+1]; p++ {
			for i := f.ci[p]; i < k && f.flag[i] != k; i = f.parent[i] {
				if f.parent[i] == -1 {
					f.parent[i] = k
				}
				f.lnz[i]++
				f.flag[i] = k
			}
		}
	}
	f.lp = make([]int, n+1)
	for k := 0; k < n; k++ {
		f.lp[k+1] = f.lp[k] + f.lnz[k]
	}
	f.li = make([]int, f.lp[n])
	f.lx = make([]float64, f.lp[n])
	f.d = make([]float64, n)
	f.pattern = make([]int, n)
	f.y = make([]float64, n)
	return nil
}

// NNZL returns the number of entries in L including its unit diagonal.
func (f *Factor) NNZL() int { return len(f.li) + f.n }

// Perm returns the ordering: Perm()[k] is the original index of pivot k.
func (f *Factor) Perm() []int { return f.perm }

func (f *Factor) samePattern(a *Matrix) bool {
	if a.n != f.n || len(a.rowIdx) != len(f.aRowIdx) {
		return false
	}
	for i, v := range a.colPtr {
		if f.aColPtr[i] != v {
			return false
		}
	}
	for i, v := range a.rowIdx {
		if f.aRowIdx[i] != v {
			return false
		}
	}
	return true
}

// Factorize computes the numeric factorisation of A. If A's pattern differs
// from the analysed one (or Analyze was not called), it analyses A first
// with default options. It returns a *PivotError naming the original column
// whose pivot failed.
func (f *Factor) Factorize(a *Matrix) error {
	if f.perm == nil || !f.samePattern(a) {
		opt := f.opt
		if err := f.Analyze(a, &opt); err != nil {
			return err
		}
	}
	f.ok = false
	n := f.n
	for i := range f.cx {
		f.cx[i] = 0
	}
	for p, q := range f.cmap {
		f.cx[q] += a.val[p]
	}
	f.neg, f.pos = 0, 0
	y, flag, pattern := f.y, f.flag, f.pattern
	for k := 0; k < n; k++ {
		y[k] = 0
		top := n
		flag[k] = k
		f.lnz[k] = 0
		diag := 0.0
		for p := f.cp[k]; p < f.cp[k+1]; p++ {
			i := f.ci[p]
			y[i] += f.cx[p]
			if i == k {
				diag = f.cx[p]
			}
			l := 0
			for ; flag[i] != k; i = f.parent[i] {
				pattern[l] = i
				l++
				flag[i] = k
			}
			for l > 0 {
				top--
				l--
				pattern[top] = pattern[l]
			}
		}
		dk := y[k]
		y[k] = 0
		for ; top < n; top++ {
			i := pattern[top]
			yi := y[i]
			y[i] = 0
			p2 := f.lp[i] + f.lnz[i]
			for p := f.lp[i]; p < p2; p++ {
				y[f.li[p]] -= f.lx[p] * yi
			}
			lki := yi / f.d[i]
			dk -= lki * yi
			f.li[p2] = k
			f.lx[p2] = lki
			f.lnz[i]++
		}
		f.d[k] = dk
		tol := f.opt.PivotTol * math.Abs(diag)
		switch {
		case math.IsNaN(dk) || math.Abs(dk) <= tol || diag == 0:
			return &PivotError{Col: f.perm[k], Pivot: dk, Diagonal: diag}
		case dk < 0 && f.opt.Mode == Cholesky:
			return &PivotError{Col: f.perm[k], Pivot: dk, Diagonal: diag, Negative: true}
		case dk < 0:
			f.neg++
		default:
			f.pos++
		}
	}
	f.ok = true
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
	n := f.n
	x := f.y[:n]
	for k := 0; k < n; k++ {
		x[k] = b[f.perm[k]]
	}
	for j := 0; j < n; j++ {
		xj := x[j]
		for p := f.lp[j]; p < f.lp[j+1]; p++ {
			x[f.li[p]] -= f.lx[p] * xj
		}
	}
	for j := 0; j < n; j++ {
		x[j] /= f.d[j]
	}
	for j := n - 1; j >= 0; j-- {
		s := x[j]
		for p := f.lp[j]; p < f.lp[j+1]; p++ {
			s -= f.lx[p] * x[f.li[p]]
		}
		x[j] = s
	}
	for k := 0; k < n; k++ {
		dst[f.perm[k]] = x[k]
	}
	for k := range x {
		x[k] = 0
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
