package ringdown

import (
	"math"
	"math/cmplx"

	"gonum.org/v1/gonum/dsp/fourier"
)

// fastLen returns the smallest n' >= n whose only prime factors are 2, 3
// and 5, lengths for which the FFT is fast.
func fastLen(n int) int {
	if n <= 1 {
		return 1
	}
	best := math.MaxInt
	for p2 := 1; p2 < 2*n; p2 *= 2 {
		for p3 := p2; p3 < 2*n; p3 *= 3 {
			for p5 := p3; p5 < 2*n; p5 *= 5 {
				if p5 >= n && p5 < best {
					best = p5
				}
			}
		}
	}
	return best
}

// spectrum is an amplitude spectrum on an even frequency grid.
type spectrum struct {
	base float64   // frequency of bin 0 [Hz]
	df   float64   // bin spacing [Hz]
	mag  []float64 // |X(base + k·df)|, unnormalised
}

// amplitudeSpectrum returns |DFT| of x zero-padded to fft.Len() points
// (at least len(x)).
func amplitudeSpectrum(fft *fourier.FFT, ws *workspace, x []float64, rate float64) spectrum {
	n := fft.Len()
	buf, c := ws.buffers(n)
	copy(buf, x)
	fft.Coefficients(c, buf)
	mag := make([]float64, len(c))
	for i, v := range c {
		mag[i] = cmplx.Abs(v)
	}
	return spectrum{df: rate / float64(n), mag: mag}
}

// freq returns the frequency of (fractional) bin k [Hz].
func (s spectrum) freq(k float64) float64 { return s.base + k*s.df }

// bin returns the (fractional) bin of frequency f.
func (s spectrum) bin(f float64) float64 { return (f - s.base) / s.df }

// peak returns the bin of the largest magnitude with lo <= k <= hi, and its
// interpolated position: a parabola through the logarithms of the three
// bins around it (Gaussian interpolation; exact for a Gaussian peak, within
// a small fraction of a bin for the windowed peaks met here — Gasior &
// Gonzalez, "Improving FFT frequency measurement resolution by parabolic and
// Gaussian interpolation", CERN AB-Note-2004-021).
func (s spectrum) peak(lo, hi int) (k int, frac float64) {
	lo = max(lo, 1)
	hi = min(hi, len(s.mag)-2)
	k = -1
	best := -1.0
	for i := lo; i <= hi; i++ {
		if s.mag[i] > best {
			k, best = i, s.mag[i]
		}
	}
	if k < 0 {
		return -1, 0
	}
	a, b, c := s.mag[k-1], s.mag[k], s.mag[k+1]
	if a <= 0 || b <= 0 || c <= 0 {
		return k, float64(k)
	}
	la, lb, lc := math.Log(a), math.Log(b), math.Log(c)
	den := la - 2*lb + lc
	if den >= 0 {
		return k, float64(k)
	}
	d := 0.5 * (la - lc) / den
	return k, float64(k) + math.Max(-0.5, math.Min(0.5, d))
}

// halfPower returns the frequencies below and above bin k where the power
// |X|² falls to half its value at k, interpolating linearly in power
// between bins; ok is false when either side runs out of bins first.
func (s spectrum) halfPower(k int) (flo, fhi float64, ok bool) {
	if k <= 0 || k >= len(s.mag)-1 {
		return 0, 0, false
	}
	half := s.mag[k] * s.mag[k] / 2
	i := k
	for i > 0 && s.mag[i]*s.mag[i] > half {
		i--
	}
	if i == 0 && s.mag[0]*s.mag[0] > half {
		return 0, 0, false
	}
	j := k
	for j < len(s.mag)-1 && s.mag[j]*s.mag[j] > half {
		j++
	}
	if s.mag[j]*s.mag[j] > half {
		return 0, 0, false
	}
	cross := func(a, b int) float64 { // bins a (below half) and b (above)
		pa, pb := s.mag[a]*s.mag[a], s.mag[b]*s.mag[b]
		return float64(a) + (half-pa)/(pb-pa)*float64(b-a)
	}
	return s.freq(cross(i, i+1)), s.freq(cross(j, j-1)), true
}

// noiseRatio returns ε, the typical noise amplitude in the spectrum
// relative to its peak at bin k (fractional position pk): the median of
// |mag − L| over the bins between lo and hi [Hz] more than two half-widths
// hw [Hz] from the peak, where L = mag[k]/√(1 + ((f − f_pk)/hw)²) is the
// Lorentzian through the peak, divided by mag[k]. It returns 0 when no bins
// are left to measure.
func (s spectrum) noiseRatio(k int, pk, hw, lo, hi float64) float64 {
	var p []float64
	fpk := s.freq(pk)
	for i := max(0, int(s.bin(lo))); i <= min(len(s.mag)-1, int(s.bin(hi))); i++ {
		d := (s.freq(float64(i)) - fpk) / hw
		if math.Abs(d) > 2 {
			p = append(p, math.Abs(s.mag[i]-s.mag[k]/math.Sqrt(1+d*d)))
		}
	}
	if len(p) == 0 || !(s.mag[k] > 0) || !(hw > 0) {
		return 0
	}
	return median(p) / s.mag[k]
}

// zoomSpectrum returns the amplitude spectrum of the analytic signal
// z = y + i·h near fc, with bin spacing df or at most 64-fold zero-padding: z is shifted down by fc,
// averaged over blocks of d samples (a boxcar low-pass) and decimated by d,
// then zero-padded and transformed with a complex FFT. The spectrum of the
// analytic signal is twice the positive-frequency spectrum of y, so peak,
// half-power points and noise ratio are those of y. The boxcar's droop is
// below 1 % within fs/(16d) of fc; callers choose d so that the region of
// interest lies well inside that.
func zoomSpectrum(y, h []float64, rate, fc float64, d int, df float64) spectrum {
	d = max(d, 1)
	m := len(y) / d
	w := make([]complex128, m)
	step := 2 * math.Pi * fc / rate
	for k := range m {
		var acc complex128
		for j := k * d; j < (k+1)*d; j++ {
			s, c := math.Sincos(step * float64(j))
			acc += complex(y[j], h[j]) * complex(c, -s)
		}
		w[k] = acc / complex(float64(d), 0)
	}
	rd := rate / float64(d)
	// Zero-padding beyond 64 times the data (or 2¹⁶ bins) adds nothing the
	// interpolation cannot give; it only costs time when df is tiny.
	n := fastLen(max(2*m, int(math.Min(math.Ceil(rd/df), float64(max(64*m, 1<<16))))))
	buf := make([]complex128, n)
	copy(buf, w)
	c := fourier.NewCmplxFFT(n).Coefficients(nil, buf)
	// Reorder to ascending frequency: bins 0..⌈n/2⌉−1 are zero and
	// positive, the rest (⌊n/2⌋ of them) negative.
	mag := make([]float64, n)
	half := n / 2
	for k := range n {
		src := (k + n - half) % n
		mag[k] = cmplx.Abs(c[src])
	}
	return spectrum{base: fc - float64(half)*rd/float64(n), df: rd / float64(n), mag: mag}
}
