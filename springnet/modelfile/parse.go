package modelfile

import (
	"fmt"
	"strings"
)

// ParseQuantity reads a value with an optional unit ("1200 mm", "2.5 N/um",
// "0.8") for the kind of quantity named by a [units] key ("length",
// "force", "stiffness", ...), returning it in SI. A plain number is in
// defaultUnit ("" for the SI unit). For command-line flags and other
// edges that take the same notation as the file.
func ParseQuantity(text, kind, defaultUnit string) (float64, error) {
	q := quantity(-1)
	var keys []string
	for k := quantity(1); k < numQuantities; k++ {
		keys = append(keys, quantityInfo[k].key)
		if quantityInfo[k].key == kind {
			q = k
		}
	}
	if q < 0 {
		return 0, fmt.Errorf("modelfile: unknown kind of quantity %q%s (kinds: %s)", kind, suggest(kind, keys), strings.Join(keys, ", "))
	}
	if defaultUnit == "" {
		defaultUnit = quantityInfo[q].si
	}
	def, err := parseUnit(defaultUnit)
	if err == nil && def.d != quantityInfo[q].d {
		err = fmt.Errorf("%q is not a unit of %s", defaultUnit, quantityInfo[q].word)
	}
	if err != nil {
		return 0, fmt.Errorf("modelfile: default unit: %v", err)
	}
	v, err := parseValue(text, q, def)
	if err != nil {
		return 0, fmt.Errorf("modelfile: %s %q: %v", kind, text, err)
	}
	return v, nil
}

// ParseBracing reads a list of braced faces such as "back:x, left" or
// "front:single,right:cross": each face (front, back, left, right) with an
// optional pattern (single, the default, or x / cross).
func ParseBracing(text string) ([]Bracing, error) {
	var out []Bracing
	faces := map[string]Face{"front": Front, "back": Back, "left": Left, "right": Right}
	for _, item := range strings.Split(text, ",") {
		item = strings.ToLower(strings.TrimSpace(item))
		if item == "" {
			continue
		}
		face, pat, _ := strings.Cut(item, ":")
		f, ok := faces[strings.TrimSpace(face)]
		if !ok {
			return nil, fmt.Errorf("modelfile: bracing %q: unknown face %q%s (faces: front, back, left, right)",
				text, face, suggest(face, []string{"front", "back", "left", "right"}))
		}
		b := Bracing{Face: f}
		switch strings.TrimSpace(pat) {
		case "", "single":
		case "x", "cross":
			b.Pattern = Cross
		default:
			return nil, fmt.Errorf("modelfile: bracing %q: unknown pattern %q (patterns: single, x)", text, pat)
		}
		out = append(out, b)
	}
	return out, nil
}

// String returns "single" or "x".
func (p Pattern) String() string {
	switch p {
	case Single:
		return "single"
	case Cross:
		return "x"
	}
	return fmt.Sprintf("Pattern(%d)", int(p))
}

// String returns "rigid" or "beams".
func (t Top) String() string {
	switch t {
	case RigidTop:
		return "rigid"
	case BeamTop:
		return "beams"
	}
	return fmt.Sprintf("Top(%d)", int(t))
}

// String returns "frame" or "piers".
func (k Kind) String() string {
	switch k {
	case Frame:
		return "frame"
	case Piers:
		return "piers"
	}
	return fmt.Sprintf("Kind(%d)", int(k))
}
