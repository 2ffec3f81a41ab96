package springnet_test

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet"
)

// frameTol is the tolerance of frame stiffness against hand formulas that
// neglect axial deformation: the members here are given EA = frameAxial
// times their 12·EI/L², so axial flexibility changes the sway stiffness by
// a relative amount of order 1/frameAxial.
const (
	frameAxial = 1e6
	frameTol   = 1e-4
)

// frameRaw returns raw beam stiffness with EI about both axes, GJ = EI
// and EA = frameAxial·12·EI/L².
func frameRaw(ei, l float64) springnet.RawBeam {
	return springnet.RawBeam{EA: frameAxial * 12 * ei / (l * l), EIy: ei, EIz: ei, GJ: ei}
}

// sway returns the sway stiffness at a place in X from a unit load case.
func sway(t *testing.T, m *springnet.Model, p springnet.Place, load float64) float64 {
	t.Helper()
	res, err := springnet.Static(m, nil)
	require.NoError(t, err)
	eq := res.Case(springnet.DefaultCase).Equilibrium()
	assert.Less(t, eq.ForceError, 1e-9, "reactions balance the load")
	return load / res.Case(springnet.DefaultCase).At(p).UX
}

func TestPortalFrameRigidGirder(t *testing.T) {
	// Portal frame in the X–Z plane: two columns of height h, tops joined
	// by a rigid girder (a rigid group whose rotation is held, standing for
	// the axially rigid columns the formulas assume), sideways load H.
	// Fixed bases: each column is fixed–guided, k = 12EI/h³; pinned bases:
	// pinned–guided, k = 3EI/h³ (Timoshenko & Gere, Mechanics of
	// Materials, beam deflection tables; the usual storey-stiffness
	// result). A diagonal bar of axial stiffness EA/L_d at angle θ to the
	// floor adds (EA/L_d)·cos²θ (bar stiffness resolved horizontally,
	// Gere & Goodno, trusses).
	const h, w, ei = 1.5, 2.0, 5e5
	const eaDiag = 4e7
	ld := math.Hypot(w, h)
	cos := w / ld
	// A joint spring k_r between column top and girder (a bolted joint):
	// slope-deflection with M_top = −k_r·θ gives, per fixed-base column,
	//
	//	k = 12EI/h³ − 36·(EI)²/(h⁴·(4EI/h + k_r))
	//
	// (derived here; k_r → ∞: 12EI/h³, k_r = 0: 3EI/h³, the cantilever).
	const kr = 2 * ei / h
	tests := []struct {
		name   string
		base   springnet.DOF
		brace  bool
		top    springnet.Beam // joint at the column tops
		wantFn func() float64
	}{
		{"fixed bases", springnet.AllDOF, false, springnet.Beam{}, func() float64 { return 2 * 12 * ei / (h * h * h) }},
		{"pinned bases", springnet.Translations | springnet.RZ, false, springnet.Beam{}, func() float64 { return 2 * 3 * ei / (h * h * h) }},
		{"fixed bases, braced bay", springnet.AllDOF, true, springnet.Beam{}, func() float64 { return 2*12*ei/(h*h*h) + eaDiag/ld*cos*cos }},
		{"fixed bases, pinned tops (releases)", springnet.AllDOF, false, springnet.Beam{ReleaseB: springnet.ReleasePin},
			func() float64 { return 2 * 3 * ei / (h * h * h) }},
		{"fixed bases, bolted tops (joint springs)", springnet.AllDOF, false, springnet.Beam{SpringB: springnet.Vec{Y: kr, Z: kr}},
			func() float64 { return 2 * (12*ei/(h*h*h) - 36*ei*ei/(h*h*h*h*(4*ei/h+kr))) }},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			var m springnet.Model
			b1 := m.AddNode("base 1", springnet.Vec{})
			b2 := m.AddNode("base 2", springnet.Vec{X: w})
			t1 := m.AddNode("top 1", springnet.Vec{Z: h})
			t2 := m.AddNode("top 2", springnet.Vec{X: w, Z: h})
			m.Fix(b1, tc.base)
			m.Fix(b2, tc.base)
			col := tc.top
			col.Raw = frameRaw(ei, h)
			m.AddBeam(b1, t1, col)
			m.AddBeam(b2, t2, col)
			g := m.AddRigidGroup("girder", t1, t2)
			m.FixGroup(g, springnet.Rotations|springnet.UZ)
			if tc.brace {
				m.AddBar(b1, t2, springnet.Bar{Name: "diagonal", EA: eaDiag})
			}
			const load = 1e3
			m.AddLoad(g, springnet.Load{FX: load})
			assert.InEpsilon(t, tc.wantFn(), sway(t, &m, g, load), frameTol)
		})
	}
}

// table builds a welded four-leg table: legs of height h at the corners of
// an a × b rectangle, fixed at the floor, joined at the top by four rails.
// Legs and rails are beams (a moment frame) or, with bars, pin-jointed.
// With diagonals, each long side (the X–Z faces) gets one diagonal bar.
// The load is H/4 in X at each top corner.
func table(h, a, b, eiLeg, eiRail, eaDiag float64, bars, diagonals bool, load float64) (*springnet.Model, []springnet.NodeID) {
	var m springnet.Model
	corners := [4][2]float64{{0, 0}, {a, 0}, {a, b}, {0, b}}
	var base, top []springnet.NodeID
	for i, c := range corners {
		base = append(base, m.AddNode(fmt.Sprintf("foot %d", i+1), springnet.Vec{X: c[0], Y: c[1]}))
		top = append(top, m.AddNode(fmt.Sprintf("corner %d", i+1), springnet.Vec{X: c[0], Y: c[1], Z: h}))
	}
	member := func(p, q springnet.NodeID, ei, l float64) {
		if bars {
			m.AddBar(p, q, springnet.Bar{EA: frameRaw(ei, l).EA})
			return
		}
		m.AddBeam(p, q, springnet.Beam{Raw: frameRaw(ei, l)})
	}
	for i := range 4 {
		if bars {
			m.Fix(base[i], springnet.Translations)
		} else {
			m.Fix(base[i], springnet.AllDOF)
		}
		member(base[i], top[i], eiLeg, h)
		l := a
		if i%2 == 1 {
			l = b
		}
		member(top[i], top[(i+1)%4], eiRail, l)
		m.AddLoad(top[i], springnet.Load{FX: load / 4})
	}
	if diagonals {
		m.AddBar(base[0], top[1], springnet.Bar{Name: "diagonal front", EA: eaDiag})
		m.AddBar(base[3], top[2], springnet.Bar{Name: "diagonal back", EA: eaDiag})
	}
	return &m, top
}

func TestWeldedTableRacking(t *testing.T) {
	// A welded table racks as two portal frames (the X–Z faces); the Y
	// rails only translate under a symmetric X load. Slope-deflection
	// (Hibbeler, Structural Analysis, slope-deflection method; derived
	// here): a fixed-base portal with columns EIc, height h and a girder
	// EIb, span a, sways with
	//
	//	k = (24·EIc/h³)·(1 + 6β)/(4 + 6β),   β = (EIb/a)/(EIc/h)
	//
	// (β → ∞: 24EIc/h³, two fixed–guided columns; β → 0: 6EIc/h³, two
	// cantilevers). A diagonal bar adds (EA/L_d)·cos²θ per face.
	const h, a, b = 0.8, 1.2, 0.6
	const eiLeg, eiRail, eaDiag = 3e4, 6e4, 2e7
	beta := (eiRail / a) / (eiLeg / h)
	portal := 24 * eiLeg / (h * h * h) * (1 + 6*beta) / (4 + 6*beta)
	ld := math.Hypot(a, h)
	brace := eaDiag / ld * (a / ld) * (a / ld)
	const load = 1e3
	tests := []struct {
		name      string
		diagonals bool
		want      float64
	}{
		{"moment frame", false, 2 * portal},
		{"moment frame with diagonals", true, 2*portal + 2*brace},
	}
	var got [2]float64
	for i, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m, top := table(h, a, b, eiLeg, eiRail, eaDiag, false, tc.diagonals, load)
			res, err := springnet.Static(m, nil)
			require.NoError(t, err)
			cr := res.Case(springnet.DefaultCase)
			// The frame's two X–Z faces sway alike; take the mean corner.
			mean := 0.0
			for _, n := range top {
				mean += cr.Displacement(n).UX / 4
			}
			got[i] = load / mean
			if !tc.diagonals {
				assert.InEpsilon(t, tc.want, got[i], frameTol)
				for _, n := range top {
					assert.InEpsilon(t, mean, cr.Displacement(n).UX, frameTol, "all corners sway alike")
				}
			} else {
				// With diagonals the faces are not symmetric any more (the
				// braced corner rises a little against the legs' axial
				// stiffness, a relative effect of order 1/frameAxial times
				// the diagonal-to-leg stiffness ratio).
				assert.InEpsilon(t, tc.want, got[i], frameTol)
			}
		})
	}
	t.Run("pin-jointed table is a mechanism", func(t *testing.T) {
		m, _ := table(h, a, b, eiLeg, eiRail, eaDiag, true, false, load)
		_, err := springnet.Static(m, nil)
		var mech *springnet.MechanismError
		require.True(t, errors.As(err, &mech), "got %v", err)
		assert.NotZero(t, mech.DOF&springnet.Translations, "it racks: a translation is free")
	})
}

func TestRigidTopOnBeamLegsMountLoad(t *testing.T) {
	// Four fixed legs under a rigid top (a machine bed: rigid group at the
	// legs' tops), a sideways force F at a mount in the plane of the top,
	// offset e in Y from the centre. The top translates by
	// F / (4·12EI/h³) (four fixed–guided legs) and twists about Z by
	// F·e / k_θ with k_θ = Σ (12EI/h³)·rᵢ² + 4·GJ/h: each leg's top moves
	// sideways by θ·rᵢ and twists by θ (rigid-body kinematics of the top;
	// Timoshenko & Gere for the leg stiffnesses).
	const h, a, b, ei, gj = 0.9, 1.0, 0.6, 4e4, 3e4
	const f, ecc = 2e3, 0.25
	var m springnet.Model
	var tops []springnet.NodeID
	for i, c := range [4][2]float64{{0, 0}, {a, 0}, {a, b}, {0, b}} {
		base := m.AddNode(fmt.Sprintf("foot %d", i), springnet.Vec{X: c[0], Y: c[1]})
		top := m.AddNode(fmt.Sprintf("top %d", i), springnet.Vec{X: c[0], Y: c[1], Z: h})
		m.Fix(base, springnet.AllDOF)
		raw := frameRaw(ei, h)
		raw.GJ = gj
		m.AddBeam(base, top, springnet.Beam{Raw: raw})
		tops = append(tops, top)
	}
	g := m.AddRigidGroup("bed", tops...)
	mt := m.AddMount("spindle", springnet.Vec{X: a / 2, Y: b/2 + ecc, Z: h}, g)
	m.AddLoad(mt, springnet.Load{FX: f})
	res, err := springnet.Static(&m, nil)
	require.NoError(t, err)
	cr := res.Case(springnet.DefaultCase)
	kLeg := 12 * ei / (h * h * h)
	r2 := (a/2)*(a/2) + (b/2)*(b/2)
	kTwist := 4*kLeg*r2 + 4*gj/h
	d := cr.At(g)
	assert.InEpsilon(t, f/(4*kLeg), d.UX, frameTol)
	assert.InEpsilon(t, -f*ecc/kTwist, d.RZ, frameTol)
	// The mount moves with the top: u = u_g + θ × r.
	dm := cr.At(mt)
	assert.InEpsilon(t, d.UX-d.RZ*ecc, dm.UX, frameTol)
	// Each leg carries its share of shear; the base reactions balance F.
	eq := cr.Equilibrium()
	assert.Less(t, eq.ForceError, 1e-9) // relative imbalances (Equilibrium doc) of one direct solve: round-off
	assert.Less(t, eq.MomentError, 1e-9)
}
