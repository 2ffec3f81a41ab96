package eigen_test

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/springnet/eigen"
	"github.com/trestle-go/trestle/springnet/sparse"
	"gonum.org/v1/gonum/mat"
)

// Tolerances.
const (
	// freqTol is the agreement asked of the sparse and dense eigenvalues
	// (the task's accuracy target, 1e-8 relative in frequency; we test
	// the eigenvalues λ = ω², which is stricter by a factor two).
	freqTol = 1e-8
	// orthoTol bounds |φᵢᵀMφⱼ − δᵢⱼ|: the Lanczos vectors are converged to
	// Tol = 1e-10, the eigenvector error is of that order over the gap.
	orthoTol = 1e-7
	// residTol bounds the relative residual of a returned pair: round-off
	// of a converged pair is ~1e-14; 1e-9 leaves room for ill-conditioned
	// random networks.
	residTol = 1e-9
)

// network is a random network of scalar springs between DOF (and to the
// ground) with masses: a stand-in for a model's K and M with a known
// structure.
type network struct {
	name     string
	k, m     *sparse.Matrix
	massless int
}

// randomNetwork builds a random spring network on n DOF. Springs join
// random pairs (stiffness spread over two decades); grounded adds springs
// to the ground at a few DOF (otherwise the network floats: one rigid-body
// mode per connected part). Mass is lumped (diagonal) or consistent (a
// bar-like 2×2 block m/6·[2 1; 1 2] on every spring, plus a lumped part);
// massless DOF get no lumped mass (diagonal M only).
func randomNetwork(rng *rand.Rand, n int, grounded, consistent bool, massless int) network {
	bk, bm := sparse.NewBuilder(n), sparse.NewBuilder(n)
	spring := func(i, j int, k float64) {
		bk.Add(i, i, k)
		bk.Add(j, j, k)
		bk.Add(i, j, -k)
	}
	// A spanning chain in random order keeps the network connected.
	perm := rng.Perm(n)
	for a := 1; a < n; a++ {
		spring(perm[a-1], perm[a], math.Pow(10, 2*rng.Float64()-1))
	}
	for e := 0; e < 2*n; e++ {
		i, j := rng.IntN(n), rng.IntN(n)
		if i != j {
			k := math.Pow(10, 2*rng.Float64()-1)
			spring(i, j, k)
			if consistent {
				mm := 0.1 * rng.Float64()
				bm.Add(i, i, mm/3)
				bm.Add(j, j, mm/3)
				bm.Add(i, j, mm/6)
			}
		}
	}
	if grounded {
		for g := 0; g < 1+n/10; g++ {
			i := rng.IntN(n)
			bk.Add(i, i, math.Pow(10, 2*rng.Float64()-1))
		}
	}
	for i := 0; i < n; i++ {
		if i < massless && !consistent {
			bm.Add(i, i, 0) // keep the pattern: explicit zero
			continue
		}
		bm.Add(i, i, 0.5+rng.Float64())
	}
	name := fmt.Sprintf("n%d", n)
	if grounded {
		name += "-grounded"
	} else {
		name += "-free"
	}
	if consistent {
		name += "-consistentM"
	} else {
		name += "-lumpedM"
	}
	if massless > 0 {
		name += fmt.Sprintf("-%dmassless", massless)
	}
	return network{name: name, k: bk.Matrix(), m: bm.Matrix(), massless: massless}
}

// denseAll returns every finite eigenvalue of the pencil from the dense
// reference, ascending.
func denseAll(t *testing.T, k, m *sparse.Matrix) []float64 {
	N := k.N()
	res, err := eigen.Dense(eigen.DenseOf(k), eigen.DenseOf(m), N)
	var few *eigen.FewerModesError
	if !errors.As(err, &few) {
		require.NoError(t, err)
	}
	return res.Values
}

// TestLowestAgainstDense compares Lowest with the dense gonum reference on
// random sparse pencils: eigenvalues, Sturm counts, M-orthonormality,
// residuals and the rigid-body flags.
func TestLowestAgainstDense(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	var cases []network
	for trial := 0; trial < 36; trial++ {
		n := 20 + rng.IntN(140)
		grounded := trial%3 != 0
		consistent := trial%4 == 1
		massless := 0
		if trial%5 == 2 && !consistent {
			massless = 1 + rng.IntN(n/4)
		}
		cases = append(cases, randomNetwork(rng, n, grounded, consistent, massless))
	}
	for ci, c := range cases {
		nev := 1 + (ci*7)%12
		block := 1 + ci%3
		t.Run(fmt.Sprintf("%02d-%s-nev%d-block%d", ci, c.name, nev, block), func(t *testing.T) {
			ref := denseAll(t, c.k, c.m)
			require.GreaterOrEqual(t, len(ref), nev)
			res, err := eigen.Lowest(c.k, c.m, nev, &eigen.Settings{BlockSize: block})
			require.NoError(t, err)
			require.Equal(t, nev, res.Len())
			scale := ref[len(ref)-1]
			for i := 0; i < nev; i++ {
				if math.Abs(ref[i]) <= 1e-8*scale { // rigid-body mode
					assert.True(t, res.RigidBody(i), "mode %d: λ = %g should be flagged rigid", i, res.Values[i])
					assert.InDelta(t, 0, res.Values[i], 1e-9*scale, "mode %d", i) // a zero eigenvalue comes out as round-off of the largest one
					continue
				}
				assert.False(t, res.RigidBody(i), "mode %d", i)
				assert.InEpsilon(t, ref[i], res.Values[i], freqTol, "mode %d", i)
				assert.Less(t, res.Residuals[i], residTol, "mode %d", i)
			}
			// Sturm count: the dense spectrum below the checked shift.
			require.True(t, res.Checked)
			below := 0
			for _, v := range ref {
				if v < res.SturmShift {
					below++
				}
			}
			assert.Equal(t, below, res.SturmCount, "eigenvalues below σ₂ = %g", res.SturmShift)
			cnt, err := eigen.CountBelow(c.k, c.m, res.SturmShift)
			require.NoError(t, err)
			assert.Equal(t, below, cnt)
			assertMOrthonormal(t, res, c.m)
		})
	}
}

func assertMOrthonormal(t *testing.T, res *eigen.Result, m *sparse.Matrix) {
	t.Helper()
	N := m.N()
	mv := make([]float64, N)
	for i := 0; i < res.Len(); i++ {
		vi := res.Vector(i)
		m.MulVec(mv, vi)
		for j := 0; j <= i; j++ {
			vj := res.Vector(j)
			var d float64
			for r := range vj {
				d += vj[r] * mv[r]
			}
			want := 0.0
			if i == j {
				want = 1
			}
			assert.InDelta(t, want, d, orthoTol, "φ%dᵀMφ%d", j, i)
		}
	}
}

// chain builds a spring–mass chain of n equal masses m joined by equal
// springs k; fixed adds a spring from the first mass to the ground.
func chain(n int, k, m float64, fixed bool) (K, M *sparse.Matrix) {
	return chains(1, n, k, m, fixed)
}

// chains returns copies unconnected copies of chain(n, k, m, fixed), one
// after the other (block-diagonal).
func chains(copies, n int, k, m float64, fixed bool) (K, M *sparse.Matrix) {
	N := copies * n
	bk, bm := sparse.NewBuilder(N), sparse.NewBuilder(N)
	for c := 0; c < copies; c++ {
		o := c * n
		if fixed {
			bk.Add(o, o, k)
		}
		for i := 1; i < n; i++ {
			bk.Add(o+i-1, o+i-1, k)
			bk.Add(o+i, o+i, k)
			bk.Add(o+i, o+i-1, -k)
		}
	}
	for i := 0; i < N; i++ {
		bm.Add(i, i, m)
	}
	return bk.Matrix(), bm.Matrix()
}

// TestChainClosedForm checks Lowest against the natural frequencies of a
// uniform spring–mass chain.
func TestChainClosedForm(t *testing.T) {
	const k, m = 2.5e6, 3.0 // N/m, kg (demo values)
	cases := []struct {
		name  string
		n     int
		fixed bool
		nev   int
		// omega is the closed form of mode j (1-based).
		omega func(n, j int) float64
	}{
		{
			// Fixed-free chain of n masses: ω_j = 2√(k/m)·sin((2j−1)π/(2(2n+1))),
			// the standard result (e.g. Meirovitch, "Elements of Vibration
			// Analysis"; the eigenvalues of tridiag(−1, 2, −1) with a free end).
			name: "fixed-free", n: 200, fixed: true, nev: 12,
			omega: func(n, j int) float64 {
				return 2 * math.Sqrt(k/m) * math.Sin(float64(2*j-1)*math.Pi/float64(2*(2*n+1)))
			},
		},
		{
			// Free-free chain: ω_j = 2√(k/m)·sin((j−1)π/(2n)), j = 1 the
			// rigid-body mode (eigenvalues 2 − 2cos((j−1)π/n) of the path
			// Laplacian; standard, e.g. Strang, "Introduction to Applied
			// Mathematics", from memory).
			name: "free-free", n: 150, fixed: false, nev: 8,
			omega: func(n, j int) float64 {
				return 2 * math.Sqrt(k/m) * math.Sin(float64(j-1)*math.Pi/float64(2*n))
			},
		},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			K, M := chain(c.n, k, m, c.fixed)
			res, err := eigen.Lowest(K, M, c.nev, nil)
			require.NoError(t, err)
			require.Equal(t, c.nev, res.Len())
			for i := 0; i < c.nev; i++ {
				w := c.omega(c.n, i+1)
				if w == 0 {
					assert.True(t, res.RigidBody(i), "mode %d", i)
					assert.InDelta(t, 0, res.Values[i], 1e-9*k/m) // exact 0 (free chain); round-off against the scale k/m
					assert.Equal(t, 0.0, res.Frequency(i))
					continue
				}
				assert.False(t, res.RigidBody(i), "mode %d", i)
				assert.InEpsilon(t, w*w, res.Values[i], freqTol, "mode %d", i)
				assert.InEpsilon(t, w/(2*math.Pi), res.Frequency(i), freqTol, "mode %d", i)
			}
			assert.True(t, res.Checked)
			assert.Equal(t, c.nev, res.SturmCount)
		})
	}
}

// TestRepeatedEigenvalues uses two identical uncoupled chains: every
// eigenvalue is double. With block size 1 the Lanczos process finds one
// copy of each; the Sturm check must catch the rest (continuing the
// search), never return a short list silently.
func TestRepeatedEigenvalues(t *testing.T) {
	const n, k, m = 60, 1e4, 1.0
	K, M := chains(2, n, k, m, true)
	for _, block := range []int{1, 2, 3} {
		t.Run(fmt.Sprintf("block%d", block), func(t *testing.T) {
			res, err := eigen.Lowest(K, M, 6, &eigen.Settings{BlockSize: block})
			require.NoError(t, err)
			for j := 1; j <= 3; j++ {
				// Fixed-free chain closed form (Meirovitch), each twice.
				w := 2 * math.Sqrt(k/m) * math.Sin(float64(2*j-1)*math.Pi/float64(2*(2*n+1)))
				assert.InEpsilon(t, w*w, res.Values[2*j-2], freqTol)
				assert.InEpsilon(t, w*w, res.Values[2*j-1], freqTol)
			}
			assert.True(t, res.Checked)
			assertMOrthonormal(t, res, M)
		})
	}
}

// TestDenseMatchesGonumGeneral cross-checks Dense (Cholesky reduction)
// against gonum's nonsymmetric eigensolver (mat.Eigen) on M⁻¹·K, an
// independent route to the same eigenvalues, on a small pencil.
func TestDenseMatchesGonumGeneral(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	c := randomNetwork(rng, 25, true, true, 0)
	K, M := eigen.DenseOf(c.k), eigen.DenseOf(c.m)
	res, err := eigen.Dense(K, M, 25)
	require.NoError(t, err)
	var minvK mat.Dense
	require.NoError(t, minvK.Solve(M, K))
	var ge mat.Eigen
	require.True(t, ge.Factorize(&minvK, mat.EigenNone))
	var ref []float64
	for _, v := range ge.Values(nil) {
		ref = append(ref, real(v))
	}
	sortFloats(ref)
	for i := range ref {
		// The nonsymmetric solver is backward stable for M⁻¹K, whose
		// condition is that of M: allow 1e-9 relative.
		assert.InEpsilon(t, ref[i], res.Values[i], 1e-9, "mode %d", i)
	}
}

func sortFloats(a []float64) {
	for i := 1; i < len(a); i++ {
		for j := i; j > 0 && a[j] < a[j-1]; j-- {
			a[j], a[j-1] = a[j-1], a[j]
		}
	}
}

// TestInputErrors: bad input gives a clear error, never a panic.
func TestInputErrors(t *testing.T) {
	K, M := chain(5, 1, 1, true)
	Kbig, _ := chain(6, 1, 1, true)
	nanB := sparse.NewBuilder(5)
	for i := 0; i < 5; i++ {
		nanB.Add(i, i, 1)
	}
	nanB.Add(2, 1, math.NaN())
	zeroM := sparse.NewBuilder(5)
	zeroM.Add(0, 0, 0)
	cases := []struct {
		name string
		k, m *sparse.Matrix
		n    int
		msg  string
	}{
		{"n zero", K, M, 0, "asked for 0 modes"},
		{"n too big", K, M, 6, "asked for 6 modes"},
		{"size mismatch", Kbig, M, 2, "K is 6×6 but M is 5×5"},
		{"NaN", nanB.Matrix(), M, 2, "K(2, 1) = NaN"},
		{"no mass", K, zeroM.Matrix(), 2, "no mass"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			res, err := eigen.Lowest(c.k, c.m, c.n, nil)
			require.Error(t, err)
			assert.Nil(t, res)
			assert.Contains(t, err.Error(), c.msg)
			assert.Contains(t, err.Error(), "eigen:")
		})
	}
}

// TestLowestUserShift: with a shift inside the spectrum Lowest returns the
// eigenvalues nearest it, and the Sturm check bounds them on both sides.
func TestLowestUserShift(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for trial := 0; trial < 4; trial++ {
		c := randomNetwork(rng, 60+20*trial, true, trial%2 == 1, 0)
		ref := denseAll(t, c.k, c.m)
		sigma := ref[10+trial] + 0.37*(ref[11+trial]-ref[10+trial])
		const nev = 5
		t.Run(c.name, func(t *testing.T) {
			res, err := eigen.Lowest(c.k, c.m, nev, &eigen.Settings{Shift: sigma, ShiftSet: true})
			require.NoError(t, err)
			// The nev dense eigenvalues nearest σ, ascending.
			near := append([]float64(nil), ref...)
			for i := range near {
				for j := i + 1; j < len(near); j++ {
					if math.Abs(near[j]-sigma) < math.Abs(near[i]-sigma) {
						near[i], near[j] = near[j], near[i]
					}
				}
			}
			near = near[:nev]
			sortFloats(near)
			for i := range near {
				assert.InEpsilon(t, near[i], res.Values[i], freqTol, "mode %d", i)
			}
			require.True(t, res.Checked)
			inside := 0
			for _, v := range ref {
				if v >= res.SturmLow && v < res.SturmShift {
					inside++
				}
			}
			assert.Equal(t, inside, res.SturmCount)
			assert.Less(t, res.SturmLow, res.Values[0])
			assert.Greater(t, res.SturmShift, res.Values[nev-1])
		})
	}
}

// TestManyRigidModes: four identical free-free chains, not connected, have
// four rigid-body modes and every other eigenvalue four times, more than
// the block size. All must be found (continuing after the Sturm check).
func TestManyRigidModes(t *testing.T) {
	const n, k, m, copies = 30, 1e4, 2.0, 4
	K, M := chains(copies, n, k, m, false)
	res, err := eigen.Lowest(K, M, 2*copies, nil)
	require.NoError(t, err)
	for i := 0; i < copies; i++ {
		assert.True(t, res.RigidBody(i), "mode %d", i)
	}
	// Free-free chain (path Laplacian): ω₂ = 2√(k/m)·sin(π/(2n)), four times.
	w := 2 * math.Sqrt(k/m) * math.Sin(math.Pi/float64(2*n))
	for i := copies; i < 2*copies; i++ {
		assert.False(t, res.RigidBody(i), "mode %d", i)
		assert.InEpsilon(t, w*w, res.Values[i], freqTol, "mode %d", i)
	}
	assert.True(t, res.Checked)
	assert.Equal(t, 2*copies, res.SturmCount)
	assertMOrthonormal(t, res, M)
}

// TestFiftyModes: n = 50 needs several thick restarts of a basis holding
// more than the wanted vectors; compare with the dense reference.
func TestFiftyModes(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	c := randomNetwork(rng, 400, true, false, 0)
	ref := denseAll(t, c.k, c.m)
	const nev = 50
	res, err := eigen.Lowest(c.k, c.m, nev, nil)
	require.NoError(t, err)
	require.Equal(t, nev, res.Len())
	for i := 0; i < nev; i++ {
		assert.InEpsilon(t, ref[i], res.Values[i], freqTol, "mode %d", i)
		assert.Less(t, res.Residuals[i], residTol)
	}
	assert.True(t, res.Checked)
	assert.Equal(t, nev, res.SturmCount)
	assertMOrthonormal(t, res, c.m)
}

// TestShiftAtEigenvalue: a user shift of exactly 0 on a free-free chain
// makes K − σM = K singular (the rigid-body mode); Lowest moves the shift
// and still returns the right modes.
func TestShiftAtEigenvalue(t *testing.T) {
	const n, k, m = 50, 1e5, 1.5
	K, M := chain(n, k, m, false)
	res, err := eigen.Lowest(K, M, 4, &eigen.Settings{Shift: 0, ShiftSet: true})
	require.NoError(t, err)
	assert.NotEqual(t, 0.0, res.Shift, "the shift must have been moved")
	assert.True(t, res.RigidBody(0))
	for j := 2; j <= 4; j++ {
		// Free-free chain closed form (path Laplacian, see TestChainClosedForm).
		w := 2 * math.Sqrt(k/m) * math.Sin(float64(j-1)*math.Pi/float64(2*n))
		assert.InEpsilon(t, w*w, res.Values[j-1], freqTol, "mode %d", j)
	}
	assert.True(t, res.Checked)
	_, err = eigen.CountBelow(K, M, 0)
	var se *eigen.SingularError
	assert.ErrorAs(t, err, &se, "K − 0·M is singular")
}

// TestAllModes asks for every eigenpair of small problems.
func TestAllModes(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for _, n := range []int{1, 2, 5, 13, 30} {
		t.Run(fmt.Sprintf("n%d", n), func(t *testing.T) {
			K, M := chain(n, 3e3, 2, true)
			res, err := eigen.Lowest(K, M, n, &eigen.Settings{BlockSize: 1 + rng.IntN(3)})
			require.NoError(t, err)
			require.Equal(t, n, res.Len())
			for j := 1; j <= n; j++ {
				// Fixed-free chain closed form (Meirovitch, see TestChainClosedForm).
				w := 2 * math.Sqrt(3e3/2.0) * math.Sin(float64(2*j-1)*math.Pi/float64(2*(2*n+1)))
				assert.InEpsilon(t, w*w, res.Values[j-1], freqTol, "mode %d", j)
			}
			assert.True(t, res.Checked)
			assert.Equal(t, n, res.SturmCount)
		})
	}
}

// TestCounter: a Counter reused over shifts gives the dense counts.
func TestCounter(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	c := randomNetwork(rng, 70, true, true, 0)
	ref := denseAll(t, c.k, c.m)
	cnt, err := eigen.NewCounter(c.k, c.m, nil)
	require.NoError(t, err)
	for _, i := range []int{0, 3, 17, 40, 69} {
		// Midway between dense eigenvalues i−1 and i: exactly i below.
		sigma := ref[i] - 1
		if i > 0 {
			sigma = 0.5 * (ref[i-1] + ref[i])
		}
		got, err := cnt.Below(sigma)
		require.NoError(t, err)
		assert.Equal(t, i, got, "σ = %g", sigma)
		one, err := eigen.CountBelow(c.k, c.m, sigma)
		require.NoError(t, err)
		assert.Equal(t, got, one, "a fresh count agrees with the reused one")
	}
}
