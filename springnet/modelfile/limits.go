package modelfile

import (
	"fmt"
	"math"
)

// MemoryBudget is the memory an analysis of a model may need before Read,
// Build and Generate refuse it [bytes]. It is a fixed figure (8 GiB), not
// the free memory of the machine, so that the same file is accepted or
// refused everywhere.
const MemoryBudget = 8 << 30

// Size is the estimated size of a model's analysis (see Estimate).
type Size struct {
	Nodes     int     // nodes in the file
	Equations int     // DOF of the stiffness matrix, at most 6 per node or rigid group
	NonzerosK float64 // nonzeros of the lower triangle of K
	NonzerosL float64 // estimated nonzeros of the sparse factor L
	Bytes     float64 // estimated memory of factor, matrix and eigen vectors
}

// Estimate bounds the size of the analysis of c before it is built.
//
//	n      = 6·(free nodes) + 6·(rigid groups)         (equations, an upper bound)
//	nnz(K) = Σ over nodes 6·6·(1 + neighbours)/2         (lower triangle, 6×6 blocks)
//	r      = nnz(K)/n                                   (nonzeros per column of K)
//	nnz(L) = min(n(n+1)/2, r·n^1.5)
//	bytes  = 12·nnz(L) + 12·nnz(K) + 8·n·(40 + 24)
//
// The n^1.5 growth is the fill of a nested-dissection ordering of a 3D
// mesh-like graph with separators of size n^(2/3), rounded up for
// safety (common practice as a rough bound; George & Liu, Computer
// Solution of Large Sparse Positive Definite Systems, give the 2D n·log n
// and 3D n^(4/3) results it bounds). 12 bytes per nonzero: an 8-byte value
// and a 4-byte index; 40 + 24 vectors of length n: a Lanczos basis and
// the work vectors of the analyses. Stands are thin frames, far sparser
// than solid meshes, so this errs on the side of refusing only what is
// clearly too big.
func Estimate(c *Contents) Size {
	grouped := map[string]bool{}
	for _, g := range c.Groups {
		for _, n := range g.Nodes {
			grouped[n] = true
		}
	}
	deg := map[string]int{}
	for _, m := range c.Members {
		deg[m.A]++
		deg[m.B]++
	}
	s := Size{Nodes: len(c.Nodes)}
	var nnzK float64
	for _, n := range c.Nodes {
		if grouped[n.Name] {
			continue
		}
		s.Equations += 6
		nnzK += 36 * float64(1+deg[n.Name]) / 2
	}
	s.Equations += 6 * len(c.Groups)
	for _, g := range c.Groups {
		d := 0
		for _, n := range g.Nodes {
			d += deg[n]
		}
		nnzK += 36 * float64(1+d) / 2
	}
	return sizeOf(s, nnzK)
}

func sizeOf(s Size, nnzK float64) Size {
	n := float64(s.Equations)
	s.NonzerosK = nnzK
	if n == 0 {
		return s
	}
	r := math.Max(1, nnzK/n)
	s.NonzerosL = math.Min(n*(n+1)/2, r*math.Pow(n, 1.5))
	s.Bytes = 12*s.NonzerosL + 12*nnzK + 8*n*64
	return s
}

func (s Size) refusal() string {
	return fmt.Sprintf("the model is too large to analyse: %d nodes, %d equations; the sparse factor needs about %.3g nonzeros "+
		"and the analysis about %.3g GiB, over the budget of %d GiB (estimate: nnz(L) ≈ r·n^1.5 for n equations and r nonzeros per column); "+
		"use fewer nodes, rigid groups for stiff parts, or a coarser layout",
		s.Nodes, s.Equations, s.NonzerosL, s.Bytes/(1<<30), MemoryBudget>>30)
}
