// Package element holds the matrices of single members in global axes, ready
// to be added into a structure's matrices, and the recovery of member forces
// from the nodal displacements a solve produces.
//
// # Elements
//
//   - Bar: a pin-ended axial member (BarStiffness, BarAxialForce,
//     BarGeometricStiffness, BarConsistentMass, BarLumpedMass), over the
//     three translations of each end.
//   - Springs: an axial spring along a→b (AxialSpringStiffness), a two-node
//     spring with one stiffness per global direction (SpringStiffness), and a
//     ground spring from a node to the fixed ground (GroundSpringStiffness).
//   - Beam: a 3D two-node beam with axial, two bending and torsion stiffness,
//     Euler–Bernoulli or Timoshenko, with end releases and rotational end
//     springs (BeamStiffness and friends).
//
// # Units
//
// SI throughout: m, N, Pa, kg, s, rad. EA, GAs [N]; EI, GJ [N·m²]; spring
// stiffness [N/m] or [N·m/rad]; mass per length [kg/m]; polar mass moment per
// length [kg·m].
//
// # Axes and degrees of freedom
//
// Global axes are X, Y, Z. Each node carries UX, UY, UZ, RX, RY, RZ in that
// order; a two-node matrix (Mat12) orders the six DOF of end a then the six of
// end b, and a bar matrix (Mat6) the three translations of a then of b.
//
// A Frame gives a member's local axes: x from end a to end b; z in the plane
// of x and a reference up vector (global Z by default, global Y for a member
// along Z); y = z × x; then an optional roll about x. See NewFrame.
//
// # Sign conventions
//
// Axial forces are tension positive. Matrices act on displacements to give
// the forces the element applies... (see the function docs).
//
// # Errors
//
// Functions that can meet bad input (NewFrame, BeamStiffness) return an
// error starting with "element:" that wraps one of ErrZeroLength,
// ErrParallelUp, ErrNotFinite, so the caller can name the member and rewrap.
// The matrix functions do not check their numeric arguments; the model's
// validation is expected to reject NaN, Inf and negative stiffness first.
package element
