package modelfile_test

import (
	"bytes"
	"fmt"
	"strings"

	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/modelfile"
)

// Read a model file and measure the stiffness at a mount.
func ExampleRead() {
	text := `
title = "Two legs and a rigid beam"
[units]
length = "mm"
stiffness = "N/um"

[nodes]
A = [0, 0, 0]
B = [1000, 0, 0]
A-top = [0, 0, 800]
B-top = [1000, 0, 800]

[[beam]]
name = "leg"
ends = [["A", "A-top"], ["B", "B-top"]]
EA = "40 MN"
EIy = "20 kN*m2"
EIz = "20 kN*m2"
GJ = "15 kN*m2"

[[foot]]
at = ["A", "B"]
stiffness = { x = 10, y = 10, z = 100, rx = "5 kN*m/rad", ry = "5 kN*m/rad" }

[[rigid-group]]
name = "beam"
nodes = ["A-top", "B-top"]

[[mount]]
name = "middle"
on = "beam"
at = [500, 0, 800]
`
	f, err := modelfile.Read("legs.toml", strings.NewReader(text))
	if err != nil {
		fmt.Println(err)
		return
	}
	ps, err := springnet.MountStiffness(f.Model, f.MountIDs["middle"], nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	// The load at the middle is symmetric: the legs only stretch. Each leg
	// (EA/L = 40 MN / 0.8 m = 50 N/um) is in series with its foot
	// (100 N/um), and the two are in parallel:
	// 2 / (1/50 + 1/100) = 66.67 N/um.
	fmt.Printf("%s: vertical stiffness %.4g N/um\n", f.Title, ps.Stiffness3()[2][2]/1e6)
	// Output:
	// Two legs and a rigid beam: vertical stiffness 66.67 N/um
}

// Errors point at the line and suggest the name meant.
func ExampleRead_errors() {
	text := `[nodes]
A1 = [0, 0, 0]
C3 = [0, 0, 1]
[[bar]]
name = "brace-3"
ends = ["A1", "C2"]
EA = 1e6
`
	_, err := modelfile.Read("stand.toml", strings.NewReader(text))
	fmt.Println(err)
	// Output:
	// stand.toml:4: bar "brace-3" names unknown node "C2"; did you mean "C3"?
}

// Generate a plain stand and write it as a file to edit.
func ExampleGenerate() {
	f, err := modelfile.Generate(modelfile.Layout{
		LegsX: 2, LegsY: 2, Width: 1.2, Depth: 0.6, Height: 0.8,
		Material: "steel S235", Section: "square-tube 50x3 mm",
		Stretchers: []float64{0.2},
		Bracing:    []modelfile.Bracing{{Face: modelfile.Back}},
		Feet:       springnet.Stiffness6{X: 5e6, Y: 5e6, Z: 5e7}, CompressionOnly: true,
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(f.Model.NumNodes(), "nodes,", f.Model.NumElements(), "elements")
	var buf bytes.Buffer
	if err := modelfile.Write(&buf, f); err != nil {
		fmt.Println(err)
		return
	}
	// The top of the file.
	lines := strings.Split(buf.String(), "\n")
	fmt.Println(strings.Join(lines[1:7], "\n"))
	// Output:
	// 12 nodes, 18 elements
	// title = "Generated 2 × 2 frame, 1.2 × 0.6 × 0.8 m"
	//
	// [units]
	// length = "mm"
	// force = "N"
	//
}

// The demo file: a welded stand for a small lathe.
func ExampleDemo() {
	f, err := modelfile.Read("lathe-stand.toml", bytes.NewReader(modelfile.Demo()))
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(f.Title)
	for _, sp := range f.Dynamics.Speeds {
		fmt.Printf("%s: %.4g to %.4g Hz, %d per revolution\n", sp.Name, sp.Low, sp.High, max(sp.PerRev, 1))
	}
	// Output:
	// Welded stand for a small lathe
	// spindle: 1 to 36.67 Hz, 1 per revolution
	// motor: 24 to 24 Hz, 1 per revolution
	// change gears: 1 to 36.67 Hz, 24 per revolution
}
