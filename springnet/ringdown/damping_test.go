package ringdown

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/materials"
)

// The damping measures Reduce reports come from materials.FromRatio. These
// tests check that conversion, as this package uses it, against the
// textbook definitions evaluated independently: on the closed-form free
// decay, on the steady-state energy balance, and on the receptance curve.

var testRatios = []float64{0.001, 0.01, 0.05, 0.2, 0.5}

func TestLogDecrementFromTheDecay(t *testing.T) {
	// δ = ln(x(t)/x(t+T_d)) for the free decay x(t) = A e^(−ζωₙt) sin(ω_d t + φ)
	// over one damped period T_d = 2π/ω_d (Inman, Engineering Vibration,
	// 4th ed., §1.6, logarithmic decrement), measured on the signal itself.
	for _, z := range testRatios {
		m := mode{F: 10, Zeta: z, A: 1, Phi: 0.7}
		td := 1 / (m.F * math.Sqrt(1-z*z))
		t0 := 0.013 // any time where x ≠ 0
		delta := math.Log(m.at(t0) / m.at(t0+td))
		d, err := materials.FromRatio(z)
		require.NoError(t, err)
		assert.InEpsilon(t, delta, d.LogDecr, 1e-12, "ζ = %g", z) // closed form vs the signal: round-off of log/exp only
		// And back: ζ = δ/√(4π² + δ²).
		assert.InEpsilon(t, z, materials.RatioFromLogDecrement(delta), 1e-12, "ζ = %g", z)
	}
}

func TestSpecificCapacityFromTheDecay(t *testing.T) {
	// ψ = ΔU/U per cycle. At an extremum of the displacement the velocity
	// is zero, so the energy is ½kx²; extrema are one damped period apart.
	// So ψ = 1 − (x(t_p+T_d)/x(t_p))² (Thomson & Dahleh, Theory of Vibration
	// with Applications, 5th ed., §2.7, specific damping capacity — from
	// memory), with t_p found on the signal where ẋ = 0:
	// tan(ω_d t + φ) = ω_d/(ζωₙ).
	for _, z := range testRatios {
		m := mode{F: 10, Zeta: z, A: 1, Phi: 0.7}
		wn := 2 * math.Pi * m.F
		wd := wn * math.Sqrt(1-z*z)
		tp := (math.Atan(wd/(z*wn)) - m.Phi + 2*math.Pi) / wd
		td := 2 * math.Pi / wd
		h := 1e-7
		// ẋ by central difference, h = 1e-7 s: truncation h²·ωₙ³A/6 ≈ 4e-10, round-off
		// ε/h ≈ 1e-9; against a peak velocity ωₙA ≈ 63, 1e-6 is near zero.
		require.InDelta(t, 0, (m.at(tp+h)-m.at(tp-h))/(2*h), 1e-6, "t_p is an extremum")
		ratio := m.at(tp+td) / m.at(tp)
		psi := 1 - ratio*ratio
		d, err := materials.FromRatio(z)
		require.NoError(t, err)
		assert.InEpsilon(t, psi, d.SpecificCap, 1e-9, "ζ = %g", z) // 1 − ratio² cancels ~2 digits at ζ = 0.001 (ψ ≈ 0.013): a generous round-off allowance
	}
}

func TestLossFactorFromEnergyPerCycle(t *testing.T) {
	// η = ΔU/(2π U_max): the energy a viscous damper c = 2ζωₙm dissipates
	// in one cycle of x = X sin ωₙt, ∮ c ẋ² dt, over 2π times the peak strain
	// energy ½kX² (Inman, Engineering Vibration, §2.7, loss factor of the
	// equivalent hysteretic damping — from memory). Integrated numerically
	// (trapezoid rule on a periodic integrand: exact to rounding).
	const m, wn, x0, steps = 1.0, 2 * math.Pi * 10, 1e-3, 2000
	k := m * wn * wn
	for _, z := range testRatios {
		c := 2 * z * wn * m
		period := 2 * math.Pi / wn
		dt := period / steps
		du := 0.0
		for i := range steps {
			v := x0 * wn * math.Cos(wn*float64(i)*dt)
			du += c * v * v * dt
		}
		eta := du / (2 * math.Pi * 0.5 * k * x0 * x0)
		d, err := materials.FromRatio(z)
		require.NoError(t, err)
		assert.InEpsilon(t, eta, d.LossFactor, 1e-12, "ζ = %g", z) // trapezoid on a periodic integrand is exact: round-off only
	}
}

func TestQFromHalfPowerBandwidth(t *testing.T) {
	// Q = fₙ/Δf from the half-power points of the receptance
	// |H(r)| = 1/√((1−r²)² + (2ζr)²), r = ω/ωₙ; the half-power method gives
	// Q = 1/(2ζ) to first order in ζ (Inman, Engineering Vibration, §2.2).
	// The points are found numerically by bisection on |H|² = |H|²_max/2.
	// Tolerance 2ζ: the first-order error of the half-power approximation.
	for _, z := range []float64{0.001, 0.01, 0.05} {
		h2 := func(r float64) float64 { return 1 / ((1-r*r)*(1-r*r) + 4*z*z*r*r) }
		rp := math.Sqrt(1 - 2*z*z) // peak of the receptance
		half := h2(rp) / 2
		root := func(a, b float64) float64 { // h2 − half changes sign on [a, b]
			for range 200 {
				mid := (a + b) / 2
				if (h2(a)-half)*(h2(mid)-half) <= 0 {
					b = mid
				} else {
					a = mid
				}
			}
			return (a + b) / 2
		}
		r1, r2 := root(rp-10*z, rp), root(rp, rp+10*z)
		q := 1 / (r2 - r1)
		d, err := materials.FromRatio(z)
		require.NoError(t, err)
		assert.InEpsilon(t, q, d.Q, 2*z, "ζ = %g", z)
	}
}

func TestFromRatioRejectsBadRatios(t *testing.T) {
	for _, z := range []float64{-0.1, 1, 1.5, math.NaN()} {
		_, err := materials.FromRatio(z)
		assert.Error(t, err, "ζ = %g", z)
	}
}
