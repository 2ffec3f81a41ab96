package springnet

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestSweepAnalysesOnce: the static solves and the mount stiffness of all
// three levels share one sparsity pattern, so Sweep's Solver does one
// symbolic analysis (the buckling eigenproblem factorises its own
// matrix).
func TestSweepAnalysesOnce(t *testing.T) {
	var m Model
	var tops []NodeID
	for _, c := range [4][2]float64{{0, 0}, {0.5, 0}, {0.5, 0.4}, {0, 0.4}} {
		b := m.AddNode("", Vec{X: c[0], Y: c[1]})
		tp := m.AddNode("", Vec{X: c[0], Y: c[1], Z: 0.8})
		m.AddFoot(b, Foot{K: Stiffness6{X: 1e6, Y: 1e6, Z: 1e7}, CompressionOnly: true, Vary: materialsRange(0.5, 1, 2)})
		m.Fix(b, RX|RY|RZ)
		m.AddBeam(b, tp, Beam{Raw: RawBeam{EA: 1e8, EIy: 1e4, EIz: 1e4, GJ: 1e4}})
		tops = append(tops, tp)
	}
	g := m.AddRigidGroup("top", tops...)
	m.AddMount("spindle", Vec{X: 0.25, Y: 0.2, Z: 1}, g)
	m.AddLoad(g, Load{FZ: -2e3, FX: 50})
	var s Solver
	res, err := s.Sweep(&m, &SweepSettings{Buckling: true})
	require.NoError(t, err)
	require.Len(t, res.Mounts, 1)
	assert.Equal(t, 1, s.analyses)
	// Only the feet vary (raw members do not), stiffer from Low to High;
	// stiffening any element cannot soften the stand (K only grows in
	// the positive semidefinite order), so the softest stiffness rises.
	assert.Less(t, res.Mounts[0].Softest.ByLevel[0], res.Mounts[0].Softest.ByLevel[2])
}
