// Command trestle designs and checks machine stands from the command line.
// It is a thin layer over the trestle library: it parses flags and files,
// calls springnet (statics, mount stiffness, member checks, buckling,
// modes, frequency response), springnet/modelfile (model files),
// springnet/ringdown (tap tests) and springnet/draw (pictures), and prints.
//
// # Commands
//
//	trestle demo                 the full analysis of the built-in demo stand
//	trestle analyse FILE         load cases, mount stiffness, load share, utilisation,
//	                             buckling, natural modes
//	trestle modes FILE           natural frequencies, modal damping, running-speed check
//	trestle response FILE        driving-point frequency response at the mounts
//	trestle ranges FILE          governing numbers at low, nominal and high material values
//	trestle compare A B          governing numbers of two models side by side
//	trestle ringdown CSV         tap-test record → frequency, ζ, δ, η, Q, ψ with uncertainties
//	trestle materials [NAME]     the material catalogue, or one material with its sources
//	trestle sections [SPEC]      section shapes, or the properties of one section
//	trestle generate             a model file for a common layout
//	trestle export FILE          K, M and load vectors in Matrix Market form
//	trestle draw FILE            SVG or PNG: four views, deflection or mode shape, colours
//
// Every command takes --help, with an example. FILE may be "-" (standard
// input) or "demo" (the built-in demo model). The model file format is
// described in springnet/modelfile/doc.go.
//
// # Output
//
// Text reports are aligned tables, governing numbers first, then
// warnings (lifted feet, feet held sideways at the point of lifting,
// uplift, tipping, overstress, resonance), then
// details, and they end with the cautions. A case under which the stand
// tips over (no stable set of feet stays in contact) is named first
// among the warnings and has no results; the other cases stand. ranges
// runs one springnet.Sweep (one Solver reused over the levels). --units si prints N/µm, mm,
// µm, N, MPa, kg; --units us prints lbf/in, in, lbf, psi, lb.
//
// --json prints the same report as JSON, always in SI base units with the
// unit in each field name, and a "schema" field naming the report and its
// version ("trestle.analysis/1"). SCHEMA.md in this folder documents every
// report; the Go structs in schema.go are the definition.
//
// # Files
//
// An input is never overwritten: an output path that names an input is
// refused. Outputs (pictures, model files, matrices, CSV) are written to a
// temporary file in the same folder and renamed into place, so a failed
// run leaves any earlier file as it was. `generate` refuses to write over
// an existing model file (it may hold the user's edits) unless given
// --replace.
//
// # Errors
//
// Every error is printed to standard error as "trestle: ..." and the exit
// code is 1. Errors from files name the file and line (the model-file
// reader's and ring-down reader's messages); a model that can move
// freely names the node and direction.
//
// # Tests
//
// go test ./cmd/trestle runs the commands in-process through run. The
// golden reports in testdata/*.golden are rewritten with
// go test ./cmd/trestle -update; their numbers for testdata/four-legs.toml
// are checked against hand calculations in TestFourLegsHandCheck,
// TestModesHandCheck and TestResponseHandCheck.
package main
