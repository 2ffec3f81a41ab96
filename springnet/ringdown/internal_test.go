package ringdown

import (
	"math"
	"math/cmplx"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/dsp/fourier"
	"gonum.org/v1/gonum/stat"
)

func TestAnalyticSignalOfCosine(t *testing.T) {
	// The Hilbert transform of cos ωt is sin ωt (Bracewell, The Fourier
	// Transform and Its Applications, Hilbert transform table), so the
	// envelope of A cos ωt is A. Away from the record's ends (zero-padding
	// makes them non-periodic) the FFT route must agree within 1e-3 of A.
	const fs, f, n, a = 1000.0, 37.0, 4000, 2.5
	x := make([]float64, n)
	for i := range x {
		x[i] = a * math.Cos(2*math.Pi*f*float64(i)/fs)
	}
	y, h := analytic(fourier.NewFFT(analyticLen(n, fs, Band{})), nil, x, fs, Band{})
	for i := n / 4; i < 3*n/4; i++ {
		want := a * math.Sin(2*math.Pi*f*float64(i)/fs)
		require.Equal(t, x[i], y[i], "without a band y is x")
		assert.InDelta(t, want, h[i], 1e-3*a, "h[%d]", i)
	}
}

func TestBandPassIsolatesOneSine(t *testing.T) {
	// x = sin(2π·20t) + 0.7 sin(2π·70t): the band 56–84 Hz passes the
	// second term only (its Gaussian skirt gives exp(−(36/5.6)²/2) ≈ 1e-9 at
	// 20 Hz), so y must equal 0.7 sin(2π·70t) away from the ends.
	const fs, n = 1000.0, 6000
	x := make([]float64, n)
	for i := range x {
		tt := float64(i) / fs
		x[i] = math.Sin(2*math.Pi*20*tt) + 0.7*math.Sin(2*math.Pi*70*tt)
	}
	band := Band{56, 84}
	y, h := analytic(fourier.NewFFT(analyticLen(n, fs, band)), nil, x, fs, band)
	// 2e-3 (0.3 % of 0.7): an allowance for the padded transform's end
	// effects reaching into the middle half; empirical, not derived.
	for i := n / 4; i < 3*n/4; i++ {
		tt := float64(i) / fs
		assert.InDelta(t, 0.7*math.Sin(2*math.Pi*70*tt), y[i], 2e-3, "y[%d]", i)
		assert.InDelta(t, 0.7, math.Hypot(y[i], h[i]), 2e-3, "envelope[%d]", i)
	}
	assert.Equal(t, 1.0, band.gain(70))
	assert.InDelta(t, math.Exp(-0.5), band.gain(84+0.2*28), 1e-15, "one skirt deviation out: e^(−1/2)")
	assert.InDelta(t, 0, band.gain(20), 2e-9, "e^(−(36/5.6)²/2) ≈ 1.1e-9")
}

func TestTruncationWidthAgainstDFT(t *testing.T) {
	// Half-power half-width of the spectrum of a decay cut off where it has
	// fallen to r, measured by brute-force DTFT of the sampled, truncated
	// complex decay, against truncationWidth's closed form. The sampled
	// decay differs from the continuous one by O((σ/fs)²).
	const fs, sig = 2000.0, 3.0
	for _, r := range []float64{0.01, 0.05, 0.1, 0.2} {
		n := int(-math.Log(r)/sig*fs) + 1
		dtft := func(df float64) float64 { // |Σ e^(−σt) e^(−i2π·df·t)|²
			var s complex128
			for k := range n {
				tt := float64(k) / fs
				s += cmplx.Exp(complex(-sig*tt, -2*math.Pi*df*tt))
			}
			return real(s)*real(s) + imag(s)*imag(s)
		}
		half := dtft(0) / 2
		lo, hi := 0.0, 5*sig/(2*math.Pi)
		for range 60 {
			mid := (lo + hi) / 2
			if dtft(mid) > half {
				lo = mid
			} else {
				hi = mid
			}
		}
		x := (lo + hi) / 2 * 2 * math.Pi / sig
		// 2e-3: the sampled record ends on a whole sample, so its L = σT is off
		// by up to σ/fs = 1.5e-3 from −ln r (hand calculation).
		assert.InEpsilon(t, x, truncationWidth(r), 2e-3, "r = %g", r)
	}
	assert.Equal(t, 1.0, truncationWidth(0), "no truncation: the Lorentzian")
}

func TestFitLineAgainstGonum(t *testing.T) {
	// Reference: gonum stat.LinearRegression (weighted least squares).
	rng := rand.New(rand.NewPCG(1, 1))
	n := 200
	x, y, w := make([]float64, n), make([]float64, n), make([]float64, n)
	for i := range x {
		x[i] = float64(i) * 0.01
		y[i] = 1.5 - 0.7*x[i] + 0.05*rng.NormFloat64()
		w[i] = 0.5 + rng.Float64()
	}
	for _, weights := range [][]float64{nil, w} {
		a, b := stat.LinearRegression(x, y, weights, false)
		f, ok := fitLine(x, y, weights)
		require.True(t, ok)
		// 1e-12: the same least-squares sums in another order, round-off only.
		assert.InEpsilon(t, a, f.a, 1e-12)
		assert.InEpsilon(t, b, f.b, 1e-12)
	}
	// Standard error of the slope for independent residuals: s/√Σ(x−x̄)²
	// (Draper & Smith §1.4); the AR(1) inflation is near 1 for white noise.
	f, _ := fitLine(x, y, nil)
	sxx := 0.0
	mx := stat.Mean(x, nil)
	for _, v := range x {
		sxx += (v - mx) * (v - mx)
	}
	assert.InEpsilon(t, f.resid/math.Sqrt(sxx), f.sb/math.Sqrt(f.inflated), 1e-12) // same formula: round-off only
	assert.Less(t, f.inflated, 1.5, "white residuals: little inflation")
	_, ok := fitLine([]float64{1, 1, 1}, []float64{1, 2, 3}, nil)
	assert.False(t, ok, "no spread in t")
}

func TestLocalSineIsExact(t *testing.T) {
	// Three or more samples of A cos(w(n − n₀)) give back A and n₀ exactly
	// (two unknowns α, β of a linear model, fitted without error).
	for _, w := range []float64{2 * math.Pi / 6, 2 * math.Pi / 40} {
		for _, half := range []int{1, 3} {
			const a, n0 = 1.7, 0.3
			y := make([]float64, 2*half+1)
			for i := range y {
				y[i] = -a * math.Cos(w*(float64(i-half)-n0)) // a trough
			}
			amp, off, ok := localSine(y, w)
			require.True(t, ok)
			assert.InEpsilon(t, a, amp, 1e-12) // exact fit: round-off only
			assert.InDelta(t, n0, off, 1e-9)   // samples; offset = atan2(β, α)/w, the 1/w (up to 6.4) scales the round-off
		}
	}
}

func TestDetectClipping(t *testing.T) {
	x := []float64{0, 1, 2, 2, 2, 1, 0, -1, -2, -1, 0, 1, 1.5, 1, 0}
	n, last := detectClipping(x)
	assert.Equal(t, 3, n, "three samples on the upper rail")
	assert.Equal(t, 4, last)
	n, last = detectClipping([]float64{0, 1, 0, -1, 0, 0.5, 0})
	assert.Zero(t, n, "single extremes are peaks, not clipping")
	assert.Equal(t, -1, last)
}

func TestFastLen(t *testing.T) {
	smooth := func(n int) bool {
		for _, p := range []int{2, 3, 5} {
			for n%p == 0 {
				n /= p
			}
		}
		return n == 1
	}
	for _, n := range append(seq(1, 2000), 1_000_001, 1_048_577) {
		want := n
		for !smooth(want) {
			want++
		}
		require.Equal(t, want, fastLen(n), "n = %d", n)
	}
}

func TestZoomSpectrumAgainstDTFT(t *testing.T) {
	// The zoomed spectrum at a bin equals the DTFT of the analytic signal at
	// that frequency, to the boxcar's droop sinc(Δf·d/fs) ≈ 1 near fc.
	const fs, fc, n = 1000.0, 25.0, 3000
	y, h := make([]float64, n), make([]float64, n)
	for i := range y {
		tt := float64(i) / fs
		e := math.Exp(-1.2 * tt)
		y[i] = e * math.Cos(2*math.Pi*24.9*tt)
		h[i] = e * math.Sin(2*math.Pi*24.9*tt)
	}
	sp := zoomSpectrum(y, h, fs, fc, 10, 0.01)
	for _, f := range []float64{24.5, 24.9, 25.3} {
		k := int(math.Round(sp.bin(f)))
		fk := sp.freq(float64(k))
		var s complex128
		for i := range y {
			s += complex(y[i], h[i]) * cmplx.Exp(complex(0, -2*math.Pi*fk*float64(i)/fs))
		}
		// The decimated sum is 1/d of the full-rate one.
		assert.InEpsilon(t, cmplx.Abs(s)/10, sp.mag[k], 2e-3, "f = %g", fk)
	}
}

func TestFitDampedSineRecoversParameters(t *testing.T) {
	// Noise-free samples of the model itself, started 5 % off: the fit
	// must return the parameters to rounding (the model is exact).
	p := [np]float64{0.8, -0.3, 1.7, 2 * math.Pi * 12, 0.05, -0.01}
	var tt, yy []float64
	for i := range 2000 {
		x := float64(i) / 500
		tt = append(tt, x)
		yy = append(yy, model(p, x))
	}
	p0 := p
	for i := range p0 {
		p0[i] *= 1.05
	}
	f, ok := fitDampedSine(tt, yy, p0)
	require.True(t, ok)
	for i := range p {
		assert.InDelta(t, p[i], f.p[i], 1e-8*math.Max(1, math.Abs(p[i])), "parameter %d", i) // 1e-8: the search stops on a 1e-10 relative change of the sum of squares, not at round-off
	}
}

// seq returns a, a+1, ..., b−1.
func seq(a, b int) []int {
	out := make([]int, 0, b-a)
	for i := a; i < b; i++ {
		out = append(out, i)
	}
	return out
}
