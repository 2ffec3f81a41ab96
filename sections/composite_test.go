package sections

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
)

func mustLookup(t *testing.T, name string) materials.Material {
	t.Helper()
	m, err := materials.Lookup(name)
	require.NoError(t, err)
	return m
}

func TestFilledRoundTubeTransformed(t *testing.T) {
	// Transformed section (Gere & Goodno, Mechanics of Materials §6.2):
	// EA = Es·As + Ec·Ac, EI = Es·Is + Ec·Ic, m = ρs·As + ρc·Ac, by hand
	// from the annulus and circle formulas.
	steel, conc := mustLookup(t, "steel S235"), mustLookup(t, "concrete C25/30")
	D, tw := 114.3*mm, 3.6*mm
	d := D - 2*tw
	as, ac := math.Pi/4*(D*D-d*d), math.Pi/4*d*d
	is, ic := math.Pi/64*(math.Pow(D, 4)-math.Pow(d, 4)), math.Pi/64*math.Pow(d, 4)
	js, jc := 2*is, 2*ic
	f := Filled{Tube: RoundTube{D: D, T: tw}, Shell: steel, Fill: conc}
	parts, err := f.Parts()
	require.NoError(t, err)
	for _, lv := range materials.Levels {
		t.Run(lv.String(), func(t *testing.T) {
			es, ec := steel.E.At(lv), conc.E.At(lv)
			ea, eiy, eiz, gj, m := Transformed(parts, lv)
			relClose(t, "EA", es*as+ec*ac, ea, exact)
			relClose(t, "EIy", es*is+ec*ic, eiy, exact)
			relClose(t, "EIz", es*is+ec*ic, eiz, exact)
			relClose(t, "GJ", steel.ShearModulus(lv)*js+conc.ShearModulus(lv)*jc, gj, exact)
			relClose(t, "mass", steel.Density*as+conc.Density*ac, m, exact)
		})
	}
	// The Props of the composite are the tube's.
	tube := props(t, RoundTube{D: D, T: tw})
	assert.Equal(t, tube.A, props(t, f).A)
	mpl, err := f.MassPerLength()
	require.NoError(t, err)
	relClose(t, "MassPerLength", steel.Density*as+conc.Density*ac, mpl, exact)
}

func TestFilledWithSandIsMassOnly(t *testing.T) {
	// Dry sand is MassOnly: EA and EI are the steel's alone; the sand
	// adds ρ·A of the core to the mass (materials catalogue: 1600 kg/m³).
	steel, sand := mustLookup(t, "steel S235"), mustLookup(t, "sand")
	require.True(t, sand.MassOnly)
	tube := RectTube{H: 100 * mm, B: 100 * mm, T: 5 * mm}
	f := Filled{Tube: tube, Shell: steel, Fill: sand}
	parts, err := f.Parts()
	require.NoError(t, err)
	ea, eiy, _, gj, m := Transformed(parts, materials.Nominal)
	p := props(t, tube)
	relClose(t, "EA steel only", steel.E.Nominal*p.A, ea, exact)
	relClose(t, "EI steel only", steel.E.Nominal*p.Iy, eiy, exact)
	relClose(t, "GJ steel only", steel.ShearModulus(materials.Nominal)*p.J, gj, exact)
	core := 90 * 90 * mm * mm // sharp corners, as given: (B − 2t)²
	relClose(t, "mass", steel.Density*p.A+sand.Density*core, m, exact)
}

func TestFilledRectTubeCoreWithCorners(t *testing.T) {
	// EN 10219 100×100×5: inner radius ri = ro − t = 5 mm, so the core is
	// 90 × 90 mm less (4 − π)·ri² at the corners (hand calculation).
	f := Filled{Tube: RectTube{H: 100 * mm, B: 100 * mm, T: 5 * mm, Conv: EN10219},
		Shell: mustLookup(t, "steel S355"), Fill: mustLookup(t, "concrete C25/30")}
	parts, err := f.Parts()
	require.NoError(t, err)
	ri := 5 * mm
	relClose(t, "core A", 90*90*mm*mm-(4-math.Pi)*ri*ri, parts[1].A, exact)
	// Tube plus core fill the outer rounded square: ro = 10 mm.
	ro := 10 * mm
	relClose(t, "A total", 100*100*mm*mm-(4-math.Pi)*ro*ro, parts[0].A+parts[1].A, exact)
}

func TestGroutedBlock(t *testing.T) {
	// Net section plus grouted cores fill the gross rectangle L·W, and
	// their second moments add to the gross W·L³/12 (superposition).
	b, err := NominalBlock(8)
	require.NoError(t, err)
	g := GroutedBlock{Block: b, Unit: mustLookup(t, "masonry concrete grouted"), Grout: mustLookup(t, "concrete C20/25")}
	parts, err := g.Parts()
	require.NoError(t, err)
	require.Len(t, parts, 2)
	relClose(t, "A", b.Gross(), parts[0].A+parts[1].A, exact)
	relClose(t, "Iy", b.W*math.Pow(b.L, 3)/12, parts[0].Iy+parts[1].Iy, exact)
	relClose(t, "Iz", b.L*math.Pow(b.W, 3)/12, parts[0].Iz+parts[1].Iz, exact)
	relClose(t, "grout A (2 cores 5.125 × 6.3125 in)", 2*5.125*6.3125*in2, parts[1].A, exact)
}

func TestCompositeErrors(t *testing.T) {
	steel := mustLookup(t, "steel S235")
	sand := mustLookup(t, "sand")
	for _, tc := range []struct {
		name string
		c    Composite
		want string
	}{
		{"not a tube", Filled{Tube: Rect{B: 1, H: 1}, Shell: steel, Fill: sand}, "not a tube"},
		{"no fill", Filled{Tube: RoundTube{D: 0.1, T: 0.005}, Shell: steel}, "fill material is not set"},
		{"sand shell", Filled{Tube: RoundTube{D: 0.1, T: 0.005}, Shell: sand, Fill: sand}, "no stiffness"},
		{"bad tube", Filled{Tube: RoundTube{D: 0.1, T: 0.06}, Shell: steel, Fill: sand}, "half the diameter"},
		{"no grout", GroutedBlock{Block: Block{L: 0.39, W: 0.19, FaceShell: 0.03, Web: 0.025}, Unit: steel}, "grout material"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := tc.c.Parts()
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
		})
	}
}
