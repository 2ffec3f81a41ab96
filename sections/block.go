package sections

import (
	"fmt"

	"github.com/trestle-go/trestle/materials"
)

var (
	_ Section   = Block{}
	_ Composite = GroutedBlock{}
)

// Block is a hollow concrete masonry unit seen in plan, as the section of
// a pier of stacked units: length L along z, width W along y, two face
// shells of thickness FaceShell running the full length, and Webs cross
// webs of thickness Web (two at the ends, the rest evenly between). The
// section is the net (ungrouted) section; GroutedBlock adds grouted cores.
// Mortar-bedding effects (face-shell bedding) are not modelled.
type Block struct {
	L         float64 // actual length along z [m]
	W         float64 // actual width along y [m]
	FaceShell float64 // face-shell thickness [m]
	Web       float64 // cross-web thickness [m]
	Webs      int     // number of cross webs (2 or more); 0 means 3 (a two-core unit)
}

// NominalBlock returns the ASTM C90 two-core unit of nominal width
// 4, 6, 8, 10 or 12 in: actual width nominal − 3/8 in, length 15-5/8 in,
// minimum face shells 3/4, 1, 1-1/4, 1-3/8, 1-1/2 in and webs 3/4 in
// (4 in) or 1 in (ASTM C90 Table 2 minimums, from memory).
func NominalBlock(widthIn int) (Block, error) {
	fs := map[int]float64{4: 0.75, 6: 1, 8: 1.25, 10: 1.375, 12: 1.5}
	f, ok := fs[widthIn]
	if !ok {
		return Block{}, fmt.Errorf("sections: block: nominal width %d in is not one of 4, 6, 8, 10, 12", widthIn)
	}
	web := 1.0
	if widthIn == 4 {
		web = 0.75
	}
	return Block{L: 15.625 * inch, W: (float64(widthIn) - 0.375) * inch, FaceShell: f * inch, Web: web * inch}, nil
}

func (b Block) webs() int {
	if b.Webs == 0 {
		return 3
	}
	return b.Webs
}

// maxWebs bounds the cross webs of one unit.
const maxWebs = 10

func (b Block) check() error {
	if err := checkLengths("length L", b.L, "width W", b.W, "face shell", b.FaceShell, "web", b.Web); err != nil {
		return fmt.Errorf("sections: %v: %w", b, err)
	}
	n := b.webs()
	if n < 2 || n > maxWebs {
		return fmt.Errorf("sections: %v: %d cross webs is not in 2…%d", b, b.Webs, maxWebs)
	}
	if 2*b.FaceShell >= b.W {
		return fmt.Errorf("sections: %v: two face shells %s leave no core in the width %s", b, mmText(b.FaceShell), mmText(b.W))
	}
	if float64(n)*b.Web >= b.L {
		return fmt.Errorf("sections: %v: %d webs of %s leave no core in the length %s", b, n, mmText(b.Web), mmText(b.L))
	}
	return nil
}

// Gross returns the gross plan area L·W [m²].
func (b Block) Gross() float64 { return b.L * b.W }

// cores returns the core rectangles [y0, y1, z0, z1].
func (b Block) cores() [][4]float64 {
	n := b.webs()
	y := b.W/2 - b.FaceShell
	pitch := (b.L - b.Web) / float64(n-1)
	var out [][4]float64
	for i := range n - 1 {
		z0 := -b.L/2 + b.Web + float64(i)*pitch
		out = append(out, [4]float64{-y, y, z0, z0 + pitch - b.Web})
	}
	return out
}

// Properties returns the net section of the unit. Torsion by Bredt's
// formula for the closed outer cell with walls of two thicknesses
// (Roark 8th ed. Table 10.7 case 16): J = 4·Am² / ∮ds/t with
// Am = (L − Web)(W − FaceShell) and ∮ds/t = 2(L − Web)/FaceShell +
// 2(W − FaceShell)/Web; in a symmetric unit the inner webs carry no
// shear flow. Shear areas are the walls parallel to the shear:
// AsZ = 2·FaceShell·L, AsY = Webs·Web·W (common practice).
func (b Block) Properties() (Props, error) {
	if err := b.check(); err != nil {
		return Props{}, err
	}
	s := shape{rectPrim(-b.W/2, b.W/2, -b.L/2, b.L/2)}
	out := []Loop{roundedRectLoop(b.W, b.L, 0, true)}
	for _, c := range b.cores() {
		s = append(s, rectPrim(c[0], c[1], c[2], c[3]).neg())
		out = append(out, Loop{{c[0], c[2]}, {c[0], c[3]}, {c[1], c[3]}, {c[1], c[2]}}) // clockwise
	}
	ap, err := s.props()
	if err != nil {
		return Props{}, fmt.Errorf("sections: %v: %w", b, err)
	}
	am := (b.L - b.Web) * (b.W - b.FaceShell)
	loop := 2*(b.L-b.Web)/b.FaceShell + 2*(b.W-b.FaceShell)/b.Web
	j := 4 * am * am / loop
	return finish(ap, j, float64(b.webs())*b.Web*b.W, 2*b.FaceShell*b.L, out), nil
}

// GroutedBlock is a Block with every core filled with grout: a Composite
// of the unit's net section (material Unit) and the grout cores (Grout).
type GroutedBlock struct {
	Block Block
	Unit  materials.Material // the masonry of the unit's net section
	Grout materials.Material // the core fill
}

// Properties returns the net section of the unit (the primary part).
func (g GroutedBlock) Properties() (Props, error) { return g.Block.Properties() }

// Parts returns the unit's net section and the grout cores, about the
// unit's centroid (the centre, by symmetry). The grout's J is the sum of
// the cores' own rectangle torsion constants (each core alone), a lower
// bound on its share.
func (g GroutedBlock) Parts() ([]Part, error) {
	p, err := g.Block.Properties()
	if err != nil {
		return nil, err
	}
	if err := checkMaterial("unit", g.Unit); err != nil {
		return nil, fmt.Errorf("sections: %v: %w", g, err)
	}
	if err := checkMaterial("grout", g.Grout); err != nil {
		return nil, fmt.Errorf("sections: %v: %w", g, err)
	}
	var s shape
	var j float64
	for _, c := range g.Block.cores() {
		s = append(s, rectPrim(c[0], c[1], c[2], c[3]))
		j += rectTorsion(c[1]-c[0], c[3]-c[2])
	}
	ap, err := s.props()
	if err != nil {
		return nil, fmt.Errorf("sections: %v: grout: %w", g, err)
	}
	return []Part{
		{Material: g.Unit, A: p.A, Iy: p.Iy, Iz: p.Iz, J: p.J},
		{Material: g.Grout, A: ap.A, Iy: ap.Iy, Iz: ap.Iz, J: j},
	}, nil
}

// MassPerLength returns the mass per length of unit and grout [kg/m].
func (g GroutedBlock) MassPerLength() (float64, error) {
	parts, err := g.Parts()
	if err != nil {
		return 0, err
	}
	return MassPerLength(parts), nil
}

func checkMaterial(role string, m materials.Material) error {
	if m.Name == "" && m.Density == 0 && m.E == (materials.Range{}) {
		return fmt.Errorf("%s material is not set", role)
	}
	if err := m.Check(); err != nil {
		return fmt.Errorf("%s material: %w", role, err)
	}
	return nil
}
