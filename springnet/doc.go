// Package springnet models a machine stand as a 3D network of nodes joined
// by bars, springs and beams, resting on supports and feet, and analyses it:
// linear statics per load case and combination, compression-only feet with
// lift-off and a tipping margin, and mount stiffness (compliance and
// stiffness at the points where a machine sits).
//
// # Model
//
// The zero Model is empty and ready to use. Builder methods return handles
// (NodeID, ElementID, GroupID, MountID, CaseID) and no errors; Validate
// reports every data problem at once (errors.Join), each naming its item.
// A handle out of range is a programming error and panics.
//
//	var m springnet.Model
//	a := m.AddNode("A", springnet.Vec{})
//	b := m.AddNode("B", springnet.Vec{Z: 0.8})
//	m.AddBeam(a, b, springnet.Beam{Material: steel, Section: tube})
//	m.Fix(a, springnet.AllDOF)
//	m.AddLoad(b, springnet.Load{FX: 500})  // to DefaultCase
//	res, err := springnet.Static(&m, nil)
//
// Elements: Bar (pin-ended, EA/L), Spring (axial along a→b, and per global
// direction between coincident ends, rotations included), Foot (node to
// ground, optionally CompressionOnly), Beam (3D, Euler–Bernoulli or
// Timoshenko, releases and end springs; matrices from package element).
// Members take a materials.Material and a sections.Section (a Composite
// section uses each part's material), or raw numbers. Rigid groups tie
// nodes into one rigid body, imposed exactly by eliminating their DOF onto
// a reference point with six DOF (the centroid unless given):
//
//	u_s = u_m + θ_m × r,   θ_s = θ_m,   r = x_s − x_m
//
// — never by stiff penalty members. Mounts are named points on a node,
// group or mount. Loads, masses and stiffness queries take a Place: a
// NodeID, a GroupID (at its reference point) or a MountID. Load cases hold
// loads and a gravity vector (self-weight from density and section, plus
// added masses); combinations are factored sums of cases, each solved as
// its own load.
//
// # Units, axes, signs
//
// SI throughout: m, N, Pa, kg, s, rad. Global axes X, Y, Z with Z up; the
// floor under feet is horizontal. Node DOF order UX, UY, UZ, RX, RY, RZ;
// rotations by the right-hand rule. Loads and displacements are positive
// along the axes. Axial forces are tension positive. A reaction is the
// force the support or floor exerts on the stand (a foot carrying weight
// has a positive FZ). Moments in the equilibrium check are about the
// origin. NPerMicron and LbfPerInch convert stiffness for printing.
//
// # Degrees of freedom
//
// Every node touched by something carries translations. Rotations exist
// only where something reaches them: a beam, a spring or foot with
// rotational stiffness, a moment, or a load or mass away from the node. A
// node that only bars and axial springs touch has translations only, and
// a rotation nothing reaches (a group turning about the line of its nodes)
// is not a mechanism unless a load acts on it. Nodes of a rigid group map
// onto the group's six DOF. Fixed DOF are removed.
//
// # Solving
//
// Solver assembles K over the free DOF into a sparse matrix, passes each
// equation's point to the ordering, and keeps the symbolic factorisation
// while the pattern is unchanged (a sweep over materials.Level, or feet
// entering and leaving contact, refactorises only). Compression-only feet
// are solved by an active-set loop of linear solves: the worst violation
// first, then, once a contact set repeats, one foot at a time by Murty's
// least-index rule. A loose foot drops all its springs when it lifts, so a
// foot can have no consistent state (down it pulls, lifted the frame racks
// and it presses into the floor); it is then held: lifted, its sideways
// springs kept (FootResult.Held). The tipping margin follows the contact
// path exactly (see Tipping). System exports K, the lumped mass and the
// loads (Matrix Market). Sweep runs the statics, the mount stiffness at
// every mount and, if asked, buckling and the lowest natural frequencies
// (SweepSettings.Modes) at the Low, Nominal and High material levels with
// one Solver and returns each governing number as a Spread: its value per
// level and its min–max range (not assumed monotone in E).
//
// # Members and buckling
//
// CaseResult.MemberForces and MemberCheck (MembersTo for all) give each
// bar and beam's end forces in local axes, the section forces along it
// with its self-weight (MemberResult.At), the extreme fibre stresses and
// a utilisation: the larger of tension over Material.Yield and
// compression over Material.CompressiveStrength(), per part of a
// composite section. The utilisation is a stress ratio, not a code check:
// no resistance or safety factors, no lateral-torsional or local
// buckling, no interaction formula. Each member also gets an Euler check
// on its own, P_cr = π²·E·I/(K·L)² about both local axes, with K from the
// end conditions read from the model (releases, supports, rigid groups,
// what else is attached) by the recommended design values of AISC 360
// Commentary Table C-A-7.1 by default (MemberSettings: theoretical values,
// per-member K, sway frames). Sections with a product of area (angles)
// are taken about their principal axes (see Beam). Buckling solves the
// whole frame, (K + λ·Kg)·φ = 0 with Kg from the axial forces of one case,
// for the lowest load factors λ and their shapes; it finds sway of a whole
// stand that no member check sees. It returns a *FewerFactorsError when
// fewer positive factors exist than asked (with no result when there is
// none: nothing is in compression). Both are linear, elastic model
// results: imperfections, residual stress and plasticity lower real
// capacities, so check members and stability against local codes and
// licensed engineering practice.
//
// # Dynamics
//
// Modes finds the lowest natural modes, K·φ = ω²·M·φ, with the consistent
// or lumped mass of bars and beams (MassMatrix) plus the point masses
// (Mass, with moments and products of inertia), by sparse shift-invert
// Lanczos or dense for small models, and checks by a Sturm-sequence count
// that no mode below the highest found was missed. Rigid-body and
// mechanism modes (ω ≈ 0, a stand with too few supports) are returned and
// flagged, not treated as errors. Modal damping follows the modal strain
// energy method: the loss factor of a mode is η = Σ ηᵢ·Uᵢ / Σ Uᵢ over the
// strain energy Uᵢ each element, or each part of a composite section,
// stores in the mode (Model.LossFactor), and ζ = η/2. Response gives
// receptance and dynamic stiffness between two places by modal
// superposition of the modes found, with the static residual flexibility
// of the modes left out added back. CheckExcitation compares the natural
// frequencies with the harmonics of running speeds and flags those
// within a margin of an excitation band (20 % by default, common
// practice). Mode shapes are scaled to unit modal mass (φᵀ·M·φ = 1), and
// modal quantities (participation, effective mass, receptance) use that
// scaling. Sweep gives the lowest frequencies per material level
// (SweepSettings.Modes).
//
// # Errors
//
// Errors start with "springnet:" and name the item. A free motion is a
// *MechanismError naming the node or group and direction, with the motion
// described where found, and the usual cure. A solve whose relative
// residual exceeds MaxResidual returns its result with a *ConditionError.
// A case under which a stand on compression-only feet has no stable
// contact set tips: Static (and Sweep) still solve every other case and
// return the result together with a *TippingError naming the case
// (errors.Join of one per tipped case, or level in Sweep); the tipped
// case's CaseResult reports Tipped, its lifted feet and the factor at
// which it tips, and has no displacements or forces: its queries return
// zero values, and member checks, Buckling and ComplianceSensitivity on
// it return an error. A caller that goes on after a *TippingError must
// check CaseResult.Tipped. Modes and mount stiffness take every foot in
// contact and do not depend on a case. No result holds NaN or Inf. Results
// about tipping and overload are model results: check them against local
// codes and licensed engineering practice.
package springnet
