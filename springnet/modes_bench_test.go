package springnet_test

import (
	"fmt"
	"testing"

	"github.com/trestle-go/trestle/sections"
	"github.com/trestle-go/trestle/springnet"
)

// gridFrame is a space frame of n×n columns 0.8 m high joined at the top
// by a grid of beams, clamped at the floor: 6n² free DOF (demo data).
func gridFrame(n int) *springnet.Model {
	var m springnet.Model
	sec := sections.RoundTube{D: 0.0603, T: 0.004}
	top := make([][]springnet.NodeID, n)
	for i := 0; i < n; i++ {
		top[i] = make([]springnet.NodeID, n)
		for j := 0; j < n; j++ {
			b := m.AddNode(fmt.Sprintf("b%d.%d", i, j), springnet.Vec{X: 0.5 * float64(i), Y: 0.5 * float64(j)})
			m.Fix(b, springnet.AllDOF)
			t := m.AddNode(fmt.Sprintf("t%d.%d", i, j), springnet.Vec{X: 0.5 * float64(i), Y: 0.5 * float64(j), Z: 0.8})
			m.AddBeam(b, t, springnet.Beam{Material: modeSteel(), Section: sec})
			top[i][j] = t
			if i > 0 {
				m.AddBeam(top[i-1][j], t, springnet.Beam{Material: modeSteel(), Section: sec})
			}
			if j > 0 {
				m.AddBeam(top[i][j-1], t, springnet.Beam{Material: modeSteel(), Section: sec})
			}
		}
	}
	return &m
}

// BenchmarkModes: the 20 lowest modes of grid frames, sparse path.
func BenchmarkModes(b *testing.B) {
	for _, n := range []int{10, 20} {
		m := gridFrame(n)
		b.Run(fmt.Sprintf("grid %dx%d", n, n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := springnet.Modes(m, &springnet.ModeSettings{Count: 20, Method: springnet.SparseMethod}); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
