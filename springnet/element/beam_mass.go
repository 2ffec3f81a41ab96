package element

// BeamConsistentMass returns the consistent mass matrix of the beam in global
// axes [kg, kg·m, kg·m²], for mass per length m [kg/m] and polar mass moment
// of inertia per length mj [kg·m] (ρ·Ip; the torsional inertia). In local
// axes: axial and torsion (m·L/6)·[2 1; 1 2] and (mj·L/6)·[2 1; 1 2]; the
// x–y bending block over (v_a, θz_a, v_b, θz_b), with Φ as in
// BeamLocalStiffness (0 for Euler–Bernoulli),
//
//	m·L/(840(1+Φ)²)·[ a   b   c   d
//	                  b   e  −d   g
//	                  c  −d   a  −b
//	                  d   g  −b   e ]
//
//	a = 312 + 588Φ + 280Φ²      b = (44 + 77Φ + 35Φ²)·L
//	c = 108 + 252Φ + 140Φ²      d = −(26 + 63Φ + 35Φ²)·L
//	e = (8 + 14Φ + 7Φ²)·L²      g = −(6 + 14Φ + 7Φ²)·L²
//
// which for Φ = 0 is the familiar (m·L/420)·[156 22L 54 −13L; …]
// (Przemieniecki, Theory of Matrix Structural Analysis, inertia of a beam
// element with shear deformation, translational part; rederived for this
// package by integrating m·v² over the Timoshenko cubics of DeflectedShape).
// The x–z block over (w, θy) has the w–θ couplings reversed. Rotary inertia
// of the cross-section in bending is not included. Releases and end springs
// are honoured by the congruence Pᵀ·M·P with the static map of
// BeamStiffness; p serves only for Φ and those.
func BeamConsistentMass(f Frame, p BeamProps, m, mj float64) Mat12 {
	ml := beamLocalMass(m, mj, f.L, shearPhi(p.EIz, p.GAsY, f.L), shearPhi(p.EIy, p.GAsZ, f.L))
	ml = throughJoints(ml, p, f.L)
	return toGlobal(&ml, f)
}

func beamLocalMass(m, mj, l, phiY, phiZ float64) Mat12 {
	var k Mat12
	ax := m * l / 6
	k[0][0], k[6][6], k[0][6], k[6][0] = 2*ax, 2*ax, ax, ax
	tj := mj * l / 6
	k[3][3], k[9][9], k[3][9], k[9][3] = 2*tj, 2*tj, tj, tj
	for _, pl := range [2]struct {
		t, r, tb, rb int
		sign, phi    float64
	}{{1, 5, 7, 11, 1, phiY}, {2, 4, 8, 10, -1, phiZ}} {
		ph := pl.phi
		s := m * l / (840 * (1 + ph) * (1 + ph))
		a := (312 + 588*ph + 280*ph*ph) * s
		b := pl.sign * (44 + 77*ph + 35*ph*ph) * l * s
		c := (108 + 252*ph + 140*ph*ph) * s
		d := -pl.sign * (26 + 63*ph + 35*ph*ph) * l * s
		e := (8 + 14*ph + 7*ph*ph) * l * l * s
		g := -(6 + 14*ph + 7*ph*ph) * l * l * s
		addBlock(&k, [4]int{pl.t, pl.r, pl.tb, pl.rb}, [4][4]float64{
			{a, b, c, d},
			{b, e, -d, g},
			{c, -d, a, -b},
			{d, g, -b, e},
		})
	}
	return k
}

// BeamLumpedMass returns a lumped (diagonal in local axes) mass matrix of the
// beam in global axes: m·L/2 on each translation of each end, mj·L/2 on the
// twist of each end, and, if rotary is true, m·L³/78 on each end's rotation
// about local y and z. The 1/78 is HRZ lumping (Hinton, Rock and Zienkiewicz,
// 1976, from memory): the diagonal of the consistent matrix scaled so the translations
// carry the whole mass (4L²·mL/420 · 420/312 = mL³/78; Cook et al., 4th ed.,
// lumped mass). Without rotary the bending rotations carry no mass, and a modal
// analysis must then condense or restrain them.
func BeamLumpedMass(f Frame, m, mj float64, rotary bool) Mat12 {
	var k Mat12
	half := m * f.L / 2
	rot := 0.0
	if rotary {
		rot = m * f.L * f.L * f.L / 78
	}
	for _, b := range [2]int{0, 6} {
		k[b][b], k[b+1][b+1], k[b+2][b+2] = half, half, half
		k[b+3][b+3] = mj * f.L / 2
		k[b+4][b+4], k[b+5][b+5] = rot, rot
	}
	return toGlobal(&k, f)
}
