package modelfile

import (
	"errors"
	"fmt"
	"math"
	"sort"

	"github.com/trestle-go/trestle/springnet"
)

// Kind is the kind of layout Generate builds.
type Kind int

const (
	// Frame is a rectangular frame of legs with stretchers, bracing and a
	// rigid or beam-grid top.
	Frame Kind = iota
	// Piers are masonry or cast piers (Timoshenko beams) under a slab
	// modelled as a rigid group.
	Piers
)

// Face is a vertical face of a rectangular layout. X runs along the width
// from left to right, Y along the depth from front to back.
type Face int

// The four faces.
const (
	Front Face = iota // y = 0
	Back              // y = Depth
	Left              // x = 0
	Right             // x = Width
)

// String returns "front", "back", "left" or "right".
func (f Face) String() string {
	switch f {
	case Front:
		return "front"
	case Back:
		return "back"
	case Left:
		return "left"
	case Right:
		return "right"
	}
	return fmt.Sprintf("Face(%d)", int(f))
}

// Pattern is how a braced panel is braced.
type Pattern int

// Bracing patterns.
const (
	Single Pattern = iota // one diagonal per panel, rising from the lower left
	Cross                 // both diagonals (an X), not joined where they cross
)

// Bracing puts diagonals (pin-ended bars) into every panel of a face: each
// bay between neighbouring legs, between neighbouring levels (the floor,
// each stretcher height, the top).
type Bracing struct {
	Face    Face
	Pattern Pattern
}

// Top is the kind of top of a frame.
type Top int

// Tops.
const (
	RigidTop Top = iota // a thick plate or machine bed: the leg heads form a rigid group "top"
	BeamTop             // rails (beams) joining the leg heads along both grid directions
)

// Layout describes a common stand for Generate. Lengths in m, masses in
// kg, forces in N, stiffnesses in N/m.
type Layout struct {
	Title string
	Kind  Kind

	LegsX, LegsY         int     // legs (or piers) along the width and the depth; each ≥ 2
	Width, Depth, Height float64 // between leg centre lines, and floor to top [m]

	Material string // material of every member (a catalogue name)
	Section  string // leg or pier section spec (sections.Parse)

	// Frames only.
	Stretchers       []float64 // heights of the stretcher levels above the floor [m], each in (0, Height)
	StretcherSection string    // "": Section
	Bracing          []Bracing
	BraceSection     string // "": Section
	Top              Top
	TopSection       string // rails of a BeamTop; "": Section

	// Feet under each leg; zero: the legs are fixed to the floor.
	Feet            springnet.Stiffness6
	CompressionOnly bool

	// Optional loads: a machine of mass MachineMass [kg] with its centre
	// MachineHeight [m] above the top, centred on the plan, and a case
	// "top load" with a downward force TopLoad [N] at the centre of the
	// top. On a BeamTop both are shared equally by the leg heads.
	MachineMass   float64
	MachineHeight float64
	TopLoad       float64

	Units Units // units of the written file; zero: mm and N
}

// maxLegs bounds LegsX·LegsY before anything is allocated.
const maxLegs = 1 << 20

// Generate builds the model file of a common layout: node names are the
// leg's column letter (A, B, ... along X) and row number (1, 2, ... along
// Y), with "-s1", "-s2", ... at the stretcher levels and "-top" at the
// top; members are named "leg-1", "stretcher-1", "rail-1", "brace-1",
// "pier-1", feet "foot-1". Write the result to get a file to edit.
//
// Counts, for nx × ny legs and s stretcher levels (frames):
//
//	legs        nx·ny·(s+1)          beams
//	stretchers  s·(ny·(nx−1) + nx·(ny−1))   beams
//	rails       ny·(nx−1) + nx·(ny−1)        beams (BeamTop only)
//	braces      (s+1)·bays·(1 or 2)          bars per braced face; bays = nx−1 (front, back) or ny−1 (left, right)
//
// A layout whose analysis would not fit in MemoryBudget is refused with
// the estimate.
func Generate(l Layout) (*File, error) {
	if err := l.check(); err != nil {
		return nil, err
	}
	c := l.contents()
	return build("", c)
}

func (l *Layout) check() error {
	var errs []error
	bad := func(format string, args ...any) {
		errs = append(errs, fmt.Errorf("modelfile: layout: "+format, args...))
	}
	if l.LegsX < 2 || l.LegsY < 2 {
		bad("needs at least 2 × 2 legs, got %d × %d", l.LegsX, l.LegsY)
	} else if l.LegsX > maxLegs/l.LegsY {
		bad("%d × %d legs is more than the limit of %d", l.LegsX, l.LegsY, maxLegs)
	}
	for _, d := range []struct {
		n string
		v float64
	}{{"width", l.Width}, {"depth", l.Depth}, {"height", l.Height}} {
		if !(d.v > 0) || math.IsInf(d.v, 0) {
			bad("%s %g m must be positive and finite", d.n, d.v)
		}
	}
	if l.Material == "" || l.Section == "" {
		bad("needs a material and a section")
	}
	if l.Kind == Piers && (len(l.Stretchers) > 0 || len(l.Bracing) > 0 || l.Top != RigidTop) {
		bad("piers take no stretchers, bracing or beam top: the slab is rigid")
	}
	prev := 0.0
	for _, h := range l.Stretchers {
		if !(h > prev) || !(h < l.Height) {
			bad("stretcher heights must rise, each between the floor and the top (0 < h < %g m), got %g m", l.Height, h)
			break
		}
		prev = h
	}
	for _, b := range l.Bracing {
		if b.Face < Front || b.Face > Right || b.Pattern < Single || b.Pattern > Cross {
			bad("unknown bracing face %d or pattern %d", b.Face, b.Pattern)
		}
	}
	for _, v := range []float64{l.Feet.X, l.Feet.Y, l.Feet.Z, l.Feet.RX, l.Feet.RY, l.Feet.RZ, l.MachineMass, l.MachineHeight, l.TopLoad} {
		if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
			bad("feet stiffness, machine mass and height and top load must be finite and non-negative")
			break
		}
	}
	if len(errs) > 0 {
		return errors.Join(errs...)
	}
	// Size before building: every node a 6-DOF node with at most six
	// neighbours on the grid and two braces.
	nodes := l.LegsX * l.LegsY * (len(l.Stretchers) + 2)
	s := sizeOf(Size{Nodes: nodes, Equations: 6 * nodes}, float64(nodes)*36*(1+8)/2)
	if s.Bytes > MemoryBudget {
		return fmt.Errorf("modelfile: layout: %s", s.refusal())
	}
	return nil
}

// colName returns A, B, ..., Z, AA, AB, ...
func colName(i int) string {
	s := ""
	for i++; i > 0; i = (i - 1) / 26 {
		s = string(rune('A'+(i-1)%26)) + s
	}
	return s
}

// round rounds a generated coordinate to 1 nm, so that sums like
// 0.8·0.3 do not leave round-off digits in the written file.
func round(x float64) float64 { return math.Round(x*1e9) / 1e9 }

func (l *Layout) contents() *Contents {
	c := &Contents{Title: l.Title, Units: l.Units}
	if c.Units == (Units{}) {
		c.Units = Units{Length: "mm", Force: "N"}
	}
	if c.Title == "" {
		c.Title = fmt.Sprintf("Generated %d × %d %s, %g × %g × %g m", l.LegsX, l.LegsY,
			map[Kind]string{Frame: "frame", Piers: "piers under a slab"}[l.Kind], l.Width, l.Depth, l.Height)
	}
	nx, ny := l.LegsX, l.LegsY
	levels := append([]float64{0}, l.Stretchers...)
	levels = append(levels, l.Height)
	sort.Float64s(levels[1 : len(levels)-1])
	suffix := func(k int) string {
		switch {
		case k == 0:
			return ""
		case k == len(levels)-1:
			return "-top"
		}
		return fmt.Sprintf("-s%d", k)
	}
	name := func(i, j, k int) string { return fmt.Sprintf("%s%d%s", colName(i), j+1, suffix(k)) }
	x := func(i int) float64 { return round(l.Width * float64(i) / float64(nx-1)) }
	y := func(j int) float64 { return round(l.Depth * float64(j) / float64(ny-1)) }
	for k, z := range levels {
		for j := 0; j < ny; j++ {
			for i := 0; i < nx; i++ {
				c.Nodes = append(c.Nodes, Node{Name: name(i, j, k), At: springnet.Vec{X: x(i), Y: y(j), Z: round(z)}})
			}
		}
	}
	or := func(s string) string {
		if s == "" {
			return l.Section
		}
		return s
	}
	counter := map[string]int{}
	add := func(prefix string, kind springnet.ElementKind, sec, a, b string) {
		counter[prefix]++
		m := Member{Kind: kind, Name: fmt.Sprintf("%s-%d", prefix, counter[prefix]), A: a, B: b,
			Material: l.Material, Section: sec}
		if l.Kind == Piers {
			m.Timoshenko = true
		}
		c.Members = append(c.Members, m)
	}
	legName := "leg"
	if l.Kind == Piers {
		legName = "pier"
	}
	for j := 0; j < ny; j++ {
		for i := 0; i < nx; i++ {
			for k := 0; k+1 < len(levels); k++ {
				add(legName, springnet.BeamKind, l.Section, name(i, j, k), name(i, j, k+1))
			}
		}
	}
	grid := func(prefix, sec string, k int) {
		for j := 0; j < ny; j++ {
			for i := 0; i+1 < nx; i++ {
				add(prefix, springnet.BeamKind, sec, name(i, j, k), name(i+1, j, k))
			}
		}
		for i := 0; i < nx; i++ {
			for j := 0; j+1 < ny; j++ {
				add(prefix, springnet.BeamKind, sec, name(i, j, k), name(i, j+1, k))
			}
		}
	}
	for k := 1; k+1 < len(levels); k++ {
		grid("stretcher", or(l.StretcherSection), k)
	}
	if l.Top == BeamTop {
		grid("rail", or(l.TopSection), len(levels)-1)
	}
	for _, b := range l.Bracing {
		// Legs along the face, in order.
		var legs [][2]int
		switch b.Face {
		case Front, Back:
			j := 0
			if b.Face == Back {
				j = ny - 1
			}
			for i := 0; i < nx; i++ {
				legs = append(legs, [2]int{i, j})
			}
		default:
			i := 0
			if b.Face == Right {
				i = nx - 1
			}
			for j := 0; j < ny; j++ {
				legs = append(legs, [2]int{i, j})
			}
		}
		for k := 0; k+1 < len(levels); k++ {
			for p := 0; p+1 < len(legs); p++ {
				lo, hi := legs[p], legs[p+1]
				add("brace", springnet.BarKind, or(l.BraceSection), name(lo[0], lo[1], k), name(hi[0], hi[1], k+1))
				if b.Pattern == Cross {
					add("brace", springnet.BarKind, or(l.BraceSection), name(hi[0], hi[1], k), name(lo[0], lo[1], k+1))
				}
			}
		}
	}
	top := len(levels) - 1
	var bases, heads []string
	for j := 0; j < ny; j++ {
		for i := 0; i < nx; i++ {
			bases = append(bases, name(i, j, 0))
			heads = append(heads, name(i, j, top))
		}
	}
	if l.Feet != (springnet.Stiffness6{}) {
		for n, b := range bases {
			c.Feet = append(c.Feet, Foot{Name: fmt.Sprintf("foot-%d", n+1), Node: b, K: l.Feet, CompressionOnly: l.CompressionOnly})
		}
	} else {
		for _, b := range bases {
			c.Supports = append(c.Supports, Support{At: b, Fix: springnet.AllDOF})
		}
	}
	centre := springnet.Vec{X: round(l.Width / 2), Y: round(l.Depth / 2), Z: round(l.Height)}
	if l.Top == RigidTop {
		gname := "top"
		if l.Kind == Piers {
			gname = "slab"
		}
		c.Groups = append(c.Groups, RigidGroup{Name: gname, Nodes: heads})
		c.Mounts = append(c.Mounts, Mount{Name: "centre", On: gname, At: centre})
		if l.MachineMass > 0 {
			cg := centre.Add(springnet.Vec{Z: round(l.MachineHeight)})
			c.Masses = append(c.Masses, Mass{Name: "machine", On: "centre", Kg: l.MachineMass, Centre: &cg})
		}
		if l.TopLoad > 0 {
			c.Cases = append(c.Cases, Case{Name: "top load", Loads: []Load{{At: "centre", Load: springnet.Load{FZ: -l.TopLoad}}}})
		}
	} else {
		n := float64(len(heads))
		var loads []Load
		for _, h := range heads {
			if l.MachineMass > 0 {
				c.Masses = append(c.Masses, Mass{Name: "machine share", On: h, Kg: l.MachineMass / n})
			}
			loads = append(loads, Load{At: h, Load: springnet.Load{FZ: -l.TopLoad / n}})
		}
		if l.TopLoad > 0 {
			c.Cases = append(c.Cases, Case{Name: "top load", Loads: loads})
		}
	}
	c.Cases = append([]Case{{Name: "own weight", Gravity: springnet.Gravity(1)}}, c.Cases...)
	return c
}
