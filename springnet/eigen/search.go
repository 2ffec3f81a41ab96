package eigen

import (
	"errors"
	"math"
	"sort"

	"github.com/trestle-go/trestle/springnet/sparse"
	"gonum.org/v1/gonum/floats"
)

// problem describes one spectral transformation for the common driver.
// The pencil is K + α·B2 (B2 = M for vibration, Kg for buckling); an
// eigenvalue λ corresponds to the singular pencil at α = alpha(λ).
type problem struct {
	what   string         // name of the shifted matrix, for errors
	pc     *pencil        // K + α·B2
	kmat   *sparse.Matrix // K
	b2     *sparse.Matrix // M or Kg
	op     operator
	purify bool
	// toLambda maps a Ritz value θ of OP to the eigenvalue λ.
	toLambda func(theta float64) float64
	// prio orders Ritz values, most wanted first.
	prio func(theta float64) float64
	// admissible reports whether a Ritz value stands for a wanted kind of
	// eigenvalue (finite; for buckling, a positive load factor).
	admissible func(theta float64) bool
	// alpha returns the α at which K + α·B2 is singular for eigenvalue λ.
	alpha func(lambda float64) float64
	// shift is the λ of the Lanczos factorisation and below its count of
	// eigenvalues less than shift.
	shift float64
	below int
	// scale is the eigenvalue scale, used for gaps and rigid flags.
	scale float64
	// zero is the size below which an eigenvalue counts as zero (rigid
	// body); the Sturm shift keeps at least that distance, so that a
	// rigid-body eigenvalue computed as a tiny negative number is still
	// counted with its exact value 0.
	zero float64
}

// maxContinuations bounds the restarts of the search after a Sturm check
// found missed modes.
const maxContinuations = 8

// pair is a converged Ritz pair, by Ritz index.
type pair struct {
	lambda float64
	j      int
}

// sturm is the outcome of a Sturm check on [lo, hi).
type sturm struct {
	lo, hi  float64
	count   int
	found   int
	checked bool
}

// factorAt factorises the pencil at the eigenvalue-shift lam, moving lam
// slightly (towards the side given by dir, within (limLo, limHi)) when the
// matrix is singular or its factorisation unstable there. It returns the
// shift used and the number of negative pivots.
func (pb *problem) factorAt(lam, limLo, limHi float64) (float64, int, error) {
	// Fractions of the distance to the limits to try after lam itself.
	tries := []float64{0, 0.5, -0.5, 0.25, -0.25, 0.75, -0.75, 0.1, -0.1}
	var lastErr error
	failCol, fails := -1, 0
	for _, t := range tries {
		x := lam
		switch {
		case t > 0 && !math.IsInf(limHi, 1):
			x = lam + t*(limHi-lam)
		case t > 0:
			x = lam + t*math.Max(math.Abs(lam), pb.scale*1e-6)
		case t < 0 && !math.IsInf(limLo, -1):
			x = lam + t*(lam-limLo)
		case t < 0:
			x = lam + t*math.Max(math.Abs(lam), pb.scale*1e-6)
		}
		err := pb.pc.factor(pb.alpha(x))
		if err == nil {
			neg, _ := pb.pc.f.Inertia()
			return x, neg, nil
		}
		var pe *sparse.PivotError
		if !errors.As(err, &pe) && !errors.Is(err, errUnstable) {
			return 0, 0, err
		}
		lastErr = err
		if pe != nil {
			lastErr = &SingularError{Col: pe.Col, Shift: x, What: pb.what}
			// The same column failing at three shifts is singular at
			// every shift: a DOF with neither stiffness nor mass.
			if pe.Col == failCol {
				fails++
			} else {
				failCol, fails = pe.Col, 1
			}
			if fails == 3 {
				break
			}
		}
	}
	return 0, 0, lastErr
}

// run searches for the n most wanted eigenpairs and checks them with the
// Sturm count; it returns the chosen pairs in ascending order of λ.
func (pb *problem) run(kr *krylov, n int, st *Settings) ([]pair, *ritz, sturm, error) {
	want := n
	missing := -1 // eigenvalues missed at the previous check
	for attempt := 0; ; attempt++ {
		rz, err := kr.iterate(want, st.MaxIter, st.Tol, pb.prio)
		if err != nil {
			return nil, nil, sturm{}, err
		}
		var all []pair // converged, admissible, in priority order
		for _, j := range rz.order {
			if rz.conv[j] && pb.admissible(rz.theta[j]) {
				all = append(all, pair{pb.toLambda(rz.theta[j]), j})
			}
		}
		sel := append([]pair(nil), all[:min(n, len(all))]...)
		if len(sel) == 0 {
			return nil, rz, sturm{}, &FewerModesError{Want: n, Found: 0}
		}
		sort.Slice(all, func(a, b int) bool { return all[a].lambda < all[b].lambda })
		lo, hi := math.Inf(1), math.Inf(-1)
		for _, p := range sel {
			lo, hi = math.Min(lo, p.lambda), math.Max(hi, p.lambda)
		}
		if pb.below > 0 {
			// Eigenvalues lie on both sides of the shift: to prove the
			// chosen ones are the nearest, the check covers every
			// eigenvalue within their largest distance d of the shift.
			d := math.Max(hi-pb.shift, pb.shift-lo)
			lo, hi = math.Min(lo, pb.shift-d), math.Max(hi, pb.shift+d)
		}
		chk, err := pb.check(all, lo, hi)
		if err != nil {
			return nil, nil, sturm{}, err
		}
		// Each continuation finds at least one more copy of a repeated
		// eigenvalue (up to a block); give up when one makes no progress.
		stuck := missing >= 0 && chk.count-chk.found >= missing
		missing = chk.count - chk.found
		if chk.count <= chk.found || stuck || attempt >= maxContinuations {
			sort.Slice(sel, func(a, b int) bool { return sel[a].lambda < sel[b].lambda })
			if chk.count != chk.found {
				return nil, nil, chk, &MissedModesError{Low: chk.lo, High: chk.hi, Count: chk.count, Found: chk.found}
			}
			chk.checked = true
			return sel, rz, chk, nil
		}
		// Modes were missed (typically an eigenvalue of higher
		// multiplicity than the block size): lock what has converged and
		// search its complement until the count is met.
		if _, _, err := pb.factorAt(pb.shift, math.Inf(-1), math.Inf(1)); err != nil {
			return nil, nil, sturm{}, err
		}
		var keep []int
		for _, j := range rz.order {
			if rz.conv[j] && len(keep) < kr.mmax-kr.p {
				keep = append(keep, j)
			}
		}
		if err := kr.restart(rz, keep, true); err != nil {
			return nil, nil, sturm{}, err
		}
		want = len(keep) + (chk.count - chk.found)
		if want > kr.mmax-kr.p {
			return nil, nil, chk, &MissedModesError{Low: chk.lo, High: chk.hi, Count: chk.count, Found: chk.found}
		}
	}
}

// check runs the Sturm count on an interval [σ₁, σ₂) holding the
// eigenvalues lo..hi, with σ₂ in a gap of the converged spectrum all
// (sorted) above hi and σ₁ = shift when nothing lies below the shift.
func (pb *problem) check(all []pair, lo, hi float64) (sturm, error) {
	var c sturm
	// σ₂: above hi by a margin, but below the next converged eigenvalue
	// that is clearly separate; an eigenvalue closer than the margin joins
	// the interval.
	delta := math.Max(sturmMargin*math.Max(hi-pb.shift, math.Abs(hi)), pb.zero)
	if delta == 0 {
		delta = sturmMargin * pb.scale
	}
	top := hi
	next := math.Inf(1)
	for _, p := range all {
		if p.lambda <= top {
			continue
		}
		if p.lambda-top <= 1e-6*delta {
			top = p.lambda // a numerically repeated eigenvalue
			continue
		}
		next = p.lambda
		break
	}
	sigma2 := top + delta
	if sigma2 >= next {
		sigma2 = 0.5 * (top + next)
	}
	limHi := math.Min(next, top+2*delta)
	sigma2, c2, err := pb.factorAt(sigma2, top, limHi)
	if err != nil {
		return c, err
	}
	sigma1, c1 := pb.shift, pb.below
	if pb.below > 0 {
		// Eigenvalues lie below the shift: bound the interval below lo.
		bot, prev := lo, math.Inf(-1)
		for i := len(all) - 1; i >= 0; i-- {
			p := all[i]
			if p.lambda >= bot {
				continue
			}
			if bot-p.lambda <= 1e-6*delta {
				bot = p.lambda
				continue
			}
			prev = p.lambda
			break
		}
		sigma1 = bot - delta
		if sigma1 <= prev {
			sigma1 = 0.5 * (bot + prev)
		}
		limLo := math.Max(prev, bot-2*delta)
		if sigma1, c1, err = pb.factorAt(sigma1, limLo, bot); err != nil {
			return c, err
		}
	}
	c.lo, c.hi, c.count = sigma1, sigma2, c2-c1
	for _, p := range all {
		if p.lambda >= sigma1 && p.lambda < sigma2 {
			c.found++
		}
	}
	return c, nil
}

// finish extracts, normalises and checks the chosen eigenpairs.
func (pb *problem) finish(kr *krylov, rz *ritz, sel []pair, chk sturm, st *Settings) (*Result, error) {
	n := kr.n
	res := &Result{
		n: n, Shift: pb.shift, SturmCount: chk.count, SturmLow: chk.lo, SturmShift: chk.hi, Checked: chk.checked,
		Solves: kr.solves, Factorizations: pb.pc.count,
	}
	knorm, bnorm := norm1(pb.kmat), norm1(pb.b2)
	kphi := make([]float64, n)
	bphi := make([]float64, n)
	r := make([]float64, n)
	for i, p := range sel {
		phi := make([]float64, n)
		kr.vector(phi, rz, p.j, pb.purify)
		if pb.purify && rz.exact {
			// No residual block to purify with: apply OP explicitly,
			// φ = OP·y/θ, which puts the massless DOF in static
			// equilibrium with the others.
			kr.op.bmul(bphi, phi)
			if err := kr.op.apply(kphi, phi, bphi); err != nil {
				return nil, err
			}
			res.Solves++
			for r := range phi {
				phi[r] = kphi[r] / rz.theta[p.j]
			}
		}
		pb.kmat.MulVec(kphi, phi)
		pb.b2.MulVec(bphi, phi)
		phiK, phiB := floats.Dot(phi, kphi), floats.Dot(phi, bphi)
		var lam, norm float64
		if pb.purify { // vibration: M-normalise, λ = φᵀKφ / φᵀMφ
			norm = math.Sqrt(phiB)
			lam = phiK / phiB
			copy(r, kphi)
			floats.AddScaled(r, -lam, bphi) // K·φ − λ·M·φ
		} else { // buckling: K-normalise, λ = −φᵀKφ / φᵀKgφ
			norm = math.Sqrt(phiK)
			lam = -phiK / phiB
			copy(r, kphi)
			floats.AddScaled(r, lam, bphi) // K·φ + λ·Kg·φ
		}
		if !(norm > 0) || math.IsInf(lam, 0) || math.IsNaN(lam) {
			return nil, &ResidualError{Mode: i, Value: p.lambda, Residual: math.Inf(1), Tol: st.ResidualTol}
		}
		floats.Scale(1/norm, phi)
		rel := floats.Norm(r, 2) / ((knorm + math.Abs(lam)*bnorm) * floats.Norm(phi, 2) * norm)
		if !(rel <= st.ResidualTol) {
			return nil, &ResidualError{Mode: i, Value: lam, Residual: rel, Tol: st.ResidualTol}
		}
		res.Values = append(res.Values, lam)
		res.Residuals = append(res.Residuals, rel)
		res.vectors = append(res.vectors, phi)
		res.rigid = append(res.rigid, pb.purify && math.Abs(lam) <= st.RigidTol*pb.scale)
	}
	// The Rayleigh quotients may reorder eigenvalues within round-off.
	idx := make([]int, len(res.Values))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return res.Values[idx[a]] < res.Values[idx[b]] })
	out := *res
	out.Values, out.Residuals, out.vectors, out.rigid = nil, nil, nil, nil
	for _, i := range idx {
		out.Values = append(out.Values, res.Values[i])
		out.Residuals = append(out.Residuals, res.Residuals[i])
		out.vectors = append(out.vectors, res.vectors[i])
		out.rigid = append(out.rigid, res.rigid[i])
	}
	return &out, nil
}
