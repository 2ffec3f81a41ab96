package main

import (
	"encoding/json"
	"fmt"
	"io"
	"math"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"text/tabwriter"

	"github.com/trestle-go/trestle/springnet"
)

// writeJSON writes v indented, with a final newline. Lists are [], never
// null (SCHEMA.md): nil slices in v are made empty first (in a copy when
// v is not a pointer).
func writeJSON(w io.Writer, v any) error {
	if rv := reflect.ValueOf(v); rv.IsValid() && rv.Kind() != reflect.Pointer {
		p := reflect.New(rv.Type())
		p.Elem().Set(rv)
		v = p.Interface()
	}
	emptyLists(reflect.ValueOf(v))
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	enc.SetEscapeHTML(false)
	return enc.Encode(v)
}

// emptyLists sets every settable nil slice reachable from v through
// pointers, structs, slices and arrays to an empty slice.
func emptyLists(v reflect.Value) {
	switch v.Kind() {
	case reflect.Pointer, reflect.Interface:
		if !v.IsNil() {
			emptyLists(v.Elem())
		}
	case reflect.Struct:
		for i := range v.NumField() {
			if v.Type().Field(i).IsExported() {
				emptyLists(v.Field(i))
			}
		}
	case reflect.Slice:
		if v.IsNil() {
			if v.CanSet() {
				v.Set(reflect.MakeSlice(v.Type(), 0, 0))
			}
			return
		}
		for i := range v.Len() {
			emptyLists(v.Index(i))
		}
	case reflect.Array:
		for i := range v.Len() {
			emptyLists(v.Index(i))
		}
	}
}

// table is a tabwriter for aligned columns, two spaces apart.
func table(w io.Writer) *tabwriter.Writer { return tabwriter.NewWriter(w, 0, 0, 2, ' ', 0) }

// heading prints a section heading.
func heading(w io.Writer, s string) {
	fmt.Fprintf(w, "\n%s\n%s\n", s, strings.Repeat("─", len([]rune(s))))
}

// writeWarnings prints the WARNINGS section, one "!" line per warning
// (nothing when there are none).
func writeWarnings(w io.Writer, warnings []string) {
	if len(warnings) == 0 {
		return
	}
	heading(w, "WARNINGS")
	for _, x := range warnings {
		fmt.Fprintf(w, "  ! %s\n", x)
	}
}

// writePending prints the NOT IN THIS REPORT section (nothing when
// pending is empty).
func writePending(w io.Writer, pending []string) {
	if len(pending) == 0 {
		return
	}
	heading(w, "NOT IN THIS REPORT")
	for _, p := range pending {
		fmt.Fprintf(w, "  – %s\n", p)
	}
}

// direction words a unit vector: the axis it is close to, else its
// components.
func direction(d [3]float64) string {
	names := [3]string{"X", "Y", "Z"}
	for i, v := range d {
		if math.Abs(v) > 0.995 {
			return names[i]
		}
	}
	var c [3]float64
	for i, v := range d {
		if math.Abs(v) >= 0.005 { // no "-0.00"
			c[i] = v
		}
	}
	return fmt.Sprintf("(%.2f, %.2f, %.2f)", c[0], c[1], c[2])
}

// smallFloor: relative errors below it are round-off and print as
// "< 1e-12" (a double-precision solve leaves 1e-16 to 1e-13 that changes
// with the order of the arithmetic).
const smallFloor = 1e-12

// small formats a relative error or residual.
func small(v float64) string {
	if v < smallFloor {
		return "< 1e-12"
	}
	return fmt.Sprintf("%.1e", v)
}

// writeCautions ends every report.
func writeCautions(w io.Writer) {
	heading(w, "CAUTIONS")
	for _, c := range cautions {
		fmt.Fprintf(w, "  • %s\n", c)
	}
}

// writeAnalysis prints an analysis report as text: governing numbers,
// warnings, then the details per mount and per case, then the cautions.
func writeAnalysis(w io.Writer, r *AnalysisReport, u unitSystem) {
	k, mo, f, s := u.stiffness(), u.motion(), u.force(), u.stress()
	fmt.Fprintf(w, "trestle analysis: %s (material level %s)\n", r.Model, r.Level)
	sm := r.Summary
	fmt.Fprintf(w, "%d nodes, %d beams, %d bars, %d springs, %d feet, %d rigid groups, %d mounts, %d load cases",
		sm.Nodes, sm.Beams, sm.Bars, sm.Springs, sm.Feet, sm.Groups, sm.Mounts, sm.Cases)
	if sm.FloorLoadCase != "" {
		fmt.Fprintf(w, "; floor load %s in case %q", f.fu(sm.FloorLoadN), sm.FloorLoadCase)
	}
	fmt.Fprintln(w)

	writeWarnings(w, r.Warnings)

	g := r.Governing
	heading(w, "GOVERNING NUMBERS")
	tw := table(w)
	if g.SoftestMount != "" {
		tied := ""
		for _, mt := range r.Mounts {
			if mt.Name == g.SoftestMount && mt.SoftestTied {
				tied = fmt.Sprintf(" (as soft along %s)", direction(mt.PrincipalDirection[1]))
			}
		}
		fmt.Fprintf(tw, "  softest mount stiffness\t%s\tat %s, along %s%s\n", k.fu(g.SoftestStiffnessNPerM), g.SoftestMount, direction(g.SoftestDirection), tied)
	} else {
		fmt.Fprintf(tw, "  softest mount stiffness\t—\tno mounts or rigid groups in the model\n")
	}
	if g.FirstFrequencyHz != nil {
		fmt.Fprintf(tw, "  first natural frequency\t%s Hz\t%s\n", num(*g.FirstFrequencyHz), firstMotion(r.Modes))
	} else {
		fmt.Fprintf(tw, "  first natural frequency\t—\tno modal result (see warnings)\n")
	}
	if g.MaxUtilisationMember != "" {
		fmt.Fprintf(tw, "  highest utilisation\t%s\t%s in case %q\n", pct(g.MaxUtilisation), g.MaxUtilisationMember, g.MaxUtilisationCase)
	} else {
		fmt.Fprintf(tw, "  highest utilisation\t—\tno rated member\n")
	}
	if g.BucklingFactor != nil {
		fmt.Fprintf(tw, "  buckling factor (whole stand)\t%s\ton the loads of case %q\n", num(*g.BucklingFactor), g.BucklingCase)
	} else {
		fmt.Fprintf(tw, "  buckling factor (whole stand)\t—\tnothing in compression can buckle\n")
	}
	if g.EulerMargin != nil {
		fmt.Fprintf(tw, "  member Euler margin\t%s\t%s in case %q\n", num(*g.EulerMargin), g.EulerMember, g.EulerCase)
	}
	fmt.Fprintf(tw, "  largest displacement\t%s\tat %s in case %q\n", mo.fu(g.MaxDisplacementM), g.MaxDisplacementNode, g.MaxDisplacementCase)
	switch {
	case len(g.TippedCases) > 0:
		fmt.Fprintf(tw, "  feet\tTIPS OVER\tunder case %s\n", join(quoteAll(g.TippedCases)))
	case len(g.LiftedFeet) > 0:
		fmt.Fprintf(tw, "  feet\tLIFTED\t%s\n", join(heldNoted(g.LiftedFeet, g.HeldFeet)))
	case len(g.UpliftFeet) > 0:
		fmt.Fprintf(tw, "  feet\tUPLIFT\t%s\n", join(g.UpliftFeet))
	case r.Summary.Feet > 0:
		fmt.Fprintf(tw, "  feet\tall in contact\tno uplift in any case\n")
	}
	if g.TippingFactor != nil {
		fmt.Fprintf(tw, "  tipping margin\t%s ×\tthe non-gravity loads of case %q tip the stand\n", fixed(*g.TippingFactor, 2), g.TippingCase)
	} else if r.Summary.Feet > 0 {
		why := "no case's loads can tip the stand"
		for _, c := range r.Cases {
			if c.Tipping.Note != "" {
				why = fmt.Sprintf("not found for case %q (see below)", c.Name)
				break
			}
		}
		fmt.Fprintf(tw, "  tipping margin\t—\t%s\n", why)
	}
	tw.Flush()

	if len(r.Mounts) > 0 {
		heading(w, fmt.Sprintf("MOUNT STIFFNESS [%s], rotation free", k.unit))
		tw = table(w)
		fmt.Fprintf(tw, "  mount\tX\tY\tZ\tsoftest\talong\tstiffest\talong\n")
		for _, mt := range r.Mounts {
			along := direction(mt.PrincipalDirection[0])
			if mt.SoftestTied {
				along += " = " + direction(mt.PrincipalDirection[1])
			}
			fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", mt.Name, k.f(mt.XNPerM), k.f(mt.YNPerM), k.f(mt.ZNPerM),
				k.f(mt.PrincipalNPerM[0]), along, k.f(mt.PrincipalNPerM[2]), direction(mt.PrincipalDirection[2]))
		}
		tw.Flush()
	}
	if len(r.Buckling) > 0 {
		heading(w, "WHOLE-STAND BUCKLING (load factors on each case's loads, self-weight included)")
		tw = table(w)
		fmt.Fprintf(tw, "  case\tlowest factors\tnote\n")
		for _, b := range r.Buckling {
			fs := make([]string, len(b.Factors))
			for i, x := range b.Factors {
				fs[i] = num(x)
			}
			list := strings.Join(fs, ", ")
			if list == "" {
				list = "—"
			}
			fmt.Fprintf(tw, "  %s\t%s\t%s\n", b.Case, list, b.Note)
		}
		tw.Flush()
	}
	if r.Modes != nil {
		writeModesTable(w, r.Modes)
	}

	for _, c := range r.Cases {
		kind := "LOAD CASE"
		if c.Combination {
			kind = "COMBINATION"
		}
		heading(w, fmt.Sprintf("%s %q", kind, c.Name))
		if c.Tipped {
			fmt.Fprintf(w, "  THE STAND TIPS OVER under this case (lifted: %s): no displacements, forces or reactions\n", join(c.TippedLifted))
			if c.Tipping.Found {
				fmt.Fprintf(w, "  it tips at %s × the non-gravity loads\n", fixed(c.Tipping.Factor, 2))
			}
			continue
		}
		fmt.Fprintf(w, "  largest displacement %s at %s", mo.fu(c.MaxDisplacementM), c.MaxDisplacementNode)
		if c.MaxUtilisationMember != "" {
			fmt.Fprintf(w, "; highest utilisation %s (%s)", pct(c.MaxUtilisation), c.MaxUtilisationMember)
		}
		fmt.Fprintln(w)
		switch {
		case c.Tipping.Found:
			fmt.Fprintf(w, "  tipping margin %s × the non-gravity loads (last foot to carry: %s)\n", fixed(c.Tipping.Factor, 2), c.Tipping.LastFoot)
		case c.Tipping.Note != "":
			fmt.Fprintf(w, "  tipping margin not found: %s\n", c.Tipping.Note)
		}
		if len(c.Feet) > 0 {
			fmt.Fprintf(w, "\n  Feet (force from the floor on the stand, FZ up) [%s]\n", f.unit)
			tw = table(w)
			fmt.Fprintf(tw, "  foot\tnode\tFZ\tshare\tFX\tFY\tstate\n")
			for _, ft := range c.Feet {
				state := "in contact"
				switch {
				case ft.Held:
					state = "LIFTED, held sideways"
				case ft.Lifted:
					state = "LIFTED"
				case ft.Uplift:
					state = "UPLIFT (tension)"
				}
				fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\n", ft.Name, ft.Node, f.f(ft.FZN), pct(ft.Share), f.f(ft.FXN), f.f(ft.FYN), state)
			}
			tw.Flush()
		}
		if len(c.Supports) > 0 {
			fmt.Fprintf(w, "\n  Supports (reaction on the stand) [%s, %s]\n", f.unit, u.moment().unit)
			tw = table(w)
			fmt.Fprintf(tw, "  node\tFX\tFY\tFZ\tMX\tMY\tMZ\n")
			for _, sp := range c.Supports {
				mm := u.moment()
				fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\n", sp.Node, f.f(sp.FXN), f.f(sp.FYN), f.f(sp.FZN), mm.f(sp.MXNm), mm.f(sp.MYNm), mm.f(sp.MZNm))
			}
			tw.Flush()
		}
		if len(c.Mounts) > 0 {
			fmt.Fprintf(w, "\n  Mount motion [%s]\n", mo.unit)
			tw = table(w)
			fmt.Fprintf(tw, "  mount\tUX\tUY\tUZ\n")
			for _, mm := range c.Mounts {
				fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\n", mm.Name, mo.f(mm.UXM), mo.f(mm.UYM), mo.f(mm.UZM))
			}
			tw.Flush()
		}
		if len(c.Members) > 0 {
			mm := u.moment()
			fmt.Fprintf(w, "\n  Members (axial force tension +; fibre stresses as magnitudes) [%s, %s, %s]\n", f.unit, mm.unit, s.unit)
			tw = table(w)
			fmt.Fprintf(tw, "  member\tkind\taxial\tmoment\tσ tension\tσ compr.\tutilisation\tEuler margin\n")
			for _, mb := range c.Members {
				ut := "not rated"
				if mb.Rated {
					ut = pct(mb.Utilisation) + " " + mb.Governs
				}
				eu := "—"
				if mb.EulerMargin > 0 {
					eu = num(mb.EulerMargin)
				}
				fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", mb.Name, mb.Kind, f.f(mb.AxialN), mm.f(mb.MaxMomentNm),
					s.f(mb.TensionPa), s.f(mb.CompressionPa), ut, eu)
			}
			tw.Flush()
		}
		eq := c.Equilibrium
		fmt.Fprintf(w, "\n  Check: applied FZ %s, reactions FZ %s; equilibrium error force %s, moment %s; solve residual %s\n",
			f.fu(eq.AppliedN[2]), f.fu(eq.ReactionsN[2]), small(eq.ForceError), small(eq.MomentError), small(c.Residual))
	}
	writePending(w, r.Pending)
	writeCautions(w)
}

// writeModesTable prints the natural modes: frequency, what moves, modal
// damping, effective mass shares, and the running-speed check.
func writeModesTable(w io.Writer, m *ModesReport) {
	heading(w, "NATURAL MODES (modal damping by strain energy; effective mass shares)")
	tw := table(w)
	fmt.Fprintf(tw, "  mode\tf [Hz]\tmotion\tloss factor η (low–nom–high)\tζ\tX\tY\tZ\tmost energy in\n")
	for _, md := range m.Modes {
		energy := "—"
		if len(md.Energy) > 0 {
			energy = fmt.Sprintf("%s (%s)", md.Energy[0].Group, pct(md.Energy[0].Share))
		}
		fmt.Fprintf(tw, "  %d\t%s\t%s\t%s – %s – %s\t%s\t%s\t%s\t%s\t%s\n", md.Number, num(md.FrequencyHz), md.Motion,
			sig3(md.LossFactor[0]), sig3(md.LossFactor[1]), sig3(md.LossFactor[2]), sig3(md.DampingRatio),
			pct(md.Participation[0]), pct(md.Participation[1]), pct(md.Participation[2]), energy)
	}
	tw.Flush()
	if m.SturmCount >= 0 {
		fmt.Fprintf(w, "  Sturm check: %d natural frequencies below %s Hz, none missed.\n", m.SturmCount, num(m.SturmBelowHz))
	}
	if len(m.Speeds) > 0 {
		fmt.Fprintf(w, "\n  Running speeds checked (natural frequencies within %.0f %% of an excitation band):\n", 100*springnet.DefaultMargin)
		for _, sp := range m.Speeds {
			fmt.Fprintf(w, "  – %s\n", sp)
		}
		if len(m.Resonances) == 0 {
			fmt.Fprintf(w, "  No natural frequency is near an excitation band.\n")
		} else {
			tw = table(w)
			fmt.Fprintf(tw, "  mode\tf [Hz]\tspeed\tharmonic\tband [Hz]\tseparation\n")
			for _, r := range m.Resonances {
				sep := "inside"
				if r.Separation > 0 {
					sep = pct(r.Separation)
				}
				fmt.Fprintf(tw, "  %d\t%s\t%s\t%d\t%s – %s\t%s\n", r.Mode, num(r.FrequencyHz), r.Speed, r.Order, num(r.LowHz), num(r.HighHz), sep)
			}
			tw.Flush()
		}
	}
}

// sig3 formats a damping value with three significant figures.
func sig3(v float64) string {
	if v == 0 {
		return "0"
	}
	return strconv.FormatFloat(v, 'g', 3, 64)
}

// quoteAll returns each of s in Go quotes.
func quoteAll(s []string) []string {
	out := make([]string, len(s))
	for i, x := range s {
		out[i] = fmt.Sprintf("%q", x)
	}
	return out
}

// heldNoted returns the lifted feet ("foot (case)") with those also held
// sideways marked "foot (case, held sideways)".
func heldNoted(lifted, held []string) []string {
	out := make([]string, len(lifted))
	for i, l := range lifted {
		out[i] = l
		if slices.Contains(held, l) && strings.HasSuffix(l, ")") {
			out[i] = strings.TrimSuffix(l, ")") + ", held sideways)"
		}
	}
	return out
}
