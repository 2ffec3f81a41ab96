package materials_test

import (
	"fmt"

	"github.com/trestle-go/trestle/materials"
)

func ExampleLookup() {
	m, err := materials.Lookup("Concrete_C25-30") // case and separators do not matter
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, l := range materials.Levels {
		fmt.Printf("%s: E %.4g GPa, loss factor %.4g\n", l, m.E.At(l)/1e9, m.Loss.At(l))
	}
	fmt.Println(m.Refs("E")[0])

	_, err = materials.Lookup("steel S275")
	fmt.Println(err)
	// Output:
	// low: E 22.03 GPa, loss factor 0.005
	// nominal: E 31.48 GPa, loss factor 0.015
	// high: E 37.77 GPa, loss factor 0.03
	// Eurocode 2 EN 1992-1-1 Table 3.1: Ecm = 22 (fcm/10)^0.3 GPa, fcm = fck + 8 MPa
	// materials: no material "steel S275" in the catalogue; closest: "steel S235", "steel S355", "steel A36"
}

func ExampleConcreteEC2() {
	const mpa = 1e6
	m, err := materials.ConcreteEC2(30 * mpa)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s: Ecm %.4g GPa (range %.4g–%.4g GPa), density %.4g kg/m³\n",
		m.Name, m.E.Nominal/1e9, m.E.Low/1e9, m.E.High/1e9, m.Density)

	_, err = materials.ConcreteEC2(95 * mpa)
	fmt.Println(err)
	// Output:
	// concrete C30/37: Ecm 32.84 GPa (range 22.99–39.4 GPa), density 2400 kg/m³
	// materials: EC2 concrete fck 95 MPa is outside 12–90 MPa (EN 1992-1-1 Table 3.1 classes C12/15 to C90/105)
}

func ExampleFromLogDecrement() {
	// A tap test shows successive peaks falling from 1.00 to 0.94:
	// δ = ln(1.00/0.94).
	d, err := materials.FromLogDecrement(0.0618754)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("ζ %.4g, η %.4g, Q %.4g, ψ %.4g\n", d.Ratio, d.LossFactor, d.Q, d.SpecificCap)
	fmt.Printf("small-damping ζ ≈ δ/2π: %.4g\n", materials.ApproxRatioFromLogDecrement(0.0618754))
	// Output:
	// ζ 0.009847, η 0.01969, Q 50.78, ψ 0.1164
	// small-damping ζ ≈ δ/2π: 0.009848
}

func ExampleMaterial_At() {
	oak, err := materials.Lookup("white oak")
	if err != nil {
		fmt.Println(err)
		return
	}
	p := oak.At(materials.Low)
	fmt.Printf("%s at %s: E %.4g GPa, G %.4g GPa, %.4g kg/m³\n", oak.Name, materials.Low, p.E/1e9, p.G/1e9, p.Density)
	// Output:
	// timber white oak at low: E 7.849 GPa, G 0.4905 GPa, 762 kg/m³
}
