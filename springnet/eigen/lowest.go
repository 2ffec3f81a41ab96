package eigen

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/springnet/sparse"
)

// Lowest returns the n lowest eigenpairs of K·φ = λ·M·φ (more precisely,
// the n eigenvalues nearest the shift σ, which by default lies just below
// zero) by shift-invert block Lanczos, checked by a Sturm count. Values are
// λ = ω² [rad²/s²] in ascending order, vectors M-orthonormal.
//
// K and M must be symmetric positive semidefinite of the same order with
// tr(M) > 0; n must be in [1, N]. With the default shift a negative pivot
// of K − σM is an error (K or M is not semidefinite). Errors: see the
// package doc. If the pencil has fewer than n finite eigenvalues (massless
// DOF), Lowest returns the Result with those that exist together with a
// *FewerModesError.
func Lowest(K, M *sparse.Matrix, n int, s *Settings) (*Result, error) {
	if err := checkPair("Lowest", "M", K, M, n); err != nil {
		return nil, err
	}
	N := K.N()
	for j := 0; j < N; j++ {
		if d := M.At(j, j); d < 0 {
			return nil, fmt.Errorf("eigen: Lowest: negative mass M(%d, %d) = %g", j, j, d)
		}
		if d := K.At(j, j); d < 0 {
			return nil, fmt.Errorf("eigen: Lowest: negative stiffness K(%d, %d) = %g", j, j, d)
		}
	}
	st := s.withDefaults(n, N)
	if st.Coords != nil && len(st.Coords) != N {
		return nil, fmt.Errorf("eigen: Lowest: %d coordinates for %d DOF", len(st.Coords), N)
	}
	if st.ShiftSet && (math.IsNaN(st.Shift) || math.IsInf(st.Shift, 0)) {
		return nil, fmt.Errorf("eigen: Lowest: shift %v", st.Shift)
	}
	trK, trM := trace(K), trace(M)
	if !(trM > 0) {
		return nil, errors.New("eigen: Lowest: the mass matrix has no mass (tr M = 0)")
	}
	scale := trK / trM
	if !(scale > 0) {
		scale = 1 // K = 0: every mode is rigid
	}
	sigma := -DefaultShiftFraction * scale
	if st.ShiftSet {
		sigma = st.Shift
	}
	pb := &problem{
		what: "K − σM", kmat: K, b2: M, purify: true,
		pc:         newPencil(K, M, &st),
		toLambda:   func(t float64) float64 { return sigma + 1/t },
		prio:       math.Abs,
		admissible: func(float64) bool { return true },
		alpha:      func(l float64) float64 { return -l },
		scale:      scale,
		zero:       st.RigidTol * scale,
	}
	pb.toLambda = func(t float64) float64 { return pb.shift + 1/t }
	// Factorise at σ; factorAt moves the shift when K − σM is singular
	// there (σ an eigenvalue) and reports a DOF with neither stiffness nor
	// mass as a *SingularError.
	var err error
	if pb.shift, pb.below, err = pb.factorAt(sigma, math.Inf(-1), math.Inf(1)); err != nil {
		return nil, err
	}
	if !st.ShiftSet && pb.below > 0 {
		return nil, fmt.Errorf("eigen: Lowest: K − σM has %d negative pivots at σ = %.6g < 0: K or M is not positive semidefinite", pb.below, pb.shift)
	}
	pb.op = &shiftInvert{pc: pb.pc, m: M}
	return pb.solve(n, &st)
}

// solve runs the Lanczos search and assembles the Result.
func (pb *problem) solve(n int, st *Settings) (*Result, error) {
	kr := newKrylov(pb.op, pb.kmat.N(), st.BlockSize, st.Basis)
	if err := kr.start(); err != nil {
		return nil, err
	}
	sel, rz, chk, err := pb.run(kr, n, st)
	if err != nil {
		return nil, err
	}
	res, err := pb.finish(kr, rz, sel, chk, st)
	if err != nil {
		return nil, err
	}
	if len(sel) < n {
		return res, &FewerModesError{Want: n, Found: len(sel)}
	}
	return res, nil
}

// CountBelow returns the number of eigenvalues of K·φ = λ·M·φ below sigma,
// the number of negative pivots of the LDLᵀ factorisation of K − σM
// (Sylvester's law of inertia). K and M must be symmetric with K − σ₀M
// positive definite for some σ₀ < sigma (true for K, M positive
// semidefinite without a massless mechanism). It returns a *SingularError
// when K − σM is singular (sigma is an eigenvalue, to working precision).
// To count at several shifts, use a Counter, which keeps the symbolic
// analysis.
func CountBelow(K, M *sparse.Matrix, sigma float64) (int, error) {
	c, err := NewCounter(K, M, nil)
	if err != nil {
		return 0, err
	}
	return c.Below(sigma)
}

// Counter counts the eigenvalues of one pencil K·φ = λ·M·φ below given
// shifts (see CountBelow), keeping the ordering and symbolic analysis of
// K − σM between calls. Build it with NewCounter; it is not safe for
// concurrent use.
type Counter struct {
	pc *pencil
}

// NewCounter checks K and M and returns a Counter for them. Of the
// Settings only Ordering and Coords are used; nil means defaults.
func NewCounter(K, M *sparse.Matrix, s *Settings) (*Counter, error) {
	if K == nil || M == nil || K.N() != M.N() {
		return nil, errors.New("eigen: CountBelow: K and M must be non-nil and of the same order")
	}
	if err := checkMatrix("K", K); err != nil {
		return nil, err
	}
	if err := checkMatrix("M", M); err != nil {
		return nil, err
	}
	var st Settings
	if s != nil {
		st.Ordering, st.Coords = s.Ordering, s.Coords
	}
	if st.Coords != nil && len(st.Coords) != K.N() {
		return nil, fmt.Errorf("eigen: CountBelow: %d coordinates for %d DOF", len(st.Coords), K.N())
	}
	return &Counter{pc: newPencil(K, M, &st)}, nil
}

// Below returns the number of eigenvalues below sigma, or a
// *SingularError when K − σM is singular.
func (c *Counter) Below(sigma float64) (int, error) {
	if math.IsNaN(sigma) || math.IsInf(sigma, 0) {
		return 0, fmt.Errorf("eigen: CountBelow: shift %v", sigma)
	}
	err := c.pc.factor(-sigma)
	var pe *sparse.PivotError
	switch {
	case errors.As(err, &pe):
		return 0, &SingularError{Col: pe.Col, Shift: sigma, What: "K − σM"}
	case err != nil:
		return 0, err
	}
	neg, _ := c.pc.f.Inertia()
	return neg, nil
}
