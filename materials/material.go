package materials

import (
	"errors"
	"fmt"
	"math"
	"strings"
)

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

// String returns the family name, e.g. "cast iron".
func (k Kind) String() string {
	switch k {
	case Other:
		return "other"
	case Steel:
		return "steel"
	case Stainless:
		return "stainless steel"
	case CastIron:
		return "cast iron"
	case Aluminium:
		return "aluminium"
	case Concrete:
		return "concrete"
	case Masonry:
		return "masonry"
	case MineralCasting:
		return "mineral casting"
	case Stone:
		return "stone"
	case Timber:
		return "timber"
	case EngineeredWood:
		return "engineered wood"
	case Elastomer:
		return "elastomer"
	case Fill:
		return "fill"
	}
	return fmt.Sprintf("Kind(%d)", int(k))
}

// Props holds the scalar properties of a Material at one Level, SI.
type Props struct {
	E       float64 // Young's modulus [Pa]
	G       float64 // shear modulus [Pa]
	Poisson float64 // Poisson's ratio [-]
	Density float64 // mass density [kg/m³]
	Loss    float64 // damping loss factor η [-]
}

// At returns the properties of m with every range taken at level l
// (E, G and Loss all at the same end). Analyses that want a mixed corner
// (stiff but lightly damped, say) read the Ranges directly.
func (m Material) At(l Level) Props {
	return Props{
		E:       m.E.At(l),
		G:       m.ShearModulus(l),
		Poisson: m.Poisson,
		Density: m.Density,
		Loss:    m.Loss.At(l),
	}
}

// Refs returns the references given for figure (compared without regard
// to case), in order; nil if there are none.
func (m Material) Refs(figure string) []string {
	var refs []string
	for _, s := range m.Sources {
		if strings.EqualFold(s.Figure, figure) {
			refs = append(refs, s.Ref)
		}
	}
	return refs
}

// MaxLossFactor is the largest loss factor Check accepts: η = 2ζ with the
// damping ratio ζ < 1.
const MaxLossFactor = 2.0

// Check reports whether m is a usable material, naming it in the error:
// a name; finite, ordered, non-negative E, G and Loss ranges; E.Low > 0
// unless MassOnly (a MassOnly material may have the zero E); G.Low > 0
// when G is given, else Poisson in (−1, 0.5]; Density > 0; finite,
// non-negative strengths; Loss.High < MaxLossFactor. Each problem found
// is reported (errors.Join).
func (m Material) Check() error {
	name := m.Name
	if strings.TrimSpace(name) == "" {
		name = "(unnamed)"
	}
	var errs []error
	bad := func(format string, args ...any) {
		errs = append(errs, fmt.Errorf("materials: %q: "+format, append([]any{name}, args...)...))
	}
	if strings.TrimSpace(m.Name) == "" {
		bad("empty name")
	}
	if err := m.E.Check(); err != nil {
		bad("E: %v", trimPkg(err))
	} else if !m.MassOnly && !(m.E.Low > 0) {
		bad("E %v must be positive (only a MassOnly material may have no stiffness)", m.E)
	}
	if m.G != (Range{}) {
		if err := m.G.Check(); err != nil {
			bad("G: %v", trimPkg(err))
		} else if !(m.G.Low > 0) {
			bad("G %v must be positive", m.G)
		}
	}
	if math.IsNaN(m.Poisson) || !(m.Poisson > -1 && m.Poisson <= 0.5) {
		bad("Poisson's ratio %g is not in (-1, 0.5]", m.Poisson)
	}
	if math.IsNaN(m.Density) || math.IsInf(m.Density, 0) || !(m.Density > 0) {
		bad("density %g kg/m³ must be positive and finite", m.Density)
	}
	for _, s := range []struct {
		what string
		v    float64
	}{{"yield", m.Yield}, {"compressive strength", m.Compress}} {
		if math.IsNaN(s.v) || math.IsInf(s.v, 0) || s.v < 0 {
			bad("%s %g Pa must be finite and non-negative (0: not rated)", s.what, s.v)
		}
	}
	if err := m.Loss.Check(); err != nil {
		bad("loss factor: %v", trimPkg(err))
	} else if m.Loss.High >= MaxLossFactor {
		bad("loss factor %v: η must be below %g (damping ratio below 1)", m.Loss, MaxLossFactor)
	}
	return errors.Join(errs...)
}

// trimPkg drops the "materials: " prefix of an error from this package,
// so a nested message does not repeat it.
func trimPkg(err error) string {
	return strings.TrimPrefix(err.Error(), "materials: ")
}
