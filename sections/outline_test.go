package sections

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// shoelace returns the signed area and first moments of a polygon
// (Green's theorem; positive when counter-clockwise).
func shoelace(l Loop) (a, sy, sz float64) {
	for i := range l {
		p, q := l[i], l[(i+1)%len(l)]
		c := p[0]*q[1] - q[0]*p[1]
		a += c / 2
		sy += (p[0] + q[0]) * c / 6
		sz += (p[1] + q[1]) * c / 6
	}
	return a, sy, sz
}

func TestOutlinesMatchProperties(t *testing.T) {
	// The drawing outline, by the shoelace formula, encloses the section's
	// area with its centroid at the origin: outer loop counter-clockwise
	// (positive), holes clockwise (negative). Arcs are drawn as chords, 6
	// per quarter circle, which loses up to 1.1 % of a circle's area
	// (1 − sin θ/θ with θ = 15°); curved shapes get that tolerance.
	const chords = 0.012
	for _, k := range List() {
		if k.Name == "general" {
			continue // no geometry, no outline
		}
		t.Run(k.Name, func(t *testing.T) {
			s, err := Parse(k.Example)
			require.NoError(t, err)
			p := props(t, s)
			require.NotEmpty(t, p.Outline)
			var a, sy, sz float64
			for i, l := range p.Outline {
				la, ly, lz := shoelace(l)
				if i == 0 {
					assert.Positive(t, la, "outer loop counter-clockwise")
				} else {
					assert.Negative(t, la, "hole %d clockwise", i)
				}
				a, sy, sz = a+la, sy+ly, sz+lz
			}
			relClose(t, "area", p.A, a, chords)
			size := math.Sqrt(p.A)
			assert.InDelta(t, 0, sy/a, chords*size, "centroid y")
			assert.InDelta(t, 0, sz/a, chords*size, "centroid z")
		})
	}
}
