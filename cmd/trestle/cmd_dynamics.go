package main

import (
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"

	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/draw"
)

// modeScene draws mode i of res over the model: the shape magnified to a
// readable size, members coloured by their share of the mode's strain
// energy (red: the member that stores most).
func modeScene(m *springnet.Model, name string, res *springnet.ModeResult, i int, md ModeReport) draw.Scene {
	s := draw.FromModel(m)
	shape := res.ShapesTo(nil, i)
	for n := range s.Nodes {
		d := shape[n]
		s.Nodes[n].Move = draw.Point{X: d.UX, Y: d.UY, Z: d.UZ}
	}
	for k := range s.Mounts {
		d := res.Shape(i, springnet.MountID(k))
		s.Mounts[k].Move = draw.Point{X: d.UX, Y: d.UY, Z: d.UZ}
	}
	energy := res.ElementEnergiesTo(nil, i)
	top := 0.0
	k := 0
	for e := 0; e < m.NumElements(); e++ {
		if m.ElementKind(springnet.ElementID(e)) == springnet.FootKind {
			continue
		}
		s.Members[k].Value, s.Members[k].Rated = energy[e], true
		top = math.Max(top, energy[e])
		k++
	}
	s.Title = fmt.Sprintf("%s — mode %d, %s Hz", name, md.Number, num(md.FrequencyHz))
	s.Colours = draw.Colours{Name: "share of the mode's strain energy", Max: top, Percent: true}
	s.Shape = fmt.Sprintf("mode %d, %s Hz, %s", md.Number, num(md.FrequencyHz), md.Motion)
	s.Sizeless = true
	s.Notes = []string{
		"A mode shape has no size of its own: it is drawn at a readable scale.",
		fmt.Sprintf("Modal loss factor η %s (nominal); ζ = η/2.", num(md.LossFactor[1])),
	}
	return s
}

func runModes(e env) error {
	fl := newFlags("modes", "trestle modes [flags] FILE",
		`Finds the lowest natural frequencies and mode shapes of the stand in FILE
("-": standard input; "demo": the built-in demo), what each mode moves,
its modal damping from the loss factors of materials, joints and feet
(strain-energy weighting, at low, nominal and high loss factors), its
effective mass shares, and checks them against the machine's running
speeds given in the file. --picture draws one mode shape.`,
		"trestle modes stand.toml\ntrestle modes --count 10 --picture mode1.svg demo\ntrestle modes --mode 3 --picture twist.png demo", e)
	var of outputFlags
	of.add(fl)
	count := fl.Int("count", 0, "number of modes; default from the file, else 6")
	level := fl.levelFlag()
	picture := fl.String("picture", "", "draw a mode shape to this `file` (.svg or .png)")
	which := fl.Int("mode", 0, "mode to draw (from 1); default the first that is not a free motion")
	pos, _, err := fl.parseReport(e.args, 1, 1, &of) // modes prints Hz only: --units is read (and checked) but changes nothing
	if err != nil {
		return handled(err)
	}
	if *count < 0 {
		return fmt.Errorf("modes: --count %d: want a positive number", *count)
	}
	l, err := parseLevel(*level)
	if err != nil {
		return err
	}
	picFormat, err := picturePath(*picture, pos[0])
	if err != nil {
		return err
	}
	m, name, dyn, err := loadModel(pos[0], e.stdin)
	if err != nil {
		return err
	}
	if *count > 0 {
		dyn.count = *count
	}
	res, mr, warn := modes(m, l, dyn, []string{})
	if res == nil {
		return fmt.Errorf("%s: %s", name, join(warn))
	}
	rep := ModesCommandReport{Schema: schemaModes, Model: name, Level: l.String(), Modes: mr, Warnings: warn, Cautions: cautions}
	if i := firstElastic(mr); i >= 0 {
		f := mr.Modes[i].FrequencyHz
		rep.FirstFrequencyHz = &f
	}
	if *picture != "" {
		i := *which - 1
		if *which == 0 {
			i = max(firstElastic(mr), 0)
		}
		if i < 0 || i >= len(mr.Modes) {
			return fmt.Errorf("modes: --mode %d: the analysis found modes 1 to %d (raise --count)", *which, len(mr.Modes))
		}
		s := modeScene(m, name, res, i, mr.Modes[i])
		if err := writeAtomic(*picture, pos, func(w io.Writer) error { return writeScene(w, &s, picFormat) }); err != nil {
			return err
		}
		rep.Picture = *picture
	}
	if of.json {
		return writeJSON(e.stdout, rep)
	}
	fmt.Fprintf(e.stdout, "trestle modes: %s (material level %s)\n", name, rep.Level)
	writeWarnings(e.stdout, rep.Warnings)
	heading(e.stdout, "GOVERNING NUMBERS")
	if rep.FirstFrequencyHz != nil {
		fmt.Fprintf(e.stdout, "  first natural frequency  %s Hz  (%s)\n", num(*rep.FirstFrequencyHz), firstMotion(mr))
	} else {
		fmt.Fprintf(e.stdout, "  first natural frequency  —  every mode found is a free motion\n")
	}
	writeModesTable(e.stdout, mr)
	if rep.Picture != "" {
		fmt.Fprintf(e.stdout, "\n  Picture written to %s\n", rep.Picture)
	}
	writeCautions(e.stdout)
	return nil
}

// firstMotion is the motion of the first mode that is not free ("" if
// none, or m is nil).
func firstMotion(m *ModesReport) string {
	if i := firstElastic(m); i >= 0 {
		return m.Modes[i].Motion
	}
	return ""
}

// firstElastic is the index of the first mode of m that is not a free
// motion (-1 if none, or m is nil).
func firstElastic(m *ModesReport) int {
	if m == nil {
		return -1
	}
	for i, md := range m.Modes {
		if !md.RigidBody {
			return i
		}
	}
	return -1
}

// Defaults of the response command.
const (
	defaultBandLow  = 1.0   // [Hz]
	defaultBandHigh = 300.0 // [Hz]
)

func runResponse(e env) error {
	fl := newFlags("response", "trestle response [flags] FILE",
		`Computes the driving-point frequency response at each mount of the stand
in FILE (or each rigid group when there are no mounts), along X, Y and Z:
the motion per unit harmonic force, by modal superposition with modal
(strain-energy) damping and a residual for the modes left out. Prints the
resonance peaks with their dynamic stiffness and the smallest dynamic
stiffness in the band; --csv writes the whole curves. The band comes from
--band, else the file's [response] band, else 1–300 Hz.`,
		"trestle response stand.toml\ntrestle response --band 5-200 --csv frf.csv demo\ntrestle response --damping low --json demo", e)
	var of outputFlags
	of.add(fl)
	band := fl.String("band", "", "frequency band `LOW-HIGH` in Hz")
	level := fl.String("level", "nominal", "material `level` for the stiffness: low, nominal or high")
	damping := fl.String("damping", "nominal", "loss factors at their low, nominal or high end (`level`; low gives the higher peaks)")
	points := fl.Int("points", 0, "frequencies in the band (log spaced); default 400")
	csvOut := fl.String("csv", "", "write the curves to this CSV `file`")
	pos, u, err := fl.parseReport(e.args, 1, 1, &of)
	if err != nil {
		return handled(err)
	}
	l, err := parseLevel(*level)
	if err != nil {
		return err
	}
	dl, err := parseLevel(*damping)
	if err != nil {
		return fmt.Errorf("--damping: %w", err)
	}
	b, err := parseBand("band", *band)
	if err != nil {
		return err
	}
	if *points < 0 {
		return fmt.Errorf("response: --points %d: want a positive number", *points)
	}
	if *csvOut != "" {
		if err := checkNotInput(*csvOut, pos[0]); err != nil {
			return err
		}
	}
	f, err := loadFile(pos[0], e.stdin)
	if err != nil {
		return err
	}
	m, name := f.Model, modelName(f)
	if b.IsZero() {
		b.Low, b.High = f.Dynamics.Band[0], f.Dynamics.Band[1]
	}
	if b.IsZero() {
		b.Low, b.High = defaultBandLow, defaultBandHigh
	}
	places := mountPlaces(m)
	if len(places) == 0 {
		return fmt.Errorf("%s: no mounts or rigid groups to probe; add a mount where the machine sits", name)
	}
	set := &springnet.ResponseSettings{Low: b.Low, High: b.High, Points: *points, Damping: dl,
		Modes: springnet.ModeSettings{Level: l}}
	rep := ResponseReport{Schema: schemaResponse, Model: name, Level: l.String(), BandHz: [2]float64{b.Low, b.High},
		Warnings: []string{}, Cautions: cautions}
	var res *springnet.ModeResult
	var cond *springnet.ConditionError
	for _, p := range places {
		for _, d := range []springnet.DOF{springnet.UX, springnet.UY, springnet.UZ} {
			probe := springnet.Probe{At: p, Dir: d}
			var frf *springnet.FRF
			if res == nil {
				frf, res, err = springnet.Response(m, probe, probe, set)
			} else {
				frf, err = res.Receptance(probe, probe, set)
			}
			if errors.As(err, &cond) && frf != nil {
				rep.Warnings = append(rep.Warnings, "suspect solve: "+err.Error())
			} else if err != nil {
				return explain(name, err)
			}
			rep.Modes = frf.Truncation().Modes
			rep.Probes = append(rep.Probes, probeReport(placeName(m, p), d, frf))
		}
	}
	if *csvOut != "" {
		if err := writeAtomic(*csvOut, pos, func(w io.Writer) error { return writeResponseCSV(w, rep) }); err != nil {
			return err
		}
	}
	if of.json {
		return writeJSON(e.stdout, rep)
	}
	writeResponse(e.stdout, rep, u)
	if *csvOut != "" {
		fmt.Fprintf(e.stdout, "\nCurves written to %s\n", *csvOut)
	}
	writeCautions(e.stdout)
	return nil
}

func probeReport(place string, d springnet.DOF, frf *springnet.FRF) ProbeResponse {
	pr := ProbeResponse{Place: place, Direction: d.String(), Peaks: []PeakReport{}, MinDynamicNPerM: math.Inf(1)}
	for j := 0; j < frf.Len(); j++ {
		h := frf.Magnitude(j)
		pr.FrequencyHz = append(pr.FrequencyHz, frf.Frequency(j))
		pr.ReceptanceMPerN = append(pr.ReceptanceMPerN, h)
		pr.PhaseRad = append(pr.PhaseRad, frf.Phase(j))
		if h > 0 && 1/h < pr.MinDynamicNPerM {
			pr.MinDynamicNPerM, pr.MinDynamicAtHz = 1/h, frf.Frequency(j)
		}
	}
	if frf.Len() > 0 && pr.ReceptanceMPerN[0] > 0 {
		pr.StaticNPerM = 1 / pr.ReceptanceMPerN[0]
	}
	for _, pk := range frf.Peaks() {
		if pk.Magnitude > 0 {
			pr.Peaks = append(pr.Peaks, PeakReport{FrequencyHz: pk.Frequency, ReceptanceMPerN: pk.Magnitude,
				DynamicNPerM: 1 / pk.Magnitude, Mode: pk.Mode + 1})
			if 1/pk.Magnitude < pr.MinDynamicNPerM {
				pr.MinDynamicNPerM, pr.MinDynamicAtHz = 1/pk.Magnitude, pk.Frequency
			}
		}
	}
	if math.IsInf(pr.MinDynamicNPerM, 1) {
		pr.MinDynamicNPerM = 0
	}
	return pr
}

func writeResponse(w io.Writer, r ResponseReport, u unitSystem) {
	k := u.stiffness()
	fmt.Fprintf(w, "trestle response: %s (material level %s)\n", r.Model, r.Level)
	fmt.Fprintf(w, "Driving-point response, %s–%s Hz, %d modes plus a residual for the rest.\n", num(r.BandHz[0]), num(r.BandHz[1]), r.Modes)
	writeWarnings(w, r.Warnings)
	heading(w, fmt.Sprintf("GOVERNING NUMBERS: smallest dynamic stiffness in the band [%s]", k.unit))
	tw := table(w)
	fmt.Fprintf(tw, "  place\tdirection\tstatic\tsmallest dynamic\tat [Hz]\tdrop\n")
	for _, p := range r.Probes {
		drop := "—"
		if p.StaticNPerM > 0 {
			drop = fmt.Sprintf("÷%s", num(p.StaticNPerM/p.MinDynamicNPerM))
		}
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\n", p.Place, p.Direction, k.f(p.StaticNPerM), k.f(p.MinDynamicNPerM), num(p.MinDynamicAtHz), drop)
	}
	tw.Flush()
	heading(w, fmt.Sprintf("RESONANCE PEAKS (dynamic stiffness |F/x| [%s])", k.unit))
	tw = table(w)
	fmt.Fprintf(tw, "  place\tdirection\tf [Hz]\tdynamic stiffness\tmode\n")
	for _, p := range r.Probes {
		for _, pk := range p.Peaks {
			fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%d\n", p.Place, p.Direction, num(pk.FrequencyHz), k.f(pk.DynamicNPerM), pk.Mode)
		}
	}
	tw.Flush()
}

// writeResponseCSV writes one row per frequency: the receptance
// magnitude [m/N] and phase [rad] of every probe.
func writeResponseCSV(w io.Writer, r ResponseReport) error {
	if len(r.Probes) == 0 {
		return nil
	}
	cw := csv.NewWriter(w)
	head := []string{"frequency_hz"}
	for _, p := range r.Probes {
		head = append(head, p.Place+" "+p.Direction+" receptance_m_per_n", p.Place+" "+p.Direction+" phase_rad")
	}
	cw.Write(head)
	g := func(v float64) string { return strconv.FormatFloat(v, 'g', 6, 64) }
	for j, f := range r.Probes[0].FrequencyHz {
		row := []string{g(f)}
		for _, p := range r.Probes {
			row = append(row, g(p.ReceptanceMPerN[j]), g(p.PhaseRad[j]))
		}
		cw.Write(row)
	}
	cw.Flush()
	return cw.Error()
}
