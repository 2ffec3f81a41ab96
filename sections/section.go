package sections

import "github.com/trestle-go/trestle/materials"

// Section is a member cross-section. Local axes: x along the member, y and
// z in the section plane; Iy is the second moment about the y axis (bending
// in the x–z plane, stresses varying with z), Iz about the z axis.
// Properties returns the section's properties about its centroid, SI, or
// an error if the dimensions are not valid (zero, negative or non-finite
// size, wall too thick, ...).
type Section interface {
	Properties() (Props, error)
}

// Composite is a section of more than one material (a filled tube, a
// grouted block). Parts returns each material's share, about the
// composite's centroid; the Props of a Composite are those of its primary
// (structural) part. Analyses use Parts for EA, EI, GJ and mass (see
// Transformed): each Part carries its own Material, which takes the place
// of the member's material.
type Composite interface {
	Section
	Parts() ([]Part, error)
}

// Part is one material's share of a composite section.
type Part struct {
	Material materials.Material
	A        float64 // area [m²]
	Iy, Iz   float64 // second moments about the composite's centroidal axes [m⁴]
	J        float64 // torsion constant of this part alone [m⁴]
}

// Props holds the properties of a cross-section about its centroid, SI.
type Props struct {
	A        float64 // area [m²]
	Iy, Iz   float64 // second moments of area about y and z [m⁴]
	Iyz      float64 // product of area ∫yz dA [m⁴]; zero for a section symmetric about y or z (nonzero for an angle)
	J        float64 // St Venant torsion constant [m⁴]
	AsY, AsZ float64 // shear areas for shear along y and z (κA) [m²]; 0: shear-rigid
	Sy, Sz   float64 // elastic section moduli Iy/CZ and Iz/CY [m³]; 0: not known
	CY, CZ   float64 // extreme-fibre distance from the centroid along y and z [m]
	Ry, Rz   float64 // radii of gyration √(Iy/A), √(Iz/A) [m]
	Outline  []Loop  // boundary loops for drawing about the centroid: first the outer (counter-clockwise), then holes (clockwise)
}

// Loop is a closed polygon in section coordinates (y, z) [m]; the last
// point joins the first.
type Loop [][2]float64

// Transformed returns the stiffnesses and mass per length of a composite
// section from its parts at material level l (transformed section):
//
//	EA = Σ Eᵢ Aᵢ,  EIy = Σ Eᵢ Iyᵢ,  EIz = Σ Eᵢ Izᵢ,  GJ = Σ Gᵢ Jᵢ,  m = Σ ρᵢ Aᵢ
//
// in N, N·m², N·m², N·m² and kg/m. Parts whose Material is MassOnly (dry
// sand) add mass but no stiffness. Perfect bond between the parts is
// assumed (no slip), as in the transformed-section method of any
// mechanics-of-materials text (e.g. Gere & Goodno, Mechanics of Materials,
// §6.2).
func Transformed(parts []Part, l materials.Level) (EA, EIy, EIz, GJ, massPerLength float64) {
	for _, p := range parts {
		massPerLength += p.Material.Density * p.A
		if p.Material.MassOnly {
			continue
		}
		e := p.Material.E.At(l)
		EA += e * p.A
		EIy += e * p.Iy
		EIz += e * p.Iz
		GJ += p.Material.ShearModulus(l) * p.J
	}
	return EA, EIy, EIz, GJ, massPerLength
}

// MassPerLength returns Σ ρᵢ Aᵢ over parts [kg/m].
func MassPerLength(parts []Part) float64 {
	var m float64
	for _, p := range parts {
		m += p.Material.Density * p.A
	}
	return m
}
