// Package eigen solves the generalized symmetric eigenproblems of structural
// dynamics and linear buckling on sparse matrices from package sparse.
//
// # Vibration: K·φ = λ·M·φ
//
// K is the stiffness matrix (symmetric, positive semidefinite: it may have
// rigid-body or mechanism modes), M the mass matrix (symmetric, positive
// semidefinite: lumped or consistent, and it may have massless DOF such as
// the rotations of a lumped-mass beam model). The eigenvalue is λ = ω²
// [rad²/s²], the natural frequency f = √λ / 2π [Hz].
//
// Lowest finds the n eigenvalues nearest a shift σ (by default a small
// negative number, so these are the lowest n) by shift-invert block Lanczos
// with full reorthogonalisation in the M-inner product and thick restarts
// (Krylov–Schur form):
//
//	(K − σM)⁻¹ M φ = ν φ,   λ = σ + 1/ν
//
// using one sparse LDLᵀ factorisation of K − σM. The default shift is
//
//	σ = −10⁻⁶ · tr(K) / tr(M)
//
// a millionth of the mean diagonal ratio, which keeps K − σM positive
// definite when K has rigid-body modes and stays well below the lowest
// nonzero eigenvalue of practical stands. If K − σM is singular at σ the
// shift is moved and the factorisation retried.
//
// Massless DOF give infinite eigenvalues. They map to ν = 0, are never
// among the wanted ones, and are removed from the Lanczos vectors by
// starting in the range of the operator and by purifying the returned
// eigenvectors (Ericsson and Ruhe, "The spectral transformation Lanczos
// method", Math. Comp. 35, 1980; Nour-Omid, Parlett, Ericsson and Legge,
// "How to implement the spectral transformation", Math. Comp. 48, 1987).
// Eigenvectors are M-orthonormal: φᵢᵀ M φⱼ = δᵢⱼ.
//
// After convergence a Sturm-sequence check factorises K − σ₂M at a shift σ₂
// just above the highest returned eigenvalue (in a gap of the converged
// spectrum) and counts its negative pivots, which by Sylvester's law of
// inertia is the number of eigenvalues below σ₂. If that count exceeds the
// number of eigenvalues found, the search continues with the found modes
// locked; if it still disagrees Lowest returns a *MissedModesError.
// Result.SturmCount and Result.Checked report the check.
//
// Rigid-body and mechanism modes are returned like any other (λ ≈ 0, which
// may come out as a tiny negative number) and flagged by Result.RigidBody.
//
// # Buckling: (K + λ·Kg)·φ = 0
//
// K is the (positive definite) stiffness of a supported structure, Kg the
// geometric stiffness of a reference load case (indefinite in general); λ
// is the load factor by which the reference load must be multiplied to
// buckle the structure. Buckling finds the n lowest positive λ with the
// buckling spectral transformation (Grimes, Lewis and Simon, "A shifted
// block Lanczos algorithm for solving sparse symmetric generalized
// eigenproblems", SIAM J. Matrix Anal. Appl. 15, 1994): Lanczos on
// K⁻¹·Kg in the K-inner product, μ = −1/λ, the most negative μ first. The
// modes are K-orthonormal, φᵢᵀ K φⱼ = δᵢⱼ. The Sturm check counts the
// negative pivots of K + σ₂·Kg, the number of load factors in (0, σ₂).
//
// # Dense reference
//
// Dense and DenseBuckling solve small problems with gonum: Cholesky
// reduction to a standard symmetric problem and mat.EigenSym. Dense reduces
// with the Cholesky factor of M when M is positive definite. When M has
// zero rows (massless DOF) it condenses those DOF statically first; for any
// other singular M it reduces with the factor of K − σM and drops the
// infinite eigenvalues (accurate for the lower modes only).
//
// # Factorisations
//
// The shifted matrices are factorised by sparse.Factor in LDLT mode
// (without pivoting), all on the union of the patterns of K and M (or Kg),
// so one symbolic analysis serves every shift. Each factorisation is
// checked by the normwise backward error of a test solve and each Lanczos
// solve by its own backward error (one step of iterative refinement when
// it exceeds 1e-14); a poor one moves the shift or fails.
//
// With Settings.Shift inside the spectrum Lowest returns the n eigenvalues
// nearest it, and the Sturm check counts the interval around the shift that
// holds every eigenvalue at most as far from it as the returned ones
// (Result.SturmLow, Result.SturmShift).
//
// # Accuracy and errors
//
// Each returned pair carries its relative residual
//
//	‖K·φ − λ·M·φ‖₂ / ((‖K‖₁ + |λ|·‖M‖₁) · ‖φ‖₂)
//
// (‖·‖₁ the largest absolute column sum, an upper bound of ‖·‖₂ for a
// symmetric matrix; for buckling ‖K·φ + λ·Kg·φ‖₂ / ((‖K‖₁ + |λ|·‖Kg‖₁)·‖φ‖₂)),
// the normwise backward error of the pair. A residual above
// Settings.ResidualTol is a *ResidualError. Errors start with "eigen:" and
// are typed where a caller can act on them: *MissedModesError,
// *SingularError (a DOF with neither stiffness nor mass, or a K that is not
// positive definite for buckling, naming the matrix column),
// *ConvergenceError, *ResidualError and *FewerModesError (the problem has
// fewer finite eigenvalues than asked; returned together with a usable
// Result holding those that exist). Bad arguments (n out of range, sizes
// that do not match, NaN or Inf entries) are plain errors; nothing
// non-finite is ever returned.
package eigen
