package sparse

import (
	"cmp"
	"math/rand/v2"
	"slices"
)

// ndLeaf is the subgraph size at or below which nested dissection stops
// and orders the rest by approximate minimum degree.
const ndLeaf = 200

// nested holds the state of one nested dissection.
type nested struct {
	g      graph
	coords [][3]float64 // nil: graph separators only
	out    []int        // the ordering, built front to back
	loc    []int        // scratch: local index of a vertex, or -1
	side   []int8       // scratch: 0 unassigned, 1 left, 2 right, 3 separator
	mark   []int        // scratch for traversals
	stamp  int
	queue  []int
	rng    *rand.Rand
}

// ndOrder returns a nested dissection ordering of g. With coordinates,
// each subgraph is split at the median of its longest extent
// (recursive coordinate bisection); otherwise by a multilevel graph
// bisection (bisect). The vertex separator is ordered after both halves, and each
// small enough part by approximate minimum degree.
func ndOrder(g graph, coords [][3]float64) []int {
	st := &nested{g: g, coords: coords,
		out:  make([]int, 0, g.n),
		loc:  make([]int, g.n),
		side: make([]int8, g.n),
		mark: make([]int, g.n),
		rng:  rand.New(rand.NewPCG(1, 1)),
	}
	for i := range st.loc {
		st.loc[i] = -1
	}
	all := make([]int, g.n)
	for i := range all {
		all[i] = i
	}
	st.dissect(all)
	return st.out
}

// dissect appends an ordering of verts (which it may reorder) to st.out.
func (st *nested) dissect(verts []int) {
	if len(verts) <= ndLeaf {
		st.leaf(verts)
		return
	}
	var left, right, sep []int
	if st.coords != nil {
		left, right, sep = st.coordSplit(verts)
	}
	if left == nil || right == nil {
		left, right, sep = st.graphSplit(verts)
	}
	if left == nil || right == nil {
		st.leaf(verts)
		return
	}
	st.dissect(left)
	st.dissect(right)
	st.out = append(st.out, sep...)
}

// leaf orders verts by approximate minimum degree on their induced
// subgraph.
func (st *nested) leaf(verts []int) {
	if len(verts) <= 2 {
		st.out = append(st.out, verts...)
		return
	}
	sub := st.induced(verts)
	for _, v := range amdOrder(sub) {
		st.out = append(st.out, verts[v])
	}
}

// induced returns the subgraph of g induced by verts, in local indices.
func (st *nested) induced(verts []int) graph {
	for i, v := range verts {
		st.loc[v] = i
	}
	ptr := make([]int, len(verts)+1)
	var adj []int
	for i, v := range verts {
		for _, w := range st.g.adj[st.g.ptr[v]:st.g.ptr[v+1]] {
			if l := st.loc[w]; l >= 0 {
				adj = append(adj, l)
			}
		}
		ptr[i+1] = len(adj)
	}
	for _, v := range verts {
		st.loc[v] = -1
	}
	return graph{n: len(verts), ptr: ptr, adj: adj}
}

// coordSplit splits verts at the median coordinate along their longest
// extent. The separator is the smaller of the two boundary layers, so it
// separates for any graph; it returns nil parts if the points coincide.
func (st *nested) coordSplit(verts []int) (left, right, sep []int) {
	lo, hi := st.coords[verts[0]], st.coords[verts[0]]
	for _, v := range verts {
		c := st.coords[v]
		for a := 0; a < 3; a++ {
			lo[a] = min(lo[a], c[a])
			hi[a] = max(hi[a], c[a])
		}
	}
	axis := 0
	for a := 1; a < 3; a++ {
		if hi[a]-lo[a] > hi[axis]-lo[axis] {
			axis = a
		}
	}
	if hi[axis] == lo[axis] {
		return nil, nil, nil
	}
	slices.SortStableFunc(verts, func(x, y int) int { return cmp.Compare(st.coords[x][axis], st.coords[y][axis]) })
	mid := len(verts) / 2
	v := st.coords[verts[mid]][axis]
	// Cut between distinct values: left < v ≤ right, unless that leaves
	// left empty.
	cut := slices.IndexFunc(verts, func(x int) bool { return st.coords[x][axis] >= v })
	if cut == 0 {
		cut = slices.IndexFunc(verts, func(x int) bool { return st.coords[x][axis] > v })
	}
	for _, x := range verts[:cut] {
		st.side[x] = 1
	}
	for _, x := range verts[cut:] {
		st.side[x] = 2
	}
	return st.separate(verts)
}

// separate turns the two-way partition in st.side (1 and 2) of verts into
// left, right and a vertex separator: a minimum vertex cover of the cut
// edges, from a maximum matching of the bipartite cut graph (König's
// theorem). It clears st.side.
func (st *nested) separate(verts []int) (left, right, sep []int) {
	g := st.g
	// Boundary vertices of each side, numbered locally.
	var bl, br []int
	for _, v := range verts {
		s := st.side[v]
		for _, w := range g.adj[g.ptr[v]:g.ptr[v+1]] {
			if t := st.side[w]; t != 0 && t != s {
				if s == 1 {
					st.loc[v] = len(bl)
					bl = append(bl, v)
				} else {
					st.loc[v] = len(br)
					br = append(br, v)
				}
				break
			}
		}
	}
	// Maximum matching by augmenting paths from each left vertex.
	ml := make([]int, len(bl)) // match of left i (index in br), or -1
	mr := make([]int, len(br))
	for i := range ml {
		ml[i] = -1
	}
	for i := range mr {
		mr[i] = -1
	}
	visited := make([]int, len(br))
	stamp := 0
	var augment func(i int) bool
	augment = func(i int) bool {
		v := bl[i]
		for _, w := range g.adj[g.ptr[v]:g.ptr[v+1]] {
			if st.side[w] != 2 || st.loc[w] < 0 {
				continue
			}
			j := st.loc[w]
			if visited[j] == stamp {
				continue
			}
			visited[j] = stamp
			if mr[j] < 0 || augment(mr[j]) {
				ml[i], mr[j] = j, i
				return true
			}
		}
		return false
	}
	// Greedy start, then augmenting paths.
	for i, v := range bl {
		for _, w := range g.adj[g.ptr[v]:g.ptr[v+1]] {
			if st.side[w] == 2 && st.loc[w] >= 0 && mr[st.loc[w]] < 0 {
				ml[i], mr[st.loc[w]] = st.loc[w], i
				break
			}
		}
	}
	for i := range bl {
		if ml[i] < 0 {
			stamp++
			augment(i)
		}
	}
	// König: Z = vertices reachable from unmatched left vertices along
	// alternating paths; cover = (left boundary \ Z) ∪ (right boundary ∩ Z).
	zl := make([]bool, len(bl))
	zr := make([]bool, len(br))
	queue := make([]int, 0, len(bl))
	for i := range bl {
		if ml[i] < 0 {
			zl[i] = true
			queue = append(queue, i)
		}
	}
	for h := 0; h < len(queue); h++ {
		v := bl[queue[h]]
		for _, w := range g.adj[g.ptr[v]:g.ptr[v+1]] {
			if st.side[w] != 2 || st.loc[w] < 0 {
				continue
			}
			j := st.loc[w]
			if zr[j] {
				continue
			}
			zr[j] = true
			if i := mr[j]; i >= 0 && !zl[i] {
				zl[i] = true
				queue = append(queue, i)
			}
		}
	}
	for i, v := range bl {
		if !zl[i] {
			st.side[v] = 3
		}
	}
	for j, v := range br {
		if zr[j] {
			st.side[v] = 3
		}
	}
	for _, v := range verts {
		switch st.side[v] {
		case 1:
			left = append(left, v)
		case 2:
			right = append(right, v)
		default:
			sep = append(sep, v)
		}
	}
	for _, v := range bl {
		st.loc[v] = -1
	}
	for _, v := range br {
		st.loc[v] = -1
	}
	for _, v := range verts {
		st.side[v] = 0
	}
	return left, right, sep
}
