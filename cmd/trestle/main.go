// Command trestle analyses machine stands modelled as networks of bars,
// springs and beams, and reduces tap-test ring-down records. See doc.go.
package main

import (
	"fmt"
	"os"
)

func main() {
	if err := run(os.Args[1:], os.Stdin, os.Stdout, os.Stderr); err != nil {
		fmt.Fprintln(os.Stderr, "trestle:", err)
		os.Exit(1)
	}
}
