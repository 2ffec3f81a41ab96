package sections

import (
	"fmt"
	"math"
)

var (
	_ Section = RoundTube{}
	_ Section = RectTube{}
)

// Convention says how a tube's nominal wall and corner radius become the
// geometry its properties are computed from.
type Convention int

const (
	// AsGiven uses the wall T as given and, for rectangular tubes, the
	// outer corner radius R as given (0: sharp corners).
	AsGiven Convention = iota
	// AISC uses the design wall t = 0.93·T for electric-resistance-welded
	// HSS and pipe (AISC 360-16 §B4.2) and, where R is 0, an outer corner
	// radius of 2·t (the AISC Manual's convention for its HSS tables).
	AISC
	// EN10219 uses the nominal wall T and, where R is 0, the outer corner
	// radius of EN 10219-2 (ro = 2T for T ≤ 6 mm, 2.5T for 6 < T ≤ 10 mm,
	// 3T above) with inner radius ro − T.
	EN10219
)

// String returns "as-given", "aisc" or "en10219".
func (c Convention) String() string {
	switch c {
	case AISC:
		return "aisc"
	case EN10219:
		return "en10219"
	case AsGiven:
		return "as-given"
	}
	return fmt.Sprintf("Convention(%d)", int(c))
}

// designWall returns the wall thickness properties are computed with.
func (c Convention) designWall(t float64) float64 {
	if c == AISC {
		return 0.93 * t // AISC 360-16 §B4.2
	}
	return t
}

func (c Convention) valid() bool { return c >= AsGiven && c <= EN10219 }

// RoundTube is a circular hollow section: outside diameter D, nominal
// wall T. With Conv AISC the properties use the design wall 0.93·T.
type RoundTube struct {
	D    float64    // outside diameter [m]
	T    float64    // nominal wall thickness [m]
	Conv Convention // wall convention; zero: T as given
}

// Properties returns the properties of the annulus D × t (t the design
// wall): A = π(D² − d²)/4, I = π(D⁴ − d⁴)/64, J = π(D⁴ − d⁴)/32 (exact
// for a circular tube, Roark 8th ed. Table 10.7 case 10), shear area by
// Cowper's hollow-circle coefficient (≈ A/2 for a thin wall; see
// annulusProps). It fails if D or T is not a positive finite length or if
// T is not less than D/2.
func (r RoundTube) Properties() (Props, error) {
	if err := r.check(); err != nil {
		return Props{}, err
	}
	t := r.Conv.designWall(r.T)
	return annulusProps(r.D, r.D-2*t), nil
}

func (r RoundTube) check() error {
	if err := checkLengths("diameter D", r.D, "wall T", r.T); err != nil {
		return fmt.Errorf("sections: %v: %w", r, err)
	}
	if !r.Conv.valid() {
		return fmt.Errorf("sections: %v: unknown wall convention %d", r, int(r.Conv))
	}
	if 2*r.T >= r.D {
		return fmt.Errorf("sections: %v: wall %s is not less than half the diameter %s", r, mmText(r.T), mmText(r.D))
	}
	return nil
}

// RectTube is a rectangular (or, with H = B, square) hollow section:
// depth H along z, width B along y, nominal wall T and outer corner
// radius R. Conv selects the design-wall and default-radius convention.
type RectTube struct {
	H    float64    // outside depth along z [m]
	B    float64    // outside width along y [m]
	T    float64    // nominal wall thickness [m]
	R    float64    // outer corner radius [m]; 0: from Conv (sharp for AsGiven)
	Conv Convention // wall and corner convention
}

// geometry returns the design wall t and the outer and inner corner radii.
func (r RectTube) geometry() (t, ro, ri float64) {
	t = r.Conv.designWall(r.T)
	ro = r.R
	if ro == 0 {
		switch r.Conv {
		case AISC:
			ro = 2 * t // AISC Manual HSS tables: outside corner radius 2·t_design
		case EN10219:
			switch { // EN 10219-2 Table A.1 note, on the nominal wall
			case r.T <= 6e-3:
				ro = 2 * r.T
			case r.T <= 10e-3:
				ro = 2.5 * r.T
			default:
				ro = 3 * r.T
			}
		}
	}
	ri = math.Max(ro-t, 0)
	return t, ro, ri
}

func (r RectTube) check() error {
	if err := checkLengths("depth H", r.H, "width B", r.B, "wall T", r.T); err != nil {
		return fmt.Errorf("sections: %v: %w", r, err)
	}
	if math.IsNaN(r.R) || math.IsInf(r.R, 0) || r.R < 0 {
		return fmt.Errorf("sections: %v: corner radius R %s is not a length >= 0", r, mmText(r.R))
	}
	if !r.Conv.valid() {
		return fmt.Errorf("sections: %v: unknown wall convention %d", r, int(r.Conv))
	}
	side := math.Min(r.H, r.B)
	if 2*r.T >= side {
		return fmt.Errorf("sections: %v: wall %s is not less than half the smaller side %s", r, mmText(r.T), mmText(side))
	}
	if _, ro, _ := r.geometry(); 2*ro > side {
		return fmt.Errorf("sections: %v: corner radius %s is more than half the smaller side %s", r, mmText(ro), mmText(side))
	}
	return nil
}

// Properties returns the properties of the tube with exact rounded
// corners (outer radius ro, inner ri = max(ro − t, 0)). Torsion by the
// thin-walled closed-section (Bredt) formula with corners, as in
// EN 10219-2 Annex B:
//
//	Rc = (ro + ri)/2,  p = 2[(B − t) + (H − t)] − 2Rc(4 − π)
//	Ah = (B − t)(H − t) − Rc²(4 − π)
//	J = t³p/3 + 4 Ah² t / p
//
// Shear areas are the wall areas parallel to the shear, AsZ = 2·H·t and
// AsY = 2·B·t (common practice). It fails if the wall is not less than
// half the smaller side or the corner radius does not fit.
func (r RectTube) Properties() (Props, error) {
	if err := r.check(); err != nil {
		return Props{}, err
	}
	t, ro, ri := r.geometry()
	s := append(roundedRect(r.B, r.H, ro), negate(roundedRect(r.B-2*t, r.H-2*t, ri))...)
	ap, err := s.props()
	if err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", r, err)
	}
	rc := (ro + ri) / 2
	p := 2*((r.B-t)+(r.H-t)) - 2*rc*(4-math.Pi)
	ah := (r.B-t)*(r.H-t) - rc*rc*(4-math.Pi)
	j := t*t*t*p/3 + 4*ah*ah*t/p
	out := []Loop{roundedRectLoop(r.B, r.H, ro, true), roundedRectLoop(r.B-2*t, r.H-2*t, ri, false)}
	return finish(ap, j, 2*r.B*t, 2*r.H*t, out), nil
}

func negate(s shape) shape {
	out := make(shape, len(s))
	for i, p := range s {
		out[i] = p.neg()
	}
	return out
}

// core returns the void of the tube as a solid section's properties
// (for a fill), about the same centroid.
func (r RectTube) core() (Props, error) {
	if err := r.check(); err != nil {
		return Props{}, err
	}
	t, _, ri := r.geometry()
	b, h := r.B-2*t, r.H-2*t
	ap, err := roundedRect(b, h, ri).props()
	if err != nil {
		return Props{}, fmt.Errorf("sections: %v: core: %w", r, err)
	}
	// Torsion of the core: the sharp rectangle's series, scaled by the
	// square of the area ratio for the rounded corners (small correction).
	ratio := ap.A / (b * h)
	j := rectTorsion(b, h) * ratio * ratio
	return finish(ap, j, 5.0/6*ap.A, 5.0/6*ap.A, []Loop{roundedRectLoop(b, h, ri, true)}), nil
}

// core returns the void of the round tube as a solid circle.
func (r RoundTube) core() (Props, error) {
	if err := r.check(); err != nil {
		return Props{}, err
	}
	return annulusProps(r.D-2*r.Conv.designWall(r.T), 0), nil
}
