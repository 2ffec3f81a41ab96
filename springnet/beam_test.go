package springnet_test

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// beamTol is the relative tolerance for beam closed forms through the
// Model: the cubic beam element is exact for end loads, so agreement is
// limited by the round-off of a direct solve of a small, well-conditioned
// system (stiffness ratios within about 1e4).
const beamTol = 1e-9

// beamSteel is a steel with exactly known constants for closed-form
// checks: E = 200 GPa, ν = 0.3 (G = E/2.6), yield 235 MPa (the S235
// nominal yield of EN 10025-2, from memory; only used as a divisor).
func beamSteel() materials.Material {
	return materials.Material{Name: "test steel", Kind: materials.Steel, E: materials.Exact(200e9),
		Poisson: 0.3, Density: 7850, Yield: 235e6}
}

// beamCantilever builds a cantilever along dir from the origin, fixed at
// the root, and returns the model and the tip node.
func beamCantilever(dir springnet.Vec, l float64, bm springnet.Beam) (*springnet.Model, springnet.NodeID, springnet.ElementID) {
	var m springnet.Model
	a := m.AddNode("root", springnet.Vec{})
	b := m.AddNode("tip", dir.Scale(l))
	m.Fix(a, springnet.AllDOF)
	e := m.AddBeam(a, b, bm)
	return &m, b, e
}

func TestBeamCantileverBothPlanes(t *testing.T) {
	// Euler–Bernoulli cantilever with an end load P: δ = P·L³/(3·E·I)
	// (Timoshenko & Gere, Mechanics of Materials, cantilever with a
	// concentrated end load). A 40 × 80 mm bar (B along y, H along z):
	// Iy = B·H³/12 resists loads along local z, Iz = H·B³/12 loads along y.
	const p, l, e = 1e3, 1.2, 200e9
	const b, h = 0.04, 0.08
	iy, iz := b*h*h*h/12, h*b*b*b/12
	sec := sections.Rect{B: b, H: h}
	tests := []struct {
		name string
		dir  springnet.Vec // member axis
		up   springnet.Vec
		roll float64
		load springnet.Load
		i    float64 // governing second moment
		comp func(springnet.Displacement) float64
	}{
		// Along X with the default up (global Z): local z = Z, local y = Y.
		{"along X, load Z (about local y)", springnet.Vec{X: 1}, springnet.Vec{}, 0,
			springnet.Load{FZ: p}, iy, func(d springnet.Displacement) float64 { return d.UZ }},
		{"along X, load Y (about local z)", springnet.Vec{X: 1}, springnet.Vec{}, 0,
			springnet.Load{FY: p}, iz, func(d springnet.Displacement) float64 { return d.UY }},
		// A quarter roll turns local z onto −Y: the stiff axis now faces Y.
		{"along X rolled 90°, load Y", springnet.Vec{X: 1}, springnet.Vec{}, math.Pi / 2,
			springnet.Load{FY: p}, iy, func(d springnet.Displacement) float64 { return d.UY }},
		// Up vector picks local z: up = Y puts the depth H along Y.
		{"along X, up Y, load Y", springnet.Vec{X: 1}, springnet.Vec{Y: 1}, 0,
			springnet.Load{FY: p}, iy, func(d springnet.Displacement) float64 { return d.UY }},
		// A vertical member: default up is global Y, so local z = Y.
		{"along Z, load X", springnet.Vec{Z: 1}, springnet.Vec{}, 0,
			springnet.Load{FX: p}, iz, func(d springnet.Displacement) float64 { return d.UX }},
		{"along Z, load Y", springnet.Vec{Z: 1}, springnet.Vec{}, 0,
			springnet.Load{FY: p}, iy, func(d springnet.Displacement) float64 { return d.UY }},
		// An oblique member in the X–Y plane, loaded along Z.
		{"oblique, load Z", springnet.Vec{X: 0.6, Y: 0.8}, springnet.Vec{}, 0,
			springnet.Load{FZ: p}, iy, func(d springnet.Displacement) float64 { return d.UZ }},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m, tip, _ := beamCantilever(tc.dir, l, springnet.Beam{Material: beamSteel(), Section: sec, Up: tc.up, Roll: tc.roll})
			m.AddLoad(tip, tc.load)
			res, err := springnet.Static(m, nil)
			require.NoError(t, err)
			want := p * l * l * l / (3 * e * tc.i) // Timoshenko & Gere, cantilever end load
			assert.InEpsilon(t, want, tc.comp(res.Displacement(tip)), beamTol)
		})
	}
}

func TestBeamFixedGuided(t *testing.T) {
	// Fixed at one end, guided at the other (the end translates but cannot
	// rotate), transverse end load P: δ = P·L³/(12·E·I) (Roark's Formulas
	// for Stress and Strain, Table 8.1, end load, left end fixed, right end
	// guided; from memory).
	const p, l, e, d = 2e3, 0.9, 200e9, 0.05
	i := math.Pi * d * d * d * d / 64 // round bar, Gere & Goodno App. D
	m, tip, _ := beamCantilever(springnet.Vec{X: 1}, l, springnet.Beam{Material: beamSteel(), Section: sections.Round{D: d}})
	m.Fix(tip, springnet.Rotations)
	m.AddLoad(tip, springnet.Load{FY: p, FZ: -p})
	res, err := springnet.Static(m, nil)
	require.NoError(t, err)
	want := p * l * l * l / (12 * e * i)
	got := res.Displacement(tip)
	assert.InEpsilon(t, want, got.UY, beamTol)
	assert.InEpsilon(t, -want, got.UZ, beamTol)
}

func TestBeamTimoshenkoCantilever(t *testing.T) {
	// A stubby rectangular member, L/h = 2: shear deflection matters.
	// Timoshenko cantilever, end load: δ = P·L³/(3EI) + P·L/(κ·G·A) with
	// κ = 5/6 for a rectangle (Timoshenko & Gere, Mechanics of Materials,
	// shear deflections; Timoshenko's shear coefficient for a rectangle).
	const p, l, e, nu = 5e3, 0.6, 200e9, 0.3
	const b, h = 0.05, 0.3
	g := e / (2 * (1 + nu))
	a := b * h
	iy := b * h * h * h / 12
	bending := p * l * l * l / (3 * e * iy)
	shear := p * l / (5.0 / 6 * g * a)
	sec := sections.Rect{B: b, H: h}
	tests := []struct {
		name       string
		timoshenko bool
		want       float64
	}{
		{"Euler–Bernoulli default", false, bending},
		{"Timoshenko", true, bending + shear},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m, tip, _ := beamCantilever(springnet.Vec{X: 1}, l, springnet.Beam{Material: beamSteel(), Section: sec, Timoshenko: tc.timoshenko})
			m.AddLoad(tip, springnet.Load{FZ: -p})
			res, err := springnet.Static(m, nil)
			require.NoError(t, err)
			assert.InEpsilon(t, -tc.want, res.Displacement(tip).UZ, beamTol)
		})
	}
	// Here δs/δb = E·h²/(4·κ·G·L²) ≈ 0.195: at L/h = 2 the
	// Euler–Bernoulli default misses a sixth of the deflection.
}

func TestBeamReleasesAndJointSprings(t *testing.T) {
	const e, l, p = 200e9, 1.0, 1e3
	sec := sections.Rect{B: 0.03, H: 0.05}
	pr, err := sec.Properties()
	require.NoError(t, err)
	iy, iz := pr.Iy, pr.Iz

	// Two members a–m–b between supports fixed in every direction, load P
	// along Y and Z at mid-span m, the members' ends at the supports
	// released: both bending rotations pinned, the span is simply
	// supported in both planes, δ = P·L³/(48EI); ReleaseRY pins bending
	// about local y only, so about z the span stays fixed–fixed,
	// δ = P·L³/(192EI) (Timoshenko & Gere, Mechanics of Materials, simply
	// supported and fixed-ended beams with a central load).
	spans := []struct {
		name     string
		rel      springnet.Release
		kUY, kUZ float64 // δ = P·L³/(k·E·I)
	}{
		{"simply supported by end pins, both planes", springnet.ReleasePin, 48, 48},
		{"pin about one axis only", springnet.ReleaseRY, 192, 48},
	}
	for _, tc := range spans {
		t.Run(tc.name, func(t *testing.T) {
			var m springnet.Model
			a := m.AddNode("a", springnet.Vec{})
			mid := m.AddNode("mid", springnet.Vec{X: l / 2})
			b := m.AddNode("b", springnet.Vec{X: l})
			m.Fix(a, springnet.AllDOF)
			m.Fix(b, springnet.AllDOF)
			m.AddBeam(a, mid, springnet.Beam{Material: beamSteel(), Section: sec, ReleaseA: tc.rel})
			m.AddBeam(mid, b, springnet.Beam{Material: beamSteel(), Section: sec, ReleaseB: tc.rel})
			m.AddLoad(mid, springnet.Load{FY: p, FZ: p})
			res, err := springnet.Static(&m, nil)
			require.NoError(t, err)
			d := res.Displacement(mid)
			assert.InEpsilon(t, p*l*l*l/(tc.kUY*e*iz), d.UY, beamTol)
			assert.InEpsilon(t, p*l*l*l/(tc.kUZ*e*iy), d.UZ, beamTol)
		})
	}

	t.Run("torsion release", func(t *testing.T) {
		// Two shafts in series a–m–b, both ends fixed, torque at m:
		// k = GJ/L₁ + GJ/L₂ (springs in parallel); releasing twist at m on
		// the second leaves GJ/L₁ (Timoshenko & Gere, statically
		// indeterminate torsional members).
		g := 200e9 / 2.6
		gj := g * pr.J
		for _, rel := range []bool{false, true} {
			var m springnet.Model
			a := m.AddNode("a", springnet.Vec{})
			mid := m.AddNode("mid", springnet.Vec{X: 0.4})
			b := m.AddNode("b", springnet.Vec{X: 1.0})
			m.Fix(a, springnet.AllDOF)
			m.Fix(b, springnet.AllDOF)
			m.AddBeam(a, mid, springnet.Beam{Material: beamSteel(), Section: sec})
			second := springnet.Beam{Material: beamSteel(), Section: sec}
			if rel {
				second.ReleaseA = springnet.ReleaseRX
			}
			m.AddBeam(mid, b, second)
			const torque = 50.0
			m.AddLoad(mid, springnet.Load{MX: torque})
			res, err := springnet.Static(&m, nil)
			require.NoError(t, err)
			k := gj/0.4 + gj/0.6
			if rel {
				k = gj / 0.4
			}
			assert.InEpsilon(t, torque/k, res.Displacement(mid).RX, beamTol, "released=%v", rel)
		}
	})

	t.Run("bolted joint as rotational spring", func(t *testing.T) {
		// Cantilever on a rotational spring k at the root: the member turns
		// rigidly by θ = P·L/k at the root, adding θ·L to the tip, so
		// δ = P·L³/(3EI) + P·L²/k (superposition).
		const k = 2e5 // N·m/rad
		tests := []struct {
			name   string
			spring springnet.Vec
			load   springnet.Load
			i      float64
			comp   func(springnet.Displacement) float64
		}{
			{"about local y", springnet.Vec{Y: k}, springnet.Load{FZ: p}, iy, func(d springnet.Displacement) float64 { return d.UZ }},
			{"about local z", springnet.Vec{Z: k}, springnet.Load{FY: p}, iz, func(d springnet.Displacement) float64 { return d.UY }},
		}
		for _, tc := range tests {
			t.Run(tc.name, func(t *testing.T) {
				m, tip, _ := beamCantilever(springnet.Vec{X: 1}, l, springnet.Beam{Material: beamSteel(), Section: sec, SpringA: tc.spring})
				m.AddLoad(tip, tc.load)
				res, err := springnet.Static(m, nil)
				require.NoError(t, err)
				want := p*l*l*l/(3*e*tc.i) + p*l*l/k
				assert.InEpsilon(t, want, tc.comp(res.Displacement(tip)), beamTol)
			})
		}
	})
}

func TestBeamTorsionBredt(t *testing.T) {
	// Thin closed tube, Bredt's formulas (Timoshenko & Gere, Mechanics of
	// Materials, torsion of thin-walled tubes):
	//
	//	T = 2·A_m·t·τ,   θ = T·L·p_m / (4·A_m²·G·t)
	//
	// with A_m the area and p_m the length of the wall's mid-line. A
	// 100 × 60 × 2 mm sharp-cornered tube. Tolerance: the section adds the
	// open-wall St Venant part t³·p/3 to Bredt's J (EN 10219-2 Annex B), a
	// relative difference of t²·p²/(12·A_m²) ≈ 0.1 % here.
	const bredtTol = 2e-3
	const b, h, tw, l, torque = 0.1, 0.06, 0.002, 1.5, 400.0
	const e, nu = 200e9, 0.3
	g := e / (2 * (1 + nu))
	am := (b - tw) * (h - tw)
	pm := 2 * ((b - tw) + (h - tw))
	m, tip, el := beamCantilever(springnet.Vec{Y: 1}, l, springnet.Beam{Material: beamSteel(), Section: sections.RectTube{H: h, B: b, T: tw}})
	m.AddLoad(tip, springnet.Load{MY: torque})
	res, err := springnet.Static(m, nil)
	require.NoError(t, err)
	want := torque * l * pm / (4 * am * am * g * tw)
	assert.InEpsilon(t, want, res.Displacement(tip).RY, bredtTol)
	// The member carries the torque; the wall shear stress follows.
	mr, err := res.Case(springnet.DefaultCase).MemberForces(el)
	require.NoError(t, err)
	assert.InEpsilon(t, torque, math.Abs(mr.A.T), beamTol)
	assert.InEpsilon(t, torque, math.Abs(mr.B.T), beamTol)
}

// sharpAngle returns the properties of a sharp-cornered angle with legs b
// along +y and h along +z from the heel at the origin, thickness tk, as
// two rectangles (the composite-area method of any mechanics-of-materials
// text, e.g. Gere & Goodno, Mechanics of Materials, ch. 12): area,
// centroid from the heel, and Iy, Iz, Iyz about the centroid.
func sharpAngle(b, h, tk float64) (area, yc, zc, iy, iz, iyz float64) {
	type rect struct{ y0, y1, z0, z1 float64 }
	rs := []rect{{0, b, 0, tk}, {0, tk, tk, h}}
	var sy, sz float64
	for _, r := range rs {
		a := (r.y1 - r.y0) * (r.z1 - r.z0)
		area += a
		sy += a * (r.y0 + r.y1) / 2
		sz += a * (r.z0 + r.z1) / 2
	}
	yc, zc = sy/area, sz/area
	for _, r := range rs {
		w, d := r.y1-r.y0, r.z1-r.z0
		a := w * d
		dy, dz := (r.y0+r.y1)/2-yc, (r.z0+r.z1)/2-zc
		iy += w*d*d*d/12 + a*dz*dz
		iz += d*w*w*w/12 + a*dy*dy
		iyz += a * dy * dz
	}
	return area, yc, zc, iy, iz, iyz
}

func TestBeamAngleCantileverUnsymmetricBending(t *testing.T) {
	// A cantilever whose section has a product of area deflects out of
	// the plane of the load. With v, w the tip deflections along the
	// section's geometric y and z, the generalised flexure formula
	// (Boresi & Schmidt, Advanced Mechanics of Materials, nonsymmetrical
	// bending of straight beams) gives, for ε = −y·v'' − z·w'' and a tip
	// load (Py, Pz) at x = L,
	//
	//	[Iz Iyz; Iyz Iy]·[v''; w''] = (L − x)/E·[Py; Pz]
	//	v = L³/(3·E·D)·(Iy·Py − Iyz·Pz),  w = L³/(3·E·D)·(Iz·Pz − Iyz·Py)
	//
	// with D = Iy·Iz − Iyz². Sharp 50 × 50 × 5 mm and 80 × 40 × 6 mm
	// angles, along X (geometric y = global Y, z = global Z) with and
	// without a roll, and upright along Z.
	const l, e, p = 1.0, 200e9, 100.0
	tests := []struct {
		name    string
		b, h    float64
		dir, up springnet.Vec
		roll    float64
		load    springnet.Vec
	}{
		{"equal angle along X, vertical load", 0.05, 0.05, springnet.Vec{X: 1}, springnet.Vec{}, 0, springnet.Vec{Z: -p}},
		{"equal angle along X, sideways load", 0.05, 0.05, springnet.Vec{X: 1}, springnet.Vec{}, 0, springnet.Vec{Y: p}},
		{"unequal angle along X, rolled 0.4 rad", 0.08, 0.04, springnet.Vec{X: 1}, springnet.Vec{}, 0.4, springnet.Vec{Y: p / 2, Z: -p}},
		{"unequal angle upright, up X", 0.08, 0.04, springnet.Vec{Z: 1}, springnet.Vec{X: 1}, 0, springnet.Vec{X: p, Y: p}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			const tk = 0.005
			area, _, _, iy, iz, iyz := sharpAngle(tc.b, tc.h, tk)
			sec := sections.Angle{B: tc.b, H: tc.h, T: tk}
			pr, err := sec.Properties()
			require.NoError(t, err)
			// sharpAngle is the hand closed form of two rectangles; round-off only
			// (Iyz by parallel-axis sums, which cancel a few digits: 1e-9).
			require.InEpsilon(t, area, pr.A, 1e-12, "the section is the two rectangles")
			require.InEpsilon(t, iyz, pr.Iyz, 1e-9, "same product of area, same sign")
			m, tip, _ := beamCantilever(tc.dir, l, springnet.Beam{Material: beamSteel(), Section: sec, Up: tc.up, Roll: tc.roll})
			m.AddLoad(tip, springnet.Load{FX: tc.load.X, FY: tc.load.Y, FZ: tc.load.Z})
			res, err := springnet.Static(m, nil)
			require.NoError(t, err)
			// Geometric section axes in global coordinates: the frame of
			// Beam (z in the plane of the axis and up, y = z × x, then
			// the roll turning y towards z).
			ex := tc.dir
			up := tc.up
			if up == (springnet.Vec{}) {
				up = springnet.Vec{Z: 1}
			}
			ez := up.Sub(ex.Scale(up.Dot(ex)))
			ez = ez.Scale(1 / ez.Norm())
			ey := ez.Cross(ex)
			c, s := math.Cos(tc.roll), math.Sin(tc.roll)
			ey, ez = ey.Scale(c).Add(ez.Scale(s)), ey.Scale(-s).Add(ez.Scale(c))
			py, pz := tc.load.Dot(ey), tc.load.Dot(ez)
			d := iy*iz - iyz*iyz
			v := l * l * l / (3 * e * d) * (iy*py - iyz*pz)
			w := l * l * l / (3 * e * d) * (iz*pz - iyz*py)
			want := ey.Scale(v).Add(ez.Scale(w))
			got := res.Displacement(tip)
			scale := want.Norm()
			assert.InDelta(t, want.X, got.UX, beamTol*scale, "UX")
			assert.InDelta(t, want.Y, got.UY, beamTol*scale, "UY")
			assert.InDelta(t, want.Z, got.UZ, beamTol*scale, "UZ")
		})
	}
}

func TestBucklingAngleColumnMinorAxis(t *testing.T) {
	// A fixed–free column of a sharp 50 × 50 × 5 mm equal angle buckles
	// about its minor principal axis: P_cr = π²·E·I_min/(2L)² (Timoshenko
	// & Gere, Theory of Elastic Stability, ch. 2), I_min = (Iy+Iz)/2 −
	// √(((Iy−Iz)/2)² + Iyz²) (Gere & Goodno, principal axes). Eight
	// elements, as in TestBucklingEulerColumn.
	const l, e, tk, b = 1.5, 200e9, 0.005, 0.05
	_, _, _, iy, iz, iyz := sharpAngle(b, b, tk)
	imin := (iy+iz)/2 - math.Hypot((iy-iz)/2, iyz)
	m, _ := bucklingColumn(8, l, sections.Angle{B: b, H: b, T: tk}, springnet.AllDOF, 0)
	res, err := springnet.Buckling(m, springnet.DefaultCase, &springnet.BucklingSettings{Modes: 2})
	require.NoError(t, err)
	want := math.Pi * math.Pi * e * imin / (4 * l * l) / 1e3 // the column carries 1 kN
	assert.InEpsilon(t, want, res.Factor(0), eulerTol)
}
