package materials

// Material is an engineering material as a stand builder meets it. All
// values are SI: Pa, kg/m³. A zero strength means "not rated" (the figure
// does not apply or is not known), and utilisation is then not computed.
//
// Stiffness is given by E and either G or Poisson; when G is the zero Range
// the shear modulus is derived as E / (2(1+ν)).
type Material struct {
	Name     string   // catalogue name, e.g. "steel S235"
	Kind     Kind     // family, for grouping and drawing
	E        Range    // Young's modulus [Pa]
	G        Range    // shear modulus [Pa]; zero: derived from E and Poisson
	Poisson  float64  // Poisson's ratio [-]
	Density  float64  // mass density [kg/m³]
	Yield    float64  // yield or allowable tensile/bending stress [Pa]; 0: not rated
	Compress float64  // compressive strength (concrete f'c, masonry f'm, timber parallel to grain) [Pa]; 0: use Yield
	Loss     Range    // damping loss factor η [-]
	MassOnly bool     // contributes mass and damping but no stiffness (dry sand fill)
	Sources  []Source // where each figure came from
	Spread   string   // what drives the spread of E (and of the loss factor)
}

// Kind is a family of materials.
type Kind int

// Material families.
const (
	Other Kind = iota
	Steel
	Stainless
	CastIron
	Aluminium
	Concrete
	Masonry
	MineralCasting
	Stone
	Timber
	EngineeredWood
	Elastomer
	Fill
)

// Source names where one figure of a Material came from.
type Source struct {
	Figure string // which property: "E", "G", "density", "yield", "loss", ...
	Ref    string // the published source, e.g. "Eurocode 2 (EN 1992-1-1) Table 3.1"; "from memory" or "common practice" where it applies
}

// ShearModulus returns the shear modulus at level l [Pa]: G when given,
// else E/(2(1+ν)).
func (m Material) ShearModulus(l Level) float64 {
	if m.G != (Range{}) {
		return m.G.At(l)
	}
	return m.E.At(l) / (2 * (1 + m.Poisson))
}

// CompressiveStrength returns Compress if rated, else Yield [Pa].
func (m Material) CompressiveStrength() float64 {
	if m.Compress > 0 {
		return m.Compress
	}
	return m.Yield
}
