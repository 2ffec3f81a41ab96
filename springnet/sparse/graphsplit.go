package sparse

import "slices"

// graphSplit bisects the subgraph induced by verts using a breadth-first
// level structure from a pseudo-peripheral vertex (George and Liu 1981,
// ch. 8): the vertices before the level that halves the subgraph go
// left, the rest right; separate then extracts a vertex separator. A
// disconnected subgraph is split between its components without a
// separator. It returns nil parts if no split is found.
func (st *nested) graphSplit(verts []int) (left, right, sep []int) {
	for _, v := range verts {
		st.side[v] = 4 // member, unvisited
	}
	// Connected component of verts[0].
	start := st.peripheral(verts[0])
	levels := st.bfs(start) // visited vertices, level by level in st.queue
	nvis := len(st.queue)
	if nvis < len(verts) {
		// Disconnected: split between components, no separator. Collect
		// all components and deal them to the smaller side.
		for _, v := range verts {
			st.side[v] = 0
		}
		comps := st.components(verts)
		slices.SortFunc(comps, func(a, b []int) int { return len(b) - len(a) })
		for _, c := range comps {
			if len(left) <= len(right) {
				left = append(left, c...)
			} else {
				right = append(right, c...)
			}
		}
		return left, right, []int{}
	}
	// The level boundary closest to half.
	half := len(verts) / 2
	cut := 0
	for _, e := range levels {
		if e <= half || cut == 0 {
			cut = e
		}
	}
	if cut == 0 || cut >= nvis {
		for _, v := range verts {
			st.side[v] = 0
		}
		return nil, nil, nil
	}
	for i, v := range st.queue {
		if i < cut {
			st.side[v] = 1
		} else {
			st.side[v] = 2
		}
	}
	return st.separate(verts)
}

// bfs runs a breadth-first search from s over vertices marked 4 in
// st.side, leaving the visit order in st.queue; it returns the end
// position in st.queue of each level. Visited vertices are re-marked 4.
func (st *nested) bfs(s int) []int {
	st.stamp++
	st.queue = append(st.queue[:0], s)
	st.mark[s] = st.stamp
	var ends []int
	for head := 0; head < len(st.queue); {
		end := len(st.queue)
		for ; head < end; head++ {
			v := st.queue[head]
			for _, w := range st.g.adj[st.g.ptr[v]:st.g.ptr[v+1]] {
				if st.side[w] == 4 && st.mark[w] != st.stamp {
					st.mark[w] = st.stamp
					st.queue = append(st.queue, w)
				}
			}
		}
		ends = append(ends, end)
	}
	return ends
}

// peripheral returns a pseudo-peripheral vertex of s's component (Gibbs,
// Poole and Stockmeyer's iteration: restart from a vertex of the last
// level while the eccentricity grows).
func (st *nested) peripheral(s int) int {
	ecc := -1
	for it := 0; it < 8; it++ {
		ends := st.bfs(s)
		if len(ends)-1 <= ecc {
			break
		}
		ecc = len(ends) - 1
		// A vertex of minimum degree in the last level.
		last := st.queue[ends[len(ends)-2]:]
		if len(ends) == 1 {
			last = st.queue
		}
		best, bd := last[0], -1
		for _, v := range last {
			d := st.g.ptr[v+1] - st.g.ptr[v]
			if bd < 0 || d < bd {
				best, bd = v, d
			}
		}
		s = best
	}
	return s
}

// components returns the connected components of the subgraph induced
// by verts.
func (st *nested) components(verts []int) [][]int {
	for _, v := range verts {
		st.side[v] = 4
	}
	var comps [][]int
	for _, v := range verts {
		if st.side[v] != 4 {
			continue
		}
		st.bfs(v)
		c := append([]int(nil), st.queue...)
		for _, w := range c {
			st.side[w] = 0
		}
		comps = append(comps, c)
	}
	return comps
}
