package sections

import "github.com/trestle-go/trestle/materials"

// Section is a member cross-section. Local axes: x along the member, y and
// z in the section plane; Iy is the second moment about the y axis (bending
// in the x–z plane), Iz about the z axis. Properties returns an error if the
// dimensions are not valid (zero or negative size, wall too thick, ...).
type Section interface {
	Properties() (Props, error)
}

// Composite is a section of more than one material (a filled tube, a
// grouted block). Parts returns each material's share, about the
// section's own centroid; the Props of a Composite are those of its
// primary (structural) part, and analyses use Parts for EA, EI and mass.
type Composite interface {
	Section
	Parts() ([]Part, error)
}

// Part is one material's share of a composite section.
type Part struct {
	Material materials.Material
	A        float64 // area [m²]
	Iy, Iz   float64 // second moments about the section's centroidal axes [m⁴]
	J        float64 // torsion constant [m⁴]
}

// Props holds the properties of a cross-section, SI.
type Props struct {
	A        float64 // area [m²]
	Iy, Iz   float64 // second moments of area about y and z [m⁴]
	J        float64 // torsion constant [m⁴]
	AsY, AsZ float64 // shear areas for shear along y and z (κA) [m²]; 0: shear-rigid
	Sy, Sz   float64 // elastic section moduli about y and z [m³]
	CY, CZ   float64 // extreme-fibre distance from the centroid along y and z [m]
	Ry, Rz   float64 // radii of gyration about y and z [m]
	Outline  []Loop  // boundary loops for drawing: first the outer, then holes
}

// Loop is a closed polygon in section coordinates (y, z) [m].
type Loop [][2]float64
