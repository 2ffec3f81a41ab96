package eigen_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/springnet/eigen"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// Massless DOF, singular mass matrices and mechanisms.

// TestMasslessCondensation: a fixed-free chain of 2n springs k whose odd
// nodes carry no mass is, after static condensation, a chain of n masses m
// joined by springs k/2 (two springs in series), so
// ω_j = 2√(k/(2m))·sin((2j−1)π/(2(2n+1))). Only n eigenvalues are finite.
func TestMasslessCondensation(t *testing.T) {
	const n, k, m = 40, 1e6, 2.0
	N := 2 * n
	bk, bm := sparse.NewBuilder(N), sparse.NewBuilder(N)
	bk.Add(0, 0, k) // spring to the ground
	for i := 1; i < N; i++ {
		bk.Add(i-1, i-1, k)
		bk.Add(i, i, k)
		bk.Add(i, i-1, -k)
	}
	for i := 0; i < N; i++ {
		if i%2 == 1 {
			bm.Add(i, i, m) // nodes 2, 4, …, 2n (1-based) carry the mass
		} else {
			bm.Add(i, i, 0)
		}
	}
	K, M := bk.Matrix(), bm.Matrix()
	const nev = 10
	res, err := eigen.Lowest(K, M, nev, nil)
	require.NoError(t, err)
	dres, err := eigen.Dense(eigen.DenseOf(K), eigen.DenseOf(M), nev)
	require.NoError(t, err)
	for j := 1; j <= nev; j++ {
		w := 2 * math.Sqrt(k/(2*m)) * math.Sin(float64(2*j-1)*math.Pi/float64(2*(2*n+1)))
		assert.InEpsilon(t, w*w, res.Values[j-1], freqTol, "sparse mode %d", j)
		assert.InEpsilon(t, w*w, dres.Values[j-1], freqTol, "dense mode %d", j)
		// Massless DOF: the vector is the static response of the massive
		// ones, so each massless node sits midway between its neighbours.
		v := res.Vector(j - 1)
		for i := 2; i < N; i += 2 {
			assert.InDelta(t, 0.5*(v[i-1]+v[i+1]), v[i], 1e-8*math.Abs(v[i-1]-v[i+1])+1e-12) // 1e-8 of the local slope, 1e-12 floor where it vanishes: a generous allowance over round-off
		}
	}
	assertMOrthonormal(t, res, M)

	// Asking for more modes than there are masses.
	all, err := eigen.Lowest(K, M, n+3, nil)
	var few *eigen.FewerModesError
	require.ErrorAs(t, err, &few)
	assert.Equal(t, n, few.Found)
	require.NotNil(t, all)
	assert.Equal(t, n, all.Len())
	for i, v := range all.Values {
		assert.False(t, math.IsInf(v, 0) || math.IsNaN(v), "value %d", i)
	}
	_, err = eigen.Dense(eigen.DenseOf(K), eigen.DenseOf(M), n+3)
	require.ErrorAs(t, err, &few)
	assert.Equal(t, n, few.Found)
}

// TestMasslessMechanism: a DOF with neither stiffness nor mass makes the
// pencil singular; the error names it.
func TestMasslessMechanism(t *testing.T) {
	bk, bm := sparse.NewBuilder(4), sparse.NewBuilder(4)
	for i := 0; i < 3; i++ {
		bk.Add(i, i, 2)
		bm.Add(i, i, 1)
	}
	bk.Add(1, 0, -1)
	bk.Add(3, 3, 0) // DOF 3: no stiffness …
	bm.Add(3, 3, 0) // … and no mass
	_, err := eigen.Lowest(bk.Matrix(), bm.Matrix(), 2, nil)
	var se *eigen.SingularError
	require.ErrorAs(t, err, &se)
	assert.Equal(t, 3, se.Col)
}

// TestSingularConsistentMass: a mass matrix of rank N/2 without zero rows
// (each pair of DOF shares one mass through M_pair = m·[1 1; 1 1]) has N/2
// infinite eigenvalues. Lowest must return only finite ones, agree with
// the dense path (here the shifted-K reduction), and report the shortage.
func TestSingularConsistentMass(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	const N = 60
	net := randomNetwork(rng, N, true, false, 0)
	bm := sparse.NewBuilder(N)
	for i := 0; i < N; i += 2 {
		mi := 0.5 + rng.Float64()
		bm.Add(i, i, mi)
		bm.Add(i+1, i+1, mi)
		bm.Add(i+1, i, mi)
	}
	M := bm.Matrix()
	ref := denseAll(t, net.k, M)
	require.Len(t, ref, N/2, "rank of M")
	res, err := eigen.Lowest(net.k, M, 6, nil)
	require.NoError(t, err)
	for i := 0; i < 6; i++ {
		assert.InEpsilon(t, ref[i], res.Values[i], freqTol, "mode %d", i)
		assert.Less(t, res.Residuals[i], residTol)
	}
	assertMOrthonormal(t, res, M)
	all, err := eigen.Lowest(net.k, M, N/2+4, nil)
	var few *eigen.FewerModesError
	require.ErrorAs(t, err, &few)
	assert.Equal(t, N/2, few.Found)
	require.NotNil(t, all)
	for i := range all.Values {
		// The shifted-K reduction of the reference loses relative accuracy
		// as eps·λ/(λ₁ − σ) for the upper modes: allow 1e-6.
		assert.InEpsilon(t, ref[i], all.Values[i], 1e-6, "mode %d", i)
	}
}

// TestMechanismMode: a DOF with mass but no stiffness (a loose mass) is a
// mechanism, λ = 0 exactly; it is returned and flagged, and the other
// modes are unchanged (the fixed-free chain closed form, Meirovitch).
func TestMechanismMode(t *testing.T) {
	const n, k, m = 20, 4e4, 0.5
	bk, bm := sparse.NewBuilder(n+1), sparse.NewBuilder(n+1)
	bk.Add(0, 0, k)
	for i := 1; i < n; i++ {
		bk.Add(i-1, i-1, k)
		bk.Add(i, i, k)
		bk.Add(i, i-1, -k)
	}
	bk.Add(n, n, 0) // the loose mass: no stiffness at all
	for i := 0; i <= n; i++ {
		bm.Add(i, i, m)
	}
	res, err := eigen.Lowest(bk.Matrix(), bm.Matrix(), 3, nil)
	require.NoError(t, err)
	assert.True(t, res.RigidBody(0))
	v := res.Vector(0)
	assert.InDelta(t, 1/math.Sqrt(m), math.Abs(v[n]), 1e-8, "the mechanism moves the loose mass only")
	for j := 1; j <= 2; j++ {
		w := 2 * math.Sqrt(k/m) * math.Sin(float64(2*j-1)*math.Pi/float64(2*(2*n+1)))
		assert.InEpsilon(t, w*w, res.Values[j], freqTol, "mode %d", j)
		assert.False(t, res.RigidBody(j))
	}
	assert.True(t, res.Checked)
}
