package materials

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// freeDecay is the free response of a viscously damped single-degree-of-
// freedom oscillator released from x = 1 at rest (Inman, Engineering
// Vibration, 4th ed., §1.3, underdamped solution; Thomson & Dahleh §2.6):
//
//	x(t) = e^(−ζωt) (cos ω_d t + ζ/√(1−ζ²) sin ω_d t),  ω_d = ω√(1−ζ²)
//
// and its velocity, found here by differentiating by hand.
func freeDecay(zeta, w, t float64) (x, v float64) {
	wd := w * math.Sqrt(1-zeta*zeta)
	a := zeta / math.Sqrt(1-zeta*zeta)
	e := math.Exp(-zeta * w * t)
	c, s := math.Cos(wd*t), math.Sin(wd*t)
	x = e * (c + a*s)
	// dx/dt = −ζω x + e(−ω_d sin + a ω_d cos)
	v = -zeta*w*x + e*(-wd*s+a*wd*c)
	return x, v
}

// TestDampingAgainstFreeDecay measures δ and ψ on the free-decay curve of
// the oscillator itself, one damped period apart, and compares them with
// the exact conversions.
func TestDampingAgainstFreeDecay(t *testing.T) {
	const w = 2 * math.Pi * 7.3 // any natural frequency [rad/s]
	const m, tol = 1.0, 1e-10   // tol: round-off in exp/cos over one period
	const deltaTol = 1e-12      // δ and ζ(δ): a log and a sqrt of the same round-off, no energy sums
	for _, zeta := range []float64{1e-4, 0.003, 0.02, 0.1, 0.2, 0.3, 0.5, 0.7} {
		t.Run("", func(t *testing.T) {
			k := m * w * w
			td := 2 * math.Pi / (w * math.Sqrt(1-zeta*zeta))
			x0, v0 := freeDecay(zeta, w, 0)
			x1, v1 := freeDecay(zeta, w, td)
			delta := math.Log(x0 / x1) // definition of the log decrement
			e0 := 0.5*k*x0*x0 + 0.5*m*v0*v0
			e1 := 0.5*k*x1*x1 + 0.5*m*v1*v1
			psi := (e0 - e1) / e0 // definition of the specific damping capacity

			d, err := FromRatio(zeta)
			require.NoError(t, err)
			assert.InEpsilon(t, delta, d.LogDecr, deltaTol, "δ")
			assert.InEpsilon(t, psi, d.SpecificCap, tol, "ψ")
			assert.InEpsilon(t, zeta, RatioFromLogDecrement(delta), deltaTol, "ζ from δ")
			assert.InEpsilon(t, zeta, RatioFromSpecificCapacity(psi), 1e-8, "ζ from ψ") // log1p of a measured ψ: looser
		})
	}
}

// TestQualityFactorHalfPower checks Q = 1/(2ζ) against the half-power
// bandwidth of the receptance |H(ω)|² = 1/((k−mω²)² + (cω)²), found by
// bisection: Q ≈ ω_n/Δω for light damping (Inman §2.4 / Thomson §3.2,
// half-power points; the exact bandwidth differs by O(ζ²)).
func TestQualityFactorHalfPower(t *testing.T) {
	const wn = 1.0
	for _, zeta := range []float64{0.001, 0.01, 0.05} {
		h2 := func(w float64) float64 {
			r := 1 - w*w
			return 1 / (r*r + (2*zeta*w)*(2*zeta*w))
		}
		wp := wn * math.Sqrt(1-2*zeta*zeta) // peak of the receptance (Inman §2.2)
		half := h2(wp) / 2
		find := func(lo, hi float64) float64 { // h2 − half changes sign on [lo, hi]
			for range 200 {
				mid := (lo + hi) / 2
				if (h2(lo)-half)*(h2(mid)-half) <= 0 {
					hi = mid
				} else {
					lo = mid
				}
			}
			return (lo + hi) / 2
		}
		w1 := find(wp*(1-10*zeta), wp)
		w2 := find(wp, wp*(1+10*zeta))
		q := wn / (w2 - w1)
		d, err := FromRatio(zeta)
		require.NoError(t, err)
		// Half-power estimate differs from 1/(2ζ) by about ζ² relative; allow 2ζ²+1e-9.
		assert.InEpsilon(t, q, d.Q, 2*zeta*zeta+1e-9, "ζ = %g", zeta)
	}
}

// TestLossFactorFromEnergyPerCycle checks η = ΔU/(2π U_max): the energy a
// viscous damper c = 2ζωₙm dissipates in one cycle of x = X sin ωₙt,
// ∮ c ẋ² dt, over 2π times the peak strain energy ½kX² (Inman, Engineering
// Vibration, §2.7, loss factor of the equivalent hysteretic damping — from
// memory). Integrated numerically (trapezoid rule on a periodic integrand:
// exact to rounding).
func TestLossFactorFromEnergyPerCycle(t *testing.T) {
	const m, wn, x0, steps = 1.0, 2 * math.Pi * 10, 1e-3, 2000
	k := m * wn * wn
	for _, zeta := range []float64{0.001, 0.01, 0.05, 0.2, 0.5} {
		c := 2 * zeta * wn * m
		period := 2 * math.Pi / wn
		dt := period / steps
		du := 0.0
		for i := range steps {
			v := x0 * wn * math.Cos(wn*float64(i)*dt)
			du += c * v * v * dt
		}
		eta := du / (2 * math.Pi * 0.5 * k * x0 * x0)
		d, err := FromRatio(zeta)
		require.NoError(t, err)
		assert.InEpsilon(t, eta, d.LossFactor, 1e-12, "ζ = %g", zeta) // trapezoid on a periodic integrand is exact: round-off only
	}
}

func TestDampingTextbookValues(t *testing.T) {
	tests := []struct {
		name string
		got  float64
		want float64
		tol  float64
	}{
		// Hand calculation: δ = 2π·0.1/√(1−0.01) = 0.628319/0.994987 = 0.631484.
		{"delta at zeta 0.1", LogDecrementFromRatio(0.1), 0.631484, 1e-5},
		// Hand calculation: ζ = 1/√(4π²+1) = 1/6.362265 = 0.157177 for δ = 1.
		{"zeta at delta 1", RatioFromLogDecrement(1), 0.157177, 1e-5},
		// η = 2ζ (Inman §1.6 for the viscous equivalent at resonance).
		{"loss at zeta 0.02", LossFactorFromRatio(0.02), 0.04, 1e-12},
		{"zeta at loss 0.04", RatioFromLossFactor(0.04), 0.02, 1e-12},
		// Q = 1/(2ζ): Q = 50 is ζ = 0.01.
		{"zeta at Q 50", RatioFromQ(50), 0.01, 1e-12},
		// Hand calculation: ψ = 1 − e^(−2·2π·0.05/√(1−0.0025)) = 1 − e^(−0.629105) = 0.466932.
		{"psi at zeta 0.05", mustRatio(t, 0.05).SpecificCap, 0.466932, 1e-5},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			assert.InEpsilon(t, tc.want, tc.got, tc.tol)
		})
	}
}

func mustRatio(t *testing.T, zeta float64) Damping {
	d, err := FromRatio(zeta)
	require.NoError(t, err)
	return d
}

// TestDampingApproxVsExact checks that the small-damping forms differ from
// the exact ones by the amounts the series expansions predict:
// δ: 1/√(1−ζ²) − 1 ≈ ζ²/2; ψ: (2δ − (1−e^(−2δ)))/ψ ≈ δ.
func TestDampingApproxVsExact(t *testing.T) {
	for _, zeta := range []float64{0.001, 0.01, 0.05} {
		d := mustRatio(t, zeta)
		dRel := (d.LogDecr - ApproxLogDecrementFromRatio(zeta)) / d.LogDecr
		assert.InEpsilon(t, zeta*zeta/2, dRel, 0.01, "δ at ζ = %g", zeta) // next term is O(ζ⁴)
		pRel := (ApproxSpecificCapacityFromRatio(zeta) - d.SpecificCap) / d.SpecificCap
		assert.InEpsilon(t, d.LogDecr, pRel, 0.7*d.LogDecr+1e-3, "ψ at ζ = %g", zeta) // next term is O(δ²)
		assert.Greater(t, pRel, 0.0, "4πζ overstates ψ")
		assert.InEpsilon(t, zeta, ApproxRatioFromLogDecrement(d.LogDecr), zeta*zeta, "ζ ≈ δ/2π")
		assert.InEpsilon(t, zeta, ApproxRatioFromSpecificCapacity(ApproxSpecificCapacityFromRatio(zeta)), 1e-12) // ψ = 4πζ and back: exact inverses, round-off only
	}
	// At ζ = 0.01 the ψ ≈ 4πζ form is already about 6 % out (the doc comment says so).
	d := mustRatio(t, 0.01)
	assert.Greater(t, ApproxSpecificCapacityFromRatio(0.01)/d.SpecificCap-1, 0.05)
}

func TestDampingRoundTrips(t *testing.T) {
	const tol = 1e-12 // round-off only
	for _, zeta := range []float64{0, 1e-6, 1e-3, 0.05, 0.2, 0.5, 0.9, 0.999} {
		d := mustRatio(t, zeta)
		for _, c := range []struct {
			name string
			got  func() (Damping, error)
		}{
			{"log decrement", func() (Damping, error) { return FromLogDecrement(d.LogDecr) }},
			{"loss factor", func() (Damping, error) { return FromLossFactor(d.LossFactor) }},
			{"Q", func() (Damping, error) { return FromQ(d.Q) }},
			{"specific capacity", func() (Damping, error) { return FromSpecificCapacity(d.SpecificCap) }},
		} {
			t.Run(c.name, func(t *testing.T) {
				if c.name == "specific capacity" && zeta >= 0.9 {
					t.Skip("1 − ψ = e^(−2δ) is below 1e-10 here: ψ keeps too few digits in float64")
				}
				back, err := c.got()
				require.NoError(t, err)
				assert.InDelta(t, zeta, back.Ratio, tol*math.Max(1, 1/(1-zeta)))
			})
		}
	}
	d := mustRatio(t, 0)
	assert.True(t, math.IsInf(d.Q, 1), "ζ = 0 has infinite Q")
	assert.Zero(t, d.LogDecr)
	assert.Zero(t, d.SpecificCap)
}

func TestDampingBadInput(t *testing.T) {
	tests := []struct {
		name string
		fn   func() (Damping, error)
	}{
		{"negative ratio", func() (Damping, error) { return FromRatio(-0.01) }},
		{"ratio 1", func() (Damping, error) { return FromRatio(1) }},
		{"ratio above 1", func() (Damping, error) { return FromRatio(1.5) }},
		{"NaN ratio", func() (Damping, error) { return FromRatio(math.NaN()) }},
		{"negative log decrement", func() (Damping, error) { return FromLogDecrement(-1) }},
		{"infinite log decrement", func() (Damping, error) { return FromLogDecrement(math.Inf(1)) }},
		{"loss factor 2", func() (Damping, error) { return FromLossFactor(2) }},
		{"NaN loss factor", func() (Damping, error) { return FromLossFactor(math.NaN()) }},
		{"Q 0.5", func() (Damping, error) { return FromQ(0.5) }},
		{"negative Q", func() (Damping, error) { return FromQ(-3) }},
		{"specific capacity 1", func() (Damping, error) { return FromSpecificCapacity(1) }},
		{"negative specific capacity", func() (Damping, error) { return FromSpecificCapacity(-0.1) }},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := tc.fn()
			require.Error(t, err)
			assert.Contains(t, err.Error(), "materials: ")
		})
	}
}
