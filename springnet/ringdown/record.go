package ringdown

import (
	"fmt"
	"math"
)

// MinSamples is the fewest samples a Record may hold. Fewer cannot carry even
// two cycles at the lowest useful sampling (about six samples per cycle).
const MinSamples = 16

// StandardGravity is the standard acceleration of gravity [m/s²]
// (CGPM 1901; ISO 80000-3), used to convert records given in g.
const StandardGravity = 9.80665

// Record is an evenly sampled ring-down signal. Read builds one from a CSV or
// TSV file; a caller with samples in memory builds one with a literal.
type Record struct {
	Start   float64   // time of the first sample [s]
	Rate    float64   // sample rate [Hz]
	Samples []float64 // signal values, evenly spaced [Unit]
	Unit    string    // unit of Samples: "m/s²" when converted from g, else as in the file; "" unknown
	Column  string    // which column (or columns) the samples came from
	Notes   []string  // what the reader decided or repaired: guessed units, resampling, duplicates
}

// Len returns the number of samples.
func (r Record) Len() int { return len(r.Samples) }

// Duration returns the time spanned by the samples, (Len−1)/Rate [s].
func (r Record) Duration() float64 {
	if len(r.Samples) < 2 || !(r.Rate > 0) {
		return 0
	}
	return float64(len(r.Samples)-1) / r.Rate
}

// Time returns the time of sample i [s].
func (r Record) Time(i int) float64 { return r.Start + float64(i)/r.Rate }

// Check reports an error if r cannot be reduced: too few samples, a sample
// rate that is not positive and finite, a start time or sample that is not
// finite.
func (r Record) Check() error {
	if !(r.Rate > 0) || math.IsInf(r.Rate, 0) {
		return fmt.Errorf("ringdown: sample rate %g Hz is not positive and finite", r.Rate)
	}
	if math.IsNaN(r.Start) || math.IsInf(r.Start, 0) {
		return fmt.Errorf("ringdown: start time %g s is not finite", r.Start)
	}
	if len(r.Samples) < MinSamples {
		return fmt.Errorf("ringdown: only %d samples; need at least %d", len(r.Samples), MinSamples)
	}
	for i, v := range r.Samples {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return fmt.Errorf("ringdown: sample %d is %g, not a finite number", i, v)
		}
	}
	return nil
}
