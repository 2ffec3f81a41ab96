package sparse_test

import (
	"fmt"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/mat"

	"github.com/trestle-go/trestle/springnet/lattice"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// TestLatticeAgainstGonum solves the 4×3×5 benchmark lattice (n = 300)
// with every ordering, and counts the eigenvalues of K − σ·M below σ by
// the LDLᵀ inertia, checking both against gonum's dense Cholesky and
// generalized symmetric eigen solver (the reference).
func TestLatticeAgainstGonum(t *testing.T) {
	l, err := lattice.New(4, 3, 5, nil)
	require.NoError(t, err)
	n := l.N()
	kd := mat.NewSymDense(n, nil)
	for j := 0; j < n; j++ {
		rows, vals := l.K.Col(j)
		for p, i := range rows {
			kd.SetSym(i, j, vals[p])
		}
	}
	var ch mat.Cholesky
	require.True(t, ch.Factorize(kd))
	var want mat.VecDense
	require.NoError(t, ch.SolveVecTo(&want, mat.NewVecDense(n, l.Load)))
	md := mat.NewDiagDense(n, l.Mass)
	// Generalized eigenvalues of K·φ = λ·M·φ with diagonal M: those of
	// M^-1/2·K·M^-1/2.
	sc := mat.NewSymDense(n, nil)
	for i := 0; i < n; i++ {
		for j := 0; j <= i; j++ {
			sc.SetSym(i, j, kd.At(i, j)/math.Sqrt(md.At(i, i)*md.At(j, j)))
		}
	}
	var es mat.EigenSym
	require.True(t, es.Factorize(sc, false))
	lambda := es.Values(nil)
	// K − σ·M for each shift σ, in one pattern made once (Union) and
	// refilled per σ (Combine), so one analysis serves every shift.
	mb := sparse.NewBuilder(n)
	for j, v := range l.Mass {
		mb.Add(j, j, v)
	}
	m := mb.Matrix()
	shifted, err := sparse.Union(l.K, m)
	require.NoError(t, err)

	for _, ord := range []sparse.Ordering{sparse.Auto, sparse.Natural, sparse.MinDegree, sparse.NestedDissection} {
		for _, coords := range [][][3]float64{nil, l.Coords} {
			t.Run(fmt.Sprintf("ord%d/coords%v", ord, coords != nil), func(t *testing.T) {
				var f sparse.Factor
				require.NoError(t, f.Analyze(l.K, &sparse.Options{Ordering: ord, Coords: coords}))
				require.NoError(t, f.Factorize(l.K))
				x := make([]float64, n)
				f.Solve(x, l.Load)
				// Relative residual: common practice for a backward-stable
				// solve of a matrix with condition ~1e6 is below 1e-12.
				assert.Less(t, sparse.Residual(l.K, x, l.Load), 1e-12)
				// Displacements agree with the dense solve to 1e-9 of the
				// top corner's displacement: the condition number (~1e6)
				// times machine epsilon, with a margin.
				for i := range x {
					assert.InDelta(t, want.AtVec(i), x[i], 1e-9*math.Abs(want.AtVec(n-1))+1e-9*math.Abs(want.AtVec(i)))
				}
				// Sturm count at shifts between eigenvalues.
				var g sparse.Factor
				require.NoError(t, g.Analyze(shifted, &sparse.Options{Ordering: ord, Coords: coords, Mode: sparse.LDLT}))
				for _, idx := range []int{0, 5, 40, 150} {
					sigma := 0.5 * (lambda[idx] + lambda[idx+1])
					require.NoError(t, sparse.Combine(shifted, l.K, -sigma, m))
					require.NoError(t, g.Factorize(shifted))
					neg, _ := g.Inertia()
					assert.Equal(t, idx+1, neg, "eigenvalues below σ = %.6g (gonum EigenSym)", sigma)
				}
			})
		}
	}
}
