// Package element holds the matrices of single members in global axes, ready
// to be added into a structure's matrices, and the recovery of member forces,
// deflected shapes and stresses from the nodal displacements a solve gives.
// It imports nothing of trestle's; the springnet package assembles with it.
//
// # Elements
//
//   - Bar, a pin-ended axial member, over the three translations of each end
//     (Mat6): BarStiffness, BarAxialForce, BarGeometricStiffness,
//     BarConsistentMass, BarLumpedMass.
//   - Springs: an axial spring along a→b (AxialSpringStiffness, Mat6 over
//     translations); a two-node spring with one stiffness per global
//     direction, translations and rotations uncoupled (SpringStiffness,
//     Mat12); a ground spring from one node to the fixed ground
//     (GroundSpringStiffness, Mat6 diagonal over the node's six DOF).
//   - Beam, a 3D two-node member with axial, two bending and torsion
//     stiffness, Euler–Bernoulli or Timoshenko, with end releases and
//     rotational end springs (BeamProps): BeamStiffness,
//     BeamGeometricStiffness, BeamConsistentMass, BeamLumpedMass,
//     BeamEndForces, DeflectedShape, CombinedStress.
//
// All matrices are fixed-size arrays (Mat6, Mat12) returned by value, so
// assembly allocates nothing.
//
// # Units
//
// SI throughout: m, N, Pa, kg, s, rad. EA and κGA [N]; EI and GJ [N·m²];
// spring stiffness [N/m] or [N·m/rad]; mass per length [kg/m]; polar mass
// moment of inertia per length, ρ·Ip [kg·m].
//
// # Axes and degrees of freedom
//
// Global axes are X, Y, Z. Each node carries UX, UY, UZ, RX, RY, RZ in that
// order. A Mat12 orders the six DOF of end a then the six of end b; a bar
// matrix the three translations of a then of b.
//
// A Frame holds a member's local axes: x from end a to end b; z in the plane
// of x and a reference up vector, on the up side (global Z by default,
// global Y for a member along Z); y = z × x, so (x, y, z) is right-handed;
// then an optional roll turns y and z about x (right-hand rule).
//
// EIy resists bending about local y, that is deflection w along z in the
// local x–z plane; EIz resists bending about local z, deflection v along y
// in the x–y plane. Rotations follow the right-hand rule: θz = dv/dx and
// θy = −dw/dx. κGA along y (GAsY) pairs with EIz, along z (GAsZ) with EIy.
//
// # Sign conventions
//
// Stiffness matrices map displacements to the forces the nodes apply to the
// element (equal and opposite to what the element applies to the nodes), so
// they add directly into K·u = f. Axial forces are tension positive.
// BeamForces.Local keeps that matrix convention in local axes; the
// SectionForces at each end are stress resultants on the face with outward
// normal +x (N tension positive; σ = N/A + My·z/Iy − Mz·y/Iz). Spring forces
// are positive when the spring is extended (end b moved in +i relative to
// end a). Geometric stiffness is linear in the axial force N, with
// compression N < 0, for linear buckling (K + λ·Kg)·φ = 0.
//
// # Releases and end springs
//
// A released or sprung end rotation becomes an internal degree of freedom of
// the element, tied to the node through the spring (or not at all), and is
// removed by static condensation. The same static map from node to beam-end
// rotations is used for the geometric stiffness, the consistent mass, the
// force recovery and the deflected shape, so all are consistent. If a
// condensed DOF has no stiffness left (both ends released in torsion), it
// follows its node instead of dividing by zero.
//
// # Errors
//
// NewFrame, BeamProps.Validate and CombinedStress return errors starting with
// "element:"; NewFrame's wrap ErrZeroLength, ErrParallelUp or ErrNotFinite, so
// the caller can name the member and rewrap. The matrix functions do not
// check their numeric arguments: validate first (BeamProps.Validate,
// Spring6.Valid); invalid input gives meaningless matrices.
package element
