package springnet

// pointMassBlocks returns, per owner, the 6×6 rigid-body mass of the added
// masses about the owner's reference point: for a mass m with inertia
// tensor J (Mass.Tensor) at offset r, M = Tᵀ·diag(m, m, m, J)·T with
// T = [I, −[r]×; 0, I] (u_p = u_o + θ × r).
func (nt *net) pointMassBlocks() [][6][6]float64 {
	d := &nt.dm
	out := make([][6][6]float64, len(d.ownerRef))
	for _, pm := range nt.m.masses {
		o, at := d.placeOwner(nt.m, pm.on)
		r := at.Add(pm.m.Offset).Sub(d.ownerRef[o])
		// Rows of T for the translations: u = u_o + θ × r = u_o − [r]× θ.
		var t [3][6]float64
		skew := [3][3]float64{{0, -r.Z, r.Y}, {r.Z, 0, -r.X}, {-r.Y, r.X, 0}}
		for i := 0; i < 3; i++ {
			t[i][i] = 1
			for j := 0; j < 3; j++ {
				t[i][3+j] = -skew[i][j]
			}
		}
		blk := &out[o]
		for a := 0; a < 6; a++ {
			for b := 0; b < 6; b++ {
				s := 0.0
				for i := 0; i < 3; i++ {
					s += t[i][a] * t[i][b]
				}
				blk[a][b] += pm.m.Kg * s
			}
		}
		jt := pm.m.Tensor()
		for a := 0; a < 3; a++ {
			for b := 0; b < 3; b++ {
				blk[3+a][3+b] += jt[a][b]
			}
		}
	}
	return out
}
