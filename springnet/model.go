package springnet

import (
	"fmt"

	"github.com/trestle-go/trestle/materials"
)

// NodeID is a handle to a node of a Model. Handles are only valid for the
// model that returned them; an out-of-range handle is a programming error
// and makes the methods that take it panic.
type NodeID int

// ElementID is a handle to an element (bar, spring, foot or beam) of a Model.
type ElementID int

// GroupID is a handle to a rigid group of a Model.
type GroupID int

// MountID is a handle to a mount of a Model.
type MountID int

// CaseID is a handle to a load case or a combination of a Model.
type CaseID int

// DefaultCase is the first load case of a model. AddLoad and SetGravity on
// it create it (named "default") if AddLoadCase has not been called yet;
// otherwise it is the first case added.
const DefaultCase CaseID = 0

// Place is where a load, a mass or a mount attaches, and where mount
// stiffness is measured: a NodeID (at the node), a GroupID (at the group's
// reference point) or a MountID (at the mount's point, on the body the mount
// is on).
type Place interface{ place() }

func (NodeID) place()  {}
func (GroupID) place() {}
func (MountID) place() {}

// Model is a 3D network of nodes joined by bars, springs and beams, resting
// on supports and feet, with rigid groups, mounts, masses and load cases.
// The zero Model is empty and ready to use. Builder methods do not return
// errors; Validate reports every problem of the data at once.
type Model struct {
	nodes      []node
	nodeByName map[string]NodeID
	elems      []elem
	groups     []group
	mounts     []mount
	masses     []pointMass
	cases      []loadCase
	groupFix   map[GroupID]DOF
}

type node struct {
	name  string
	at    Vec
	fixed DOF
}

// ElementKind tells what an element is.
type ElementKind int

// Element kinds.
const (
	BarKind    ElementKind = iota + 1 // pin-ended axial member (Bar)
	SpringKind                        // two-node spring (Spring)
	FootKind                          // node-to-ground spring (Foot)
	BeamKind                          // 3D beam (Beam)
)

// String returns "bar", "spring", "foot" or "beam".
func (k ElementKind) String() string {
	switch k {
	case BarKind:
		return "bar"
	case SpringKind:
		return "spring"
	case FootKind:
		return "foot"
	case BeamKind:
		return "beam"
	}
	return fmt.Sprintf("ElementKind(%d)", int(k))
}

type elem struct {
	kind   ElementKind
	a, b   NodeID // b is -1 for a foot
	bar    *Bar   // the one for kind is set
	spring *Spring
	foot   *Foot
	beam   *Beam
}

func (e *elem) name() string {
	switch e.kind {
	case BarKind:
		return e.bar.Name
	case SpringKind:
		return e.spring.Name
	case FootKind:
		return e.foot.Name
	}
	return e.beam.Name
}

type group struct {
	name   string
	nodes  []NodeID
	ref    Vec
	hasRef bool
}

type mount struct {
	name string
	at   Vec
	on   Place
}

type pointMass struct {
	on Place
	m  Mass
}

// Mass is a lumped mass attached rigidly to a node, rigid group or mount.
//
// Inertia and Products describe its inertia about axes through the centre
// of mass parallel to X, Y, Z. Products holds the products of inertia
// P_yz = ∫y·z dm, P_zx = ∫z·x dm, P_xy = ∫x·y dm (in X, Y, Z), positive
// as integrals; the inertia tensor's off-diagonal terms are their
// negatives (see Tensor):
//
//	J = [ Jx    −P_xy  −P_zx ]
//	    [ −P_xy  Jy    −P_yz ]
//	    [ −P_zx −P_yz   Jz   ]
//
// A body's tensor is positive semidefinite and its principal moments obey
// the triangle inequality; Validate checks both when Products is given
// (with Products zero, each moment need only be non-negative, so a rotary
// inertia about one axis stays allowed). Machine.Masses fills Products
// from a tensor.
type Mass struct {
	Kg       float64 // mass [kg]
	Offset   Vec     // centre of mass relative to the place it is attached to [m]
	Inertia  Vec     // moments of inertia about axes through the centre of mass parallel to X, Y, Z [kg·m²]
	Products Vec     // products of inertia P_yz, P_zx, P_xy about the centre of mass [kg·m²]
}

// Tensor returns the inertia tensor of ms about its centre of mass in
// global axes [kg·m²]: moments on the diagonal, −products off it.
func (ms Mass) Tensor() [3][3]float64 {
	j, p := ms.Inertia, ms.Products
	return [3][3]float64{
		{j.X, -p.Z, -p.Y},
		{-p.Z, j.Y, -p.X},
		{-p.Y, -p.X, j.Z},
	}
}

type placedLoad struct {
	at Place
	l  Load
}

type loadCase struct {
	name    string
	gravity Vec
	loads   []placedLoad
	terms   []Term // non-nil: a combination
}

// Term is one case of a combination and its factor.
type Term struct {
	Case   CaseID
	Factor float64
}

// AddNode adds a node at the point at [m] and returns its handle. An empty
// name gives the automatic name "N<i>", i being the handle's number. Names
// must be unique (Validate).
func (m *Model) AddNode(name string, at Vec) NodeID {
	id := NodeID(len(m.nodes))
	if name == "" {
		name = fmt.Sprintf("N%d", id)
	}
	m.nodes = append(m.nodes, node{name: name, at: at})
	if m.nodeByName == nil {
		m.nodeByName = make(map[string]NodeID)
	}
	if _, dup := m.nodeByName[name]; !dup {
		m.nodeByName[name] = id
	}
	return id
}

// Node returns the node with the given name.
func (m *Model) Node(name string) (NodeID, bool) {
	id, ok := m.nodeByName[name]
	return id, ok
}

// NumNodes returns the number of nodes; handles run from 0 to NumNodes()−1.
func (m *Model) NumNodes() int { return len(m.nodes) }

// NodeName returns the name of node n.
func (m *Model) NodeName(n NodeID) string { return m.nodes[m.checkNode(n)].name }

// NodeAt returns the position of node n [m].
func (m *Model) NodeAt(n NodeID) Vec { return m.nodes[m.checkNode(n)].at }

// Fixed returns the fixed DOF of node n.
func (m *Model) Fixed(n NodeID) DOF { return m.nodes[m.checkNode(n)].fixed }

func (m *Model) checkNode(n NodeID) NodeID {
	if n < 0 || int(n) >= len(m.nodes) {
		panic(fmt.Sprintf("springnet: node handle %d out of range [0, %d)", n, len(m.nodes)))
	}
	return n
}

// Fix prescribes zero displacement for the DOF d of node n (a support).
// Repeated calls add to the fixed set. A node of a rigid group cannot be
// fixed (use FixGroup).
func (m *Model) Fix(n NodeID, d DOF) { m.nodes[m.checkNode(n)].fixed |= d }

// FixGroup prescribes zero displacement for the DOF d of rigid group g at
// its reference point.
func (m *Model) FixGroup(g GroupID, d DOF) {
	m.checkGroup(g)
	if m.groupFix == nil {
		m.groupFix = make(map[GroupID]DOF)
	}
	m.groupFix[g] |= d
}

func (m *Model) addElem(e elem) ElementID {
	m.checkNode(e.a)
	if e.b >= 0 {
		m.checkNode(e.b)
	}
	m.elems = append(m.elems, e)
	return ElementID(len(m.elems) - 1)
}

// AddBar adds a pin-ended axial member from a to b. An empty bar.Name gives
// "B<i>", i being the element handle's number.
func (m *Model) AddBar(a, b NodeID, bar Bar) ElementID {
	if bar.Name == "" {
		bar.Name = fmt.Sprintf("B%d", len(m.elems))
	}
	return m.addElem(elem{kind: BarKind, a: a, b: b, bar: &bar})
}

// AddSpring adds a two-node spring from a to b. An empty Name gives "S<i>".
func (m *Model) AddSpring(a, b NodeID, s Spring) ElementID {
	if s.Name == "" {
		s.Name = fmt.Sprintf("S%d", len(m.elems))
	}
	return m.addElem(elem{kind: SpringKind, a: a, b: b, spring: &s})
}

// AddFoot adds a spring from node n to the ground (the floor). An empty
// Name gives "F<i>".
func (m *Model) AddFoot(n NodeID, f Foot) ElementID {
	if f.Name == "" {
		f.Name = fmt.Sprintf("F%d", len(m.elems))
	}
	return m.addElem(elem{kind: FootKind, a: n, b: -1, foot: &f})
}

// AddBeam adds a 3D beam from a to b. An empty Name gives "M<i>".
func (m *Model) AddBeam(a, b NodeID, bm Beam) ElementID {
	if bm.Name == "" {
		bm.Name = fmt.Sprintf("M%d", len(m.elems))
	}
	return m.addElem(elem{kind: BeamKind, a: a, b: b, beam: &bm})
}

// NumElements returns the number of elements; handles run from 0 to
// NumElements()−1.
func (m *Model) NumElements() int { return len(m.elems) }

func (m *Model) el(e ElementID) *elem {
	if e < 0 || int(e) >= len(m.elems) {
		panic(fmt.Sprintf("springnet: element handle %d out of range [0, %d)", e, len(m.elems)))
	}
	return &m.elems[e]
}

// ElementKind returns what element e is.
func (m *Model) ElementKind(e ElementID) ElementKind { return m.el(e).kind }

// ElementName returns the name of element e.
func (m *Model) ElementName(e ElementID) string { return m.el(e).name() }

// ElementNodes returns the end nodes of element e; b is −1 for a foot.
func (m *Model) ElementNodes(e ElementID) (a, b NodeID) {
	x := m.el(e)
	return x.a, x.b
}

// Element returns the element with the given name (the first, if names
// repeat).
func (m *Model) Element(name string) (ElementID, bool) {
	for i := range m.elems {
		if m.elems[i].name() == name {
			return ElementID(i), true
		}
	}
	return -1, false
}

// BarOf returns the data of element e if it is a bar.
func (m *Model) BarOf(e ElementID) (Bar, bool) {
	if x := m.el(e); x.kind == BarKind {
		return *x.bar, true
	}
	return Bar{}, false
}

// SpringOf returns the data of element e if it is a spring.
func (m *Model) SpringOf(e ElementID) (Spring, bool) {
	if x := m.el(e); x.kind == SpringKind {
		return *x.spring, true
	}
	return Spring{}, false
}

// FootOf returns the data of element e if it is a foot.
func (m *Model) FootOf(e ElementID) (Foot, bool) {
	if x := m.el(e); x.kind == FootKind {
		return *x.foot, true
	}
	return Foot{}, false
}

// BeamOf returns the data of element e if it is a beam.
func (m *Model) BeamOf(e ElementID) (Beam, bool) {
	if x := m.el(e); x.kind == BeamKind {
		return *x.beam, true
	}
	return Beam{}, false
}

// AddRigidGroup adds a rigid group: the nodes move together as one rigid
// body (a thick top plate, a machine bed), imposed exactly by eliminating
// their DOF onto a reference point with six DOF, at the centroid of the
// nodes. A node can be in at most one group (Validate).
func (m *Model) AddRigidGroup(name string, nodes ...NodeID) GroupID {
	for _, n := range nodes {
		m.checkNode(n)
	}
	if name == "" {
		name = fmt.Sprintf("G%d", len(m.groups))
	}
	m.groups = append(m.groups, group{name: name, nodes: append([]NodeID(nil), nodes...)})
	return GroupID(len(m.groups) - 1)
}

// AddRigidGroupAt is AddRigidGroup with the reference point given [m]
// instead of the centroid.
func (m *Model) AddRigidGroupAt(name string, ref Vec, nodes ...NodeID) GroupID {
	g := m.AddRigidGroup(name, nodes...)
	m.groups[g].ref, m.groups[g].hasRef = ref, true
	return g
}

func (m *Model) checkGroup(g GroupID) GroupID {
	if g < 0 || int(g) >= len(m.groups) {
		panic(fmt.Sprintf("springnet: group handle %d out of range [0, %d)", g, len(m.groups)))
	}
	return g
}

// NumGroups returns the number of rigid groups.
func (m *Model) NumGroups() int { return len(m.groups) }

// GroupName returns the name of group g.
func (m *Model) GroupName(g GroupID) string { return m.groups[m.checkGroup(g)].name }

// GroupNodes returns a copy of the nodes of group g.
func (m *Model) GroupNodes(g GroupID) []NodeID {
	return append([]NodeID(nil), m.groups[m.checkGroup(g)].nodes...)
}

// GroupPoint returns the reference point of group g [m]: the given point,
// or the centroid of its nodes.
func (m *Model) GroupPoint(g GroupID) Vec {
	gr := &m.groups[m.checkGroup(g)]
	if gr.hasRef || len(gr.nodes) == 0 {
		return gr.ref
	}
	var c Vec
	for _, n := range gr.nodes {
		c = c.Add(m.nodes[n].at)
	}
	return c.Scale(1 / float64(len(gr.nodes)))
}

// Group returns the group with the given name.
func (m *Model) Group(name string) (GroupID, bool) {
	for i := range m.groups {
		if m.groups[i].name == name {
			return GroupID(i), true
		}
	}
	return -1, false
}

// AddMount adds a named point at [m] on a node, group or mount, where a
// machine sits. Loads may be applied and stiffness measured at mounts.
func (m *Model) AddMount(name string, at Vec, on Place) MountID {
	m.checkPlace(on)
	if name == "" {
		name = fmt.Sprintf("P%d", len(m.mounts))
	}
	m.mounts = append(m.mounts, mount{name: name, at: at, on: on})
	return MountID(len(m.mounts) - 1)
}

func (m *Model) checkMount(p MountID) MountID {
	if p < 0 || int(p) >= len(m.mounts) {
		panic(fmt.Sprintf("springnet: mount handle %d out of range [0, %d)", p, len(m.mounts)))
	}
	return p
}

func (m *Model) checkPlace(p Place) {
	switch p := p.(type) {
	case NodeID:
		m.checkNode(p)
	case GroupID:
		m.checkGroup(p)
	case MountID:
		m.checkMount(p)
	default:
		panic(fmt.Sprintf("springnet: place %v is not a NodeID, GroupID or MountID", p))
	}
}

// NumMounts returns the number of mounts.
func (m *Model) NumMounts() int { return len(m.mounts) }

// MountName returns the name of mount p.
func (m *Model) MountName(p MountID) string { return m.mounts[m.checkMount(p)].name }

// MountAt returns the point of mount p [m].
func (m *Model) MountAt(p MountID) Vec { return m.mounts[m.checkMount(p)].at }

// MountOn returns what mount p is attached to.
func (m *Model) MountOn(p MountID) Place { return m.mounts[m.checkMount(p)].on }

// Mount returns the mount with the given name.
func (m *Model) Mount(name string) (MountID, bool) {
	for i := range m.mounts {
		if m.mounts[i].name == name {
			return MountID(i), true
		}
	}
	return -1, false
}

// PlaceName describes p for messages: `node "B3"`, `group "top"`, `mount "spindle"`.
func (m *Model) PlaceName(p Place) string {
	switch p := p.(type) {
	case NodeID:
		return fmt.Sprintf("node %q", m.NodeName(p))
	case GroupID:
		return fmt.Sprintf("group %q", m.GroupName(p))
	case MountID:
		return fmt.Sprintf("mount %q", m.MountName(p))
	}
	return fmt.Sprintf("place %v", p)
}

// PlaceAt returns the point of p [m]: the node's position, the group's
// reference point, or the mount's point.
func (m *Model) PlaceAt(p Place) Vec {
	switch p := p.(type) {
	case NodeID:
		return m.NodeAt(p)
	case GroupID:
		return m.GroupPoint(p)
	case MountID:
		return m.MountAt(p)
	}
	m.checkPlace(p)
	return Vec{}
}

// AddMass adds a lumped mass attached rigidly to a node, group or mount.
// Gravity acts on it in every load case with gravity; later analyses use it
// for the mass matrix.
func (m *Model) AddMass(on Place, ms Mass) {
	m.checkPlace(on)
	m.masses = append(m.masses, pointMass{on: on, m: ms})
}

// AddLoadCase adds a load case with no loads and no gravity and returns its
// handle. The first case added is DefaultCase.
func (m *Model) AddLoadCase(name string) CaseID {
	if name == "" {
		name = fmt.Sprintf("case %d", len(m.cases))
	}
	m.cases = append(m.cases, loadCase{name: name})
	return CaseID(len(m.cases) - 1)
}

func (m *Model) checkCase(c CaseID) *loadCase {
	if c == DefaultCase && len(m.cases) == 0 {
		m.AddLoadCase("default")
	}
	if c < 0 || int(c) >= len(m.cases) {
		panic(fmt.Sprintf("springnet: case handle %d out of range [0, %d)", c, len(m.cases)))
	}
	return &m.cases[c]
}

// AddLoad adds the load l at p to DefaultCase (created, named "default",
// if the model has no case yet).
func (m *Model) AddLoad(at Place, l Load) { m.AddCaseLoad(DefaultCase, at, l) }

// AddCaseLoad adds the load l at p to case c. A force at a point away from
// a node (a mount, a group's reference point) also gives the node or group
// the moment of that force.
func (m *Model) AddCaseLoad(c CaseID, at Place, l Load) {
	m.checkPlace(at)
	lc := m.checkCase(c)
	lc.loads = append(lc.loads, placedLoad{at: at, l: l})
}

// SetGravity sets the acceleration of gravity for case c [m/s²]; it acts
// on the self-weight of members and on every added mass. Use Gravity(1) for
// ordinary self-weight. The zero vector (the default) means no gravity.
func (m *Model) SetGravity(c CaseID, g Vec) { m.checkCase(c).gravity = g }

// AddCombination adds a combination: the factored sum of plain load cases,
// analysed as its own load (so compression-only feet are treated right).
func (m *Model) AddCombination(name string, terms ...Term) CaseID {
	if name == "" {
		name = fmt.Sprintf("combination %d", len(m.cases))
	}
	m.cases = append(m.cases, loadCase{name: name, terms: append([]Term{}, terms...)})
	return CaseID(len(m.cases) - 1)
}

// NumCases returns the number of load cases and combinations.
func (m *Model) NumCases() int { return len(m.cases) }

// CaseName returns the name of case c.
func (m *Model) CaseName(c CaseID) string {
	if c < 0 || int(c) >= len(m.cases) {
		panic(fmt.Sprintf("springnet: case handle %d out of range [0, %d)", c, len(m.cases)))
	}
	return m.cases[c].name
}

// IsCombination reports whether case c is a combination.
func (m *Model) IsCombination(c CaseID) bool { m.CaseName(c); return m.cases[c].terms != nil }

// Case returns the load case or combination with the given name.
func (m *Model) Case(name string) (CaseID, bool) {
	for i := range m.cases {
		if m.cases[i].name == name {
			return CaseID(i), true
		}
	}
	return -1, false
}

// levelOrNominal is a helper for Range-valued scale factors: the zero
// Range means exactly 1.
func scaleAt(r materials.Range, l materials.Level) float64 {
	if r == (materials.Range{}) {
		return 1
	}
	return r.At(l)
}
