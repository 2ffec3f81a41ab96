package lattice_test

import (
	"fmt"

	"github.com/trestle-go/trestle/springnet/lattice"
)

// A single cubic cell: 4 free top nodes, 12 DOF. The lumped mass of the
// top layer in x is half of every bar touching it plus the full top bars:
// ρ·A·h·(6 + 6√2 + 2√3) = 7850·1e-4·0.1·17.949 = 1.409 kg; the load is
// −1 N at each top node.
func ExampleNew() {
	l, err := lattice.New(1, 1, 1, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	mx, fz := 0.0, 0.0
	for f := 0; f < l.N()/3; f++ {
		mx += l.Mass[3*f]
		fz += l.Load[3*f+2]
	}
	fmt.Printf("DOF %d, top mass in x %.4g kg, load %.4g N\n", l.N(), mx, fz)
	// Output:
	// DOF 12, top mass in x 1.409 kg, load -4 N
}
