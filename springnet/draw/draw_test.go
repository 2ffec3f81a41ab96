package draw_test

import (
	"bytes"
	"encoding/xml"
	"image/color"
	"image/png"
	"io"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/draw"
)

// frameScene is a portal frame on two feet with a brace and a spring:
// four nodes, three members, one mount.
func frameScene() draw.Scene {
	return draw.Scene{
		Title: "portal <test> & co",
		Nodes: []draw.Node{
			{Name: "A", At: draw.Point{}, Foot: true, Label: true},
			{Name: "B", At: draw.Point{X: 1}, Support: true, Label: true},
			{Name: "C", At: draw.Point{Z: 1}, Move: draw.Point{X: 1e-3}},
			{Name: "D", At: draw.Point{X: 1, Z: 1}, Move: draw.Point{X: 1e-3, Z: -2e-4}},
		},
		Members: []draw.Member{
			{Name: "left", A: 0, B: 2, Value: 0.2, Rated: true},
			{Name: "right", A: 1, B: 3, Value: 1.4, Rated: true},
			{Name: "top", A: 2, B: 3, Style: draw.Bar},
			{Name: "pad", A: 0, B: 3, Style: draw.Spring, Value: 0.5, Rated: true},
		},
		Mounts:  []draw.Mount{{Name: "M1", At: draw.Point{X: 0.5, Z: 1}, Move: draw.Point{X: 1e-3}}},
		Groups:  []draw.Group{{Name: "beam", Nodes: []int{2, 3}}},
		Colours: draw.Colours{Name: "utilisation", Max: 1, Percent: true},
		Shape:   "deflection under \"push\"",
		Notes:   []string{"a note"},
	}
}

// svgElement is what the well-formedness test collects.
type svgElement struct {
	name  string
	class string
	id    string
	data  string
}

// parseSVG decodes the whole document with encoding/xml (failing on
// malformed XML) and returns its elements.
func parseSVG(t *testing.T, b []byte) []svgElement {
	t.Helper()
	dec := xml.NewDecoder(bytes.NewReader(b))
	var els []svgElement
	depth := 0
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		require.NoError(t, err, "SVG must be well-formed XML")
		switch x := tok.(type) {
		case xml.StartElement:
			depth++
			e := svgElement{name: x.Name.Local}
			for _, a := range x.Attr {
				switch a.Name.Local {
				case "class":
					e.class = a.Value
				case "id":
					e.id = a.Value
				case "data-member":
					e.data = a.Value
				}
			}
			els = append(els, e)
		case xml.EndElement:
			depth--
		}
	}
	require.Equal(t, 0, depth, "every element is closed")
	require.NotEmpty(t, els)
	require.Equal(t, "svg", els[0].name, "root element")
	return els
}

func TestSVGDrawsEveryMemberInEveryView(t *testing.T) {
	tests := []struct {
		name  string
		scene func() draw.Scene
	}{
		{"portal with shape", frameScene},
		{"no shape, no colours", func() draw.Scene {
			s := frameScene()
			s.Shape, s.Colours = "", draw.Colours{}
			return s
		}},
		{"single node", func() draw.Scene { return draw.Scene{Nodes: []draw.Node{{Name: "only"}}} }},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s := tc.scene()
			var buf bytes.Buffer
			require.NoError(t, s.SVG(&buf))
			els := parseSVG(t, buf.Bytes())
			perMember := map[string]int{}
			ids := map[string]bool{}
			for _, e := range els {
				if e.id != "" {
					assert.False(t, ids[e.id], "id %q is unique", e.id)
					ids[e.id] = true
				}
				if e.class == "member" {
					assert.Equal(t, "line", e.name)
					perMember[e.data]++
				}
			}
			// Four views: front, side, top, isometric.
			require.Len(t, perMember, len(s.Members))
			for _, m := range s.Members {
				assert.Equal(t, 4, perMember[m.Name], "member %q drawn once per view", m.Name)
			}
		})
	}
}

func TestSVGMarksFeetSupportsMounts(t *testing.T) {
	s := frameScene()
	var buf bytes.Buffer
	require.NoError(t, s.SVG(&buf))
	count := map[string]int{}
	for _, e := range parseSVG(t, buf.Bytes()) {
		count[e.class]++
	}
	assert.Equal(t, 4, count["foot"], "one foot × four views")
	assert.Equal(t, 4, count["support"], "one support × four views")
	assert.Equal(t, 4, count["mount"], "one mount × four views")
	assert.Equal(t, 4, count["group"], "one rigid group × four views")
	assert.Equal(t, 4*len(s.Members), count["ghost"], "the unloaded outline is drawn under a shape")
	txt := buf.String()
	assert.Contains(t, txt, "portal &lt;test&gt; &amp; co", "title is escaped")
	assert.Contains(t, txt, "right: utilisation 140 %", "member tooltip names the value")
	assert.Contains(t, txt, "(automatic", "legend states the scale")
	assert.Contains(t, txt, "drawn ×", "legend states the factor")
	assert.Contains(t, txt, "largest 1.02 mm", "legend states the largest motion: √(1² + 0.2²) mm")

	s.Sizeless = true
	buf.Reset()
	require.NoError(t, s.SVG(&buf))
	assert.NotContains(t, buf.String(), "largest", "a mode shape has no size to state")
}

func TestPNGDecodes(t *testing.T) {
	s := frameScene()
	var buf bytes.Buffer
	require.NoError(t, s.PNG(&buf))
	img, err := png.Decode(&buf)
	require.NoError(t, err)
	b := img.Bounds()
	assert.Equal(t, 1280, b.Dx()) // the size PNG's doc comment promises: 1280 × 900
	assert.Equal(t, 900, b.Dy())
	// Something other than the white background is drawn.
	nonWhite := 0
	for y := b.Min.Y; y < b.Max.Y; y += 4 {
		for x := b.Min.X; x < b.Max.X; x += 4 {
			if r, g, bl, _ := img.At(x, y).RGBA(); r != 0xffff || g != 0xffff || bl != 0xffff {
				nonWhite++
			}
		}
	}
	// 500 of the 320 × 225 = 72 000 sampled pixels (0.7 %): more than a
	// speck; a chosen threshold, not derived.
	assert.Greater(t, nonWhite, 500)
}

func TestAutoScale(t *testing.T) {
	s := frameScene()
	// Largest motion: node D, √(1e-3² + 2e-4²); stand size 1 m.
	want := draw.AutoFraction * 1 / math.Hypot(1e-3, 2e-4)
	assert.InEpsilon(t, want, s.AutoScale(), 1e-12) // one hypot and divide: round-off only
	still := draw.Scene{Nodes: []draw.Node{{At: draw.Point{X: 1}}}}
	assert.Zero(t, still.AutoScale(), "nothing moves: no scale")
}

func TestValidate(t *testing.T) {
	tests := []struct {
		name string
		edit func(*draw.Scene)
		want string
	}{
		{"member end out of range", func(s *draw.Scene) { s.Members[0].B = 9 }, `member 0 "left": end node out of range`},
		{"NaN position", func(s *draw.Scene) { s.Nodes[1].At.X = math.NaN() }, `node 1 "B"`},
		{"Inf value", func(s *draw.Scene) { s.Members[1].Value = math.Inf(1) }, `member 1 "right": value is not finite`},
		{"negative scale", func(s *draw.Scene) { s.Scale = -1 }, "scale -1"},
		{"group node out of range", func(s *draw.Scene) { s.Groups[0].Nodes[1] = -2 }, `group 0 "beam": node -2 out of range`},
		{"empty", func(s *draw.Scene) { *s = draw.Scene{} }, "no nodes"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s := frameScene()
			tc.edit(&s)
			err := s.Validate()
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
			assert.True(t, strings.HasPrefix(err.Error(), "draw: "))
			assert.Error(t, s.SVG(io.Discard), "SVG refuses an invalid scene")
			assert.Error(t, s.PNG(io.Discard), "PNG refuses an invalid scene")
		})
	}
}

func TestColourScale(t *testing.T) {
	// The scale's defined points (this package's own scale, doc comment).
	blue := color.RGBA{49, 104, 178, 255}
	red := color.RGBA{200, 30, 45, 255}
	assert.Equal(t, blue, draw.Colour(0, 1))
	assert.Equal(t, blue, draw.Colour(-0.3, 1), "below zero stays at the low end")
	assert.Equal(t, red, draw.Colour(1, 1))
	assert.Equal(t, red, draw.Colour(250, 250), "the red end follows max")
	assert.NotEqual(t, red, draw.Colour(1.01, 1), "above max is a different colour")
	assert.Equal(t, draw.Colour(0.5, 1), draw.Colour(0.5, 0), "max 0 means 1")
	// Warmer towards the limit: from green (0.55) to red (1) the green
	// channel only falls.
	prev := 256
	for v := 0.55; v <= 1.0; v += 0.05 {
		c := draw.Colour(v, 1)
		assert.LessOrEqual(t, int(c.G), prev, "green channel at %g", v)
		prev = int(c.G)
	}
}

func TestFromModel(t *testing.T) {
	var m springnet.Model
	a := m.AddNode("A", springnet.Vec{})
	b := m.AddNode("B", springnet.Vec{Z: 1})
	c := m.AddNode("C", springnet.Vec{X: 1, Z: 1})
	m.AddBar(a, b, springnet.Bar{Name: "post", EA: 1e8})
	sp := m.AddSpring(b, c, springnet.Spring{Axial: 1e6})
	m.AddFoot(a, springnet.Foot{K: springnet.Stiffness6{Z: 1e8}})
	m.Fix(c, springnet.AllDOF)
	d := m.AddNode("D", springnet.Vec{X: 1, Y: 1, Z: 1})
	m.AddRigidGroup("top", b, d)
	m.AddMount("seat", springnet.Vec{X: 0.5, Z: 1}, b)
	s := draw.FromModel(&m)
	require.Len(t, s.Nodes, 4)
	require.Len(t, s.Groups, 1)
	assert.Equal(t, draw.Group{Name: "top", Nodes: []int{1, 3}}, s.Groups[0])
	require.Len(t, s.Members, 2, "feet are node marks, not members")
	assert.Equal(t, "post", s.Members[0].Name)
	assert.Equal(t, draw.Bar, s.Members[0].Style)
	assert.Equal(t, draw.Spring, s.Members[1].Style)
	assert.Equal(t, m.ElementName(sp), s.Members[1].Name, "an unnamed element keeps the model's automatic name")
	assert.True(t, s.Nodes[0].Foot)
	assert.True(t, s.Nodes[2].Support)
	assert.False(t, s.Nodes[1].Foot || s.Nodes[1].Support)
	assert.False(t, s.Nodes[1].Label, "only feet and supports are labelled")
	require.Len(t, s.Mounts, 1)
	assert.Equal(t, draw.Point{X: 0.5, Z: 1}, s.Mounts[0].At)
}
