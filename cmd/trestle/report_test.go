package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet/modelfile"
)

// decodeStrict decodes JSON into v, failing on fields v does not have.
func decodeStrict(t *testing.T, data string, v any) {
	t.Helper()
	dec := json.NewDecoder(strings.NewReader(data))
	dec.DisallowUnknownFields()
	require.NoError(t, dec.Decode(v))
}

// TestFourLegsHandCheck checks the analysis of testdata/four-legs.toml
// against hand calculations. Four identical legs, L = 1 m, EA = 2e8 N,
// EIy = 1e4 N·m² (sway along Y), EIz = 2e4 N·m² (sway along X), fixed at
// the floor, under a rigid top held level.
// These runs are the ones the golden files four-legs.*.golden pin.
func TestFourLegsHandCheck(t *testing.T) {
	const (
		L, EA, EI = 1.0, 2e8, 1e4 // EI: EIy, the weaker
		EIz       = 2e4
		press     = 4000.0 // N down at the centre
		push      = 480.0  // N along X at the centre
		// tol: direct sparse solves of an 8-node model agree with closed
		// forms to round-off; 1e-9 leaves room for the residual check.
		tol = 1e-9
	)
	r := trestle(t, "", "analyse", "--json", "testdata/four-legs.toml")
	require.NoError(t, r.err)
	var rep AnalysisReport
	decodeStrict(t, r.stdout, &rep)

	require.Len(t, rep.Mounts, 1)
	mt := rep.Mounts[0]
	// Axial springs in parallel: k = 4·EA/L (Gere & Goodno, Mechanics of
	// Materials, §2.2, δ = PL/EA).
	assert.InEpsilon(t, 4*EA/L, mt.ZNPerM, tol)
	// Fixed–guided legs in parallel: k = 4·12·EI/L³ (Roark's Formulas for
	// Stress and Strain, Table 8.1, case 1e: fixed end, guided end).
	kx := 4 * 12 * EIz / (L * L * L)
	ky := 4 * 12 * EI / (L * L * L)
	assert.InEpsilon(t, kx, mt.XNPerM, tol)
	assert.InEpsilon(t, ky, mt.YNPerM, tol)
	assert.InEpsilon(t, ky, rep.Governing.SoftestStiffnessNPerM, tol)
	assert.Equal(t, [3]float64{0, 1, 0}, rep.Governing.SoftestDirection)

	require.Len(t, rep.Cases, 2)
	pc, sc := rep.Cases[0], rep.Cases[1]
	require.Equal(t, "press", pc.Name)
	require.Equal(t, "push", sc.Name)
	// Press: the top sinks δ = P/(4EA/L); each support carries P/4 by
	// symmetry; each leg is in compression P/4.
	assert.InEpsilon(t, press/(4*EA/L), pc.MaxDisplacementM, tol)
	require.Len(t, pc.Supports, 4)
	for _, s := range pc.Supports {
		assert.InEpsilon(t, press/4, s.FZN, tol, s.Node)
	}
	for _, m := range pc.Members {
		assert.InEpsilon(t, -press/4, m.AxialN, tol, m.Name)
	}
	// Push: δ = H/kx; each leg takes H/4 in shear and end moments
	// M = (H/4)·L/2 (fixed–guided: equal and opposite end moments).
	assert.InEpsilon(t, push/kx, sc.MaxDisplacementM, tol)
	for _, s := range sc.Supports {
		assert.InEpsilon(t, -push/4, s.FXN, tol, s.Node)
		assert.InEpsilon(t, push/4*L/2, math.Abs(s.MYNm), tol, s.Node)
	}
	for _, m := range sc.Members {
		assert.InEpsilon(t, push/4*L/2, m.MaxMomentNm, tol, m.Name)
	}
	// Whole-stand sway buckling under press (about the weaker axis), one
	// element per leg: the consistent geometric stiffness gives
	// P = 10·EI/L² per leg
	// (Przemieniecki, Theory of Matrix Structural Analysis, §15; 1.3 %
	// above Euler's π²·EI/L² for a fixed–guided column with sway).
	require.NotNil(t, rep.Governing.BucklingFactor)
	assert.InEpsilon(t, 10*EI/(L*L)/(press/4), *rep.Governing.BucklingFactor, 1e-9)              // eigenvalue of a converged symmetric solve: round-off level
	assert.InEpsilon(t, math.Pi*math.Pi*EI/(L*L)/(press/4), *rep.Governing.BucklingFactor, 0.02) // 2 %: covers the 1.3 % one-element excess stated above
	// Member Euler check without sway, fixed–fixed, K = 0.65 (AISC 360
	// Commentary Table C-A-7.1, recommended design value).
	require.NotNil(t, rep.Governing.EulerMargin)
	assert.InEpsilon(t, math.Pi*math.Pi*EI/math.Pow(0.65*L, 2)/(press/4), *rep.Governing.EulerMargin, 1e-9) // a formula on a direct solve's axial force: round-off
	// Equilibrium: reactions balance the applied load.
	assert.InEpsilon(t, press, pc.Equilibrium.ReactionsN[2], tol)
	assert.Less(t, pc.Equilibrium.ForceError, 1e-12) // relative force imbalance of one direct solve: round-off
	assert.Equal(t, cautions, rep.Cautions)
}

// TestGoldenReports pins whole reports of the examples whose numbers rest
// on closed forms checked in the hand-check tests (four-legs.toml,
// steel-legs.toml) and of the section geometry. The demo, whose numbers
// move with every refinement of the library (mass matrices, effective
// lengths, catalogue values), is checked for its structure in
// TestDemoStructure instead.
func TestGoldenReports(t *testing.T) {
	tests := []struct {
		name string
		args []string
	}{
		{"four-legs.analyse.si", []string{"analyse", "testdata/four-legs.toml"}},
		{"four-legs.analyse.us", []string{"analyse", "--units", "us", "testdata/four-legs.toml"}},
		{"four-legs.analyse.json", []string{"analyse", "--json", "testdata/four-legs.toml"}},
		{"four-legs.ranges", []string{"ranges", "testdata/four-legs.toml"}},
		{"four-legs.modes", []string{"modes", "testdata/four-legs.toml"}},
		{"four-legs.response", []string{"response", "--band", "1-40", "--points", "60", "testdata/four-legs.toml"}},
		{"steel-legs.ranges", []string{"ranges", "testdata/steel-legs.toml"}},
		{"compare", []string{"compare", "testdata/four-legs.toml", "testdata/steel-legs.toml"}},
		{"materials.S355", []string{"materials", "S355"}},
		{"sections.square-tube", []string{"sections", "square-tube 50x3 mm"}},
		{"sections.square-tube.us", []string{"sections", "--units", "us", "square-tube 50x3 mm"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r := trestle(t, "", tc.args...)
			require.NoError(t, r.err)
			golden(t, tc.name, r.stdout)
		})
	}
}

func TestReportsEndWithCautions(t *testing.T) {
	for _, args := range [][]string{
		{"demo"},
		{"analyse", "testdata/four-legs.toml"},
		{"ranges", "testdata/four-legs.toml"},
		{"compare", "demo", "testdata/four-legs.toml"},
		{"ringdown", "testdata/tap.csv"},
		{"modes", "demo"},
		{"response", "--points", "40", "demo"},
	} {
		t.Run(strings.Join(args, " "), func(t *testing.T) {
			r := trestle(t, "", args...)
			require.NoError(t, r.err)
			i := strings.LastIndex(r.stdout, "CAUTIONS")
			require.Greater(t, i, 0)
			tail := r.stdout[i:]
			for _, c := range cautions {
				assert.Contains(t, tail, c)
			}
			assert.Contains(t, tail, "licensed engineering practice")
		})
	}
}

func TestJSONRoundTrip(t *testing.T) {
	tests := []struct {
		name string
		args []string
		into func() any
	}{
		{"demo", []string{"demo", "--json"}, func() any { return new(AnalysisReport) }},
		{"analyse", []string{"analyse", "--json", "testdata/four-legs.toml"}, func() any { return new(AnalysisReport) }},
		{"analyse held foot", []string{"analyse", "--json", "testdata/bench-planing-120lbf.toml"}, func() any { return new(AnalysisReport) }},
		{"ranges", []string{"ranges", "--json", "testdata/four-legs.toml"}, func() any { return new(RangesReport) }},
		{"compare", []string{"compare", "--json", "demo", "testdata/four-legs.toml"}, func() any { return new(CompareReport) }},
		{"ringdown", []string{"ringdown", "--json", "testdata/tap.csv"}, func() any { return new(RingdownReport) }},
		{"modes", []string{"modes", "--json", "demo"}, func() any { return new(ModesCommandReport) }},
		{"response", []string{"response", "--json", "--points", "40", "demo"}, func() any { return new(ResponseReport) }},
		{"materials", []string{"materials", "--json"}, func() any { return new(MaterialsReport) }},
		{"material", []string{"materials", "--json", "C25/30"}, func() any { return new(MaterialsReport) }},
		{"sections", []string{"sections", "--json"}, func() any { return new(SectionsReport) }},
		{"section", []string{"sections", "--json", "filled round-tube 100x4 mm with concrete C25/30"}, func() any { return new(SectionReport) }},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r := trestle(t, "", tc.args...)
			require.NoError(t, r.err)
			v := tc.into()
			decodeStrict(t, r.stdout, v)
			var again bytes.Buffer
			require.NoError(t, writeJSON(&again, v))
			assert.JSONEq(t, r.stdout, again.String(), "decoding and encoding again loses nothing")
			var generic map[string]any
			require.NoError(t, json.Unmarshal([]byte(r.stdout), &generic))
			assert.Contains(t, generic["schema"], "trestle.", "every report names its schema")
			// SCHEMA.md: null only where the field is a pointer; lists are [].
			checkNulls(t, generic, reflect.TypeOf(v).Elem(), "")
		})
	}
}

// checkNulls fails on a null in the decoded JSON value j whose Go field in
// type typ is not a pointer (a list, a number, a text), and on a key that
// typ does not have.
func checkNulls(t *testing.T, j any, typ reflect.Type, path string) {
	t.Helper()
	for typ.Kind() == reflect.Pointer {
		typ = typ.Elem()
	}
	switch jv := j.(type) {
	case map[string]any:
		if typ.Kind() != reflect.Struct {
			return // a map in Go: no schema fields to check
		}
		fields := map[string]reflect.StructField{}
		for i := range typ.NumField() {
			f := typ.Field(i)
			name, _, _ := strings.Cut(f.Tag.Get("json"), ",")
			if name == "" {
				name = f.Name
			}
			fields[name] = f
		}
		for k, val := range jv {
			f, ok := fields[k]
			if !assert.True(t, ok, "%s.%s: no such field", path, k) {
				continue
			}
			if val == nil {
				assert.Equal(t, reflect.Pointer, f.Type.Kind(), "%s.%s is null but is not a pointer field", path, k)
				continue
			}
			checkNulls(t, val, f.Type, path+"."+k)
		}
	case []any:
		if typ.Kind() != reflect.Slice && typ.Kind() != reflect.Array {
			return
		}
		for i, e := range jv {
			assert.NotNil(t, e, "%s[%d] is null", path, i)
			checkNulls(t, e, typ.Elem(), fmt.Sprintf("%s[%d]", path, i))
		}
	}
}

func TestDemoEndToEnd(t *testing.T) {
	// The README's main-job command: go run ./cmd/trestle demo. It needs
	// no file: run it from an empty folder.
	t.Chdir(t.TempDir())
	r := trestle(t, "", "demo")
	require.NoError(t, r.err)
	for _, want := range []string{"GOVERNING NUMBERS", "softest mount stiffness", "N/µm",
		"highest utilisation", "buckling factor", "MOUNT STIFFNESS", "Feet", "share", "Members", "Check: applied", "CAUTIONS"} {
		assert.Contains(t, r.stdout, want)
	}
	i, j := strings.Index(r.stdout, "GOVERNING NUMBERS"), strings.Index(r.stdout, "LOAD CASE")
	assert.True(t, i > 0 && j > i, "governing numbers come before the details")
	assert.Empty(t, r.stderr)

	var rep AnalysisReport
	js := trestle(t, "", "demo", "--json")
	require.NoError(t, js.err)
	decodeStrict(t, js.stdout, &rep)
	assert.Equal(t, schemaAnalysis, rep.Schema)
	assert.NotEmpty(t, rep.Mounts)
	for _, m := range rep.Mounts {
		assert.Greater(t, m.PrincipalNPerM[0], 0.0, m.Name)
	}
	// The floor carries the stand's weight: sum of the feet in the first
	// case equals the applied vertical load (equilibrium, Newton's first law).
	var sum float64
	for _, f := range rep.Cases[0].Feet {
		sum += f.FZN
	}
	assert.InEpsilon(t, -rep.Cases[0].Equilibrium.AppliedN[2], sum, 1e-9) // a sum of reactions from a direct solve: round-off

	// --picture draws the case with the largest displacement beside the
	// report, leaving standard output to the report.
	p := trestle(t, "", "demo", "--picture", "demo.svg")
	require.NoError(t, p.err)
	assert.Equal(t, r.stdout, p.stdout)
	assert.Contains(t, p.stderr, "demo.svg")
	data, err := os.ReadFile("demo.svg")
	require.NoError(t, err)
	assert.Len(t, svgMembers(t, data), len(rep.Cases[0].Members), "every member drawn")
}

func TestTiedSoftestDirection(t *testing.T) {
	// Square footprint, identical legs: k_X = k_Y at the seat by symmetry,
	// so the softest direction is any horizontal one; the report names a
	// global axis and says the stiffness is tied.
	r := trestle(t, "", "analyse", "--json", "testdata/tall-square.toml")
	require.NoError(t, r.err)
	var rep AnalysisReport
	decodeStrict(t, r.stdout, &rep)
	require.Len(t, rep.Mounts, 1)
	mt := rep.Mounts[0]
	assert.True(t, mt.SoftestTied)
	assert.InEpsilon(t, mt.XNPerM, mt.YNPerM, 1e-9) // equal by symmetry; round-off only
	assert.Equal(t, [3]float64{1, 0, 0}, mt.PrincipalDirection[0])
	assert.Equal(t, [3]float64{0, 1, 0}, mt.PrincipalDirection[1])
	text := trestle(t, "", "analyse", "testdata/tall-square.toml")
	require.NoError(t, text.err)
	assert.Contains(t, text.stdout, "along X (as soft along Y)")
}

func TestTippingMarginOrWarning(t *testing.T) {
	// Rigid-body statics: the stand tips about the leeward feet when
	// λ·P·H = W·b/2 (the weight's centroid is over the middle of the
	// square footprint), with P = 100 N at H = 1.5 m, b = 0.4 m and W the
	// floor load of the case.
	const p, h, b = 100.0, 1.5, 0.4
	r := trestle(t, "", "analyse", "--json", "testdata/tall-square.toml")
	require.NoError(t, r.err)
	var rep AnalysisReport
	decodeStrict(t, r.stdout, &rep)
	want := rep.Summary.FloorLoadN * b / (2 * p * h)
	tp := rep.Cases[0].Tipping
	if tp.Found {
		require.NotNil(t, rep.Governing.TippingFactor)
		// The library finds λ in closed form within a contact set: round-off only.
		assert.InEpsilon(t, want, *rep.Governing.TippingFactor, 1e-9)
		return
	}
	// Without an answer from the library the report must say so, not
	// claim the stand cannot tip.
	require.NotEmpty(t, tp.Note)
	found := false
	for _, w := range rep.Warnings {
		found = found || strings.Contains(w, "TIPPING MARGIN UNKNOWN")
	}
	assert.True(t, found, "a warning names the unknown tipping margin")
}

// TestRangesHandCheck: every stiffness of testdata/steel-legs.toml is E
// times geometry, so at the catalogue's low, nominal and high E of steel
// S235 the mount stiffness scales with E and the natural frequency with
// √E (the mass does not change); the sway stiffness of four fixed–guided
// round legs is 4·12·E·I/L³ with I = π·d⁴/64 (Roark's Formulas for Stress
// and Strain, Table 8.1, case 1e; a circle's second moment).
func TestRangesHandCheck(t *testing.T) {
	const (
		d, L           = 0.030, 0.7
		eLo, eNom, eHi = 195e9, 210e9, 212e9 // steel S235 E range in the materials catalogue
		tol            = 1e-9
	)
	r := trestle(t, "", "ranges", "--json", "testdata/steel-legs.toml")
	require.NoError(t, r.err)
	var rep RangesReport
	decodeStrict(t, r.stdout, &rep)
	require.Len(t, rep.Levels, 3)
	lo, nom, hi := rep.Levels[0], rep.Levels[1], rep.Levels[2]
	require.Equal(t, []string{"low", "nominal", "high"}, []string{lo.Level, nom.Level, hi.Level})
	i := math.Pi * math.Pow(d, 4) / 64
	assert.InEpsilon(t, 4*12*eNom*i/(L*L*L), nom.Governing.SoftestStiffnessNPerM, tol)
	assert.InEpsilon(t, eLo/eNom, lo.Governing.SoftestStiffnessNPerM/nom.Governing.SoftestStiffnessNPerM, tol)
	assert.InEpsilon(t, eHi/eNom, hi.Governing.SoftestStiffnessNPerM/nom.Governing.SoftestStiffnessNPerM, tol)
	require.NotNil(t, lo.Governing.FirstFrequencyHz)
	require.NotNil(t, nom.Governing.FirstFrequencyHz)
	require.NotNil(t, hi.Governing.FirstFrequencyHz)
	assert.InEpsilon(t, math.Sqrt(eLo/eNom), *lo.Governing.FirstFrequencyHz / *nom.Governing.FirstFrequencyHz, tol)
	assert.InEpsilon(t, math.Sqrt(eHi/eNom), *hi.Governing.FirstFrequencyHz / *nom.Governing.FirstFrequencyHz, tol)
	// Under its own weight each leg carries a quarter in pure compression
	// whatever E is: the utilisation does not change.
	assert.InEpsilon(t, nom.Governing.MaxUtilisation, lo.Governing.MaxUtilisation, tol)
	assert.InEpsilon(t, nom.Governing.MaxUtilisation, hi.Governing.MaxUtilisation, tol)
}

// TestDemoStructure checks the layout of the demo's full report: the
// sections in order, every mount, case and mode listed, governing numbers
// before details. Names come from the JSON report, so the demo model may
// change.
func TestDemoStructure(t *testing.T) {
	for _, model := range []string{"demo", "testdata/lathe-stand.toml"} {
		t.Run(model, func(t *testing.T) { demoStructure(t, model) })
	}
}

func demoStructure(t *testing.T, model string) {
	r := trestle(t, "", "analyse", "--json", model)
	require.NoError(t, r.err)
	var rep AnalysisReport
	decodeStrict(t, r.stdout, &rep)
	text := trestle(t, "", "analyse", model)
	require.NoError(t, text.err)
	out := text.stdout
	order := []string{"trestle analysis: " + rep.Model, "GOVERNING NUMBERS", "softest mount stiffness",
		"first natural frequency", "highest utilisation", "buckling factor", "MOUNT STIFFNESS", "WHOLE-STAND BUCKLING",
		"NATURAL MODES", "LOAD CASE", "Feet", "Members", "Check: applied", "CAUTIONS"}
	at := 0
	for _, w := range order {
		i := strings.Index(out[at:], w)
		require.GreaterOrEqual(t, i, 0, "%q after position %d", w, at)
		at += i
	}
	for _, m := range rep.Mounts {
		assert.Contains(t, out, "\n  "+m.Name+" ", "mount %s has a row", m.Name)
	}
	for _, c := range rep.Cases {
		assert.Contains(t, out, fmt.Sprintf("%q", c.Name))
		assert.Len(t, c.Feet, rep.Summary.Feet, "every foot in case %q", c.Name)
		assert.Len(t, c.Members, rep.Summary.Bars+rep.Summary.Beams+rep.Summary.Springs, "every member in case %q", c.Name)
	}
	require.NotNil(t, rep.Modes)
	for _, md := range rep.Modes.Modes {
		assert.Contains(t, out, fmt.Sprintf("\n  %d  ", md.Number), "mode %d has a row", md.Number)
	}
}

// TestLiftedFootWarnedFirst: the demo stand with the cutting force alone
// (no weight holding it down) lifts foot-2. Statics of a rigid top on
// four equal vertical springs (each foot takes P/4 plus M·c/Σc² from each
// moment): the 1200 N down at the headstock, 0.35 m left of the centre of
// the 1.2 × 0.5 m plan, gives 475 N on each left foot and 125 N on each
// right one; the 300 N push along Y at 0.82 m height takes 300·0.82 =
// 246 N from each front foot; the 150 N along −X takes 150·0.82·0.6/1.44
// = 51 N from each right foot. Only the front right foot (foot-2) ends in
// tension, 125 − 246 − 51 < 0, so it lifts. The warning comes before the
// governing numbers.
func TestLiftedFootWarnedFirst(t *testing.T) {
	model := string(modelfile.Demo()) + `
[[case]]
name = "cutting alone"
[[case.load]]
at = "headstock"
force = [-150, 300, "-1.2 kN"]
`
	r := trestle(t, model, "analyse", "--json", "-")
	require.NoError(t, r.err)
	var rep AnalysisReport
	decodeStrict(t, r.stdout, &rep)
	assert.Equal(t, []string{"foot-2 (cutting alone)"}, rep.Governing.LiftedFeet)
	text := trestle(t, model, "analyse", "-")
	require.NoError(t, text.err)
	out := text.stdout
	i := strings.Index(out, "LIFTED FEET")
	require.GreaterOrEqual(t, i, 0)
	assert.Less(t, i, strings.Index(out, "GOVERNING NUMBERS"))
}

// TestRangesRigidMount: a mount on a support fixed in every direction has
// no stiffness (it is infinite); ranges names it in a warning and still
// reports the other mount, whose sway stiffness is 4·12·E·I/L³ as in
// TestRangesHandCheck (Roark's Formulas for Stress and Strain, Table 8.1,
// case 1e).
func TestRangesRigidMount(t *testing.T) {
	const (
		d, L = 0.030, 0.7
		eNom = 210e9 // steel S235 nominal E in the materials catalogue
		tol  = 1e-9  // the same solve as TestRangesHandCheck
	)
	data, err := os.ReadFile("testdata/steel-legs.toml")
	require.NoError(t, err)
	model := string(data) + "\n[[mount]]\nname = \"floor-pad\"\non = \"A1\"\nat = [0, 0, 0]\n"
	r := trestle(t, model, "ranges", "--json", "-")
	require.NoError(t, r.err)
	var rep RangesReport
	decodeStrict(t, r.stdout, &rep)
	require.Len(t, rep.Warnings, 1)
	assert.Contains(t, rep.Warnings[0], "no stiffness at floor-pad")
	assert.Contains(t, rep.Warnings[0], "held rigidly")
	require.Len(t, rep.Levels, 3)
	for _, l := range rep.Levels {
		require.Len(t, l.Mounts, 1, l.Level)
		assert.Equal(t, "seat", l.Mounts[0].Name)
	}
	i := math.Pi * math.Pow(d, 4) / 64
	assert.InEpsilon(t, 4*12*eNom*i/(L*L*L), rep.Levels[1].Governing.SoftestStiffnessNPerM, tol)
	text := trestle(t, model, "ranges", "-")
	require.NoError(t, text.err)
	assert.Contains(t, text.stdout, "WARNINGS")
	assert.Contains(t, text.stdout, "no stiffness at floor-pad")
}

// TestDemoFactoredCombination: the demo's factored combination is 1.5 ×
// "weight and cutting" and every foot stays in contact under both, so by
// linearity (superposition of a linear elastic model) its displacements,
// forces and stresses are 1.5 times those of that case.
func TestDemoFactoredCombination(t *testing.T) {
	const tol = 1e-9 // two solves of the same system, round-off only
	r := trestle(t, "", "demo", "--json")
	require.NoError(t, r.err)
	var rep AnalysisReport
	decodeStrict(t, r.stdout, &rep)
	byName := map[string]CaseReport{}
	for _, c := range rep.Cases {
		byName[c.Name] = c
	}
	wc, ok := byName["weight and cutting"]
	require.True(t, ok)
	fc, ok := byName["factored weight and cutting"]
	require.True(t, ok)
	require.True(t, fc.Combination)
	assert.Empty(t, rep.Governing.LiftedFeet, "the demo's cases are physical: no foot lifts")
	assert.InEpsilon(t, 1.5*wc.MaxDisplacementM, fc.MaxDisplacementM, tol)
	assert.InEpsilon(t, 1.5*wc.MaxUtilisation, fc.MaxUtilisation, tol)
	require.Len(t, fc.Feet, len(wc.Feet))
	for i := range wc.Feet {
		assert.InEpsilon(t, 1.5*wc.Feet[i].FZN, fc.Feet[i].FZN, tol, wc.Feet[i].Name)
	}
}

// TestRoundOffIsNotUplift: in the timber bench's "pounding" case a
// 300 lbf load stands straight over pad-1 (FL-top is above FL-0), so by
// statics pad-1 carries all of it, 300 lbf = 1334.4665 N (1 lbf =
// 4.4482216152605 N, NIST SP 811), and the other pads nothing. The
// solve leaves them a round-off of about 1e-11 N, which is neither
// printed nor flagged as uplift.
func TestRoundOffIsNotUplift(t *testing.T) {
	const (
		lbf = 4.4482216152605 // N, NIST SP 811
		tol = 1e-9            // statics of one solve; round-off only
	)
	r := trestle(t, "", "analyse", "--json", "../../examples/timber-bench.toml")
	require.NoError(t, r.err)
	var rep AnalysisReport
	decodeStrict(t, r.stdout, &rep)
	assert.Empty(t, rep.Governing.UpliftFeet)
	var pounding *CaseReport
	for i := range rep.Cases {
		if rep.Cases[i].Name == "pounding" {
			pounding = &rep.Cases[i]
		}
	}
	require.NotNil(t, pounding)
	require.Len(t, pounding.Feet, 4)
	assert.InEpsilon(t, 300*lbf, pounding.Feet[0].FZN, tol)
	for _, f := range pounding.Feet[1:] {
		assert.Zero(t, f.FZN, f.Name)
		assert.False(t, f.Uplift, f.Name)
	}
}

// TestTippedCaseReported: the demo with a 20 kN push along Y at the
// headstock (0.82 m up) tips over its back feet. The other cases keep
// their results, and the tipping factor on the push follows from
// rigid-body statics about the back edge (y = 0.5 m, on the floor), where
// the back feet and every horizontal foot force have no moment: the
// front feet unload to zero at λ·20 kN·0.82 m = the weight's moment
// about that edge, which the "own weight" case gives as its front feet's
// reactions × 0.5 m (equilibrium of that case). The flat foot springs
// and a flexible frame do not change this in a small-displacement model.
func TestTippedCaseReported(t *testing.T) {
	// sameSolveTol: one case solved twice with the same factorisation
	// differs by round-off of the solve only.
	const sameSolveTol = 1e-9
	const (
		push, height, depth = 20e3, 0.82, 0.5 // N, m, m: the case below and the demo's plan
		tol                 = 1e-6            // a contact path found to round-off
	)
	model := string(modelfile.Demo()) + `
[[case]]
name = "shove"
gravity = true
[[case.load]]
at = "headstock"
force = [0, "20 kN", 0]
`
	r := trestle(t, model, "analyse", "--json", "-")
	require.NoError(t, r.err)
	var rep AnalysisReport
	decodeStrict(t, r.stdout, &rep)
	assert.Equal(t, []string{"shove"}, rep.Governing.TippedCases)
	require.NotEmpty(t, rep.Warnings)
	assert.True(t, strings.HasPrefix(rep.Warnings[0], "TIPS OVER"), rep.Warnings[0])
	var own, shove *CaseReport
	for i := range rep.Cases {
		switch rep.Cases[i].Name {
		case "own weight":
			own = &rep.Cases[i]
		case "shove":
			shove = &rep.Cases[i]
		}
	}
	require.NotNil(t, own)
	require.NotNil(t, shove)
	require.True(t, shove.Tipped)
	assert.ElementsMatch(t, []string{"foot-1", "foot-2"}, shove.TippedLifted)
	assert.Empty(t, shove.Members)
	require.True(t, shove.Tipping.Found)
	require.Len(t, own.Feet, 4)
	front := own.Feet[0].FZN + own.Feet[1].FZN // foot-1 and foot-2 stand at y = 0
	assert.InEpsilon(t, front*depth/(push*height), shove.Tipping.Factor, tol)

	// The cases that stand are those of the demo.
	d := trestle(t, "", "analyse", "--json", "demo")
	require.NoError(t, d.err)
	var demo AnalysisReport
	decodeStrict(t, d.stdout, &demo)
	require.Len(t, rep.Cases, len(demo.Cases)+1)
	for _, want := range demo.Cases {
		found := false
		for _, got := range rep.Cases {
			if got.Name == want.Name {
				found = true
				// The same solve of the same case; which other cases are
				// solved beside it may change the order of the arithmetic
				// (multi-load solves), so round-off is allowed.
				var wj, gj bytes.Buffer
				require.NoError(t, writeJSON(&wj, want))
				require.NoError(t, writeJSON(&gj, got))
				assert.True(t, sameWithin(wj.String(), gj.String(), sameSolveTol), "case %q:\n%s", want.Name, diff(wj.String(), gj.String()))
			}
		}
		assert.True(t, found, want.Name)
	}

	text := trestle(t, model, "analyse", "-")
	require.NoError(t, text.err)
	assert.Contains(t, text.stdout, "THE STAND TIPS OVER under this case")
	rg := trestle(t, model, "ranges", "--json", "-")
	require.NoError(t, rg.err)
	var rr RangesReport
	decodeStrict(t, rg.stdout, &rr)
	require.Len(t, rr.Warnings, 1)
	assert.Contains(t, rr.Warnings[0], `TIPS OVER under case "shove" at low, nominal, high`)
	dr := trestle(t, model, "draw", "--case", "shove", "--out", filepath.Join(t.TempDir(), "x.svg"), "-")
	require.Error(t, dr.err)
	assert.Contains(t, dr.err.Error(), "tips over")
}

// TestHeldFootReported: testdata/bench-planing-120lbf.toml (a copy of
// springnet/testdata/bench-planing-120lbf.toml) pushes the timber bench
// 120 lbf along X at FL-top; the contact search cycles on pad-4, which
// springnet reports held: lifted (FZ = 0) but still held sideways. The
// report says so in the feet table, the governing row, the JSON and one
// warning. Horizontal equilibrium of the whole bench (the feet are its
// only supports) needs the held foot's FX: the four feet's FX add up to
// −120 lbf, 1 lbf = 4.4482216152605 N (NIST SP 811).
func TestHeldFootReported(t *testing.T) {
	const (
		lbf = 4.4482216152605 // N, NIST SP 811
		tol = 1e-6            // statics of a converged contact solve; round-off only
	)
	path := "testdata/bench-planing-120lbf.toml"
	r := trestle(t, "", "analyse", "--json", path)
	require.NoError(t, r.err)
	var rep AnalysisReport
	decodeStrict(t, r.stdout, &rep)
	var planing *CaseReport
	for i := range rep.Cases {
		if rep.Cases[i].Name == "planing" {
			planing = &rep.Cases[i]
		}
	}
	require.NotNil(t, planing)
	require.Len(t, planing.Feet, 4)
	var sumFX float64
	var pad4 FootReport
	for _, f := range planing.Feet {
		sumFX += f.FXN
		if f.Name == "pad-4" {
			pad4 = f
		} else {
			assert.False(t, f.Held, f.Name)
		}
	}
	require.Equal(t, "pad-4", pad4.Name)
	assert.True(t, pad4.Held)
	assert.True(t, pad4.Lifted, "a held foot is lifted")
	assert.Zero(t, pad4.FZN)
	assert.Zero(t, pad4.Share)
	// sideways: the held foot carries a real share of the 534 N push
	// (springnet gives about 94 N along −X); 1 % of the push is far above
	// round-off and far below that.
	assert.Greater(t, math.Hypot(pad4.FXN, pad4.FYN), 0.01*120*lbf)
	assert.InEpsilon(t, -120*lbf, sumFX, tol, "ΣFX of the feet balances the push")
	assert.Equal(t, []string{"pad-4 (planing)"}, rep.Governing.HeldFeet)
	assert.Contains(t, rep.Governing.LiftedFeet, "pad-4 (planing)")
	held := 0
	for _, w := range rep.Warnings {
		if strings.HasPrefix(w, "HELD SIDEWAYS: pad-4 (planing)") {
			held++
		}
	}
	assert.Equal(t, 1, held, "one warning explains the held foot: %q", rep.Warnings)

	text := trestle(t, "", "analyse", path)
	require.NoError(t, text.err)
	out := text.stdout
	assert.Contains(t, out, "pad-4 (planing, held sideways)")
	var row string
	for _, l := range strings.Split(out[strings.Index(out, `LOAD CASE "planing"`):], "\n") {
		if strings.HasPrefix(strings.TrimSpace(l), "pad-4 ") {
			row = l
			break
		}
	}
	require.NotEmpty(t, row)
	assert.True(t, strings.HasSuffix(row, "LIFTED, held sideways"), row)
	// foot node FZ share FX FY state: FZ is printed 0, FX is not.
	fields := strings.Fields(row)
	require.GreaterOrEqual(t, len(fields), 7, row)
	assert.Equal(t, "0", fields[2], row)
	assert.NotEqual(t, "0", fields[5], row)
}
