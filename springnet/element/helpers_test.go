package element_test

import (
	"math"
	"sort"
	"testing"

	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/mat"

	"github.com/trestle-go/trestle/springnet/element"
)

// residualTol bounds the relative residual of the dense reference solves in
// these tests: gonum's LU on well-conditioned systems of at most a few
// hundred unknowns lands near 1e-14; 1e-9 leaves room for the stiffness
// ratios of beams (EA/L against EI/L³).
const residualTol = 1e-9

// dense6 copies a Mat6 into a gonum matrix.
func dense6(k element.Mat6) *mat.Dense {
	d := mat.NewDense(6, 6, nil)
	for i := range 6 {
		for j := range 6 {
			d.Set(i, j, k[i][j])
		}
	}
	return d
}

// dense12 copies a Mat12 into a gonum matrix.
func dense12(k element.Mat12) *mat.Dense {
	d := mat.NewDense(12, 12, nil)
	for i := range 12 {
		for j := range 12 {
			d.Set(i, j, k[i][j])
		}
	}
	return d
}

// rank returns the numerical rank of a from gonum's SVD, counting singular
// values above tol times the largest.
func rank(t *testing.T, a mat.Matrix, tol float64) int {
	t.Helper()
	var svd mat.SVD
	require.True(t, svd.Factorize(a, mat.SVDNone))
	s := svd.Values(nil)
	r := 0
	for _, v := range s {
		if v > tol*s[0] {
			r++
		}
	}
	return r
}

// system is a small dense structure: nodes with six DOF each.
type system struct {
	n    int
	k, m *mat.Dense
	f    []float64
	fix  []bool
}

func newSystem(nodes int) *system {
	n := 6 * nodes
	return &system{n: n, k: mat.NewDense(n, n, nil), m: mat.NewDense(n, n, nil), f: make([]float64, n), fix: make([]bool, n)}
}

// add12 adds a two-node element matrix into dst at nodes a and b.
func (s *system) add12(dst *mat.Dense, k element.Mat12, a, b int) {
	idx := [2]int{6 * a, 6 * b}
	for i := range 12 {
		for j := range 12 {
			r, c := idx[i/6]+i%6, idx[j/6]+j%6
			dst.Set(r, c, dst.At(r, c)+k[i][j])
		}
	}
}

// addBar adds a bar matrix (translations only) into dst at nodes a and b.
func (s *system) addBar(dst *mat.Dense, k element.Mat6, a, b int) {
	idx := [2]int{6 * a, 6 * b}
	for i := range 6 {
		for j := range 6 {
			r, c := idx[i/3]+i%3, idx[j/3]+j%3
			dst.Set(r, c, dst.At(r, c)+k[i][j])
		}
	}
}

// fixNode fixes the listed DOF (0..5) of node; no list fixes all six.
func (s *system) fixNode(node int, dofs ...int) {
	if len(dofs) == 0 {
		dofs = []int{0, 1, 2, 3, 4, 5}
	}
	for _, d := range dofs {
		s.fix[6*node+d] = true
	}
}

func (s *system) free() []int {
	var fr []int
	for i := range s.n {
		if !s.fix[i] {
			fr = append(fr, i)
		}
	}
	return fr
}

func (s *system) reduce(a *mat.Dense) *mat.Dense {
	fr := s.free()
	r := mat.NewDense(len(fr), len(fr), nil)
	for i, p := range fr {
		for j, q := range fr {
			r.Set(i, j, a.At(p, q))
		}
	}
	return r
}

// solve returns the displacement of every DOF (zero where fixed) under s.f,
// checking the residual of the reduced solve.
func (s *system) solve(t *testing.T) []float64 {
	t.Helper()
	fr := s.free()
	kr := s.reduce(s.k)
	fv := mat.NewVecDense(len(fr), nil)
	for i, p := range fr {
		fv.SetVec(i, s.f[p])
	}
	var x mat.VecDense
	require.NoError(t, x.SolveVec(kr, fv))
	var r mat.VecDense
	r.MulVec(kr, &x)
	r.SubVec(&r, fv)
	require.LessOrEqual(t, mat.Norm(&r, 2), residualTol*mat.Norm(fv, 2), "residual")
	u := make([]float64, s.n)
	for i, p := range fr {
		u[p] = x.AtVec(i)
	}
	return u
}

// genEig returns, ascending, the eigenvalues μ of A·x = μ·B·x for symmetric A
// and symmetric positive definite B, by the Cholesky reduction
// B = L·Lᵀ, C = L⁻¹·A·L⁻ᵀ (Golub and Van Loan, Matrix Computations, symmetric-definite problem).
// gonum has no dense generalized symmetric solver, so this is the reference.
func genEig(t *testing.T, a, b *mat.Dense) []float64 {
	t.Helper()
	n, _ := b.Dims()
	var chol mat.Cholesky
	require.True(t, chol.Factorize(mat.NewSymDense(n, symData(b))), "B not positive definite")
	var l mat.TriDense
	chol.LTo(&l)
	// C = L⁻¹ A L⁻ᵀ: solve L·Y = A, then L·Cᵀ = Yᵀ.
	var y, c mat.Dense
	require.NoError(t, y.Solve(&l, a))
	require.NoError(t, c.Solve(&l, y.T()))
	cs := mat.NewSymDense(n, nil)
	for i := range n {
		for j := i; j < n; j++ {
			cs.SetSym(i, j, 0.5*(c.At(i, j)+c.At(j, i)))
		}
	}
	var es mat.EigenSym
	require.True(t, es.Factorize(cs, false))
	v := es.Values(nil)
	sort.Float64s(v)
	return v
}

func symData(a *mat.Dense) []float64 {
	n, _ := a.Dims()
	d := make([]float64, n*n)
	for i := range n {
		for j := range n {
			d[i*n+j] = 0.5 * (a.At(i, j) + a.At(j, i))
		}
	}
	return d
}

// maxAbs12 returns the largest absolute entry of k.
func maxAbs12(k element.Mat12) float64 {
	m := 0.0
	for i := range 12 {
		for j := range 12 {
			m = math.Max(m, math.Abs(k[i][j]))
		}
	}
	return m
}

// rigidMotion returns the displacement of a rigid body at point x for a
// translation tr and a small rotation th (UX..RZ).
func rigidMotion(x, tr, th element.Vec3) element.Vec6 {
	c := element.Vec3{th[1]*x[2] - th[2]*x[1], th[2]*x[0] - th[0]*x[2], th[0]*x[1] - th[1]*x[0]}
	return element.Vec6{tr[0] + c[0], tr[1] + c[1], tr[2] + c[2], th[0], th[1], th[2]}
}

// rigidBasis returns the six rigid-body motions of a two-node member a→b as
// 12-vectors: three translations, three rotations about the origin.
func rigidBasis(a, b element.Vec3) [6]element.Vec12 {
	var out [6]element.Vec12
	for i := range 6 {
		var tr, th element.Vec3
		if i < 3 {
			tr[i] = 1
		} else {
			th[i-3] = 1
		}
		ua, ub := rigidMotion(a, tr, th), rigidMotion(b, tr, th)
		copy(out[i][:6], ua[:])
		copy(out[i][6:], ub[:])
	}
	return out
}

func mul12(k element.Mat12, u element.Vec12) element.Vec12 {
	var f element.Vec12
	for i := range 12 {
		for j := range 12 {
			f[i] += k[i][j] * u[j]
		}
	}
	return f
}

// isSym reports whether a is symmetric to 1e-12 of its largest entry; the
// element matrices are built symmetric, so only a formula slip breaks this.
func isSym(a *mat.Dense) bool {
	n, _ := a.Dims()
	big := mat.Norm(a, math.Inf(1))
	for i := range n {
		for j := range n {
			if math.Abs(a.At(i, j)-a.At(j, i)) > 1e-12*big {
				return false
			}
		}
	}
	return true
}

// eigSym returns the eigenvalues of the symmetric part of a, ascending.
func eigSym(t *testing.T, a *mat.Dense) []float64 {
	t.Helper()
	n, _ := a.Dims()
	var es mat.EigenSym
	require.True(t, es.Factorize(mat.NewSymDense(n, symData(a)), false))
	v := es.Values(nil)
	sort.Float64s(v)
	return v
}

// solve6 solves a 6×6 system with gonum and checks the residual.
func solve6(t *testing.T, k element.Mat6, f [6]float64) [6]float64 {
	t.Helper()
	a := dense6(k)
	b := mat.NewVecDense(6, f[:])
	var x mat.VecDense
	require.NoError(t, x.SolveVec(a, b))
	var r mat.VecDense
	r.MulVec(a, &x)
	r.SubVec(&r, b)
	require.LessOrEqual(t, mat.Norm(&r, 2), residualTol*mat.Norm(b, 2))
	var out [6]float64
	copy(out[:], x.RawVector().Data)
	return out
}
