package element_test

import (
	"fmt"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet/element"
)

// Demo section: a steel tube-like member with distinct EIy and EIz so that a
// mix-up of the two planes shows. Values are demo data, not a catalogue
// section.
var demo = element.BeamProps{
	EA:  2.1e8, // N
	EIy: 4.0e5, // N·m²
	EIz: 1.5e5, // N·m²
	GJ:  2.5e5, // N·m²
}

func withJoints(p element.BeamProps, ra, rb element.Release, sa, sb element.Vec3) element.BeamProps {
	p.ReleaseA, p.ReleaseB, p.RotSpringA, p.RotSpringB = ra, rb, sa, sb
	return p
}

// jointCases lists releases and end springs with the rank of the condensed
// stiffness, by counting (hand calculation): 12 DOF minus 6 rigid-body
// motions is 6; each released end rotation adds a DOF the beam ignores, and
// releasing both ends about the same axis turns that axis into a mechanism
// of the member (a pin-pin link keeps only its axial force in that plane; a
// torsion release at both ends leaves no torque).
var jointCases = []struct {
	name string
	p    element.BeamProps
	rank int
}{
	{"rigid", demo, 6},
	{"Timoshenko", func() element.BeamProps { p := demo; p.GAsY, p.GAsZ = 8e7, 3e7; return p }(), 6},
	{"RY at a", withJoints(demo, element.ReleaseRY, 0, element.Vec3{}, element.Vec3{}), 5},
	{"RZ at b", withJoints(demo, 0, element.ReleaseRZ, element.Vec3{}, element.Vec3{}), 5},
	{"pin at a", withJoints(demo, element.ReleasePin, 0, element.Vec3{}, element.Vec3{}), 4},
	{"RY both", withJoints(demo, element.ReleaseRY, element.ReleaseRY, element.Vec3{}, element.Vec3{}), 4},
	{"pin both", withJoints(demo, element.ReleasePin, element.ReleasePin, element.Vec3{}, element.Vec3{}), 2},
	{"RX at a", withJoints(demo, element.ReleaseRX, 0, element.Vec3{}, element.Vec3{}), 5},
	{"RX both", withJoints(demo, element.ReleaseRX, element.ReleaseRX, element.Vec3{}, element.Vec3{}), 5},
	{"all released both", withJoints(demo, element.ReleaseRX|element.ReleasePin, element.ReleaseRX|element.ReleasePin, element.Vec3{}, element.Vec3{}), 1},
	{"springs", withJoints(demo, 0, 0, element.Vec3{1e5, 2e5, 3e5}, element.Vec3{4e5, 0, 5e4}), 6},
	{"spring and release", withJoints(demo, element.ReleaseRY, 0, element.Vec3{1e5, 2e5, 3e5}, element.Vec3{0, 1e4, 0}), 5},
}

func TestBeamStiffnessInvariants(t *testing.T) {
	f := skewFrame(t)
	for _, tc := range jointCases {
		t.Run(tc.name, func(t *testing.T) {
			require.NoError(t, tc.p.Validate())
			k := element.BeamStiffness(f, tc.p)
			d := dense12(k)
			assert.True(t, isSym(d), "symmetric")
			// Rigid-body motion gives no force (the six rigid modes, about
			// the global origin, which is off the member).
			scale := maxAbs12(k)
			for i, r := range rigidBasis(f.A, f.B()) {
				fr := mul12(k, r)
				for j := range 12 {
					assert.InDelta(t, 0, fr[j], 1e-10*scale, "rigid mode %d, row %d", i, j) // 1e-10 of the largest entry: round-off
				}
			}
			// Force recovery under rigid motion: nothing (a small rotation
			// of 1e-3 rad, so the moment scale is EI·1e-3/L).
			for i, r := range rigidBasis(f.A, f.B()) {
				var ua, ub element.Vec6
				for j := range 6 {
					ua[j], ub[j] = 1e-3*r[j], 1e-3*r[6+j]
				}
				bf := element.BeamEndForces(f, tc.p, ua, ub)
				for j, v := range bf.Local {
					assert.InDelta(t, 0, v, 1e-10*scale*1e-3, "rigid mode %d, end force %d", i, j)
				}
			}
			// rankTol: singular values of a condensed beam span about EA/L
			// to GJ/L·(1/L²)… ~1e-5 of the largest; round-off sits near
			// 1e-16, so 1e-11 separates them cleanly.
			assert.Equal(t, tc.rank, rank(t, d, 1e-11))
			// Positive semi-definite: no negative eigenvalue beyond round-off.
			var es = eigSym(t, d)
			assert.GreaterOrEqual(t, es[0], -1e-10*scale)
		})
	}
}

// cantilever builds one beam from the origin to (L, 0, 0) with its local
// axes equal to the global ones (x along X, y along Y, z along Z), fixed at
// node 0.
func cantilever(t *testing.T, l float64, p element.BeamProps) (*system, element.Frame) {
	t.Helper()
	f, err := element.NewFrame(element.Vec3{}, element.Vec3{l, 0, 0}, element.Vec3{}, 0)
	require.NoError(t, err)
	s := newSystem(2)
	s.add12(s.k, element.BeamStiffness(f, p), 0, 1)
	s.fixNode(0)
	return s, f
}

// TestCantilever checks a single element against Euler–Bernoulli and
// Timoshenko closed forms for a cantilever (Gere and Timoshenko, Mechanics of
// Materials, table of beam deflections; Roark's Formulas for Stress and
// Strain, cantilever with end load; table number not quoted). One cubic element is exact for end loads.
func TestCantilever(t *testing.T) {
	const l, p, m = 1.6, 2e3, 500.0
	timo := demo
	timo.GAsY, timo.GAsZ = 4e6, 2.5e6 // deep, shear-soft section (demo data)
	tests := []struct {
		name  string
		props element.BeamProps
		load  int     // loaded DOF at the tip
		value float64 // load [N or N·m]
		dof   int     // measured DOF at the tip
		want  float64
	}{
		// δ = P·L³/(3·EI), bending in x–y about z.
		{"Fy tip deflection", demo, 1, p, 1, p * l * l * l / (3 * demo.EIz)},
		// θ = P·L²/(2·EI); θz = dv/dx > 0.
		{"Fy tip rotation", demo, 1, p, 5, p * l * l / (2 * demo.EIz)},
		// Same in x–z about y, load downwards.
		{"Fz tip deflection", demo, 2, -p, 2, -p * l * l * l / (3 * demo.EIy)},
		// θy = −dw/dx; dw/dx = −P·L²/(2EI) so θy = +P·L²/(2EI).
		{"Fz tip rotation", demo, 2, -p, 4, p * l * l / (2 * demo.EIy)},
		// End moment: δ = M·L²/(2EI), θ = M·L/EI.
		{"Mz tip deflection", demo, 5, m, 1, m * l * l / (2 * demo.EIz)},
		{"My tip rotation", demo, 4, m, 4, m * l / demo.EIy},
		// Axial δ = P·L/EA; torsion φ = T·L/GJ.
		{"axial", demo, 0, p, 0, p * l / demo.EA},
		{"torsion", demo, 3, m, 3, m * l / demo.GJ},
		// Timoshenko: δ = P·L³/(3EI) + P·L/(κGA) (Timoshenko and Gere,
		// Mechanics of Materials, shear deflection of a cantilever).
		{"Timoshenko Fy", timo, 1, p, 1, p*l*l*l/(3*timo.EIz) + p*l/timo.GAsY},
		{"Timoshenko Fz", timo, 2, p, 2, p*l*l*l/(3*timo.EIy) + p*l/timo.GAsZ},
		// Shear does not change the tip rotation under end load:
		// θ = P·L²/(2EI) still (same source).
		{"Timoshenko Fy rotation", timo, 1, p, 5, p * l * l / (2 * timo.EIz)},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s, _ := cantilever(t, l, tc.props)
			s.f[6+tc.load] = tc.value
			u := s.solve(t)
			assert.InEpsilon(t, tc.want, u[6+tc.dof], relTol)
		})
	}
}

// TestBeamSupportCases covers support conditions made with end restraints,
// releases and springs, against closed forms (Gere and Timoshenko, Mechanics
// of Materials, statically indeterminate beams).
func TestBeamSupportCases(t *testing.T) {
	const l, p, m = 1.6, 2e3, 500.0
	ei := demo.EIz
	tests := []struct {
		name  string
		props element.BeamProps
		fixB  []int // restrained DOF at node b (x–y plane analysis)
		load  int
		value float64
		dof   int
		want  float64
	}{
		// Fixed-guided: tip translates without rotating, δ = P·L³/(12EI).
		{"fixed-guided", demo, []int{5}, 1, p, 1, p * l * l * l / (12 * ei)},
		// Same, but the beam is released about z at b: the guide no longer
		// acts, stiffness back to the cantilever's 3EI/L³.
		{"guided node, released beam end", withJoints(demo, 0, element.ReleaseRZ, element.Vec3{}, element.Vec3{}), []int{5}, 1, p, 1, p * l * l * l / (3 * ei)},
		// Propped cantilever (fixed a, roller b), moment at b:
		// θb = M·L/(4EI).
		{"propped, end moment", demo, []int{1}, 5, m, 5, m * l / (4 * ei)},
		// Pinned a (release at a, node fixed), roller b, moment at b:
		// simply supported beam, θb = M·L/(3EI).
		{"pinned by release, end moment", withJoints(demo, element.ReleaseRZ, 0, element.Vec3{}, element.Vec3{}), []int{1}, 5, m, 5, m * l / (3 * ei)},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s, _ := cantilever(t, l, tc.props)
			s.fixNode(1, tc.fixB...)
			s.f[6+tc.load] = tc.value
			u := s.solve(t)
			assert.InEpsilon(t, tc.want, u[6+tc.dof], relTol)
		})
	}
}

// TestCantileverRotationalSpring: a cantilever whose base joint is a
// rotational spring k: δ = P·L³/(3EI) + P·L²/k (rigid-body rotation P·L/k of
// the beam adds L·P·L/k; superposition, closed form). Checked in both planes.
func TestCantileverRotationalSpring(t *testing.T) {
	const l, p = 1.6, 2e3
	const kz, ky = 3e5, 8e5 // N·m/rad, demo joint stiffnesses
	props := withJoints(demo, 0, 0, element.Vec3{0, ky, kz}, element.Vec3{})
	s, f := cantilever(t, l, props)
	s.f[6+1] = p
	s.f[6+2] = p
	u := s.solve(t)
	assert.InEpsilon(t, p*l*l*l/(3*demo.EIz)+p*l*l/kz, u[7], relTol)
	assert.InEpsilon(t, p*l*l*l/(3*demo.EIy)+p*l*l/ky, u[8], relTol)
	// The beam-end moment at a equals the spring moment P·L (statics).
	var ua, ub element.Vec6
	copy(ub[:], u[6:12])
	bf := element.BeamEndForces(f, props, ua, ub)
	assert.InEpsilon(t, p*l, math.Abs(bf.A.Mz), relTol)
	assert.InEpsilon(t, p*l, math.Abs(bf.A.My), relTol)
}

// TestReleaseAtFixedEndIsMechanism: a cantilever whose only support is
// released about z can swing in the x–y plane; the reduced stiffness is
// singular (one zero singular value, by counting).
func TestReleaseAtFixedEndIsMechanism(t *testing.T) {
	s, _ := cantilever(t, 1.6, withJoints(demo, element.ReleaseRZ, 0, element.Vec3{}, element.Vec3{}))
	kr := s.reduce(s.k)
	assert.Equal(t, 5, rank(t, kr, 1e-11), "one free swing out of six DOF") // 1e-11: rankTol as in TestBeamStiffnessInvariants
}

// TestSkewedCantilever: the cantilever turned to an arbitrary direction, with
// a roll, deflects the same in its own axes: tip load along Ez gives
// P·L³/(3·EIy) along Ez and nothing across (frame invariance; closed form as
// in TestCantilever).
func TestSkewedCantilever(t *testing.T) {
	const p = 2e3
	f := skewFrame(t)
	s := newSystem(2)
	s.add12(s.k, element.BeamStiffness(f, demo), 0, 1)
	s.fixNode(0)
	for i := range 3 {
		s.f[6+i] = p * f.Ez[i]
	}
	u := s.solve(t)
	tip := element.Vec3{u[6], u[7], u[8]}
	l := f.L
	assert.InEpsilon(t, p*l*l*l/(3*demo.EIy), dot3(tip, f.Ez), relTol)
	assert.InDelta(t, 0, dot3(tip, f.Ey), 1e-9*p*l*l*l/(3*demo.EIy))
	assert.InDelta(t, 0, dot3(tip, f.Ex), 1e-9*p*l*l*l/(3*demo.EIy))
	// Tip rotation about −Ey... θy = +P·L²/(2EIy) about local y for a load
	// along −z; here the load is along +z so the rotation is −P·L²/(2EIy).
	rot := element.Vec3{u[9], u[10], u[11]}
	assert.InEpsilon(t, -p*l*l/(2*demo.EIy), dot3(rot, f.Ey), relTol)
}

// TestBeamEndForces: cantilever along X, tip load −P along Z. Statics: shear
// Vz = −P along the span (on the +x face), My(x) = P·(L − x), so My = P·L at
// the root and 0 at the tip; nothing else.
func TestBeamEndForces(t *testing.T) {
	const l, p = 1.6, 2e3
	s, f := cantilever(t, l, demo)
	s.f[8] = -p
	u := s.solve(t)
	var ua, ub element.Vec6
	copy(ub[:], u[6:12])
	bf := element.BeamEndForces(f, demo, ua, ub)
	tol := 1e-9 * p * l
	assert.InEpsilon(t, -p, bf.A.Vz, relTol)
	assert.InEpsilon(t, -p, bf.B.Vz, relTol)
	assert.InEpsilon(t, p*l, bf.A.My, relTol)
	assert.InDelta(t, 0, bf.B.My, tol)
	assert.InEpsilon(t, p*l/2, bf.At(0.5).My, relTol)
	for _, sf := range []element.SectionForces{bf.A, bf.B} {
		assert.InDelta(t, 0, sf.N, tol)
		assert.InDelta(t, 0, sf.Vy, tol)
		assert.InDelta(t, 0, sf.T, tol)
		assert.InDelta(t, 0, sf.Mz, tol)
	}
	// Matrix convention: the node at b pushes the member with the load.
	assert.InEpsilon(t, -p, bf.Local[8], relTol)

	// Axial tension and torsion: N = P, T = M (statics).
	s2, _ := cantilever(t, l, demo)
	s2.f[6], s2.f[9] = p, 300
	u2 := s2.solve(t)
	copy(ub[:], u2[6:12])
	bf = element.BeamEndForces(f, demo, ua, ub)
	assert.InEpsilon(t, p, bf.A.N, relTol)
	assert.InEpsilon(t, p, bf.B.N, relTol)
	assert.InEpsilon(t, 300, bf.A.T, relTol)
}

// TestReleasedEndCarriesNoMoment: a beam released about z at b, with both
// nodes moved arbitrarily, has Mz = 0 at b; with both bending axes released
// at both ends it carries only axial force and torque (pin-pin link).
func TestReleasedEndCarriesNoMoment(t *testing.T) {
	f := skewFrame(t)
	ua := element.Vec6{1e-3, -2e-3, 5e-4, 1e-3, 2e-3, -3e-3}
	ub := element.Vec6{-4e-4, 1e-3, 2e-3, -2e-3, 1e-3, 4e-3}
	tol := 1e-9 * demo.EIz * 1e-3 // moment scale of the imposed rotations
	bf := element.BeamEndForces(f, withJoints(demo, 0, element.ReleaseRZ, element.Vec3{}, element.Vec3{}), ua, ub)
	assert.InDelta(t, 0, bf.B.Mz, tol)
	assert.Greater(t, math.Abs(bf.A.Mz), 1e3*tol, "the other end still carries moment")
	bf = element.BeamEndForces(f, withJoints(demo, element.ReleasePin, element.ReleasePin, element.Vec3{}, element.Vec3{}), ua, ub)
	for _, v := range []float64{bf.A.My, bf.A.Mz, bf.B.My, bf.B.Mz, bf.A.Vy, bf.A.Vz} {
		assert.InDelta(t, 0, v, tol)
	}
	assert.Greater(t, math.Abs(bf.A.N), 1.0)
	// Torsion released at both ends: no torque.
	bf = element.BeamEndForces(f, withJoints(demo, element.ReleaseRX, element.ReleaseRX, element.Vec3{}, element.Vec3{}), ua, ub)
	assert.InDelta(t, 0, bf.A.T, tol)
	assert.InDelta(t, 0, bf.B.T, tol)
	assert.Greater(t, math.Abs(bf.A.Mz), 1e3*tol, "bending still carried")
}

// TestDeflectedShape: the cantilever elastic curve under tip load is
// v(x) = P·x²·(3L − x)/(6EI) (Gere and Timoshenko, table of cantilever
// deflections), a cubic, so the Hermite interpolation is exact; at mid-span
// v = 5PL³/(48EI). Checked on the skewed member in global coordinates.
func TestDeflectedShape(t *testing.T) {
	const p, n = 2e3, 5
	f := skewFrame(t)
	s := newSystem(2)
	s.add12(s.k, element.BeamStiffness(f, demo), 0, 1)
	s.fixNode(0)
	for i := range 3 {
		s.f[6+i] = p * f.Ey[i]
	}
	u := s.solve(t)
	var ua, ub element.Vec6
	copy(ub[:], u[6:12])
	const mag = 10.0
	pts := element.DeflectedShape(nil, f, demo, ua, ub, n, mag)
	require.Len(t, pts, n)
	l := f.L
	for i, pt := range pts {
		x := l * float64(i) / (n - 1)
		v := p * x * x * (3*l - x) / (6 * demo.EIz)
		want := element.Vec3{}
		for j := range 3 {
			want[j] = f.A[j] + x*f.Ex[j] + mag*v*f.Ey[j]
		}
		assertVec(t, want, pt, 1e-12, fmt.Sprintf("point %d", i)) // Hermite cubic is exact here: round-off only (m)
	}
}

// TestCombinedStress: σ = |N|/A + |My|/Sy + |Mz|/Sz at the worst corner;
// a hand calculation: 10 kN on 1000 mm² is 10 MPa, 2 kN·m on 4e-5 m³ is
// 50 MPa, 1 kN·m on 2e-5 m³ is 50 MPa, total 110 MPa.
func TestCombinedStress(t *testing.T) {
	s := element.SectionForces{N: -1e4, My: 2e3, Mz: -1e3}
	got, err := element.CombinedStress(s, 1e-3, 4e-5, 2e-5)
	require.NoError(t, err)
	assert.InEpsilon(t, 110e6, got, relTol)
	_, err = element.CombinedStress(s, 0, 4e-5, 2e-5)
	assert.ErrorContains(t, err, "element:")
	_, err = element.CombinedStress(s, 1e-3, math.NaN(), 2e-5)
	assert.Error(t, err)
	bf := element.BeamForces{A: s, B: element.SectionForces{N: -1e4}}
	got, err = bf.MaxStress(1e-3, 4e-5, 2e-5)
	require.NoError(t, err)
	assert.InEpsilon(t, 110e6, got, relTol)
}

func TestBeamPropsValidate(t *testing.T) {
	require.NoError(t, demo.Validate())
	bad := []struct {
		name string
		p    element.BeamProps
		want string
	}{
		{"zero EA", func() element.BeamProps { p := demo; p.EA = 0; return p }(), "EA"},
		{"negative GAsY", func() element.BeamProps { p := demo; p.GAsY = -1; return p }(), "GAsY"},
		{"NaN spring", func() element.BeamProps { p := demo; p.RotSpringB[2] = math.NaN(); return p }(), "RotSpringB[z]"},
		{"unknown release bit", func() element.BeamProps { p := demo; p.ReleaseA = 1 << 6; return p }(), "release"},
	}
	for _, tc := range bad {
		t.Run(tc.name, func(t *testing.T) {
			err := tc.p.Validate()
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
			assert.Contains(t, err.Error(), "element:")
		})
	}
}

// TestDeflectedShapeTimoshenko: a shear-flexible cantilever under tip load
// deflects v(x) = P·x²(3L − x)/(6EI) + P·x/(κGA) (bending plus constant shear
// strain P/κGA; Timoshenko and Gere, Mechanics of Materials, shear
// deflection of a cantilever).
func TestDeflectedShapeTimoshenko(t *testing.T) {
	const l, p, n = 1.6, 2e3, 9
	props := demo
	props.GAsY, props.GAsZ = 4e6, 2.5e6
	s, f := cantilever(t, l, props)
	s.f[7], s.f[8] = p, p
	u := s.solve(t)
	var ua, ub element.Vec6
	copy(ub[:], u[6:12])
	pts := element.DeflectedShape(nil, f, props, ua, ub, n, 1)
	require.Len(t, pts, n)
	// Round-off scale: the largest tip deflection (a tolerance proportional
	// to each point's own deflection would demand an exact zero at the root).
	tip := max(p*l*l*l/(3*props.EIz)+p*l/props.GAsY, p*l*l*l/(3*props.EIy)+p*l/props.GAsZ)
	for i, pt := range pts {
		x := l * float64(i) / (n - 1)
		vy := p*x*x*(3*l-x)/(6*props.EIz) + p*x/props.GAsY
		vz := p*x*x*(3*l-x)/(6*props.EIy) + p*x/props.GAsZ
		assertVec(t, element.Vec3{x, vy, vz}, pt, 1e-9*tip, fmt.Sprintf("point %d", i))
	}
}
