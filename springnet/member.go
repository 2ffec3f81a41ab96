package springnet

import (
	"fmt"
	"math"

	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet/element"
)

// MemberResult holds the results of one bar or beam in one load case.
//
// Forces are in the member's local axes (x from end a to end b; see Beam),
// in N and N·m; stresses in Pa. For a section with a product of area (an
// angle) the local axes are its principal axes, turned by Theta from the
// section's geometric axes: My is about the major axis, Mz about the
// minor one. A and B are the section forces at the ends
// on the face with outward normal +x (element.SectionForces: N tension
// positive); Local holds the forces the nodes apply to the member ends in
// the matrix convention (element.BeamForces.Local). For a bar only N is
// non-zero.
//
// Shear deformation: beams are Euler–Bernoulli by default. Set
// Beam.Timoshenko for stubby members: the shear part of a cantilever's tip
// deflection over its bending part is 3·E·I/(κ·G·A·L²) = E·h²/(4·κ·G·L²)
// for a rectangle of depth h, about 0.78·(h/L)² for steel or concrete
// (κ = 5/6, G = E/2.6): 3 % at L/h = 5, 0.8 % at L/h = 10, but 20 % at
// L/h = 2 (Timoshenko & Gere, Mechanics of Materials, shear deflections).
// Below L/h ≈ 5–10 (short piers, deep base beams, squat legs) use
// Timoshenko. Timber, with G/E near 1/16 along the grain (Wood Handbook),
// shows 5 % even at L/h = 10. Masonry and concrete piers are usually squat
// (L/h of 1 to 3), where shear adds 8 % to 75 % of the bending deflection
// (masonry, G = 0.4·E): model them as Timoshenko beams, as the usual
// pier-rigidity formula Δ = P·h³/(3EI) + 1.2·P·h/(A·G) for a cantilever
// pier does.
type MemberResult struct {
	Element ElementID
	Name    string
	Kind    ElementKind // BarKind or BeamKind
	Length  float64     // [m]
	// Theta is the angle [rad] from the section's geometric y axis to the
	// local y axis, positive towards z: the principal angle of a section
	// with a product of area, else 0 (see Beam).
	Theta float64

	A, B  element.SectionForces
	Local element.Vec12

	// LineLoad is the distributed load along the member from self-weight
	// in this case, in local axes [N/m]: X along the member, Y and Z
	// across it. Beams carry it in bending (At includes it); bars carry
	// only their axial share (A.N and B.N differ by q_x·L about the bar's
	// mean force), their self-weight bending is not computed.
	LineLoad Vec

	// Stressed tells whether fibre stresses were computed: false for a
	// member without a Section (raw stiffness) or whose section has no
	// section moduli.
	Stressed bool
	// Tension is the largest tensile normal stress at the extreme fibres
	// anywhere along the member (≥ 0), Compression the largest compressive
	// one as a magnitude (≥ 0) [Pa]:
	//
	//	σ = N/A ± |My|/Sy ± |Mz|/Sz
	//
	// (σ = N/A ± √(My² + Mz²)/S for round sections; for sections with a
	// product of area, such as angles, σ = N/A + My·z/Iy − Mz·y/Iz on the
	// principal axes at every corner of the outline, as the bounding-box
	// fibres would overstate it). For a composite section these are
	// the stresses of the part that governs the utilisation, Eᵢ times the
	// strain at the outer extreme fibre (conservative for inner parts).
	Tension, Compression float64
	// Utilisation is the largest ratio of fibre stress to the material's
	// strength: Tension / Material.Yield and Compression /
	// Material.CompressiveStrength() (Compress if rated, else Yield),
	// over the parts of a composite section. What Yield means depends on
	// the material (yield of steel, minimum tensile strength of gray iron,
	// reference bending stress Fb of NDS timber; see package materials).
	// 0 when no strength is rated. Governs is "tension" or "compression"
	// (empty when not rated) and Strength the strength it was divided by.
	//
	// This is a stress ratio, not a code check: no resistance or safety
	// factors, no lateral-torsional or local buckling, no shear or
	// torsional stress, no interaction formula. Check members against
	// local codes and licensed engineering practice.
	Utilisation float64
	Governs     string
	Strength    float64 // [Pa]

	// Buckling is the Euler check of the member on its own.
	Buckling EulerCheck

	frame  element.Frame
	bp     element.BeamProps
	ua, ub element.Vec6
}

// At returns the section forces at the fraction s ∈ [0, 1] of the length
// from end a, including the self-weight line load q (local axes), by
// equilibrium of the part from a to x = s·L:
//
//	N(x) = N_A − q_x·x,   Vy(x) = Vy_A − q_y·x,   Vz(x) = Vz_A − q_z·x,   T(x) = T_A
//	My(x) = My_A + Vz_A·x − q_z·x²/2,   Mz(x) = Mz_A − Vy_A·x + q_y·x²/2
//
// Without a line load this is element.BeamForces.At.
func (r MemberResult) At(s float64) element.SectionForces {
	x := s * r.Length
	q := r.LineLoad
	a := r.A
	return element.SectionForces{
		N:  a.N - q.X*x,
		Vy: a.Vy - q.Y*x,
		Vz: a.Vz - q.Z*x,
		T:  a.T,
		My: a.My + a.Vz*x - q.Z*x*x/2,
		Mz: a.Mz - a.Vy*x + q.Y*x*x/2,
	}
}

// Shape appends to dst n ≥ 2 points of the deflected member from end a to
// end b in global coordinates [m], the displacements multiplied by mag
// (1: true size) for drawing. A beam follows its end translations and
// rotations (after releases and end springs) by the cubics of
// element.DeflectedShape, exact without span load; a bar is straight. n < 2
// is taken as 2.
func (r MemberResult) Shape(dst []Vec, n int, mag float64) []Vec {
	if n < 2 {
		n = 2
	}
	if r.Kind == BeamKind {
		pts := element.DeflectedShape(nil, r.frame, r.bp, r.ua, r.ub, n, mag)
		for _, p := range pts {
			dst = append(dst, vecOf(p))
		}
		return dst
	}
	a := vecOf(r.frame.A)
	b := vecOf(r.frame.B())
	ua := Vec{r.ua[0], r.ua[1], r.ua[2]}
	ub := Vec{r.ub[0], r.ub[1], r.ub[2]}
	for i := range n {
		s := float64(i) / float64(n-1)
		p := a.Scale(1 - s).Add(b.Scale(s))
		u := ua.Scale(1 - s).Add(ub.Scale(s))
		dst = append(dst, p.Add(u.Scale(mag)))
	}
	return dst
}

// MemberForces returns the results of bar or beam e in this case with the
// default member settings (see MemberCheck). It returns an error if e is a
// spring or a foot; an out-of-range handle panics.
func (c *CaseResult) MemberForces(e ElementID) (MemberResult, error) {
	return c.MemberCheck(e, nil)
}

// MemberForces returns the results of bar or beam e in DefaultCase (the
// first case) with the default member settings; use Case for the others.
func (r *StaticResult) MemberForces(e ElementID) (MemberResult, error) {
	return r.cases[0].MemberForces(e)
}

// MemberCheck returns the results of bar or beam e in this case: end
// forces, fibre stresses, utilisation and the Euler buckling check with
// the effective-length factors chosen by s (nil: defaults). It returns an
// error if e is a spring or a foot, s holds an invalid override, or the
// stand tips under the case (CaseResult.Tipped); an out-of-range handle
// panics.
func (c *CaseResult) MemberCheck(e ElementID, s *MemberSettings) (MemberResult, error) {
	x := c.nt.m.el(e)
	if x.kind != BarKind && x.kind != BeamKind {
		return MemberResult{}, fmt.Errorf("springnet: %v %q is not a bar or beam: no member results", x.kind, x.name())
	}
	if err := c.tippedErr("member forces"); err != nil {
		return MemberResult{}, err
	}
	if err := s.check(c.nt.m); err != nil {
		return MemberResult{}, err
	}
	return c.member(e, s, nil), nil
}

// MembersTo writes the results of every bar and beam, in element order,
// into dst (nil allocates) and returns it. It returns an error if s holds
// an invalid override or the stand tips under the case
// (CaseResult.Tipped).
func (c *CaseResult) MembersTo(dst []MemberResult, s *MemberSettings) ([]MemberResult, error) {
	if err := s.check(c.nt.m); err != nil {
		return dst[:0], err
	}
	if err := c.tippedErr("member forces"); err != nil {
		return dst[:0], err
	}
	dst = dst[:0]
	touch := nodeTouches(c.nt.m)
	for i := range c.nt.m.elems {
		if k := c.nt.m.elems[i].kind; k == BarKind || k == BeamKind {
			dst = append(dst, c.member(ElementID(i), s, touch))
		}
	}
	return dst, nil
}

// member computes the results of member e; touch is the per-node element
// count (nil: counted here).
func (c *CaseResult) member(e ElementID, s *MemberSettings, touch []int) MemberResult {
	nt := c.nt
	m := nt.m
	x := &m.elems[e]
	p := &nt.el[e]
	r := MemberResult{Element: e, Name: x.name(), Kind: x.kind, Length: p.frame.L, Theta: p.mp.theta,
		frame: p.frame, bp: p.bp, ua: c.disp[x.a], ub: c.disp[x.b]}
	ef := c.forces[e]
	if x.kind == BeamKind {
		r.A, r.B, r.Local = ef.Beam.A, ef.Beam.B, ef.Beam.Local
	} else {
		n := ef.Axial
		r.A.N, r.B.N = n, n
		r.Local[0], r.Local[6] = -n, n
	}
	if g := caseGravity(m, c.id); g != (Vec{}) && p.mp.lineMass > 0 {
		q := vecOf(p.frame.ToLocal(g.Scale(p.mp.lineMass).arr()))
		if x.kind == BarKind {
			// A bar's force from its end displacements is its mean
			// (the weight is lumped half at each end); spread it along
			// the bar so that N(x) = N_A − q_x·x has that mean.
			q.Y, q.Z = 0, 0
			half := q.X * p.frame.L / 2
			r.A.N, r.B.N = ef.Axial+half, ef.Axial-half
			r.Local[0], r.Local[6] = -r.A.N, r.B.N
		}
		r.LineLoad = q
	}
	var sec sections.Section
	if x.kind == BeamKind {
		sec = x.beam.Section
	} else {
		sec = x.bar.Section
	}
	r.fibreStresses(sec, &p.mp)
	if touch == nil {
		touch = nodeTouches(m)
	}
	r.Buckling = nt.euler(e, &r, s, touch)
	return r
}

// caseGravity returns the gravity acceleration of case c, the factored
// sum over a combination's cases [m/s²].
func caseGravity(m *Model, c CaseID) Vec {
	lc := &m.cases[c]
	if lc.terms == nil {
		return lc.gravity
	}
	var g Vec
	for _, t := range lc.terms {
		g = g.Add(m.cases[t.Case].gravity.Scale(t.Factor))
	}
	return g
}

// stressSamples is the number of equally spaced stations along a member
// at which fibre stresses are evaluated (besides the points where a
// bending moment under the line load is stationary). The forces are at
// most quadratic along the member, so the ends and the stationary points
// carry the extremes of each component; the stations catch their sum.
const stressSamples = 21

// fibreStresses fills Stressed, Tension, Compression, Utilisation,
// Governs and Strength.
func (r *MemberResult) fibreStresses(sec sections.Section, mp *memberProps) {
	if sec == nil || len(mp.parts) == 0 || mp.ea <= 0 {
		return
	}
	// In the member's local axes: principal for a section with a product
	// of area, whose outline is then rotated with them.
	pr, theta, err := memberSection(sec)
	if err != nil || !(pr.A > 0) {
		return
	}
	bending := r.Kind == BeamKind
	if bending && (pr.Sy <= 0 || pr.Sz <= 0 || mp.eiy <= 0 || mp.eiz <= 0) {
		return
	}
	round := isRound(sec)
	general := bending && (theta != 0 || pr.Iyz != 0) && len(pr.Outline) > 0 && len(mp.parts) == 1
	// Strain extremes at one station: axial strain ± bending strain.
	strain := func(f element.SectionForces) (hi, lo float64) {
		ax := f.N / mp.ea
		if !bending {
			return ax, ax
		}
		if general {
			// Unsymmetric bending, ε(y, z) = ε₀ + a·z + b·y with
			// a = (My·Iz + Mz·Iyz)/(E·D), b = −(Mz·Iy + My·Iyz)/(E·D),
			// D = Iy·Iz − Iyz² (Gere & Goodno, Mechanics of Materials,
			// unsymmetric bending), at the outline's corners. In
			// principal axes Iyz = 0 and this is σ = N/A + My·z/Iy −
			// Mz·y/Iz; the bounding box (CY, CZ) of a rotated angle
			// would overstate the extreme fibres.
			e := mp.parts[0].e
			d := pr.Iy*pr.Iz - pr.Iyz*pr.Iyz
			ca := (f.My*pr.Iz + f.Mz*pr.Iyz) / (e * d)
			cb := -(f.Mz*pr.Iy + f.My*pr.Iyz) / (e * d)
			hi, lo = math.Inf(-1), math.Inf(1)
			for _, loop := range pr.Outline {
				for _, q := range loop {
					v := ax + ca*q[1] + cb*q[0]
					hi, lo = math.Max(hi, v), math.Min(lo, v)
				}
			}
			return hi, lo
		}
		// Curvatures about y and z times the extreme-fibre distances.
		ky := math.Abs(f.My) / mp.eiy * pr.CZ
		kz := math.Abs(f.Mz) / mp.eiz * pr.CY
		b := ky + kz
		if round {
			b = math.Hypot(ky, kz)
		}
		return ax + b, ax - b
	}
	var hi, lo float64 = math.Inf(-1), math.Inf(1)
	take := func(s float64) {
		if s < 0 || s > 1 {
			return
		}
		h, l := strain(r.At(s))
		hi, lo = math.Max(hi, h), math.Min(lo, l)
	}
	for i := range stressSamples {
		take(float64(i) / float64(stressSamples-1))
	}
	if q := r.LineLoad; bending && r.Length > 0 {
		if q.Z != 0 {
			take(r.A.Vz / q.Z / r.Length) // dMy/dx = Vz_A − q_z·x = 0
		}
		if q.Y != 0 {
			take(r.A.Vy / q.Y / r.Length)
		}
	}
	if !finite(hi) || !finite(lo) {
		return
	}
	r.Stressed = true
	first := true
	for _, pt := range mp.parts {
		t := math.Max(pt.e*hi, 0)
		c := math.Max(-pt.e*lo, 0)
		if first {
			r.Tension, r.Compression = t, c
			first = false
		}
		if pt.tens > 0 && t/pt.tens > r.Utilisation {
			r.Utilisation, r.Governs, r.Strength = t/pt.tens, "tension", pt.tens
			r.Tension, r.Compression = t, c
		}
		if pt.comp > 0 && c/pt.comp > r.Utilisation {
			r.Utilisation, r.Governs, r.Strength = c/pt.comp, "compression", pt.comp
			r.Tension, r.Compression = t, c
		}
	}
}

// isRound reports whether the bending stress of sec is √(My² + Mz²)/S:
// solid and hollow circles, and tubes filled with something.
func isRound(sec sections.Section) bool {
	switch s := sec.(type) {
	case sections.Round, sections.RoundTube, sections.Pipe:
		return true
	case sections.Filled:
		return isRound(s.Tube)
	}
	return false
}

// nodeTouches returns, per node, the number of elements ending there.
func nodeTouches(m *Model) []int {
	t := make([]int, len(m.nodes))
	for i := range m.elems {
		t[m.elems[i].a]++
		if b := m.elems[i].b; b >= 0 {
			t[b]++
		}
	}
	return t
}
