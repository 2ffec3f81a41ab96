package springnet

import (
	"github.com/trestle-go/trestle/springnet/element"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// edof is one element degree of freedom: component c (0..5) of node n.
type edof struct {
	n NodeID
	c int
}

// elemStiffness writes the global stiffness of element i into k over the
// returned DOF list (at most 12). A lifted compression-only foot has zero
// stiffness but keeps its DOF, so the sparsity pattern does not change.
func (nt *net) elemStiffness(i int, k *[12][12]float64, dofs *[12]edof) int {
	e := &nt.m.elems[i]
	p := &nt.el[i]
	nd := 0
	push := func(n NodeID, c int) { dofs[nd] = edof{n, c}; nd++ }
	switch e.kind {
	case BarKind:
		kb := element.BarStiffness(p.frame, p.mp.ea)
		nd = barMatrix(e, &kb, k, dofs)
	case SpringKind:
		orig := e.spring.K.arr()
		var idx [6]int
		nc := 0
		for c := 0; c < 6; c++ {
			if (c < 3 && p.axial != 0) || orig[c] != 0 {
				idx[nc] = c
				nc++
			}
		}
		for j := 0; j < nc; j++ {
			push(e.a, idx[j])
		}
		for j := 0; j < nc; j++ {
			push(e.b, idx[j])
		}
		for r := 0; r < nd; r++ {
			for c := 0; c < nd; c++ {
				k[r][c] = 0
			}
		}
		for j := 0; j < nc; j++ {
			v := p.k6[idx[j]]
			k[j][j], k[j+nc][j+nc] = v, v
			k[j][j+nc], k[j+nc][j] = -v, -v
		}
		if p.axial != 0 {
			ka := element.AxialSpringStiffness(p.frame, p.axial)
			// Translations are the first three of each end's list.
			for r := 0; r < 3; r++ {
				for c := 0; c < 3; c++ {
					k[r][c] += ka[r][c]
					k[r][c+nc] += ka[r][c+3]
					k[r+nc][c] += ka[r+3][c]
					k[r+nc][c+nc] += ka[r+3][c+3]
				}
			}
		}
	case FootKind:
		orig := e.foot.K.arr()
		for c := 0; c < 6; c++ {
			if orig[c] != 0 {
				push(e.a, c)
			}
		}
		for r := 0; r < nd; r++ {
			for c := 0; c < nd; c++ {
				k[r][c] = 0
			}
			if p.active || p.held && dofs[r].c != 2 {
				k[r][r] = p.k6[dofs[r].c]
			}
		}
	case BeamKind:
		kb := element.BeamStiffness(p.frame, p.bp)
		nd = p.beamMatrix(e, &kb, k, dofs)
	}
	return nd
}

// barMatrix writes a bar's 6×6 matrix kb (translations of end a, then of
// end b) into k over dofs and returns 6. Stiffness, geometric stiffness
// and mass of a bar share this DOF list.
func barMatrix(e *elem, kb *element.Mat6, k *[12][12]float64, dofs *[12]edof) int {
	nd := 0
	for _, n := range [2]NodeID{e.a, e.b} {
		for c := 0; c < 3; c++ {
			dofs[nd] = edof{n, c}
			nd++
		}
	}
	for r := 0; r < 6; r++ {
		copy(k[r][:6], kb[r][:])
	}
	return nd
}

// beamMatrix writes the part of a beam's 12×12 matrix kb (end a, then end
// b, UX…RZ each) over the DOF the beam carries into k over dofs and
// returns their number: translations at both ends, rotations at an end
// only where the beam reaches them (p.rotA, p.rotB; an end released in
// every rotation has none). Stiffness, geometric stiffness and mass of a
// beam share this DOF list, so their patterns match.
func (p *prepElem) beamMatrix(e *elem, kb *element.Mat12, k *[12][12]float64, dofs *[12]edof) int {
	var keep [12]int
	nd := 0
	for c := 0; c < 12; c++ {
		n, comp := e.a, c
		if c >= 6 {
			n, comp = e.b, c-6
		}
		if comp >= 3 && ((c < 6 && !p.rotA) || (c >= 6 && !p.rotB)) {
			continue
		}
		keep[nd] = c
		dofs[nd] = edof{n, comp}
		nd++
	}
	for r := 0; r < nd; r++ {
		for c := 0; c < nd; c++ {
			k[r][c] = kb[keep[r]][keep[c]]
		}
	}
	return nd
}

// assemble builds the stiffness matrix over the free DOF into b (reset
// first) and returns it. Every equation gets an explicit diagonal entry so
// the pattern is the same whatever the values.
func (nt *net) assemble(b *sparse.Builder) *sparse.Matrix {
	return nt.assembleWith(b, nt.elemStiffness, nil)
}

// elemMatrix writes one element's matrix over its DOF list and returns the
// list's length.
type elemMatrix func(i int, k *[12][12]float64, dofs *[12]edof) int

// assembleWith assembles the element matrices given by fn, plus for each
// owner the 6×6 block of extra (if not nil; about the owner's reference
// point), through the rigid-group transformation.
func (nt *net) assembleWith(b *sparse.Builder, fn elemMatrix, extra [][6][6]float64) *sparse.Matrix {
	d := &nt.dm
	b.Reset(d.n)
	for i := 0; i < d.n; i++ {
		b.Add(i, i, 0)
	}
	var k [12][12]float64
	var dofs [12]edof
	for i := range nt.m.elems {
		nd := fn(i, &k, &dofs)
		// A foot keeps its entries when lifted (zero), so that the
		// pattern does not change with the contact state.
		d.scatter(b, nt.m, &k, &dofs, nd, nt.m.elems[i].kind == FootKind)
	}
	for o, blk := range extra {
		eq := d.ownerEq[o]
		for r := 0; r < 6; r++ {
			for c := 0; c <= r; c++ {
				if blk[r][c] != 0 && eq[r] >= 0 && eq[c] >= 0 {
					b.Add(eq[r], eq[c], blk[r][c])
				}
			}
		}
	}
	return b.Matrix()
}

// scatter adds the element matrix k over its DOF list dofs[:nd] to b
// through the rigid-group transformation (each node DOF a sum of
// equation terms, K_eq = Tᵀ·k·T), lower triangle only. Zero entries are
// skipped unless keepZeros. It reports whether a non-zero value was added.
func (d *dofMap) scatter(b *sparse.Builder, m *Model, k *[12][12]float64, dofs *[12]edof, nd int, keepZeros bool) bool {
	var tbuf [12][3]term
	var ts [12][]term
	for a := 0; a < nd; a++ {
		ts[a] = d.nodeTerms(dofs[a].n, dofs[a].c, m.nodes[dofs[a].n].at, &tbuf[a])
	}
	nonzero := false
	for a := 0; a < nd; a++ {
		for bb := 0; bb < nd; bb++ {
			v := k[a][bb]
			if v == 0 && !keepZeros {
				continue
			}
			for _, ta := range ts[a] {
				for _, tb := range ts[bb] {
					if ta.eq >= tb.eq {
						b.Add(ta.eq, tb.eq, v*ta.coef*tb.coef)
						nonzero = nonzero || v != 0
					}
				}
			}
		}
	}
	return nonzero
}

// nodeDisp returns the six displacements of node n from the equation
// vector u (zero for fixed or absent DOF).
func (d *dofMap) nodeDisp(n NodeID, at Vec, u []float64) [6]float64 {
	o := d.owner(n)
	return d.pointDisp(o, at, u)
}

// pointDisp returns the motion of the point at, rigidly attached to owner o.
func (d *dofMap) pointDisp(o int, at Vec, u []float64) [6]float64 {
	var w [6]float64
	for c, eq := range d.ownerEq[o] {
		if eq >= 0 {
			w[c] = u[eq]
		}
	}
	r := at.Sub(d.ownerRef[o])
	if r != (Vec{}) {
		t := vecOf([3]float64{w[3], w[4], w[5]}).Cross(r)
		w[0] += t.X
		w[1] += t.Y
		w[2] += t.Z
	}
	return w
}

// addOwnerLoad adds force f and moment mo acting at point at to owner o's
// load (about the owner's reference point).
func (d *dofMap) addOwnerLoad(dst [][6]float64, o int, at Vec, f, mo Vec) {
	r := at.Sub(d.ownerRef[o])
	mo = mo.Add(r.Cross(f))
	dst[o][0] += f.X
	dst[o][1] += f.Y
	dst[o][2] += f.Z
	dst[o][3] += mo.X
	dst[o][4] += mo.Y
	dst[o][5] += mo.Z
}

// totalLoad returns the load vector of case loads cl over the free
// equations: gravity plus the other loads.
func (d *dofMap) totalLoad(cl *caseLoads) []float64 {
	f := d.eqVector(nil, cl.grav)
	fv := d.eqVector(nil, cl.vari)
	for i := range f {
		f[i] += fv[i]
	}
	return f
}

// eqVector scatters owner loads onto the free equations.
func (d *dofMap) eqVector(dst []float64, ol [][6]float64) []float64 {
	if dst == nil {
		dst = make([]float64, d.n)
	}
	for i := range dst {
		dst[i] = 0
	}
	for o := range ol {
		for c, eq := range d.ownerEq[o] {
			if eq >= 0 {
				dst[eq] += ol[o][c]
			}
		}
	}
	return dst
}
