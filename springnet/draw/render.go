package draw

import (
	"fmt"
	"image/color"
	"math"
	"sort"
	"strconv"
	"strings"
)

// Picture size and layout [px at 96 dpi].
const (
	picW, picH   = 1280.0, 900.0
	margin       = 10.0
	titleH       = 44.0  // title band at the top
	legendW      = 270.0 // legend column at the right
	panelTitleH  = 22.0  // view name band inside a panel
	panelPad     = 26.0  // free space around the stand inside a panel
	footH, footW = 10.0, 12.0
	fontSmall    = 11.0
	fontNormal   = 13.0
	fontTitle    = 19.0
)

// op is a drawing primitive kind.
type op int

const (
	opLine   op = iota // polyline through pts
	opPoly             // closed filled/stroked polygon
	opCircle           // circle at pts[0], radius r
	opText             // text at pts[0]
)

// anchor is where text sits relative to its point.
type anchor int

const (
	anchorStart anchor = iota
	anchorMiddle
	anchorEnd
)

// pt is a point on the picture [px], y down.
type pt struct{ x, y float64 }

// prim is one primitive of the display list that both back-ends draw.
type prim struct {
	op     op
	class  string // SVG class
	id     string // SVG id; "" none
	data   string // SVG data-member (the member's name)
	title  string // SVG tooltip
	pts    []pt
	r      float64
	stroke color.RGBA // A == 0: none
	fill   color.RGBA // A == 0: none
	// opacity of the fill in (0, 1]; 0 means opaque.
	opacity float64
	width   float64
	dash    []float64
	text    string
	size    float64
	anchor  anchor
	bold    bool
}

// view is one of the four projections.
type view int

const (
	front view = iota
	side
	top
	iso
)

var viewNames = [...]string{"front", "side", "top", "isometric"}
var viewTitles = [...]string{
	"FRONT — looking along +Y",
	"SIDE — looking along −X",
	"TOP — looking down",
	"ISOMETRIC — from front right, above",
}

// axis labels per view: right, up.
var viewAxes = [...][2]string{{"X", "Z"}, {"Y", "Z"}, {"X", "Y"}, {"", ""}}

var isoR, isoU = 1 / math.Sqrt2, 1 / math.Sqrt(6)

// project returns the picture-plane coordinates (right, up) [m] of p.
func (v view) project(p Point) (u, w float64) {
	switch v {
	case front:
		return p.X, p.Z
	case side:
		return p.Y, p.Z
	case top:
		return p.X, p.Y
	}
	// Viewer along (1, −1, 1) looking at the origin: right (1, 1, 0)/√2,
	// up (−1, 1, 2)/√6.
	return (p.X + p.Y) * isoR, (-p.X + p.Y + 2*p.Z) * isoU
}

// depth grows towards the viewer.
func (v view) depth(p Point) float64 {
	switch v {
	case front:
		return -p.Y
	case side:
		return p.X
	case top:
		return p.Z
	}
	return p.X - p.Y + p.Z
}

// frame maps a view's model-plane coordinates into its panel.
type frame struct {
	s      float64 // px per m
	u0, w0 float64 // model-plane point at the panel's reference pixel
	px, py float64 // reference pixel
	x0, y0 float64 // panel corner
	pw, ph float64 // panel size
}

func (f frame) at(u, w float64) pt { return pt{f.px + (u-f.u0)*f.s, f.py - (w-f.w0)*f.s} }

// renderer builds the display list of a scene.
type renderer struct {
	s     *Scene
	k     float64 // displacement magnification (0: no shape)
	prims []prim
}

func (r *renderer) add(p prim) { r.prims = append(r.prims, p) }

// shown returns the drawn (displaced) position of node i.
func (r *renderer) shown(i int) Point {
	n := r.s.Nodes[i]
	return n.At.add(n.Move.scale(r.k))
}

// extents returns the bounding box of the stand in view v, original and
// displaced.
func (r *renderer) extents(v view) (umin, umax, wmin, wmax float64) {
	umin, wmin = math.Inf(1), math.Inf(1)
	umax, wmax = math.Inf(-1), math.Inf(-1)
	grow := func(p Point) {
		u, w := v.project(p)
		umin, umax = math.Min(umin, u), math.Max(umax, u)
		wmin, wmax = math.Min(wmin, w), math.Max(wmax, w)
	}
	for i, n := range r.s.Nodes {
		grow(n.At)
		grow(r.shown(i))
	}
	for _, m := range r.s.Mounts {
		grow(m.At)
		grow(m.At.add(m.Move.scale(r.k)))
	}
	return
}

// panel returns the corner and size of view v's panel.
func panel(v view) (x0, y0, w, h float64) {
	w = (picW - legendW - 3*margin) / 2
	h = (picH - titleH - 3*margin) / 2
	col, row := float64(int(v)%2), float64(int(v)/2)
	return margin + col*(w+margin), titleH + margin + row*(h+margin), w, h
}

// frames fits the views: one scale for the three orthographic views, its
// own for the isometric; each stand centred in its panel.
func (r *renderer) frames() [4]frame {
	var fs [4]frame
	fit := func(v view) float64 {
		umin, umax, wmin, wmax := r.extents(v)
		_, _, pw, ph := panel(v)
		aw, ah := pw-2*panelPad, ph-panelTitleH-2*panelPad-footH
		s := math.Inf(1)
		if d := umax - umin; d > 0 {
			s = math.Min(s, aw/d)
		}
		if d := wmax - wmin; d > 0 {
			s = math.Min(s, ah/d)
		}
		if math.IsInf(s, 1) {
			s = 100
		}
		return s
	}
	ortho := math.Min(fit(front), math.Min(fit(side), fit(top)))
	for _, v := range []view{front, side, top, iso} {
		s := ortho
		if v == iso {
			s = fit(iso)
		}
		umin, umax, wmin, wmax := r.extents(v)
		x0, y0, pw, ph := panel(v)
		cx := x0 + pw/2
		cy := y0 + panelTitleH + (ph-panelTitleH-footH)/2
		fs[v] = frame{s: s, u0: (umin + umax) / 2, w0: (wmin + wmax) / 2, px: cx, py: cy, x0: x0, y0: y0, pw: pw, ph: ph}
	}
	return fs
}

// build makes the display list.
func (r *renderer) build() {
	s := r.s
	r.add(prim{op: opPoly, class: "background", pts: rect(0, 0, picW, picH), fill: white})
	title := s.Title
	if title == "" {
		title = "stand"
	}
	r.add(prim{op: opText, class: "title", pts: []pt{{margin + 4, 30}}, text: title, size: fontTitle, bold: true, stroke: inkColour})
	fs := r.frames()
	for _, v := range []view{front, side, top, iso} {
		r.view(v, fs[v])
	}
	r.legend()
}

func rect(x, y, w, h float64) []pt { return []pt{{x, y}, {x + w, y}, {x + w, y + h}, {x, y + h}} }

// memberColour is the colour of member m.
func (r *renderer) memberColour(m Member) color.RGBA {
	switch {
	case r.s.Colours.Name == "":
		return plainColour
	case !m.Rated:
		return unratedColour
	}
	return Colour(m.Value, r.s.Colours.Max)
}

func memberWidth(st Style) float64 {
	switch st {
	case Bar:
		return 2
	case Spring:
		return 1.5
	}
	return 3.2
}

// view draws one panel.
func (r *renderer) view(v view, f frame) {
	s := r.s
	name := viewNames[v]
	r.add(prim{op: opPoly, class: "panel", id: "panel-" + name, pts: rect(f.x0, f.y0, f.pw, f.ph), stroke: frameColour, width: 1})
	r.add(prim{op: opText, class: "view-title", pts: []pt{{f.x0 + 8, f.y0 + 16}}, text: viewTitles[v], size: fontNormal, bold: true, stroke: inkColour})
	r.axes(v, f)

	// The floor under the feet, in the elevations.
	if v == front || v == side || v == iso {
		r.floor(v, f)
	}
	// The unloaded outline.
	if r.k > 0 {
		for i, m := range s.Members {
			pa, pb := r.place(v, f, s.Nodes[m.A].At), r.place(v, f, s.Nodes[m.B].At)
			r.add(prim{op: opLine, class: "ghost", id: fmt.Sprintf("%s-g%d", name, i), pts: []pt{pa, pb},
				stroke: ghostColour, width: 1, dash: []float64{4, 3}})
		}
	}
	// Members and rigid groups far to near (painter's order by mean
	// depth), so a top plate hides the back legs; the plate is
	// translucent, so what it hides still shows faintly.
	type drawable struct {
		depth float64
		p     prim
	}
	var items []drawable
	for i, g := range s.Groups {
		if len(g.Nodes) < 2 {
			continue
		}
		pts := make([]pt, len(g.Nodes))
		d := 0.0
		for j, n := range g.Nodes {
			pts[j] = r.place(v, f, r.shown(n))
			d += v.depth(r.shown(n))
		}
		items = append(items, drawable{d / float64(len(g.Nodes)), prim{op: opPoly, class: "group", id: fmt.Sprintf("%s-rg%d", name, i),
			title: "rigid " + g.Name, pts: pts, fill: groupFill, opacity: groupOpacity, stroke: groupColour, width: 1.5}})
	}
	for i, m := range s.Members {
		pa, pb := r.place(v, f, r.shown(m.A)), r.place(v, f, r.shown(m.B))
		p := prim{op: opLine, class: "member", id: fmt.Sprintf("%s-m%d", name, i), data: m.Name,
			title: r.memberTitle(m), pts: []pt{pa, pb}, stroke: r.memberColour(m), width: memberWidth(m.Style)}
		if m.Style == Spring {
			p.dash = []float64{5, 3}
		}
		items = append(items, drawable{(v.depth(r.shown(m.A)) + v.depth(r.shown(m.B))) / 2, p})
	}
	sort.SliceStable(items, func(i, j int) bool { return items[i].depth < items[j].depth })
	for _, it := range items {
		r.add(it.p)
	}
	// Nodes, feet, supports.
	for i, n := range s.Nodes {
		at := r.place(v, f, n.At)
		if n.Foot {
			r.add(prim{op: opPoly, class: "foot", id: fmt.Sprintf("%s-f%d", name, i), title: "foot at " + n.Name,
				pts: []pt{at, {at.x - footW/2, at.y + footH}, {at.x + footW/2, at.y + footH}}, fill: floorColour, stroke: inkColour, width: 1})
		}
		if n.Support {
			r.support(at, name, i, n.Name)
		}
		p := r.place(v, f, r.shown(i))
		r.add(prim{op: opCircle, class: "node", pts: []pt{p}, r: 2.2, fill: inkColour})
	}
	// Mounts; labels that fall on one spot (mounts one behind the other)
	// are written once, joined.
	var mountLabels, nodeLabels, floorLabels labels
	for i, m := range s.Mounts {
		p := r.place(v, f, m.At.add(m.Move.scale(r.k)))
		const d = 6
		r.add(prim{op: opPoly, class: "mount", id: fmt.Sprintf("%s-mt%d", name, i), title: "mount " + m.Name,
			pts: []pt{{p.x, p.y - d}, {p.x + d, p.y}, {p.x, p.y + d}, {p.x - d, p.y}}, fill: mountColour, stroke: white, width: 1})
		mountLabels.add(pt{p.x + 8, p.y - 7}, m.Name)
	}
	mountLabels.emit(r, prim{op: opText, class: "label mount-label", size: fontSmall, stroke: mountColour, bold: true})
	// Node labels, beside the undisplaced position for feet and supports
	// (they sit on the floor), else the drawn one.
	for i, n := range s.Nodes {
		if !n.Label || n.Name == "" {
			continue
		}
		p := r.place(v, f, r.shown(i))
		if n.Foot || n.Support {
			p = r.place(v, f, n.At)
			p.y += footH + 12
			floorLabels.add(p, n.Name)
			continue
		}
		nodeLabels.add(pt{p.x + 5, p.y - 5}, n.Name)
	}
	floorLabels.emit(r, prim{op: opText, class: "label", size: fontSmall, stroke: inkColour, anchor: anchorMiddle})
	nodeLabels.emit(r, prim{op: opText, class: "label", size: fontSmall, stroke: inkColour})
}

// labels gathers the labels of one kind in one view, joining those that
// fall within labelMerge pixels of each other.
type labels struct {
	at   []pt
	text [][]string
}

// labelMerge is the distance [px] under which two labels are one.
const labelMerge = 16

func (l *labels) add(p pt, s string) {
	for i, q := range l.at {
		if math.Hypot(p.x-q.x, p.y-q.y) < labelMerge {
			l.text[i] = append(l.text[i], s)
			return
		}
	}
	l.at = append(l.at, p)
	l.text = append(l.text, []string{s})
}

// emit adds the labels to r, each a copy of proto with its place and text.
func (l *labels) emit(r *renderer, proto prim) {
	for i, p := range l.at {
		q := proto
		q.pts = []pt{p}
		q.text = strings.Join(l.text[i], " · ")
		r.add(q)
	}
}

// place maps a model point into view v's panel.
func (r *renderer) place(v view, f frame, p Point) pt {
	u, w := v.project(p)
	return f.at(u, w)
}

func (r *renderer) memberTitle(m Member) string {
	if !m.Rated || r.s.Colours.Name == "" {
		return m.Name
	}
	return fmt.Sprintf("%s: %s %s", m.Name, r.s.Colours.Name, r.valueText(m.Value))
}

func (r *renderer) valueText(v float64) string {
	if r.s.Colours.Percent {
		return strconv.FormatFloat(100*v, 'f', 0, 64) + " %"
	}
	return strconv.FormatFloat(v, 'g', 3, 64)
}

// support draws a hatched block under a fixed node.
func (r *renderer) support(at pt, view string, i int, name string) {
	const w, h = 16.0, 7.0
	r.add(prim{op: opPoly, class: "support", id: fmt.Sprintf("%s-s%d", view, i), title: "support at " + name,
		pts: rect(at.x-w/2, at.y, w, h), fill: white, stroke: floorColour, width: 1.2})
	for k := 0; k < 4; k++ {
		x := at.x - w/2 + float64(k)*w/4
		r.add(prim{op: opLine, class: "support-hatch", pts: []pt{{x, at.y + h}, {x + w/4, at.y}}, stroke: floorColour, width: 1})
	}
}

// floor draws the floor line under the lowest feet and supports.
func (r *renderer) floor(v view, f frame) {
	var pts []pt
	for _, n := range r.s.Nodes {
		if n.Foot || n.Support {
			pts = append(pts, r.place(v, f, n.At))
		}
	}
	if len(pts) == 0 {
		return
	}
	if v == iso {
		// A shadow outline of the footprint on the floor.
		return
	}
	x0, x1, y := math.Inf(1), math.Inf(-1), math.Inf(-1)
	for _, p := range pts {
		x0, x1, y = math.Min(x0, p.x), math.Max(x1, p.x), math.Max(y, p.y)
	}
	y += footH
	r.add(prim{op: opLine, class: "floor", pts: []pt{{x0 - 24, y}, {x1 + 24, y}}, stroke: floorColour, width: 1.5})
}

// axes draws a small axis key in the panel's lower left corner.
func (r *renderer) axes(v view, f frame) {
	o := pt{f.x0 + 14, f.y0 + f.ph - 12}
	const l = 26
	arrow := func(d Point, label string) {
		u, w := v.project(d)
		n := math.Hypot(u, w)
		if n < 1e-9 {
			return
		}
		e := pt{o.x + l*u/n, o.y - l*w/n}
		r.add(prim{op: opLine, class: "axis", pts: []pt{o, e}, stroke: inkColour, width: 1})
		r.add(prim{op: opText, class: "axis-label", pts: []pt{{e.x + 3*u/n, e.y - 3*w/n + 4}}, text: label, size: fontSmall, stroke: inkColour, anchor: anchorMiddle})
	}
	for _, a := range []struct {
		d Point
		s string
	}{{Point{X: 1}, "X"}, {Point{Y: 1}, "Y"}, {Point{Z: 1}, "Z"}} {
		if v != iso && a.s != viewAxes[v][0] && a.s != viewAxes[v][1] {
			continue
		}
		arrow(a.d, a.s)
	}
}

// displayList validates s and returns its primitives.
func (s *Scene) displayList() ([]prim, error) {
	if err := s.Validate(); err != nil {
		return nil, err
	}
	r := &renderer{s: s, k: s.scale()}
	r.build()
	return r.prims, nil
}
