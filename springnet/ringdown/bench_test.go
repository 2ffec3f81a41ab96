package ringdown

import (
	"math/rand/v2"
	"testing"
	"time"
)

// BenchmarkReduce1M reduces a one-million-sample record: 50 s at 20 kHz of
// a 35 Hz mode with ζ = 0.005 at 30 dB SNR, most of it noise floor. Besides
// wall time it reports the process CPU time per reduction (cpu-ms/op),
// which does not depend on how busy the machine is.
func BenchmarkReduce1M(b *testing.B) {
	s := synth{Rate: 20000, Duration: 50, Strike: 0.5, Modes: []mode{{F: 35, Zeta: 0.005, A: 3, Phi: 0.4}}, SNR: 30}
	rec := s.record(rand.New(rand.NewPCG(1, 1)))
	if rec.Len() != 1_000_000 {
		b.Fatalf("record has %d samples", rec.Len())
	}
	b.ReportAllocs()
	cpu0 := cpuTime()
	for b.Loop() {
		if _, err := Reduce(rec, nil); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(cpuTime()-cpu0)/float64(time.Millisecond)/float64(b.N), "cpu-ms/op")
}
