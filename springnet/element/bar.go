package element

// BarStiffness returns the global stiffness of a pin-ended axial member over
// the translations of end a then end b (UX, UY, UZ of a, then of b) [N/m]:
//
//	K = (EA/L)·[ c·cᵀ  −c·cᵀ ]
//	           [ −c·cᵀ  c·cᵀ ]
//
// with c = f.Ex the unit vector from a to b (Przemieniecki, Theory of
// Matrix Structural Analysis, pin-jointed member). ea is the axial
// stiffness E·A [N].
func BarStiffness(f Frame, ea float64) Mat6 {
	return axialBlock(f.Ex, ea/f.L)
}

// BarAxialForce returns the axial force of a bar [N], tension positive,
// from the global translations of its ends [m]:
//
//	N = (EA/L)·c·(u_b − u_a)
func BarAxialForce(f Frame, ea float64, ua, ub Vec3) float64 {
	return ea / f.L * dot(f.Ex, sub(ub, ua))
}

// BarGeometricStiffness returns the geometric (stress) stiffness of a bar
// carrying the axial force n [N] (tension positive) over the translations of
// end a then end b [N/m]:
//
//	Kg = (N/L)·[ I − c·cᵀ   −(I − c·cᵀ) ]
//	           [ −(I − c·cᵀ)  I − c·cᵀ  ]
//
// (Przemieniecki, stability chapter; McGuire, Gallagher and Ziemian, Matrix
// Structural Analysis, 2nd ed., truss element). For linear buckling solve
// (K + λ·Kg)·φ = 0 with Kg built from the reference axial forces; a
// compressed bar (n < 0) softens the structure.
func BarGeometricStiffness(f Frame, n float64) Mat6 {
	var k Mat6
	s := n / f.L
	c := f.Ex
	for i := range 3 {
		for j := range 3 {
			v := -c[i] * c[j]
			if i == j {
				v++
			}
			v *= s
			k[i][j], k[i+3][j+3] = v, v
			k[i][j+3], k[i+3][j] = -v, -v
		}
	}
	return k
}

// BarConsistentMass returns the consistent mass matrix of a bar over the
// translations of end a then end b [kg], for mass per length m [kg/m]:
//
//	M = (m·L/6)·[ 2I  I ]
//	            [ I  2I ]
//
// (Przemieniecki, inertia properties of a pin-jointed member with linear displacement
// along and across the axis). It does not depend on the member direction.
func BarConsistentMass(f Frame, m float64) Mat6 {
	var k Mat6
	s := m * f.L / 6
	for i := range 3 {
		k[i][i], k[i+3][i+3] = 2*s, 2*s
		k[i][i+3], k[i+3][i] = s, s
	}
	return k
}

// BarLumpedMass returns the lumped (diagonal) mass matrix of a bar over the
// translations of end a then end b [kg]: half of m·L at each end, in every
// direction.
func BarLumpedMass(f Frame, m float64) Mat6 {
	var k Mat6
	s := m * f.L / 2
	for i := range 6 {
		k[i][i] = s
	}
	return k
}

// axialBlock returns k·[c cᵀ, −c cᵀ; −c cᵀ, c cᵀ].
func axialBlock(c Vec3, k float64) Mat6 {
	var m Mat6
	for i := range 3 {
		for j := range 3 {
			v := k * c[i] * c[j]
			m[i][j], m[i+3][j+3] = v, v
			m[i][j+3], m[i+3][j] = -v, -v
		}
	}
	return m
}
