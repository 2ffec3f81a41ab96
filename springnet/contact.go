package springnet

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"
)

// contactTol is the relative size, against the total applied force, below
// which a foot's vertical reaction counts as zero when deciding contact.
// Far above round-off of the solve (MaxResidual is 1e-8 at worst, 1e-12
// typically) and far below any force that matters.
const contactTol = 1e-9

// contact solves case c on compression-only feet by an active-set loop of
// linear solves (see settle), then follows the contact path beyond the
// case's loads to find the tipping margin.
//
// A loose foot in contact carries all its springs; lifted, none. That
// model can have no consistent contact set: a foot pulls on the floor
// while down, yet once it lets go sideways the frame racks and the foot
// would press into the floor. The search then cycles; the feet that flip
// within the cycle are held (FootResult.Held): lifted vertically but
// still held sideways by their horizontal and rotational springs, the
// limit of a foot at the point of lifting whose friction still holds.
// Holding only grows (at worst every foot is held), and with every foot
// held only vertical springs come and go: the contact is then a linear
// complementarity problem with a symmetric positive definite matrix (the
// stand's flexibility at the feet), for which the least-index rule
// terminates (Murty, Linear Complementarity, Linear and Nonlinear
// Programming, 1988, from memory). So the search ends.
func (s *Solver) contact(nt *net, c CaseID, cl *caseLoads, co []int) (*CaseResult, error) {
	for _, i := range co {
		nt.el[i].active = true
		nt.el[i].held = false
	}
	fg := nt.dm.eqVector(nil, cl.grav)
	fv := nt.dm.eqVector(nil, cl.vari)
	f := make([]float64, len(fg))
	for i := range f {
		f[i] = fg[i] + fv[i]
	}
	tol := contactTol * (loadMagnitude(cl.grav) + loadMagnitude(cl.vari))
	name := nt.m.cases[c].name
	u := make([]float64, len(f))
	var residual float64
	for {
		r, cycle, err := s.settle(nt, u, f, co, tol, name)
		if err != nil {
			return nil, err
		}
		if cycle == nil {
			residual = r
			break
		}
		if !nt.hold(cycle, co) {
			return nil, fmt.Errorf("springnet: case %q: the contact of the compression-only feet did not settle "+
				"with every foot held", name)
		}
	}
	cr := nt.recover(c, cl, u, residual)
	tip, err := s.tipping(nt, fg, fv, co, tol, 1)
	if err != nil {
		return nil, err
	}
	cr.tip = tip
	return cr, nil
}

// tippedCase builds the result of case c, under which the stand on the
// compression-only feet co tips (te, from contact): no solution, the feet
// lifted when the last stable set was lost (the state contact left), and
// the factor λ ≤ 1 on the loads other than gravity at which it tips,
// found by following the contact path from gravity alone (λ = 0, every
// foot down) as Tipping does from λ = 1.
func (s *Solver) tippedCase(nt *net, c CaseID, cl *caseLoads, co []int, te *TippingError) *CaseResult {
	cr := &CaseResult{nt: nt, id: c, name: nt.m.cases[c].name, tipped: te}
	for _, i := range co {
		if !nt.el[i].active {
			cr.lifted = append(cr.lifted, ElementID(i))
		}
		nt.el[i].active, nt.el[i].held = true, false
	}
	fg := nt.dm.eqVector(nil, cl.grav)
	fv := nt.dm.eqVector(nil, cl.vari)
	tol := contactTol * (loadMagnitude(cl.grav) + loadMagnitude(cl.vari))
	note := fmt.Sprintf("the stand tips under the loads of case %q: no stable set of feet stays in contact (lifted: %s)",
		cr.name, strings.Join(te.Lifted, ", "))
	tip, err := s.tipping(nt, fg, fv, co, tol, 0)
	switch {
	case err == nil && tip.Found && tip.Factor <= 1:
		tip.Note = fmt.Sprintf("%s; it tips at %.4g × the loads other than gravity", note, tip.Factor)
	case isZero(fg):
		// No weight holds it down: any other load tips it.
		tip = Tipping{Factor: 0, Found: true, Note: note + "; nothing holds it down (no gravity), so any other load tips it"}
	case isZero(fv):
		tip = Tipping{Note: note + "; it tips under gravity alone (its centre of gravity is outside the feet)"}
	default:
		tip = Tipping{Note: note + "; the contact path from gravity alone did not find the factor at which it tips"}
	}
	cr.tip = tip
	return cr
}

// hold marks the feet of cycle as held; if all of them already are, every
// foot of co. It reports whether anything changed.
func (nt *net) hold(cycle, co []int) bool {
	changed := false
	for _, i := range cycle {
		if !nt.el[i].held {
			nt.el[i].held = true
			changed = true
		}
	}
	if changed {
		return true
	}
	for _, i := range co {
		if !nt.el[i].held {
			nt.el[i].held = true
			changed = true
		}
	}
	return changed
}

// settle finds the contact set of the feet co under the loads f, starting
// from their current state, and leaves the solution in u. Each step solves
// with the current set and flips feet in contact that pull on the floor or
// lifted feet that would press into it. The first steps drop the foot in
// the worst tension and re-admit every penetrating foot at once (fast in
// the common case); once a contact set repeats, one foot at a time, the
// one of least index (Murty's least-index rule). If a set repeats under
// that rule too, settle returns the feet that flipped since its first
// visit and leaves the state as it is.
func (s *Solver) settle(nt *net, u, f []float64, co []int, tol float64, name string) (float64, []int, error) {
	maxSolves := 50*len(co) + 100
	seen := make(map[string]int) // contact set → index into flips when visited
	var flips []int
	leastIndex := false
	for solves := 0; ; solves++ {
		if solves > maxSolves {
			return 0, nil, fmt.Errorf("springnet: case %q: the contact of the compression-only feet did not settle in %d solves", name, maxSolves)
		}
		key := nt.contactKey(co)
		if at, ok := seen[key]; ok {
			if leastIndex {
				return 0, uniqueInts(flips[at:]), nil
			}
			leastIndex = true
			clear(seen)
			flips = flips[:0]
		}
		seen[key] = len(flips)
		if err := s.factorAs(nt, false); err != nil {
			return 0, nil, s.tipOrMechanism(nt, err, name, co)
		}
		residual := s.solve(u, f)
		worst, worstR := -1, -tol
		var admit []int
		for _, i := range co {
			r := nt.footFZ(i, u)
			switch {
			case nt.el[i].active && r < worstR && !(leastIndex && worst >= 0):
				worst, worstR = i, r
			case !nt.el[i].active && r > tol:
				admit = append(admit, i) // it would press into the floor
			}
		}
		if leastIndex {
			// The least index among both kinds of violation.
			switch {
			case worst >= 0 && (len(admit) == 0 || worst < admit[0]):
				admit = nil
			case len(admit) > 0:
				worst, admit = -1, admit[:1]
			}
		}
		if worst < 0 && len(admit) == 0 {
			return residual, nil, nil
		}
		if worst >= 0 {
			nt.el[worst].active = false
			flips = append(flips, worst)
		}
		for _, i := range admit {
			nt.el[i].active = true
			flips = append(flips, i)
		}
	}
}

// uniqueInts returns the distinct values of x in order of first
// appearance.
func uniqueInts(x []int) []int {
	var out []int
	for _, v := range x {
		if !slices.Contains(out, v) {
			out = append(out, v)
		}
	}
	return out
}

// footFZ returns the vertical reaction foot i would have from u if it were
// in contact: −k_z·u_z.
func (nt *net) footFZ(i int, u []float64) float64 {
	e := &nt.m.elems[i]
	w := nt.dm.nodeDisp(e.a, nt.m.nodes[e.a].at, u)
	return -nt.el[i].k6[2] * w[2]
}

// tipOrMechanism turns a factorisation failure with feet lifted into a
// *TippingError; with every foot down it is a plain mechanism, and so it is
// when the free node is the node of a lifted foot (a pin-jointed leg whose
// foot left the floor swings freely: that is no tipping, but the model
// cannot say what the leg does).
func (s *Solver) tipOrMechanism(nt *net, err error, name string, co []int) error {
	var lifted []string
	for _, i := range co {
		if !nt.el[i].active {
			lifted = append(lifted, nt.m.elems[i].foot.Name)
		}
	}
	var me *MechanismError
	if !errors.As(err, &me) {
		return err
	}
	me.Case = name
	if len(lifted) == 0 {
		s.describeMotion(nt, me) // s.k is still the failed matrix
		return me
	}
	if f := s.hangsFree(nt, me.Node, co); f != "" {
		me.Motion = fmt.Sprintf("foot %q lifted off and its node hangs free (a pin-jointed leg); "+
			"make the leg a beam, brace the foot, or bolt it down", f)
		return me
	}
	return &TippingError{Case: name, Lifted: lifted}
}

// hangsFree tells a lifted foot whose node hangs free from a stand that
// tips, after a factorisation failed at node n: it returns the name of the
// lifted foot at n if the failure is that node's (a pin-jointed leg), else
// "". Where the factorisation meets a tipping stand's free motion depends
// on the ordering, so the node alone does not tell: with every lifted foot
// held sideways (see contact) a hanging node is held, while a stand that
// tips about feet on the floor still moves freely (turning about a line
// on the floor moves the floor's points vertically, to first order). It
// refactorises with the held feet and restores their state.
func (s *Solver) hangsFree(nt *net, n NodeID, co []int) string {
	f := nt.liftedFootAt(n, co)
	if f == "" {
		return ""
	}
	was := make([]bool, len(co))
	for j, i := range co {
		was[j] = nt.el[i].held
		nt.el[i].held = true
	}
	err := s.factorAs(nt, false)
	for j, i := range co {
		nt.el[i].held = was[j]
	}
	if err != nil {
		return "" // still free with the feet held: the stand tips
	}
	return f
}

// liftedFootAt returns the name of a lifted compression-only foot at node
// n, or "".
func (nt *net) liftedFootAt(n NodeID, co []int) string {
	if n < 0 {
		return ""
	}
	for _, i := range co {
		if !nt.el[i].active && nt.m.elems[i].a == n {
			return nt.m.elems[i].foot.Name
		}
	}
	return ""
}

// tipping follows the contact path for loads fg + λ·fv from λ = lam0
// upward, starting from the current contact set (the one the case settled
// on, from 1; every foot down, from 0), until the stand can move freely. Within a contact set the reactions are linear in λ, so each
// change of contact happens at a λ found in closed form.
func (s *Solver) tipping(nt *net, fg, fv []float64, co []int, tol, lam0 float64) (Tipping, error) {
	if isZero(fg) || isZero(fv) {
		return Tipping{}, nil
	}
	n := len(fg)
	ug, uv := make([]float64, n), make([]float64, n)
	lam := lam0
	last := ""
	path := contactPath{seen: make(map[string]int)} // contact sets visited at this λ
	maxEvents := 50*len(co) + 100
	for ev := 0; ev < maxEvents; ev++ {
		if err := s.factorAs(nt, false); err != nil {
			var me *MechanismError
			if errors.As(err, &me) && last != "" {
				if f := s.hangsFree(nt, me.Node, co); f != "" {
					return Tipping{Note: fmt.Sprintf("the contact path stopped at %.4g × the loads: "+
						"foot %q lifted off and its node hangs free (a pin-jointed leg)", lam, f)}, nil
				}
				return Tipping{Factor: lam, Found: true, LastFoot: last}, nil
			}
			if me != nil {
				s.describeMotion(nt, me) // s.k is still the failed matrix
			}
			return Tipping{}, err
		}
		s.solve(ug, fg)
		s.solve(uv, fv)
		// First make the contact set consistent at λ, one foot at a time,
		// the least index first (feet that unload together, at the same λ,
		// leave one after the other). A set seen before at this λ is a
		// cycle: its feet are held (see contact) and the search goes on.
		flip := -1
		for _, i := range co {
			r := nt.footFZ(i, ug) + lam*nt.footFZ(i, uv)
			if (nt.el[i].active && r < -tol) || (!nt.el[i].active && r > tol) {
				flip = i
				break
			}
		}
		if flip >= 0 {
			if _, stuck := nt.flipOnPath(&path, flip, co, &last); stuck {
				return Tipping{Note: fmt.Sprintf("the contact of the feet did not settle at %.4g × the loads", lam)}, nil
			}
			continue
		}
		next, who := math.Inf(1), -1
		for _, i := range co {
			rg, rv := nt.footFZ(i, ug), nt.footFZ(i, uv)
			// In contact and unloading, or lifted and coming down: the
			// reaction rg + λ·rv crosses zero at λ = −rg/rv.
			// A rate within round-off of zero (|rv| ≤ tol) is no change.
			if (nt.el[i].active && rv < -tol) || (!nt.el[i].active && rv > tol) {
				// A foot already at zero (round-off either side) counts now.
				if l := -rg / rv; l > lam*(1-eventTol) && l < next {
					next, who = math.Max(l, lam), i
				}
			}
		}
		if who < 0 {
			return Tipping{}, nil
		}
		if next > lam*(1+eventTol) {
			path.reset() // a new λ: sets seen before are no cycle
		}
		// At the same λ the event can undo the consistency step: a cycle.
		flipped, stuck := nt.flipOnPath(&path, who, co, &last)
		if stuck {
			return Tipping{Note: fmt.Sprintf("the contact of the feet did not settle at %.4g × the loads", lam)}, nil
		}
		if flipped {
			lam = next
		}
	}
	return Tipping{Note: fmt.Sprintf("the contact path did not end in %d changes of contact (last at %.4g × the loads)", maxEvents, lam)}, nil
}

// contactPath remembers the contact sets visited at one load factor and
// the feet flipped since, to find a cycle.
type contactPath struct {
	seen  map[string]int // contact set → index into flips when visited
	flips []int
}

func (p *contactPath) reset() {
	clear(p.seen)
	p.flips = p.flips[:0]
}

// flipOnPath flips foot i (naming it in *last when it lifts) unless the
// current contact set was visited before at this load factor: then it
// holds the feet flipped since (see contact), forgets the visits and
// returns flipped false; stuck when there was nothing left to hold.
func (nt *net) flipOnPath(p *contactPath, i int, co []int, last *string) (flipped, stuck bool) {
	if cyc, ok := nt.visit(p.seen, &p.flips, i, co); !ok {
		p.reset()
		return false, !nt.hold(cyc, co)
	}
	nt.el[i].active = !nt.el[i].active
	if !nt.el[i].active {
		*last = nt.m.elems[i].foot.Name
	}
	return true, false
}

// visit records the current contact set of the feet co in seen and the
// coming flip of foot i in flips. If the set was seen before, it returns
// the feet flipped since then and false.
func (nt *net) visit(seen map[string]int, flips *[]int, i int, co []int) ([]int, bool) {
	k := nt.contactKey(co)
	if at, ok := seen[k]; ok {
		return uniqueInts((*flips)[at:]), false
	}
	seen[k] = len(*flips)
	*flips = append(*flips, i)
	return nil, true
}

// contactKey returns the contact set of the feet co as a string of 0 and 1.
func (nt *net) contactKey(co []int) string {
	key := make([]byte, len(co))
	for j, i := range co {
		key[j] = '0'
		if nt.el[i].active {
			key[j] = '1'
		}
	}
	return string(key)
}

// eventTol is the relative band around the current load factor within
// which a contact change counts as happening now: feet that unload at the
// same factor in exact arithmetic differ by round-off.
const eventTol = 1e-9

func isZero(x []float64) bool {
	for _, v := range x {
		if v != 0 {
			return false
		}
	}
	return true
}

// loadMagnitude returns the sum of the magnitudes of the owners' forces.
func loadMagnitude(l [][6]float64) float64 {
	s := 0.0
	for _, v := range l {
		s += math.Sqrt(v[0]*v[0] + v[1]*v[1] + v[2]*v[2])
	}
	return s
}
