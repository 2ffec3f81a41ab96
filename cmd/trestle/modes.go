package main

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/modelfile"
)

// dynamics is what the modal part of a report needs from a model file.
type dynamics struct {
	count  int               // modes wanted; 0: springnet's default
	speeds []modelfile.Speed // running speeds to check
}

// dynamicsOf returns the dynamics inputs of a model file.
func dynamicsOf(f *modelfile.File) dynamics {
	return dynamics{count: f.Dynamics.Modes, speeds: f.Dynamics.Speeds}
}

// directions of the effective mass shares, in ModeReport.Participation
// order, and their words.
var (
	participationDirs = [6]springnet.DOF{springnet.UX, springnet.UY, springnet.UZ, springnet.RX, springnet.RY, springnet.RZ}
	motionWords       = [6]string{"sway along X", "sway along Y", "bounce (vertical)", "rocking about X", "rocking about Y", "twist about Z"}
)

// internalShare: a mode whose largest effective mass share is below this
// moves the stand's parts against each other more than the stand as a
// whole (common practice reads shares under a few per cent as local).
const internalShare = 0.02

// swayShare: a mode whose largest translational mass share reaches this
// is named by that translation ("sway along X") even when its rotation
// about the floor carries more (a sway of a tall stand does both).
const swayShare = 0.3

// modeReference is the point about which rotational mass shares are taken:
// the centre of the plan at floor level.
func modeReference(m *springnet.Model) springnet.Vec {
	if m.NumNodes() == 0 {
		return springnet.Vec{}
	}
	var c springnet.Vec
	zmin := math.Inf(1)
	for i := 0; i < m.NumNodes(); i++ {
		p := m.NodeAt(springnet.NodeID(i))
		c = c.Add(p)
		zmin = math.Min(zmin, p.Z)
	}
	c = c.Scale(1 / float64(m.NumNodes()))
	c.Z = zmin
	return c
}

// modes runs the modal analysis and the running-speed check. A failure
// becomes a warning and a nil report: the static results still stand.
func modes(m *springnet.Model, l materials.Level, dyn dynamics, warn []string) (*springnet.ModeResult, *ModesReport, []string) {
	res, err := springnet.Modes(m, &springnet.ModeSettings{Count: dyn.count, Level: l, Reference: modeReference(m)})
	if res == nil {
		return nil, nil, append(warn, "no natural frequencies: "+err.Error())
	}
	if err != nil {
		warn = append(warn, "modes: "+err.Error())
	}
	rep := &ModesReport{Modes: []ModeReport{}, Resonances: []ResonanceReport{}, Speeds: []string{}, SturmCount: -1}
	if sc := res.Sturm(); sc.Checked {
		rep.SturmCount, rep.SturmBelowHz = sc.Count, sc.Below
	}
	for i, d := range participationDirs[:3] {
		rep.TotalMassKg[i] = res.TotalMass(d)
	}
	for i := 0; i < res.NumModes(); i++ {
		lf := res.LossFactor(i)
		mr := ModeReport{Number: i + 1, FrequencyHz: res.Frequency(i), RigidBody: res.RigidBody(i),
			LossFactor: [3]float64{lf.Low, lf.Nominal, lf.High}, DampingRatio: res.DampingRatio(i).Nominal,
			Energy: []EnergyReport{}}
		best, bestT := 0, 0
		for j, d := range participationDirs {
			mr.Participation[j] = res.Participation(i, d)
			if mr.Participation[j] > mr.Participation[best] {
				best = j
			}
			if j < 3 && mr.Participation[j] > mr.Participation[bestT] {
				bestT = j
			}
		}
		// A sway also rotates the stand about the floor; name it by its
		// translation when that carries a good share of the mass.
		if mr.Participation[bestT] >= swayShare {
			best = bestT
		}
		switch {
		case mr.RigidBody:
			mr.Motion = "free motion (rigid body or mechanism)"
		case mr.Participation[best] < internalShare:
			mr.Motion = "local or higher-order (little mass moves)"
		default:
			mr.Motion = motionWords[best]
		}
		for _, es := range res.MaterialEnergy(i) {
			mr.Energy = append(mr.Energy, EnergyReport{Group: es.Group, Share: es.Share})
		}
		rep.Modes = append(rep.Modes, mr)
	}
	freqs := res.FrequenciesTo(nil)
	for _, sp := range dyn.speeds {
		rs := springnet.RunningSpeed{Name: sp.Name, RPMLow: 60 * sp.Low, RPMHigh: 60 * sp.High, PerRev: sp.PerRev}
		rep.Speeds = append(rep.Speeds, speedText(sp))
		found, err := springnet.CheckExcitation(freqs, []springnet.RunningSpeed{rs}, &springnet.ExcitationSettings{Harmonics: sp.Harmonics})
		if err != nil {
			warn = append(warn, "running speed check: "+err.Error())
			continue
		}
		for _, r := range found {
			rep.Resonances = append(rep.Resonances, ResonanceReport{Mode: r.Mode + 1, FrequencyHz: r.Frequency,
				Speed: r.Excitation.Speed, Order: r.Excitation.Order, LowHz: r.Excitation.Low, HighHz: r.Excitation.High,
				Separation: r.Separation})
		}
	}
	warn = append(warn, resonanceWarnings(rep.Resonances)...)
	return res, rep, warn
}

// maxResonanceLines: past this many modes near excitation bands, the
// warnings name the rest in one line.
const maxResonanceLines = 3

// resonanceWarnings says, one line a mode, which natural frequencies lie
// in or near excitation bands.
func resonanceWarnings(rs []ResonanceReport) []string {
	var out []string
	var modes []int
	bands := map[int][]string{}
	freq := map[int]float64{}
	for _, r := range rs {
		if _, ok := bands[r.Mode]; !ok {
			modes = append(modes, r.Mode)
		}
		b := fmt.Sprintf("%s ×%d", r.Speed, r.Order)
		if r.Separation > 0 {
			b += fmt.Sprintf(" (%.0f %% away)", 100*r.Separation)
		}
		bands[r.Mode] = append(bands[r.Mode], b)
		freq[r.Mode] = r.FrequencyHz
	}
	for i, m := range modes {
		if i == maxResonanceLines {
			out = append(out, fmt.Sprintf("RESONANCE: %d more modes lie in or near excitation bands (see NATURAL MODES)", len(modes)-i))
			break
		}
		out = append(out, fmt.Sprintf("RESONANCE: mode %d at %s Hz lies in or near the excitation of %s", m, num(freq[m]), join(bands[m])))
	}
	return out
}

// speedText describes a running speed as read.
func speedText(s modelfile.Speed) string {
	rpm := num(60*s.Low) + " rpm"
	if s.High != s.Low {
		rpm = num(60*s.Low) + "–" + num(60*s.High) + " rpm"
	}
	per := ""
	if s.PerRev > 1 {
		per = fmt.Sprintf(", %d per rev", s.PerRev)
	}
	h := max(s.Harmonics, 0)
	if h == 0 {
		h = springnet.DefaultHarmonics
	}
	return fmt.Sprintf("%s %s%s, harmonics 1–%d", s.Name, rpm, per, h)
}

var _ = errors.New
