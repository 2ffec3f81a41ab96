package eigen_test

import (
	"fmt"
	"math"
	"syscall"
	"testing"

	"github.com/trestle-go/trestle/springnet/eigen"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// eigshLattice holds the lowest ten eigenvalues λ = ω² [rad²/s²] of the
// benchmark lattices from SciPy's ARPACK shift-invert eigsh (SciPy 1.10.1,
// eigsh(K, k=10, M, sigma=0), default tol = machine precision), run with
// ../shared/perf/scipy_ref.py on the .mtx files written by
// ../shared/perf/gen_lattice.py; full-precision values from its JSON
// output. Frequencies f = √λ/2π: 107.85, 107.85, 167.83, … Hz at 20³, as
// in ../shared/perf/anchors.md.
var eigshLattice = map[int][]float64{
	20: {459202.2097130923, 459202.20971309586, 1111983.8073319304, 2064033.4848731125, 3295446.964338103, 3295446.9643381205, 5506996.949997392, 5521327.719706347, 6907858.469961213, 7073095.747319362},
	// 30³: the same script, 431 s (f = 71.2988, 71.2988, 111.4670, … Hz).
	30: {200689.28084287592, 200689.28084288124, 490514.789840659, 910938.8077106642, 1453162.142404623, 1453162.142404627, 2434792.765313117, 2437407.9131574505, 3065791.6529135546, 3114409.012584884},
}

// BenchmarkLowestLattice times the lowest 10 modes of the benchmark lattice
// (../shared/perf/README.md) at 20³ (26 460 DOF) and 30³ (86 490 DOF),
// with the DOF coordinates passed for a geometric nested dissection (the
// ordering of choice for a 3D grid; Auto would also try minimum degree). Compare with
// SciPy's shift-invert eigsh (31.1 s at 20³ in ../shared/perf/anchors.md).
// It reports the frequencies and the largest relative difference from
// eigsh's eigenvalues, and fails if that exceeds 1e-8.
func BenchmarkLowestLattice(b *testing.B) {
	for _, s := range []int{20, 30} {
		b.Run(fmt.Sprintf("%dx%dx%d", s, s, s), func(b *testing.B) {
			k, m, coords := benchLattice(b, s, s, s)
			b.ReportAllocs()
			cpu0 := cpuSeconds()
			b.ResetTimer()
			var res *eigen.Result
			for i := 0; i < b.N; i++ {
				var err error
				res, err = eigen.Lowest(k, m, 10, &eigen.Settings{Coords: coords, Ordering: sparse.NestedDissection})
				if err != nil {
					b.Fatal(err)
				}
			}
			b.StopTimer()
			// CPU time (user + system, all threads) per run: on a shared
			// machine the wall time alone says little.
			b.ReportMetric((cpuSeconds()-cpu0)/float64(b.N), "cpu_s/op")
			b.ReportMetric(res.Frequency(0), "f1_Hz")
			b.ReportMetric(res.Frequency(9), "f10_Hz")
			b.ReportMetric(float64(res.Solves), "solves")
			b.ReportMetric(float64(res.Factorizations), "factorizations")
			var worst float64
			for _, r := range res.Residuals {
				worst = math.Max(worst, r)
			}
			b.ReportMetric(worst*1e15, "max_residual_x1e-15")
			if !res.Checked {
				b.Fatal("Sturm check not passed")
			}
			if ref, ok := eigshLattice[s]; ok {
				var d float64
				for i, v := range ref {
					d = math.Max(d, math.Abs(res.Values[i]-v)/v)
				}
				b.ReportMetric(d*1e12, "max_rel_diff_eigsh_x1e-12")
				// The task's accuracy target: the same frequencies to 1e-8.
				if d > 1e-8 {
					b.Errorf("eigenvalues differ from eigsh by %.3g relative", d)
				}
			}
		})
	}
}

// cpuSeconds returns the user and system CPU time of the process [s].
func cpuSeconds() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return math.NaN()
	}
	tv := func(t syscall.Timeval) float64 { return float64(t.Sec) + 1e-6*float64(t.Usec) }
	return tv(ru.Utime) + tv(ru.Stime)
}
