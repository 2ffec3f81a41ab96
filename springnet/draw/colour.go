package draw

import (
	"image/color"
	"math"
)

// colourStops is trestle's colour scale, from 0 to 1 of Colours.Max:
// blue, teal, green, amber, orange, red. It rises in lightness to the
// middle and turns warm as a member nears its limit, so that "how close
// to the limit" reads without the legend.
var colourStops = [...]struct {
	at float64
	c  color.RGBA
}{
	{0.00, color.RGBA{49, 104, 178, 255}},
	{0.30, color.RGBA{38, 166, 154, 255}},
	{0.55, color.RGBA{140, 190, 60, 255}},
	{0.75, color.RGBA{240, 180, 30, 255}},
	{0.90, color.RGBA{232, 100, 35, 255}},
	{1.00, color.RGBA{200, 30, 45, 255}},
}

// Fixed colours of the drawing.
var (
	overColour    = color.RGBA{120, 30, 140, 255}  // above the top of the scale
	unratedColour = color.RGBA{120, 120, 120, 255} // no value
	plainColour   = color.RGBA{40, 60, 90, 255}    // no colour scale
	ghostColour   = color.RGBA{190, 190, 190, 255} // the unloaded outline
	inkColour     = color.RGBA{30, 30, 30, 255}    // text, symbols
	frameColour   = color.RGBA{200, 200, 200, 255} // panel frames
	floorColour   = color.RGBA{140, 110, 80, 255}  // floor and ground
	mountColour   = color.RGBA{20, 90, 200, 255}   // mounts
	white         = color.RGBA{255, 255, 255, 255}
	groupColour   = color.RGBA{90, 90, 110, 255}   // rigid group outline
	groupFill     = color.RGBA{200, 204, 220, 255} // rigid group shading, drawn at groupOpacity
)

// groupOpacity lets members behind a rigid group show through it.
const groupOpacity = 0.7

// Colour returns the colour of value v on a scale whose red end is max
// (max <= 0 means 1): v <= 0 is blue, v = max red, above max purple.
func Colour(v, max float64) color.RGBA {
	if !(max > 0) {
		max = 1
	}
	t := v / max
	switch {
	case math.IsNaN(t):
		return unratedColour
	case t > 1+1e-12:
		return overColour
	case t <= 0:
		return colourStops[0].c
	}
	for i := 1; i < len(colourStops); i++ {
		a, b := colourStops[i-1], colourStops[i]
		if t <= b.at {
			f := (t - a.at) / (b.at - a.at)
			mix := func(x, y uint8) uint8 { return uint8(math.Round(float64(x) + f*(float64(y)-float64(x)))) }
			return color.RGBA{mix(a.c.R, b.c.R), mix(a.c.G, b.c.G), mix(a.c.B, b.c.B), 255}
		}
	}
	return colourStops[len(colourStops)-1].c
}
