package sparse_test

import (
	"fmt"
	"syscall"
	"testing"
	"time"

	"github.com/trestle-go/trestle/springnet/lattice"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// cpuTime returns the process's user+system CPU time, to report
// alongside wall time when other jobs share the machine.
func cpuTime() time.Duration {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return time.Duration(ru.Utime.Nano() + ru.Stime.Nano())
}

// benchSizes are the lattice sizes of the benchmark ladder.
var benchSizes = []int{10, 20, 30}

func benchLattice(b *testing.B, nx int) *lattice.Lattice {
	b.Helper()
	l, err := lattice.New(nx, nx, nx, nil)
	if err != nil {
		b.Fatal(err)
	}
	return l
}

// BenchmarkAssemble times Builder→Matrix on the lattice's lower-triangle
// entries (given in a shuffled column order, with each entry split in two
// to exercise the duplicate summing).
func BenchmarkAssemble(b *testing.B) {
	for _, nx := range benchSizes {
		b.Run(fmt.Sprintf("lattice%d", nx), func(b *testing.B) {
			l := benchLattice(b, nx)
			k := l.K
			bd := sparse.NewBuilder(k.N())
			b.ReportAllocs()
			b.ResetTimer()
			c0 := cpuTime()
			for it := 0; it < b.N; it++ {
				bd.Reset(k.N())
				for j := k.N() - 1; j >= 0; j-- {
					rows, vals := k.Col(j)
					for p, i := range rows {
						bd.Add(i, j, vals[p]/2)
						bd.Add(j, i, vals[p]/2)
					}
				}
				_ = bd.Matrix()
			}
			b.ReportMetric((cpuTime()-c0).Seconds()/float64(b.N), "cpu-s/op")
			b.ReportMetric(float64(2*k.NNZ()), "entries")
		})
	}
}

func benchOrderings() []sparse.Ordering {
	return []sparse.Ordering{sparse.Auto, sparse.MinDegree, sparse.NestedDissection}
}

var orderingName = map[sparse.Ordering]string{sparse.Auto: "auto", sparse.Natural: "natural", sparse.MinDegree: "amd", sparse.NestedDissection: "nd"}

// BenchmarkAnalyze times ordering + symbolic analysis and reports nnz(L).
func BenchmarkAnalyze(b *testing.B) {
	for _, nx := range benchSizes {
		for _, ord := range benchOrderings() {
			b.Run(fmt.Sprintf("lattice%d/%s", nx, orderingName[ord]), func(b *testing.B) {
				l := benchLattice(b, nx)
				var f sparse.Factor
				b.ReportAllocs()
				b.ResetTimer()
				c0 := cpuTime()
				for it := 0; it < b.N; it++ {
					if err := f.Analyze(l.K, &sparse.Options{Ordering: ord, Coords: l.Coords}); err != nil {
						b.Fatal(err)
					}
				}
				b.ReportMetric((cpuTime()-c0).Seconds()/float64(b.N), "cpu-s/op")
				b.ReportMetric(float64(f.NNZL()), "nnzL")
			})
		}
	}
}

// BenchmarkAnalyzeGraph times ordering + symbolic analysis without
// coordinates (graph nested dissection) and reports nnz(L).
func BenchmarkAnalyzeGraph(b *testing.B) {
	for _, nx := range benchSizes {
		b.Run(fmt.Sprintf("lattice%d/nd", nx), func(b *testing.B) {
			l := benchLattice(b, nx)
			var f sparse.Factor
			b.ReportAllocs()
			b.ResetTimer()
			c0 := cpuTime()
			for it := 0; it < b.N; it++ {
				if err := f.Analyze(l.K, &sparse.Options{Ordering: sparse.NestedDissection}); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric((cpuTime()-c0).Seconds()/float64(b.N), "cpu-s/op")
			b.ReportMetric(float64(f.NNZL()), "nnzL")
		})
	}
}

// BenchmarkFactorize times the numeric factorisation (refactorisation into
// the analysed storage) with the Auto ordering.
func BenchmarkFactorize(b *testing.B) {
	for _, nx := range benchSizes {
		for _, mode := range []sparse.Mode{sparse.Cholesky, sparse.LDLT} {
			b.Run(fmt.Sprintf("lattice%d/mode%d", nx, mode), func(b *testing.B) {
				l := benchLattice(b, nx)
				var f sparse.Factor
				if err := f.Analyze(l.K, &sparse.Options{Coords: l.Coords, Mode: mode}); err != nil {
					b.Fatal(err)
				}
				if err := f.Factorize(l.K); err != nil {
					b.Fatal(err)
				}
				b.ReportAllocs()
				b.ResetTimer()
				c0 := cpuTime()
				for it := 0; it < b.N; it++ {
					if err := f.Factorize(l.K); err != nil {
						b.Fatal(err)
					}
				}
				b.ReportMetric((cpuTime()-c0).Seconds()/float64(b.N), "cpu-s/op")
				b.ReportMetric(float64(f.NNZL()), "nnzL")
			})
		}
	}
}

// BenchmarkSolve times one solve with the lattice's load vector and
// reports the relative residual (in units of 1e-15).
func BenchmarkSolve(b *testing.B) {
	for _, nx := range benchSizes {
		b.Run(fmt.Sprintf("lattice%d", nx), func(b *testing.B) {
			l := benchLattice(b, nx)
			var f sparse.Factor
			if err := f.Analyze(l.K, &sparse.Options{Coords: l.Coords}); err != nil {
				b.Fatal(err)
			}
			if err := f.Factorize(l.K); err != nil {
				b.Fatal(err)
			}
			x := make([]float64, l.N())
			b.ReportAllocs()
			b.ResetTimer()
			c0 := cpuTime()
			for it := 0; it < b.N; it++ {
				f.Solve(x, l.Load)
			}
			b.ReportMetric((cpuTime()-c0).Seconds()/float64(b.N), "cpu-s/op")
			b.ReportMetric(sparse.Residual(l.K, x, l.Load)*1e15, "residual-e15")
		})
	}
}

// BenchmarkSolveMany times a block solve with 10 right-hand sides (the
// load vector scaled), as block eigen-solvers use.
func BenchmarkSolveMany(b *testing.B) {
	const nr = 10
	for _, nx := range benchSizes {
		b.Run(fmt.Sprintf("lattice%d/rhs%d", nx, nr), func(b *testing.B) {
			l := benchLattice(b, nx)
			var f sparse.Factor
			if err := f.Analyze(l.K, &sparse.Options{Coords: l.Coords}); err != nil {
				b.Fatal(err)
			}
			if err := f.Factorize(l.K); err != nil {
				b.Fatal(err)
			}
			rhs := make([][]float64, nr)
			x := make([][]float64, nr)
			for r := range rhs {
				rhs[r] = make([]float64, l.N())
				x[r] = make([]float64, l.N())
				for i, v := range l.Load {
					rhs[r][i] = v * float64(r+1)
				}
			}
			f.SolveMany(x, rhs)
			b.ReportAllocs()
			b.ResetTimer()
			c0 := cpuTime()
			for it := 0; it < b.N; it++ {
				f.SolveMany(x, rhs)
			}
			b.ReportMetric((cpuTime()-c0).Seconds()/float64(b.N), "cpu-s/op")
			b.ReportMetric(sparse.Residual(l.K, x[nr-1], rhs[nr-1])*1e15, "residual-e15")
		})
	}
}

// BenchmarkShift times forming K − σ·M on the 20³ lattice (M its lumped
// mass as a diagonal matrix) for a new σ: by a Builder from K's and σ·M's
// entries, as an eigenvalue search did per shift, and by Combine into
// their union pattern computed once.
func BenchmarkShift(b *testing.B) {
	l := benchLattice(b, 20)
	n := l.K.N()
	mb := sparse.NewBuilder(n)
	for j, v := range l.Mass {
		mb.Add(j, j, v)
	}
	m := mb.Matrix()
	const sigma = 4e5 // [rad²/s²] near the lattice's lowest eigenvalue
	b.Run("Builder", func(b *testing.B) {
		bld := sparse.NewBuilder(n)
		b.ReportAllocs()
		for it := 0; it < b.N; it++ {
			bld.Reset(n)
			for j := 0; j < n; j++ {
				rows, vals := l.K.Col(j)
				for p, i := range rows {
					bld.Add(i, j, vals[p])
				}
				rows, vals = m.Col(j)
				for p, i := range rows {
					bld.Add(i, j, -sigma*vals[p])
				}
			}
			_ = bld.Matrix()
		}
	})
	b.Run("Combine", func(b *testing.B) {
		dst, err := sparse.Union(l.K, m)
		if err != nil {
			b.Fatal(err)
		}
		b.ReportAllocs()
		for it := 0; it < b.N; it++ {
			if err := sparse.Combine(dst, l.K, -sigma, m); err != nil {
				b.Fatal(err)
			}
		}
	})
}

// BenchmarkSolveTwo compares, on the 20³ lattice, two right-hand sides
// solved by two Solve calls and by one SolveMany (the block of two of the
// eigen solver's Lanczos process).
func BenchmarkSolveTwo(b *testing.B) {
	l := benchLattice(b, 20)
	var f sparse.Factor
	if err := f.Analyze(l.K, &sparse.Options{Coords: l.Coords}); err != nil {
		b.Fatal(err)
	}
	if err := f.Factorize(l.K); err != nil {
		b.Fatal(err)
	}
	rhs := [][]float64{l.Load, make([]float64, l.N())}
	for i, v := range l.Load {
		rhs[1][i] = v * float64(1+i%3)
	}
	x := [][]float64{make([]float64, l.N()), make([]float64, l.N())}
	b.Run("Solve", func(b *testing.B) {
		c0 := cpuTime()
		for it := 0; it < b.N; it++ {
			f.Solve(x[0], rhs[0])
			f.Solve(x[1], rhs[1])
		}
		b.ReportMetric((cpuTime()-c0).Seconds()/float64(b.N), "cpu-s/op")
	})
	b.Run("SolveMany", func(b *testing.B) {
		c0 := cpuTime()
		for it := 0; it < b.N; it++ {
			f.SolveMany(x, rhs)
		}
		b.ReportMetric((cpuTime()-c0).Seconds()/float64(b.N), "cpu-s/op")
	})
}
