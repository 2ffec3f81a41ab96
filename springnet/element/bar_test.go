package element_test

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet/element"
)

// relTol is for results of a few dozen floating-point operations compared
// with closed forms: round-off is ~1e-15 relative; 1e-9 flags any formula
// error (which shows at the percent level) without flaking.
const relTol = 1e-9

func skewFrame(t *testing.T) element.Frame {
	t.Helper()
	f, err := element.NewFrame(element.Vec3{0.3, -0.2, 0.1}, element.Vec3{1.1, 0.5, 0.9}, element.Vec3{}, 0.4)
	require.NoError(t, err)
	return f
}

func TestBarStiffnessInvariants(t *testing.T) {
	f := skewFrame(t)
	const ea = 2e8 // N, a 1000 mm² steel bar (E = 200 GPa), demo data
	k := element.BarStiffness(f, ea)
	d := dense6(k)
	assert.True(t, isSym(d), "symmetric")
	// A pin-ended bar resists only stretching: rank 1 (Przemieniecki, pin-jointed member).
	assert.Equal(t, 1, rank(t, d, 1e-12)) // the zero singular values are round-off (~1e-16 of the largest)
	// Rigid-body motion gives no force.
	for i := range 6 {
		var tr, th element.Vec3
		if i < 3 {
			tr[i] = 1e-3
		} else {
			th[i-3] = 1e-3
		}
		ua, ub := rigidMotion(f.A, tr, th), rigidMotion(f.B(), tr, th)
		u := [6]float64{ua[0], ua[1], ua[2], ub[0], ub[1], ub[2]}
		for r := range 6 {
			s := 0.0
			for c := range 6 {
				s += k[r][c] * u[c]
			}
			assert.InDelta(t, 0, s, 1e-9*ea/f.L*1e-3, "rigid motion %d row %d", i, r) // 1e-9 of the force scale EA/L·θ (θ = 1e-3): round-off
		}
		assert.InDelta(t, 0, element.BarAxialForce(f, ea, element.Vec3(ua[:3]), element.Vec3(ub[:3])), 1e-9*ea*1e-3) // as above
	}
	// Stretching by δ along the axis: N = EA·δ/L, tension positive (Hooke's law).
	const delta = 1e-4
	ub := element.Vec3{delta * f.Ex[0], delta * f.Ex[1], delta * f.Ex[2]}
	assert.InEpsilon(t, ea*delta/f.L, element.BarAxialForce(f, ea, element.Vec3{}, ub), relTol)
	assert.InEpsilon(t, -ea*delta/f.L, element.BarAxialForce(f, ea, ub, element.Vec3{}), relTol)
}

// TestTwoBarTruss: a symmetric two-bar truss, bars at angle θ from the
// vertical meeting at the loaded apex. Statics: N = −P/(2 cos θ) in each
// bar; the apex drops δ = P·L/(2·EA·cos²θ) (Gere and Timoshenko, Mechanics
// of Materials, two-bar truss by the displacement method; Hibbeler,
// Mechanics of Materials, statically determinate truss).
func TestTwoBarTruss(t *testing.T) {
	const ea, p, theta, h = 1e7, 5e3, 0.6, 1.2
	apex := element.Vec3{0, 0, h}
	left := element.Vec3{-h * math.Tan(theta), 0, 0}
	right := element.Vec3{h * math.Tan(theta), 0, 0}
	fl, err := element.NewFrame(left, apex, element.Vec3{}, 0)
	require.NoError(t, err)
	fr, err := element.NewFrame(right, apex, element.Vec3{}, 0)
	require.NoError(t, err)
	s := newSystem(3) // 0 apex, 1 left, 2 right
	s.addBar(s.k, element.BarStiffness(fl, ea), 1, 0)
	s.addBar(s.k, element.BarStiffness(fr, ea), 2, 0)
	s.fixNode(1)
	s.fixNode(2)
	s.fixNode(0, 1, 3, 4, 5) // out of plane and rotations: a plane truss
	s.f[2] = -p
	u := s.solve(t)
	l := h / math.Cos(theta)
	assert.InEpsilon(t, -p*l/(2*ea*math.Cos(theta)*math.Cos(theta)), u[2], relTol)
	assert.InDelta(t, 0, u[0], 1e-12, "symmetric: no sway") // 1e-12 m: round-off beside u[2] ≈ 5e-4 m
	n := element.BarAxialForce(fl, ea, element.Vec3{}, element.Vec3{u[0], u[1], u[2]})
	assert.InEpsilon(t, -p/(2*math.Cos(theta)), n, relTol)
}

// TestBarGeometricStiffness: a taut string of tension N and length L pulled
// sideways at one end by δ resists with N·δ/L (string in tension, first-order
// statics of a rotated force); an axial motion or a rigid translation brings
// no geometric force.
func TestBarGeometricStiffness(t *testing.T) {
	f := skewFrame(t)
	const n, delta = 1.5e4, 1e-3
	kg := element.BarGeometricStiffness(f, n)
	assert.True(t, isSym(dense6(kg)))
	// End b moves by δ along Ey (across the bar).
	u := [6]float64{0, 0, 0, delta * f.Ey[0], delta * f.Ey[1], delta * f.Ey[2]}
	var fb element.Vec3
	for r := range 3 {
		for c := range 6 {
			fb[r] += kg[3+r][c] * u[c]
		}
	}
	assertVec(t, element.Vec3{n * delta / f.L * f.Ey[0], n * delta / f.L * f.Ey[1], n * delta / f.L * f.Ey[2]}, fb, 1e-9*n*delta/f.L, "string force")
	// Axial stretch and translation: nothing.
	for _, u := range [][6]float64{
		{0, 0, 0, f.Ex[0], f.Ex[1], f.Ex[2]},
		{1, 2, 3, 1, 2, 3},
	} {
		for r := range 6 {
			s := 0.0
			for c := range 6 {
				s += kg[r][c] * u[c]
			}
			assert.InDelta(t, 0, s, 1e-9*n/f.L) // 1e-9 of the scale N/L: round-off
		}
	}
}

// TestBarMass: a rigid translation of unit speed carries the whole mass,
// uᵀ·M·u = m·L, for both the consistent and the lumped matrix (Przemieniecki,
// inertia properties: mass matrices must reproduce rigid-body kinetic energy).
func TestBarMass(t *testing.T) {
	f := skewFrame(t)
	const m = 7.85 // kg/m: 1000 mm² of steel at 7850 kg/m³
	tests := []struct {
		name string
		mm   element.Mat6
	}{
		{"consistent", element.BarConsistentMass(f, m)},
		{"lumped", element.BarLumpedMass(f, m)},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			assert.True(t, isSym(dense6(tc.mm)))
			for d := range 3 {
				var u [6]float64
				u[d], u[d+3] = 1, 1
				e := 0.0
				for r := range 6 {
					for c := range 6 {
						e += u[r] * tc.mm[r][c] * u[c]
					}
				}
				assert.InEpsilon(t, m*f.L, e, relTol)
			}
		})
	}
	// Consistent mass: m·L/6·[2I, I; I, 2I] (Przemieniecki, pin-jointed member; Cook et al., bar element).
	c := element.BarConsistentMass(f, m)
	assert.InEpsilon(t, m*f.L/3, c[0][0], relTol)
	assert.InEpsilon(t, m*f.L/6, c[1][4], relTol)
	assert.Zero(t, c[0][1])
}
