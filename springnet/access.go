package springnet

// Read access to the rest of a Model's data, for writers, drawings and
// reports. Slices returned are copies.

// GroupFixed returns the fixed DOF of rigid group g (FixGroup).
func (m *Model) GroupFixed(g GroupID) DOF { m.checkGroup(g); return m.groupFix[g] }

// GroupRef returns the reference point given to AddRigidGroupAt; ok is
// false when the group uses its centroid (see GroupPoint).
func (m *Model) GroupRef(g GroupID) (ref Vec, ok bool) {
	gr := &m.groups[m.checkGroup(g)]
	return gr.ref, gr.hasRef
}

// NumMasses returns the number of added masses.
func (m *Model) NumMasses() int { return len(m.masses) }

// MassOf returns added mass i (0 <= i < NumMasses) and where it is attached.
func (m *Model) MassOf(i int) (on Place, ms Mass) {
	pm := m.masses[i]
	return pm.on, pm.m
}

// PlacedLoad is a load and where it acts.
type PlacedLoad struct {
	At   Place
	Load Load
}

// CaseLoads returns the loads of plain case c (nil for a combination).
func (m *Model) CaseLoads(c CaseID) []PlacedLoad {
	m.CaseName(c)
	var out []PlacedLoad
	for _, pl := range m.cases[c].loads {
		out = append(out, PlacedLoad{At: pl.at, Load: pl.l})
	}
	return out
}

// CaseGravity returns the gravity acceleration of plain case c [m/s²].
func (m *Model) CaseGravity(c CaseID) Vec { m.CaseName(c); return m.cases[c].gravity }

// CaseTerms returns the terms of combination c (nil for a plain case).
func (m *Model) CaseTerms(c CaseID) []Term {
	m.CaseName(c)
	if m.cases[c].terms == nil {
		return nil
	}
	return append([]Term{}, m.cases[c].terms...)
}

// Reaction is a support reaction at a fixed node or rigid group.
type Reaction struct {
	At   Place  // NodeID or GroupID
	Name string // the node's or group's name
	Load Load   // force and moment the support exerts on the stand [N, N·m]
}

// Reactions returns the reactions of every node and group with a fixed DOF,
// nodes first in handle order, then groups; nil in a tipped case. Feet
// are in Feet.
func (c *CaseResult) Reactions() []Reaction {
	if c.Tipped() {
		return nil
	}
	m := c.nt.m
	var out []Reaction
	for i := range m.nodes {
		if m.nodes[i].fixed != 0 && c.nt.dm.groupOf[i] < 0 {
			out = append(out, Reaction{At: NodeID(i), Name: m.nodes[i].name, Load: loadOf(c.react[i])})
		}
	}
	for g := range m.groups {
		if m.groupFix[GroupID(g)] != 0 {
			out = append(out, Reaction{At: GroupID(g), Name: m.groups[g].name, Load: loadOf(c.react[c.nt.dm.nNodes+g])})
		}
	}
	return out
}

// ForcesTo writes the force state of every element, in handle order, into
// dst (nil allocates) and returns it; in a tipped case only Kind is set.
func (c *CaseResult) ForcesTo(dst []ElementForce) []ElementForce {
	if dst == nil {
		dst = make([]ElementForce, len(c.nt.m.elems))
	}
	if c.Tipped() {
		for i := range c.nt.m.elems {
			dst[i] = ElementForce{Kind: c.nt.m.elems[i].kind}
		}
		return dst
	}
	copy(dst, c.forces)
	return dst
}
