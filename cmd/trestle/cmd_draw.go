package main

import (
	"fmt"
	"io"
	"math"
	"path/filepath"
	"strings"

	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/draw"
)

// sceneOf builds the picture of an analysed model: the geometry, the
// deflection of case c magnified, members coloured by utilisation.
func sceneOf(a *analysed, c springnet.CaseID, scale float64) draw.Scene {
	m := a.model
	s := draw.FromModel(m)
	cr := a.static.Case(c)
	for i := range s.Nodes {
		d := cr.Displacement(springnet.NodeID(i))
		s.Nodes[i].Move = draw.Point{X: d.UX, Y: d.UY, Z: d.UZ}
	}
	for i := range s.Mounts {
		d := cr.At(springnet.MountID(i))
		s.Mounts[i].Move = draw.Point{X: d.UX, Y: d.UY, Z: d.UZ}
	}
	// Members in FromModel order are the report's members: every element
	// that is not a foot, in element order.
	rm := a.report.Cases[c].Members
	for k := range s.Members {
		if k < len(rm) && rm[k].Name == s.Members[k].Name && rm[k].Rated {
			s.Members[k].Value, s.Members[k].Rated = rm[k].Utilisation, true
		}
	}
	s.Title = fmt.Sprintf("%s — case %q", a.report.Model, cr.Name())
	s.Colours = draw.Colours{Name: "utilisation", Max: 1, Percent: true}
	s.Shape = fmt.Sprintf("deflection under %q", cr.Name())
	s.Scale = scale
	s.Notes = []string{
		"Linear elastic, small-displacement model. Check anchoring, tipping, floor capacity and local codes; defer to licensed engineering practice.",
	}
	if a.report.Cases[c].MaxUtilisationMember != "" {
		s.Notes = append(s.Notes, fmt.Sprintf("Highest utilisation in this case: %s, %s (fibre stress over strength; not a code check).",
			a.report.Cases[c].MaxUtilisationMember, pct(a.report.Cases[c].MaxUtilisation)))
	}
	return s
}

// pictureFormat returns "svg" or "png" from a file name's extension.
func pictureFormat(path, override string) (string, error) {
	f := strings.ToLower(override)
	if f == "" {
		f = strings.TrimPrefix(strings.ToLower(filepath.Ext(path)), ".")
	}
	switch f {
	case "svg", "png":
		return f, nil
	}
	return "", fmt.Errorf("picture %s: say .svg or .png (or --format svg|png)", path)
}

// picturePath checks a --picture path before any work is done: its
// format ("svg" or "png" by the extension; "" when path is "") and that
// it does not name the input.
func picturePath(path, input string) (string, error) {
	if path == "" {
		return "", nil
	}
	format, err := pictureFormat(path, "")
	if err != nil {
		return "", err
	}
	if err := checkNotInput(path, input); err != nil {
		return "", err
	}
	return format, nil
}

// writeScene writes s as SVG or PNG.
func writeScene(w io.Writer, s *draw.Scene, format string) error {
	if format == "png" {
		return s.PNG(w)
	}
	return s.SVG(w)
}

func runDraw(e env) error {
	fl := newFlags("draw", "trestle draw [flags] FILE",
		`Draws the stand in FILE ("-": standard input; "demo": the built-in demo)
in front, side, top and isometric views, with the deflection of one load
case magnified over the unloaded outline and members coloured by
utilisation (or, with --mode, a natural mode shape with members coloured
by their share of its strain energy), and writes it as SVG or PNG (by
the extension of --out).
Feet, supports and mounts are marked and named; the legend states the
magnification.`,
		"trestle draw --out stand.svg stand.toml\ntrestle draw --case \"weight and cutting\" --out demo.png demo\ntrestle draw --mode 1 --out sway.svg demo", e)
	out := fl.String("out", "", "picture `file` to write (.svg or .png); required")
	format := fl.String("format", "", "`format`: svg or png; default from the --out extension")
	caseName := fl.String("case", "", "load case to show; default the first")
	mode := fl.Int("mode", 0, "draw natural mode `N` (from 1) instead of a load case, coloured by strain-energy share")
	scale := fl.Float64("scale", 0, "displacement magnification; 0 chooses one")
	level := fl.levelFlag()
	labels := fl.Bool("labels", false, "write every node's name (default: feet, supports and mounts only)")
	pos, err := fl.parseWant(e.args, 1, 1)
	if err != nil {
		return handled(err)
	}
	if *out == "" {
		return fmt.Errorf("draw: say where to write the picture with --out FILE.svg or FILE.png")
	}
	fmtName, err := pictureFormat(*out, *format)
	if err != nil {
		return err
	}
	if !(*scale >= 0) || math.IsInf(*scale, 0) {
		return fmt.Errorf("draw: --scale %g: want a finite factor >= 0", *scale)
	}
	if err := checkNotInput(*out, pos[0]); err != nil {
		return err
	}
	l, err := parseLevel(*level)
	if err != nil {
		return err
	}
	m, name, dyn, err := loadModel(pos[0], e.stdin)
	if err != nil {
		return err
	}
	if *mode < 0 || (*mode > 0 && *caseName != "") {
		return fmt.Errorf("draw: --mode %d: give a mode number from 1, or --case, not both", *mode)
	}
	if *mode > 0 {
		dyn.count = max(dyn.count, *mode)
		res, mr, warn := modes(m, l, dyn, nil)
		if res == nil {
			return fmt.Errorf("%s: %s", name, join(warn))
		}
		if *mode > len(mr.Modes) {
			return fmt.Errorf("draw: --mode %d: the model has %d modes", *mode, len(mr.Modes))
		}
		s := modeScene(m, name, res, *mode-1, mr.Modes[*mode-1])
		s.Scale = *scale
		labelAll(&s, *labels)
		if err := writeAtomic(*out, pos, func(w io.Writer) error { return writeScene(w, &s, fmtName) }); err != nil {
			return err
		}
		fmt.Fprintf(e.stdout, "wrote %s (%s, mode %d at %s Hz)\n", *out, fmtName, *mode, num(mr.Modes[*mode-1].FrequencyHz))
		return nil
	}
	a, err := analyse(m, name, l, dyn)
	if err != nil {
		return err
	}
	c, err := findCase(m, *caseName)
	if err != nil {
		return err
	}
	if cr := a.report.Cases[c]; cr.Tipped {
		return fmt.Errorf("draw: %s: the stand tips over under case %q (lifted: %s): it has no deflection to draw",
			name, cr.Name, join(cr.TippedLifted))
	}
	s := sceneOf(a, c, *scale)
	labelAll(&s, *labels)
	if err := writeAtomic(*out, pos, func(w io.Writer) error { return writeScene(w, &s, fmtName) }); err != nil {
		return err
	}
	fmt.Fprintf(e.stdout, "wrote %s (%s, case %q, displacements ×%.3g)\n", *out, fmtName, m.CaseName(c), effectiveScale(&s))
	return nil
}

func effectiveScale(s *draw.Scene) float64 {
	if s.Scale > 0 {
		return s.Scale
	}
	return s.AutoScale()
}

// findCase returns the case named name, or the first case for "".
func findCase(m *springnet.Model, name string) (springnet.CaseID, error) {
	if name == "" {
		if m.NumCases() == 0 {
			return 0, fmt.Errorf("the model has no load cases")
		}
		return 0, nil
	}
	if c, ok := m.Case(name); ok {
		return c, nil
	}
	var names []string
	for i := 0; i < m.NumCases(); i++ {
		names = append(names, fmt.Sprintf("%q", m.CaseName(springnet.CaseID(i))))
	}
	return 0, fmt.Errorf("no load case %q; the model has %s", name, strings.Join(names, ", "))
}

// labelAll marks every node of s for a label when all is true.
func labelAll(s *draw.Scene, all bool) {
	if !all {
		return
	}
	for i := range s.Nodes {
		s.Nodes[i].Label = true
	}
}
