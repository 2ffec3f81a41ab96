package ringdown

import (
	"math"

	"gonum.org/v1/gonum/dsp/fourier"
)

// Band is a frequency band [Low, High] in Hz.
type Band struct{ Low, High float64 }

// IsZero reports whether b is the zero Band (no band).
func (b Band) IsZero() bool { return b == Band{} }

// skirtFraction is the standard deviation of the Gaussian skirt on each
// side of a band-pass, as a fraction of the band's width. A Gaussian skirt
// gives the filter an impulse response with Gaussian tails, so a strike
// leaks into the isolated signal only for a short, known time; a wider skirt
// shortens that time, a narrower one rejects a close neighbour better
// (about −40 dB at 1.5 band-widths × skirtFraction × 2 beyond the edge).
const skirtFraction = 0.2

// gain returns the band-pass gain at f: 1 inside the band, a Gaussian skirt
// exp(−d²/(2s²)) at distance d outside it, s = skirtFraction·(High−Low).
func (b Band) gain(f float64) float64 {
	s := skirtFraction * (b.High - b.Low)
	var d float64
	switch {
	case f < b.Low:
		d = b.Low - f
	case f > b.High:
		d = f - b.High
	default:
		return 1
	}
	if d > 9*s {
		return 0
	}
	return math.Exp(-d * d / (2 * s * s))
}

// settle returns how long the band-pass needs to forget a strike [s]: four
// standard deviations of the Gaussian envelope of its impulse response,
// 4/(2π s).
func (b Band) settle() float64 {
	if b.IsZero() {
		return 0
	}
	return 4 / (2 * math.Pi * skirtFraction * (b.High - b.Low))
}

// analyticLen returns the FFT length analytic needs for n samples: zero
// padding of a sixteenth (at least 64 samples) against wrap-around, plus
// the band-pass's settling time.
func analyticLen(n int, rate float64, band Band) int {
	guard := max(n/16, 64)
	if !band.IsZero() {
		guard += int(math.Ceil(band.settle() * rate))
	}
	guard = min(guard, n)
	return fastLen(n + guard)
}

// analytic returns the (band-passed when band is not zero) signal y and its
// Hilbert transform h, so that y + i·h is the analytic signal. Both come
// from one real FFT of x zero-padded against wrap-around, the zero-phase
// band-pass and −i·sign(f) applied in the frequency domain (Oppenheim &
// Schafer, Discrete-Time Signal Processing, 3rd ed., §12.4), and one or two
// inverse real FFTs, all of length fft.Len() (from analyticLen). The DC
// term is removed from h; without a band, y is x itself (the caller has
// removed its mean and trend).
func analytic(fft *fourier.FFT, ws *workspace, x []float64, rate float64, band Band) (y, h []float64) {
	n := len(x)
	nf := fft.Len()
	buf, c := ws.buffers(nf)
	copy(buf, x)
	fft.Coefficients(c, buf)
	c[0] = 0
	scale := 1 / float64(nf)
	if band.IsZero() {
		y = x
	} else {
		df := rate / float64(nf)
		for k := range c {
			c[k] *= complex(band.gain(float64(k)*df), 0)
		}
		out := fft.Sequence(buf, c)
		y = make([]float64, n)
		for i := range y {
			y[i] = out[i] * scale
		}
	}
	// Hilbert transform: multiply by −i for 0 < f < Nyquist; zero at DC and
	// at the Nyquist bin.
	for k := range c {
		c[k] = complex(imag(c[k]), -real(c[k]))
	}
	c[0] = 0
	if nf%2 == 0 {
		c[len(c)-1] = 0
	}
	out := fft.Sequence(buf, c)
	h = make([]float64, n)
	for i := range h {
		h[i] = out[i] * scale
	}
	return y, h
}

// workspace holds the FFT buffers one Reduce reuses; a nil *workspace
// allocates fresh ones.
type workspace struct {
	buf  []float64
	coef []complex128
}

// buffers returns a zeroed real buffer of length n and a coefficient
// buffer of length n/2+1.
func (w *workspace) buffers(n int) ([]float64, []complex128) {
	if w == nil {
		return make([]float64, n), make([]complex128, n/2+1)
	}
	if cap(w.buf) < n {
		w.buf = make([]float64, n)
	}
	if cap(w.coef) < n/2+1 {
		w.coef = make([]complex128, n/2+1)
	}
	buf := w.buf[:n]
	clear(buf)
	return buf, w.coef[:n/2+1]
}
