//go:build !amd64 || purego

package sparse

// kern6x8 sets C[i][j] -= Σ_t a[6t+i]·b[8t+j] for the 6×8 tile at c.
func kern6x8(k int, a, b, c []float64, ldc int) { kern6x8go(k, a, b, c, ldc) }

// useAVX is false: there is only the portable kernel.
var useAVX = false
