package sections

import "testing"

func BenchmarkParse(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Parse("rect-tube 100x50x4 mm r=8 en10219"); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkRectTubeProperties(b *testing.B) {
	b.ReportAllocs()
	s := RectTube{H: 0.1, B: 0.05, T: 0.004, Conv: EN10219}
	for b.Loop() {
		if _, err := s.Properties(); err != nil {
			b.Fatal(err)
		}
	}
}
