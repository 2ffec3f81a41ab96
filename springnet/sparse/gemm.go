package sparse

// Packed matrix multiply for the dense kernels: C −= A·Bᵀ on row-major
// blocks, in the blocking scheme of Goto and van de Geijn ("Anatomy of
// high-performance matrix multiplication", ACM TOMS 34(3), 2008) with a
// 6×8 register tile.

const (
	gemmKC = 256  // depth of a packed panel
	gemmMC = 144  // rows of A packed at a time (a multiple of gemmMR)
	gemmMR = 6    // rows of a register tile
	gemmNC = 2048 // rows of B packed at a time
)

// gemmWork is the packing workspace of one goroutine. Its panels grow
// to what the multiplies it has run needed (at most gemmMC×gemmKC and
// gemmNC×gemmKC), so a small problem does not pay for (allocate and
// clear) the 4.5 MB of full-size panels, and a refactorisation of the
// same pattern, which runs the same multiplies, allocates nothing.
type gemmWork struct {
	ap, bp []float64
	tile   [gemmMR * 8]float64
}

func newGemmWork() *gemmWork { return &gemmWork{} }

// reserve grows the packed panels to what gemmPacked needs for an r×c×k
// multiply.
func (w *gemmWork) reserve(r, c, k int) {
	kc := min(gemmKC, k)
	if na := (min(gemmMC, r) + gemmMR - 1) / gemmMR * gemmMR * kc; len(w.ap) < na {
		w.ap = make([]float64, na)
	}
	if nb := (min(gemmNC, c) + 7) / 8 * 8 * kc; len(w.bp) < nb {
		w.bp = make([]float64, nb)
	}
}

// kern6x8go is the portable 6×8 tile kernel.
func kern6x8go(k int, a, b, c []float64, ldc int) {
	var acc [6][8]float64
	for t := 0; t < k; t++ {
		at := a[6*t : 6*t+6]
		bt := b[8*t : 8*t+8]
		for i := 0; i < 6; i++ {
			ai := at[i]
			r := &acc[i]
			for j := 0; j < 8; j++ {
				r[j] += ai * bt[j]
			}
		}
	}
	for i := 0; i < 6; i++ {
		ci := c[i*ldc : i*ldc+8]
		for j := range ci {
			ci[j] -= acc[i][j]
		}
	}
}

// gemmPacked sets C −= A·Bᵀ for A (r×k), B (c×k), C (r×c). With lower
// set, only the tiles that reach the lower triangle (j ≤ i) are computed;
// entries above the diagonal may then be overwritten with junk.
func (w *gemmWork) gemmPacked(r, c, k int, a []float64, lda int, b []float64, ldb int, cc []float64, ldc int, lower bool) {
	w.reserve(r, c, k)
	for jc := 0; jc < c; jc += gemmNC {
		nc := min(gemmNC, c-jc)
		if lower && jc >= r {
			break
		}
		for kc0 := 0; kc0 < k; kc0 += gemmKC {
			kc := min(gemmKC, k-kc0)
			// Pack B[jc:jc+nc, kc0:kc0+kc] in strips of 8 rows.
			nstripB := (nc + 7) / 8
			for s := 0; s < nstripB; s++ {
				dst := w.bp[s*8*kc : (s+1)*8*kc]
				j0 := jc + 8*s
				nj := min(8, jc+nc-j0)
				for jj := 0; jj < nj; jj++ {
					src := b[(j0+jj)*ldb+kc0 : (j0+jj)*ldb+kc0+kc]
					for t, v := range src {
						dst[8*t+jj] = v
					}
				}
				for jj := nj; jj < 8; jj++ {
					for t := 0; t < kc; t++ {
						dst[8*t+jj] = 0
					}
				}
			}
			i0 := 0
			if lower {
				i0 = jc / gemmMR * gemmMR // rows above jc have no lower-triangle tile here
			}
			for ic := i0; ic < r; ic += gemmMC {
				mc := min(gemmMC, r-ic)
				nstripA := (mc + gemmMR - 1) / gemmMR
				for s := 0; s < nstripA; s++ {
					dst := w.ap[s*gemmMR*kc : (s+1)*gemmMR*kc]
					ia := ic + gemmMR*s
					ni := min(gemmMR, ic+mc-ia)
					for ii := 0; ii < ni; ii++ {
						src := a[(ia+ii)*lda+kc0 : (ia+ii)*lda+kc0+kc]
						for t, v := range src {
							dst[gemmMR*t+ii] = v
						}
					}
					for ii := ni; ii < gemmMR; ii++ {
						for t := 0; t < kc; t++ {
							dst[gemmMR*t+ii] = 0
						}
					}
				}
				for sb := 0; sb < nstripB; sb++ {
					j0 := jc + 8*sb
					nj := min(8, jc+nc-j0)
					bs := w.bp[sb*8*kc : (sb+1)*8*kc]
					for sa := 0; sa < nstripA; sa++ {
						ia := ic + gemmMR*sa
						if lower && j0 > ia+gemmMR-1 {
							continue
						}
						ni := min(gemmMR, ic+mc-ia)
						as := w.ap[sa*gemmMR*kc : (sa+1)*gemmMR*kc]
						if ni == gemmMR && nj == 8 {
							kern6x8(kc, as, bs, cc[ia*ldc+j0:], ldc)
							continue
						}
						t := w.tile[:]
						clear(t)
						kern6x8(kc, as, bs, t, 8)
						for ii := 0; ii < ni; ii++ {
							row := cc[(ia+ii)*ldc+j0 : (ia+ii)*ldc+j0+nj]
							for jj := range row {
								row[jj] += t[ii*8+jj]
							}
						}
					}
				}
			}
		}
	}
}
