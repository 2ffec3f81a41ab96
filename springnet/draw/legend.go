package draw

import (
	"fmt"
	"strconv"
	"strings"
)

// legend draws the colour scale, the shape statement and the symbol key.
func (r *renderer) legend() {
	s := r.s
	x := picW - legendW
	y := titleH + margin
	r.add(prim{op: opPoly, class: "legend", id: "legend", pts: rect(x, y, legendW-margin, picH-y-margin), stroke: frameColour, width: 1})
	x += 12
	y += 22
	text := func(t string, size float64, bold bool) {
		for _, line := range wrap(t, int((legendW-34)/(size*0.52))) {
			r.add(prim{op: opText, class: "legend-text", pts: []pt{{x, y}}, text: line, size: size, bold: bold, stroke: inkColour})
			y += size + 5
		}
	}
	if s.Colours.Name != "" {
		text("Members coloured by "+s.Colours.Name, fontNormal, true)
		y += 4
		max := s.Colours.Max
		if !(max > 0) {
			max = 1
		}
		const barW, barH, steps = 22.0, 200.0, 40
		for k := 0; k < steps; k++ {
			t0 := float64(k) / steps
			yy := y + barH*(1-t0) - barH/steps
			r.add(prim{op: opPoly, class: "scale", pts: rect(x, yy, barW, barH/steps+0.5), fill: Colour((t0+0.5/steps)*max, max)})
		}
		r.add(prim{op: opPoly, class: "scale-frame", pts: rect(x, y, barW, barH), stroke: inkColour, width: 0.8})
		for k := 0; k <= 4; k++ {
			t := float64(k) / 4
			yy := y + barH*(1-t)
			r.add(prim{op: opLine, class: "scale-tick", pts: []pt{{x + barW, yy}, {x + barW + 5, yy}}, stroke: inkColour, width: 0.8})
			r.add(prim{op: opText, class: "scale-label", pts: []pt{{x + barW + 9, yy + 4}}, text: r.valueText(t * max), size: fontSmall, stroke: inkColour})
		}
		y += barH + 14
		r.add(prim{op: opPoly, class: "scale-over", pts: rect(x, y, barW, 12), fill: overColour})
		r.add(prim{op: opText, class: "legend-text", pts: []pt{{x + barW + 9, y + 10}}, text: "above " + r.valueText(max), size: fontSmall, stroke: inkColour})
		y += 18
		r.add(prim{op: opPoly, class: "scale-none", pts: rect(x, y, barW, 12), fill: unratedColour})
		r.add(prim{op: opText, class: "legend-text", pts: []pt{{x + barW + 9, y + 10}}, text: "no value", size: fontSmall, stroke: inkColour})
		y += 30
	}
	if s.Shape != "" {
		text("Shape: "+s.Shape, fontNormal, true)
		if r.k > 0 {
			how := "automatic"
			if s.Scale > 0 {
				how = "chosen"
			}
			if s.Sizeless {
				text(fmt.Sprintf("drawn ×%s (%s scale); the shape has no size of its own", sig(r.k), how), fontSmall, false)
			} else {
				text(fmt.Sprintf("displacements drawn ×%s (%s scale); largest %s mm", sig(r.k), how, sig(1e3*s.maxMove())), fontSmall, false)
			}
			text("grey dashed: unloaded", fontSmall, false)
		} else {
			text("nothing moves", fontSmall, false)
		}
		y += 8
	}
	text("Symbols", fontNormal, true)
	key := func(draw func(p pt), label string) {
		draw(pt{x + 11, y - 4})
		r.add(prim{op: opText, class: "legend-text", pts: []pt{{x + 30, y}}, text: label, size: fontSmall, stroke: inkColour})
		y += 20
	}
	key(func(p pt) {
		r.add(prim{op: opPoly, class: "key", pts: []pt{{p.x, p.y - 5}, {p.x - footW/2, p.y + 5}, {p.x + footW/2, p.y + 5}}, fill: floorColour, stroke: inkColour, width: 1})
	}, "foot on the floor")
	key(func(p pt) {
		r.add(prim{op: opPoly, class: "key", pts: rect(p.x-8, p.y-3, 16, 7), fill: white, stroke: floorColour, width: 1.2})
	}, "fixed support")
	key(func(p pt) {
		r.add(prim{op: opPoly, class: "key", pts: []pt{{p.x, p.y - 6}, {p.x + 6, p.y}, {p.x, p.y + 6}, {p.x - 6, p.y}}, fill: mountColour})
	}, "mount (machine seat)")
	key(func(p pt) {
		r.add(prim{op: opPoly, class: "key", pts: rect(p.x-10, p.y-5, 20, 10), fill: groupFill, stroke: groupColour, width: 1.5})
	}, "rigid group (top, bed)")
	key(func(p pt) {
		r.add(prim{op: opLine, class: "key", pts: []pt{{p.x - 10, p.y}, {p.x + 10, p.y}}, stroke: inkColour, width: memberWidth(Beam)})
	}, "beam")
	key(func(p pt) {
		r.add(prim{op: opLine, class: "key", pts: []pt{{p.x - 10, p.y}, {p.x + 10, p.y}}, stroke: inkColour, width: memberWidth(Bar)})
	}, "bar (pin-ended)")
	key(func(p pt) {
		r.add(prim{op: opLine, class: "key", pts: []pt{{p.x - 10, p.y}, {p.x + 10, p.y}}, stroke: inkColour, width: memberWidth(Spring), dash: []float64{5, 3}})
	}, "spring")
	y += 8
	for _, n := range s.Notes {
		text(n, fontSmall, false)
		y += 4
	}
}

// sig formats v with three significant figures.
func sig(v float64) string { return strconv.FormatFloat(v, 'g', 3, 64) }

// wrap splits t into lines of at most n characters at spaces.
func wrap(t string, n int) []string {
	if n < 10 {
		n = 10
	}
	var lines []string
	line := ""
	for _, w := range strings.Fields(t) {
		switch {
		case line == "":
			line = w
		case len([]rune(line))+1+len([]rune(w)) <= n:
			line += " " + w
		default:
			lines = append(lines, line)
			line = w
		}
	}
	if line != "" {
		lines = append(lines, line)
	}
	return lines
}
