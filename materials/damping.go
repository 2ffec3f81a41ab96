package materials

import (
	"fmt"
	"math"
)

// Damping measures and their conversions, all in one place.
//
// For a single-degree-of-freedom viscously damped oscillator with damping
// ratio ζ (0 <= ζ < 1), free decay x(t) = X e^(−ζωₙt) cos(ω_d t + φ), the
// exact relations are (Inman, Engineering Vibration, 4th ed., §1.6;
// Thomson & Dahleh, Theory of Vibration with Applications, 5th ed., §2.7):
//
//	δ = ln(xᵢ/xᵢ₊₁) = 2πζ / √(1 − ζ²)        log decrement
//	ζ = δ / √(4π² + δ²)
//	ψ = ΔU/U = 1 − e^(−2δ)                   specific damping capacity
//	                                          (energy lost per cycle / energy at the cycle's start)
//	η = 2ζ                                    loss factor at resonance (viscous equivalent)
//	Q = 1 / (2ζ)                              quality factor
//
// The small-damping forms are
//
//	η ≈ 2ζ ≈ δ/π ≈ ψ/(2π) ≈ 1/Q
//
// δ ≈ 2πζ is in error by about ζ²/2 (relative): 0.5 % at ζ = 0.1.
// ψ ≈ 2δ is in error by about δ (relative), so ψ ≈ 4πζ is 1 % out
// already at ζ ≈ 0.0016 and 6 % out at ζ = 0.01; use the exact forms for ψ.
// The loss factor of a material (hysteretic damping) is η = ΔU / (2π U_max)
// per cycle; it equals 2ζ at resonance, which is how the modal strain
// energy method uses it.

// Damping holds one damping value expressed in every common measure.
type Damping struct {
	Ratio       float64 // damping ratio ζ [-]
	LogDecr     float64 // logarithmic decrement δ [-]
	LossFactor  float64 // loss factor η [-]
	Q           float64 // quality factor Q [-]; +Inf for ζ = 0
	SpecificCap float64 // specific damping capacity ψ [-]
}

// FromRatio returns every measure of damping for the damping ratio zeta,
// using the exact forms. It fails unless 0 <= zeta < 1.
func FromRatio(zeta float64) (Damping, error) {
	if math.IsNaN(zeta) || zeta < 0 || zeta >= 1 {
		return Damping{}, fmt.Errorf("materials: damping ratio %g is not in [0, 1)", zeta)
	}
	delta := LogDecrementFromRatio(zeta)
	q := math.Inf(1)
	if zeta > 0 {
		q = 1 / (2 * zeta)
	}
	return Damping{
		Ratio:       zeta,
		LogDecr:     delta,
		LossFactor:  2 * zeta,
		Q:           q,
		SpecificCap: -math.Expm1(-2 * delta),
	}, nil
}

// LogDecrementFromRatio returns δ = 2πζ/√(1−ζ²) (exact).
func LogDecrementFromRatio(zeta float64) float64 {
	return 2 * math.Pi * zeta / math.Sqrt(1-zeta*zeta)
}

// RatioFromLogDecrement returns ζ = δ/√(4π²+δ²) (exact).
func RatioFromLogDecrement(delta float64) float64 {
	return delta / math.Sqrt(4*math.Pi*math.Pi+delta*delta)
}

// RatioFromLossFactor returns ζ = η/2.
func RatioFromLossFactor(eta float64) float64 { return eta / 2 }

// LossFactorFromRatio returns η = 2ζ.
func LossFactorFromRatio(zeta float64) float64 { return 2 * zeta }

// RatioFromQ returns ζ = 1/(2Q).
func RatioFromQ(q float64) float64 { return 1 / (2 * q) }

// RatioFromSpecificCapacity returns ζ for the specific damping capacity ψ
// (exact): δ = −ln(1−ψ)/2, then ζ from δ.
func RatioFromSpecificCapacity(psi float64) float64 {
	return RatioFromLogDecrement(-math.Log1p(-psi) / 2)
}

// Small-damping (approximate) forms: see the accuracy note at the top of
// this file.

// ApproxRatioFromLogDecrement returns ζ ≈ δ/(2π).
func ApproxRatioFromLogDecrement(delta float64) float64 { return delta / (2 * math.Pi) }

// ApproxLogDecrementFromRatio returns δ ≈ 2πζ.
func ApproxLogDecrementFromRatio(zeta float64) float64 { return 2 * math.Pi * zeta }

// ApproxSpecificCapacityFromRatio returns ψ ≈ 4πζ (= 2δ).
func ApproxSpecificCapacityFromRatio(zeta float64) float64 { return 4 * math.Pi * zeta }

// FromLogDecrement returns every measure of damping for the logarithmic
// decrement delta (exact forms). It fails unless delta >= 0 and finite.
func FromLogDecrement(delta float64) (Damping, error) {
	if math.IsNaN(delta) || math.IsInf(delta, 0) || delta < 0 {
		return Damping{}, fmt.Errorf("materials: log decrement %g must be finite and non-negative", delta)
	}
	return FromRatio(RatioFromLogDecrement(delta))
}

// FromLossFactor returns every measure of damping for the loss factor eta,
// taking ζ = η/2. It fails unless 0 <= eta < 2.
func FromLossFactor(eta float64) (Damping, error) {
	if math.IsNaN(eta) || eta < 0 || eta >= 2 {
		return Damping{}, fmt.Errorf("materials: loss factor %g is not in [0, 2)", eta)
	}
	return FromRatio(RatioFromLossFactor(eta))
}

// FromQ returns every measure of damping for the quality factor q,
// taking ζ = 1/(2Q); q = +Inf means no damping. It fails unless q > 0.5.
func FromQ(q float64) (Damping, error) {
	if math.IsNaN(q) || !(q > 0.5) {
		return Damping{}, fmt.Errorf("materials: quality factor %g must be above 0.5 (damping ratio below 1)", q)
	}
	return FromRatio(RatioFromQ(q))
}

// FromSpecificCapacity returns every measure of damping for the specific
// damping capacity psi (exact forms). It fails unless 0 <= psi < 1.
func FromSpecificCapacity(psi float64) (Damping, error) {
	if math.IsNaN(psi) || psi < 0 || psi >= 1 {
		return Damping{}, fmt.Errorf("materials: specific damping capacity %g is not in [0, 1)", psi)
	}
	return FromRatio(RatioFromSpecificCapacity(psi))
}

// ApproxRatioFromSpecificCapacity returns ζ ≈ ψ/(4π).
func ApproxRatioFromSpecificCapacity(psi float64) float64 { return psi / (4 * math.Pi) }
