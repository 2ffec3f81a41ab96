package springnet_test

import (
	"fmt"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/lattice"
)

// latticeModel builds the benchmark space-truss lattice as a springnet
// model: nodes at the grid points (spacing h), a bar from every node to
// each of its 26 neighbours (face, edge and body diagonals), the base
// layer z = 0 fixed, and −1 N in z at every node of the top layer. Nodes
// are added layer by layer, x fastest, so the free equations come out in
// the lattice package's order.
func latticeModel(nx, ny, nz int) *springnet.Model {
	p := lattice.DefaultParams()
	var m springnet.Model
	id := func(i, j, k int) springnet.NodeID { return springnet.NodeID(i + (nx+1)*(j+(ny+1)*k)) }
	for k := 0; k <= nz; k++ {
		for j := 0; j <= ny; j++ {
			for i := 0; i <= nx; i++ {
				n := m.AddNode("", springnet.Vec{X: float64(i) * p.H, Y: float64(j) * p.H, Z: float64(k) * p.H})
				if k == 0 {
					m.Fix(n, springnet.Translations)
				}
			}
		}
	}
	for k := 0; k <= nz; k++ {
		for j := 0; j <= ny; j++ {
			for i := 0; i <= nx; i++ {
				for dk := -1; dk <= 1; dk++ {
					for dj := -1; dj <= 1; dj++ {
						for di := -1; di <= 1; di++ {
							qi, qj, qk := i+di, j+dj, k+dk
							if qi < 0 || qi > nx || qj < 0 || qj > ny || qk < 0 || qk > nz {
								continue
							}
							a, b := id(i, j, k), id(qi, qj, qk)
							if b <= a || (k == 0 && qk == 0) {
								continue // each bar once; base-to-base bars carry nothing
							}
							m.AddBar(a, b, springnet.Bar{EA: p.E * p.A, LineMass: p.Rho * p.A})
						}
					}
				}
				if k == nz {
					m.AddLoad(id(i, j, k), springnet.Load{FZ: -1})
				}
			}
		}
	}
	return &m
}

func TestLatticeMatchesDefinition(t *testing.T) {
	// The lattice package builds K, the lumped mass and the load straight
	// from the benchmark's definition (checked there against the
	// definition's SHA-256 digests); assembling the same lattice from bars
	// must give the same matrices, entry by entry, to round-off.
	const nx, ny, nz = 3, 2, 3
	ref, err := lattice.New(nx, ny, nz, nil)
	require.NoError(t, err)
	m := latticeModel(nx, ny, nz)
	m.SetGravity(springnet.DefaultCase, springnet.Vec{}) // no self-weight: the load is the definition's
	sys, err := springnet.Assemble(m, materials.Nominal)
	require.NoError(t, err)
	require.Equal(t, ref.N(), sys.N())
	const tol = 1e-12 // relative to the largest entry: the two sum the same terms in another order
	kmax := 0.0
	for j := 0; j < ref.N(); j++ {
		_, vals := ref.K.Col(j)
		for _, v := range vals {
			kmax = math.Max(kmax, math.Abs(v))
		}
	}
	for j := 0; j < ref.N(); j++ {
		for i := j; i < ref.N(); i++ {
			if d := math.Abs(ref.K.At(i, j) - sys.K().At(i, j)); d > tol*kmax {
				t.Fatalf("K[%d][%d] = %g, lattice %g", i, j, sys.K().At(i, j), ref.K.At(i, j))
			}
		}
		assert.InEpsilon(t, ref.Mass[j], sys.M().At(j, j), tol)
	}
	load := sys.LoadTo(nil, springnet.DefaultCase)
	assert.Equal(t, ref.Load, load)
}

func BenchmarkStaticLattice(b *testing.B) {
	for _, n := range []int{10, 20} {
		m := latticeModel(n, n, n)
		b.Run(fmt.Sprintf("%d^3/new", n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := springnet.Static(m, nil); err != nil {
					b.Fatal(err)
				}
			}
		})
		b.Run(fmt.Sprintf("%d^3/reused", n), func(b *testing.B) {
			b.ReportAllocs()
			var s springnet.Solver
			for b.Loop() {
				if _, err := s.Static(m, nil); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
