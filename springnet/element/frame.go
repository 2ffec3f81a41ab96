package element

import (
	"errors"
	"fmt"
	"math"
)

// Vec3 is a point or a vector in global axes (X, Y, Z) [m] or a rotation
// vector [rad], depending on use.
type Vec3 = [3]float64

// Vec6 holds the six degrees of freedom of one node in the order
// UX, UY, UZ, RX, RY, RZ [m, rad], or the matching forces and moments
// FX, FY, FZ, MX, MY, MZ [N, N·m].
type Vec6 = [6]float64

// Vec12 holds the degrees of freedom of a two-node element: the six of end a
// followed by the six of end b.
type Vec12 = [12]float64

// Mat3 is a 3×3 matrix stored by rows.
type Mat3 [3][3]float64

// Mat6 is a 6×6 matrix stored by rows. For a bar it acts on the
// translations of end a then end b; for a ground spring on the six DOF of one node.
type Mat6 [6][6]float64

// Mat12 is a 12×12 matrix stored by rows acting on the six DOF of end a then
// the six DOF of end b.
type Mat12 [12][12]float64

// ErrZeroLength is wrapped by NewFrame when the two end points coincide.
var ErrZeroLength = errors.New("zero length")

// ErrParallelUp is wrapped by NewFrame when the reference up vector is
// parallel to the member axis.
var ErrParallelUp = errors.New("up vector parallel to member axis")

// ErrNotFinite is wrapped by functions of this package given a NaN or
// infinite input.
var ErrNotFinite = errors.New("not finite")

// parallelTol is the smallest sine of the angle between the member axis and
// the up vector that NewFrame accepts. Below it the local axes would be
// decided by round-off (common practice: a tolerance well above machine
// epsilon, well below any angle a designer would draw).
const parallelTol = 1e-6

// Frame holds the local axes of a two-node member.
//
// Ex points from end a to end b. Ez lies in the plane of Ex and the
// reference up vector, on the same side as up; Ey = Ez × Ex completes a
// right-handed set (Ex × Ey = Ez). A roll angle then turns (Ey, Ez) about Ex
// by the right-hand rule. The zero Frame is not valid; build one with NewFrame.
type Frame struct {
	A  Vec3    // end a [m]
	L  float64 // length from a to b [m]
	Ex Vec3    // unit vector from a to b
	Ey Vec3    // unit local y axis
	Ez Vec3    // unit local z axis
}

// NewFrame returns the local axes of the member from a to b.
//
// up is the reference vector that local z leans towards. If up is the zero
// vector, global Z is used, except for a member parallel to global Z, for
// which global Y is used. roll [rad] then rotates (Ey, Ez) about Ex:
//
//	Ey' =  cos(roll)·Ey + sin(roll)·Ez
//	Ez' = −sin(roll)·Ey + cos(roll)·Ez
//
// NewFrame returns an error wrapping ErrZeroLength if a and b coincide,
// ErrParallelUp if a non-zero up is parallel to a→b, and ErrNotFinite
// if any input is NaN or infinite.
func NewFrame(a, b, up Vec3, roll float64) (Frame, error) {
	for _, v := range [...]float64{a[0], a[1], a[2], b[0], b[1], b[2], up[0], up[1], up[2], roll} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return Frame{}, fmt.Errorf("element: frame %v→%v: %w input", a, b, ErrNotFinite)
		}
	}
	d := sub(b, a)
	l := norm(d)
	if l == 0 || l <= 1e-12*math.Max(norm(a), norm(b)) {
		return Frame{}, fmt.Errorf("element: frame %v→%v: %w", a, b, ErrZeroLength)
	}
	ex := scale(d, 1/l)
	if up == (Vec3{}) {
		up = Vec3{0, 0, 1}
		if norm(cross(ex, up)) < parallelTol {
			up = Vec3{0, 1, 0}
		}
	}
	nu := norm(up)
	if norm(cross(ex, up)) < parallelTol*nu {
		return Frame{}, fmt.Errorf("element: frame %v→%v: %w (up = %v)", a, b, ErrParallelUp, up)
	}
	ez := sub(up, scale(ex, dot(up, ex)))
	ez = scale(ez, 1/norm(ez))
	ey := cross(ez, ex)
	if roll != 0 {
		c, s := math.Cos(roll), math.Sin(roll)
		ey, ez = add(scale(ey, c), scale(ez, s)), add(scale(ey, -s), scale(ez, c))
	}
	return Frame{A: a, L: l, Ex: ex, Ey: ey, Ez: ez}, nil
}

// B returns end b of the member [m].
func (f Frame) B() Vec3 { return add(f.A, scale(f.Ex, f.L)) }

// Rotation returns the matrix whose rows are Ex, Ey, Ez, so that
// v_local = R·v_global and v_global = Rᵀ·v_local.
func (f Frame) Rotation() Mat3 { return Mat3{f.Ex, f.Ey, f.Ez} }

// ToLocal returns the components of the global vector v in the local axes.
func (f Frame) ToLocal(v Vec3) Vec3 { return Vec3{dot(f.Ex, v), dot(f.Ey, v), dot(f.Ez, v)} }

// ToGlobal returns the global components of the local vector v.
func (f Frame) ToGlobal(v Vec3) Vec3 {
	return add(add(scale(f.Ex, v[0]), scale(f.Ey, v[1])), scale(f.Ez, v[2]))
}

func sub(a, b Vec3) Vec3           { return Vec3{a[0] - b[0], a[1] - b[1], a[2] - b[2]} }
func add(a, b Vec3) Vec3           { return Vec3{a[0] + b[0], a[1] + b[1], a[2] + b[2]} }
func scale(a Vec3, s float64) Vec3 { return Vec3{a[0] * s, a[1] * s, a[2] * s} }
func dot(a, b Vec3) float64        { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func norm(a Vec3) float64          { return math.Sqrt(dot(a, a)) }
func cross(a, b Vec3) Vec3 {
	return Vec3{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}
