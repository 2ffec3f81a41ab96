package springnet_test

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// energyTol: energy shares and loss factors are ratios of sums of a few
// products; only round-off separates them from the closed forms.
const energyTol = 1e-10

// Two springs in series carry the same force F, so each stores
// Uᵢ = F²/(2kᵢ). The modal strain energy method weighs the loss factors
// by energy (Ungar & Kerwin 1962):
//
//	η = Σ ηᵢUᵢ / Σ Uᵢ = (η₁/k₁ + η₂/k₂) / (1/k₁ + 1/k₂)
//
// and the single mode has ω² = k/m with k = k₁k₂/(k₁ + k₂) (springs in
// series; the middle node is massless).
func TestDampingSpringsInSeries(t *testing.T) {
	for _, tc := range []struct {
		name   string
		k1, k2 float64
		e1, e2 materials.Range
	}{
		{"stiff pad on soft mount", 5e8, 2e7, materials.Range{Low: 0.01, Nominal: 0.02, High: 0.03}, materials.Range{Low: 0.1, Nominal: 0.15, High: 0.25}},
		{"equal stiffness", 1e7, 1e7, materials.Exact(0.002), materials.Exact(0.2)},
	} {
		t.Run(tc.name, func(t *testing.T) {
			const kg = 250.0
			var m springnet.Model
			a := m.AddNode("ground", springnet.Vec{})
			b := m.AddNode("mid", springnet.Vec{X: 0.1})
			c := m.AddNode("top", springnet.Vec{X: 0.2})
			m.Fix(a, springnet.AllDOF)
			m.Fix(b, springnet.UY|springnet.UZ)
			m.Fix(c, springnet.UY|springnet.UZ)
			s1 := m.AddSpring(a, b, springnet.Spring{K: springnet.Stiffness6{X: tc.k1}, Loss: tc.e1})
			s2 := m.AddSpring(b, c, springnet.Spring{K: springnet.Stiffness6{X: tc.k2}, Loss: tc.e2})
			m.AddMass(c, springnet.Mass{Kg: kg})
			r, err := springnet.Modes(&m, &springnet.ModeSettings{Count: 1})
			require.NoError(t, err)
			require.Equal(t, 1, r.NumModes())
			k := tc.k1 * tc.k2 / (tc.k1 + tc.k2)
			assert.InEpsilon(t, math.Sqrt(k/kg)/(2*math.Pi), r.Frequency(0), modeTight)
			c1, c2 := 1/tc.k1, 1/tc.k2
			eta := func(e1, e2 float64) float64 { return (e1*c1 + e2*c2) / (c1 + c2) }
			got := r.LossFactor(0)
			assert.InEpsilon(t, eta(tc.e1.Low, tc.e2.Low), got.Low, energyTol)
			assert.InEpsilon(t, eta(tc.e1.Nominal, tc.e2.Nominal), got.Nominal, energyTol)
			assert.InEpsilon(t, eta(tc.e1.High, tc.e2.High), got.High, energyTol)
			assert.InEpsilon(t, eta(tc.e1.Nominal, tc.e2.Nominal)/2, r.DampingRatio(0).Nominal, energyTol)
			assert.InEpsilon(t, c1/(c1+c2), r.ElementEnergy(0, s1), energyTol)
			assert.InEpsilon(t, c2/(c1+c2), r.ElementEnergy(0, s2), energyTol)
		})
	}
}

// A composite (filled tube) cantilever bending in one plane: both parts
// share the curvature, so the strain energy splits as Eₚ·Iyₚ / Σ E·Iy
// (transformed section, Gere & Goodno, Mechanics of Materials, §6.2), and
// the modal loss factor is the same weighted mean of the parts' loss
// factors. A dry-sand fill adds mass only: all energy is in the shell.
func TestDampingCompositeSplit(t *testing.T) {
	steel := modeSteel()
	grout := materials.Material{Name: "test grout", E: materials.Exact(30e9), Poisson: 0.2, Density: 2300,
		Loss: materials.Range{Low: 0.01, Nominal: 0.02, High: 0.04}}
	sand := materials.Material{Name: "test sand", Density: 1600, MassOnly: true, Loss: materials.Exact(0.1)}
	tube := sections.RoundTube{D: 0.1143, T: 0.005}
	for _, tc := range []struct {
		name string
		fill materials.Material
	}{
		{"grout", grout},
		{"sand", sand},
	} {
		t.Run(tc.name, func(t *testing.T) {
			sec := sections.Filled{Tube: tube, Shell: steel, Fill: tc.fill}
			parts, err := sec.Parts()
			require.NoError(t, err)
			m, _ := cantileverModel(10, 1.5, "clamped-free", sec)
			r, err := springnet.Modes(m, &springnet.ModeSettings{Count: 1})
			require.NoError(t, err)
			// Transformed section for the frequency (Blevins, Table 8-1,
			// cantilever λ₁ = 1.8751): EI = Σ Eₚ·Iₚ over the parts with
			// stiffness, m = Σ ρₚ·Aₚ over all parts (sand adds mass only).
			ei := steel.E.Nominal * parts[0].Iy
			if !tc.fill.MassOnly {
				ei += tc.fill.E.Nominal * parts[1].Iy
			}
			lineMass := steel.Density*parts[0].A + tc.fill.Density*parts[1].A
			f1 := 1.87510407 * 1.87510407 / (2 * math.Pi * 1.5 * 1.5) * math.Sqrt(ei/lineMass)
			assert.InEpsilon(t, f1, r.Frequency(0), beamFE)
			us := steel.E.Nominal * parts[0].Iy
			uc := 0.0
			if !tc.fill.MassOnly {
				uc = tc.fill.E.Nominal * parts[1].Iy
			}
			share := us / (us + uc)
			byName := map[string]springnet.EnergyShare{}
			for _, sh := range r.MaterialEnergy(0) {
				byName[sh.Group] = sh
			}
			assert.InEpsilon(t, share, byName["test steel"].Share, energyTol)
			want := func(l materials.Level) float64 {
				if tc.fill.MassOnly {
					return steel.Loss.At(l)
				}
				return share*steel.Loss.At(l) + (1-share)*tc.fill.Loss.At(l)
			}
			got := r.LossFactor(0)
			assert.InEpsilon(t, want(materials.Low), got.Low, energyTol)
			assert.InEpsilon(t, want(materials.Nominal), got.Nominal, energyTol)
			assert.InEpsilon(t, want(materials.High), got.High, energyTol)
			if tc.fill.MassOnly {
				assert.Len(t, byName, 1, "sand stores no strain energy")
			}
		})
	}
}

// A measured loss factor on the element replaces the material's.
func TestDampingMeasuredLossOverrides(t *testing.T) {
	measured := materials.Range{Low: 0.004, Nominal: 0.006, High: 0.01}
	var mm springnet.Model
	a := mm.AddNode("", springnet.Vec{})
	mm.Fix(a, springnet.AllDOF)
	prev := a
	for i := 1; i <= 8; i++ {
		n := mm.AddNode("", springnet.Vec{X: float64(i) / 8})
		mm.Fix(n, springnet.UY|springnet.RX|springnet.RZ)
		mm.AddBeam(prev, n, springnet.Beam{Material: modeSteel(), Section: sections.RoundTube{D: 0.05, T: 0.003}, Loss: measured})
		prev = n
	}
	r, err := springnet.Modes(&mm, &springnet.ModeSettings{Count: 2})
	require.NoError(t, err)
	for i := 0; i < 2; i++ {
		assert.InEpsilon(t, measured.Nominal, r.LossFactor(i).Nominal, energyTol)
		assert.InEpsilon(t, measured.Low, r.LossFactor(i).Low, energyTol)
	}
	assert.Equal(t, measured, mm.LossFactor(0))
}

// Compliance sensitivity: for a load case C = fᵀu = 2U and, for a
// material whose moduli are scaled by s, dC/ds = −2·U_k (the energy stored
// in that material; Haftka & Gürdal, Elements of Structural Optimization,
// sensitivity of the compliance, from memory). Checked against a central finite difference of
// C over the modulus of one material.
func TestComplianceSensitivity(t *testing.T) {
	const fx, fz = 800.0, -1500.0
	build := func(eLeg, eBrace float64) (*springnet.Model, springnet.NodeID) {
		leg := materials.Material{Name: "leg steel", E: materials.Exact(eLeg), Poisson: 0.3, Density: 7850}
		brace := materials.Material{Name: "brace alu", E: materials.Exact(eBrace), Poisson: 0.33, Density: 2700}
		var m springnet.Model
		b0 := m.AddNode("b0", springnet.Vec{})
		b1 := m.AddNode("b1", springnet.Vec{X: 1})
		t0 := m.AddNode("t0", springnet.Vec{Z: 0.9})
		t1 := m.AddNode("t1", springnet.Vec{X: 1, Z: 0.9})
		m.Fix(b0, springnet.AllDOF)
		m.Fix(b1, springnet.AllDOF)
		sec := sections.RoundTube{D: 0.0483, T: 0.0032}
		m.AddBeam(b0, t0, springnet.Beam{Material: leg, Section: sec})
		m.AddBeam(b1, t1, springnet.Beam{Material: leg, Section: sec})
		m.AddBeam(t0, t1, springnet.Beam{Material: leg, Section: sec})
		m.AddBar(b0, t1, springnet.Bar{Material: brace, Section: sec})
		m.AddFoot(t1, springnet.Foot{K: springnet.Stiffness6{Y: 1e6, RX: 1e5, RZ: 1e5}})
		m.AddFoot(t0, springnet.Foot{K: springnet.Stiffness6{Y: 1e6, RX: 1e5, RZ: 1e5}})
		m.AddLoad(t0, springnet.Load{FX: fx, FZ: fz})
		return &m, t0
	}
	const eL, eB = 200e9, 70e9
	m, _ := build(eL, eB)
	sens, err := springnet.ComplianceSensitivity(m, springnet.DefaultCase, materials.Nominal)
	require.NoError(t, err)
	compliance := func(eLeg, eBrace float64) float64 {
		mm, t0 := build(eLeg, eBrace)
		res, err := springnet.Static(mm, nil)
		require.NoError(t, err)
		u := res.Case(springnet.DefaultCase).Displacement(t0)
		return fx*u.UX + fz*u.UZ // C = fᵀu
	}
	byName := map[string]springnet.Sensitivity{}
	for _, s := range sens {
		byName[s.Group] = s
	}
	// Central differences with a relative step h: error O(h²) ≈ 1e-8 of
	// the derivative, plus round-off of C·1e-16/h ≈ 1e-12: 1e-6 covers both.
	const h = 1e-4
	dL := (compliance(eL*(1+h), eB) - compliance(eL*(1-h), eB)) / (2 * h) // dC/ds
	dB := (compliance(eL, eB*(1+h)) - compliance(eL, eB*(1-h))) / (2 * h)
	assert.InEpsilon(t, dL, byName["leg steel"].DC, 1e-6)
	assert.InEpsilon(t, dB, byName["brace alu"].DC, 1e-6)
	assert.InEpsilon(t, dL/eL, byName["leg steel"].DCdE, 1e-6)
	// Invariant: Σ_k dC/ds_k = −2U = −C for a linear case (scaling every
	// stiffness by 1 + s scales u by 1/(1 + s)).
	sumDC := 0.0
	for _, s := range sens {
		sumDC += s.DC
	}
	assert.InEpsilon(t, -compliance(eL, eB), sumDC, 1e-9) // an exact identity; round-off of the sensitivity sums
}
