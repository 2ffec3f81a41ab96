package draw_test

import (
	"io"
	"testing"

	"github.com/trestle-go/trestle/springnet/draw"
)

// gridScene is an n × n × levels space frame of unit bays: nodes on a
// grid, members along the three axes, every member rated.
func gridScene(n, levels int) draw.Scene {
	var s draw.Scene
	id := func(i, j, k int) int { return (k*n+j)*n + i }
	for k := 0; k < levels; k++ {
		for j := 0; j < n; j++ {
			for i := 0; i < n; i++ {
				s.Nodes = append(s.Nodes, draw.Node{At: draw.Point{X: float64(i), Y: float64(j), Z: float64(k)},
					Move: draw.Point{X: 1e-4 * float64(k)}, Foot: k == 0})
			}
		}
	}
	add := func(a, b int) {
		s.Members = append(s.Members, draw.Member{A: a, B: b, Value: float64(len(s.Members)%10) / 10, Rated: true})
	}
	for k := 0; k < levels; k++ {
		for j := 0; j < n; j++ {
			for i := 0; i < n; i++ {
				if i+1 < n {
					add(id(i, j, k), id(i+1, j, k))
				}
				if j+1 < n {
					add(id(i, j, k), id(i, j+1, k))
				}
				if k+1 < levels {
					add(id(i, j, k), id(i, j, k+1))
				}
			}
		}
	}
	s.Colours = draw.Colours{Name: "utilisation", Max: 1}
	s.Shape = "sway"
	return s
}

func BenchmarkSVG(b *testing.B) {
	s := gridScene(10, 4) // 400 nodes, 1 080 members
	b.ReportAllocs()
	for b.Loop() {
		if err := s.SVG(io.Discard); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkPNG(b *testing.B) {
	s := gridScene(10, 4)
	b.ReportAllocs()
	for b.Loop() {
		if err := s.PNG(io.Discard); err != nil {
			b.Fatal(err)
		}
	}
}
