package main

import (
	"fmt"
	"io"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
)

func runDemo(e env) error {
	fl := newFlags("demo", "trestle demo [flags]",
		`Analyses the demo stand built into trestle (a welded steel bench for a
small lathe on four loose levelling feet) and prints the full report:
governing numbers, mount stiffness, load share, member forces and
utilisation, checks and cautions. Works from any folder.`,
		"trestle demo\ntrestle demo --units us\ntrestle demo --picture demo.svg\ntrestle demo --json > demo.json", e)
	var of outputFlags
	of.add(fl)
	picture := fl.String("picture", "", "also draw the case with the largest displacement to this `file` (.svg or .png)")
	_, u, err := fl.parseReport(e.args, 0, 0, &of)
	if err != nil {
		return handled(err)
	}
	return printAnalysis(e, demoArg, materials.Nominal, of.json, u, *picture, nil)
}

func runAnalyse(e env) error {
	fl := newFlags("analyse", "trestle analyse [flags] FILE",
		`Analyses the stand in the model file FILE ("-": standard input; "demo":
the built-in demo): every load case and combination, the stiffness at
each mount, the load share between feet, lift-off and tipping margin,
member forces and utilisation, Euler margins, whole-stand buckling and
the natural modes with the running-speed check. Governing numbers come
first, warnings next, details after.`,
		"trestle analyse stand.toml\ntrestle analyse --level low --units us stand.toml\ncat stand.toml | trestle analyse --json -", e)
	var of outputFlags
	of.add(fl)
	level := fl.levelFlag()
	picture := fl.String("picture", "", "also draw the case with the largest displacement to this `file` (.svg or .png)")
	pos, u, err := fl.parseReport(e.args, 1, 1, &of)
	if err != nil {
		return handled(err)
	}
	l, err := parseLevel(*level)
	if err != nil {
		return err
	}
	return printAnalysis(e, pos[0], l, of.json, u, *picture, pos)
}

// analyseFile reads the model file (as loadModel) and analyses it at
// level l.
func analyseFile(file string, stdin io.Reader, l materials.Level) (*analysed, error) {
	m, name, dyn, err := loadModel(file, stdin)
	if err != nil {
		return nil, err
	}
	return analyse(m, name, l, dyn)
}

// printAnalysis analyses the model file at level l and prints its report,
// as JSON if asked, else as text in units u; with a picture path it first
// draws the case with the largest displacement (see reportPicture).
func printAnalysis(e env, file string, l materials.Level, asJSON bool, u unitSystem, picture string, inputs []string) error {
	a, err := analyseFile(file, e.stdin, l)
	if err != nil {
		return err
	}
	if err := reportPicture(e, a, picture, inputs); err != nil {
		return err
	}
	if asJSON {
		return writeJSON(e.stdout, a.report)
	}
	writeAnalysis(e.stdout, a.report, u)
	return nil
}

// reportPicture draws the case with the largest displacement of a to
// path (nothing when path is ""), refusing to overwrite any of inputs. It
// says where it wrote on standard error, so that standard output stays
// the report (or its JSON).
func reportPicture(e env, a *analysed, path string, inputs []string) error {
	if path == "" {
		return nil
	}
	format, err := pictureFormat(path, "")
	if err != nil {
		return err
	}
	c := springnet.CaseID(0)
	if id, ok := a.model.Case(a.report.Governing.MaxDisplacementCase); ok {
		c = id
	}
	s := sceneOf(a, c, 0)
	if err := writeAtomic(path, inputs, func(w io.Writer) error { return writeScene(w, &s, format) }); err != nil {
		return err
	}
	fmt.Fprintf(e.stderr, "trestle: picture of case %q written to %s\n", a.model.CaseName(c), path)
	return nil
}
