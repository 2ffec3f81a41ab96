package sections

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestIShapeIPE200(t *testing.T) {
	// IPE 200 (EN 10365; ArcelorMittal sales programme tables, from
	// memory): h 200, b 100, tw 5.6, tf 8.5, r 12 mm; A = 28.5 cm²,
	// Iy = 1943 cm⁴, Iz = 142 cm⁴, Wel,y = 194 cm³, iy = 8.26 cm,
	// iz = 2.24 cm, It = 6.98 cm⁴.
	p := props(t, IShape{H: 200 * mm, B: 100 * mm, TW: 5.6 * mm, TF: 8.5 * mm, R: 12 * mm})
	relClose(t, "A", 28.5*cm2, p.A, table3)
	relClose(t, "Iy", 1943*cm4, p.Iy, table3)
	relClose(t, "Iz", 142*cm4, p.Iz, table3)
	relClose(t, "Wel,y", 194*cm*cm2, p.Sy, table3)
	relClose(t, "iy", 8.26*cm, p.Ry, table3)
	relClose(t, "iz", 2.24*cm, p.Rz, table3)
	// El Darwish–Johnston reproduces the tables' It within about 1 %.
	const itFit = 0.015
	relClose(t, "It", 6.98*cm4, p.J, itFit)
	assert.Zero(t, p.Iyz)
}

func TestIShapeW8x31(t *testing.T) {
	// AISC Manual 15th ed. Table 1-1, W8x31 (from memory): d 8.00, bf
	// 7.995, tw 0.285, tf 0.435, k_des 0.829 in (fillet r = k_des − tf);
	// A = 9.13 in², Ix = 110 in⁴, Iy = 37.1 in⁴, J = 0.536 in⁴.
	p := props(t, IShape{H: 8 * in, B: 7.995 * in, TW: 0.285 * in, TF: 0.435 * in, R: (0.829 - 0.435) * in})
	relClose(t, "A", 9.13*in2, p.A, table3)
	relClose(t, "Ix", 110*in4, p.Iy, table3)
	relClose(t, "Iy", 37.1*in4, p.Iz, table3)
	const jFit = 0.03 // AISC computes J with its own fillet allowance
	relClose(t, "J", 0.536*in4, p.J, jFit)
}

func TestIShapeClosedForm(t *testing.T) {
	// No fillets: Iy = (B·H³ − (B − tw)(H − 2tf)³)/12, Iz = (2·tf·B³ +
	// (H − 2tf)·tw³)/12 (Gere & Goodno App. D by superposition);
	// J = (2·B·tf³ + (H − tf)·tw³)/3 (Σ b t³/3, Roark Table 10.7).
	H, B, tw, tf := 300*mm, 150*mm, 7*mm, 11*mm
	p := props(t, IShape{H: H, B: B, TW: tw, TF: tf})
	relClose(t, "A", 2*B*tf+(H-2*tf)*tw, p.A, exact)
	relClose(t, "Iy", (B*H*H*H-(B-tw)*math.Pow(H-2*tf, 3))/12, p.Iy, exact)
	relClose(t, "Iz", (2*tf*B*B*B+(H-2*tf)*tw*tw*tw)/12, p.Iz, exact)
	relClose(t, "J", (2*B*tf*tf*tf+(H-tf)*tw*tw*tw)/3, p.J, exact)
	relClose(t, "AsZ = H·tw (common practice)", H*tw, p.AsZ, exact)
}

func TestChannelClosedForm(t *testing.T) {
	// Parallel-flange channel without fillets, by superposition (Gere &
	// Goodno App. D): A = 2·B·tf + (H − 2tf)·tw;
	// Iy = (B·H³ − (B − tw)(H − 2tf)³)/12; centroid from the web's back
	// ȳ = (2·tf·B²/2 + (H − 2tf)·tw²/2)/A; Iz = 2·tf·B³/3 + (H − 2tf)·tw³/3 − A·ȳ².
	H, B, tw, tf := 100*mm, 50*mm, 6*mm, 8.5*mm
	p := props(t, Channel{H: H, B: B, TW: tw, TF: tf})
	a := 2*B*tf + (H-2*tf)*tw
	yb := (tf*B*B + (H-2*tf)*tw*tw/2) / a
	relClose(t, "A", a, p.A, exact)
	relClose(t, "Iy", (B*H*H*H-(B-tw)*math.Pow(H-2*tf, 3))/12, p.Iy, exact)
	relClose(t, "Iz", 2*tf*B*B*B/3+(H-2*tf)*tw*tw*tw/3-a*yb*yb, p.Iz, 1e-10) // 1e-10: the parallel-axis subtraction −A·yb² cancels digits
	relClose(t, "CY", B-yb, p.CY, exact)
	assert.InDelta(t, 0, p.Iyz, 1e-20, "symmetric about y") // 1e-20 m⁴ is under 1e-13 of Iz (≈ 3e-7 m⁴): round-off only
}

func TestAngleEN10056(t *testing.T) {
	// EN 10056-1 equal angle L 50×50×5, r1 = 7, r2 = 3.5 mm (makers'
	// tables, from memory): A = 4.80 cm², Iy = Iz = 10.96 cm⁴,
	// Iu = 17.4 cm⁴, Iv = 4.54 cm⁴, e = 1.40 cm (centroid from the back).
	p := props(t, Angle{B: 50 * mm, H: 50 * mm, T: 5 * mm, R: 7 * mm, RT: 3.5 * mm})
	relClose(t, "A", 4.80*cm2, p.A, table3)
	relClose(t, "Iy", 10.96*cm4, p.Iy, table3)
	relClose(t, "Iz", 10.96*cm4, p.Iz, table3)
	imax, imin, theta := p.Principal()
	relClose(t, "Iu", 17.4*cm4, imax, table3)
	relClose(t, "Iv", 4.54*cm4, imin, table3)
	// Equal legs: principal axes at 45° (by symmetry).
	assert.InDelta(t, math.Pi/4, math.Abs(theta), 1e-9)
	// e = distance from the back of a leg to the centroid = CY measured
	// toward the back: the outline's minimum y is −e.
	require.NotEmpty(t, p.Outline)
	ymin := math.Inf(1)
	for _, pt := range p.Outline[0] {
		ymin = math.Min(ymin, pt[0])
	}
	relClose(t, "e", 1.40*cm, -ymin, table3)
}

func TestAngleSharpClosedForm(t *testing.T) {
	// Sharp L of legs b, h and thickness t: product of inertia about the
	// centroid, by the parallel-axis theorem on two rectangles (Gere &
	// Goodno §12.7): Iyz = Σ Aᵢ·dyᵢ·dzᵢ.
	b, h, tt := 80*mm, 60*mm, 6*mm
	p := props(t, Angle{B: b, H: h, T: tt})
	a1, y1, z1 := b*tt, b/2, tt/2
	a2, y2, z2 := tt*(h-tt), tt/2, tt+(h-tt)/2
	a := a1 + a2
	yc, zc := (a1*y1+a2*y2)/a, (a1*z1+a2*z2)/a
	relClose(t, "Iyz", a1*(y1-yc)*(z1-zc)+a2*(y2-yc)*(z2-zc), p.Iyz, 1e-10) // 1e-10: differences about the centroid cancel digits
	relClose(t, "J", (b+h-tt)*tt*tt*tt/3, p.J, exact)
}

func TestOpenShapeErrors(t *testing.T) {
	for _, tc := range []struct {
		name string
		s    Section
		want string
	}{
		{"angle too thick", Angle{B: 50 * mm, H: 50 * mm, T: 50 * mm}, "no leg"},
		{"angle toe", Angle{B: 50 * mm, H: 50 * mm, T: 5 * mm, RT: 6 * mm}, "toe radius"},
		{"i web", IShape{H: 200 * mm, B: 10 * mm, TW: 12 * mm, TF: 8 * mm}, "web"},
		{"i flanges", IShape{H: 20 * mm, B: 100 * mm, TW: 5 * mm, TF: 10 * mm}, "flanges"},
		{"channel NaN", Channel{H: math.NaN(), B: 50 * mm, TW: 5 * mm, TF: 8 * mm}, "finite"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := tc.s.Properties()
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
		})
	}
}
