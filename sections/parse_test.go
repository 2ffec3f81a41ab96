package sections

import (
	"math"
	"reflect"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// sameSection asserts got is the same type as want with fields equal to
// within conversion rounding (60.3/1000 in the parser against 60.3*mm here).
func sameSection(t *testing.T, want, got Section) {
	t.Helper()
	require.Equal(t, reflect.TypeOf(want), reflect.TypeOf(got))
	wv, gv := reflect.ValueOf(want), reflect.ValueOf(got)
	for i := range wv.NumField() {
		name := wv.Type().Field(i).Name
		w, g := wv.Field(i), gv.Field(i)
		switch w.Kind() {
		case reflect.Float64:
			assert.InDeltaf(t, w.Float(), g.Float(), 1e-15*math.Abs(w.Float()), "field %s", name)
		case reflect.Interface:
			sameSection(t, w.Interface().(Section), g.Interface().(Section))
		case reflect.Struct:
			if w.Type().Name() == "Material" {
				assert.Equalf(t, w.FieldByName("Name").String(), g.FieldByName("Name").String(), "field %s", name)
			} else {
				sameSection(t, w.Interface().(Section), g.Interface().(Section))
			}
		default:
			assert.Equalf(t, w.Interface(), g.Interface(), "field %s", name)
		}
	}
}

func TestParseGood(t *testing.T) {
	steel, conc, sand := mustLookup(t, "steel S235"), mustLookup(t, "concrete C25/30"), mustLookup(t, "sand dry")
	b8, _ := NominalBlock(8)
	for _, tc := range []struct {
		spec string
		want Section
	}{
		{"rect 100x20 mm", Rect{B: 100 * mm, H: 20 * mm}},
		{"RECT 100X20 MM", Rect{B: 100 * mm, H: 20 * mm}},
		{"rect 100x20mm", Rect{B: 100 * mm, H: 20 * mm}},
		{"rect 100 x 20 mm", Rect{B: 100 * mm, H: 20 * mm}},
		{"rect 100×20 mm", Rect{B: 100 * mm, H: 20 * mm}},
		{"rectangle 10x2 cm", Rect{B: 100 * mm, H: 20 * mm}},
		{"square 40 mm", Square{B: 40 * mm}},
		{"round 1.5 in", Round{D: 1.5 * in}},
		{"round 0.04 m", Round{D: 40 * mm}},
		{"flat 50x10 mm", Flat{W: 50 * mm, T: 10 * mm}},
		{"round-tube 60.3x3.2 mm", RoundTube{D: 60.3 * mm, T: 3.2 * mm}},
		{"chs 60.3x3.2 mm", RoundTube{D: 60.3 * mm, T: 3.2 * mm}},
		{"round-tube 4.5x0.237 in aisc", RoundTube{D: 4.5 * in, T: 0.237 * in, Conv: AISC}},
		{"square-tube 50x3 mm", RectTube{H: 50 * mm, B: 50 * mm, T: 3 * mm}},
		{"square-tube 2x3/16 in aisc", RectTube{H: 2 * in, B: 2 * in, T: 3.0 / 16 * in, Conv: AISC}},
		{"rect-tube 100x50x4 mm r=8", RectTube{H: 100 * mm, B: 50 * mm, T: 4 * mm, R: 8 * mm}},
		{"rect-tube 100x50x4 mm r=0.8cm", RectTube{H: 100 * mm, B: 50 * mm, T: 4 * mm, R: 8 * mm}},
		{"rect-tube 100x50x4 mm en10219", RectTube{H: 100 * mm, B: 50 * mm, T: 4 * mm, Conv: EN10219}},
		{"rhs 6x4x1/4 in aisc", RectTube{H: 6 * in, B: 4 * in, T: 0.25 * in, Conv: AISC}},
		{"pipe 2in sch40", Pipe{NPS: "2", Schedule: "40"}},
		{"pipe 2 sch 80", Pipe{NPS: "2", Schedule: "80"}},
		{"pipe 1-1/2in std aisc", Pipe{NPS: "1-1/2", Schedule: "std", Conv: AISC}},
		{"angle 50x50x5 mm r=7 rt=3.5", Angle{B: 50 * mm, H: 50 * mm, T: 5 * mm, R: 7 * mm, RT: 3.5 * mm}},
		{"channel 100x50x6x8.5 mm", Channel{H: 100 * mm, B: 50 * mm, TW: 6 * mm, TF: 8.5 * mm}},
		{"i-shape 200x100x5.6x8.5 mm r=12", IShape{H: 200 * mm, B: 100 * mm, TW: 5.6 * mm, TF: 8.5 * mm, R: 12 * mm}},
		{"lumber 2x4", Lumber{Thick: 2, Wide: 4}},
		{"lumber 2x6 x3", Lumber{Thick: 2, Wide: 6, Plies: 3}},
		{"block 8in", b8},
		{"block 8 in ungrouted", b8},
		{"block 390x190 mm", Block{L: 390 * mm, W: 190 * mm, FaceShell: 30 * mm, Web: 25 * mm}},
		{"block 390x190 mm fs=32 web=28 webs=2", Block{L: 390 * mm, W: 190 * mm, FaceShell: 32 * mm, Web: 28 * mm, Webs: 2}},
		{"block 8in grouted", GroutedBlock{Block: b8, Unit: mustLookup(t, "masonry concrete grouted"), Grout: mustLookup(t, "concrete C20/25")}},
		{"block 8in grouted with concrete C25/30", GroutedBlock{Block: b8, Unit: mustLookup(t, "masonry concrete grouted"), Grout: conc}},
		{"filled square-tube 100x5 mm with concrete C25/30", Filled{Tube: RectTube{H: 100 * mm, B: 100 * mm, T: 5 * mm}, Shell: steel, Fill: conc}},
		{"filled round-tube 114.3x3.6 mm of steel S355 with sand", Filled{Tube: RoundTube{D: 114.3 * mm, T: 3.6 * mm}, Shell: mustLookup(t, "steel S355"), Fill: sand}},
		{"filled pipe 4in sch40 with mineral casting", Filled{Tube: Pipe{NPS: "4", Schedule: "40"}, Shell: steel, Fill: mustLookup(t, "epoxy granite")}},
		{"general A=12.3cm2 Iy=100cm4 Iz=50cm4 J=20cm4", General{A: 12.3 * cm2, Iy: 100 * cm4, Iz: 50 * cm4, J: 20 * cm4}},
		{"general a=1230mm² iy=1e6mm^4 iz=0.5e6mm4 j=2e5mm4 asy=6cm2 cz=5cm", General{A: 12.3 * cm2, Iy: 100 * cm4, Iz: 50 * cm4, J: 20 * cm4, AsY: 6 * cm2, CZ: 5 * cm}},
	} {
		t.Run(tc.spec, func(t *testing.T) {
			got, err := Parse(tc.spec)
			require.NoError(t, err)
			sameSection(t, tc.want, got)
			roundTrip(t, got)
		})
	}
}

func TestParseBad(t *testing.T) {
	for _, tc := range []struct{ spec, want string }{
		{"", "empty"},
		{"   ", "empty"},
		{"rund 40 mm", `did you mean "round"`},
		{"squaretube 50x3 mm", `did you mean "square-tube"`},
		// "hs" is one edit from the aliases chs, rhs and shs: the tie goes to
		// the first alias in sort order (chs, a round tube), every time.
		{"hs 50x3 mm", `did you mean "round-tube"`},
		{"wibble", "unknown shape"},
		{"100x20 mm", "give the shape first"},
		{"round-tube 60.3x3.2", "missing unit"},
		{"round-tube 60.3x3.2 aisc", "missing unit"},
		{"round-tube 60.3x3.2 furlong", `unknown unit "furlong"`},
		{"round 0 mm", "zero"},
		{"round -5 mm", "negative"},
		{"round-tube 60x30 mm", "not less than half the diameter"},
		{"square-tube 50x25 mm", "half the smaller side"},
		{"rect nanxnan mm", "not a number"},
		{"rect infx3 mm", "not a number"},
		{"rect 0x1e3 mm", "zero"},
		{"rect 1e400x3 mm", "out of range"},
		{"rect 1e-9x1 mm", "smaller than"},
		{"rect 1e9x1 mm", "larger than"},
		{"rect 0x10x3 mm", "needs 2 size"},
		{"rect 10 mm", "needs 2 size"},
		{"rect 1/0x3 mm", "divides by zero"},
		{"rect 0x1p3x3 mm", "needs 2 size"},
		{"rect 100x20 mm r=3", "unexpected"},
		{"square-tube 50x3 mm q=4", "unknown option"},
		{"square-tube 50x3 mm aisc en10219", "not both"},
		{"pipe", "nominal size"},
		{"pipe 2in", "schedule"},
		{"pipe 2in sch30", "unknown schedule"},
		{"pipe 2in schedule40", "should read"},
		{"pipe 9in sch40", "unknown nominal size"},
		{"pipe 3-1/2in sch160", "not made"},
		{"lumber 2x4 mm", "take no unit"},
		{"lumber 2x6x3", "plies apart"},
		{"lumber 2x30", "not a sawn lumber size"},
		{"lumber 2.5x4", "not a nominal size"},
		{"lumber 2x4 x0", "zero plies"},
		{"block 7in", "not one of"},
		{"block 390x190 mm fs=100", "face shells"},
		{"block 390x190 mm webs=1", "cross webs"},
		{"block 8in with grout", "takes no material"},
		{"block 8in grouted with unobtainium", "no material"},
		{"rect 100x20 mm with steel S235", "takes no material"},
		{"filled rect 10x10 mm with concrete C25/30", "only a tube"},
		{"filled square-tube 100x5 mm", "needs its fill"},
		{"filled square-tube 100x5 mm with", "no material name"},
		{"filled square-tube 100x5 mm with unobtainium", "no material"},
		{"filled square-tube 100x5 mm of sand with sand", "no stiffness"},
		{"filled", "needs a tube"},
		{"filled filled round-tube 60x3 mm with sand", "twice"},
		{"with concrete", "before the shape"},
		{"general A=1cm2 Iy=1cm4 Iz=1cm4", "J= is missing"},
		{"general A=1cm4 Iy=1cm4 Iz=1cm4 J=1cm4", "power 2"},
		{"general A=1 Iy=1cm4 Iz=1cm4 J=1cm4", "give a unit"},
		{"general A=1cm2 Iy=1cm4 Iz=1cm4 J=5cm4", "larger than Iy + Iz"},
		{"general A=1cm2 A=1cm2", "twice"},
		{"general A=1cm2 Iy=1cm4 Iz=1cm4 J=1cm4 K=3", "unknown item"},
		{"general A=1cm2 Iy=1cm4 Iz=1cm4 J=1cm4 Asy=2cm2", "shear area"},
		{"rect 1\x00x2 mm", "control character"},
		{"rect \xff mm", "UTF-8"},
		{strings.Repeat("rect ", 100), "longer than"},
	} {
		t.Run(tc.spec, func(t *testing.T) {
			s, err := Parse(tc.spec)
			require.Error(t, err, "parsed as %#v", s)
			assert.Contains(t, err.Error(), tc.want)
			assert.True(t, strings.HasPrefix(err.Error(), "sections: spec "), err.Error())
		})
	}
}

func TestListExamplesParse(t *testing.T) {
	list := List()
	require.NotEmpty(t, list)
	seen := map[string]bool{}
	for _, k := range list {
		t.Run(k.Name, func(t *testing.T) {
			assert.False(t, seen[k.Name], "duplicate kind")
			seen[k.Name] = true
			assert.NotEmpty(t, k.Description)
			s, err := Parse(k.Example)
			require.NoError(t, err)
			assert.True(t, strings.HasPrefix(Spec(s), k.Name+" "), "Spec %q does not start with the kind", Spec(s))
			roundTrip(t, s)
		})
	}
}

func TestSpecChoosesUnits(t *testing.T) {
	// Specs keep the units a person would write: mm for metric sizes, in
	// for inch sizes.
	for _, tc := range []struct {
		s    Section
		want string
	}{
		{Rect{B: 100 * mm, H: 20 * mm}, "rect 100x20 mm"},
		{RectTube{H: 6 * in, B: 4 * in, T: 0.25 * in, Conv: AISC}, "rect-tube 6x4x0.25 in aisc"},
		{RectTube{H: 50 * mm, B: 50 * mm, T: 3 * mm, R: 6 * mm}, "square-tube 50x3 mm r=6"},
		{Lumber{Thick: 2, Wide: 6, Plies: 3}, "lumber 2x6 x3"},
		{Pipe{NPS: "1-1/2", Schedule: "80"}, "pipe 1-1/2in sch80"},
		{General{A: 12.3 * cm2, Iy: 100 * cm4, Iz: 50 * cm4, J: 20 * cm4}, "general A=12.3cm2 Iy=100cm4 Iz=50cm4 J=20cm4"},
	} {
		assert.Equal(t, tc.want, Spec(tc.s))
	}
}

func TestGeneral(t *testing.T) {
	g := General{A: 12.3 * cm2, Iy: 100 * cm4, Iz: 50 * cm4, J: 20 * cm4, CY: 4 * cm, CZ: 5 * cm}
	p := props(t, g)
	relClose(t, "Sy = Iy/cz", 100.0/5*cm*cm2, p.Sy, exact)
	relClose(t, "Sz = Iz/cy", 50.0/4*cm*cm2, p.Sz, exact)
	relClose(t, "Ry", math.Sqrt(100/12.3)*cm, p.Ry, exact)
	// A round bar given as General has the same properties: J = Iy + Iz
	// exactly (the limit of Saint-Venant's inequality).
	r := props(t, Round{D: 40 * mm})
	_, err := General{A: r.A, Iy: r.Iy, Iz: r.Iz, J: r.J}.Properties()
	assert.NoError(t, err)
	for _, bad := range []General{{}, {A: 1, Iy: 1, Iz: 1, J: math.NaN()}, {A: 1, Iy: 1, Iz: 1, J: 1, AsY: -1}, {A: 1, Iy: 1, Iz: 1, J: 1, CY: math.Inf(1)}} {
		_, err := bad.Properties()
		assert.Error(t, err, "%+v", bad)
	}
}
