package element

import "math"

// Spring6 holds the six stiffnesses of a spring in global directions:
// KX, KY, KZ [N/m] act on the translations UX, UY, UZ and KRX, KRY, KRZ
// [N·m/rad] on the rotations RX, RY, RZ. A zero entry means no stiffness in
// that direction. Directions are uncoupled.
type Spring6 [6]float64

// AxialSpringStiffness returns the stiffness of a spring of stiffness k [N/m]
// acting along the line from end a to end b, over the translations of end a
// then end b [N/m]:
//
//	K = k·[ c·cᵀ  −c·cᵀ ]
//	      [ −c·cᵀ  c·cᵀ ]
//
// with c = f.Ex. It is the bar matrix with EA/L replaced by k.
func AxialSpringStiffness(f Frame, k float64) Mat6 {
	return axialBlock(f.Ex, k)
}

// AxialSpringForce returns the force in an axial spring [N], tension
// (extension) positive: F = k·c·(u_b − u_a).
func AxialSpringForce(f Frame, k float64, ua, ub Vec3) float64 {
	return k * dot(f.Ex, sub(ub, ua))
}

// SpringStiffness returns the 12×12 global stiffness of a two-node spring
// with stiffness k per global direction, over the six DOF of end a then the
// six of end b:
//
//	K = [ D  −D ]    D = diag(KX, KY, KZ, KRX, KRY, KRZ)
//	    [ −D  D ]
//
// The spring ignores the positions of its ends: it couples the same
// direction at both ends, so it is meant for short or zero-length links
// (a mount, a pad, a bolted joint). Assemble the block form directly with
// the diagonal k if allocation matters.
func SpringStiffness(k Spring6) Mat12 {
	var m Mat12
	for i, v := range k {
		m[i][i], m[i+6][i+6] = v, v
		m[i][i+6], m[i+6][i] = -v, -v
	}
	return m
}

// SpringForce returns the six spring forces and moments of a two-node spring
// [N, N·m]: F_i = k_i·(u_b,i − u_a,i). A positive value is a spring
// extended in direction i; it pulls end a in +i and end b in −i.
func SpringForce(k Spring6, ua, ub Vec6) Vec6 {
	var f Vec6
	for i := range f {
		f[i] = k[i] * (ub[i] - ua[i])
	}
	return f
}

// GroundSpringStiffness returns the 6×6 diagonal stiffness of a spring from
// one node to the fixed ground, over the six DOF of the node.
func GroundSpringStiffness(k Spring6) Mat6 {
	var m Mat6
	for i, v := range k {
		m[i][i] = v
	}
	return m
}

// GroundSpringForce returns the forces and moments the ground spring exerts
// on the ground [N, N·m]: F_i = k_i·u_i. The node feels −F (the reaction
// the spring gives it).
func GroundSpringForce(k Spring6, u Vec6) Vec6 {
	var f Vec6
	for i := range f {
		f[i] = k[i] * u[i]
	}
	return f
}

// Valid reports whether every stiffness of k is finite and not negative.
func (k Spring6) Valid() bool {
	for _, v := range k {
		if v < 0 || math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

// SpringStiffnessInAxes returns the 12×12 global stiffness of a two-node
// spring whose six stiffnesses act along and about the axes given by the
// rows of r (orthonormal, global components; f.Rotation() of a Frame, for
// instance). With T = diag(R, R, R, R):
//
//	K = Tᵀ·[ D  −D ]·T
//	       [ −D  D ]
//
// It is SpringStiffness for r = I. Like SpringStiffness it ignores the
// positions of the ends.
func SpringStiffnessInAxes(r Mat3, k Spring6) Mat12 {
	d := SpringStiffness(k)
	return toGlobal(&d, Frame{Ex: r[0], Ey: r[1], Ez: r[2]})
}

// GroundSpringStiffnessInAxes returns the 6×6 global stiffness of a ground
// spring whose stiffnesses act along and about the rows of r:
// K = diag(Rᵀ·Dt·R, Rᵀ·Dr·R).
func GroundSpringStiffnessInAxes(r Mat3, k Spring6) Mat6 {
	var m Mat6
	for i := range 3 {
		for j := range 3 {
			var t, q float64
			for a := range 3 {
				t += r[a][i] * k[a] * r[a][j]
				q += r[a][i] * k[a+3] * r[a][j]
			}
			m[i][j], m[i+3][j+3] = t, q
		}
	}
	return m
}

// SpringForceInAxes returns the six forces and moments of a two-node spring
// with axes r, in those axes [N, N·m]; positive when extended, as for
// SpringForce.
func SpringForceInAxes(r Mat3, k Spring6, ua, ub Vec6) Vec6 {
	var f Vec6
	for i := range 3 {
		var dt, dr float64
		for j := range 3 {
			dt += r[i][j] * (ub[j] - ua[j])
			dr += r[i][j] * (ub[j+3] - ua[j+3])
		}
		f[i], f[i+3] = k[i]*dt, k[i+3]*dr
	}
	return f
}
