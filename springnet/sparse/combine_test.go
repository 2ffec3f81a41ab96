package sparse

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/mat"
)

// TestCombineMatchesBuilder fills the union pattern of two random
// matrices with a + α·b for several α and checks it against the matrix a
// Builder assembles from a's entries and α·b's (same pattern, same values
// to the bit, as Combine documents) and against gonum's dense A + α·B
// (the reference for the values).
func TestCombineMatchesBuilder(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	const n = 120
	a, ad := randomSym(rng, n, 4, 1)
	b, bd := randomSym(rng, n, 3, -1)
	dst, err := Union(a, b)
	require.NoError(t, err)
	// The random patterns differ: the union has entries of each alone.
	require.Greater(t, dst.NNZ(), a.NNZ())
	require.Greater(t, dst.NNZ(), b.NNZ())
	for _, alpha := range []float64{0, 1, -3.7e5, 2.5e-3} {
		t.Run(fmt.Sprintf("alpha=%g", alpha), func(t *testing.T) {
			require.NoError(t, Combine(dst, a, alpha, b))
			bld := NewBuilder(n)
			for j := 0; j < n; j++ {
				rows, vals := a.Col(j)
				for p, i := range rows {
					bld.Add(i, j, vals[p])
				}
				rows, vals = b.Col(j)
				for p, i := range rows {
					bld.Add(i, j, alpha*vals[p])
				}
			}
			want := bld.Matrix()
			assert.Equal(t, want.colPtr, dst.colPtr)
			assert.Equal(t, want.rowIdx, dst.rowIdx)
			assert.Equal(t, want.val, dst.val)
			var sum mat.SymDense
			sum.ScaleSym(alpha, bd)
			sum.AddSym(ad, &sum)
			// Tolerance: one rounding of each sum (gonum and Combine may
			// round α·b_ij + a_ij in either order of operations).
			const tol = 1e-15
			for j := 0; j < n; j++ {
				for i := j; i < n; i++ {
					w := sum.At(i, j)
					assert.InDelta(t, w, dst.At(i, j), tol*(1+math.Abs(w)), "(%d, %d)", i, j)
				}
			}
		})
	}
}

// TestCombineErrors checks the two misuses Combine and Union report.
func TestCombineErrors(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	a, _ := randomSym(rng, 50, 4, 1)
	b, _ := randomSym(rng, 50, 4, 1)
	c, _ := randomSym(rng, 40, 4, 1)
	_, err := Union(a, c)
	assert.ErrorContains(t, err, "sparse: Union of matrices of order 50 and 40")
	assert.ErrorContains(t, Combine(a, a, 1, c), "sparse: Combine into order 50")
	// a's pattern alone cannot hold b's entries.
	dst, err := Union(a, a)
	require.NoError(t, err)
	assert.ErrorContains(t, Combine(dst, a, 1, b), "outside the destination's pattern")
}
