package draw

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/springnet"
)

// Point is a position or a displacement in model axes [m].
type Point struct{ X, Y, Z float64 }

func (p Point) add(q Point) Point     { return Point{p.X + q.X, p.Y + q.Y, p.Z + q.Z} }
func (p Point) scale(s float64) Point { return Point{s * p.X, s * p.Y, s * p.Z} }
func (p Point) norm() float64         { return math.Sqrt(p.X*p.X + p.Y*p.Y + p.Z*p.Z) }
func (p Point) finite() bool          { return fin(p.X) && fin(p.Y) && fin(p.Z) }
func fin(v float64) bool              { return !math.IsNaN(v) && !math.IsInf(v, 0) }
func pointOf(v springnet.Vec) Point   { return Point{v.X, v.Y, v.Z} }

// Node is a point of the network.
type Node struct {
	Name    string
	At      Point // position [m]
	Move    Point // displacement in the shape shown [m]
	Foot    bool  // stands on a foot (drawn as a triangle on the floor)
	Support bool  // fixed to the ground (drawn as a hatched block)
	Label   bool  // write the name beside it in every view
}

// Style is how a member is drawn.
type Style int

// Member styles.
const (
	Beam   Style = iota // a thick line
	Bar                 // a thinner line (pin-ended)
	Spring              // a dashed line
)

// Member is a line between two nodes, coloured by Value.
type Member struct {
	Name  string
	A, B  int // indices into Scene.Nodes
	Style Style
	Value float64 // on the colour scale; used when Rated
	Rated bool    // Value is meaningful; otherwise drawn grey
}

// Mount is a named point where a machine sits, marked with a diamond.
type Mount struct {
	Name string
	At   Point // [m]
	Move Point // displacement in the shape shown [m]
}

// Group is a set of nodes that move as one rigid body (a machine bed, a
// thick top plate): drawn as a shaded outline through its nodes in the
// order given.
type Group struct {
	Name  string
	Nodes []int // indices into Scene.Nodes
}

// Colours says what member colours mean.
type Colours struct {
	Name    string  // e.g. "utilisation"; "" means no colour scale (all members one colour)
	Max     float64 // value at the red end of the scale; 0 means 1
	Percent bool    // label the scale in per cent
}

// Scene is what one picture shows.
type Scene struct {
	Title   string
	Nodes   []Node
	Members []Member
	Mounts  []Mount
	Groups  []Group
	Colours Colours
	// Shape says what the node displacements are, e.g. `deflection under
	// "weight"` or "mode 1, 23.4 Hz"; "" draws no displaced shape.
	Shape string
	// Scale multiplies the displacements; 0 means AutoScale.
	Scale float64
	// Sizeless says the displacements have no physical size (a mode
	// shape): the legend gives no largest displacement.
	Sizeless bool
	// Notes are extra legend lines (a caution, a source).
	Notes []string
}

// AutoFraction is the size of the largest displacement, as a fraction of
// the stand's largest dimension, when Scale is automatic.
const AutoFraction = 0.08

// FromModel returns a Scene with the nodes (named; feet and fixed nodes
// marked), the members (bars, beams and two-node springs, named, styled by
// kind, unrated), the rigid groups and the mounts of m. Feet and supports
// are labelled.
func FromModel(m *springnet.Model) Scene {
	var s Scene
	s.Nodes = make([]Node, m.NumNodes())
	for i := range s.Nodes {
		id := springnet.NodeID(i)
		s.Nodes[i] = Node{Name: m.NodeName(id), At: pointOf(m.NodeAt(id)), Support: m.Fixed(id) != 0}
	}
	for e := 0; e < m.NumElements(); e++ {
		id := springnet.ElementID(e)
		a, b := m.ElementNodes(id)
		name := m.ElementName(id)
		if name == "" {
			name = fmt.Sprintf("%s #%d", m.ElementKind(id), e)
		}
		switch m.ElementKind(id) {
		case springnet.FootKind:
			s.Nodes[a].Foot = true
			continue
		case springnet.BarKind:
			s.Members = append(s.Members, Member{Name: name, A: int(a), B: int(b), Style: Bar})
		case springnet.SpringKind:
			s.Members = append(s.Members, Member{Name: name, A: int(a), B: int(b), Style: Spring})
		default:
			s.Members = append(s.Members, Member{Name: name, A: int(a), B: int(b), Style: Beam})
		}
	}
	for i := range s.Nodes {
		s.Nodes[i].Label = s.Nodes[i].Foot || s.Nodes[i].Support
	}
	for g := 0; g < m.NumGroups(); g++ {
		id := springnet.GroupID(g)
		grp := Group{Name: m.GroupName(id)}
		for _, n := range m.GroupNodes(id) {
			grp.Nodes = append(grp.Nodes, int(n))
		}
		s.Groups = append(s.Groups, grp)
	}
	for i := 0; i < m.NumMounts(); i++ {
		id := springnet.MountID(i)
		s.Mounts = append(s.Mounts, Mount{Name: m.MountName(id), At: pointOf(m.MountAt(id))})
	}
	return s
}

// Validate reports every problem of s at once: member ends out of range,
// positions, displacements or values that are not finite, a negative or
// non-finite Scale or Colours.Max, an empty scene.
func (s *Scene) Validate() error {
	var errs []error
	if len(s.Nodes) == 0 {
		errs = append(errs, errors.New("draw: the scene has no nodes"))
	}
	for i, n := range s.Nodes {
		if !n.At.finite() || !n.Move.finite() {
			errs = append(errs, fmt.Errorf("draw: node %d %q: position or displacement is not finite", i, n.Name))
		}
	}
	for i, mb := range s.Members {
		if mb.A < 0 || mb.A >= len(s.Nodes) || mb.B < 0 || mb.B >= len(s.Nodes) {
			errs = append(errs, fmt.Errorf("draw: member %d %q: end node out of range [0, %d)", i, mb.Name, len(s.Nodes)))
		}
		if mb.Rated && !fin(mb.Value) {
			errs = append(errs, fmt.Errorf("draw: member %d %q: value is not finite", i, mb.Name))
		}
	}
	for i, g := range s.Groups {
		for _, n := range g.Nodes {
			if n < 0 || n >= len(s.Nodes) {
				errs = append(errs, fmt.Errorf("draw: group %d %q: node %d out of range [0, %d)", i, g.Name, n, len(s.Nodes)))
				break
			}
		}
	}
	for i, mt := range s.Mounts {
		if !mt.At.finite() || !mt.Move.finite() {
			errs = append(errs, fmt.Errorf("draw: mount %d %q: position or displacement is not finite", i, mt.Name))
		}
	}
	if !fin(s.Scale) || s.Scale < 0 {
		errs = append(errs, fmt.Errorf("draw: scale %g is not a finite factor >= 0", s.Scale))
	}
	if !fin(s.Colours.Max) || s.Colours.Max < 0 {
		errs = append(errs, fmt.Errorf("draw: colour scale maximum %g is not finite and >= 0", s.Colours.Max))
	}
	return errors.Join(errs...)
}

// size returns the largest dimension of the undisplaced stand [m] (1 for
// a single point).
func (s *Scene) size() float64 {
	lo := Point{math.Inf(1), math.Inf(1), math.Inf(1)}
	hi := Point{math.Inf(-1), math.Inf(-1), math.Inf(-1)}
	grow := func(p Point) {
		lo = Point{math.Min(lo.X, p.X), math.Min(lo.Y, p.Y), math.Min(lo.Z, p.Z)}
		hi = Point{math.Max(hi.X, p.X), math.Max(hi.Y, p.Y), math.Max(hi.Z, p.Z)}
	}
	for _, n := range s.Nodes {
		grow(n.At)
	}
	for _, m := range s.Mounts {
		grow(m.At)
	}
	d := math.Max(hi.X-lo.X, math.Max(hi.Y-lo.Y, hi.Z-lo.Z))
	if !(d > 0) {
		return 1
	}
	return d
}

// maxMove returns the largest displacement in s [m].
func (s *Scene) maxMove() float64 {
	mx := 0.0
	for _, n := range s.Nodes {
		mx = math.Max(mx, n.Move.norm())
	}
	for _, m := range s.Mounts {
		mx = math.Max(mx, m.Move.norm())
	}
	return mx
}

// AutoScale returns the magnification that draws the largest displacement
// as AutoFraction of the stand's largest dimension, or 0 when nothing
// moves.
func (s *Scene) AutoScale() float64 {
	mx := s.maxMove()
	if !(mx > 0) {
		return 0
	}
	return AutoFraction * s.size() / mx
}

// scale returns the magnification used: Scale, or AutoScale.
func (s *Scene) scale() float64 {
	if s.Shape == "" {
		return 0
	}
	if s.Scale > 0 {
		return s.Scale
	}
	return s.AutoScale()
}
