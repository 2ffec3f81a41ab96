package sparse

import (
	"errors"
	"math/rand/v2"
	"runtime"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestParallelMatchesSerial forces the subtree-parallel factorisation on
// a mid-size problem and checks it produces the same bits as the serial
// one (every entry is computed by the same operations in the same order),
// the same inertia, and the same failing column on a singular matrix.
func TestParallelMatchesSerial(t *testing.T) {
	if runtime.GOMAXPROCS(0) < 2 {
		defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(2))
	}
	rng := rand.New(rand.NewPCG(1, 1))
	a, _ := randomSym(rng, 1500, 6, -1)
	factor := func(a *Matrix, minPar float64) (*Factor, error) {
		f := &Factor{minParallel: minPar}
		require.NoError(t, f.Analyze(a, &Options{Mode: LDLT, Ordering: NestedDissection}))
		return f, f.Factorize(a)
	}
	par, err := factor(a, 1)
	require.NoError(t, err)
	require.NotEmpty(t, par.workers, "the plan has worker subtrees")
	ser, err := factor(a, 1e300)
	require.NoError(t, err)
	require.Empty(t, ser.workers)
	assert.Equal(t, ser.lx, par.lx)
	assert.Equal(t, ser.d, par.d)
	sn, sp := ser.Inertia()
	pn, pp := par.Inertia()
	assert.Equal(t, [2]int{sn, sp}, [2]int{pn, pp})

	// Zero a row and column: that original index must be reported.
	const dead = 321
	for j := 0; j < a.n; j++ {
		for p := a.colPtr[j]; p < a.colPtr[j+1]; p++ {
			if j == dead || a.rowIdx[p] == dead {
				a.val[p] = 0
			}
		}
	}
	for _, minPar := range []float64{1, 1e300} {
		_, err := factor(a, minPar)
		var pe *PivotError
		require.True(t, errors.As(err, &pe), "error %v", err)
		assert.Equal(t, dead, pe.Col)
	}
}

// TestRefactorAllocates checks that a refactorisation with the analysed
// pattern reuses the storage of the first one (the Factor doc promises
// it): no allocation on one goroutine and, on the subtree-parallel
// path, only the bookkeeping of starting the workers.
func TestRefactorAllocates(t *testing.T) {
	if runtime.GOMAXPROCS(0) < 2 {
		defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(2))
	}
	rng := rand.New(rand.NewPCG(1, 1))
	a, _ := randomSym(rng, 1500, 6, -1)
	for _, tc := range []struct {
		name   string
		minPar float64
		// allowed allocations per refactorisation besides one per
		// worker goroutine (its closure), with their reason
		allowed float64
	}{
		// One goroutine: nothing at all.
		{"serial", 1e300, 0},
		// factorSubtrees' error slice and its WaitGroup, both shared with
		// the worker goroutines and so on the heap.
		{"parallel", 1, 2},
	} {
		t.Run(tc.name, func(t *testing.T) {
			f := &Factor{minParallel: tc.minPar}
			require.NoError(t, f.Analyze(a, &Options{Mode: LDLT, Ordering: NestedDissection}))
			require.NoError(t, f.Factorize(a))
			require.Equal(t, tc.minPar == 1, len(f.workers) > 0, "parallel plan as intended")
			var err error
			allocs := testing.AllocsPerRun(5, func() { err = f.Factorize(a) })
			require.NoError(t, err)
			t.Logf("%.1f allocations per refactorisation", allocs)
			assert.LessOrEqual(t, allocs, tc.allowed+float64(len(f.workers)))
		})
	}
}

// TestGemmWorkSized checks that the packing panels are sized by the
// multiplies of the problem: a small matrix, whose fronts are a few
// columns wide, must not get the full gemmNC×gemmKC panel (4 MB).
func TestGemmWorkSized(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	a, _ := randomSym(rng, 200, 4, -1)
	var f Factor
	require.NoError(t, f.Analyze(a, &Options{Mode: LDLT}))
	require.NoError(t, f.Factorize(a))
	require.NotEmpty(t, f.gw)
	for _, w := range f.gw {
		assert.Less(t, len(w.bp), gemmNC*gemmKC/8)
		assert.Less(t, len(w.ap), gemmMC*gemmKC)
	}
}
