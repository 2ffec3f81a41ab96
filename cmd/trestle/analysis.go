package main

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
)

// cautions end every report.
var cautions = []string{
	"trestle is a linear elastic, small-displacement model; its numbers are only as good as the model and the material ranges given to it.",
	"Check anchoring, tipping, floor capacity and local building codes.",
	"Defer to licensed engineering practice for anything that carries people or critical loads.",
}

// pendingStatic names the analyses that springnet does not offer yet in
// this build; the report says so instead of leaving them out silently.
var pendingAnalyses = []string{}

// elementLabel is the name of element e, or "<kind> #<i>" when it has none.
func elementLabel(m *springnet.Model, e springnet.ElementID) string {
	if n := m.ElementName(e); n != "" {
		return n
	}
	return fmt.Sprintf("%s #%d", m.ElementKind(e), int(e))
}

// mountPlaces returns the places whose stiffness the report gives: the
// mounts, else the rigid groups.
func mountPlaces(m *springnet.Model) []springnet.Place {
	var ps []springnet.Place
	for i := 0; i < m.NumMounts(); i++ {
		ps = append(ps, springnet.MountID(i))
	}
	if len(ps) == 0 {
		for i := 0; i < m.NumGroups(); i++ {
			ps = append(ps, springnet.GroupID(i))
		}
	}
	return ps
}

// analysed is a model with its static results at one material level, kept
// together so that reports and pictures draw on the same solve.
type analysed struct {
	model  *springnet.Model
	static *springnet.StaticResult
	modes  *springnet.ModeResult // nil when the modal analysis failed
	report *AnalysisReport
}

// explain turns springnet's typed errors into a message for a person who
// does not know the solver.
func explain(name string, err error) error {
	var mech *springnet.MechanismError
	var tip *springnet.TippingError
	switch {
	case errors.As(err, &mech):
		return fmt.Errorf("%s: the stand is a mechanism, it can move without resistance: %v. "+
			"Add a brace, a support or a stiffer joint there", name, err)
	case errors.As(err, &tip):
		return fmt.Errorf("%s: %v", name, err)
	}
	return fmt.Errorf("%s: %w", name, err)
}

// analyse runs the static analysis and the mount stiffness of m at level l
// and builds the report. Suspect solves (a *springnet.ConditionError) are
// kept and reported as warnings.
func analyse(m *springnet.Model, name string, l materials.Level, dyn dynamics) (*analysed, error) {
	var s springnet.Solver
	st := &springnet.StaticSettings{Level: l}
	rep := &AnalysisReport{Schema: schemaAnalysis, Model: name, Level: l.String(),
		Warnings: []string{}, Mounts: []MountStiffness{}, Cases: []CaseReport{},
		Pending: append([]string(nil), pendingAnalyses...), Cautions: cautions}
	res, err := s.Static(m, st)
	var cond *springnet.ConditionError
	var tip *springnet.TippingError
	switch {
	case errors.As(err, &cond) && res != nil:
		rep.Warnings = append(rep.Warnings, "suspect solve: "+err.Error())
	case errors.As(err, &tip) && res != nil:
		// The cases that tip are marked in their reports and named first
		// among the warnings (alerts); the others stand.
	case err != nil:
		return nil, explain(name, err)
	}
	rep.Summary = summarise(m, res)
	for _, p := range mountPlaces(m) {
		ps, err := s.MountStiffness(m, p, st)
		if errors.As(err, &cond) && ps != nil {
			rep.Warnings = append(rep.Warnings, "suspect solve: "+err.Error())
		} else if err != nil {
			// A place held rigidly, or one the library cannot load (a
			// mount offset from a pinned node), has no stiffness to
			// report; the rest of the analysis stands.
			rep.Warnings = append(rep.Warnings, fmt.Sprintf("no stiffness at %s: %v", placeName(m, p), err))
			continue
		}
		mr := mountReport(ps)
		mr.Name = placeName(m, p)
		rep.Mounts = append(rep.Mounts, mr)
	}
	for c := 0; c < res.NumCases(); c++ {
		rep.Cases = append(rep.Cases, caseReport(m, res.Case(springnet.CaseID(c))))
	}
	rep.Buckling, rep.Warnings = buckling(m, res, l, rep.Warnings)
	a := &analysed{model: m, static: res, report: rep}
	a.modes, rep.Modes, rep.Warnings = modes(m, l, dyn, rep.Warnings)
	rep.Governing = governing(rep)
	// Safety first: lifted feet, uplift, tipping and overstress before
	// resonance and solver notes.
	rep.Warnings = append(alerts(rep), rep.Warnings...)
	return a, nil
}

func summarise(m *springnet.Model, res *springnet.StaticResult) ModelSummary {
	s := ModelSummary{Nodes: m.NumNodes(), Groups: m.NumGroups(), Mounts: m.NumMounts(), Cases: m.NumCases()}
	for e := 0; e < m.NumElements(); e++ {
		switch m.ElementKind(springnet.ElementID(e)) {
		case springnet.BarKind:
			s.Bars++
		case springnet.BeamKind:
			s.Beams++
		case springnet.SpringKind:
			s.Springs++
		case springnet.FootKind:
			s.Feet++
		}
	}
	// The floor load is what the floor and supports carry in the first
	// plain case that has a vertical load.
	for c := 0; c < res.NumCases(); c++ {
		if m.IsCombination(springnet.CaseID(c)) {
			continue
		}
		eq := res.Case(springnet.CaseID(c)).Equilibrium()
		if eq.Reactions.FZ != 0 {
			s.FloorLoadN, s.FloorLoadCase = eq.Reactions.FZ, m.CaseName(springnet.CaseID(c))
			break
		}
	}
	return s
}

func mountReport(ps *springnet.PointStiffness) MountStiffness {
	k, dir := ps.Principal()
	mr := MountStiffness{Name: ps.Name(),
		XNPerM:         ps.Along(springnet.Vec{X: 1}),
		YNPerM:         ps.Along(springnet.Vec{Y: 1}),
		ZNPerM:         ps.Along(springnet.Vec{Z: 1}),
		PrincipalNPerM: k}
	// Equal softest stiffnesses (a symmetric stand) leave the direction
	// within their plane arbitrary: report the global axis in that plane
	// (the one least along the stiffest direction), so that the same
	// model prints the same direction on every machine.
	if k[1]-k[0] <= tieTol*math.Abs(k[1]) {
		mr.SoftestTied = true
		axes := [3]springnet.Vec{{X: 1}, {Y: 1}, {Z: 1}}
		best := 0
		for i := 1; i < 3; i++ {
			if math.Abs(axes[i].Dot(dir[2])) < math.Abs(axes[best].Dot(dir[2]))-tieTol {
				best = i
			}
		}
		a := axes[best]
		// Remove any part along the stiffest direction, then complete the
		// right-handed set.
		a = a.Sub(dir[2].Scale(a.Dot(dir[2])))
		a = a.Scale(1 / a.Norm())
		dir[0], dir[1] = a, dir[2].Cross(a)
	}
	for i := range dir {
		mr.PrincipalDirection[i] = [3]float64{clean(dir[i].X), clean(dir[i].Y), clean(dir[i].Z)}
	}
	return mr
}

// tieTol is the relative difference under which two principal
// stiffnesses are taken as equal (far above the solve's round-off, far
// below any difference a designer acts on).
const tieTol = 1e-6

// roundOff is the relative size below which a result is taken as
// round-off of the double-precision solve and printed as zero.
const roundOff = 1e-9

// cut returns 0 if |v| <= tiny, else v.
func cut(v, tiny float64) float64 {
	if math.Abs(v) <= tiny {
		return 0
	}
	return v
}

// placeName is the bare name of a mount, group or node.
func placeName(m *springnet.Model, p springnet.Place) string {
	switch p := p.(type) {
	case springnet.MountID:
		return m.MountName(p)
	case springnet.GroupID:
		return m.GroupName(p)
	case springnet.NodeID:
		return m.NodeName(p)
	}
	return m.PlaceName(p)
}

// clean rounds components below 1e-12 to zero so that directions print
// the same on every machine.
func clean(v float64) float64 {
	if math.Abs(v) < 1e-12 {
		return 0
	}
	return v
}

func caseReport(m *springnet.Model, cr *springnet.CaseResult) CaseReport {
	r := CaseReport{Name: cr.Name(), Combination: m.IsCombination(cr.ID()), Residual: cr.Residual(),
		Feet: []FootReport{}, Supports: []SupportReport{}, Members: []MemberReport{}, Mounts: []MountMotion{}}
	tp := cr.Tipping()
	r.Tipping = TippingReport{Found: tp.Found, Factor: tp.Factor, LastFoot: tp.LastFoot, Note: tp.Note}
	if cr.Tipped() {
		// No solution: nothing else to report.
		r.Tipped = true
		for _, e := range cr.Lifted() {
			r.TippedLifted = append(r.TippedLifted, elementLabel(m, e))
		}
		return r
	}
	for n := 0; n < m.NumNodes(); n++ {
		id := springnet.NodeID(n)
		d := cr.Displacement(id).Translation().Norm()
		if d > r.MaxDisplacementM {
			r.MaxDisplacementM, r.MaxDisplacementNode = d, m.NodeName(id)
		}
		if m.Fixed(id) != 0 {
			re := cr.Reaction(id)
			if re != (springnet.Load{}) {
				r.Supports = append(r.Supports, SupportReport{Node: m.NodeName(id),
					FXN: re.FX, FYN: re.FY, FZN: re.FZ, MXNm: re.MX, MYNm: re.MY, MZNm: re.MZ})
			}
		}
	}
	// A vertical reaction below roundOff × the largest in the case is
	// round-off (a foot that carries nothing while the stand balances on
	// the others): it prints as 0 and is not uplift.
	var maxFZ float64
	for _, f := range cr.Feet() {
		maxFZ = math.Max(maxFZ, math.Abs(f.Reaction.FZ))
	}
	for _, f := range cr.Feet() {
		name := f.Name
		if name == "" {
			name = elementLabel(m, f.Element)
		}
		fz := cut(f.Reaction.FZ, roundOff*maxFZ)
		r.Feet = append(r.Feet, FootReport{Name: name, Node: m.NodeName(f.Node),
			FXN: f.Reaction.FX, FYN: f.Reaction.FY, FZN: fz, Share: f.Share,
			Uplift: f.Uplift && !f.Lifted && fz < 0, Lifted: f.Lifted, Held: f.Lifted && f.Held})
	}
	members, err := cr.MembersTo(nil, nil)
	if err != nil {
		members = nil // default settings cannot fail; keep the axial forces below
	}
	next := 0
	for e := 0; e < m.NumElements(); e++ {
		id := springnet.ElementID(e)
		k := m.ElementKind(id)
		if k == springnet.FootKind {
			continue
		}
		f := cr.Force(id)
		mr := MemberReport{Name: elementLabel(m, id), Kind: k.String(), AxialN: f.Axial}
		if k == springnet.SpringKind {
			mr.AxialN = f.Axial
		} else if next < len(members) && members[next].Element == id {
			x := members[next]
			next++
			mr.AxialN = x.A.N
			mr.MaxMomentNm = math.Max(math.Hypot(x.A.My, x.A.Mz), math.Hypot(x.B.My, x.B.Mz))
			if x.Stressed {
				mr.TensionPa, mr.CompressionPa = x.Tension, x.Compression
			}
			mr.Utilisation, mr.Governs, mr.Rated = x.Utilisation, x.Governs, x.Governs != ""
			if b := x.Buckling; b.Rated && b.Compressed && b.Margin > 0 {
				mr.EulerMargin = b.Margin
				mr.EulerK = b.KY
				if b.PcrZ < b.PcrY {
					mr.EulerK = b.KZ
				}
				if r.EulerMember == "" || b.Margin < r.EulerMargin {
					r.EulerMargin, r.EulerMember = b.Margin, mr.Name
				}
			}
		}
		r.Members = append(r.Members, mr)
		if mr.Utilisation > r.MaxUtilisation {
			r.MaxUtilisation, r.MaxUtilisationMember = mr.Utilisation, mr.Name
		}
	}
	// Forces and stresses below roundOff × the largest in the case are
	// round-off.
	var maxN, maxM, maxS float64
	for _, mr := range r.Members {
		maxN = math.Max(maxN, math.Abs(mr.AxialN))
		maxM = math.Max(maxM, mr.MaxMomentNm)
		maxS = math.Max(maxS, math.Max(mr.TensionPa, mr.CompressionPa))
	}
	for i := range r.Members {
		mr := &r.Members[i]
		mr.AxialN = cut(mr.AxialN, roundOff*maxN)
		mr.MaxMomentNm = cut(mr.MaxMomentNm, roundOff*maxM)
		mr.TensionPa = cut(mr.TensionPa, roundOff*maxS)
		mr.CompressionPa = cut(mr.CompressionPa, roundOff*maxS)
	}
	// Motions below roundOff × the largest are round-off and print as 0.
	tiny := roundOff * r.MaxDisplacementM
	for _, p := range mountPlaces(m) {
		d := cr.At(p)
		r.Mounts = append(r.Mounts, MountMotion{Name: placeName(m, p),
			UXM: cut(d.UX, tiny), UYM: cut(d.UY, tiny), UZM: cut(d.UZ, tiny)})
	}
	eq := cr.Equilibrium()
	r.Equilibrium = EquilibriumReport{
		AppliedN:   [3]float64{eq.Applied.FX, eq.Applied.FY, eq.Applied.FZ},
		ReactionsN: [3]float64{eq.Reactions.FX, eq.Reactions.FY, eq.Reactions.FZ},
		ForceError: eq.ForceError, MomentError: eq.MomentError}
	return r
}

// bucklingModes is how many whole-frame load factors each case reports.
const bucklingModes = 3

// buckling runs the whole-frame buckling analysis of every case.
func buckling(m *springnet.Model, static *springnet.StaticResult, l materials.Level, warn []string) ([]BucklingReport, []string) {
	out := []BucklingReport{}
	for c := 0; c < m.NumCases(); c++ {
		id := springnet.CaseID(c)
		br := BucklingReport{Case: m.CaseName(id), Factors: []float64{}}
		if static.Case(id).Tipped() {
			br.Note = "the stand tips under this case"
			out = append(out, br)
			continue
		}
		res, err := springnet.Buckling(m, id, &springnet.BucklingSettings{Modes: bucklingModes, Level: l})
		var few *springnet.FewerFactorsError
		var cond *springnet.ConditionError
		switch {
		case errors.As(err, &few) && res == nil:
			br.Note = "nothing in compression can buckle under this case"
			if few.Reversed > 0 {
				br.Note += fmt.Sprintf("; reversed, it buckles at %.4g", few.Reversed)
			}
		case errors.As(err, &few), err == nil, errors.As(err, &cond) && res != nil:
			if cond != nil {
				warn = append(warn, "suspect buckling solve: "+err.Error())
			}
			br.Factors = res.FactorsTo(nil)
		default:
			br.Note = "not found: " + err.Error()
			warn = append(warn, fmt.Sprintf("buckling of case %q: %v", br.Case, err))
		}
		out = append(out, br)
	}
	return out, warn
}

// governing picks the numbers a designer reads first from a report.
func governing(rep *AnalysisReport) Governing {
	g := Governing{LiftedFeet: []string{}, HeldFeet: []string{}, UpliftFeet: []string{}}
	first := true
	for _, mt := range rep.Mounts {
		// Ties within round-off keep the first mount named.
		if first || mt.PrincipalNPerM[0] < g.SoftestStiffnessNPerM*(1-1e-9) {
			g.SoftestMount, g.SoftestStiffnessNPerM, g.SoftestDirection = mt.Name, mt.PrincipalNPerM[0], mt.PrincipalDirection[0]
			first = false
		}
	}
	for _, c := range rep.Cases {
		if c.Tipped {
			g.TippedCases = append(g.TippedCases, c.Name)
		}
		if c.MaxUtilisation > g.MaxUtilisation {
			g.MaxUtilisation, g.MaxUtilisationMember, g.MaxUtilisationCase = c.MaxUtilisation, c.MaxUtilisationMember, c.Name
		}
		if c.MaxDisplacementM > g.MaxDisplacementM {
			g.MaxDisplacementM, g.MaxDisplacementNode, g.MaxDisplacementCase = c.MaxDisplacementM, c.MaxDisplacementNode, c.Name
		}
		for _, f := range c.Feet {
			if f.Lifted {
				g.LiftedFeet = append(g.LiftedFeet, fmt.Sprintf("%s (%s)", f.Name, c.Name))
			}
			if f.Held {
				g.HeldFeet = append(g.HeldFeet, fmt.Sprintf("%s (%s)", f.Name, c.Name))
			}
			if f.Uplift {
				g.UpliftFeet = append(g.UpliftFeet, fmt.Sprintf("%s (%s)", f.Name, c.Name))
			}
		}
		if c.Tipping.Found && (g.TippingFactor == nil || c.Tipping.Factor < *g.TippingFactor) {
			f := c.Tipping.Factor
			g.TippingFactor, g.TippingCase = &f, c.Name
		}
	}
	if i := firstElastic(rep.Modes); i >= 0 {
		f := rep.Modes.Modes[i].FrequencyHz
		g.FirstFrequencyHz = &f
	}
	for _, b := range rep.Buckling {
		if len(b.Factors) > 0 && (g.BucklingFactor == nil || b.Factors[0] < *g.BucklingFactor) {
			f := b.Factors[0]
			g.BucklingFactor, g.BucklingCase = &f, b.Case
		}
	}
	for _, c := range rep.Cases {
		if c.EulerMember != "" && (g.EulerMargin == nil || c.EulerMargin < *g.EulerMargin) {
			f := c.EulerMargin
			g.EulerMargin, g.EulerMember, g.EulerCase = &f, c.EulerMember, c.Name
		}
	}
	return g
}

// Thresholds for the flags at the top of a report.
const (
	// utilisationFlag: members above this share of their strength are
	// named at the top (common practice: keep stands well inside elastic
	// limits for stiffness-critical work).
	utilisationFlag = 0.5
	// tippingFlag: a tipping factor below this on the non-gravity loads is
	// flagged (common practice: a margin of 1.5 against overturning).
	tippingFlag = 1.5
)

// alerts returns the warnings a person must see first: lifted feet,
// uplift, a small tipping margin, members over strength.
func alerts(rep *AnalysisReport) []string {
	var w []string
	g := rep.Governing
	for _, c := range rep.Cases {
		if c.Tipped {
			w = append(w, fmt.Sprintf("TIPS OVER under case %q: no stable set of feet stays in contact (lifted: %s); "+
				"the case has no results. Add weight, widen the base or anchor the feet", c.Name, join(c.TippedLifted)))
		}
	}
	if len(g.LiftedFeet) > 0 {
		w = append(w, fmt.Sprintf("LIFTED FEET out of contact: %s; the stand rocks on the others", join(g.LiftedFeet)))
	}
	if len(g.HeldFeet) > 0 {
		w = append(w, fmt.Sprintf("HELD SIDEWAYS: %s: lifted to the point of carrying no weight, yet friction still holds them sideways "+
			"(their FX, FY); anchor them or stiffen the frame against racking", join(g.HeldFeet)))
	}
	if len(g.UpliftFeet) > 0 {
		w = append(w, fmt.Sprintf("UPLIFT: %s pull the stand down; they need anchors that carry tension", join(g.UpliftFeet)))
	}
	for _, c := range rep.Cases {
		if !c.Tipped && !c.Tipping.Found && c.Tipping.Note != "" {
			w = append(w, fmt.Sprintf("TIPPING MARGIN UNKNOWN for case %q: %s; check tipping by hand", c.Name, c.Tipping.Note))
		}
	}
	if g.TippingFactor != nil && *g.TippingFactor < tippingFlag {
		w = append(w, fmt.Sprintf("TIPPING: case %q tips at %.2f × its non-gravity loads (below %.1f)", g.TippingCase, *g.TippingFactor, tippingFlag))
	}
	switch {
	case g.MaxUtilisation >= 1:
		w = append(w, fmt.Sprintf("OVERSTRESSED: %s in case %q at %.0f %% of its strength", g.MaxUtilisationMember, g.MaxUtilisationCase, 100*g.MaxUtilisation))
	case g.MaxUtilisation >= utilisationFlag:
		w = append(w, fmt.Sprintf("HIGH UTILISATION: %s in case %q at %.0f %% of its strength", g.MaxUtilisationMember, g.MaxUtilisationCase, 100*g.MaxUtilisation))
	}
	return w
}

func join(s []string) string {
	out := ""
	for i, x := range s {
		if i > 0 {
			out += ", "
		}
		out += x
	}
	return out
}
