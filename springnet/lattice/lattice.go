package lattice

import (
	"fmt"
	"math"

	"github.com/trestle-go/trestle/springnet/sparse"
)

// Params are the lattice's spacing and bar properties. The zero value of a
// field means its default (DefaultParams).
type Params struct {
	H   float64 // grid spacing [m]
	E   float64 // Young's modulus of the bars [Pa]
	A   float64 // cross-section area of the bars [m²]
	Rho float64 // density of the bars [kg/m³]
}

// DefaultParams returns the benchmark's parameters: h = 0.1 m,
// E = 200 GPa, A = 1e-4 m², ρ = 7850 kg/m³.
func DefaultParams() Params { return Params{H: 0.1, E: 200e9, A: 1e-4, Rho: 7850} }

// Default holds DefaultParams() for reading (springnet's lattice test uses
// it); New never reads it, so changing it has no effect on the lattice.
var Default = DefaultParams()

// Lattice is a generated space-truss lattice reduced to its free degrees
// of freedom.
type Lattice struct {
	NX, NY, NZ int
	// K is the stiffness matrix [N/m] over the free DOF (lower triangle
	// stored, exact zeros omitted).
	K *sparse.Matrix
	// Mass is the lumped mass diagonal [kg], one value per free DOF.
	Mass []float64
	// Load is the load vector [N]: −1 in z at every node of the top layer.
	Load []float64
	// Coords is the position [m] of the node carrying each free DOF.
	Coords [][3]float64
}

// N returns the number of free DOF, 3·(nx+1)·(ny+1)·nz.
func (l *Lattice) N() int { return len(l.Mass) }

// New generates the nx×ny×nz lattice with parameters p (nil for
// DefaultParams).
// Every value is computed in the order given by the definition, each
// operation rounded on its own, so K, Mass and Load are bit-identical to
// any other faithful implementation. It fails if a size is below 1 or a
// parameter is not positive and finite.
func New(nx, ny, nz int, p *Params) (*Lattice, error) {
	if nx < 1 || ny < 1 || nz < 1 {
		return nil, fmt.Errorf("lattice: size %d×%d×%d: every count must be at least 1", nx, ny, nz)
	}
	prm := DefaultParams()
	if p != nil {
		for _, f := range []struct {
			v   float64
			dst *float64
		}{{p.H, &prm.H}, {p.E, &prm.E}, {p.A, &prm.A}, {p.Rho, &prm.Rho}} {
			if f.v != 0 {
				*f.dst = f.v
			}
		}
	}
	for _, p := range []struct {
		name string
		v    float64
	}{{"H", prm.H}, {"E", prm.E}, {"A", prm.A}, {"Rho", prm.Rho}} {
		if !(p.v > 0) || math.IsInf(p.v, 0) {
			return nil, fmt.Errorf("lattice: parameter %s = %g: must be positive and finite", p.name, p.v)
		}
	}
	n64 := 3 * int64(nx+1) * int64(ny+1) * int64(nz)
	if n64 > math.MaxInt32 {
		return nil, fmt.Errorf("lattice: size %d×%d×%d: %d DOF is too many", nx, ny, nz, n64)
	}

	// Per-class constants, in the order of the definition.
	var g, mh [4]float64
	for m := 1; m <= 3; m++ {
		L := prm.H * math.Sqrt(float64(m))
		k := (prm.E * prm.A) / L
		g[m] = k / float64(m)
		mh[m] = 0.5 * ((prm.Rho * prm.A) * L)
	}

	nfree := (nx + 1) * (ny + 1) * nz
	n := 3 * nfree
	free := func(i, j, k int) int { return i + (nx+1)*(j+(ny+1)*(k-1)) }
	b := sparse.NewBuilder(n)
	l := &Lattice{NX: nx, NY: ny, NZ: nz, Mass: make([]float64, n), Load: make([]float64, n), Coords: make([][3]float64, n)}
	for k := 1; k <= nz; k++ {
		for j := 0; j <= ny; j++ {
			for i := 0; i <= nx; i++ {
				f := free(i, j, k)
				var S [4][3][3]int
				var N [4]int
				for dk := -1; dk <= 1; dk++ {
					for dj := -1; dj <= 1; dj++ {
						for di := -1; di <= 1; di++ {
							if di == 0 && dj == 0 && dk == 0 {
								continue
							}
							qi, qj, qk := i+di, j+dj, k+dk
							if qi < 0 || qi > nx || qj < 0 || qj > ny || qk < 0 || qk > nz {
								continue
							}
							s := [3]int{di, dj, dk}
							m := di*di + dj*dj + dk*dk
							N[m]++
							for a := 0; a < 3; a++ {
								for c := 0; c < 3; c++ {
									S[m][a][c] += s[a] * s[c]
								}
							}
							// Off-diagonal block, lower triangle: the free
							// neighbour with the larger index is the row.
							if qk == 0 {
								continue
							}
							q := free(qi, qj, qk)
							if q <= f {
								continue
							}
							for a := 0; a < 3; a++ {
								for c := 0; c < 3; c++ {
									switch s[a] * s[c] {
									case 1:
										b.Add(3*q+a, 3*f+c, -g[m])
									case -1:
										b.Add(3*q+a, 3*f+c, g[m])
									}
								}
							}
						}
					}
				}
				for a := 0; a < 3; a++ {
					for c := 0; c <= a; c++ {
						v := float64(float64(g[1]*float64(S[1][a][c]))+float64(g[2]*float64(S[2][a][c]))) + float64(g[3]*float64(S[3][a][c]))
						if v != 0 {
							b.Add(3*f+a, 3*f+c, v)
						}
					}
				}
				mass := float64(float64(mh[1]*float64(N[1]))+float64(mh[2]*float64(N[2]))) + float64(mh[3]*float64(N[3]))
				pos := [3]float64{float64(i) * prm.H, float64(j) * prm.H, float64(k) * prm.H}
				for a := 0; a < 3; a++ {
					l.Mass[3*f+a] = mass
					l.Coords[3*f+a] = pos
				}
				if k == nz {
					l.Load[3*f+2] = -1
				}
			}
		}
	}
	l.K = b.Matrix()
	return l, nil
}
