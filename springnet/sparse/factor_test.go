package sparse

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/mat"
)

// TestFactorAgainstDense checks the sparse solve against gonum's dense
// Cholesky (the reference) on small random diagonally dominant SPD
// matrices, factorised without a prior Analyze.
func TestFactorAgainstDense(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for trial := 0; trial < 20; trial++ {
		n := 5 + rng.IntN(60)
		a, dense := randomSym(rng, n, 6, 1) // SPD: diagonal = off-diagonal row sum + 1
		rhs := make([]float64, n)
		for i := range rhs {
			rhs[i] = rng.Float64()
		}
		var f Factor
		require.NoError(t, f.Factorize(a))
		x := make([]float64, n)
		f.Solve(x, rhs)
		var ch mat.Cholesky
		require.True(t, ch.Factorize(dense))
		var want mat.VecDense
		require.NoError(t, ch.SolveVecTo(&want, mat.NewVecDense(n, rhs)))
		// Reference: gonum's dense Cholesky. The diagonal is the off-diagonal
		// row sum + 1 (strictly dominant, condition small), so the two
		// backward-stable solves agree to a few hundred ulps: 1e-12 relative.
		for i := range x {
			assert.InDelta(t, want.AtVec(i), x[i], 1e-12*(1+math.Abs(want.AtVec(i))))
		}
		assert.Less(t, Residual(a, x, rhs), residualTol)
	}
}
