package springnet_test

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// randomStand builds a random but stable network: beams along a random
// spanning tree of the nodes (so every node is connected with rotations),
// a few extra beams and bars, node 0 clamped, a foot, point masses with
// rotary inertia, and sometimes a rigid group of two nodes.
func randomStand(rng *rand.Rand) *springnet.Model {
	var m springnet.Model
	n := 6 + rng.IntN(8)
	var nodes []springnet.NodeID
	for i := 0; i < n; i++ {
		at := springnet.Vec{X: rng.Float64(), Y: rng.Float64(), Z: rng.Float64()}
		nodes = append(nodes, m.AddNode(fmt.Sprintf("n%d", i), at))
	}
	m.Fix(nodes[0], springnet.AllDOF)
	steel := modeSteel()
	sec := func() sections.Section {
		d := 0.02 + 0.06*rng.Float64()
		return sections.RoundTube{D: d, T: d / 10}
	}
	for i := 1; i < n; i++ {
		j := rng.IntN(i)
		m.AddBeam(nodes[j], nodes[i], springnet.Beam{Material: steel, Section: sec()})
	}
	for k := 0; k < n/3; k++ {
		a, b := rng.IntN(n), rng.IntN(n)
		if a == b {
			continue
		}
		if rng.IntN(2) == 0 {
			m.AddBar(nodes[a], nodes[b], springnet.Bar{Material: steel, Section: sec()})
		} else {
			m.AddBeam(nodes[a], nodes[b], springnet.Beam{Material: steel, Section: sec()})
		}
	}
	m.AddFoot(nodes[1+rng.IntN(n-1)], springnet.Foot{K: springnet.Stiffness6{X: 1e6, Y: 2e6, Z: 5e7}})
	for k := 0; k < 2; k++ {
		m.AddMass(nodes[1+rng.IntN(n-1)], springnet.Mass{Kg: 5 + 50*rng.Float64(),
			Offset:  springnet.Vec{Z: 0.1 * rng.Float64()},
			Inertia: springnet.Vec{X: rng.Float64(), Y: rng.Float64(), Z: rng.Float64()}})
	}
	if rng.IntN(2) == 0 && n > 4 {
		m.AddRigidGroup("g", nodes[n-1], nodes[n-2])
	}
	return &m
}

// The sparse path (shift-invert Lanczos) against the dense gonum path on
// 30 seeded random stable networks: the frequencies agree to 1e-8
// (relative; both are accurate to round-off well below that) and the
// Sturm counts agree with each other and with the number of modes.
func TestModesSparseAgainstDenseRandom(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	const count = 6
	for k := 0; k < 30; k++ {
		m := randomStand(rng)
		for _, kind := range []springnet.MassMatrix{springnet.Consistent, springnet.Lumped} {
			t.Run(fmt.Sprintf("network %d %v", k, kind), func(t *testing.T) {
				sp, err := springnet.Modes(m, &springnet.ModeSettings{Count: count, Mass: kind, Method: springnet.SparseMethod})
				require.NoError(t, err)
				de, err := springnet.Modes(m, &springnet.ModeSettings{Count: count, Mass: kind, Method: springnet.DenseMethod})
				require.NoError(t, err)
				require.Equal(t, count, sp.NumModes())
				require.Equal(t, count, de.NumModes())
				for i := 0; i < count; i++ {
					assert.InEpsilon(t, de.Frequency(i), sp.Frequency(i), modeTight, "mode %d", i+1) // dense LAPACK reference
					assert.False(t, sp.RigidBody(i))
				}
				// Invariant: element energy shares of a mode add up to 1.
				sum := 0.0
				for _, e := range sp.ElementEnergiesTo(nil, 0) {
					sum += e
				}
				assert.InEpsilon(t, 1, sum, 1e-12) // shares are parts of one sum: round-off only
				assert.True(t, sp.Sturm().Checked)
				assert.True(t, de.Sturm().Checked)
				assert.Equal(t, count, sp.Sturm().Count)
				assert.Equal(t, sp.Sturm().Count, de.Sturm().Count)
			})
		}
	}
}

// Effective modal masses over all modes add up to the mass that moves
// with each rigid motion (Chopra, Dynamics of Structures, effective modal
// mass): for a clamped cantilever with lumped mass, the total mass less
// the half element lumped on the clamped node, plus the tip mass.
func TestModesEffectiveMassSum(t *testing.T) {
	sec := sections.RoundTube{D: 0.0603, T: 0.004}
	p, err := sec.Properties()
	require.NoError(t, err)
	const n, l, tip = 6, 1.2, 40.0
	for _, kind := range []springnet.MassMatrix{springnet.Lumped, springnet.Consistent} {
		t.Run(kind.String(), func(t *testing.T) {
			var m springnet.Model
			prev := m.AddNode("", springnet.Vec{})
			m.Fix(prev, springnet.AllDOF)
			for i := 1; i <= n; i++ {
				nd := m.AddNode("", springnet.Vec{Z: l * float64(i) / n})
				m.AddBeam(prev, nd, springnet.Beam{Material: modeSteel(), Section: sec})
				prev = nd
			}
			m.AddMass(prev, springnet.Mass{Kg: tip})
			all := 6 * n
			r, err := springnet.Modes(&m, &springnet.ModeSettings{Count: all, Mass: kind})
			require.NoError(t, err)
			require.Equal(t, all, r.NumModes())
			rhoA := modeSteel().Density * p.A
			for _, d := range []springnet.DOF{springnet.UX, springnet.UY, springnet.UZ, springnet.RX, springnet.RY, springnet.RZ} {
				sum := 0.0
				for i := 0; i < all; i++ {
					sum += r.EffectiveMass(i, d)
				}
				// 1e-9: sums over all 36 modes of products of eigenvectors; round-off only.
				assert.InEpsilon(t, r.TotalMass(d), sum, 1e-9, "%v", d)
				assert.InEpsilon(t, 1, r.CumulativeParticipation(all-1, d), 1e-9, "%v", d)
			}
			if kind == springnet.Lumped {
				// Lumped: half of the first element sits on the clamp.
				want := rhoA*(l-l/n/2) + tip
				assert.InEpsilon(t, want, r.TotalMass(springnet.UX), 1e-12) // a sum of a few lumped masses: round-off only
				assert.InEpsilon(t, want, r.TotalMass(springnet.UZ), 1e-12)
			}
		})
	}
}

// A stand with no supports at all still has modes: six rigid-body modes
// (flagged, at 0 Hz) and then its elastic ones, the same as the elastic
// modes of the free-free beam, f = λ²/(2πL²)·√(EI/m), λ₁ = 4.73004074
// (Blevins, Table 8-1, free-free beam; value from memory).
func TestModesFreeFree(t *testing.T) {
	sec := sections.RoundTube{D: 0.0603, T: 0.004}
	p, err := sec.Properties()
	require.NoError(t, err)
	const n, l = 20, 2.0
	var m springnet.Model
	prev := m.AddNode("", springnet.Vec{})
	for i := 1; i <= n; i++ {
		nd := m.AddNode("", springnet.Vec{X: l * float64(i) / n})
		m.AddBeam(prev, nd, springnet.Beam{Material: modeSteel(), Section: sec})
		prev = nd
	}
	for _, method := range []springnet.ModeMethod{springnet.SparseMethod, springnet.DenseMethod} {
		r, err := springnet.Modes(&m, &springnet.ModeSettings{Count: 8, Method: method})
		require.NoError(t, err)
		require.Equal(t, 8, r.NumModes())
		for i := 0; i < 6; i++ {
			assert.True(t, r.RigidBody(i), "mode %d", i+1)
			assert.Zero(t, r.Frequency(i))
			assert.Zero(t, r.LossFactor(i).Nominal)
		}
		mat := modeSteel()
		want := 4.73004074 * 4.73004074 / (2 * math.Pi * l * l) * math.Sqrt(mat.E.Nominal*p.Iy/(mat.Density*p.A))
		// Round tube: bending in both planes at the same frequency.
		assert.InEpsilon(t, want, r.Frequency(6), beamFE)
		assert.InEpsilon(t, want, r.Frequency(7), beamFE)
	}
}

// A DOF with neither stiffness nor mass is reported by name.
func TestModesMasslessMechanism(t *testing.T) {
	var m springnet.Model
	a := m.AddNode("ground", springnet.Vec{})
	b := m.AddNode("mid", springnet.Vec{X: 1})
	c := m.AddNode("tip", springnet.Vec{X: 2})
	m.Fix(a, springnet.AllDOF)
	m.Fix(b, springnet.UZ)
	m.Fix(c, springnet.UZ)
	m.AddSpring(a, b, springnet.Spring{K: springnet.Stiffness6{X: 1e6}})
	m.AddSpring(b, c, springnet.Spring{K: springnet.Stiffness6{X: 1e6}})
	m.AddMass(c, springnet.Mass{Kg: 10})
	for _, method := range []springnet.ModeMethod{springnet.SparseMethod, springnet.DenseMethod} {
		_, err := springnet.Modes(&m, &springnet.ModeSettings{Count: 1, Method: method})
		require.Error(t, err)
		assert.Contains(t, err.Error(), "springnet: modes")
		assert.Contains(t, err.Error(), `node "mid" UY`)
	}
	var empty springnet.Model
	e := empty.AddNode("e", springnet.Vec{})
	f := empty.AddNode("f", springnet.Vec{X: 1})
	empty.Fix(e, springnet.AllDOF)
	empty.AddBar(e, f, springnet.Bar{EA: 1e6})
	_, err := springnet.Modes(&empty, nil)
	assert.ErrorContains(t, err, "no mass")
}
