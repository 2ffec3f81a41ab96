package springnet

import (
	"errors"
	"fmt"
	"math"
)

// contactTol is the relative size, against the total applied force, below
// which a foot's vertical reaction counts as zero when deciding contact.
// Far above round-off of the solve (MaxResidual is 1e-8 at worst, 1e-12
// typically) and far below any force that matters.
const contactTol = 1e-9

// contact solves case c on compression-only feet by an active-set loop of
// linear solves: start with every foot in contact; drop the foot in the
// worst tension; re-admit every lifted foot that would penetrate the floor;
// repeat until nothing changes. Then it follows the contact path beyond
// the case's loads to find the tipping margin.
func (s *Solver) contact(nt *net, c CaseID, cl *caseLoads, co []int) (*CaseResult, error) {
	for _, i := range co {
		nt.el[i].active = true
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
	maxIter := 4*len(co) + 20
	var residual float64
	for it := 0; ; it++ {
		if it > maxIter {
			return nil, fmt.Errorf("springnet: case %q: the contact of the compression-only feet did not settle in %d solves", name, maxIter)
		}
		if err := s.factor(nt); err != nil {
			return nil, nt.tipOrMechanism(err, name, co)
		}
		residual = s.solve(u, f)
		worst, worstR := -1, -tol
		changed := false
		for _, i := range co {
			r := nt.footFZ(i, u)
			switch {
			case nt.el[i].active && r < worstR:
				worst, worstR = i, r
			case !nt.el[i].active && r > tol:
				nt.el[i].active = true // it would press into the floor
				changed = true
			}
		}
		if worst >= 0 {
			nt.el[worst].active = false
			changed = true
		}
		if !changed {
			break
		}
	}
	cr := nt.recover(c, cl, u, residual)
	tip, err := s.tipping(nt, fg, fv, co, tol)
	if err != nil {
		return nil, err
	}
	cr.tip = tip
	return cr, nil
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
func (nt *net) tipOrMechanism(err error, name string, co []int) error {
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
		return me
	}
	if f := nt.liftedFootAt(me.Node, co); f != "" {
		me.Motion = fmt.Sprintf("foot %q lifted off and its node hangs free (a pin-jointed leg); "+
			"make the leg a beam, brace the foot, or bolt it down", f)
		return me
	}
	return &TippingError{Case: name, Lifted: lifted}
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

// tipping follows the contact path for loads fg + λ·fv from λ = 1 upward,
// starting from the contact set the case settled on, until the stand can
// move freely. Within a contact set the reactions are linear in λ, so each
// change of contact happens at a λ found in closed form.
func (s *Solver) tipping(nt *net, fg, fv []float64, co []int, tol float64) (Tipping, error) {
	if isZero(fg) || isZero(fv) {
		return Tipping{}, nil
	}
	n := len(fg)
	ug, uv := make([]float64, n), make([]float64, n)
	lam := 1.0
	last := ""
	maxEvents := 8*len(co) + 20
	for ev := 0; ev < maxEvents; ev++ {
		if err := s.factor(nt); err != nil {
			var me *MechanismError
			if errors.As(err, &me) && last != "" {
				if f := nt.liftedFootAt(me.Node, co); f != "" {
					return Tipping{Note: fmt.Sprintf("the contact path stopped at %.4g × the loads: "+
						"foot %q lifted off and its node hangs free (a pin-jointed leg)", lam, f)}, nil
				}
				return Tipping{Factor: lam, Found: true, LastFoot: last}, nil
			}
			return Tipping{}, err
		}
		s.solve(ug, fg)
		s.solve(uv, fv)
		// First make the contact set consistent at λ (feet that unload
		// together, at the same λ, leave one after the other).
		worst, worstR := -1, -tol
		readmit := false
		for _, i := range co {
			r := nt.footFZ(i, ug) + lam*nt.footFZ(i, uv)
			switch {
			case nt.el[i].active && r < worstR:
				worst, worstR = i, r
			case !nt.el[i].active && r > tol:
				nt.el[i].active = true
				readmit = true
			}
		}
		if worst >= 0 {
			nt.el[worst].active = false
			last = nt.m.elems[worst].foot.Name
			continue
		}
		if readmit {
			continue
		}
		next, who := math.Inf(1), -1
		for _, i := range co {
			rg, rv := nt.footFZ(i, ug), nt.footFZ(i, uv)
			// In contact and unloading, or lifted and coming down: the
			// reaction rg + λ·rv crosses zero at λ = −rg/rv.
			if (nt.el[i].active && rv < 0) || (!nt.el[i].active && rv > 0) {
				// A foot already at zero (round-off either side) counts now.
				if l := -rg / rv; l > lam*(1-eventTol) && l < next {
					next, who = math.Max(l, lam), i
				}
			}
		}
		if who < 0 {
			return Tipping{}, nil
		}
		nt.el[who].active = !nt.el[who].active
		if !nt.el[who].active {
			last = nt.m.elems[who].foot.Name
		}
		lam = next
	}
	return Tipping{}, nil
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
