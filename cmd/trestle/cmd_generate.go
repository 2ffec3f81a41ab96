package main

import (
	"fmt"
	"io"
	"strconv"
	"strings"

	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/modelfile"
)

func runGenerate(e env) error {
	fl := newFlags("generate", "trestle generate [flags]",
		`Writes a model file for a common stand so nobody types coordinates: a
rectangular frame of legs with stretchers, bracing on chosen faces and a
rigid or beam top, or masonry / cast piers under a rigid slab; feet under
each leg; optionally a machine mass and a top load. Edit the file, then
run trestle analyse on it. Lengths are mm (--units us: in) unless a unit
is given ("1.2m", "48in"); foot stiffness N/µm (us: lbf/in); mass kg (lb);
force N (lbf).`,
		`trestle generate --legs 2x2 --width 1200 --depth 600 --height 800 \
    --section "square-tube 50x3 mm" --stretchers 150 --brace back,left,right \
    --feet z=50,h=5 --loose --machine-mass 350 --out stand.toml
trestle generate --kind piers --legs 2x2 --width 1.5m --depth 0.8m --height 0.6m \
    --material "masonry concrete grouted" --section "block 8in grouted" --out base.toml`, e)
	units := fl.String("units", "si", "default `units` of plain numbers in flags and of the written file: si or us")
	kind := fl.String("kind", "frame", "`kind`: frame (legs, stretchers, bracing) or piers (under a rigid slab)")
	legs := fl.String("legs", "2x2", "legs along the width and the depth, `NxM`")
	width := fl.String("width", "", "distance between the outer leg centre lines along X (required)")
	depth := fl.String("depth", "", "the same along Y (required)")
	height := fl.String("height", "", "floor to top (required)")
	material := fl.String("material", "steel S235", "material of every member (catalogue name)")
	section := fl.String("section", "", "leg or pier section spec, e.g. \"square-tube 50x3 mm\" (required)")
	stretchers := fl.String("stretchers", "", "stretcher heights above the floor, comma-separated")
	stretcherSection := fl.String("stretcher-section", "", "stretcher section spec; default the leg section")
	brace := fl.String("brace", "", "faces to brace: front, back, left, right (comma-separated)")
	pattern := fl.String("brace-pattern", "single", "`pattern`: single diagonal or cross (X) in each panel")
	braceSection := fl.String("brace-section", "", "brace section spec; default the leg section")
	top := fl.String("top", "rigid", "`kind`: rigid (a plate or machine bed) or beams (rails between leg heads)")
	topSection := fl.String("top-section", "", "rail section of a beam top; default the leg section")
	feet := fl.String("feet", "", "foot stiffness, e.g. `z=50,h=5` (vertical, horizontal); none: legs fixed to the floor")
	loose := fl.Bool("loose", false, "feet carry compression only (they lift off)")
	machineMass := fl.String("machine-mass", "", "machine mass on the top")
	machineHeight := fl.String("machine-height", "", "machine centre of mass above the top")
	topLoad := fl.String("top-load", "", "downward force at the centre of the top, as its own load case")
	title := fl.String("title", "", "title written into the file")
	out := fl.String("out", "", "model `file` to write; default standard output")
	replace := fl.Bool("replace", false, "overwrite --out if it exists (it may hold your edits)")
	if _, err := fl.parseWant(e.args, 0, 0); err != nil {
		return handled(err)
	}
	if err := checkNewFile(*out, *replace); err != nil {
		return err
	}
	u, err := parseUnits(*units)
	if err != nil {
		return err
	}
	l := modelfile.Layout{Title: *title, Material: *material, Section: *section,
		StretcherSection: *stretcherSection, BraceSection: *braceSection, TopSection: *topSection,
		CompressionOnly: *loose}
	switch strings.ToLower(*kind) {
	case "frame":
		l.Kind = modelfile.Frame
	case "piers", "pier":
		l.Kind = modelfile.Piers
	default:
		return fmt.Errorf("--kind %q: want frame or piers", *kind)
	}
	nx, ny, ok := strings.Cut(strings.ToLower(*legs), "x")
	if l.LegsX, err = strconv.Atoi(strings.TrimSpace(nx)); !ok || err != nil {
		return fmt.Errorf("--legs %q: want NxM, e.g. 2x3", *legs)
	}
	if l.LegsY, err = strconv.Atoi(strings.TrimSpace(ny)); err != nil {
		return fmt.Errorf("--legs %q: want NxM, e.g. 2x3", *legs)
	}
	for _, d := range []struct {
		name, val string
		dst       *float64
	}{{"width", *width, &l.Width}, {"depth", *depth, &l.Depth}, {"height", *height, &l.Height}} {
		if d.val == "" {
			return fmt.Errorf("generate: --%s is required", d.name)
		}
		if *d.dst, err = parseQuantity(d.name, d.val, u.length(), lengthUnits); err != nil {
			return err
		}
	}
	if *section == "" {
		return fmt.Errorf("generate: --section is required, e.g. --section \"square-tube 50x3 mm\"")
	}
	for _, s := range parseList(*stretchers) {
		h, err := parseQuantity("stretchers", s, u.length(), lengthUnits)
		if err != nil {
			return err
		}
		l.Stretchers = append(l.Stretchers, h)
	}
	var pat modelfile.Pattern
	switch strings.ToLower(*pattern) {
	case "single":
		pat = modelfile.Single
	case "cross", "x":
		pat = modelfile.Cross
	default:
		return fmt.Errorf("--brace-pattern %q: want single or cross", *pattern)
	}
	faces := map[string]modelfile.Face{"front": modelfile.Front, "back": modelfile.Back, "left": modelfile.Left, "right": modelfile.Right}
	for _, f := range parseList(*brace) {
		face, ok := faces[strings.ToLower(f)]
		if !ok {
			return fmt.Errorf("--brace: unknown face %q (use front, back, left, right)", f)
		}
		l.Bracing = append(l.Bracing, modelfile.Bracing{Face: face, Pattern: pat})
	}
	switch strings.ToLower(*top) {
	case "rigid":
		l.Top = modelfile.RigidTop
	case "beams", "beam", "rails":
		l.Top = modelfile.BeamTop
	default:
		return fmt.Errorf("--top %q: want rigid or beams", *top)
	}
	if *feet != "" {
		if l.Feet, err = parseFeet(*feet, u); err != nil {
			return err
		}
	} else if *loose {
		return fmt.Errorf("generate: --loose needs --feet (loose feet need a stiffness)")
	}
	if *machineMass != "" {
		if l.MachineMass, err = parseQuantity("machine-mass", *machineMass, u.mass(), massUnits); err != nil {
			return err
		}
	}
	if *machineHeight != "" {
		if l.MachineHeight, err = parseQuantity("machine-height", *machineHeight, u.length(), lengthUnits); err != nil {
			return err
		}
	}
	if *topLoad != "" {
		if l.TopLoad, err = parseQuantity("top-load", *topLoad, u.force(), forceUnits); err != nil {
			return err
		}
	}
	if u == usUnits {
		l.Units = modelfile.Units{Length: "in", Force: "lbf", Mass: "lb"}
	} else {
		l.Units = modelfile.Units{Length: "mm", Force: "N", Mass: "kg"}
	}
	f, err := modelfile.Generate(l)
	if err != nil {
		return err
	}
	if *out == "" {
		return modelfile.Write(e.stdout, f)
	}
	if err := writeAtomic(*out, nil, func(w io.Writer) error { return modelfile.Write(w, f) }); err != nil {
		return err
	}
	m := f.Model
	fmt.Fprintf(e.stdout, "wrote %s: %d nodes, %d elements, %d load cases. Next: trestle analyse %s\n",
		*out, m.NumNodes(), m.NumElements(), m.NumCases(), *out)
	return nil
}

// parseFeet reads "z=50,h=5" (also x=, y=, rx=, ry=, rz=): stiffness per
// direction in N/µm (us: lbf/in) unless a unit is given; h sets x and y.
// Rotational values are N·m/rad.
func parseFeet(s string, u unitSystem) (springnet.Stiffness6, error) {
	var k springnet.Stiffness6
	for _, item := range parseList(s) {
		key, val, ok := strings.Cut(item, "=")
		if !ok {
			return k, fmt.Errorf("--feet %q: want direction=stiffness pairs, e.g. z=50,h=5", s)
		}
		key = strings.ToLower(strings.TrimSpace(key))
		if strings.HasPrefix(key, "r") {
			v, unit, err := splitNumber(val)
			if err != nil || unit != "" && unit != "N*m/rad" && unit != "N·m/rad" {
				return k, fmt.Errorf("--feet %s: rotational stiffness is a number in N·m/rad", item)
			}
			switch key {
			case "rx":
				k.RX = v
			case "ry":
				k.RY = v
			case "rz":
				k.RZ = v
			default:
				return k, fmt.Errorf("--feet: unknown direction %q (x, y, z, h, rx, ry, rz)", key)
			}
			continue
		}
		v, err := parseQuantity("feet", val, u.stiffness(), stiffnessUnits)
		if err != nil {
			return k, err
		}
		switch key {
		case "x":
			k.X = v
		case "y":
			k.Y = v
		case "z":
			k.Z = v
		case "h":
			k.X, k.Y = v, v
		default:
			return k, fmt.Errorf("--feet: unknown direction %q (x, y, z, h, rx, ry, rz)", key)
		}
	}
	return k, nil
}
