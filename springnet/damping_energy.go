package springnet

import (
	"sort"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet/element"
)

// Strain energy: one function (elemEnergy) gives ½·uₑᵀ·Kₑ·uₑ of an element
// for any vector of the free equations — a mode shape or a static
// displacement — through the same DOF map and rigid-group transformation
// as the assembly. Modal damping (modal strain energy method), the energy
// shares of a mode and the compliance sensitivities all use it.

// Names of the energy groups of elements without a material.
const (
	GroupSprings    = "springs"     // two-node springs (pads, joints)
	GroupFeet       = "feet"        // feet (node-to-ground springs)
	GroupRawMembers = "raw members" // bars and beams given by raw numbers
)

// elemValues writes the values of element DOF dofs[:nd] from the equation
// vector u into x.
func (nt *net) elemValues(dofs *[12]edof, nd int, u []float64, x *[12]float64) {
	var tb [3]term
	for a := 0; a < nd; a++ {
		s := 0.0
		for _, t := range nt.dm.nodeTerms(dofs[a].n, dofs[a].c, nt.m.nodes[dofs[a].n].at, &tb) {
			s += t.coef * u[t.eq]
		}
		x[a] = s
	}
}

// elemEnergy returns the strain energy ½·uₑᵀ·Kₑ·uₑ of element i for the
// equation vector u [J for u in m and rad], and the element's DOF values
// (for the split between parts).
func (nt *net) elemEnergy(i int, u []float64, x *[12]float64) float64 {
	var k [12][12]float64
	var dofs [12]edof
	nd := nt.elemStiffness(i, &k, &dofs)
	nt.elemValues(&dofs, nd, u, x)
	return quadHalf(&k, nd, x)
}

// quadHalf returns ½·xᵀ·k·x over the leading nd entries.
func quadHalf(k *[12][12]float64, nd int, x *[12]float64) float64 {
	s := 0.0
	for a := 0; a < nd; a++ {
		r := 0.0
		for b := 0; b < nd; b++ {
			r += k[a][b] * x[b]
		}
		s += x[a] * r
	}
	return s / 2
}

// strainEnergies writes the strain energy of every element for u into
// dst (nil allocates) and returns it.
func (nt *net) strainEnergies(dst, u []float64) []float64 {
	dst = sizedFloats(dst, len(nt.m.elems))
	var x [12]float64
	for i := range nt.m.elems {
		dst[i] = nt.elemEnergy(i, u, &x)
	}
	return dst
}

func sizedFloats(dst []float64, n int) []float64 {
	if cap(dst) < n {
		return make([]float64, n)
	}
	return dst[:n]
}

// energyPart is one material's share of an element's stiffness.
type energyPart struct {
	group int             // index into energyBook.names
	loss  materials.Range // the part's loss factor
	// Stiffness of the part (for the split of the element's energy):
	// EA, EIy, EIz, GJ [N, N·m²].
	ea, eiy, eiz, gj float64
}

// energyBook holds, for a prepared model, who stores each element's strain
// energy: the element's material, each part of a composite section, or
// the springs, feet and raw members groups.
type energyBook struct {
	names []string
	parts [][]energyPart // per element
	own   []bool         // per element: the element's own Loss overrides its parts'
	loss  []materials.Range
	// composite beams with joints split by axial stiffness (see split)
	jointed []bool
}

// newEnergyBook sorts the elements of nt into energy groups.
func newEnergyBook(nt *net) *energyBook {
	m := nt.m
	bk := &energyBook{parts: make([][]energyPart, len(m.elems)), own: make([]bool, len(m.elems)),
		loss: make([]materials.Range, len(m.elems)), jointed: make([]bool, len(m.elems))}
	idx := map[string]int{}
	group := func(name string) int {
		if g, ok := idx[name]; ok {
			return g
		}
		idx[name] = len(bk.names)
		bk.names = append(bk.names, name)
		return len(bk.names) - 1
	}
	matName := func(mt materials.Material) string {
		if mt.Name == "" {
			return "unnamed material"
		}
		return mt.Name
	}
	for i := range m.elems {
		e := &m.elems[i]
		bk.loss[i] = m.LossFactor(ElementID(i))
		var sec sections.Section
		var mt materials.Material
		var own materials.Range
		switch e.kind {
		case SpringKind:
			bk.parts[i] = []energyPart{{group: group(GroupSprings), loss: bk.loss[i]}}
			continue
		case FootKind:
			bk.parts[i] = []energyPart{{group: group(GroupFeet), loss: bk.loss[i]}}
			continue
		case BarKind:
			sec, mt, own = e.bar.Section, e.bar.Material, e.bar.Loss
		case BeamKind:
			sec, mt, own = e.beam.Section, e.beam.Material, e.beam.Loss
			b := e.beam
			bk.jointed[i] = b.ReleaseA != 0 || b.ReleaseB != 0 || b.SpringA != (Vec{}) || b.SpringB != (Vec{})
		}
		bk.own[i] = own != (materials.Range{})
		if sec == nil {
			bk.parts[i] = []energyPart{{group: group(GroupRawMembers), loss: bk.loss[i]}}
			continue
		}
		c, ok := sec.(sections.Composite)
		if !ok {
			bk.parts[i] = []energyPart{{group: group(matName(mt)), loss: bk.loss[i]}}
			continue
		}
		parts, err := c.Parts()
		if err != nil { // prepare has already checked the section
			bk.parts[i] = []energyPart{{group: group(matName(mt)), loss: bk.loss[i]}}
			continue
		}
		var ps []energyPart
		for _, pt := range parts {
			if pt.Material.MassOnly {
				continue // stores no strain energy (see the doc of Modes)
			}
			e := pt.Material.E.At(nt.level)
			g := pt.Material.ShearModulus(nt.level)
			loss := pt.Material.Loss
			if bk.own[i] {
				loss = own
			}
			ps = append(ps, energyPart{group: group(matName(pt.Material)), loss: loss,
				ea: e * pt.A, eiy: e * pt.Iy, eiz: e * pt.Iz, gj: g * pt.J})
		}
		if len(ps) == 0 {
			ps = []energyPart{{group: group(matName(mt)), loss: bk.loss[i]}}
		}
		bk.parts[i] = ps
	}
	return bk
}

// split writes into w the shares (summing to 1) of element i's strain
// energy stored by each of its parts, for the element DOF values x. One
// part takes all. A composite bar splits by axial stiffness Eₚ·Aₚ/EA
// (exact). A composite beam splits by the energy of each part's own
// Euler–Bernoulli stiffness for the same end motion,
//
//	Uₚ ∝ EₚAₚ·u_ax + EₚIyₚ·u_y + EₚIzₚ·u_z + GₚJₚ·u_t
//
// with u_c the energy of the beam with unit stiffness c only: exact for an
// Euler–Bernoulli beam with rigid joints (its stiffness is linear in EA,
// EIy, EIz, GJ), an approximation with shear deformation; a composite beam
// with releases or end springs splits by axial stiffness (an
// approximation).
func (bk *energyBook) split(nt *net, i int, x *[12]float64, w []float64) []float64 {
	ps := bk.parts[i]
	w = sizedFloats(w, len(ps))
	if len(ps) == 1 {
		w[0] = 1
		return w
	}
	tot := 0.0
	kind := nt.m.elems[i].kind
	if kind == BarKind || bk.jointed[i] {
		for j, p := range ps {
			w[j] = p.ea
			tot += p.ea
		}
	} else {
		p := &nt.el[i]
		// Full 12 end values (the beam has rotations at both ends).
		var unit [4]float64
		if p.rotA && p.rotB {
			for c, bp := range [4]element.BeamProps{{EA: 1}, {EIy: 1}, {EIz: 1}, {GJ: 1}} {
				kb := element.BeamStiffness(p.frame, bp)
				unit[c] = quadHalf((*[12][12]float64)(&kb), 12, x)
			}
		}
		for j, pt := range ps {
			w[j] = pt.ea*unit[0] + pt.eiy*unit[1] + pt.eiz*unit[2] + pt.gj*unit[3]
			tot += w[j]
		}
	}
	if !(tot > 0) {
		for j := range w {
			w[j] = 1 / float64(len(w))
		}
		return w
	}
	for j := range w {
		w[j] /= tot
	}
	return w
}

// energyTally is the strain energy of one vector sorted by element and
// group, with the energy-weighted loss factors.
type energyTally struct {
	elem  []float64 // per element [J]
	group []float64 // per group [J]
	total float64
	// Σ ηᵢ·Uᵢ at the three levels, per group and in total.
	groupLoss [][3]float64
	lossSum   [3]float64
}

// tally computes the energies of u.
func (bk *energyBook) tally(nt *net, u []float64) *energyTally {
	return bk.tallyAll(nt, [][]float64{u})[0]
}

// tallyAll computes the energies of each vector of us, forming each
// element's stiffness once.
func (bk *energyBook) tallyAll(nt *net, us [][]float64) []*energyTally {
	out := make([]*energyTally, len(us))
	for v := range us {
		out[v] = &energyTally{elem: make([]float64, len(nt.m.elems)), group: make([]float64, len(bk.names)),
			groupLoss: make([][3]float64, len(bk.names))}
	}
	var k [12][12]float64
	var dofs [12]edof
	var x [12]float64
	var w []float64
	for i := range nt.m.elems {
		nd := nt.elemStiffness(i, &k, &dofs)
		for v, u := range us {
			t := out[v]
			nt.elemValues(&dofs, nd, u, &x)
			ue := quadHalf(&k, nd, &x)
			t.elem[i] = ue
			t.total += ue
			if ue == 0 {
				continue
			}
			w = bk.split(nt, i, &x, w)
			for j, p := range bk.parts[i] {
				up := ue * w[j]
				t.group[p.group] += up
				for l, lv := range materials.Levels {
					eta := p.loss.At(lv) * up
					t.groupLoss[p.group][l] += eta
					t.lossSum[l] += eta
				}
			}
		}
	}
	return out
}

// lossRange returns the energy-weighted loss factor η = Σ ηᵢUᵢ / Σ Uᵢ at
// each level (zero when there is no strain energy).
func (t *energyTally) lossRange() materials.Range {
	if !(t.total > 0) {
		return materials.Range{}
	}
	return materials.Range{Low: t.lossSum[0] / t.total, Nominal: t.lossSum[1] / t.total, High: t.lossSum[2] / t.total}
}

// EnergyShare is the part of a mode's (or a load case's) strain energy
// stored in one material, or in the springs, feet or raw members.
type EnergyShare struct {
	Group  string          // material name, or GroupSprings, GroupFeet, GroupRawMembers
	Energy float64         // strain energy [J] (for a mode: per unit modal mass, see ModeResult)
	Share  float64         // fraction of the total [-]
	Loss   materials.Range // energy-weighted loss factor of the group [-]
}

// shares lists the groups holding energy, largest first.
func (t *energyTally) shares(bk *energyBook) []EnergyShare {
	var out []EnergyShare
	for g, u := range t.group {
		if u == 0 {
			continue
		}
		es := EnergyShare{Group: bk.names[g], Energy: u}
		if t.total > 0 {
			es.Share = u / t.total
		}
		if u > 0 {
			gl := t.groupLoss[g]
			es.Loss = materials.Range{Low: gl[0] / u, Nominal: gl[1] / u, High: gl[2] / u}
		}
		out = append(out, es)
	}
	sort.SliceStable(out, func(a, b int) bool { return out[a].Energy > out[b].Energy })
	return out
}

// StrainEnergies writes the strain energy of every element under the
// static solution of case c into dst (nil allocates; indexed by
// ElementID) and returns it [J]: ½·uₑᵀ·Kₑ·uₑ over each element's DOF,
// the same function the modal damping uses. A lifted compression-only
// foot has none. For a linear case the energies add up to half the work
// of the loads. A tipped case (CaseResult.Tipped) gives zeros.
func StrainEnergies(c *CaseResult, dst []float64) []float64 {
	if c.Tipped() {
		dst = sizedFloats(dst, len(c.nt.m.elems))
		clear(dst)
		return dst
	}
	defer c.contactState()()
	return c.nt.strainEnergies(dst, c.u)
}

// setContact sets the feet of c's net to c's contact state: lifted feet
// inactive, held feet held.
func (c *CaseResult) setContact() {
	nt := c.nt
	for i := range nt.el {
		nt.el[i].active = true
		nt.el[i].held = false
	}
	for _, e := range c.lifted {
		nt.el[e].active = false
	}
	for _, e := range c.held {
		nt.el[e].held = true
	}
}

// contactState sets the feet of c's net to c's contact state (lifted feet
// inactive) and returns the function that restores the previous state.
func (c *CaseResult) contactState() func() {
	nt := c.nt
	was := make([]prepElem, len(nt.el))
	copy(was, nt.el)
	c.setContact()
	return func() {
		for i := range nt.el {
			nt.el[i].active, nt.el[i].held = was[i].active, was[i].held
		}
	}
}

// MaterialEnergies returns the strain energy of the static solution of
// case c per material (and for the springs, feet and raw members), the
// largest first, with each group's loss factor range; nil for a tipped
// case (CaseResult.Tipped).
func MaterialEnergies(c *CaseResult) []EnergyShare {
	if c.Tipped() {
		return nil
	}
	defer c.contactState()()
	bk := newEnergyBook(c.nt)
	return bk.tally(c.nt, c.u).shares(bk)
}

// sectionMaterials lists the materials that store strain energy in a
// member of material mt and section sec, in the order of energyBook's
// parts.
func sectionMaterials(mt materials.Material, sec sections.Section) []materials.Material {
	c, ok := sec.(sections.Composite)
	if !ok {
		return []materials.Material{mt}
	}
	parts, err := c.Parts()
	if err != nil {
		return []materials.Material{mt}
	}
	var out []materials.Material
	for _, p := range parts {
		if !p.Material.MassOnly {
			out = append(out, p.Material)
		}
	}
	if len(out) == 0 {
		return []materials.Material{mt}
	}
	return out
}
