package modelfile

import (
	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
)

// Contents is what a model file says, item by item, in SI units and with
// every reference still a name: the reader fills it from the text, Build
// turns it into a springnet.Model, Write writes it back as text. The
// generator fills one from a Layout. Line fields hold the line of the item
// in the file it was read from (0 when it did not come from a file).
type Contents struct {
	Title       string
	Description string
	Units       Units         // units the writer uses for plain numbers
	Materials   []MaterialDef // materials defined in the file, in file order
	Nodes       []Node
	Members     []Member // bars, beams and springs, in file order
	Feet        []Foot
	Supports    []Support
	Groups      []RigidGroup
	Mounts      []Mount
	Masses      []Mass
	Cases       []Case
	Combos      []Combination
	Dynamics    Dynamics
	Checks      Checks
}

// Checks holds the settings of the member checks the file asks for.
type Checks struct {
	// Basis picks the automatic effective-length factors of the buckling
	// check ("design" or "theoretical" in the file).
	Basis springnet.KBasis
}

// MaterialDef is a material defined in the [materials] table: a catalogue
// entry (From) with some properties overridden, or a material of the
// user's own. Material is the resolved material.
type MaterialDef struct {
	Name     string // the name members use
	From     string // catalogue name it starts from; "" for the user's own
	Material materials.Material
	Line     int
}

// Node is a named point [m].
type Node struct {
	Name string
	At   springnet.Vec
	Line int
}

// Member is one bar, beam or spring between two nodes.
type Member struct {
	Kind     springnet.ElementKind // BarKind, BeamKind or SpringKind
	Name     string                // "" lets the model name it (B3, M5, S7)
	A, B     string                // end node names
	Material string                // material name: one defined in the file or a catalogue name
	Section  string                // section spec (sections.Parse); "" for raw stiffness
	Raw      springnet.RawBeam     // raw stiffness when Section is ""; a bar uses EA and LineMass
	Loss     materials.Range       // loss factor override; zero: the material's

	// EffectiveLength overrides the buckling effective-length factors
	// about local y and z (bars and beams); 0: automatic.
	EffectiveLength springnet.EffectiveLength

	// Beams only.
	Up          springnet.Vec
	Roll        float64 // [rad]
	Timoshenko  bool
	ReleaseA    springnet.Release
	ReleaseB    springnet.Release
	JointSpring [2]springnet.Vec // rotational springs at the ends [N·m/rad]; zero: rigid

	// Springs only.
	Axial float64 // [N/m]
	K     springnet.Stiffness6
	Vary  materials.Range

	Line int
}

// Foot is a spring from a node to the floor.
type Foot struct {
	Name            string // "" lets the model name it
	Node            string
	K               springnet.Stiffness6
	CompressionOnly bool
	Vary            materials.Range
	Loss            materials.Range
	Line            int
}

// Support fixes directions of a node or of a rigid group.
type Support struct {
	At   string // node or rigid group name
	Fix  springnet.DOF
	Line int
}

// RigidGroup is a set of nodes moving as one rigid body.
type RigidGroup struct {
	Name      string
	Nodes     []string
	Reference *springnet.Vec // reference point [m]; nil: the centroid
	Line      int
}

// Mount is a named point where a machine sits, on a node, group or mount.
type Mount struct {
	Name string
	On   string
	At   springnet.Vec
	Line int
}

// Mass is a lumped mass on a node, group or mount. Its centre is either
// given in global coordinates (Centre, non-nil) or as an Offset from the
// place's point.
type Mass struct {
	Name    string // for messages and reports; optional
	On      string
	Kg      float64
	Centre  *springnet.Vec // centre of mass in global coordinates [m]
	Offset  springnet.Vec  // used when Centre is nil [m]
	Inertia springnet.Vec  // about axes through the centre parallel to X, Y, Z [kg·m²]
	// Products holds the products of inertia P_yz, P_zx, P_xy = ∫yz dm,
	// ∫zx dm, ∫xy dm about the centre (springnet.Mass.Products); the file
	// gives them as a tensor whose off-diagonal terms are their negatives.
	Products springnet.Vec
	Line     int
}

// Case is a load case: gravity and loads.
type Case struct {
	Name    string
	Gravity springnet.Vec // [m/s²]; zero: none
	Loads   []Load
	Line    int
}

// Load is a force and moment at a node, group or mount.
type Load struct {
	At   string
	Load springnet.Load
	Line int
}

// Combination is a factored sum of cases.
type Combination struct {
	Name  string
	Terms []Term
	Line  int
}

// Term is one case of a combination and its factor.
type Term struct {
	Case   string
	Factor float64
}

// Dynamics holds the inputs of the vibration checks: the running speeds of
// the machine (to compare its excitation frequencies with the stand's
// natural frequencies) and the frequency band of interest for the
// response. The model file carries them to the caller; springnet does not
// read them.
type Dynamics struct {
	Speeds []Speed
	Band   [2]float64 // lowest and highest frequency of interest [Hz]; zero: not given
	Modes  int        // number of modes wanted; 0: the caller's default
}

// Speed is one running speed range of the machine and what turns at it.
// The excitation frequencies are k·PerRev·f for f in [Low, High] and
// k = 1 .. Harmonics.
type Speed struct {
	Name      string
	Low, High float64 // speed range [rev/s]; Low = High for a fixed speed
	PerRev    int     // events per revolution: teeth, flutes, blades (1 for unbalance)
	Harmonics int     // how many multiples to check; 0: the caller's default
	Line      int
}

// Excitations returns the frequency ranges [Hz] the speed excites: for
// k = 1 .. max(Harmonics, 1), [k·n·Low, k·n·High] with n = max(PerRev, 1).
func (s Speed) Excitations() [][2]float64 {
	n := float64(max(s.PerRev, 1))
	var out [][2]float64
	for k := 1; k <= max(s.Harmonics, 1); k++ {
		out = append(out, [2]float64{float64(k) * n * s.Low, float64(k) * n * s.High})
	}
	return out
}
