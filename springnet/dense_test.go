package springnet_test

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/mat"

	"github.com/trestle-go/trestle/springnet"
	"github.com/trestle-go/trestle/springnet/element"
)

// denseTol is the agreement required between the sparse path and the
// dense reference, relative to the largest displacement: both are direct
// solves of SPD systems whose condition numbers stay below about 1e5 by
// construction (stiffnesses within three decades), so differences are
// round-off times the condition number, far below 1e-9.
const denseTol = 1e-9

// randomNet is a random stable network with its independent dense
// reference: every node has a foot with stiffness in all six directions
// (so the system is positive definite whatever else is drawn), plus random
// bars, springs and beams, rigid groups and supports.
type randomNet struct {
	m     springnet.Model
	nodes []springnet.NodeID
	at    []springnet.Vec
	group []int // per node: group index or −1
	gref  []springnet.Vec
	fixed []springnet.DOF
	kFull [][]float64 // full 6n × 6n stiffness, built with the element package
	fFull []float64
}

func newRandomNet(rng *rand.Rand, n int) *randomNet {
	r := &randomNet{kFull: make([][]float64, 6*n), fFull: make([]float64, 6*n)}
	for i := range r.kFull {
		r.kFull[i] = make([]float64, 6*n)
	}
	between := func(lo, hi float64) float64 { return lo * math.Pow(hi/lo, rng.Float64()) }
	for i := 0; i < n; i++ {
		p := springnet.Vec{X: 2 * rng.Float64(), Y: 2 * rng.Float64(), Z: 2 * rng.Float64()}
		r.nodes = append(r.nodes, r.m.AddNode("", p))
		r.at = append(r.at, p)
		r.group = append(r.group, -1)
		r.fixed = append(r.fixed, 0)
		k := springnet.Stiffness6{X: between(1e5, 1e7), Y: between(1e5, 1e7), Z: between(1e5, 1e7),
			RX: between(1e4, 1e6), RY: between(1e4, 1e6), RZ: between(1e4, 1e6)}
		r.m.AddFoot(r.nodes[i], springnet.Foot{K: k})
		kk := [6]float64{k.X, k.Y, k.Z, k.RX, k.RY, k.RZ}
		for c := 0; c < 6; c++ {
			r.kFull[6*i+c][6*i+c] += kk[c]
		}
	}
	addBlock := func(idx []int, k func(i, j int) float64) {
		for a, ia := range idx {
			for b, ib := range idx {
				r.kFull[ia][ib] += k(a, b)
			}
		}
	}
	for e := 0; e < 2*n; e++ {
		a, b := rng.IntN(n), rng.IntN(n)
		if a == b {
			continue
		}
		fr, err := element.NewFrame(r.at[a].Vec3(), r.at[b].Vec3(), [3]float64{}, 0)
		if err != nil {
			continue
		}
		var tr []int
		for c := 0; c < 3; c++ {
			tr = append(tr, 6*a+c)
		}
		for c := 0; c < 3; c++ {
			tr = append(tr, 6*b+c)
		}
		var all []int
		for c := 0; c < 6; c++ {
			all = append(all, 6*a+c)
		}
		for c := 0; c < 6; c++ {
			all = append(all, 6*b+c)
		}
		switch rng.IntN(3) {
		case 0:
			ea := between(1e6, 1e8)
			r.m.AddBar(r.nodes[a], r.nodes[b], springnet.Bar{EA: ea})
			k := element.BarStiffness(fr, ea)
			addBlock(tr, func(i, j int) float64 { return k[i][j] })
		case 1:
			// Per-direction translational stiffness needs coincident ends
			// (Validate); the rotational one may span a distance.
			s := springnet.Spring{Axial: between(1e5, 1e7), K: springnet.Stiffness6{RZ: between(1e4, 1e6)}}
			r.m.AddSpring(r.nodes[a], r.nodes[b], s)
			ka := element.AxialSpringStiffness(fr, s.Axial)
			addBlock(tr, func(i, j int) float64 { return ka[i][j] })
			k6 := element.SpringStiffness(element.Spring6{0, 0, 0, 0, 0, s.K.RZ})
			addBlock(all, func(i, j int) float64 { return k6[i][j] })
		case 2:
			raw := springnet.RawBeam{EA: between(1e6, 1e8), EIy: between(1e4, 1e6), EIz: between(1e4, 1e6), GJ: between(1e4, 1e6)}
			bm := springnet.Beam{Raw: raw}
			if rng.IntN(4) == 0 {
				bm.ReleaseB = springnet.ReleasePin
			}
			r.m.AddBeam(r.nodes[a], r.nodes[b], bm)
			k := element.BeamStiffness(fr, element.BeamProps{EA: raw.EA, EIy: raw.EIy, EIz: raw.EIz, GJ: raw.GJ, ReleaseB: bm.ReleaseB})
			addBlock(all, func(i, j int) float64 { return k[i][j] })
		}
	}
	// Rigid groups of three nodes each, and supports on other nodes.
	ng := n / 12
	perm := rng.Perm(n)
	p := 0
	for g := 0; g < ng; g++ {
		var members []springnet.NodeID
		var c springnet.Vec
		for k := 0; k < 3; k++ {
			i := perm[p]
			p++
			members = append(members, r.nodes[i])
			r.group[i] = g
			c = c.Add(r.at[i])
		}
		r.m.AddRigidGroup(fmt.Sprintf("g%d", g), members...)
		r.gref = append(r.gref, c.Scale(1.0/3))
	}
	for k := 0; k < n/5 && p < n; k++ {
		i := perm[p]
		p++
		d := springnet.DOF(rng.IntN(64))
		r.m.Fix(r.nodes[i], d)
		r.fixed[i] = d
	}
	for i := 0; i < n; i++ {
		l := springnet.Load{FX: rng.NormFloat64() * 1e3, FY: rng.NormFloat64() * 1e3, FZ: rng.NormFloat64() * 1e3,
			MX: rng.NormFloat64() * 1e2, MY: rng.NormFloat64() * 1e2, MZ: rng.NormFloat64() * 1e2}
		r.m.AddLoad(r.nodes[i], l)
		for c, v := range [6]float64{l.FX, l.FY, l.FZ, l.MX, l.MY, l.MZ} {
			r.fFull[6*i+c] += v
		}
	}
	return r
}

// reference solves the network densely: reduced DOF are the free DOF of
// ungrouped nodes and the six DOF of each group; T maps them to the full
// node DOF (u_s = u_m + θ_m × r, θ_s = θ_m); K_red = Tᵀ·K·T, f_red = Tᵀ·f,
// solved with gonum's dense Cholesky. It returns the full displacements.
func (r *randomNet) reference(t *testing.T) []float64 {
	n := len(r.nodes)
	col := 0
	nodeCol := make([][6]int, n)
	for i := 0; i < n; i++ {
		for c := 0; c < 6; c++ {
			nodeCol[i][c] = -1
			if r.group[i] < 0 && r.fixed[i]&(1<<c) == 0 {
				nodeCol[i][c] = col
				col++
			}
		}
	}
	groupCol := make([]int, len(r.gref))
	for g := range groupCol {
		groupCol[g] = col
		col += 6
	}
	// Rows of T as (column, coefficient) lists: T is very sparse.
	type tc struct {
		col  int
		coef float64
	}
	T := make([][]tc, 6*n)
	for i := 0; i < n; i++ {
		if g := r.group[i]; g >= 0 {
			rr := r.at[i].Sub(r.gref[g])
			m0 := groupCol[g]
			for c := 0; c < 6; c++ {
				T[6*i+c] = append(T[6*i+c], tc{m0 + c, 1})
			}
			// θ × r: ux += θy·rz − θz·ry, uy += θz·rx − θx·rz, uz += θx·ry − θy·rx
			T[6*i+0] = append(T[6*i+0], tc{m0 + 4, rr.Z}, tc{m0 + 5, -rr.Y})
			T[6*i+1] = append(T[6*i+1], tc{m0 + 5, rr.X}, tc{m0 + 3, -rr.Z})
			T[6*i+2] = append(T[6*i+2], tc{m0 + 3, rr.Y}, tc{m0 + 4, -rr.X})
			continue
		}
		for c := 0; c < 6; c++ {
			if nodeCol[i][c] >= 0 {
				T[6*i+c] = append(T[6*i+c], tc{nodeCol[i][c], 1})
			}
		}
	}
	// K_red = Tᵀ·K·T and f_red = Tᵀ·f, entry by entry.
	sym := mat.NewSymDense(col, nil)
	for i := range r.kFull {
		for j, v := range r.kFull[i] {
			if v == 0 {
				continue
			}
			for _, a := range T[i] {
				for _, b := range T[j] {
					if a.col <= b.col {
						sym.SetSym(a.col, b.col, sym.At(a.col, b.col)+a.coef*v*b.coef)
					}
				}
			}
		}
	}
	fr := mat.NewVecDense(col, nil)
	for i, v := range r.fFull {
		for _, a := range T[i] {
			fr.SetVec(a.col, fr.AtVec(a.col)+a.coef*v)
		}
	}
	var ch mat.Cholesky
	require.True(t, ch.Factorize(sym), "reference matrix not positive definite")
	var ur mat.VecDense
	require.NoError(t, ch.SolveVecTo(&ur, fr))
	uf := make([]float64, 6*n)
	for i := range uf {
		for _, a := range T[i] {
			uf[i] += a.coef * ur.AtVec(a.col)
		}
	}
	return uf
}

func newRNG() *rand.Rand { return rand.New(rand.NewPCG(1, 1)) }

func TestAgainstDenseReference(t *testing.T) {
	rng := newRNG()
	const networks = 50
	for k := 0; k < networks; k++ {
		// Node counts from 2 to 333 on a geometric scale: 12 to ~2000 DOF.
		n := int(math.Round(2 * math.Pow(333.0/2, float64(k)/(networks-1))))
		if testing.Short() && n > 100 {
			continue
		}
		t.Run(fmt.Sprintf("n=%d", n), func(t *testing.T) {
			r := newRandomNet(rng, n)
			res, err := springnet.Static(&r.m, nil)
			require.NoError(t, err)
			want := r.reference(t)
			scale := 0.0
			for _, v := range want {
				scale = math.Max(scale, math.Abs(v))
			}
			worst := 0.0
			for i, nd := range r.nodes {
				d := res.Displacement(nd)
				got := [6]float64{d.UX, d.UY, d.UZ, d.RX, d.RY, d.RZ}
				for c := 0; c < 6; c++ {
					worst = math.Max(worst, math.Abs(got[c]-want[6*i+c]))
				}
			}
			assert.Less(t, worst/scale, denseTol)
			eq := res.Case(0).Equilibrium()
			assert.Less(t, eq.ForceError, denseTol)
			assert.Less(t, eq.MomentError, denseTol)
		})
	}
}
