package lattice

import (
	"crypto/sha256"
	"encoding/binary"
	"encoding/hex"
	"math"
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet/sparse"
)

func digestK(l *Lattice) string {
	h := sha256.New()
	var rec [24]byte
	for j := 0; j < l.K.N(); j++ {
		rows, vals := l.K.Col(j)
		for p, i := range rows {
			binary.LittleEndian.PutUint64(rec[0:], uint64(i+1))
			binary.LittleEndian.PutUint64(rec[8:], uint64(j+1))
			binary.LittleEndian.PutUint64(rec[16:], math.Float64bits(vals[p]))
			h.Write(rec[:])
		}
	}
	return hex.EncodeToString(h.Sum(nil))
}

func digestVec(x []float64) string {
	h := sha256.New()
	var rec [8]byte
	for _, v := range x {
		binary.LittleEndian.PutUint64(rec[:], math.Float64bits(v))
		h.Write(rec[:])
	}
	return hex.EncodeToString(h.Sum(nil))
}

// TestDigests checks the generated K, mass and load bit for bit against the
// SHA-256 check values of the lattice definition's table
// (../shared/perf/README.md, "Lattice definition (bit-exact)"), which were
// produced by the reference generator gen_lattice.py.
func TestDigests(t *testing.T) {
	for _, tc := range []struct {
		nx, ny, nz int
		n, nnz     int
		k, m, b    string
	}{
		{2, 2, 2, 54, 411,
			"3f4a12d59f7f9a17ffb410fecaac92f1aefbfdf4a65c242c32dd1b0c29059c71",
			"667c1dab2c919e72eb61c58c729aff30d2b605d627efae1a41efd3389137790c",
			"fe83c550681bb24054abd6644665662679dff35de0bd64985252b04fcf28a963"},
		{4, 3, 5, 300, 3773,
			"a88294f5df96f482c0116e9021fd2146e51e96fc0c0452892fae041a7ea133c6",
			"4180b265ebea4cdb04620bdf86ae23e3634f9323f65d6bb7f9a900caf5cdc3bf",
			"85d6f97c95ab8535a3433e7726b3d2b955c5763a45b6804c2b878770ea7b1dbb"},
		{10, 10, 10, 3630, 63243,
			"523505b236007b3dfaa0f22869e5884331db9e5e90ca13640efa18d3b88f000c",
			"c1965bb884200d1e606974c87d0721040fd4553a7e513e6bd9be74ebe42175cb",
			"2fa27b79c8aaea4d260fcdd7076e6d72128f628136ce82d897a7dd909ac88d71"},
	} {
		t.Run("", func(t *testing.T) {
			l, err := New(tc.nx, tc.ny, tc.nz, nil)
			require.NoError(t, err)
			assert.Equal(t, tc.n, l.N())
			assert.Equal(t, tc.nnz, l.K.NNZ())
			assert.Equal(t, tc.k, digestK(l), "sha256_K")
			assert.Equal(t, tc.m, digestVec(l.Mass), "sha256_M")
			assert.Equal(t, tc.b, digestVec(l.Load), "sha256_b")
		})
	}
}

// TestWriteFilesDigests writes the 4×3×5 lattice, parses the files back
// and checks the parsed values against the definition's digests (the
// README's bit-identity is of the parsed values).
func TestWriteFilesDigests(t *testing.T) {
	l, err := New(4, 3, 5, nil)
	require.NoError(t, err)
	prefix := filepath.Join(t.TempDir(), "lat")
	require.NoError(t, l.WriteFiles(prefix))
	read := func(name string) *os.File {
		f, err := os.Open(name)
		require.NoError(t, err)
		t.Cleanup(func() { f.Close() })
		return f
	}
	k, err := sparse.ReadMatrix(read(prefix + ".mtx"))
	require.NoError(t, err)
	m, err := sparse.ReadVector(read(prefix + "_mass.mtx"))
	require.NoError(t, err)
	b, err := sparse.ReadVector(read(prefix + "_load.mtx"))
	require.NoError(t, err)
	back := &Lattice{K: k, Mass: m, Load: b}
	// Digests from ../shared/perf/README.md, row 4×3×5.
	assert.Equal(t, "a88294f5df96f482c0116e9021fd2146e51e96fc0c0452892fae041a7ea133c6", digestK(back))
	assert.Equal(t, "4180b265ebea4cdb04620bdf86ae23e3634f9323f65d6bb7f9a900caf5cdc3bf", digestVec(back.Mass))
	assert.Equal(t, "85d6f97c95ab8535a3433e7726b3d2b955c5763a45b6804c2b878770ea7b1dbb", digestVec(back.Load))
}

// TestNewRejectsBadInput checks the errors for sizes and parameters.
func TestNewRejectsBadInput(t *testing.T) {
	for _, tc := range []struct {
		name       string
		nx, ny, nz int
		p          *Params
		want       string
	}{
		{"zero size", 0, 2, 2, nil, "lattice: size 0×2×2"},
		{"negative E", 2, 2, 2, &Params{E: -1}, "lattice: parameter E = -1"},
		{"NaN h", 2, 2, 2, &Params{H: math.NaN()}, "lattice: parameter H = NaN"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := New(tc.nx, tc.ny, tc.nz, tc.p)
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.want)
		})
	}
}
