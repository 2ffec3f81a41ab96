package eigen

import (
	"errors"
	"fmt"
	"math"
	"sort"

	"github.com/trestle-go/trestle/springnet/sparse"
	"gonum.org/v1/gonum/mat"
)

// DenseOf returns a as a dense symmetric matrix (for small problems and
// tests).
func DenseOf(a *sparse.Matrix) *mat.SymDense {
	n := a.N()
	d := mat.NewSymDense(n, nil)
	for j := 0; j < n; j++ {
		rows, vals := a.Col(j)
		for p, i := range rows {
			d.SetSym(i, j, vals[p])
		}
	}
	return d
}

// Dense returns the n lowest eigenpairs of K·φ = λ·M·φ computed densely
// with gonum, in the same form as Lowest (M-orthonormal vectors, rigid-body
// flags, residuals). It reduces to a standard symmetric problem with the
// Cholesky factor L of M, L⁻¹·K·L⁻ᵀ·ψ = λ·ψ, when M is positive definite.
// When M has zero rows (massless DOF s) it first condenses them statically,
// K* = K_mm − K_ms·K_ss⁻¹·K_sm, solves K*·φ_m = λ·M_mm·φ_m the same way
// and recovers φ_s = −K_ss⁻¹·K_sm·φ_m; the infinite eigenvalues of the
// massless DOF are not returned. For any other singular M it uses the
// factor L of K − σM with σ = −10⁻⁶·tr(K)/tr(M): L⁻¹·M·L⁻ᵀ·ψ = ν·ψ,
// λ = σ + 1/ν, dropping ν ≈ 0 (accurate for the lower modes only). Each λ
// is then refined by the Rayleigh quotient φᵀKφ / φᵀMφ.
//
// The whole spectrum is computed, so no Sturm check is made: Checked is
// false and SturmCount 0. The cost is O(N³); use it for N up to a few
// hundred. If the pencil has fewer than n finite eigenvalues, Dense returns
// those with a *FewerModesError.
func Dense(K, M *mat.SymDense, n int) (*Result, error) {
	N := K.SymmetricDim()
	if err := checkDense(K, M, n, "Dense", "M"); err != nil {
		return nil, err
	}
	var trK, trM float64
	for i := 0; i < N; i++ {
		trK += K.At(i, i)
		trM += M.At(i, i)
	}
	if !(trM > 0) {
		return nil, errors.New("eigen: Dense: the mass matrix has no mass (tr M = 0)")
	}
	scale := trK / trM
	if !(scale > 0) {
		scale = 1
	}
	var lambdas []float64
	var vecs [][]float64
	var shift float64
	var err error
	var chM mat.Cholesky
	massless := zeroRows(M)
	switch {
	case chM.Factorize(M) && chM.Cond() < 1e12:
		lambdas, vecs, err = reduceByMass(K, &chM)
	case len(massless) > 0 && len(massless) < N:
		lambdas, vecs, err = condensed(K, M, massless)
	default:
		shift = -DefaultShiftFraction * scale
		lambdas, vecs, err = reduceByShiftedK(K, M, shift)
	}
	if err != nil {
		return nil, err
	}
	return denseResult(K, M, lambdas, vecs, n, shift, scale, true)
}

// reduceByMass solves K·φ = λ·M·φ with the Cholesky factor of M.
func reduceByMass(K *mat.SymDense, chM *mat.Cholesky) ([]float64, [][]float64, error) {
	N := K.SymmetricDim()
	linv := choleskyInverse(chM)
	var c mat.Dense
	ld := mat.DenseCopyOf(linv)
	c.Product(ld, K, ld.T())
	vals, z, err := eigSym(&c)
	if err != nil {
		return nil, nil, err
	}
	var vecs [][]float64
	for j := range vals {
		phi := make([]float64, N)
		mat.NewVecDense(N, phi).MulVec(linv.T(), z.ColView(j))
		vecs = append(vecs, phi)
	}
	return vals, vecs, nil
}

// zeroRows returns the indices of the rows of M that are entirely zero
// (massless DOF).
func zeroRows(M *mat.SymDense) []int {
	N := M.SymmetricDim()
	var z []int
	for i := 0; i < N; i++ {
		zero := true
		for j := 0; j < N && zero; j++ {
			zero = M.At(i, j) == 0
		}
		if zero {
			z = append(z, i)
		}
	}
	return z
}

// condensed solves the pencil by static condensation of the massless DOF
// s (zero rows of M): K* = K_mm − K_ms·K_ss⁻¹·K_sm, then K*·φ_m = λ·M_mm·φ_m
// by the Cholesky factor of M_mm, and φ_s = −K_ss⁻¹·K_sm·φ_m.
func condensed(K, M *mat.SymDense, s []int) ([]float64, [][]float64, error) {
	N := K.SymmetricDim()
	isS := make([]bool, N)
	for _, i := range s {
		isS[i] = true
	}
	var m []int
	for i := 0; i < N; i++ {
		if !isS[i] {
			m = append(m, i)
		}
	}
	sub := func(a *mat.SymDense, r, c []int) *mat.Dense {
		d := mat.NewDense(len(r), len(c), nil)
		for i, ri := range r {
			for j, cj := range c {
				d.Set(i, j, a.At(ri, cj))
			}
		}
		return d
	}
	kss := mat.NewSymDense(len(s), nil)
	for i, ri := range s {
		for j := i; j < len(s); j++ {
			kss.SetSym(i, j, K.At(ri, s[j]))
		}
	}
	var chS mat.Cholesky
	if !chS.Factorize(kss) {
		return nil, nil, errors.New("eigen: Dense: the stiffness of the massless DOF is singular: a mechanism without mass")
	}
	ksm := sub(K, s, m)
	var x mat.Dense // K_ss⁻¹·K_sm
	if err := chS.SolveTo(&x, ksm); err != nil {
		return nil, nil, fmt.Errorf("eigen: Dense: condensing massless DOF: %w", err)
	}
	var kc mat.Dense
	kc.Mul(ksm.T(), &x)
	kstar := mat.NewSymDense(len(m), nil)
	mstar := mat.NewSymDense(len(m), nil)
	for i, ri := range m {
		for j := i; j < len(m); j++ {
			kstar.SetSym(i, j, K.At(ri, m[j])-0.5*(kc.At(i, j)+kc.At(j, i)))
			mstar.SetSym(i, j, M.At(ri, m[j]))
		}
	}
	var chM mat.Cholesky
	if !chM.Factorize(mstar) {
		return nil, nil, errors.New("eigen: Dense: the mass matrix of the DOF that carry mass is not positive definite")
	}
	vals, vm, err := reduceByMass(kstar, &chM)
	if err != nil {
		return nil, nil, err
	}
	var vecs [][]float64
	for _, v := range vm {
		phi := make([]float64, N)
		for i, ri := range m {
			phi[ri] = v[i]
		}
		for i, si := range s {
			var d float64
			for j := range m {
				d -= x.At(i, j) * v[j]
			}
			phi[si] = d
		}
		vecs = append(vecs, phi)
	}
	return vals, vecs, nil
}

// reduceByShiftedK solves the pencil with the Cholesky factor L of
// K − σM: L⁻¹·M·L⁻ᵀ·ψ = ν·ψ, λ = σ + 1/ν, dropping ν ≈ 0 (infinite λ).
func reduceByShiftedK(K, M *mat.SymDense, shift float64) ([]float64, [][]float64, error) {
	N := K.SymmetricDim()
	a := mat.NewSymDense(N, nil)
	a.AddSym(K, scaledSym(M, -shift))
	var chA mat.Cholesky
	if !chA.Factorize(a) {
		return nil, nil, fmt.Errorf("eigen: Dense: K − σM is not positive definite at σ = %.6g: a mechanism without mass, or K or M is not semidefinite", shift)
	}
	linv := choleskyInverse(&chA)
	var c mat.Dense
	ld := mat.DenseCopyOf(linv)
	c.Product(ld, M, ld.T())
	vals, z, err := eigSym(&c)
	if err != nil {
		return nil, nil, err
	}
	var lambdas []float64
	var vecs [][]float64
	numax := vals[len(vals)-1]
	for j := len(vals) - 1; j >= 0; j-- {
		nu := vals[j]
		if !(nu > 1e-12*numax) {
			break // infinite eigenvalues (massless DOF)
		}
		phi := make([]float64, N)
		v := mat.NewVecDense(N, phi)
		v.MulVec(linv.T(), z.ColView(j))
		v.ScaleVec(1/math.Sqrt(nu), v) // φᵀ(K−σM)φ = 1/ν ⇒ φᵀMφ = 1
		lambdas = append(lambdas, shift+1/nu)
		vecs = append(vecs, phi)
	}
	return lambdas, vecs, nil
}

// DenseBuckling returns the n lowest positive load factors of
// (K + λ·Kg)·φ = 0 computed densely: with the Cholesky factor L of K
// (which must be positive definite), L⁻¹·Kg·L⁻ᵀ·ψ = μ·ψ, λ = −1/μ for
// μ < 0, φ = L⁻ᵀψ (K-orthonormal), λ refined by −φᵀKφ / φᵀKgφ.
func DenseBuckling(K, Kg *mat.SymDense, n int) (*Result, error) {
	if err := checkDense(K, Kg, n, "DenseBuckling", "Kg"); err != nil {
		return nil, err
	}
	N := K.SymmetricDim()
	var ch mat.Cholesky
	if !ch.Factorize(K) {
		return nil, errors.New("eigen: DenseBuckling: K is not positive definite (an unsupported mechanism)")
	}
	linv := choleskyInverse(&ch)
	var c mat.Dense
	ld := mat.DenseCopyOf(linv)
	c.Product(ld, Kg, ld.T())
	vals, z, err := eigSym(&c)
	if err != nil {
		return nil, err
	}
	var mu float64
	for _, v := range vals {
		mu = math.Max(mu, math.Abs(v))
	}
	var lambdas []float64
	var vecs [][]float64
	for j, v := range vals { // ascending μ: most negative first
		if !(v < -1e-12*mu) {
			break
		}
		phi := make([]float64, N)
		mat.NewVecDense(N, phi).MulVec(linv.T(), z.ColView(j))
		lambdas = append(lambdas, -1/v)
		vecs = append(vecs, phi)
	}
	return denseResult(K, Kg, lambdas, vecs, n, 0, 1, false)
}

func checkDense(K, B *mat.SymDense, n int, fn, bname string) error {
	if K == nil || B == nil {
		return fmt.Errorf("eigen: %s: nil matrix", fn)
	}
	N := K.SymmetricDim()
	if B.SymmetricDim() != N {
		return fmt.Errorf("eigen: %s: K is %d×%d but %s is %d×%d", fn, N, N, bname, B.SymmetricDim(), B.SymmetricDim())
	}
	if n < 1 || n > N {
		return fmt.Errorf("eigen: %s: asked for %d modes of a problem of order %d", fn, n, N)
	}
	for i := 0; i < N; i++ {
		for j := 0; j <= i; j++ {
			for _, x := range [2]float64{K.At(i, j), B.At(i, j)} {
				if math.IsNaN(x) || math.IsInf(x, 0) {
					return fmt.Errorf("eigen: %s: entry (%d, %d) is %v", fn, i, j, x)
				}
			}
		}
	}
	return nil
}

func scaledSym(a *mat.SymDense, f float64) *mat.SymDense {
	var s mat.SymDense
	s.ScaleSym(f, a)
	return &s
}

// choleskyInverse returns L⁻¹ for the factor A = L·Lᵀ.
func choleskyInverse(ch *mat.Cholesky) *mat.TriDense {
	var l mat.TriDense
	ch.LTo(&l)
	var inv mat.TriDense
	if err := inv.InverseTri(&l); err != nil {
		// A condition warning only: the inverse is still computed.
		_ = err
	}
	return &inv
}

// eigSym returns the eigenvalues (ascending) and eigenvectors of the
// symmetric part of c.
func eigSym(c *mat.Dense) ([]float64, *mat.Dense, error) {
	n, _ := c.Dims()
	s := mat.NewSymDense(n, nil)
	for i := 0; i < n; i++ {
		for j := i; j < n; j++ {
			s.SetSym(i, j, 0.5*(c.At(i, j)+c.At(j, i)))
		}
	}
	var es mat.EigenSym
	if !es.Factorize(s, true) {
		return nil, nil, errors.New("eigen: dense symmetric eigensolver did not converge")
	}
	var z mat.Dense
	es.VectorsTo(&z)
	return es.Values(nil), &z, nil
}

// denseResult refines, checks and sorts dense eigenpairs and keeps n.
func denseResult(K, B *mat.SymDense, lambdas []float64, vecs [][]float64, n int, shift, scale float64, vib bool) (*Result, error) {
	N := K.SymmetricDim()
	knorm, bnorm := denseNorm1(K), denseNorm1(B)
	res := &Result{n: N, Shift: shift}
	kphi, bphi := mat.NewVecDense(N, nil), mat.NewVecDense(N, nil)
	r := mat.NewVecDense(N, nil)
	for i, phi := range vecs {
		v := mat.NewVecDense(N, phi)
		kphi.MulVec(K, v)
		bphi.MulVec(B, v)
		pk, pb := mat.Dot(v, kphi), mat.Dot(v, bphi)
		var lam, norm float64
		if vib {
			lam, norm = pk/pb, math.Sqrt(pb)
			r.AddScaledVec(kphi, -lam, bphi)
		} else {
			lam, norm = -pk/pb, math.Sqrt(pk)
			r.AddScaledVec(kphi, lam, bphi)
		}
		if !(norm > 0) || math.IsNaN(lam) || math.IsInf(lam, 0) {
			return nil, &ResidualError{Mode: i, Value: lambdas[i], Residual: math.Inf(1), Tol: DefaultResidualTol}
		}
		v.ScaleVec(1/norm, v)
		rel := mat.Norm(r, 2) / ((knorm + math.Abs(lam)*bnorm) * mat.Norm(v, 2) * norm)
		lambdas[i] = lam
		res.Residuals = append(res.Residuals, rel)
		res.rigid = append(res.rigid, vib && math.Abs(lam) <= DefaultRigidTol*scale)
	}
	idx := make([]int, len(lambdas))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return lambdas[idx[a]] < lambdas[idx[b]] })
	if len(idx) > n {
		idx = idx[:n]
	}
	out := &Result{n: N, Shift: shift}
	for _, i := range idx {
		if !(res.Residuals[i] <= DefaultResidualTol) {
			return nil, &ResidualError{Mode: len(out.Values), Value: lambdas[i], Residual: res.Residuals[i], Tol: DefaultResidualTol}
		}
		out.Values = append(out.Values, lambdas[i])
		out.Residuals = append(out.Residuals, res.Residuals[i])
		out.vectors = append(out.vectors, vecs[i])
		out.rigid = append(out.rigid, res.rigid[i])
	}
	if len(out.Values) < n {
		return out, &FewerModesError{Want: n, Found: len(out.Values)}
	}
	return out, nil
}

func denseNorm1(a *mat.SymDense) float64 {
	n := a.SymmetricDim()
	var m float64
	for j := 0; j < n; j++ {
		var s float64
		for i := 0; i < n; i++ {
			s += math.Abs(a.At(i, j))
		}
		m = math.Max(m, s)
	}
	return m
}
