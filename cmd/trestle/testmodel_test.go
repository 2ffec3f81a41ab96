package main

import (
	"fmt"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// demoName is how reports name the built-in demo stand.
const demoName = "demo stand (built in)"

// Demo stand dimensions [m] and loads. Invented demo data: a welded steel
// bench for a small lathe.
const (
	demoLength  = 1.2   // along X
	demoWidth   = 0.6   // along Y
	demoHeight  = 0.8   // floor to top frame
	demoRail    = 0.15  // stretcher height
	demoMachine = 350.0 // machine mass [kg]
	demoCoG     = 0.25  // machine centre of mass above the top [m]
)

// demoModel builds the demo stand in Go: four square-tube legs with
// stretchers and a top frame (beams), X-braces of flat bar on the long
// faces (bars), loose levelling feet, the machine bed as a rigid group
// over the top corners with four mounts, the machine as a mass, and three
// load cases. It stands in for the embedded model file until the
// model-file package provides one.
func demoModel() (*springnet.Model, error) {
	steel, err := materials.Lookup("steel S235")
	if err != nil {
		return nil, err
	}
	leg, err := sections.Parse("square-tube 50x3 mm")
	if err != nil {
		return nil, err
	}
	rail, err := sections.Parse("rect-tube 50x30x3 mm")
	if err != nil {
		return nil, err
	}
	brace, err := sections.Parse("flat 40x6 mm")
	if err != nil {
		return nil, err
	}
	var m springnet.Model
	corners := [4][2]float64{{0, 0}, {demoLength, 0}, {demoLength, demoWidth}, {0, demoWidth}}
	var foot, mid, top [4]springnet.NodeID
	for i, c := range corners {
		foot[i] = m.AddNode(fmt.Sprintf("F%d", i+1), springnet.Vec{X: c[0], Y: c[1]})
		mid[i] = m.AddNode(fmt.Sprintf("S%d", i+1), springnet.Vec{X: c[0], Y: c[1], Z: demoRail})
		top[i] = m.AddNode(fmt.Sprintf("T%d", i+1), springnet.Vec{X: c[0], Y: c[1], Z: demoHeight})
		m.AddBeam(foot[i], mid[i], springnet.Beam{Name: fmt.Sprintf("leg-%d-low", i+1), Material: steel, Section: leg})
		m.AddBeam(mid[i], top[i], springnet.Beam{Name: fmt.Sprintf("leg-%d", i+1), Material: steel, Section: leg})
		// Levelling foot: 200 N/µm vertical, 20 N/µm sideways (demo data).
		m.AddFoot(foot[i], springnet.Foot{Name: fmt.Sprintf("foot-%d", i+1),
			K: springnet.Stiffness6{X: 20e6, Y: 20e6, Z: 200e6}, CompressionOnly: true})
	}
	for i := 0; i < 4; i++ {
		j := (i + 1) % 4
		m.AddBeam(mid[i], mid[j], springnet.Beam{Name: fmt.Sprintf("rail-%d%d", i+1, j+1), Material: steel, Section: rail})
		m.AddBeam(top[i], top[j], springnet.Beam{Name: fmt.Sprintf("top-%d%d", i+1, j+1), Material: steel, Section: rail})
	}
	// X-braces on the two long faces (y = 0: corners 1–2, y = W: 3–4).
	for _, f := range [][2]int{{0, 1}, {3, 2}} {
		a, b := f[0], f[1]
		m.AddBar(mid[a], top[b], springnet.Bar{Name: fmt.Sprintf("brace-%d%d", a+1, b+1), Material: steel, Section: brace})
		m.AddBar(mid[b], top[a], springnet.Bar{Name: fmt.Sprintf("brace-%d%d", b+1, a+1), Material: steel, Section: brace})
	}
	bed := m.AddRigidGroup("bed", top[0], top[1], top[2], top[3])
	var mounts [4]springnet.MountID
	for i, c := range corners {
		mounts[i] = m.AddMount(fmt.Sprintf("M%d", i+1), springnet.Vec{X: c[0], Y: c[1], Z: demoHeight}, bed)
	}
	m.AddMass(bed, springnet.Mass{Kg: demoMachine, Offset: springnet.Vec{Z: demoCoG}})

	weight := m.AddLoadCase("weight")
	m.SetGravity(weight, springnet.Gravity(1))
	// Cutting: gravity plus a 600 N cutting force along -Y at the spindle
	// (demo data), 0.2 m above the bed near the headstock end.
	cut := m.AddLoadCase("cutting")
	m.SetGravity(cut, springnet.Gravity(1))
	spindle := m.AddMount("spindle", springnet.Vec{X: 0.3, Y: demoWidth / 2, Z: demoHeight + 0.2}, bed)
	m.AddCaseLoad(cut, spindle, springnet.Load{FY: -600, FZ: -300})
	// Bump: gravity plus a 600 N sideways push on the bed (a person or a
	// pallet truck leaning on it, demo data).
	bump := m.AddLoadCase("side push")
	m.SetGravity(bump, springnet.Gravity(1))
	m.AddCaseLoad(bump, springnet.MountID(mounts[2]), springnet.Load{FY: 600})
	return &m, nil
}
