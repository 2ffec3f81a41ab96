// Package springnet models a machine stand as a 3D network of nodes joined
// by bars, springs and beams, resting on supports and feet, and analyses it:
// linear statics per load case and combination, compression-only feet with
// lift-off and tipping margin, and mount stiffness (compliance and stiffness
// matrices at the points where a machine sits).
//
// # Model
//
// The zero Model is empty and ready to use. Builder methods return handles
// (NodeID, ElementID, GroupID, MountID, CaseID) and no errors; Validate
// reports every data problem at once. A handle out of range is a
// programming error and panics.
//
//	var m springnet.Model
//	a := m.AddNode("A", springnet.Vec{})
//	b := m.AddNode("B", springnet.Vec{Z: 0.8})
//	m.AddBar(a, b, springnet.Bar{Material: steel, Section: tube})
//	m.Fix(a, springnet.AllDOF)
//	m.AddLoad(b, springnet.Load{FZ: -1e3})
//	res, err := springnet.Static(&m, nil)
//
// Elements: Bar (pin-ended, EA/L), Spring (axial along a→b and/or per
// global direction, rotational included), Foot (node to ground, optionally
// compression-only), Beam (3D, Euler–Bernoulli or Timoshenko, releases and
// end springs). Rigid groups tie nodes into one rigid body, imposed exactly
// by eliminating their DOF onto a reference point with six DOF:
//
//	u_s = u_m + θ_m × r,   θ_s = θ_m,   r = x_s − x_m
//
// (no stiff penalty members). Mounts are named points on a node, group or
// mount; loads, masses and stiffness queries take a Place: a NodeID,
// GroupID or MountID.
//
// # Units, axes, signs
//
// SI throughout: m, N, Pa, kg, s, rad. Global axes X, Y, Z with Z up; the
// floor under feet is horizontal. Node DOF order UX, UY, UZ, RX, RY, RZ;
// rotations by the right-hand rule. Loads and displacements are positive
// along the axes. Axial forces are tension positive. A reaction is the force
// the support or floor exerts on the stand (a foot carrying weight has a
// positive FZ reaction).
//
// # Degrees of freedom
//
// Every node touched by something carries translations. Rotations exist
// only where something reaches them: a beam, a spring or foot with
// rotational stiffness, a moment or an offset load or mass. A node that
// only bars and axial springs touch has translations only, and its
// unreachable rotations are not mechanisms. Nodes of a rigid group map onto
// the group's six DOF. Fixed DOF are removed.
//
// # Errors
//
// Errors start with "springnet:" and name the item. Validate joins every
// data problem. A free motion (a mechanism) is a *MechanismError naming the
// node or group and direction, with the motion described where found. A
// solve whose relative residual exceeds MaxResidual returns its result with
// a *ConditionError. A stand on compression-only feet with no stable
// contact set is a *TippingError. No result holds NaN or Inf.
package springnet
