package springnet_test

import (
	"math"
	"math/cmplx"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
	"gonum.org/v1/gonum/mat"
)

// frfTol: the modal sum with every mode included equals the direct
// solution up to round-off in sums of a few terms near resonance.
const frfTol = 1e-9

// oneDOF is a rigid top of kg on four massless legs of stiffness EA/L,
// free only vertically, with loss factor eta in the legs.
func oneDOF(ea, l, kg float64, eta materials.Range) (*springnet.Model, springnet.GroupID) {
	var m springnet.Model
	var tops []springnet.NodeID
	for i, c := range [4][2]float64{{0, 0}, {1, 0}, {1, 1}, {0, 1}} {
		b := m.AddNode("", springnet.Vec{X: c[0], Y: c[1]})
		top := m.AddNode("", springnet.Vec{X: c[0], Y: c[1], Z: l})
		m.Fix(b, springnet.AllDOF)
		m.AddBar(b, top, springnet.Bar{Name: "leg" + string(rune('1'+i)), EA: ea, Loss: eta})
		tops = append(tops, top)
	}
	g := m.AddRigidGroup("top", tops...)
	m.FixGroup(g, springnet.UX|springnet.UY|springnet.RX|springnet.RY|springnet.RZ)
	m.AddMass(g, springnet.Mass{Kg: kg})
	return &m, g
}

// Single DOF, viscous equivalent damping ζ = η/2 (closed forms: Thomson &
// Dahleh, Theory of Vibration with Applications, 5th ed., §3.1; Inman,
// Engineering Vibration, 4th ed., §2.2; section numbers from memory):
//
//	|H(ωₙ)| = 1/(2ζk),   H(0) = 1/k,
//	peak at ωₙ·√(1 − 2ζ²) with |H| = 1/(2ζ·√(1 − ζ²)·k)
func TestResponseSingleDOF(t *testing.T) {
	for _, tc := range []struct {
		name string
		eta  float64
	}{
		{"lightly damped steel", 0.002},
		{"elastomer mounts", 0.2},
	} {
		t.Run(tc.name, func(t *testing.T) {
			const ea, l, kg = 3e8, 0.9, 1500.0
			m, g := oneDOF(ea, l, kg, materials.Exact(tc.eta))
			k := 4 * ea / l
			fn := math.Sqrt(k/kg) / (2 * math.Pi)
			zeta := tc.eta / 2
			p := springnet.Probe{At: g, Dir: springnet.UZ}
			f, mr, err := springnet.Response(m, p, p, &springnet.ResponseSettings{Low: fn / 10, High: fn * 3, Points: 301})
			require.NoError(t, err)
			require.Equal(t, 1, mr.NumModes())
			assert.InEpsilon(t, zeta, mr.DampingRatio(0).Nominal, 1e-12) // ζ = η/2 of one material: one divide
			assert.InEpsilon(t, 1/(2*zeta*k), cmplx.Abs(f.At(fn)), frfTol)
			assert.InEpsilon(t, 1/k, real(f.At(1e-6*fn)), frfTol) // at r = 1e-6 the O(r²) term is 1e-12, under frfTol
			assert.InDelta(t, -math.Pi/2, cmplx.Phase(f.At(fn)), frfTol)
			tr := f.Truncation()
			assert.True(t, tr.Residual)
			assert.InDelta(t, 0, tr.ResidualCompliance, 1e-12/k, "one mode is the whole response")
			pk := f.Peaks()
			require.Len(t, pk, 1)
			// Golden-section search to 1e-12 of the frequency; the peak is
			// flat, so its frequency is good to about √1e-12.
			assert.InEpsilon(t, fn*math.Sqrt(1-2*zeta*zeta), pk[0].Frequency, 1e-5)
			assert.InEpsilon(t, 1/(2*zeta*math.Sqrt(1-zeta*zeta)*k), pk[0].Magnitude, 1e-9)
			assert.Equal(t, 0, pk[0].Mode)
			// Dynamic stiffness is the inverse.
			j := f.Len() / 2
			assert.InEpsilon(t, 1, cmplx.Abs(f.DynamicStiffness(j)*f.Receptance(j)), 1e-12)
		})
	}
}

// csolve solves the complex system a·x = b by Gaussian elimination with
// partial pivoting (a small dense reference; Golub & Van Loan, Matrix
// Computations, Gaussian elimination with partial pivoting, §3.4;
// section number from memory).
func csolve(a [][]complex128, b []complex128) []complex128 {
	n := len(b)
	for k := 0; k < n; k++ {
		p := k
		for i := k + 1; i < n; i++ {
			if cmplx.Abs(a[i][k]) > cmplx.Abs(a[p][k]) {
				p = i
			}
		}
		a[k], a[p] = a[p], a[k]
		b[k], b[p] = b[p], b[k]
		for i := k + 1; i < n; i++ {
			f := a[i][k] / a[k][k]
			for j := k; j < n; j++ {
				a[i][j] -= f * a[k][j]
			}
			b[i] -= f * b[k]
		}
	}
	x := make([]complex128, n)
	for i := n - 1; i >= 0; i-- {
		s := b[i]
		for j := i + 1; j < n; j++ {
			s -= a[i][j] * x[j]
		}
		x[i] = s / a[i][i]
	}
	return x
}

// Two DOF in a chain, ground–k₁–m₁–k₂–m₂, springs with loss factors η₁,
// η₂: the modal receptance against the direct solution of
//
//	(K − ω²M + iωC)·x = f
//
// with the proportional-equivalent damping C = M·Φ·diag(2ζᵣωᵣ)·Φᵀ·M
// (Φ M-orthonormal, so ΦᵀCΦ = diag(2ζᵣωᵣ)), Φ and ωᵣ from gonum's dense
// solver and ζᵣ = ηᵣ/2 from the modal strain energies computed here.
func TestResponseTwoDOFDirect(t *testing.T) {
	const k1, k2, m1, m2 = 4e7, 1.5e7, 300.0, 120.0
	const eta1, eta2 = 0.01, 0.12
	var m springnet.Model
	g := m.AddNode("ground", springnet.Vec{})
	a := m.AddNode("a", springnet.Vec{X: 0.3})
	b := m.AddNode("b", springnet.Vec{X: 0.6})
	m.Fix(g, springnet.AllDOF)
	m.Fix(a, springnet.UY|springnet.UZ)
	m.Fix(b, springnet.UY|springnet.UZ)
	m.AddSpring(g, a, springnet.Spring{K: springnet.Stiffness6{X: k1}, Loss: materials.Exact(eta1)})
	m.AddSpring(a, b, springnet.Spring{K: springnet.Stiffness6{X: k2}, Loss: materials.Exact(eta2)})
	m.AddMass(a, springnet.Mass{Kg: m1})
	m.AddMass(b, springnet.Mass{Kg: m2})

	mr, err := springnet.Modes(&m, &springnet.ModeSettings{Count: 2})
	require.NoError(t, err)
	require.Equal(t, 2, mr.NumModes())

	// Dense reference from first principles.
	K := mat.NewSymDense(2, []float64{k1 + k2, -k2, -k2, k2}) // the chain's stiffness
	M := mat.NewSymDense(2, []float64{m1, 0, 0, m2})
	// Standard form with L = diag(√m): A = L⁻¹·K·L⁻¹.
	A := mat.NewSymDense(2, []float64{(k1 + k2) / m1, -k2 / math.Sqrt(m1*m2), -k2 / math.Sqrt(m1*m2), k2 / m2})
	var es mat.EigenSym
	require.True(t, es.Factorize(A, true))
	w2 := es.Values(nil)
	var z mat.Dense
	es.VectorsTo(&z)
	phi := mat.NewDense(2, 2, nil)
	for r := 0; r < 2; r++ {
		phi.Set(0, r, z.At(0, r)/math.Sqrt(m1))
		phi.Set(1, r, z.At(1, r)/math.Sqrt(m2))
	}
	var zeta [2]float64
	for r := 0; r < 2; r++ {
		x1, x2 := phi.At(0, r), phi.At(1, r)
		u1, u2 := k1*x1*x1/2, k2*(x2-x1)*(x2-x1)/2
		zeta[r] = (eta1*u1 + eta2*u2) / (u1 + u2) / 2
		// 1e-10: a 2×2 eigenproblem solved two ways (gonum dense vs the library): round-off only.
		assert.InEpsilon(t, zeta[r], mr.DampingRatio(r).Nominal, 1e-10)
		assert.InEpsilon(t, math.Sqrt(w2[r])/(2*math.Pi), mr.Frequency(r), 1e-10)
	}
	var c, tmp mat.Dense
	d := mat.NewDiagDense(2, []float64{2 * zeta[0] * math.Sqrt(w2[0]), 2 * zeta[1] * math.Sqrt(w2[1])})
	tmp.Product(M, phi, d, phi.T(), M)
	c.CloneFrom(&tmp)

	probes := []springnet.Probe{{At: a, Dir: springnet.UX}, {At: b, Dir: springnet.UX}}
	f1, f2 := mr.Frequency(0), mr.Frequency(1)
	for _, pair := range [][2]int{{1, 1}, {1, 0}, {0, 1}, {0, 0}} {
		out, in := pair[0], pair[1]
		fr, err := mr.Receptance(probes[out], probes[in], &springnet.ResponseSettings{Low: f1 / 5, High: f2 * 2, Points: 50})
		require.NoError(t, err)
		for _, hz := range []float64{f1 / 5, f1 * 0.99, f1, (f1 + f2) / 2, f2, f2 * 1.7} {
			w := 2 * math.Pi * hz
			sys := make([][]complex128, 2)
			for i := 0; i < 2; i++ {
				sys[i] = make([]complex128, 2)
				for j := 0; j < 2; j++ {
					sys[i][j] = complex(K.At(i, j)-w*w*M.At(i, j), w*c.At(i, j))
				}
			}
			rhs := make([]complex128, 2)
			rhs[in] = 1
			x := csolve(sys, rhs)
			got := fr.At(hz)
			assert.InEpsilon(t, cmplx.Abs(x[out]), cmplx.Abs(got), frfTol, "H%d%d at %.4g Hz", out+1, in+1, hz)
			assert.InDelta(t, 0, cmplx.Abs(got-x[out])/cmplx.Abs(x[out]), frfTol, "H%d%d at %.4g Hz", out+1, in+1, hz)
		}
	}
}

// Truncation: with only the first modes of a cantilever, the residual
// flexibility restores the static compliance exactly (at ω → 0 the
// receptance equals the compliance the static solver gives,
// MountStiffness) and brings the receptance below the first mode close
// to the sum over all modes.
func TestResponseResidualFlexibility(t *testing.T) {
	sec := sections.RoundTube{D: 0.0603, T: 0.004}
	m, nodes := cantileverModel(12, 1.5, "clamped-free", sec)
	tip := nodes[len(nodes)-1]
	mid := nodes[6]
	out := springnet.Probe{At: tip, Dir: springnet.UZ}
	in := springnet.Probe{At: mid, Dir: springnet.UZ}
	few, err := springnet.Modes(m, &springnet.ModeSettings{Count: 2})
	require.NoError(t, err)
	all, err := springnet.Modes(m, &springnet.ModeSettings{Count: 30, Method: springnet.DenseMethod})
	require.NoError(t, err)
	f1 := few.Frequency(0)
	band := &springnet.ResponseSettings{Low: f1 / 10, High: f1 / 2, Points: 20}
	withRes, err := few.Receptance(out, in, band)
	require.NoError(t, err)
	noRes := *band
	noRes.NoResidual = true
	without, err := few.Receptance(out, in, &noRes)
	require.NoError(t, err)
	full, err := all.Receptance(out, in, &noRes)
	require.NoError(t, err)
	assert.True(t, withRes.Truncation().Residual)
	assert.False(t, without.Truncation().Residual)

	// Static compliance between the two points from the static solver:
	// unit load at mid, displacement at tip (Maxwell–Betti).
	mm, nodes2 := cantileverModel(12, 1.5, "clamped-free", sec)
	mm.AddLoad(nodes2[6], springnet.Load{FZ: 1})
	st, err := springnet.Static(mm, nil)
	require.NoError(t, err)
	cs := st.Displacement(nodes2[len(nodes2)-1]).UZ
	assert.InEpsilon(t, cs, real(withRes.At(1e-9*f1)), 1e-8) // static solve vs modal sum + residual flexibility: equal in exact arithmetic, 1e-8 for round-off of two solves

	hz := 0.3 * f1
	eRes := cmplx.Abs(withRes.At(hz) - full.At(hz))
	eNo := cmplx.Abs(without.At(hz) - full.At(hz))
	assert.Less(t, eRes, eNo/10, "the residual term must improve a truncated sum below the first mode")
}

// Bad inputs are errors naming the problem.
func TestResponseErrors(t *testing.T) {
	m, g := oneDOF(3e8, 0.9, 1500, materials.Range{})
	p := springnet.Probe{At: g, Dir: springnet.UZ}
	for _, tc := range []struct {
		name string
		s    *springnet.ResponseSettings
		p    springnet.Probe
		msg  string
	}{
		{"no settings", nil, p, "band"},
		{"band reversed", &springnet.ResponseSettings{Low: 50, High: 10}, p, "band"},
		{"no damping", &springnet.ResponseSettings{Low: 1, High: 200}, p, "no damping"},
		{"two directions", &springnet.ResponseSettings{Low: 1, High: 200, Ratio: 0.02}, springnet.Probe{At: g, Dir: springnet.UX | springnet.UY}, "direction"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, _, err := springnet.Response(m, tc.p, p, tc.s)
			require.Error(t, err)
			assert.Contains(t, err.Error(), "springnet: response")
			assert.Contains(t, err.Error(), tc.msg)
		})
	}
	// With an assumed ratio the undamped model has a finite response.
	f, _, err := springnet.Response(m, p, p, &springnet.ResponseSettings{Low: 1, High: 200, Ratio: 0.05})
	require.NoError(t, err)
	assert.Positive(t, f.Magnitude(0))
}
