package element

// BeamGeometricStiffness returns the consistent geometric (stress) stiffness
// of the beam in global axes for the axial force n [N], tension positive.
// In local axes the x–y bending block over (v_a, θz_a, v_b, θz_b) is
//
//	(N/L)·[ 6/5    L/10    −6/5   L/10
//	        L/10   2L²/15  −L/10  −L²/30
//	       −6/5   −L/10     6/5  −L/10
//	        L/10  −L²/30   −L/10  2L²/15 ]
//
// and the x–z block over (w, θy) is the same with the w–θ couplings
// reversed (McGuire, Gallagher and Ziemian, Matrix Structural Analysis, 2nd
// ed., beam-column geometric stiffness without the torsion terms;
// Przemieniecki, stability chapter).
//
// Simplifications, stated: the coupling of torsion with axial force
// (the N·Ip/(A·L) terms, which govern torsional buckling of open sections)
// and the Wagner/moment terms are omitted; the cubic (Euler–Bernoulli) shape
// is used even when shear stiffness is given. Releases and end springs are
// honoured by the congruence Pᵀ·Kg·P with the same static map from node to
// beam-end rotations as BeamStiffness, so a released beam buckles with the
// shapes it deflects with.
//
// For linear buckling solve (K + λ·Kg)·φ = 0 with Kg from the reference axial
// forces; compression is n < 0.
func BeamGeometricStiffness(f Frame, p BeamProps, n float64) Mat12 {
	kg := beamLocalGeometric(n, f.L)
	if p.hasJoints() {
		var j joints
		j.init(p, f.L)
		pm := j.beamDOF()
		kg = congruent(&kg, &pm)
	}
	return toGlobal(&kg, f)
}

func beamLocalGeometric(n, l float64) Mat12 {
	var k Mat12
	s := n / l
	a := 6.0 / 5 * s
	b := l / 10 * s
	c := 2 * l * l / 15 * s
	d := -l * l / 30 * s
	for _, pl := range [2]struct {
		t, r, tb, rb int
		sign         float64
	}{{1, 5, 7, 11, 1}, {2, 4, 8, 10, -1}} {
		sb := pl.sign * b
		addBlock(&k, [4]int{pl.t, pl.r, pl.tb, pl.rb}, [4][4]float64{
			{a, sb, -a, sb},
			{sb, c, -sb, d},
			{-a, -sb, a, -sb},
			{sb, d, -sb, c},
		})
	}
	return k
}
