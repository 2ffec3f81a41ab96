package springnet_test

import (
	"errors"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet"
)

// narrowStand is a rigid stand (one rigid group through its four feet) of
// footprint b × d on loose (compression-only) feet, weight w [N] with its
// centre of gravity above the middle, and a lateral load (px, py) at
// height h.
func narrowStand(b, d, h, w, px, py float64) (*springnet.Model, [4]springnet.ElementID) {
	var m springnet.Model
	pts := [4][2]float64{{b / 2, -d / 2}, {b / 2, d / 2}, {-b / 2, d / 2}, {-b / 2, -d / 2}} // A, B, C, D
	var nodes []springnet.NodeID
	var feet [4]springnet.ElementID
	for i, p := range pts {
		n := m.AddNode(string(rune('A'+i)), springnet.Vec{X: p[0], Y: p[1]})
		nodes = append(nodes, n)
		feet[i] = m.AddFoot(n, springnet.Foot{Name: "foot " + string(rune('A'+i)),
			K: springnet.Stiffness6{X: 1e6, Y: 1e6, Z: 1e7}, CompressionOnly: true})
	}
	g := m.AddRigidGroup("stand", nodes...)
	c := m.AddLoadCase("wind")
	m.SetGravity(c, springnet.Gravity(1))
	m.AddMass(g, springnet.Mass{Kg: w / springnet.StandardGravity, Offset: springnet.Vec{Z: 0.7}})
	top := m.AddMount("top", springnet.Vec{Z: h}, g)
	m.AddCaseLoad(c, top, springnet.Load{FX: px, FY: py})
	return &m, feet
}

// contactTol is the relative tolerance against rigid-body statics: the
// feet are elastic but the stand is rigid, so the vertical reactions of a
// determinate contact set are exact up to round-off.
const contactTol = 1e-8

func TestCompressionOnlyFeet(t *testing.T) {
	// Reference: rigid-body statics by hand (moments about the base; the
	// lateral foot forces act at floor level and give no overturning
	// moment). Footprint b × d, weight W at the centre, lateral P at
	// height H.
	const b, d, h, w = 0.4, 0.6, 1.5, 1000.0

	t.Run("along x, all feet down", func(t *testing.T) {
		// Four feet: Rᵢ = W/4 + H·Px·xᵢ/Σx², Σx² = b²; windward feet (x = −b/2)
		// carry W/4 − H·P/(2b) = 250 − 187.5 = 62.5 N. Tipping about the
		// leeward edge when P·H = W·b/2: λ = W·b/(2·H·P) = 4/3.
		const p = 100.0
		m, feet := narrowStand(b, d, h, w, p, 0)
		res, err := springnet.Static(m, nil)
		require.NoError(t, err)
		cr := res.Case(0)
		want := [4]float64{w/4 + h*p/(2*b), w/4 + h*p/(2*b), w/4 - h*p/(2*b), w/4 - h*p/(2*b)}
		for i, f := range feet {
			fr, ok := cr.Foot(f)
			require.True(t, ok)
			assert.InEpsilon(t, want[i], fr.Reaction.FZ, contactTol, fr.Name)
			assert.InEpsilon(t, want[i]/w, fr.Share, contactTol, fr.Name)
			assert.False(t, fr.Lifted)
		}
		tip := cr.Tipping()
		require.True(t, tip.Found)
		assert.InEpsilon(t, w*b/(2*h*p), tip.Factor, contactTol)
		assert.Less(t, cr.Equilibrium().ForceError, contactTol)
		assert.Less(t, cr.Equilibrium().MomentError, contactTol)
	})

	t.Run("diagonal, one foot lifts", func(t *testing.T) {
		// With all four down, R_D = W/4 − H·Px/(2b) − H·Py/(2d) < 0, so D
		// lifts. On A, B, C (determinate):
		//   R_A = W/2 − H·Py/d,  R_B = H·Px/b + H·Py/d,  R_C = W/2 − H·Px/b.
		// The stand tips about edge AB when C unloads: λ = W·b/(2·H·Px).
		p := 120.0
		px, py := p/math.Sqrt2, p/math.Sqrt2
		m, feet := narrowStand(b, d, h, w, px, py)
		res, err := springnet.Static(m, nil)
		require.NoError(t, err)
		cr := res.Case(0)
		want := [4]float64{w/2 - h*py/d, h*px/b + h*py/d, w/2 - h*px/b, 0}
		for i, f := range feet {
			fr, _ := cr.Foot(f)
			assert.InDelta(t, want[i], fr.Reaction.FZ, contactTol*w, fr.Name)
			assert.Equal(t, i == 3, fr.Lifted, fr.Name)
		}
		assert.Equal(t, []springnet.ElementID{feet[3]}, cr.Lifted())
		tip := cr.Tipping()
		require.True(t, tip.Found)
		assert.InEpsilon(t, w*b/(2*h*px), tip.Factor, contactTol)
		assert.Equal(t, "foot C", tip.LastFoot)
	})

	t.Run("tips", func(t *testing.T) {
		// P·H = 300 N·m > W·b/2 = 200 N·m: no stable contact set.
		m, _ := narrowStand(b, d, h, w, 200, 0)
		_, err := springnet.Static(m, nil)
		var te *springnet.TippingError
		require.True(t, errors.As(err, &te), "got %v", err)
		assert.Contains(t, err.Error(), "tips")
	})

	t.Run("bolted feet flag uplift", func(t *testing.T) {
		// The same as "all feet down" with the load doubled, feet bolted
		// (linear): windward feet in tension W/4 − H·P/(2b) = −125 N.
		const p = 200.0
		mb := boltedCopy(t, b, d, h, w, p)
		res, err := springnet.Static(mb, nil)
		require.NoError(t, err)
		for _, fr := range res.Case(0).Feet() {
			want := w/4 + h*p/(2*b)
			if fr.Name == "foot C" || fr.Name == "foot D" {
				want = w/4 - h*p/(2*b)
			}
			assert.InEpsilon(t, want, fr.Reaction.FZ, contactTol)
			assert.Equal(t, want < 0, fr.Uplift)
		}
	})
}

func boltedCopy(t *testing.T, b, d, h, w, p float64) *springnet.Model {
	t.Helper()
	var m springnet.Model
	pts := [4][2]float64{{b / 2, -d / 2}, {b / 2, d / 2}, {-b / 2, d / 2}, {-b / 2, -d / 2}}
	var nodes []springnet.NodeID
	for i, q := range pts {
		n := m.AddNode("", springnet.Vec{X: q[0], Y: q[1]})
		nodes = append(nodes, n)
		m.AddFoot(n, springnet.Foot{Name: "foot " + string(rune('A'+i)), K: springnet.Stiffness6{X: 1e6, Y: 1e6, Z: 1e7}})
	}
	g := m.AddRigidGroup("stand", nodes...)
	m.SetGravity(springnet.DefaultCase, springnet.Gravity(1))
	m.AddMass(g, springnet.Mass{Kg: w / springnet.StandardGravity, Offset: springnet.Vec{Z: 0.7}})
	top := m.AddMount("top", springnet.Vec{Z: h}, g)
	m.AddLoad(top, springnet.Load{FX: p})
	return &m
}

func TestLiftedFootOnPinnedLeg(t *testing.T) {
	// Legs under a rigid top, on loose feet, pushed diagonally so that one
	// foot lifts (as in "diagonal, one foot lifts"). With beam legs the
	// lifted foot hangs on its leg and the stand stands on three feet;
	// with pin-ended bar legs the lifted foot's node swings freely, which
	// must come out as a mechanism naming the foot, not as tipping.
	const b, d, h, w = 0.4, 0.6, 1.5, 1000.0
	build := func(beams bool) *springnet.Model {
		var m springnet.Model
		var tops, feet []springnet.NodeID
		for i, p := range [4][2]float64{{b / 2, -d / 2}, {b / 2, d / 2}, {-b / 2, d / 2}, {-b / 2, -d / 2}} {
			f := m.AddNode("", springnet.Vec{X: p[0], Y: p[1]})
			feet = append(feet, f)
			top := m.AddNode("", springnet.Vec{X: p[0], Y: p[1], Z: 0.8})
			if beams {
				m.AddBeam(f, top, springnet.Beam{Raw: springnet.RawBeam{EA: 1e9, EIy: 1e6, EIz: 1e6, GJ: 1e6}})
			} else {
				m.AddBar(f, top, springnet.Bar{EA: 1e9})
			}
			m.AddFoot(f, springnet.Foot{Name: "foot " + string(rune('A'+i)), K: springnet.Stiffness6{X: 1e6, Y: 1e6, Z: 1e7}, CompressionOnly: true})
			tops = append(tops, top)
		}
		if !beams {
			// One brace per side so that the pin-jointed frame does not sway.
			for i := range feet {
				m.AddBar(feet[i], tops[(i+1)%4], springnet.Bar{EA: 1e9})
			}
		}
		g := m.AddRigidGroup("top", tops...)
		m.SetGravity(springnet.DefaultCase, springnet.Gravity(1))
		m.AddMass(g, springnet.Mass{Kg: w / springnet.StandardGravity})
		mt := m.AddMount("push", springnet.Vec{Z: h}, g)
		m.AddLoad(mt, springnet.Load{FX: 120 / math.Sqrt2, FY: 120 / math.Sqrt2})
		return &m
	}
	t.Run("beam legs", func(t *testing.T) {
		res, err := springnet.Static(build(true), nil)
		require.NoError(t, err)
		lifted := res.Case(0).Lifted()
		require.Len(t, lifted, 1)
		assert.Equal(t, "foot D", build(true).ElementName(lifted[0]))
	})
	t.Run("bar legs", func(t *testing.T) {
		_, err := springnet.Static(build(false), nil)
		var me *springnet.MechanismError
		require.True(t, errors.As(err, &me), "got %v", err)
		assert.Contains(t, me.Motion, `foot "foot D" lifted off`)
	})
}
