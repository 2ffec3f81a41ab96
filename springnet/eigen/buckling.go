package eigen

import (
	"errors"
	"fmt"

	"github.com/trestle-go/trestle/springnet/sparse"
)

// Buckling returns the n lowest positive load factors λ of the linear
// buckling problem (K + λ·Kg)·φ = 0 and their modes (K-orthonormal:
// φᵀ·K·φ = 1), in ascending order, by Lanczos on K⁻¹·Kg in the K-inner
// product (μ = −1/λ, most negative μ first), checked by a Sturm count of
// K + σ₂·Kg.
//
// K must be symmetric positive definite (a supported structure): a
// singular or indefinite K is a *SingularError naming the column. Kg is
// the geometric stiffness of the reference load, symmetric and usually
// indefinite. Settings.Shift is not used. If there are fewer than n
// positive load factors (for example, every member in tension), Buckling
// returns those found with a *FewerModesError.
func Buckling(K, Kg *sparse.Matrix, n int, s *Settings) (*Result, error) {
	if err := checkPair("Buckling", "Kg", K, Kg, n); err != nil {
		return nil, err
	}
	N := K.N()
	st := s.withDefaults(n, N)
	if st.Coords != nil && len(st.Coords) != N {
		return nil, fmt.Errorf("eigen: Buckling: %d coordinates for %d DOF", len(st.Coords), N)
	}
	scale := 1.0
	if g := norm1(Kg); g > 0 {
		scale = norm1(K) / g
	}
	pb := &problem{
		what: "K", kmat: K, b2: Kg, purify: false,
		pc:         newPencil(K, Kg, &st),
		toLambda:   func(t float64) float64 { return -1 / t },
		prio:       func(t float64) float64 { return -t },
		admissible: func(t float64) bool { return t < 0 },
		alpha:      func(l float64) float64 { return l },
		scale:      scale,
	}
	err := pb.pc.factor(0)
	var pe *sparse.PivotError
	switch {
	case errors.As(err, &pe):
		return nil, &SingularError{Col: pe.Col, What: "K"}
	case err != nil:
		return nil, err
	}
	if neg, _ := pb.pc.f.Inertia(); neg > 0 {
		return nil, fmt.Errorf("eigen: Buckling: K has %d negative pivots: it is not positive definite", neg)
	}
	pb.op = &bucklingOp{pc: pb.pc, k: K, kg: Kg, t: make([]float64, N)}
	return pb.solve(n, &st)
}

// bucklingOp is OP = K⁻¹·Kg, self-adjoint in the K-inner product.
type bucklingOp struct {
	pc    *pencil // factorised at α = 0: K
	k, kg *sparse.Matrix
	t     []float64
	ts    [][]float64
}

func (op *bucklingOp) apply(dst, x, _ []float64) error {
	op.kg.MulVec(op.t, x)
	if res := op.pc.solve(dst, op.t); !(res <= solveResidualTol) {
		return fmt.Errorf("eigen: solve with K has backward error %.3g", res)
	}
	return nil
}

func (op *bucklingOp) applyMany(dst, x, _ [][]float64) error {
	for len(op.ts) < len(x) {
		op.ts = append(op.ts, make([]float64, len(op.t)))
	}
	ts := op.ts[:len(x)]
	for i, xi := range x {
		op.kg.MulVec(ts[i], xi)
	}
	if res := op.pc.solveMany(dst, ts); !(res <= solveResidualTol) {
		return fmt.Errorf("eigen: solve with K has backward error %.3g", res)
	}
	return nil
}

func (op *bucklingOp) bmul(dst, x []float64) { op.k.MulVec(dst, x) }
