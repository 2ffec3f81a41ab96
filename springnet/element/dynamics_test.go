package element_test

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/mat"

	"github.com/trestle-go/trestle/springnet/element"
)

// column builds n equal beam elements from the origin to (L, 0, 0).
func column(t *testing.T, n int, l float64) []element.Frame {
	t.Helper()
	fs := make([]element.Frame, n)
	for i := range n {
		a := element.Vec3{l * float64(i) / float64(n)}
		b := element.Vec3{l * float64(i+1) / float64(n)}
		f, err := element.NewFrame(a, b, element.Vec3{}, 0)
		require.NoError(t, err)
		fs[i] = f
	}
	return fs
}

// bucklingLoad returns the smallest positive λ of (K + λ·Kg)·φ = 0 for a
// unit compression (N = −1 in every element): the critical load [N].
func bucklingLoad(t *testing.T, s *system, kg *mat.Dense) float64 {
	t.Helper()
	a := s.reduce(kg)
	a.Scale(-1, a)
	// K·φ = λ·(−Kg)·φ ⇔ (−Kg)·φ = μ·K·φ with μ = 1/λ; K is positive
	// definite once supported, −Kg need not be.
	mu := genEig(t, a, s.reduce(s.k))
	return 1 / mu[len(mu)-1]
}

// TestEulerColumn: a pinned–pinned column, buckling about its weaker axis
// (EIz < EIy), P = π²·EIz/L² (Euler; Timoshenko and Gere, Theory of Elastic
// Stability, pin-ended column). One element gives 12·EI/L² (hand calculation with the
// consistent geometric stiffness: antisymmetric end rotations, 2EI/L = P·L/6);
// more elements converge from above; 8 within 0.5 % (task brief).
func TestEulerColumn(t *testing.T) {
	const l = 2.5
	euler := math.Pi * math.Pi * demo.EIz / (l * l)
	prev := math.Inf(1)
	for _, n := range []int{1, 2, 4, 8, 16} {
		fs := column(t, n, l)
		s := newSystem(n + 1)
		kg := mat.NewDense(s.n, s.n, nil)
		for i, f := range fs {
			s.add12(s.k, element.BeamStiffness(f, demo), i, i+1)
			s.add12(kg, element.BeamGeometricStiffness(f, demo, -1), i, i+1)
		}
		s.fixNode(0, 0, 1, 2, 3) // pin: translations and twist
		s.fixNode(n, 1, 2)       // roller: lateral translations
		pcr := bucklingLoad(t, s, kg)
		switch n {
		case 1:
			assert.InEpsilon(t, 12*demo.EIz/(l*l), pcr, 1e-9, "one element")
		case 8:
			// Brief: within 0.5 %.
			assert.InEpsilon(t, euler, pcr, 0.005, "8 elements")
		}
		assert.GreaterOrEqual(t, pcr, euler*(1-1e-9), "upper bound (Rayleigh–Ritz)")
		assert.Less(t, pcr, prev, "converges from above")
		prev = pcr
		t.Logf("n = %2d: P/P_Euler = %.7f", n, pcr/euler)
	}
}

// TestFixedPinnedColumnByRelease: a column fixed at the base and pinned at
// the top, the pin made by releasing the last element's top end. Critical load
// P = (4.4934)²·EI/L², 4.4934 the first root of tan x = x (Timoshenko and
// Gere, Theory of Elastic Stability, column fixed at one end and pinned at
// the other; effective length 0.699 L).
func TestFixedPinnedColumnByRelease(t *testing.T) {
	const l, n = 2.5, 8
	const x1 = 4.493409457909064 // first positive root of tan x = x
	want := x1 * x1 * demo.EIz / (l * l)
	fs := column(t, n, l)
	s := newSystem(n + 1)
	kg := mat.NewDense(s.n, s.n, nil)
	for i, f := range fs {
		p := demo
		if i == n-1 {
			p.ReleaseB = element.ReleasePin
		}
		s.add12(s.k, element.BeamStiffness(f, p), i, i+1)
		s.add12(kg, element.BeamGeometricStiffness(f, p, -1), i, i+1)
	}
	s.fixNode(0)
	// Top node: lateral translations held; its bending rotations belong to
	// nothing once released, so restrain them too; twist held.
	s.fixNode(n, 1, 2, 3, 4, 5)
	pcr := bucklingLoad(t, s, kg)
	// Tolerance: 8 cubic elements are within ~1e-4 for the Euler case;
	// 0.5 % as in the brief.
	assert.InEpsilon(t, want, pcr, 0.005)
	assert.GreaterOrEqual(t, pcr, want*(1-1e-9))
}

// TestPinnedBeamGeometricIsBar: a beam pinned at both ends keeps only the
// chord rotation, whose geometric stiffness is the bar's (N/L)(I − c·cᵀ)
// (Przemieniecki, stability chapter: string stiffness of a pin-ended member).
func TestPinnedBeamGeometricIsBar(t *testing.T) {
	f := skewFrame(t)
	const n = -3e4
	p := withJoints(demo, element.ReleasePin, element.ReleasePin, element.Vec3{}, element.Vec3{})
	kb := element.BeamGeometricStiffness(f, p, n)
	bar := element.BarGeometricStiffness(f, n)
	for i := range 6 {
		for j := range 6 {
			r, c := (i/3)*6+i%3, (j/3)*6+j%3
			assert.InDelta(t, bar[i][j], kb[r][c], 1e-9*math.Abs(n)/f.L, "(%d,%d)", i, j) // 1e-9 of N/L: round-off of the condensation
		}
	}
}

func TestBeamGeometricInvariants(t *testing.T) {
	f := skewFrame(t)
	for _, tc := range jointCases {
		t.Run(tc.name, func(t *testing.T) {
			kg := element.BeamGeometricStiffness(f, tc.p, 1e4)
			assert.True(t, isSym(dense12(kg)))
			// Rigid translations bring no geometric force (Kg depends
			// only on relative transverse motion).
			rb := rigidBasis(f.A, f.B())
			for i, r := range rb[:3] {
				fr := mul12(kg, r)
				for j := range 12 {
					assert.InDelta(t, 0, fr[j], 1e-10*maxAbs12(kg), "translation %d row %d", i, j) // 1e-10 of the largest entry: round-off
				}
			}
		})
	}
}

// TestBeamMassRigidBody: the kinetic energy of rigid motion at unit speed:
// translation m·L; rotation about the member's centre across the axis
// m·L³/12 (slender rod about its centre, any dynamics text); twist mj·L.
// The consistent matrix reproduces all three exactly because rigid motions
// lie in its shape functions (Przemieniecki, inertia properties); lumped matrices keep
// the translation only.
func TestBeamMassRigidBody(t *testing.T) {
	f := skewFrame(t)
	const m, mj = 12.0, 0.03 // kg/m, kg·m (demo data)
	l := f.L
	mid := element.Vec3{}
	for i := range 3 {
		mid[i] = 0.5 * (f.A[i] + f.B()[i])
	}
	motion := func(tr, th element.Vec3) element.Vec12 {
		ua := rigidMotion(sub3(f.A, mid), tr, th)
		ub := rigidMotion(sub3(f.B(), mid), tr, th)
		var u element.Vec12
		copy(u[:6], ua[:])
		copy(u[6:], ub[:])
		return u
	}
	energy := func(mm element.Mat12, u element.Vec12) float64 {
		mu := mul12(mm, u)
		e := 0.0
		for i := range 12 {
			e += u[i] * mu[i]
		}
		return e
	}
	cons := element.BeamConsistentMass(f, demo, m, mj)
	assert.True(t, isSym(dense12(cons)))
	for _, d := range []element.Vec3{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}, f.Ex} {
		assert.InEpsilon(t, m*l, energy(cons, motion(d, element.Vec3{})), relTol, "translation %v", d)
	}
	assert.InEpsilon(t, m*l*l*l/12, energy(cons, motion(element.Vec3{}, f.Ey)), relTol, "rotation about y")
	assert.InEpsilon(t, m*l*l*l/12, energy(cons, motion(element.Vec3{}, f.Ez)), relTol, "rotation about z")
	assert.InEpsilon(t, mj*l, energy(cons, motion(element.Vec3{}, f.Ex)), relTol, "twist")
	for _, rotary := range []bool{false, true} {
		lump := element.BeamLumpedMass(f, m, mj, rotary)
		assert.True(t, isSym(dense12(lump)))
		for _, d := range []element.Vec3{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}} {
			assert.InEpsilon(t, m*l, energy(lump, motion(d, element.Vec3{})), relTol)
		}
		assert.InEpsilon(t, mj*l, energy(lump, motion(element.Vec3{}, f.Ex)), relTol, "twist")
	}
	// The Timoshenko consistent mass keeps them too.
	timo := demo
	timo.GAsY, timo.GAsZ = 2e5, 3e5 // very shear-soft: Φ of order 10 (demo data)
	mt := element.BeamConsistentMass(f, timo, m, mj)
	assert.InEpsilon(t, m*l, energy(mt, motion(element.Vec3{0, 0, 1}, element.Vec3{})), relTol)
	assert.InEpsilon(t, m*l*l*l/12, energy(mt, motion(element.Vec3{}, f.Ey)), relTol)
	assert.InEpsilon(t, m*l*l*l/12, energy(mt, motion(element.Vec3{}, f.Ez)), relTol)
	// A released beam keeps its rigid-body energies (the static map P
	// preserves rigid motions).
	rel := withJoints(demo, element.ReleasePin, element.ReleaseRY, element.Vec3{}, element.Vec3{0, 0, 1e4})
	mr := element.BeamConsistentMass(f, rel, m, mj)
	assert.InEpsilon(t, m*l, energy(mr, motion(element.Vec3{1, 0, 0}, element.Vec3{})), relTol)
	assert.InEpsilon(t, m*l*l*l/12, energy(mr, motion(element.Vec3{}, f.Ez)), relTol)
}

// modes returns the natural circular frequencies [rad/s] of s with mass s.m,
// ascending, via K·φ = ω²·M·φ ⇔ M·φ = μ·K·φ, μ = 1/ω², which also works for
// a lumped M with massless rotations.
func modes(t *testing.T, s *system) []float64 {
	t.Helper()
	mu := genEig(t, s.reduce(s.m), s.reduce(s.k))
	var w []float64
	for i := len(mu) - 1; i >= 0; i-- {
		if mu[i] > 0 {
			w = append(w, 1/math.Sqrt(mu[i]))
		}
	}
	return w
}

// TestCantileverFrequencies: the clamped-free beam with 20 elements against
// ω = (βL)²·√(EI/(m·L⁴)), βL = 1.87510407 and 4.69409113 (Blevins, Formulas for
// Natural Frequency and Mode Shape, Table 8-1, clamped-free; digits past
// 1.8751 and 4.6941 from memory); the two bending planes give the first two
// modes here (EIz < EIy), the second EIz mode the third. Within 1 % (task brief); the consistent matrix is
// far closer.
func TestCantileverFrequencies(t *testing.T) {
	const l, n, m, mj = 2.0, 20, 10.0, 0.01
	w := func(bl, ei float64) float64 { return bl * bl * math.Sqrt(ei/(m*l*l*l*l)) }
	want := []float64{w(1.87510407, demo.EIz), w(1.87510407, demo.EIy), w(4.69409113, demo.EIz)}
	tests := []struct {
		name string
		mass func(element.Frame) element.Mat12
		// tol: 1 % for the lumped matrices (task brief; measured −0.5 % at
		// mode 3); 1e-4 for the consistent one, whose error falls as h⁴
		// (measured 2.1e-6 at mode 3), so a lumped-quality result fails it.
		tol float64
	}{
		{"consistent", func(f element.Frame) element.Mat12 { return element.BeamConsistentMass(f, demo, m, mj) }, 1e-4},
		{"lumped with rotary", func(f element.Frame) element.Mat12 { return element.BeamLumpedMass(f, m, mj, true) }, 0.01},
		{"lumped", func(f element.Frame) element.Mat12 { return element.BeamLumpedMass(f, m, mj, false) }, 0.01},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s := newSystem(n + 1)
			for i, f := range column(t, n, l) {
				s.add12(s.k, element.BeamStiffness(f, demo), i, i+1)
				s.add12(s.m, tc.mass(f), i, i+1)
			}
			s.fixNode(0)
			got := modes(t, s)
			require.GreaterOrEqual(t, len(got), 3)
			for i, wv := range want {
				assert.InEpsilon(t, wv, got[i], tc.tol, "mode %d", i+1)
				t.Logf("mode %d: ω/ω_exact − 1 = %.2e", i+1, got[i]/wv-1)
			}
		})
	}
}

// TestShaftFrequencies: torsion and axial modes of a clamped-free member,
// ω = (π/2L)·√(GJ/mj) and (π/2L)·√(EA/m) (Blevins, Table 8-16/8-17 for
// uniform shafts and rods; table numbers from memory). 20 linear elements
// with consistent mass err by ~(π/2/20)²/24 ≈ 0.03 %; 0.1 % allowed.
func TestShaftFrequencies(t *testing.T) {
	const l, n, m, mj = 2.0, 20, 10.0, 0.05
	tests := []struct {
		name string
		dof  int
		want float64
	}{
		{"torsion", 3, math.Pi / (2 * l) * math.Sqrt(demo.GJ/mj)},
		{"axial", 0, math.Pi / (2 * l) * math.Sqrt(demo.EA/m)},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s := newSystem(n + 1)
			for i, f := range column(t, n, l) {
				s.add12(s.k, element.BeamStiffness(f, demo), i, i+1)
				s.add12(s.m, element.BeamConsistentMass(f, demo, m, mj), i, i+1)
			}
			for i := range n + 1 {
				for d := range 6 {
					if d != tc.dof || i == 0 {
						s.fixNode(i, d)
					}
				}
			}
			got := modes(t, s)
			require.NotEmpty(t, got)
			assert.InEpsilon(t, tc.want, got[0], 1e-3) // 0.1 %: above the ~0.03 % discretisation error (doc comment)
		})
	}
}

// TestEngesserColumn: shear flexibility lowers the Euler load of a pinned
// column to P = P_e / (1 + P_e/(κGA)) (Engesser; Timoshenko and Gere, Theory
// of Elastic Stability, effect of shearing force on the critical load).
// With the Timoshenko geometric stiffness the discrete loads fall towards it
// from above; 8 elements within 0.5 % (task-brief tolerance).
func TestEngesserColumn(t *testing.T) {
	const l = 2.5
	pe := math.Pi * math.Pi * demo.EIz / (l * l)
	props := demo
	props.GAsY, props.GAsZ = 5*pe, 1e3*pe // P_e/κGA = 0.2 in the weak plane
	want := pe / (1 + pe/props.GAsY)
	prev := math.Inf(1)
	for _, n := range []int{2, 4, 8, 16} {
		fs := column(t, n, l)
		s := newSystem(n + 1)
		kg := mat.NewDense(s.n, s.n, nil)
		for i, f := range fs {
			s.add12(s.k, element.BeamStiffness(f, props), i, i+1)
			s.add12(kg, element.BeamGeometricStiffness(f, props, -1), i, i+1)
		}
		s.fixNode(0, 0, 1, 2, 3)
		s.fixNode(n, 1, 2)
		pcr := bucklingLoad(t, s, kg)
		t.Logf("n = %2d: P/P_Engesser − 1 = %.2e", n, pcr/want-1)
		if n == 8 {
			assert.InEpsilon(t, want, pcr, 0.005)
		}
		assert.GreaterOrEqual(t, pcr, want*(1-1e-9), "upper bound")
		assert.Less(t, pcr, prev, "converges from above")
		prev = pcr
	}
}

// TestSimplySupportedTimoshenkoFrequencies: a pinned–pinned beam with shear
// flexibility and no rotary inertia vibrates at
// ω_n² = ω_e,n² / (1 + (nπ/L)²·EI/(κGA)), ω_e,n = (nπ/L)²·√(EI/m)
// (hand derivation from the Timoshenko beam equations with the rotary
// inertia term dropped, mode shape sin(nπx/L); cf. Timoshenko, Young and
// Weaver, Vibration Problems in Engineering, effect of shear). 16 elements,
// within 0.5 % (same tolerance as the buckling tests). Measured: the error
// falls as h² (1.3e-3, 3.2e-4, 8.0e-5 for 8, 16, 32 elements in mode 1),
// as the short elements here are shear-dominated (Φ ≈ 78 at 16 elements).
func TestSimplySupportedTimoshenkoFrequencies(t *testing.T) {
	const l, n, m, mj = 2.5, 16, 10.0, 0.01
	k := math.Pi / l
	props := demo
	props.GAsY, props.GAsZ = 4*k*k*demo.EIz, 4*k*k*demo.EIy // shear term 0.25 at n = 1
	w := func(mode, ei, gas float64) float64 {
		kn := mode * k
		return kn * kn * math.Sqrt(ei/m) / math.Sqrt(1+kn*kn*ei/gas)
	}
	want := []float64{w(1, props.EIz, props.GAsY), w(1, props.EIy, props.GAsZ), w(2, props.EIz, props.GAsY)}
	s := newSystem(n + 1)
	for i, f := range column(t, n, l) {
		s.add12(s.k, element.BeamStiffness(f, props), i, i+1)
		s.add12(s.m, element.BeamConsistentMass(f, props, m, mj), i, i+1)
	}
	s.fixNode(0, 0, 1, 2, 3)
	s.fixNode(n, 1, 2)
	got := modes(t, s)
	require.GreaterOrEqual(t, len(got), 3)
	for i, wv := range want {
		t.Logf("mode %d: ω/ω_exact − 1 = %.2e", i+1, got[i]/wv-1)
		assert.InEpsilon(t, wv, got[i], 0.005, "mode %d", i+1)
	}
}
