//go:build !amd64 || purego

package sparse

// kern4x8 sets C[i][j] -= Σ_t a[4t+i]·b[8t+j] for the 4×8 tile at c.
func kern4x8(k int, a, b, c []float64, ldc int) { kern4x8go(k, a, b, c, ldc) }

// useAVX is false: there is only the portable kernel.
var useAVX = false
