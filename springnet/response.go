package springnet

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet/eigen"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// Probe is where a harmonic force goes in, or where a motion is read: a
// place (a mount, node or rigid group) and one direction (UX, UY, UZ for
// forces and displacements, RX, RY, RZ for moments and rotations).
type Probe struct {
	At  Place
	Dir DOF
}

// ResponseSettings controls a frequency response. A nil *ResponseSettings
// is not allowed (the band has no default); zero fields mean defaults.
type ResponseSettings struct {
	// Low and High bound the band [Hz], 0 < Low < High.
	Low, High float64
	// Points is the number of frequencies in the band; 0 means
	// DefaultResponsePoints. They are spaced logarithmically unless Linear.
	Points int
	Linear bool
	// Damping picks the level of the modal loss factors (ModeResult.
	// LossFactor); the zero Level is Nominal. Choose Low for a
	// conservative (higher) resonance peak.
	Damping materials.Level
	// Ratio, when positive, replaces the modal damping ratio of every mode
	// (a measured or assumed ζ, e.g. from a tap test).
	Ratio float64
	// Cutoff: Response includes every mode below Cutoff·High; 0 means
	// DefaultCutoff. Receptance uses the modes of its ModeResult.
	Cutoff float64
	// MaxModes caps the number of modes Response computes; 0 means
	// DefaultMaxResponseModes.
	MaxModes int
	// NoResidual leaves out the residual-flexibility correction.
	NoResidual bool
	// Modes sets the mass matrix, material level and solver of the modal
	// analysis that Response runs (its Count is set from Cutoff).
	Modes ModeSettings
}

// Defaults of ResponseSettings.
const (
	DefaultResponsePoints = 400
	// DefaultCutoff: modes up to twice the top of the band (common
	// practice is 1.5 to 2 times the highest frequency of interest; the
	// residual flexibility accounts for the rest quasi-statically).
	DefaultCutoff           = 2.0
	DefaultMaxResponseModes = 200
)

// FRF is a frequency response function between two probes by modal
// superposition with modal (strain-energy) damping,
//
//	H_jk(ω) = Σᵣ φ_jr·φ_kr / (ω_r² − ω² + i·2ζ_r·ω_r·ω)  +  R_jk
//
// with modes of unit modal mass (Ewins, Modal Testing: Theory, Practice
// and Application, 2nd ed., receptance of a proportionally damped system)
// and R_jk the residual flexibility of the modes left out: the static
// compliance minus the static compliance of the modes kept,
//
//	R_jk = C_jk − Σᵣ φ_jr·φ_kr / ω_r²
//
// (modes r with ω_r > 0), a constant that is exact at ω = 0 and good while
// the band stays well below the first mode left out. Without supports
// (rigid-body modes) the static compliance does not exist and no residual
// is added (Truncation says so). Receptance is displacement per unit
// force [m/N] (rad/N, m/(N·m), rad/(N·m) for rotations and moments); the
// dynamic stiffness is its inverse. The phase is that of the response
// relative to the force: 0 below resonance, −π/2 at resonance for a
// driving point.
type FRF struct {
	out, in string
	freq    []float64
	h       []complex128
	lambda  []float64 // ω_r² of the modes included
	zeta    []float64
	prod    []float64 // φ_jr·φ_kr
	resid   float64
	trunc   Truncation
}

// Truncation states what an FRF leaves out.
type Truncation struct {
	Modes    int     // modes in the sum
	Highest  float64 // frequency of the highest mode in the sum [Hz]
	Band     float64 // top of the band [Hz]
	Residual bool    // a residual-flexibility term is added
	// ResidualCompliance is that term [m/N] (0 when not added).
	ResidualCompliance float64
	// Why, when Residual is false: "not asked for", or why it could not be
	// formed (a model with rigid-body modes has no static compliance).
	Why string
}

// Peak is a local maximum of |H| in the band.
type Peak struct {
	Frequency float64 // [Hz]
	Magnitude float64 // |H| [m/N]
	Phase     float64 // arg H [rad], in (−π, π]
	Mode      int     // the mode nearest in frequency (index into the ModeResult)
}

// Response computes the modes of m below Cutoff·High (at most MaxModes) and
// returns the receptance between in and out over the band; see
// ModeResult.Receptance. Errors are those of Modes and Receptance.
func Response(m *Model, out, in Probe, s *ResponseSettings) (*FRF, *ModeResult, error) {
	if err := checkBand(s); err != nil {
		return nil, nil, err
	}
	cut := s.Cutoff
	if cut == 0 {
		cut = DefaultCutoff
	}
	if !(cut >= 1) || !finite(cut) {
		return nil, nil, fmt.Errorf("springnet: response: cutoff factor %g must be at least 1", s.Cutoff)
	}
	maxModes := s.MaxModes
	if maxModes == 0 {
		maxModes = DefaultMaxResponseModes
	}
	if maxModes < 0 {
		return nil, nil, fmt.Errorf("springnet: response: %d modes asked for", s.MaxModes)
	}
	if err := m.Validate(); err != nil {
		return nil, nil, err
	}
	nt, err := prepare(m, s.Modes.Level)
	if err != nil {
		return nil, nil, err
	}
	k := nt.assemble(sparse.NewBuilder(0))
	mm := nt.assembleMassOf(sparse.NewBuilder(0), s.Modes.Mass)
	w := 2 * math.Pi * cut * s.High
	count := 0
	for try := 0; try < 4; try++ {
		count, err = eigen.CountBelow(k, mm, w*w)
		var sing *eigen.SingularError
		if !errors.As(err, &sing) {
			break
		}
		w *= 1 + 1e-6
	}
	if err != nil {
		// A massless mechanism: let Modes describe it.
		count = 1
	}
	ms := s.Modes
	ms.Count = max(1, min(count, maxModes))
	mr, err := Modes(m, &ms)
	var few *eigen.FewerModesError
	if err != nil && !(errors.As(err, &few) && mr != nil) {
		return nil, nil, err
	}
	f, err := mr.Receptance(out, in, s)
	return f, mr, err
}

func checkBand(s *ResponseSettings) error {
	if s == nil {
		return errors.New("springnet: response: no settings: the band (Low, High) must be given")
	}
	if !(s.Low > 0) || !(s.High > s.Low) || !finite(s.High) {
		return fmt.Errorf("springnet: response: band [%g, %g] Hz must have 0 < Low < High", s.Low, s.High)
	}
	if s.Points < 0 || s.Points == 1 {
		return fmt.Errorf("springnet: response: %d points: need at least 2", s.Points)
	}
	if s.Ratio < 0 || !finite(s.Ratio) {
		return fmt.Errorf("springnet: response: damping ratio %g must be non-negative", s.Ratio)
	}
	return nil
}

// probeOf resolves a probe to its owner, point and component.
func (r *ModeResult) probeOf(p Probe, what string) (o int, at Vec, c int, err error) {
	m := r.nt.m
	m.checkPlace(p.At)
	c = -1
	for i := 0; i < 6; i++ {
		if p.Dir == dofAt(i) {
			c = i
		}
	}
	if c < 0 {
		return 0, Vec{}, 0, fmt.Errorf("springnet: response: %s at %s: direction %v must be one of UX, UY, UZ, RX, RY, RZ", what, m.PlaceName(p.At), p.Dir)
	}
	d := &r.nt.dm
	o, at = d.placeOwner(m, p.At)
	if o < d.nNodes && d.ownerHas[o]&Rotations != Rotations && (c >= 3 || at.Sub(d.ownerRef[o]).Norm() > 0) {
		return 0, Vec{}, 0, fmt.Errorf("springnet: response: %s at %s: node %q carries no rotations "+
			"(only bars or axial springs meet there), so a moment there, or a force away from it, is not defined; "+
			"put the probe at the node or on a rigid group", what, m.PlaceName(p.At), m.nodes[o].name)
	}
	return o, at, c, nil
}

// Receptance returns the receptance H between a harmonic force at in and
// the motion at out over the band of s, by modal superposition of the
// modes of r with their modal damping (ζ = η/2 at s.Damping, or s.Ratio)
// plus, unless s.NoResidual, the residual flexibility (see FRF). The
// static compliance for the residual is solved with K (its residual
// checked); a result whose solve residual exceeds MaxResidual comes with a
// *ConditionError.
//
// It fails for a bad band or probe, and when a mode in the band carries no
// damping (every element it strains has a zero loss factor) and couples
// the two probes: its peak would be infinite. Give loss factors or Ratio.
func (r *ModeResult) Receptance(out, in Probe, s *ResponseSettings) (*FRF, error) {
	if err := checkBand(s); err != nil {
		return nil, err
	}
	oo, ao, co, err := r.probeOf(out, "output")
	if err != nil {
		return nil, err
	}
	oi, ai, ci, err := r.probeOf(in, "input")
	if err != nil {
		return nil, err
	}
	nt := r.nt
	d := &nt.dm
	f := &FRF{out: nt.m.PlaceName(out.At) + " " + out.Dir.String(), in: nt.m.PlaceName(in.At) + " " + in.Dir.String()}
	wLo, wHi := 2*math.Pi*s.Low, 2*math.Pi*s.High
	modal := 0.0 // static compliance of the modes kept
	for i, v := range r.vecs {
		po := d.pointDisp(oo, ao, v)[co]
		pi := d.pointDisp(oi, ai, v)[ci]
		lam := r.lambda[i]
		if r.rigid[i] || lam < 0 {
			lam = 0
		}
		z := s.Ratio
		if z == 0 {
			z = r.DampingRatio(i).At(s.Damping)
		}
		prod := po * pi
		scale := math.Sqrt(math.Abs(po*po) + math.Abs(pi*pi))
		if lam > 0 && z == 0 && math.Abs(prod) > 1e-12*scale*scale {
			wr := math.Sqrt(lam)
			if wr >= wLo*0.5 && wr <= wHi*2 {
				return nil, fmt.Errorf("springnet: response: mode %d (%.4g Hz) has no damping: no element it strains has a loss factor; "+
					"give the members' materials or the springs and feet a Loss, or set ResponseSettings.Ratio", i+1, hzOf(lam))
			}
		}
		f.lambda = append(f.lambda, lam)
		f.zeta = append(f.zeta, z)
		f.prod = append(f.prod, prod)
		if lam > 0 {
			modal += prod / lam
		}
	}
	f.trunc = Truncation{Modes: len(r.vecs), Band: s.High}
	if n := len(r.lambda); n > 0 {
		f.trunc.Highest = hzOf(r.lambda[n-1])
	}
	var cond error
	switch {
	case s.NoResidual:
		f.trunc.Why = "not asked for"
	default:
		cs, res, err := r.staticCompliance(oo, ao, co, oi, ai, ci)
		if err != nil {
			f.trunc.Why = err.Error()
			break
		}
		f.resid = cs - modal
		f.trunc.Residual = true
		f.trunc.ResidualCompliance = f.resid
		if res > MaxResidual {
			cond = &ConditionError{Case: "static compliance for the residual flexibility", Residual: res}
		}
	}
	n := s.Points
	if n == 0 {
		n = DefaultResponsePoints
	}
	for j := 0; j < n; j++ {
		t := float64(j) / float64(n-1)
		var fr float64
		if s.Linear {
			fr = s.Low + t*(s.High-s.Low)
		} else {
			fr = s.Low * math.Pow(s.High/s.Low, t)
		}
		if j == n-1 {
			fr = s.High
		}
		h := f.At(fr)
		if cmplx.IsNaN(h) || cmplx.IsInf(h) {
			return nil, fmt.Errorf("springnet: response: receptance at %.6g Hz is not finite", fr)
		}
		f.freq = append(f.freq, fr)
		f.h = append(f.h, h)
	}
	return f, cond
}

// staticCompliance returns the static displacement at out under a unit
// force (or moment) at in, and the solve's relative residual. It fails
// when K is singular (rigid-body modes).
func (r *ModeResult) staticCompliance(oo int, ao Vec, co int, oi int, ai Vec, ci int) (float64, float64, error) {
	nt := r.nt
	for i := range r.rigid {
		if r.rigid[i] {
			return 0, 0, errors.New("no residual flexibility: the model has rigid-body or mechanism modes, so it has no static compliance")
		}
	}
	var sv Solver
	if err := sv.factor(nt); err != nil {
		return 0, 0, fmt.Errorf("no residual flexibility: %w", err)
	}
	d := &nt.dm
	u := make([]float64, d.n)
	res := sv.unitLoadSolve(d, oi, ai, ci, make([][6]float64, len(d.ownerRef)), u)
	if !finiteAll(u) {
		return 0, 0, errors.New("no residual flexibility: the static solve failed")
	}
	return d.pointDisp(oo, ao, u)[co], res, nil
}

// At returns the receptance at frequency freq [Hz] (any frequency, not
// only the band's points).
func (f *FRF) At(freq float64) complex128 {
	w := 2 * math.Pi * freq
	h := complex(f.resid, 0)
	for i, lam := range f.lambda {
		wr := math.Sqrt(lam)
		h += complex(f.prod[i], 0) / complex(lam-w*w, 2*f.zeta[i]*wr*w)
	}
	return h
}

// Output and Input describe the probes, e.g. `mount "spindle" UX`.
func (f *FRF) Output() string { return f.out }

// Input describes the input probe.
func (f *FRF) Input() string { return f.in }

// Len returns the number of frequencies.
func (f *FRF) Len() int { return len(f.freq) }

// Frequency returns frequency j of the band [Hz].
func (f *FRF) Frequency(j int) float64 { return f.freq[j] }

// Receptance returns the receptance at frequency j [m/N].
func (f *FRF) Receptance(j int) complex128 { return f.h[j] }

// DynamicStiffness returns 1/H at frequency j [N/m]; a zero receptance
// (an anti-resonance exactly on a point) gives +Inf.
func (f *FRF) DynamicStiffness(j int) complex128 {
	if f.h[j] == 0 {
		return complex(math.Inf(1), 0)
	}
	return 1 / f.h[j]
}

// Magnitude returns |H| at frequency j [m/N].
func (f *FRF) Magnitude(j int) float64 { return cmplx.Abs(f.h[j]) }

// Phase returns arg H at frequency j [rad].
func (f *FRF) Phase(j int) float64 { return cmplx.Phase(f.h[j]) }

// Truncation states the modes included and the residual term.
func (f *FRF) Truncation() Truncation { return f.trunc }

// Peaks returns the local maxima of |H| inside the band, each refined by
// golden-section search between the neighbouring points of the band, in
// ascending frequency. Peaks closer than the spacing of the points may
// merge.
func (f *FRF) Peaks() []Peak {
	var out []Peak
	mag := func(x float64) float64 { return cmplx.Abs(f.At(x)) }
	for j := 1; j+1 < len(f.freq); j++ {
		a, b, c := cmplx.Abs(f.h[j-1]), cmplx.Abs(f.h[j]), cmplx.Abs(f.h[j+1])
		if !(b > a && b >= c) {
			continue
		}
		lo, hi := f.freq[j-1], f.freq[j+1]
		const g = 0.6180339887498949 // (√5 − 1)/2
		x1, x2 := hi-g*(hi-lo), lo+g*(hi-lo)
		f1, f2 := mag(x1), mag(x2)
		for it := 0; it < 80 && hi-lo > 1e-12*hi; it++ {
			if f1 > f2 {
				hi, x2, f2 = x2, x1, f1
				x1 = hi - g*(hi-lo)
				f1 = mag(x1)
			} else {
				lo, x1, f1 = x1, x2, f2
				x2 = lo + g*(hi-lo)
				f2 = mag(x2)
			}
		}
		x := (lo + hi) / 2
		if mag(x) < b {
			x = f.freq[j]
		}
		h := f.At(x)
		near, best := -1, math.Inf(1)
		for i, lam := range f.lambda {
			if dd := math.Abs(hzOf(lam) - x); dd < best {
				near, best = i, dd
			}
		}
		out = append(out, Peak{Frequency: x, Magnitude: cmplx.Abs(h), Phase: cmplx.Phase(h), Mode: near})
	}
	return out
}
