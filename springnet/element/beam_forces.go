package element

import (
	"fmt"
	"math"
)

// SectionForces are the stress resultants at a cross-section of a beam, in
// local axes, acting on the face whose outward normal is +x (the part of the
// member towards end a acts on the part towards end b with the opposite
// values):
//
//	N  axial force [N], tension positive
//	Vy, Vz  shear forces along local y, z [N]
//	T  torque about local x [N·m]
//	My, Mz  bending moments about local y, z [N·m]
//
// All components follow the right-hand rule about the local axes on that
// face, so the normal stress at local (y, z) in the section is
//
//	σ = N/A + My·z/Iy − Mz·y/Iz
//
// (a positive My stretches the fibres at +z, a positive Mz those at −y).
type SectionForces struct {
	N, Vy, Vz, T, My, Mz float64
}

// BeamForces holds the forces of a beam recovered from its end displacements.
type BeamForces struct {
	// Local holds the forces and moments the nodes apply to the member ends,
	// in local axes, order Fx, Fy, Fz, Mx, My, Mz at end a then end b
	// (the matrix convention: Local = K_local·u_local for the beam proper).
	Local Vec12
	// A and B are the section forces at end a and end b (see
	// SectionForces): A = −Local[0:6], B = Local[6:12].
	A, B SectionForces
}

// BeamEndForces returns the member forces of the beam from the global
// displacements of its end nodes ua, ub (UX, UY, UZ [m], RX, RY, RZ [rad]).
//
// Where an end is released or sprung, the beam's own end rotation is found
// from the static condensation, so a released moment comes out zero and a
// sprung one equals the spring moment. The recovery assumes no load along
// the span: N, Vy, Vz and T are constant and My, Mz vary linearly (see At).
func BeamEndForces(f Frame, p BeamProps, ua, ub Vec6) BeamForces {
	u := beamEndDisp(f, p, ua, ub)
	kb := BeamLocalStiffness(p, f.L)
	out := BeamForces{Local: mulVec(&kb, &u)}
	l := out.Local
	out.A = SectionForces{N: -l[0], Vy: -l[1], Vz: -l[2], T: -l[3], My: -l[4], Mz: -l[5]}
	out.B = SectionForces{N: l[6], Vy: l[7], Vz: l[8], T: l[9], My: l[10], Mz: l[11]}
	return out
}

// At returns the section forces at the fraction s ∈ [0, 1] of the length
// from end a, interpolating linearly between the ends; exact for a beam
// without span loads.
func (b BeamForces) At(s float64) SectionForces {
	lerp := func(x, y float64) float64 { return x + s*(y-x) }
	return SectionForces{
		N:  lerp(b.A.N, b.B.N),
		Vy: lerp(b.A.Vy, b.B.Vy),
		Vz: lerp(b.A.Vz, b.B.Vz),
		T:  lerp(b.A.T, b.B.T),
		My: lerp(b.A.My, b.B.My),
		Mz: lerp(b.A.Mz, b.B.Mz),
	}
}

// beamEndDisp returns the local displacements of the beam proper (with
// internal end rotations where released or sprung).
func beamEndDisp(f Frame, p BeamProps, ua, ub Vec6) Vec12 {
	u := localDisp(f, ua, ub)
	if !p.hasJoints() {
		return u
	}
	var j joints
	j.init(p, f.L)
	pm := j.beamDOF()
	return mulVec(&pm, &u)
}

// mulVec returns a·u.
func mulVec(a *Mat12, u *Vec12) Vec12 {
	var out Vec12
	for r := range 12 {
		s := 0.0
		for c := range 12 {
			s += a[r][c] * u[c]
		}
		out[r] = s
	}
	return out
}

// DeflectedShape appends to dst n ≥ 2 points along the deflected member, from
// end a to end b, in global coordinates [m]:
//
//	x_i = a + s_i·L·Ex + mag·Rᵀ·(u(s_i), v(s_i), w(s_i)),  s_i = i/(n−1)
//
// where u is linear between the end axial displacements and v, w interpolate
// the end translations and the beam's own end rotations (after releases and
// end springs; θz = dv/dx, θy = −dw/dx at an Euler–Bernoulli end). For the
// Euler–Bernoulli beam these are the Hermite cubics; with shear stiffness
// given they are the cubics of the Timoshenko beam under end loads, which
// add Φ·(shear) terms,
//
//	v(s) = [ (1 − 3s² + 2s³ + Φ(1 − s))·v_a + L(s − 2s² + s³ + Φ(s − s²)/2)·θ_a
//	       + (3s² − 2s³ + Φs)·v_b + L(s³ − s² − Φ(s − s²)/2)·θ_b ] / (1 + Φ)
//
// (Przemieniecki, beam element with shear deformation; Cook et al.,
// Timoshenko beam), so the shape is exact for a member without span load.
// mag magnifies the displacements for drawing (1 for true size). n < 2 is
// taken as 2.
func DeflectedShape(dst []Vec3, f Frame, p BeamProps, ua, ub Vec6, n int, mag float64) []Vec3 {
	if n < 2 {
		n = 2
	}
	u := beamEndDisp(f, p, ua, ub)
	l := f.L
	phiY, phiZ := shearPhi(p.EIz, p.GAsY, l), shearPhi(p.EIy, p.GAsZ, l)
	for i := range n {
		s := float64(i) / float64(n-1)
		loc := Vec3{
			(1-s)*u[0] + s*u[6],
			cubic(s, l, phiY, u[1], u[5], u[7], u[11]),
			cubic(s, l, phiZ, u[2], -u[4], u[8], -u[10]),
		}
		g := f.ToGlobal(loc)
		pt := add(f.A, scale(f.Ex, s*l))
		dst = append(dst, add(pt, scale(g, mag)))
	}
	return dst
}

// shearPhi returns Φ = 12·EI/(κGA·L²), 0 when gas is 0 (rigid in shear).
func shearPhi(ei, gas, l float64) float64 {
	if gas > 0 {
		return 12 * ei / (gas * l * l)
	}
	return 0
}

// cubic returns the transverse displacement at s of a beam with end
// translations va, vb and end rotations ta, tb (as dv/dx-type slopes).
func cubic(s, l, phi, va, ta, vb, tb float64) float64 {
	s2, s3 := s*s, s*s*s
	h := phi * (s - s2) / 2
	return ((1-3*s2+2*s3+phi*(1-s))*va +
		l*(s-2*s2+s3+h)*ta +
		(3*s2-2*s3+phi*s)*vb +
		l*(s3-s2-h)*tb) / (1 + phi)
}

// CombinedStress returns the largest absolute normal stress at the extreme
// fibres of a section [Pa] from axial force and biaxial bending:
//
//	σ = N/A ± My/Sy ± Mz/Sz,   max |σ| = |N|/A + |My|/Sy + |Mz|/Sz
//
// with A the area [m²] and Sy, Sz the elastic section moduli about local y
// and z [m³]. This is exact for sections whose extreme fibres in y and z
// meet at a corner (rectangles, I and box sections) and conservative for
// round ones, where √(My² + Mz²)/S applies. It returns an error if A, Sy or
// Sz is not positive and finite.
func CombinedStress(s SectionForces, a, sy, sz float64) (float64, error) {
	for _, v := range [...]struct {
		name string
		v    float64
	}{{"A", a}, {"Sy", sy}, {"Sz", sz}} {
		if !(v.v > 0) || math.IsInf(v.v, 0) {
			return 0, fmt.Errorf("element: stress: section %s = %g: must be positive and finite", v.name, v.v)
		}
	}
	return math.Abs(s.N)/a + math.Abs(s.My)/sy + math.Abs(s.Mz)/sz, nil
}

// MaxStress returns the largest CombinedStress over the two ends of the
// beam, which bound it along a span without load.
func (b BeamForces) MaxStress(a, sy, sz float64) (float64, error) {
	sa, err := CombinedStress(b.A, a, sy, sz)
	if err != nil {
		return 0, err
	}
	sb, _ := CombinedStress(b.B, a, sy, sz)
	return math.Max(sa, sb), nil
}
