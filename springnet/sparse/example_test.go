package sparse_test

import (
	"errors"
	"fmt"

	"github.com/trestle-go/trestle/springnet/sparse"
)

// A chain of three springs of k = 1000 N/m hangs from a fixed support and
// carries 10 N at its free end. Each spring carries the full 10 N, so the
// nodes move 0.01, 0.02 and 0.03 m (springs in series).
func Example() {
	const k = 1000.0 // N/m
	b := sparse.NewBuilder(3)
	for e := 0; e < 3; e++ { // spring e joins node e−1 (support for e = 0) and node e
		b.Add(e, e, k)
		if e > 0 {
			b.Add(e-1, e-1, k)
			b.Add(e, e-1, -k)
		}
	}
	K := b.Matrix()
	var f sparse.Factor
	if err := f.Factorize(K); err != nil {
		fmt.Println(err)
		return
	}
	load := []float64{0, 0, 10} // N
	u := make([]float64, 3)
	f.Solve(u, load)
	fmt.Printf("u = %.4g %.4g %.4g m\n", u[0], u[1], u[2])
	fmt.Printf("residual below 1e-12: %v\n", sparse.Residual(K, u, load) < 1e-12)
	// Output:
	// u = 0.01 0.02 0.03 m
	// residual below 1e-12: true
}

// The same chain with unit masses has eigenvalues 4k·sin²((2j−1)π/14),
// j = 1, 2, 3 (fixed-free chain of n = 3 springs: λ = 4k·sin²((2j−1)π /
// (2(2n+1)))), i.e. 0.198k, 1.555k and 3.247k. Factorising K − σ·I in LDLT
// mode and counting negative pivots tells how many lie below σ.
func ExampleFactor_Inertia() {
	const k = 1.0
	for _, sigma := range []float64{0.1, 0.5, 2.2, 3.5} {
		b := sparse.NewBuilder(3)
		for e := 0; e < 3; e++ {
			b.Add(e, e, k)
			if e > 0 {
				b.Add(e-1, e-1, k)
				b.Add(e, e-1, -k)
			}
			b.Add(e, e, -sigma)
		}
		var f sparse.Factor
		if err := f.Analyze(b.Matrix(), &sparse.Options{Mode: sparse.LDLT}); err != nil {
			fmt.Println(err)
			return
		}
		if err := f.Factorize(b.Matrix()); err != nil {
			fmt.Println(err)
			return
		}
		neg, _ := f.Inertia()
		fmt.Printf("eigenvalues below %.4g: %d\n", sigma, neg)
	}
	// Output:
	// eigenvalues below 0.1: 0
	// eigenvalues below 0.5: 1
	// eigenvalues below 2.2: 2
	// eigenvalues below 3.5: 3
}

// Two nodes joined by a spring and not supported form a mechanism: the
// factorisation stops at the pivot of the rigid-body motion and names the
// original row.
func ExamplePivotError() {
	b := sparse.NewBuilder(2)
	b.Add(0, 0, 5e3)
	b.Add(1, 1, 5e3)
	b.Add(1, 0, -5e3)
	var f sparse.Factor
	if err := f.Analyze(b.Matrix(), &sparse.Options{Ordering: sparse.Natural}); err != nil {
		fmt.Println(err)
		return
	}
	var pe *sparse.PivotError
	if err := f.Factorize(b.Matrix()); errors.As(err, &pe) {
		fmt.Printf("singular at row %d (negative: %v)\n", pe.Col, pe.Negative)
	}
	// Output:
	// singular at row 1 (negative: false)
}

// Two springs of k = 1000 N/m in a chain from a fixed support, with a
// 1 kg mass at each node: K = k·[2 −1; −1 1], M = I, whose eigenvalues
// are the roots of λ² − 3kλ + k² = 0, λ = k(3 ∓ √5)/2 = 382.0 and
// 2618 rad²/s². Union makes the pattern of K − σ·M once; Combine
// refills it for each σ, and the negative pivots of its LDLᵀ count the
// eigenvalues below σ.
func ExampleCombine() {
	const k = 1000.0 // N/m
	kb := sparse.NewBuilder(2)
	kb.Add(0, 0, 2*k)
	kb.Add(1, 0, -k)
	kb.Add(1, 1, k)
	K := kb.Matrix()
	mb := sparse.NewBuilder(2)
	mb.Add(0, 0, 1) // kg
	mb.Add(1, 1, 1)
	M := mb.Matrix()
	A, err := sparse.Union(K, M)
	if err != nil {
		fmt.Println(err)
		return
	}
	var f sparse.Factor
	if err := f.Analyze(A, &sparse.Options{Mode: sparse.LDLT}); err != nil {
		fmt.Println(err)
		return
	}
	for _, sigma := range []float64{300, 1000, 3000} { // rad²/s²
		if err := sparse.Combine(A, K, -sigma, M); err != nil {
			fmt.Println(err)
			return
		}
		if err := f.Factorize(A); err != nil {
			fmt.Println(err)
			return
		}
		neg, _ := f.Inertia()
		fmt.Printf("eigenvalues below %.4g: %d\n", sigma, neg)
	}
	// Output:
	// eigenvalues below 300: 0
	// eigenvalues below 1000: 1
	// eigenvalues below 3000: 2
}
