package ringdown

// splineResample evaluates the natural cubic spline through (t, x) at the
// points grid; t is strictly increasing and grid lies within [t₀, tₙ₋₁].
// The spline's second derivatives come from the usual tridiagonal system
// (Burden & Faires, Numerical Analysis, §3.5, natural boundary conditions).
func splineResample(t, x, grid []float64) []float64 {
	n := len(t)
	out := make([]float64, len(grid))
	if n < 3 {
		for i := range out {
			out[i] = x[0]
		}
		return out
	}
	// Second derivatives m[i]; m[0] = m[n-1] = 0. Thomas algorithm.
	m := make([]float64, n)
	c := make([]float64, n) // modified super-diagonal
	d := make([]float64, n) // modified right-hand side
	for i := 1; i < n-1; i++ {
		h0, h1 := t[i]-t[i-1], t[i+1]-t[i]
		a, b, cc := h0, 2*(h0+h1), h1
		r := 6 * ((x[i+1]-x[i])/h1 - (x[i]-x[i-1])/h0)
		den := b - a*c[i-1]
		c[i] = cc / den
		d[i] = (r - a*d[i-1]) / den
	}
	for i := n - 2; i >= 1; i-- {
		m[i] = d[i] - c[i]*m[i+1]
	}
	k := 0
	for j, g := range grid {
		for k < n-2 && t[k+1] < g {
			k++
		}
		h := t[k+1] - t[k]
		a := (t[k+1] - g) / h
		b := (g - t[k]) / h
		out[j] = a*x[k] + b*x[k+1] + ((a*a*a-a)*m[k]+(b*b*b-b)*m[k+1])*h*h/6
	}
	return out
}
