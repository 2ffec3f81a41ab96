package modelfile

import (
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"github.com/trestle-go/trestle/springnet"
)

// dims are the exponents of length, mass and time of a quantity; angles
// are dimensionless (rad = 1).
type dims [3]int8

var (
	dimNone      = dims{0, 0, 0}
	dimLength    = dims{1, 0, 0}
	dimMass      = dims{0, 1, 0}
	dimForce     = dims{1, 1, -2}
	dimMoment    = dims{2, 1, -2}
	dimStress    = dims{-1, 1, -2}
	dimDensity   = dims{-3, 1, 0}
	dimStiffness = dims{0, 1, -2} // N/m
	dimEI        = dims{3, 1, -2} // N·m²
	dimLineMass  = dims{-1, 1, 0} // kg/m
	dimArea      = dims{2, 0, 0}  // m²
	dimInertia   = dims{2, 1, 0}  // kg·m²
	dimAccel     = dims{1, 0, -2} // m/s²
	dimFrequency = dims{0, 0, -1} // Hz
)

// scale converts a number in some unit to SI: si = v·num/den. Metric units
// keep num and den exact powers of ten so that values like 600 mm convert
// to exactly the double nearest 0.6 m.
type scale struct {
	num, den float64
	d        dims
}

func (s scale) toSI(v float64) float64 { return v * s.num / s.den }
func (s scale) fromSI(v float64) float64 {
	return v * s.den / s.num
}

// atoms are the unit symbols a unit expression is built of.
var atoms = map[string]scale{
	"m": {1, 1, dimLength}, "mm": {1, 1000, dimLength}, "cm": {1, 100, dimLength},
	"um": {1, 1e6, dimLength}, "µm": {1, 1e6, dimLength}, "μm": {1, 1e6, dimLength}, "km": {1000, 1, dimLength},
	"in": {254, 10000, dimLength}, "ft": {3048, 10000, dimLength},
	"n": {1, 1, dimForce}, "kn": {1000, 1, dimForce}, "mn": {1e6, 1, dimForce},
	"lbf": {springnet.PoundForce, 1, dimForce}, "kip": {1000 * springnet.PoundForce, 1, dimForce},
	"kgf": {9.80665, 1, dimForce},
	"kg":  {1, 1, dimMass}, "g": {1, 1000, dimMass}, "t": {1000, 1, dimMass}, "lb": {0.45359237, 1, dimMass},
	"s": {1, 1, dims{0, 0, 1}}, "ms": {1, 1000, dims{0, 0, 1}}, "min": {60, 1, dims{0, 0, 1}},
	"pa": {1, 1, dimStress}, "kpa": {1000, 1, dimStress}, "mpa": {1e6, 1, dimStress}, "gpa": {1e9, 1, dimStress},
	// psi and ksi are lbf/in² rounded once (the constant expression
	// springnet.PoundForce/(springnet.Inch²) rounds one ulp higher).
	"psi": {6894.757293168361, 1, dimStress}, "ksi": {6894757.293168361, 1, dimStress},
	"hz": {1, 1, dimFrequency}, "rpm": {1, 60, dimFrequency},
	"rad": {1, 1, dimNone}, "deg": {math.Pi, 180, dimNone},
}

// parseUnit reads a unit expression such as "mm", "N/um", "kN*m/rad",
// "kg/m3", "N·mm²", "m/s^2" (factors joined by * · or a space, one "/"
// starting the denominator, powers as a trailing digit, ^n or ²³).
func parseUnit(u string) (scale, error) {
	s := strings.TrimSpace(u)
	if s == "" {
		return scale{}, fmt.Errorf("no unit")
	}
	s = strings.NewReplacer("·", "*", "²", "2", "³", "3", "^", "", " ", "*").Replace(s)
	out := scale{num: 1, den: 1}
	parts := strings.Split(s, "/")
	if len(parts) > 2 {
		return scale{}, fmt.Errorf("unit %q has more than one \"/\"", u)
	}
	for pi, part := range parts {
		for _, f := range strings.Split(part, "*") {
			if f == "" {
				return scale{}, fmt.Errorf("unit %q has an empty factor", u)
			}
			pow := 1
			if c := f[len(f)-1]; c >= '2' && c <= '4' && len(f) > 1 {
				pow = int(c - '0')
				f = f[:len(f)-1]
			}
			a, ok := atoms[strings.ToLower(f)]
			if !ok {
				return scale{}, fmt.Errorf("unknown unit %q in %q (known: %s)", f, u, strings.Join(atomNames(), ", "))
			}
			if f == "Mn" || f == "mN" {
				return scale{}, fmt.Errorf("unit %q is ambiguous; write MN (meganewton)", f)
			}
			for range pow {
				if pi == 0 {
					out.num *= a.num
					out.den *= a.den
					for i := range out.d {
						out.d[i] += a.d[i]
					}
				} else {
					out.num *= a.den
					out.den *= a.num
					for i := range out.d {
						out.d[i] -= a.d[i]
					}
				}
			}
		}
	}
	return out, nil
}

func atomNames() []string {
	var n []string
	for k := range atoms {
		if k != "µm" && k != "μm" {
			n = append(n, k)
		}
	}
	sort.Strings(n)
	return n
}

// quantity is a kind of value in the file and the unit it takes when
// a plain number is given.
type quantity int

const (
	qNone quantity = iota // dimensionless
	qLength
	qForce
	qMass
	qStress
	qDensity
	qStiffness
	qRotStiffness
	qMoment
	qEI
	qLineMass
	qArea
	qInertia
	qAccel
	qFrequency
	qAngle
	qSpeed
	numQuantities
)

var quantityInfo = [numQuantities]struct {
	key  string // key in [units]
	word string // for messages
	d    dims
	si   string // SI unit written by the writer when nothing else fits
}{
	qNone:         {"", "number", dimNone, ""},
	qLength:       {"length", "length", dimLength, "m"},
	qForce:        {"force", "force", dimForce, "N"},
	qMass:         {"mass", "mass", dimMass, "kg"},
	qStress:       {"stress", "stress or modulus", dimStress, "Pa"},
	qDensity:      {"density", "density", dimDensity, "kg/m3"},
	qStiffness:    {"stiffness", "stiffness (force per length)", dimStiffness, "N/m"},
	qRotStiffness: {"rotational-stiffness", "rotational stiffness (moment per radian)", dimMoment, "N*m/rad"},
	qMoment:       {"moment", "moment", dimMoment, "N*m"},
	qEI:           {"bending-stiffness", "bending stiffness (force times length squared)", dimEI, "N*m2"},
	qLineMass:     {"mass-per-length", "mass per length", dimLineMass, "kg/m"},
	qArea:         {"area", "area", dimArea, "m2"},
	qInertia:      {"mass-inertia", "mass moment of inertia", dimInertia, "kg*m2"},
	qAccel:        {"acceleration", "acceleration", dimAccel, "m/s2"},
	qFrequency:    {"frequency", "frequency", dimFrequency, "Hz"},
	qAngle:        {"angle", "angle", dimNone, "rad"},
	qSpeed:        {"speed", "rotational speed", dimFrequency, "Hz"},
}

// Units are the units of plain numbers in a model file, one per kind of
// quantity, as written in the [units] table ("mm", "N/mm", "MPa"). An
// empty field takes its default (see DefaultUnit). Values written as a
// string with a unit ("1200 mm") ignore these.
type Units struct {
	Length              string // default "m"
	Force               string // default "N"
	Mass                string // default "kg"
	Stress              string // moduli and strengths; default force/length²
	Density             string // default "kg/m3"
	Stiffness           string // springs and feet; default force/length
	RotationalStiffness string // default force·length/rad
	Moment              string // default force·length
	BendingStiffness    string // raw EI and GJ; default force·length²
	MassPerLength       string // default "kg/m"
	Area                string // default length²
	MassInertia         string // default "kg*m2"
	Acceleration        string // default "m/s2"
	Frequency           string // default "Hz"
	Angle               string // default "deg"
	Speed               string // running speeds; default "rpm"
}

func (u *Units) field(q quantity) *string {
	switch q {
	case qLength:
		return &u.Length
	case qForce:
		return &u.Force
	case qMass:
		return &u.Mass
	case qStress:
		return &u.Stress
	case qDensity:
		return &u.Density
	case qStiffness:
		return &u.Stiffness
	case qRotStiffness:
		return &u.RotationalStiffness
	case qMoment:
		return &u.Moment
	case qEI:
		return &u.BendingStiffness
	case qLineMass:
		return &u.MassPerLength
	case qArea:
		return &u.Area
	case qInertia:
		return &u.MassInertia
	case qAccel:
		return &u.Acceleration
	case qFrequency:
		return &u.Frequency
	case qAngle:
		return &u.Angle
	case qSpeed:
		return &u.Speed
	}
	return nil
}

// DefaultUnit returns the unit used for quantity key (a [units] key such as
// "stiffness") when u leaves it empty: built from the length and force
// units where the quantity is made of them (stiffness N/mm when length is
// mm and force N), else a fixed default (kg/m3, kg/m, kg*m2, m/s2, Hz,
// deg, rpm).
func (u Units) DefaultUnit(key string) string {
	for q := quantity(1); q < numQuantities; q++ {
		if quantityInfo[q].key == key {
			return u.unitOf(q)
		}
	}
	return ""
}

// unitOf returns the unit text used for q.
func (u Units) unitOf(q quantity) string {
	if f := u.field(q); f != nil && *f != "" {
		return *f
	}
	l, f := u.Length, u.Force
	if l == "" {
		l = "m"
	}
	if f == "" {
		f = "N"
	}
	switch q {
	case qLength:
		return l
	case qForce:
		return f
	case qMass:
		return "kg"
	case qStress:
		if f == "N" && l == "mm" {
			return "MPa"
		}
		if f == "N" && l == "m" {
			return "Pa"
		}
		return f + "/" + l + "2"
	case qDensity:
		return "kg/m3"
	case qStiffness:
		return f + "/" + l
	case qRotStiffness:
		return f + "*" + l + "/rad"
	case qMoment:
		return f + "*" + l
	case qEI:
		return f + "*" + l + "2"
	case qLineMass:
		return "kg/m"
	case qArea:
		return l + "2"
	case qInertia:
		return "kg*m2"
	case qAccel:
		return "m/s2"
	case qFrequency:
		return "Hz"
	case qAngle:
		return "deg"
	case qSpeed:
		return "rpm"
	}
	return ""
}

// scales resolves every quantity's unit; the errors name the [units] key.
func (u Units) scales() ([numQuantities]scale, []error) {
	var out [numQuantities]scale
	var errs []error
	out[qNone] = scale{1, 1, dimNone}
	for q := quantity(1); q < numQuantities; q++ {
		txt := u.unitOf(q)
		s, err := parseUnit(txt)
		if err == nil && s.d != quantityInfo[q].d {
			err = fmt.Errorf("%q is not a unit of %s", txt, quantityInfo[q].word)
		}
		if err != nil {
			errs = append(errs, fmt.Errorf("units: %s: %v", quantityInfo[q].key, err))
			s = scale{1, 1, quantityInfo[q].d}
		}
		out[q] = s
	}
	return out, errs
}

// parseValue reads "1200 mm", "2.5 N/um", "-5kN" or a bare number string
// (in the default unit s). It checks the dimensions against q.
func parseValue(text string, q quantity, def scale) (float64, error) {
	t := strings.TrimSpace(text)
	i := 0
	for i < len(t) && strings.IndexByte("0123456789+-.eE_", t[i]) >= 0 {
		// stop at a unit starting with e/E only if followed by a letter
		if (t[i] == 'e' || t[i] == 'E') && (i == 0 || i+1 >= len(t) || !strings.ContainsRune("0123456789+-", rune(t[i+1]))) {
			break
		}
		i++
	}
	numTxt, unitTxt := strings.TrimSpace(t[:i]), strings.TrimSpace(t[i:])
	if numTxt == "" {
		return 0, fmt.Errorf("%q does not start with a number", text)
	}
	v, err := strconv.ParseFloat(strings.ReplaceAll(numTxt, "_", ""), 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, fmt.Errorf("%q is not a finite number", numTxt)
	}
	s := def
	if unitTxt != "" {
		var err error
		if s, err = parseUnit(unitTxt); err != nil {
			return 0, err
		}
		if s.d != quantityInfo[q].d {
			return 0, fmt.Errorf("%q is not a %s", text, quantityInfo[q].word)
		}
	}
	si := s.toSI(v)
	if math.IsInf(si, 0) || math.IsNaN(si) {
		return 0, fmt.Errorf("%q is too large once converted to SI units", text)
	}
	return si, nil
}

// formatIn writes the SI value v in the unit s as the shortest decimal
// that reads back to exactly v; ok is false if none does.
func formatIn(v float64, s scale) (string, bool) {
	if v == 0 {
		return "0", true
	}
	x := s.fromSI(v)
	for _, prec := range []int{-1, 15, 16, 17} {
		t := strconv.FormatFloat(x, 'g', prec, 64)
		y, err := strconv.ParseFloat(t, 64)
		if err == nil && s.toSI(y) == v {
			return tidyNumber(t), true
		}
	}
	return "", false
}

// tidyNumber turns Go's "1e+06" into "1e6", which TOML also accepts.
func tidyNumber(t string) string {
	if i := strings.IndexAny(t, "e"); i >= 0 {
		exp := t[i+1:]
		exp = strings.TrimPrefix(exp, "+")
		neg := strings.HasPrefix(exp, "-")
		exp = strings.TrimLeft(strings.TrimPrefix(exp, "-"), "0")
		if exp == "" {
			exp = "0"
		}
		if neg {
			exp = "-" + exp
		}
		mant := t[:i]
		if !strings.Contains(mant, ".") {
			mant += ".0"
		}
		return mant + "e" + exp
	}
	if !strings.Contains(t, ".") && len(strings.TrimPrefix(t, "-")) > 15 {
		return t + ".0" // too long for a TOML integer
	}
	return t // a TOML integer or float; the reader takes both as numbers
}
