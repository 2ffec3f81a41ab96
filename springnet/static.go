package springnet

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet/element"
)

// StaticSettings controls a static analysis. A nil *StaticSettings means
// defaults; zero fields mean defaults.
type StaticSettings struct {
	// Level picks the material values (E, G, spring Vary) from their
	// ranges; the zero Level is Nominal.
	Level materials.Level
}

// Static solves every load case and combination of m with a new Solver;
// see Solver.Static.
func Static(m *Model, st *StaticSettings) (*StaticResult, error) {
	var s Solver
	return s.Static(m, st)
}

// Static validates m and solves every load case and combination: nodal
// displacements, element forces, support and foot reactions, the
// equilibrium check, load share between feet, lift-off of
// compression-only feet and the tipping margin.
//
// It returns a *MechanismError (and no result) if the model can move
// freely with every foot down, and the validation errors of an invalid
// model.
//
// A case under which a stand on compression-only feet has no stable set
// of feet in contact tips: it gets a CaseResult marked Tipped (the feet
// lifted when the last stable set was lost, the factor at which it tips,
// no displacements or forces), the other cases are solved as usual, and
// Static returns the result together with a *TippingError naming the
// case, or errors.Join of one *TippingError per tipped case, in case
// order (errors.As finds the first). Callers that only check err != nil
// stay safe; callers that go on must check CaseResult.Tipped.
//
// If a solve's relative residual exceeds MaxResidual it returns the
// result together with a *ConditionError (the worst one), unless a case
// tipped: the tipping errors then stand alone, so that a caller that
// accepts a result with a *ConditionError never takes a tipped case for
// a solved one; CaseResult.Residual still tells.
func (s *Solver) Static(m *Model, st *StaticSettings) (*StaticResult, error) {
	if st == nil {
		st = &StaticSettings{}
	}
	if err := m.Validate(); err != nil {
		return nil, err
	}
	if len(m.cases) == 0 {
		return nil, errors.New("springnet: no load cases: add loads (AddLoad) or a case (AddLoadCase)")
	}
	nt, err := prepare(m, st.Level)
	if err != nil {
		return nil, err
	}
	res := &StaticResult{m: m, level: st.Level, nt: nt}
	co := compressionOnlyFeet(m)
	var worst *ConditionError
	var tips []error
	factored := false
	for c := range m.cases {
		cl, err := nt.buildLoads(CaseID(c))
		if err != nil {
			return nil, err
		}
		cr, err := s.solveCaseOn(nt, CaseID(c), cl, co, &factored)
		var tip *TippingError
		if errors.As(err, &tip) {
			res.cases = append(res.cases, s.tippedCase(nt, CaseID(c), cl, co, tip))
			tips = append(tips, tip)
			continue
		}
		if err != nil {
			return nil, err
		}
		if cr.residual > MaxResidual && (worst == nil || cr.residual > worst.Residual) {
			worst = cr.conditionError()
		}
		if !cr.finite() {
			return nil, fmt.Errorf("springnet: case %q: the solution is not finite; the model is singular or its values overflow", cr.name)
		}
		res.cases = append(res.cases, cr)
	}
	return res, resultError(tips, worst)
}

// resultError returns the error that goes with a result of Static or
// Sweep: the tipping errors if a case tipped (one alone, several joined in
// order), else worst if not nil, else nil.
func resultError(tips []error, worst *ConditionError) error {
	switch {
	case len(tips) == 1:
		return tips[0]
	case len(tips) > 1:
		return errors.Join(tips...)
	case worst != nil:
		return worst
	}
	return nil
}

// compressionOnlyFeet returns the element indices of the
// compression-only feet of m.
func compressionOnlyFeet(m *Model) []int {
	var co []int
	for i := range m.elems {
		if m.elems[i].kind == FootKind && m.elems[i].foot.CompressionOnly {
			co = append(co, i)
		}
	}
	return co
}

// solveCaseOn solves case c of nt: without compression-only feet by the
// factorisation of K (made first unless *factored, which it then sets),
// else by the active-set loop over the feet co, which refactorises as the
// contact set changes (and leaves *factored alone).
func (s *Solver) solveCaseOn(nt *net, c CaseID, cl *caseLoads, co []int, factored *bool) (*CaseResult, error) {
	if len(co) > 0 {
		return s.contact(nt, c, cl, co)
	}
	if !*factored {
		if err := s.factor(nt); err != nil {
			return nil, err
		}
		*factored = true
	}
	return s.solveCase(nt, c, cl), nil
}

// solveCase solves one case with the current factorisation and recovers
// its results.
func (s *Solver) solveCase(nt *net, c CaseID, cl *caseLoads) *CaseResult {
	f := nt.dm.totalLoad(cl)
	u := make([]float64, len(f))
	r := s.solve(u, f)
	return nt.recover(c, cl, u, r)
}

// StaticResult holds the results of every load case and combination of a
// static analysis, in case order.
type StaticResult struct {
	m     *Model
	level materials.Level
	nt    *net
	cases []*CaseResult
}

// Level returns the material level the analysis used.
func (r *StaticResult) Level() materials.Level { return r.level }

// NumCases returns the number of cases (load cases and combinations).
func (r *StaticResult) NumCases() int { return len(r.cases) }

// Case returns the result of case or combination c.
func (r *StaticResult) Case(c CaseID) *CaseResult {
	if c < 0 || int(c) >= len(r.cases) {
		panic(fmt.Sprintf("springnet: case handle %d out of range [0, %d)", c, len(r.cases)))
	}
	return r.cases[c]
}

// Displacement returns the displacement of node n in DefaultCase (the
// first case; zero if it tipped); use Case for the others.
func (r *StaticResult) Displacement(n NodeID) Displacement { return r.cases[0].Displacement(n) }

// Residual returns the largest relative residual of all the solves.
func (r *StaticResult) Residual() float64 {
	w := 0.0
	for _, c := range r.cases {
		w = math.Max(w, c.residual)
	}
	return w
}

// ElementForce is the force state of one element in one case. Forces are
// in N, moments in N·m, stresses in Pa.
type ElementForce struct {
	Kind ElementKind
	// Axial is the axial force, tension positive: of a bar, of the axial
	// part of a spring, or of a beam at end a.
	Axial float64
	// Stress is the axial stress N/A (bars and beams with an area); for a
	// composite section, the stress of the part with the highest
	// utilisation (or of the first part).
	Stress float64
	// Utilisation is the axial stress over the strength of bars: Yield in
	// tension, CompressiveStrength in compression (the worst part of a
	// composite); 0 when not rated. Beams are left to member checks, which
	// include bending.
	Utilisation float64
	// Spring is, for a two-node spring, the force per global direction
	// F_i = k_i·(u_b,i − u_a,i) (positive: extended; it pulls a towards +i)
	// plus the axial part along a→b; for a foot, the reaction the floor
	// exerts on the stand.
	Spring Load
	// Beam holds a beam's end forces in local axes (see element.BeamForces),
	// corrected for its self-weight line load.
	Beam element.BeamForces
}

// FootResult is the state of one foot in one case.
type FootResult struct {
	Element  ElementID
	Name     string
	Node     NodeID
	Reaction Load    // force and moment the floor exerts on the stand [N, N·m]
	Share    float64 // Reaction.FZ over the sum of FZ of all feet [-]; 0 if that sum is 0
	Uplift   bool    // the vertical reaction is tension (the foot pulls the stand down)
	Lifted   bool    // a compression-only foot out of contact
	// Held marks a lifted foot that still carries its horizontal and
	// rotational springs: the contact search found no consistent set with
	// it either down or free (it pulls on the floor while down, and presses
	// into it once it lets go sideways), so it is taken at the point of
	// lifting with friction holding it. Its vertical reaction is zero; its
	// Reaction holds the sideways force. A foot so close to lifting
	// deserves a look: anchor it or check the frame's racking.
	Held bool
}

// Equilibrium compares the applied loads with the reactions, forces and
// moments about the global origin. ForceError and MomentError are
// |Σapplied + Σreactions| over the sum of the magnitudes of every
// applied load and reaction (0 when there is nothing).
type Equilibrium struct {
	Applied     Load // sum of applied loads incl. gravity, moments about the origin
	Reactions   Load // sum of support and foot reactions, moments about the origin
	ForceError  float64
	MomentError float64
}

// Tipping is the tipping margin of a case on compression-only feet.
//
// Factor is the factor λ on the case's loads other than gravity (gravity
// acting on members and masses held at its value) at which no stable set
// of feet stays in contact: the contact path is followed exactly for this
// linear model, feet dropping out as their reaction reaches zero and
// coming back as they touch again, until the stand can move freely. λ > 1
// means the case is that far from tipping; LastFoot is the foot whose
// unloading ended it. Found is false when no factor tips the stand (no
// gravity, no other load, or the feet never all unload), and Factor is
// then 0. Model the machine's weight as a Mass so that it counts as
// stabilising.
//
// In a case that tips under its own loads (CaseResult.Tipped), Factor is
// the factor λ ≤ 1 at which it tips, the contact path followed from
// gravity alone (λ = 0, every foot down); it is 0 when no gravity holds
// the stand down. Found is false if the path does not find it (a stand
// that tips under gravity alone), and Note says that the stand tips in
// either case. A margin is a model result: check stability against local
// codes and licensed engineering practice.
type Tipping struct {
	Factor   float64
	Found    bool
	LastFoot string
	Note     string // why the path stopped without an answer, when it did
}

// CaseResult holds the static results of one load case or combination.
//
// A case under which the stand tips (Tipped) has no solution: Lifted
// gives the feet lifted when the last stable set of feet was lost and
// Tipping the factor at which it tips and a note; every other query
// returns zero values (Displacement, At, Differential, Force, Reaction,
// Equilibrium, Residual, DisplacementsTo and ForcesTo write zeros; Feet,
// Reactions and MaterialEnergies are empty, Foot reports ok false), and
// MemberForces, MemberCheck, MembersTo, Buckling and
// ComplianceSensitivity return an error. Nothing is NaN.
type CaseResult struct {
	nt       *net
	id       CaseID
	name     string
	u        []float64
	residual float64
	disp     [][6]float64 // per node
	forces   []ElementForce
	feet     []FootResult
	footIdx  []int        // per element: index into feet or −1
	react    [][6]float64 // per owner: support reactions (fixed DOF only)
	eq       Equilibrium
	tip      Tipping
	lifted   []ElementID
	held     []ElementID   // compression-only feet held sideways (FootResult.Held)
	tipped   *TippingError // non-nil: the stand tips under this case; no solution
}

// Tipped reports whether the stand tips under this case: on
// compression-only feet, no stable set of feet stays in contact. The case
// then has no displacements or forces (see CaseResult); Lifted and
// Tipping say which feet lifted and at what factor it tips. The stand
// must be made stable (weight, a wider base, anchored feet) before the
// case's results mean anything; check stability against local codes and
// licensed engineering practice.
func (c *CaseResult) Tipped() bool { return c.tipped != nil }

// conditionError returns the *ConditionError of c's residual, for a
// caller that found it above MaxResidual.
func (c *CaseResult) conditionError() *ConditionError {
	return &ConditionError{Case: fmt.Sprintf("case %q", c.name), Residual: c.residual}
}

// tippedErr returns the error of a query that needs the solution of a
// tipped case, or nil if c was solved.
func (c *CaseResult) tippedErr(what string) error {
	if c.tipped == nil {
		return nil
	}
	return fmt.Errorf("springnet: case %q: the stand tips (lifted: %s): no %s; make it stable first",
		c.name, strings.Join(c.tipped.Lifted, ", "), what)
}

// Name returns the case's name.
func (c *CaseResult) Name() string { return c.name }

// ID returns the case's handle.
func (c *CaseResult) ID() CaseID { return c.id }

// Residual returns the relative residual of the solve (0 for a tipped
// case).
func (c *CaseResult) Residual() float64 { return c.residual }

// Displacement returns the displacement of node n [m, rad]; rotations that
// do not exist at the node (bars only) are zero, and so is all of it in a
// tipped case.
func (c *CaseResult) Displacement(n NodeID) Displacement {
	c.nt.m.checkNode(n)
	if c.Tipped() {
		return Displacement{}
	}
	return dispOf(c.disp[n])
}

// At returns the motion of a place: a node, a group's reference point or
// a mount point, moving rigidly with its node or group [m, rad]; zero in
// a tipped case.
func (c *CaseResult) At(p Place) Displacement {
	c.nt.m.checkPlace(p)
	if c.Tipped() {
		return Displacement{}
	}
	o, at := c.nt.dm.placeOwner(c.nt.m, p)
	return dispOf(c.nt.dm.pointDisp(o, at, c.u))
}

// Differential returns the motion of place b relative to place a,
// At(b) − At(a): what bends or twists a machine bed between two mounts.
func (c *CaseResult) Differential(a, b Place) Displacement {
	wa, wb := c.At(a).arr(), c.At(b).arr()
	for i := range wb {
		wb[i] -= wa[i]
	}
	return dispOf(wb)
}

// Force returns the force state of element e; in a tipped case only Kind
// is set.
func (c *CaseResult) Force(e ElementID) ElementForce {
	x := c.nt.m.el(e)
	if c.Tipped() {
		return ElementForce{Kind: x.kind}
	}
	return c.forces[e]
}

// Reaction returns the support reaction at a fixed node (NodeID) or a fixed
// rigid group (GroupID, at its reference point): the force and moment the
// support exerts on the stand, in the fixed directions only (zero
// elsewhere; zero everywhere in a tipped case). Feet are reported by Foot
// and Feet.
func (c *CaseResult) Reaction(p Place) Load {
	if c.Tipped() {
		c.nt.m.checkPlace(p)
		return Load{}
	}
	switch p := p.(type) {
	case NodeID:
		c.nt.m.checkNode(p)
		if c.nt.dm.groupOf[p] >= 0 {
			return Load{}
		}
		return loadOf(c.react[p])
	case GroupID:
		c.nt.m.checkGroup(p)
		return loadOf(c.react[c.nt.dm.nNodes+int(p)])
	}
	return Load{}
}

// Foot returns the state of foot e; ok is false if e is not a foot or the
// case tipped (see Lifted).
func (c *CaseResult) Foot(e ElementID) (FootResult, bool) {
	c.nt.m.el(e)
	if c.Tipped() {
		return FootResult{}, false
	}
	i := c.footIdx[e]
	if i < 0 {
		return FootResult{}, false
	}
	return c.feet[i], true
}

// Feet returns the states of all feet in element order (a copy); nil in a
// tipped case (see Lifted).
func (c *CaseResult) Feet() []FootResult { return append([]FootResult(nil), c.feet...) }

// Lifted returns the compression-only feet out of contact. In a tipped
// case, the feet that were lifted when the last stable set of feet was
// lost (TippingError.Lifted names them).
func (c *CaseResult) Lifted() []ElementID { return append([]ElementID(nil), c.lifted...) }

// Equilibrium returns the equilibrium check of the case (zero in a tipped
// case).
func (c *CaseResult) Equilibrium() Equilibrium { return c.eq }

// Tipping returns the tipping margin (zero Tipping without
// compression-only feet). In a tipped case its Factor is at most 1 and
// its Note says that the stand tips.
func (c *CaseResult) Tipping() Tipping { return c.tip }

// DisplacementsTo writes the displacement of every node, in node order,
// into dst (nil allocates) and returns it; zeros in a tipped case.
func (c *CaseResult) DisplacementsTo(dst []Displacement) []Displacement {
	if dst == nil {
		dst = make([]Displacement, len(c.nt.m.nodes))
	}
	if c.Tipped() {
		clear(dst[:len(c.nt.m.nodes)])
		return dst
	}
	for i := range c.disp {
		dst[i] = dispOf(c.disp[i])
	}
	return dst
}

func (c *CaseResult) finite() bool {
	if !finiteAll(c.u) {
		return false
	}
	for _, f := range c.forces {
		if !f.Spring.finite() || !finite(f.Axial+f.Stress+f.Utilisation) {
			return false
		}
	}
	return true
}

// recover computes the results of case c from the solution u.
func (nt *net) recover(c CaseID, cl *caseLoads, u []float64, residual float64) *CaseResult {
	m := nt.m
	d := &nt.dm
	cr := &CaseResult{nt: nt, id: c, name: m.cases[c].name, u: u, residual: residual}
	cr.disp = make([][6]float64, len(m.nodes))
	for i := range m.nodes {
		cr.disp[i] = d.nodeDisp(NodeID(i), m.nodes[i].at, u)
	}
	no := len(d.ownerRef)
	internal := make([][6]float64, no)
	cr.forces = make([]ElementForce, len(m.elems))
	cr.footIdx = make([]int, len(m.elems))
	var k [12][12]float64
	var dofs [12]edof
	var sumFZ float64
	for i := range m.elems {
		cr.footIdx[i] = -1
		e := &m.elems[i]
		p := &nt.el[i]
		nd := nt.elemStiffness(i, &k, &dofs)
		var fe [12]float64
		for a := 0; a < nd; a++ {
			s := 0.0
			for b := 0; b < nd; b++ {
				s += k[a][b] * cr.disp[dofs[b].n][dofs[b].c]
			}
			fe[a] = s
		}
		ef := ElementForce{Kind: e.kind}
		ua, ub := cr.disp[e.a], [6]float64{}
		if e.b >= 0 {
			ub = cr.disp[e.b]
		}
		switch e.kind {
		case BarKind:
			ef.Axial = element.BarAxialForce(p.frame, p.mp.ea, [3]float64(ua[:3]), [3]float64(ub[:3]))
			ef.Stress, ef.Utilisation = p.mp.stress(ef.Axial)
		case SpringKind:
			sf := element.SpringForce(p.k6, ua, ub)
			if p.axial != 0 {
				ef.Axial = element.AxialSpringForce(p.frame, p.axial, [3]float64(ua[:3]), [3]float64(ub[:3]))
				for j := 0; j < 3; j++ {
					sf[j] += ef.Axial * p.frame.Ex[j]
				}
			}
			ef.Spring = loadOf(sf)
		case FootKind:
			var r [6]float64
			for j := 0; j < 6; j++ {
				if p.active || p.held && j != 2 {
					r[j] = -p.k6[j] * ua[j]
				}
			}
			ef.Spring = loadOf(r)
			fr := FootResult{Element: ElementID(i), Name: e.foot.Name, Node: e.a, Reaction: ef.Spring,
				Uplift: r[2] < 0, Lifted: !p.active, Held: p.held && !p.active}
			sumFZ += r[2]
			cr.footIdx[i] = len(cr.feet)
			cr.feet = append(cr.feet, fr)
			if !p.active {
				cr.lifted = append(cr.lifted, ElementID(i))
			}
			if p.held {
				cr.held = append(cr.held, ElementID(i))
			}
		case BeamKind:
			ef.Beam = element.BeamEndForces(p.frame, p.bp, ua, ub)
			if cl.lineG != (Vec{}) {
				for _, nl := range nt.gravityLoads(i, cl.lineG) {
					off := 0
					if nl.n == e.b && nl.n != e.a {
						off = 6
					}
					fl, ml := p.frame.ToLocal(nl.f.arr()), p.frame.ToLocal(nl.m.arr())
					for j := 0; j < 3; j++ {
						ef.Beam.Local[off+j] -= fl[j]
						ef.Beam.Local[off+3+j] -= ml[j]
					}
				}
				l := ef.Beam.Local
				ef.Beam.A = element.SectionForces{N: -l[0], Vy: -l[1], Vz: -l[2], T: -l[3], My: -l[4], Mz: -l[5]}
				ef.Beam.B = element.SectionForces{N: l[6], Vy: l[7], Vz: l[8], T: l[9], My: l[10], Mz: l[11]}
			}
			ef.Axial = ef.Beam.A.N
			ef.Stress, _ = p.mp.stress(ef.Axial)
		}
		cr.forces[i] = ef
		if e.kind == FootKind {
			continue
		}
		// Element end forces onto the owners.
		for a := 0; a < nd; a++ {
			n := dofs[a].n
			var f, mo Vec
			if dofs[a].c < 3 {
				f = unitVec(dofs[a].c).Scale(fe[a])
			} else {
				mo = unitVec(dofs[a].c - 3).Scale(fe[a])
			}
			d.addOwnerLoad(internal, d.owner(n), m.nodes[n].at, f, mo)
		}
	}
	for i := range cr.feet {
		if sumFZ != 0 {
			cr.feet[i].Share = cr.feet[i].Reaction.FZ / sumFZ
		}
	}

	// Support reactions: internal − applied at fixed DOF.
	cr.react = make([][6]float64, no)
	var app, rea [6]float64
	var appMag, reaMag [2]float64
	addAbout := func(sum *[6]float64, mag *[2]float64, at Vec, l [6]float64) {
		f := vecOf([3]float64{l[0], l[1], l[2]})
		mo := vecOf([3]float64{l[3], l[4], l[5]}).Add(at.Cross(f))
		for j, v := range [6]float64{f.X, f.Y, f.Z, mo.X, mo.Y, mo.Z} {
			sum[j] += v
		}
		mag[0] += f.Norm()
		mag[1] += mo.Norm()
	}
	for o := 0; o < no; o++ {
		var a6 [6]float64
		for j := 0; j < 6; j++ {
			a6[j] = cl.grav[o][j] + cl.vari[o][j]
		}
		addAbout(&app, &appMag, d.ownerRef[o], a6)
		fixed := DOF(0)
		if o < d.nNodes {
			fixed = m.nodes[o].fixed
		} else {
			fixed = m.groupFix[GroupID(o-d.nNodes)]
		}
		if o < d.nNodes && d.groupOf[o] >= 0 {
			continue
		}
		for j := 0; j < 6; j++ {
			if fixed&dofAt(j) != 0 && d.ownerHas[o]&dofAt(j) != 0 {
				cr.react[o][j] = internal[o][j] - a6[j]
			}
		}
		if cr.react[o] != ([6]float64{}) {
			addAbout(&rea, &reaMag, d.ownerRef[o], cr.react[o])
		}
	}
	for _, fr := range cr.feet {
		addAbout(&rea, &reaMag, m.nodes[fr.Node].at, fr.Reaction.arr())
	}
	cr.eq = Equilibrium{Applied: loadOf(app), Reactions: loadOf(rea)}
	if den := appMag[0] + reaMag[0]; den > 0 {
		cr.eq.ForceError = vecOf([3]float64{app[0] + rea[0], app[1] + rea[1], app[2] + rea[2]}).Norm() / den
	}
	if den := appMag[1] + reaMag[1]; den > 0 {
		cr.eq.MomentError = vecOf([3]float64{app[3] + rea[3], app[4] + rea[4], app[5] + rea[5]}).Norm() / den
	}
	return cr
}

func unitVec(i int) Vec {
	var a [3]float64
	a[i] = 1
	return vecOf(a)
}
