package springnet

import (
	"errors"
	"sort"

	"github.com/trestle-go/trestle/materials"
)

// Sensitivity is how the compliance of a load case changes with the
// stiffness of one material (or of the springs, feet or raw members).
type Sensitivity struct {
	Group  string  // material name, or GroupSprings, GroupFeet, GroupRawMembers
	Energy float64 // strain energy stored in the group, U_k [J]
	// DC is dC/ds [J]: the change of the compliance C = fᵀu per unit
	// relative change s of the group's moduli (E and G together, or the
	// stiffnesses of the springs or feet), DC = −2·U_k.
	DC float64
	// DCdE is dC/dE_k = −2·U_k / E_k [J/Pa] at the analysis level; 0 for
	// a group without a modulus (springs, feet, raw members).
	DCdE float64
	// Share is U_k / U, the fraction of the strain energy [-].
	Share float64
}

// ComplianceSensitivity returns, for load case c (a case or a
// combination) analysed statically at level l, the sensitivity of the
// compliance C = fᵀu (the work of the loads, twice the strain energy of a
// linear solution) to the modulus of each material, largest |DC| first:
//
//	dC/dE_k = −2·U_k / E_k
//
// because K is linear in E_k and, with loads fixed, dC/dE_k = −uᵀ·(∂K/∂E_k)·u
// (the compliance is self-adjoint; Haftka & Gürdal, Elements of
// Structural Optimization, 3rd ed., sensitivity analysis, section from
// memory). U_k is the strain energy
// stored in material k (StrainEnergies, parts of composite sections split
// as for modal damping). Gravity loads do not depend on E, so they stay
// fixed. Compression-only feet keep the contact state of the solution.
// Errors are those of Static for case c: a *TippingError (and no
// result) if the stand tips under c; the tipping of other cases is no
// error here.
func ComplianceSensitivity(m *Model, c CaseID, l materials.Level) ([]Sensitivity, error) {
	m.CaseName(c)
	res, err := Static(m, &StaticSettings{Level: l})
	if err != nil && res == nil {
		return nil, err
	}
	cr := res.Case(c)
	if cr.Tipped() {
		return nil, cr.tipped
	}
	var tip *TippingError
	if errors.As(err, &tip) {
		// Another case tipped; only this case's solve matters.
		err = nil
		if cr.residual > MaxResidual {
			err = cr.conditionError()
		}
	}
	defer cr.contactState()()
	bk := newEnergyBook(cr.nt)
	t := bk.tally(cr.nt, cr.u)
	mod := bk.moduli(cr.nt)
	var out []Sensitivity
	for g, u := range t.group {
		s := Sensitivity{Group: bk.names[g], Energy: u, DC: -2 * u}
		if mod[g] > 0 {
			s.DCdE = -2 * u / mod[g]
		}
		if t.total > 0 {
			s.Share = u / t.total
		}
		out = append(out, s)
	}
	sort.SliceStable(out, func(a, b int) bool { return out[a].Energy > out[b].Energy })
	return out, err
}

// moduli returns per energy group the Young's modulus of its material at
// the net's level (0 for springs, feet and raw members).
func (bk *energyBook) moduli(nt *net) []float64 {
	out := make([]float64, len(bk.names))
	for i := range nt.m.elems {
		e := &nt.m.elems[i]
		var mats []materials.Material
		switch {
		case e.kind == BarKind && e.bar.Section != nil:
			mats = sectionMaterials(e.bar.Material, e.bar.Section)
		case e.kind == BeamKind && e.beam.Section != nil:
			mats = sectionMaterials(e.beam.Material, e.beam.Section)
		}
		if len(mats) != len(bk.parts[i]) {
			continue
		}
		for j, p := range bk.parts[i] {
			if out[p.group] == 0 {
				out[p.group] = mats[j].E.At(nt.level)
			}
		}
	}
	return out
}
