package springnet_test

import (
	"errors"
	"fmt"
	"log"
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// A four-leg steel stand with a rigid top plate on levelling feet: the
// stiffness a machine feels at its mount, in N/µm.
func Example() {
	const mm = 1e-3
	steel, err := materials.Lookup("steel S235")
	if err != nil {
		log.Fatal(err)
	}
	leg := sections.RoundTube{D: 60.3 * mm, T: 4 * mm}
	const w, d, h = 0.8, 0.6, 0.85 // footprint and height [m] (demo data)

	var m springnet.Model
	var tops []springnet.NodeID
	for i, c := range [4][2]float64{{0, 0}, {w, 0}, {w, d}, {0, d}} {
		foot := m.AddNode(fmt.Sprintf("foot%d", i+1), springnet.Vec{X: c[0], Y: c[1]})
		top := m.AddNode(fmt.Sprintf("top%d", i+1), springnet.Vec{X: c[0], Y: c[1], Z: h})
		m.AddBeam(foot, top, springnet.Beam{Name: fmt.Sprintf("leg%d", i+1), Material: steel, Section: leg})
		// A levelling foot on a concrete floor (demo stiffnesses).
		m.AddFoot(foot, springnet.Foot{K: springnet.Stiffness6{X: 2e7, Y: 2e7, Z: 3e8}})
		tops = append(tops, top)
	}
	plate := m.AddRigidGroup("top", tops...)
	spindle := m.AddMount("spindle", springnet.Vec{X: w / 2, Y: d / 2, Z: h + 0.1}, plate)

	st, err := springnet.MountStiffness(&m, spindle, nil)
	var mech *springnet.MechanismError
	switch {
	case errors.As(err, &mech):
		log.Fatalf("the stand is a mechanism at %s in %v", mech.Name, mech.DOF)
	case err != nil:
		log.Fatal(err)
	}
	fmt.Printf("X: %.4g N/µm\n", springnet.NPerMicron(st.Along(springnet.Vec{X: 1})))
	fmt.Printf("Y: %.4g N/µm\n", springnet.NPerMicron(st.Along(springnet.Vec{Y: 1})))
	fmt.Printf("Z: %.4g N/µm\n", springnet.NPerMicron(st.Along(springnet.Vec{Z: 1})))
	k, dir := st.Principal()
	axis := "X"
	if math.Abs(dir[0].Y) > math.Abs(dir[0].X) {
		axis = "Y"
	}
	if math.Abs(dir[0].Z) > math.Max(math.Abs(dir[0].X), math.Abs(dir[0].Y)) {
		axis = "Z"
	}
	fmt.Printf("softest: %.4g N/µm, mostly along %s\n", springnet.NPerMicron(k[0]), axis)
	// Output:
	// X: 1.123 N/µm
	// Y: 1.111 N/µm
	// Z: 441.8 N/µm
	// softest: 1.111 N/µm, mostly along Y
}

// A machine of 400 kg on a narrow stand with loose feet, pushed sideways
// at the top: the load share between the feet and the tipping margin.
func ExampleStatic() {
	var m springnet.Model
	var corners []springnet.NodeID
	for _, c := range [4][2]float64{{0, 0}, {0.5, 0}, {0.5, 0.8}, {0, 0.8}} {
		n := m.AddNode("", springnet.Vec{X: c[0], Y: c[1]})
		m.AddFoot(n, springnet.Foot{K: springnet.Stiffness6{X: 1e7, Y: 1e7, Z: 2e8}, CompressionOnly: true})
		corners = append(corners, n)
	}
	// The stand is stiff compared with its feet: one rigid body.
	stand := m.AddRigidGroup("stand", corners...)
	m.AddMass(stand, springnet.Mass{Kg: 400, Offset: springnet.Vec{Z: 0.9}})
	top := m.AddMount("top", springnet.Vec{X: 0.25, Y: 0.4, Z: 1.6}, stand)
	push := m.AddLoadCase("push")
	m.SetGravity(push, springnet.Gravity(1))
	m.AddCaseLoad(push, top, springnet.Load{FX: 300})

	res, err := springnet.Static(&m, nil)
	if err != nil {
		log.Fatal(err)
	}
	cr := res.Case(push)
	for _, f := range cr.Feet() {
		fmt.Printf("%s: %.4g N (%.3g)\n", f.Name, f.Reaction.FZ, f.Share)
	}
	tip := cr.Tipping()
	// By hand: W·b/2 = 3923 N × 0.25 m against 300 N × 1.6 m: 2.043.
	fmt.Printf("tips at %.4g × the push\n", tip.Factor)
	// Output:
	// F0: 500.7 N (0.128)
	// F1: 1461 N (0.372)
	// F2: 1461 N (0.372)
	// F3: 500.7 N (0.128)
	// tips at 2.043 × the push
}

// The same stand under two cases, one of which tips: Static still solves
// the other and returns the result with a *TippingError; the tipped case
// says so and has no displacements or forces.
func ExampleCaseResult_Tipped() {
	var m springnet.Model
	var corners []springnet.NodeID
	for _, c := range [4][2]float64{{0, 0}, {0.5, 0}, {0.5, 0.8}, {0, 0.8}} {
		n := m.AddNode("", springnet.Vec{X: c[0], Y: c[1]})
		m.AddFoot(n, springnet.Foot{K: springnet.Stiffness6{X: 1e7, Y: 1e7, Z: 2e8}, CompressionOnly: true})
		corners = append(corners, n)
	}
	stand := m.AddRigidGroup("stand", corners...)
	m.AddMass(stand, springnet.Mass{Kg: 400, Offset: springnet.Vec{Z: 0.9}})
	top := m.AddMount("top", springnet.Vec{X: 0.25, Y: 0.4, Z: 1.6}, stand)
	for _, c := range []struct {
		name string
		fx   float64
	}{{"push", 300}, {"shove", 1000}} {
		id := m.AddLoadCase(c.name)
		m.SetGravity(id, springnet.Gravity(1))
		m.AddCaseLoad(id, top, springnet.Load{FX: c.fx})
	}

	res, err := springnet.Static(&m, nil)
	var tip *springnet.TippingError
	switch {
	case errors.As(err, &tip) && res != nil:
		fmt.Printf("case %q tips\n", tip.Case)
	case err != nil:
		log.Fatal(err)
	}
	for c := 0; c < res.NumCases(); c++ {
		cr := res.Case(springnet.CaseID(c))
		if cr.Tipped() {
			// By hand: W·b/2 = 3923 N × 0.25 m against 1000 N × 1.6 m.
			fmt.Printf("%s: tipped at %.4g × the push, %d feet lifted\n", cr.Name(), cr.Tipping().Factor, len(cr.Lifted()))
			continue
		}
		fmt.Printf("%s: tips at %.4g × the push\n", cr.Name(), cr.Tipping().Factor)
	}
	// Output:
	// case "shove" tips
	// push: tips at 2.043 × the push
	// shove: tipped at 0.6129 × the push, 2 feet lifted
}

// A timber stand on rubber pads: the governing numbers as ranges over the
// material uncertainty (timber E and the pads' stiffness spread), from
// one Solver.
func ExampleSweep() {
	const mm = 1e-3
	timber, err := materials.Lookup("timber C24")
	if err != nil {
		log.Fatal(err)
	}
	leg := sections.Rect{B: 90 * mm, H: 90 * mm}
	const w, d, h = 0.8, 0.6, 0.7 // footprint and height [m] (demo data)
	var m springnet.Model
	var tops []springnet.NodeID
	for _, c := range [4][2]float64{{0, 0}, {w, 0}, {w, d}, {0, d}} {
		foot := m.AddNode("", springnet.Vec{X: c[0], Y: c[1]})
		top := m.AddNode("", springnet.Vec{X: c[0], Y: c[1], Z: h})
		m.AddBeam(foot, top, springnet.Beam{Material: timber, Section: leg})
		// A rubber pad (demo stiffnesses, ±30 % spread).
		m.AddFoot(foot, springnet.Foot{K: springnet.Stiffness6{X: 5e6, Y: 5e6, Z: 5e7},
			Vary: materials.Range{Low: 0.7, Nominal: 1, High: 1.3}})
		tops = append(tops, top)
	}
	plate := m.AddRigidGroup("top", tops...)
	m.AddMount("spindle", springnet.Vec{X: w / 2, Y: d / 2, Z: h + 0.1}, plate)
	m.AddLoad(plate, springnet.Load{FZ: -3e3, FX: 200})

	res, err := springnet.Sweep(&m, &springnet.SweepSettings{Buckling: true})
	if err != nil {
		log.Fatal(err)
	}
	k := res.Mounts[0].Softest.Range
	fmt.Printf("softest at spindle: %.4g / %.4g / %.4g N/µm\n",
		springnet.NPerMicron(k.Low), springnet.NPerMicron(k.Nominal), springnet.NPerMicron(k.High))
	u := res.MaxUtilisation.Range
	fmt.Printf("utilisation: %.4g / %.4g / %.4g\n", u.Low, u.Nominal, u.High)
	b := res.Buckling.Range
	fmt.Printf("buckling factor: %.4g / %.4g / %.4g\n", b.Low, b.Nominal, b.High)
	// Output:
	// softest at spindle: 1.177 / 1.74 / 2.305 N/µm
	// utilisation: 0.01864 / 0.01864 / 0.01864
	// buckling factor: 242.9 / 360.8 / 479.2
}
