package draw_test

import (
	"bytes"
	"fmt"
	"strings"

	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/draw"
)

// A picture of a two-leg frame: geometry from the model, a displaced
// shape and values per member from the caller.
func Example() {
	var m springnet.Model
	a := m.AddNode("A", springnet.Vec{})
	b := m.AddNode("B", springnet.Vec{X: 1})
	c := m.AddNode("C", springnet.Vec{Z: 0.8})
	d := m.AddNode("D", springnet.Vec{X: 1, Z: 0.8})
	m.AddBeam(a, c, springnet.Beam{Name: "left"})
	m.AddBeam(b, d, springnet.Beam{Name: "right"})
	m.AddBeam(c, d, springnet.Beam{Name: "top"})
	m.AddFoot(a, springnet.Foot{K: springnet.Stiffness6{X: 1e7, Y: 1e7, Z: 1e8}})
	m.Fix(b, springnet.AllDOF)

	s := draw.FromModel(&m)
	s.Title = "portal frame"
	s.Nodes[2].Move = draw.Point{X: 0.4e-3} // sway of the top [m]
	s.Nodes[3].Move = draw.Point{X: 0.4e-3}
	s.Shape = "deflection under a side load"
	s.Colours = draw.Colours{Name: "utilisation", Max: 1, Percent: true}
	for i, u := range []float64{0.35, 0.8, 0.1} {
		s.Members[i].Value, s.Members[i].Rated = u, true
	}

	var svg bytes.Buffer
	if err := s.SVG(&svg); err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("member lines: %d (3 members × 4 views)\n", strings.Count(svg.String(), `class="member"`))
	fmt.Printf("magnification: %.4g\n", s.AutoScale())
	// Between the amber (0.75) and orange (0.9) stops, a third of the way.
	fmt.Printf("colour at 80 %%: %v\n", draw.Colour(0.8, 1))
	// Output:
	// member lines: 12 (3 members × 4 views)
	// magnification: 200
	// colour at 80 %: {237 153 32 255}
}
