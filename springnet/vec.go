package springnet

import (
	"fmt"
	"math"
	"strings"
)

// Vec is a point or a vector in global axes [m], or a rotation vector
// [rad], depending on use. Z points up.
type Vec struct{ X, Y, Z float64 }

// Add returns v + w.
func (v Vec) Add(w Vec) Vec { return Vec{v.X + w.X, v.Y + w.Y, v.Z + w.Z} }

// Sub returns v − w.
func (v Vec) Sub(w Vec) Vec { return Vec{v.X - w.X, v.Y - w.Y, v.Z - w.Z} }

// Scale returns s·v.
func (v Vec) Scale(s float64) Vec { return Vec{s * v.X, s * v.Y, s * v.Z} }

// Dot returns v·w.
func (v Vec) Dot(w Vec) float64 { return v.X*w.X + v.Y*w.Y + v.Z*w.Z }

// Cross returns v × w.
func (v Vec) Cross(w Vec) Vec {
	return Vec{v.Y*w.Z - v.Z*w.Y, v.Z*w.X - v.X*w.Z, v.X*w.Y - v.Y*w.X}
}

// Norm returns the Euclidean length of v.
func (v Vec) Norm() float64 { return math.Sqrt(v.Dot(v)) }

func (v Vec) finite() bool { return finite(v.X) && finite(v.Y) && finite(v.Z) }

func (v Vec) arr() [3]float64 { return [3]float64{v.X, v.Y, v.Z} }

func vecOf(a [3]float64) Vec { return Vec{a[0], a[1], a[2]} }

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// DOF is a bit set of a node's degrees of freedom: translations UX, UY, UZ
// [m] and rotations RX, RY, RZ [rad] about the global axes.
type DOF uint8

// The six degrees of freedom of a node, in the order used everywhere in
// trestle, and the usual sets.
const (
	UX DOF = 1 << iota
	UY
	UZ
	RX
	RY
	RZ

	Translations = UX | UY | UZ
	Rotations    = RX | RY | RZ
	AllDOF       = Translations | Rotations
)

var dofNames = [6]string{"UX", "UY", "UZ", "RX", "RY", "RZ"}

// String returns the set as names joined by "|", e.g. "UX|RZ"; the empty
// set is "none".
func (d DOF) String() string {
	if d == 0 {
		return "none"
	}
	var parts []string
	for i, n := range dofNames {
		if d&(1<<i) != 0 {
			parts = append(parts, n)
		}
	}
	if rest := d &^ AllDOF; rest != 0 {
		parts = append(parts, fmt.Sprintf("DOF(%#x)", uint8(rest)))
	}
	return strings.Join(parts, "|")
}

// Has reports whether every degree of freedom of e is in d.
func (d DOF) Has(e DOF) bool { return d&e == e }

// dofAt returns the single DOF for component index i (0..5).
func dofAt(i int) DOF { return 1 << i }

// Load is a force and moment in global axes [N, N·m]. At a node it acts on
// the node; at a mount or rigid group it acts at that point.
type Load struct{ FX, FY, FZ, MX, MY, MZ float64 }

// Force returns the force part of l [N].
func (l Load) Force() Vec { return Vec{l.FX, l.FY, l.FZ} }

// Moment returns the moment part of l [N·m].
func (l Load) Moment() Vec { return Vec{l.MX, l.MY, l.MZ} }

func (l Load) arr() [6]float64 { return [6]float64{l.FX, l.FY, l.FZ, l.MX, l.MY, l.MZ} }

func loadOf(a [6]float64) Load { return Load{a[0], a[1], a[2], a[3], a[4], a[5]} }

func (l Load) finite() bool {
	for _, v := range l.arr() {
		if !finite(v) {
			return false
		}
	}
	return true
}

// Displacement is the motion of a node or point in global axes: UX, UY, UZ
// [m] and small rotations RX, RY, RZ [rad].
type Displacement struct{ UX, UY, UZ, RX, RY, RZ float64 }

// Translation returns the translational part of d [m].
func (d Displacement) Translation() Vec { return Vec{d.UX, d.UY, d.UZ} }

// Rotation returns the rotational part of d [rad].
func (d Displacement) Rotation() Vec { return Vec{d.RX, d.RY, d.RZ} }

func (d Displacement) arr() [6]float64 { return [6]float64{d.UX, d.UY, d.UZ, d.RX, d.RY, d.RZ} }

func dispOf(a [6]float64) Displacement { return Displacement{a[0], a[1], a[2], a[3], a[4], a[5]} }

// StandardGravity is the standard acceleration of gravity g₀ = 9.80665 m/s²
// (3rd CGPM, 1901; exact by definition).
const StandardGravity = 9.80665

// Gravity returns the acceleration vector of f times standard gravity
// acting downwards (−Z) [m/s²]; Gravity(1) is ordinary self-weight.
func Gravity(f float64) Vec { return Vec{Z: -f * StandardGravity} }

// Vec3 returns v as an array, the form the element package takes.
func (v Vec) Vec3() [3]float64 { return [3]float64{v.X, v.Y, v.Z} }
