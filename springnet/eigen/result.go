package eigen

import (
	"fmt"
	"math"

	"github.com/trestle-go/trestle/springnet/sparse"
)

// Settings controls Lowest and Buckling. A nil *Settings means defaults;
// zero fields mean defaults.
type Settings struct {
	// Shift is the spectral shift σ [same unit as λ], used only when
	// ShiftSet is true. Lowest then returns the n eigenvalues nearest σ.
	// By default σ = −10⁻⁶·tr(K)/tr(M) for Lowest and σ = 0 for Buckling.
	Shift    float64
	ShiftSet bool
	// Tol is the convergence tolerance: a Ritz pair (θ, y) of the
	// transformed operator is converged when ‖OP·y − θ·y‖ ≤ Tol·|θ|.
	// Default 1e-10.
	Tol float64
	// MaxIter is the maximum number of thick restarts. Default 300.
	MaxIter int
	// BlockSize is the number of vectors the Lanczos process carries at
	// once; a block of p finds eigenvalues of multiplicity up to p without
	// relying on rounding errors. Default 2.
	BlockSize int
	// Basis is the largest Krylov basis kept between restarts. Default
	// max(2n + 2p, n + 20, 24), rounded up to a multiple of BlockSize.
	Basis int
	// Ordering and Coords are passed to sparse.Factor.Analyze (Coords: one
	// point per matrix row, or nil).
	Ordering sparse.Ordering
	Coords   [][3]float64
	// ResidualTol is the largest accepted relative residual of a returned
	// eigenpair (see the package doc). Default 1e-6.
	ResidualTol float64
	// RigidTol flags a mode as rigid-body or mechanism when
	// |λ| ≤ RigidTol · tr(K)/tr(M). Default 1e-8.
	RigidTol float64
}

// Defaults of Settings.
const (
	DefaultTol         = 1e-10
	DefaultMaxIter     = 300
	DefaultBlockSize   = 2
	DefaultResidualTol = 1e-6
	DefaultRigidTol    = 1e-8
	// DefaultShiftFraction sets the default vibration shift
	// σ = −DefaultShiftFraction · tr(K)/tr(M).
	DefaultShiftFraction = 1e-6
	// sturmMargin is the relative distance of the Sturm shift σ₂ above the
	// highest returned eigenvalue, measured from σ. The eigenvalues are
	// accurate to about 1e-12 relative, so 1e-5 is safely above them and
	// rarely catches an unconverged eigenvalue of a near-repeated pair.
	sturmMargin = 1e-5
)

func (s *Settings) withDefaults(n, size int) Settings {
	var t Settings
	if s != nil {
		t = *s
	}
	if t.Tol <= 0 {
		t.Tol = DefaultTol
	}
	if t.MaxIter <= 0 {
		t.MaxIter = DefaultMaxIter
	}
	if t.BlockSize <= 0 {
		t.BlockSize = DefaultBlockSize
	}
	if t.ResidualTol <= 0 {
		t.ResidualTol = DefaultResidualTol
	}
	if t.RigidTol <= 0 {
		t.RigidTol = DefaultRigidTol
	}
	p := t.BlockSize
	if t.Basis <= 0 {
		t.Basis = max(2*n+2*p, n+20, 24)
	}
	t.Basis = (t.Basis + p - 1) / p * p
	if t.Basis < n+p {
		t.Basis = (n + 2*p - 1) / p * p
	}
	if t.Basis+p > size {
		// The whole space fits: take all of it, one vector at a time, so
		// that the process ends with an exhausted (exact) basis.
		t.BlockSize = 1
		t.Basis = size
	}
	return t
}

// Result holds eigenpairs in ascending order of eigenvalue.
type Result struct {
	// Values are the eigenvalues in ascending order: λ = ω² [rad²/s²] for
	// Lowest and Dense, the load factors for Buckling.
	Values []float64
	// Residuals[i] is the relative residual of pair i (see the package doc).
	Residuals []float64
	// SturmCount is the number of eigenvalues in the checked interval
	// [SturmLow, SturmShift) by the Sturm-sequence count; Checked says
	// whether that count was made and agreed with the eigenvalues found
	// there. SturmShift is σ₂, just above the highest returned eigenvalue;
	// SturmLow is the shift σ when no eigenvalue lies below it (the usual
	// case: the returned eigenvalues are then the lowest), otherwise a
	// second Sturm shift just below the lowest returned eigenvalue.
	SturmCount int
	SturmLow   float64
	SturmShift float64
	Checked    bool
	// Shift is the spectral shift σ used for the Lanczos factorisation.
	Shift float64
	// Solves is the number of solves with the factorised shifted matrix
	// (the cost measure of the Lanczos process); Factorizations counts the
	// numeric factorisations, Sturm check included.
	Solves         int
	Factorizations int

	n       int         // order of the matrices
	vectors [][]float64 // one per value
	rigid   []bool
}

// Len returns the number of eigenpairs.
func (r *Result) Len() int { return len(r.Values) }

// Vector returns a copy of eigenvector i. It panics if i is out of range.
func (r *Result) Vector(i int) []float64 { return r.VectorTo(nil, i) }

// VectorTo copies eigenvector i into dst (allocated when nil or too short)
// and returns it.
func (r *Result) VectorTo(dst []float64, i int) []float64 {
	if len(dst) < r.n {
		dst = make([]float64, r.n)
	}
	dst = dst[:r.n]
	copy(dst, r.vectors[i])
	return dst
}

// RigidBody reports whether mode i is a rigid-body or mechanism mode
// (λ ≈ 0, see Settings.RigidTol). Always false for buckling.
func (r *Result) RigidBody(i int) bool { return r.rigid[i] }

// Frequency returns the natural frequency of mode i, f = √λ / 2π [Hz], and
// 0 for a rigid-body mode or a (round-off) negative λ.
func (r *Result) Frequency(i int) float64 {
	if r.rigid[i] || r.Values[i] <= 0 {
		return 0
	}
	return math.Sqrt(r.Values[i]) / (2 * math.Pi)
}

// MissedModesError reports that the Sturm-sequence count found more (or
// fewer) eigenvalues in the checked interval than the Lanczos process.
type MissedModesError struct {
	Low, High float64 // the checked interval [Low, High)
	Count     int     // eigenvalues there by the Sturm count
	Found     int     // eigenvalues there found by Lanczos
}

// Error implements the error interface.
func (e *MissedModesError) Error() string {
	if e.Count > e.Found {
		return fmt.Sprintf("eigen: Sturm check: %d eigenvalues lie in [%.6g, %.6g) but only %d were found: modes were missed", e.Count, e.Low, e.High, e.Found)
	}
	return fmt.Sprintf("eigen: Sturm check: %d eigenvalues lie in [%.6g, %.6g) but %d were found: spurious modes", e.Count, e.Low, e.High, e.Found)
}

// SingularError reports a shifted matrix that could not be factorised at
// any of the shifts tried: for vibration, a DOF (matrix column Col) that
// has neither stiffness nor mass in some direction; for buckling, a K that
// is singular or not positive definite at column Col.
type SingularError struct {
	Col   int     // matrix column (DOF index) of the failing pivot
	Shift float64 // the last shift tried
	What  string  // which matrix
}

// Error implements the error interface.
func (e *SingularError) Error() string {
	return fmt.Sprintf("eigen: %s is singular at DOF %d (shift %.6g): a mechanism without mass or stiffness", e.What, e.Col, e.Shift)
}

// ConvergenceError reports that Lanczos did not converge within MaxIter
// restarts.
type ConvergenceError struct {
	Want, Converged, Restarts int
}

// Error implements the error interface.
func (e *ConvergenceError) Error() string {
	return fmt.Sprintf("eigen: only %d of %d eigenpairs converged after %d restarts", e.Converged, e.Want, e.Restarts)
}

// ResidualError reports an eigenpair whose relative residual is too large.
type ResidualError struct {
	Mode     int
	Value    float64
	Residual float64
	Tol      float64
}

// Error implements the error interface.
func (e *ResidualError) Error() string {
	return fmt.Sprintf("eigen: mode %d (λ = %.6g): relative residual %.3g exceeds %.3g", e.Mode, e.Value, e.Residual, e.Tol)
}

// FewerModesError reports a problem with fewer finite eigenvalues (or
// positive load factors) than asked for. It is returned together with a
// Result holding those that exist.
type FewerModesError struct {
	Want, Found int
}

// Error implements the error interface.
func (e *FewerModesError) Error() string {
	return fmt.Sprintf("eigen: asked for %d modes but the problem has only %d finite ones", e.Want, e.Found)
}
