package modelfile_test

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet/modelfile"
)

func TestParseQuantity(t *testing.T) {
	tests := []struct {
		text, kind, def string
		want            float64
		wantErr         string
	}{
		{"1200 mm", "length", "", 1.2, ""},
		{"1200", "length", "mm", 1.2, ""},
		{"0.8", "length", "", 0.8, ""},
		{"2.5 N/um", "stiffness", "", 2.5e6, ""},
		{"5 kN", "force", "", 5000, ""},
		{"3 ft", "length", "", 0.9144, ""}, // 1 ft = 0.3048 m exactly (international foot, 1959)
		{"5 kN", "length", "", 0, "is not a length"},
		{"tall", "length", "", 0, "does not start with a number"},
		{"1", "lenght", "", 0, `did you mean "length"?`},
		{"1", "length", "kg", 0, "not a unit of length"},
	}
	for _, tc := range tests {
		t.Run(tc.text+" "+tc.kind, func(t *testing.T) {
			v, err := modelfile.ParseQuantity(tc.text, tc.kind, tc.def)
			if tc.wantErr != "" {
				require.Error(t, err)
				assert.Contains(t, err.Error(), tc.wantErr)
				return
			}
			require.NoError(t, err)
			const tol = 1e-15 // a few ulps of numbers near 1
			assert.InDelta(t, tc.want, v, tol*tc.want)
		})
	}
}

func TestParseBracing(t *testing.T) {
	b, err := modelfile.ParseBracing("back:x, left ,front:single")
	require.NoError(t, err)
	assert.Equal(t, []modelfile.Bracing{{Face: modelfile.Back, Pattern: modelfile.Cross}, {Face: modelfile.Left}, {Face: modelfile.Front}}, b)
	_, err = modelfile.ParseBracing("bakc:x")
	require.Error(t, err)
	assert.Contains(t, err.Error(), `did you mean "back"?`)
	_, err = modelfile.ParseBracing("back:z")
	assert.Error(t, err)
}
