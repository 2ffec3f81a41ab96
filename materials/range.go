package materials

import (
	"fmt"
	"math"
)

// Range is a property known to lie in [Low, High]; Nominal is the design value.
// A well-formed Range has 0 <= Low <= Nominal <= High, all finite.
type Range struct{ Low, Nominal, High float64 }

// Level picks one end of a Range. The zero Level is Nominal.
type Level int

// The three levels of a Range.
const (
	Nominal Level = iota
	Low
	High
)

// Levels lists the three levels in the order low, nominal, high.
var Levels = [3]Level{Low, Nominal, High}

// String returns "low", "nominal" or "high".
func (l Level) String() string {
	switch l {
	case Low:
		return "low"
	case High:
		return "high"
	case Nominal:
		return "nominal"
	}
	return fmt.Sprintf("Level(%d)", int(l))
}

// Exact returns a Range with all three values equal to v.
func Exact(v float64) Range { return Range{v, v, v} }

// At returns the value of r at level l.
func (r Range) At(l Level) float64 {
	switch l {
	case Low:
		return r.Low
	case High:
		return r.High
	}
	return r.Nominal
}

// Scale returns r with every value multiplied by f (f >= 0).
func (r Range) Scale(f float64) Range { return Range{r.Low * f, r.Nominal * f, r.High * f} }

// Check reports an error if r is not finite, is negative, or is out of order.
func (r Range) Check() error {
	for _, v := range [3]float64{r.Low, r.Nominal, r.High} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return fmt.Errorf("materials: range %v is not finite", r)
		}
		if v < 0 {
			return fmt.Errorf("materials: range %v has a negative value", r)
		}
	}
	if !(r.Low <= r.Nominal && r.Nominal <= r.High) {
		return fmt.Errorf("materials: range %v is not ordered low <= nominal <= high", r)
	}
	return nil
}
