package modelfile_test

import (
	"bytes"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/modelfile"
)

// TestFromModel builds a model in Go with every kind of item, writes it
// and reads it back: the model read equals the model built.
func TestFromModel(t *testing.T) {
	steel, err := materials.Lookup("steel S355")
	require.NoError(t, err)
	oak, err := materials.Custom(materials.Material{Name: "old oak", E: materials.Range{Low: 8e9, Nominal: 1e10, High: 1.2e10},
		Poisson: 0.37, Density: 750, Loss: materials.Exact(0.012)})
	require.NoError(t, err)
	tube, err := sections.Parse("square-tube 60x4 mm")
	require.NoError(t, err)
	filled, err := sections.Parse("filled round-tube 114.3x5 mm with concrete C25/30")
	require.NoError(t, err)
	beam, err := sections.Parse("rect 100x50 mm")
	require.NoError(t, err)

	var m springnet.Model
	a := m.AddNode("a", springnet.Vec{})
	b := m.AddNode("b", springnet.Vec{X: 1.1})
	c := m.AddNode("c", springnet.Vec{X: 1.1, Y: 0.7})
	d := m.AddNode("d", springnet.Vec{Y: 0.7})
	ta := m.AddNode("a-top", springnet.Vec{Z: 0.9})
	tb := m.AddNode("b-top", springnet.Vec{X: 1.1, Z: 0.9})
	tc := m.AddNode("c-top", springnet.Vec{X: 1.1, Y: 0.7, Z: 0.9})
	td := m.AddNode("d-top", springnet.Vec{Y: 0.7, Z: 0.9})
	pad := m.AddNode("pad", springnet.Vec{Y: 0.7, Z: 0.9})
	m.AddBeam(a, ta, springnet.Beam{Name: "leg-1", Material: steel, Section: tube})
	m.AddBeam(b, tb, springnet.Beam{Name: "leg-2", Material: steel, Section: tube})
	m.AddBeam(c, tc, springnet.Beam{Name: "leg-3", Material: steel, Section: filled, Timoshenko: true})
	m.AddBeam(d, td, springnet.Beam{Material: oak, Section: beam, Up: springnet.Vec{X: 1}, Roll: 0.1,
		ReleaseA: springnet.ReleaseRY, SpringB: springnet.Vec{Y: 3e4, Z: 3e4}, Loss: materials.Exact(0.02)})
	m.AddBar(a, tb, springnet.Bar{Name: "brace", EA: 2e7, LineMass: 1.5})
	m.AddBeam(b, tc, springnet.Beam{Name: "raw", Raw: springnet.RawBeam{EA: 1e8, EIy: 2e5, EIz: 1e5, GJ: 5e4, GAsY: 1e7, GAsZ: 1e7, LineMass: 8, A: 1e-3}})
	m.AddSpring(td, pad, springnet.Spring{Name: "iso", K: springnet.Stiffness6{X: 1e6, Y: 1e6, Z: 5e6, RZ: 100}, Vary: materials.Range{Low: 0.8, Nominal: 1, High: 1.3}})
	m.AddFoot(a, springnet.Foot{Name: "f-1", K: springnet.Stiffness6{X: 1e6, Y: 1e6, Z: 5e7}, CompressionOnly: true})
	m.AddFoot(b, springnet.Foot{Name: "f-2", K: springnet.Stiffness6{X: 1e6, Y: 1e6, Z: 5e7}, CompressionOnly: true})
	m.Fix(c, springnet.AllDOF)
	m.Fix(d, springnet.Translations)
	top := m.AddRigidGroupAt("top", springnet.Vec{X: 0.55, Y: 0.35, Z: 0.9}, ta, tb, tc)
	m.FixGroup(top, springnet.RZ)
	spindle := m.AddMount("spindle", springnet.Vec{X: 0.4, Y: 0.3, Z: 1.0}, top)
	tool := m.AddMount("tool", springnet.Vec{X: 0.45, Y: 0.3, Z: 0.95}, spindle)
	// Products of inertia (demo values; a body's tensor: principal
	// moments stay near 20, 25, 30 kg·m²) are written as a tensor and read back.
	m.AddMass(top, springnet.Mass{Kg: 400, Offset: springnet.Vec{Z: 0.25}, Inertia: springnet.Vec{X: 20, Y: 30, Z: 25},
		Products: springnet.Vec{X: 1.5, Y: -2, Z: 0.5}})
	m.AddMass(pad, springnet.Mass{Kg: 3.5})
	w := m.AddLoadCase("weight")
	m.SetGravity(w, springnet.Gravity(1))
	cut := m.AddLoadCase("cut")
	m.AddCaseLoad(cut, tool, springnet.Load{FX: -200, FZ: -1500, MZ: 12})
	m.AddCaseLoad(cut, pad, springnet.Load{FY: 10})
	tilt := m.AddLoadCase("tilted floor")
	m.SetGravity(tilt, springnet.Vec{X: 0.1, Z: -springnet.StandardGravity})
	m.AddCombination("ultimate", springnet.Term{Case: w, Factor: 1.35}, springnet.Term{Case: cut, Factor: 1.5})
	require.NoError(t, m.Validate())

	c1, err := modelfile.FromModel(&m, modelfile.Units{Length: "mm", Force: "kN"})
	require.NoError(t, err)
	var buf bytes.Buffer
	require.NoError(t, modelfile.WriteContents(&buf, c1))
	text := buf.String()
	f, err := modelfile.Read("from-model.toml", &buf)
	require.NoError(t, err, text)
	sameModel(t, &m, f.Model)
	require.Equal(t, m.NumMasses(), f.Model.NumMasses())
	for i := 0; i < m.NumMasses(); i++ {
		p1, m1 := m.MassOf(i)
		p2, m2 := f.Model.MassOf(i)
		assert.Equal(t, p1, p2)
		assert.Equal(t, m1, m2)
	}
	for i := 0; i < m.NumCases(); i++ {
		id := springnet.CaseID(i)
		assert.Equal(t, m.CaseLoads(id), f.Model.CaseLoads(id))
		assert.Equal(t, m.CaseGravity(id), f.Model.CaseGravity(id))
		assert.Equal(t, m.CaseTerms(id), f.Model.CaseTerms(id))
	}
	assert.Equal(t, m.GroupFixed(top), f.Model.GroupFixed(f.GroupIDs["top"]))
	assert.Contains(t, text, "inertia = [[20, -0.5, 2], [-0.5, 30, -1.5], [2, -1.5, 25]]", "the tensor, −products off the diagonal")
	// "pad" is a node: its name is not shared, so it is written plainly.
	assert.Contains(t, text, `at = "pad"`)
}

// TestFromModelAmbiguous: a node and a mount with one name are told
// apart by prefixes.
func TestFromModelAmbiguous(t *testing.T) {
	var m springnet.Model
	a := m.AddNode("x", springnet.Vec{})
	b := m.AddNode("y", springnet.Vec{Z: 1})
	m.AddBar(a, b, springnet.Bar{EA: 1e6})
	m.Fix(a, springnet.AllDOF)
	m.Fix(b, springnet.UX|springnet.UY)
	p := m.AddMount("y", springnet.Vec{Z: 1.2}, b)
	m.AddLoad(p, springnet.Load{FZ: -1})
	c, err := modelfile.FromModel(&m, modelfile.Units{})
	require.NoError(t, err)
	var buf bytes.Buffer
	require.NoError(t, modelfile.WriteContents(&buf, c))
	text := buf.String()
	assert.Contains(t, text, `"mount:y"`)
	assert.Contains(t, text, `"node:y"`)
	f, err := modelfile.Read("amb.toml", &buf)
	require.NoError(t, err, text)
	sameModel(t, &m, f.Model)
}
