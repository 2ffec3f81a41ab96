package sparse

import (
	"slices"
)

// graphSplit bisects the subgraph induced by verts by multilevel edge
// bisection (bisect); separate then extracts a vertex separator. A
// disconnected subgraph is split between its components without a
// separator. It returns nil parts if no split is found.
func (st *nested) graphSplit(verts []int) (left, right, sep []int) {
	for _, v := range verts {
		st.side[v] = 4 // member, unvisited
	}
	// Connected component of verts[0].
	st.bfs(verts[0])
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
	// Connected: multilevel bisection of the induced subgraph.
	for _, v := range verts {
		st.side[v] = 0
	}
	part := bisect(st.induced(verts), st.rng)
	n0 := 0
	for i, v := range verts {
		st.side[v] = int8(part[i]) + 1
		if part[i] == 0 {
			n0++
		}
	}
	if n0 == 0 || n0 == len(verts) {
		for _, v := range verts {
			st.side[v] = 0
		}
		return nil, nil, nil
	}
	return st.separate(verts)
}

// bfs runs a breadth-first search from s over vertices marked 4 in
// st.side, leaving the visit order in st.queue; it returns the end
// position in st.queue of each level.
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
