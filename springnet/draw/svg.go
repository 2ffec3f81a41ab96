package draw

import (
	"bufio"
	"encoding/xml"
	"fmt"
	"image/color"
	"io"
	"strconv"
	"strings"
)

// SVG writes the scene as a standalone SVG 1.1 document to w. Every member
// is drawn once per view as a <line class="member"> whose data-member
// attribute names it and whose <title> gives its value. It fails if s is
// invalid (see Validate) or w fails.
func (s *Scene) SVG(w io.Writer) error {
	prims, err := s.displayList()
	if err != nil {
		return err
	}
	b := bufio.NewWriter(w)
	fmt.Fprintf(b, `<?xml version="1.0" encoding="UTF-8"?>
<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="%s" height="%s" viewBox="0 0 %s %s" font-family="Liberation Sans, Arial, Helvetica, sans-serif">
`, f1(picW), f1(picH), f1(picW), f1(picH))
	fmt.Fprintf(b, "<title>%s</title>\n", esc(s.Title))
	for _, p := range prims {
		writeSVGPrim(b, p)
	}
	b.WriteString("</svg>\n")
	return b.Flush()
}

func writeSVGPrim(b *bufio.Writer, p prim) {
	attrs := func() string {
		var sb strings.Builder
		if p.class != "" {
			fmt.Fprintf(&sb, ` class="%s"`, esc(p.class))
		}
		if p.id != "" {
			fmt.Fprintf(&sb, ` id="%s"`, esc(p.id))
		}
		if p.data != "" {
			fmt.Fprintf(&sb, ` data-member="%s"`, esc(p.data))
		}
		return sb.String()
	}
	paint := func() string {
		var sb strings.Builder
		if p.fill.A > 0 {
			fmt.Fprintf(&sb, ` fill="%s"`, hex(p.fill))
			if p.opacity > 0 && p.opacity < 1 {
				fmt.Fprintf(&sb, ` fill-opacity="%s"`, f1(p.opacity))
			}
		} else {
			sb.WriteString(` fill="none"`)
		}
		if p.stroke.A > 0 && p.width > 0 {
			fmt.Fprintf(&sb, ` stroke="%s" stroke-width="%s"`, hex(p.stroke), f1(p.width))
			if len(p.dash) > 0 {
				ds := make([]string, len(p.dash))
				for i, d := range p.dash {
					ds[i] = f1(d)
				}
				fmt.Fprintf(&sb, ` stroke-dasharray="%s"`, strings.Join(ds, " "))
			}
		}
		return sb.String()
	}
	body := func(tag string, open string) {
		if p.title != "" {
			fmt.Fprintf(b, "%s><title>%s</title></%s>\n", open, esc(p.title), tag)
			return
		}
		fmt.Fprintf(b, "%s/>\n", open)
	}
	switch p.op {
	case opLine:
		if len(p.pts) == 2 {
			a, c := p.pts[0], p.pts[1]
			body("line", fmt.Sprintf(`<line%s x1="%s" y1="%s" x2="%s" y2="%s"%s stroke-linecap="round"`,
				attrs(), f1(a.x), f1(a.y), f1(c.x), f1(c.y), paint()))
			return
		}
		body("polyline", fmt.Sprintf(`<polyline%s points="%s"%s`, attrs(), points(p.pts), paint()))
	case opPoly:
		body("polygon", fmt.Sprintf(`<polygon%s points="%s"%s`, attrs(), points(p.pts), paint()))
	case opCircle:
		c := p.pts[0]
		body("circle", fmt.Sprintf(`<circle%s cx="%s" cy="%s" r="%s"%s`, attrs(), f1(c.x), f1(c.y), f1(p.r), paint()))
	case opText:
		c := p.pts[0]
		anchor := [...]string{"start", "middle", "end"}[p.anchor]
		weight := ""
		if p.bold {
			weight = ` font-weight="bold"`
		}
		fmt.Fprintf(b, `<text%s x="%s" y="%s" font-size="%s" text-anchor="%s"%s fill="%s">%s</text>`+"\n",
			attrs(), f1(c.x), f1(c.y), f1(p.size), anchor, weight, hex(p.stroke), esc(p.text))
	}
}

func points(ps []pt) string {
	s := make([]string, len(ps))
	for i, p := range ps {
		s[i] = f1(p.x) + "," + f1(p.y)
	}
	return strings.Join(s, " ")
}

// f1 formats a coordinate with at most two decimals.
func f1(v float64) string {
	s := strconv.FormatFloat(v, 'f', 2, 64)
	s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	if s == "-0" || s == "" {
		return "0"
	}
	return s
}

func hex(c color.RGBA) string { return fmt.Sprintf("#%02x%02x%02x", c.R, c.G, c.B) }

// esc escapes text for XML character data and attribute values.
func esc(s string) string {
	var sb strings.Builder
	xml.EscapeText(&sb, []byte(s))
	return sb.String()
}
