package eigen_test

import (
	"fmt"
	"math"

	"github.com/trestle-go/trestle/springnet/eigen"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// A fixed-free chain of five 10 kg masses joined by 1 MN/m springs: the
// lowest three natural frequencies, checked by the Sturm count.
func ExampleLowest() {
	const n, k, m = 5, 1e6, 10.0 // DOF, N/m, kg
	bk, bm := sparse.NewBuilder(n), sparse.NewBuilder(n)
	bk.Add(0, 0, k) // spring to the ground
	for i := 1; i < n; i++ {
		bk.Add(i-1, i-1, k)
		bk.Add(i, i, k)
		bk.Add(i, i-1, -k)
	}
	for i := 0; i < n; i++ {
		bm.Add(i, i, m)
	}
	res, err := eigen.Lowest(bk.Matrix(), bm.Matrix(), 3, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	for i := 0; i < res.Len(); i++ {
		fmt.Printf("mode %d: %.4g Hz\n", i+1, res.Frequency(i))
	}
	fmt.Println("Sturm check:", res.Checked, res.SturmCount)
	// Closed form (Meirovitch): f_j = (1/π)·√(k/m)·sin((2j−1)π/22) =
	// 14.33, 41.82, 65.92 Hz.

	// Output:
	// mode 1: 14.33 Hz
	// mode 2: 41.82 Hz
	// mode 3: 65.92 Hz
	// Sturm check: true 3
}

// A free-floating pair of masses has a rigid-body mode at λ = 0, flagged
// rather than an error.
func ExampleResult_RigidBody() {
	bk, bm := sparse.NewBuilder(2), sparse.NewBuilder(2)
	bk.Add(0, 0, 400)
	bk.Add(1, 1, 400)
	bk.Add(1, 0, -400) // one 400 N/m spring between them
	bm.Add(0, 0, 1)
	bm.Add(1, 1, 1)
	res, err := eigen.Lowest(bk.Matrix(), bm.Matrix(), 2, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	for i := 0; i < res.Len(); i++ {
		fmt.Printf("rigid %v, f = %.4g Hz\n", res.RigidBody(i), res.Frequency(i))
	}
	// Closed form: ω = √(2k/m) = 28.28 rad/s, f = 4.502 Hz.

	// Output:
	// rigid true, f = 0 Hz
	// rigid false, f = 4.502 Hz
}

// Euler buckling of a pinned column, modelled as a Hencky bar-chain of
// 40 rigid links with rotational springs c = EI/a: the lowest load factor
// for a 1 N reference compression is the critical load, close to
// π²EI/L².
func ExampleBuckling() {
	const n, L, EI = 39, 2.0, 1e4 // interior joints, m, N·m²
	a := L / (n + 1)              // link length [m]
	c := EI / a                   // rotational spring [N·m/rad]
	// DOF: lateral deflection of each joint. K = (c/a²)·T², Kg = −T/a for
	// a 1 N compression, T = tridiag(−1, 2, −1).
	bk, bg := sparse.NewBuilder(n), sparse.NewBuilder(n)
	for i := 0; i < n; i++ {
		d := 6.0
		if i == 0 || i == n-1 {
			d = 5
		}
		bk.Add(i, i, c/(a*a)*d)
		bg.Add(i, i, -2/a)
		if i > 0 {
			bk.Add(i, i-1, -4*c/(a*a))
			bg.Add(i, i-1, 1/a)
		}
		if i > 1 {
			bk.Add(i, i-2, c/(a*a))
		}
	}
	res, err := eigen.Buckling(bk.Matrix(), bg.Matrix(), 2, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("P1 = %.4g N, P2 = %.4g N, Euler π²EI/L² = %.4g N\n", res.Values[0], res.Values[1], math.Pi*math.Pi*EI/(L*L))
	// Closed form (Hencky chain): P_k = (4EI/a²)·sin²(kπ/80) = 24 661 and
	// 98 493 N.

	// Output:
	// P1 = 2.466e+04 N, P2 = 9.849e+04 N, Euler π²EI/L² = 2.467e+04 N
}
