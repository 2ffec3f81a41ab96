package springnet_test

import (
	"errors"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

func TestSelfWeightFixedBeam(t *testing.T) {
	// Fixed-fixed beam under its own weight w per length: end reactions
	// w·L/2, end moments w·L²/12, mid-span moment w·L²/24, mid-span
	// deflection w·L⁴/(384·E·I) (Roark's Formulas for Stress and Strain,
	// 7th ed., Table 8.1 case 2e, both ends fixed, uniform load). Cubic
	// beam elements with consistent loads give these exactly at the nodes.
	steel := materials.Material{Name: "steel", E: materials.Exact(210e9), Poisson: 0.3, Density: 7850}
	sec := sections.Rect{B: 0.04, H: 0.08}
	props, err := sec.Properties()
	require.NoError(t, err)
	const l = 3.0
	var m springnet.Model
	a := m.AddNode("a", springnet.Vec{})
	mid := m.AddNode("mid", springnet.Vec{X: l / 2})
	b := m.AddNode("b", springnet.Vec{X: l})
	m.Fix(a, springnet.AllDOF)
	m.Fix(b, springnet.AllDOF)
	left := m.AddBeam(a, mid, springnet.Beam{Material: steel, Section: sec})
	m.AddBeam(mid, b, springnet.Beam{Material: steel, Section: sec})
	m.SetGravity(m.AddLoadCase("self-weight"), springnet.Gravity(1))
	res, err := springnet.Static(&m, nil)
	require.NoError(t, err)
	cr := res.Case(0)
	w := 7850 * props.A * springnet.StandardGravity
	assert.InEpsilon(t, w*l/2, cr.Reaction(a).FZ, closeTol)
	assert.InEpsilon(t, w*l*l/12, math.Abs(cr.Reaction(a).MY), closeTol)
	assert.InEpsilon(t, w*l*l*l*l/(384*210e9*props.Iy), -cr.Displacement(mid).UZ, closeTol)
	f := cr.Force(left).Beam
	assert.InEpsilon(t, w*l*l/12, math.Abs(f.A.My), closeTol)
	assert.InEpsilon(t, w*l*l/24, math.Abs(f.B.My), closeTol)
	assert.Less(t, cr.Equilibrium().ForceError, closeTol)
	assert.Less(t, cr.Equilibrium().MomentError, closeTol)
}

// filledTube is a test composite: a steel tube of area as filled with
// grout of area ag, and a loose sand layer (mass only) of area asand.
type filledTube struct {
	steel, grout, sand materials.Material
	as, ag, asand      float64
}

func (f filledTube) Properties() (sections.Props, error) {
	return sections.Props{A: f.as + f.ag, Iy: 1e-6, Iz: 1e-6, J: 2e-6}, nil
}

func (f filledTube) Parts() ([]sections.Part, error) {
	return []sections.Part{
		{Material: f.steel, A: f.as, Iy: 1e-6, Iz: 1e-6, J: 2e-6},
		{Material: f.grout, A: f.ag, Iy: 1e-7, Iz: 1e-7, J: 2e-7},
		{Material: f.sand, A: f.asand},
	}, nil
}

func TestCompositeBar(t *testing.T) {
	// Transformed section: EA = Σ Eᵢ·Aᵢ (strain compatibility, e.g. Gere &
	// Goodno, Mechanics of Materials, §2.4 on composite bars); a mass-only
	// fill adds weight, no stiffness. Stress in each part σᵢ = Eᵢ·N/EA.
	tube := filledTube{
		steel: materials.Material{Name: "steel", E: materials.Exact(200e9), Density: 7850, Yield: 235e6},
		grout: materials.Material{Name: "grout", E: materials.Range{Low: 20e9, Nominal: 30e9, High: 35e9}, Density: 2300, Compress: 40e6},
		sand:  materials.Material{Name: "dry sand", Density: 1600, MassOnly: true},
		as:    1e-3, ag: 4e-3, asand: 2e-3,
	}
	const l, p = 0.9, -2e5
	for _, lv := range materials.Levels {
		var m springnet.Model
		a := m.AddNode("a", springnet.Vec{})
		b := m.AddNode("b", springnet.Vec{Z: l})
		m.Fix(a, springnet.AllDOF)
		m.Fix(b, springnet.UX|springnet.UY)
		e := m.AddBar(a, b, springnet.Bar{Material: tube.steel, Section: tube})
		m.AddLoad(b, springnet.Load{FZ: p})
		g := m.AddLoadCase("weight")
		m.SetGravity(g, springnet.Gravity(1))
		res, err := springnet.Static(&m, &springnet.StaticSettings{Level: lv})
		require.NoError(t, err)
		ea := 200e9*tube.as + tube.grout.E.At(lv)*tube.ag
		assert.InEpsilon(t, p*l/ea, res.Displacement(b).UZ, closeTol)
		f := res.Case(0).Force(e)
		// Utilisation: steel |σ|/Yield vs grout |σ|/Compress; the larger.
		us := 200e9 * math.Abs(p) / ea / 235e6
		ug := tube.grout.E.At(lv) * math.Abs(p) / ea / 40e6
		assert.InEpsilon(t, math.Max(us, ug), f.Utilisation, closeTol)
		weight := (7850*tube.as + 2300*tube.ag + 1600*tube.asand) * l * springnet.StandardGravity
		assert.InEpsilon(t, weight, res.Case(g).Reaction(a).FZ+res.Case(g).Reaction(b).FZ, closeTol)
	}
}

func TestGroupMechanisms(t *testing.T) {
	// A rigid top on four pinned vertical bars: nothing resists sway or
	// twist of the top.
	build := func() (*springnet.Model, springnet.GroupID) {
		var m springnet.Model
		var tops []springnet.NodeID
		for _, c := range [4][2]float64{{0, 0}, {1, 0}, {1, 1}, {0, 1}} {
			b := m.AddNode("", springnet.Vec{X: c[0], Y: c[1]})
			t := m.AddNode("", springnet.Vec{X: c[0], Y: c[1], Z: 1})
			m.Fix(b, springnet.Translations)
			m.AddBar(b, t, springnet.Bar{EA: 1e8})
			tops = append(tops, t)
		}
		return &m, m.AddRigidGroup("top", tops...)
	}
	t.Run("sway", func(t *testing.T) {
		m, g := build()
		m.AddLoad(g, springnet.Load{FX: 100})
		_, err := springnet.Static(m, nil)
		var me *springnet.MechanismError
		require.True(t, errors.As(err, &me), "got %v", err)
		assert.Equal(t, g, me.Group)
		assert.Equal(t, "top", me.Name)
		assert.Contains(t, err.Error(), `group "top"`)
	})
	t.Run("twist under a moment", func(t *testing.T) {
		m, g := build()
		m.FixGroup(g, springnet.UX|springnet.UY)
		m.AddLoad(g, springnet.Load{MZ: 100})
		_, err := springnet.Static(m, nil)
		var me *springnet.MechanismError
		require.True(t, errors.As(err, &me), "got %v", err)
		assert.Equal(t, springnet.RZ, me.DOF)
		assert.Equal(t, g, me.Group)
	})
	t.Run("unloaded twist is no mechanism", func(t *testing.T) {
		// Nothing reaches the twist and nothing loads it: it does not exist.
		m, g := build()
		m.FixGroup(g, springnet.UX|springnet.UY)
		m.AddLoad(g, springnet.Load{FZ: -100})
		res, err := springnet.Static(m, nil)
		require.NoError(t, err)
		assert.InEpsilon(t, -100/4e8, res.Case(0).At(g).UZ, closeTol) // four legs, EA/L = 1e8 each
	})
}

func TestCombinationIsSuperposition(t *testing.T) {
	// A linear model obeys superposition: the combination 1.35·A + 1.5·B
	// gives 1.35·u_A + 1.5·u_B (linearity of K·u = f).
	var m springnet.Model
	r := newRandomNet(newRNG(), 30)
	m = r.m
	ca := springnet.DefaultCase
	cb := m.AddLoadCase("B")
	m.AddCaseLoad(cb, r.nodes[3], springnet.Load{FY: 2e3, MZ: 10})
	m.SetGravity(cb, springnet.Gravity(1))
	combo := m.AddCombination("ULS", springnet.Term{Case: ca, Factor: 1.35}, springnet.Term{Case: cb, Factor: 1.5})
	res, err := springnet.Static(&m, nil)
	require.NoError(t, err)
	for _, n := range r.nodes {
		ua, ub, uc := res.Case(ca).Displacement(n), res.Case(cb).Displacement(n), res.Case(combo).Displacement(n)
		// 1e-9 relative (with a 1e-18 floor for zeros): superposition is exact, round-off only.
		assert.InDelta(t, 1.35*ua.UX+1.5*ub.UX, uc.UX, 1e-9*(math.Abs(uc.UX)+1e-9))
		assert.InDelta(t, 1.35*ua.RZ+1.5*ub.RZ, uc.RZ, 1e-9*(math.Abs(uc.RZ)+1e-9))
	}
}

func TestDifferentialDeflection(t *testing.T) {
	// Two mounts on one rigid group move by u + θ × r: their difference is
	// θ × (r_b − r_a) (rigid-body kinematics), checked on the legs model
	// with an eccentric load that tilts the top.
	xs := []float64{-0.5, 0.5, 0.5, -0.5}
	ys := []float64{-0.4, -0.4, 0.4, 0.4}
	m, g, _ := legsUnderTop(t, xs, ys, 1e8, 0.8)
	a := m.AddMount("a", springnet.Vec{X: -0.3, Z: 0.8}, g)
	b := m.AddMount("b", springnet.Vec{X: 0.4, Y: 0.1, Z: 0.8}, g)
	m.AddLoad(b, springnet.Load{FZ: -5e3})
	res, err := springnet.Static(m, nil)
	require.NoError(t, err)
	cr := res.Case(0)
	th := cr.At(g).Rotation()
	want := th.Cross(springnet.Vec{X: 0.7, Y: 0.1})
	got := cr.Differential(a, b)
	// 1e-12 m: rigid-top kinematics of one solve, round-off only (NotZero below keeps it from passing on zeros).
	assert.InDelta(t, want.Z, got.UZ, 1e-12)
	assert.InDelta(t, want.X, got.UX, 1e-12)
	assert.NotZero(t, got.UZ)
}

func TestOffsetMountOnPinnedNode(t *testing.T) {
	// A mount away from a node that only bars meet cannot be loaded: the
	// node has no rotations to carry the moment. Stiffness there is an
	// error, not a silently wrong number.
	var m springnet.Model
	a := m.AddNode("a", springnet.Vec{})
	b := m.AddNode("b", springnet.Vec{Z: 1})
	m.Fix(a, springnet.AllDOF)
	m.AddFoot(b, springnet.Foot{K: springnet.Stiffness6{X: 1e6, Y: 1e6}}) // lateral tie
	m.AddBar(a, b, springnet.Bar{EA: 1e8})
	mt := m.AddMount("off", springnet.Vec{X: 0.2, Z: 1}, b)
	_, err := springnet.MountStiffness(&m, mt, nil)
	require.Error(t, err)
	assert.Contains(t, err.Error(), `mount "off"`)
	// At the node itself it is fine: k = EA/L along the bar (Hooke).
	st, err := springnet.MountStiffness(&m, b, nil)
	require.NoError(t, err)
	assert.InEpsilon(t, 1e8, st.Along(springnet.Vec{Z: 1}), closeTol)
	assert.False(t, st.HasRotations())
}
