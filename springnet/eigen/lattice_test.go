package eigen_test

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/springnet/eigen"
	"github.com/trestle-go/trestle/springnet/lattice"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// benchLattice returns K, the lumped mass matrix M and the DOF coordinates
// of the benchmark space-truss lattice (../shared/perf/README.md, built by
// package lattice).
func benchLattice(tb testing.TB, nx, ny, nz int) (k, m *sparse.Matrix, coords [][3]float64) {
	tb.Helper()
	l, err := lattice.New(nx, ny, nz, nil)
	require.NoError(tb, err)
	bm := sparse.NewBuilder(l.N())
	for i, v := range l.Mass {
		bm.Add(i, i, v)
	}
	return l.K, bm.Matrix(), l.Coords
}

// TestLattice10Frequencies checks the three lowest natural frequencies of
// the 10×10×10 benchmark lattice.
func TestLattice10Frequencies(t *testing.T) {
	k, m, coords := benchLattice(t, 10, 10, 10)
	res, err := eigen.Lowest(k, m, 3, &eigen.Settings{Coords: coords})
	require.NoError(t, err)
	require.Equal(t, 3, res.Len())
	// ../shared/perf/anchors.md, "Lowest natural frequencies (eigsh, Hz)",
	// row 10,10,10: 220.6201, 220.6201, 338.0411 (SciPy eigsh, ARPACK),
	// printed to 4 decimals, hence the tolerance of half a unit in the
	// last place (plus round-off).
	want := []float64{220.6201, 220.6201, 338.0411}
	const printedHalfULP = 0.5e-4 + 1e-9
	for i, f := range want {
		assert.InDelta(t, f, res.Frequency(i), printedHalfULP, "mode %d", i)
		assert.False(t, res.RigidBody(i))
	}
	assert.True(t, res.Checked)
	assert.Equal(t, 3, res.SturmCount)
	assertMOrthonormal(t, res, m)
}
