package sparse

import (
	"bytes"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestMTXRoundTrip writes and reads back a random matrix and vector with
// awkward values; the format promises exact float64 round trips
// (shortest 'g' formatting, strconv.ParseFloat).
func TestMTXRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	a, _ := randomSym(rng, 60, 5, 1)
	a.val[0] = 1e-300
	a.val[1] = -math.MaxFloat64
	a.val[2] = math.SmallestNonzeroFloat64
	var buf bytes.Buffer
	require.NoError(t, WriteMatrix(&buf, a, "test matrix", "second line"))
	text := buf.String()
	assert.True(t, strings.HasPrefix(text, "%%MatrixMarket matrix coordinate real symmetric\n% test matrix\n% second line\n60 60 "))
	b, err := ReadMatrix(strings.NewReader(text))
	require.NoError(t, err)
	assert.Equal(t, a.colPtr, b.colPtr)
	assert.Equal(t, a.rowIdx, b.rowIdx)
	assert.Equal(t, a.val, b.val)

	x := []float64{0.1, -2.5e-17, 3, math.Pi, 0}
	buf.Reset()
	require.NoError(t, WriteVector(&buf, x))
	assert.Equal(t, "%%MatrixMarket matrix array real general\n5 1\n0.1\n-2.5e-17\n3\n3.141592653589793\n0\n", buf.String())
	y, err := ReadVector(&buf)
	require.NoError(t, err)
	assert.Equal(t, x, y)
}

// TestMTXErrors checks that bad files give errors naming the line.
func TestMTXErrors(t *testing.T) {
	const hdr = "%%MatrixMarket matrix coordinate real symmetric\n"
	for _, tc := range []struct{ name, in, want string }{
		{"empty", "", "empty input"},
		{"banner", "hello\n", "line 1: not a Matrix Market header"},
		{"general", "%%MatrixMarket matrix coordinate real general\n", "line 1: symmetry"},
		{"complex", "%%MatrixMarket matrix coordinate complex symmetric\n", "line 1: field"},
		{"no size", hdr + "% c\n", "line 2: missing size line"},
		{"bad size", hdr + "3 3\n", "line 2: size line"},
		{"not square", hdr + "3 4 1\n", "line 2: a symmetric matrix must be square"},
		{"negative", hdr + "-3 -3 1\n", "line 2: rows"},
		{"too many", hdr + "2 2 4\n", "line 2: entry count 4 exceeds"},
		{"index", hdr + "2 2 1\n3 1 1.0\n", "line 3: entry index (3, 1) outside 1..2"},
		{"zero index", hdr + "2 2 1\n0 1 1.0\n", "line 3: entry index"},
		{"value", hdr + "2 2 1\n1 1 abc\n", "line 3: value \"abc\" is not a number"},
		{"nan", hdr + "2 2 1\n1 1 NaN\n", "line 3: value \"NaN\" is not finite"},
		{"short", hdr + "2 2 2\n1 1 1\n", "file ends after 1 of 2 entries"},
		{"fields", hdr + "2 2 1\n1 1\n", "line 3: entry"},
		{"extra", hdr + "2 2 1\n1 1 1\n2 2 2\n", "line 4: unexpected data"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := ReadMatrix(strings.NewReader(tc.in))
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
			assert.True(t, strings.HasPrefix(err.Error(), "sparse: "))
		})
	}
	const vh = "%%MatrixMarket matrix array real general\n"
	for _, tc := range []struct{ name, in, want string }{
		{"coordinate", "%%MatrixMarket matrix coordinate real general\n", "line 1: format"},
		{"columns", vh + "3 2\n", "line 2: 2 columns"},
		{"short", vh + "3 1\n1\n2\n", "file ends after 2 of 3 values"},
		{"two values", vh + "2 1\n1 2\n", "line 3: want one value per line"},
		{"inf", vh + "1 1\n+Inf\n", "line 3: value \"+Inf\" is not finite"},
	} {
		t.Run("vector/"+tc.name, func(t *testing.T) {
			_, err := ReadVector(strings.NewReader(tc.in))
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
		})
	}
}

// FuzzReadMatrix checks that the reader never panics and that whatever it
// accepts survives a write/read round trip unchanged. Seeds are in
// testdata/fuzz/FuzzReadMatrix.
func FuzzReadMatrix(f *testing.F) {
	f.Add([]byte("%%MatrixMarket matrix coordinate real symmetric\n3 3 4\n1 1 2\n2 1 -1\n2 2 2\n3 3 1e-3\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		a, err := ReadMatrix(bytes.NewReader(data))
		if err != nil {
			if !strings.HasPrefix(err.Error(), "sparse: ") {
				t.Fatalf("error without package prefix: %v", err)
			}
			return
		}
		var buf bytes.Buffer
		if err := WriteMatrix(&buf, a); err != nil {
			t.Fatal(err)
		}
		b, err := ReadMatrix(&buf)
		if err != nil {
			t.Fatalf("re-read: %v", err)
		}
		if !slicesEqualF(a.val, b.val) || len(a.rowIdx) != len(b.rowIdx) {
			t.Fatal("round trip changed the matrix")
		}
	})
}

// FuzzReadVector is FuzzReadMatrix for vectors.
func FuzzReadVector(f *testing.F) {
	f.Add([]byte("%%MatrixMarket matrix array real general\n2 1\n0.5\n-1\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		x, err := ReadVector(bytes.NewReader(data))
		if err != nil {
			return
		}
		var buf bytes.Buffer
		if err := WriteVector(&buf, x); err != nil {
			t.Fatal(err)
		}
		y, err := ReadVector(&buf)
		if err != nil || !slicesEqualF(x, y) {
			t.Fatalf("round trip: %v", err)
		}
	})
}

func slicesEqualF(a, b []float64) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if math.Float64bits(a[i]) != math.Float64bits(b[i]) {
			return false
		}
	}
	return true
}
