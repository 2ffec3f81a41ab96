//go:build amd64 && !purego

package sparse

//go:noescape
func kern6x8avx(k int, a, b, c *float64, ldc int)

func cpuid(eaxArg, ecxArg uint32) (eax, ebx, ecx, edx uint32)

func xgetbv() (eax, edx uint32)

// hasAVX2FMA reports whether the CPU and OS support AVX2 and FMA3.
func hasAVX2FMA() bool {
	maxID, _, _, _ := cpuid(0, 0)
	if maxID < 7 {
		return false
	}
	_, _, ecx1, _ := cpuid(1, 0)
	const fma, osxsave, avx = 1 << 12, 1 << 27, 1 << 28
	if ecx1&fma == 0 || ecx1&osxsave == 0 || ecx1&avx == 0 {
		return false
	}
	if xcr0, _ := xgetbv(); xcr0&6 != 6 {
		return false
	}
	_, ebx7, _, _ := cpuid(7, 0)
	return ebx7&(1<<5) != 0
}

// useAVX is fixed at start-up from the CPU's features (read-only after).
var useAVX = hasAVX2FMA()

// kern6x8 sets C[i][j] -= Σ_t a[6t+i]·b[8t+j] for the 6×8 tile at c.
func kern6x8(k int, a, b, c []float64, ldc int) {
	if useAVX && k > 0 {
		_ = a[6*k-1]
		_ = b[8*k-1]
		_ = c[5*ldc+7]
		kern6x8avx(k, &a[0], &b[0], &c[0], ldc)
		return
	}
	kern6x8go(k, a, b, c, ldc)
}
