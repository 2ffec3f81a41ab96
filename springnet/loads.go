package springnet

import "math"

// caseLoads holds the loads of one case or combination on the owners,
// split into the gravity part (self-weight and masses: the stabilising
// part for the tipping margin) and the rest.
type caseLoads struct {
	grav, vari [][6]float64 // per owner, about its reference point
	gvec       Vec          // gravity acceleration of a plain case [m/s²]
	// beamQ is the combined gravity line load on each element [N/m]
	// (global), used to recover beam end forces; nil when no gravity.
	lineG Vec // Σ factor·gravity: the line load on an element is lineMass·lineG
}

// buildLoads returns the loads of case c. A load on a DOF that does not
// exist (a rotation of a group that no element resists) is a mechanism.
func (nt *net) buildLoads(c CaseID) (*caseLoads, error) {
	cl := nt.buildLoadsRaw(c)
	d := &nt.dm
	for o := range cl.grav {
		// Round-off in r × F must not count as a load: compare with the
		// owner's force times the model's size.
		var fo, mo float64
		for j := 0; j < 3; j++ {
			fo += math.Abs(cl.grav[o][j]) + math.Abs(cl.vari[o][j])
			mo += math.Abs(cl.grav[o][j+3]) + math.Abs(cl.vari[o][j+3])
		}
		tiny := 1e-12 * (fo*nt.span + mo)
		for j := 0; j < 6; j++ {
			if d.ownerHas[o]&dofAt(j) == 0 && (math.Abs(cl.grav[o][j]) > tiny || math.Abs(cl.vari[o][j]) > tiny) {
				me := &MechanismError{Node: -1, Group: -1, DOF: dofAt(j), Case: nt.m.cases[c].name,
					Motion: "a load acts in a direction that nothing resists"}
				if o < d.nNodes {
					me.Node, me.Name = NodeID(o), nt.m.nodes[o].name
				} else {
					me.Group, me.Name = GroupID(o-d.nNodes), nt.m.groups[o-d.nNodes].name
				}
				return nil, me
			}
		}
	}
	return cl, nil
}

func (nt *net) buildLoadsRaw(c CaseID) *caseLoads {
	m := nt.m
	d := &nt.dm
	no := len(d.ownerRef)
	cl := &caseLoads{grav: make([][6]float64, no), vari: make([][6]float64, no)}
	lc := &m.cases[c]
	if lc.terms == nil {
		nt.addCase(cl, lc, 1)
		return cl
	}
	for _, t := range lc.terms {
		nt.addCase(cl, &m.cases[t.Case], t.Factor)
	}
	return cl
}

func (nt *net) addCase(cl *caseLoads, lc *loadCase, f float64) {
	m := nt.m
	d := &nt.dm
	for _, pl := range lc.loads {
		o, at := d.placeOwner(m, pl.at)
		d.addOwnerLoad(cl.vari, o, at, pl.l.Force().Scale(f), pl.l.Moment().Scale(f))
	}
	g := lc.gravity.Scale(f)
	if g == (Vec{}) {
		return
	}
	cl.lineG = cl.lineG.Add(g)
	for i := range m.elems {
		for _, el := range nt.gravityLoads(i, g) {
			o := d.owner(el.n)
			d.addOwnerLoad(cl.grav, o, m.nodes[el.n].at, el.f, el.m)
		}
	}
	for _, pm := range m.masses {
		o, at := d.placeOwner(m, pm.on)
		d.addOwnerLoad(cl.grav, o, at.Add(pm.m.Offset), g.Scale(pm.m.Kg), Vec{})
	}
}

type nodalLoad struct {
	n    NodeID
	f, m Vec
}

// gravityLoads returns the equivalent nodal loads of element i's
// self-weight under gravity g. Bars: half the weight at each end. Beams
// without releases or end springs: the consistent loads of a uniform line
// load q (fixed-end forces; e.g. Przemieniecki, Theory of Matrix Structural
// Analysis, ch. 5):
//
//	F_a = F_b = q·L/2,   M_a = −M_b = (L²/12)·e × q⊥
//
// with e the unit axis and q⊥ the part of q across it. Beams with releases
// or end springs get half the weight at each end and no moments (an
// approximation, small for self-weight).
func (nt *net) gravityLoads(i int, g Vec) []nodalLoad {
	e := &nt.m.elems[i]
	p := &nt.el[i]
	if e.kind != BarKind && e.kind != BeamKind {
		return nil
	}
	q := g.Scale(p.mp.lineMass) // N/m
	if q == (Vec{}) {
		return nil
	}
	l := p.frame.L
	half := q.Scale(l / 2)
	out := []nodalLoad{{n: e.a, f: half}, {n: e.b, f: half}}
	if e.kind == BeamKind && nt.fixedEnds(i) {
		ax := vecOf(p.frame.Ex)
		qp := q.Sub(ax.Scale(q.Dot(ax)))
		ma := ax.Cross(qp).Scale(l * l / 12)
		out[0].m, out[1].m = ma, ma.Scale(-1)
	}
	return out
}

// fixedEnds reports whether beam i has no releases and no end springs, so
// that its consistent line loads apply.
func (nt *net) fixedEnds(i int) bool {
	bm := nt.m.elems[i].beam
	return bm.ReleaseA == 0 && bm.ReleaseB == 0 && bm.SpringA == (Vec{}) && bm.SpringB == (Vec{})
}
