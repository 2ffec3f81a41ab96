package main

import (
	"bytes"
	"encoding/csv"
	"encoding/xml"
	"errors"
	"image/png"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet/sparse"
)

func TestHelpOnEveryCommand(t *testing.T) {
	for _, c := range commands() {
		t.Run(c.name, func(t *testing.T) {
			for _, h := range []string{"--help", "-h"} {
				r := trestle(t, "", c.name, h)
				require.NoError(t, r.err)
				assert.Contains(t, r.stdout, "Usage: trestle "+c.name)
				assert.Contains(t, r.stdout, "Example:\n  trestle "+c.name)
			}
		})
	}
	r := trestle(t, "", "--help")
	require.NoError(t, r.err)
	for _, c := range commands() {
		assert.Contains(t, r.stdout, "  "+c.name+" ")
	}
	r = trestle(t, "", "help", "draw")
	require.NoError(t, r.err)
	assert.Contains(t, r.stdout, "Usage: trestle draw")
}

// TestErrors checks that bad input gives an error that says what is wrong
// (main prints it and exits 1).
func TestErrors(t *testing.T) {
	bad := filepath.Join(t.TempDir(), "bad.toml")
	require.NoError(t, os.WriteFile(bad, []byte("[nodes]\nA = [0, 0, 0]\n\n[[bar]]\nname = \"b\"\nends = [\"A\", \"B\"]\nEA = 1e6\n"), 0o644))
	tests := []struct {
		name  string
		stdin string
		args  []string
		want  []string
	}{
		{"no command", "", nil, []string{"no command"}},
		{"unknown command", "", []string{"analyze-it"}, []string{`unknown command "analyze-it"`}},
		{"near miss", "", []string{"demoo"}, []string{`did you mean "demo"`}},
		{"missing file", "", []string{"analyse", "no-such-file.toml"}, []string{"no-such-file.toml"}},
		{"no argument", "", []string{"analyse"}, []string{"want one argument"}},
		{"two arguments", "", []string{"analyse", "a", "b"}, []string{"want one argument, got 2"}},
		{"bad units", "", []string{"analyse", "--units", "furlongs", "demo"}, []string{`--units "furlongs"`}},
		{"bad level", "", []string{"analyse", "--level", "medium", "demo"}, []string{`--level "medium"`}},
		{"unknown flag", "", []string{"analyse", "--colour", "demo"}, []string{"flag provided but not defined", "--help"}},
		{"model error names file and line", "", []string{"analyse", bad}, []string{"bad.toml:", `"B"`}},
		{"empty stdin", "", []string{"analyse", "-"}, []string{"standard input"}},
		{"draw without out", "", []string{"draw", "demo"}, []string{"--out"}},
		{"draw bad extension", "", []string{"draw", "--out", "x.gif", "demo"}, []string{".svg or .png"}},
		{"draw unknown case", "", []string{"draw", "--out", filepath.Join(t.TempDir(), "x.svg"), "--case", "wind", "demo"}, []string{`no load case "wind"`, `"own weight"`}},
		{"unknown material", "", []string{"materials", "unobtanium"}, []string{"unobtanium"}},
		{"bad section", "", []string{"sections", "hexagon 5 mm"}, []string{"hexagon"}},
		{"ringdown not numbers", "t,x\n0,a\n", []string{"ringdown", "-"}, []string{"standard input"}},
		{"ringdown bad band", "", []string{"ringdown", "--band", "30-10", "testdata/tap.csv"}, []string{"--band"}},
		{"compare both stdin", "", []string{"compare", "-", "-"}, []string{"only one"}},
		{"generate no size", "", []string{"generate", "--section", "square 40 mm"}, []string{"--width is required"}},
		{"generate bad legs", "", []string{"generate", "--legs", "two", "--width", "1m", "--depth", "1m", "--height", "1m", "--section", "square 40 mm"}, []string{"--legs"}},
		{"generate bad unit", "", []string{"generate", "--width", "3 parsecs", "--depth", "1m", "--height", "1m", "--section", "square 40 mm"}, []string{"unknown unit"}},
		{"export without dir", "", []string{"export", "demo"}, []string{"--dir"}},
		{"modes bad count", "", []string{"modes", "--count", "-2", "demo"}, []string{"--count -2"}},
		{"modes mode out of range", "", []string{"modes", "--mode", "40", "--picture", filepath.Join(t.TempDir(), "m.svg"), "testdata/four-legs.toml"}, []string{"--mode 40", "modes 1 to 3"}},
		{"response bad band", "", []string{"response", "--band", "5", "demo"}, []string{"--band"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r := trestle(t, tc.stdin, tc.args...)
			require.Error(t, r.err)
			for _, w := range tc.want {
				assert.Contains(t, r.err.Error(), w)
			}
			assert.False(t, errors.Is(r.err, errHelp))
		})
	}
}

func TestStdinDash(t *testing.T) {
	data, err := os.ReadFile("testdata/four-legs.toml")
	require.NoError(t, err)
	fromFile := trestle(t, "", "analyse", "--json", "testdata/four-legs.toml")
	fromStdin := trestle(t, string(data), "analyse", "--json", "-")
	require.NoError(t, fromFile.err)
	require.NoError(t, fromStdin.err)
	var a, b AnalysisReport
	decodeStrict(t, fromFile.stdout, &a)
	decodeStrict(t, fromStdin.stdout, &b)
	a.Model, b.Model = "", ""
	assert.Equal(t, a, b, "the same model read from a file and from standard input")
}

func TestFlagsAfterArguments(t *testing.T) {
	r := trestle(t, "", "analyse", "testdata/four-legs.toml", "--json")
	require.NoError(t, r.err)
	assert.True(t, strings.HasPrefix(r.stdout, "{"))
}

// svgMembers decodes an SVG with encoding/xml (failing on malformed XML)
// and counts <line class="member"> elements per data-member name.
func svgMembers(t *testing.T, data []byte) map[string]int {
	t.Helper()
	dec := xml.NewDecoder(bytes.NewReader(data))
	count := map[string]int{}
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		require.NoError(t, err)
		if se, ok := tok.(xml.StartElement); ok && se.Name.Local == "line" {
			var class, name string
			for _, a := range se.Attr {
				switch a.Name.Local {
				case "class":
					class = a.Value
				case "data-member":
					name = a.Value
				}
			}
			if class == "member" {
				count[name]++
			}
		}
	}
	return count
}

func TestDraw(t *testing.T) {
	dir := t.TempDir()
	svg := filepath.Join(dir, "legs.svg")
	r := trestle(t, "", "draw", "--out", svg, "--case", "push", "testdata/four-legs.toml")
	require.NoError(t, r.err)
	assert.Contains(t, r.stdout, "wrote "+svg)
	data, err := os.ReadFile(svg)
	require.NoError(t, err)
	count := svgMembers(t, data)
	// Four legs, each drawn in four views.
	assert.Equal(t, map[string]int{"leg-1": 4, "leg-2": 4, "leg-3": 4, "leg-4": 4}, count)
	assert.Contains(t, string(data), "deflection under &#34;push&#34;")

	pngPath := filepath.Join(dir, "demo.png")
	r = trestle(t, "", "draw", "--out", pngPath, "demo")
	require.NoError(t, r.err)
	f, err := os.Open(pngPath)
	require.NoError(t, err)
	defer f.Close()
	img, err := png.Decode(f)
	require.NoError(t, err)
	assert.Equal(t, 1280, img.Bounds().Dx())
	entries, err := os.ReadDir(dir)
	require.NoError(t, err)
	assert.Len(t, entries, 2, "no temporary files left behind")
}

func TestNeverOverwritesInput(t *testing.T) {
	dir := t.TempDir()
	model := filepath.Join(dir, "stand.toml")
	orig, err := os.ReadFile("testdata/four-legs.toml")
	require.NoError(t, err)
	require.NoError(t, os.WriteFile(model, orig, 0o644))
	tap := filepath.Join(dir, "tap.svg") // a ring-down input with a picture's name
	tapData, err := os.ReadFile("testdata/tap.csv")
	require.NoError(t, err)
	require.NoError(t, os.WriteFile(tap, tapData, 0o644))
	for _, args := range [][]string{
		{"draw", "--out", model, "--format", "svg", model},
		{"draw", "--out", filepath.Join(dir, ".", "stand.toml"), "--format", "png", model},
		{"ringdown", "--picture", tap, tap},
	} {
		r := trestle(t, "", args...)
		require.Error(t, r.err, args)
		assert.Contains(t, r.err.Error(), "refusing to overwrite an input")
	}
	got, err := os.ReadFile(model)
	require.NoError(t, err)
	assert.Equal(t, orig, got, "the model file is unchanged")
	got, err = os.ReadFile(tap)
	require.NoError(t, err)
	assert.Equal(t, tapData, got, "the record is unchanged")
}

func TestWriteAtomic(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "out.txt")
	require.NoError(t, os.WriteFile(path, []byte("before"), 0o644))
	err := writeAtomic(path, nil, func(w io.Writer) error {
		io.WriteString(w, "half a")
		return errors.New("disk on fire")
	})
	require.Error(t, err)
	got, _ := os.ReadFile(path)
	assert.Equal(t, "before", string(got), "a failed write leaves the old file")
	require.NoError(t, writeAtomic(path, nil, func(w io.Writer) error { _, err := io.WriteString(w, "after"); return err }))
	got, _ = os.ReadFile(path)
	assert.Equal(t, "after", string(got))
	entries, _ := os.ReadDir(dir)
	assert.Len(t, entries, 1, "no temporary files left behind")
}

func TestRingdown(t *testing.T) {
	// testdata/tap.csv is x = 9.81 + 2·exp(−ζωn·t)·sin(ωd·t) + noise with
	// f_d = 25 Hz and ζ = 0.02 (see its header).
	const fd, zeta = 25.0, 0.02
	dir := t.TempDir()
	pic := filepath.Join(dir, "tap.svg")
	r := trestle(t, "", "ringdown", "--json", "--picture", pic, "testdata/tap.csv")
	require.NoError(t, r.err)
	var rep RingdownReport
	decodeStrict(t, r.stdout, &rep)
	// Tolerances: noise of ±0.002 on a unit-2 amplitude over 30 cycles
	// limits ζ to a few per mille (ringdown's own tests bound its
	// methods); 1 % on ζ and 0.01 Hz on f are well outside that.
	assert.InDelta(t, fd, rep.DampedFrequency.Value, 0.01)
	assert.InEpsilon(t, zeta, rep.Ratio.Value, 0.01)
	// Textbook relations (Inman, Engineering Vibration, §1.6; loss factor
	// η = 2ζ and Q = 1/(2ζ) near resonance).
	// These are exact identities and JSON carries float64 exactly, so
	// exactTol is round-off only.
	const exactTol = 1e-12
	z := rep.Ratio.Value
	assert.InEpsilon(t, rep.DampedFrequency.Value/math.Sqrt(1-z*z), rep.NaturalFrequency.Value, exactTol)
	assert.InEpsilon(t, 2*math.Pi*z/math.Sqrt(1-z*z), rep.LogDecrement.Value, exactTol)
	assert.InEpsilon(t, 2*z, rep.LossFactor.Value, exactTol)
	assert.InEpsilon(t, 1/(2*z), rep.Q.Value, exactTol)
	assert.True(t, rep.Agree)
	assert.Len(t, rep.Methods, 4)
	assert.Equal(t, pic, rep.Picture)
	data, err := os.ReadFile(pic)
	require.NoError(t, err)
	require.NoError(t, xml.Unmarshal(data, new(struct{})), "the picture is well-formed XML")

	text := trestle(t, "", "ringdown", "testdata/tap.csv")
	require.NoError(t, text.err)
	for _, w := range []string{"natural frequency fn", "damping ratio ζ", "log decrement δ", "loss factor η", "quality factor Q", "specific damping capacity ψ", "The methods agree"} {
		assert.Contains(t, text.stdout, w)
	}
}

func TestGenerateThenAnalyse(t *testing.T) {
	dir := t.TempDir()
	out := filepath.Join(dir, "stand.toml")
	r := trestle(t, "", "generate", "--legs", "2x3", "--width", "1.5m", "--depth", "600", "--height", "800",
		"--section", "square-tube 50x3 mm", "--stretchers", "150", "--brace", "front,back,left,right", "--brace-pattern", "cross",
		"--feet", "z=50,h=5", "--loose", "--machine-mass", "400", "--machine-height", "300", "--out", out)
	require.NoError(t, r.err)
	assert.Contains(t, r.stdout, "wrote "+out)
	a := trestle(t, "", "analyse", "--json", out)
	require.NoError(t, a.err)
	var rep AnalysisReport
	decodeStrict(t, a.stdout, &rep)
	assert.Equal(t, 4+2, rep.Summary.Feet, "2 × 3 legs, a foot each")
	// The feet carry the machine and the frame: more than the machine's
	// weight alone (400 kg × standard gravity).
	assert.Greater(t, rep.Summary.FloorLoadN, 400*9.80665)
	// Writing to standard output gives the same file.
	s := trestle(t, "", "generate", "--legs", "2x3", "--width", "1.5m", "--depth", "600", "--height", "800",
		"--section", "square-tube 50x3 mm", "--stretchers", "150", "--brace", "front,back,left,right", "--brace-pattern", "cross",
		"--feet", "z=50,h=5", "--loose", "--machine-mass", "400", "--machine-height", "300")
	require.NoError(t, s.err)
	data, err := os.ReadFile(out)
	require.NoError(t, err)
	assert.Equal(t, string(data), s.stdout)

	// A second generate to the same file would lose the user's edits: it is
	// refused and the file stays as it was, unless --replace is given.
	edited := append(data, []byte("# my edit\n")...)
	require.NoError(t, os.WriteFile(out, edited, 0o644))
	again := []string{"generate", "--legs", "2x2", "--width", "1m", "--depth", "1m", "--height", "1m",
		"--section", "square 40 mm", "--out", out}
	g := trestle(t, "", again...)
	require.Error(t, g.err)
	assert.Contains(t, g.err.Error(), "--replace")
	kept, err := os.ReadFile(out)
	require.NoError(t, err)
	assert.Equal(t, string(edited), string(kept), "the edited file is untouched")
	g = trestle(t, "", append(again, "--replace")...)
	require.NoError(t, g.err)
	replaced, err := os.ReadFile(out)
	require.NoError(t, err)
	assert.NotContains(t, string(replaced), "# my edit")
}

func TestExport(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "sys")
	r := trestle(t, "", "export", "--dir", dir, "testdata/four-legs.toml")
	require.NoError(t, r.err)
	f, err := os.Open(filepath.Join(dir, "K.mtx"))
	require.NoError(t, err)
	defer f.Close()
	k, err := sparse.ReadMatrix(f)
	require.NoError(t, err)
	eqf, err := os.Open(filepath.Join(dir, "equations.csv"))
	require.NoError(t, err)
	defer eqf.Close()
	rows, err := csv.NewReader(eqf).ReadAll()
	require.NoError(t, err)
	require.Equal(t, k.N()+1, len(rows), "one row per equation plus the header")
	// The level top on fixed legs: only the group's three translations
	// are free (its rotations are held), so K is 3 × 3 and diagonal with
	// 4·12·EIz/L³ (X), 4·12·EIy/L³ (Y) and 4·EA/L (Z); see
	// TestFourLegsHandCheck.
	// Leg data from testdata/four-legs.toml; 1e-12: sums of four equal
	// exact terms written in shortest round-trip form, round-off only.
	const ea, eiy, eiz, l = 2e8, 1e4, 2e4, 1.0
	require.Equal(t, 3, k.N())
	assert.InEpsilon(t, 4*12*eiz/(l*l*l), k.At(0, 0), 1e-12) // 9.6e5 N/m
	assert.InEpsilon(t, 4*12*eiy/(l*l*l), k.At(1, 1), 1e-12) // 4.8e5 N/m
	assert.InEpsilon(t, 4*ea/l, k.At(2, 2), 1e-12)           // 8e8 N/m
	assert.Equal(t, []string{"1", "group", "top", "UX"}, rows[1][:4])
	for _, name := range []string{"M.mtx", "F-1-press.mtx", "F-2-push.mtx"} {
		_, err := os.Stat(filepath.Join(dir, name))
		assert.NoError(t, err, name)
	}
	ff, err := os.Open(filepath.Join(dir, "F-1-press.mtx"))
	require.NoError(t, err)
	defer ff.Close()
	load, err := sparse.ReadVector(ff)
	require.NoError(t, err)
	assert.Equal(t, []float64{0, 0, -4000}, load)
}

// TestModesHandCheck: a 120 kg rigid top on the four legs of
// four-legs.toml, held level: three modes, sway along Y on k = 4·12·EIy/L³,
// along X on 4·12·EIz/L³ and bounce on k = 4·EA/L, each f = √(k/m)/2π (a mass on
// a spring; Inman, Engineering Vibration, §1.1). Every leg has loss
// factor 0.02, so every mode has η = 0.02 (modal strain energy: Ungar and
// Kerwin 1962, one material).
func TestModesHandCheck(t *testing.T) {
	const (
		mass, EIy, EIz, EA, L = 120.0, 1e4, 2e4, 2e8, 1.0
		eta                   = 0.02
		tol                   = 1e-6 // dense eigen solve of a 3 × 3 problem; round-off only
	)
	fY := math.Sqrt(4*12*EIy/(L*L*L)/mass) / (2 * math.Pi)
	fX := math.Sqrt(4*12*EIz/(L*L*L)/mass) / (2 * math.Pi)
	fBounce := math.Sqrt(4*EA/L/mass) / (2 * math.Pi)
	pic := filepath.Join(t.TempDir(), "mode.svg")
	r := trestle(t, "", "modes", "--json", "--picture", pic, "testdata/four-legs.toml")
	require.NoError(t, r.err)
	var rep ModesCommandReport
	decodeStrict(t, r.stdout, &rep)
	require.Len(t, rep.Modes.Modes, 3, "three free directions: the top's translations")
	m := rep.Modes.Modes
	assert.InEpsilon(t, fY, m[0].FrequencyHz, tol)
	assert.InEpsilon(t, fX, m[1].FrequencyHz, tol)
	assert.InEpsilon(t, fBounce, m[2].FrequencyHz, tol)
	require.NotNil(t, rep.FirstFrequencyHz)
	assert.InEpsilon(t, fY, *rep.FirstFrequencyHz, tol)
	// Each mode moves the whole mass along one axis.
	assert.InEpsilon(t, 1, m[0].Participation[1], tol)
	assert.InEpsilon(t, 1, m[1].Participation[0], tol)
	assert.InEpsilon(t, 1, m[2].Participation[2], tol)
	assert.Equal(t, "sway along Y", m[0].Motion)
	assert.Equal(t, "bounce (vertical)", m[2].Motion)
	for _, md := range m {
		assert.InEpsilon(t, eta, md.LossFactor[1], tol)
		assert.InEpsilon(t, eta/2, md.DampingRatio, tol)
	}
	assert.InEpsilon(t, mass, rep.Modes.TotalMassKg[2], tol)
	data, err := os.ReadFile(pic)
	require.NoError(t, err)
	assert.Equal(t, map[string]int{"leg-1": 4, "leg-2": 4, "leg-3": 4, "leg-4": 4}, svgMembers(t, data))
}

// TestResponseHandCheck: the same mass on springs with loss factor η
// taken as viscous damping ζ = η/2. Driving-point receptance of one
// degree of freedom, H = 1/(k − ω²m + i·2ζ·ω·ωₙ·m): static stiffness k at
// low frequency, and the smallest dynamic stiffness 2ζ·√(1 − ζ²)·k at the
// peak ω = ωₙ·√(1 − 2ζ²) (Inman, Engineering Vibration, §2.2).
func TestResponseHandCheck(t *testing.T) {
	const (
		mass, EI, L = 120.0, 1e4, 1.0
		zeta        = 0.01
	)
	k := 4 * 12 * EI / (L * L * L)
	fn := math.Sqrt(k/mass) / (2 * math.Pi)
	csvPath := filepath.Join(t.TempDir(), "frf.csv")
	r := trestle(t, "", "response", "--json", "--band", "0.05-40", "--points", "800", "--csv", csvPath, "testdata/four-legs.toml")
	require.NoError(t, r.err)
	var rep ResponseReport
	decodeStrict(t, r.stdout, &rep)
	require.Len(t, rep.Probes, 3)
	x := rep.Probes[1] // along Y, where k = 4·12·EIy/L³
	assert.Equal(t, "centre", x.Place)
	assert.Equal(t, "UY", x.Direction)
	// At 0.05 Hz the dynamic term is (0.05/10.07)² ≈ 2.5e-5 of k.
	assert.InEpsilon(t, k, x.StaticNPerM, 1e-4)
	require.NotEmpty(t, x.Peaks)
	// The peak is refined by golden-section search: its frequency and
	// height agree with the closed form to the search tolerance.
	assert.InEpsilon(t, fn*math.Sqrt(1-2*zeta*zeta), x.Peaks[0].FrequencyHz, 1e-6)
	assert.InEpsilon(t, 2*zeta*math.Sqrt(1-zeta*zeta)*k, x.Peaks[0].DynamicNPerM, 1e-6)
	assert.InEpsilon(t, 2*zeta*math.Sqrt(1-zeta*zeta)*k, x.MinDynamicNPerM, 1e-6)
	rows, err := os.ReadFile(csvPath)
	require.NoError(t, err)
	recs, err := csv.NewReader(bytes.NewReader(rows)).ReadAll()
	require.NoError(t, err)
	assert.Len(t, recs, 801, "a header and one row per frequency")
	assert.Len(t, recs[0], 1+2*3, "frequency, then magnitude and phase per probe")
}

// TestRingdownMaterialIntoModel: the measured loss factor goes into a
// model file through the printed material entry, and the modes of a stand
// whose strain energy is all in that material then carry it (modal strain
// energy with one material: η_mode = η_material).
func TestRingdownMaterialIntoModel(t *testing.T) {
	r := trestle(t, "", "ringdown", "--json", "--material", "steel S235", "testdata/tap.csv")
	require.NoError(t, r.err)
	var rep RingdownReport
	decodeStrict(t, r.stdout, &rep)
	require.Contains(t, rep.ModelMaterial, `from = "steel S235"`)
	model, err := os.ReadFile("testdata/steel-legs.toml")
	require.NoError(t, err)
	text := strings.Replace(string(model), `material = "steel S235"`, `material = "steel S235 (measured)"`, 1) + "\n" + rep.ModelMaterial
	m := trestle(t, text, "modes", "--json", "-")
	require.NoError(t, m.err)
	var modes ModesCommandReport
	decodeStrict(t, m.stdout, &modes)
	require.NotEmpty(t, modes.Modes.Modes)
	// The entry is written to three significant figures.
	assert.InEpsilon(t, rep.LossFactor.Value, modes.Modes.Modes[0].LossFactor[1], 5e-3)
}

// A name or spec typed without quotes reads as the quoted one: the words are
// joined with spaces.
func TestUnquotedWords(t *testing.T) {
	for _, tc := range []struct{ name, quoted string }{
		{"sections", "square-tube 50x3 mm"},
		{"materials", "steel S235"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			q := trestle(t, "", tc.name, tc.quoted)
			require.NoError(t, q.err)
			u := trestle(t, "", append([]string{tc.name}, strings.Fields(tc.quoted)...)...)
			require.NoError(t, u.err)
			assert.Equal(t, q.stdout, u.stdout)
			assert.Contains(t, u.stdout, tc.quoted)
		})
	}
}
