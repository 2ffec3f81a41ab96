package modelfile_test

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/springnet/modelfile"
	"gonum.org/v1/gonum/mat"
)

// TestRotatedBoxTensor: a machine given as a uniform box turned in space,
// its inertia written as the full tensor J = R·diag(Ia, Ib, Ic)·Rᵀ about
// the centre (R's columns are the box's edges in global axes), reads into
// a springnet.Mass whose Tensor() is that J. The box's principal moments
// are the closed form Ia = m(b² + c²)/12, Ib = m(a² + c²)/12,
// Ic = m(a² + b²)/12 (Meriam & Kraige, Engineering Mechanics: Dynamics,
// table of mass moments of inertia, rectangular prism); the tensor read
// must have them as eigenvalues whatever R is. For a turn θ about Z alone
// the product of inertia follows from its definition: a point at box
// coordinates (u, v) is at x = u·cosθ − v·sinθ, y = u·sinθ + v·cosθ, so
// P_xy = ∫xy dm = sinθ·cosθ·(∫u² dm − ∫v² dm) = sinθ·cosθ·m(a² − b²)/12
// (∫uv dm = 0 by symmetry, ∫u² dm = m·a²/12).
func TestRotatedBoxTensor(t *testing.T) {
	const (
		m       = 120.0         // kg, demo value
		a, b, c = 0.8, 0.5, 0.3 // box edges along its own axes [m], demo values
		tol     = 1e-12         // tensor entries written with 17 figures and read back: round-off of a few ulps of the trace
		eigTol  = 1e-10         // a 3×3 symmetric eigen decomposition: round-off
	)
	principal := [3]float64{m * (b*b + c*c) / 12, m * (a*a + c*c) / 12, m * (a*a + b*b) / 12}
	rz := func(th float64) [3][3]float64 {
		s, co := math.Sincos(th)
		return [3][3]float64{{co, -s, 0}, {s, co, 0}, {0, 0, 1}}
	}
	rx := func(th float64) [3][3]float64 {
		s, co := math.Sincos(th)
		return [3][3]float64{{1, 0, 0}, {0, co, -s}, {0, s, co}}
	}
	mul := func(p, q [3][3]float64) (r [3][3]float64) {
		for i := range 3 {
			for j := range 3 {
				for k := range 3 {
					r[i][j] += p[i][k] * q[k][j]
				}
			}
		}
		return r
	}
	tests := []struct {
		name string
		r    [3][3]float64
		pxy  float64 // NaN: no closed form checked beyond the eigenvalues
	}{
		{"30° about Z", rz(math.Pi / 6), math.Sin(math.Pi/6) * math.Cos(math.Pi/6) * m * (a*a - b*b) / 12},
		{"30° about Z after 20° about X", mul(rz(math.Pi/6), rx(math.Pi/9)), math.NaN()},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			var d, rt [3][3]float64
			for i := range 3 {
				d[i][i] = principal[i]
				for j := range 3 {
					rt[i][j] = tc.r[j][i]
				}
			}
			j := mul(mul(tc.r, d), rt)
			// Symmetric to round-off; write it exactly symmetric, as a person would.
			rows := make([]string, 3)
			for i := range 3 {
				var e [3]string
				for k := range 3 {
					e[k] = fmt.Sprintf("%.17g", (j[i][k]+j[k][i])/2)
				}
				rows[i] = "[" + strings.Join(e[:], ", ") + "]"
			}
			text := `[nodes]
A = [0, 0, 0]
B = [0, 0, 1]
[[bar]]
ends = ["A", "B"]
EA = 1e6
[[support]]
at = ["A", "B"]
fix = "all"
[[mass]]
name = "machine"
on = "B"
mass = 120
inertia = [` + strings.Join(rows, ", ") + `]
`
			f, err := modelfile.Read("box.toml", strings.NewReader(text))
			require.NoError(t, err, text)
			require.Equal(t, 1, f.Model.NumMasses())
			_, ms := f.Model.MassOf(0)
			got := ms.Tensor()
			trace := principal[0] + principal[1] + principal[2]
			for i := range 3 {
				for k := range 3 {
					assert.InDelta(t, j[i][k], got[i][k], tol*trace, "J[%d][%d]", i, k)
				}
			}
			if !math.IsNaN(tc.pxy) {
				assert.InDelta(t, tc.pxy, ms.Products.Z, tol*trace, "P_xy = ∫xy dm")
				assert.InDelta(t, 0, ms.Products.X, tol*trace)
				assert.InDelta(t, 0, ms.Products.Y, tol*trace)
			}
			s := mat.NewSymDense(3, nil)
			for i := range 3 {
				for k := i; k < 3; k++ {
					s.SetSym(i, k, got[i][k])
				}
			}
			var es mat.EigenSym
			require.True(t, es.Factorize(s, false))
			ev := es.Values(nil) // ascending; a > b > c makes Ia < Ib < Ic
			for i := range ev {
				assert.InDelta(t, principal[i], ev[i], eigTol*trace, "principal moment %d", i)
			}
		})
	}
}
