package main

import (
	"bytes"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet/ringdown"
)

// parseBand reads "LOW-HIGH" or "LOW:HIGH" (two numbers).
func parseBand(flagName, s string) (ringdown.Band, error) {
	if s == "" {
		return ringdown.Band{}, nil
	}
	sep := strings.IndexAny(s[1:], "-:,")
	if sep < 0 {
		return ringdown.Band{}, fmt.Errorf("--%s %q: want two numbers, LOW-HIGH", flagName, s)
	}
	sep++
	lo, err1 := strconv.ParseFloat(strings.TrimSpace(s[:sep]), 64)
	hi, err2 := strconv.ParseFloat(strings.TrimSpace(s[sep+1:]), 64)
	if err1 != nil || err2 != nil || math.IsNaN(lo) || math.IsNaN(hi) || math.IsInf(lo, 0) || math.IsInf(hi, 0) || !(lo < hi) {
		return ringdown.Band{}, fmt.Errorf("--%s %q: want two finite numbers LOW-HIGH with LOW < HIGH", flagName, s)
	}
	return ringdown.Band{Low: lo, High: hi}, nil
}

func estimate(e ringdown.Estimate) Estimate { return Estimate{Value: e.Value, Uncertainty: e.Err} }

// pm formats a value with its uncertainty: the uncertainty to two
// significant figures and the value to the same decimal place.
func pm(e Estimate) string {
	if !(e.Uncertainty > 0) {
		return num(e.Value)
	}
	d := 1 - int(math.Floor(math.Log10(e.Uncertainty)))
	if d < 0 {
		d = 0
	}
	if d > 12 {
		d = 12
	}
	return strconv.FormatFloat(e.Value, 'f', d, 64) + " ± " + strconv.FormatFloat(e.Uncertainty, 'f', d, 64)
}

func runRingdown(e env) error {
	fl := newFlags("ringdown", "trestle ringdown [flags] CSV",
		`Reduces a tap-test ring-down record (CSV or TSV from a data logger or a
phone; "-": standard input) to the natural frequency and damping of its
dominant mode, or of the mode inside --band or near --centre: damped and
undamped frequency, damping ratio ζ, log decrement δ, loss factor η,
quality factor Q and specific damping capacity ψ, each with its standard
uncertainty, and how well the four methods (peaks, analytic envelope,
damped-sine fit, half-power bandwidth) agree. --picture draws the record
with the fitted envelope and the spectrum; --material prints a model-file
material entry carrying the measured loss factor, to feed the test back
into the model.`,
		"trestle ringdown tap.csv\ntrestle ringdown --column az --band 15-30 --picture tap.svg tap.csv\ntrestle ringdown --material \"steel S235\" tap.csv\ntrestle ringdown --rate 2000 --json samples.txt", e)
	var of outputFlags
	of.add(fl)
	column := fl.String("column", "", "signal column by header name or 1-based number; default: the liveliest")
	magnitude := fl.Bool("magnitude", false, "use √(x²+y²+z²) of three axis columns")
	rate := fl.Float64("rate", 0, "sample rate [Hz] when the file has no time column")
	timeUnit := fl.String("time-unit", "", "`unit` of the time column: s, ms, us or ns; default from the header")
	band := fl.String("band", "", "isolate the mode inside `LOW-HIGH` Hz")
	centre := fl.Float64("centre", 0, "isolate the mode nearest this frequency [Hz]")
	window := fl.String("window", "", "fit window `START-END` in seconds of record time; default automatic")
	picture := fl.String("picture", "", "write a picture of the record and spectrum to this `file` (.svg or .png)")
	material := fl.String("material", "", "print a model-file material with this catalogue `name` and the measured loss factor")
	pos, err := fl.parseWant(e.args, 1, 1)
	if err != nil {
		return handled(err)
	}
	if _, err := parseUnits(of.units); err != nil {
		return err
	}
	opt := ringdown.ReadOptions{Name: displayName(pos[0]), Column: *column, Magnitude: *magnitude, SampleRate: *rate}
	switch strings.ToLower(*timeUnit) {
	case "":
	case "s":
		opt.TimeUnit = 1
	case "ms":
		opt.TimeUnit = 1e-3
	case "us", "µs":
		opt.TimeUnit = 1e-6
	case "ns":
		opt.TimeUnit = 1e-9
	default:
		return fmt.Errorf("--time-unit %q: want s, ms, us or ns", *timeUnit)
	}
	var set ringdown.Settings
	if set.Band, err = parseBand("band", *band); err != nil {
		return err
	}
	win, err := parseBand("window", *window)
	if err != nil {
		return err
	}
	set.Window = ringdown.Span{Start: win.Low, End: win.High}
	set.Centre = *centre
	picFormat, err := picturePath(*picture, pos[0])
	if err != nil {
		return err
	}
	var base materials.Material
	if *material != "" {
		if base, err = materials.Lookup(*material); err != nil {
			return err
		}
	}
	data, err := readInput(pos[0], e.stdin)
	if err != nil {
		return err
	}
	rec, err := ringdown.Read(bytes.NewReader(data), opt)
	if err != nil {
		return err
	}
	res, err := ringdown.Reduce(rec, &set)
	if err != nil {
		return err
	}
	rep := ringdownReport(pos[0], rec, res)
	if *material != "" {
		rep.ModelMaterial = materialSnippet(base, res.LossFactor())
	}
	if *picture != "" {
		f := ringdown.SVG
		if picFormat == "png" {
			f = ringdown.PNG
		}
		if err := writeAtomic(*picture, pos, func(w io.Writer) error { return res.WritePicture(w, f) }); err != nil {
			return err
		}
		rep.Picture = *picture
	}
	if of.json {
		return writeJSON(e.stdout, rep)
	}
	writeRingdown(e.stdout, rep)
	return nil
}

func ringdownReport(name string, rec ringdown.Record, res ringdown.Result) RingdownReport {
	w := res.Window()
	ag := res.Agreement()
	rep := RingdownReport{Schema: schemaRingdown, Input: displayName(name), Column: rec.Column,
		SampleRateHz: rec.Rate, Samples: rec.Len(),
		DampedFrequency: estimate(res.DampedFrequency()), NaturalFrequency: estimate(res.NaturalFrequency()),
		Ratio: estimate(res.Ratio()), LogDecrement: estimate(res.LogDecrement()), LossFactor: estimate(res.Loss()),
		Q: estimate(res.Q()), SpecificCapacity: estimate(res.SpecificCapacity()),
		WindowS: [2]float64{w.Start, w.End}, Cycles: w.Cycles, Nominal: res.Nominal(),
		AgreementFactor: ag.Factor, AgreementLimit: ag.Limit, Agree: ag.Agree,
		Warnings: res.Warnings(), Notes: append([]string(nil), rec.Notes...)}
	if rep.Warnings == nil {
		rep.Warnings = []string{}
	}
	if rep.Notes == nil {
		rep.Notes = []string{}
	}
	for _, m := range res.Methods() {
		rep.Methods = append(rep.Methods, MethodReport{Method: m.Method, OK: m.OK,
			DampedFrequency: estimate(m.DampedFrequency), Ratio: estimate(m.Ratio), Cycles: m.Cycles, Note: m.Note})
	}
	return rep
}

// ringdownCautions end the ring-down report.
var ringdownCautions = []string{
	"A ring-down measures one mode of the stand as built and mounted; damping varies with amplitude, bolt preload and temperature.",
}

func writeRingdown(w io.Writer, r RingdownReport) {
	dur := 0.0
	if r.SampleRateHz > 0 && r.Samples > 1 {
		dur = float64(r.Samples-1) / r.SampleRateHz
	}
	fmt.Fprintf(w, "Ring-down of %s: column %q, %d samples at %s Hz (%s s)\n", r.Input, r.Column, r.Samples, num(r.SampleRateHz), num(dur))
	if !r.Agree || len(r.Warnings) > 0 {
		heading(w, "WARNINGS")
		for _, x := range r.Warnings {
			fmt.Fprintf(w, "  ! %s\n", x)
		}
	}
	heading(w, "MODE (value ± standard uncertainty)")
	tw := table(w)
	fmt.Fprintf(tw, "  natural frequency fn\t%s Hz\n", pm(r.NaturalFrequency))
	fmt.Fprintf(tw, "  damped frequency fd\t%s Hz\n", pm(r.DampedFrequency))
	fmt.Fprintf(tw, "  damping ratio ζ\t%s\n", pm(r.Ratio))
	fmt.Fprintf(tw, "  log decrement δ\t%s\n", pm(r.LogDecrement))
	fmt.Fprintf(tw, "  loss factor η\t%s\n", pm(r.LossFactor))
	fmt.Fprintf(tw, "  quality factor Q\t%s\n", pm(r.Q))
	fmt.Fprintf(tw, "  specific damping capacity ψ\t%s\n", pm(r.SpecificCapacity))
	fmt.Fprintf(tw, "  fit window\t%s – %s s, %s cycles\n", num(r.WindowS[0]), num(r.WindowS[1]), num(r.Cycles))
	fmt.Fprintf(tw, "  nominal values from\t%s\n", r.Nominal)
	tw.Flush()

	heading(w, "METHODS")
	tw = table(w)
	fmt.Fprintf(tw, "  method\tf_d [Hz]\tζ\tcycles\tnote\n")
	for _, m := range r.Methods {
		if !m.OK {
			fmt.Fprintf(tw, "  %s\tfailed\t\t\t%s\n", m.Method, m.Note)
			continue
		}
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\n", m.Method, pm(m.DampedFrequency), pm(m.Ratio), num(m.Cycles), m.Note)
	}
	tw.Flush()
	verdict := "agree"
	if !r.Agree {
		verdict = "DISAGREE"
	}
	fmt.Fprintf(w, "\n  The methods %s on ζ: largest over smallest %s (limit %s).\n", verdict, fixed(r.AgreementFactor, 2), fixed(r.AgreementLimit, 2))
	if len(r.Notes) > 0 {
		fmt.Fprintf(w, "\n  Reader notes:\n")
		for _, n := range r.Notes {
			fmt.Fprintf(w, "  – %s\n", n)
		}
	}
	if r.Picture != "" {
		fmt.Fprintf(w, "\n  Picture written to %s\n", r.Picture)
	}
	if r.ModelMaterial != "" {
		fmt.Fprintf(w, "\n  To use the measured loss factor (± %d standard uncertainties) in a model file:\n\n%s", ringdown.Coverage, indent(r.ModelMaterial, "    "))
		fmt.Fprintln(w)
	}
	heading(w, "CAUTIONS")
	for _, c := range append(append([]string(nil), ringdownCautions...), cautions...) {
		fmt.Fprintf(w, "  • %s\n", c)
	}
}

// materialSnippet is a model-file [materials] entry: the catalogue
// material with the measured loss factor as low, nominal, high.
func materialSnippet(m materials.Material, loss materials.Range) string {
	return fmt.Sprintf("[materials.%q]\nfrom = %q\nloss-factor = [%s, %s, %s]   # measured by tap test\n",
		m.Name+" (measured)", m.Name, sig3(loss.Low), sig3(loss.Nominal), sig3(loss.High))
}
