package ringdown

import (
	"math/rand/v2"
	"testing"
)

// BenchmarkReduce1M reduces a one-million-sample record: 50 s at 20 kHz of
// a 35 Hz mode with ζ = 0.005 at 30 dB SNR, most of it noise floor.
func BenchmarkReduce1M(b *testing.B) {
	s := synth{Rate: 20000, Duration: 50, Strike: 0.5, Modes: []mode{{F: 35, Zeta: 0.005, A: 3, Phi: 0.4}}, SNR: 30}
	rec := s.record(rand.New(rand.NewPCG(1, 1)))
	if rec.Len() != 1_000_000 {
		b.Fatalf("record has %d samples", rec.Len())
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Reduce(rec, nil); err != nil {
			b.Fatal(err)
		}
	}
}
