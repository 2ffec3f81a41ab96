package springnet_test

import (
	"fmt"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// sweepTol is the relative tolerance of Sweep results against closed
// forms and against fresh analyses: round-off of a direct solve of a
// tiny, well-conditioned system.
const sweepTol = 1e-9

// spreadSteel is a steel whose E is known to lie within ±5 % of 200 GPa
// (invented spread for the test; the closed forms take any values).
func spreadSteel() materials.Material {
	m := beamSteel()
	m.E = materials.Range{Low: 190e9, Nominal: 200e9, High: 210e9}
	return m
}

func TestSweepBarOverLevels(t *testing.T) {
	// A bar along X from a fixed node to a node held sideways by a foot
	// (Y, Z only), pulled by F: the stiffness along the bar is EA/L, the
	// displacement F·L/(E·A) and the stress F/A at every level
	// (Gere & Goodno, Mechanics of Materials, axially loaded members);
	// the foot's stiffness does not vary (no Vary).
	const l, d, f, kSide = 1.2, 0.02, 10e3, 1e9
	area := math.Pi * d * d / 4
	mat := spreadSteel()
	var m springnet.Model
	a := m.AddNode("a", springnet.Vec{})
	b := m.AddNode("b", springnet.Vec{X: l})
	m.Fix(a, springnet.Translations)
	m.AddBar(a, b, springnet.Bar{Material: mat, Section: sections.Round{D: d}})
	m.AddFoot(b, springnet.Foot{K: springnet.Stiffness6{Y: kSide, Z: kSide}})
	m.AddLoad(b, springnet.Load{FX: f})
	tip := m.AddMount("tip", springnet.Vec{X: l}, b)

	var s springnet.Solver
	res, err := s.Sweep(&m, nil)
	require.NoError(t, err)
	require.Len(t, res.Mounts, 1)
	mt := res.Mounts[0]
	assert.Equal(t, springnet.Place(tip), mt.Place)
	for i, lv := range materials.Levels {
		e := mat.E.At(lv)
		t.Run(lv.String(), func(t *testing.T) {
			assert.InEpsilon(t, e*area/l, mt.X.ByLevel[i], sweepTol, "EA/L")
			assert.InEpsilon(t, e*area/l, mt.X.At(lv), sweepTol, "EA/L")
			assert.InEpsilon(t, kSide, mt.Y.ByLevel[i], sweepTol, "the foot, no Vary")
			assert.InEpsilon(t, e*area/l, mt.Softest.ByLevel[i], sweepTol, "EA/L is below the foot's 1e9")
			assert.InEpsilon(t, f*l/(e*area), res.MaxDisplacement.ByLevel[i], sweepTol, "F·L/(E·A)")
			assert.InEpsilon(t, f/area/mat.Yield, res.MaxUtilisation.ByLevel[i], sweepTol, "F/A over yield")

			// The reused Solver gives what fresh ones give.
			fresh, err := springnet.Static(&m, &springnet.StaticSettings{Level: lv})
			require.NoError(t, err)
			assert.InEpsilon(t, fresh.Displacement(b).UX, res.Static[i].Displacement(b).UX, sweepTol)
			ps, err := springnet.MountStiffness(&m, tip, &springnet.StaticSettings{Level: lv})
			require.NoError(t, err)
			assert.InEpsilon(t, ps.Along(springnet.Vec{X: 1}), mt.X.ByLevel[i], sweepTol)
			assert.Equal(t, lv, res.Static[i].Level())
		})
	}
	// Stiffness rises with E: its range runs from the Low to the High
	// level; the displacement falls, so its range runs the other way.
	assert.Equal(t, mt.X.At(materials.Low), mt.X.Range.Low)
	assert.Equal(t, mt.X.At(materials.High), mt.X.Range.High)
	assert.Equal(t, res.MaxDisplacement.At(materials.High), res.MaxDisplacement.Range.Low)
	assert.Equal(t, res.MaxDisplacement.At(materials.Low), res.MaxDisplacement.Range.High)
	assert.Equal(t, res.MaxDisplacement.At(materials.Nominal), res.MaxDisplacement.Range.Nominal)
	assert.NoError(t, res.MaxDisplacement.Range.Check())
	assert.False(t, res.HasBuckling, "buckling not asked for")
}

func TestSweepBucklingLinearInE(t *testing.T) {
	// A fixed–free column under P buckles at λ·P = π²·E·I/(2L)² (Timoshenko
	// & Gere, Theory of Elastic Stability, ch. 2), so the factor follows E
	// level by level; eight elements as in TestBucklingEulerColumn.
	const l, p, b, h = 1.5, 1e3, 0.04, 0.06
	iWeak := h * b * b * b / 12
	mat := spreadSteel()
	var m springnet.Model
	prev := m.AddNode("base", springnet.Vec{})
	m.Fix(prev, springnet.AllDOF)
	for i := 1; i <= 8; i++ {
		n := m.AddNode("", springnet.Vec{Z: l * float64(i) / 8})
		m.AddBeam(prev, n, springnet.Beam{Material: mat, Section: sections.Rect{B: b, H: h}})
		prev = n
	}
	m.AddLoad(prev, springnet.Load{FZ: -p})
	m.AddMount("top", m.NodeAt(prev), prev)
	res, err := springnet.Sweep(&m, &springnet.SweepSettings{Buckling: true, Places: []springnet.Place{}})
	require.NoError(t, err)
	assert.Empty(t, res.Mounts, "an empty Places measures nothing")
	require.True(t, res.HasBuckling)
	for i, lv := range materials.Levels {
		want := math.Pi * math.Pi * mat.E.At(lv) * iWeak / (4 * l * l) / p
		assert.InEpsilon(t, want, res.Buckling.ByLevel[i], eulerTol, lv.String())
	}
	assert.Equal(t, res.Buckling.At(materials.Low), res.Buckling.Range.Low)
}

func TestSweepTensionOnlyHasNoBuckling(t *testing.T) {
	// A hanging bar is in tension: nothing can buckle, so Buckled stays
	// false and the sweep still succeeds.
	var m springnet.Model
	top := m.AddNode("top", springnet.Vec{Z: 1})
	bot := m.AddNode("bottom", springnet.Vec{})
	m.Fix(top, springnet.Translations)
	m.Fix(bot, springnet.UX|springnet.UY)
	m.AddBar(top, bot, springnet.Bar{Material: spreadSteel(), Section: sections.Round{D: 0.01}})
	m.AddLoad(bot, springnet.Load{FZ: -1e3})
	res, err := springnet.Sweep(&m, &springnet.SweepSettings{Buckling: true})
	require.NoError(t, err)
	assert.False(t, res.HasBuckling)
	assert.Equal(t, springnet.Spread{}, res.Buckling)
}

func TestSweepEulerMarginAndTipping(t *testing.T) {
	t.Run("Euler margin follows E", func(t *testing.T) {
		// One fixed–free beam under P: margin = π²·E·I/(K·L)²/P with the
		// design K = 2.1 (AISC 360 Commentary Table C-A-7.1) about the
		// weak axis, level by level.
		const l, p, b, h = 1.2, 5e3, 0.04, 0.06
		iWeak := h * b * b * b / 12
		mat := spreadSteel()
		m, tip, _ := beamCantilever(springnet.Vec{Z: 1}, l, springnet.Beam{Material: mat, Section: sections.Rect{B: b, H: h}})
		m.AddLoad(tip, springnet.Load{FZ: -p})
		res, err := springnet.Sweep(m, nil)
		require.NoError(t, err)
		require.True(t, res.HasEulerMargin)
		for i, lv := range materials.Levels {
			want := math.Pi * math.Pi * mat.E.At(lv) * iWeak / (2.1 * l * 2.1 * l) / p
			assert.InEpsilon(t, want, res.EulerMargin.ByLevel[i], sweepTol, lv.String())
		}
		assert.False(t, res.HasTipping, "no compression-only feet")
	})
	t.Run("tipping of a rigid stand does not depend on E", func(t *testing.T) {
		// The stand of TestCompressionOnlyFeet, "along x, all feet down":
		// λ = W·b/(2·H·P) by rigid-body statics, at every level.
		const b, d, h, w, p = 0.4, 0.6, 1.5, 1000.0, 100.0
		m, _ := narrowStand(b, d, h, w, p, 0)
		res, err := springnet.Sweep(m, nil)
		require.NoError(t, err)
		require.True(t, res.HasTipping)
		for i := range materials.Levels {
			assert.InEpsilon(t, w*b/(2*h*p), res.Tipping.ByLevel[i], contactTol)
		}
		require.Len(t, res.Mounts, 1, "the stand's mount")
		assert.False(t, res.HasEulerMargin, "no members")
	})
}

// BenchmarkSweep compares Sweep (one Solver, one factorisation per level
// for every mount) with the same numbers from fresh package-level calls,
// a Static and a MountStiffness per mount at each level, on the 10³
// lattice with four mounts on its top layer.
func BenchmarkSweep(b *testing.B) {
	const n = 10
	m := latticeModel(n, n, n)
	top := func(i, j int) springnet.NodeID { return springnet.NodeID(i + (n+1)*(j+(n+1)*n)) }
	for k, c := range [4][2]int{{0, 0}, {n, 0}, {n, n}, {0, n}} {
		nd := top(c[0], c[1])
		m.AddMount(fmt.Sprint("m", k), m.NodeAt(nd), nd)
	}
	b.Run("sweep", func(b *testing.B) {
		for b.Loop() {
			if _, err := springnet.Sweep(m, nil); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("fresh calls", func(b *testing.B) {
		for b.Loop() {
			for _, lv := range materials.Levels {
				st := &springnet.StaticSettings{Level: lv}
				if _, err := springnet.Static(m, st); err != nil {
					b.Fatal(err)
				}
				for k := range m.NumMounts() {
					if _, err := springnet.MountStiffness(m, springnet.MountID(k), st); err != nil {
						b.Fatal(err)
					}
				}
			}
		}
	})
}

func TestSweepFrequency(t *testing.T) {
	// A mass m on a massless bar of stiffness k = E·A/L, free only along
	// the bar, is one DOF: f = √(k/m)/2π at each level of E (any vibration
	// text, e.g. Thomson & Dahleh, Theory of Vibration with Applications,
	// §2.1, section number from memory).
	const l, d, kg = 0.8, 0.015, 250.0
	area := math.Pi * d * d / 4
	mat := spreadSteel()
	mat.Density = 0 // massless bar: the point mass alone
	var m springnet.Model
	a := m.AddNode("a", springnet.Vec{})
	b := m.AddNode("b", springnet.Vec{Z: l})
	m.Fix(a, springnet.Translations)
	m.Fix(b, springnet.UX|springnet.UY)
	m.AddBar(a, b, springnet.Bar{Material: mat, Section: sections.Round{D: d}})
	m.AddMass(b, springnet.Mass{Kg: kg})
	m.AddLoad(b, springnet.Load{FZ: -kg * springnet.StandardGravity}) // Sweep's statics need a case

	for _, kind := range []springnet.MassMatrix{springnet.Consistent, springnet.Lumped} {
		t.Run(kind.String(), func(t *testing.T) {
			var s springnet.Solver
			// Three asked for, one there: the model's one mode.
			res, err := s.Sweep(&m, &springnet.SweepSettings{Modes: 3, ModeMass: kind})
			require.NoError(t, err)
			require.Len(t, res.Frequencies, 1)
			f := res.Frequencies[0]
			for i, lv := range materials.Levels {
				want := math.Sqrt(mat.E.At(lv)*area/l/kg) / (2 * math.Pi)
				assert.InEpsilon(t, want, f.ByLevel[i], sweepTol, "%v", lv)
				require.NotNil(t, res.ModeResults[i])
				assert.Equal(t, res.ModeResults[i].Frequency(0), f.ByLevel[i])
			}
			// f rises with E: the range runs from the Low to the High level.
			assert.InEpsilon(t, math.Sqrt(mat.E.Low*area/l/kg)/(2*math.Pi), f.Range.Low, sweepTol)
			assert.InEpsilon(t, math.Sqrt(mat.E.High*area/l/kg)/(2*math.Pi), f.Range.High, sweepTol)
			assert.InEpsilon(t, math.Sqrt(mat.E.Nominal*area/l/kg)/(2*math.Pi), f.Range.Nominal, sweepTol)
		})
	}
	t.Run("none asked", func(t *testing.T) {
		res, err := springnet.Sweep(&m, nil)
		require.NoError(t, err)
		assert.Nil(t, res.Frequencies)
		assert.Nil(t, res.ModeResults[0])
	})
	t.Run("negative", func(t *testing.T) {
		_, err := springnet.Sweep(&m, &springnet.SweepSettings{Modes: -1})
		assert.ErrorContains(t, err, "springnet: sweep")
	})
}
