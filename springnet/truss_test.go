package springnet_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

func TestPrattTruss(t *testing.T) {
	// A four-panel Pratt truss, panels a = 3 m, height h = 4 m (3-4-5
	// triangles), pinned at L0, roller at L4, P = 10 kN down at L1, L2, L3.
	// Reference: hand calculation by the method of joints (the method of
	// Hibbeler, Structural Analysis, ch. 3), reactions 15 kN each:
	//   L0: F(L0U1)·4/5 = −15 → −18.75 kN;  F(L0L1) = 18.75·3/5 = 11.25 kN
	//   L1: F(L1L2) = 11.25 kN;  F(U1L1) = 10 kN
	//   U1: z: 18.75·4/5 − 10 − F(U1L2)·4/5 = 0 → F(U1L2) = 6.25 kN
	//       x: 18.75·3/5 + F(U1U2) + 6.25·3/5 = 0 → F(U1U2) = −15 kN
	//   L2: F(U2L2) = 10 − 2·6.25·4/5 = 0
	// and the mirror image on the right. Tension positive.
	const a, h, p, ea = 3.0, 4.0, 10e3, 5e8
	var m springnet.Model
	L := make([]springnet.NodeID, 5)
	U := make([]springnet.NodeID, 4)
	for i := 0; i <= 4; i++ {
		L[i] = m.AddNode("L"+string(rune('0'+i)), springnet.Vec{X: a * float64(i)})
		m.Fix(L[i], springnet.UY) // plane truss: hold out of plane
	}
	for i := 1; i <= 3; i++ {
		U[i] = m.AddNode("U"+string(rune('0'+i)), springnet.Vec{X: a * float64(i), Z: h})
		m.Fix(U[i], springnet.UY)
	}
	m.Fix(L[0], springnet.UX|springnet.UZ)
	m.Fix(L[4], springnet.UZ)
	bar := func(name string, x, y springnet.NodeID) springnet.ElementID {
		return m.AddBar(x, y, springnet.Bar{Name: name, EA: ea})
	}
	want := map[springnet.ElementID]float64{
		bar("L0L1", L[0], L[1]): 11.25e3, bar("L1L2", L[1], L[2]): 11.25e3,
		bar("L2L3", L[2], L[3]): 11.25e3, bar("L3L4", L[3], L[4]): 11.25e3,
		bar("U1U2", U[1], U[2]): -15e3, bar("U2U3", U[2], U[3]): -15e3,
		bar("L0U1", L[0], U[1]): -18.75e3, bar("U3L4", U[3], L[4]): -18.75e3,
		bar("U1L1", U[1], L[1]): 10e3, bar("U2L2", U[2], L[2]): 0, bar("U3L3", U[3], L[3]): 10e3,
		bar("U1L2", U[1], L[2]): 6.25e3, bar("U3L2", U[3], L[2]): 6.25e3,
	}
	for i := 1; i <= 3; i++ {
		m.AddLoad(L[i], springnet.Load{FZ: -p})
	}
	res, err := springnet.Static(&m, nil)
	require.NoError(t, err)
	cr := res.Case(0)
	for e, f := range want {
		assert.InDelta(t, f, cr.Force(e).Axial, closeTol*p, m.ElementName(e))
	}
	assert.InDelta(t, 15e3, cr.Reaction(L[0]).FZ, closeTol*p) // 3P/2 by symmetry (hand calculation above)
	assert.InDelta(t, 15e3, cr.Reaction(L[4]).FZ, closeTol*p)
	assert.InDelta(t, 0, cr.Reaction(L[0]).FX, closeTol*p)
	// Every node is held out of plane, so all eight report; vertical
	// reactions sum to the 30 kN applied (statics).
	sum := 0.0
	rs := cr.Reactions()
	assert.Len(t, rs, 8)
	for _, r := range rs {
		sum += r.Load.FZ
	}
	assert.InEpsilon(t, 3*p, sum, closeTol)
}

func TestCantileverBeam(t *testing.T) {
	// Cantilever, end load P: δ = P·L³/(3·E·I) (Euler–Bernoulli); with shear
	// deformation add P·L/(κ·G·A) (Timoshenko; Timoshenko & Gere, Mechanics
	// of Materials, §9.11, and Roark's Formulas, 7th ed., Table 8.1 case 1a
	// for the bending part).
	steel := materials.Material{Name: "steel", E: materials.Exact(200e9), Poisson: 0.3, Density: 7850, Yield: 235e6}
	sec := sections.Rect{B: 0.05, H: 0.1}
	const l, p = 1.2, 2e3
	props, err := sec.Properties()
	require.NoError(t, err)
	for _, timo := range []bool{false, true} {
		name := "Euler–Bernoulli"
		if timo {
			name = "Timoshenko"
		}
		t.Run(name, func(t *testing.T) {
			var m springnet.Model
			base := m.AddNode("base", springnet.Vec{})
			tip := m.AddNode("tip", springnet.Vec{X: l})
			m.Fix(base, springnet.AllDOF)
			m.AddBeam(base, tip, springnet.Beam{Material: steel, Section: sec, Timoshenko: timo})
			m.AddLoad(tip, springnet.Load{FZ: -p})
			res, err := springnet.Static(&m, nil)
			require.NoError(t, err)
			want := p * l * l * l / (3 * 200e9 * props.Iy)
			if timo {
				want += p * l / (steel.ShearModulus(materials.Nominal) * props.AsZ)
			}
			assert.InEpsilon(t, want, -res.Displacement(tip).UZ, closeTol)
			// Base moment P·L from the reaction.
			assert.InEpsilon(t, p*l, math.Abs(res.Case(0).Reaction(base).MY), closeTol)
		})
	}
}

func TestComplianceReciprocity(t *testing.T) {
	// Maxwell–Betti: the compliance matrix is symmetric. Checked on a
	// random network at a node with rotations and at a group's point.
	rng := newRNG()
	r := newRandomNet(rng, 40)
	for _, p := range []springnet.Place{r.nodes[0], springnet.GroupID(0)} {
		ps, err := springnet.MountStiffness(&r.m, p, nil)
		require.NoError(t, err)
		c, ok := ps.Compliance6()
		require.True(t, ok)
		for i := 0; i < 6; i++ {
			for j := 0; j < i; j++ {
				assert.InDelta(t, c[i][j], c[j][i], 1e-9*math.Sqrt(c[i][i]*c[j][j]), "C[%d][%d]", i, j)
			}
		}
		// K·C = I for the 6×6 pair and principal stiffnesses bracket Along.
		k, _ := ps.Stiffness6()
		for i := 0; i < 6; i++ {
			for j := 0; j < 6; j++ {
				s := 0.0
				for q := 0; q < 6; q++ {
					s += k[i][q] * c[q][j]
				}
				want := 0.0
				if i == j {
					want = 1
				}
				assert.InDelta(t, want, s, 1e-8) // K·C = I: round-off of a 6×6 inverse
			}
		}
		kp, dirs := ps.Principal()
		for i := range kp {
			assert.InEpsilon(t, kp[i], ps.Along(dirs[i]), closeTol) // stiffness along a principal direction is that principal value (eigen-decomposition)
		}
		assert.LessOrEqual(t, kp[0], kp[1])
		assert.LessOrEqual(t, kp[1], kp[2])
	}
}

func TestLevelSweepReusesSolver(t *testing.T) {
	// A reused Solver gives the same answer as a new one (STYLE.md), and
	// a bar's stretch scales as 1/E across the material range.
	mat := materials.Material{Name: "timber", E: materials.Range{Low: 8e9, Nominal: 11e9, High: 13e9}, Density: 500}
	var m springnet.Model
	a := m.AddNode("a", springnet.Vec{})
	b := m.AddNode("b", springnet.Vec{Z: 1})
	m.Fix(a, springnet.AllDOF)
	m.Fix(b, springnet.UX|springnet.UY)
	m.AddBar(a, b, springnet.Bar{Material: mat, Section: sections.Square{B: 0.1}})
	m.AddLoad(b, springnet.Load{FZ: -1e4})
	var s springnet.Solver
	for _, lv := range materials.Levels {
		got, err := s.Static(&m, &springnet.StaticSettings{Level: lv})
		require.NoError(t, err)
		fresh, err := springnet.Static(&m, &springnet.StaticSettings{Level: lv})
		require.NoError(t, err)
		assert.Equal(t, fresh.Displacement(b), got.Displacement(b))
		// δ = P·L/(E·A)
		assert.InEpsilon(t, 1e4*1/(mat.E.At(lv)*0.01), -got.Displacement(b).UZ, closeTol)
	}
}

func TestValidateReportsEverything(t *testing.T) {
	var m springnet.Model
	a := m.AddNode("A", springnet.Vec{})
	m.AddNode("A", springnet.Vec{X: math.NaN()})
	c := m.AddNode("C", springnet.Vec{X: 1})
	m.AddNode("lonely", springnet.Vec{Y: 5})
	m.AddBar(a, a, springnet.Bar{Name: "zero", EA: 1e6})
	m.AddBar(a, c, springnet.Bar{Name: "nosec"})
	m.AddBar(a, c, springnet.Bar{Name: "nomat", Section: sections.Square{B: 0.1}})
	m.AddFoot(c, springnet.Foot{Name: "inf", K: springnet.Stiffness6{Z: math.Inf(1)}})
	m.AddRigidGroup("g1", a)
	m.AddRigidGroup("g2", a)
	m.AddRigidGroup("empty")
	err := m.Validate()
	require.Error(t, err)
	msg := err.Error()
	for _, want := range []string{
		`node "A": duplicate name`, `not finite`, `node "lonely": dangling`, `bar "zero": zero length`,
		`bar "nosec": no section`, `bar "nomat": material: no material`, `foot "inf": stiffness UZ`,
		`node "A": in two groups`, `group "empty": has no nodes`,
	} {
		assert.Contains(t, msg, want)
	}
	for _, line := range strings.Split(msg, "\n") {
		assert.True(t, strings.HasPrefix(line, "springnet: "), line)
	}
	_, err = springnet.Static(&m, nil)
	assert.Error(t, err)
	var me *springnet.MechanismError
	assert.False(t, errors.As(err, &me))
}

func TestDOFString(t *testing.T) {
	tests := []struct {
		d    springnet.DOF
		want string
	}{
		{springnet.UX | springnet.RZ, "UX|RZ"},
		{springnet.AllDOF, "UX|UY|UZ|RX|RY|RZ"},
		{0, "none"},
	}
	for _, tc := range tests {
		t.Run(tc.want, func(t *testing.T) { assert.Equal(t, tc.want, tc.d.String()) })
	}
}

func TestUnits(t *testing.T) {
	// 1 lbf/in = 4.4482216152605 N / 0.0254 m = 175.126835246476 N/m
	// (exact definitions, 1959 international yard and pound agreement).
	assert.InEpsilon(t, 175.126835246476, springnet.FromLbfPerInch(1), 1e-14)
	assert.InEpsilon(t, 1.0, springnet.LbfPerInch(springnet.FromLbfPerInch(1)), 1e-15)
	assert.InEpsilon(t, 2.34e3, springnet.NPerMicron(2.34e9), 1e-15) // 1 µm = 1e-6 m by definition; one multiply
}

func TestLumpedMassTotal(t *testing.T) {
	// The mass matrix applied to a unit rigid translation gives the total
	// mass: Σ ρ·A·L over members plus the added masses (conservation of
	// mass; the lumped matrix keeps it exactly).
	steel := materials.Material{Name: "steel", E: materials.Exact(200e9), Poisson: 0.3, Density: 7850}
	sec := sections.Square{B: 0.04}
	var m springnet.Model
	a := m.AddNode("a", springnet.Vec{})
	b := m.AddNode("b", springnet.Vec{X: 1})
	c := m.AddNode("c", springnet.Vec{X: 1, Y: 2})
	d := m.AddNode("d", springnet.Vec{X: 0, Y: 2})
	m.AddBar(a, b, springnet.Bar{Material: steel, Section: sec})
	m.AddBeam(b, c, springnet.Beam{Material: steel, Section: sec})
	m.AddBeam(c, d, springnet.Beam{Material: steel, Section: sec})
	m.AddBar(d, a, springnet.Bar{Material: steel, Section: sec})
	g := m.AddRigidGroup("cd", c, d)
	m.AddMass(g, springnet.Mass{Kg: 50, Offset: springnet.Vec{Z: 0.3}, Inertia: springnet.Vec{X: 1, Y: 1, Z: 1}})
	m.AddMass(a, springnet.Mass{Kg: 7})
	m.Fix(a, springnet.AllDOF)
	m.AddLoadCase("none")
	sys, err := springnet.Assemble(&m, materials.Nominal)
	require.NoError(t, err)
	want := 7850*0.04*0.04*(1+2+1+2) + 50 + 0 // node a is fixed: its 7 kg and half the bars' mass there do not count
	want -= 7850 * 0.04 * 0.04 * (0.5 + 1)    // half of a–b (1 m) and half of d–a (2 m) sit at a
	n := sys.N()
	u := make([]float64, n)
	for i := 0; i < n; i++ {
		if _, dof := sys.Equation(i); dof == springnet.UX {
			u[i] = 1
		}
	}
	f := make([]float64, n)
	sys.M().MulVec(f, u)
	got := 0.0
	for i := 0; i < n; i++ {
		if _, dof := sys.Equation(i); dof == springnet.UX {
			got += f[i]
		}
	}
	assert.InEpsilon(t, want, got, 1e-12) // a sum of a few products: round-off only
	var sb strings.Builder
	require.NoError(t, sys.WriteK(&sb))
	assert.True(t, strings.HasPrefix(sb.String(), "%%MatrixMarket matrix coordinate real symmetric\n"))
}
