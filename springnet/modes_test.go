package springnet_test

import (
	"fmt"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
	"gonum.org/v1/gonum/mat"
)

// Tolerances of the modal tests.
const (
	// modeTight: an exact discrete model against a closed form or a dense
	// reference; only round-off separates them.
	modeTight = 1e-8
	// beamFE: 20 to 40 cubic (Hermite) beam elements against the
	// continuous Euler–Bernoulli beam; the discretisation error of the
	// first three modes is far below this (the task asks for 1 %).
	beamFE = 0.01
)

// modeSteel is a steel with exact values, so that closed forms use the
// same numbers as the model.
func modeSteel() materials.Material {
	return materials.Material{Name: "test steel", E: materials.Exact(210e9), Poisson: 0.3, Density: 7850,
		Loss: materials.Range{Low: 0.0005, Nominal: 0.001, High: 0.002}}
}

// A mass on four legs, free only vertically, is one DOF:
// f = (1/2π)·√(k/m), k = 4·EA/L (any vibration text, e.g. Thomson &
// Dahleh, Theory of Vibration with Applications, 5th ed., §2.1, section
// number from memory).
func TestModesMassOnLegs(t *testing.T) {
	for _, tc := range []struct {
		name          string
		ea, l, kg, jz float64
	}{
		{"light", 2e8, 0.8, 120, 0},
		{"heavy with rotary inertia", 5e8, 1.2, 2500, 300},
	} {
		t.Run(tc.name, func(t *testing.T) {
			var m springnet.Model
			var tops []springnet.NodeID
			for i, c := range [4][2]float64{{0, 0}, {1, 0}, {1, 1}, {0, 1}} {
				b := m.AddNode(fmt.Sprintf("b%d", i), springnet.Vec{X: c[0], Y: c[1]})
				top := m.AddNode(fmt.Sprintf("t%d", i), springnet.Vec{X: c[0], Y: c[1], Z: tc.l})
				m.Fix(b, springnet.AllDOF)
				m.AddBar(b, top, springnet.Bar{EA: tc.ea}) // massless legs (raw, no LineMass)
				tops = append(tops, top)
			}
			g := m.AddRigidGroup("top", tops...)
			m.FixGroup(g, springnet.UX|springnet.UY|springnet.RX|springnet.RY|springnet.RZ)
			m.AddMass(g, springnet.Mass{Kg: tc.kg, Inertia: springnet.Vec{Z: tc.jz}})
			for _, method := range []springnet.ModeMethod{springnet.DenseMethod, springnet.SparseMethod} {
				r, err := springnet.Modes(&m, &springnet.ModeSettings{Count: 1, Method: method})
				require.NoError(t, err)
				require.Equal(t, 1, r.NumModes())
				want := math.Sqrt(4*tc.ea/tc.l/tc.kg) / (2 * math.Pi) // f = √(k/m)/2π
				assert.InEpsilon(t, want, r.Frequency(0), modeTight)
				assert.False(t, r.RigidBody(0))
				assert.True(t, r.Sturm().Checked)
				assert.Equal(t, 1, r.Sturm().Count)
				// One DOF carries all the mass it moves (Chopra): M_eff = m.
				assert.InEpsilon(t, tc.kg, r.EffectiveMass(0, springnet.UZ), modeTight)
				assert.InEpsilon(t, 1, r.CumulativeParticipation(0, springnet.UZ), modeTight)
			}
		})
	}
}

// cantileverModel builds a beam of n elements along X, clamped at x = 0,
// moving only in the X–Z plane (UY, RX, RZ fixed everywhere). ends says
// how the ends are held: "clamped-free" or "pinned-pinned".
func cantileverModel(n int, l float64, ends string, sec sections.Section) (*springnet.Model, []springnet.NodeID) {
	var m springnet.Model
	var nodes []springnet.NodeID
	for i := 0; i <= n; i++ {
		nd := m.AddNode("", springnet.Vec{X: l * float64(i) / float64(n)})
		m.Fix(nd, springnet.UY|springnet.RX|springnet.RZ)
		nodes = append(nodes, nd)
	}
	for i := 0; i < n; i++ {
		m.AddBeam(nodes[i], nodes[i+1], springnet.Beam{Material: modeSteel(), Section: sec})
	}
	switch ends {
	case "clamped-free":
		m.Fix(nodes[0], springnet.AllDOF)
	case "pinned-pinned":
		m.Fix(nodes[0], springnet.UX|springnet.UZ)
		m.Fix(nodes[n], springnet.UZ)
	}
	return &m, nodes
}

// Bending frequencies of uniform Euler–Bernoulli beams,
//
//	f_n = (λ_n² / 2π L²)·√(EI/m)
//
// with λ = βL = 1.87510407, 4.69409113, 7.85475744 for a cantilever
// (Blevins, Formulas for Natural Frequency and Mode Shape, Table 8-1; the
// digits past 1.8751, 4.6941, 7.8548 from memory) and λ = nπ for a simply
// supported beam (same table).
func TestModesBeamBending(t *testing.T) {
	sec := sections.RoundTube{D: 0.0603, T: 0.004}
	p, err := sec.Properties()
	require.NoError(t, err)
	const l = 2.0
	mat := modeSteel()
	ei := mat.E.Nominal * p.Iy
	mass := mat.Density * p.A
	for _, tc := range []struct {
		name string
		ends string
		n    int
		kind springnet.MassMatrix
		lam  [3]float64
	}{
		{"cantilever consistent", "clamped-free", 20, springnet.Consistent, [3]float64{1.87510407, 4.69409113, 7.85475744}},
		{"cantilever lumped", "clamped-free", 40, springnet.Lumped, [3]float64{1.87510407, 4.69409113, 7.85475744}},
		{"simply supported consistent", "pinned-pinned", 20, springnet.Consistent, [3]float64{math.Pi, 2 * math.Pi, 3 * math.Pi}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			m, _ := cantileverModel(tc.n, l, tc.ends, sec)
			r, err := springnet.Modes(m, &springnet.ModeSettings{Count: 3, Mass: tc.kind})
			require.NoError(t, err)
			require.Equal(t, 3, r.NumModes())
			for i, lam := range tc.lam {
				want := lam * lam / (2 * math.Pi * l * l) * math.Sqrt(ei/mass)
				assert.InEpsilon(t, want, r.Frequency(i), beamFE, "mode %d", i+1)
				t.Logf("mode %d: %.6g Hz, relative error %.2e", i+1, r.Frequency(i), r.Frequency(i)/want-1)
			}
			assert.True(t, r.Sturm().Checked)
			// One material: ζ = η/2 of that material at every level
			// (modal strain energy method with a single loss factor).
			for i := 0; i < 3; i++ {
				z := r.DampingRatio(i)
				// 1e-12: with one material the weighted mean is that one value; round-off only.
				assert.InEpsilon(t, mat.Loss.Low/2, z.Low, 1e-12)
				assert.InEpsilon(t, mat.Loss.Nominal/2, z.Nominal, 1e-12)
				assert.InEpsilon(t, mat.Loss.High/2, z.High, 1e-12)
				sh := r.MaterialEnergy(i)
				require.Len(t, sh, 1)
				assert.Equal(t, "test steel", sh[0].Group)
				assert.InEpsilon(t, 1, sh[0].Share, 1e-12)
				// Energy of a mode of unit modal mass is ω²/2.
				assert.InEpsilon(t, r.Eigenvalue(i)/2, sh[0].Energy, 1e-8)
			}
		})
	}
}

// skew returns [r]×, with [r]×·v = r × v.
func skew(r [3]float64) *mat.Dense {
	return mat.NewDense(3, 3, []float64{0, -r[2], r[1], r[2], 0, -r[0], -r[1], r[0], 0})
}

// rigidT returns T (3×6) with the motion of a point at offset r from the
// reference point u_p = u + θ × r = [I, −[r]×]·[u; θ].
func rigidT(r [3]float64) *mat.Dense {
	t := mat.NewDense(3, 6, nil)
	s := skew(r)
	for i := 0; i < 3; i++ {
		t.Set(i, i, 1)
		for j := 0; j < 3; j++ {
			t.Set(i, 3+j, -s.At(i, j))
		}
	}
	return t
}

// denseFrequencies solves K·φ = ω²·M·φ with gonum: Cholesky of M = L·Lᵀ,
// then the symmetric eigensolver on L⁻¹·K·L⁻ᵀ; returns f = ω/2π ascending.
func denseFrequencies(t *testing.T, k, m *mat.SymDense) []float64 {
	var ch mat.Cholesky
	require.True(t, ch.Factorize(m), "M must be positive definite")
	var l mat.TriDense
	ch.LTo(&l)
	n := k.SymmetricDim()
	var linv mat.TriDense
	require.NoError(t, linv.InverseTri(&l))
	var a mat.Dense
	a.Product(&linv, k, linv.T())
	as := mat.NewSymDense(n, nil)
	for i := 0; i < n; i++ {
		for j := i; j < n; j++ {
			as.SetSym(i, j, (a.At(i, j)+a.At(j, i))/2)
		}
	}
	var es mat.EigenSym
	require.True(t, es.Factorize(as, false))
	var out []float64
	for _, v := range es.Values(nil) {
		out = append(out, math.Sqrt(math.Max(v, 0))/(2*math.Pi))
	}
	return out
}

// A heavy rigid top with its centre of gravity above the feet and a full
// inertia tensor (a machine, through Machine.Masses) on four springy legs:
// the six frequencies against gonum's dense solvers, K and M built here
// from first principles: K = Σ Tᵢᵀ·diag(kx, ky, kz)·Tᵢ over the legs,
// M = T_cᵀ·diag(m, m, m)·T_c + J with the tensor J about the CG.
func TestModesRigidTopAgainstGonum(t *testing.T) {
	legs := [4][3]float64{{-0.4, -0.3, 0}, {0.4, -0.3, 0}, {0.4, 0.3, 0}, {-0.4, 0.3, 0}}
	kx, ky, kz := 2e7, 3e7, 4e8 // per leg [N/m] (demo data)
	const kg = 1800.0
	cg := [3]float64{0.05, -0.02, 0.45}
	for _, tc := range []struct {
		name string
		j    [3][3]float64
	}{
		{"principal axes along X, Y, Z", [3][3]float64{{300, 0, 0}, {0, 420, 0}, {0, 0, 380}}},
		{"full tensor", [3][3]float64{{300, -25, 12}, {-25, 420, -30}, {12, -30, 380}}},
		{"box", func() [3][3]float64 {
			b := springnet.BoxInertia(kg, 1.2, 0.9, 1.1)
			return [3][3]float64{{b.X, 0, 0}, {0, b.Y, 0}, {0, 0, b.Z}}
		}()},
	} {
		t.Run(tc.name, func(t *testing.T) {
			var m springnet.Model
			var nodes []springnet.NodeID
			for i, p := range legs {
				n := m.AddNode(fmt.Sprintf("leg%d", i), springnet.Vec{X: p[0], Y: p[1], Z: p[2]})
				m.AddFoot(n, springnet.Foot{K: springnet.Stiffness6{X: kx, Y: ky, Z: kz}})
				nodes = append(nodes, n)
			}
			g := m.AddRigidGroupAt("top", springnet.Vec{}, nodes...)
			corner := m.AddMount("corner", springnet.Vec{X: 0.4, Y: 0.3, Z: 0.9}, g)
			ms, err := springnet.Machine{Kg: kg, CG: springnet.Vec{X: cg[0], Y: cg[1], Z: cg[2]}, Inertia: tc.j}.Masses()
			require.NoError(t, err)
			for _, x := range ms {
				m.AddMass(g, x)
			}
			r, err := springnet.Modes(&m, &springnet.ModeSettings{Count: 6})
			require.NoError(t, err)
			require.Equal(t, 6, r.NumModes())

			k := mat.NewSymDense(6, nil)
			for _, p := range legs {
				tr := rigidT(p)
				var kt mat.Dense
				kt.Product(tr.T(), mat.NewDiagDense(3, []float64{kx, ky, kz}), tr)
				k.AddSym(k, symOf(&kt))
			}
			mm := mat.NewSymDense(6, nil)
			tc2 := rigidT(cg)
			var mt mat.Dense
			mt.Product(tc2.T(), tc2)
			mt.Scale(kg, &mt)
			for i := 0; i < 3; i++ {
				for j := 0; j < 3; j++ {
					mt.Set(3+i, 3+j, mt.At(3+i, 3+j)+tc.j[i][j])
				}
			}
			mm.AddSym(mm, symOf(&mt))
			want := denseFrequencies(t, k, mm)
			for i := 0; i < 6; i++ {
				assert.InEpsilon(t, want[i], r.Frequency(i), modeTight, "mode %d", i+1)
			}
			// The whole mass takes part: six modes span the six rigid
			// motions of the top (Chopra, effective modal mass).
			for _, d := range []springnet.DOF{springnet.UX, springnet.UY, springnet.UZ} {
				assert.InEpsilon(t, kg, r.TotalMass(d), modeTight)
				assert.InEpsilon(t, 1, r.CumulativeParticipation(5, d), modeTight)
			}
			// A mount on the top moves with it rigidly: u = u_g + θ × r
			// (rigid-body kinematics), in every mode.
			for i := 0; i < 6; i++ {
				ug := r.Shape(i, g)
				um := r.Shape(i, corner)
				want := ug.Translation().Add(ug.Rotation().Cross(springnet.Vec{X: 0.4, Y: 0.3, Z: 0.9}))
				// 1e-12 (absolute, unit modal mass): the mount is slaved rigidly, round-off only.
				assert.InDelta(t, want.X, um.UX, 1e-12)
				assert.InDelta(t, want.Y, um.UY, 1e-12)
				assert.InDelta(t, want.Z, um.UZ, 1e-12)
			}
			// All strain energy is in the feet.
			sh := r.MaterialEnergy(0)
			require.Len(t, sh, 1)
			assert.Equal(t, springnet.GroupFeet, sh[0].Group)
		})
	}
}

func symOf(a *mat.Dense) *mat.SymDense {
	n, _ := a.Dims()
	s := mat.NewSymDense(n, nil)
	for i := 0; i < n; i++ {
		for j := i; j < n; j++ {
			s.SetSym(i, j, (a.At(i, j)+a.At(j, i))/2)
		}
	}
	return s
}

// Machine.Masses rejects what no body can have and keeps one mass for a
// diagonal tensor.
func TestMachineMasses(t *testing.T) {
	ms, err := springnet.MachineBox(600, springnet.Vec{Z: 0.5}, springnet.Vec{X: 1, Y: 0.5, Z: 0.8}).Masses()
	require.NoError(t, err)
	require.Len(t, ms, 1)
	// Solid cuboid: Jx = m(b² + c²)/12 (Meriam & Kraige, Dynamics, table of
	// mass moments of inertia; the formula as the task states it).
	// 1e-12: the same formula evaluated once, round-off only.
	assert.InEpsilon(t, 600*(0.25+0.64)/12, ms[0].Inertia.X, 1e-12)
	assert.InEpsilon(t, 600*(1+0.64)/12, ms[0].Inertia.Y, 1e-12)
	assert.InEpsilon(t, 600*(1+0.25)/12, ms[0].Inertia.Z, 1e-12)
	for _, tc := range []struct {
		name string
		mc   springnet.Machine
	}{
		{"negative mass", springnet.Machine{Kg: -1}},
		{"triangle inequality", springnet.Machine{Kg: 10, Inertia: [3][3]float64{{1, 0, 0}, {0, 1, 0}, {0, 0, 5}}}},
		{"asymmetric", springnet.Machine{Kg: 10, Inertia: [3][3]float64{{1, 0.5, 0}, {0, 1, 0}, {0, 0, 1}}}},
		{"not finite", springnet.Machine{Kg: 10, Inertia: [3][3]float64{{math.NaN(), 0, 0}, {0, 1, 0}, {0, 0, 1}}}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := tc.mc.Masses()
			assert.ErrorContains(t, err, "springnet: machine")
		})
	}
}

// Longitudinal modes of a uniform fixed–free rod of bars,
//
//	f_n = (2n − 1)/(4L) · √(E/ρ)
//
// (the classical fixed–free rod, e.g. Blevins, Formulas for Natural
// Frequency and Mode Shape, longitudinal vibration of straight bars; the
// table number is not quoted, from memory), with consistent and lumped bar
// masses.
func TestModesRodAxial(t *testing.T) {
	const n, l = 40, 3.0
	sec := sections.RoundTube{D: 0.05, T: 0.004}
	mt := modeSteel()
	for _, kind := range []springnet.MassMatrix{springnet.Consistent, springnet.Lumped} {
		t.Run(kind.String(), func(t *testing.T) {
			var m springnet.Model
			prev := m.AddNode("", springnet.Vec{})
			m.Fix(prev, springnet.AllDOF)
			for i := 1; i <= n; i++ {
				nd := m.AddNode("", springnet.Vec{X: l * float64(i) / n})
				m.Fix(nd, springnet.UY|springnet.UZ)
				m.AddBar(prev, nd, springnet.Bar{Material: mt, Section: sec})
				prev = nd
			}
			r, err := springnet.Modes(&m, &springnet.ModeSettings{Count: 3, Mass: kind})
			require.NoError(t, err)
			c := math.Sqrt(mt.E.Nominal / mt.Density)
			for i := 0; i < 3; i++ {
				want := float64(2*i+1) / (4 * l) * c
				assert.InEpsilon(t, want, r.Frequency(i), beamFE, "mode %d", i+1)
				// The only energy is axial, in steel: ζ = η/2.
				assert.InEpsilon(t, mt.Loss.Nominal/2, r.DampingRatio(i).Nominal, 1e-12)
			}
		})
	}
}
