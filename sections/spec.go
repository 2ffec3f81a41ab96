package sections

import (
	"fmt"
	"strconv"
	"strings"

	"github.com/trestle-go/trestle/materials"
)

// Spec returns the text spec of s (see Parse), which parses back to an
// equal value: each shape's String. Lengths are written in whichever of
// mm, in, cm, m, ft gives the shortest text that converts back exactly.
// A composite's materials are written by name, so a composite whose
// materials are not catalogue entries does not round-trip. For a Section
// type outside this package Spec returns its fmt %v form.
func Spec(s Section) string {
	if st, ok := s.(fmt.Stringer); ok {
		return st.String()
	}
	return fmt.Sprintf("%v", s)
}

// dimsText writes lengths joined by "x" and the unit, plus the trailing
// optional lengths as key=value in the same unit.
func dimsText(kind string, dims []float64, opts ...any) string {
	all := append([]float64(nil), dims...)
	type kv struct {
		k string
		v float64
	}
	var extra []kv
	for i := 0; i+1 < len(opts); i += 2 {
		v := opts[i+1].(float64)
		if v != 0 {
			extra = append(extra, kv{opts[i].(string), v})
			all = append(all, v)
		}
	}
	txt, u := formatDims(all)
	var b strings.Builder
	b.WriteString(kind + " " + strings.Join(txt[:len(dims)], "x") + " " + u.name)
	for i, e := range extra {
		b.WriteString(" " + e.k + "=" + txt[len(dims)+i])
	}
	return b.String()
}

func convText(c Convention) string {
	if c == AsGiven {
		return ""
	}
	return " " + c.String()
}

// String returns the spec, e.g. "rect 100x20 mm".
func (r Rect) String() string { return dimsText("rect", []float64{r.B, r.H}) }

// String returns the spec, e.g. "square 40 mm".
func (s Square) String() string { return dimsText("square", []float64{s.B}) }

// String returns the spec, e.g. "round 40 mm".
func (r Round) String() string { return dimsText("round", []float64{r.D}) }

// String returns the spec, e.g. "flat 50x10 mm".
func (f Flat) String() string { return dimsText("flat", []float64{f.W, f.T}) }

// String returns the spec, e.g. "round-tube 60.3x3.2 mm".
func (r RoundTube) String() string {
	return dimsText("round-tube", []float64{r.D, r.T}) + convText(r.Conv)
}

// String returns the spec, e.g. "rect-tube 100x50x4 mm r=8", or
// "square-tube 50x3 mm" when H = B.
func (r RectTube) String() string {
	if r.H == r.B {
		return dimsText("square-tube", []float64{r.B, r.T}, "r", r.R) + convText(r.Conv)
	}
	return dimsText("rect-tube", []float64{r.H, r.B, r.T}, "r", r.R) + convText(r.Conv)
}

// String returns the spec, e.g. "pipe 2in sch40".
func (p Pipe) String() string {
	s := strings.ToLower(p.Schedule)
	if s != "std" && s != "xs" {
		s = "sch" + s
	}
	return "pipe " + p.NPS + "in " + s + convText(p.Conv)
}

// String returns the spec, e.g. "angle 50x50x5 mm r=7".
func (a Angle) String() string {
	return dimsText("angle", []float64{a.B, a.H, a.T}, "r", a.R, "rt", a.RT)
}

// String returns the spec, e.g. "channel 100x50x6x8.5 mm".
func (c Channel) String() string {
	return dimsText("channel", []float64{c.H, c.B, c.TW, c.TF}, "r", c.R)
}

// String returns the spec, e.g. "i-shape 200x100x5.6x8.5 mm r=12".
func (s IShape) String() string {
	return dimsText("i-shape", []float64{s.H, s.B, s.TW, s.TF}, "r", s.R)
}

// String returns the spec, e.g. "lumber 2x6 x3".
func (l Lumber) String() string {
	s := "lumber " + strconv.Itoa(l.Thick) + "x" + strconv.Itoa(l.Wide)
	if l.Plies != 0 {
		s += " x" + strconv.Itoa(l.Plies)
	}
	return s
}

// String returns the spec, e.g. "block 8in" or
// "block 390x190 mm fs=30 web=25".
func (b Block) String() string {
	for _, n := range [...]int{4, 6, 8, 10, 12} {
		if nb, _ := NominalBlock(n); nb == b {
			return "block " + strconv.Itoa(n) + "in"
		}
	}
	s := dimsText("block", []float64{b.L, b.W}, "fs", b.FaceShell, "web", b.Web)
	if b.Webs != 0 {
		s += " webs=" + strconv.Itoa(b.Webs)
	}
	return s
}

// Default materials the parser uses when a spec names none.
const (
	defaultUnit       = "masonry concrete grouted"
	defaultGrout      = "concrete C20/25"
	defaultShell      = "steel S235"
	defaultShellAISC  = "steel A500 Gr C"
	materialClauseOf  = "of"
	materialClauseFor = "with"
)

func defaultShellFor(tube Section) string {
	switch t := tube.(type) {
	case RoundTube:
		if t.Conv == AISC {
			return defaultShellAISC
		}
	case RectTube:
		if t.Conv == AISC {
			return defaultShellAISC
		}
	case Pipe:
		if t.Conv == AISC {
			return defaultShellAISC
		}
	}
	return defaultShell
}

func materialText(clause string, m materials.Material, def string) string {
	if m.Name == def {
		return ""
	}
	return " " + clause + " " + m.Name
}

// String returns the spec, e.g. "block 8in grouted".
func (g GroutedBlock) String() string {
	return g.Block.String() + " grouted" + materialText(materialClauseOf, g.Unit, defaultUnit) +
		materialText(materialClauseFor, g.Grout, defaultGrout)
}

// String returns the spec, e.g. "filled square-tube 100x5 mm with concrete C25/30".
func (f Filled) String() string {
	return "filled " + Spec(f.Tube) + materialText(materialClauseOf, f.Shell, defaultShellFor(f.Tube)) +
		" " + materialClauseFor + " " + f.Fill.Name
}

// String returns the spec, e.g. "general A=12.3cm2 Iy=100cm4 Iz=50cm4 J=20cm4".
func (g General) String() string {
	s := "general A=" + formatQty(g.A, 2) + " Iy=" + formatQty(g.Iy, 4) + " Iz=" + formatQty(g.Iz, 4) + " J=" + formatQty(g.J, 4)
	for _, o := range []struct {
		k string
		v float64
		p int
	}{{"Asy", g.AsY, 2}, {"Asz", g.AsZ, 2}, {"cy", g.CY, 1}, {"cz", g.CZ, 1}} {
		if o.v != 0 {
			s += " " + o.k + "=" + formatQty(o.v, o.p)
		}
	}
	return s
}
