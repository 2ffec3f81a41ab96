package sections

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
)

func TestRectClosedForms(t *testing.T) {
	// Rectangle b×h: A = bh, Iy = bh³/12, Iz = hb³/12, S = I/c
	// (Gere & Goodno, Mechanics of Materials, Appendix D case 2).
	for _, tc := range []struct {
		name string
		s    Section
		b, h float64
	}{
		{"rect 100x20", Rect{B: 100 * mm, H: 20 * mm}, 100 * mm, 20 * mm},
		{"square 40", Square{B: 40 * mm}, 40 * mm, 40 * mm},
		{"flat 50x10", Flat{W: 50 * mm, T: 10 * mm}, 50 * mm, 10 * mm},
	} {
		t.Run(tc.name, func(t *testing.T) {
			p := props(t, tc.s)
			b, h := tc.b, tc.h
			relClose(t, "A", b*h, p.A, exact)
			relClose(t, "Iy", b*h*h*h/12, p.Iy, exact)
			relClose(t, "Iz", h*b*b*b/12, p.Iz, exact)
			relClose(t, "Sy", b*h*h/6, p.Sy, exact)
			relClose(t, "Sz", h*b*b/6, p.Sz, exact)
			relClose(t, "Ry", h/math.Sqrt(12), p.Ry, exact)
			relClose(t, "AsY", 5.0/6*b*h, p.AsY, exact) // Timoshenko κ = 5/6
			assert.Zero(t, p.Iyz)
		})
	}
}

func TestRectTorsionTimoshenkoTable(t *testing.T) {
	// J = k₁·a·b³ for an a×b rectangle (a >= b); k₁ from Timoshenko &
	// Goodier, Theory of Elasticity, 3rd ed., §109 table (also Roark 8th
	// ed., Table 10.7 case 4), printed to 3 digits.
	for _, tc := range []struct {
		ratio, k1 float64
	}{{1, 0.141}, {1.5, 0.196}, {2, 0.229}, {3, 0.263}, {5, 0.291}, {10, 0.312}} {
		b := 10 * mm
		a := tc.ratio * b
		relClose(t, "k1", tc.k1, rectTorsion(a, b)/(a*b*b*b), 0.003) // 3-digit table
	}
	// a/b → ∞: k₁ → 1/3 − 0.21 b/a (Roark's approximation, good to ~0.1 % beyond a/b = 10).
	a, b := 1.0, 0.01
	relClose(t, "k1 thin", 1.0/3-0.21*b/a, rectTorsion(a, b)/(a*b*b*b), 1e-3) // Roark's ~0.1 %, stated above
}

func TestRoundClosedForms(t *testing.T) {
	// Circle: A = πd²/4, I = πd⁴/64, J = πd⁴/32 (exact for a circle).
	d := 40 * mm
	p := props(t, Round{D: d})
	relClose(t, "A", math.Pi*d*d/4, p.A, exact)
	relClose(t, "I", math.Pi*math.Pow(d, 4)/64, p.Iy, exact)
	relClose(t, "J", math.Pi*math.Pow(d, 4)/32, p.J, exact)
	relClose(t, "S", math.Pi*math.Pow(d, 3)/32, p.Sy, exact)
	// Cowper (1966) Table 1, solid circle: κ = 6(1+ν)/(7+6ν) = 0.886 at ν = 0.3.
	relClose(t, "kappa", 0.886, p.AsY/p.A, 0.001) // 0.001: Cowper's 3 figures (7.8/8.8 = 0.88636, 4e-4 off)
}
