package draw

import (
	"image/color"
	"io"
	"math"

	"codeberg.org/go-fonts/liberation/liberationsansbold"
	"codeberg.org/go-fonts/liberation/liberationsansregular"
	"golang.org/x/image/font/opentype"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/vgimg"
)

// pngDPI is the resolution of PNG output; one picture pixel is one image
// pixel.
const pngDPI = 96

// pxLen converts picture pixels (1/96 in) to vg lengths (1/72 in).
func pxLen(v float64) vg.Length { return vg.Length(v * 72 / pngDPI) }

// PNG renders the scene as a PNG image (1280 × 900 pixels) to w. It fails
// if s is invalid (see Validate) or w fails.
func (s *Scene) PNG(w io.Writer) error {
	prims, err := s.displayList()
	if err != nil {
		return err
	}
	faces, err := loadFaces()
	if err != nil {
		return err
	}
	c := vgimg.NewWith(vgimg.UseWH(pxLen(picW), pxLen(picH)), vgimg.UseDPI(pngDPI))
	at := func(p pt) vg.Point { return vg.Point{X: pxLen(p.x), Y: pxLen(picH - p.y)} }
	path := func(ps []pt, closed bool) vg.Path {
		var pa vg.Path
		for i, p := range ps {
			if i == 0 {
				pa.Move(at(p))
			} else {
				pa.Line(at(p))
			}
		}
		if closed {
			pa.Close()
		}
		return pa
	}
	stroke := func(p prim, pa vg.Path) {
		if p.stroke.A == 0 || p.width <= 0 {
			return
		}
		c.SetColor(p.stroke)
		c.SetLineWidth(pxLen(p.width))
		var ds []vg.Length
		for _, d := range p.dash {
			ds = append(ds, pxLen(d))
		}
		c.SetLineDash(ds, 0)
		c.Stroke(pa)
	}
	for _, p := range prims {
		switch p.op {
		case opLine:
			stroke(p, path(p.pts, false))
		case opPoly:
			pa := path(p.pts, true)
			if p.fill.A > 0 {
				c.SetColor(fillColour(p))
				c.Fill(pa)
			}
			stroke(p, pa)
		case opCircle:
			var pa vg.Path
			ctr := at(p.pts[0])
			pa.Move(vg.Point{X: ctr.X + pxLen(p.r), Y: ctr.Y})
			pa.Arc(ctr, pxLen(p.r), 0, 2*3.141592653589793)
			pa.Close()
			if p.fill.A > 0 {
				c.SetColor(p.fill)
				c.Fill(pa)
			}
			stroke(p, pa)
		case opText:
			face := faces.face(p.bold, pxLen(p.size))
			pos := at(p.pts[0])
			switch p.anchor {
			case anchorMiddle:
				pos.X -= face.Width(p.text) / 2
			case anchorEnd:
				pos.X -= face.Width(p.text)
			}
			c.SetColor(p.stroke)
			c.FillString(face, pos, p.text)
		}
	}
	_, err = vgimg.PngCanvas{Canvas: c}.WriteTo(w)
	return err
}

// fillColour is p's fill with its opacity.
func fillColour(p prim) color.Color {
	if p.opacity > 0 && p.opacity < 1 {
		return color.NRGBA{R: p.fill.R, G: p.fill.G, B: p.fill.B, A: uint8(math.Round(255 * p.opacity))}
	}
	return p.fill
}

// faces holds the fonts of one rendering (no package-level state).
type faces struct{ regular, bold *opentype.Font }

func loadFaces() (faces, error) {
	r, err := opentype.Parse(liberationsansregular.TTF)
	if err != nil {
		return faces{}, err
	}
	b, err := opentype.Parse(liberationsansbold.TTF)
	if err != nil {
		return faces{}, err
	}
	return faces{r, b}, nil
}

func (f faces) face(bold bool, size vg.Length) font.Face {
	fn := font.Font{Typeface: "Liberation", Variant: "Sans", Size: size}
	tt := f.regular
	if bold {
		tt = f.bold
	}
	return font.Face{Font: fn, Face: tt}
}
