package sparse

import "math/rand/v2"

// Multilevel graph bisection (Hendrickson and Leland 1995; Karypis and
// Kumar, SIAM J. Sci. Comput. 20(1), 1998): coarsen by heavy-edge
// matching, bisect the coarsest graph by greedy growing from several
// seeds, then project back level by level, refining each with
// Fiduccia–Mattheyses passes.

// wgraph is a graph with vertex and edge weights.
type wgraph struct {
	n   int
	ptr []int
	adj []int
	ew  []int // weight of each adjacency entry
	vw  []int // vertex weights
}

const (
	coarsestSize = 100  // stop coarsening below this many vertices
	imbalance    = 1.05 // largest part may weigh this × half the total
	growTries    = 6    // seeds tried for the initial bisection
	fmPasses     = 6    // refinement passes per level
	fmStall      = 80   // moves without improvement before a pass stops
)

// bisect returns a two-way partition (0/1 per vertex) of g with a small
// edge cut and parts within the balance limit. rng makes it repeatable.
func bisect(g graph, rng *rand.Rand) []int8 {
	w := wgraph{n: g.n, ptr: g.ptr, adj: g.adj, ew: make([]int, len(g.adj)), vw: make([]int, g.n)}
	for i := range w.ew {
		w.ew[i] = 1
	}
	for i := range w.vw {
		w.vw[i] = 1
	}
	return w.bisect(rng)
}

func (g *wgraph) bisect(rng *rand.Rand) []int8 {
	if g.n <= coarsestSize {
		return g.initial(rng)
	}
	cg, cmap := g.coarsen(rng)
	if cg.n > g.n*9/10 {
		// Matching stalls (e.g. a star): partition this level directly.
		return g.initial(rng)
	}
	cpart := cg.bisect(rng)
	part := make([]int8, g.n)
	for v := range part {
		part[v] = cpart[cmap[v]]
	}
	g.refine(part)
	return part
}

// coarsen matches each vertex with its unmatched neighbour of heaviest
// edge (visiting vertices in random order) and contracts the matching.
func (g *wgraph) coarsen(rng *rand.Rand) (*wgraph, []int) {
	n := g.n
	match := make([]int, n)
	for i := range match {
		match[i] = -1
	}
	order := rng.Perm(n)
	for _, v := range order {
		if match[v] != -1 {
			continue
		}
		best, bw := v, -1
		for p := g.ptr[v]; p < g.ptr[v+1]; p++ {
			if u := g.adj[p]; match[u] == -1 && u != v && g.ew[p] > bw {
				best, bw = u, g.ew[p]
			}
		}
		match[v] = best
		match[best] = v
	}
	cmap := make([]int, n)
	nc := 0
	for v := 0; v < n; v++ {
		if u := match[v]; u >= v {
			cmap[v] = nc
			cmap[u] = nc
			nc++
		}
	}
	c := &wgraph{n: nc, ptr: make([]int, nc+1), vw: make([]int, nc)}
	pos := make([]int, nc) // position of coarse neighbour in the current list, or -1
	for i := range pos {
		pos[i] = -1
	}
	c.adj = make([]int, 0, len(g.adj)/2)
	c.ew = make([]int, 0, len(g.adj)/2)
	for v := 0; v < n; v++ {
		u := match[v]
		if u < v {
			continue
		}
		cv := cmap[v]
		start := len(c.adj)
		for _, x := range [2]int{v, u} {
			c.vw[cv] += g.vw[x]
			for p := g.ptr[x]; p < g.ptr[x+1]; p++ {
				cu := cmap[g.adj[p]]
				if cu == cv {
					continue
				}
				if q := pos[cu]; q >= start {
					c.ew[q] += g.ew[p]
				} else {
					pos[cu] = len(c.adj)
					c.adj = append(c.adj, cu)
					c.ew = append(c.ew, g.ew[p])
				}
			}
			if u == v {
				break
			}
		}
		c.ptr[cv+1] = len(c.adj)
	}
	return c, cmap
}

// initial bisects a small graph by greedy growing from several random
// seeds, each refined, keeping the smallest cut.
func (g *wgraph) initial(rng *rand.Rand) []int8 {
	total := 0
	for _, w := range g.vw {
		total += w
	}
	var best []int8
	bestCut := -1
	part := make([]int8, g.n)
	queue := make([]int, 0, g.n)
	for try := 0; try < growTries; try++ {
		for i := range part {
			part[i] = 1
		}
		// Breadth-first growth of part 0 to half the weight.
		grown := 0
		seed := rng.IntN(g.n)
		queue = append(queue[:0], seed)
		part[seed] = 0
		grown += g.vw[seed]
		for h := 0; h < len(queue) && 2*grown < total; h++ {
			v := queue[h]
			for p := g.ptr[v]; p < g.ptr[v+1] && 2*grown < total; p++ {
				if u := g.adj[p]; part[u] == 1 {
					part[u] = 0
					grown += g.vw[u]
					queue = append(queue, u)
				}
			}
			if h == len(queue)-1 && 2*grown < total {
				// Disconnected: continue from any vertex still outside.
				for u := 0; u < g.n; u++ {
					if part[u] == 1 {
						part[u] = 0
						grown += g.vw[u]
						queue = append(queue, u)
						break
					}
				}
			}
		}
		g.refine(part)
		if c := g.cut(part); bestCut < 0 || c < bestCut {
			bestCut = c
			best = append(best[:0], part...)
		}
	}
	return best
}

func (g *wgraph) cut(part []int8) int {
	c := 0
	for v := 0; v < g.n; v++ {
		for p := g.ptr[v]; p < g.ptr[v+1]; p++ {
			if part[g.adj[p]] != part[v] {
				c += g.ew[p]
			}
		}
	}
	return c / 2
}

// fmItem is a candidate move in the refinement heap.
type fmItem struct{ gain, v, stamp int }

// fmHeap is a max-heap of moves by gain (typed, so pushes do not box).
type fmHeap []fmItem

func (h *fmHeap) push(x fmItem) {
	*h = append(*h, x)
	q := *h
	for i := len(q) - 1; i > 0; {
		p := (i - 1) / 2
		if q[p].gain >= q[i].gain {
			break
		}
		q[p], q[i] = q[i], q[p]
		i = p
	}
}

func (h *fmHeap) pop() fmItem {
	q := *h
	top := q[0]
	last := len(q) - 1
	q[0] = q[last]
	q = q[:last]
	for i := 0; ; {
		l, r, big := 2*i+1, 2*i+2, i
		if l < len(q) && q[l].gain > q[big].gain {
			big = l
		}
		if r < len(q) && q[r].gain > q[big].gain {
			big = r
		}
		if big == i {
			break
		}
		q[i], q[big] = q[big], q[i]
		i = big
	}
	*h = q
	return top
}

// refine improves the edge cut of part by Fiduccia–Mattheyses passes:
// repeatedly move the unlocked vertex of highest gain whose move keeps
// the balance, then roll back to the best cut seen.
func (g *wgraph) refine(part []int8) {
	n := g.n
	var wt [2]int
	for v := 0; v < n; v++ {
		wt[part[v]] += g.vw[v]
	}
	limit := int(imbalance * float64(wt[0]+wt[1]) / 2)
	gain := make([]int, n)
	stamp := make([]int, n)
	locked := make([]bool, n)
	var moves []int
	var h fmHeap
	for pass := 0; pass < fmPasses; pass++ {
		h = h[:0]
		for v := 0; v < n; v++ {
			gv, boundary := 0, false
			for p := g.ptr[v]; p < g.ptr[v+1]; p++ {
				if part[g.adj[p]] != part[v] {
					gv += g.ew[p]
					boundary = true
				} else {
					gv -= g.ew[p]
				}
			}
			gain[v] = gv
			locked[v] = false
			stamp[v]++
			if boundary {
				h.push(fmItem{gv, v, stamp[v]})
			}
		}
		moves = moves[:0]
		cur, bestDelta, bestAt := 0, 0, 0
		// Moves that restore balance are accepted even at a loss.
		over := max(wt[0], wt[1]) > limit
		for len(h) > 0 && len(moves)-bestAt < fmStall {
			it := h.pop()
			v := it.v
			if locked[v] || it.stamp != stamp[v] {
				continue
			}
			from := part[v]
			to := 1 - from
			if wt[to]+g.vw[v] > limit && !(over && wt[from] > wt[to]) {
				continue
			}
			locked[v] = true
			part[v] = to
			wt[from] -= g.vw[v]
			wt[to] += g.vw[v]
			cur -= gain[v]
			moves = append(moves, v)
			balanced := max(wt[0], wt[1]) <= limit
			if balanced && (cur < bestDelta || over) {
				bestDelta, bestAt = cur, len(moves)
				over = false
			}
			for p := g.ptr[v]; p < g.ptr[v+1]; p++ {
				u := g.adj[p]
				if locked[u] {
					continue
				}
				if part[u] == to {
					gain[u] -= 2 * g.ew[p]
				} else {
					gain[u] += 2 * g.ew[p]
				}
				stamp[u]++
				h.push(fmItem{gain[u], u, stamp[u]})
			}
		}
		// Roll back the moves after the best point.
		for i := len(moves) - 1; i >= bestAt; i-- {
			v := moves[i]
			from := part[v]
			part[v] = 1 - from
			wt[from] -= g.vw[v]
			wt[1-from] += g.vw[v]
		}
		if bestAt == 0 || bestDelta == 0 {
			break
		}
	}
}
