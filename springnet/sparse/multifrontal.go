package sparse

import (
	"runtime"
	"slices"
	"sync"
)

// fworker is the workspace of one goroutine of the numeric factorisation:
// its front, its stack of update matrices, the panel workspace and the
// pivot counts of the columns it eliminated.
type fworker struct {
	front, stack, work []float64
	frontMx, stackMx   int
	workMx             int
	gw                 gemmPool
	top                int
	neg, pos           int
	roots              []int // subtree roots this worker factorises (tasks)
}

// defaultParallelFlops is the estimated work (Σ k·m² over supernodes)
// below which the factorisation stays on one goroutine.
const defaultParallelFlops = 2e7

// planTasks splits the supernodal tree between goroutines: the heaviest
// subtrees are split until there are a few per goroutine, these are dealt
// to the workers (largest first, to the least loaded), and the supernodes
// above them form the top part, factorised afterwards with shared dense
// kernels. It also sizes every worker's buffers.
func (f *Factor) planTasks() {
	ns := f.ns
	p := runtime.GOMAXPROCS(0)
	f.taskOf = make([]int, ns)
	for s := range f.taskOf {
		f.taskOf[s] = -1
	}
	f.fdesc = make([]int, ns)
	work := make([]float64, ns) // subtree work
	total := 0.0
	for s := 0; s < ns; s++ {
		k := float64(f.sfirst[s+1] - f.sfirst[s])
		m := float64(f.sptr[s+1] - f.sptr[s])
		work[s] += k * m * m
		f.fdesc[s] = s
		ch := f.child[f.cptr[s]:f.cptr[s+1]]
		if len(ch) > 0 {
			f.fdesc[s] = f.fdesc[ch[0]]
		}
		for _, c := range ch {
			work[s] += work[c]
		}
	}
	var roots []int
	for s := 0; s < ns; s++ {
		if f.parentOf(s) < 0 {
			roots = append(roots, s)
			total += work[s]
		}
	}
	minFlops := f.minParallel
	if minFlops == 0 {
		minFlops = defaultParallelFlops
	}
	f.workers = f.workers[:0]
	if p > 1 && total >= minFlops {
		cands := slices.Clone(roots)
		for split := 0; split < 64 && len(cands) < 4*p; split++ {
			h := 0
			for i, c := range cands {
				if work[c] > work[cands[h]] {
					h = i
				}
			}
			s := cands[h]
			ch := f.child[f.cptr[s]:f.cptr[s+1]]
			if len(ch) == 0 {
				break
			}
			cands = append(append(cands[:h], cands[h+1:]...), ch...)
		}
		slices.SortFunc(cands, func(a, b int) int {
			switch {
			case work[a] > work[b]:
				return -1
			case work[a] < work[b]:
				return 1
			}
			return a - b
		})
		f.workers = make([]*fworker, p)
		load := make([]float64, p)
		for t := range f.workers {
			f.workers[t] = &fworker{}
		}
		for _, r := range cands {
			t := slices.Index(load, slices.Min(load))
			load[t] += work[r]
			f.workers[t].roots = append(f.workers[t].roots, r)
			for s := f.fdesc[r]; s <= r; s++ {
				f.taskOf[s] = t
			}
		}
		for _, w := range f.workers {
			slices.Sort(w.roots)
		}
	}
	// Size the buffers by simulating the stacks.
	f.main = &fworker{}
	f.main.workMx = panelWidth * panelWidth
	for _, w := range f.workers {
		w.workMx = panelWidth * panelWidth
		for _, r := range w.roots {
			for s := f.fdesc[r]; s <= r; s++ {
				f.simulate(s, w)
			}
		}
	}
	for s := 0; s < ns; s++ {
		if f.taskOf[s] < 0 {
			f.simulate(s, f.main)
		}
	}
	f.rootOff = make([]int, ns)
}

// parentOf returns the supernodal parent of s, or -1.
func (f *Factor) parentOf(s int) int {
	rows := f.srow[f.sptr[s]:f.sptr[s+1]]
	k := f.sfirst[s+1] - f.sfirst[s]
	if len(rows) == k {
		return -1
	}
	return f.snodeOf[rows[k]]
}

// simulate accounts for supernode s in w's buffer sizes.
func (f *Factor) simulate(s int, w *fworker) {
	k := f.sfirst[s+1] - f.sfirst[s]
	m := f.sptr[s+1] - f.sptr[s]
	u := m - k
	w.frontMx = max(w.frontMx, u*u)
	w.workMx = max(w.workMx, k*panelWidth, u*k)
	for _, c := range f.child[f.cptr[s]:f.cptr[s+1]] {
		if f.taskOf[s] < 0 && f.taskOf[c] >= 0 {
			continue // read from the worker that made it
		}
		uc := f.sptr[c+1] - f.sptr[c] - (f.sfirst[c+1] - f.sfirst[c])
		w.top -= uc * uc
	}
	w.top += u * u
	w.stackMx = max(w.stackMx, w.top)
}

func (w *fworker) alloc(gw gemmPool) {
	w.front = make([]float64, w.frontMx)
	w.stack = make([]float64, w.stackMx)
	w.work = make([]float64, w.workMx)
	w.gw = gw
}

// factorNumeric runs the numeric factorisation over all supernodes: the
// workers' subtrees concurrently, then the top part.
func (f *Factor) factorNumeric() error {
	f.neg, f.pos = 0, 0
	if len(f.workers) > 0 {
		if err := f.factorSubtrees(); err != nil {
			return err
		}
	}
	m := f.main
	m.top, m.neg, m.pos = 0, 0, 0
	for s := 0; s < f.ns; s++ {
		if f.taskOf[s] >= 0 {
			continue
		}
		if err := f.super(s, m); err != nil {
			return err
		}
	}
	f.neg, f.pos = m.neg, m.pos
	for _, w := range f.workers {
		f.neg += w.neg
		f.pos += w.pos
	}
	return nil
}

// factorSubtrees factorises the workers' subtrees concurrently. It is
// apart from factorNumeric so that the serial path allocates nothing
// (the WaitGroup and error slice shared with goroutines live on the heap).
func (f *Factor) factorSubtrees() error {
	errs := make([]error, len(f.workers))
	var wg sync.WaitGroup
	for t, w := range f.workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			w.top, w.neg, w.pos = 0, 0, 0
			for _, r := range w.roots {
				for s := f.fdesc[r]; s <= r; s++ {
					if err := f.super(s, w); err != nil {
						errs[t] = err
						return
					}
				}
				k := f.sfirst[r+1] - f.sfirst[r]
				u := f.sptr[r+1] - f.sptr[r] - k
				f.rootOff[r] = w.top - u*u
			}
		}()
	}
	wg.Wait()
	// Of several failures, report the one earliest in pivot order.
	var first error
	firstCol := -1
	for _, err := range errs {
		if pe, ok := err.(*PivotError); ok {
			if col := f.inv[pe.Col]; firstCol < 0 || col < firstCol {
				first, firstCol = err, col
			}
		} else if err != nil && first == nil {
			first = err
		}
	}
	return first
}

// super assembles and partially factorises the front of supernode s on
// worker w, then pushes its update matrix on w's stack.
func (f *Factor) super(s int, w *fworker) error {
	c0, c1 := f.sfirst[s], f.sfirst[s+1]
	k := c1 - c0
	m := f.sptr[s+1] - f.sptr[s]
	// L's block (m×k, row-major) is the front's first k columns; the rest
	// of the front's lower triangle, the update matrix, is ub.
	lx := f.lx[f.lptr[s]:f.lptr[s+1]]
	clear(lx)
	u := m - k
	ub := w.front[:u*u]
	for i := 0; i < u; i++ {
		clear(ub[i*u : i*u+i+1])
	}
	// Assemble A's columns.
	for p := f.cp[c0]; p < f.cp[c1]; p++ {
		lx[f.fo[p]] += f.cx[p]
	}
	// Extend-add the children's update matrices: from w's stack (last
	// child on top) or, for a worker's subtree root, from that worker.
	ch := f.child[f.cptr[s]:f.cptr[s+1]]
	top := f.taskOf[s] < 0
	for t := len(ch) - 1; t >= 0; t-- {
		c := ch[t]
		rel := f.rel[f.relptr[c]:f.relptr[c+1]]
		uc := len(rel)
		var upd []float64
		if top && f.taskOf[c] >= 0 {
			off := f.rootOff[c]
			upd = f.workers[f.taskOf[c]].stack[off : off+uc*uc]
		} else {
			w.top -= uc * uc
			upd = w.stack[w.top : w.top+uc*uc]
		}
		nl := 0 // rel[:nl] are pivot columns of s
		for nl < uc && rel[nl] < k {
			nl++
		}
		for i, ri := range rel {
			src := upd[i*uc : i*uc+i+1]
			dl := lx[ri*k:]
			for j, v := range src[:min(i+1, nl)] {
				dl[rel[j]] += v
			}
			if i >= nl {
				du := ub[(ri-k)*u : (ri-k+1)*u]
				for j := nl; j <= i; j++ {
					du[rel[j]-k] += src[j]
				}
			}
		}
	}
	// Partial factorisation with the pivot test on original diagonals.
	if err := partialLDLT(lx, ub, m, k, f.d[c0:c1], w.work, w.gw, f, w, c0); err != nil {
		return err
	}
	if u > 0 {
		upd := w.stack[w.top : w.top+u*u]
		for i := 0; i < u; i++ {
			copy(upd[i*u:i*u+i+1], ub[i*u:i*u+i+1])
		}
		w.top += u * u
	}
	return nil
}
