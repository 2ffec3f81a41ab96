package sections

import (
	"fmt"
	"math"
)

var _ Section = General{}

// General is a section given directly by its properties, for shapes not
// in the catalogue. A, Iy, Iz and J are required; shear areas may be 0
// (shear-rigid) and CY, CZ may be 0 (section moduli then 0, "not known").
// Iy and Iz are taken as principal (Iyz = 0). It has no geometry, so its
// Props.Outline is empty.
type General struct {
	A        float64 // area [m²]
	Iy, Iz   float64 // second moments [m⁴]
	J        float64 // torsion constant [m⁴]
	AsY, AsZ float64 // shear areas [m²]; 0: shear-rigid
	CY, CZ   float64 // extreme-fibre distances [m]; 0: not known
}

// Properties returns the given properties with Sy = Iy/CZ, Sz = Iz/CY
// (when CZ, CY are given) and the radii of gyration. It fails if A, Iy,
// Iz or J is not positive and finite; if any other value is negative or
// not finite; if a shear area exceeds A; or if J > Iy + Iz (no section
// has a torsion constant above its polar moment, Saint-Venant's
// inequality: the circle attains it).
func (g General) Properties() (Props, error) {
	fail := func(format string, args ...any) (Props, error) {
		return Props{}, fmt.Errorf("sections: %v: "+format, append([]any{g}, args...)...)
	}
	for _, v := range []struct {
		name string
		x    float64
		req  bool
	}{{"A", g.A, true}, {"Iy", g.Iy, true}, {"Iz", g.Iz, true}, {"J", g.J, true},
		{"AsY", g.AsY, false}, {"AsZ", g.AsZ, false}, {"cy", g.CY, false}, {"cz", g.CZ, false}} {
		switch {
		case math.IsNaN(v.x) || math.IsInf(v.x, 0):
			return fail("%s is not a finite number", v.name)
		case v.req && !(v.x > 0):
			return fail("%s = %g is not positive", v.name, v.x)
		case v.x < 0:
			return fail("%s = %g is negative", v.name, v.x)
		}
	}
	if g.AsY > g.A || g.AsZ > g.A {
		return fail("a shear area is larger than the area A")
	}
	if g.J > (g.Iy+g.Iz)*(1+1e-9) {
		return fail("J = %g m⁴ is larger than Iy + Iz = %g m⁴, which no section allows", g.J, g.Iy+g.Iz)
	}
	p := Props{A: g.A, Iy: g.Iy, Iz: g.Iz, J: g.J, AsY: g.AsY, AsZ: g.AsZ, CY: g.CY, CZ: g.CZ,
		Ry: math.Sqrt(g.Iy / g.A), Rz: math.Sqrt(g.Iz / g.A)}
	if g.CZ > 0 {
		p.Sy = g.Iy / g.CZ
	}
	if g.CY > 0 {
		p.Sz = g.Iz / g.CY
	}
	if err := checkProps(p); err != nil {
		return fail("%v", err)
	}
	return p, nil
}
