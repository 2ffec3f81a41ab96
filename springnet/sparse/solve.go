package sparse

import (
	"fmt"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
)

// SolveMany solves A·x = b for several right-hand sides at once, reading
// L once for all of them: dst[r] receives the solution for b[r]. Every
// slice must have length N; dst[r] may be b[r]. It panics if there is no
// successful factorisation or the shapes are wrong (programming errors).
func (f *Factor) SolveMany(dst, b [][]float64) {
	if !f.ok {
		panic("sparse: SolveMany without a successful Factorize")
	}
	if len(dst) != len(b) {
		panic(fmt.Sprintf("sparse: SolveMany with %d solutions for %d right-hand sides", len(dst), len(b)))
	}
	nr := len(b)
	if nr == 0 {
		return
	}
	x := f.block(nr)
	for r, br := range b {
		for k, i := range f.perm {
			x[k*nr+r] = br[i]
		}
	}
	f.solveBlock(x, nr)
	for r, dr := range dst {
		for k, i := range f.perm {
			dr[i] = x[k*nr+r]
		}
	}
}

// SolveBlock solves A·X = B for the nrhs columns of the column-major N×nrhs
// block b, writing X to dst (same shape; it may be b). It panics if there
// is no successful factorisation or the lengths are wrong.
func (f *Factor) SolveBlock(dst, b []float64, nrhs int) {
	if !f.ok {
		panic("sparse: SolveBlock without a successful Factorize")
	}
	n := f.n
	if nrhs < 0 || len(b) != n*nrhs || len(dst) != n*nrhs {
		panic(fmt.Sprintf("sparse: SolveBlock with lengths %d and %d for %d×%d", len(dst), len(b), n, nrhs))
	}
	if nrhs == 0 {
		return
	}
	x := f.block(nrhs)
	for r := 0; r < nrhs; r++ {
		col := b[r*n : (r+1)*n]
		for k, i := range f.perm {
			x[k*nrhs+r] = col[i]
		}
	}
	f.solveBlock(x, nrhs)
	for r := 0; r < nrhs; r++ {
		col := dst[r*n : (r+1)*n]
		for k, i := range f.perm {
			col[i] = x[k*nrhs+r]
		}
	}
}

// block returns the workspace for nr right-hand sides, grown if needed.
func (f *Factor) block(nr int) []float64 {
	if len(f.xblk) < f.n*nr {
		f.xblk = make([]float64, f.n*nr)
	}
	if len(f.tblk) < len(f.tbuf)*nr {
		f.tblk = make([]float64, len(f.tbuf)*nr)
	}
	return f.xblk[:f.n*nr]
}

// blockBLAS is the supernode width from which solveBlock uses the gonum
// BLAS level-3 kernels (triangular solve and multiply on the block of
// right-hand sides) rather than plain loops.
const blockBLAS = 8

// solveBlock overwrites the row-major N×nr block x (pivot order) with
// (L·D·Lᵀ)⁻¹·x.
func (f *Factor) solveBlock(x []float64, nr int) {
	row := func(i int) []float64 { return x[i*nr : (i+1)*nr] }
	for s := 0; s < f.ns; s++ {
		c0, c1 := f.sfirst[s], f.sfirst[s+1]
		k := c1 - c0
		rows := f.srow[f.sptr[s]:f.sptr[s+1]]
		lx := f.lx[f.lptr[s]:f.lptr[s+1]]
		if k >= blockBLAS && nr > 1 {
			xs := blas64.General{Rows: k, Cols: nr, Stride: nr, Data: x[c0*nr : c1*nr]}
			blas64.Trsm(blas.Left, blas.NoTrans, 1, blas64.Triangular{Uplo: blas.Lower, Diag: blas.Unit, N: k, Stride: k, Data: lx[:k*k]}, xs)
			if u := len(rows) - k; u > 0 {
				t := f.tblk[:u*nr]
				blas64.Gemm(blas.NoTrans, blas.NoTrans, 1, blas64.General{Rows: u, Cols: k, Stride: k, Data: lx[k*k:]}, xs, 0, blas64.General{Rows: u, Cols: nr, Stride: nr, Data: t})
				for i, r := range rows[k:] {
					xi := row(r)
					for q, v := range t[i*nr : (i+1)*nr] {
						xi[q] -= v
					}
				}
			}
			continue
		}
		for i := 1; i < len(rows); i++ {
			li := lx[i*k : i*k+min(i, k)]
			xi := row(rows[i])
			for c, l := range li {
				if l == 0 {
					continue
				}
				xc := row(c0 + c)
				for q, v := range xc {
					xi[q] -= l * v
				}
			}
		}
	}
	for j, dj := range f.d {
		xj := row(j)
		for q := range xj {
			xj[q] /= dj
		}
	}
	for s := f.ns - 1; s >= 0; s-- {
		c0, c1 := f.sfirst[s], f.sfirst[s+1]
		k := c1 - c0
		rows := f.srow[f.sptr[s]:f.sptr[s+1]]
		lx := f.lx[f.lptr[s]:f.lptr[s+1]]
		if k >= blockBLAS && nr > 1 {
			xs := blas64.General{Rows: k, Cols: nr, Stride: nr, Data: x[c0*nr : c1*nr]}
			if u := len(rows) - k; u > 0 {
				t := f.tblk[:u*nr]
				for i, r := range rows[k:] {
					copy(t[i*nr:(i+1)*nr], row(r))
				}
				blas64.Gemm(blas.Trans, blas.NoTrans, -1, blas64.General{Rows: u, Cols: k, Stride: k, Data: lx[k*k:]}, blas64.General{Rows: u, Cols: nr, Stride: nr, Data: t}, 1, xs)
			}
			blas64.Trsm(blas.Left, blas.Trans, 1, blas64.Triangular{Uplo: blas.Lower, Diag: blas.Unit, N: k, Stride: k, Data: lx[:k*k]}, xs)
			continue
		}
		for i := len(rows) - 1; i > 0; i-- {
			li := lx[i*k : i*k+min(i, k)]
			xi := row(rows[i])
			for c, l := range li {
				if l == 0 {
					continue
				}
				xc := row(c0 + c)
				for q, v := range xi {
					xc[q] -= l * v
				}
			}
		}
	}
}

// Stats describes a factorisation's size.
type Stats struct {
	N          int     // order of the matrix
	NNZA       int     // stored entries of A (lower triangle)
	NNZL       int     // entries of L including the diagonal, without padding
	Stored     int     // values stored for L, supernodal padding included
	Supernodes int     // number of supernodes
	MaxFront   int     // order of the largest front
	Flops      float64 // Σ_j c_j², c_j the entries of column j of L: the usual flop count of the factorisation
}

// Stats returns the sizes of the last analysis.
func (f *Factor) Stats() Stats {
	st := Stats{N: f.n, NNZA: len(f.aRowIdx), NNZL: f.nnzl, Stored: f.lptr[f.ns], Supernodes: f.ns, Flops: f.flops}
	for s := 0; s < f.ns; s++ {
		st.MaxFront = max(st.MaxFront, f.sptr[s+1]-f.sptr[s])
	}
	return st
}
