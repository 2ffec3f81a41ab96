package sections

import (
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"
)

// lengthUnit is a unit of length a spec may name. Values convert as
// x·mul/div so that millimetres divide by 1000 exactly as written.
type lengthUnit struct {
	name     string
	mul, div float64
}

// inch is the international inch [m], exact by definition (1959).
const inch = 0.0254

// lengthUnits lists the units of length, in the order Spec prefers them.
var lengthUnits = [...]lengthUnit{
	{"mm", 1, 1000},
	{"in", inch, 1},
	{"cm", 1, 100},
	{"m", 1, 1},
	{"ft", 0.3048, 1}, // international foot
}

func findUnit(name string) (lengthUnit, bool) {
	for _, u := range lengthUnits {
		if u.name == name {
			return u, true
		}
	}
	return lengthUnit{}, false
}

func unitNames() string {
	names := make([]string, len(lengthUnits))
	for i, u := range lengthUnits {
		names[i] = u.name
	}
	return strings.Join(names, ", ")
}

// toSI converts x in unit u raised to the power p (1 length, 2 area, 4
// second moment) to SI.
func (u lengthUnit) toSI(x float64, p int) float64 {
	for range p {
		x = x * u.mul / u.div
	}
	return x
}

func (u lengthUnit) fromSI(v float64, p int) float64 {
	for range p {
		v = v * u.div / u.mul
	}
	return v
}

// specRoundTrip is how close a length written in a spec must convert
// back to the value it came from, relative: a few ulps, so that 6 in
// prints as "6" even when 6 × 0.0254 was rounded differently in a
// constant expression than at run time.
const specRoundTrip = 1e-15

// formatIn returns the shortest decimal text x such that parsing it in
// unit u (power p) gives back v to within specRoundTrip, and whether
// there is one.
func (u lengthUnit) formatIn(v float64, p int) (string, bool) {
	x := u.fromSI(v, p)
	if math.IsNaN(x) || math.IsInf(x, 0) || x <= 0 {
		return "", false
	}
	for prec := 1; prec <= 17; prec++ {
		s := strconv.FormatFloat(x, 'g', prec, 64)
		back, err := strconv.ParseFloat(s, 64)
		if err != nil {
			return "", false
		}
		if strings.ContainsAny(s, "e") && back >= 1e-3 && back < 1e7 {
			s = strconv.FormatFloat(back, 'f', -1, 64)
		}
		if math.Abs(u.toSI(back, p)-v) <= specRoundTrip*v {
			return s, true
		}
	}
	return "", false
}

// formatDims writes the lengths vs (SI) in one unit and returns the
// texts and the unit. It takes mm or in, whichever writes all values (to
// within specRoundTrip) in fewer characters, mm on a tie, else the first
// of cm, m, ft that can.
func formatDims(vs []float64) (dims []string, unit lengthUnit) {
	try := func(u lengthUnit) ([]string, int, bool) {
		out := make([]string, len(vs))
		total := 0
		for i, v := range vs {
			s, good := u.formatIn(v, 1)
			if !good {
				return nil, 0, false
			}
			out[i] = s
			total += len(s)
		}
		return out, total, true
	}
	mm, _ := findUnit("mm")
	in, _ := findUnit("in")
	dmm, nmm, okmm := try(mm)
	din, nin, okin := try(in)
	switch {
	case okmm && (!okin || nmm <= nin):
		return dmm, mm
	case okin:
		return din, in
	}
	for _, name := range []string{"cm", "m", "ft"} {
		u, _ := findUnit(name)
		if d, _, ok := try(u); ok {
			return d, u
		}
	}
	// non-finite values: print them plainly in metres
	unit, _ = findUnit("m")
	for _, v := range vs {
		dims = append(dims, strconv.FormatFloat(v, 'g', -1, 64))
	}
	return dims, unit
}

// formatQty formats an SI quantity of length power p with its own unit
// attached (mm2, cm4, m ...), choosing the shortest exact form.
func formatQty(v float64, p int) string {
	best := ""
	for _, name := range []string{"cm", "mm", "in", "m"} {
		u, _ := findUnit(name)
		s, ok := u.formatIn(v, p)
		if !ok {
			continue
		}
		s += u.name
		if p > 1 {
			s += strconv.Itoa(p)
		}
		if best == "" || len(s) < len(best) {
			best = s
		}
	}
	if best == "" {
		best = strconv.FormatFloat(v, 'g', -1, 64) + "m"
		if p > 1 {
			best += strconv.Itoa(p)
		}
	}
	return best
}

// mmText formats an SI length in millimetres for error messages.
func mmText(v float64) string { return strconv.FormatFloat(v*1000, 'g', 6, 64) + " mm" }

var (
	decimalRE  = regexp.MustCompile(`^([0-9]+(\.[0-9]*)?|\.[0-9]+)([eE][-+]?[0-9]+)?$`)
	fractionRE = regexp.MustCompile(`^(([0-9]+)-)?([0-9]+)/([0-9]+)$`)
)

// parseNumber reads a plain positive-or-zero number: a decimal (1.5,
// 2e-3), a fraction (3/16) or a whole number and a fraction (1-1/2).
// NaN, Inf, hex, signs and anything else are errors.
func parseNumber(s string) (float64, error) {
	if s == "" {
		return 0, fmt.Errorf("missing number")
	}
	if s[0] == '-' && len(s) > 1 && (s[1] >= '0' && s[1] <= '9' || s[1] == '.') {
		return 0, fmt.Errorf("size %q is negative", s)
	}
	if decimalRE.MatchString(s) {
		x, err := strconv.ParseFloat(s, 64)
		if err != nil || math.IsInf(x, 0) {
			return 0, fmt.Errorf("number %q is out of range", s)
		}
		return x, nil
	}
	if m := fractionRE.FindStringSubmatch(s); m != nil {
		var whole float64
		if m[2] != "" {
			w, err := strconv.ParseFloat(m[2], 64)
			if err != nil {
				return 0, fmt.Errorf("number %q is out of range", s)
			}
			whole = w
		}
		num, err1 := strconv.ParseFloat(m[3], 64)
		den, err2 := strconv.ParseFloat(m[4], 64)
		if err1 != nil || err2 != nil || math.IsInf(num, 0) || math.IsInf(den, 0) {
			return 0, fmt.Errorf("number %q is out of range", s)
		}
		if den == 0 {
			return 0, fmt.Errorf("fraction %q divides by zero", s)
		}
		return whole + num/den, nil
	}
	return 0, fmt.Errorf("%q is not a number", s)
}

// Limits on any one length, so that every property stays finite and
// well scaled: 1 µm to 100 m covers any stand member with a wide margin.
const (
	minLength = 1e-6 // [m]
	maxLength = 100  // [m]
)

// checkLength reports why v (SI) is not a usable length named what.
func checkLength(what string, v float64) error {
	switch {
	case math.IsNaN(v) || math.IsInf(v, 0):
		return fmt.Errorf("%s is not a finite number", what)
	case v <= 0:
		return fmt.Errorf("%s %s is not positive", what, mmText(v))
	case v < minLength:
		return fmt.Errorf("%s %s is smaller than %s", what, mmText(v), mmText(minLength))
	case v > maxLength:
		return fmt.Errorf("%s %g m is larger than %g m", what, v, float64(maxLength))
	}
	return nil
}

// checkLengths checks name/value pairs in order.
func checkLengths(pairs ...any) error {
	for i := 0; i+1 < len(pairs); i += 2 {
		if err := checkLength(pairs[i].(string), pairs[i+1].(float64)); err != nil {
			return err
		}
	}
	return nil
}
