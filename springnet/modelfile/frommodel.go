package modelfile

import (
	"errors"
	"fmt"
	"reflect"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// FromModel describes a model built in Go as Contents, so that Write can
// write it as a file (with the units u for plain numbers). Names are kept;
// members come before feet and cases before combinations in the file, so
// the handles of a model that interleaves them are renumbered when the
// file is read back. A material that is not a catalogue entry is written
// in full under its name; a section is written by its spec
// (sections.Spec). It fails, naming the members, if a section has no spec
// that reads back to it (a section type from outside the sections
// package, a composite of non-catalogue materials).
func FromModel(m *springnet.Model, u Units) (*Contents, error) {
	c := &Contents{Units: u}
	var errs []error

	// Places: a name used by items of two kinds gets a prefix.
	kinds := map[string]int{}
	for i := 0; i < m.NumNodes(); i++ {
		kinds[m.NodeName(springnet.NodeID(i))]++
	}
	for g := 0; g < m.NumGroups(); g++ {
		kinds[m.GroupName(springnet.GroupID(g))]++
	}
	for p := 0; p < m.NumMounts(); p++ {
		kinds[m.MountName(springnet.MountID(p))]++
	}
	place := func(p springnet.Place) string {
		var kind, name string
		switch p := p.(type) {
		case springnet.NodeID:
			kind, name = "node", m.NodeName(p)
		case springnet.GroupID:
			kind, name = "group", m.GroupName(p)
		case springnet.MountID:
			kind, name = "mount", m.MountName(p)
		}
		if kinds[name] > 1 {
			return kind + ":" + name
		}
		return name
	}

	for i := 0; i < m.NumNodes(); i++ {
		n := springnet.NodeID(i)
		c.Nodes = append(c.Nodes, Node{Name: m.NodeName(n), At: m.NodeAt(n)})
		if d := m.Fixed(n); d != 0 {
			c.Supports = append(c.Supports, Support{At: place(n), Fix: d})
		}
	}

	matName := map[string]materials.Material{} // name used in the file -> material
	material := func(mt materials.Material) string {
		if mt.E == (materials.Range{}) && mt.Density == 0 && mt.Name == "" {
			return ""
		}
		base := mt.Name
		if base == "" {
			base = "material"
		}
		name := base
		for k := 2; ; k++ {
			prev, used := matName[name]
			if !used || reflect.DeepEqual(prev, mt) {
				break
			}
			name = fmt.Sprintf("%s (%d)", base, k)
		}
		if _, done := matName[name]; done {
			return name
		}
		matName[name] = mt
		if cat, err := materials.Lookup(name); err == nil && reflect.DeepEqual(cat, mt) {
			return name // a catalogue entry as it is
		}
		def := MaterialDef{Name: name, Material: mt}
		if cat, err := materials.Lookup(mt.Name); err == nil && cat.Name == mt.Name && mt.Name != "" {
			def.From = mt.Name
		}
		c.Materials = append(c.Materials, def)
		return name
	}
	section := func(what string, s sections.Section) string {
		if s == nil {
			return ""
		}
		spec := sections.Spec(s)
		back, err := sections.Parse(spec)
		if err != nil || !reflect.DeepEqual(back, s) {
			errs = append(errs, fmt.Errorf("modelfile: %s: its section has no spec that reads back to it (%q)", what, spec))
		}
		return spec
	}

	for i := 0; i < m.NumElements(); i++ {
		e := springnet.ElementID(i)
		a, b := m.ElementNodes(e)
		kind := m.ElementKind(e)
		what := fmt.Sprintf("%v %q", kind, m.ElementName(e))
		mb := Member{Kind: kind, Name: m.ElementName(e), A: m.NodeName(a)}
		if b >= 0 {
			mb.B = m.NodeName(b)
		}
		switch kind {
		case springnet.BarKind:
			x, _ := m.BarOf(e)
			mb.Material, mb.Section, mb.Loss = material(x.Material), section(what, x.Section), x.Loss
			if x.Section == nil {
				mb.Raw = springnet.RawBeam{EA: x.EA, LineMass: x.LineMass}
			}
		case springnet.BeamKind:
			x, _ := m.BeamOf(e)
			mb.Material, mb.Section, mb.Loss = material(x.Material), section(what, x.Section), x.Loss
			if x.Section == nil {
				mb.Raw = x.Raw
			}
			mb.Up, mb.Roll, mb.Timoshenko = x.Up, x.Roll, x.Timoshenko
			mb.ReleaseA, mb.ReleaseB = x.ReleaseA, x.ReleaseB
			mb.JointSpring = [2]springnet.Vec{x.SpringA, x.SpringB}
		case springnet.SpringKind:
			x, _ := m.SpringOf(e)
			mb.Axial, mb.K, mb.Vary, mb.Loss = x.Axial, x.K, x.Vary, x.Loss
		case springnet.FootKind:
			x, _ := m.FootOf(e)
			c.Feet = append(c.Feet, Foot{Name: x.Name, Node: m.NodeName(a), K: x.K,
				CompressionOnly: x.CompressionOnly, Vary: x.Vary, Loss: x.Loss})
			continue
		}
		c.Members = append(c.Members, mb)
	}

	for g := 0; g < m.NumGroups(); g++ {
		id := springnet.GroupID(g)
		rg := RigidGroup{Name: m.GroupName(id)}
		for _, n := range m.GroupNodes(id) {
			rg.Nodes = append(rg.Nodes, m.NodeName(n))
		}
		if ref, ok := m.GroupRef(id); ok {
			rg.Reference = &ref
		}
		c.Groups = append(c.Groups, rg)
		if d := m.GroupFixed(id); d != 0 {
			c.Supports = append(c.Supports, Support{At: place(id), Fix: d})
		}
	}
	for p := 0; p < m.NumMounts(); p++ {
		id := springnet.MountID(p)
		c.Mounts = append(c.Mounts, Mount{Name: m.MountName(id), On: place(m.MountOn(id)), At: m.MountAt(id)})
	}
	for i := 0; i < m.NumMasses(); i++ {
		on, ms := m.MassOf(i)
		c.Masses = append(c.Masses, Mass{On: place(on), Kg: ms.Kg, Offset: ms.Offset, Inertia: ms.Inertia, Products: ms.Products})
	}
	for i := 0; i < m.NumCases(); i++ {
		id := springnet.CaseID(i)
		if m.IsCombination(id) {
			cb := Combination{Name: m.CaseName(id)}
			for _, t := range m.CaseTerms(id) {
				cb.Terms = append(cb.Terms, Term{Case: m.CaseName(t.Case), Factor: t.Factor})
			}
			c.Combos = append(c.Combos, cb)
			continue
		}
		lc := Case{Name: m.CaseName(id), Gravity: m.CaseGravity(id)}
		for _, l := range m.CaseLoads(id) {
			lc.Loads = append(lc.Loads, Load{At: place(l.At), Load: l.Load})
		}
		c.Cases = append(c.Cases, lc)
	}
	if err := errors.Join(errs...); err != nil {
		return nil, err
	}
	return c, nil
}
