package element

// BeamConsistentMass returns the consistent mass matrix of the beam in global
// axes [kg, kg·m, kg·m²], for mass per length m [kg/m] and polar mass moment
// of inertia per length mj [kg·m] (ρ·Ip; the torsional inertia). In local
// axes: axial and torsion (m·L/6)·[2 1; 1 2] and (mj·L/6)·[2 1; 1 2]; the
// x–y bending block over (v_a, θz_a, v_b, θz_b)
//
//	(m·L/420)·[ 156   22L   54   −13L
//	            22L   4L²   13L  −3L²
//	            54    13L   156  −22L
//	           −13L  −3L²  −22L   4L² ]
//
// and the x–z block over (w, θy) with the w–θ couplings reversed
// (Przemieniecki, Theory of Matrix Structural Analysis, inertia properties
// of a beam element; Cook et al., 4th ed., consistent mass). Rotary inertia of the cross-section in bending is
// not included. Releases and end springs are honoured by the congruence
// Pᵀ·M·P with the static map of BeamStiffness; p serves only for those.
func BeamConsistentMass(f Frame, p BeamProps, m, mj float64) Mat12 {
	ml := beamLocalMass(m, mj, f.L)
	if p.hasJoints() {
		var j joints
		j.init(p, f.L)
		pm := j.beamDOF()
		ml = congruent(&ml, &pm)
	}
	return toGlobal(&ml, f)
}

func beamLocalMass(m, mj, l float64) Mat12 {
	var k Mat12
	ax := m * l / 6
	k[0][0], k[6][6], k[0][6], k[6][0] = 2*ax, 2*ax, ax, ax
	tj := mj * l / 6
	k[3][3], k[9][9], k[3][9], k[9][3] = 2*tj, 2*tj, tj, tj
	s := m * l / 420
	for _, pl := range [2]struct {
		t, r, tb, rb int
		sign         float64
	}{{1, 5, 7, 11, 1}, {2, 4, 8, 10, -1}} {
		c1 := pl.sign * 22 * l * s
		c2 := pl.sign * 13 * l * s
		addBlock(&k, [4]int{pl.t, pl.r, pl.tb, pl.rb}, [4][4]float64{
			{156 * s, c1, 54 * s, -c2},
			{c1, 4 * l * l * s, c2, -3 * l * l * s},
			{54 * s, c2, 156 * s, -c1},
			{-c2, -3 * l * l * s, -c1, 4 * l * l * s},
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
