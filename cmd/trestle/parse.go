package main

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"unicode"
)

// splitNumber splits "1200mm" or "1.2 m" into the number and the unit.
func splitNumber(s string) (float64, string, error) {
	s = strings.TrimSpace(s)
	i := strings.IndexFunc(s, func(r rune) bool {
		return !(unicode.IsDigit(r) || r == '.' || r == '-' || r == '+' || r == 'e' || r == 'E')
	})
	// An 'e' that starts a unit word is not an exponent; there is no such
	// unit among ours, so a plain split is enough.
	numPart, unit := s, ""
	if i >= 0 {
		numPart, unit = strings.TrimSpace(s[:i]), strings.TrimSpace(s[i:])
	}
	v, err := strconv.ParseFloat(numPart, 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, "", fmt.Errorf("%q is not a finite number", s)
	}
	return v, unit, nil
}

// scaleOf looks up a unit among the allowed ones.
func scaleOf(what, unit string, allowed map[string]float64) (float64, error) {
	if f, ok := allowed[strings.ToLower(unit)]; ok {
		return f, nil
	}
	var names []string
	for k := range allowed {
		if k != "" {
			names = append(names, k)
		}
	}
	slices.Sort(names)
	return 0, fmt.Errorf("%s: unknown unit %q (use one of %s)", what, unit, strings.Join(names, ", "))
}

var lengthUnits = map[string]float64{"mm": 1e-3, "cm": 1e-2, "m": 1, "in": inch, "ft": foot}
var stiffnessUnits = map[string]float64{"n/um": 1e6, "n/µm": 1e6, "kn/mm": 1e6, "n/mm": 1e3, "n/m": 1, "lbf/in": lbf / inch}
var massUnits = map[string]float64{"kg": 1, "lb": pound, "t": 1000}
var forceUnits = map[string]float64{"n": 1, "kn": 1e3, "lbf": lbf}

// parseQuantity reads a flag value such as "1200", "1.2 m" or "48in". A
// bare number is in the default unit of u's system (the unit of q).
func parseQuantity(flagName, s string, q quantity, allowed map[string]float64) (float64, error) {
	v, unit, err := splitNumber(s)
	if err != nil {
		return 0, fmt.Errorf("--%s: %v", flagName, err)
	}
	if unit == "" {
		return v / q.factor, nil
	}
	f, err := scaleOf("--"+flagName, unit, allowed)
	if err != nil {
		return 0, err
	}
	return v * f, nil
}

// parseList splits a comma-separated list, dropping empty items.
func parseList(s string) []string {
	var out []string
	for _, x := range strings.Split(s, ",") {
		if x = strings.TrimSpace(x); x != "" {
			out = append(out, x)
		}
	}
	return out
}
