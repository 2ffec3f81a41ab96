package modelfile

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
)

// reader holds the state of one Read.
type reader struct {
	errs *errList
	pos  *positions
	sc   [numQuantities]scale
}

// tab is one TOML table being read: its keys, where it is, and what to
// call it in messages.
type tab struct {
	r    *reader
	path string // resolved path for line look-up: "beam#2"
	what string // for messages: `beam "leg"`, "[units]"
	m    map[string]any
}

func (t *tab) line(key string) int {
	if key == "" {
		return t.r.pos.at(t.path)
	}
	return t.r.pos.at(t.path + "." + key)
}

func (t *tab) errf(key, format string, args ...any) {
	msg := fmt.Sprintf(format, args...)
	if key != "" {
		msg = fmt.Sprintf("%s: %s: %s", t.what, key, msg)
	} else {
		msg = t.what + ": " + msg
	}
	t.r.errs.add(t.line(key), "%s", msg)
}

// allow reports keys of t that are not in known, suggesting the closest.
func (t *tab) allow(known ...string) {
	keys := make([]string, 0, len(t.m))
	for k := range t.m {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		found := false
		for _, n := range known {
			if k == n {
				found = true
				break
			}
		}
		if !found {
			t.r.errs.add(t.line(k), "%s: unknown key %q%s (keys here: %s)", t.what, k, suggest(k, known), strings.Join(known, ", "))
		}
	}
}

func (t *tab) has(key string) bool { _, ok := t.m[key]; return ok }

func (t *tab) require(keys ...string) bool {
	ok := true
	for _, k := range keys {
		if !t.has(k) {
			t.errf("", "needs %q", k)
			ok = false
		}
	}
	return ok
}

// str returns the string value of key; "" and false when absent or wrong.
func (t *tab) str(key string) (string, bool) {
	v, ok := t.m[key]
	if !ok {
		return "", false
	}
	s, ok := v.(string)
	if !ok {
		t.errf(key, "must be a text in quotes, not %s", typeWord(v))
		return "", false
	}
	return s, true
}

func (t *tab) boolean(key string) (bool, bool) {
	v, ok := t.m[key]
	if !ok {
		return false, false
	}
	b, ok := v.(bool)
	if !ok {
		t.errf(key, "must be true or false, not %s", typeWord(v))
	}
	return b, ok
}

// strs returns a text or a list of texts.
func (t *tab) strs(key string) ([]string, bool) {
	v, ok := t.m[key]
	if !ok {
		return nil, false
	}
	switch v := v.(type) {
	case string:
		return []string{v}, true
	case []any:
		out := make([]string, 0, len(v))
		for i, x := range v {
			s, ok := x.(string)
			if !ok {
				t.errf(key, "item %d must be a name in quotes, not %s", i+1, typeWord(x))
				return nil, false
			}
			out = append(out, s)
		}
		return out, true
	}
	t.errf(key, "must be a name or a list of names, not %s", typeWord(v))
	return nil, false
}

// num reads a number in quantity q: a TOML number in the file's unit or a
// text with its own unit.
func (t *tab) num(key string, q quantity) (float64, bool) {
	v, ok := t.m[key]
	if !ok {
		return 0, false
	}
	x, err := t.r.value(v, q)
	if err != nil {
		t.errf(key, "%v", err)
		return 0, false
	}
	return x, true
}

func (t *tab) positive(key string, q quantity) (float64, bool) {
	x, ok := t.num(key, q)
	if ok && x <= 0 {
		t.errf(key, "must be positive")
		return 0, false
	}
	return x, ok
}

func (t *tab) integer(key string, lo, hi int64) (int, bool) {
	v, ok := t.m[key]
	if !ok {
		return 0, false
	}
	n, ok := v.(int64)
	if !ok || n < lo || n > hi {
		t.errf(key, "must be a whole number from %d to %d", lo, hi)
		return 0, false
	}
	return int(n), true
}

func (r *reader) value(v any, q quantity) (float64, error) {
	x, err := r.rawValue(v, q)
	if err == nil && (math.IsInf(x, 0) || math.IsNaN(x)) {
		return 0, fmt.Errorf("%v is too large once converted to SI units", v)
	}
	return x, err
}

func (r *reader) rawValue(v any, q quantity) (float64, error) {
	switch v := v.(type) {
	case int64:
		return r.sc[q].toSI(float64(v)), nil
	case float64:
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return 0, fmt.Errorf("%v is not a finite number", v)
		}
		return r.sc[q].toSI(v), nil
	case string:
		return parseValue(v, q, r.sc[q])
	}
	return 0, fmt.Errorf("must be a %s (a number, or a text with a unit like %q), not %s", quantityInfo[q].word, exampleOf(q), typeWord(v))
}

func exampleOf(q quantity) string {
	switch q {
	case qLength:
		return "1200 mm"
	case qForce:
		return "5 kN"
	case qStiffness:
		return "2.5 N/um"
	case qStress:
		return "200 GPa"
	case qMass:
		return "350 kg"
	}
	return "1.5"
}

// vec reads [x, y, z] in quantity q.
func (t *tab) vec(key string, q quantity) (springnet.Vec, bool) {
	v, ok := t.m[key]
	if !ok {
		return springnet.Vec{}, false
	}
	out, err := t.r.vecValue(v, q)
	if err != nil {
		t.errf(key, "%v", err)
		return springnet.Vec{}, false
	}
	return out, true
}

func (r *reader) vecValue(v any, q quantity) (springnet.Vec, error) {
	a, ok := v.([]any)
	if !ok || len(a) != 3 {
		return springnet.Vec{}, fmt.Errorf("must be three numbers [x, y, z], not %s", typeWord(v))
	}
	var out [3]float64
	for i, x := range a {
		f, err := r.value(x, q)
		if err != nil {
			return springnet.Vec{}, fmt.Errorf("%s: %v", "xyz"[i:i+1], err)
		}
		out[i] = f
	}
	return springnet.Vec{X: out[0], Y: out[1], Z: out[2]}, nil
}

// rng reads a range: one value (exact), [low, nominal, high], or
// {low = , nominal = , high = }.
func (t *tab) rng(key string, q quantity) (materials.Range, bool) {
	v, ok := t.m[key]
	if !ok {
		return materials.Range{}, false
	}
	var vals [3]float64
	switch v := v.(type) {
	case []any:
		if len(v) != 3 {
			t.errf(key, "a range is [low, nominal, high]; got %d values", len(v))
			return materials.Range{}, false
		}
		for i, x := range v {
			f, err := t.r.value(x, q)
			if err != nil {
				t.errf(key, "%v", err)
				return materials.Range{}, false
			}
			vals[i] = f
		}
	case map[string]any:
		sub := &tab{r: t.r, path: t.path + "." + key, what: t.what + ": " + key, m: v}
		sub.allow("low", "nominal", "high")
		if !sub.require("low", "nominal", "high") {
			return materials.Range{}, false
		}
		var ok1, ok2, ok3 bool
		vals[0], ok1 = sub.num("low", q)
		vals[1], ok2 = sub.num("nominal", q)
		vals[2], ok3 = sub.num("high", q)
		if !ok1 || !ok2 || !ok3 {
			return materials.Range{}, false
		}
	default:
		f, err := t.r.value(v, q)
		if err != nil {
			t.errf(key, "%v", err)
			return materials.Range{}, false
		}
		return materials.Exact(f), true
	}
	r := materials.Range{Low: vals[0], Nominal: vals[1], High: vals[2]}
	if !(r.Low <= r.Nominal && r.Nominal <= r.High) || r.Low < 0 {
		t.errf(key, "a range must be [low, nominal, high] with 0 <= low <= nominal <= high")
		return materials.Range{}, false
	}
	return r, true
}

// sub returns the inline or nested table at key.
func (t *tab) sub(key string) (*tab, bool) {
	v, ok := t.m[key]
	if !ok {
		return nil, false
	}
	m, ok := v.(map[string]any)
	if !ok {
		t.errf(key, "must be a table like { x = 1, z = 2 }, not %s", typeWord(v))
		return nil, false
	}
	return &tab{r: t.r, path: t.path + "." + key, what: t.what + ": " + key, m: m}, true
}

var dofWords = map[string]springnet.DOF{
	"x": springnet.UX, "y": springnet.UY, "z": springnet.UZ,
	"rx": springnet.RX, "ry": springnet.RY, "rz": springnet.RZ,
	"all": springnet.AllDOF, "translations": springnet.Translations, "rotations": springnet.Rotations,
}

func dofWordList() []string {
	return []string{"x", "y", "z", "rx", "ry", "rz", "all", "translations", "rotations"}
}

// dof reads a direction set: "all", "z" or a list of direction words.
func (t *tab) dof(key string) (springnet.DOF, bool) {
	words, ok := t.strs(key)
	if !ok {
		return 0, false
	}
	var d springnet.DOF
	for _, w := range words {
		x, ok := dofWords[strings.ToLower(strings.TrimSpace(w))]
		if !ok {
			t.errf(key, "unknown direction %q%s (directions: %s)", w, suggest(w, dofWordList()), strings.Join(dofWordList(), ", "))
			return 0, false
		}
		d |= x
	}
	if d == 0 {
		t.errf(key, "names no direction")
		return 0, false
	}
	return d, true
}

// release reads a beam end release: "pin", "twist", "all" or a list of
// "rx", "ry", "rz" (local axes).
func (t *tab) release(key string) (springnet.Release, bool) {
	words, ok := t.strs(key)
	if !ok {
		return 0, false
	}
	known := map[string]springnet.Release{
		"pin": springnet.ReleasePin, "twist": springnet.ReleaseRX, "rx": springnet.ReleaseRX,
		"ry": springnet.ReleaseRY, "rz": springnet.ReleaseRZ,
		"all": springnet.ReleasePin | springnet.ReleaseRX,
	}
	names := []string{"pin", "twist", "all", "rx", "ry", "rz"}
	var r springnet.Release
	for _, w := range words {
		x, ok := known[strings.ToLower(strings.TrimSpace(w))]
		if !ok {
			t.errf(key, "unknown release %q%s (releases: %s)", w, suggest(w, names), strings.Join(names, ", "))
			return 0, false
		}
		r |= x
	}
	return r, true
}

// stiffness6 reads { x = , y = , z = , rx = , ry = , rz = , horizontal = }.
func (t *tab) stiffness6(key string) (springnet.Stiffness6, bool) {
	s, ok := t.sub(key)
	if !ok {
		return springnet.Stiffness6{}, false
	}
	s.allow("x", "y", "z", "rx", "ry", "rz", "horizontal")
	var k springnet.Stiffness6
	good := true
	get := func(key string, q quantity, dst ...*float64) {
		if v, ok := s.num(key, q); ok {
			if v < 0 {
				s.errf(key, "must not be negative")
				good = false
			}
			for _, d := range dst {
				*d = v
			}
		} else if s.has(key) {
			good = false
		}
	}
	get("horizontal", qStiffness, &k.X, &k.Y)
	get("x", qStiffness, &k.X)
	get("y", qStiffness, &k.Y)
	get("z", qStiffness, &k.Z)
	get("rx", qRotStiffness, &k.RX)
	get("ry", qRotStiffness, &k.RY)
	get("rz", qRotStiffness, &k.RZ)
	return k, good
}

func typeWord(v any) string {
	switch v := v.(type) {
	case string:
		return fmt.Sprintf("the text %q", truncate(v, 40))
	case int64, float64:
		return fmt.Sprintf("the number %v", v)
	case bool:
		return fmt.Sprintf("%v", v)
	case []any:
		return fmt.Sprintf("a list of %d", len(v))
	case []map[string]any:
		return "a list of tables"
	case map[string]any:
		return "a table"
	}
	return fmt.Sprintf("a %T", v)
}

func truncate(s string, n int) string {
	r := []rune(s)
	if len(r) <= n {
		return s
	}
	return string(r[:n]) + "…"
}
