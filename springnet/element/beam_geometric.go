package element

// BeamGeometricStiffness returns the consistent geometric (stress) stiffness
// of the beam in global axes for the axial force n [N], tension positive.
// It is Kg = N·∫ v'ᵀv' dx over the same cubic displacement fields as
// BeamStiffness (the Timoshenko ones when shear stiffness is given). In
// local axes, with Φ = 12·EIz/(κGAy·L²) (0 for Euler–Bernoulli), the x–y
// bending block over (v_a, θz_a, v_b, θz_b) is
//
//	N/(L(1+Φ)²)·[  g     L/10  −g     L/10
//	               L/10  L²r   −L/10  −L²t
//	              −g    −L/10   g    −L/10
//	               L/10 −L²t   −L/10   L²r ]
//
//	g = 6/5 + 2Φ + Φ²,  r = 2/15 + Φ/6 + Φ²/12,  t = 1/30 + Φ/6 + Φ²/12
//
// and the x–z block over (w, θy) is the same with Φ from EIy and κGAz and
// the w–θ couplings reversed. For Φ = 0 this is the familiar beam-column
// matrix (McGuire, Gallagher and Ziemian, Matrix Structural Analysis, 2nd
// ed.; Przemieniecki, stability chapter); the Φ terms follow from
// integrating with the Timoshenko cubics of DeflectedShape (derived for this
// package; checked against Engesser's shear-reduced Euler load in the tests).
//
// Stated simplifications: the coupling of torsion with axial force (the
// N·Ip/(A·L) terms, which govern torsional buckling of open sections) and
// the Wagner and end-moment terms are omitted. Releases and end springs are
// honoured by the congruence Pᵀ·Kg·P with the static map of BeamStiffness,
// so a released beam buckles with the shapes it deflects with.
//
// For linear buckling solve (K + λ·Kg)·φ = 0 with Kg from the reference axial
// forces; compression is n < 0.
func BeamGeometricStiffness(f Frame, p BeamProps, n float64) Mat12 {
	kg := beamLocalGeometric(n, f.L, shearPhi(p.EIz, p.GAsY, f.L), shearPhi(p.EIy, p.GAsZ, f.L))
	kg = throughJoints(kg, p, f.L)
	return toGlobal(&kg, f)
}

func beamLocalGeometric(n, l, phiY, phiZ float64) Mat12 {
	var k Mat12
	for _, pl := range [2]struct {
		t, r, tb, rb int
		sign, phi    float64
	}{{1, 5, 7, 11, 1, phiY}, {2, 4, 8, 10, -1, phiZ}} {
		ph := pl.phi
		s := n / (l * (1 + ph) * (1 + ph))
		a := (6.0/5 + 2*ph + ph*ph) * s
		b := pl.sign * l / 10 * s
		c := (2.0/15 + ph/6 + ph*ph/12) * l * l * s
		d := -(1.0/30 + ph/6 + ph*ph/12) * l * l * s
		addBlock(&k, [4]int{pl.t, pl.r, pl.tb, pl.rb}, [4][4]float64{
			{a, b, -a, b},
			{b, c, -b, d},
			{-a, -b, a, -b},
			{b, d, -b, c},
		})
	}
	return k
}
