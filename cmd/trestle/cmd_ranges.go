package main

import (
	"errors"
	"fmt"
	"io"
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
)

// governingRow is one governing number across columns (levels or models).
type governingRow struct {
	name string
	q    *quantity // nil: a plain number
	vals []*float64
	// lowerIsWorse says which way is bad, for the spread column.
	lowerIsWorse bool
}

func ptr(v float64) *float64 { return &v }

// governingRows lists the governing numbers of several reports.
func governingRows(gs []Governing, u unitSystem) []governingRow {
	k, mo := u.stiffness(), u.motion()
	rows := []governingRow{
		{name: "softest mount stiffness [" + k.unit + "]", q: &k, lowerIsWorse: true},
		{name: "first natural frequency [Hz]", lowerIsWorse: true},
		{name: "highest utilisation [%]"},
		{name: "whole-stand buckling factor", lowerIsWorse: true},
		{name: "lowest member Euler margin", lowerIsWorse: true},
		{name: "largest displacement [" + mo.unit + "]", q: &mo},
		{name: "tipping margin", lowerIsWorse: true},
	}
	for _, g := range gs {
		var soft *float64
		if g.SoftestMount != "" {
			soft = ptr(g.SoftestStiffnessNPerM)
		}
		rows[0].vals = append(rows[0].vals, soft)
		rows[1].vals = append(rows[1].vals, g.FirstFrequencyHz)
		rows[2].vals = append(rows[2].vals, ptr(100*g.MaxUtilisation))
		rows[3].vals = append(rows[3].vals, g.BucklingFactor)
		rows[4].vals = append(rows[4].vals, g.EulerMargin)
		rows[5].vals = append(rows[5].vals, ptr(g.MaxDisplacementM))
		rows[6].vals = append(rows[6].vals, g.TippingFactor)
	}
	return rows
}

func (r governingRow) cell(i int) string {
	v := r.vals[i]
	if v == nil {
		return "—"
	}
	if r.q != nil {
		return r.q.f(*v)
	}
	return num(*v)
}

func runRanges(e env) error {
	fl := newFlags("ranges", "trestle ranges [flags] FILE",
		`Analyses the stand in FILE three times, with every material and spring at
the low, nominal and high end of its range (Young's modulus, shear
modulus, spring and foot spreads), and shows the spread of the governing
numbers: mount stiffness, first natural frequency, utilisation, buckling
factor, displacement. Design to the worse end.`,
		"trestle ranges stand.toml\ntrestle ranges --json demo", e)
	var of outputFlags
	of.add(fl)
	pos, u, err := fl.parseReport(e.args, 1, 1, &of)
	if err != nil {
		return handled(err)
	}
	m, name, dyn, err := loadModel(pos[0], e.stdin)
	if err != nil {
		return err
	}
	rep, err := ranges(m, name, dyn)
	if err != nil {
		return err
	}
	if of.json {
		return writeJSON(e.stdout, rep)
	}
	writeRanges(e.stdout, *rep, u)
	return nil
}

// ranges sweeps m over the material levels with one reused Solver
// (springnet.Sweep: the symbolic analysis of K is done once, each level
// only refactorises) and builds the report: per level the governing
// numbers, with the names of the governing mount, member, node and case
// taken from the level's static results, and the mount stiffness.
func ranges(m *springnet.Model, name string, dyn dynamics) (*RangesReport, error) {
	rep := &RangesReport{Schema: schemaRanges, Model: name, Warnings: []string{}, Cautions: cautions,
		Pending: append([]string(nil), pendingAnalyses...)}
	count := dyn.count
	if count == 0 {
		count = springnet.DefaultModeCount
	}
	var s springnet.Solver
	// Buckling is run here per case rather than by Sweep, which gives
	// the lowest factor but not the case that has it.
	st := &springnet.SweepSettings{Places: mountPlaces(m), Modes: count}
	res, err := s.Sweep(m, st)
	// Sweep fails as a whole where the full analysis only warns: at a
	// place with no stiffness (held rigidly, or offset from a pinned
	// node) or when there are no natural modes (no mass). Find the part
	// that failed, drop it with a warning and sweep again; each retry
	// drops a place or the modes, so this ends.
	var cond *springnet.ConditionError
	var tip *springnet.TippingError
	for err != nil && !(errors.As(err, &cond) && res != nil) && !(errors.As(err, &tip) && res != nil) {
		if i, perr := placeWithoutStiffness(&s, m, st.Places); i >= 0 {
			rep.Warnings = append(rep.Warnings, fmt.Sprintf("no stiffness at %s: %v", placeName(m, st.Places[i]), perr))
			st.Places = append(st.Places[:i:i], st.Places[i+1:]...)
		} else if st.Modes > 0 {
			if _, merr := springnet.Modes(m, &springnet.ModeSettings{Count: st.Modes}); merr == nil {
				return nil, explain(name, err)
			}
			rep.Warnings = append(rep.Warnings, "no natural frequencies: "+err.Error())
			st.Modes = 0
		} else {
			return nil, explain(name, err)
		}
		res, err = s.Sweep(m, st)
	}
	switch {
	case errors.As(err, &tip):
		// Each level's governing numbers name the cases that tip.
		rep.Warnings = append(rep.Warnings, tippedWarnings(res)...)
	case err != nil:
		rep.Warnings = append(rep.Warnings, "suspect solve: "+err.Error())
	}
	for li, l := range materials.Levels {
		lr := LevelReport{Level: l.String(), Mounts: []MountStiffness{}}
		part := &AnalysisReport{}
		for pi, p := range st.Places {
			mr := mountReport(res.Mounts[pi].Points[li])
			mr.Name = placeName(m, p)
			lr.Mounts = append(lr.Mounts, mr)
		}
		part.Mounts = lr.Mounts
		sr := res.Static[li]
		for c := 0; c < sr.NumCases(); c++ {
			part.Cases = append(part.Cases, caseReport(m, sr.Case(springnet.CaseID(c))))
		}
		if part.Buckling, err = lowestBuckling(&s, m, sr, l); err != nil {
			rep.Warnings = append(rep.Warnings, err.Error())
		}
		lr.Governing = governing(part)
		if mr := res.ModeResults[li]; mr != nil {
			for i := 0; i < mr.NumModes(); i++ {
				if !mr.RigidBody(i) {
					f := mr.Frequency(i)
					lr.Governing.FirstFrequencyHz = &f
					break
				}
			}
		}
		rep.Levels = append(rep.Levels, lr)
	}
	return rep, nil
}

// tippedWarnings names each case under which the stand tips, with the
// material levels at which it does.
func tippedWarnings(res *springnet.SweepResult) []string {
	var w []string
	sr := res.Static[0]
	for c := 0; c < sr.NumCases(); c++ {
		var at []string
		for li, l := range materials.Levels {
			if res.Static[li].Case(springnet.CaseID(c)).Tipped() {
				at = append(at, l.String())
			}
		}
		if len(at) > 0 {
			w = append(w, fmt.Sprintf("TIPS OVER under case %q at %s material values: no stable set of feet stays in contact; "+
				"add weight, widen the base or anchor the feet", sr.Case(springnet.CaseID(c)).Name(), join(at)))
		}
	}
	return w
}

// lowestBuckling returns the lowest positive whole-stand buckling factor
// of m at level l as a one-entry report naming its case (none when no
// case has one), solving with s. A case in which nothing is in
// compression has no factor, nor has a case that tips (in sr, the static
// results at l); a case whose buckling analysis fails is
// skipped and named in the error.
func lowestBuckling(s *springnet.Solver, m *springnet.Model, sr *springnet.StaticResult, l materials.Level) ([]BucklingReport, error) {
	var out []BucklingReport
	var errs []error
	for c := 0; c < m.NumCases(); c++ {
		id := springnet.CaseID(c)
		if sr.Case(id).Tipped() {
			continue // no solution to buckle from
		}
		br, err := s.Buckling(m, id, &springnet.BucklingSettings{Modes: 1, Level: l})
		var few *springnet.FewerFactorsError
		var cond *springnet.ConditionError
		switch {
		case errors.As(err, &few) && br == nil:
			continue // nothing in compression under this case
		case errors.As(err, &cond) && br != nil:
			errs = append(errs, fmt.Errorf("suspect buckling solve at %s material values: %v", l, err))
		case err != nil && !errors.As(err, &few):
			errs = append(errs, fmt.Errorf("buckling of case %q at %s material values: %v", m.CaseName(id), l, err))
			continue
		}
		if br.NumModes() > 0 && (out == nil || br.Factor(0) < out[0].Factors[0]) {
			out = []BucklingReport{{Case: m.CaseName(id), Factors: []float64{br.Factor(0)}}}
		}
	}
	return out, errors.Join(errs...)
}

// placeWithoutStiffness returns the index of the first of places at which
// the stiffness cannot be found, and why, or −1 when every place has one
// (the failure is elsewhere). A model that cannot be solved at all is
// not blamed on a place.
func placeWithoutStiffness(s *springnet.Solver, m *springnet.Model, places []springnet.Place) (int, error) {
	var cond *springnet.ConditionError
	for i, p := range places {
		ps, err := s.MountStiffness(m, p, nil)
		if err == nil || errors.As(err, &cond) && ps != nil {
			continue
		}
		var mech *springnet.MechanismError
		if errors.As(err, &mech) || m.Validate() != nil {
			return -1, nil
		}
		return i, err
	}
	return -1, nil
}

// spread returns (max − min)/nominal of the non-nil values, and whether
// it could be computed.
func spread(vals []*float64, nominal int) (float64, bool) {
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, v := range vals {
		if v == nil {
			return 0, false
		}
		lo, hi = math.Min(lo, *v), math.Max(hi, *v)
	}
	n := vals[nominal]
	if n == nil || *n == 0 {
		return 0, false
	}
	return (hi - lo) / math.Abs(*n), true
}

func writeRanges(w io.Writer, r RangesReport, u unitSystem) {
	fmt.Fprintf(w, "trestle ranges: %s\n", r.Model)
	fmt.Fprintf(w, "Every material and spring at the low, nominal and high end of its range.\n")
	writeWarnings(w, r.Warnings)
	gs := make([]Governing, len(r.Levels))
	for i, l := range r.Levels {
		gs[i] = l.Governing
	}
	heading(w, "GOVERNING NUMBERS")
	tw := table(w)
	fmt.Fprintf(tw, "  quantity")
	for _, l := range r.Levels {
		fmt.Fprintf(tw, "\t%s", l.Level)
	}
	fmt.Fprintf(tw, "\tspread\n")
	nominal := 0
	for i, l := range r.Levels {
		if l.Level == materials.Nominal.String() {
			nominal = i
		}
	}
	for _, row := range governingRows(gs, u) {
		fmt.Fprintf(tw, "  %s", row.name)
		for i := range row.vals {
			fmt.Fprintf(tw, "\t%s", row.cell(i))
		}
		sp := "—"
		if s, ok := spread(row.vals, nominal); ok {
			sp = pct(s)
		}
		fmt.Fprintf(tw, "\t%s\n", sp)
	}
	tw.Flush()
	if len(r.Levels) > 0 && len(r.Levels[0].Mounts) > 0 {
		k := u.stiffness()
		heading(w, fmt.Sprintf("MOUNT STIFFNESS, softest direction [%s]", k.unit))
		tw = table(w)
		fmt.Fprintf(tw, "  mount")
		for _, l := range r.Levels {
			fmt.Fprintf(tw, "\t%s", l.Level)
		}
		fmt.Fprintf(tw, "\talong (nominal)\n")
		for i, mt := range r.Levels[0].Mounts {
			fmt.Fprintf(tw, "  %s", mt.Name)
			for _, l := range r.Levels {
				fmt.Fprintf(tw, "\t%s", k.f(l.Mounts[i].PrincipalNPerM[0]))
			}
			fmt.Fprintf(tw, "\t%s\n", direction(r.Levels[nominal].Mounts[i].PrincipalDirection[0]))
		}
		tw.Flush()
	}
	writePending(w, r.Pending)
	writeCautions(w)
}

func runCompare(e env) error {
	fl := newFlags("compare", "trestle compare [flags] A B",
		`Analyses two model files and shows their governing numbers side by side
with the change from A to B: mount stiffness, first natural frequency,
utilisation, buckling, displacement, tipping margin. "demo" names the
built-in demo; one of them may be "-" (standard input).`,
		"trestle compare stand.toml stand-braced.toml\ntrestle compare --units us demo mine.toml", e)
	var of outputFlags
	of.add(fl)
	level := fl.levelFlag()
	pos, err := fl.parseWant(e.args, 2, 2)
	if err != nil {
		return handled(err)
	}
	if pos[0] == "-" && pos[1] == "-" {
		return fmt.Errorf("compare: only one of A and B can be standard input")
	}
	u, err := parseUnits(of.units)
	if err != nil {
		return err
	}
	l, err := parseLevel(*level)
	if err != nil {
		return err
	}
	var reps [2]*AnalysisReport
	for i, p := range pos {
		a, err := analyseFile(p, e.stdin, l)
		if err != nil {
			return err
		}
		reps[i] = a.report
	}
	rep := CompareReport{Schema: schemaCompare, A: reps[0].Model, B: reps[1].Model,
		GoverningA: reps[0].Governing, GoverningB: reps[1].Governing,
		MountsA: reps[0].Mounts, MountsB: reps[1].Mounts, Cautions: cautions}
	if of.json {
		return writeJSON(e.stdout, rep)
	}
	writeCompare(e.stdout, rep, u)
	return nil
}

func writeCompare(w io.Writer, r CompareReport, u unitSystem) {
	fmt.Fprintf(w, "trestle compare\n  A: %s\n  B: %s\n", r.A, r.B)
	heading(w, "GOVERNING NUMBERS")
	tw := table(w)
	fmt.Fprintf(tw, "  quantity\tA\tB\tB vs A\n")
	for _, row := range governingRows([]Governing{r.GoverningA, r.GoverningB}, u) {
		ch := "—"
		if a, b := row.vals[0], row.vals[1]; a != nil && b != nil && *a != 0 {
			ch = fmt.Sprintf("%+.1f %%", 100*(*b-*a)/math.Abs(*a))
		}
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\n", row.name, row.cell(0), row.cell(1), ch)
	}
	tw.Flush()
	k := u.stiffness()
	heading(w, fmt.Sprintf("MOUNT STIFFNESS, softest direction [%s]", k.unit))
	tw = table(w)
	fmt.Fprintf(tw, "  mount\tA\tB\tB vs A\n")
	seen := map[string]bool{}
	find := func(ms []MountStiffness, name string) *MountStiffness {
		for i := range ms {
			if ms[i].Name == name {
				return &ms[i]
			}
		}
		return nil
	}
	for _, list := range [][]MountStiffness{r.MountsA, r.MountsB} {
		for _, mt := range list {
			if seen[mt.Name] {
				continue
			}
			seen[mt.Name] = true
			a, b := find(r.MountsA, mt.Name), find(r.MountsB, mt.Name)
			ca, cb, ch := "—", "—", "—"
			if a != nil {
				ca = k.f(a.PrincipalNPerM[0])
			}
			if b != nil {
				cb = k.f(b.PrincipalNPerM[0])
			}
			if a != nil && b != nil && a.PrincipalNPerM[0] != 0 {
				ch = fmt.Sprintf("%+.1f %%", 100*(b.PrincipalNPerM[0]-a.PrincipalNPerM[0])/a.PrincipalNPerM[0])
			}
			fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\n", mt.Name, ca, cb, ch)
		}
	}
	tw.Flush()
	writeCautions(w)
}
