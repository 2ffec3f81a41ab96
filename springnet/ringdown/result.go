package ringdown

import (
	"fmt"
	"math"
	"slices"

	"github.com/trestle-go/trestle/materials"
)

var _ fmt.Stringer = Result{}

// Estimate is a measured value and its standard uncertainty (one standard
// deviation, in the value's unit).
type Estimate struct {
	Value float64
	Err   float64
}

// MethodEstimate is what one method found. Methods that could not measure
// (too few peaks, no half-power points, ...) have OK false and say why in
// Note; their numbers are then zero or only indicative.
type MethodEstimate struct {
	Method          string   // MethodPeaks, MethodHilbert, MethodSineFit or MethodHalfPower
	OK              bool     // the method produced a usable estimate
	DampedFrequency Estimate // damped natural frequency f_d [Hz]
	Ratio           Estimate // damping ratio ζ [-]
	Cycles          float64  // cycles (or, for peaks, peak-to-peak spans) used
	Note            string   // how it went: points used, why it failed
}

// set fills m from a decay rate σ [1/s] and damped angular frequency ω_d
// [rad/s] with their uncertainties:
//
//	ζ = σ/√(ω_d² + σ²)    (from σ = ζωₙ and ω_d = ωₙ√(1−ζ²); Inman §1.6)
//
// propagated to first order.
func (m *MethodEstimate) set(sig, usig, om, uom, cycles float64) {
	w := math.Hypot(om, sig)
	zeta := sig / w
	dz := math.Hypot(om*om/(w*w*w)*usig, sig*om/(w*w*w)*uom)
	m.DampedFrequency = Estimate{om / (2 * math.Pi), uom / (2 * math.Pi)}
	m.Ratio = Estimate{zeta, dz}
	m.Cycles = cycles
	m.OK = sig > 0 && om > 0 && zeta < 1 && finite(zeta, dz, om, uom, cycles)
	if !m.OK {
		m.DampedFrequency, m.Ratio = Estimate{}, Estimate{}
	}
}

// finite reports whether every value is finite.
func finite(v ...float64) bool {
	for _, x := range v {
		if bad(x) {
			return false
		}
	}
	return true
}

// Agreement says how well the methods agree on the damping ratio.
type Agreement struct {
	Factor float64 // largest over smallest ζ among the methods that worked (1: perfect)
	Limit  float64 // the factor above which they are said to disagree
	Agree  bool    // Factor <= Limit
}

// Window is the stretch of record the fits used.
type Window struct {
	Start, End float64 // [s], record time
	Cycles     float64 // cycles of the mode inside it
}

// Result is the outcome of Reduce: the mode's frequency and damping in
// every common measure, each with its standard uncertainty, how the methods
// compare, warnings, and what the picture needs. Obtain one from Reduce.
type Result struct {
	fd, fn       Estimate // damped and undamped natural frequency [Hz]
	zeta         Estimate
	delta        Estimate
	eta          Estimate
	q            Estimate
	psi          Estimate
	window       Window
	methods      []MethodEstimate
	agree        Agreement
	warnings     []string
	nominal      string // the method giving the nominal values
	band         Band
	pic          picture
	noiseFloor   float64 // [unit of the record]
	floorReached bool
}

// DampedFrequency returns the damped natural frequency f_d [Hz].
func (r Result) DampedFrequency() Estimate { return r.fd }

// NaturalFrequency returns the undamped natural frequency fₙ = f_d/√(1−ζ²) [Hz].
func (r Result) NaturalFrequency() Estimate { return r.fn }

// Ratio returns the damping ratio ζ [-].
func (r Result) Ratio() Estimate { return r.zeta }

// LogDecrement returns the logarithmic decrement δ = 2πζ/√(1−ζ²) [-].
func (r Result) LogDecrement() Estimate { return r.delta }

// Loss returns the loss factor η = 2ζ [-] as an estimate; LossFactor gives
// it as a materials.Range.
func (r Result) Loss() Estimate { return r.eta }

// Q returns the quality factor Q = 1/(2ζ) [-].
func (r Result) Q() Estimate { return r.q }

// SpecificCapacity returns the specific damping capacity ψ = 1 − e^(−2δ) [-].
func (r Result) SpecificCapacity() Estimate { return r.psi }

// Damping returns the nominal damping in every measure (materials.FromRatio
// of the nominal ζ); the zero Damping for a Result not from Reduce.
func (r Result) Damping() materials.Damping {
	d, err := materials.FromRatio(r.zeta.Value)
	if err != nil || !(r.zeta.Value > 0) {
		return materials.Damping{}
	}
	return d
}

// Limits for the warnings on the fit.
const (
	// noRingdown: a best-fit damped sinusoid whose residual standard
	// deviation exceeds its own starting amplitude describes no ring-down.
	noRingdown = 1.0
	// poorFit: residuals above 30 % of the amplitude mean a 10 dB SNR or
	// worse at the window start, or something the model lacks.
	poorFit = 0.3
	// littleDecay: over the window the envelope should fall by at least
	// e^(−0.5) ≈ 61 %; less, and the decay rate rests on little change.
	littleDecay = 0.5
)

// Coverage is the coverage factor of LossFactor's range: ±2 standard
// uncertainties, about 95 % for a normal distribution (JCGM 100:2008, GUM,
// §6.3).
const Coverage = 2

// LossFactor returns the measured loss factor η as a range: nominal η,
// low and high η ∓ Coverage·u(η), the low end held at zero or above.
func (r Result) LossFactor() materials.Range {
	e, u := r.eta.Value, Coverage*r.eta.Err
	return materials.Range{Low: math.Max(0, e-u), Nominal: e, High: e + u}
}

// Window returns the fit window.
func (r Result) Window() Window { return r.window }

// Cycles returns the number of cycles in the fit window.
func (r Result) Cycles() float64 { return r.window.Cycles }

// Methods returns the per-method estimates in the order peaks, Hilbert,
// sine fit, half-power (a copy).
func (r Result) Methods() []MethodEstimate { return slices.Clone(r.methods) }

// Nominal returns the name of the method whose values are the nominal ones
// (the sine fit unless it failed).
func (r Result) Nominal() string { return r.nominal }

// Agreement returns how well the methods agree on ζ.
func (r Result) Agreement() Agreement { return r.agree }

// Warnings returns what the reader noted and what the reduction found
// doubtful, one sentence each (a copy).
func (r Result) Warnings() []string { return slices.Clone(r.warnings) }

// NoiseFloor returns the level of the (isolated) signal's envelope over the
// record's last tenth, in the record's unit, and whether the ring-down had
// reached it (if not, the level is the decay itself).
func (r Result) NoiseFloor() (level float64, reached bool) { return r.noiseFloor, r.floorReached }

// Band returns the isolation band used (zero if none) [Hz].
func (r Result) Band() Band { return r.band }

// String returns a one-line summary, e.g.
// "f_d = 21.31 ± 0.002 Hz, ζ = 0.0123 ± 0.0004 over 18.2 cycles".
func (r Result) String() string {
	return fmt.Sprintf("f_d = %.4g ± %.2g Hz, ζ = %.4g ± %.2g over %.3g cycles",
		r.fd.Value, r.fd.Err, r.zeta.Value, r.zeta.Err, r.window.Cycles)
}

// WithMeasuredLoss returns m with its loss factor replaced by the measured
// one (r.LossFactor()) and a Source for "loss" naming the measurement in
// place of any earlier one. m itself is not changed.
func WithMeasuredLoss(m materials.Material, r Result) materials.Material {
	out := m
	out.Loss = r.LossFactor()
	out.Sources = make([]materials.Source, 0, len(m.Sources)+1)
	for _, s := range m.Sources {
		if s.Figure != "loss" {
			out.Sources = append(out.Sources, s)
		}
	}
	lf := out.Loss
	out.Sources = append(out.Sources, materials.Source{
		Figure: "loss",
		Ref: fmt.Sprintf("measured: tap-test ring-down, η = %.3g (%.3g–%.3g, ±%d standard uncertainties) at %.4g Hz over %.3g cycles",
			lf.Nominal, lf.Low, lf.High, Coverage, r.fn.Value, r.window.Cycles),
	})
	return out
}

// combine turns the method estimates into the Result.
func (r *reduction) combine(ms []MethodEstimate, sf sineFit) (Result, error) {
	var nom *MethodEstimate
	for _, name := range []string{MethodSineFit, MethodHilbert, MethodPeaks} {
		for i := range ms {
			if ms[i].Method == name && ms[i].OK {
				nom = &ms[i]
				break
			}
		}
		if nom != nil {
			break
		}
	}
	if nom == nil {
		return Result{}, fmt.Errorf("ringdown: no method could measure the decay of the %.4g Hz mode", r.f0)
	}
	if nom.Method != MethodSineFit {
		r.addWarn("the damped-sinusoid fit failed; nominal values are from the %s method", nom.Method)
	}
	var zs, fs []float64
	for _, m := range ms {
		if m.OK {
			zs = append(zs, m.Ratio.Value)
			fs = append(fs, m.DampedFrequency.Value)
		}
	}
	zeta := Estimate{nom.Ratio.Value, math.Hypot(nom.Ratio.Err, sampleSD(zs))}
	fd := Estimate{nom.DampedFrequency.Value, math.Hypot(nom.DampedFrequency.Err, sampleSD(fs))}
	c := math.Sqrt(1 - zeta.Value*zeta.Value)
	fn := Estimate{fd.Value / c, math.Hypot(fd.Err/c, fd.Value*zeta.Value/(c*c*c)*zeta.Err)}
	res := Result{fd: fd, fn: fn, zeta: zeta, methods: ms, nominal: nom.Method, band: r.cfg.band,
		noiseFloor: r.floor * r.scale, floorReached: r.floorOK}
	var err error
	if res.delta, res.eta, res.q, res.psi, err = measures(zeta); err != nil {
		return Result{}, err
	}
	res.window = Window{Start: r.rec.Time(r.win[0]), End: r.rec.Time(r.win[1]), Cycles: nom.Cycles}
	lo, hi := slices.Min(zs), slices.Max(zs)
	res.agree = Agreement{Factor: hi / lo, Limit: r.cfg.Disagree}
	res.agree.Agree = res.agree.Factor <= res.agree.Limit
	if !res.agree.Agree {
		r.addWarn("methods disagree by %.0f %% on the damping ratio (%.3g to %.3g; limit %.0f %%)",
			100*(res.agree.Factor-1), lo, hi, 100*(res.agree.Limit-1))
	}
	if nom.Method == MethodSineFit {
		switch rel := sf.resid / sf.amplitude(); {
		case rel > noRingdown:
			return Result{}, fmt.Errorf("ringdown: no ring-down found near %.4g Hz: the best damped sinusoid leaves residuals %.2g times its amplitude", r.f0, rel)
		case rel > poorFit:
			r.addWarn("the damped sinusoid fits poorly: residuals are %.0f %% of its amplitude (noise, other modes or a non-linear decay)", 100*rel)
		}
	}
	if decay := res.window.Cycles * res.delta.Value; decay < littleDecay {
		r.addWarn("the envelope falls only to %.0f %% over the fit window: the damping rests on a short stretch of decay", 100*math.Exp(-decay))
	}
	if zeta.Err > 0.5*zeta.Value {
		r.addWarn("the damping ratio is uncertain by %.0f %% of its value", 100*zeta.Err/zeta.Value)
	}
	if cyc := res.window.Cycles; cyc < fewCycles {
		r.addWarn("only %.1f cycles above the noise floor: the damping is uncertain", cyc)
	}
	if spc := r.period(); spc < fewSamples {
		r.addWarn("only %.1f samples per cycle: frequency and damping rest on interpolation", spc)
	}
	if !r.floorOK && r.cfg.Window == (Span{}) {
		r.addWarn("the record ends before the ring-down reaches the noise floor")
	}
	res.warnings = r.warn
	res.pic = r.picture(sf, nom)
	if !finite(fd.Value, fd.Err, fn.Value, fn.Err, zeta.Value, zeta.Err, res.window.Start, res.window.End, res.window.Cycles, res.agree.Factor) {
		return Result{}, fmt.Errorf("ringdown: the reduction produced a value that is not finite")
	}
	return res, nil
}

// measures converts ζ ± u into δ, η, Q and ψ through materials.FromRatio,
// propagating u by a central difference of the same conversion.
func measures(z Estimate) (delta, eta, q, psi Estimate, err error) {
	d, err := materials.FromRatio(z.Value)
	if err != nil {
		return delta, eta, q, psi, fmt.Errorf("ringdown: %w", err)
	}
	h := 1e-6 * z.Value
	lo, err1 := materials.FromRatio(z.Value - h)
	hi, err2 := materials.FromRatio(z.Value + h)
	if err1 != nil || err2 != nil {
		return delta, eta, q, psi, fmt.Errorf("ringdown: damping ratio %g too close to 0 or 1 to convert", z.Value)
	}
	slope := func(a, b float64) float64 { return math.Abs(b-a) / (2 * h) * z.Err }
	delta = Estimate{d.LogDecr, slope(lo.LogDecr, hi.LogDecr)}
	eta = Estimate{d.LossFactor, slope(lo.LossFactor, hi.LossFactor)}
	q = Estimate{d.Q, slope(lo.Q, hi.Q)}
	psi = Estimate{d.SpecificCap, slope(lo.SpecificCap, hi.SpecificCap)}
	if !finite(delta.Value, delta.Err, eta.Value, eta.Err, q.Value, q.Err, psi.Value, psi.Err) {
		return delta, eta, q, psi, fmt.Errorf("ringdown: damping ratio %g gives a measure that is not finite", z.Value)
	}
	return delta, eta, q, psi, nil
}

// sampleSD returns the sample standard deviation of v (0 for fewer than two).
func sampleSD(v []float64) float64 {
	if len(v) < 2 {
		return 0
	}
	m := 0.0
	for _, x := range v {
		m += x
	}
	m /= float64(len(v))
	ss := 0.0
	for _, x := range v {
		ss += (x - m) * (x - m)
	}
	return math.Sqrt(ss / float64(len(v)-1))
}
