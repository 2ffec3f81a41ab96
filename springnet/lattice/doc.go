// Package lattice generates the benchmark space truss used to time and
// check the sparse solver: an nx×ny×nz grid of cubic cells with spacing
// h whose nodes are joined by pin-ended steel bars along every cell edge,
// both diagonals of every face and the four body diagonals of every cell,
// fixed at all nodes of the bottom layer (k = 0).
//
// The generator follows the bit-exact definition in the project's
// perf/README.md ("Lattice definition (bit-exact)"): every number is a
// float64 computed in the stated order, each operation rounded on its own
// (no fused multiply-add), so K, the lumped mass and the load agree bit
// for bit with any other faithful implementation; the tests check the
// SHA-256 digests of the definition's table.
//
// # Units and axes
//
// SI: K in N/m, mass in kg, load in N, coordinates in m. Grid point
// (i, j, k) sits at (i·h, j·h, k·h) with z up. Free node f = i +
// (nx+1)·(j + (ny+1)·(k−1)) for k ≥ 1 carries DOF 3f (x), 3f+1 (y) and
// 3f+2 (z); the load is −1 N in z at every node of the top layer.
//
// # Errors
//
// New returns an error starting with "lattice:" for a size below 1 or a
// parameter that is not positive and finite; WriteFiles for a file that
// cannot be written (and removes the partial file).
package lattice
