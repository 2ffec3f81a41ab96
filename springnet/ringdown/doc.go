// Package ringdown turns a tap-test record — the free vibration of a stand
// after it is struck, logged by an accelerometer — into the natural
// frequency and damping of its dominant mode (or of the mode in a chosen
// band), in the measures the rest of trestle uses.
//
// # Reading
//
// Read takes a CSV or TSV export from a phone or data logger: tab,
// semicolon, comma or space separated; decimal commas where the separator
// is not a comma; an optional header and units line; time in s, ms, µs or
// ns (from the header, the units line or ReadOptions.TimeUnit), or a sample
// rate instead of a time column; one chosen or automatically picked signal
// column, or the magnitude of three axes. Uneven timestamps are resampled
// onto an even grid with a natural cubic spline; repeated timestamps are
// averaged. Signals in g or mg become m/s². What the reader decided is
// listed in Record.Notes. A Record can also be built directly.
//
// # Model
//
// One mode rings down as the viscously damped free vibration (Inman,
// Engineering Vibration, §1.6)
//
//	x(t) = A e^(−ζωₙt) sin(ω_d t + φ),  ω_d = ωₙ√(1−ζ²),  σ = ζωₙ
//
// Reduce removes the mean and a straight-line trend (gravity, drift), finds
// the dominant spectral peak of the record after the strike (tapered FFT,
// Gaussian peak interpolation), optionally isolates one mode with a
// zero-phase band-pass (Settings.Band or Settings.Centre; Gaussian skirts
// so a strike leaks into the isolated signal only for a short time), and
// forms the analytic signal by FFT (Hilbert transform). The fit window
// starts after the strike, any clipped samples and the band-pass's settling
// time, and ends where the smoothed envelope meets NoiseFactor × the noise
// floor. Four methods then measure σ and ω_d on the window:
//
//   - peaks: peak and trough amplitudes (a local sinusoid fit at each
//     extremum), straight line through their logarithms;
//   - hilbert: straight lines through the log-envelope and the unwrapped
//     phase of the analytic signal;
//   - sine fit: Levenberg–Marquardt fit of the damped sinusoid (plus a
//     straight line) to the samples, started from the Hilbert values; its
//     values are the nominal ones;
//   - half-power: bandwidth of the zoomed spectrum of the decay, corrected
//     for the truncation of the segment.
//
// Each method's estimate carries a standard uncertainty from its fit
// (covariance from the residuals, inflated for serially correlated
// residuals); the reported uncertainty combines the nominal method's with
// the spread between methods. Agreement flags methods that differ by more
// than Settings.Disagree.
//
// # Units and conventions
//
// Time in seconds of record time, frequency in hertz, damping measures
// dimensionless; the signal keeps its unit (m/s² after conversion from g).
// ζ, δ, η, Q and ψ are related by materials.FromRatio (exact forms; η = 2ζ
// at resonance). Result.LossFactor gives η as a materials.Range with
// ±2 standard uncertainties, ready for WithMeasuredLoss or a model element.
//
// # Errors and warnings
//
// Errors start with "ringdown:" and name the input and, where they belong
// to one place, the line and column. Reduce fails when the record or
// settings are unusable, no peak is found, the ring-down stays above the
// noise floor for less than two cycles, or no damped sinusoid fits. Short
// of failure, doubts are sentences in Result.Warnings: few cycles, few
// samples per cycle, clipping, a second strong mode, poor fit, methods that
// disagree. Nothing that is not finite leaves the package.
//
// Pictures (Result.WritePicture) are written to an io.Writer as SVG or PNG;
// formatting numbers for print is left to the caller.
package ringdown
