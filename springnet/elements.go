package springnet

import (
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet/element"
)

// Bar is a pin-ended axial member: stiffness EA/L along its axis only, so
// its end nodes need no rotations.
//
// Stiffness comes from Material and Section (a sections.Composite uses each
// part's material: EA = Σ Eᵢ·Aᵢ, mass Σ ρᵢ·Aᵢ per length, MassOnly parts add
// mass only). Without a Section the raw EA [N] and LineMass [kg/m] are used;
// raw values do not vary with the material Level.
type Bar struct {
	Name     string
	Material materials.Material
	Section  sections.Section
	EA       float64         // raw axial stiffness E·A [N]; used when Section is nil
	LineMass float64         // raw mass per length [kg/m]; used when Section is nil
	Loss     materials.Range // damping loss factor [-]; zero: Material.Loss
}

// Stiffness6 holds a stiffness per global direction: X, Y, Z [N/m] on the
// translations and RX, RY, RZ [N·m/rad] on the rotations. Zero means no
// stiffness in that direction; directions are uncoupled.
type Stiffness6 struct{ X, Y, Z, RX, RY, RZ float64 }

func (k Stiffness6) arr() [6]float64 { return [6]float64{k.X, k.Y, k.Z, k.RX, k.RY, k.RZ} }

// rotational reports whether k has a rotational stiffness.
func (k Stiffness6) rotational() bool { return k.RX != 0 || k.RY != 0 || k.RZ != 0 }

// Spring is a two-node spring: Axial [N/m] acts along the line from a to b
// (as a bar would), K acts per global direction between the same DOF of the
// two ends (a pad, a bolted joint, a levelling screw); both may be given
// and add up. Vary multiplies every stiffness at the analysis Level (an
// elastomer pad's spread); the zero Range means exactly 1.
type Spring struct {
	Name  string
	Axial float64    // stiffness along a→b [N/m]
	K     Stiffness6 // stiffness per global direction
	Vary  materials.Range
	Loss  materials.Range // damping loss factor [-]
}

// Foot is a spring from a node to the ground: a levelling foot, a pad or
// an anchor on the floor, with a stiffness per global direction. The floor
// is horizontal and Z is up. A CompressionOnly foot is a loose foot: it
// carries nothing once its vertical reaction would turn to tension
// (lift-off), and the static analysis finds the feet in contact by an
// active-set iteration. Bolted feet stay linear. Vary multiplies every
// stiffness at the analysis Level; the zero Range means exactly 1.
type Foot struct {
	Name            string
	K               Stiffness6
	CompressionOnly bool
	Vary            materials.Range
	Loss            materials.Range // damping loss factor [-]
}

// Release is a bit set of beam end rotations, in the beam's local axes,
// that the beam does not transmit (see element.Release).
type Release = element.Release

// Beam end releases.
const (
	ReleaseRX  = element.ReleaseRX  // twist free
	ReleaseRY  = element.ReleaseRY  // pin for bending about local y
	ReleaseRZ  = element.ReleaseRZ  // pin for bending about local z
	ReleasePin = element.ReleasePin // both bending rotations free
)

// Beam is a 3D two-node beam with axial, bending (about local y and z) and
// torsional stiffness, Euler–Bernoulli or (Timoshenko) with shear
// deformation from the section's shear areas.
//
// Local axes: x from a to b; z in the plane of x and Up (global Z when Up
// is zero, global Y for a member along Z), y = z × x; then Roll [rad]
// about x. Iy of the section is about local y. A section with a product
// of area (an angle: Props.Iyz ≠ 0) is taken about its principal axes:
// the frame turns on by the principal angle θ (Props.Principal), so that
// local y is the major axis (E·Imax) and local z the minor one (E·Imin),
// and the beam deflects out of the plane of a load along a geometric
// axis, as unsymmetric bending requires. Member forces are then reported
// on the principal axes (MemberResult.Theta).
//
// Stiffness comes from Material and Section (a sections.Composite uses each
// part's material), or, without a Section, from Raw. ReleaseA/B free end
// rotations; SpringA/B put rotational springs [N·m/rad] about local x, y, z
// between node and beam end (zero: rigid joint).
//
// Shear deformation adds E·h²/(4·κ·G·L²) of the bending deflection of a
// cantilever of depth h (Timoshenko & Gere, Mechanics of Materials, shear
// deflections): for steel (κ = 5/6, G = E/2.6) about 3 % at L/h = 5 and
// 20 % at L/h = 2; far more for timber, whose G/E along the grain is near
// 1/16 (Wood Handbook). Set Timoshenko below L/h ≈ 5–10, and always for
// masonry and concrete piers (see MemberResult for more).
type Beam struct {
	Name       string
	Material   materials.Material
	Section    sections.Section
	Up         Vec
	Roll       float64 // [rad]
	Timoshenko bool    // include shear deformation (needs AsY, AsZ of the section)
	ReleaseA   Release
	ReleaseB   Release
	SpringA    Vec // rotational springs at end a about local x, y, z [N·m/rad]; 0: rigid
	SpringB    Vec // the same at end b
	Raw        RawBeam
	Loss       materials.Range // damping loss factor [-]; zero: Material.Loss
}

// RawBeam gives a beam's stiffness as plain numbers, used when the Beam has
// no Section. They do not vary with the material Level.
type RawBeam struct {
	EA, EIy, EIz, GJ float64 // [N], [N·m²]
	GAsY, GAsZ       float64 // shear stiffness [N]; 0: Euler–Bernoulli
	LineMass         float64 // [kg/m]
	A                float64 // area for stress [m²]; 0: no stress
}

// memberProps are the level-resolved properties of a bar or beam.
type memberProps struct {
	ea, eiy, eiz, gj, gasy, gasz float64
	lineMass                     float64
	polarMass                    float64 // ρ·(Iy+Iz) per length [kg·m]
	area                         float64 // for stress; 0: unknown
	// theta is the angle [rad] from the section's geometric y axis to the
	// member's local y axis: the principal angle of a section with a
	// product of area (an angle), else 0. The member's frame is rolled by
	// it, so that eiy and eiz are principal (see principalSection).
	theta float64
	// parts for stress and utilisation: modulus and strength per part
	parts []partStrength
}

type partStrength struct {
	e, tens, comp float64
}

// resolve computes the properties of a member with the given material,
// section and raw values at level l.
func resolveMember(mat materials.Material, sec sections.Section, raw RawBeam, l materials.Level, needShear bool) (memberProps, error) {
	if sec == nil {
		return memberProps{ea: raw.EA, eiy: raw.EIy, eiz: raw.EIz, gj: raw.GJ, gasy: raw.GAsY, gasz: raw.GAsZ,
			lineMass: raw.LineMass, area: raw.A}, nil
	}
	p, theta, err := memberSection(sec)
	if err != nil {
		return memberProps{}, err
	}
	var mp memberProps
	if c, ok := sec.(sections.Composite); ok {
		parts, err := c.Parts()
		if err != nil {
			return memberProps{}, err
		}
		for _, pt := range parts {
			mp.lineMass += pt.Material.Density * pt.A
			mp.polarMass += pt.Material.Density * (pt.Iy + pt.Iz)
			if pt.Material.MassOnly {
				continue
			}
			e := pt.Material.E.At(l)
			g := pt.Material.ShearModulus(l)
			mp.ea += e * pt.A
			mp.eiy += e * pt.Iy
			mp.eiz += e * pt.Iz
			mp.gj += g * pt.J
			mp.parts = append(mp.parts, partStrength{e: e, tens: pt.Material.Yield, comp: pt.Material.CompressiveStrength()})
		}
		mp.area = p.A
		if needShear && mp.ea > 0 {
			// Shear areas belong to the primary part; use the E-weighted
			// mean shear modulus of the parts (an approximation, stated).
			gMean := 0.0
			for _, pt := range parts {
				if !pt.Material.MassOnly {
					gMean += pt.Material.ShearModulus(l) * pt.Material.E.At(l) * pt.A / mp.ea
				}
			}
			mp.gasy, mp.gasz = gMean*p.AsY, gMean*p.AsZ
		}
		return mp, nil
	}
	e := mat.E.At(l)
	g := mat.ShearModulus(l)
	mp = memberProps{ea: e * p.A, eiy: e * p.Iy, eiz: e * p.Iz, gj: g * p.J,
		lineMass: mat.Density * p.A, polarMass: mat.Density * (p.Iy + p.Iz), area: p.A, theta: theta,
		parts: []partStrength{{e: e, tens: mat.Yield, comp: mat.CompressiveStrength()}}}
	if needShear {
		mp.gasy, mp.gasz = g*p.AsY, g*p.AsZ
	}
	return mp, nil
}

// productTol is the size of a product of area, relative to Iy + Iz,
// below which a section's geometric axes are taken as principal (round-off
// of the properties of a symmetric shape).
const productTol = 1e-9

// memberSection returns the properties of sec in the member's local axes,
// and the angle theta [rad] from the section's geometric y axis to the
// local y axis. A single-material section with a product of area (an
// angle) is taken about its principal axes (principalSection); every
// other section about its geometric axes, with theta = 0. A composite's
// parts carry no product of area; no composite shape has one.
func memberSection(sec sections.Section) (sections.Props, float64, error) {
	p, err := sec.Properties()
	if err != nil {
		return p, 0, err
	}
	if _, ok := sec.(sections.Composite); ok {
		return p, 0, nil
	}
	if math.Abs(p.Iyz) <= productTol*(math.Abs(p.Iy)+math.Abs(p.Iz)) {
		return p, 0, nil
	}
	q, theta := principalSection(p)
	return q, theta, nil
}

// principalSection returns p about its principal axes and the angle theta
// [rad] from the geometric y axis to the major principal axis, positive
// from y towards z (Props.Principal):
//
//	Iy' = Imax,  Iz' = Imin,  Iy'z' = 0
//	y' = y·cos θ + z·sin θ,   z' = −y·sin θ + z·cos θ
//
// (Gere & Goodno, Mechanics of Materials, principal axes). The outline is
// rotated into (y', z'), CY, CZ, Sy, Sz, Ry, Rz follow from it; the shear
// areas go with the geometric axis nearer each principal axis (a rotated
// shear area has no single value; for an equal angle AsY = AsZ anyway).
func principalSection(p sections.Props) (sections.Props, float64) {
	imax, imin, theta := p.Principal()
	c, s := math.Cos(theta), math.Sin(theta)
	q := p
	q.Iy, q.Iz, q.Iyz = imax, imin, 0
	if math.Abs(s) > math.Abs(c) {
		q.AsY, q.AsZ = p.AsZ, p.AsY
	}
	q.Outline = make([]sections.Loop, len(p.Outline))
	cy, cz := 0.0, 0.0
	for i, loop := range p.Outline {
		out := make(sections.Loop, len(loop))
		for j, pt := range loop {
			y, z := pt[0]*c+pt[1]*s, -pt[0]*s+pt[1]*c
			out[j] = [2]float64{y, z}
			cy, cz = math.Max(cy, math.Abs(y)), math.Max(cz, math.Abs(z))
		}
		q.Outline[i] = out
	}
	q.CY, q.CZ, q.Sy, q.Sz = 0, 0, 0, 0
	if cy > 0 && cz > 0 {
		q.CY, q.CZ = cy, cz
		q.Sy, q.Sz = q.Iy/cz, q.Iz/cy
	}
	if p.A > 0 {
		q.Ry, q.Rz = math.Sqrt(q.Iy/p.A), math.Sqrt(q.Iz/p.A)
	}
	return q, theta
}

// stress returns the axial stress of the stiffest-strained part and the
// utilisation, for axial force n [N]: strain ε = N / EA, σᵢ = Eᵢ·ε,
// utilisation max σᵢ/Yieldᵢ (tension) or |σᵢ|/Compressᵢ (compression), over
// rated parts. Without parts it uses the raw area (no utilisation).
func (mp *memberProps) stress(n float64) (sigma, util float64) {
	if len(mp.parts) == 0 {
		if mp.area > 0 {
			return n / mp.area, 0
		}
		return 0, 0
	}
	eps := n / mp.ea
	for i, pt := range mp.parts {
		s := pt.e * eps
		if i == 0 {
			sigma = s
		}
		strength := pt.tens
		if s < 0 {
			strength = pt.comp
		}
		if strength > 0 {
			u := abs(s) / strength
			if u > util {
				util = u
				sigma = s
			}
		}
	}
	return sigma, util
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}

// LossFactor returns the damping loss factor range of element e: its own
// Loss, else its material's Loss (zero for springs and feet without one).
//
// For a member with a composite section and no Loss of its own, the
// parts' materials apply (Modes splits each element's strain energy over
// its parts), so LossFactor returns the range spanning the stiff parts
// (MassOnly parts store no strain energy and are left out): Low and High
// are the least Low and greatest High of the parts, Nominal their
// nominal loss factors weighted by nominal axial stiffness Eₚ·Aₚ (exact
// for uniform axial strain; in bending the split differs, see
// Modes). A section whose parts cannot be read falls back to the
// member's Material.
func (m *Model) LossFactor(e ElementID) materials.Range {
	x := m.el(e)
	switch x.kind {
	case BarKind:
		return memberLoss(x.bar.Loss, x.bar.Material, x.bar.Section)
	case BeamKind:
		return memberLoss(x.beam.Loss, x.beam.Material, x.beam.Section)
	case SpringKind:
		return x.spring.Loss
	}
	return x.foot.Loss
}

// memberLoss returns a member's loss factor range (see Model.LossFactor).
func memberLoss(given materials.Range, mat materials.Material, sec sections.Section) materials.Range {
	if given != (materials.Range{}) {
		return given
	}
	c, ok := sec.(sections.Composite)
	if !ok {
		return mat.Loss
	}
	parts, err := c.Parts()
	if err != nil {
		return mat.Loss
	}
	out := materials.Range{Low: math.Inf(1), High: math.Inf(-1)}
	sw, sn := 0.0, 0.0
	for _, p := range parts {
		if p.Material.MassOnly {
			continue
		}
		l := p.Material.Loss
		out.Low = math.Min(out.Low, l.Low)
		out.High = math.Max(out.High, l.High)
		w := p.Material.E.Nominal * p.A
		sw += w
		sn += w * l.Nominal
	}
	if !(sw > 0) || math.IsInf(out.Low, 0) {
		return mat.Loss
	}
	out.Nominal = sn / sw
	return out
}
