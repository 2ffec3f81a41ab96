package springnet_test

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// LossFactor of a member with a composite section spans its parts: least
// Low, greatest High, nominal values weighted by Eₚ·Aₚ (the transformed
// section's axial split, Gere & Goodno, Mechanics of Materials, §6.2;
// areas of the tube wall and its core by the circle formula).
func TestLossFactorComposite(t *testing.T) {
	steel := materials.Material{Name: "test steel", E: materials.Exact(200e9), Poisson: 0.3, Density: 7850,
		Loss: materials.Range{Low: 0.0005, Nominal: 0.001, High: 0.003}}
	grout := materials.Material{Name: "test grout", E: materials.Exact(30e9), Poisson: 0.2, Density: 2300,
		Loss: materials.Range{Low: 0.01, Nominal: 0.02, High: 0.04}}
	sand := materials.Material{Name: "test sand", Density: 1600, MassOnly: true, Loss: materials.Exact(0.1)}
	const d, tw = 0.1143, 0.005
	tube := sections.RoundTube{D: d, T: tw}
	aShell := math.Pi / 4 * (d*d - (d-2*tw)*(d-2*tw))
	aCore := math.Pi / 4 * (d - 2*tw) * (d - 2*tw)
	nominal := (200e9*aShell*0.001 + 30e9*aCore*0.02) / (200e9*aShell + 30e9*aCore)

	var m springnet.Model
	a := m.AddNode("A", springnet.Vec{})
	b := m.AddNode("B", springnet.Vec{Z: 1})
	grouted := m.AddBeam(a, b, springnet.Beam{Material: steel, Section: sections.Filled{Tube: tube, Shell: steel, Fill: grout}})
	bar := m.AddBar(a, b, springnet.Bar{Material: steel, Section: sections.Filled{Tube: tube, Shell: steel, Fill: grout}})
	sanded := m.AddBeam(a, b, springnet.Beam{Material: steel, Section: sections.Filled{Tube: tube, Shell: steel, Fill: sand}})
	own := materials.Exact(0.05)
	given := m.AddBeam(a, b, springnet.Beam{Material: steel, Section: sections.Filled{Tube: tube, Shell: steel, Fill: grout}, Loss: own})
	plain := m.AddBeam(a, b, springnet.Beam{Material: steel, Section: tube})

	// Tolerance: areas by the same formula as the section, to round-off.
	const tol = 1e-9
	for _, e := range []springnet.ElementID{grouted, bar} {
		got := m.LossFactor(e)
		assert.Equal(t, 0.0005, got.Low) // least Low of the parts: the steel's input above
		assert.Equal(t, 0.04, got.High)  // greatest High of the parts: the grout's input above
		assert.InEpsilon(t, nominal, got.Nominal, tol)
	}
	// Dry sand stores no strain energy: the shell's loss factor alone.
	assert.Equal(t, steel.Loss, m.LossFactor(sanded))
	// The member's own Loss wins; a plain section has its material's.
	assert.Equal(t, own, m.LossFactor(given))
	assert.Equal(t, steel.Loss, m.LossFactor(plain))
}
