package springnet_test

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// A tall welded stand: four square-tube legs under a rigid machine bed,
// carrying a 2 t machine. Buckling finds the load factor at which the
// stand sways sideways.
func ExampleBuckling() {
	const mm = 1e-3
	steel, err := materials.Lookup("S235")
	if err != nil {
		fmt.Println(err)
		return
	}
	leg := sections.RectTube{H: 40 * mm, B: 40 * mm, T: 2 * mm}
	var m springnet.Model
	var tops []springnet.NodeID
	for _, c := range [][2]float64{{0, 0}, {0.8, 0}, {0.8, 0.6}, {0, 0.6}} {
		prev := m.AddNode("", springnet.Vec{X: c[0], Y: c[1]})
		m.Fix(prev, springnet.AllDOF)
		for i := 1; i <= 8; i++ { // eight elements per leg for the buckled shape
			n := m.AddNode("", springnet.Vec{X: c[0], Y: c[1], Z: 2.0 * float64(i) / 8})
			m.AddBeam(prev, n, springnet.Beam{Material: steel, Section: leg})
			prev = n
		}
		tops = append(tops, prev)
	}
	bed := m.AddRigidGroup("bed", tops...)
	m.AddMass(bed, springnet.Mass{Kg: 2000, Offset: springnet.Vec{Z: 0.4}})
	m.SetGravity(springnet.DefaultCase, springnet.Gravity(1))

	res, err := springnet.Buckling(&m, springnet.DefaultCase, &springnet.BucklingSettings{Modes: 2})
	if err != nil {
		fmt.Println(err)
		return
	}
	for i := 0; i < res.NumModes(); i++ {
		s := res.Shape(i, bed)
		dir := "X"
		if math.Abs(s.UY) > math.Abs(s.UX) {
			dir = "Y"
		}
		fmt.Printf("mode %d: load factor %.4g, the bed sways along %s\n", i+1, res.Factor(i), dir)
	}
	// Output:
	// mode 1: load factor 7.675, the bed sways along Y
	// mode 2: load factor 7.693, the bed sways along X
}

// A structure in tension cannot buckle: Buckling says so.
func ExampleFewerFactorsError() {
	var m springnet.Model
	prev := m.AddNode("hook", springnet.Vec{Z: 1})
	m.Fix(prev, springnet.AllDOF)
	for i := 1; i <= 4; i++ { // a 1 m rod hanging from a hook
		n := m.AddNode("", springnet.Vec{Z: 1 - float64(i)/4})
		m.AddBeam(prev, n, springnet.Beam{Raw: springnet.RawBeam{EA: 1e8, EIy: 1e3, EIz: 1e3, GJ: 1e3}})
		prev = n
	}
	m.AddLoad(prev, springnet.Load{FZ: -1e3}) // hanging load
	_, err := springnet.Buckling(&m, springnet.DefaultCase, nil)
	var fe *springnet.FewerFactorsError
	if errors.As(err, &fe) {
		fmt.Printf("positive factors: %d; reversed load buckles at %.4g\n", fe.Found, fe.Reversed)
	}
	// Output:
	// positive factors: 0; reversed load buckles at 2.467
}

// Member results of a cantilever post: end forces, fibre stress,
// utilisation against the material's strength and the Euler check.
func ExampleCaseResult_MemberCheck() {
	const mm = 1e-3
	steel, err := materials.Lookup("S235")
	if err != nil {
		fmt.Println(err)
		return
	}
	var m springnet.Model
	base := m.AddNode("base", springnet.Vec{})
	top := m.AddNode("top", springnet.Vec{Z: 1.2})
	m.Fix(base, springnet.AllDOF)
	post := m.AddBeam(base, top, springnet.Beam{Material: steel, Section: sections.RectTube{H: 60 * mm, B: 60 * mm, T: 3 * mm}})
	m.AddLoad(top, springnet.Load{FX: 500, FZ: -20e3})

	res, err := springnet.Static(&m, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	mr, err := res.Case(springnet.DefaultCase).MemberCheck(post, &springnet.MemberSettings{Basis: springnet.DesignK})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("N %.4g kN, base moment %.4g kN·m\n", mr.A.N/1e3, mr.A.Mz/1e3)
	fmt.Printf("compression %.4g MPa, utilisation %.2f (%s)\n", mr.Compression/1e6, mr.Utilisation, mr.Governs)
	b := mr.Buckling
	fmt.Printf("ends %v–%v, K %.2g, P_cr %.4g kN, margin %.3g\n", b.EndA[1], b.EndB[1], b.KZ, b.Pcr/1e3, b.Margin)
	// Output:
	// N -20 kN, base moment 0.6 kN·m
	// compression 77.7 MPa, utilisation 0.33 (compression)
	// ends fixed–free, K 2.1, P_cr 121.2 kN, margin 6.06
}
