package sparse

import "fmt"

// Union returns a matrix whose pattern is the union of the patterns of a
// and b, with all values zero: the storage for Combine, which fills it
// with a + α·b for one α after another without building a new matrix
// (and without changing the pattern, so a Factor keeps its analysis).
func Union(a, b *Matrix) (*Matrix, error) {
	if a.n != b.n {
		return nil, fmt.Errorf("sparse: Union of matrices of order %d and %d", a.n, b.n)
	}
	n := a.n
	colPtr := make([]int, n+1)
	rows := make([]int, 0, max(len(a.rowIdx), len(b.rowIdx)))
	for j := 0; j < n; j++ {
		ra, _ := a.Col(j)
		rb, _ := b.Col(j)
		p, q := 0, 0
		for p < len(ra) || q < len(rb) {
			switch {
			case q == len(rb) || (p < len(ra) && ra[p] < rb[q]):
				rows = append(rows, ra[p])
				p++
			case p == len(ra) || rb[q] < ra[p]:
				rows = append(rows, rb[q])
				q++
			default: // the same row in both
				rows = append(rows, ra[p])
				p++
				q++
			}
		}
		colPtr[j+1] = len(rows)
	}
	return &Matrix{n: n, colPtr: colPtr, rowIdx: rows, val: make([]float64, len(rows))}, nil
}

// Combine sets the values of dst to a + alpha·b, keeping dst's pattern,
// which must hold every entry of a and of b (make dst with Union); entries
// of dst in neither are set to zero. Each sum is formed as a_ij +
// alpha·b_ij, as a Builder given a's entries and then alpha·b's would
// form it, so the values are the same to the bit. It returns an error if
// the orders differ or an entry of a or b has no place in dst.
func Combine(dst, a *Matrix, alpha float64, b *Matrix) error {
	if a.n != dst.n || b.n != dst.n {
		return fmt.Errorf("sparse: Combine into order %d of matrices of order %d and %d", dst.n, a.n, b.n)
	}
	for j := 0; j < dst.n; j++ {
		rd, vd := dst.Col(j)
		ra, va := a.Col(j)
		rb, vb := b.Col(j)
		p, q := 0, 0
		for t, i := range rd {
			v := 0.0
			if p < len(ra) && ra[p] == i {
				v = va[p]
				p++
			}
			if q < len(rb) && rb[q] == i {
				v += float64(alpha * vb[q]) // rounded: no fused multiply-add
				q++
			}
			vd[t] = v
		}
		if p < len(ra) || q < len(rb) {
			return fmt.Errorf("sparse: Combine: column %d of an operand has entries outside the destination's pattern", j)
		}
	}
	return nil
}
