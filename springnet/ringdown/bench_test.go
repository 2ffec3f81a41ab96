package ringdown

import (
	"fmt"
	"math/rand/v2"
	"strings"
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

// BenchmarkRead1M reads a one-million-line CSV file (time and three axes,
// 42 MB).
func BenchmarkRead1M(b *testing.B) {
	var sb strings.Builder
	sb.WriteString("time,ax,ay,az\n")
	for i := range 1_000_000 {
		fmt.Fprintf(&sb, "%.6f,%.5f,%.5f,%.5f\n", float64(i)*5e-5, 0.01*float64(i%17), 9.81, -0.02*float64(i%13))
	}
	text := sb.String()
	b.SetBytes(int64(len(text)))
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Read(strings.NewReader(text), ReadOptions{Column: "az"}); err != nil {
			b.Fatal(err)
		}
	}
}
