package springnet

import (
	"fmt"
	"math"
	"sort"
)

// RunningSpeed is one speed range of something turning in or near the
// machine (a spindle, a motor, a fan or pump) and how many excitation
// events each revolution makes: teeth or flutes of a cutter, blades of a
// fan or pump; 0 or 1 for once per revolution (unbalance).
type RunningSpeed struct {
	Name    string
	RPMLow  float64 // lowest speed [rev/min]
	RPMHigh float64 // highest speed [rev/min]; equal to RPMLow for a fixed speed
	PerRev  int     // events per revolution; 0 means 1
}

// ExcitationSettings controls CheckExcitation. A nil *ExcitationSettings
// means defaults; zero fields mean defaults.
type ExcitationSettings struct {
	// Harmonics is the highest multiple of each base excitation frequency
	// checked; 0 means DefaultHarmonics.
	Harmonics int
	// Margin is the relative separation asked for between a natural
	// frequency and an excitation band; 0 means DefaultMargin.
	Margin float64
}

// Defaults of ExcitationSettings.
const (
	// DefaultHarmonics: the base frequency and its 2nd and 3rd multiples
	// (a choice of this package; cutting forces of interrupted cuts are
	// rich in harmonics, raise it for them).
	DefaultHarmonics = 3
	// DefaultMargin: keep natural frequencies at least 20 % away from
	// excitation frequencies (common practice; local rules may ask more).
	DefaultMargin = 0.2
)

// Excitation is one band of excitation frequencies: harmonic Order of a
// running speed's base frequency rpm/60 × PerRev, over the speed range.
type Excitation struct {
	Speed     string  // the RunningSpeed's name
	Order     int     // harmonic (1 = the base frequency)
	Low, High float64 // [Hz]
}

// Excitations returns the excitation bands of the speeds, for orders 1 to
// harmonics (0 means DefaultHarmonics):
//
//	f = k · PerRev · rpm / 60,   k = 1 … harmonics
//
// in the order of the speeds, then of k. It fails for a speed that is not
// positive and finite, a range given highest first, or a negative count.
func Excitations(speeds []RunningSpeed, harmonics int) ([]Excitation, error) {
	if harmonics < 0 {
		return nil, fmt.Errorf("springnet: excitation: %d harmonics", harmonics)
	}
	if harmonics == 0 {
		harmonics = DefaultHarmonics
	}
	var out []Excitation
	for i, sp := range speeds {
		name := sp.Name
		if name == "" {
			name = fmt.Sprintf("speed %d", i+1)
		}
		if !(sp.RPMLow > 0) || !finite(sp.RPMHigh) || sp.RPMHigh < sp.RPMLow {
			return nil, fmt.Errorf("springnet: excitation: speed %q: range %g to %g rpm must be positive, lowest first", name, sp.RPMLow, sp.RPMHigh)
		}
		if sp.PerRev < 0 {
			return nil, fmt.Errorf("springnet: excitation: speed %q: %d events per revolution", name, sp.PerRev)
		}
		n := float64(max(sp.PerRev, 1))
		for k := 1; k <= harmonics; k++ {
			f := float64(k) * n / 60
			out = append(out, Excitation{Speed: name, Order: k, Low: f * sp.RPMLow, High: f * sp.RPMHigh})
		}
	}
	return out, nil
}

// Resonance is a natural frequency that lies within the margin of an
// excitation band.
type Resonance struct {
	Mode       int     // index of the mode (into the frequencies checked)
	Frequency  float64 // natural frequency [Hz]
	Excitation Excitation
	// Separation is the relative distance of the natural frequency from
	// the band, (f − High)/High above it, (Low − f)/Low below it, 0
	// inside it; a resonance has Separation < Margin.
	Separation float64
}

// CheckExcitation lists every natural frequency in freqs [Hz] that lies
// within the margin of an excitation band of the speeds: f in
// [Low·(1 − Margin), High·(1 + Margin)]. Zero frequencies (rigid-body
// modes) are skipped. The list is in ascending order of mode, then of
// excitation. Use it with ModeResult.FrequenciesTo or with measured
// frequencies (a tap test). Errors: those of Excitations, a margin outside
// [0, 1), or a frequency that is negative or not finite.
func CheckExcitation(freqs []float64, speeds []RunningSpeed, s *ExcitationSettings) ([]Resonance, error) {
	if s == nil {
		s = &ExcitationSettings{}
	}
	margin := s.Margin
	if margin == 0 {
		margin = DefaultMargin
	}
	if !(margin > 0 && margin < 1) {
		return nil, fmt.Errorf("springnet: excitation: margin %g must be in (0, 1)", s.Margin)
	}
	ex, err := Excitations(speeds, s.Harmonics)
	if err != nil {
		return nil, err
	}
	var out []Resonance
	for i, f := range freqs {
		if !finite(f) || f < 0 {
			return nil, fmt.Errorf("springnet: excitation: frequency %d is %g Hz", i+1, f)
		}
		if f == 0 {
			continue
		}
		for _, e := range ex {
			if f < e.Low*(1-margin) || f > e.High*(1+margin) {
				continue
			}
			sep := 0.0
			switch {
			case f > e.High:
				sep = (f - e.High) / e.High
			case f < e.Low:
				sep = (e.Low - f) / e.Low
			}
			out = append(out, Resonance{Mode: i, Frequency: f, Excitation: e, Separation: math.Max(sep, 0)})
		}
	}
	sort.SliceStable(out, func(a, b int) bool { return out[a].Mode < out[b].Mode })
	return out, nil
}

// CheckExcitation lists the modes of r within the margin of an excitation
// band of the speeds; see the function CheckExcitation.
func (r *ModeResult) CheckExcitation(speeds []RunningSpeed, s *ExcitationSettings) ([]Resonance, error) {
	return CheckExcitation(r.FrequenciesTo(nil), speeds, s)
}
