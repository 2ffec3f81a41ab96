package element_test

import (
	"fmt"
	"math"

	"github.com/trestle-go/trestle/springnet/element"
)

// A member along global Y with the default up vector: local z stays global
// Z and local y turns to −X.
func ExampleNewFrame() {
	f, err := element.NewFrame(element.Vec3{0, 0, 0}, element.Vec3{0, 1.5, 0}, element.Vec3{}, 0)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("L = %.4g m\nex = %.4g\ney = %.4g\nez = %.4g\n", f.L, f.Ex, f.Ey, f.Ez)

	_, err = element.NewFrame(element.Vec3{1, 2, 3}, element.Vec3{1, 2, 3}, element.Vec3{}, 0)
	fmt.Println(err)
	// Output:
	// L = 1.5 m
	// ex = [0 1 0]
	// ey = [-1 0 0]
	// ez = [0 0 1]
	// element: frame [1 2 3]→[1 2 3]: zero length
}

// A 2 m steel bar of 1000 mm² (EA = 200 GPa · 1e-3 m²) stretched by 1 mm
// carries N = EA·δ/L = 100 kN in tension.
func ExampleBarAxialForce() {
	const mm = 1e-3
	f, _ := element.NewFrame(element.Vec3{}, element.Vec3{2, 0, 0}, element.Vec3{}, 0)
	n := element.BarAxialForce(f, 200e9*1000*mm*mm, element.Vec3{}, element.Vec3{1 * mm, 0, 0})
	fmt.Printf("N = %.4g kN\n", n/1e3)
	// Output:
	// N = 100 kN
}

// One beam element as a cantilever: fix end a and solve the 2×2 bending
// system of end b by hand. The tip deflection equals P·L³/(3·EI).
func ExampleBeamStiffness() {
	const l, ei, p = 1.6, 1.5e5, 2e3 // m, N·m², N
	f, _ := element.NewFrame(element.Vec3{}, element.Vec3{l, 0, 0}, element.Vec3{}, 0)
	k := element.BeamStiffness(f, element.BeamProps{EA: 2e8, EIy: 4e5, EIz: ei, GJ: 2e5})
	// End b, bending in the x–y plane: DOF UY (7) and RZ (11).
	kvv, kvt, ktt := k[7][7], k[7][11], k[11][11]
	v := p * ktt / (kvv*ktt - kvt*kvt)
	fmt.Printf("tip deflection %.4g mm, P·L³/(3EI) = %.4g mm\n", v*1e3, p*l*l*l/(3*ei)*1e3)

	// The same with a rotational spring of 3e5 N·m/rad at the root adds P·L²/k.
	k = element.BeamStiffness(f, element.BeamProps{EA: 2e8, EIy: 4e5, EIz: ei, GJ: 2e5, RotSpringA: element.Vec3{0, 0, 3e5}})
	kvv, kvt, ktt = k[7][7], k[7][11], k[11][11]
	v = p * ktt / (kvv*ktt - kvt*kvt)
	fmt.Printf("with root spring %.4g mm, closed form %.4g mm\n", v*1e3, (p*l*l*l/(3*ei)+p*l*l/3e5)*1e3)
	// Output:
	// tip deflection 18.2 mm, P·L³/(3EI) = 18.2 mm
	// with root spring 35.27 mm, closed form 35.27 mm
}

// Member forces of a cantilever with its tip pushed up by 10 mm, free to
// rotate: the tip load is 3EI·δ/L³ and the root moment that load times L
// (negative: a load along +z stretches the fibres at −z near the root).
func ExampleBeamEndForces() {
	const l, ei = 2.0, 1e5
	props := element.BeamProps{EA: 2e8, EIy: ei, EIz: ei, GJ: 1e5}
	f, _ := element.NewFrame(element.Vec3{}, element.Vec3{l, 0, 0}, element.Vec3{}, 0)
	// Tip of a cantilever under end load: w = δ, θy = −3δ/(2L).
	const d = 0.01
	ub := element.Vec6{0, 0, d, 0, -3 * d / (2 * l), 0}
	bf := element.BeamEndForces(f, props, element.Vec6{}, ub)
	fmt.Printf("Vz = %.4g N, My(a) = %.4g N·m, My(b) = %.4g N·m\n", bf.B.Vz, bf.A.My, math.Abs(math.Round(bf.B.My*1e6)/1e6))
	fmt.Printf("3EI·δ/L³ = %.4g N\n", 3*ei*d/(l*l*l))
	// Output:
	// Vz = 375 N, My(a) = -750 N·m, My(b) = 0 N·m
	// 3EI·δ/L³ = 375 N
}

// The largest fibre stress of a section under axial force and biaxial
// bending.
func ExampleCombinedStress() {
	s := element.SectionForces{N: -10e3, My: 2e3, Mz: -1e3} // N, N·m
	sigma, err := element.CombinedStress(s, 1e-3, 4e-5, 2e-5)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("σ max = %.4g MPa\n", sigma/1e6)
	// Output:
	// σ max = 110 MPa
}

// Points along a cantilever bent by a tip load, for drawing: the tip sits at
// its deflection, mid-span at 5/16 of it (Hermite cubic, exact here).
func ExampleDeflectedShape() {
	const l = 2.0
	f, _ := element.NewFrame(element.Vec3{}, element.Vec3{l, 0, 0}, element.Vec3{}, 0)
	props := element.BeamProps{EA: 2e8, EIy: 1e5, EIz: 1e5, GJ: 1e5}
	const d = 0.01
	ub := element.Vec6{0, d, 0, 0, 0, 3 * d / (2 * l)} // θz = dv/dx = 3δ/(2L)
	for _, p := range element.DeflectedShape(nil, f, props, element.Vec6{}, ub, 3, 1) {
		fmt.Printf("x = %.4g m, y = %.4g mm\n", p[0], p[1]*1e3)
	}
	// Output:
	// x = 0 m, y = 0 mm
	// x = 1 m, y = 3.125 mm
	// x = 2 m, y = 10 mm
}
