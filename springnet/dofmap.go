package springnet

import (
	"fmt"
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet/element"
)

// The DOF map. Owners are the bodies that carry equations: every node not
// in a rigid group (owner index = node index) and every rigid group (owner
// index = number of nodes + group index), whose six DOF sit at its
// reference point. A grouped node's motion follows its group's:
//
//	u_s = u_m + θ_m × r,   θ_s = θ_m,   r = x_s − x_m
//
// Equation numbers run over the owners' free DOF; −1 marks a DOF that is
// fixed or absent.

// term is one contribution to a node DOF: coef times equation eq.
type term struct {
	eq   int
	coef float64
}

// dofMap maps node and owner DOF to equation numbers and back.
type dofMap struct {
	nNodes    int
	groupOf   []int // per node: group index or −1
	ownerRef  []Vec // per owner: reference point
	ownerEq   [][6]int
	ownerHas  []DOF // DOF that exist (fixed or free) per owner
	n         int   // number of equations
	eqOwner   []int // per equation: owner
	eqComp    []int8
	coords    [][3]float64
	groupFix  []DOF
	anyRotReq []DOF // per owner: DOF reached
}

// owner returns the owner of node n.
func (d *dofMap) owner(n NodeID) int {
	if g := d.groupOf[n]; g >= 0 {
		return d.nNodes + g
	}
	return int(n)
}

// nodeTerms writes the terms of component c of node n into buf and returns
// the filled part; fixed or absent DOF give no terms.
func (d *dofMap) nodeTerms(n NodeID, c int, x Vec, buf *[3]term) []term {
	o := d.owner(n)
	eq := &d.ownerEq[o]
	if o < d.nNodes || c >= 3 {
		if eq[c] < 0 {
			return buf[:0]
		}
		buf[0] = term{eq[c], 1}
		return buf[:1]
	}
	r := x.Sub(d.ownerRef[o])
	// Row c of [I, −[r]×]: ux += θy·rz − θz·ry; uy += θz·rx − θx·rz; uz += θx·ry − θy·rx.
	var cs [3]struct {
		k    int
		coef float64
	}
	switch c {
	case 0:
		cs = [3]struct {
			k    int
			coef float64
		}{{0, 1}, {4, r.Z}, {5, -r.Y}}
	case 1:
		cs = [3]struct {
			k    int
			coef float64
		}{{1, 1}, {5, r.X}, {3, -r.Z}}
	default:
		cs = [3]struct {
			k    int
			coef float64
		}{{2, 1}, {3, r.Y}, {4, -r.X}}
	}
	k := 0
	for _, t := range cs {
		if t.coef != 0 && eq[t.k] >= 0 {
			buf[k] = term{eq[t.k], t.coef}
			k++
		}
	}
	return buf[:k]
}

// describeEq names equation i: `node "B3" UY` or `group "top" RZ`.
func (d *dofMap) describeEq(m *Model, i int) string {
	o := d.eqOwner[i]
	return fmt.Sprintf("%s %s", d.ownerName(m, o), dofAt(int(d.eqComp[i])))
}

func (d *dofMap) ownerName(m *Model, o int) string {
	if o < d.nNodes {
		return fmt.Sprintf("node %q", m.nodes[o].name)
	}
	return fmt.Sprintf("group %q", m.groups[o-d.nNodes].name)
}

// placeOwner resolves a place to its owner and point.
func (d *dofMap) placeOwner(m *Model, p Place) (int, Vec) {
	switch p := p.(type) {
	case NodeID:
		return d.owner(p), m.nodes[p].at
	case GroupID:
		return d.nNodes + int(p), d.ownerRef[d.nNodes+int(p)]
	case MountID:
		mt := &m.mounts[p]
		o, _ := d.placeOwner(m, mt.on)
		return o, mt.at
	}
	panic(fmt.Sprintf("springnet: bad place %v", p))
}

// net is a model prepared for analysis at one material level: DOF map
// and per-element data.
type net struct {
	m     *Model
	level materials.Level
	dm    dofMap
	el    []prepElem
	span  float64 // size of the model's bounding box [m]
	// per-owner gravity and variable loads are built per case by loads.go
}

// prepElem holds the level-resolved data of one element.
type prepElem struct {
	frame  element.Frame
	mp     memberProps       // bars and beams
	bp     element.BeamProps // beams
	k6     element.Spring6   // springs (per direction) and feet
	axial  float64           // springs: axial stiffness
	rotA   bool              // beam end a carries rotations
	rotB   bool              // beam end b carries rotations
	active bool              // false: a lifted compression-only foot
	held   bool              // a compression-only foot that keeps its horizontal and rotational springs when lifted
}

// prepare resolves element properties at level l and builds the DOF map.
// The model must be valid.
func prepare(m *Model, l materials.Level) (*net, error) {
	nt := &net{m: m, level: l, el: make([]prepElem, len(m.elems))}
	nn := len(m.nodes)
	reach := make([]DOF, nn) // DOF reached at each node
	used := make([]bool, nn)
	for i := range m.elems {
		e := &m.elems[i]
		p := &nt.el[i]
		p.active = true
		used[e.a] = true
		if e.b >= 0 {
			used[e.b] = true
		}
		var err error
		switch e.kind {
		case BarKind:
			if e.bar.Section == nil {
				p.mp = memberProps{ea: e.bar.EA, lineMass: e.bar.LineMass}
			} else {
				p.mp, err = resolveMember(e.bar.Material, e.bar.Section, RawBeam{}, l, false)
			}
			if err == nil {
				// A bar's section has no set orientation; rolling by the
				// principal angle makes its local axes principal for the
				// Euler check (its stiffness is axial only).
				p.frame, err = element.NewFrame(m.nodes[e.a].at.arr(), m.nodes[e.b].at.arr(), [3]float64{}, p.mp.theta)
			}
			reach[e.a] |= Translations
			reach[e.b] |= Translations
		case BeamKind:
			bm := e.beam
			p.mp, err = resolveMember(bm.Material, bm.Section, bm.Raw, l, bm.Timoshenko)
			if err == nil {
				// Principal axes: a section with a product of area is
				// rolled by its principal angle (memberSection).
				p.frame, err = element.NewFrame(m.nodes[e.a].at.arr(), m.nodes[e.b].at.arr(), bm.Up.arr(), bm.Roll+p.mp.theta)
			}
			if err == nil {
				p.bp = beamPropsOf(bm, &p.mp)
			}
			reach[e.a] |= Translations
			reach[e.b] |= Translations
			if bm.ReleaseA&(ReleaseRX|ReleaseRY|ReleaseRZ) != ReleaseRX|ReleaseRY|ReleaseRZ {
				reach[e.a] |= Rotations
				p.rotA = true
			}
			if bm.ReleaseB&(ReleaseRX|ReleaseRY|ReleaseRZ) != ReleaseRX|ReleaseRY|ReleaseRZ {
				reach[e.b] |= Rotations
				p.rotB = true
			}
		case SpringKind:
			s := e.spring
			f := scaleAt(s.Vary, l)
			for c, v := range s.K.arr() {
				p.k6[c] = v * f
				if v != 0 {
					reach[e.a] |= dofAt(c)
					reach[e.b] |= dofAt(c)
				}
			}
			if s.Axial != 0 {
				p.axial = s.Axial * f
				p.frame, err = element.NewFrame(m.nodes[e.a].at.arr(), m.nodes[e.b].at.arr(), [3]float64{}, 0)
				reach[e.a] |= Translations
				reach[e.b] |= Translations
			}
		case FootKind:
			f := scaleAt(e.foot.Vary, l)
			for c, v := range e.foot.K.arr() {
				p.k6[c] = v * f
				if v != 0 {
					reach[e.a] |= dofAt(c)
				}
			}
		}
		if err != nil {
			return nil, fmt.Errorf("springnet: %v %q: %w", e.kind, e.name(), err)
		}
	}

	d := &nt.dm
	d.nNodes = nn
	d.groupOf = make([]int, nn)
	for i := range d.groupOf {
		d.groupOf[i] = -1
	}
	for g := range m.groups {
		for _, n := range m.groups[g].nodes {
			d.groupOf[n] = g
		}
	}
	no := nn + len(m.groups)
	d.ownerRef = make([]Vec, no)
	d.ownerHas = make([]DOF, no)
	d.ownerEq = make([][6]int, no)
	for i := range m.nodes {
		d.ownerRef[i] = m.nodes[i].at
	}
	for g := range m.groups {
		d.ownerRef[nn+g] = m.GroupPoint(GroupID(g))
		d.ownerHas[nn+g] = AllDOF
	}

	// Moments, offset loads and offset or rotary masses reach rotations.
	needRot := func(o int, r Vec, mom Vec, force Vec) {
		if o >= nn {
			return
		}
		if mom != (Vec{}) || (r.Norm() > 0 && force.Norm() > 0) {
			reach[o] |= Rotations
		}
	}
	for ci := range m.cases {
		for _, pl := range m.cases[ci].loads {
			o, at := d.placeOwner(m, pl.at)
			needRot(o, at.Sub(d.ownerRef[o]), pl.l.Moment(), pl.l.Force())
		}
	}
	for _, pm := range m.masses {
		o, at := d.placeOwner(m, pm.on)
		at = at.Add(pm.m.Offset)
		if o < nn && (pm.m.Inertia != (Vec{}) || pm.m.Products != (Vec{}) || (at.Sub(d.ownerRef[o]).Norm() > 0 && pm.m.Kg > 0)) {
			reach[o] |= Rotations
		}
	}
	for i := range m.nodes {
		if d.groupOf[i] >= 0 {
			continue
		}
		if used[i] || m.nodes[i].fixed != 0 || reach[i] != 0 {
			d.ownerHas[i] = Translations | reach[i]&Rotations
		}
	}

	var lo, hi Vec
	for i, nd := range m.nodes {
		if i == 0 {
			lo, hi = nd.at, nd.at
		}
		lo = Vec{math.Min(lo.X, nd.at.X), math.Min(lo.Y, nd.at.Y), math.Min(lo.Z, nd.at.Z)}
		hi = Vec{math.Max(hi.X, nd.at.X), math.Max(hi.Y, nd.at.Y), math.Max(hi.Z, nd.at.Z)}
	}
	nt.span = hi.Sub(lo).Norm() + lo.Norm() + hi.Norm()
	d.number(m)
	// Drop rotations that no element reaches (the rotation of a group
	// about the line of its nodes, a group held only by bars along one
	// axis): they are not mechanisms unless a load acts on them, which
	// buildLoads reports.
	touched := nt.touched()
	dropped := false
	for eq, ok := range touched {
		if !ok && d.eqComp[eq] >= 3 {
			d.ownerHas[d.eqOwner[eq]] &^= dofAt(int(d.eqComp[eq]))
			dropped = true
		}
	}
	if dropped {
		d.number(m)
	}
	return nt, nil
}

// number numbers the free DOF, nodes first, then groups.
func (d *dofMap) number(m *Model) {
	nn := d.nNodes
	no := len(d.ownerRef)
	d.n = 0
	d.eqOwner, d.eqComp, d.coords = d.eqOwner[:0], d.eqComp[:0], d.coords[:0]
	for o := 0; o < no; o++ {
		fixed := DOF(0)
		if o < nn {
			fixed = m.nodes[o].fixed
		} else {
			fixed = m.groupFix[GroupID(o-nn)]
		}
		for c := 0; c < 6; c++ {
			dd := dofAt(c)
			if d.ownerHas[o]&dd == 0 || fixed&dd != 0 {
				d.ownerEq[o][c] = -1
				continue
			}
			d.ownerEq[o][c] = d.n
			d.n++
			d.eqOwner = append(d.eqOwner, o)
			d.eqComp = append(d.eqComp, int8(c))
			d.coords = append(d.coords, d.ownerRef[o].arr())
		}
	}
}

// touched reports, per equation, whether some element has stiffness there
// (a non-zero diagonal on an element DOF that maps to it).
func (nt *net) touched() []bool {
	d := &nt.dm
	out := make([]bool, d.n)
	var k [12][12]float64
	var dofs [12]edof
	var tb [3]term
	for i := range nt.m.elems {
		nd := nt.elemStiffness(i, &k, &dofs)
		foot := nt.m.elems[i].kind == FootKind
		for a := 0; a < nd; a++ {
			if k[a][a] == 0 && !foot {
				continue
			}
			for _, t := range d.nodeTerms(dofs[a].n, dofs[a].c, nt.m.nodes[dofs[a].n].at, &tb) {
				out[t.eq] = true
			}
		}
	}
	return out
}

// finiteAll reports whether every value of x is finite.
func finiteAll(x []float64) bool {
	for _, v := range x {
		if !finite(v) {
			return false
		}
	}
	return true
}
