package sections

import (
	"fmt"
	"math"
)

// This file holds the plane-geometry helpers every shape uses: a section
// is built from signed primitives (rectangles and quarter discs) whose
// areas and second moments add by the parallel-axis theorem, which keeps
// rounded corners and root fillets exact instead of polygon-approximated.

// prim is one signed primitive region: a rectangle [y0,y1]×[z0,z1] or a
// quarter disc of radius r centred at (yc, zc) filling quadrant (sy, sz).
type prim struct {
	sign           float64 // +1 material, −1 hole
	rect           bool
	y0, y1, z0, z1 float64 // rectangle bounds [m]
	yc, zc, r      float64 // quarter-disc centre and radius [m]
	sy, sz         float64 // quarter-disc quadrant, ±1 each
}

func rectPrim(y0, y1, z0, z1 float64) prim {
	return prim{sign: 1, rect: true, y0: y0, y1: y1, z0: z0, z1: z1}
}

func quarterPrim(yc, zc, r, sy, sz float64) prim {
	return prim{sign: 1, yc: yc, zc: zc, r: r, sy: sy, sz: sz}
}

func (p prim) neg() prim { p.sign = -p.sign; return p }

// own returns the area, centroid and second moments about the primitive's
// own centroid (unsigned).
func (p prim) own() (a, cy, cz, iy, iz, iyz float64) {
	if p.rect {
		b, h := p.y1-p.y0, p.z1-p.z0
		return b * h, (p.y0 + p.y1) / 2, (p.z0 + p.z1) / 2, b * h * h * h / 12, h * b * b * b / 12, 0
	}
	// Quarter disc: A = πr²/4, centroid 4r/(3π) from the centre along each
	// axis; I about the centre's axes πr⁴/16, product r⁴/8 (signed by
	// quadrant). Gere & Goodno, Mechanics of Materials, Appendix D, case 10.
	r := p.r
	a = math.Pi * r * r / 4
	e := 4 * r / (3 * math.Pi)
	ic := math.Pi*r*r*r*r/16 - a*e*e
	icyz := p.sy * p.sz * (r*r*r*r/8 - a*e*e)
	return a, p.yc + p.sy*e, p.zc + p.sz*e, ic, ic, icyz
}

// shape is a sum of signed primitives.
type shape []prim

// areaProps are the plane properties of a shape about its centroid.
type areaProps struct {
	A       float64
	Yc, Zc  float64 // centroid in the construction coordinates
	Iy, Iz  float64 // about centroidal axes parallel to y, z (Iy = ∫z² dA)
	Iyz     float64 // product ∫yz dA about the centroid
	Ymin    float64 // bounding box in construction coordinates
	Ymax    float64
	Zmin    float64
	Zmax    float64
	cyExtr  float64 // largest |y − Yc| over the shape
	czExtr  float64 // largest |z − Zc|
	centred bool
}

// props sums the primitives. It fails if the net area is not positive or
// anything is not finite.
func (s shape) props() (areaProps, error) {
	var A, Sy, Sz float64
	for _, p := range s {
		a, cy, cz, _, _, _ := p.own()
		A += p.sign * a
		Sy += p.sign * a * cy
		Sz += p.sign * a * cz
	}
	if !(A > 0) || math.IsInf(A, 0) {
		return areaProps{}, fmt.Errorf("net area %g m² is not positive", A)
	}
	yc, zc := Sy/A, Sz/A
	var iy, iz, iyz float64
	ymin, ymax := math.Inf(1), math.Inf(-1)
	zmin, zmax := math.Inf(1), math.Inf(-1)
	for _, p := range s {
		a, cy, cz, oy, oz, oyz := p.own()
		dy, dz := cy-yc, cz-zc
		iy += p.sign * (oy + a*dz*dz)
		iz += p.sign * (oz + a*dy*dy)
		iyz += p.sign * (oyz + a*dy*dz)
		if p.sign > 0 {
			lo, hi, zl, zh := p.bounds()
			ymin, ymax = math.Min(ymin, lo), math.Max(ymax, hi)
			zmin, zmax = math.Min(zmin, zl), math.Max(zmax, zh)
		}
	}
	ap := areaProps{A: A, Yc: yc, Zc: zc, Iy: iy, Iz: iz, Iyz: iyz,
		Ymin: ymin, Ymax: ymax, Zmin: zmin, Zmax: zmax}
	ap.cyExtr = math.Max(ymax-yc, yc-ymin)
	ap.czExtr = math.Max(zmax-zc, zc-zmin)
	return ap, nil
}

func (p prim) bounds() (ymin, ymax, zmin, zmax float64) {
	if p.rect {
		return p.y0, p.y1, p.z0, p.z1
	}
	y1, z1 := p.yc+p.sy*p.r, p.zc+p.sz*p.r
	return math.Min(p.yc, y1), math.Max(p.yc, y1), math.Min(p.zc, z1), math.Max(p.zc, z1)
}

// roundedRect returns a rectangle centred on the origin, width b along y,
// height h along z, with corner radius r (0: sharp).
func roundedRect(b, h, r float64) shape {
	s := shape{rectPrim(-b/2, b/2, -h/2, h/2)}
	if r <= 0 {
		return s
	}
	// Each corner loses the spandrel: an r×r square minus a quarter disc.
	for _, q := range [4][2]float64{{1, 1}, {-1, 1}, {-1, -1}, {1, -1}} {
		cy, cz := q[0]*(b/2-r), q[1]*(h/2-r)
		y0, y1 := math.Min(cy, cy+q[0]*r), math.Max(cy, cy+q[0]*r)
		z0, z1 := math.Min(cz, cz+q[1]*r), math.Max(cz, cz+q[1]*r)
		s = append(s, rectPrim(y0, y1, z0, z1).neg(), quarterPrim(cy, cz, r, q[0], q[1]))
	}
	return s
}

// fillet returns the spandrel filling the re-entrant corner at (y, z)
// between two walls, radius r, extending into quadrant (sy, sz) — the
// material added by a root radius.
func fillet(y, z, r, sy, sz float64) shape {
	// square from the corner into (sy, sz), minus the quarter disc centred
	// at the far corner of that square, which opens back toward the corner.
	y0, y1 := math.Min(y, y+sy*r), math.Max(y, y+sy*r)
	z0, z1 := math.Min(z, z+sz*r), math.Max(z, z+sz*r)
	return shape{rectPrim(y0, y1, z0, z1), quarterPrim(y+sy*r, z+sz*r, r, -sy, -sz).neg()}
}

// finish turns plane properties into Props (about the centroid), adding
// the torsion constant and shear areas the caller supplies, and the
// outline shifted so the centroid is at the origin.
func finish(ap areaProps, j, asy, asz float64, outline []Loop) Props {
	p := Props{A: ap.A, Iy: ap.Iy, Iz: ap.Iz, Iyz: ap.Iyz, J: j, AsY: asy, AsZ: asz,
		CY: ap.cyExtr, CZ: ap.czExtr}
	p.Sy = p.Iy / p.CZ
	p.Sz = p.Iz / p.CY
	p.Ry = math.Sqrt(p.Iy / p.A)
	p.Rz = math.Sqrt(p.Iz / p.A)
	for _, l := range outline {
		m := make(Loop, len(l))
		for i, pt := range l {
			m[i] = [2]float64{pt[0] - ap.Yc, pt[1] - ap.Zc}
		}
		p.Outline = append(p.Outline, m)
	}
	return p
}

// arcSegments is the number of straight segments per quarter circle in
// outlines (drawing only; properties use exact arcs).
const arcSegments = 6

// roundedRectLoop returns the outline of roundedRect(b, h, r), counter-
// clockwise when ccw is true, else clockwise.
func roundedRectLoop(b, h, r float64, ccw bool) Loop {
	var l Loop
	corners := [4][2]float64{{1, -1}, {1, 1}, {-1, 1}, {-1, -1}} // CCW order starting bottom right
	for k, q := range corners {
		if r <= 0 {
			l = append(l, [2]float64{q[0] * b / 2, q[1] * h / 2})
			continue
		}
		cy, cz := q[0]*(b/2-r), q[1]*(h/2-r)
		start := float64(k)*math.Pi/2 - math.Pi/2 // bottom-right corner arc runs from −90° to 0°
		for i := 0; i <= arcSegments; i++ {
			t := start + float64(i)*(math.Pi/2)/arcSegments
			l = append(l, [2]float64{cy + r*math.Cos(t), cz + r*math.Sin(t)})
		}
	}
	if !ccw {
		reverse(l)
	}
	return l
}

// circleLoop returns a circle of diameter d centred on the origin.
func circleLoop(d float64, ccw bool) Loop {
	n := 4 * arcSegments * 2
	l := make(Loop, n)
	for i := range l {
		t := 2 * math.Pi * float64(i) / float64(n)
		l[i] = [2]float64{d / 2 * math.Cos(t), d / 2 * math.Sin(t)}
	}
	if !ccw {
		reverse(l)
	}
	return l
}

func reverse(l Loop) {
	for i, j := 0, len(l)-1; i < j; i, j = i+1, j-1 {
		l[i], l[j] = l[j], l[i]
	}
}

// rectTorsion returns the St Venant torsion constant of a solid a×b
// rectangle by the series of Timoshenko & Goodier, Theory of Elasticity,
// 3rd ed., §109 (the same β as Roark's Formulas for Stress and Strain,
// 8th ed., Table 10.7 case 4):
//
//	J = a b³/3 · [1 − (192/π⁵)(b/a) Σ_{n=1,3,5,…} tanh(nπa/(2b))/n⁵],  a ≥ b
func rectTorsion(a, b float64) float64 {
	if a < b {
		a, b = b, a
	}
	var sum float64
	for n := 1; n <= 99; n += 2 {
		fn := float64(n)
		sum += math.Tanh(fn*math.Pi*a/(2*b)) / (fn * fn * fn * fn * fn)
	}
	return a * b * b * b / 3 * (1 - 192/math.Pow(math.Pi, 5)*(b/a)*sum)
}

// checkFinite reports the first property of p that is not finite, or an
// area or second moment that is not positive.
func checkProps(p Props) error {
	for _, v := range []struct {
		name string
		x    float64
		pos  bool
	}{{"A", p.A, true}, {"Iy", p.Iy, true}, {"Iz", p.Iz, true}, {"J", p.J, true},
		{"AsY", p.AsY, false}, {"AsZ", p.AsZ, false}, {"Sy", p.Sy, false}, {"Sz", p.Sz, false},
		{"CY", p.CY, false}, {"CZ", p.CZ, false}, {"Ry", p.Ry, false}, {"Rz", p.Rz, false}, {"Iyz", p.Iyz, false}} {
		if math.IsNaN(v.x) || math.IsInf(v.x, 0) {
			return fmt.Errorf("%s is not finite", v.name)
		}
		if v.pos && !(v.x > 0) {
			return fmt.Errorf("%s = %g is not positive", v.name, v.x)
		}
	}
	return nil
}
