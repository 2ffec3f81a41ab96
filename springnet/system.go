package springnet

import (
	"fmt"
	"io"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// System is a model's assembled linear system at one material level, over
// its free equations: stiffness K [N/m, N, N·m/rad], lumped mass M [kg,
// kg·m, kg·m²] and one load vector per case [N, N·m]. Equation describes
// each equation as a node or group and a direction. Compression-only feet
// count as in contact.
type System struct {
	nt    *net
	k, m  *sparse.Matrix
	loads [][]float64
}

// Assemble validates m and assembles its system at level l.
func Assemble(m *Model, l materials.Level) (*System, error) {
	if err := m.Validate(); err != nil {
		return nil, err
	}
	nt, err := prepare(m, l)
	if err != nil {
		return nil, err
	}
	s := &System{nt: nt}
	s.k = nt.assemble(sparse.NewBuilder(0))
	s.m = nt.assembleMassOf(sparse.NewBuilder(0), Lumped)
	for c := range m.cases {
		cl, err := nt.buildLoads(CaseID(c))
		if err != nil {
			return nil, err
		}
		s.loads = append(s.loads, nt.dm.totalLoad(cl))
	}
	return s, nil
}

// N returns the number of equations.
func (s *System) N() int { return s.nt.dm.n }

// K returns the stiffness matrix (shared; do not modify).
func (s *System) K() *sparse.Matrix { return s.k }

// M returns the lumped mass matrix (shared; do not modify).
func (s *System) M() *sparse.Matrix { return s.m }

// LoadTo writes the load vector of case c into dst (nil allocates) and
// returns it.
func (s *System) LoadTo(dst []float64, c CaseID) []float64 {
	s.nt.m.CaseName(c)
	if dst == nil {
		dst = make([]float64, s.N())
	}
	copy(dst, s.loads[c])
	return dst
}

// Equation describes equation i: the node or group that owns it, for
// example `node "B3"` or `group "top"`, and its direction.
func (s *System) Equation(i int) (owner string, d DOF) {
	if i < 0 || i >= s.N() {
		panic(fmt.Sprintf("springnet: equation %d out of range [0, %d)", i, s.N()))
	}
	dm := &s.nt.dm
	return dm.ownerName(s.nt.m, dm.eqOwner[i]), dofAt(int(dm.eqComp[i]))
}

// EquationOf returns the equation of direction d (one bit) of place p: a
// node's own DOF, or for a node in a rigid group or a GroupID the group's
// DOF at its reference point. ok is false if that DOF is fixed or does
// not exist (a rotation nothing reaches, or a grouped node's translation,
// which is not an equation of its own).
func (s *System) EquationOf(p Place, d DOF) (eq int, ok bool) {
	s.nt.m.checkPlace(p)
	dm := &s.nt.dm
	o, at := dm.placeOwner(s.nt.m, p)
	for c := 0; c < 6; c++ {
		if d == dofAt(c) {
			if c < 3 && at != dm.ownerRef[o] {
				return -1, false
			}
			eq = dm.ownerEq[o][c]
			return eq, eq >= 0
		}
	}
	return -1, false
}

// Point returns the point in space of equation i's node or group [m].
func (s *System) Point(i int) Vec { return vecOf(s.nt.dm.coords[i]) }

// WriteK writes K in Matrix Market coordinate format (symmetric, lower
// triangle, 1-based), with sparse.WriteMatrix.
func (s *System) WriteK(w io.Writer) error {
	return sparse.WriteMatrix(w, s.k, "stiffness K [N/m, N, N*m/rad], trestle springnet")
}

// WriteM writes the lumped mass matrix in Matrix Market coordinate format.
func (s *System) WriteM(w io.Writer) error {
	return sparse.WriteMatrix(w, s.m, "lumped mass M [kg, kg*m, kg*m^2], trestle springnet")
}

// WriteLoad writes the load vector of case c in Matrix Market array format.
func (s *System) WriteLoad(w io.Writer, c CaseID) error {
	name := s.nt.m.CaseName(c)
	return sparse.WriteVector(w, s.loads[c], fmt.Sprintf("load vector of case %q [N, N*m], trestle springnet", name))
}
