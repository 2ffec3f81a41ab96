// Command excitation lists the frequencies a machine's running speeds
// excite, from the [[speed]] tables of a model file (the demo lathe stand
// when no file is given), and marks those inside the [response] band: the
// ranges to keep the stand's natural frequencies out of.
//
//	go run ./examples/excitation [model.toml]
package main

import (
	"fmt"
	"io"
	"os"

	"github.com/trestle-go/trestle/springnet/modelfile"
)

func main() {
	if err := run(os.Args[1:], os.Stdout); err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(1)
	}
}

func run(args []string, w io.Writer) error {
	name, text := "lathe-stand.toml", modelfile.Demo()
	if len(args) > 0 {
		var err error
		name = args[0]
		if text, err = os.ReadFile(name); err != nil {
			return err
		}
	}
	c, err := modelfile.Parse(name, text)
	if err != nil {
		return err
	}
	band := c.Dynamics.Band
	fmt.Fprintf(w, "band of interest: %.4g to %.4g Hz\n", band[0], band[1])
	for _, sp := range c.Dynamics.Speeds {
		for k, r := range sp.Excitations() {
			in := ""
			if band != [2]float64{} && r[1] >= band[0] && r[0] <= band[1] {
				in = "  in band"
			}
			fmt.Fprintf(w, "%-14s x%-3d %8.4g to %8.4g Hz%s\n", sp.Name, (k+1)*max(sp.PerRev, 1), r[0], r[1], in)
		}
	}
	return nil
}
