package element_test

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet/element"
)

// TestSpringSeries: two springs in series between ground and a loaded node
// give k1·k2/(k1 + k2) in every direction (springs in series, any statics
// text); the force in each equals the load.
func TestSpringSeries(t *testing.T) {
	k1 := element.Spring6{1e6, 2e6, 3e6, 4e3, 5e3, 6e3}
	k2 := element.Spring6{3e6, 1e6, 5e5, 1e3, 2e4, 3e3}
	s := newSystem(3) // 0 ground, 1 middle, 2 loaded
	s.add12(s.k, element.SpringStiffness(k1), 0, 1)
	s.add12(s.k, element.SpringStiffness(k2), 1, 2)
	s.fixNode(0)
	load := element.Vec6{100, -200, 300, 4, -5, 6}
	copy(s.f[12:], load[:])
	u := s.solve(t)
	for i := range 6 {
		keq := k1[i] * k2[i] / (k1[i] + k2[i])
		assert.InEpsilon(t, load[i]/keq, u[12+i], relTol, "DOF %d", i)
	}
	var u1, u2 element.Vec6
	copy(u1[:], u[6:12])
	copy(u2[:], u[12:18])
	f2 := element.SpringForce(k2, u1, u2)
	for i := range 6 {
		// A load pulling node b in +i extends the spring: positive force.
		assert.InEpsilon(t, load[i], f2[i], relTol, "force %d", i)
	}
}

// TestGroundSpring: a node on a ground spring deflects F/k (Hooke's law); the
// spring pushes the ground with F.
func TestGroundSpring(t *testing.T) {
	k := element.Spring6{1e6, 2e6, 3e6, 4e3, 5e3, 6e3}
	g := element.GroundSpringStiffness(k)
	assert.True(t, isSym(dense6(g)))
	load := element.Vec6{10, 20, -30, 1, 2, -3}
	var u element.Vec6
	for i := range 6 {
		u[i] = load[i] / g[i][i]
		assert.InEpsilon(t, load[i]/k[i], u[i], relTol)
	}
	f := element.GroundSpringForce(k, u)
	for i := range 6 {
		assert.InEpsilon(t, load[i], f[i], relTol)
	}
}

// TestSpringRigidMotion: a two-node spring with coincident ends feels no
// force under any rigid translation, or under a rigid rotation (equal end
// rotations, equal translations at coincident ends).
func TestSpringRigidMotion(t *testing.T) {
	k := element.SpringStiffness(element.Spring6{1e6, 2e6, 3e6, 4e3, 5e3, 6e3})
	assert.True(t, isSym(dense12(k)))
	// Six independent directions: rank 6 (each direction one spring).
	assert.Equal(t, 6, rank(t, dense12(k), 1e-12)) // smallest/largest = 4e3/3e6 ≫ 1e-12; zeros would be round-off
	p := element.Vec3{0.4, 0.1, -0.3}
	for _, r := range rigidBasis(p, p) {
		f := mul12(k, r)
		for i := range 12 {
			assert.InDelta(t, 0, f[i], 1e-9) // rigid motion strains no spring; 1e-9 N is round-off against k ≤ 6e6
		}
	}
}

// TestAxialSpringMatchesBar: an axial spring of stiffness k is the bar with
// EA/L = k (same matrix by definition), and its force is k times the
// extension.
func TestAxialSpringMatchesBar(t *testing.T) {
	f := skewFrame(t)
	const k = 3.3e6
	s := element.AxialSpringStiffness(f, k)
	b := element.BarStiffness(f, k*f.L)
	for i := range 6 {
		for j := range 6 {
			assert.InDelta(t, b[i][j], s[i][j], relTol*k)
		}
	}
	const d = 2e-4
	ub := element.Vec3{d * f.Ex[0], d * f.Ex[1], d * f.Ex[2]}
	assert.InEpsilon(t, k*d, element.AxialSpringForce(f, k, element.Vec3{}, ub), relTol)
	require.True(t, element.Spring6{1, 0, 2, 0, 0, 0}.Valid())
	assert.False(t, element.Spring6{1, -1, 2, 0, 0, 0}.Valid())
}

// TestSpringInAxes: a spring with stiffness only along its first axis, that
// axis being a member's Ex, is the axial spring along the member
// (definition); a load along an axis of a ground spring moves the node F/k
// along that axis only (Hooke's law in the rotated axes).
func TestSpringInAxes(t *testing.T) {
	f := skewFrame(t)
	r := f.Rotation()
	const k = 2.5e6
	two := element.SpringStiffnessInAxes(r, element.Spring6{k})
	ax := element.AxialSpringStiffness(f, k)
	for i := range 6 {
		for j := range 6 {
			ri, rj := (i/3)*6+i%3, (j/3)*6+j%3
			assert.InDelta(t, ax[i][j], two[ri][rj], relTol*k)
		}
	}
	ks := element.Spring6{1e6, 2e6, 3e6, 4e3, 5e3, 6e3}
	g := element.GroundSpringStiffnessInAxes(r, ks)
	assert.True(t, isSym(dense6(g)))
	// Load F along Ey (the second axis): u = F/k₂ along Ey.
	const load = 500.0
	var fv [6]float64
	for i := range 3 {
		fv[i] = load * f.Ey[i]
	}
	u := solve6(t, g, fv)
	want := load / ks[1]
	assertVec(t, element.Vec3{want * f.Ey[0], want * f.Ey[1], want * f.Ey[2]}, element.Vec3{u[0], u[1], u[2]}, 1e-9*want, "ground spring") // 1e-9 relative: a 6×6 solve, round-off only
	// Two-node spring in axes: extension along Ez recovered as k₃·δ.
	const d = 1e-3
	ub := element.Vec6{d * f.Ez[0], d * f.Ez[1], d * f.Ez[2]}
	fr := element.SpringForceInAxes(r, ks, element.Vec6{}, ub)
	assert.InEpsilon(t, ks[2]*d, fr[2], relTol)
	assert.InDelta(t, 0, fr[0], 1e-9*ks[2]*d) // 1e-9 of the axial force: round-off of the axes
	// Rigid motions of coincident ends: no force.
	kk := element.SpringStiffnessInAxes(r, ks)
	for _, rb := range rigidBasis(f.A, f.A) {
		fr := mul12(kk, rb)
		for i := range 12 {
			assert.InDelta(t, 0, fr[i], 1e-9*ks[2]) // unit rigid motions strain nothing: round-off against k₃
		}
	}
}
