package springnet

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet/eigen"
	"github.com/trestle-go/trestle/springnet/element"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// BucklingSettings controls a whole-frame buckling analysis. A nil
// *BucklingSettings means defaults; zero fields mean defaults.
type BucklingSettings struct {
	// Modes is the number of lowest load factors wanted; 0 means 3.
	Modes int
	// Level picks the material values; the zero Level is Nominal.
	Level materials.Level
}

// DefaultBucklingModes is the number of load factors Buckling finds when
// BucklingSettings.Modes is 0.
const DefaultBucklingModes = 3

// BucklingResult holds the lowest load factors of a linear buckling
// analysis and their mode shapes.
type BucklingResult struct {
	nt      *net
	c       CaseID
	static  *CaseResult
	factors []float64
	resid   []float64
	vecs    [][]float64 // per mode, over the equations; largest translation 1
}

// Buckling finds the lowest load factors λ by which the loads of case c
// (a load case or a combination, self-weight included) must be multiplied
// for the stand to buckle, and their mode shapes: the linear (eigenvalue)
// buckling problem
//
//	(K + λ·Kg)·φ = 0
//
// with K the stiffness and Kg the geometric stiffness of every bar and
// beam under its axial force from the static solution of case c (beams:
// the mean of the end forces), assembled through the same DOF map and
// rigid-group elimination as K; compression-only feet take the contact
// state of that solution. It is solved by eigen.Buckling (shift-invert
// Lanczos with a Sturm check). This catches sway buckling of a whole stand
// (a tall stand under a heavy machine), which the member check cannot.
//
// Stated simplifications: the geometric stiffness of beams omits the
// torsion–axial coupling (torsional and lateral-torsional buckling are not
// found) and springs have none; the load-stiffness of loads applied away
// from their node or group (the P-δ of a rigid top carrying an offset
// load) is not included; the axial forces are those of the linear static
// solution and scale with λ (linear buckling: imperfections and
// plasticity lower the real capacity).
//
// Errors: the static errors of case c (*MechanismError; a *TippingError,
// with no result, when the stand tips under case c, whose buckling then
// means nothing; validation — other cases are not solved); a *FewerFactorsError, with no result, when no load factor
// is positive (nothing in compression can buckle: a tension-only
// structure), or with the result when fewer than Modes exist. A static
// solve whose residual exceeds MaxResidual gives the result with a
// *ConditionError. A buckling factor is a model result: check stability
// against local codes and licensed engineering practice.
func Buckling(m *Model, c CaseID, s *BucklingSettings) (*BucklingResult, error) {
	var sv Solver
	return sv.Buckling(m, c, s)
}

// Buckling is the package function Buckling with the static solution of
// case c solved by sv (which keeps its symbolic analysis for the next
// level or case); the eigenproblem has its own factorisation.
func (sv *Solver) Buckling(m *Model, c CaseID, s *BucklingSettings) (*BucklingResult, error) {
	if s == nil {
		s = &BucklingSettings{}
	}
	if s.Modes < 0 {
		return nil, fmt.Errorf("springnet: buckling: %d modes asked for", s.Modes)
	}
	modes := s.Modes
	if modes == 0 {
		modes = DefaultBucklingModes
	}
	if err := m.Validate(); err != nil {
		return nil, err
	}
	if len(m.cases) == 0 {
		return nil, errors.New("springnet: buckling: no load cases: add loads (AddLoad) or a case (AddLoadCase)")
	}
	m.CaseName(c) // panics on a handle out of range
	nt, err := prepare(m, s.Level)
	if err != nil {
		return nil, err
	}
	name := m.cases[c].name
	cl, err := nt.buildLoads(c)
	if err != nil {
		return nil, err
	}
	co := compressionOnlyFeet(m)
	factored := false
	cr, err := sv.solveCaseOn(nt, c, cl, co, &factored)
	if err != nil {
		return nil, err
	}
	if len(co) > 0 {
		// The tipping search moves the contact state on; restore the
		// state of the solution.
		cr.setContact()
	}
	if !cr.finite() {
		return nil, fmt.Errorf("springnet: buckling: case %q: the static solution is not finite", name)
	}
	var cond error
	if cr.residual > MaxResidual {
		cond = &ConditionError{Case: fmt.Sprintf("case %q (static solution for buckling)", name), Residual: cr.residual}
	}

	k := nt.assemble(sparse.NewBuilder(0))
	kg, nonzero := nt.assembleGeometric(sparse.NewBuilder(0), cr.forces)
	res := &BucklingResult{nt: nt, c: c, static: cr}
	n := k.N()
	if !nonzero || n == 0 {
		return nil, &FewerFactorsError{Case: name, Want: modes}
	}
	want := min(modes, n)
	est := &eigen.Settings{Coords: nt.dm.coords}
	er, err := eigen.Buckling(k, kg, want, est)
	var few *eigen.FewerModesError
	switch {
	case errors.As(err, &few):
		if er == nil || er.Len() == 0 {
			fe := &FewerFactorsError{Case: name, Want: modes}
			if rr, err := eigen.Buckling(k, negated(kg), 1, est); err == nil && rr.Len() > 0 {
				fe.Reversed = rr.Values[0]
			}
			return nil, fe
		}
	case err != nil:
		return nil, fmt.Errorf("springnet: buckling: case %q: %w", name, err)
	}
	for i := 0; i < er.Len(); i++ {
		lam := er.Values[i]
		v := er.Vector(i)
		if !finite(lam) || !finiteAll(v) {
			return nil, fmt.Errorf("springnet: buckling: case %q: mode %d is not finite", name, i)
		}
		res.factors = append(res.factors, lam)
		res.resid = append(res.resid, er.Residuals[i])
		res.vecs = append(res.vecs, nt.normaliseMode(v))
	}
	if len(res.factors) < modes {
		fe := &FewerFactorsError{Case: name, Want: modes, Found: len(res.factors)}
		if cond != nil {
			return res, errors.Join(fe, cond)
		}
		return res, fe
	}
	if cond != nil {
		return res, cond
	}
	return res, nil
}

// FewerFactorsError reports a buckling analysis with fewer positive load
// factors than asked for. Found = 0 (no result is returned) means nothing
// in compression can buckle under the case's loads: a tension-only
// structure, or a case whose members carry no axial force. Reversed is
// then the lowest load factor of the reversed load (λ < 0 of the original
// problem) when there is one, else 0.
type FewerFactorsError struct {
	Case        string
	Want, Found int
	Reversed    float64
}

// Error implements the error interface.
func (e *FewerFactorsError) Error() string {
	if e.Found > 0 {
		return fmt.Sprintf("springnet: buckling: case %q: only %d of the %d load factors asked for are positive", e.Case, e.Found, e.Want)
	}
	msg := fmt.Sprintf("springnet: buckling: case %q: no positive load factor: nothing in compression can buckle under this load (a tension-only structure, or no axial force)", e.Case)
	if e.Reversed > 0 {
		msg += fmt.Sprintf("; with the load reversed it buckles at factor %.4g", e.Reversed)
	}
	return msg
}

// NumModes returns the number of load factors found.
func (r *BucklingResult) NumModes() int { return len(r.factors) }

// Case returns the load case analysed.
func (r *BucklingResult) Case() CaseID { return r.c }

// Level returns the material level of the analysis.
func (r *BucklingResult) Level() materials.Level { return r.nt.level }

// Residual returns the relative residual ‖K·φ + λ·Kg·φ‖ / (‖K‖₁·‖φ‖) of
// mode i (see package eigen).
func (r *BucklingResult) Residual(i int) float64 { return r.resid[r.mode(i)] }

// Static returns the static result of the case whose axial forces gave
// the geometric stiffness.
func (r *BucklingResult) Static() *CaseResult { return r.static }

// Factor returns load factor i (ascending; i from 0): the case's loads
// times Factor(i) buckle the stand in mode i. It panics if i is out of
// range.
func (r *BucklingResult) Factor(i int) float64 { return r.factors[r.mode(i)] }

// FactorsTo writes the load factors into dst (nil allocates) and returns
// it.
func (r *BucklingResult) FactorsTo(dst []float64) []float64 {
	return append(dst[:0], r.factors...)
}

func (r *BucklingResult) mode(i int) int {
	if i < 0 || i >= len(r.factors) {
		panic(fmt.Sprintf("springnet: buckling mode %d out of range [0, %d)", i, len(r.factors)))
	}
	return i
}

// Shape returns the motion of place p in mode i, scaled so that the
// largest translation of any node or group is 1 and positive (a shape has
// no physical size; rotations are in the same scale per metre).
func (r *BucklingResult) Shape(i int, p Place) Displacement {
	v := r.vecs[r.mode(i)]
	r.nt.m.checkPlace(p)
	o, at := r.nt.dm.placeOwner(r.nt.m, p)
	return dispOf(r.nt.dm.pointDisp(o, at, v))
}

// ShapesTo writes the motion of every node in mode i, in node order, into
// dst (nil allocates) and returns it; see Shape for the scale.
func (r *BucklingResult) ShapesTo(dst []Displacement, i int) []Displacement {
	v := r.vecs[r.mode(i)]
	m := r.nt.m
	dst = dst[:0]
	for n := range m.nodes {
		dst = append(dst, dispOf(r.nt.dm.nodeDisp(NodeID(n), m.nodes[n].at, v)))
	}
	return dst
}

// MemberShape appends to dst n ≥ 2 points of bar or beam e bent in mode i,
// in global coordinates [m], the mode scaled by mag (see Shape for the
// scale of a mode), for drawings. It panics if e is not a bar or beam.
func (r *BucklingResult) MemberShape(dst []Vec, i int, e ElementID, n int, mag float64) []Vec {
	v := r.vecs[r.mode(i)]
	m := r.nt.m
	x := m.el(e)
	if x.kind != BarKind && x.kind != BeamKind {
		panic(fmt.Sprintf("springnet: MemberShape: %v %q is not a bar or beam", x.kind, x.name()))
	}
	p := &r.nt.el[e]
	mr := MemberResult{Kind: x.kind, Length: p.frame.L, frame: p.frame, bp: p.bp,
		ua: r.nt.dm.nodeDisp(x.a, m.nodes[x.a].at, v), ub: r.nt.dm.nodeDisp(x.b, m.nodes[x.b].at, v)}
	return mr.Shape(dst, n, mag)
}

// normaliseMode scales v so that its largest translation (over the
// equations of translations) is +1; a mode without translations is scaled
// by its largest component.
func (nt *net) normaliseMode(v []float64) []float64 {
	big, at := 0.0, -1
	for i, x := range v {
		if nt.dm.eqComp[i] < 3 && math.Abs(x) > big {
			big, at = math.Abs(x), i
		}
	}
	if at < 0 {
		for i, x := range v {
			if math.Abs(x) > big {
				big, at = math.Abs(x), i
			}
		}
	}
	if at < 0 || big == 0 {
		return v
	}
	f := 1 / v[at]
	for i := range v {
		v[i] *= f
	}
	return v
}

// elemGeometric writes the global geometric stiffness of element i under
// axial force n [N], tension positive, into k over the returned DOF list,
// the same DOF as elemStiffness gives for bars and beams; other elements
// have none (0).
func (nt *net) elemGeometric(i int, n float64, k *[12][12]float64, dofs *[12]edof) int {
	e := &nt.m.elems[i]
	p := &nt.el[i]
	switch e.kind {
	case BarKind:
		kb := element.BarGeometricStiffness(p.frame, n)
		return barMatrix(e, &kb, k, dofs)
	case BeamKind:
		kb := element.BeamGeometricStiffness(p.frame, p.bp, n)
		return p.beamMatrix(e, &kb, k, dofs)
	}
	return 0
}

// axialForGeometric returns the axial force that loads member i's
// geometric stiffness: a bar's force, the mean of a beam's end forces.
func axialForGeometric(ef *ElementForce) float64 {
	if ef.Kind == BeamKind {
		return (ef.Beam.A.N + ef.Beam.B.N) / 2
	}
	return ef.Axial
}

// assembleGeometric builds the geometric stiffness over the free DOF from
// the element forces, through the rigid-group transformation, into b, and
// reports whether it has a non-zero entry.
func (nt *net) assembleGeometric(b *sparse.Builder, forces []ElementForce) (*sparse.Matrix, bool) {
	d := &nt.dm
	b.Reset(d.n)
	var k [12][12]float64
	var dofs [12]edof
	nonzero := false
	for i := range nt.m.elems {
		kind := nt.m.elems[i].kind
		if kind != BarKind && kind != BeamKind {
			continue
		}
		n := axialForGeometric(&forces[i])
		if n == 0 {
			continue
		}
		nd := nt.elemGeometric(i, n, &k, &dofs)
		if d.scatter(b, nt.m, &k, &dofs, nd, false) {
			nonzero = true
		}
	}
	return b.Matrix(), nonzero
}

// negated returns −a.
func negated(a *sparse.Matrix) *sparse.Matrix {
	b := sparse.NewBuilder(a.N())
	for j := 0; j < a.N(); j++ {
		rows, vals := a.Col(j)
		for p, r := range rows {
			b.Add(r, j, -vals[p])
		}
	}
	return b.Matrix()
}
