package sparse

import "slices"

// symPattern is the lower triangle (with diagonal) of C = P·A·Pᵀ in CSC
// form, with the position in C of every stored entry of A.
type symPattern struct {
	cp, ci []int // column pointers and row indices of C's lower triangle
	cmap   []int // cmap[p] = position in ci of A's entry p
}

// permuteLower returns the lower triangle of P·A·Pᵀ, where inv[i] is the
// new index of original row i. Rows within each column are sorted.
func permuteLower(a *Matrix, inv []int) symPattern {
	n := a.n
	cp := make([]int, n+1)
	for j := 0; j < n; j++ {
		pj := inv[j]
		for p := a.colPtr[j]; p < a.colPtr[j+1]; p++ {
			cp[min(inv[a.rowIdx[p]], pj)+1]++
		}
	}
	for k := 0; k < n; k++ {
		cp[k+1] += cp[k]
	}
	// Counting sort by row first (rows in increasing new order), then by
	// column: each column's rows come out sorted.
	nnz := len(a.rowIdx)
	rowOf := make([]int, nnz) // new row of each A entry
	colOf := make([]int, nnz)
	rp := make([]int, n+1)
	for j := 0; j < n; j++ {
		pj := inv[j]
		for p := a.colPtr[j]; p < a.colPtr[j+1]; p++ {
			pi := inv[a.rowIdx[p]]
			r, c := max(pi, pj), min(pi, pj)
			rowOf[p], colOf[p] = r, c
			rp[r+1]++
		}
	}
	for k := 0; k < n; k++ {
		rp[k+1] += rp[k]
	}
	byRow := make([]int, nnz) // A entry indices ordered by new row
	for p := 0; p < nnz; p++ {
		r := rowOf[p]
		byRow[rp[r]] = p
		rp[r]++
	}
	next := make([]int, n)
	copy(next, cp[:n])
	ci := make([]int, nnz)
	cmap := make([]int, nnz)
	for _, p := range byRow {
		c := colOf[p]
		q := next[c]
		next[c]++
		ci[q] = rowOf[p]
		cmap[p] = q
	}
	return symPattern{cp: cp, ci: ci, cmap: cmap}
}

// etree returns the elimination tree of the matrix whose lower triangle
// is (cp, ci): parent[j] is the parent of column j, or -1 for a root
// (Liu's algorithm with path compression; Davis 2006, §4.1).
func etree(n int, cp, ci []int) []int {
	parent := make([]int, n)
	ancestor := make([]int, n)
	// Row k of the lower triangle lists the columns i < k with entries;
	// visit columns k in order and, for each entry (k, i), climb from i.
	rp := make([]int, n+1)
	for p := range ci {
		rp[ci[p]+1]++
	}
	for k := 0; k < n; k++ {
		rp[k+1] += rp[k]
	}
	cols := make([]int, len(ci))
	next := make([]int, n)
	copy(next, rp[:n])
	for j := 0; j < n; j++ {
		for p := cp[j]; p < cp[j+1]; p++ {
			r := ci[p]
			cols[next[r]] = j
			next[r]++
		}
	}
	for k := 0; k < n; k++ {
		parent[k] = -1
		ancestor[k] = -1
		for p := rp[k]; p < rp[k+1]; p++ {
			for i := cols[p]; i != -1 && i < k; {
				inext := ancestor[i]
				ancestor[i] = k
				if inext == -1 {
					parent[i] = k
				}
				i = inext
			}
		}
	}
	return parent
}

// postorder returns a postordering of the forest parent: post[k] is the
// k-th node, children before parents, each subtree contiguous.
func postorder(parent []int) []int {
	n := len(parent)
	head := make([]int, n)
	next := make([]int, n)
	stack := make([]int, n)
	for j := range head {
		head[j] = -1
	}
	for j := n - 1; j >= 0; j-- {
		if p := parent[j]; p != -1 {
			next[j] = head[p]
			head[p] = j
		}
	}
	post := make([]int, 0, n)
	for j := 0; j < n; j++ {
		if parent[j] != -1 {
			continue
		}
		top := 0
		stack[0] = j
		for top >= 0 {
			p := stack[top]
			i := head[p]
			if i == -1 {
				top--
				post = append(post, p)
			} else {
				head[p] = next[i]
				top++
				stack[top] = i
			}
		}
	}
	return post
}

// colCounts returns the number of entries of each column of the Cholesky
// factor L (diagonal included) of the matrix with lower triangle (cp, ci),
// whose elimination tree parent is postordered (parent[j] > j, subtrees
// contiguous). Gilbert, Ng and Peyton, SIAM J. Matrix Anal. Appl. 15(4),
// 1994, in the form of Davis 2006, §4.5.
func colCounts(n int, cp, ci []int, parent []int) []int {
	delta := make([]int, n)
	w := make([]int, 4*n)
	ancestor, maxfirst, prevleaf, first := w[:n], w[n:2*n], w[2*n:3*n], w[3*n:]
	for k := range w {
		w[k] = -1
	}
	for k := 0; k < n; k++ {
		j := k
		if first[j] == -1 {
			delta[j] = 1 // j is a leaf
		}
		for ; j != -1 && first[j] == -1; j = parent[j] {
			first[j] = k
		}
	}
	for i := 0; i < n; i++ {
		ancestor[i] = i
	}
	for j := 0; j < n; j++ {
		if parent[j] != -1 {
			delta[parent[j]]--
		}
		for p := cp[j]; p < cp[j+1]; p++ {
			i := ci[p]
			// Is j a leaf of the i-th row subtree?
			if i <= j || first[j] <= maxfirst[i] {
				continue
			}
			maxfirst[i] = first[j]
			jprev := prevleaf[i]
			prevleaf[i] = j
			delta[j]++
			if jprev == -1 {
				continue
			}
			q := jprev
			for q != ancestor[q] {
				q = ancestor[q]
			}
			for s := jprev; s != q; {
				sp := ancestor[s]
				ancestor[s] = q
				s = sp
			}
			delta[q]--
		}
		if parent[j] != -1 {
			ancestor[j] = parent[j]
		}
	}
	for j := 0; j < n; j++ {
		if parent[j] != -1 {
			delta[parent[j]] += delta[j]
		}
	}
	return delta
}

// Relaxed amalgamation limits (the defaults of Ashcraft and Grimes,
// "The influence of relaxed supernode partitions on the multifrontal
// method", ACM TOMS 15(4), 1989, as commonly tuned): a merged supernode of
// at most relaxCols[t] columns is accepted if its fraction of explicit
// zeros is below relaxZeros[t]; any size is accepted below relaxAny.
var (
	relaxCols  = [3]int{4, 16, 48}
	relaxZeros = [3]float64{1, 0.8, 0.1}
)

const relaxAny = 0.05

// supernodes partitions the postordered columns into relaxed supernodes.
// It returns the first column of each supernode (plus n at the end).
func supernodes(n int, parent, cc []int) []int {
	if n == 0 {
		return []int{0}
	}
	nchild := make([]int, n)
	for j := 0; j < n; j++ {
		if p := parent[j]; p != -1 {
			nchild[p]++
		}
	}
	// Fundamental supernodes.
	first := []int{0}
	for j := 1; j < n; j++ {
		if !(parent[j-1] == j && cc[j-1] == cc[j]+1 && nchild[j] == 1) {
			first = append(first, j)
		}
	}
	nf := len(first)
	first = append(first, n)
	// Supernodal tree: parent of s is the supernode holding the etree
	// parent of s's last column.
	snodeOf := make([]int, n)
	for s := 0; s < nf; s++ {
		for j := first[s]; j < first[s+1]; j++ {
			snodeOf[j] = s
		}
	}
	sparent := make([]int, nf)
	for s := 0; s < nf; s++ {
		sparent[s] = -1
		if p := parent[first[s+1]-1]; p != -1 {
			sparent[s] = snodeOf[p]
		}
	}
	// Relaxed amalgamation: s absorbs the supernode just before its first
	// column when that one is its child and the padding is acceptable.
	ncol := make([]int, nf)
	nrow := make([]int, nf)
	zeros := make([]float64, nf)
	start := make([]int, nf) // fundamental index of the merged first column
	merged := make([]bool, nf)
	for s := 0; s < nf; s++ {
		ncol[s] = first[s+1] - first[s]
		nrow[s] = cc[first[s]]
		start[s] = s
	}
	ent := func(k, m int) float64 { return float64(k)*float64(m) - float64(k)*float64(k-1)/2 }
	for s := nf - 1; s > 0; s-- {
		if merged[s] {
			continue
		}
		for start[s] > 0 {
			c := start[s] - 1
			if merged[c] || sparent[c] != s && !(sparent[c] >= 0 && merged[sparent[c]] && root(sparent, merged, sparent[c]) == s) {
				break
			}
			k := ncol[c] + ncol[s]
			m := ncol[c] + nrow[s]
			e := ent(k, m)
			z := zeros[c] + zeros[s] + e - ent(ncol[c], nrow[c]) - ent(ncol[s], nrow[s])
			frac := z / e
			ok := frac < relaxAny
			for t := range relaxCols {
				if k <= relaxCols[t] && frac < relaxZeros[t] {
					ok = true
				}
			}
			if !ok {
				break
			}
			merged[c] = true
			sparent[c] = s
			ncol[s], nrow[s], zeros[s] = k, m, z
			start[s] = start[c]
		}
	}
	out := make([]int, 0, nf+1)
	for s := 0; s < nf; s++ {
		if !merged[s] {
			out = append(out, first[start[s]])
		}
	}
	return append(out, n)
}

// root follows merged supernodes up to the one that absorbed them.
func root(sparent []int, merged []bool, s int) int {
	for merged[s] {
		s = sparent[s]
	}
	return s
}

// sortInts sorts a small slice of row indices.
func sortInts(x []int) { slices.Sort(x) }
