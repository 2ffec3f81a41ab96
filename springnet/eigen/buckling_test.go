package eigen_test

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/springnet/eigen"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// henckyColumn builds the pinned–pinned Hencky bar-chain column: n+1 rigid
// links of length a, rotational springs c at the n interior joints, lateral
// deflections w of the joints as DOF. Strain energy ½·(c/a²)·Σ(Δ²w)², so
// K = (c/a²)·T² with T = tridiag(−1, 2, −1); the work of an axial
// compression P is (P/2a)·Σ(Δw)², so Kg = −(P/a)·T for P = 1.
func henckyColumn(n int, a, c float64) (K, Kg *sparse.Matrix) {
	T := func(i, j int) float64 {
		switch {
		case i == j:
			return 2
		case i-j == 1 || j-i == 1:
			return -1
		}
		return 0
	}
	bk, bg := sparse.NewBuilder(n), sparse.NewBuilder(n)
	for i := 0; i < n; i++ {
		for j := max(0, i-2); j <= i; j++ {
			var t2 float64
			for l := max(0, i-1); l <= min(n-1, i+1); l++ {
				t2 += T(i, l) * T(l, j)
			}
			bk.Add(i, j, c/(a*a)*t2)
			if i-j <= 1 {
				bg.Add(i, j, -T(i, j)/a)
			}
		}
	}
	return bk.Matrix(), bg.Matrix()
}

// TestBucklingHencky checks Buckling and DenseBuckling against the critical
// loads of the Hencky bar-chain, P_k = (4c/a)·sin²(kπ/(2(n+1))) (hand
// derivation above: K and Kg share the eigenvectors of T, whose eigenvalues
// are 4·sin²(kπ/(2(n+1))); standard, e.g. Wang, Zhang and Challamel on
// Hencky bar-chains, from memory). As n → ∞ with c = EI/a and L = (n+1)a
// the first tends to Euler's π²EI/L².
func TestBucklingHencky(t *testing.T) {
	const n, a, c = 120, 0.05, 2e4
	K, Kg := henckyColumn(n, a, c)
	const nev = 6
	res, err := eigen.Buckling(K, Kg, nev, nil)
	require.NoError(t, err)
	dres, err := eigen.DenseBuckling(eigen.DenseOf(K), eigen.DenseOf(Kg), nev)
	require.NoError(t, err)
	require.Equal(t, nev, res.Len())
	for k := 1; k <= nev; k++ {
		s := math.Sin(float64(k) * math.Pi / float64(2*(n+1)))
		want := 4 * c / a * s * s
		assert.InEpsilon(t, want, res.Values[k-1], freqTol, "mode %d", k)
		assert.InEpsilon(t, want, dres.Values[k-1], freqTol, "dense mode %d", k)
		assert.Less(t, res.Residuals[k-1], residTol)
		assert.False(t, res.RigidBody(k-1))
	}
	// Euler: π²EI/L² with EI = c·a, L = (n+1)·a; the chain is within
	// O(1/n²) of it (x²/3 = 5.6e-5 relative here, x = π/(2(n+1))).
	L := float64(n+1) * a
	assert.InEpsilon(t, math.Pi*math.Pi*c*a/(L*L), res.Values[0], 1e-4) // 1e-4: above the 5.6e-5 chain-vs-continuum gap
	assert.True(t, res.Checked)
	assert.Equal(t, nev, res.SturmCount)
	// K-orthonormal modes.
	kv := make([]float64, n)
	for i := 0; i < nev; i++ {
		K.MulVec(kv, res.Vector(i))
		for j := 0; j <= i; j++ {
			vj := res.Vector(j)
			var d float64
			for r := range vj {
				d += vj[r] * kv[r]
			}
			want := 0.0
			if i == j {
				want = 1
			}
			assert.InDelta(t, want, d, orthoTol)
		}
	}
}

// TestBucklingAgainstDense compares Buckling with DenseBuckling on random
// supported spring networks whose springs carry random axial forces
// (compression and tension): geometric stiffness (N/ℓ)·[1 −1; −1 1] per
// spring with ℓ = 1.
func TestBucklingAgainstDense(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for trial := 0; trial < 12; trial++ {
		n := 20 + rng.IntN(100)
		nev := 1 + trial%6
		net := randomNetwork(rng, n, true, false, 0)
		bg := sparse.NewBuilder(n)
		for e := 0; e < 2*n; e++ {
			i, j := rng.IntN(n), rng.IntN(n)
			if i == j {
				continue
			}
			f := 2*rng.Float64() - 1.3 // mostly compression (N < 0)
			bg.Add(i, i, f)
			bg.Add(j, j, f)
			bg.Add(i, j, -f)
		}
		Kg := bg.Matrix()
		t.Run(fmt.Sprintf("%02d-n%d-nev%d", trial, n, nev), func(t *testing.T) {
			ref, err := eigen.DenseBuckling(eigen.DenseOf(net.k), eigen.DenseOf(Kg), n)
			var few *eigen.FewerModesError
			if err != nil {
				require.ErrorAs(t, err, &few)
			}
			require.GreaterOrEqual(t, ref.Len(), nev)
			res, err := eigen.Buckling(net.k, Kg, nev, &eigen.Settings{BlockSize: 1 + trial%2})
			require.NoError(t, err)
			for i := 0; i < nev; i++ {
				assert.InEpsilon(t, ref.Values[i], res.Values[i], freqTol, "mode %d", i)
			}
			require.True(t, res.Checked)
			below := 0
			for _, v := range ref.Values {
				if v < res.SturmShift {
					below++
				}
			}
			assert.Equal(t, below, res.SturmCount)
		})
	}
}

// TestBucklingAllTension: with every spring in tension there is no
// positive load factor.
func TestBucklingAllTension(t *testing.T) {
	K, _ := chain(30, 1e3, 1, true)
	Kg, _ := chain(30, 5, 1, false) // positive semidefinite: tension
	res, err := eigen.Buckling(K, Kg, 3, nil)
	var few *eigen.FewerModesError
	require.ErrorAs(t, err, &few)
	assert.Equal(t, 0, few.Found)
	if res != nil {
		assert.Equal(t, 0, res.Len())
	}
}

// TestBucklingUnsupported: a singular K (no support) is an error naming
// the column.
func TestBucklingUnsupported(t *testing.T) {
	K, _ := chain(10, 1e3, 1, false) // free-free: singular
	_, Kg := henckyColumn(10, 0.1, 1)
	_, err := eigen.Buckling(K, Kg, 2, nil)
	var se *eigen.SingularError
	require.ErrorAs(t, err, &se)
	// Every DOF of a free chain can move, so any column is a right answer;
	// it must be one of the ten and the message must name it.
	assert.GreaterOrEqual(t, se.Col, 0)
	assert.Less(t, se.Col, 10)
	assert.Contains(t, err.Error(), fmt.Sprintf("DOF %d", se.Col))
}

// TestBucklingOneLoadedSpring: a supported chain in which one spring
// carries compression N < 0 has a rank-one Kg = N·g·gᵀ, g = e_i − e_j,
// hence exactly one load factor: K + λ·N·g·gᵀ is singular when
// 1 + λ·N·gᵀK⁻¹g = 0, λ = −1 / (N·gᵀK⁻¹g) (hand derivation, matrix
// determinant lemma).
func TestBucklingOneLoadedSpring(t *testing.T) {
	K, _ := chain(25, 1e3, 1, true)
	bg := sparse.NewBuilder(25)
	const N = -40.0 // compression [N per unit length]
	bg.Add(10, 10, N)
	bg.Add(11, 11, N)
	bg.Add(11, 10, -N)
	bg.Add(24, 24, 0) // keep the order
	Kg := bg.Matrix()
	ref, err := eigen.DenseBuckling(eigen.DenseOf(K), eigen.DenseOf(Kg), 1)
	require.NoError(t, err)
	res, err := eigen.Buckling(K, Kg, 1, nil)
	require.NoError(t, err)
	assert.InEpsilon(t, ref.Values[0], res.Values[0], freqTol)
	// Fixed-free chain: a self-equilibrated pair of unit forces on nodes
	// 10 and 11 stretches only the spring between them, so gᵀK⁻¹g = 1/k
	// and λ = k/|N| = 25.
	assert.InEpsilon(t, 1e3/40, res.Values[0], freqTol)

	more, err := eigen.Buckling(K, Kg, 3, nil)
	var few *eigen.FewerModesError
	require.ErrorAs(t, err, &few)
	assert.Equal(t, 1, few.Found)
	require.NotNil(t, more)
	assert.Equal(t, 1, more.Len())
}

// TestBucklingAllFactors asks for every load factor of small columns.
func TestBucklingAllFactors(t *testing.T) {
	for _, n := range []int{1, 3, 10} {
		t.Run(fmt.Sprintf("n%d", n), func(t *testing.T) {
			const a, c = 0.1, 5e3
			K, Kg := henckyColumn(n, a, c)
			res, err := eigen.Buckling(K, Kg, n, nil)
			require.NoError(t, err)
			require.Equal(t, n, res.Len())
			for k := 1; k <= n; k++ {
				// Hencky bar-chain closed form (see TestBucklingHencky).
				s := math.Sin(float64(k) * math.Pi / float64(2*(n+1)))
				assert.InEpsilon(t, 4*c/a*s*s, res.Values[k-1], freqTol, "mode %d", k)
			}
			assert.True(t, res.Checked)
		})
	}
}
