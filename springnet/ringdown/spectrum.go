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

// spectrum is a one-sided amplitude spectrum on an even frequency grid.
type spectrum struct {
	df  float64   // bin spacing [Hz]
	mag []float64 // |X(k·df)|, unnormalised
}

// amplitudeSpectrum returns |DFT| of x zero-padded to at least nfft points.
func amplitudeSpectrum(x []float64, nfft int, rate float64) spectrum {
	n := fastLen(max(nfft, len(x)))
	buf := make([]float64, n)
	copy(buf, x)
	c := fourier.NewFFT(n).Coefficients(nil, buf)
	mag := make([]float64, len(c))
	for i, v := range c {
		mag[i] = cmplx.Abs(v)
	}
	return spectrum{df: rate / float64(n), mag: mag}
}

// freq returns the frequency of (fractional) bin k [Hz].
func (s spectrum) freq(k float64) float64 { return k * s.df }

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
