package ringdown

import (
	"math"
	"math/rand/v2"
)

// mode is one damped mode of a synthetic record, in the closed form of free
// viscous decay (Inman, Engineering Vibration, 4th ed., §1.6; Thomson &
// Dahleh, Theory of Vibration with Applications, §2.7):
//
//	x(t) = A e^(−ζωₙt) sin(ω_d t + φ),  ω_d = ωₙ√(1−ζ²)
type mode struct {
	F    float64 // undamped natural frequency fₙ [Hz]
	Zeta float64 // damping ratio ζ
	A    float64 // amplitude at the strike
	Phi  float64 // phase at the strike [rad]
}

// at returns the mode's value at time t after the strike (0 before it).
func (m mode) at(t float64) float64 {
	if t < 0 {
		return 0
	}
	wn := 2 * math.Pi * m.F
	wd := wn * math.Sqrt(1-m.Zeta*m.Zeta)
	return m.A * math.Exp(-m.Zeta*wn*t) * math.Sin(wd*t+m.Phi)
}

// synth describes a synthetic ring-down record.
type synth struct {
	Rate     float64 // sample rate [Hz]
	Duration float64 // record length [s]
	Strike   float64 // time of the strike [s]
	Modes    []mode
	SNR      float64 // dB: signal power (of the first mode over its first e-folding... see noise) over noise power; 0: no noise
	Offset   float64 // DC offset (gravity) added
	Clip     float64 // clip level (0: none)
	Jitter   float64 // timestamp jitter as a fraction of the step (uniform ±); 0: even
}

// samples returns the times and values; the noise is white Gaussian with
// σ = A₁/√2 · 10^(−SNR/20), i.e. SNR is the ratio of the initial signal
// power (A²/2) to the noise power.
func (s synth) samples(rng *rand.Rand) (t, x []float64) {
	n := int(s.Duration * s.Rate)
	t = make([]float64, n)
	x = make([]float64, n)
	sigma := 0.0
	if s.SNR != 0 {
		sigma = s.Modes[0].A / math.Sqrt2 * math.Pow(10, -s.SNR/20)
	}
	for i := range n {
		ti := float64(i) / s.Rate
		if s.Jitter > 0 && i > 0 && i < n-1 {
			ti += (2*rng.Float64() - 1) * s.Jitter / s.Rate
		}
		t[i] = ti
		v := s.Offset
		for _, m := range s.Modes {
			v += m.at(ti - s.Strike)
		}
		if sigma > 0 {
			v += sigma * rng.NormFloat64()
		}
		if s.Clip > 0 {
			v = math.Max(s.Offset-s.Clip, math.Min(s.Offset+s.Clip, v))
		}
		x[i] = v
	}
	return t, x
}

// record returns the synthetic record, evenly sampled (no jitter).
func (s synth) record(rng *rand.Rand) Record {
	_, x := s.samples(rng)
	return Record{Rate: s.Rate, Samples: x, Unit: "m/s²"}
}
