package ringdown

import (
	"math"

	"gonum.org/v1/gonum/mat"
)

// line fit: y = a + b·t by ordinary least squares, with standard errors
// inflated for serially correlated residuals.
type lineFit struct {
	a, b     float64 // intercept and slope
	sa, sb   float64 // their standard errors
	resid    float64 // residual standard deviation
	rho      float64 // lag-one autocorrelation of the residuals
	n        int     // number of points
	inflated float64 // variance inflation factor applied, (1+ρ)/(1−ρ)
}

// fitLine fits y = a + b·t by weighted least squares, weights w (nil: all
// one) (Draper & Smith, Applied Regression Analysis, 3rd ed., §1.4 and
// §9.2). The standard errors use the weighted residual variance and are
// inflated by (1+ρ)/(1−ρ), ρ the lag-one autocorrelation of the weighted
// residuals: the AR(1) effective-sample-size correction (common practice
// for serially correlated residuals; Wilks, Statistical Methods in the
// Atmospheric Sciences, §5.2, from memory). ok is false for fewer than three
// points, no spread in t, or weights that are not positive.
func fitLine(t, y, w []float64) (lineFit, bool) {
	n := len(t)
	if n < 3 || len(y) != n || (w != nil && len(w) != n) {
		return lineFit{}, false
	}
	wt := func(i int) float64 {
		if w == nil {
			return 1
		}
		return w[i]
	}
	var sw, mt, my float64
	for i := range t {
		wi := wt(i)
		if !(wi > 0) || bad(wi) {
			return lineFit{}, false
		}
		sw += wi
		mt += wi * t[i]
		my += wi * y[i]
	}
	mt /= sw
	my /= sw
	var stt, sty float64
	for i := range t {
		dt := t[i] - mt
		stt += wt(i) * dt * dt
		sty += wt(i) * dt * (y[i] - my)
	}
	if !(stt > 0) || bad(stt) {
		return lineFit{}, false
	}
	f := lineFit{n: n}
	f.b = sty / stt
	f.a = my - f.b*mt
	var ss, lag, prev float64
	for i := range t {
		r := (y[i] - f.a - f.b*t[i]) * math.Sqrt(wt(i))
		ss += r * r
		if i > 0 {
			lag += r * prev
		}
		prev = r
	}
	if ss > 0 {
		f.rho = lag / ss
	}
	f.inflated = inflation(f.rho, n)
	// Scale the weights to mean one so s² is a variance of one point.
	s2 := ss / float64(n-2) * float64(n) / sw
	f.resid = math.Sqrt(s2)
	f.sb = math.Sqrt(s2 / stt * sw / float64(n) * f.inflated)
	f.sa = math.Sqrt(s2 * (1/float64(n) + mt*mt/stt*sw/float64(n)) * f.inflated)
	ok := !bad(f.a) && !bad(f.b) && !bad(f.sa) && !bad(f.sb)
	return f, ok
}

// inflation returns the AR(1) variance inflation (1+ρ)/(1−ρ) for lag-one
// autocorrelation rho, bounded so that at least two effective points remain.
func inflation(rho float64, n int) float64 {
	rho = math.Max(0, rho)
	f := (1 + rho) / (1 - math.Min(rho, 0.999999))
	return math.Min(f, float64(n)/2)
}

// np is the number of parameters of the damped-sinusoid model.
const np = 6

// sineFit holds the result of fitting a damped sinusoid on a straight line
//
//	y(t) = e^(−σt) (a·sin ωt + b·cos ωt) + c + d·t
//
// to samples by Levenberg–Marquardt. The line takes up what detrending the
// whole record left behind (the decay itself has a small mean).
type sineFit struct {
	p        [np]float64     // a, b, σ [1/s], ω [rad/s], c
	cov      [np][np]float64 // covariance of p (inflated for correlated residuals)
	resid    float64         // residual standard deviation
	iters    int             // iterations used
	inflated float64         // variance inflation applied
	conv     bool            // converged
}

// amplitude returns √(a²+b²), the envelope at t = 0.
func (f sineFit) amplitude() float64 { return math.Hypot(f.p[0], f.p[1]) }

// phase returns φ in y = A e^(−σt) sin(ωt + φ) + c.
func (f sineFit) phase() float64 { return math.Atan2(f.p[1], f.p[0]) }

// fitDampedSine refines the start values p0 by Levenberg–Marquardt on the
// samples (t, y) (Marquardt, J. SIAM 11 (1963) 431; the damping λ scales the
// diagonal of JᵀJ). The covariance is s²(JᵀJ)⁻¹ at the solution, inflated by
// the AR(1) factor of the residuals as in fitLine.
func fitDampedSine(t, y []float64, p0 [np]float64) (sineFit, bool) {
	const (
		maxIter = 60
		tol     = 1e-10 // relative change of the sum of squares that ends the search
	)
	n := len(t)
	if n < 8 {
		return sineFit{}, false
	}
	p := p0
	lambda := 1e-3
	jtj, jtr, ss, ok := normalEq(t, y, p)
	if !ok {
		return sineFit{}, false
	}
	fit := sineFit{}
	for fit.iters = 0; fit.iters < maxIter; fit.iters++ {
		improved := false
		for range 12 {
			var a mat.SymDense
			a = *mat.NewSymDense(np, nil)
			for i := range np {
				for j := i; j < np; j++ {
					v := jtj[i][j]
					if i == j {
						v *= 1 + lambda
					}
					a.SetSym(i, j, v)
				}
			}
			var ch mat.Cholesky
			if !ch.Factorize(&a) {
				lambda *= 10
				continue
			}
			var dx mat.VecDense
			if err := ch.SolveVecTo(&dx, mat.NewVecDense(np, jtr[:])); err != nil {
				lambda *= 10
				continue
			}
			var q [np]float64
			for i := range q {
				q[i] = p[i] + dx.AtVec(i)
			}
			jtj2, jtr2, ss2, ok := normalEq(t, y, q)
			if ok && ss2 < ss {
				rel := (ss - ss2) / ss
				p, jtj, jtr, ss = q, jtj2, jtr2, ss2
				lambda = math.Max(lambda/10, 1e-12)
				improved = true
				if rel < tol {
					fit.conv = true
				}
				break
			}
			lambda *= 10
		}
		if !improved {
			// No step lowers the sum of squares: at a minimum to rounding.
			fit.conv = true
		}
		if fit.conv {
			break
		}
	}
	fit.p = p
	s2 := ss / float64(n-np)
	fit.resid = math.Sqrt(s2)
	// Residual autocorrelation for the inflation factor.
	var lag, prev, sum float64
	for i := range t {
		r := y[i] - model(p, t[i])
		sum += r * r
		if i > 0 {
			lag += r * prev
		}
		prev = r
	}
	rho := 0.0
	if sum > 0 {
		rho = lag / sum
	}
	fit.inflated = inflation(rho, n)
	a := mat.NewSymDense(np, nil)
	for i := range np {
		for j := i; j < np; j++ {
			a.SetSym(i, j, jtj[i][j])
		}
	}
	var ch mat.Cholesky
	if !ch.Factorize(a) {
		return fit, false
	}
	var inv mat.SymDense
	if err := ch.InverseTo(&inv); err != nil {
		return fit, false
	}
	for i := range np {
		for j := range np {
			fit.cov[i][j] = inv.At(i, j) * s2 * fit.inflated
		}
	}
	for _, v := range fit.p {
		if bad(v) {
			return fit, false
		}
	}
	return fit, fit.conv
}

// model evaluates the damped sinusoid with parameters p at t.
func model(p [np]float64, t float64) float64 {
	s, c := math.Sincos(p[3] * t)
	return math.Exp(-p[2]*t)*(p[0]*s+p[1]*c) + p[4] + p[5]*t
}

// normalEq returns JᵀJ (upper triangle), Jᵀr and the sum of squared
// residuals r = y − model for parameters p.
func normalEq(t, y []float64, p [np]float64) (jtj [np][np]float64, jtr [np]float64, ss float64, ok bool) {
	a, b, sig, om := p[0], p[1], p[2], p[3]
	var g [np]float64
	for i, ti := range t {
		e := math.Exp(-sig * ti)
		s, c := math.Sincos(om * ti)
		u := a*s + b*c
		v := a*c - b*s
		r := y[i] - (e*u + p[4] + p[5]*ti)
		g[0] = e * s
		g[1] = e * c
		g[2] = -ti * e * u
		g[3] = ti * e * v
		g[4] = 1
		g[5] = ti
		for j := range np {
			jtr[j] += g[j] * r
			for k := j; k < np; k++ {
				jtj[j][k] += g[j] * g[k]
			}
		}
		ss += r * r
	}
	for j := range np {
		for k := 0; k < j; k++ {
			jtj[j][k] = jtj[k][j]
		}
	}
	return jtj, jtr, ss, !bad(ss)
}
