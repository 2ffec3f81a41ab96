package eigen_test

import (
	"fmt"
	"math"
	"testing"

	"github.com/trestle-go/trestle/springnet/eigen"
)

// BenchmarkLowestLattice times the lowest 10 modes of the benchmark lattice
// (../shared/perf/README.md) at 20³ (26 460 DOF) and 30³ (86 490 DOF),
// with the DOF coordinates passed for a geometric ordering. Compare with
// SciPy's shift-invert eigsh in ../shared/perf/anchors.md (31.1 s at 20³).
// It reports the frequencies as metrics so a run shows what it computed.
func BenchmarkLowestLattice(b *testing.B) {
	for _, s := range []int{20, 30} {
		b.Run(fmt.Sprintf("%dx%dx%d", s, s, s), func(b *testing.B) {
			k, m, coords := benchLattice(b, s, s, s)
			b.ReportAllocs()
			b.ResetTimer()
			var res *eigen.Result
			for i := 0; i < b.N; i++ {
				var err error
				res, err = eigen.Lowest(k, m, 10, &eigen.Settings{Coords: coords})
				if err != nil {
					b.Fatal(err)
				}
			}
			b.StopTimer()
			b.ReportMetric(res.Frequency(0), "f1_Hz")
			b.ReportMetric(res.Frequency(9), "f10_Hz")
			b.ReportMetric(float64(res.Solves), "solves")
			b.ReportMetric(float64(res.Factorizations), "factorizations")
			var worst float64
			for _, r := range res.Residuals {
				worst = math.Max(worst, r)
			}
			b.ReportMetric(worst, "max_residual")
			if !res.Checked {
				b.Fatal("Sturm check not passed")
			}
		})
	}
}
