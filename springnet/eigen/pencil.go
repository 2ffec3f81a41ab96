package eigen

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/springnet/sparse"
	"gonum.org/v1/gonum/floats"
)

// pencil forms A(α) = K + α·B on the union of the patterns of K and B,
// computed once: every shift refills the values of the same matrix
// (sparse.Combine), so one sparse.Factor keeps its symbolic analysis
// across shifts and no matrix is assembled per shift.
type pencil struct {
	k, b     *sparse.Matrix
	sum      *sparse.Matrix // union pattern of K and B; values of the last α formed
	f        sparse.Factor
	opt      sparse.Options
	a        *sparse.Matrix // the matrix last factorised successfully
	alpha    float64        // its α
	anorm    float64        // its 1-norm
	ok       bool
	analyzed bool
	count    int // numeric factorisations
	r        []float64
	x        []float64
}

// newPencil returns the pencil of K and B, which the callers have checked
// to be of the same order.
func newPencil(k, b *sparse.Matrix, s *Settings) *pencil {
	sum, err := sparse.Union(k, b)
	if err != nil {
		panic(err) // the orders were checked by the callers
	}
	return &pencil{
		k: k, b: b,
		sum: sum,
		opt: sparse.Options{Ordering: s.Ordering, Mode: sparse.LDLT, Coords: s.Coords},
		r:   make([]float64, k.N()),
		x:   make([]float64, k.N()),
	}
}

// at forms K + α·B in pc.sum (overwriting the previous α's values) and
// returns it.
func (pc *pencil) at(alpha float64) *sparse.Matrix {
	if err := sparse.Combine(pc.sum, pc.k, alpha, pc.b); err != nil {
		panic(err) // pc.sum is the union of the patterns of K and B
	}
	return pc.sum
}

// factor factorises K + α·B (LDLᵀ) and checks the factorisation with the
// residual of one solve. It returns a *sparse.PivotError for a singular
// matrix and errUnstable when the solve residual is poor.
func (pc *pencil) factor(alpha float64) error {
	// The last factorised matrix's values are overwritten: until this
	// factorisation succeeds there is none to solve with.
	pc.a, pc.ok = nil, false
	a := pc.at(alpha)
	if !pc.analyzed {
		if err := pc.f.Analyze(a, &pc.opt); err != nil {
			return fmt.Errorf("eigen: sparse analysis: %w", err)
		}
		pc.analyzed = true
	}
	pc.count++
	if err := pc.f.Factorize(a); err != nil {
		return err
	}
	pc.a, pc.alpha, pc.anorm = a, alpha, norm1(a)
	// Guard the factorisation without pivoting: solve with a fixed
	// right-hand side and check the backward error.
	b := make([]float64, a.N())
	for i := range b {
		b[i] = 1 + float64(i%7)/7
	}
	x := make([]float64, a.N())
	if eta := pc.solve(x, b); !(eta <= factorResidualTol) {
		return errUnstable
	}
	pc.ok = true
	return nil
}

// factorResidualTol is the largest normwise backward error
// ‖A·x − b‖ / (‖A‖₁‖x‖ + ‖b‖) of the check solve accepted after a
// factorisation. LDLᵀ without pivoting of an indefinite matrix can lose
// accuracy through pivot growth, which shows in the backward error; above
// this the factors (and their inertia) are not trusted. A stable
// factorisation gives about 1e-16.
const factorResidualTol = 1e-10

var errUnstable = errors.New("eigen: unstable factorisation (large solve residual)")

// solve sets dst = A⁻¹·b for the last factorisation, with one step of
// iterative refinement when the backward error is not small, and returns
// the normwise backward error ‖A·x − b‖₂ / (‖A‖₁‖x‖₂ + ‖b‖₂).
func (pc *pencil) solve(dst, b []float64) float64 {
	pc.f.Solve(dst, b)
	eta := pc.backward(dst, b)
	if eta > 1e-14 {
		pc.f.Solve(pc.x, pc.r)
		floats.Sub(dst, pc.x)
		eta = pc.backward(dst, b)
	}
	return eta
}

// solveMany solves A·dst[i] = b[i] for a block in one pass over the
// factor, refining any solution whose backward error is not small, and
// returns the largest backward error.
func (pc *pencil) solveMany(dst, b [][]float64) float64 {
	if !useSolveMany {
		var worst float64
		for i := range dst {
			worst = math.Max(worst, pc.solve(dst[i], b[i]))
		}
		return worst
	}
	pc.f.SolveMany(dst, b)
	var worst float64
	for i := range dst {
		eta := pc.backward(dst[i], b[i])
		if eta > 1e-14 {
			pc.f.Solve(pc.x, pc.r)
			floats.Sub(dst[i], pc.x)
			eta = pc.backward(dst[i], b[i])
		}
		worst = math.Max(worst, eta)
	}
	return worst
}

// useSolveMany selects sparse.Factor.SolveMany for the blocks of the
// Lanczos process. On the 20³ benchmark lattice a block of 2 takes 0.042
// CPU s by SolveMany against 0.053 s by two Solve calls (sparse's
// BenchmarkSolveTwo); set it false to go back to one Solve per vector.
const useSolveMany = true

// backward sets pc.r = A·x − b and returns the normwise backward error.
func (pc *pencil) backward(x, b []float64) float64 {
	r := pc.r
	pc.a.MulVec(r, x)
	floats.Sub(r, b)
	den := pc.anorm*floats.Norm(x, 2) + floats.Norm(b, 2)
	if den == 0 {
		return 0
	}
	return floats.Norm(r, 2) / den
}

// solveResidualTol is the largest backward error of a Lanczos solve
// accepted after refinement.
const solveResidualTol = 1e-10

// shiftInvert is OP = (K − σM)⁻¹·M, self-adjoint in the M-inner product.
type shiftInvert struct {
	pc *pencil // K + α·M with α = −σ
	m  *sparse.Matrix
}

func (op *shiftInvert) apply(dst, x, mx []float64) error {
	if res := op.pc.solve(dst, mx); !(res <= solveResidualTol) {
		return fmt.Errorf("eigen: solve with K − σM (σ = %.6g) has relative residual %.3g", -op.pc.alpha, res)
	}
	return nil
}

func (op *shiftInvert) applyMany(dst, x, mx [][]float64) error {
	if res := op.pc.solveMany(dst, mx); !(res <= solveResidualTol) {
		return fmt.Errorf("eigen: solve with K − σM (σ = %.6g) has backward error %.3g", -op.pc.alpha, res)
	}
	return nil
}

func (op *shiftInvert) bmul(dst, x []float64) { op.m.MulVec(dst, x) }

// checkPair checks the arguments that Lowest and Buckling (named fn in
// the errors) share: K and B (named bName) given and of the same order N,
// n in [1, N], and no NaN or Inf entry in either (checkMatrix).
func checkPair(fn, bName string, K, B *sparse.Matrix, n int) error {
	if K == nil || B == nil {
		return fmt.Errorf("eigen: %s: nil matrix", fn)
	}
	N := K.N()
	if B.N() != N {
		return fmt.Errorf("eigen: %s: K is %d×%d but %s is %d×%d", fn, N, N, bName, B.N(), B.N())
	}
	if n < 1 || n > N {
		return fmt.Errorf("eigen: %s: asked for %d modes of a problem of order %d", fn, n, N)
	}
	if err := checkMatrix("K", K); err != nil {
		return err
	}
	return checkMatrix(bName, B)
}

// checkMatrix reports a NaN or Inf entry of a.
func checkMatrix(name string, a *sparse.Matrix) error {
	for j := 0; j < a.N(); j++ {
		rows, vals := a.Col(j)
		for p, v := range vals {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return fmt.Errorf("eigen: %s(%d, %d) = %v", name, rows[p], j, v)
			}
		}
	}
	return nil
}

// norm1 returns the largest absolute column sum of the symmetric a.
func norm1(a *sparse.Matrix) float64 {
	n := a.N()
	s := make([]float64, n)
	for j := 0; j < n; j++ {
		rows, vals := a.Col(j)
		for p, i := range rows {
			v := math.Abs(vals[p])
			s[j] += v
			if i != j {
				s[i] += v
			}
		}
	}
	var m float64
	for _, v := range s {
		m = max(m, v)
	}
	return m
}

// trace returns the sum of the diagonal of a.
func trace(a *sparse.Matrix) float64 {
	var t float64
	for j := 0; j < a.N(); j++ {
		t += a.At(j, j)
	}
	return t
}
