package sparse

import (
	"runtime"
	"sync"
)

// parallelFlops is the multiply size (r·c·k) above which gemm work is
// shared between goroutines.
const parallelFlops = 1 << 21

// gemmPool holds one packing workspace per goroutine that may run a
// share of a large multiply.
type gemmPool []*gemmWork

func newGemmPool() gemmPool {
	n := runtime.GOMAXPROCS(0)
	p := make(gemmPool, n)
	for i := range p {
		p[i] = newGemmWork()
	}
	return p
}

// gemmNT sets C −= A·Bᵀ as gemmWork.gemmNT does, splitting the rows of C
// between the pool's workspaces when the multiply is large.
func (p gemmPool) gemmNT(r, c, k int, a []float64, lda int, b []float64, ldb int, cc []float64, ldc int, lower bool) {
	nw := min(len(p), runtime.GOMAXPROCS(0))
	if nw <= 1 || r*c*k < parallelFlops || r < 8*nw {
		p[0].gemmNT(r, c, k, a, lda, b, ldb, cc, ldc, lower)
		return
	}
	// Row bounds giving each worker an equal share of the work: row i
	// costs min(i+1, c) tiles when lower, c otherwise.
	cost := func(i int) float64 {
		if lower {
			return float64(min(i+1, c))
		}
		return float64(c)
	}
	total := 0.0
	for i := 0; i < r; i++ {
		total += cost(i)
	}
	bounds := make([]int, 0, nw+1)
	bounds = append(bounds, 0)
	acc := 0.0
	for i := 0; i < r && len(bounds) < nw; i++ {
		acc += cost(i)
		if acc >= total*float64(len(bounds))/float64(nw) {
			bounds = append(bounds, (i+1)/4*4)
		}
	}
	bounds = append(bounds, r)
	var wg sync.WaitGroup
	for t := 0; t+1 < len(bounds); t++ {
		i0, i1 := bounds[t], bounds[t+1]
		if i1 <= i0 {
			continue
		}
		cols := c
		if lower {
			cols = min(c, i1)
		}
		wg.Add(1)
		go func(w *gemmWork) {
			defer wg.Done()
			// Rows i0..i1 of C; with lower, C's diagonal is at column i.
			if lower {
				w.gemmRowsLower(i0, i1, cols, k, a, lda, b, ldb, cc, ldc)
			} else {
				w.gemmNT(i1-i0, cols, k, a[i0*lda:], lda, b, ldb, cc[i0*ldc:], ldc, false)
			}
		}(p[t])
	}
	wg.Wait()
}

// gemmRowsLower computes rows i0..i1 of a lower-triangle update C −= A·Bᵀ
// (columns 0..cols), keeping the diagonal alignment of the whole block.
func (w *gemmWork) gemmRowsLower(i0, i1, cols, k int, a []float64, lda int, b []float64, ldb int, cc []float64, ldc int) {
	// The rectangle left of row block's diagonal band is full; the band
	// [i0, i1) × [i0, min(cols, i1)) is lower-triangular.
	if left := min(i0, cols); left > 0 {
		w.gemmNT(i1-i0, left, k, a[i0*lda:], lda, b, ldb, cc[i0*ldc:], ldc, false)
	}
	if cols > i0 {
		w.gemmNT(i1-i0, cols-i0, k, a[i0*lda:], lda, b[i0*ldb:], ldb, cc[i0*ldc+i0:], ldc, true)
	}
}
