package springnet

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet/element"
)

// Validate reports every problem of the model's data at once, joined with
// errors.Join, each naming its item (`springnet: bar "B7": zero length`):
// duplicate names, non-finite coordinates and values (NaN or Inf anywhere),
// zero-length members, missing or invalid materials and sections,
// non-positive stiffnesses, dangling nodes (no element, no support, no
// group), nodes in two groups, empty groups, supports on grouped nodes,
// bad combinations. It returns nil for a valid model. Analyses call it first.
func (m *Model) Validate() error {
	var errs []error
	add := func(format string, args ...any) {
		errs = append(errs, fmt.Errorf("springnet: "+format, args...))
	}

	// Nodes.
	seen := make(map[string]bool, len(m.nodes))
	for i := range m.nodes {
		n := &m.nodes[i]
		if seen[n.name] {
			add("node %q: duplicate name", n.name)
		}
		seen[n.name] = true
		if !n.at.finite() {
			add("node %q: position %v is not finite", n.name, n.at)
		}
		if n.fixed&^AllDOF != 0 {
			add("node %q: fixed set %v has unknown bits", n.name, n.fixed)
		}
	}

	// Groups.
	groupOf := make([]int, len(m.nodes))
	for i := range groupOf {
		groupOf[i] = -1
	}
	seen = make(map[string]bool)
	for gi := range m.groups {
		g := &m.groups[gi]
		if seen[g.name] {
			add("group %q: duplicate name", g.name)
		}
		seen[g.name] = true
		if len(g.nodes) == 0 {
			add("group %q: has no nodes", g.name)
		}
		if g.hasRef && !g.ref.finite() {
			add("group %q: reference point %v is not finite", g.name, g.ref)
		}
		for _, n := range g.nodes {
			switch prev := groupOf[n]; {
			case prev == gi:
				add("group %q: node %q listed twice", g.name, m.nodes[n].name)
			case prev >= 0:
				add("node %q: in two groups, %q and %q", m.nodes[n].name, m.groups[prev].name, g.name)
			default:
				groupOf[n] = gi
			}
			if m.nodes[n].fixed != 0 {
				add("node %q: is in group %q and cannot be fixed on its own; fix the group (FixGroup) instead", m.nodes[n].name, g.name)
			}
		}
	}
	for g, d := range m.groupFix {
		if d&^AllDOF != 0 {
			add("group %q: fixed set %v has unknown bits", m.groups[g].name, d)
		}
	}

	// Elements.
	used := make([]bool, len(m.nodes))
	seen = make(map[string]bool)
	for i := range m.elems {
		e := &m.elems[i]
		name := e.name()
		if seen[name] {
			add("%v %q: duplicate element name", e.kind, name)
		}
		seen[name] = true
		used[e.a] = true
		if e.b >= 0 {
			used[e.b] = true
		}
		for _, err := range m.checkElem(e) {
			add("%v %q: %v", e.kind, name, err)
		}
	}

	for i := range m.nodes {
		if !used[i] && m.nodes[i].fixed == 0 && groupOf[i] < 0 {
			add("node %q: dangling (no element, no support, not in a group)", m.nodes[i].name)
		}
	}

	// Mounts, masses, cases.
	seen = make(map[string]bool)
	for i := range m.mounts {
		mt := &m.mounts[i]
		if seen[mt.name] {
			add("mount %q: duplicate name", mt.name)
		}
		seen[mt.name] = true
		if !mt.at.finite() {
			add("mount %q: point %v is not finite", mt.name, mt.at)
		}
	}
	for i := range m.masses {
		pm := &m.masses[i]
		ms := pm.m
		where := m.PlaceName(pm.on)
		if !finite(ms.Kg) || ms.Kg < 0 {
			add("mass %d at %s: %g kg is not a finite non-negative mass", i, where, ms.Kg)
		}
		if !ms.Offset.finite() {
			add("mass %d at %s: offset %v is not finite", i, where, ms.Offset)
		}
		if !ms.Inertia.finite() || ms.Inertia.X < 0 || ms.Inertia.Y < 0 || ms.Inertia.Z < 0 {
			add("mass %d at %s: inertia %v must be finite and non-negative", i, where, ms.Inertia)
		} else if !ms.Products.finite() {
			add("mass %d at %s: products of inertia %v are not finite", i, where, ms.Products)
		} else if ms.Products != (Vec{}) {
			if err := bodyTensor(ms.Tensor()); err != nil {
				add("mass %d at %s: %v", i, where, err)
			}
		}
	}
	seen = make(map[string]bool)
	for ci := range m.cases {
		c := &m.cases[ci]
		if seen[c.name] {
			add("case %q: duplicate name", c.name)
		}
		seen[c.name] = true
		if !c.gravity.finite() {
			add("case %q: gravity %v is not finite", c.name, c.gravity)
		}
		for _, pl := range c.loads {
			if !pl.l.finite() {
				add("case %q: load %+v at %s is not finite", c.name, pl.l, m.PlaceName(pl.at))
			}
		}
		if c.terms != nil {
			if len(c.terms) == 0 {
				add("combination %q: has no terms", c.name)
			}
			for _, t := range c.terms {
				switch {
				case t.Case < 0 || int(t.Case) >= len(m.cases):
					add("combination %q: unknown case %d", c.name, t.Case)
				case m.cases[t.Case].terms != nil:
					add("combination %q: term %q is itself a combination", c.name, m.cases[t.Case].name)
				}
				if !finite(t.Factor) {
					add("combination %q: factor %g is not finite", c.name, t.Factor)
				}
			}
		}
	}
	return errors.Join(errs...)
}

// checkElem returns the problems of one element, without its name.
func (m *Model) checkElem(e *elem) []error {
	var errs []error
	bad := func(format string, args ...any) { errs = append(errs, fmt.Errorf(format, args...)) }
	length := 0.0
	if e.b >= 0 {
		length = m.nodes[e.b].at.Sub(m.nodes[e.a].at).Norm()
	}
	checkRange := func(what string, r materials.Range) {
		if err := r.Check(); err != nil {
			bad("%s: %v", what, err)
		}
	}
	switch e.kind {
	case BarKind:
		if e.a == e.b || !finite(length) || length == 0 {
			bad("zero length")
		}
		checkRange("loss factor", e.bar.Loss)
		if e.bar.Section == nil {
			if !finite(e.bar.EA) || e.bar.EA <= 0 {
				bad("no section and raw EA %g is not positive", e.bar.EA)
			}
			if !finite(e.bar.LineMass) || e.bar.LineMass < 0 {
				bad("raw mass per length %g is not finite and non-negative", e.bar.LineMass)
			}
			break
		}
		errs = append(errs, checkMember(e.bar.Material, e.bar.Section, RawBeam{}, false)...)
	case BeamKind:
		if e.a == e.b || !finite(length) || length == 0 {
			bad("zero length")
			break
		}
		checkRange("loss factor", e.beam.Loss)
		bm := e.beam
		if !bm.Up.finite() || !finite(bm.Roll) || !bm.SpringA.finite() || !bm.SpringB.finite() {
			bad("up vector, roll or end springs not finite")
			break
		}
		if _, err := element.NewFrame(m.nodes[e.a].at.arr(), m.nodes[e.b].at.arr(), bm.Up.arr(), bm.Roll); err != nil {
			bad("%v", err)
			break
		}
		if bm.Section == nil && !finite(bm.Raw.LineMass+bm.Raw.A) || bm.Raw.LineMass < 0 || bm.Raw.A < 0 {
			bad("raw mass per length or area is negative or not finite")
		}
		errs = append(errs, checkMember(bm.Material, bm.Section, bm.Raw, true)...)
		if len(errs) == 0 {
			for _, l := range materials.Levels {
				p, err := beamProps(bm, l)
				if err == nil {
					err = p.Validate()
				}
				if err != nil {
					bad("at %v level: %v", l, err)
					break
				}
			}
		}
	case SpringKind:
		s := e.spring
		checkRange("loss factor", s.Loss)
		checkRange("stiffness factor (Vary)", s.Vary)
		if s.Vary != (materials.Range{}) && s.Vary.Low <= 0 {
			bad("stiffness factor (Vary) %v must be positive", s.Vary)
		}
		okAny := false
		ks := s.K.arr()
		for i, v := range append(ks[:], s.Axial) {
			if !finite(v) || v < 0 {
				dir := "axial"
				if i < 6 {
					dir = dofNames[i]
				}
				bad("stiffness %s = %g must be finite and non-negative", dir, v)
			}
			okAny = okAny || v > 0
		}
		if !okAny {
			bad("has no stiffness")
		}
		if s.Axial != 0 && (e.a == e.b || length == 0 || !finite(length)) {
			bad("zero length with an axial stiffness (use K for a zero-length spring)")
		}
		if e.a == e.b {
			bad("both ends are the same node")
		}
		// A per-direction force between points apart across that direction
		// would leave its moment r × F unbalanced.
		r := m.nodes[e.b].at.Sub(m.nodes[e.a].at)
		tiny := 1e-9 * math.Max(1, math.Max(m.nodes[e.a].at.Norm(), m.nodes[e.b].at.Norm()))
		for c, v := range ks[:3] {
			if v != 0 && r.Cross(unitVec(c)).Norm() > tiny {
				bad("stiffness %s acts between ends %.3g m apart across it, which leaves a moment unbalanced; "+
					"put both ends at one point (a zero-length link), use Axial, or use a Foot", dofNames[c], r.Norm())
			}
		}
	case FootKind:
		f := e.foot
		checkRange("loss factor", f.Loss)
		checkRange("stiffness factor (Vary)", f.Vary)
		if f.Vary != (materials.Range{}) && f.Vary.Low <= 0 {
			bad("stiffness factor (Vary) %v must be positive", f.Vary)
		}
		okAny := false
		for i, v := range f.K.arr() {
			if !finite(v) || v < 0 {
				bad("stiffness %s = %g must be finite and non-negative", dofNames[i], v)
			}
			okAny = okAny || v > 0
		}
		if !okAny {
			bad("has no stiffness")
		}
		if f.CompressionOnly && f.K.Z <= 0 {
			bad("compression-only foot needs a vertical stiffness K.Z")
		}
	}
	return errs
}

// checkMember checks the material and section of a bar or beam.
func checkMember(mat materials.Material, sec sections.Section, raw RawBeam, beam bool) []error {
	var errs []error
	bad := func(format string, args ...any) { errs = append(errs, fmt.Errorf(format, args...)) }
	if sec == nil {
		if beam && raw == (RawBeam{}) {
			bad("no section and no raw stiffness")
		}
		return errs
	}
	p, err := sec.Properties()
	if err != nil {
		bad("section: %v", err)
		return errs
	}
	if !finite(p.A) || p.A <= 0 {
		bad("section area %g is not positive", p.A)
	}
	checkMat := func(what string, mt materials.Material) {
		if mt.E == (materials.Range{}) && !mt.MassOnly {
			bad("%s: no material (E is zero)", what)
			return
		}
		if err := mt.E.Check(); err != nil {
			bad("%s %q: E: %v", what, mt.Name, err)
		} else if !mt.MassOnly && mt.E.Low <= 0 {
			bad("%s %q: E %v must be positive", what, mt.Name, mt.E)
		}
		if err := mt.G.Check(); err != nil {
			bad("%s %q: G: %v", what, mt.Name, err)
		}
		if err := mt.Loss.Check(); err != nil {
			bad("%s %q: loss factor: %v", what, mt.Name, err)
		}
		for _, f := range [...]struct {
			n string
			v float64
		}{{"density", mt.Density}, {"yield", mt.Yield}, {"compressive strength", mt.Compress}, {"Poisson's ratio", mt.Poisson}} {
			if !finite(f.v) || f.v < 0 {
				bad("%s %q: %s %g must be finite and non-negative", what, mt.Name, f.n, f.v)
			}
		}
		if beam && mt.G == (materials.Range{}) && !(mt.Poisson > -1) {
			bad("%s %q: no shear modulus", what, mt.Name)
		}
	}
	c, ok := sec.(sections.Composite)
	if !ok {
		checkMat("material", mat)
		return errs
	}
	parts, err := c.Parts()
	if err != nil {
		bad("section parts: %v", err)
		return errs
	}
	stiff := 0
	for i, pt := range parts {
		checkMat(fmt.Sprintf("part %d material", i), pt.Material)
		for _, v := range [...]float64{pt.A, pt.Iy, pt.Iz, pt.J} {
			if !finite(v) || v < 0 {
				bad("part %d (%q): area or moment %g must be finite and non-negative", i, pt.Material.Name, v)
				break
			}
		}
		if !pt.Material.MassOnly {
			stiff++
		}
	}
	if stiff == 0 {
		bad("composite section has no stiff part")
	}
	return errs
}

// beamProps returns the element stiffness data of beam bm at level l.
func beamProps(bm *Beam, l materials.Level) (element.BeamProps, error) {
	mp, err := resolveMember(bm.Material, bm.Section, bm.Raw, l, bm.Timoshenko)
	if err != nil {
		return element.BeamProps{}, err
	}
	return beamPropsOf(bm, &mp), nil
}

// beamPropsOf returns the element stiffness data of beam bm with the
// level-resolved properties mp (about the member's local, principal axes).
func beamPropsOf(bm *Beam, mp *memberProps) element.BeamProps {
	p := element.BeamProps{EA: mp.ea, EIy: mp.eiy, EIz: mp.eiz, GJ: mp.gj,
		ReleaseA: bm.ReleaseA, ReleaseB: bm.ReleaseB,
		RotSpringA: bm.SpringA.arr(), RotSpringB: bm.SpringB.arr()}
	if bm.Timoshenko || bm.Section == nil {
		p.GAsY, p.GAsZ = mp.gasy, mp.gasz
	}
	return p
}
