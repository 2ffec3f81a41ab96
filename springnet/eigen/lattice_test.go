package eigen_test

import (
	"crypto/sha256"
	"encoding/binary"
	"encoding/hex"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/springnet/eigen"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// benchLattice builds the benchmark space-truss lattice exactly as defined
// in ../shared/perf/README.md ("Lattice definition (bit-exact)"): K (lower
// triangle), the lumped mass diagonal M, and the coordinates of each free
// DOF. It stands in for the springnet/lattice package until that exists.
func benchLattice(nx, ny, nz int) (k, m *sparse.Matrix, coords [][3]float64, lower [][3]float64) {
	const h, E, A, rho = 0.1, 200e9, 1e-4, 7850.0
	var L, kk, g, mh [4]float64
	for c := 1; c <= 3; c++ {
		L[c] = h * math.Sqrt(float64(c))
		kk[c] = (E * A) / L[c]
		g[c] = kk[c] / float64(c)
		mh[c] = 0.5 * ((rho * A) * L[c])
	}
	free := func(i, j, l int) int { return i + (nx+1)*(j+(ny+1)*(l-1)) }
	nfree := (nx + 1) * (ny + 1) * nz
	n := 3 * nfree
	// Entries keyed by (row >= col); off-diagonal blocks are never summed.
	type entry struct{ r, c int }
	vals := map[entry]float64{}
	massv := make([]float64, n)
	coords = make([][3]float64, n)
	for l := 1; l <= nz; l++ {
		for j := 0; j <= ny; j++ {
			for i := 0; i <= nx; i++ {
				p := free(i, j, l)
				var S [4][3][3]float64
				var Nc [4]float64
				for dk := -1; dk <= 1; dk++ {
					for dj := -1; dj <= 1; dj++ {
						for di := -1; di <= 1; di++ {
							if di == 0 && dj == 0 && dk == 0 {
								continue
							}
							i2, j2, l2 := i+di, j+dj, l+dk
							if i2 < 0 || i2 > nx || j2 < 0 || j2 > ny || l2 < 0 || l2 > nz {
								continue
							}
							s := [3]int{di, dj, dk}
							c := di*di + dj*dj + dk*dk
							Nc[c]++
							for a := 0; a < 3; a++ {
								for b := 0; b < 3; b++ {
									S[c][a][b] += float64(s[a] * s[b])
								}
							}
							if l2 == 0 {
								continue // fixed neighbour: no off-diagonal block
							}
							q := free(i2, j2, l2)
							if q <= p {
								continue // lower triangle: row block q > p
							}
							for a := 0; a < 3; a++ {
								for b := 0; b < 3; b++ {
									switch s[a] * s[b] {
									case 1:
										vals[entry{3*q + a, 3*p + b}] = -g[c]
									case -1:
										vals[entry{3*q + a, 3*p + b}] = g[c]
									}
								}
							}
						}
					}
				}
				for a := 0; a < 3; a++ {
					for b := 0; b <= a; b++ {
						v := ((g[1] * S[1][a][b]) + (g[2] * S[2][a][b])) + (g[3] * S[3][a][b])
						if v != 0 {
							vals[entry{3*p + a, 3*p + b}] = v
						}
					}
					massv[3*p+a] = ((mh[1] * Nc[1]) + (mh[2] * Nc[2])) + (mh[3] * Nc[3])
					coords[3*p+a] = [3]float64{float64(i) * h, float64(j) * h, float64(l) * h}
				}
			}
		}
	}
	bk := sparse.NewBuilder(n)
	for e, v := range vals {
		bk.Add(e.r, e.c, v)
	}
	bm := sparse.NewBuilder(n)
	for i, v := range massv {
		bm.Add(i, i, v)
	}
	return bk.Matrix(), bm.Matrix(), coords, nil
}

// latticeDigests computes the check digests of ../shared/perf/README.md.
func latticeDigests(k, m *sparse.Matrix) (dk, dm string) {
	hk := sha256.New()
	var buf [8]byte
	for j := 0; j < k.N(); j++ {
		rows, vals := k.Col(j)
		for p, i := range rows {
			binary.LittleEndian.PutUint64(buf[:], uint64(i+1))
			hk.Write(buf[:])
			binary.LittleEndian.PutUint64(buf[:], uint64(j+1))
			hk.Write(buf[:])
			binary.LittleEndian.PutUint64(buf[:], math.Float64bits(vals[p]))
			hk.Write(buf[:])
		}
	}
	hm := sha256.New()
	for i := 0; i < m.N(); i++ {
		binary.LittleEndian.PutUint64(buf[:], math.Float64bits(m.At(i, i)))
		hm.Write(buf[:])
	}
	return hex.EncodeToString(hk.Sum(nil)), hex.EncodeToString(hm.Sum(nil))
}

// TestBenchLatticeDigests checks the test's lattice generator against the
// SHA-256 digests published in ../shared/perf/README.md.
func TestBenchLatticeDigests(t *testing.T) {
	cases := []struct {
		name       string
		nx, ny, nz int
		n, nnz     int
		dk, dm     string
	}{
		// Values from the "Check values" table of ../shared/perf/README.md.
		{"2x2x2", 2, 2, 2, 54, 411, "3f4a12d59f7f9a17ffb410fecaac92f1aefbfdf4a65c242c32dd1b0c29059c71", "667c1dab2c919e72eb61c58c729aff30d2b605d627efae1a41efd3389137790c"},
		{"4x3x5", 4, 3, 5, 300, 3773, "a88294f5df96f482c0116e9021fd2146e51e96fc0c0452892fae041a7ea133c6", "4180b265ebea4cdb04620bdf86ae23e3634f9323f65d6bb7f9a900caf5cdc3bf"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			k, m, _, _ := benchLattice(c.nx, c.ny, c.nz)
			require.Equal(t, c.n, k.N())
			assert.Equal(t, c.nnz, k.NNZ())
			dk, dm := latticeDigests(k, m)
			assert.Equal(t, c.dk, dk)
			assert.Equal(t, c.dm, dm)
		})
	}
}

// TestLattice10Frequencies checks the three lowest natural frequencies of
// the 10×10×10 benchmark lattice.
func TestLattice10Frequencies(t *testing.T) {
	if testing.Short() {
		t.Skip("lattice 10×10×10 skipped in -short mode")
	}
	k, m, coords, _ := benchLattice(10, 10, 10)
	res, err := eigen.Lowest(k, m, 3, &eigen.Settings{Coords: coords})
	require.NoError(t, err)
	require.Equal(t, 3, res.Len())
	// ../shared/perf/anchors.md, "Lowest natural frequencies (eigsh, Hz)",
	// row 10,10,10: 220.6201, 220.6201, 338.0411 (SciPy eigsh, ARPACK),
	// printed to 4 decimals, hence the tolerance of half a unit in the
	// last place (plus round-off).
	want := []float64{220.6201, 220.6201, 338.0411}
	const printedHalfULP = 0.5e-4 + 1e-9
	for i, f := range want {
		assert.InDelta(t, f, res.Frequency(i), printedHalfULP, "mode %d", i)
	}
	assert.True(t, res.Checked)
	assert.Equal(t, 3, res.SturmCount)
}
