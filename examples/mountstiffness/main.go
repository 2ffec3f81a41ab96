// Command mountstiffness reads a model file (the demo lathe stand when no
// file is given) and prints the stiffness at each mount: the three
// principal stiffnesses and their directions, at the low, nominal and high
// material levels.
//
//	go run ./examples/mountstiffness [model.toml]
package main

import (
	"bytes"
	"fmt"
	"io"
	"os"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
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
	f, err := modelfile.Read(name, bytes.NewReader(text))
	if err != nil {
		return err
	}
	if f.Model.NumMounts() == 0 {
		return fmt.Errorf("%s: no mounts to measure", name)
	}
	fmt.Fprintf(w, "%s\n", f.Title)
	for p := 0; p < f.Model.NumMounts(); p++ {
		id := springnet.MountID(p)
		fmt.Fprintf(w, "mount %q\n", f.Model.MountName(id))
		for _, lv := range materials.Levels {
			ps, err := springnet.MountStiffness(f.Model, id, &springnet.StaticSettings{Level: lv})
			if err != nil {
				return err
			}
			k, dir := ps.Principal()
			fmt.Fprintf(w, "  %-8v", lv)
			for i := range k {
				fmt.Fprintf(w, "  %8.4g N/um along (%.2f, %.2f, %.2f)", springnet.NPerMicron(k[i]), dir[i].X, dir[i].Y, dir[i].Z)
			}
			fmt.Fprintln(w)
		}
	}
	return nil
}
