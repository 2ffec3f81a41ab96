package springnet

import (
	"fmt"
	"math"
)

// KBasis selects the effective-length factors of the member buckling
// check.
type KBasis int

const (
	// DesignK (the zero KBasis) uses the recommended design values of
	// AISC 360 Commentary Table C-A-7.1, which allow for joints that are
	// never perfectly fixed: fixed–fixed 0.65, fixed–pinned 0.8,
	// pinned–pinned 1.0, fixed–free 2.1, fixed–guided 1.2, pinned–guided
	// 2.0.
	DesignK KBasis = iota
	// TheoreticalK uses the theoretical values of the same table (the
	// Euler buckled shapes): fixed–fixed 0.5, fixed–pinned 0.7,
	// pinned–pinned 1.0, fixed–free 2.0, fixed–guided 1.0, pinned–guided
	// 2.0.
	TheoreticalK
)

// String returns "design" or "theoretical".
func (b KBasis) String() string {
	switch b {
	case DesignK:
		return "design"
	case TheoreticalK:
		return "theoretical"
	}
	return fmt.Sprintf("KBasis(%d)", int(b))
}

// EndFixity is how one end of a member is held for buckling in one
// bending plane.
type EndFixity int

// End conditions of the member buckling check.
const (
	// EndPinned: the end cannot move sideways but may turn. Ends joined
	// rigidly to other members count as pinned (their restraint depends
	// on the rest of the frame), as do released ends and ends on a joint
	// spring.
	EndPinned EndFixity = iota
	// EndFixed: the end can neither move sideways nor turn: a support
	// fixed in that rotation, or a joint into a rigid group.
	EndFixed
	// EndGuided: the end cannot turn but may move sideways (a support
	// fixed in rotation only, with nothing else attached).
	EndGuided
	// EndFree: nothing else is attached and no support holds the end.
	EndFree
)

// String returns "pinned", "fixed", "guided" or "free".
func (f EndFixity) String() string {
	switch f {
	case EndPinned:
		return "pinned"
	case EndFixed:
		return "fixed"
	case EndGuided:
		return "guided"
	case EndFree:
		return "free"
	}
	return fmt.Sprintf("EndFixity(%d)", int(f))
}

// EffectiveLength is a user's effective-length factor K about local y and
// z of one member; 0 for an axis keeps the automatic factor.
type EffectiveLength struct{ Y, Z float64 }

// MemberSettings controls the member results. A nil *MemberSettings means
// defaults; zero fields mean defaults.
type MemberSettings struct {
	// Basis picks the automatic effective-length factors; the zero
	// value is DesignK.
	Basis KBasis
	// K overrides the effective-length factor of chosen members (bars or
	// beams). Factors must be positive and finite.
	K map[ElementID]EffectiveLength
	// Sway declares the frame unbraced: an end counts as held sideways
	// only where a support fixes its translation, so ends that would be
	// fixed become guided and pinned ends become free (fixed–guided:
	// K = 1.0, design 1.2; fixed–free: K = 2.0, design 2.1). Without it
	// the check assumes every end with something attached is held
	// sideways (a braced frame).
	Sway bool
}

func (s *MemberSettings) check(m *Model) error {
	if s == nil {
		return nil
	}
	if s.Basis != DesignK && s.Basis != TheoreticalK {
		return fmt.Errorf("springnet: member settings: unknown effective-length basis %d", int(s.Basis))
	}
	for e, k := range s.K {
		if e < 0 || int(e) >= len(m.elems) {
			return fmt.Errorf("springnet: member settings: effective length for element handle %d out of range [0, %d)", e, len(m.elems))
		}
		if kind := m.elems[e].kind; kind != BarKind && kind != BeamKind {
			return fmt.Errorf("springnet: member settings: effective length for %v %q, which is not a bar or beam", kind, m.elems[e].name())
		}
		for _, v := range [2]float64{k.Y, k.Z} {
			if !finite(v) || v < 0 {
				return fmt.Errorf("springnet: member settings: %v %q: effective-length factor %g must be positive and finite (0: automatic)", m.elems[e].kind, m.elems[e].name(), v)
			}
		}
	}
	return nil
}

// EulerCheck is the Euler buckling check of one member on its own,
//
//	P_cr = π²·E·I / (K·L)²
//
// about local y (E·Iy, KY) and local z (E·Iz, KZ), with the effective-length
// factor K from the end conditions (see KBasis for the values) or the
// user's override. For a Timoshenko beam the shear stiffness reduces it by
// Engesser's formula P_cr / (1 + P_cr/(κ·G·A)) (Timoshenko & Gere, Theory
// of Elastic Stability, effect of shearing force on the critical load).
//
// The end conditions are read from the model: releases, joint springs,
// supports, rigid groups and whether anything else is attached. By default
// the check assumes the ends do not move sideways relative to each other
// unless an end is free or guided (a braced frame): a member of an
// unbraced (sway) frame buckles at a larger K. For sway frames set
// MemberSettings.Sway, override K, or use the whole-frame Buckling
// analysis, which needs no K. Lateral-torsional, torsional and
// local buckling are not checked. A margin is a model result: check
// stability against local codes and licensed engineering practice.
type EulerCheck struct {
	// Rated is false when the member has no bending stiffness data (a bar
	// or beam given by raw stiffness without a section); every other
	// field is then zero.
	Rated bool
	// EndA and EndB are the end conditions for bending about local y
	// (index 0) and local z (index 1).
	EndA, EndB [2]EndFixity
	// KY and KZ are the effective-length factors used; 0 when the member
	// on its own has no effective length (pinned or free at one end and
	// free at the other: it is held by the rest of the frame, or it is a
	// mechanism), and then the critical load is 0 and Note says so.
	KY, KZ float64
	Basis  KBasis // the basis of automatic factors
	// Override is true when the user's factor replaced an automatic one.
	Override bool
	// PcrY and PcrZ are the critical loads about local y and z [N]; Pcr
	// is the smaller.
	PcrY, PcrZ, Pcr float64
	// Compression is the largest axial compression along the member
	// [N], ≥ 0.
	Compression float64
	// Margin is Pcr / Compression: the factor on the compression at which
	// the member buckles. 0 when the member is not in compression
	// (Compressed false), where no buckling check applies.
	Margin     float64
	Compressed bool
	Note       string
}

// effectiveK returns the factor for a pair of end conditions and whether
// one exists (AISC 360 Commentary Table C-A-7.1; theoretical and
// recommended design values).
func effectiveK(a, b EndFixity, basis KBasis) (float64, bool) {
	if a > b {
		a, b = b, a
	}
	design := basis == DesignK
	pick := func(theory, rec float64) (float64, bool) {
		if design {
			return rec, true
		}
		return theory, true
	}
	switch {
	case a == EndFixed && b == EndFixed:
		return pick(0.5, 0.65)
	case a == EndPinned && b == EndFixed:
		return pick(0.7, 0.8)
	case a == EndPinned && b == EndPinned:
		return pick(1.0, 1.0)
	case a == EndFixed && b == EndGuided:
		return pick(1.0, 1.2)
	case a == EndPinned && b == EndGuided:
		return pick(2.0, 2.0)
	case a == EndFixed && b == EndFree:
		return pick(2.0, 2.1)
	}
	return 0, false // pinned–free, guided–guided, guided–free, free–free
}

// euler computes the Euler check of member e with results r.
func (nt *net) euler(e ElementID, r *MemberResult, s *MemberSettings, touch []int) EulerCheck {
	var ec EulerCheck
	x := &nt.m.elems[e]
	p := &nt.el[e]
	if p.mp.eiy <= 0 || p.mp.eiz <= 0 {
		return ec
	}
	ec.Rated = true
	if s != nil {
		ec.Basis = s.Basis
	}
	// Largest compression along the member: N is linear in x.
	nmin := math.Min(r.A.N, r.At(1).N)
	if nmin < 0 {
		ec.Compression = -nmin
		ec.Compressed = true
	}
	sway := s != nil && s.Sway
	// Bending about local y deflects along local z, about z along y.
	axes := [2][3]float64{p.frame.Ey, p.frame.Ez}
	defl := [2][3]float64{p.frame.Ez, p.frame.Ey}
	for k := range 2 {
		ec.EndA[k] = nt.endFixity(x, x.a, true, k, axes[k], defl[k], touch, sway)
		ec.EndB[k] = nt.endFixity(x, x.b, false, k, axes[k], defl[k], touch, sway)
	}
	var over EffectiveLength
	if s != nil {
		over = s.K[e]
	}
	l := p.frame.L
	// Local axes are principal (a section with a product of area is
	// rolled by its principal angle, memberSection), so an angle buckles
	// about its minor principal axis, local z.
	ei := [2]float64{p.mp.eiy, p.mp.eiz}
	gas := [2]float64{p.mp.gasz, p.mp.gasy} // shear along z pairs with bending about y
	ks := [2]float64{over.Y, over.Z}
	var pcr [2]float64
	for k := range 2 {
		kk := ks[k]
		if kk > 0 {
			ec.Override = true
		} else {
			var ok bool
			kk, ok = effectiveK(ec.EndA[k], ec.EndB[k], ec.Basis)
			if !ok {
				ec.Note = fmt.Sprintf("no effective length on its own (ends %v and %v about local %c): "+
					"held by the rest of the frame or a mechanism; give K or use the frame buckling analysis",
					ec.EndA[k], ec.EndB[k], "yz"[k])
				continue
			}
		}
		pe := math.Pi * math.Pi * ei[k] / (kk * l * kk * l)
		if x.kind == BeamKind && x.beam.Timoshenko && gas[k] > 0 {
			pe /= 1 + pe/gas[k]
		}
		pcr[k] = pe
		if k == 0 {
			ec.KY = kk
		} else {
			ec.KZ = kk
		}
	}
	ec.PcrY, ec.PcrZ = pcr[0], pcr[1]
	ec.Pcr = math.Min(pcr[0], pcr[1])
	if ec.Compressed {
		ec.Margin = ec.Pcr / ec.Compression
	}
	return ec
}

// endFixity classifies end n (a when atA) of member x for bending about
// local axis k (0: y, 1: z) whose direction in global axes is axis; the
// end deflects along defl. With sway, only a support holds an end
// sideways.
func (nt *net) endFixity(x *elem, n NodeID, atA bool, k int, axis, defl [3]float64, touch []int, sway bool) EndFixity {
	m := nt.m
	rotHeld := false
	inGroup := nt.dm.groupOf[n] >= 0
	if x.kind == BeamKind {
		rel, spring := x.beam.ReleaseB, x.beam.SpringB
		if atA {
			rel, spring = x.beam.ReleaseA, x.beam.SpringA
		}
		bit := ReleaseRY
		sp := spring.Y
		if k == 1 {
			bit, sp = ReleaseRZ, spring.Z
		}
		if rel&bit == 0 && sp == 0 {
			if inGroup {
				rotHeld = true
			} else {
				fixed := m.nodes[n].fixed
				rotHeld = true
				for j := range 3 {
					if math.Abs(axis[j]) > 1e-9 && fixed&dofAt(3+j) == 0 {
						rotHeld = false
					}
				}
			}
		}
	}
	// Free to move sideways: nothing else attached, no group, and no
	// support holding every translation the deflection has a part in.
	held := true
	for j := range 3 {
		if math.Abs(defl[j]) > 1e-9 && m.nodes[n].fixed&dofAt(j) == 0 {
			held = false
		}
	}
	free := !inGroup && touch[n] <= 1 && !held
	if sway {
		free = inGroup || !held
	}
	switch {
	case free && rotHeld:
		return EndGuided
	case free:
		return EndFree
	case rotHeld:
		return EndFixed
	}
	return EndPinned
}
