package springnet

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
)

// TestRigidMotionNoForce: a rigid-body motion of the whole model (a
// translation t plus a small rotation ω: u = t + ω × x, θ = ω) strains
// nothing, so every element force is zero (a property of any consistent
// stiffness matrix: its null space holds the rigid-body modes; Cook,
// Malkus, Plesha & Witt, Concepts and Applications of Finite Element
// Analysis, 4th ed., on rigid-body motion of elements; section from
// memory).
func TestRigidMotionNoForce(t *testing.T) {
	var m Model
	var nodes []NodeID
	for i := 0; i < 6; i++ {
		x := float64(i)
		nodes = append(nodes, m.AddNode("", Vec{X: 0.3 * x, Y: 0.1 * x * x, Z: math.Sin(x)}))
	}
	m.AddBar(nodes[0], nodes[1], Bar{EA: 1e8})
	m.AddBeam(nodes[1], nodes[2], Beam{Raw: RawBeam{EA: 1e8, EIy: 1e5, EIz: 2e5, GJ: 5e4}})
	m.AddBeam(nodes[2], nodes[3], Beam{Raw: RawBeam{EA: 1e8, EIy: 1e5, EIz: 2e5, GJ: 5e4, GAsY: 1e7, GAsZ: 1e7}, ReleaseB: ReleasePin})
	m.AddSpring(nodes[3], nodes[4], Spring{Axial: 1e6, K: Stiffness6{RX: 1e4, RY: 1e4}})
	m.AddBar(nodes[4], nodes[5], Bar{EA: 1e8})
	m.AddBar(nodes[5], nodes[0], Bar{EA: 1e8})
	m.AddRigidGroup("g", nodes[4], nodes[5])
	m.AddLoadCase("none")
	require.NoError(t, m.Validate())
	nt, err := prepare(&m, 0)
	require.NoError(t, err)
	tr := Vec{1e-3, -2e-3, 5e-4}
	om := Vec{2e-4, -1e-4, 3e-4}
	u := make([]float64, nt.dm.n)
	for i := range u {
		o := nt.dm.eqOwner[i]
		c := int(nt.dm.eqComp[i])
		mv := tr.Add(om.Cross(nt.dm.ownerRef[o]))
		u[i] = [6]float64{mv.X, mv.Y, mv.Z, om.X, om.Y, om.Z}[c]
	}
	cl, err := nt.buildLoads(0)
	require.NoError(t, err)
	cr := nt.recover(0, cl, u, 0)
	// Forces scale: stiffness 1e8 times motion 1e-3 → 1e5; round-off 1e-16
	// times that, with a margin.
	const tol = 1e-6
	for i := range m.elems {
		f := cr.Force(ElementID(i))
		assert.InDelta(t, 0, f.Axial, tol, "element %d axial", i)
		for _, v := range f.Spring.arr() {
			assert.InDelta(t, 0, v, tol, "element %d spring", i)
		}
		for _, v := range f.Beam.Local {
			assert.InDelta(t, 0, v, tol, "element %d beam", i)
		}
	}
}

// TestSolverKeepsAnalysis: a sweep over material levels, and feet leaving
// and re-entering contact, change values but not the sparsity pattern, so
// the Solver analyses once (STYLE.md, "Reuse where it pays").
func TestSolverKeepsAnalysis(t *testing.T) {
	var m Model
	var ns []NodeID
	for i, c := range [4][2]float64{{0, 0}, {0.4, 0}, {0.4, 0.6}, {0, 0.6}} {
		n := m.AddNode("", Vec{X: c[0], Y: c[1]})
		m.AddFoot(n, Foot{Name: string(rune('A' + i)), K: Stiffness6{X: 1e6, Y: 1e6, Z: 1e7}, CompressionOnly: true,
			Vary: materialsRange(0.5, 1, 2)})
		ns = append(ns, n)
	}
	g := m.AddRigidGroup("stand", ns...)
	m.SetGravity(DefaultCase, Gravity(1))
	m.AddMass(g, Mass{Kg: 100, Offset: Vec{X: 0.2, Y: 0.3, Z: 0.5}})
	m.AddLoad(g, Load{FX: 100, FY: 80}) // lifts a foot
	var s Solver
	for _, lv := range []int{0, 1, 2, 0} {
		res, err := s.Static(&m, &StaticSettings{Level: levelOf(lv)})
		require.NoError(t, err)
		require.NotEmpty(t, res.Case(0).Lifted())
	}
	assert.Equal(t, 1, s.analyses)
}

func materialsRange(lo, nom, hi float64) materials.Range {
	return materials.Range{Low: lo, Nominal: nom, High: hi}
}

func levelOf(i int) materials.Level { return materials.Levels[i] }
