package materials

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestEC2Table31 compares Ecm by the EN 1992-1-1 Table 3.1 formula with
// the Ecm row of that table (from memory). The table rounds to whole GPa,
// so a tolerance of 0.5 GPa (plus round-off) is the most the formula may
// differ from the printed value.
func TestEC2Table31(t *testing.T) {
	const tableRounding = 0.5e9 + 1e3 // Table 3.1 prints Ecm to the nearest GPa
	tests := []struct {
		name     string
		fck, ecm float64 // MPa, GPa: EN 1992-1-1 Table 3.1
	}{
		{"C12/15", 12, 27}, {"C16/20", 16, 29}, {"C20/25", 20, 30}, {"C25/30", 25, 31},
		{"C30/37", 30, 33}, {"C35/45", 35, 34}, {"C40/50", 40, 35}, {"C45/55", 45, 36},
		{"C50/60", 50, 37}, {"C55/67", 55, 38}, {"C60/75", 60, 39}, {"C70/85", 70, 41},
		{"C80/95", 80, 42}, {"C90/105", 90, 44},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m, err := ConcreteEC2(tc.fck * 1e6)
			require.NoError(t, err)
			assert.Equal(t, "concrete "+tc.name, m.Name)
			assert.InDelta(t, tc.ecm*1e9, m.E.Nominal, tableRounding)
			// EN 1992-1-1 3.1.3(2): sandstone −30 %, basalt +20 %.
			assert.InEpsilon(t, 0.7*m.E.Nominal, m.E.Low, 1e-12)
			assert.InEpsilon(t, 1.2*m.E.Nominal, m.E.High, 1e-12)
			assert.Equal(t, tc.fck*1e6, m.Compress, "Compress is fck")
			assert.Equal(t, 0.2, m.Poisson, "EN 1992-1-1 3.1.3(4)")
			assert.NoError(t, m.Check())
		})
	}
	// Hand calculation of the formula itself: C25/30, fcm = 33 MPa,
	// 22·3.3^0.3 = 22·1.43084 = 31.478 GPa.
	assert.InEpsilon(t, 31.478e9, EC2SecantModulus(25e6), 1e-4)
}

func TestConcreteACI(t *testing.T) {
	// ACI 318-19 19.2.2.1(b) US form: f'c = 4000 psi → Ec = 57 000 √4000 psi
	// = 3.605e6 psi (hand calculation). The SI form 4700 √f'c is a rounded
	// conversion of it, so compare within 1 %.
	const formsAgree = 0.01 // 4700 MPa^0.5 vs 57000/√145.04 ≈ 4733 MPa^0.5: 0.7 % apart
	m, err := ConcreteACI(4000 * psiTest)
	require.NoError(t, err)
	assert.InEpsilon(t, 57000*math.Sqrt(4000)*psiTest, m.E.Nominal, formsAgree)
	assert.InEpsilon(t, 3.605e6*psiTest, m.E.Nominal, formsAgree)

	// SI: f'c = 28 MPa → 4700 √28 = 24.87 GPa (hand calculation).
	const fourFigures = 1e-3 // the hand values here are written to 4 significant figures (≤ 2e-4 rounding)
	m, err = ConcreteACI(28e6)
	require.NoError(t, err)
	assert.InEpsilon(t, 24.87e9, m.E.Nominal, fourFigures)
	// ACI 318-19 R19.2.2: measured values 80 % to 120 % of computed (from memory).
	assert.InEpsilon(t, 0.8*m.E.Nominal, m.E.Low, 1e-12) // 1e-12: one multiply, round-off only
	assert.InEpsilon(t, 1.2*m.E.Nominal, m.E.High, 1e-12)
	require.NoError(t, m.Check())

	// ACI 318-19 19.2.2.1(a) at wc = 2320 kg/m³ (145 lb/ft³) and f'c = 28 MPa:
	// 2320^1.5 · 0.043 · √28 = 111 746 · 0.043 · 5.2915 = 25.43 GPa (hand calculation),
	// within 3 % of the normal-weight form (the two forms are separate fits).
	md, err := ConcreteACIDensity(28e6, 2320)
	require.NoError(t, err)
	assert.InEpsilon(t, 25.43e9, md.E.Nominal, fourFigures)
	assert.InEpsilon(t, m.E.Nominal, md.E.Nominal, 0.03) // 3 %: the two ACI fits differ by 2.2 % here (hand calculation above)
	assert.Equal(t, 2320.0, md.Density)
	// Lightweight concrete, wc = 1800 kg/m³: Ec ∝ wc^1.5, so (1800/2320)^1.5 of the above.
	ml, err := ConcreteACIDensity(28e6, 1800)
	require.NoError(t, err)
	assert.InEpsilon(t, md.E.Nominal*math.Pow(1800.0/2320, 1.5), ml.E.Nominal, 1e-12) // round-off only: same formula, other density
}

func TestMasonryTMS402(t *testing.T) {
	// TMS 402-16 4.2.2: E_m = 900 f'm (concrete), 700 f'm (clay); E_v = 0.4 E_m.
	// f'm = 2000 psi → 1.8e6 psi concrete, 1.4e6 psi clay (hand calculation).
	// 1e-9 below: exact products of the clause coefficients, round-off only.
	cm, err := ConcreteMasonry(2000 * psiTest)
	require.NoError(t, err)
	assert.InEpsilon(t, 1.8e6*psiTest, cm.E.Nominal, 1e-9)
	assert.InEpsilon(t, 0.4*1.8e6*psiTest, cm.ShearModulus(Nominal), 1e-9)
	cl, err := ClayMasonry(2000 * psiTest)
	require.NoError(t, err)
	assert.InEpsilon(t, 1.4e6*psiTest, cl.E.Nominal, 1e-9)
	for _, m := range []Material{cm, cl} {
		assert.NoError(t, m.Check())
		assert.Equal(t, 2000*psiTest, m.Compress)
		assert.InEpsilon(t, 0.75*m.E.Nominal, m.E.Low, 1e-12, "trestle's ±25 % rule")
		assert.InEpsilon(t, 1.25*m.E.Nominal, m.E.High, 1e-12, "trestle's ±25 % rule")
	}
}

func TestConstructorsBadInput(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	tests := []struct {
		name string
		fn   func() (Material, error)
		want string // part of the message
	}{
		{"EC2 NaN", func() (Material, error) { return ConcreteEC2(nan) }, "not a finite"},
		{"EC2 Inf", func() (Material, error) { return ConcreteEC2(inf) }, "not a finite"},
		{"EC2 zero", func() (Material, error) { return ConcreteEC2(0) }, "positive"},
		{"EC2 negative", func() (Material, error) { return ConcreteEC2(-25e6) }, "positive"},
		{"EC2 below C12/15", func() (Material, error) { return ConcreteEC2(10e6) }, "Table 3.1"},
		{"EC2 above C90/105", func() (Material, error) { return ConcreteEC2(100e6) }, "Table 3.1"},
		{"EC2 given in MPa by mistake", func() (Material, error) { return ConcreteEC2(25) }, "outside"},
		{"ACI NaN", func() (Material, error) { return ConcreteACI(nan) }, "not a finite"},
		{"ACI below 17 MPa", func() (Material, error) { return ConcreteACI(15e6) }, "19.2.1.1"},
		{"ACI above 100 MPa", func() (Material, error) { return ConcreteACI(120e6) }, "outside"},
		{"ACI density light", func() (Material, error) { return ConcreteACIDensity(28e6, 1000) }, "19.2.2.1(a)"},
		{"ACI density heavy", func() (Material, error) { return ConcreteACIDensity(28e6, 3000) }, "19.2.2.1(a)"},
		{"ACI density NaN", func() (Material, error) { return ConcreteACIDensity(28e6, nan) }, "density"},
		{"ACI density bad f'c", func() (Material, error) { return ConcreteACIDensity(-1, 2300) }, "positive"},
		{"masonry low f'm", func() (Material, error) { return ConcreteMasonry(5e6) }, "TMS 402"},
		{"masonry CMU high f'm", func() (Material, error) { return ConcreteMasonry(35e6) }, "TMS 402"},
		{"masonry clay high f'm", func() (Material, error) { return ClayMasonry(50e6) }, "TMS 402"},
		{"masonry NaN", func() (Material, error) { return ClayMasonry(nan) }, "not a finite"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m, err := tc.fn()
			require.Error(t, err)
			assert.Contains(t, err.Error(), "materials: ")
			assert.Contains(t, err.Error(), tc.want)
			assert.Equal(t, Material{}, m)
		})
	}
	// Clay masonry accepts what concrete masonry rejects (TMS 402 limits differ).
	_, err := ClayMasonry(35e6)
	assert.NoError(t, err)
}
