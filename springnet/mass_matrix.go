package springnet

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/springnet/element"
	"github.com/trestle-go/trestle/springnet/sparse"
	"gonum.org/v1/gonum/mat"
)

// MassMatrix selects how the mass of bars and beams is distributed over
// their end DOF. Point masses (AddMass) are the same either way; springs
// and feet are massless.
type MassMatrix int

const (
	// Consistent uses the consistent mass matrices of package element
	// (the same shape functions as the stiffness): more accurate per
	// element, the usual choice for beams. It is the zero value.
	Consistent MassMatrix = iota
	// Lumped puts half of a member's mass on the translations of each end
	// (beams: HRZ rotary terms on the bending rotations, torsional
	// inertia on the twist).
	Lumped
)

// String returns "consistent" or "lumped".
func (k MassMatrix) String() string {
	switch k {
	case Consistent:
		return "consistent"
	case Lumped:
		return "lumped"
	}
	return fmt.Sprintf("MassMatrix(%d)", int(k))
}

// memberMass writes the mass matrix of the chosen kind of bar or beam i
// [kg, kg·m, kg·m²] over its stiffness DOF list (barMatrix, beamMatrix)
// and returns the number of DOF; springs and feet are massless (0).
// Lumped: bars half their mass at each end on the translations; beams the
// element package's lumped matrix with HRZ rotary terms (so beam-end
// rotations carry mass).
func (nt *net) memberMass(i int, kind MassMatrix, k *[12][12]float64, dofs *[12]edof) int {
	e := &nt.m.elems[i]
	p := &nt.el[i]
	switch e.kind {
	case BarKind:
		var mb element.Mat6
		if kind == Lumped {
			mb = element.BarLumpedMass(p.frame, p.mp.lineMass)
		} else {
			mb = element.BarConsistentMass(p.frame, p.mp.lineMass)
		}
		return barMatrix(e, &mb, k, dofs)
	case BeamKind:
		var mb element.Mat12
		if kind == Lumped {
			mb = element.BeamLumpedMass(p.frame, p.mp.lineMass, p.mp.polarMass, true)
		} else {
			mb = element.BeamConsistentMass(p.frame, p.bp, p.mp.lineMass, p.mp.polarMass)
		}
		return p.beamMatrix(e, &mb, k, dofs)
	}
	return 0
}

// assembleMassOf returns the mass matrix of the chosen kind over the free
// equations [kg, kg·m, kg·m²], point masses included through the rigid
// transformation M = Tᵀ·diag(m, m, m, J)·T (pointMassBlocks). With rigid
// groups a lumped matrix is block-diagonal rather than diagonal (a lumped
// mass away from the group's reference point couples its translation and
// rotation).
func (nt *net) assembleMassOf(b *sparse.Builder, kind MassMatrix) *sparse.Matrix {
	member := func(i int, k *[12][12]float64, dofs *[12]edof) int { return nt.memberMass(i, kind, k, dofs) }
	return nt.assembleWith(b, member, nt.pointMassBlocks())
}

// BoxInertia returns the moments of inertia [kg·m²] of a uniform
// rectangular block of mass kg [kg] and edge lengths a, b, c [m] along X,
// Y and Z, about axes through its centre parallel to X, Y and Z:
//
//	Jx = m(b² + c²)/12,   Jy = m(a² + c²)/12,   Jz = m(a² + b²)/12
//
// (solid cuboid; any dynamics text, e.g. Meriam & Kraige, Engineering
// Mechanics: Dynamics, table of mass moments of inertia). A machine known
// only by its mass and bounding box is often modelled so (an estimate:
// real machines are denser low down). Use the result as Mass.Inertia.
func BoxInertia(kg, a, b, c float64) Vec {
	return Vec{kg * (b*b + c*c) / 12, kg * (a*a + c*c) / 12, kg * (a*a + b*b) / 12}
}

// Machine is a rigid machine given by its mass, the offset of its centre
// of gravity from the place it is attached to, and its inertia tensor
// about the centre of gravity in global axes (symmetric; off-diagonal
// terms are the tensor's, J_xy = −∫xy dm, not the products of inertia).
type Machine struct {
	Kg      float64       // mass [kg]
	CG      Vec           // centre of gravity relative to the place [m]
	Inertia [3][3]float64 // inertia tensor about the CG, global axes [kg·m²]
}

// MachineBox returns a Machine of mass kg [kg] whose inertia is that of a
// uniform block of size (X, Y, Z edge lengths) [m] centred on its centre
// of gravity cg (see BoxInertia).
func MachineBox(kg float64, cg, size Vec) Machine {
	j := BoxInertia(kg, size.X, size.Y, size.Z)
	return Machine{Kg: kg, CG: cg, Inertia: [3][3]float64{{j.X, 0, 0}, {0, j.Y, 0}, {0, 0, j.Z}}}
}

// Masses returns the machine as a Mass (for Model.AddMass on the same
// place): its mass, centre of gravity as Offset, and the tensor as
// moments (Inertia) and products of inertia (Products = the tensor's
// off-diagonal terms negated; see Mass). It returns a slice, of one Mass,
// as it always has. It fails for a negative or non-finite mass, an
// asymmetric tensor, or one no body can have (a negative principal
// moment, or one larger than the sum of the other two).
func (mc Machine) Masses() ([]Mass, error) {
	if !finite(mc.Kg) || mc.Kg < 0 || !mc.CG.finite() {
		return nil, fmt.Errorf("springnet: machine: mass %g kg at %v must be finite and non-negative", mc.Kg, mc.CG)
	}
	j := mc.Inertia
	scale := math.Abs(j[0][0]) + math.Abs(j[1][1]) + math.Abs(j[2][2])
	for r := 0; r < 3; r++ {
		for c := 0; c < 3; c++ {
			if !finite(j[r][c]) {
				return nil, errors.New("springnet: machine: inertia tensor is not finite")
			}
			if math.Abs(j[r][c]-j[c][r]) > 1e-12*scale {
				return nil, fmt.Errorf("springnet: machine: inertia tensor is not symmetric (J[%d][%d] = %g, J[%d][%d] = %g)", r, c, j[r][c], c, r, j[c][r])
			}
		}
	}
	ms := Mass{Kg: mc.Kg, Offset: mc.CG,
		Inertia: Vec{j[0][0], j[1][1], j[2][2]},
		Products: Vec{
			X: -(j[1][2] + j[2][1]) / 2,
			Y: -(j[0][2] + j[2][0]) / 2,
			Z: -(j[0][1] + j[1][0]) / 2,
		}}
	if err := bodyTensor(ms.Tensor()); err != nil {
		return nil, fmt.Errorf("springnet: machine: %w", err)
	}
	return []Mass{ms}, nil
}

// bodyTensor checks that the symmetric tensor j [kg·m²] is one a body can
// have: finite, principal moments non-negative (positive semidefinite) and
// each at most the sum of the other two (the triangle inequality, from
// J₁ + J₂ − J₃ = 2∫z'² dm ≥ 0 in principal axes). Round-off of 1e-12 of
// the trace is allowed.
func bodyTensor(j [3][3]float64) error {
	s := mat.NewSymDense(3, nil)
	scale := 0.0
	for r := 0; r < 3; r++ {
		for c := r; c < 3; c++ {
			if !finite(j[r][c]) || !finite(j[c][r]) {
				return errors.New("inertia tensor is not finite")
			}
			s.SetSym(r, c, (j[r][c]+j[c][r])/2)
		}
		scale += math.Abs(j[r][r])
	}
	var es mat.EigenSym
	if !es.Factorize(s, false) {
		return errors.New("inertia tensor: eigen decomposition failed")
	}
	p := es.Values(nil)
	tol := 1e-12 * scale
	for k := 0; k < 3; k++ {
		if p[k] < -tol || p[k] > p[(k+1)%3]+p[(k+2)%3]+tol {
			return fmt.Errorf("principal moments of inertia %.6g, %.6g, %.6g kg·m² are not those of a body "+
				"(each must be non-negative and at most the sum of the other two)", p[0], p[1], p[2])
		}
	}
	return nil
}
