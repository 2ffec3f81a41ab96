package modelfile_test

import (
	"bytes"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/modelfile"
)

// solveTol is the relative tolerance of a sparse solve against a closed
// form: the solver's residual is checked at 1e-8 (springnet.MaxResidual),
// a healthy frame gives ~1e-12.
const solveTol = 1e-9

func props(t *testing.T, spec string) sections.Props {
	t.Helper()
	s, err := sections.Parse(spec)
	require.NoError(t, err)
	p, err := s.Properties()
	require.NoError(t, err)
	return p
}

func TestGenerateCounts(t *testing.T) {
	// 3 × 2 legs (nx = 3 along X, ny = 2 along Y), s = 2 stretcher levels,
	// a beam-grid top, the back face cross-braced and the left face
	// single-braced, feet under the legs. Counted by hand:
	//   nodes       nx·ny·(s+2)                 = 3·2·4       = 24
	//   legs        nx·ny·(s+1)                 = 3·2·3       = 18
	//   stretchers  s·(ny·(nx−1) + nx·(ny−1))   = 2·(2·2+3·1) = 14
	//   rails       ny·(nx−1) + nx·(ny−1)       = 4 + 3       =  7
	//   back braces (s+1) panels · 2 bays · 2   = 3·2·2       = 12
	//   left braces (s+1) panels · 1 bay  · 1   = 3·1·1       =  3
	//   feet        nx·ny                                     =  6
	//   elements    18 + 14 + 7 + 12 + 3 + 6                  = 60
	f, err := modelfile.Generate(modelfile.Layout{LegsX: 3, LegsY: 2, Width: 1.5, Depth: 0.6, Height: 0.9,
		Material: "steel S235", Section: "square-tube 50x3 mm", Stretchers: []float64{0.15, 0.5},
		Top: modelfile.BeamTop, TopSection: "rect-tube 60x40x3 mm",
		Bracing: []modelfile.Bracing{{Face: modelfile.Back, Pattern: modelfile.Cross}, {Face: modelfile.Left}},
		Feet:    springnet.Stiffness6{X: 1e6, Y: 1e6, Z: 1e7}})
	require.NoError(t, err)
	count := map[string]int{}
	for _, m := range f.Members {
		count[m.Name[:len(m.Name)-len(suffixNum(m.Name))]]++
	}
	assert.Equal(t, 24, f.Model.NumNodes())
	assert.Equal(t, 18, count["leg-"])
	assert.Equal(t, 14, count["stretcher-"])
	assert.Equal(t, 7, count["rail-"])
	assert.Equal(t, 15, count["brace-"])
	assert.Len(t, f.Feet, 6)
	assert.Equal(t, 60, f.Model.NumElements())
	// Node names: column letter, row number, level.
	_, ok := f.Model.Node("C2-top")
	assert.True(t, ok)
	_, ok = f.Model.Node("A1-s2")
	assert.True(t, ok)
	// The file it writes reads back (the round trip is TestRoundTrip).
	var buf bytes.Buffer
	require.NoError(t, modelfile.Write(&buf, f))
	_, err = modelfile.Read("gen.toml", &buf)
	require.NoError(t, err)
}

func suffixNum(s string) string {
	i := len(s)
	for i > 0 && s[i-1] >= '0' && s[i-1] <= '9' {
		i--
	}
	return s[i:]
}

// TestGenerateMountStiffness: four legs under a rigid top, loaded at the
// centre, act as springs in parallel. With fixed bases the vertical
// stiffness at the centre is 4·EA/L (legs in parallel; the symmetric load
// neither bends the legs nor tilts the top). With feet of vertical
// stiffness kf under each leg, each leg and its foot are in series:
// k = 4 / (L/EA + 1/kf).
func TestGenerateMountStiffness(t *testing.T) {
	const spec, L = "square-tube 50x3 mm", 0.8
	p := props(t, spec)
	steel, err := materials.Lookup("steel S235")
	require.NoError(t, err)
	ea := steel.E.Nominal * p.A
	const kf = 3e7 // N/m, a stiff levelling foot
	tests := []struct {
		name string
		feet springnet.Stiffness6
		want float64
	}{
		{"fixed bases", springnet.Stiffness6{}, 4 * ea / L},
		{"feet in series", springnet.Stiffness6{X: 1e7, Y: 1e7, Z: kf, RX: 1e5, RY: 1e5, RZ: 1e5}, 4 / (L/ea + 1/kf)},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			f, err := modelfile.Generate(modelfile.Layout{LegsX: 2, LegsY: 2, Width: 1, Depth: 0.6, Height: L,
				Material: "steel S235", Section: spec, Feet: tc.feet, TopLoad: 5e3})
			require.NoError(t, err)
			centre := f.MountIDs["centre"]
			ps, err := springnet.MountStiffness(f.Model, centre, nil)
			require.NoError(t, err)
			k := ps.Stiffness3()
			assert.InEpsilon(t, tc.want, k[2][2], solveTol)
			// The same from the static case: δ = P/k under the 5 kN top load.
			res, err := springnet.Static(f.Model, nil)
			require.NoError(t, err)
			c := f.CaseIDs["top load"]
			assert.InEpsilon(t, 5e3/tc.want, -res.Case(c).At(centre).UZ, solveTol)
		})
	}
}

// TestGeneratePiers: four piers fixed at the floor under a rigid slab.
// Sliding the slab in X without rotation bends each pier fixed–guided;
// with shear deformation (Timoshenko beam) its stiffness is
//
//	k = 1 / (L³/(12·E·I) + L/(G·As))
//
// (fixed–guided beam with shear: Timoshenko & Gere, Mechanics of
// Materials; Roark's Formulas for Stress and Strain, table of beam
// deflections with the shear term). The slab's 6×6 stiffness K[0][0] is
// the force per unit slide with the slab's other motions held, so it is
// 4·k.
func TestGeneratePiers(t *testing.T) {
	const spec, L = "rect 300x300 mm", 0.7
	mat, err := materials.Lookup("masonry concrete grouted")
	require.NoError(t, err)
	p := props(t, spec)
	e, g := mat.E.Nominal, mat.ShearModulus(materials.Nominal)
	f, err := modelfile.Generate(modelfile.Layout{Kind: modelfile.Piers, LegsX: 2, LegsY: 2, Width: 1.2, Depth: 0.8,
		Height: L, Material: "masonry concrete grouted", Section: spec, MachineMass: 800, MachineHeight: 0.4})
	require.NoError(t, err)
	for _, m := range f.Members {
		assert.True(t, m.Timoshenko, "piers are Timoshenko beams")
	}
	ps, err := springnet.MountStiffness(f.Model, f.GroupIDs["slab"], nil)
	require.NoError(t, err)
	k6, ok := ps.Stiffness6()
	require.True(t, ok)
	kPier := 1 / (L*L*L/(12*e*p.Iz) + L/(g*p.AsY))
	assert.InEpsilon(t, 4*kPier, k6[0][0], solveTol)
	// Vertical: 4·EA/L, the same as the frame.
	assert.InEpsilon(t, 4*e*p.A/L, k6[2][2], solveTol)
	// The shear term matters for a squat pier: it softens it by more than 5 %.
	assert.Less(t, kPier, 0.95/(L*L*L/(12*e*p.Iz)))
}

func TestGenerateErrors(t *testing.T) {
	base := modelfile.Layout{LegsX: 2, LegsY: 2, Width: 1, Depth: 1, Height: 1, Material: "steel S235", Section: "square-tube 50x3 mm"}
	tests := []struct {
		name string
		mod  func(l *modelfile.Layout)
		want string
	}{
		{"one leg", func(l *modelfile.Layout) { l.LegsX = 1 }, "at least 2 × 2 legs"},
		{"negative height", func(l *modelfile.Layout) { l.Height = -1 }, "height"},
		{"stretcher above top", func(l *modelfile.Layout) { l.Stretchers = []float64{1.2} }, "stretcher heights"},
		{"piers with bracing", func(l *modelfile.Layout) {
			l.Kind = modelfile.Piers
			l.Bracing = []modelfile.Bracing{{Face: modelfile.Front}}
		}, "piers take no"},
		{"unknown material", func(l *modelfile.Layout) { l.Material = "unobtainium" }, `unknown material "unobtainium"`},
		{"bad section", func(l *modelfile.Layout) { l.Section = "square-tube 50x30 mm" }, "square-tube"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			l := base
			tc.mod(&l)
			_, err := modelfile.Generate(l)
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
		})
	}
}
