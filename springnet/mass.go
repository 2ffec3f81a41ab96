package springnet

import (
	"github.com/trestle-go/trestle/springnet/element"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// elemLumpedMass writes the lumped mass matrix of element i [kg, kg·m²]:
// bars half their mass at each end on the translations; beams the
// element package's lumped matrix with HRZ rotary terms (so beam-end
// rotations carry mass); springs and feet are massless.
func (nt *net) elemLumpedMass(i int, k *[12][12]float64, dofs *[12]edof) int {
	e := &nt.m.elems[i]
	p := &nt.el[i]
	nd := 0
	switch e.kind {
	case BarKind:
		mb := element.BarLumpedMass(p.frame, p.mp.lineMass)
		for c := 0; c < 3; c++ {
			dofs[nd] = edof{e.a, c}
			nd++
		}
		for c := 0; c < 3; c++ {
			dofs[nd] = edof{e.b, c}
			nd++
		}
		for r := 0; r < 6; r++ {
			copy(k[r][:6], mb[r][:])
		}
	case BeamKind:
		mb := element.BeamLumpedMass(p.frame, p.mp.lineMass, p.mp.polarMass, true)
		var keep [12]int
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
				k[r][c] = mb[keep[r]][keep[c]]
			}
		}
	}
	return nd
}

// pointMassBlocks returns, per owner, the 6×6 rigid-body mass of the added
// masses about the owner's reference point: for a mass m with inertia
// tensor J (Mass.Tensor) at offset r, M = Tᵀ·diag(m, m, m, J)·T with
// T = [I, −[r]×; 0, I] (u_p = u_o + θ × r).
func (nt *net) pointMassBlocks() [][6][6]float64 {
	d := &nt.dm
	out := make([][6][6]float64, len(d.ownerRef))
	for _, pm := range nt.m.masses {
		o, at := d.placeOwner(nt.m, pm.on)
		r := at.Add(pm.m.Offset).Sub(d.ownerRef[o])
		// Rows of T for the translations: u = u_o + θ × r = u_o − [r]× θ.
		var t [3][6]float64
		skew := [3][3]float64{{0, -r.Z, r.Y}, {r.Z, 0, -r.X}, {-r.Y, r.X, 0}}
		for i := 0; i < 3; i++ {
			t[i][i] = 1
			for j := 0; j < 3; j++ {
				t[i][3+j] = -skew[i][j]
			}
		}
		blk := &out[o]
		for a := 0; a < 6; a++ {
			for b := 0; b < 6; b++ {
				s := 0.0
				for i := 0; i < 3; i++ {
					s += t[i][a] * t[i][b]
				}
				blk[a][b] += pm.m.Kg * s
			}
		}
		jt := pm.m.Tensor()
		for a := 0; a < 3; a++ {
			for b := 0; b < 3; b++ {
				blk[3+a][3+b] += jt[a][b]
			}
		}
	}
	return out
}

// assembleMass returns the lumped mass matrix over the free equations
// [kg, kg·m, kg·m²]. With rigid groups it is block-diagonal rather than
// diagonal (a lumped mass away from the group's reference point couples
// its translation and rotation).
func (nt *net) assembleMass(b *sparse.Builder) *sparse.Matrix {
	return nt.assembleWith(b, nt.elemLumpedMass, nt.pointMassBlocks())
}
