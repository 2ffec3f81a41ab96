package main

import (
	"github.com/trestle-go/trestle/materials"
)

func runDemo(e env) error {
	fl := newFlags("demo", "trestle demo [flags]",
		`Analyses the demo stand built into trestle (a welded steel bench for a
small lathe on four loose levelling feet) and prints the full report:
governing numbers, mount stiffness, load share, member forces and
utilisation, checks and cautions. Works from any folder.`,
		"trestle demo\ntrestle demo --units us\ntrestle demo --json > demo.json", e)
	var of outputFlags
	of.add(fl)
	pos, err := fl.parse(e.args)
	if err != nil {
		return handled(err)
	}
	if err := fl.wantArgs(pos, 0, 0); err != nil {
		return err
	}
	u, err := parseUnits(of.units)
	if err != nil {
		return err
	}
	m, name, dyn, err := loadModel(demoArg, e.stdin)
	if err != nil {
		return err
	}
	a, err := analyse(m, name, materials.Nominal, dyn)
	if err != nil {
		return err
	}
	if of.json {
		return writeJSON(e.stdout, a.report)
	}
	writeAnalysis(e.stdout, a.report, u)
	return nil
}

func runAnalyse(e env) error {
	fl := newFlags("analyse", "trestle analyse [flags] FILE",
		`Analyses the stand in the model file FILE ("-": standard input): every load
case and combination, the stiffness at each mount, the load share between
feet, lift-off and tipping margin, member forces and utilisation.
Governing numbers come first, details after.`,
		"trestle analyse stand.toml\ntrestle analyse --level low --units us stand.toml\ncat stand.toml | trestle analyse --json -", e)
	var of outputFlags
	of.add(fl)
	level := fl.String("level", "nominal", "material values: `low`, nominal or high")
	pos, err := fl.parse(e.args)
	if err != nil {
		return handled(err)
	}
	if err := fl.wantArgs(pos, 1, 1); err != nil {
		return err
	}
	u, err := parseUnits(of.units)
	if err != nil {
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
	a, err := analyse(m, name, l, dyn)
	if err != nil {
		return err
	}
	if of.json {
		return writeJSON(e.stdout, a.report)
	}
	writeAnalysis(e.stdout, a.report, u)
	return nil
}
