package sparse

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestGemmPacked checks the packed multiply (both the assembly and the
// portable tile kernel) against the textbook triple loop.
func TestGemmPacked(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	w := newGemmWork()
	for _, sz := range [][3]int{{1, 1, 1}, {4, 8, 3}, {5, 9, 300}, {37, 21, 17}, {130, 70, 260}, {300, 2100, 40}} {
		for _, lower := range []bool{false, true} {
			for _, avx := range []bool{false, true} {
				t.Run(fmt.Sprintf("%v/lower%v/avx%v", sz, lower, avx), func(t *testing.T) {
					r, c, k := sz[0], sz[1], sz[2]
					lda, ldb, ldc := k+3, k+1, c+2
					a := make([]float64, r*lda)
					b := make([]float64, c*ldb)
					cc := make([]float64, r*ldc)
					for _, x := range [][]float64{a, b, cc} {
						for i := range x {
							x[i] = rng.Float64() - 0.5
						}
					}
					want := append([]float64(nil), cc...)
					for i := 0; i < r; i++ {
						for j := 0; j < c; j++ {
							s := 0.0
							for q := 0; q < k; q++ {
								s += a[i*lda+q] * b[j*ldb+q]
							}
							want[i*ldc+j] -= s
						}
					}
					saved := useAVX
					useAVX = avx && saved
					defer func() { useAVX = saved }()
					w.gemmPacked(r, c, k, a, lda, b, ldb, cc, ldc, lower)
					worst := 0.0
					for i := 0; i < r; i++ {
						for j := 0; j < c; j++ {
							if lower && j > i {
								continue
							}
							worst = math.Max(worst, math.Abs(cc[i*ldc+j]-want[i*ldc+j]))
						}
					}
					// Sums of k products of numbers below 1/2: rounding
					// error below k·ε in any summation order.
					assert.Less(t, worst, float64(k+1)*1e-15)
				})
			}
		}
	}
}

// TestGemmPoolSplit checks the row split between goroutines against the
// single-workspace multiply (same tile sums, so the same bits per entry).
func TestGemmPoolSplit(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	pool := gemmPool{newGemmWork(), newGemmWork(), newGemmWork()}
	for _, lower := range []bool{false, true} {
		r, c, k := 301, 301, 90
		if !lower {
			c = 157
		}
		a := make([]float64, r*k)
		b := make([]float64, c*k)
		cc := make([]float64, r*c)
		for _, x := range [][]float64{a, b, cc} {
			for i := range x {
				x[i] = rng.Float64() - 0.5
			}
		}
		want := append([]float64(nil), cc...)
		pool[0].gemmPacked(r, c, k, a, k, b, k, want, c, lower)
		pool.gemmNT(r, c, k, a, k, b, k, cc, c, lower)
		bad := 0
		for i := 0; i < r; i++ {
			for j := 0; j < c; j++ {
				if (!lower || j <= i) && math.Abs(cc[i*c+j]-want[i*c+j]) > float64(k)*1e-15 {
					bad++
				}
			}
		}
		assert.Zero(t, bad, "lower=%v", lower)
	}
}
