package modelfile

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestMaterialPlainKeys reads each plain numeric key of a [materials.NAME]
// table, given with its own unit, and checks the SI value. Expected values
// are the unit conversions: 1 MPa = 1e6 Pa, 1 psi = 4.4482216152605 N /
// 0.0254² m² (exact by definition; NIST SP 811), 1 g/cm³ = 1000 kg/m³.
func TestMaterialPlainKeys(t *testing.T) {
	const text = `
[materials.cast]
E = ["90 GPa", "110 GPa", "120 GPa"]
poisson = 0.26
density = "7.2 g/cm3"
strength = "30000 psi"
compressive-strength = "570 MPa"
`
	c, err := Parse("mat.toml", []byte(text))
	require.NoError(t, err)
	require.Len(t, c.Materials, 1)
	m := c.Materials[0].Material
	const psi = 4.4482216152605 / (0.0254 * 0.0254)
	const tol = 1e-12 // relative: one or two roundings in the conversion
	assert.InEpsilon(t, 0.26, m.Poisson, tol)
	assert.InEpsilon(t, 7200, m.Density, tol)
	assert.InEpsilon(t, 30000*psi, m.Yield, tol)
	assert.InEpsilon(t, 570e6, m.Compress, tol)
	assert.InEpsilon(t, 110e9, m.E.Nominal, tol)
}
