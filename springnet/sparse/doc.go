// Package sparse factorises and solves sparse symmetric linear systems,
// K·x = b, as met in stiffness analysis: Cholesky (L·D·Lᵀ with positive
// pivots) for positive definite K and L·D·Lᵀ without pivoting for
// indefinite matrices such as the shifted K − σ·M of an eigenvalue
// search, whose negative pivots count the eigenvalues below σ (Inertia,
// by Sylvester's law of inertia).
//
// # Model
//
// A Matrix is symmetric and stores its lower triangle in compressed
// sparse columns. Build one with a Builder: Add entries from element
// matrices in any order and either triangle; duplicates are summed, and
// explicit zeros keep their place in the pattern, so the pattern depends
// only on the positions added. Numbers are whatever the caller's units
// are; the package is pure numerics and imports nothing of this module.
// For a family A(α) = X + α·Y (a shifted K − σ·M), Union makes the union
// pattern once and Combine refills its values for each α, with no
// assembly and the same pattern, so a Factor keeps its analysis.
//
// A Factor is analysed once per pattern and refactorised for new values:
//
//	var f sparse.Factor
//	err := f.Analyze(k, &sparse.Options{Mode: sparse.LDLT, Coords: xyz})
//	err = f.Factorize(k) // again for every new set of values
//	f.Solve(x, b)
//
// Analyze computes a fill-reducing ordering P (Options.Ordering):
// approximate minimum degree (Amestoy, Davis and Duff 1996), nested
// dissection (recursive coordinate bisection when Options.Coords gives a
// point per row, multilevel graph bisection otherwise; each vertex
// separator is a minimum cover of the cut edges), or Auto, which uses minimum
// degree below 3000 rows and otherwise the one of the two with the
// smaller factor. It then builds the postordered elimination tree, the
// column counts (Gilbert, Ng and Peyton 1994) and relaxed supernodes.
// Factorize is multifrontal: each supernode's front is assembled from A
// and its children's update matrices, partially factorised with blocked
// dense kernels (a packed matrix multiply with an AVX2/FMA register tile
// on amd64, plain Go elsewhere or with the purego build tag), and its
// Schur complement passed to the parent. With GOMAXPROCS > 1 and enough
// work, independent subtrees are factorised concurrently and the large
// multiplies near the root are shared between goroutines (run with
// GOMAXPROCS=1 for a single thread). The packing panels of the multiply
// grow to what the fronts need, so a small problem allocates little.
// Refactorisation reuses all the storage of the first factorisation (on
// one goroutine it allocates nothing). SolveMany and SolveBlock read each
// row of L once for all their right-hand sides, which makes a block of
// two cheaper than two Solve calls. Solve, SolveMany and SolveBlock use
// a workspace inside the Factor: one goroutine at a time.
//
// # Errors
//
// A pivot d_k with |d_k| <= PivotTol·|a_kk| (a_kk the original diagonal,
// PivotTol 1e-11 by default; where a_kk is zero, the largest |entry| of
// column k stands in for it, and an all-zero column always fails), or in
// Cholesky mode a negative pivot, stops Factorize with a *PivotError whose Col is the row
// of the original, unpermuted matrix: the caller maps it to the node and
// direction that is free. Check every solution with Residual. The Matrix
// Market readers (ReadMatrix, ReadVector) return errors naming the line
// and never panic; they reject non-finite values. Indices out of range in
// Builder.Add are programming errors and panic, as does Solve without a
// successful Factorize. Error strings start with "sparse:".
package sparse
