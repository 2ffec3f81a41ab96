package springnet_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
)

// rigidTol is the relative tolerance against rigid-body statics: the top
// is rigid and the four legs and feet are identical, so the reactions of
// a stand with every foot down are exact up to the round-off of a
// well-conditioned solve (residuals 1e-14 to 1e-12).
const rigidTol = 1e-8

// legStand is a stand of footprint b × d: a rigid top at height hl on four
// massless vertical beam legs (raw stiffness), each on a loose
// (compression-only) foot, feet A (+x, −y), B (+x, +y), C (−x, +y),
// D (−x, −y). Its weight w [N] is a Mass above the middle; each case of
// pushes gets a push along +X at height h and gravity.
type legStand struct {
	m     *springnet.Model
	feet  [4]springnet.ElementID
	legs  [4]springnet.ElementID
	cases []springnet.CaseID
}

func newLegStand(b, d, hl, h, w float64, pushes map[string]float64, order []string) legStand {
	var s legStand
	var m springnet.Model
	pts := [4][2]float64{{b / 2, -d / 2}, {b / 2, d / 2}, {-b / 2, d / 2}, {-b / 2, -d / 2}}
	var tops []springnet.NodeID
	leg := springnet.Beam{Up: springnet.Vec{X: 1}, Raw: springnet.RawBeam{EA: 1e8, EIy: 1e5, EIz: 1e5, GJ: 1e5}}
	for i, p := range pts {
		name := string(rune('A' + i))
		bot := m.AddNode(name, springnet.Vec{X: p[0], Y: p[1]})
		top := m.AddNode(name+"'", springnet.Vec{X: p[0], Y: p[1], Z: hl})
		tops = append(tops, top)
		leg.Name = "leg " + name
		s.legs[i] = m.AddBeam(bot, top, leg)
		s.feet[i] = m.AddFoot(bot, springnet.Foot{Name: "foot " + name,
			K: springnet.Stiffness6{X: 1e6, Y: 1e6, Z: 1e7}, CompressionOnly: true})
	}
	g := m.AddRigidGroup("top", tops...)
	m.AddMass(g, springnet.Mass{Kg: w / springnet.StandardGravity})
	at := m.AddMount("push", springnet.Vec{Z: h}, g)
	for _, name := range order {
		c := m.AddLoadCase(name)
		m.SetGravity(c, springnet.Gravity(1))
		m.AddCaseLoad(c, at, springnet.Load{FX: pushes[name]})
		s.cases = append(s.cases, c)
	}
	s.m = &m
	return s
}

func TestStaticTippedCase(t *testing.T) {
	// Rigid-body statics by hand, moments about the floor (the sideways
	// foot forces act at floor level and the feet carry no moment).
	// Footprint b × d, weight W above the middle, push P along +X at
	// height H. With every foot down the vertical reactions are linear in
	// x: leeward feet A, B carry W/4 + P·H/(2b), windward C, D
	// W/4 − P·H/(2b). The windward feet unload, and the stand tips about
	// AB, when P·H = W·b/2: P_tip = W·b/(2H) = 133.3 N, a factor
	// λ = W·b/(2·H·P) on the push.
	const b, d, hl, h, w = 0.4, 0.6, 0.8, 1.5, 1000.0
	pTip := w * b / (2 * h)
	pushes := map[string]float64{"light": 0.75 * pTip, "heavy": 1.5 * pTip, "gale": 2.25 * pTip}
	tests := []struct {
		name   string
		order  []string
		tipped []string // in case order
	}{
		{"tipped case first", []string{"heavy", "light"}, []string{"heavy"}},
		{"tipped case last", []string{"light", "heavy"}, []string{"heavy"}},
		{"two tipped cases", []string{"gale", "light", "heavy"}, []string{"gale", "heavy"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			s := newLegStand(b, d, hl, h, w, pushes, tt.order)
			res, err := springnet.Static(s.m, nil)
			require.NotNil(t, res, "a tipped case must not cost the others: %v", err)
			var te *springnet.TippingError
			require.True(t, errors.As(err, &te), "got %v", err)
			assert.Equal(t, tt.tipped[0], te.Case, "errors.As finds the first tipped case")
			for name := range pushes {
				want := strings.Contains(strings.Join(tt.tipped, " "), name)
				inOrder := strings.Contains(strings.Join(tt.order, " "), name)
				assert.Equal(t, want && inOrder, strings.Contains(err.Error(), `"`+name+`"`),
					"the message names every tipped case and no other: %s", name)
			}
			require.Equal(t, len(tt.order), res.NumCases())
			for i, c := range s.cases {
				name := tt.order[i]
				p := pushes[name]
				cr := res.Case(c)
				require.Equal(t, name, cr.Name())
				if p > pTip {
					checkTipped(t, s, cr, w*b/(2*h*p))
					continue
				}
				require.False(t, cr.Tipped(), name)
				// Leeward A, B; windward C, D (see above). The sideways
				// reactions share the push equally (four identical legs
				// and feet under a rigid top: symmetry).
				want := [4]float64{w/4 + p*h/(2*b), w/4 + p*h/(2*b), w/4 - p*h/(2*b), w/4 - p*h/(2*b)}
				for j, f := range s.feet {
					fr, ok := cr.Foot(f)
					require.True(t, ok)
					assert.False(t, fr.Lifted, fr.Name)
					assert.InEpsilon(t, want[j], fr.Reaction.FZ, rigidTol, fr.Name)
					assert.InEpsilon(t, -p/4, fr.Reaction.FX, rigidTol, fr.Name)
					// A massless vertical leg loaded at its ends carries
					// its foot's vertical reaction in compression.
					mr, err := cr.MemberForces(s.legs[j])
					require.NoError(t, err)
					assert.InEpsilon(t, -want[j], mr.A.N, rigidTol, fr.Name)
				}
				assert.Empty(t, cr.Lifted())
				eq := cr.Equilibrium()
				assert.Less(t, eq.ForceError, rigidTol)
				assert.Less(t, eq.MomentError, rigidTol)
				tip := cr.Tipping()
				require.True(t, tip.Found, tip.Note)
				assert.InEpsilon(t, w*b/(2*h*p), tip.Factor, rigidTol)
			}
		})
	}
}

// checkTipped checks the result of a case under which the stand tips at
// the factor want on its push (hand statics in TestStaticTippedCase).
func checkTipped(t *testing.T, s legStand, cr *springnet.CaseResult, want float64) {
	t.Helper()
	require.True(t, cr.Tipped(), cr.Name())
	// The windward feet unload first (rigid-body statics above), so they
	// are the lifted ones when the last stable set is lost.
	assert.ElementsMatch(t, []springnet.ElementID{s.feet[2], s.feet[3]}, cr.Lifted())
	tip := cr.Tipping()
	require.True(t, tip.Found, tip.Note)
	assert.InEpsilon(t, want, tip.Factor, rigidTol, "tips at W·b/(2·H·P)")
	assert.Contains(t, tip.Note, "tips")
	assert.Contains(t, tip.Note, "foot C")

	// No solution: zero values, never NaN, and errors where a result is
	// computed from the solution.
	for n := 0; n < s.m.NumNodes(); n++ {
		assert.Equal(t, springnet.Displacement{}, cr.Displacement(springnet.NodeID(n)))
	}
	for _, d := range cr.DisplacementsTo(nil) {
		assert.Equal(t, springnet.Displacement{}, d)
	}
	assert.Len(t, cr.DisplacementsTo(nil), s.m.NumNodes())
	assert.Equal(t, springnet.Displacement{}, cr.At(springnet.MountID(0)))
	assert.Equal(t, springnet.ElementForce{Kind: springnet.BeamKind}, cr.Force(s.legs[0]))
	for i, f := range cr.ForcesTo(nil) {
		assert.Equal(t, s.m.ElementKind(springnet.ElementID(i)), f.Kind)
		assert.Zero(t, f.Axial)
	}
	_, ok := cr.Foot(s.feet[0])
	assert.False(t, ok)
	assert.Nil(t, cr.Feet())
	assert.Nil(t, cr.Reactions())
	assert.Equal(t, springnet.Equilibrium{}, cr.Equilibrium())
	for _, e := range springnet.StrainEnergies(cr, nil) {
		assert.Zero(t, e)
	}
	assert.Nil(t, springnet.MaterialEnergies(cr))
	_, err := cr.MemberCheck(s.legs[0], nil)
	assert.ErrorContains(t, err, "tips")
	mr, err := cr.MembersTo(nil, nil)
	assert.ErrorContains(t, err, "tips")
	assert.Empty(t, mr)
}

func TestTippedCaseAnalyses(t *testing.T) {
	// The stand of TestStaticTippedCase: "heavy" tips, "light" does not.
	const b, d, hl, h, w = 0.4, 0.6, 0.8, 1.5, 1000.0
	pTip := w * b / (2 * h)
	pushes := map[string]float64{"light": 0.75 * pTip, "heavy": 1.5 * pTip}
	s := newLegStand(b, d, hl, h, w, pushes, []string{"light", "heavy"})
	light, heavy := s.cases[0], s.cases[1]

	t.Run("buckling", func(t *testing.T) {
		br, err := springnet.Buckling(s.m, heavy, nil)
		var te *springnet.TippingError
		assert.True(t, errors.As(err, &te), "got %v", err)
		assert.Nil(t, br)
		br, err = springnet.Buckling(s.m, light, &springnet.BucklingSettings{Modes: 1})
		require.NoError(t, err, "the other case buckles as usual")
		assert.Greater(t, br.Factor(0), 0.0)
	})

	t.Run("compliance sensitivity", func(t *testing.T) {
		_, err := springnet.ComplianceSensitivity(s.m, heavy, materials.Nominal)
		var te *springnet.TippingError
		assert.True(t, errors.As(err, &te), "got %v", err)
		_, err = springnet.ComplianceSensitivity(s.m, light, materials.Nominal)
		assert.NoError(t, err, "another case's tipping is no error here")
	})

	t.Run("sweep", func(t *testing.T) {
		res, err := springnet.Sweep(s.m, &springnet.SweepSettings{Buckling: true})
		require.NotNil(t, res, "a tipped case must not cost the sweep: %v", err)
		var te *springnet.TippingError
		require.True(t, errors.As(err, &te), "got %v", err)
		assert.Equal(t, "heavy", te.Case)
		for _, l := range materials.Levels {
			assert.Contains(t, err.Error(), "at "+l.String()+" material values", "every level is named")
		}
		assert.NotContains(t, err.Error(), `"light"`)
		// Rigid-body statics (TestStaticTippedCase): the lowest factor is
		// the tipped case's, W·b/(2·H·P_heavy) = 2/3, at every level (the
		// raw stiffnesses do not vary, and statics do not depend on them).
		require.True(t, res.HasTipping)
		for i := range res.Tipping.ByLevel {
			assert.InEpsilon(t, w*b/(2*h*pushes["heavy"]), res.Tipping.ByLevel[i], rigidTol)
		}
		require.True(t, res.HasBuckling, "the case that stands still buckles")
		// Invariant: the governing displacement is the standing case's,
		// the same as Static gives on its own.
		sr, _ := springnet.Static(s.m, nil)
		require.NotNil(t, sr)
		maxU := 0.0
		for _, u := range sr.Case(light).DisplacementsTo(nil) {
			maxU = math.Max(maxU, u.Translation().Norm())
		}
		require.Greater(t, maxU, 0.0)
		assert.InEpsilon(t, maxU, res.MaxDisplacement.At(materials.Nominal), rigidTol)
		for li := range materials.Levels {
			assert.True(t, res.Static[li].Case(heavy).Tipped())
			assert.False(t, res.Static[li].Case(light).Tipped())
		}
	})
}

func TestTippedUnderGravityAlone(t *testing.T) {
	// A rigid stand whose centre of gravity is outside its feet (x = 0.5 m
	// beyond feet at x = ±0.2 m) tips under its weight alone; pressed down
	// at the middle without gravity it stands, each of the four feet
	// carrying a quarter (symmetry).
	const b, d, w = 0.4, 0.6, 1000.0
	var m springnet.Model
	var nodes []springnet.NodeID
	var feet []springnet.ElementID
	for i, p := range [4][2]float64{{b / 2, -d / 2}, {b / 2, d / 2}, {-b / 2, d / 2}, {-b / 2, -d / 2}} {
		n := m.AddNode(string(rune('A'+i)), springnet.Vec{X: p[0], Y: p[1]})
		nodes = append(nodes, n)
		feet = append(feet, m.AddFoot(n, springnet.Foot{Name: "foot " + string(rune('A'+i)),
			K: springnet.Stiffness6{X: 1e6, Y: 1e6, Z: 1e7}, CompressionOnly: true}))
	}
	g := m.AddRigidGroup("stand", nodes...)
	m.AddMass(g, springnet.Mass{Kg: w / springnet.StandardGravity, Offset: springnet.Vec{X: 0.5, Z: 0.7}})
	mid := m.AddMount("middle", springnet.Vec{Z: 0.7}, g)
	weight := m.AddLoadCase("weight")
	m.SetGravity(weight, springnet.Gravity(1))
	press := m.AddLoadCase("press")
	m.AddCaseLoad(press, mid, springnet.Load{FZ: -w})

	res, err := springnet.Static(&m, nil)
	require.NotNil(t, res, "got %v", err)
	var te *springnet.TippingError
	require.True(t, errors.As(err, &te), "got %v", err)
	assert.Equal(t, "weight", te.Case)

	cr := res.Case(weight)
	require.True(t, cr.Tipped())
	tip := cr.Tipping()
	assert.False(t, tip.Found, "no factor on the other loads: there are none")
	assert.Contains(t, tip.Note, "gravity alone")
	assert.NotEmpty(t, cr.Lifted())

	cr = res.Case(press)
	require.False(t, cr.Tipped())
	for _, f := range feet {
		fr, ok := cr.Foot(f)
		require.True(t, ok)
		assert.InEpsilon(t, w/4, fr.Reaction.FZ, rigidTol, fr.Name)
	}
}
