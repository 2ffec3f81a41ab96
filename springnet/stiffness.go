package springnet

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// PointStiffness is the stiffness of the stand at one place (a mount, a
// node, a rigid group's reference point), found by unit loads there:
// column j of the compliance C is the motion of the place under a unit
// force (j < 3) or moment (j >= 3) at it. C is symmetric by Maxwell–Betti
// reciprocity. Compliance in m/N, rad/N, m/(N·m), rad/(N·m); stiffness the
// inverse units.
//
// The 3×3 translational stiffness is the inverse of the 3×3 translational
// compliance: the stiffness felt by a force at the place with its rotation
// free (what a machine foot bolted there feels). The 6×6 stiffness, where
// the place carries rotations, is the inverse of the 6×6 compliance.
type PointStiffness struct {
	name string
	c    [6][6]float64
	k3   [3][3]float64
	k6   [6][6]float64
	rot  bool
	res  float64
}

// MountStiffness returns the stiffness at p with a new Solver; see
// Solver.MountStiffness.
func MountStiffness(m *Model, p Place, st *StaticSettings) (*PointStiffness, error) {
	var s Solver
	return s.MountStiffness(m, p, st)
}

// MountStiffness validates m and returns the compliance and stiffness of
// the stand at p (a NodeID, GroupID or MountID) at the material level of
// st. Compression-only feet count as in contact. It fails with a
// *MechanismError if the model can move freely, and with an error if p is
// held rigidly (fixed) in some direction, where its stiffness is infinite.
// A solve with a large residual returns the result and a *ConditionError.
func (s *Solver) MountStiffness(m *Model, p Place, st *StaticSettings) (*PointStiffness, error) {
	if st == nil {
		st = &StaticSettings{}
	}
	if err := m.Validate(); err != nil {
		return nil, err
	}
	m.checkPlace(p)
	nt, err := prepare(m, st.Level)
	if err != nil {
		return nil, err
	}
	if err := s.factor(nt); err != nil {
		return nil, err
	}
	return s.pointStiffness(nt, p)
}

// pointStiffness returns the stiffness at p of the prepared model nt,
// whose K the Solver has just factorised (every foot in contact).
func (s *Solver) pointStiffness(nt *net, p Place) (*PointStiffness, error) {
	m := nt.m
	d := &nt.dm
	o, at := d.placeOwner(m, p)
	ps := &PointStiffness{name: m.PlaceName(p)}
	if o < d.nNodes && d.ownerHas[o]&Rotations != Rotations && at.Sub(d.ownerRef[o]).Norm() > 0 {
		return nil, fmt.Errorf("springnet: stiffness at %s: the point is away from node %q, which carries no rotations "+
			"(only bars or axial springs meet there), so a force there would turn it freely; "+
			"put the mount at the node or on a rigid group", ps.name, m.nodes[o].name)
	}
	ps.rot = d.ownerHas[o]&Rotations == Rotations
	ncol := 3
	if ps.rot {
		ncol = 6
	}
	ol := make([][6]float64, len(d.ownerRef))
	u := make([]float64, d.n)
	worst := 0.0
	for j := 0; j < ncol; j++ {
		worst = math.Max(worst, s.unitLoadSolve(d, o, at, j, ol, u))
		w := d.pointDisp(o, at, u)
		for i := 0; i < ncol; i++ {
			ps.c[i][j] = w[i]
		}
	}
	for i := 0; i < 3; i++ {
		if !(ps.c[i][i] > 0) || !finite(ps.c[i][i]) {
			return nil, fmt.Errorf("springnet: stiffness at %s: the place is held rigidly in %v (a fixed support); its stiffness there is infinite", ps.name, dofAt(i))
		}
	}
	k3, ok := invertSym(ps.c[:3], 3)
	if !ok {
		return nil, fmt.Errorf("springnet: stiffness at %s: the translational compliance is singular (rigid in some direction)", ps.name)
	}
	for i := 0; i < 3; i++ {
		copy(ps.k3[i][:], k3[i][:3])
	}
	if ps.rot {
		if k6, ok := invertSym(ps.c[:], 6); ok {
			ps.k6 = k6
		} else {
			ps.rot = false
		}
	}
	ps.res = worst
	if worst > MaxResidual {
		return ps, &ConditionError{Case: "stiffness at " + ps.name, Residual: worst}
	}
	return ps, nil
}

// unitLoadSolve solves K·u = f with the current factorisation for a unit
// force along axis j (j < 3) or a unit moment about axis j − 3 at the
// point at on owner o, and returns the relative residual. ol is scratch
// of one [6]float64 per owner; u receives the solution.
func (s *Solver) unitLoadSolve(d *dofMap, o int, at Vec, j int, ol [][6]float64, u []float64) float64 {
	for i := range ol {
		ol[i] = [6]float64{}
	}
	var f, mo Vec
	if j < 3 {
		f = unitVec(j)
	} else {
		mo = unitVec(j - 3)
	}
	d.addOwnerLoad(ol, o, at, f, mo)
	return s.solve(u, d.eqVector(nil, ol))
}

// invertSym inverts the leading n×n block of a symmetric positive definite
// matrix with gonum's Cholesky; ok is false if it is not positive definite.
func invertSym(a [][6]float64, n int) ([6][6]float64, bool) {
	// C is symmetric by reciprocity up to round-off; use the mean of the
	// two triangles (the raw C is kept for Compliance3/6).
	s := mat.NewSymDense(n, nil)
	for i := 0; i < n; i++ {
		for j := i; j < n; j++ {
			s.SetSym(i, j, (a[i][j]+a[j][i])/2)
		}
	}
	var ch mat.Cholesky
	var out [6][6]float64
	if !ch.Factorize(s) {
		return out, false
	}
	var inv mat.SymDense
	if err := ch.InverseTo(&inv); err != nil {
		return out, false
	}
	for i := 0; i < n; i++ {
		for j := 0; j < n; j++ {
			out[i][j] = inv.At(i, j)
			if !finite(out[i][j]) {
				return out, false
			}
		}
	}
	return out, true
}

// Residual returns the largest relative residual of the unit-load solves.
func (p *PointStiffness) Residual() float64 { return p.res }

// Name describes the place, e.g. `mount "spindle"`.
func (p *PointStiffness) Name() string { return p.name }

// Compliance3 returns the 3×3 translational compliance [m/N].
func (p *PointStiffness) Compliance3() [3][3]float64 {
	var c [3][3]float64
	for i := range c {
		copy(c[i][:], p.c[i][:3])
	}
	return c
}

// Stiffness3 returns the 3×3 translational stiffness [N/m], the inverse of
// Compliance3.
func (p *PointStiffness) Stiffness3() [3][3]float64 { return p.k3 }

// HasRotations reports whether the place carries rotations, so that the
// 6×6 matrices exist.
func (p *PointStiffness) HasRotations() bool { return p.rot }

// Compliance6 returns the 6×6 compliance over UX, UY, UZ, RX, RY, RZ
// (loads FX, FY, FZ, MX, MY, MZ); ok is false without rotations.
func (p *PointStiffness) Compliance6() (c [6][6]float64, ok bool) { return p.c, p.rot }

// Stiffness6 returns the 6×6 stiffness (the inverse of Compliance6); ok is
// false without rotations.
func (p *PointStiffness) Stiffness6() (k [6][6]float64, ok bool) { return p.k6, p.rot }

// Along returns the stiffness along the direction d [N/m]: the force along
// d per unit motion along d under that force,
//
//	k_d = 1 / (dᵀ·C·d),  d normalised.
//
// It panics if d is the zero vector (a programming error).
func (p *PointStiffness) Along(d Vec) float64 {
	n := d.Norm()
	if !(n > 0) {
		panic("springnet: PointStiffness.Along: zero direction")
	}
	u := d.Scale(1 / n).arr()
	s := 0.0
	for i := 0; i < 3; i++ {
		for j := 0; j < 3; j++ {
			s += u[i] * p.c[i][j] * u[j]
		}
	}
	return 1 / s
}

// Principal returns the principal translational stiffnesses [N/m] in
// ascending order (the softest first) and their unit directions: the
// eigenvalues and eigenvectors of Stiffness3 (gonum EigenSym). The
// softest direction is where the stand gives most.
func (p *PointStiffness) Principal() (k [3]float64, dir [3]Vec) {
	s := mat.NewSymDense(3, nil)
	for i := 0; i < 3; i++ {
		for j := i; j < 3; j++ {
			s.SetSym(i, j, p.k3[i][j])
		}
	}
	var es mat.EigenSym
	if !es.Factorize(s, true) {
		return k, dir // cannot happen for a finite symmetric 3×3
	}
	vals := es.Values(nil)
	var vec mat.Dense
	es.VectorsTo(&vec)
	for i := 0; i < 3; i++ {
		k[i] = vals[i]
		v := Vec{vec.At(0, i), vec.At(1, i), vec.At(2, i)}
		// Make the largest component positive so directions print stably.
		a := v.arr()
		big := 0
		for j := 1; j < 3; j++ {
			if math.Abs(a[j]) > math.Abs(a[big]) {
				big = j
			}
		}
		if a[big] < 0 {
			v = v.Scale(-1)
		}
		dir[i] = v
	}
	return k, dir
}
