package springnet_test

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"sort"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/mat"

	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/modelfile"
)

// Tolerances of the contact checks.
const (
	// complementarityTol is the tension or penetration, relative to the
	// total vertical load, that still counts as zero: the contact search
	// decides at 1e-9 of the load, the solve is good to ~1e-12.
	complementarityTol = 1e-8
	// staticsTol is the relative agreement of a determinate contact set's
	// reactions with rigid-body statics: exact up to round-off.
	staticsTol = 1e-7
)

// checkContact asserts complementarity and equilibrium of a solved case on
// compression-only feet: every foot in contact pushes up (FZ ≥ 0), every
// lifted foot carries no vertical force and does not penetrate the floor
// (UZ ≥ 0), and the reactions balance the loads.
func checkContact(t *testing.T, m *springnet.Model, cr *springnet.CaseResult) {
	t.Helper()
	eq := cr.Equilibrium()
	load := math.Abs(eq.Applied.FZ)
	require.Positive(t, load)
	for _, fr := range cr.Feet() {
		foot, _ := m.FootOf(fr.Element)
		if fr.Lifted {
			assert.Zero(t, fr.Reaction.FZ, fr.Name)
			// The gap is UZ; the spring would carry −k_z·UZ were it down.
			assert.GreaterOrEqual(t, foot.K.Z*cr.Displacement(fr.Node).UZ, -complementarityTol*load, fr.Name)
		} else {
			assert.GreaterOrEqual(t, fr.Reaction.FZ, -complementarityTol*load, fr.Name)
			assert.False(t, fr.Held, fr.Name)
		}
	}
	assert.Less(t, eq.ForceError, complementarityTol)
	assert.Less(t, eq.MomentError, complementarityTol)
}

// staticsReactions solves rigid-body statics for the vertical reactions of
// three feet on the floor (z = 0) at pts under loads whose resultant is
// applied (moments about the origin): ΣR = −F_z, Σy·R = −M_x, Σx·R = M_y.
// Horizontal reactions act at floor level and add no moment about
// horizontal axes through the floor. Reference: statics of a rigid body on
// three supports (any mechanics text).
func staticsReactions(t *testing.T, pts [3]springnet.Vec, applied springnet.Load) [3]float64 {
	t.Helper()
	a := mat.NewDense(3, 3, nil)
	for j, p := range pts {
		a.Set(0, j, 1)
		a.Set(1, j, p.Y)
		a.Set(2, j, p.X)
	}
	b := mat.NewVecDense(3, []float64{-applied.FZ, -applied.MX, applied.MY})
	var x mat.VecDense
	require.NoError(t, x.SolveVec(a, b))
	return [3]float64{x.AtVec(0), x.AtVec(1), x.AtVec(2)}
}

// checkDeterminate compares the vertical reactions of the feet in contact
// with rigid-body statics when exactly three feet, all on the floor, carry
// the stand; it reports whether it did.
func checkDeterminate(t *testing.T, m *springnet.Model, cr *springnet.CaseResult) bool {
	t.Helper()
	var pts [3]springnet.Vec
	var got [3]float64
	n := 0
	for _, fr := range cr.Feet() {
		if fr.Lifted {
			continue
		}
		if n == 3 {
			return false
		}
		pts[n], got[n] = m.NodeAt(fr.Node), fr.Reaction.FZ
		n++
	}
	if n != 3 {
		return false
	}
	for _, p := range pts {
		if p.Z != 0 {
			return false
		}
	}
	// Three feet on one line are no triangle: skip.
	area := (pts[1].X-pts[0].X)*(pts[2].Y-pts[0].Y) - (pts[2].X-pts[0].X)*(pts[1].Y-pts[0].Y)
	if math.Abs(area) < 1e-9 {
		return false
	}
	eq := cr.Equilibrium()
	want := staticsReactions(t, pts, eq.Applied)
	for j := range want {
		assert.InDelta(t, want[j], got[j], staticsTol*math.Abs(eq.Applied.FZ), "foot %d", j)
	}
	return true
}

func TestContactCycleBench(t *testing.T) {
	// The timber bench of examples/ with the planing force raised to
	// [120, 0, −40] lbf: with all four pads down, pad-4 (back left) pulls on
	// the floor by a few newtons; lifted with its sideways springs, the
	// frame racks and it would press into the floor. The search used to
	// cycle between the two; now the pad is held (lifted, friction holding
	// it sideways) and the stand stands on three pads.
	fh, err := os.Open("testdata/bench-planing-120lbf.toml")
	require.NoError(t, err)
	defer fh.Close()
	f, err := modelfile.Read("bench-planing-120lbf.toml", fh)
	require.NoError(t, err)
	res, err := springnet.Static(f.Model, nil)
	require.NoError(t, err)
	c, ok := f.CaseIDs["planing"]
	require.True(t, ok)
	cr := res.Case(c)
	checkContact(t, f.Model, cr)
	require.Len(t, cr.Lifted(), 1)
	fr, _ := cr.Foot(cr.Lifted()[0])
	assert.Equal(t, "pad-4", fr.Name)
	assert.True(t, fr.Held, "pad-4 is lifted but held sideways")
	// The loads the statics check below uses: the planing case is the own
	// weight plus 120 lbf along X and 40 lbf down at FL-top (0, 0, 33 in);
	// its moment about the origin is r × F = (0, 33 in · 120 lbf, 0)
	// (1 lbf = 4.4482216152605 N, 1 in = 0.0254 m, exact by definition).
	w, ok := f.CaseIDs["own weight"]
	require.True(t, ok)
	const lbf, in = 4.4482216152605, 0.0254
	ap, aw := cr.Equilibrium().Applied, res.Case(w).Equilibrium().Applied
	assert.InDelta(t, 120*lbf, ap.FX-aw.FX, staticsTol*120*lbf)
	assert.InDelta(t, -40*lbf, ap.FZ-aw.FZ, staticsTol*120*lbf)
	assert.InDelta(t, 33*in*120*lbf, ap.MY-aw.MY, staticsTol*33*in*120*lbf)
	assert.InDelta(t, 0, ap.MX-aw.MX, staticsTol*33*in*120*lbf)
	// Three pads carry the bench: their vertical reactions are those of
	// rigid-body statics (the held pad's sideways force acts at floor level).
	assert.True(t, checkDeterminate(t, f.Model, cr))
	// A pushed bench can tip: the margin is found and above 1.
	tip := cr.Tipping()
	require.True(t, tip.Found, tip.Note)
	assert.Greater(t, tip.Factor, 1.0)
}

// benchAt reads the bench of testdata with the planing force scaled to
// lam × [120, 0, −40] lbf.
func benchAt(t *testing.T, lam float64) *modelfile.File {
	t.Helper()
	data, err := os.ReadFile("testdata/bench-planing-120lbf.toml")
	require.NoError(t, err)
	const force = "force = [120, 0, -40]"
	require.Contains(t, string(data), force)
	text := strings.Replace(string(data), force, fmt.Sprintf("force = [%.17g, 0, %.17g]", 120*lam, -40*lam), 1)
	f, err := modelfile.Read("bench", strings.NewReader(text))
	require.NoError(t, err)
	return f
}

func TestContactBenchTippingFactor(t *testing.T) {
	// The tipping factor the contact path finds, checked by direct
	// solves with the force scaled just below and just above it: below,
	// the bench stands (complementarity and equilibrium hold); above, it
	// tips. The margin is far above the path's round-off and far below
	// the factor's size.
	const margin = 0.01
	for _, force := range []float64{1, 100.0 / 120} { // 120 lbf and the example's 100 lbf
		f := benchAt(t, force)
		res, err := springnet.Static(f.Model, nil)
		require.NoError(t, err)
		c := f.CaseIDs["planing"]
		tip := res.Case(c).Tipping()
		require.True(t, tip.Found, tip.Note)

		below := benchAt(t, force*tip.Factor*(1-margin))
		rb, err := springnet.Static(below.Model, nil)
		require.NoError(t, err, "at %g × the force", tip.Factor*(1-margin))
		checkContact(t, below.Model, rb.Case(c))

		_, err = springnet.Static(benchAt(t, force*tip.Factor*(1+margin)).Model, nil)
		var te *springnet.TippingError
		assert.True(t, errors.As(err, &te), "at %g × the force: %v", tip.Factor*(1+margin), err)
	}
}

// looseStand is a stand on n loose feet at pts on the floor (a convex
// polygon), its weight w at cg and a load p at q, one case with gravity.
// Without legs it is one rigid body through its feet; with legs each foot
// carries a weightless steel tube leg (a beam, up to legH) whose top is part
// of the rigid top, so the stand is flexible.
func looseStand(pts []springnet.Vec, legs bool, w float64, cg springnet.Vec, q springnet.Vec, p springnet.Load) *springnet.Model {
	const legH = 0.6
	steel := beamSteel()
	steel.Density = 0 // weightless legs: the weight is w alone
	var m springnet.Model
	var nodes []springnet.NodeID
	for i, at := range pts {
		n := m.AddNode(string(rune('A'+i)), at)
		m.AddFoot(n, springnet.Foot{Name: "foot " + string(rune('A'+i)),
			K: springnet.Stiffness6{X: 2e6, Y: 3e6, Z: 1e7 * (1 + float64(i%3))}, CompressionOnly: true})
		if legs {
			top := m.AddNode("", springnet.Vec{X: at.X, Y: at.Y, Z: legH})
			m.AddBeam(n, top, springnet.Beam{Material: steel, Section: sections.RoundTube{D: 0.04, T: 0.003}})
			n = top
		}
		nodes = append(nodes, n)
	}
	g := m.AddRigidGroup("stand", nodes...)
	c := m.AddLoadCase("random")
	m.SetGravity(c, springnet.Gravity(1))
	m.AddMass(g, springnet.Mass{Kg: w / springnet.StandardGravity, Offset: cg.Sub(m.GroupPoint(g))})
	mt := m.AddMount("load", q, g)
	m.AddCaseLoad(c, mt, p)
	return &m
}

// polygonMargin returns the signed distance of (x, y) inside the convex
// polygon pts (counter-clockwise): positive inside, negative outside
// (the least distance to an edge line; outside, a bound that keeps its
// sign).
func polygonMargin(pts []springnet.Vec, x, y float64) float64 {
	d := math.Inf(1)
	for i := range pts {
		a, b := pts[i], pts[(i+1)%len(pts)]
		ex, ey := b.X-a.X, b.Y-a.Y
		l := math.Hypot(ex, ey)
		d = math.Min(d, (ex*(y-a.Y)-ey*(x-a.X))/l)
	}
	return d
}

// maxTipFactor bounds the search for a tipping factor by hand; tipTol is
// the relative agreement asked of it (bisection to round-off).
const (
	maxTipFactor = 1e4
	tipTol       = 1e-6
)

// firstRoot returns the least x in [lo, hi] where f changes sign from
// positive, by a geometric scan and bisection.
func firstRoot(f func(float64) float64, lo, hi float64) (float64, bool) {
	const steps = 4000
	r := math.Pow(hi/lo, 1.0/steps)
	a := lo
	for i := 0; i < steps; i++ {
		b := a * r
		if f(b) < 0 {
			for j := 0; j < 100; j++ {
				mid := 0.5 * (a + b)
				if f(mid) < 0 {
					b = mid
				} else {
					a = mid
				}
			}
			return 0.5 * (a + b), true
		}
		a = b
	}
	return 0, false
}

func TestContactRandomStands(t *testing.T) {
	// Reference: a body on loose feet stands iff the centre of pressure of
	// the applied loads — where their resultant meets the floor,
	// x = M_y/(−F_z), y = M_x/F_z for moments about the origin — lies in
	// the convex hull of the feet (rigid-body statics of the whole stand,
	// any mechanics text: the reactions are vertical forces ≥ 0 at the feet
	// and sideways forces at floor level). In linear theory this holds for
	// a flexible stand too. Samples within a small band of the edge are
	// skipped.
	for _, legs := range []bool{false, true} {
		name := "rigid"
		if legs {
			name = "legs"
		}
		t.Run(name, func(t *testing.T) { randomStands(t, legs) })
	}
}

func randomStands(t *testing.T, legs bool) {
	const samples = 150
	const edgeBand = 1e-4 // [m] of a ~0.5 m base: far above round-off
	rng := rand.New(rand.NewPCG(1, 1))
	stood, tipped, determinate, tips, held := 0, 0, 0, 0, 0
	for s := 0; s < samples; s++ {
		n := 4 + rng.IntN(3)
		a, b := 0.3+0.4*rng.Float64(), 0.3+0.4*rng.Float64()
		ang := make([]float64, n)
		for i := range ang {
			// Evenly spread with jitter: distinct, ordered angles.
			ang[i] = (float64(i) + 0.8*rng.Float64()) * 2 * math.Pi / float64(n)
		}
		sort.Float64s(ang)
		pts := make([]springnet.Vec, n)
		for i, th := range ang {
			pts[i] = springnet.Vec{X: a * math.Cos(th), Y: b * math.Sin(th)}
		}
		w := 500 + 2000*rng.Float64()
		cg := springnet.Vec{X: 0.2 * a * (2*rng.Float64() - 1), Y: 0.2 * b * (2*rng.Float64() - 1), Z: 0.3 + rng.Float64()}
		q := springnet.Vec{X: a * (2*rng.Float64() - 1), Y: b * (2*rng.Float64() - 1), Z: 1.5 * rng.Float64()}
		p := springnet.Load{FX: 0.6 * w * (2*rng.Float64() - 1), FY: 0.6 * w * (2*rng.Float64() - 1), FZ: -w * rng.Float64()}
		m := looseStand(pts, legs, w, cg, q, p)

		// Resultant and moment about the origin, by hand.
		fz := -w + p.FZ
		mx := cg.Y*(-w) + (q.Y*p.FZ - q.Z*p.FY)
		my := -cg.X*(-w) + (q.Z*p.FX - q.X*p.FZ)
		margin := polygonMargin(pts, my/(-fz), mx/fz)
		if math.Abs(margin) < edgeBand {
			continue
		}
		res, err := springnet.Static(m, nil)
		if margin < 0 {
			var te *springnet.TippingError
			require.True(t, errors.As(err, &te), "sample %d: centre of pressure %.3g m outside; got %v", s, -margin, err)
			tipped++
			continue
		}
		require.NoError(t, err, "sample %d: centre of pressure %.3g m inside", s, margin)
		cr := res.Case(0)
		checkContact(t, m, cr)
		for _, fr := range cr.Feet() {
			if fr.Held {
				held++
			}
		}
		eq := cr.Equilibrium()
		assert.InEpsilon(t, -fz, eq.Reactions.FZ, staticsTol, "sample %d", s)
		if checkDeterminate(t, m, cr) {
			determinate++
		}
		stood++
		// The tipping factor: the λ at which the centre of pressure of
		// weight + λ·load first reaches the edge of the base.
		cop := func(l float64) float64 {
			fz := -w + l*p.FZ
			mx := cg.Y*(-w) + l*(q.Y*p.FZ-q.Z*p.FY)
			my := -cg.X*(-w) + l*(q.Z*p.FX-q.X*p.FZ)
			return polygonMargin(pts, my/(-fz), mx/fz)
		}
		want, ok := firstRoot(cop, 1, maxTipFactor)
		tip := cr.Tipping()
		if !ok {
			assert.False(t, tip.Found && tip.Factor < maxTipFactor/2, "sample %d: tips at %g", s, tip.Factor)
			continue
		}
		if assert.True(t, tip.Found, "sample %d: want %g; %s", s, want, tip.Note) {
			assert.InEpsilon(t, want, tip.Factor, tipTol, "sample %d", s)
			tips++
		}
	}
	// Both outcomes and determinate contact sets must have been tried.
	assert.Greater(t, stood, samples/10)
	assert.Greater(t, tipped, samples/10)
	assert.Greater(t, determinate, samples/20)
	assert.Greater(t, tips, samples/10)
	t.Logf("%d stood (%d on three feet, %d tipping factors checked, %d feet held), %d tipped", stood, determinate, tips, held, tipped)
}

// BenchmarkContactBench times the static analysis of the bench whose
// contact search used to cycle (four cases, one with a held pad, with the
// tipping path).
func BenchmarkContactBench(b *testing.B) {
	data, err := os.ReadFile("testdata/bench-planing-120lbf.toml")
	require.NoError(b, err)
	f, err := modelfile.Read("bench", strings.NewReader(string(data)))
	require.NoError(b, err)
	for b.Loop() {
		if _, err := springnet.Static(f.Model, nil); err != nil {
			b.Fatal(err)
		}
	}
}
