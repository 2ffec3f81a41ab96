package modelfile_test

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/modelfile"
)

// exampleFiles returns the model files of the repository's examples
// folder and the demo.
func exampleFiles(t testing.TB) map[string][]byte {
	files := map[string][]byte{"lathe-stand.toml": modelfile.Demo()}
	names, err := filepath.Glob("../../examples/*.toml")
	require.NoError(t, err)
	for _, n := range names {
		b, err := os.ReadFile(n)
		require.NoError(t, err)
		files[filepath.Base(n)] = b
	}
	return files
}

// zeroLines clears the Line fields, which differ between a file and its
// rewrite: every int field named Line anywhere in c.
func zeroLines(c *modelfile.Contents) { zeroLineFields(reflect.ValueOf(c).Elem()) }

func zeroLineFields(v reflect.Value) {
	switch v.Kind() {
	case reflect.Struct:
		for i := 0; i < v.NumField(); i++ {
			if f := v.Field(i); v.Type().Field(i).Name == "Line" && f.Kind() == reflect.Int && f.CanSet() {
				f.SetInt(0)
			} else {
				zeroLineFields(f)
			}
		}
	case reflect.Slice, reflect.Array:
		for i := 0; i < v.Len(); i++ {
			zeroLineFields(v.Index(i))
		}
	case reflect.Pointer:
		if !v.IsNil() {
			zeroLineFields(v.Elem())
		}
	}
}

// sameModel compares two models through their public accessors.
func sameModel(t *testing.T, a, b *springnet.Model) {
	t.Helper()
	require.Equal(t, a.NumNodes(), b.NumNodes(), "nodes")
	for i := 0; i < a.NumNodes(); i++ {
		n := springnet.NodeID(i)
		assert.Equal(t, a.NodeName(n), b.NodeName(n))
		assert.Equal(t, a.NodeAt(n), b.NodeAt(n), "node %s", a.NodeName(n)) // exact: the writer writes round-trip digits
		assert.Equal(t, a.Fixed(n), b.Fixed(n))
	}
	require.Equal(t, a.NumElements(), b.NumElements(), "elements")
	for i := 0; i < a.NumElements(); i++ {
		e := springnet.ElementID(i)
		assert.Equal(t, a.ElementKind(e), b.ElementKind(e))
		assert.Equal(t, a.ElementName(e), b.ElementName(e))
		a1, a2 := a.ElementNodes(e)
		b1, b2 := b.ElementNodes(e)
		assert.Equal(t, [2]springnet.NodeID{a1, a2}, [2]springnet.NodeID{b1, b2})
		switch a.ElementKind(e) {
		case springnet.BarKind:
			x, _ := a.BarOf(e)
			y, _ := b.BarOf(e)
			assert.Equal(t, x, y)
		case springnet.BeamKind:
			x, _ := a.BeamOf(e)
			y, _ := b.BeamOf(e)
			assert.Equal(t, x, y)
		case springnet.SpringKind:
			x, _ := a.SpringOf(e)
			y, _ := b.SpringOf(e)
			assert.Equal(t, x, y)
		case springnet.FootKind:
			x, _ := a.FootOf(e)
			y, _ := b.FootOf(e)
			assert.Equal(t, x, y)
		}
		assert.Equal(t, a.LossFactor(e), b.LossFactor(e))
	}
	require.Equal(t, a.NumGroups(), b.NumGroups())
	for g := 0; g < a.NumGroups(); g++ {
		id := springnet.GroupID(g)
		assert.Equal(t, a.GroupName(id), b.GroupName(id))
		assert.Equal(t, a.GroupNodes(id), b.GroupNodes(id))
		assert.Equal(t, a.GroupPoint(id), b.GroupPoint(id))
	}
	require.Equal(t, a.NumMounts(), b.NumMounts())
	for p := 0; p < a.NumMounts(); p++ {
		id := springnet.MountID(p)
		assert.Equal(t, a.MountName(id), b.MountName(id))
		assert.Equal(t, a.MountAt(id), b.MountAt(id))
		assert.Equal(t, a.MountOn(id), b.MountOn(id))
	}
	require.Equal(t, a.NumCases(), b.NumCases())
	for c := 0; c < a.NumCases(); c++ {
		id := springnet.CaseID(c)
		assert.Equal(t, a.CaseName(id), b.CaseName(id))
		assert.Equal(t, a.IsCombination(id), b.IsCombination(id))
	}
}

func TestRoundTrip(t *testing.T) {
	gen, err := modelfile.Generate(modelfile.Layout{LegsX: 3, LegsY: 2, Width: 1.6, Depth: 0.7, Height: 0.85,
		Material: "steel S235", Section: "square-tube 60x4 mm", Stretchers: []float64{0.2, 0.5},
		StretcherSection: "rect-tube 50x30x3 mm",
		Bracing:          []modelfile.Bracing{{Face: modelfile.Back, Pattern: modelfile.Cross}, {Face: modelfile.Left}},
		Feet:             springnet.Stiffness6{Z: 4e7, X: 3e6, Y: 3e6}, CompressionOnly: true,
		MachineMass: 500, MachineHeight: 0.3, TopLoad: 2e3})
	require.NoError(t, err)
	var genText bytes.Buffer
	require.NoError(t, modelfile.Write(&genText, gen))
	files := exampleFiles(t)
	files["generated"] = genText.Bytes()
	for name, text := range files {
		t.Run(name, func(t *testing.T) {
			f1, err := modelfile.Read(name, bytes.NewReader(text))
			require.NoError(t, err)
			var out bytes.Buffer
			require.NoError(t, modelfile.Write(&out, f1))
			f2, err := modelfile.Read("rewritten", bytes.NewReader(out.Bytes()))
			require.NoError(t, err, "rewritten file:\n%s", out.String())
			c1, c2 := f1.Contents, f2.Contents
			zeroLines(&c1)
			zeroLines(&c2)
			assert.Equal(t, c1, c2)
			sameModel(t, f1.Model, f2.Model)
			// Writing again gives the same text: the writer is a fixed point.
			var out2 bytes.Buffer
			require.NoError(t, modelfile.Write(&out2, f2))
			assert.Equal(t, out.String(), out2.String())
		})
	}
}

func TestExamplesValidateAndSolve(t *testing.T) {
	for name, text := range exampleFiles(t) {
		t.Run(name, func(t *testing.T) {
			f, err := modelfile.Read(name, bytes.NewReader(text))
			require.NoError(t, err)
			require.NoError(t, f.Model.Validate())
			assert.NotEmpty(t, f.Title, "every example has a title")
			if f.Model.NumCases() > 0 {
				res, err := springnet.Static(f.Model, nil)
				require.NoError(t, err, "every example solves")
				assert.Equal(t, f.Model.NumCases(), res.NumCases())
			}
		})
	}
}

// TestDemoValues checks the demo's conversions against hand calculations.
func TestDemoValues(t *testing.T) {
	f, err := modelfile.Read("lathe-stand.toml", bytes.NewReader(modelfile.Demo()))
	require.NoError(t, err)
	const exact = 0 // unit conversions of decimal metric units are exact to the last bit here
	// A2 = [1200, 0, 0] mm = 1.2 m.
	a2, ok := f.Model.Node("A2")
	require.True(t, ok)
	assert.Equal(t, springnet.Vec{X: 1.2}, f.Model.NodeAt(a2))
	// stiffness unit N/um: z = 50 N/um = 5e7 N/m; horizontal = 5 N/um on x and y.
	foot, ok := f.Model.FootOf(f.ElementIDs["foot-1"])
	require.True(t, ok)
	assert.InDelta(t, 5e7, foot.K.Z, exact)
	assert.InDelta(t, 5e6, foot.K.X, exact)
	assert.InDelta(t, 5e6, foot.K.Y, exact)
	assert.True(t, foot.CompressionOnly)
	// -1.2 kN given as text = -1200 N.
	assert.InDelta(t, -1200, f.Cases[1].Loads[0].Load.FZ, exact)
	// Box inertia of the lathe, 320 kg, 1.25 × 0.42 × 0.42 m (uniform box:
	// Ixx = m(b² + c²)/12 = 320·(0.42² + 0.42²)/12 = 9.408 kg·m²).
	const rel = 1e-12 // products of exact-ish decimals
	assert.InEpsilon(t, 9.408, f.Masses[0].Inertia.X, rel)
	assert.InEpsilon(t, 320*(1.25*1.25+0.42*0.42)/12, f.Masses[0].Inertia.Y, rel)
	// rpm → rev/s: 1440 rpm = 24 Hz; change gears, 24 teeth at 60..2200 rpm
	// excite 24·1 Hz .. 24·36.67 Hz.
	sp := f.Dynamics.Speeds
	require.Len(t, sp, 3)
	assert.InEpsilon(t, 24.0, sp[1].Low, rel)
	ex := sp[2].Excitations()
	require.Len(t, ex, 1)
	assert.InEpsilon(t, 24.0, ex[0][0], rel)
	assert.InEpsilon(t, 24*2200/60.0, ex[0][1], rel)
	assert.Equal(t, [2]float64{2, 250}, f.Dynamics.Band)
	// The material override keeps the catalogue's E and takes the loss factor.
	beam, ok := f.Model.BeamOf(f.ElementIDs["leg-low-1"])
	require.True(t, ok)
	s235, err := materials.Lookup("steel S235")
	require.NoError(t, err)
	assert.Equal(t, s235.E, beam.Material.E)
	assert.Equal(t, materials.Range{Low: 0.001, Nominal: 0.002, High: 0.004}, beam.Material.Loss) // the demo file's loss-factor = [0.001, 0.002, 0.004]
	// The mass centre is given in global coordinates; the model holds it
	// as an offset from the top's centroid (600, 250, 800) mm.
	// Member checks: theoretical factors, the brace's given as 1.
	ms := f.MemberSettings()
	require.NotNil(t, ms)
	assert.Equal(t, springnet.TheoreticalK, ms.Basis)
	assert.Equal(t, map[springnet.ElementID]springnet.EffectiveLength{f.ElementIDs["back-brace"]: {Y: 1, Z: 1}}, ms.K)
	top := f.GroupIDs["top"]
	assert.Equal(t, springnet.Vec{X: 0.6, Y: 0.25, Z: 0.8}, f.Model.GroupPoint(top))
}

func TestErrors(t *testing.T) {
	const head = `[units]
length = "mm"
[nodes]
A1 = [0, 0, 0]
B1 = [0, 0, 800]
C3 = [500, 0, 800]
`
	// line numbers below count from the first line of head (A1 is line 4).
	tests := []struct {
		name string
		text string
		line int
		want string
	}{
		{"syntax", head + "[[beam]\n", 7, "syntax"},
		{"unknown node", head + `[[beam]]
name = "brace-3"
ends = ["B1", "C2"]
material = "steel S235"
section = "square-tube 50x3 mm"
`, 7, `beam "brace-3" names unknown node "C2"; did you mean "C3"?`},
		{"unknown key", head + `[[beam]]
name = "leg"
ends = ["A1", "B1"]
materal = "steel S235"
section = "square-tube 50x3 mm"
`, 10, `unknown key "materal"; did you mean "material"?`},
		{"unknown material", head + `[[beam]]
ends = ["A1", "B1"]
material = "steel S253"
section = "square-tube 50x3 mm"
`, 7, `unknown material "steel S253"`},
		{"bad section", head + `[[bar]]
name = "tie"
ends = ["A1", "B1"]
material = "steel S235"
section = "sqare-tube 50x3 mm"
`, 7, `unknown shape "sqare-tube"`},
		{"wrong unit kind", head + `[[foot]]
at = "A1"
stiffness = { z = "50 kN" }
`, 9, `"50 kN" is not a stiffness`},
		{"unknown unit", `[units]
length = "furlong"
`, 1, `unknown unit "furlong"`},
		{"not a number", head + "D1 = [0, 0, \"tall\"]\n", 7, `does not start with a number`},
		{"duplicate node name in a group", head + `[[rigid-group]]
name = "top"
nodes = ["B1", "C3", "B1"]
`, 7, `node "B1" listed twice`},
		{"zero length from Validate", head + `D1 = [0, 0, 800]
[[bar]]
name = "stub"
ends = ["B1", "D1"]
material = "steel S235"
section = "round 20 mm"
`, 8, `bar "stub": zero length`},
		{"unknown place", head + `[[case]]
name = "push"
[[case.load]]
at = "B2"
force = [100, 0, 0]
`, 9, `names unknown node, rigid group or mount "B2"; did you mean "B1"?`},
		{"unknown case in combination", head + `[[case]]
name = "weight"
gravity = true
[[combination]]
name = "all"
factors = { wieght = 1.35 }
`, 10, `names unknown case "wieght"; did you mean "weight"?`},
		{"bad direction", head + `[[support]]
at = "A1"
fix = ["x", "zz"]
`, 9, `unknown direction "zz"`},
		{"range order", `[materials.odd]
from = "steel S235"
E = ["210 GPa", "200 GPa", "190 GPa"]
`, 3, `low <= nominal <= high`},
		{"overflow after the unit", head + `[[mass]]
on = "C3"
mass = 5
offset = [0, 0, "1e308 km"]
`, 10, `is too large`},
		{"inertia tensor not symmetric", head + `[[mass]]
on = "B1"
mass = 10
inertia = [[1, -0.5, 0], [0.5, 1, 0], [0, 0, 1]]
`, 10, `not symmetric: row 1 column 2 is -0.5, row 2 column 1 is 0.5`},
		// Eigenvalues of [[1, -2, 0], [-2, 1, 0], [0, 0, 1]] are -1, 1, 3
		// (1 ± 2 and 1): a negative principal moment, which no body has.
		// springnet's Validate says so; the message goes to the mass's line.
		{"inertia tensor of no body", head + `[[mass]]
on = "B1"
mass = 10
inertia = [[1, -2, 0], [-2, 1, 0], [0, 0, 1]]
`, 7, `are not those of a body`},
		{"members need a section", head + `[[beam]]
ends = ["A1", "B1"]
material = "steel S235"
`, 7, `needs a "section"`},
		{"ambiguous name", head + `[[rigid-group]]
name = "B1"
nodes = ["C3"]
[[case]]
name = "push"
[[case.load]]
at = "B1"
force = [1, 0, 0]
`, 12, `more than one item`},
		{"after a multi-line text and array", `description = """
[nodes]
X = 1
"""
[nodes]
A = [
  0,
  0,
  0,
]
B = [0, 0, 1]
[[bar]]
ends = ["A", "Q"]
EA = 1
`, 12, `names unknown node "Q"`},
		{"invalid UTF-8", "title = \"a\xffb\"\n", 1, "UTF-8"},
		{"nesting", "x = " + strings.Repeat("[", 40) + strings.Repeat("]", 40) + "\n", 1, "nesting"},
		{"gravity word", head + `[[case]]
name = "w"
gravity = "yes"
`, 9, `gravity`},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := modelfile.Read("stand.toml", strings.NewReader(tc.text))
			require.Error(t, err)
			errs := modelfile.Errors(err)
			require.NotEmpty(t, errs, "errors are *modelfile.Error: %v", err)
			found := false
			for _, e := range errs {
				if strings.Contains(e.Msg, tc.want) {
					found = true
					assert.Equal(t, tc.line, e.Line, "line of %q", e.Msg)
					assert.Equal(t, "stand.toml", e.File)
					assert.True(t, strings.HasPrefix(e.Error(), "stand.toml:"), e.Error())
				}
			}
			assert.True(t, found, "want %q in\n%v", tc.want, err)
		})
	}
}

// TestBuildMapsValidateErrors: Build maps the model's Validate messages
// back to the lines of the Contents items, masses by their order.
func TestBuildMapsValidateErrors(t *testing.T) {
	c := &modelfile.Contents{
		Nodes:    []modelfile.Node{{Name: "A", Line: 3}, {Name: "B", At: springnet.Vec{Z: 1}, Line: 4}},
		Members:  []modelfile.Member{{Kind: springnet.BarKind, Name: "tie", A: "A", B: "B", Raw: springnet.RawBeam{EA: 1e6}, Line: 5}},
		Supports: []modelfile.Support{{At: "A", Fix: springnet.AllDOF, Line: 6}},
		Masses:   []modelfile.Mass{{On: "B", Kg: 1, Line: 7}, {On: "B", Kg: -2, Line: 9}},
	}
	_, err := modelfile.Build("built.toml", c)
	require.Error(t, err)
	errs := modelfile.Errors(err)
	require.Len(t, errs, 1, "%v", err)
	assert.Equal(t, 9, errs[0].Line)
	assert.Contains(t, errs[0].Msg, "not a finite non-negative mass")
}

// TestErrorsAllReported checks that Read reports every problem, not just
// the first.
func TestErrorsAllReported(t *testing.T) {
	text := `[nodes]
A = [0, 0, 0]
B = [0, 0, 1]
[[bar]]
ends = ["A", "X"]
material = "steel S235"
section = "round 20 mm"
[[bar]]
ends = ["A", "Y"]
material = "steel S235"
section = "round 20 mm"
[[foot]]
at = "Z"
stiffness = { z = 1e6 }
`
	_, err := modelfile.Read("m.toml", strings.NewReader(text))
	require.Error(t, err)
	errs := modelfile.Errors(err)
	require.Len(t, errs, 3, "%v", err)
	assert.Equal(t, []int{4, 8, 12}, []int{errs[0].Line, errs[1].Line, errs[2].Line})
}

func TestLimits(t *testing.T) {
	t.Run("file size", func(t *testing.T) {
		big := bytes.Repeat([]byte("# padding padding padding padding\n"), modelfile.MaxFileSize/34+10)
		_, err := modelfile.Read("big.toml", bytes.NewReader(big))
		require.Error(t, err)
		assert.Contains(t, err.Error(), "larger than 16 MiB")
	})
	t.Run("model too large", func(t *testing.T) {
		// 80 000 unconnected nodes: n = 480 000 equations, r = 3 nonzeros per
		// column, nnz(L) ≈ 3·n^1.5 ≈ 1e9, about 12 GB > 8 GiB.
		var b strings.Builder
		b.WriteString("[nodes]\n")
		for i := range 80000 {
			fmt.Fprintf(&b, "N%d = [%d, 0, 0]\n", i, i)
		}
		_, err := modelfile.Read("huge.toml", strings.NewReader(b.String()))
		require.Error(t, err)
		assert.Contains(t, err.Error(), "too large to analyse")
		assert.Contains(t, err.Error(), "480000 equations")
	})
	t.Run("dotted key depth", func(t *testing.T) {
		_, err := modelfile.Read("deep.toml", strings.NewReader(strings.Repeat("a.", 40)+"b = 1\n"))
		require.Error(t, err)
		assert.Contains(t, err.Error(), "nesting")
	})
	t.Run("generated layout too big", func(t *testing.T) {
		// 400 × 400 legs, 10 levels: 1.6e6 nodes, ~1e7 equations. The
		// estimate r·n^1.5 with n ≈ 1e7 is far beyond 8 GiB.
		_, err := modelfile.Generate(modelfile.Layout{LegsX: 400, LegsY: 400, Width: 100, Depth: 100, Height: 1,
			Material: "steel S235", Section: "square-tube 50x3 mm", Stretchers: []float64{.1, .2, .3, .4, .5, .6, .7, .8}})
		require.Error(t, err)
		assert.Contains(t, err.Error(), "too large to analyse")
	})
	t.Run("estimate", func(t *testing.T) {
		// Four nodes in a chain: n = 24 equations; the dense bound n(n+1)/2
		// = 300 caps r·n^1.5 here.
		c := &modelfile.Contents{Nodes: []modelfile.Node{{Name: "a"}, {Name: "b"}, {Name: "c"}, {Name: "d"}},
			Members: []modelfile.Member{{A: "a", B: "b"}, {A: "b", B: "c"}, {A: "c", B: "d"}}}
		s := modelfile.Estimate(c)
		assert.Equal(t, 24, s.Equations)
		assert.Equal(t, 300.0, s.NonzerosL) // n(n+1)/2 with n = 24
		// nnz(K) = Σ 36·(1 + degree)/2 = 18·(2 + 3 + 3 + 2) = 180.
		assert.Equal(t, 180.0, s.NonzerosK)
	})
}

func TestBoxInertia(t *testing.T) {
	// A uniform cube of side a about an axis through its centre: I = m·a²/6
	// (Meriam & Kraige, Engineering Mechanics: Dynamics, mass moments of inertia table).
	const m, a = 12.0, 0.5
	got := modelfile.BoxInertia(m, springnet.Vec{X: a, Y: a, Z: a})
	const rel = 1e-15 // one rounding
	assert.InEpsilon(t, m*a*a/6, got.X, rel)
	assert.InEpsilon(t, m*a*a/6, got.Y, rel)
	assert.InEpsilon(t, m*a*a/6, got.Z, rel)
	// A thin rod along X (Ly = Lz = 0): Iyy = Izz = m·L²/12, Ixx = 0.
	rod := modelfile.BoxInertia(m, springnet.Vec{X: 2})
	assert.Equal(t, springnet.Vec{X: 0, Y: m * 4 / 12, Z: m * 4 / 12}, rod)
}

func TestWriteRefusesNonFinite(t *testing.T) {
	c := &modelfile.Contents{Nodes: []modelfile.Node{{Name: "A", At: springnet.Vec{X: math.NaN()}}}}
	var buf bytes.Buffer
	err := modelfile.WriteContents(&buf, c)
	require.Error(t, err)
	assert.Contains(t, err.Error(), "NaN or infinite")
	assert.Zero(t, buf.Len(), "nothing is written")
}

func TestUnitsPerValue(t *testing.T) {
	text := `[nodes]
A = ["0 mm", "0 in", 0]
B = ["25.4 mm", "1 in", "0.001 km"]
[[spring]]
name = "pad"
ends = ["A", "B"]
axial = "2.5 N/um"
[[foot]]
name = "shoe"
at = "B"
stiffness = { rz = "3 kN*m/rad", x = "10 lbf/in" }
[[support]]
at = "A"
fix = "all"
[[support]]
at = "B"
fix = ["y", "z", "rx", "ry"]
`
	f, err := modelfile.Read("u.toml", strings.NewReader(text))
	require.NoError(t, err)
	b, _ := f.Model.Node("B")
	at := f.Model.NodeAt(b)
	const tol = 1e-15                    // a few ulps of 0.0254 m
	assert.InDelta(t, 0.0254, at.X, tol) // 1 in = 25.4 mm exactly (international inch, 1959)
	assert.InDelta(t, 0.0254, at.Y, tol)
	assert.InDelta(t, 1.0, at.Z, tol)
	s, ok := f.Model.SpringOf(f.ElementIDs["pad"])
	require.True(t, ok)
	assert.Equal(t, 2.5e6, s.Axial) // "2.5 N/um" above = 2.5e6 N/m by hand
	shoe, ok := f.Model.FootOf(f.ElementIDs["shoe"])
	require.True(t, ok)
	assert.Equal(t, 3e3, shoe.K.RZ) // "3 kN*m/rad" above = 3e3 N·m/rad by hand
	// 1 lbf/in = 4.4482216152605 N / 0.0254 m = 175.126835... N/m (NIST SP 811 factors).
	assert.InEpsilon(t, 10*4.4482216152605/0.0254, shoe.K.X, 1e-14)
	assert.Equal(t, springnet.UY|springnet.UZ|springnet.RX|springnet.RY, f.Model.Fixed(b))
}

// BenchmarkRead reads a generated 20 × 20-leg frame with three stretcher
// levels (2000 nodes, about 4600 members).
func BenchmarkRead(b *testing.B) {
	f, err := modelfile.Generate(modelfile.Layout{LegsX: 20, LegsY: 20, Width: 10, Depth: 10, Height: 1,
		Material: "steel S235", Section: "square-tube 50x3 mm", Stretchers: []float64{0.2, 0.4, 0.6},
		Feet: springnet.Stiffness6{X: 1e6, Y: 1e6, Z: 1e7}})
	require.NoError(b, err)
	var buf bytes.Buffer
	require.NoError(b, modelfile.Write(&buf, f))
	text := buf.Bytes()
	b.SetBytes(int64(len(text)))
	b.ReportAllocs()
	for b.Loop() {
		if _, err := modelfile.Read("big.toml", bytes.NewReader(text)); err != nil {
			b.Fatal(err)
		}
	}
}
