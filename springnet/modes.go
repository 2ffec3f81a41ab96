package springnet

import (
	"errors"
	"fmt"
	"math"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet/eigen"
	"github.com/trestle-go/trestle/springnet/sparse"
)

// ModeMethod selects the eigen solver of Modes.
type ModeMethod int

const (
	// AutoMethod uses DenseMethod up to DenseLimit equations and
	// SparseMethod above. It is the zero value.
	AutoMethod ModeMethod = iota
	// SparseMethod uses eigen.Lowest: shift-invert block Lanczos on the
	// sparse matrices, with its Sturm-sequence check.
	SparseMethod
	// DenseMethod uses eigen.Dense (gonum, the whole spectrum, O(N³)),
	// followed by a Sturm count of the sparse K − σM.
	DenseMethod
)

// DenseLimit is the largest number of equations for which AutoMethod
// solves densely.
const DenseLimit = 60

// DefaultModeCount is the number of modes Modes finds when
// ModeSettings.Count is 0.
const DefaultModeCount = 6

// ModeSettings controls a modal analysis. A nil *ModeSettings means
// defaults; zero fields mean defaults.
type ModeSettings struct {
	// Count is the number of lowest modes wanted; 0 means
	// DefaultModeCount. More than the model has gives all it has.
	Count int
	// Mass picks the mass matrix of bars and beams; the zero value is
	// Consistent.
	Mass MassMatrix
	// Level picks the material values (stiffness, and the spring and foot
	// spreads); the zero Level is Nominal. The loss factors are reported
	// at all three levels.
	Level materials.Level
	// Method picks the eigen solver; the zero value is AutoMethod.
	Method ModeMethod
	// Reference is the point about which the rotational effective modal
	// masses (RX, RY, RZ) are taken [m]; the zero value is the origin.
	Reference Vec
}

// SturmCheck reports the Sturm-sequence count made after the eigen
// solution: the number of eigenvalues of K·φ = ω²·M·φ below a frequency
// just above the highest mode returned, by the number of negative pivots
// of the LDLᵀ factorisation of K − ω²M (Sylvester's law of inertia). When
// Checked is true, Count equals the number of modes returned below Below:
// no mode in that range was missed.
type SturmCheck struct {
	Checked bool
	Count   int     // eigenvalues below Below
	Below   float64 // the frequency of the count [Hz]
	Dense   bool    // the modes came from the dense solver
}

// ModeResult holds the lowest natural frequencies and mode shapes of a
// model, with effective modal masses, strain-energy shares and modal
// damping. Mode shapes are kept M-orthonormal (φᵀ·M·φ = 1), so a mode's
// strain energy is ½·ω² per unit modal mass.
type ModeResult struct {
	nt     *net
	mass   MassMatrix
	k, mm  *sparse.Matrix
	lambda []float64
	vecs   [][]float64
	rigid  []bool
	resid  []float64
	sturm  SturmCheck
	ref    Vec
	// Effective modal mass: influence vectors r_d of a unit rigid motion
	// in direction d, their "total" rᵀMr and the modal factors φᵀMr.
	infl  [6][]float64
	total [6]float64
	gamma [][6]float64
	book  *energyBook
	tally []*energyTally
}

// Modes finds the lowest natural frequencies and mode shapes of m,
//
//	K·φ = ω²·M·φ,   f = ω / 2π
//
// with K the stiffness and M the mass matrix (Consistent or Lumped member
// masses plus the point masses with their rotary inertia, assembled
// through the same DOF map and rigid-group transformation as K; springs
// and feet are massless). Compression-only feet count as in contact.
// Fixed DOF are removed, so mass sitting on supports does not take part.
//
// The sparse path (eigen.Lowest) checks by a Sturm count that no mode
// below the highest one returned was missed; the dense path (eigen.Dense)
// computes the whole spectrum and is checked by the same count. A model
// with too few supports has rigid-body or mechanism modes (ω ≈ 0): they
// are returned and flagged (RigidBody), not treated as errors.
//
// Damping comes from the modal strain energy method (see LossFactor).
// Dry sand fill (a MassOnly part) adds mass but stores no strain energy,
// so its friction damping is not counted: attach a measured loss factor
// to the member (Bar.Loss, Beam.Loss) to include it.
//
// Errors: validation errors; an error when the model has no free DOF or
// no mass; a DOF with neither stiffness nor mass (a massless mechanism)
// names its node or group and direction. If the model has fewer modes
// than asked for (massless DOF), the result holds those that exist and
// comes with a *eigen.FewerModesError; a failed Sturm check is a
// *eigen.MissedModesError, returned with no result.
func Modes(m *Model, s *ModeSettings) (*ModeResult, error) {
	if s == nil {
		s = &ModeSettings{}
	}
	if s.Count < 0 {
		return nil, fmt.Errorf("springnet: modes: %d modes asked for", s.Count)
	}
	if !s.Reference.finite() {
		return nil, fmt.Errorf("springnet: modes: reference point %v is not finite", s.Reference)
	}
	if s.Mass != Consistent && s.Mass != Lumped {
		return nil, fmt.Errorf("springnet: modes: unknown mass matrix %v", s.Mass)
	}
	if err := m.Validate(); err != nil {
		return nil, err
	}
	nt, err := prepare(m, s.Level)
	if err != nil {
		return nil, err
	}
	N := nt.dm.n
	if N == 0 {
		return nil, errors.New("springnet: modes: the model has no free degree of freedom")
	}
	count := s.Count
	if count == 0 {
		count = DefaultModeCount
	}
	want := min(count, N)
	r := &ModeResult{nt: nt, mass: s.Mass, ref: s.Reference}
	r.k = nt.assemble(sparse.NewBuilder(0))
	r.mm = nt.assembleMassOf(sparse.NewBuilder(0), s.Mass)
	trM := 0.0
	for j := 0; j < N; j++ {
		trM += r.mm.At(j, j)
	}
	if !(trM > 0) {
		return nil, errors.New("springnet: modes: the model has no mass on its free DOF: give members a material with a density (or a LineMass) or add masses")
	}
	dense := s.Method == DenseMethod || (s.Method == AutoMethod && N <= DenseLimit)
	var er *eigen.Result
	if dense {
		er, err = eigen.Dense(eigen.DenseOf(r.k), eigen.DenseOf(r.mm), want)
	} else {
		er, err = eigen.Lowest(r.k, r.mm, want, &eigen.Settings{Coords: nt.dm.coords})
	}
	var few *eigen.FewerModesError
	var sing *eigen.SingularError
	if dense && err != nil && !errors.As(err, &few) {
		// The dense solver does not say which DOF failed; the sparse
		// factorisation of K − σM below zero does.
		scale := matTrace(r.k) / trM
		if !(scale > 0) {
			scale = 1
		}
		if _, cerr := eigen.CountBelow(r.k, r.mm, -eigen.DefaultShiftFraction*scale); errors.As(cerr, &sing) {
			err = cerr
		}
	}
	switch {
	case errors.As(err, &few) && er != nil && er.Len() > 0:
		// keep the result and report the shortfall below
	case errors.As(err, &sing) && sing.Col >= 0 && sing.Col < N:
		return nil, fmt.Errorf("springnet: modes: %s has neither stiffness nor mass (a massless mechanism): support or brace it, or give it mass: %w",
			nt.dm.describeEq(m, sing.Col), err)
	case err != nil:
		return nil, fmt.Errorf("springnet: modes: %w", err)
	}
	for i := 0; i < er.Len(); i++ {
		v := er.Vector(i)
		if !finite(er.Values[i]) || !finiteAll(v) {
			return nil, fmt.Errorf("springnet: modes: mode %d is not finite", i+1)
		}
		r.lambda = append(r.lambda, er.Values[i])
		r.vecs = append(r.vecs, v)
		r.rigid = append(r.rigid, er.RigidBody(i))
		r.resid = append(r.resid, er.Residuals[i])
	}
	if dense {
		if err := r.denseSturm(); err != nil {
			return nil, err
		}
	} else {
		r.sturm = SturmCheck{Checked: er.Checked, Count: er.SturmCount, Below: hzOf(er.SturmShift)}
	}
	r.participation()
	r.book = newEnergyBook(nt)
	r.tally = r.book.tallyAll(nt, r.vecs)
	for i := range r.vecs {
		if r.rigid[i] {
			// A rigid-body mode strains nothing; its energy is round-off.
			r.tally[i] = &energyTally{elem: make([]float64, len(m.elems)),
				group: make([]float64, len(r.book.names)), groupLoss: make([][3]float64, len(r.book.names))}
		}
	}
	if few != nil {
		return r, few
	}
	return r, nil
}

// hz returns √λ / 2π, 0 for λ ≤ 0.
func hzOf(lambda float64) float64 {
	if !(lambda > 0) {
		return 0
	}
	return math.Sqrt(lambda) / (2 * math.Pi)
}

// denseSturm counts the eigenvalues below a shift just above the highest
// dense eigenvalue with the sparse LDLᵀ factorisation of K − σM.
func (r *ModeResult) denseSturm() error {
	r.sturm.Dense = true
	if len(r.lambda) == 0 {
		return nil
	}
	top := r.lambda[len(r.lambda)-1]
	scale := 0.0
	for j := 0; j < r.k.N(); j++ {
		scale += r.k.At(j, j)
	}
	scale /= math.Max(matTrace(r.mm), math.SmallestNonzeroFloat64)
	gap := 1e-3 * math.Max(math.Abs(top), 1e-6*scale)
	// Count at σ = top + gap; if that takes in eigenvalues beyond the
	// ones returned (a cluster at the top), move σ closer to the top.
	var cnt, below int
	var sigma float64
	for shrink := 0; shrink < 4; shrink++ {
		var err error
		sigma = top + gap
		for try := 0; try < 4; try++ {
			cnt, err = eigen.CountBelow(r.k, r.mm, sigma)
			var sing *eigen.SingularError
			if !errors.As(err, &sing) {
				break
			}
			sigma += gap / 7 // σ hit an eigenvalue: move on
		}
		if err != nil {
			return fmt.Errorf("springnet: modes: Sturm check: %w", err)
		}
		below = 0
		for _, l := range r.lambda {
			if l < sigma {
				below++
			}
		}
		if cnt <= below {
			break
		}
		gap /= 1000
	}
	r.sturm.Count = cnt
	r.sturm.Below = hzOf(sigma)
	// cnt > below: an eigenvalue within round-off of the highest returned
	// one was left out of the number asked for; nothing below it was
	// missed, but the count cannot show it (Checked stays false).
	r.sturm.Checked = cnt == below
	if cnt < below {
		return &eigen.MissedModesError{Low: math.Inf(-1), High: sigma, Count: cnt, Found: below}
	}
	return nil
}

func matTrace(a *sparse.Matrix) float64 {
	s := 0.0
	for j := 0; j < a.N(); j++ {
		s += a.At(j, j)
	}
	return s
}

// participation computes the influence vectors and modal factors.
func (r *ModeResult) participation() {
	d := &r.nt.dm
	N := d.n
	for dir := 0; dir < 6; dir++ {
		v := make([]float64, N)
		for eq := 0; eq < N; eq++ {
			o := d.eqOwner[eq]
			c := int(d.eqComp[eq])
			if dir < 3 {
				if c == dir {
					v[eq] = 1
				}
				continue
			}
			axis := unitVec(dir - 3)
			if c >= 3 {
				if c == dir {
					v[eq] = 1
				}
				continue
			}
			// u = e × (x − P) at the owner's reference point.
			u := axis.Cross(d.ownerRef[o].Sub(r.ref)).arr()
			v[eq] = u[c]
		}
		r.infl[dir] = v
		mr := make([]float64, N)
		r.mm.MulVec(mr, v)
		r.total[dir] = dotVec(v, mr)
		for i, phi := range r.vecs {
			if dir == 0 {
				r.gamma = append(r.gamma, [6]float64{})
			}
			r.gamma[i][dir] = dotVec(phi, mr)
		}
	}
}

func dotVec(a, b []float64) float64 {
	s := 0.0
	for i := range a {
		s += a[i] * b[i]
	}
	return s
}

// NumModes returns the number of modes found.
func (r *ModeResult) NumModes() int { return len(r.lambda) }

func (r *ModeResult) mode(i int) int {
	if i < 0 || i >= len(r.lambda) {
		panic(fmt.Sprintf("springnet: mode %d out of range [0, %d)", i, len(r.lambda)))
	}
	return i
}

// Frequency returns the natural frequency of mode i (from 0, ascending)
// [Hz]; 0 for a rigid-body or mechanism mode.
func (r *ModeResult) Frequency(i int) float64 {
	if r.rigid[r.mode(i)] {
		return 0
	}
	return hzOf(r.lambda[i])
}

// FrequenciesTo writes the natural frequencies [Hz] into dst (nil
// allocates) and returns it.
func (r *ModeResult) FrequenciesTo(dst []float64) []float64 {
	dst = dst[:0]
	for i := range r.lambda {
		dst = append(dst, r.Frequency(i))
	}
	return dst
}

// Eigenvalue returns ω² of mode i [rad²/s²] as solved (a rigid-body mode
// may show a tiny number of either sign).
func (r *ModeResult) Eigenvalue(i int) float64 { return r.lambda[r.mode(i)] }

// RigidBody reports whether mode i is a rigid-body or mechanism mode
// (ω ≈ 0, see eigen.Settings.RigidTol): a part of the stand that can move
// without straining anything.
func (r *ModeResult) RigidBody(i int) bool { return r.rigid[r.mode(i)] }

// Residual returns the relative residual of mode i (eigen package doc).
func (r *ModeResult) Residual(i int) float64 { return r.resid[r.mode(i)] }

// Sturm returns the Sturm-sequence check of the solution.
func (r *ModeResult) Sturm() SturmCheck { return r.sturm }

// MassMatrix returns the kind of mass matrix used.
func (r *ModeResult) MassMatrix() MassMatrix { return r.mass }

// Level returns the material level of the stiffness.
func (r *ModeResult) Level() materials.Level { return r.nt.level }

// Shape returns the motion of place p in mode i, scaled so that the
// largest translation of any node or group is 1 and positive (a mode
// shape has no physical size; rotations are in the same scale per metre).
func (r *ModeResult) Shape(i int, p Place) Displacement {
	r.nt.m.checkPlace(p)
	v := r.nt.normaliseMode(append([]float64(nil), r.vecs[r.mode(i)]...))
	o, at := r.nt.dm.placeOwner(r.nt.m, p)
	return dispOf(r.nt.dm.pointDisp(o, at, v))
}

// ShapesTo writes the motion of every node in mode i, in node order, into
// dst (nil allocates) and returns it; see Shape for the scale.
func (r *ModeResult) ShapesTo(dst []Displacement, i int) []Displacement {
	v := r.nt.normaliseMode(append([]float64(nil), r.vecs[r.mode(i)]...))
	m := r.nt.m
	dst = dst[:0]
	for n := range m.nodes {
		dst = append(dst, dispOf(r.nt.dm.nodeDisp(NodeID(n), m.nodes[n].at, v)))
	}
	return dst
}

// ModalShape returns the motion of place p in mode i with the mode scaled
// to unit modal mass, φᵀ·M·φ = 1 (a translation in m per √kg of modal
// mass), the scale the receptance sums use: φ_j·φ_k/ω² is a compliance.
func (r *ModeResult) ModalShape(i int, p Place) Displacement {
	r.nt.m.checkPlace(p)
	o, at := r.nt.dm.placeOwner(r.nt.m, p)
	return dispOf(r.nt.dm.pointDisp(o, at, r.vecs[r.mode(i)]))
}

func dirIndex(d DOF) int {
	for c := 0; c < 6; c++ {
		if d == dofAt(c) {
			return c
		}
	}
	panic(fmt.Sprintf("springnet: direction %v is not one of UX, UY, UZ, RX, RY, RZ", d))
}

// EffectiveMass returns the effective modal mass of mode i in direction d
// (one of UX, UY, UZ [kg], or RX, RY, RZ [kg·m²] about the reference
// point of ModeSettings),
//
//	M_eff = (φᵀ·M·r)² / (φᵀ·M·φ)
//
// with r the motion of every DOF under a unit rigid translation along d
// or rotation about d (Chopra, Dynamics of Structures, modal
// contributions; effective modal mass). Over all modes the effective
// masses add up to TotalMass(d). It panics if d is not a single direction.
func (r *ModeResult) EffectiveMass(i int, d DOF) float64 {
	g := r.gamma[r.mode(i)][dirIndex(d)]
	return g * g
}

// ParticipationFactor returns Γ = φᵀ·M·r of mode i in direction d (modes
// of unit modal mass) [√kg, or √kg·m for rotations]; its sign follows the
// mode's.
func (r *ModeResult) ParticipationFactor(i int, d DOF) float64 {
	return r.gamma[r.mode(i)][dirIndex(d)]
}

// TotalMass returns rᵀ·M·r in direction d: the mass [kg] (or rotary
// inertia about the reference point [kg·m²]) that moves with a rigid
// motion along d, not counting what sits on fixed DOF. It is what the
// effective masses of all modes add up to.
func (r *ModeResult) TotalMass(d DOF) float64 { return r.total[dirIndex(d)] }

// Participation returns the share of TotalMass(d) that mode i carries,
// EffectiveMass(i, d) / TotalMass(d) [-] (0 if nothing moves along d).
func (r *ModeResult) Participation(i int, d DOF) float64 {
	t := r.TotalMass(d)
	if !(t > 0) {
		return 0
	}
	return r.EffectiveMass(i, d) / t
}

// CumulativeParticipation returns the sum of Participation over modes 0
// to i. Common practice asks for at least 0.9 in each direction of
// interest before a response sum is trusted.
func (r *ModeResult) CumulativeParticipation(i int, d DOF) float64 {
	s := 0.0
	for j := 0; j <= r.mode(i); j++ {
		s += r.Participation(j, d)
	}
	return s
}

// ElementEnergy returns the share of mode i's strain energy stored in
// element e [-]: ½·φₑᵀ·Kₑ·φₑ over ½·φᵀ·K·φ (0 for a rigid-body mode).
func (r *ModeResult) ElementEnergy(i int, e ElementID) float64 {
	r.nt.m.el(e)
	t := r.tally[r.mode(i)]
	if !(t.total > 0) {
		return 0
	}
	return t.elem[e] / t.total
}

// ElementEnergiesTo writes ElementEnergy(i, e) for every element into dst
// (nil allocates; indexed by ElementID) and returns it.
func (r *ModeResult) ElementEnergiesTo(dst []float64, i int) []float64 {
	t := r.tally[r.mode(i)]
	dst = sizedFloats(dst, len(t.elem))
	for e, u := range t.elem {
		dst[e] = 0
		if t.total > 0 {
			dst[e] = u / t.total
		}
	}
	return dst
}

// MaterialEnergy returns the strain energy of mode i per material (and
// for the springs, feet and raw members), the largest share first; Energy
// is for the mode at unit modal mass (the total is ω²/2 [J/kg]).
func (r *ModeResult) MaterialEnergy(i int) []EnergyShare {
	return r.tally[r.mode(i)].shares(r.book)
}

// LossFactor returns the loss factor of mode i by the modal strain energy
// method, at each level of the elements' loss factor ranges,
//
//	η = Σₑ ηₑ·Uₑ / Σₑ Uₑ,   Uₑ = ½·φₑᵀ·Kₑ·φₑ
//
// (Ungar and Kerwin, "Loss factors of viscoelastic systems in terms of
// energy concepts", J. Acoust. Soc. Am. 34, 1962; Johnson and Kienholz,
// AIAA J. 20, 1982). ηₑ is Model.LossFactor(e): the element's own Loss
// (a measured value) or its material's; a composite section without an
// own Loss uses each part's material, weighted by the part's energy. A
// rigid-body mode stores no energy and has η = 0.
func (r *ModeResult) LossFactor(i int) materials.Range { return r.tally[r.mode(i)].lossRange() }

// DampingRatio returns the damping ratio of mode i, ζ = η/2 at each level
// (the viscous equivalent at resonance; materials.RatioFromLossFactor).
func (r *ModeResult) DampingRatio(i int) materials.Range {
	return r.LossFactor(i).Scale(0.5)
}
