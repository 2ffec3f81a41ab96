package sections

import (
	"fmt"
	"math"
)

var (
	_ Section = Rect{}
	_ Section = Square{}
	_ Section = Round{}
	_ Section = Flat{}
)

// Rect is a solid rectangular bar, width B along y and depth H along z,
// so Iy = B·H³/12 is the stiffness for bending in the x–z plane.
type Rect struct {
	B float64 // width along y [m]
	H float64 // depth along z [m]
}

// Square is a solid square bar of side B.
type Square struct {
	B float64 // side [m]
}

// Round is a solid round bar of diameter D.
type Round struct {
	D float64 // diameter [m]
}

// Flat is a flat bar lying flat: width W along y, thickness T along z
// (bending about y is its weak axis; use Rect{B: T, H: W} for a flat bar
// on edge). Its properties are those of the rectangle.
type Flat struct {
	W float64 // width along y [m]
	T float64 // thickness along z [m]
}

// rectProps returns the properties of a solid b×h rectangle centred on
// the origin:
//
//	A = b h,  Iy = b h³/12,  Iz = h b³/12  (Gere & Goodno, App. D case 2)
//	J by the Timoshenko–Goodier series (rectTorsion)
//	AsY = AsZ = 5/6 A  (Timoshenko's shear coefficient for a rectangle)
func rectProps(b, h float64) (Props, error) {
	ap, err := roundedRect(b, h, 0).props()
	if err != nil {
		return Props{}, err
	}
	a := b * h
	return finish(ap, rectTorsion(b, h), 5.0/6*a, 5.0/6*a, []Loop{roundedRectLoop(b, h, 0, true)}), nil
}

// Properties returns the properties of the rectangle (see rectProps).
func (r Rect) Properties() (Props, error) {
	if err := checkLengths("width B", r.B, "depth H", r.H); err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", r, err)
	}
	return rectProps(r.B, r.H)
}

// Properties returns the properties of the square bar.
func (s Square) Properties() (Props, error) {
	if err := checkLength("side B", s.B); err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", s, err)
	}
	return rectProps(s.B, s.B)
}

// Properties returns the properties of the flat bar (a W×T rectangle).
func (f Flat) Properties() (Props, error) {
	if err := checkLengths("width W", f.W, "thickness T", f.T); err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", f, err)
	}
	return rectProps(f.W, f.T)
}

// Properties returns the properties of the round bar:
//
//	A = π D²/4,  I = π D⁴/64,  J = π D⁴/32 (exact for a circle)
//	As = κ A with Cowper's κ = 6(1+ν)/(7+6ν) at ν = 0.3 (0.886)
//
// (Cowper, "The shear coefficient in Timoshenko's beam theory", J. Appl.
// Mech. 33, 1966, Table 1.)
func (r Round) Properties() (Props, error) {
	if err := checkLength("diameter D", r.D); err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", r, err)
	}
	return annulusProps(r.D, 0), nil
}

// cowperNu is the Poisson's ratio used in Cowper's shear coefficients for
// round sections; 0.3 (steel) — the coefficient moves by under 2 % over
// ν = 0.2…0.35.
const cowperNu = 0.3

// annulusProps returns the properties of a circle of diameter d with a
// concentric hole of diameter di (0: solid):
//
//	A = π(d² − di²)/4,  I = π(d⁴ − di⁴)/64,  J = π(d⁴ − di⁴)/32
//	As = κA, Cowper's hollow-circle κ = 6(1+ν)(1+m²)² / ((7+6ν)(1+m²)² + (20+12ν)m²), m = di/d
func annulusProps(d, di float64) Props {
	a := math.Pi / 4 * (d*d - di*di)
	i := math.Pi / 64 * (d*d*d*d - di*di*di*di)
	m2 := (di / d) * (di / d)
	nu := cowperNu
	k := 6 * (1 + nu) * (1 + m2) * (1 + m2) / ((7+6*nu)*(1+m2)*(1+m2) + (20+12*nu)*m2)
	p := Props{A: a, Iy: i, Iz: i, J: 2 * i, AsY: k * a, AsZ: k * a, CY: d / 2, CZ: d / 2}
	p.Sy, p.Sz = i/(d/2), i/(d/2)
	p.Ry = math.Sqrt(i / a)
	p.Rz = p.Ry
	p.Outline = []Loop{circleLoop(d, true)}
	if di > 0 {
		p.Outline = append(p.Outline, circleLoop(di, false))
	}
	return p
}
