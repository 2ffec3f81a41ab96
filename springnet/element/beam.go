package element

import (
	"fmt"
	"math"
)

// Release is a bit set of end rotations that a beam does not transmit, in
// local axes. A released rotation carries no moment: the beam end turns
// freely of the node about that axis.
type Release uint8

const (
	// ReleaseRX frees twist: no torque passes between node and beam end.
	ReleaseRX Release = 1 << iota
	// ReleaseRY frees rotation about local y: a pin for bending in the local
	// x–z plane (My = 0 at that end).
	ReleaseRY
	// ReleaseRZ frees rotation about local z: a pin for bending in the local
	// x–y plane (Mz = 0 at that end).
	ReleaseRZ
	// ReleasePin frees both bending rotations (a ball joint that still
	// carries torque).
	ReleasePin = ReleaseRY | ReleaseRZ
)

// BeamProps holds the stiffness data of a 3D two-node beam in its local axes
// (see Frame).
//
// EIy is the bending stiffness for moments about local y, that is bending in
// the local x–z plane (deflection w along z); EIz is for moments about local
// z, bending in the x–y plane (deflection v along y).
//
// GAsY and GAsZ are the shear stiffnesses κ·G·A for shear force along local y
// (pairs with EIz) and along local z (pairs with EIy). Zero means rigid in
// shear: the Euler–Bernoulli beam. A positive value gives the Timoshenko beam
// with Φ = 12·EI/(κ·G·A·L²).
//
// ReleaseA and ReleaseB free end rotations (see Release). RotSpringA and
// RotSpringB put a rotational spring [N·m/rad] about local x, y, z in series
// between the node and the beam end, for a bolted or partly rigid joint; zero
// means a rigid joint. A release overrides a spring about the same axis.
//
// A joint spring far stiffer than the beam end it feeds (k above about
// 1e8·EI/L) loses digits in the condensation, k − k²/(k + k_beam); give 0
// for a rigid joint instead.
//
// The zero BeamProps is a beam with no stiffness; see Validate.
type BeamProps struct {
	EA   float64 // axial stiffness E·A [N]
	EIy  float64 // bending stiffness about local y, E·Iy [N·m²]
	EIz  float64 // bending stiffness about local z, E·Iz [N·m²]
	GJ   float64 // torsional stiffness G·J [N·m²]
	GAsY float64 // shear stiffness along local y, κ·G·A [N]; 0 = Euler–Bernoulli
	GAsZ float64 // shear stiffness along local z, κ·G·A [N]; 0 = Euler–Bernoulli

	ReleaseA, ReleaseB     Release
	RotSpringA, RotSpringB Vec3 // about local x, y, z [N·m/rad]; 0 = rigid
}

// Validate returns an error if a property is NaN, infinite or negative, or if
// EA, EIy, EIz or GJ is not positive. The error starts with "element:" and
// names the field; it wraps ErrNotFinite for NaN and Inf.
func (p BeamProps) Validate() error {
	fields := [...]struct {
		name     string
		v        float64
		positive bool
	}{
		{"EA", p.EA, true}, {"EIy", p.EIy, true}, {"EIz", p.EIz, true}, {"GJ", p.GJ, true},
		{"GAsY", p.GAsY, false}, {"GAsZ", p.GAsZ, false},
		{"RotSpringA[x]", p.RotSpringA[0], false}, {"RotSpringA[y]", p.RotSpringA[1], false},
		{"RotSpringA[z]", p.RotSpringA[2], false}, {"RotSpringB[x]", p.RotSpringB[0], false},
		{"RotSpringB[y]", p.RotSpringB[1], false}, {"RotSpringB[z]", p.RotSpringB[2], false},
	}
	for _, f := range fields {
		switch {
		case math.IsNaN(f.v) || math.IsInf(f.v, 0):
			return fmt.Errorf("element: beam %s = %v: %w", f.name, f.v, ErrNotFinite)
		case f.v < 0 || (f.positive && f.v == 0):
			return fmt.Errorf("element: beam %s = %g: must be positive", f.name, f.v)
		}
	}
	if p.ReleaseA&^(ReleaseRX|ReleaseRY|ReleaseRZ) != 0 || p.ReleaseB&^(ReleaseRX|ReleaseRY|ReleaseRZ) != 0 {
		return fmt.Errorf("element: beam release bits %#x, %#x: unknown bits set", p.ReleaseA, p.ReleaseB)
	}
	return nil
}

// hasJoints reports whether any end rotation is released or sprung.
func (p BeamProps) hasJoints() bool {
	return p.ReleaseA != 0 || p.ReleaseB != 0 || p.RotSpringA != (Vec3{}) || p.RotSpringB != (Vec3{})
}

// BeamLocalStiffness returns the stiffness of the beam proper, of length l
// [m], in local axes over u, v, w, θx, θy, θz at end a then end b, ignoring
// releases and end springs. With Φ = 12·EI/(κGA·L²) (0 for Euler–Bernoulli)
// the bending block in the x–y plane over (v_a, θz_a, v_b, θz_b) is
//
//	EIz/((1+Φ)L³)·[ 12    6L        −12   6L
//	                6L   (4+Φ)L²   −6L   (2−Φ)L²
//	               −12   −6L        12   −6L
//	                6L   (2−Φ)L²   −6L   (4+Φ)L² ]
//
// and the x–z block over (w, θy) is the same with the signs of the
// w–θ couplings reversed, since θy = −dw/dx (Przemieniecki, Theory of Matrix
// Structural Analysis, beam element with shear deformation; Cook, Malkus,
// Plesha and Witt, Concepts and Applications of Finite Element Analysis,
// 4th ed., beam and Timoshenko beam elements).
func BeamLocalStiffness(p BeamProps, l float64) Mat12 {
	var k Mat12
	ea := p.EA / l
	k[0][0], k[6][6], k[0][6], k[6][0] = ea, ea, -ea, -ea
	gj := p.GJ / l
	k[3][3], k[9][9], k[3][9], k[9][3] = gj, gj, -gj, -gj
	bendingBlock(&k, 1, 5, 7, 11, p.EIz, p.GAsY, l, 1)
	bendingBlock(&k, 2, 4, 8, 10, p.EIy, p.GAsZ, l, -1)
	return k
}

// bendingBlock writes one bending plane into k at translations ta, tb and
// rotations ra, rb; sign is +1 for the x–y plane and −1 for the x–z plane.
func bendingBlock(k *Mat12, ta, ra, tb, rb int, ei, gas, l, sign float64) {
	phi := shearPhi(ei, gas, l)
	c := ei / ((1 + phi) * l * l * l)
	t := 12 * c
	tr := sign * 6 * l * c
	rr := (4 + phi) * l * l * c
	rr2 := (2 - phi) * l * l * c
	idx := [4]int{ta, ra, tb, rb}
	blk := [4][4]float64{
		{t, tr, -t, tr},
		{tr, rr, -tr, rr2},
		{-t, -tr, t, -tr},
		{tr, rr2, -tr, rr},
	}
	addBlock(k, idx, blk)
}

func addBlock(k *Mat12, idx [4]int, blk [4][4]float64) {
	for i, r := range idx {
		for j, c := range idx {
			k[r][c] += blk[i][j]
		}
	}
}

// BeamStiffness returns the global stiffness of the beam over UX, UY, UZ, RX,
// RY, RZ at end a then end b [N/m, N, N·m/rad].
//
// Releases and end springs are applied to the local stiffness by static
// condensation: each released or sprung end rotation becomes an internal
// degree of freedom, tied to the node through the spring (or not at all for
// a release), and is eliminated. The result is transformed with
// K = Tᵀ·K_local·T, T = diag(R, R, R, R), R = f.Rotation().
//
// p should pass Validate; other values give a meaningless matrix.
func BeamStiffness(f Frame, p BeamProps) Mat12 {
	var kl Mat12
	if !p.hasJoints() {
		kl = BeamLocalStiffness(p, f.L)
	} else {
		var j joints
		j.init(p, f.L)
		kl = j.condensed()
	}
	return toGlobal(&kl, f)
}

// joints holds the beam augmented with internal end-rotation DOF for
// releases and springs, and the map from node DOF to beam-end DOF.
type joints struct {
	kb  Mat12           // beam proper, local
	n   int             // number of internal DOF
	dof [6]int          // node DOF (local index 0..11) of each internal DOF
	k   [18][18]float64 // augmented stiffness: 12 node DOF, then internal
	x   [6][12]float64  // internal DOF as a function of the node DOF
}

// init builds the augmented stiffness and solves for the internal DOF.
func (j *joints) init(p BeamProps, l float64) {
	*j = joints{kb: BeamLocalStiffness(p, l)}
	var where [12]int // beam DOF → augmented index
	for i := range where {
		where[i] = i
	}
	type end struct {
		rel    Release
		spring Vec3
		base   int
	}
	for _, e := range [2]end{{p.ReleaseA, p.RotSpringA, 3}, {p.ReleaseB, p.RotSpringB, 9}} {
		for r := range 3 {
			released := e.rel&(Release(1)<<r) != 0
			ks := e.spring[r]
			if !released && ks == 0 {
				continue
			}
			d := e.base + r
			q := 12 + j.n
			j.dof[j.n] = d
			j.n++
			where[d] = q
			if !released {
				j.k[d][d] += ks
				j.k[q][q] += ks
				j.k[d][q] -= ks
				j.k[q][d] -= ks
			}
		}
	}
	for r := range 12 {
		for c := range 12 {
			j.k[where[r]][where[c]] += j.kb[r][c]
		}
	}
	j.solveInternal()
}

// condensTol is the smallest pivot, relative to the original diagonal of the
// same internal DOF, that condensation divides by. A smaller pivot means that
// DOF has no stiffness left once the others are tied (both ends released in
// torsion): it is then slaved to its node rotation instead. Round-off in a
// 12×12 beam matrix is about 1e-15 relative; 1e-10 leaves a wide margin
// (common practice).
const condensTol = 1e-10

// solveInternal solves K_ii·X = −K_ie for X with symmetric Gaussian
// elimination, in place on a copy of K_ii.
func (j *joints) solveInternal() {
	n := j.n
	var a [6][6]float64
	var rhs [6][12]float64
	for r := range n {
		for c := range n {
			a[r][c] = j.k[12+r][12+c]
		}
		for c := range 12 {
			rhs[r][c] = -j.k[12+r][c]
		}
	}
	var dropped [6]bool
	var diag0 [6]float64
	for r := range n {
		diag0[r] = a[r][r]
	}
	for k := range n {
		p := a[k][k]
		if p <= condensTol*diag0[k] || p <= 0 {
			dropped[k] = true
			continue
		}
		for i := k + 1; i < n; i++ {
			f := a[i][k] / p
			if f == 0 {
				continue
			}
			for c := k; c < n; c++ {
				a[i][c] -= f * a[k][c]
			}
			for c := range 12 {
				rhs[i][c] -= f * rhs[k][c]
			}
		}
	}
	for k := n - 1; k >= 0; k-- {
		if dropped[k] {
			j.x[k] = [12]float64{}
			j.x[k][j.dof[k]] = 1
			continue
		}
		for c := range 12 {
			s := rhs[k][c]
			for i := k + 1; i < n; i++ {
				s -= a[k][i] * j.x[i][c]
			}
			j.x[k][c] = s / a[k][k]
		}
	}
}

// condensed returns Tcᵀ·K_aug·Tc with Tc = [I; X], the statically condensed
// local stiffness over the node DOF.
func (j *joints) condensed() Mat12 {
	// t[r][c]: augmented DOF r as a function of node DOF c.
	var t [18][12]float64
	for i := range 12 {
		t[i][i] = 1
	}
	for q := range j.n {
		t[12+q] = j.x[q]
	}
	m := 12 + j.n
	var kt [18][12]float64 // K_aug·Tc
	for r := range m {
		for c := range 12 {
			s := 0.0
			for i := range m {
				s += j.k[r][i] * t[i][c]
			}
			kt[r][c] = s
		}
	}
	var out Mat12
	for r := range 12 {
		for c := r; c < 12; c++ {
			s := 0.0
			for i := range m {
				s += t[i][r] * kt[i][c]
			}
			out[r][c], out[c][r] = s, s
		}
	}
	return out
}

// beamDOF returns the map P from node DOF to beam-end DOF (local): the
// beam's own end rotations are those of the internal DOF where released or
// sprung, and the node's elsewhere.
func (j *joints) beamDOF() Mat12 {
	var p Mat12
	for i := range 12 {
		p[i][i] = 1
	}
	for q := range j.n {
		p[j.dof[q]] = j.x[q]
	}
	return p
}

// throughJoints returns a, a local matrix over the beam's own end DOF,
// carried to the node DOF by the congruence Pᵀ·a·P with the static map P of
// the releases and end springs of p (see beamDOF); a itself if p has none.
func throughJoints(a Mat12, p BeamProps, l float64) Mat12 {
	if !p.hasJoints() {
		return a
	}
	var j joints
	j.init(p, l)
	pm := j.beamDOF()
	return congruent(&a, &pm)
}

// congruent returns Pᵀ·A·P.
func congruent(a *Mat12, p *Mat12) Mat12 {
	var ap Mat12
	for r := range 12 {
		for c := range 12 {
			s := 0.0
			for i := range 12 {
				s += a[r][i] * p[i][c]
			}
			ap[r][c] = s
		}
	}
	var out Mat12
	for r := range 12 {
		for c := r; c < 12; c++ {
			s := 0.0
			for i := range 12 {
				s += p[i][r] * ap[i][c]
			}
			out[r][c], out[c][r] = s, s
		}
	}
	return out
}

// toGlobal returns Tᵀ·kl·T with T = diag(R, R, R, R).
func toGlobal(kl *Mat12, f Frame) Mat12 {
	r := f.Rotation()
	var out Mat12
	for bi := range 4 {
		for bj := range 4 {
			// out_IJ = Rᵀ · kl_IJ · R
			var tmp [3][3]float64 // kl_IJ · R
			for i := range 3 {
				for j := range 3 {
					s := 0.0
					for k := range 3 {
						s += kl[3*bi+i][3*bj+k] * r[k][j]
					}
					tmp[i][j] = s
				}
			}
			for i := range 3 {
				for j := range 3 {
					s := 0.0
					for k := range 3 {
						s += r[k][i] * tmp[k][j]
					}
					out[3*bi+i][3*bj+j] = s
				}
			}
		}
	}
	return out
}

// localDisp returns the local components of the global end displacements.
func localDisp(f Frame, ua, ub Vec6) Vec12 {
	var u Vec12
	for b, v := range [4]Vec3{{ua[0], ua[1], ua[2]}, {ua[3], ua[4], ua[5]}, {ub[0], ub[1], ub[2]}, {ub[3], ub[4], ub[5]}} {
		l := f.ToLocal(v)
		copy(u[3*b:3*b+3], l[:])
	}
	return u
}
