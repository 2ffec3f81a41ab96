package sections_test

import (
	"fmt"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
)

const mm = 1e-3

func ExampleParse() {
	s, err := sections.Parse("rect-tube 100x50x4 mm r=8")
	if err != nil {
		fmt.Println(err)
		return
	}
	p, err := s.Properties()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(sections.Spec(s))
	fmt.Printf("A = %.4g cm², Iy = %.4g cm⁴, Iz = %.4g cm⁴, J = %.4g cm⁴\n", p.A*1e4, p.Iy*1e8, p.Iz*1e8, p.J*1e8)

	_, err = sections.Parse("round-tube 60x40 mm")
	fmt.Println(err)
	// Output:
	// rect-tube 100x50x4 mm r=8
	// A = 10.95 cm², Iy = 134.1 cm⁴, Iz = 44.95 cm⁴, J = 113 cm⁴
	// sections: spec "round-tube 60x40 mm": round-tube 60x40 mm: wall 40 mm is not less than half the diameter 60 mm
}

func ExampleRoundTube() {
	tube := sections.RoundTube{D: 60.3 * mm, T: 3.2 * mm}
	p, err := tube.Properties()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("A = %.4g mm², I = %.4g mm⁴, J = %.4g mm⁴\n", p.A/(mm*mm), p.Iy/(mm*mm*mm*mm), p.J/(mm*mm*mm*mm))
	fmt.Printf("S = %.4g mm³, r = %.4g mm, shear area %.4g of A\n", p.Sy/(mm*mm*mm), p.Ry/mm, p.AsY/p.A)
	// Output:
	// A = 574 mm², I = 2.347e+05 mm⁴, J = 4.694e+05 mm⁴
	// S = 7784 mm³, r = 20.22 mm, shear area 0.5333 of A
}

func ExampleTransformed() {
	steel, err := materials.Lookup("steel S235")
	if err != nil {
		fmt.Println(err)
		return
	}
	concrete, err := materials.Lookup("concrete C25/30")
	if err != nil {
		fmt.Println(err)
		return
	}
	filled := sections.Filled{Tube: sections.RectTube{H: 100 * mm, B: 100 * mm, T: 5 * mm, Conv: sections.EN10219}, Shell: steel, Fill: concrete}
	parts, err := filled.Parts()
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, lv := range materials.Levels {
		ea, eiy, _, _, m := sections.Transformed(parts, lv)
		fmt.Printf("%-7s EA = %.4g MN, EI = %.4g kN·m², mass %.4g kg/m\n", lv, ea/1e6, eiy/1e3, m)
	}
	// Output:
	// low     EA = 535.9 MN, EI = 648.2 kN·m², mass 33.8 kg/m
	// nominal EA = 639.8 MN, EI = 740.1 kN·m², mass 33.8 kg/m
	// high    EA = 694.3 MN, EI = 779.7 kN·m², mass 33.8 kg/m
}

func ExampleList() {
	for _, k := range sections.List()[:3] {
		fmt.Printf("%-6s %s\n", k.Name, k.Example)
	}
	// Output:
	// rect   rect 100x20 mm
	// square square 40 mm
	// round  round 40 mm
}
