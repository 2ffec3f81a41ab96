package springnet

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet/eigen"
)

// SweepSettings controls Sweep. A nil *SweepSettings means defaults; zero
// fields mean defaults.
type SweepSettings struct {
	// Places are where mount stiffness is measured (NodeID, GroupID or
	// MountID); nil means every mount of the model, in mount order, and
	// an empty slice none.
	Places []Place
	// Member chooses the effective-length factors of the member checks
	// (MembersTo); nil: defaults. Utilisation does not depend on it.
	Member *MemberSettings
	// Buckling also runs the whole-frame buckling analysis (Buckling)
	// of every case at every level and reports the lowest positive load
	// factor.
	Buckling bool
	// Modes asks for the lowest Modes natural frequencies at every level
	// (Modes at that Level); 0: none. Rigid-body modes count, at 0 Hz.
	Modes int
	// ModeMass picks the mass matrix of bars and beams for Modes; the
	// zero value is Consistent.
	ModeMass MassMatrix
}

// Spread is one governing number over the material levels.
//
// ByLevel holds its value at each level in the order of materials.Levels
// (Low, Nominal, High material values). Range is the spread of those
// values: Range.Low the smallest, Range.High the largest, Range.Nominal
// the value at Nominal. A stiffness rises with E, so its smallest value
// is at the Low level, but a displacement falls, and a utilisation or a
// buckling factor of a statically indeterminate stand (where stiffer
// parts draw more load) can move either way or not at all; Range is
// therefore the min and max over the three levels, not the values at the
// Low and High levels. Design to the worse end of Range.
type Spread struct {
	ByLevel [3]float64
	Range   materials.Range
}

// At returns the value at level l.
func (s Spread) At(l materials.Level) float64 {
	for i, v := range materials.Levels {
		if v == l {
			return s.ByLevel[i]
		}
	}
	panic(fmt.Sprintf("springnet: Spread.At: unknown level %v", l))
}

// spreadOf builds a Spread from values in materials.Levels order.
func spreadOf(v [3]float64) Spread {
	s := Spread{ByLevel: v, Range: materials.Range{Low: v[0], High: v[0]}}
	for i, l := range materials.Levels {
		s.Range.Low = math.Min(s.Range.Low, v[i])
		s.Range.High = math.Max(s.Range.High, v[i])
		if l == materials.Nominal {
			s.Range.Nominal = v[i]
		}
	}
	return s
}

// MountSpread is the stiffness at one place over the material levels.
type MountSpread struct {
	Place   Place
	Name    string // as Model.PlaceName
	X, Y, Z Spread // stiffness along global X, Y, Z (PointStiffness.Along) [N/m]
	// Softest is the smallest principal translational stiffness
	// (PointStiffness.Principal) [N/m]; its direction may turn from
	// level to level (see Points).
	Softest Spread
	// Points holds the full results per level, in materials.Levels order.
	Points [3]*PointStiffness
}

// SweepResult holds the results of Sweep: the governing numbers of the
// stand with every material and spring at the Low, Nominal and High end
// of its range.
type SweepResult struct {
	// Static holds the static results per level, in materials.Levels
	// order.
	Static [3]*StaticResult
	// Mounts holds the stiffness at each place of SweepSettings.Places.
	Mounts []MountSpread
	// MaxDisplacement is the largest translation |u| of any node in any
	// case that does not tip [m]; MaxUtilisation and EulerMargin also
	// leave out tipped cases.
	MaxDisplacement Spread
	// MaxUtilisation is the largest member utilisation (a stress ratio,
	// MemberResult.Utilisation) of any bar or beam in any case; 0 where
	// no member has a rated strength.
	MaxUtilisation Spread
	// EulerMargin is the lowest Euler margin of a member on its own
	// (EulerCheck.Margin of a compressed member with a critical load) over
	// members and cases; set only when HasEulerMargin, which is true
	// when such a member exists at every level.
	EulerMargin    Spread
	HasEulerMargin bool
	// Tipping is the lowest tipping factor (Tipping.Factor where Found)
	// over the cases of a stand on compression-only feet, at most 1 where
	// a case tips under its own loads (CaseResult.Tipped); set only when
	// HasTipping, which is true when some case has a factor at every
	// level.
	Tipping    Spread
	HasTipping bool
	// Buckling is the lowest positive whole-frame buckling load factor
	// over the cases; set only when HasBuckling, which is true when
	// buckling was asked for (SweepSettings.Buckling) and some case has a
	// positive load factor at every level.
	Buckling    Spread
	HasBuckling bool
	// Frequencies holds the i-th lowest natural frequency [Hz] over the
	// levels (SweepSettings.Modes), for as many modes as were found at
	// every level (a model with fewer modes gives fewer); nil when none
	// were asked for. Frequencies[0] is the first natural frequency.
	Frequencies []Spread
	// ModeResults holds the modal results per level, in materials.Levels
	// order, when modes were asked for (shapes, damping, rigid-body
	// flags).
	ModeResults [3]*ModeResult
}

// lowest collects the smallest value per level of a governing number
// that may be missing.
type lowest struct {
	v     [3]float64
	found [3]bool
}

func (w *lowest) take(level int, v float64) {
	if !w.found[level] || v < w.v[level] {
		w.v[level], w.found[level] = v, true
	}
}

// spread returns the Spread and whether a value was found at every level.
func (w *lowest) spread() (Spread, bool) {
	if !w.found[0] || !w.found[1] || !w.found[2] {
		return Spread{}, false
	}
	return spreadOf(w.v), true
}

// Sweep analyses m at each material level (materials.Levels: every
// material's E and G and every spring's and foot's Vary at the Low,
// Nominal and High end of its range) with the one Solver s, so the
// symbolic analysis of K is done once and each level only refactorises:
// Static (every case), the mount stiffness at each place (one
// factorisation per level for all places, every foot in contact, as in
// MountStiffness) and, if asked, Buckling of every case and the lowest
// natural frequencies (Modes; its eigen solver factorises K − σM itself,
// once per level). It returns the governing numbers as Spreads: mount
// stiffness along X, Y, Z and the softest principal one, the largest
// displacement and utilisation, the lowest member Euler margin, tipping
// factor and buckling factor, and the lowest natural frequencies.
//
// Errors are those of the analyses, wrapped with the level; no result is
// returned then. A level at which some case tips (CaseResult.Tipped) is
// analysed as far as it goes: the tipped cases add their tipping factor
// (at most 1) to Tipping and nothing else (no displacement, utilisation,
// Euler margin or buckling), and Sweep returns the result together with
// the *TippingError of the case, wrapped with the level, or errors.Join
// of one per tipped case and level (errors.As finds the first; the
// message names every tipped case at every level). A solve whose
// residual exceeds MaxResidual gives the result with the worst
// *ConditionError, unless a case tipped: the tipping errors then stand
// alone, as in Static. A case in which nothing is in
// compression has no buckling factor and is skipped. These are model
// results over the stated material ranges: check members and stability
// against local codes and licensed engineering practice.
func (s *Solver) Sweep(m *Model, st *SweepSettings) (*SweepResult, error) {
	if st == nil {
		st = &SweepSettings{}
	}
	if st.Modes < 0 {
		return nil, fmt.Errorf("springnet: sweep: %d modes asked for", st.Modes)
	}
	places := st.Places
	if places == nil {
		for i := range m.mounts {
			places = append(places, MountID(i))
		}
	}
	for _, p := range places {
		m.checkPlace(p)
	}
	res := &SweepResult{Mounts: make([]MountSpread, len(places))}
	var worst *ConditionError
	keep := func(err error) error {
		var ce *ConditionError
		if errors.As(err, &ce) {
			if worst == nil || ce.Residual > worst.Residual {
				worst = ce
			}
			return nil
		}
		return err
	}
	var disp, util [3]float64
	var euler, tip, buck lowest
	var mr []MemberResult
	var tips []error // per level where a case tips, wrapped
	for li, l := range materials.Levels {
		wrap := func(err error) error {
			return fmt.Errorf("springnet: sweep at %v material values: %w", l, err)
		}
		sr, err := s.Static(m, &StaticSettings{Level: l})
		var te *TippingError
		if errors.As(err, &te) && sr != nil {
			// Some cases tip (named in err); the others are solved. Static
			// leaves out a ConditionError then: take the cases' own.
			err = nil
			for _, cr := range sr.cases {
				if cr.Tipped() {
					tips = append(tips, wrap(cr.tipped)) // one line per case and level
				} else if cr.residual > MaxResidual {
					keep(cr.conditionError())
				}
			}
		}
		if err = keep(err); err != nil {
			return nil, wrap(err)
		}
		res.Static[li] = sr
		for _, cr := range sr.cases {
			if tp := cr.Tipping(); tp.Found {
				tip.take(li, tp.Factor)
			}
			if cr.Tipped() {
				continue // no displacements or member forces
			}
			for n := range m.nodes {
				disp[li] = math.Max(disp[li], cr.Displacement(NodeID(n)).Translation().Norm())
			}
			if mr, err = cr.MembersTo(mr, st.Member); err != nil {
				return nil, wrap(err)
			}
			for i := range mr {
				util[li] = math.Max(util[li], mr[i].Utilisation)
				if b := mr[i].Buckling; b.Rated && b.Compressed && b.Margin > 0 {
					euler.take(li, b.Margin)
				}
			}
		}

		if len(places) > 0 {
			// Static may leave compression-only feet lifted: prepare
			// afresh (every foot in contact) and factorise once for all
			// places. The pattern is the same, so this refactorises only.
			nt, err := prepare(m, l)
			if err != nil {
				return nil, wrap(err)
			}
			if err := s.factor(nt); err != nil {
				return nil, wrap(err)
			}
			for pi, p := range places {
				ps, err := s.pointStiffness(nt, p)
				if err = keep(err); err != nil {
					return nil, wrap(err)
				}
				ms := &res.Mounts[pi]
				ms.Points[li] = ps
			}
		}

		if st.Buckling {
			for c := range m.cases {
				if sr.cases[c].Tipped() {
					continue // no static solution to buckle from
				}
				br, err := s.Buckling(m, CaseID(c), &BucklingSettings{Modes: 1, Level: l})
				var few *FewerFactorsError
				if errors.As(err, &few) && br == nil {
					continue // nothing in compression under this case
				}
				if err = keep(err); err != nil {
					return nil, wrap(err)
				}
				buck.take(li, br.Factor(0))
			}
		}

		if st.Modes > 0 {
			mr, err := Modes(m, &ModeSettings{Count: st.Modes, Mass: st.ModeMass, Level: l})
			var few *eigen.FewerModesError
			if !(errors.As(err, &few) && mr != nil) {
				if err = keep(err); err != nil {
					return nil, wrap(err)
				}
			}
			res.ModeResults[li] = mr
		}
	}
	if st.Modes > 0 {
		n := st.Modes
		for _, mr := range res.ModeResults {
			n = min(n, mr.NumModes())
		}
		res.Frequencies = make([]Spread, n)
		for i := range res.Frequencies {
			var f [3]float64
			for li, mr := range res.ModeResults {
				f[li] = mr.Frequency(i)
			}
			res.Frequencies[i] = spreadOf(f)
		}
	}
	res.MaxDisplacement = spreadOf(disp)
	res.MaxUtilisation = spreadOf(util)
	res.EulerMargin, res.HasEulerMargin = euler.spread()
	res.Tipping, res.HasTipping = tip.spread()
	res.Buckling, res.HasBuckling = buck.spread()
	for pi, p := range places {
		ms := &res.Mounts[pi]
		ms.Place, ms.Name = p, m.PlaceName(p)
		var kx, ky, kz, soft [3]float64
		for li, ps := range ms.Points {
			kx[li], ky[li], kz[li] = ps.Along(Vec{X: 1}), ps.Along(Vec{Y: 1}), ps.Along(Vec{Z: 1})
			k, _ := ps.Principal()
			soft[li] = k[0]
		}
		ms.X, ms.Y, ms.Z, ms.Softest = spreadOf(kx), spreadOf(ky), spreadOf(kz), spreadOf(soft)
	}
	return res, resultError(tips, worst)
}

// Sweep is Solver.Sweep with a new Solver.
func Sweep(m *Model, st *SweepSettings) (*SweepResult, error) {
	var s Solver
	return s.Sweep(m, st)
}
