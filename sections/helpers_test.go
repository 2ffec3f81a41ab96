package sections

import (
	"fmt"
	"math"
	"reflect"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Units for test inputs.
const (
	mm  = 1e-3
	cm  = 1e-2
	in  = 0.0254 // exact
	in2 = in * in
	in3 = in2 * in
	in4 = in2 * in2
	cm2 = cm * cm
	cm4 = cm2 * cm2
)

// Tolerances.
const (
	// exact is for closed forms evaluated in a different order than the
	// code does: a few ulps of the largest term.
	exact = 1e-12
	// table3 is for handbook values printed to 3 significant figures:
	// half a unit in the third digit is at most 0.5 % (for 1.00…); a
	// little more for the table's own rounding of inputs.
	table3 = 0.006
)

// props returns s's properties, failing the test on an error.
func props(t *testing.T, s Section) Props {
	t.Helper()
	p, err := s.Properties()
	require.NoError(t, err)
	return p
}

// relClose asserts |got − want| <= tol·|want| with a message naming what.
func relClose(t *testing.T, what string, want, got, tol float64) {
	t.Helper()
	assert.LessOrEqualf(t, math.Abs(got-want), tol*math.Abs(want), "%s: want %.6g, got %.6g (tol %.3g rel)", what, want, got, tol)
}

// sameValue reports whether a and b are equal, floats to within rel
// relative (walking structs, interfaces, slices and strings), and names
// the first difference.
func sameValue(a, b reflect.Value, rel float64, path string) (bool, string) {
	if a.Kind() != b.Kind() || a.Type() != b.Type() {
		return false, path + ": types differ"
	}
	switch a.Kind() {
	case reflect.Float64:
		x, y := a.Float(), b.Float()
		if x == y || math.Abs(x-y) <= rel*math.Max(math.Abs(x), math.Abs(y)) {
			return true, ""
		}
		return false, fmt.Sprintf("%s: %v != %v", path, x, y)
	case reflect.Interface:
		if a.IsNil() || b.IsNil() {
			return a.IsNil() == b.IsNil(), path + ": nil"
		}
		return sameValue(a.Elem(), b.Elem(), rel, path)
	case reflect.Struct:
		for i := range a.NumField() {
			if ok, why := sameValue(a.Field(i), b.Field(i), rel, path+"."+a.Type().Field(i).Name); !ok {
				return false, why
			}
		}
		return true, ""
	case reflect.Slice:
		if a.Len() != b.Len() {
			return false, path + ": lengths differ"
		}
		for i := range a.Len() {
			if ok, why := sameValue(a.Index(i), b.Index(i), rel, fmt.Sprintf("%s[%d]", path, i)); !ok {
				return false, why
			}
		}
		return true, ""
	}
	if a.Interface() != b.Interface() {
		return false, fmt.Sprintf("%s: %v != %v", path, a.Interface(), b.Interface())
	}
	return true, ""
}

// roundTripTol is the round-trip promise of Spec: lengths come back to
// within specRoundTrip (a few ulps), plus one rounding of the parse.
const roundTripTol = 2 * specRoundTrip

// roundTrip checks that Spec(s) parses back to s (see roundTripTol).
func roundTrip(t *testing.T, s Section) {
	t.Helper()
	spec := Spec(s)
	back, err := Parse(spec)
	require.NoError(t, err, "Spec %q", spec)
	ok, why := sameValue(reflect.ValueOf(s), reflect.ValueOf(back), roundTripTol, "")
	assert.True(t, ok, "Spec %q: %s", spec, why)
}
