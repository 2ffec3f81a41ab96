package springnet

import (
	"errors"
	"math"

	"github.com/trestle-go/trestle/springnet/sparse"
)

// Solver solves static problems of a Model and keeps its sparse symbolic
// analysis (ordering and elimination structure) while the sparsity pattern
// stays the same, so a sweep over material levels (or over feet in and out
// of contact) only refactorises numerically. The zero Solver is ready to
// use. A Solver is not safe for concurrent use.
type Solver struct {
	f        sparse.Factor
	b        *sparse.Builder
	colPtr   []int
	rowIdx   []int
	hasPat   bool
	k        *sparse.Matrix
	analyses int // symbolic analyses done (for tests of reuse)
}

// factor assembles K for nt and factorises it, analysing the pattern only
// when it changed. A failed pivot becomes a *MechanismError with its
// free motion described.
func (s *Solver) factor(nt *net) error { return s.factorAs(nt, true) }

// factorAs is factor; with describe false the *MechanismError leaves
// Motion empty (describeMotion fills it in later, while s.k is the
// failed matrix). Describing the motion costs a second factorisation, a
// waste in the contact search, where most failures are tipping.
func (s *Solver) factorAs(nt *net, describe bool) error {
	if s.b == nil {
		s.b = sparse.NewBuilder(0)
	}
	s.k = nt.assemble(s.b)
	if !s.samePattern(s.k) {
		if err := s.f.Analyze(s.k, &sparse.Options{Coords: nt.dm.coords}); err != nil {
			return err
		}
		s.keepPattern(s.k)
		s.analyses++
	}
	err := s.f.Factorize(s.k)
	var pe *sparse.PivotError
	if errors.As(err, &pe) {
		me := nt.mechanism(pe)
		if describe {
			s.describeMotion(nt, me)
		}
		return me
	}
	return err
}

func (s *Solver) samePattern(a *sparse.Matrix) bool {
	if !s.hasPat || len(s.colPtr) != a.N()+1 || len(s.rowIdx) != a.NNZ() {
		return false
	}
	p := 0
	for j := 0; j < a.N(); j++ {
		rows, _ := a.Col(j)
		if s.colPtr[j] != p {
			return false
		}
		for _, r := range rows {
			if s.rowIdx[p] != r {
				return false
			}
			p++
		}
	}
	return true
}

func (s *Solver) keepPattern(a *sparse.Matrix) {
	s.colPtr = s.colPtr[:0]
	s.rowIdx = s.rowIdx[:0]
	for j := 0; j < a.N(); j++ {
		s.colPtr = append(s.colPtr, len(s.rowIdx))
		rows, _ := a.Col(j)
		s.rowIdx = append(s.rowIdx, rows...)
	}
	s.colPtr = append(s.colPtr, len(s.rowIdx))
	s.hasPat = true
}

// solve solves K·x = b with the current factorisation, with one step of
// iterative refinement when the residual is not already tiny, and returns
// the relative residual.
func (s *Solver) solve(x, b []float64) float64 {
	if len(b) == 0 {
		return 0
	}
	s.f.Solve(x, b)
	res := sparse.Residual(s.k, x, b)
	if res > 1e-13 && finiteAll(x) {
		r := make([]float64, len(b))
		s.k.MulVec(r, x)
		for i := range r {
			r[i] = b[i] - r[i]
		}
		dx := make([]float64, len(b))
		s.f.Solve(dx, r)
		y := make([]float64, len(b))
		for i := range y {
			y[i] = x[i] + dx[i]
		}
		if r2 := sparse.Residual(s.k, y, b); r2 < res {
			copy(x, y)
			res = r2
		}
	}
	if math.IsNaN(res) || !finiteAll(x) {
		return math.Inf(1)
	}
	return res
}
