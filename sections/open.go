package sections

import (
	"fmt"
	"math"
)

var (
	_ Section = Angle{}
	_ Section = Channel{}
	_ Section = IShape{}
)

// Angle is an L-section with legs B along y and H along z, thickness T
// root (fillet) radius R and toe radius RT (the rounded inner edge at
// each leg's tip, as rolled angles have). Its geometric axes are not
// principal, even for equal legs: Props.Iyz is nonzero and
// Props.Principal gives the principal second moments (use the minor one
// for buckling).
type Angle struct {
	B  float64 // leg along y [m]
	H  float64 // leg along z [m]
	T  float64 // thickness [m]
	R  float64 // root radius [m]; 0: none
	RT float64 // toe radius [m]; 0: none
}

// Channel is a C-section with parallel flanges: depth H along z, flange
// width B along y (flanges pointing +y), web TW, flanges TF, root radius R.
type Channel struct {
	H  float64 // depth along z [m]
	B  float64 // flange width along y [m]
	TW float64 // web thickness [m]
	TF float64 // flange thickness [m]
	R  float64 // root radius [m]; 0: none
}

// IShape is a doubly symmetric I-section with parallel flanges: depth H
// along z, flange width B along y, web TW, flanges TF and root radius R.
// Iy is the strong axis.
type IShape struct {
	H  float64 // depth along z [m]
	B  float64 // flange width along y [m]
	TW float64 // web thickness [m]
	TF float64 // flange thickness [m]
	R  float64 // root radius [m]; 0: none
}

// Principal returns the principal second moments of p (Imax >= Imin) and
// the angle theta [rad] from the y axis to the Imax axis:
//
//	I₁,₂ = (Iy+Iz)/2 ± √(((Iy−Iz)/2)² + Iyz²),  tan 2θ = −2Iyz/(Iy−Iz)
//
// (Gere & Goodno, Mechanics of Materials, §12.8.)
func (p Props) Principal() (Imax, Imin, theta float64) {
	m := (p.Iy + p.Iz) / 2
	d := math.Hypot((p.Iy-p.Iz)/2, p.Iyz)
	return m + d, m - d, 0.5 * math.Atan2(-2*p.Iyz, p.Iy-p.Iz)
}

// arc appends points on a circle of radius r about (cy, cz) from angle a0
// to a1 [rad]; a zero radius gives the single corner point.
func arc(l Loop, cy, cz, r, a0, a1 float64) Loop {
	if r <= 0 {
		return append(l, [2]float64{cy, cz})
	}
	for i := 0; i <= arcSegments; i++ {
		t := a0 + (a1-a0)*float64(i)/arcSegments
		l = append(l, [2]float64{cy + r*math.Cos(t), cz + r*math.Sin(t)})
	}
	return l
}

func checkRoot(what string, r float64) error {
	if math.IsNaN(r) || math.IsInf(r, 0) || r < 0 {
		return fmt.Errorf("%s %s is not a length >= 0", what, mmText(r))
	}
	return nil
}

// Properties returns the properties of the angle about its centroid and
// the axes parallel to its legs. Torsion J = (B + H − T)·T³/3, the open
// thin-walled Σ b t³/3 on the legs' centre-line lengths (Roark 8th ed.,
// Table 10.7; Timoshenko & Goodier §110). Shear areas: 5/6 of the leg
// parallel to the shear (common practice).
func (a Angle) Properties() (Props, error) {
	if err := checkLengths("leg B", a.B, "leg H", a.H, "thickness T", a.T); err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", a, err)
	}
	if err := checkRoot("root radius R", a.R); err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", a, err)
	}
	if err := checkRoot("toe radius RT", a.RT); err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", a, err)
	}
	if a.RT > a.T {
		return Props{}, fmt.Errorf("sections: %v: toe radius %s is more than the thickness %s", a, mmText(a.RT), mmText(a.T))
	}
	if a.T+a.R >= math.Min(a.B, a.H) {
		return Props{}, fmt.Errorf("sections: %v: thickness %s plus root radius %s leaves no leg beyond it (shorter leg %s)",
			a, mmText(a.T), mmText(a.R), mmText(math.Min(a.B, a.H)))
	}
	s := shape{rectPrim(0, a.B, 0, a.T), rectPrim(0, a.T, a.T, a.H)}
	if a.R > 0 {
		s = append(s, fillet(a.T, a.T, a.R, 1, 1)...)
	}
	if rt := a.RT; rt > 0 { // round off the inner edge of each tip
		s = append(s, rectPrim(a.B-rt, a.B, a.T-rt, a.T).neg(), quarterPrim(a.B-rt, a.T-rt, rt, 1, 1),
			rectPrim(a.T-rt, a.T, a.H-rt, a.H).neg(), quarterPrim(a.T-rt, a.H-rt, rt, 1, 1))
	}
	ap, err := s.props()
	if err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", a, err)
	}
	var l Loop
	l = append(l, [2]float64{0, 0}, [2]float64{a.B, 0})
	l = arc(l, a.B-a.RT, a.T-a.RT, a.RT, 0, 0.5*math.Pi)
	l = arc(l, a.T+a.R, a.T+a.R, a.R, 1.5*math.Pi, math.Pi)
	l = arc(l, a.T-a.RT, a.H-a.RT, a.RT, 0, 0.5*math.Pi)
	l = append(l, [2]float64{0, a.H})
	j := (a.B + a.H - a.T) * a.T * a.T * a.T / 3
	return finish(ap, j, 5.0/6*a.B*a.T, 5.0/6*a.H*a.T, []Loop{l}), nil
}

func checkFlanged(h, b, tw, tf, r float64, webs float64) error {
	if err := checkLengths("depth H", h, "width B", b, "web TW", tw, "flange TF", tf); err != nil {
		return err
	}
	if err := checkRoot("root radius R", r); err != nil {
		return err
	}
	if tw+webs*r >= b {
		return fmt.Errorf("web %s and root radii %s do not fit in the flange width %s", mmText(tw), mmText(r), mmText(b))
	}
	if 2*tf+2*r >= h {
		return fmt.Errorf("two flanges %s and root radii %s do not fit in the depth %s", mmText(tf), mmText(r), mmText(h))
	}
	return nil
}

// Properties returns the properties of the channel about its centroid
// (y measured from the back of the web before centring). Torsion
// J = (2(B − TW/2)·TF³ + (H − TF)·TW³)/3 (Σ b t³/3 on centre-line
// lengths, Roark Table 10.7); fillets add area and inertia but are left
// out of J. Shear areas: AsZ = H·TW (web), AsY = 5/6·2·B·TF (flanges);
// common practice.
func (c Channel) Properties() (Props, error) {
	if err := checkFlanged(c.H, c.B, c.TW, c.TF, c.R, 1); err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", c, err)
	}
	h2 := c.H / 2
	s := shape{rectPrim(0, c.B, h2-c.TF, h2), rectPrim(0, c.B, -h2, -h2+c.TF), rectPrim(0, c.TW, -h2+c.TF, h2-c.TF)}
	if c.R > 0 {
		s = append(s, fillet(c.TW, h2-c.TF, c.R, 1, -1)...)
		s = append(s, fillet(c.TW, -h2+c.TF, c.R, 1, 1)...)
	}
	ap, err := s.props()
	if err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", c, err)
	}
	var l Loop
	l = append(l, [2]float64{0, -h2}, [2]float64{c.B, -h2}, [2]float64{c.B, -h2 + c.TF})
	l = arc(l, c.TW+c.R, -h2+c.TF+c.R, c.R, 1.5*math.Pi, math.Pi)
	l = arc(l, c.TW+c.R, h2-c.TF-c.R, c.R, math.Pi, 0.5*math.Pi)
	l = append(l, [2]float64{c.B, h2 - c.TF}, [2]float64{c.B, h2}, [2]float64{0, h2})
	j := (2*(c.B-c.TW/2)*c.TF*c.TF*c.TF + (c.H-c.TF)*c.TW*c.TW*c.TW) / 3
	return finish(ap, j, 5.0/6*2*c.B*c.TF, c.H*c.TW, []Loop{l}), nil
}

// Properties returns the properties of the I-section. Torsion: without a
// root radius J = (2·B·TF³ + (H − TF)·TW³)/3 (Σ b t³/3, centre-line web);
// with one, the fillet-corrected formula of El Darwish & Johnston
// ("Torsion of structural shapes", J. Struct. Div. ASCE 91, 1965), as used
// for the European rolled-section tables:
//
//	J = 2/3·B·TF³ + 1/3·(H − 2TF)·TW³ + 2αD⁴ − 0.420·TF⁴
//	α = −0.042 + 0.2204·TW/TF + 0.1355·R/TF − 0.0865·R·TW/TF² − 0.0725·TW²/TF²
//	D = ((TF + R)² + TW·(R + TW/4)) / (2R + TF)
//
// Shear areas: AsZ = H·TW (the web, AISC 360-16 §G2.1 uses d·tw),
// AsY = 5/6·2·B·TF (flanges); common practice.
func (s IShape) Properties() (Props, error) {
	if err := checkFlanged(s.H, s.B, s.TW, s.TF, s.R, 2); err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", s, err)
	}
	h2, w2 := s.H/2, s.TW/2
	sh := shape{rectPrim(-s.B/2, s.B/2, h2-s.TF, h2), rectPrim(-s.B/2, s.B/2, -h2, -h2+s.TF), rectPrim(-w2, w2, -h2+s.TF, h2-s.TF)}
	if s.R > 0 {
		for _, q := range [4][2]float64{{1, 1}, {-1, 1}, {1, -1}, {-1, -1}} {
			sh = append(sh, fillet(q[0]*w2, q[1]*(h2-s.TF), s.R, q[0], -q[1])...)
		}
	}
	ap, err := sh.props()
	if err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", s, err)
	}
	b2, r := s.B/2, s.R
	var l Loop
	l = append(l, [2]float64{b2, -h2}, [2]float64{b2, -h2 + s.TF})
	l = arc(l, w2+r, -h2+s.TF+r, r, 1.5*math.Pi, math.Pi)
	l = arc(l, w2+r, h2-s.TF-r, r, math.Pi, 0.5*math.Pi)
	l = append(l, [2]float64{b2, h2 - s.TF}, [2]float64{b2, h2}, [2]float64{-b2, h2}, [2]float64{-b2, h2 - s.TF})
	l = arc(l, -w2-r, h2-s.TF-r, r, 0.5*math.Pi, 0)
	l = arc(l, -w2-r, -h2+s.TF+r, r, 0, -0.5*math.Pi)
	l = append(l, [2]float64{-b2, -h2 + s.TF}, [2]float64{-b2, -h2})
	tf, tw := s.TF, s.TW
	var j float64
	if r > 0 {
		alpha := -0.042 + 0.2204*tw/tf + 0.1355*r/tf - 0.0865*r*tw/(tf*tf) - 0.0725*tw*tw/(tf*tf)
		d := ((tf+r)*(tf+r) + tw*(r+tw/4)) / (2*r + tf)
		j = 2.0/3*s.B*tf*tf*tf + 1.0/3*(s.H-2*tf)*tw*tw*tw + 2*alpha*d*d*d*d - 0.420*tf*tf*tf*tf
	}
	if j <= 0 { // no fillet, or a shape far outside the fitted range
		j = (2*s.B*tf*tf*tf + (s.H-tf)*tw*tw*tw) / 3
	}
	return finish(ap, j, 5.0/6*2*s.B*tf, s.H*tw, []Loop{l}), nil
}
