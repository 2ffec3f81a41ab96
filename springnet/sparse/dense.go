package sparse

// Dense kernels on row-major blocks: element (i, j) of a block with
// leading dimension ld is x[i*ld+j].

// smallGemm is the flop count below which gemmNT uses plain loops rather
// than the packed multiply (whose packing costs more than it saves).
const smallGemm = 4 * 1024

// gemmNT sets C −= A·Bᵀ for A (r×k, lda), B (c×k, ldb), C (r×c, ldc);
// with lower set, only entries j ≤ i are required (others may be junk).
func (w *gemmWork) gemmNT(r, c, k int, a []float64, lda int, b []float64, ldb int, cc []float64, ldc int, lower bool) {
	if r == 0 || c == 0 || k == 0 {
		return
	}
	if r*c*k >= smallGemm {
		w.gemmPacked(r, c, k, a, lda, b, ldb, cc, ldc, lower)
		return
	}
	for i := 0; i < r; i++ {
		ai := a[i*lda : i*lda+k]
		nj := c
		if lower {
			nj = min(c, i+1)
		}
		ci := cc[i*ldc : i*ldc+nj]
		for j := range ci {
			bj := b[j*ldb : j*ldb+k]
			s := 0.0
			for t, v := range ai {
				s += v * bj[t]
			}
			ci[j] -= s
		}
	}
}

// solveBlock is the width of the sub-blocks of the panel's row solves.
const solveBlock = 8

// panelWidth is the number of pivots factorised together in partialLDLT.
const panelWidth = 96

// partialLDLT eliminates the first k of the m rows/columns of a
// symmetric front held as its first k columns f (m×k, row-major, lower
// part of the top k×k block) and the lower triangle of its trailing
// (m−k)×(m−k) block ub (row-major). Afterwards f holds the unit lower
// factor columns, d[:k] the pivots, and ub the Schur complement. w must hold at least max(panelWidth², k·panelWidth, (m−k)·k) values.
// Each pivot j is checked by pc.checkPivot(c0+j, ·, fw); an error stops the
// factorisation.
func partialLDLT(f, ub []float64, m, k int, d, w []float64, gw gemmPool, pc *Factor, fw *fworker, c0 int) error {
	ld := k
	for p0 := 0; p0 < k; p0 += panelWidth {
		p1 := min(p0+panelWidth, k)
		pb := p1 - p0
		// Diagonal block of the panel, unblocked (right-looking inside).
		for j := p0; j < p1; j++ {
			dj := f[j*ld+j]
			if err := pc.checkPivot(c0+j, dj, fw); err != nil {
				return err
			}
			d[j] = dj
			inv := 1 / dj
			for r := j + 1; r < p1; r++ {
				rr := f[r*ld:]
				lrj := rr[j] * inv
				if lrj == 0 {
					continue
				}
				for c := j + 1; c <= r; c++ {
					rr[c] -= lrj * f[c*ld+j]
				}
			}
			for r := j + 1; r < p1; r++ {
				f[r*ld+j] *= inv
			}
		}
		// W = L_panel-diag · D (pb×pb) for the row solves below.
		wd := w[:pb*pb]
		for j := p0; j < p1; j++ {
			for c := p0; c < j; c++ {
				wd[(j-p0)*pb+(c-p0)] = f[j*ld+c] * d[c]
			}
		}
		// Rows below the panel's diagonal block: solve row·(L11 D)ᵀ = row,
		// by substitution in sub-blocks of solveBlock columns, each
		// followed by a multiply updating the panel's later columns.
		for sb0 := 0; sb0 < pb; sb0 += solveBlock {
			sb1 := min(sb0+solveBlock, pb)
			for r := p1; r < m; r++ {
				rr := f[r*ld+p0 : r*ld+p1]
				for j := sb0; j < sb1; j++ {
					s := rr[j]
					wj := wd[j*pb+sb0 : j*pb+j]
					for c, v := range wj {
						s -= rr[sb0+c] * v
					}
					rr[j] = s / d[p0+j]
				}
			}
			if sb1 < pb && m > p1 {
				gw[0].gemmNT(m-p1, pb-sb1, sb1-sb0, f[p1*ld+p0+sb0:], ld, wd[sb1*pb+sb0:], pb, f[p1*ld+p0+sb1:], ld, false)
			}
		}
		if p1 == k {
			break
		}
		// Update the remaining pivot columns [p1, k) of rows [p1, m):
		// F[i, j] -= Σ_c L[i,c]·d_c·L[j,c]. W holds L[p1:k, panel]·D.
		nk := k - p1
		wp := w[:nk*pb]
		for j := 0; j < nk; j++ {
			src := f[(p1+j)*ld+p0 : (p1+j)*ld+p1]
			dst := wp[j*pb : (j+1)*pb]
			for c, v := range src {
				dst[c] = v * d[p0+c]
			}
		}
		gw.gemmNT(m-p1, nk, pb, f[p1*ld+p0:], ld, wp, pb, f[p1*ld+p1:], ld, true)
	}
	// Schur complement: F22 -= L21·D·L21ᵀ (lower triangle, row blocks).
	u := m - k
	if u == 0 || k == 0 {
		return nil
	}
	w2 := w[:u*k]
	for i := 0; i < u; i++ {
		src := f[(k+i)*ld : (k+i)*ld+k]
		dst := w2[i*k : (i+1)*k]
		for c, v := range src {
			dst[c] = v * d[c]
		}
	}
	gw.gemmNT(u, u, k, f[k*ld:], ld, w2, k, ub, u, true)
	return nil
}
