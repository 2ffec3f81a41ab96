package materials

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestRange(t *testing.T) {
	r := Range{1, 2, 4}
	assert.Equal(t, 1.0, r.At(Low))
	assert.Equal(t, 2.0, r.At(Nominal))
	assert.Equal(t, 4.0, r.At(High))
	var zero Level
	assert.Equal(t, Nominal, zero, "the zero Level is Nominal")
	assert.Equal(t, Range{2, 4, 8}, r.Scale(2))
	assert.Equal(t, Range{3, 3, 3}, Exact(3))
	assert.Equal(t, [3]Level{Low, Nominal, High}, Levels)
	assert.Equal(t, "low nominal high", Low.String()+" "+Nominal.String()+" "+High.String())

	tests := []struct {
		name string
		r    Range
		ok   bool
	}{
		{"ordered", Range{1, 2, 3}, true},
		{"zero", Range{}, true},
		{"exact", Exact(5), true},
		{"reversed", Range{3, 2, 1}, false},
		{"nominal above high", Range{1, 4, 3}, false},
		{"negative", Range{-1, 0, 1}, false},
		{"NaN", Range{1, math.NaN(), 3}, false},
		{"Inf", Range{1, 2, math.Inf(1)}, false},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			err := tc.r.Check()
			if tc.ok {
				assert.NoError(t, err)
			} else {
				require.Error(t, err)
				assert.True(t, strings.HasPrefix(err.Error(), "materials: "))
			}
		})
	}
}

func goodMaterial() Material {
	return Material{
		Name:    "test steel",
		Kind:    Steel,
		E:       Range{195e9, 200e9, 210e9},
		Poisson: 0.3,
		Density: 7850,
		Yield:   250e6,
		Loss:    Range{1e-4, 3e-4, 1e-3},
	}
}

func TestMaterialCheck(t *testing.T) {
	tests := []struct {
		name string
		edit func(*Material)
		want string // part of the error; "" for no error
	}{
		{"good", func(*Material) {}, ""},
		{"no name", func(m *Material) { m.Name = " " }, "empty name"},
		{"zero E", func(m *Material) { m.E = Range{} }, "must be positive"},
		{"zero E mass only", func(m *Material) { m.E = Range{}; m.MassOnly = true }, ""},
		{"reversed E", func(m *Material) { m.E = Range{2e11, 1e11, 3e11} }, "not ordered"},
		{"NaN E", func(m *Material) { m.E.High = math.NaN() }, "not finite"},
		{"negative G", func(m *Material) { m.G = Range{-1, 1, 2} }, "G: "},
		{"zero low G", func(m *Material) { m.G = Range{0, 1, 2} }, "G "},
		{"Poisson 0.6", func(m *Material) { m.Poisson = 0.6 }, "Poisson"},
		{"Poisson NaN", func(m *Material) { m.Poisson = math.NaN() }, "Poisson"},
		{"zero density", func(m *Material) { m.Density = 0 }, "density"},
		{"Inf density", func(m *Material) { m.Density = math.Inf(1) }, "density"},
		{"negative yield", func(m *Material) { m.Yield = -1 }, "yield"},
		{"NaN compress", func(m *Material) { m.Compress = math.NaN() }, "compressive"},
		{"loss out of order", func(m *Material) { m.Loss = Range{0.1, 0.01, 0.2} }, "loss factor"},
		{"loss 2", func(m *Material) { m.Loss = Range{0.1, 0.5, 2} }, "below 2"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m := goodMaterial()
			tc.edit(&m)
			err := m.Check()
			if tc.want == "" {
				assert.NoError(t, err)
				return
			}
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
			assert.True(t, strings.HasPrefix(err.Error(), "materials: "), err.Error())
			if strings.TrimSpace(m.Name) != "" {
				assert.Contains(t, err.Error(), `"test steel"`, "names the material")
			}
		})
	}
	// Every problem is reported at once.
	m := goodMaterial()
	m.Density, m.Poisson = -1, 2
	err := m.Check()
	require.Error(t, err)
	assert.Contains(t, err.Error(), "density")
	assert.Contains(t, err.Error(), "Poisson")
}

func TestMaterialAtAndShear(t *testing.T) {
	m := goodMaterial()
	// Isotropic elasticity: G = E / (2(1+ν)) (Timoshenko & Goodier, Theory of Elasticity).
	p := m.At(High)
	assert.Equal(t, 210e9, p.E)
	assert.InEpsilon(t, 210e9/2.6, p.G, 1e-12) // 2(1+0.3) = 2.6; 1e-12: one division, round-off only
	assert.Equal(t, 1e-3, p.Loss)
	assert.Equal(t, 7850.0, p.Density)
	assert.Equal(t, 0.3, p.Poisson)
	m.G = Range{70e9, 80e9, 90e9}
	assert.Equal(t, 70e9, m.At(Low).G, "a given G wins over E and ν")
	assert.Equal(t, 250e6, m.CompressiveStrength(), "Compress 0: Yield")
	m.Compress = 30e6
	assert.Equal(t, 30e6, m.CompressiveStrength())
}

func TestCustom(t *testing.T) {
	m := goodMaterial()
	got, err := Custom(m)
	require.NoError(t, err)
	assert.Equal(t, []string{"user supplied"}, got.Refs("all"))

	m.Sources = []Source{{"E", "mill certificate"}}
	got, err = Custom(m)
	require.NoError(t, err)
	got.Sources[0].Ref = "changed"
	assert.Equal(t, "mill certificate", m.Sources[0].Ref, "Custom copies the Sources")
	assert.Equal(t, []string{"mill certificate"}, m.Refs("e"), "Refs ignores case")

	m.E = Range{3, 2, 1}
	_, err = Custom(m)
	assert.ErrorContains(t, err, `materials: "test steel": E`)
}

func TestKindString(t *testing.T) {
	assert.Equal(t, "cast iron", CastIron.String())
	assert.Equal(t, "fill", Fill.String())
	assert.Equal(t, "Kind(99)", Kind(99).String())
}
