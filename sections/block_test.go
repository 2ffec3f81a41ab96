package sections

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestBlockGross(t *testing.T) {
	// Common practice: a 240 mm × 390 mm block has a gross footprint of
	// 0.0936 m².
	b := Block{L: 390 * mm, W: 240 * mm, FaceShell: 35 * mm, Web: 30 * mm}
	relClose(t, "gross", 0.0936, b.Gross(), exact)
}

func TestNominalBlock8in(t *testing.T) {
	// ASTM C90 8 in unit (from memory): actual 7-5/8 × 15-5/8 in, face
	// shells 1-1/4 in, webs 1 in, three webs. Hand calculation of the net
	// section: A = 2·1.25·15.625 + 3·1·(7.625 − 2.5) = 54.4375 in²;
	// Iz about the long axis (y across the width) by superposition:
	// gross minus the two cores 5.125 × 6.3125 in.
	b, err := NominalBlock(8)
	require.NoError(t, err)
	p := props(t, b)
	relClose(t, "A", 54.4375*in2, p.A, exact)
	L, W := 15.625, 7.625
	coreY, coreZ := 5.125, 6.3125
	iz := L*W*W*W/12 - 2*coreZ*coreY*coreY*coreY/12
	relClose(t, "Iz", iz*in4, p.Iz, exact)
	// Face-shell area per foot of wall: 2 · 1.25 · 12 = 30.0 in²/ft,
	// NCMA TEK 14-1B, 8 in hollow units, face-shell bedded (from memory).
	relClose(t, "face shells per ft", 30.0*in2, 2*b.FaceShell*12*in, exact)
	// Net area ratio of about 46 % of gross for minimum-wall units: common
	// practice puts hollow units at 40–60 % solid.
	ratio := p.A / b.Gross()
	assert.True(t, ratio > 0.4 && ratio < 0.6, "net/gross %.3g", ratio)
}

func TestBlockBredtUniformWall(t *testing.T) {
	// Two webs as thick as the face shells: a sharp rectangular tube, so
	// J = 4·Am²·t/pm (Bredt, Roark 8th ed. Table 10.7 case 16).
	L, W, tt := 400*mm, 200*mm, 30*mm
	p := props(t, Block{L: L, W: W, FaceShell: tt, Web: tt, Webs: 2})
	am, pm := (L-tt)*(W-tt), 2*(L+W-2*tt)
	relClose(t, "J", 4*am*am*tt/pm, p.J, exact)
	tube := props(t, RectTube{H: L, B: W, T: tt})
	relClose(t, "A as a tube", tube.A, p.A, exact)
	relClose(t, "Iy as a tube", tube.Iy, p.Iy, exact)
}

func TestBlockErrors(t *testing.T) {
	for _, tc := range []struct {
		b    Block
		want string
	}{
		{Block{L: 390 * mm, W: 190 * mm, FaceShell: 100 * mm, Web: 25 * mm}, "face shells"},
		{Block{L: 390 * mm, W: 190 * mm, FaceShell: 30 * mm, Web: 150 * mm}, "webs"},
		{Block{L: 390 * mm, W: 190 * mm, FaceShell: 30 * mm, Web: 25 * mm, Webs: 1}, "cross webs"},
		{Block{L: 390 * mm, W: 190 * mm, Web: 25 * mm}, "face shell"},
	} {
		_, err := tc.b.Properties()
		require.Error(t, err)
		assert.Contains(t, err.Error(), tc.want)
	}
	_, err := NominalBlock(7)
	assert.Error(t, err)
}
