package sparse

import (
	"fmt"
	"math"
	"slices"
	"sort"
)

// Matrix is a symmetric n×n sparse matrix stored by its lower triangle in
// compressed sparse column form: the entries of column j are rows
// RowIdx[ColPtr[j]:ColPtr[j+1]], all >= j, sorted ascending, no duplicates.
type Matrix struct {
	n      int
	colPtr []int
	rowIdx []int
	val    []float64
}

// N returns the order of m.
func (m *Matrix) N() int { return m.n }

// NNZ returns the number of stored entries (lower triangle with diagonal).
func (m *Matrix) NNZ() int { return len(m.rowIdx) }

// Col returns the row indices and values of the stored lower part of column
// j. The slices alias m's storage; do not modify them.
func (m *Matrix) Col(j int) (rows []int, vals []float64) {
	a, b := m.colPtr[j], m.colPtr[j+1]
	return m.rowIdx[a:b], m.val[a:b]
}

// At returns element (i, j), using symmetry for i < j.
func (m *Matrix) At(i, j int) float64 {
	if i < j {
		i, j = j, i
	}
	rows, vals := m.Col(j)
	k := sort.SearchInts(rows, i)
	if k < len(rows) && rows[k] == i {
		return vals[k]
	}
	return 0
}

// MulVec sets dst = m·x. dst and x must have length N and must not alias.
func (m *Matrix) MulVec(dst, x []float64) {
	for i := range dst[:m.n] {
		dst[i] = 0
	}
	for j := 0; j < m.n; j++ {
		xj := x[j]
		s := 0.0
		for p := m.colPtr[j]; p < m.colPtr[j+1]; p++ {
			i := m.rowIdx[p]
			v := m.val[p]
			if i == j {
				s += v * xj
				continue
			}
			dst[i] += v * xj
			s += v * x[i]
		}
		dst[j] += s
	}
}

// Builder collects entries of a symmetric matrix as triplets; duplicates are
// summed when the Matrix is built. Entries may be given in either triangle.
// The zero Builder is not usable; use NewBuilder.
type Builder struct {
	n    int
	i, j []int
	v    []float64
}

// NewBuilder returns a Builder for an n×n symmetric matrix.
func NewBuilder(n int) *Builder { return &Builder{n: n} }

// N returns the order of the matrix being built.
func (b *Builder) N() int { return b.n }

// Add adds v to element (i, j) (and, by symmetry, (j, i)). It panics if i
// or j is out of range: indices come from the program, not from a user.
func (b *Builder) Add(i, j int, v float64) {
	if i < 0 || j < 0 || i >= b.n || j >= b.n {
		panic(fmt.Sprintf("sparse: index (%d, %d) out of range for order %d", i, j, b.n))
	}
	if i < j {
		i, j = j, i
	}
	b.i = append(b.i, i)
	b.j = append(b.j, j)
	b.v = append(b.v, v)
}

// Reset empties b, keeping its storage, for order n.
func (b *Builder) Reset(n int) {
	b.n = n
	b.i, b.j, b.v = b.i[:0], b.j[:0], b.v[:0]
}

// grow makes room for n more entries.
func (b *Builder) grow(n int) {
	b.i = slices.Grow(b.i, n)
	b.j = slices.Grow(b.j, n)
	b.v = slices.Grow(b.v, n)
}

// Matrix returns the assembled matrix, duplicates summed. Explicit zeros
// that were added are kept, so the pattern depends only on the positions
// added, not on the values. The Builder keeps its entries.
func (b *Builder) Matrix() *Matrix {
	// Two counting sorts, by row then stably by column, leave every
	// column's rows in order; duplicates are then adjacent.
	n := b.n
	nnz := len(b.i)
	rp := make([]int, n+1)
	for _, i := range b.i {
		rp[i+1]++
	}
	for i := 0; i < n; i++ {
		rp[i+1] += rp[i]
	}
	byRow := make([]int32, nnz)
	if nnz > math.MaxInt32 {
		panic("sparse: too many entries")
	}
	for k, i := range b.i {
		byRow[rp[i]] = int32(k)
		rp[i]++
	}
	cp := rp // reuse for column counts
	clear(cp)
	for _, j := range b.j {
		cp[j+1]++
	}
	for j := 0; j < n; j++ {
		cp[j+1] += cp[j]
	}
	next := make([]int, n)
	copy(next, cp[:n])
	rows := make([]int, nnz)
	vals := make([]float64, nnz)
	for _, k := range byRow {
		j := b.j[k]
		q := next[j]
		next[j]++
		rows[q] = b.i[k]
		vals[q] = b.v[k]
	}
	// Sum adjacent duplicates, compacting in place.
	colPtr := make([]int, n+1)
	w := 0
	for j := 0; j < n; j++ {
		for q := cp[j]; q < cp[j+1]; q++ {
			if w > colPtr[j] && rows[w-1] == rows[q] {
				vals[w-1] += vals[q]
				continue
			}
			rows[w] = rows[q]
			vals[w] = vals[q]
			w++
		}
		colPtr[j+1] = w
	}
	if w < nnz*3/4 {
		rows = slices.Clip(slices.Clone(rows[:w]))
		vals = slices.Clip(slices.Clone(vals[:w]))
	}
	return &Matrix{n: n, colPtr: colPtr, rowIdx: rows[:w], val: vals[:w]}
}
