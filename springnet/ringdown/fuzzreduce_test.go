package ringdown

import (
	"encoding/binary"
	"math"
	"testing"
)

// FuzzReduce feeds arbitrary samples (16-bit integers, as a logger's ADC
// gives them) and settings to Reduce: it must not panic, and a Result it
// returns must hold only finite numbers. The seed corpus is in
// testdata/fuzz/FuzzReduce.
func FuzzReduce(f *testing.F) {
	seed := make([]byte, 2*400)
	for i := range 400 {
		v := 2000 * math.Exp(-0.01*float64(i)) * math.Sin(0.5*float64(i))
		binary.LittleEndian.PutUint16(seed[2*i:], uint16(int16(v)))
	}
	f.Add(seed, 0.0, 0.0)
	f.Add(seed, 30.0, 0.3)
	f.Fuzz(func(t *testing.T, data []byte, centre, width float64) {
		n := len(data) / 2
		if n > 20000 {
			n = 20000
		}
		x := make([]float64, n)
		for i := range x {
			x[i] = float64(int16(binary.LittleEndian.Uint16(data[2*i:])))
		}
		res, err := Reduce(Record{Rate: 1000, Samples: x}, &Settings{Centre: centre, Width: width})
		if err != nil {
			return
		}
		assertFinite(t, res)
	})
}
