package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/trestle-go/trestle/springnet"
)

// Conversion factors to SI, exact by definition (NIST SP 811, Appendix B).
// The inch and the pound-force are springnet's.
const (
	inch  = springnet.Inch       // m
	foot  = 12 * inch            // m
	pound = 0.45359237           // kg (avoirdupois)
	lbf   = springnet.PoundForce // N (pound-force, standard gravity)
	psi   = lbf / (inch * inch)  // Pa
)

// unitSystem says how numbers are printed in text reports. JSON output is
// always SI base units.
type unitSystem int

const (
	siUnits unitSystem = iota // N/µm, mm, µm, N, MPa, kg
	usUnits                   // lbf/in, in, in, lbf, psi, lb
)

// parseUnits reads a --units value.
func parseUnits(s string) (unitSystem, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "si", "metric", "":
		return siUnits, nil
	case "us", "imperial":
		return usUnits, nil
	}
	return 0, fmt.Errorf("--units %q: want si or us", s)
}

// quantity is one printed kind of number: its unit name and the factor
// that turns the SI value into it.
type quantity struct {
	unit   string
	factor float64 // printed = SI value × factor
}

func (u unitSystem) stiffness() quantity {
	if u == usUnits {
		return quantity{"lbf/in", inch / lbf}
	}
	return quantity{"N/µm", 1e-6}
}

func (u unitSystem) length() quantity {
	if u == usUnits {
		return quantity{"in", 1 / inch}
	}
	return quantity{"mm", 1e3}
}

// motion is for small displacements.
func (u unitSystem) motion() quantity {
	if u == usUnits {
		return quantity{"in", 1 / inch}
	}
	return quantity{"µm", 1e6}
}

func (u unitSystem) force() quantity {
	if u == usUnits {
		return quantity{"lbf", 1 / lbf}
	}
	return quantity{"N", 1}
}

func (u unitSystem) moment() quantity {
	if u == usUnits {
		return quantity{"lbf·in", 1 / (lbf * inch)}
	}
	return quantity{"N·m", 1}
}

func (u unitSystem) stress() quantity {
	if u == usUnits {
		return quantity{"psi", 1 / psi}
	}
	return quantity{"MPa", 1e-6}
}

// modulus is for elastic moduli.
func (u unitSystem) modulus() quantity {
	if u == usUnits {
		return quantity{"Msi", 1e-6 / psi}
	}
	return quantity{"GPa", 1e-9}
}

func (u unitSystem) mass() quantity {
	if u == usUnits {
		return quantity{"lb", 1 / pound}
	}
	return quantity{"kg", 1}
}

func (u unitSystem) density() quantity {
	if u == usUnits {
		return quantity{"lb/ft³", foot * foot * foot / pound}
	}
	return quantity{"kg/m³", 1}
}

// area, second moment, modulus of section.
func (u unitSystem) area() quantity {
	if u == usUnits {
		return quantity{"in²", 1 / (inch * inch)}
	}
	return quantity{"mm²", 1e6}
}

func (u unitSystem) inertia() quantity {
	if u == usUnits {
		return quantity{"in⁴", 1 / math.Pow(inch, 4)}
	}
	return quantity{"mm⁴", 1e12}
}

func (u unitSystem) sectionModulus() quantity {
	if u == usUnits {
		return quantity{"in³", 1 / math.Pow(inch, 3)}
	}
	return quantity{"mm³", 1e9}
}

// f formats the SI value v in q's unit (number only).
func (q quantity) f(v float64) string { return num(v * q.factor) }

// fu formats the SI value v in q's unit with the unit.
func (q quantity) fu(v float64) string { return num(v*q.factor) + " " + q.unit }

// num formats v with four significant figures, without an exponent
// between 0.0001 and 10⁷, and never as NaN (printed "—").
func num(v float64) string {
	switch {
	case math.IsNaN(v) || math.IsInf(v, 0):
		return "—"
	case v == 0:
		return "0"
	}
	a := math.Abs(v)
	if a >= 1e-4 && a < 1e7 {
		digits := 3 - int(math.Floor(math.Log10(a)))
		if digits < 0 {
			digits = 0
		}
		s := strconv.FormatFloat(v, 'f', digits, 64)
		if strings.Contains(s, ".") {
			s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
		}
		if s == "-0" {
			s = "0"
		}
		return s
	}
	return strconv.FormatFloat(v, 'e', 3, 64)
}

// pct formats a fraction as a percentage with one decimal.
func pct(v float64) string {
	p := 100 * v
	if math.Abs(p) < 0.05 {
		p = 0 // no "-0.0 %"
	}
	return strconv.FormatFloat(p, 'f', 1, 64) + " %"
}

// fixed formats v with d decimals.
func fixed(v float64, d int) string { return strconv.FormatFloat(v, 'f', d, 64) }
