package sparse

import (
	"fmt"
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

// Matrix returns the assembled matrix, duplicates summed. Explicit zeros
// that were added are kept, so the pattern depends only on the positions
// added, not on the values.
func (b *Builder) Matrix() *Matrix {
	n := b.n
	count := make([]int, n+1)
	for _, j := range b.j {
		count[j+1]++
	}
	for j := 0; j < n; j++ {
		count[j+1] += count[j]
	}
	rows := make([]int, len(b.i))
	vals := make([]float64, len(b.i))
	next := append([]int(nil), count[:n]...)
	for k, j := range b.j {
		p := next[j]
		rows[p] = b.i[k]
		vals[p] = b.v[k]
		next[j]++
	}
	m := &Matrix{n: n, colPtr: make([]int, n+1)}
	m.rowIdx = make([]int, 0, len(rows))
	m.val = make([]float64, 0, len(rows))
	mark := make([]int, n)
	for i := range mark {
		mark[i] = -1
	}
	for j := 0; j < n; j++ {
		start := len(m.rowIdx)
		for p := count[j]; p < count[j+1]; p++ {
			i := rows[p]
			if mark[i] >= start {
				m.val[mark[i]] += vals[p]
				continue
			}
			mark[i] = len(m.rowIdx)
			m.rowIdx = append(m.rowIdx, i)
			m.val = append(m.val, vals[p])
		}
		seg := colSorter{m.rowIdx[start:], m.val[start:]}
		sort.Sort(seg)
		m.colPtr[j+1] = len(m.rowIdx)
	}
	return m
}

type colSorter struct {
	r []int
	v []float64
}

func (s colSorter) Len() int           { return len(s.r) }
func (s colSorter) Less(a, b int) bool { return s.r[a] < s.r[b] }
func (s colSorter) Swap(a, b int) {
	s.r[a], s.r[b] = s.r[b], s.r[a]
	s.v[a], s.v[b] = s.v[b], s.v[a]
}
