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

// closeTol is the relative tolerance for closed-form checks: the solves
// are direct, so agreement is limited by round-off (about 1e-15 per
// operation) accumulated over a few hundred operations.
const closeTol = 1e-9

func TestSingleBar(t *testing.T) {
	// Axial bar: δ = P·L/(E·A) (Hooke's law; Gere & Goodno, Mechanics of
	// Materials, §2.2). Here along an oblique axis to exercise the transform.
	const ea, p = 2e8, 1e4
	tests := []struct {
		name string
		dir  springnet.Vec
	}{
		{"along z", springnet.Vec{Z: 1}},
		{"along x", springnet.Vec{X: 1}},
		{"oblique", springnet.Vec{X: 1, Y: 2, Z: 2}.Scale(1.0 / 3)},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			const l = 1.5
			var m springnet.Model
			a := m.AddNode("A", springnet.Vec{})
			b := m.AddNode("B", tc.dir.Scale(l))
			bar := m.AddBar(a, b, springnet.Bar{EA: ea})
			m.Fix(a, springnet.AllDOF)
			// Hold b across the bar with two axial springs at right angles
			// to it: they add nothing along the bar.
			for _, q := range across(tc.dir) {
				anchor := m.AddNode("", b0(tc.dir, l).Add(q))
				m.Fix(anchor, springnet.Translations)
				m.AddSpring(b, anchor, springnet.Spring{Axial: 1e6})
			}
			m.AddLoad(b, springnet.Load{FX: p * tc.dir.X, FY: p * tc.dir.Y, FZ: p * tc.dir.Z})
			res, err := springnet.Static(&m, nil)
			require.NoError(t, err)
			d := res.Displacement(b).Translation()
			want := p * l / ea
			assert.InEpsilon(t, want, d.Dot(tc.dir), closeTol)
			assert.InEpsilon(t, p, res.Case(springnet.DefaultCase).Force(bar).Axial, closeTol)
		})
	}
}

func b0(dir springnet.Vec, l float64) springnet.Vec { return dir.Scale(l) }

// across returns two unit vectors at right angles to dir and each other.
func across(dir springnet.Vec) [2]springnet.Vec {
	ref := springnet.Vec{X: 1}
	if math.Abs(dir.X) > 0.9 {
		ref = springnet.Vec{Y: 1}
	}
	p := dir.Cross(ref)
	p = p.Scale(1 / p.Norm())
	q := dir.Cross(p)
	return [2]springnet.Vec{p, q.Scale(1 / q.Norm())}
}

func TestConcretePier(t *testing.T) {
	// A concrete pier as a bar, A = 0.312 × 0.3 = 0.0936 m², E = 20 GPa,
	// L = 0.8 m: k = E·A/L = 2.34e9 N/m (Hooke's law; Gere & Goodno,
	// Mechanics of Materials, §2.2); two in parallel under a rigid top
	// give twice that (springs in parallel add).
	conc := materials.Material{Name: "concrete", E: materials.Exact(20e9), Density: 2400}
	sec := sections.Rect{B: 0.312, H: 0.3}
	const want1 = 20e9 * 0.312 * 0.3 / 0.8
	for _, n := range []int{1, 2} {
		var m springnet.Model
		var tops []springnet.NodeID
		for i := 0; i < n; i++ {
			x := float64(i)
			b := m.AddNode("", springnet.Vec{X: x})
			top := m.AddNode("", springnet.Vec{X: x, Z: 0.8})
			m.Fix(b, springnet.AllDOF)
			m.AddBar(b, top, springnet.Bar{Material: conc, Section: sec})
			tops = append(tops, top)
		}
		g := m.AddRigidGroup("top", tops...)
		// Lateral restraint of the top (a wall tie), acting across the piers only.
		for _, top := range tops {
			m.AddFoot(top, springnet.Foot{K: springnet.Stiffness6{X: 1e7, Y: 1e7}})
		}
		st, err := springnet.MountStiffness(&m, g, nil)
		require.NoError(t, err)
		assert.InEpsilon(t, float64(n)*want1, st.Along(springnet.Vec{Z: 1}), closeTol)
	}
}

// fourLegs builds a rigid square top on n legs: raw-EA bars from fixed
// pins at z = 0 to the top at z = h, the top a rigid group with lateral
// restraint by a fixed group DOF set.
func legsUnderTop(t *testing.T, xs, ys []float64, ea, h float64) (*springnet.Model, springnet.GroupID, []springnet.ElementID) {
	t.Helper()
	var m springnet.Model
	var tops []springnet.NodeID
	var legs []springnet.ElementID
	for i := range xs {
		b := m.AddNode("", springnet.Vec{X: xs[i], Y: ys[i]})
		top := m.AddNode("", springnet.Vec{X: xs[i], Y: ys[i], Z: h})
		m.Fix(b, springnet.AllDOF)
		legs = append(legs, m.AddBar(b, top, springnet.Bar{EA: ea}))
		tops = append(tops, top)
	}
	g := m.AddRigidGroup("top", tops...)
	// Hold the top against sway and twist; the legs carry vertical load and
	// rocking.
	m.FixGroup(g, springnet.UX|springnet.UY|springnet.RZ)
	return &m, g, legs
}

func TestLegsUnderRigidTop(t *testing.T) {
	// Rigid top on n equal legs: central load P shares P/n per leg;
	// an eccentric load P at (ex, 0) shares P/n + P·ex·xᵢ/Σx² (rigid-body
	// statics, the pile-group / bolt-group formula, e.g. Bowles, Foundation
	// Analysis and Design, 5th ed., §18-9).
	xs := []float64{-0.5, 0.5, 0.5, -0.5, 0}
	ys := []float64{-0.4, -0.4, 0.4, 0.4, 0}
	const ea, h, p = 1e8, 0.8, -1e4
	tests := []struct {
		name string
		ex   float64
	}{
		{"central", 0},
		{"eccentric", 0.3},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m, g, legs := legsUnderTop(t, xs, ys, ea, h)
			mt := m.AddMount("machine", springnet.Vec{X: tc.ex, Z: h}, g)
			m.AddLoad(mt, springnet.Load{FZ: p})
			res, err := springnet.Static(m, nil)
			require.NoError(t, err)
			cr := res.Case(springnet.DefaultCase)
			sx2 := 0.0
			for _, x := range xs {
				sx2 += x * x
			}
			n := float64(len(xs))
			for i, e := range legs {
				want := p/n + p*tc.ex*xs[i]/sx2 // compression negative
				assert.InDelta(t, want, cr.Force(e).Axial, closeTol*math.Abs(p), "leg %d", i)
			}
			eq := cr.Equilibrium()
			assert.Less(t, eq.ForceError, closeTol)
			assert.Less(t, eq.MomentError, closeTol)
		})
	}
}

func TestSpringsInSeries(t *testing.T) {
	// Springs in series: 1/k = Σ 1/kᵢ (Hooke's law; e.g. Inman,
	// Engineering Vibration, 4th ed., §1.5). Foot (floor), leg bar, pad.
	const kFloor, kPad, ea, l = 5e8, 2e7, 3e8, 0.7
	kLeg := ea / l
	want := 1 / (1/kFloor + 1/kLeg + 1/kPad)
	var m springnet.Model
	f := m.AddNode("foot", springnet.Vec{})
	top := m.AddNode("top", springnet.Vec{Z: l})
	mt := m.AddNode("mount", springnet.Vec{Z: l})
	m.AddFoot(f, springnet.Foot{K: springnet.Stiffness6{X: 1e7, Y: 1e7, Z: kFloor}})
	m.AddBar(f, top, springnet.Bar{EA: ea})
	m.AddSpring(top, mt, springnet.Spring{K: springnet.Stiffness6{Z: kPad, X: 1e7, Y: 1e7}})
	m.AddSpring(top, mt, springnet.Spring{K: springnet.Stiffness6{X: 1e7, Y: 1e7}}) // extra lateral
	m.Fix(top, springnet.UX|springnet.UY)
	st, err := springnet.MountStiffness(&m, mt, nil)
	require.NoError(t, err)
	assert.InEpsilon(t, want, st.Along(springnet.Vec{Z: -1}), closeTol)
}

func TestMechanismTable(t *testing.T) {
	// A pin-jointed four-leg table: legs and top frame as bars, pinned at
	// the floor. Without bracing it sways under a lateral load (a
	// mechanism); one diagonal per side makes it a stable space truss
	// (Maxwell's rule for space frames, necessary condition b + r >= 3j:
	// with the diagonals b = 13, r = 12, j = 8: 25 >= 24).
	build := func(braced bool) (*springnet.Model, springnet.NodeID) {
		var m springnet.Model
		const w, d, h = 1.0, 0.6, 0.8
		pts := [4][2]float64{{0, 0}, {w, 0}, {w, d}, {0, d}}
		var bot, top [4]springnet.NodeID
		for i, p := range pts {
			bot[i] = m.AddNode("", springnet.Vec{X: p[0], Y: p[1]})
			top[i] = m.AddNode("", springnet.Vec{X: p[0], Y: p[1], Z: h})
			m.Fix(bot[i], springnet.Translations)
			m.AddBar(bot[i], top[i], springnet.Bar{EA: 1e8})
		}
		for i := range 4 {
			m.AddBar(top[i], top[(i+1)%4], springnet.Bar{EA: 1e8})
			if braced {
				m.AddBar(bot[i], top[(i+1)%4], springnet.Bar{EA: 1e8})
			}
		}
		if braced {
			m.AddBar(top[0], top[2], springnet.Bar{EA: 1e8}) // the top's own diagonal
		}
		m.AddLoad(top[2], springnet.Load{FY: 500})
		return &m, top[2]
	}
	t.Run("unbraced", func(t *testing.T) {
		m, _ := build(false)
		_, err := springnet.Static(m, nil)
		var mech *springnet.MechanismError
		require.True(t, errors.As(err, &mech), "got %v", err)
		assert.NotEqual(t, springnet.UZ, mech.DOF, "a leg cannot move along its axis")
		assert.Contains(t, err.Error(), "brace it, support it, or make the joint rigid")
		assert.Contains(t, mech.Motion, "sway")
		t.Log(err)
	})
	t.Run("braced", func(t *testing.T) {
		m, top := build(true)
		res, err := springnet.Static(m, nil)
		require.NoError(t, err)
		assert.Greater(t, res.Displacement(top).UY, 0.0)
		eq := res.Case(springnet.DefaultCase).Equilibrium()
		assert.Less(t, eq.ForceError, closeTol)
		assert.Less(t, eq.MomentError, closeTol)
	})
}

func TestConditionErrorStiffLinkOnSoftFoot(t *testing.T) {
	// A very stiff link (k₁) carried on a very soft foot (k₂): both ends
	// move about F/k₂ while the link stretches only F/k₁. The link's
	// force k₁·(u_c − u_b) is the difference of two nearly equal
	// displacements times a huge stiffness, so the residual ‖K·u − f‖/‖f‖
	// is of order round-off × k₁/k₂ (Higham, Accuracy and Stability of
	// Numerical Algorithms, ch. 7: residual and backward error; chapter from
	// memory) and
	// iterative refinement in the same precision cannot bring it down.
	// With k₁/k₂ = 3.7e9 (below the pivot test's 1e11) that is about 1e-7,
	// above MaxResidual: a usable but suspect solve. Twelve load cases with
	// unrounded loads make a lucky exact cancellation in all of them
	// implausible on any platform.
	const soft, ratio = 1234.5, 3.7e9
	var m springnet.Model
	b := m.AddNode("b", springnet.Vec{})
	c := m.AddNode("c", springnet.Vec{X: 0.1})
	m.AddFoot(b, springnet.Foot{K: springnet.Stiffness6{X: soft, Y: 1e6, Z: 1e6}})
	m.AddFoot(c, springnet.Foot{K: springnet.Stiffness6{Y: 1e6, Z: 1e6}})
	m.AddSpring(b, c, springnet.Spring{Axial: soft * ratio})
	var loads []float64
	for i := range 12 {
		f := 987.6 * (1 + 0.37*float64(i))
		m.AddCaseLoad(m.AddLoadCase(""), c, springnet.Load{FX: f})
		loads = append(loads, f)
	}
	res, err := springnet.Static(&m, nil)
	var cond *springnet.ConditionError
	require.ErrorAs(t, err, &cond)
	require.NotNil(t, res, "a suspect solve still gives its result")
	assert.Greater(t, cond.Residual, springnet.MaxResidual)
	assert.Equal(t, res.Residual(), cond.Residual, "the worst case is reported")
	// Usable: the displacement is that of springs in series,
	// u_c = F/k₂ + F/k₁ (Hooke's law), to within the forward error,
	// about k₁/k₂ × 2e-16 ≈ 1e-6 (condition number times round-off);
	// suspectTol allows ten times that.
	const suspectTol = 1e-5
	for i, f := range loads {
		want := f/soft + f/(soft*ratio)
		assert.InEpsilon(t, want, res.Case(springnet.CaseID(i)).Displacement(c).UX, suspectTol)
	}
	// Sweep passes the condition on with its result.
	sw, err := springnet.Sweep(&m, nil)
	require.ErrorAs(t, err, &cond)
	assert.NotNil(t, sw)
}
