package sparse

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestTinyMatrices covers orders 0 and 1 and a diagonal matrix (every
// column its own tree) in all orderings: x = b/a by hand.
func TestTinyMatrices(t *testing.T) {
	for _, ord := range []Ordering{Auto, Natural, MinDegree, NestedDissection} {
		var f Factor
		require.NoError(t, f.Factorize(NewBuilder(0).Matrix()))
		f.Solve(nil, nil)

		b := NewBuilder(1)
		b.Add(0, 0, 4)
		require.NoError(t, f.Analyze(b.Matrix(), &Options{Ordering: ord}))
		require.NoError(t, f.Factorize(b.Matrix()))
		x := []float64{0}
		f.Solve(x, []float64{2})
		assert.Equal(t, 0.5, x[0]) // 4·x = 2 by hand; exact in binary

		const n = 500
		b = NewBuilder(n)
		rhs := make([]float64, n)
		for i := 0; i < n; i++ {
			b.Add(i, i, float64(i+1))
			rhs[i] = float64(i + 1)
		}
		require.NoError(t, f.Analyze(b.Matrix(), &Options{Ordering: ord, Mode: LDLT}))
		require.NoError(t, f.Factorize(b.Matrix()))
		x = make([]float64, n)
		f.Solve(x, rhs)
		for i := range x {
			assert.Equal(t, 1.0, x[i])
		}
		neg, pos := f.Inertia()
		assert.Equal(t, [2]int{0, n}, [2]int{neg, pos})
	}
}
