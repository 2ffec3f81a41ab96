package sparse

// graph is the adjacency structure of a symmetric matrix without its
// diagonal: the neighbours of vertex v are adj[ptr[v]:ptr[v+1]].
type graph struct {
	n   int
	ptr []int
	adj []int
}

// adjacency returns the graph of A (both triangles, no diagonal).
func adjacency(a *Matrix) graph {
	n := a.n
	deg := make([]int, n+1)
	for j := 0; j < n; j++ {
		for p := a.colPtr[j]; p < a.colPtr[j+1]; p++ {
			if i := a.rowIdx[p]; i != j {
				deg[i+1]++
				deg[j+1]++
			}
		}
	}
	for v := 0; v < n; v++ {
		deg[v+1] += deg[v]
	}
	adj := make([]int, deg[n])
	next := make([]int, n)
	copy(next, deg[:n])
	// Columns in increasing order give each list sorted ascending: the
	// rows i > j of column j are appended to list j (ascending), and j is
	// appended to list i after every smaller column.
	for j := 0; j < n; j++ {
		for p := a.colPtr[j]; p < a.colPtr[j+1]; p++ {
			if i := a.rowIdx[p]; i != j {
				adj[next[i]] = j
				next[i]++
			}
		}
	}
	for j := 0; j < n; j++ {
		for p := a.colPtr[j]; p < a.colPtr[j+1]; p++ {
			if i := a.rowIdx[p]; i != j {
				adj[next[j]] = i
				next[j]++
			}
		}
	}
	return graph{n: n, ptr: deg, adj: adj}
}
