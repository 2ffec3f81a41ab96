package springnet_test

import (
	"fmt"
	"log"
	"math"
	"math/cmplx"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// standWithMachine builds a four-leg steel stand with a rigid top on
// elastomer-padded feet and a 900 kg machine on it (demo data).
func standWithMachine() (*springnet.Model, springnet.MountID) {
	const mm = 1e-3
	steel, err := materials.Lookup("steel S235")
	if err != nil {
		log.Fatal(err)
	}
	leg := sections.RectTube{B: 80 * mm, H: 80 * mm, T: 5 * mm}
	const w, d, h = 1.2, 0.8, 0.7 // footprint and height [m]
	var m springnet.Model
	var tops []springnet.NodeID
	for i, c := range [4][2]float64{{0, 0}, {w, 0}, {w, d}, {0, d}} {
		foot := m.AddNode(fmt.Sprintf("foot%d", i+1), springnet.Vec{X: c[0], Y: c[1]})
		top := m.AddNode(fmt.Sprintf("top%d", i+1), springnet.Vec{X: c[0], Y: c[1], Z: h})
		m.AddBeam(foot, top, springnet.Beam{Name: fmt.Sprintf("leg%d", i+1), Material: steel, Section: leg})
		m.AddFoot(foot, springnet.Foot{Name: fmt.Sprintf("pad%d", i+1),
			K:    springnet.Stiffness6{X: 5e6, Y: 5e6, Z: 4e7, RX: 2e4, RY: 2e4},
			Loss: materials.Range{Low: 0.08, Nominal: 0.12, High: 0.18}})
		tops = append(tops, top)
	}
	plate := m.AddRigidGroup("top", tops...)
	// The machine: 900 kg, centre of gravity 0.45 m above the top, inertia
	// of its 1.0 × 0.7 × 0.9 m bounding box.
	mc := springnet.MachineBox(900, springnet.Vec{Z: 0.45}, springnet.Vec{X: 1.0, Y: 0.7, Z: 0.9})
	masses, err := mc.Masses()
	if err != nil {
		log.Fatal(err)
	}
	for _, x := range masses {
		m.AddMass(plate, x)
	}
	spindle := m.AddMount("spindle", springnet.Vec{X: w / 2, Y: d / 2, Z: h + 0.6}, plate)
	return &m, spindle
}

// The lowest modes of a stand carrying a machine: frequency, damping from
// the feet's and the steel's loss factors, where the energy sits, and how
// much of the mass moves in X.
func ExampleModes() {
	m, _ := standWithMachine()
	r, err := springnet.Modes(m, &springnet.ModeSettings{Count: 4})
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("Sturm check: %v, %d modes below %.4g Hz\n", r.Sturm().Checked, r.Sturm().Count, r.Sturm().Below)
	pct := func(x float64) float64 { return math.Round(1000*x) / 10 } // to 0.1 %
	for i := 0; i < r.NumModes(); i++ {
		top := r.MaterialEnergy(i)[0]
		fmt.Printf("mode %d: %.4g Hz, ζ = %.3g %%, mass in X %.4g %%, in Y %.4g %%; %s hold %.4g %% of the energy\n",
			i+1, r.Frequency(i), 100*r.DampingRatio(i).Nominal, pct(r.Participation(i, springnet.UX)),
			pct(r.Participation(i, springnet.UY)), top.Group, pct(top.Share))
	}
	// Output:
	// Sturm check: true, 4 modes below 63.28 Hz
	// mode 1: 11.8 Hz, ζ = 3.21 %, mass in X 0 %, in Y 98.7 %; feet hold 53.5 % of the energy
	// mode 2: 12.83 Hz, ζ = 2.76 %, mass in X 99.3 %, in Y 0 %; steel S235 hold 54.2 % of the energy
	// mode 3: 27.43 Hz, ζ = 2.32 %, mass in X 0 %, in Y 0 %; steel S235 hold 61.5 % of the energy
	// mode 4: 63.25 Hz, ζ = 5.53 %, mass in X 0 %, in Y 0 %; feet hold 92.1 % of the energy
}

// The receptance at the spindle mount in X, its peaks, and the dynamic
// stiffness at the first peak.
func ExampleResponse() {
	m, spindle := standWithMachine()
	p := springnet.Probe{At: spindle, Dir: springnet.UX}
	f, _, err := springnet.Response(m, p, p, &springnet.ResponseSettings{Low: 1, High: 100, Points: 500})
	if err != nil {
		log.Fatal(err)
	}
	tr := f.Truncation()
	fmt.Printf("%d modes up to %.4g Hz, residual flexibility: %v\n", tr.Modes, tr.Highest, tr.Residual)
	for _, pk := range f.Peaks() {
		k := cmplx.Abs(1 / f.At(pk.Frequency))
		fmt.Printf("peak at %.4g Hz: %.4g µm/N, dynamic stiffness %.4g N/µm\n", pk.Frequency, pk.Magnitude*1e6, springnet.NPerMicron(k))
	}
	// Output:
	// 6 modes up to 100.3 Hz, residual flexibility: true
	// peak at 12.82 Hz: 3.156 µm/N, dynamic stiffness 0.3169 N/µm
}

// Which natural frequencies sit within ±20 % (the default margin, common
// practice) of the first two harmonics of what the machine excites.
func ExampleCheckExcitation() {
	m, _ := standWithMachine()
	r, err := springnet.Modes(m, &springnet.ModeSettings{Count: 6})
	if err != nil {
		log.Fatal(err)
	}
	speeds := []springnet.RunningSpeed{
		{Name: "spindle, 2-flute cutter", RPMLow: 1500, RPMHigh: 3000, PerRev: 2},
		{Name: "motor", RPMLow: 1460, RPMHigh: 1460},
	}
	hits, err := r.CheckExcitation(speeds, &springnet.ExcitationSettings{Harmonics: 2})
	if err != nil {
		log.Fatal(err)
	}
	for _, h := range hits {
		fmt.Printf("mode %d (%.4g Hz) near %s ×%d: %.4g–%.4g Hz\n", h.Mode+1, h.Frequency,
			h.Excitation.Speed, h.Excitation.Order, h.Excitation.Low, h.Excitation.High)
	}
	// Output:
	// mode 3 (27.43 Hz) near motor ×1: 24.33–24.33 Hz
	// mode 4 (63.25 Hz) near spindle, 2-flute cutter ×1: 50–100 Hz
	// mode 5 (86.03 Hz) near spindle, 2-flute cutter ×1: 50–100 Hz
	// mode 5 (86.03 Hz) near spindle, 2-flute cutter ×2: 100–200 Hz
	// mode 6 (100.3 Hz) near spindle, 2-flute cutter ×1: 50–100 Hz
	// mode 6 (100.3 Hz) near spindle, 2-flute cutter ×2: 100–200 Hz
}

// The first natural frequencies of the stand with its machine as ranges
// over the material uncertainty (the pads' stiffness spread and the
// steel's E), one modal analysis per level.
func ExampleSweep_frequencies() {
	m, spindle := standWithMachine()
	m.AddLoad(spindle, springnet.Load{FX: 500}) // a cutting force (demo data)
	res, err := springnet.Sweep(m, &springnet.SweepSettings{Modes: 2})
	if err != nil {
		log.Fatal(err)
	}
	for i, f := range res.Frequencies {
		fmt.Printf("mode %d: %.4g – %.4g – %.4g Hz\n", i+1, f.Range.Low, f.Range.Nominal, f.Range.High)
	}
	// Output:
	// mode 1: 11.59 – 11.8 – 11.83 Hz
	// mode 2: 12.57 – 12.83 – 12.86 Hz
}
