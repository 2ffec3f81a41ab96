package sparse

import "math"

// amdOrder returns an approximate minimum degree ordering of the graph g:
// perm[k] is the vertex eliminated k-th.
//
// The method is the approximate minimum degree algorithm of Amestoy, Davis
// and Duff (SIAM J. Matrix Anal. Appl. 17(4), 1996) on a quotient graph,
// with element absorption, aggressive absorption, mass elimination and
// detection of indistinguishable variables by hashing, in the compact form
// given in T. A. Davis, "Direct Methods for Sparse Linear Systems" (SIAM
// 2006), ch. 7. Rows denser than max(16, 10·√n) are ordered last.
func amdOrder(g graph) []int {
	n := g.n
	if n == 0 {
		return nil
	}
	flip := func(i int) int { return -i - 2 }
	cnz := len(g.adj)
	nzmax := cnz + cnz/5 + 2*n
	ci := make([]int, nzmax)
	copy(ci, g.adj)
	cp := make([]int, n+1)
	copy(cp, g.ptr)
	dense := max(16, int(10*math.Sqrt(float64(n))))
	dense = min(n-2, dense)

	ws := make([]int, 9*(n+1))
	length := ws[0 : n+1]
	nv := ws[n+1 : 2*(n+1)]
	next := ws[2*(n+1) : 3*(n+1)]
	head := ws[3*(n+1) : 4*(n+1)]
	elen := ws[4*(n+1) : 5*(n+1)]
	degree := ws[5*(n+1) : 6*(n+1)]
	w := ws[6*(n+1) : 7*(n+1)]
	hhead := ws[7*(n+1) : 8*(n+1)]
	last := ws[8*(n+1) : 9*(n+1)]

	for k := 0; k < n; k++ {
		length[k] = cp[k+1] - cp[k]
	}
	length[n] = 0
	for i := 0; i <= n; i++ {
		head[i] = -1
		last[i] = -1
		next[i] = -1
		hhead[i] = -1
		nv[i] = 1
		w[i] = 1
		elen[i] = 0
		degree[i] = length[i]
	}
	wclear := func(mark, lemax int) int {
		if mark < 2 || mark+lemax < 0 || mark+lemax > math.MaxInt/2 {
			for k := 0; k < n; k++ {
				if w[k] != 0 {
					w[k] = 1
				}
			}
			mark = 2
		}
		return mark
	}
	mark := wclear(0, 0)
	elen[n] = -2
	cp[n] = -1
	w[n] = 0
	nel := 0
	for i := 0; i < n; i++ {
		d := degree[i]
		switch {
		case d == 0:
			elen[i] = -2
			nel++
			cp[i] = -1
			w[i] = 0
		case d > dense:
			nv[i] = 0
			elen[i] = -1
			nel++
			cp[i] = flip(n)
			nv[n]++
		default:
			if head[d] != -1 {
				last[head[d]] = i
			}
			next[i] = head[d]
			head[d] = i
		}
	}
	mindeg, lemax := 0, 0
	for nel < n {
		// Select a variable of minimum approximate degree.
		k := -1
		for ; mindeg < n; mindeg++ {
			if k = head[mindeg]; k != -1 {
				break
			}
		}
		if next[k] != -1 {
			last[next[k]] = -1
		}
		head[mindeg] = next[k]
		elenk := elen[k]
		nvk := nv[k]
		nel += nvk

		// Garbage collection.
		if elenk > 0 && cnz+mindeg >= nzmax {
			for j := 0; j < n; j++ {
				if p := cp[j]; p >= 0 {
					cp[j] = ci[p]
					ci[p] = flip(j)
				}
			}
			q := 0
			for p := 0; p < cnz; {
				j := flip(ci[p])
				p++
				if j >= 0 {
					ci[q] = cp[j]
					cp[j] = q
					q++
					for k3 := 0; k3 < length[j]-1; k3++ {
						ci[q] = ci[p]
						q++
						p++
					}
				}
			}
			cnz = q
		}

		// Construct the new element Lk.
		dk := 0
		nv[k] = -nvk
		p := cp[k]
		pk1 := cnz
		if elenk == 0 {
			pk1 = p
		}
		pk2 := pk1
		for k1 := 1; k1 <= elenk+1; k1++ {
			var e, pj, ln int
			if k1 > elenk {
				e = k
				pj = p
				ln = length[k] - elenk
			} else {
				e = ci[p]
				p++
				pj = cp[e]
				ln = length[e]
			}
			for k2 := 1; k2 <= ln; k2++ {
				i := ci[pj]
				pj++
				nvi := nv[i]
				if nvi <= 0 {
					continue
				}
				dk += nvi
				nv[i] = -nvi
				ci[pk2] = i
				pk2++
				if next[i] != -1 {
					last[next[i]] = last[i]
				}
				if last[i] != -1 {
					next[last[i]] = next[i]
				} else {
					head[degree[i]] = next[i]
				}
			}
			if e != k {
				cp[e] = flip(k)
				w[e] = 0
			}
		}
		if elenk != 0 {
			cnz = pk2
		}
		degree[k] = dk
		cp[k] = pk1
		length[k] = pk2 - pk1
		elen[k] = -2

		// Set differences |Le \ Lk| for every element e.
		mark = wclear(mark, lemax)
		for pk := pk1; pk < pk2; pk++ {
			i := ci[pk]
			eln := elen[i]
			if eln <= 0 {
				continue
			}
			nvi := -nv[i]
			wnvi := mark - nvi
			for p := cp[i]; p <= cp[i]+eln-1; p++ {
				e := ci[p]
				if w[e] >= mark {
					w[e] -= nvi
				} else if w[e] != 0 {
					w[e] = degree[e] + wnvi
				}
			}
		}

		// Degree update and element absorption.
		for pk := pk1; pk < pk2; pk++ {
			i := ci[pk]
			p1 := cp[i]
			p2 := p1 + elen[i] - 1
			pn := p1
			h, d := 0, 0
			for p := p1; p <= p2; p++ {
				e := ci[p]
				if w[e] != 0 {
					dext := w[e] - mark
					if dext > 0 {
						d += dext
						ci[pn] = e
						pn++
						h += e
					} else {
						cp[e] = flip(k)
						w[e] = 0
					}
				}
			}
			elen[i] = pn - p1 + 1
			p3 := pn
			p4 := p1 + length[i]
			for p := p2 + 1; p < p4; p++ {
				j := ci[p]
				nvj := nv[j]
				if nvj <= 0 {
					continue
				}
				d += nvj
				ci[pn] = j
				pn++
				h += j
			}
			if d == 0 {
				// Mass elimination: i is absorbed into k.
				cp[i] = flip(k)
				nvi := -nv[i]
				dk -= nvi
				nvk += nvi
				nel += nvi
				nv[i] = 0
				elen[i] = -1
			} else {
				degree[i] = min(degree[i], d)
				ci[pn] = ci[p3]
				ci[p3] = ci[p1]
				ci[p1] = k
				length[i] = pn - p1 + 1
				if h < 0 {
					h = -h
				}
				h %= n
				next[i] = hhead[h]
				hhead[h] = i
				last[i] = h
			}
		}
		degree[k] = dk
		lemax = max(lemax, dk)
		mark = wclear(mark+lemax, lemax)

		// Supervariable detection.
		for pk := pk1; pk < pk2; pk++ {
			i := ci[pk]
			if nv[i] >= 0 {
				continue
			}
			h := last[i]
			i = hhead[h]
			hhead[h] = -1
			for ; i != -1 && next[i] != -1; i, mark = next[i], mark+1 {
				ln := length[i]
				eln := elen[i]
				for p := cp[i] + 1; p <= cp[i]+ln-1; p++ {
					w[ci[p]] = mark
				}
				jlast := i
				for j := next[i]; j != -1; {
					ok := length[j] == ln && elen[j] == eln
					for p := cp[j] + 1; ok && p <= cp[j]+ln-1; p++ {
						if w[ci[p]] != mark {
							ok = false
						}
					}
					if ok {
						cp[j] = flip(i)
						nv[i] += nv[j]
						nv[j] = 0
						elen[j] = -1
						j = next[j]
						next[jlast] = j
					} else {
						jlast = j
						j = next[j]
					}
				}
			}
		}

		// Finalize the new element.
		p = pk1
		for pk := pk1; pk < pk2; pk++ {
			i := ci[pk]
			nvi := -nv[i]
			if nvi <= 0 {
				continue
			}
			nv[i] = nvi
			d := degree[i] + dk - nvi
			d = min(d, n-nel-nvi)
			if head[d] != -1 {
				last[head[d]] = i
			}
			next[i] = head[d]
			last[i] = -1
			head[d] = i
			mindeg = min(mindeg, d)
			degree[i] = d
			ci[p] = i
			p++
		}
		nv[k] = nvk
		length[k] = p - pk1
		if length[k] == 0 {
			cp[k] = -1
			w[k] = 0
		}
		if elenk != 0 {
			cnz = p
		}
	}

	// Postorder the assembly tree.
	for i := 0; i < n; i++ {
		cp[i] = flip(cp[i])
	}
	for j := 0; j <= n; j++ {
		head[j] = -1
	}
	for j := n; j >= 0; j-- {
		if nv[j] > 0 || cp[j] == -1 {
			continue
		}
		next[j] = head[cp[j]]
		head[cp[j]] = j
	}
	for e := n; e >= 0; e-- {
		if nv[e] <= 0 {
			continue
		}
		if cp[e] != -1 {
			next[e] = head[cp[e]]
			head[cp[e]] = e
		}
	}
	perm := make([]int, n+1)
	stack := w // w is free now
	k := 0
	for i := 0; i <= n; i++ {
		if cp[i] != -1 {
			continue
		}
		top := 0
		stack[0] = i
		for top >= 0 {
			p := stack[top]
			j := head[p]
			if j == -1 {
				top--
				perm[k] = p
				k++
			} else {
				head[p] = next[j]
				top++
				stack[top] = j
			}
		}
	}
	// perm holds 0..n; drop the placeholder n (the root of dense rows).
	out := perm[:0]
	for _, v := range perm[:k] {
		if v != n {
			out = append(out, v)
		}
	}
	return out
}
