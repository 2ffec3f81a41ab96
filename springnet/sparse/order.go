package sparse

// autoSmall is the order below which Auto uses minimum degree alone: on
// small matrices it is as good as dissection and cheaper to compute.
const autoSmall = 3000

// order returns the fill-reducing permutation for a: perm[k] is the
// original index of pivot k.
func order(a *Matrix, opt *Options) []int {
	n := a.n
	switch opt.Ordering {
	case Natural:
		return identity(n)
	case MinDegree:
		return amdOrder(adjacency(a))
	case NestedDissection:
		return ndOrder(adjacency(a), opt.Coords)
	}
	// Auto: both orderings, keep the one with the smaller factor.
	g := adjacency(a)
	md := amdOrder(g)
	if n < autoSmall {
		return md
	}
	nd := ndOrder(g, opt.Coords)
	if fill(a, nd) < fill(a, md) {
		return nd
	}
	return md
}

// fill returns nnz(L) (diagonal included) of a in the ordering perm.
func fill(a *Matrix, perm []int) int {
	n := a.n
	inv := make([]int, n)
	for k, i := range perm {
		inv[i] = k
	}
	pat := permuteLower(a, inv)
	post := postorder(etree(n, pat.cp, pat.ci))
	for k, j := range post {
		inv[perm[j]] = k
	}
	pat = permuteLower(a, inv)
	total := 0
	for _, c := range colCounts(n, pat.cp, pat.ci, etree(n, pat.cp, pat.ci)) {
		total += c
	}
	return total
}

func identity(n int) []int {
	p := make([]int, n)
	for i := range p {
		p[i] = i
	}
	return p
}
