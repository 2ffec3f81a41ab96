// Command generate writes the model file of a plain stand from a few
// numbers: a 3 × 2 frame of square tube with stretchers, a braced back, a
// rigid top and levelling feet. Edit the result by hand, or change the
// numbers here.
//
//	go run ./examples/generate > stand.toml
package main

import (
	"fmt"
	"io"
	"os"

	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/modelfile"
)

func main() {
	if err := run(os.Stdout); err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(1)
	}
}

// layout is the stand this program generates (SI units).
func layout() modelfile.Layout {
	return modelfile.Layout{
		Title: "Generated stand: 3 x 2 legs, 1.8 x 0.7 m, 0.85 m high",
		LegsX: 3, LegsY: 2,
		Width: 1.8, Depth: 0.7, Height: 0.85,
		Material:   "steel S235",
		Section:    "square-tube 60x4 mm",
		Stretchers: []float64{0.15}, StretcherSection: "rect-tube 50x30x3 mm",
		Bracing:      []modelfile.Bracing{{Face: modelfile.Back, Pattern: modelfile.Cross}},
		BraceSection: "flat 40x6 mm",
		Top:          modelfile.RigidTop,
		Feet:         springnet.Stiffness6{X: 5e6, Y: 5e6, Z: 5e7}, CompressionOnly: true,
		MachineMass: 650, MachineHeight: 0.35,
		TopLoad: 3000,
		Units:   modelfile.Units{Length: "mm", Force: "N", Stiffness: "N/um"},
	}
}

func run(w io.Writer) error {
	f, err := modelfile.Generate(layout())
	if err != nil {
		return err
	}
	return modelfile.Write(w, f)
}
