package sections

import (
	"fmt"

	"github.com/trestle-go/trestle/materials"
)

var _ Composite = Filled{}

// Filled is a tube (RoundTube, RectTube or Pipe) filled with concrete,
// mineral casting, grout or sand: a Composite of the tube (material
// Shell) and its core (material Fill). A MassOnly fill (dry sand) adds
// mass but no stiffness. Perfect bond is assumed for a stiff fill; the
// usual caution applies that shrinkage can loosen a concrete core.
type Filled struct {
	Tube  Section            // RoundTube, RectTube or Pipe
	Shell materials.Material // the tube's material
	Fill  materials.Material // the core's material
}

// hollow is a tube whose void can be filled.
type hollow interface {
	Section
	core() (Props, error)
}

func (f Filled) tube() (hollow, error) {
	h, ok := f.Tube.(hollow)
	if !ok {
		return nil, fmt.Errorf("sections: filled: %T is not a tube (RoundTube, RectTube or Pipe)", f.Tube)
	}
	return h, nil
}

// Properties returns the tube's own properties (the primary part).
func (f Filled) Properties() (Props, error) {
	h, err := f.tube()
	if err != nil {
		return Props{}, err
	}
	return h.Properties()
}

// Parts returns the tube and its core about their common centroid (the
// centre, by symmetry). The core of a rectangular tube keeps the inner
// corner radius; its J is the rectangle series scaled by the square of
// the area ratio (the corners' small effect).
func (f Filled) Parts() ([]Part, error) {
	h, err := f.tube()
	if err != nil {
		return nil, err
	}
	p, err := h.Properties()
	if err != nil {
		return nil, err
	}
	c, err := h.core()
	if err != nil {
		return nil, err
	}
	if err := checkMaterial("shell", f.Shell); err != nil {
		return nil, fmt.Errorf("sections: %v: %w", f, err)
	}
	if f.Shell.MassOnly {
		return nil, fmt.Errorf("sections: %v: shell material %q has no stiffness", f, f.Shell.Name)
	}
	if err := checkMaterial("fill", f.Fill); err != nil {
		return nil, fmt.Errorf("sections: %v: %w", f, err)
	}
	return []Part{
		{Material: f.Shell, A: p.A, Iy: p.Iy, Iz: p.Iz, J: p.J},
		{Material: f.Fill, A: c.A, Iy: c.Iy, Iz: c.Iz, J: c.J},
	}, nil
}

// MassPerLength returns the mass per length of tube and fill [kg/m].
func (f Filled) MassPerLength() (float64, error) {
	parts, err := f.Parts()
	if err != nil {
		return 0, err
	}
	return MassPerLength(parts), nil
}
