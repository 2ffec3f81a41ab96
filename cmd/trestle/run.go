package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"sort"
	"strings"
	"text/tabwriter"

	"github.com/trestle-go/trestle/materials"
)

// env is what every command gets: its arguments after the command word and
// the standard streams.
type env struct {
	args   []string
	stdin  io.Reader
	stdout io.Writer
	stderr io.Writer
}

// command is one subcommand of trestle.
type command struct {
	name    string
	args    string // argument synopsis, e.g. "FILE"
	summary string // one line for the command list
	run     func(e env) error
}

// commands returns the subcommands in the order the help lists them.
func commands() []command {
	return []command{
		{"demo", "", "analyse the built-in demo stand end to end", runDemo},
		{"analyse", "FILE", "static load cases, mount stiffness, load share, utilisation, buckling", runAnalyse},
		{"modes", "FILE", "natural frequencies, mode shapes and modal damping", runModes},
		{"response", "FILE", "frequency response at the mounts", runResponse},
		{"ranges", "FILE", "governing numbers at low, nominal and high material values", runRanges},
		{"compare", "A B", "governing numbers of two models side by side", runCompare},
		{"ringdown", "CSV", "reduce a tap-test ring-down record to frequency and damping", runRingdown},
		{"materials", "[NAME]", "list the material catalogue, or one material with its sources", runMaterials},
		{"sections", "[SPEC]", "list section shapes, or the properties of one section spec", runSections},
		{"generate", "", "write a model file for a common stand layout", runGenerate},
		{"export", "FILE", "write the stiffness and mass matrices and load vectors (Matrix Market)", runExport},
		{"draw", "FILE", "draw the stand (SVG or PNG): views, deformed shape, utilisation", runDraw},
	}
}

// run is the whole program: it parses args, runs one command and returns
// its error. Nothing in it exits the process.
func run(args []string, stdin io.Reader, stdout, stderr io.Writer) error {
	if len(args) == 0 {
		usage(stderr)
		return errors.New("no command given (try: trestle demo)")
	}
	name := args[0]
	switch name {
	case "-h", "-help", "--help", "help":
		if len(args) > 1 && name == "help" {
			return run([]string{args[1], "--help"}, stdin, stdout, stderr)
		}
		usage(stdout)
		return nil
	case "version", "--version":
		fmt.Fprintln(stdout, "trestle", version)
		return nil
	}
	for _, c := range commands() {
		if c.name == name || (name == "analyze" && c.name == "analyse") {
			return c.run(env{args: args[1:], stdin: stdin, stdout: stdout, stderr: stderr})
		}
	}
	return fmt.Errorf("unknown command %q%s (run trestle --help for the list)", name, suggestCommand(name))
}

// version is the program's version string.
const version = "0.1 (development)"

func usage(w io.Writer) {
	fmt.Fprint(w, `trestle designs machine stands: stiffness at the mounts, load share, member
utilisation, buckling, modes and damping, and tap-test reduction.

Usage: trestle COMMAND [flags] [arguments]

Commands:
`)
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	for _, c := range commands() {
		fmt.Fprintf(tw, "  %s %s\t%s\n", c.name, c.args, c.summary)
	}
	tw.Flush()
	fmt.Fprint(w, `
Every command takes --help. Reports take --json (SI units, schema in
cmd/trestle/SCHEMA.md) and --units si|us. A FILE of "-" reads standard input.

Example:
  trestle demo
  trestle analyse stand.toml --units us
`)
}

// suggestCommand returns `; did you mean "x"?` for the closest command
// name, or "".
func suggestCommand(name string) string {
	best, bestD := "", 3
	for _, c := range commands() {
		if d := materials.EditDistance(strings.ToLower(name), c.name); d < bestD {
			best, bestD = c.name, d
		}
	}
	if best == "" {
		return ""
	}
	return fmt.Sprintf("; did you mean %q?", best)
}

// flags is a command's flag set with its help text.
type flags struct {
	*flag.FlagSet
	synopsis string // "trestle analyse [flags] FILE"
	about    string // what the command does, a few lines
	example  string // one or more example command lines
	w        io.Writer
}

func newFlags(name, synopsis, about, example string, e env) *flags {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	return &flags{FlagSet: fs, synopsis: synopsis, about: about, example: example, w: e.stdout}
}

// printHelp writes the command's help to w.
func (f *flags) printHelp(w io.Writer) {
	fmt.Fprintf(w, "Usage: %s\n\n%s\n", f.synopsis, strings.TrimSpace(f.about))
	var names []string
	f.VisitAll(func(fl *flag.Flag) { names = append(names, fl.Name) })
	sort.Strings(names)
	if len(names) > 0 {
		fmt.Fprintln(w, "\nFlags:")
		tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
		for _, n := range names {
			fl := f.Lookup(n)
			typ, use := flag.UnquoteUsage(fl)
			def := ""
			if fl.DefValue != "" && fl.DefValue != "false" && fl.DefValue != "0" {
				def = fmt.Sprintf(" (default %s)", fl.DefValue)
			}
			fmt.Fprintf(tw, "  --%s %s\t%s%s\n", n, typ, use, def)
		}
		tw.Flush()
	}
	fmt.Fprintf(w, "\nExample:\n%s\n", indent(strings.TrimSpace(f.example), "  "))
}

// errHelp is returned by parse when help was asked for and printed.
var errHelp = errors.New("help shown")

// parse parses args, allowing flags after positional arguments
// (`analyse stand.toml --json`). It returns the positional arguments, or
// errHelp after printing the help for -h/--help. A lone "-" is a
// positional argument (standard input).
func (f *flags) parse(args []string) ([]string, error) {
	var pos []string
	rest := args
	for {
		if err := f.Parse(rest); err != nil {
			if errors.Is(err, flag.ErrHelp) {
				f.printHelp(f.w)
				return nil, errHelp
			}
			return nil, fmt.Errorf("%s: %v (see trestle %s --help)", f.Name(), err, f.Name())
		}
		rest = f.Args()
		if len(rest) == 0 {
			return pos, nil
		}
		if rest[0] == "--" {
			return append(pos, rest[1:]...), nil
		}
		pos = append(pos, rest[0])
		rest = rest[1:]
	}
}

// wantArgs checks the number of positional arguments.
func (f *flags) wantArgs(pos []string, lo, hi int) error {
	if len(pos) < lo || len(pos) > hi {
		what := "no arguments"
		switch {
		case lo == hi && lo == 1:
			what = "one argument"
		case lo == hi && lo > 1:
			what = fmt.Sprintf("%d arguments", lo)
		case hi > 0:
			what = fmt.Sprintf("%d to %d arguments", lo, hi)
		}
		return fmt.Errorf("%s: want %s, got %d (usage: %s)", f.Name(), what, len(pos), f.synopsis)
	}
	return nil
}

// parseWant parses args (see parse) and checks that lo to hi positional
// arguments remain.
func (f *flags) parseWant(args []string, lo, hi int) ([]string, error) {
	pos, err := f.parse(args)
	if err != nil {
		return nil, err
	}
	if err := f.wantArgs(pos, lo, hi); err != nil {
		return nil, err
	}
	return pos, nil
}

// parseReport is parseWant for a report command: it also reads the
// --units of of (added to f with of.add).
func (f *flags) parseReport(args []string, lo, hi int, of *outputFlags) ([]string, unitSystem, error) {
	pos, err := f.parseWant(args, lo, hi)
	if err != nil {
		return nil, 0, err
	}
	u, err := parseUnits(of.units)
	if err != nil {
		return nil, 0, err
	}
	return pos, u, nil
}

// levelFlag adds --level, the material level (read with parseLevel).
func (f *flags) levelFlag() *string {
	return f.String("level", "nominal", "material `level`: low, nominal or high")
}

// outputFlags are the flags every report command shares.
type outputFlags struct {
	json  bool
	units string
}

func (o *outputFlags) add(f *flags) {
	f.BoolVar(&o.json, "json", false, "print the report as JSON (SI units; see cmd/trestle/SCHEMA.md)")
	f.StringVar(&o.units, "units", "si", "`units` of the text report: si (N/µm, mm, MPa, kg) or us (lbf/in, in, psi, lb)")
}

func indent(s, pre string) string {
	lines := strings.Split(s, "\n")
	for i, l := range lines {
		if l != "" {
			lines[i] = pre + l
		}
	}
	return strings.Join(lines, "\n")
}

// handled turns errHelp into success.
func handled(err error) error {
	if errors.Is(err, errHelp) {
		return nil
	}
	return err
}
