package sparse

// order returns the fill-reducing permutation for a: perm[k] is the
// original index of pivot k.
func order(a *Matrix, opt *Options) []int {
	n := a.n
	switch opt.Ordering {
	case Natural:
		return identity(n)
	default:
		return amdOrder(adjacency(a))
	}
}

func identity(n int) []int {
	p := make([]int, n)
	for i := range p {
		p[i] = i
	}
	return p
}
