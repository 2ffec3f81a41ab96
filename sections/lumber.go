package sections

import (
	"fmt"
)

var _ Section = Lumber{}

// Lumber is sawn lumber by its nominal size in inches, dressed (surfaced
// dry) to the sizes of the NDS Supplement (AWC, National Design
// Specification Supplement, Tables 1A/1B, after the American Softwood
// Lumber Standard PS 20):
//
//	boards and dimension lumber (nominal thickness 1–4 in):
//	  thickness 1 → 3/4 in, 2 → 1-1/2, 3 → 2-1/2, 4 → 3-1/2
//	  width up to 7 in nominal: nominal − 1/2 in; 8 in and wider: nominal − 3/4 in
//	timbers (both nominal sizes 5 in or more): each nominal − 1/2 in
//
// Thick lies along y and Wide along z (a 2x4 on edge: Iy is the strong
// axis). Plies glued face to face side by side (along y) make a solid
// B = Plies·b rectangle: full composite action is assumed, which is right
// for glued laminations and an upper bound for nailed or screwed ones.
type Lumber struct {
	Thick int // nominal thickness [in], 1 to 16
	Wide  int // nominal width [in], >= Thick, up to 16
	Plies int // number of plies side by side; 0 means 1
}

// Dressed returns the dressed thickness and width of one ply [m], or an
// error for a nominal size the NDS tables do not list.
func (l Lumber) Dressed() (b, d float64, err error) {
	if l.Thick < 1 || l.Wide < l.Thick || l.Wide > 16 || l.Wide < 2 {
		return 0, 0, fmt.Errorf("sections: %v: nominal size %dx%d is not a sawn lumber size (thickness 1–16 in, width from the thickness up to 16 in, at least 2 in)", l, l.Thick, l.Wide)
	}
	if l.Thick >= 5 { // timbers, NDS Supplement Table 1D
		return (float64(l.Thick) - 0.5) * inch, (float64(l.Wide) - 0.5) * inch, nil
	}
	thick := map[int]float64{1: 0.75, 2: 1.5, 3: 2.5, 4: 3.5}[l.Thick]
	wide := float64(l.Wide) - 0.5
	if l.Wide >= 8 {
		wide = float64(l.Wide) - 0.75
	}
	return thick * inch, wide * inch, nil
}

func (l Lumber) plies() int {
	if l.Plies == 0 {
		return 1
	}
	return l.Plies
}

// maxPlies limits built-up members to something a shop would glue up.
const maxPlies = 20

// Properties returns the properties of the dressed rectangle Plies·b × d
// (see Rect). It fails for an unknown nominal size or a ply count outside
// 1…20.
func (l Lumber) Properties() (Props, error) {
	b, d, err := l.Dressed()
	if err != nil {
		return Props{}, err
	}
	if l.Plies < 0 || l.Plies > maxPlies {
		return Props{}, fmt.Errorf("sections: %v: %d plies is not in 1…%d", l, l.Plies, maxPlies)
	}
	return rectProps(float64(l.plies())*b, d)
}
