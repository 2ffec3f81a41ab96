package springnet

import (
	"fmt"
	"strings"
)

// MaxResidual is the largest relative residual ‖K·u − f‖/‖f‖ a static
// solve may have before its result is called suspect (*ConditionError).
// A healthy factorisation of a well-posed stand gives 1e-14 to 1e-12;
// 1e-8 leaves room for stiffness ratios up to about 1e8 while still
// catching a nearly singular system (a joint held only by a very soft
// spring, a rigid group tied to a flimsy member).
const MaxResidual = 1e-8

// MechanismError reports that the model can move without resistance: the
// factorisation met a zero pivot at the named node (or rigid group) and
// direction. Motion, when found, describes the free motion (one inverse
// iteration from the failing direction), e.g. `sway in y of node "B1", node
// "B2"` or `rotation about z of group "top"`.
type MechanismError struct {
	Node   NodeID  // the free node; −1 if the free DOF belongs to a group
	Group  GroupID // the free rigid group; −1 if it is a node
	Name   string  // the node's or group's name
	DOF    DOF     // the free direction (one bit)
	Motion string  // the free motion in words; empty if not found
	Pivot  float64 // the failing pivot (diagnostic)
	Case   string  // the load case, when the mechanism appeared with feet lifted
	eq     int     // the failed equation (for describeMotion)
}

// Error names the free node or group and direction, the motion if known,
// and the usual cure.
func (e *MechanismError) Error() string {
	who := fmt.Sprintf("node %q", e.Name)
	if e.Group >= 0 {
		who = fmt.Sprintf("group %q", e.Name)
	}
	var b strings.Builder
	fmt.Fprintf(&b, "springnet: mechanism: %s is free in %v", who, e.DOF)
	if e.Case != "" {
		fmt.Fprintf(&b, " (case %q)", e.Case)
	}
	if e.Motion != "" {
		fmt.Fprintf(&b, "; free motion: %s", e.Motion)
	}
	b.WriteString("; brace it, support it, or make the joint rigid")
	return b.String()
}

// ConditionError reports a solve whose relative residual exceeds
// MaxResidual. It is returned together with the result, which is usable
// but suspect.
type ConditionError struct {
	Case     string  // the load case or analysis
	Residual float64 // relative residual ‖K·u − f‖/‖f‖
}

// Error gives the residual and says the result is suspect.
func (e *ConditionError) Error() string {
	return fmt.Sprintf("springnet: %s: relative residual %.3g exceeds %.0e: the system is ill-conditioned "+
		"(a nearly free part, or stiffnesses far apart); results are suspect", e.Case, e.Residual, MaxResidual)
}

// TippingError reports a load case under which a stand on
// compression-only feet has no stable set of feet in contact: it tips over
// (or slides away) rather than standing. Lifted names the feet out of
// contact when the last stable set was lost.
type TippingError struct {
	Case   string
	Lifted []string
}

// Error says the stand tips and which feet were lifted.
func (e *TippingError) Error() string {
	return fmt.Sprintf("springnet: case %q: the stand tips: no stable set of feet stays in contact "+
		"(lifted: %s); add weight, widen the base or anchor the feet. "+
		"Check stability against local codes and licensed engineering practice", e.Case, strings.Join(e.Lifted, ", "))
}
