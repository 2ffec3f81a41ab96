package ringdown

import (
	"fmt"
	"math"
	"slices"

	"gonum.org/v1/gonum/dsp/fourier"
)

// Span is a stretch of time [Start, End] in seconds of record time.
type Span struct{ Start, End float64 }

// Settings tune Reduce. The zero value (or a nil *Settings) reduces the
// dominant mode of the whole record with an automatic fit window.
type Settings struct {
	// Band isolates one mode with a zero-phase band-pass [Hz] before the
	// envelope and the fits; the mode is looked for inside it. Zero: none.
	Band Band
	// Centre, when Band is zero, isolates the band Centre·(1 ± Width) [Hz]
	// and reduces the strongest mode inside it. Zero: none.
	Centre float64
	// Width is the half-width of the band around Centre as a fraction of it.
	// Zero: 0.2.
	Width float64
	// Search is where the dominant mode is looked for when no band is given
	// [Hz]. Zero: from three cycles per record length up to 0.45 × the
	// sample rate.
	Search Band
	// Window fixes the fit window [s, record time]. Zero: automatic, from
	// after the strike and any clipped peaks to where the envelope meets
	// NoiseFactor × the noise floor.
	Window Span
	// NoiseFactor: the automatic fit window ends where the smoothed
	// envelope falls below NoiseFactor × the noise floor. Zero: 3.
	NoiseFactor float64
	// Disagree: methods disagree when the largest damping ratio among them
	// exceeds the smallest by more than this factor. Zero: 1.3.
	Disagree float64
}

// Defaults for Settings and limits of the reduction.
const (
	defaultWidth       = 0.2
	defaultNoiseFactor = 3
	// defaultDisagree: damping ratios from different methods on one good
	// record usually agree within 10–20 % (common practice); 30 % is
	// taken as disagreement.
	defaultDisagree = 1.3
	// maxFitPoints caps the samples used by the time-domain fits; longer
	// windows are strided, keeping at least minFitPerCycle samples a cycle.
	maxFitPoints   = 100_000
	minFitPerCycle = 8
	// fewCycles: fewer cycles than this in the fit window earn a warning.
	fewCycles = 5
	// fewSamples: fewer samples per cycle than this earn a warning.
	fewSamples = 8
	// floorTail: the noise floor is measured over this last fraction of
	// the record.
	floorTail = 0.1
	// secondPeakLevel: another spectral peak above this fraction of the
	// dominant one (−10 dB) earns a warning when no band is given.
	secondPeakLevel = 0.316
	// restrikeRise: an envelope that grows by this factor within two
	// cycles marks a second strike (a free decay only falls).
	restrikeRise = 2
)

// Method names in Result.Methods, in this order.
const (
	MethodPeaks     = "peaks"      // log of interpolated peak amplitudes, linear fit
	MethodHilbert   = "hilbert"    // log of the analytic-signal envelope, linear fit
	MethodSineFit   = "sine fit"   // damped sinusoid, nonlinear least squares
	MethodHalfPower = "half-power" // half-power bandwidth of the windowed spectrum
)

// config is Settings with defaults filled in and checked.
type config struct {
	Settings
	band Band // isolation band actually used; zero: none
}

func (s *Settings) config(rate float64) (config, error) {
	var c config
	if s != nil {
		c.Settings = *s
	}
	for _, v := range []float64{c.Band.Low, c.Band.High, c.Centre, c.Width, c.Search.Low, c.Search.High,
		c.Window.Start, c.Window.End, c.NoiseFactor, c.Disagree} {
		if bad(v) {
			return c, fmt.Errorf("ringdown: settings hold a value that is not finite (%g)", v)
		}
	}
	nyq := rate / 2
	if c.Width == 0 {
		c.Width = defaultWidth
	}
	if c.NoiseFactor == 0 {
		c.NoiseFactor = defaultNoiseFactor
	}
	if c.Disagree == 0 {
		c.Disagree = defaultDisagree
	}
	switch {
	case c.Width <= 0 || c.Width >= 1:
		return c, fmt.Errorf("ringdown: band width %g is not in (0, 1)", c.Width)
	case c.NoiseFactor < 1:
		return c, fmt.Errorf("ringdown: noise factor %g is below 1", c.NoiseFactor)
	case c.Disagree <= 1:
		return c, fmt.Errorf("ringdown: disagreement factor %g is not above 1", c.Disagree)
	case c.Centre < 0 || c.Centre >= nyq:
		return c, fmt.Errorf("ringdown: centre frequency %g Hz is not in (0, %g) Hz (half the sample rate)", c.Centre, nyq)
	}
	c.band = c.Band
	if c.band.IsZero() && c.Centre > 0 {
		c.band = Band{c.Centre * (1 - c.Width), c.Centre * (1 + c.Width)}
	}
	if !c.band.IsZero() {
		if !(c.band.Low >= 0 && c.band.Low < c.band.High && c.band.High <= nyq) {
			return c, fmt.Errorf("ringdown: band %g–%g Hz is not an interval within 0–%g Hz (half the sample rate)", c.band.Low, c.band.High, nyq)
		}
	}
	if !c.Search.IsZero() && !(c.Search.Low >= 0 && c.Search.Low < c.Search.High) {
		return c, fmt.Errorf("ringdown: search band %g–%g Hz is not an interval", c.Search.Low, c.Search.High)
	}
	if c.Window != (Span{}) && !(c.Window.Start < c.Window.End) {
		return c, fmt.Errorf("ringdown: fit window %g–%g s is not an interval", c.Window.Start, c.Window.End)
	}
	return c, nil
}

// Reduce finds the dominant mode of rec (or the mode inside the band given
// in s) and measures its frequency and damping by four methods: peak
// amplitudes, the analytic-signal envelope, a damped-sinusoid fit and the
// half-power bandwidth. The sine fit gives the nominal values; the spread of
// the others enters the uncertainty. A nil s means the default Settings.
//
// Reduce fails if the record or settings are unusable, no spectral peak is
// found, or the ring-down stays above the noise floor for less than two
// cycles; problems short of failure are listed in Result.Warnings.
func Reduce(rec Record, s *Settings) (Result, error) {
	if err := rec.Check(); err != nil {
		return Result{}, err
	}
	cfg, err := s.config(rec.Rate)
	if err != nil {
		return Result{}, err
	}
	r := reduction{rec: rec, cfg: cfg, fs: rec.Rate}
	r.warn = slices.Clone(rec.Notes)
	return r.run()
}

// reduction carries one Reduce through its steps.
type reduction struct {
	rec  Record
	cfg  config
	fs   float64
	warn []string

	scale    float64      // largest |sample|: the record is divided by it
	x        []float64    // detrended record, divided by scale
	y, h     []float64    // isolated signal and its Hilbert transform
	env      []float64    // analytic-signal envelope |y + i h|
	es       []float64    // env smoothed over one period
	f0       float64      // spectral peak frequency [Hz]
	over     spectrum     // overview spectrum (from the strike on)
	strike   int          // index of the largest |x|
	clipped  int          // number of clipped samples
	clipEnd  int          // last clipped sample, −1 if none
	win      [2]int       // fit window, sample indices inclusive
	floorOK  bool         // the envelope reached the noise floor
	floor    float64      // noise floor of the envelope
	halfPts  [2]float64   // half-power frequencies [Hz], zero if not found
	restrike int          // where a second strike begins, −1 if none
	plan     *fourier.FFT // the last real FFT made, for reuse
	phase    []float64    // unwrapped phase over the window, once computed
	ws       workspace    // FFT buffers
}

func (r *reduction) addWarn(format string, a ...any) {
	r.warn = append(r.warn, fmt.Sprintf(format, a...))
}

func (r *reduction) run() (Result, error) {
	n := len(r.rec.Samples)
	// Work on the record divided by its largest magnitude, so that squares
	// neither overflow nor underflow whatever the unit; amplitudes are
	// scaled back only for the picture.
	r.scale = 0
	for _, v := range r.rec.Samples {
		r.scale = math.Max(r.scale, math.Abs(v))
	}
	if r.scale == 0 {
		return Result{}, fmt.Errorf("ringdown: the record is constant (after removing the mean and trend)")
	}
	r.x = make([]float64, n)
	for i, v := range r.rec.Samples {
		r.x[i] = v / r.scale
	}
	r.clipped, r.clipEnd = detectClipping(r.x)
	detrend(r.x)
	r.strike = 0
	for i, v := range r.x {
		if math.Abs(v) > math.Abs(r.x[r.strike]) {
			r.strike = i
		}
	}
	if r.x[r.strike] == 0 {
		return Result{}, fmt.Errorf("ringdown: the record is constant (after removing the mean and trend)")
	}
	if err := r.findMode(); err != nil {
		return Result{}, err
	}
	r.y, r.h = analytic(r.fft(analyticLen(n, r.fs, r.cfg.band)), &r.ws, r.x, r.fs, r.cfg.band)
	r.env = make([]float64, n)
	for i := range r.env {
		// The record is scaled to at most 1: no overflow without Hypot.
		r.env[i] = math.Sqrt(r.y[i]*r.y[i] + r.h[i]*r.h[i])
	}
	if err := r.chooseWindow(); err != nil {
		return Result{}, err
	}
	ms := make([]MethodEstimate, 0, 4)
	pk := r.peaksMethod()
	hb, hfit := r.hilbertMethod()
	sf, sfit := r.sineMethod(hb, hfit)
	hp := r.halfPowerMethod(hfit)
	ms = append(ms, pk, hb, sf, hp)
	return r.combine(ms, sfit)
}

// fft returns a real FFT of length at least n, reusing the last one when it
// is long enough and not more than twice n (its twiddle factors cost as much
// as a transform).
func (r *reduction) fft(n int) *fourier.FFT {
	if r.plan == nil || r.plan.Len() < n || r.plan.Len() > 2*n {
		r.plan = fourier.NewFFT(fastLen(n))
	}
	return r.plan
}

// detrend subtracts from x, in place, its least-squares straight line
// against the sample index (gravity, DC and slow drift). For the index
// i = 0..n−1 the mean is (n−1)/2 and Σ(i − ī)² = n(n²−1)/12.
func detrend(x []float64) {
	n := len(x)
	if n < 2 {
		return
	}
	mt := float64(n-1) / 2
	stt := float64(n) * (float64(n)*float64(n) - 1) / 12
	my := 0.0
	for _, v := range x {
		my += v
	}
	my /= float64(n)
	sty := 0.0
	for i, v := range x {
		sty += (float64(i) - mt) * (v - my)
	}
	b := sty / stt
	for i := range x {
		x[i] -= my + b*(float64(i)-mt)
	}
}

// detectClipping counts samples sitting on the record's extreme values when
// at least three samples (or two in a row) share an extreme: a sensor or
// logger at its range limit. It returns the count and the last such index
// (−1 if none).
func detectClipping(x []float64) (count, last int) {
	lo, hi := x[0], x[0]
	for _, v := range x {
		lo, hi = min(lo, v), max(hi, v)
	}
	if hi == lo {
		return 0, -1
	}
	tol := 1e-9 * (hi - lo)
	last = -1
	for _, rail := range []float64{hi, lo} {
		c, l, run, pair := 0, -1, 0, false
		for i, v := range x {
			if math.Abs(v-rail) <= tol {
				c++
				l = i
				run++
				if run >= 2 {
					pair = true
				}
			} else {
				run = 0
			}
		}
		if c >= 3 || pair {
			count += c
			last = max(last, l)
		}
	}
	return count, last
}

// findMode computes the overview spectrum from the strike on (a half-cosine
// taper over its last tenth) and locates the dominant peak.
func (r *reduction) findMode() error {
	seg := slices.Clone(r.x[r.strike:])
	if len(seg) < MinSamples {
		seg = slices.Clone(r.x)
	}
	m := len(seg)
	nt := max(m/10, 1)
	for i := m - nt; i < m; i++ {
		u := float64(i-(m-nt)) / float64(nt)
		seg[i] *= 0.5 * (1 + math.Cos(math.Pi*u))
	}
	// The same length as the analytic signal's FFT, so one plan serves both.
	r.over = amplitudeSpectrum(r.fft(max(analyticLen(len(r.x), r.fs, r.cfg.band), 1<<16)), &r.ws, seg, r.fs)
	lo, hi := r.searchBand(m)
	klo := int(math.Ceil(lo / r.over.df))
	khi := int(math.Floor(hi / r.over.df))
	k, frac := r.over.peak(klo, khi)
	if k < 0 || r.over.mag[k] == 0 {
		return fmt.Errorf("ringdown: no spectral peak between %.4g and %.4g Hz", lo, hi)
	}
	r.f0 = r.over.freq(frac)
	if r.cfg.band.IsZero() {
		r.checkSecondPeak(k, klo, khi)
	}
	return nil
}

// searchBand returns where the dominant mode is looked for [Hz].
func (r *reduction) searchBand(m int) (lo, hi float64) {
	if !r.cfg.band.IsZero() {
		return r.cfg.band.Low, r.cfg.band.High
	}
	lo, hi = 3*r.fs/float64(m), 0.45*r.fs
	if !r.cfg.Search.IsZero() {
		lo, hi = max(lo, r.cfg.Search.Low), min(hi, r.cfg.Search.High)
	}
	return lo, hi
}

// checkSecondPeak warns when another local maximum of the spectrum, away
// from the dominant peak, comes within 10 dB of it.
func (r *reduction) checkSecondPeak(k, klo, khi int) {
	mag := r.over.mag
	// Skip the dominant peak itself: three half-power widths either side
	// (or three bins).
	away := 3
	if lo, hi, ok := r.over.halfPower(k); ok {
		away = max(away, int(1.5*(hi-lo)/r.over.df))
	}
	limit := secondPeakLevel * mag[k]
	best, bk := 0.0, -1
	for i := max(klo, 1); i <= min(khi, len(mag)-2); i++ {
		if abs(i-k) <= away || mag[i] < limit || mag[i] < mag[i-1] || mag[i] < mag[i+1] {
			continue
		}
		// A shoulder of the dominant peak is no second mode: require a dip
		// below the limit between them.
		a, b := min(i, k), max(i, k)
		dip := slices.Min(mag[a : b+1])
		if dip >= 0.7*mag[i] {
			continue
		}
		if mag[i] > best {
			best, bk = mag[i], i
		}
	}
	if bk >= 0 {
		r.addWarn("another spectral peak at %.4g Hz is within %.0f dB of the mode at %.4g Hz; give a band or centre frequency to reduce the modes one at a time",
			r.over.freq(float64(bk)), -20*math.Log10(best/mag[k]), r.f0)
	}
}

func abs(i int) int {
	if i < 0 {
		return -i
	}
	return i
}

// period returns the samples per cycle of the dominant mode.
func (r *reduction) period() float64 { return r.fs / r.f0 }

// chooseWindow sets the fit window.
func (r *reduction) chooseWindow() error {
	n := len(r.x)
	p := r.period()
	pi := max(1, int(math.Round(p)))
	// Smoothed envelope: moving average over one period.
	es := movingAverage(r.env, pi)
	r.es = es
	// Noise floor: the median envelope over the record's last tenth. Whether
	// that tail is noise or still the decay is settled below, once the
	// window start is known.
	tail := max(int(floorTail*float64(n)), 4*pi)
	tail = min(tail, n/2)
	t0 := n - tail
	r.floor = median(es[t0:])
	edge := int(math.Ceil(2 * p))
	settle := int(math.Ceil(r.cfg.band.settle() * r.fs))
	if r.cfg.Window != (Span{}) {
		s := int(math.Ceil((r.cfg.Window.Start - r.rec.Start) * r.fs))
		e := int(math.Floor((r.cfg.Window.End - r.rec.Start) * r.fs))
		s, e = max(s, 0), min(e, n-1)
		if e-s < int(2*p) {
			return fmt.Errorf("ringdown: fit window %.4g–%.4g s holds fewer than two cycles of the %.4g Hz mode inside the record (%.4g–%.4g s)",
				r.cfg.Window.Start, r.cfg.Window.End, r.f0, r.rec.Start, r.rec.Time(n-1))
		}
		r.win = [2]int{s, e}
		if r.clipEnd >= s {
			r.addWarn("%d clipped samples, the last at %.4g s, inside the given fit window", r.clipped, r.rec.Time(r.clipEnd))
		}
		return nil
	}
	peak := 0
	for i := range es {
		if es[i] > es[peak] {
			peak = i
		}
	}
	start := max(peak+pi, edge, r.strike+settle)
	if r.clipEnd >= 0 {
		start = max(start, r.clipEnd+pi)
		r.addWarn("%d clipped samples (sensor or logger at its range limit): the fit starts after the last one, at %.4g s", r.clipped, r.rec.Time(r.clipEnd))
	}
	end := n - 1 - max(edge, settle)
	// The envelope first falls below NoiseFactor × floor at cross. The tail
	// is the noise floor if the decay from start to cross, carried on to
	// the middle of the tail, ends well below the floor; otherwise the tail
	// is still the ring-down and the window runs to the end of the record.
	thr := r.cfg.NoiseFactor * r.floor
	cross := -1
	for i := start; i <= min(end, t0); i++ {
		if es[i] < thr {
			cross = i
			break
		}
	}
	if cross > start && es[start] > es[cross] && es[cross] > 0 {
		rate := math.Log(es[start]/es[cross]) / float64(cross-start) // per sample
		predicted := es[cross] * math.Exp(-rate*float64(t0+tail/2-cross))
		r.floorOK = predicted < 0.5*r.floor
	}
	if r.floorOK {
		end = cross
	}
	// A second strike: the envelope more than doubles within two cycles,
	// once; the window ends a cycle before the rise begins. Two close modes
	// beating make the envelope rise after every null instead: several
	// rises are reported as beating and leave the window alone.
	r.restrike = -1
	lag := 2 * pi
	var rises []int
	for i := start + lag; i <= end; i++ {
		if es[i] > restrikeRise*es[i-lag] {
			rises = append(rises, i-lag)
			i += 2 * lag // one rise, not many samples of it
		}
	}
	switch {
	case len(rises) == 1:
		r.restrike = rises[0]
		r.addWarn("the envelope jumps at %.4g s (a second strike?): the fit window ends before it", r.rec.Time(rises[0]))
		end = max(start, rises[0]-pi)
	case len(rises) > 1:
		r.addWarn("the envelope rises %d times in the fit window (two close modes beating?): give a band or centre frequency", len(rises))
	}
	if end-start < int(2*p) {
		return fmt.Errorf("ringdown: the %.4g Hz ring-down stays clear of the noise floor (and of clipping) for fewer than two cycles", r.f0)
	}
	r.win = [2]int{start, end}
	return nil
}

// movingAverage returns the centred running mean of x over w samples.
func movingAverage(x []float64, w int) []float64 {
	n := len(x)
	out := make([]float64, n)
	if w <= 1 {
		copy(out, x)
		return out
	}
	pre := make([]float64, n+1)
	for i, v := range x {
		pre[i+1] = pre[i] + v
	}
	h := w / 2
	for i := range out {
		a, b := max(0, i-h), min(n, i-h+w)
		out[i] = (pre[b] - pre[a]) / float64(b-a)
	}
	return out
}

// stride returns the step through the window that keeps at most
// maxFitPoints samples and at least minFitPerCycle per cycle.
func (r *reduction) stride() int {
	m := r.win[1] - r.win[0] + 1
	s := max(1, m/maxFitPoints)
	s = min(s, max(1, int(r.period()/minFitPerCycle)))
	return s
}

// unwrappedPhase returns the unwrapped phase of y + i h over the window
// (computed once).
func (r *reduction) unwrappedPhase() []float64 {
	if r.phase != nil {
		return r.phase
	}
	a, b := r.win[0], r.win[1]
	ph := make([]float64, b-a+1)
	prev := 0.0
	for i := a; i <= b; i++ {
		v := math.Atan2(r.h[i], r.y[i])
		if i > a {
			d := v - prev
			d -= 2 * math.Pi * math.Round(d/(2*math.Pi))
			ph[i-a] = ph[i-a-1] + d
		} else {
			ph[0] = v
		}
		prev = v
	}
	r.phase = ph
	return ph
}

// hilbertMethod fits the logarithm of the envelope (weights env², the
// inverse variance of ln env for additive noise) and the unwrapped phase
// against time over the window.
func (r *reduction) hilbertMethod() (MethodEstimate, hilbertFit) {
	me := MethodEstimate{Method: MethodHilbert}
	a, b := r.win[0], r.win[1]
	st := r.stride()
	ph := r.unwrappedPhase()
	var t, le, w, p []float64
	for i := a; i <= b; i += st {
		if r.env[i] <= 0 {
			continue
		}
		t = append(t, float64(i-a)/r.fs)
		le = append(le, math.Log(r.env[i]))
		w = append(w, r.env[i]*r.env[i])
		p = append(p, ph[i-a])
	}
	ef, ok1 := fitLine(t, le, w)
	pf, ok2 := fitLine(t, p, w)
	if !ok1 || !ok2 || !(pf.b > 0) {
		me.Note = "envelope or phase fit failed"
		return me, hilbertFit{}
	}
	me.set(-ef.b, ef.sb, pf.b, pf.sb, r.cycles(pf.b))
	me.Note = fmt.Sprintf("%d samples", len(t))
	return me, hilbertFit{env: ef, phase: pf}
}

// hilbertFit holds the two line fits of the Hilbert method: ln envelope
// and unwrapped phase against time from the window start.
type hilbertFit struct{ env, phase lineFit }

// cycles returns the cycles in the window at angular frequency om.
func (r *reduction) cycles(om float64) float64 {
	return float64(r.win[1]-r.win[0]) / r.fs * om / (2 * math.Pi)
}

// peaksMethod reads the extrema of the signal where the analytic phase
// crosses multiples of π, refines each by fitting a sinusoid of the mode's
// frequency to the samples within ±1/8 cycle (three samples at least), and
// fits the logarithm of their amplitudes (weights A²)
// and their times against their index.
func (r *reduction) peaksMethod() MethodEstimate {
	me := MethodEstimate{Method: MethodPeaks}
	a, b := r.win[0], r.win[1]
	ph := r.unwrappedPhase()
	w := 2 * math.Pi * r.f0 / r.fs // radians per sample
	p := r.period()
	reach := max(1, int(p/8)) // search for the extremum within ±1/8 cycle of the crossing
	half := max(1, int(p/8))  // half-width of the local sinusoid fit
	var tk, lk, wk, idx []float64
	m0 := math.Ceil(ph[0] / math.Pi)
	j := 0
	for m := m0; ; m++ {
		target := m * math.Pi
		for j < len(ph) && ph[j] < target {
			j++
		}
		if j >= len(ph) {
			break
		}
		k := a + j
		for c := a + j - reach; c <= a+j+reach; c++ {
			if c >= 0 && c < len(r.y) && math.Abs(r.y[c]) > math.Abs(r.y[k]) {
				k = c
			}
		}
		if k-half < a || k+half > b {
			continue
		}
		amp, off, ok := localSine(r.y[k-half:k+half+1], w)
		if !ok || math.Abs(off) > float64(reach)+1 {
			continue
		}
		tk = append(tk, (float64(k-a)+off)/r.fs)
		lk = append(lk, math.Log(amp))
		wk = append(wk, amp*amp)
		idx = append(idx, m)
	}
	if len(tk) < 4 {
		me.Note = fmt.Sprintf("only %d peaks in the window", len(tk))
		return me
	}
	af, ok1 := fitLine(tk, lk, wk)
	tf, ok2 := fitLine(idx, tk, nil) // time per half cycle
	if !ok1 || !ok2 || !(tf.b > 0) {
		me.Note = "peak fit failed"
		return me
	}
	om := math.Pi / tf.b
	som := math.Pi / (tf.b * tf.b) * tf.sb
	me.set(-af.b, af.sb, om, som, float64(len(tk)-1)/2)
	me.Note = fmt.Sprintf("%d peaks and troughs", len(tk))
	return me
}

// sineMethod fits the damped sinusoid to the window, starting from the
// Hilbert estimates.
func (r *reduction) sineMethod(hb MethodEstimate, hf hilbertFit) (MethodEstimate, sineFit) {
	me := MethodEstimate{Method: MethodSineFit}
	if !hb.OK {
		me.Note = "no start values (the envelope fit failed)"
		return me, sineFit{}
	}
	a, b := r.win[0], r.win[1]
	st := r.stride()
	var t, y []float64
	for i := a; i <= b; i += st {
		t = append(t, float64(i-a)/r.fs)
		y = append(y, r.y[i])
	}
	amp := math.Exp(hf.env.a)
	phi0, om := hf.phase.a, hf.phase.b
	// y ≈ A e^(−σt) cos(ωt + φ₀) = e^(−σt)(−A sin φ₀ · sin ωt + A cos φ₀ · cos ωt).
	p0 := [np]float64{-amp * math.Sin(phi0), amp * math.Cos(phi0), -hf.env.b, om, 0, 0}
	f, ok := fitDampedSine(t, y, p0)
	if !ok || !(f.p[2] > 0) || !(f.p[3] > 0) || math.Abs(f.p[3]-om) > 0.1*om {
		me.Note = "the nonlinear fit did not converge to a decaying sinusoid"
		return me, sineFit{}
	}
	me.set(f.p[2], math.Sqrt(f.cov[2][2]), f.p[3], math.Sqrt(f.cov[3][3]), r.cycles(f.p[3]))
	me.Note = fmt.Sprintf("%d iterations, residual %.3g of amplitude", f.iters, f.resid/f.amplitude())
	return me, f
}

// halfPowerMethod measures the half-power bandwidth of the rectangular-
// windowed spectrum of the ring-down from the window start to where the
// envelope meets the noise floor, zero-padded so that the bandwidth spans
// about 20 bins. For the free decay e^(−σt) sin(ω_d t) the spectrum near
// ω_d is |1/(σ + i(ω−ω_d))|², whose half-power points are ω_d ± σ (the
// half-power method: Inman, Engineering Vibration, §2.2); so σ = Δω/2 and
// ζ = σ/√(ω_d² + σ²).
//
// A segment cut short, where the decay has fallen only to r of its start,
// has the spectrum |1 − r e^(−i(ω−ω_d)T)|² / (σ² + (ω−ω_d)²) (the Fourier
// transform of the truncated decay), whose half-power points lie wider, at
// ω_d ± x(r)·σ; the measured half-width is divided by x(r) (truncationWidth),
// with r taken from the envelope fit's decay rate over the segment.
//
// Its uncertainty combines the change when the segment is shortened by a
// quarter (truncation) and the noise: with ε the typical noise amplitude in
// the spectrum relative to the peak (spectrum.noiseRatio), noise moves each
// half-power point by about 2√2·ε half-widths (where the Lorentzian's power
// falls at half a peak per half-width), so u(σ)/σ ≈ 2ε.
func (r *reduction) halfPowerMethod(hf hilbertFit) MethodEstimate {
	me := MethodEstimate{Method: MethodHalfPower}
	a, b := r.win[0], r.win[1]
	sigEst := -hf.env.b
	if !(sigEst > 0) {
		sigEst = 2 * math.Pi * r.f0 * 0.01
	}
	// Zoom: keep ±bw around the mode, sampled at 16·bw or more.
	bw := math.Max(10*sigEst/math.Pi, 0.2*r.f0)
	dec := max(1, int(r.fs/(16*bw)))
	measure := func(a, end int) (sig, om, lo, hi, eps float64, ok bool) {
		x := truncationWidth(math.Exp(-sigEst * float64(end-a) / r.fs))
		sp := zoomSpectrum(r.y[a:end+1], r.h[a:end+1], r.fs, r.f0, dec, sigEst/math.Pi/20)
		k, frac := sp.peak(int(sp.bin(0.8*r.f0)), int(sp.bin(1.2*r.f0))+1)
		if k < 0 {
			return 0, 0, 0, 0, 0, false
		}
		lo, hi, ok = sp.halfPower(k)
		if !ok {
			return 0, 0, 0, 0, 0, false
		}
		eps = sp.noiseRatio(k, frac, (hi-lo)/2, r.f0-bw, r.f0+bw)
		return math.Pi * (hi - lo) / x, 2 * math.Pi * sp.freq(frac), lo, hi, eps, true
	}
	// The segment runs on past the window to where the envelope meets the
	// noise floor, so that the decay is nearly complete (cutting it short
	// widens the peak) without adding more noise than needed.
	last := len(r.y) - 1 - int(math.Ceil(2*r.period()+r.cfg.band.settle()*r.fs))
	if r.restrike >= 0 {
		last = min(last, r.restrike)
	}
	end := max(last, b)
	if r.floorOK {
		for i := b; i <= last; i++ {
			if r.es[i] < r.floor {
				end = i
				break
			}
		}
	}
	sig, om, lo, hi, eps, ok := measure(a, end)
	if !ok {
		me.Note = "no half-power points around the peak"
		return me
	}
	r.halfPts = [2]float64{lo, hi}
	sig2, om2, _, _, _, ok2 := measure(a, a+(end-a)*3/4)
	if !ok2 {
		sig2, om2 = sig, om
	}
	usig := math.Hypot(sig2-sig, 2*eps*sig)
	uom := math.Hypot(om2-om, 2*eps*sig)
	me.set(sig, usig, om, uom, r.cycles(om))
	me.Note = fmt.Sprintf("%d samples, spectrum noise %.2g of peak amplitude", end-a+1, eps)
	if rEnd := math.Exp(-sigEst * float64(end-a) / r.fs); rEnd > 0.2 {
		me.OK = false
		me.Note = fmt.Sprintf("the ring-down falls only to %.0f %% of its starting amplitude: too short for the half-power bandwidth", 100*rEnd)
	}
	return me
}

// truncationWidth returns x, the half-power half-width in units of σ of
// the spectrum of a decay e^(−σt) e^(iω_d t) cut off at time T where it has
// fallen to r = e^(−σT) of its start:
//
//	|1 − r e^(−i x L)|² / (1 + x²) = (1 − r)²/2,  L = σT = −ln r,
//
// the first root above zero. x = 1 for r = 0 (the Lorentzian); x ≈ 1.41
// for r = 0.1. r outside (0, 0.5) gives 1.
func truncationWidth(r float64) float64 {
	if !(r > 1e-12) || r >= 0.5 {
		return 1
	}
	l := -math.Log(r)
	g := func(x float64) float64 {
		s, c := math.Sincos(x * l)
		re, im := 1-r*c, r*s
		return (re*re+im*im)/(1+x*x) - (1-r)*(1-r)/2
	}
	lo, hi := 0.0, 0.0
	for x := 0.01; x < 5; x += 0.01 {
		if g(x) <= 0 {
			lo, hi = x-0.01, x
			break
		}
	}
	if hi == 0 {
		return 1
	}
	for range 50 {
		m := (lo + hi) / 2
		if g(m) > 0 {
			lo = m
		} else {
			hi = m
		}
	}
	return (lo + hi) / 2
}

// localSine fits y[n] = α cos(w(n−c)) + β sin(w(n−c)) by least squares to
// the samples y (c their centre) and returns the amplitude √(α²+β²) and the
// offset of the extremum from the centre in samples. For a lightly damped
// mode the decay over a quarter cycle is negligible; three samples make
// the fit exact for a pure sinusoid at any sampling above Nyquist.
func localSine(y []float64, w float64) (amp, off float64, ok bool) {
	c := (len(y) - 1) / 2
	var scc, sss, scs, syc, sys float64
	for i, v := range y {
		s, co := math.Sincos(w * float64(i-c))
		scc += co * co
		sss += s * s
		scs += co * s
		syc += v * co
		sys += v * s
	}
	det := scc*sss - scs*scs
	if !(math.Abs(det) > 1e-12) {
		return 0, 0, false
	}
	alpha := (syc*sss - sys*scs) / det
	beta := (sys*scc - syc*scs) / det
	amp = math.Hypot(alpha, beta)
	if !(amp > 0) {
		return 0, 0, false
	}
	// α cos x + β sin x = A cos(x − θ), θ = atan2(β, α); for a trough take
	// the maximum of −y, θ + π.
	th := math.Atan2(beta, alpha)
	if y[c] < 0 {
		th = math.Atan2(-beta, -alpha)
	}
	return amp, th / w, true
}
