package modelfile

import (
	"fmt"
	"sort"
	"strconv"
	"strings"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// Build turns c into a model and checks it: names resolved (each unknown
// name reported with the closest known one), materials looked up, section
// specs parsed, the size checked against MemoryBudget, then
// Model.Validate with its errors mapped to the items' lines. name is the
// file name used in messages ("" for none). It returns every problem
// joined (see Error).
func Build(name string, c *Contents) (*File, error) { return build(name, c) }

func build(name string, c *Contents) (*File, error) {
	el := &errList{file: name}
	if est := Estimate(c); est.Bytes > MemoryBudget {
		el.add(0, "%v", est.refusal())
		return nil, el.err()
	}
	b := &builder{c: c, el: el, m: &springnet.Model{},
		f: &File{Contents: *c, Name: name,
			NodeIDs: map[string]springnet.NodeID{}, ElementIDs: map[string]springnet.ElementID{},
			GroupIDs: map[string]springnet.GroupID{}, MountIDs: map[string]springnet.MountID{},
			CaseIDs: map[string]springnet.CaseID{}},
		mats: map[string]materials.Material{}, secs: map[string]sections.Section{},
		badSec: map[string]bool{}, lines: map[string]int{}}
	b.f.Model = b.m
	b.run()
	if err := el.err(); err != nil {
		return nil, err
	}
	if err := b.m.Validate(); err != nil {
		for _, e := range joined(err) {
			msg := e.Error()
			line := 0
			if sm := validateItem.FindStringSubmatch(msg); sm != nil {
				if n, err := strconv.Unquote(sm[2]); err == nil {
					line = b.lineOf(sm[1], n)
				}
			} else if sm := validateMass.FindStringSubmatch(msg); sm != nil {
				// Masses are added in file order: mass i is c.Masses[i].
				if i, err := strconv.Atoi(sm[1]); err == nil && i < len(c.Masses) {
					line = c.Masses[i].Line
				}
			}
			el.add(line, "%s", strings.TrimPrefix(msg, "springnet: "))
		}
		return nil, el.err()
	}
	return b.f, nil
}

func joined(err error) []error {
	if j, ok := err.(interface{ Unwrap() []error }); ok {
		var out []error
		for _, e := range j.Unwrap() {
			out = append(out, joined(e)...)
		}
		return out
	}
	return []error{err}
}

type builder struct {
	c      *Contents
	el     *errList
	m      *springnet.Model
	f      *File
	mats   map[string]materials.Material
	secs   map[string]sections.Section
	badSec map[string]bool // section specs (and "material\x00name") already reported
	lines  map[string]int  // "kind\x00name" -> line, for Validate messages

	inGroup map[springnet.NodeID]bool // nodes in a rigid group, once groups are built
}

func (b *builder) setLine(kind, name string, line int) {
	k := kind + "\x00" + name
	if _, ok := b.lines[k]; !ok {
		b.lines[k] = line
	}
}

func (b *builder) lineOf(kind, name string) int {
	if kind == "group" {
		kind = "rigid group"
	}
	return b.lines[kind+"\x00"+name]
}

func (b *builder) run() {
	c, m := b.c, b.m
	for _, d := range c.Materials {
		if _, dup := b.mats[d.Name]; dup {
			b.el.add(d.Line, "material %q is defined twice", d.Name)
		}
		b.mats[d.Name] = d.Material
	}
	var nodeNames []string
	for _, n := range c.Nodes {
		if _, dup := b.f.NodeIDs[n.Name]; dup {
			b.el.add(n.Line, "node %q is defined twice", n.Name)
			continue
		}
		if n.Name == "" {
			b.el.add(n.Line, "a node has an empty name")
			continue
		}
		b.f.NodeIDs[n.Name] = m.AddNode(n.Name, n.At)
		b.setLine("node", n.Name, n.Line)
		nodeNames = append(nodeNames, n.Name)
	}
	node := func(line int, what, n string) (springnet.NodeID, bool) {
		id, ok := b.f.NodeIDs[n]
		if !ok {
			hint := ""
			if !b.el.full() {
				hint = suggest(n, nodeNames)
			}
			b.el.add(line, "%s names unknown node %q%s", what, n, hint)
		}
		return id, ok
	}
	for _, mb := range c.Members {
		what := mb.Kind.String()
		if mb.Name != "" {
			what = fmt.Sprintf("%s %q", what, mb.Name)
		} else {
			what = fmt.Sprintf("%s %s–%s", what, mb.A, mb.B)
		}
		a, ok1 := node(mb.Line, what, mb.A)
		bn, ok2 := node(mb.Line, what, mb.B)
		var mat materials.Material
		var sec sections.Section
		ok3 := true
		if mb.Kind != springnet.SpringKind {
			if mb.Material != "" {
				mat, ok3 = b.material(mb.Line, what, mb.Material)
			}
			if mb.Section != "" {
				var ok bool
				sec, ok = b.section(mb.Line, what, mb.Section)
				ok3 = ok3 && ok
			}
		}
		if !ok1 || !ok2 || !ok3 {
			continue
		}
		var id springnet.ElementID
		switch mb.Kind {
		case springnet.BarKind:
			id = m.AddBar(a, bn, springnet.Bar{Name: mb.Name, Material: mat, Section: sec,
				EA: mb.Raw.EA, LineMass: mb.Raw.LineMass, Loss: mb.Loss})
		case springnet.BeamKind:
			id = m.AddBeam(a, bn, springnet.Beam{Name: mb.Name, Material: mat, Section: sec,
				Up: mb.Up, Roll: mb.Roll, Timoshenko: mb.Timoshenko,
				ReleaseA: mb.ReleaseA, ReleaseB: mb.ReleaseB,
				SpringA: mb.JointSpring[0], SpringB: mb.JointSpring[1], Raw: mb.Raw, Loss: mb.Loss})
		case springnet.SpringKind:
			id = m.AddSpring(a, bn, springnet.Spring{Name: mb.Name, Axial: mb.Axial, K: mb.K, Vary: mb.Vary, Loss: mb.Loss})
		default:
			b.el.add(mb.Line, "%s: unknown member kind", what)
			continue
		}
		b.named(mb.Kind.String(), m.ElementName(id), mb.Line, id)
	}
	for _, ft := range c.Feet {
		what := "foot"
		if ft.Name != "" {
			what = fmt.Sprintf("foot %q", ft.Name)
		}
		n, ok := node(ft.Line, what, ft.Node)
		if !ok {
			continue
		}
		id := m.AddFoot(n, springnet.Foot{Name: ft.Name, K: ft.K, CompressionOnly: ft.CompressionOnly, Vary: ft.Vary, Loss: ft.Loss})
		b.named("foot", m.ElementName(id), ft.Line, id)
	}
	for _, g := range c.Groups {
		what := fmt.Sprintf("rigid group %q", g.Name)
		if _, dup := b.f.GroupIDs[g.Name]; dup {
			b.el.add(g.Line, "%s is defined twice", what)
			continue
		}
		var ids []springnet.NodeID
		ok := true
		for _, n := range g.Nodes {
			id, good := node(g.Line, what, n)
			ok = ok && good
			ids = append(ids, id)
		}
		if !ok {
			continue
		}
		var id springnet.GroupID
		if g.Reference != nil {
			id = m.AddRigidGroupAt(g.Name, *g.Reference, ids...)
		} else {
			id = m.AddRigidGroup(g.Name, ids...)
		}
		b.f.GroupIDs[g.Name] = id
		b.setLine("rigid group", g.Name, g.Line)
	}
	for _, s := range c.Supports {
		what := fmt.Sprintf("support at %q", s.At)
		switch p := b.place(s.Line, what, s.At, false).(type) {
		case springnet.NodeID:
			if b.groupedNode(p) {
				b.el.add(s.Line, "%s: node %q is in a rigid group; support the group instead", what, s.At)
				continue
			}
			m.Fix(p, s.Fix)
		case springnet.GroupID:
			m.FixGroup(p, s.Fix)
		}
	}
	for _, mt := range c.Mounts {
		what := fmt.Sprintf("mount %q", mt.Name)
		if _, dup := b.f.MountIDs[mt.Name]; dup {
			b.el.add(mt.Line, "%s is defined twice", what)
			continue
		}
		p := b.place(mt.Line, what, mt.On, true)
		if p == nil {
			continue
		}
		b.f.MountIDs[mt.Name] = m.AddMount(mt.Name, mt.At, p)
		b.setLine("mount", mt.Name, mt.Line)
	}
	for i, ms := range c.Masses {
		what := fmt.Sprintf("mass %d", i+1)
		if ms.Name != "" {
			what = fmt.Sprintf("mass %q", ms.Name)
		}
		p := b.place(ms.Line, what, ms.On, true)
		if p == nil {
			continue
		}
		off := ms.Offset
		if ms.Centre != nil {
			off = ms.Centre.Sub(m.PlaceAt(p))
		}
		m.AddMass(p, springnet.Mass{Kg: ms.Kg, Offset: off, Inertia: ms.Inertia, Products: ms.Products})
	}
	for _, lc := range c.Cases {
		if _, dup := b.f.CaseIDs[lc.Name]; dup {
			b.el.add(lc.Line, "case %q is defined twice", lc.Name)
			continue
		}
		id := m.AddLoadCase(lc.Name)
		b.f.CaseIDs[lc.Name] = id
		b.setLine("case", lc.Name, lc.Line)
		if lc.Gravity != (springnet.Vec{}) {
			m.SetGravity(id, lc.Gravity)
		}
		for _, l := range lc.Loads {
			p := b.place(l.Line, fmt.Sprintf("case %q: load", lc.Name), l.At, true)
			if p != nil {
				m.AddCaseLoad(id, p, l.Load)
			}
		}
	}
	caseNames := make([]string, 0, len(c.Cases))
	for _, lc := range c.Cases {
		caseNames = append(caseNames, lc.Name)
	}
	for _, cb := range c.Combos {
		what := fmt.Sprintf("combination %q", cb.Name)
		if _, dup := b.f.CaseIDs[cb.Name]; dup {
			b.el.add(cb.Line, "%s: the name is already used by a case or combination", what)
			continue
		}
		var terms []springnet.Term
		ok := true
		for _, t := range cb.Terms {
			id, found := b.f.CaseIDs[t.Case]
			if !found || m.IsCombination(id) {
				b.el.add(cb.Line, "%s names unknown case %q%s", what, t.Case, suggest(t.Case, caseNames))
				ok = false
				continue
			}
			terms = append(terms, springnet.Term{Case: id, Factor: t.Factor})
		}
		if !ok {
			continue
		}
		b.f.CaseIDs[cb.Name] = m.AddCombination(cb.Name, terms...)
		b.setLine("combination", cb.Name, cb.Line)
	}
	for _, sp := range c.Dynamics.Speeds {
		if !(sp.Low > 0) || !(sp.High >= sp.Low) {
			b.el.add(sp.Line, "speed %q: speeds must be positive, lowest first", sp.Name)
		}
	}
}

func (b *builder) named(kind, name string, line int, id springnet.ElementID) {
	if _, dup := b.f.ElementIDs[name]; !dup {
		b.f.ElementIDs[name] = id
	}
	b.setLine(kind, name, line)
}

func (b *builder) material(line int, what, name string) (materials.Material, bool) {
	if m, ok := b.mats[name]; ok {
		return m, true
	}
	if b.badSec["material\x00"+name] {
		return materials.Material{}, false // reported at its first use
	}
	m, err := materials.Lookup(name)
	if err != nil {
		var own []string
		for n := range b.mats {
			own = append(own, n)
		}
		sort.Strings(own)
		hint := suggest(name, own)
		if hint == "" {
			hint = ": " + strings.TrimPrefix(err.Error(), "materials: ")
		}
		b.el.add(line, "%s names unknown material %q%s", what, name, hint)
		b.badSec["material\x00"+name] = true
		return m, false
	}
	b.mats[name] = m
	return m, true
}

func (b *builder) section(line int, what, spec string) (sections.Section, bool) {
	if s, ok := b.secs[spec]; ok {
		return s, true
	}
	if b.badSec[spec] {
		return nil, false // reported at its first use
	}
	s, err := sections.Parse(spec)
	if err != nil {
		b.badSec[spec] = true
		b.el.add(line, "%s: %s", what, strings.TrimPrefix(err.Error(), "sections: "))
		return nil, false
	}
	b.secs[spec] = s
	return s, true
}

// place resolves a node, rigid group or (if mounts) mount name. A name
// may carry a prefix "node:", "group:" or "mount:" to pick among items of
// different kinds with the same name.
func (b *builder) place(line int, what, name string, mounts bool) springnet.Place {
	kind := ""
	if i := strings.IndexByte(name, ':'); i > 0 {
		switch k := name[:i]; k {
		case "node", "group", "mount":
			kind, name = k, strings.TrimSpace(name[i+1:])
		}
	}
	var found []springnet.Place
	if id, ok := b.f.NodeIDs[name]; ok && (kind == "" || kind == "node") {
		found = append(found, id)
	}
	if id, ok := b.f.GroupIDs[name]; ok && (kind == "" || kind == "group") {
		found = append(found, id)
	}
	if id, ok := b.f.MountIDs[name]; ok && mounts && (kind == "" || kind == "mount") {
		found = append(found, id)
	}
	switch len(found) {
	case 1:
		return found[0]
	case 0:
		if b.el.full() {
			b.el.add(line, "%s names unknown item %q", what, name)
			return nil
		}
		var all []string
		for n := range b.f.NodeIDs {
			all = append(all, n)
		}
		for n := range b.f.GroupIDs {
			all = append(all, n)
		}
		kinds := "node or rigid group"
		if mounts {
			kinds = "node, rigid group or mount"
			for n := range b.f.MountIDs {
				all = append(all, n)
			}
		}
		sort.Strings(all)
		hint := suggest(name, all)
		if mounts && hint == "" && b.laterMount(name) {
			hint = "; that mount is defined further down: define a mount before the mounts and masses that sit on it"
		}
		b.el.add(line, "%s names unknown %s %q%s", what, kinds, name, hint)
	default:
		b.el.add(line, "%s: %q is the name of more than one item; write \"node:%s\", \"group:%s\" or \"mount:%s\"", what, name, name, name, name)
	}
	return nil
}

func (b *builder) groupedNode(n springnet.NodeID) bool {
	if b.inGroup == nil {
		b.inGroup = map[springnet.NodeID]bool{}
		for g := 0; g < b.m.NumGroups(); g++ {
			for _, x := range b.m.GroupNodes(springnet.GroupID(g)) {
				b.inGroup[x] = true
			}
		}
	}
	return b.inGroup[n]
}

func (b *builder) laterMount(name string) bool {
	for _, mt := range b.c.Mounts {
		if mt.Name == name {
			return true
		}
	}
	return false
}
