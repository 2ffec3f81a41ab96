package springnet_test

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
)

// massTight is the relative agreement of mass matrices built two ways
// from the same masses: sums of a few products, exact up to round-off.
const massTight = 1e-12

// massMatrixOf assembles the 6×6 mass matrix of one free node carrying
// the masses ms (a foot so that the node is in the model).
func massMatrixOf(t *testing.T, ms ...springnet.Mass) [6][6]float64 {
	t.Helper()
	var m springnet.Model
	n := m.AddNode("N", springnet.Vec{})
	m.AddFoot(n, springnet.Foot{K: springnet.Stiffness6{X: 1, Y: 1, Z: 1, RX: 1, RY: 1, RZ: 1}})
	for _, x := range ms {
		m.AddMass(n, x)
	}
	s, err := springnet.Assemble(&m, materials.Nominal)
	require.NoError(t, err)
	var out [6][6]float64
	for a := 0; a < 6; a++ {
		ea, ok := s.EquationOf(n, springnet.DOF(1)<<a)
		require.True(t, ok)
		for b := 0; b < 6; b++ {
			eb, _ := s.EquationOf(n, springnet.DOF(1)<<b)
			out[a][b] = s.M().At(ea, eb)
		}
	}
	return out
}

func TestMassProducts(t *testing.T) {
	// Two equal point masses m at c ± d are, about their centre c, a body
	// of mass 2m with (by the definitions, any dynamics text, e.g. Meriam
	// & Kraige, Dynamics, products of inertia):
	//   Jx = 2m(d_y² + d_z²), …,  P_yz = ∫yz dm = 2m·d_y·d_z, …
	// The rigid-body mass matrix of the pair and that of one Mass with
	// these moments and products must be the same.
	const kg = 7.5
	c := springnet.Vec{X: 0.3, Y: -0.2, Z: 0.5}
	d := springnet.Vec{X: 0.4, Y: 0.25, Z: -0.15}
	pair := massMatrixOf(t, springnet.Mass{Kg: kg, Offset: c.Add(d)}, springnet.Mass{Kg: kg, Offset: c.Sub(d)})
	one := springnet.Mass{Kg: 2 * kg, Offset: c,
		Inertia:  springnet.Vec{X: 2 * kg * (d.Y*d.Y + d.Z*d.Z), Y: 2 * kg * (d.Z*d.Z + d.X*d.X), Z: 2 * kg * (d.X*d.X + d.Y*d.Y)},
		Products: springnet.Vec{X: 2 * kg * d.Y * d.Z, Y: 2 * kg * d.Z * d.X, Z: 2 * kg * d.X * d.Y}}
	single := massMatrixOf(t, one)
	scale := 2 * kg
	for a := 0; a < 6; a++ {
		for b := 0; b < 6; b++ {
			assert.InDelta(t, pair[a][b], single[a][b], massTight*scale, "M[%d][%d]", a, b)
		}
	}
	// And both are what the parallel-axis theorem gives about the node: the
	// RX–RY term is −Σ m·x·y = −2m(c_x·c_y + d_x·d_y) (a wrong sign of the
	// products would miss it by 4m·d_x·d_y).
	assert.InDelta(t, -2*kg*(c.X*c.Y+d.X*d.Y), single[3][4], massTight*scale)
	assert.InDelta(t, -2*kg*(c.Y*c.Z+d.Y*d.Z), single[4][5], massTight*scale)
	assert.InDelta(t, -2*kg*(c.Z*c.X+d.Z*d.X), single[3][5], massTight*scale)

	// Tensor: moments on the diagonal, −products off it.
	jt := one.Tensor()
	assert.Equal(t, -one.Products.Z, jt[0][1])
	assert.Equal(t, -one.Products.Y, jt[0][2])
	assert.Equal(t, -one.Products.X, jt[1][2])
	assert.Equal(t, jt[1][0], jt[0][1])

	// Machine.Masses gives one Mass carrying the tensor.
	ms, err := springnet.Machine{Kg: 2 * kg, CG: c, Inertia: jt}.Masses()
	require.NoError(t, err)
	require.Len(t, ms, 1)
	assert.Equal(t, one.Inertia, ms[0].Inertia)
	assert.InDelta(t, one.Products.X, ms[0].Products.X, massTight*scale)
	assert.InDelta(t, one.Products.Y, ms[0].Products.Y, massTight*scale)
	assert.InDelta(t, one.Products.Z, ms[0].Products.Z, massTight*scale)
}

func TestMassProductsValidate(t *testing.T) {
	for _, tc := range []struct {
		name string
		ms   springnet.Mass
		want string // "" when valid
	}{
		// Two point masses as above: a body.
		{"pair", springnet.Mass{Kg: 1, Inertia: springnet.Vec{X: 2, Y: 2, Z: 4}, Products: springnet.Vec{Z: 2}}, ""},
		// Jx = Jy = 1, P_xy = 2: principal moments 3 and −1 in the XY
		// plane: not positive semidefinite.
		{"indefinite", springnet.Mass{Kg: 1, Inertia: springnet.Vec{X: 1, Y: 1, Z: 2}, Products: springnet.Vec{Z: 2}}, "principal moments"},
		// Principal moments 1.5, 0.5, 5: 5 > 1.5 + 0.5.
		{"triangle inequality", springnet.Mass{Kg: 1, Inertia: springnet.Vec{X: 1, Y: 1, Z: 5}, Products: springnet.Vec{Z: 0.5}}, "principal moments"},
		{"not finite", springnet.Mass{Kg: 1, Inertia: springnet.Vec{X: 1, Y: 1, Z: 1}, Products: springnet.Vec{X: math.Inf(1)}}, "not finite"},
		// Without products a rotary inertia about one axis stays allowed.
		{"one axis", springnet.Mass{Kg: 1, Inertia: springnet.Vec{Z: 3}}, ""},
	} {
		t.Run(tc.name, func(t *testing.T) {
			var m springnet.Model
			n := m.AddNode("N", springnet.Vec{})
			m.Fix(n, springnet.AllDOF)
			m.AddMass(n, tc.ms)
			err := m.Validate()
			if tc.want == "" {
				assert.NoError(t, err)
				return
			}
			assert.ErrorContains(t, err, tc.want)
			assert.ErrorContains(t, err, "springnet: mass 0 at")
		})
	}
}
