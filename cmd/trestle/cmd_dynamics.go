package main

import (
	"errors"
	"fmt"
)

// errNoModes is returned by the dynamics commands until springnet offers
// a modal analysis.
var errNoModes = errors.New("springnet has no modal analysis in this build yet (modes, modal damping and frequency response are being added); run trestle analyse for the static results")

func runModes(e env) error {
	fl := newFlags("modes", "trestle modes [flags] FILE",
		`Finds the lowest natural frequencies and mode shapes of the stand in FILE,
with the modal damping of each mode from the loss factors of its
materials, joints and feet (strain-energy weighting), and checks them
against the machine's running speeds from the file.`,
		"trestle modes stand.toml\ntrestle modes --count 6 --picture mode1.svg demo", e)
	var of outputFlags
	of.add(fl)
	fl.Int("count", 0, "number of modes; default from the file, else 6")
	fl.String("picture", "", "draw the first mode shape to this `file` (.svg or .png)")
	pos, err := fl.parse(e.args)
	if err != nil {
		return handled(err)
	}
	if err := fl.wantArgs(pos, 1, 1); err != nil {
		return err
	}
	if _, err := parseUnits(of.units); err != nil {
		return err
	}
	if _, _, err := loadModel(pos[0], e.stdin); err != nil {
		return err
	}
	return fmt.Errorf("modes: %w", errNoModes)
}

func runResponse(e env) error {
	fl := newFlags("response", "trestle response [flags] FILE",
		`Computes the frequency response at the mounts of the stand in FILE: the
dynamic compliance (motion per unit force) over the band given in the file
or by --band, with modal damping, and marks the machine's excitation
frequencies.`,
		"trestle response stand.toml\ntrestle response --band 5-200 --json demo", e)
	var of outputFlags
	of.add(fl)
	fl.String("band", "", "frequency band `LOW-HIGH` in Hz; default from the file")
	pos, err := fl.parse(e.args)
	if err != nil {
		return handled(err)
	}
	if err := fl.wantArgs(pos, 1, 1); err != nil {
		return err
	}
	if _, err := parseUnits(of.units); err != nil {
		return err
	}
	if _, _, err := loadModel(pos[0], e.stdin); err != nil {
		return err
	}
	return fmt.Errorf("response: %w", errNoModes)
}
