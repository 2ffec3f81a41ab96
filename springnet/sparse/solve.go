package sparse

import (
	"fmt"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
	"gonum.org/v1/gonum/floats"
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
	xs := f.block(nr)
	for r, br := range b {
		x := xs[r]
		for k, i := range f.perm {
			x[k] = br[i]
		}
	}
	f.solveCols(xs)
	for r, dr := range dst {
		x := xs[r]
		for k, i := range f.perm {
			dr[i] = x[k]
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
	xs := f.block(nrhs)
	for r, x := range xs {
		col := b[r*n : (r+1)*n]
		for k, i := range f.perm {
			x[k] = col[i]
		}
	}
	f.solveCols(xs)
	for r, x := range xs {
		col := dst[r*n : (r+1)*n]
		for k, i := range f.perm {
			col[i] = x[k]
		}
	}
}

// block returns the workspace for nr right-hand sides in pivot order, one
// slice of length N each, grown if needed.
func (f *Factor) block(nr int) [][]float64 {
	if len(f.xblk) < f.n*nr {
		f.xblk = make([]float64, f.n*nr)
	}
	if len(f.xcols) < nr {
		f.xcols = make([][]float64, nr)
	}
	xs := f.xcols[:nr]
	for r := range xs {
		xs[r] = f.xblk[r*f.n : (r+1)*f.n]
	}
	return xs
}

// solveCols overwrites every xs[r] (pivot order) with (L·D·Lᵀ)⁻¹·xs[r].
// It is solvePermuted with the right-hand sides inside the loops over
// the rows of L, so each row of a supernode's off-diagonal block is read
// from memory once for all of them (those reads dominate a solve).
func (f *Factor) solveCols(xs [][]float64) {
	// Forward: L·y = b.
	for s := 0; s < f.ns; s++ {
		c0, c1 := f.sfirst[s], f.sfirst[s+1]
		k := c1 - c0
		rows := f.srow[f.sptr[s]:f.sptr[s+1]]
		lx := f.lx[f.lptr[s]:f.lptr[s+1]]
		if k >= solveBLAS {
			tri := blas64.Triangular{Uplo: blas.Lower, Diag: blas.Unit, N: k, Stride: k, Data: lx[:k*k]}
			for _, x := range xs {
				blas64.Trsv(blas.NoTrans, tri, blas64.Vector{N: k, Inc: 1, Data: x[c0:c1]})
			}
			for i, r := range rows[k:] {
				li := lx[(k+i)*k : (k+i+1)*k]
				for _, x := range xs {
					x[r] -= floats.Dot(li, x[c0:c1])
				}
			}
			continue
		}
		for _, x := range xs {
			xv := x[c0:c1]
			for j := 1; j < k; j++ {
				lj := lx[j*k : j*k+j]
				v := xv[j]
				for c, l := range lj {
					v -= l * xv[c]
				}
				xv[j] = v
			}
		}
		for i := k; i < len(rows); i++ {
			li := lx[i*k : (i+1)*k]
			r := rows[i]
			for _, x := range xs {
				xv := x[c0:c1]
				v := 0.0
				for c, l := range li {
					v += l * xv[c]
				}
				x[r] -= v
			}
		}
	}
	for _, x := range xs {
		for j, dj := range f.d {
			x[j] /= dj
		}
	}
	// Backward: Lᵀ·x = y.
	for s := f.ns - 1; s >= 0; s-- {
		c0, c1 := f.sfirst[s], f.sfirst[s+1]
		k := c1 - c0
		rows := f.srow[f.sptr[s]:f.sptr[s+1]]
		lx := f.lx[f.lptr[s]:f.lptr[s+1]]
		for i := k; i < len(rows); i++ {
			li := lx[i*k : (i+1)*k]
			r := rows[i]
			for _, x := range xs {
				xi := x[r]
				if xi == 0 {
					continue
				}
				if k >= solveBLAS {
					floats.AddScaled(x[c0:c1], -xi, li)
					continue
				}
				xv := x[c0:c1]
				for c, l := range li {
					xv[c] -= l * xi
				}
			}
		}
		if k >= solveBLAS {
			tri := blas64.Triangular{Uplo: blas.Lower, Diag: blas.Unit, N: k, Stride: k, Data: lx[:k*k]}
			for _, x := range xs {
				blas64.Trsv(blas.Trans, tri, blas64.Vector{N: k, Inc: 1, Data: x[c0:c1]})
			}
			continue
		}
		for _, x := range xs {
			xv := x[c0:c1]
			for i := k - 1; i > 0; i-- {
				li := lx[i*k : i*k+i]
				xi := xv[i]
				for c, l := range li {
					xv[c] -= l * xi
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
