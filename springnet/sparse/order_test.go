package sparse

import (
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// grid2D returns the 5-point Laplacian on an m×m grid (SPD).
func grid2D(m int) *Matrix {
	b := NewBuilder(m * m)
	for y := 0; y < m; y++ {
		for x := 0; x < m; x++ {
			v := x + m*y
			b.Add(v, v, 4)
			if x+1 < m {
				b.Add(v+1, v, -1)
			}
			if y+1 < m {
				b.Add(v+m, v, -1)
			}
		}
	}
	return b.Matrix()
}

func isPerm(p []int, n int) bool {
	if len(p) != n {
		return false
	}
	seen := make([]bool, n)
	for _, v := range p {
		if v < 0 || v >= n || seen[v] {
			return false
		}
		seen[v] = true
	}
	return true
}

// TestOrderingsArePermutations checks every ordering returns a valid
// permutation on random patterns, including empty rows and dense rows.
func TestOrderingsArePermutations(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, n := range []int{1, 2, 3, 10, 57, 300, 1000} {
		for _, ord := range []Ordering{Auto, Natural, MinDegree, NestedDissection} {
			b := NewBuilder(n)
			for k := 0; k < 3*n; k++ {
				b.Add(rng.IntN(n), rng.IntN(n), 1)
			}
			if n > 20 {
				for i := 0; i < n; i++ { // a dense row
					b.Add(i, 7, 1)
				}
			}
			a := b.Matrix()
			p := order(a, &Options{Ordering: ord})
			assert.True(t, isPerm(p, n), "n=%d ordering %d", n, ord)
		}
	}
}

// TestMinDegreeReducesFill checks AMD on the 2D 5-point grid against the
// natural (banded) ordering: for an m×m grid the band ordering fills about
// m³ entries (George & Liu, "Computer Solution of Large Sparse Positive
// Definite Systems", 1981, ch. 4), minimum degree is O(m² log m).
func TestMinDegreeReducesFill(t *testing.T) {
	a := grid2D(60)
	var nat, md Factor
	require.NoError(t, nat.Analyze(a, &Options{Ordering: Natural}))
	require.NoError(t, md.Analyze(a, &Options{Ordering: MinDegree}))
	// Common practice: minimum degree on a 60×60 grid fills 3-5x less than the band.
	assert.Less(t, float64(md.NNZL()), 0.4*float64(nat.NNZL()), "amd %d natural %d", md.NNZL(), nat.NNZL())
	t.Logf("nnz(L): natural %d, min degree %d", nat.NNZL(), md.NNZL())
}
