package ringdown

import (
	"bytes"
	"math"
	"testing"
)

// FuzzRead feeds arbitrary bytes to Read under a few option sets. Read must
// not panic, and a record it accepts must pass Check: at least MinSamples
// finite samples at a positive, finite rate. The seed corpus is in
// testdata/fuzz/FuzzRead.
func FuzzRead(f *testing.F) {
	f.Add([]byte("time,a\n0,1\n0.001,2\n"), uint8(0))
	f.Add([]byte("t;x\n0,0;1,5\n0,1;2,5\n"), uint8(1))
	f.Fuzz(func(t *testing.T, data []byte, mode uint8) {
		opts := []ReadOptions{
			{},
			{SampleRate: 100},
			{Magnitude: true},
			{Column: "2", TimeUnit: 1e-3},
			{Column: "x", Name: "fuzz.csv"},
		}
		opt := opts[int(mode)%len(opts)]
		rec, err := Read(bytes.NewReader(data), opt)
		if err != nil {
			if rec.Samples != nil {
				t.Fatalf("error %v with a non-empty record", err)
			}
			return
		}
		if err := rec.Check(); err != nil {
			t.Fatalf("accepted record fails Check: %v", err)
		}
		if math.IsNaN(rec.Start) || math.IsInf(rec.Start, 0) {
			t.Fatalf("start %g", rec.Start)
		}
	})
}
