package sparse

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"runtime"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/mat"
)

// randomSym returns a random sparse symmetric matrix with about deg
// off-diagonal entries per row plus a few dense-ish rows, as a Matrix and
// as a gonum SymDense. Diagonal: row sums of |a_ij| + shift, so shift > 0
// makes it SPD (diagonally dominant) and shift < 0 indefinite.
func randomSym(rng *rand.Rand, n, deg int, shift float64) (*Matrix, *mat.SymDense) {
	b := NewBuilder(n)
	dense := mat.NewSymDense(n, nil)
	for k := 0; k < deg*n/2; k++ {
		i, j := rng.IntN(n), rng.IntN(n)
		if i == j {
			continue
		}
		v := rng.Float64() - 0.5
		b.Add(i, j, v)
		dense.SetSym(i, j, dense.At(i, j)+v)
	}
	// A few long-range couplings build bigger fronts.
	for k := 0; k < n/10; k++ {
		i := rng.IntN(n)
		for t := 0; t < 8; t++ {
			j := rng.IntN(n)
			if i == j {
				continue
			}
			v := 0.1 * (rng.Float64() - 0.5)
			b.Add(i, j, v)
			dense.SetSym(i, j, dense.At(i, j)+v)
		}
	}
	for i := 0; i < n; i++ {
		s := 0.0
		for j, v := range dense.RawSymmetric().Data[i*n : (i+1)*n] {
			if j > i {
				s += math.Abs(v)
			}
		}
		for j := 0; j < i; j++ {
			s += math.Abs(dense.At(i, j))
		}
		d := s + shift
		if shift < 0 && i%2 == 0 {
			d = -(s - shift) // strongly negative rows: indefinite, no tiny pivots
		} else if shift < 0 {
			d = s - shift
		}
		b.Add(i, i, d)
		dense.SetSym(i, i, d)
	}
	return b.Matrix(), dense
}

// Tolerances: the matrices are diagonally dominant (condition number below
// ~1e3), so backward-stable solves agree with the dense reference to a
// few hundred ulps; residualTol is common practice for a stable solver.
const (
	solutionTol = 1e-10
	residualTol = 1e-13
)

// TestFactorAgainstGonum compares solutions and inertia with gonum's dense
// Cholesky (SPD), LU (solution) and EigenSym (eigenvalue signs) over many
// sizes, every ordering and both modes.
func TestFactorAgainstGonum(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	sizes := []int{10, 37, 120, 400, 1000, 2000}
	for _, n := range sizes {
		for _, mode := range []Mode{Cholesky, LDLT} {
			shift := 1.0
			if mode == LDLT {
				shift = -1
			}
			a, dense := randomSym(rng, n, 6, shift)
			coords := make([][3]float64, n)
			for i := range coords {
				coords[i] = [3]float64{rng.Float64(), rng.Float64(), rng.Float64()}
			}
			rhs := make([]float64, n)
			for i := range rhs {
				rhs[i] = rng.Float64() - 0.5
			}
			// Dense references, once per matrix.
			var want mat.VecDense
			if mode == Cholesky {
				var ch mat.Cholesky
				require.True(t, ch.Factorize(dense))
				require.NoError(t, ch.SolveVecTo(&want, mat.NewVecDense(n, rhs)))
			} else {
				var lu mat.LU
				lu.Factorize(dense)
				require.NoError(t, lu.SolveVecTo(&want, false, mat.NewVecDense(n, rhs)))
			}
			wantNeg := -1
			if n <= 1000 {
				var es mat.EigenSym
				require.True(t, es.Factorize(dense, false))
				wantNeg = 0
				for _, v := range es.Values(nil) {
					if v < 0 {
						wantNeg++
					}
				}
			}
			for _, ord := range []Ordering{Auto, Natural, MinDegree, NestedDissection} {
				if n == 2000 && ord == Natural {
					continue // band fill on a random graph: slow, nothing new
				}
				t.Run(fmt.Sprintf("n%d/ord%d/mode%d", n, ord, mode), func(t *testing.T) {
					var f Factor
					require.NoError(t, f.Analyze(a, &Options{Ordering: ord, Mode: mode, Coords: coords}))
					require.True(t, isPerm(f.Perm(), n))
					require.NoError(t, f.Factorize(a))
					x := make([]float64, n)
					f.Solve(x, rhs)
					assert.Less(t, Residual(a, x, rhs), residualTol)
					maxErr, scale := 0.0, 0.0
					for i := range x {
						maxErr = max(maxErr, math.Abs(x[i]-want.AtVec(i)))
						scale = max(scale, math.Abs(want.AtVec(i)))
					}
					assert.Less(t, maxErr, solutionTol*scale, "solution vs gonum dense")
					if wantNeg >= 0 {
						neg, pos := f.Inertia()
						assert.Equal(t, wantNeg, neg, "negative eigenvalues (gonum EigenSym)")
						assert.Equal(t, n-wantNeg, pos)
					}
				})
			}
		}
	}
}

// TestRefactorMatchesFresh checks that refactorising with new values
// reuses the analysis and gives the same factor as a fresh Factor.
func TestRefactorMatchesFresh(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	a, _ := randomSym(rng, 500, 6, 1)
	var f Factor
	require.NoError(t, f.Factorize(a))
	// Same pattern, new values.
	a2 := &Matrix{n: a.n, colPtr: a.colPtr, rowIdx: a.rowIdx, val: make([]float64, len(a.val))}
	for p, v := range a.val {
		a2.val[p] = v * (1 + 0.3*rng.Float64())
	}
	lx := &f.lx[0]
	require.NoError(t, f.Factorize(a2))
	assert.Same(t, lx, &f.lx[0], "storage reused")
	var g Factor
	require.NoError(t, g.Factorize(a2))
	assert.Equal(t, g.lx, f.lx, "same numbers as a fresh factorisation")
	assert.Equal(t, g.d, f.d)
	// gonum's parallel Gemm allocates a little goroutine bookkeeping per
	// call; the factor's own storage must not be allocated again.
	var m0, m1 runtime.MemStats
	runtime.ReadMemStats(&m0)
	require.NoError(t, f.Factorize(a2))
	runtime.ReadMemStats(&m1)
	assert.Less(t, m1.TotalAlloc-m0.TotalAlloc, uint64(8*len(f.lx)/10), "refactorisation reallocates")
}

// TestPivotErrorNamesColumn builds singular matrices whose null space is
// one known original index and checks the error names it.
func TestPivotErrorNamesColumn(t *testing.T) {
	for _, ord := range []Ordering{Natural, MinDegree, NestedDissection} {
		for _, mode := range []Mode{Cholesky, LDLT} {
			t.Run(fmt.Sprintf("ord%d/mode%d", ord, mode), func(t *testing.T) {
				// A path graph Laplacian (free-free bar chain, singular:
				// rigid-body translation) with a spring to ground at every
				// node except... none: it is singular. Grounding all nodes
				// but the chain's link into node "free" isolates that node.
				const n = 50
				const free = 17
				b := NewBuilder(n)
				for i := 0; i < n; i++ {
					if i == free {
						b.Add(i, i, 0)
						continue
					}
					b.Add(i, i, 3)
					if i+1 < n && i+1 != free {
						b.Add(i+1, i, -1)
					}
				}
				var f Factor
				require.NoError(t, f.Analyze(b.Matrix(), &Options{Ordering: ord, Mode: mode}))
				err := f.Factorize(b.Matrix())
				var pe *PivotError
				require.True(t, errors.As(err, &pe), "error %v", err)
				assert.Equal(t, free, pe.Col)
			})
		}
	}
	t.Run("negative in Cholesky", func(t *testing.T) {
		b := NewBuilder(3)
		b.Add(0, 0, 2)
		b.Add(1, 1, -2)
		b.Add(2, 2, 2)
		var f Factor
		require.NoError(t, f.Analyze(b.Matrix(), &Options{Ordering: Natural}))
		var pe *PivotError
		require.True(t, errors.As(f.Factorize(b.Matrix()), &pe))
		assert.Equal(t, 1, pe.Col)
		assert.True(t, pe.Negative)
	})
	t.Run("dependent rows", func(t *testing.T) {
		// Two nodes joined by a spring k, nothing grounded: the second
		// pivot is k − k·k/k = 0 exactly (rigid-body mode).
		b := NewBuilder(2)
		b.Add(0, 0, 5)
		b.Add(1, 1, 5)
		b.Add(1, 0, -5)
		var f Factor
		require.NoError(t, f.Analyze(b.Matrix(), &Options{Ordering: Natural}))
		var pe *PivotError
		require.True(t, errors.As(f.Factorize(b.Matrix()), &pe))
		assert.Equal(t, 1, pe.Col)
		assert.False(t, pe.Negative)
	})
}
