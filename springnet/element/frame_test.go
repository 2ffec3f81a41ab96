package element_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet/element"
)

// axisTol: unit vectors built from a handful of products and one square
// root are exact to a few ulps; 1e-12 is far above round-off and far below
// any real error in an axis.
const axisTol = 1e-12

func TestNewFrameAxes(t *testing.T) {
	tests := []struct {
		name       string
		a, b, up   element.Vec3
		roll       float64
		ex, ey, ez element.Vec3 // by hand from the convention in NewFrame's doc
	}{
		{"along X, default up Z", element.Vec3{}, element.Vec3{2, 0, 0}, element.Vec3{}, 0,
			element.Vec3{1, 0, 0}, element.Vec3{0, 1, 0}, element.Vec3{0, 0, 1}},
		{"along Y, default up Z", element.Vec3{1, 1, 1}, element.Vec3{1, 4, 1}, element.Vec3{}, 0,
			element.Vec3{0, 1, 0}, element.Vec3{-1, 0, 0}, element.Vec3{0, 0, 1}},
		{"vertical, default up falls back to Y", element.Vec3{}, element.Vec3{0, 0, 3}, element.Vec3{}, 0,
			element.Vec3{0, 0, 1}, element.Vec3{1, 0, 0}, element.Vec3{0, 1, 0}},
		{"vertical downward, default up Y", element.Vec3{0, 0, 3}, element.Vec3{}, element.Vec3{}, 0,
			element.Vec3{0, 0, -1}, element.Vec3{-1, 0, 0}, element.Vec3{0, 1, 0}},
		{"along X, up tilted: only its normal part counts", element.Vec3{}, element.Vec3{1, 0, 0}, element.Vec3{5, 0, 2}, 0,
			element.Vec3{1, 0, 0}, element.Vec3{0, 1, 0}, element.Vec3{0, 0, 1}},
		{"along X, up Y", element.Vec3{}, element.Vec3{1, 0, 0}, element.Vec3{0, 1, 0}, 0,
			element.Vec3{1, 0, 0}, element.Vec3{0, 0, -1}, element.Vec3{0, 1, 0}},
		{"along X, roll 90°: y turns to old z", element.Vec3{}, element.Vec3{1, 0, 0}, element.Vec3{}, math.Pi / 2,
			element.Vec3{1, 0, 0}, element.Vec3{0, 0, 1}, element.Vec3{0, -1, 0}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			f, err := element.NewFrame(tc.a, tc.b, tc.up, tc.roll)
			require.NoError(t, err)
			assert.InDelta(t, math.Sqrt(sq(sub3(tc.b, tc.a))), f.L, axisTol)
			assertVec(t, tc.ex, f.Ex, axisTol, "Ex")
			assertVec(t, tc.ey, f.Ey, axisTol, "Ey")
			assertVec(t, tc.ez, f.Ez, axisTol, "Ez")
			assertVec(t, tc.b, f.B(), axisTol, "B")
		})
	}
}

// TestNewFrameOrthonormal checks, for random members, that the axes are
// orthonormal and right-handed (Ex × Ey = Ez), that Ez leans towards up, and
// that ToLocal inverts ToGlobal.
func TestNewFrameOrthonormal(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	for range 200 {
		a := element.Vec3{rng.NormFloat64(), rng.NormFloat64(), rng.NormFloat64()}
		b := element.Vec3{rng.NormFloat64(), rng.NormFloat64(), rng.NormFloat64()}
		up := element.Vec3{rng.NormFloat64(), rng.NormFloat64(), rng.NormFloat64()}
		roll := 0.0
		f, err := element.NewFrame(a, b, up, roll)
		require.NoError(t, err)
		for _, v := range [3]element.Vec3{f.Ex, f.Ey, f.Ez} {
			assert.InDelta(t, 1, dot3(v, v), axisTol)
		}
		assert.InDelta(t, 0, dot3(f.Ex, f.Ey), axisTol)
		assert.InDelta(t, 0, dot3(f.Ex, f.Ez), axisTol)
		assert.InDelta(t, 0, dot3(f.Ey, f.Ez), axisTol)
		assertVec(t, f.Ez, cross3(f.Ex, f.Ey), axisTol, "right-handed")
		assert.Positive(t, dot3(f.Ez, up), "Ez leans towards up")
		assert.InDelta(t, 0, dot3(f.Ey, up), 1e-12*math.Sqrt(sq(up)), "up lies in the x–z plane") // round-off of unit vectors
		v := element.Vec3{rng.NormFloat64(), rng.NormFloat64(), rng.NormFloat64()}
		assertVec(t, v, f.ToGlobal(f.ToLocal(v)), axisTol, "round trip")
	}
}

func TestNewFrameErrors(t *testing.T) {
	tests := []struct {
		name     string
		a, b, up element.Vec3
		roll     float64
		want     error
	}{
		{"zero length", element.Vec3{1, 2, 3}, element.Vec3{1, 2, 3}, element.Vec3{}, 0, element.ErrZeroLength},
		{"up parallel", element.Vec3{}, element.Vec3{1, 1, 0}, element.Vec3{-2, -2, 0}, 0, element.ErrParallelUp},
		{"NaN end", element.Vec3{math.NaN(), 0, 0}, element.Vec3{1, 0, 0}, element.Vec3{}, 0, element.ErrNotFinite},
		{"Inf roll", element.Vec3{}, element.Vec3{1, 0, 0}, element.Vec3{}, math.Inf(1), element.ErrNotFinite},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := element.NewFrame(tc.a, tc.b, tc.up, tc.roll)
			require.Error(t, err)
			assert.ErrorIs(t, err, tc.want)
			assert.Contains(t, err.Error(), "element:")
		})
	}
}

func assertVec(t *testing.T, want, got element.Vec3, tol float64, msg string) {
	t.Helper()
	for i := range 3 {
		assert.InDelta(t, want[i], got[i], tol, "%s[%d]: want %v got %v", msg, i, want, got)
	}
}

func sub3(a, b element.Vec3) element.Vec3 { return element.Vec3{a[0] - b[0], a[1] - b[1], a[2] - b[2]} }
func dot3(a, b element.Vec3) float64      { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func sq(a element.Vec3) float64           { return dot3(a, a) }
func cross3(a, b element.Vec3) element.Vec3 {
	return element.Vec3{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}
