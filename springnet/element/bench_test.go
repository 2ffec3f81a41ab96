package element_test

import (
	"testing"

	"github.com/trestle-go/trestle/springnet/element"
)

var sinkMat12 element.Mat12

func benchFrame(b *testing.B) element.Frame {
	f, err := element.NewFrame(element.Vec3{0.3, -0.2, 0.1}, element.Vec3{1.1, 0.5, 0.9}, element.Vec3{}, 0.4)
	if err != nil {
		b.Fatal(err)
	}
	return f
}

func BenchmarkBeamStiffness(b *testing.B) {
	f := benchFrame(b)
	b.ReportAllocs()
	for b.Loop() {
		sinkMat12 = element.BeamStiffness(f, demo)
	}
}

func BenchmarkBeamStiffnessReleased(b *testing.B) {
	f := benchFrame(b)
	p := withJoints(demo, element.ReleasePin, element.ReleaseRX, element.Vec3{0, 0, 0}, element.Vec3{0, 1e5, 1e5})
	b.ReportAllocs()
	for b.Loop() {
		sinkMat12 = element.BeamStiffness(f, p)
	}
}

func BenchmarkBeamGeometricStiffness(b *testing.B) {
	f := benchFrame(b)
	b.ReportAllocs()
	for b.Loop() {
		sinkMat12 = element.BeamGeometricStiffness(f, demo, -1e4)
	}
}

func BenchmarkBeamConsistentMass(b *testing.B) {
	f := benchFrame(b)
	b.ReportAllocs()
	for b.Loop() {
		sinkMat12 = element.BeamConsistentMass(f, demo, 10, 0.01)
	}
}

func BenchmarkBeamEndForces(b *testing.B) {
	f := benchFrame(b)
	p := withJoints(demo, element.ReleasePin, 0, element.Vec3{}, element.Vec3{0, 1e5, 1e5})
	ua := element.Vec6{1e-3, 2e-3, 3e-3, 1e-3, 2e-3, 3e-3}
	var sink element.BeamForces
	b.ReportAllocs()
	for b.Loop() {
		sink = element.BeamEndForces(f, p, ua, element.Vec6{})
	}
	_ = sink
}
