package lattice

import (
	"errors"
	"fmt"
	"os"

	"github.com/trestle-go/trestle/springnet/sparse"
)

// WriteFiles writes the lattice in Matrix Market form to prefix+".mtx"
// (K, coordinate real symmetric, lower triangle), prefix+"_mass.mtx" (the
// lumped mass diagonal) and prefix+"_load.mtx" (the load vector), both
// array real general n×1. Values parse back to the identical float64s.
func (l *Lattice) WriteFiles(prefix string) error {
	desc := fmt.Sprintf("space-truss lattice %dx%dx%d (trestle springnet/lattice)", l.NX, l.NY, l.NZ)
	if err := writeFile(prefix+".mtx", func(f *os.File) error {
		return sparse.WriteMatrix(f, l.K, desc+": stiffness K [N/m]")
	}); err != nil {
		return err
	}
	if err := writeFile(prefix+"_mass.mtx", func(f *os.File) error {
		return sparse.WriteVector(f, l.Mass, desc+": lumped mass diagonal [kg]")
	}); err != nil {
		return err
	}
	return writeFile(prefix+"_load.mtx", func(f *os.File) error {
		return sparse.WriteVector(f, l.Load, desc+": load b [N]")
	})
}

func writeFile(name string, write func(*os.File) error) error {
	f, err := os.Create(name)
	if err != nil {
		return fmt.Errorf("lattice: %w", err)
	}
	err = write(f)
	if cerr := f.Close(); err == nil {
		err = cerr
	}
	if err != nil {
		return errors.Join(fmt.Errorf("lattice: writing %s: %w", name, err), os.Remove(name))
	}
	return nil
}
