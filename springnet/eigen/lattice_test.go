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

// TestLattice10TenModesSingleVector: the ten lowest modes of the 10×10×10
// lattice with block size 1. The lattice is symmetric about two planes, so
// several eigenvalues are double; single-vector Lanczos can converge to one
// copy only, and the Sturm check must then send it looking for the other.
func TestLattice10TenModesSingleVector(t *testing.T) {
	k, m, coords := benchLattice(t, 10, 10, 10)
	res, err := eigen.Lowest(k, m, 10, &eigen.Settings{Coords: coords, BlockSize: 1})
	require.NoError(t, err)
	require.Equal(t, 10, res.Len())
	// ../shared/perf/anchors.md, "Lowest natural frequencies (eigsh, Hz)",
	// row 10,10,10: f1..f3 to 4 decimals, f4..f10 to 2 decimals; the
	// tolerance is half a unit in the last printed place.
	want := []float64{220.6201, 220.6201, 338.0411, 461.81, 582.46, 582.46, 747.69, 751.34, 834.19, 852.77}
	for i, f := range want {
		tol := 0.5e-2 + 1e-9
		if i < 3 {
			tol = 0.5e-4 + 1e-9
		}
		assert.InDelta(t, f, res.Frequency(i), tol, "mode %d", i)
	}
	assert.True(t, res.Checked)
	// σ₂ lies above the 10th eigenvalue and any eigenvalue numerically
	// equal to it (the 11th may be the other copy of a double one).
	assert.GreaterOrEqual(t, res.SturmCount, 10)
	t.Logf("%d factorisations (2 = no continuation), %d solves", res.Factorizations, res.Solves)
}
