package sections

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestRectTubeAISCTables(t *testing.T) {
	// AISC Steel Construction Manual, HSS dimensions and properties
	// (design wall 0.93·t_nom, outside corner radius 2·t_des). Values as
	// listed on steelcalculator.app's HSS pages, which reproduce the AISC
	// shapes database (checked by search); HSS2x2x3/16 from memory.
	for _, tc := range []struct {
		name       string
		h, b, tnom float64 // in
		a, ix, iy  float64 // in², in⁴
		j          float64 // in⁴; 0: not checked
		src        string
	}{
		{"HSS2x2x3/16", 2, 2, 3.0 / 16, 1.19, 0.641, 0.641, 0, "AISC Manual 15th ed. Table 1-12, from memory"},
		{"HSS4x4x3/16", 4, 4, 3.0 / 16, 2.58, 6.21, 6.21, 10.0, "steelcalculator.app/sections/hss4x4x3-16 (AISC database)"},
		{"HSS2-1/4x2-1/4x3/16", 2.25, 2.25, 3.0 / 16, 1.37, 0.953, 0.953, 1.60, "steelcalculator.app/sections/hss2-1-4x2-1-4x3-16"},
		{"HSS3x2x3/16", 3, 2, 3.0 / 16, 1.54, 1.77, 0.932, 2.05, "steelcalculator.app/sections/hss3x2x3-16"},
		{"HSS6x4x3/16", 6, 4, 3.0 / 16, 3.28, 16.4, 8.76, 18.2, "steelcalculator.app/sections/hss6x4x3-16"},
		{"HSS12x6x1/4", 12, 6, 0.25, 8.03, 151, 51.9, 124, "steelcalculator.app/sections/hss12x6x1-4"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			p := props(t, RectTube{H: tc.h * in, B: tc.b * in, T: tc.tnom * in, Conv: AISC})
			relClose(t, "A "+tc.src, tc.a*in2, p.A, table3)
			relClose(t, "Ix "+tc.src, tc.ix*in4, p.Iy, table3)
			relClose(t, "Iy "+tc.src, tc.iy*in4, p.Iz, table3)
			if tc.j > 0 {
				// The AISC database's J uses its own thin-wall formula;
				// our EN 10219-2 form agrees within 1.5 % (the small
				// tubes, where the corners are a larger share, differ most).
				const jFormulas = 0.015
				relClose(t, "J "+tc.src, tc.j*in4, p.J, jFormulas)
			}
		})
	}
}

func TestSquareTubeTwoInchThreeSixteenths(t *testing.T) {
	// Common practice check value: a 2 in square tube with a 3/16 in wall
	// "has an area near 8.8e-4 m²". That is the nominal wall with sharp
	// corners, 4·t·(b − t) = 1.359 in² = 8.77e-4 m² (hand calculation);
	// the AISC design wall with 2t corners gives 1.19 in² = 7.7e-4 m²
	// (AISC Manual, HSS2x2x3/16, from memory).
	sharp := props(t, RectTube{H: 2 * in, B: 2 * in, T: 3.0 / 16 * in})
	relClose(t, "sharp, nominal wall", 4*(3.0/16)*(2-3.0/16)*in2, sharp.A, exact)
	relClose(t, "8.8e-4 m² (common practice, 2 digits)", 8.8e-4, sharp.A, 0.005)
	aisc := props(t, RectTube{H: 2 * in, B: 2 * in, T: 3.0 / 16 * in, Conv: AISC})
	relClose(t, "AISC 1.19 in²", 7.7e-4, aisc.A, 0.005) // 0.005: 7.7e-4 is 2 figures of 1.19 in² = 7.68e-4 m² (0.3 %)
}

func TestRectTubeEN10219(t *testing.T) {
	// EN 10219-2 cold-formed SHS 100×100×5: A = 18.4 cm², I = 271 cm⁴,
	// Wel = 54.2 cm³, i = 3.84 cm, It = 441 cm⁴ (EN 10219-2 Table B.3 /
	// makers' tables, from memory); corner radii ro = 2t = 10 mm, ri = t.
	p := props(t, RectTube{H: 100 * mm, B: 100 * mm, T: 5 * mm, Conv: EN10219})
	relClose(t, "A", 18.4*cm2, p.A, table3)
	relClose(t, "I", 271*cm4, p.Iy, table3)
	relClose(t, "Wel", 54.2*cm*cm2, p.Sy, table3)
	relClose(t, "i", 3.84*cm, p.Ry, table3)
	relClose(t, "It", 441*cm4, p.J, table3)
	// Corner radius rule of EN 10219-2: 2t (t <= 6), 2.5t (6 < t <= 10), 3t.
	for _, tc := range []struct{ t, ro float64 }{{5 * mm, 10 * mm}, {8 * mm, 20 * mm}, {12 * mm, 36 * mm}} {
		_, ro, ri := RectTube{H: 200 * mm, B: 200 * mm, T: tc.t, Conv: EN10219}.geometry()
		relClose(t, "ro", tc.ro, ro, exact)
		relClose(t, "ri", tc.ro-tc.t, ri, exact)
	}
}

func TestRectTubeClosedForms(t *testing.T) {
	// Sharp-cornered tube: I = (B·H³ − b·h³)/12 with b = B − 2t, h = H − 2t
	// (Gere & Goodno App. D); Bredt, thin wall: J = 4·Am²·t/pm with
	// Am = (B − t)(H − t), pm = 2(B + H − 2t) (Roark 8th ed. Table 10.7
	// case 16), plus the open-wall term t³·pm/3.
	B, H, tw := 60*mm, 100*mm, 3*mm
	p := props(t, RectTube{H: H, B: B, T: tw})
	b, h := B-2*tw, H-2*tw
	relClose(t, "A", B*H-b*h, p.A, exact)
	relClose(t, "Iy", (B*H*H*H-b*h*h*h)/12, p.Iy, exact)
	relClose(t, "Iz", (H*B*B*B-h*b*b*b)/12, p.Iz, exact)
	am, pm := (B-tw)*(H-tw), 2*(B+H-2*tw)
	relClose(t, "J Bredt", 4*am*am*tw/pm+tw*tw*tw*pm/3, p.J, exact)
	relClose(t, "AsZ web area", 2*H*tw, p.AsZ, exact) // common practice
	// Rounded corners with ro = B/2 = H/2 make a circle: the annulus.
	c := props(t, RectTube{H: 50 * mm, B: 50 * mm, T: 5 * mm, R: 25 * mm})
	ann := annulusProps(50*mm, 40*mm)
	// 1e-9, not exact: the tube path sums corner arcs and flats, the annulus takes
	// D⁴ − d⁴ directly; the differences of close fourth powers lose a few digits.
	relClose(t, "circle A", ann.A, c.A, 1e-9)
	relClose(t, "circle I", ann.Iy, c.Iy, 1e-9)
}

func TestRoundTube(t *testing.T) {
	// Annulus (exact): A = π(D² − d²)/4, I = π(D⁴ − d⁴)/64, J = 2I.
	D, tw := 60.3*mm, 3.2*mm
	d := D - 2*tw
	p := props(t, RoundTube{D: D, T: tw})
	relClose(t, "A", math.Pi/4*(D*D-d*d), p.A, exact)
	relClose(t, "I", math.Pi/64*(math.Pow(D, 4)-math.Pow(d, 4)), p.Iy, exact)
	relClose(t, "J", math.Pi/32*(math.Pow(D, 4)-math.Pow(d, 4)), p.J, exact)
	// EN 10219-2 CHS 60.3×3.2: A = 5.74 cm², I = 23.5 cm⁴ (from memory).
	relClose(t, "CHS A", 5.74*cm2, p.A, table3)
	relClose(t, "CHS I", 23.5*cm4, p.Iy, table3)
	// Thin wall: shear area → A/2 (Timoshenko); Cowper's 2(1+ν)/(4+3ν)
	// = 0.531 at ν = 0.3 (Cowper 1966, Table 1, thin-walled round tube).
	thin := props(t, RoundTube{D: 1, T: 1e-4})
	relClose(t, "thin kappa (Cowper)", 2*1.3/4.9, thin.AsY/thin.A, 1e-3) // t/D = 1e-4, not 0: the limit is approached as O(t/D)
	// AISC HSS4.500x0.237: t_des = 0.220 in, A = 2.96 in², I = 6.79 in⁴
	// (AISC Manual round HSS table, from memory).
	h := props(t, RoundTube{D: 4.5 * in, T: 0.237 * in, Conv: AISC})
	relClose(t, "HSS4.500x0.237 A", 2.96*in2, h.A, table3)
	relClose(t, "HSS4.500x0.237 I", 6.79*in4, h.Iy, table3)
}

func TestPipe(t *testing.T) {
	// ASME B36.10M: NPS 2 OD 2.375 in; Sch 40 wall 0.154, Sch 80 0.218
	// (from memory; the AISC Manual pipe table lists the same).
	tube, err := Pipe{NPS: "2", Schedule: "40"}.Tube()
	require.NoError(t, err)
	relClose(t, "OD", 2.375*in, tube.D, exact)
	relClose(t, "wall", 0.154*in, tube.T, exact)
	// Nominal wall: A = 1.07 in², I = 0.666 in⁴ (ASME/Crane pipe data, from memory).
	p := props(t, Pipe{NPS: "2", Schedule: "std"})
	relClose(t, "Sch 40 A", 1.07*in2, p.A, table3)
	relClose(t, "Sch 40 I", 0.666*in4, p.Iy, table3)
	// AISC Manual Table 1-14, Pipe 2 Std with design wall 0.93·t = 0.143:
	// I = 0.627 in⁴, r = 0.791 in (from memory). The brief recalled
	// A = 1.02 in²; I/r² = 1.00 in², and π·t·(D − t) = 1.003 in², so 1.00
	// is the consistent figure and is what we check.
	a := props(t, Pipe{NPS: "2", Schedule: "40", Conv: AISC})
	relClose(t, "Pipe 2 Std I", 0.627*in4, a.Iy, table3)
	relClose(t, "Pipe 2 Std r", 0.791*in, a.Ry, table3)
	relClose(t, "Pipe 2 Std A = I/r²", 0.627/(0.791*0.791)*in2, a.A, 0.01)
	// NPS 4 Sch 80: OD 4.500, wall 0.337 (ASME B36.10M, from memory).
	four, err := Pipe{NPS: "4", Schedule: "xs"}.Tube()
	require.NoError(t, err)
	relClose(t, "NPS 4 XS wall", 0.337*in, four.T, exact)

	for _, bad := range []Pipe{{NPS: "9", Schedule: "40"}, {NPS: "2", Schedule: "30"}, {NPS: "3-1/2", Schedule: "160"}} {
		_, err := bad.Properties()
		assert.Error(t, err, "%+v", bad)
	}
	// Every listed size: walls increase with schedule.
	for _, s := range pipeSizes {
		assert.Less(t, s.sch10, s.sch40, s.nps)
		assert.Less(t, s.sch40, s.sch80, s.nps)
		if s.s160 > 0 {
			assert.Less(t, s.sch80, s.s160, s.nps)
		}
	}
}

func TestTubeErrors(t *testing.T) {
	for _, tc := range []struct {
		name string
		s    Section
		want string
	}{
		{"wall half diameter", RoundTube{D: 60 * mm, T: 30 * mm}, "not less than half the diameter"},
		{"zero wall", RoundTube{D: 60 * mm}, "wall T"},
		{"NaN diameter", RoundTube{D: math.NaN(), T: 1 * mm}, "not a finite number"},
		{"rect wall", RectTube{H: 100 * mm, B: 40 * mm, T: 20 * mm}, "half the smaller side"},
		{"radius too big", RectTube{H: 100 * mm, B: 40 * mm, T: 2 * mm, R: 30 * mm}, "corner radius"},
		{"negative radius", RectTube{H: 100 * mm, B: 40 * mm, T: 2 * mm, R: -1 * mm}, "corner radius"},
		{"bad convention", RectTube{H: 100 * mm, B: 40 * mm, T: 2 * mm, Conv: 7}, "convention"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := tc.s.Properties()
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
			assert.Contains(t, err.Error(), "sections: ")
		})
	}
}
