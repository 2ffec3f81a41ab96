package sections

import (
	"math"
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
