package sparse

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestSolveManyMatchesSolve checks the blocked solves against one solve
// per right-hand side (same operations per column, so the same bits up to
// summation order: compared with a tolerance) and their residuals.
func TestSolveManyMatchesSolve(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	const n, nr = 700, 5
	a, _ := randomSym(rng, n, 6, -1)
	var f Factor
	require.NoError(t, f.Analyze(a, &Options{Mode: LDLT, Ordering: NestedDissection}))
	require.NoError(t, f.Factorize(a))
	b := make([][]float64, nr)
	want := make([][]float64, nr)
	block := make([]float64, n*nr)
	for r := range b {
		b[r] = make([]float64, n)
		for i := range b[r] {
			b[r][i] = rng.Float64() - 0.5
		}
		copy(block[r*n:], b[r])
		want[r] = make([]float64, n)
		f.Solve(want[r], b[r])
	}
	got := make([][]float64, nr)
	for r := range got {
		got[r] = make([]float64, n)
	}
	f.SolveMany(got, b)
	f.SolveBlock(block, block, nr)
	for r := range b {
		assert.Less(t, Residual(a, got[r], b[r]), residualTol)
		for i := range got[r] {
			assert.InDelta(t, want[r][i], got[r][i], solutionTol*(1+math.Abs(want[r][i])))
			assert.InDelta(t, want[r][i], block[r*n+i], solutionTol*(1+math.Abs(want[r][i])))
		}
	}
	st := f.Stats()
	assert.Equal(t, n, st.N)
	assert.Equal(t, f.NNZL(), st.NNZL)
	assert.GreaterOrEqual(t, st.Stored, st.NNZL-n) // stored L blocks hold the strict lower part and padding
}
