package springnet

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/trestle-go/trestle/springnet/sparse"
)

// maxDiagnosticPivots bounds the number of failing pivots the mechanism
// diagnosis steps over (one refactorisation each) before giving up on
// describing the motion: a handful covers the usual cases (a sway, a
// twist, a loose node) without making a large model's error slow.
const maxDiagnosticPivots = 16

// mechanism turns a failed pivot into a *MechanismError naming the node or
// group and direction; describeMotion (describeNull) tries to describe the
// free motion: it adds a diagnostic unit-scale spring at each failing equation until the matrix
// factorises, then does two steps of inverse iteration from the first
// failing direction. The springs exist only inside this diagnosis; no
// result is ever computed with them.
func (nt *net) mechanism(pe *sparse.PivotError) *MechanismError {
	d := &nt.dm
	eq := pe.Col
	o := d.eqOwner[eq]
	me := &MechanismError{Node: -1, Group: -1, DOF: dofAt(int(d.eqComp[eq])), Pivot: pe.Pivot, eq: eq}
	if o < d.nNodes {
		me.Node = NodeID(o)
		me.Name = nt.m.nodes[o].name
	} else {
		me.Group = GroupID(o - d.nNodes)
		me.Name = nt.m.groups[o-d.nNodes].name
	}
	return me
}

// describeMotion fills in the free motion of me, a failure of the
// factorisation of s.k (which must still be the failed matrix).
func (s *Solver) describeMotion(nt *net, me *MechanismError) {
	me.Motion = nt.describeNull(s.k, me.eq)
}

func (nt *net) describeNull(k *sparse.Matrix, first int) string {
	n := k.N()
	// Scale of the diagnostic springs: the mean diagonal of K.
	scale := 0.0
	for j := 0; j < n; j++ {
		scale += math.Abs(k.At(j, j))
	}
	if scale == 0 {
		scale = 1
	} else {
		scale /= float64(n)
	}
	extra := map[int]bool{first: true}
	var f sparse.Factor
	var kk *sparse.Matrix
	for tries := 0; ; tries++ {
		if tries > maxDiagnosticPivots {
			return ""
		}
		b := sparse.NewBuilder(n)
		for j := 0; j < n; j++ {
			rows, vals := k.Col(j)
			for p, r := range rows {
				b.Add(r, j, vals[p])
			}
		}
		for j := range extra {
			b.Add(j, j, scale)
		}
		kk = b.Matrix()
		err := f.Factorize(kk)
		var pe *sparse.PivotError
		if err == nil {
			break
		}
		if !errors.As(err, &pe) || extra[pe.Col] {
			return ""
		}
		extra[pe.Col] = true
	}
	x := make([]float64, n)
	v := make([]float64, n)
	v[first] = 1
	for it := 0; it < 2; it++ {
		f.Solve(x, v)
		mx := 0.0
		for _, xi := range x {
			mx = math.Max(mx, math.Abs(xi))
		}
		if mx == 0 || !finite(mx) {
			return ""
		}
		for i := range x {
			v[i] = x[i] / mx
		}
	}
	return nt.describeMotion(v)
}

// describeMotion puts a displacement vector over the equations into words:
// the dominant kind of motion and who moves.
func (nt *net) describeMotion(u []float64) string {
	d := &nt.dm
	type mover struct {
		owner int
		size  float64
		dir   Vec
		rot   bool
	}
	var movers []mover
	for o := range d.ownerEq {
		w := d.pointDisp(o, d.ownerRef[o], u)
		t := vecOf([3]float64{w[0], w[1], w[2]})
		r := vecOf([3]float64{w[3], w[4], w[5]})
		if o >= d.nNodes && r.Norm() > 0 {
			// A group turning: measure the rotation by the motion it gives at
			// a typical node distance.
			size := r.Norm() * nt.groupRadius(o-d.nNodes)
			if size >= t.Norm() {
				movers = append(movers, mover{o, size, r, true})
				continue
			}
		}
		if t.Norm() > 0 {
			movers = append(movers, mover{o, t.Norm(), t, false})
		} else if r.Norm() > 0 {
			movers = append(movers, mover{o, r.Norm() * 1e-3, r, true})
		}
	}
	if len(movers) == 0 {
		return ""
	}
	sort.SliceStable(movers, func(i, j int) bool { return movers[i].size > movers[j].size })
	top := movers[0]
	var who []string
	for _, mv := range movers {
		if mv.size < 0.5*top.size || mv.rot != top.rot {
			continue
		}
		who = append(who, d.ownerName(nt.m, mv.owner))
	}
	const maxNames = 4
	names := strings.Join(who[:min(len(who), maxNames)], ", ")
	if len(who) > maxNames {
		names += fmt.Sprintf(" and %d more", len(who)-maxNames)
	}
	if top.rot {
		return fmt.Sprintf("rotation about %s of %s", axisWord(top.dir), names)
	}
	kind := "sway"
	if math.Abs(top.dir.Z) >= math.Max(math.Abs(top.dir.X), math.Abs(top.dir.Y)) {
		kind = "motion"
	}
	return fmt.Sprintf("%s in %s of %s", kind, axisWord(top.dir), names)
}

// axisWord names the axis closest to v ("x", "y", "z") or gives the unit
// vector when v is oblique.
func axisWord(v Vec) string {
	n := v.Norm()
	u := v.Scale(1 / n)
	for i, c := range [3]float64{u.X, u.Y, u.Z} {
		if math.Abs(c) > 0.95 {
			return "xyz"[i : i+1]
		}
	}
	return fmt.Sprintf("direction (%.2f, %.2f, %.2f)", u.X, u.Y, u.Z)
}

// groupRadius returns the mean distance of a group's nodes from its
// reference point (1 m if zero).
func (nt *net) groupRadius(g int) float64 {
	gr := &nt.m.groups[g]
	ref := nt.dm.ownerRef[nt.dm.nNodes+g]
	s := 0.0
	for _, n := range gr.nodes {
		s += nt.m.nodes[n].at.Sub(ref).Norm()
	}
	if s == 0 {
		return 1
	}
	return s / float64(len(gr.nodes))
}
